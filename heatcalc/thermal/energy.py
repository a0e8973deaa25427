"""Theoretical energy to heat, melt and superheat a charge, as a breakdown table."""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np
import pandas as pd

from .. import _checks as chk
from .enthalpy import REFERENCE_TEMPERATURE, enthalpy_curve

__all__ = ["EnergyBreakdown", "charge_energy"]

_J_PER_KWH = 3.6e6


@dataclass(frozen=True)
class EnergyBreakdown:
    """Energy taken up by a charge between two temperatures, by component.

    Attributes
    ----------
    material : str
        Material key.
    mass : float [kg]
    t_initial, t_final : float [K]
    sensible_solid : float [J]
        Sensible heat below the solidus (or up to `t_final` if it is below the solidus).
    latent : float [J]
        Latent heat released (all of it once `t_final` reaches the liquidus; a linear share of
        it inside an alloy's melting range).
    sensible_liquid : float [J]
        Sensible heat above the solidus: through the melting range and the superheat.
    """

    material: str
    mass: float
    t_initial: float
    t_final: float
    sensible_solid: float
    latent: float
    sensible_liquid: float

    @property
    def total(self) -> float:
        """Sum of the components [J]."""
        return self.sensible_solid + self.latent + self.sensible_liquid

    @property
    def specific(self) -> float:
        """Total per unit mass [J/kg]."""
        return self.total / self.mass

    @property
    def per_tonne(self) -> float:
        """Total per tonne of charge [kWh/t]."""
        return self.specific * 1e3 / _J_PER_KWH

    def to_frame(self) -> pd.DataFrame:
        """The breakdown as a table: J, kJ/kg and kWh/t per component, and the total."""
        names = ["sensible heat, solid", "latent heat", "sensible heat, liquid", "total"]
        values = np.array([self.sensible_solid, self.latent, self.sensible_liquid, self.total])
        spec = values / self.mass
        return pd.DataFrame(
            {
                "component": names,
                "energy_J": values,
                "specific_kJ_per_kg": spec / 1e3,
                "kWh_per_t": spec * 1e3 / _J_PER_KWH,
            }
        )

    def _repr_html_(self) -> str:
        head = (
            f"<p>{self.material}: {self.mass:g} kg from {self.t_initial - 273.15:.1f} degC to "
            f"{self.t_final - 273.15:.1f} degC</p>"
        )
        return head + self.to_frame().to_html(index=False, float_format=lambda x: f"{x:.4g}")


def charge_energy(material, t_final, mass=1.0, t_initial=REFERENCE_TEMPERATURE):
    """Theoretical energy to bring a charge from `t_initial` to `t_final`.

    Parameters
    ----------
    material : str or Material
    t_final : float [K]
        Final temperature (pouring temperature for a melt), inside the specific-heat table.
    mass : float [kg]
        Charge mass, > 0.
    t_initial : float [K]
        Starting temperature, <= `t_final`.

    Returns
    -------
    EnergyBreakdown

    Raises
    ------
    ValueError
        If a temperature lies outside the specific-heat table, `t_final` < `t_initial`, or
        the mass is not > 0.

    Notes
    -----
    ``E = m (h(t_final) - h(t_initial))`` with :func:`~heatcalc.thermal.specific_enthalpy`,
    split at the solidus. Losses are not included: a crucible furnace needs far more (losses
    through the lining and coil, furnace efficiency).

    Examples
    --------
    >>> from heatcalc.materials import Material
    >>> m = Material.constant(specific_heat=1000.0, t_min=250.0, t_max=1500.0,
    ...                       solidus=900.0, liquidus=900.0, latent_heat=4e5)
    >>> e = charge_energy(m, 1000.0, mass=2.0)
    >>> round(e.sensible_solid), round(e.latent), round(e.sensible_liquid)
    (1213700, 800000, 200000)
    """
    mat = chk.material(material)
    m = float(chk.positive("mass", mass, "kg"))
    t1 = float(chk.kelvin("t_final", t_final))
    t0 = float(chk.kelvin("t_initial", t_initial))
    if t1 < t0:
        raise ValueError(f"t_final={t1!r} K must be >= t_initial={t0!r} K")
    curve = enthalpy_curve(mat)
    h0, h1 = curve.enthalpy(np.array([t0, t1]))
    ts = mat.solidus
    if ts is None or t1 <= ts:
        solid, latent, liquid = h1 - h0, 0.0, 0.0
    else:
        tl, lat = mat.liquidus, mat.latent_heat or 0.0

        def fraction(t):  # liquid fraction: step for a pure metal, linear for an alloy
            if t <= ts:
                return 0.0
            return 1.0 if t >= tl else (t - ts) / (tl - ts)

        latent = lat * (fraction(t1) - fraction(t0))
        h_sol = curve.enthalpy(max(ts, t0))  # solid value at the solidus
        solid = h_sol - h0
        liquid = h1 - h_sol - latent
    return EnergyBreakdown(mat.key, m, t0, t1, m * solid, m * latent, m * liquid)
