"""Magnetisation model: Kuz'min saturation curve and the arctan B-H curve."""

import numpy as np
import pytest
from scipy.constants import mu_0

from heatcalc.materials import MagnetisationModel

IRON = MagnetisationModel(1043.0, 2.15, 400.0, kuzmin_s=0.35, kuzmin_p=4.0)


def test_saturation_at_low_temperature_and_zero_above_curie():
    # Saturation flux density of iron ~2.15 T at room temperature (CHECKS.md, book, from memory)
    assert IRON.saturation(0.0) == pytest.approx(2.15)
    assert IRON.saturation(293.15) == pytest.approx(2.15, rel=0.02)
    assert IRON.saturation(1043.0) == 0.0
    assert IRON.saturation(1200.0) == 0.0


def test_kuzmin_shape_for_iron_at_half_curie():
    # Kuz'min, Phys. Rev. Lett. 94, 107204 (2005), eq. (7) with s = 0.35, p = 4 for Fe
    # (from memory): m(0.5) = (1 - 0.35*0.5**1.5 - 0.65*0.5**4)**(1/3)
    expected = (1 - 0.35 * 0.5**1.5 - 0.65 * 0.5**4) ** (1 / 3)
    assert IRON.saturation(0.5 * 1043.0) / 2.15 == pytest.approx(expected, rel=1e-12)
    # Measured reduced magnetisation of iron at T/Tc = 0.5 is about 0.94 (Crangle & Goodman,
    # Proc. R. Soc. A 321, 1971; from memory, +-0.02)
    assert IRON.saturation(0.5 * 1043.0) / 2.15 == pytest.approx(0.94, abs=0.02)


def test_bh_curve_limits():
    h = np.array([1e-3, 10.0])
    # small field: slope mu_i mu0 (the model's definition)
    np.testing.assert_allclose(IRON.flux_density(h, 293.15) / (mu_0 * h), 400.0, rtol=1e-3)
    # large field: B -> J_s + mu0 H (saturation)
    big = 1e8
    js = IRON.saturation(293.15)
    assert IRON.flux_density(big, 293.15) == pytest.approx(js + mu_0 * big, rel=1e-3)


def test_permeability_falls_with_field_and_to_one_above_curie():
    h = np.logspace(0, 6, 25)
    mu = IRON.relative_permeability(h, 293.15)
    assert np.all(np.diff(mu) < 0)
    assert mu[0] == pytest.approx(400.0, rel=1e-3)
    assert np.all(mu > 1.0)
    np.testing.assert_array_equal(IRON.relative_permeability(h, 1100.0), 1.0)
    # consistent with B/(mu0 H)
    np.testing.assert_allclose(mu, IRON.flux_density(h, 293.15) / (mu_0 * h), rtol=1e-12)


def test_permeability_falls_as_curie_is_approached_at_fixed_field():
    t = np.linspace(300.0, 1040.0, 30)
    mu = IRON.relative_permeability(2e4, t)
    assert np.all(np.diff(mu) <= 1e-12)


@pytest.mark.parametrize(
    ("kwargs", "match"),
    [
        ({"curie_temperature": -1.0}, "curie_temperature"),
        ({"saturation_flux_density": 0.0}, "saturation_flux_density"),
        ({"initial_relative_permeability": 0.5}, "initial_relative_permeability"),
    ],
)
def test_bad_parameters(kwargs, match):
    base = {
        "curie_temperature": 1043.0,
        "saturation_flux_density": 2.0,
        "initial_relative_permeability": 300.0,
    }
    base.update(kwargs)
    with pytest.raises(ValueError, match=match):
        MagnetisationModel(**base)


def test_negative_field_refused():
    with pytest.raises(ValueError, match="h_peak"):
        IRON.relative_permeability(-1.0, 300.0)
