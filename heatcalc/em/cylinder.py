"""Long solid cylinder in a uniform axial alternating magnetic field (analytic solution).

Sign convention
---------------
RMS phasors, time dependence ``exp(j omega t)``. The applied field ``H_z`` is axial and equal
to ``h_surface`` (real, taken as phase reference) at the surface ``r = radius``. Inside,
``H_z(r) = h_surface I0(alpha r) / I0(alpha radius)`` with ``alpha = (1 + j)/delta``; the same
function written with Kelvin functions is ``(ber m_r + j bei m_r)/(ber m_a + j bei m_a)``,
``m = sqrt(2) r / delta``, equivalently ``J0(k r)/J0(k a)`` with ``k = (1 - j)/delta``.
The induced current is azimuthal, ``J_theta = -dH_z/dr``, and ``E_theta = rho J_theta``.

The complex power entering unit surface area is ``-E_theta H_z*`` at ``r = radius``, i.e.
``(p + j q) = Z_s |h_surface|**2`` with surface impedance
``Z_s = rho H_z'(a) / H_z(a) = (rho/delta) (P + jQ)``; ``P`` and ``Q`` depend on
``radius/delta`` only (:func:`cylinder_power_factors`). Both are positive: the conductor
absorbs active power and stores magnetic energy (inductive, ``q > 0``).
"""

from __future__ import annotations

import numpy as np

from heatcalc import _checks as v
from heatcalc.em._bessel import ONE_PLUS_J, cylinder_zeta, i_ratio
from heatcalc.em.skin import skin_depth as _skin_depth

__all__ = [
    "cylinder_field",
    "cylinder_current_density",
    "cylinder_power_density",
    "cylinder_power_per_area",
    "cylinder_surface_impedance",
    "cylinder_power_factors",
]


def _radius_and_position(r, radius):
    a = v.positive("radius", radius, "m")
    rr = v.real_array("r", r, "m")
    v.within("r", rr, 0.0, "0", a, "radius")
    return rr, a


def cylinder_field(r, radius, skin_depth):
    """Complex field ratio ``H(r)/H(radius)`` inside a long solid cylinder.

    Parameters
    ----------
    r : float or array [m]
        Radial position, ``0 <= r <= radius``.
    radius : float or array [m]
        Cylinder radius, > 0.
    skin_depth : float or array [m]
        Skin depth of the material, > 0 (see :func:`heatcalc.em.skin_depth`).

    Returns
    -------
    complex or array [-]
        ``I0(alpha r)/I0(alpha radius)``, ``alpha = (1 + j)/skin_depth``; 1 at the surface.

    Raises
    ------
    ValueError
        If radius or skin_depth is not > 0, or r is outside [0, radius].

    Notes
    -----
    Stable for any ``radius/skin_depth`` (scaled Bessel functions; tested to 1000).
    Deep in a thick cylinder ``|H| ~ sqrt(radius/r) exp(-(radius - r)/skin_depth)``.

    References
    ----------
    J. Davies, Conduction and Induction Heating, Peter Peregrinus (IEE), 1990: solid cylinder
    in a long coil, Kelvin-function solution.
    M. Abramowitz and I. A. Stegun, Handbook of Mathematical Functions, NBS AMS 55, 1964,
    sections 9.6 and 9.9.
    """
    rr, a = _radius_and_position(r, radius)
    delta = v.positive("skin_depth", skin_depth, "m")
    return v.scalar_or_array(i_ratio(0, rr, a, delta))


def cylinder_current_density(r, h_surface, radius, resistivity, frequency, mu_r=1.0):
    """Complex azimuthal current density ``J_theta(r)`` in a long solid cylinder.

    Parameters
    ----------
    r : float or array [m]
        Radial position, ``0 <= r <= radius``.
    h_surface : float or array [A/m]
        RMS field strength at the surface, >= 0 (phase reference).
    radius : float or array [m]
        Cylinder radius, > 0.
    resistivity : float or array [ohm m]
        Electrical resistivity, > 0.
    frequency : float or array [Hz]
        Frequency, > 0.
    mu_r : float or array [-]
        Relative permeability, >= 1 (uniform).

    Returns
    -------
    complex or array [A/m2]
        RMS phasor ``J_theta = -dH_z/dr = -h_surface alpha I1(alpha r)/I0(alpha radius)``.

    Raises
    ------
    ValueError
        For an invalid argument (see :func:`cylinder_field`, :func:`heatcalc.em.skin_depth`).

    References
    ----------
    J. Davies, Conduction and Induction Heating, Peter Peregrinus (IEE), 1990: solid cylinder
    in a long coil, Kelvin-function solution.
    M. Abramowitz and I. A. Stegun, Handbook of Mathematical Functions, NBS AMS 55, 1964,
    sections 9.6 and 9.9.
    """
    rr, a = _radius_and_position(r, radius)
    h = v.non_negative("h_surface", h_surface, "A/m")
    delta = _skin_depth(resistivity, frequency, mu_r)
    return v.scalar_or_array(-h * (ONE_PLUS_J / delta) * i_ratio(1, rr, a, delta))


def cylinder_power_density(r, h_surface, radius, resistivity, frequency, mu_r=1.0):
    """Time-averaged induced power per unit volume ``rho |J|**2`` in a solid cylinder.

    Parameters
    ----------
    r, h_surface, radius, resistivity, frequency, mu_r
        As for :func:`cylinder_current_density` (units m, A/m, m, ohm m, Hz, -).

    Returns
    -------
    float or array [W/m3]
        Power density; integrated over the cross-section and divided by the circumference
        it equals :func:`cylinder_power_per_area`.

    Raises
    ------
    ValueError
        For an invalid argument.

    References
    ----------
    J. Davies, Conduction and Induction Heating, Peter Peregrinus (IEE), 1990: solid cylinder
    in a long coil, Kelvin-function solution.
    M. Abramowitz and I. A. Stegun, Handbook of Mathematical Functions, NBS AMS 55, 1964,
    sections 9.6 and 9.9.
    """
    j = cylinder_current_density(r, h_surface, radius, resistivity, frequency, mu_r)
    rho = np.asarray(resistivity, dtype=float)
    return v.scalar_or_array(rho * np.abs(j) ** 2)


def cylinder_power_factors(radius_to_skin_depth):
    """Dimensionless active and reactive power functions ``P`` and ``Q`` of a solid cylinder.

    Parameters
    ----------
    radius_to_skin_depth : float or array [-]
        ``radius / skin_depth``, > 0. The Kelvin-function argument is
        ``m = sqrt(2) radius / skin_depth``.

    Returns
    -------
    P, Q : float or array [-]
        ``P + jQ = (1 + j) I1(u)/I0(u)``, ``u = (1 + j) radius/skin_depth``, so that active and
        reactive power per unit surface are ``(rho H**2 / delta) P`` and
        ``(rho H**2 / delta) Q``.

    Raises
    ------
    ValueError
        If radius_to_skin_depth is not > 0.

    Notes
    -----
    In Kelvin functions of ``m``:
    ``P = sqrt(2) (ber ber' + bei bei') / (ber**2 + bei**2)``,
    ``Q = sqrt(2) (ber bei' - bei ber') / (ber**2 + bei**2)``.
    Limits: ``P -> x**3/4``, ``Q -> x`` for ``x = radius/delta -> 0``; ``P -> 1 - 1/(2x)``,
    ``Q -> 1`` for ``x -> infinity``. Valid for all ``x > 0`` (series below ``x = 1``).

    References
    ----------
    J. Davies, Conduction and Induction Heating, Peter Peregrinus (IEE), 1990: solid cylinder
    in a long coil, Kelvin-function solution.
    M. Abramowitz and I. A. Stegun, Handbook of Mathematical Functions, NBS AMS 55, 1964,
    sections 9.6 and 9.9.

    Examples
    --------
    >>> p, q = cylinder_power_factors(1.0)
    >>> round(float(p), 6), round(float(q), 6)
    (0.22441, 0.925506)
    """
    x = v.positive("radius_to_skin_depth", radius_to_skin_depth, "-")
    zeta = cylinder_zeta(x)
    return v.scalar_or_array(zeta.real), v.scalar_or_array(zeta.imag)


def cylinder_surface_impedance(radius, resistivity, frequency, mu_r=1.0):
    """Complex surface impedance of a long solid cylinder in an axial field.

    Parameters
    ----------
    radius : float or array [m]
        Cylinder radius, > 0.
    resistivity : float or array [ohm m]
        Electrical resistivity, > 0.
    frequency : float or array [Hz]
        Frequency, > 0.
    mu_r : float or array [-]
        Relative permeability, >= 1.

    Returns
    -------
    complex or array [ohm]
        ``Z_s = (rho/delta) (P + jQ)``, defined so that the (active + j reactive) power
        entering unit surface area is ``Z_s |H_surface|**2`` (RMS field). ``Re, Im > 0``.

    Raises
    ------
    ValueError
        For an invalid argument.

    References
    ----------
    J. Davies, Conduction and Induction Heating, Peter Peregrinus (IEE), 1990: solid cylinder
    in a long coil, Kelvin-function solution.
    M. Abramowitz and I. A. Stegun, Handbook of Mathematical Functions, NBS AMS 55, 1964,
    sections 9.6 and 9.9.

    Examples
    --------
    A thick cylinder tends to ``(1 + j) rho/delta``:

    >>> from heatcalc.em import skin_depth
    >>> z = cylinder_surface_impedance(0.1, 1.2e-6, 10e3)
    >>> z_thick = 1.2e-6 / skin_depth(1.2e-6, 10e3)
    >>> round(float(z.real / z_thick), 3), round(float(z.imag / z_thick), 3)
    (0.972, 1.0)
    """
    a = v.positive("radius", radius, "m")
    rho = v.positive("resistivity", resistivity, "ohm m")
    delta = _skin_depth(rho, frequency, mu_r)
    return v.scalar_or_array(rho / delta * cylinder_zeta(a / delta))


def cylinder_power_per_area(h_surface, radius, resistivity, frequency, mu_r=1.0):
    """Time-averaged induced power per unit surface area of a long solid cylinder.

    Parameters
    ----------
    h_surface : float or array [A/m]
        RMS axial field strength at the surface, >= 0.
    radius : float or array [m]
        Cylinder radius, > 0.
    resistivity : float or array [ohm m]
        Electrical resistivity, > 0.
    frequency : float or array [Hz]
        Frequency, > 0.
    mu_r : float or array [-]
        Relative permeability, >= 1.

    Returns
    -------
    float or array [W/m2]
        ``p = (rho H**2 / delta) P(radius/delta)``.

    Raises
    ------
    ValueError
        For an invalid argument.

    Notes
    -----
    Uniform properties, infinitely long cylinder (end effects ignored). For
    ``radius >> delta`` ``p -> rho H**2 / delta (1 - delta/(2 radius))``.

    References
    ----------
    J. Davies, Conduction and Induction Heating, Peter Peregrinus (IEE), 1990: solid cylinder
    in a long coil, Kelvin-function solution.
    M. Abramowitz and I. A. Stegun, Handbook of Mathematical Functions, NBS AMS 55, 1964,
    sections 9.6 and 9.9.

    Examples
    --------
    >>> round(float(cylinder_power_per_area(1e4, 0.05, 1.2e-6, 1e3)))
    5698
    """
    h = v.non_negative("h_surface", h_surface, "A/m")
    z = cylinder_surface_impedance(radius, resistivity, frequency, mu_r)
    return v.scalar_or_array(h**2 * np.real(z))
