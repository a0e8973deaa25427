"""Billet through-heat job against hand calculations and facts of the trade."""

import dataclasses
import warnings

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from heatcalc import em, materials
from heatcalc.jobs.demo import DEMO_INPUTS
from heatcalc.jobs.through_heat import run_through_heat
from heatcalc.units import UnitsError

BASE = DEMO_INPUTS["through-heat"]  # the demo job (heatcalc.jobs.demo)


def run(**changes):
    with warnings.catch_warnings():
        warnings.simplefilter("ignore")
        return run_through_heat(dataclasses.replace(BASE, **changes))


@pytest.fixture(scope="module")
def result():
    return run()


def test_heat_content_against_published_figure(result):
    # Heat content of a medium-carbon steel from 20 to 1200 degC is about 0.215 kWh/kg
    # (774 kJ/kg; BISRA 1953 heat-content tables for 0.4 % C steel, from memory, +-5 %),
    # so 1.5 t/h needs about 322 kW of net heat.
    assert result.net_power == pytest.approx(1500 / 3600 * 774e3, rel=0.05)
    # and the iron figure of CHECKS.md (222 kWh/t to 1200 degC, NIST-JANAF, book) is within
    # a few per cent of the steel's
    assert result.net_power / (1500 / 3600) / 3600 == pytest.approx(222, rel=0.06)


def test_line_kinematics_by_hand(result):
    mass = materials.get("aisi-1045").density(293.15) * 3.141592653589793 * 0.03**2 * 0.15
    assert result.billet_mass == pytest.approx(mass)
    pieces_per_s = (1500 / 3600) / mass
    assert result.pieces_rate == pytest.approx(pieces_per_s)
    assert result.speed == pytest.approx(pieces_per_s * 0.15)
    assert result.line_length == pytest.approx(result.speed * result.heating_time)
    assert result.billets_in_coil == pytest.approx(result.heating_time * pieces_per_s)


def test_exit_state_meets_the_targets(result):
    assert result.exit_mean - 273.15 == pytest.approx(1200, abs=3)
    assert result.exit_surface - result.exit_centre <= 80.0 * 1.005
    assert result.all_passed


def test_energy_balance_of_the_line(result):
    # energy in = stored + lost, reported by the transient
    assert abs(result.closure_error) < 1e-6
    # the power absorbed exceeds the heat content delivered by the surface losses (positive)
    assert result.workpiece_power > result.net_power
    assert result.workpiece_power < 1.3 * result.net_power
    # supply power = workpiece power + copper loss (+ margin) in every section
    for c in result.circuits:
        assert c.input_power == pytest.approx(c.workpiece_power + c.copper_loss, rel=1e-9)


def test_frequency_choice_follows_the_through_heating_rule(result):
    # diameter / skin depth above Curie of 3.5-4 or more for efficient through-heating
    # (handbooks of induction heating; common practice): 3 kHz gives 5.96 for 60 mm
    rho = materials.get("aisi-1045").resistivity(1473.15)
    ratio = 0.06 / em.skin_depth(rho, 3e3)
    assert result.frequency == 3e3
    assert ratio > 3.5
    assert 0.06 / em.skin_depth(rho, 1e3) < 3.56  # 1 kHz is below the optimum


def test_curie_transition_shows(result):
    sec = result.sections
    # magnetic in the first section (surface below Curie), non-magnetic after it
    assert sec["surface_mu_r"].iloc[0] > 5
    assert (sec["surface_mu_r"].iloc[1:] == 1.0).all()
    # the magnetic section couples far better (common practice: efficiency drops at Curie)
    assert sec["coil_efficiency"].iloc[0] > sec["coil_efficiency"].iloc[1:].max()
    curie = materials.get("aisi-1045").curie_temperature
    s = result.transient.series["surface"]
    assert s.iloc[0] < curie < s.iloc[-1]


def test_longer_time_gives_smaller_spread():
    short = run(heating_time="110 s")
    long = run(heating_time="220 s")
    assert (long.exit_surface - long.exit_centre) < (short.exit_surface - short.exit_centre)
    assert long.exit_mean == pytest.approx(short.exit_mean, abs=4)


def test_thicker_billet_needs_longer_time(result):
    thick = run(diameter="75 mm", coil_inner_diameter="115 mm")
    assert thick.heating_time > result.heating_time


@pytest.mark.parametrize(
    ("change", "error", "match"),
    [
        ({"throughput": "1.5 m"}, UnitsError, "throughput='1.5 m'.*mass rate"),
        ({"diameter": "60"}, UnitsError, "diameter='60' has no unit"),
        ({"coil_inner_diameter": "50 mm"}, ValueError, "coil_inner_diameter='50 mm' must exceed"),
        ({"section_power_shares": (0.5, 0.5)}, ValueError, "section_power_shares"),
        ({"target_temperature": "1400 degC"}, materials.OutOfRangeError, "aisi-1045"),
        ({"coil_sections": 0}, ValueError, "coil_sections=0"),
        ({"allowed_spread": "-5 K"}, ValueError, "allowed_spread"),
    ],
)
def test_bad_input(change, error, match):
    with pytest.raises(error, match=match):
        run(**change)


@settings(max_examples=4, deadline=None)
@given(st.floats(0.8, 2.0))
def test_more_throughput_needs_more_power(tonnes_per_hour):
    # at a fixed time in the coil, more billets per hour need proportionally more power
    low = run(throughput=f"{tonnes_per_hour} t/h", heating_time="150 s")
    high = run(throughput=f"{tonnes_per_hour * 1.25} t/h", heating_time="150 s")
    assert high.workpiece_power > low.workpiece_power
    assert high.net_power == pytest.approx(1.25 * low.net_power, rel=1e-9)
