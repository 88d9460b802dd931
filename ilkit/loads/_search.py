"""The search behind critical placement (internal).

A *group* is a set of loads that move together: point loads at fixed offsets
and uniform segments at fixed offsets (a segment may run to ``±inf``).  Its
effect on a line, as a function of the position ``y`` of the group, is a
piecewise polynomial whose pieces change only at *events*: positions where a
point load or a segment end crosses a knot of the line.  Between two events
every term is one polynomial, so the extreme is either the value at an event
(both one-sided limits where the line jumps) or a stationary point inside an
interval.  The stationary points are found from the derivative, which is
fitted exactly (it is a polynomial of known degree) at interior Chebyshev
nodes and solved by :func:`ilkit._poly.unit_roots`.  For
piecewise-linear lines and point loads the derivative is constant between
events and only events remain: the classic rule that an extreme has a load at
a breakpoint.  The result is exact to rounding for lines of any degree.

A *chain* is a series of groups separated by gaps that may vary within
``[lo, hi]`` (``hi`` may be ``inf``): a truck with a variable axle spacing, two
trucks at least a given distance apart.  The objective is a sum of one
function per group and the constraints only bind neighbours, so at the
optimum each gap is either at a bound (the neighbours move as one group) or
free (each group sits at one of its own candidates).  Every pattern of tied
and free gaps is searched, the free ones by dynamic programming over the
candidates.
"""

from __future__ import annotations

import functools
import itertools
from collections.abc import Callable
from dataclasses import dataclass
from typing import TYPE_CHECKING

import numpy as np

from ilkit._poly import unit_roots

if TYPE_CHECKING:  # pragma: no cover
    from ilkit.influence import InfluenceLine

__all__ = [
    "Segment",
    "Group",
    "Chain",
    "Candidates",
    "ChainOptimum",
    "Pattern",
    "candidates",
    "patterns",
    "best_in_chain",
]

LEFT, EXACT, RIGHT = -1, 0, 1


@dataclass(frozen=True)
class Segment:
    """A uniform load of ``intensity`` from offset ``start`` to ``end`` (``±inf`` allowed)."""

    start: float
    end: float
    intensity: float
    breakable: bool = False


@dataclass(frozen=True)
class Group:
    """Loads that move together.

    ``offsets`` of the point loads are ascending; the group's position is the
    position of offset 0.  ``extent`` is the offset of the last point load.
    """

    offsets: tuple[float, ...]
    loads: tuple[float, ...]
    segments: tuple[Segment, ...] = ()

    @property
    def extent(self) -> float:
        return self.offsets[-1] if self.offsets else 0.0

    def mirrored(self) -> Group:
        """The group seen from the other end (offsets measured the other way)."""
        e = self.extent
        return Group(
            tuple(e - a for a in reversed(self.offsets)),
            tuple(reversed(self.loads)),
            tuple(Segment(e - s.end, e - s.start, s.intensity, s.breakable) for s in self.segments),
        )

    def joined(self, other: Group, gap: float) -> Group:
        """This group followed by ``other`` with ``gap`` from its last point load to ``other``'s first."""
        shift = self.extent + gap
        return Group(
            self.offsets + tuple(shift + a for a in other.offsets),
            self.loads + other.loads,
            self.segments
            + tuple(Segment(shift + s.start, shift + s.end, s.intensity, s.breakable) for s in other.segments),
        )


@dataclass(frozen=True)
class Chain:
    """Groups in order along the beam, with the gap ``(lo, hi)`` after each group but the last."""

    groups: tuple[Group, ...]
    gaps: tuple[tuple[float, float], ...] = ()

    def mirrored(self) -> Chain:
        return Chain(tuple(g.mirrored() for g in reversed(self.groups)), tuple(reversed(self.gaps)))


@dataclass(frozen=True)
class Candidates:
    """Positions ``y`` of a group worth checking, the side of the limit taken and the effect there.

    ``jumps`` is True when some candidate is a one-sided limit.
    """

    y: np.ndarray
    side: np.ndarray
    value: np.ndarray
    jumps: bool = False


@dataclass(frozen=True)
class ChainOptimum:
    """Best placement of a chain: value, position and side of every group, the gaps used."""

    value: float
    positions: tuple[float, ...]
    sides: tuple[int, ...]
    gaps: tuple[float, ...]


# ----------------------------------------------------------------- groups
@dataclass(frozen=True)
class _Batch:
    """Groups searched together on the same lines: their point loads padded to one width."""

    groups: tuple[Group, ...]
    axle_line: InfluenceLine
    seg_lines: tuple[tuple[InfluenceLine, ...], ...]
    offsets: np.ndarray  # (groups, widest) offsets, 0 where padded
    loads: np.ndarray  # (groups, widest) loads, 0 where padded

    @classmethod
    def of(cls, groups, axle_line, seg_lines) -> _Batch:
        width = max(len(g.offsets) for g in groups)
        offsets = np.zeros((len(groups), width))
        loads = np.zeros((len(groups), width))
        for k, g in enumerate(groups):
            offsets[k, : len(g.offsets)] = g.offsets
            loads[k, : len(g.loads)] = g.loads
        return cls(tuple(groups), axle_line, tuple(seg_lines), offsets, loads)

    def _spread(self, table: np.ndarray, gi: np.ndarray, y: np.ndarray) -> np.ndarray:
        return table[gi].reshape(gi.shape + (1,) * (y.ndim - 1) + (table.shape[1],))

    def effect(self, y: np.ndarray, gi: np.ndarray, side: int) -> np.ndarray:
        """Effect of group ``gi[i]`` at position ``y[i]`` (``y`` may have a further axis)."""
        total = np.zeros_like(y)
        if self.offsets.shape[1]:
            xs = y[..., None] + self._spread(self.offsets, gi, y)
            line = self.axle_line
            vals = line.left(xs) if side == LEFT else (line.right(xs) if side == RIGHT else line(xs))
            total = total + (vals * self._spread(self.loads, gi, y)).sum(axis=-1)
        for k, (group, lines) in enumerate(zip(self.groups, self.seg_lines)):
            if group.segments:
                mask = gi == k
                for seg, h in zip(group.segments, lines):
                    yk = y[mask]
                    total[mask] += seg.intensity * (h.cumulative(yk + seg.end) - h.cumulative(yk + seg.start))
        return total

    def rate(self, y: np.ndarray, gi: np.ndarray) -> np.ndarray:
        """Derivative of the effect with respect to the group position (inside intervals)."""
        total = np.zeros_like(y)
        if self.offsets.shape[1]:
            xs = y[..., None] + self._spread(self.offsets, gi, y)
            total = total + (self.axle_line.slope(xs) * self._spread(self.loads, gi, y)).sum(axis=-1)
        for k, (group, lines) in enumerate(zip(self.groups, self.seg_lines)):
            if group.segments:
                mask = gi == k
                for seg, h in zip(group.segments, lines):
                    for end, sign in ((seg.end, 1.0), (seg.start, -1.0)):
                        if np.isfinite(end):  # an end at infinity is off the beam: ordinate 0
                            total[mask] += sign * seg.intensity * h(y[mask] + end)
        return total

    def degree(self) -> int:
        """Degree of the derivative of the effect between events."""
        degree = self.axle_line.degree - 1 if self.offsets.shape[1] else -1
        for lines in self.seg_lines:
            for h in lines:
                degree = max(degree, h.degree)
        return degree


_NODES: dict[int, tuple[np.ndarray, np.ndarray]] = {}


def _chebyshev(n: int) -> tuple[np.ndarray, np.ndarray]:
    """``n`` interior Chebyshev nodes on (-1, 1) and the inverse of their Vandermonde matrix."""
    if n not in _NODES:
        u = np.cos((2 * np.arange(n) + 1) * np.pi / (2 * n))
        _NODES[n] = (u, np.linalg.inv(np.vander(u, n, increasing=True)))
    return _NODES[n]


def candidates(group: Group, axle_line: InfluenceLine, seg_lines: tuple[InfluenceLine, ...] = ()) -> Candidates:
    """Every position of ``group`` where its effect on the lines can be extreme.

    ``axle_line`` acts on the point loads, ``seg_lines[k]`` on segment ``k``.
    """
    return candidates_of_groups((group,), axle_line, (seg_lines,))[0]


def candidates_of_groups(
    groups: tuple[Group, ...],
    axle_line: InfluenceLine,
    seg_lines: tuple[tuple[InfluenceLine, ...], ...],
) -> list[Candidates]:
    """:func:`candidates` of several groups at once (one vectorised pass over all of them)."""
    batch = _Batch.of(groups, axle_line, seg_lines)
    knots = np.asarray(axle_line.breakpoints)
    events, owners = [], []
    for k, (group, lines) in enumerate(zip(groups, seg_lines)):
        if group.offsets:
            events.append((knots[:, None] - np.asarray(group.offsets)[None, :]).ravel())
            owners.append(np.full(events[-1].size, k))
        for seg, h in zip(group.segments, lines):
            for end in (seg.start, seg.end):
                if np.isfinite(end):
                    events.append(np.asarray(h.breakpoints) - end)
                    owners.append(np.full(events[-1].size, k))
    y, gi = np.concatenate(events), np.concatenate(owners)
    order = np.lexsort((y, gi))  # by group, then position
    y, gi = y[order], gi[order]
    distinct = np.ones(y.size, dtype=bool)
    distinct[1:] = (y[1:] != y[:-1]) | (gi[1:] != gi[:-1])
    y, gi = y[distinct], gi[distinct]
    left = batch.effect(y, gi, LEFT)
    right = batch.effect(y, gi, RIGHT)
    scale = max(1.0, float(np.abs(left).max(initial=0.0)), float(np.abs(right).max(initial=0.0)))
    jump = np.abs(left - right) > 1e-12 * scale
    ys, gis, values = [y, y[jump]], [gi, gi[jump]], [right, left[jump]]
    sides = [np.where(jump, RIGHT, EXACT), np.full(int(jump.sum()), LEFT)]
    degree = batch.degree()
    if degree >= 1:
        roots, rgi = _stationary(batch, y, gi, degree)
        if roots.size:
            ys.append(roots)
            gis.append(rgi)
            sides.append(np.full(roots.size, EXACT))
            values.append(batch.effect(roots, rgi, EXACT))
    y_all, gi_all, side_all, value_all = (np.concatenate(a) for a in (ys, gis, sides, values))
    out = []
    for k in range(len(groups)):
        mask = gi_all == k
        side = side_all[mask]
        out.append(Candidates(y_all[mask], side, value_all[mask], bool(side.any())))
    return out


def _stationary(batch: _Batch, events: np.ndarray, gi: np.ndarray, degree: int) -> tuple[np.ndarray, np.ndarray]:
    """Positions strictly between consecutive events of a group where the effect is stationary."""
    lo, hi = events[:-1], events[1:]
    same = gi[:-1] == gi[1:]
    keep = same & (hi - lo > 1e-12 * max(1.0, float(np.abs(events).max())))
    lo, hi, g = lo[keep], hi[keep], gi[:-1][keep]
    mid, half = 0.5 * (lo + hi), 0.5 * (hi - lo)
    u, inverse = _chebyshev(degree + 1)
    rates = batch.rate(mid[:, None] + half[:, None] * u[None, :], g)
    coefficients = rates @ inverse.T  # ascending powers of u, one row per interval
    rows, roots = unit_roots(coefficients)
    return mid[rows] + half[rows] * roots, g[rows]


# --------------------------------------------------------------------- chains



@dataclass(frozen=True)
class Pattern:
    """A chain with each variable gap held at a bound or left free.

    ``blocks`` are the groups joined by held gaps; ``members[b]`` lists the
    chain's groups in block ``b`` with their offset in it; ``free_gaps`` are
    the ranges between consecutive blocks.
    """

    blocks: tuple[Group, ...]
    members: tuple[tuple[tuple[int, float], ...], ...]
    free_gaps: tuple[tuple[float, float], ...]


@functools.lru_cache(maxsize=512)
def patterns(chain: Chain) -> tuple[Pattern, ...]:
    """Every pattern of gaps held at a bound or left free (a gap at ``inf`` is never held there)."""
    choices = []
    for lo, hi in chain.gaps:
        options = ["lo"]
        if np.isfinite(hi) and hi > lo:
            options.append("hi")
        if hi > lo:
            options.append("free")
        choices.append(options)
    out = []
    for pattern in itertools.product(*choices):
        blocks: list[Group] = [chain.groups[0]]
        members: list[list[tuple[int, float]]] = [[(0, 0.0)]]
        free: list[tuple[float, float]] = []
        for k, option in enumerate(pattern):
            lo, hi = chain.gaps[k]
            nxt = chain.groups[k + 1]
            if option == "free":
                blocks.append(nxt)
                members.append([(k + 1, 0.0)])
                free.append((lo, hi))
            else:
                gap = lo if option == "lo" else hi
                members[-1].append((k + 1, blocks[-1].extent + gap))
                blocks[-1] = blocks[-1].joined(nxt, gap)
        out.append(Pattern(tuple(blocks), tuple(tuple(m) for m in members), tuple(free)))
    return tuple(out)


def best_in_chain(chain: Chain, find: Callable[[Group], Candidates], sense: int) -> ChainOptimum:
    """Largest (``sense=1``) or smallest (``sense=-1``) effect of a chain.

    ``find(group)`` returns the :class:`Candidates` of a group (the caller
    caches them).  Every pattern of gaps held at a bound or left free is
    searched.
    """
    best: ChainOptimum | None = None
    for pattern in patterns(chain):
        result = _best_for_pattern(chain, pattern, find, sense)
        if result is not None and (best is None or sense * result.value > sense * best.value):
            best = result
    assert best is not None
    return best


def _best_for_pattern(chain: Chain, pattern: Pattern, find, sense: int) -> ChainOptimum | None:
    blocks = pattern.blocks
    cands = [find(b) for b in blocks]
    if len(blocks) == 1:
        v = cands[0].value
        picks = [int(v.argmax() if sense > 0 else v.argmin())]
        value = float(v[picks[0]])
    else:
        # dynamic programming along the blocks
        score = sense * cands[0].value
        back: list[np.ndarray] = []
        for b in range(1, len(blocks)):
            prev, cur = cands[b - 1], cands[b]
            lo, hi = pattern.free_gaps[b - 1]
            gap = cur.y - (prev.y + blocks[b - 1].extent)[:, None]
            tol = 1e-9 * max(1.0, abs(lo), abs(hi) if hi < np.inf else 0.0)
            ok = gap >= lo - tol
            if hi < np.inf:
                ok &= gap <= hi + tol
            if prev.jumps and cur.jumps:
                # a limit from the left of one block and the right of the other moves the gap:
                # it must not leave the allowed range
                sp, sc = prev.side[:, None], cur.side[None, :]
                ok &= ~((np.abs(gap - lo) <= tol) & (sp == RIGHT) & (sc == LEFT))
                if hi < np.inf:
                    ok &= ~((np.abs(gap - hi) <= tol) & (sp == LEFT) & (sc == RIGHT))
            total = np.where(ok, score[:, None], -np.inf)
            arg = total.argmax(axis=0)
            score = total[arg, np.arange(cur.y.size)] + sense * cur.value
            back.append(arg)
        last = int(score.argmax())
        if score[last] == -np.inf:
            return None
        picks = [last]
        for arg in reversed(back):
            picks.append(int(arg[picks[-1]]))
        picks.reverse()
        value = float(sense * score[last])
    positions = [0.0] * len(chain.groups)
    sides = [EXACT] * len(chain.groups)
    for b, pick in enumerate(picks):
        y, side = float(cands[b].y[pick]), int(cands[b].side[pick])
        for g, shift in pattern.members[b]:
            positions[g] = y + shift
            sides[g] = side
    gaps = tuple(positions[k + 1] - positions[k] - chain.groups[k].extent for k in range(len(chain.gaps)))
    return ChainOptimum(value, tuple(positions), tuple(sides), gaps)
