"""Field-dependent permeability (steel below the Curie temperature): limits and consistency.

The magnetisation curve is an invented arctan model written here for the tests:
B = mu0 H + Js (2/pi) atan(pi (mu_i - 1) mu0 H / (2 Js)), mu_r = B/(mu0 H), Js = 1.8 T,
mu_i = 500. It tends to mu_i at low field and to 1 at very high field.
"""

import numpy as np
import pytest
from scipy.constants import mu_0, pi

from heatcalc.em import (
    cylinder_surface_impedance,
    radial_mesh,
    skin_depth,
    slab_surface_impedance,
    solve_radial_field,
)

JS, MU_I = 1.8, 500.0
RHO, FREQ, RADIUS = 2e-7, 1e4, 0.02


def mu_arctan(h_peak):
    h = np.asarray(h_peak, dtype=float)
    x = pi * (MU_I - 1.0) * mu_0 * h / (2.0 * JS)
    safe = np.where(x > 1e-6, x, 1.0)
    ratio = np.where(x > 1e-6, np.arctan(safe) / safe, 1.0 - x**2 / 3.0)  # series near 0
    return 1.0 + (MU_I - 1.0) * ratio


def _element_peak(field):
    # definition in the solver docs: sqrt(2) x RMS over the element of the linear field
    left, right = field[:-1], field[1:]
    mean_sq = (np.abs(left) ** 2 + np.abs(right) ** 2 + (left * np.conj(right)).real) / 3.0
    return np.sqrt(2.0 * mean_sq)


def test_curve_limits():
    # The test curve itself: mu_i at low field, 1 + Js/(mu0 H) at high field.
    assert mu_arctan(1e-9) == pytest.approx(MU_I, rel=1e-12)
    assert mu_arctan(1e9) == pytest.approx(1.0 + JS / (mu_0 * 1e9), rel=1e-6)


def test_low_field_equals_analytic_with_initial_permeability():
    delta = skin_depth(RHO, FREQ, MU_I)
    mesh = radial_mesh("cylinder", RADIUS, skin_depth=delta)
    res = solve_radial_field(mesh, RHO, mu_arctan, FREQ, h_surface=1e-2)
    assert res.converged
    np.testing.assert_allclose(res.mu_r, MU_I, rtol=1e-6)
    linear = solve_radial_field(mesh, RHO, MU_I, FREQ, h_surface=1e-2)
    assert res.surface_impedance == pytest.approx(linear.surface_impedance, rel=1e-6)
    exact = cylinder_surface_impedance(RADIUS, RHO, FREQ, MU_I)
    assert res.surface_impedance.real == pytest.approx(exact.real, rel=1e-3)
    assert res.surface_impedance.imag == pytest.approx(exact.imag, rel=1e-3)


def test_very_high_field_approaches_non_magnetic_solution():
    # At very high field mu_r -> 1 + Js/(mu0 H): the solution tends to the analytic one with
    # mu_r = 1, the deviation falling like 1/H.
    mesh = radial_mesh("cylinder", RADIUS, skin_depth=skin_depth(RHO, FREQ))
    exact = cylinder_surface_impedance(RADIUS, RHO, FREQ, 1.0)
    deviations = []
    for h in (1e8, 1e9):
        res = solve_radial_field(mesh, RHO, mu_arctan, FREQ, h_surface=h)
        assert res.converged
        assert res.mu_r[-1] - 1.0 < 2.0 * JS / (mu_0 * h)  # "1 + small" at the surface
        deviations.append(abs(res.surface_impedance / exact - 1.0))
    assert deviations[1] < 2e-3
    assert deviations[1] < 0.2 * deviations[0]


@pytest.mark.parametrize("geometry", ["cylinder", "tube", "slab"])
@pytest.mark.parametrize("h_surface", [3e3, 3e4, 3e5])
def test_self_consistent_profile(geometry, h_surface):
    # Recompute mu_r from the final field: it must match the returned mu_r within tolerance.
    inner = 0.012 if geometry == "tube" else None
    delta = skin_depth(RHO, FREQ, mu_arctan(np.sqrt(2) * h_surface))
    mesh = radial_mesh(geometry, RADIUS, inner, skin_depth=0.5 * delta)
    res = solve_radial_field(mesh, RHO, mu_arctan, FREQ, h_surface=h_surface, tolerance=1e-5)
    assert res.converged
    recomputed = mu_arctan(_element_peak(res.field))
    np.testing.assert_allclose(res.mu_r, recomputed, rtol=2e-5)
    # saturation is strongest at the surface: mu_r rises with depth
    assert res.mu_r[-1] < res.mu_r[0]
    assert res.energy_error < 1e-10


def test_power_per_area_increases_with_field():
    fields = np.geomspace(10.0, 1e7, 13)
    mesh = radial_mesh("cylinder", RADIUS, skin_depth=0.5 * skin_depth(RHO, FREQ, 30.0))
    powers = [solve_radial_field(mesh, RHO, mu_arctan, FREQ, h).power_per_area for h in fields]
    assert np.all(np.diff(powers) > 0)


def test_saturation_lowers_power_per_unit_field_squared():
    # Less permeability at higher field gives a larger skin depth and a smaller rho/delta:
    # p/H^2 falls as the steel saturates (trade: surface heating of magnetic steel).
    mesh = radial_mesh("slab", 0.01, skin_depth=0.5 * skin_depth(RHO, FREQ, 30.0))
    ratio = [
        solve_radial_field(mesh, RHO, mu_arctan, FREQ, h).power_per_area / h**2
        for h in (1e2, 1e4, 1e6)
    ]
    assert ratio[0] > ratio[1] > ratio[2]
    thick_low = slab_surface_impedance(0.02, RHO, FREQ, MU_I).real
    assert ratio[0] == pytest.approx(thick_low, rel=0.05)
