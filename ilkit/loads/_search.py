"""The search behind critical placement (internal).

A *group* is a set of loads that move together: point loads at fixed offsets
and uniform segments at fixed offsets (a segment may run to ``±inf``).  Its
effect on a line, as a function of its position, is a piecewise polynomial
whose pieces change only at *events*: positions where a point load or a
segment end crosses a knot of the line.  Between two events every term is one
polynomial, so the extreme is either a one-sided limit at an event or a
stationary point inside an interval.

Exact faces.  A candidate is never carried as a float position plus offsets
that might round across a jump: it is an *anchor* (the offset of the group
that stands at a knot), the knot, a further ``shift`` (0 at events, inside
the interval at stationary points) and the side of the limit.  Every load's
position is computed from the knot it is measured from, and a position
within :data:`COINCIDENT` times the line length of a knot *is* that knot
(float sums such as ``0.2 + 0.1`` or a unit conversion land within rounding
of the point they stand for).  A load standing at a knot where the line
jumps takes the ordinate of the face named by the candidate's side.  The
same function (:func:`ordinates`) gives the ordinates to the search and to
the placement table, so the two cannot disagree.

Stationary points.  The derivative of the effect between events is a
polynomial of known degree; it is fitted exactly at interior Chebyshev
nodes (in a coordinate normalised to ``(-1, 1)``, so the result does not
depend on the size of the numbers) and solved by
:func:`ilkit._poly.unit_roots`.  For piecewise-linear lines and point loads
the derivative is constant between events and only events remain: the
classic rule that an extreme has a load at a breakpoint.

A *chain* is a series of groups separated by gaps that may vary within
``[lo, hi]`` (``hi`` may be ``inf``): a truck with a variable axle spacing,
two trucks at least a given distance apart.  Parts of a train that can never
be on the beam together (a spacing longer than the beam) are searched apart
(:func:`split`).  At the optimum each gap is either at a bound (the
neighbours move as one block) or free (each block at one of its own
candidates): with up to :data:`PATTERN_GAPS` varying gaps every pattern of
held and free gaps is searched, the free ones by dynamic programming over the
candidates (:func:`best_in_chain`); with more, :mod:`ilkit.loads._chain` runs
one dynamic programme over the whole chain, whose state is the position of a
group and whose step handles held and free gaps together, so that the work
grows with the number of gaps, not as ``3^k``.  :func:`cost` estimates the
work of either before it starts.

Memory stays bounded whatever the length of a train: only the point loads
that can be on the beam are evaluated for a candidate, in batches of at most
:data:`CHUNK` ordinates.
"""

from __future__ import annotations

import functools
import itertools
import math
from collections.abc import Callable
from dataclasses import dataclass
from fractions import Fraction
from typing import TYPE_CHECKING

import numpy as np

from ilkit._poly import unit_roots

if TYPE_CHECKING:  # pragma: no cover
    from ilkit.influence import InfluenceLine

__all__ = [
    "COINCIDENT",
    "Segment",
    "Group",
    "Chain",
    "Candidates",
    "Standing",
    "ChainOptimum",
    "Pattern",
    "candidates",
    "ordinates",
    "patterns",
    "split",
    "best_in_chain",
]

LEFT, EXACT, RIGHT = -1, 0, 1

COINCIDENT = 1e-10
"""Two positions closer than this fraction of the line length are one point (a load standing within
rounding of a knot stands at the knot)."""

JUMP = 1e-9
"""A knot where the one-sided ordinates differ by more than this fraction of the largest ordinate is a jump."""


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
    exact: tuple[Fraction, ...] | None = None  # the offsets without rounding, where known

    @property
    def extent(self) -> float:
        return self.offsets[-1] if self.offsets else 0.0

    @functools.cached_property
    def arrays(self) -> tuple[np.ndarray, np.ndarray]:
        """Offsets and loads as arrays."""
        return np.asarray(self.offsets, dtype=float), np.asarray(self.loads, dtype=float)

    @property
    def reach(self) -> tuple[float, float]:
        """Smallest and largest offset covered by a load (point or uniform; ``±inf`` for open segments)."""
        starts = [0.0, *(s.start for s in self.segments)]
        ends = [self.extent, *(s.end for s in self.segments)]
        return min(starts), max(ends)

    def mirrored(self) -> Group:
        """The group seen from the other end (offsets measured the other way)."""
        e = self.extent
        exact = None if self.exact is None else tuple(self.exact[-1] - a for a in reversed(self.exact))
        return Group(
            tuple(e - a for a in reversed(self.offsets)) if exact is None else tuple(float(a) for a in exact),
            tuple(reversed(self.loads)),
            tuple(Segment(e - s.end, e - s.start, s.intensity, s.breakable) for s in self.segments),
            exact,
        )

    def joined(self, other: Group, gap: float) -> Group:
        """This group followed by ``other`` with ``gap`` from its last point load to ``other``'s first."""
        shift = self.extent + gap
        exact = None
        if self.exact is not None and other.exact is not None and math.isfinite(gap):
            at = (self.exact[-1] if self.exact else Fraction(0)) + Fraction(gap)
            exact = self.exact + tuple(at + a for a in other.exact)
        return Group(
            self.offsets + tuple(shift + a for a in other.offsets),
            self.loads + other.loads,
            self.segments
            + tuple(Segment(shift + s.start, shift + s.end, s.intensity, s.breakable) for s in other.segments),
            exact,
        )

    @classmethod
    def of(cls, spacings: list[float], loads: list[float], segments: tuple[Segment, ...] = ()) -> Group:
        """Point loads at the given spacings (the first at offset 0), offsets summed without rounding."""
        exact = [Fraction(0)]
        for gap in spacings:
            exact.append(exact[-1] + Fraction(gap))
        return cls(tuple(float(a) for a in exact), tuple(loads), segments, tuple(exact))


@dataclass(frozen=True)
class Chain:
    """Groups in order along the beam, with the gap ``(lo, hi)`` after each group but the last."""

    groups: tuple[Group, ...]
    gaps: tuple[tuple[float, float], ...] = ()

    def mirrored(self) -> Chain:
        return Chain(tuple(g.mirrored() for g in reversed(self.groups)), tuple(reversed(self.gaps)))

    @property
    def variable(self) -> int:
        """Number of gaps that may vary."""
        return sum(1 for lo, hi in self.gaps if hi > lo)


# ------------------------------------------------------------------ ordinates
@dataclass(frozen=True)
class _Knots:
    x: np.ndarray  # knots of the line
    left: np.ndarray  # one-sided ordinates at them (0 off the beam)
    right: np.ndarray
    jumps: np.ndarray  # True where the two differ


def knot_table(line: InfluenceLine) -> _Knots:
    """The knots of ``line`` with their one-sided ordinates (cached on the line)."""
    cache = line.__dict__
    table = cache.get("_knot_table")
    if table is None:
        rows = np.array(line.knot_values(), dtype=float).reshape(-1, 3)
        x, left, right = rows[:, 0], rows[:, 1], rows[:, 2]
        scale = float(np.abs(rows[:, 1:]).max(initial=0.0))
        table = _Knots(x, left, right, np.abs(left - right) > JUMP * scale)
        cache["_knot_table"] = table
    return table


def snap(line: InfluenceLine, x: np.ndarray, tol: float) -> tuple[np.ndarray, np.ndarray]:
    """Positions within ``tol`` of a knot moved onto it, and the index of that knot (-1 elsewhere)."""
    knots = knot_table(line).x
    last = knots.size - 1
    j = np.searchsorted(knots, x)
    right = np.minimum(j, last)
    left = np.maximum(j - 1, 0)
    to_right = np.abs(knots[right] - x) <= tol
    to_left = ~to_right & (np.abs(x - knots[left]) <= tol)
    k = np.where(to_right, right, np.where(to_left, left, -1))
    return np.where(k >= 0, knots[np.maximum(k, 0)], x), k


def ordinates(line: InfluenceLine, x: np.ndarray, side: np.ndarray | int, tol: float) -> tuple[np.ndarray, ...]:
    """Ordinates of loads at ``x`` taking the limit from ``side`` where they stand at a jump.

    Returns the ordinates, the positions (moved onto the knot a load stands
    at) and the face of each load: ``LEFT`` or ``RIGHT`` at a jump, ``EXACT``
    elsewhere.  ``side`` ``EXACT`` at a jump means the value ``line(x)``
    gives there (the right face, the left one at the right end).
    """
    table = knot_table(line)
    xs, k = snap(line, x, tol)
    base = np.asarray(line(xs), dtype=float)
    at = np.maximum(k, 0)
    face_here = (k >= 0) & table.jumps[at]
    side = np.broadcast_to(side, xs.shape)
    use_left = face_here & ((side == LEFT) | ((side == EXACT) & (k == table.x.size - 1)))
    use_right = face_here & ~use_left
    values = np.where(use_left, table.left[at], np.where(use_right, table.right[at], base))
    faces = np.where(use_left, LEFT, np.where(use_right, RIGHT, EXACT))
    return values, xs, faces


def _both_sides(line: InfluenceLine, x: np.ndarray, tol: float) -> tuple[np.ndarray, np.ndarray, np.ndarray]:
    """Left and right ordinates of loads at ``x``, and where a load stands at a jump."""
    table = knot_table(line)
    xs, k = snap(line, x, tol)
    base = np.asarray(line(xs), dtype=float)
    at = np.maximum(k, 0)
    face_here = (k >= 0) & table.jumps[at]
    return np.where(face_here, table.left[at], base), np.where(face_here, table.right[at], base), face_here


# ----------------------------------------------------------------- candidates
@dataclass(frozen=True)
class Candidates:
    """Where a group may stand for an extreme, and its effect there.

    Candidate ``c`` puts offset ``anchor[c]`` of the group at ``knot[c]`` and
    moves it on by ``shift[c]``; ``side[c]`` is the one-sided limit taken
    (``EXACT``: no load at a jump).  ``first`` and ``last`` are the positions
    of the first and last point loads (offset 0 for a group without any).
    """

    knot: np.ndarray
    anchor: np.ndarray
    shift: np.ndarray
    side: np.ndarray
    value: np.ndarray
    first: np.ndarray
    last: np.ndarray

    @property
    def jumps(self) -> bool:
        return bool(self.side.any())

    def __len__(self) -> int:
        return int(self.value.size)


@dataclass(frozen=True)
class Lines:
    """The lines a group is searched on: ``axle`` for its point loads, ``segments[k]`` for segment ``k``,
    and ``tol``, the distance within which two positions are one point."""

    axle: InfluenceLine
    segments: tuple[InfluenceLine, ...]
    tol: float


CHUNK = 1 << 20
"""Most ordinates evaluated in one array: longer searches run in batches, so memory stays bounded."""


def _span(group: Group, lines: Lines, knot, anchor, shift, reach: float | np.ndarray = 0.0):
    """For each candidate, the first and the stop index of the point loads that can be on the beam
    (``reach``: a further travel to cover)."""
    a, _ = group.arrays
    base = anchor - knot - shift
    first = np.searchsorted(a, base - reach - lines.tol, side="left")
    stop = np.searchsorted(a, base + lines.axle.length + lines.tol, side="right")
    return first, stop


def _batches(first: np.ndarray, stop: np.ndarray, per_row: int = 1):
    """Slices of the candidates such that each batch evaluates at most :data:`CHUNK` ordinates."""
    width = int((stop - first).max(initial=0))
    step = max(1, CHUNK // max(width * per_row, 1))
    for start in range(0, first.size, step):
        yield slice(start, start + step), width


def _gather(group: Group, first, stop, width: int) -> tuple[np.ndarray, np.ndarray]:
    """Offsets and loads of the point loads from ``first`` to ``stop`` per row (padded with zero loads)."""
    a, w = group.arrays
    idx = first[:, None] + np.arange(width)[None, :]
    mask = idx < stop[:, None]
    idx = np.minimum(idx, max(a.size - 1, 0))
    return a[idx], np.where(mask, w[idx], 0.0)


def _segment_effect(group: Group, lines: Lines, knot, anchor, shift) -> np.ndarray:
    total = np.zeros(knot.shape)
    for seg, h in zip(group.segments, lines.segments):
        start = knot + (seg.start - anchor) + shift
        end = knot + (seg.end - anchor) + shift
        total = total + seg.intensity * (h.cumulative(end) - h.cumulative(start))
    return total


def effect(group: Group, lines: Lines, knot, anchor, shift, side) -> np.ndarray:
    """Effect of the group at candidates (arrays of the fields of :class:`Candidates`)."""
    total = _segment_effect(group, lines, knot, anchor, shift)
    if group.offsets:
        side = np.asarray(side)
        first, stop = _span(group, lines, knot, anchor, shift)
        for rows, width in _batches(first, stop):
            a, w = _gather(group, first[rows], stop[rows], width)
            x = knot[rows, None] + (a - anchor[rows, None]) + shift[rows, None]
            values, _, _ = ordinates(lines.axle, x, side[rows, None], lines.tol)
            total[rows] += (values * w).sum(axis=1)
    return total


def _event_values(group: Group, lines: Lines, knot, anchor) -> tuple[np.ndarray, np.ndarray, np.ndarray]:
    """Effect of the point loads at events, from the left and from the right, and whether a load stands at
    a jump."""
    left, right = np.zeros(knot.size), np.zeros(knot.size)
    faces = np.zeros(knot.size, dtype=bool)
    zero = np.zeros(knot.size)
    first, stop = _span(group, lines, knot, anchor, zero)
    for rows, width in _batches(first, stop):
        a, w = _gather(group, first[rows], stop[rows], width)
        x = knot[rows, None] + (a - anchor[rows, None])
        lo, hi, face = _both_sides(lines.axle, x, lines.tol)
        left[rows] = (lo * w).sum(axis=1)
        right[rows] = (hi * w).sum(axis=1)
        faces[rows] = (face & (w != 0)).any(axis=1)
    return left, right, faces


def _rate(group: Group, lines: Lines, knot, anchor, shift) -> np.ndarray:
    """Derivative of the effect with respect to the shift (inside intervals between events); ``shift`` is
    2-d (one row per interval)."""
    total = np.zeros(shift.shape)
    if group.offsets:
        first, stop = _span(group, lines, knot, anchor, np.zeros(knot.size), shift.max(axis=1))
        for rows, width in _batches(first, stop, shift.shape[1]):
            a, w = _gather(group, first[rows], stop[rows], width)
            x = knot[rows, None, None] + (a - anchor[rows, None])[:, None, :] + shift[rows, :, None]
            slopes = np.asarray(lines.axle.slope(x.ravel())).reshape(x.shape)
            total[rows] += (slopes * w[:, None, :]).sum(axis=2)
    for seg, h in zip(group.segments, lines.segments):
        for end, sign in ((seg.end, 1.0), (seg.start, -1.0)):
            if math.isfinite(end):  # an end at infinity is off the beam: ordinate 0
                at = knot[:, None] + (end - anchor)[:, None] + shift
                total = total + sign * seg.intensity * np.asarray(h(at.ravel())).reshape(at.shape)
    return total


def _degree(group: Group, lines: Lines) -> int:
    """Degree of the derivative of the effect between events."""
    degree = lines.axle.degree - 1 if group.offsets else -1
    for h in lines.segments:
        degree = max(degree, h.degree)
    return degree


_NODES: dict[int, tuple[np.ndarray, np.ndarray]] = {}


def _chebyshev(n: int) -> tuple[np.ndarray, np.ndarray]:
    """``n`` interior Chebyshev nodes on (-1, 1) and the inverse of their Vandermonde matrix."""
    if n not in _NODES:
        u = np.cos((2 * np.arange(n) + 1) * np.pi / (2 * n))
        _NODES[n] = (u, np.linalg.inv(np.vander(u, n, increasing=True)))
    return _NODES[n]


def events(group: Group, lines: Lines) -> tuple[np.ndarray, np.ndarray]:
    """Knots and anchors of every event of a group (a point load or a segment end at a knot), in order of the
    group's position, one per position (events within ``tol`` of each other are one)."""
    knots, anchors = [], []
    if group.offsets:
        a, _ = group.arrays
        k = knot_table(lines.axle).x
        knots.append(np.repeat(k, a.size))
        anchors.append(np.tile(a, k.size))
    for seg, h in zip(group.segments, lines.segments):
        for end in (seg.start, seg.end):
            if math.isfinite(end):
                k = knot_table(h).x
                knots.append(k)
                anchors.append(np.full(k.size, end))
    knot, anchor = np.concatenate(knots), np.concatenate(anchors)
    y = knot - anchor
    order = np.argsort(y, kind="stable")  # point loads first among equal positions
    knot, anchor, y = knot[order], anchor[order], y[order]
    keep = np.ones(y.size, dtype=bool)
    keep[1:] = np.diff(y) > lines.tol
    return knot[keep], anchor[keep]


def candidates(group: Group, lines: Lines) -> Candidates:
    """Every position of ``group`` where its effect on the lines can be extreme."""
    knot, anchor = events(group, lines)
    zero = np.zeros(knot.size)
    seg = _segment_effect(group, lines, knot, anchor, zero)
    left = right = seg
    faces = np.zeros(knot.size, dtype=bool)
    if group.offsets:
        lo, hi, faces = _event_values(group, lines, knot, anchor)
        left, right = seg + lo, seg + hi
    # an event with a load at a jump is two candidates, one per face; any other is one
    parts = [
        (knot, anchor, zero, np.where(faces, RIGHT, EXACT), right),
        (knot[faces], anchor[faces], zero[faces], np.full(int(faces.sum()), LEFT), left[faces]),
    ]
    degree = _degree(group, lines)
    if degree >= 1 and knot.size > 1:
        parts.append(_stationary(group, lines, knot, anchor, degree))
    k, an, sh, sd, val = (np.concatenate(f) for f in zip(*parts))
    a = group.offsets
    first = k + ((a[0] if a else 0.0) - an) + sh
    last = k + ((a[-1] if a else 0.0) - an) + sh
    return Candidates(k, an, sh, sd.astype(int), val, first, last)


def _stationary(group: Group, lines: Lines, knot: np.ndarray, anchor: np.ndarray, degree: int):
    """Candidates strictly between consecutive events where the effect is stationary."""
    y = knot - anchor
    width = np.diff(y)
    tol = lines.tol
    keep = width > 2 * tol
    k, an, width = knot[:-1][keep], anchor[:-1][keep], width[keep]
    u, inverse = _chebyshev(degree + 1)
    half = 0.5 * width
    rates = _rate(group, lines, k, an, half[:, None] * (1.0 + u[None, :]))
    coefficients = rates @ inverse.T  # ascending powers of u, one row per interval
    rows, roots = unit_roots(coefficients)
    t = half[rows] * (1.0 + roots)
    inside = (t > tol) & (t < width[rows] - tol)
    rows, t = rows[inside], t[inside]
    k, an = k[rows], an[rows]
    side = np.zeros(t.size, dtype=int)
    return k, an, t, side, effect(group, lines, k, an, t, side)


# --------------------------------------------------------------------- chains
@dataclass(frozen=True)
class Standing:
    """Where a block of groups stands: offset ``anchor`` of ``block`` at ``knot``, moved on by ``shift``,
    with the one-sided limit ``side``.  ``members`` are the chain's groups in the block with their offset."""

    block: Group
    members: tuple[tuple[int, float], ...]
    knot: float
    anchor: float
    shift: float
    side: int

    def at(self, offset: float) -> float:
        """Position of an offset of the block."""
        return self.knot + (offset - self.anchor) + self.shift

    def axles(self) -> np.ndarray:
        """Positions of the block's point loads."""
        a, _ = self.block.arrays
        return self.knot + (a - self.anchor) + self.shift


@dataclass(frozen=True)
class ChainOptimum:
    """Best placement of a chain: its value, where each block stands (in order along the chain, covering
    every group) and the gap used after each group of the chain but the last."""

    value: float
    standings: tuple[Standing, ...]
    gaps: tuple[float, ...]


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


def feasible(
    prev: Candidates, cur: Candidates, lo: float, hi: float, tol: float
) -> np.ndarray:
    """Which pairs (previous block's candidate, this block's) keep the gap between them within ``[lo, hi]``.

    A gap within ``tol`` of a bound is at the bound; there a limit from the
    left of one block and from the right of the other would move the gap out
    of the range, so that pair is refused.
    """
    gap = cur.first[None, :] - prev.last[:, None]
    ok = gap >= lo - tol
    if hi < np.inf:
        ok &= gap <= hi + tol
    if prev.jumps and cur.jumps:
        sp, sc = prev.side[:, None], cur.side[None, :]
        ok &= ~((np.abs(gap - lo) <= tol) & (sp == RIGHT) & (sc == LEFT))
        if hi < np.inf:
            ok &= ~((np.abs(gap - hi) <= tol) & (sp == LEFT) & (sc == RIGHT))
    return ok


def best_in_chain(chain: Chain, find: Callable[[Group], Candidates], sense: int, tol: float) -> ChainOptimum:
    """Largest (``sense=1``) or smallest (``sense=-1``) effect of a chain whose parts can all be on the beam
    together (see :func:`split`).

    ``find(group)`` returns the :class:`Candidates` of a group (the caller
    caches them).  Every pattern of gaps held at a bound or left free is
    searched.
    """
    best: ChainOptimum | None = None
    for pattern in patterns(chain):
        result = _best_for_pattern(chain, pattern, find, sense, tol)
        if result is not None and (best is None or sense * result.value > sense * best.value):
            best = result
    assert best is not None  # the pattern with every gap at its lower bound always has a candidate
    return best


def _best_for_pattern(chain: Chain, pattern: Pattern, find, sense: int, tol: float) -> ChainOptimum | None:
    blocks = pattern.blocks
    cands = [find(b) for b in blocks]
    score = sense * cands[0].value
    back: list[np.ndarray] = []
    for b in range(1, len(blocks)):
        lo, hi = pattern.free_gaps[b - 1]
        ok = feasible(cands[b - 1], cands[b], lo, hi, tol)
        total = np.where(ok, score[:, None], -np.inf)
        arg = total.argmax(axis=0)
        score = total[arg, np.arange(len(cands[b]))] + sense * cands[b].value
        back.append(arg)
    last = int(score.argmax())
    if score[last] == -np.inf:
        return None
    picks = [last]
    for arg in reversed(back):
        picks.append(int(arg[picks[-1]]))
    picks.reverse()
    standings = tuple(
        Standing(
            block,
            pattern.members[b],
            float(c.knot[p]),
            float(c.anchor[p]),
            float(c.shift[p]),
            int(c.side[p]),
        )
        for b, (block, c, p) in enumerate(zip(blocks, cands, picks))
    )
    return ChainOptimum(float(sense * score[last]), standings, chain_gaps(chain, standings, tol))


def chain_gaps(chain: Chain, standings: tuple[Standing, ...], tol: float) -> tuple[float, ...]:
    """The gap after each group of the chain as placed (a gap within ``tol`` of a bound is the bound)."""
    where: dict[int, tuple[Standing, float]] = {g: (s, shift) for s in standings for g, shift in s.members}
    out = []
    for k, (lo, hi) in enumerate(chain.gaps):
        if lo == hi:
            out.append(lo)
            continue
        (s0, m0), (s1, m1) = where[k], where[k + 1]
        if s0 is s1:  # held: the members' offsets in the block say which bound
            gap = m1 - m0 - chain.groups[k].extent
        else:
            gap = s1.at(m1) - s0.at(m0 + chain.groups[k].extent)
        for bound in (lo, hi):
            if abs(gap - bound) <= tol:
                gap = bound
        out.append(gap)
    return tuple(out)


# ---------------------------------------------------------------- independence
@dataclass(frozen=True)
class Split:
    """A chain cut where its parts can never be on the beam together.

    ``chain`` is the chain with groups cut at spacings longer than the beam;
    ``parts`` are its stretches of groups ``(first, stop)`` that may stand on
    the beam together; ``origin[k]`` is the gap of the original chain that
    gap ``k`` of ``chain`` is (``None`` for a cut inside a group).
    """

    chain: Chain
    parts: tuple[tuple[int, int], ...]
    origin: tuple[int | None, ...]

    def part(self, index: int) -> Chain:
        first, stop = self.parts[index]
        return Chain(self.chain.groups[first:stop], self.chain.gaps[first : stop - 1])


def _cut_group(group: Group, length: float) -> list[tuple[Group, float]]:
    """A group as clusters of point loads that are more than ``length`` apart, with the spacing before each
    (segments stay with the cluster they touch; a group whose segments lie between clusters is not cut)."""
    a = group.offsets
    cuts = [k for k in range(1, len(a)) if a[k] - a[k - 1] > length]
    if not cuts:
        return [(group, 0.0)]
    for s in group.segments:  # only uniform loads ahead of the first or behind the last point load
        if not (s.end <= a[0] or s.start >= a[-1]):
            return [(group, 0.0)]
    exact = group.exact if group.exact is not None else tuple(Fraction(v) for v in a)
    out = []
    bounds = [0, *cuts, len(a)]
    for i, (k0, k1) in enumerate(zip(bounds[:-1], bounds[1:])):
        base = exact[k0]
        segs = tuple(
            Segment(s.start - a[k0], s.end - a[k0], s.intensity, s.breakable)
            for s in group.segments
            if (i == 0 and s.end <= a[0]) or (i == len(bounds) - 2 and s.start >= a[-1])
        )
        own = tuple(v - base for v in exact[k0:k1])
        cluster = Group(tuple(float(v) for v in own), group.loads[k0:k1], segs, own)
        out.append((cluster, float(exact[k0] - exact[k0 - 1]) if k0 else 0.0))
    return out


@functools.lru_cache(maxsize=512)
def split(chain: Chain, length: float) -> Split:
    """Cut ``chain`` where nothing can be on a beam of ``length`` on both sides at once."""
    groups: list[Group] = []
    gaps: list[tuple[float, float]] = []
    origin: list[int | None] = []
    for k, group in enumerate(chain.groups):
        for i, (cluster, before) in enumerate(_cut_group(group, length)):
            if i:
                gaps.append((before, before))
                origin.append(None)
            groups.append(cluster)
        if k < len(chain.gaps):
            gaps.append(chain.gaps[k])
            origin.append(k)
    parts, first = [], 0
    for k, (lo, _) in enumerate(gaps):
        _, end = groups[k].reach
        start, _ = groups[k + 1].reach
        if (lo - (end - groups[k].extent)) + start > length:  # the closest the two can come
            parts.append((first, k + 1))
            first = k + 1
    parts.append((first, len(groups)))
    return Split(Chain(tuple(groups), tuple(gaps)), tuple(parts), tuple(origin))


def assemble(cut: Split, index: int, best: ChainOptimum, tol: float) -> ChainOptimum:
    """The whole chain placed: part ``index`` as found, the others beyond the beam at their shortest gaps.

    ``gaps`` are those of the original chain.
    """
    chain = cut.chain
    first, stop = cut.parts[index]
    standings = [
        Standing(s.block, tuple((g + first, m) for g, m in s.members), s.knot, s.anchor, s.shift, s.side)
        for s in best.standings
    ]
    part_gaps = list(best.gaps)
    gaps: dict[int, float] = {first + k: g for k, g in enumerate(part_gaps)}
    # groups after the part, each at the shortest gap behind the one before (a position, anchor 0)
    prev = standings[-1]
    end = prev.at(prev.members[-1][1] + chain.groups[stop - 1].extent)
    for g in range(stop, len(chain.groups)):
        lo = chain.gaps[g - 1][0]
        gaps[g - 1] = lo
        s = Standing(chain.groups[g], ((g, 0.0),), end + lo, 0.0, 0.0, EXACT)
        standings.append(s)
        end = s.at(chain.groups[g].extent)
    head = standings[0]
    start = head.at(head.members[0][1])
    before = []
    for g in range(first - 1, -1, -1):
        lo = chain.gaps[g][0]
        gaps[g] = lo
        y = start - lo - chain.groups[g].extent
        before.append(Standing(chain.groups[g], ((g, 0.0),), y, 0.0, 0.0, EXACT))
        start = y
    ordered = tuple(reversed(before)) + tuple(standings)
    original = [0.0] * sum(1 for o in cut.origin if o is not None)
    for k, o in enumerate(cut.origin):
        if o is not None:
            original[o] = gaps[k]
    return ChainOptimum(best.value, ordered, tuple(original))


# --------------------------------------------------------------------- cost
PATTERN_GAPS = 2
"""Most varying gaps searched by patterns of held and free gaps (3^k patterns); more go to the programme."""

MATRIX_LIMIT = 4_000_000
"""Largest table of pairs of candidates the pattern search may build; larger chains go to the programme."""


@dataclass(frozen=True)
class Cost:
    """What a search of a chain on a line takes: ``work`` ordinate evaluations (an estimate), and the
    numbers behind it; ``patterns`` says whether the pattern search is used."""

    work: float
    axles: int
    variable: int
    breakpoints: int
    on_beam: int
    patterns: bool


def on_beam_at_once(group: Group, length: float) -> int:
    """The most point loads of ``group`` that fit on a stretch of ``length``."""
    a, _ = group.arrays
    if not a.size:
        return 0
    return int((np.searchsorted(a, a + length, side="right") - np.arange(a.size)).max())


def cost(chain: Chain, lines_of: Callable[[Group], Lines]) -> Cost:
    """The cost of searching ``chain`` (one part of a split chain), before any search is done."""
    work, knots, widest = 0.0, 0, 0
    sizes = []
    for g in chain.groups:
        lines = lines_of(g)
        k = knot_table(lines.axle).x.size if g.offsets else 0
        k_seg = sum(2 * knot_table(h).x.size for h in lines.segments)
        w = on_beam_at_once(g, lines.axle.length)
        nodes = max(_degree(g, lines) + 2, 2)
        events = k * len(g.offsets) + k_seg
        work += events * max(w, 1) * (2 + nodes)
        knots, widest = max(knots, k), max(widest, w)
        sizes.append(2 * events)
    pairs = sum(a * b for a, b in zip(sizes[:-1], sizes[1:]))
    patterns = chain.variable <= PATTERN_GAPS and pairs <= MATRIX_LIMIT
    if patterns:
        work = work * 3**chain.variable + pairs * 3**chain.variable
    axles = sum(len(g.offsets) for g in chain.groups)
    return Cost(work, axles, chain.variable, knots, widest, patterns)
