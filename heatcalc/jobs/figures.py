"""Figures of the job results, for the calculation record.

Every function takes a job result and returns a new :class:`matplotlib.figure.Figure` made with
:func:`heatcalc.plotting.new_figure` (not attached to pyplot, so nothing is shown by accident);
a workbook shows it with :func:`heatcalc.plotting.show` as a PNG image. Temperatures are
plotted in degrees Celsius, sizes in millimetres. A result of the wrong job type raises
ValueError naming the figure and the type received.

=============================  ===============================================================
figure                         job results
=============================  ===============================================================
:func:`energy_breakdown`       melting: energy per tonne in the charge and from the mains
:func:`power_flow`             melting: cycle-average power from the mains to the charge
:func:`frequency_chart`        all: coil efficiency and size / skin depth over the frequencies
:func:`temperature_history`    through-heat, harden, braze: temperatures against time
:func:`radial_profiles`        through-heat, harden: temperature against radius
:func:`power_density_profile`  all: induced power density in depth
:func:`harden_profile`         harden: end-of-heating temperature in depth, case depth
:func:`joint_power_history`    braze: power into fitting and tube, losses, against time
=============================  ===============================================================
"""

from __future__ import annotations

import numpy as np
from matplotlib.figure import Figure
from matplotlib.ticker import EngFormatter, FuncFormatter
from scipy.constants import zero_Celsius

from .. import em, materials
from ..plotting import axis_label, new_figure
from ..units import format_value, temperature, to_si
from ._base import JobResult
from ._induction import surface_state
from ._joint_field import composite_power_split
from .brazing import BrazingResult
from .melting import MeltingResult
from .surface_harden import HardenResult
from .through_heat import ThroughHeatResult

__all__ = [
    "energy_breakdown",
    "power_flow",
    "frequency_chart",
    "temperature_history",
    "radial_profiles",
    "power_density_profile",
    "harden_profile",
    "joint_power_history",
]

_GREY = "0.35"


def _require(result, kinds, figure: str) -> None:
    if not isinstance(result, kinds):
        names = " or ".join(k.__name__ for k in kinds)
        raise ValueError(f"{figure}: result must be a {names}; got {type(result).__name__}")


def _legend_below(fig, handles, labels, ncol) -> None:
    """The legend under the axes, outside the plotted area."""
    fig.legend(handles, labels, loc="outside lower center", ncol=ncol, fontsize=8)


def _curie_line(ax, curie_kelvin, label) -> None:
    ax.axhline(_degc(curie_kelvin), color=_GREY, linestyle=":", linewidth=1.2, label=label)


def _target_line(ax, t_degc, label) -> None:
    ax.axhline(t_degc, color="C3", linestyle="--", linewidth=1.2, label=label)


def _end_of_heating(ax, time) -> None:
    ax.axvline(
        time, color=_GREY, linestyle="--", linewidth=1.0, label=f"end of heating {time:.3g} s"
    )


def _degc(t_kelvin):
    return np.asarray(t_kelvin, dtype=float) - zero_Celsius


def energy_breakdown(result: MeltingResult) -> Figure:
    """Energy per tonne of charge from the mains, item by item [kWh/t].

    One bar per item: the parts of the theoretical energy (sensible heat of the solid, latent
    heat, sensible heat of the liquid), then the losses of a cycle (radiation, lining
    conduction, coil copper, converter), each loss as its cycle-average power times the cycle
    time per tonne. The bars add up to the result's specific energy at the mains.

    Raises
    ------
    ValueError
        If `result` is not a MeltingResult.
    """
    _require(result, (MeltingResult,), "energy_breakdown")
    per_t = 3.6e3  # J/kg per kWh/t
    parts = result.energy.to_frame()
    parts = parts[parts["component"] != "total"]
    flow = result.power_flow().iloc[1:]  # the losses (row 0 is the charge's own energy)
    scale = result.cycle_time * 1e3 / result.energy.mass / per_t  # kW -> kWh/t over a cycle
    items = [(c, v, "C0") for c, v in zip(parts["component"], parts["kWh_per_t"], strict=True)]
    items += [
        (d, v, "C1") for d, v in zip(flow["destination"], flow["power_kW"] * scale, strict=True)
    ]
    fig, ax = new_figure(160, 80)
    y = np.arange(len(items))
    values = [v for _, v, _ in items]
    ax.barh(y, values, color=[c for *_, c in items])
    for k, v in enumerate(values):
        ax.text(v, k, f"  {v:.0f}", va="center", fontsize=8)
    ax.set_yticks(y, [lb for lb, *_ in items], fontsize=9)
    ax.invert_yaxis()
    ax.set_xlim(0, 1.15 * max(values))
    ax.set_xlabel(axis_label("Energy per tonne of charge", "kWh/t"))
    theory, mains = result.theoretical_specific_energy / per_t, result.specific_energy / per_t
    fig.suptitle(
        f"Energy per tonne of charge: {theory:.0f} kWh/t into the charge (blue bars),\n"
        f"{mains:.0f} kWh/t from the mains (all bars)",
        fontsize=10,
    )
    return fig


def power_flow(result: MeltingResult) -> Figure:
    """Cycle-average power from the mains to the charge, as a waterfall [kW].

    The first bar is the mains power; each loss (converter, coil copper, lining conduction,
    radiation) steps down from it; the last bar is the power that heats, melts and superheats
    the charge.

    Raises
    ------
    ValueError
        If `result` is not a MeltingResult.
    """
    _require(result, (MeltingResult,), "power_flow")
    flow = result.power_flow()
    useful = flow.iloc[0]
    losses = flow.iloc[1:].iloc[::-1]  # from the mains inwards: converter first
    total = float(flow["power_kW"].sum())
    fig, ax = new_figure(160, 80)
    labels = ["from the mains"]
    ax.bar(0, total, color="0.55")
    ax.text(0, total, f"{total:.0f} kW", ha="center", va="bottom", fontsize=8)
    level = total
    for i, row in enumerate(losses.itertuples(index=False), start=1):
        ax.bar(i, row.power_kW, bottom=level - row.power_kW, color="C1")
        ax.text(
            i,
            level,
            f"-{row.power_kW:.1f} kW\n({100 * row.share:.1f} %)",
            ha="center",
            va="bottom",
            fontsize=8,
        )
        level -= row.power_kW
        labels.append(row.destination)
    n = len(labels)
    ax.bar(n, useful["power_kW"], color="C0")
    ax.text(
        n,
        useful["power_kW"],
        f"{useful['power_kW']:.0f} kW\n({100 * useful['share']:.0f} %)",
        ha="center",
        va="bottom",
        fontsize=8,
    )
    labels.append("into the charge")
    ax.set_xticks(range(len(labels)), [lb.replace(" ", "\n", 2) for lb in labels], fontsize=8)
    ax.set_ylim(0, 1.15 * total)
    ax.set_ylabel(axis_label("Cycle-average power", "kW"))
    ax.set_title("Power flow, mains to charge")
    return fig


def _plain_number(value, _pos=None) -> str:
    return f"{value:g}"


def _plain_minor(value, _pos=None) -> str:
    """Labels of the minor ticks 2 and 5 of each decade on a log axis."""
    mantissa = value / 10 ** np.floor(np.log10(value))
    return f"{value:g}" if np.isclose(mantissa, 2) or np.isclose(mantissa, 5) else ""


def _ratio_column(table) -> str:
    for name in ("ratio", "hot_ratio", "wall_to_skin_depth"):
        if name in table.columns:
            return name
    raise ValueError("frequency_chart: the result's frequency_table has no ratio column")


def frequency_chart(result: JobResult) -> Figure:
    """Coil efficiency and the size-to-skin-depth ratio over the frequencies considered.

    Coil efficiency at each frequency of the job's frequency table (left axis) and the job's
    frequency ratio (right axis; diameter / skin depth, skin depth / case depth for hardening,
    fitting wall / skin depth for brazing, with the fitting's share of the power on the left
    axis) as a curve through the table's points (the ratio goes as the square root of the
    frequency, or its inverse, at the fixed resistivity of the table). The frequencies where the
    ratio is within the job's band are shaded; the chosen frequency is a dashed line.

    Raises
    ------
    ValueError
        If `result` is not a melting, through-heat, harden or brazing result, or its frequency
        table lacks the band (``attrs["band"]``) or the ratio.
    """
    _require(
        result, (MeltingResult, ThroughHeatResult, HardenResult, BrazingResult), "frequency_chart"
    )
    table = result.frequency_table.sort_values("frequency")
    column = _ratio_column(table)
    if "band" not in table.attrs or "ratio" not in table.attrs:
        raise ValueError("frequency_chart: the frequency_table has no attrs 'band' and 'ratio'")
    low, high = table.attrs["band"]
    name = table.attrs["ratio"]
    f = table["frequency"].to_numpy(dtype=float)
    ratio = table[column].to_numpy(dtype=float)
    # ratio = c f^(+1/2) for size / skin depth, c f^(-1/2) for skin depth / size
    exponent = -0.5 if name.startswith("skin depth") else 0.5
    c = float(np.mean(ratio / f**exponent))
    f_band = sorted(((low / c) ** (1 / exponent), (high / c) ** (1 / exponent)))
    f_lo = min(f.min(), f_band[0]) / 1.5
    f_hi = max(f.max(), f_band[1]) * 1.5
    chosen = result.circuit.frequency if isinstance(result, MeltingResult) else result.frequency

    fig, ax = new_figure(160, 100)
    ax.semilogx(f, table["efficiency"], "o-", label="coil efficiency")
    if "fitting_share" in table.columns:
        ax.semilogx(
            f, table["fitting_share"], "D--", color="C4", label="share of power in the fitting"
        )
    ax.set_ylim(0, 1)
    ax.set_xlim(f_lo, f_hi)
    ax.set_xlabel("Frequency")
    ax.set_ylabel(
        axis_label("Coil efficiency" + (", share" if "fitting_share" in table else ""), "-")
    )
    ax.axvspan(*f_band, color="C2", alpha=0.15, label=f"band: {name} {low:.3g} to {high:.3g}")
    ax.axvline(
        chosen, color=_GREY, linestyle="--", label=f"chosen: {format_value(chosen, 'frequency')}"
    )
    ax2 = ax.twinx()
    ax2.spines["right"].set_visible(True)
    ax2.grid(False)
    grid = np.geomspace(f_lo, f_hi, 200)
    ax2.semilogx(grid, c * grid**exponent, color="C1", label=name)
    ax2.semilogx(f, ratio, "s", color="C1")
    if column == "hot_ratio" and "cold_ratio" in table.columns:
        ax2.semilogx(f, table["cold_ratio"], "^:", color="C3", label=f"{name}, cold (magnetic)")
    ax2.set_yscale("log")
    ax2.yaxis.set_major_formatter(FuncFormatter(_plain_number))
    ax2.yaxis.set_minor_formatter(FuncFormatter(_plain_minor))
    ax2.set_ylabel(axis_label(name[0].upper() + name[1:], "-"))
    h1, l1 = ax.get_legend_handles_labels()
    h2, l2 = ax2.get_legend_handles_labels()
    _legend_below(fig, h1 + h2, l1 + l2, ncol=2)
    ax.xaxis.set_major_formatter(EngFormatter(unit="Hz"))  # after twinx (it resets the scale)
    ax.set_title("Frequency choice")
    return fig


def temperature_history(result) -> Figure:
    """Surface, centre and mean temperature against time, with the job's reference lines.

    Through-heat: the coil-section boundaries (dotted), the transfer to the press (shaded), the
    target mean temperature. Harden: the austenitising temperature and the end of heating.
    Both: the Curie temperature of the steel. Brazing: fitting and tube temperatures, the
    filler's brazing range (shaded), the brazing temperature, the end of heating and the
    cooling with the power off.

    Raises
    ------
    ValueError
        If `result` is not a ThroughHeatResult, HardenResult or BrazingResult.
    """
    _require(result, (ThroughHeatResult, HardenResult, BrazingResult), "temperature_history")
    if isinstance(result, BrazingResult):
        return _brazing_history(result)
    s = result.transient.series
    t = s.index.to_numpy(dtype=float)
    fig, ax = new_figure(160, 100)
    for col, style in (("surface", "-"), ("mean", "-"), ("centre", "-")):
        ax.plot(t, _degc(s[col]), style, label=col)
    curie = materials.get(result.transient.material).curie_temperature
    if curie is not None:
        _curie_line(ax, curie, f"Curie temperature {_degc(curie):.0f} °C")
    if isinstance(result, ThroughHeatResult):
        target = temperature(result.inputs.target_temperature, name="target_temperature")
        _target_line(ax, _degc(target), f"target mean {_degc(target):.0f} °C")
        for k, end in enumerate(result.section_times):
            ax.axvline(end, color=_GREY, linestyle=":", linewidth=1.0)
            start = result.section_times[k - 1] if k else 0.0
            ax.text(
                (start + end) / 2,
                0.02,
                f"coil {k + 1}",
                transform=ax.get_xaxis_transform(),
                ha="center",
                fontsize=8,
                color=_GREY,
            )
        if t[-1] > result.heating_time:
            ax.axvspan(result.heating_time, t[-1], color="0.85", alpha=0.6, label="transfer")
    else:
        t_aus = result.austenitising_temperature
        _target_line(ax, _degc(t_aus), f"austenitising {_degc(t_aus):.0f} °C")
        _end_of_heating(ax, result.heat_time)
    ax.set_xlim(0, t[-1])
    ax.set_xlabel(axis_label("Time", "s"))
    ax.set_ylabel(axis_label("Temperature", "°C"))
    _legend_below(fig, *ax.get_legend_handles_labels(), ncol=3)
    ax.set_title("Temperature history")
    return fig


def radial_profiles(result) -> Figure:
    """Temperature against radius at the times the transient stored profiles.

    Raises
    ------
    ValueError
        If `result` is not a ThroughHeatResult or HardenResult.
    """
    _require(result, (ThroughHeatResult, HardenResult), "radial_profiles")
    tr = result.transient
    r_mm = tr.nodes * 1e3
    labels = tr.series["label"]
    fig, ax = new_figure(160, 100)
    for time in tr.profiles.columns.to_numpy(dtype=float):
        where = labels.iloc[int(np.searchsorted(labels.index.to_numpy(), time - 1e-9))]
        text = f"{time:.3g} s" + (f" ({where})" if where else "")
        ax.plot(r_mm, _degc(tr.profile(time)), label=text)
    curie = materials.get(tr.material).curie_temperature
    if curie is not None:
        _curie_line(ax, curie, "Curie")
    ax.set_xlim(0, r_mm[-1])
    ax.set_xlabel(axis_label("Radius (0 = axis)", "mm"))
    ax.set_ylabel(axis_label("Temperature", "°C"))
    _legend_below(fig, *ax.get_legend_handles_labels(), ncol=4)
    ax.set_title("Radial temperature profiles")
    return fig


def _power_curves(result):
    """(label, depth [m], power density [W/m3], skin depth [m]) curves of a result."""
    if isinstance(result, em.RadialFieldResult):
        r_s = result.nodes[-1]
        return [("field solution", r_s - result.centres, result.power_density, None)]
    if isinstance(result, BrazingResult):
        return _joint_curves(result)
    if isinstance(result, MeltingResult):
        inp = result.inputs
        radius = to_si(inp.crucible_inner_diameter, "m", name="crucible_inner_diameter") / 2
        t_pour = temperature(inp.pouring_temperature, name="pouring_temperature")
        rho = materials.get(inp.alloy).resistivity(t_pour)
        r = np.linspace(0.0, radius, 401)
        c = result.circuit
        p = em.cylinder_power_density(r, c.surface_field, radius, rho, c.frequency)
        return [("molten bath (Kelvin-function solution)", radius - r, p, result.skin_depth)]
    tr = result.transient
    mat = materials.get(tr.material)
    if isinstance(result, HardenResult):
        end = tr.profile(result.heat_time)
        states = [
            ("start of heating (cold)", np.full_like(end, tr.series["surface"].iloc[0])),
            ("end of heating", end),
        ]
        states = [(lb, prof, result.power_density) for lb, prof in states]
        f = result.frequency
    else:
        n = len(result.sections)
        mids = [(k + 0.5) * result.heating_time / n for k in range(n)]
        states = [
            (f"{row.section}, mid-point", tr.profile(t), row.power_per_area_W_per_mm2 * 1e6)
            for t, row in zip(mids, result.sections.itertuples(index=False), strict=True)
        ]
        f = result.frequency
    curves = []
    for label, prof, p_area in states:
        st = surface_state(mat, tr.geometry, tr.nodes, prof, f, p_area)
        fld = st.field
        curves.append(
            (label, fld.nodes[-1] - fld.centres, fld.power_density, st.skin_depth_surface)
        )
    return curves


def _joint_curves(result):
    """Fitting and tube of a brazed joint at the end of heating, at the coil's surface field."""
    inp, g = result.inputs, result.geometry
    fitting, tube = materials.get(inp.fitting_material), materials.get(inp.tube_material)

    def mu(mat, t):
        if not mat.is_magnetic:
            return 1.0
        return lambda h_peak: mat.relative_permeability(h_peak, np.full_like(h_peak, t))

    rho_f = float(fitting.resistivity(result.end_fitting))
    split = composite_power_split(
        g,
        rho_f,
        float(tube.resistivity(result.end_tube)),
        result.frequency,
        fitting_mu_r=mu(fitting, result.end_fitting),
        tube_mu_r=mu(tube, result.end_tube),
        h_surface=result.circuit.surface_field,
    )
    fld = split.field
    depth = g.fitting_outer_radius - fld.centres
    in_fitting = fld.centres > g.fitting_inner_radius
    in_tube = fld.centres < g.tube_outer_radius
    delta_f = float(em.skin_depth(rho_f, result.frequency, float(np.max(fld.mu_r[in_fitting]))))
    return [
        ("fitting, end of heating", depth[in_fitting], fld.power_density[in_fitting], delta_f),
        ("tube, end of heating", depth[in_tube], fld.power_density[in_tube], None),
    ]


def power_density_profile(result) -> Figure:
    """Induced power density against depth below the heated surface (log scale).

    Melting: the Kelvin-function solution for the molten bath at the coil's surface field.
    Brazing: the composite-wall solution (fitting, clearance, tube) at the end of heating at
    the coil's surface field; depth from the fitting's outer surface.
    Harden: the radial field solution at the start (cold, magnetic) and the end of heating at
    the job's power density. Through-heat: the field solution at each coil section's
    mid-point profile and power. A :class:`heatcalc.em.RadialFieldResult` is plotted as it is.
    Skin depths at the surface are marked on the curves.

    Raises
    ------
    ValueError
        If `result` is none of these.
    """
    _require(
        result,
        (MeltingResult, HardenResult, ThroughHeatResult, BrazingResult, em.RadialFieldResult),
        "power_density_profile",
    )
    curves = _power_curves(result)
    fig, ax = new_figure(160, 100)
    peak = max(float(np.max(p)) for _, _, p, _ in curves)
    deepest = 0.0
    for k, (label, depth, p, delta) in enumerate(curves):
        order = np.argsort(depth)
        d_mm, p_cm3 = depth[order] * 1e3, p[order] / 1e6
        ax.semilogy(d_mm, p_cm3, color=f"C{k}", label=label)
        if delta is not None:
            ax.semilogy([delta * 1e3], [np.interp(delta * 1e3, d_mm, p_cm3)], "o", color=f"C{k}")
            deepest = max(deepest, delta)
    ax.set_ylim(peak / 1e6 * 1e-4, peak / 1e6 * 2)
    span = float(max(np.max(d) for _, d, _, _ in curves))
    # depth range: to where every curve has fallen below the lower limit, or the centre
    floor = peak * 1e-4
    reach = max(float(np.max(d[p >= floor])) for _, d, p, _ in curves)
    ax.set_xlim(0, min(span, 1.2 * reach) * 1e3)
    ax.set_xlabel(axis_label("Depth below the surface", "mm"))
    ax.set_ylabel(axis_label("Power density", "W/cm³"))
    _legend_below(fig, *ax.get_legend_handles_labels(), ncol=2)
    note = " (dots: skin depth at the surface)" if deepest else ""
    ax.set_title("Induced power density in depth" + note)
    return fig


def harden_profile(result: HardenResult) -> Figure:
    """End-of-heating temperature against depth, with the austenitising line and case depth.

    The required case depth and its tolerance are shaded; the predicted case depth (where the
    profile crosses the austenitising temperature) is marked.

    Raises
    ------
    ValueError
        If `result` is not a HardenResult.
    """
    _require(result, (HardenResult,), "harden_profile")
    prof = result.end_profile.sort_values("depth_mm")
    need = to_si(result.inputs.case_depth, "m", name="case_depth") * 1e3
    tol = to_si(result.inputs.case_depth_tolerance, "m", name="case_depth_tolerance") * 1e3
    t_aus = _degc(result.austenitising_temperature)
    d = result.predicted_case_depth * 1e3
    fig, ax = new_figure(160, 100)
    ax.plot(prof["depth_mm"], prof["temperature_degC"], label="end of heating")
    _target_line(ax, t_aus, f"austenitising {t_aus:.0f} °C")
    ax.axvspan(
        need,
        need + tol,
        color="C2",
        alpha=0.15,
        label=f"required case {need:.3g} to {need + tol:.3g} mm",
    )
    ax.plot([d], [t_aus], "o", color="C1", label=f"predicted case depth {d:.3g} mm")
    ax.axvline(d, color="C1", linewidth=1.0)
    curie = materials.get(result.transient.material).curie_temperature
    if curie is not None:
        _curie_line(ax, curie, "Curie")
    radius = float(prof["depth_mm"].max())
    ax.set_xlim(0, min(radius, max(3 * d, 2 * (need + tol))))
    ax.set_xlabel(axis_label("Depth below the surface", "mm"))
    ax.set_ylabel(axis_label("Temperature", "°C"))
    _legend_below(fig, *ax.get_legend_handles_labels(), ncol=2)
    ax.set_title("Temperature in depth at the end of heating")
    return fig


def _cooling_span(ax, series, heat_end) -> None:
    t_end = float(series.index[-1])
    if t_end > heat_end:
        ax.axvspan(heat_end, t_end, color="0.85", alpha=0.6, label="power off, cooling")


def _brazing_history(result) -> Figure:
    s = result.series
    t = s.index.to_numpy(dtype=float)
    fig, ax = new_figure(160, 100)
    ax.plot(t, _degc(s["fitting"]), label="fitting (outer part)")
    ax.plot(t, _degc(s["tube"]), label="tube (inner part)")
    lo, hi = result.brazing_range
    ax.axhspan(
        _degc(lo),
        _degc(hi),
        color="C2",
        alpha=0.15,
        label=f"brazing range {_degc(lo):.0f} to {_degc(hi):.0f} °C",
    )
    t_b = result.brazing_temperature
    _target_line(ax, _degc(t_b), f"brazing temperature {_degc(t_b):.0f} °C")
    _end_of_heating(ax, result.heat_time)
    _cooling_span(ax, s, result.heat_time)
    ax.set_xlim(0, t[-1])
    ax.set_xlabel(axis_label("Time", "s"))
    ax.set_ylabel(axis_label("Temperature", "°C"))
    _legend_below(fig, *ax.get_legend_handles_labels(), ncol=3)
    ax.set_title("Temperature history of the joint")
    return fig


def joint_power_history(result: BrazingResult) -> Figure:
    """Power into the fitting and the tube, heat across the clearance, and losses, over time [W].

    The heat leaving the joint is the loss from the fitting's outer surface plus the heat
    conducted along both parts out of the overlap; absorbed minus leaving is the heat stored in
    the two parts.

    Raises
    ------
    ValueError
        If `result` is not a BrazingResult.
    """
    _require(result, (BrazingResult,), "joint_power_history")
    s = result.series
    t = s.index.to_numpy(dtype=float)
    fig, ax = new_figure(160, 100)
    ax.plot(t, s["power_fitting"] + s["power_tube"], color="0.3", label="power into the joint")
    ax.plot(t, s["power_fitting"], label="into the fitting")
    ax.plot(t, s["power_tube"], label="into the tube")
    ax.plot(t, s["joint_flow"], linestyle="--", label="across the clearance, fitting to tube")
    leaving = s["surface_loss"] + s["conduction_fitting"] + s["conduction_tube"]
    ax.plot(
        t, leaving, linestyle=":", label="leaving the joint (surface, conduction along the parts)"
    )
    ax.axvline(result.heat_time, color=_GREY, linestyle="--", linewidth=1.0)
    _cooling_span(ax, s, result.heat_time)
    ax.set_xlim(0, t[-1])
    ax.set_xlabel(axis_label("Time", "s"))
    ax.set_ylabel(axis_label("Power", "W"))
    _legend_below(fig, *ax.get_legend_handles_labels(), ncol=2)
    ax.set_title("Power in the joint")
    return fig
