"""Overflow-free modified Bessel function ratios for complex argument.

The field in a cylinder is ``I0(alpha r)`` with ``alpha = (1 + j)/delta`` (see
:mod:`heatcalc.em.cylinder`). ``I0`` grows like ``exp(r/delta)``, so it overflows for
``r/delta`` above about 700; everything here uses the exponentially scaled functions
``scipy.special.ive`` (``I_n(z) exp(-|Re z|)``) and ``kve`` (``K_n(z) exp(z)``) and puts the
exponential factors back as differences of exponents, which are never positive.

For small ``z`` the real part of ``I1(z)/I0(z) * (1 + j)`` is much smaller than its imaginary
part and comes out of the library with a relative error of about ``1e-16 / x**2``; below
``x = 1`` the power series is summed instead (it is exact to rounding there).
"""

from __future__ import annotations

import numpy as np
from scipy.special import factorial, ive

__all__ = ["ONE_PLUS_J", "cylinder_zeta", "i_ratio"]

ONE_PLUS_J = 1.0 + 1.0j

# Below this value of radius/skin depth the series is used for the surface impedance.
_SERIES_LIMIT = 1.0
# t = j x**2 / 2 has |t| <= 0.5 there; 16 terms leave a remainder below 1e-30.
_K = np.arange(16)
_C0 = 1.0 / factorial(_K) ** 2  # I0(u) = sum (u**2/4)**k / (k!)**2
_C1 = 1.0 / (factorial(_K) * factorial(_K + 1))  # I1(u) = (u/2) sum (u**2/4)**k / (k!(k+1)!)


def _horner(coefficients: np.ndarray, t: np.ndarray) -> np.ndarray:
    total = np.zeros_like(t)
    for c in coefficients[::-1]:
        total = total * t + c
    return total


def cylinder_zeta(x: np.ndarray) -> np.ndarray:
    """Dimensionless surface impedance ``P + jQ = (1 + j) I1(u)/I0(u)``, ``u = (1 + j) x``.

    ``x = radius / skin_depth`` (array, > 0, already checked by the caller).
    """
    x = np.asarray(x, dtype=float)
    out = np.empty(x.shape, dtype=complex)
    small = x <= _SERIES_LIMIT
    if np.any(small):
        xs = x[small]
        t = 0.5j * xs**2  # u**2 / 4
        # (1 + j) * (u/2) = (1 + j)**2 x / 2 = j x
        out[small] = 1j * xs * _horner(_C1, t) / _horner(_C0, t)
    large = ~small
    if np.any(large):
        u = ONE_PLUS_J * x[large]
        out[large] = ONE_PLUS_J * ive(1, u) / ive(0, u)
    return out


def i_ratio(order: int, r: np.ndarray, radius: np.ndarray, delta: np.ndarray) -> np.ndarray:
    """``I_order(alpha r) / I0(alpha radius)`` without overflow, ``alpha = (1 + j)/delta``."""
    alpha = ONE_PLUS_J / delta
    return ive(order, alpha * r) / ive(0, alpha * radius) * np.exp((r - radius) / delta)
