"""Electromagnetic core of heatcalc: skin depth, analytic fields, radial field solver.

Conventions (shared by every module here and by the coil and thermal layers that use it)
---------------------------------------------------------------------------------------
* SI units; arguments are floats or numpy arrays and broadcast together.
* Phasors are RMS values with time dependence ``exp(j omega t)``; powers are time averages.
  Field strengths ``h_surface`` are RMS [A/m]; a *peak* amplitude (``sqrt(2)`` x RMS) is used
  only where a magnetisation curve is evaluated (field-dependent ``mu_r``).
* The field at the heated surface is real and is the phase reference.
* Inside a conductor ``alpha = (1 + j)/delta``, ``alpha**2 = j omega mu_0 mu_r / rho``; induced
  current ``J = -dH/dr`` (azimuthal in cylinders and tubes, tangential in plates).
* Surface impedance ``Z_s = rho H'(surface)/H(surface)`` [ohm]: the (active + j reactive) power
  entering unit surface area is ``Z_s |H_surface|**2``; ``Re(Z_s) > 0`` and ``Im(Z_s) > 0``
  (inductive). For a thick conductor ``Z_s -> (1 + j) rho/delta``.
"""

from heatcalc.em.cylinder import (
    cylinder_current_density,
    cylinder_field,
    cylinder_power_density,
    cylinder_power_factors,
    cylinder_power_per_area,
    cylinder_surface_impedance,
)
from heatcalc.em.radial_field import (
    ConvergenceError,
    ConvergenceWarning,
    RadialFieldResult,
    solve_radial_field,
)
from heatcalc.em.radial_mesh import GEOMETRIES, RadialMesh, mesh_from_nodes, radial_mesh
from heatcalc.em.skin import frequency_for_skin_depth, skin_depth
from heatcalc.em.slab import (
    slab_current_density,
    slab_field,
    slab_power_density,
    slab_power_factors,
    slab_power_per_area,
    slab_surface_impedance,
)
from heatcalc.em.tube import (
    tube_current_density,
    tube_field,
    tube_power_density,
    tube_power_factors,
    tube_power_per_area,
    tube_surface_impedance,
)

__all__ = [
    "GEOMETRIES",
    "ConvergenceError",
    "ConvergenceWarning",
    "RadialFieldResult",
    "RadialMesh",
    "cylinder_current_density",
    "cylinder_field",
    "cylinder_power_density",
    "cylinder_power_factors",
    "cylinder_power_per_area",
    "cylinder_surface_impedance",
    "frequency_for_skin_depth",
    "mesh_from_nodes",
    "radial_mesh",
    "skin_depth",
    "slab_current_density",
    "slab_field",
    "slab_power_density",
    "slab_power_factors",
    "slab_power_per_area",
    "slab_surface_impedance",
    "solve_radial_field",
    "tube_current_density",
    "tube_field",
    "tube_power_density",
    "tube_power_factors",
    "tube_power_per_area",
    "tube_surface_impedance",
]
