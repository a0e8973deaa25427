"""Cooling water for the coil: flow for a heat load, velocity and pressure drop.

Water properties come from CoolProp (IAPWS-95 formulation) at the mean water temperature;
the friction factor and Reynolds number from the ``fluids`` library. The coil's tubing is
split into ``circuits`` parallel water circuits of equal flow; each circuit has
``ceil(turns / circuits)`` turns of the tubing's mean turn length plus its own lead length
(the longest circuit sets the pressure drop).

Common practice, no source: water velocity in coil tubing about 1 to 4 m/s, and outlet
water below about 50 degC (323.15 K) to avoid scale; outside those a
:class:`CoolingPracticeWarning` is issued (the calculation still returns).
"""

from __future__ import annotations

import math
import warnings
from dataclasses import dataclass

import numpy as np
import pandas as pd
from CoolProp.CoolProp import PropsSI
from fluids.core import Reynolds
from fluids.friction import HHR_roughness, friction_factor, friction_factor_curved

from heatcalc import _checks as c

__all__ = [
    "CoolingPracticeWarning",
    "VELOCITY_RANGE",
    "MAX_OUTLET_TEMPERATURE",
    "COPPER_TUBE_ROUGHNESS",
    "FRICTION_METHODS",
    "friction_methods",
    "WaterProperties",
    "water_properties",
    "water_mass_flow",
    "darcy_pressure_drop",
    "CoolingResult",
    "coil_cooling",
    "coil_cooling_within_velocity",
]


class CoolingPracticeWarning(UserWarning):
    """Cooling water outside common practice (velocity or outlet temperature)."""


#: Water velocity in coil tubing, common practice (no source) [m/s].
VELOCITY_RANGE = (1.0, 4.0)
#: Outlet water temperature limit, 50 degC, common practice (no source) [K].
MAX_OUTLET_TEMPERATURE = 323.15
#: Absolute roughness of seamless drawn copper tube, the lower value in Idelchik, Handbook of
#: Hydraulic Resistance (as tabulated in ``fluids.friction.HHR_roughness``) [m].
COPPER_TUBE_ROUGHNESS = HHR_roughness[
    "Seamless tubes made from brass, copper, lead, aluminum, Commercially smooth"
][0]

FRICTION_METHODS = ("straight", "helical")


def friction_methods() -> tuple[str, ...]:
    """Names accepted by the ``friction`` argument.

    ``"straight"``: Clamond's solution of the Colebrook equation
    (``fluids.friction.friction_factor``, laminar ``64/Re`` below Re = 2040);
    ``"helical"``: ``fluids.friction.friction_factor_curved`` (Schmidt correlations for
    coiled tubes, with the coil's mean diameter as the helix diameter).

    Examples
    --------
    >>> friction_methods()
    ('straight', 'helical')
    """
    return FRICTION_METHODS


@dataclass(frozen=True)
class WaterProperties:
    """Liquid water properties at one state (SI units)."""

    temperature: float
    pressure: float
    density: float
    specific_heat: float
    viscosity: float


def _saturation_temperature(pressure: float) -> float:
    return PropsSI("T", "P", pressure, "Q", 0, "Water")


def water_properties(temperature, pressure=101325.0) -> WaterProperties:
    """Density, specific heat and viscosity of liquid water from CoolProp.

    Parameters
    ----------
    temperature : float [K]
        Temperature, above 273.16 K and below saturation at ``pressure``.
    pressure : float [Pa]
        Absolute pressure, > 611.655 Pa (triple point).

    Returns
    -------
    WaterProperties

    Raises
    ------
    ValueError
        If the state is not liquid water.

    References
    ----------
    W. Wagner and A. Pruss, IAPWS-95, J. Phys. Chem. Ref. Data 31, 2002, via CoolProp
    (I. H. Bell et al., Ind. Eng. Chem. Res. 53, 2014).

    Examples
    --------
    >>> w = water_properties(293.15)
    >>> round(w.density, 1), round(w.specific_heat), round(w.viscosity * 1e3, 4)
    (998.2, 4184, 1.0016)
    """
    t = float(c.positive("temperature", temperature, "K"))
    p = float(c.real("pressure", pressure, "Pa"))
    if not p > 611.655:
        raise ValueError(f"pressure must be > 611.655 Pa (triple point) [Pa]; got {pressure!r}")
    t_sat = _saturation_temperature(p)
    if not 273.16 < t < t_sat:
        raise ValueError(
            f"temperature must lie between 273.16 K and the saturation temperature "
            f"{t_sat:.2f} K at {p:g} Pa (liquid water) [K]; got {temperature!r}"
        )
    return WaterProperties(
        temperature=t,
        pressure=p,
        density=PropsSI("D", "T", t, "P", p, "Water"),
        specific_heat=PropsSI("C", "T", t, "P", p, "Water"),
        viscosity=PropsSI("V", "T", t, "P", p, "Water"),
    )


def water_mass_flow(heat, temperature_rise, specific_heat):
    """Water mass flow that carries away a heat load, ``m = Q / (c_p dT)``.

    Parameters
    ----------
    heat : float or array [W]
        Heat load, >= 0.
    temperature_rise : float or array [K]
        Allowed water temperature rise, > 0.
    specific_heat : float or array [J/(kg K)]
        Specific heat of the water at the mean temperature, > 0.

    Returns
    -------
    float or array [kg/s]

    Raises
    ------
    ValueError
        For an invalid argument.

    Examples
    --------
    >>> round(float(water_mass_flow(41.8e3, 10.0, 4180.0)), 6)
    1.0
    """
    q = c.non_negative("heat", heat, "W")
    dt = c.positive("temperature_rise", temperature_rise, "K")
    cp = c.positive("specific_heat", specific_heat, "J/(kg K)")
    return c.scalar_or_array(q / (cp * dt))


def darcy_pressure_drop(
    velocity,
    diameter,
    length,
    density,
    viscosity,
    *,
    roughness=0.0,
    minor_loss=0.0,
    friction="straight",
    bend_diameter=None,
):
    """Pressure drop of water flowing through a tube (Darcy-Weisbach).

    Parameters
    ----------
    velocity : float or array [m/s]
        Mean velocity, > 0.
    diameter : float or array [m]
        Inside (hydraulic) diameter, > 0.
    length : float or array [m]
        Tube length, >= 0.
    density : float or array [kg/m^3]
        Water density, > 0.
    viscosity : float or array [Pa s]
        Dynamic viscosity, > 0.
    roughness : float or array [m]
        Absolute wall roughness, >= 0.
    minor_loss : float or array [-]
        Sum of loss coefficients of fittings, entries and exits, >= 0.
    friction : str
        ``"straight"`` or ``"helical"`` (see :func:`friction_methods`).
    bend_diameter : float [m], optional
        Helix diameter for ``friction="helical"`` (required then), > diameter.

    Returns
    -------
    float or array [Pa]
        ``dp = (f L / D + K) rho V**2 / 2``.

    Raises
    ------
    ValueError
        For an invalid argument.

    References
    ----------
    F. M. White, Fluid Mechanics, McGraw-Hill (Darcy-Weisbach equation); D. Clamond,
    "Efficient resolution of the Colebrook equation", Ind. Eng. Chem. Res. 48, 2009.

    Examples
    --------
    Water at 15 degC, 6 L/s in a 50 mm stainless pipe 60 m long; Cengel & Cimbala, Fluid
    Mechanics, 2006, ch. 8, print 96.5 kPa (with f rounded to 0.0172):

    >>> round(float(darcy_pressure_drop(3.06, 0.05, 60.0, 999.1, 1.138e-3, roughness=2e-6)))
    96453
    """
    v = c.positive("velocity", velocity, "m/s")
    d = c.positive("diameter", diameter, "m")
    length_ = c.non_negative("length", length, "m")
    rho = c.positive("density", density, "kg/m^3")
    mu = c.positive("viscosity", viscosity, "Pa s")
    eps = c.non_negative("roughness", roughness, "m")
    k = c.non_negative("minor_loss", minor_loss, "-")
    c.choice("friction", friction, FRICTION_METHODS)
    if friction == "helical":
        if bend_diameter is None:
            raise ValueError("bend_diameter must be given for friction='helical'")
        dc = c.positive("bend_diameter", bend_diameter, "m")
        if not np.all(dc > d):
            raise ValueError(f"bend_diameter must be > diameter; got {bend_diameter!r}")
    else:
        dc = np.asarray(np.nan)
    v, d, length_, rho, mu, eps, k, dc = np.broadcast_arrays(v, d, length_, rho, mu, eps, k, dc)
    out = np.empty(v.shape)
    for idx in np.ndindex(v.shape):
        re = Reynolds(V=float(v[idx]), D=float(d[idx]), rho=float(rho[idx]), mu=float(mu[idx]))
        if friction == "straight":
            fd = friction_factor(Re=re, eD=float(eps[idx] / d[idx]), Method="Clamond")
        else:
            fd = friction_factor_curved(
                Re=re, Di=float(d[idx]), Dc=float(dc[idx]), roughness=float(eps[idx])
            )
        out[idx] = (fd * length_[idx] / d[idx] + k[idx]) * rho[idx] * v[idx] ** 2 / 2.0
    return c.scalar_or_array(out)


_ROWS = (
    ("heat load", "heat", "W"),
    ("inlet temperature", "inlet_temperature", "K"),
    ("outlet temperature", "outlet_temperature", "K"),
    ("water mass flow", "mass_flow", "kg/s"),
    ("water volume flow", "volume_flow", "m^3/s"),
    ("parallel circuits", "circuits", "-"),
    ("tubing length per circuit", "circuit_length", "m"),
    ("channel hydraulic diameter", "hydraulic_diameter", "m"),
    ("water velocity", "velocity", "m/s"),
    ("Reynolds number", "reynolds", "-"),
    ("Darcy friction factor", "friction_factor", "-"),
    ("pressure drop", "pressure_drop", "Pa"),
)


@dataclass(frozen=True)
class CoolingResult:
    """Cooling-water figures for a coil (SI units; ``to_frame()`` for a table)."""

    heat: float
    inlet_temperature: float
    outlet_temperature: float
    mass_flow: float
    volume_flow: float
    circuits: int
    circuit_length: float
    hydraulic_diameter: float
    velocity: float
    reynolds: float
    friction_factor: float
    pressure_drop: float
    friction: str
    cautions: tuple[str, ...]

    def to_frame(self) -> pd.DataFrame:
        """Table with columns quantity, value, unit."""
        rows = [(label, float(getattr(self, name)), unit) for label, name, unit in _ROWS]
        rows.append(("friction method", self.friction, "-"))
        return pd.DataFrame(rows, columns=["quantity", "value", "unit"])

    def _repr_html_(self) -> str:
        notes = "".join(f"<p>Caution: {text}</p>" for text in self.cautions)
        return self.to_frame().to_html(index=False) + notes


def coil_cooling(
    coil,
    heat,
    temperature_rise,
    *,
    inlet_temperature=293.15,
    pressure=101325.0,
    circuits=1,
    lead_length=0.0,
    extra_heat=0.0,
    roughness=COPPER_TUBE_ROUGHNESS,
    minor_loss=0.0,
    friction="straight",
) -> CoolingResult:
    """Water flow, velocity and pressure drop to cool a coil.

    Parameters
    ----------
    coil : SolenoidCoil or RectangularSolenoidCoil
        The coil (tubing channel and turn length).
    heat : float [W]
        Coil copper loss, >= 0.
    temperature_rise : float [K]
        Allowed water temperature rise, > 0.
    inlet_temperature : float [K]
        Inlet water temperature.
    pressure : float [Pa]
        Absolute water pressure for the properties.
    circuits : int
        Number of parallel water circuits, 1 to ``coil.turns``.
    lead_length : float [m]
        Tubing length of the leads per circuit, >= 0.
    extra_heat : float [W]
        Further heat carried by the same water (e.g. conducted from a crucible, or
        magnetic-shunt losses), >= 0.
    roughness : float [m]
        Tube wall roughness, >= 0; default drawn copper.
    minor_loss : float [-]
        Sum of fitting loss coefficients per circuit, >= 0.
    friction : str
        ``"straight"`` or ``"helical"`` (see :func:`friction_methods`).

    Returns
    -------
    CoolingResult

    Raises
    ------
    ValueError
        For an invalid argument or water that would not stay liquid.

    Warns
    -----
    CoolingPracticeWarning
        If the velocity lies outside ``VELOCITY_RANGE`` or the outlet is above
        ``MAX_OUTLET_TEMPERATURE``.

    Notes
    -----
    ``m = (heat + extra_heat) / (c_p dT)`` with ``c_p`` at the mean water temperature;
    velocity ``m / (circuits rho A_channel)``; pressure drop by
    :func:`darcy_pressure_drop` over the longest circuit.
    """
    c.choice("friction", friction, FRICTION_METHODS)
    eps = float(c.non_negative("roughness", roughness, "m"))
    n_circ = c.positive_integer("circuits", circuits)
    if n_circ > coil.turns:
        raise ValueError(f"circuits must be <= turns ({coil.turns}); got {circuits!r}")
    q = float(c.non_negative("heat", heat, "W")) + float(
        c.non_negative("extra_heat", extra_heat, "W")
    )
    dt = float(c.positive("temperature_rise", temperature_rise, "K"))
    t_in = float(c.positive("inlet_temperature", inlet_temperature, "K"))
    lead = float(c.non_negative("lead_length", lead_length, "m"))
    t_out = t_in + dt
    water_in = water_properties(t_in, pressure)  # raises if the inlet is not liquid
    t_sat = _saturation_temperature(water_in.pressure)
    if not t_out < t_sat:
        raise ValueError(
            f"temperature_rise must keep the outlet below saturation ({t_sat:.2f} K); "
            f"got {temperature_rise!r} K from {t_in!r} K"
        )
    water = water_properties(t_in + dt / 2.0, pressure)
    mass = float(water_mass_flow(q, dt, water.specific_heat))
    if mass == 0.0:
        raise ValueError("heat + extra_heat must be > 0 to size a water flow; got 0")
    area = coil.conductor.channel_area
    d_h = coil.conductor.hydraulic_diameter
    velocity = mass / (n_circ * water.density * area)
    length = math.ceil(coil.turns / n_circ) * coil.mean_turn_length + lead
    re = Reynolds(V=velocity, D=d_h, rho=water.density, mu=water.viscosity)
    if friction == "helical":
        fd = friction_factor_curved(Re=re, Di=d_h, Dc=coil.mean_diameter, roughness=eps)
    else:
        fd = friction_factor(Re=re, eD=eps / d_h, Method="Clamond")
    dp = float(
        darcy_pressure_drop(
            velocity,
            d_h,
            length,
            water.density,
            water.viscosity,
            roughness=roughness,
            minor_loss=minor_loss,
            friction=friction,
            bend_diameter=coil.mean_diameter if friction == "helical" else None,
        )
    )
    cautions = []
    lo, hi = VELOCITY_RANGE
    if not lo <= velocity <= hi:
        cautions.append(
            f"water velocity {velocity:.2f} m/s outside {lo:g}-{hi:g} m/s (common practice)"
        )
    if t_out > MAX_OUTLET_TEMPERATURE:
        cautions.append(
            f"outlet water {t_out - 273.15:.1f} degC above "
            f"{MAX_OUTLET_TEMPERATURE - 273.15:.0f} degC (common practice)"
        )
    for text in cautions:
        warnings.warn(text, CoolingPracticeWarning, stacklevel=2)
    return CoolingResult(
        heat=q,
        inlet_temperature=t_in,
        outlet_temperature=t_out,
        mass_flow=mass,
        volume_flow=mass / water.density,
        circuits=n_circ,
        circuit_length=length,
        hydraulic_diameter=d_h,
        velocity=velocity,
        reynolds=re,
        friction_factor=fd,
        pressure_drop=dp,
        friction=friction,
        cautions=tuple(cautions),
    )


def coil_cooling_within_velocity(
    coil, heat, temperature_rise, *, max_velocity=3.0, **options
) -> CoolingResult:
    """Cooling with the fewest parallel water circuits that keep the velocity in bounds.

    Parameters
    ----------
    coil, heat, temperature_rise, **options
        As for :func:`coil_cooling` (``circuits`` is chosen here and must not be given).
    max_velocity : float [m/s]
        Largest velocity accepted, > 0. The default 3 m/s sits inside the usual 1-4 m/s range
        for coil tubing with a margin for the pressure drop (common practice, no source).

    Returns
    -------
    CoolingResult
        For the smallest number of circuits (1 to ``coil.turns``) whose velocity is at most
        `max_velocity`; with every turn its own circuit if none is. Warnings
        (:class:`CoolingPracticeWarning`) are issued for the returned design only.

    Examples
    --------
    >>> from heatcalc.coil import SolenoidCoil, RectangularTube
    >>> coil = SolenoidCoil(20, 0.4, 0.12, RectangularTube(0.015, 0.01, 0.0015), 1.9e-8)
    >>> res = coil_cooling_within_velocity(coil, 60e3, 15.0)
    >>> res.velocity <= 3.0
    True
    """
    if "circuits" in options:
        raise ValueError("circuits is chosen by coil_cooling_within_velocity; do not give it")
    vmax = float(c.positive("max_velocity", max_velocity, "m/s"))
    n_turns = c.positive_integer("coil.turns", coil.turns)
    for n in range(1, n_turns + 1):
        with warnings.catch_warnings():
            warnings.simplefilter("ignore", CoolingPracticeWarning)
            trial = coil_cooling(coil, heat, temperature_rise, circuits=n, **options)
        if trial.velocity <= vmax:
            break
    return coil_cooling(coil, heat, temperature_rise, circuits=trial.circuits, **options)
