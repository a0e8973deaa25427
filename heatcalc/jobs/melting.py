"""Melting charge in a coreless crucible induction furnace.

The design point is the full molten bath at the pouring temperature: the melt is a solid
cylinder of liquid metal inside a refractory lining, inside a water-cooled multi-turn coil.

Calculation, in order:

1. Energy to heat, melt and superheat the charge from the enthalpy tables
   (:func:`heatcalc.thermal.charge_energy`).
2. Bath height from the charge mass and the liquid density.
3. Thermal losses at the pouring temperature, held for the whole cycle (an upper bound: the
   charge is cooler for most of the cycle): radiation from the open bath surface
   (:func:`heatcalc.thermal.radiation_loss`) and conduction through the side lining
   (:func:`heatcalc.thermal.cylindrical_wall`) and the floor (plane wall) to the cooled coil.
4. Power at the melt: energy / cycle time + thermal losses; or, for a given supply power, the
   cycle time that this power allows.
5. Coil electricals for the molten bath (:func:`heatcalc.coil.coil_circuit`), the capacitor
   bank, the supply rating, the cooling water (coil copper loss plus heat conducted through the
   lining to the coil, carried by the same water).
6. Frequency check: crucible diameter over skin depth in the melt, and a ranking of the
   available supply frequencies.
"""

from __future__ import annotations

import math
import warnings
from dataclasses import dataclass, field

import numpy as np
import pandas as pd
from scipy.constants import pi

from .. import coil as hcoil
from .. import em, materials, thermal
from ..units import format_value
from ._base import Check, HandCheck, JobResult, convert, input_table, positive

__all__ = ["MeltingInputs", "MeltingResult", "run_melting", "MELTING_RATIO_BAND"]

#: Crucible diameter / skin depth band used to judge the frequency: above 10 the melt's
#: absorbed power is within about 15 % of its thick-conductor limit (computed from the Bessel
#: solution, P(m) at D/delta = 10 is 0.86); beyond about 60 the stirring, which grows as the
#: frequency falls, is weak for alloying and scrap intake (common practice, no source).
MELTING_RATIO_BAND = (10.0, 60.0)

_UNITS = {
    "charge_mass": "mass",
    "start_temperature": "temperature",
    "pouring_temperature": "temperature",
    "cycle_time": "time",
    "supply_power": "power",
    "crucible_inner_diameter": "length",
    "lining_thickness": "length",
    "floor_thickness": "length",
    "lining_conductivity": "thermal_conductivity",
    "coil_inner_diameter": "length",
    "coil_length": "length",
    "tube_axial_width": "length",
    "tube_radial_depth": "length",
    "tube_wall": "length",
    "coil_temperature": "temperature",
    "frequency": "frequency",
    "frequency_options": "frequency_list",
    "max_coil_voltage": "voltage",
    "ambient_temperature": "temperature",
    "water_inlet_temperature": "temperature",
    "water_temperature_rise": "temperature_difference",
}

DESCRIPTIONS = {
    "alloy": "charge alloy (material key)",
    "charge_mass": "mass of metal per melt",
    "start_temperature": "charge temperature at the start",
    "pouring_temperature": "bath temperature at tapping",
    "cycle_time": "melt cycle time (give this or supply_power)",
    "supply_power": "power available at the supply (give this or cycle_time)",
    "crucible_inner_diameter": "inside diameter of the lining (melt diameter)",
    "lining_thickness": "side lining between melt and coil",
    "floor_thickness": "floor lining under the melt",
    "lining_conductivity": "thermal conductivity of the lining",
    "coil_inner_diameter": "bore of the coil",
    "coil_length": "winding height of the coil",
    "coil_turns": "number of turns",
    "tube_axial_width": "copper tube, size along the axis",
    "tube_radial_depth": "copper tube, radial size",
    "tube_wall": "copper tube wall",
    "coil_temperature": "copper temperature in service",
    "frequency": "operating frequency",
    "frequency_options": "frequencies the supply range offers",
    "max_coil_voltage": "largest coil (tank) voltage of the supply",
    "converter_efficiency": "supply efficiency, mains to coil terminals",
    "supply_margin": "margin on the supply rating",
    "bath_surface": "emissivity condition of the bath surface",
    "open_fraction": "fraction of the cycle the bath radiates to the room (lid off)",
    "ambient_temperature": "room temperature",
    "water_inlet_temperature": "cooling water inlet",
    "water_temperature_rise": "allowed water temperature rise",
    "water_circuits": "parallel water circuits through the coil",
}


@dataclass(frozen=True)
class MeltingInputs:
    """Inputs of a melting-charge job; dimensional fields are strings or quantities with units.

    Give exactly one of `cycle_time` (the power follows) and `supply_power` (the cycle time
    follows).
    """

    alloy: str
    charge_mass: str
    pouring_temperature: str
    crucible_inner_diameter: str
    lining_thickness: str
    coil_inner_diameter: str
    coil_length: str
    coil_turns: int
    frequency: str
    cycle_time: str | None = None
    supply_power: str | None = None
    start_temperature: str = "20 degC"
    floor_thickness: str = "150 mm"
    lining_conductivity: str = "1.5 W/(m*K)"
    tube_axial_width: str = "25 mm"
    tube_radial_depth: str = "20 mm"
    tube_wall: str = "3 mm"
    coil_temperature: str = "40 degC"
    frequency_options: tuple[str, ...] = ()
    max_coil_voltage: str | None = None
    converter_efficiency: float = 0.96
    supply_margin: float = 0.10
    bath_surface: str = "molten"
    open_fraction: float = 1.0
    ambient_temperature: str = "25 degC"
    water_inlet_temperature: str = "25 degC"
    water_temperature_rise: str = "15 delta_degC"
    water_circuits: int = 2

    def to_frame(self) -> pd.DataFrame:
        return input_table(self, DESCRIPTIONS)


@dataclass
class MeltingResult(JobResult):
    """Results of :func:`run_melting` (SI units in the attributes)."""

    inputs: MeltingInputs | None = None
    energy: thermal.EnergyBreakdown | None = None
    bath_height: float = 0.0
    cycle_time: float = 0.0
    melt_rate: float = 0.0
    radiation_loss: float = 0.0
    side_wall_loss: float = 0.0
    floor_loss: float = 0.0
    melt_power: float = 0.0
    coil_input_power: float = 0.0
    supply_power: float = 0.0
    specific_energy: float = 0.0
    theoretical_specific_energy: float = 0.0
    skin_depth: float = 0.0
    diameter_to_skin_depth: float = 0.0
    circuit: hcoil.CoilCircuitResult | None = None
    capacitors: hcoil.CapacitorBank | None = None
    rating: hcoil.SupplyRating | None = None
    cooling: hcoil.CoolingResult | None = None
    frequency_table: pd.DataFrame = field(default_factory=pd.DataFrame)
    wall: thermal.WallConduction | None = None

    @property
    def thermal_losses(self) -> float:
        """Radiation + side wall + floor [W]."""
        return self.radiation_loss + self.side_wall_loss + self.floor_loss

    def summary_rows(self):
        c = self.circuit
        return [
            ("charge", self.inputs.alloy, "text"),
            ("charge mass", self.energy.mass, "mass"),
            ("bath height", self.bath_height, "length"),
            ("cycle time", self.cycle_time / 60.0, "-"),
            ("melt rate", self.melt_rate, "mass_rate"),
            ("theoretical energy", self.energy.total, "energy"),
            ("theoretical specific energy", self.theoretical_specific_energy, "specific_energy"),
            ("radiation loss (open bath)", self.radiation_loss, "power"),
            ("conduction loss, side lining", self.side_wall_loss, "power"),
            ("conduction loss, floor", self.floor_loss, "power"),
            ("power into the melt", self.melt_power, "power"),
            ("coil copper loss", c.copper_loss, "power"),
            ("coil efficiency", c.efficiency, "%"),
            ("power at the coil terminals", self.coil_input_power, "power"),
            ("power from the mains", self.supply_power, "power"),
            ("specific energy at the mains", self.specific_energy, "specific_energy"),
            ("frequency", c.frequency, "frequency"),
            ("skin depth in the melt", self.skin_depth, "length"),
            ("crucible diameter / skin depth", self.diameter_to_skin_depth, "-"),
            ("coil current", c.coil_current, "current"),
            ("coil voltage", c.coil_voltage, "voltage"),
            ("coil power factor", c.power_factor, "-"),
            ("capacitor bank", self.capacitors.reactive_power, "reactive_power"),
            ("supply rating", self.rating.power_rating, "power"),
            ("supply apparent-power rating", self.rating.apparent_power_rating, "apparent_power"),
            ("cooling water", self.cooling.volume_flow, "volume_rate"),
            ("water pressure drop", self.cooling.pressure_drop, "pressure"),
        ]

    def summary(self) -> pd.DataFrame:
        df = super().summary()
        df.loc[df["quantity"] == "cycle time", "value"] = f"{self.cycle_time / 60:.1f} min"
        return df

    def recommendations(self) -> list[str]:
        """Design recommendations in words (frequency, power, coil, time)."""
        c = self.circuit
        best = self.frequency_table.sort_values("rank").iloc[0]
        out = [
            f"Supply: {format_value(self.rating.power_rating, 'power')} at "
            f"{format_value(c.frequency, 'frequency')} (includes the "
            f"{100 * self.rating.margin:.0f} % margin), parallel-compensated with a "
            f"{format_value(self.capacitors.reactive_power, 'reactive_power')} capacitor bank.",
            f"Melt cycle {self.cycle_time / 60:.0f} min for {self.energy.mass:g} kg: "
            f"{format_value(self.melt_rate, 'mass_rate')} at "
            f"{format_value(self.specific_energy, 'specific_energy')} from the mains.",
            f"Coil: {self.inputs.coil_turns} turns, {format_value(c.coil_current, 'current')} "
            f"at {format_value(c.coil_voltage, 'voltage')}; cooling water "
            f"{format_value(self.cooling.volume_flow, 'volume_rate')} in "
            f"{self.cooling.circuits} circuit(s).",
        ]
        if float(best["frequency"]) != c.frequency:
            out.append(
                f"Of the frequencies offered, {format_value(float(best['frequency']), 'frequency')}"
                f" ranks first ({best['reason']})."
            )
        else:
            out.append(f"The chosen frequency ranks first of those offered ({best['reason']}).")
        return out

    def power_flow(self) -> pd.DataFrame:
        """Where the mains power goes, per cycle-average [kW] and share."""
        parts = [
            ("heat, melt and superheat the charge", self.energy.total / self.cycle_time),
            ("radiation from the bath", self.radiation_loss),
            ("conduction through the lining", self.side_wall_loss + self.floor_loss),
            ("coil copper loss", self.circuit.copper_loss),
            ("supply (converter) loss", self.supply_power - self.coil_input_power),
        ]
        df = pd.DataFrame(parts, columns=["destination", "power_W"])
        df["power_kW"] = df["power_W"] / 1e3
        df["share"] = df["power_W"] / self.supply_power
        return df[["destination", "power_kW", "share"]]


def run_melting(inputs: MeltingInputs) -> MeltingResult:
    """Run a melting-charge calculation.

    Parameters
    ----------
    inputs : MeltingInputs

    Returns
    -------
    MeltingResult

    Raises
    ------
    ValueError
        For a missing unit, a wrong dimension, a negative size, a temperature outside the
        alloy's tables, or inconsistent geometry (coil bore smaller than the lined crucible).
    """
    if not isinstance(inputs, MeltingInputs):
        raise ValueError(f"inputs must be MeltingInputs; got {type(inputs).__name__}")
    si = convert(inputs, _UNITS)
    positive(
        si,
        "charge_mass",
        "crucible_inner_diameter",
        "lining_thickness",
        "floor_thickness",
        "lining_conductivity",
        "coil_inner_diameter",
        "coil_length",
        "frequency",
        "cycle_time",
        "supply_power",
        "max_coil_voltage",
    )
    if (si["cycle_time"] is None) == (si["supply_power"] is None):
        raise ValueError(
            "give exactly one of cycle_time and supply_power; got "
            f"cycle_time={inputs.cycle_time!r}, supply_power={inputs.supply_power!r}"
        )
    for name in ("converter_efficiency", "open_fraction"):
        v = getattr(inputs, name)
        if not (isinstance(v, (int, float)) and 0 <= v <= 1) or (
            name == "converter_efficiency" and v == 0
        ):
            raise ValueError(f"{name}={v!r} must be a fraction between 0 and 1")
    if not (isinstance(inputs.supply_margin, (int, float)) and 0 <= inputs.supply_margin < 1):
        raise ValueError(f"supply_margin={inputs.supply_margin!r} must be in [0, 1)")
    mat = materials.get(inputs.alloy)
    if mat.liquidus is None:
        raise ValueError(f"alloy={inputs.alloy!r} has no melting data; choose a metal to melt")
    t_pour = si["pouring_temperature"]
    if t_pour <= mat.liquidus:
        raise ValueError(
            f"pouring_temperature={inputs.pouring_temperature!r} must be above the liquidus of "
            f"{mat.key} ({format_value(mat.liquidus, 'temperature')})"
        )
    r_melt = si["crucible_inner_diameter"] / 2.0
    r_lining = r_melt + si["lining_thickness"]
    if si["coil_inner_diameter"] / 2.0 < r_lining:
        raise ValueError(
            f"coil_inner_diameter={inputs.coil_inner_diameter!r} is smaller than the lined "
            f"crucible ({format_value(2 * r_lining, 'length')}); expected a larger bore"
        )

    result = MeltingResult(title=f"Melting charge: {mat.name}", inputs=inputs)
    result.sources = [
        "Enthalpy, density, resistivity and emissivity: data/materials/" + mat.key + ".toml",
        "Skin effect in a cylinder: Kelvin-function solution (heatcalc.em)",
        "Coil circuit: long-coil referral with Nagaoka's coefficient (heatcalc.coil)",
        "Conduction through cylindrical layers: Incropera & DeWitt, 6th ed., 2007, sec. 3.3",
        "Radiation: grey body, Stefan-Boltzmann constant from scipy.constants (CODATA)",
        "Water friction: fluids (Clamond solution of Colebrook); water: CoolProp",
    ]
    result.assumptions = [
        "Design point is the full molten bath at the pouring temperature (electricals, losses).",
        "Thermal losses are taken at the pouring temperature for the whole cycle: an upper "
        "bound, since the charge is cooler for most of the cycle.",
        "The melt is a long solid cylinder in the coil's field; the lining and any crucible "
        "are non-conducting (a conducting crucible would absorb power).",
        "Lining conducts radially at constant conductivity; the outer lining face sits at the "
        "mean cooling-water temperature; the furnace top is open for open_fraction of the cycle.",
        "Tapping, charging and holding times are not included in the cycle time.",
    ]

    # 1. energy ---------------------------------------------------------------------------
    energy = thermal.charge_energy(
        mat, t_pour, mass=si["charge_mass"], t_initial=si["start_temperature"]
    )
    result.energy = energy
    result.theoretical_specific_energy = energy.specific

    # 2. bath -----------------------------------------------------------------------------
    rho_liquid = mat.density(t_pour)
    area = pi * r_melt**2
    result.bath_height = si["charge_mass"] / (rho_liquid * area)

    # 3. thermal losses ---------------------------------------------------------------------
    emissivity = mat.emissivity(inputs.bath_surface)
    q_rad = thermal.radiation_loss(t_pour, si["ambient_temperature"], emissivity)
    result.radiation_loss = float(q_rad) * area * inputs.open_fraction
    t_water = si["water_inlet_temperature"] + si["water_temperature_rise"] / 2.0
    wall = thermal.cylindrical_wall(
        [r_melt, r_lining], [si["lining_conductivity"]], t_pour, t_water, length=result.bath_height
    )
    result.wall = wall
    result.side_wall_loss = wall.heat_flow
    # floor: plane wall, q = k A dT / t, to a floor at the room temperature
    result.floor_loss = (
        si["lining_conductivity"] * area * (t_pour - si["ambient_temperature"])
    ) / si["floor_thickness"]

    # 4. coil circuit (linear: efficiency does not depend on the power) ----------------------
    rho_melt = mat.resistivity(t_pour)
    copper = materials.get("cu-etp")
    coil = hcoil.SolenoidCoil(
        turns=inputs.coil_turns,
        length=si["coil_length"],
        inner_diameter=si["coil_inner_diameter"],
        conductor=hcoil.RectangularTube(
            si["tube_axial_width"], si["tube_radial_depth"], si["tube_wall"]
        ),
        resistivity=copper.resistivity(si["coil_temperature"]),
    )
    melt = hcoil.CylinderWorkpiece(r_melt, result.bath_height, rho_melt, 1.0)
    f = si["frequency"]
    eta_conv = inputs.converter_efficiency
    if si["cycle_time"] is not None:
        result.cycle_time = si["cycle_time"]
        result.melt_power = energy.total / result.cycle_time + result.thermal_losses
        with result.collecting(hcoil.EndCorrectionWarning):
            circuit = hcoil.coil_circuit(coil, melt, f, workpiece_power=result.melt_power)
    else:
        with warnings.catch_warnings():
            # the same circuit is evaluated again below, where its warnings are collected
            warnings.simplefilter("ignore", hcoil.EndCorrectionWarning)
            probe = hcoil.coil_circuit(coil, melt, f, workpiece_power=1e3)
        p_coil = si["supply_power"] * eta_conv
        result.melt_power = p_coil * probe.overall_efficiency
        net = result.melt_power - result.thermal_losses
        if net <= 0:
            raise ValueError(
                f"supply_power={inputs.supply_power!r} does not cover the thermal losses "
                f"({format_value(result.thermal_losses, 'power')} at the melt): the charge "
                "would never reach the pouring temperature"
            )
        result.cycle_time = energy.total / net
        with result.collecting(hcoil.EndCorrectionWarning):
            circuit = hcoil.coil_circuit(coil, melt, f, workpiece_power=result.melt_power)
    result.circuit = circuit
    result.melt_rate = si["charge_mass"] / result.cycle_time
    result.coil_input_power = circuit.input_power
    result.supply_power = circuit.input_power / eta_conv
    result.specific_energy = result.supply_power * result.cycle_time / si["charge_mass"]
    result.capacitors = hcoil.capacitor_bank(circuit, "parallel")
    result.rating = hcoil.supply_rating(
        circuit,
        "parallel",
        margin=inputs.supply_margin,
        other_losses=result.supply_power - result.coil_input_power,
    )
    result.cooling = hcoil.coil_cooling(
        coil,
        circuit.copper_loss,
        si["water_temperature_rise"],
        inlet_temperature=si["water_inlet_temperature"],
        circuits=inputs.water_circuits,
        extra_heat=result.side_wall_loss,
        friction="helical",
    )

    # 5. frequency --------------------------------------------------------------------------
    result.skin_depth = float(em.skin_depth(rho_melt, f))
    result.diameter_to_skin_depth = 2.0 * r_melt / result.skin_depth
    rule = hcoil.heating_rule(melt, low=MELTING_RATIO_BAND[0], high=MELTING_RATIO_BAND[1])
    options = sorted(set(si["frequency_options"]) | {f})
    table = hcoil.rank_frequencies(coil, melt, np.array(options), rule=rule)
    # stirring grows as the frequency falls; at equal power the stirring force scales about
    # as 1/sqrt(f) (from memory; a relative index, not a prediction of velocity)
    table["relative_stirring"] = np.sqrt(f / table["frequency"])
    result.frequency_table = table

    _checks(result, si, mat)
    _hand_checks(result, si, mat)
    return result


def _checks(result: MeltingResult, si: dict, mat) -> None:
    c = result.circuit
    lo, hi = MELTING_RATIO_BAND
    ratio = result.diameter_to_skin_depth
    result.checks.append(
        Check(
            "crucible diameter / skin depth in band",
            f"{ratio:.3g}",
            f"{lo:g} to {hi:g}",
            lo <= ratio <= hi,
            "below: poor coupling; above: weak stirring",
        )
    )
    result.checks.append(
        Check(
            "bath within the coil height",
            format_value(result.bath_height, "length"),
            f"<= {format_value(si['coil_length'], 'length')}",
            result.bath_height <= si["coil_length"],
            "metal above the coil is poorly heated and stirred",
        )
    )
    if si["max_coil_voltage"] is not None:
        result.checks.append(
            Check(
                "coil voltage within the supply's limit",
                format_value(c.coil_voltage, "voltage"),
                f"<= {format_value(si['max_coil_voltage'], 'voltage')}",
                c.coil_voltage <= si["max_coil_voltage"],
                "otherwise change the turns or use a matching transformer",
            )
        )
    result.checks.append(
        Check(
            "mains energy above the theoretical minimum",
            format_value(result.specific_energy, "specific_energy"),
            f"> {format_value(result.theoretical_specific_energy, 'specific_energy')}",
            result.specific_energy > result.theoretical_specific_energy,
            "energy balance sanity check",
        )
    )
    ok_velocity = 1.0 <= result.cooling.velocity <= 4.0
    result.checks.append(
        Check(
            "cooling-water velocity",
            format_value(result.cooling.velocity, "velocity"),
            "1 to 4 m/s (common practice, no source)",
            ok_velocity,
            "; ".join(result.cooling.cautions),
        )
    )
    if c.efficiency < 0.5:
        result.warn(
            f"coil efficiency {c.efficiency:.2f} is low: check the coil-to-melt gap and the "
            "tube size"
        )
    if not lo <= ratio <= hi:
        result.warn(
            f"crucible diameter / skin depth {ratio:.3g} is outside {lo:g}-{hi:g}: consider "
            "another frequency (see the frequency table)"
        )
    if result.bath_height > si["coil_length"]:
        result.warn("the bath stands higher than the coil")


def _hand_checks(result: MeltingResult, si: dict, mat) -> None:
    e = result.energy
    m = e.mass
    result.hand_checks = [
        HandCheck(
            "theoretical energy",
            "E = m [h(T_pour) - h(T_start)]",
            f"{m:g} kg x {e.specific / 1e3:.4g} kJ/kg = {e.total / 3.6e6:.4g} kWh",
        ),
        HandCheck(
            "power into the melt",
            "P_melt = E / t_cycle + losses",
            f"{e.total / 1e3:.4g} kJ / {result.cycle_time:.4g} s + "
            f"{result.thermal_losses / 1e3:.4g} kW = {result.melt_power / 1e3:.4g} kW",
        ),
        HandCheck(
            "power from the mains",
            "P_mains = P_melt / (eta_coil x eta_converter)",
            f"{result.melt_power / 1e3:.4g} / ({result.circuit.overall_efficiency:.4f} x "
            f"{result.inputs.converter_efficiency:g}) = {result.supply_power / 1e3:.4g} kW",
        ),
        HandCheck(
            "melt rate",
            "m / t_cycle",
            f"{m:g} kg / {result.cycle_time / 3600:.4g} h = {result.melt_rate * 3600:.4g} kg/h",
        ),
        HandCheck(
            "skin depth in the melt",
            "delta = sqrt(2 rho / (omega mu0))",
            f"rho = {mat.resistivity(si['pouring_temperature']):.4g} ohm m -> "
            f"{result.skin_depth * 1e3:.4g} mm",
        ),
        HandCheck(
            "bath height",
            "H = m / (rho_liquid pi D^2 / 4)",
            format_value(result.bath_height, "length", sig=4),
        ),
    ]
    if not math.isfinite(result.specific_energy):  # pragma: no cover - guarded above
        raise ValueError("specific energy is not finite")
