"""Argument checks shared by :mod:`heatcalc.thermal`.

Every check raises :class:`ValueError` whose message names the argument, quotes the offending
value and says what was expected, for example ``emissivity must lie in [0, 1] [-]; got 1.2``.
Arrays are checked element by element; nothing is clamped or replaced.
"""

from __future__ import annotations

import numpy as np

__all__ = [
    "real",
    "positive",
    "non_negative",
    "kelvin",
    "fraction",
    "choice",
    "material",
    "scalar_or_array",
]


def _first_bad(name: str, arr: np.ndarray, bad: np.ndarray) -> str:
    if arr.ndim == 0:
        return f"got {arr.item()!r}"
    idx = tuple(int(i) for i in np.argwhere(bad)[0])
    shown = idx[0] if len(idx) == 1 else idx
    return (
        f"got {arr[idx].item()!r} at index {shown} "
        f"({int(np.count_nonzero(bad))} of {arr.size} elements of {name} fail)"
    )


def real(name: str, value, unit: str) -> np.ndarray:
    """``value`` as a finite float array, else ValueError."""
    try:
        arr = np.asarray(value)
    except Exception as exc:  # pragma: no cover - numpy raises many kinds here
        raise ValueError(f"{name} must be a real number [{unit}]; got {value!r}") from exc
    if arr.dtype == object or not np.issubdtype(arr.dtype, np.number):
        raise ValueError(f"{name} must be a real number [{unit}]; got {value!r}")
    if np.iscomplexobj(arr):
        raise ValueError(f"{name} must be real, not complex [{unit}]; got {value!r}")
    arr = arr.astype(float, copy=False)
    bad = ~np.isfinite(arr)
    if np.any(bad):
        raise ValueError(f"{name} must be finite [{unit}]; {_first_bad(name, arr, bad)}")
    return arr


def positive(name: str, value, unit: str) -> np.ndarray:
    """Finite and > 0 everywhere."""
    arr = real(name, value, unit)
    bad = ~(arr > 0)
    if np.any(bad):
        raise ValueError(f"{name} must be > 0 [{unit}]; {_first_bad(name, arr, bad)}")
    return arr


def non_negative(name: str, value, unit: str) -> np.ndarray:
    """Finite and >= 0 everywhere."""
    arr = real(name, value, unit)
    bad = ~(arr >= 0)
    if np.any(bad):
        raise ValueError(f"{name} must be >= 0 [{unit}]; {_first_bad(name, arr, bad)}")
    return arr


def kelvin(name: str, value) -> np.ndarray:
    """A temperature in kelvin: finite and > 0."""
    arr = real(name, value, "K")
    bad = ~(arr > 0)
    if np.any(bad):
        raise ValueError(
            f"{name} must be an absolute temperature > 0 [K]; {_first_bad(name, arr, bad)}"
        )
    return arr


def fraction(name: str, value) -> np.ndarray:
    """A number in [0, 1] (emissivity)."""
    arr = real(name, value, "-")
    bad = ~((arr >= 0) & (arr <= 1))
    if np.any(bad):
        raise ValueError(f"{name} must lie in [0, 1] [-]; {_first_bad(name, arr, bad)}")
    return arr


def choice(name: str, value, options) -> str:
    """One of a fixed set of strings."""
    if value not in options:
        raise ValueError(f"{name}={value!r} is not known; expected one of {sorted(options)}")
    return value


def material(value):
    """A :class:`~heatcalc.materials.Material`, or a library key turned into one."""
    from heatcalc import materials

    if isinstance(value, materials.Material):
        return value
    if isinstance(value, str):
        try:
            return materials.get(value)
        except KeyError as exc:
            raise ValueError(str(exc.args[0])) from None
    raise ValueError(f"material must be a Material or a library key; got {value!r}")


def scalar_or_array(result):
    """A Python float for a 0-d result, the array otherwise."""
    result = np.asarray(result)
    return float(result) if result.ndim == 0 else result
