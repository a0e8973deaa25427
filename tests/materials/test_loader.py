"""Loading material files: the built-in library, users' files, and malformed files."""

import numpy as np
import pytest

from heatcalc import materials
from heatcalc.materials import Material, MaterialFileError, OutOfRangeError

GOOD = """
key = "{key}"
name = "Test steel (invented for a loader test)"
category = "steel"
temperature_unit = "degC"
[sources]
X = "invented for a loader test"
[resistivity]
unit = "uohm*m"
temperature = [20, 500, 800, 1200]
value = [0.16, 0.5, 1.1, 1.2]
source = "X"
[density]
unit = "g/cm**3"
temperature = [20, 1200]
value = [7.85, 7.5]
source = ["X", "X"]
[emissivity]
source = "X"
oxidised = 0.8
bright = 0.3
[magnetic]
curie_temperature = 760
saturation_flux_density = 2.0
initial_relative_permeability = 300
source = "X"
"""


def write(tmp_path, text, key="test-steel"):
    p = tmp_path / f"{key}.toml"
    p.write_text(text.format(key=key) if "{key}" in text else text)
    return p


def test_user_file_loads_and_converts_units(tmp_path):
    m = materials.load(write(tmp_path, GOOD))
    assert m.key == "test-steel"
    assert m.resistivity(293.15) == pytest.approx(0.16e-6)
    assert m.density(293.15) == pytest.approx(7850.0)  # g/cm3 -> kg/m3
    assert m.curie_temperature == pytest.approx(1033.15)
    assert m.emissivity("oxidised") == 0.8
    assert m.relative_permeability(1.0, 1100.0) == 1.0
    assert m.temperature_range() == pytest.approx((293.15, 1473.15))
    assert set(m.to_frame()["property"]) == {"resistivity", "density"}
    assert "Curie temperature" in set(m.summary()["quantity"])


def test_range_error_names_material_and_property(tmp_path):
    m = materials.load(write(tmp_path, GOOD))
    with pytest.raises(OutOfRangeError, match="test-steel: resistivity asked at"):
        m.resistivity(np.array([300.0, 1600.0]))


def test_missing_property_and_emissivity_condition(tmp_path):
    m = materials.load(write(tmp_path, GOOD))
    with pytest.raises(ValueError, match="has no specific_heat table"):
        m.specific_heat(300.0)
    with pytest.raises(ValueError, match="surface='polished'.*bright.*oxidised"):
        m.emissivity("polished")
    with pytest.raises(ValueError, match="ambiguous"):
        m.emissivity()


@pytest.mark.parametrize(
    ("change", "match"),
    [
        (('source = "X"\n[density]', 'source = "Y"\n[density]'), "names source 'Y'"),
        (("g/cm**3", "g/cm"), r"\[density\] unit="),
        (("value = [7.85, 7.5]", "value = [7.85]"), "equal length"),
        (('temperature_unit = "degC"', 'temperature_unit = "C"'), "temperature_unit="),
        (("oxidised = 0.8", "oxidised = 8"), "must be in"),
        (("[0.16, 0.5, 1.1, 1.2]", "[0.16, 0.5, 1.1]"), "3 points|equal length"),
    ],
)
def test_malformed_files_are_refused(tmp_path, change, match):
    old, new = change
    text = GOOD.replace(old, new, 1)
    assert text != GOOD
    with pytest.raises(MaterialFileError, match=match):
        materials.load(write(tmp_path, text))


def test_key_must_match_file_name(tmp_path):
    p = tmp_path / "other-name.toml"
    p.write_text(GOOD.format(key="test-steel"))
    with pytest.raises(MaterialFileError, match="must equal the file name"):
        materials.load(p)


def test_missing_file():
    with pytest.raises(FileNotFoundError, match="path="):
        materials.load("/nonexistent/steel.toml")


def test_builtin_lookup_is_exact():
    keys = materials.available()
    assert keys == sorted(keys)
    assert len(keys) >= 9
    with pytest.raises(KeyError, match="'AISI1045' is not in the library; available:"):
        materials.get("AISI1045")
    m = materials.get(keys[0])
    assert isinstance(m, Material)
    assert materials.get(m) is m


def test_every_builtin_file_loads_and_catalogue_lists_it():
    cat = materials.catalogue()
    assert list(cat["key"]) == materials.available()
    assert cat["sources"].str.len().min() > 10


def test_constant_material():
    m = Material.constant("c", thermal_conductivity=30.0, specific_heat=600.0, density=7000.0)
    np.testing.assert_array_equal(m.thermal_conductivity(np.array([300.0, 1500.0])), 30.0)
    with pytest.raises(ValueError, match="density=-1"):
        Material.constant("c", density=-1.0)
    with pytest.raises(OutOfRangeError):
        m.density(6000.0)


def test_composition_block(tmp_path):
    text = GOOD + '[composition]\nC = 0.45\nMn = 0.75\nsource = "X"\n'
    m = materials.load(write(tmp_path, text))
    assert dict(m.composition) == {"C": 0.45, "Mn": 0.75}
    with pytest.raises(MaterialFileError, match="composition"):
        materials.load(write(tmp_path, text.replace("C = 0.45", "C = 145")))
