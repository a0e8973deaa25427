"""Timing of the coil circuit: one operating point and a 200-point frequency sweep.

Run: /work/venv/bin/python benchmarks/bench_coil.py
Prints medians over repeated runs and the ratio of the vectorised sweep to 200 single
evaluations.
"""

from __future__ import annotations

import statistics
import time

import numpy as np

from heatcalc.coil import (
    CylinderWorkpiece,
    RectangularTube,
    SolenoidCoil,
    coil_circuit,
    frequency_sweep,
)

# invented scenario: billet heater coil, 100 mm hot steel billet
COIL = SolenoidCoil(12, 0.3, 0.14, RectangularTube(0.02, 0.012, 0.0015), 1.85e-8)
BILLET = CylinderWorkpiece(0.05, 0.3, 1.2e-6)
FREQUENCIES = np.logspace(2, 5, 200)


def _median_seconds(func, repeats: int, inner: int) -> float:
    times = []
    for _ in range(repeats):
        start = time.perf_counter()
        for _ in range(inner):
            func()
        times.append((time.perf_counter() - start) / inner)
    return statistics.median(times)


def main() -> None:
    coil_circuit(COIL, BILLET, 3e3, workpiece_power=1e5)  # warm-up (imports, caches)
    frequency_sweep(COIL, BILLET, FREQUENCIES)
    single = _median_seconds(
        lambda: coil_circuit(COIL, BILLET, 3e3, workpiece_power=1e5), repeats=15, inner=50
    )
    sweep = _median_seconds(lambda: frequency_sweep(COIL, BILLET, FREQUENCIES), 15, 5)
    print(f"one circuit evaluation (coil_circuit): median {single * 1e6:9.1f} us")
    print(f"200-point frequency sweep:            median {sweep * 1e3:9.3f} ms")
    print(f"ratio sweep / (200 x single):         {sweep / (200 * single):9.3f}")


if __name__ == "__main__":
    main()
