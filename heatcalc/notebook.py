"""Workbooks: start a new job from a template, run it with inputs, export the record.

A workbook is a notebook with one cell tagged ``parameters`` holding plain literals (strings
with units such as ``"80 mm"``). Running one executes a parameterised copy with papermill in
the current Python environment and writes, next to each other,

* ``<name>.ipynb``: the executed notebook (code and outputs), and
* ``<name>.html``: the hand-over record, with every code cell's input hidden (the record
  shows its inputs through the workbook's input echo table), images embedded and no script
  loaded from the network; cells tagged ``record-omit`` (interactive sections) are left out,
* ``<name>.pdf`` on request, printed from the HTML by a Chromium-family browser installed on
  the machine (skipped with a message where there is none).
"""

from __future__ import annotations

import ast
import io
import json
import os
import re
import shutil
import subprocess
import sys
import tempfile
import time
import tomllib
from collections.abc import Callable
from dataclasses import dataclass
from pathlib import Path

import jinja2
import nbformat
import pint

from . import _paths
from .units import UnitsError, parse_quantity

__all__ = [
    "WORKBOOKS",
    "HEADER_PARAMETERS",
    "OMIT_TAG",
    "WorkbookError",
    "RunRecord",
    "template_path",
    "new_workbook",
    "workbook_parameters",
    "check_parameters",
    "parse_assignments",
    "load_parameter_file",
    "run_workbook",
    "export_html",
    "find_browser",
    "export_pdf",
    "build_demo",
]

#: Template workbook of each job type, shipped in ``heatcalc._workbooks``.
WORKBOOKS = {
    "melting": "melting_charge.ipynb",
    "through-heat": "billet_through_heat.ipynb",
    "harden": "surface_harden.ipynb",
    "braze": "brazing.ipynb",
}

#: Parameters of the job header, blanked by :func:`new_workbook`.
HEADER_PARAMETERS = (
    "job_reference",
    "customer",
    "part",
    "engineer",
    "checker",
    "job_date",
    "revision",
)

#: Cells with this tag (interactive, UI-only) are left out of the HTML record.
OMIT_TAG = "record-omit"

_KERNEL = "python3"
_NOT_LITERAL = object()


class WorkbookError(RuntimeError):
    """A workbook failed to run: which cell, which exception, where the partial run is."""

    def __init__(self, message, cell_index=None, ename=None, evalue=None, notebook=None):
        super().__init__(message)
        self.cell_index = cell_index  # index in the workbook as written (0-based)
        self.ename, self.evalue = ename, evalue  # exception name and message
        self.notebook = notebook  # the partly run notebook


@dataclass(frozen=True)
class RunRecord:
    """Files written by one run; `pdf` is None when no PDF was made (`note` says why)."""

    notebook: Path
    html: Path
    pdf: Path | None
    seconds: float
    note: str = ""


# -- templates and new jobs ----------------------------------------------------------------
def _templates():
    return _paths.shipped("_workbooks", "workbooks")


def template_path(job_type: str) -> Path:
    """The shipped template workbook of a job type.

    Raises
    ------
    ValueError
        Unknown `job_type` (the message lists the known ones).
    FileNotFoundError
        The template is not shipped with this installation.
    """
    if job_type not in WORKBOOKS:
        raise ValueError(
            f"job_type={job_type!r} is not known; known job types: {', '.join(WORKBOOKS)}"
        )
    path = Path(str(_templates().joinpath(WORKBOOKS[job_type])))
    if not path.is_file():
        raise FileNotFoundError(
            f"the template {WORKBOOKS[job_type]} of job type {job_type!r} "
            f"is not installed (looked in {path.parent})"
        )
    return path


def _parameters_cell(nb, where):
    cells = [c for c in nb.cells if "parameters" in c.get("metadata", {}).get("tags", [])]
    if len(cells) != 1:
        raise ValueError(
            f"{where}: expected exactly one cell tagged 'parameters', found {len(cells)}"
        )
    return cells[0]


def _blank_header(source: str, where) -> str:
    """Replace the values of the header assignments by blanks, keeping comments and layout."""
    tree = ast.parse(source)
    lines = io.StringIO(source, newline="").readlines()  # the line breaks ast counts
    starts = [0]
    for line in lines:
        starts.append(starts[-1] + len(line))

    def offset(lineno, col):  # ast columns count UTF-8 bytes
        return starts[lineno - 1] + len(lines[lineno - 1].encode()[:col].decode())

    edits, found = [], set()
    for node in tree.body:
        if isinstance(node, ast.Assign) and len(node.targets) == 1:
            target = node.targets[0]
        elif isinstance(node, ast.AnnAssign) and node.value is not None:
            target = node.target
        else:
            continue
        if isinstance(target, ast.Name) and target.id in HEADER_PARAMETERS:
            v = node.value
            blank = "[]" if isinstance(v, (ast.List, ast.Tuple)) else '""'
            a, b = offset(v.lineno, v.col_offset), offset(v.end_lineno, v.end_col_offset)
            edits.append((a, b, blank))
            found.add(target.id)
    missing = [n for n in HEADER_PARAMETERS if n not in found]
    if missing:
        raise ValueError(
            f"{where}: the parameters cell does not assign the job header parameters {missing}"
        )
    for a, b, blank in sorted(edits, reverse=True):
        source = source[:a] + blank + source[b:]
    return source


def _clean(nb) -> None:
    """Drop outputs, execution counts, run metadata and any injected parameters."""
    nb.cells = [
        c for c in nb.cells if "injected-parameters" not in c.get("metadata", {}).get("tags", [])
    ]
    for key in ("papermill", "widgets"):
        nb.metadata.pop(key, None)
    for cell in nb.cells:
        for key in ("papermill", "execution"):
            cell.metadata.pop(key, None)
        if cell.cell_type == "code":
            cell.outputs, cell.execution_count = [], None


def new_workbook(job_type: str, path, *, template=None) -> Path:
    """Start a new job: copy the job type's template with a blank header and no outputs.

    Parameters
    ----------
    job_type : str
        A key of :data:`WORKBOOKS`.
    path : str or Path
        The new workbook (``.ipynb``); missing parent folders are created.
    template : str or Path, optional
        Copy this workbook instead of the shipped template.

    Raises
    ------
    FileExistsError
        `path` exists already (it is never overwritten).
    ValueError
        Unknown job type, a path not ending in ``.ipynb``, or a template without a complete
        header in its parameters cell.
    """
    if job_type not in WORKBOOKS:
        template_path(job_type)  # raises the ValueError naming the known job types
    src = Path(template) if template is not None else template_path(job_type)
    dest = Path(path)
    if dest.suffix != ".ipynb":
        raise ValueError(f"path={str(path)!r} must end in .ipynb")
    if dest.exists():
        raise FileExistsError(
            f"{dest} exists already; choose another name (it is never overwritten)"
        )
    nb = nbformat.read(src, as_version=4)
    cell = _parameters_cell(nb, src)
    cell.source = _blank_header(cell.source, src)
    _clean(nb)
    dest.parent.mkdir(parents=True, exist_ok=True)
    with open(dest, "x", encoding="utf-8") as fh:  # "x": fails rather than overwrite
        nbformat.write(nb, fh)
    return dest


# -- parameters ----------------------------------------------------------------------------
def workbook_parameters(path) -> dict[str, dict]:
    """The parameters of a workbook: name -> {default (a Python value), text, type, help}.

    Read by papermill's parameter inspection (that of ``papermill.inspect_notebook``) for the
    kernel and language the workbook is run with, so that a notebook without kernel metadata
    is read as well. A workbook without a ``parameters`` cell has none.
    """
    from papermill.translators import papermill_translators

    if not Path(path).is_file():
        raise FileNotFoundError(f"workbook {str(path)!r} does not exist")
    nb = nbformat.read(path, as_version=4)
    cells = [c for c in nb.cells if "parameters" in c.get("metadata", {}).get("tags", [])]
    if not cells:
        return {}
    cell = _parameters_cell(nb, Path(path).name)  # exactly one
    out = {}
    for p in papermill_translators.find_translator(_KERNEL, "python").inspect(cell):
        try:
            default = ast.literal_eval(p.default)
        except (ValueError, SyntaxError, TypeError):
            default = _NOT_LITERAL
        out[p.name] = {
            "default": default,
            "text": p.default,
            "type": p.inferred_type_name,
            "help": p.help,
        }
    return out


def _quantity_default(default):
    if isinstance(default, str):
        try:
            return parse_quantity(default, "default")
        except UnitsError:
            return None
    return None


def _is_number(value) -> bool:
    if isinstance(value, bool):
        return False
    if isinstance(value, (int, float)):
        return True
    try:
        float(str(value).strip())
        return True
    except ValueError:
        return False


_UNIT_OF = re.compile(r"^\s*[-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?\s*(.*?)\s*$")


def _check_one(name, value, spec):
    default = spec["default"]
    if value is None:
        # an optional input left empty (e.g. cycle_time=None to give supply_power instead);
        # the job itself says which inputs may not be empty
        return None
    if isinstance(value, pint.Quantity):  # papermill needs JSON values: pass it as text
        value = f"{value.magnitude!r} {format(value.units, 'D')}"
    q_default = _quantity_default(default)
    if q_default is not None:
        if _is_number(value):
            raise ValueError(
                f"{name}={value!r} is missing its unit; the workbook's default is "
                f"{default!r}, so write for example {name}='{value} "
                f"{_UNIT_OF.match(default).group(1)}'"
            )
        if not isinstance(value, str):
            raise ValueError(f"{name}={value!r} must be a string with a unit like {default!r}")
        try:
            q = parse_quantity(value, name)
        except UnitsError as exc:
            raise ValueError(str(exc)) from None
        if q.dimensionality != q_default.dimensionality:
            raise ValueError(
                f"{name}={value!r} has dimension {q.dimensionality}; the workbook "
                f"expects {q_default.dimensionality}, like its default "
                f"{default!r}"
            )
        return value
    expected = {str: str, bool: bool, list: (list, tuple), tuple: (list, tuple), dict: dict}
    if isinstance(default, bool) or (isinstance(default, (str, list, tuple, dict))):
        kind = expected[type(default)]
        if not isinstance(value, kind) or (kind is not bool and isinstance(value, bool)):
            raise ValueError(
                f"{name}={value!r} must be of type {type(default).__name__}, "
                f"like the workbook's default {spec['text']}"
            )
    elif isinstance(default, (int, float)) and (not _is_number(value) or isinstance(value, str)):
        raise ValueError(f"{name}={value!r} must be a number, like the default {spec['text']}")
    try:
        json.dumps(value)
    except TypeError:
        raise ValueError(
            f"{name}={value!r} is not a plain value (text, number, list, dict)"
        ) from None
    return list(value) if isinstance(value, tuple) else value


def check_parameters(path, parameters: dict) -> dict:
    """Check parameter names and values against the workbook's parameters cell.

    Returns the values to pass to the run (quantities as strings).

    Raises
    ------
    ValueError
        An unknown name (the message lists the known ones), a number without a unit where the
        default has one, a unit of the wrong dimension, or a value of the wrong type.
    """
    spec = workbook_parameters(path)
    unknown = [n for n in parameters if n not in spec]
    if unknown:
        known = ", ".join(spec) if spec else "(none: the workbook has no parameters cell)"
        raise ValueError(
            f"{Path(path).name} has no parameter named {', '.join(unknown)}; "
            f"known parameters: {known}"
        )
    return {n: _check_one(n, v, spec[n]) for n, v in parameters.items()}


def parse_assignments(pairs, path) -> dict:
    """Turn command-line ``name=value`` texts into parameter values, by the defaults' types.

    Text parameters (including quantities such as ``diameter=80 mm``) stay text; numbers,
    booleans, lists and dicts are read as Python literals. Values are then checked with
    :func:`check_parameters`.
    """
    spec = workbook_parameters(path)
    out = {}
    for pair in pairs:
        name, sep, text = pair.partition("=")
        name, text = name.strip(), text.strip()
        if not sep or not name:
            raise ValueError(f"--set {pair!r}: expected name=value, e.g. diameter='80 mm'")
        default = spec[name]["default"] if name in spec else _NOT_LITERAL
        if len(text) >= 2 and text[0] == text[-1] and text[0] in "'\"":
            text = text[1:-1]  # quotes that survived the shell
        if text == "None":
            out[name] = None
        elif isinstance(default, str):
            out[name] = text
        elif isinstance(default, bool):
            words = {"true": True, "yes": True, "1": True, "false": False, "no": False, "0": False}
            if text.lower() not in words:
                raise ValueError(f"--set {pair!r}: {name} takes true or false")
            out[name] = words[text.lower()]
        else:
            try:
                out[name] = ast.literal_eval(text)
            except (ValueError, SyntaxError):
                out[name] = text
    return check_parameters(path, out)


def load_parameter_file(path) -> dict:
    """Read parameters from a JSON, TOML or YAML file holding one mapping of name to value."""
    p = Path(path)
    if not p.is_file():
        raise FileNotFoundError(f"parameter file {str(path)!r} does not exist")
    text = p.read_text(encoding="utf-8")
    try:
        if p.suffix == ".json":
            data = json.loads(text)
        elif p.suffix == ".toml":
            data = tomllib.loads(text)
        elif p.suffix in (".yaml", ".yml"):
            import yaml

            data = yaml.safe_load(text)
        else:
            raise ValueError(f"parameter file {p.name!r}: expected .json, .toml, .yaml or .yml")
    except (json.JSONDecodeError, tomllib.TOMLDecodeError) as exc:
        raise ValueError(f"parameter file {p.name!r} could not be read: {exc}") from None
    if not isinstance(data, dict):
        raise ValueError(f"parameter file {p.name!r} must hold a mapping of names to values")
    return data


# -- running -------------------------------------------------------------------------------
def _kernel_manager_class(kernel_stderr):
    """A kernel manager whose "python3" kernel is this interpreter (not whatever is on PATH).

    The kernel process's own stderr (start-up chatter, crash reports; not cell output) goes
    to `kernel_stderr`, shown only when the run fails.
    """
    from ipykernel.kernelspec import RESOURCES, get_kernel_dict
    from jupyter_client.kernelspec import KernelSpecManager
    from jupyter_client.manager import AsyncKernelManager
    from traitlets import default

    class CurrentEnvSpecs(KernelSpecManager):
        def get_kernel_spec(self, kernel_name):
            if kernel_name == _KERNEL:
                return self.kernel_spec_class(resource_dir=RESOURCES, **get_kernel_dict())
            return super().get_kernel_spec(kernel_name)

    class CurrentEnvKernelManager(AsyncKernelManager):
        @default("kernel_spec_manager")
        def _current_env_specs(self):
            return CurrentEnvSpecs(data_dir=self.data_dir)

        async def start_kernel(self, **kw):
            kw.setdefault("stderr", kernel_stderr)
            return await super().start_kernel(**kw)

    return CurrentEnvKernelManager


def _first_line(source: str) -> str:
    lines = [ln for ln in source.splitlines() if ln.strip() and not ln.lstrip().startswith("#")]
    return lines[0].strip() if lines else ""


def _tail(fh, lines=5) -> str:
    fh.seek(0)
    text = fh.read().decode("utf-8", "replace").strip().splitlines()
    return " | ".join(text[-lines:])


def _execute(src: Path, dest: Path, parameters, *, kernel_name, cwd, progress, timeout):
    import papermill
    from papermill.exceptions import PapermillExecutionError

    with tempfile.TemporaryFile() as kernel_stderr:
        try:
            papermill.execute_notebook(
                str(src),
                str(dest),
                parameters=parameters,
                kernel_name=kernel_name,
                language="python",
                cwd=str(cwd),
                log_output=False,
                progress_bar=progress,
                execution_timeout=timeout,
                start_timeout=60,
                kernel_manager_class=_kernel_manager_class(kernel_stderr),
            )
        except PapermillExecutionError as exc:
            failed = dest.with_name(dest.name.replace(".running.ipynb", ".failed.ipynb"))
            index = _author_index(src, exc.cell_index, bool(parameters))
            if dest.exists():
                os.replace(dest, failed)
            raise WorkbookError(
                f"{src.name}: cell {index + 1} (execution count "
                f"{exc.exec_count}, starting {_first_line(exc.source)!r}) raised {exc.ename}: "
                f"{exc.evalue}. The partly run notebook is {failed}",
                cell_index=index,
                ename=exc.ename,
                evalue=exc.evalue,
                notebook=failed,
            ) from None
        except Exception as exc:  # kernel died, timed out, could not start
            if dest.exists():
                dest.unlink()
            log = _tail(kernel_stderr)
            raise WorkbookError(
                f"{src.name}: the run failed: {type(exc).__name__}: {exc}"
                + (f" (kernel said: {log})" if log else "")
            ) from exc


def _author_index(src: Path, index: int, injected: bool) -> int:
    """Index in the workbook as written of cell `index` of the run (papermill puts an
    injected-parameters cell after the parameters cell when parameters are given)."""
    if not injected:
        return index
    cells = nbformat.read(src, as_version=4).cells
    tagged = [i for i, c in enumerate(cells) if "parameters" in c.metadata.get("tags", [])]
    return index - 1 if tagged and index > tagged[0] else index


def run_workbook(
    path,
    out_dir,
    parameters=None,
    *,
    overwrite=False,
    pdf=False,
    progress=False,
    kernel_name=_KERNEL,
    cwd=None,
    timeout=600,
    report: Callable[[str], None] | None = None,
) -> RunRecord:
    """Run a workbook with inputs and write the executed notebook and the HTML record.

    Parameters
    ----------
    path : str or Path
        The workbook (a template copy with its inputs edited), never an executed record.
    out_dir : str or Path
        Folder for ``<name>.ipynb``, ``<name>.html`` (and ``<name>.pdf``); created if missing.
    parameters : dict, optional
        Inputs overriding the parameters cell, checked by :func:`check_parameters`.
    overwrite : bool
        Replace existing outputs; without it an existing output stops the run before it starts.
    pdf : bool
        Also print the record to PDF with an installed Chromium-family browser (skipped, with
        a note in the result, where there is none).
    progress : bool
        Show papermill's progress bar (on stderr).
    kernel_name : str
        Kernel to run; the default "python3" is the current interpreter.
    cwd : str or Path, optional
        Working folder of the kernel; default the workbook's folder.
    timeout : float [s]
        Longest time one cell may run.
    report : callable, optional
        Called with a progress line when the run starts (after the checks).

    Raises
    ------
    FileNotFoundError, FileExistsError, ValueError
        Before running: no such workbook, existing outputs, bad parameters.
    WorkbookError
        A cell raised (the message names the cell and the exception) or the kernel failed.
    """
    t0 = time.perf_counter()
    src = Path(path)
    if not src.is_file():
        raise FileNotFoundError(f"workbook {str(path)!r} does not exist")
    if src.suffix != ".ipynb":
        raise ValueError(f"workbook {str(path)!r} must be a .ipynb notebook")
    nb = nbformat.read(src, as_version=4)
    if any("injected-parameters" in c.metadata.get("tags", []) for c in nb.cells):
        raise ValueError(
            f"{src.name} is an executed record (it has injected parameters); run "
            "the workbook you edited, or start one with `heatcalc new`"
        )
    values = check_parameters(src, dict(parameters or {}))
    out = Path(out_dir)
    targets = {ext: out / f"{src.stem}.{ext}" for ext in ("ipynb", "html", "pdf")}
    if targets["ipynb"].resolve() == src.resolve():
        raise ValueError(
            f"the record {targets['ipynb']} would replace the workbook itself; "
            "choose another output folder"
        )
    wanted = [targets["ipynb"], targets["html"]] + ([targets["pdf"]] if pdf else [])
    existing = [str(p) for p in wanted if p.exists()]
    if existing and not overwrite:
        raise FileExistsError(
            f"would overwrite {', '.join(existing)}; use overwrite=True "
            "(--overwrite) or another output folder"
        )
    out.mkdir(parents=True, exist_ok=True)
    if report:
        report(f"running {src} ...")
    running = out / f"{src.stem}.running.ipynb"
    _execute(
        src,
        running,
        values,
        kernel_name=kernel_name,
        cwd=Path(cwd or src.parent),
        progress=progress,
        timeout=timeout,
    )
    os.replace(running, targets["ipynb"])
    export_html(targets["ipynb"], targets["html"])
    pdf_path, note = (None, "")
    if pdf:
        pdf_path, note = export_pdf(targets["html"], targets["pdf"])
    return RunRecord(targets["ipynb"], targets["html"], pdf_path, time.perf_counter() - t0, note)


# -- export --------------------------------------------------------------------------------
_RECORD_TEMPLATE = """{%- extends 'lab/index.html.j2' -%}
{%- block html_head_js -%}{%- endblock html_head_js -%}
{%- block jupyter_widgets -%}{%- endblock jupyter_widgets -%}
{%- block html_head_js_mathjax -%}{%- endblock html_head_js_mathjax -%}
{%- block html_head_js_mermaidjs -%}{%- endblock html_head_js_mermaidjs -%}
{%- block extra_css -%}
<style type="text/css">
@page { size: A4; margin: 15mm; }
@media print {
  table, img { break-inside: avoid; }
  h1, h2, h3, h4 { break-after: avoid; }
}
</style>
{%- endblock extra_css -%}
{%- block data_widget_view -%}
<p><em>Interactive control: open the workbook in JupyterLab to use it.</em></p>
{%- endblock data_widget_view -%}
"""


def export_html(notebook, html_path) -> Path:
    """Write the HTML record of an executed notebook.

    Code cell inputs and prompts are hidden, cells tagged :data:`OMIT_TAG` are dropped, output
    images are embedded, and no script is loaded from the network (no MathJax, no widget
    renderer): results must be carried by text, tables and PNG figures.
    """
    from nbconvert import HTMLExporter
    from traitlets.config import Config

    src = Path(notebook)
    nb = nbformat.read(src, as_version=4)
    nb.metadata.pop("widgets", None)
    c = Config()
    c.TagRemovePreprocessor.enabled = True
    c.TagRemovePreprocessor.remove_cell_tags = {OMIT_TAG}
    exporter = HTMLExporter(
        config=c,
        template_name="lab",
        exclude_input=True,
        exclude_input_prompt=True,
        exclude_output_prompt=True,
        embed_images=True,
        extra_loaders=[jinja2.DictLoader({"heatcalc_record.html.j2": _RECORD_TEMPLATE})],
        template_file="heatcalc_record.html.j2",
    )
    title = src.stem.removesuffix(".running")
    body, _ = exporter.from_notebook_node(
        nb, resources={"metadata": {"name": title, "path": str(src.parent)}}
    )
    dest = Path(html_path)
    dest.write_text(body, encoding="utf-8")
    return dest


_BROWSERS = (
    "/usr/bin/chromium",
    "chromium",
    "chromium-browser",
    "google-chrome",
    "google-chrome-stable",
)
#: Without these, a browser on a machine with a closed network keeps trying to reach its
#: vendor's services.
BROWSER_FLAGS = (
    "--headless",
    "--no-sandbox",
    "--disable-gpu",
    "--disable-quic",
    "--no-first-run",
    "--disable-background-networking",
    "--disable-component-update",
    "--disable-sync",
)


def find_browser() -> str | None:
    """Path of an installed Chromium-family browser, or None."""
    for name in _BROWSERS:
        found = shutil.which(name)
        if found:
            return found
    return None


def export_pdf(html_path, pdf_path, *, browser=None, timeout=120) -> tuple[Path | None, str]:
    """Print the HTML record to PDF with a headless browser already on the machine.

    Returns
    -------
    (Path or None, str)
        The PDF, or None and the reason it was skipped (no browser, browser failed).
    """
    browser = browser or find_browser()
    if browser is None:
        return None, (
            "PDF skipped: no Chromium or Chrome browser is installed (looked for "
            f"{', '.join(_BROWSERS)})"
        )
    html_file, dest = Path(html_path).resolve(), Path(pdf_path).resolve()
    with tempfile.TemporaryDirectory(prefix="heatcalc-pdf-") as profile:
        cmd = [
            browser,
            *BROWSER_FLAGS,
            f"--user-data-dir={profile}",
            "--no-pdf-header-footer",
            f"--print-to-pdf={dest}",
            html_file.as_uri(),
        ]
        try:
            done = subprocess.run(
                cmd, capture_output=True, text=True, timeout=timeout, stdin=subprocess.DEVNULL
            )
        except subprocess.TimeoutExpired:
            return None, f"PDF skipped: {browser} did not finish within {timeout} s"
    if done.returncode != 0 or not dest.is_file():
        tail = (done.stderr or "").strip().splitlines()[-3:]
        return None, f"PDF skipped: {browser} failed ({done.returncode}): {' '.join(tail)}"
    return dest, f"PDF written with {browser}"


def _stderr(message: str) -> None:
    print(message, file=sys.stderr, flush=True)


def build_demo(
    out_dir="heatcalc-records",
    *,
    overwrite=False,
    pdf=False,
    report: Callable[[str], None] | None = _stderr,
) -> dict[str, RunRecord]:
    """Run every shipped workbook with its own demo inputs; write notebooks and HTML records.

    Parameters
    ----------
    out_dir : str or Path
        Folder for the records.
    overwrite, pdf
        As for :func:`run_workbook`.
    report : callable or None
        Called with one progress line per workbook (default: print to stderr).

    Returns
    -------
    dict of job type to RunRecord
    """
    out = Path(out_dir)
    templates = {job: template_path(job) for job in WORKBOOKS}
    if not overwrite:
        exts = ("ipynb", "html", "pdf") if pdf else ("ipynb", "html")
        existing = [
            str(out / f"{t.stem}.{e}")
            for t in templates.values()
            for e in exts
            if (out / f"{t.stem}.{e}").exists()
        ]
        if existing:
            raise FileExistsError(
                f"would overwrite {', '.join(existing)}; use overwrite=True "
                "(--overwrite) or another output folder"
            )
    out.mkdir(parents=True, exist_ok=True)
    records = {}
    for i, (job, template) in enumerate(templates.items(), 1):
        step = f"[{i}/{len(templates)}] {job}: "
        rec = run_workbook(
            template,
            out,
            overwrite=overwrite,
            pdf=pdf,
            cwd=out.resolve(),
            report=(lambda m, step=step: report(step + m)) if report else None,
        )
        records[job] = rec
        if report:
            report(
                f"[{i}/{len(templates)}] {job}: {rec.html.name} in {rec.seconds:.1f} s"
                + (f"; {rec.note}" if rec.note else "")
            )
    return records
