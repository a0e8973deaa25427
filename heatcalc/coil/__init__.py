"""Coil and power-supply circuit: impedance, efficiency, capacitors, frequency, cooling water.

Modules
-------
inductance
    Nagaoka's coefficient, empty-coil and return-path inductance.
conductor
    Copper tubing profiles and the impedance of the current-carrying wall.
geometry
    Coil and workpiece dataclasses.
circuit
    Equivalent circuit of coil and workpiece (see its notes for the assumed geometry).
supply
    Capacitor compensation, resonance, supply terminal quantities and rating.
matching
    Number of turns or matching-transformer ratio for a supply's limits.
frequency
    Frequency sweeps, heating-pattern rules, ranking of available frequencies, plot.
cooling
    Cooling-water flow, velocity and pressure drop.
"""

from heatcalc.coil.circuit import (
    END_CORRECTION_METHODS,
    END_CORRECTION_WARNING_RATIO,
    CoilCircuitResult,
    CoilImpedance,
    EndCorrectionWarning,
    coil_circuit,
    coil_impedance,
    ellipsoid_demagnetising_factor,
    end_correction_methods,
    workpiece_power_at_current,
)
from heatcalc.coil.conductor import (
    RectangularTube,
    RoundTube,
    backed_sheet_impedance,
    optimum_wall_thickness,
)
from heatcalc.coil.cooling import (
    COPPER_TUBE_ROUGHNESS,
    FRICTION_METHODS,
    MAX_OUTLET_TEMPERATURE,
    VELOCITY_RANGE,
    CoolingPracticeWarning,
    CoolingResult,
    WaterProperties,
    coil_cooling,
    coil_cooling_within_velocity,
    darcy_pressure_drop,
    friction_methods,
    water_mass_flow,
    water_properties,
)
from heatcalc.coil.frequency import (
    PURPOSES,
    FrequencyBand,
    HeatingRule,
    frequency_band,
    frequency_sweep,
    heating_rule,
    plot_frequency_sweep,
    rank_frequencies,
    relative_power_optimum,
)
from heatcalc.coil.geometry import (
    CylinderWorkpiece,
    RectangularSolenoidCoil,
    SlabWorkpiece,
    SolenoidCoil,
    TubeWorkpiece,
)
from heatcalc.coil.inductance import empty_coil_inductance, nagaoka, return_path_inductance
from heatcalc.coil.matching import (
    TransformerRatio,
    TurnsChoice,
    transformer_ratio_for_supply,
    turns_for_supply,
)
from heatcalc.coil.supply import (
    ARRANGEMENTS,
    CapacitorBank,
    SupplyRating,
    capacitor_bank,
    coil_resonant_frequency,
    compensated_impedance,
    compensation_capacitance,
    resonant_frequency,
    supply_rating,
    terminal_quantities,
)

__all__ = [
    # inductance
    "nagaoka",
    "empty_coil_inductance",
    "return_path_inductance",
    # conductor and geometry
    "RectangularTube",
    "RoundTube",
    "backed_sheet_impedance",
    "optimum_wall_thickness",
    "SolenoidCoil",
    "RectangularSolenoidCoil",
    "CylinderWorkpiece",
    "TubeWorkpiece",
    "SlabWorkpiece",
    # circuit
    "END_CORRECTION_METHODS",
    "END_CORRECTION_WARNING_RATIO",
    "EndCorrectionWarning",
    "ellipsoid_demagnetising_factor",
    "end_correction_methods",
    "CoilImpedance",
    "CoilCircuitResult",
    "coil_impedance",
    "coil_circuit",
    "workpiece_power_at_current",
    # supply
    "ARRANGEMENTS",
    "compensation_capacitance",
    "compensated_impedance",
    "CapacitorBank",
    "capacitor_bank",
    "resonant_frequency",
    "coil_resonant_frequency",
    "terminal_quantities",
    "SupplyRating",
    "supply_rating",
    # matching
    "TurnsChoice",
    "turns_for_supply",
    "TransformerRatio",
    "transformer_ratio_for_supply",
    # frequency
    "PURPOSES",
    "HeatingRule",
    "heating_rule",
    "relative_power_optimum",
    "FrequencyBand",
    "frequency_band",
    "frequency_sweep",
    "rank_frequencies",
    "plot_frequency_sweep",
    # cooling
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
