"""Property-based checks (hypothesis) of invariants of the thermal core.

Invariants: enthalpy increases with temperature and its inverse recovers the temperature;
the radial solver conserves energy (first law) for any constant material, flux and loss; more
power heats faster; radiation grows with temperature and emissivity; the lumped and radial
models agree for a thin, highly conducting body (the lumped limit, Bi -> 0).
"""

import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from heatcalc import materials
from heatcalc.materials import Material
from heatcalc.thermal import (
    SurfaceLoss,
    enthalpy_curve,
    heat_segment,
    lumped_heating,
    radiation_loss,
    simulate_heating,
    specific_enthalpy,
    temperature_from_enthalpy,
)

KEYS = ["aisi-1045", "aisi-4140", "aisi-304", "iron", "al-1050", "al-6061", "cu-etp"]
SETTINGS = settings(max_examples=25, deadline=None)


@SETTINGS
@given(key=st.sampled_from(KEYS), a=st.floats(0.0, 1.0), b=st.floats(0.0, 1.0))
def test_enthalpy_is_increasing_and_invertible(key, a, b):
    mat = materials.get(key)
    curve = enthalpy_curve(mat)
    lo, hi = sorted((a, b))
    t1 = curve.t_min + lo * (curve.t_max - curve.t_min)
    t2 = curve.t_min + hi * (curve.t_max - curve.t_min)
    h1, h2 = specific_enthalpy(mat, t1), specific_enthalpy(mat, t2)
    assert h2 >= h1
    if t2 > t1 + 1e-6:
        assert h2 > h1
    assert temperature_from_enthalpy(mat, h1) == pytest.approx(t1, abs=1e-7)


@SETTINGS
@given(
    k=st.floats(5.0, 300.0),
    c=st.floats(300.0, 1200.0),
    rho=st.floats(2000.0, 9000.0),
    flux=st.floats(1e4, 1e6),
    eps=st.floats(0.0, 1.0),
    h=st.floats(0.0, 50.0),
    geometry=st.sampled_from(["cylinder", "tube", "slab"]),
)
def test_radial_solver_conserves_energy(k, c, rho, flux, eps, h, geometry):
    m = Material.constant(thermal_conductivity=k, specific_heat=c, density=rho, t_max=1e5)
    loss = SurfaceLoss(emissivity=eps, h_convection=h)
    inner = 0.01 if geometry == "tube" else None
    r = simulate_heating(m, geometry, 0.02, [heat_segment(20.0, power_per_area=flux, loss=loss)],
                         inner=inner, n_nodes=21, steps_per_segment=40)  # fmt: skip
    assert abs(r.closure_error) < 1e-9
    assert r.energy_in == pytest.approx(20.0 * flux)
    # constant c: stored = m c (mean rise) exactly
    mass = rho * (0.02 if geometry == "slab" else (0.02**2 - (inner or 0.0) ** 2) / 0.04)
    rise = r.series["mean"].iloc[-1] - 293.15
    assert r.energy_stored == pytest.approx(mass * c * rise, rel=1e-6, abs=1e-3)


@SETTINGS
@given(flux=st.floats(5e4, 5e5), factor=st.floats(1.05, 3.0))
def test_more_flux_gives_hotter_workpiece(flux, factor):
    m = Material.constant(thermal_conductivity=40.0, specific_heat=600.0, density=7800.0)
    loss = SurfaceLoss(emissivity=0.8)
    ends = []
    for q in (flux, flux * factor):
        r = simulate_heating(m, "cylinder", 0.02, [heat_segment(10.0, power_per_area=q,
                             loss=loss)], n_nodes=15, steps_per_segment=20)  # fmt: skip
        ends.append(r.series.iloc[-1])
    assert ends[1]["surface"] > ends[0]["surface"]
    assert ends[1]["centre"] > ends[0]["centre"]


@SETTINGS
@given(
    t=st.floats(300.0, 3000.0), dt=st.floats(1.0, 500.0), eps=st.floats(0.01, 1.0),
    ratio=st.floats(0.1, 0.99),
)  # fmt: skip
def test_radiation_monotonic(t, dt, eps, ratio):
    assert radiation_loss(t + dt, 293.15, eps) > radiation_loss(t, 293.15, eps)
    assert radiation_loss(t, 293.15, eps * ratio) < radiation_loss(t, 293.15, eps)


@SETTINGS
@given(power=st.floats(1e4, 1e5))
def test_lumped_limit_of_the_radial_solver(power):
    # Thin copper-like slab (Bi ~ 1e-5): the radial solution and the lumped model coincide.
    m = Material.constant(thermal_conductivity=400.0, specific_heat=400.0, density=8900.0)
    half = 0.002
    loss = SurfaceLoss(h_convection=20.0)
    r = simulate_heating(m, "slab", half, [heat_segment(30.0, power_per_area=power, loss=loss)],
                         n_nodes=5, steps_per_segment=600)  # fmt: skip
    lump = lumped_heating(m, 8900.0 * half, power, 30.0, area=1.0, loss=loss)
    rise = lump.series["temperature"].iloc[-1] - 293.15
    # backward Euler with 0.05 s steps against an accurate integration: 2e-4 of the rise
    assert r.series["mean"].iloc[-1] - 293.15 == pytest.approx(rise, rel=2e-4)
    assert np.isfinite(r.series["surface"]).all()
