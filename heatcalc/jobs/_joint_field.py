"""Induced power in a tube-in-fitting joint: the composite wall and a table over temperature.

A tube pushed into a fitting (socket) in a coil's axial field is a two-layer wall with a bore:
tube inside, a thin non-conducting clearance, fitting outside.
:func:`composite_power_split` solves the induced field across it with the radial field solver
of :mod:`heatcalc.em` and returns the power per unit outer surface in each part;
:class:`JointPowerTable` tabulates the split, the surface impedance and the coil efficiency over
the two part temperatures for the transient of :mod:`heatcalc.jobs._two_parts`.

All quantities SI, temperatures in kelvin.
"""

from __future__ import annotations

import math
from dataclasses import dataclass

import numpy as np
from scipy.constants import pi

from .. import coil as hcoil
from .. import em

__all__ = [
    "GAP_RESISTIVITY",
    "GRID_POINTS",
    "JointGeometry",
    "PowerSplit",
    "composite_power_split",
    "JointPowerTable",
]

#: Resistivity [ohm m] given to the element that stands for the non-conducting clearance
#: between tube and fitting. Across it the field is uniform and ``rho dH/dr`` (the electric
#: field) carries the flux of the gap, exactly as for a vacuum gap when ``rho`` is large; at
#: 1 ohm m the power dissipated in it is below 1e-8 of the total for the walls and frequencies
#: of brazing (checked in tests/jobs/test_job_brazing.py).
GAP_RESISTIVITY = 1.0

#: Temperatures per part in :class:`JointPowerTable`.
GRID_POINTS = 13


@dataclass(frozen=True)
class JointGeometry:
    """Radii of a tube-in-fitting joint and the overlap length [m].

    ``tube_inner_radius < tube_outer_radius <= fitting_inner_radius < fitting_outer_radius``;
    the clearance is ``fitting_inner_radius - tube_outer_radius`` (radial, >= 0).
    """

    tube_inner_radius: float
    tube_outer_radius: float
    fitting_inner_radius: float
    fitting_outer_radius: float
    overlap_length: float

    def __post_init__(self):
        r = (
            self.tube_inner_radius,
            self.tube_outer_radius,
            self.fitting_inner_radius,
            self.fitting_outer_radius,
        )
        ok = 0 < r[0] < r[1] <= r[2] < r[3] and self.overlap_length > 0
        if not ok or not np.all(np.isfinite(r)):
            raise ValueError(
                "radii must satisfy 0 < tube_inner_radius < tube_outer_radius <= "
                f"fitting_inner_radius < fitting_outer_radius and overlap_length > 0 [m]; got "
                f"{r!r}, overlap_length={self.overlap_length!r}"
            )

    @property
    def radial_gap(self) -> float:
        """Radial clearance between tube and fitting [m]."""
        return self.fitting_inner_radius - self.tube_outer_radius

    @property
    def tube_wall(self) -> float:
        return self.tube_outer_radius - self.tube_inner_radius

    @property
    def fitting_wall(self) -> float:
        return self.fitting_outer_radius - self.fitting_inner_radius

    @property
    def tube_section(self) -> float:
        """Cross-section of the tube wall [m2]."""
        return pi * (self.tube_outer_radius**2 - self.tube_inner_radius**2)

    @property
    def fitting_section(self) -> float:
        """Cross-section of the fitting wall [m2]."""
        return pi * (self.fitting_outer_radius**2 - self.fitting_inner_radius**2)

    @property
    def interface_area(self) -> float:
        """Overlap area at the tube's outer surface [m2]."""
        return 2 * pi * self.tube_outer_radius * self.overlap_length

    @property
    def outer_area(self) -> float:
        """Outer (heated) surface of the fitting over the overlap [m2]."""
        return 2 * pi * self.fitting_outer_radius * self.overlap_length


@dataclass(frozen=True)
class PowerSplit:
    """Induced power in the two parts of a composite wall (per unit outer surface area).

    Attributes
    ----------
    fitting_power_per_area, tube_power_per_area : float [W/m2]
        Power absorbed in each part per unit outer surface of the fitting, at `h_surface`.
    gap_power_per_area : float [W/m2]
        Power in the clearance element (should be negligible).
    surface_impedance : complex [ohm]
        Of the composite wall, for the coil circuit.
    h_surface : float [A/m]
    field : em.RadialFieldResult
    """

    fitting_power_per_area: float
    tube_power_per_area: float
    gap_power_per_area: float
    surface_impedance: complex
    h_surface: float
    field: em.RadialFieldResult

    @property
    def power_per_area(self) -> float:
        """Total absorbed power per unit outer surface [W/m2]."""
        return self.fitting_power_per_area + self.tube_power_per_area + self.gap_power_per_area

    @property
    def fitting_share(self) -> float:
        """Fraction of the absorbed power that goes into the fitting [-]."""
        return self.fitting_power_per_area / self.power_per_area


def _layer_nodes(outer, inner, n, delta, fraction):
    mesh = em.radial_mesh("tube", outer, inner, n=n, skin_depth=delta, surface_fraction=fraction)
    return mesh.nodes


def composite_power_split(
    geometry: JointGeometry,
    fitting_resistivity: float,
    tube_resistivity: float,
    frequency: float,
    *,
    fitting_mu_r=1.0,
    tube_mu_r=1.0,
    h_surface: float = 1.0,
    n_fitting: int = 81,
    n_tube: int = 41,
    surface_fraction: float = 0.04,
) -> PowerSplit:
    """Power absorbed in the fitting and in the tube of a tube-in-fitting joint.

    Parameters
    ----------
    geometry : JointGeometry
    fitting_resistivity, tube_resistivity : float [ohm m]
        Uniform in each part (each part is at one temperature).
    frequency : float [Hz]
    fitting_mu_r, tube_mu_r : float or callable [-]
        Relative permeability, or a callable ``mu_r(h_peak)`` of the peak field per element of
        that part (magnetic steel below its Curie temperature).
    h_surface : float [A/m]
        RMS field at the fitting's outer surface.
    n_fitting, n_tube : int
        Nodes across each wall, graded towards the wall's outer face on its skin depth.
    surface_fraction : float [-]
        Width of the outermost element of each wall as a fraction of its skin depth (the
        grading of :func:`heatcalc.em.radial_mesh`; halve it with the node counts doubled for
        a refinement study).

    Returns
    -------
    PowerSplit

    Raises
    ------
    ValueError
        For invalid arguments (from the mesh and field solver).

    Notes
    -----
    The field equation of :func:`heatcalc.em.solve_radial_field` is solved from the tube bore
    (empty: its flux drives the electric field of the bore wall) to the fitting's outer
    surface; a clearance wider than zero is one element of resistivity
    :data:`GAP_RESISTIVITY`, so the field is uniform across it and its flux is counted.
    The power in each part is the sum of the element powers ``rho |J|^2`` times the element
    volume per unit outer surface. With equal materials and no clearance the result is the
    tube of :func:`heatcalc.em.tube_power_per_area`.
    """
    g = geometry
    mu_f_grade = fitting_mu_r(np.sqrt(2.0) * h_surface) if callable(fitting_mu_r) else fitting_mu_r
    mu_t_grade = tube_mu_r(np.sqrt(2.0) * h_surface) if callable(tube_mu_r) else tube_mu_r
    d_f = em.skin_depth(fitting_resistivity, frequency, np.max(mu_f_grade))
    d_t = em.skin_depth(tube_resistivity, frequency, np.max(mu_t_grade))
    tube_nodes = _layer_nodes(
        g.tube_outer_radius, g.tube_inner_radius, n_tube, d_t, surface_fraction
    )
    fitting_nodes = _layer_nodes(
        g.fitting_outer_radius, g.fitting_inner_radius, n_fitting, d_f, surface_fraction
    )
    gap = g.radial_gap > 0
    nodes = np.concatenate([tube_nodes, fitting_nodes if gap else fitting_nodes[1:]])
    mesh = em.mesh_from_nodes("tube", nodes)
    n_t = tube_nodes.size - 1
    n_g = 1 if gap else 0
    tube_el = slice(0, n_t)
    fit_el = slice(n_t + n_g, mesh.n_elements)
    rho = np.empty(mesh.n_elements)
    rho[tube_el] = tube_resistivity
    rho[n_t : n_t + n_g] = GAP_RESISTIVITY
    rho[fit_el] = fitting_resistivity
    if callable(fitting_mu_r) or callable(tube_mu_r):

        def mu(h_peak):
            out = np.ones(mesh.n_elements)
            for part, sl in ((tube_mu_r, tube_el), (fitting_mu_r, fit_el)):
                out[sl] = part(h_peak[sl]) if callable(part) else part
            return out

    else:
        mu = np.ones(mesh.n_elements)
        mu[tube_el] = tube_mu_r
        mu[fit_el] = fitting_mu_r
    res = em.solve_radial_field(mesh, rho, mu, frequency, h_surface=h_surface)
    pv = res.power_density * mesh.volume_per_area
    return PowerSplit(
        fitting_power_per_area=float(pv[fit_el].sum()),
        tube_power_per_area=float(pv[tube_el].sum()),
        gap_power_per_area=float(pv[n_t : n_t + n_g].sum()),
        surface_impedance=complex(res.surface_impedance),
        h_surface=float(h_surface),
        field=res,
    )


class JointPowerTable:
    """Power into fitting and tube as a function of their temperatures, for the transient.

    Parameters
    ----------
    geom : JointGeometry
    fitting, tube : Material
    frequency : float [Hz]
    coil : heatcalc.coil.SolenoidCoil
    workpiece : heatcalc.coil.TubeWorkpiece
        The composite seen by the coil (outer radius of the fitting, length of the overlap);
        its surface impedance is replaced by that of the composite solution.
    basis : {"coil", "absorbed"}
        What the power level of :meth:`set_power` is: at the coil terminals (the joint gets
        the coil efficiency's share of it) or absorbed by the joint.
    t0 : float [K]
        Lowest temperature of the table.
    tops : (float, float) [K]
        Highest temperature of the fitting and of the tube in the table.

    Notes
    -----
    The fitting share, the surface impedance and the coil efficiency are tabulated on
    ``GRID_POINTS`` temperatures per part and interpolated bilinearly (linearly beyond the
    grid, where only trial states of the integrator go); the resistivity tables are piecewise
    linear, and the interpolation error of the share stays below 0.1 % (checked in
    tests/jobs/test_job_brazing.py). Non-magnetic parts: the field problem is linear, so the
    table is built once at unit field. A magnetic part: its permeability depends on the field,
    so each entry is solved at the surface field that gives the absorbed power (fixed point
    ``h <- h sqrt(p_wanted / p(h))``), and the table is rebuilt for each power level.
    """

    def __init__(self, geom, fitting, tube, frequency, coil, workpiece, basis, t0, tops):
        self.args = (geom, fitting, tube, frequency, coil, workpiece)
        self.basis = basis
        self.tf = np.linspace(t0, tops[0], GRID_POINTS)
        self.tt = np.linspace(t0, tops[1], GRID_POINTS)
        self.magnetic = fitting.is_magnetic or tube.is_magnetic
        self.built_for = None
        self.power_level = None
        self.area = geom.outer_area * min(1.0, coil.length / geom.overlap_length)
        if not self.magnetic:
            self._build(None)

    def state(self, t_f, t_t, power=None) -> PowerSplit:
        """The composite solution at one pair of temperatures [K].

        For a magnetic part, at the surface field that gives the absorbed power of the power
        level `power` [W] (small-field permeability if `power` is None).
        """
        geom, fitting, tube, f, coil, wp = self.args

        def mu(mat, t):
            if not mat.is_magnetic:
                return 1.0
            return lambda h_peak: mat.relative_permeability(h_peak, np.full_like(h_peak, t))

        rho_f, rho_t = fitting.resistivity(t_f), tube.resistivity(t_t)
        h = 1.0
        for _ in range(40):  # converges in a few steps: p grows nearly as h**2
            split = composite_power_split(
                geom, rho_f, rho_t, f, fitting_mu_r=mu(fitting, t_f), tube_mu_r=mu(tube, t_t),
                h_surface=h,
            )  # fmt: skip
            if not self.magnetic or power is None:
                return split
            eta = float(self.efficiency(split.surface_impedance))
            wanted = power * (eta if self.basis == "coil" else 1.0) / self.area
            ratio = wanted / split.power_per_area
            if abs(ratio - 1.0) < 1e-4:
                break
            h *= math.sqrt(ratio)
        return split

    def efficiency(self, surface_impedance):
        """Coil efficiency [-] for a composite surface impedance [ohm] (float or array)."""
        geom, fitting, tube, f, coil, wp = self.args
        return hcoil.coil_impedance(coil, wp, f, surface_impedance=surface_impedance).efficiency

    def _build(self, power):
        n = GRID_POINTS
        self.share = np.empty((n, n))
        self.z = np.empty((n, n), dtype=complex)
        for i, t_f in enumerate(self.tf):
            for j, t_t in enumerate(self.tt):
                split = self.state(t_f, t_t, power)
                self.share[i, j] = split.fitting_share
                self.z[i, j] = split.surface_impedance
        self.eta = np.asarray(self.efficiency(self.z))
        self.built_for = power

    def set_power(self, power: float) -> None:
        """Set the power level [W] (rebuilds the table of a magnetic joint)."""
        self.power_level = float(power)
        if self.magnetic and power != self.built_for:
            self._build(power)

    def _interp(self, table, t_f, t_t):
        i = min(max(int(np.searchsorted(self.tf, t_f)) - 1, 0), GRID_POINTS - 2)
        j = min(max(int(np.searchsorted(self.tt, t_t)) - 1, 0), GRID_POINTS - 2)
        u = (t_f - self.tf[i]) / (self.tf[i + 1] - self.tf[i])
        v = (t_t - self.tt[j]) / (self.tt[j + 1] - self.tt[j])
        return (
            (1 - u) * (1 - v) * table[i, j]
            + u * (1 - v) * table[i + 1, j]
            + (1 - u) * v * table[i, j + 1]
            + u * v * table[i + 1, j + 1]
        )

    def fitting_share(self, t_f, t_t) -> float:
        """Fraction of the absorbed power that goes into the fitting [-]."""
        return float(self._interp(self.share, t_f, t_t))

    def coil_efficiency(self, t_f, t_t) -> float:
        """Coil efficiency [-] at the part temperatures [K]."""
        return float(self._interp(self.eta, t_f, t_t))

    def absorbed(self, t_f, t_t) -> float:
        """Power absorbed by the joint [W] at the power level and part temperatures [K]."""
        p = self.power_level
        return p * self.coil_efficiency(t_f, t_t) if self.basis == "coil" else p

    def __call__(self, t_f, t_t):
        """``(P_fitting, P_tube)`` [W] at the part temperatures [K]."""
        p = self.absorbed(t_f, t_t)
        s = self.fitting_share(t_f, t_t)
        return p * s, p * (1.0 - s)
