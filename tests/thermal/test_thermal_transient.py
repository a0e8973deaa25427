"""Radial transient solver: grid geometry, schedules, result object, argument checks.

Outside references: the exact volumes of a cylinder, a tube and a slab (geometry); the first
law (stored = in - lost). The accuracy checks against Carslaw & Jaeger and Incropera & DeWitt
are in tests/verification/test_thermal_analytic.py.
"""

import numpy as np
import pandas as pd
import pytest

from heatcalc.em import radial_mesh
from heatcalc.materials import Material
from heatcalc.thermal import (
    RadialConduction,
    Segment,
    SurfaceLoss,
    conduction_grid,
    heat_segment,
    simulate_heating,
    soak_segment,
    transfer_segment,
)

STEEL_LIKE = Material.constant(thermal_conductivity=30.0, specific_heat=600.0, density=7800.0)


# -- grid -------------------------------------------------------------------------------------
@pytest.mark.parametrize(
    ("geometry", "nodes", "volume_per_area"),
    [
        # volume / heated area: pi R^2 / (2 pi R) = R/2; tube (Ro^2 - Ri^2)/(2 Ro); slab l
        ("cylinder", np.linspace(0.0, 0.04, 17), 0.02),
        ("tube", np.linspace(0.01, 0.04, 13), (0.04**2 - 0.01**2) / (2 * 0.04)),
        ("slab", np.geomspace(1e-4, 0.01, 9) - 1e-4, 0.01 - 1e-4),
    ],
)
def test_grid_volumes_are_exact(geometry, nodes, volume_per_area):
    g = conduction_grid(geometry, nodes)
    assert g.volume.sum() == pytest.approx(volume_per_area, rel=1e-13)
    assert g.element_volume.sum() == pytest.approx(volume_per_area, rel=1e-13)
    s = g.node_source(np.full(nodes.size - 1, 2.0e6))
    assert s.sum() == pytest.approx(2.0e6 * volume_per_area, rel=1e-13)


def test_grid_matches_field_mesh_volumes():
    mesh = radial_mesh("tube", 0.05, 0.03, n=40, skin_depth=2e-3)
    g = conduction_grid(mesh.geometry, mesh.nodes)
    np.testing.assert_allclose(g.element_volume, mesh.volume_per_area, rtol=1e-12)


def test_grid_bad_input():
    with pytest.raises(ValueError, match="geometry='sphere' is not known"):
        conduction_grid("sphere", [0.0, 0.5, 1.0])
    with pytest.raises(ValueError, match="at least 3 positions"):
        conduction_grid("slab", [0.0, 1.0])
    with pytest.raises(ValueError, match="strictly increasing"):
        conduction_grid("slab", [0.0, 1.0, 0.5])
    with pytest.raises(ValueError, match=r"nodes\[0\] must be 0 for a cylinder"):
        conduction_grid("cylinder", [0.1, 0.5, 1.0])
    with pytest.raises(ValueError, match=r"nodes\[0\] \(bore radius\) must be > 0"):
        conduction_grid("tube", [0.0, 0.5, 1.0])
    with pytest.raises(ValueError, match="grid must be a ConductionGrid"):
        RadialConduction("grid", STEEL_LIKE)
    g = conduction_grid("slab", [0.0, 0.5, 1.0])
    with pytest.raises(ValueError, match="no thermal_conductivity table"):
        RadialConduction(g, Material.constant(specific_heat=500.0, density=7800.0))


# -- schedules --------------------------------------------------------------------------------
def test_segment_helpers():
    air = SurfaceLoss(emissivity=0.8)
    assert heat_segment(10.0, h_surface=3e4, frequency=1e4).mode == "field"
    assert transfer_segment(5.0, air).mode == "off"
    assert soak_segment(5.0, air).mode == "off"
    low = soak_segment(5.0, air, power_per_area=1e4, frequency=1e3)
    assert low.mode == "power" and low.induction
    assert not heat_segment(1.0, power_per_area=1e5).induction  # surface flux


def test_segment_bad_input():
    with pytest.raises(ValueError, match="duration must be > 0"):
        Segment(0.0)
    with pytest.raises(ValueError, match="mode='current' is not known"):
        Segment(1.0, "current", 1.0)
    with pytest.raises(ValueError, match="value must be >= 0"):
        Segment(1.0, "power", -1.0)
    with pytest.raises(ValueError, match="value must be > 0"):
        Segment(1.0, "field", 0.0, frequency=1e3)
    with pytest.raises(ValueError, match="frequency must be given for mode='field'"):
        Segment(1.0, "field", 1e4)
    with pytest.raises(ValueError, match="value must be 0 for mode='off'"):
        Segment(1.0, "off", 5.0)
    with pytest.raises(ValueError, match="frequency must be > 0"):
        Segment(1.0, "power", 1e5, frequency=-50.0)
    with pytest.raises(ValueError, match="loss must be a SurfaceLoss"):
        Segment(1.0, "off", loss=0.8)
    with pytest.raises(ValueError, match="give exactly one of power_per_area and h_surface"):
        heat_segment(1.0)


# -- runs and results -------------------------------------------------------------------------
@pytest.fixture(scope="module")
def flux_run():
    schedule = [
        heat_segment(30.0, power_per_area=2e5, loss=SurfaceLoss(emissivity=0.8), label="heat"),
        transfer_segment(10.0, SurfaceLoss(emissivity=0.8, h_convection=10.0)),
    ]
    return simulate_heating(STEEL_LIKE, "cylinder", 0.03, schedule, n_nodes=31,
                            time_step=0.25, profile_times=[0.0, 12.3, 30.0, 40.0])  # fmt: skip


def test_series_and_profiles(flux_run):
    s = flux_run.series
    assert isinstance(s, pd.DataFrame) and s.index.name == "time"
    assert {"surface", "centre", "mean", "power", "loss", "h_surface", "label"} <= set(s.columns)
    assert s.index[0] == 0.0 and s.index[-1] == pytest.approx(40.0)
    assert 12.3 in s.index  # steps were cut to land on the profile time
    assert np.all(np.diff(s.index) <= 0.25 + 1e-12)
    assert list(s["label"].iloc[1:].unique()) == ["heat", "transfer"]
    assert flux_run.profiles.shape == (31, 4)
    prof = flux_run.profile(30.0)
    assert prof[-1] == pytest.approx(s.loc[30.0, "surface"])
    assert prof[0] == pytest.approx(s.loc[30.0, "centre"])
    with pytest.raises(ValueError, match="is not among the profile times"):
        flux_run.profile(7.0)


def test_time_to_reach(flux_run):
    s = flux_run.series
    t = flux_run.time_to_reach(400.0, where="surface")
    i = np.searchsorted(s["surface"].to_numpy(), 400.0)
    assert s.index[i - 1] <= t <= s.index[i]
    assert flux_run.time_to_reach(293.0, where="mean") == 0.0
    with pytest.raises(ValueError, match="never reached at the centre"):
        flux_run.time_to_reach(2000.0)
    with pytest.raises(ValueError, match="where='middle' is not known"):
        flux_run.time_to_reach(400.0, where="middle")


def test_energy_tables(flux_run):
    bal = flux_run.energy_balance()
    assert bal.loc["energy in", "J_per_m2"] == pytest.approx(2e5 * 30.0)
    assert bal.loc["energy in", "J_per_m"] == pytest.approx(2e5 * 30.0 * 2 * np.pi * 0.03)
    assert abs(bal.loc["in - stored - lost", "J_per_m2"]) < 1e-6 * 2e5 * 30.0
    s = flux_run.series
    assert s["energy_in"].iloc[-1] == pytest.approx(flux_run.energy_in)
    assert s["energy_stored"].iloc[-1] == pytest.approx(flux_run.energy_stored)
    assert "<table" in flux_run._repr_html_()
    assert flux_run.summary().loc["closure error [-]", "value"] == flux_run.closure_error


def test_initial_profile_array_and_uniform_steps():
    t0 = np.linspace(400.0, 600.0, 21)
    r = simulate_heating(STEEL_LIKE, "slab", 0.01, [transfer_segment(5.0, None)], n_nodes=21,
                         t_initial=t0, steps_per_segment=10)  # fmt: skip
    assert len(r.series) == 11
    assert r.series["centre"].iloc[0] == pytest.approx(400.0, abs=1e-3)
    # insulated: energy conserved, profile flattens towards the mean
    assert abs(r.energy_stored) < 1e-6 * 7800 * 600 * 0.01
    assert r.series["surface"].iloc[-1] < 600.0


def test_leaving_the_tables_raises():
    m = Material.constant(thermal_conductivity=30.0, specific_heat=600.0, density=7800.0,
                          t_min=250.0, t_max=800.0)  # fmt: skip
    with pytest.raises(ValueError, match=r"at t = .* is outside the tables of 'constant'"):
        simulate_heating(m, "cylinder", 0.02, [heat_segment(100.0, power_per_area=1e6)],
                         n_nodes=11)  # fmt: skip


def test_simulate_bad_input():
    seg = heat_segment(1.0, power_per_area=1e5)
    with pytest.raises(ValueError, match="geometry='ball' is not known"):
        simulate_heating(STEEL_LIKE, "ball", 0.02, [seg])
    with pytest.raises(ValueError, match="schedule must be a non-empty sequence of Segment"):
        simulate_heating(STEEL_LIKE, "cylinder", 0.02, [])
    with pytest.raises(ValueError, match="schedule must be a non-empty sequence of Segment"):
        simulate_heating(STEEL_LIKE, "cylinder", 0.02, [1.0])
    with pytest.raises(ValueError, match="time_step must be > 0"):
        simulate_heating(STEEL_LIKE, "cylinder", 0.02, [seg], time_step=0.0)
    with pytest.raises(ValueError, match="steps_per_segment must be an integer >= 1"):
        simulate_heating(STEEL_LIKE, "cylinder", 0.02, [seg], steps_per_segment=0)
    with pytest.raises(ValueError, match="t_initial must be an absolute temperature"):
        simulate_heating(STEEL_LIKE, "cylinder", 0.02, [seg], t_initial=-1.0)
    with pytest.raises(ValueError, match=r"t_initial must be a scalar or one value per node"):
        simulate_heating(STEEL_LIKE, "cylinder", 0.02, [seg], n_nodes=11, t_initial=[300.0] * 3)
    with pytest.raises(ValueError, match="outer must be > 0"):
        simulate_heating(STEEL_LIKE, "cylinder", -0.02, [seg])
    with pytest.raises(ValueError, match="inner must be given for a tube"):
        simulate_heating(STEEL_LIKE, "tube", 0.02, [seg])
    with pytest.raises(ValueError, match="mesh must be a RadialMesh or None"):
        simulate_heating(STEEL_LIKE, "cylinder", 0.02, [seg], mesh=[0.0, 0.01, 0.02])
    with pytest.raises(ValueError, match="mesh is a slab of outer=0.02 m, inner=0.0 m"):
        simulate_heating(STEEL_LIKE, "cylinder", 0.02, [seg], mesh=radial_mesh("slab", 0.02))
    with pytest.raises(ValueError, match="profile_times must be >= 0"):
        simulate_heating(STEEL_LIKE, "cylinder", 0.02, [seg], profile_times=[-1.0])
    with pytest.raises(ValueError, match=r"profile_times \[5.0\] lie beyond the end"):
        simulate_heating(STEEL_LIKE, "cylinder", 0.02, [seg], profile_times=[5.0])
    with pytest.raises(ValueError, match="no resistivity table, needed for induction"):
        simulate_heating(STEEL_LIKE, "cylinder", 0.02, [heat_segment(1.0, power_per_area=1e5,
                                                                     frequency=1e3)])  # fmt: skip
    ind = heat_segment(1.0, h_surface=1e4, frequency=1e3)
    conducting = Material.constant(resistivity=1e-6, thermal_conductivity=30.0,
                                   specific_heat=600.0, density=7800.0)  # fmt: skip
    with pytest.raises(ValueError, match="field_update must be > 0"):
        simulate_heating(conducting, "cylinder", 0.02, [ind], field_update=0.0)
    with pytest.raises(ValueError, match="field_tolerance must be > 0"):
        simulate_heating(conducting, "cylinder", 0.02, [ind], field_tolerance=-1.0)
    with pytest.raises(ValueError, match="tolerance must be > 0"):
        simulate_heating(conducting, "cylinder", 0.02, [ind], tolerance=0.0)
    with pytest.raises(ValueError, match="n must be an integer >= 3"):
        simulate_heating(STEEL_LIKE, "cylinder", 0.02, [seg], n_nodes=2)


def test_constant_resistivity_field_mode_matches_analytic_power():
    # Non-magnetic, constant resistivity: the absorbed power equals the analytic solid-cylinder
    # value rho H^2/delta P(m) of heatcalc.em (itself checked against Kelvin functions).
    from heatcalc.em import cylinder_power_per_area

    m = Material.constant(resistivity=1e-6, thermal_conductivity=30.0, specific_heat=600.0,
                          density=7800.0)  # fmt: skip
    r = simulate_heating(m, "cylinder", 0.02, [heat_segment(2.0, h_surface=2e4, frequency=5e3)],
                         n_nodes=200, steps_per_segment=4)  # fmt: skip
    ref = cylinder_power_per_area(2e4, 0.02, 1e-6, 5e3)
    assert r.series["power"].iloc[-1] == pytest.approx(ref, rel=2e-3)


def test_line_of_coils_with_different_frequencies():
    # A heating line: two coils at different frequencies and modes, a gap, a third coil.
    air = SurfaceLoss(emissivity=0.8)
    line = [
        heat_segment(20.0, power_per_area=6e5, frequency=1e3, loss=air, label="coil 1"),
        heat_segment(15.0, h_surface=4e4, frequency=4e3, loss=air, label="coil 2"),
        transfer_segment(3.0, air, label="gap"),
        heat_segment(10.0, power_per_area=0.0, frequency=4e3, loss=air, label="coil 3 (off)"),
    ]
    r = simulate_heating("iron", "cylinder", 0.025, line, n_nodes=50, steps_per_segment=40)
    s = r.series
    assert list(s["label"].iloc[1:].unique()) == [seg.label for seg in line]
    np.testing.assert_allclose(s[s["label"] == "coil 1"]["power"], 6e5)
    assert (s[s["label"] == "coil 2"]["h_surface"] == 4e4).all()
    assert (s[s["label"] == "gap"]["power"] == 0).all()
    assert (s[s["label"] == "coil 3 (off)"]["h_surface"] == 0).all()
    assert abs(r.closure_error) < 1e-9


def test_failed_newton_step_is_halved_and_stays_conservative():
    from heatcalc.thermal.coupled import _advance

    tm = 933.47
    m = Material.constant(thermal_conductivity=200.0, specific_heat=1000.0, density=2400.0,
                          solidus=tm, liquidus=tm, latent_heat=3.97e5)  # fmt: skip
    grid = conduction_grid("slab", np.linspace(0.0, 0.01, 11))
    cond = RadialConduction(grid, m, max_iterations=5)  # too few for one 20 s step
    h0 = cond.enthalpy(np.full(11, tm - 5.0))
    h1, t1, lost, iterations = _advance(cond, h0, 20.0, None, 4e5, None)
    assert iterations > 5  # the step was split
    stored = float(cond.mass @ (h1 - h0))
    assert stored == pytest.approx(4e5 * 20.0, rel=1e-9)
    assert lost == 0.0
