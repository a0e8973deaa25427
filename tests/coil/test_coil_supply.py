"""Capacitor compensation, resonance, turns and transformer ratio, supply rating."""

import numpy as np
import pytest
from coil_cases import billet_coil, hot_billet
from hypothesis import given, settings
from hypothesis import strategies as st
from scipy.constants import pi

from heatcalc.coil import (
    capacitor_bank,
    coil_circuit,
    coil_impedance,
    coil_resonant_frequency,
    compensated_impedance,
    compensation_capacitance,
    resonant_frequency,
    supply_rating,
    terminal_quantities,
    transformer_ratio_for_supply,
    turns_for_supply,
)


@pytest.fixture(scope="module")
def operating_point():
    return coil_circuit(billet_coil(), hot_billet(), 3e3, workpiece_power=1e5)


# --- compensation: unity power factor at the design frequency (parallel and series) ---
@pytest.mark.parametrize("arrangement", ["parallel", "series"])
def test_compensated_coil_has_unity_power_factor(operating_point, arrangement):
    bank = capacitor_bank(operating_point, arrangement)
    assert bank.input_power_factor == pytest.approx(1.0, abs=1e-12)
    z_in = bank.input_impedance
    assert abs(z_in.imag) < 1e-12 * abs(z_in)
    # the tank delivers the coil's input power at unity power factor
    v, i = terminal_quantities(operating_point, arrangement)
    assert v * i == pytest.approx(operating_point.input_power, rel=1e-12)
    # capacitor kvar balances the coil's reactive power
    if arrangement == "series":
        assert bank.reactive_power == pytest.approx(operating_point.reactive_power, rel=1e-12)


@settings(max_examples=50, deadline=None)
@given(
    r=st.floats(1e-4, 10.0),
    x=st.floats(1e-3, 100.0),
    f=st.floats(10.0, 1e6),
    arrangement=st.sampled_from(["parallel", "series"]),
)
def test_capacitance_gives_real_input_impedance(r, x, f, arrangement):
    cap = compensation_capacitance(r, x, f, arrangement)
    z_in = complex(compensated_impedance(complex(r, x), cap, f, arrangement))
    assert abs(z_in.imag) <= 1e-9 * abs(z_in)
    # textbook: parallel tank R_in = (R^2 + X^2)/R, series R_in = R (Nilsson & Riedel,
    # Electric Circuits; from memory)
    expected = (r * r + x * x) / r if arrangement == "parallel" else r
    assert z_in.real == pytest.approx(expected, rel=1e-9)


def test_lossless_coil_capacitance_is_the_lc_value():
    # R = 0: both arrangements give omega^2 L C = 1, i.e. C = 1/(omega X)
    f, x = 1e4, 0.5
    for arrangement in ("parallel", "series"):
        cap = compensation_capacitance(0.0, x, f, arrangement)
        assert cap == pytest.approx(1.0 / (2 * pi * f * x), rel=1e-14)


def test_capacitance_broadcasts():
    caps = compensation_capacitance(0.1, np.array([1.0, 2.0]), np.array([[1e3], [2e3]]))
    assert caps.shape == (2, 2)
    assert caps[1, 1] == pytest.approx(float(compensation_capacitance(0.1, 2.0, 2e3)))


# --- resonance ---
def test_resonant_frequency_of_constant_rl_matches_textbook_formulas():
    # Series RLC: omega0 = 1/sqrt(L C); parallel (R-L) || C: omega0^2 = 1/(L C) - R^2/L^2
    # (Nilsson & Riedel, Electric Circuits, parallel resonance with a lossy coil; from memory)
    r, ind, cap = 0.05, 20e-6, 50e-6

    def z(f):
        return r + 2j * pi * f * ind

    f_series = resonant_frequency(z, cap, "series", (100.0, 1e5))
    assert f_series == pytest.approx(1 / (2 * pi * np.sqrt(ind * cap)), rel=1e-10)
    f_par = resonant_frequency(z, cap, "parallel", (100.0, 1e5))
    assert f_par == pytest.approx(np.sqrt(1 / (ind * cap) - r**2 / ind**2) / (2 * pi), rel=1e-10)


@pytest.mark.parametrize("arrangement", ["parallel", "series"])
def test_coil_resonance_returns_design_frequency(operating_point, arrangement):
    # round trip: the capacitor sized at 3 kHz resonates the coil at 3 kHz
    bank = capacitor_bank(operating_point, arrangement)
    f0 = coil_resonant_frequency(
        billet_coil(), hot_billet(), bank.capacitance, arrangement, (1e3, 1e4)
    )
    assert f0 == pytest.approx(3e3, rel=1e-9)


def test_resonance_bounds_must_bracket():
    with pytest.raises(ValueError, match="frequency_bounds must bracket the resonance"):
        resonant_frequency(lambda f: 2j * pi * f * 1e-6, 1e-6, "series", (1e6, 2e6))
    with pytest.raises(ValueError, match="frequency_bounds must be"):
        resonant_frequency(lambda f: 2j * pi * f * 1e-6, 1e-6, "series", (2e6, 1e6))
    with pytest.raises(ValueError, match="frequency_bounds must be > 0"):
        resonant_frequency(lambda f: 2j * pi * f * 1e-6, 1e-6, "series", (-1.0, 1e6))
    with pytest.raises(ValueError, match="impedance must be a callable"):
        resonant_frequency(1.0, 1e-6, "series", (1.0, 1e6))
    with pytest.raises(ValueError, match="capacitance must be > 0"):
        resonant_frequency(lambda f: 1j * f, 0.0, "series", (1.0, 1e6))


# --- turns and transformer ratio ---
def test_turns_choice_meets_limits_and_prefers_efficiency():
    choice = turns_for_supply(billet_coil(), hot_billet(), 3e3, 1e5, 400.0, 450.0)
    table = choice.table
    assert list(table["turns"]) == list(range(1, 16))  # 15 turns of 20 mm fit 300 mm
    assert choice.turns is not None
    row = table[table["turns"] == choice.turns].iloc[0]
    assert row["supply_voltage"] <= 400.0 and row["supply_current"] <= 450.0
    ok = table[table["within_limits"]]
    assert row["efficiency"] == ok["efficiency"].max()
    # coil current falls with turns at fixed power (tubing fixed)
    assert np.all(np.diff(table["coil_current"]) < 0)


def test_turns_choice_reports_when_nothing_fits():
    choice = turns_for_supply(billet_coil(), hot_billet(), 3e3, 1e5, 10.0, 1e6)
    assert choice.turns is None
    assert "voltage" in choice.reason
    choice = turns_for_supply(
        billet_coil(), hot_billet(), 3e3, 1e5, 1e4, 10.0, arrangement="series"
    )
    assert choice.turns is None and "current" in choice.reason


def test_transformer_ratio_limits(operating_point):
    v_t, i_t = terminal_quantities(operating_point, "parallel")
    ratio = transformer_ratio_for_supply(operating_point, 800.0, 400.0, "parallel")
    assert ratio.max_ratio == pytest.approx(800.0 / v_t)
    assert ratio.min_ratio == pytest.approx(i_t / 400.0)
    assert ratio.ratio * v_t == pytest.approx(800.0)
    assert i_t / ratio.ratio <= 400.0
    too_small = transformer_ratio_for_supply(operating_point, 100.0, 100.0, "parallel")
    assert too_small.ratio is None  # 10 kVA cannot pass the tank's ~130 kVA


# --- rating and conservation ---
def test_supply_rating_power_balance_and_margin(operating_point):
    rating = supply_rating(operating_point, "parallel", margin=0.15, other_losses=4e3)
    # supply power = workpiece power + coil loss + other listed losses
    assert rating.required_power == pytest.approx(
        operating_point.workpiece_power + operating_point.copper_loss + 4e3, rel=1e-12
    )
    assert rating.power_rating == pytest.approx(1.15 * rating.required_power)
    assert rating.apparent_power_rating == pytest.approx(rating.power_rating)
    unc = supply_rating(operating_point, "uncompensated", margin=0.0)
    assert unc.apparent_power_rating == pytest.approx(operating_point.apparent_power, rel=1e-12)
    assert unc.capacitor_reactive_power == 0.0
    assert list(rating.to_frame().columns) == ["quantity", "value", "unit"]
    assert "supply power rating" in rating._repr_html_()


def test_series_terminal_voltage_is_current_times_resistance(operating_point):
    v, i = terminal_quantities(operating_point, "series")
    assert i == operating_point.coil_current
    assert v == pytest.approx(i * operating_point.resistance, rel=1e-12)
    v_u, i_u = terminal_quantities(operating_point, "uncompensated")
    assert (v_u, i_u) == (operating_point.coil_voltage, operating_point.coil_current)


# --- bad input ---
def test_supply_functions_reject_bad_input(operating_point):
    with pytest.raises(ValueError, match="reactance must be > 0"):
        compensation_capacitance(0.1, 0.0, 1e3)
    with pytest.raises(ValueError, match="resistance must be >= 0"):
        compensation_capacitance(-0.1, 1.0, 1e3)
    with pytest.raises(ValueError, match="frequency must be > 0"):
        compensation_capacitance(0.1, 1.0, 0.0)
    with pytest.raises(ValueError, match="arrangement must be one of"):
        compensation_capacitance(0.1, 1.0, 1e3, "shunt")
    with pytest.raises(ValueError, match="capacitance must be > 0"):
        compensated_impedance(1 + 1j, -1.0, 1e3)
    with pytest.raises(ValueError, match="circuit must be a CoilCircuitResult"):
        capacitor_bank(coil_impedance(billet_coil(), hot_billet(), 1e3))
    with pytest.raises(ValueError, match="arrangement must be one of"):
        terminal_quantities(operating_point, "delta")
    with pytest.raises(ValueError, match="margin must be >= 0"):
        supply_rating(operating_point, margin=-0.1)
    with pytest.raises(ValueError, match="other_losses must be >= 0"):
        supply_rating(operating_point, other_losses=-1.0)
    with pytest.raises(ValueError, match="max_voltage must be > 0"):
        transformer_ratio_for_supply(operating_point, 0.0, 10.0)
    with pytest.raises(ValueError, match="max_current must be > 0"):
        turns_for_supply(billet_coil(), hot_billet(), 3e3, 1e5, 400.0, -1.0)
    with pytest.raises(ValueError, match="candidates must be a whole number"):
        turns_for_supply(billet_coil(), hot_billet(), 3e3, 1e5, 400.0, 400.0, candidates=[2.5])
    with pytest.raises(ValueError, match="candidates must hold at least one"):
        turns_for_supply(billet_coil(), hot_billet(), 3e3, 1e5, 400.0, 400.0, candidates=[])
    with pytest.raises(ValueError, match="space factor"):
        turns_for_supply(billet_coil(), hot_billet(), 3e3, 1e5, 400.0, 400.0, candidates=[16])
