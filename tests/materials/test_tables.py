"""Property tables: exact at knots, linear between, monotonic, strict outside the range."""

import warnings

import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from heatcalc.materials import ExtrapolationWarning, OutOfRangeError, PropertyTable

T = np.array([300.0, 500.0, 900.0, 900.0, 1300.0])  # a jump at 900 K
V = np.array([1.0, 3.0, 5.0, 9.0, 10.0])


def table():
    return PropertyTable("demo", "resistivity", T, V, "ohm*m", ("x",) * 5)


def test_exact_at_table_points_and_jump_takes_value_before():
    tab = table()
    np.testing.assert_array_equal(tab(np.array([300.0, 500.0, 1300.0])), [1.0, 3.0, 10.0])
    assert tab(900.0) == 5.0  # at the jump: the value before it (documented)
    assert tab(900.0 + 1e-6) == pytest.approx(9.0, abs=1e-5)


def test_linear_between_points():
    # hand calculation: halfway between (300, 1) and (500, 3) is 2
    assert table()(400.0) == pytest.approx(2.0)
    assert table()(1100.0) == pytest.approx(9.5)


@settings(max_examples=100, deadline=None)
@given(st.lists(st.floats(300, 1300), min_size=2, max_size=20))
def test_monotonic_where_table_is(ts):
    ts = np.sort(np.array(ts))
    vals = table()(ts)
    assert np.all(np.diff(vals) >= -1e-12)
    assert np.all((vals >= 1.0) & (vals <= 10.0))


def test_outside_range_raises_with_range_in_message():
    with pytest.raises(OutOfRangeError, match=r"demo: resistivity asked at 1400.00 K.*1300.00 K"):
        table()(np.array([500.0, 1400.0]))
    with pytest.raises(OutOfRangeError):
        table()(299.0)


def test_extrapolation_only_when_asked_and_then_warns():
    with pytest.warns(ExtrapolationWarning, match="extrapolated"):
        v = table()(1400.0, extrapolate=True)
    assert v == pytest.approx(10.25)  # slope 1/400 per K beyond the last segment
    with warnings.catch_warnings():
        warnings.simplefilter("error")
        table()(1000.0)  # inside: no warning at all


def test_bad_tables_refused():
    with pytest.raises(ValueError, match="must increase"):
        PropertyTable("m", "q", np.array([300.0, 200.0]), np.array([1.0, 2.0]), "u")
    with pytest.raises(ValueError, match="at most twice"):
        PropertyTable("m", "q", np.array([3.0, 3.0, 3.0]), np.array([1.0, 2.0, 3.0]), "u")
    with pytest.raises(ValueError, match="equal length"):
        PropertyTable("m", "q", np.array([3.0, 4.0]), np.array([1.0]), "u")
