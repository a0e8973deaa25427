"""Frequency choice: relative-power optima, rule bands, sweeps, ranking and the plot helper."""

import matplotlib
import numpy as np
import pytest
from coil_cases import RHO_HOT_STEEL, billet_coil, delta, hot_billet, plate, steel_tube
from matplotlib.figure import Figure
from scipy import special
from scipy.optimize import minimize_scalar

from heatcalc.coil import (
    FrequencyBand,
    RectangularSolenoidCoil,
    frequency_band,
    frequency_sweep,
    heating_rule,
    plot_frequency_sweep,
    rank_frequencies,
    relative_power_optimum,
)


def kelvin_p(m):
    """P(m) = sqrt(2) (ber ber' + bei bei') / (ber^2 + bei^2), m = sqrt(2) a / delta
    (CHECKS.md; Davies, Conduction and Induction Heating, 1990)."""
    b, i = special.ber(m), special.bei(m)
    bp, ip = special.berp(m), special.beip(m)
    return np.sqrt(2.0) * (b * bp + i * ip) / (b * b + i * i)


def slab_f(x):
    """F(x) = (sinh x - sin x)/(cosh x + cos x), x = d/delta (Davies 1990; CHECKS.md)."""
    return (np.sinh(x) - np.sin(x)) / (np.cosh(x) + np.cos(x))


def test_cylinder_optimum_is_d_over_delta_3_56():
    # CHECKS.md: P(m)/m peaks at D/delta = 3.56 (handbooks of induction heating)
    opt = relative_power_optimum("cylinder")
    assert opt == pytest.approx(3.56, abs=5e-3)
    # independent route with the Kelvin-function form; P(m)/m with m = sqrt(2) a/delta,
    # so D/delta = sqrt(2) m at the optimum
    res = minimize_scalar(
        lambda m: -kelvin_p(m) / m, bounds=(1.0, 5.0), method="bounded", options={"xatol": 1e-10}
    )
    assert opt == pytest.approx(np.sqrt(2.0) * res.x, rel=1e-6)


def test_slab_optimum_against_f_of_x():
    res = minimize_scalar(
        lambda x: -slab_f(x) / x, bounds=(0.5, 6.0), method="bounded", options={"xatol": 1e-10}
    )
    assert relative_power_optimum("slab") == pytest.approx(res.x, rel=1e-6)


def test_tube_optimum_limits():
    # a vanishing bore gives the solid-cylinder optimum 3.56 (CHECKS.md)
    assert relative_power_optimum("tube", 1e-4) == pytest.approx(
        relative_power_optimum("cylinder"), rel=1e-6
    )
    # thin wall: shorted-turn view of the wall, current K = j w tau H_in with
    # tau = mu_0 a t/(2 rho) and power per length ~ rho (w tau)^2/(1 + (w tau)^2); at fixed
    # field and frequency it peaks (over rho) at w tau = 1, i.e. a t/delta^2 = 1
    # (derived here from Faraday's law; Davies 1990, thin tubular load)
    for t_over_a in (1e-3, 3e-3):
        d_opt = relative_power_optimum("tube", 1.0 - t_over_a)
        assert (d_opt / 2.0) ** 2 * t_over_a == pytest.approx(1.0, abs=3 * t_over_a)


def test_rules_for_each_workpiece_and_purpose():
    bar = heating_rule(hot_billet())
    assert bar.quantity == "diameter / skin depth"
    assert bar.low == pytest.approx(3.5567, abs=1e-3) and bar.high == pytest.approx(2 * bar.low)
    assert heating_rule(plate()).quantity == "thickness / skin depth"
    tube = heating_rule(steel_tube())
    assert tube.quantity == "wall / skin depth" and tube.high == pytest.approx(2 * tube.low)
    # 60 x 5 mm tube: outer D/delta at the optimum converted to wall/delta
    d_opt = relative_power_optimum("tube", 0.025 / 0.03)
    assert tube.low == pytest.approx(d_opt * 0.005 / 0.06, rel=1e-12)
    hard = heating_rule(hot_billet(), "surface_hardening", case_depth=2e-3)
    assert hard.skin_depth_range() == pytest.approx((2e-3 * 2 / 3, 3e-3))
    user = heating_rule(hot_billet(), low=4.0, high=8.0)
    assert (user.low, user.high) == (4.0, 8.0) and "user" in user.reason


def test_frequency_band_edges_give_the_rule_ratios():
    bar = hot_billet()
    for rule in (heating_rule(bar), heating_rule(bar, "surface_hardening", case_depth=1.5e-3)):
        band = frequency_band(bar, rule)
        assert isinstance(band, FrequencyBand) and band.low < band.high
        r_low = float(rule.ratio(delta(RHO_HOT_STEEL, band.low)))
        r_high = float(rule.ratio(delta(RHO_HOT_STEEL, band.high)))
        assert sorted([r_low, r_high]) == pytest.approx([rule.low, rule.high], rel=1e-12)


def test_through_heating_band_for_a_100_mm_hot_billet():
    # D/delta 3.56-7.11 for D = 100 mm hot steel (rho 1.2e-6): f = rho (D/ratio)^-2/(pi mu_0),
    # about 0.38-1.5 kHz: within the mains-to-few-kHz range used for billets of that size
    # (common practice, no source).
    band = frequency_band(hot_billet(), heating_rule(hot_billet()))
    assert 300.0 < band.low < 450.0 and 1.3e3 < band.high < 1.8e3


def test_sweep_columns_and_trends():
    f = np.logspace(1.5, 5, 60)
    table = frequency_sweep(billet_coil(), hot_billet(), f)
    assert list(table.columns) == [
        "frequency",
        "skin_depth",
        "ratio",
        "in_band",
        "efficiency",
        "power_factor",
        "resistance",
        "reactance",
        "relative_power",
    ]
    assert table.attrs["ratio"] == "diameter / skin depth"
    assert table["relative_power"].max() == pytest.approx(1.0)
    assert np.all((table["efficiency"] > 0) & (table["efficiency"] < 1))
    # ratio grows as sqrt(f)
    assert np.allclose(table["ratio"] / np.sqrt(f), table["ratio"].iloc[0] / np.sqrt(f[0]))
    # below the band efficiency falls steeply as frequency falls (trade: D/delta >= 3.5)
    low = table[table["ratio"] < 3.0]
    assert np.all(np.diff(low["efficiency"]) > 0)
    assert low["efficiency"].iloc[0] < 0.5 * table["efficiency"].max()
    in_band = table["in_band"].to_numpy()
    assert np.array_equal(in_band, (table["ratio"] >= 3.5567454) & (table["ratio"] <= 7.11349))


def test_rank_available_frequencies():
    available = [50.0, 500.0, 1e3, 3e3, 10e3]
    table = rank_frequencies(billet_coil(), hot_billet(), available)
    assert list(table["rank"]) == [1, 2, 3, 4, 5]
    in_band = table[table["in_band"]]
    assert set(in_band["frequency"]) == {500.0, 1e3}
    # in-band first, best efficiency first
    assert list(table["frequency"][:2]) == [1e3, 500.0]
    # then out of band by distance from the band
    assert list(table["band_distance"][2:]) == sorted(table["band_distance"][2:])
    assert "below the band" in table.loc[table["frequency"] == 50.0, "reason"].item()
    assert "above the band" in table.loc[table["frequency"] == 10e3, "reason"].item()


def test_plot_returns_figure_without_pyplot():
    import matplotlib.pyplot as plt

    before = plt.get_fignums()
    table = frequency_sweep(billet_coil(), hot_billet(), np.logspace(2, 4.5, 40))
    band = frequency_band(hot_billet(), heating_rule(hot_billet()))
    fig = plot_frequency_sweep(table, band)
    assert isinstance(fig, Figure)
    assert plt.get_fignums() == before  # not registered with pyplot, never shown
    assert len(fig.axes) == 2
    assert matplotlib.get_backend()  # drawing works off-screen
    fig.canvas.draw()


def test_plate_sweep_in_rectangular_coil():
    from coil_cases import RHO_COPPER, TUBE_20x12

    coil = RectangularSolenoidCoil(10, 0.5, 0.4, 0.08, TUBE_20x12, RHO_COPPER)
    table = frequency_sweep(coil, plate(), np.array([100.0, 1e3, 1e4]), method="long_coil")
    assert table.attrs["ratio"] == "thickness / skin depth"
    assert np.all(np.diff(table["efficiency"]) > 0)


def test_frequency_functions_reject_bad_input():
    coil, bar = billet_coil(), hot_billet()
    with pytest.raises(ValueError, match="purpose must be one of"):
        heating_rule(bar, "annealing")
    with pytest.raises(ValueError, match="case_depth must be given"):
        heating_rule(bar, "surface_hardening")
    with pytest.raises(ValueError, match="case_depth must be > 0"):
        heating_rule(bar, "surface_hardening", case_depth=-1e-3)
    with pytest.raises(ValueError, match="low must be < high"):
        heating_rule(bar, low=5.0, high=4.0)
    with pytest.raises(ValueError, match="high must be > 0"):
        heating_rule(bar, high=-4.0)
    with pytest.raises(ValueError, match="workpiece must be a CylinderWorkpiece"):
        heating_rule("bar")
    with pytest.raises(ValueError, match="shape must be one of"):
        relative_power_optimum("sphere")
    with pytest.raises(ValueError, match="inner_to_outer must be given"):
        relative_power_optimum("tube")
    with pytest.raises(ValueError, match="inner_to_outer must be < 1"):
        relative_power_optimum("tube", 1.0)
    with pytest.raises(ValueError, match="mu_r must be >= 1"):
        relative_power_optimum("tube", 0.5, mu_r=0.5)
    with pytest.raises(ValueError, match="frequencies must be > 0"):
        frequency_sweep(coil, bar, [0.0, 1e3])
    with pytest.raises(ValueError, match="frequencies must be a non-empty one-dimensional"):
        frequency_sweep(coil, bar, [[1e3, 2e3]])
    with pytest.raises(ValueError, match="rule must be a HeatingRule"):
        frequency_sweep(coil, bar, [1e3], rule="through")
    with pytest.raises(ValueError, match="rule must be a HeatingRule"):
        frequency_band(bar, None)
    with pytest.raises(ValueError, match="table must be a frequency_sweep table"):
        plot_frequency_sweep({"frequency": [1.0]})
