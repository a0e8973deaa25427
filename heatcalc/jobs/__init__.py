"""Job calculations: one module per job type, each a frozen input dataclass, one function and
a result object that shows as tables in a notebook.

============  ========================  =========================  ======================
job type      inputs                    function                   result
============  ========================  =========================  ======================
melting       :class:`MeltingInputs`    :func:`run_melting`        :class:`MeltingResult`
through-heat  :class:`ThroughHeatInputs` :func:`run_through_heat`  :class:`ThroughHeatResult`
harden        :class:`HardenInputs`     :func:`run_surface_harden` :class:`HardenResult`
braze         :class:`BrazingInputs`    :func:`run_brazing`        :class:`BrazingResult`
============  ========================  =========================  ======================
"""

from ._base import HandCheck, JobResult, JobWarning
from .brazing import BrazingInputs, BrazingResult, run_brazing
from .melting import MeltingInputs, MeltingResult, run_melting
from .surface_harden import HardenInputs, HardenResult, case_depth_from_profile, run_surface_harden
from .through_heat import ThroughHeatInputs, ThroughHeatResult, run_through_heat

__all__ = [
    "HandCheck",
    "JobResult",
    "JobWarning",
    "MeltingInputs",
    "MeltingResult",
    "run_melting",
    "ThroughHeatInputs",
    "ThroughHeatResult",
    "run_through_heat",
    "HardenInputs",
    "HardenResult",
    "run_surface_harden",
    "case_depth_from_profile",
    "BrazingInputs",
    "BrazingResult",
    "run_brazing",
]
