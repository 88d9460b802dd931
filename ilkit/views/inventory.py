"""Views of a batch run over a girder inventory (:func:`ilkit.batch.run`): the summary, the spread of the
governing values across the inventory, one girder's calculation sheet on demand.

No engineering here: every number is read from the run's tables or computed again by its task.

* ``views.table(result)``: the summary (one row per girder; :meth:`ilkit.batch.BatchResult.summary`);
  in a notebook a :class:`~ilkit.batch.BatchResult` shows its counts, the girders not done and the
  first rows of the summary;
* :func:`plot_inventory`: a histogram of one governing value (the largest sagging moment of each
  girder ...) across the inventory, one set of bars per unit system;
* :func:`write_girder_sheet`: one girder's calculation sheet (its beam, the load model and limit-state
  envelopes of the run), named after its id (escaped: :func:`ilkit.batch.file_name`);
* :func:`write_inventory_demo`: the demo's inventory run (``make demo``): a generated inventory of our own,
  its summary table and its histograms on a page that renders offline.
"""

from __future__ import annotations

import html
import os
from pathlib import Path
from typing import TYPE_CHECKING, Any, Literal

from ilkit._check import choice, whole
from ilkit.batch.names import file_name
from ilkit.batch.runner import STATUS_COLUMNS, BatchResult
from ilkit.batch.tasks import QUANTITIES
from ilkit.errors import BatchInputError
from ilkit.views import style
from ilkit.views._args import axes_or_none, expect
from ilkit.views.caution import CAUTION
from ilkit.views.display import mimebundle
from ilkit.views.tables import table

if TYPE_CHECKING:  # pragma: no cover
    import pandas as pd
    from matplotlib.axes import Axes

    from ilkit.views.rating_records import RatingSheet
    from ilkit.views.report import CalculationSheet

__all__ = ["plot_inventory", "write_girder_sheet", "write_inventory_demo"]

_WORDS = {("moment", "max"): "largest sagging moment", ("moment", "min"): "largest hogging moment",
          ("shear", "max"): "largest positive shear", ("shear", "min"): "largest negative shear",
          ("reaction", "max"): "largest reaction", ("reaction", "min"): "smallest reaction"}
_UNITS = {"moment": "moment", "shear": "force", "reaction": "force"}


def _unit(system: str, quantity: str) -> str:
    from ilkit.units import SYSTEMS

    found = SYSTEMS.get(system)
    return getattr(found, _UNITS[quantity]) if found is not None else ""


def plot_inventory(
    result: BatchResult,
    quantity: Literal["moment", "shear", "reaction", "RF"] = "moment",
    extreme: Literal["max", "min"] | None = None,
    ax: Axes | None = None,
    *,
    bins: int = 30,
    vehicle: str | None = None,
) -> Axes:
    """Histogram of one governing value of each girder done, across the inventory; returns the axes.

    An envelope run: the ``extreme`` (``"max"``, the default, or ``"min"``) of ``quantity`` (the summary's
    ``{quantity}_{extreme}``, over every load and section of the run), one set of bars per unit system (values
    are not converted); sagging moment positive, shear and reactions as in :mod:`ilkit.model`.  A rating run
    (:class:`ilkit.batch.RatingTask`): ``quantity="RF"``, the controlling rating factor of each girder
    (dimensionless), or that of ``vehicle`` (``"Type 3"``), with a line at RF = 1."""
    expect(result, BatchResult, what="plot_inventory", hint="give the result of ilkit.batch.run(...)")
    choice(quantity, (*QUANTITIES, "RF"), what="plot_inventory: quantity", field="quantity", error=BatchInputError)
    rf = quantity == "RF"
    choice(extreme, ("min",) if rf else ("max", "min"), what="plot_inventory: extreme", field="extreme",
           error=BatchInputError, optional=True)
    if vehicle is not None and not rf:
        raise BatchInputError("plot_inventory: vehicle goes with quantity='RF' (a rating run).", field="vehicle",
                              value=vehicle)
    n = whole(bins, what="plot_inventory: bins", field="bins", minimum=1, error=BatchInputError)
    axes_or_none(ax, what="plot_inventory")
    summary = result.summary()
    done = summary[summary["status"] == "done"]
    if rf:
        column = "RF" if vehicle is None else f"RF: {vehicle}"
        if column not in summary:
            vehicles = [c.removeprefix("RF: ") for c in summary.columns if str(c).startswith("RF: ")]
            raise BatchInputError(
                f"plot_inventory: no rating factors of {vehicle if vehicle is not None else 'any vehicle'!r} in this "
                f"run; " + (f"its vehicles: {', '.join(vehicles)}." if vehicles else "rate it with "
                            "batch.run(..., task=batch.RatingTask(...))."), field="vehicle", value=vehicle)
        words = "controlling rating factor" + (f" for {vehicle}" if vehicle is not None else "")
        with style.context():
            ax = style.axes(ax, 3.2)
            values = done[column].to_numpy(dtype=float)
            ax.hist(values, bins=n, label=f"{len(values)} girders")
            ax.axvline(1.0, color="0.25", linestyle="--", linewidth=1.0, label="RF = 1")
            ax.set_xlabel(f"{words} of each girder")
            ax.set_ylabel("girders")
            ax.set_title(f"{words.capitalize()} across the inventory: {len(done)} girders done, "
                         f"{len(summary) - len(done)} not done", fontsize="medium")
            ax.legend(fontsize="small")
        return ax
    which = extreme or "max"
    column = f"{quantity}_{which}"
    with style.context():
        ax = style.axes(ax, 3.2)
        groups = list(done.groupby("units", sort=True)) if not done.empty else []
        for system, part in groups:
            values = part[column].to_numpy(dtype=float)
            unit = _unit(str(system), quantity)
            ax.hist(values, bins=n, alpha=0.75 if len(groups) > 1 else 1.0,
                    label=f"{system}: {len(values)} girders ({unit})")
        units = sorted({_unit(str(s), quantity) for s, _ in groups})
        ax.set_xlabel(f"{_WORDS[(quantity, which)]} of each girder" + (f" ({units[0]})" if len(units) == 1 else ""))
        ax.set_ylabel("girders")
        ax.set_title(f"{_WORDS[(quantity, which)].capitalize()} across the inventory: {len(done)} girders done, "
                     f"{len(summary) - len(done)} not done", fontsize="medium")
        if groups:
            ax.legend(fontsize="small")
    return ax


def write_girder_sheet(result: BatchResult, girder: str,
                       folder: str | os.PathLike[str]) -> CalculationSheet | RatingSheet:
    """Write the calculation sheet of one girder of a run into ``folder``: its beam and the run's results for
    it computed again from its record (for each load model the girder's live load and one lane's envelope
    with its placements; the permanent effects and the factored envelopes of the limit states; for a rating
    run the rating sheet, :func:`ilkit.views.write_rating_sheet`, HTML and Markdown); the files are named
    after the girder's id, escaped so that they stay in ``folder`` (:func:`ilkit.batch.file_name`).
    Returns the :class:`~ilkit.views.CalculationSheet` (or the rating sheet's paths)."""
    from ilkit.views.report import write_calculation_sheet

    expect(result, BatchResult, what="write_girder_sheet", hint="give the result of ilkit.batch.run(...)")
    record = result.record(girder)
    computed = result.compute(girder)
    source = (result.inventory.source if result.inventory else "") or "records given in Python"
    if computed and computed[0][1] == "rating":
        from ilkit.views.rating_records import write_rating_sheet

        return write_rating_sheet(computed[0][2], file_name(folder, girder, ".html"), title=f"Load rating of girder "
                                  f"{girder}", info={"girder": girder, "inventory": source}, pdf=False)
    beam = record.beam()
    loads = ", ".join(load for load, kind, _ in computed if kind == "load model")
    states = ", ".join(str(s) for s in result.settings.get("limit_states", []))
    info = {"girder": girder, "inventory": source,
            "load models": loads or "-", "limit states": states or "-"}
    results: list[Any] = []
    for _, kind, found in computed:  # a load model: the girder's share, then one lane's envelope and placements
        results += [found.live, found.lane] if kind == "load model" else [found.permanent, found]
    return write_calculation_sheet(beam, file_name(folder, girder, ".html"), lines=[], results=results,
                                   title=f"Girder {girder}", info=info)


@table.register(BatchResult)
def _summary_table(result: BatchResult, **_: Any) -> pd.DataFrame:
    return result.summary()


@mimebundle.register(BatchResult)
def _display(result: BatchResult, include: Any = None, exclude: Any = None) -> dict[str, Any]:
    summary = result.summary()
    done = int((summary["status"] == "done").sum())
    parts = [f"<p><strong>Batch run</strong> in <code>{html.escape(str(result.folder))}</code>: {len(summary)} "
             f"girders, {done} done ({result.computed} computed now, {result.skipped} found done), "
             f"{result.failed} failed, {result.invalid} invalid records.</p>"]
    errors = summary[summary["status"] != "done"][list(STATUS_COLUMNS)]
    if not errors.empty:
        parts.append("<p>Girders not done:</p>" + errors.head(20).to_html(index=False))
    shown = summary[summary["status"] == "done"].drop(columns=["status", "error", "field", "message"])
    parts.append("<p>Summary (first rows; <code>result.summary()</code> has them all):</p>"
                 + shown.head(10).to_html(index=False, float_format=lambda v: f"{v:.6g}"))
    parts.append(f"<p><em>{html.escape(CAUTION)}</em></p>")
    return {"text/plain": repr(result), "text/html": "\n".join(parts)}


_DEMO_PLOTS = (("moment", "max"), ("moment", "min"), ("shear", "max"), ("reaction", "max"))


def write_inventory_demo(out: str | os.PathLike[str], girders: int = 300, *, workers: int | None = None,
                         progress: bool = True) -> Path:
    """Run a generated inventory of ``girders`` girders of our own (:func:`ilkit.batch.sample_inventory`: 1 to
    5 spans of 20 to 150 ft, kip-ft) under HL-93, Strength I and Service II at tenth points into
    ``out/inventory_run/`` (the Parquet tables) and write ``out/inventory_run.html`` (the counts, histograms
    of the governing values and the summary table; it renders offline) and ``out/inventory_run_summary.csv``;
    rate the girders that carry resistances (every fourth) for the design and legal loads into
    ``out/inventory_rating/`` and write ``out/inventory_rating.html`` (:func:`write_rating_demo`), linked
    from the first page; returns the first page.  A second call resumes the runs (nothing is computed
    twice)."""
    from ilkit._files import write_files
    from ilkit.batch import run, sample_inventory
    from ilkit.views import _doc

    folder = Path(out)
    n = whole(girders, what="write_inventory_demo: girders", field="girders", minimum=1, error=BatchInputError)
    records = sample_inventory(n)
    result = run(records, folder / "inventory_run", models=["HL-93"],
                 limit_states=["Strength I", "Service II"], workers=workers, progress=progress)
    rated = [r for r in records if "resistance" in r]
    rating_page = write_rating_demo(folder, rated, workers=workers, progress=progress)
    summary = result.summary()
    figures = []
    for quantity, extreme in _DEMO_PLOTS:
        with style.context():
            fig = style.new_figure(3.2)
            plot_inventory(result, quantity, extreme, fig.add_subplot(), bins=30)
            figures.append(f'<p><img src="{_doc.svg_data_uri(style.figure_svg(fig))}" '
                           f'alt="{html.escape(_WORDS[(quantity, extreme)])} of each girder"></p>')
    done = int((summary["status"] == "done").sum())
    columns = ["girder", "status", "spans", "moment_max", "moment_max_x", "moment_max_load", "moment_min",
               "moment_min_x", "moment_min_load", "shear_max", "shear_min", "reaction_max"]
    page = (
        "<!doctype html><html><head><meta charset='utf-8'><title>Inventory run: HL-93, Strength I, Service II"
        "</title></head><body style='font-family: sans-serif; max-width: 60em; margin: 2em auto'>"
        "<h1>Inventory run: HL-93, Strength I and Service II over a generated inventory</h1>"
        f"<p><strong>Caution.</strong> {html.escape(CAUTION)}</p>"
        f"<p>{len(summary)} girders of our own (invented: 1 to 5 continuous spans of 20 to 150 ft, kip and ft), "
        f"{done} done, {result.failed} failed, {result.invalid} invalid; envelopes at tenth points of every span "
        "(ilkit.batch.run). Governing values over every section, the HL-93 girder live load and the two limit "
        "states; sagging moment positive, shear positive when the part left of the section is pushed up, "
        "reactions upward. Tables: inventory_run/results.parquet, inventory_run/summary.parquet, "
        "inventory_run_summary.csv.</p>"
        f"<p>The load rating of the {len(rated)} girders that carry resistances: "
        f"<a href='{rating_page.name}'>{rating_page.name}</a>.</p>"
        + "".join(figures)
        + summary[columns].to_html(index=False, float_format=lambda v: f"{v:.1f}")
        + "</body></html>")
    target = folder / "inventory_run.html"
    write_files({target: page, folder / "inventory_run_summary.csv": summary.to_csv(index=False)},
                what="write_inventory_demo")
    return target


_RATING_DEMO = {"loads": ("design", "legal"), "adtt": 1500, "condition": "good"}


def write_rating_demo(out: str | os.PathLike[str], records: list[dict[str, Any]], *, workers: int | None = None,
                      progress: bool = True) -> Path:
    """Rate ``records`` (inventory records with resistances) for the design load and the legal loads (ADTT
    1500, good condition; :class:`ilkit.batch.RatingTask`) into ``out/inventory_rating/`` and write
    ``out/inventory_rating.html`` (the controlling rating factor of each vehicle across the inventory, a
    histogram of each girder's controlling RF and the summary table; it renders offline) and
    ``out/inventory_rating_summary.csv``; returns the page."""
    import pandas as pd

    from ilkit._files import write_files
    from ilkit.batch import RatingTask, run
    from ilkit.views import _doc

    folder = Path(out)
    result = run(records, folder / "inventory_rating", task=RatingTask(**_RATING_DEMO), workers=workers,
                 progress=progress)
    summary = result.summary()
    done = summary[summary["status"] == "done"]
    vehicles = [str(c).removeprefix("RF: ") for c in summary.columns if str(c).startswith("RF: ")]
    per_vehicle = pd.DataFrame([{
        "vehicle": v, "girders rated": int(done[f"RF: {v}"].notna().sum()),
        "smallest RF": done[f"RF: {v}"].min(),
        "girder": done.loc[done[f"RF: {v}"].idxmin(), "girder"] if not done.empty else "",
        "where": done.loc[done[f"RF: {v}"].idxmin(), f"where: {v}"] if not done.empty else "",
        "median RF": done[f"RF: {v}"].median(), "girders with RF < 1": int((done[f"RF: {v}"] < 1).sum()),
        "girders with a posting load": int(done[f"posting: {v}"].notna().sum()),
    } for v in vehicles])
    with style.context():
        fig = style.new_figure(3.2)
        plot_inventory(result, "RF", ax=fig.add_subplot(), bins=30)
        figure = (f'<p><img src="{_doc.svg_data_uri(style.figure_svg(fig))}" '
                  'alt="controlling rating factor of each girder"></p>')
    columns = ["girder", "status", "field", "spans", "RF", "RF_vehicle", "RF_where",
               *[f"RF: {v}" for v in vehicles[:5]], "rating tons: Type 3", "posting: Type 3"]
    columns = [c for c in columns if c in summary]
    page = (
        "<!doctype html><html><head><meta charset='utf-8'><title>Inventory rating: design and legal loads"
        "</title></head><body style='font-family: sans-serif; max-width: 60em; margin: 2em auto'>"
        "<h1>Inventory rating: HL-93 and the AASHTO legal loads over a generated inventory</h1>"
        f"<p><strong>Caution.</strong> {html.escape(CAUTION)} A load rating must be checked and sealed by a "
        "licensed engineer under the bridge owner's rules; the rating factors recalled from the Manual for Bridge "
        "Evaluation are marked from memory in ilkit.rating.</p>"
        f"<p>{len(summary)} girders of our own with invented nominal resistances (demo data: no cross-section "
        f"stands behind them), {len(done)} rated, {result.failed} failed, {result.invalid} invalid; LRFR at "
        "tenth points (ilkit.batch.RatingTask: the design load at inventory and operating levels, the legal "
        "loads with γLL for an ADTT of 1500, φc = 1.0 for good condition, φs = 1.0). Rating in tons and the "
        "posting load for the legal vehicles. Tables: inventory_rating/results.parquet, "
        "inventory_rating/summary.parquet, inventory_rating_summary.csv.</p>"
        "<h2>Controlling rating factor of each vehicle across the inventory</h2>"
        + per_vehicle.to_html(index=False, float_format=lambda v: f"{v:.2f}", na_rep="")
        + figure
        + "<h2>Each girder</h2>"
        + summary[columns].to_html(index=False, float_format=lambda v: f"{v:.2f}", na_rep="")
        + "</body></html>")
    target = folder / "inventory_rating.html"
    write_files({target: page, folder / "inventory_rating_summary.csv": summary.to_csv(index=False)},
                what="write_rating_demo")
    return target
