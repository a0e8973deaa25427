"""Benchmark of the thermal core (run as a script; prints medians, asserts nothing).

Cases
-----
1. Coupled field + heat transient of a 80 mm AISI 1045 billet through the Curie temperature:
   100 radial nodes, 1 kHz, constant absorbed power 0.9 MW/m2 for 100 s then a 50 s soak in
   air, 1500 steps each (3000 steps). Target: under 0.5 s on one core.
2. The same with constant surface field (constant coil current).
3. Conduction only (surface flux, constant properties), 100 nodes, 3000 steps.
4. Lumped heating of an aluminium charge through melting.

Usage: ``python benchmarks/bench_thermal.py [repeats]``
"""

from __future__ import annotations

import statistics
import sys
import time

from heatcalc import materials
from heatcalc.materials import Material
from heatcalc.thermal import (
    Segment,
    SurfaceLoss,
    heat_segment,
    lumped_heating,
    simulate_heating,
    soak_segment,
)

AIR = SurfaceLoss(emissivity=0.8, t_surroundings=293.15, h_convection=10.0)


def billet(mode: str):
    steel = materials.get("aisi-1045")
    if mode == "power":
        heat = heat_segment(100.0, power_per_area=9e5, frequency=1e3, loss=AIR)
    else:
        heat = heat_segment(100.0, h_surface=6.5e4, frequency=1e3, loss=AIR)
    schedule = [heat, soak_segment(50.0, loss=AIR)]
    return simulate_heating(steel, "cylinder", 0.04, schedule, n_nodes=100, steps_per_segment=1500)


def conduction_only():
    m = Material.constant(thermal_conductivity=40.0, specific_heat=600.0, density=7800.0)
    schedule = [Segment(150.0, "power", 5e5, loss=AIR)] * 2
    return simulate_heating(m, "cylinder", 0.04, schedule, n_nodes=100, steps_per_segment=1500)


def lumped():
    al = materials.get("al-1050")
    loss = SurfaceLoss(emissivity=0.2, t_surroundings=293.15, h_convection=10.0)
    return lumped_heating(al, 100.0, 150e3, 1200.0, area=0.3, loss=loss, stop_at=1023.15)


def median_time(func, repeats: int) -> tuple[float, object]:
    func()  # warm-up: imports, material files, caches
    times, out = [], None
    for _ in range(repeats):
        start = time.perf_counter()
        out = func()
        times.append(time.perf_counter() - start)
    return statistics.median(times), out


def main(repeats: int = 7) -> None:
    target = 0.5
    print(f"heatcalc.thermal benchmark, median of {repeats} runs")
    for name, func in [
        ("billet, constant power", lambda: billet("power")),
        ("billet, constant field", lambda: billet("field")),
    ]:
        t, r = median_time(func, repeats)
        s = r.series
        print(
            f"{name:26s} {t:7.3f} s  ({t / target:4.2f} x the 0.5 s target)  steps "
            f"{len(s) - 1}, field solves {r.field_solves}, Newton iterations "
            f"{r.newton_iterations}; end surface {s['surface'].iloc[-1] - 273.15:.0f} degC, "
            f"centre {s['centre'].iloc[-1] - 273.15:.0f} degC (peak surface "
            f"{s['surface'].max() - 273.15:.0f} degC), closure {r.closure_error:.1e}"
        )
    t, r = median_time(conduction_only, repeats)
    print(f"{'conduction only':26s} {t:7.3f} s  steps {len(r.series) - 1}")
    t, r = median_time(lumped, repeats)
    print(f"{'lumped melt':26s} {t:7.3f} s  rows {len(r.series)}")


if __name__ == "__main__":
    main(int(sys.argv[1]) if len(sys.argv) > 1 else 7)
