"""Specific enthalpy of a material, latent heat of melting included, and its inverse.

The specific heat tables of :mod:`heatcalc.materials` are piecewise linear in temperature, so
their integral, the sensible enthalpy, is piecewise quadratic and is computed exactly (the
trapezoid rule on the table knots is exact for a piecewise-linear integrand). Latent heat is
added as a step at the melting point of a pure metal (solidus equal to liquidus) and released
linearly between solidus and liquidus for an alloy.
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

from .. import _checks as chk

__all__ = [
    "REFERENCE_TEMPERATURE",
    "EnthalpyCurve",
    "enthalpy_curve",
    "specific_enthalpy",
    "temperature_from_enthalpy",
]

#: Reference of all enthalpies in heatcalc: 20 degC [K].
REFERENCE_TEMPERATURE = 293.15


@dataclass(frozen=True, eq=False)
class EnthalpyCurve:
    """Specific enthalpy of one material as a piecewise-quadratic function of temperature.

    Build it with :func:`enthalpy_curve`. Each of the ``n`` segments ``[x0, x1]`` (all of
    non-zero length) has an effective heat capacity that is linear from ``c0`` to ``c1``
    (sensible heat plus, between solidus and liquidus of an alloy, ``L/(T_l - T_s)``) and
    starts at enthalpy ``h0``; a step of latent heat at a pure metal's melting point shows as
    ``h0[i+1] > h1[i]``.

    Attributes
    ----------
    key : str
        Material key (for messages).
    x0, x1, c0, c1, h0, h1 : numpy.ndarray
        Segment ends [K], effective heat capacity at the ends [J/(kg K)], enthalpy at the
        ends [J/kg], relative to `reference`.
    reference : float [K]
        Temperature of zero enthalpy.
    latent_heat : float [J/kg]
        Latent heat included (0 if the material has none or the table stops below solidus).
    solidus, liquidus : float or None [K]
    note : str
        Why the curve stops below the end of the table, if it does.
    """

    key: str
    x0: np.ndarray
    x1: np.ndarray
    c0: np.ndarray
    c1: np.ndarray
    h0: np.ndarray
    h1: np.ndarray
    reference: float
    latent_heat: float
    solidus: float | None
    liquidus: float | None
    note: str = ""

    @property
    def t_min(self) -> float:
        return float(self.x0[0])

    @property
    def t_max(self) -> float:
        return float(self.x1[-1])

    def _check_range(self, t: np.ndarray, name: str) -> None:
        lo, hi = self.t_min, self.t_max
        if t.size and (t.min() < lo - 1e-9 or t.max() > hi + 1e-9):
            worst = t.min() if t.min() < lo else t.max()
            raise ValueError(
                f"{name}={worst:.2f} K ({worst - 273.15:.1f} degC) is outside the specific-heat "
                f"table of {self.key!r}, which covers {lo:.2f} K to {hi:.2f} K{self.note}"
            )

    def enthalpy(self, temperature):
        """Specific enthalpy [J/kg] at `temperature` [K]; at a step, the solid value."""
        t = chk.real("temperature", temperature, "K")
        self._check_range(t, "temperature")
        return chk.float_or_array(self.enthalpy_unchecked(t))

    def enthalpy_unchecked(self, t: np.ndarray) -> np.ndarray:
        """:meth:`enthalpy` without checks, for solvers' trial states.

        Outside the table the end heat capacity is held constant (the caller must check the
        final state with :meth:`enthalpy`).
        """
        t = np.asarray(t, dtype=float)
        # Evaluate at the nearest table end, then extend linearly with the end heat capacity
        # (trial states only; final states are checked by the caller).
        tc = np.clip(t, self.x0[0], self.x1[-1])
        i = np.clip(np.searchsorted(self.x0, tc, side="left") - 1, 0, self.x0.size - 1)
        d = tc - self.x0[i]
        slope = (self.c1[i] - self.c0[i]) / (self.x1[i] - self.x0[i])
        h = self.h0[i] + self.c0[i] * d + 0.5 * slope * d * d
        return h + np.where(t < tc, self.c0[0], self.c1[-1]) * (t - tc)

    def heat_capacity(self, temperature):
        """Effective heat capacity dh/dT [J/(kg K)], latent heat of an alloy's range included.

        The step of a pure metal is not included (it has no finite derivative).
        """
        t = chk.real("temperature", temperature, "K")
        self._check_range(t, "temperature")
        i = np.clip(np.searchsorted(self.x0, t, side="left") - 1, 0, self.x0.size - 1)
        w = (t - self.x0[i]) / (self.x1[i] - self.x0[i])
        return chk.float_or_array(self.c0[i] + (self.c1[i] - self.c0[i]) * w)

    def temperature(self, enthalpy):
        """Temperature [K] at specific enthalpy `enthalpy` [J/kg] (inverse of :meth:`enthalpy`).

        On the step of a pure metal (solid and liquid coexisting) the melting point is returned.
        """
        h = chk.real("enthalpy", enthalpy, "J/kg")
        lo, hi = self.h0[0], self.h1[-1]
        if h.size and (h.min() < lo - 1e-9 * abs(lo) - 1e-12 or h.max() > hi + 1e-9 * abs(hi)):
            worst = h.min() if h.min() < lo else h.max()
            raise ValueError(
                f"enthalpy={worst:.6g} J/kg is outside the range of {self.key!r}, "
                f"{lo:.6g} to {hi:.6g} J/kg ({self.t_min:.2f} K to {self.t_max:.2f} K)"
            )
        return chk.float_or_array(self.temperature_unchecked(h)[0])

    def __post_init__(self):
        # Per-segment constants of the inverse, computed once (the solvers call it often).
        n = self.x0.size
        inv_after = np.zeros(n)
        inv_after[-1] = 1.0 / self.c1[-1]  # beyond the table: constant heat capacity
        object.__setattr__(self, "_slope", (self.c1 - self.c0) / (self.x1 - self.x0))
        object.__setattr__(self, "_span", self.h1 - self.h0)
        object.__setattr__(self, "_inv_after", inv_after)

    def temperature_unchecked(self, h: np.ndarray):
        """Temperature [K] and dT/dh [K kg/J] at `h`, without checks, for solvers.

        dT/dh is 0 on the step of a pure metal. Outside the table the end heat capacity is
        held constant (the caller must check the final state).
        """
        h = np.asarray(h, dtype=float)
        i = np.maximum(np.searchsorted(self.h0, h, side="right") - 1, 0)
        r = h - self.h0[i]
        rc = np.minimum(r, self._span[i])  # enthalpy taken up inside the segment
        c0 = self.c0[i]
        # c0 d + slope d^2 / 2 = rc, in the form that is stable for slope -> 0; below the
        # table (rc < 0, first segment only) this is linear with the end heat capacity.
        disc = np.sqrt(c0 * c0 + 2.0 * self._slope[i] * np.maximum(rc, 0.0))
        excess = r - rc  # > 0 on a melting step, or beyond the end of the table
        after = self._inv_after[i]
        t = self.x0[i] + 2.0 * rc / (c0 + disc) + excess * after
        dtdh = np.where(excess > 0.0, after, 1.0 / disc)
        return t, dtdh

    def inverse_table(self, max_error: float = 1e-4):
        """Knots for a fast linear-interpolation inverse ``T(h)`` (for time-stepping solvers).

        Parameters
        ----------
        max_error : float [K]
            Bound on the error of ``numpy.interp(h, H, T)`` against :meth:`temperature`.

        Returns
        -------
        H, T, D : ndarray
            Enthalpy knots [J/kg] (non-decreasing; a value repeats at the ends of a melting
            step), temperatures [K] and dT/dh [K kg/J] at the knots (0 along a melting step).
            Two far knots continue the end segments linearly with the end heat capacity, so
            interpolation never clamps silently inside +-1e7 J/kg of the table.

        Notes
        -----
        Between knots the inverse of a quadratic is interpolated linearly; with
        ``T'' = -c'/c**3`` the error is at most ``dh**2 |c'| / (8 c_min**3)``, and each segment
        is cut into enough pieces to keep that below `max_error`.
        """
        hs, ts, ds = [], [], []
        for i in range(self.x0.size):
            c0, c1, s = self.c0[i], self.c1[i], self._slope[i]
            width = self._span[i]
            bound = abs(s) / (8.0 * min(c0, c1) ** 3)
            pieces = max(1, int(np.ceil(width * np.sqrt(bound / max_error))))
            d = np.linspace(0.0, self.x1[i] - self.x0[i], 2 * pieces + 1)
            # nodes uniform in T are not uniform in h; refine in T twice as densely
            h = self.h0[i] + c0 * d + 0.5 * s * d * d
            hs.append(h)
            ts.append(self.x0[i] + d)
            ds.append(1.0 / (c0 + s * d))
            if i < self.x0.size - 1 and self.h0[i + 1] > self.h1[i]:  # melting step
                hs.append(np.array([self.h1[i], self.h0[i + 1]]))
                ts.append(np.array([self.x1[i], self.x1[i]]))
                ds.append(np.array([0.0, 0.0]))
        far = 1e7
        H = np.concatenate([[self.h0[0] - far], *hs, [self.h1[-1] + far]])
        T = np.concatenate(
            [[self.x0[0] - far / self.c0[0]], *ts, [self.x1[-1] + far / self.c1[-1]]]
        )
        D = np.concatenate([[1.0 / self.c0[0]], *ds, [1.0 / self.c1[-1]]])
        return H, T, D


def _segments(material):
    """Segment arrays of the effective heat capacity of `material`."""
    try:
        table = material.tables["specific_heat"]
    except KeyError:
        raise ValueError(f"material {material.key!r} has no specific_heat table") from None
    x = table.temperature
    if x.size < 2:
        raise ValueError(f"material {material.key!r}: specific_heat table needs two points")
    ts, tl, latent = material.solidus, material.liquidus, material.latent_heat or 0.0
    knots = [x]
    if ts is not None and x[0] < ts < x[-1]:
        knots.append([ts])
    if tl is not None and x[0] < tl < x[-1]:
        knots.append([tl])
    u = np.unique(np.concatenate(knots))
    x0, x1 = u[:-1], u[1:]
    # The table is linear on each segment of the union of knots. Its left-limit value at x1
    # is what the table returns at x1 (before a jump); the right-limit value at x0 follows
    # from the midpoint, exactly, because the segment is linear.
    c1 = table(x1)
    c0 = 2.0 * table(0.5 * (x0 + x1)) - c1
    jump = np.zeros_like(x0)  # latent step at the start of a segment
    if ts is not None and latent > 0:
        if tl > ts:
            inside = (x0 >= ts) & (x1 <= tl)
            c0 = c0 + np.where(inside, latent / (tl - ts), 0.0)
            c1 = c1 + np.where(inside, latent / (tl - ts), 0.0)
        else:
            jump = np.where(x0 == ts, latent, 0.0)
    return x0, x1, c0, c1, jump


_CACHE: dict[int, tuple[object, EnthalpyCurve]] = {}


def enthalpy_curve(material, reference: float = REFERENCE_TEMPERATURE) -> EnthalpyCurve:
    """Build the :class:`EnthalpyCurve` of a material.

    Parameters
    ----------
    material : str or Material
        Library key or :class:`~heatcalc.materials.Material` with a specific_heat table.
    reference : float [K]
        Temperature of zero enthalpy, inside the specific-heat table (default 293.15 K).

    Returns
    -------
    EnthalpyCurve

    Raises
    ------
    ValueError
        If the material has no specific-heat table, the reference lies outside it, or the
        effective heat capacity is not positive.
    """
    mat = chk.material(material)
    ref = float(chk.kelvin("reference", reference))
    hit = _CACHE.get(id(mat))
    if hit is not None and hit[0] is mat and hit[1].reference == ref:
        return hit[1]
    x0, x1, c0, c1, jump = _segments(mat)
    note = ""
    if mat.solidus is not None and mat.latent_heat is None and x1[-1] > mat.solidus:
        # Without a latent heat the enthalpy above the solidus is unknown: stop there.
        keep = x1 <= mat.solidus
        x0, x1, c0, c1, jump = x0[keep], x1[keep], c0[keep], c1[keep], jump[keep]
        note = f" (cut at the solidus, {mat.solidus:.2f} K: the material has no latent_heat)"
    if np.any(c0 <= 0) or np.any(c1 <= 0):
        raise ValueError(f"material {mat.key!r}: specific_heat must be > 0 everywhere")
    inc = 0.5 * (c0 + c1) * (x1 - x0)  # exact integral of a linear function
    h0 = np.concatenate([[0.0], np.cumsum(inc)[:-1]]) + np.cumsum(jump)
    h1 = h0 + inc
    if not (x0[0] - 1e-9 <= ref <= x1[-1] + 1e-9):
        raise ValueError(
            f"reference={ref!r} K lies outside the specific-heat table of {mat.key!r} "
            f"({x0[0]:.2f} K to {x1[-1]:.2f} K{note})"
        )
    probe = EnthalpyCurve(mat.key, x0, x1, c0, c1, h0, h1, ref, 0.0, None, None)
    shift = float(probe.enthalpy_unchecked(np.asarray(ref)))
    latent_in = float(jump.sum())
    if mat.solidus is not None and mat.liquidus > mat.solidus and mat.latent_heat:
        span = np.clip(x1[-1], mat.solidus, mat.liquidus) - mat.solidus
        latent_in = mat.latent_heat * span / (mat.liquidus - mat.solidus)
    curve = EnthalpyCurve(
        mat.key,
        x0,
        x1,
        c0,
        c1,
        h0 - shift,
        h1 - shift,
        ref,
        latent_in,
        mat.solidus,
        mat.liquidus,
        note,
    )
    if len(_CACHE) > 64:
        _CACHE.clear()
    _CACHE[id(mat)] = (mat, curve)
    return curve


def specific_enthalpy(material, temperature, reference: float = REFERENCE_TEMPERATURE):
    """Specific enthalpy relative to `reference`, latent heat of melting included.

    Parameters
    ----------
    material : str or Material
        Library key or :class:`~heatcalc.materials.Material`.
    temperature : float or array [K]
        Inside the material's specific-heat table.
    reference : float [K]
        Temperature of zero enthalpy (default 20 degC = 293.15 K).

    Returns
    -------
    float or array [J/kg]

    Raises
    ------
    ValueError
        If a temperature lies outside the specific-heat table, or above the solidus of a
        material without latent heat.

    Notes
    -----
    ``h(T) = integral_ref^T c_p dT + L f(T)``, with ``c_p`` the piecewise-linear table (the
    integral is exact) and ``f`` the liquid fraction: a step at the melting point when
    solidus equals liquidus (the solid value is returned at the melting point itself), linear
    from 0 at the solidus to 1 at the liquidus otherwise (a simplification: real alloys release
    their latent heat unevenly across the range).

    References
    ----------
    V. R. Voller, "Fast implicit finite-difference method for the analysis of phase change
    problems", Numer. Heat Transfer B 17 (1990) 155-169 (enthalpy formulation).

    Examples
    --------
    >>> from heatcalc.materials import Material
    >>> m = Material.constant(specific_heat=900.0, t_min=250.0, t_max=1200.0,
    ...                       solidus=933.47, liquidus=933.47, latent_heat=3.97e5)
    >>> round(specific_enthalpy(m, 393.15))
    90000
    >>> round(specific_enthalpy(m, 1000.0) / 1e3, 1)
    1033.2
    """
    mat = chk.material(material)
    curve = enthalpy_curve(mat, reference)
    return curve.enthalpy(temperature)


def temperature_from_enthalpy(material, enthalpy, reference: float = REFERENCE_TEMPERATURE):
    """Temperature at a given specific enthalpy (inverse of :func:`specific_enthalpy`).

    Parameters
    ----------
    material : str or Material
    enthalpy : float or array [J/kg]
        Relative to `reference`.
    reference : float [K]

    Returns
    -------
    float or array [K]
        On the melting step of a pure metal, the melting point.

    Raises
    ------
    ValueError
        If `enthalpy` lies outside the range covered by the specific-heat table.

    Examples
    --------
    >>> from heatcalc.materials import Material
    >>> m = Material.constant(specific_heat=500.0, t_min=250.0, t_max=1600.0)
    >>> temperature_from_enthalpy(m, 5.0e4)
    393.15
    """
    mat = chk.material(material)
    curve = enthalpy_curve(mat, reference)
    return curve.temperature(enthalpy)
