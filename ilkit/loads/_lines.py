"""Many influence lines at once, as padded arrays (internal).

The placement search runs on all the lines of an envelope in one pass: the
lines' knots and polynomial pieces are stacked in arrays padded to the
longest line, and every evaluation takes, beside the positions, the index of
the line each position belongs to.  Evaluations repeat the arithmetic of
:class:`ilkit.influence.InfluenceLine` (Horner's rule in the local
coordinate of a piece, the same conventions at knots and off the beam), so a
line in a set gives the same ordinates as the line itself.

A position within :data:`COINCIDENT` times its line's length of a knot *is*
that knot (:meth:`LineSet.snap`); where the line jumps there the ordinate is
the one of the face asked for (:meth:`LineSet.ordinates`).  The signed parts
of all the lines (the line where it has one sign, 0 elsewhere: what a load
placed only where it adds sees) come from one search for the roots of all
their pieces (:meth:`LineSet.signed`).
"""

from __future__ import annotations

import functools
from collections.abc import Sequence
from typing import TYPE_CHECKING

import numpy as np

from ilkit._poly import horner, roots_in_pieces, taylor_shift

if TYPE_CHECKING:  # pragma: no cover
    from ilkit.influence import InfluenceLine

__all__ = ["COINCIDENT", "JUMP", "LEFT", "EXACT", "RIGHT", "LineSet"]

LEFT, EXACT, RIGHT = -1, 0, 1

COINCIDENT = 1e-10
"""Two positions closer than this fraction of the line length are one point (a load standing within
rounding of a knot stands at the knot).  Below the beam's merge tolerance (``ilkit.positions``), so two
knots of a line are never within it of one position."""

JUMP = 1e-9
"""A knot where the one-sided ordinates differ by more than this fraction of the largest ordinate is a jump."""


class LineSet:
    """Lines as padded arrays.

    ``knots[i, :count[i]]`` are the knots of line ``i`` (``inf`` beyond);
    ``coef[i, j]`` the ascending coefficients of its piece ``j`` in
    ``t = x - knots[i, j]`` (zeros beyond); ``left``/``right`` the one-sided
    ordinates at the knots (0 off the beam) and ``jumps`` where they differ.
    """

    def __init__(self, knots: np.ndarray, counts: np.ndarray, coef: np.ndarray) -> None:
        self.knots = knots
        self.counts = counts
        self.coef = coef
        n = knots.shape[0]
        rows = np.arange(n)
        self.length = knots[rows, counts - 1]
        self.tol = COINCIDENT * self.length
        self.degree = coef.shape[2] - 1
        # one-sided ordinates at the knots
        k = knots.shape[1]
        left = np.zeros((n, k))
        right = np.zeros((n, k))
        if k > 1:
            width = _widths(knots)
            ends = horner(coef, width)  # piece j at its right end
            left[:, 1:] = ends
            right[:, :-1] = coef[:, :, 0]
        valid = np.arange(k)[None, :] < counts[:, None]
        last = np.arange(k)[None, :] == (counts - 1)[:, None]
        right = np.where(last | ~valid, 0.0, right)
        left = np.where(valid, left, 0.0)
        self.left, self.right = left, right
        scale = np.maximum(np.abs(left).max(axis=1), np.abs(right).max(axis=1))
        self.jumps = valid & (np.abs(left - right) > JUMP * scale[:, None])

    @classmethod
    def of(cls, lines: Sequence[InfluenceLine]) -> LineSet:
        """The set of ``lines`` (cached on a single line)."""
        if len(lines) == 1:
            cached = lines[0].__dict__.get("_line_set")
            if cached is not None:
                return cached
        counts = np.array([len(line.breakpoints) for line in lines])
        width = int(counts.max())
        degree = max(line.degree for line in lines)
        knots = np.full((len(lines), width), np.inf)
        coef = np.zeros((len(lines), max(width - 1, 1), degree + 1))
        for i, line in enumerate(lines):
            knots[i, : counts[i]] = line.breakpoints
            table = _coefficients(line)  # (degree + 1, pieces)
            coef[i, : table.shape[1], : table.shape[0]] = table.T
        out = cls(knots, counts, coef)
        if len(lines) == 1:
            lines[0].__dict__["_line_set"] = out
        return out

    @property
    def size(self) -> int:
        return int(self.knots.shape[0])

    @functools.cached_property
    def valid(self) -> tuple[np.ndarray, np.ndarray]:
        """Line and index of every knot, line by line."""
        return np.nonzero(np.arange(self.knots.shape[1])[None, :] < self.counts[:, None])

    def subset(self, rows: np.ndarray) -> LineSet:
        """The lines ``rows`` (in that order; a line may come more than once)."""
        if rows.size == self.size and (rows == np.arange(self.size)).all():
            return self
        n = int(self.counts[rows].max())
        out = LineSet(self.knots[rows, :n], self.counts[rows], self.coef[rows, : max(n - 1, 1)])
        for sense, part in self.__dict__.get("_signed_parts", {}).items():  # parts already found
            out.__dict__.setdefault("_signed_parts", {})[sense] = part.subset(rows)
        return out

    @classmethod
    def rows_of(cls, sets: Sequence[LineSet], which: np.ndarray, rows: np.ndarray) -> LineSet:
        """Row ``i`` is line ``rows[i]`` of ``sets[which[i]]``."""
        k = max(int(s.knots.shape[1]) for s in sets)
        d = max(int(s.coef.shape[2]) for s in sets)
        knots = np.full((rows.size, k), np.inf)
        coef = np.zeros((rows.size, max(k - 1, 1), d))
        counts = np.zeros(rows.size, dtype=int)
        for n, s in enumerate(sets):
            sel = np.nonzero(which == n)[0]
            knots[sel, : s.knots.shape[1]] = s.knots[rows[sel]]
            coef[sel, : s.coef.shape[1], : s.coef.shape[2]] = s.coef[rows[sel]]
            counts[sel] = s.counts[rows[sel]]
        return cls(knots, counts, coef)

    @functools.cached_property
    def area(self) -> np.ndarray:
        """Net area of each line (the integral over the beam)."""
        return self._cumulative_at_knots[np.arange(self.size), self.counts - 1]

    def row(self, i: int) -> LineSet:
        """Line ``i`` alone (cached)."""
        cache = self.__dict__.setdefault("_rows", {})
        if i not in cache:
            n = int(self.counts[i])
            cache[i] = LineSet(self.knots[i : i + 1, :n], self.counts[i : i + 1], self.coef[i : i + 1, : max(n - 1, 1)])
        return cache[i]

    # ------------------------------------------------------------ evaluation
    @functools.cached_property
    def _bands(self) -> tuple[float, np.ndarray, np.ndarray]:
        """The knots of all lines laid end to end, line ``i`` shifted by ``i`` times a band wider than
        twice the longest line, and where each line's knots start."""
        band = 2.0 * float(self.length.max()) + 1.0
        valid = np.isfinite(self.knots)
        keys = (self.knots + band * np.arange(self.size)[:, None])[valid]
        starts = np.concatenate(([0], np.cumsum(self.counts)[:-1]))
        return band, keys, starts

    def _count(self, rows: np.ndarray, x: np.ndarray, strict: bool) -> np.ndarray:
        """Number of knots of each position's line below ``x`` (``strict``) or at or below it.

        One binary search over the knots of all lines laid end to end: a
        position is moved into its line's band (clipped to half a band beyond
        the line's ends, which changes no count), where it keeps its distance
        to the knots to within a rounding far below the snapping tolerance.
        """
        side = "left" if strict else "right"
        if self.size == 1:
            return np.searchsorted(self.knots[0, : self.counts[0]], x, side=side)
        rows = np.broadcast_to(_expand(rows, x), x.shape)
        band, keys, starts = self._bands
        reach = 0.25 * band
        key = np.clip(x, -reach, self.length[rows] + reach) + band * rows
        return np.searchsorted(keys, key, side=side) - starts[rows]

    def evaluate(self, rows: np.ndarray, x: np.ndarray, mode: str = "value", count: np.ndarray | None = None):
        """Ordinates at ``x`` of the lines ``rows`` (broadcast over trailing axes of ``x``).

        ``mode``: ``"value"`` as ``line(x)``, ``"left"`` as ``line.left(x)``,
        ``"right"`` as ``line.right(x)``.  ``count``, when known, is the
        number of knots below (``"left"``) or at or below (else) each position.
        """
        x = np.asarray(x, dtype=float)
        r = np.broadcast_to(_expand(rows, x), x.shape)
        length = self.length[r]
        if count is None:
            count = self._count(rows, x, strict=mode == "left")
        j = count - 1
        if mode == "left":
            off = (x <= 0.0) | (x > length)
        else:
            off = (x < 0.0) | (x > length)
            if mode == "right":
                off |= x >= length
        j = np.clip(j, 0, self.counts[r] - 2)
        t = np.where(off, 0.0, x - self.knots[r, j])
        y = horner(self.coef[r, j], t)
        return np.where(off, 0.0, y)

    @functools.cached_property
    def _cumulative_at_knots(self) -> np.ndarray:
        k = self.knots.shape[1]
        out = np.zeros((self.size, k))
        if k > 1:
            width = _widths(self.knots)
            out[:, 1:] = np.cumsum(_antiderivative(self.coef, width), axis=1)
        return out

    def cumulative(self, rows: np.ndarray, x: np.ndarray) -> np.ndarray:
        """Integrals from the left end to ``x`` (``±inf`` allowed), as ``line.cumulative(x)``."""
        x = np.asarray(x, dtype=float)
        r = np.broadcast_to(_expand(rows, x), x.shape)
        xs = np.clip(x, 0.0, self.length[r])
        j = np.clip(self._count(rows, xs, strict=False) - 1, 0, self.counts[r] - 2)
        t = xs - self.knots[r, j]
        return _antiderivative(self.coef[r, j], t) + self._cumulative_at_knots[r, j]

    # ------------------------------------------------------------------ faces
    def snap(self, rows: np.ndarray, x: np.ndarray) -> tuple[np.ndarray, np.ndarray]:
        """Positions within the tolerance of a knot moved onto it, and the index of that knot (-1 elsewhere)."""
        xs, k, _ = self._snap(rows, x)
        return xs, k

    def _snap(self, rows: np.ndarray, x: np.ndarray) -> tuple[np.ndarray, np.ndarray, np.ndarray]:
        """:meth:`snap`, and the number of knots at or below each moved position."""
        x = np.asarray(x, dtype=float)
        r = np.broadcast_to(_expand(rows, x), x.shape)
        j = self._count(rows, x, strict=True)  # the first knot at or right of x
        last = self.counts[r] - 1
        jr = np.minimum(j, last)
        jl = np.maximum(j - 1, 0)
        tol = self.tol[r]
        to_right = np.abs(self.knots[r, jr] - x) <= tol
        to_left = ~to_right & (np.abs(x - self.knots[r, jl]) <= tol)
        k = np.where(to_right, jr, np.where(to_left, jl, -1))
        # a position not moved equals no knot (it would have been moved), so below and at-or-below agree
        return np.where(k >= 0, self.knots[r, np.maximum(k, 0)], x), k, np.where(k >= 0, k + 1, j)

    def ordinates(self, rows: np.ndarray, x: np.ndarray, side: np.ndarray | int) -> tuple[np.ndarray, ...]:
        """Ordinates of loads at ``x`` taking the limit from ``side`` where they stand at a jump.

        Returns the ordinates, the positions (moved onto the knot a load stands
        at) and the face of each load: ``LEFT`` or ``RIGHT`` at a jump,
        ``EXACT`` elsewhere.  ``side`` ``EXACT`` at a jump means the value
        ``line(x)`` gives there (the right face, the left one at the right end).
        """
        xs, k, count = self._snap(rows, x)
        r = np.broadcast_to(_expand(rows, xs), xs.shape)
        base = self.evaluate(rows, xs, count=count)
        at = np.maximum(k, 0)
        face_here = (k >= 0) & self.jumps[r, at]
        side = np.broadcast_to(side, xs.shape)
        use_left = face_here & ((side == LEFT) | ((side == EXACT) & (k == self.counts[r] - 1)))
        use_right = face_here & ~use_left
        values = np.where(use_left, self.left[r, at], np.where(use_right, self.right[r, at], base))
        faces = np.where(use_left, LEFT, np.where(use_right, RIGHT, EXACT))
        return values, xs, faces

    def signed(self, sense: int) -> LineSet:
        """The lines where they have the sign of ``sense``, 0 elsewhere (zero crossings become knots)."""
        cache = self.__dict__.setdefault("_signed_parts", {})
        if sense not in cache:
            cache[sense] = self._signed(1 if sense > 0 else -1)
        return cache[sense]

    def _signed(self, want: int) -> LineSet:
        n, k = self.knots.shape
        pieces = np.arange(k - 1)[None, :] < (self.counts - 1)[:, None]
        line_of, piece_of = np.nonzero(pieces)
        start = self.knots[line_of, piece_of]
        width = self.knots[line_of, piece_of + 1] - start
        rows, t = roots_in_pieces(self.coef[line_of, piece_of], width)
        tol = self.tol[line_of[rows]]
        inside = (t > tol) & (t < width[rows] - tol)
        rows, t = rows[inside], t[inside]
        # the new knots: the old ones and the crossings, line by line
        line_k = np.concatenate((np.nonzero(np.isfinite(self.knots))[0], line_of[rows]))
        x_k = np.concatenate((self.knots[np.isfinite(self.knots)], start[rows] + t))
        order = np.lexsort((x_k, line_k))
        line_k, x_k = line_k[order], x_k[order]
        # each new piece: the old piece under its middle, shifted to its start, kept where it has the sign
        same = line_k[1:] == line_k[:-1]
        p_line = line_k[:-1][same]
        p_start, p_end = x_k[:-1][same], x_k[1:][same]
        mid = 0.5 * (p_start + p_end)
        old = np.clip(self._count(p_line, mid, strict=False) - 1, 0, self.counts[p_line] - 2)
        coef = taylor_shift(self.coef[p_line, old], p_start - self.knots[p_line, old])
        keep = want * horner(coef, mid - p_start) > 0
        coef = np.where(keep[:, None], coef, 0.0)
        # a knot between two zero pieces is no knot
        zero = ~keep
        drop = np.zeros(x_k.size, dtype=bool)
        inner = np.nonzero(same[:-1] & same[1:])[0] + 1  # knots with a piece on both sides, in the same line
        piece_index = np.cumsum(same) - 1  # index into the pieces of the piece starting at knot i
        drop[inner] = zero[piece_index[inner] - 1] & zero[piece_index[inner]]
        keep_knot = ~drop
        keep_piece = np.ones(coef.shape[0], dtype=bool)
        starts_at = np.nonzero(same)[0]  # knot where each piece starts
        keep_piece = keep_knot[starts_at]
        line_k, x_k = line_k[keep_knot], x_k[keep_knot]
        coef, p_line = coef[keep_piece], p_line[keep_piece]
        counts = np.bincount(line_k, minlength=n)
        width = int(counts.max())
        slot = np.arange(x_k.size) - np.concatenate(([0], np.cumsum(counts)[:-1]))[line_k]
        knots = np.full((n, width), np.inf)
        knots[line_k, slot] = x_k
        table = np.zeros((n, max(width - 1, 1), self.coef.shape[2]))
        p_slot = np.arange(p_line.size) - np.concatenate(([0], np.cumsum(counts - 1)[:-1]))[p_line]
        table[p_line, p_slot] = coef
        return LineSet(knots, counts, table)

    def intervals(self, i: int) -> list[tuple[float, float]]:
        """Stretches of line ``i`` where it is not zero (pieces merged), as ``(start, end)``."""
        out: list[list[float]] = []
        for j in range(int(self.counts[i]) - 1):
            if not np.any(self.coef[i, j]):
                continue
            a, b = float(self.knots[i, j]), float(self.knots[i, j + 1])
            if out and out[-1][1] == a:
                out[-1][1] = b
            else:
                out.append([a, b])
        return [(a, b) for a, b in out]


def _widths(knots: np.ndarray) -> np.ndarray:
    """Widths of the pieces of padded knots (0 where padded)."""
    valid = np.isfinite(knots[:, 1:])
    return np.subtract(knots[:, 1:], knots[:, :-1], out=np.zeros(valid.shape), where=valid)


def _coefficients(line: InfluenceLine) -> np.ndarray:
    """The line's coefficient table ``(degree + 1, pieces)`` (ascending powers)."""
    table = getattr(line, "_c", None)
    if table is None:  # pragma: no cover - every InfluenceLine has it
        table = np.array([p.coefficients for p in line.pieces]).T
    return table


def _expand(rows: np.ndarray, x: np.ndarray) -> np.ndarray:
    """``rows`` with trailing axes to broadcast against ``x``."""
    rows = np.asarray(rows)
    return rows.reshape(rows.shape + (1,) * (np.ndim(x) - rows.ndim))




def _antiderivative(c: np.ndarray, t: np.ndarray) -> np.ndarray:
    """``sum c[..., p] t^(p+1) / (p+1)`` by Horner's rule (as ``InfluenceLine``)."""
    y = np.zeros(np.broadcast(c[..., 0], t).shape)
    for p in range(c.shape[-1] - 1, -1, -1):
        y = (y + c[..., p] / (p + 1)) * t
    return y
