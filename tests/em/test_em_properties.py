"""Property-based checks (hypothesis) of the analytic solutions."""

import numpy as np
from hypothesis import given, settings
from hypothesis import strategies as st

from heatcalc.em import (
    cylinder_power_per_area,
    cylinder_surface_impedance,
    skin_depth,
    slab_power_per_area,
    slab_surface_impedance,
    tube_power_per_area,
    tube_surface_impedance,
)

rho = st.floats(1e-9, 1e-4)
freq = st.floats(1e-2, 1e7)
mu = st.floats(1.0, 2e3)
size = st.floats(1e-4, 1.0)
field = st.floats(1e-2, 1e6)
fraction = st.floats(1e-3, 0.999)

SETTINGS = settings(max_examples=60, deadline=None)


@SETTINGS
@given(field, size, rho, freq, mu, fraction)
def test_power_per_area_positive_and_finite(h, a, r, f, m, q):
    for p in (
        cylinder_power_per_area(h, a, r, f, m),
        slab_power_per_area(h, a, r, f, m),
        tube_power_per_area(h, a, q * a, r, f, m),
    ):
        assert np.isfinite(p) and p > 0


@SETTINGS
@given(size, rho, freq, mu, fraction)
def test_surface_impedance_in_first_quadrant_and_bounded(a, r, f, m, q):
    # Re, Im > 0 (absorbing, inductive). A plate absorbs at most coth(pi/2) = 1.0903 times the
    # thick-conductor value rho/delta (maximum of F at x = pi, Davies 1990); a solid cylinder
    # stays below it, approaching 1 - delta/(2a) from below (CHECKS.md large-a limit).
    z_thick = r / skin_depth(r, f, m)
    for z in (
        cylinder_surface_impedance(a, r, f, m),
        slab_surface_impedance(a, r, f, m),
        tube_surface_impedance(a, q * a, r, f, m),
    ):
        assert z.real > 0 and z.imag > 0
    assert cylinder_surface_impedance(a, r, f, m).real < z_thick
    assert slab_surface_impedance(a, r, f, m).real <= 1.0904 * z_thick


@SETTINGS
@given(field, size, rho, freq, mu, st.floats(1.01, 10.0))
def test_power_scales_with_field_squared(h, a, r, f, m, k):
    p1 = cylinder_power_per_area(h, a, r, f, m)
    p2 = cylinder_power_per_area(k * h, a, r, f, m)
    assert np.isclose(p2, k**2 * p1, rtol=1e-12)
