"""Input checks shared by the electromagnetic functions.

Every check raises :class:`ValueError` with a message that names the argument, shows the
offending value and says what was expected, for example::

    resistivity must be > 0 [ohm m]; got -1e-08

Arrays are checked element by element; the message quotes the first offending element, its
index and how many elements fail. Nothing is clamped or replaced.
"""

from __future__ import annotations

import numpy as np

__all__ = [
    "real_array",
    "positive",
    "non_negative",
    "at_least",
    "less_than",
    "within",
    "scalar_or_array",
]


def _describe(name: str, values: np.ndarray, bad: np.ndarray) -> str:
    """Quote the first bad element of ``values`` (mask ``bad``) for an error message."""
    if values.ndim == 0:
        return f"got {values.item()!r}"
    index = tuple(int(i) for i in np.argwhere(bad)[0])
    shown = index[0] if len(index) == 1 else index
    count = int(np.count_nonzero(bad))
    return (
        f"got {values[index].item()!r} at index {shown} "
        f"({count} of {values.size} elements of {name} fail)"
    )


def real_array(name: str, value, unit: str) -> np.ndarray:
    """Return ``value`` as a float array; raise if it is not real, numeric and finite."""
    try:
        arr = np.asarray(value)
    except Exception as exc:  # pragma: no cover - numpy raises many kinds here
        raise ValueError(f"{name} must be a real number [{unit}]; got {value!r}") from exc
    if arr.dtype == object or not (
        np.issubdtype(arr.dtype, np.number) or np.issubdtype(arr.dtype, np.bool_)
    ):
        raise ValueError(f"{name} must be a real number [{unit}]; got {value!r}")
    if np.iscomplexobj(arr):
        raise ValueError(f"{name} must be real, not complex [{unit}]; got {value!r}")
    arr = arr.astype(float, copy=False)
    bad = ~np.isfinite(arr)
    if np.any(bad):
        raise ValueError(f"{name} must be finite [{unit}]; {_describe(name, arr, bad)}")
    return arr


def positive(name: str, value, unit: str) -> np.ndarray:
    """Return ``value`` as a float array, every element finite and > 0."""
    arr = real_array(name, value, unit)
    bad = ~(arr > 0.0)
    if np.any(bad):
        raise ValueError(f"{name} must be > 0 [{unit}]; {_describe(name, arr, bad)}")
    return arr


def non_negative(name: str, value, unit: str) -> np.ndarray:
    """Return ``value`` as a float array, every element finite and >= 0."""
    arr = real_array(name, value, unit)
    bad = ~(arr >= 0.0)
    if np.any(bad):
        raise ValueError(f"{name} must be >= 0 [{unit}]; {_describe(name, arr, bad)}")
    return arr


def at_least(name: str, value, minimum: float, unit: str) -> np.ndarray:
    """Return ``value`` as a float array, every element finite and >= ``minimum``."""
    arr = real_array(name, value, unit)
    bad = ~(arr >= minimum)
    if np.any(bad):
        raise ValueError(f"{name} must be >= {minimum:g} [{unit}]; {_describe(name, arr, bad)}")
    return arr


def less_than(name: str, value: np.ndarray, other_name: str, other: np.ndarray) -> None:
    """Raise unless ``value < other`` everywhere (after broadcasting)."""
    value_b, other_b = np.broadcast_arrays(value, other)
    bad = ~(value_b < other_b)
    if np.any(bad):
        index = tuple(np.argwhere(bad)[0]) if bad.ndim else ()
        raise ValueError(
            f"{name} must be < {other_name}; got {name}={value_b[index].item()!r} with "
            f"{other_name}={other_b[index].item()!r}"
        )


def within(name: str, value: np.ndarray, low, low_name: str, high, high_name: str) -> None:
    """Raise unless ``low <= value <= high`` everywhere (after broadcasting); no tolerance."""
    value_b, low_b, high_b = np.broadcast_arrays(value, low, high)
    bad = ~((value_b >= low_b) & (value_b <= high_b))
    if np.any(bad):
        index = tuple(np.argwhere(bad)[0]) if bad.ndim else ()
        raise ValueError(
            f"{name} must lie in [{low_name}, {high_name}] = "
            f"[{low_b[index].item()!r}, {high_b[index].item()!r}]; "
            f"got {value_b[index].item()!r}"
        )


def scalar_or_array(result: np.ndarray):
    """Return a numpy scalar for a 0-d result, the array otherwise."""
    result = np.asarray(result)
    return result[()] if result.ndim == 0 else result
