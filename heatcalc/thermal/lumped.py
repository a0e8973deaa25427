"""Lumped (uniform-temperature) heating of a thin or well-stirred charge.

The charge is one body of uniform temperature: ``m dh/dt = P(t) - Q_loss(T(h))``, written in
enthalpy so that the latent heat of melting gives a temperature plateau instead of an
infinite heat capacity. Valid when the Biot number ``h_eff L/k`` is small (thin parts) or the
melt is stirred (crucible melting).
"""

from __future__ import annotations

from dataclasses import dataclass, field

import numpy as np
import pandas as pd
from scipy.integrate import solve_ivp

from .. import _checks as chk
from .enthalpy import enthalpy_curve
from .surface_loss import SurfaceLoss

__all__ = ["LumpedResult", "lumped_heating"]


@dataclass(frozen=True)
class LumpedResult:
    """Result of :func:`lumped_heating`.

    Attributes
    ----------
    series : pandas.DataFrame
        Indexed by ``time`` [s]: ``temperature`` [K], ``enthalpy`` [J/kg], ``power`` [W],
        ``loss`` [W].
    events : dict
        Time [s] of each event that occurred: ``"reach <T> K"`` per target, ``"melt start"``,
        ``"fully liquid"``.
    energy_in, energy_lost, energy_stored : float [J]
    """

    series: pd.DataFrame
    events: dict = field(default_factory=dict)
    energy_in: float = 0.0
    energy_lost: float = 0.0
    energy_stored: float = 0.0

    @property
    def closure_error(self) -> float:
        """``(energy_in - energy_lost - energy_stored) / energy_in`` [-]."""
        return (self.energy_in - self.energy_lost - self.energy_stored) / self.energy_in

    def time_to_reach(self, temperature: float) -> float:
        """Time [s] at which the charge first reaches `temperature` [K].

        Raises
        ------
        ValueError
            If the charge never reaches it within the computed time.
        """
        t = self.series["temperature"].to_numpy()
        idx = np.flatnonzero(t >= temperature)
        if idx.size == 0:
            raise ValueError(
                f"temperature={temperature!r} K is never reached (maximum {t.max():.2f} K)"
            )
        i = idx[0]
        time = self.series.index.to_numpy()
        if i == 0:
            return float(time[0])
        return float(np.interp(temperature, t[i - 1 : i + 1], time[i - 1 : i + 1]))


def lumped_heating(
    material,
    mass,
    power,
    duration,
    *,
    t_initial=293.15,
    area=0.0,
    loss: SurfaceLoss | None = None,
    targets=(),
    stop_at=None,
    n_output=401,
    rtol=1e-9,
):
    """Heat a uniform-temperature charge with a given power against surface losses.

    Parameters
    ----------
    material : str or Material
    mass : float [kg]
        > 0.
    power : float or callable [W]
        Power absorbed by the charge, constant or ``power(t) -> W``.
    duration : float [s]
        Time to integrate over, > 0.
    t_initial : float [K]
    area : float [m2]
        Surface area losing heat, >= 0.
    loss : SurfaceLoss, optional
        Loss conditions per unit area; no losses if None.
    targets : sequence of float [K]
        Temperatures whose first arrival is recorded in ``events``.
    stop_at : float [K], optional
        Stop the integration when this temperature is reached.
    n_output : int
        Number of output times, evenly spaced (events are added).
    rtol : float
        Relative tolerance of the integrator.

    Returns
    -------
    LumpedResult

    Raises
    ------
    ValueError
        For invalid arguments, or if the temperature leaves the material's tables.

    Notes
    -----
    Integrates ``dh/dt = (P(t) - A q(T(h)))/m`` for the specific enthalpy ``h`` with
    ``scipy.integrate.solve_ivp`` (RK45), ``T(h)`` from
    :func:`~heatcalc.thermal.temperature_from_enthalpy`; events are located on ``h``, which is
    smooth in time, so the plateau of a pure metal is resolved exactly. With constant
    properties and a linear loss ``q = h_c (T - T_inf)`` the exact solution is
    ``T = T_inf + (T0 - T_inf) e^(-t/tau) + P/(h_c A) (1 - e^(-t/tau))``,
    ``tau = m c/(h_c A)``; on a melting plateau at ``T_m`` it lasts ``m L / (P - A q(T_m))``.

    References
    ----------
    F. P. Incropera, D. P. DeWitt, Fundamentals of Heat and Mass Transfer, 6th ed., Wiley,
    2007, section 5.3 (general lumped capacitance analysis).

    Examples
    --------
    >>> from heatcalc.materials import Material
    >>> m = Material.constant(specific_heat=500.0, t_min=250.0, t_max=2000.0)
    >>> r = lumped_heating(m, 10.0, 5000.0, 800.0, targets=[1000.0])
    >>> round(r.events["reach 1000 K"], 1)
    706.9
    """
    mat = chk.material(material)
    curve = enthalpy_curve(mat)
    m = float(chk.positive("mass", mass, "kg"))
    t_end = float(chk.positive("duration", duration, "s"))
    t0 = float(chk.kelvin("t_initial", t_initial))
    a = float(chk.non_negative("area", area, "m2"))
    if loss is not None and not isinstance(loss, SurfaceLoss):
        raise ValueError(f"loss must be a SurfaceLoss or None; got {loss!r}")
    if callable(power):
        power_of_t = power
    else:
        p = float(chk.real("power", power, "W"))
        power_of_t = lambda t: p  # noqa: E731
    targets = [float(x) for x in chk.kelvin("targets", np.atleast_1d(np.asarray(targets, float)))]
    if isinstance(n_output, bool) or not isinstance(n_output, (int, np.integer)) or n_output < 2:
        raise ValueError(f"n_output must be an integer >= 2; got {n_output!r}")
    h_start = float(curve.enthalpy(t0))

    def loss_w(t):
        if loss is None or a == 0.0:
            return 0.0
        return loss.flux_and_slope(t)[0] * a

    def rhs(time, y):
        t = float(curve.temperature_unchecked(y)[0][0])
        return [(power_of_t(time) - loss_w(t)) / m]

    marks = {f"reach {x:g} K": float(curve.enthalpy(x)) for x in targets}
    if mat.solidus is not None and mat.latent_heat and curve.t_max > mat.solidus:
        marks["melt start"] = float(curve.enthalpy(mat.solidus))  # solid value at solidus
        if curve.t_max > mat.liquidus:
            step = mat.latent_heat if mat.liquidus == mat.solidus else 0.0
            marks["fully liquid"] = float(curve.enthalpy(mat.liquidus)) + step
    stop_name = None
    if stop_at is not None:
        stop = float(chk.kelvin("stop_at", stop_at))
        stop_name = f"reach {stop:g} K"
        marks.setdefault(stop_name, float(curve.enthalpy(stop)))
    events, names = [], []
    for name, mark in marks.items():

        def event(time, y, mark=mark):
            return y[0] - mark

        event.direction = 1.0
        event.terminal = name == stop_name
        events.append(event)
        names.append(name)
    # The integrator may probe beyond the table; the trajectory itself is checked below.
    sol = solve_ivp(
        rhs,
        (0.0, t_end),
        [h_start],
        method="RK45",
        rtol=rtol,
        atol=1e-6,
        events=events,
        dense_output=True,
        max_step=t_end / 50.0,
    )
    if sol.status < 0:  # pragma: no cover - RK45 does not fail on this smooth problem
        raise RuntimeError(f"lumped_heating: integration failed: {sol.message}")
    found = {}
    for name, times in zip(names, sol.t_events, strict=True):
        if times.size:
            found[name] = float(times[0])
    t_last = float(sol.t[-1])
    times = np.union1d(np.linspace(0.0, t_last, int(n_output)), list(found.values()))
    h = sol.sol(times)[0]
    temp = curve.temperature(h)  # raises if the trajectory leaves the table
    pw = np.array([power_of_t(x) for x in times], dtype=float)
    lw = np.array([loss_w(x) for x in np.atleast_1d(temp)])
    series = pd.DataFrame(
        {"temperature": temp, "enthalpy": h, "power": pw, "loss": lw},
        index=pd.Index(times, name="time"),
    )
    # Energy integrals with the dense output: in = int P dt, lost = int Q dt (Gauss-Legendre
    # on each output interval, exact enough for smooth integrands at this spacing).
    xg, wg = np.polynomial.legendre.leggauss(5)
    mid, half = 0.5 * (times[1:] + times[:-1]), 0.5 * np.diff(times)
    tq = (mid[:, None] + half[:, None] * xg[None, :]).ravel()
    wq = (half[:, None] * wg[None, :]).ravel()
    hq = sol.sol(tq)[0]
    tq_temp = curve.temperature_unchecked(hq)[0]
    e_in = float(np.dot(wq, [power_of_t(x) for x in tq]))
    e_lost = float(np.dot(wq, [loss_w(x) for x in tq_temp]))
    e_stored = m * (float(h[-1]) - h_start)
    return LumpedResult(series, found, e_in, e_lost, e_stored)
