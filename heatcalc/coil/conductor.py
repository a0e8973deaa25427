"""Coil conductor: copper tubing profiles and the impedance of the current-carrying wall.

In a solenoid the coil current flows on the face of each turn that looks at the bore, in a
layer about one copper skin depth thick. The wall of the tubing there is treated as a flat
sheet with the coil's field ``H`` on the bore face and no field behind it (inside the water
channel and outside a long coil). :func:`backed_sheet_impedance` gives that sheet's surface
impedance; :mod:`heatcalc.coil.circuit` scales it by the turns, the turn length and the space
factor.
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np
from scipy.constants import pi

from heatcalc import _checks as c
from heatcalc import em

__all__ = [
    "RectangularTube",
    "RoundTube",
    "backed_sheet_impedance",
    "optimum_wall_thickness",
]


def backed_sheet_impedance(thickness, resistivity, frequency):
    """Surface impedance of a conducting sheet with field on one face and none on the other.

    Parameters
    ----------
    thickness : float or array [m]
        Sheet (tubing wall) thickness, > 0.
    resistivity : float or array [ohm m]
        Resistivity of the conductor at its working temperature, > 0.
    frequency : float or array [Hz]
        Frequency, > 0.

    Returns
    -------
    complex or array [ohm]
        ``Z = E / H`` at the face carrying the field, with ``Re, Im > 0``; the complex power
        per unit face area is ``Z |H|**2`` (H RMS). Non-magnetic conductor (``mu_r = 1``).

    Raises
    ------
    ValueError
        If any argument is not finite and > 0.

    Notes
    -----
    With ``H(0) = H_0`` and ``H(t) = 0`` the one-dimensional diffusion equation gives
    ``H(x) = H_0 sinh(g (t - x)) / sinh(g t)``, ``g = (1 + j) / delta`` and so
    ``Z = rho g coth(g t)``. Limits: ``t >> delta``: ``Z -> (1 + j) rho / delta``;
    ``t << delta``: ``Z -> rho / t + j omega mu_0 t / 3`` (direct-current sheet resistance
    plus the internal inductance of a uniform current layer). The real part is least at
    ``t = pi delta / 2``, where it equals ``tanh(pi / 2) rho / delta``.

    References
    ----------
    J. Davies, Conduction and Induction Heating, Peter Peregrinus, 1990, ch. 2 and 8
    (one-sided slab; optimum coil wall pi delta / 2; from memory).

    Examples
    --------
    A wall much thicker than the skin depth behaves like a half-space:

    >>> z = complex(backed_sheet_impedance(5e-3, 1.7e-8, 10e3))
    >>> round(z.real / z.imag, 6)
    1.0
    """
    t = c.positive("thickness", thickness, "m")
    rho = c.positive("resistivity", resistivity, "ohm m")
    f = c.positive("frequency", frequency, "Hz")
    delta = em.skin_depth(rho, f)
    g_t = (1.0 + 1.0j) * t / delta
    return c.scalar_or_array(rho * (1.0 + 1.0j) / delta / np.tanh(g_t))


def optimum_wall_thickness(resistivity, frequency):
    """Wall thickness ``pi delta / 2`` that minimises the AC resistance of a backed sheet.

    Parameters
    ----------
    resistivity : float or array [ohm m]
        Conductor resistivity, > 0.
    frequency : float or array [Hz]
        Frequency, > 0.

    Returns
    -------
    float or array [m]
        ``pi delta / 2``, ``delta = sqrt(rho / (pi f mu_0))``.

    Raises
    ------
    ValueError
        If any argument is not finite and > 0.

    Notes
    -----
    ``Re[(1 + j) coth((1 + j) x)] = (sinh 2x + sin 2x) / (cosh 2x - cos 2x)`` has its only
    minimum at ``x = pi / 2``; a thinner wall raises the loss steeply, a thicker one by up
    to 9 %.

    References
    ----------
    J. Davies, Conduction and Induction Heating, Peter Peregrinus, 1990, ch. 8 (from memory).

    Examples
    --------
    >>> round(float(optimum_wall_thickness(1.7e-8, 10e3)) * 1e3, 3)
    1.031
    """
    rho = c.positive("resistivity", resistivity, "ohm m")
    f = c.positive("frequency", frequency, "Hz")
    return c.scalar_or_array(pi / 2.0 * em.skin_depth(rho, f))


@dataclass(frozen=True)
class RectangularTube:
    """Rectangular copper tubing, one turn of the coil.

    Parameters
    ----------
    axial_width : float [m]
        Outside width along the coil axis, > 0.
    radial_depth : float [m]
        Outside depth in the radial direction, > 0.
    wall : float [m]
        Wall thickness, > 0 and less than half of both outside sizes. The coil current is
        carried by the wall facing the bore.

    Raises
    ------
    ValueError
        If a size is not finite and > 0 or the wall leaves no water channel.
    """

    axial_width: float
    radial_depth: float
    wall: float

    def __post_init__(self):
        w = float(c.positive("axial_width", self.axial_width, "m"))
        h = float(c.positive("radial_depth", self.radial_depth, "m"))
        t = float(c.positive("wall", self.wall, "m"))
        if not 2.0 * t < min(w, h):
            raise ValueError(
                f"wall must be < half the smaller outside size ({min(w, h) / 2.0!r} m) to "
                f"leave a water channel; got {t!r}"
            )
        object.__setattr__(self, "axial_width", w)
        object.__setattr__(self, "radial_depth", h)
        object.__setattr__(self, "wall", t)

    @property
    def channel_area(self) -> float:
        """Cross-section of the water channel [m^2]."""
        return (self.axial_width - 2.0 * self.wall) * (self.radial_depth - 2.0 * self.wall)

    @property
    def hydraulic_diameter(self) -> float:
        """Hydraulic diameter of the water channel, 4 A / P [m]."""
        a = self.axial_width - 2.0 * self.wall
        b = self.radial_depth - 2.0 * self.wall
        return 2.0 * a * b / (a + b)

    @property
    def copper_area(self) -> float:
        """Copper cross-section of the tubing [m^2]."""
        return self.axial_width * self.radial_depth - self.channel_area


@dataclass(frozen=True)
class RoundTube:
    """Round copper tubing, one turn of the coil.

    Parameters
    ----------
    outer_diameter : float [m]
        Outside diameter, > 0; it is both the axial width and the radial depth of a turn.
    wall : float [m]
        Wall thickness, > 0 and < outer_diameter / 2.

    Raises
    ------
    ValueError
        If a size is not finite and > 0 or the wall leaves no water channel.

    Notes
    -----
    For the electrical model the current-carrying part is taken as a flat sheet of the wall
    thickness and of axial width equal to the outside diameter. The real current crowds into
    the arc that faces the bore, so this underestimates the copper loss of round tubing;
    rectangular tubing fits the model better.
    """

    outer_diameter: float
    wall: float

    def __post_init__(self):
        d = float(c.positive("outer_diameter", self.outer_diameter, "m"))
        t = float(c.positive("wall", self.wall, "m"))
        if not 2.0 * t < d:
            raise ValueError(
                f"wall must be < outer_diameter / 2 ({d / 2.0!r} m) to leave a water channel; "
                f"got {t!r}"
            )
        object.__setattr__(self, "outer_diameter", d)
        object.__setattr__(self, "wall", t)

    @property
    def axial_width(self) -> float:
        """Axial width of one turn, the outside diameter [m]."""
        return self.outer_diameter

    @property
    def radial_depth(self) -> float:
        """Radial depth of one turn, the outside diameter [m]."""
        return self.outer_diameter

    @property
    def channel_area(self) -> float:
        """Cross-section of the water channel [m^2]."""
        return pi * (self.outer_diameter - 2.0 * self.wall) ** 2 / 4.0

    @property
    def hydraulic_diameter(self) -> float:
        """Bore of the tubing [m]."""
        return self.outer_diameter - 2.0 * self.wall

    @property
    def copper_area(self) -> float:
        """Copper cross-section of the tubing [m^2]."""
        return pi * self.outer_diameter**2 / 4.0 - self.channel_area
