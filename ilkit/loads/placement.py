"""Critical placement: the largest and smallest effect of a moving load on an influence line.

Every axle train is tried in both travel directions; axles off the beam
contribute nothing.  Breakable uniform loads cover exactly the parts of the
line of the wanted sign; blocks are placed whole.  The search is exact for
piecewise-linear lines (an extreme has a load at a breakpoint, so those
placements are enumerated) and, for curved (piecewise-cubic) lines, finds
the stationary points of the effect in closed form between breakpoints, so
the position is exact to rounding, well within 1e-6 of the span (see
:mod:`ilkit.loads._search`).

The search runs on many lines at once (:func:`extremes_of`, for envelopes):
the lines are stacked as arrays, and every step (signed parts, candidate
placements of each part of a train, the dynamic programme over varying
spacings, the choice of the governing case) is done for all of them in one
pass.  :func:`place` and :func:`extremes` are the same search on one line.

Effects follow the sign conventions of :mod:`ilkit.model` (loads act
downward); values are in the line's unit system.
"""

from __future__ import annotations

import functools
from collections.abc import Sequence
from typing import Literal

import numpy as np

from ilkit._check import choice, finite
from ilkit._exact import fmt
from ilkit.errors import LoadInputError, PlacementTooLargeError, UnitsError
from ilkit.influence import InfluenceLine
from ilkit.loads import _search
from ilkit.loads._chain import best_by_programme
from ilkit.loads._lines import EXACT, LEFT, RIGHT, LineSet
from ilkit.loads.combination import Combination, LoadModel, as_model
from ilkit.loads.primitives import OVERFLOW, AxleTrain, KnifeEdge, Load, UniformBlocks, UniformLoad
from ilkit.loads.results import AxlePosition, Direction, Extreme, Extremes, LoadPlacement, Patch
from ilkit.model import Beam

__all__ = ["place", "extremes", "extremes_of", "maxima_of"]

Sense = Literal["max", "min"]
Travelling = AxleTrain | UniformBlocks | KnifeEdge
_SIDES = {LEFT: "left", RIGHT: "right", EXACT: None}
_TIE = 1e-12
"""Relative difference below which two cases or two placements are a tie (the first found is kept)."""

WORK_LIMIT = 2e8
"""Most ordinate evaluations one placement search may take on one line (a few seconds); more raise
:class:`~ilkit.PlacementTooLargeError` before any work is done."""


def place(
    line: InfluenceLine,
    load: Load | Combination | LoadModel,
    extreme: Sense = "max",
    *,
    beam: Beam | None = None,
) -> Extreme:
    """The largest (``extreme="max"``) or smallest (``"min"``) effect of ``load`` on ``line``.

    ``load`` may be a primitive load, a :class:`Combination` or a
    :class:`LoadModel` (the governing case is returned).  The load is
    converted to the line's units; a line of a beam without units is an
    error.  ``beam`` is needed only to tell interior supports for cases that
    apply to interior reactions (AASHTO's two-truck rule) when the support is
    not at an end of the beam.
    """
    choice(extreme, ("max", "min"), what="extreme", field="extreme", error=LoadInputError)
    sense = 1 if extreme == "max" else -1
    return _Study.of((_line(line),), (sense,), load, beam).extremes(lazy=False)[0]


def extremes(line: InfluenceLine, load: Load | Combination | LoadModel, *, beam: Beam | None = None) -> Extremes:
    """Both the largest and the smallest effect of ``load`` on ``line`` (see :func:`place`).

    Effects are in the line's unit system (force, moment, length or rad, as the quantity) with
    the signs of :mod:`ilkit.model`.
    """
    found = _Study.of((_line(line),), (1, -1), load, beam).extremes(lazy=False)
    return Extremes(found[0], found[1])


def extremes_of(
    lines: Sequence[InfluenceLine], load: Load | Combination | LoadModel, *, beam: Beam | None = None
) -> list[Extremes]:
    """:func:`extremes` of many lines of one beam, searched together (for envelopes).

    The lines must share their units.  Each extreme describes its placements
    the first time they are asked for.
    """
    found = _Study.of(tuple(_line(line) for line in lines), (1, -1), load, beam).extremes(lazy=True)
    n = len(lines)
    return [Extremes(found[i], found[n + i]) for i in range(n)]


def maxima_of(
    lines: Sequence[InfluenceLine], load: Load | Combination | LoadModel, *, beam: Beam | None = None
) -> list[Extreme]:
    """The largest effect of ``load`` on each of many lines of one beam (see :func:`extremes_of`)."""
    return _Study.of(tuple(_line(line) for line in lines), (1,), load, beam).extremes(lazy=True)


def _line(line: object) -> InfluenceLine:
    if not isinstance(line, InfluenceLine):
        raise LoadInputError(
            f"expected an InfluenceLine (e.g. beam.moment(12)), got {type(line).__name__}.", field="line"
        )
    return line


# ---------------------------------------------------------------------- study
class _Found:
    """The worst placement of one travelling load on every row: ``value[i]``, and the search it came from."""

    def __init__(self, sense: np.ndarray, tol: np.ndarray) -> None:
        self.sense = sense
        self.tol = tol
        self.value = np.full(tol.size, np.nan)
        self.source = np.zeros(tol.size, dtype=int)
        self.sources: list[tuple[Direction, _search.Split, int, object]] = []
        self.inner: _Found | None = None
        self.local = np.arange(tol.size)

    def offer(self, value: np.ndarray, direction: Direction, cut: _search.Split, index: int, result: object) -> None:
        """Keep ``value`` on the rows where it is better than the best so far (ties keep the first)."""
        s = self.sense
        better = np.isnan(self.value) | (s * value > s * self.value + _TIE * np.abs(self.value))
        self.value = np.where(better, value, self.value)
        self.source = np.where(better, len(self.sources), self.source)
        self.sources.append((direction, cut, index, result))

    @classmethod
    def on(cls, found: _Found, rows: np.ndarray, sense: np.ndarray) -> _Found:
        """``found`` (searched on the rows ``rows`` alone) for all the rows (NaN on the others)."""
        out = cls(sense, np.zeros(sense.size))
        out.value[rows] = found.value
        out.local = np.full(sense.size, -1)
        out.local[rows] = np.arange(rows.size)
        out.inner = found
        return out

    @functools.cached_property
    def exact(self) -> np.ndarray:
        """The effect of the placement found on each row, evaluated afresh (the search compares values to
        rounding): one evaluation for the placements found by patterns; the programme's are exact."""
        if self.inner is not None:
            out = np.full(self.value.size, np.nan)
            out[self.local >= 0] = self.inner.exact
            return out
        out = self.value.copy()
        chosen = []
        for k, (_, _, _, result) in enumerate(self.sources):
            if isinstance(result, _search.ChainSearch):
                rows = np.nonzero(self.source == k)[0]
                chosen.extend(result.chosen(rows))
                out[rows] = 0.0
        return out + _search.exact_sum(chosen, self.value.size)

    def optimum(self, i: int) -> tuple[Direction, _search.Split, _search.ChainOptimum]:
        """Direction, split chain and the whole chain placed, on row ``i``."""
        if self.inner is not None:
            return self.inner.optimum(int(self.local[i]))
        direction, cut, index, result = self.sources[int(self.source[i])]
        part = result.optimum(i) if isinstance(result, _search.ChainSearch) else result[i]  # type: ignore[index]
        return direction, cut, _search.assemble(cut, index, part, float(self.tol[i]))


class _Study:
    """Lines of one beam and one load model, with the searches done so far.

    A *row* is a line and a sense (``+1`` for its largest effect, ``-1`` for
    its smallest): the largest and the smallest effect of many lines are
    searched together, row by row.  ``plain`` holds the rows' lines,
    ``signed`` their parts of the row's sign.
    """

    def __init__(
        self,
        lines: tuple[InfluenceLine, ...],
        sense: np.ndarray,
        model: LoadModel,
        beam: Beam | None,
        plain: LineSet,
        signed: LineSet,
    ) -> None:
        self.lines = lines
        self.sense = sense
        self.beam = beam
        self.model = model
        self.plain = plain
        self.signed = signed
        self.tol = plain.tol
        # parts of a train closer than this can stand on a line together: its length, and the tolerance
        # within which a load at an end stands on it (a train as long as the beam to rounding fits on it)
        self.reach = float((plain.length + plain.tol).max())
        self._cands: dict[tuple[object, ...], _search.Candidates] = {}
        self._found: dict[int, _Found] = {}
        self._effects: dict[int, np.ndarray] = {}
        self._parts: dict[bytes, _Study] = {}

    @classmethod
    def of(
        cls,
        lines: tuple[InfluenceLine, ...],
        senses: tuple[int, ...],
        load: Load | Combination | LoadModel,
        beam: Beam | None,
    ) -> _Study:
        """The rows of every line with each of ``senses`` (all the lines with the first, then the second)."""
        if beam is not None and not isinstance(beam, Beam):
            raise LoadInputError(
                f"beam: give the Beam the line belongs to (or leave it out), got {type(beam).__name__} {beam!r}.",
                field="beam",
                value=beam,
            )
        model = as_model(load)
        units = lines[0].units
        if units is None:
            raise UnitsError(
                f"{lines[0].quantity.label}: the beam declares no units, so {model.name} (in "
                f"{model.units.name}) cannot be applied. Declare them: Beam(..., units={model.units.name!r}) "
                "or units='kN-m'.",
                field="units",
            )
        if any(line.units != units for line in lines):
            raise LoadInputError("extremes_of: give lines of one beam (one unit system).", field="lines")
        base = LineSet.of(lines)
        n = len(lines)
        index = np.tile(np.arange(n), len(senses))
        sense = np.repeat(np.array(senses), n)
        plain = base.subset(index)
        signed = LineSet.rows_of((base.signed(1), base.signed(-1)), (sense < 0).astype(int), index)
        return cls(tuple(lines[i] for i in index), sense, model.converted(units), beam, plain, signed)

    # -------------------------------------------------------------- lines
    def lines_for(self, drop: bool) -> _search.Lines:
        """The lines point loads see (the signed parts when adverse axles are dropped), the lines themselves
        and their signed parts."""
        return _search.Lines(self.signed if drop else self.plain, self.plain, self.signed)

    def _key(self, group: _search.Group, drop: bool) -> tuple[object, ...]:
        return (group, drop and bool(group.offsets), any(s.breakable for s in group.segments))

    def prefetch(self, groups: list[_search.Group], drop: bool) -> None:
        """Search many groups in one pass over all the rows."""
        wanted = {g: None for g in groups if self._key(g, drop) not in self._cands}
        if wanted:
            found = _search.candidates_of_groups(tuple(wanted), self.lines_for(drop))
            for group, cands in zip(wanted, found):
                self._cands[self._key(group, drop)] = cands

    def finder(self, drop: bool):
        def find(group: _search.Group) -> _search.Candidates:
            key = self._key(group, drop)
            if key not in self._cands:
                self.prefetch([group], drop)
            return self._cands[key]

        return find

    # ------------------------------------------------------------ extremes
    def extremes(self, *, lazy: bool) -> list[Extreme]:
        """The extreme of every row (placements described now, or when first asked for)."""
        with np.errstate(over="ignore", invalid="ignore"):  # an overflow is reported below, as the effect
            case = self._governing()
            total = self._exact_totals(case)
        out = []
        for i, line in enumerate(self.lines):
            sense = int(self.sense[i])
            if not np.isfinite(total[i]):
                largest = "largest" if sense > 0 else "smallest"
                what = f"the {largest} effect of {self.model.name} on {line.quantity.label}"
                finite(float(total[i]), what=what, why=OVERFLOW, field="load", error=LoadInputError)
            governing = self.model.cases[int(case[i])]
            describe = functools.partial(self.describe_case, i, governing)
            placements = describe if lazy else describe()
            # the exact effect of the placement found (its table adds up to it, to rounding); the same on one
            # line and among many
            extreme = "max" if sense > 0 else "min"
            out.append(Extreme(line.quantity, extreme, float(total[i]), governing.name, placements, line.units,
                               governing.dynamic))
        return out

    def _governing(self) -> np.ndarray:
        """Which case governs on each row.

        A load is searched only on the rows where a case holding it applies
        (the two-truck rule, for one, on few of them).
        """
        n = self.plain.size
        cases = self.model.cases
        applies = [self.applies(case) for case in cases]
        needed: dict[int, np.ndarray] = {}
        for case, where in zip(cases, applies):
            for part in case.parts:
                needed[id(part)] = needed.get(id(part), np.zeros(n, dtype=bool)) | where
        self.prefetch_loads([p for c in cases for p in c.parts if needed[id(p)].all()])
        best = np.full(n, np.nan)
        which = np.zeros(n, dtype=int)
        s = self.sense
        for k, (case, where) in enumerate(zip(cases, applies)):
            if not where.any():
                continue
            total = sum(case.part_factor(part) * self.effect(part, needed[id(part)]) for part in case.parts)
            better = where & (np.isnan(best) | (s * total > s * best + _TIE * np.abs(best)))
            best = np.where(better, total, best)
            which = np.where(better, k, which)
        return which

    def _exact_totals(self, case: np.ndarray) -> np.ndarray:
        """The total of each row's governing case with each load where the search placed it, evaluated
        afresh (the choices were made on the search's values, to rounding)."""
        total = np.full(self.plain.size, np.nan)
        for k, combination in enumerate(self.model.cases):
            rows = case == k
            if not rows.any():
                continue
            parts = []
            for part in combination.parts:
                effect = self.effect(part) if isinstance(part, UniformLoad) else self.search(part).exact
                parts.append(combination.part_factor(part) * effect)
            total = np.where(rows, sum(parts), total)
        return total

    def prefetch_loads(self, loads: list[Load]) -> None:
        """Candidates of every group of the travelling ``loads`` searched by patterns, in one pass per kind."""
        by_drop: dict[bool, list[_search.Group]] = {}
        for part in loads:
            if isinstance(part, UniformLoad):
                continue
            drop = isinstance(part, AxleTrain) and part.drop_adverse_axles
            for _, chain in _layouts(part):
                cut = _search.split(chain, self.reach)
                for index in range(len(cut.parts)):
                    sub = cut.part(index)
                    if sub.variable <= _search.PATTERN_GAPS and _search.cost(sub, self.lines_for(drop)).patterns:
                        for pattern in _search.patterns(sub):
                            by_drop.setdefault(drop, []).extend(pattern.blocks)
        for drop, groups in by_drop.items():
            self.prefetch(groups, drop)

    def on(self, rows: np.ndarray) -> _Study:
        """The same study on the rows ``rows`` only (cached)."""
        key = rows.tobytes()
        if key not in self._parts:
            lines = tuple(self.lines[i] for i in rows)
            self._parts[key] = _Study(
                lines, self.sense[rows], self.model, self.beam, self.plain.subset(rows), self.signed.subset(rows)
            )
        return self._parts[key]

    def applies(self, case: Combination) -> np.ndarray:
        """On which rows ``case`` is considered."""
        n = self.plain.size
        if case.applies_to == "all":
            return np.ones(n, dtype=bool)
        out = np.zeros(n, dtype=bool)
        for i, line in enumerate(self.lines):
            kind = line.quantity.kind
            if kind == "moment":
                # negative moment between the points of contraflexure under a uniform load on all spans
                out[i] = self.sense[i] < 0 and self.plain.area[i] < 0
            elif kind == "reaction":
                out[i] = self.sense[i] > 0 and self.interior_support(line)
        return out

    def interior_support(self, line: InfluenceLine) -> bool:
        at = line.quantity.at
        if self.beam is not None:
            positions = [s.at for s in self.beam.supports]
            if at not in positions:
                raise LoadInputError(
                    f"{line.quantity.label}: the beam given has no support at x={fmt(at)} (supports at "
                    f"x={', '.join(fmt(p) for p in positions)}); pass the beam the line belongs to.",
                    field="beam",
                )
            return positions[0] < at < positions[-1]
        if at == 0 or float(at) == line.length:
            return False
        raise LoadInputError(
            f"{line.quantity.label}: {self.model.name} treats reactions at interior supports apart; "
            f"pass beam=beam so ilkit can tell whether the support at x={fmt(at)} is interior.",
            field="beam",
        )

    # ------------------------------------------------------------ one load
    def effect(self, part: Load, where: np.ndarray | None = None) -> np.ndarray:
        """Unfactored extreme effect of one load on the rows ``where`` (all if not given; NaN elsewhere)."""
        key = id(part)
        if key not in self._effects:
            if isinstance(part, UniformLoad):  # on the parts of the row's sign: the signed line's area
                self._effects[key] = part.intensity * self.signed.area
            else:
                self._effects[key] = self.search(part, where).value
        return self._effects[key]

    def search(self, load: Travelling, where: np.ndarray | None = None) -> _Found:
        """The worst placement of a travelling load on the rows ``where`` (all if not given), over both
        directions and every part of it that can be on the beam alone."""
        key = id(load)
        if key not in self._found and where is not None and not where.all():
            rows = np.nonzero(where)[0]
            sub = self.on(rows)
            sub.prefetch_loads([load])
            self._found[key] = _Found.on(sub.search(load), rows, self.sense)
        if key not in self._found:
            drop = isinstance(load, AxleTrain) and load.drop_adverse_axles
            lines = self.lines_for(drop)
            found = _Found(self.sense, self.tol)
            find = self.finder(drop)
            for direction, chain in _layouts(load):
                cut = _search.split(chain, self.reach)
                for index in range(len(cut.parts)):
                    part = cut.part(index)
                    plan = _search.cost(part, lines)
                    self.check(load, plan)
                    if plan.patterns:
                        result = _search.best_in_chain(part, find, self.sense, self.tol)
                        found.offer(result.value, direction, cut, index, result)
                    else:
                        optima = [
                            best_by_programme(part, lines.row(i), int(self.sense[i])) for i in range(self.plain.size)
                        ]
                        found.offer(np.array([o.value for o in optima]), direction, cut, index, optima)
            self._found[key] = found
        return self._found[key]

    def check(self, load: Travelling, plan: _search.Cost) -> None:
        """Refuse a search that would take more than :data:`WORK_LIMIT` ordinate evaluations on a line."""
        if plan.work <= WORK_LIMIT:
            return
        raise PlacementTooLargeError(
            f"{load.name} on {self.lines[0].quantity.label}: the search for the worst placement would take about "
            f"{plan.work:.3g} ordinate evaluations ({plan.axles} axles, up to {plan.on_beam} on the beam at "
            f"once, {plan.variable} varying spacings, {plan.breakpoints} breakpoints of the line), more than "
            f"the limit of {WORK_LIMIT:.3g}. Give fewer axles (e.g. an equivalent uniform load for a long "
            "train), fix some spacings, or raise ilkit.loads.placement.WORK_LIMIT if the time and memory "
            "are available.",
            work=plan.work,
            limit=WORK_LIMIT,
            axles=plan.axles,
            variable=plan.variable,
            breakpoints=plan.breakpoints,
            on_beam=plan.on_beam,
        )

    # ------------------------------------------------------------ description
    def describe_case(self, i: int, case: Combination) -> tuple[LoadPlacement, ...]:
        """Where each load of ``case`` stands on row ``i``."""
        with np.errstate(over="ignore", invalid="ignore"):
            return tuple(self.placement(i, part, case.part_factor(part)) for part in case.parts)

    def placement(self, i: int, part: Load, factor: float) -> LoadPlacement:
        line = self.lines[i]
        if isinstance(part, UniformLoad):
            patches = self.patches_on_sign(i, part.intensity, [(-np.inf, np.inf)])
            effect = float(sum(p.effect for p in patches))
            return LoadPlacement(part.name, effect, factor, None, (), (), patches, line=line)
        direction, cut, opt = self.search(part).optimum(i)
        drop = isinstance(part, AxleTrain) and part.drop_adverse_axles
        return self.describe(i, part, direction, cut, opt, drop, factor)

    def describe(
        self,
        i: int,
        load: Travelling,
        direction: Direction,
        cut: _search.Split,
        opt: _search.ChainOptimum,
        drop: bool,
        factor: float,
    ) -> LoadPlacement:
        """The placement as a table: every axle at the position the search evaluated, with the ordinate of
        the face it stands on, every loaded stretch, and their sum."""
        line = self.lines[i]
        sense = int(self.sense[i])
        standings = opt.standings
        xs = np.concatenate([s.axles() for s in standings])
        sides = np.concatenate([np.full(len(s.block.offsets), s.side) for s in standings])
        rows = np.full(xs.size, i)
        if drop:  # the positions the search evaluated on the signed part, moved onto its knots
            xs, _ = self.signed.snap(rows, xs)
        values, xs, faces = self.plain.ordinates(rows, xs, sides)
        lead_last = direction == "left to right"  # the mirrored chain: the lead axle is the rightmost
        order = np.arange(xs.size)[::-1] if lead_last else np.arange(xs.size)
        loads = load.loads if isinstance(load, AxleTrain) else ((load.load,) if isinstance(load, KnifeEdge) else ())
        axles = []
        for number, (k, p) in enumerate(zip(order, loads), start=1):
            x, face, ordinate = float(xs[k]), int(faces[k]), float(values[k])
            on_beam = 0.0 <= x <= line.length and not (
                (face == LEFT and x <= 0.0) or (face == RIGHT and x >= line.length)
            )
            counted = on_beam and (not drop or sense * ordinate > 0)
            axles.append(AxlePosition(number, p, x, _SIDES[face], ordinate, counted))
        patches: list[Patch] = []
        segments = sorted(
            ((s.at(g.start), s.at(g.end), g) for s in standings for g in s.block.segments), key=lambda item: item[0]
        )
        for start, end, seg in segments:
            if seg.breakable:
                patches.extend(self.patches_on_sign(i, seg.intensity, [(start, end)]))
            else:
                a, b = max(start, 0.0), min(end, line.length)
                if b > a:
                    patches.append(Patch(a, b, seg.intensity, seg.intensity * line.integral(a, b)))
        spacings: tuple[float, ...] = ()
        if isinstance(load, AxleTrain):
            chosen = iter(reversed(opt.gaps) if lead_last else opt.gaps)
            spacings = tuple(lo if lo == hi else next(chosen) for lo, hi in load.spacings)
        # the front: offset 0 of the first group when travelling right to left (the natural chain), the
        # far end of the last group of the mirrored chain when travelling left to right
        groups = cut.chain.groups
        head, tail = standings[0], standings[-1]
        front = (
            tail.at(tail.members[-1][1] + groups[tail.members[-1][0]].extent)
            if lead_last
            else head.at(head.members[0][1])
        )
        effect = float(sum(a.effect for a in axles) + sum(p.effect for p in patches))
        shown = None if isinstance(load, KnifeEdge) else direction
        return LoadPlacement(load.name, effect, factor, shown, spacings, tuple(axles), tuple(patches), front, line)

    def patches_on_sign(self, i: int, intensity: float, spans: list[tuple[float, float]]) -> tuple[Patch, ...]:
        """Patches of a breakable load limited to ``spans``: the parts of the line of the row's sign."""
        line = self.lines[i]
        out = []
        for a, b in self.signed.intervals(i):
            for lo, hi in spans:
                s, e = max(a, lo), min(b, hi)
                if e > s:
                    out.append(Patch(s, e, intensity, intensity * line.integral(s, e)))
        return tuple(out)


def _layouts(load: Travelling) -> tuple[tuple[Direction, _search.Chain], ...]:
    """The load's chain in each travel direction (the lead axle on the right when travelling right), kept
    with the load."""
    found = load.__dict__.get("_layouts")
    if found is None:
        natural = load.chain()
        if isinstance(load, KnifeEdge):
            found = (("left to right", natural),)
        else:
            found = (("left to right", natural.mirrored()), ("right to left", natural))
        load.__dict__["_layouts"] = found
    return found
