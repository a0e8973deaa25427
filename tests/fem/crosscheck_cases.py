"""One coil-workpiece case set up both ways: heatcalc's equivalent circuit and the FEM model.

Shared by ``test_fem_crosscheck.py``, ``benchmarks/fem_validation_table.py`` and
``benchmarks/bench_fem_vs_circuit.py``. A case is given by its dimensionless groups; the
invented scenario behind it is a bar heater at Brackwater Thermal Works (drawing BTW-0417):
50 mm bar, copper tubing coil of ten turns.

Both models see the same geometry, the one heatcalc's circuit states it assumes: a uniform
current sheet of ``N`` turns on the bore face, diameter ``D_c`` and length ``l_c``; a coaxial,
axially centred solid cylinder. The FEM winding is that sheet (``radial_thickness = 0``,
``turn_fill = 1``) unless a pitch is asked for. The circuit's copper resistance is used for
the efficiency of both (the FEM winding is stranded, it has no copper loss of its own), so the
efficiency comparison shows the effect of the workpiece resistance only.
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np
from axisym_fem import CylinderLoad, MeshSettings, Winding, solve_coil
from scipy.constants import mu_0, pi

from heatcalc.coil import CylinderWorkpiece, RectangularTube, SolenoidCoil, coil_impedance

__all__ = ["WORKPIECE_DIAMETER", "CrossCheckCase", "compare"]

WORKPIECE_DIAMETER = 0.05  # m, invented
TURNS = 10
# Annealed copper 1.7241e-8 ohm m at 20 degC (IEC 60028) at about 40 degC, alpha 0.00393 /K.
RHO_COPPER = 1.7241e-8 * (1.0 + 0.00393 * 20.0)
# Plain carbon steel above the Curie point, about 1.2e-6 ohm m (BISRA 1953, +-10 %), and an
# illustrative 5e-7 ohm m for steel below it (the magnetic rows; only the ratio to copper
# enters, through the efficiency).
RHO_HOT = 1.2e-6
RHO_MAGNETIC = 5e-7
BAR_LENGTH_FACTOR = 3.0  # a "bar" is three coil lengths long, centred on the coil


@dataclass(frozen=True)
class CrossCheckCase:
    """length_to_diameter ``l_c/D_c``; bore_ratio ``D_c/D_w``; diameter_to_skin_depth
    ``D_w/delta_w``; mu_r of the workpiece; workpiece "billet" (``l_w = l_c``) or "bar"
    (``l_w = 3 l_c``); turn_fill < 1 gives discrete turns (pitch) in the FEM model."""

    length_to_diameter: float
    bore_ratio: float
    diameter_to_skin_depth: float
    mu_r: float = 1.0
    workpiece: str = "billet"
    turn_fill: float = 1.0

    def __post_init__(self):
        if self.workpiece not in ("billet", "bar"):
            raise ValueError(f"workpiece={self.workpiece!r}: expected 'billet' or 'bar'")

    def geometry(self):
        """(coil, workpiece, frequency, winding, load) for heatcalc and for the FEM model."""
        d_w = WORKPIECE_DIAMETER
        d_c = self.bore_ratio * d_w
        length = self.length_to_diameter * d_c
        rho = RHO_HOT if self.mu_r == 1.0 else RHO_MAGNETIC
        delta = d_w / self.diameter_to_skin_depth
        frequency = rho / (pi * mu_0 * self.mu_r * delta**2)
        l_w = length * (1.0 if self.workpiece == "billet" else BAR_LENGTH_FACTOR)
        pitch = length / TURNS
        tube = RectangularTube(
            axial_width=0.8 * pitch, radial_depth=0.012, wall=min(0.0015, 0.3 * pitch)
        )
        coil = SolenoidCoil(TURNS, length, d_c, tube, RHO_COPPER)
        work = CylinderWorkpiece(d_w / 2.0, l_w, rho, self.mu_r)
        winding = Winding(d_c / 2.0, 0.0, length, TURNS, self.turn_fill)
        load = CylinderLoad(d_w / 2.0, rho, self.mu_r, l_w)
        return coil, work, frequency, winding, load


def compare(case, mesh=None, method="permeable_return_path"):
    """Solve ``case`` with heatcalc's circuit and the FEM model at 1 A.

    Returns a dict: circuit and FEM load impedance [ohm], copper resistance [ohm],
    efficiencies [-], relative differences circuit/FEM - 1 of the workpiece power at equal
    current (= of the load resistance), of the reactance and of |Z|, the efficiency difference
    [-], the FEM power share beyond the coil ends [-] and the FEM degrees of freedom.
    """
    coil, work, frequency, winding, load = case.geometry()
    parts = coil_impedance(coil, work, frequency, method=method)
    z_circ = complex(parts.load)
    r_cu = float(np.real(parts.conductor))
    fem = solve_coil(winding, load, frequency, current=1.0, mesh=mesh or MeshSettings())
    z_fem = fem.impedance
    eta_circ = z_circ.real / (z_circ.real + r_cu)
    eta_fem = z_fem.real / (z_fem.real + r_cu)
    outside = 0.0
    if case.workpiece == "bar":
        outside = fem.power_between(winding.length / 2.0, load.length / 2.0) / fem.workpiece_power
    return {
        "frequency": frequency,
        "z_circuit": z_circ,
        "z_fem": z_fem,
        "copper_resistance": r_cu,
        "eta_circuit": eta_circ,
        "eta_fem": eta_fem,
        "power_error": z_circ.real / z_fem.real - 1.0,
        "reactance_error": z_circ.imag / z_fem.imag - 1.0,
        "impedance_error": abs(z_circ) / abs(z_fem) - 1.0,
        "efficiency_difference": eta_circ - eta_fem,
        "power_outside_coil": outside,
        "fem_power": fem.workpiece_power,
        "n_dofs": fem.n_dofs,
    }
