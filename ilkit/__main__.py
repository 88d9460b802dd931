"""``python -m ilkit``: commands from a shell.

* ``python -m ilkit batch INVENTORY --out FOLDER [--model HL-93] [--limit-state "Strength I"] ...``: a batch
  run over a girder inventory (:func:`ilkit.batch.run`); with ``--rate design,legal [--adtt N] [--condition fair]``
  the load rating of every girder from its resistances (:class:`ilkit.batch.RatingTask`); see
  ``python -m ilkit batch --help``.
* ``python -m ilkit demo [--out out/demo]``: the demo study (the same as ``python -m ilkit.demo``).
"""

from __future__ import annotations

import argparse
import sys
from pathlib import Path


def _batch(argv: list[str]) -> int:
    parser = argparse.ArgumentParser(
        prog="python -m ilkit batch",
        description="Run a girder inventory: live-load envelopes of load models and factored envelopes of limit "
                    "states at the sections of each girder, or (--rate) the load rating of each girder, written "
                    "as Parquet tables (results.parquet, "
                    "summary.parquet) in the output folder. A run killed midway resumes when started again with "
                    "the same arguments.")
    parser.add_argument("inventory", type=Path, help="the inventory: a .toml, .json, .csv or .parquet file")
    parser.add_argument("--out", type=Path, required=True, help="the output folder")
    parser.add_argument("--model", action="append", default=[], metavar="NAME",
                        help="a load model (HL-93, fatigue truck, LM1 ...); repeat for several")
    parser.add_argument("--limit-state", action="append", default=[], metavar="NAME",
                        help="a limit state ('Strength I', 'Service II', 'AASHTO' for all ...); repeat for several")
    rate = parser.add_argument_group(
        "load rating", "rate every girder (LRFR) from its resistance instead of computing envelopes")
    rate.add_argument("--rate", default=None, metavar="LOADS",
                      help="rating loads, comma-separated: design, legal, 'AASHTO legal', 'specialized hauling', "
                           "emergency, or vehicles ('HL-93 inventory', 'Type 3', 'SU4' ...)")
    rate.add_argument("--adtt", type=float, default=None, metavar="N",
                      help="trucks a day in one direction, for the legal loads' live-load factor (default: not known)")
    rate.add_argument("--condition", default=None, metavar="WORD",
                      help="the members' condition for φc: good, satisfactory, fair, poor, or a number (default good)")
    rate.add_argument("--system", default=None, metavar="WORDS",
                      help="the structure's kind for φs (e.g. 'welded members in two-girder, truss or arch "
                           "bridges'), or a number (default: all other girder bridges and slab bridges)")
    rate.add_argument("--wearing-surface-measured", action="store_true",
                      help="the wearing surface's thickness was measured: γDW 1.25 instead of 1.50")
    parser.add_argument("--divisions", type=int, default=10, help="parts per span (default 10: tenth points)")
    parser.add_argument("--workers", type=int, default=None, help="local worker processes (default: all cores)")
    parser.add_argument("--scheduler", default=None, metavar="ADDRESS",
                        help="a dask.distributed scheduler (tcp://host:8786): run on that cluster instead")
    parser.add_argument("--chunk-size", type=int, default=100, help="girders per chunk file (default 100)")
    parser.add_argument("--retry-failed", action="store_true", help="compute again the girders that failed")
    parser.add_argument("--fresh", action="store_true", help="remove an earlier run's results in --out first")
    parser.add_argument("--no-progress", action="store_true", help="no progress bar")
    args = parser.parse_args(argv)
    from ilkit import batch
    from ilkit.errors import BatchInputError as batch_error
    from ilkit.errors import IlkitError

    try:
        what: dict[str, object] = {"models": args.model or None, "limit_states": args.limit_state or None,
                                   "divisions": args.divisions}
        given = {"adtt": args.adtt, "condition": _number_or_words(args.condition),
                 "system": _number_or_words(args.system),
                 "wearing_surface_measured": args.wearing_surface_measured or None}
        given = {k: v for k, v in given.items() if v is not None}  # the others keep RatingTask's defaults
        if args.rate is None and given:
            options = ", ".join(f"--{k.replace('_', '-')}" for k in given)
            raise batch_error(f"{options} belong to a rating run; give --rate too (e.g. --rate design,legal).",
                              field="rate")
        if args.rate is not None:
            if args.model or args.limit_state:
                raise batch_error("give --rate (a rating run) or --model and --limit-state (an envelope run), not "
                                  "both; run them into two folders.", field="rate")
            what = {"task": batch.RatingTask(loads=[x.strip() for x in args.rate.split(",") if x.strip()],
                                             divisions=args.divisions, **given)}
        result = batch.run(args.inventory, args.out, workers=args.workers, scheduler=args.scheduler,
                           chunk_size=args.chunk_size, progress=not args.no_progress,
                           retry_failed=args.retry_failed, fresh=args.fresh, **what)  # type: ignore[arg-type]
    except IlkitError as err:
        print(f"error: {err}", file=sys.stderr)
        return 2
    print(f"{result.computed} girders computed, {result.skipped} already done, {result.failed} failed, "
          f"{result.invalid} invalid records")
    print(f"results: {result.results_path}")
    print(f"summary: {result.summary_path}")
    if result.failed or result.invalid:
        print("girders not done (girder, status, field, message):")
        for row in result.errors().itertuples(index=False):
            print(f"  {row.girder}: {row.status} ({row.field}) {row.message}")
    return 0


def _number_or_words(text: str | None) -> str | float | None:
    """A factor given on the command line: a number (``0.95``) or its words (``fair``); ``None`` when not given."""
    if text is None:
        return None
    try:
        return float(text)
    except ValueError:
        return text


def main(argv: list[str] | None = None) -> int:
    """Dispatch ``python -m ilkit COMMAND ...``; returns the exit status (2 for bad input)."""
    args = sys.argv[1:] if argv is None else argv
    commands = {"batch": _batch}
    if not args or args[0] in ("-h", "--help") or args[0] not in (*commands, "demo"):
        print(__doc__.strip(), file=sys.stderr if args and args[0] not in ("-h", "--help") else sys.stdout)
        return 0 if args and args[0] in ("-h", "--help") else 2
    if args[0] == "demo":
        from ilkit import demo

        return demo.main(args[1:])
    return commands[args[0]](args[1:])


if __name__ == "__main__":
    sys.exit(main())
