"""Supply side of the coil: capacitor compensation, resonance and supply rating.

The coil is an inductive impedance ``Z = R + jX``. A capacitor ``C`` in parallel (voltage-fed
tank) or in series (current-fed tank) brings the power factor at the tank terminals to 1:

* parallel: ``Im(1/Z + j omega C) = 0`` gives ``C = X / (omega (R**2 + X**2))``; the tank
  then presents ``R_in = (R**2 + X**2) / R`` at the coil voltage.
* series: ``X = 1 / (omega C)`` gives ``C = 1 / (omega X)``; the tank presents ``R`` and
  carries the coil current.

Capacitors and transformers are taken as ideal (lossless) unless their losses are listed in
``other_losses`` of :func:`supply_rating`.

References
----------
Any circuit-theory text for the RL-C resonance conditions, e.g. J. W. Nilsson and S. A.
Riedel, Electric Circuits, Prentice Hall (parallel and series resonance; from memory).
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np
import pandas as pd
from scipy.constants import pi
from scipy.optimize import brentq

from heatcalc import _checks as c
from heatcalc.coil.circuit import CoilCircuitResult, coil_impedance

__all__ = [
    "ARRANGEMENTS",
    "compensation_capacitance",
    "compensated_impedance",
    "CapacitorBank",
    "capacitor_bank",
    "resonant_frequency",
    "coil_resonant_frequency",
    "terminal_quantities",
    "SupplyRating",
    "supply_rating",
]

ARRANGEMENTS = ("parallel", "series")
_TERMINAL_ARRANGEMENTS = ("parallel", "series", "uncompensated")


def compensation_capacitance(resistance, reactance, frequency, arrangement="parallel"):
    """Capacitance that brings an inductive impedance to unity power factor.

    Parameters
    ----------
    resistance : float or array [ohm]
        Coil resistance ``R``, >= 0.
    reactance : float or array [ohm]
        Coil reactance ``X``, > 0 (inductive).
    frequency : float or array [Hz]
        Design frequency, > 0.
    arrangement : str
        ``"parallel"`` or ``"series"``.

    Returns
    -------
    float or array [F]
        Parallel: ``X / (omega (R**2 + X**2))``; series: ``1 / (omega X)``.

    Raises
    ------
    ValueError
        For an invalid argument.

    Examples
    --------
    >>> round(float(compensation_capacitance(0.0, 1.0, 1e3)) * 1e6, 3)
    159.155
    """
    r = c.non_negative("resistance", resistance, "ohm")
    x = c.positive("reactance", reactance, "ohm")
    omega = 2.0 * pi * c.positive("frequency", frequency, "Hz")
    c.choice("arrangement", arrangement, ARRANGEMENTS)
    if arrangement == "parallel":
        return c.scalar_or_array(x / (omega * (r * r + x * x)))
    return c.scalar_or_array(1.0 / (omega * x))


def compensated_impedance(impedance, capacitance, frequency, arrangement="parallel"):
    """Impedance of the coil with its capacitor, seen from the supply.

    Parameters
    ----------
    impedance : complex or array [ohm]
        Coil impedance ``Z`` at ``frequency``.
    capacitance : float or array [F]
        Capacitance, > 0.
    frequency : float or array [Hz]
        Frequency, > 0.
    arrangement : str
        ``"parallel"``: ``1 / (1/Z + j omega C)``; ``"series"``: ``Z + 1/(j omega C)``.

    Returns
    -------
    complex or array [ohm]

    Raises
    ------
    ValueError
        For an invalid argument.

    Examples
    --------
    >>> z = compensated_impedance(1 + 10j, 1 / (2 * 3.141592653589793 * 1e3 * 10), 1e3, "series")
    >>> round(float(abs(z)), 9)
    1.0
    """
    z = c.complex_value("impedance", impedance, "ohm")
    cap = c.positive("capacitance", capacitance, "F")
    omega = 2.0 * pi * c.positive("frequency", frequency, "Hz")
    c.choice("arrangement", arrangement, ARRANGEMENTS)
    if arrangement == "parallel":
        return c.scalar_or_array(1.0 / (1.0 / z + 1j * omega * cap))
    return c.scalar_or_array(z + 1.0 / (1j * omega * cap))


@dataclass(frozen=True)
class CapacitorBank:
    """Capacitor bank that compensates the coil at one frequency (SI units).

    Attributes
    ----------
    arrangement : str
    frequency : float [Hz]
    capacitance : float [F]
    reactive_power : float [var]
        Capacitor rating, ``omega C V_C**2``.
    capacitor_voltage : float [V]
    capacitor_current : float [A]
    input_impedance : complex [ohm]
        Tank impedance seen from the supply (real at the design frequency).
    """

    arrangement: str
    frequency: float
    capacitance: float
    reactive_power: float
    capacitor_voltage: float
    capacitor_current: float
    input_impedance: complex

    @property
    def input_power_factor(self) -> float:
        """Power factor seen by the supply [-]."""
        return self.input_impedance.real / abs(self.input_impedance)


def capacitor_bank(circuit: CoilCircuitResult, arrangement="parallel") -> CapacitorBank:
    """Size the capacitor bank for a coil operating point.

    Parameters
    ----------
    circuit : CoilCircuitResult
        Result of :func:`heatcalc.coil.circuit.coil_circuit`.
    arrangement : str
        ``"parallel"`` or ``"series"``.

    Returns
    -------
    CapacitorBank

    Raises
    ------
    ValueError
        If circuit is not a CoilCircuitResult or arrangement is unknown.
    """
    if not isinstance(circuit, CoilCircuitResult):
        raise ValueError(f"circuit must be a CoilCircuitResult; got {circuit!r}")
    c.choice("arrangement", arrangement, ARRANGEMENTS)
    f = circuit.frequency
    omega = 2.0 * pi * f
    cap = float(compensation_capacitance(circuit.resistance, circuit.reactance, f, arrangement))
    z = complex(circuit.resistance, circuit.reactance)
    if arrangement == "parallel":
        v_c = circuit.coil_voltage
        i_c = omega * cap * v_c
    else:
        i_c = circuit.coil_current
        v_c = i_c / (omega * cap)
    return CapacitorBank(
        arrangement=arrangement,
        frequency=f,
        capacitance=cap,
        reactive_power=v_c * i_c,
        capacitor_voltage=v_c,
        capacitor_current=i_c,
        input_impedance=complex(compensated_impedance(z, cap, f, arrangement)),
    )


def resonant_frequency(impedance, capacitance, arrangement, frequency_bounds):
    """Frequency at which a coil and capacitor present unity power factor.

    Parameters
    ----------
    impedance : callable
        ``impedance(frequency) -> complex`` coil impedance [ohm] at ``frequency`` [Hz].
    capacitance : float [F]
        Capacitance, > 0.
    arrangement : str
        ``"parallel"`` or ``"series"``.
    frequency_bounds : tuple of float [Hz]
        ``(low, high)`` with ``0 < low < high``; must bracket exactly the sign change of the
        reactive part.

    Returns
    -------
    float [Hz]
        Root of ``Im(Z_in) = 0`` found by Brent's method on ``log f`` (relative tolerance
        1e-12).

    Raises
    ------
    ValueError
        For invalid bounds or if the bounds do not bracket a resonance.

    Notes
    -----
    Parallel: ``Im(1/Z) + omega C = 0``; for a constant ``R, L`` this is
    ``omega**2 = 1/(L C) - R**2 / L**2``. Series: ``X - 1/(omega C) = 0``. The coil impedance
    varies with frequency through the skin depths, hence the numerical root.

    Examples
    --------
    >>> f = resonant_frequency(lambda f: 2j * 3.141592653589793 * f * 1e-6, 1e-6, "series",
    ...                        (1e3, 1e6))
    >>> round(f, 3)
    159154.943
    """
    if not callable(impedance):
        raise ValueError(f"impedance must be a callable of frequency; got {impedance!r}")
    cap = float(c.positive("capacitance", capacitance, "F"))
    c.choice("arrangement", arrangement, ARRANGEMENTS)
    bounds = c.positive("frequency_bounds", frequency_bounds, "Hz")
    if bounds.shape != (2,) or not bounds[0] < bounds[1]:
        raise ValueError(
            f"frequency_bounds must be (low, high) with low < high [Hz]; got {frequency_bounds!r}"
        )

    def reactive(log_f: float) -> float:
        f = float(np.exp(log_f))
        z = complex(impedance(f))
        omega = 2.0 * pi * f
        if arrangement == "parallel":
            return (1.0 / z).imag + omega * cap
        return z.imag - 1.0 / (omega * cap)

    lo, hi = np.log(bounds)
    g_lo, g_hi = reactive(lo), reactive(hi)
    if not g_lo * g_hi < 0.0:
        raise ValueError(
            f"frequency_bounds must bracket the resonance (reactive part changes sign); "
            f"got {frequency_bounds!r} with reactive parts {g_lo!r} and {g_hi!r}"
        )
    return float(np.exp(brentq(reactive, lo, hi, xtol=1e-14, rtol=1e-12)))


def coil_resonant_frequency(
    coil, workpiece, capacitance, arrangement, frequency_bounds, **options
) -> float:
    """Resonant frequency of a coil with its workpiece and a given capacitor.

    Parameters
    ----------
    coil, workpiece
        As for :func:`heatcalc.coil.circuit.coil_impedance`.
    capacitance : float [F]
        Capacitance, > 0.
    arrangement : str
        ``"parallel"`` or ``"series"``.
    frequency_bounds : tuple of float [Hz]
        Search interval ``(low, high)``.
    **options
        ``method``, ``lead_impedance`` for :func:`heatcalc.coil.circuit.coil_impedance`.

    Returns
    -------
    float [Hz]

    Raises
    ------
    ValueError
        As for :func:`resonant_frequency`.
    """
    return resonant_frequency(
        lambda f: complex(coil_impedance(coil, workpiece, f, **options).total),
        capacitance,
        arrangement,
        frequency_bounds,
    )


def terminal_quantities(circuit: CoilCircuitResult, arrangement="parallel"):
    """Voltage and current the supply delivers to the tank at the design frequency.

    Parameters
    ----------
    circuit : CoilCircuitResult
        Coil operating point.
    arrangement : str
        ``"parallel"`` (voltage = coil voltage, current = input power / voltage),
        ``"series"`` (current = coil current, voltage = input power / current) or
        ``"uncompensated"`` (coil voltage and coil current).

    Returns
    -------
    voltage : float [V]
    current : float [A]

    Raises
    ------
    ValueError
        For an unknown arrangement.
    """
    c.choice("arrangement", arrangement, _TERMINAL_ARRANGEMENTS)
    if arrangement == "parallel":
        return circuit.coil_voltage, circuit.input_power / circuit.coil_voltage
    if arrangement == "series":
        return circuit.input_power / circuit.coil_current, circuit.coil_current
    return circuit.coil_voltage, circuit.coil_current


_RATING_ROWS = (
    ("workpiece power", "workpiece_power", "W"),
    ("coil copper loss", "copper_loss", "W"),
    ("lead loss", "lead_loss", "W"),
    ("other losses", "other_losses", "W"),
    ("required supply power", "required_power", "W"),
    ("margin", "margin", "-"),
    ("supply power rating", "power_rating", "W"),
    ("supply apparent-power rating", "apparent_power_rating", "VA"),
    ("capacitor bank", "capacitor_reactive_power", "var"),
)


@dataclass(frozen=True)
class SupplyRating:
    """Supply rating for a coil operating point (SI units; ``to_frame()`` for a table)."""

    arrangement: str
    workpiece_power: float
    copper_loss: float
    lead_loss: float
    other_losses: float
    required_power: float
    margin: float
    power_rating: float
    apparent_power_rating: float
    capacitor_reactive_power: float

    def to_frame(self) -> pd.DataFrame:
        """Table with columns quantity, value, unit."""
        rows = [(label, float(getattr(self, name)), unit) for label, name, unit in _RATING_ROWS]
        rows.insert(0, ("arrangement", self.arrangement, "-"))
        return pd.DataFrame(rows, columns=["quantity", "value", "unit"])

    def _repr_html_(self) -> str:
        return self.to_frame().to_html(index=False)


def supply_rating(
    circuit: CoilCircuitResult, arrangement="parallel", margin=0.1, other_losses=0.0
) -> SupplyRating:
    """Power and apparent-power rating of the supply, with a margin.

    Parameters
    ----------
    circuit : CoilCircuitResult
        Coil operating point.
    arrangement : str
        ``"parallel"``, ``"series"`` (compensated, unity power factor) or ``"uncompensated"``.
    margin : float [-]
        Fractional margin added to the ratings, >= 0 (0.1 = 10 %).
    other_losses : float [W]
        Further losses the supply covers (transformer, capacitors, cables), >= 0.

    Returns
    -------
    SupplyRating

    Raises
    ------
    ValueError
        For an invalid argument.

    Notes
    -----
    Required power = workpiece power + copper loss + lead loss + other losses. Compensated
    tanks draw it at unity power factor, so the apparent-power rating equals the power
    rating; an uncompensated coil adds its reactive power ``Q``:
    ``S = (1 + margin) sqrt(P**2 + Q**2)``.
    """
    if not isinstance(circuit, CoilCircuitResult):
        raise ValueError(f"circuit must be a CoilCircuitResult; got {circuit!r}")
    c.choice("arrangement", arrangement, _TERMINAL_ARRANGEMENTS)
    m = float(c.non_negative("margin", margin, "-"))
    other = float(c.non_negative("other_losses", other_losses, "W"))
    required = circuit.input_power + other
    if arrangement == "uncompensated":
        apparent = (1.0 + m) * float(np.hypot(required, circuit.reactive_power))
        q_cap = 0.0
    else:
        apparent = (1.0 + m) * required
        q_cap = capacitor_bank(circuit, arrangement).reactive_power
    return SupplyRating(
        arrangement=arrangement,
        workpiece_power=circuit.workpiece_power,
        copper_loss=circuit.copper_loss,
        lead_loss=circuit.lead_loss,
        other_losses=other,
        required_power=required,
        margin=m,
        power_rating=(1.0 + m) * required,
        apparent_power_rating=apparent,
        capacitor_reactive_power=q_cap,
    )
