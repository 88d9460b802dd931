"""Factored envelopes, distribution to a girder and limit states in the calculation record.

Registers, for the results of :mod:`ilkit.design` (factored envelopes, distributions, limit states,
lane placements and transverse lines, a girder's live load and its envelope):

* :func:`ilkit.views.table` (and so CSV, Excel and LaTeX export): each one's ``to_frame()`` (a girder's live
  load: its factors per action);
* :func:`ilkit.views.display.mimebundle` and :func:`ilkit.views.report.report_section`: the same document
  blocks, so a display and a sheet section cannot disagree.  The section of a factored envelope lists every
  factor used with its source and status (read, recalled from memory, given by the user) and the caution.

Every number is the core's, rounded for reading (five significant figures for effects, four for factors).
"""

from __future__ import annotations

from typing import TYPE_CHECKING, Any

from ilkit.design.combinations import ANY, LimitState
from ilkit.design.distribution import Distribution
from ilkit.design.factored import QUANTITIES, FactoredEnvelope
from ilkit.design.factors import Factor
from ilkit.design.live import GirderLiveLoad, LiveEnvelope
from ilkit.design.transverse import LanePlacement, TransverseLine
from ilkit.errors import MissingDependencyError
from ilkit.views import style
from ilkit.views._doc import Block, Figure, Heading, Para, Table
from ilkit.views.caution import CAUTION
from ilkit.views.display import mimebundle
from ilkit.views.factored_plots import plot_factored_envelope, plot_transverse
from ilkit.views.moving_records import _html, _slug, figure_block
from ilkit.views.numbers import short
from ilkit.views.report import report_section
from ilkit.views.tables import doc_table, table

if TYPE_CHECKING:  # pragma: no cover
    import pandas as pd

__all__ = ["factored_blocks", "factor_rows", "distribution_blocks", "limit_state_blocks", "lane_blocks",
           "FACTOR_HEADER"]

FACTOR_HEADER = ("where", "factor", "symbol", "value", "applied", "source", "status")
"""The columns of the table of factors of a calculation sheet."""


def _status(f: Factor) -> str:
    return {"from memory": "recalled from memory: check it", "read": "read in the standard",
            "given": "given by the user"}[f.status]


def factor_rows(where: str, factors: Any) -> list[tuple[str, ...]]:
    """One row per factor: where it applies, its kind, symbol, value, what it multiplies, source and status."""
    rows = []
    for f in factors:
        applied = (f"on {', '.join(f.parts)} (in the load values)" if f.parts else "×")
        if f.includes:
            applied += f"; includes {', '.join(f.includes)}"
        if f.note:
            applied += f"; {f.note}"
        rows.append((where, f.kind, f.symbol, short(f.value, 4), applied, f.source or "given by the user",
                     _status(f)))
    return rows


def _used_factors(envelope: FactoredEnvelope) -> tuple[tuple[str, ...], ...]:
    """Every factor of the envelope: each live load's factors per action, each limit state's load factors on
    the live load and on the permanent categories present."""
    rows: list[tuple[str, ...]] = []
    seen: set[int] = set()
    for state in envelope.limit_states:
        live = envelope.live[state.name].live
        if id(live) not in seen:
            seen.add(id(live))
            for action in ("moment", "shear"):
                rows += factor_rows(f"{live.name}, {action}", live.factors(action))  # type: ignore[arg-type]
    categories = envelope.permanent.categories
    for state in envelope.limit_states:
        rows += factor_rows(f"{state.name}, live load", [state.live_factor()])
        for kind, value in state.live_parts.items():
            rows.append((f"{state.name}, live load", "load factor", f"ψ ({kind})", short(value, 4),
                         f"× on the {kind} part", state.source, _status(state.live_factor())))
        for category in categories:
            hi, lo = state.factors_of(category)
            key = category if category in state.permanent else ANY
            rows.append((f"{state.name}, {category}", "load factor", f"γ{category},max / γ{category},min",
                         f"{short(hi, 4)} / {short(lo, 4)}", "by sign of the category's effect"
                         + ("" if key == category else " (the limit state's factor for other categories)"),
                         state.source or "given by the user",
                         "recalled from memory: check it" if state.from_memory else
                         ("read in the standard" if state.source else "given by the user")))
    return tuple(rows)


def _figure(envelope: FactoredEnvelope, quantity: str, number: str) -> Block:
    words = {"moment": "bending moment", "shear": "shear", "reaction": "reactions"}[quantity]
    try:
        with style.context():
            fig = style.new_figure(5.2)
            plot_factored_envelope(envelope, quantity, axes=fig.subplots(2, 1, sharex=True))  # type: ignore[arg-type]
    except MissingDependencyError as err:
        return Para((str(err),))
    return Figure(style.figure_svg(fig), f"{number} Factored {words} with the unfactored components".strip(),
                  _slug(f"factored-{number.replace('.', '-')}-{quantity}"))


def factored_blocks(envelope: FactoredEnvelope, number: str = "") -> list[Block]:
    """A factored envelope as document blocks: the rule, every factor with its source and status, the caution,
    drawings and tables of each quantity, the governing limit state and live-load case, notes."""
    u = envelope.units
    names = ", ".join(s.name for s in envelope.limit_states)
    lives = "; ".join(dict.fromkeys(envelope.live[s.name].live.name for s in envelope.limit_states))
    blocks: list[Block] = [
        Heading(f"{number} Factored envelopes: {lives}".strip(), 3),
        Para((f"Limit states: {names}. At every section the largest value is Σ γ P over the permanent load "
              "categories, with γmax where the category's effect adds to it and γmin where it relieves it, plus "
              "γLL times the girder's largest live-load effect where that adds; the smallest value likewise. The "
              "live-load effect is one lane's exact extreme with its dynamic effect, times the girder's share "
              "(lanes, multiple presence and distribution, each applied once).",)),
        Para(("Every factor in these numbers, its source and its status:",)),
        Table(FACTOR_HEADER, _used_factors(envelope)),
        Para((CAUTION + " Values marked as recalled from memory must be checked against the licensed current "
              "edition of the standard before the results are relied on.",)),
    ]
    for quantity in QUANTITIES:
        unit = (u.moment if quantity == "moment" else u.force) if u else ""
        wide = envelope.table(quantity)
        rename = {"x": f"x [{u.length}]" if u else "x", **{c: f"{c} [{unit}]" for c in wide.columns
                                                           if c.endswith((" max", " min")) and unit}}
        blocks += [_figure(envelope, quantity, number),
                   Para((f"Factored {quantity}{f' [{unit}]' if unit else ''} at the sections:",)),
                   doc_table(wide.rename(columns=rename), digits=5)]
    strength = [s.name for s in envelope.limit_states if s.name.startswith(("Strength", "ULS"))]
    governing = envelope.governing(strength or None)
    blocks += [Para((f"The governing limit state{' among ' + ', '.join(strength) if strength else ''} and "
                     "live-load case at each section:",)),
               doc_table(governing, digits=5)]
    blocks += [Para((note,)) for note in envelope.notes]
    return blocks


def distribution_blocks(distribution: Distribution, number: str = "") -> list[Block]:
    """A distribution as document blocks: how each factor was found and the factors with their sources."""
    factors = [distribution.moment, distribution.shear]
    if distribution.deflection is not None:
        factors.append(distribution.deflection)
    blocks: list[Block] = [
        Heading(f"{number} Distribution to {distribution.girder}".strip(), 3),
        Para((f"Method: {distribution.method}. Each factor is the girder's share of one lane's load, in lanes:",)),
        doc_table(distribution.to_frame(), digits=4),
    ]
    if distribution.checks:
        blocks += [Para(("Every parameter within the range of applicability of the formulas:",)),
                   doc_table(distribution.ranges(), digits=6)]
    return [*blocks, Table(FACTOR_HEADER, tuple(factor_rows(distribution.girder, factors)))]


def limit_state_blocks(state: LimitState, number: str = "") -> list[Block]:
    """A limit state as document blocks: its factors, source, status and notes."""
    status = "recalled from memory: check it" if state.from_memory else ("read" if state.source else "user's")
    dynamic = (f"{short(100 * state.dynamic_allowance, 4)} %" if state.dynamic_allowance is not None
               else "as in the load model")
    return [
        Heading(f"{number} Limit state: {state.name}".strip(), 3),
        Para((f"Source: {state.source or 'given by the user'} ({status}). Dynamic allowance: {dynamic}; multiple "
              f"presence {'applies' if state.multiple_presence else 'does not apply'}."
              + (f" {state.notes}." if state.notes else ""),)),
        doc_table(state.to_frame(), digits=4),
    ]


def lane_blocks(placement: LanePlacement, number: str = "") -> list[Block]:
    """A lane placement as document blocks: the drawing, the lanes and wheel lines, the trials, the factor."""
    line = placement.line
    trials = tuple((str(n), short(raw, 4), short(total, 4), "yes" if n == placement.loaded else "")
                   for n, raw, total in placement.trials)
    return [
        Heading(f"{number} Lanes across the deck: girder {line.girder}".strip(), 3),
        figure_block(lambda ax: plot_transverse(placement, ax), 2.8,
                     f"{number} Girder {line.girder}: transverse line and lanes".strip(),
                     _slug(f"lanes-{number.replace('.', '-')}-girder-{line.girder}")),
        Para((f"{line.method.capitalize()}; {placement.note}; lanes {short(placement.design_lanes.width, 4)} "
              f"{line.section.units.length} wide ({placement.design_lanes.source}).",)),
        doc_table(placement.to_frame(), digits=4),
        Table(("loaded lanes", "share", "with m", "governs"), trials, "rrrl"),
        Table(FACTOR_HEADER, tuple(factor_rows(f"girder {line.girder}", [placement.factor]))),
    ]


def _live_blocks(live: GirderLiveLoad) -> list[Block]:
    rows = []
    for action in ("moment", "shear", "deflection"):
        try:
            rows += factor_rows(f"{live.name}, {action}", live.factors(action))  # type: ignore[arg-type]
        except ValueError:
            continue
    return [Heading(f"Live load of a girder: {live.name}", 3), Table(FACTOR_HEADER, tuple(rows))]


def _live_frame(live: GirderLiveLoad) -> pd.DataFrame:
    import pandas as pd

    rows = []
    for action in ("moment", "shear", "deflection"):
        try:
            record = live.factors(action)  # type: ignore[arg-type]
        except ValueError:
            continue
        for f in record:
            rows.append({"action": action, "kind": f.kind, "symbol": f.symbol, "value": f.value,
                         "parts": ", ".join(f.parts), "source": f.source, "status": f.status})
    return pd.DataFrame(rows)


# ------------------------------------------------------------ registrations
@table.register(FactoredEnvelope)
@table.register(Distribution)
@table.register(LimitState)
@table.register(LanePlacement)
@table.register(TransverseLine)
@table.register(LiveEnvelope)
def _(result: Any) -> pd.DataFrame:
    return result.to_frame()


@table.register(GirderLiveLoad)
def _(live: GirderLiveLoad) -> pd.DataFrame:
    return _live_frame(live)


_BLOCKS = {
    FactoredEnvelope: factored_blocks,
    Distribution: distribution_blocks,
    LimitState: limit_state_blocks,
    LanePlacement: lane_blocks,
}
for _kind, _make in _BLOCKS.items():
    report_section.register(_kind)(lambda result, number, make=_make: make(result, number))
    mimebundle.register(_kind)(lambda result, include=None, exclude=None, make=_make: _html(make(result)))


@report_section.register(GirderLiveLoad)
def _(live: GirderLiveLoad, number: str) -> list[Block]:
    blocks = _live_blocks(live)
    blocks[0] = Heading(f"{number} {blocks[0].text}".strip(), 3)  # type: ignore[union-attr]
    return blocks


@mimebundle.register(GirderLiveLoad)
def _(live: GirderLiveLoad, include: Any = None, exclude: Any = None) -> dict[str, Any]:
    return _html(_live_blocks(live))


@mimebundle.register(TransverseLine)
def _(line: TransverseLine, include: Any = None, exclude: Any = None) -> dict[str, Any]:
    return _html([Heading(f"Transverse line of girder {line.girder}", 3),
                  figure_block(lambda ax: plot_transverse(line, ax), 2.6, "transverse line", "transverse"),
                  doc_table(line.to_frame(), digits=4)])


@mimebundle.register(LiveEnvelope)
def _(env: LiveEnvelope, include: Any = None, exclude: Any = None) -> dict[str, Any]:
    return _html([Heading(f"Live-load envelope of a girder: {env.live.name}", 3),
                  Para((f"One lane's extremes times the girder's share: {env.live.factors('moment').describe()} "
                        f"(moment), {env.live.factors('shear').describe()} (shear and reactions).",)),
                  doc_table(env.frame, digits=5)])

