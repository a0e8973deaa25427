"""Timing of the electromagnetic core (run: python benchmarks/bench_em.py).

Prints the median of several timeit repeats for each case and its ratio to the target
(ratio < 1 means faster than the target).
"""

from __future__ import annotations

import timeit

import numpy as np
from scipy.constants import mu_0, pi

from heatcalc.em import cylinder_power_per_area, radial_mesh, skin_depth, solve_radial_field

JS, MU_I = 1.8, 500.0  # invented arctan magnetisation curve, as in the tests


def mu_arctan(h_peak):
    h = np.asarray(h_peak, dtype=float)
    x = pi * (MU_I - 1.0) * mu_0 * h / (2.0 * JS)
    safe = np.where(x > 1e-6, x, 1.0)
    return 1.0 + (MU_I - 1.0) * np.where(x > 1e-6, np.arctan(safe) / safe, 1.0 - x**2 / 3.0)


def median_seconds(function, number, repeat=7):
    times = timeit.repeat(function, number=number, repeat=repeat)
    return float(np.median(times)) / number


def main():
    frequencies = np.geomspace(10.0, 1e6, 10_000)
    rho = 2e-7
    mesh_linear = radial_mesh("cylinder", 0.02, n=200, skin_depth=skin_depth(rho, 1e4, 50.0))
    mesh_steel = radial_mesh("cylinder", 0.02, n=200, skin_depth=0.5 * skin_depth(rho, 1e4, 30.0))
    nonlinear = solve_radial_field(mesh_steel, rho, mu_arctan, 1e4, 3e4)
    cases = [
        (
            "cylinder_power_per_area, 10,000 frequencies",
            lambda: cylinder_power_per_area(3e4, 0.02, rho, frequencies, 50.0),
            20,
            50e-3,
        ),
        (
            "solve_radial_field, 200 nodes, uniform properties",
            lambda: solve_radial_field(mesh_linear, rho, 50.0, 1e4, 3e4),
            500,
            1e-3,
        ),
        (
            f"solve_radial_field, 200 nodes, arctan mu_r ({nonlinear.iterations} iterations)",
            lambda: solve_radial_field(mesh_steel, rho, mu_arctan, 1e4, 3e4),
            20,
            10e-3,
        ),
    ]
    print(f"{'case':<66} {'median':>10} {'target':>9} {'ratio':>6}")
    for label, function, number, target in cases:
        t = median_seconds(function, number)
        print(f"{label:<66} {t * 1e3:8.3f} ms {target * 1e3:6.1f} ms {t / target:6.3f}")


if __name__ == "__main__":
    main()
