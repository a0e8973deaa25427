"""Energy balance of the coupled field + heat solver through the Curie point and melting.

The stored energy is recomputed independently from the final temperature profile with
:func:`heatcalc.thermal.specific_enthalpy` and the control-volume masses; the surface loss is
recomputed from the surface-temperature history with the exact loss functions (radiation with
the CODATA constant, ``ht`` + CoolProp convection) by the right-endpoint rule that matches the
backward-Euler scheme. Closure ``(in - stored - lost)/in`` must stay below 0.1 %.

Facts of the trade used (common practice, no source): a steel's absorbed power at constant coil
current falls sharply once the surface passes the Curie temperature; at constant absorbed power
the surface field must rise there.
"""

import numpy as np
import pytest

from heatcalc import materials
from heatcalc.materials import Material
from heatcalc.thermal import (
    REFERENCE_TEMPERATURE,
    SurfaceLoss,
    conduction_grid,
    heat_segment,
    simulate_heating,
    soak_segment,
    specific_enthalpy,
    transfer_segment,
)

AIR = SurfaceLoss(emissivity=0.8, t_surroundings=293.15, convection="horizontal_cylinder",
                  length=0.06)  # fmt: skip
WARM_ENCLOSURE = SurfaceLoss(emissivity=0.2, t_surroundings=900.0)


def independent_closure(result, material, schedule, t_initial):
    mat = materials.get(material) if isinstance(material, str) else material
    grid = conduction_grid(result.geometry, result.nodes)
    mass = grid.volume * float(mat.density(REFERENCE_TEMPERATURE))
    final = result.profiles.iloc[:, -1].to_numpy()
    stored = float(mass @ (specific_enthalpy(mat, final) - specific_enthalpy(mat, t_initial)))
    s = result.series
    dt = np.diff(s.index.to_numpy())
    steps = s.iloc[1:]
    energy_in = float(np.sum(steps["power"].to_numpy() * dt))
    lost = 0.0
    for k, seg in enumerate(schedule):
        mine = (steps["segment"] == k).to_numpy()
        if seg.loss is not None:
            lost += float(np.sum(seg.loss.flux(steps["surface"].to_numpy()[mine]) * dt[mine]))
    return (energy_in - stored - lost) / energy_in, energy_in, stored, lost


@pytest.fixture(scope="module")
def steel_cycle():
    schedule = [
        heat_segment(60.0, h_surface=5e4, frequency=3e3, loss=AIR),
        transfer_segment(10.0, AIR),
        soak_segment(30.0, WARM_ENCLOSURE),
    ]
    r = simulate_heating("aisi-1045", "cylinder", 0.03, schedule, n_nodes=80,
                         steps_per_segment=300, profile_times=[100.0])  # fmt: skip
    return r, schedule


def test_steel_cycle_closes_through_curie(steel_cycle):
    r, schedule = steel_cycle
    steel = materials.get("aisi-1045")
    assert r.series["surface"].max() > steel.curie_temperature + 15.0  # really through it
    closure, e_in, stored, lost = independent_closure(r, "aisi-1045", schedule, 293.15)
    assert abs(closure) < 1e-3
    assert abs(r.closure_error) < 1e-9  # the solver's own bookkeeping
    assert e_in == pytest.approx(r.energy_in, rel=1e-12)
    assert lost == pytest.approx(r.energy_lost, rel=1e-3)


def test_constant_current_power_falls_past_curie(steel_cycle):
    r, _ = steel_cycle
    steel = materials.get("aisi-1045")
    heat = r.series[r.series["label"] == "heat"]
    t_cross = heat.index[np.argmax(heat["surface"].to_numpy() > steel.curie_temperature)]
    before = heat.loc[: t_cross - 8.0, "power"].max()
    after = heat["power"].iloc[-1]
    assert after < 0.5 * before
    # the peak of absorbed power comes shortly before the surface reaches the Curie point
    t_peak = heat["power"].idxmax()
    assert t_cross - 15.0 < t_peak < t_cross


def test_constant_power_needs_more_field_past_curie():
    steel = materials.get("aisi-1045")
    schedule = [heat_segment(45.0, power_per_area=1.2e6, frequency=3e3, loss=AIR)]
    r = simulate_heating(steel, "cylinder", 0.03, schedule, n_nodes=60, steps_per_segment=200)
    s = r.series.iloc[1:]
    np.testing.assert_allclose(s["power"], 1.2e6, rtol=1e-12)  # exactly the target
    cold = s[s["surface"] < steel.curie_temperature - 100.0]["h_surface"].min()
    hot = s["h_surface"].iloc[-1]
    assert s["surface"].iloc[-1] > steel.curie_temperature + 30.0
    assert hot > 1.5 * cold


def test_aluminium_melting_cycle_closes():
    al = materials.get("al-1050")
    loss = SurfaceLoss(emissivity=0.2, t_surroundings=293.15, h_convection=10.0)
    schedule = [
        heat_segment(150.0, power_per_area=6e5, frequency=1e3, loss=loss),
        soak_segment(30.0, SurfaceLoss(emissivity=0.1, t_surroundings=293.15)),
    ]
    r = simulate_heating(al, "cylinder", 0.05, schedule, n_nodes=60, steps_per_segment=300,
                         profile_times=[180.0])  # fmt: skip
    assert r.series["centre"].iloc[-1] > al.liquidus  # fully molten at the end
    closure, *_ = independent_closure(r, al, schedule, 293.15)
    assert abs(closure) < 1e-3
    # while melting the centre waits near the solidus (latent heat absorbed): common practice
    centre = r.series["centre"]
    waiting = centre[(centre > al.solidus - 1.0) & (centre < al.solidus + 1.0)]
    assert waiting.index[-1] - waiting.index[0] > 20.0


def test_pure_metal_plateau_conserves_energy():
    # Constant properties with a melting step at 933.47 K, surface flux: the balance closes to
    # the Newton tolerance and the nodes wait at the melting point while they melt.
    tm = 933.47
    m = Material.constant(thermal_conductivity=200.0, specific_heat=1000.0, density=2400.0,
                          solidus=tm, liquidus=tm, latent_heat=3.97e5)  # fmt: skip
    seg = heat_segment(200.0, power_per_area=8e5, loss=SurfaceLoss(emissivity=0.3))
    r = simulate_heating(m, "slab", 0.02, [seg], n_nodes=41, steps_per_segment=400)
    assert abs(r.closure_error) < 1e-9
    stored = r.energy_stored
    assert stored == pytest.approx(r.energy_in - r.energy_lost, rel=1e-9)
    centre = r.series["centre"]
    assert np.sum(np.abs(centre - tm) < 1e-6) > 20  # a plateau, not a jump
    assert r.series["centre"].iloc[-1] > tm  # and then fully liquid


def test_coupled_time_step_convergence_is_first_order():
    # Self-convergence of the coupled problem (no exact solution): successive differences of
    # the final centre temperature and energy absorbed halve with the step (backward Euler and
    # a source lagged by one step); field re-solved at almost every step.
    schedule = [heat_segment(40.0, h_surface=5e4, frequency=3e3, loss=AIR)]
    values = []
    for steps in [20, 40, 80, 160]:
        r = simulate_heating("aisi-1045", "cylinder", 0.03, schedule, n_nodes=60,
                             steps_per_segment=steps, field_update=0.05,
                             field_tolerance=1e-6)  # fmt: skip
        values.append([r.series["centre"].iloc[-1], r.energy_in])
    diffs = np.abs(np.diff(np.array(values), axis=0))
    dts = 40.0 / np.array([40, 80, 160])
    for column in range(2):
        order = np.polyfit(np.log(dts), np.log(diffs[:, column]), 1)[0]
        assert 0.8 < order < 1.25, (column, order, diffs)
