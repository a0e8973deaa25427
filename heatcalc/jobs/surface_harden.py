"""Surface hardening of a steel shaft: single-shot or scanning.

The part is a long solid cylinder of a hardenable steel. Heating at constant absorbed power
per unit surface (the power density) is followed by an immediate quench, which is named as an
input but not modelled. The calculation:

1. Austenitising temperature: given, or Andrews' Ac3 from the grade's composition plus a
   superheat for the short induction heating time.
2. Frequency: the hot skin depth (above the Curie temperature, at the austenitising
   temperature) against the required case depth, ranked over the available frequencies.
3. Heating with the coupled field-heat transient (:func:`heatcalc.thermal.simulate_heating`)
   until the surface reaches its end-of-heating temperature. Three ways to fix the third
   quantity: a power density (heat time follows), a heat time (power density follows), or
   neither, in which case the power density is found that gives the required case depth.
4. Predicted case depth: the depth that is above the austenitising temperature at the end of
   heating; the core temperature; the radial profile.
5. Scan speed (scanning) as the heated band over the heat time; power; coil electricals at the
   start (cold, magnetic) and the end (hot) of heating; supply rating.
"""

from __future__ import annotations

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
from ._base import Check, HandCheck, JobResult, convert, input_table, positive
from ._induction import surface_state

__all__ = ["HardenInputs", "HardenResult", "run_surface_harden", "case_depth_from_profile"]

#: Hot skin depth / case depth band for the frequency choice: 1.2 to 3 (from memory, after the
#: frequency / case-depth tables of induction-hardening handbooks; heating relies on conduction
#: below 1 and heats too deep above about 3).
HARDEN_BAND = (1.2, 3.0)

_UNITS = {
    "diameter": "length",
    "case_depth": "length",
    "case_depth_tolerance": "length",
    "austenitising_temperature": "temperature",
    "austenitising_superheat": "temperature_difference",
    "surface_temperature": "temperature",
    "power_density": "power_per_area",
    "heat_time": "time",
    "frequency": "frequency",
    "frequency_options": "frequency_list",
    "heated_length": "length",
    "coil_inner_diameter": "length",
    "coil_length": "length",
    "tube_axial_width": "length",
    "tube_radial_depth": "length",
    "tube_wall": "length",
    "coil_temperature": "temperature",
    "start_temperature": "temperature",
    "ambient_temperature": "temperature",
    "max_core_temperature": "temperature",
    "supply_voltage": "voltage",
    "water_inlet_temperature": "temperature",
    "water_temperature_rise": "temperature_difference",
}

DESCRIPTIONS = {
    "material": "steel grade (material key)",
    "diameter": "diameter of the hardened section",
    "case_depth": "required case depth (to the austenitising temperature)",
    "case_depth_tolerance": "allowed excess over the required case depth",
    "austenitising_temperature": "empty: Andrews' Ac3 + superheat",
    "austenitising_superheat": "added to Ac3 for short heating times",
    "surface_temperature": "surface temperature at the end of heating",
    "power_density": "absorbed power per surface (give this, heat_time, or neither)",
    "heat_time": "heating time (give this, power_density, or neither)",
    "frequency": "operating frequency (empty: the best of frequency_options)",
    "frequency_options": "frequencies the supply range offers",
    "process": "'scan' or 'single-shot'",
    "heated_length": "length hardened at once (single-shot) or in all (scan)",
    "coil_inner_diameter": "inductor bore",
    "coil_length": "inductor face length along the axis",
    "coil_turns": "inductor turns",
    "tube_axial_width": "copper profile, size along the axis",
    "tube_radial_depth": "copper profile, radial size",
    "tube_wall": "copper profile wall",
    "coil_temperature": "copper temperature in service",
    "start_temperature": "part temperature before heating",
    "surface": "emissivity condition of the part",
    "ambient_temperature": "surroundings",
    "quenchant": "quench medium (named, not modelled)",
    "max_core_temperature": "largest core temperature at the end of heating (empty: no check)",
    "supply_voltage": "supply output voltage for the matching-transformer ratio",
    "supply_margin": "margin on the supply rating",
    "water_inlet_temperature": "cooling water inlet",
    "water_temperature_rise": "allowed water temperature rise",
}


@dataclass(frozen=True)
class HardenInputs:
    """Inputs of a surface-hardening job; dimensional fields carry units."""

    material: str
    diameter: str
    case_depth: str
    frequency_options: tuple[str, ...]
    coil_inner_diameter: str
    coil_length: str
    heated_length: str
    process: str = "scan"
    case_depth_tolerance: str = "1.0 mm"
    austenitising_temperature: str | None = None
    austenitising_superheat: str = "100 delta_degC"
    surface_temperature: str | None = None
    power_density: str | None = None
    heat_time: str | None = None
    frequency: str | None = None
    coil_turns: int = 1
    tube_axial_width: str | None = None
    tube_radial_depth: str = "10 mm"
    tube_wall: str = "1.5 mm"
    coil_temperature: str = "40 degC"
    start_temperature: str = "20 degC"
    surface: str = "bright"
    ambient_temperature: str = "25 degC"
    quenchant: str = "polymer solution, spray"
    max_core_temperature: str | None = None
    supply_voltage: str | None = None
    supply_margin: float = 0.10
    water_inlet_temperature: str = "25 degC"
    water_temperature_rise: str = "15 delta_degC"

    def to_frame(self) -> pd.DataFrame:
        return input_table(self, DESCRIPTIONS)


@dataclass
class HardenResult(JobResult):
    """Results of :func:`run_surface_harden` (SI units in the attributes)."""

    inputs: HardenInputs | None = None
    austenitising_temperature: float = 0.0
    ac3: float | None = None
    surface_temperature: float = 0.0
    frequency: float = 0.0
    hot_skin_depth: float = 0.0
    power_density: float = 0.0
    heat_time: float = 0.0
    predicted_case_depth: float = 0.0
    core_temperature: float = 0.0
    scan_speed: float | None = None
    workpiece_power: float = 0.0
    supply_power_rating: float = 0.0
    supply_kva_rating: float = 0.0
    transformer_ratio: float | None = None
    closure_error: float = 0.0
    transient: thermal.TransientResult | None = None
    end_profile: pd.DataFrame = field(default_factory=pd.DataFrame)
    electricals: pd.DataFrame = field(default_factory=pd.DataFrame)
    frequency_table: pd.DataFrame = field(default_factory=pd.DataFrame)
    circuits: dict = field(default_factory=dict)
    cooling: hcoil.CoolingResult | None = None

    def summary_rows(self):
        rows = [
            ("steel", self.inputs.material, "text"),
            ("austenitising temperature", self.austenitising_temperature, "temperature"),
            ("surface at the end of heating", self.surface_temperature, "temperature"),
            ("frequency", self.frequency, "frequency"),
            ("hot skin depth", self.hot_skin_depth, "length"),
            ("power density", self.power_density, ("power_per_area", "kW/cm**2")),
            ("heat time", self.heat_time, "time"),
            ("required case depth", self._required, "length"),
            ("predicted case depth", self.predicted_case_depth, "length"),
            ("core at the end of heating", self.core_temperature, "temperature"),
            ("power into the part", self.workpiece_power, "power"),
        ]
        if self.scan_speed is not None:
            rows.append(("scan speed", self.scan_speed, "speed"))
        rows += [
            ("supply rating", self.supply_power_rating, "power"),
            ("supply apparent-power rating", self.supply_kva_rating, "apparent_power"),
        ]
        if self.transformer_ratio is not None:
            rows.append(("matching transformer ratio", self.transformer_ratio, "-"))
        rows.append(("energy balance closure", self.closure_error, "-"))
        return rows

    _required: float = 0.0

    def summary(self) -> pd.DataFrame:
        df = super().summary()
        df.loc[df["quantity"] == "energy balance closure", "value"] = f"{self.closure_error:.1e}"
        if self.ac3 is not None:
            df.loc[df["quantity"] == "austenitising temperature", "value"] += (
                f" (Ac3 {format_value(self.ac3, 'temperature')} + superheat)"
            )
        return df


def _recommendations(self) -> list[str]:
    e = self.electricals.set_index("state")
    out = [
        f"Frequency {format_value(self.frequency, 'frequency')} (hot skin depth "
        f"{format_value(self.hot_skin_depth, 'length')} for a "
        f"{format_value(self._required, 'length')} case).",
        f"Power density {self.power_density / 1e7:.3g} kW/cm² for "
        f"{format_value(self.heat_time, 'time')}; surface "
        f"{format_value(self.surface_temperature, 'temperature')} at the end of heating, then "
        f"quench at once ({self.inputs.quenchant}).",
        f"Predicted case depth {format_value(self.predicted_case_depth, 'length')}; core "
        f"{format_value(self.core_temperature, 'temperature')} at the end of heating.",
        f"Supply {format_value(self.supply_power_rating, 'power')} with the margin; coil current "
        f"up to {e['coil_current_A'].max():.0f} A.",
    ]
    if self.scan_speed is not None:
        out.insert(2, f"Scan speed {format_value(self.scan_speed, 'speed')}.")
    return out


HardenResult.recommendations = _recommendations


def case_depth_from_profile(nodes, temperature, threshold):
    """Depth [m] below the surface that is at or above `threshold` [K].

    Parameters
    ----------
    nodes : array [m]
        Radial positions from the axis; the last is the surface.
    temperature : array [K]
        Temperatures at the nodes.
    threshold : float [K]

    Returns
    -------
    float [m]
        0 if the surface is below the threshold; the radius if the whole section is above it.
        Linear interpolation between the nodes at the first crossing from the surface.

    Examples
    --------
    >>> case_depth_from_profile([0.0, 0.01, 0.02], [300.0, 900.0, 1300.0], 1100.0)
    0.005
    """
    r = np.asarray(nodes, dtype=float)
    t = np.asarray(temperature, dtype=float)
    if t[-1] < threshold:
        return 0.0
    below = np.flatnonzero(t < threshold)
    if below.size == 0:
        return float(r[-1])
    i = below[-1]  # last node (from the axis) below; the crossing is between i and i + 1
    frac = (threshold - t[i]) / (t[i + 1] - t[i])
    r_cross = r[i] + frac * (r[i + 1] - r[i])
    return float(r[-1] - r_cross)


def run_surface_harden(inputs: HardenInputs, n_nodes: int = 120) -> HardenResult:
    """Run a surface-hardening calculation.

    Raises
    ------
    ValueError
        For bad inputs (missing units, negative sizes, both power_density and heat_time, a
        required case depth that no power density reaches, a grade without composition and
        no austenitising temperature).
    """
    if not isinstance(inputs, HardenInputs):
        raise ValueError(f"inputs must be HardenInputs; got {type(inputs).__name__}")
    si = convert(inputs, _UNITS)
    positive(
        si,
        "diameter",
        "case_depth",
        "heated_length",
        "coil_inner_diameter",
        "coil_length",
        "power_density",
        "heat_time",
        "frequency",
        "tube_radial_depth",
        "tube_wall",
    )
    positive(si, "case_depth_tolerance", "austenitising_superheat", allow_zero=True)
    if si["power_density"] is not None and si["heat_time"] is not None:
        raise ValueError(
            "give at most one of power_density and heat_time; got "
            f"power_density={inputs.power_density!r}, heat_time={inputs.heat_time!r}"
        )
    if inputs.process not in ("scan", "single-shot"):
        raise ValueError(f"process={inputs.process!r}; expected 'scan' or 'single-shot'")
    if not 0 <= inputs.supply_margin < 1:
        raise ValueError(f"supply_margin={inputs.supply_margin!r} must be in [0, 1)")
    mat = materials.get(inputs.material)
    if not mat.is_magnetic:
        raise ValueError(
            f"material={inputs.material!r} is not a hardenable (ferritic) steel in the library"
        )
    radius = si["diameter"] / 2.0
    if si["case_depth"] >= radius:
        raise ValueError(
            f"case_depth={inputs.case_depth!r} must be less than the radius "
            f"({format_value(radius, 'length')})"
        )
    if si["coil_inner_diameter"] <= si["diameter"]:
        raise ValueError(
            f"coil_inner_diameter={inputs.coil_inner_diameter!r} must exceed the part diameter "
            f"{inputs.diameter!r}"
        )
    res = HardenResult(title=f"Surface harden: {mat.name}", inputs=inputs)
    res._required = si["case_depth"]

    # austenitising temperature -------------------------------------------------------------
    if si["austenitising_temperature"] is None:
        if not mat.composition:
            raise ValueError(
                f"material {mat.key!r} has no composition: give austenitising_temperature"
            )
        res.ac3 = materials.ac3_andrews(dict(mat.composition))
        t_aus = res.ac3 + si["austenitising_superheat"]
    else:
        t_aus = si["austenitising_temperature"]
    res.austenitising_temperature = t_aus
    t_surf = si["surface_temperature"] if si["surface_temperature"] is not None else t_aus + 120.0
    if t_surf <= t_aus:
        raise ValueError(
            f"surface_temperature={inputs.surface_temperature!r} must be above the "
            f"austenitising temperature ({format_value(t_aus, 'temperature')})"
        )
    mat.specific_heat(np.array([si["start_temperature"], t_surf]))  # range check
    res.surface_temperature = t_surf

    res.assumptions = [
        "The hardened section is a long cylinder (no end effects); heat flows radially.",
        "Constant absorbed power per unit surface during heating; the induced-current "
        "distribution follows the temperature- and field-dependent properties.",
        "Case depth = depth above the austenitising temperature at the end of heating; the "
        f"quench ({inputs.quenchant}) starts at once and is assumed fast enough to transform "
        "all austenite (the quench is not modelled; hardenability is not checked).",
        "Scanning is treated as single-shot heating of each point for heat time = coil face "
        "length / scan speed (the field under a scanning inductor is taken as uniform).",
        "Austenitising temperature from Andrews' Ac3 plus a superheat for the short heating "
        "time unless given.",
    ]
    res.sources = [
        "Material data: data/materials/" + mat.key + ".toml",
        "Ac3: Andrews, J. Iron Steel Inst. 203 (1965) 721",
        "Induced currents: radial finite-element field solution (heatcalc.em)",
        "Transient: implicit enthalpy method (heatcalc.thermal)",
        "Frequency band: hot skin depth 1.2-3 x case depth (from memory, induction-hardening "
        "handbook tables)",
    ]

    # frequency ---------------------------------------------------------------------------
    rho_hot = mat.resistivity(t_aus)
    hot = hcoil.CylinderWorkpiece(radius, si["coil_length"], rho_hot, 1.0)
    axial = si["tube_axial_width"] or si["coil_length"] / inputs.coil_turns
    conductor = hcoil.RectangularTube(axial, si["tube_radial_depth"], si["tube_wall"])
    rho_cu = materials.get("cu-etp").resistivity(si["coil_temperature"])
    coil = hcoil.SolenoidCoil(
        inputs.coil_turns, si["coil_length"], si["coil_inner_diameter"], conductor, rho_cu
    )
    rule = hcoil.heating_rule(
        hot,
        "surface_hardening",
        case_depth=si["case_depth"],
        low=HARDEN_BAND[0],
        high=HARDEN_BAND[1],
    )
    options = sorted(set(si["frequency_options"]) | ({si["frequency"]} - {None}))
    if not options:
        raise ValueError("frequency_options is empty and no frequency is given")
    table = hcoil.rank_frequencies(coil, hot, np.array(options), rule=rule)
    f = (
        si["frequency"]
        if si["frequency"] is not None
        else float(table.sort_values("rank")["frequency"].iloc[0])
    )
    res.frequency = f
    res.hot_skin_depth = float(em.skin_depth(rho_hot, f))
    res.frequency_table = table

    # heating -------------------------------------------------------------------------------
    loss = thermal.SurfaceLoss(
        emissivity=mat.emissivity(inputs.surface),
        t_surroundings=si["ambient_temperature"],
        convection="horizontal_cylinder",
        length=si["diameter"],
    )
    t0 = si["start_temperature"]
    k0, rc0 = mat.thermal_conductivity(t0), mat.density(t0) * mat.specific_heat(t0)

    def simulate(p, duration, profile=True):
        seg = [thermal.Segment(duration, "power", p, f, loss, "heat")]
        with warnings.catch_warnings():
            warnings.simplefilter("ignore", em.ConvergenceWarning)
            return thermal.simulate_heating(
                mat,
                "cylinder",
                radius,
                seg,
                t_initial=t0,
                n_nodes=n_nodes,
                steps_per_segment=200,
                profile_times=(duration,) if profile else (),
            )

    def time_to_surface(p):
        """Heat time [s] for the surface to reach t_surf at power density p."""
        # constant-flux semi-infinite solid: T_s - T_0 = 2 q sqrt(t / (pi k rho c))
        guess = math.pi * k0 * rc0 * ((t_surf - t0) / (2 * p)) ** 2
        duration = 1.5 * guess
        short, long = 0.0, math.inf  # durations known too short / overshooting the tables
        for _ in range(30):
            try:
                tr = simulate(p, duration, profile=False)
            except materials.OutOfRangeError:
                long = duration
            else:
                if tr.series["surface"].max() >= t_surf:
                    return tr.time_to_reach(t_surf, "surface")
                short = duration
            if short > 600:
                break
            duration = 2.0 * duration if math.isinf(long) else 0.5 * (short + long)
        raise ValueError(
            f"power density {p / 1e4:.3g} W/cm2 does not bring the surface to "
            f"{format_value(t_surf, 'temperature')} within 10 min"
        )

    def state_at(p):
        t_h = time_to_surface(p)
        tr = simulate(p, t_h)
        prof = tr.profile(t_h)
        return t_h, tr, prof, case_depth_from_profile(tr.nodes, prof, t_aus)

    if si["power_density"] is not None:
        p = si["power_density"]
        t_h, tr, prof, depth = state_at(p)
    elif si["heat_time"] is not None:
        t_target = si["heat_time"]

        def g(logp):
            return math.log(time_to_surface(math.exp(logp)) / t_target)

        p = math.exp(brentq(g, math.log(1e5), math.log(2e8), xtol=1e-4))
        t_h, tr, prof, depth = state_at(p)
    else:

        def gd(logp):
            return state_at(math.exp(logp))[3] - si["case_depth"] * 1.1

        try:
            logp = brentq(gd, math.log(1e6), math.log(1e8), xtol=2e-3)
        except ValueError:
            raise ValueError(
                f"no power density between 100 W/cm2 and 10 kW/cm2 gives case_depth="
                f"{inputs.case_depth!r} at {format_value(f, 'frequency')}; change the "
                "frequency or give power_density"
            ) from None
        p = math.exp(logp)
        t_h, tr, prof, depth = state_at(p)
    res.power_density, res.heat_time = p, t_h
    res.transient, res.closure_error = tr, tr.closure_error
    res.predicted_case_depth = depth
    res.core_temperature = float(prof[0])
    res.end_profile = pd.DataFrame(
        {"depth_mm": (radius - tr.nodes) * 1e3, "temperature_degC": prof - 273.15}
    )
    area = (
        pi
        * si["diameter"]
        * (si["coil_length"] if inputs.process == "scan" else si["heated_length"])
    )
    res.workpiece_power = p * area
    if inputs.process == "scan":
        res.scan_speed = si["coil_length"] / t_h

    # electricals: start (cold, magnetic) and end (hot) of heating -------------------------
    wp_len = si["coil_length"] if inputs.process == "scan" else si["heated_length"]
    rows = []
    for label, profile in (("start (cold)", np.full_like(prof, t0)), ("end (hot)", prof)):
        st = surface_state(mat, "cylinder", tr.nodes, profile, f, p)
        wp = hcoil.CylinderWorkpiece(
            radius, wp_len, st.resistivity_surface, max(1.0, st.mu_r_surface)
        )
        with res.collecting(hcoil.EndCorrectionWarning):
            circ = hcoil.coil_circuit(
                coil,
                wp,
                f,
                workpiece_power=res.workpiece_power,
                surface_impedance=st.surface_impedance,
            )
        res.circuits[label] = circ
        rating = hcoil.supply_rating(circ, "series", margin=inputs.supply_margin)
        rows.append(
            {
                "state": label,
                "surface_mu_r": st.mu_r_surface,
                "surface_skin_depth_mm": st.skin_depth_surface * 1e3,
                "end_correction_ratio": circ.interior_to_return_ratio,
                "coil_efficiency": circ.efficiency,
                "power_factor": circ.power_factor,
                "coil_current_A": circ.coil_current,
                "coil_voltage_V": circ.coil_voltage,
                "supply_kW": rating.power_rating / 1e3,
                "supply_kVA": rating.apparent_power_rating / 1e3,
            }
        )
    res.electricals = pd.DataFrame(rows)
    res.supply_power_rating = float(res.electricals["supply_kW"].max() * 1e3)
    res.supply_kva_rating = float(res.electricals["supply_kVA"].max() * 1e3)
    worst = max(res.circuits.values(), key=lambda c: c.copper_loss)
    if si["supply_voltage"] is not None:
        res.transformer_ratio = si["supply_voltage"] / max(
            c.coil_voltage for c in res.circuits.values()
        )
    with warnings.catch_warnings():
        warnings.simplefilter("ignore", hcoil.CoolingPracticeWarning)
        res.cooling = hcoil.coil_cooling(
            coil,
            worst.copper_loss,
            si["water_temperature_rise"],
            inlet_temperature=si["water_inlet_temperature"],
        )

    _checks(res, si, mat, t_aus)
    _hand_checks(res, si, mat, k0, rc0)
    return res


def _checks(res: HardenResult, si: dict, mat, t_aus: float) -> None:
    need, tol = si["case_depth"], si["case_depth_tolerance"]
    d = res.predicted_case_depth
    res.checks.append(
        Check(
            "predicted case depth",
            format_value(d, "length", sig=3),
            f"{format_value(need, 'length')} to {format_value(need + tol, 'length')}",
            need <= d <= need + tol,
            "depth above the austenitising temperature at the end of heating",
        )
    )
    ratio = res.hot_skin_depth / need
    lo, hi = HARDEN_BAND
    res.checks.append(
        Check(
            "hot skin depth / case depth in band",
            f"{ratio:.3g}",
            f"{lo:g} to {hi:g}",
            lo <= ratio <= hi,
            "below: slow, relies on conduction; above: heats too deep",
        )
    )
    if si["max_core_temperature"] is not None:
        res.checks.append(
            Check(
                "core temperature at the end of heating",
                format_value(res.core_temperature, "temperature"),
                f"<= {format_value(si['max_core_temperature'], 'temperature')}",
                res.core_temperature <= si["max_core_temperature"],
                "distortion and a soft core",
            )
        )
    res.checks.append(
        Check(
            "energy balance of the transient closes",
            f"{res.closure_error:.1e}",
            "|error| < 1e-3",
            abs(res.closure_error) < 1e-3,
        )
    )
    v = res.cooling.velocity
    res.checks.append(
        Check(
            "inductor cooling-water velocity",
            f"{v:.2f} m/s",
            "1 to 4 m/s (common practice, no source)",
            1.0 <= v <= 4.0,
            "; ".join(res.cooling.cautions),
        )
    )
    if not lo <= ratio <= hi:
        res.warn(
            f"hot skin depth / case depth is {ratio:.3g} at "
            f"{format_value(res.frequency, 'frequency')}: outside {lo:g}-{hi:g}"
        )
    if res.heat_time < 0.5:
        res.warn(
            f"heat time {res.heat_time:.2f} s is very short: control and quench timing "
            "become critical"
        )


def _hand_checks(res: HardenResult, si: dict, mat, k0: float, rc0: float) -> None:
    dt = res.surface_temperature - si["start_temperature"]
    t_semi = math.pi * k0 * rc0 * (dt / (2 * res.power_density)) ** 2
    res.hand_checks = [
        HandCheck(
            "heat time, order of magnitude",
            "t ~ pi k rho c (dT / 2q)^2 (constant flux into a semi-infinite solid, cold "
            "properties; Carslaw & Jaeger 1959 sec. 2.9)",
            f"{t_semi:.3g} s vs {res.heat_time:.3g} s computed",
        ),
        HandCheck(
            "hot skin depth",
            "delta = 503 sqrt(rho / f)",
            f"rho = {mat.resistivity(res.austenitising_temperature):.3g} ohm m, f = "
            f"{res.frequency:.4g} Hz: {res.hot_skin_depth * 1e3:.3g} mm",
        ),
        HandCheck(
            "power into the part",
            "P = q x pi D x length",
            f"{res.power_density / 1e4:.4g} W/cm2 x {math.pi * si['diameter'] * 1e3:.4g} mm x "
            f"length = {res.workpiece_power / 1e3:.4g} kW",
        ),
    ]
    if res.scan_speed is not None:
        res.hand_checks.append(
            HandCheck(
                "scan speed",
                "v = coil face length / heat time",
                f"{si['coil_length'] * 1e3:.4g} mm / {res.heat_time:.3g} s = "
                f"{res.scan_speed * 1e3:.4g} mm/s",
            )
        )
