"""Load ratings in the calculation record: tables, displays, sheet sections and the rating sheet.

Registers :class:`~ilkit.rating.GirderRating` and :class:`~ilkit.rating.RailRating` with
:func:`ilkit.views.table` (their tidy tables), :func:`ilkit.views.display.mimebundle` and
:func:`ilkit.views.report.report_section` (the same document blocks), and writes the rating sheet
(:func:`write_rating_sheet`): a title block, the caution that a rating must be sealed by a licensed engineer,
the inputs, every factor with its source and status, the vehicles, the controlling ratings with the rating in
tons and the posting load, the rating factor along the girder, the governing placements drawn, the method;
as HTML and Markdown, and as PDF made offline from the same HTML (WeasyPrint, ``pip install ilkit[pdf]``).

Every number is the core's, rounded for reading (three significant figures for rating factors, five for
effects, four for factors).
"""

from __future__ import annotations

import math
from collections.abc import Mapping
from dataclasses import dataclass
from pathlib import Path
from typing import TYPE_CHECKING, Any

from ilkit._files import write_files
from ilkit.errors import MissingDependencyError, RatingInputError
from ilkit.rating.lrfr import GirderRating
from ilkit.rating.rail import RailRating
from ilkit.rating.resistance import RESISTANCE_KINDS
from ilkit.views._doc import Block, Callout, Heading, Para, Table
from ilkit.views.caution import CAUTION
from ilkit.views.design_records import load_words
from ilkit.views.display import mimebundle
from ilkit.views.factored_records import FACTOR_HEADER, factor_rows
from ilkit.views.moving import plot_placement
from ilkit.views.moving_records import _html, _slug, figure_block
from ilkit.views.numbers import short
from ilkit.views.rating_plots import plot_rail_rating, plot_rating
from ilkit.views.report import TitleBlock, _inputs, report_section, sheet_files
from ilkit.views.tables import table

if TYPE_CHECKING:  # pragma: no cover
    import pandas as pd

__all__ = ["RATING_CAUTION", "RatingSheet", "rating_blocks", "rail_rating_blocks", "write_rating_sheet",
           "TITLE_ALIASES"]

RATING_CAUTION = (
    "A load rating is an engineering judgement on an existing structure: these rating factors must be checked, "
    "and the rating sealed, by a licensed professional engineer under the bridge owner's rules and the "
    "licensed current edition of the Manual for Bridge Evaluation (or the rail owner's and AREMA's rules). "
    "Values marked as recalled from memory must be checked against the licensed current edition before the "
    "results are relied on; the resistances are the engineer's input, not computed here."
)
"""The caution every rating sheet and rating display carries, besides :data:`ilkit.views.caution.CAUTION`."""

TITLE_ALIASES = {"bridge": "structure", "engineer": "prepared by", "checker": "checked by"}
"""Words a rating's title block may use for the fields of :class:`~ilkit.views.TitleBlock`."""

_RF_DIGITS = 3


def _rf(value: float) -> str:
    return "∞" if math.isinf(value) else f"{value:.{_RF_DIGITS}g}" if abs(value) < 1000 else short(value, 3)


def _tons(value: float) -> str:
    return "" if value is None or (isinstance(value, float) and math.isnan(value)) else f"{value:.1f}"


def _where(row: Any, length: str) -> str:
    side = f" ({row['side']} face)" if row["side"] else ""
    return f"{row['quantity']} {row['sense']}, x = {short(row['x'], 5)} {length}{side}".strip()


def controlling_table(rating: GirderRating) -> Table:
    """The controlling rating of every vehicle as a document table (its placement: :func:`placement_table`)."""
    length = rating.beam.units.length if rating.beam.units else ""
    rows = []
    for _, r in rating.controlling().iterrows():
        rows.append((r["vehicle"], r["level"], r["limit_state"], _rf(r["RF"]), _where(r, length), _tons(r["weight"]),
                     _tons(r["rating_tons"]), _tons(r["posting"]), r["action"]))
    header = ("vehicle", "level", "limit state", "RF", "where", "weight [t]", "rating [t]", "posting [t]",
              "what follows")
    return Table(header, tuple(rows), "lllrlrrrl")


def placement_table(rating: GirderRating) -> Table:
    """Where every vehicle stands for its controlling rating, in words (one lane)."""
    rows = tuple((r["vehicle"], r["case"], r["placement"]) for _, r in rating.controlling().iterrows())
    return Table(("vehicle", "governing case", "where the loads stand"), rows)


def _rating_factors(rating: GirderRating) -> tuple[tuple[str, ...], ...]:
    rows: list[tuple[str, ...]] = []
    for action, record in rating.capacity_factors.items():
        rows += factor_rows(f"capacity, {action}", record)
    for r in rating.loads:
        for action, record in rating.live_factors[r.name].items():
            rows += factor_rows(f"{r.name}, {action}", record)
        for action, record in rating.service_factors.get(r.name, {}).items():
            rows += factor_rows(f"{r.name}, {action}, Service II", [record.factors[-1]])
    if rating.service is not None:
        rows.append(("Service II, dead loads", "load factor", "γp", "1", "every category, unfactored",
                     rating.service_states[rating.loads[0].name].source, "recalled from memory: check it"))
    seen = set()
    for r in rating.loads:
        state = rating.limit_states[r.name]
        for category in rating.permanent.categories:
            hi, lo = state.factors_of(category)
            key = (category, hi, lo)
            if key in seen:
                continue
            seen.add(key)
            rows.append((f"dead load {category}", "load factor", f"γ{category},max / γ{category},min",
                         f"{short(hi, 4)} / {short(lo, 4)}", "by the sign of the category's effect", state.source,
                         "recalled from memory: check it"))
    return tuple(rows)


def _vehicle_rows(rating: GirderRating) -> tuple[tuple[str, ...], ...]:
    rows = []
    for r in rating.loads:
        recalled = "; ".join(r.model.from_memory) or "—"
        rows.append((r.name, r.level, f"γLL {short(r.live_factor.value, 4)} ({r.live_factor.note})",
                     "one lane, m taken out" if r.single_lane else "girder's distribution factor",
                     r.model.source or "given by the user", recalled))
    return tuple(rows)


def _resistance_rows(rating: GirderRating) -> tuple[tuple[str, ...], ...]:
    rows = []
    for res, words in ((rating.resistances, "strength"), (rating.service, "Service II limit")):
        if res is None:
            continue
        for kind in RESISTANCE_KINDS:
            action = "shear" if kind == "shear" else "moment"
            phi = short(res.phi[action].value, 3) if words == "strength" else "—"
            rows.append((f"{kind} ({words})", res.describe(kind), phi))
    return tuple(rows)


def _along_table(rating: GirderRating) -> Table:
    """RF at every section (the smaller of the actions and senses), one column per vehicle."""
    import pandas as pd

    frames = []
    for r in rating.loads:
        rows = rating.along(r.name)
        best = rows.loc[rows.groupby(["x", "side"], sort=False)["RF"].idxmin()][["x", "side", "RF"]]
        frames.append(best.rename(columns={"RF": r.name}).set_index(["x", "side"]))
    wide = pd.concat(frames, axis=1)
    order = sorted(wide.index, key=lambda k: (k[0], {"left": 0, "": 1, "right": 2}[k[1]]))
    wide = wide.loc[order]
    length = rating.beam.units.length if rating.beam.units else ""
    header = (f"x [{length}]" if length else "x", "face", *[r.name for r in rating.loads])
    body = tuple((short(x, 5), side, *(_rf(v) if not (isinstance(v, float) and math.isnan(v)) else "—"
                                       for v in row))
                 for (x, side), row in zip(wide.index, wide.itertuples(index=False)))
    return Table(header, body, "rl" + "r" * len(rating.loads))


def _placement_figures(rating: GirderRating, number: str) -> list[Block]:
    blocks: list[Block] = []
    length = rating.beam.units.length if rating.beam.units else ""
    for k, (_, row) in enumerate(rating.controlling().iterrows(), start=1):
        extreme = rating.extreme(row["vehicle"], row["quantity"], row["x"], row["sense"], row["side"] or None)
        caption = (f"{number}.{k} {row['vehicle']}: controlling placement for {_where(row, length)} "
                   f"(RF {_rf(row['RF'])})")
        blocks.append(figure_block(lambda ax, e=extreme: plot_placement(e, ax), 3.3, caption,
                                   _slug(f"rating-{number}-{k}-{row['vehicle']}")))
    return blocks


def rating_blocks(rating: GirderRating, number: str = "", *, placements: bool = False) -> list[Block]:
    """A girder's rating as document blocks: the rule, the controlling ratings, RF along the girder, every
    factor with its source and status, the vehicles, the resistances, notes and the cautions
    (``placements``: also the governing placements drawn)."""
    d = rating.distribution
    blocks: list[Block] = [
        Heading(f"{number} Load rating (LRFR)".strip(), 3),
        Para(("At every rated section, action and sense of the live load: RF = (C − Σ γp P) / (γLL (LL + IM)), "
              "C = φc φs φ Rn with φc φs not less than 0.85 (AASHTO Manual for Bridge Evaluation 6A.4.2.1, from "
              "memory). LL + IM is the girder's live-load extreme of that sense: one lane's exact extreme with "
              "the vehicle's dynamic allowance, times the girder's share; Σ γp P takes each permanent load "
              "category with its largest factor where it adds to the live load's effect and its smallest where "
              "it relieves it.",)),
        *([Para(("Service II (steel, MBE 6A.6.4.2.2, from memory): RF = (fR − P) / (γLL (LL + IM)), fR the "
                 "limit given, the dead loads P unfactored, γLL 1.30 for the design inventory level and legal "
                 "loads, 1.00 for the operating level and permits.",))] if rating.service is not None else []),
        Para((f"Condition factor {rating.condition.describe()}, system factor {rating.system.describe()}; "
              f"distribution: {d.girder}, {d.method} (moment {short(d.moment.value, 4)}, shear "
              f"{short(d.shear.value, 4)} lanes).",)),
        Para(("The controlling rating of every vehicle (rating in tons = RF × weight; posting load W / 0.7 × "
              "(RF − 0.3) for 0.3 < RF < 1, MBE 6A.8.3, from memory):",)),
        controlling_table(rating),
        Para(("Where each vehicle stands for its controlling rating (positions in the beam's length unit):",)),
        placement_table(rating),
        figure_block(lambda ax: plot_rating(rating, ax=ax), 3.0,
                     f"{number} Rating factor along the girder, every vehicle".strip(),
                     _slug(f"rating-along-{number}") or "rating-along"),
        Para(("Every factor in these numbers, its source and its status:",)),
        Table(FACTOR_HEADER, _rating_factors(rating)),
        Para(("The rating vehicles, their sources and what was recalled from memory:",)),
        Table(("vehicle", "level", "live-load factor", "distribution", "source", "recalled from memory"),
              _vehicle_rows(rating)),
        Para((f"Nominal resistances Rn (given{': ' + rating.resistances.name if rating.resistances.name else ''}; "
              "beam units) and resistance factors φ:",)),
        Table(("resistance", "Rn", "φ"), _resistance_rows(rating), "llr"),
    ]
    if placements:
        blocks += _placement_figures(rating, number or "placement")
    blocks += [Para((note,)) for note in rating.notes]
    blocks.append(Para((RATING_CAUTION,)))
    return blocks


def rail_rating_blocks(rating: RailRating, number: str = "") -> list[Block]:
    """A rail rating as document blocks: the rule, the controlling ratings, the rating along the girder, the
    factors and notes."""
    length = rating.beam.units.length if rating.beam.units else ""
    title = "Cooper E-rating (AREMA)" if rating.kind == "Cooper" else "Classified load α (EN 1991-2)"
    rule = ("E = 80 (C − D) / (L80 (1 + I)) at every section, action and sense, C the capacity of the rating "
            "level, D the dead-load effect, L80 the girder's share of the Cooper E80 effect (train or alternate "
            "live load), I the impact (AREMA Chapter 15, from memory)." if rating.kind == "Cooper" else
            "α = (Rd − γG G) / (γQ Φ L71) at every section, action and sense, L71 the girder's share of the LM71 "
            "effect (and SW/0 for continuous girders) at α = 1 (EN 1991-2, EN 1990 Annex A2, from memory).")
    top = rating.controlling()
    rows = []
    for _, r in top.iterrows():
        value = f"E{r['rating']:.1f}" if rating.kind == "Cooper" else f"{r['rating']:.3f}"
        extra = () if rating.kind == "Cooper" else (
            "below the smallest class" if math.isnan(r["alpha_class"]) else f"{r['alpha_class']:.2f}",)
        rows.append((r["level"], value, _where(r, length), r["case"], *extra))
    header = ("level", "rating", "where", "governing case") + (() if rating.kind == "Cooper" else ("class α",))
    factors: list[tuple[str, ...]] = []
    for where, record in rating.factors.items():
        factors += factor_rows(where, record)
    return [
        Heading(f"{number} {title}".strip(), 3),
        Para((rule,)),
        Table(header, tuple(rows)),
        figure_block(lambda ax: plot_rail_rating(rating, ax=ax), 3.0, f"{number} {title} along the girder".strip(),
                     _slug(f"rail-{number}-{rating.kind}") or "rail-rating"),
        Table(FACTOR_HEADER, tuple(factors)),
        *(Para((n,)) for n in rating.notes),
        Para((RATING_CAUTION,)),
    ]


# ------------------------------------------------------------------------------------------ the rating sheet
@dataclass(frozen=True)
class RatingSheet:
    """Paths of a written rating sheet (``pdf`` is ``None`` when none was written)."""

    html: Path
    markdown: Path
    figures: Path
    pdf: Path | None


def _title_block(value: object) -> TitleBlock:
    if isinstance(value, Mapping):
        value = {TITLE_ALIASES.get(str(k).strip().lower(), k): v for k, v in value.items()}
    return TitleBlock.of(value)  # type: ignore[arg-type]


def sheet_blocks(rating: GirderRating, *, title: str, title_block: TitleBlock, info: Mapping[str, str] | None,
                 rail: tuple[RailRating, ...] = ()) -> list[Block]:
    """The rating sheet as document blocks."""
    import ilkit

    u = rating.beam.units
    blocks: list[Block] = [Heading(title, 1), *title_block.blocks(title)]
    if info:
        blocks.append(Table(("", ""), tuple((str(k), str(v)) for k, v in info.items())))
    blocks += [Callout(RATING_CAUTION, "caution"), Callout(CAUTION, "caution"),
               Heading("1. Inputs", 2), *_inputs(rating.beam)]
    loads = [(stage.name, load) for stage in rating.permanent.stages for load in stage.loads]
    blocks += [Para(("Permanent loads (unfactored):",)),
               Table(("stage", "load", "category", "as given"),
                     tuple((s or "—", load.name, load.category, load_words(load, u)) for s, load in loads))]
    blocks += [Heading("2. Rating", 2), *rating_blocks(rating, "2.1")]
    chapter = 3
    if rail:
        blocks.append(Heading(f"{chapter}. Rail rating", 2))
        for k, r in enumerate(rail, start=1):
            blocks += rail_rating_blocks(r, f"{chapter}.{k}")
        chapter += 1
    blocks += [Heading(f"{chapter}. Rating factors along the girder", 2),
               Para(("The smaller rating factor of the rated actions and senses at every section, per vehicle:",)),
               _along_table(rating)]
    chapter += 1
    blocks += [Heading(f"{chapter}. Governing placements", 2),
               Para(("Where each vehicle stands for its controlling rating (one lane, with the dynamic allowance, "
                     "without the girder's share):",)),
               *_placement_figures(rating, str(chapter))]
    chapter += 1
    blocks += [
        Heading(f"{chapter}. Method and sources", 2),
        Para(("Live-load effects: the exact worst placement of every vehicle on the influence line of each rated "
              "section (axles at breakpoints or stationary points, lane loads on the parts of the line of the "
              "wanted sign, both directions of travel), ilkit.loads. Permanent effects: exact integration of "
              "the influence lines, ilkit.design.",)),
        Para(("Rating factors, vehicles and constants: AASHTO Manual for Bridge Evaluation (LRFR), recalled from "
              "memory against its third edition (2018) with interim revisions; AASHTO LRFD Bridge Design "
              "Specifications, recalled against the ninth edition (2020). The licensed current editions govern.",)),
        Para((f"Computed by ilkit {ilkit.__version__}. Tables round the numbers (three significant figures for "
              "rating factors).",)),
        Callout(RATING_CAUTION, "caution"),
    ]
    return blocks


def write_rating_sheet(
    rating: GirderRating,
    path: str | Path,
    *,
    title: str = "Load rating sheet",
    title_block: TitleBlock | Mapping[str, str] | None = None,
    info: Mapping[str, str] | None = None,
    rail: RailRating | tuple[RailRating, ...] = (),
    pdf: bool | None = None,
) -> RatingSheet:
    """Write the rating sheet of ``rating`` as ``<path>.html``, ``<path>.md`` (figures as SVG files in
    ``<path>_figures/``) and ``<path>.pdf``.

    ``title_block``: a :class:`~ilkit.views.TitleBlock` or a mapping of its fields; ``"bridge"``,
    ``"engineer"`` and ``"checker"`` are accepted for structure, prepared by and checked by.  ``info``:
    further header lines.  ``rail``: rail ratings of the same girder to include.  ``pdf``: ``True`` writes
    the PDF (WeasyPrint, ``pip install ilkit[pdf]``; without it :class:`~ilkit.MissingDependencyError`),
    ``False`` does not, ``None`` writes it where WeasyPrint is installed.  Every file is written atomically,
    all or none.
    """
    from ilkit.views.report import _stem

    if not isinstance(rating, GirderRating):
        raise RatingInputError(f"write_rating_sheet: give ilkit.rating.rate_girder(...), got "
                               f"{type(rating).__name__}.", field="rating", value=rating)
    rails = (rail,) if isinstance(rail, RailRating) else tuple(rail)
    if not all(isinstance(r, RailRating) for r in rails):
        raise RatingInputError("write_rating_sheet: rail must be rail ratings (cooper_rating(...)).", field="rail")
    stem = _stem(path)
    block = _title_block(title_block)
    blocks = sheet_blocks(rating, title=title, title_block=block, info=info, rail=rails)
    page, files, figures = sheet_files(stem, title, blocks, block)
    pdf_path = None
    if pdf is not False:
        data = pdf_bytes(page, required=pdf is True)
        if data is not None:
            pdf_path = stem.with_name(stem.name + ".pdf")
            files[pdf_path] = data
    write_files(files, what="write_rating_sheet")
    return RatingSheet(stem.with_name(stem.name + ".html"), stem.with_name(stem.name + ".md"), figures, pdf_path)


def pdf_bytes(page: str, *, required: bool = True) -> bytes | None:
    """An HTML page (self-contained: inline SVG, no scripts, no network) as PDF bytes, made offline with
    WeasyPrint; ``None`` when WeasyPrint is not installed and ``required`` is False."""
    try:
        import weasyprint
    except (ImportError, OSError) as err:  # OSError: the system's Pango library is missing
        if not required:
            return None
        raise MissingDependencyError(
            f"the PDF needs WeasyPrint and the Pango library ({err}); install it with: pip install ilkit[pdf] "
            "(on Debian, Pango comes with: apt-get install libpango-1.0-0 libpangoft2-1.0-0)") from None
    return weasyprint.HTML(string=page, base_url=None).write_pdf()  # type: ignore[no-any-return]


# ------------------------------------------------------------------------------------------ registrations
@table.register(GirderRating)
@table.register(RailRating)
def _(result: Any) -> pd.DataFrame:
    return result.to_frame()


@report_section.register(GirderRating)
def _(rating: GirderRating, number: str) -> list[Block]:
    return rating_blocks(rating, number, placements=True)


@report_section.register(RailRating)
def _(rating: RailRating, number: str) -> list[Block]:
    return rail_rating_blocks(rating, number)


@mimebundle.register(GirderRating)
def _(rating: GirderRating, include: Any = None, exclude: Any = None) -> dict[str, Any]:
    return _html(rating_blocks(rating))


@mimebundle.register(RailRating)
def _(rating: RailRating, include: Any = None, exclude: Any = None) -> dict[str, Any]:
    return _html(rail_rating_blocks(rating))
