"""Temperature-dependent material properties from documented, sourced data files.

>>> from heatcalc import materials
>>> steel = materials.get("aisi-1045")
>>> steel.resistivity(293.15) > 1e-7
True
"""

from .library import MaterialFileError, available, catalogue, data_dir, get, load
from .magnetisation import MagnetisationModel
from .material import TABLE_PROPERTIES, Material
from .tables import ExtrapolationWarning, OutOfRangeError, PropertyTable
from .transformation import ac1_andrews, ac3_andrews

__all__ = [
    "available",
    "get",
    "load",
    "catalogue",
    "data_dir",
    "Material",
    "MagnetisationModel",
    "PropertyTable",
    "OutOfRangeError",
    "ExtrapolationWarning",
    "MaterialFileError",
    "TABLE_PROPERTIES",
    "ac1_andrews",
    "ac3_andrews",
]
