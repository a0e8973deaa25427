"""Lumped (uniform-temperature) heating against its exact solutions.

Outside references:
* the lumped-capacitance solution with a heat input, Incropera & DeWitt, Fundamentals of Heat
  and Mass Transfer, 6th ed., 2007, section 5.3 (eq. 5.25 with a constant source term), derived
  here in closed form: T = T_inf + (T0 - T_inf) e^(-t/tau) + P/(h A) (1 - e^(-t/tau));
* the melting plateau of a pure metal, duration m L / (P - loss(T_m)) (first law; common
  practice, no source).
"""

import numpy as np
import pytest

from heatcalc.materials import Material
from heatcalc.thermal import SurfaceLoss, lumped_heating

M, C, P, H, A, T_INF, T0 = 12.0, 480.0, 9000.0, 25.0, 0.4, 293.15, 350.0


def exact(t):
    tau = M * C / (H * A)
    return T_INF + (T0 - T_INF) * np.exp(-t / tau) + P / (H * A) * (1 - np.exp(-t / tau))


@pytest.fixture(scope="module")
def linear_run():
    mat = Material.constant(specific_heat=C, t_min=200.0, t_max=2500.0)
    loss = SurfaceLoss(h_convection=H, t_surroundings=T_INF)
    return lumped_heating(mat, M, P, 2000.0, t_initial=T0, area=A, loss=loss,
                          targets=[800.0, 1000.0])  # fmt: skip


def test_matches_exact_solution(linear_run):
    s = linear_run.series
    t = s.index.to_numpy()
    np.testing.assert_allclose(s["temperature"], exact(t), rtol=0, atol=1e-4)


def test_event_times_match_inverse_of_exact_solution(linear_run):
    tau = M * C / (H * A)
    t_ss = T_INF + P / (H * A)  # steady temperature
    for target in [800.0, 1000.0]:
        t_exact = -tau * np.log((t_ss - target) / (t_ss - T0))
        assert linear_run.events[f"reach {target:g} K"] == pytest.approx(t_exact, rel=1e-6)
        assert linear_run.time_to_reach(target) == pytest.approx(t_exact, rel=1e-3)


def test_energy_closure(linear_run):
    assert abs(linear_run.closure_error) < 1e-6
    assert linear_run.energy_in == pytest.approx(P * 2000.0)


def test_melting_plateau_duration():
    tm, latent = 933.47, 3.97e5
    mat = Material.constant(specific_heat=1000.0, t_min=250.0, t_max=1500.0, solidus=tm,
                            liquidus=tm, latent_heat=latent)  # fmt: skip
    loss = SurfaceLoss(h_convection=20.0, t_surroundings=T_INF)
    m, p, a = 5.0, 12e3, 0.2
    r = lumped_heating(mat, m, p, 1200.0, area=a, loss=loss, stop_at=1400.0)
    plateau = r.events["fully liquid"] - r.events["melt start"]
    assert plateau == pytest.approx(m * latent / (p - 20.0 * a * (tm - T_INF)), rel=1e-6)
    s = r.series
    on = s[(s.index > r.events["melt start"] + 1) & (s.index < r.events["fully liquid"] - 1)]
    assert len(on) > 10 and np.allclose(on["temperature"], tm, atol=1e-9)
    assert abs(r.closure_error) < 1e-6


def test_stop_at_ends_the_run_and_power_may_vary():
    mat = Material.constant(specific_heat=500.0, t_min=250.0, t_max=2000.0)
    r = lumped_heating(mat, 10.0, lambda t: 1000.0 + 10.0 * t, 5000.0, stop_at=900.0)
    # no losses: m c (T - T0) = 1000 t + 5 t^2
    t_end = r.series.index[-1]
    assert r.series["temperature"].iloc[-1] == pytest.approx(900.0, abs=1e-5)
    assert 1000.0 * t_end + 5.0 * t_end**2 == pytest.approx(10 * 500 * (900 - 293.15), rel=1e-6)


def test_more_power_heats_faster():
    mat = Material.constant(specific_heat=500.0, t_min=250.0, t_max=3000.0)
    loss = SurfaceLoss(emissivity=0.8, t_surroundings=T_INF)
    times = [
        lumped_heating(mat, 10.0, p, 3000.0, area=0.2, loss=loss, targets=[1200.0]).events[
            "reach 1200 K"
        ]
        for p in (3e4, 4e4, 6e4)
    ]
    assert times[0] > times[1] > times[2]


def test_bad_input_messages():
    mat = Material.constant(specific_heat=500.0, t_min=250.0, t_max=2000.0)
    with pytest.raises(ValueError, match="mass must be > 0"):
        lumped_heating(mat, -1.0, 100.0, 10.0)
    with pytest.raises(ValueError, match="duration must be > 0"):
        lumped_heating(mat, 1.0, 100.0, 0.0)
    with pytest.raises(ValueError, match="t_initial must be an absolute temperature"):
        lumped_heating(mat, 1.0, 100.0, 10.0, t_initial=-20.0)
    with pytest.raises(ValueError, match="area must be >= 0"):
        lumped_heating(mat, 1.0, 100.0, 10.0, area=-1.0)
    with pytest.raises(ValueError, match="loss must be a SurfaceLoss"):
        lumped_heating(mat, 1.0, 100.0, 10.0, loss=5.0)
    with pytest.raises(ValueError, match="power must be finite"):
        lumped_heating(mat, 1.0, np.inf, 10.0)
    with pytest.raises(ValueError, match="targets must be an absolute temperature"):
        lumped_heating(mat, 1.0, 100.0, 10.0, targets=[-5.0])
    with pytest.raises(ValueError, match="stop_at must be an absolute temperature"):
        lumped_heating(mat, 1.0, 100.0, 10.0, stop_at=0.0)
    with pytest.raises(ValueError, match="n_output must be an integer >= 2"):
        lumped_heating(mat, 1.0, 100.0, 10.0, n_output=1)
    with pytest.raises(ValueError, match="enthalpy=.* is outside the range"):
        lumped_heating(mat, 1.0, 1e6, 100.0)  # heats beyond the table
    r = lumped_heating(mat, 1.0, 100.0, 10.0)
    with pytest.raises(ValueError, match="never reached"):
        r.time_to_reach(1500.0)
