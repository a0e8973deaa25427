"""The built-in demo scenario. ALL OF IT IS INVENTED.

Customer: *Brannock Valley Metalworks Ltd* (an invented foundry and forge), served by the
application-engineering desk of *Northfold Induction Systems* (an invented equipment builder).
People, part numbers and job references are invented too. The four jobs are the ones the
workbooks are committed with; they exist to show the workbooks working, not as design data.
"""

from __future__ import annotations

from .brazing import BrazingInputs
from .melting import MeltingInputs
from .surface_harden import HardenInputs
from .through_heat import ThroughHeatInputs

__all__ = ["CUSTOMER", "ENGINEER", "CHECKER", "DEMO_JOBS", "DEMO_INPUTS"]

CUSTOMER = "Brannock Valley Metalworks Ltd (invented demo customer)"
ENGINEER = "A. Ferreira (invented)"
CHECKER = "K. Lindqvist (invented)"

#: Header fields of each demo job (invented).
DEMO_JOBS = {
    "melting": {
        "job_reference": "NIS-26-0412-M",
        "part": "6061 returns and ingot remelt, bay 2 crucible furnace (BVM-F2)",
    },
    "through-heat": {
        "job_reference": "NIS-26-0413-B",
        "part": "AISI 1045 billet 60 x 150 mm for flange blank BVM-FL-6031",
    },
    "harden": {
        "job_reference": "NIS-26-0414-H",
        "part": "AISI 4140 drive shaft BVM-SH-2207, bearing journal 40 mm",
    },
    "braze": {
        "job_reference": "NIS-26-0415-J",
        "part": "Copper tube 22 x 1.0 into brass socket, manifold BVM-MN-118",
    },
}

#: The demo inputs of each job type (invented); the workbooks are committed with these, and
#: the tests of the jobs, the figures and the workbooks use them.
DEMO_INPUTS = {
    "melting": MeltingInputs(
        alloy="al-6061",
        charge_mass="300 kg",
        pouring_temperature="750 degC",
        crucible_inner_diameter="500 mm",
        lining_thickness="65 mm",
        coil_inner_diameter="660 mm",
        coil_length="720 mm",
        coil_turns=14,
        tube_axial_width="45 mm",
        tube_radial_depth="25 mm",
        tube_wall="4 mm",
        frequency="500 Hz",
        cycle_time="72 min",
        frequency_options=("250 Hz", "500 Hz", "1 kHz", "3 kHz"),
        max_coil_voltage="800 V",
        start_temperature="25 degC",
    ),
    "through-heat": ThroughHeatInputs(
        material="aisi-1045",
        diameter="60 mm",
        billet_length="150 mm",
        throughput="1.5 t/h",
        target_temperature="1200 degC",
        allowed_spread="80 delta_degC",
        frequency_options=("1 kHz", "3 kHz", "6 kHz", "10 kHz"),
        coil_inner_diameter="95 mm",
        coil_sections=3,
        section_power_shares=(0.42, 0.33, 0.25),
        max_coil_voltage="800 V",
    ),
    "harden": HardenInputs(
        material="aisi-4140",
        diameter="40 mm",
        case_depth="2.0 mm",
        frequency_options=("10 kHz", "30 kHz", "100 kHz", "200 kHz"),
        coil_inner_diameter="48 mm",
        coil_length="20 mm",
        heated_length="120 mm",
        max_core_temperature="400 degC",
        supply_voltage="400 V",
        water_temperature_rise="5 delta_degC",
    ),
    "braze": BrazingInputs(
        tube_material="cu-etp",
        tube_outer_diameter="22 mm",
        tube_wall="1.0 mm",
        fitting_material="brass-c26000",
        fitting_outer_diameter="28 mm",
        overlap_length="20 mm",
        coil_inner_diameter="40 mm",
        coil_turns=4,
        power="5 kW",
        frequency_options=("10 kHz", "30 kHz", "100 kHz", "200 kHz"),
        allowed_difference="60 delta_degC",
    ),
}
