"""Skin depth: handbook resistivities, the 503 rule, broadcasting, monotonic trends."""

import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st
from scipy.constants import mu_0, pi

from heatcalc.em import frequency_for_skin_depth, skin_depth

# Resistivities at 293 K: CRC Handbook of Chemistry and Physics, "Electrical resistivity of pure
# metals" (after Matula 1979 and Desai 1984) -- from memory.
RHO_COPPER = 1.678e-8
RHO_ALUMINIUM = 2.650e-8


def test_copper_60_hz_published_value():
    # 8.42 mm for copper at 60 Hz (CHECKS.md from the CRC resistivity; commonly quoted value,
    # from memory); printed to 3 digits, so tolerance half a unit of the last digit.
    assert skin_depth(RHO_COPPER, 60.0) == pytest.approx(8.42e-3, abs=0.005e-3)


def test_aluminium_50_hz_published_value():
    # 11.6 mm for aluminium at 50 Hz (CRC resistivity; commonly quoted value, from memory).
    assert skin_depth(RHO_ALUMINIUM, 50.0) == pytest.approx(11.6e-3, abs=0.05e-3)


@pytest.mark.parametrize(
    ("rho", "frequency"),
    [(RHO_COPPER, 50.0), (RHO_COPPER, 60.0), (RHO_COPPER, 1e4), (RHO_ALUMINIUM, 50.0),
     (RHO_ALUMINIUM, 60.0), (RHO_ALUMINIUM, 1e4)],
)  # fmt: skip
def test_503_rule(rho, frequency):
    # Rule of thumb delta = 503 sqrt(rho/(mu_r f)) (common practice, no source); the exact
    # constant is 1/sqrt(pi mu_0) = 503.29 (scipy.constants). 503 is good to 0.06 %.
    assert skin_depth(rho, frequency) == pytest.approx(503.0 * np.sqrt(rho / frequency), rel=1e-3)
    assert skin_depth(rho, frequency) == pytest.approx(
        np.sqrt(rho / frequency) / np.sqrt(pi * mu_0), rel=1e-14
    )


def test_constant_503_from_scipy_constants():
    # 1/sqrt(pi mu_0) = 503.29 (lib: scipy.constants; CODATA mu_0, so compare to the printed
    # digits, not to 4 pi 1e-7). CHECKS.md writes 1/(pi sqrt(mu_0)), which is 283.95: a slip.
    assert 1.0 / np.sqrt(pi * mu_0) == pytest.approx(503.29, abs=0.005)
    assert skin_depth(1.0, 1.0) == pytest.approx(503.29, abs=0.005)


def test_copper_10_khz_and_permeability_scaling():
    # 503 rule (common practice): copper at 10 kHz about 0.65 mm; steel-like mu_r = 100
    # divides the skin depth by 10.
    assert skin_depth(RHO_COPPER, 1e4) == pytest.approx(0.652e-3, abs=0.001e-3)
    assert skin_depth(RHO_COPPER, 1e4, 100.0) == pytest.approx(
        skin_depth(RHO_COPPER, 1e4) / 10.0, rel=1e-14
    )


def test_broadcasting_and_scalar_return():
    scalar = skin_depth(1e-7, 1e3)
    assert np.ndim(scalar) == 0
    rho = np.array([[1e-8], [1e-7], [1e-6]])
    f = np.array([50.0, 1e3, 1e4, 1e5])
    grid = skin_depth(rho, f, 1.0)
    assert grid.shape == (3, 4)
    assert grid[1, 1] == pytest.approx(scalar, rel=1e-15)


def test_frequency_for_skin_depth_inverts_skin_depth():
    f = np.array([50.0, 3e3, 4e5])
    delta = skin_depth(1.1e-6, f, 20.0)
    assert frequency_for_skin_depth(delta, 1.1e-6, 20.0) == pytest.approx(f, rel=1e-13)


_rho = st.floats(1e-9, 1e-4)
_f = st.floats(1e-1, 1e7)
_mu = st.floats(1.0, 5e3)
_factor = st.floats(1.01, 100.0)


@settings(max_examples=60, deadline=None)
@given(_rho, _f, _mu, _factor)
def test_monotonic_in_each_argument(rho, f, mu, factor):
    # Raising resistivity raises the skin depth; raising frequency or permeability lowers it
    # (trade, CHECKS.md; follows from delta = sqrt(rho/(pi f mu_0 mu_r))).
    base = skin_depth(rho, f, mu)
    assert skin_depth(rho * factor, f, mu) > base
    assert skin_depth(rho, f * factor, mu) < base
    assert skin_depth(rho, f, mu * factor) < base
