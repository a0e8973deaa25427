"""Billet through-heating on a progressive line of coil sections (forging).

Billets travel end to end through ``n`` equal coil sections; each section holds a constant
absorbed power per unit surface (the supplies are power-regulated). The calculation:

1. Throughput -> mass rate, pieces per hour and billet speed.
2. Frequency: for each available frequency, diameter / skin depth cold (magnetic, at the
   surface field of the first section) and hot (above the Curie temperature, at the target
   temperature); the hot ratio ranks the frequencies (:func:`heatcalc.coil.rank_frequencies`,
   through-heating rule) unless a frequency is fixed.
3. Heating time: the coupled field-heat transient (:func:`heatcalc.thermal.simulate_heating`)
   with the section powers scaled so that the mean temperature at the exit of the line is the
   target; the shortest heating time whose surface-centre difference at the exit is within the
   allowed spread is found by a secant search on log(time) (the spread falls roughly as
   1/time). A heating time may be given instead.
4. Line length, billets in the coil, section lengths and turns.
5. Electricals of every section at its mid-point temperature profile (surface impedance of the
   radially varying properties), capacitors, supply rating, cooling water.
6. Transfer to the press (cooling in air) and the temperatures the press sees.
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
from ..units import UnitsError, format_value, parse_quantity, to_si
from ._base import Check, HandCheck, JobResult, JobWarning, convert, input_table, positive
from ._induction import surface_state

__all__ = ["ThroughHeatInputs", "ThroughHeatResult", "run_through_heat"]

_UNITS = {
    "diameter": "length",
    "billet_length": "length",
    "target_temperature": "temperature",
    "allowed_spread": "temperature_difference",
    "start_temperature": "temperature",
    "frequency": "frequency",
    "frequency_options": "frequency_list",
    "heating_time": "time",
    "coil_inner_diameter": "length",
    "turn_pitch": "length",
    "tube_axial_width": "length",
    "tube_radial_depth": "length",
    "tube_wall": "length",
    "coil_temperature": "temperature",
    "transfer_time": "time",
    "ambient_temperature": "temperature",
    "max_coil_voltage": "voltage",
    "water_inlet_temperature": "temperature",
    "water_temperature_rise": "temperature_difference",
}

DESCRIPTIONS = {
    "material": "billet steel (material key)",
    "diameter": "billet diameter",
    "billet_length": "billet length",
    "throughput": "mass rate ('1.5 t/h') or pieces per hour ('600 1/h')",
    "target_temperature": "mean temperature at the exit of the line",
    "allowed_spread": "largest surface - centre difference at the exit",
    "start_temperature": "billet temperature at entry",
    "frequency": "operating frequency (empty: the best of frequency_options)",
    "frequency_options": "frequencies the supply range offers",
    "coil_sections": "number of coil sections in line",
    "section_power_shares": "share of the line power per section (empty: equal)",
    "heating_time": "time in the coil (empty: the shortest within the spread)",
    "coil_inner_diameter": "coil bore (over the liner)",
    "turn_pitch": "axial pitch of the turns",
    "tube_axial_width": "copper tube, size along the axis",
    "tube_radial_depth": "copper tube, radial size",
    "tube_wall": "copper tube wall",
    "coil_temperature": "copper temperature in service",
    "transfer_time": "time from coil exit to the press",
    "surface": "emissivity condition of the billet surface",
    "ambient_temperature": "surroundings",
    "max_coil_voltage": "largest coil voltage of a section supply",
    "supply_margin": "margin on the supply rating",
    "water_inlet_temperature": "cooling water inlet",
    "water_temperature_rise": "allowed water temperature rise",
}


@dataclass(frozen=True)
class ThroughHeatInputs:
    """Inputs of a billet through-heat job; dimensional fields carry units."""

    material: str
    diameter: str
    billet_length: str
    throughput: str
    target_temperature: str
    allowed_spread: str
    frequency_options: tuple[str, ...]
    coil_inner_diameter: str
    frequency: str | None = None
    coil_sections: int = 3
    section_power_shares: tuple[float, ...] = ()
    heating_time: str | None = None
    start_temperature: str = "20 degC"
    turn_pitch: str = "16 mm"
    tube_axial_width: str = "13 mm"
    tube_radial_depth: str = "10 mm"
    tube_wall: str = "1.5 mm"
    coil_temperature: str = "40 degC"
    transfer_time: str = "6 s"
    surface: str = "oxidised"
    ambient_temperature: str = "25 degC"
    max_coil_voltage: str | None = None
    supply_margin: float = 0.10
    water_inlet_temperature: str = "25 degC"
    water_temperature_rise: str = "15 delta_degC"

    def to_frame(self) -> pd.DataFrame:
        return input_table(self, DESCRIPTIONS)


@dataclass
class ThroughHeatResult(JobResult):
    """Results of :func:`run_through_heat` (SI units in the attributes)."""

    inputs: ThroughHeatInputs | None = None
    frequency: float = 0.0
    mass_rate: float = 0.0
    pieces_rate: float = 0.0
    billet_mass: float = 0.0
    heating_time: float = 0.0
    line_length: float = 0.0
    billets_in_coil: float = 0.0
    speed: float = 0.0
    exit_surface: float = 0.0
    exit_centre: float = 0.0
    exit_mean: float = 0.0
    press_surface: float = 0.0
    press_centre: float = 0.0
    max_surface: float = 0.0
    workpiece_power: float = 0.0
    net_power: float = 0.0
    copper_loss: float = 0.0
    coil_efficiency: float = 0.0
    supply_power_rating: float = 0.0
    supply_kva_rating: float = 0.0
    capacitor_kvar: float = 0.0
    cooling_flow: float = 0.0
    closure_error: float = 0.0
    transient: thermal.TransientResult | None = None
    sections: pd.DataFrame = field(default_factory=pd.DataFrame)
    frequency_table: pd.DataFrame = field(default_factory=pd.DataFrame)
    circuits: list = field(default_factory=list)
    section_times: np.ndarray = field(default_factory=lambda: np.zeros(0))
    curie_temperature: float | None = None

    def summary_rows(self):
        return [
            ("billet", self.inputs.material, "text"),
            ("billet mass", self.billet_mass, "mass"),
            ("throughput", self.mass_rate, "mass_rate"),
            ("pieces per hour", self.pieces_rate * 3600, "-"),
            ("frequency", self.frequency, "frequency"),
            ("heating time", self.heating_time, "time"),
            ("billet speed", self.speed, "speed"),
            ("line length (coil)", self.line_length, "length"),
            ("billets in the coil", self.billets_in_coil, "-"),
            ("exit: surface", self.exit_surface, "temperature"),
            ("exit: centre", self.exit_centre, "temperature"),
            ("exit: mean", self.exit_mean, "temperature"),
            (
                "exit: surface - centre",
                self.exit_surface - self.exit_centre,
                "temperature_difference",
            ),
            ("at the press: surface", self.press_surface, "temperature"),
            ("at the press: centre", self.press_centre, "temperature"),
            ("highest surface temperature", self.max_surface, "temperature"),
            ("power into the billets", self.workpiece_power, "power"),
            ("heat content delivered (m dh/dt)", self.net_power, "power"),
            ("coil copper loss", self.copper_loss, "power"),
            ("coil efficiency (line)", self.coil_efficiency, "%"),
            ("capacitor banks (sum)", self.capacitor_kvar, "reactive_power"),
            ("supply rating (sum)", self.supply_power_rating, "power"),
            ("supply apparent-power rating", self.supply_kva_rating, "apparent_power"),
            ("cooling water (coils)", self.cooling_flow, "volume_rate"),
            ("energy balance closure", self.closure_error, "-"),
        ]

    def summary(self) -> pd.DataFrame:
        df = super().summary()
        df.loc[df["quantity"] == "pieces per hour", "value"] = f"{self.pieces_rate * 3600:.0f}"
        df.loc[df["quantity"] == "billets in the coil", "value"] = f"{self.billets_in_coil:.1f}"
        df.loc[df["quantity"] == "energy balance closure", "value"] = f"{self.closure_error:.1e}"
        return df


def _recommendations(self) -> list[str]:
    sec = self.sections
    return [
        f"Frequency {format_value(self.frequency, 'frequency')}: diameter / skin depth "
        f"{self.frequency_table.set_index('frequency').loc[self.frequency, 'hot_ratio']:.3g} "
        "above the Curie temperature.",
        f"Line of {len(sec)} coil sections, {format_value(self.line_length, 'length')} in all "
        f"({int(sec['turns'].iloc[0])} turns each), heating time "
        f"{format_value(self.heating_time, 'time')} at "
        f"{format_value(self.speed, 'speed')} billet speed.",
        f"Section powers {', '.join(f'{p:.0f}' for p in sec['power_kW'])} kW into the billets; "
        f"supplies rated {format_value(self.supply_power_rating, 'power')} in all with the "
        "margin.",
        f"Exit: mean {format_value(self.exit_mean, 'temperature')}, surface - centre "
        f"{format_value(self.exit_surface - self.exit_centre, 'temperature_difference')}; at "
        f"the press the surface is {format_value(self.press_surface, 'temperature')}.",
    ]


ThroughHeatResult.recommendations = _recommendations


def _throughput(text, billet_mass: float) -> tuple[float, float]:
    """Mass rate [kg/s] and pieces rate [1/s] from '1.5 t/h' or '600 1/h'."""
    q = parse_quantity(text, "throughput")
    if q.check("[mass]/[time]"):
        rate = to_si(q, "kg/s", name="throughput")
        return rate, rate / billet_mass
    if q.check("1/[time]"):
        pieces = to_si(q, "1/s", name="throughput")
        return pieces * billet_mass, pieces
    raise UnitsError(
        f"throughput={text!r} has dimension {q.dimensionality}; expected a mass rate such as "
        "'1.5 t/h' or a piece rate such as '600 1/h'"
    )


def _shares(inputs) -> np.ndarray:
    n = inputs.coil_sections
    if not (isinstance(n, int) and 1 <= n <= 12):
        raise ValueError(f"coil_sections={n!r} must be a whole number from 1 to 12")
    if not inputs.section_power_shares:
        return np.full(n, 1.0 / n)
    s = np.asarray(inputs.section_power_shares, dtype=float)
    if s.size != n or np.any(s <= 0):
        raise ValueError(
            f"section_power_shares={inputs.section_power_shares!r} must give {n} positive "
            "shares, one per coil section"
        )
    return s / s.sum()


def run_through_heat(inputs: ThroughHeatInputs, n_nodes: int = 60) -> ThroughHeatResult:
    """Run a billet through-heat calculation.

    Parameters
    ----------
    inputs : ThroughHeatInputs
    n_nodes : int
        Radial nodes of the transient (60 is converged to about 1 K for billets; more for
        a final check).

    Returns
    -------
    ThroughHeatResult

    Raises
    ------
    ValueError
        For bad inputs (missing units, negative sizes, temperatures outside the material's
        tables, a spread that cannot be met within ten minutes in the coil).
    """
    if not isinstance(inputs, ThroughHeatInputs):
        raise ValueError(f"inputs must be ThroughHeatInputs; got {type(inputs).__name__}")
    si = convert(inputs, _UNITS)
    positive(
        si,
        "diameter",
        "billet_length",
        "allowed_spread",
        "coil_inner_diameter",
        "turn_pitch",
        "heating_time",
        "frequency",
        "max_coil_voltage",
    )
    positive(si, "transfer_time", allow_zero=True)
    if not si["frequency_options"] and si["frequency"] is None:
        raise ValueError("frequency_options is empty and no frequency is given")
    if not 0 <= inputs.supply_margin < 1:
        raise ValueError(f"supply_margin={inputs.supply_margin!r} must be in [0, 1)")
    mat = materials.get(inputs.material)
    radius = si["diameter"] / 2.0
    if si["coil_inner_diameter"] <= si["diameter"]:
        raise ValueError(
            f"coil_inner_diameter={inputs.coil_inner_diameter!r} must exceed the billet "
            f"diameter {inputs.diameter!r}"
        )
    t0, t_target = si["start_temperature"], si["target_temperature"]
    if t_target <= t0:
        raise ValueError(
            f"target_temperature={inputs.target_temperature!r} must be above the start "
            f"temperature {inputs.start_temperature!r}"
        )
    mat.specific_heat(np.array([t0, t_target]))  # range check with the material's message
    shares = _shares(inputs)
    n_sec = inputs.coil_sections

    res = ThroughHeatResult(title=f"Billet through-heat: {mat.name}", inputs=inputs)
    res.curie_temperature = mat.curie_temperature
    res.billet_mass = mat.density(293.15) * pi * radius**2 * si["billet_length"]
    res.mass_rate, res.pieces_rate = _throughput(inputs.throughput, res.billet_mass)
    positive({"throughput": res.mass_rate}, "throughput")
    res.speed = res.pieces_rate * si["billet_length"]
    res.assumptions = [
        "Billets travel end to end; each is treated as a long cylinder (no end effects; heat "
        "flows radially only; end faces neither absorb nor lose heat).",
        "Each coil section holds a constant absorbed power per unit surface (power-regulated "
        "supplies); power is distributed in depth by the induced-current solution with "
        "temperature- and field-dependent properties.",
        "Surface losses: radiation with the stated emissivity plus natural convection from a "
        "horizontal cylinder, in the coil and during the transfer.",
        "Coil electricals per section at the section's mid-point temperature profile; the coil "
        "is the section's length of a long solenoid with Nagaoka's end correction.",
        "Sections are fed by separate supplies of the same frequency; ratings are summed.",
    ]
    res.sources = [
        "Material data: data/materials/" + mat.key + ".toml",
        "Induced currents: radial finite-element field solution (heatcalc.em)",
        "Transient: implicit enthalpy method (heatcalc.thermal), checked against Carslaw & "
        "Jaeger, Conduction of Heat in Solids, 1959, sec. 7.7",
        "Convection: Churchill & Chu, Int. J. Heat Mass Transfer 18 (1975), via ht",
        "Through-heating frequency rule: diameter / skin depth >= 3.56 (optimum of P(m)/m)",
    ]

    loss = thermal.SurfaceLoss(
        emissivity=mat.emissivity(inputs.surface),
        t_surroundings=si["ambient_temperature"],
        convection="horizontal_cylinder",
        length=si["diameter"],
    )
    conductor = hcoil.RectangularTube(
        si["tube_axial_width"], si["tube_radial_depth"], si["tube_wall"]
    )
    rho_cu = materials.get("cu-etp").resistivity(si["coil_temperature"])
    area_per_length = 2 * pi * radius
    dh = float(thermal.specific_enthalpy(mat, t_target) - thermal.specific_enthalpy(mat, t0))
    res.net_power = res.mass_rate * dh

    # frequency ------------------------------------------------------------------------------
    rho_hot = mat.resistivity(t_target)
    # billets run end to end, so the workpiece fills the (probe) coil's length
    probe_length = 0.5
    hot = hcoil.CylinderWorkpiece(radius, probe_length, rho_hot, 1.0)
    probe_coil = hcoil.SolenoidCoil(
        max(1, int(probe_length / si["turn_pitch"])),
        probe_length,
        si["coil_inner_diameter"],
        conductor,
        rho_cu,
    )
    options = sorted(set(si["frequency_options"]) | ({si["frequency"]} - {None}))
    table = hcoil.rank_frequencies(probe_coil, hot, np.array(options))
    table = table.rename(columns={"ratio": "hot_ratio"})
    if si["frequency"] is None:
        f = float(table.sort_values("rank")["frequency"].iloc[0])
    else:
        f = si["frequency"]
    res.frequency = f

    # heating time and section powers -----------------------------------------------------------
    def simulate(t_heat, p_total):
        segs = [
            thermal.Segment(t_heat / n_sec, "power", p_total * s, f, loss, f"coil {k + 1}")
            for k, s in enumerate(shares)
        ]
        mids = tuple((k + 0.5) * t_heat / n_sec for k in range(n_sec))
        ends = tuple((k + 1) * t_heat / n_sec for k in range(n_sec))
        if si["transfer_time"] > 0:
            segs.append(thermal.transfer_segment(si["transfer_time"], loss))
        with warnings.catch_warnings():
            warnings.simplefilter("ignore", em.ConvergenceWarning)
            return thermal.simulate_heating(
                mat,
                "cylinder",
                radius,
                segs,
                t_initial=t0,
                n_nodes=n_nodes,
                steps_per_segment=60,
                profile_times=mids + ends,
            )

    def at_exit(tr, t_heat):
        s = tr.series
        row = s.loc[s.index <= t_heat * (1 + 1e-9)].iloc[-1]
        return row

    def solve_power(t_heat, p_guess):
        """Absorbed power per area (sum over sections) that gives the target exit mean."""
        p = p_guess
        for _ in range(8):
            tr = simulate(t_heat, p * n_sec)
            mean = at_exit(tr, t_heat)["mean"]
            h_got = float(thermal.specific_enthalpy(mat, mean) - thermal.specific_enthalpy(mat, t0))
            # absorbed energy raises the enthalpy; losses take a part: scale on the enthalpy
            p_new = p * dh / h_got
            if abs(p_new / p - 1) < 2e-3:
                return tr, p_new
            p = p_new
        return tr, p

    def p_first_guess(t_heat):
        return (res.billet_mass * dh / t_heat) / (area_per_length * si["billet_length"]) / n_sec

    if si["heating_time"] is not None:
        t_heat = si["heating_time"]
        tr, p_sec = solve_power(t_heat, p_first_guess(t_heat))
    else:
        # secant on log(spread) - log(allowed) against log(time)
        allowed = si["allowed_spread"]
        guesses = []
        t_heat = max(20.0, 2.0 * radius**2 * mat.density(t0) * mat.specific_heat(t0) / 30.0)
        p_sec = p_first_guess(t_heat)
        tr = None
        for _ in range(14):
            try:
                tr, p_sec = solve_power(t_heat, p_sec)
            except materials.OutOfRangeError:
                # the surface left the material's tables: far too fast, lengthen the time
                t_heat *= 1.6
                p_sec /= 1.6
                continue
            row = at_exit(tr, t_heat)
            spread = max(row["surface"] - row["centre"], 1e-3)
            g = math.log(spread / allowed)
            guesses.append((math.log(t_heat), g, tr, p_sec))
            if abs(g) < 0.02 and spread <= allowed * 1.001:
                break
            if len(guesses) == 1:
                x_new = math.log(t_heat) + g  # spread ~ 1/time
            else:
                (x1, g1, *_), (x2, g2, *_) = guesses[-2], guesses[-1]
                x_new = x2 - g2 * (x2 - x1) / (g2 - g1) if g2 != g1 else x2 + g2
            x_new = min(x_new, math.log(600.0))
            t_next = math.exp(x_new) * (1.0 + 0.01)  # aim just inside the limit
            if t_next >= 600.0 and len(guesses) > 2 and guesses[-1][1] > 0:
                raise ValueError(
                    f"allowed_spread={inputs.allowed_spread!r} cannot be met with up to 10 min "
                    "in the coil at this frequency; allow more spread, use a lower frequency or "
                    "a soak"
                )
            p_sec *= t_heat / t_next
            t_heat = t_next
        if tr is None or guesses[-1][1] > 0.05:
            raise ValueError(
                f"no heating time up to 10 min meets allowed_spread={inputs.allowed_spread!r} "
                "without overheating the surface; allow more spread or lower the target"
            )
        t_heat, tr, p_sec = math.exp(guesses[-1][0]), guesses[-1][2], guesses[-1][3]
    res.heating_time = t_heat
    res.transient = tr
    res.closure_error = tr.closure_error
    exit_row = at_exit(tr, t_heat)
    res.exit_surface, res.exit_centre = exit_row["surface"], exit_row["centre"]
    res.exit_mean = exit_row["mean"]
    last = tr.series.iloc[-1]
    res.press_surface, res.press_centre = last["surface"], last["centre"]
    res.max_surface = float(tr.series["surface"].max())

    # line ---------------------------------------------------------------------------------
    res.line_length = res.speed * t_heat
    res.billets_in_coil = t_heat * res.pieces_rate
    sec_len = res.line_length / n_sec
    turns = max(1, int(round(sec_len / si["turn_pitch"])))
    if turns * si["tube_axial_width"] > sec_len:
        turns = int(sec_len / si["tube_axial_width"])
    if turns < 1:
        raise ValueError(
            f"a coil section of {format_value(sec_len, 'length')} is shorter than one turn "
            f"({inputs.tube_axial_width!r}); use fewer sections"
        )

    # electricals per section ---------------------------------------------------------------
    rows, circuits = [], []
    cu_total = p_total = kvar = kw = kva = flow = 0.0
    res.section_times = np.array([(k + 1) * t_heat / n_sec for k in range(n_sec)])
    for k, s in enumerate(shares):
        t_mid = (k + 0.5) * t_heat / n_sec
        prof = tr.profile(t_mid)
        p_area = p_sec * n_sec * s
        state = surface_state(mat, "cylinder", tr.nodes, prof, f, p_area)
        coil = hcoil.SolenoidCoil(turns, sec_len, si["coil_inner_diameter"], conductor, rho_cu)
        wp = hcoil.CylinderWorkpiece(
            radius, sec_len, state.resistivity_surface, max(1.0, state.mu_r_surface)
        )
        p_w = p_area * area_per_length * sec_len
        with res.collecting(hcoil.EndCorrectionWarning):
            circ = hcoil.coil_circuit(
                coil, wp, f, workpiece_power=p_w, surface_impedance=state.surface_impedance
            )
        bank = hcoil.capacitor_bank(circ, "parallel")
        rating = hcoil.supply_rating(circ, "parallel", margin=inputs.supply_margin)
        cool = _water(coil, circ.copper_loss, si)
        circuits.append(circ)
        cu_total += circ.copper_loss
        p_total += p_w
        kvar += bank.reactive_power
        kw += rating.power_rating
        kva += rating.apparent_power_rating
        flow += cool.volume_flow
        rows.append(
            {
                "section": f"coil {k + 1}",
                "length_mm": sec_len * 1e3,
                "turns": turns,
                "power_kW": p_w / 1e3,
                "power_per_area_W_per_mm2": p_area / 1e6,
                "surface_degC_mid": prof[-1] - 273.15,
                "centre_degC_mid": prof[0] - 273.15,
                "surface_mu_r": state.mu_r_surface,
                "surface_skin_depth_mm": state.skin_depth_surface * 1e3,
                "end_correction_ratio": circ.interior_to_return_ratio,
                "coil_efficiency": circ.efficiency,
                "power_factor": circ.power_factor,
                "coil_current_A": circ.coil_current,
                "coil_voltage_V": circ.coil_voltage,
                "capacitors_kvar": bank.reactive_power / 1e3,
                "water_circuits": cool.circuits,
                "water_L_per_min": cool.volume_flow * 6e4,
                "water_velocity_m_per_s": cool.velocity,
            }
        )
    res.circuits = circuits
    res.sections = pd.DataFrame(rows)
    res.workpiece_power = p_total
    res.copper_loss = cu_total
    res.coil_efficiency = p_total / (p_total + cu_total)
    res.capacitor_kvar = kvar
    res.supply_power_rating = kw
    res.supply_kva_rating = kva
    res.cooling_flow = flow

    # cold ratio: first section's surface state
    cold = res.sections.iloc[0]
    rho_cold = mat.resistivity(t0)
    mu_cold = cold["surface_mu_r"]
    table["cold_ratio"] = 2 * radius / em.skin_depth(rho_cold, table["frequency"], mu_cold)
    res.frequency_table = table

    _checks(res, si, mat)
    _hand_checks(res, si, mat, dh)
    return res


def _checks(res: ThroughHeatResult, si: dict, mat) -> None:
    spread = res.exit_surface - res.exit_centre
    res.checks.append(
        Check(
            "surface - centre at the exit",
            format_value(spread, "temperature_difference"),
            f"<= {format_value(si['allowed_spread'], 'temperature_difference')}",
            spread <= si["allowed_spread"] * 1.005,
        )
    )
    hot_ratio = float(res.frequency_table.set_index("frequency").loc[res.frequency, "hot_ratio"])
    res.checks.append(
        Check(
            "diameter / skin depth above Curie",
            f"{hot_ratio:.3g}",
            ">= 3.56 (through-heating optimum)",
            hot_ratio >= 3.56,
            "below: poor coupling and low efficiency once non-magnetic",
        )
    )
    limit = mat.solidus - 100.0 if mat.solidus else None
    if limit is not None:
        res.checks.append(
            Check(
                "highest surface temperature below solidus - 100 K",
                format_value(res.max_surface, "temperature"),
                f"< {format_value(limit, 'temperature')}",
                res.max_surface < limit,
                "burning and grain growth (common practice, no source)",
            )
        )
    if si["max_coil_voltage"] is not None:
        vmax = float(res.sections["coil_voltage_V"].max())
        res.checks.append(
            Check(
                "section coil voltage within the supply's limit",
                format_value(vmax, "voltage"),
                f"<= {format_value(si['max_coil_voltage'], 'voltage')}",
                vmax <= si["max_coil_voltage"],
                "otherwise change the turns or use a matching transformer",
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
    v = res.sections["water_velocity_m_per_s"]
    res.checks.append(
        Check(
            "cooling-water velocity in every section",
            f"{v.min():.2f} to {v.max():.2f} m/s",
            "1 to 4 m/s (common practice, no source)",
            bool((v >= 1.0).all() and (v <= 4.0).all()),
            "parallel water circuits chosen per section",
        )
    )
    if res.coil_efficiency < 0.5:
        res.warn(f"line coil efficiency {res.coil_efficiency:.2f} is low")
    if hot_ratio < 3.56:
        res.warn(
            f"diameter / skin depth above Curie is {hot_ratio:.3g} at "
            f"{format_value(res.frequency, 'frequency')}: below the through-heating optimum"
        )
    if res.transient.field_solves == 0:  # pragma: no cover - induction always active here
        warnings.warn("no field solution was made", JobWarning, stacklevel=2)


def _hand_checks(res: ThroughHeatResult, si: dict, mat, dh: float) -> None:
    q_last = res.sections["power_per_area_W_per_mm2"].iloc[-1] * 1e6
    k_hot = mat.thermal_conductivity(res.exit_mean)
    bound = q_last * si["diameter"] / 4 / k_hot
    res.hand_checks = [
        HandCheck(
            "heat content delivered",
            "P = m_dot [h(T_target) - h(T_start)]",
            f"{res.mass_rate * 3600:.4g} kg/h x {dh / 1e3:.4g} kJ/kg = "
            f"{res.net_power / 1e3:.4g} kW",
        ),
        HandCheck(
            "billet speed",
            "v = pieces/h x billet length",
            f"{res.pieces_rate * 3600:.4g} /h x {si['billet_length'] * 1e3:.4g} mm = "
            f"{res.speed * 1e3:.4g} mm/s",
        ),
        HandCheck(
            "line length",
            "L = v x t_heat",
            f"{res.speed * 1e3:.4g} mm/s x {res.heating_time:.4g} s = {res.line_length:.4g} m",
        ),
        HandCheck(
            "power into the billets",
            "P_w >= P (the difference is the surface loss in the coil)",
            f"{res.workpiece_power / 1e3:.4g} kW vs {res.net_power / 1e3:.4g} kW",
        ),
        HandCheck(
            "spread bound, last section (all power at the surface)",
            "dT <= q R / (2 k), Carslaw & Jaeger 1959 sec. 7.7",
            f"q = {q_last:.4g} W/m2, k = {k_hot:.3g} W/(m K): {bound:.3g} K",
        ),
    ]


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
