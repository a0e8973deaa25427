"""`heatcalc demo`, `heatcalc materials`, help texts, exit codes and PDF skipping."""

import subprocess
import sys

import pytest

from heatcalc import materials, notebook
from heatcalc.cli import main


def test_demo_runs_every_template_and_says_where_the_records_are(
    tmp_path, fixture_templates, capsys
):
    out = tmp_path / "records"
    assert main(["demo", "--out", str(out)]) == 0
    cap = capsys.readouterr()
    html = out / "bar_heating.html"
    assert html.is_file() and (out / "bar_heating.ipynb").is_file()
    assert f"records are in {out.resolve()}" in cap.out and str(html) in cap.out
    assert "[1/1] through-heat: running" in cap.err  # progress, one line per workbook
    assert "1 records in" in cap.err
    # a second demo into the same folder refuses before running anything
    stamp = html.stat().st_mtime_ns
    assert main(["demo", "--out", str(out)]) == 2
    assert "would overwrite" in capsys.readouterr().err
    assert html.stat().st_mtime_ns == stamp


def test_demo_with_a_template_missing(tmp_path, fixture_templates, monkeypatch, capsys):
    monkeypatch.setattr(notebook, "WORKBOOKS", {"braze": "not_there.ipynb"})
    assert main(["demo", "--out", str(tmp_path)]) == 2
    assert "template not_there.ipynb of job type 'braze' is not installed" in (
        capsys.readouterr().err
    )
    assert list(tmp_path.iterdir()) == []


def test_materials_lists_every_key_with_sources(capsys):
    assert main(["materials"]) == 0
    out = capsys.readouterr().out
    keys = materials.available()
    assert keys
    lines = out.splitlines()
    for key in keys:
        assert any(line.startswith(f"{key}: ") for line in lines), key
    assert out.count("sources: ") == len(keys)


@pytest.mark.parametrize("command", [[], ["new"], ["run"], ["demo"], ["materials"]])
def test_help_for_every_command(command, capsys):
    assert main([*command, "--help"]) == 0
    assert "usage: heatcalc" in capsys.readouterr().out


def test_usage_errors_exit_2(capsys):
    assert main([]) == 2
    assert main(["melt"]) == 2
    assert main(["run"]) == 2  # the workbook is required
    assert "usage: heatcalc" in capsys.readouterr().err


def test_missing_workbook_exit_2(tmp_path, capsys):
    assert main(["run", str(tmp_path / "none.ipynb")]) == 2
    assert "none.ipynb' does not exist" in capsys.readouterr().err


def test_module_entry_point_runs_as_a_program():
    done = subprocess.run(
        [sys.executable, "-m", "heatcalc.cli", "run", "--help"],
        capture_output=True, text=True, timeout=60,
    )  # fmt: skip
    assert done.returncode == 0 and "--set NAME=VALUE" in done.stdout


def test_pdf_skipped_cleanly_without_a_browser(tmp_path, monkeypatch):
    monkeypatch.setattr(notebook, "find_browser", lambda: None)
    page = tmp_path / "r.html"
    page.write_text("<p>record</p>", encoding="utf-8")
    pdf, note = notebook.export_pdf(page, tmp_path / "r.pdf")
    assert pdf is None and note.startswith("PDF skipped: no Chromium")
    assert not (tmp_path / "r.pdf").exists()


def test_pdf_failure_of_the_browser_is_reported(tmp_path):
    page = tmp_path / "r.html"
    page.write_text("<p>record</p>", encoding="utf-8")
    pdf, note = notebook.export_pdf(page, tmp_path / "r.pdf", browser="false")  # exits 1
    assert pdf is None and note.startswith("PDF skipped: false failed (1)")
