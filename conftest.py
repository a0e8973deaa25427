"""Test-session set-up shared by pytest and nbval.

* nbval compares committed workbook outputs strictly; volatile text (memory addresses,
  timestamps, temporary paths, version strings, figure reprs) is masked by the sanitize file
  ``tests/nbval_sanitize.cfg``, whose absolute path is set here so that pytest may be started
  from any folder.
* stderr of workbook cells is not compared (warnings text varies between library versions).
"""

from pathlib import Path

HERE = Path(__file__).resolve().parent
SANITIZE = HERE / "tests" / "nbval_sanitize.cfg"


def pytest_configure(config):
    if hasattr(config.option, "nbval_sanitize_with") and not config.option.nbval_sanitize_with:
        config.option.nbval_sanitize_with = str(SANITIZE)
    # Warm matplotlib's font cache once, before kernels start (first use is slow).
    from matplotlib import font_manager

    font_manager.findfont("DejaVu Sans")


def pytest_collectstart(collector):
    if collector.fspath and collector.fspath.ext == ".ipynb":
        collector.skip_compare += ("stderr",)
