"""Plate with equal fields on both faces: closed form F(x), its maximum and limits."""

import mpmath
import numpy as np
import pytest
from scipy import integrate
from scipy.optimize import minimize_scalar

from heatcalc.em import (
    skin_depth,
    slab_current_density,
    slab_field,
    slab_power_density,
    slab_power_factors,
    slab_power_per_area,
    slab_surface_impedance,
)


def _mp_f_g(x):
    """F and G of Davies (1990) evaluated with mpmath at 30 digits."""
    with mpmath.workdps(30):
        x = mpmath.mpf(x)
        den = mpmath.cosh(x) + mpmath.cos(x)
        return (
            float((mpmath.sinh(x) - mpmath.sin(x)) / den),
            float((mpmath.sinh(x) + mpmath.sin(x)) / den),
        )


@pytest.mark.parametrize("x", [1e-4, 1e-2, 0.3, 1.0, 1.999, 2.0, 2.001, 3.0, 7.0, 40.0, 800.0])
def test_closed_form_against_mpmath(x):
    # F(x) = (sinh x - sin x)/(cosh x + cos x), G(x) with + sin x: Davies, Conduction and
    # Induction Heating, Peregrinus 1990 (from memory); evaluated with mpmath at 30 digits.
    f_ref, g_ref = _mp_f_g(x)
    f, g = slab_power_factors(x)
    assert f == pytest.approx(f_ref, rel=1e-13)
    assert g == pytest.approx(g_ref, rel=1e-13)


def test_closed_form_against_numpy_hyperbolic_functions():
    # The same closed form (Davies 1990) in plain numpy, where it does not cancel badly.
    x = np.linspace(0.8, 30.0, 200)
    f, g = slab_power_factors(x)
    den = np.cosh(x) + np.cos(x)
    np.testing.assert_allclose(f, (np.sinh(x) - np.sin(x)) / den, rtol=1e-12)
    np.testing.assert_allclose(g, (np.sinh(x) + np.sin(x)) / den, rtol=1e-12)


def test_maximum_at_pi():
    # F has its maximum at x = pi, F(pi) = coth(pi/2) (Davies 1990, from memory; CHECKS.md).
    best = minimize_scalar(
        lambda x: -slab_power_factors(x)[0], bounds=(2.0, 4.5), method="bounded",
        options={"xatol": 1e-10},
    )  # fmt: skip
    assert best.x == pytest.approx(np.pi, abs=1e-6)
    assert -best.fun == pytest.approx(1.0 / np.tanh(np.pi / 2.0), rel=1e-12)


def test_low_frequency_limit():
    # F -> x^3/6 for thin plates (Davies 1990, CHECKS.md); G -> x (uniform field: reactive
    # power omega mu H^2 d/2 per face = (rho H^2/delta) d/delta); relative corrections O(x^4).
    x = np.array([1e-4, 1e-3, 1e-2])
    f, g = slab_power_factors(x)
    np.testing.assert_allclose(f, x**3 / 6.0, rtol=1e-4)
    np.testing.assert_allclose(g, x, rtol=1e-4)


def test_thick_plate_limit():
    # Thick plate: p -> rho H^2/delta on each face (CHECKS.md; common practice).
    rho, f, h = 1.2e-6, 1e4, 1e4
    delta = skin_depth(rho, f)
    assert slab_power_per_area(h, 50 * delta, rho, f) == pytest.approx(
        rho * h**2 / delta, rel=1e-15
    )
    z = slab_surface_impedance(1000 * delta, rho, f)
    assert z == pytest.approx((1 + 1j) * rho / delta, rel=1e-15)


def test_field_one_skin_depth_deep_is_one_over_e():
    # Thick conductor: |H| one skin depth below the surface ~ 1/e (common practice, no source);
    # exact for a thick plate.
    delta, d = 1e-3, 0.1
    assert abs(slab_field(d / 2 - delta, d, delta)) == pytest.approx(np.exp(-1.0), rel=1e-12)


def test_low_frequency_field_uniform():
    # Very low frequency: as if the plate were absent (common practice, no source).
    x = np.linspace(-0.005, 0.005, 11)
    np.testing.assert_allclose(slab_field(x, 0.01, 100.0), 1.0, atol=1e-8)


def test_field_symmetry_and_surface_value():
    d, delta = 0.02, 3e-3
    x = np.linspace(0, d / 2, 7)
    np.testing.assert_allclose(slab_field(x, d, delta), slab_field(-x, d, delta), rtol=1e-15)
    assert slab_field(d / 2, d, delta) == pytest.approx(1.0, rel=1e-15)
    j = slab_current_density(x, 1.0, d, 1e-6, 1e3)
    np.testing.assert_allclose(slab_current_density(-x, 1.0, d, 1e-6, 1e3), -j, rtol=1e-15)


def test_current_density_is_minus_field_gradient():
    rho, f, d, h = 1e-6, 3e3, 0.02, 500.0
    delta = skin_depth(rho, f)
    x = np.array([-0.009, -0.002, 0.001, 0.0095])
    step = 1e-7
    grad = (slab_field(x + step, d, delta) - slab_field(x - step, d, delta)) / (2 * step)
    np.testing.assert_allclose(slab_current_density(x, h, d, rho, f), -h * grad, rtol=1e-6)


@pytest.mark.parametrize("x_ratio", [0.2, 2.0, 30.0])
def test_power_density_integrates_to_power_per_face(x_ratio):
    # Energy balance: integral over half the thickness of rho |J|^2 = power into one face.
    rho, f, h, mu = 5e-7, 2e3, 2e3, 3.0
    delta = skin_depth(rho, f, mu)
    d = x_ratio * delta
    total, _ = integrate.quad(
        lambda x: slab_power_density(x, h, d, rho, f, mu), 0.0, d / 2, epsrel=1e-12, limit=200
    )
    assert total == pytest.approx(slab_power_per_area(h, d, rho, f, mu), rel=1e-9)


def test_no_overflow_for_very_thick_plate():
    delta = 1e-4
    x = np.linspace(-0.05, 0.05, 101)  # thickness/skin depth = 1000
    h = slab_field(x, 0.1, delta)
    assert np.all(np.isfinite(h))
    assert abs(h[50]) < 1e-100


def test_broadcasting_scalars_and_arrays():
    p = slab_power_per_area(1e3, 0.01, 1e-6, 1e4)
    assert np.ndim(p) == 0
    grid = slab_power_per_area(1e3, np.array([[0.005], [0.01]]), 1e-6, np.array([1e3, 1e4, 1e5]))
    assert grid.shape == (2, 3)
    assert grid[1, 1] == pytest.approx(p, rel=1e-15)
    z = slab_surface_impedance(np.array([1e-3, 1e-2]), 1e-6, 1e4, 10.0)
    assert np.all(z.real > 0) and np.all(z.imag > 0)
