"""Solid cylinder: Kelvin functions, mpmath, an independent Bessel route, limits."""

import mpmath
import numpy as np
import pytest
from scipy import integrate, special

from heatcalc.em import (
    cylinder_current_density,
    cylinder_field,
    cylinder_power_density,
    cylinder_power_factors,
    cylinder_power_per_area,
    cylinder_surface_impedance,
    skin_depth,
)

SQRT2 = np.sqrt(2.0)


def _mp_kelvin_p_q(x):
    """P and Q at x = radius/delta from mpmath Kelvin functions at 30 digits.

    Derivatives from the identities of Abramowitz & Stegun (1964) 9.9:
    sqrt(2) ber'x = ber_1 x + bei_1 x, sqrt(2) bei'x = bei_1 x - ber_1 x.
    """
    with mpmath.workdps(30):
        m = mpmath.sqrt(2) * mpmath.mpf(x)
        ber, bei = mpmath.ber(0, m), mpmath.bei(0, m)
        ber1, bei1 = mpmath.ber(1, m), mpmath.bei(1, m)
        berp = (ber1 + bei1) / mpmath.sqrt(2)
        beip = (bei1 - ber1) / mpmath.sqrt(2)
        norm = ber**2 + bei**2
        p = mpmath.sqrt(2) * (ber * berp + bei * beip) / norm
        q = mpmath.sqrt(2) * (ber * beip - bei * berp) / norm
        return float(p), float(q)


# --- Kelvin functions: Abramowitz & Stegun (1964), Table 9.12 (values from memory, CHECKS.md) ---
AS_TABLE_9_12 = {1.0: (0.9843817812, 0.2495660400), 2.0: (0.7517341827, 0.9722916273)}


@pytest.mark.parametrize("x", sorted(AS_TABLE_9_12))
def test_kelvin_functions_against_abramowitz_stegun(x):
    ber, bei = AS_TABLE_9_12[x]
    # printed to 10 decimals
    assert special.ber(x) == pytest.approx(ber, abs=1e-10)
    assert special.bei(x) == pytest.approx(bei, abs=1e-10)
    assert float(mpmath.ber(0, x)) == pytest.approx(ber, abs=1e-10)
    assert float(mpmath.bei(0, x)) == pytest.approx(bei, abs=1e-10)


def test_field_ratio_against_abramowitz_stegun_table():
    # With delta = sqrt(2), the Kelvin argument sqrt(2) r/delta equals r: the field ratio
    # H(1)/H(2) = (ber 1 + j bei 1)/(ber 2 + j bei 2), values of A&S Table 9.12 (from memory).
    ber1, bei1 = AS_TABLE_9_12[1.0]
    ber2, bei2 = AS_TABLE_9_12[2.0]
    expected = complex(ber1, bei1) / complex(ber2, bei2)
    assert cylinder_field(1.0, 2.0, SQRT2) == pytest.approx(expected, abs=2e-10)
    assert cylinder_field(0.0, 1.0, SQRT2) == pytest.approx(1.0 / complex(ber1, bei1), abs=2e-10)


@pytest.mark.parametrize("x", [0.1, 0.7, 1.0, 2.5, 4.0, 5.0])
def test_scipy_kelvin_against_mpmath(x):
    # lib: mpmath at 30 digits; rtol 1e-9 for x <= 5 (CHECKS.md). Derivative identities A&S 9.9.
    with mpmath.workdps(30):
        ber1, bei1 = mpmath.ber(1, x), mpmath.bei(1, x)
        assert special.ber(x) == pytest.approx(float(mpmath.ber(0, x)), rel=1e-9)
        assert special.bei(x) == pytest.approx(float(mpmath.bei(0, x)), rel=1e-9)
        assert special.berp(x) == pytest.approx(float((ber1 + bei1) / mpmath.sqrt(2)), rel=1e-9)
        assert special.beip(x) == pytest.approx(float((bei1 - ber1) / mpmath.sqrt(2)), rel=1e-9)
        # the identity itself, against mpmath's numerical derivative
        assert float(mpmath.diff(lambda t: mpmath.ber(0, t), x)) == pytest.approx(
            float((ber1 + bei1) / mpmath.sqrt(2)), rel=1e-20
        )


@pytest.mark.parametrize("x", [1e-4, 0.01, 0.3, 1.0, 1.7, 3.0, 10.0, 50.0, 200.0, 1000.0])
def test_power_factors_against_mpmath_kelvin(x):
    # lib: mpmath ber/bei at 30 digits; covers the series branch (x <= 1), the scaled-Bessel
    # branch and radius/skin depth = 1000 (Kelvin argument 1414, ber ~ 1e432).
    p_ref, q_ref = _mp_kelvin_p_q(x)
    p, q = cylinder_power_factors(x)
    assert p == pytest.approx(p_ref, rel=1e-12)
    assert q == pytest.approx(q_ref, rel=1e-12)


@pytest.mark.parametrize("ratio", [0.05, 0.3, 0.5, 0.9, 1.0])
@pytest.mark.parametrize("x", [0.5, 3.0, 20.0, 300.0])
def test_field_profile_against_mpmath_kelvin(x, ratio):
    # H(r)/H(a) = (ber m_r + j bei m_r)/(ber m_a + j bei m_a), m = sqrt(2) r/delta;
    # lib: mpmath at 30 digits.
    with mpmath.workdps(30):
        ma = mpmath.sqrt(2) * x
        mr = ma * ratio
        ref = mpmath.mpc(mpmath.ber(0, mr), mpmath.bei(0, mr)) / mpmath.mpc(
            mpmath.ber(0, ma), mpmath.bei(0, ma)
        )
    got = cylinder_field(ratio * x, x, 1.0)
    assert abs(got - complex(ref)) <= 1e-12 * max(abs(complex(ref)), 1e-300)


def test_independent_routes_jv_and_ber_bei_agree_with_module():
    # Two routes computed here, neither used by the module: complex scipy.special.jv with
    # k = (1 - j)/delta (J0(k r) = ber + j bei for exp(j omega t)), and the Kelvin form with
    # scipy.special.ber/bei/berp/beip (CHECKS.md).
    x = np.geomspace(0.05, 100.0, 60)
    k = 1.0 - 1.0j  # delta = 1
    zeta_jv = -k * special.jv(1, k * x) / special.jv(0, k * x)
    m = SQRT2 * x
    ber, bei, berp, beip = special.ber(m), special.bei(m), special.berp(m), special.beip(m)
    norm = ber**2 + bei**2
    p_kelvin = SQRT2 * (ber * berp + bei * beip) / norm
    q_kelvin = SQRT2 * (ber * beip - bei * berp) / norm
    p, q = cylinder_power_factors(x)
    np.testing.assert_allclose(zeta_jv.real, p_kelvin, rtol=1e-9)
    np.testing.assert_allclose(zeta_jv.imag, q_kelvin, rtol=1e-9)
    np.testing.assert_allclose(p, p_kelvin, rtol=1e-9)
    np.testing.assert_allclose(q, q_kelvin, rtol=1e-9)


def _i_ratio_asymptotic(z, terms=8):
    """I1(z)/I0(z) from the large-argument expansion, Abramowitz & Stegun (1964) 9.7.1."""

    def series(nu):
        mu = 4.0 * nu**2
        total, term = 1.0 + 0j, 1.0 + 0j
        for k in range(1, terms):
            term = term * -(mu - (2 * k - 1) ** 2) / (k * 8.0 * z)
            total = total + term
        return total

    return series(1) / series(0)


@pytest.mark.parametrize("x", [60.0, 100.0, 300.0, 1000.0, 5000.0])
def test_large_ratio_against_asymptotic_expansion(x):
    # A&S 9.7.1 asymptotic expansion (exact to rounding for |z| > 80 with 8 terms): checks the
    # scaled-Bessel route has not overflowed or lost digits up to radius/skin depth 5000.
    z = (1.0 + 1.0j) * x
    ref = (1.0 + 1.0j) * _i_ratio_asymptotic(z)
    p, q = cylinder_power_factors(x)
    assert p == pytest.approx(ref.real, rel=1e-12)
    assert q == pytest.approx(ref.imag, rel=1e-12)
    field = cylinder_field(np.linspace(0.0, x, 11), x, 1.0)
    assert np.all(np.isfinite(field))


def test_thick_cylinder_limit_and_first_correction():
    # Large radius/skin depth: p -> rho H^2/delta (CHECKS.md), with the 1 - delta/(2a) correction;
    # the neglected term is of order (delta/a)^2.
    x = np.array([20.0, 50.0, 200.0, 1000.0])
    p, q = cylinder_power_factors(x)
    assert np.all(np.abs(p - (1.0 - 1.0 / (2.0 * x))) < 0.1 / x**2)
    assert np.all(np.abs(q - 1.0) < 0.1 / x**2)
    rho, f = 1.2e-6, 1e6
    delta = skin_depth(rho, f)
    h = 2e4
    thick = cylinder_power_per_area(h, 1000 * delta, rho, f)
    assert thick == pytest.approx(rho * h**2 / delta * (1 - 1 / 2000), rel=1e-7)


def test_low_frequency_limits():
    # a/delta -> 0: P -> (a/delta)^3/4, Q -> a/delta (CHECKS.md); relative corrections O(x^4).
    x = np.array([1e-4, 1e-3, 1e-2])
    p, q = cylinder_power_factors(x)
    np.testing.assert_allclose(p, x**3 / 4.0, rtol=1e-4)
    np.testing.assert_allclose(q, x, rtol=1e-4)


def test_low_frequency_field_is_as_if_conductor_absent():
    # Very low frequency: field inside equals the applied field (common practice, no source).
    r = np.linspace(0.0, 0.05, 21)
    h = cylinder_field(r, 0.05, 1e3)  # a/delta = 5e-5
    np.testing.assert_allclose(h, 1.0, atol=1e-8)


def test_one_skin_depth_below_surface_is_about_one_over_e():
    # Thick conductor: |H| one skin depth deep is about 1/e of the surface value (common
    # practice, no source); the cylinder adds the geometric factor sqrt(a/r), here 1.0005.
    radius, delta = 1.0, 1e-3
    h = abs(cylinder_field(radius - delta, radius, delta))
    assert h == pytest.approx(np.exp(-1.0), rel=2e-3)


def test_power_density_integrates_to_power_per_area():
    # Energy balance: (1/a) integral(rho |J|^2 r dr) = power per unit surface (Poynting).
    rho, f, radius, h = 2e-7, 5e3, 0.012, 3e4
    delta = skin_depth(rho, f, 30.0)
    expected = cylinder_power_per_area(h, radius, rho, f, 30.0)
    total, _ = integrate.quad(
        lambda r: cylinder_power_density(r, h, radius, rho, f, 30.0) * r,
        0.0,
        radius,
        points=[radius - 5 * delta],
        limit=200,
        epsrel=1e-12,
    )
    assert total / radius == pytest.approx(expected, rel=1e-9)


def test_current_density_is_minus_field_gradient():
    # J = -dH/dr (sign convention): compare with a central difference of the field.
    rho, f, radius, h = 1e-6, 2e3, 0.03, 1e3
    delta = skin_depth(rho, f)
    r = np.array([0.005, 0.015, 0.025, 0.029])
    step = 1e-7
    gradient = (
        cylinder_field(r + step, radius, delta) - cylinder_field(r - step, radius, delta)
    ) / (2 * step)
    np.testing.assert_allclose(
        cylinder_current_density(r, h, radius, rho, f), -h * gradient, rtol=1e-6
    )


def test_surface_impedance_signs_and_definition():
    rho, f = 1e-6, np.array([10.0, 1e3, 1e5])
    z = cylinder_surface_impedance(0.02, rho, f, 5.0)
    assert np.all(z.real > 0) and np.all(z.imag > 0)
    np.testing.assert_allclose(cylinder_power_per_area(7.0, 0.02, rho, f, 5.0), 49.0 * z.real)


def test_broadcasting_scalars_and_arrays():
    p_scalar = cylinder_power_per_area(1e4, 0.02, 1e-6, 1e3)
    assert np.ndim(p_scalar) == 0 and isinstance(float(p_scalar), float)
    radius = np.array([[0.01], [0.02], [0.04]])
    f = np.array([1e2, 1e3, 1e4, 1e5])
    grid = cylinder_power_per_area(1e4, radius, 1e-6, f)
    assert grid.shape == (3, 4)
    assert grid[1, 1] == pytest.approx(p_scalar, rel=1e-14)
    field = cylinder_field(np.linspace(0, 0.02, 5)[:, None], 0.02, np.array([1e-3, 1e-2]))
    assert field.shape == (5, 2)
    assert np.ndim(cylinder_field(0.01, 0.02, 1e-3)) == 0


def test_efficient_through_heating_ratio():
    # P(m)/m peaks at D/delta = 3.56 (CHECKS.md; handbooks of induction heating, trade);
    # D/delta of about 3.5-4 is the usual choice for through-heating.
    from scipy.optimize import minimize_scalar

    best = minimize_scalar(
        lambda x: -cylinder_power_factors(x)[0] / x, bounds=(0.5, 5.0), method="bounded"
    )
    assert 2.0 * best.x == pytest.approx(3.56, abs=0.005)
