"""Nagaoka's coefficient and solenoid inductance against published values and other routes."""

import mpmath
import numpy as np
import pytest
from scipy import integrate, special
from scipy.constants import mu_0, pi

from heatcalc.coil import empty_coil_inductance, nagaoka, return_path_inductance


def lundin(d_over_l):
    """Lundin's handbook approximation of Nagaoka's coefficient (independent route).

    R. Lundin, "A handbook formula for the inductance of a single-layer circular coil",
    Proc. IEEE 73(9), 1985, 1428-1429; stated error a few parts per million (from memory).
    """
    x = float(d_over_l)

    def f1(u):
        return (1.0 + 0.383901 * u + 0.017108 * u * u) / (1.0 + 0.258952 * u)

    def f2(u):
        return 0.093842 * u + 0.002029 * u * u - 0.000801 * u**3

    if x <= 1.0:
        return f1(x * x) - 4.0 * x / (3.0 * pi)
    y = 1.0 / x
    return 2.0 * y / pi * ((np.log(4.0 / y) - 0.5) * f1(y * y) + f2(y * y))


def wheeler(d_over_l):
    """Wheeler's formula L[uH] = r^2 N^2 / (9 r + 10 l) (inches) as a ratio to the long-coil
    inductance: K = 1 / (1 + 0.45 D/l). H. A. Wheeler, "Simple inductance formulas for radio
    coils", Proc. IRE 16, 1928; about 1 % for D/l <= 3 (CHECKS.md, from memory)."""
    return 1.0 / (1.0 + 0.45 * d_over_l)


def nagaoka_mpmath(d, length):
    """The elliptic-integral form evaluated in mpmath at 40 digits, without Carlson's R_D.

    mpmath.ellipk/ellipe take the parameter m = k^2 like scipy.
    """
    with mpmath.workdps(40):
        d, length = mpmath.mpf(d), mpmath.mpf(length)
        m = d * d / (d * d + length * length)
        k, kp = mpmath.sqrt(m), mpmath.sqrt(1 - m)
        kk, ee = mpmath.ellipk(m), mpmath.ellipe(m)
        return float(4 / (3 * mpmath.pi * kp) * ((kp**2 / k**2) * (kk - ee) + ee - k))


def sheet_inductance_by_loops(d, length):
    """Inductance per N^2 of a current sheet from Maxwell's mutual inductance of two coaxial
    circles, integrated over the sheet (independent route):
    M(z) = mu_0 r [(2/k - k) K(k) - (2/k) E(k)], k^2 = 4 r^2 / (4 r^2 + z^2)
    (J. C. Maxwell, A Treatise on Electricity and Magnetism, 1873, art. 701; Grover 1946, ch. 11),
    L / N^2 = (2 / l^2) int_0^l (l - u) M(u) du."""
    r = d / 2.0

    def mutual(u):
        m = 4.0 * r * r / (4.0 * r * r + u * u)
        k = np.sqrt(m)
        kk = special.ellipkm1(u * u / (4.0 * r * r + u * u))  # K(m) accurate as m -> 1
        return mu_0 * r * ((2.0 / k - k) * kk - 2.0 / k * special.ellipe(m))

    val, err = integrate.quad(
        lambda u: (length - u) * mutual(u), 0.0, length, limit=400, epsabs=0.0, epsrel=1e-11
    )
    return 2.0 * val / length**2


# --- published table values (Nagaoka 1909; Grover, Inductance Calculations, 1946, Table 36;
# CHECKS.md, from memory), printed to 4 decimals ---
@pytest.mark.parametrize(("d_over_l", "expected"), [(1.0, 0.6884), (0.2, 0.9201)])
def test_nagaoka_against_grover_table(d_over_l, expected):
    assert nagaoka(d_over_l * 0.25, 0.25) == pytest.approx(expected, abs=5e-5)


@pytest.mark.parametrize("d_over_l", [1e-3, 0.05, 0.2, 0.5, 1.0, 1.5, 3.0, 10.0, 100.0, 1e4])
def test_nagaoka_against_lundin_approximation(d_over_l):
    # Lundin 1985: a few ppm over the whole range (from memory); allow 5 ppm.
    assert nagaoka(d_over_l, 1.0) == pytest.approx(lundin(d_over_l), rel=5e-6)


@pytest.mark.parametrize("d_over_l", np.linspace(0.01, 3.0, 31))
def test_nagaoka_against_wheeler_within_one_percent(d_over_l):
    # Wheeler 1928: about 1 % for D/l <= 3 (from memory).
    assert nagaoka(d_over_l, 1.0) == pytest.approx(wheeler(d_over_l), rel=0.01)


@pytest.mark.parametrize(
    ("d_over_l", "rel"),
    [
        (1e-6, 1e-12),
        (1e-3, 1e-12),
        (0.3, 1e-12),
        (1.0, 1e-12),
        (7.0, 1e-12),
        (100.0, 1e-12),
        (1e4, 1e-8),
    ],
)
def test_nagaoka_against_mpmath_high_precision(d_over_l, rel):
    # mpmath at 40 digits evaluates the same closed form directly; scipy's route uses
    # Carlson's R_D for K - E, so long coils keep full precision; for very flat coils the
    # stated rounding error (about 1e-16 (D/l)^2, Notes of nagaoka) sets the tolerance.
    assert nagaoka(d_over_l, 1.0) == pytest.approx(nagaoka_mpmath(d_over_l, 1.0), rel=rel)


@pytest.mark.parametrize("d_over_l", [0.1, 0.5, 1.0, 2.0, 5.0])
def test_nagaoka_against_maxwell_loop_integration(d_over_l):
    d, length = d_over_l * 0.2, 0.2
    l_inf_per_n2 = mu_0 * pi * d * d / 4.0 / length
    k_loops = sheet_inductance_by_loops(d, length) / l_inf_per_n2
    assert nagaoka(d, length) == pytest.approx(k_loops, rel=1e-8)


def test_nagaoka_limits():
    # long coil -> 1; flat coil: K -> (2 l/(pi D)) (ln(4 D/l) - 1/2), the thin-ring limit of
    # L = mu_0 N^2 r (ln(8 r/l) - 1/2) (Grover 1946, ch. 14; from memory)
    assert nagaoka(1e-4, 1.0) == pytest.approx(1.0, abs=1e-4)
    x = 1e4  # next term of the series is relatively (l/D)^2 ln(4 D/l) / 8, about 1e-8 here
    assert nagaoka(x, 1.0) == pytest.approx(2.0 / (pi * x) * (np.log(4.0 * x) - 0.5), rel=1e-7)


def test_nagaoka_is_decreasing_and_in_unit_interval():
    x = np.logspace(-4, 4, 200)
    k = nagaoka(x, 1.0)
    assert np.all((k > 0) & (k < 1))
    assert np.all(np.diff(k) < 0)


def test_nagaoka_broadcasts_scalars_and_arrays():
    d = np.array([0.05, 0.1, 0.2])
    k = nagaoka(d, 0.1)
    assert k.shape == (3,)
    assert k[1] == pytest.approx(float(nagaoka(0.1, 0.1)), rel=1e-15)
    grid = nagaoka(d[:, None], np.array([0.1, 0.2])[None, :])
    assert grid.shape == (3, 2)
    assert grid[1, 0] == pytest.approx(k[1], rel=1e-15)
    assert np.ndim(nagaoka(0.1, 0.3)) == 0
    # depends on D/l only (dimensionless)
    assert nagaoka(3.0, 7.0) == pytest.approx(float(nagaoka(0.3, 0.7)), rel=1e-14)


def test_long_empty_coil_inductance_tends_to_mu0_n2_a_over_l():
    # Long solenoid L = mu_0 N^2 A / l (any electromagnetism text); mu_0 from scipy (CODATA).
    d, n = 0.1, 200
    for length, tol in [(10.0, 5e-3), (100.0, 5e-4), (1000.0, 5e-5)]:
        expected = mu_0 * n * n * pi * d * d / 4.0 / length
        assert empty_coil_inductance(d, length, n) == pytest.approx(expected, rel=tol)
    # the shortfall is 4 D / (3 pi l) to first order (Lundin's f1 expansion)
    length = 1000.0
    ratio = empty_coil_inductance(d, length, n) / (mu_0 * n * n * pi * d * d / 4.0 / length)
    assert 1.0 - ratio == pytest.approx(4.0 * d / (3.0 * pi * length), rel=1e-3)


def test_empty_coil_inductance_scales_with_turns_squared():
    ratio = empty_coil_inductance(0.1, 0.2, np.array([5.0, 10.0])) / empty_coil_inductance(
        0.1, 0.2, 5.0
    )
    assert ratio == pytest.approx([1.0, 4.0], rel=1e-14)


@pytest.mark.parametrize("d_over_l", [0.1, 1.0, 4.0])
def test_return_path_in_parallel_gives_nagaoka_inductance(d_over_l):
    d, length, n = d_over_l * 0.3, 0.3, 7
    l_inf = mu_0 * n * n * pi * d * d / 4.0 / length
    l_r = return_path_inductance(d, length, n)
    parallel = l_inf * l_r / (l_inf + l_r)
    assert parallel == pytest.approx(float(empty_coil_inductance(d, length, n)), rel=1e-12)


# --- bad input ---
@pytest.mark.parametrize(
    ("kwargs", "match"),
    [
        ({"diameter": 0.0, "length": 1.0}, "diameter must be > 0"),
        ({"diameter": -0.1, "length": 1.0}, "diameter must be > 0"),
        ({"diameter": 0.1, "length": 0.0}, "length must be > 0"),
        ({"diameter": 0.1, "length": np.nan}, "length must be finite"),
        ({"diameter": np.array([0.1, -1.0]), "length": 1.0}, "index 1"),
        ({"diameter": "big", "length": 1.0}, "diameter must be a real number"),
        ({"diameter": 0.1 + 0.1j, "length": 1.0}, "diameter must be real"),
    ],
)
def test_nagaoka_rejects_bad_sizes(kwargs, match):
    with pytest.raises(ValueError, match=match):
        nagaoka(**kwargs)


@pytest.mark.parametrize("func", [empty_coil_inductance, return_path_inductance])
def test_inductances_reject_bad_turns(func):
    with pytest.raises(ValueError, match="turns must be > 0"):
        func(0.1, 0.1, 0)
