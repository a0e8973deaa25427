"""Long tube in a coil, empty bore, uniform axial alternating field outside (analytic).

Sign convention
---------------
RMS phasors, time dependence ``exp(j omega t)``. The tube has outer radius ``a`` and inner radius
``b``; the applied axial field is ``h_surface`` (real, phase reference) at ``r = a``. In the wall
``H_z = A I0(alpha r) + B K0(alpha r)``, ``alpha = (1 + j)/delta``. The bore holds no conductor,
so its field is uniform and equal to ``H_z(b)``; its flux ``mu_0 pi b**2 H_z(b)`` drives the
electric field at the inner wall (Faraday's law round the bore):
``2 pi b E_theta(b) = -j omega mu_0 pi b**2 H_z(b)``, with ``E_theta = -rho dH_z/dr``, hence
``dH_z/dr (b) = j b / (mu_r delta**2) H_z(b)`` (``mu_r`` of the wall, ``mu_0`` in the bore).
The induced current is ``J_theta = -dH_z/dr``.

The complex power entering unit outer surface (including the magnetic energy of the bore) is
``Z_s |h_surface|**2``, ``Z_s = rho H_z'(a)/H_z(a) = (rho/delta)(P + jQ)``.
"""

from __future__ import annotations

import numpy as np
from scipy.special import ive, kve

from heatcalc import _checks as v
from heatcalc.em._bessel import ONE_PLUS_J
from heatcalc.em.skin import skin_depth as _skin_depth

__all__ = [
    "tube_field",
    "tube_current_density",
    "tube_power_density",
    "tube_power_per_area",
    "tube_surface_impedance",
    "tube_power_factors",
]

# Walls thinner than one skin depth: the active part is small beside the reactive part (bore
# flux), and taking it as the real part of the closed form would lose digits; it is obtained
# instead by integrating rho |J|**2 over the wall with Gauss-Legendre quadrature, exact to
# rounding for such a smooth integrand (field varies on the scale delta >= wall thickness).
_THIN_WALL = 1.0
_GAUSS_X, _GAUSS_W = np.polynomial.legendre.leggauss(24)


def _wall_state(r, outer, inner, mu_r):
    """Field and derivative ratios in the wall, lengths in skin depths.

    Returns ``H(r)/H(a)`` and ``delta H'(r)/H(a)``; ``r``, ``outer``, ``inner`` are in units of
    the skin depth and broadcast together. Bessel functions are exponentially scaled so that
    no exponent is positive (``r >= inner``).
    """
    u = ONE_PLUS_J
    ub = u * inner
    beta = 1j * inner / mu_r
    c_hat = (u * ive(1, ub) - beta * ive(0, ub)) / (u * kve(1, ub) + beta * kve(0, ub))

    def combos(x):
        ux = u * x
        grow = np.exp(x - outer)  # e^{(x - a)/delta}, x <= a
        fall = c_hat * np.exp(inner - outer + u * (inner - x))  # |.| <= 1 for x >= b
        value = ive(0, ux) * grow + kve(0, ux) * fall
        slope = u * (ive(1, ux) * grow - kve(1, ux) * fall)
        return value, slope

    value_a, slope_a = combos(outer)
    value_r, slope_r = combos(r)
    return value_r / value_a, slope_r / value_a, slope_a / value_a


def _tube_zeta(outer, inner, mu_r):
    """``P + jQ`` for lengths in skin depths (arrays, validated by the caller)."""
    outer, inner, mu_r = np.broadcast_arrays(outer, inner, mu_r)
    zeta = np.asarray(_wall_state(outer, outer, inner, mu_r)[2], dtype=complex).copy()
    thin = (outer - inner) <= _THIN_WALL
    if np.any(thin):
        a, b, m = outer[thin], inner[thin], mu_r[thin]
        half = 0.5 * (a - b)
        mid = 0.5 * (a + b)
        nodes = mid[..., None] + half[..., None] * _GAUSS_X
        _, slope, _ = _wall_state(nodes, a[..., None], b[..., None], m[..., None])
        integral = half * np.sum(_GAUSS_W * np.abs(slope) ** 2 * nodes, axis=-1)
        zeta[thin] = integral / a + 1j * zeta[thin].imag
    return zeta


def _check_radii(outer_radius, inner_radius):
    a = v.positive("outer_radius", outer_radius, "m")
    b = v.positive("inner_radius", inner_radius, "m")
    v.less_than("inner_radius", b, "outer_radius", a)
    return a, b


def _position(r, a):
    rr = v.real_array("r", r, "m")
    v.within("r", rr, 0.0, "0", a, "outer_radius")
    return rr


def tube_field(r, outer_radius, inner_radius, skin_depth, mu_r=1.0):
    """Complex field ratio ``H(r)/H(outer_radius)`` in a long tube with an empty bore.

    Parameters
    ----------
    r : float or array [m]
        Radial position, ``0 <= r <= outer_radius``; in the bore (``r < inner_radius``) the
        field is uniform and equal to its value at the inner wall.
    outer_radius : float or array [m]
        Outer radius, > 0.
    inner_radius : float or array [m]
        Inner (bore) radius, ``0 < inner_radius < outer_radius``.
    skin_depth : float or array [m]
        Skin depth of the wall material, > 0.
    mu_r : float or array [-]
        Relative permeability of the wall, >= 1 (it enters the bore condition).

    Returns
    -------
    complex or array [-]
        Field ratio, 1 at the outer surface.

    Raises
    ------
    ValueError
        For a non-positive size or skin depth, ``inner_radius >= outer_radius``, mu_r < 1 or r
        outside [0, outer_radius].

    Notes
    -----
    Stable for any wall thickness and radius in skin depths (scaled Bessel functions).

    References
    ----------
    J. Davies, Conduction and Induction Heating, Peter Peregrinus (IEE), 1990: tubular load.
    M. Abramowitz and I. A. Stegun, Handbook of Mathematical Functions, 1964, section 9.6.
    """
    a, b = _check_radii(outer_radius, inner_radius)
    rr = _position(r, a)
    delta = v.positive("skin_depth", skin_depth, "m")
    mu = v.at_least("mu_r", mu_r, 1.0, "-")
    rr, a, b, delta, mu = np.broadcast_arrays(rr, a, b, delta, mu)
    ratio = _wall_state(np.maximum(rr, b) / delta, a / delta, b / delta, mu)[0]
    return v.scalar_or_array(ratio)


def tube_current_density(
    r, h_surface, outer_radius, inner_radius, resistivity, frequency, mu_r=1.0
):
    """Complex azimuthal current density ``J_theta(r)`` in a long tube with an empty bore.

    Parameters
    ----------
    r : float or array [m]
        Radial position, ``0 <= r <= outer_radius``; zero current in the bore.
    h_surface : float or array [A/m]
        RMS field at the outer surface, >= 0 (phase reference).
    outer_radius, inner_radius : float or array [m]
        Radii, ``0 < inner_radius < outer_radius``.
    resistivity : float or array [ohm m]
        Electrical resistivity, > 0.
    frequency : float or array [Hz]
        Frequency, > 0.
    mu_r : float or array [-]
        Relative permeability of the wall, >= 1.

    Returns
    -------
    complex or array [A/m2]
        RMS phasor ``J_theta = -dH_z/dr``.

    Raises
    ------
    ValueError
        For an invalid argument.

    References
    ----------
    J. Davies, Conduction and Induction Heating, Peter Peregrinus (IEE), 1990: tubular load.
    """
    a, b = _check_radii(outer_radius, inner_radius)
    rr = _position(r, a)
    h = v.non_negative("h_surface", h_surface, "A/m")
    delta = _skin_depth(resistivity, frequency, mu_r)
    mu = np.asarray(mu_r, dtype=float)
    rr, h, a, b, delta, mu = np.broadcast_arrays(rr, h, a, b, delta, mu)
    in_wall = rr >= b
    slope = _wall_state(np.maximum(rr, b) / delta, a / delta, b / delta, mu)[1]
    return v.scalar_or_array(np.where(in_wall, -h * slope / delta, 0.0))


def tube_power_density(r, h_surface, outer_radius, inner_radius, resistivity, frequency, mu_r=1.0):
    """Time-averaged induced power per unit volume ``rho |J|**2`` in a tube.

    Parameters
    ----------
    r, h_surface, outer_radius, inner_radius, resistivity, frequency, mu_r
        As for :func:`tube_current_density` (units m, A/m, m, m, ohm m, Hz, -).

    Returns
    -------
    float or array [W/m3]
        Power density (zero in the bore).

    Raises
    ------
    ValueError
        For an invalid argument.
    """
    j = tube_current_density(r, h_surface, outer_radius, inner_radius, resistivity, frequency, mu_r)
    return v.scalar_or_array(np.asarray(resistivity, dtype=float) * np.abs(j) ** 2)


def tube_power_factors(outer_radius_to_skin_depth, inner_radius_to_skin_depth, mu_r=1.0):
    """Dimensionless active and reactive functions ``P`` and ``Q`` of a tube with empty bore.

    Parameters
    ----------
    outer_radius_to_skin_depth : float or array [-]
        ``outer_radius / skin_depth``, > 0.
    inner_radius_to_skin_depth : float or array [-]
        ``inner_radius / skin_depth``, > 0 and < outer_radius_to_skin_depth.
    mu_r : float or array [-]
        Relative permeability of the wall, >= 1.

    Returns
    -------
    P, Q : float or array [-]
        Active and reactive power per unit outer surface are ``(rho H**2/delta) P`` and
        ``(rho H**2/delta) Q``.

    Raises
    ------
    ValueError
        For an invalid argument.

    Notes
    -----
    As the bore shrinks, or the wall becomes many skin depths thick, ``P`` and ``Q`` tend to
    those of the solid cylinder. For walls thinner than one skin depth ``P`` is evaluated as
    the wall integral of ``|J|**2`` (24-point Gauss-Legendre) to keep full precision.

    References
    ----------
    J. Davies, Conduction and Induction Heating, Peter Peregrinus (IEE), 1990: tubular load.

    Examples
    --------
    >>> p, q = tube_power_factors(10.0, 5.0)
    >>> round(float(p), 4), round(float(q), 4)
    (0.9493, 1.0006)
    """
    a = v.positive("outer_radius_to_skin_depth", outer_radius_to_skin_depth, "-")
    b = v.positive("inner_radius_to_skin_depth", inner_radius_to_skin_depth, "-")
    v.less_than("inner_radius_to_skin_depth", b, "outer_radius_to_skin_depth", a)
    mu = v.at_least("mu_r", mu_r, 1.0, "-")
    zeta = _tube_zeta(a, b, mu)
    return v.scalar_or_array(zeta.real), v.scalar_or_array(zeta.imag)


def tube_surface_impedance(outer_radius, inner_radius, resistivity, frequency, mu_r=1.0):
    """Complex surface impedance of a long tube with an empty bore in an axial field.

    Parameters
    ----------
    outer_radius, inner_radius : float or array [m]
        Radii, ``0 < inner_radius < outer_radius``.
    resistivity : float or array [ohm m]
        Electrical resistivity of the wall, > 0.
    frequency : float or array [Hz]
        Frequency, > 0.
    mu_r : float or array [-]
        Relative permeability of the wall, >= 1.

    Returns
    -------
    complex or array [ohm]
        ``Z_s = (rho/delta)(P + jQ)``: (active + j reactive) power entering unit outer surface
        is ``Z_s |H_surface|**2`` (RMS); the reactive part includes the bore. ``Re, Im > 0``.

    Raises
    ------
    ValueError
        For an invalid argument.

    References
    ----------
    J. Davies, Conduction and Induction Heating, Peter Peregrinus (IEE), 1990: tubular load.
    """
    a, b = _check_radii(outer_radius, inner_radius)
    rho = v.positive("resistivity", resistivity, "ohm m")
    mu = v.at_least("mu_r", mu_r, 1.0, "-")
    delta = _skin_depth(rho, frequency, mu)
    return v.scalar_or_array(rho / delta * _tube_zeta(a / delta, b / delta, mu))


def tube_power_per_area(h_surface, outer_radius, inner_radius, resistivity, frequency, mu_r=1.0):
    """Time-averaged induced power per unit outer surface of a long tube with an empty bore.

    Parameters
    ----------
    h_surface : float or array [A/m]
        RMS axial field at the outer surface, >= 0.
    outer_radius, inner_radius : float or array [m]
        Radii, ``0 < inner_radius < outer_radius``.
    resistivity : float or array [ohm m]
        Electrical resistivity of the wall, > 0.
    frequency : float or array [Hz]
        Frequency, > 0.
    mu_r : float or array [-]
        Relative permeability of the wall, >= 1.

    Returns
    -------
    float or array [W/m2]
        ``p = (rho H**2/delta) P``.

    Raises
    ------
    ValueError
        For an invalid argument.

    Notes
    -----
    Infinitely long tube, nothing conducting in the bore, uniform wall properties.

    References
    ----------
    J. Davies, Conduction and Induction Heating, Peter Peregrinus (IEE), 1990: tubular load.
    """
    h = v.non_negative("h_surface", h_surface, "A/m")
    z = tube_surface_impedance(outer_radius, inner_radius, resistivity, frequency, mu_r)
    return v.scalar_or_array(h**2 * np.real(z))
