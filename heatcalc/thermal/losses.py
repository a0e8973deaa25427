"""Surface heat losses: grey-body radiation and natural convection to air.

All functions take kelvin and broadcast over scalars and arrays. Natural-convection Nusselt
numbers come from the ``ht`` library (Caleb Bell, Chemical Engineering Design Library), with
air properties at the film temperature from :mod:`heatcalc.thermal.air` (CoolProp).
"""

from __future__ import annotations

import numpy as np
from ht import conv_free_immersed as _free
from scipy.constants import Stefan_Boltzmann, atm, g

from .. import _checks as chk
from .air import air_properties

__all__ = [
    "NATURAL_CONVECTION_METHODS",
    "natural_convection_methods",
    "radiation_loss",
    "radiation_coefficient",
    "natural_convection_coefficient",
    "natural_convection_loss",
]


def _vertical_cylinder(pr, gr, length, diameter):
    return _free.Nu_vertical_cylinder_Popiel_Churchill(pr, gr, length, diameter)


#: Nusselt correlations by geometry and method; the first method of each geometry is the
#: default. Each is called as ``f(Pr, Gr, length, diameter)``.
NATURAL_CONVECTION_METHODS = {
    "horizontal_cylinder": {
        "Churchill-Chu": lambda pr, gr, L, D: _free.Nu_horizontal_cylinder_Churchill_Chu(pr, gr),
        "Morgan": lambda pr, gr, L, D: _free.Nu_horizontal_cylinder_Morgan(pr, gr),
    },
    "vertical_plate": {
        "Churchill-Chu": lambda pr, gr, L, D: _free.Nu_vertical_plate_Churchill(pr, gr),
    },
    "vertical_cylinder": {"Popiel-Churchill": _vertical_cylinder},
    "horizontal_plate_up": {
        "McAdams": lambda pr, gr, L, D: _free.Nu_horizontal_plate_McAdams(pr, gr, True),
    },
    "horizontal_plate_down": {
        "McAdams": lambda pr, gr, L, D: _free.Nu_horizontal_plate_McAdams(pr, gr, False),
    },
}

# A hot face up cools like a cold face down, and the other way round.
_FLIPPED = {"horizontal_plate_up": "horizontal_plate_down"}
_FLIPPED.update({v: k for k, v in _FLIPPED.items()})


def natural_convection_methods(geometry: str) -> list[str]:
    """Methods available for `geometry`, the default first.

    Examples
    --------
    >>> natural_convection_methods("horizontal_cylinder")
    ['Churchill-Chu', 'Morgan']
    """
    chk.choice("geometry", geometry, NATURAL_CONVECTION_METHODS)
    return list(NATURAL_CONVECTION_METHODS[geometry])


def radiation_loss(t_surface, t_surroundings, emissivity):
    """Net radiation from a grey surface to large surroundings.

    Parameters
    ----------
    t_surface : float or array [K]
    t_surroundings : float or array [K]
    emissivity : float or array [-]
        Total hemispherical emissivity, in [0, 1].

    Returns
    -------
    float or array [W/m2]
        Positive when the surface loses heat.

    Raises
    ------
    ValueError
        If a temperature is not > 0 K or the emissivity is outside [0, 1].

    Notes
    -----
    ``q = eps sigma (T_s**4 - T_sur**4)`` for a small grey body in a large enclosure, with the
    CODATA Stefan-Boltzmann constant (``scipy.constants``).

    References
    ----------
    F. P. Incropera, D. P. DeWitt, Fundamentals of Heat and Mass Transfer, 6th ed., Wiley,
    2007, eq. 1.7.

    Examples
    --------
    >>> round(radiation_loss(1273.15, 293.15, 0.8))
    118850
    """
    ts = chk.kelvin("t_surface", t_surface)
    ta = chk.kelvin("t_surroundings", t_surroundings)
    eps = chk.fraction("emissivity", emissivity, allow_zero=True)
    return chk.float_or_array(eps * Stefan_Boltzmann * (ts**4 - ta**4))


def radiation_coefficient(t_surface, t_surroundings, emissivity):
    """Linearised radiation coefficient ``h_r`` with ``q = h_r (T_s - T_sur)``.

    Parameters
    ----------
    t_surface, t_surroundings : float or array [K]
    emissivity : float or array [-]

    Returns
    -------
    float or array [W/(m2 K)]
        ``eps sigma (T_s + T_sur)(T_s**2 + T_sur**2)``.

    References
    ----------
    F. P. Incropera, D. P. DeWitt, Fundamentals of Heat and Mass Transfer, 6th ed., Wiley,
    2007, eq. 1.9.
    """
    ts = chk.kelvin("t_surface", t_surface)
    ta = chk.kelvin("t_surroundings", t_surroundings)
    eps = chk.fraction("emissivity", emissivity, allow_zero=True)
    return chk.float_or_array(eps * Stefan_Boltzmann * (ts + ta) * (ts**2 + ta**2))


def _nusselt(func, pr, gr, length, diameter):
    return np.vectorize(func, otypes=[float])(pr, gr, length, diameter)


def natural_convection_coefficient(
    t_surface,
    t_air,
    length,
    geometry: str = "horizontal_cylinder",
    method: str | None = None,
    diameter=None,
    pressure: float = atm,
):
    """Natural-convection film coefficient from a surface to still air.

    Parameters
    ----------
    t_surface : float or array [K]
    t_air : float or array [K]
        Air temperature far from the surface.
    length : float or array [m]
        Characteristic length: the diameter of a horizontal cylinder, the height of a vertical
        plate or cylinder, area/perimeter of a horizontal plate.
    geometry : str
        One of ``NATURAL_CONVECTION_METHODS``: ``"horizontal_cylinder"``,
        ``"vertical_plate"``, ``"vertical_cylinder"``, ``"horizontal_plate_up"`` (hot face
        up), ``"horizontal_plate_down"`` (hot face down).
    method : str, optional
        Correlation; see :func:`natural_convection_methods`. Default: the first listed.
    diameter : float or array [m], optional
        Cylinder diameter, required for ``"vertical_cylinder"`` only.
    pressure : float [Pa]

    Returns
    -------
    float or array [W/(m2 K)]

    Raises
    ------
    ValueError
        For an unknown geometry or method, a missing diameter, a non-positive length, or a film
        temperature outside the air table (200 K to 2000 K, see :mod:`heatcalc.thermal.air`).

    Notes
    -----
    ``h = Nu k / L`` with ``Nu(Pr, Gr)`` from ``ht``, ``Gr = g beta |T_s - T_air| L**3 / nu**2``
    and all air properties at the film temperature ``(T_s + T_air)/2``, ``beta = 1/T_film``.
    A surface colder than the air is handled by symmetry (a horizontal plate then swaps its
    hot-face-up and hot-face-down correlations). Churchill-Chu for the horizontal cylinder is
    valid for ``Ra <= 1e12``; the plate correlations of McAdams for ``1e4 <= Ra <= 1e11``.
    For a hot billet radiation is usually ten times larger than natural convection.

    References
    ----------
    S. W. Churchill, H. H. S. Chu, "Correlating equations for laminar and turbulent free
    convection from a horizontal cylinder", Int. J. Heat Mass Transfer 18 (1975) 1049-1053.
    S. W. Churchill, H. H. S. Chu, "Correlating equations for laminar and turbulent free
    convection from a vertical plate", Int. J. Heat Mass Transfer 18 (1975) 1323-1329.
    V. T. Morgan, "The overall convective heat transfer from smooth circular cylinders",
    Adv. Heat Transfer 11 (1975) 199-264.
    C. O. Popiel, J. Wojtkowiak, K. Bober, "Laminar free convective heat transfer from
    isothermal vertical slender cylinder", Exp. Therm. Fluid Sci. 32 (2008) 607-613.
    W. H. McAdams, Heat Transmission, 3rd ed., McGraw-Hill, 1954.
    C. Bell et al., ht: Heat transfer component of the Chemical Engineering Design Library.

    Examples
    --------
    A 0.1 m pipe at 165 degC in air at 23 degC (compare Incropera & DeWitt, 6th ed.,
    Example 9.3, h = 7.3 W/(m2 K), from memory):

    >>> round(float(natural_convection_coefficient(438.15, 296.15, 0.1)), 1)
    7.3
    """
    chk.choice("geometry", geometry, NATURAL_CONVECTION_METHODS)
    methods = NATURAL_CONVECTION_METHODS[geometry]
    if method is None:
        method = next(iter(methods))
    chk.choice("method", method, methods)
    ts = chk.kelvin("t_surface", t_surface)
    ta = chk.kelvin("t_air", t_air)
    L = chk.positive("length", length, "m")
    if geometry == "vertical_cylinder":
        if diameter is None:
            raise ValueError("diameter must be given for geometry='vertical_cylinder' [m]")
        D = chk.positive("diameter", diameter, "m")
    else:
        D = np.asarray(np.nan)
    ts, ta, L, D = np.broadcast_arrays(ts, ta, L, D)
    air = air_properties(0.5 * (ts + ta), pressure)
    # The correlations need dT != 0 (Gr**-1/4 in Popiel-Churchill); below 1 mK the
    # coefficient is taken at 1 mK (its limit), and the heat flux h dT still vanishes.
    dt = np.maximum(np.abs(ts - ta), 1e-3)
    nu = air.kinematic_viscosity
    gr = g * air.expansion * dt * L**3 / nu**2
    if geometry in _FLIPPED:
        cold = ts < ta
        nu_hot = _nusselt(methods[method], air.prandtl, gr, L, D)
        other = NATURAL_CONVECTION_METHODS[_FLIPPED[geometry]]
        nu_cold = _nusselt(next(iter(other.values())), air.prandtl, gr, L, D)
        nusselt = np.where(cold, nu_cold, nu_hot)
    else:
        nusselt = _nusselt(methods[method], air.prandtl, gr, L, D)
    return chk.float_or_array(nusselt * air.conductivity / L)


def natural_convection_loss(
    t_surface,
    t_air,
    length,
    geometry: str = "horizontal_cylinder",
    method: str | None = None,
    diameter=None,
    pressure: float = atm,
):
    """Natural-convection heat flux ``h (T_s - T_air)`` [W/m2]; see
    :func:`natural_convection_coefficient` for the parameters.

    Examples
    --------
    >>> round(float(natural_convection_loss(438.15, 296.15, 0.1)))
    1034
    """
    h = natural_convection_coefficient(
        t_surface, t_air, length, geometry, method, diameter, pressure
    )
    return chk.float_or_array(h * (np.asarray(t_surface, dtype=float) - np.asarray(t_air)))
