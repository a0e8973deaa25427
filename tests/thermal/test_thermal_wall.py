"""Steady conduction through cylindrical layers.

Outside references:
* scipy.integrate.solve_ivp on the radial conduction equation, as an independent route;
* the plane-wall limit q = k A dT / thickness for a thin wall (Incropera & DeWitt, Fundamentals
  of Heat and Mass Transfer, 6th ed., 2007, eq. 3.4);
* the film resistance 1/(h A) (Incropera & DeWitt 2007, eq. 3.9).
"""

import numpy as np
import pytest
from scipy.integrate import solve_ivp

from heatcalc.thermal import cylindrical_wall


def shooting_heat_flow(radii, ks, t_in, t_out, length):
    """Integrate dT/dr = -Q/(2 pi k L r) layer by layer (solve_ivp); T is linear in Q."""

    def drop_per_watt():
        temps, t = [0.0], 0.0
        for r0, r1, kk in zip(radii[:-1], radii[1:], ks, strict=True):
            sol = solve_ivp(
                lambda r, y, kk=kk: [-1.0 / (2 * np.pi * kk * length * r)],
                (r0, r1),
                [t],
                rtol=1e-12,
                atol=1e-14,
            )
            t = sol.y[0, -1]
            temps.append(t)
        return np.array(temps)

    unit = drop_per_watt()  # temperature change per watt of outward flow
    q = (t_out - t_in) / unit[-1]
    return q, t_in + q * unit


def test_three_layers_against_ode_integration():
    radii, ks = [0.15, 0.16, 0.20, 0.23], [20.0, 1.2, 0.15]
    wall = cylindrical_wall(radii, ks, 1723.15, 308.15, length=0.8)
    q, temps = shooting_heat_flow(radii, ks, 1723.15, 308.15, 0.8)
    assert wall.heat_flow == pytest.approx(q, rel=1e-8)
    np.testing.assert_allclose(wall.interface_temperatures, temps, rtol=1e-8)
    assert wall.interface_temperatures[0] == 1723.15
    assert wall.interface_temperatures[-1] == 308.15


def test_thin_wall_tends_to_plane_wall():
    r, t, k = 0.5, 1e-4, 2.0
    wall = cylindrical_wall([r, r + t], [k], 400.0, 300.0, length=1.0)
    area = 2 * np.pi * (r + t / 2)
    assert wall.heat_flow == pytest.approx(k * area * 100.0 / t, rel=1e-8)


def test_films_add_series_resistances():
    bare = cylindrical_wall([0.1, 0.12], [1.5], 1500.0, 300.0)
    filmed = cylindrical_wall([0.1, 0.12], [1.5], 1500.0, 300.0, film_inner=500.0,
                              film_outer=3000.0)  # fmt: skip
    r_in = 1 / (500.0 * 2 * np.pi * 0.1)
    r_out = 1 / (3000.0 * 2 * np.pi * 0.12)
    assert filmed.total_resistance == pytest.approx(bare.total_resistance + r_in + r_out)
    assert filmed.labels == ("inner film", "layer 1", "outer film")
    drops = -np.diff(filmed.interface_temperatures)
    np.testing.assert_allclose(drops, filmed.heat_flow * filmed.resistances, rtol=1e-12)
    frame = filmed.to_frame()
    assert frame["drop_K"].sum() == pytest.approx(1200.0)
    assert "<table" in filmed._repr_html_()


def test_heat_flow_inwards_is_negative():
    assert cylindrical_wall([0.1, 0.2], [1.0], 300.0, 400.0).heat_flow < 0


def test_bad_input_messages():
    with pytest.raises(ValueError, match="radii must increase strictly"):
        cylindrical_wall([0.2, 0.1], [1.0], 400.0, 300.0)
    with pytest.raises(ValueError, match="radii must be > 0"):
        cylindrical_wall([0.0, 0.1], [1.0], 400.0, 300.0)
    with pytest.raises(ValueError, match="radii must list at least two"):
        cylindrical_wall([0.1], [], 400.0, 300.0)
    with pytest.raises(ValueError, match=r"conductivities must give one value per layer \(2\)"):
        cylindrical_wall([0.1, 0.2, 0.3], [1.0], 400.0, 300.0)
    with pytest.raises(ValueError, match="conductivities must be > 0"):
        cylindrical_wall([0.1, 0.2], [-1.0], 400.0, 300.0)
    with pytest.raises(ValueError, match="t_inner must be an absolute temperature"):
        cylindrical_wall([0.1, 0.2], [1.0], -400.0, 300.0)
    with pytest.raises(ValueError, match="t_outer must be an absolute temperature"):
        cylindrical_wall([0.1, 0.2], [1.0], 400.0, 0.0)
    with pytest.raises(ValueError, match="length must be > 0"):
        cylindrical_wall([0.1, 0.2], [1.0], 400.0, 300.0, length=0.0)
    with pytest.raises(ValueError, match="film_inner must be > 0"):
        cylindrical_wall([0.1, 0.2], [1.0], 400.0, 300.0, film_inner=0.0)
    with pytest.raises(ValueError, match="film_outer must be > 0"):
        cylindrical_wall([0.1, 0.2], [1.0], 400.0, 300.0, film_outer=-2.0)
