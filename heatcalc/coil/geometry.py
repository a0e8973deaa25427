"""Coil and workpiece descriptions (frozen dataclasses, SI units).

Coil
----
A single-layer solenoid of ``turns`` turns of copper tubing wound over an axial ``length``
(the winding length, ``turns x pitch``: the length of the equivalent current sheet). The
bore is either round (:class:`SolenoidCoil`, ``inner_diameter``) or rectangular
(:class:`RectangularSolenoidCoil`, ``bore_width`` x ``bore_height``, for plates). The bore
face of the turns is where the coil current flows. ``space_factor = turns * axial_width /
length`` is the axial fill of copper (<= 1). ``resistivity`` is that of the copper at its
working temperature (the materials library provides it).

Workpieces
----------
Solid cylinder, tube with an empty bore, or plate (slab), each with its resistivity and
relative permeability at the state to be analysed (uniform through the section; for
properties that vary with radius pass the surface impedance of a radial field solution to
:func:`heatcalc.coil.circuit.coil_impedance`). A workpiece sits coaxially in the coil and
axially within it when it is shorter; when longer, only the part under the coil is counted.
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np
from scipy.constants import pi

from heatcalc import _checks as c
from heatcalc import em
from heatcalc.coil.conductor import RectangularTube, RoundTube

__all__ = [
    "SolenoidCoil",
    "RectangularSolenoidCoil",
    "CylinderWorkpiece",
    "TubeWorkpiece",
    "SlabWorkpiece",
]


def _set_float(obj, name: str, value: float) -> None:
    object.__setattr__(obj, name, float(value))


def _check_winding(obj) -> None:
    object.__setattr__(obj, "turns", c.positive_integer("turns", obj.turns))
    _set_float(obj, "length", c.positive("length", obj.length, "m"))
    _set_float(obj, "resistivity", c.positive("resistivity", obj.resistivity, "ohm m"))
    if not isinstance(obj.conductor, RectangularTube | RoundTube):
        raise ValueError(f"conductor must be a RectangularTube or RoundTube; got {obj.conductor!r}")
    fill = obj.turns * obj.conductor.axial_width / obj.length
    if fill > 1.0:
        raise ValueError(
            f"turns x conductor axial width must not exceed length: space factor "
            f"{fill!r} > 1 (turns={obj.turns!r}, axial width="
            f"{obj.conductor.axial_width!r} m, length={obj.length!r} m)"
        )


@dataclass(frozen=True)
class SolenoidCoil:
    """Single-layer solenoid with a round bore.

    Parameters
    ----------
    turns : int
        Number of turns, >= 1.
    length : float [m]
        Winding length (current-sheet length), > 0.
    inner_diameter : float [m]
        Bore diameter (inner face of the turns), > 0.
    conductor : RectangularTube or RoundTube
        Tubing profile of one turn.
    resistivity : float [ohm m]
        Resistivity of the copper at its working temperature, > 0.

    Raises
    ------
    ValueError
        For an invalid size, or turns that do not fit in the length (space factor > 1).
    """

    turns: int
    length: float
    inner_diameter: float
    conductor: RectangularTube | RoundTube
    resistivity: float

    def __post_init__(self):
        _set_float(self, "inner_diameter", c.positive("inner_diameter", self.inner_diameter, "m"))
        _check_winding(self)

    @property
    def space_factor(self) -> float:
        """Axial copper fill, ``turns * axial_width / length`` [-]."""
        return self.turns * self.conductor.axial_width / self.length

    @property
    def bore_area(self) -> float:
        """Area inside the current sheet, ``pi D**2 / 4`` [m^2]."""
        return pi * self.inner_diameter**2 / 4.0

    @property
    def current_path_length(self) -> float:
        """Length of one turn along the bore face, where the current flows [m]."""
        return pi * self.inner_diameter

    @property
    def equivalent_diameter(self) -> float:
        """Current-sheet diameter used for Nagaoka's coefficient [m]."""
        return self.inner_diameter

    @property
    def mean_turn_length(self) -> float:
        """Length of one turn along the tubing's centre line (water path) [m]."""
        return pi * (self.inner_diameter + self.conductor.radial_depth)

    @property
    def mean_diameter(self) -> float:
        """Diameter of the tubing's centre line [m]."""
        return self.inner_diameter + self.conductor.radial_depth


@dataclass(frozen=True)
class RectangularSolenoidCoil:
    """Single-layer solenoid with a rectangular bore (for plates and strip).

    Parameters
    ----------
    turns : int
        Number of turns, >= 1.
    length : float [m]
        Winding length (current-sheet length), > 0.
    bore_width : float [m]
        Inside size of the bore along the plate width, > 0.
    bore_height : float [m]
        Inside size of the bore across the plate thickness, > 0.
    conductor : RectangularTube or RoundTube
        Tubing profile of one turn.
    resistivity : float [ohm m]
        Resistivity of the copper at its working temperature, > 0.

    Raises
    ------
    ValueError
        For an invalid size, or turns that do not fit in the length (space factor > 1).

    Notes
    -----
    The short-coil correction uses Nagaoka's coefficient of the round coil of equal bore
    area (``equivalent_diameter``). That is an approximation with no published error bound
    here; for a wide, flat bore prefer ``method="long_coil"`` when the coil is long against
    the bore height, or a field computation.
    """

    turns: int
    length: float
    bore_width: float
    bore_height: float
    conductor: RectangularTube | RoundTube
    resistivity: float

    def __post_init__(self):
        _set_float(self, "bore_width", c.positive("bore_width", self.bore_width, "m"))
        _set_float(self, "bore_height", c.positive("bore_height", self.bore_height, "m"))
        _check_winding(self)

    @property
    def space_factor(self) -> float:
        """Axial copper fill, ``turns * axial_width / length`` [-]."""
        return self.turns * self.conductor.axial_width / self.length

    @property
    def bore_area(self) -> float:
        """Area inside the current sheet [m^2]."""
        return self.bore_width * self.bore_height

    @property
    def current_path_length(self) -> float:
        """Length of one turn along the bore face [m]."""
        return 2.0 * (self.bore_width + self.bore_height)

    @property
    def equivalent_diameter(self) -> float:
        """Diameter of the round bore of equal area, used for Nagaoka's coefficient [m]."""
        return float(np.sqrt(4.0 * self.bore_area / pi))

    @property
    def mean_turn_length(self) -> float:
        """Length of one turn along the tubing's centre line (square corners) [m]."""
        return self.current_path_length + 4.0 * self.conductor.radial_depth

    @property
    def mean_diameter(self) -> float:
        """Diameter of the circle with the mean turn length (for bend curvature) [m]."""
        return self.mean_turn_length / pi


def _check_material(obj) -> None:
    _set_float(obj, "length", c.positive("length", obj.length, "m"))
    _set_float(obj, "resistivity", c.positive("resistivity", obj.resistivity, "ohm m"))
    mu = c.real("mu_r", obj.mu_r, "-")
    if not mu >= 1.0:
        raise ValueError(f"mu_r must be >= 1 [-]; got {obj.mu_r!r}")
    _set_float(obj, "mu_r", mu)


@dataclass(frozen=True)
class CylinderWorkpiece:
    """Solid round bar or billet.

    Parameters
    ----------
    radius : float [m]
        Radius, > 0.
    length : float [m]
        Length, > 0.
    resistivity : float [ohm m]
        Resistivity, > 0.
    mu_r : float [-]
        Relative permeability, >= 1 (1 above the Curie temperature).
    """

    radius: float
    length: float
    resistivity: float
    mu_r: float = 1.0

    def __post_init__(self):
        _set_float(self, "radius", c.positive("radius", self.radius, "m"))
        _check_material(self)

    @property
    def perimeter(self) -> float:
        """Heated perimeter of the cross-section [m]."""
        return 2.0 * pi * self.radius

    @property
    def area(self) -> float:
        """Cross-section that excludes gap flux [m^2]."""
        return pi * self.radius**2

    def surface_impedance(self, frequency):
        """Surface impedance [ohm] from :func:`heatcalc.em.cylinder_surface_impedance`."""
        return em.cylinder_surface_impedance(self.radius, self.resistivity, frequency, self.mu_r)


@dataclass(frozen=True)
class TubeWorkpiece:
    """Tube with an empty bore.

    Parameters
    ----------
    outer_radius : float [m]
        Outside radius, > 0.
    inner_radius : float [m]
        Bore radius, 0 < inner_radius < outer_radius.
    length : float [m]
        Length, > 0.
    resistivity : float [ohm m]
        Resistivity, > 0.
    mu_r : float [-]
        Relative permeability, >= 1.
    """

    outer_radius: float
    inner_radius: float
    length: float
    resistivity: float
    mu_r: float = 1.0

    def __post_init__(self):
        _set_float(self, "outer_radius", c.positive("outer_radius", self.outer_radius, "m"))
        _set_float(self, "inner_radius", c.positive("inner_radius", self.inner_radius, "m"))
        if not self.inner_radius < self.outer_radius:
            raise ValueError(
                f"inner_radius must be < outer_radius ({self.outer_radius!r} m); "
                f"got {self.inner_radius!r}"
            )
        _check_material(self)

    @property
    def wall(self) -> float:
        """Wall thickness [m]."""
        return self.outer_radius - self.inner_radius

    @property
    def perimeter(self) -> float:
        """Heated (outer) perimeter [m]."""
        return 2.0 * pi * self.outer_radius

    @property
    def area(self) -> float:
        """Area inside the outer surface (the bore flux is in the surface impedance) [m^2]."""
        return pi * self.outer_radius**2

    def surface_impedance(self, frequency):
        """Surface impedance [ohm] from :func:`heatcalc.em.tube_surface_impedance`."""
        return em.tube_surface_impedance(
            self.outer_radius, self.inner_radius, self.resistivity, frequency, self.mu_r
        )


@dataclass(frozen=True)
class SlabWorkpiece:
    """Plate (or a stack of plates heated as one) much wider than it is thick.

    Parameters
    ----------
    thickness : float [m]
        Plate thickness, > 0.
    width : float [m]
        Plate width, > thickness.
    length : float [m]
        Length along the coil axis, > 0.
    resistivity : float [ohm m]
        Resistivity, > 0.
    mu_r : float [-]
        Relative permeability, >= 1.

    Notes
    -----
    Both broad faces see the coil field (:func:`heatcalc.em.slab_surface_impedance`); the
    narrow edge faces and the end effects at the plate edges are neglected, which needs
    ``width >> thickness``.
    """

    thickness: float
    width: float
    length: float
    resistivity: float
    mu_r: float = 1.0

    def __post_init__(self):
        _set_float(self, "thickness", c.positive("thickness", self.thickness, "m"))
        _set_float(self, "width", c.positive("width", self.width, "m"))
        if not self.width > self.thickness:
            raise ValueError(
                f"width must be > thickness ({self.thickness!r} m); got {self.width!r}"
            )
        _check_material(self)

    @property
    def perimeter(self) -> float:
        """Heated perimeter: the two broad faces [m]."""
        return 2.0 * self.width

    @property
    def area(self) -> float:
        """Cross-section that excludes gap flux [m^2]."""
        return self.width * self.thickness

    def surface_impedance(self, frequency):
        """Surface impedance of each face [ohm] from :func:`heatcalc.em.slab_surface_impedance`."""
        return em.slab_surface_impedance(self.thickness, self.resistivity, frequency, self.mu_r)
