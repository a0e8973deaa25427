"""Tube with an empty bore: mpmath reference, limits towards the solid cylinder, Faraday's law."""

import mpmath
import numpy as np
import pytest
from scipy import integrate
from scipy.constants import mu_0, pi

from heatcalc.em import (
    cylinder_power_factors,
    cylinder_surface_impedance,
    skin_depth,
    tube_current_density,
    tube_field,
    tube_power_density,
    tube_power_factors,
    tube_power_per_area,
    tube_surface_impedance,
)


def _mp_tube_zeta(outer, inner, mu_r):
    """P + jQ from I0/K0 written out with mpmath at 40 digits (lengths in skin depths).

    Wall: H = A I0(alpha r) + B K0(alpha r); bore condition H'(b) = j b/(mu_r delta^2) H(b)
    from Faraday's law round the bore (J. Davies, Conduction and Induction Heating, 1990).
    """
    with mpmath.workdps(40):
        alpha = mpmath.mpc(1, 1)
        beta = mpmath.mpc(0, 1) * inner / mu_r
        ua, ub = alpha * outer, alpha * inner
        c = (alpha * mpmath.besseli(1, ub) - beta * mpmath.besseli(0, ub)) / (
            alpha * mpmath.besselk(1, ub) + beta * mpmath.besselk(0, ub)
        )
        z = (
            alpha
            * (mpmath.besseli(1, ua) - c * mpmath.besselk(1, ua))
            / (mpmath.besseli(0, ua) + c * mpmath.besselk(0, ua))
        )
        return complex(z)


@pytest.mark.parametrize("mu_r", [1.0, 100.0])
@pytest.mark.parametrize("bore_fraction", [1e-4, 0.01, 0.5, 0.9, 0.999])
@pytest.mark.parametrize("outer", [1e-2, 0.3, 1.0, 3.0, 10.0, 100.0, 1000.0])
def test_against_mpmath(outer, bore_fraction, mu_r):
    # lib: mpmath Bessel I and K at 40 digits, same boundary-value problem written independently.
    ref = _mp_tube_zeta(outer, outer * bore_fraction, mu_r)
    p, q = tube_power_factors(outer, outer * bore_fraction, mu_r)
    assert p == pytest.approx(ref.real, rel=1e-10)
    assert q == pytest.approx(ref.imag, rel=1e-12)


@pytest.mark.parametrize("outer", [0.3, 2.0, 8.0])
@pytest.mark.parametrize("mu_r", [1.0, 50.0])
def test_tends_to_solid_cylinder_as_bore_shrinks(outer, mu_r):
    # A vanishing bore leaves a solid cylinder (CHECKS.md task list; physical limit).
    p_cyl, q_cyl = cylinder_power_factors(outer)
    errors = []
    for fraction in (1e-2, 1e-3, 1e-4):
        p, q = tube_power_factors(outer, fraction * outer, mu_r)
        errors.append(abs(p / p_cyl - 1) + abs(q / q_cyl - 1))
    assert errors[-1] < 1e-6
    assert errors[0] > errors[1] > errors[2]


def test_thick_wall_tends_to_solid_cylinder():
    # Wall many skin depths thick: the bore is screened and the tube acts as a solid bar.
    rho, f = 2e-7, 1e4
    delta = skin_depth(rho, f, 20.0)
    a = 0.05
    z_tube = tube_surface_impedance(a, a - 40 * delta, rho, f, 20.0)
    z_solid = cylinder_surface_impedance(a, rho, f, 20.0)
    assert z_tube == pytest.approx(z_solid, rel=1e-14)


@pytest.mark.parametrize(("outer", "inner", "mu_r"), [(0.02, 0.015, 1.0), (0.02, 0.019, 80.0)])
def test_low_frequency_limit_from_faradays_law(outer, inner, mu_r):
    # At low frequency the field is uniform, and Faraday's law gives
    # E(r) 2 pi r = -j omega mu_0 H pi [mu_r (r^2 - b^2) + b^2] (standard electromagnetics, e.g.
    # J. Davies 1990). Active power per outer area = (1/a) integral(sigma |E|^2 r dr);
    # reactive = omega mu_0 H^2 [mu_r (a^2 - b^2) + b^2] / (2a).
    rho, f, h = 1e-6, 1e-4, 100.0
    omega = 2 * pi * f
    assert outer / skin_depth(rho, f, mu_r) < 4e-3  # corrections of order (a/delta)^2

    def e_field(r):
        return omega * mu_0 * h * (mu_r * (r**2 - inner**2) + inner**2) / (2 * r)

    active, _ = integrate.quad(lambda r: e_field(r) ** 2 / rho * r, inner, outer, epsrel=1e-13)
    reactive = omega * mu_0 * h**2 * (mu_r * (outer**2 - inner**2) + inner**2) / (2 * outer)
    z = tube_surface_impedance(outer, inner, rho, f, mu_r) * h**2
    assert z.real == pytest.approx(active / outer, rel=1e-6)
    assert z.imag == pytest.approx(reactive, rel=1e-6)


def test_bore_field_uniform_and_current_zero_in_bore():
    a, b, delta = 0.03, 0.02, 4e-3
    r_bore = np.array([0.0, 0.01, 0.0199])
    np.testing.assert_allclose(
        tube_field(r_bore, a, b, delta, 5.0), tube_field(b, a, b, delta, 5.0)
    )
    j = tube_current_density(r_bore, 1e3, a, b, 1e-6, 1e3, 5.0)
    assert np.all(j == 0)
    assert tube_field(a, a, b, delta, 5.0) == pytest.approx(1.0, rel=1e-14)


def test_inner_wall_satisfies_bore_condition():
    # rho H'(b) = j omega mu_0 (b/2) H(b), i.e. E_theta(b) from the bore flux (Faraday's law).
    rho, f, mu_r = 1e-6, 2e3, 40.0
    a, b = 0.03, 0.027
    j_b = tube_current_density(b, 1.0, a, b, rho, f, mu_r)  # J = -H'
    h_b = tube_field(b, a, b, skin_depth(rho, f, mu_r), mu_r)
    assert -rho * j_b == pytest.approx(1j * 2 * pi * f * mu_0 * b / 2 * h_b, rel=1e-12)


@pytest.mark.parametrize(("wall", "mu_r"), [(0.3, 1.0), (2.0, 1.0), (6.0, 30.0)])
def test_power_density_integrates_to_power_per_area(wall, mu_r):
    # Energy balance: (1/a) integral(rho |J|^2 r dr) over the wall = power per outer surface.
    rho, f, h = 3e-7, 4e3, 1e4
    delta = skin_depth(rho, f, mu_r)
    a = 0.04
    b = a - wall * delta
    total, _ = integrate.quad(
        lambda r: tube_power_density(r, h, a, b, rho, f, mu_r) * r, b, a, epsrel=1e-12, limit=200
    )
    assert total / a == pytest.approx(tube_power_per_area(h, a, b, rho, f, mu_r), rel=1e-9)


def test_thin_wall_quadrature_and_closed_form_agree_at_the_switch():
    # Self-consistency of the two internal routes either side of wall = 1 skin depth
    # (not an outside check): P is continuous across the switch.
    a = 5.0
    p_below, _ = tube_power_factors(a, a - 1.0, 3.0)
    p_above, _ = tube_power_factors(a, a - 1.0 - 1e-12, 3.0)
    assert p_below == pytest.approx(p_above, rel=1e-11)


def test_broadcasting_and_signs():
    z = tube_surface_impedance(0.02, np.array([[0.005], [0.015]]), 1e-6, np.array([1e2, 1e4, 1e6]))
    assert z.shape == (2, 3)
    assert np.all(z.real > 0) and np.all(z.imag > 0)
    assert np.ndim(tube_power_per_area(1e3, 0.02, 0.01, 1e-6, 1e3)) == 0
    field = tube_field(np.linspace(0.0, 0.02, 9)[:, None], 0.02, 0.01, np.array([1e-3, 1e-2]))
    assert field.shape == (9, 2) and np.all(np.isfinite(field))
