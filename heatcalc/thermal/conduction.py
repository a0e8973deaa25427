"""Implicit radial heat conduction with an enthalpy formulation (cylinder, tube, slab).

Discretisation
--------------
Vertex-centred finite volumes on the nodes of a radial mesh (the same nodes as the field
solver's :class:`heatcalc.em.RadialMesh`; the last node is the heated surface). Each node owns
the control volume between the mid-points of its elements. Everything is per unit area of the
heated surface: masses [kg/m2], sources and fluxes [W/m2], energies [J/m2]. With geometric
weight ``w = r`` (cylinder, tube) or ``1`` (slab) and ``w_s`` its surface value,

    m_i (H_i - H_i^old)/dt = G_{i-1} (T_{i-1} - T_i) + G_i (T_{i+1} - T_i) + S_i
                             - [i = surface] (q_loss(T_s) - q_in)

with ``m_i = rho integral_CV w dr / w_s``, ``G_e = k(T_e) w(mid_e) / (w_s h_e)`` (k at the mean
temperature of the element) and ``H`` the specific enthalpy of
:mod:`heatcalc.thermal.enthalpy`. Backward Euler in time (first order, unconditionally stable);
in space second order. The unknown is the enthalpy, so latent heat (a step for a pure metal)
and the magnetic-transformation peak of ``c_p`` are conserved exactly: the sum of the equations
telescopes to ``stored = in - lost`` for every step.

Nonlinear solution: Newton iteration on ``H`` with ``T(H)`` and ``dT/dH`` from the enthalpy
curve (``dT/dH = 0`` on a melting plateau), the loss linearised with its exact derivative, and
``k`` lagged (Picard). Each iteration is one tridiagonal solve (LAPACK ``dgtsv``). ``T(H)`` is
looked up in :meth:`~heatcalc.thermal.EnthalpyCurve.inverse_table` (linear interpolation,
within 1e-4 K of the exact inverse), which is several times faster than the exact inverse.

Boundaries: the cylinder axis and the slab mid-plane are symmetry lines; the bore wall of a
tube is adiabatic. Geometry is fixed and the density is taken at 20 degC (thermal expansion
neglected; mass conserved).
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np
from scipy.linalg import lapack

from .. import _checks as chk
from ..materials import OutOfRangeError
from .enthalpy import REFERENCE_TEMPERATURE, enthalpy_curve

__all__ = [
    "GEOMETRIES",
    "ConductionGrid",
    "RadialConduction",
    "NewtonFailure",
    "conduction_grid",
]

GEOMETRIES = ("cylinder", "tube", "slab")


class NewtonFailure(RuntimeError):
    """A conduction step did not converge (the caller shortens the step)."""


@dataclass(frozen=True, eq=False)
class ConductionGrid:
    """Finite-volume factors of a radial mesh, per unit heated surface area.

    Attributes
    ----------
    geometry : str
    nodes : ndarray [m]
        Increasing; the last node is the heated surface (see :func:`conduction_grid`).
    widths : ndarray [m]
        Element widths.
    face : ndarray [-]
        ``w(mid-point)/w_s`` per element (conductance ``k face / width``).
    half_left, half_right : ndarray [m]
        Volume per heated area of the inner and outer half of each element.
    volume : ndarray [m]
        Control volume per heated area of each node.
    """

    geometry: str
    nodes: np.ndarray
    widths: np.ndarray
    face: np.ndarray
    half_left: np.ndarray
    half_right: np.ndarray
    volume: np.ndarray

    @property
    def element_volume(self) -> np.ndarray:
        """Element volume per heated area [m]."""
        return self.half_left + self.half_right

    def node_source(self, element_power_density) -> np.ndarray:
        """Heat generated in each control volume [W/m2] from per-element W/m3 values."""
        p = np.asarray(element_power_density, dtype=float)
        s = np.zeros(self.nodes.size)
        s[:-1] += p * self.half_left
        s[1:] += p * self.half_right
        return s


def conduction_grid(geometry: str, nodes) -> ConductionGrid:
    """Build the :class:`ConductionGrid` of given node positions.

    Parameters
    ----------
    geometry : {"cylinder", "tube", "slab"}
        Solid cylinder (``nodes[0] = 0``, the axis), tube (``nodes[0]`` the bore radius > 0)
        or slab heated equally on both faces (``nodes[0] = 0``, the mid-plane; the last node
        is half the thickness).
    nodes : array [m]
        At least 3 strictly increasing positions, the heated surface last.

    Returns
    -------
    ConductionGrid

    Raises
    ------
    ValueError
        For an unknown geometry or unsuitable nodes.

    Examples
    --------
    >>> g = conduction_grid("cylinder", [0.0, 0.5, 1.0])
    >>> g.volume.round(4).tolist()   # per unit surface area: R/2 in total
    [0.0312, 0.25, 0.2188]
    """
    chk.choice("geometry", geometry, GEOMETRIES)
    x = chk.real("nodes", nodes, "m")
    if x.ndim != 1 or x.size < 3:
        raise ValueError(f"nodes must be a 1-d array of at least 3 positions; got shape {x.shape}")
    if np.any(np.diff(x) <= 0):
        raise ValueError(f"nodes must be strictly increasing [m]; got {x.tolist()}")
    if geometry == "tube":
        if x[0] <= 0:
            raise ValueError(f"nodes[0] (bore radius) must be > 0 for a tube; got {x[0]!r}")
    elif x[0] != 0:
        raise ValueError(f"nodes[0] must be 0 for a {geometry}; got {x[0]!r}")
    left, right = x[:-1], x[1:]
    mid = 0.5 * (left + right)
    if geometry == "slab":
        ws = 1.0
        face = np.ones_like(mid)
        half_left, half_right = mid - left, right - mid
    else:
        ws = x[-1]
        face = mid / ws
        half_left = 0.5 * (mid**2 - left**2) / ws
        half_right = 0.5 * (right**2 - mid**2) / ws
    volume = np.zeros(x.size)
    volume[:-1] += half_left
    volume[1:] += half_right
    return ConductionGrid(geometry, x, right - left, face, half_left, half_right, volume)


class RadialConduction:
    """Backward-Euler enthalpy stepper for one material on one grid.

    Parameters
    ----------
    grid : ConductionGrid
    material : str or Material
        Needs specific_heat, thermal_conductivity and density tables.
    tolerance : float [K]
        Newton stops when the largest enthalpy update divided by the smallest heat capacity
        is below this.
    max_iterations : int
        Newton iterations before :class:`NewtonFailure`.
    """

    def __init__(self, grid: ConductionGrid, material, tolerance=1e-4, max_iterations=30):
        if not isinstance(grid, ConductionGrid):
            raise ValueError(f"grid must be a ConductionGrid; got {type(grid)!r}")
        self.grid = grid
        self.material = chk.material(material)
        self.curve = enthalpy_curve(self.material)
        try:
            ktab = self.material.tables["thermal_conductivity"]
        except KeyError:
            raise ValueError(
                f"material {self.material.key!r} has no thermal_conductivity table"
            ) from None
        self._kx, self._ky = ktab.temperature, ktab.value
        self.density = float(self.material.density(REFERENCE_TEMPERATURE))
        self.mass = self.density * grid.volume
        self.tolerance = float(chk.positive("tolerance", tolerance, "K"))
        self.max_iterations = int(max_iterations)
        self._c_min = float(min(self.curve.c0.min(), self.curve.c1.min()))
        self.t_min = max(self.curve.t_min, ktab.t_min)
        self.t_max = min(self.curve.t_max, ktab.t_max)
        self._hk, self._tk, self._dk = self.curve.inverse_table(max_error=1e-4)
        self._neg_cond = -grid.face / grid.widths
        self._kx2 = 2.0 * self._kx

    # -- state conversions ----------------------------------------------------------------
    def enthalpy(self, temperature) -> np.ndarray:
        """Nodal specific enthalpy [J/kg] of a temperature profile [K] (checked)."""
        t = np.broadcast_to(chk.kelvin("temperature", temperature), self.grid.nodes.shape)
        self.check_range(t, "temperature")
        return np.asarray(self.curve.enthalpy_unchecked(t), dtype=float).copy()

    def temperature(self, enthalpy: np.ndarray) -> np.ndarray:
        """Nodal temperature [K] of an enthalpy profile [J/kg] (tabulated inverse, 1e-4 K)."""
        return np.interp(enthalpy, self._hk, self._tk)

    def _inverse(self, h: np.ndarray):
        return np.interp(h, self._hk, self._tk), np.interp(h, self._hk, self._dk)

    def check_range(self, t: np.ndarray, what: str = "temperature", when: str = "") -> None:
        lo, hi = float(t.min()), float(t.max())
        if lo < self.t_min - 1e-9 or hi > self.t_max + 1e-9:
            worst = lo if lo < self.t_min else hi
            raise OutOfRangeError(
                f"{what} {worst:.2f} K ({worst - 273.15:.1f} degC){when} is outside the tables "
                f"of {self.material.key!r} for conduction ({self.t_min:.2f} K to "
                f"{self.t_max:.2f} K)"
            )

    def conductivity(self, t: np.ndarray) -> np.ndarray:
        """Thermal conductivity [W/(m K)] (linear in the table; no range check)."""
        return np.interp(t, self._kx, self._ky)

    # -- one time step --------------------------------------------------------------------
    def step(self, h_old, dt, source=None, surface_input=0.0, loss=None, guess=None):
        """Advance one backward-Euler step.

        Parameters
        ----------
        h_old : ndarray [J/kg]
            Nodal enthalpy at the start of the step.
        dt : float [s]
        source : ndarray [W/m2], optional
            Heat generated in each control volume per unit heated area
            (:meth:`ConductionGrid.node_source`).
        surface_input : float [W/m2]
            Heat flux entering at the surface node.
        loss : SurfaceLoss, optional
            Loss at the surface, evaluated implicitly.
        guess : ndarray [J/kg], optional
            Starting point of the Newton iteration (default `h_old`), e.g. extrapolated from
            the previous steps.

        Returns
        -------
        h_new, t_new : ndarray
        q_loss : float [W/m2]
            Loss at the end-of-step surface temperature.
        iterations : int

        Raises
        ------
        NewtonFailure
            If Newton does not converge within ``max_iterations``.
        """
        m_dt = self.mass / dt
        h = (h_old if guess is None else guess).copy()
        rhs_fixed = m_dt * h_old
        if source is not None:
            rhs_fixed += source
        rhs_fixed[-1] += surface_input
        neg_cond, kx2, ky = self._neg_cond, self._kx2, self._ky
        tol = self.tolerance * self._c_min
        inverse = self._inverse
        for iteration in range(1, self.max_iterations + 1):
            t, dtdh = inverse(h)
            # -G per element, k at the element's mean temperature (table abscissae doubled
            # so that the sum of the two node temperatures can be looked up directly).
            neg_g = np.interp(t[1:] + t[:-1], kx2, ky) * neg_cond
            flow = neg_g * (t[:-1] - t[1:])  # heat flowing inwards across each element
            resid = m_dt * h - rhs_fixed
            resid[:-1] -= flow
            resid[1:] += flow
            lower = neg_g * dtdh[:-1]  # dR_{i+1}/dH_i
            upper = neg_g * dtdh[1:]  # dR_i/dH_{i+1}
            diag = m_dt.copy()
            diag[:-1] -= lower
            diag[1:] -= upper
            if loss is not None:
                q, dq = loss.flux_and_slope(float(t[-1]))
                resid[-1] += q
                diag[-1] += dq * dtdh[-1]
            # J dx = R, then H <- H - dx (the Newton update with the sign folded in).
            *_, dx, info = lapack.dgtsv(
                lower, diag, upper, resid, overwrite_dl=1, overwrite_d=1, overwrite_du=1
            )
            if info != 0:  # pragma: no cover - the matrix is diagonally dominant
                raise NewtonFailure(f"tridiagonal solve failed (LAPACK info={info})")
            h -= dx
            change = np.abs(dx).max()
            if change < tol:
                t = inverse(h)[0]
                q_loss = 0.0 if loss is None else float(loss.flux_and_slope(float(t[-1]))[0])
                return h, t, q_loss, iteration
            if not np.isfinite(change):
                break
        raise NewtonFailure(
            f"conduction step of {dt:.4g} s did not converge in {self.max_iterations} "
            f"iterations (n={h.size})"
        )
