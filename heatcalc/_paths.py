"""Where the shipped data and workbook templates are.

In an installed wheel they are the sub-packages ``heatcalc._data`` and ``heatcalc._workbooks``
(mapped from the repository's top-level ``data/`` and ``workbooks/`` by ``pyproject.toml``). In a
source tree or an editable install those sub-packages do not exist, and the top-level folders
are used directly.
"""

from __future__ import annotations

from importlib import resources
from pathlib import Path

__all__ = ["shipped"]

_REPO = Path(__file__).resolve().parent.parent


def shipped(package: str, folder: str):
    """A traversable for ``heatcalc.<package>`` or, in a source tree, ``<repo>/<folder>``."""
    try:
        return resources.files(f"heatcalc.{package}")
    except ModuleNotFoundError:
        return _REPO / folder
