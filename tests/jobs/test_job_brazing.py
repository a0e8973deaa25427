"""Brazing job (tube into fitting) against hand calculations, exact solutions and the trade."""

import dataclasses
import math
import warnings

import mpmath as mp
import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st
from scipy.constants import mu_0, pi
from scipy.special import ellipe, ellipk, erf

from heatcalc import coil as hcoil
from heatcalc import em, materials
from heatcalc.jobs._joint_field import (
    GAP_RESISTIVITY,
    JointGeometry,
    JointPowerTable,
    composite_power_split,
)
from heatcalc.jobs._two_parts import Fin, Lump, infinite_fin_heat_flow, simulate_two_parts
from heatcalc.jobs.brazing import _UNITS, DESCRIPTIONS, BrazingInputs, run_brazing
from heatcalc.jobs.demo import DEMO_INPUTS
from heatcalc.materials import Material
from heatcalc.thermal import SurfaceLoss, natural_convection_coefficient, radiation_loss
from heatcalc.units import UnitsError

# Copper tube 22 x 1.0 mm in a brass socket OD 28 mm, 20 mm overlap (the demo joint).
BASE = DEMO_INPUTS["braze"]  # the demo job (heatcalc.jobs.demo)
DEMO_GEOMETRY = JointGeometry(10e-3, 11e-3, 11.05e-3, 14e-3, 20e-3)


def run(**changes):
    with warnings.catch_warnings():
        warnings.simplefilter("ignore")
        return run_brazing(dataclasses.replace(BASE, **changes))


@pytest.fixture(scope="module")
def result():
    return run()


# -- exact solution of the composite wall, written here from first principles ----------------
def exact_split(g, rho_f, rho_t, f):
    """Power per unit outer area in fitting and tube, and Z_s, by Bessel functions (mpmath).

    In each wall H = A I0(a r) + B K0(a r), a = sqrt(j omega mu0 / rho) (Abramowitz & Stegun
    9.6; the axial-field diffusion equation of Davies, Conduction and Induction Heating, 1990).
    Faraday's law round a circle of radius r with J = -dH/dr, E = rho J gives
    rho H'(r) r = j omega mu0 int_0^r H r' dr', hence: at the empty bore b,
    rho H'(b) = j omega mu0 b H(b) / 2; across the non-conducting clearance c..d (H uniform),
    d rho_f H'(d) = c rho_t H'(c) + j omega mu0 H(c) (d^2 - c^2) / 2; H(c) = H(d); H(e) = 1.
    Power into a wall per unit outer area: [Re(rho H' conj(H)) r] across it, divided by e.
    """
    mp.mp.dps = 30
    w, m0 = 2 * mp.pi * f, mp.mpf(mu_0)
    a_t, a_f = mp.sqrt(1j * w * m0 / rho_t), mp.sqrt(1j * w * m0 / rho_f)
    b, c, d, e = (mp.mpf(x) for x in (g.tube_inner_radius, g.tube_outer_radius,
                                      g.fitting_inner_radius, g.fitting_outer_radius))  # fmt: skip

    def h(a, r):
        return [mp.besseli(0, a * r), mp.besselk(0, a * r)]

    def dh(a, r):
        return [a * mp.besseli(1, a * r), -a * mp.besselk(1, a * r)]

    m = mp.matrix(4, 4)
    k_gap = 1j * w * m0 * (d**2 - c**2) / 2
    for col in range(2):
        m[0, col] = rho_t * dh(a_t, b)[col] - 1j * w * m0 * b / 2 * h(a_t, b)[col]
        m[1, col], m[1, col + 2] = -h(a_t, c)[col], h(a_f, d)[col]
        m[2, col] = -c * rho_t * dh(a_t, c)[col] - k_gap * h(a_t, c)[col]
        m[2, col + 2] = d * rho_f * dh(a_f, d)[col]
        m[3, col + 2] = h(a_f, e)[col]
    x = mp.lu_solve(m, mp.matrix([0, 0, 0, 1]))

    def flux(rho, a, coef, r):
        hh = coef[0] * h(a, r)[0] + coef[1] * h(a, r)[1]
        dd = coef[0] * dh(a, r)[0] + coef[1] * dh(a, r)[1]
        return mp.re(rho * dd * mp.conj(hh)) * r / e, rho * dd / hh

    p_t = flux(rho_t, a_t, x[0:2], c)[0]  # the bore term is purely reactive
    out, z_s = flux(rho_f, a_f, x[2:4], e)
    p_f = out - flux(rho_f, a_f, x[2:4], d)[0]
    return float(p_f), float(p_t), complex(z_s)


@pytest.mark.parametrize("frequency", [1e3, 10e3, 30e3])
def test_power_split_against_exact_two_layer_solution(frequency):
    rho_f, rho_t = 14e-8, 5e-8  # brass and copper near 680 degC (order of the data files)
    p_f, p_t, z_s = exact_split(DEMO_GEOMETRY, rho_f, rho_t, frequency)
    s = composite_power_split(DEMO_GEOMETRY, rho_f, rho_t, frequency)
    total = p_f + p_t
    assert s.fitting_power_per_area == pytest.approx(p_f, rel=5e-4)
    assert abs(s.tube_power_per_area - p_t) < 1e-4 * total
    assert s.surface_impedance == pytest.approx(z_s, rel=5e-4)


def test_single_material_wall_is_the_analytic_tube():
    # both layers copper, no clearance: a plain tube 28 mm x 4 mm (analytic Bessel solution,
    # heatcalc.em.tube, itself checked against Davies 1990 and mpmath in tests/em)
    g = JointGeometry(10e-3, 11e-3, 11e-3, 14e-3, 20e-3)
    rho = 5e-8
    for f in (3e3, 30e3):
        s = composite_power_split(g, rho, rho, f)
        total = float(em.tube_power_per_area(1.0, 14e-3, 10e-3, rho, f))
        assert s.power_per_area == pytest.approx(total, rel=5e-4)
        # the inner layer's share: integral of rho |J|^2 2 pi r dr over 10-11 mm
        r = np.linspace(10e-3, 11e-3, 2001)
        pd_ = em.tube_power_density(r, 1.0, 14e-3, 10e-3, rho, f)
        inner = np.trapezoid(pd_ * r, r) / 14e-3
        assert abs(s.tube_power_per_area - inner) < 2e-3 * max(inner, 0.01 * total)
        assert s.gap_power_per_area == 0.0


def test_power_split_converges_at_second_order():
    p_f, p_t, _ = exact_split(DEMO_GEOMETRY, 14e-8, 5e-8, 10e3)
    sizes, errors = [], []
    for k in (1, 2, 4, 8):
        s = composite_power_split(
            DEMO_GEOMETRY, 14e-8, 5e-8, 10e3,
            n_fitting=20 * k + 1, n_tube=10 * k + 1, surface_fraction=0.16 / k,
        )  # fmt: skip
        sizes.append(1.0 / k)
        errors.append(abs(s.fitting_power_per_area - p_f) + abs(s.tube_power_per_area - p_t))
    order = np.polyfit(np.log(sizes), np.log(errors), 1)[0]
    assert 1.8 < order < 2.2  # linear elements: second order (Hughes 1987, ch. 1)


def test_power_table_interpolation_is_accurate():
    # the transient reads the split from a table over the two temperatures: compare with the
    # direct solution half-way between the grid points (the worst place for bilinear)
    cu, brass = materials.get("cu-etp"), materials.get("brass-c26000")
    conductor = hcoil.RoundTube(6e-3, 1e-3)
    coil = hcoil.SolenoidCoil(4, 0.030, 0.040, conductor, 1.9e-8)
    wp = hcoil.TubeWorkpiece(14e-3, 10e-3, 0.020, 1.4e-7)
    table = JointPowerTable(DEMO_GEOMETRY, brass, cu, 10e3, coil, wp, "coil", 293.15,
                            (1123.15, 1338.15))  # fmt: skip
    table.set_power(1.0)
    for t_f, t_t in (
        (0.5 * (table.tf[3] + table.tf[4]), 0.5 * (table.tt[2] + table.tt[3])),
        (0.5 * (table.tf[9] + table.tf[10]), 0.5 * (table.tt[7] + table.tt[8])),
    ):
        direct = table.state(t_f, t_t)
        assert table.fitting_share(t_f, t_t) == pytest.approx(direct.fitting_share, rel=1e-3)
        eta = float(table.efficiency(direct.surface_impedance))
        assert table.coil_efficiency(t_f, t_t) == pytest.approx(eta, rel=1e-3)
        p_f, p_t = table(t_f, t_t)
        assert p_f + p_t == pytest.approx(table.coil_efficiency(t_f, t_t))


def test_clearance_element_dissipates_nothing():
    # the gap element of GAP_RESISTIVITY stands for a non-conductor: its share must vanish
    for f in (1e3, 10e3, 200e3):
        s = composite_power_split(DEMO_GEOMETRY, 14e-8, 5e-8, f)
        assert s.gap_power_per_area < 1e-8 * s.power_per_area
    assert GAP_RESISTIVITY >= 1.0


def test_higher_frequency_concentrates_power_in_the_fitting():
    # the outer fitting shields the tube at high frequency (common practice, no source)
    shares = [
        composite_power_split(DEMO_GEOMETRY, 14e-8, 5e-8, f).fitting_share
        for f in (1e3, 3e3, 10e3, 30e3, 100e3)
    ]
    assert np.all(np.diff(shares) > 0)
    assert shares[0] < 0.8 and shares[-1] > 0.999


# -- two lumps and fins against exact solutions --------------------------------------------
def constant(key, k, c, rho, resistivity=3e-8):
    return Material.constant(
        key, thermal_conductivity=k, specific_heat=c, density=rho, resistivity=resistivity,
        t_min=200.0, t_max=2000.0,
    )  # fmt: skip


def test_two_lumps_exact_solution_without_losses():
    # Two capacities C_f, C_t, constant powers P_f, P_t, conductance G, no losses:
    #   C_f T_f' = P_f - G D,  C_t T_t' = P_t + G D,  D = T_f - T_t.
    # Subtracting the equations divided by their C: D' = P_f/C_f - P_t/C_t - lam D with
    # lam = G (1/C_f + 1/C_t), so D(t) = D_inf (1 - exp(-lam t)), D_inf = (P_f/C_f -
    # P_t/C_t) / lam; adding them: C_f T_f + C_t T_t = (C_f + C_t) T_0 + (P_f + P_t) t.
    m_f, m_t, c_f, c_t, g = 0.04, 0.012, 380.0, 420.0, 6.0
    fit = Lump(constant("f", 120.0, c_f, 8500.0), m_f)
    tube = Lump(constant("t", 390.0, c_t, 8900.0), m_t)
    p_f, p_t = 900.0, 100.0
    r = simulate_two_parts(fit, tube, g, lambda a, b: (p_f, p_t), 12.0, t_initial=300.0,
                           rtol=1e-9)  # fmt: skip
    t = r.series.index.to_numpy()
    cf, ct = m_f * c_f, m_t * c_t
    lam = g * (1 / cf + 1 / ct)
    d_exact = (p_f / cf - p_t / ct) / lam * (1 - np.exp(-lam * t))
    d = (r.series["fitting"] - r.series["tube"]).to_numpy()
    assert np.max(np.abs(d - d_exact)) < 2e-5 * d_exact.max()
    mean = cf * r.series["fitting"] + ct * r.series["tube"]
    assert np.allclose(mean, (cf + ct) * 300.0 + (p_f + p_t) * t, rtol=1e-7)
    assert abs(r.closure_error) < 1e-8


def fin_base_flow_exact(k, area, perimeter, h, alpha, theta, t):
    """Heat into a semi-infinite rod with side loss h after a step theta of its base.

    theta_t = alpha theta_xx - alpha m^2 theta, m^2 = h P / (k A); Laplace transform:
    q(s) = k A theta / s sqrt((s + beta)/alpha), beta = alpha m^2, whose inverse is
    q(t) = k A theta [m erf(m sqrt(alpha t)) + exp(-beta t) / sqrt(pi alpha t)].
    Limits: k A theta / sqrt(pi alpha t) for a semi-infinite solid (Incropera & DeWitt 2007,
    eq. 5.58) and sqrt(h P k A) theta for the steady infinite fin (Table 3.4 case D).
    """
    m = math.sqrt(h * perimeter / (k * area))
    return (
        k
        * area
        * theta
        * (m * erf(m * np.sqrt(alpha * t)) + np.exp(-m * m * alpha * t) / np.sqrt(pi * alpha * t))
    )


def fin_case(first=5e-4, growth=1.15, duration=60.0, model="transient"):
    k, c, rho, h = 400.0, 400.0, 8900.0, 20.0
    area, perimeter = pi * (0.011**2 - 0.010**2), 2 * pi * 0.011
    loss = SurfaceLoss(emissivity=0.0, t_surroundings=300.0, h_convection=h)
    base = Lump(constant("rod", k, c, rho), 1e9, fin=Fin(area, perimeter, loss))  # held at T_b
    other = Lump(constant("other", k, c, rho), 1.0)
    r = simulate_two_parts(
        base, other, 0.0, lambda a, b: (0.0, 0.0), duration, t_initial=800.0, fin_initial=300.0,
        fin_model=model, fin_first_cell=first, fin_growth=growth, fin_length=1.0, n_output=61,
        rtol=1e-9,
    )  # fmt: skip
    return r, (k, area, perimeter, h, k / (rho * c), 500.0)


def test_transient_fin_against_exact_solution_and_its_convergence():
    errors = []
    for j in range(4):
        r, args = fin_case(first=4e-3 / 2**j, growth=1.2 ** (1 / 2**j))
        s = r.series
        err = [
            abs(np.interp(t, s.index, s["conduction_fitting"]) / fin_base_flow_exact(*args, t) - 1)
            for t in (5.0, 20.0, 60.0)
        ]
        errors.append(max(err))
    assert errors[-1] < 1e-4
    order = np.polyfit(np.log([2.0**-j for j in range(4)]), np.log(errors), 1)[0]
    assert 1.7 < order < 2.3  # finite volumes: second order in the cell size


def test_steady_fin_is_the_infinite_fin_and_the_transient_tends_to_it():
    # Incropera & DeWitt 2007, Table 3.4 case D: q = sqrt(h P k A) theta_b
    k, area, perimeter, h, alpha, theta = fin_case(duration=1.0)[1]
    steady = math.sqrt(h * perimeter * k * area) * theta
    assert infinite_fin_heat_flow(h, perimeter, k, area, theta) == pytest.approx(steady)
    r, _ = fin_case(duration=1.0, model="steady")
    assert r.series["conduction_fitting"].iloc[-1] == pytest.approx(steady, rel=1e-6)
    long, _ = fin_case(duration=1500.0, growth=1.1)
    assert long.series["conduction_fitting"].iloc[-1] == pytest.approx(steady, rel=0.01)


# -- the job: hand calculations ---------------------------------------------------------------
def test_joint_geometry_and_masses_by_hand(result):
    g = result.geometry
    assert (g.tube_inner_radius, g.tube_outer_radius) == pytest.approx((10e-3, 11e-3))
    assert g.fitting_inner_radius == pytest.approx(11.05e-3)  # bore = 22 mm + 0.1 mm clearance
    cu, brass = materials.get("cu-etp"), materials.get("brass-c26000")
    m_t = cu.density(293.15) * pi * (0.011**2 - 0.010**2) * 0.020
    m_f = brass.density(293.15) * pi * (0.014**2 - 0.01105**2) * 0.020
    assert result.tube_mass == pytest.approx(m_t)
    assert result.fitting_mass == pytest.approx(m_f)
    # coil: 4 turns of 6 mm tube with 1.5 mm between turns, 30 mm long, 40 mm bore: Nagaoka's
    # coefficient from complete elliptic integrals (Nagaoka 1909; CHECKS.md), m = k^2
    d, length = 0.040, 4 * (6e-3 + 1.5e-3)
    k2 = d**2 / (d**2 + length**2)
    k, kp = math.sqrt(k2), math.sqrt(1 - k2)
    big_k, big_e = ellipk(k2), ellipe(k2)
    nagaoka = 4 / (3 * pi * kp) * ((kp**2 / k2) * (big_k - big_e) + big_e - k)
    assert result.circuit.impedance.nagaoka_coefficient == pytest.approx(nagaoka, rel=1e-6)


@pytest.fixture(scope="module")
def constant_job():
    # constant properties, no radiation, no conduction along the parts: only natural
    # convection from the fitting is left
    tube = constant("tube-c", 390.0, 420.0, 8900.0, resistivity=5e-8)
    fitting = constant("fitting-c", 120.0, 380.0, 8500.0, resistivity=14e-8)
    return run(
        tube_material=tube, fitting_material=fitting, tube_surface=0.0, fitting_surface=0.0,
        tube_conduction=False, fitting_conduction=False, power="1500 W",
        power_basis="absorbed",
    )  # fmt: skip


def test_energy_and_time_by_hand_for_constant_properties(constant_job):
    r = constant_job
    m_t = 8900.0 * pi * (0.011**2 - 0.010**2) * 0.020
    m_f = 8500.0 * pi * (0.014**2 - 0.01105**2) * 0.020
    t0 = 293.15
    energy = m_f * 380.0 * (r.end_fitting - t0) + m_t * 420.0 * (r.end_tube - t0)  # sum m c dT
    assert r.heat_energy == pytest.approx(energy, rel=1e-9)
    # time = energy / net power; the only loss is natural convection from the fitting, below
    # 25 W/(m2 K) for a small hot cylinder in still air (Incropera & DeWitt 2007, Table 1.1:
    # free convection of gases 2-25 W/(m2 K), from memory)
    area = 2 * pi * 0.014 * 0.020
    worst = 25.0 * area * (r.max_fitting - 298.15)
    assert energy / 1500.0 < r.heat_time < energy / (1500.0 - worst)
    # constant resistivities: constant power split
    heat = r.series[r.series["phase"] == "heat"]
    assert np.ptp(heat["power_fitting"]) < 1e-9 * 1500.0
    assert (heat["power_fitting"] + heat["power_tube"]).iloc[-1] == pytest.approx(1500.0)
    assert r.brazing_temperature == pytest.approx(r.end_tube, abs=1e-3)


def test_energy_balance_closes(result):
    run_ = result.run
    assert abs(result.closure_error) < 1e-6
    assert run_.energy_in == pytest.approx(run_.energy_lost + run_.energy_stored, rel=1e-6)
    # the heat stored at the end of heating is what the parts hold at their end temperatures
    assert 0 < result.heat_energy < run_.energy_in


def test_hand_check_of_the_time_reproduces_the_model(result):
    heat = result.series[result.series["phase"] == "heat"]
    t = heat.index.to_numpy()
    gain = heat["power_fitting"] + heat["power_tube"]
    leave = heat["surface_loss"] + heat["conduction_fitting"] + heat["conduction_tube"]
    # E = integral of (P - heat leaving the joint) dt, trapezoid on the output times
    assert np.trapezoid(gain - leave, t) == pytest.approx(result.heat_energy, rel=2e-3)


def test_skin_depth_and_wall_ratio_by_hand(result):
    rho = materials.get("brass-c26000").resistivity(result.brazing_temperature)
    # delta = 503 sqrt(rho / f) m (1/sqrt(pi mu0) = 503.3; CHECKS.md)
    delta = 503.3 * math.sqrt(rho / 10e3)
    assert result.fitting_skin_depth == pytest.approx(delta, rel=1e-3)
    row = result.frequency_table.set_index("frequency").loc[10e3]
    assert row["wall_to_skin_depth"] == pytest.approx(2.95e-3 / delta, rel=1e-3)


def test_conduction_along_the_tube_exceeds_the_steady_fin_during_a_short_heat(result):
    # Incropera & DeWitt 2007, Table 3.4 case D with h = radiation + Churchill-Chu convection
    cu = materials.get("cu-etp")
    t = result.end_tube
    eps = cu.emissivity("oxidised")
    h = float(radiation_loss(t, 298.15, eps)) / (t - 298.15) + float(
        natural_convection_coefficient(t, 298.15, 0.022)
    )
    area, perimeter = pi * (0.011**2 - 0.010**2), 2 * pi * 0.011
    steady = math.sqrt(h * perimeter * float(cu.thermal_conductivity(t)) * area) * (t - 298.15)
    heat = result.series[result.series["phase"] == "heat"]
    # the copper next to the joint still stores heat: more than the steady fin carries, and
    # less than the semi-infinite solid bound k A theta / sqrt(pi alpha t) (eq. 5.58)
    assert heat["conduction_tube"].iloc[-1] > steady
    alpha = 390.0 / (8900.0 * 400.0)
    bound = 390.0 * area * (t - 293.15) / math.sqrt(pi * alpha * 1.0)
    assert heat["conduction_tube"].iloc[-1] < bound
    steady_job = run(fin_model="steady")
    end = steady_job.series[steady_job.series["phase"] == "heat"]
    h2 = float(radiation_loss(steady_job.end_tube, 298.15, eps)) / (
        steady_job.end_tube - 298.15
    ) + float(natural_convection_coefficient(steady_job.end_tube, 298.15, 0.022))
    k = float(cu.thermal_conductivity(steady_job.end_tube))
    fin = math.sqrt(h2 * perimeter * k * area) * (steady_job.end_tube - 298.15)
    assert end["conduction_tube"].iloc[-1] == pytest.approx(fin, rel=2e-3)
    assert steady_job.heat_time < result.heat_time  # storage in the tube is left out


# -- the job: filler data and temperatures -----------------------------------------------------
def test_filler_range_from_aws_a58(result):
    # AWS A5.8 BAg-7: solidus 1145 degF, liquidus 1205 degF, brazing range 1205-1400 degF
    # (618 / 652 / 652-760 degC; AWS A5.8/A5.8M, from memory)
    def f_to_k(x):
        return (x - 32) * 5 / 9 + 273.15

    assert result.brazing_range == pytest.approx((f_to_k(1205), f_to_k(1400)), abs=1e-6)
    assert result.filler_liquidus == pytest.approx(f_to_k(1205))
    assert result.filler_solidus == pytest.approx(f_to_k(1145))
    # default target: liquidus + 30 K (common practice, no source)
    assert result.brazing_temperature == pytest.approx(f_to_k(1205) + 30.0)


def test_wide_range_filler_defaults_to_the_middle_of_its_range():
    # AWS A5.8 BCuP-5: liquidus 1475 degF (802 degC), range 1300-1500 degF (704-816 degC);
    # liquidus + 30 K lies above the range, so the default is its middle (from memory)
    r = run(filler="bcup-5", power="6 kW")
    lo, hi = (1300 - 32) * 5 / 9 + 273.15, (1500 - 32) * 5 / 9 + 273.15
    assert r.brazing_temperature == pytest.approx(0.5 * (lo + hi))


def test_demo_joint_meets_its_limits(result):
    assert result.target_reached
    assert result.end_tube == pytest.approx(result.brazing_temperature, abs=0.01)
    assert result.end_fitting > result.end_tube  # heated from outside
    assert result.max_fitting <= result.brazing_range[1]
    assert result.time_to_range < result.heat_time
    assert result.time_in_range > 0
    assert result.all_passed, result.checks_frame()
    # frequency: 10 kHz puts the 2.95 mm brass wall at wall / skin depth 1.57 (band 1-2)
    assert result.frequency == 10e3
    # supply: power at the coil = workpiece + copper; rating = (1 + margin) x that
    c = result.circuit
    assert c.input_power == pytest.approx(5e3, rel=1e-3)
    assert result.rating.power_rating == pytest.approx(1.1 * c.input_power)


def test_too_much_power_overheats_the_fitting():
    # 10 kW at the coil leaves the tube behind: the brass passes the top of the brazing range
    r = run(power="10 kW")
    names = {c.name: c.passed for c in r.checks}
    assert not names["highest temperature within the filler's brazing range"]
    assert r.warnings


# -- the job: facts of the trade and trends -----------------------------------------------------
def test_low_frequency_couples_poorly_and_high_frequency_heats_the_fitting():
    r = run(frequency_options=("1 kHz", "3 kHz", "10 kHz", "100 kHz"))
    t = r.frequency_table.sort_values("frequency")
    # a thin copper-alloy joint at low frequency is poorly coupled (common practice, no source)
    assert t["efficiency"].iloc[0] < 0.6 * t["efficiency"].iloc[-1]
    assert t["fitting_share"].is_monotonic_increasing
    assert t["wall_to_skin_depth"].is_monotonic_increasing


def test_magnetic_steel_fitting_couples_better_than_brass(result):
    # a steel part below its Curie temperature couples far better than copper alloys
    # (common practice, no source)
    steel = run(fitting_material="aisi-1045")
    assert steel.circuit.efficiency > result.circuit.efficiency
    assert steel.fitting_share_start > result.fitting_share_start
    assert steel.target_reached
    # steel conducts ten times worse than copper alloys: the lumped model is stretched, and
    # says so (Bi = h wall / k > 0.1, Incropera & DeWitt 2007, eq. 5.10)
    k = float(materials.get("aisi-1045").thermal_conductivity(steel.brazing_temperature))
    joint_part = 5000.0 * 2.95e-3 / k  # joint conductance across the fitting wall
    assert joint_part < steel.biot < 1.03 * joint_part  # plus the small surface-loss part
    assert any("Biot" in w for w in steel.warnings)


@settings(max_examples=4, deadline=None)
@given(st.floats(3.0, 7.0))
def test_more_power_shorter_time(kw):
    slow = run(power=f"{kw} kW")
    fast = run(power=f"{1.25 * kw} kW")
    assert fast.heat_time < slow.heat_time
    assert fast.end_difference > slow.end_difference  # faster heating, larger lag


@pytest.mark.parametrize("outer", ["30 mm", "33 mm"])
def test_thicker_fitting_wall_takes_longer(result, outer):
    thick = run(fitting_outer_diameter=outer)
    assert thick.heat_time > result.heat_time


def test_given_time_round_trip(result):
    back = run(power=None, heat_time=f"{result.heat_time} s")
    assert back.power == pytest.approx(5e3, rel=1e-4)
    assert back.heat_time == pytest.approx(result.heat_time, rel=1e-4)


def test_inputs_are_described_and_echoed(result):
    names = {f.name for f in dataclasses.fields(BrazingInputs)}
    assert set(DESCRIPTIONS) == names
    assert set(_UNITS) <= names
    frame = BASE.to_frame()
    assert frame.set_index("input").loc["power", "value"] == "5 kW"
    summary = result.summary().set_index("quantity")["value"]
    assert summary["power at the coil terminals"] == "5.00 kW"
    assert summary["both parts at the brazing temperature"] == "yes"
    assert {"fitting", "tube", "power_fitting", "power_tube", "losses"} <= set(result.series)
    assert len(result.hand_checks) >= 5 and result.sources and result.assumptions


# -- bad input -----------------------------------------------------------------------------------
@pytest.mark.parametrize(
    ("change", "error", "match"),
    [
        ({"tube_wall": 1.0}, UnitsError, "tube_wall=1.0 has no unit"),
        ({"overlap_length": "20 kg"}, UnitsError, "overlap_length='20 kg'.*expected"),
        (
            {"brazing_temperature": "800 degC"},
            ValueError,
            "brazing_temperature='800 degC'.*outside",
        ),
        ({"joint_clearance": "-0.1 mm"}, ValueError, "joint_clearance"),
        ({"fitting_outer_diameter": "22 mm"}, ValueError, "fitting_outer_diameter='22 mm'"),
        ({"filler": "bag-99"}, ValueError, "filler='bag-99' is not in the material library"),
        ({"filler": "cu-etp"}, ValueError, "filler='cu-etp' has no brazing range"),
        ({"tube_material": "copper"}, ValueError, "tube_material='copper'"),
        ({"heat_time": "20 s"}, ValueError, "exactly one of power and heat_time"),
        ({"coil_inner_diameter": "28 mm"}, ValueError, "coil_inner_diameter='28 mm'"),
        ({"power_basis": "mains"}, ValueError, "power_basis='mains'"),
        ({"fin_model": "exact"}, ValueError, "fin_model='exact'"),
        ({"fitting_surface": 1.5}, ValueError, "fitting_surface=1.5"),
        ({"tube_surface": "shiny"}, ValueError, "tube_surface='shiny'"),
        ({"tube_wall": "12 mm"}, ValueError, "tube_wall='12 mm'"),
        ({"coil_tube_depth": "5 mm"}, ValueError, "coil_tube_depth"),
        ({"supply_margin": 1.5}, ValueError, "supply_margin=1.5"),
    ],
)
def test_bad_input(change, error, match):
    with pytest.raises(error, match=match):
        run(**change)


def test_power_too_small_to_reach_the_brazing_temperature():
    with pytest.raises(ValueError, match="power=.*does not bring both parts"):
        run(power="300 W")


def test_heat_time_too_short():
    with pytest.raises(ValueError, match="heat_time='2 s' is too short"):
        run(power=None, heat_time="2 s")


def test_bad_input_of_the_core_functions():
    mat = constant("m", 100.0, 400.0, 8000.0)
    lump = Lump(mat, 0.01)
    with pytest.raises(ValueError, match="fin_model='exact'"):
        simulate_two_parts(lump, lump, 1.0, lambda a, b: (1.0, 1.0), 1.0, fin_model="exact")
    with pytest.raises(ValueError, match="conductance=-1.0"):
        simulate_two_parts(lump, lump, -1.0, lambda a, b: (1.0, 1.0), 1.0)
    with pytest.raises(ValueError, match="tube.mass=0.0"):
        simulate_two_parts(lump, Lump(mat, 0.0), 1.0, lambda a, b: (1.0, 1.0), 1.0)
    with pytest.raises(ValueError, match="radii must satisfy"):
        JointGeometry(10e-3, 11e-3, 10.9e-3, 14e-3, 20e-3)  # bore smaller than the tube
