"""One-dimensional meshes for the radial field solver, graded towards the heated surface.

A mesh runs from the inner end (cylinder axis, tube bore wall, or plate mid-plane) to the heated
outer surface, which is always the last node. Elements lie between nodes; material properties
are given per element. Element sizes grow geometrically away from the surface so that the
surface element is a chosen fraction of the skin depth while the node count stays fixed.
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np
from scipy.optimize import brentq

from heatcalc import _checks as v

__all__ = ["GEOMETRIES", "RadialMesh", "mesh_from_nodes", "radial_mesh"]

#: Geometries understood by :func:`radial_mesh` and the solver.
GEOMETRIES = ("cylinder", "tube", "slab")


@dataclass(frozen=True, eq=False)
class RadialMesh:
    """Nodes of a radial mesh and the geometric factors of its linear elements.

    Attributes
    ----------
    geometry : str
        ``"cylinder"``, ``"tube"`` or ``"slab"``.
    nodes : ndarray [m]
        Node positions, increasing; ``nodes[-1]`` is the heated surface. For ``"cylinder"``
        ``nodes[0] = 0`` (axis); for ``"tube"`` ``nodes[0]`` is the bore radius; for ``"slab"``
        the coordinate is the distance from the mid-plane and ``nodes[-1]`` is half the
        thickness.
    weight_mean : ndarray [m] or [-]
        Per element, the mean of the geometric weight ``w`` of element integrals
        ``integral(f w dr)``: ``w = r`` [m] for cylinder and tube, ``w = 1`` [-] for the plate.
    mass_left, mass_right, mass_cross : ndarray [m2] or [m]
        Per element, ``integral(N_i N_j w dr)`` for the linear shape functions (left-left,
        right-right, left-right).
    volume_per_area : ndarray [m]
        Per element, element volume per unit heated surface area, ``integral(w dr)/w(surface)``.
    """

    geometry: str
    nodes: np.ndarray
    weight_mean: np.ndarray
    mass_left: np.ndarray
    mass_right: np.ndarray
    mass_cross: np.ndarray
    volume_per_area: np.ndarray

    @property
    def outer(self) -> float:
        """Position of the heated surface [m]."""
        return float(self.nodes[-1])

    @property
    def inner(self) -> float:
        """Position of the first node [m] (0 for cylinder and plate)."""
        return float(self.nodes[0])

    @property
    def n_elements(self) -> int:
        """Number of elements (one fewer than nodes)."""
        return self.nodes.size - 1

    @property
    def widths(self) -> np.ndarray:
        """Element widths [m]."""
        return np.diff(self.nodes)

    @property
    def centres(self) -> np.ndarray:
        """Element mid-points [m]."""
        return 0.5 * (self.nodes[1:] + self.nodes[:-1])

    @property
    def surface_weight(self) -> float:
        """Geometric weight at the heated surface (the radius [m], or 1 for the plate)."""
        return self.outer if self.geometry != "slab" else 1.0


def _freeze(arr: np.ndarray) -> np.ndarray:
    arr = np.ascontiguousarray(arr, dtype=float)
    arr.setflags(write=False)
    return arr


def mesh_from_nodes(geometry: str, nodes) -> RadialMesh:
    """Build a :class:`RadialMesh` from given node positions (increasing, surface last).

    Parameters
    ----------
    geometry : str
        One of :data:`GEOMETRIES`.
    nodes : array [m]
        At least 3 strictly increasing positions; ``nodes[0]`` must be 0 for the cylinder and
        plate and > 0 for the tube.

    Returns
    -------
    RadialMesh

    Raises
    ------
    ValueError
        For an unknown geometry or unsuitable nodes.
    """
    if geometry not in GEOMETRIES:
        raise ValueError(f"geometry must be one of {GEOMETRIES}; got {geometry!r}")
    x = v.real_array("nodes", nodes, "m")
    if x.ndim != 1 or x.size < 3:
        raise ValueError(f"nodes must be a 1-d array of at least 3 positions; got shape {x.shape}")
    if np.any(np.diff(x) <= 0.0):
        raise ValueError("nodes must be strictly increasing")
    if geometry == "tube":
        if x[0] <= 0.0:
            raise ValueError(f"nodes[0] (bore radius) must be > 0 for a tube; got {x[0]!r}")
    elif x[0] != 0.0:
        raise ValueError(f"nodes[0] must be 0 for a {geometry}; got {x[0]!r}")
    left, right = x[:-1], x[1:]
    h = right - left
    if geometry == "slab":
        weight_mean = np.ones_like(h)
        mass_left = h / 3.0
        mass_right = h / 3.0
        mass_cross = h / 6.0
        surface = 1.0
    else:
        weight_mean = 0.5 * (left + right)
        mass_left = h * (3.0 * left + right) / 12.0
        mass_right = h * (left + 3.0 * right) / 12.0
        mass_cross = h * (left + right) / 12.0
        surface = x[-1]
    return RadialMesh(
        geometry=geometry,
        nodes=_freeze(x),
        weight_mean=_freeze(weight_mean),
        mass_left=_freeze(mass_left),
        mass_right=_freeze(mass_right),
        mass_cross=_freeze(mass_cross),
        volume_per_area=_freeze(weight_mean * h / surface),
    )


def _growth_ratio(first: float, length: float, n_elements: int) -> float:
    """Ratio q > 1 with ``first (q**n - 1)/(q - 1) = length`` (geometric element sizes)."""

    def excess(log_q: float) -> float:
        q = np.exp(log_q)
        return first * np.expm1(n_elements * log_q) / (q - 1.0) - length

    high = 1.0
    while excess(high) < 0.0:  # pragma: no cover - only for absurdly small first elements
        high *= 2.0
    return float(np.exp(brentq(excess, 1e-12, high, xtol=1e-14, rtol=1e-14)))


def radial_mesh(
    geometry, outer, inner=None, n=200, skin_depth=None, surface_fraction=0.04, max_growth=1.15
):
    """Mesh from the inner end to the heated surface, graded towards the surface.

    Parameters
    ----------
    geometry : {"cylinder", "tube", "slab"}
        Solid cylinder (mesh from the axis), tube (from the bore wall) or plate (from the
        mid-plane; symmetric fields on both faces).
    outer : float [m]
        Outer radius, or half the thickness for ``"slab"``; > 0.
    inner : float [m], optional
        Bore radius, required for ``"tube"`` (``0 < inner < outer``), not allowed otherwise.
    n : int
        Number of nodes, >= 3 (elements: ``n - 1``).
    skin_depth : float [m], optional
        Skin depth used for grading (> 0). If omitted the mesh is uniform.
    surface_fraction : float [-]
        Wanted width of the surface element as a fraction of ``skin_depth``, > 0.
    max_growth : float [-]
        Largest ratio of neighbouring element widths, > 1.

    Returns
    -------
    RadialMesh

    Raises
    ------
    ValueError
        For an invalid argument.

    Notes
    -----
    The surface element is ``surface_fraction * skin_depth`` and widths grow geometrically
    inwards, ``h_k = h_0 q**k``, with ``q`` chosen so the elements fill the depth exactly. If
    that needs ``q > max_growth`` the surface element is enlarged instead; if a uniform mesh is
    already finer than wanted, the mesh is uniform. Linear elements converge at second order,
    with power errors of roughly ``(h/delta)**2 / 12`` near the surface.

    Examples
    --------
    >>> mesh = radial_mesh("cylinder", 0.05, n=200, skin_depth=1e-3)
    >>> mesh.nodes.size, round(float(mesh.widths[-1]) / 1e-3, 3)
    (200, 0.04)
    """
    if geometry not in GEOMETRIES:
        raise ValueError(f"geometry must be one of {GEOMETRIES}; got {geometry!r}")
    outer_value = float(v.positive("outer", outer, "m"))
    if geometry == "tube":
        if inner is None:
            raise ValueError("inner must be given for a tube (bore radius) [m]; got None")
        inner_value = float(v.positive("inner", inner, "m"))
        v.less_than("inner", np.asarray(inner_value), "outer", np.asarray(outer_value))
    else:
        if inner is not None:
            raise ValueError(f"inner must be None for a {geometry}; got {inner!r}")
        inner_value = 0.0
    if isinstance(n, bool) or not isinstance(n, (int, np.integer)) or n < 3:
        raise ValueError(f"n must be an integer >= 3 (number of nodes); got {n!r}")
    fraction = float(v.positive("surface_fraction", surface_fraction, "-"))
    growth = float(v.real_array("max_growth", max_growth, "-"))
    if not growth > 1.0:
        raise ValueError(f"max_growth must be > 1 [-]; got {max_growth!r}")
    length = outer_value - inner_value
    n_el = int(n) - 1
    uniform = length / n_el
    if skin_depth is None:
        widths = np.full(n_el, uniform)
    else:
        delta = float(v.positive("skin_depth", skin_depth, "m"))
        first = fraction * delta
        if first >= uniform:
            widths = np.full(n_el, uniform)
        else:
            q = _growth_ratio(first, length, n_el)
            if q > growth:
                q = growth
                first = length * (q - 1.0) / np.expm1(n_el * np.log(q))
            widths = first * q ** np.arange(n_el)
    depth = np.concatenate(([0.0], np.cumsum(widths)))
    depth *= length / depth[-1]  # remove rounding in the sum so the last node is exact
    nodes = outer_value - depth[::-1]
    nodes[0] = inner_value
    nodes[-1] = outer_value
    return mesh_from_nodes(geometry, nodes)
