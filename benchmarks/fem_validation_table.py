"""Validation table: heatcalc's coil-workpiece circuit against the axisymmetric FEM model.

Run from the repository root (needs scikit-fem, the test extra):

    python benchmarks/fem_validation_table.py > fem_table.md            # all, ~12 min
    python benchmarks/fem_validation_table.py --subset > fem_table.md   # magnetic rows and
                                                          # a quarter of the others, ~6 min

Prints Markdown tables (pasted into docs/fem_validation.md): for each case the relative
difference circuit/FEM - 1 of the workpiece power at equal coil current, of the reactance and
of |Z|, the efficiency of each, the circuit's ratio of interior impedance to return-path
reactance |Z_i|/X_r (``interior_to_return_ratio``), the power difference of the
empty-coil end correction (``method="nagaoka_return_path"``, the default before the
permeable return path), and an estimate of the FEM's own numerical error (change
between two meshes). Takes a few minutes on two cores.
"""

from __future__ import annotations

import itertools
import sys
import time
from pathlib import Path

import numpy as np

sys.path.insert(0, str(Path(__file__).resolve().parents[1] / "tests" / "fem"))

from axisym_fem import MeshSettings
from crosscheck_cases import CrossCheckCase, compare

from heatcalc.coil import coil_impedance

LENGTHS = (0.5, 1.0, 2.0, 4.0, 8.0)
BORES = (1.1, 1.4, 2.0)
SKIN = (1.0, 3.5, 10.0, 50.0)
FINE = MeshSettings(refine=1.5)
COARSE = MeshSettings()


def row(case):
    fine = compare(case, mesh=FINE)
    coarse = compare(case, mesh=COARSE)
    fem_error = abs(fine["z_fem"] / coarse["z_fem"] - 1.0)
    coil, work, f, _, _ = case.geometry()
    z_long = complex(coil_impedance(coil, work, f, method="long_coil").load)
    parts = coil_impedance(coil, work, f)
    fine["interior_to_return"] = float(parts.interior_to_return_ratio)
    z_empty = complex(coil_impedance(coil, work, f, method="nagaoka_return_path").load)
    fine["empty_return_power_error"] = z_empty.real / fine["z_fem"].real - 1.0
    fine["long_coil_power_error"] = z_long.real / fine["z_fem"].real - 1.0
    fine["fem_mesh_change"] = fem_error
    return fine


def pct(x):
    return f"{100 * x:+.1f}"


def table(cases, title):
    print(f"\n### {title}\n")
    print(
        "| l_c/D_c | D_c/D_w | D_w/delta | mu_r | workpiece | power % | reactance % | |Z| % "
        "| eta circuit | eta FEM | empty-coil return power % | long-coil power % "
        "| power beyond coil ends % | |Z_i|/X_r | FEM mesh change |"
    )
    print("|" + "---|" * 15)
    results = []
    for case in cases:
        r = row(case)
        results.append((case, r))
        print(
            f"| {case.length_to_diameter:g} | {case.bore_ratio:g} | "
            f"{case.diameter_to_skin_depth:g} | {case.mu_r:g} | {case.workpiece} | "
            f"{pct(r['power_error'])} | {pct(r['reactance_error'])} | "
            f"{pct(r['impedance_error'])} | {r['eta_circuit']:.3f} | {r['eta_fem']:.3f} | "
            f"{pct(r['empty_return_power_error'])} | {pct(r['long_coil_power_error'])} | "
            f"{100 * r['power_outside_coil']:.1f} | "
            f"{r['interior_to_return']:.2f} | {r['fem_mesh_change']:.0e} |",
            flush=True,
        )
    return results


def summary(results, title):
    print(f"\n### {title}: largest |difference| by coil length\n")
    print(
        "| l_c/D_c | power % | reactance % | |Z| % | efficiency (points) "
        "| empty-coil return power % | cases |"
    )
    print("|---|---|---|---|---|---|---|")
    for length in sorted({c.length_to_diameter for c, _ in results}):
        sel = [r for c, r in results if c.length_to_diameter == length]

        def worst(key, sel=sel):
            return max(abs(r[key]) for r in sel)

        print(
            f"| {length:g} | {100 * worst('power_error'):.1f} | "
            f"{100 * worst('reactance_error'):.1f} | {100 * worst('impedance_error'):.1f} | "
            f"{100 * worst('efficiency_difference'):.1f} | "
            f"{100 * worst('empty_return_power_error'):.1f} | {len(sel)} |"
        )


def by_interior_ratio(results):
    print("\n### All sheet cases: largest |difference| by the circuit's |Z_i|/X_r\n")
    print("| |Z_i|/X_r | power % (billet) | power % (bar) | reactance % | cases |")
    print("|---|---|---|---|---|")
    edges = (0.0, 0.03, 0.1, 0.3, 1.0, np.inf)  # 0.3: END_CORRECTION_WARNING_RATIO
    for low, high in zip(edges, edges[1:], strict=False):
        sel = [(c, r) for c, r in results if low <= r["interior_to_return"] < high]
        if not sel:
            continue

        def worst(key, kind=None, sel=sel):
            vals = [abs(r[key]) for c, r in sel if kind is None or c.workpiece == kind]
            return f"{100 * max(vals):.1f}" if vals else "-"

        print(
            f"| {low:g} to {high:g} | {worst('power_error', 'billet')} | "
            f"{worst('power_error', 'bar')} | {worst('reactance_error')} | {len(sel)} |"
        )


def main():
    start = time.perf_counter()
    subset = "--subset" in sys.argv[1:]
    main_cases = [
        CrossCheckCase(length, bore, skin, 1.0, work)
        for length, bore, skin, work in itertools.product(LENGTHS, BORES, SKIN, ("billet", "bar"))
        if not subset or (bore != 1.4 and skin in (1.0, 10.0) and length != 2.0)
    ]
    res = table(main_cases, "Non-magnetic workpiece (mu_r = 1), uniform current sheet")
    summary(res, "Non-magnetic")

    magnetic = [
        CrossCheckCase(length, bore, skin, mu_r, work)
        for mu_r, length, bore, skin, work in itertools.product(
            (10.0, 100.0), (1.0, 4.0, 8.0), (1.1, 1.4), (3.5, 10.0, 50.0), ("billet", "bar")
        )
    ] + [
        CrossCheckCase(length, 2.0, skin, mu_r, work)
        for mu_r, length, skin, work in itertools.product(
            (3.0, 30.0), (4.0, 8.0), (3.5, 10.0), ("billet", "bar")
        )
    ]
    res_m = table(magnetic, "Magnetic workpiece (constant mu_r), uniform current sheet")
    summary(res_m, "Magnetic")

    by_interior_ratio(res + res_m)

    if not subset:
        pitch = [
            CrossCheckCase(length, bore, 10.0, 1.0, "billet", turn_fill=0.8)
            for length, bore in itertools.product((1.0, 4.0), (1.1, 1.4, 2.0))
        ]
        table(
            pitch, "Ten discrete turns (80 % axial fill) instead of a uniform sheet, D_w/delta 10"
        )

    errs = [abs(r["fem_mesh_change"]) for _, r in res + res_m]
    print(
        f"\nFEM mesh change (refine 1 -> 1.5), all cases: median {np.median(errs):.1e}, "
        f"max {max(errs):.1e}; run time {time.perf_counter() - start:.0f} s"
    )


if __name__ == "__main__":
    main()
