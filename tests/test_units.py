"""Units at the job boundary: parsing, dimension errors, temperatures, display."""

import numpy as np
import pytest
from scipy import constants

from heatcalc.units import (
    Q_,
    UnitsError,
    format_value,
    parse_quantity,
    temperature,
    temperature_difference,
    to_si,
)


@pytest.mark.parametrize(
    ("text", "unit", "expected"),
    [
        ("75 mm", "m", 0.075),
        # 1 in = 25.4 mm exactly (international inch, 1959; NIST SP 811, 2008, appendix B)
        ("3 in", "m", 3 * 0.0254),
        ("450 kg/h", "kg/s", 0.125),
        ("25 kHz", "Hz", 25e3),
        ("1.2 MW", "W", 1.2e6),
        ("2.5 t/h", "kg/s", 2500 / 3600),
        ("0.17 uohm*m", "ohm*m", 0.17e-6),
    ],
)
def test_to_si_parses_strings(text, unit, expected):
    assert to_si(text, unit, name="x") == pytest.approx(expected, rel=1e-12)


def test_to_si_accepts_quantities_and_arrays():
    assert to_si(Q_(2, "ft"), "m", name="length") == pytest.approx(0.6096)  # NIST SP 811
    arr = to_si(Q_(np.array([1.0, 2.0]), "kW"), "W", name="power")
    np.testing.assert_allclose(arr, [1000.0, 2000.0])


@pytest.mark.parametrize("bare", [75, 75.0, np.float64(3.0), "75", [1, 2]])
def test_bare_number_is_refused_naming_the_argument(bare):
    with pytest.raises(UnitsError, match=r"diameter=.*no unit"):
        to_si(bare, "m", name="diameter")


def test_wrong_dimension_names_argument_value_and_expected():
    with pytest.raises(UnitsError, match=r"frequency='75 mm'.*\[length\].*1 / \[time\]"):
        to_si("75 mm", "Hz", name="frequency")


@pytest.mark.parametrize("bad", ["", "abc", "3 furlongz", "mm 75"])
def test_unreadable_text(bad):
    with pytest.raises(UnitsError, match="radius="):
        parse_quantity(bad, name="radius")


def test_temperature_scales():
    # ITS-90 / SI: T[K] = t[degC] + 273.15; t[degF] = 1.8 t[degC] + 32 (NIST SP 811, 2008)
    assert temperature("1200 degC", name="t") == pytest.approx(1473.15)
    assert temperature("2192 degF", name="t") == pytest.approx(1473.15)
    assert temperature("-40 degF", name="t") == pytest.approx(233.15)
    assert temperature(Q_(300, "K"), name="t") == 300.0
    assert temperature("0 degC", name="t") == pytest.approx(constants.zero_Celsius)


def test_temperature_round_trip_degc_degf_k():
    for t_c in (-20.0, 20.0, 770.0, 1250.0):
        kelvin = temperature(Q_(t_c, "degC"), name="t")
        back_f = Q_(kelvin, "K").to("degF").magnitude
        assert temperature(Q_(back_f, "degF"), name="t") == pytest.approx(kelvin, abs=1e-9)
        assert Q_(kelvin, "K").to("degC").magnitude == pytest.approx(t_c, abs=1e-9)


def test_temperature_errors():
    with pytest.raises(UnitsError, match="target=1200 has no unit"):
        temperature(1200, name="target")
    with pytest.raises(UnitsError, match="target='5 m'.*expected a temperature"):
        temperature("5 m", name="target")
    with pytest.raises(UnitsError, match="temperature difference"):
        temperature("50 delta_degC", name="target")
    with pytest.raises(UnitsError, match="below absolute zero"):
        temperature("-300 degC", name="target")


def test_temperature_differences_have_no_offset():
    assert temperature_difference("50 delta_degC", name="dt") == pytest.approx(50.0)
    assert temperature_difference("50 K", name="dt") == pytest.approx(50.0)
    # 1 degF interval = 5/9 K (NIST SP 811, 2008)
    assert temperature_difference("90 delta_degF", name="dt") == pytest.approx(50.0)
    with pytest.raises(UnitsError, match="dt='50 degC'.*absolute"):
        temperature_difference("50 degC", name="dt")
    # difference of two absolute temperatures through pint keeps no offset
    d = Q_(1200, "degC") - Q_(1150, "degC")
    assert temperature_difference(d, name="dt") == pytest.approx(50.0)


def test_offset_temperature_refused_by_to_si():
    with pytest.raises(UnitsError, match="offset temperature"):
        to_si("20 degC", "K", name="t")


@pytest.mark.parametrize(
    ("value", "kind", "expected"),
    [
        (0.0754, "length", "75.4 mm"),
        (25e3, "frequency", "25.0 kHz"),
        (50.0, "frequency", "50.0 Hz"),
        (152_300.0, "power", "152 kW"),
        (1473.15, "temperature", "1200 °C"),
        (1.062e6, "specific_energy", "295 kWh/t"),  # 1 kWh/t = 3600 J/kg
        (0.125, "mass_rate", "450 kg/h"),
    ],
)
def test_format_value(value, kind, expected):
    assert format_value(value, kind) == expected


def test_format_value_unknown_kind():
    with pytest.raises(ValueError, match="kind='weight'"):
        format_value(1.0, "weight")
