"""Matching the coil to a supply: number of turns, or a matching-transformer ratio.

The supply's voltage and current limits apply at the tank terminals (see
:func:`heatcalc.coil.supply.terminal_quantities`): a parallel tank is fed at the coil voltage,
a series tank carries the coil current, an uncompensated coil takes both directly.
Transformers are ideal.
"""

from __future__ import annotations

import dataclasses
from dataclasses import dataclass

import numpy as np
import pandas as pd

from heatcalc import _checks as c
from heatcalc.coil.circuit import CoilCircuitResult, coil_circuit
from heatcalc.coil.supply import _TERMINAL_ARRANGEMENTS, terminal_quantities

__all__ = ["TurnsChoice", "turns_for_supply", "TransformerRatio", "transformer_ratio_for_supply"]


@dataclass(frozen=True)
class TurnsChoice:
    """Candidate turn numbers for a supply and the one chosen.

    Attributes
    ----------
    table : pandas.DataFrame
        One row per candidate: turns, space factor, coil current and voltage, supply
        voltage and current, efficiency, power factor, whether the supply limits are met.
    turns : int or None
        Feasible candidate of highest coil efficiency; None if no candidate fits.
    reason : str
    """

    table: pd.DataFrame
    turns: int | None
    reason: str

    def _repr_html_(self) -> str:
        return f"<p>{self.reason}</p>" + self.table.to_html(index=False)


def turns_for_supply(
    coil,
    workpiece,
    frequency,
    workpiece_power,
    max_voltage,
    max_current,
    *,
    arrangement="parallel",
    candidates=None,
    **options,
) -> TurnsChoice:
    """Number of turns that lets a supply deliver the workpiece power within its limits.

    Parameters
    ----------
    coil : SolenoidCoil or RectangularSolenoidCoil
        Coil whose length, bore and tubing are kept; only the turns change.
    workpiece : CylinderWorkpiece, TubeWorkpiece or SlabWorkpiece
        The workpiece.
    frequency : float [Hz]
        Operating frequency, > 0.
    workpiece_power : float [W]
        Power to induce, > 0.
    max_voltage : float [V]
        Supply (tank) voltage limit, > 0.
    max_current : float [A]
        Supply (tank) current limit, > 0.
    arrangement : str
        ``"parallel"``, ``"series"`` or ``"uncompensated"`` (see :func:`terminal_quantities`).
    candidates : iterable of int, optional
        Turn numbers to try; default every number from 1 to the most that fit the length.
    **options
        ``method``, ``lead_impedance`` for the circuit.

    Returns
    -------
    TurnsChoice

    Raises
    ------
    ValueError
        For an invalid argument or a candidate whose turns do not fit the coil length.

    Notes
    -----
    With the tubing fixed, more turns raise the space factor: the workpiece resistance grows
    as ``N**2`` and the copper resistance as ``N``, so efficiency rises with ``N`` and the
    coil current at fixed power falls roughly as ``1/N``.
    """
    f = float(c.positive("frequency", frequency, "Hz"))
    p_w = float(c.positive("workpiece_power", workpiece_power, "W"))
    v_max = float(c.positive("max_voltage", max_voltage, "V"))
    i_max = float(c.positive("max_current", max_current, "A"))
    c.choice("arrangement", arrangement, _TERMINAL_ARRANGEMENTS)
    if candidates is None:
        most = int(np.floor(coil.length / coil.conductor.axial_width * (1.0 + 1e-12)))
        candidates = range(1, max(most, 1) + 1)
    rows = []
    for n in candidates:
        trial = dataclasses.replace(coil, turns=c.positive_integer("candidates", n))
        res = coil_circuit(trial, workpiece, f, workpiece_power=p_w, **options)
        v_s, i_s = terminal_quantities(res, arrangement)
        rows.append(
            {
                "turns": trial.turns,
                "space_factor": trial.space_factor,
                "coil_current": res.coil_current,
                "coil_voltage": res.coil_voltage,
                "supply_voltage": v_s,
                "supply_current": i_s,
                "efficiency": res.efficiency,
                "power_factor": res.power_factor,
                "within_limits": bool(v_s <= v_max and i_s <= i_max),
            }
        )
    table = pd.DataFrame(rows)
    if table.empty:
        raise ValueError(f"candidates must hold at least one turn number; got {candidates!r}")
    ok = table[table["within_limits"]]
    if ok.empty:
        over_v = bool((table["supply_voltage"] > v_max).all())
        over_i = bool((table["supply_current"] > i_max).all())
        limits = (
            " and ".join(name for name, hit in (("voltage", over_v), ("current", over_i)) if hit)
            or "voltage or current (no candidate meets both)"
        )
        return TurnsChoice(table, None, f"no candidate fits the supply {limits} limit")
    best = ok.loc[ok["efficiency"].idxmax()]
    reason = (
        f"{int(best['turns'])} turns: highest coil efficiency ({best['efficiency']:.3f}) "
        f"within {v_max:g} V and {i_max:g} A ({arrangement})"
    )
    return TurnsChoice(table, int(best["turns"]), reason)


@dataclass(frozen=True)
class TransformerRatio:
    """Matching-transformer turns ratio (supply side : coil side), ideal transformer.

    Attributes
    ----------
    min_ratio : float [-]
        Smallest ratio that keeps the supply current within its limit.
    max_ratio : float [-]
        Largest ratio that keeps the supply voltage within its limit.
    ratio : float or None [-]
        ``max_ratio`` (full supply voltage, least current) if ``min_ratio <= max_ratio``.
    """

    min_ratio: float
    max_ratio: float
    ratio: float | None


def transformer_ratio_for_supply(
    circuit: CoilCircuitResult, max_voltage, max_current, arrangement="parallel"
) -> TransformerRatio:
    """Turns ratio of a matching transformer between the supply and the tank.

    Parameters
    ----------
    circuit : CoilCircuitResult
        Coil operating point.
    max_voltage : float [V]
        Supply voltage limit, > 0.
    max_current : float [A]
        Supply current limit, > 0.
    arrangement : str
        As for :func:`terminal_quantities`.

    Returns
    -------
    TransformerRatio

    Raises
    ------
    ValueError
        For an invalid argument.

    Notes
    -----
    The supply sees ``a V_t`` and ``I_t / a`` for ratio ``a`` and tank voltage and current
    ``V_t, I_t``: ``I_t / I_max <= a <= V_max / V_t``. A ratio exists when the tank's
    volt-amperes fit the supply's, ``V_t I_t <= V_max I_max``.

    Examples
    --------
    >>> from heatcalc.coil import SolenoidCoil, RectangularTube, CylinderWorkpiece, coil_circuit
    >>> coil = SolenoidCoil(12, 0.3, 0.14, RectangularTube(0.02, 0.012, 0.0015), 1.9e-8)
    >>> res = coil_circuit(coil, CylinderWorkpiece(0.05, 0.3, 1.2e-6), 3e3, workpiece_power=1e5)
    >>> t = transformer_ratio_for_supply(res, 800.0, 400.0)
    >>> t.ratio == t.max_ratio
    True
    """
    v_max = float(c.positive("max_voltage", max_voltage, "V"))
    i_max = float(c.positive("max_current", max_current, "A"))
    v_t, i_t = terminal_quantities(circuit, arrangement)
    low, high = i_t / i_max, v_max / v_t
    return TransformerRatio(low, high, high if low <= high else None)
