"""Radial transient heating of a workpiece by induced currents, along a power schedule.

Couples :class:`~heatcalc.thermal.conduction.RadialConduction` (implicit enthalpy conduction)
with :class:`~heatcalc.thermal.induction_source.InductionSource` (the radial field solution
of :mod:`heatcalc.em`, re-evaluated as resistivity and permeability change with temperature).
Within a step the heat source is the one of the temperature profile at the start of the step
(first order in time, like the conduction scheme); the energy bookkeeping uses exactly the
power applied, so the balance ``in = stored + lost`` closes to the Newton tolerance.
"""

from __future__ import annotations

import math
import warnings

import numpy as np
import pandas as pd

from heatcalc.em import RadialMesh, radial_mesh, skin_depth

from .. import _checks as chk
from .conduction import GEOMETRIES, NewtonFailure, RadialConduction, conduction_grid
from .induction_source import InductionSource
from .schedule import Segment
from .transient_result import TransientResult

__all__ = ["simulate_heating"]

_MAX_HALVINGS = 8


def _grading_skin_depth(mat, schedule, t0: np.ndarray) -> float | None:
    """Smallest skin depth of the schedule at the initial state, small-field mu_r."""
    freqs = [s.frequency for s in schedule if s.induction]
    if not freqs:
        return None
    rho = float(np.min(mat.resistivity(t0)))
    mu = float(np.max(mat.relative_permeability(np.zeros_like(t0), t0)))
    return float(skin_depth(rho, max(freqs), mu))


def _advance(cond, h, dt, source, q_in, loss, guess=None, depth=0):
    """One step, halved recursively if Newton fails; returns h, T, lost energy, iterations."""
    try:
        h1, t1, q, its = cond.step(h, dt, source, q_in, loss, guess)
        return h1, t1, q * dt, its
    except NewtonFailure:
        if depth >= _MAX_HALVINGS:
            raise
        ha, _, ea, ia = _advance(cond, h, 0.5 * dt, source, q_in, loss, None, depth + 1)
        hb, tb, eb, ib = _advance(cond, ha, 0.5 * dt, source, q_in, loss, None, depth + 1)
        return hb, tb, ea + eb, ia + ib


def _step_times(start: float, seg: Segment, time_step, steps, profile_times) -> np.ndarray:
    end = start + seg.duration
    n = steps if time_step is None else max(1, math.ceil(seg.duration / time_step - 1e-9))
    times = np.linspace(start, end, n + 1)[1:]
    extra = np.array([t for t in profile_times if start < t < end])
    if extra.size == 0:
        return times
    # Drop regular times that would leave a sliver of a step next to a profile time.
    close = np.min(np.abs(times[:, None] - extra[None, :]), axis=1) < 1e-6 * seg.duration
    return np.union1d(times[~close | (times == end)], extra)


def simulate_heating(
    material,
    geometry: str,
    outer: float,
    schedule,
    *,
    inner: float | None = None,
    t_initial=293.15,
    n_nodes: int = 100,
    mesh: RadialMesh | None = None,
    time_step: float | None = None,
    steps_per_segment: int = 200,
    profile_times=(),
    field_update: float = 5.0,
    field_tolerance: float = 1e-2,
    tolerance: float = 1e-4,
) -> TransientResult:
    """Transient radial heating of a long cylinder, tube or slab along a power schedule.

    Parameters
    ----------
    material : str or Material
        Library key or :class:`~heatcalc.materials.Material` (``Material.constant`` works for
        textbook checks; induction segments need a resistivity table).
    geometry : {"cylinder", "tube", "slab"}
        Solid cylinder, tube (heated outside, adiabatic bore) or slab heated equally on both
        faces.
    outer : float [m]
        Outer radius, or half the thickness of the slab.
    schedule : sequence of Segment
        Run in order (see :mod:`heatcalc.thermal.schedule`).
    inner : float [m], optional
        Bore radius, for ``"tube"`` only.
    t_initial : float or array [K]
        Uniform initial temperature, or one value per node.
    n_nodes : int
        Number of radial nodes (when `mesh` is not given). The mesh is graded towards the
        surface for the smallest skin depth of the schedule at the initial state (highest
        frequency, small-field permeability), uniform without induction.
    mesh : RadialMesh, optional
        A mesh from :func:`heatcalc.em.radial_mesh` to use instead.
    time_step : float [s], optional
        Largest step; default: `steps_per_segment` equal steps per segment.
    steps_per_segment : int
        Steps per segment when `time_step` is None.
    profile_times : sequence of float [s]
        Times at which the radial profile is stored (the steps are cut to land on them).
    field_update : float [K]
        Element temperature change that triggers a new field solution (> 0).
    field_tolerance : float [-]
        Relative convergence of the permeability and absorbed power per field solution (> 0).
    tolerance : float [K]
        Newton tolerance of the conduction step (enthalpy change / smallest heat capacity).

    Returns
    -------
    TransientResult

    Raises
    ------
    ValueError
        For invalid arguments, or when a temperature leaves the material's tables.

    Notes
    -----
    See :mod:`heatcalc.thermal.conduction` for the equations. Checked against Carslaw and
    Jaeger's constant-flux solutions for the cylinder and slab, and the one-term series for a
    cylinder cooling by convection (``tests/verification/test_thermal_analytic.py``).

    References
    ----------
    H. S. Carslaw, J. C. Jaeger, Conduction of Heat in Solids, 2nd ed., Oxford, 1959,
    sections 3.3 and 7.7.
    V. R. Voller, C. R. Swaminathan, B. G. Thomas, "Fixed grid techniques for phase change
    problems: a review", Int. J. Numer. Meth. Eng. 30 (1990) 875-898.

    Examples
    --------
    Constant surface flux into a steel-like cylinder: the mean rises by 2 q t/(rho c R).

    >>> from heatcalc.materials import Material
    >>> from heatcalc.thermal import Segment
    >>> m = Material.constant(thermal_conductivity=30.0, specific_heat=600.0, density=7800.0)
    >>> r = simulate_heating(m, "cylinder", 0.05, [Segment(60.0, "power", 1e5)], n_nodes=41)
    >>> round(float(r.series["mean"].iloc[-1]) - 293.15, 2)  # 2*1e5*60/(7800*600*0.05)
    51.28
    """
    mat = chk.material(material)
    chk.choice("geometry", geometry, GEOMETRIES)
    segments = list(schedule) if not isinstance(schedule, Segment) else [schedule]
    if not segments or not all(isinstance(s, Segment) for s in segments):
        raise ValueError(f"schedule must be a non-empty sequence of Segment; got {schedule!r}")
    if time_step is not None:
        time_step = float(chk.positive("time_step", time_step, "s"))
    if isinstance(steps_per_segment, bool) or not isinstance(steps_per_segment, int):
        raise ValueError(f"steps_per_segment must be an integer >= 1; got {steps_per_segment!r}")
    if steps_per_segment < 1:
        raise ValueError(f"steps_per_segment must be an integer >= 1; got {steps_per_segment!r}")
    t0 = chk.kelvin("t_initial", t_initial)
    if any(s.induction for s in segments) and "resistivity" not in mat.tables:
        raise ValueError(
            f"material {mat.key!r} has no resistivity table, needed for induction heating "
            "(give no frequency to apply the power as a surface flux)"
        )
    if mesh is None:
        delta = _grading_skin_depth(mat, segments, np.atleast_1d(t0))
        mesh = radial_mesh(geometry, outer, inner, n=n_nodes, skin_depth=delta)
    elif not isinstance(mesh, RadialMesh):
        raise ValueError(f"mesh must be a RadialMesh or None; got {type(mesh)!r}")
    elif (
        mesh.geometry != geometry
        or not np.isclose(mesh.outer, outer, rtol=1e-12)
        or (inner is not None and not np.isclose(mesh.inner, inner, rtol=1e-12))
    ):
        raise ValueError(
            f"mesh is a {mesh.geometry} of outer={mesh.outer!r} m, inner={mesh.inner!r} m; "
            f"expected geometry={geometry!r}, outer={outer!r}, inner={inner!r}"
        )
    grid = conduction_grid(mesh.geometry, mesh.nodes)
    cond = RadialConduction(grid, mat, tolerance=tolerance)
    if t0.ndim and t0.shape != grid.nodes.shape:
        raise ValueError(
            f"t_initial must be a scalar or one value per node ({grid.nodes.size}); "
            f"got shape {t0.shape}"
        )
    profile_times = sorted(float(x) for x in chk.non_negative("profile_times", profile_times, "s"))
    end = sum(s.duration for s in segments)
    late = [p for p in profile_times if p > end * (1.0 + 1e-12)]
    if late:
        raise ValueError(f"profile_times {late} lie beyond the end of the schedule ({end} s)")
    source = None
    if any(s.induction for s in segments):
        source = InductionSource(
            mat, mesh, field_update=field_update, field_tolerance=field_tolerance
        )

    h = cond.enthalpy(t0)
    h_start = h.copy()
    t = cond.temperature(h)
    mass = cond.mass
    total_mass = mass.sum()
    rows = [(0.0, t[-1], t[0], mass @ t / total_mass, 0.0, 0.0, np.nan, 0, "", 0.0, 0.0, 0.0)]
    profiles = {0.0: t.copy()} if profile_times and profile_times[0] == 0.0 else {}
    e_in = e_lost = 0.0
    iterations = 0
    now = 0.0
    for k, seg in enumerate(segments):
        h_prev = dt_prev = None  # no extrapolation across a change of segment
        for t_next in _step_times(now, seg, time_step, steps_per_segment, profile_times):
            dt = t_next - now
            s_nodes, q_in, hs = None, 0.0, np.nan
            if seg.induction:
                shape, power, hs = source.evaluate(t, seg)
                s_nodes = grid.node_source(shape)
            elif seg.mode == "power":
                q_in, power = float(seg.value), float(seg.value)
            else:
                power = 0.0
            # Newton starts from the linear extrapolation of the last step (same step size
            # ratio), which saves about one iteration per step on smooth stretches.
            guess = None if dt_prev is None else h + (h - h_prev) * (dt / dt_prev)
            h_prev, dt_prev = h, dt
            h, t, lost, its = _advance(cond, h, dt, s_nodes, q_in, seg.loss, guess)
            cond.check_range(t, when=f" at t = {t_next:.4g} s ({seg.label or f'segment {k}'})")
            iterations += its
            e_in += power * dt
            e_lost += lost
            stored = float(mass @ (h - h_start))
            rows.append(
                (
                    t_next,
                    t[-1],
                    t[0],
                    mass @ t / total_mass,
                    power,
                    lost / dt,
                    hs,
                    k,
                    seg.label,
                    e_in,
                    e_lost,
                    stored,
                )
            )
            if any(abs(t_next - p) <= 1e-9 * max(1.0, p) for p in profile_times):
                profiles[t_next] = t.copy()
            now = t_next
    columns = ["time", "surface", "centre", "mean", "power", "loss", "h_surface", "segment"]
    columns += ["label", "energy_in", "energy_lost", "energy_stored"]
    series = pd.DataFrame(rows, columns=columns).set_index("time")
    prof = pd.DataFrame(profiles, index=pd.Index(grid.nodes, name="position"))
    if source is not None and source.unconverged:
        warnings.warn(
            f"{source.unconverged} of {source.solves} field solutions stopped before the "
            "permeability iteration converged",
            RuntimeWarning,
            stacklevel=2,
        )
    return TransientResult(
        material=mat.key,
        geometry=geometry,
        nodes=grid.nodes,
        series=series,
        profiles=prof,
        energy_in=e_in,
        energy_lost=e_lost,
        energy_stored=float(mass @ (h - h_start)),
        field_solves=0 if source is None else source.solves,
        newton_iterations=iterations,
    )
