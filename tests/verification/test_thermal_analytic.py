"""Radial transient conduction solver against exact solutions, with observed orders.

Outside references:
* H. S. Carslaw, J. C. Jaeger, Conduction of Heat in Solids, 2nd ed., Oxford, 1959 (recalled
  FROM MEMORY): section 7.7, solid cylinder with constant surface flux F from zero,
      v = (F a/K) [2 kappa t/a^2 + r^2/(2 a^2) - 1/4
                   - 2 sum exp(-kappa alpha_n^2 t/a^2) J0(alpha_n r/a)/(alpha_n^2 J0(alpha_n))],
  alpha_n the positive roots of J1 (scipy.special.jn_zeros); section 3.3, slab -l < x < l with
  flux F at both faces,
      v = F t/(rho c l) + (F l/K) [(3x^2 - l^2)/(6 l^2)
                   - (2/pi^2) sum (-1)^n/n^2 exp(-kappa n^2 pi^2 t/l^2) cos(n pi x/l)].
* F. P. Incropera, D. P. DeWitt, Fundamentals of Heat and Mass Transfer, 6th ed., 2007,
  section 5.6.2 and Table 5.1 (one-term solution for an infinite cylinder cooled by
  convection): zeta_1 J1(zeta_1)/J0(zeta_1) = Bi, C1 = (2/zeta_1) J1/(J0^2 + J1^2), computed with
  scipy; Table 5.1 at Bi = 1: zeta_1 = 1.2558, C1 = 1.2071 (from memory).
* Tube with an adiabatic bore and constant outer flux: quasi-steady solution derived here from
  the heat equation (first principles).
"""

import numpy as np
import pytest
from scipy.optimize import brentq
from scipy.special import j0, j1, jn_zeros

from heatcalc.em import radial_mesh
from heatcalc.materials import Material
from heatcalc.thermal import Segment, SurfaceLoss, simulate_heating

K, C, RHO = 30.0, 600.0, 7800.0
KAPPA = K / (RHO * C)
A = 0.05  # radius or half-thickness [m]
F = 1e5  # surface flux [W/m2]
T0 = 293.15
STEEL_LIKE = Material.constant(thermal_conductivity=K, specific_heat=C, density=RHO)


def cj_cylinder(r, t, n_terms=80):
    alpha = jn_zeros(1, n_terms)[:, None]
    r = np.atleast_1d(r)[None, :]
    series = np.sum(
        np.exp(-KAPPA * alpha**2 * t / A**2) * j0(alpha * r / A) / (alpha**2 * j0(alpha)), axis=0
    )
    return F * A / K * (2 * KAPPA * t / A**2 + r[0] ** 2 / (2 * A**2) - 0.25 - 2 * series)


def cj_slab(x, t, n_terms=200):
    n = np.arange(1, n_terms + 1)[:, None]
    x = np.atleast_1d(x)[None, :]
    series = np.sum(
        (-1.0) ** n
        / n**2
        * np.exp(-KAPPA * n**2 * np.pi**2 * t / A**2)
        * np.cos(n * np.pi * x / A),
        axis=0,
    )
    return F * t / (RHO * C * A) + F * A / K * (
        (3 * x[0] ** 2 - A**2) / (6 * A**2) - 2 / np.pi**2 * series
    )


def run(geometry, n, duration, steps, inner=None, profile_times=()):
    mesh = radial_mesh(geometry, A, inner, n=n)
    return simulate_heating(
        STEEL_LIKE,
        geometry,
        A,
        [Segment(duration, "power", F)],
        inner=inner,
        mesh=mesh,
        t_initial=T0,
        steps_per_segment=steps,
        profile_times=profile_times,
        tolerance=1e-7,
    )


def fit_order(h, err):
    return np.polyfit(np.log(h), np.log(err), 1)[0]


# -- solid cylinder, constant flux -------------------------------------------------------------
@pytest.fixture(scope="module")
def cylinder_run():
    return run("cylinder", 101, 400.0, 4000, profile_times=(20.0, 60.0, 200.0, 400.0))


@pytest.mark.parametrize("time", [20.0, 60.0, 200.0, 400.0])
def test_cylinder_profile_against_carslaw_jaeger(cylinder_run, time):
    got = cylinder_run.profile(time) - T0
    ref = cj_cylinder(cylinder_run.nodes, time)
    # 0.1 % of the flux temperature scale F a/K (167 K)
    np.testing.assert_allclose(got, ref, rtol=0, atol=1e-3 * F * A / K)


def test_cylinder_mean_rise_is_exact_at_all_times(cylinder_run):
    s = cylinder_run.series
    t = s.index.to_numpy()
    np.testing.assert_allclose(s["mean"] - T0, 2 * F * t / (RHO * C * A), rtol=1e-9, atol=1e-9)


def test_cylinder_quasi_steady_difference(cylinder_run):
    last = cylinder_run.series.iloc[-1]
    assert last["surface"] - last["centre"] == pytest.approx(F * A / (2 * K), rel=2e-4)


def test_cylinder_spatial_order():
    # Fo = 1.03: the transient has decayed (exp(-14.7 Fo)), so backward Euler is exact for the
    # remaining linear-in-time solution and only the mesh error is left.
    errors, widths = [], []
    for n in [11, 21, 41, 81]:
        r = run("cylinder", n, 400.0, 400)
        final = np.array([r.series["surface"].iloc[-1], r.series["centre"].iloc[-1]]) - T0
        errors.append(np.max(np.abs(final - cj_cylinder(np.array([A, 0.0]), 400.0))))
        widths.append(A / (n - 1))
    order = fit_order(widths, errors)
    assert 1.8 < order < 2.2, (order, errors)


def test_cylinder_time_order():
    # Fine mesh (space error far below the time error), backward Euler at t = 20 s.
    steps = [10, 20, 40, 80]
    errors = []
    ref = cj_cylinder(np.array([A]), 20.0)[0]
    for n in steps:
        r = run("cylinder", 401, 20.0, n)
        errors.append(abs(r.series["surface"].iloc[-1] - T0 - ref))
    order = fit_order([20.0 / n for n in steps], errors)
    assert 0.8 < order < 1.2, (order, errors)


# -- slab, constant flux on both faces ---------------------------------------------------------
@pytest.fixture(scope="module")
def slab_run():
    return run("slab", 101, 300.0, 3000, profile_times=(10.0, 100.0, 300.0))


@pytest.mark.parametrize("time", [10.0, 100.0, 300.0])
def test_slab_profile_against_carslaw_jaeger(slab_run, time):
    got = slab_run.profile(time) - T0
    ref = cj_slab(slab_run.nodes, time)
    np.testing.assert_allclose(got, ref, rtol=0, atol=1e-3 * F * A / K)


def test_slab_mean_and_quasi_steady(slab_run):
    s = slab_run.series
    t = s.index.to_numpy()
    np.testing.assert_allclose(s["mean"] - T0, F * t / (RHO * C * A), rtol=1e-9, atol=1e-9)
    last = s.iloc[-1]
    assert last["surface"] - last["centre"] == pytest.approx(F * A / (2 * K), rel=5e-4)


def test_slab_spatial_order():
    # Fo = 2 (the slowest slab mode decays as exp(-pi^2 Fo)): only the mesh error is left.
    errors, widths = [], []
    for n in [11, 21, 41, 81]:
        r = run("slab", n, 780.0, 780)
        final = np.array([r.series["surface"].iloc[-1], r.series["centre"].iloc[-1]]) - T0
        errors.append(np.max(np.abs(final - cj_slab(np.array([A, 0.0]), 780.0))))
        widths.append(A / (n - 1))
    order = fit_order(widths, errors)
    assert 1.8 < order < 2.2, (order, errors)


# -- tube, adiabatic bore ----------------------------------------------------------------------
def test_tube_mean_and_quasi_steady_difference():
    ri = 0.02
    r = run("tube", 101, 600.0, 600, inner=ri)
    s = r.series
    rate = 2 * F * A / (RHO * C * (A**2 - ri**2))  # dT/dt of the mean (first law)
    np.testing.assert_allclose(s["mean"] - T0, rate * s.index.to_numpy(), rtol=1e-9, atol=1e-9)
    # T = rate t + f(r), f'' + f'/r = rate/kappa, f'(ri) = 0:
    # f(a) - f(ri) = rate/(2 kappa) [(a^2 - ri^2)/2 - ri^2 ln(a/ri)]
    diff = rate / (2 * KAPPA) * ((A**2 - ri**2) / 2 - ri**2 * np.log(A / ri))
    last = s.iloc[-1]
    assert last["surface"] - last["centre"] == pytest.approx(diff, rel=1e-3)


# -- cylinder cooling by convection: one-term solution -----------------------------------------
def one_term_coefficients(biot):
    zeta = brentq(lambda z: z * j1(z) - biot * j0(z), 1e-9, jn_zeros(0, 1)[0] - 1e-9)
    c1 = 2.0 / zeta * j1(zeta) / (j0(zeta) ** 2 + j1(zeta) ** 2)
    return zeta, c1


def test_one_term_coefficients_match_table_5_1():
    # Incropera & DeWitt Table 5.1, infinite cylinder, Bi = 1.0 (from memory).
    zeta, c1 = one_term_coefficients(1.0)
    assert zeta == pytest.approx(1.2558, abs=1e-4)
    assert c1 == pytest.approx(1.2071, abs=1e-4)


@pytest.mark.parametrize("biot", [0.5, 1.0, 5.0])
def test_cylinder_cooling_against_one_term_solution(biot):
    t_hot, t_inf = 1000.0, 300.0
    h = biot * K / A
    fourier = 0.6
    duration = fourier * A**2 / KAPPA
    mesh = radial_mesh("cylinder", A, n=81)
    cooling = Segment(duration, "off", loss=SurfaceLoss(h_convection=h, t_surroundings=t_inf))
    r = simulate_heating(STEEL_LIKE, "cylinder", A, [cooling], mesh=mesh, t_initial=t_hot,
                         steps_per_segment=2000, tolerance=1e-7)  # fmt: skip
    zeta, c1 = one_term_coefficients(biot)
    theta_centre = c1 * np.exp(-(zeta**2) * fourier)
    last = r.series.iloc[-1]
    got_centre = (last["centre"] - t_inf) / (t_hot - t_inf)
    got_surface = (last["surface"] - t_inf) / (t_hot - t_inf)
    # one-term truncation at Fo = 0.6 is below 0.1 %; allow 0.5 %
    assert got_centre == pytest.approx(theta_centre, rel=5e-3)
    assert got_surface == pytest.approx(theta_centre * j0(zeta), rel=5e-3)
    # energy: the heat lost equals the enthalpy drop (Incropera eq. 5.51 for Q/Q0)
    q_ratio = 1 - 2 * theta_centre / zeta * j1(zeta)
    lost = r.energy_lost / (RHO * C * (t_hot - t_inf) * A / 2)
    assert lost == pytest.approx(q_ratio, rel=5e-3)
