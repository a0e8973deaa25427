"""Shared set-up of the command-line tests.

The fixture workbooks in ``fixtures/`` are templates (no outputs): they are run by the tests,
not compared by nbval.
"""

from pathlib import Path

import pytest

from heatcalc import notebook

collect_ignore_glob = ["fixtures/*"]

FIXTURES = Path(__file__).resolve().parent / "fixtures"
#: A small workbook shaped like the job workbooks (used by the browser test too).
BAR_WORKBOOK = FIXTURES / "bar_heating.ipynb"


@pytest.fixture(scope="session")
def bar_workbook():
    return BAR_WORKBOOK


@pytest.fixture
def fixture_templates(monkeypatch):
    """Make the fixture workbook the template of the job type "through-heat" (only)."""
    monkeypatch.setattr(notebook, "_templates", lambda: FIXTURES)
    monkeypatch.setattr(notebook, "WORKBOOKS", {"through-heat": BAR_WORKBOOK.name})
