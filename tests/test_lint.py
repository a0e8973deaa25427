"""The lint rules in pyproject.toml are enforced by the test run (ruff check + format)."""

import shutil
import subprocess
import sys
from pathlib import Path

import pytest

REPO = Path(__file__).resolve().parents[1]


def _ruff(*args):
    try:
        import ruff  # noqa: F401
    except ImportError:  # pragma: no cover - ruff is in the test extra
        if shutil.which("ruff") is None:
            pytest.fail("ruff is not installed; install the test extra: pip install '.[test]'")
    return subprocess.run(
        [sys.executable, "-m", "ruff", *args, str(REPO)],
        capture_output=True,
        text=True,
        cwd=REPO,
    )


def test_ruff_check_is_clean():
    res = _ruff("check", "--no-cache")
    assert res.returncode == 0, res.stdout + res.stderr


def test_ruff_format_is_clean():
    res = _ruff("format", "--check", "--no-cache")
    assert res.returncode == 0, res.stdout + res.stderr
