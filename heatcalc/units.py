"""Quantities with units at the boundary of heatcalc.

Everything below the job layer works in SI floats and numpy arrays (kelvin for temperatures).
This module is the single place where quantities with units are parsed, checked and converted,
and where numbers are formatted for display.

Accepted input for a quantity argument:

* a :class:`pint.Quantity` built with :data:`ureg` (``Q_(75, "mm")``),
* a string such as ``"75 mm"``, ``"3 in"``, ``"1200 degC"``, ``"450 kg/h"``, ``"25 kHz"``.

A bare number is refused: the unit of a job input must always be stated.

Examples
--------
>>> to_si("75 mm", "m", name="diameter")
0.075
>>> round(temperature("1200 degC", name="target"), 2)
1473.15
>>> round(temperature_difference("90 delta_degF", name="spread"), 6)
50.0
>>> format_value(0.0754, "length")
'75.4 mm'
"""

from __future__ import annotations

import math
import re
from numbers import Real

import numpy as np
import pint

__all__ = [
    "ureg",
    "Q_",
    "UnitsError",
    "parse_quantity",
    "to_si",
    "temperature",
    "temperature_difference",
    "format_value",
    "DISPLAY_UNITS",
]

#: The one unit registry of heatcalc; it is also set as pint's application registry so that
#: quantities made by users with ``pint.Quantity`` mix with ours.
ureg = pint.UnitRegistry(autoconvert_offset_to_baseunit=False)
ureg.formatter.default_format = "~P"
# reactive power: the var (IEC 60050-131) is dimensionally a volt-ampere
ureg.define("volt_ampere_reactive = volt * ampere = var")
pint.set_application_registry(ureg)
Q_ = ureg.Quantity


class UnitsError(ValueError):
    """A job input is missing its unit, has the wrong dimension, or cannot be parsed."""


def _describe(value) -> str:
    return repr(value) if isinstance(value, str) else str(value)


def parse_quantity(value, name: str) -> pint.Quantity:
    """Turn a job input into a pint quantity, refusing bare numbers.

    Parameters
    ----------
    value : pint.Quantity or str
        The input as given by the user, e.g. ``"75 mm"``.
    name : str
        The argument name, used in error messages.

    Raises
    ------
    UnitsError
        If `value` is a bare number, an unparsable string or another type.
    """
    if isinstance(value, pint.Quantity):
        return value
    if isinstance(value, bool) or isinstance(value, (Real, np.ndarray, list, tuple)):
        raise UnitsError(
            f"{name}={_describe(value)} has no unit; give a quantity with units, "
            f"for example {name}='75 mm' or Q_(75, 'mm')"
        )
    if isinstance(value, str):
        text = value.strip()
        match = _NUMBER_UNIT.match(text)
        if not match:
            raise UnitsError(
                f"{name}={text!r} could not be read; expected a number followed by a unit, "
                "such as '75 mm' or '1200 degC'"
            )
        number, unit_text = match.groups()
        if not unit_text:
            raise UnitsError(
                f"{name}={text!r} has no unit; expected a number with a unit such as '75 mm'"
            )
        try:
            # Number and unit are built separately so that offset units ('1200 degC') parse.
            return Q_(float(number), unit_text)
        except Exception as exc:  # pint raises several error types for unreadable units
            raise UnitsError(f"{name}={text!r} could not be read as a quantity: {exc}") from None
    raise UnitsError(
        f"{name}={_describe(value)} of type {type(value).__name__} is not a quantity; "
        "expected a string such as '75 mm' or a pint Quantity"
    )


_NUMBER_UNIT = re.compile(r"^([-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?)\s*(.*)$")


def to_si(value, unit: str, name: str):
    """Convert a job input to a float (or array) in `unit`, checking its dimension.

    Parameters
    ----------
    value : pint.Quantity or str
        The input, e.g. ``"3 in"``.
    unit : str
        Target unit, normally SI (``"m"``, ``"W"``, ``"Hz"``, ``"kg/s"``).
    name : str
        The argument name, used in error messages.

    Returns
    -------
    float or numpy.ndarray
        The magnitude in `unit`.

    Raises
    ------
    UnitsError
        Bare number, unparsable text, or a dimension other than that of `unit`.

    Examples
    --------
    >>> to_si("3 in", "m", name="diameter")
    0.0762
    >>> to_si("450 kg/h", "kg/s", name="throughput")
    0.125
    """
    q = parse_quantity(value, name)
    target = ureg.Unit(unit)
    if q.dimensionality != target.dimensionality:
        raise UnitsError(
            f"{name}={_describe(value)} has dimension {q.dimensionality}; "
            f"expected {target.dimensionality} (a quantity convertible to {unit})"
        )
    if _is_offset(q):
        raise UnitsError(
            f"{name}={_describe(value)} is an offset temperature; use temperature() for it"
        )
    mag = q.m_as(target)
    if isinstance(mag, np.ndarray):
        return mag.astype(float)
    return float(mag)


_OFFSET_UNITS = ("degree_Celsius", "degree_Fahrenheit")


def _is_offset(q: pint.Quantity) -> bool:
    return any(u in _OFFSET_UNITS for u in q._units)


def temperature(value, name: str):
    """Convert an absolute temperature (degC, degF, K, degR) to kelvin.

    Parameters
    ----------
    value : pint.Quantity or str
        For example ``"1200 degC"``, ``"2192 degF"``, ``Q_(1473.15, "K")``.
    name : str
        The argument name, used in error messages.

    Returns
    -------
    float or numpy.ndarray [K]

    Raises
    ------
    UnitsError
        Bare number, not a temperature, a temperature *difference* (``delta_degC``), or a value
        below absolute zero.
    """
    q = parse_quantity(value, name)
    if q.dimensionality != ureg.kelvin.dimensionality:
        raise UnitsError(
            f"{name}={_describe(value)} has dimension {q.dimensionality}; expected a temperature "
            "such as '1200 degC', '2192 degF' or '1473 K'"
        )
    if any(u.startswith("delta_") for u in q._units):
        raise UnitsError(
            f"{name}={_describe(value)} is a temperature difference; expected an absolute "
            "temperature such as '1200 degC'"
        )
    kelvin = q.to(ureg.kelvin).magnitude
    if np.any(np.asarray(kelvin) < 0):
        raise UnitsError(f"{name}={_describe(value)} is below absolute zero")
    if isinstance(kelvin, np.ndarray):
        return kelvin.astype(float)
    return float(kelvin)


def temperature_difference(value, name: str):
    """Convert a temperature difference to kelvin (no offset is applied).

    Accepts ``"50 K"``, ``"50 delta_degC"``, ``"90 delta_degF"``. A plain ``"50 degC"`` is
    refused because it is ambiguous (an absolute temperature of 50 degC is 323.15 K).

    Returns
    -------
    float or numpy.ndarray [K]

    Examples
    --------
    >>> temperature_difference("50 delta_degC", name="allowed_spread")
    50.0
    """
    q = parse_quantity(value, name)
    if q.dimensionality != ureg.kelvin.dimensionality:
        raise UnitsError(
            f"{name}={_describe(value)} has dimension {q.dimensionality}; expected a temperature "
            "difference such as '50 delta_degC' or '50 K'"
        )
    if _is_offset(q):
        raise UnitsError(
            f"{name}={_describe(value)} is an absolute (offset) temperature; a difference is "
            "expected: write e.g. '50 delta_degC' or '50 K'"
        )
    mag = q.to(ureg.kelvin).magnitude
    if isinstance(mag, np.ndarray):
        return mag.astype(float)
    return float(mag)


#: Display units by kind of quantity: (unit of the SI input, unit shown). Temperatures are
#: given in kelvin and shown in degC.
DISPLAY_UNITS = {
    "length": ("m", "mm"),
    "area": ("m**2", "cm**2"),
    "mass": ("kg", "kg"),
    "mass_rate": ("kg/s", "kg/h"),
    "time": ("s", "s"),
    "power": ("W", "kW"),
    "apparent_power": ("V*A", "kV*A"),
    "reactive_power": ("V*A", "kvar"),
    "power_density": ("W/m**3", "W/mm**3"),
    "power_per_area": ("W/m**2", "W/mm**2"),
    "energy": ("J", "kWh"),
    "specific_energy": ("J/kg", "kWh/t"),
    "frequency": ("Hz", "kHz"),
    "temperature": ("K", "degC"),
    "temperature_difference": ("K", "K"),
    "voltage": ("V", "V"),
    "current": ("A", "A"),
    "field": ("A/m", "kA/m"),
    "resistance": ("ohm", "mohm"),
    "inductance": ("H", "uH"),
    "capacitance": ("F", "uF"),
    "velocity": ("m/s", "m/s"),
    "volume_rate": ("m**3/s", "L/min"),
    "pressure": ("Pa", "bar"),
    "resistivity": ("ohm*m", "uohm*m"),
    "speed": ("m/s", "mm/s"),
}

_SYMBOLS = {
    "kV*A": "kVA",
    "uohm*m": "µΩ·m",
    "mohm": "mΩ",
    "uH": "µH",
    "uF": "µF",
    "W/mm**2": "W/mm²",
    "kW/cm**2": "kW/cm²",
    "W/mm**3": "W/mm³",
    "cm**2": "cm²",
    "degC": "°C",
}


def _round_sig(x: float, sig: int) -> str:
    if x == 0 or not math.isfinite(x):
        return f"{x:g}"
    digits = sig - int(math.floor(math.log10(abs(x)))) - 1
    if digits <= 0:
        return f"{round(x, digits):.0f}"
    return f"{x:.{digits}f}"


def format_value(value_si: float, kind: str, sig: int = 3, unit: str | None = None) -> str:
    """Format an SI number for display with a sensible unit and significant figures.

    Parameters
    ----------
    value_si : float
        The value in the SI unit of `kind` (kelvin for temperatures).
    kind : str
        A key of :data:`DISPLAY_UNITS` ("length", "power", "temperature", ...).
    sig : int
        Significant figures (temperatures in degC are shown to whole degrees or `sig`
        figures, whichever keeps more).
    unit : str, optional
        Display unit overriding the default of `kind`.

    Examples
    --------
    >>> format_value(25e3, "frequency")
    '25.0 kHz'
    >>> format_value(1473.15, "temperature")
    '1200 °C'
    >>> format_value(1.062e6, "specific_energy")
    '295 kWh/t'
    """
    if kind not in DISPLAY_UNITS:
        raise ValueError(f"kind={kind!r} is not known; expected one of {sorted(DISPLAY_UNITS)}")
    si_unit, shown = DISPLAY_UNITS[kind]
    if unit is None and kind == "frequency" and abs(value_si) < 1e3:
        shown = "Hz"  # mains and low medium frequencies read better in Hz
    shown = unit or shown
    if kind == "temperature":
        mag = Q_(float(value_si), ureg.kelvin).to(shown).magnitude
        text = f"{mag:.0f}" if abs(mag) >= 10 else _round_sig(mag, sig)
    else:
        mag = Q_(float(value_si), si_unit).to(shown).magnitude
        text = _round_sig(mag, sig)
    return f"{text} {_SYMBOLS.get(shown, shown)}"
