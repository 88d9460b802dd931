"""Critical placement: the largest and smallest effect of a moving load on an influence line.

Every axle train is tried in both travel directions; axles off the beam
contribute nothing.  Breakable uniform loads cover exactly the parts of the
line of the wanted sign; blocks are placed whole.  The search is exact for
piecewise-linear lines (an extreme has a load at a breakpoint, so those
placements are enumerated) and, for curved (piecewise-cubic) lines, finds
the stationary points of the effect in closed form between breakpoints, so
the position is exact to rounding, well within 1e-6 of the span (see
:mod:`ilkit.loads._search`).

Effects follow the sign conventions of :mod:`ilkit.model` (loads act
downward); values are in the line's unit system.
"""

from __future__ import annotations

import functools
from collections.abc import Callable
from dataclasses import dataclass, field
from typing import Literal

import numpy as np

from ilkit._check import choice, finite
from ilkit._exact import fmt
from ilkit.errors import LoadInputError, PlacementTooLargeError, UnitsError
from ilkit.influence import InfluenceLine
from ilkit.loads import _search
from ilkit.loads._chain import best_by_programme
from ilkit.loads.combination import Combination, LoadModel, as_model
from ilkit.loads.primitives import OVERFLOW, AxleTrain, KnifeEdge, Load, UniformBlocks, UniformLoad
from ilkit.loads.results import AxlePosition, Direction, Extreme, Extremes, LoadPlacement, Patch
from ilkit.model import Beam

__all__ = ["place", "extremes"]

Sense = Literal["max", "min"]
_SIDES = {_search.LEFT: "left", _search.RIGHT: "right", _search.EXACT: None}
_TIE = 1e-12
"""Relative difference below which two cases or two placements are a tie (the first found is kept)."""

WORK_LIMIT = 2e8
"""Most ordinate evaluations one placement search may take (a few seconds); more raise
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
    return _Study(line, load, beam).extreme(1 if extreme == "max" else -1)


def extremes(line: InfluenceLine, load: Load | Combination | LoadModel, *, beam: Beam | None = None) -> Extremes:
    """Both the largest and the smallest effect of ``load`` on ``line`` (see :func:`place`).

    Effects are in the line's unit system (force, moment, length or rad, as the quantity) with
    the signs of :mod:`ilkit.model`.
    """
    study = _Study(line, load, beam)
    return Extremes(study.extreme(1), study.extreme(-1))


# ---------------------------------------------------------------------- study
@dataclass
class _Study:
    """One line and one load model, with the searches done so far."""

    line: InfluenceLine
    load: Load | Combination | LoadModel
    beam: Beam | None = None
    model: LoadModel = field(init=False)
    tol: float = field(init=False)
    _parts: dict[int, InfluenceLine] = field(init=False, default_factory=dict)
    _cands: dict[tuple[object, ...], _search.Candidates] = field(init=False, default_factory=dict)
    _effects: dict[tuple[int, int], float] = field(init=False, default_factory=dict)
    _chains: dict[tuple[int, int], tuple[Direction, _search.Split, _search.ChainOptimum]] = field(
        init=False, default_factory=dict
    )

    def __post_init__(self) -> None:
        if not isinstance(self.line, InfluenceLine):
            raise LoadInputError(
                f"expected an InfluenceLine (e.g. beam.moment(12)), got {type(self.line).__name__}.", field="line"
            )
        if self.beam is not None and not isinstance(self.beam, Beam):
            raise LoadInputError(
                f"beam: give the Beam the line belongs to (or leave it out), got {type(self.beam).__name__} "
                f"{self.beam!r}.",
                field="beam",
                value=self.beam,
            )
        model = as_model(self.load)
        if self.line.units is None:
            raise UnitsError(
                f"{self.line.quantity.label}: the beam declares no units, so {model.name} (in "
                f"{model.units.name}) cannot be applied. Declare them: Beam(..., units={model.units.name!r}) "
                "or units='kN-m'.",
                field="units",
            )
        self.model = model.converted(self.line.units)
        self.tol = _search.COINCIDENT * self.line.length

    # -------------------------------------------------------------- lines
    def signed(self, sense: int) -> InfluenceLine:
        """The part of the line that adds to the extreme of ``sense``."""
        if sense not in self._parts:
            self._parts[sense] = self.line.part("positive" if sense > 0 else "negative")
        return self._parts[sense]

    def lines(self, group: _search.Group, drop: bool, sense: int) -> _search.Lines:
        """The lines a group is searched on: the signed part for axles when adverse axles are dropped and
        for breakable uniform loads, the line itself otherwise."""
        axle = self.signed(sense) if drop and group.offsets else self.line
        segments = tuple(self.signed(sense) if s.breakable else self.line for s in group.segments)
        return _search.Lines(axle, segments, self.tol)

    def finder(self, drop: bool, sense: int) -> Callable[[_search.Group], _search.Candidates]:
        """Candidates of a group, searched on the lines it sees (cached)."""

        def find(group: _search.Group) -> _search.Candidates:
            axle_sense = sense if drop and group.offsets else 0
            key = (group, axle_sense, sense if any(s.breakable for s in group.segments) else 0)
            if key not in self._cands:
                self._cands[key] = _search.candidates(group, self.lines(group, drop, sense))
            return self._cands[key]

        return find

    # ------------------------------------------------------------- extremes
    def extreme(self, sense: int) -> Extreme:
        with np.errstate(over="ignore", invalid="ignore"):  # an overflow is reported below, as the effect
            found = self._extreme(sense)
        what = f"the {'largest' if sense > 0 else 'smallest'} effect of {self.model.name} on {self.line.quantity.label}"
        finite(found.value, what=what, why=OVERFLOW, field="load", error=LoadInputError)
        return found

    def _extreme(self, sense: int) -> Extreme:
        cases = [case for case in self.model.cases if self.applies(case, sense)]
        best: tuple[float, Combination] | None = None
        for case in cases:
            total = sum(case.part_factor(part) * self.effect(part, sense) for part in case.parts)
            if best is None or sense * total > sense * best[0] + _TIE * abs(best[0]):
                best = (total, case)
        assert best is not None  # a model always has a case that applies everywhere
        _, case = best
        placements = tuple(self.placement(part, sense, case.part_factor(part)) for part in case.parts)
        # the value is the sum of the table: what each load, as described, adds
        total = float(sum(p.factored for p in placements))
        return Extreme(
            self.line.quantity, "max" if sense > 0 else "min", total, case.name, placements, self.line.units,
            case.dynamic,
        )

    def applies(self, case: Combination, sense: int) -> bool:
        if case.applies_to == "all":
            return True
        q = self.line.quantity
        if q.kind == "moment":
            # negative moment between the points of contraflexure under a uniform load on all spans
            return sense < 0 and self.line.area < 0
        if q.kind == "reaction":
            return sense > 0 and self.interior_support()
        return False

    def interior_support(self) -> bool:
        at = self.line.quantity.at
        if self.beam is not None:
            positions = [s.at for s in self.beam.supports]
            if at not in positions:
                raise LoadInputError(
                    f"{self.line.quantity.label}: the beam given has no support at x={fmt(at)} (supports at "
                    f"x={', '.join(fmt(p) for p in positions)}); pass the beam the line belongs to.",
                    field="beam",
                )
            return positions[0] < at < positions[-1]
        if at == 0 or float(at) == self.line.length:
            return False
        raise LoadInputError(
            f"{self.line.quantity.label}: {self.model.name} treats reactions at interior supports apart; "
            f"pass beam=beam so ilkit can tell whether the support at x={fmt(at)} is interior.",
            field="beam",
        )

    # ------------------------------------------------------------ one load
    def effect(self, part: Load, sense: int) -> float:
        """Unfactored extreme effect of one load (its placement is described only if its case governs)."""
        key = (id(part), sense)
        if key not in self._effects:
            if isinstance(part, UniformLoad):
                area = self.line.positive_area if sense > 0 else self.line.negative_area
                self._effects[key] = part.intensity * area
            else:
                self._effects[key] = self.best_chain(part, sense)[2].value
        return self._effects[key]

    def placement(self, part: Load, sense: int, factor: float) -> LoadPlacement:
        if isinstance(part, UniformLoad):
            patches = self.patches_on_sign(part.intensity, [(-np.inf, np.inf)], sense)
            effect = float(sum(p.effect for p in patches))
            return LoadPlacement(part.name, effect, factor, None, (), (), patches, line=self.line)
        direction, cut, opt = self.best_chain(part, sense)
        drop = isinstance(part, AxleTrain) and part.drop_adverse_axles
        return self.describe(part, direction, cut, opt, sense, drop, factor)

    def best_chain(
        self, load: AxleTrain | UniformBlocks | KnifeEdge, sense: int
    ) -> tuple[Direction, _search.Split, _search.ChainOptimum]:
        """The worst placement of a travelling load, over both directions and every part of it that can be
        on the beam alone."""
        key = (id(load), sense)
        if key not in self._chains:
            find = self.finder(isinstance(load, AxleTrain) and load.drop_adverse_axles, sense)
            best: tuple[Direction, _search.Split, _search.ChainOptimum] | None = None
            drop = isinstance(load, AxleTrain) and load.drop_adverse_axles

            def lines_of(group: _search.Group) -> _search.Lines:
                return self.lines(group, drop, sense)

            for direction, chain in _layouts(load):
                cut = _search.split(chain, self.line.length)
                for index in range(len(cut.parts)):
                    part = cut.part(index)
                    plan = _search.cost(part, lines_of)
                    self.check(load, plan)
                    if plan.patterns:
                        opt = _search.best_in_chain(part, find, sense, self.tol)
                    else:
                        opt = best_by_programme(part, lines_of, sense, self.tol)
                    if best is None or sense * opt.value > sense * best[2].value + _TIE * abs(best[2].value):
                        best = (direction, cut, _search.assemble(cut, index, opt, self.tol))
            assert best is not None
            self._chains[key] = best
        return self._chains[key]

    def check(self, load: AxleTrain | UniformBlocks | KnifeEdge, plan: _search.Cost) -> None:
        """Refuse a search that would take more than :data:`WORK_LIMIT` ordinate evaluations."""
        if plan.work <= WORK_LIMIT:
            return
        raise PlacementTooLargeError(
            f"{load.name} on {self.line.quantity.label}: the search for the worst placement would take about "
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

    def describe(
        self,
        load: AxleTrain | UniformBlocks | KnifeEdge,
        direction: Direction,
        cut: _search.Split,
        opt: _search.ChainOptimum,
        sense: int,
        drop: bool,
        factor: float,
    ) -> LoadPlacement:
        """The placement as a table: every axle at the position the search evaluated, with the ordinate of
        the face it stands on, every loaded stretch, and their sum."""
        line, tol = self.line, self.tol
        standings = opt.standings
        xs = np.concatenate([s.axles() for s in standings])
        sides = np.concatenate([np.full(len(s.block.offsets), s.side) for s in standings])
        if drop:  # the positions the search evaluated on the signed part, moved onto its knots
            xs, _ = _search.snap(self.signed(sense), xs, tol)
        values, xs, faces = _search.ordinates(line, xs, sides, tol)
        lead_last = direction == "left to right"  # the mirrored chain: the lead axle is the rightmost
        order = np.arange(xs.size)[::-1] if lead_last else np.arange(xs.size)
        loads = load.loads if isinstance(load, AxleTrain) else ((load.load,) if isinstance(load, KnifeEdge) else ())
        axles = []
        for number, (k, p) in enumerate(zip(order, loads), start=1):
            x, face, ordinate = float(xs[k]), int(faces[k]), float(values[k])
            on_beam = 0.0 <= x <= line.length and not (
                (face == _search.LEFT and x <= 0.0) or (face == _search.RIGHT and x >= line.length)
            )
            counted = on_beam and (not drop or sense * ordinate > 0)
            axles.append(AxlePosition(number, p, x, _SIDES[face], ordinate, counted))
        patches: list[Patch] = []
        segments = sorted(((s.at(g.start), s.at(g.end), g) for s in standings for g in s.block.segments),
                          key=lambda item: item[0])
        for start, end, seg in segments:
            if seg.breakable:
                patches.extend(self.patches_on_sign(seg.intensity, [(start, end)], sense))
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

    def patches_on_sign(self, intensity: float, spans: list[tuple[float, float]], sense: int) -> tuple[Patch, ...]:
        """Patches of a breakable load limited to ``spans``: the parts of the line of the wanted sign."""
        out = []
        for a, b in self.line.intervals("positive" if sense > 0 else "negative"):
            for lo, hi in spans:
                s, e = max(a, lo), min(b, hi)
                if e > s:
                    out.append(Patch(s, e, intensity, intensity * self.line.integral(s, e)))
        return tuple(out)


@functools.lru_cache(maxsize=256)
def _layouts(load: AxleTrain | UniformBlocks | KnifeEdge) -> tuple[tuple[Direction, _search.Chain], ...]:
    """The load's chain in each travel direction (the lead axle on the right when travelling right)."""
    natural = load.chain()
    if isinstance(load, KnifeEdge):
        return (("left to right", natural),)
    return (("left to right", natural.mirrored()), ("right to left", natural))
