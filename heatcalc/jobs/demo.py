"""The built-in demo scenario. ALL OF IT IS INVENTED.

Customer: *Brannock Valley Metalworks Ltd* (an invented foundry and forge), served by the
application-engineering desk of *Northfold Induction Systems* (an invented equipment builder).
People, part numbers and job references are invented too. The four jobs are the ones the
workbooks are committed with; they exist to show the workbooks working, not as design data.
"""

from __future__ import annotations

__all__ = ["CUSTOMER", "ENGINEER", "CHECKER", "DEMO_JOBS"]

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
