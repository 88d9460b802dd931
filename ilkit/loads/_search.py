"""The search behind critical placement (internal).

A *group* is a set of loads that move together: point loads at fixed offsets
and uniform segments at fixed offsets (a segment may run to ``±inf``).  Its
effect on a line, as a function of its position, is a piecewise polynomial
whose pieces change only at *events*: positions where a point load or a
segment end crosses a knot of the line.  Between two events every term is one
polynomial, so the extreme is either a one-sided limit at an event or a
stationary point inside an interval.

Many lines at once.  Candidates are rows tagged with their group and their
line (a :class:`~ilkit.loads._lines.LineSet`): the candidates of several
groups on all the lines of an envelope come from one pass
(:func:`candidates_of_groups`), and the dynamic programme over varying gaps
runs for all the lines together (:func:`best_in_chain`).

Exact faces.  A candidate is never carried as a float position plus offsets
that might round across a jump: it is an *anchor* (the offset of the group
that stands at a knot), the knot, a further ``shift`` (0 at events, inside
the interval at stationary points) and the side of the limit.  Every load's
position is computed from the knot it is measured from, and a position
within :data:`COINCIDENT` times the line length of a knot *is* that knot
(float sums such as ``0.2 + 0.1`` or a unit conversion land within rounding
of the point they stand for).  A load standing at a knot where the line
jumps takes the ordinate of the face named by the candidate's side.  The
same evaluation (:meth:`LineSet.ordinates <ilkit.loads._lines.LineSet.ordinates>`,
through :func:`effect`) gives the value of the placement found and the
placement table, so the two cannot disagree.

Search values.  Between events the point loads' effect is the sum, over the
events so far, of what changes at each (one load leaves a piece of a line and
enters the next): a polynomial per interval, built once for all intervals
(:func:`events`).  Its values at the events, from either side, and the roots
of its derivative (closed form, after a cheap check that the derivative
changes sign at all) rank the candidates; the placement chosen on each line is
then evaluated afresh, load by load (:func:`exact_sum`), so the value reported
is the exact effect of a real placement.  For piecewise-linear lines and point
loads the derivative is constant between events and only events remain: the
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
from dataclasses import dataclass, field
from fractions import Fraction

import numpy as np

from ilkit._poly import horner, roots_in_pieces, taylor_shift
from ilkit.loads._lines import COINCIDENT, EXACT, LEFT, RIGHT, LineSet

__all__ = [
    "COINCIDENT",
    "Segment",
    "Group",
    "Chain",
    "Candidates",
    "Standing",
    "ChainOptimum",
    "Pattern",
    "Lines",
    "Rows",
    "ChainSearch",
    "candidates_of_groups",
    "patterns",
    "split",
    "best_in_chain",
    "exact_sum",
]


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
    exact: tuple[Fraction, ...] | None = field(default=None, hash=False)  # the offsets without rounding

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


# ----------------------------------------------------------------- candidates
@dataclass(frozen=True)
class Lines:
    """The lines groups are searched on, one set of the same lines three ways: ``axle`` for point loads,
    ``plain`` (the lines) for unbreakable uniform segments, ``signed`` (their parts of the wanted sign) for
    breakable ones."""

    axle: LineSet
    plain: LineSet
    signed: LineSet

    def segment(self, seg: Segment) -> LineSet:
        return self.signed if seg.breakable else self.plain

    @property
    def size(self) -> int:
        return self.plain.size

    def row(self, i: int) -> Lines:
        """The same for line ``i`` alone."""
        return Lines(self.axle.row(i), self.plain.row(i), self.signed.row(i))


@dataclass(frozen=True)
class Candidates:
    """Where a group may stand for an extreme on each line, and its effect there.

    Flat arrays, ordered by line (``starts[i]:starts[i+1]`` are line
    ``i``'s).  Candidate ``c`` puts offset ``anchor[c]`` of the group at
    ``knot[c]`` and moves it on by ``shift[c]``; ``side[c]`` is the one-sided
    limit taken (``EXACT``: no load at a jump).  ``first`` and ``last`` are
    the positions of the first and last point loads (offset 0 for a group
    without any).
    """

    line: np.ndarray
    knot: np.ndarray
    anchor: np.ndarray
    shift: np.ndarray
    side: np.ndarray
    value: np.ndarray
    first: np.ndarray
    last: np.ndarray
    starts: np.ndarray
    group: Group = field(repr=False, compare=False)
    lines: Lines = field(repr=False, compare=False)

    @functools.cached_property
    def _layout(self) -> tuple[np.ndarray, np.ndarray]:
        counts = np.diff(self.starts)
        width = int(counts.max(initial=0))
        idx = self.starts[:-1, None] + np.arange(width)[None, :]
        mask = idx < self.starts[1:, None]
        return np.minimum(idx, max(self.value.size - 1, 0)), mask

    def padded(self, field: str, fill: float) -> np.ndarray:
        """``field`` as a ``(lines, most candidates)`` table, ``fill`` where a line has fewer."""
        idx, mask = self._layout
        data = getattr(self, field)
        if not data.size:
            return np.full(mask.shape, fill)
        return np.where(mask, data[idx], fill)


@dataclass(frozen=True)
class _Table:
    """Groups searched together: their point loads padded to one width (offsets ``inf`` where padded)."""

    groups: tuple[Group, ...]
    offsets: np.ndarray
    loads: np.ndarray
    counts: np.ndarray

    @classmethod
    @functools.lru_cache(maxsize=1024)
    def of(cls, groups: tuple[Group, ...]) -> _Table:
        width = max(max((len(g.offsets) for g in groups), default=0), 1)
        offsets = np.full((len(groups), width), np.inf)
        loads = np.zeros((len(groups), width))
        for k, g in enumerate(groups):
            offsets[k, : len(g.offsets)] = g.offsets
            loads[k, : len(g.loads)] = g.loads
        return cls(groups, offsets, loads, np.array([len(g.offsets) for g in groups]))

    def count(self, g: np.ndarray, x: np.ndarray, strict: bool) -> np.ndarray:
        """Number of offsets of each row's group below ``x`` (``strict``) or at or below it."""
        if len(self.groups) == 1:
            a = self.offsets[0, : self.counts[0]]
            return np.searchsorted(a, x, side="left" if strict else "right")
        if self.offsets.shape[1] <= 64:
            a = self.offsets[g]
            return ((a < x[:, None]) if strict else (a <= x[:, None])).sum(axis=1)
        out = np.zeros(x.shape, dtype=int)
        for k in np.unique(g):
            sel = g == k
            out[sel] = np.searchsorted(self.offsets[k, : self.counts[k]], x[sel], side="left" if strict else "right")
        return out


@dataclass(frozen=True)
class Rows:
    """Candidates as rows: the group ``g`` and the line ``r`` of each, its anchor, knot, shift and side."""

    g: np.ndarray
    r: np.ndarray
    knot: np.ndarray
    anchor: np.ndarray
    shift: np.ndarray
    side: np.ndarray

    def __getitem__(self, sel) -> Rows:
        return Rows(self.g[sel], self.r[sel], self.knot[sel], self.anchor[sel], self.shift[sel], self.side[sel])

    def with_side(self, side: np.ndarray) -> Rows:
        return Rows(self.g, self.r, self.knot, self.anchor, self.shift, side)


CHUNK = 1 << 20
"""Most ordinates evaluated in one array: longer searches run in batches, so memory stays bounded."""


def _span(table: _Table, lines: Lines, rows: Rows, reach: float | np.ndarray = 0.0):
    """For each row, the first and the stop index of the point loads that can be on the beam (``reach``: a
    further travel to cover)."""
    tol = lines.axle.tol[rows.r]
    base = rows.anchor - rows.knot - rows.shift
    first = table.count(rows.g, base - reach - tol, strict=True)
    stop = table.count(rows.g, base + lines.axle.length[rows.r] + tol, strict=False)
    return first, stop


def _batches(first: np.ndarray, stop: np.ndarray, g: np.ndarray, per_row: int = 1):
    """Slices of the rows, each of one group (rows come ordered by group) and at most :data:`CHUNK`
    ordinates, with the most point loads a row of the slice has on the beam."""
    if not g.size:
        return
    edges = np.concatenate(([0], np.nonzero(g[1:] != g[:-1])[0] + 1, [g.size]))
    count = stop - first
    for lo, hi in zip(edges[:-1], edges[1:]):
        width = int(count[lo:hi].max(initial=0))
        step = max(1, CHUNK // max(width * per_row, 1))
        for start in range(lo, hi, step):
            yield slice(start, min(start + step, hi)), width


def _gather(table: _Table, g: np.ndarray, first: np.ndarray, stop: np.ndarray, width: int):
    """Offsets and loads of the point loads from ``first`` to ``stop`` per row (zero loads where padded)."""
    idx = first[:, None] + np.arange(width)[None, :]
    mask = idx < stop[:, None]
    idx = np.minimum(idx, table.offsets.shape[1] - 1)
    a = table.offsets[g[:, None], idx]
    return np.where(mask, a, 0.0), np.where(mask, table.loads[g[:, None], idx], 0.0)


def _segments(table: _Table, lines: Lines, rows: Rows):
    """Each uniform segment of the rows' groups: which rows hold its group, those rows, it and its line."""
    for k, group in enumerate(table.groups):
        if group.segments:
            sel = np.nonzero(rows.g == k)[0]
            part = rows[sel]
            for seg in group.segments:
                yield sel, part, seg, lines.segment(seg)


def _segment_effect(table: _Table, lines: Lines, rows: Rows) -> np.ndarray:
    total = np.zeros(rows.g.size)
    for sel, part, seg, h in _segments(table, lines, rows):
        start = part.knot + (seg.start - part.anchor) + part.shift
        end = part.knot + (seg.end - part.anchor) + part.shift
        total[sel] += seg.intensity * (h.cumulative(part.r, end) - h.cumulative(part.r, start))
    return total


def effect(table: _Table, lines: Lines, rows: Rows) -> np.ndarray:
    """Effect of each row's group on its line, where the row puts it."""
    total = _segment_effect(table, lines, rows)
    if table.offsets.size and table.counts.any():
        first, stop = _span(table, lines, rows)
        for sl, width in _batches(first, stop, rows.g):
            part = rows[sl]
            a, w = _gather(table, part.g, first[sl], stop[sl], width)
            x = part.knot[:, None] + (a - part.anchor[:, None]) + part.shift[:, None]
            values, _, _ = lines.axle.ordinates(part.r, x, part.side[:, None])
            total[sl] += (values * w).sum(axis=1)
    return total


def _segment_rate(table: _Table, lines: Lines, rows: Rows, shift: np.ndarray) -> np.ndarray:
    """Derivative of the uniform segments' effect with respect to the shift, at the positions ``shift`` (one
    row per row of ``rows``, whose own shift is 0)."""
    total = np.zeros(shift.shape)
    for sel, part, seg, h in _segments(table, lines, rows):
        for end, sign in ((seg.end, 1.0), (seg.start, -1.0)):
            if math.isfinite(end):  # an end at infinity is off the beam: ordinate 0
                at = part.knot[:, None] + (end - part.anchor)[:, None] + shift[sel]
                total[sel] += sign * seg.intensity * h.evaluate(part.r, at)
    return total


def _degree(groups: tuple[Group, ...], lines: Lines) -> int:
    """Degree of the derivative of the effect of ``groups`` between events."""
    degree = lines.axle.degree - 1 if any(g.offsets for g in groups) else -1
    for group in groups:
        for seg in group.segments:
            degree = max(degree, lines.segment(seg).degree)
    return degree


_NODES: dict[int, tuple[np.ndarray, np.ndarray]] = {}


def _chebyshev(n: int) -> tuple[np.ndarray, np.ndarray]:
    """``n`` interior Chebyshev nodes on (-1, 1) and the inverse of their Vandermonde matrix."""
    if n not in _NODES:
        u = np.cos((2 * np.arange(n) + 1) * np.pi / (2 * n))
        _NODES[n] = (u, np.linalg.inv(np.vander(u, n, increasing=True)))
    return _NODES[n]


def events(table: _Table, lines: Lines) -> tuple[Rows, np.ndarray, np.ndarray]:
    """Every event (a point load or a segment end at a knot) of each group on each line, ordered by group,
    line and the group's position; events within the tolerance of each other are one.

    Also, for each event, the effect of the point loads just after it, as a
    polynomial in the group's position (the sum, over the events so far, of
    what changes at each: one load leaves a piece of the line and enters the
    next), and whether a load stands at a jump there.
    """
    parts, changes, jumps = [], [], []
    ls = lines.axle
    width = ls.degree + 1
    gk, ik = np.nonzero(np.arange(table.offsets.shape[1])[None, :] < table.counts[:, None])  # every point load
    if gk.size:
        r, j = ls.valid
        gg, rr, jj = np.repeat(gk, r.size), np.tile(r, gk.size), np.tile(j, gk.size)
        aa, ww = np.repeat(table.offsets[gk, ik], r.size), np.repeat(table.loads[gk, ik], r.size)
        parts.append((gg, rr, ls.knots[rr, jj], aa))
        changes.append(_crossing(ls, rr, jj, aa, ww))
        jumps.append(ls.jumps[rr, jj] & (ww != 0))
    for k, group in enumerate(table.groups):
        for seg in group.segments:
            h = lines.segment(seg)
            r, j = h.valid
            for end in (seg.start, seg.end):
                if math.isfinite(end):
                    parts.append((np.full(r.size, k), r, h.knots[r, j], np.full(r.size, end)))
                    changes.append(np.zeros((r.size, width)))
                    jumps.append(np.zeros(r.size, dtype=bool))
    g, r, knot, anchor = (np.concatenate(c) for c in zip(*parts))
    y = knot - anchor
    order = np.lexsort((y, g * lines.size + r))  # point loads first among equal positions (stable)
    g, r, knot, anchor, y = g[order], r[order], knot[order], anchor[order], y[order]
    block = np.ones(y.size, dtype=bool)
    block[1:] = (g[1:] != g[:-1]) | (r[1:] != r[:-1])
    keep = block.copy()
    keep[1:] |= np.diff(y) > lines.axle.tol[r[1:]]
    zero = np.zeros(int(keep.sum()))
    rows = Rows(g[keep], r[keep], knot[keep], anchor[keep], zero, zero.astype(int))
    first = np.nonzero(keep)[0]
    faces = np.logical_or.reduceat(np.concatenate(jumps)[order], first)
    # the running sum of the changes, block by block (laid out one block per row, so that no block's sum
    # depends on the others: a line gives the same alone and among many)
    changes_sorted = np.concatenate(changes)[order]
    total = np.empty_like(changes_sorted)
    edges = np.concatenate(([0], np.nonzero(g[1:] != g[:-1])[0] + 1, [g.size]))
    for lo, hi in zip(edges[:-1], edges[1:]):  # group by group, so that the layout wastes little
        starts = np.nonzero(block[lo:hi])[0]
        which = np.cumsum(block[lo:hi]) - 1
        slot = np.arange(hi - lo) - starts[which]
        laid = np.zeros((starts.size, int(slot.max(initial=0)) + 1, changes_sorted.shape[1]))
        laid[which, slot] = changes_sorted[lo:hi]
        total[lo:hi] = np.cumsum(laid, axis=1)[which, slot]
    last = np.append(first[1:] - 1, y.size - 1)  # the last row of each run of one event
    return rows, total[last], faces


def _crossing(ls: LineSet, r: np.ndarray, j: np.ndarray, a: np.ndarray, w: np.ndarray) -> np.ndarray:
    """What a load ``w`` at offset ``a`` crossing knot ``j`` of line ``r`` changes in the effect, as a
    polynomial in the group's position ``y`` (piece ``j`` entered, piece ``j - 1`` left; none beyond the
    ends)."""
    enter = j < ls.counts[r] - 1
    leave = j >= 1
    jin = np.minimum(j, ls.coef.shape[1] - 1)
    jout = np.maximum(j - 1, 0)
    cin = taylor_shift(ls.coef[r, jin], a - ls.knots[r, jin])
    cout = taylor_shift(ls.coef[r, jout], a - ls.knots[r, jout])
    return w[:, None] * (np.where(enter[:, None], cin, 0.0) - np.where(leave[:, None], cout, 0.0))


def candidates_of_groups(groups: tuple[Group, ...], lines: Lines) -> list[Candidates]:
    """Every position of each group where its effect on each line can be extreme (one pass for all).

    The values are those of the search (the point loads' part from the
    polynomials of :func:`events`, to rounding); :func:`exact_sum` evaluates
    the candidates chosen afresh, every load on its face.
    """
    table = _Table.of(groups)
    degree = _degree(groups, lines)
    ev, after, faces = events(table, lines)
    y = ev.knot - ev.anchor
    seg = _segment_effect(table, lines, ev)
    first_of_block = np.ones(y.size, dtype=bool)
    first_of_block[1:] = (ev.g[1:] != ev.g[:-1]) | (ev.r[1:] != ev.r[:-1])
    before = np.where(first_of_block[:, None], 0.0, np.roll(after, 1, axis=0))
    right = seg + horner(after, y)
    left = seg + horner(before, y)
    # an event with a load at a jump is two candidates, one per face; any other is one
    picked = [
        (ev.with_side(np.where(faces, RIGHT, EXACT)), right),
        (ev[faces].with_side(np.full(int(faces.sum()), LEFT)), left[faces]),
    ]
    if degree >= 1 and ev.g.size > 1:
        picked.append(_stationary(table, lines, ev, after, degree))
    fields = ("g", "r", "knot", "anchor", "shift", "side")
    rows = Rows(*(np.concatenate([getattr(p, f) for p, _ in picked]) for f in fields))
    value = np.concatenate([v for _, v in picked])
    out = []
    for k, group in enumerate(groups):
        sel = np.nonzero(rows.g == k)[0]
        sel = sel[np.argsort(rows.r[sel], kind="stable")]
        part = rows[sel]
        a = group.offsets
        first = part.knot + ((a[0] if a else 0.0) - part.anchor) + part.shift
        last = part.knot + ((a[-1] if a else 0.0) - part.anchor) + part.shift
        starts = np.concatenate(([0], np.cumsum(np.bincount(part.r, minlength=lines.size))))
        out.append(
            Candidates(
                part.r, part.knot, part.anchor, part.shift, part.side, value[sel], first, last, starts,
                group, lines,
            )
        )
    return out


def _stationary(table: _Table, lines: Lines, ev: Rows, profile: np.ndarray, degree: int) -> tuple[Rows, np.ndarray]:
    """Candidates strictly between consecutive events of a group on a line where the effect is stationary.

    Between two events every point load stays on one piece of the line, so
    the effect of the point loads there is the polynomial ``profile`` of the
    event before (see :func:`events`); the roots of its derivative in the
    interval are found in closed form, after a check, cheap for a quadratic,
    that it changes sign there at all.  The part of uniform segments, rarer,
    is fitted at Chebyshev nodes.  The values are the search's: the
    polynomial's, and the segments' evaluated.
    """
    y = ev.knot - ev.anchor
    same = (ev.g[1:] == ev.g[:-1]) & (ev.r[1:] == ev.r[:-1])
    width = np.diff(y)
    tol = lines.axle.tol[ev.r[:-1]]
    keep = same & (width > 2 * tol)
    index = np.nonzero(keep)[0]
    base = ev[index]
    width = width[index]
    tol = tol[index]
    rates = np.zeros((index.size, degree + 1))
    if table.counts.any():
        p = profile[index]
        slope = p[:, 1:] * np.arange(1, p.shape[1])[None, :]
        rates[:, : slope.shape[1]] += taylor_shift(slope, y[index])  # in the shift t from the event
    if any(g.segments for g in table.groups):
        u, inverse = _chebyshev(degree + 1)
        half = 0.5 * width
        sampled = _segment_rate(table, lines, base, half[:, None] * (1.0 + u[None, :])) @ inverse.T  # in u
        c = taylor_shift(sampled, -np.ones(half.size))  # in v = t / half
        rates += c / half[:, None] ** np.arange(c.shape[1])[None, :]
    rows_in = np.nonzero(_may_change_sign(rates, width))[0]
    found, t = roots_in_pieces(rates[rows_in], width[rows_in])
    found = rows_in[found]
    inside = (t > tol[found]) & (t < width[found] - tol[found])
    found, t = found[inside], t[inside]
    rows = Rows(base.g[found], base.r[found], base.knot[found], base.anchor[found], t, np.zeros(t.size, dtype=int))
    value = _segment_effect(table, lines, rows)
    if table.counts.any():
        value = value + horner(profile[index][found], y[index][found] + t)
    return rows, value


def _may_change_sign(c: np.ndarray, width: np.ndarray) -> np.ndarray:
    """Rows of polynomials (ascending) that may change sign on ``(0, width)``: exactly for degree 2 or less
    (ends and vertex), every row of a higher degree."""
    if c.shape[1] > 3 and np.any(c[:, 3:]):
        return np.ones(c.shape[0], dtype=bool)
    zero = np.zeros(c.shape[0])
    c0 = c[:, 0]
    c1 = c[:, 1] if c.shape[1] > 1 else zero
    c2 = c[:, 2] if c.shape[1] > 2 else zero
    end = c0 + width * (c1 + c2 * width)
    with np.errstate(divide="ignore", invalid="ignore"):
        vertex = np.where(c2 != 0, -c1 / (2 * c2), -1.0)
    top = c0 + vertex * (c1 + c2 * vertex)
    inside = (vertex > 0) & (vertex < width)
    return (c0 * end <= 0) | (inside & (top * c0 <= 0))


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


def _feasible(prev: dict, cur: dict, lo: float, hi: float, tol: np.ndarray) -> np.ndarray:
    """Which pairs (previous block's candidate, this block's), per line, keep the gap between them within
    ``[lo, hi]`` (tables ``(lines, previous, current)``).

    A gap within ``tol`` of a bound is at the bound; there a limit from the
    left of one block and from the right of the other would move the gap out
    of the range, so that pair is refused.
    """
    gap = cur["first"][:, None, :] - prev["last"][:, :, None]
    tol = tol[:, None, None]
    ok = gap >= lo - tol
    if hi < np.inf:
        ok &= gap <= hi + tol
    sp, sc = prev["side"][:, :, None], cur["side"][:, None, :]
    ok &= ~((np.abs(gap - lo) <= tol) & (sp == RIGHT) & (sc == LEFT))
    if hi < np.inf:
        ok &= ~((np.abs(gap - hi) <= tol) & (sp == LEFT) & (sc == RIGHT))
    return ok


@dataclass(frozen=True)
class ChainSearch:
    """The best placement of a chain on each line: ``value[i]`` for line ``i``, found with pattern
    ``pattern[i]`` and the candidates ``picks[pattern][b, i]`` of its blocks (see :meth:`optimum`)."""

    chain: Chain
    patterns: tuple[Pattern, ...]
    candidates: tuple[tuple[Candidates, ...], ...]
    value: np.ndarray
    pattern: np.ndarray
    picks: tuple[np.ndarray, ...]
    tol: np.ndarray

    def chosen(self, lines: np.ndarray) -> list[tuple[Candidates, np.ndarray, np.ndarray]]:
        """For the lines ``lines``: each block's candidates, the index of the one found, and the line."""
        out = []
        for p in range(len(self.patterns)):
            sel = lines[self.pattern[lines] == p]
            if sel.size:
                for b, cands in enumerate(self.candidates[p]):
                    out.append((cands, cands.starts[sel] + self.picks[p][b, sel], sel))
        return out

    def optimum(self, i: int) -> ChainOptimum:
        """The placement found on line ``i``."""
        p = int(self.pattern[i])
        pattern = self.patterns[p]
        standings = []
        for b, (block, cands) in enumerate(zip(pattern.blocks, self.candidates[p])):
            c = int(cands.starts[i] + self.picks[p][b, i])
            standings.append(
                Standing(
                    block,
                    pattern.members[b],
                    float(cands.knot[c]),
                    float(cands.anchor[c]),
                    float(cands.shift[c]),
                    int(cands.side[c]),
                )
            )
        found = tuple(standings)
        return ChainOptimum(float(self.value[i]), found, chain_gaps(self.chain, found, float(self.tol[i])))


def exact_sum(chosen: list[tuple[Candidates, np.ndarray, np.ndarray]], size: int) -> np.ndarray:
    """The effect of the chosen candidates evaluated afresh (every load on its face), summed per line: one
    evaluation for all of them."""
    out = np.zeros(size)
    if not chosen:
        return out
    table = _Table.of(tuple(c.group for c, _, _ in chosen))
    g = np.concatenate([np.full(i.size, k) for k, (_, i, _) in enumerate(chosen)])
    names = ("line", "knot", "anchor", "shift", "side")
    rows = Rows(g, *(np.concatenate([getattr(c, f)[i] for c, i, _ in chosen]) for f in names))
    values = effect(table, chosen[0][0].lines, rows)
    np.add.at(out, np.concatenate([lines for _, _, lines in chosen]), values)
    return out


def best_in_chain(
    chain: Chain, find: Callable[[Group], Candidates], sense: np.ndarray, tol: np.ndarray
) -> ChainSearch:
    """Largest (``sense[i]=1``) or smallest (``-1``) effect of a chain whose parts can all be on the beam
    together (see :func:`split`), on every line ``i`` at once.

    ``find(group)`` returns the :class:`Candidates` of a group on the lines
    (the caller caches them); ``tol`` is each line's tolerance.  Every
    pattern of gaps held at a bound or left free is searched.
    """
    found = patterns(chain)
    cands, values, picks = [], [], []
    for pattern in found:
        blocks = tuple(find(b) for b in pattern.blocks)
        value, pick = _best_for_pattern(pattern, blocks, sense, tol)
        cands.append(blocks)
        values.append(value)
        picks.append(pick)
    table = np.vstack(values)  # (patterns, lines), -inf where no placement
    best = np.argmax(sense[None, :] * table, axis=0)  # the first pattern among equals
    value = table[best, np.arange(table.shape[1])]
    return ChainSearch(chain, found, tuple(cands), value, best, tuple(picks), tol)


def _best_for_pattern(
    pattern: Pattern, blocks: tuple[Candidates, ...], sense: np.ndarray, tol: np.ndarray
) -> tuple[np.ndarray, np.ndarray]:
    """Best value of one pattern on every line (``-sense inf`` where none) and the candidate of each block
    (an index among the line's candidates)."""
    tables = [{f: c.padded(f, fill) for f, fill in (("first", 0.0), ("last", 0.0), ("side", 0))} for c in blocks]
    scores = [np.where(c._layout[1], sense[:, None] * c.padded("value", 0.0), -np.inf) for c in blocks]
    n = scores[0].shape[0]
    score = scores[0]
    back: list[np.ndarray] = []
    for b in range(1, len(blocks)):
        lo, hi = pattern.free_gaps[b - 1]
        width = scores[b].shape[1]
        arg = np.zeros((n, width), dtype=int)
        new = np.full((n, width), -np.inf)
        step = max(1, MATRIX_LIMIT // max(score.shape[1] * width, 1))
        for start in range(0, n, step):  # lines in batches, so that the table of pairs stays bounded
            sl = slice(start, start + step)
            prev = {f: t[sl] for f, t in tables[b - 1].items()}
            cur = {f: t[sl] for f, t in tables[b].items()}
            ok = _feasible(prev, cur, lo, hi, tol[sl])
            total = np.where(ok, score[sl][:, :, None], -np.inf)
            arg[sl] = total.argmax(axis=1)
            new[sl] = np.take_along_axis(total, arg[sl][:, None, :], axis=1)[:, 0, :] + scores[b][sl]
        score = new
        back.append(arg)
    last = score.argmax(axis=1)
    best = score[np.arange(n), last]
    pick = np.zeros((len(blocks), n), dtype=int)
    pick[-1] = last
    for b in range(len(blocks) - 1, 0, -1):
        pick[b - 1] = back[b - 1][np.arange(n), pick[b]]
    return sense * best, pick


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


def cost(chain: Chain, lines: Lines) -> Cost:
    """The cost of searching ``chain`` (one part of a split chain) on one of the lines (the longest search
    among them), before any search is done."""
    work, knots, widest = 0.0, 0, 0
    sizes = []
    length = float(lines.plain.length.max())
    for g in chain.groups:
        k = int(lines.axle.counts.max()) if g.offsets else 0
        k_seg = sum(2 * int(lines.segment(s).counts.max()) for s in g.segments)
        w = on_beam_at_once(g, length)
        nodes = max(_degree((g,), lines) + 2, 2)
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
