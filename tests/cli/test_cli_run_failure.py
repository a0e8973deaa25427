"""A workbook that fails while running: a clear message, exit code 1, no record written."""

import nbformat
import pytest

from heatcalc import notebook
from heatcalc.cli import main


@pytest.fixture(scope="module")
def failed(tmp_path_factory, bar_workbook):
    import contextlib
    import io

    out = tmp_path_factory.mktemp("failed")
    err = io.StringIO()
    # The fixture workbook raises when the target is not above the start temperature: the
    # inputs pass the checks made before running and the workbook itself refuses them.
    with contextlib.redirect_stderr(err), contextlib.redirect_stdout(io.StringIO()):
        code = main(["run", str(bar_workbook), "--out", str(out),
                     "--set", "target_temperature=10 degC"])  # fmt: skip
    return {"code": code, "stderr": err.getvalue(), "out": out}


def test_failure_exit_code_and_message(failed, bar_workbook):
    assert failed["code"] == 1
    err = failed["stderr"]
    assert "heatcalc run: failed: bar_heating.ipynb" in err
    # the cell as the author counts it (papermill's injected cell not counted)
    cells = nbformat.read(bar_workbook, as_version=4).cells
    index = next(i for i, c in enumerate(cells) if "mass_kg = " in c.source)
    assert f"cell {index + 1} " in err
    assert "starting 'd_m = units.to_si(diameter" in err
    assert "raised ValueError: target_temperature='10 degC' must be above" in err


def test_failure_keeps_the_partial_run_and_writes_no_record(failed):
    out = failed["out"]
    assert sorted(p.name for p in out.iterdir()) == ["bar_heating.failed.ipynb"]
    assert str(out / "bar_heating.failed.ipynb") in failed["stderr"]


def test_workbook_error_carries_the_details(tmp_path):
    bad = nbformat.v4.new_notebook()
    bad.cells = [
        nbformat.v4.new_code_cell('x = "1 m"', metadata={"tags": ["parameters"]}),
        nbformat.v4.new_markdown_cell("text"),
        nbformat.v4.new_code_cell("1 / 0"),
    ]
    bad.metadata["kernelspec"] = {"name": "python3", "language": "python", "display_name": "P"}
    path = tmp_path / "bad.ipynb"
    nbformat.write(bad, path)
    with pytest.raises(notebook.WorkbookError, match="cell 3 .* raised ZeroDivisionError") as e:
        notebook.run_workbook(path, tmp_path / "out")
    assert e.value.cell_index == 2 and e.value.ename == "ZeroDivisionError"
    assert e.value.notebook.name == "bad.failed.ipynb"
