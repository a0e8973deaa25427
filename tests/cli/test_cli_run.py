"""`heatcalc run`: inputs checked before running, results follow the inputs, HTML record.

Two executions of the fixture workbook serve the whole module (a papermill run costs a few
seconds): the defaults (with --pdf), then changed inputs (--params file and --set) written over
the first run's files with --overwrite.
"""

import math
import re

import nbformat
import pytest

from heatcalc import notebook
from heatcalc.cli import main
from heatcalc.units import format_value


def _expected_power(time_s):
    # Energy balance of the fixture: m c (T1 - T0) / t for a solid bar, computed here by hand
    # from the fixture's inputs (40 mm x 250 mm, 7850 kg/m3, 490 J/(kg K), 20 -> 900 degC).
    mass = 7850 * math.pi / 4 * 0.040**2 * 0.250
    return mass * 490 * (900 - 20) / time_s


@pytest.fixture(scope="module")
def runs(tmp_path_factory, bar_workbook):
    import contextlib
    import io

    out = tmp_path_factory.mktemp("records")
    first = {}
    err = io.StringIO()
    with contextlib.redirect_stderr(err), contextlib.redirect_stdout(io.StringIO()) as so:
        first["code"] = main(["run", str(bar_workbook), "--out", str(out), "--pdf"])
    first["stdout"], first["stderr"] = so.getvalue(), err.getvalue()
    first["html"] = (out / "bar_heating.html").read_text(encoding="utf-8")
    first["nb"] = nbformat.read(out / "bar_heating.ipynb", as_version=4)
    first["pdf"] = out / "bar_heating.pdf"

    params = tmp_path_factory.mktemp("params") / "job.toml"
    params.write_text('supply_power = "60 kW"\n', encoding="utf-8")
    second = {}
    with contextlib.redirect_stderr(io.StringIO()), contextlib.redirect_stdout(io.StringIO()):
        second["code"] = main(
            ["run", str(bar_workbook), "--out", str(out), "--overwrite",
             "--params", str(params), "--set", "heating_time=15 s"]
        )  # fmt: skip
    second["html"] = (out / "bar_heating.html").read_text(encoding="utf-8")
    second["nb"] = nbformat.read(out / "bar_heating.ipynb", as_version=4)
    return {"out": out, "first": first, "second": second}


def test_run_writes_notebook_and_record(runs):
    first = runs["first"]
    assert first["code"] == 0, first["stderr"]
    assert "record:" in first["stdout"] and "bar_heating.html" in first["stdout"]
    assert "running" in first["stderr"] and "done in" in first["stderr"]  # progress
    assert not list(runs["out"].glob("*.running.ipynb"))
    code = [c for c in first["nb"].cells if c.cell_type == "code"]
    assert all(c.execution_count for c in code)  # every cell ran


def test_results_follow_the_inputs(runs):
    p60 = format_value(_expected_power(60), "power")  # '17.7 kW'
    p15 = format_value(_expected_power(15), "power")  # '70.9 kW'
    assert p60 in runs["first"]["html"] and p15 not in runs["first"]["html"]
    assert runs["second"]["code"] == 0
    assert p15 in runs["second"]["html"] and p60 not in runs["second"]["html"]
    # --params gave the supply power: the check compares against it and now fails
    assert "&lt;= 60.0 kW" in runs["second"]["html"]
    assert re.search(r">FAIL</td>", runs["second"]["html"])
    assert re.search(r">PASS</td>", runs["first"]["html"])
    injected = [c for c in runs["second"]["nb"].cells if "injected-parameters" in c.metadata.tags]
    assert "heating_time = " in injected[0].source and "supply_power = " in injected[0].source


def test_record_shows_results_and_inputs_but_no_code(runs):
    page = runs["first"]["html"]
    for text in ("Heat-up energy", "Mean power into the bar", "Northfield Thermal Works",
                 "40 mm", "0.04 m", "Sign-off", "Input fingerprint", "Cautions"):  # fmt: skip
        assert text in page, text
    assert re.search(r'<img[^>]+src="data:image/png;base64,', page)  # figure embedded
    # no code: distinctive lines of the fixture's code cells, no prompts, no input areas
    for code_line in ("mass_kg = rho_si", "record.input_echo(", "plotting.show(fig)"):
        assert code_line not in html_unescape(page)
    code_cells = re.findall(r'<div class="(jp-Cell jp-CodeCell[^"]*)"', page)
    assert code_cells and all("jp-mod-noInput" in c for c in code_cells)
    assert not re.search(r'class="[^"]*(jp-InputPrompt|jp-Editor|highlight)\b', page)
    body = page[page.index("<body") :]
    assert "In&nbsp;[" not in body and "Out[" not in body
    # the interactive section (tagged record-omit) is left out of the record
    assert "Interactive: heating time" not in page and "FloatSlider" not in page
    # self-contained: no script loaded from the network, no MathJax
    assert not re.search(r"<script[^>]+src=", page)
    assert "mathjax" not in page.lower()


def html_unescape(text):
    import html

    return html.unescape(text)


def test_pdf_printed_when_a_browser_is_installed(runs):
    if notebook.find_browser() is None:
        assert "PDF skipped: no Chromium" in runs["first"]["stdout"]
        pytest.skip("no Chromium-family browser on this machine: the PDF is skipped cleanly")
    assert runs["first"]["pdf"].read_bytes()[:5] == b"%PDF-"
    assert "pdf:" in runs["first"]["stdout"]


def test_existing_record_is_not_overwritten(runs, bar_workbook, capsys):
    before = (runs["out"] / "bar_heating.html").read_bytes()
    assert main(["run", str(bar_workbook), "--out", str(runs["out"])]) == 2
    err = capsys.readouterr().err
    assert "would overwrite" in err and "bar_heating.html" in err and "--overwrite" in err
    assert (runs["out"] / "bar_heating.html").read_bytes() == before


def test_an_executed_record_is_not_run_again(runs, tmp_path, capsys):
    record_nb = runs["out"] / "bar_heating.ipynb"
    assert main(["run", str(record_nb), "--out", str(tmp_path)]) == 2
    assert "is an executed record" in capsys.readouterr().err


@pytest.mark.parametrize(
    "assignment, message",
    [
        ("diametr=80 mm", "has no parameter named diametr; known parameters: job_reference"),
        ("diameter=80", "diameter='80' is missing its unit; the workbook's default is '40 mm'"),
        ("start_temperature=20", "write for example start_temperature='20 degC'"),
        ("diameter=80 kg", "diameter='80 kg' has dimension [mass]; the workbook expects"),
        ("diameter=eighty mm", "diameter='eighty mm' could not be read"),
        ("diameter", "expected name=value"),
        ("revision=A", "revision='A' must be of type list"),
    ],
)
def test_bad_inputs_are_refused_before_running(assignment, message, bar_workbook, tmp_path, capsys):
    out = tmp_path / "never"
    code = main(["run", str(bar_workbook), "--out", str(out), "--set", assignment])
    err = capsys.readouterr().err
    assert code == 2
    assert message in err
    assert not out.exists()  # nothing ran, nothing written


def test_parameter_file_values_are_checked(bar_workbook, tmp_path, capsys):
    params = tmp_path / "p.json"
    params.write_text('{"length": 250}', encoding="utf-8")
    assert main(["run", str(bar_workbook), "--params", str(params), "--out", str(tmp_path)]) == 2
    assert "length=250 is missing its unit" in capsys.readouterr().err


def test_parse_assignments_reads_literals_for_non_text_parameters(bar_workbook):
    values = notebook.parse_assignments(
        ['revision=[["B", "2026-04-01", "Longer bar", "RO"]]', "customer='Quoted Ltd'"],
        bar_workbook,
    )
    assert values == {"revision": [["B", "2026-04-01", "Longer bar", "RO"]],
                      "customer": "Quoted Ltd"}  # fmt: skip


def test_an_optional_input_can_be_emptied_with_none(bar_workbook):
    # switching between two alternative inputs (e.g. cycle time or supply power) needs the
    # first one emptied from the command line
    values = notebook.parse_assignments(["heating_time=None", "supply_power='60 kW'"], bar_workbook)
    assert values == {"heating_time": None, "supply_power": "60 kW"}


@pytest.mark.parametrize(
    "name, text, data",
    [
        ("p.json", '{"diameter": "80 mm", "n": 3}', {"diameter": "80 mm", "n": 3}),
        ("p.toml", 'diameter = "80 mm"\nn = 3\n', {"diameter": "80 mm", "n": 3}),
        ("p.yaml", "diameter: 80 mm\nn: 3\n", {"diameter": "80 mm", "n": 3}),
    ],
)
def test_load_parameter_file(tmp_path, name, text, data):
    path = tmp_path / name
    path.write_text(text, encoding="utf-8")
    assert notebook.load_parameter_file(path) == data


def test_load_parameter_file_refuses_bad_files(tmp_path):
    (tmp_path / "p.txt").write_text("a=1", encoding="utf-8")
    with pytest.raises(ValueError, match="expected .json, .toml, .yaml"):
        notebook.load_parameter_file(tmp_path / "p.txt")
    (tmp_path / "l.json").write_text("[1, 2]", encoding="utf-8")
    with pytest.raises(ValueError, match="must hold a mapping"):
        notebook.load_parameter_file(tmp_path / "l.json")
    with pytest.raises(FileNotFoundError, match="does not exist"):
        notebook.load_parameter_file(tmp_path / "none.json")


@pytest.fixture(scope="module")
def typed_workbook(tmp_path_factory):
    nb = nbformat.v4.new_notebook()
    nb.cells = [
        nbformat.v4.new_code_cell(
            'count = 3\nratio = 0.5\nflag = True\nnote = None\nstart = "20 degC"\n'
            'grade = "aisi-1045"\nlevels = [1, 2]\n',
            metadata={"tags": ["parameters"]},
        )
    ]
    path = tmp_path_factory.mktemp("typed") / "typed.ipynb"
    nbformat.write(nb, path)
    return path


def test_check_parameters_by_the_defaults_types(typed_workbook):
    from heatcalc.units import Q_

    ok = notebook.check_parameters(
        typed_workbook,
        {"count": 4, "ratio": 1, "flag": False, "note": {"any": "thing"}, "grade": "cu-etp",
         "levels": (3, 4), "start": Q_(25, "degC")},
    )  # fmt: skip
    assert ok["levels"] == [3, 4]  # tuples go in as lists (JSON)
    assert ok["start"] == "25 degree_Celsius"  # quantities go in as text with their unit
    cli = notebook.parse_assignments(
        ["count=5", "flag=no", "levels=[7]", "grade=cu-etp", "start=30 degC"], typed_workbook
    )
    assert cli == {"count": 5, "flag": False, "levels": [7], "grade": "cu-etp", "start": "30 degC"}


@pytest.mark.parametrize(
    "values, match",
    [
        ({"count": "4"}, "count='4' must be a number"),
        ({"count": True}, "count=True must be a number"),
        ({"flag": 1}, "flag=1 must be of type bool"),
        ({"grade": 1045}, "grade=1045 must be of type str"),
        ({"start": 20}, "start=20 is missing its unit"),
        ({"start": "20 m"}, "has dimension [length]"),
        ({"note": object()}, "is not a plain value"),
    ],
)
def test_check_parameters_refuses_wrong_types(typed_workbook, values, match):
    with pytest.raises(ValueError, match=re.escape(match)):
        notebook.check_parameters(typed_workbook, values)


def test_parse_assignments_refuses_a_bad_boolean(typed_workbook):
    with pytest.raises(ValueError, match="flag takes true or false"):
        notebook.parse_assignments(["flag=maybe"], typed_workbook)


def test_parameters_cell_must_be_single_and_present(tmp_path):
    nb = nbformat.v4.new_notebook()
    tagged = {"tags": ["parameters"]}
    nb.cells = [nbformat.v4.new_code_cell("a = 1", metadata=tagged),
                nbformat.v4.new_code_cell("b = 2", metadata=tagged)]  # fmt: skip
    two = tmp_path / "two.ipynb"
    nbformat.write(nb, two)
    with pytest.raises(ValueError, match="exactly one cell tagged 'parameters', found 2"):
        notebook.check_parameters(two, {"a": 2})
    nb.cells = [nbformat.v4.new_code_cell("a = 1")]
    none = tmp_path / "none.ipynb"
    nbformat.write(nb, none)
    assert notebook.workbook_parameters(none) == {}
    with pytest.raises(ValueError, match=r"no parameter named a; known parameters: \(none"):
        notebook.check_parameters(none, {"a": 2})


def test_the_record_never_replaces_the_workbook(bar_workbook, tmp_path, capsys):
    copy = tmp_path / bar_workbook.name
    copy.write_bytes(bar_workbook.read_bytes())
    assert main(["run", str(copy), "--out", str(tmp_path), "--overwrite"]) == 2
    assert "would replace the workbook itself" in capsys.readouterr().err
    assert copy.read_bytes() == bar_workbook.read_bytes()
