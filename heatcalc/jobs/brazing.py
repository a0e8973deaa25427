"""Induction brazing of a tube-to-fitting joint (a tube pushed into a socket).

A solenoid coil around the joint heats the fitting (outside) and, through it, the tube
(inside). The calculation:

1. Power split between fitting and tube from the radial field solution of the two-layer wall
   with a bore (:func:`heatcalc.jobs._joint_field.composite_power_split`), tabulated over the two
   part temperatures (resistivity, and permeability of a magnetic part, change with them).
2. Heating: two lumps (one uniform temperature per part, checked with the Biot number) joined
   by the conductance of the clearance, with radiation and natural convection from the
   fitting and conduction along both parts away from the joint (long fins); integrated with
   the implicit BDF method until both parts reach the brazing temperature, then cooled with
   the power off until the filler has frozen.
3. Overheating margins against the filler's brazing range, its liquidus and the base metals'
   solidus (and zinc loss from brass).
4. Frequency: fitting wall / skin depth at the brazing temperature for each available
   frequency, the share of power left to the tube, the coil efficiency; ranked on the band
   wall / skin depth 1 to 2 (common practice, no source).
5. Coil electricals at the end of heating (surface impedance of the composite wall),
   capacitors, supply rating, cooling water.
6. Given power -> time; given time -> power (Brent's method on the time to temperature).
"""

from __future__ import annotations

import dataclasses
import math
import warnings
from dataclasses import dataclass, field

import numpy as np
import pandas as pd
from scipy.constants import pi
from scipy.optimize import brentq

from .. import coil as hcoil
from .. import em, materials, thermal
from ..units import format_value
from ._base import JobResult, convert, input_table, positive
from ._brazing_checks import (
    BRASS_ZINC_LIMIT,
    WALL_RATIO_BAND,
    add_checks,
    add_hand_checks,
    add_texts,
)
from ._joint_field import JointGeometry, JointPowerTable, composite_power_split
from ._two_parts import FIN_MODELS, Fin, Lump, simulate_two_parts

__all__ = [
    "BrazingInputs",
    "BrazingResult",
    "run_brazing",
    "POWER_BASES",
    "WALL_RATIO_BAND",
    "BRASS_ZINC_LIMIT",
]

#: What a given ``power`` means: at the coil terminals, or absorbed by the joint.
POWER_BASES = ("coil", "absorbed")

#: Default brazing temperature above the filler's liquidus [K] (common practice, no source).
LIQUIDUS_MARGIN = 30.0

_LONGEST_HEAT = 600.0  # [s]
_LONGEST_COOL = 300.0  # [s]

_UNITS = {
    "tube_outer_diameter": "length",
    "tube_wall": "length",
    "fitting_outer_diameter": "length",
    "overlap_length": "length",
    "coil_inner_diameter": "length",
    "frequency": "frequency",
    "frequency_options": "frequency_list",
    "power": "power",
    "heat_time": "time",
    "brazing_temperature": "temperature",
    "joint_clearance": "length",
    "joint_conductance": "heat_transfer_coefficient",
    "allowed_difference": "temperature_difference",
    "start_temperature": "temperature",
    "ambient_temperature": "temperature",
    "coil_tube_size": "length",
    "coil_tube_depth": "length",
    "coil_tube_wall": "length",
    "turn_gap": "length",
    "coil_temperature": "temperature",
    "max_coil_voltage": "voltage",
    "water_inlet_temperature": "temperature",
    "water_temperature_rise": "temperature_difference",
}

DESCRIPTIONS = {
    "tube_material": "tube (inner part), material key",
    "tube_outer_diameter": "tube outside diameter",
    "tube_wall": "tube wall thickness",
    "fitting_material": "fitting or socket (outer part), material key",
    "fitting_outer_diameter": "fitting outside diameter over the joint",
    "overlap_length": "insertion depth of the tube in the fitting (brazed length)",
    "coil_inner_diameter": "bore of the coil",
    "coil_turns": "number of turns",
    "frequency_options": "frequencies the supply range offers",
    "frequency": "operating frequency (empty: the best of frequency_options)",
    "power": "power at the coil terminals or absorbed (see power_basis); or give heat_time",
    "power_basis": "'coil': power at the coil terminals; 'absorbed': power into the joint",
    "heat_time": "wanted time to the brazing temperature (the power follows)",
    "filler": "brazing filler metal (material key)",
    "brazing_temperature": "temperature both parts must reach (empty: liquidus + 30 K)",
    "joint_clearance": "diametral clearance: fitting bore minus tube outside diameter",
    "joint_conductance": "heat-transfer coefficient across the clearance (flux, contact)",
    "allowed_difference": "largest fitting - tube difference at the end (default: common "
    "practice, no source)",
    "start_temperature": "temperature of the parts at the start",
    "ambient_temperature": "surroundings and air",
    "tube_surface": "tube emissivity: surface condition of its material, or a number",
    "fitting_surface": "fitting emissivity: surface condition of its material, or a number",
    "tube_conduction": "count conduction along the tube out of the joint",
    "fitting_conduction": "count conduction along the fitting body beyond the joint",
    "fin_model": "conduction along the parts: 'transient' (1-D) or 'steady' (infinite fin)",
    "coil_tube_profile": "coil tubing: 'round' or 'rectangular'",
    "coil_tube_size": "coil tubing outside diameter (round) or axial width (rectangular)",
    "coil_tube_depth": "coil tubing radial depth (rectangular only)",
    "coil_tube_wall": "coil tubing wall",
    "turn_gap": "axial space between turns",
    "coil_temperature": "copper temperature in service",
    "max_coil_voltage": "largest coil voltage of the supply",
    "supply_margin": "margin on the supply rating",
    "water_inlet_temperature": "cooling water inlet",
    "water_temperature_rise": "allowed water temperature rise",
}


@dataclass(frozen=True)
class BrazingInputs:
    """Inputs of a tube-to-fitting brazing job; dimensional fields carry units.

    Give exactly one of `power` (the time follows) and `heat_time` (the power follows).
    """

    tube_material: str
    tube_outer_diameter: str
    tube_wall: str
    fitting_material: str
    fitting_outer_diameter: str
    overlap_length: str
    coil_inner_diameter: str
    coil_turns: int
    frequency_options: tuple[str, ...] = ()
    frequency: str | None = None
    power: str | None = None
    power_basis: str = "coil"
    heat_time: str | None = None
    filler: str = "bag-7"
    brazing_temperature: str | None = None
    joint_clearance: str = "0.1 mm"
    joint_conductance: str = "5000 W/(m**2*K)"
    allowed_difference: str = "50 delta_degC"
    start_temperature: str = "20 degC"
    ambient_temperature: str = "25 degC"
    tube_surface: str | float = "oxidised"
    fitting_surface: str | float = "oxidised"
    tube_conduction: bool = True
    fitting_conduction: bool = True
    fin_model: str = "transient"
    coil_tube_profile: str = "round"
    coil_tube_size: str = "6 mm"
    coil_tube_depth: str | None = None
    coil_tube_wall: str = "1 mm"
    turn_gap: str = "1.5 mm"
    coil_temperature: str = "40 degC"
    max_coil_voltage: str | None = None
    supply_margin: float = 0.10
    water_inlet_temperature: str = "25 degC"
    water_temperature_rise: str = "15 delta_degC"

    def to_frame(self) -> pd.DataFrame:
        return input_table(self, DESCRIPTIONS)


@dataclass
class BrazingResult(JobResult):
    """Results of :func:`run_brazing` (SI units in the attributes, kelvin)."""

    inputs: BrazingInputs | None = None
    geometry: JointGeometry | None = None
    frequency: float = 0.0
    power: float = 0.0
    power_basis: str = "coil"
    brazing_temperature: float = 0.0
    brazing_range: tuple[float, float] = (0.0, 0.0)
    filler_liquidus: float = 0.0
    filler_solidus: float = 0.0
    target_reached: bool = False
    heat_time: float = 0.0
    time_to_range: float = math.nan
    time_in_range: float = 0.0
    end_fitting: float = 0.0
    end_tube: float = 0.0
    max_fitting: float = 0.0
    max_tube: float = 0.0
    max_difference: float = 0.0
    fitting_mass: float = 0.0
    tube_mass: float = 0.0
    heat_energy: float = 0.0
    absorbed_start: float = 0.0
    absorbed_end: float = 0.0
    fitting_share_start: float = 0.0
    fitting_share_end: float = 0.0
    joint_conductance: float = 0.0
    equalisation_time: float = 0.0
    biot: float = 0.0
    wall_difference: float = 0.0
    fitting_skin_depth: float = 0.0
    closure_error: float = 0.0
    circuit: hcoil.CoilCircuitResult | None = None
    capacitors: hcoil.CapacitorBank | None = None
    rating: hcoil.SupplyRating | None = None
    cooling: hcoil.CoolingResult | None = None
    frequency_table: pd.DataFrame = field(default_factory=pd.DataFrame)
    series: pd.DataFrame = field(default_factory=pd.DataFrame)
    run: object = None

    @property
    def end_difference(self) -> float:
        """Fitting minus tube at the end of heating [K]."""
        return self.end_fitting - self.end_tube

    def recommendations(self) -> list[str]:
        """Design recommendations in words (frequency, power, coil, time)."""
        c = self.circuit
        basis = "at the coil terminals" if self.power_basis == "coil" else "absorbed"
        out = [
            f"Frequency {format_value(self.frequency, 'frequency')}: fitting wall / skin depth "
            f"{self.geometry.fitting_wall / self.fitting_skin_depth:.3g}, "
            f"{100 * self.fitting_share_end:.0f} % of the power in the fitting at the end.",
            f"Power {format_value(self.power, 'power')} {basis} for "
            f"{format_value(self.heat_time, 'time')}, to "
            f"{format_value(self.brazing_temperature, 'temperature')} at the tube; both parts "
            f"are in the brazing range for {format_value(self.time_in_range, 'time')}.",
            f"Coil: {self.inputs.coil_turns} turns, {format_value(c.coil_current, 'current')} at "
            f"{format_value(c.coil_voltage, 'voltage')}; capacitors "
            f"{format_value(self.capacitors.reactive_power, 'reactive_power')}; supply "
            f"{format_value(self.rating.power_rating, 'power')} with the margin.",
        ]
        if not self.target_reached:
            out.append("The brazing temperature is not reached: raise the power or the time.")
        return out

    def summary_rows(self):
        c = self.circuit
        basis = "at the coil terminals" if self.power_basis == "coil" else "absorbed"
        return [
            (
                "joint",
                f"{self.inputs.tube_material} tube in {self.inputs.fitting_material}",
                "text",
            ),
            ("filler", self.inputs.filler, "text"),
            ("brazing temperature (target)", self.brazing_temperature, "temperature"),
            ("brazing range, low", self.brazing_range[0], "temperature"),
            ("brazing range, high", self.brazing_range[1], "temperature"),
            ("frequency", self.frequency, "frequency"),
            (f"power {basis}", self.power, "power"),
            (
                "both parts at the brazing temperature",
                "yes" if self.target_reached else "no",
                "text",
            ),
            ("time to the brazing temperature", self.heat_time, "time"),
            ("time until both parts enter the brazing range", self.time_to_range, "time"),
            ("time with both parts in the brazing range", self.time_in_range, "time"),
            ("fitting at the end of heating", self.end_fitting, "temperature"),
            ("tube at the end of heating", self.end_tube, "temperature"),
            ("fitting - tube at the end", self.end_difference, "temperature_difference"),
            ("largest fitting - tube while heating", self.max_difference, "temperature_difference"),
            ("highest fitting temperature", self.max_fitting, "temperature"),
            ("highest tube temperature", self.max_tube, "temperature"),
            ("heat stored in the joint", self.heat_energy, "energy"),
            ("power into the joint, start", self.absorbed_start, "power"),
            ("power into the joint, end", self.absorbed_end, "power"),
            ("share of power in the fitting, end", self.fitting_share_end, "%"),
            ("fitting skin depth at brazing temperature", self.fitting_skin_depth, "length"),
            ("joint conductance G", self.joint_conductance, "-"),
            ("equalisation time 1/[G (1/C_f + 1/C_t)]", self.equalisation_time, "time"),
            ("Biot number (largest)", self.biot, "-"),
            ("wall temperature drop estimate", self.wall_difference, "temperature_difference"),
            ("coil efficiency (end)", c.efficiency, "%"),
            ("coil current", c.coil_current, "current"),
            ("coil voltage", c.coil_voltage, "voltage"),
            ("coil power factor", c.power_factor, "-"),
            ("capacitor bank", self.capacitors.reactive_power, "reactive_power"),
            ("supply rating", self.rating.power_rating, "power"),
            ("cooling water", self.cooling.volume_flow, "volume_rate"),
            ("energy balance closure", self.closure_error, "-"),
        ]

    def summary(self) -> pd.DataFrame:
        df = super().summary()
        if math.isnan(self.time_to_range):
            df.loc[df["quantity"].str.startswith("time until both"), "value"] = "not reached"
        df.loc[df["quantity"] == "joint conductance G", "value"] = (
            f"{self.joint_conductance:.3g} W/K"
        )
        df.loc[df["quantity"] == "energy balance closure", "value"] = f"{self.closure_error:.1e}"
        df.loc[df["quantity"] == "Biot number (largest)", "value"] = f"{self.biot:.2g}"
        return df


# -- inputs ------------------------------------------------------------------------------------
def _material(inputs, name):
    key = getattr(inputs, name)
    try:
        return materials.get(key)
    except KeyError as exc:
        raise ValueError(f"{name}={key!r} is not in the material library: {exc.args[0]}") from None


def _emissivity(mat, surface, name):
    if isinstance(surface, (int, float)) and not isinstance(surface, bool):
        if not 0.0 <= surface <= 1.0:
            raise ValueError(f"{name}={surface!r} must be an emissivity in [0, 1]")
        return float(surface)
    try:
        return mat.emissivity(surface)
    except ValueError as exc:
        raise ValueError(f"{name}={surface!r}: {exc}") from None


def _target(si, inputs, filler):
    lo, hi = filler.brazing_range
    if si["brazing_temperature"] is None:
        t = filler.liquidus + LIQUIDUS_MARGIN
        if not lo <= t <= hi:  # a filler brazed partly solid (range starts below liquidus)
            t = 0.5 * (lo + hi)
        return t
    t = si["brazing_temperature"]
    if not lo <= t <= hi:
        raise ValueError(
            f"brazing_temperature={inputs.brazing_temperature!r} lies outside the brazing "
            f"range of {filler.key} ({format_value(lo, 'temperature')} to "
            f"{format_value(hi, 'temperature')}, {filler.brazing_classification or filler.key})"
        )
    return t


def _limit(mat):
    """Highest temperature a part may take in the model: its solidus or its table top [K]."""
    top = min(mat.temperature_range()[1], thermal.enthalpy_curve(mat).t_max)
    return min(top, mat.solidus) if mat.solidus else top


def _coil(si, inputs):
    if inputs.coil_tube_profile == "round":
        if si["coil_tube_depth"] is not None:
            raise ValueError("coil_tube_depth must be empty for coil_tube_profile='round'")
        conductor = hcoil.RoundTube(si["coil_tube_size"], si["coil_tube_wall"])
    elif inputs.coil_tube_profile == "rectangular":
        if si["coil_tube_depth"] is None:
            raise ValueError("coil_tube_depth must be given for coil_tube_profile='rectangular'")
        conductor = hcoil.RectangularTube(
            si["coil_tube_size"], si["coil_tube_depth"], si["coil_tube_wall"]
        )
    else:
        raise ValueError(
            f"coil_tube_profile={inputs.coil_tube_profile!r} must be 'round' or 'rectangular'"
        )
    length = inputs.coil_turns * (conductor.axial_width + si["turn_gap"])
    rho_cu = materials.get("cu-etp").resistivity(si["coil_temperature"])
    return hcoil.SolenoidCoil(
        inputs.coil_turns, length, si["coil_inner_diameter"], conductor, rho_cu
    )


# -- the job -----------------------------------------------------------------------------------
def run_brazing(inputs: BrazingInputs) -> BrazingResult:
    """Run a tube-to-fitting brazing calculation.

    Parameters
    ----------
    inputs : BrazingInputs

    Returns
    -------
    BrazingResult

    Raises
    ------
    ValueError
        For a missing unit or wrong dimension (naming the field), a negative size, an unknown
        material or filler, a brazing temperature outside the filler's range, a fitting bore
        that does not clear the tube, a coil that does not clear the fitting, a power too small
        to reach the brazing temperature in 10 min, or a heat time too short to reach it
        without overheating a part.
    """
    if not isinstance(inputs, BrazingInputs):
        raise ValueError(f"inputs must be BrazingInputs; got {type(inputs).__name__}")
    si = convert(inputs, _UNITS)
    positive(
        si,
        "tube_outer_diameter",
        "tube_wall",
        "fitting_outer_diameter",
        "overlap_length",
        "coil_inner_diameter",
        "frequency",
        "power",
        "heat_time",
        "joint_clearance",
        "joint_conductance",
        "allowed_difference",
        "coil_tube_size",
        "coil_tube_depth",
        "coil_tube_wall",
        "max_coil_voltage",
    )
    positive(si, "turn_gap", allow_zero=True)
    if (si["power"] is None) == (si["heat_time"] is None):
        raise ValueError(
            "give exactly one of power and heat_time; got "
            f"power={inputs.power!r}, heat_time={inputs.heat_time!r}"
        )
    if inputs.power_basis not in POWER_BASES:
        raise ValueError(f"power_basis={inputs.power_basis!r} must be one of {POWER_BASES}")
    if inputs.fin_model not in FIN_MODELS:
        raise ValueError(f"fin_model={inputs.fin_model!r} must be one of {FIN_MODELS}")
    if not si["frequency_options"] and si["frequency"] is None:
        raise ValueError("frequency_options is empty and no frequency is given")
    if not (isinstance(inputs.supply_margin, (int, float)) and 0 <= inputs.supply_margin < 1):
        raise ValueError(f"supply_margin={inputs.supply_margin!r} must be in [0, 1)")
    if isinstance(inputs.coil_turns, bool) or not isinstance(inputs.coil_turns, int):
        raise ValueError(f"coil_turns={inputs.coil_turns!r} must be a whole number >= 1")
    tube, fitting, filler = (
        _material(inputs, n) for n in ("tube_material", "fitting_material", "filler")
    )
    if filler.brazing_range is None or filler.liquidus is None:
        raise ValueError(
            f"filler={inputs.filler!r} has no brazing range; expected a brazing filler metal "
            "such as 'bag-7' or 'bcup-5'"
        )

    # geometry ----------------------------------------------------------------------------
    r_to = si["tube_outer_diameter"] / 2.0
    r_ti = r_to - si["tube_wall"]
    if not r_ti > 0:
        raise ValueError(
            f"tube_wall={inputs.tube_wall!r} must be less than half the tube outer diameter "
            f"{inputs.tube_outer_diameter!r}"
        )
    r_fi = r_to + si["joint_clearance"] / 2.0
    r_fo = si["fitting_outer_diameter"] / 2.0
    if not r_fo > r_fi:
        raise ValueError(
            f"fitting_outer_diameter={inputs.fitting_outer_diameter!r} must exceed the fitting "
            f"bore {format_value(2 * r_fi, 'length')} (tube outer diameter + joint_clearance)"
        )
    geom = JointGeometry(r_ti, r_to, r_fi, r_fo, si["overlap_length"])
    coil = _coil(si, inputs)
    if not si["coil_inner_diameter"] > 2 * r_fo:
        raise ValueError(
            f"coil_inner_diameter={inputs.coil_inner_diameter!r} must exceed the fitting outer "
            f"diameter {inputs.fitting_outer_diameter!r}"
        )

    # temperatures ------------------------------------------------------------------------
    t0, t_amb = si["start_temperature"], si["ambient_temperature"]
    t_target = _target(si, inputs, filler)
    lo, hi = filler.brazing_range
    limits = (_limit(fitting), _limit(tube))
    for mat, lim, name in ((fitting, limits[0], "fitting"), (tube, limits[1], "tube")):
        t_min = mat.temperature_range()[0]
        for value, arg in ((t0, "start_temperature"), (t_amb, "ambient_temperature")):
            if value < t_min:
                raise ValueError(
                    f"{arg}={getattr(inputs, arg)!r} is below the property tables of the "
                    f"{name} {mat.key} (from {format_value(t_min, 'temperature')})"
                )
        if t_target >= lim:
            raise ValueError(
                f"brazing_temperature {format_value(t_target, 'temperature')} is at or above "
                f"the highest temperature the {name} {mat.key} may take here "
                f"({format_value(lim, 'temperature')}: solidus or end of its property tables)"
            )
    if t0 >= t_target:
        raise ValueError(
            f"start_temperature={inputs.start_temperature!r} must be below the brazing "
            f"temperature {format_value(t_target, 'temperature')}"
        )

    res = BrazingResult(
        title=f"Brazing: {tube.name} in {fitting.name}", inputs=inputs, geometry=geom
    )
    res.brazing_temperature, res.brazing_range = t_target, (lo, hi)
    res.filler_liquidus, res.filler_solidus = filler.liquidus, filler.solidus
    res.power_basis = inputs.power_basis

    # frequency ---------------------------------------------------------------------------
    rho_f_hot = fitting.resistivity(t_target)
    fitting_alone = hcoil.TubeWorkpiece(r_fo, r_fi, geom.overlap_length, rho_f_hot, 1.0)
    composite = hcoil.TubeWorkpiece(r_fo, r_ti, geom.overlap_length, rho_f_hot, 1.0)
    options = sorted(set(si["frequency_options"]) | ({si["frequency"]} - {None}))
    rule = dataclasses.replace(
        hcoil.heating_rule(fitting_alone, low=WALL_RATIO_BAND[0], high=WALL_RATIO_BAND[1]),
        reason="fitting wall / skin depth 1 to 2 for brazing a tube joint (common practice, no "
        "source)",
    )
    table = hcoil.rank_frequencies(coil, fitting_alone, np.array(options), rule=rule)
    optimum = hcoil.heating_rule(fitting_alone)  # through-heating optimum of the fitting alone
    shares, effs = [], []
    for f in table["frequency"]:
        s = composite_power_split(geom, rho_f_hot, tube.resistivity(t_target), f)
        shares.append(s.fitting_share)
        effs.append(
            float(
                hcoil.coil_impedance(
                    coil, composite, f, surface_impedance=s.surface_impedance
                ).efficiency
            )
        )
    table = table.rename(
        columns={"ratio": "wall_to_skin_depth", "efficiency": "efficiency_fitting_alone"}
    )
    table["fitting_share"] = shares
    table["efficiency"] = effs
    table.attrs["optimum"] = (optimum.low, optimum.high)
    res.frequency_table = table
    f = float(table["frequency"].iloc[0]) if si["frequency"] is None else si["frequency"]
    res.frequency = f
    res.fitting_skin_depth = float(em.skin_depth(rho_f_hot, f))

    # the two lumps -----------------------------------------------------------------------
    t_ref = thermal.REFERENCE_TEMPERATURE  # masses from the room-temperature volume
    res.fitting_mass = float(fitting.density(t_ref)) * geom.fitting_section * geom.overlap_length
    res.tube_mass = float(tube.density(t_ref)) * geom.tube_section * geom.overlap_length
    eps_f = _emissivity(fitting, inputs.fitting_surface, "fitting_surface")
    eps_t = _emissivity(tube, inputs.tube_surface, "tube_surface")
    loss_f = thermal.SurfaceLoss(eps_f, t_amb, convection="horizontal_cylinder", length=2 * r_fo)
    loss_t = thermal.SurfaceLoss(eps_t, t_amb, convection="horizontal_cylinder", length=2 * r_to)
    fin_f = Fin(geom.fitting_section, 2 * pi * r_fo, loss_f) if inputs.fitting_conduction else None
    fin_t = Fin(geom.tube_section, 2 * pi * r_to, loss_t) if inputs.tube_conduction else None
    lump_f = Lump(fitting, res.fitting_mass, geom.outer_area, loss_f, fin_f)
    lump_t = Lump(tube, res.tube_mass, 0.0, None, fin_t)
    g_area = si["joint_conductance"] * geom.interface_area
    res.joint_conductance = g_area
    model = JointPowerTable(geom, fitting, tube, f, coil, composite, inputs.power_basis, t0, limits)

    def simulate(power, final=False, duration=_LONGEST_HEAT):
        model.set_power(power)
        return simulate_two_parts(
            lump_f,
            lump_t,
            g_area,
            model,
            duration,
            t_initial=t0,
            stop_at=t_target,
            marks=(lo,),
            limits=limits,
            cool_until=(filler.solidus or lo) if final else None,
            cool_duration=_LONGEST_COOL if final else 0.0,
            fin_model=inputs.fin_model,
            n_output=301 if final else 11,
        )

    h_f = thermal.specific_enthalpy(fitting, [t0, t_target])
    h_t = thermal.specific_enthalpy(tube, [t0, t_target])
    e_min = res.fitting_mass * (h_f[1] - h_f[0]) + res.tube_mass * (h_t[1] - h_t[0])
    if si["power"] is not None:
        power = si["power"]
    else:
        power = _power_for_time(simulate, si["heat_time"], e_min, model, t0, inputs)
    run = simulate(power, final=True)
    if run.stop == "duration":
        raise ValueError(
            f"power={format_value(power, 'power')} ({inputs.power_basis}) does not bring both "
            f"parts to {format_value(t_target, 'temperature')} within "
            f"{_LONGEST_HEAT / 60:.0f} min: the losses take it all; raise the power"
        )
    res.power, res.run, res.series = power, run, run.series
    _results(res, run, model, fitting, tube, lo, hi)
    _electricals(res, si, inputs, coil, composite, model, geom, run)
    h_loss = float(loss_f.flux(t_target)) / (t_target - t_amb)
    h_joint = si["joint_conductance"]
    res.biot = max(
        (h_loss + h_joint) * geom.fitting_wall / float(fitting.thermal_conductivity(t_target)),
        h_joint * geom.tube_wall / float(tube.thermal_conductivity(t_target)),
    )
    add_checks(res, si, fitting, tube, filler)
    add_hand_checks(res, si, fitting, tube, geom, loss_t, h_loss)
    add_texts(res, inputs, fitting, tube, filler, _LONGEST_COOL)
    return res


def _power_for_time(simulate, t_wanted, e_min, model, t0, inputs):
    """Power whose time to the brazing temperature is `t_wanted` (Brent's method)."""
    eta = 1.0
    if inputs.power_basis == "coil":
        split = model.state(t0, t0, None)  # small-field state: a first guess only
        eta = float(model.efficiency(split.surface_impedance))
    guess = e_min / (t_wanted * eta)

    def excess(p):
        return simulate(p, duration=3.0 * t_wanted).heat_end - t_wanted

    lo_p, hi_p = guess, guess
    g_lo = g_hi = excess(guess)
    for _ in range(12):
        if g_lo > 0:
            break
        lo_p /= 1.6
        g_lo = excess(lo_p)
    for _ in range(12):
        if g_hi < 0:
            break
        hi_p *= 1.6
        g_hi = excess(hi_p)
    if not (g_lo > 0 > g_hi):  # pragma: no cover - the time falls steadily with the power
        raise ValueError(f"heat_time={inputs.heat_time!r}: no power found that meets it")
    p = brentq(excess, lo_p, hi_p, rtol=1e-6, xtol=1e-3)
    if simulate(p, duration=3.0 * t_wanted).stop == "limit":
        raise ValueError(
            f"heat_time={inputs.heat_time!r} is too short: a part reaches its temperature limit "
            "(solidus or end of its property data) before both reach the brazing temperature; "
            "allow more time, or raise joint_conductance or use a lower frequency"
        )
    return p


def _results(res, run, model, fitting, tube, lo, hi):
    s = run.series
    heat = s[s["phase"] == "heat"]
    res.target_reached = run.stop == "target"
    res.heat_time = run.heat_end
    res.time_to_range = run.events.get(f"both reach {lo:g} K", math.nan)
    end = heat.iloc[-1]
    res.end_fitting, res.end_tube = float(end["fitting"]), float(end["tube"])
    res.max_fitting, res.max_tube = float(s["fitting"].max()), float(s["tube"].max())
    res.max_difference = float((heat["fitting"] - heat["tube"]).max())
    inside = ((s[["fitting", "tube"]] >= lo) & (s[["fitting", "tube"]] <= hi)).all(axis=1)
    ind = inside.to_numpy(dtype=float)
    res.time_in_range = float(np.sum(np.diff(s.index.to_numpy()) * 0.5 * (ind[1:] + ind[:-1])))
    t0 = float(s["fitting"].iloc[0])
    res.heat_energy = float(
        res.fitting_mass * np.diff(thermal.specific_enthalpy(fitting, [t0, res.end_fitting]))[0]
        + res.tube_mass * np.diff(thermal.specific_enthalpy(tube, [t0, res.end_tube]))[0]
    )
    res.absorbed_start = float(model.absorbed(t0, t0))
    res.absorbed_end = float(model.absorbed(res.end_fitting, res.end_tube))
    res.fitting_share_start = model.fitting_share(t0, t0)
    res.fitting_share_end = model.fitting_share(res.end_fitting, res.end_tube)
    res.closure_error = run.closure_error
    t_mid = 0.5 * (t0 + res.brazing_temperature)
    c_f = res.fitting_mass * float(fitting.specific_heat(t_mid))
    c_t = res.tube_mass * float(tube.specific_heat(t_mid))
    res.equalisation_time = 1.0 / (res.joint_conductance * (1.0 / c_f + 1.0 / c_t))


def _electricals(res, si, inputs, coil, composite, model, geom, run):
    split = model.state(res.end_fitting, res.end_tube, res.power)

    def circuit(p_w):
        with res.collecting(hcoil.EndCorrectionWarning):
            return hcoil.coil_circuit(
                coil, composite, res.frequency, workpiece_power=p_w,
                surface_impedance=split.surface_impedance,
            )  # fmt: skip

    circ = circuit(res.absorbed_end)
    if inputs.power_basis == "coil":
        # the table's efficiency is interpolated; close the power at the terminals exactly
        circ = circuit(res.power * circ.efficiency)
    res.circuit = circ
    res.capacitors = hcoil.capacitor_bank(circ, "parallel")
    res.rating = hcoil.supply_rating(circ, "parallel", margin=inputs.supply_margin)
    res.cooling = _water(coil, circ.copper_loss, si)
    p_f = res.absorbed_end * res.fitting_share_end / geom.outer_area
    k_f = float(model.args[1].thermal_conductivity(res.end_fitting))
    # all the fitting's power entering at its surface and crossing its whole wall: an upper
    # bound of the difference across the wall (part is stored on the way)
    res.wall_difference = p_f * geom.fitting_wall / k_f


def _water(coil, heat, si):
    with warnings.catch_warnings():
        # the velocity and outlet temperature are reported as checks of the job
        warnings.simplefilter("ignore", hcoil.CoolingPracticeWarning)
        return hcoil.coil_cooling_within_velocity(
            coil,
            heat,
            si["water_temperature_rise"],
            inlet_temperature=si["water_inlet_temperature"],
        )
