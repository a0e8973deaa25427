"""Shared machinery of the job calculations: input conversion, checks, results.

A job module defines

* a frozen dataclass of inputs whose fields are quantities with units (strings such as
  ``"80 mm"`` or pint quantities), plain strings (material keys) or numbers where the quantity
  is dimensionless; the class lists, in ``UNITS``, the kind of every dimensional field;
* one function that converts the inputs to SI once (:func:`convert`), runs the calculation in the
  core layers, and returns a result object derived from :class:`JobResult`.
"""

from __future__ import annotations

import contextlib
import dataclasses
import math
import warnings
from dataclasses import dataclass, field

import numpy as np
import pandas as pd

from ..record import Check
from ..units import format_value, parse_quantity, temperature, temperature_difference, to_si

__all__ = [
    "Check",
    "HandCheck",
    "JobResult",
    "JobWarning",
    "convert",
    "input_table",
    "positive",
]

#: Field kinds understood by :func:`convert`: kind -> (SI unit or special, display kind).
_KINDS = {
    "length": "m",
    "mass": "kg",
    "mass_rate": "kg/s",
    "time": "s",
    "power": "W",
    "frequency": "Hz",
    "voltage": "V",
    "current": "A",
    "power_per_area": "W/m**2",
    "thermal_conductivity": "W/(m*K)",
    "heat_transfer_coefficient": "W/(m**2*K)",
    "speed": "m/s",
    "rate": "1/s",
    "volume_rate": "m**3/s",
    "pressure": "Pa",
    "temperature": None,
    "temperature_difference": None,
}


class JobWarning(UserWarning):
    """An assumption of a job calculation is stretched; the result needs a second look."""


def convert(inputs, units: dict[str, str]) -> dict[str, float]:
    """Convert the dimensional fields of a job-input dataclass to SI floats (kelvin).

    Parameters
    ----------
    inputs : dataclass instance
        The job inputs.
    units : dict
        Field name -> kind (a key of the module's kind table, e.g. ``"length"``).

    Raises
    ------
    heatcalc.units.UnitsError
        Naming the field, the value and the expected dimension.
    """
    out = {}
    for name, kind in units.items():
        value = getattr(inputs, name)
        if value is None:
            out[name] = None
            continue
        if kind == "temperature":
            out[name] = temperature(value, name=name)
        elif kind == "temperature_difference":
            out[name] = temperature_difference(value, name=name)
        elif kind == "frequency_list":
            vals = [value] if isinstance(value, str) else list(value)
            out[name] = [to_si(v, "Hz", name=name) for v in vals]
        else:
            out[name] = to_si(value, _KINDS[kind], name=name)
    return out


def positive(values: dict, *names: str, allow_zero: bool = False) -> None:
    """Raise ValueError naming the argument if any of `names` is not positive."""
    for n in names:
        v = values[n]
        if v is None:
            continue
        bad = (v < 0) if allow_zero else (v <= 0)
        if not np.isfinite(v) or bad:
            want = "zero or positive" if allow_zero else "positive"
            raise ValueError(f"{n}={v!r} (SI) must be {want}")


def input_table(inputs, descriptions: dict[str, str] | None = None) -> pd.DataFrame:
    """Echo of the inputs as given (with their units) and their description."""
    rows = []
    for f in dataclasses.fields(inputs):
        v = getattr(inputs, f.name)
        if hasattr(v, "units"):
            text = f"{v:~P}"
        elif isinstance(v, (list, tuple)):
            text = ", ".join(str(x) for x in v)
        else:
            text = str(v)
        rows.append(
            {
                "input": f.name,
                "value": text,
                "description": (descriptions or {}).get(f.name, f.metadata.get("doc", "")),
            }
        )
    return pd.DataFrame(rows)


@dataclass(frozen=True)
class HandCheck:
    """A result a practitioner can re-derive by hand: the formula and the figures."""

    quantity: str
    formula: str
    value: str


@dataclass
class JobResult:
    """Base of the result objects: tables, checks, warnings, hand checks, display."""

    title: str = ""
    assumptions: list[str] = field(default_factory=list)
    checks: list[Check] = field(default_factory=list)
    warnings: list[str] = field(default_factory=list)
    hand_checks: list[HandCheck] = field(default_factory=list)
    sources: list[str] = field(default_factory=list)

    # subclasses fill `summary_rows` with (quantity, SI value, display kind) triples
    def summary_rows(self) -> list[tuple[str, float, str]]:  # pragma: no cover - abstract
        raise NotImplementedError

    def warn(self, message: str) -> None:
        """Record a warning in the result and emit it as a :class:`JobWarning`."""
        self.warnings.append(message)
        warnings.warn(message, JobWarning, stacklevel=3)

    @contextlib.contextmanager
    def collecting(self, *categories):
        """Collect warnings of `categories` raised by the core layers into this result.

        Each distinct message becomes an entry of :attr:`warnings` (and a
        :class:`JobWarning`), so that a stretched model assumption reported deep in the core
        (e.g. the coil's end correction) reaches the record.
        """
        with warnings.catch_warnings(record=True) as caught:
            warnings.simplefilter("always")
            yield
        for w in caught:
            if issubclass(w.category, categories) and str(w.message) not in self.warnings:
                self.warn(str(w.message))
            elif not issubclass(w.category, categories):
                warnings.warn_explicit(w.message, w.category, w.filename, w.lineno)

    def summary(self) -> pd.DataFrame:
        """The main results with display units (quantity, value)."""
        rows = []
        for q, v, kind in self.summary_rows():
            if kind == "text":
                shown = str(v)
            elif kind == "-":
                shown = _plain(v)
            elif kind == "%":
                shown = f"{100 * v:.1f} %"
            elif isinstance(kind, tuple):
                shown = format_value(v, kind[0], unit=kind[1])
            else:
                shown = format_value(v, kind)
            rows.append({"quantity": q, "value": shown})
        return pd.DataFrame(rows)

    def checks_frame(self) -> pd.DataFrame:
        return pd.DataFrame(
            [
                {
                    "check": c.name,
                    "result": c.value,
                    "limit": c.limit,
                    "verdict": "PASS" if c.passed else "FAIL",
                    "note": c.note,
                }
                for c in self.checks
            ],
            columns=["check", "result", "limit", "verdict", "note"],
        )

    def hand_checks_frame(self) -> pd.DataFrame:
        return pd.DataFrame(
            [dataclasses.asdict(h) for h in self.hand_checks],
            columns=["quantity", "formula", "value"],
        )

    @property
    def all_passed(self) -> bool:
        return all(c.passed for c in self.checks)

    def _repr_html_(self) -> str:
        parts = [f"<h3>{self.title}</h3>", self.summary().to_html(index=False)]
        if self.checks:
            parts += ["<h4>Checks</h4>", self.checks_frame().to_html(index=False)]
        if self.warnings:
            items = "".join(f"<li>{w}</li>" for w in self.warnings)
            parts += [f"<h4>Warnings</h4><ul>{items}</ul>"]
        return "\n".join(parts)


def _plain(v) -> str:
    if isinstance(v, (int, np.integer)):
        return str(int(v))
    if isinstance(v, float) and math.isfinite(v):
        return f"{v:.3g}"
    return str(v)


def quantity_text(value) -> str:
    """The text of an input value as the user gave it."""
    if isinstance(value, str):
        return value
    return f"{parse_quantity(value, 'value'):~P}"
