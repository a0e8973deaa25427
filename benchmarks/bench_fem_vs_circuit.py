"""The same coil and workpiece solved by heatcalc's circuit and by the axisymmetric FEM model.

Run from the repository root (needs scikit-fem, the test extra):

    python benchmarks/bench_fem_vs_circuit.py

For a long and a short coil (invented bar heater, 50 mm hot steel bar, ten-turn coil):
median wall time of each route, their ratio, and the agreement of workpiece power (at equal
coil current), reactance, |Z| and efficiency.
"""

from __future__ import annotations

import statistics
import sys
import time
from pathlib import Path

sys.path.insert(0, str(Path(__file__).resolve().parents[1] / "tests" / "fem"))

from axisym_fem import MeshSettings, solve_coil
from crosscheck_cases import CrossCheckCase

from heatcalc.coil import coil_circuit

CASES = {
    "long coil (l/D 4, D_c/D_w 1.4, D_w/delta 10)": CrossCheckCase(4.0, 1.4, 10.0),
    "short coil (l/D 1, D_c/D_w 1.4, D_w/delta 10)": CrossCheckCase(1.0, 1.4, 10.0),
}
CURRENT = 1000.0  # A RMS


def _median_seconds(func, repeats, inner=1):
    times = []
    for _ in range(repeats):
        start = time.perf_counter()
        for _ in range(inner):
            func()
        times.append((time.perf_counter() - start) / inner)
    return statistics.median(times)


def main():
    mesh = MeshSettings()
    for name, case in CASES.items():
        coil, work, f, winding, load = case.geometry()
        circ = coil_circuit(coil, work, f, coil_current=CURRENT)
        fem = solve_coil(winding, load, f, current=CURRENT, mesh=mesh)
        t_circ = _median_seconds(
            lambda coil=coil, work=work, f=f: coil_circuit(coil, work, f, coil_current=CURRENT),
            repeats=15,
            inner=50,
        )
        t_fem = _median_seconds(
            lambda winding=winding, load=load, f=f: solve_coil(
                winding, load, f, current=CURRENT, mesh=mesh
            ),
            repeats=5,
        )
        x_circ = circ.load_reactance
        r_cu = circ.copper_resistance
        r_fem = fem.impedance.real
        eta_fem = r_fem / (r_fem + r_cu)
        z_circ = abs(complex(circ.load_resistance, x_circ))
        print(f"{name}, f = {f:.0f} Hz, I = {CURRENT:.0f} A, FEM {fem.n_dofs} unknowns")
        print(f"  heatcalc circuit  median {t_circ * 1e6:10.1f} us")
        print(f"  FEM (skfem, P2)   median {t_fem * 1e3:10.1f} ms")
        print(f"  ratio FEM/circuit        {t_fem / t_circ:10.0f}")
        print(
            f"  workpiece power   circuit {circ.workpiece_power / 1e3:9.3f} kW  "
            f"FEM {fem.workpiece_power / 1e3:9.3f} kW  "
            f"circuit/FEM - 1 {100 * (circ.workpiece_power / fem.workpiece_power - 1):+.2f} %"
        )
        print(
            f"  reactance         circuit {x_circ * 1e3:9.4f} mOhm FEM "
            f"{fem.impedance.imag * 1e3:9.4f} mOhm circuit/FEM - 1 "
            f"{100 * (x_circ / fem.impedance.imag - 1):+.2f} %"
        )
        print(f"  |Z| circuit/FEM - 1      {100 * (z_circ / abs(fem.impedance) - 1):+.2f} %")
        print(
            f"  efficiency        circuit {circ.efficiency:.4f}  FEM {eta_fem:.4f} "
            "(same copper resistance)"
        )


if __name__ == "__main__":
    main()
