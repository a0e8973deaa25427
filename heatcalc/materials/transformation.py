"""Transformation temperatures of hypoeutectoid steels from their composition.

Notes
-----
Andrews' empirical formulae (temperatures in degC, composition in mass %), valid for low-alloy
steels with C < 0.6 %, Mn < 4.9 %, Cr < 5 %, Ni < 5 %, Mo < 5.4 %:

.. math::

    A_{c1} = 723 - 10.7\\,Mn - 16.9\\,Ni + 29.1\\,Si + 16.9\\,Cr + 290\\,As + 6.38\\,W

    A_{c3} = 910 - 203\\sqrt{C} - 15.2\\,Ni + 44.7\\,Si + 104\\,V + 31.5\\,Mo + 13.1\\,W

These are equilibrium-like (slow heating) values. Induction hardening heats in seconds and needs
a higher austenitising temperature (commonly 50-150 K above Ac3; common practice, no source).

References
----------
K. W. Andrews, "Empirical formulae for the calculation of some transformation temperatures",
J. Iron Steel Inst. 203 (1965) 721-727.
"""

from __future__ import annotations

import math

__all__ = ["ac1_andrews", "ac3_andrews", "ANDREWS_LIMITS"]

#: Composition limits of Andrews' data set [mass %].
ANDREWS_LIMITS = {"C": 0.6, "Mn": 4.9, "Cr": 5.0, "Ni": 5.0, "Mo": 5.4}

_KNOWN = {"C", "Mn", "Si", "Cr", "Ni", "Mo", "V", "W", "As", "Cu", "P", "S"}


def _check(composition: dict[str, float]) -> dict[str, float]:
    if not isinstance(composition, dict):
        raise ValueError(f"composition={composition!r} must be a dict of element -> mass %")
    out = {}
    for el, v in composition.items():
        if el not in _KNOWN:
            raise ValueError(f"composition element {el!r} is not known; expected {sorted(_KNOWN)}")
        if not (isinstance(v, (int, float)) and 0 <= v <= 30):
            raise ValueError(f"composition[{el!r}]={v!r} must be a mass % between 0 and 30")
        out[el] = float(v)
    for el, lim in ANDREWS_LIMITS.items():
        if out.get(el, 0.0) > lim:
            raise ValueError(
                f"composition[{el!r}]={out[el]} % is beyond Andrews' data set (<= {lim} %)"
            )
    return out


def ac1_andrews(composition: dict[str, float]) -> float:
    """Lower critical temperature Ac1 [K] after Andrews (1965).

    Examples
    --------
    >>> round(ac1_andrews({"C": 0.45, "Mn": 0.75, "Si": 0.25}) - 273.15, 1)
    722.3
    """
    c = _check(composition)
    g = c.get
    t = (
        723
        - 10.7 * g("Mn", 0)
        - 16.9 * g("Ni", 0)
        + 29.1 * g("Si", 0)
        + 16.9 * g("Cr", 0)
        + 290 * g("As", 0)
        + 6.38 * g("W", 0)
    )
    return t + 273.15


def ac3_andrews(composition: dict[str, float]) -> float:
    """Upper critical temperature Ac3 [K] after Andrews (1965).

    Examples
    --------
    >>> round(ac3_andrews({"C": 0.45, "Mn": 0.75, "Si": 0.25}) - 273.15, 1)
    784.99
    """
    c = _check(composition)
    if "C" not in c or c["C"] <= 0:
        raise ValueError("composition must give a carbon content 'C' > 0 for Ac3")
    g = c.get
    t = (
        910
        - 203 * math.sqrt(c["C"])
        - 15.2 * g("Ni", 0)
        + 44.7 * g("Si", 0)
        + 104 * g("V", 0)
        + 31.5 * g("Mo", 0)
        + 13.1 * g("W", 0)
    )
    return t + 273.15
