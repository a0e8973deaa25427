"""Coil circuit: analytic limits approached at the expected order (log-log fits)."""

import numpy as np
import pytest
from scipy.constants import mu_0, pi

from heatcalc import em
from heatcalc.coil import (
    CylinderWorkpiece,
    RectangularTube,
    SolenoidCoil,
    coil_circuit,
    coil_impedance,
    nagaoka,
)

RHO_CU = 1.7241e-8  # annealed copper, IEC 60028 (from memory)
RHO_STEEL_HOT = 1.2e-6  # plain carbon steel above Curie, BISRA 1953 (+-10 %)


def _slope(x, y):
    return np.polyfit(np.log(x), np.log(y), 1)[0]


def _coil(length, turns=10, inner_diameter=0.14, unit_fill=False, wall=0.0015):
    width = length / turns if unit_fill else min(0.02, length / turns)
    return SolenoidCoil(
        turns, length, inner_diameter, RectangularTube(width, 0.012, min(wall, 0.4 * width)), RHO_CU
    )


def test_nagaoka_long_coil_expansion_orders():
    # K = 1 - 4 x/(3 pi) + x^2/8 - ... for x = D/l -> 0 (first terms of Lundin's 1985
    # expansion; Grover 1946): 1 - K is first order, the remainder after the linear term second.
    x = np.logspace(-4, -2, 9)
    k = nagaoka(x, 1.0)
    assert _slope(x, 1.0 - k) == pytest.approx(1.0, abs=0.01)
    rem = 1.0 - k - 4.0 * x / (3.0 * pi)
    assert np.all(rem < 0)
    assert _slope(x, -rem) == pytest.approx(2.0, abs=0.02)
    assert -rem[0] / x[0] ** 2 == pytest.approx(1.0 / 8.0, rel=1e-3)


def test_empty_coil_reactance_tends_to_long_solenoid_value():
    # X -> omega mu_0 N^2 A / l as l/D grows, the error falling as D/l (first order)
    f, d = 1e3, 0.14
    lengths = np.array([2.0, 4.0, 8.0, 16.0, 32.0])
    err = []
    for length in lengths:
        coil = _coil(length, turns=50)
        x = complex(coil_impedance(coil, None, f).load).imag
        x_long = 2 * pi * f * mu_0 * 50**2 * pi * d * d / 4 / length
        assert complex(coil_impedance(coil, None, f, method="long_coil").load).imag == (
            pytest.approx(x_long, rel=1e-13)
        )
        err.append(1.0 - x / x_long)
    assert _slope(d / lengths, np.array(err)) == pytest.approx(1.0, abs=0.02)


def test_efficiency_approaches_davies_simpson_limit_at_first_order_in_delta_over_d():
    # eta_inf = 1/(1 + (Dc/Dw) sqrt(rho_c/(mu_r rho_w))) (Davies & Simpson 1979, from memory);
    # with P = 1 - delta/(2a) + ... the error is first order in delta/D.
    coil = _coil(1.0, turns=10, unit_fill=True, wall=0.005)  # wall >= 20 copper skin depths
    bar = CylinderWorkpiece(0.05, 1.0, RHO_STEEL_HOT)
    eta_inf = 1.0 / (1.0 + 0.14 / 0.10 * np.sqrt(RHO_CU / RHO_STEEL_HOT))
    freqs = np.array([1e5, 4e5, 1.6e6, 6.4e6])
    eta = np.array(
        [float(coil_impedance(coil, bar, f, method="long_coil").efficiency) for f in freqs]
    )
    ratio = np.array([float(em.skin_depth(RHO_STEEL_HOT, f)) for f in freqs]) / 0.10
    err = eta_inf - eta
    assert np.all(err > 0)
    assert _slope(ratio, err) == pytest.approx(1.0, abs=0.03)


def test_short_coil_correction_vanishes_at_first_order_in_d_over_l():
    f = 3e3
    lengths = np.array([1.0, 2.0, 4.0, 8.0, 16.0])
    diffs = []
    for length in lengths:
        coil = _coil(length, turns=20)
        bar = CylinderWorkpiece(0.05, length, RHO_STEEL_HOT)
        a = complex(coil_impedance(coil, bar, f).load)
        b = complex(coil_impedance(coil, bar, f, method="long_coil").load)
        diffs.append(abs(a - b) / abs(b))
    assert _slope(0.14 / lengths, np.array(diffs)) == pytest.approx(1.0, abs=0.05)


def test_circuit_with_radial_solver_converges_at_second_order():
    # The coil current for a given workpiece power, using the radial solver's surface
    # impedance on uniform meshes, converges to the analytic circuit at order 2 (linear
    # elements, em notes).
    coil = _coil(0.3, turns=12)
    bar = CylinderWorkpiece(0.05, 0.3, RHO_STEEL_HOT)
    f = 3e3
    exact = coil_circuit(coil, bar, f, workpiece_power=1e5).coil_current
    nodes = np.array([41, 81, 161, 321])
    err = []
    for n in nodes:
        mesh = em.radial_mesh("cylinder", bar.radius, n=int(n))
        zs = em.solve_radial_field(mesh, RHO_STEEL_HOT, 1.0, f).surface_impedance
        i = coil_circuit(coil, bar, f, workpiece_power=1e5, surface_impedance=zs).coil_current
        err.append(abs(i - exact) / exact)
    h = bar.radius / (nodes - 1)
    assert _slope(h, np.array(err)) == pytest.approx(2.0, abs=0.15)
