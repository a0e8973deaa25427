"""Coil copper: backed-sheet impedance against limits, an ODE solution and Davies' optimum."""

import mpmath
import numpy as np
import pytest
from scipy import integrate
from scipy.constants import mu_0, pi

from heatcalc.coil import RectangularTube, RoundTube, backed_sheet_impedance, optimum_wall_thickness

RHO_CU = 1.7241e-8  # annealed copper at 20 degC, IEC 60028 (CHECKS.md, from memory)


def delta(rho, f):
    return np.sqrt(rho / (pi * f * mu_0))


def sheet_impedance_by_ode(thickness, rho, f, n=201):
    """Independent route: solve d2H/dxi2 = 2j H (xi = x/delta, the diffusion equation
    d2H/dx2 = j omega mu_0 H / rho) on [0, t/delta] with H(0) = 1, H(t) = 0 as a
    boundary-value problem (scipy.integrate.solve_bvp); then Z = E/H at the face with
    E = -rho dH/dx (current density J = -dH/dx along the sheet)."""
    d = delta(rho, f)
    xi_end = thickness / d
    xi = np.linspace(0.0, xi_end, n)

    def rhs(_x, y):  # y = [Re H, Im H, Re H', Im H']
        d2 = 2j * (y[0] + 1j * y[1])
        return np.vstack([y[2], y[3], d2.real, d2.imag])

    def bc(ya, yb):
        return np.array([ya[0] - 1.0, ya[1], yb[0], yb[1]])

    guess = np.zeros((4, n))
    guess[0] = 1.0 - xi / xi_end
    guess[2] = -1.0 / xi_end
    sol = integrate.solve_bvp(rhs, bc, xi, guess, tol=1e-9, max_nodes=100000)
    assert sol.success, sol.message
    dh0 = sol.sol(0.0)[2] + 1j * sol.sol(0.0)[3]
    return -rho / d * dh0


@pytest.mark.parametrize("t_over_delta", [0.2, 1.0, np.pi / 2, 3.0])
def test_backed_sheet_against_ode_solution(t_over_delta):
    f = 10e3
    t = t_over_delta * delta(RHO_CU, f)
    z = backed_sheet_impedance(t, RHO_CU, f)
    assert z == pytest.approx(sheet_impedance_by_ode(t, RHO_CU, f), rel=1e-6)


def test_backed_sheet_against_mpmath_coth():
    # rho (1 + j)/delta coth((1 + j) t/delta) in 30-digit arithmetic
    f, t = 3e3, 2e-3
    d = delta(RHO_CU, f)
    with mpmath.workdps(30):
        g = mpmath.mpc(1, 1) / d
        expected = complex(RHO_CU * g * mpmath.coth(g * t))
    assert complex(backed_sheet_impedance(t, RHO_CU, f)) == pytest.approx(expected, rel=1e-13)


def test_thick_sheet_tends_to_half_space():
    # t >> delta: Z -> (1 + j) rho / delta (Davies, Conduction and Induction Heating, 1990, ch. 2)
    f = 50e3
    d = delta(RHO_CU, f)
    z = backed_sheet_impedance(50 * d, RHO_CU, f)
    assert z == pytest.approx((1 + 1j) * RHO_CU / d, rel=1e-12)
    # very thick (no overflow in the complex tanh)
    assert np.isfinite(backed_sheet_impedance(1e4 * d, RHO_CU, f))


def test_thin_sheet_tends_to_dc_resistance_and_uniform_current_inductance():
    # t << delta: Z -> rho/t + j omega mu_0 t / 3 (uniform current layer; sheet resistance rho/t)
    f, t = 50.0, 1e-5
    z = complex(backed_sheet_impedance(t, RHO_CU, f))
    assert z.real == pytest.approx(RHO_CU / t, rel=1e-6)
    assert z.imag == pytest.approx(2 * pi * f * mu_0 * t / 3.0, rel=1e-4)


def test_optimum_wall_is_pi_delta_over_two():
    # Davies (1990), ch. 8: the coil wall for least loss is pi delta / 2, where the resistance
    # is tanh(pi/2) = 0.917 of the thick-wall value (from memory); checked by a bounded search.
    from scipy.optimize import minimize_scalar

    f = 10e3
    d = delta(RHO_CU, f)
    res = minimize_scalar(
        lambda t: backed_sheet_impedance(t, RHO_CU, f).real,
        bounds=(0.5 * d, 4 * d),
        method="bounded",
        options={"xatol": 1e-12},
    )
    assert res.x == pytest.approx(float(optimum_wall_thickness(RHO_CU, f)), rel=1e-5)
    r_opt = backed_sheet_impedance(optimum_wall_thickness(RHO_CU, f), RHO_CU, f).real
    assert r_opt / (RHO_CU / d) == pytest.approx(np.tanh(pi / 2), rel=1e-12)
    assert r_opt / (RHO_CU / d) == pytest.approx(0.917, abs=5e-4)


def test_backed_sheet_broadcasts():
    t = np.array([1e-3, 2e-3])
    z = backed_sheet_impedance(t, RHO_CU, np.array([[1e3], [1e4]]))
    assert z.shape == (2, 2)
    assert z[1, 0] == pytest.approx(complex(backed_sheet_impedance(1e-3, RHO_CU, 1e4)), rel=1e-15)
    assert np.ndim(backed_sheet_impedance(1e-3, RHO_CU, 1e3)) == 0
    assert np.all(z.real > 0) and np.all(z.imag > 0)


def test_tubing_geometry_by_hand():
    tube = RectangularTube(0.020, 0.012, 0.0015)
    # channel 17 x 9 mm: area 153 mm^2, hydraulic diameter 4 A / P = 612 / 52 mm
    assert tube.channel_area == pytest.approx(153e-6, rel=1e-12)
    assert tube.hydraulic_diameter == pytest.approx(612.0 / 52.0 * 1e-3, rel=1e-12)
    assert tube.copper_area == pytest.approx(240e-6 - 153e-6, rel=1e-12)
    rnd = RoundTube(0.010, 0.001)
    assert rnd.hydraulic_diameter == pytest.approx(0.008, rel=1e-12)
    assert rnd.channel_area == pytest.approx(pi * 0.008**2 / 4, rel=1e-12)
    assert rnd.axial_width == rnd.radial_depth == 0.010


@pytest.mark.parametrize(
    ("args", "match"),
    [
        ((0.0, 1.7e-8, 1e3), "thickness must be > 0"),
        ((1e-3, -1.7e-8, 1e3), "resistivity must be > 0"),
        ((1e-3, 1.7e-8, 0.0), "frequency must be > 0"),
    ],
)
def test_backed_sheet_rejects_bad_input(args, match):
    with pytest.raises(ValueError, match=match):
        backed_sheet_impedance(*args)


def test_optimum_wall_rejects_bad_input():
    with pytest.raises(ValueError, match="resistivity must be > 0"):
        optimum_wall_thickness(0.0, 1e3)
    with pytest.raises(ValueError, match="frequency must be > 0"):
        optimum_wall_thickness(1.7e-8, -1.0)


@pytest.mark.parametrize(
    ("make", "match"),
    [
        (lambda: RectangularTube(0.0, 0.01, 0.001), "axial_width must be > 0"),
        (lambda: RectangularTube(0.01, -0.01, 0.001), "radial_depth must be > 0"),
        (lambda: RectangularTube(0.01, 0.01, 0.0), "wall must be > 0"),
        (lambda: RectangularTube(0.01, 0.01, 0.005), "wall must be < half"),
        (lambda: RoundTube(0.0, 0.001), "outer_diameter must be > 0"),
        (lambda: RoundTube(0.01, 0.006), "wall must be < outer_diameter / 2"),
    ],
)
def test_tubing_rejects_bad_sizes(make, match):
    with pytest.raises(ValueError, match=match):
        make()
