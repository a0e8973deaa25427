"""The ``heatcalc`` command: start, run and export calculation-record workbooks.

::

    heatcalc new through-heat jobs/Q-1042.ipynb
    heatcalc run jobs/Q-1042.ipynb --set diameter="80 mm" --set throughput="1.2 t/h" --pdf
    heatcalc demo --out heatcalc-records
    heatcalc materials

Exit codes: 0 done, 1 a workbook failed while running, 2 bad usage or bad input (unknown
parameter, missing unit, existing output, unknown job type), 130 interrupted.
"""

from __future__ import annotations

import argparse
import os
import sys
import textwrap
import time
from pathlib import Path

from . import __version__
from . import notebook as nbk

__all__ = ["main", "build_parser"]

EXIT_OK, EXIT_FAILED, EXIT_USAGE, EXIT_INTERRUPTED = 0, 1, 2, 130
DEFAULT_OUT = "heatcalc-records"


def _say(message: str) -> None:
    print(message, file=sys.stderr, flush=True)


def build_parser() -> argparse.ArgumentParser:
    """The argument parser of the ``heatcalc`` command."""
    parser = argparse.ArgumentParser(
        prog="heatcalc",
        description="Induction-heating calculation records: start a job workbook from a "
        "template, run it with inputs, export the record as HTML (and PDF).",
        epilog="Exit codes: 0 done, 1 a workbook failed, 2 bad usage or input.",
    )
    parser.add_argument("--version", action="version", version=f"heatcalc {__version__}")
    sub = parser.add_subparsers(dest="command", metavar="COMMAND", required=True)

    jobs = ", ".join(nbk.WORKBOOKS)
    p = sub.add_parser(
        "new",
        help="start a job: copy a template workbook with a blank job header",
        description=f"Copy the template workbook of a job type ({jobs}) to PATH with a blank "
        "job header and no outputs. An existing PATH is never overwritten.",
    )
    p.add_argument("job_type", metavar="JOB_TYPE", help=f"one of: {jobs}")
    p.add_argument("path", metavar="PATH", type=Path, help="the new workbook (.ipynb)")

    p = sub.add_parser(
        "run",
        help="run a workbook with inputs and write the record",
        description="Run WORKBOOK (values from --params, then --set, override its parameters "
        "cell) and write <name>.ipynb and <name>.html (code hidden) into --out.",
    )
    p.add_argument("workbook", metavar="WORKBOOK", type=Path, help="the workbook to run")
    p.add_argument(
        "--set",
        dest="assignments",
        metavar="NAME=VALUE",
        action="append",
        default=[],
        help="set one input, with its unit where it has one: --set diameter='80 mm' (repeatable)",
    )
    p.add_argument(
        "--params",
        metavar="FILE",
        type=Path,
        help="inputs from a .json, .toml or .yaml file holding one mapping of name to value",
    )
    p.add_argument(
        "--out",
        metavar="DIR",
        type=Path,
        default=Path(DEFAULT_OUT),
        help=f"output folder (default: ./{DEFAULT_OUT})",
    )
    p.add_argument("--pdf", action="store_true", help="also print the record to PDF")
    p.add_argument("--overwrite", action="store_true", help="replace existing outputs")
    p.add_argument("--quiet", action="store_true", help="no progress output")

    p = sub.add_parser(
        "demo",
        help="run every shipped workbook with its demo inputs",
        description="Run the shipped workbooks with their own demo inputs and write the "
        "records into --out.",
    )
    p.add_argument(
        "--out",
        metavar="DIR",
        type=Path,
        default=Path(DEFAULT_OUT),
        help=f"output folder (default: ./{DEFAULT_OUT})",
    )
    p.add_argument("--pdf", action="store_true", help="also print the records to PDF")
    p.add_argument("--overwrite", action="store_true", help="replace existing records")

    sub.add_parser(
        "materials",
        help="list the built-in materials and their sources",
        description="List the built-in materials: key, name, category, the temperature range "
        "of their tables and their sources.",
    )
    return parser


def _cmd_new(args) -> int:
    path = nbk.new_workbook(args.job_type, args.path)
    print(f"new {args.job_type} workbook: {path}")
    print(
        "fill in the job header and inputs in its parameters cell, then run it with "
        f"`heatcalc run {path}`"
    )
    return EXIT_OK


def _cmd_run(args) -> int:
    params = nbk.load_parameter_file(args.params) if args.params else {}
    params = nbk.check_parameters(args.workbook, params) if params else {}
    params.update(nbk.parse_assignments(args.assignments, args.workbook))
    rec = nbk.run_workbook(
        args.workbook,
        args.out,
        params,
        overwrite=args.overwrite,
        pdf=args.pdf,
        progress=not args.quiet and sys.stderr.isatty(),
        report=None if args.quiet else _say,
    )
    if not args.quiet:
        _say(f"done in {rec.seconds:.1f} s")
    print(f"notebook: {rec.notebook}")
    print(f"record:   {rec.html}")
    if args.pdf:
        print(f"pdf:      {rec.pdf}" if rec.pdf else rec.note)
    return EXIT_OK


def _cmd_demo(args) -> int:
    t0 = time.perf_counter()
    records = nbk.build_demo(args.out, overwrite=args.overwrite, pdf=args.pdf, report=_say)
    _say(f"{len(records)} records in {time.perf_counter() - t0:.1f} s")
    print(f"records are in {args.out.resolve()}:")
    for job, rec in records.items():
        print(f"  {job:<13} {rec.html}" + (f"  {rec.pdf}" if rec.pdf else ""))
    return EXIT_OK


def _cmd_materials(args) -> int:
    from .materials import catalogue

    table = catalogue()
    for row in table.itertuples(index=False):
        print(f"{row.key}: {row.name} ({row.category}; tables {row[3]})")
        print(
            textwrap.fill(
                f"sources: {row.sources}",
                width=100,
                initial_indent="    ",
                subsequent_indent="      ",
            )
        )
    return EXIT_OK


_COMMANDS = {"new": _cmd_new, "run": _cmd_run, "demo": _cmd_demo, "materials": _cmd_materials}


def main(argv=None) -> int:
    """Run the ``heatcalc`` command with `argv` (default: the process arguments).

    Returns the exit code: 0 done, 1 a workbook failed, 2 bad usage or input.
    """
    parser = build_parser()
    try:
        args = parser.parse_args(argv)
    except SystemExit as exc:  # --help, --version (0) or a usage error (2)
        return int(exc.code or 0)
    try:
        return _COMMANDS[args.command](args)
    except nbk.WorkbookError as exc:
        _say(f"heatcalc {args.command}: failed: {exc}")
        return EXIT_FAILED
    except (ValueError, FileExistsError, FileNotFoundError, KeyError) as exc:
        message = exc.args[0] if isinstance(exc, KeyError) and exc.args else exc
        _say(f"heatcalc {args.command}: error: {message}")
        return EXIT_USAGE
    except BrokenPipeError:  # output piped into a program that stopped reading (| head)
        sys.stdout = open(os.devnull, "w")  # keeps the exit quiet
        return EXIT_OK
    except KeyboardInterrupt:
        _say(f"heatcalc {args.command}: interrupted")
        return EXIT_INTERRUPTED


if __name__ == "__main__":
    sys.exit(main())
