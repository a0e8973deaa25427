"""Cooling water: flow from Q = m cp dT, pressure drop against a textbook example and fluids."""

import math
import warnings

import numpy as np
import pytest
from coil_cases import billet_coil, round_tube_coil
from CoolProp.CoolProp import PropsSI
from fluids.core import Reynolds
from fluids.friction import friction_factor, friction_factor_curved

from heatcalc.coil import (
    COPPER_TUBE_ROUGHNESS,
    MAX_OUTLET_TEMPERATURE,
    VELOCITY_RANGE,
    CoolingPracticeWarning,
    coil_cooling,
    darcy_pressure_drop,
    friction_methods,
    water_mass_flow,
    water_properties,
)


def haaland(re, e_d):
    """Haaland's explicit friction factor, within about 1.5 % of Colebrook (S. E. Haaland,
    J. Fluids Eng. 105, 1983; independent route)."""
    return (-1.8 * math.log10((e_d / 3.7) ** 1.11 + 6.9 / re)) ** -2


def test_pressure_drop_against_cengel_cimbala_worked_example():
    # Cengel & Cimbala, Fluid Mechanics: Fundamentals and Applications, 2006, ch. 8 example
    # "head loss in a water pipe" (from memory): water at 15 degC (rho 999.1 kg/m3,
    # mu 1.138e-3 Pa s), 6 L/s through a 5 cm stainless pipe (roughness 0.002 mm), 60 m long:
    # V = 3.06 m/s, Re = 134,300, f = 0.0172, dP = 96.5 kPa (3 figures printed).
    d, q, length = 0.05, 6e-3, 60.0
    v = q / (math.pi * d * d / 4)
    assert v == pytest.approx(3.06, abs=5e-3)
    assert Reynolds(V=v, D=d, rho=999.1, mu=1.138e-3) == pytest.approx(134300, rel=5e-3)
    dp = darcy_pressure_drop(v, d, length, 999.1, 1.138e-3, roughness=2e-6)
    assert dp == pytest.approx(96.5e3, rel=5e-3)
    # CoolProp gives the book's property values at 15 degC (IAPWS-95)
    assert PropsSI("D", "T", 288.15, "P", 101325, "Water") == pytest.approx(999.1, abs=0.05)
    assert PropsSI("V", "T", 288.15, "P", 101325, "Water") == pytest.approx(1.138e-3, rel=1e-3)


@pytest.mark.parametrize("re", [5e3, 2e4, 1e5, 1e6])
def test_friction_against_haaland_and_blasius(re):
    mu, rho, d = 1e-3, 1000.0, 0.01
    v = re * mu / (rho * d)
    dp = darcy_pressure_drop(v, d, 1.0, rho, mu)
    f = dp * d / (rho * v * v / 2)
    assert f == pytest.approx(haaland(re, 0.0), rel=0.015)
    if re <= 1e5:  # Blasius (1913) smooth-tube law, 4e3 < Re < 1e5, within about 3 %
        assert f == pytest.approx(0.3164 * re**-0.25, rel=0.03)


def test_laminar_flow_gives_hagen_poiseuille():
    # f = 64/Re for laminar flow (Hagen-Poiseuille); fluids returns it below Re = 2040
    mu, rho, d, v = 1e-3, 1000.0, 0.004, 0.25  # Re = 1000
    dp = darcy_pressure_drop(v, d, 2.0, rho, mu)
    assert dp == pytest.approx(32 * mu * 2.0 * v / d**2, rel=1e-12)


def test_minor_losses_and_broadcasting():
    base = darcy_pressure_drop(2.0, 0.01, 5.0, 998.0, 1e-3)
    with_k = darcy_pressure_drop(2.0, 0.01, 5.0, 998.0, 1e-3, minor_loss=1.5)
    assert with_k - base == pytest.approx(1.5 * 998.0 * 4.0 / 2, rel=1e-12)
    arr = darcy_pressure_drop(np.array([1.0, 2.0]), 0.01, 5.0, 998.0, 1e-3)
    assert arr.shape == (2,)
    assert arr[1] == pytest.approx(float(base), rel=1e-14)


def test_water_properties_against_table_values():
    # Liquid water at 20 degC, 1 atm: rho 998.2 kg/m3, cp 4.184 kJ/(kg K), mu 1.002 mPa s
    # (CRC Handbook of Chemistry and Physics, properties of water; from memory)
    w = water_properties(293.15)
    assert w.density == pytest.approx(998.2, rel=2e-4)
    assert w.specific_heat == pytest.approx(4184.0, rel=2e-3)
    assert w.viscosity == pytest.approx(1.002e-3, rel=2e-3)


def test_flow_from_heat_balance_against_hand_figures():
    # Hand figures, Q = m cp dT: 41.8 kW with cp 4180 J/(kg K) and 10 K -> 1.000 kg/s;
    # 10 kW at 20 K rise -> 10e3/(4180 x 20) = 0.1196 kg/s, about 7.2 L/min
    assert water_mass_flow(41.8e3, 10.0, 4180.0) == pytest.approx(1.0, rel=1e-14)
    with pytest.warns(CoolingPracticeWarning, match="velocity"):  # 0.8 m/s in this tubing
        res = coil_cooling(billet_coil(turns=4), 10e3, 20.0, inlet_temperature=288.15)
    assert res.volume_flow * 60e3 == pytest.approx(7.18, rel=5e-3)
    assert res.outlet_temperature == pytest.approx(308.15)
    arr = water_mass_flow(np.array([1e3, 2e3]), 10.0, 4180.0)
    assert arr[1] == pytest.approx(2 * arr[0], rel=1e-14)


@pytest.mark.parametrize("friction", ["straight", "helical"])
def test_coil_pressure_drop_against_fluids_route(friction):
    # Independent composition from CoolProp + fluids: tubing length N pi (D + h) per circuit,
    # hydraulic diameter 4A/P of the rectangular channel, properties at the mean temperature.
    coil = billet_coil()
    res = coil_cooling(
        coil, 30e3, 15.0, inlet_temperature=293.15, lead_length=1.0, friction=friction
    )
    t_mean = 293.15 + 7.5
    rho = PropsSI("D", "T", t_mean, "P", 101325, "Water")
    cp = PropsSI("C", "T", t_mean, "P", 101325, "Water")
    mu = PropsSI("V", "T", t_mean, "P", 101325, "Water")
    a, b = 0.020 - 0.003, 0.012 - 0.003
    area, d_h = a * b, 2 * a * b / (a + b)
    m = 30e3 / (cp * 15.0)
    v = m / (rho * area)
    length = 12 * math.pi * (0.14 + 0.012) + 1.0
    re = Reynolds(V=v, D=d_h, rho=rho, mu=mu)
    if friction == "straight":
        fd = friction_factor(re, eD=COPPER_TUBE_ROUGHNESS / d_h, Method="Clamond")
    else:
        fd = friction_factor_curved(re, d_h, 0.14 + 0.012, COPPER_TUBE_ROUGHNESS)
    assert res.mass_flow == pytest.approx(m, rel=1e-12)
    assert res.velocity == pytest.approx(v, rel=1e-12)
    assert res.circuit_length == pytest.approx(length, rel=1e-14)
    assert res.pressure_drop == pytest.approx(fd * length / d_h * rho * v * v / 2, rel=1e-12)


def test_helical_friction_exceeds_straight():
    # Secondary (Dean) flow raises the friction of coiled tubes (Schlunder, Heat Exchanger
    # Design Handbook, 1983, via fluids)
    coil = billet_coil()
    s = coil_cooling(coil, 30e3, 15.0)
    h = coil_cooling(coil, 30e3, 15.0, friction="helical")
    assert h.pressure_drop > s.pressure_drop
    assert friction_methods() == ("straight", "helical")


def test_parallel_circuits_cut_pressure_drop():
    coil = billet_coil()
    one = coil_cooling(coil, 30e3, 15.0, circuits=1)
    two = coil_cooling(coil, 30e3, 15.0, circuits=2)
    assert two.velocity == pytest.approx(one.velocity / 2, rel=1e-12)
    assert two.circuit_length == pytest.approx(one.circuit_length / 2, rel=1e-12)
    # turbulent smooth tube: dp ~ L V^1.75 (Blasius), so about 2^2.75 = 6.7 lower
    assert 5.5 < one.pressure_drop / two.pressure_drop < 8.0
    # uneven split: the longest circuit (ceil(12/5) = 3 turns) sets the length
    with pytest.warns(CoolingPracticeWarning, match="velocity"):  # 0.6 m/s per circuit
        five = coil_cooling(coil, 30e3, 15.0, circuits=5)
    assert five.circuit_length == pytest.approx(3 * math.pi * 0.152, rel=1e-12)


def test_warnings_outside_common_practice():
    coil = billet_coil()
    with warnings.catch_warnings():
        warnings.simplefilter("error", CoolingPracticeWarning)
        ok = coil_cooling(coil, 30e3, 15.0)  # about 3.2 m/s, outlet 35 degC: no warning
    assert VELOCITY_RANGE[0] < ok.velocity < VELOCITY_RANGE[1] and ok.cautions == ()
    with pytest.warns(CoolingPracticeWarning, match="velocity"):
        slow = coil_cooling(coil, 2e3, 15.0)
    assert slow.velocity < 1.0
    with pytest.warns(CoolingPracticeWarning, match="velocity"):
        coil_cooling(round_tube_coil(), 30e3, 10.0)
    with pytest.warns(CoolingPracticeWarning, match="outlet water"):
        hot = coil_cooling(coil, 50e3, 20.0, inlet_temperature=308.15)
    assert hot.outlet_temperature > MAX_OUTLET_TEMPERATURE
    assert "Caution" in hot._repr_html_()
    assert list(hot.to_frame().columns) == ["quantity", "value", "unit"]


def test_extra_heat_from_crucible_adds_to_flow():
    coil = billet_coil()
    base = coil_cooling(coil, 20e3, 15.0)
    more = coil_cooling(coil, 20e3, 15.0, extra_heat=10e3)
    assert more.mass_flow == pytest.approx(1.5 * base.mass_flow, rel=1e-12)


@pytest.mark.parametrize(
    ("kwargs", "match"),
    [
        ({"circuits": 0}, "circuits must be a whole number"),
        ({"circuits": 13}, "circuits must be <= turns"),
        ({"temperature_rise": 0.0}, "temperature_rise must be > 0"),
        ({"temperature_rise": 90.0}, "temperature_rise must keep the outlet below saturation"),
        ({"inlet_temperature": 270.0}, "temperature must lie between 273.16 K"),
        ({"friction": "rough"}, "friction must be one of"),
        ({"roughness": -1e-6}, "roughness must be >= 0"),
        ({"heat": 0.0}, "heat \\+ extra_heat must be > 0"),
        ({"heat": -1.0}, "heat must be >= 0"),
        ({"lead_length": -1.0}, "lead_length must be >= 0"),
        ({"extra_heat": -1.0}, "extra_heat must be >= 0"),
        ({"pressure": 100.0}, "pressure must be > 611.655"),
    ],
)
def test_coil_cooling_rejects_bad_input(kwargs, match):
    args = {"heat": 30e3, "temperature_rise": 15.0}
    args.update(kwargs)
    with pytest.raises(ValueError, match=match):
        coil_cooling(billet_coil(), **args)


def test_pressure_drop_rejects_bad_input():
    with pytest.raises(ValueError, match="velocity must be > 0"):
        darcy_pressure_drop(0.0, 0.01, 1.0, 998.0, 1e-3)
    with pytest.raises(ValueError, match="bend_diameter must be given"):
        darcy_pressure_drop(1.0, 0.01, 1.0, 998.0, 1e-3, friction="helical")
    with pytest.raises(ValueError, match="bend_diameter must be > diameter"):
        darcy_pressure_drop(1.0, 0.01, 1.0, 998.0, 1e-3, friction="helical", bend_diameter=0.005)
    with pytest.raises(ValueError, match="viscosity must be > 0"):
        darcy_pressure_drop(1.0, 0.01, 1.0, 998.0, 0.0)
    with pytest.raises(ValueError, match="minor_loss must be >= 0"):
        darcy_pressure_drop(1.0, 0.01, 1.0, 998.0, 1e-3, minor_loss=-1.0)
    with pytest.raises(ValueError, match="specific_heat must be > 0"):
        water_mass_flow(1.0, 1.0, 0.0)


def test_cooling_within_velocity_picks_the_fewest_circuits():
    import warnings

    from heatcalc.coil import (
        RectangularTube,
        SolenoidCoil,
        coil_cooling,
        coil_cooling_within_velocity,
    )

    coil = SolenoidCoil(20, 0.4, 0.12, RectangularTube(0.015, 0.01, 0.0015), 1.9e-8)
    res = coil_cooling_within_velocity(coil, 60e3, 15.0)
    assert res.velocity <= 3.0
    with warnings.catch_warnings():
        warnings.simplefilter("ignore")
        fewer = coil_cooling(coil, 60e3, 15.0, circuits=res.circuits - 1)
    assert fewer.velocity > 3.0  # one circuit fewer would be too fast
    # the same flow either way: Q = m cp dT does not depend on the circuits
    assert fewer.mass_flow == pytest.approx(res.mass_flow)
    with pytest.raises(ValueError, match="circuits is chosen"):
        coil_cooling_within_velocity(coil, 60e3, 15.0, circuits=2)
    with pytest.raises(ValueError, match="max_velocity"):
        coil_cooling_within_velocity(coil, 60e3, 15.0, max_velocity=0.0)
