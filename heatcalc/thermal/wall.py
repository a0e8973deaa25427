"""Steady conduction through concentric cylindrical layers (crucible, refractory, insulation).

Typical use: heat flowing from a melt through the crucible wall and refractory lining to the
water-cooled coil of a crucible furnace.
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np
import pandas as pd

from .. import _checks as chk

__all__ = ["WallConduction", "cylindrical_wall"]


@dataclass(frozen=True)
class WallConduction:
    """Result of :func:`cylindrical_wall`.

    Attributes
    ----------
    heat_flow : float [W]
        Heat flowing outwards through the wall (negative if inwards).
    resistances : numpy.ndarray [K/W]
        Thermal resistance of each element in series, inside to outside: the inner film (if
        given), each layer, the outer film (if given).
    interface_temperatures : numpy.ndarray [K]
        Temperatures at the ends of the elements: ``t_inner``, ..., ``t_outer``.
    labels : tuple of str
        Name of each resistance.
    """

    heat_flow: float
    resistances: np.ndarray
    interface_temperatures: np.ndarray
    labels: tuple[str, ...]

    @property
    def total_resistance(self) -> float:
        """Sum of the series resistances [K/W]."""
        return float(self.resistances.sum())

    def to_frame(self) -> pd.DataFrame:
        """One row per element: resistance, temperature drop and temperatures either side."""
        t = self.interface_temperatures
        return pd.DataFrame(
            {
                "element": self.labels,
                "resistance_K_per_W": self.resistances,
                "t_in_degC": t[:-1] - 273.15,
                "t_out_degC": t[1:] - 273.15,
                "drop_K": t[:-1] - t[1:],
            }
        )

    def _repr_html_(self) -> str:
        return f"<p>heat flow {self.heat_flow:.4g} W</p>" + self.to_frame().to_html(
            index=False, float_format=lambda x: f"{x:.4g}"
        )


def cylindrical_wall(
    radii, conductivities, t_inner, t_outer, length=1.0, film_inner=None, film_outer=None
):
    """Heat flow through concentric cylindrical layers between two temperatures.

    Parameters
    ----------
    radii : sequence of float [m]
        Layer boundaries from inside to outside, strictly increasing, > 0 (n + 1 values for n
        layers).
    conductivities : sequence of float [W/(m K)]
        Thermal conductivity of each layer (n values), > 0.
    t_inner : float [K]
        Temperature inside (the melt, or the inner wall face if `film_inner` is None).
    t_outer : float [K]
        Temperature outside (the cooling water, or the outer face if `film_outer` is None).
    length : float [m]
        Axial length of the wall.
    film_inner, film_outer : float [W/(m2 K)], optional
        Film coefficients at the inner and outer faces, > 0.

    Returns
    -------
    WallConduction

    Raises
    ------
    ValueError
        For radii not increasing, a count mismatch, or a non-positive value.

    Notes
    -----
    One-dimensional steady conduction with constant conductivity per layer; the layers are in
    series, each of resistance ``ln(r2/r1)/(2 pi k L)``, a film ``1/(2 pi r L h)``; the heat
    flow is ``Q = (t_inner - t_outer)/sum(R)`` and each interface temperature follows from the
    drop ``Q R`` across each element. End losses and contact resistances are not included.

    References
    ----------
    F. P. Incropera, D. P. DeWitt, Fundamentals of Heat and Mass Transfer, 6th ed., Wiley,
    2007, section 3.3.1, eqs. 3.33 and 3.36.

    Examples
    --------
    A 20 mm refractory lining (k = 1.5) round a 0.2 m melt, 1 m long, 1500 degC inside and
    40 degC at the coil:

    >>> wall = cylindrical_wall([0.1, 0.12], [1.5], 1773.15, 313.15)
    >>> round(wall.heat_flow / 1e3, 1)
    75.4
    """
    r = chk.positive("radii", radii, "m")
    k = chk.positive("conductivities", conductivities, "W/(m K)")
    if r.ndim != 1 or r.size < 2:
        raise ValueError(f"radii must list at least two boundaries [m]; got {radii!r}")
    if k.ndim != 1 or k.size != r.size - 1:
        raise ValueError(
            f"conductivities must give one value per layer ({r.size - 1}); got {conductivities!r}"
        )
    if np.any(np.diff(r) <= 0):
        raise ValueError(f"radii must increase strictly [m]; got {radii!r}")
    ti = float(chk.kelvin("t_inner", t_inner))
    to = float(chk.kelvin("t_outer", t_outer))
    L = float(chk.positive("length", length, "m"))
    res = list(np.log(r[1:] / r[:-1]) / (2.0 * np.pi * k * L))
    labels = [f"layer {i + 1}" for i in range(k.size)]
    if film_inner is not None:
        h = float(chk.positive("film_inner", film_inner, "W/(m2 K)"))
        res.insert(0, 1.0 / (2.0 * np.pi * r[0] * L * h))
        labels.insert(0, "inner film")
    if film_outer is not None:
        h = float(chk.positive("film_outer", film_outer, "W/(m2 K)"))
        res.append(1.0 / (2.0 * np.pi * r[-1] * L * h))
        labels.append("outer film")
    res = np.asarray(res)
    q = (ti - to) / res.sum()
    temps = ti - q * np.concatenate([[0.0], np.cumsum(res)])
    temps[-1] = to  # exact by construction; remove rounding
    return WallConduction(float(q), res, temps, tuple(labels))
