"""Temperature tables with strict range checks and vectorised linear interpolation."""

from __future__ import annotations

import warnings
from dataclasses import dataclass, field

import numpy as np

__all__ = ["OutOfRangeError", "ExtrapolationWarning", "PropertyTable"]


class OutOfRangeError(ValueError):
    """A temperature lies outside the range of a material's property table."""


class ExtrapolationWarning(UserWarning):
    """A property was extrapolated beyond its table because the caller asked for it."""


@dataclass(frozen=True)
class PropertyTable:
    """One property of one material as a function of temperature.

    Parameters
    ----------
    material : str
        Material key (for messages).
    quantity : str
        Property name, e.g. ``"resistivity"``.
    temperature : numpy.ndarray [K]
        Strictly increasing, except that a temperature may appear twice in a row to mark a
        jump (melting of a pure metal). At the jump itself the value *before* the jump is used.
    value : numpy.ndarray [SI]
        Values at `temperature`.
    unit : str
        SI unit of `value` (for display).
    sources : tuple of str
        Source key for each point.
    """

    material: str
    quantity: str
    temperature: np.ndarray
    value: np.ndarray
    unit: str
    sources: tuple[str, ...] = field(default=())

    def __post_init__(self):
        t = np.asarray(self.temperature, dtype=float)
        v = np.asarray(self.value, dtype=float)
        if t.ndim != 1 or t.shape != v.shape or t.size < 1:
            raise ValueError(
                f"{self.material}.{self.quantity}: temperature and value must be 1-D arrays of "
                f"equal length; got shapes {t.shape} and {v.shape}"
            )
        if not np.all(np.isfinite(t)) or not np.all(np.isfinite(v)):
            raise ValueError(f"{self.material}.{self.quantity}: table holds non-finite numbers")
        dt = np.diff(t)
        if np.any(dt < 0):
            raise ValueError(
                f"{self.material}.{self.quantity}: temperatures must increase; got {t.tolist()}"
            )
        if np.any((dt[1:] == 0) & (dt[:-1] == 0)):
            raise ValueError(
                f"{self.material}.{self.quantity}: a temperature may appear at most twice "
                "(to mark a jump)"
            )
        object.__setattr__(self, "temperature", t)
        object.__setattr__(self, "value", v)

    @property
    def t_min(self) -> float:
        return float(self.temperature[0])

    @property
    def t_max(self) -> float:
        return float(self.temperature[-1])

    def __call__(self, temperature, extrapolate: bool = False):
        """Value at `temperature` [K] (float or array), linear between table points.

        Raises
        ------
        OutOfRangeError
            If any temperature lies outside the table and `extrapolate` is False.
        """
        t = np.asarray(temperature, dtype=float)
        if np.any(~np.isfinite(t)):
            raise ValueError(f"temperature={temperature!r} holds non-finite values")
        lo, hi = self.t_min, self.t_max
        outside = (t < lo - 1e-9) | (t > hi + 1e-9)
        if np.any(outside):
            bad = t[outside]
            worst = bad.flat[np.argmax(np.abs(bad - np.clip(bad, lo, hi)))]
            msg = (
                f"{self.material}: {self.quantity} asked at {worst:.2f} K "
                f"({worst - 273.15:.1f} degC); the table covers {lo:.2f} K to {hi:.2f} K "
                f"({lo - 273.15:.1f} to {hi - 273.15:.1f} degC)"
            )
            if not extrapolate:
                raise OutOfRangeError(msg + "; pass extrapolate=True to extrapolate with a warning")
            warnings.warn(msg + "; extrapolated linearly", ExtrapolationWarning, stacklevel=3)
        out = self._interp(t)
        return float(out) if out.ndim == 0 else out

    def _interp(self, t: np.ndarray) -> np.ndarray:
        x, y = self.temperature, self.value
        if x.size == 1:
            return np.full_like(t, y[0])
        # Segment index: the segment [x[i], x[i+1]] holding t, taking the segment *before* a
        # jump at the jump temperature (side='left'), and never a zero-length segment.
        i = np.searchsorted(x, t, side="left") - 1
        i = np.clip(i, 0, x.size - 2)
        # Inside the table x[i] < t <= x[i+1] cannot hold on a zero-length segment; only an
        # extrapolated point next to a jump at a table end can land on one: step off it.
        zero = x[i + 1] == x[i]
        i = np.where(zero, np.where(i == 0, i + 1, i - 1), i)
        x0, x1, y0, y1 = x[i], x[i + 1], y[i], y[i + 1]
        return y0 + (y1 - y0) * (t - x0) / (x1 - x0)
