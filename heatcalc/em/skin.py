"""Skin depth of a conductor in an alternating magnetic field.

Conventions used throughout :mod:`heatcalc.em`
----------------------------------------------
* Phasors are RMS values with time dependence ``exp(j omega t)``, ``omega = 2 pi f``.
* Inside a conductor of resistivity ``rho`` and relative permeability ``mu_r`` the field obeys
  the diffusion equation ``laplacian(H) = alpha**2 H`` with
  ``alpha = (1 + j) / delta`` and ``alpha**2 = j omega mu_0 mu_r / rho``.
* ``delta`` is the skin depth returned by :func:`skin_depth`.
"""

from __future__ import annotations

import numpy as np
from scipy.constants import mu_0, pi

from heatcalc import _checks as v

__all__ = ["skin_depth", "frequency_for_skin_depth"]


def skin_depth(resistivity, frequency, mu_r=1.0):
    """Skin depth of a conductor.

    Parameters
    ----------
    resistivity : float or array [ohm m]
        Electrical resistivity, > 0.
    frequency : float or array [Hz]
        Supply frequency, > 0.
    mu_r : float or array [-]
        Relative magnetic permeability, >= 1.

    Returns
    -------
    float or array [m]
        Skin depth, broadcast over the arguments.

    Raises
    ------
    ValueError
        If resistivity or frequency is not > 0, or mu_r < 1.

    Notes
    -----
    ``delta = sqrt(2 rho / (omega mu_0 mu_r)) = sqrt(rho / (pi f mu_0 mu_r))``. The field
    amplitude in a thick conductor falls by 1/e over one skin depth. Valid while the
    displacement current is negligible (f << 1/(rho eps_0), always the case for metals).

    References
    ----------
    J. Davies, Conduction and Induction Heating, Peter Peregrinus, 1990, ch. 2.

    Examples
    --------
    Copper at 20 degC (1.678e-8 ohm m) at 60 Hz:

    >>> round(float(skin_depth(1.678e-8, 60.0)) * 1e3, 2)
    8.42
    """
    rho = v.positive("resistivity", resistivity, "ohm m")
    f = v.positive("frequency", frequency, "Hz")
    mu = v.at_least("mu_r", mu_r, 1.0, "-")
    return v.scalar_or_array(np.sqrt(rho / (pi * f * mu_0 * mu)))


def frequency_for_skin_depth(skin_depth, resistivity, mu_r=1.0):
    """Frequency at which a conductor has a given skin depth.

    Parameters
    ----------
    skin_depth : float or array [m]
        Wanted skin depth, > 0.
    resistivity : float or array [ohm m]
        Electrical resistivity, > 0.
    mu_r : float or array [-]
        Relative magnetic permeability, >= 1.

    Returns
    -------
    float or array [Hz]
        ``f = rho / (pi mu_0 mu_r delta**2)``, the inverse of :func:`skin_depth`.

    Raises
    ------
    ValueError
        If skin_depth or resistivity is not > 0, or mu_r < 1.

    Examples
    --------
    >>> f = frequency_for_skin_depth(2e-3, 1.2e-6)
    >>> round(float(f))
    75991
    """
    delta = v.positive("skin_depth", skin_depth, "m")
    rho = v.positive("resistivity", resistivity, "ohm m")
    mu = v.at_least("mu_r", mu_r, 1.0, "-")
    return v.scalar_or_array(rho / (pi * mu_0 * mu * delta**2))
