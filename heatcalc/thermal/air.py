"""Properties of dry air for convection correlations, tabulated once from CoolProp.

CoolProp's air model (Lemmon et al. 2000 equation of state, Lemmon and Jacobsen 2004 transport
properties) is valid from about 60 K to 2000 K. The table here spans 200 K to that upper
limit, queried from CoolProp itself, in steps of 5 K at one pressure, and is interpolated
linearly; the interpolation error is below 1e-4 relative for every property (checked in
``tests/thermal/test_thermal_losses.py``). A film temperature outside the table raises
ValueError: no clamping and no silent extrapolation. Above 2000 K (surfaces near 3700 K in
300 K air) no transport-property model is wired in; radiation dominates there by two orders
of magnitude.
"""

from __future__ import annotations

import functools
from dataclasses import dataclass

import numpy as np
from scipy.constants import atm

from .. import _checks as chk

__all__ = ["AirProperties", "air_properties", "air_table"]

_T_LOW = 200.0
_STEP = 5.0


@dataclass(frozen=True, eq=False)
class AirProperties:
    """Air properties at one or more temperatures (arrays of equal shape).

    Attributes
    ----------
    temperature : array [K]
    density : array [kg/m3]
    viscosity : array [Pa s]
        Dynamic viscosity.
    conductivity : array [W/(m K)]
    specific_heat : array [J/(kg K)]
        Isobaric.
    prandtl : array [-]
    expansion : array [1/K]
        Volumetric expansion coefficient, ideal gas ``1/T``.
    """

    temperature: np.ndarray
    density: np.ndarray
    viscosity: np.ndarray
    conductivity: np.ndarray
    specific_heat: np.ndarray
    prandtl: np.ndarray
    expansion: np.ndarray

    @property
    def kinematic_viscosity(self) -> np.ndarray:
        """Kinematic viscosity [m2/s]."""
        return self.viscosity / self.density


@functools.lru_cache(maxsize=8)
def air_table(pressure: float = atm) -> AirProperties:
    """The CoolProp air table at `pressure` [Pa], 200 K to CoolProp's upper limit, 5 K steps.

    Computed once per pressure and cached.

    References
    ----------
    I. H. Bell, J. Wronski, S. Quoilin, V. Lemort, "Pure and pseudo-pure fluid thermophysical
    property evaluation and the open-source thermophysical property library CoolProp",
    Ind. Eng. Chem. Res. 53 (2014) 2498-2508.
    E. W. Lemmon, R. T. Jacobsen, "Viscosity and thermal conductivity equations for nitrogen,
    oxygen, argon, and air", Int. J. Thermophys. 25 (2004) 21-69.
    """
    import CoolProp.CoolProp as CP

    p = float(chk.positive("pressure", pressure, "Pa"))
    t_high = float(CP.PropsSI("Tmax", "Air"))
    t = np.arange(_T_LOW, t_high + 0.5 * _STEP, _STEP)
    t[-1] = min(t[-1], t_high)
    state = CP.AbstractState("HEOS", "Air")
    rows = []
    for ti in t:  # about 360 state updates, once per pressure
        state.update(CP.PT_INPUTS, p, float(ti))
        rows.append((state.rhomass(), state.viscosity(), state.conductivity(), state.cpmass()))
    rho, mu, k, cp = np.array(rows).T
    return AirProperties(t, rho, mu, k, cp, cp * mu / k, 1.0 / t)


def air_properties(temperature, pressure: float = atm) -> AirProperties:
    """Air properties at `temperature` [K] by linear interpolation in :func:`air_table`.

    Parameters
    ----------
    temperature : float or array [K]
        Between 200 K and 2000 K (CoolProp's upper limit for air).
    pressure : float [Pa]
        Default one standard atmosphere.

    Returns
    -------
    AirProperties
        Arrays of the shape of `temperature`.

    Raises
    ------
    ValueError
        If a temperature lies outside the table.

    Examples
    --------
    >>> air = air_properties(300.0)
    >>> round(float(air.conductivity), 4), round(float(air.prandtl), 3)
    (0.0264, 0.707)
    """
    tab = air_table(float(chk.positive("pressure", pressure, "Pa")))
    t = chk.kelvin("temperature", temperature)
    lo, hi = tab.temperature[0], tab.temperature[-1]
    if t.size and (t.min() < lo or t.max() > hi):
        worst = t.min() if t.min() < lo else t.max()
        raise ValueError(
            f"temperature={worst:.2f} K (air film) is outside the air property table "
            f"{lo:.0f} K to {hi:.0f} K (CoolProp's range for air)"
        )

    def f(values):
        return np.interp(t, tab.temperature, values)

    return AirProperties(
        t,
        f(tab.density),
        f(tab.viscosity),
        f(tab.conductivity),
        f(tab.specific_heat),
        f(tab.prandtl),
        1.0 / t,
    )
