"""Inductance of single-layer solenoids: Nagaoka's coefficient and the return-flux path.

A single-layer solenoid is idealised as a uniform current sheet of diameter ``D`` and length
``l``. Its inductance is the long-coil value ``mu_0 N**2 A / l`` (``A = pi D**2 / 4``) times
Nagaoka's coefficient ``K(D/l)``, which falls from 1 (infinitely long coil) towards 0 (a flat
ring). The shortfall is the reluctance of the path the flux takes outside the coil to close
on itself; :func:`return_path_inductance` expresses it as an inductance in parallel with the
interior flux path, which is how :mod:`heatcalc.coil.circuit` corrects short coils.
"""

from __future__ import annotations

import numpy as np
from scipy.constants import mu_0, pi
from scipy.special import ellipe, elliprd

from heatcalc import _checks as c

__all__ = ["nagaoka", "empty_coil_inductance", "return_path_inductance"]


def nagaoka(diameter, length):
    """Nagaoka's coefficient of a single-layer solenoid (current sheet).

    Parameters
    ----------
    diameter : float or array [m]
        Diameter of the current sheet, > 0.
    length : float or array [m]
        Axial length of the current sheet, > 0.

    Returns
    -------
    float or array [-]
        ``K`` in (0, 1), broadcast over the arguments; ``L = K mu_0 N**2 (pi D**2 / 4) / l``.

    Raises
    ------
    ValueError
        If diameter or length is not finite and > 0.

    Notes
    -----
    Exact form with complete elliptic integrals of modulus ``k``:

    ``K = 4 / (3 pi k') [ (k'**2 / k**2) (K(k) - E(k)) + E(k) - k ]``,
    ``k**2 = D**2 / (D**2 + l**2)``, ``k' = sqrt(1 - k**2)``.

    The difference ``K(k) - E(k)`` loses all accuracy for long coils (``k -> 0``); it is
    evaluated as ``(k**2 / 3) R_D(0, k'**2, 1)`` with Carlson's symmetric integral
    (``scipy.special.elliprd``), so no cancellation occurs. ``scipy.special.ellipe`` takes the
    parameter ``m = k**2``. Valid for any ``D/l > 0``. For flat coils the bracket is a small
    difference of terms near 1: the relative rounding error grows as about
    ``1e-16 (D/l)**2`` (1e-12 at ``D/l = 100``, 1e-9 at ``D/l = 1e4``). The current-sheet
    idealisation assumes a closely wound coil (pitch small against diameter and length).

    References
    ----------
    H. Nagaoka, "The inductance coefficients of solenoids", J. Coll. Sci. Tokyo 27, 1909.
    F. W. Grover, Inductance Calculations, Van Nostrand, 1946, ch. 14 (tables of K).
    B. C. Carlson, "Numerical computation of real or complex elliptic integrals",
    Numer. Algorithms 10, 1995 (``R_D``).

    Examples
    --------
    Grover's table value for a coil as long as it is wide:

    >>> round(float(nagaoka(0.1, 0.1)), 4)
    0.6884
    """
    d = c.positive("diameter", diameter, "m")
    length_ = c.positive("length", length, "m")
    d, length_ = np.broadcast_arrays(d, length_)
    hyp2 = d * d + length_ * length_
    m = d * d / hyp2  # parameter m = k**2 as scipy expects
    kp2 = length_ * length_ / hyp2  # k'**2, computed without subtracting from 1
    k = d / np.sqrt(hyp2)
    kp = length_ / np.sqrt(hyp2)
    # (k'^2/k^2) (K - E) = k'^2 R_D(0, k'^2, 1) / 3
    bracket = kp2 * elliprd(0.0, kp2, 1.0) / 3.0 + ellipe(m) - k
    return c.scalar_or_array(4.0 / (3.0 * pi * kp) * bracket)


def empty_coil_inductance(diameter, length, turns):
    """Inductance of an empty single-layer solenoid, ``K mu_0 N**2 (pi D**2 / 4) / l``.

    Parameters
    ----------
    diameter : float or array [m]
        Current-sheet diameter, > 0.
    length : float or array [m]
        Coil length, > 0.
    turns : float or array [-]
        Number of turns, > 0 (fractional values allowed for sweeps).

    Returns
    -------
    float or array [H]
        Inductance of the current sheet (the conductor's own internal inductance excluded).

    Raises
    ------
    ValueError
        If any argument is not finite and > 0.

    Notes
    -----
    For ``l >> D``, ``K -> 1`` and the result tends to the long-solenoid value
    ``mu_0 N**2 A / l``.

    References
    ----------
    F. W. Grover, Inductance Calculations, Van Nostrand, 1946, ch. 14.

    Examples
    --------
    >>> round(float(empty_coil_inductance(0.1, 0.1, 10)) * 1e6, 3)
    6.794
    """
    d = c.positive("diameter", diameter, "m")
    length_ = c.positive("length", length, "m")
    n = c.positive("turns", turns, "-")
    area = pi * d * d / 4.0
    return c.scalar_or_array(nagaoka(d, length_) * mu_0 * n * n * area / length_)


def return_path_inductance(diameter, length, turns):
    """Inductance that represents the return-flux path outside a short solenoid.

    Parameters
    ----------
    diameter : float or array [m]
        Current-sheet diameter, > 0.
    length : float or array [m]
        Coil length, > 0.
    turns : float or array [-]
        Number of turns, > 0.

    Returns
    -------
    float or array [H]
        ``L_r = L_inf K / (1 - K)`` with ``L_inf = mu_0 N**2 (pi D**2 / 4) / l``.

    Raises
    ------
    ValueError
        If any argument is not finite and > 0.

    Notes
    -----
    Magnetic-circuit view of a solenoid: the ampere-turns ``N I`` drive the flux through the
    interior reluctance ``l / (mu_0 A)`` and, in series, through the reluctance ``R_r`` of the
    return path outside the coil. In the electrical equivalent circuit series reluctances
    become parallel inductances, ``L = N**2 / (R_i + R_r)``. Choosing ``R_r`` so that the
    empty coil has Nagaoka's inductance ``K L_inf`` gives ``L_r = N**2 / R_r = L_inf K/(1-K)``.
    ``L_inf`` in parallel with ``L_r`` returns ``K L_inf`` exactly. ``L_r`` grows without
    bound as the coil becomes long (``K -> 1``).

    References
    ----------
    R. M. Baker, "Design and calculation of induction-heating coils", AIEE Trans. Part II,
    76, 1957 (return-path reactance in parallel with the coil interior; from memory).

    Examples
    --------
    >>> l_inf = float(empty_coil_inductance(0.1, 0.1, 10) / nagaoka(0.1, 0.1))
    >>> l_r = float(return_path_inductance(0.1, 0.1, 10))
    >>> round(l_inf * l_r / (l_inf + l_r) * 1e6, 3)
    6.794
    """
    d = c.positive("diameter", diameter, "m")
    length_ = c.positive("length", length, "m")
    n = c.positive("turns", turns, "-")
    k = nagaoka(d, length_)
    l_inf = mu_0 * n * n * (pi * d * d / 4.0) / length_
    return c.scalar_or_array(l_inf * k / (1.0 - k))
