"""Radial field solver against the analytic solutions: accuracy, energy balance, order.

The analytic solutions themselves are checked against outside references in tests/em/
(Abramowitz & Stegun Table 9.12, mpmath, Davies 1990); here they are the exact solutions the
numerical solver must reproduce.
"""

import numpy as np
import pytest
from scipy import special

from heatcalc.em import (
    cylinder_field,
    cylinder_power_density,
    cylinder_surface_impedance,
    mesh_from_nodes,
    radial_mesh,
    skin_depth,
    slab_field,
    slab_surface_impedance,
    solve_radial_field,
    tube_field,
    tube_surface_impedance,
)

RHO, FREQ = 1.2e-6, 1e3
DELTA = skin_depth(RHO, FREQ)
RATIOS = [0.1, 0.3, 1.0, 3.0, 10.0, 30.0, 100.0]


def _case(geometry, ratio, n=200, graded=True, mu_r=1.0):
    """Mesh, numerical result and analytic impedance/field for radius (half-thickness)/delta."""
    delta = skin_depth(RHO, FREQ, mu_r)
    outer = ratio * delta
    inner = 0.6 * outer if geometry == "tube" else None
    mesh = radial_mesh(geometry, outer, inner, n=n, skin_depth=delta if graded else None)
    result = solve_radial_field(mesh, RHO, mu_r, FREQ)
    r = mesh.nodes
    if geometry == "cylinder":
        z = cylinder_surface_impedance(outer, RHO, FREQ, mu_r)
        h = cylinder_field(r, outer, delta)
    elif geometry == "tube":
        z = tube_surface_impedance(outer, inner, RHO, FREQ, mu_r)
        h = tube_field(r, outer, inner, delta, mu_r)
    else:
        z = slab_surface_impedance(2 * outer, RHO, FREQ, mu_r)
        h = slab_field(r, 2 * outer, delta)
    return mesh, result, z, h


@pytest.mark.parametrize("ratio", RATIOS)
@pytest.mark.parametrize("geometry", ["cylinder", "tube", "slab"])
def test_power_and_reactive_power_within_0p1_percent(geometry, ratio):
    # Default mesh (200 nodes graded with the true skin depth) against the analytic solution.
    _, res, z, _ = _case(geometry, ratio)
    assert res.power_per_area == pytest.approx(z.real, rel=1e-3)
    assert res.reactive_power_per_area == pytest.approx(z.imag, rel=1e-3)
    # energy balance: element powers sum to the surface Poynting flux
    assert res.energy_error < 1e-6


@pytest.mark.parametrize("mu_r", [1.0, 30.0, 500.0])
@pytest.mark.parametrize("geometry", ["cylinder", "tube", "slab"])
def test_field_profile_matches_analytic(geometry, mu_r):
    _, res, _, h = _case(geometry, 5.0, mu_r=mu_r)
    assert np.max(np.abs(res.field - h)) < 1e-3


def test_power_density_matches_analytic_at_element_centres():
    # The element gradient of linear elements is most accurate at the element centre. The
    # relative error grows with depth (accumulated phase error ~ depth (h/delta)^2), where the
    # power density itself has fallen off: check relative error within 3 skin depths, and the
    # error relative to the surface power density everywhere.
    mesh, res, _, _ = _case("cylinder", 20.0)
    outer = mesh.outer
    analytic = cylinder_power_density(res.centres, 1.0, outer, RHO, FREQ)
    near = res.centres > outer - 3 * DELTA
    np.testing.assert_allclose(res.power_density[near], analytic[near], rtol=2e-3)
    assert np.max(np.abs(res.power_density - analytic)) < 1e-3 * analytic[-1]


@pytest.mark.parametrize("geometry", ["cylinder", "tube", "slab"])
def test_energy_check_at_extremes(geometry):
    for ratio in (0.01, 1000.0):
        _, res, z, _ = _case(geometry, ratio)
        assert res.energy_error < 1e-10
        assert res.power_per_area == pytest.approx(z.real, rel=1e-3)


@pytest.mark.parametrize("geometry", ["cylinder", "tube", "slab"])
def test_observed_order_of_convergence_is_two(geometry):
    # Linear elements: error in the surface impedance O(h^2). Uniform meshes, log-log fit of
    # the error against the element width (scikit-fem style order check).
    n_values = np.array([21, 41, 81, 161, 321])
    errors, widths = [], []
    for n in n_values:
        mesh, res, z, _ = _case(geometry, 3.0, n=int(n), graded=False)
        errors.append(abs(res.surface_impedance / z - 1.0))
        widths.append(mesh.widths.max())
    slope = np.polyfit(np.log(widths), np.log(errors), 1)[0]
    assert slope == pytest.approx(2.0, abs=0.1)


def _two_layer_impedance(a, c, rho_shell, mu_shell, rho_core, mu_core):
    """Exact surface impedance of a cylinder with a core (radius c) and a shell (c..a).

    Core: H = C I0(alpha2 r); shell: H = A I0(alpha1 r) + B K0(alpha1 r); H and E = rho H'
    continuous at r = c (J. Davies, Conduction and Induction Heating, 1990, multi-layer loads;
    A&S 9.6 functions from scipy.special).
    """
    a1 = (1 + 1j) / skin_depth(rho_shell, FREQ, mu_shell)
    a2 = (1 + 1j) / skin_depth(rho_core, FREQ, mu_core)
    gamma = rho_core * a2 * special.iv(1, a2 * c) / special.iv(0, a2 * c)
    ratio = (rho_shell * a1 * special.iv(1, a1 * c) - gamma * special.iv(0, a1 * c)) / (
        rho_shell * a1 * special.kv(1, a1 * c) + gamma * special.kv(0, a1 * c)
    )
    return (
        rho_shell
        * a1
        * (special.iv(1, a1 * a) - ratio * special.kv(1, a1 * a))
        / (special.iv(0, a1 * a) + ratio * special.kv(0, a1 * a))
    )


def test_two_layer_cylinder_with_property_jump():
    # Hot non-magnetic shell over a cold magnetic core (a hardening situation): per-element
    # properties with a jump at a node, against the exact two-layer solution.
    a, c = 0.02, 0.018
    rho_shell, mu_shell, rho_core, mu_core = 1.1e-6, 1.0, 2e-7, 100.0
    freq = FREQ
    core = radial_mesh("cylinder", c, n=100, skin_depth=skin_depth(rho_core, freq, mu_core))
    shell = radial_mesh("tube", a, c, n=100, skin_depth=skin_depth(rho_shell, freq, mu_shell))
    mesh = mesh_from_nodes("cylinder", np.concatenate([core.nodes[:-1], shell.nodes]))
    in_shell = mesh.centres > c
    rho = np.where(in_shell, rho_shell, rho_core)
    mu = np.where(in_shell, mu_shell, mu_core)
    res = solve_radial_field(mesh, rho, mu, freq)
    exact = _two_layer_impedance(a, c, rho_shell, mu_shell, rho_core, mu_core)
    assert res.surface_impedance.real == pytest.approx(exact.real, rel=1e-3)
    assert res.surface_impedance.imag == pytest.approx(exact.imag, rel=1e-3)
    assert res.energy_error < 1e-10
