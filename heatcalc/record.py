"""The calculation record: job header, input echo, checks, cautions, sign-off and stamps.

A finished workbook is a document an engineer signs. This module builds its parts; each part
is plain data (a :class:`pandas.DataFrame` or a :class:`RecordBlock` holding HTML and plain
text), so that it shows the same in JupyterLab, in the HTML export and in a text console.
Everything shown is deterministic: the same inputs give the same record, byte for byte, apart
from the version line of :func:`version_stamp`.

Examples
--------
>>> fp = fingerprint({"diameter": "80 mm", "material": "aisi-1045"})
>>> len(fp), fp == fingerprint({"diameter": "80 millimeter", "material": "aisi-1045"})
(12, True)
>>> fp == fingerprint({"diameter": "8 cm", "material": "aisi-1045"})
False
>>> print(check_table([Check("Coil voltage", "410 V", "<= 500 V", True)]).text)
Check         Value  Limit     Result  Note
Coil voltage  410 V  <= 500 V  PASS
The check passes.
"""

from __future__ import annotations

import hashlib
import html
import json
import math
import platform
from dataclasses import dataclass, field
from importlib.metadata import PackageNotFoundError, version

import numpy as np
import pandas as pd
import pint

from .units import UnitsError, parse_quantity, ureg

__all__ = [
    "Revision",
    "JobHeader",
    "RecordBlock",
    "Check",
    "JOB_TYPES",
    "REVIEW_NOTICE",
    "input_echo",
    "fingerprint",
    "versions",
    "version_stamp",
    "stamp_block",
    "cautions",
    "cautions_block",
    "sign_off_block",
    "sources_block",
    "list_block",
    "check_table",
    "checks_frame",
]

#: Job types known to the record and the command line.
JOB_TYPES = ("melting", "through-heat", "harden", "braze")

_CELL = "border:1px solid #999;padding:3px 8px;text-align:left;vertical-align:top"
_HEAD = _CELL + ";background:#eee"
_TABLE = "border-collapse:collapse;margin:4px 0 10px 0"


def _e(text) -> str:
    return html.escape(str(text), quote=True)


def _html_table(columns, rows, caption: str | None = None, row_styles=None) -> str:
    """A small bordered HTML table; all text escaped, optional per-cell styles."""
    out = [f'<table style="{_TABLE}">']
    if caption:
        out.append(f'<caption style="text-align:left;font-weight:bold">{_e(caption)}</caption>')
    out.append("<tr>" + "".join(f'<th style="{_HEAD}">{_e(c)}</th>' for c in columns) + "</tr>")
    for i, row in enumerate(rows):
        styles = row_styles[i] if row_styles else [""] * len(row)
        cells = "".join(
            f'<td style="{_CELL}{";" + s if s else ""}">{_e(v)}</td>'
            for v, s in zip(row, styles, strict=True)
        )
        out.append(f"<tr>{cells}</tr>")
    out.append("</table>")
    return "".join(out)


def _text_table(columns, rows) -> str:
    """Columns padded to their widest entry, two spaces apart, trailing blanks stripped."""
    rows = [[str(v) for v in r] for r in rows]
    widths = [max(len(str(c)), *(len(r[i]) for r in rows)) for i, c in enumerate(columns)]
    lines = [[str(c) for c in columns], *rows]
    return "\n".join(
        "  ".join(v.ljust(w) for v, w in zip(line, widths, strict=True)).rstrip() for line in lines
    )


@dataclass(frozen=True)
class RecordBlock:
    """A displayable part of the record: HTML for notebooks and exports, text for consoles.

    Attributes
    ----------
    kind : str
        What the block is ("cautions", "sign-off", "sources", "checks", "stamp").
    html : str
        HTML fragment (inline styles only, so it survives export).
    text : str
        The same content as plain text.
    markdown : str
        The same content as Markdown (for pasting into a markdown cell or a report).
    """

    kind: str
    html: str
    text: str
    markdown: str

    def _repr_html_(self) -> str:
        return self.html

    def _repr_pretty_(self, p, cycle) -> None:  # IPython's text/plain representation
        p.text(self.text)

    def __str__(self) -> str:
        return self.text


# -- job header ----------------------------------------------------------------------------
@dataclass(frozen=True)
class Revision:
    """One line of the revision history: revision mark, date, what changed, and by whom."""

    rev: str
    date: str
    description: str
    by: str

    def __post_init__(self):
        for name in ("rev", "date", "description", "by"):
            value = getattr(self, name)
            if not isinstance(value, str):
                raise ValueError(f"revision {name}={value!r} must be a string")


def _as_revision(item) -> Revision:
    if isinstance(item, Revision):
        return item
    if isinstance(item, dict):
        unknown = set(item) - {"rev", "date", "description", "by"}
        if unknown:
            raise ValueError(
                f"revision entry {item!r} has unknown keys {sorted(unknown)}; "
                "expected rev, date, description, by"
            )
        return Revision(**{k: item.get(k, "") for k in ("rev", "date", "description", "by")})
    if isinstance(item, (list, tuple)) and len(item) == 4:
        return Revision(*item)
    raise ValueError(
        f"revision entry {item!r} is not understood; expected [rev, date, description, by] "
        "or a dict with those keys"
    )


_HEADER_FIELDS = (
    ("reference", "Job reference"),
    ("customer", "Customer"),
    ("part", "Part"),
    ("engineer", "Engineer"),
    ("checker", "Checker"),
    ("date", "Date"),
)


@dataclass(frozen=True)
class JobHeader:
    """Who the calculation is for and who made it; the top of every record.

    Parameters
    ----------
    reference, customer, part, engineer, checker, date : str
        Free text; blank for a new job (see :meth:`empty`).
    revisions : sequence of Revision, [rev, date, description, by] lists or dicts
        Revision history, oldest first.

    Examples
    --------
    >>> h = JobHeader("Q-1001", "Example Forge Ltd", "Axle blank", "A. Engineer", "",
    ...               "2026-01-15", [["A", "2026-01-15", "First issue", "AE"]])
    >>> h.current_revision
    'A'
    >>> JobHeader.empty().is_empty
    True
    """

    reference: str = ""
    customer: str = ""
    part: str = ""
    engineer: str = ""
    checker: str = ""
    date: str = ""
    revisions: tuple[Revision, ...] = field(default_factory=tuple)

    def __post_init__(self):
        for name, _ in _HEADER_FIELDS:
            value = getattr(self, name)
            if not isinstance(value, str):
                raise ValueError(f"{name}={value!r} must be a string (blank if not known yet)")
        revs = self.revisions
        if revs is None:
            revs = ()
        if isinstance(revs, (str, dict, Revision)):
            raise ValueError(
                f"revisions={revs!r} must be a list of [rev, date, description, by] entries"
            )
        object.__setattr__(self, "revisions", tuple(_as_revision(r) for r in revs))

    @classmethod
    def empty(cls) -> JobHeader:
        """A blank header for a new job."""
        return cls()

    @classmethod
    def from_parameters(
        cls,
        job_reference="",
        customer="",
        part="",
        engineer="",
        checker="",
        job_date="",
        revision=(),
    ) -> JobHeader:
        """Build from the header parameters of a workbook's parameters cell."""
        return cls(job_reference, customer, part, engineer, checker, job_date, revision)

    @property
    def is_empty(self) -> bool:
        return not any(getattr(self, n) for n, _ in _HEADER_FIELDS) and not self.revisions

    @property
    def current_revision(self) -> str:
        """The latest revision mark, or '' when there is no revision yet."""
        return self.revisions[-1].rev if self.revisions else ""

    def to_frame(self) -> pd.DataFrame:
        """The header fields (with the current revision) as a one-column table."""
        rows = [(label, getattr(self, name)) for name, label in _HEADER_FIELDS]
        rows.append(("Revision", self.current_revision))
        return pd.DataFrame({"value": [v for _, v in rows]}, index=[k for k, _ in rows])

    def revisions_frame(self) -> pd.DataFrame:
        """The revision history as a table (empty table when there is none)."""
        return pd.DataFrame(
            [(r.rev, r.date, r.description, r.by) for r in self.revisions],
            columns=["Rev", "Date", "Description", "By"],
        )

    def _repr_html_(self) -> str:
        fields = _html_table(["Field", "Entry"], self.to_frame()["value"].items(), "Job")
        revs = [(r.rev, r.date, r.description, r.by) for r in self.revisions] or [("",) * 4]
        history = _html_table(["Rev", "Date", "Description", "By"], revs, "Revision history")
        return fields + history

    def _repr_pretty_(self, p, cycle) -> None:
        p.text(self.to_text())

    def to_text(self) -> str:
        lines = [f"{label}: {value}".rstrip() for label, value in self.to_frame()["value"].items()]
        for r in self.revisions:
            lines.append(f"  rev {r.rev}  {r.date}  {r.description}  ({r.by})")
        return "\n".join(lines)


# -- inputs --------------------------------------------------------------------------------
def _try_quantity(value, name):
    """A pint quantity if `value` is one or a string with a unit, else None."""
    if isinstance(value, pint.Quantity):
        return value
    if isinstance(value, str):
        try:
            return parse_quantity(value, name)
        except UnitsError:
            return None
    return None


#: SI unit shown in the echo for each dimensionality (unit: how it is printed); others fall
#: back to pint's base units.
_SI_UNITS = {
    "m": "m", "m**2": "m²", "m**3": "m³", "kg": "kg", "kg/s": "kg/s", "s": "s", "W": "W",
    "W/m**3": "W/m³", "W/m**2": "W/m²", "J": "J", "J/kg": "J/kg", "Hz": "Hz", "V": "V",
    "A": "A", "A/m": "A/m", "ohm": "Ω", "H": "H", "F": "F", "m/s": "m/s", "m**3/s": "m³/s",
    "Pa": "Pa", "ohm*m": "Ω·m", "kg/m**3": "kg/m³", "J/(kg*K)": "J/(kg·K)",
    "W/(m*K)": "W/(m·K)", "W/(m**2*K)": "W/(m²·K)",
}  # fmt: skip
_SI_BY_DIMENSION = {ureg.Unit(u).dimensionality: u for u in reversed(_SI_UNITS)}


def _si_text(q: pint.Quantity) -> str:
    if q.dimensionality == ureg.kelvin.dimensionality:
        return f"{q.to(ureg.kelvin).magnitude:.6g} K"
    if q.dimensionless:
        return f"{q.to('').magnitude:.6g}"
    target = _SI_BY_DIMENSION.get(q.dimensionality)
    if target is None:
        q_si = q.to_base_units()
        return f"{q_si.magnitude:.6g} {format(q_si.units, '~P')}"
    return f"{q.to(target).magnitude:.6g} {_SI_UNITS[target]}"


def input_echo(inputs: dict, descriptions: dict | None = None) -> pd.DataFrame:
    """Echo the inputs of a calculation: as entered, in SI, and what each one means.

    Parameters
    ----------
    inputs : dict of str to (str or pint.Quantity or other)
        The inputs as the engineer entered them (``{"diameter": "80 mm", ...}``). Values that
        are not quantities (material keys, counts) are echoed as they are.
    descriptions : dict of str to str, optional
        A short description per input name.

    Returns
    -------
    pandas.DataFrame
        Index ``input`` (the names, in the given order); columns ``value`` (as entered),
        ``SI value`` (blank for non-quantities; temperatures in K) and ``description``.

    Raises
    ------
    ValueError
        If a description names an input that is not in `inputs` (a misspelt name), or an
        input name is not a string.

    Examples
    --------
    >>> input_echo({"diameter": "80 mm"}, {"diameter": "billet diameter"})["SI value"].iloc[0]
    '0.08 m'
    """
    descriptions = dict(descriptions or {})
    extra = [k for k in descriptions if k not in inputs]
    if extra:
        raise ValueError(
            f"descriptions name inputs that do not exist: {extra}; inputs are {list(inputs)}"
        )
    rows = []
    for name, value in inputs.items():
        if not isinstance(name, str):
            raise ValueError(f"input name {name!r} must be a string")
        q = _try_quantity(value, name)
        shown = (
            value.strip()
            if isinstance(value, str)
            else (format(q, "~P") if q is not None else repr(value))
        )
        rows.append((name, shown, _si_text(q) if q is not None else "", descriptions.get(name, "")))
    frame = pd.DataFrame(rows, columns=["input", "value", "SI value", "description"])
    return frame.set_index("input")


def _canonical(value, name):
    q = _try_quantity(value, name)
    if q is not None:
        mag = q.magnitude
        if not isinstance(mag, (int, float)):
            mag = [float(m) for m in mag.ravel()]  # arrays: flattened, as floats
        else:
            mag = float(mag)
            if not math.isfinite(mag):
                raise ValueError(f"{name}={value!r} is not finite")
        # Units as sorted (pint unit name, exponent) pairs: independent of pint's formatters.
        units = [[u, int(e) if float(e).is_integer() else float(e)] for u, e in q.unit_items()]
        return {"q": [mag, sorted(units)]}
    if value is None or isinstance(value, (bool, int, str)):
        return value.strip() if isinstance(value, str) else value
    if isinstance(value, float):
        if not math.isfinite(value):
            raise ValueError(f"{name}={value!r} is not finite")
        return value
    if isinstance(value, (list, tuple)):
        return [_canonical(v, name) for v in value]
    if isinstance(value, dict):
        return {str(k): _canonical(v, name) for k, v in value.items()}
    raise ValueError(
        f"{name}={value!r} of type {type(value).__name__} cannot be fingerprinted; "
        "use strings, numbers, quantities, lists or dicts"
    )


def fingerprint(inputs: dict, length: int = 12) -> str:
    """A short, stable hash of a set of inputs, printed on the record.

    Two records with the same fingerprint were calculated from the same inputs.

    Parameters
    ----------
    inputs : dict of str to value
        Names and values (strings with units, quantities, plain strings, numbers, lists).
    length : int
        Number of hexadecimal characters kept (4 to 64).

    Returns
    -------
    str
        The first `length` hex digits of the SHA-256 of the canonical JSON of the inputs.

    Notes
    -----
    Canonical form: quantities (``"80 mm"`` or ``Q_(80, "mm")``) become
    ``{"q": [magnitude as float, [[unit name, exponent], ...]]}`` with pint's unit names
    ("millimeter", "degree_Celsius") sorted, so spelling of the unit and
    spacing do not matter ("80 mm" = "80 millimeter") but the unit chosen does ("80 mm" and
    "8 cm" differ: the record echoes what was entered). Other strings are stripped. The JSON is
    written with sorted keys, no spaces and ASCII escapes, so it is the same on every platform;
    floats use Python's shortest round-trip repr.
    """
    if not isinstance(length, int) or not 4 <= length <= 64:
        raise ValueError(f"length={length!r} must be an integer from 4 to 64")
    if not isinstance(inputs, dict):
        raise ValueError(f"inputs={inputs!r} must be a dict of names to values")
    canon = {}
    for name, value in inputs.items():
        if not isinstance(name, str):
            raise ValueError(f"input name {name!r} must be a string")
        canon[name] = _canonical(value, name)
    text = json.dumps(canon, sort_keys=True, separators=(",", ":"), ensure_ascii=True)
    return hashlib.sha256(text.encode("ascii")).hexdigest()[:length]


# -- version stamp -------------------------------------------------------------------------
_STAMPED = ("numpy", "scipy", "pandas", "pint", "matplotlib")


def versions() -> dict[str, str]:
    """Versions of heatcalc, Python and the numerical libraries, by name."""
    from . import __version__

    out = {"heatcalc": __version__, "Python": platform.python_version()}
    for pkg in _STAMPED:
        try:
            out[pkg] = version(pkg)
        except PackageNotFoundError:
            out[pkg] = "not-installed"
    return out


def version_stamp() -> str:
    """One line naming the software versions the record was calculated with.

    Each entry is ``<name> <version>`` so that a test comparing recorded outputs can mask the
    versions with one pattern per name (see ``tests/nbval_sanitize.cfg``).
    """
    return ", ".join(f"{k} {v}" for k, v in versions().items())


def stamp_block(inputs: dict) -> RecordBlock:
    """The record's footer line: software versions and the fingerprint of the inputs."""
    fp = fingerprint(inputs)
    stamp = version_stamp()
    text = f"Calculated with {stamp}.\nInput fingerprint: {fp}"
    body = f"<p>Calculated with {_e(stamp)}.<br>Input fingerprint: <code>{_e(fp)}</code></p>"
    md = f"Calculated with {stamp}.  \nInput fingerprint: `{fp}`"
    return RecordBlock("stamp", body, text, md)


# -- cautions ------------------------------------------------------------------------------
_COMMON = (
    "High voltage and radio-frequency power: the supply, busbars, capacitors and coil carry "
    "dangerous voltages at medium or high frequency; only trained, authorised people open "
    "enclosures or work near live parts.",
    "Stored energy in capacitor banks: capacitors can stay charged after the supply is off; "
    "discharge them and verify they are discharged with a suitable instrument before touching.",
    "Strong magnetic fields near the coil and busbars: people with implanted medical devices "
    "such as pacemakers must keep away; no loose ferrous objects (tools, jewellery) near the "
    "coil.",
    "Lockout/tagout before any work on the coil, busbars or capacitors: isolate, lock and tag "
    "the supply and prove it dead.",
    "Loss of cooling water: flow, pressure and temperature interlocks must remove power when "
    "cooling fails; without water the coil and supply are damaged and trapped water can flash "
    "to steam.",
)
_BY_JOB = {
    "melting": (
        "Molten metal and moisture: wet, oily or sealed charge material (closed tubes, cans, "
        "hollow parts) can cause a steam explosion; charge only dry, clean, open material.",
        "Refractory wear: inspect the crucible lining as it thins, and keep the ground-leak "
        "(earth-leakage) detection working so that metal reaching toward the coil trips the "
        "supply.",
        "Protective equipment at the furnace: face shield, aluminised clothing, heat-resistant "
        "gloves and safety footwear when charging, sampling, deslagging and pouring.",
    ),
    "through-heat": (
        "Hot billets cause severe burns; hot steel may not glow visibly, so treat every billet "
        "leaving the line as hot.",
        "Handling: use tongs and guarded conveyors, mark hot zones, keep clear of pushers and "
        "pinch points.",
        "Ejection and jams: pushers and ejectors move suddenly; a jammed billet left under power "
        "overheats; clear jams only with the power off and locked out.",
    ),
    "harden": (
        "Quenchant: oil quenchants can catch fire; hot parts and quenchant cause burns; quench "
        "fumes and vapour need extraction.",
        "Part cracking: a severe quench can cause quench cracks; temper promptly after "
        "hardening as the process specification requires, and inspect parts for cracks.",
    ),
    "braze": (
        "Flux and filler fumes: cadmium-bearing fillers give toxic fumes, prefer cadmium-free "
        "fillers; fluoride fluxes give harmful fumes.",
        "Ventilation and extraction at the joint are required while brazing.",
        "Burns: joint and parts stay hot after heating; flux and filler can spatter.",
    ),
}

#: The closing statement of every cautions block.
REVIEW_NOTICE = (
    "These results must be reviewed by a qualified engineer before use. Local codes, standards "
    "and licensed practice govern the equipment and its use. heatcalc is a calculation aid, "
    "not a safety assessment."
)


def _check_job_type(job_type) -> str:
    if job_type not in _BY_JOB:
        raise ValueError(f"job_type={job_type!r} is not known; expected one of {list(JOB_TYPES)}")
    return job_type


def cautions(job_type: str) -> list[str]:
    """The safety cautions printed on the record of a job type, ending with the review notice.

    Parameters
    ----------
    job_type : str
        One of :data:`JOB_TYPES`: "melting", "through-heat", "harden", "braze".

    Returns
    -------
    list of str
        Cautions common to induction equipment, then those of the job type, then
        :data:`REVIEW_NOTICE` as the last entry.

    Notes
    -----
    These are reminders of well-known hazards of the trade (common practice, no source), not a
    risk assessment of any installation.
    """
    return [*_COMMON, *_BY_JOB[_check_job_type(job_type)], REVIEW_NOTICE]


def cautions_block(job_type: str) -> RecordBlock:
    """The cautions of :func:`cautions` as a displayable block (HTML list, text, Markdown)."""
    items = cautions(job_type)
    hazards, notice = items[:-1], items[-1]
    body = (
        '<div style="border:2px solid #b00;padding:4px 10px;margin:6px 0">'
        '<p style="font-weight:bold;margin:4px 0">Cautions</p><ul>'
        + "".join(f"<li>{_e(c)}</li>" for c in hazards)
        + f'</ul><p style="font-weight:bold">{_e(notice)}</p></div>'
    )
    text = "CAUTIONS\n" + "\n".join(f"- {c}" for c in hazards) + f"\n{notice}"
    md = "**Cautions**\n\n" + "\n".join(f"- {c}" for c in hazards) + f"\n\n**{notice}**"
    return RecordBlock("cautions", body, text, md)


# -- sign-off and sources ------------------------------------------------------------------
def sign_off_block(header: JobHeader | None = None) -> RecordBlock:
    """Prepared / checked / approved table with blank name, signature and date cells.

    If a `header` is given, the names of its engineer (prepared) and checker (checked) are
    filled in; signatures and dates are always left blank for signing by hand.
    """
    names = {"Prepared": "", "Checked": "", "Approved": ""}
    if header is not None:
        names["Prepared"], names["Checked"] = header.engineer, header.checker
    rows = [(role, name, "", "") for role, name in names.items()]
    tall = ["", "", "height:2.2em;min-width:12em", "min-width:7em"]
    body = _html_table(["", "Name", "Signature", "Date"], rows, "Sign-off", [tall] * 3)
    blanks = [(role, name or "_" * 16, "_" * 16, "_" * 10) for role, name, *_ in rows]
    text = "SIGN-OFF\n" + _text_table(["", "Name", "Signature", "Date"], blanks)
    md = "| | Name | Signature | Date |\n|---|---|---|---|\n" + "\n".join(
        f"| {r} | {n} | | |" for r, n, *_ in rows
    )
    return RecordBlock("sign-off", body, text, md)


def sources_block(references) -> RecordBlock:
    """Numbered list of the sources of the formulas and data used in the record.

    Raises
    ------
    ValueError
        If `references` is a bare string or contains an empty or non-string entry.
    """
    if isinstance(references, str):
        raise ValueError("references must be a list of strings, not a single string")
    refs = list(references)
    for r in refs:
        if not isinstance(r, str) or not r.strip():
            raise ValueError(f"reference {r!r} must be a non-empty string")
    body = (
        '<p style="font-weight:bold">Sources</p><ol>'
        + "".join(f"<li>{_e(r)}</li>" for r in refs)
        + "</ol>"
    )
    text = "SOURCES\n" + "\n".join(f"[{i}] {r}" for i, r in enumerate(refs, 1))
    md = "**Sources**\n\n" + "\n".join(f"{i}. {r}" for i, r in enumerate(refs, 1))
    return RecordBlock("sources", body, text, md)


def list_block(title: str, items, kind: str = "list") -> RecordBlock:
    """A titled bullet list (assumptions, recommendations, warnings) for the record.

    Raises
    ------
    ValueError
        If `items` is a bare string or holds an empty or non-string entry.

    Examples
    --------
    >>> print(list_block("Assumptions", ["Long cylinder.", "No end effects."]))
    ASSUMPTIONS
    - Long cylinder.
    - No end effects.
    """
    if isinstance(items, str):
        raise ValueError("items must be a list of strings, not a single string")
    entries = list(items)
    for r in entries:
        if not isinstance(r, str) or not r.strip():
            raise ValueError(f"item {r!r} must be a non-empty string")
    if not entries:
        entries = ["(none)"]
    body = (
        f'<p style="font-weight:bold">{_e(title)}</p><ul>'
        + "".join(f"<li>{_e(r)}</li>" for r in entries)
        + "</ul>"
    )
    text = title.upper() + "\n" + "\n".join(f"- {r}" for r in entries)
    md = f"**{title}**\n\n" + "\n".join(f"- {r}" for r in entries)
    return RecordBlock(kind, body, text, md)


# -- checks --------------------------------------------------------------------------------
@dataclass(frozen=True)
class Check:
    """One pass/fail check of a result against a job limit.

    Parameters
    ----------
    name : str
        What is checked ("Coil voltage").
    value, limit : str
        The result and the limit as display text with units ("410 V", "<= 500 V").
    passed : bool
        Whether the check passes.
    note : str
        Optional remark (what to change when it fails).
    """

    name: str
    value: str
    limit: str
    passed: bool
    note: str = ""

    def __post_init__(self):
        if isinstance(self.passed, np.bool_):  # numpy bool from a comparison
            object.__setattr__(self, "passed", bool(self.passed))
        if not isinstance(self.passed, bool):
            raise ValueError(f"passed={self.passed!r} for check {self.name!r} must be True/False")
        for attr in ("name", "value", "limit", "note"):
            if not isinstance(getattr(self, attr), str):
                raise ValueError(
                    f"{attr}={getattr(self, attr)!r} for check {self.name!r} must be a string "
                    "(format numbers with their unit first)"
                )

    @property
    def result(self) -> str:
        return "PASS" if self.passed else "FAIL"


_COLUMNS = ["Check", "Value", "Limit", "Result", "Note"]
_PASS = "background:#d7f0d7;color:#064;font-weight:bold"
_FAIL = "background:#f8d0d0;color:#900;font-weight:bold"


def _checks(checks) -> list[Check]:
    checks = list(checks)
    for c in checks:
        if not isinstance(c, Check):
            raise ValueError(f"checks must be Check objects; got {c!r}")
    return checks


def checks_frame(checks) -> pd.DataFrame:
    """The checks as a table with a PASS/FAIL column."""
    rows = [(c.name, c.value, c.limit, c.result, c.note) for c in _checks(checks)]
    return pd.DataFrame(rows, columns=_COLUMNS)


def check_table(checks) -> RecordBlock:
    """Pass/fail table of the checks: PASS/FAIL as text (coloured in HTML) and a summary."""
    checks = _checks(checks)
    rows = [(c.name, c.value, c.limit, c.result, c.note) for c in checks]
    styles = [["", "", "", _PASS if c.passed else _FAIL, ""] for c in checks]
    failed = [c.name for c in checks if not c.passed]
    if not checks:
        summary = "No checks."
    elif not failed:
        summary = "The check passes." if len(checks) == 1 else f"All {len(checks)} checks pass."
    else:
        summary = f"{len(failed)} of {len(checks)} FAIL: {', '.join(failed)}."
    body = _html_table(_COLUMNS, rows, "Checks", styles) + f"<p>{_e(summary)}</p>"
    md = "| " + " | ".join(_COLUMNS) + " |\n|" + "---|" * len(_COLUMNS) + "\n"
    md += "\n".join("| " + " | ".join(r) + " |" for r in rows) + f"\n\n{summary}"
    text = (_text_table(_COLUMNS, rows) + "\n" if checks else "") + summary
    return RecordBlock("checks", body, text, md)
