"""The committed job workbooks: shape of the record, and outputs that match the package now.

nbval re-runs the workbooks and compares every output (``pytest workbooks``). These ordinary
tests run no notebook; they read the committed JSON and check that

* each has exactly one ``parameters`` cell holding the seven header parameters and exactly the
  fields of the job's input dataclass, as plain literals, equal to the demo job (the header of
  ``heatcalc.jobs.demo`` and the ``BASE`` inputs of ``tests/jobs/test_job_<job>.py``);
* the committed outputs carry the numbers that the job function gives for those inputs today
  (every row of the results summary, every check with its verdict, the recommendations and
  the input fingerprint), so that the record cannot drift from the package unnoticed;
* cautions (top and bottom), sign-off and stamp are there, code cells ran once each in order
  without errors, figures are PNG, and the HTML record hides the code and the interactive part.

Volatile text is masked on both sides with the patterns nbval uses (``tests/nbval_sanitize.cfg``).
"""

import ast
import dataclasses
import re
import warnings
from pathlib import Path

import nbformat
import pytest

from heatcalc import notebook, record
from heatcalc.jobs import demo
from heatcalc.jobs.brazing import BrazingInputs, run_brazing
from heatcalc.jobs.demo import DEMO_INPUTS
from heatcalc.jobs.melting import MeltingInputs, run_melting
from heatcalc.jobs.surface_harden import HardenInputs, run_surface_harden
from heatcalc.jobs.through_heat import ThroughHeatInputs, run_through_heat

REPO = Path(__file__).resolve().parents[2]
WORKBOOKS = REPO / "workbooks"
JOB_TESTS = REPO / "tests" / "jobs"
SANITIZE = REPO / "tests" / "nbval_sanitize.cfg"

#: job type -> (input dataclass, job function, job test module holding BASE)
JOBS = {
    "melting": (MeltingInputs, run_melting, "test_job_melting.py"),
    "through-heat": (ThroughHeatInputs, run_through_heat, "test_job_through_heat.py"),
    "harden": (HardenInputs, run_surface_harden, "test_job_surface_harden.py"),
    "braze": (BrazingInputs, run_brazing, "test_job_brazing.py"),
}

#: Job types whose result has no recommendations() yet (the workbook has no such section).
NO_RECOMMENDATIONS: set[str] = set()


def _patterns():
    text = SANITIZE.read_text(encoding="utf-8")
    return re.findall(r"^regex: (.*)$\n^replace: (.*)$", text, flags=re.MULTILINE)


def _sanitize(text: str) -> str:
    for pattern, replace in _patterns():
        text = re.sub(pattern, replace, text)
    return text


def _output_text(cell) -> str:
    parts = []
    for out in cell.get("outputs", []):
        if out.get("output_type") == "stream":
            parts.append(out.get("text", ""))
        data = out.get("data", {})
        parts += [data.get("text/plain", ""), data.get("text/html", "")]
    return "\n".join(parts)


class Workbook:
    """A committed workbook read once: cells, parameters, the job inputs and today's result."""

    def __init__(self, job_type):
        self.job_type = job_type
        self.path = WORKBOOKS / notebook.WORKBOOKS[job_type]
        self.nb = nbformat.read(self.path, as_version=4)
        self.inputs_class, self.run, self.test_module = JOBS[job_type]
        tagged = [c for c in self.nb.cells if "parameters" in c.metadata.get("tags", [])]
        self.parameter_cells = tagged
        self.parameters = _literal_assignments(tagged[0].source) if len(tagged) == 1 else {}
        self.code = [c for c in self.nb.cells if c.cell_type == "code"]
        self.text = _sanitize("\n".join(_output_text(c) for c in self.code))
        self._result = None

    @property
    def job_inputs(self) -> dict:
        return {k: v for k, v in self.parameters.items() if k not in notebook.HEADER_PARAMETERS}

    def dataclass_inputs(self):
        kw = {}
        for f in dataclasses.fields(self.inputs_class):
            v = self.parameters[f.name]
            kw[f.name] = tuple(v) if str(f.type).startswith("tuple") else v
        return self.inputs_class(**kw)

    @property
    def result(self):
        if self._result is None:
            with warnings.catch_warnings():
                warnings.simplefilter("ignore")
                self._result = self.run(self.dataclass_inputs())
        return self._result


def _literal_assignments(source: str) -> dict:
    tree = ast.parse(source)
    out = {}
    for node in tree.body:
        assert isinstance(node, ast.Assign) and len(node.targets) == 1, ast.dump(node)[:80]
        target = node.targets[0]
        assert isinstance(target, ast.Name), ast.dump(target)
        out[target.id] = ast.literal_eval(node.value)  # plain literals only (papermill)
    return out


def _load_base(module_file: str):
    """The demo inputs of the job whose tests are in `module_file` (kept in heatcalc.jobs.demo)."""
    key = next(k for k, v in JOBS.items() if v[2] == module_file)
    return DEMO_INPUTS[key]


@pytest.fixture(scope="module", params=list(JOBS))
def wb(request):
    return Workbook(request.param)


def test_one_parameters_cell_with_the_header_and_every_job_input(wb):
    assert len(wb.parameter_cells) == 1
    names = list(wb.parameters)
    assert names[: len(notebook.HEADER_PARAMETERS)] == list(notebook.HEADER_PARAMETERS)
    fields = {f.name for f in dataclasses.fields(wb.inputs_class)}
    assert set(wb.job_inputs) == fields
    assert len(names) == len(set(names)) == len(fields) + len(notebook.HEADER_PARAMETERS)
    # every input line carries a comment (the unit and meaning for the engineer)
    for line in wb.parameter_cells[0].source.splitlines():
        name = line.partition(" = ")[0]
        if name in fields:
            assert "  # " in line, line
    # papermill sees the same parameters
    assert list(notebook.workbook_parameters(wb.path)) == names


def test_demo_header_and_inputs(wb):
    p = wb.parameters
    job = demo.DEMO_JOBS[wb.job_type]
    assert (p["job_reference"], p["part"]) == (job["job_reference"], job["part"])
    assert (p["customer"], p["engineer"], p["checker"]) == (
        demo.CUSTOMER,
        demo.ENGINEER,
        demo.CHECKER,
    )
    assert p["revision"] and p["revision"][0][0] == "A"
    assert wb.dataclass_inputs() == _load_base(wb.test_module)


def test_committed_outputs_carry_todays_numbers(wb):
    result = wb.result
    for quantity, value in result.summary()[["quantity", "value"]].itertuples(index=False):
        assert _sanitize(value) in wb.text, (quantity, value)
    for c in result.checks:  # a row of the committed check table: name, value, limit, verdict
        row = r"\s+".join(re.escape(_sanitize(x)) for x in (c.name, c.value, c.limit, c.result))
        assert re.search(row, wb.text), row
    if wb.job_type in NO_RECOMMENDATIONS:
        assert not hasattr(result, "recommendations"), "add the recommendations to the workbook"
        assert "RECOMMENDATIONS" not in wb.text
    else:
        for line in result.recommendations():
            assert _sanitize(line) in wb.text, line
    for line in result.assumptions:
        assert line in wb.text
    fp = record.fingerprint(wb.job_inputs)
    assert f"Input fingerprint: {fp}" in wb.text
    expected = "WARNINGS\n- (none)" if not result.warnings else result.warnings[0]
    assert expected in wb.text


def test_record_blocks_present_and_cells_run_in_order(wb):
    texts = [_output_text(c) for c in wb.code]
    cautions = record.cautions_block(wb.job_type).text
    at = [i for i, t in enumerate(texts) if cautions in t]
    assert len(at) == 2 and at[0] <= 4 and at[1] >= len(texts) - 4  # near the top and the end
    sign_off = record.sign_off_block(record.JobHeader.from_parameters(**_header(wb))).text
    assert sign_off in texts[-2]
    assert "Calculated with heatcalc" in texts[-1]
    assert wb.code[-1].source.strip() == "record.stamp_block(inputs)"
    # executed top to bottom, once each, without errors or stray warnings
    assert [c.execution_count for c in wb.code] == list(range(1, len(wb.code) + 1))
    for c in wb.code:
        for out in c.outputs:
            assert out.output_type != "error", out
            assert out.get("name") != "stderr", out.get("text", "")[:300]
            assert "image/svg+xml" not in out.get("data", {})
    pngs = sum("image/png" in o.get("data", {}) for c in wb.code for o in c.outputs)
    assert pngs >= 4
    assert "widgets" not in wb.nb.metadata  # no stale widget state in the committed file


def test_interactive_section_is_tagged_and_tested_headless(wb):
    omitted = [c for c in wb.nb.cells if notebook.OMIT_TAG in c.metadata.get("tags", [])]
    sources = "\n".join(c.source for c in omitted)
    assert "ipywidgets" in sources and ".observe(" in sources
    assert "print(" not in sources  # callbacks update widgets, never print
    last = omitted[-1]
    assert ".value =" in last.source  # a cell moves the control from code ...
    assert "<b>" in _output_text(last)  # ... and shows the label it produced
    # no widget is imported or shown outside the interactive section
    kept = [c for c in wb.nb.cells if c not in omitted]
    assert not any("ipywidgets" in c.source for c in kept)


def test_html_record_hides_code_and_interactive_part(wb, tmp_path):
    html = notebook.export_html(wb.path, tmp_path / "record.html").read_text(encoding="utf-8")
    assert "record.input_echo" not in html and "import " not in html
    assert "Interactive" not in html and "ipywidgets" not in html
    assert "<img" in html and "data:image/png;base64" in html
    first = wb.result.summary()["value"].iloc[1]
    assert first in html
    assert "Sign-off" in html and "Input fingerprint" in html


def _header(wb):
    p = wb.parameters
    return {name: p[name] for name in notebook.HEADER_PARAMETERS}
