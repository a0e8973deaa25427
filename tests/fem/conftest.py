"""The finite-element cross-checks need scikit-fem (test extra); without it, skip this folder.

``axisym_fem.py`` and ``crosscheck_cases.py`` are helper modules, not test files, but
``--doctest-modules`` imports them; without scikit-fem those imports would be collection
errors rather than skips.
"""

import importlib.util

HELPERS_NEEDING_SKFEM = ["axisym_fem.py", "crosscheck_cases.py"]
collect_ignore = [] if importlib.util.find_spec("skfem") else HELPERS_NEEDING_SKFEM
