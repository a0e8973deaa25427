"""`heatcalc new`: a template copy with a blank job header, no outputs, never overwriting."""

import nbformat
import papermill
import pytest

from heatcalc import notebook
from heatcalc.cli import main

HEADER_DEFAULTS = {
    "job_reference": '""',
    "customer": '""',
    "part": '""',
    "engineer": '""',
    "checker": '""',
    "job_date": '""',
    "revision": "[]",
}


def test_new_blanks_the_header_and_keeps_the_inputs(
    tmp_path, fixture_templates, bar_workbook, capsys
):
    dest = tmp_path / "jobs" / "Q-2001.ipynb"
    assert main(["new", "through-heat", str(dest)]) == 0
    assert str(dest) in capsys.readouterr().out
    new = papermill.inspect_notebook(str(dest))
    template = papermill.inspect_notebook(str(bar_workbook))
    assert {k: new[k]["default"] for k in HEADER_DEFAULTS} == HEADER_DEFAULTS
    assert template["customer"]["default"] == '"Northfield Thermal Works"'  # it was filled
    for name in template:
        if name not in HEADER_DEFAULTS:
            assert new[name]["default"] == template[name]["default"], name
    nb = nbformat.read(dest, as_version=4)
    code = [c for c in nb.cells if c.cell_type == "code"]
    assert all(c.outputs == [] and c.execution_count is None for c in code)
    assert "papermill" not in nb.metadata and "widgets" not in nb.metadata
    src = next(c.source for c in nb.cells if "parameters" in c.metadata.get("tags", []))
    assert "# Job header" in src and "Northfield" not in src  # comments kept, names gone


def test_new_refuses_to_overwrite(tmp_path, fixture_templates, capsys):
    dest = tmp_path / "mine.ipynb"
    dest.write_text("my work", encoding="utf-8")
    assert main(["new", "through-heat", str(dest)]) == 2
    err = capsys.readouterr().err
    assert "exists already" in err and str(dest) in err
    assert dest.read_text(encoding="utf-8") == "my work"
    with pytest.raises(FileExistsError, match="mine.ipynb exists already"):
        notebook.new_workbook("through-heat", dest)


def test_new_unknown_job_type_lists_the_known_ones(tmp_path, capsys):
    assert main(["new", "forging", str(tmp_path / "a.ipynb")]) == 2
    err = capsys.readouterr().err
    assert "job_type='forging' is not known" in err
    assert "melting, through-heat, harden, braze" in err
    assert not (tmp_path / "a.ipynb").exists()


def test_new_refuses_a_path_that_is_not_a_notebook(tmp_path, fixture_templates):
    with pytest.raises(ValueError, match="must end in .ipynb"):
        notebook.new_workbook("through-heat", tmp_path / "job.txt")


def test_blank_header_handles_layout_annotations_and_non_ascii():
    source = (
        '# header\n'
        'job_reference = "Q-1"  # the quote number\n'
        'customer: str = "Müller Härterei GmbH"\n'
        'part = "Welle"; engineer = "Zoë"\n'
        'checker = "B"\n'
        'job_date = "2026-01-01"\n'
        'revision = [\n    ["A", "2026-01-01", "Erstausgabe", "ZÖ"],\n]\n'
        'diameter = "80 mm"\n'
    )  # fmt: skip
    out = notebook._blank_header(source, "test")
    assert out == (
        '# header\n'
        'job_reference = ""  # the quote number\n'
        'customer: str = ""\n'
        'part = ""; engineer = ""\n'
        'checker = ""\n'
        'job_date = ""\n'
        'revision = []\n'
        'diameter = "80 mm"\n'
    )  # fmt: skip


def test_blank_header_requires_every_header_parameter():
    with pytest.raises(ValueError, match=r"does not assign the job header parameters \['checker'"):
        notebook._blank_header(
            'job_reference = ""\ncustomer = ""\npart = ""\nengineer = ""\n'
            'job_date = ""\nrevision = []\n',
            "tmpl.ipynb",
        )
