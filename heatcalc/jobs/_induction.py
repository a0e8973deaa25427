"""Workpiece state for the coil circuit from a temperature profile (shared by the jobs)."""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

from .. import em

__all__ = ["SurfaceState", "surface_state"]


@dataclass(frozen=True)
class SurfaceState:
    """Induced-current state of a workpiece at one temperature profile and power.

    Attributes
    ----------
    surface_impedance : complex [ohm]
        ``Z_s`` with (P + jQ)/area = ``Z_s |H|^2``, for the radially varying properties.
    h_surface : float [A/m]
        RMS surface field that induces `power_per_area`.
    power_per_area : float [W/m2]
    resistivity_surface : float [ohm m]
    mu_r_surface : float [-]
        Relative permeability of the outermost element.
    skin_depth_surface : float [m]
        Skin depth with the surface element's properties.
    field : em.RadialFieldResult
    """

    surface_impedance: complex
    h_surface: float
    power_per_area: float
    resistivity_surface: float
    mu_r_surface: float
    skin_depth_surface: float
    field: em.RadialFieldResult


def surface_state(material, geometry, nodes, t_nodes, frequency, power_per_area, iterations=30):
    """Surface impedance and field for a temperature profile at a given absorbed power.

    Parameters
    ----------
    material : Material
    geometry : {"cylinder", "tube", "slab"}
    nodes : array [m]
        Radial nodes of the profile (the last is the heated surface).
    t_nodes : array [K]
        Temperatures at the nodes.
    frequency : float [Hz]
    power_per_area : float [W/m2]
        Absorbed power per heated area, > 0.

    Notes
    -----
    For a magnetic steel the permeability depends on the field, so the surface field is found
    by the fixed point ``h <- h sqrt(p_target / p(h))`` with the field-dependent solution of
    :func:`heatcalc.em.solve_radial_field` at each step (converges in a few steps because
    ``p`` grows nearly as ``h^2``).
    """
    if not power_per_area > 0:
        raise ValueError(f"power_per_area={power_per_area!r} must be > 0 [W/m2]")
    mesh = em.mesh_from_nodes(geometry, np.asarray(nodes, dtype=float))
    te = 0.5 * (t_nodes[1:] + t_nodes[:-1])
    rho = material.resistivity(te)
    if material.is_magnetic:

        def mu(h_peak):
            return material.relative_permeability(h_peak, te)

    else:
        mu = 1.0
    h = 1.0
    res = em.solve_radial_field(
        mesh, rho, 1.0 if not material.is_magnetic else mu(te * 0), frequency
    )
    h = float(np.sqrt(power_per_area / res.power_per_area))
    for _ in range(iterations):
        res = em.solve_radial_field(mesh, rho, mu, frequency, h_surface=h)
        ratio = power_per_area / res.power_per_area
        if abs(ratio - 1.0) < 1e-6:
            break
        h *= float(np.sqrt(ratio))
    mu_s = float(np.atleast_1d(res.mu_r)[-1])
    rho_s = float(rho[-1])
    return SurfaceState(
        surface_impedance=complex(res.surface_impedance),
        h_surface=float(res.h_surface),
        power_per_area=float(res.power_per_area),
        resistivity_surface=rho_s,
        mu_r_surface=mu_s,
        skin_depth_surface=float(em.skin_depth(rho_s, frequency, mu_s)),
        field=res,
    )
