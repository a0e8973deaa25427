"""The calculation record: header, input echo, fingerprint, version stamp, cautions, blocks."""

import hashlib
import html
import json
import os
import platform
import re
import subprocess
import sys
from pathlib import Path

import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from heatcalc import record
from heatcalc.record import Check, JobHeader, Revision
from heatcalc.units import Q_

SANITIZE = Path(__file__).resolve().parent / "nbval_sanitize.cfg"


# -- job header ----------------------------------------------------------------------------
def _header():
    return JobHeader(
        "NTW-Q-0415",
        "Northfield Thermal Works",
        "Drive pin DP-220",
        "R. Okafor",
        "L. Brandt",
        "2026-03-02",
        [["A", "2026-03-02", "First issue", "RO"], {"rev": "B", "description": "Longer bar"}],
    )


def test_header_fields_table_and_revisions():
    h = _header()
    frame = h.to_frame()
    assert list(frame.index) == [
        "Job reference", "Customer", "Part", "Engineer", "Checker", "Date", "Revision",
    ]  # fmt: skip
    assert frame.loc["Customer", "value"] == "Northfield Thermal Works"
    assert frame.loc["Revision", "value"] == "B"  # the latest revision
    assert h.revisions[1] == Revision("B", "", "Longer bar", "")
    assert list(h.revisions_frame()["Rev"]) == ["A", "B"]
    assert not h.is_empty
    with pytest.raises(AttributeError):  # frozen: a record header is not edited in place
        h.customer = "x"


def test_empty_header_is_blank_everywhere():
    h = JobHeader.empty()
    assert h.is_empty and h.current_revision == ""
    assert set(h.to_frame()["value"]) == {""}
    assert h.revisions_frame().empty
    # blank rows are still drawn so that the printed record can be filled in by hand
    assert h._repr_html_().count("<td") == 7 * 2 + 4


def test_header_from_parameters_matches_constructor():
    h = _header()
    same = JobHeader.from_parameters(
        job_reference=h.reference, customer=h.customer, part=h.part, engineer=h.engineer,
        checker=h.checker, job_date=h.date, revision=h.revisions,
    )  # fmt: skip
    assert same == h


def test_header_html_escapes_user_text():
    h = JobHeader(customer="<b>Smith & Sons</b>")
    assert "&lt;b&gt;Smith &amp; Sons&lt;/b&gt;" in h._repr_html_()
    assert "<b>Smith" not in h._repr_html_()


@pytest.mark.parametrize(
    "kwargs, match",
    [
        ({"customer": 42}, "customer=42"),
        ({"revisions": "A"}, "revisions='A'"),
        ({"revisions": [["A", "2026"]]}, r"revision entry \['A', '2026'\]"),
        ({"revisions": [{"rev": "A", "who": "x"}]}, "unknown keys"),
        ({"revisions": [["A", "2026-01-01", "x", 5]]}, "revision by=5"),
    ],
)
def test_header_bad_input(kwargs, match):
    with pytest.raises(ValueError, match=match):
        JobHeader(**kwargs)


# -- input echo ----------------------------------------------------------------------------
def test_input_echo_values_si_and_descriptions():
    echo = record.input_echo(
        {
            "diameter": "80 mm",
            "target": "1200 degC",
            "spread": "50 delta_degC",
            "frequency": "25 kHz",
            "throughput": "450 kg/h",
            "bar": Q_(3, "in"),
            "material": "aisi-1045",
            "coils": 2,
        },
        {"diameter": "billet diameter", "material": "material key"},
    )
    assert list(echo.columns) == ["value", "SI value", "description"]
    assert list(echo.index)[:2] == ["diameter", "target"]
    # conversions: 1 in = 25.4 mm exactly (NIST SP 811, 2008, appendix B.8); 0 degC = 273.15 K
    expected_si = {
        "diameter": "0.08 m",
        "target": "1473.15 K",
        "spread": "50 K",
        "frequency": "25000 Hz",
        "throughput": "0.125 kg/s",
        "bar": "0.0762 m",
        "material": "",
        "coils": "",
    }
    assert echo["SI value"].to_dict() == expected_si
    assert echo.loc["diameter", "value"] == "80 mm"  # as entered
    assert echo.loc["bar", "value"] == "3 in"
    assert echo.loc["material", "description"] == "material key"
    assert echo.loc["coils", "description"] == ""


def test_input_echo_refuses_description_of_unknown_input():
    with pytest.raises(ValueError, match=r"descriptions name inputs that do not exist: \['diam'\]"):
        record.input_echo({"diameter": "80 mm"}, {"diam": "typo"})


# -- fingerprint ---------------------------------------------------------------------------
def test_fingerprint_is_sha256_of_the_documented_canonical_json():
    # The canonical form written out by hand, as documented in fingerprint's Notes.
    canonical = '{"diameter":{"q":[80.0,[["millimeter",1]]]},"material":"aisi-1045"}'
    expected = hashlib.sha256(canonical.encode("ascii")).hexdigest()[:12]
    assert record.fingerprint({"material": "aisi-1045", "diameter": "80 mm"}) == expected
    rate = '{"m":{"q":[450.0,[["hour",-1],["kilogram",1]]]}}'
    assert (
        record.fingerprint({"m": "450 kg/h"}, length=64)
        == hashlib.sha256(rate.encode("ascii")).hexdigest()
    )


def test_fingerprint_regression_value():
    # Regression value (produced by this code, 2026): pins the canonical form so that records
    # made with one release can be matched with another.
    inputs = {"diameter": "40 mm", "length": "250 mm", "target": "900 degC", "turns": 6}
    assert record.fingerprint(inputs) == "00faaa70c259"


def test_fingerprint_same_in_a_fresh_process_with_another_hash_seed():
    inputs = {"diameter": "40 mm", "customer": "Northfield", "times": ["1 s", "2 s"]}
    code = (
        "from heatcalc.record import fingerprint; "
        f"print(fingerprint({inputs!r}))"
    )  # fmt: skip
    env = {**os.environ, "PYTHONHASHSEED": "12345"}
    out = subprocess.run(
        [sys.executable, "-c", code], capture_output=True, text=True, env=env, check=True
    )
    assert out.stdout.strip() == record.fingerprint(inputs)


def test_fingerprint_ignores_spelling_order_and_spacing_but_not_values():
    a = {"diameter": "80 mm", "material": "aisi-1045", "power": "250 kW"}
    same = [
        {"power": "250 kW", "material": "aisi-1045", "diameter": "80 mm"},  # order
        {"diameter": "80  millimeter", "material": " aisi-1045 ", "power": Q_(250, "kW")},
        {"diameter": "80.0 mm", "material": "aisi-1045", "power": "2.5e2 kW"},
    ]
    for b in same:
        assert record.fingerprint(a) == record.fingerprint(b)
    different = [
        {**a, "diameter": "80.1 mm"},
        {**a, "diameter": "8 cm"},  # the record echoes what was entered
        {**a, "material": "aisi-4140"},
        {**a, "extra": ""},
        {k: v for k, v in a.items() if k != "power"},
    ]
    fps = {record.fingerprint(b) for b in different}
    assert len(fps) == len(different) and record.fingerprint(a) not in fps


@settings(max_examples=60, deadline=None)
@given(
    x=st.floats(min_value=1e-6, max_value=1e6, allow_nan=False),
    y=st.floats(min_value=1e-6, max_value=1e6, allow_nan=False),
)
def test_fingerprint_changes_when_a_value_changes(x, y):
    a = record.fingerprint({"d": f"{x!r} mm", "n": "aisi-1045"})
    b = record.fingerprint({"d": f"{y!r} mm", "n": "aisi-1045"})
    assert (a == b) == (x == y)


@pytest.mark.parametrize(
    "inputs, length, match",
    [
        ({"d": float("nan")}, 12, "d=nan is not finite"),
        ({"d": object()}, 12, "cannot be fingerprinted"),
        ({1: "80 mm"}, 12, "input name 1"),
        ({"d": "80 mm"}, 2, "length=2"),
        (["d"], 12, "must be a dict"),
    ],
)
def test_fingerprint_bad_input(inputs, length, match):
    with pytest.raises(ValueError, match=match):
        record.fingerprint(inputs, length=length)


# -- version stamp and the nbval sanitize file ---------------------------------------------
def _sanitize(text):
    pairs = re.findall(r"^regex: (.*)$\n^replace: (.*)$", SANITIZE.read_text(), re.MULTILINE)
    for regex, replace in pairs:
        text = re.sub(regex, replace, text)
    return text


def test_version_stamp_names_the_versions():
    stamp = record.version_stamp()
    assert stamp.startswith("heatcalc ")
    assert f"Python {platform.python_version()}" in stamp
    assert f"numpy {np.__version__}" in stamp
    assert "scipy " in stamp and "pint " in stamp


def test_version_stamp_is_masked_by_the_sanitize_file():
    # Recorded workbook outputs are compared by nbval after sanitizing: a stamp made with other
    # versions must compare equal once masked.
    here = record.stamp_block({"d": "80 mm"})
    other = (
        "heatcalc 9.8.7rc1, Python 3.13.0, numpy 3.0.0.dev0, scipy 1.99.1, pandas 2.2.3, "
        "pint 0.25.1, matplotlib 3.10.0"
    )
    for text in (here.text, here.html):
        masked = _sanitize(text)
        assert _sanitize(text.replace(record.version_stamp(), other)) == masked
        assert "VERSION" in masked and "numpy VERSION" in masked


# -- cautions ------------------------------------------------------------------------------
COMMON_PHRASES = [
    "high voltage",
    "radio-frequency",
    "capacitor",
    "discharge",
    "verify",
    "pacemaker",
    "ferrous",
    "lockout/tagout",
    "busbars",
    "cooling water",
    "interlock",
    "steam",
]
JOB_PHRASES = {
    "melting": ["molten metal", "moisture", "wet, oily or sealed", "steam explosion",
                "refractory", "ground-leak", "earth-leakage", "face shield", "aluminised"],
    "through-heat": ["hot billets", "burns", "handling", "ejection", "jams"],
    "harden": ["quenchant", "fire", "oil", "burns", "fumes", "quench cracks", "temper promptly"],
    "braze": ["flux", "filler", "cadmium", "cadmium-free", "fluoride", "ventilation",
              "extraction", "burns"],
}  # fmt: skip
CLOSING = ["reviewed by a qualified engineer", "local codes, standards and licensed practice",
           "calculation aid, not a safety assessment"]  # fmt: skip


@pytest.mark.parametrize("job_type", ["melting", "through-heat", "harden", "braze"])
def test_cautions_hold_the_required_items(job_type):
    # Required content: the project's brief for the record (hazards of the trade, common
    # practice, no source).
    items = record.cautions(job_type)
    text = " ".join(items).lower()
    for phrase in COMMON_PHRASES + JOB_PHRASES[job_type]:
        assert phrase in text, f"{job_type}: {phrase!r} missing"
    last = items[-1].lower()
    for phrase in CLOSING:
        assert phrase in last  # every block ends with the review notice
    block = record.cautions_block(job_type)
    assert block.text.endswith(record.REVIEW_NOTICE)
    assert block.markdown.endswith(f"**{record.REVIEW_NOTICE}**")
    assert html.escape(record.REVIEW_NOTICE) in block.html
    assert block.html.count("<li>") == len(items) - 1


def test_cautions_are_specific_to_the_job():
    assert "steam explosion" not in " ".join(record.cautions("braze"))
    assert "cadmium" not in " ".join(record.cautions("melting"))


def test_cautions_unknown_job_type():
    with pytest.raises(ValueError, match=r"job_type='forging' is not known.*'through-heat'"):
        record.cautions("forging")


# -- sign-off, sources, checks -------------------------------------------------------------
def test_sign_off_block_has_blank_cells_to_sign():
    block = record.sign_off_block()
    for role in ("Prepared", "Checked", "Approved"):
        assert role in block.html and role in block.text
    for col in ("Name", "Signature", "Date"):
        assert f">{col}</th>" in block.html
    cells = re.findall(r"<td[^>]*>(.*?)</td>", block.html)
    assert len(cells) == 12 and cells.count("") == 9  # 3 roles x (name, signature, date)
    named = record.sign_off_block(_header())
    cells = re.findall(r"<td[^>]*>(.*?)</td>", named.html)
    assert cells[1] == "R. Okafor" and cells[5] == "L. Brandt" and cells[2] == ""


def test_sources_block_numbers_the_references():
    block = record.sources_block(["Author A, Book, 1999, table 2", "Author B, Paper, 2004"])
    assert block.text.splitlines()[1:] == [
        "[1] Author A, Book, 1999, table 2",
        "[2] Author B, Paper, 2004",
    ]
    assert block.html.count("<li>") == 2
    with pytest.raises(ValueError, match="not a single string"):
        record.sources_block("Author A")
    with pytest.raises(ValueError, match="reference '' must be a non-empty string"):
        record.sources_block(["Author A", ""])


def test_check_table_pass_fail_text_colour_and_summary():
    checks = [
        Check("Coil voltage", "410 V", "<= 500 V", True),
        Check("Supply power", "320 kW", "<= 250 kW", False, "choose a larger supply"),
    ]
    block = record.check_table(checks)
    lines = block.text.splitlines()
    assert lines[0].split() == ["Check", "Value", "Limit", "Result", "Note"]
    assert lines[1].startswith("Coil voltage") and "PASS" in lines[1]
    assert "FAIL" in lines[2] and lines[2].endswith("choose a larger supply")
    assert lines[3] == "1 of 2 FAIL: Supply power."
    # colour as well as text in HTML (colour alone is not enough for a printed record)
    assert re.search(r'<td style="[^"]*#d7f0d7[^"]*">PASS</td>', block.html)
    assert re.search(r'<td style="[^"]*#f8d0d0[^"]*">FAIL</td>', block.html)
    assert "&lt;= 500 V" in block.html
    frame = record.checks_frame(checks)
    assert list(frame["Result"]) == ["PASS", "FAIL"]
    assert record.check_table(checks[:1]).text.endswith("The check passes.")
    assert record.check_table([]).text == "No checks."


@pytest.mark.parametrize(
    "args, match",
    [
        (("V", "1 V", "2 V", 1), "passed=1"),
        (("V", 410.0, "2 V", True), "value=410.0"),
    ],
)
def test_check_bad_input(args, match):
    with pytest.raises(ValueError, match=match):
        Check(*args)


def test_check_table_refuses_other_objects():
    with pytest.raises(ValueError, match="checks must be Check objects"):
        record.check_table([("V", "1 V", "2 V", True)])


def test_blocks_show_as_text_in_a_console():
    from IPython.lib.pretty import pretty

    block = record.check_table([Check("Coil voltage", "410 V", "<= 500 V", True)])
    assert pretty(block) == block.text == str(block)
    assert pretty(_header()) == _header().to_text()
    assert json.dumps(block.markdown)  # plain text, serialisable


def test_list_block_renders_items_and_refuses_bad_input():
    block = record.list_block("Assumptions", ["Long cylinder.", "No <end> effects."])
    assert block.text == "ASSUMPTIONS\n- Long cylinder.\n- No <end> effects."
    assert "&lt;end&gt;" in block.html  # user text is escaped in the HTML
    assert record.list_block("Warnings", []).text.endswith("(none)")
    with pytest.raises(ValueError, match="not a single string"):
        record.list_block("Assumptions", "one string")
    with pytest.raises(ValueError, match="non-empty string"):
        record.list_block("Assumptions", ["ok", ""])
