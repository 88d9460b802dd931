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
nodes and solved by bisection on its monotone stretches.  For
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

import itertools
from dataclasses import dataclass
from typing import TYPE_CHECKING

import numpy as np

if TYPE_CHECKING:  # pragma: no cover
    from ilkit.influence import InfluenceLine

__all__ = ["Segment", "Group", "Chain", "Candidates", "ChainOptimum", "candidates", "best_in_chain"]

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
    """Positions ``y`` of a group worth checking, the side of the limit taken and the effect there."""

    y: np.ndarray
    side: np.ndarray
    value: np.ndarray


@dataclass(frozen=True)
class ChainOptimum:
    """Best placement of a chain: value, position and side of every group, the gaps used."""

    value: float
    positions: tuple[float, ...]
    sides: tuple[int, ...]
    gaps: tuple[float, ...]


# ------------------------------------------------------------------ one group
def _effect(group: Group, axle_line: InfluenceLine, seg_lines: tuple[InfluenceLine, ...], y: np.ndarray, side: int):
    total = np.zeros_like(y)
    if group.offsets:
        xs = y[:, None] + np.asarray(group.offsets)[None, :]
        if side == LEFT:
            vals = axle_line.left(xs)
        elif side == RIGHT:
            vals = axle_line.right(xs)
        else:
            vals = axle_line(xs)
        total = total + vals @ np.asarray(group.loads)
    for seg, h in zip(group.segments, seg_lines):
        total = total + seg.intensity * (h.cumulative(y + seg.end) - h.cumulative(y + seg.start))
    return total


def _rate(group: Group, axle_line: InfluenceLine, seg_lines: tuple[InfluenceLine, ...], y: np.ndarray):
    """Derivative of the effect with respect to the group position (inside intervals)."""
    total = np.zeros_like(y)
    if group.offsets:
        xs = y[..., None] + np.asarray(group.offsets)
        total = total + axle_line.slope(xs) @ np.asarray(group.loads)
    for seg, h in zip(group.segments, seg_lines):
        for end, sign in ((seg.end, 1.0), (seg.start, -1.0)):
            if np.isfinite(end):  # an end at infinity is off the beam: ordinate 0
                total = total + sign * seg.intensity * h(y + end)
    return total


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
    events = []
    if group.offsets:
        events.append((np.asarray(axle_line.breakpoints)[:, None] - np.asarray(group.offsets)[None, :]).ravel())
    for seg, h in zip(group.segments, seg_lines):
        knots = np.asarray(h.breakpoints)
        for end in (seg.start, seg.end):
            if np.isfinite(end):
                events.append(knots - end)
    y = np.unique(np.concatenate(events))
    left = _effect(group, axle_line, seg_lines, y, LEFT)
    right = _effect(group, axle_line, seg_lines, y, RIGHT)
    scale = max(1.0, float(np.abs(left).max(initial=0.0)), float(np.abs(right).max(initial=0.0)))
    jump = np.abs(left - right) > 1e-12 * scale
    ys = [y, y[jump]]
    sides = [np.where(jump, RIGHT, EXACT), np.full(int(jump.sum()), LEFT)]
    values = [right, left[jump]]

    degree = -1
    if group.offsets:
        degree = axle_line.degree - 1
    if group.segments:
        degree = max(degree, *(h.degree for h in seg_lines))
    if degree >= 1 and y.size > 1:
        roots = _stationary(group, axle_line, seg_lines, y, degree)
        if roots.size:
            ys.append(roots)
            sides.append(np.full(roots.size, EXACT))
            values.append(_effect(group, axle_line, seg_lines, roots, EXACT))
    return Candidates(np.concatenate(ys), np.concatenate(sides), np.concatenate(values))


def _stationary(group, axle_line, seg_lines, events: np.ndarray, degree: int) -> np.ndarray:
    lo, hi = events[:-1], events[1:]
    keep = hi - lo > 1e-12 * max(1.0, float(np.abs(events).max()))
    lo, hi = lo[keep], hi[keep]
    mid, half = 0.5 * (lo + hi), 0.5 * (hi - lo)
    u, inverse = _chebyshev(degree + 1)
    rates = _rate(group, axle_line, seg_lines, mid[:, None] + half[:, None] * u[None, :])
    coefficients = rates @ inverse.T  # ascending powers of u, one row per interval
    rows, roots = unit_roots(coefficients)
    return mid[rows] + half[rows] * roots


# -------------------------------------------------------------- polynomials
def _polyval(coefficients: np.ndarray, u: np.ndarray) -> np.ndarray:
    out = np.zeros_like(u)
    for k in range(coefficients.shape[1] - 1, -1, -1):
        out = out * u + coefficients[:, k]
    return out


def unit_roots(coefficients: np.ndarray) -> tuple[np.ndarray, np.ndarray]:
    """Real roots inside (-1, 1) of polynomials of degree <= 3 (one row of ascending coefficients each).

    Returns the row index and the root of each.  The polynomial is split at
    the roots of its derivative into monotone stretches; a stretch whose ends
    differ in sign holds one root, found by bisection to rounding.
    """
    n, width = coefficients.shape
    if width <= 1 or n == 0:
        return np.zeros(0, dtype=int), np.zeros(0)
    if width == 2:
        c0, c1 = coefficients[:, 0], coefficients[:, 1]
        with np.errstate(divide="ignore", invalid="ignore"):
            r = np.where(c1 != 0, -c0 / np.where(c1 != 0, c1, 1.0), np.nan)
        ok = (r > -1) & (r < 1)
        return np.nonzero(ok)[0], r[ok]
    derivative = coefficients[:, 1:] * np.arange(1, width)[None, :]
    rows_d, crit = unit_roots(derivative)
    cuts = np.full((n, width), np.nan)  # at most width-2 critical points, plus the ends
    cuts[:, 0] = -1.0
    count = np.ones(n, dtype=int)
    for r, c in sorted(zip(rows_d.tolist(), crit.tolist())):
        cuts[r, count[r]] = c
        count[r] += 1
    cuts[np.arange(n), count] = 1.0
    rows_out, roots_out = [], []
    for k in range(width - 1):
        a, b = cuts[:, k], cuts[:, k + 1]
        valid = ~np.isnan(a) & ~np.isnan(b) & (b > a)
        fa = _polyval(coefficients, np.where(valid, a, 0.0))
        fb = _polyval(coefficients, np.where(valid, b, 0.0))
        change = valid & (np.sign(fa) * np.sign(fb) < 0)
        idx = np.nonzero(change)[0]
        if idx.size == 0:
            continue
        lo, hi, flo = a[idx], b[idx], fa[idx]
        sub = coefficients[idx]
        for _ in range(60):
            m = 0.5 * (lo + hi)
            fm = _polyval(sub, m)
            same = np.sign(fm) == np.sign(flo)
            lo = np.where(same, m, lo)
            flo = np.where(same, fm, flo)
            hi = np.where(same, hi, m)
        rows_out.append(idx)
        roots_out.append(0.5 * (lo + hi))
    if not rows_out:
        return np.zeros(0, dtype=int), np.zeros(0)
    return np.concatenate(rows_out), np.concatenate(roots_out)


# --------------------------------------------------------------------- chains



def best_in_chain(chain: Chain, find, sense: int) -> ChainOptimum:
    """Largest (``sense=1``) or smallest (``sense=-1``) effect of a chain.

    ``find(group)`` returns the :class:`Candidates` of a group (the caller
    caches them).  Every pattern of gaps held at a bound or left free is
    searched.
    """
    choices = []
    for lo, hi in chain.gaps:
        options: list[str] = ["lo"]
        if np.isfinite(hi) and hi > lo:
            options.append("hi")
        if hi > lo:
            options.append("free")
        choices.append(options)
    best: ChainOptimum | None = None
    for pattern in itertools.product(*choices):
        result = _best_for_pattern(chain, pattern, find, sense)
        if result is not None and (best is None or sense * result.value > sense * best.value):
            best = result
    assert best is not None
    return best


def _best_for_pattern(chain: Chain, pattern: tuple[str, ...], find, sense: int) -> ChainOptimum | None:
    # merge groups joined by gaps held at a bound
    blocks: list[Group] = [chain.groups[0]]
    members: list[list[tuple[int, float]]] = [[(0, 0.0)]]  # (group index, offset within block)
    free_gaps: list[tuple[float, float]] = []
    for k, option in enumerate(pattern):
        lo, hi = chain.gaps[k]
        nxt = chain.groups[k + 1]
        if option == "free":
            blocks.append(nxt)
            members.append([(k + 1, 0.0)])
            free_gaps.append((lo, hi))
        else:
            gap = lo if option == "lo" else hi
            shift = blocks[-1].extent + gap
            blocks[-1] = blocks[-1].joined(nxt, gap)
            members[-1].append((k + 1, shift))
    cands = [find(b) for b in blocks]
    # dynamic programming along the blocks
    score = sense * cands[0].value
    back: list[np.ndarray] = []
    for b in range(1, len(blocks)):
        prev, cur = cands[b - 1], cands[b]
        lo, hi = free_gaps[b - 1]
        gap = cur.y[None, :] - (prev.y[:, None] + blocks[b - 1].extent)
        tol = 1e-9 * max(1.0, abs(lo), abs(hi) if np.isfinite(hi) else 0.0)
        ok = (gap >= lo - tol) & (gap <= hi + tol)
        # a limit from the left of one block and the right of the other moves the gap:
        # it must not leave the allowed range
        sp, sc = prev.side[:, None], cur.side[None, :]
        ok &= ~((np.abs(gap - lo) <= tol) & (sp == RIGHT) & (sc == LEFT))
        if np.isfinite(hi):
            ok &= ~((np.abs(gap - hi) <= tol) & (sp == LEFT) & (sc == RIGHT))
        total = np.where(ok, score[:, None], -np.inf)
        arg = np.argmax(total, axis=0)
        score = total[arg, np.arange(cur.y.size)] + sense * cur.value
        back.append(arg)
    last = int(np.argmax(score))
    if not np.isfinite(score[last]):
        return None
    picks = [last]
    for arg in reversed(back):
        picks.append(int(arg[picks[-1]]))
    picks.reverse()
    positions = [0.0] * len(chain.groups)
    sides = [EXACT] * len(chain.groups)
    for b, pick in enumerate(picks):
        for g, shift in members[b]:
            positions[g] = float(cands[b].y[pick]) + shift
            sides[g] = int(cands[b].side[pick])
    gaps = tuple(positions[k + 1] - positions[k] - chain.groups[k].extent for k in range(len(chain.gaps)))
    return ChainOptimum(float(sense * score[last]), tuple(positions), tuple(sides), gaps)
