"""Every guarded argument of the analytic functions raises ValueError naming itself."""

import numpy as np
import pytest

from heatcalc import em

GOOD = {
    "resistivity": 1e-6,
    "frequency": 1e3,
    "mu_r": 10.0,
    "radius": 0.02,
    "thickness": 0.01,
    "outer_radius": 0.02,
    "inner_radius": 0.01,
    "skin_depth": 1e-3,
    "h_surface": 1e3,
}

CALLS = {
    "skin_depth": (em.skin_depth, ["resistivity", "frequency", "mu_r"], {}),
    "frequency_for_skin_depth": (
        em.frequency_for_skin_depth,
        ["skin_depth", "resistivity", "mu_r"],
        {},
    ),
    "cylinder_field": (em.cylinder_field, ["radius", "skin_depth"], {"r": 0.01}),
    "cylinder_current_density": (
        em.cylinder_current_density,
        ["h_surface", "radius", "resistivity", "frequency", "mu_r"],
        {"r": 0.01},
    ),
    "cylinder_power_density": (
        em.cylinder_power_density,
        ["h_surface", "radius", "resistivity", "frequency", "mu_r"],
        {"r": 0.01},
    ),
    "cylinder_power_per_area": (
        em.cylinder_power_per_area,
        ["h_surface", "radius", "resistivity", "frequency", "mu_r"],
        {},
    ),
    "cylinder_surface_impedance": (
        em.cylinder_surface_impedance,
        ["radius", "resistivity", "frequency", "mu_r"],
        {},
    ),
    "slab_field": (em.slab_field, ["thickness", "skin_depth"], {"x": 0.001}),
    "slab_current_density": (
        em.slab_current_density,
        ["h_surface", "thickness", "resistivity", "frequency", "mu_r"],
        {"x": 0.001},
    ),
    "slab_power_density": (
        em.slab_power_density,
        ["h_surface", "thickness", "resistivity", "frequency", "mu_r"],
        {"x": 0.001},
    ),
    "slab_power_per_area": (
        em.slab_power_per_area,
        ["h_surface", "thickness", "resistivity", "frequency", "mu_r"],
        {},
    ),
    "slab_surface_impedance": (
        em.slab_surface_impedance,
        ["thickness", "resistivity", "frequency", "mu_r"],
        {},
    ),
    "tube_field": (
        em.tube_field,
        ["outer_radius", "inner_radius", "skin_depth", "mu_r"],
        {"r": 0.015},
    ),
    "tube_current_density": (
        em.tube_current_density,
        ["h_surface", "outer_radius", "inner_radius", "resistivity", "frequency", "mu_r"],
        {"r": 0.015},
    ),
    "tube_power_density": (
        em.tube_power_density,
        ["h_surface", "outer_radius", "inner_radius", "resistivity", "frequency", "mu_r"],
        {"r": 0.015},
    ),
    "tube_power_per_area": (
        em.tube_power_per_area,
        ["h_surface", "outer_radius", "inner_radius", "resistivity", "frequency", "mu_r"],
        {},
    ),
    "tube_surface_impedance": (
        em.tube_surface_impedance,
        ["outer_radius", "inner_radius", "resistivity", "frequency", "mu_r"],
        {},
    ),
}

BAD = {"mu_r": [0.99, 0.0, np.nan], "h_surface": [-1.0, np.inf]}
BAD_DEFAULT = [0.0, -1.0, np.nan, np.inf, [1.0, -2.0]]

CASES = [
    (name, arg, bad)
    for name, (_, args, _) in CALLS.items()
    for arg in args
    for bad in BAD.get(arg, BAD_DEFAULT)
]


@pytest.mark.parametrize(("name", "arg", "bad"), CASES)
def test_guarded_argument_raises_naming_itself(name, arg, bad):
    function, args, extra = CALLS[name]
    kwargs = {a: GOOD[a] for a in args} | extra
    kwargs[arg] = bad
    with pytest.raises(ValueError, match=arg) as info:
        function(**kwargs)
    assert "got" in str(info.value)  # the message quotes the offending value


def test_message_names_value_and_expectation():
    with pytest.raises(ValueError, match=r"resistivity must be > 0 \[ohm m\]; got -1e-08"):
        em.skin_depth(-1e-8, 50.0)
    with pytest.raises(ValueError, match=r"mu_r must be >= 1 \[-\]; got 0.5 at index 1"):
        em.skin_depth(1e-8, 50.0, [1.0, 0.5])


@pytest.mark.parametrize(
    ("call", "name"),
    [
        (lambda: em.cylinder_field(0.03, 0.02, 1e-3), "r"),
        (lambda: em.cylinder_field(-0.001, 0.02, 1e-3), "r"),
        (lambda: em.slab_field(0.006, 0.01, 1e-3), "x"),
        (lambda: em.tube_field(0.021, 0.02, 0.01, 1e-3), "r"),
        (lambda: em.tube_power_per_area(1.0, 0.02, 0.02, 1e-6, 1e3), "inner_radius"),
        (lambda: em.tube_power_per_area(1.0, 0.02, 0.03, 1e-6, 1e3), "inner_radius"),
        (lambda: em.tube_power_factors(1.0, 2.0), "inner_radius_to_skin_depth"),
        (lambda: em.tube_power_factors(-1.0, 0.5), "outer_radius_to_skin_depth"),
        (lambda: em.tube_power_factors(1.0, 0.0), "inner_radius_to_skin_depth"),
        (lambda: em.tube_power_factors(2.0, 1.0, 0.5), "mu_r"),
        (lambda: em.cylinder_power_factors(0.0), "radius_to_skin_depth"),
        (lambda: em.slab_power_factors(-1.0), "thickness_to_skin_depth"),
        (lambda: em.skin_depth(1j, 50.0), "resistivity"),
        (lambda: em.skin_depth("copper", 50.0), "resistivity"),
    ],
)
def test_positions_radii_and_types(call, name):
    with pytest.raises(ValueError, match=name):
        call()
