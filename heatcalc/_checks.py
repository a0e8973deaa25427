"""Argument checks shared by the core layers (:mod:`heatcalc.em`, :mod:`heatcalc.thermal`,
:mod:`heatcalc.coil`).

Every check raises :class:`ValueError` whose message names the argument, quotes the offending
value and says what was expected, for example::

    resistivity must be > 0 [ohm m]; got -1e-08

Arrays are checked element by element; the message quotes the first offending element, its
index and how many elements fail. Nothing is clamped or replaced.
"""

from __future__ import annotations

import numbers

import numpy as np

__all__ = [
    "real",
    "real_array",
    "positive",
    "non_negative",
    "at_least",
    "less_than",
    "within",
    "kelvin",
    "fraction",
    "positive_integer",
    "choice",
    "complex_value",
    "material",
    "scalar_or_array",
    "float_or_array",
]


def _first_bad(name: str, values: np.ndarray, bad: np.ndarray) -> str:
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


def real(name: str, value, unit: str) -> np.ndarray:
    """``value`` as a finite float array; raise unless it is real and numeric (no bools)."""
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
    arr = arr.astype(float, copy=False)
    bad = ~np.isfinite(arr)
    if np.any(bad):
        raise ValueError(f"{name} must be finite [{unit}]; {_first_bad(name, arr, bad)}")
    return arr


real_array = real


def positive(name: str, value, unit: str) -> np.ndarray:
    """``value`` as a float array, every element finite and > 0."""
    arr = real(name, value, unit)
    bad = ~(arr > 0.0)
    if np.any(bad):
        raise ValueError(f"{name} must be > 0 [{unit}]; {_first_bad(name, arr, bad)}")
    return arr


def non_negative(name: str, value, unit: str) -> np.ndarray:
    """``value`` as a float array, every element finite and >= 0."""
    arr = real(name, value, unit)
    bad = ~(arr >= 0.0)
    if np.any(bad):
        raise ValueError(f"{name} must be >= 0 [{unit}]; {_first_bad(name, arr, bad)}")
    return arr


def at_least(name: str, value, minimum: float, unit: str) -> np.ndarray:
    """``value`` as a float array, every element finite and >= ``minimum``."""
    arr = real(name, value, unit)
    bad = ~(arr >= minimum)
    if np.any(bad):
        raise ValueError(f"{name} must be >= {minimum:g} [{unit}]; {_first_bad(name, arr, bad)}")
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


def kelvin(name: str, value) -> np.ndarray:
    """An absolute temperature in kelvin: finite and > 0."""
    arr = real(name, value, "K")
    bad = ~(arr > 0)
    if np.any(bad):
        raise ValueError(
            f"{name} must be an absolute temperature > 0 [K]; {_first_bad(name, arr, bad)}"
        )
    return arr


def fraction(name: str, value, *, allow_zero: bool = False) -> np.ndarray:
    """``value`` as a float array in (0, 1], or in [0, 1] with ``allow_zero``."""
    arr = real(name, value, "-")
    low_ok = arr >= 0.0 if allow_zero else arr > 0.0
    bad = ~(low_ok & (arr <= 1.0))
    if np.any(bad):
        interval = "[0, 1]" if allow_zero else "(0, 1]"
        raise ValueError(f"{name} must lie in {interval} [-]; {_first_bad(name, arr, bad)}")
    return arr


def positive_integer(name: str, value) -> int:
    """``value`` as an int >= 1; raise for non-integers, bools and values < 1."""
    if isinstance(value, bool | np.bool_) or not isinstance(value, numbers.Integral):
        raise ValueError(f"{name} must be a whole number >= 1; got {value!r}")
    if value < 1:
        raise ValueError(f"{name} must be a whole number >= 1; got {value!r}")
    return int(value)


def choice(name: str, value, options) -> str:
    """``value`` if it is one of ``options`` (exact match), else raise."""
    if value not in options:
        listed = ", ".join(repr(o) for o in options)
        raise ValueError(f"{name}={value!r} is not known; {name} must be one of {listed}")
    return value


def complex_value(name: str, value, unit: str) -> np.ndarray:
    """``value`` as a complex array; raise unless numeric and finite."""
    if isinstance(value, bool | np.bool_):
        raise ValueError(f"{name} must be a number [{unit}]; got {value!r}")
    arr = np.asarray(value)
    if arr.dtype == object or not np.issubdtype(arr.dtype, np.number):
        raise ValueError(f"{name} must be a number [{unit}]; got {value!r}")
    arr = arr.astype(complex)
    bad = ~np.isfinite(arr)
    if np.any(bad):
        raise ValueError(f"{name} must be finite [{unit}]; {_first_bad(name, arr, bad)}")
    return arr


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
    """A numpy scalar for a 0-d result, the array otherwise."""
    result = np.asarray(result)
    return result[()] if result.ndim == 0 else result


def float_or_array(result):
    """A Python float for a 0-d result, the array otherwise."""
    result = np.asarray(result)
    return float(result) if result.ndim == 0 else result
