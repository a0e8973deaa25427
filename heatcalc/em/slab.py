"""Plate (slab) in a uniform tangential alternating field, equal on both faces (analytic).

Sign convention
---------------
RMS phasors, time dependence ``exp(j omega t)``. The plate has full thickness ``d`` and occupies
``-d/2 <= x <= d/2`` (``x`` measured from the mid-plane); the applied field ``H_z`` is
tangential and equal to ``h_surface`` (real, the phase reference) on both faces. Inside,
``H_z(x) = h_surface cosh(alpha x) / cosh(alpha d/2)`` with ``alpha = (1 + j)/delta``. The induced
current is ``J_y = -dH_z/dx``.

The complex power entering each face per unit area is ``Z_s |h_surface|**2`` with
``Z_s = rho H_z'(d/2)/H_z(d/2) = rho alpha tanh(alpha d/2) = (rho/delta) (F + jG)``, where
``F = (sinh x - sin x)/(cosh x + cos x)`` and ``G = (sinh x + sin x)/(cosh x + cos x)``,
``x = d/delta`` (:func:`slab_power_factors`).
"""

from __future__ import annotations

import numpy as np
from scipy.special import factorial

from heatcalc import _checks as v
from heatcalc.em._bessel import ONE_PLUS_J
from heatcalc.em.skin import skin_depth as _skin_depth

__all__ = [
    "slab_field",
    "slab_current_density",
    "slab_power_density",
    "slab_power_per_area",
    "slab_surface_impedance",
    "slab_power_factors",
]

# Below x = d/delta = 2 the hyperbolic/trigonometric combinations cancel (sinh x - sin x ~ x**3/3),
# so their power series, all of whose terms are positive, are summed instead. 10 terms of
# x**(4k + n)/(4k + n)! leave a relative remainder below 1e-30 for x <= 2.
_SERIES_LIMIT = 2.0
_K = np.arange(10)
_COSH_COS = 1.0 / factorial(4 * _K)  # (cosh x + cos x)/2
_SINH_PLUS_SIN = 1.0 / factorial(4 * _K + 1)  # (sinh x + sin x)/(2x)
_SINH_MINUS_SIN = 1.0 / factorial(4 * _K + 3)  # (sinh x - sin x)/(2x**3)


def _series(coefficients: np.ndarray, x4: np.ndarray) -> np.ndarray:
    total = np.zeros_like(x4)
    for c in coefficients[::-1]:
        total = total * x4 + c
    return total


def _slab_zeta(x: np.ndarray) -> np.ndarray:
    """``F + jG`` for ``x = thickness/skin_depth`` (> 0, checked by the caller)."""
    x = np.asarray(x, dtype=float)
    f = np.empty(x.shape)
    g = np.empty(x.shape)
    small = x <= _SERIES_LIMIT
    if np.any(small):
        xs = x[small]
        x4 = xs**4
        denominator = _series(_COSH_COS, x4)
        f[small] = xs**3 * _series(_SINH_MINUS_SIN, x4) / denominator
        g[small] = xs * _series(_SINH_PLUS_SIN, x4) / denominator
    large = ~small
    if np.any(large):
        xl = x[large]
        e1 = np.exp(-xl)
        e2 = e1 * e1
        denominator = 1.0 + e2 + 2.0 * np.cos(xl) * e1
        f[large] = (1.0 - e2 - 2.0 * np.sin(xl) * e1) / denominator
        g[large] = (1.0 - e2 + 2.0 * np.sin(xl) * e1) / denominator
    return f + 1j * g


def _half_and_position(x, thickness):
    d = v.positive("thickness", thickness, "m")
    xx = v.real_array("x", x, "m")
    v.within("x", xx, -d / 2.0, "-thickness/2", d / 2.0, "thickness/2")
    return xx, d / 2.0


def _profiles(x: np.ndarray, half: np.ndarray, delta: np.ndarray):
    """``cosh(alpha x)/cosh(alpha h)`` and ``sinh(alpha x)/cosh(alpha h)`` without overflow."""
    x, half, delta = np.broadcast_arrays(x, half, delta)
    s = np.abs(x) / delta
    hh = half / delta
    u = ONE_PLUS_J
    decay = np.exp(-u * hh)
    denominator = 1.0 + decay * decay
    cosh_ratio = np.empty(x.shape, dtype=complex)
    sinh_ratio = np.empty(x.shape, dtype=complex)
    # Near the mid-plane use sinh/cosh directly (their difference form would cancel);
    # deeper than 20 skin depths from the mid-plane the exponential form cannot overflow.
    near = s < 20.0
    cosh_ratio[near] = 2.0 * decay[near] * np.cosh(u * s[near])
    sinh_ratio[near] = 2.0 * decay[near] * np.sinh(u * s[near])
    far = ~near
    grow = np.exp(u * (s[far] - hh[far]))
    fall = np.exp(-u * (s[far] + hh[far]))
    cosh_ratio[far] = grow + fall
    sinh_ratio[far] = grow - fall
    return cosh_ratio / denominator, np.sign(x) * sinh_ratio / denominator


def slab_field(x, thickness, skin_depth):
    """Complex field ratio ``H(x)/H_surface`` in a plate with equal fields on both faces.

    Parameters
    ----------
    x : float or array [m]
        Position from the mid-plane, ``-thickness/2 <= x <= thickness/2``.
    thickness : float or array [m]
        Full plate thickness, > 0.
    skin_depth : float or array [m]
        Skin depth, > 0.

    Returns
    -------
    complex or array [-]
        ``cosh(alpha x)/cosh(alpha thickness/2)``, ``alpha = (1 + j)/skin_depth``.

    Raises
    ------
    ValueError
        If thickness or skin_depth is not > 0 or x lies outside the plate.

    References
    ----------
    J. Davies, Conduction and Induction Heating, Peter Peregrinus (IEE), 1990: plate in a
    uniform field, the functions F and G of thickness/skin depth.
    """
    xx, half = _half_and_position(x, thickness)
    delta = v.positive("skin_depth", skin_depth, "m")
    return v.scalar_or_array(_profiles(xx, half, delta)[0])


def slab_current_density(x, h_surface, thickness, resistivity, frequency, mu_r=1.0):
    """Complex current density ``J_y(x)`` in a plate with equal fields on both faces.

    Parameters
    ----------
    x : float or array [m]
        Position from the mid-plane, ``|x| <= thickness/2``.
    h_surface : float or array [A/m]
        RMS tangential field on each face, >= 0 (phase reference).
    thickness : float or array [m]
        Full plate thickness, > 0.
    resistivity : float or array [ohm m]
        Electrical resistivity, > 0.
    frequency : float or array [Hz]
        Frequency, > 0.
    mu_r : float or array [-]
        Relative permeability, >= 1.

    Returns
    -------
    complex or array [A/m2]
        RMS phasor ``J_y = -dH_z/dx = -h_surface alpha sinh(alpha x)/cosh(alpha thickness/2)``;
        odd in ``x`` (the currents on the two faces flow in opposite directions).

    Raises
    ------
    ValueError
        For an invalid argument.

    References
    ----------
    J. Davies, Conduction and Induction Heating, Peter Peregrinus (IEE), 1990: plate in a
    uniform field, the functions F and G of thickness/skin depth.
    """
    xx, half = _half_and_position(x, thickness)
    h = v.non_negative("h_surface", h_surface, "A/m")
    delta = _skin_depth(resistivity, frequency, mu_r)
    return v.scalar_or_array(-h * (ONE_PLUS_J / delta) * _profiles(xx, half, delta)[1])


def slab_power_density(x, h_surface, thickness, resistivity, frequency, mu_r=1.0):
    """Time-averaged power per unit volume ``rho |J|**2`` in a plate.

    Parameters
    ----------
    x, h_surface, thickness, resistivity, frequency, mu_r
        As for :func:`slab_current_density` (units m, A/m, m, ohm m, Hz, -).

    Returns
    -------
    float or array [W/m3]
        Power density; its integral over half the thickness equals
        :func:`slab_power_per_area`.

    Raises
    ------
    ValueError
        For an invalid argument.
    """
    j = slab_current_density(x, h_surface, thickness, resistivity, frequency, mu_r)
    return v.scalar_or_array(np.asarray(resistivity, dtype=float) * np.abs(j) ** 2)


def slab_power_factors(thickness_to_skin_depth):
    """Dimensionless active and reactive functions ``F`` and ``G`` of a plate.

    Parameters
    ----------
    thickness_to_skin_depth : float or array [-]
        ``x = thickness / skin_depth`` (full thickness), > 0.

    Returns
    -------
    F, G : float or array [-]
        ``F = (sinh x - sin x)/(cosh x + cos x)``, ``G = (sinh x + sin x)/(cosh x + cos x)``;
        active and reactive power per face are ``(rho H**2/delta) F`` and ``(rho H**2/delta) G``.

    Raises
    ------
    ValueError
        If thickness_to_skin_depth is not > 0.

    Notes
    -----
    ``F -> x**3/6`` and ``G -> x`` as ``x -> 0``; ``F, G -> 1`` as ``x -> infinity``;
    ``F`` has its maximum ``coth(pi/2) = 1.0903`` at ``x = pi``. Valid for all ``x > 0``
    (power series below ``x = 2``, exponentially scaled form above).

    References
    ----------
    J. Davies, Conduction and Induction Heating, Peter Peregrinus (IEE), 1990: plate in a
    uniform field, the functions F and G of thickness/skin depth.

    Examples
    --------
    >>> f, g = slab_power_factors(3.141592653589793)
    >>> round(float(f), 4), round(float(g), 4)
    (1.0903, 1.0903)
    """
    x = v.positive("thickness_to_skin_depth", thickness_to_skin_depth, "-")
    zeta = _slab_zeta(x)
    return v.scalar_or_array(zeta.real), v.scalar_or_array(zeta.imag)


def slab_surface_impedance(thickness, resistivity, frequency, mu_r=1.0):
    """Complex surface impedance of each face of a plate in equal fields on both faces.

    Parameters
    ----------
    thickness : float or array [m]
        Full plate thickness, > 0.
    resistivity : float or array [ohm m]
        Electrical resistivity, > 0.
    frequency : float or array [Hz]
        Frequency, > 0.
    mu_r : float or array [-]
        Relative permeability, >= 1.

    Returns
    -------
    complex or array [ohm]
        ``Z_s = (rho/delta)(F + jG)``: (active + j reactive) power entering unit area of one
        face is ``Z_s |H_surface|**2`` (RMS). ``Re, Im > 0``.

    Raises
    ------
    ValueError
        For an invalid argument.

    References
    ----------
    J. Davies, Conduction and Induction Heating, Peter Peregrinus (IEE), 1990: plate in a
    uniform field, the functions F and G of thickness/skin depth.
    """
    d = v.positive("thickness", thickness, "m")
    rho = v.positive("resistivity", resistivity, "ohm m")
    delta = _skin_depth(rho, frequency, mu_r)
    return v.scalar_or_array(rho / delta * _slab_zeta(d / delta))


def slab_power_per_area(h_surface, thickness, resistivity, frequency, mu_r=1.0):
    """Time-averaged induced power per unit area of each face of a plate.

    Parameters
    ----------
    h_surface : float or array [A/m]
        RMS tangential field on each face (equal on both), >= 0.
    thickness : float or array [m]
        Full plate thickness, > 0.
    resistivity : float or array [ohm m]
        Electrical resistivity, > 0.
    frequency : float or array [Hz]
        Frequency, > 0.
    mu_r : float or array [-]
        Relative permeability, >= 1.

    Returns
    -------
    float or array [W/m2]
        ``p = (rho H**2/delta) F(thickness/delta)`` on each face (the plate absorbs ``2 p``
        per unit of face area).

    Raises
    ------
    ValueError
        For an invalid argument.

    Notes
    -----
    Infinite plate, edge effects ignored, uniform properties.

    References
    ----------
    J. Davies, Conduction and Induction Heating, Peter Peregrinus (IEE), 1990: plate in a
    uniform field, the functions F and G of thickness/skin depth.
    """
    h = v.non_negative("h_surface", h_surface, "A/m")
    z = slab_surface_impedance(thickness, resistivity, frequency, mu_r)
    return v.scalar_or_array(h**2 * np.real(z))
