"""Radial meshes: grading, geometric factors, input checks."""

import numpy as np
import pytest
from scipy import integrate

from heatcalc.em import mesh_from_nodes, radial_mesh


@pytest.mark.parametrize("geometry", ["cylinder", "slab"])
def test_ends_and_node_count(geometry):
    mesh = radial_mesh(geometry, 0.04, n=150, skin_depth=1e-3)
    assert mesh.nodes.size == 150
    assert mesh.nodes[0] == 0.0 and mesh.nodes[-1] == 0.04
    assert np.all(np.diff(mesh.nodes) > 0)


def test_tube_starts_at_bore():
    mesh = radial_mesh("tube", 0.04, 0.03, n=50, skin_depth=1e-3)
    assert mesh.inner == 0.03 and mesh.outer == 0.04


def test_graded_towards_surface_with_requested_surface_element():
    delta = 1e-3
    mesh = radial_mesh("cylinder", 0.1, n=200, skin_depth=delta, surface_fraction=0.04)
    widths = mesh.widths
    assert widths[-1] == pytest.approx(0.04 * delta, rel=1e-9)
    assert np.all(np.diff(widths) < 0)  # shrinking towards the surface
    ratio = widths[:-1] / widths[1:]
    assert np.all(ratio <= 1.15 + 1e-12)
    np.testing.assert_allclose(ratio, ratio[0], rtol=1e-9)  # geometric


def test_growth_cap_enlarges_surface_element():
    mesh = radial_mesh("slab", 1.0, n=50, skin_depth=1e-5, max_growth=1.1)
    ratio = mesh.widths[:-1] / mesh.widths[1:]
    np.testing.assert_allclose(ratio, 1.1, rtol=1e-9)
    assert mesh.widths[-1] > 0.04 * 1e-5


def test_uniform_when_skin_depth_large_or_absent():
    for mesh in (
        radial_mesh("cylinder", 0.01, n=11),
        radial_mesh("cylinder", 0.01, n=11, skin_depth=1.0),
    ):
        np.testing.assert_allclose(mesh.widths, 1e-3, rtol=1e-12)


@pytest.mark.parametrize("geometry", ["cylinder", "tube", "slab"])
def test_geometric_factors_are_exact_integrals(geometry):
    # Mass factors integral(N_i N_j w dr) against scipy quadrature on one element.
    nodes = np.array([0.02, 0.023, 0.03]) if geometry == "tube" else np.array([0.0, 0.004, 0.01])
    mesh = mesh_from_nodes(geometry, nodes)

    def weight(r):
        return 1.0 if geometry == "slab" else r

    for e in range(2):
        r1, r2 = nodes[e], nodes[e + 1]
        h = r2 - r1

        def n_left(r, r2=r2, h=h):
            return (r2 - r) / h

        def n_right(r, r1=r1, h=h):
            return (r - r1) / h

        m_ll = integrate.quad(lambda r: n_left(r) ** 2 * weight(r), r1, r2)[0]
        m_rr = integrate.quad(lambda r: n_right(r) ** 2 * weight(r), r1, r2)[0]
        m_lr = integrate.quad(lambda r: n_left(r) * n_right(r) * weight(r), r1, r2)[0]
        assert mesh.mass_left[e] == pytest.approx(m_ll, rel=1e-13)
        assert mesh.mass_right[e] == pytest.approx(m_rr, rel=1e-13)
        assert mesh.mass_cross[e] == pytest.approx(m_lr, rel=1e-13)
    # element volumes per unit heated area sum to the volume per unit area
    total = {"slab": 0.01, "cylinder": 0.01 / 2, "tube": (0.03**2 - 0.02**2) / (2 * 0.03)}
    assert mesh.volume_per_area.sum() == pytest.approx(total[geometry], rel=1e-14)


def test_arrays_are_read_only():
    mesh = radial_mesh("cylinder", 0.01, n=5)
    with pytest.raises(ValueError):
        mesh.nodes[0] = 1.0


@pytest.mark.parametrize(
    ("kwargs", "name"),
    [
        ({"geometry": "sphere", "outer": 0.01}, "geometry"),
        ({"geometry": "cylinder", "outer": -0.01}, "outer"),
        ({"geometry": "cylinder", "outer": 0.0}, "outer"),
        ({"geometry": "tube", "outer": 0.01}, "inner"),
        ({"geometry": "tube", "outer": 0.01, "inner": 0.02}, "inner"),
        ({"geometry": "tube", "outer": 0.01, "inner": -0.001}, "inner"),
        ({"geometry": "cylinder", "outer": 0.01, "inner": 0.005}, "inner"),
        ({"geometry": "cylinder", "outer": 0.01, "n": 2}, "n"),
        ({"geometry": "cylinder", "outer": 0.01, "n": 20.5}, "n"),
        ({"geometry": "cylinder", "outer": 0.01, "skin_depth": 0.0}, "skin_depth"),
        ({"geometry": "cylinder", "outer": 0.01, "skin_depth": 1e-3, "surface_fraction": -1},
         "surface_fraction"),
        ({"geometry": "cylinder", "outer": 0.01, "max_growth": 1.0}, "max_growth"),
    ],
)  # fmt: skip
def test_bad_input(kwargs, name):
    with pytest.raises(ValueError, match=name):
        radial_mesh(**kwargs)


@pytest.mark.parametrize(
    ("geometry", "nodes", "name"),
    [
        ("cylinder", [0.0, 0.2, 0.1], "increasing"),
        ("cylinder", [0.1, 0.2, 0.3], "nodes"),
        ("tube", [0.0, 0.2, 0.3], "bore"),
        ("cylinder", [0.0, 0.1], "nodes"),
        ("cone", [0.0, 0.1, 0.2], "geometry"),
    ],
)
def test_mesh_from_nodes_bad_input(geometry, nodes, name):
    with pytest.raises(ValueError, match=name):
        mesh_from_nodes(geometry, nodes)
