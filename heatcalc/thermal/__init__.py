"""Thermal core: enthalpy, losses, lumped and radial transient heating.

* :mod:`~heatcalc.thermal.enthalpy` - specific enthalpy with latent heat, and its inverse;
* :mod:`~heatcalc.thermal.energy` - energy to heat, melt and superheat a charge;
* :mod:`~heatcalc.thermal.losses`, :mod:`~heatcalc.thermal.air`,
  :mod:`~heatcalc.thermal.surface_loss` - radiation and natural convection;
* :mod:`~heatcalc.thermal.wall` - conduction through cylindrical layers;
* :mod:`~heatcalc.thermal.lumped` - uniform-temperature heating;
* :mod:`~heatcalc.thermal.conduction`, :mod:`~heatcalc.thermal.induction_source`,
  :mod:`~heatcalc.thermal.coupled`, :mod:`~heatcalc.thermal.schedule` - radial transient
  heating coupled to the induced-current solution.

All temperatures are in kelvin, all quantities SI.
"""

from .air import AirProperties, air_properties
from .conduction import ConductionGrid, RadialConduction, conduction_grid
from .coupled import simulate_heating
from .energy import EnergyBreakdown, charge_energy
from .enthalpy import (
    REFERENCE_TEMPERATURE,
    EnthalpyCurve,
    enthalpy_curve,
    specific_enthalpy,
    temperature_from_enthalpy,
)
from .induction_source import InductionSource
from .losses import (
    NATURAL_CONVECTION_METHODS,
    natural_convection_coefficient,
    natural_convection_loss,
    natural_convection_methods,
    radiation_coefficient,
    radiation_loss,
)
from .lumped import LumpedResult, lumped_heating
from .schedule import MODES, Segment, heat_segment, soak_segment, transfer_segment
from .surface_loss import SurfaceLoss
from .transient_result import TransientResult
from .wall import WallConduction, cylindrical_wall

__all__ = [
    "REFERENCE_TEMPERATURE",
    "EnthalpyCurve",
    "enthalpy_curve",
    "specific_enthalpy",
    "temperature_from_enthalpy",
    "EnergyBreakdown",
    "charge_energy",
    "AirProperties",
    "air_properties",
    "NATURAL_CONVECTION_METHODS",
    "natural_convection_methods",
    "natural_convection_coefficient",
    "natural_convection_loss",
    "radiation_loss",
    "radiation_coefficient",
    "SurfaceLoss",
    "WallConduction",
    "cylindrical_wall",
    "LumpedResult",
    "lumped_heating",
    "ConductionGrid",
    "conduction_grid",
    "RadialConduction",
    "InductionSource",
    "MODES",
    "Segment",
    "heat_segment",
    "transfer_segment",
    "soak_segment",
    "TransientResult",
    "simulate_heating",
]
