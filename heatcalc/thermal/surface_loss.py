"""A surface-loss model for the transient solvers: radiation plus convection, fast to evaluate.

:class:`SurfaceLoss` bundles the loss conditions of one phase (emissivity, surroundings, a
constant film coefficient or a natural-convection correlation). Its :meth:`SurfaceLoss.flux`
evaluates the exact functions of :mod:`heatcalc.thermal.losses`; the solvers call
:meth:`SurfaceLoss.flux_and_slope`, which replaces the natural-convection coefficient by a
table built once (geometric spacing near the air temperature, 2 K steps beyond; linear
interpolation, relative error below 1e-4, checked in ``tests/thermal/test_thermal_losses.py``)
so that neither CoolProp nor ``ht`` runs in a time loop.
"""

from __future__ import annotations

import bisect
from dataclasses import dataclass
from functools import cached_property

import numpy as np
from scipy.constants import Stefan_Boltzmann

from .. import _checks as chk
from .air import air_table
from .losses import NATURAL_CONVECTION_METHODS, natural_convection_coefficient, radiation_loss

__all__ = ["SurfaceLoss"]

_GRID_STEP = 2.0  # [K] spacing of the convection table away from the air temperature


@dataclass(frozen=True)
class SurfaceLoss:
    """Heat-loss conditions at a surface: grey-body radiation and convection.

    Parameters
    ----------
    emissivity : float [-]
        Total hemispherical emissivity, in [0, 1] (0: no radiation).
    t_surroundings : float [K]
        Temperature of the radiating surroundings (and of the air unless `t_air` is given).
    h_convection : float [W/(m2 K)]
        Constant film coefficient (>= 0), added to any natural convection. Use it alone for an
        insulated soak (an overall coefficient through the insulation) or a forced flow.
    convection : str, optional
        Natural-convection geometry (a key of ``NATURAL_CONVECTION_METHODS``), or None.
    length : float [m], optional
        Characteristic length of the correlation (required with `convection`).
    diameter : float [m], optional
        For ``convection="vertical_cylinder"``.
    method : str, optional
        Correlation name, default the first listed for the geometry.
    t_air : float [K], optional
        Air temperature, default `t_surroundings`.

    Examples
    --------
    >>> loss = SurfaceLoss(emissivity=0.8, t_surroundings=293.15, h_convection=10.0)
    >>> round(float(loss.flux(1273.15)))
    128650
    """

    emissivity: float = 0.0
    t_surroundings: float = 293.15
    h_convection: float = 0.0
    convection: str | None = None
    length: float | None = None
    diameter: float | None = None
    method: str | None = None
    t_air: float | None = None

    def __post_init__(self):
        chk.fraction("emissivity", self.emissivity, allow_zero=True)
        chk.kelvin("t_surroundings", self.t_surroundings)
        chk.non_negative("h_convection", self.h_convection, "W/(m2 K)")
        if self.t_air is not None:
            chk.kelvin("t_air", self.t_air)
        if self.convection is not None:
            chk.choice("convection", self.convection, NATURAL_CONVECTION_METHODS)
            if self.length is None:
                raise ValueError(f"length must be given with convection={self.convection!r} [m]")
            chk.positive("length", self.length, "m")
            if self.method is not None:
                chk.choice("method", self.method, NATURAL_CONVECTION_METHODS[self.convection])
            if self.convection == "vertical_cylinder" and self.diameter is None:
                raise ValueError("diameter must be given with convection='vertical_cylinder' [m]")

    @property
    def air_temperature(self) -> float:
        return float(self.t_surroundings if self.t_air is None else self.t_air)

    def _h_natural(self, t):
        return natural_convection_coefficient(
            t, self.air_temperature, self.length, self.convection, self.method, self.diameter
        )

    def flux(self, t_surface):
        """Heat flux lost [W/m2] at surface temperature `t_surface` [K] (exact functions)."""
        ts = chk.kelvin("t_surface", t_surface)
        q = radiation_loss(ts, self.t_surroundings, self.emissivity)
        q = q + self.h_convection * (ts - self.air_temperature)
        if self.convection is not None:
            q = q + self._h_natural(ts) * (ts - self.air_temperature)
        return chk.float_or_array(q)

    @cached_property
    def _table(self):
        """Natural-convection coefficient on a grid of surface temperature.

        The grid is geometric in ``|T - T_air|`` from 1 mK to 50 K (where ``h`` varies as a
        small power of the difference) and uniform in 2 K steps beyond, on both sides of the
        air temperature, up to the film-temperature limits of the air table.
        """
        air_t = air_table().temperature
        ta = self.air_temperature
        lo = max(2.0 * air_t[0] - ta, 1.0)
        hi = 2.0 * air_t[-1] - ta  # film temperature at the top of the air table
        near = np.geomspace(1e-3, 50.0, 200)
        above = np.concatenate([near, np.arange(50.0 + _GRID_STEP, hi - ta, _GRID_STEP)])
        below = np.concatenate([near, np.arange(50.0 + _GRID_STEP, ta - lo, _GRID_STEP)])
        below = below[below < ta - lo]
        grid = np.concatenate([ta - below[::-1], [ta], ta + above, [hi]])
        h = np.asarray(self._h_natural(grid))
        return grid, h, grid.tolist()

    @property
    def t_max(self) -> float:
        """Highest surface temperature [K] the model covers (air table limit), or inf."""
        return float(self._table[0][-1]) if self.convection is not None else np.inf

    def flux_and_slope(self, t_surface: float):
        """Loss flux [W/m2] and its derivative [W/(m2 K)] at one temperature, fast, for solvers.

        No argument checks; a temperature outside the natural-convection table raises.
        """
        t = float(t_surface)
        ta = self.air_temperature
        es = self.emissivity * Stefan_Boltzmann
        q = es * (t**4 - self.t_surroundings**4) + self.h_convection * (t - ta)
        dq = 4.0 * es * t**3 + self.h_convection
        if self.convection is not None:
            grid, h, points = self._table
            if not grid[0] <= t <= grid[-1]:
                raise ValueError(
                    f"t_surface={t:.1f} K is outside the natural-convection range "
                    f"{grid[0]:.0f} K to {grid[-1]:.0f} K (air film above 2000 K)"
                )
            i = min(bisect.bisect_right(points, t) - 1, grid.size - 2)
            slope = (h[i + 1] - h[i]) / (grid[i + 1] - grid[i])
            hc = h[i] + slope * (t - grid[i])
            q += hc * (t - ta)
            dq += hc + slope * (t - ta)
        return q, dq
