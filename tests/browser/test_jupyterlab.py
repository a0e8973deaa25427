"""A job workbook in a real JupyterLab, driven in headless Chromium as an engineer would use it.

JupyterLab is started on 127.0.0.1 (free port, token, temporary root folder holding a copy of
:data:`WORKBOOK` with its committed outputs cleared, so that everything seen comes from this
run); the browser opens the workbook, runs all cells from the Run menu, waits for the kernel to
go idle, and checks that the results table, a figure and the interactive section render and
that moving the slider recalculates. The browser is the system's Chromium (no browser is
downloaded), driven by Playwright.
"""

import json
import os
import shutil
import signal
import socket
import subprocess
import sys
import time
import urllib.request
from pathlib import Path

import nbformat
import pytest

pytestmark = pytest.mark.browser

#: The workbook opened in JupyterLab (the quickest job workbook), a text of its results table
#: (RESULT_TEXT) and a text of the HTML label that its interactive section updates from its
#: first slider (WIDGET_TEXT).
WORKBOOK = Path(__file__).resolve().parents[2] / "workbooks" / "melting_charge.ipynb"
RESULT_TEXT = "power from the mains"
WIDGET_TEXT = "Mains power:"

BROWSER_ARGS = [
    "--headless", "--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run",
    "--disable-background-networking", "--disable-component-update", "--disable-sync",
]  # fmt: skip
START_TIMEOUT = 90  # s, server start
RUN_TIMEOUT = 120  # s, running all cells

sync_api = pytest.importorskip(
    "playwright.sync_api", reason="the playwright package is not installed (test extra)"
)


def _browser():
    for name in ("/usr/bin/chromium", "chromium", "chromium-browser", "google-chrome"):
        found = shutil.which(name)
        if found:
            return found
    pytest.skip("no Chromium-family browser installed (Debian package: chromium)")


def _free_port() -> int:
    with socket.socket() as s:
        s.bind(("127.0.0.1", 0))
        return s.getsockname()[1]


def _api(base, token, path, method="GET"):
    req = urllib.request.Request(
        f"{base}{path}", method=method, headers={"Authorization": f"token {token}"}
    )
    with urllib.request.urlopen(req, timeout=5) as resp:
        body = resp.read()
    return json.loads(body) if body else None


def _copy_without_outputs(src: Path, dest: Path) -> None:
    """Copy a workbook with its outputs, execution counts and widget state cleared."""
    nb = nbformat.read(src, as_version=4)
    nb.metadata.pop("widgets", None)
    for cell in nb.cells:
        if cell.cell_type == "code":
            cell.outputs, cell.execution_count = [], None
    nbformat.write(nb, dest)


@pytest.fixture(scope="module")
def lab(tmp_path_factory):
    """A running JupyterLab server; always shut down at the end of the module."""
    root = tmp_path_factory.mktemp("lab-root")
    home = tmp_path_factory.mktemp("lab-home")
    _copy_without_outputs(WORKBOOK, root / WORKBOOK.name)
    # A kernel spec for this interpreter, found first (user data folder), so that the kernel
    # imports the heatcalc under test whatever `python` is on PATH.
    spec = home / "data" / "kernels" / "python3"
    spec.mkdir(parents=True)
    (spec / "kernel.json").write_text(json.dumps({
        "argv": [sys.executable, "-m", "ipykernel_launcher", "-f", "{connection_file}"],
        "display_name": "Python 3 (ipykernel)", "language": "python",
    }))  # fmt: skip
    port, token = _free_port(), "heatcalc-test-" + os.urandom(8).hex()
    env = {
        **os.environ,
        "JUPYTER_DATA_DIR": str(home / "data"),
        "JUPYTER_CONFIG_DIR": str(home / "config"),
        "JUPYTER_RUNTIME_DIR": str(home / "runtime"),
        "JUPYTERLAB_SETTINGS_DIR": str(home / "settings"),
        "JUPYTERLAB_WORKSPACES_DIR": str(home / "workspaces"),
        "JUPYTER_PLATFORM_DIRS": "1",
    }
    cmd = [
        sys.executable, "-m", "jupyterlab", "--no-browser",
        "--ServerApp.ip=127.0.0.1", f"--ServerApp.port={port}", "--ServerApp.port_retries=0",
        f"--IdentityProvider.token={token}", f"--ServerApp.root_dir={root}",
        "--LabApp.check_for_updates_class=jupyterlab.NeverCheckForUpdate",
        "--LabApp.extension_manager=readonly",  # no look-ups of extensions on the network
    ]  # fmt: skip
    if hasattr(os, "geteuid") and os.geteuid() == 0:
        cmd.append("--allow-root")  # CI and these machines run as root
    log = open(home / "server.log", "wb")  # closed in the finaliser
    proc = subprocess.Popen(
        cmd, cwd=root, env=env, stdout=log, stderr=subprocess.STDOUT,
        stdin=subprocess.DEVNULL, start_new_session=True,
    )  # fmt: skip
    base = f"http://127.0.0.1:{port}"
    try:
        deadline = time.monotonic() + START_TIMEOUT
        while True:
            if proc.poll() is not None:
                pytest.fail(f"JupyterLab exited ({proc.returncode}): "
                            f"{(home / 'server.log').read_text()[-2000:]}")  # fmt: skip
            try:
                _api(base, token, "/api/status")
                break
            except OSError:
                if time.monotonic() > deadline:
                    pytest.fail(f"JupyterLab did not start within {START_TIMEOUT} s")
                time.sleep(0.5)
        yield {"base": base, "token": token, "root": root, "home": home}
    finally:
        try:  # orderly shutdown: kernels first, then the server
            _api(base, token, "/api/shutdown", method="POST")
        except OSError:
            pass
        try:
            proc.wait(timeout=20)
        except subprocess.TimeoutExpired:
            os.killpg(proc.pid, signal.SIGTERM)  # the server's own process group
            try:
                proc.wait(timeout=10)
            except subprocess.TimeoutExpired:
                os.killpg(proc.pid, signal.SIGKILL)
                proc.wait(timeout=10)
        log.close()


def _wait(predicate, timeout, what):
    deadline = time.monotonic() + timeout
    while not predicate():
        if time.monotonic() > deadline:
            raise AssertionError(f"timed out after {timeout} s waiting for {what}")
        time.sleep(0.5)


def _kernels_idle(lab):
    kernels = _api(lab["base"], lab["token"], "/api/kernels")
    return bool(kernels) and all(k["execution_state"] == "idle" for k in kernels)


ALL_PROMPTS_NUMBERED = """() => {
  const prompts = [...document.querySelectorAll('.jp-CodeCell .jp-InputPrompt')];
  return prompts.length > 0 && prompts.every(p => /\\[\\d+\\]/.test(p.textContent));
}"""


def test_workbook_runs_and_renders_in_jupyterlab(lab):
    executable = _browser()
    with sync_api.sync_playwright() as pw:
        browser = pw.chromium.launch(
            executable_path=executable, args=BROWSER_ARGS, headless=True, timeout=60_000
        )
        page = browser.new_page(viewport={"width": 1400, "height": 1000})
        page.set_default_timeout(60_000)
        try:
            page.goto(f"{lab['base']}/lab/tree/{WORKBOOK.name}?token={lab['token']}")
            page.locator(".jp-NotebookPanel .jp-Notebook").first.wait_for(state="visible")
            _wait(lambda: _kernels_idle(lab), START_TIMEOUT, "the kernel to start")

            page.get_by_role("menuitem", name="Run", exact=True).click()
            page.get_by_role("menuitem", name="Run All Cells", exact=True).click()
            page.wait_for_function(ALL_PROMPTS_NUMBERED, timeout=RUN_TIMEOUT * 1000)
            _wait(lambda: _kernels_idle(lab), RUN_TIMEOUT, "the kernel to be idle")

            outputs = page.locator(".jp-OutputArea-output")
            # results table (HTML table output holding the known text)
            results = outputs.locator("table", has_text=RESULT_TEXT)
            results.first.wait_for(state="visible")
            # a figure, as an image in an output area
            image = outputs.locator("img")
            image.first.wait_for(state="visible")
            assert image.first.evaluate("img => img.naturalWidth") > 100
            # the interactive section: a rendered ipywidget slider
            slider = outputs.locator(".jupyter-widgets.widget-slider")
            slider.first.wait_for(state="visible")
            label = outputs.locator(".jupyter-widgets.widget-html").first
            before = label.inner_text()
            assert WIDGET_TEXT in before
            # the slider talks to the kernel: moving it to its end changes the label
            handle = slider.first.locator(".noUi-handle").first
            handle.focus()
            handle.press("End")
            page.wait_for_function(
                "([el, text]) => el.innerText !== text",
                arg=[label.element_handle(), before],
                timeout=30_000,
            )
            after = label.inner_text()
            assert WIDGET_TEXT in after, after
            page.screenshot(path=str(lab["home"] / "after-run.png"))  # kept for a look
            # no cell raised
            errors = page.locator('[data-mime-type="application/vnd.jupyter.stderr"]')
            texts = " ".join(errors.all_inner_texts())
            assert "Traceback" not in texts and "Error" not in texts, texts
        except Exception:
            shot = lab["home"] / "failure.png"
            page.screenshot(path=str(shot), full_page=True)
            print(f"screenshot of the failure: {shot}")
            raise
        finally:
            browser.close()
