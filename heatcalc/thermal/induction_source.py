"""Heat source from the induced currents, re-evaluated as the temperature profile changes.

Wraps :func:`heatcalc.em.solve_radial_field`: per element, resistivity at the element
temperature and (for a ferromagnetic material below its Curie temperature) the amplitude
permeability ``mu_r(h_peak, T)`` of :meth:`heatcalc.materials.Material.relative_permeability`.
The field solution is kept and reused until some element has changed temperature by more than
``field_update`` kelvin, or a new segment starts.

The permeability depends on the local field, so each field solution is a fixed-point
iteration on ``log mu_r``, relaxed with Aitken's dynamic factor (starting at 0.7, kept in
[0.05, 1]) and warm-started from the previous solution; in ``"power"`` mode the surface
field is updated in the same loop, ``h_s <- h_s sqrt(target/P)``, and the power density is
finally scaled to the target exactly.
"""

from __future__ import annotations

import numpy as np

from heatcalc.em import RadialMesh, solve_radial_field

__all__ = ["InductionSource"]

_RELAX = 0.7


def _element_peak_field(field: np.ndarray) -> np.ndarray:
    """Peak amplitude (sqrt(2) x RMS over the element) of a linear nodal phasor field."""
    a, b = field[:-1], field[1:]
    mean_square = (np.abs(a) ** 2 + np.abs(b) ** 2 + (a * b.conjugate()).real) / 3.0
    return np.sqrt(2.0 * mean_square)


class InductionSource:
    """Power density from the induced currents in one workpiece.

    Parameters
    ----------
    material : Material
        Needs a resistivity table; magnetic data if ferromagnetic.
    mesh : RadialMesh
        Field-solver mesh (the conduction grid uses the same nodes).
    field_update : float [K]
        Largest element temperature change tolerated before a new field solution, > 0.
    field_tolerance : float [-]
        Relative convergence of ``mu_r`` and of the absorbed power per field solution, > 0.
    max_iterations : int
        Cap on the iteration of a field solution started cold (new frequency).
    warm_iterations : int
        Cap on the iteration of a field solution warm-started from the previous one.

    Raises
    ------
    ValueError
        For a mesh of the wrong type, a material without resistivity, or a non-positive
        `field_update` or `field_tolerance`.
    """

    def __init__(
        self,
        material,
        mesh,
        field_update=5.0,
        field_tolerance=1e-2,
        max_iterations=60,
        warm_iterations=60,
    ):
        if not isinstance(mesh, RadialMesh):
            raise ValueError(f"mesh must be a heatcalc.em.RadialMesh; got {type(mesh)!r}")
        try:
            rtab = material.tables["resistivity"]
        except KeyError:
            raise ValueError(
                f"material {material.key!r} has no resistivity table, needed for induction "
                "heating (give no frequency to apply the power as a surface flux)"
            ) from None
        if not field_update > 0:
            raise ValueError(f"field_update must be > 0 [K]; got {field_update!r}")
        if not field_tolerance > 0:
            raise ValueError(f"field_tolerance must be > 0 [-]; got {field_tolerance!r}")
        self.material = material
        self.mesh = mesh
        self._rx, self._ry = rtab.temperature, rtab.value
        self.t_min, self.t_max = rtab.t_min, rtab.t_max
        self.magnetic = material.is_magnetic
        self.threshold = float(field_update)
        self.tolerance = float(field_tolerance)
        self.max_iterations = int(max_iterations)
        self.warm_iterations = int(warm_iterations)
        self.solves = 0
        self.unconverged = 0  # field solutions that stopped at max_iterations
        self._segment = None
        self._t_last = None
        self._mu = None
        self._h_s = None
        self._shape = None  # element power density [W/m3] at the current state
        self._power = 0.0  # absorbed power per area [W/m2]

    def evaluate(self, t_nodes: np.ndarray, segment):
        """Power density per element [W/m3], absorbed power [W/m2] and RMS surface field [A/m].

        Re-solves the field only if `segment` is new or an element has moved more than the
        threshold since the last solution.
        """
        te = 0.5 * (t_nodes[1:] + t_nodes[:-1])
        if (
            segment is not self._segment
            or self._t_last is None
            or np.max(np.abs(te - self._t_last)) > self.threshold
        ):
            self._solve(te, segment)
        return self._shape, self._power, (self._h_s if self._power > 0 else 0.0)

    def _solve(self, te: np.ndarray, segment) -> None:
        if te.min() < self.t_min - 1e-9 or te.max() > self.t_max + 1e-9:
            worst = te.min() if te.min() < self.t_min else te.max()
            raise ValueError(
                f"temperature {worst:.2f} K is outside the resistivity table of "
                f"{self.material.key!r} ({self.t_min:.2f} K to {self.t_max:.2f} K)"
            )
        if segment is not self._segment:
            if self._segment is None or segment.frequency != self._segment.frequency:
                self._mu = None  # the old profile is no guide at another frequency
            if segment.mode == "field":
                self._h_s = float(segment.value)
        self._segment, self._t_last = segment, te.copy()
        rho = np.interp(te, self._rx, self._ry)
        f = float(segment.frequency)
        power_mode = segment.mode == "power"
        target = float(segment.value) if power_mode else None
        if power_mode and target == 0.0:
            self._shape, self._power = np.zeros(te.size), 0.0
            return
        if not self.magnetic:
            res = self._field(rho, 1.0, f, 1.0 if power_mode else self._h_s)
            if power_mode:
                self._h_s = float(np.sqrt(target / res.power_per_area))
            self._finish(res, target)
            return
        mat = self.material
        if self._h_s is None:  # power mode, first solution: guess with the small-field mu_r
            mu0 = mat.relative_permeability(np.zeros_like(te), te)
            self._h_s = float(np.sqrt(target / self._field(rho, mu0, f, 1.0).power_per_area))
        cap = self.warm_iterations
        if self._mu is None:
            self._mu = mat.relative_permeability(np.full_like(te, np.sqrt(2.0) * self._h_s), te)
            cap = self.max_iterations
        log_mu = np.log(self._mu)
        limit = np.log1p(self.tolerance)
        omega, previous = _RELAX, None
        for _ in range(cap):
            res = self._field(rho, np.exp(log_mu), f, self._h_s)
            change = 0.0
            if power_mode:
                ratio = target / res.power_per_area
                self._h_s *= float(np.sqrt(ratio))
                change = abs(np.log(ratio))
            peak = _element_peak_field(res.field) * (self._h_s / res.h_surface)
            step = np.log(mat.relative_permeability(peak, te)) - log_mu
            change = max(change, float(np.max(np.abs(step))))
            if change <= limit:
                break
            if previous is not None:  # Aitken's dynamic relaxation factor
                diff = step - previous
                denom = float(diff @ diff)
                if denom > 0.0:
                    # kept in a safe range: the factor is an estimate from two iterates only
                    omega = min(max(-omega * float(previous @ diff) / denom, 0.05), 1.0)
            log_mu = log_mu + omega * step
            previous = step
        else:
            self.unconverged += 1
        self._mu = np.exp(log_mu)
        self._finish(res, target)

    def _field(self, rho, mu, f, h_s):
        self.solves += 1
        return solve_radial_field(self.mesh, rho, mu, f, h_surface=h_s)

    def _finish(self, res, target) -> None:
        if target is None:
            self._shape = np.asarray(res.power_density)
            self._power = float(res.power_per_area)
        else:  # scale to the target exactly (the distribution is that of the last solution)
            self._shape = np.asarray(res.power_density) * (target / res.power_per_area)
            self._power = target
