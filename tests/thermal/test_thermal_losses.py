"""Radiation and natural-convection losses, air properties, the solver's loss model.

Outside references:
* F. P. Incropera, D. P. DeWitt, Fundamentals of Heat and Mass Transfer, 6th ed., Wiley, 2007:
  Example 1.7 (steam pipe in a room) and Example 9.3 (horizontal pipe, free convection), eqs.
  9.26, 9.30-9.32, 9.34 and Table 9.1 -- all recalled FROM MEMORY.
* ht (Chemical Engineering Design Library) correlations and CoolProp air properties called
  directly, as an independent route to the tabulated values used by heatcalc.
* scipy.constants (CODATA 2018; the SI 2019 exact constants).
"""

import numpy as np
import pytest
from CoolProp.CoolProp import PropsSI
from ht import conv_free_immersed as free
from scipy.constants import Stefan_Boltzmann, c, g, h, k, pi

from heatcalc.thermal import (
    NATURAL_CONVECTION_METHODS,
    SurfaceLoss,
    air_properties,
    natural_convection_coefficient,
    natural_convection_loss,
    natural_convection_methods,
    radiation_coefficient,
    radiation_loss,
)


def coolprop_air(temperature):
    """Air properties straight from CoolProp (no table)."""
    p = 101325.0
    rho = PropsSI("D", "T", temperature, "P", p, "Air")
    mu = PropsSI("V", "T", temperature, "P", p, "Air")
    kk = PropsSI("L", "T", temperature, "P", p, "Air")
    cp = PropsSI("C", "T", temperature, "P", p, "Air")
    return rho, mu, kk, cp


def rayleigh_direct(ts, ta, length):
    tf = 0.5 * (ts + ta)
    rho, mu, kk, cp = coolprop_air(tf)
    nu = mu / rho
    pr = cp * mu / kk
    gr = g * (1.0 / tf) * abs(ts - ta) * length**3 / nu**2
    return gr, pr, kk


# -- radiation ---------------------------------------------------------------------------------
def test_stefan_boltzmann_is_the_si_exact_value():
    # SI 2019: sigma = 2 pi^5 k^4 / (15 h^3 c^2) with exact k, h, c (scipy.constants, CODATA).
    sigma = 2 * pi**5 * k**4 / (15 * h**3 * c**2)
    q = radiation_loss(1000.0, 1e-3, 1.0)
    assert q / 1000.0**4 == pytest.approx(sigma, rel=1e-12)
    assert Stefan_Boltzmann == pytest.approx(sigma, rel=1e-12)


def test_incropera_example_1_7_steam_pipe():
    # Incropera & DeWitt 6th ed., Example 1.7 (from memory): D = 70 mm, Ts = 200 degC,
    # T_inf = T_sur = 25 degC, eps = 0.8, h = 15 W/(m2 K): q'_rad = 421 W/m, q' = 998 W/m.
    d = 0.07
    q_rad = radiation_loss(473.15, 298.15, 0.8) * pi * d
    assert q_rad == pytest.approx(421.0, rel=0.005)
    loss = SurfaceLoss(emissivity=0.8, t_surroundings=298.15, h_convection=15.0)
    assert loss.flux(473.15) * pi * d == pytest.approx(998.0, rel=0.005)


def test_radiation_coefficient_linearises_exactly():
    ts, ta = np.array([400.0, 900.0, 1500.0]), 300.0
    hr = radiation_coefficient(ts, ta, 0.7)
    np.testing.assert_allclose(hr * (ts - ta), radiation_loss(ts, ta, 0.7), rtol=1e-13)


def test_radiation_broadcasts_and_scalar():
    assert isinstance(radiation_loss(1000.0, 300.0, 0.8), float)
    q = radiation_loss(np.array([[500.0], [1000.0]]), np.array([300.0, 400.0]), 0.5)
    assert q.shape == (2, 2)
    assert q[1, 0] == pytest.approx(0.5 * Stefan_Boltzmann * (1000.0**4 - 300.0**4))


# -- air properties ----------------------------------------------------------------------------
def test_air_table_matches_coolprop_directly():
    # Documented interpolation error of the 5 K table: below 1e-4 relative.
    rng = np.random.default_rng(1)
    for t in rng.uniform(200.0, 2000.0, 25):
        air = air_properties(t)
        rho, mu, kk, cp = coolprop_air(t)
        assert float(air.density) == pytest.approx(rho, rel=1e-4)
        assert float(air.viscosity) == pytest.approx(mu, rel=1e-4)
        assert float(air.conductivity) == pytest.approx(kk, rel=1e-4)
        assert float(air.specific_heat) == pytest.approx(cp, rel=1e-4)
        assert float(air.prandtl) == pytest.approx(cp * mu / kk, rel=1e-4)


def test_air_at_300_k_against_incropera_table_a4():
    # Incropera & DeWitt 6th ed., Table A.4, air at 300 K (from memory): k = 0.0263 W/(m K),
    # nu = 15.89e-6 m2/s, Pr = 0.707.
    air = air_properties(300.0)
    assert float(air.conductivity) == pytest.approx(0.0263, rel=0.01)
    assert float(air.kinematic_viscosity) == pytest.approx(15.89e-6, rel=0.01)
    assert float(air.prandtl) == pytest.approx(0.707, rel=0.01)


def test_air_outside_table_raises():
    with pytest.raises(ValueError, match=r"temperature=2100.00 K \(air film\) is outside"):
        air_properties(2100.0)
    with pytest.raises(ValueError, match="outside the air property table"):
        natural_convection_coefficient(3900.0, 300.0, 0.1)  # film 2100 K: no silent clamp


# -- natural convection ------------------------------------------------------------------------
def test_incropera_example_9_3_horizontal_pipe():
    # Incropera & DeWitt 6th ed., Example 9.3 (from memory): D = 0.1 m, Ts = 165 degC,
    # T_inf = T_sur = 23 degC, eps = 0.85. Air at 367 K: Ra_D = 5.07e6, Nu_D = 23.3,
    # h = 7.29 W/(m2 K), q'_conv = 325 W/m, q'_rad = 442 W/m, q' = 767 W/m.
    ts, ta, d = 438.15, 296.15, 0.1
    hc = natural_convection_coefficient(ts, ta, d)
    # 3 %: CoolProp's air at 367 K against the book's Table A.4 values
    assert hc == pytest.approx(7.29, rel=0.03)
    assert natural_convection_loss(ts, ta, d) * pi * d == pytest.approx(325.0, rel=0.03)
    assert radiation_loss(ts, ta, 0.85) * pi * d == pytest.approx(442.0, rel=0.01)
    loss = SurfaceLoss(emissivity=0.85, t_surroundings=ta, convection="horizontal_cylinder",
                       length=d)  # fmt: skip
    assert loss.flux(ts) * pi * d == pytest.approx(767.0, rel=0.02)
    gr, pr, _ = rayleigh_direct(ts, ta, d)
    # Ra ~ nu^-1 alpha^-1: the book's Table A.4 values interpolated to 367 K and CoolProp's
    # differ by about 2 % each, 4 % together.
    assert gr * pr == pytest.approx(5.07e6, rel=0.05)


def test_churchill_chu_cylinder_against_ht_and_formula():
    # Independent route: CoolProp properties at the film temperature (no table), ht's function,
    # and Churchill & Chu (1975) written out as Incropera eq. 9.34.
    for ts, ta, d in [(500.0, 300.0, 0.05), (1300.0, 293.15, 0.2), (350.0, 290.0, 0.01)]:
        gr, pr, kk = rayleigh_direct(ts, ta, d)
        ra = gr * pr
        nu_formula = (
            0.60 + 0.387 * ra ** (1 / 6) / (1 + (0.559 / pr) ** (9 / 16)) ** (8 / 27)
        ) ** 2
        assert free.Nu_horizontal_cylinder_Churchill_Chu(pr, gr) == pytest.approx(nu_formula)
        got = natural_convection_coefficient(ts, ta, d)
        assert got == pytest.approx(nu_formula * kk / d, rel=2e-4)


def test_morgan_table_9_1():
    # Morgan (1975) as Incropera Table 9.1 (from memory): C = 0.480, n = 0.250 for
    # 1e4 < Ra < 1e7; C = 0.125, n = 0.333 for 1e7 < Ra < 1e12.
    for ts, ta, d in [(400.0, 300.0, 0.05), (900.0, 300.0, 0.5)]:
        gr, pr, kk = rayleigh_direct(ts, ta, d)
        ra = gr * pr
        cc, n = (0.480, 0.250) if ra < 1e7 else (0.125, 0.333)
        got = natural_convection_coefficient(ts, ta, d, method="Morgan")
        assert got == pytest.approx(cc * ra**n * kk / d, rel=2e-4)


def test_vertical_plate_churchill_chu():
    # Churchill & Chu (1975), vertical plate, Incropera eq. 9.26.
    ts, ta, height = 800.0, 300.0, 0.6
    gr, pr, kk = rayleigh_direct(ts, ta, height)
    ra = gr * pr
    nu = (0.825 + 0.387 * ra ** (1 / 6) / (1 + (0.492 / pr) ** (9 / 16)) ** (8 / 27)) ** 2
    got = natural_convection_coefficient(ts, ta, height, geometry="vertical_plate")
    assert got == pytest.approx(nu * kk / height, rel=2e-4)


def test_vertical_cylinder_tends_to_plate_when_thick():
    # A vertical cylinder behaves as a plate when D >= 35 L / Gr^(1/4) (Incropera section 9.6.3,
    # from memory); Popiel-Churchill's curvature correction then stays within a few %.
    ts, ta, height = 800.0, 300.0, 0.3
    plate = natural_convection_coefficient(ts, ta, height, geometry="vertical_plate")
    thick = natural_convection_coefficient(
        ts, ta, height, geometry="vertical_cylinder", diameter=2.0
    )
    thin = natural_convection_coefficient(
        ts, ta, height, geometry="vertical_cylinder", diameter=0.01
    )
    assert thick == pytest.approx(plate, rel=0.03)
    assert thin > 1.2 * plate  # curvature raises the coefficient of a slender cylinder


@pytest.mark.parametrize(
    ("geometry", "length", "formula"),
    [
        # McAdams (1954) as Incropera eqs. 9.30-9.32 (from memory): hot face up
        # 0.54 Ra^1/4 (1e4-1e7), 0.15 Ra^1/3 (1e7-1e11); hot face down 0.27 Ra^1/4.
        ("horizontal_plate_up", 0.1, lambda ra: 0.54 * ra**0.25),
        ("horizontal_plate_up", 0.5, lambda ra: 0.15 * ra ** (1 / 3)),
        ("horizontal_plate_down", 0.1, lambda ra: 0.27 * ra**0.25),
    ],
)
def test_horizontal_plates_mcadams(geometry, length, formula):
    ts, ta = 900.0, 300.0
    gr, pr, kk = rayleigh_direct(ts, ta, length)
    assert (gr * pr < 1e7) == (length == 0.1)  # each branch of the correlation is reached
    got = natural_convection_coefficient(ts, ta, length, geometry=geometry)
    assert got == pytest.approx(formula(gr * pr) * kk / length, rel=2e-4)


def test_cold_plate_swaps_faces():
    # A cold face up behaves as a hot face down (Incropera section 9.6.2).
    hot_down = natural_convection_coefficient(400.0, 300.0, 0.1, geometry="horizontal_plate_down")
    cold_up = natural_convection_coefficient(200.0, 300.0, 0.1, geometry="horizontal_plate_up")
    gr, pr, kk = rayleigh_direct(200.0, 300.0, 0.1)
    assert cold_up == pytest.approx(0.27 * (gr * pr) ** 0.25 * kk / 0.1, rel=2e-4)
    assert hot_down != cold_up  # different film temperature


def test_convection_vectorised_and_monotonic():
    ts = np.linspace(350.0, 1500.0, 12)
    hc = natural_convection_coefficient(ts, 300.0, 0.08)
    assert hc.shape == ts.shape
    assert np.all(np.diff(natural_convection_loss(ts, 300.0, 0.08)) > 0)
    assert isinstance(natural_convection_coefficient(500.0, 300.0, 0.08), float)
    assert natural_convection_loss(300.0, 300.0, 0.08) == 0.0


def test_method_lister_covers_every_geometry():
    assert natural_convection_methods("horizontal_cylinder") == ["Churchill-Chu", "Morgan"]
    for geometry in NATURAL_CONVECTION_METHODS:
        assert natural_convection_methods(geometry)


# -- the solver's loss model -------------------------------------------------------------------
def test_surface_loss_fast_path_matches_exact():
    loss = SurfaceLoss(emissivity=0.8, t_surroundings=300.0, convection="horizontal_cylinder",
                       length=0.08, h_convection=2.0)  # fmt: skip
    for t in [301.0, 450.0, 777.7, 1234.5, 1690.0]:
        q, dq = loss.flux_and_slope(t)
        assert q == pytest.approx(loss.flux(t), rel=1e-4)
        if abs(t - 300.0) > 5.0:  # (h varies steeply within a few K of the air temperature)
            numeric = (loss.flux(t + 0.5) - loss.flux(t - 0.5)) / 1.0
            assert dq == pytest.approx(numeric, rel=1e-3)
    with pytest.raises(ValueError, match="outside the natural-convection range"):
        loss.flux_and_slope(3800.0)
    assert loss.t_max < 3800.0


# -- bad input ---------------------------------------------------------------------------------
def test_bad_input_messages():
    with pytest.raises(ValueError, match=r"emissivity must lie in \[0, 1\]"):
        radiation_loss(1000.0, 300.0, 1.2)
    with pytest.raises(ValueError, match="t_surface must be an absolute temperature"):
        radiation_loss(-10.0, 300.0, 0.5)
    with pytest.raises(ValueError, match="t_surroundings must be an absolute temperature"):
        radiation_coefficient(1000.0, 0.0, 0.5)
    with pytest.raises(ValueError, match="geometry='sphere' is not known"):
        natural_convection_coefficient(500.0, 300.0, 0.1, geometry="sphere")
    with pytest.raises(ValueError, match="method='Nusselt' is not known"):
        natural_convection_coefficient(500.0, 300.0, 0.1, method="Nusselt")
    with pytest.raises(ValueError, match="length must be > 0"):
        natural_convection_coefficient(500.0, 300.0, 0.0)
    with pytest.raises(ValueError, match="diameter must be given"):
        natural_convection_coefficient(500.0, 300.0, 0.1, geometry="vertical_cylinder")
    with pytest.raises(ValueError, match="t_air must be an absolute temperature"):
        natural_convection_coefficient(500.0, -3.0, 0.1)
    with pytest.raises(ValueError, match="t_surface must be an absolute temperature"):
        natural_convection_coefficient(0.0, 300.0, 0.1)
    with pytest.raises(ValueError, match="diameter must be > 0"):
        natural_convection_coefficient(500.0, 300.0, 0.1, "vertical_cylinder", diameter=-1.0)
    with pytest.raises(ValueError, match="temperature must be an absolute temperature"):
        air_properties(-1.0)
    with pytest.raises(ValueError, match="t_surroundings must be an absolute temperature"):
        SurfaceLoss(t_surroundings=-1.0)
    with pytest.raises(ValueError, match="t_air must be an absolute temperature"):
        SurfaceLoss(t_air=0.0)
    with pytest.raises(ValueError, match="method='Morgan' is not known"):
        SurfaceLoss(convection="vertical_plate", length=0.1, method="Morgan")
    with pytest.raises(ValueError, match="diameter must be given with convection='vertical_cyl"):
        SurfaceLoss(convection="vertical_cylinder", length=0.5)
    with pytest.raises(ValueError, match="pressure must be > 0"):
        air_properties(300.0, pressure=-1.0)
    with pytest.raises(ValueError, match="h_convection must be >= 0"):
        SurfaceLoss(h_convection=-1.0)
    with pytest.raises(ValueError, match="length must be given with convection"):
        SurfaceLoss(convection="vertical_plate")
    with pytest.raises(ValueError, match="convection='cone' is not known"):
        SurfaceLoss(convection="cone", length=0.1)
    with pytest.raises(ValueError, match="emissivity must lie in"):
        SurfaceLoss(emissivity=-0.1)
