"""The worst placement of a chain by one dynamic programme over the groups (internal).

A chain is groups ``0..K`` with the gap after group ``b`` (from its last point
load to the next group's first) within ``[lo_b, hi_b]``.  With ``y_b`` the
position of group ``b`` and ``f_b(y)`` its effect (sense included, so that
the largest is wanted), the best of groups ``0..b`` with group ``b`` at ``y``
is

    V_0 = f_0,    V_b(y) = f_b(y) + M_{b-1}(y),    M_b(y) = sup of V_b over the window (y - T_b, y - S_b),

with ``S_b = extent_b + lo_b`` and ``T_b = extent_b + hi_b`` (``inf`` allowed).
The answer is the supremum of ``V_K``.  Each function is held exactly as
polynomial pieces between breakpoints: ``f_b`` between its events (fitted at
Chebyshev nodes, exact for a polynomial of its degree), ``M_b`` as the upper
envelope, on each stretch where nothing enters or leaves the window, of
three things: ``V_b`` followed at the right end of the window (the gap held at
``lo``), at the left end (held at ``hi``), and the largest value wholly inside
the window (one-sided limits at breakpoints and stationary points: the gap
free).  So held and free gaps are handled in the same step, and the work
grows with the number of pieces, not with ``3^K`` patterns of held and free
gaps.  Limits from either side are kept apart at every breakpoint, which is
what placing a load on one face of a jump needs.  Tracing back which of the
three gave the supremum places every group.
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

from ilkit._poly import horner, roots_in_pieces, taylor_shift
from ilkit.loads import _search
from ilkit.loads._search import EXACT, LEFT, RIGHT, Chain, ChainOptimum, Group, Lines, Standing

__all__ = ["best_by_programme"]

FOLLOW_LO, FOLLOW_HI, INSIDE = 0, 1, 2


@dataclass(frozen=True)
class Pieces:
    """A function of position as polynomial pieces.

    ``x`` are the breakpoints; piece ``i`` (``0..len(x)``) runs from
    ``x[i-1]`` to ``x[i]`` (``-inf`` and ``inf`` at the ends) and is
    ``sum c[i, k] u^k`` with ``u = y - origin[i]`` (its left breakpoint; the
    first breakpoint for piece 0).  The two end pieces are constants.
    ``source[i]`` and ``index[i]`` say where a piece of a window supremum
    comes from (see :func:`_dilate`), or which piece of the added function
    a piece of a sum holds (see :func:`_add`).
    """

    x: np.ndarray
    c: np.ndarray
    source: np.ndarray | None = None
    index: np.ndarray | None = None

    @property
    def origin(self) -> np.ndarray:
        return np.concatenate((self.x[:1], self.x)) if self.x.size else np.zeros(1)

    @property
    def bounds(self) -> tuple[np.ndarray, np.ndarray]:
        lo = np.concatenate(([-np.inf], self.x))
        hi = np.concatenate((self.x, [np.inf]))
        return lo, hi

    def locate(self, y: float, side: int, tol: float) -> int:
        """The piece holding ``y`` on ``side`` (a breakpoint within ``tol`` counts as ``y``)."""
        k = int(np.searchsorted(self.x, y))
        near = [j for j in (k - 1, k) if 0 <= j < self.x.size and abs(self.x[j] - y) <= tol]
        if near:
            j = near[0]
            return j if side == LEFT else j + 1
        return k

    def at(self, i: np.ndarray, y: np.ndarray) -> np.ndarray:
        """Piece ``i`` at ``y`` (arrays of the same shape)."""
        return horner(self.c[i], y - self.origin[i])






def _widen(c: np.ndarray, width: int) -> np.ndarray:
    return c if c.shape[1] >= width else np.pad(c, ((0, 0), (0, width - c.shape[1])))


def _merge_close(x: np.ndarray, tol: float) -> np.ndarray:
    """Sorted unique breakpoints, those within ``tol`` of the one before left out."""
    x = np.unique(x[np.isfinite(x)])
    if x.size < 2:
        return x
    keep = np.ones(x.size, dtype=bool)
    last = x[0]
    for k in range(1, x.size):  # a run of close points is one point, wherever it ends
        if x[k] - last <= tol:
            keep[k] = False
        else:
            last = x[k]
    return x[keep]


# ---------------------------------------------------------------- one group
def _profile(group: Group, lines: Lines, sense: int, reach: float) -> tuple[Pieces, np.ndarray, np.ndarray]:
    """``sense`` times the effect of ``group`` as pieces between its events, with the events' knots and anchors.

    ``reach`` is a distance that takes every load of the group off the beam.
    """
    table = _search._Table.of((group,))
    ev, _, _ = _search.events(table, lines)
    knot, anchor = ev.knot, ev.anchor
    y = knot - anchor
    degree = max(_search._degree((group,), lines) + 1, 0)
    nodes, inverse = _search._chebyshev(degree + 1)
    width = np.diff(y)
    half = 0.5 * width
    shift = half[:, None] * (1.0 + nodes[None, :])
    k2 = np.repeat(knot[:-1], nodes.size)
    a2 = np.repeat(anchor[:-1], nodes.size)
    values = _effect(group, lines, k2, a2, shift.ravel(), np.zeros(k2.size, dtype=int))
    inner = (values.reshape(shift.shape) @ inverse.T) * sense  # in u' = (shift - half) / half
    # to the local coordinate u = shift: p(u') with u' = u / half - 1
    c = taylor_shift(inner, -np.ones(inner.shape[0]))
    c = c / half[:, None] ** np.arange(c.shape[1])[None, :]
    ends = _effect(group, lines, knot[[0, -1]], anchor[[0, -1]], np.array([-reach, reach]), np.zeros(2, dtype=int))
    pieces = np.zeros((y.size + 1, c.shape[1]))
    pieces[1:-1] = c
    pieces[0, 0], pieces[-1, 0] = sense * ends[0], sense * ends[1]
    return Pieces(y, pieces), knot, anchor


def _effect(group: Group, lines: Lines, knot, anchor, shift, side) -> np.ndarray:
    """Effect of ``group`` on the one line of ``lines``, standing as the candidates say."""
    zero = np.zeros(np.size(knot), dtype=int)
    rows = _search.Rows(zero, zero, np.asarray(knot, float), np.asarray(anchor, float), np.asarray(shift, float),
                        np.asarray(side, int))
    return _search.effect(_search._Table.of((group,)), lines, rows)


# ------------------------------------------------------------ window supremum
def _sparse_max(values: np.ndarray) -> list[np.ndarray]:
    """Tables of the largest of ``values[i : i + 2^k]`` (argument indices), for range queries."""
    levels = [np.arange(values.size)]
    span = 1
    while 2 * span <= values.size:
        prev = levels[-1]
        a, b = prev[:-span], prev[span:]
        levels.append(np.where(values[a] >= values[b], a, b))
        span *= 2
    return levels


def _range_max(values: np.ndarray, levels: list[np.ndarray], lo: np.ndarray, hi: np.ndarray) -> np.ndarray:
    """Index of the largest value in ``values[lo:hi]`` per query (-1 where the range is empty)."""
    out = np.full(lo.size, -1)
    n = hi - lo
    ok = n > 0
    if not ok.any():
        return out
    k = np.zeros(lo.size, dtype=int)
    k[ok] = np.floor(np.log2(n[ok])).astype(int)
    for level in np.unique(k[ok]):
        sel = ok & (k == level)
        table = levels[level]
        a, b = table[lo[sel]], table[hi[sel] - (1 << level)]
        out[sel] = np.where(values[a] >= values[b], a, b)
    return out


@dataclass(frozen=True)
class _Points:
    """Values a function reaches at single points: one-sided limits at breakpoints, stationary points."""

    z: np.ndarray
    value: np.ndarray
    side: np.ndarray
    piece: np.ndarray


def _points(f: Pieces, tol: float) -> _Points:
    """Every one-sided limit at a breakpoint and every stationary value inside a piece, ordered by position."""
    n = f.x.size
    i_left = np.arange(n)  # piece ending at x[k]
    i_right = np.arange(1, n + 1)  # piece starting at x[k]
    zs = [f.x, f.x]
    vals = [f.at(i_left, f.x), f.at(i_right, f.x)]
    sides = [np.full(n, LEFT), np.full(n, RIGHT)]
    pieces = [i_left, i_right]
    if n >= 2 and f.c.shape[1] > 2:
        inner = np.arange(1, n)
        width = f.x[1:] - f.x[:-1]
        derivative = f.c[inner, 1:] * np.arange(1, f.c.shape[1])[None, :]
        rows, t = roots_in_pieces(derivative, width)
        ok = (t > tol) & (t < width[rows] - tol)
        rows, t = rows[ok], t[ok]
        zs.append(f.x[rows] + t)
        vals.append(f.at(inner[rows], f.x[rows] + t))
        sides.append(np.full(t.size, EXACT))
        pieces.append(inner[rows])
    z, value, side, piece = (np.concatenate(a) for a in (zs, vals, sides, pieces))
    order = np.argsort(z, kind="stable")
    return _Points(z[order], value[order], side[order], piece[order])


def _dilate(v: Pieces, low: float, high: float, tol: float, reach: float) -> tuple[Pieces, _Points]:
    """``M(y)``, the supremum of ``v`` over ``(y - high, y - low)``, as pieces with their sources.

    ``source`` is ``FOLLOW_LO`` (``v(y - low)``: the window's right end,
    ``index`` the piece of ``v``), ``FOLLOW_HI`` (``v(y - high)``) or
    ``INSIDE`` (``index`` a point of the returned :class:`_Points`).
    """
    points = _points(v, tol)
    finite = np.isfinite(high)
    cuts = [v.x + low, points.z + low]
    if finite:
        cuts += [v.x + high, points.z + high]
    e = _merge_close(np.concatenate(cuts), tol)
    # a point inside each stretch between cuts (beyond the ends: a reach away)
    if e.size:
        mids = np.concatenate(([e[0] - reach], 0.5 * (e[:-1] + e[1:]), [e[-1] + reach]))
    else:
        mids = np.zeros(1)
    lo_piece = np.searchsorted(v.x, mids - low)
    hi_piece = np.searchsorted(v.x, mids - high) if finite else None
    levels = _sparse_max(points.value)
    first = np.searchsorted(points.z, mids - high, side="right") if finite else np.zeros(mids.size, dtype=int)
    stop = np.searchsorted(points.z, mids - low, side="left")
    best = _range_max(points.value, levels, first, stop)
    const = np.where(best >= 0, points.value[np.maximum(best, 0)], -np.inf)

    width = v.c.shape[1]
    origin = v.origin
    starts = np.concatenate(([-np.inf], e))
    # the candidates on each stretch, as polynomials in u = y - start (constants on the infinite ends)
    base = np.where(np.isfinite(starts), starts, mids)
    follow_lo = taylor_shift(v.c[lo_piece], base - low - origin[lo_piece])
    options = [(FOLLOW_LO, lo_piece, follow_lo)]
    if finite:
        follow_hi = taylor_shift(v.c[hi_piece], base - high - origin[hi_piece])
        options.append((FOLLOW_HI, hi_piece, follow_hi))
    inside = np.zeros((mids.size, width))
    inside[:, 0] = np.where(np.isfinite(const), const, 0.0)
    has_inside = np.isfinite(const)
    # crossings of every pair on the finite stretches
    span = np.diff(e) if e.size else np.zeros(0)
    cut_rows, cut_at = [], []
    stretch = np.arange(1, e.size)  # finite stretches
    polys = [p for _, _, p in options] + [inside]
    for i in range(len(polys)):
        for j in range(i + 1, len(polys)):
            diff = polys[i][stretch] - polys[j][stretch]
            if j == len(polys) - 1:
                keep = has_inside[stretch]
                rows, t = roots_in_pieces(diff[keep], span[keep])
                rows = stretch[keep][rows]
            else:
                rows, t = roots_in_pieces(diff, span)
                rows = stretch[rows]
            ok = (t > tol) & (t < span[rows - 1] - tol)
            cut_rows.append(rows[ok])
            cut_at.append(t[ok])
    rows = np.concatenate([np.arange(mids.size), *cut_rows])
    local = np.concatenate([np.zeros(mids.size), *cut_at])
    order = np.lexsort((local, rows))
    rows, local = rows[order], local[order]
    # sub-stretches: from each cut to the next one of the same stretch (or its end)
    end = np.append(local[1:], np.inf)
    last = np.append(rows[1:] != rows[:-1], True)
    stretch_end = np.concatenate(([np.inf], span, [np.inf]))[rows]  # the two end stretches are infinite
    end = np.where(last, stretch_end, end)
    probe = np.where(np.isfinite(end), 0.5 * (local + end), local + 1.0)
    probe = np.where(np.isfinite(starts[rows]), probe, 0.0)
    values = [horner(p[rows], probe) for p in polys]
    values[-1] = np.where(has_inside[rows], values[-1], -np.inf)
    choice = np.argmax(np.vstack(values), axis=0)
    kinds = np.array([k for k, _, _ in options] + [INSIDE])
    source = kinds[choice]
    indices = np.vstack([idx[rows] for _, idx, _ in options] + [best[rows]])
    index = indices[choice, np.arange(rows.size)]
    coeffs = np.stack([p[rows] for p in polys])[choice, np.arange(rows.size)]
    # the piece in the local coordinate of its own start
    coeffs = np.where(np.isfinite(starts[rows])[:, None], taylor_shift(coeffs, local), coeffs)
    x = np.where(np.isfinite(starts[rows]), starts[rows] + local, -np.inf)[1:]
    # neighbours with the same source are one piece
    same = (source[1:] == source[:-1]) & (index[1:] == index[:-1])
    keep = np.concatenate(([True], ~same))
    c = coeffs[keep]
    c[0, 1:] = 0.0  # the end pieces are constants
    c[-1, 1:] = 0.0
    return Pieces(x[~same], c, source[keep], index[keep]), points


def _add(f: Pieces, g: Pieces, tol: float) -> Pieces:
    """``f + g`` as pieces; ``index[i]`` is the piece of ``g`` under piece ``i``."""
    x = _merge_close(np.concatenate((f.x, g.x)), tol)
    lo = np.concatenate(([-np.inf], x))
    hi = np.concatenate((x, [np.inf]))
    with np.errstate(invalid="ignore"):
        mid = np.where(
            np.isfinite(lo) & np.isfinite(hi),
            0.5 * (lo + hi),
            np.where(np.isfinite(lo), lo + np.abs(lo) + 1.0, hi - np.abs(hi) - 1.0),
        )
    if not x.size:
        mid = np.zeros(1)
    i_f = np.searchsorted(f.x, mid)
    i_g = np.searchsorted(g.x, mid)
    origin = np.concatenate((x[:1], x)) if x.size else np.zeros(1)
    width = max(f.c.shape[1], g.c.shape[1])
    cf = taylor_shift(_widen(f.c[i_f], width), origin - f.origin[i_f])
    cg = taylor_shift(_widen(g.c[i_g], width), origin - g.origin[i_g])
    c = cf + cg
    c[0, 1:] = 0.0
    c[-1, 1:] = 0.0
    return Pieces(x, c, None, i_g)


def _supremum(v: Pieces, tol: float, reach: float) -> tuple[float, float, int]:
    """The largest value of ``v`` (a one-sided limit or a stationary value), its position and side."""
    points = _points(v, tol)
    values = [points.value]
    where = [points.z]
    sides = [points.side]
    if v.x.size:
        values.append(v.c[[0, -1], 0])
        where.append(np.array([v.x[0] - reach, v.x[-1] + reach]))
        sides.append(np.array([EXACT, EXACT]))
    else:
        values.append(v.c[:1, 0])
        where.append(np.zeros(1))
        sides.append(np.array([EXACT]))
    value, z, side = (np.concatenate(a) for a in (values, where, sides))
    k = int(np.argmax(value))
    return float(value[k]), float(z[k]), int(side[k])


# ----------------------------------------------------------------- the chain
def _stand(member: int, group: Group, events: tuple[np.ndarray, np.ndarray], y: float, side: int,
           tol: float) -> Standing:
    """Group ``member`` at position ``y`` on ``side``, measured from an event of it: exactly at the event
    when within ``tol`` of it, else from the event before."""
    knot, anchor = events
    ys = knot - anchor
    k = int(np.searchsorted(ys, y))
    near = min((j for j in (k - 1, k) if 0 <= j < ys.size), key=lambda j: abs(ys[j] - y))
    j, shift = (near, 0.0) if abs(ys[near] - y) <= tol else (max(k - 1, 0), y - float(ys[max(k - 1, 0)]))
    return Standing(group, ((member, 0.0),), float(knot[j]), float(anchor[j]), shift, side)


def best_by_programme(chain: Chain, lines: Lines, sense: int) -> ChainOptimum:
    """Largest (``sense=1``) or smallest (``sense=-1``) effect of a chain whose groups can all be on the
    beam together, on the one line of ``lines``, by the dynamic programme of this module."""
    groups = chain.groups
    tol = float(lines.plain.tol[0])
    length = float(lines.plain.length[0])
    reach = 2.0 * (length + sum(g.reach[1] - g.reach[0] for g in groups if np.isfinite(g.reach).all()) + 1.0)
    profiles = [_profile(g, lines, sense, reach) for g in groups]
    v = profiles[0][0]
    stages = []  # (window supremum, its points, the sum) for each group after the first
    for b in range(1, len(groups)):
        lo, hi = chain.gaps[b - 1]
        e = groups[b - 1].extent
        m, points = _dilate(v, e + lo, e + hi, tol, reach)
        v = _add(profiles[b][0], m, tol)
        stages.append((m, points, v))
    _, y, side = _supremum(v, tol, reach)
    placed: list[tuple[float, int]] = [(y, side)]
    for b in range(len(groups) - 1, 0, -1):
        m, points, vb = stages[b - 1]
        prev = stages[b - 2][2] if b >= 2 else profiles[0][0]
        i = vb.locate(y, side, tol)
        j = int(vb.index[i])
        lo, hi = chain.gaps[b - 1]
        e = groups[b - 1].extent
        kind, k = int(m.source[j]), int(m.index[j])
        if kind == INSIDE:
            y, side = float(points.z[k]), int(points.side[k])
        else:
            y = y - (e + (lo if kind == FOLLOW_LO else hi))
            plo, phi = prev.bounds
            side = LEFT if abs(phi[k] - y) <= tol else RIGHT if abs(plo[k] - y) <= tol else side
        placed.append((y, side))
    placed.reverse()
    standings = tuple(
        _stand(b, g, (knot, anchor), y, s, tol)
        for b, (g, (_, knot, anchor), (y, s)) in enumerate(zip(groups, profiles, placed))
    )
    # the value where the groups stand, evaluated exactly (the pieces were fitted)
    total = 0.0
    for g, s in zip(groups, standings):
        total += float(_effect(g, lines, [s.knot], [s.anchor], [s.shift], [s.side])[0])
    return ChainOptimum(total, standings, _search.chain_gaps(chain, standings, tol))
