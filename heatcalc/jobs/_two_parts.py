"""Two parts of a joint heated together: two lumps, a joint conductance and long fins.

:func:`simulate_two_parts` integrates the temperatures of a fitting and a tube as two lumps
(one uniform temperature each) joined by the conductance of the clearance between them, with
surface losses and, optionally, conduction along each part away from the joint (a long fin,
either by one-dimensional finite volumes or as the quasi-steady infinite fin of
:func:`infinite_fin_heat_flow`).

All quantities SI, temperatures in kelvin.
"""

from __future__ import annotations

from dataclasses import dataclass, field

import numpy as np
import pandas as pd
from scipy.integrate import solve_ivp
from scipy.sparse import lil_matrix

from .. import thermal
from ..thermal import SurfaceLoss

__all__ = [
    "FIN_MODELS",
    "Fin",
    "Lump",
    "TwoPartResult",
    "simulate_two_parts",
    "infinite_fin_heat_flow",
]

#: Ways to treat conduction along a part beyond the joint.
FIN_MODELS = ("transient", "steady")


def infinite_fin_heat_flow(h, perimeter, conductivity, section, excess):
    """Heat flow into the base of a long fin (rod) with a convective side surface.

    Parameters
    ----------
    h : float or array [W/(m2 K)]
        Heat-transfer coefficient of the side surface (linearised radiation + convection).
    perimeter : float or array [m]
        Perimeter losing heat.
    conductivity : float or array [W/(m K)]
    section : float or array [m2]
        Conducting cross-section.
    excess : float or array [K]
        Base temperature minus the surroundings.

    Returns
    -------
    float or array [W]
        ``q = sqrt(h P k A) theta_b``.

    Notes
    -----
    Steady state, constant properties, a fin long enough that ``m L > 2.65`` (the tip
    carries < 1 % of the heat), ``m = sqrt(h P / (k A))``.

    References
    ----------
    F. P. Incropera, D. P. DeWitt, Fundamentals of Heat and Mass Transfer, 6th ed., Wiley,
    2007, Table 3.4 case D (infinite fin), eq. 3.84.

    Examples
    --------
    A copper rod 5 mm in diameter (k = 398 W/(m K)), h = 100 W/(m2 K), base 75 K above the
    air:

    >>> from math import pi
    >>> round(float(infinite_fin_heat_flow(100.0, pi * 5e-3, 398.0, pi * 5e-3**2 / 4, 75.0)), 2)
    8.31
    """
    return np.sqrt(h * perimeter * conductivity * section) * excess


@dataclass(frozen=True)
class Fin:
    """Conduction along a part beyond the joint, as a long rod of the part's section.

    Parameters
    ----------
    section : float [m2]
        Conducting cross-section.
    perimeter : float [m]
        Perimeter of the side surface that loses heat.
    loss : SurfaceLoss or None
        Loss conditions of the side surface (None: insulated side).
    """

    section: float
    perimeter: float
    loss: SurfaceLoss | None


@dataclass(frozen=True)
class Lump:
    """One part of the joint at a uniform temperature.

    Parameters
    ----------
    material : Material
    mass : float [kg]
    loss_area : float [m2]
        Surface losing heat to the surroundings (0: none).
    loss : SurfaceLoss or None
    fin : Fin or None
        Conduction along the part away from the joint (None: no such path).
    """

    material: object
    mass: float
    loss_area: float = 0.0
    loss: SurfaceLoss | None = None
    fin: Fin | None = None


@dataclass
class TwoPartResult:
    """Result of :func:`simulate_two_parts`.

    Attributes
    ----------
    series : pandas.DataFrame
        Indexed by ``time`` [s]; columns ``fitting``, ``tube`` [K], ``power_fitting``,
        ``power_tube``, ``joint_flow`` (fitting to tube), ``surface_loss`` (lump surfaces),
        ``conduction_fitting``, ``conduction_tube`` (into the fins at their base),
        ``losses`` (everything given to the surroundings) [W], and ``phase``
        (``"heat"`` or ``"cool"``).
    events : dict
        Time [s] of each event that occurred (``"both reach <T> K"``, ``"limit"``,
        ``"cooled"``).
    stop : str
        Why the heating phase ended: ``"target"``, ``"limit"`` or ``"duration"``.
    heat_end : float [s]
    energy_in, energy_lost, energy_stored : float [J]
        Over the whole run; the two integrals are states of the integration.
    fin_length : dict
        Length of each modelled fin [m].
    """

    series: pd.DataFrame
    events: dict = field(default_factory=dict)
    stop: str = "duration"
    heat_end: float = 0.0
    energy_in: float = 0.0
    energy_lost: float = 0.0
    energy_stored: float = 0.0
    fin_length: dict = field(default_factory=dict)

    @property
    def closure_error(self) -> float:
        """``(energy_in - energy_lost - energy_stored) / energy_in`` [-]."""
        return (self.energy_in - self.energy_lost - self.energy_stored) / self.energy_in


class _LossTable:
    """Loss flux of a SurfaceLoss on a 1 K grid, interpolated linearly (fast, vectorised).

    Linear interpolation of ``eps sigma T^4`` over 1 K errs by ``q'' dT^2 / 8``, below 1e-5
    of the flux at brazing temperatures.
    """

    def __init__(self, loss: SurfaceLoss | None, t_low: float, t_high: float):
        self.zero = loss is None
        if self.zero:
            return
        t_high = min(t_high, loss.t_max - 3.0)  # natural-convection table limit
        grid = np.arange(np.floor(t_low) - 2.0, np.ceil(t_high) + 3.0, 1.0)
        self.grid = grid
        self.q = np.array([loss.flux_and_slope(t)[0] for t in grid])
        self.t_air = loss.air_temperature

    def coefficient(self, t: float) -> float:
        """Secant coefficient ``q(T) / (T - T_air)`` [W/(m2 K)]; its limit (the slope of the
        flux) within 1 K of the air temperature."""
        excess = t - self.t_air
        if abs(excess) > 1.0:
            return float(np.interp(t, self.grid, self.q)) / excess
        return (
            float(
                np.interp(self.t_air + 1.0, self.grid, self.q)
                - np.interp(self.t_air - 1.0, self.grid, self.q)
            )
            / 2.0
        )

    def __call__(self, t):
        if self.zero:
            return np.zeros_like(np.asarray(t, dtype=float))
        # beyond the grid only solver trial states can go (the events stop the run first)
        return np.interp(t, self.grid, self.q)


def _fin_cells(first, growth, length):
    """Cell widths growing geometrically from the base until they fill `length`."""
    widths = [first]
    while sum(widths) < length:
        widths.append(widths[-1] * growth)
    w = np.array(widths)
    return w * (length / w.sum())


class _Part:
    """Numerical pieces of one lump and its fin."""

    def __init__(self, lump: Lump, t_low, t_high, fin_model, first, growth, fin_length):
        mat = lump.material
        self.lump = lump
        self.curve = thermal.enthalpy_curve(mat)
        self.h_knots, self.t_knots, _ = self.curve.inverse_table()
        k_tab = mat.tables["thermal_conductivity"]
        self.k_t, self.k_v = k_tab.temperature, k_tab.value
        self.surface = _LossTable(lump.loss, t_low, t_high)
        self.fin = lump.fin
        self.model = fin_model
        self.n_cells = 0
        self.length = 0.0
        if self.fin is not None:
            self.side = _LossTable(self.fin.loss, t_low, t_high)
            if fin_model == "transient":
                self.length = fin_length
                self.widths = _fin_cells(first, growth, fin_length)
                self.n_cells = self.widths.size
                rho0 = float(mat.density(thermal.REFERENCE_TEMPERATURE))
                self.cell_mass = rho0 * self.fin.section * self.widths
                self.gaps = np.concatenate(
                    [[0.5 * self.widths[0]], 0.5 * (self.widths[1:] + self.widths[:-1])]
                )

    def k(self, t):
        # np.interp holds the end values beyond the table: only trial states get there
        return np.interp(t, self.k_t, self.k_v)

    def temperature(self, h):
        # linear inverse on knots within 1e-4 K of the exact inverse (EnthalpyCurve docs)
        return np.interp(h, self.h_knots, self.t_knots)

    def flows(self, t_lump, t_cells):
        """Heat into the fin at its base [W], cell net inflow [W], side loss of the fin [W]."""
        fin = self.fin
        if fin is None:
            return 0.0, None, 0.0
        if self.model == "steady":
            if self.side.zero:
                return 0.0, None, 0.0
            excess = t_lump - self.side.t_air
            h = self.side.coefficient(t_lump)
            q = float(infinite_fin_heat_flow(h, fin.perimeter, self.k(t_lump), fin.section, excess))
            return q, None, q
        t_all = np.concatenate([[t_lump], t_cells])
        k_face = self.k(0.5 * (t_all[1:] + t_all[:-1]))
        flux = k_face * fin.section * (t_all[:-1] - t_all[1:]) / self.gaps  # into cell i
        side = self.side(t_cells) * fin.perimeter * self.widths
        net = flux.copy()
        net[:-1] -= flux[1:]
        net -= side
        return float(flux[0]), net, float(side.sum())


def simulate_two_parts(
    fitting: Lump,
    tube: Lump,
    conductance: float,
    power,
    duration: float,
    *,
    t_initial: float = 293.15,
    fin_initial: float | None = None,
    stop_at: float | None = None,
    marks=(),
    limits=(np.inf, np.inf),
    cool_until: float | None = None,
    cool_duration: float = 0.0,
    fin_model: str = "transient",
    fin_first_cell: float = 5e-4,
    fin_growth: float = 1.15,
    fin_length: float = 0.5,
    n_output: int = 201,
    rtol: float = 1e-6,
) -> TwoPartResult:
    """Heat a fitting and a tube as two lumps joined by a conductance.

    Parameters
    ----------
    fitting, tube : Lump
    conductance : float [W/K]
        ``G`` between the two lumps (interface conductance times overlap area), >= 0.
    power : callable
        ``power(t_fitting, t_tube) -> (P_fitting, P_tube)`` [W] during heating.
    duration : float [s]
        Longest heating time.
    t_initial : float [K]
        Initial temperature of both lumps.
    fin_initial : float [K], optional
        Initial temperature of the fins (default `t_initial`).
    stop_at : float [K], optional
        End the heating when both lumps have reached it.
    marks : sequence of float [K]
        Temperatures whose arrival at both lumps is recorded (``"both reach <T> K"``).
    limits : (float, float) [K]
        Heating ends (stop ``"limit"``) when the fitting or the tube reaches its limit.
    cool_until : float [K], optional
        After heating, continue with no power until both lumps are below this temperature
        (or `cool_duration` has passed).
    cool_duration : float [s]
        Longest cooling phase (0: none).
    fin_model : {"transient", "steady"}
        ``"transient"``: conduction along each fin by finite volumes (cells growing
        geometrically from `fin_first_cell` by `fin_growth` over `fin_length`, far end
        insulated); ``"steady"``: the quasi-steady infinite fin of
        :func:`infinite_fin_heat_flow` with the secant loss coefficient at the base.
    n_output : int
        Output times per phase, evenly spaced (event times added).
    rtol : float
        Relative tolerance of the integrator.

    Returns
    -------
    TwoPartResult

    Raises
    ------
    ValueError
        For an unknown fin model, a negative conductance, a duration or mass that is not
        positive.

    Notes
    -----
    Specific enthalpies are the states, so the stored energy is exactly ``sum m dh``:

    ``m_f dh_f/dt = P_f - G (T_f - T_t) - A_f q_f(T_f) - Q_fin,f``,
    ``m_t dh_t/dt = P_t + G (T_f - T_t) - A_t q_t(T_t) - Q_fin,t``,

    and, per fin cell ``i`` of width ``w_i``, ``m_i dh_i/dt = F_{i-1,i} - F_{i,i+1} - q(T_i)
    P w_i`` with ``F = k A dT/dx`` between neighbours (the lump is the first neighbour). The
    system is stiff (thin cells, large conductance), so it is integrated with the implicit
    BDF method of ``scipy.integrate.solve_ivp`` with the Jacobian's sparsity given.
    Long-time limit of a transient fin with constant properties: the infinite fin
    ``sqrt(h P k A) theta_b``; short-time limit: the semi-infinite solid
    ``k A theta_b / sqrt(pi alpha t)`` (Incropera & DeWitt 2007, eq. 5.58).

    References
    ----------
    F. P. Incropera, D. P. DeWitt, Fundamentals of Heat and Mass Transfer, 6th ed., Wiley,
    2007, sec. 3.6 (fins) and 5.3 (lumped capacitance).
    """
    if fin_model not in FIN_MODELS:
        raise ValueError(f"fin_model={fin_model!r} must be one of {FIN_MODELS}")
    if not conductance >= 0:
        raise ValueError(f"conductance={conductance!r} must be >= 0 [W/K]")
    if not duration > 0:
        raise ValueError(f"duration={duration!r} must be > 0 [s]")
    for name, lump in (("fitting", fitting), ("tube", tube)):
        if not lump.mass > 0:
            raise ValueError(f"{name}.mass={lump.mass!r} must be > 0 [kg]")
    t_fin0 = t_initial if fin_initial is None else fin_initial
    t_low = min(t_initial, t_fin0)
    for lump in (fitting, tube):
        for loss in (lump.loss, lump.fin.loss if lump.fin else None):
            if loss is not None:
                t_low = min(t_low, loss.t_surroundings, loss.air_temperature)
    t_high = max(
        t_initial,
        t_fin0,
        *(p.material.temperature_range()[1] for p in (fitting, tube)),
    )
    parts = [
        _Part(p, t_low, t_high, fin_model, fin_first_cell, fin_growth, fin_length)
        for p in (fitting, tube)
    ]
    pf, pt = parts
    i_f = 2
    i_t = 2 + pf.n_cells
    n_heat = 2 + pf.n_cells + pt.n_cells
    n = n_heat + 2  # the last two states integrate the energy in and the energy lost
    lim_f, lim_t = limits

    def split(y):
        return y[0], y[1], y[i_f : i_f + pf.n_cells], y[i_t : i_t + pt.n_cells]

    def components(y, heating):
        hf, ht, hcf, hct = split(y)
        tf, tt = float(pf.temperature(hf)), float(pt.temperature(ht))
        p_f, p_t = power(tf, tt) if heating else (0.0, 0.0)
        joint = conductance * (tf - tt)
        s_f = float(pf.surface(tf)) * fitting.loss_area
        s_t = float(pt.surface(tt)) * tube.loss_area
        tcf = pf.temperature(hcf) if pf.n_cells else None
        tct = pt.temperature(hct) if pt.n_cells else None
        base_f, net_f, side_f = pf.flows(tf, tcf)
        base_t, net_t, side_t = pt.flows(tt, tct)
        return {
            "tf": tf,
            "tt": tt,
            "p_f": p_f,
            "p_t": p_t,
            "joint": joint,
            "surface": s_f + s_t,
            "s_f": s_f,
            "s_t": s_t,
            "base_f": base_f,
            "base_t": base_t,
            "net_f": net_f,
            "net_t": net_t,
            "side": side_f + side_t,
        }

    def rhs_factory(heating):
        def rhs(_time, y):
            c = components(y, heating)
            dy = np.empty(n)
            dy[0] = (c["p_f"] - c["joint"] - c["s_f"] - c["base_f"]) / fitting.mass
            dy[1] = (c["p_t"] + c["joint"] - c["s_t"] - c["base_t"]) / tube.mass
            if pf.n_cells:
                dy[i_f : i_f + pf.n_cells] = c["net_f"] / pf.cell_mass
            if pt.n_cells:
                dy[i_t : i_t + pt.n_cells] = c["net_t"] / pt.cell_mass
            dy[n_heat] = c["p_f"] + c["p_t"]
            dy[n_heat + 1] = c["surface"] + c["side"]
            return dy

        return rhs

    # The energy states feed nothing back; leaving their rows out of the Jacobian keeps the
    # column grouping of the finite-difference Jacobian small (Newton still converges: their
    # equations are explicit in the other states).
    sparsity = lil_matrix((n, n))
    sparsity[0:2, 0:2] = 1
    for start, m_cells, lump_index in ((i_f, pf.n_cells, 0), (i_t, pt.n_cells, 1)):
        if not m_cells:
            continue
        sparsity[lump_index, start] = 1
        sparsity[start, lump_index] = 1
        for j in range(m_cells):
            row = start + j
            sparsity[row, row] = 1
            if j > 0:
                sparsity[row, row - 1] = 1
            if j < m_cells - 1:
                sparsity[row, row + 1] = 1
    sparsity = sparsity.tocsr()

    def t_pair(y):
        return float(pf.temperature(y[0])), float(pt.temperature(y[1]))

    heat_events, names = [], []
    for name, target in [(f"both reach {x:g} K", x) for x in marks] + (
        [("target", stop_at)] if stop_at is not None else []
    ):

        def ev(_time, y, target=target):
            return min(t_pair(y)) - target

        ev.direction = 1.0
        ev.terminal = name == "target"
        heat_events.append(ev)
        names.append(name)

    def limit(_time, y):
        tf, tt = t_pair(y)
        return max(tf - lim_f, tt - lim_t)

    limit.direction = 1.0
    limit.terminal = True
    heat_events.append(limit)
    names.append("limit")

    y0 = np.zeros(n)
    y0[0] = pf.curve.enthalpy(t_initial)
    y0[1] = pt.curve.enthalpy(t_initial)
    if pf.n_cells:
        y0[i_f : i_f + pf.n_cells] = pf.curve.enthalpy(t_fin0)
    if pt.n_cells:
        y0[i_t : i_t + pt.n_cells] = pt.curve.enthalpy(t_fin0)
    options = dict(method="BDF", rtol=rtol, atol=1e-2, jac_sparsity=sparsity, dense_output=True)
    sol = solve_ivp(rhs_factory(True), (0.0, duration), y0, events=heat_events, **options)
    if sol.status < 0:  # pragma: no cover - BDF does not fail on this smooth problem
        raise RuntimeError(f"simulate_two_parts: integration failed: {sol.message}")
    events = {}
    for name, times in zip(names, sol.t_events, strict=True):
        if times.size:
            events[name] = float(times[0])
    stop = "duration"
    if "limit" in events:
        stop = "limit"
    elif "target" in events:
        stop = "target"
    heat_end = float(sol.t[-1])
    phases = [(sol, 0.0, heat_end, True)]
    if cool_duration > 0 and cool_until is not None:

        def cooled(_time, y):
            return max(t_pair(y)) - cool_until

        cooled.direction = -1.0
        cooled.terminal = True
        sol2 = solve_ivp(
            rhs_factory(False),
            (heat_end, heat_end + cool_duration),
            sol.y[:, -1],
            events=[cooled],
            **options,
        )
        if sol2.t_events[0].size:
            events["cooled"] = float(sol2.t_events[0][0])
        phases.append((sol2, heat_end, float(sol2.t[-1]), False))

    frames = []
    for s, a, b, heating in phases:
        extra = [t for t in events.values() if a < t < b]
        times = np.union1d(np.linspace(a, b, n_output), extra)
        if not heating:
            times = times[1:]  # the heating phase holds the switch-off instant
        ys = s.sol(times)
        rows = [components(ys[:, j], heating) for j in range(times.size)]
        frames.append(
            pd.DataFrame(
                {
                    "fitting": [r["tf"] for r in rows],
                    "tube": [r["tt"] for r in rows],
                    "power_fitting": [r["p_f"] for r in rows],
                    "power_tube": [r["p_t"] for r in rows],
                    "joint_flow": [r["joint"] for r in rows],
                    "surface_loss": [r["surface"] for r in rows],
                    "conduction_fitting": [r["base_f"] for r in rows],
                    "conduction_tube": [r["base_t"] for r in rows],
                    "losses": [r["surface"] + r["side"] for r in rows],
                    "phase": "heat" if heating else "cool",
                },
                index=pd.Index(times, name="time"),
            )
        )
    series = pd.concat(frames)
    result = TwoPartResult(series, events, stop, heat_end)
    result.fin_length = {name: p.length for name, p in (("fitting", pf), ("tube", pt)) if p.n_cells}
    y_end = phases[-1][0].y[:, -1]
    stored = fitting.mass * (y_end[0] - y0[0]) + tube.mass * (y_end[1] - y0[1])
    for p, start in ((pf, i_f), (pt, i_t)):
        if p.n_cells:
            sl = slice(start, start + p.n_cells)
            stored += float(np.dot(p.cell_mass, y_end[sl] - y0[sl]))
    result.energy_in = float(y_end[n_heat])
    result.energy_lost = float(y_end[n_heat + 1])
    result.energy_stored = float(stored)
    return result
