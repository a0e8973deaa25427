"""Radial field solver: result contents, per-element properties, iteration control, bad input."""

import warnings

import numpy as np
import pytest
from scipy.constants import mu_0, pi

from heatcalc.em import (
    ConvergenceError,
    ConvergenceWarning,
    RadialFieldResult,
    cylinder_surface_impedance,
    radial_mesh,
    skin_depth,
    solve_radial_field,
)

RHO, FREQ = 2e-7, 1e4


def mu_arctan(h_peak, js=1.8, mu_i=500.0):
    """Invented arctan magnetisation curve for tests: B = mu0 H + Js (2/pi) atan(pi (mu_i - 1)
    mu0 H / (2 Js)), mu_r = B/(mu0 H); mu_r -> mu_i as H -> 0."""
    h = np.asarray(h_peak, dtype=float)
    x = pi * (mu_i - 1.0) * mu_0 * h / (2.0 * js)
    safe = np.where(x > 1e-6, x, 1.0)
    ratio = np.where(x > 1e-6, np.arctan(safe) / safe, 1.0 - x**2 / 3.0)
    return 1.0 + (mu_i - 1.0) * ratio


@pytest.fixture
def mesh():
    return radial_mesh("cylinder", 0.02, skin_depth=skin_depth(RHO, FREQ, 50.0))


def test_result_contents(mesh):
    res = solve_radial_field(mesh, RHO, 50.0, FREQ, h_surface=2e3)
    assert isinstance(res, RadialFieldResult)
    n = mesh.nodes.size
    assert res.field.shape == (n,) and res.field.dtype == complex
    assert res.current_density.shape == (n - 1,) and res.power_density.shape == (n - 1,)
    assert res.centres.shape == (n - 1,)
    assert res.field[-1] == 2e3
    assert res.converged and res.iterations == 1 and res.mu_r_change == 0.0
    np.testing.assert_array_equal(res.mu_r, 50.0)
    np.testing.assert_array_equal(res.resistivity, RHO)
    assert res.power_per_area + 1j * res.reactive_power_per_area == pytest.approx(
        res.surface_impedance * 2e3**2, rel=1e-14
    )
    assert res.surface_impedance.real > 0 and res.surface_impedance.imag > 0
    assert 0 < res.surface_resolution < 0.1
    with pytest.raises(AttributeError):
        res.power_per_area = 0.0  # frozen
    with pytest.raises(ValueError):
        res.field[0] = 0.0  # read-only arrays


def test_power_scales_with_field_squared_for_fixed_properties(mesh):
    a = solve_radial_field(mesh, RHO, 50.0, FREQ, h_surface=1.0)
    b = solve_radial_field(mesh, RHO, 50.0, FREQ, h_surface=300.0)
    assert b.power_per_area == pytest.approx(9e4 * a.power_per_area, rel=1e-13)
    assert b.surface_impedance == pytest.approx(a.surface_impedance, rel=1e-13)


def test_per_element_arrays_equal_scalars(mesh):
    m = mesh.n_elements
    a = solve_radial_field(mesh, np.full(m, RHO), np.full(m, 50.0), FREQ)
    b = solve_radial_field(mesh, RHO, 50.0, FREQ)
    assert a.surface_impedance == b.surface_impedance


def test_trend_resistivity_and_permeability_concentrate_heating():
    # Raising permeability or frequency concentrates heating near the surface; raising
    # resistivity spreads it (trade, CHECKS.md). Measure the share of power in the outer 1 mm.
    mesh = radial_mesh("cylinder", 0.02, n=400)

    def outer_share(rho, mu, f):
        res = solve_radial_field(mesh, rho, mu, f)
        w = res.power_density * mesh.volume_per_area
        return w[res.centres > 0.019].sum() / w.sum()

    base = outer_share(1e-6, 1.0, 1e3)
    assert outer_share(1e-6, 20.0, 1e3) > base
    assert outer_share(1e-6, 1.0, 1e4) > base
    assert outer_share(4e-6, 1.0, 1e3) < base


def test_constant_callable_equals_array(mesh):
    fixed = solve_radial_field(mesh, RHO, 37.0, FREQ, 1e3)
    called = solve_radial_field(mesh, RHO, lambda h: np.full_like(h, 37.0), FREQ, 1e3)
    assert called.converged and called.iterations == 1
    assert called.surface_impedance == pytest.approx(fixed.surface_impedance, rel=1e-14)


def test_callable_receives_peak_amplitude():
    # At very low frequency the field is uniform (common practice, no source), so every element
    # must be handed sqrt(2) x RMS surface field.
    seen = []

    def mu(h):
        seen.append(np.array(h))
        return np.full_like(h, 10.0)

    m = radial_mesh("slab", 0.005, n=20)
    solve_radial_field(m, 1e-6, mu, 0.01, h_surface=1e3)
    np.testing.assert_allclose(seen[-1], np.sqrt(2.0) * 1e3, rtol=1e-9)


def test_non_convergence_warns_or_raises(mesh):
    with pytest.warns(ConvergenceWarning, match="did not converge"):
        res = solve_radial_field(mesh, RHO, mu_arctan, FREQ, 3e4, max_iterations=2)
    assert not res.converged and res.iterations == 2 and res.mu_r_change > 1e-4
    with pytest.raises(ConvergenceError, match="did not converge"):
        solve_radial_field(mesh, RHO, mu_arctan, FREQ, 3e4, max_iterations=2, on_failure="raise")
    assert issubclass(ConvergenceWarning, RuntimeWarning)


def test_converged_run_issues_no_warning(mesh):
    with warnings.catch_warnings():
        warnings.simplefilter("error")
        res = solve_radial_field(mesh, RHO, mu_arctan, FREQ, 3e4)
    assert res.converged and 1 < res.iterations < 100 and res.mu_r_change <= 1e-4


@pytest.mark.parametrize(
    ("kwargs", "name"),
    [
        ({"resistivity": -1e-7}, "resistivity"),
        ({"resistivity": np.zeros(3)}, "resistivity"),
        ({"mu_r": 0.5}, "mu_r"),
        ({"mu_r": np.full(7, 2.0)}, "mu_r"),
        ({"frequency": 0.0}, "frequency"),
        ({"frequency": np.nan}, "frequency"),
        ({"h_surface": 0.0}, "h_surface"),
        ({"mesh": "cylinder"}, "mesh"),
        ({"on_failure": "ignore"}, "on_failure"),
        ({"mu_r": mu_arctan, "tolerance": 0.0}, "tolerance"),
        ({"mu_r": mu_arctan, "max_iterations": 0}, "max_iterations"),
        ({"mu_r": mu_arctan, "relaxation": 1.5}, "relaxation"),
        ({"mu_r": lambda h: 0.5 * np.ones_like(h)}, "mu_r"),
        ({"mu_r": lambda h: np.ones(3)}, "mu_r"),
        ({"mu_r": lambda h: np.full_like(h, np.nan)}, "mu_r"),
    ],
)
def test_bad_input(mesh, kwargs, name):
    args = {"mesh": mesh, "resistivity": RHO, "mu_r": 10.0, "frequency": FREQ, "h_surface": 1e3}
    args.update(kwargs)
    with pytest.raises(ValueError, match=name):
        solve_radial_field(**args)


def test_mesh_too_coarse_is_reported():
    coarse = radial_mesh("cylinder", 0.02, n=20)
    res = solve_radial_field(coarse, RHO, 100.0, FREQ)
    assert res.surface_resolution > 1.0
    exact = cylinder_surface_impedance(0.02, RHO, FREQ, 100.0)
    assert abs(res.surface_impedance / exact - 1) > 0.01  # and the answer is indeed poor
