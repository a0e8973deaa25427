"""Checks, hand checks, assumptions and sources of the brazing job (:mod:`.brazing`)."""

from __future__ import annotations

import numpy as np
from scipy.constants import pi

from .. import thermal
from ..units import format_value
from ._base import Check, HandCheck
from ._two_parts import infinite_fin_heat_flow

__all__ = ["BRASS_ZINC_LIMIT", "WALL_RATIO_BAND", "add_checks", "add_hand_checks", "add_texts"]

#: Fitting wall / skin depth band for brazing a tube joint: the fitting passes a useful part
#: of the field to the tube below 1, and shields it and overheats its own skin above about 2
#: (common practice, no source). A thinner wall therefore wants a higher frequency.
WALL_RATIO_BAND = (1.0, 2.0)

#: Brass above about 800 degC loses zinc quickly (fuming, dezincified surface); keep it below
#: (common practice, no source) [K].
BRASS_ZINC_LIMIT = 800.0 + 273.15


def add_checks(res, si, fitting, tube, filler):
    """Pass/fail checks and warnings of a :class:`~heatcalc.jobs.brazing.BrazingResult`.

    Parameters
    ----------
    res : BrazingResult
        Filled with the results; checks and warnings are appended.
    si : dict
        The job inputs in SI units.
    fitting, tube, filler : Material
    """
    lo, hi = res.brazing_range
    t_hot = max(res.max_fitting, res.max_tube)
    fv = format_value
    add = res.checks.append
    add(
        Check(
            "both parts reach the brazing temperature",
            f"tube {fv(res.end_tube, 'temperature')}, fitting {fv(res.end_fitting, 'temperature')}",
            f">= {fv(res.brazing_temperature, 'temperature')}",
            res.target_reached,
            "" if res.target_reached else "a part reached its limit first: lower the power",
        )
    )
    add(
        Check(
            "highest temperature within the filler's brazing range",
            fv(t_hot, "temperature"),
            f"<= {fv(hi, 'temperature')} ({filler.brazing_classification or filler.key})",
            t_hot <= hi,
            "overheated filler: loss of volatile elements, erosion of the base metal",
        )
    )
    flows = lo >= filler.liquidus
    need = filler.liquidus if flows else lo
    t_cold = min(res.end_fitting, res.end_tube)
    add(
        Check(
            "colder part at the end of heating: filler flows",
            fv(t_cold, "temperature"),
            f">= {fv(need, 'temperature')} ("
            + ("liquidus" if flows else "start of the brazing range, filler partly solid")
            + ")",
            t_cold >= need - 1e-6,
        )
    )
    add(
        Check(
            "fitting - tube at the end of heating",
            fv(res.end_difference, "temperature_difference"),
            f"<= {fv(si['allowed_difference'], 'temperature_difference')}",
            abs(res.end_difference) <= si["allowed_difference"],
            "the filler runs towards the hotter part; even heating fills the joint",
        )
    )
    for name, mat, t_max in (("fitting", fitting, res.max_fitting), ("tube", tube, res.max_tube)):
        if mat.solidus is not None:
            add(
                Check(
                    f"{name} below its solidus ({mat.key})",
                    fv(t_max, "temperature"),
                    f"< {fv(mat.solidus, 'temperature')}",
                    t_max < mat.solidus,
                    f"margin {fv(mat.solidus - t_max, 'temperature_difference')}",
                )
            )
        if mat.category == "brass":
            add(
                Check(
                    f"{name} (brass) below the zinc-loss temperature",
                    fv(t_max, "temperature"),
                    f"<= {fv(BRASS_ZINC_LIMIT, 'temperature')} (common practice, no source)",
                    t_max <= BRASS_ZINC_LIMIT,
                    "zinc fumes and dezincification of hot brass",
                )
            )
    row = res.frequency_table.set_index("frequency").loc[res.frequency]
    ratio = float(row["wall_to_skin_depth"])
    add(
        Check(
            "fitting wall / skin depth at the brazing temperature",
            f"{ratio:.3g}",
            f"{WALL_RATIO_BAND[0]:g} to {WALL_RATIO_BAND[1]:g} (common practice, no source)",
            WALL_RATIO_BAND[0] <= ratio <= WALL_RATIO_BAND[1],
            "a thin wall wants a higher frequency, a thick one a lower",
        )
    )
    c = res.circuit
    if si["max_coil_voltage"] is not None:
        add(
            Check(
                "coil voltage within the supply's limit",
                fv(c.coil_voltage, "voltage"),
                f"<= {fv(si['max_coil_voltage'], 'voltage')}",
                c.coil_voltage <= si["max_coil_voltage"],
                "otherwise change the turns or use a matching transformer",
            )
        )
    add(
        Check(
            "energy balance of the transient closes",
            f"{res.closure_error:.1e}",
            "|error| < 1e-3",
            abs(res.closure_error) < 1e-3,
        )
    )
    v = res.cooling.velocity
    add(
        Check(
            "cooling-water velocity",
            fv(v, "velocity"),
            "1 to 4 m/s (common practice, no source)",
            1.0 <= v <= 4.0,
            "; ".join(res.cooling.cautions),
        )
    )
    if not res.target_reached:
        res.warn("a part reached its temperature limit before both reached the brazing temperature")
    if res.biot > 0.1:
        res.warn(
            f"Biot number {res.biot:.2g} > 0.1: the one-temperature-per-part model is stretched"
        )
    if res.wall_difference > si["allowed_difference"]:
        res.warn(
            f"the fitting's induced flux may drop up to "
            f"{fv(res.wall_difference, 'temperature_difference')} across its wall (bound): its "
            "skin runs hotter than the lump temperature; lower the power or the frequency"
        )
    if abs(res.end_difference) > si["allowed_difference"]:
        res.warn(
            f"fitting - tube difference {fv(res.end_difference, 'temperature_difference')} at the "
            "end is large: lower the power, use a lower frequency or improve the joint contact"
        )
    if c.efficiency < 0.5:
        res.warn(
            f"coil efficiency {c.efficiency:.2f} is low (parts of low resistivity couple "
            "poorly): a coil closer to the fitting raises it"
        )
    if not WALL_RATIO_BAND[0] <= ratio <= WALL_RATIO_BAND[1]:
        res.warn(
            f"fitting wall / skin depth {ratio:.3g} at {fv(res.frequency, 'frequency')} is outside "
            f"{WALL_RATIO_BAND[0]:g}-{WALL_RATIO_BAND[1]:g}: see the frequency table"
        )


def add_hand_checks(res, si, fitting, tube, geom, loss_t, h_loss):
    """Hand checks (formula and figures) of a brazing result.

    Parameters
    ----------
    res : BrazingResult
    si : dict
        The job inputs in SI units.
    fitting, tube : Material
    geom : JointGeometry
    loss_t : SurfaceLoss
        Loss conditions of the tube's outer surface.
    h_loss : float [W/(m2 K)]
        Loss coefficient of the fitting's surface at the brazing temperature.
    """
    heat = res.series[res.series["phase"] == "heat"]
    t0 = float(heat["fitting"].iloc[0])
    times = heat.index.to_numpy()
    span = times[-1] - times[0]

    def mean(col):
        return float(np.trapezoid(heat[col].to_numpy(), times) / span)

    p_in = mean("power_fitting") + mean("power_tube")
    out = mean("surface_loss") + mean("conduction_fitting") + mean("conduction_tube")
    c_f = fitting.specific_heat(0.5 * (t0 + res.end_fitting))
    c_t = tube.specific_heat(0.5 * (t0 + res.end_tube))
    approx = res.fitting_mass * c_f * (res.end_fitting - t0) + res.tube_mass * c_t * (
        res.end_tube - t0
    )
    rho_f = fitting.resistivity(res.brazing_temperature)
    t_end = res.end_tube
    theta = t_end - loss_t.air_temperature
    h_t = float(loss_t.flux(t_end)) / theta
    fin_t = float(
        infinite_fin_heat_flow(
            h_t, 2 * pi * geom.tube_outer_radius, tube.thermal_conductivity(t_end),
            geom.tube_section, theta,
        )
    )  # fmt: skip
    t_gap = 0.5 * (res.end_fitting + res.end_tube)
    k_air = float(thermal.air_properties(t_gap).conductivity)
    res.hand_checks = [
        HandCheck(
            "heat stored in the joint",
            "E = m_f c_f (T_f - T_0) + m_t c_t (T_t - T_0), c at the mean temperature",
            f"{res.fitting_mass * 1e3:.4g} g x {c_f:.4g} J/(kg K) x "
            f"{res.end_fitting - t0:.4g} K + {res.tube_mass * 1e3:.4g} g x {c_t:.4g} J/(kg K) x "
            f"{res.end_tube - t0:.4g} K = {approx / 1e3:.4g} kJ (enthalpy tables: "
            f"{res.heat_energy / 1e3:.4g} kJ)",
        ),
        HandCheck(
            "time to the brazing temperature",
            "t = E / (P - heat leaving the joint by its surface and by conduction), time means "
            "over the heating",
            f"{res.heat_energy / 1e3:.4g} kJ / ({p_in / 1e3:.4g} kW - {out / 1e3:.4g} kW) = "
            f"{res.heat_energy / (p_in - out):.4g} s (model: {res.heat_time:.4g} s)",
        ),
        HandCheck(
            "skin depth in the fitting at the brazing temperature",
            "delta = sqrt(rho / (pi f mu0))",
            f"rho = {rho_f:.4g} ohm m, f = {format_value(res.frequency, 'frequency')}: "
            f"{res.fitting_skin_depth * 1e3:.3g} mm; wall {geom.fitting_wall * 1e3:.3g} mm",
        ),
        HandCheck(
            "equalisation time of the two parts",
            "tau = 1 / [G (1/C_f + 1/C_t)], G = h_joint x overlap area",
            f"G = {si['joint_conductance']:.4g} W/(m2 K) x {geom.interface_area * 1e4:.4g} cm2 = "
            f"{res.joint_conductance:.4g} W/K: tau = {res.equalisation_time:.3g} s",
        ),
        HandCheck(
            "conduction along the tube, steady infinite fin at the end of heating",
            "q = sqrt(h P k A) (T - T_air), Incropera & DeWitt 2007, Table 3.4 case D",
            f"h = {h_t:.3g} W/(m2 K): {fin_t:.4g} W (model, {res.inputs.fin_model}: "
            f"{float(heat['conduction_tube'].iloc[-1]):.4g} W)",
        ),
        HandCheck(
            "Biot number",
            "Bi = (h_loss + h_joint) wall / k, lumped model valid for Bi < 0.1 "
            "(Incropera & DeWitt 2007, eq. 5.10)",
            f"h_loss = {h_loss:.3g} W/(m2 K), h_joint = {si['joint_conductance']:.4g} W/(m2 K): "
            f"Bi = {res.biot:.2g}",
        ),
        HandCheck(
            "clearance filled with still air, for comparison",
            "h = k_air / radial gap (conduction across a gas layer)",
            f"{k_air:.3g} W/(m K) / {geom.radial_gap * 1e3:.3g} mm = "
            f"{k_air / geom.radial_gap:.4g} W/(m2 K) (joint_conductance used: "
            f"{si['joint_conductance']:.4g})",
        ),
    ]


def add_texts(res, inputs, fitting, tube, filler, longest_cool):
    """Assumptions and sources of a brazing result (`longest_cool` [s]: cooling-phase cap)."""
    low, high = res.frequency_table.attrs["optimum"]
    paths = [
        text
        for text, on in (
            ("the tube out of the joint", inputs.tube_conduction),
            ("the fitting body beyond it", inputs.fitting_conduction),
        )
        if on
    ]
    res.assumptions = [
        "Each part is one lump at a uniform temperature over the overlap length (thin walls; "
        "see the Biot number); the tube's bore holds nothing that conducts.",
        "The coil is centred on the overlap; its field is the uniform axial field of a long "
        "coil with Nagaoka's end correction. Power induced in the parts beyond the overlap "
        "(under the coil ends) is not counted: the heating time comes out a little long and "
        "the fitting - tube difference a little large (the tube next to the socket mouth takes "
        "some power directly).",
        "The power is split between fitting and tube by the radial field solution at the "
        "current part temperatures; "
        + (
            "the supply holds the power at the coil terminals constant, the joint receiving "
            "the coil efficiency's share of it."
            if inputs.power_basis == "coil"
            else "the power absorbed by the joint is held constant."
        ),
        f"Heat crosses the clearance with joint_conductance = {inputs.joint_conductance} over "
        "the overlap area (default 5000 W/(m2 K), a fluxed clearance with local contact: "
        "common practice, no source); a dry air gap gives about k_air / gap (hand checks), "
        "filler drawn into the gap far more. The difference between the parts scales roughly "
        "as 1 / joint_conductance.",
        "Losses: grey-body radiation and natural convection (horizontal cylinder) from the "
        "fitting's outer surface; "
        + (
            "conduction along "
            + " and along ".join(paths)
            + f" ({inputs.fin_model} long-fin model, radiation and convection from its surface)"
            if paths
            else "no conduction along the parts"
        )
        + "; the tube bore and the end faces lose nothing.",
        "Default brazing temperature: the filler's liquidus + 30 K, or the middle of its "
        "brazing range when that lies outside the range (common practice, no source).",
        "After heating the power is switched off and the joint cools until the hotter part is "
        f"below the filler's solidus (at most {longest_cool:.0f} s).",
        "Coil electricals at the end of heating (surface impedance of the composite wall).",
        "Frequencies ranked on fitting wall / skin depth 1-2 (brazing practice); the coil "
        "library's through-heating optimum of the fitting alone, wall / skin depth "
        f"{low:.2f} to {high:.2f}, would favour lower frequencies and leave more power to the "
        "tube at a lower coil efficiency.",
    ]
    if fitting.is_magnetic or tube.is_magnetic:
        res.assumptions.append(
            "Frequency table: a magnetic part is taken with mu_r = 1 there (the skin depth of "
            "the hot, saturated steel is smaller); the heating itself uses the field-dependent "
            "permeability."
        )
    res.sources = [
        "Material data: "
        + ", ".join(
            f"data/materials/{m.key}.toml" if m.path else f"{m.key} (given by the user)"
            for m in (fitting, tube, filler)
        ),
        f"Brazing range: {filler.sources.get(filler.brazing_source, filler.brazing_source)}",
        "Induced currents: radial finite-element field solution (heatcalc.em) across tube, "
        "clearance and fitting",
        "Lumped heating and fins: Incropera & DeWitt, Fundamentals of Heat and Mass Transfer, "
        "6th ed., 2007, sec. 5.3, sec. 3.6 and Table 3.4",
        "Convection: Churchill & Chu, Int. J. Heat Mass Transfer 18 (1975), via ht",
        "Coil circuit: long-coil referral with Nagaoka's coefficient (heatcalc.coil)",
        "Frequency band wall / skin depth 1-2 for brazing: common practice, no source",
    ]
