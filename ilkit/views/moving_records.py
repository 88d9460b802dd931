"""Moving-load results in the calculation record: tables, notebook displays and sheet sections.

Registers, for the results of :mod:`ilkit.loads`:

* :func:`ilkit.views.table` (and so CSV, Excel and LaTeX export): an
  :class:`~ilkit.Extreme`, :class:`~ilkit.Extremes` or
  :class:`~ilkit.loads.LoadPlacement` gives one row per axle and per loaded
  stretch (``to_frame()``); an :class:`~ilkit.Envelope` its section table;
* :func:`ilkit.views.display.mimebundle`: a notebook shows a placement with
  its plot (:func:`ilkit.views.plot_placement`) and its table, an envelope
  with its plots and tables, a load model with its definition and sources;
* :func:`ilkit.views.report.report_section`: the same as sections of a
  calculation sheet, and a load model's definition and sources
  (:func:`model_blocks`).

A display and a sheet section are the same document blocks rendered to HTML,
so they cannot disagree.  Every number is the core's, rounded for reading
(six significant figures for positions, five for effects, four for ordinates and factors).
"""

from __future__ import annotations

import html
import math
from collections.abc import Callable
from typing import TYPE_CHECKING, Any

from ilkit._exact import fmt
from ilkit.errors import MissingDependencyError
from ilkit.loads.combination import Combination, LoadModel
from ilkit.loads.envelope import Envelope
from ilkit.loads.primitives import AxleTrain, KnifeEdge, Load, UniformBlocks, UniformLoad
from ilkit.loads.results import Extreme, Extremes, LoadPlacement
from ilkit.views import _doc, style
from ilkit.views._doc import Block, Figure, Heading, Para, Table
from ilkit.views.caution import CAUTION_SHORT
from ilkit.views.display import mimebundle
from ilkit.views.moving import ENVELOPE_KINDS, placement_title, plot_envelope, plot_placement
from ilkit.views.numbers import area_unit, ordinate_unit, short
from ilkit.views.report import report_section
from ilkit.views.tables import doc_table, table, without_noise

if TYPE_CHECKING:  # pragma: no cover
    import pandas as pd

    from ilkit.units import UnitSystem

__all__ = [
    "placement_table",
    "placement_blocks",
    "envelope_blocks",
    "model_blocks",
    "load_definition",
    "figure_block",
]

NOT_RECORDED = "not recorded"


# ---------------------------------------------------------------------- tables
@table.register(Extreme)
@table.register(Extremes)
@table.register(LoadPlacement)
def _(result: Extreme | Extremes | LoadPlacement) -> pd.DataFrame:
    return result.to_frame()


@table.register(Envelope)
def _(envelope: Envelope) -> pd.DataFrame:
    return envelope.to_frame()


# -------------------------------------------------------------------- helpers
def figure_block(make: Callable[[Any], Any], height: float, caption: str, name: str) -> Block:
    """A figure drawn by ``make(ax)`` on a new figure, or a note saying how to get drawings."""
    try:
        with style.context():
            fig = style.new_figure(height)
            make(fig.add_subplot())
    except MissingDependencyError as err:
        return Para((str(err),))
    return Figure(style.figure_svg(fig), caption, name)


def _slug(text: str) -> str:
    """A file stem: letters, digits, dots and minus signs kept (``x-36.5``, ``-12``); other characters as
    ``-``."""
    return "".join(c if c.isalnum() or c in ".-_" else "-" for c in text).strip("-.")


def _column(frame: pd.DataFrame, prefix: str) -> str:
    """The column whose name is ``prefix`` or ``prefix [unit]``."""
    return next(c for c in frame.columns if c == prefix or c.startswith(prefix + " ["))


def _unit(column: str) -> str:
    return column[column.find("[") + 1 : column.rfind("]")] if "[" in column else ""


def _bracket(unit: str) -> str:
    return f" [{unit}]" if unit else ""


FACTOR_WORDS = "factor (dynamic allowance × case factor)"
"""What the factor on a load's effect holds (:meth:`ilkit.Combination.part_factor`)."""


def factor_parts(model: LoadModel | None, case: str, placement: LoadPlacement) -> tuple[float, float] | None:
    """``(dynamic, case factor)`` whose product is ``placement.factor``: the dynamic factor on the load
    (1 + allowance, or 1) and the factor of its ``case`` in ``model``; ``None`` when not known."""
    if model is None:
        return None
    for combination in model.cases:
        if combination.name != case:
            continue
        for part in combination.parts:
            if part.name == placement.load:
                dynamic = combination.part_factor(part) / combination.factor
                if math.isclose(dynamic * combination.factor, placement.factor, rel_tol=1e-12):
                    return dynamic, combination.factor
    return None


def _factor_text(factor: float, parts: tuple[float, float] | None) -> str:
    if parts is None or 1.0 in parts:
        return short(factor, 4)
    return f"{short(parts[0], 4)} × {short(parts[1], 4)}"


def placement_table(result: Extreme | LoadPlacement, model: LoadModel | None = None) -> Table:
    """One row per axle and loaded stretch and a total: position, axle load or intensity, the ordinate
    under an axle or the area under a stretch, the factor and the factored effect.

    The rows are those of ``result.to_frame()`` (the core's table, rounding
    noise shown as 0), each number in a column of its own with its unit; the
    total is ``result.value`` (factored) for an extreme, ``factor x effect``
    for one load.  With the load ``model`` the factor is written as its parts
    (``1.33 × 0.9``: dynamic allowance times case factor).
    """
    frame = without_noise(result.to_frame())
    if frame.empty:
        return Table(("load", "effect"), (("nothing on the beam", "0"),), "lr")
    line = result.line
    x, to_x = _column(frame, "x"), _column(frame, "to x")
    load = next(c for c in frame.columns if c.startswith("load [") or c == "axle load")
    intensity, effect = _column(frame, "intensity"), _column(frame, "effect")
    factored = _column(frame, "factored effect")
    factor, ordinate = ordinate_unit(line) if line is not None else (1.0, "")
    area = area_unit(line) if line is not None else ""
    header = (
        "load", f"x{_bracket(_unit(x))}", f"P{_bracket(_unit(load))}", f"q{_bracket(_unit(intensity))}",
        f"ordinate{_bracket(ordinate)}", f"area{_bracket(area)}", "counted", FACTOR_WORDS,
        f"factored effect{_bracket(_unit(factored))}",
    )
    case = result.case if isinstance(result, Extreme) else ""
    parts = {p.load: factor_parts(model, case, p) for p in (result.placements if isinstance(result, Extreme)
                                                             else (result,))}
    rows: list[tuple[str, ...]] = []
    for _, r in frame.iterrows():
        patch = not _missing(r[to_x])
        side = f" ({r['side']} side)" if r["side"] else ""
        rows.append((
            f"{r['load']}, {r['item']}",
            f"{short(r[x], 6)} to {short(r[to_x], 6)}" if patch else short(r[x], 6) + side,
            "" if patch else short(r[load], 5),
            short(r[intensity], 5) if patch else "",
            "" if patch else short(r["ordinate"] * factor, 4),
            short(r[effect] / r[intensity] * factor, 5) if patch else "",
            "yes" if r["counted"] else "no", _factor_text(r["factor"], parts.get(r["load"])),
            short(r[factored], 5),
        ))
    total = result.value if isinstance(result, Extreme) else result.factored
    rows.append(("total", "", "", "", "", "", "", "", short(total, 5)))
    return Table(header, tuple(rows), "lrrrrrlrr")


def _missing(value: Any) -> bool:
    return value is None or (isinstance(value, float) and math.isnan(value))


def _placement_words(p: LoadPlacement, length_unit: str, parts: tuple[float, float] | None = None) -> str:
    """How one load stands: direction, front, spacings, effect and factor (with its parts when known)."""
    u = f" {length_unit}" if length_unit else ""
    words = [p.load]
    if p.direction:
        words.append(f"travelling {p.direction}")
    if p.front is not None and p.axles:
        words.append(f"lead axle at x = {short(p.front, 6)}{u}")
    if len(p.spacings) > 0:
        words.append("spacings " + ", ".join(short(s, 6) for s in p.spacings) + u)
    if p.patches:
        words.append("loaded " + ", ".join(f"{short(s.start, 6)} to {short(s.end, 6)}" for s in p.patches) + u)
    dropped = [a.number for a in p.axles if not a.counted]
    if dropped:
        words.append(f"axle{'s' if len(dropped) > 1 else ''} {', '.join(map(str, dropped))} not counted "
                     "(off the beam, or left off because it would reduce the extreme)")
    if parts is not None:
        factor = (f"× dynamic factor {short(parts[0], 4)} × case factor {short(parts[1], 4)}"
                  if parts != (1.0, 1.0) else "× factor 1")
        words.append(f"effect {short(p.effect, 5)} (unfactored) {factor} = {short(p.factored, 5)}")
    else:
        words.append(f"effect {short(p.effect, 5)} (unfactored) × factor {short(p.factor, 4)} (dynamic allowance "
                     f"× case factor) = {short(p.factored, 5)}")
    return "; ".join(words)


# ------------------------------------------------------------------ placements
def placement_blocks(result: Extreme | LoadPlacement, number: str = "", model: LoadModel | None = None
                     ) -> list[Block]:
    """A placement as document blocks: heading, how each load stands, plot, table (``model``: the load
    model, to write each factor as its parts)."""
    line = result.line
    headline, _, second = placement_title(result).partition("\n") if line is not None else (repr(result), "", "")
    length_unit = line.units.length if line is not None and line.units else ""
    placements = result.placements if isinstance(result, Extreme) else (result,)
    case = result.case if isinstance(result, Extreme) else ""
    blocks: list[Block] = [Heading(f"{number} {headline}".strip(), 3)]
    if isinstance(result, Extreme):
        blocks.append(Para((f"Governing case: {result.case}. Value: {short(result.value, 5)} {result.unit}, the sum "
                            "of the factored effects of its loads:",)))
    blocks += [Para((_placement_words(p, length_unit, factor_parts(model, case, p)) + ".",)) for p in placements]
    if line is not None:
        blocks.append(figure_block(lambda ax: plot_placement(result, ax), 3.3,
                                   f"{number} {headline}; {second}".strip(), _figure_name(result, number)))
    blocks.append(placement_table(result, model))
    return blocks


def _figure_name(result: Extreme | LoadPlacement, number: str) -> str:
    """A file stem for a placement's figure: the paragraph, largest or smallest, the quantity (no values, so
    no signs are lost), e.g. ``placement-4-1b-smallest-M-at-x-36``."""
    line = result.line
    assert line is not None
    which = ("largest" if result.extreme == "max" else "smallest") if isinstance(result, Extreme) else "standing"
    side = f"-{line.quantity.side}" if line.quantity.side else ""
    label = f"{line.quantity.symbol}-at-x-{fmt(line.quantity.at)}{side}"
    return _slug(f"placement-{number.replace('.', '-')}-{which}-{label}")


@report_section.register(Extreme)
@report_section.register(LoadPlacement)
def _(result: Extreme | LoadPlacement, number: str) -> list[Block]:
    return placement_blocks(result, number)


@report_section.register(Extremes)
def _(result: Extremes, number: str) -> list[Block]:
    return placement_blocks(result.maximum, f"{number}a") + placement_blocks(result.minimum, f"{number}b")


# ------------------------------------------------------------------- envelopes
NO_CASE = "—"
"""The governing case shown beside an extreme of zero: no load gives a value there, so none governs."""


def _envelope_table(frame: pd.DataFrame, symbol: str, where: tuple[str, ...]) -> Table:
    hi, lo = _column(frame, f"{symbol} max"), _column(frame, f"{symbol} min")
    clean = without_noise(frame[[*where, hi, f"{symbol} max case", lo, f"{symbol} min case"]])
    for value in (hi, lo):
        case = f"{symbol} {'max' if value == hi else 'min'} case"
        clean[case] = clean[case].where(clean[value] != 0, NO_CASE)
    return doc_table(clean, digits=5)


def envelope_blocks(envelope: Envelope, number: str = "") -> list[Block]:
    """An envelope as document blocks: what it covers, plots and tables of moment, shear and reactions,
    and the placement of the absolute maximum moment."""
    u = envelope.beam.units
    length = f" {u.length}" if u else ""
    best = envelope.absolute_maximum_moment
    sections = envelope.sections
    x_col = _column(sections, "x")
    blocks: list[Block] = [
        Heading(f"{number} Envelope of {envelope.model}".strip(), 3),
        Para((f"Largest and smallest bending moment and shear at {len(sections)} section rows (the ends, every "
              "support and release, with both sides inside the beam, and equal divisions of every span and "
              f"overhang), and the largest and smallest reaction at every support, under {envelope.model}. "
              f"Absolute maximum (sagging) moment: {short(best.value, 5)} {best.unit} ({best.case}) at "
              f"{_positions(envelope, length)}, searched between the sections to 1e-6 of the beam length.",)),
    ]
    for kind, (_, words) in ENVELOPE_KINDS.items():
        blocks.append(figure_block(lambda ax, k=kind: plot_envelope(envelope, k, ax), 2.6,  # type: ignore[misc]
                                   f"{number} Envelope of {words}: {envelope.model}".strip(),
                                   _slug(f"envelope-{number.replace('.', '-')}-{kind}")))
    blocks += [
        Para((f"Bending moment{_bracket(_unit(_column(sections, 'M max')))} at the sections:",)),
        _envelope_table(sections, "M", (x_col, "side")),
        Para((f"Shear{_bracket(_unit(_column(sections, 'V max')))} at the sections:",)),
        _envelope_table(sections, "V", (x_col, "side")),
        Para((f"Reactions{_bracket(_unit(_column(envelope.reactions, 'R max')))}:",)),
        _envelope_table(envelope.reactions, "R", (_column(envelope.reactions, "x"), "support")),
    ]
    blocks += placement_blocks(best, f"{number}.1" if number else "", envelope.load_model)
    return blocks


def _positions(envelope: Envelope, length: str) -> str:
    """Where the absolute maximum is attained: one section, or each of several with the same value."""
    at = envelope.absolute_maximum_positions or (float(envelope.absolute_maximum_moment.quantity.at),)
    words = " and ".join(f"x = {short(p, 6)}{length}" for p in at)
    if len(at) > 1:
        words += (" (the same value at each, within rounding: mirror positions of a symmetric girder under a load "
                  "that travels both ways; the placement below is the one at the first)")
    return words


@report_section.register(Envelope)
def _(envelope: Envelope, number: str) -> list[Block]:
    return envelope_blocks(envelope, number)


# ------------------------------------------------------------------ load model
def _range(lo: float, hi: float) -> str:
    if lo == hi:
        return fmt(lo)
    return f"{fmt(lo)} to {fmt(hi) if math.isfinite(hi) else 'any length'}"


def load_definition(load: Load) -> str:
    """A primitive load in words, with its numbers and units (its own unit system)."""
    u = load.units
    if isinstance(load, AxleTrain):
        words = (f"{len(load.loads)} axle{'s' if len(load.loads) > 1 else ''} of "
                 f"{', '.join(fmt(v) for v in load.loads)} {u.force} (lead axle first)")
        if load.spacings:
            words += f", spaced {', '.join(_range(lo, hi) for lo, hi in load.spacings)} {u.length}"
        if load.is_variable:
            words += " (a range: the spacing giving the extreme is searched)"
        for side, extra in (("ahead of the lead axle", load.ahead), ("behind the last axle", load.behind)):
            if extra is not None:
                where = "only where it adds to the extreme" if extra.breakable else "wherever it stands"
                words += (f"; {fmt(extra.intensity)} {u.line_load} {side}, from {fmt(extra.clearance)} {u.length} "
                          f"beyond it, of unlimited length, applied {where}")
        if load.drop_adverse_axles:
            words += "; axles that would reduce the extreme are left off"
        return words + "; travels in either direction"
    if isinstance(load, UniformLoad):
        return f"{fmt(load.intensity)} {u.line_load} on the parts of the line that add to the extreme"
    if isinstance(load, UniformBlocks):
        gaps = f", {', '.join(fmt(g) for g in load.gaps)} {u.length} apart" if load.gaps else ""
        return (f"{fmt(load.intensity)} {u.line_load} over blocks of {', '.join(fmt(v) for v in load.lengths)} "
                f"{u.length}{gaps}, placed whole")
    if isinstance(load, KnifeEdge):
        return f"a single load of {fmt(load.load)} {u.force}, anywhere on the beam"
    raise TypeError(f"unknown load {load!r}")  # pragma: no cover - Load is a closed union


def _case_row(case: Combination) -> tuple[str, ...]:
    dynamic = (f"{fmt(100 * case.dynamic_allowance)} % on {', '.join(case.dynamic_on)}"
               if case.dynamic_on and case.dynamic_allowance else "none")
    considered = "every quantity" if case.applies_to == "all" else case.applies_to
    return (case.name, " + ".join(p.name for p in case.parts), dynamic, short(case.factor, 4), considered)


def model_blocks(model: LoadModel, units: UnitSystem | None = None) -> list[Block]:
    """A load model's definition and sources as document blocks (no heading).

    ``units``: the beam's unit system, to say that the model is converted.
    """
    converted = (f"{model.units.name}; converted exactly to the beam's {units.name}"
                 if units is not None and units != model.units else model.units.name)
    facts = [
        ("load model", model.name),
        ("source", model.source or f"{NOT_RECORDED} (a load defined for this study)"),
        ("edition", model.edition or f"{NOT_RECORDED}: the licensed current edition governs; check the values "
                                     "against it"),
        ("units", converted),
    ]
    if model.notes:
        facts.append(("notes", model.notes))
    blocks: list[Block] = [Table(("item", "value"), tuple(facts))]
    if model.from_memory:
        blocks += [
            Para(("Values recalled from memory, not read in a copy of the standard; check each against the "
                  "standard before relying on the results:",)),
            Table(("recalled from memory (clause)",), tuple((item,) for item in model.from_memory)),
        ]
    elif model.source:
        blocks.append(Para(("Every value of this model was read in a copy of the standard or a document quoting "
                            "it; check them against the licensed current edition.",)))
    blocks += [
        Para(("The cases are alternatives; the worst governs each quantity. Within a case every load is placed "
              "where it is worst, independently of the others:",)),
        Table(("case", "loads", "dynamic allowance", "factor", "considered for"),
              tuple(_case_row(c) for c in model.cases), "lllrl"),
        Para((f"The loads ({model.units.name}):",)),
        Table(("load", "definition"),
              tuple({p.name: (p.name, load_definition(p)) for c in model.cases for p in c.parts}.values())),
    ]
    return blocks


@report_section.register(LoadModel)
def _(model: LoadModel, number: str) -> list[Block]:
    return [Heading(f"{number} Load model: {model.name}".strip(), 3), *model_blocks(model)]


# -------------------------------------------------------------------- displays
def _html(blocks: list[Block]) -> dict[str, Any]:
    from ilkit.views.display import _CSS

    # the sheet's level-3 headings are the display's title; the caution closes every display
    body = _doc.to_html([Heading(b.text, 4) if isinstance(b, Heading) and b.level == 3 else b for b in blocks])
    caution = f'<p class="note">{html.escape(CAUTION_SHORT)}</p>'
    return {"text/html": f'{_CSS}<div class="ilkit-view">{body}{caution}</div>'}


@mimebundle.register(Extreme)
@mimebundle.register(LoadPlacement)
def _(result: Extreme | LoadPlacement, include: Any = None, exclude: Any = None) -> dict[str, Any]:
    return _html(placement_blocks(result))


@mimebundle.register(Extremes)
def _(result: Extremes, include: Any = None, exclude: Any = None) -> dict[str, Any]:
    return _html(placement_blocks(result.maximum) + placement_blocks(result.minimum))


@mimebundle.register(LoadModel)
def _(model: LoadModel, include: Any = None, exclude: Any = None) -> dict[str, Any]:
    return _html([Heading(f"Load model: {model.name}", 3), *model_blocks(model)])


@mimebundle.register(Envelope)
def _(envelope: Envelope, include: Any = None, exclude: Any = None) -> dict[str, Any]:
    return _html(envelope_blocks(envelope))

