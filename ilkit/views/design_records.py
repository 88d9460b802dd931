"""Design results in the calculation record: tables, notebook displays and sheet sections.

Registers, for the results of :mod:`ilkit.design` (permanent effects, concurrent forces, the
live-load deflection check):

* :func:`ilkit.views.table` (and so CSV, Excel and LaTeX export): the tidy table of permanent
  effects and of concurrent forces (``to_frame()``), the span table of a deflection check;
* :func:`ilkit.views.display.mimebundle` and :func:`ilkit.views.report.report_section`: the same
  document blocks (what was applied, drawings, tables, notes), so a display and a sheet section
  cannot disagree.

Every number is the core's, rounded for reading (five significant figures for effects, four for
factors); rounding noise is shown as 0.
"""

from __future__ import annotations

from typing import TYPE_CHECKING, Any

from ilkit._exact import fmt
from ilkit.design.concurrent import ConcurrentForces
from ilkit.design.deflection import DeflectionCheck
from ilkit.design.permanent import DistributedLoad, PermanentEffects, PermanentLoad, PointLoad, Settlement, SpanLoad
from ilkit.views._doc import Block, Heading, Para, Table
from ilkit.views.design_plots import PERMANENT_KINDS, plot_deflection_check, plot_permanent_effects
from ilkit.views.display import mimebundle
from ilkit.views.moving_records import _html, _slug, figure_block
from ilkit.views.numbers import short
from ilkit.views.report import report_section
from ilkit.views.tables import doc_table, table

if TYPE_CHECKING:  # pragma: no cover
    import pandas as pd

    from ilkit.units import UnitSystem

__all__ = ["permanent_blocks", "concurrent_blocks", "deflection_blocks", "load_words"]


# ---------------------------------------------------------------------- tables
@table.register(PermanentEffects)
@table.register(ConcurrentForces)
@table.register(DeflectionCheck)
def _(result: PermanentEffects | ConcurrentForces | DeflectionCheck) -> pd.DataFrame:
    return result.to_frame()


# ----------------------------------------------------------------- permanent
def _number(value: object, unit: str) -> str:
    """A number as given: a pint quantity with its own units, a plain number in the beam's ``unit``."""
    if hasattr(value, "magnitude"):
        return str(value)
    return f"{fmt(value)} {unit}".rstrip()  # type: ignore[arg-type]


def load_words(load: PermanentLoad, units: UnitSystem | None) -> str:
    """A permanent load in words with its numbers and units (as given)."""
    force = units.force if units else ""
    length = units.length if units else ""
    line = units.line_load if units else ""
    if isinstance(load, SpanLoad):
        return f"{_number(load.intensity, line)} over span {load.span}"
    if isinstance(load, DistributedLoad):
        if load.start is None and load.end is None:
            return f"{_number(load.intensity, line)} over the whole beam"
        start = "the left end" if load.start is None else f"x = {_number(load.start, length)}"
        end = "the right end" if load.end is None else f"x = {_number(load.end, length)}"
        return f"{_number(load.intensity, line)} from {start} to {end}"
    if isinstance(load, PointLoad):
        return f"{_number(load.load, force)} at x = {_number(load.at, length)}"
    assert isinstance(load, Settlement)
    return f"the bearing at x = {_number(load.at, length)} settles by {_number(load.displacement, length)}"


def permanent_blocks(effects: PermanentEffects, number: str = "") -> list[Block]:
    """Permanent effects as document blocks: the loads by stage, diagrams and tables by category, notes."""
    u = effects.units
    staged = bool(effects.stages[0].name)
    rows = []
    for stage in effects.stages:
        for load in stage.loads:
            rows.append(((stage.name,) if staged else ()) + (load.name, load.category, load_words(load, u)))
    header = (("stage",) if staged else ()) + ("load", "category", "definition")
    blocks: list[Block] = [
        Heading(f"{number} Permanent loads{': ' + effects.name if effects.name else ''}".strip(), 3),
        Para(("Loads act downward when positive. Effects come from the influence lines: a uniform load times the "
              "exact integral of the line over its stretch, a point load times the ordinate under it"
              + ("; each stage's loads act on that stage's beam and the effects of the stages add" if staged else "")
              + ". The values are unfactored (load factors belong to the limit states).",)),
        Table(header, tuple(rows)),
    ]
    table_all = effects.by_category()
    for kind in effects.quantities:
        _, words = PERMANENT_KINDS[kind]
        blocks.append(figure_block(lambda ax, k=kind: plot_permanent_effects(effects, k, ax), 2.6,  # type: ignore[misc]
                                   f"{number} Permanent loads: {words}".strip(),
                                   _slug(f"permanent-{number.replace('.', '-')}-{kind}")))
        part = table_all[table_all["quantity"] == kind].drop(columns="quantity")
        unit = _unit(u, kind)
        part = part.rename(columns={"x": f"x [{u.length}]" if u else "x",
                                    **{c: f"{c} [{unit}]" if unit else c for c in effects.categories}})
        if len(effects.categories) > 1:
            part[f"total [{unit}]" if unit else "total"] = table_all.loc[table_all["quantity"] == kind,
                                                                          list(effects.categories)].sum(axis=1)
        blocks += [Para((f"{words.capitalize()}{f' [{unit}]' if unit else ''} by load category:",)),
                   doc_table(part, digits=5)]
    blocks += [Para((note[0].upper() + note[1:],)) for note in effects.notes]
    return blocks


def _unit(u: UnitSystem | None, kind: str) -> str:
    if u is None:
        return ""
    return {"moment": u.moment, "shear": u.force, "reaction": u.force, "deflection": u.length}[kind]


@report_section.register(PermanentEffects)
def _(effects: PermanentEffects, number: str) -> list[Block]:
    return permanent_blocks(effects, number)


@mimebundle.register(PermanentEffects)
def _(effects: PermanentEffects, include: Any = None, exclude: Any = None) -> dict[str, Any]:
    return _html(permanent_blocks(effects))


# ----------------------------------------------------------------- concurrent
def concurrent_blocks(found: ConcurrentForces, number: str = "") -> list[Block]:
    """Concurrent forces as document blocks: moment with shear, shear with moment, reactions, notes."""
    blocks: list[Block] = [
        Heading(f"{number} Concurrent forces{': ' + found.girder if found.girder else ''}".strip(), 3),
        Para(("For every extreme, the actions under the same placement of the same loads, each load with its "
              "factor (dynamic allowance times case factor). Where an axle stands exactly at the section the shear "
              "jumps by its load and both faces are given.",)),
    ]
    for words, frame in (("Bending moment with the concurrent shear:", found.moment_with_shear()),
                         ("Shear with the concurrent moment:", found.shear_with_moment()),
                         ("Concurrent reactions under the placement of each extreme:", found.reactions())):
        if len(frame):
            blocks += [Para((words,)), doc_table(frame, digits=5)]
    blocks += [Para((note[0].upper() + note[1:] + ".",)) for note in found.notes]
    return blocks


@report_section.register(ConcurrentForces)
def _(found: ConcurrentForces, number: str) -> list[Block]:
    return concurrent_blocks(found, number)


@mimebundle.register(ConcurrentForces)
def _(found: ConcurrentForces, include: Any = None, exclude: Any = None) -> dict[str, Any]:
    return _html(concurrent_blocks(found))


# ----------------------------------------------------------------- deflection
def deflection_blocks(check: DeflectionCheck, number: str = "") -> list[Block]:
    """A deflection check as document blocks: the factors with their sources, the drawing, the span table."""
    factors = tuple(
        (f.kind, f.symbol, short(f.value, 4), f"on {', '.join(f.parts)}: in the load values" if f.parts else "×",
         f.source or "given by the user", "from memory: check it" if f.status == "from memory" else f.status)
        for f in check.factors
    )
    model = check.load_model
    blocks: list[Block] = [
        Heading(f"{number} Live-load deflection".strip(), 3),
        Para((f"Load model: {model.name}{f' ({model.source})' if model.source else ''}. The deflections of one "
              f"lane's load are multiplied by the girder's share {short(check.share, 4)}; the factors inside the "
              f"numbers ({check.factors.describe()}):",)),
        Table(("factor", "symbol", "value", "applied", "source", "status"), factors),
        figure_block(lambda ax: plot_deflection_check(check, ax), 2.6,
                     f"{number} Live-load deflection and the allowed deflection of each span".strip(),
                     _slug(f"deflection-{number.replace('.', '-')}")),
        Para((f"Largest deflection of each span and overhang, searched between the sections; the check "
              f"{'passes' if check.passes else 'FAILS'}:",)),
        doc_table(check.spans, digits=5),
    ]
    if model.from_memory:
        blocks += [Para(("Values recalled from memory, to be checked against the standard:",)),
                   Table(("recalled from memory (clause)",), tuple((item,) for item in model.from_memory))]
    return blocks


@report_section.register(DeflectionCheck)
def _(check: DeflectionCheck, number: str) -> list[Block]:
    return deflection_blocks(check, number)


@mimebundle.register(DeflectionCheck)
def _(check: DeflectionCheck, include: Any = None, exclude: Any = None) -> dict[str, Any]:
    return _html(deflection_blocks(check))
