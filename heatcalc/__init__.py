"""heatcalc: induction-heating application calculations and calculation-record workbooks.

Sub-packages, importing downwards only:

* :mod:`heatcalc.units` - quantities with units at the boundary, display formatting;
* :mod:`heatcalc.materials` - temperature-dependent material data with sources;
* :mod:`heatcalc.em` - skin depth, analytic and radial numerical field solutions;
* :mod:`heatcalc.thermal` - enthalpy, losses, lumped and radial transient heating;
* :mod:`heatcalc.coil` - coil and supply circuit, frequency choice, cooling water;
* :mod:`heatcalc.jobs` - one calculation per job type, returning result objects.
"""

from importlib.metadata import PackageNotFoundError, version

try:
    __version__ = version("heatcalc")
except PackageNotFoundError:  # running from a source tree that is not installed
    __version__ = "0.0.0+unknown"

__all__ = ["__version__"]
