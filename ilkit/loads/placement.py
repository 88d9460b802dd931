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
from ilkit.errors import LoadInputError, UnitsError
from ilkit.influence import InfluenceLine
from ilkit.loads import _search
from ilkit.loads.combination import Combination, LoadModel, as_model
from ilkit.loads.primitives import OVERFLOW, AxleTrain, KnifeEdge, Load, UniformBlocks, UniformLoad
from ilkit.loads.results import AxlePosition, Direction, Extreme, Extremes, LoadPlacement, Patch
from ilkit.model import Beam

__all__ = ["place", "extremes"]

Sense = Literal["max", "min"]
_SIDES = {_search.LEFT: "left", _search.RIGHT: "right", _search.EXACT: None}


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
    _parts: dict[int, InfluenceLine] = field(init=False, default_factory=dict)
    _cands: dict[tuple[object, ...], _search.Candidates] = field(init=False, default_factory=dict)
    _effects: dict[tuple[int, int], float] = field(init=False, default_factory=dict)
    _chains: dict[tuple[int, int], tuple[Direction, _search.Chain, _search.ChainOptimum]] = field(
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

    # -------------------------------------------------------------- lines
    def signed(self, sense: int) -> InfluenceLine:
        """The part of the line that adds to the extreme of ``sense``."""
        if sense not in self._parts:
            self._parts[sense] = self.line.part("positive" if sense > 0 else "negative")
        return self._parts[sense]

    def _key(self, group: _search.Group, drop: bool, sense: int) -> tuple[_search.Group, int, int]:
        # the axles see the signed line when adverse axles are dropped; breakable segments always do
        axle_key = sense if drop and group.offsets else 0
        seg_key = sense if any(s.breakable for s in group.segments) else 0
        return (group, axle_key, seg_key)

    def prefetch(self, wanted: list[tuple[_search.Group, bool]], sense: int) -> None:
        """Search many groups at once: one vectorised pass per set of lines they see."""
        batches: dict[tuple[int, int], dict[_search.Group, None]] = {}
        for group, drop in wanted:
            key = self._key(group, drop, sense)
            if key not in self._cands:
                batches.setdefault(key[1:], {})[group] = None
        for (axle_key, seg_key), groups in batches.items():
            axle_line = self.signed(sense) if axle_key else self.line
            seg_lines = tuple(
                tuple(self.signed(sense) if seg_key and s.breakable else self.line for s in g.segments) for g in groups
            )
            for group, found in zip(groups, _search.candidates_of_groups(tuple(groups), axle_line, seg_lines)):
                self._cands[(group, axle_key, seg_key)] = found

    def finder(self, drop: bool, sense: int) -> Callable[[_search.Group], _search.Candidates]:
        """Candidates of a group, searched on the lines it sees."""

        def find(group: _search.Group) -> _search.Candidates:
            key = self._key(group, drop, sense)
            if key not in self._cands:
                self.prefetch([(group, drop)], sense)
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
        wanted = [
            (block, isinstance(part, AxleTrain) and part.drop_adverse_axles)
            for case in cases
            for part in case.parts
            if not isinstance(part, UniformLoad)
            for _, chain in _layouts(part)
            for pattern in _search.patterns(chain)
            for block in pattern.blocks
        ]
        self.prefetch(wanted, sense)
        best: tuple[float, Combination] | None = None
        for case in cases:
            total = sum(case.part_factor(part) * self.effect(part, sense) for part in case.parts)
            if best is None or sense * total > sense * best[0] + 1e-12 * max(1.0, abs(best[0])):
                best = (total, case)
        assert best is not None  # a model always has a case that applies everywhere
        total, case = best
        placements = tuple(self.placement(part, sense, case.part_factor(part)) for part in case.parts)
        return Extreme(
            self.line.quantity, "max" if sense > 0 else "min", float(total), case.name, placements, self.line.units
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
            return LoadPlacement(part.name, self.effect(part, sense), factor, None, (), (), patches, line=self.line)
        direction, chain, opt = self.best_chain(part, sense)
        drop = isinstance(part, AxleTrain) and part.drop_adverse_axles
        return self.describe(part, None if isinstance(part, KnifeEdge) else direction, chain, opt, sense, drop, factor)

    def best_chain(
        self, load: AxleTrain | UniformBlocks | KnifeEdge, sense: int
    ) -> tuple[Direction, _search.Chain, _search.ChainOptimum]:
        key = (id(load), sense)
        if key not in self._chains:
            find = self.finder(isinstance(load, AxleTrain) and load.drop_adverse_axles, sense)
            best: tuple[Direction, _search.Chain, _search.ChainOptimum] | None = None
            for direction, chain in _layouts(load):
                opt = _search.best_in_chain(chain, find, sense)
                if best is None or sense * opt.value > sense * best[2].value + 1e-12 * max(1.0, abs(best[2].value)):
                    best = (direction, chain, opt)
            assert best is not None
            self._chains[key] = best
        return self._chains[key]

    def describe(
        self,
        load: AxleTrain | UniformBlocks | KnifeEdge,
        direction: Direction | None,
        chain: _search.Chain,
        opt: _search.ChainOptimum,
        sense: int,
        drop: bool,
        factor: float,
    ) -> LoadPlacement:
        line = self.line
        xs: list[float] = []
        sides: list[int] = []
        segments: list[tuple[float, float, _search.Segment]] = []
        for group, y, side in zip(chain.groups, opt.positions, opt.sides):
            xs.extend(y + a for a in group.offsets)
            sides.extend(side for _ in group.offsets)
            segments.extend((y + s.start, y + s.end, s) for s in group.segments)
        if direction == "left to right":  # the lead axle is the rightmost
            xs.reverse()
            sides.reverse()
        loads = load.loads if isinstance(load, AxleTrain) else ((load.load,) if isinstance(load, KnifeEdge) else ())
        axles = []
        for number, (x, side, p) in enumerate(zip(xs, sides, loads), start=1):
            if side == _search.LEFT:
                ordinate = float(line.left(x))
            elif side == _search.RIGHT:
                ordinate = float(line.right(x))
            else:
                ordinate = float(line(x))
            on_beam = 0.0 <= x <= line.length and not (
                (side == _search.LEFT and x <= 0.0) or (side == _search.RIGHT and x >= line.length)
            )
            counted = on_beam and (not drop or sense * ordinate > 0)
            axles.append(AxlePosition(number, p, x, _SIDES[side], ordinate, counted))
        spacings = tuple(abs(b - a) for a, b in zip(xs[:-1], xs[1:]))
        patches: list[Patch] = []
        for start, end, seg in sorted(segments, key=lambda s: s[0]):
            if seg.breakable:
                patches.extend(self.patches_on_sign(seg.intensity, [(start, end)], sense))
            else:
                a, b = max(start, 0.0), min(end, line.length)
                if b > a:
                    patches.append(Patch(a, b, seg.intensity, seg.intensity * line.integral(a, b)))
        # the front: offset 0 of the first group when travelling right to left (the natural
        # chain), the far end of the last group of the mirrored chain when travelling left to right
        last = chain.groups[-1]
        front = opt.positions[-1] + last.extent if direction == "left to right" else opt.positions[0]
        return LoadPlacement(
            load.name, opt.value, factor, direction, spacings, tuple(axles), tuple(patches), front, line
        )

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
