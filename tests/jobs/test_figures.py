"""Job figures: they draw what the results say, close their energy balances, refuse wrong types.

The figures are checked through the data of their artists (bar sizes, line data, spans), against
the result they plot and against outside facts: the skin-depth formula, the share of the
induced power within one skin depth of a thick conductor, and energy conservation (the
plotted power density integrates to the absorbed power).
"""

import copy
import dataclasses
import math
import warnings

import matplotlib.pyplot as plt
import numpy as np
import pytest
from matplotlib.figure import Figure
from scipy.constants import mu_0, pi, zero_Celsius

from heatcalc import em, materials, plotting
from heatcalc.jobs import figures
from heatcalc.jobs.brazing import run_brazing
from heatcalc.jobs.demo import DEMO_INPUTS
from heatcalc.jobs.melting import run_melting
from heatcalc.jobs.surface_harden import run_surface_harden
from heatcalc.jobs.through_heat import run_through_heat

# Inputs as in tests/jobs/test_job_*.py (the demo jobs); the through-heat and harden runs fix
# the heating time / power density and use fewer nodes so that this file stays quick.
MELT = DEMO_INPUTS["melting"]
BILLET = dataclasses.replace(
    DEMO_INPUTS["through-heat"],
    allowed_spread="120 delta_degC",
    heating_time="120 s",
    transfer_time="5 s",
    max_coil_voltage=None,
)
SHAFT = dataclasses.replace(
    DEMO_INPUTS["harden"],
    power_density="0.5 kW/cm**2",
    max_core_temperature=None,
    supply_voltage=None,
)
JOINT = DEMO_INPUTS["braze"]


def _quiet(fn, *args, **kw):
    with warnings.catch_warnings():
        warnings.simplefilter("ignore")
        return fn(*args, **kw)


@pytest.fixture(scope="module")
def melt():
    return _quiet(run_melting, MELT)


@pytest.fixture(scope="module")
def billet():
    return _quiet(run_through_heat, BILLET, n_nodes=30)


@pytest.fixture(scope="module")
def joint():
    return _quiet(run_brazing, JOINT)


@pytest.fixture(scope="module")
def shaft():
    return _quiet(run_surface_harden, SHAFT, n_nodes=60)


def _line(ax, label):
    found = [ln for ln in ax.get_lines() if ln.get_label() == label]
    assert len(found) == 1, [ln.get_label() for ln in ax.get_lines()]
    return found[0]


def _legend_texts(fig):
    return [t.get_text() for leg in fig.legends for t in leg.get_texts()]


def _span(patch):
    """x-extent of an axvspan (a Rectangle in data coordinates along x)."""
    x0 = patch.get_x()
    return (min(x0, x0 + patch.get_width()), max(x0, x0 + patch.get_width()))


def _is_png(fig):
    return plotting.to_png(fig)[:8] == b"\x89PNG\r\n\x1a\n"


# -- melting ---------------------------------------------------------------------------------
def test_energy_breakdown_bars_add_up_to_the_mains_energy(melt):
    before = plt.get_fignums()
    fig = figures.energy_breakdown(melt)
    assert isinstance(fig, Figure) and plt.get_fignums() == before  # not attached to pyplot
    (ax,) = fig.axes
    widths = [p.get_width() for p in ax.patches]
    labels = [t.get_text() for t in ax.get_yticklabels()]
    assert labels[:3] == ["sensible heat, solid", "latent heat", "sensible heat, liquid"]
    assert len(widths) == 7 and "coil copper loss" in labels
    # energy conservation: charge + losses over a cycle = mains energy per tonne, computed here
    # from the mains power and the cycle time (kWh/t = J/kg / 3600)
    mains = melt.supply_power * melt.cycle_time / 300.0 / 3.6e3
    assert sum(widths) == pytest.approx(mains, rel=1e-9)
    assert sum(widths[:3]) == pytest.approx(melt.energy.total / 300.0 / 3.6e3, rel=1e-9)
    assert "Energy per tonne" in fig.get_suptitle()
    assert ax.get_xlabel() == "Energy per tonne of charge [kWh/t]"
    assert _is_png(fig)


def test_power_flow_waterfall_closes(melt):
    fig = figures.power_flow(melt)
    (ax,) = fig.axes
    bars = ax.patches
    assert len(bars) == 6  # mains, four losses, charge
    assert bars[0].get_height() == pytest.approx(melt.supply_power / 1e3)
    charge_kw = melt.energy.total / melt.cycle_time / 1e3  # E / t_cycle
    assert bars[-1].get_height() == pytest.approx(charge_kw)
    # each loss bar hangs from the level left by the one before; the last ends at the charge
    level = bars[0].get_height()
    for b in bars[1:-1]:
        assert b.get_y() + b.get_height() == pytest.approx(level)
        level = b.get_y()
    assert level == pytest.approx(charge_kw, rel=1e-9)
    assert ax.get_ylabel() == "Cycle-average power [kW]"
    ticks = [t.get_text().replace("\n", " ") for t in ax.get_xticklabels()]
    assert ticks[0] == "from the mains" and ticks[-1] == "into the charge"


def test_frequency_chart_of_the_melt_against_the_skin_depth_formula(melt):
    fig = figures.frequency_chart(melt)
    ax, ax2 = fig.axes
    eff = _line(ax, "coil efficiency")
    table = melt.frequency_table.sort_values("frequency")
    np.testing.assert_allclose(eff.get_xdata(), table["frequency"])
    np.testing.assert_allclose(eff.get_ydata(), table["efficiency"])
    # the ratio curve is D / delta with delta = sqrt(rho / (pi f mu0)) (definition of the
    # skin depth; Davies, Conduction and Induction Heating, 1990, ch. 1)
    rho = materials.get("al-6061").resistivity(750 + zero_Celsius)
    curve = _line(ax2, "diameter / skin depth")
    f = np.asarray(curve.get_xdata())
    np.testing.assert_allclose(curve.get_ydata(), 0.5 / np.sqrt(rho / (pi * f * mu_0)), rtol=1e-9)
    # the shaded band spans the frequencies where D / delta is 10 to 60 (the job's band)
    (band,) = [p for p in ax.patches if p.get_label().startswith("band")]
    f_lo, f_hi = _span(band)
    assert 0.5 / math.sqrt(rho / (pi * f_lo * mu_0)) == pytest.approx(10.0, rel=1e-9)
    assert 0.5 / math.sqrt(rho / (pi * f_hi * mu_0)) == pytest.approx(60.0, rel=1e-9)
    (chosen,) = [ln for ln in ax.get_lines() if ln.get_label().startswith("chosen")]
    assert chosen.get_xdata()[0] == 500.0
    assert "chosen: 500 Hz" in _legend_texts(fig)
    assert ax.get_xscale() == "log" and ax2.get_yscale() == "log"


def test_power_density_of_the_melt_integrates_to_the_melt_power(melt):
    fig = figures.power_density_profile(melt)
    (ax,) = fig.axes
    (curve,) = [ln for ln in ax.get_lines() if not ln.get_label().startswith("_")]
    depth = np.asarray(curve.get_xdata()) * 1e-3  # m
    p = np.asarray(curve.get_ydata()) * 1e6  # W/m3
    radius = 0.25
    r = radius - depth
    order = np.argsort(r)
    r, p = r[order], p[order]
    # energy conservation: the power density over the bath volume is the power into the melt
    per_length = np.trapezoid(p * 2 * pi * r, r)
    assert per_length * melt.bath_height == pytest.approx(melt.melt_power, rel=2e-3)
    # thick conductor (radius / skin depth = 21): about 86 % of the power lies within one skin
    # depth, 1 - exp(-2) for a plane wave (Rudnev et al., Handbook of Induction Heating, 2003,
    # sec. 3.1; from memory); the curvature of the bath changes this by a few per cent
    inside = r >= radius - melt.skin_depth
    share = np.trapezoid((p * r)[inside], r[inside]) / np.trapezoid(p * r, r)
    assert share == pytest.approx(1 - math.exp(-2), abs=0.03)
    assert ax.get_yscale() == "log"
    assert ax.get_ylabel() == "Power density [W/cm³]"


# -- through-heat ----------------------------------------------------------------------------
def test_temperature_history_of_the_billet(billet):
    fig = figures.temperature_history(billet)
    (ax,) = fig.axes
    s = billet.transient.series
    for col in ("surface", "centre", "mean"):
        np.testing.assert_allclose(_line(ax, col).get_ydata(), s[col] - zero_Celsius)
    curie = materials.get("aisi-1045").curie_temperature - zero_Celsius
    (c_line,) = [ln for ln in ax.get_lines() if ln.get_label().startswith("Curie")]
    assert c_line.get_ydata()[0] == pytest.approx(curie)
    assert 700 < curie < 800  # medium-carbon steel loses magnetism near 770 degC (from memory)
    (target,) = [ln for ln in ax.get_lines() if ln.get_label().startswith("target")]
    assert target.get_ydata()[0] == pytest.approx(1200.0)
    verticals = [ln.get_xdata()[0] for ln in ax.get_lines() if ln.get_label().startswith("_")]
    for end in billet.section_times:
        assert any(v == pytest.approx(end) for v in verticals)
    texts = [t.get_text() for t in ax.texts]
    assert texts == ["coil 1", "coil 2", "coil 3"]
    assert "transfer" in _legend_texts(fig)
    assert ax.get_xlabel() == "Time [s]" and ax.get_ylabel() == "Temperature [°C]"


def test_radial_profiles_of_the_billet(billet):
    fig = figures.radial_profiles(billet)
    (ax,) = fig.axes
    tr = billet.transient
    profiles = [ln for ln in ax.get_lines() if ln.get_label().endswith(")")]
    assert len(profiles) == tr.profiles.shape[1] == 6
    last = profiles[-1]
    assert last.get_xdata()[-1] == pytest.approx(30.0)  # the surface, at the 60 mm radius
    np.testing.assert_allclose(last.get_ydata(), tr.profiles.iloc[:, -1] - zero_Celsius)
    assert profiles[0].get_label().endswith("(coil 1)")
    assert ax.get_xlabel() == "Radius (0 = axis) [mm]"


def test_power_density_of_each_section_integrates_to_its_power(billet):
    fig = figures.power_density_profile(billet)
    (ax,) = fig.axes
    curves = [ln for ln in ax.get_lines() if not ln.get_label().startswith("_")]
    assert [c.get_label() for c in curves] == [
        "coil 1, mid-point",
        "coil 2, mid-point",
        "coil 3, mid-point",
    ]
    radius = 0.03
    for curve, q in zip(curves, billet.sections["power_per_area_W_per_mm2"], strict=True):
        # element centres and element power densities of the field solution: the sum over the
        # elements of p dV, per unit surface, is the section's power per area (Poynting)
        r = radius - np.asarray(curve.get_xdata()) * 1e-3
        p = np.asarray(curve.get_ydata()) * 1e6
        order = np.argsort(r)
        r, p = r[order], p[order]
        nodes = billet.transient.nodes
        volume = pi * np.diff(nodes**2)  # per metre of billet
        assert np.sum(p * volume) / (2 * pi * radius) == pytest.approx(q * 1e6, rel=1e-3)
    # the first section is below the Curie temperature: its power lies much nearer the surface
    first_share = _share_within(curves[0], radius, 2e-3)
    last_share = _share_within(curves[-1], radius, 2e-3)
    assert first_share > 0.8 > last_share


def _share_within(curve, radius, depth):
    d = np.asarray(curve.get_xdata()) * 1e-3
    p = np.asarray(curve.get_ydata())
    r = radius - d
    w = p * r
    return w[d <= depth].sum() / w.sum()


def test_frequency_chart_of_the_billet_shows_hot_and_cold_ratios(billet):
    fig = figures.frequency_chart(billet)
    _, ax2 = fig.axes
    labels = [ln.get_label() for ln in ax2.get_lines()]
    assert "diameter / skin depth" in labels
    assert "diameter / skin depth, cold (magnetic)" in labels
    assert "chosen: 3.00 kHz" in _legend_texts(fig)


# -- harden ----------------------------------------------------------------------------------
def test_harden_profile_marks_the_case_depth(shaft):
    fig = figures.harden_profile(shaft)
    (ax,) = fig.axes
    prof = shaft.end_profile.sort_values("depth_mm")
    line = _line(ax, "end of heating")
    np.testing.assert_allclose(line.get_xdata(), prof["depth_mm"])
    t_aus = shaft.austenitising_temperature - zero_Celsius
    (aus,) = [ln for ln in ax.get_lines() if ln.get_label().startswith("austenitising")]
    assert aus.get_ydata()[0] == pytest.approx(t_aus)
    (mark,) = [ln for ln in ax.get_lines() if ln.get_label().startswith("predicted")]
    d = mark.get_xdata()[0]
    assert d == pytest.approx(shaft.predicted_case_depth * 1e3)
    # the plotted profile crosses the austenitising temperature at the marked depth
    assert np.interp(d, prof["depth_mm"], prof["temperature_degC"]) == pytest.approx(t_aus, abs=1)
    (band,) = [p for p in ax.patches if p.get_label().startswith("required")]
    assert _span(band) == pytest.approx((2.0, 3.0))
    assert ax.get_xlabel() == "Depth below the surface [mm]"
    assert _is_png(fig)


def test_temperature_history_of_the_shaft(shaft):
    fig = figures.temperature_history(shaft)
    (ax,) = fig.axes
    (end,) = [ln for ln in ax.get_lines() if ln.get_label().startswith("end of heating")]
    assert end.get_xdata()[0] == pytest.approx(shaft.heat_time)
    surface = _line(ax, "surface").get_ydata()
    assert surface[-1] == pytest.approx(shaft.surface_temperature - zero_Celsius, abs=2)
    assert any(t.startswith("austenitising") for t in _legend_texts(fig))


def test_power_density_of_the_shaft_cold_and_hot(shaft):
    fig = figures.power_density_profile(shaft)
    (ax,) = fig.axes
    curves = [ln for ln in ax.get_lines() if not ln.get_label().startswith("_")]
    assert [c.get_label() for c in curves] == ["start of heating (cold)", "end of heating"]
    nodes = shaft.transient.nodes
    volume = pi * np.diff(nodes**2)
    for curve in curves:
        p = np.asarray(curve.get_ydata()) * 1e6
        r = nodes[-1] - np.asarray(curve.get_xdata()) * 1e-3
        p = p[np.argsort(r)]
        assert np.sum(p * volume) / (2 * pi * nodes[-1]) == pytest.approx(
            shaft.power_density, rel=1e-3
        )
    # cold and magnetic: the power is held in a far thinner layer than when hot
    assert (
        _share_within(curves[0], nodes[-1], 1e-3) > 0.95 > _share_within(curves[1], nodes[-1], 1e-3)
    )


def test_frequency_chart_of_the_shaft_band_in_skin_depth_over_case(shaft):
    fig = figures.frequency_chart(shaft)
    ax, ax2 = fig.axes
    (band,) = [p for p in ax.patches if p.get_label().startswith("band")]
    f_lo, f_hi = _span(band)
    rho = materials.get("aisi-4140").resistivity(shaft.austenitising_temperature)
    # skin depth / case depth is 3 at the low edge and 1.2 at the high edge (the job's band)
    for f, ratio in ((f_lo, 3.0), (f_hi, 1.2)):
        assert math.sqrt(rho / (pi * f * mu_0)) / 2e-3 == pytest.approx(ratio, rel=1e-9)
    assert "skin depth / case depth" in [ln.get_label() for ln in ax2.get_lines()]


def test_power_density_of_a_field_solution_as_it_is():
    # uniform non-magnetic cylinder: the numerical solution against itself plotted, and the
    # surface value against the Kelvin-function solution (Davies 1990)
    mesh = em.radial_mesh("cylinder", 0.02, n=200, skin_depth=em.skin_depth(1e-6, 10e3))
    res = em.solve_radial_field(mesh, 1e-6, 1.0, 10e3, h_surface=1e4)
    fig = figures.power_density_profile(res)
    (ax,) = fig.axes
    (curve,) = [ln for ln in ax.get_lines() if not ln.get_label().startswith("_")]
    assert curve.get_label() == "field solution"
    np.testing.assert_allclose(
        np.sort(curve.get_ydata())[::-1], np.sort(res.power_density)[::-1] / 1e6
    )
    exact = em.cylinder_power_density(0.02, 1e4, 0.02, 1e-6, 10e3) / 1e6
    assert max(curve.get_ydata()) == pytest.approx(exact, rel=0.05)


# -- brazing ---------------------------------------------------------------------------------
def test_temperature_history_of_the_joint(joint):
    fig = figures.temperature_history(joint)
    (ax,) = fig.axes
    s = joint.series
    np.testing.assert_allclose(
        _line(ax, "fitting (outer part)").get_ydata(), s["fitting"] - zero_Celsius
    )
    np.testing.assert_allclose(_line(ax, "tube (inner part)").get_ydata(), s["tube"] - zero_Celsius)
    (band,) = [p for p in ax.patches if p.get_label().startswith("brazing range")]
    y0 = band.get_y()
    # BAg-7 is brazed from 652 to 760 degC (AWS A5.8, 1205-1400 degF; from memory)
    assert (y0, y0 + band.get_height()) == pytest.approx((652, 760), abs=1.0)
    (end,) = [ln for ln in ax.get_lines() if ln.get_label().startswith("end of heating")]
    assert end.get_xdata()[0] == pytest.approx(joint.heat_time)
    # the tube, heated mostly through the clearance, reaches the brazing temperature last
    tube = _line(ax, "tube (inner part)")
    i_end = int(np.searchsorted(s.index.to_numpy(), joint.heat_time))
    t_b = joint.brazing_temperature - zero_Celsius
    assert tube.get_ydata()[i_end] == pytest.approx(t_b, abs=1.0)
    assert "power off, cooling" in _legend_texts(fig)


def test_joint_power_history_closes_the_energy_balance(joint):
    fig = figures.joint_power_history(joint)
    (ax,) = fig.axes
    total = _line(ax, "power into the joint")
    fit, tube = _line(ax, "into the fitting"), _line(ax, "into the tube")
    np.testing.assert_allclose(total.get_ydata(), fit.get_ydata() + tube.get_ydata())
    loss = _line(ax, "leaving the joint (surface, conduction along the parts)")
    t = np.asarray(total.get_xdata())
    heat = t <= joint.heat_time
    # energy conservation over the heating: absorbed - leaving = heat stored in the two parts
    # (trapezoid rule on the plotted points)
    net = np.trapezoid((total.get_ydata() - loss.get_ydata())[heat], t[heat])
    assert net == pytest.approx(joint.heat_energy, rel=0.02)
    assert ax.get_ylabel() == "Power [W]"


def test_frequency_chart_of_the_joint(joint):
    fig = figures.frequency_chart(joint)
    ax, _ = fig.axes
    share = _line(ax, "share of power in the fitting")
    table = joint.frequency_table.sort_values("frequency")
    np.testing.assert_allclose(share.get_ydata(), table["fitting_share"])
    (band,) = [p for p in ax.patches if p.get_label().startswith("band")]
    f_lo, f_hi = _span(band)
    rho = materials.get("brass-c26000").resistivity(joint.brazing_temperature)
    wall = 14e-3 - 11.05e-3  # fitting radius minus its bore radius (tube + half the clearance)
    for f, ratio in ((f_lo, 1.0), (f_hi, 2.0)):
        assert wall / math.sqrt(rho / (pi * f * mu_0)) == pytest.approx(ratio, rel=1e-9)


def test_power_density_of_the_joint_integrates_to_the_power_into_it(joint):
    fig = figures.power_density_profile(joint)
    (ax,) = fig.axes
    curves = [ln for ln in ax.get_lines() if not ln.get_label().startswith("_")]
    assert [c.get_label() for c in curves] == ["fitting, end of heating", "tube, end of heating"]
    g = joint.geometry
    walls = (
        (g.fitting_inner_radius, g.fitting_outer_radius),
        (g.tube_inner_radius, g.tube_outer_radius),
    )
    powers = []
    for curve, (r_in, r_out) in zip(curves, walls, strict=True):
        r = g.fitting_outer_radius - np.asarray(curve.get_xdata()) * 1e-3  # element centres
        p = np.asarray(curve.get_ydata()) * 1e6
        order = np.argsort(r)
        r, p = r[order], p[order]
        assert r[0] > r_in and r[-1] < r_out  # each curve lies within its own wall
        # element edges recovered from the centres (midpoints; the wall faces at the ends)
        edges = np.concatenate(([r_in], 0.5 * (r[1:] + r[:-1]), [r_out]))
        powers.append(np.sum(p * pi * np.diff(edges**2)) * g.overlap_length)
    # energy conservation: the plotted power density over both parts is the coil circuit's
    # power into the joint at the end of heating (midpoint rule on the graded elements)
    assert sum(powers) == pytest.approx(joint.circuit.workpiece_power, rel=0.02)
    # and the fitting takes the job's share of it at the end of heating
    assert powers[0] / sum(powers) == pytest.approx(joint.fitting_share_end, abs=0.01)


# -- wrong types ---------------------------------------------------------------------------
@pytest.mark.parametrize(
    ("name", "wrong"),
    [
        ("energy_breakdown", "billet"),
        ("power_flow", "shaft"),
        ("temperature_history", "melt"),
        ("radial_profiles", "melt"),
        ("harden_profile", "billet"),
        ("joint_power_history", "melt"),
        ("temperature_history", "melt"),
    ],
)
def test_wrong_result_type_raises(name, wrong, request):
    result = request.getfixturevalue(wrong)
    with pytest.raises(
        ValueError, match=rf"{name}: result must be .*; got {type(result).__name__}"
    ):
        getattr(figures, name)(result)


@pytest.mark.parametrize(
    "name",
    ["frequency_chart", "power_density_profile", "energy_breakdown", "harden_profile"],
)
def test_not_a_result_raises(name):
    with pytest.raises(ValueError, match=rf"{name}: result must be .*; got str"):
        getattr(figures, name)("melt")


def test_frequency_chart_needs_the_band_of_the_table(melt):
    broken = copy.copy(melt)
    broken.frequency_table = melt.frequency_table.copy()
    broken.frequency_table.attrs = {}
    with pytest.raises(ValueError, match="no attrs 'band' and 'ratio'"):
        figures.frequency_chart(broken)
