"""Input checks shared by the coil and supply functions.

Every check raises :class:`ValueError` with a message that names the argument, quotes the
offending value and says what was expected, for example::

    length must be > 0 [m]; got -0.1

Arrays are checked element by element. Nothing is clamped or replaced.
"""

from __future__ import annotations

import numbers

import numpy as np

__all__ = [
    "real",
    "positive",
    "non_negative",
    "fraction",
    "positive_integer",
    "choice",
    "complex_value",
    "scalar_or_array",
]


def _first_bad(values: np.ndarray, bad: np.ndarray) -> str:
    if values.ndim == 0:
        return f"got {values.item()!r}"
    index = tuple(int(i) for i in np.argwhere(bad)[0])
    shown = index[0] if len(index) == 1 else index
    return f"got {values[index].item()!r} at index {shown}"


def real(name: str, value, unit: str) -> np.ndarray:
    """Return ``value`` as a float array; raise unless it is real, numeric and finite."""
    if isinstance(value, bool | np.bool_):
        raise ValueError(f"{name} must be a real number [{unit}]; got {value!r}")
    try:
        arr = np.asarray(value)
    except Exception as exc:  # pragma: no cover - numpy raises many kinds here
        raise ValueError(f"{name} must be a real number [{unit}]; got {value!r}") from exc
    if arr.dtype == object or not np.issubdtype(arr.dtype, np.number):
        raise ValueError(f"{name} must be a real number [{unit}]; got {value!r}")
    if np.iscomplexobj(arr):
        raise ValueError(f"{name} must be real, not complex [{unit}]; got {value!r}")
    arr = arr.astype(float)
    bad = ~np.isfinite(arr)
    if np.any(bad):
        raise ValueError(f"{name} must be finite [{unit}]; {_first_bad(arr, bad)}")
    return arr


def positive(name: str, value, unit: str) -> np.ndarray:
    """Return ``value`` as a float array, every element finite and > 0."""
    arr = real(name, value, unit)
    bad = ~(arr > 0.0)
    if np.any(bad):
        raise ValueError(f"{name} must be > 0 [{unit}]; {_first_bad(arr, bad)}")
    return arr


def non_negative(name: str, value, unit: str) -> np.ndarray:
    """Return ``value`` as a float array, every element finite and >= 0."""
    arr = real(name, value, unit)
    bad = ~(arr >= 0.0)
    if np.any(bad):
        raise ValueError(f"{name} must be >= 0 [{unit}]; {_first_bad(arr, bad)}")
    return arr


def fraction(name: str, value, *, allow_zero: bool = False) -> np.ndarray:
    """Return ``value`` as a float array in (0, 1] (or [0, 1] with ``allow_zero``)."""
    arr = real(name, value, "-")
    low_ok = arr >= 0.0 if allow_zero else arr > 0.0
    bad = ~(low_ok & (arr <= 1.0))
    if np.any(bad):
        interval = "[0, 1]" if allow_zero else "(0, 1]"
        raise ValueError(f"{name} must lie in {interval} [-]; {_first_bad(arr, bad)}")
    return arr


def positive_integer(name: str, value) -> int:
    """Return ``value`` as an int >= 1; raise for non-integers, bools and values < 1."""
    if isinstance(value, bool | np.bool_) or not isinstance(value, numbers.Integral):
        raise ValueError(f"{name} must be a whole number >= 1; got {value!r}")
    if value < 1:
        raise ValueError(f"{name} must be a whole number >= 1; got {value!r}")
    return int(value)


def choice(name: str, value, options) -> str:
    """Return ``value`` if it is one of ``options`` (exact match), else raise."""
    if value not in options:
        listed = ", ".join(repr(o) for o in options)
        raise ValueError(f"{name} must be one of {listed}; got {value!r}")
    return value


def complex_value(name: str, value, unit: str) -> np.ndarray:
    """Return ``value`` as a complex array; raise unless numeric and finite."""
    if isinstance(value, bool | np.bool_):
        raise ValueError(f"{name} must be a number [{unit}]; got {value!r}")
    arr = np.asarray(value)
    if arr.dtype == object or not np.issubdtype(arr.dtype, np.number):
        raise ValueError(f"{name} must be a number [{unit}]; got {value!r}")
    arr = arr.astype(complex)
    bad = ~np.isfinite(arr)
    if np.any(bad):
        raise ValueError(f"{name} must be finite [{unit}]; {_first_bad(arr, bad)}")
    return arr


def scalar_or_array(result):
    """Return a numpy scalar for a 0-d result, the array otherwise."""
    result = np.asarray(result)
    return result[()] if result.ndim == 0 else result
