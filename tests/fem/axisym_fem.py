"""Axisymmetric time-harmonic finite-element model of a solenoid coil around a cylinder.

A test and benchmark tool, not part of the heatcalc runtime package: it gives an independent
route to the workpiece power and the terminal impedance of a multi-turn coil, against which
heatcalc's coil-workpiece equivalent circuit is checked. It uses scikit-fem (a test-only
dependency) and nothing from heatcalc.

Model
-----
Magnetic vector potential ``A = A_phi(r, z) e_phi`` (RMS phasor, time factor ``exp(j w t)``)
solving

    -d/dr(1/(mu r) d(r A)/dr) - d/dz(1/mu dA/dz) + j w sigma A = J_s

in the weak form (both sides multiplied by the test function ``v`` and ``2 pi r``)

    int nu [(1/r) d(rA)/dr d(rv)/dr + r dA/dz dv/dz] + j w sigma r A v  dr dz = int J_s r v dr dz,

with ``nu = 1/(mu_0 mu_r)``. Written this way the integrand is bounded on the axis, where
``A = 0`` is imposed (``A`` grows like ``r``); quadrature points lie inside the elements, so the
``1/r`` factor is never evaluated on the axis. Quadratic triangles (P2) on a structured tensor
mesh graded geometrically towards the workpiece surface (cell size ``skin_depth/skin_cells``)
and the coil edges. The plane ``z = 0`` is a plane of symmetry (natural condition,
``B_r = 0``), only ``z >= 0`` is meshed; ``A = 0`` on a far box ``far_factor`` times the coil
size away.

Assumptions: linear materials (constant ``mu_r``, no saturation); the winding is stranded (each
turn carries a uniform imposed current density over its rectangle, or a uniform surface current
on its inner face for ``radial_thickness = 0``), so eddy currents in the copper are ignored and
the returned impedance holds only the workpiece-induced resistance and the reactance; the coil's
own resistance must come from a separate formula.
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np
import scipy.constants
import scipy.sparse.linalg
from axisym_mesh import MeshSettings, axis_points, halve
from skfem import (
    Basis,
    BilinearForm,
    ElementTriP1,
    ElementTriP2,
    FacetBasis,
    Functional,
    LinearForm,
    MeshTri,
    asm,
)

__all__ = [
    "CylinderLoad",
    "FieldSolution",
    "MeshSettings",
    "Winding",
    "skin_depth",
    "solve_coil",
    "solve_infinite_solenoid",
]

MU_0 = scipy.constants.mu_0


def skin_depth(resistivity, frequency, mu_r=1.0):
    """Skin depth ``sqrt(2 rho / (omega mu_0 mu_r))`` [m] (own copy, independent of heatcalc).

    Examples
    --------
    Copper, 1.678e-8 ohm m, at 60 Hz: about 8.42 mm (CHECKS.md, rule of thumb 503 sqrt(rho/f)).

    >>> round(float(skin_depth(1.678e-8, 60.0)) * 1e3, 2)
    8.42
    """
    return np.sqrt(2.0 * resistivity / (2.0 * np.pi * frequency * MU_0 * mu_r))


@dataclass(frozen=True)
class Winding:
    """Solenoid winding of ``turns`` equal turns, centred on ``z = 0``.

    inner_radius [m] is the radius of the turns' inner faces; radial_thickness [m] the radial
    depth of each turn (0: a surface current on the inner face); length [m] the axial length
    from the first turn's outer edge to the last one's; turn_fill [-] the fraction of the pitch
    ``length/turns`` filled by each turn (1: a continuous, uniformly wound block).
    """

    inner_radius: float
    radial_thickness: float
    length: float
    turns: int
    turn_fill: float = 1.0

    def __post_init__(self):
        for name in ("inner_radius", "length"):
            if not getattr(self, name) > 0:
                raise ValueError(f"{name}={getattr(self, name)!r}: expected a positive length")
        if not self.radial_thickness >= 0:
            raise ValueError(f"radial_thickness={self.radial_thickness!r}: expected >= 0")
        if int(self.turns) != self.turns or self.turns < 1:
            raise ValueError(f"turns={self.turns!r}: expected a positive integer")
        if not 0 < self.turn_fill <= 1:
            raise ValueError(f"turn_fill={self.turn_fill!r}: expected 0 < turn_fill <= 1")

    @property
    def outer_radius(self):
        return self.inner_radius + self.radial_thickness

    def turn_edges(self):
        """Axial (z_low, z_high) of every turn [m], array of shape (turns, 2)."""
        pitch = self.length / self.turns
        low = (
            -0.5 * self.length + pitch * np.arange(self.turns) + 0.5 * (1 - self.turn_fill) * pitch
        )
        return np.column_stack([low, low + self.turn_fill * pitch])


@dataclass(frozen=True)
class CylinderLoad:
    """Solid cylindrical workpiece centred on the coil.

    radius [m]; length [m] or None for a bar running through the whole computational domain;
    resistivity [Ohm m]; mu_r [-] relative permeability (constant).
    """

    radius: float
    resistivity: float
    mu_r: float = 1.0
    length: float | None = None

    def __post_init__(self):
        for name in ("radius", "resistivity", "mu_r"):
            if not getattr(self, name) > 0:
                raise ValueError(f"{name}={getattr(self, name)!r}: expected a positive value")
        if self.length is not None and not self.length > 0:
            raise ValueError(f"length={self.length!r}: expected a positive length or None")


@dataclass(frozen=True, eq=False)
class FieldSolution:
    """Solved field and integral results (RMS phasors; full coil, both halves).

    workpiece_power [W]; impedance [Ohm] terminal impedance from the flux linkage
    ``j w lambda / I`` (workpiece-induced resistance + reactance, no copper loss);
    reactive_power [var] ``w int nu |B|^2 dV``; n_dofs; smallest_cell [m].
    """

    frequency: float
    current: float
    workpiece_power: float
    impedance: complex
    reactive_power: float
    n_dofs: int
    smallest_cell: float
    basis: Basis
    potential: np.ndarray
    sigma: np.ndarray
    symmetric_half: bool

    @property
    def inductance(self):
        """Terminal inductance ``Im(Z)/omega`` [H]."""
        return self.impedance.imag / (2 * np.pi * self.frequency)

    def power_between(self, z_low, z_high):
        """Eddy-current power [W] where ``z_low < |z| < z_high`` [m] (both mirrored slices of a
        model with a plane of symmetry); cuts should lie on mesh lines, else whole cells count
        by their centres."""
        if not 0 <= z_low < z_high:
            raise ValueError(f"z_low={z_low!r}, z_high={z_high!r}: expected 0 <= z_low < z_high")
        centre_z = self.basis.mesh.p[1, self.basis.mesh.t].mean(axis=0)
        chosen = np.nonzero((centre_z > z_low) & (centre_z < z_high))[0]
        sub = Basis(
            self.basis.mesh,
            self.basis.elem,
            elements=chosen,
            quadrature=(self.basis.X, self.basis.W),
        )
        factor = 2.0 if self.symmetric_half else 1.0
        return factor * _joule_power(sub, self.potential, self.sigma[chosen], self.frequency)


@Functional
def _joule_density(w):
    # sigma w^2 |A|^2 r (times 2 pi outside)
    return w.sigma * w.omega**2 * (w.ar**2 + w.ai**2) * w.x[0]


@Functional
def _magnetic_density(w):
    r = w.x[0]
    b2 = 0.0
    for part in (w.ar, w.ai):
        b_r = -part.grad[1]
        b_z = part / r + part.grad[0]
        b2 = b2 + b_r**2 + b_z**2
    return w.nu * b2 * r


def _joule_power(basis, potential, sigma_elem, frequency):
    nqp = basis.X.shape[-1]
    return (
        2
        * np.pi
        * _joule_density.assemble(
            basis,
            ar=basis.interpolate(potential.real),
            ai=basis.interpolate(potential.imag),
            sigma=np.repeat(sigma_elem[:, None], nqp, axis=1),
            omega=2 * np.pi * frequency,
        )
    )


@BilinearForm
def _curl_curl(u, v, w):
    r = w.x[0]
    return w.nu * ((u + r * u.grad[0]) * (v + r * v.grad[0]) / r + r * u.grad[1] * v.grad[1])


@BilinearForm
def _mass_r(u, v, w):
    return w.sigma * u * v * w.x[0]


@LinearForm
def _source_r(v, w):
    return w.j * v * w.x[0]


def _element(order):
    if order == 1:
        return ElementTriP1()
    if order == 2:
        return ElementTriP2()
    raise ValueError(f"order={order!r}: expected 1 or 2")


def _assemble_and_solve(mesh, order, nu_elem, sigma_elem, j_elem, sheets, frequency, dirichlet):
    """Assemble ``(K + j w M) a = b`` and solve; sheets = [(facets, K_surface)]."""
    element = _element(order)
    basis = Basis(mesh, element, intorder=2 * order + 2)
    nqp = basis.X.shape[-1]
    per_qp = lambda values: np.repeat(values[:, None], nqp, axis=1)  # noqa: E731
    stiffness = asm(_curl_curl, basis, nu=per_qp(nu_elem))
    mass = asm(_mass_r, basis, sigma=per_qp(sigma_elem))
    load = asm(_source_r, basis, j=per_qp(j_elem))
    for facets, k_surface in sheets:
        fb = FacetBasis(mesh, element, facets=facets, intorder=2 * order + 2)
        load = load + asm(_source_r, fb, j=k_surface)
    omega = 2 * np.pi * frequency
    system = (stiffness + 1j * omega * mass).tocsr()
    fixed = basis.get_dofs(dirichlet).all()
    free = np.setdiff1d(np.arange(basis.N), fixed)
    potential = np.zeros(basis.N, dtype=complex)
    # minimum-degree ordering on A^T + A suits the symmetric sparsity of a Galerkin matrix;
    # SuperLU's default column ordering is several times slower on these meshes
    potential[free] = scipy.sparse.linalg.spsolve(
        system[free][:, free].tocsc(), load[free].astype(complex), permc_spec="MMD_AT_PLUS_A"
    )
    # complex power delivered by the source, S = j w int A J* dV (J real), per 2 pi r dr dz
    complex_power = 1j * omega * 2 * np.pi * (load @ potential)
    reactive = (
        omega
        * 2
        * np.pi
        * _magnetic_density.assemble(
            basis,
            ar=basis.interpolate(potential.real),
            ai=basis.interpolate(potential.imag),
            nu=per_qp(nu_elem),
        )
    )
    return basis, potential, complex_power, reactive


def _materials(centres, load, winding, turn_edges, current):
    """Per-element reluctivity, conductivity and imposed current density."""
    r, z = centres
    nu = np.full(r.shape, 1.0 / MU_0)
    sigma = np.zeros(r.shape)
    if load is not None:
        inside = r < load.radius
        if load.length is not None:
            inside &= np.abs(z) < 0.5 * load.length
        nu[inside] = 1.0 / (MU_0 * load.mu_r)
        sigma[inside] = 1.0 / load.resistivity
    j = np.zeros(r.shape)
    if winding.radial_thickness > 0:
        in_r = (r > winding.inner_radius) & (r < winding.outer_radius)
        for low, high in turn_edges:
            area = winding.radial_thickness * (high - low)
            j[in_r & (z > low) & (z < high)] = current / area
    return nu, sigma, j


def solve_coil(winding, load, frequency, current=1.0, mesh=None):
    """Solve a finite winding around a cylinder (or in air with ``load=None``).

    Parameters
    ----------
    winding : Winding
        Turns centred on ``z = 0``.
    load : CylinderLoad or None
        Coaxial workpiece centred on ``z = 0``, radius below the winding's inner radius.
    frequency : float [Hz]
        Frequency, > 0.
    current : float [A]
        RMS current of every turn.
    mesh : MeshSettings or None
        Mesh grading; None for the defaults.

    Returns
    -------
    FieldSolution
        Whole-coil results (both halves of the symmetric model).

    Raises
    ------
    ValueError
        For a frequency <= 0, a workpiece that does not fit inside the winding, or one longer
        than the far box.

    Notes
    -----
    See the module notes for the formulation and its assumptions. The flux-linkage impedance
    and the field integrals agree to solver precision (Poynting's theorem), which the tests
    use as a check of the post-processing.
    """
    settings = mesh or MeshSettings()
    if not frequency > 0:
        raise ValueError(f"frequency={frequency!r}: expected a positive frequency [Hz]")
    if load is not None and load.radius >= winding.inner_radius:
        raise ValueError(
            f"load.radius={load.radius!r}: expected less than the winding inner radius "
            f"{winding.inner_radius!r}"
        )
    ref = settings.refine
    g = 1.0 + (settings.growth - 1.0) / ref
    edges = winding.turn_edges()
    half_len = 0.5 * winding.length
    size = max(winding.outer_radius, half_len)
    far = settings.far_factor * size
    pitch = winding.length / winding.turns
    near_cap = (
        min(winding.inner_radius, max(half_len, winding.inner_radius / 2)) / settings.near_cells
    )
    gap = winding.inner_radius - (load.radius if load is not None else 0.0)
    coil_h = min(gap, pitch * winding.turn_fill, winding.radial_thickness or np.inf) / 4.0

    r_breaks = [0.0, winding.inner_radius, winding.outer_radius, far]
    r_anchors = [(winding.inner_radius, coil_h), (winding.outer_radius, coil_h)]
    z_breaks = [0.0, *edges[edges > 0], far]
    z_anchors = [(zb, coil_h) for zb in edges[edges >= 0]]
    near_z = half_len
    if load is not None:
        delta = skin_depth(load.resistivity, frequency, load.mu_r)
        h_skin = min(delta / settings.skin_cells, load.radius / 8.0)
        r_breaks.insert(1, load.radius)
        r_anchors.append((load.radius, h_skin))
        if load.length is not None:
            if 0.5 * load.length >= far:
                raise ValueError(f"load.length={load.length!r}: longer than the far box")
            z_breaks.append(0.5 * load.length)
            z_anchors.append((0.5 * load.length, h_skin))
            near_z = max(near_z, 0.5 * load.length)
    r_breaks = sorted(set(r_breaks))
    z_breaks = sorted(set(z_breaks))
    scale = lambda anchors: [(x, h / ref) for x, h in anchors]  # noqa: E731
    r_pts = axis_points(r_breaks, scale(r_anchors), g, near_cap / ref, winding.outer_radius)
    z_pts = axis_points(z_breaks, scale(z_anchors), g, near_cap / ref, near_z)
    r_pts = halve(r_pts, settings.halvings)
    z_pts = halve(z_pts, settings.halvings)
    mesh_tri = MeshTri.init_tensor(r_pts, z_pts)
    centres = mesh_tri.p[:, mesh_tri.t].mean(axis=1)
    nu, sigma, j = _materials(centres, load, winding, edges, current)
    sheets = []
    if winding.radial_thickness == 0:
        for low, high in edges:
            facets = mesh_tri.facets_satisfying(
                lambda x, lo=low, hi=high: (
                    np.isclose(x[0], winding.inner_radius) & (x[1] > max(lo, 0.0)) & (x[1] < hi)
                )
            )
            if len(facets):  # turns below z = 0 lie in the mirrored half
                sheets.append((facets, current / (high - low)))

    def dirichlet(x):
        return np.isclose(x[0], 0.0) | np.isclose(x[0], far) | np.isclose(x[1], far)

    basis, potential, s_half, q_half = _assemble_and_solve(
        mesh_tri, settings.order, nu, sigma, j, sheets, frequency, dirichlet
    )
    cells = np.concatenate([np.diff(r_pts), np.diff(z_pts)])
    return FieldSolution(
        frequency=frequency,
        current=current,
        workpiece_power=2.0 * _joule_power(basis, potential, sigma, frequency),
        impedance=complex(2.0 * s_half / current**2),
        reactive_power=2.0 * q_half,
        n_dofs=basis.N,
        smallest_cell=float(cells.min()),
        basis=basis,
        potential=potential,
        sigma=sigma,
        symmetric_half=True,
    )


def solve_infinite_solenoid(
    inner_radius, radial_thickness, turns_per_length, load, frequency, current=1.0, mesh=None
):
    """Solve an infinitely long uniform winding around an infinitely long cylinder.

    A slab ``0 <= z <= h`` with natural conditions on its faces (``B_r = 0``) and on the outer
    radius (``B_z = 0``, the field outside an infinite solenoid) and ``A = 0`` on the axis; the
    solution does not depend on ``z``.

    Parameters
    ----------
    inner_radius : float [m]
        Radius of the winding's inner face (of the current sheet when radial_thickness = 0).
    radial_thickness : float [m]
        Radial depth of a uniformly wound winding; 0 for a current sheet.
    turns_per_length : float [1/m]
        Turns per metre of coil length.
    load : CylinderLoad
        Workpiece (its length is ignored: infinitely long).
    frequency : float [Hz]
        Frequency, > 0.
    current : float [A]
        RMS coil current.
    mesh : MeshSettings or None
        Radial grading; None for the defaults.

    Returns
    -------
    FieldSolution
        Per unit length: workpiece_power [W/m], impedance [Ohm/m], reactive_power [var/m].
    """
    settings = mesh or MeshSettings()
    if not frequency > 0:
        raise ValueError(f"frequency={frequency!r}: expected a positive frequency [Hz]")
    if not load.radius < inner_radius:
        raise ValueError(
            f"load.radius={load.radius!r}: expected less than inner_radius {inner_radius!r}"
        )
    ref = settings.refine
    g = 1.0 + (settings.growth - 1.0) / ref
    outer = inner_radius + radial_thickness
    gap = inner_radius - load.radius
    delta = skin_depth(load.resistivity, frequency, load.mu_r)
    h_skin = min(delta / settings.skin_cells, load.radius / 8.0)
    coil_h = min(gap, radial_thickness or np.inf) / 4.0
    cap = inner_radius / settings.near_cells
    anchors = [(load.radius, h_skin / ref), (inner_radius, coil_h / ref)]
    breaks = sorted({0.0, load.radius, inner_radius, outer})
    r_pts = halve(axis_points(breaks, anchors, g, cap / ref, outer), settings.halvings)
    height = cap
    mesh_tri = MeshTri.init_tensor(r_pts, np.array([0.0, 0.5 * height, height]))
    centres = mesh_tri.p[:, mesh_tri.t].mean(axis=1)
    r = centres[0]
    nu = np.where(r < load.radius, 1.0 / (MU_0 * load.mu_r), 1.0 / MU_0)
    sigma = np.where(r < load.radius, 1.0 / load.resistivity, 0.0)
    sheet_k = turns_per_length * current
    j = np.zeros(r.shape)
    sheets = []
    if radial_thickness > 0:
        j[(r > inner_radius) & (r < outer)] = sheet_k / radial_thickness
    else:
        sheets.append(
            (mesh_tri.facets_satisfying(lambda x: np.isclose(x[0], inner_radius)), sheet_k)
        )
    basis, potential, s_slab, q_slab = _assemble_and_solve(
        mesh_tri, settings.order, nu, sigma, j, sheets, frequency, lambda x: np.isclose(x[0], 0.0)
    )
    return FieldSolution(
        frequency=frequency,
        current=current,
        workpiece_power=_joule_power(basis, potential, sigma, frequency) / height,
        impedance=complex(s_slab / (current**2 * height)),
        reactive_power=q_slab / height,
        n_dofs=basis.N,
        smallest_cell=float(np.diff(r_pts).min()),
        basis=basis,
        potential=potential,
        sigma=sigma,
        symmetric_half=False,
    )
