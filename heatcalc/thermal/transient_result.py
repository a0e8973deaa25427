"""Result object of the radial transient heating solver."""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np
import pandas as pd

__all__ = ["TransientResult", "WHERE"]

#: Columns of :attr:`TransientResult.series` accepted by :meth:`TransientResult.time_to_reach`.
WHERE = ("surface", "centre", "mean")


@dataclass(frozen=True, eq=False)
class TransientResult:
    """Histories, profiles and energy balance of a radial transient heating run.

    All energies and powers are per unit heated surface area (W/m2, J/m2); multiply by
    :attr:`surface_per_length` for values per metre of a cylinder or tube.

    Attributes
    ----------
    material : str
    geometry : str
        ``"cylinder"``, ``"tube"`` or ``"slab"``.
    nodes : ndarray [m]
        Radial positions (distance from the mid-plane for the slab); the last is the surface.
    series : pandas.DataFrame
        Indexed by ``time`` [s], one row per step and one at t = 0: ``surface``, ``centre``
        (axis, bore wall of a tube, or mid-plane) and ``mean`` (mass-weighted) temperatures
        [K]; ``power`` absorbed and ``loss`` at the surface [W/m2], averaged over the step
        ending at that time (0 in the first row, where no step ends); ``h_surface`` RMS
        surface field [A/m] (NaN without induction, 0 at zero power); ``segment`` index and
        ``label``; cumulative ``energy_in``, ``energy_lost``, ``energy_stored`` [J/m2]. The
        mean is the mass-weighted mean temperature; with a temperature-dependent heat
        capacity it can rise slightly while the enthalpy falls.
    profiles : pandas.DataFrame
        Temperature [K] at the nodes (index ``position`` [m]), one column per requested time.
    energy_in, energy_lost, energy_stored : float [J/m2]
        Totals; ``energy_stored`` from the enthalpy change of the final state.
    field_solves : int
        Number of induced-current solutions made.
    newton_iterations : int
        Total conduction iterations.
    """

    material: str
    geometry: str
    nodes: np.ndarray
    series: pd.DataFrame
    profiles: pd.DataFrame
    energy_in: float
    energy_lost: float
    energy_stored: float
    field_solves: int = 0
    newton_iterations: int = 0

    @property
    def surface_per_length(self) -> float:
        """Heated surface per unit length [m2/m] (``2 pi r_s``; 1 for a slab, per face)."""
        return 1.0 if self.geometry == "slab" else 2.0 * np.pi * float(self.nodes[-1])

    @property
    def closure_error(self) -> float:
        """``(in - lost - stored)/in`` [-] of the whole run."""
        scale = self.energy_in if self.energy_in != 0 else abs(self.energy_lost)
        return (self.energy_in - self.energy_lost - self.energy_stored) / scale

    def energy_balance(self) -> pd.DataFrame:
        """Energy in, stored, lost and the closure error, per heated area and per length."""
        per_len = self.surface_per_length
        rows = {
            "energy in": self.energy_in,
            "stored": self.energy_stored,
            "lost at surface": self.energy_lost,
            "in - stored - lost": self.energy_in - self.energy_stored - self.energy_lost,
        }
        return pd.DataFrame(
            {
                "J_per_m2": list(rows.values()),
                "J_per_m": [v * per_len for v in rows.values()],
            },
            index=pd.Index(list(rows), name="item"),
        )

    def time_to_reach(self, target: float, where: str = "centre") -> float:
        """First time [s] at which a temperature reaches `target` [K].

        Parameters
        ----------
        target : float [K]
        where : {"centre", "surface", "mean"}

        Raises
        ------
        ValueError
            For an unknown `where`, or if the target is never reached.
        """
        if where not in WHERE:
            raise ValueError(f"where={where!r} is not known; expected one of {list(WHERE)}")
        t = self.series[where].to_numpy()
        time = self.series.index.to_numpy()
        above = np.flatnonzero(t >= target)
        if above.size == 0:
            raise ValueError(
                f"target={target!r} K is never reached at the {where} (maximum {t.max():.2f} K)"
            )
        i = above[0]
        if i == 0:
            return float(time[0])
        return float(np.interp(target, t[i - 1 : i + 1], time[i - 1 : i + 1]))

    def profile(self, time: float) -> np.ndarray:
        """Temperature profile [K] at a requested profile time [s]."""
        cols = self.profiles.columns.to_numpy(dtype=float)
        j = np.flatnonzero(np.isclose(cols, time, rtol=1e-9, atol=1e-9))
        if j.size == 0:
            raise ValueError(f"time={time!r} s is not among the profile times {cols.tolist()}")
        return self.profiles.iloc[:, j[0]].to_numpy()

    def summary(self) -> pd.DataFrame:
        """Final temperatures, spread and energy figures as a small table."""
        last = self.series.iloc[-1]
        items = {
            "end time [s]": self.series.index[-1],
            "surface [degC]": last["surface"] - 273.15,
            "centre [degC]": last["centre"] - 273.15,
            "mean [degC]": last["mean"] - 273.15,
            "surface - centre [K]": last["surface"] - last["centre"],
            "energy in [kJ/m]": self.energy_in * self.surface_per_length / 1e3,
            "energy lost [kJ/m]": self.energy_lost * self.surface_per_length / 1e3,
            "closure error [-]": self.closure_error,
        }
        return pd.DataFrame({"value": list(items.values())}, index=list(items))

    def _repr_html_(self) -> str:
        return (
            f"<h4>Transient heating of {self.material} ({self.geometry})</h4>"
            + self.summary().to_html(float_format=lambda x: f"{x:.5g}")
        )
