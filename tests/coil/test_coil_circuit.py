"""Coil-workpiece equivalent circuit: referral, efficiency limit, power balance, corrections."""

import warnings

import mpmath as mp
import numpy as np
import pandas as pd
import pytest
from coil_cases import (
    RHO_COPPER,
    RHO_HOT_STEEL,
    TUBE_20x12,
    billet_coil,
    cylinder_zs_bessel,
    delta,
    hot_billet,
    plate,
    round_tube_coil,
    steel_tube,
)
from hypothesis import given, settings
from hypothesis import strategies as st
from scipy import special
from scipy.constants import mu_0, pi

from heatcalc import em
from heatcalc.coil import (
    END_CORRECTION_WARNING_RATIO,
    CoilCircuitResult,
    CylinderWorkpiece,
    EndCorrectionWarning,
    RectangularSolenoidCoil,
    RectangularTube,
    SlabWorkpiece,
    SolenoidCoil,
    TubeWorkpiece,
    coil_circuit,
    coil_impedance,
    ellipsoid_demagnetising_factor,
    empty_coil_inductance,
    end_correction_methods,
    workpiece_power_at_current,
)


def slab_zs(thickness, rho, f, mu_r=1.0):
    """Plate with equal fields on both faces: H = H0 cosh(g x)/cosh(g d/2), g = (1+j)/delta,
    Z_s = rho g tanh(g d/2) per face (Davies, Conduction and Induction Heating, 1990, ch. 2;
    independent route)."""
    g = (1 + 1j) / delta(rho, f, mu_r)
    return rho * g * np.tanh(g * thickness / 2.0)


def tube_zs(outer, inner, rho, f, mu_r=1.0):
    """Tube with an empty bore: H = A I0(g r) + B K0(g r) in the wall, bore flux condition
    H'(b) = j b H(b) / (mu_r delta^2) from Faraday's law round the bore, Z_s = rho H'(a)/H(a)
    (Davies 1990, tubular load; independent route with scipy.special.iv/kv)."""
    d = delta(rho, f, mu_r)
    g = (1 + 1j) / d
    c_b = 1j * inner / (mu_r * d * d)
    # A [g I1(g b) - c_b I0(g b)] + B [-g K1(g b) - c_b K0(g b)] = 0 ; take A = 1
    ib0, ib1 = special.iv(0, g * inner), special.iv(1, g * inner)
    kb0, kb1 = special.kv(0, g * inner), special.kv(1, g * inner)
    b_coef = (g * ib1 - c_b * ib0) / (g * kb1 + c_b * kb0)
    h_a = special.iv(0, g * outer) + b_coef * special.kv(0, g * outer)
    dh_a = g * special.iv(1, g * outer) - b_coef * g * special.kv(1, g * outer)
    return rho * dh_a / h_a


# --- referral of the workpiece to the coil (long coil) ---
def test_cylinder_referred_impedance_matches_long_coil_formula():
    # Z = N^2 (2 pi a / l) Z_s + j omega mu_0 N^2 (A_c - pi a^2) / l (long coil, workpiece as
    # long as the coil; Davies & Simpson, Induction Heating Handbook, 1979, from memory), with
    # Z_s from the complex-Bessel route.
    coil, bar, f = billet_coil(), hot_billet(), 3e3
    z = coil_impedance(coil, bar, f, method="long_coil")
    n, length, a = coil.turns, coil.length, bar.radius
    z_s = cylinder_zs_bessel(a, RHO_HOT_STEEL, f)
    expected = (
        n**2 * 2 * pi * a / length * z_s
        + 1j * 2 * pi * f * mu_0 * n**2 * pi * (coil.inner_diameter**2 / 4 - a**2) / length
    )
    assert complex(z.load) == pytest.approx(expected, rel=1e-9)


@pytest.mark.parametrize("mu_r", [1.0, 40.0])
def test_tube_workpiece_referral(mu_r):
    coil, tube, f = round_tube_coil(), steel_tube(), 10e3
    tube = TubeWorkpiece(tube.outer_radius, tube.inner_radius, tube.length, 2e-7, mu_r)
    z = coil_impedance(coil, tube, f, method="long_coil")
    n, length = coil.turns, coil.length
    z_s = tube_zs(tube.outer_radius, tube.inner_radius, 2e-7, f, mu_r)
    expected = n**2 * 2 * pi * tube.outer_radius / length * z_s
    assert complex(z.workpiece) == pytest.approx(expected, rel=1e-8)


def test_plate_in_rectangular_coil_referral():
    coil = RectangularSolenoidCoil(10, 0.5, 0.4, 0.08, TUBE_20x12, RHO_COPPER)
    slab, f = plate(), 1e3
    z = coil_impedance(coil, slab, f, method="long_coil")
    n, length = coil.turns, coil.length
    expected_w = n**2 * 2 * slab.width / length * slab_zs(slab.thickness, RHO_HOT_STEEL, f)
    assert complex(z.workpiece) == pytest.approx(expected_w, rel=1e-9)
    x_gap = 2 * pi * f * mu_0 * n**2 * (0.4 * 0.08 - slab.width * slab.thickness) / length
    assert float(z.gap_reactance) == pytest.approx(x_gap, rel=1e-12)


# --- coil efficiency ---
def _unit_space_factor_coil(inner_diameter, length=1.0, turns=10, wall=0.02):
    # space factor 1: turns touch; a wall of many copper skin depths
    tube = RectangularTube(length / turns, 0.05, wall)
    return SolenoidCoil(turns, length, inner_diameter, tube, RHO_COPPER)


@pytest.mark.parametrize(("rho_w", "mu_r"), [(1.2e-6, 1.0), (2e-7, 50.0), (2.65e-8, 1.0)])
def test_efficiency_tends_to_davies_simpson_limit(rho_w, mu_r):
    # eta = 1 / (1 + (D_c/D_w) sqrt(rho_c / (mu_r rho_w))) for D/delta large, space factor 1
    # (Davies & Simpson, Induction Heating Handbook, 1979; CHECKS.md, from memory). At finite
    # D/delta the root term is divided by P (real part of Z_s delta/rho): the exact long-coil
    # value, checked to 1e-9 with P from the Bessel route; the limit itself within delta/D.
    d_c, d_w = 0.14, 0.10
    coil = _unit_space_factor_coil(d_c)
    bar = CylinderWorkpiece(d_w / 2, 1.0, rho_w, mu_r)
    root = d_c / d_w * np.sqrt(RHO_COPPER / (mu_r * rho_w))
    for f in (3e4, 3e5):
        eta = float(coil_impedance(coil, bar, f, method="long_coil").efficiency)
        dw = delta(rho_w, f, mu_r)
        p = (cylinder_zs_bessel(d_w / 2, rho_w, f, mu_r) * dw / rho_w).real
        assert eta == pytest.approx(1.0 / (1.0 + root / p), rel=1e-9)
        assert eta == pytest.approx(1.0 / (1.0 + root), rel=2.0 * dw / d_w)


def test_magnetic_steel_heats_far_more_efficiently_than_aluminium_or_copper():
    # Common practice, no source: a copper coil heats magnetic steel (mu_r 20-100, rho 2e-7)
    # far more efficiently than aluminium or copper. Resistivities: CRC Handbook (Al 2.65e-8,
    # Cu 1.678e-8 at 293 K; CHECKS.md).
    coil, f = billet_coil(), 10e3
    eta = {
        name: float(coil_impedance(coil, CylinderWorkpiece(0.05, 0.3, rho, mu), f).efficiency)
        for name, rho, mu in [
            ("steel20", 2e-7, 20),
            ("steel100", 2e-7, 100),
            ("aluminium", 2.65e-8, 1),
            ("copper", 1.678e-8, 1),
        ]
    }
    assert eta["steel100"] > eta["steel20"] > 0.85
    assert eta["aluminium"] < 0.6 and eta["copper"] < 0.5
    assert eta["steel20"] > eta["aluminium"] + 0.3 > eta["copper"] + 0.3


def test_coil_copper_dc_limit():
    # At low frequency the copper wall carries a uniform current: R = rho N (pi D) / (w t)
    # (resistance of the bore-facing wall strip, by hand).
    coil = billet_coil()
    z = coil_impedance(coil, None, 0.1)
    w, t = TUBE_20x12.axial_width, TUBE_20x12.wall
    r_dc = RHO_COPPER * coil.turns * pi * coil.inner_diameter / (w * t)
    assert complex(z.conductor).real == pytest.approx(r_dc, rel=1e-6)


# --- power balance ---
def test_power_balance_closes_with_leads():
    coil, bar = billet_coil(), hot_billet()
    res = coil_circuit(coil, bar, 3e3, workpiece_power=150e3, lead_impedance=2e-3 + 1e-2j)
    # supply power = workpiece + coil copper + leads
    p_from_terminals = (res.coil_voltage * res.coil_current) * res.power_factor
    assert p_from_terminals == pytest.approx(res.input_power, rel=1e-12)
    assert res.input_power == pytest.approx(
        res.workpiece_power + res.copper_loss + res.lead_loss, rel=1e-12
    )
    assert res.workpiece_power == pytest.approx(150e3, rel=1e-12)
    assert res.lead_loss == pytest.approx(res.coil_current**2 * 2e-3, rel=1e-12)
    assert res.apparent_power == pytest.approx(np.hypot(res.input_power, res.reactive_power))


@pytest.mark.parametrize("method", end_correction_methods())
def test_workpiece_power_equals_poynting_flux_at_the_surface_field(method):
    # Independent route: P = Re(Z_s) H^2 x (surface area under the coil), with H the
    # reported surface field and Z_s from the Bessel route.
    coil, bar, f = billet_coil(), hot_billet(), 3e3
    res = coil_circuit(coil, bar, f, coil_current=2000.0, method=method)
    area = 2 * pi * bar.radius * min(bar.length, coil.length)
    p = cylinder_zs_bessel(bar.radius, RHO_HOT_STEEL, f).real * res.surface_field**2 * area
    assert res.workpiece_power == pytest.approx(p, rel=1e-9)
    if method == "long_coil":
        assert res.surface_field == pytest.approx(coil.turns * 2000.0 / coil.length, rel=1e-14)


# --- short workpiece, short coil ---
def test_workpiece_shorter_than_coil_long_coil_model():
    coil, f = billet_coil(length=0.3), 3e3
    full = coil_impedance(coil, hot_billet(length=0.3), f, method="long_coil")
    half = coil_impedance(coil, hot_billet(length=0.15), f, method="long_coil")
    longer = coil_impedance(coil, hot_billet(length=0.9), f, method="long_coil")
    empty = coil_impedance(coil, None, f, method="long_coil")
    # half the workpiece: half its impedance, and the freed length adds empty-bore reactance
    assert complex(half.workpiece) == pytest.approx(complex(full.workpiece) / 2, rel=1e-12)
    x_mix = (float(full.gap_reactance) + float(empty.empty_bore_reactance)) / 2
    assert complex(half.load).imag - complex(half.workpiece).imag == pytest.approx(x_mix)
    # longer than the coil: only the part under the coil counts
    assert complex(longer.load) == pytest.approx(complex(full.load), rel=1e-14)


def test_nagaoka_method_gives_empty_coil_inductance():
    # empty short coil: X = omega K mu_0 N^2 A / l (Nagaoka 1909; Grover 1946)
    coil, f = billet_coil(), 1e3
    z = coil_impedance(coil, None, f)
    l_nag = float(empty_coil_inductance(coil.inner_diameter, coil.length, coil.turns))
    assert complex(z.load) == pytest.approx(1j * 2 * pi * f * l_nag, rel=1e-12)
    assert complex(z.load).real == 0.0


def test_return_path_correction_vanishes_for_long_coils():
    f = 3e3
    diffs = []
    for length in (0.3, 3.0, 30.0):
        coil = billet_coil(turns=12, length=length)
        bar = hot_billet(length=length)
        a = complex(coil_impedance(coil, bar, f).load)
        b = complex(coil_impedance(coil, bar, f, method="long_coil").load)
        diffs.append(abs(a - b) / abs(b))
    assert diffs[0] > diffs[1] > diffs[2]
    assert diffs[2] < 1e-2


def test_short_coil_lowers_load_resistance_and_surface_field():
    coil, bar = billet_coil(), hot_billet()
    short = coil_circuit(coil, bar, 3e3, coil_current=1000.0)
    long_ = coil_circuit(coil, bar, 3e3, coil_current=1000.0, method="long_coil")
    assert short.load_resistance < long_.load_resistance
    assert short.surface_field < long_.surface_field
    assert short.workpiece_power < long_.workpiece_power
    # explicit parallel combination of interior and return path (the model's definition)
    z = short.impedance
    zi = complex(z.interior)
    zr = 1j * float(z.return_reactance)
    assert complex(z.load) == pytest.approx(zi * zr / (zi + zr), rel=1e-13)


# --- permeable return path (end correction for magnetic workpieces) ---
def test_ellipsoid_demagnetising_factor_against_published_values():
    # Sphere: N = 1/3 exactly (Osborn, Phys. Rev. 67, 1945; Stoner, Phil. Mag. 36, 1945).
    assert ellipsoid_demagnetising_factor(1.0) == pytest.approx(1 / 3, rel=1e-12)
    # Closed forms evaluated in 50-digit arithmetic with mpmath (independent of the series
    # the function uses near the sphere), on both sides of the sphere and of the switch.
    mp.mp.dps = 50

    def reference(g):
        g = mp.mpf(g)
        d = g * g - 1
        if g > 1:
            return (g / mp.sqrt(d) * mp.acosh(g) - 1) / d
        return (1 - g / mp.sqrt(-d) * mp.acos(g)) / (-d)

    gammas = [0.5, 0.9, 0.95, 1 - 1e-5, 1 + 1e-5, 1.1, 1.2, 3.0]
    got = ellipsoid_demagnetising_factor(np.array(gammas))
    assert got == pytest.approx([float(reference(g)) for g in gammas], rel=1e-13)
    # Prolate spheroid m = 10: 0.0203 (Bozorth, Ferromagnetism, 1951, table of demagnetising
    # factors of ellipsoids; from memory). Long limit (ln(2 m) - 1)/m^2 (Osborn 1945).
    assert ellipsoid_demagnetising_factor(10.0) == pytest.approx(0.0203, abs=6e-5)
    gamma = 1e4
    assert ellipsoid_demagnetising_factor(gamma) == pytest.approx(
        (np.log(2 * gamma) - 1) / gamma**2, rel=1e-6
    )
    # Thin oblate disc: N -> 1 - (pi/2) m (Osborn 1945, flat limit; from memory)
    assert ellipsoid_demagnetising_factor(1e-4) == pytest.approx(1 - pi / 2 * 1e-4, abs=1e-7)
    with pytest.raises(ValueError, match="aspect_ratio must be > 0"):
        ellipsoid_demagnetising_factor(0.0)


@settings(max_examples=40, deadline=None)
@given(
    f=st.floats(50.0, 5e5),
    rho=st.floats(1.6e-8, 1.5e-6),
    radius=st.floats(0.005, 0.065),
    length=st.floats(0.05, 2.0),
)
def test_permeable_return_path_equals_empty_coil_one_for_non_magnetic_loads(f, rho, radius, length):
    # Eddy currents in a mu_r = 1 load only expel flux, |Z_i| <= omega mu_0 N^2 A_c / l_c,
    # so the method falls back to the empty-coil return path exactly (as documented).
    coil = billet_coil()
    bar = CylinderWorkpiece(radius, length, rho)
    new = coil_impedance(coil, bar, f)
    old = coil_impedance(coil, bar, f, method="nagaoka_return_path")
    assert complex(new.load) == complex(old.load)
    assert float(new.return_reactance) == float(new.empty_return_reactance)


def test_permeable_return_path_limits_for_a_magnetic_billet():
    # Derived limits (module notes): the return reactance is at least that of the empty coil
    # for g_inf > 1 and tends to g_inf X_r for a very permeable load (m -> inf); g_inf from
    # the Nagaoka coefficient (checked against Grover in test_coil_inductance) and the
    # spheroid factor (checked above).
    coil = billet_coil(length=0.6)
    f = 50.0  # low D/delta: the effective permeability of the load is large
    k = float(coil_impedance(coil, None, f).nagaoka_coefficient)
    ratios = []
    for mu_r in (5.0, 50.0, 1e5):
        bar = CylinderWorkpiece(0.06, 0.6, 2e-7, mu_r)
        z = coil_impedance(coil, bar, f)
        ratios.append(float(z.return_reactance) / float(z.empty_return_reactance))
    g_inf = (1 - k) / k * (0.06 / 0.07) ** 2 / float(ellipsoid_demagnetising_factor(0.6 / 0.12))
    assert g_inf > 1.0
    assert 1.0 <= ratios[0] < ratios[1] < ratios[2] < g_inf
    assert ratios[2] == pytest.approx(g_inf, rel=0.02)


def test_permeable_return_path_tends_to_long_coil_model():
    # As l_c/D_c grows, Nagaoka's K -> 1 and any return path becomes irrelevant.
    f = 1e3
    diffs = []
    for length in (0.3, 3.0, 30.0):
        coil = billet_coil(turns=12, length=length)
        bar = CylinderWorkpiece(0.05, length, 5e-7, 50.0)
        a = complex(coil_impedance(coil, bar, f).load)
        b = complex(coil_impedance(coil, bar, f, method="long_coil").load)
        diffs.append(abs(a - b) / abs(b))
    assert diffs[0] > diffs[1] > diffs[2]
    assert diffs[2] < 2e-2


def test_permeable_load_power_balance_and_ordering():
    # Magnetic load: the enlarged return reactance lies between the empty-coil correction and
    # none, so the workpiece power at equal current does too; energy balance closes.
    coil, f = billet_coil(length=0.6), 200.0
    bar = CylinderWorkpiece(0.06, 0.6, 5e-7, 50.0)
    with warnings.catch_warnings():
        warnings.simplefilter("ignore", EndCorrectionWarning)
        res = {
            m: coil_circuit(coil, bar, f, coil_current=500.0, method=m)
            for m in end_correction_methods()
        }
    p = {m: r.workpiece_power for m, r in res.items()}
    assert p["nagaoka_return_path"] < p["permeable_return_path"] < p["long_coil"]
    r = res["permeable_return_path"]
    assert r.input_power == pytest.approx(r.workpiece_power + r.copper_loss, rel=1e-12)
    zi = complex(r.impedance.interior)
    zr = 1j * r.return_reactance
    assert complex(r.impedance.load) == pytest.approx(zi * zr / (zi + zr), rel=1e-13)
    assert r.interior_to_return_ratio == pytest.approx(abs(zi) / r.return_reactance, rel=1e-13)


def test_end_correction_warning_above_threshold_only():
    coil, f = billet_coil(), 300.0  # l_c/D_c about 2, D_w/delta about 6
    magnetic = CylinderWorkpiece(0.05, 0.3, 5e-7, 100.0)
    with pytest.warns(EndCorrectionWarning, match="interior_to_return_ratio"):
        res = coil_circuit(coil, magnetic, f, workpiece_power=1e5)
    assert res.interior_to_return_ratio > END_CORRECTION_WARNING_RATIO
    # non-magnetic billet, long coil: no warning
    long_coil = billet_coil(length=1.2)
    with warnings.catch_warnings():
        warnings.simplefilter("error", EndCorrectionWarning)
        quiet = coil_circuit(long_coil, hot_billet(length=1.2), 10e3, workpiece_power=1e5)
    assert quiet.interior_to_return_ratio < END_CORRECTION_WARNING_RATIO
    # long_coil method: the ratio still reports the empty-coil correction it leaves out
    lc = coil_impedance(long_coil, hot_billet(length=1.2), 10e3, method="long_coil")
    nag = coil_impedance(long_coil, hot_billet(length=1.2), 10e3, method="nagaoka_return_path")
    assert float(lc.interior_to_return_ratio) == float(nag.interior_to_return_ratio)
    table = quiet.to_frame()
    assert "interior to return-path ratio" in set(table["quantity"])


# --- surface impedance from the radial solver ---
def test_radial_solver_surface_impedance_reproduces_analytic_circuit():
    coil, bar, f = billet_coil(), hot_billet(), 3e3
    mesh = em.radial_mesh("cylinder", bar.radius, skin_depth=delta(RHO_HOT_STEEL, f))
    sol = em.solve_radial_field(mesh, RHO_HOT_STEEL, 1.0, f)
    a = coil_circuit(coil, bar, f, workpiece_power=1e5, surface_impedance=sol.surface_impedance)
    b = coil_circuit(coil, bar, f, workpiece_power=1e5)
    # em states 0.1 % for the default mesh
    assert a.coil_current == pytest.approx(b.coil_current, rel=1e-3)
    assert a.coil_voltage == pytest.approx(b.coil_voltage, rel=1e-3)
    # passing the analytic value reproduces the circuit exactly
    zs = complex(em.cylinder_surface_impedance(bar.radius, RHO_HOT_STEEL, f))
    c = coil_circuit(coil, bar, f, workpiece_power=1e5, surface_impedance=zs)
    assert c.coil_voltage == pytest.approx(b.coil_voltage, rel=1e-14)


# --- arrays, results ---
def test_frequency_array_matches_scalar_evaluations():
    coil, bar = billet_coil(), hot_billet()
    f = np.array([500.0, 3e3, 2e4])
    z = coil_impedance(coil, bar, f)
    assert np.shape(z.total) == (3,)
    for i, fi in enumerate(f):
        zi = coil_impedance(coil, bar, fi)
        assert np.ndim(zi.total) == 0
        assert complex(z.total[i]) == pytest.approx(complex(zi.total), rel=1e-14)


def test_result_table_and_html():
    res = coil_circuit(billet_coil(), hot_billet(), 3e3, workpiece_power=1e5)
    assert isinstance(res, CoilCircuitResult)
    table = res.to_frame()
    assert isinstance(table, pd.DataFrame)
    assert list(table.columns) == ["quantity", "value", "unit"]
    rows = dict(zip(table["quantity"], table["unit"], strict=True))
    assert rows["coil current"] == "A" and rows["surface field"] == "A/m"
    value = dict(zip(table["quantity"], table["value"], strict=True))
    assert value["workpiece power"] == pytest.approx(1e5)
    assert "coil efficiency" in res._repr_html_()
    assert end_correction_methods() == (
        "permeable_return_path",
        "nagaoka_return_path",
        "long_coil",
    )


def test_workpiece_power_at_current_for_field_cross_checks():
    coil, bar = billet_coil(), hot_billet()
    p, z, z_load = workpiece_power_at_current(coil, bar, 3e3, 1500.0)
    res = coil_circuit(coil, bar, 3e3, coil_current=1500.0)
    assert p == pytest.approx(res.workpiece_power, rel=1e-14)
    assert z == pytest.approx(complex(res.resistance, res.reactance), rel=1e-14)
    assert p == pytest.approx(1500.0**2 * z_load.real, rel=1e-12)


# --- properties (hypothesis) ---
@settings(max_examples=40, deadline=None)
@given(
    f=st.floats(50.0, 5e5),
    rho=st.floats(1.6e-8, 1.5e-6),
    mu_r=st.floats(1.0, 200.0),
    radius=st.floats(0.005, 0.065),
    length=st.floats(0.05, 2.0),
    method=st.sampled_from(end_correction_methods()),
)
def test_efficiency_and_power_factor_lie_in_unit_interval(f, rho, mu_r, radius, length, method):
    coil = billet_coil()
    bar = CylinderWorkpiece(radius, length, rho, mu_r)
    with warnings.catch_warnings():
        warnings.simplefilter("ignore", EndCorrectionWarning)  # magnetic loads, short coil
        res = coil_circuit(coil, bar, f, workpiece_power=1e4, method=method)
    assert 0.0 < res.efficiency < 1.0
    assert 0.0 < res.power_factor < 1.0
    assert res.input_power == pytest.approx(res.workpiece_power + res.copper_loss, rel=1e-10)


@settings(max_examples=30, deadline=None)
@given(turns=st.integers(2, 14), f=st.floats(200.0, 1e5))
def test_more_turns_at_fixed_power_lower_the_current(turns, f):
    bar = hot_billet()
    fewer = coil_circuit(billet_coil(turns=turns), bar, f, workpiece_power=5e4)
    more = coil_circuit(billet_coil(turns=turns + 1), bar, f, workpiece_power=5e4)
    assert more.coil_current < fewer.coil_current
    assert more.coil_voltage > fewer.coil_voltage
    assert more.efficiency > fewer.efficiency


# --- bad input ---
def test_rejects_bad_circuit_arguments():
    coil, bar = billet_coil(), hot_billet()
    with pytest.raises(ValueError, match="method must be one of"):
        coil_impedance(coil, bar, 1e3, method="nagaoka")
    with pytest.raises(ValueError, match="frequency must be > 0"):
        coil_impedance(coil, bar, 0.0)
    with pytest.raises(ValueError, match="lead_impedance must have a real part >= 0"):
        coil_impedance(coil, bar, 1e3, lead_impedance=-1e-3)
    with pytest.raises(ValueError, match="surface_impedance must have a real part > 0"):
        coil_impedance(coil, bar, 1e3, surface_impedance=-1e-3 + 1e-3j)
    with pytest.raises(ValueError, match="surface_impedance must be None for an empty coil"):
        coil_impedance(coil, None, 1e3, surface_impedance=1e-3 + 1e-3j)
    with pytest.raises(ValueError, match="workpiece must fit inside the coil bore"):
        coil_impedance(coil, CylinderWorkpiece(0.07, 0.3, RHO_HOT_STEEL), 1e3)
    with pytest.raises(ValueError, match="workpiece must fit inside the coil bore"):
        coil_impedance(coil, SlabWorkpiece(0.05, 0.135, 0.3, RHO_HOT_STEEL), 1e3)
    with pytest.raises(ValueError, match="workpiece must be a CylinderWorkpiece"):
        coil_impedance(coil, "billet", 1e3)
    with pytest.raises(ValueError, match="coil must be a SolenoidCoil"):
        coil_impedance("coil", bar, 1e3)
    with pytest.raises(ValueError, match="give exactly one of workpiece_power and coil_current"):
        coil_circuit(coil, bar, 1e3)
    with pytest.raises(ValueError, match="give exactly one of workpiece_power and coil_current"):
        coil_circuit(coil, bar, 1e3, workpiece_power=1.0, coil_current=1.0)
    with pytest.raises(ValueError, match="workpiece_power must be > 0"):
        coil_circuit(coil, bar, 1e3, workpiece_power=-5.0)
    with pytest.raises(ValueError, match="coil_current must be > 0"):
        coil_circuit(coil, bar, 1e3, coil_current=0.0)
    with pytest.raises(ValueError, match="workpiece_power needs a workpiece"):
        coil_circuit(coil, None, 1e3, workpiece_power=1.0)


@pytest.mark.parametrize(
    ("make", "match"),
    [
        (lambda: SolenoidCoil(0, 0.3, 0.14, TUBE_20x12, RHO_COPPER), "turns must be a whole"),
        (lambda: SolenoidCoil(2.5, 0.3, 0.14, TUBE_20x12, RHO_COPPER), "turns must be a whole"),
        (lambda: SolenoidCoil(True, 0.3, 0.14, TUBE_20x12, RHO_COPPER), "turns must be a whole"),
        (lambda: SolenoidCoil(12, -0.3, 0.14, TUBE_20x12, RHO_COPPER), "length must be > 0"),
        (lambda: SolenoidCoil(12, 0.3, 0.0, TUBE_20x12, RHO_COPPER), "inner_diameter must be > 0"),
        (lambda: SolenoidCoil(12, 0.3, 0.14, TUBE_20x12, 0.0), "resistivity must be > 0"),
        (lambda: SolenoidCoil(12, 0.3, 0.14, "tube", RHO_COPPER), "conductor must be"),
        (lambda: SolenoidCoil(16, 0.3, 0.14, TUBE_20x12, RHO_COPPER), "space factor"),
        (
            lambda: RectangularSolenoidCoil(5, 0.3, 0.0, 0.1, TUBE_20x12, RHO_COPPER),
            "bore_width must be > 0",
        ),
        (
            lambda: RectangularSolenoidCoil(5, 0.3, 0.4, -1, TUBE_20x12, RHO_COPPER),
            "bore_height must be > 0",
        ),
        (lambda: CylinderWorkpiece(0.0, 0.3, RHO_HOT_STEEL), "radius must be > 0"),
        (lambda: CylinderWorkpiece(0.05, 0.3, RHO_HOT_STEEL, 0.5), "mu_r must be >= 1"),
        (lambda: CylinderWorkpiece(0.05, 0.0, RHO_HOT_STEEL), "length must be > 0"),
        (lambda: CylinderWorkpiece(0.05, 0.3, -1.0), "resistivity must be > 0"),
        (lambda: TubeWorkpiece(0.03, 0.03, 0.3, RHO_HOT_STEEL), "inner_radius must be <"),
        (lambda: TubeWorkpiece(0.03, 0.0, 0.3, RHO_HOT_STEEL), "inner_radius must be > 0"),
        (lambda: TubeWorkpiece(-0.03, 0.01, 0.3, RHO_HOT_STEEL), "outer_radius must be > 0"),
        (lambda: SlabWorkpiece(0.02, 0.01, 0.3, RHO_HOT_STEEL), "width must be > thickness"),
        (lambda: SlabWorkpiece(0.0, 0.3, 0.3, RHO_HOT_STEEL), "thickness must be > 0"),
    ],
)
def test_dataclasses_reject_bad_input(make, match):
    with pytest.raises(ValueError, match=match):
        make()
