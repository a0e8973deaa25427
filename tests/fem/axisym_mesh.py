"""Structured, graded tensor meshes for the axisymmetric FEM model (test tool).

Points along r and z are graded so that the cell size grows linearly (about geometrically
per cell) away from anchors such as the workpiece surface, where the size is a fraction of
the skin depth; every breakpoint (material edge, turn edge) is a mesh line.
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

__all__ = ["MeshSettings", "axis_points", "graded_points", "halve"]


@dataclass(frozen=True)
class MeshSettings:
    """Mesh grading: cell size ``skin_depth/skin_cells`` at the workpiece surface, sizes growing
    by about ``growth`` per cell away from the features, ``near_cells`` cells across the coil
    radius in the near field, a far box ``far_factor`` times the coil size; ``refine`` divides
    every size (a uniform refinement of the same mesh family); ``halvings`` then splits every
    cell in two in r and z that many times (nested meshes, for convergence orders); ``order``
    of the Lagrange triangles, 1 or 2."""

    skin_cells: float = 4.0
    growth: float = 1.2
    near_cells: float = 12.0
    far_factor: float = 50.0
    refine: float = 1.0
    order: int = 2
    halvings: int = 0


def halve(points, times):
    """Insert the midpoint of every cell ``times`` times (nested refinement, h -> h / 2**times)."""
    for _ in range(times):
        points = np.sort(np.concatenate([points, 0.5 * (points[1:] + points[:-1])]))
    return points


def graded_points(start, stop, anchors, growth, cap=None, cap_until=None):
    """Points from start to stop [m] with a cell size growing linearly away from anchors.

    The target size is ``min_k(h_k + (growth - 1) |x - x_k|)`` over ``anchors = [(x_k, h_k)]``,
    further capped at ``cap`` for ``x <= cap_until``. The last cell is spread over the others.

    Examples
    --------
    Cells of 1 mm at a surface at 10 mm, growing by about 1.5 per cell towards the axis:

    >>> pts = graded_points(0.0, 0.01, [(0.01, 0.001)], growth=1.5)
    >>> len(pts), bool(np.all(np.diff(np.diff(pts)) < 0))
    (5, True)
    """
    anchors = [(float(x), float(h)) for x, h in anchors]
    if cap is not None:
        anchors.append((cap_until, cap))

    def size(x):
        h = min(hk + (growth - 1.0) * abs(x - xk) for xk, hk in anchors)
        if cap is not None and x <= cap_until:
            h = min(h, cap)
        return h

    # cumulative cell count n(x) = int dx / h(x), integrated with sub-steps of h/8 (midpoint
    # rule), so that the size is right where it shrinks as well as where it grows
    xs, count = [start], [0.0]
    while xs[-1] < stop:
        step = min(size(xs[-1]) / 8.0, stop - xs[-1])
        count.append(count[-1] + step / size(xs[-1] + 0.5 * step))
        xs.append(xs[-1] + step if xs[-1] + step < stop else stop)
    n_cells = max(1, round(count[-1]))
    return np.interp(np.linspace(0.0, count[-1], n_cells + 1), count, xs)


def axis_points(breaks, anchors, growth, cap, cap_until):
    """Graded points through every breakpoint (each interval meshed on its own)."""
    breaks = _merge_close(np.asarray(breaks, dtype=float))
    pieces = [
        graded_points(a, b, anchors, growth, cap, cap_until)
        for a, b in zip(breaks, breaks[1:], strict=False)
    ]
    return _merge_close(np.concatenate(pieces))


def _merge_close(points):
    """Sorted points without near-duplicates (rounding of computed turn edges)."""
    points = np.sort(points)
    tol = 1e-9 * (points[-1] - points[0])
    keep = np.concatenate([[True], np.diff(points) > tol])
    return points[keep]
