"""Melting-charge job against hand calculations and facts of the trade."""

import dataclasses
import math
import warnings

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st
from scipy.constants import Stefan_Boltzmann, pi

from heatcalc import materials
from heatcalc.jobs.demo import DEMO_INPUTS
from heatcalc.jobs.melting import run_melting
from heatcalc.units import UnitsError

BASE = DEMO_INPUTS["melting"]  # the demo job (heatcalc.jobs.demo)


def run(**changes):
    with warnings.catch_warnings():
        warnings.simplefilter("ignore")
        return run_melting(dataclasses.replace(BASE, **changes))


@pytest.fixture(scope="module")
def result():
    return run()


def test_theoretical_energy_of_aluminium_against_published_figure(result):
    # Theoretical energy to take aluminium from 25 degC to 750 degC is about 325 kWh/t
    # (computed from NIST-JANAF / CRC enthalpy data; CHECKS.md, +-2 %, book, from memory).
    # 6061 differs from pure aluminium by a few per cent: allow 5 %.
    assert result.theoretical_specific_energy / 3600 == pytest.approx(325, rel=0.05)


def test_practical_energy_well_above_theoretical(result):
    # Practical crucible melting of aluminium uses far more than the theoretical ~0.3 kWh/kg:
    # typically 500-700 kWh/t at the mains (common practice, no source).
    kwh_t = result.specific_energy / 3600
    assert kwh_t > 1.4 * result.theoretical_specific_energy / 3600
    assert 450 < kwh_t < 900


def test_power_balance_by_hand(result):
    # independent hand calculation from first principles
    m, t = 300.0, 72 * 60.0
    e = result.energy.total
    assert result.melt_power == pytest.approx(e / t + result.thermal_losses, rel=1e-12)
    mains = result.melt_power / (result.circuit.efficiency * 0.96)
    assert result.supply_power == pytest.approx(mains, rel=1e-9)
    assert result.melt_rate * 3600 == pytest.approx(250.0)  # 300 kg in 72 min
    assert result.specific_energy == pytest.approx(result.supply_power * t / m)
    # energy conservation: the power-flow table accounts for all the mains power
    assert result.power_flow()["share"].sum() == pytest.approx(1.0, abs=1e-9)


def test_losses_by_hand(result):
    al = materials.get("al-6061")
    t_pour = 750 + 273.15
    area = pi * 0.25**2
    # radiation q = eps sigma (T^4 - T_room^4), Incropera & DeWitt 6th ed. eq. 1.7
    q = al.emissivity("molten") * Stefan_Boltzmann * (t_pour**4 - 298.15**4)
    assert result.radiation_loss == pytest.approx(q * area, rel=1e-9)
    # side wall: Q = 2 pi k H dT / ln(r2/r1), Incropera & DeWitt eq. 3.27
    h = 300.0 / (al.density(t_pour) * area)
    t_water = 298.15 + 7.5
    side = 2 * pi * 1.5 * h * (t_pour - t_water) / math.log(0.315 / 0.25)
    assert result.side_wall_loss == pytest.approx(side, rel=1e-9)
    assert result.bath_height == pytest.approx(h)


def test_skin_depth_and_ratio(result):
    rho = materials.get("al-6061").resistivity(750 + 273.15)
    # delta = 503 sqrt(rho/f) m (1/sqrt(pi mu0) = 503.3; common practice rule)
    assert result.skin_depth == pytest.approx(503.3 * math.sqrt(rho / 500.0), rel=1e-3)
    assert result.diameter_to_skin_depth == pytest.approx(0.5 / result.skin_depth)


def test_supply_power_mode_round_trip(result):
    back = run(cycle_time=None, supply_power=f"{result.supply_power} W")
    assert back.cycle_time == pytest.approx(72 * 60.0, rel=1e-6)
    assert back.melt_power == pytest.approx(result.melt_power, rel=1e-6)


def test_stirring_and_frequency_trends(result):
    table = result.frequency_table.sort_values("frequency")
    # lower frequency: deeper skin, stronger stirring (common practice, no source)
    assert table["ratio"].is_monotonic_increasing
    assert table["relative_stirring"].is_monotonic_decreasing
    assert set(table["rank"]) == {1, 2, 3, 4}


def test_cooling_water_carries_coil_and_lining_heat(result):
    heat = result.circuit.copper_loss + result.side_wall_loss
    # Q = m cp dT with water cp ~4180 J/(kg K) (Incropera & DeWitt Table A.6, from memory)
    flow = heat / (4180 * 15.0)
    assert result.cooling.mass_flow == pytest.approx(flow, rel=0.01)


@settings(max_examples=6, deadline=None)
@given(st.floats(40.0, 150.0))
def test_more_throughput_needs_more_power(minutes):
    slow = run(cycle_time=f"{minutes + 20} min")
    fast = run(cycle_time=f"{minutes} min")
    assert fast.supply_power > slow.supply_power


@pytest.mark.parametrize(
    ("change", "error", "match"),
    [
        ({"charge_mass": 300}, UnitsError, "charge_mass=300 has no unit"),
        ({"charge_mass": "300 mm"}, UnitsError, "charge_mass='300 mm'.*expected"),
        ({"lining_thickness": "-5 mm"}, ValueError, "lining_thickness"),
        ({"supply_power": "200 kW"}, ValueError, "exactly one of cycle_time and supply_power"),
        ({"pouring_temperature": "600 degC"}, ValueError, "above the liquidus"),
        ({"pouring_temperature": "1500 degC"}, ValueError, "1500.0 degC.*outside.*al-6061"),
        ({"coil_inner_diameter": "600 mm"}, ValueError, "coil_inner_diameter"),
        ({"alloy": "aluminium"}, KeyError, "'aluminium' is not in the library"),
        ({"converter_efficiency": 1.5}, ValueError, "converter_efficiency"),
    ],
)
def test_bad_input(change, error, match):
    with pytest.raises(error, match=match):
        run(**change)


def test_supply_power_too_small_for_losses():
    with pytest.raises(ValueError, match="does not cover the thermal losses"):
        run(cycle_time=None, supply_power="20 kW")
