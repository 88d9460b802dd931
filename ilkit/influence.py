"""The influence line: one type for exact (piecewise-linear or piecewise-cubic,
rational) and numeric (piecewise-cubic, float) lines.

A line is stored as polynomial pieces between knots.  Piece ``j`` covers
``knots[j] <= x < knots[j+1]`` and is written in the local coordinate
``t = x - knots[j]`` with ascending coefficients ``c0 + c1 t + c2 t^2 + c3 t^3``.
Pieces may jump at knots; both one-sided values are available.  The load is on
the beam for ``0 <= x <= L``; anywhere else the ordinate is 0.

Ordinates are the value of the quantity caused by a unit downward load at
``x`` (sign conventions in :mod:`ilkit.model`).
"""

from __future__ import annotations

import bisect
from dataclasses import dataclass
from fractions import Fraction
from functools import cached_property
from typing import TYPE_CHECKING, Any, Literal

import numpy as np

from ilkit._check import choice, whole
from ilkit._display import RichDisplay
from ilkit._exact import fmt, fmt_precise, to_exact
from ilkit.errors import BeamInputError, IlkitError
from ilkit.quantity import Quantity
from ilkit.units import LENGTH, UnitSystem, factor_to, is_quantity

if TYPE_CHECKING:  # pragma: no cover
    import pandas as pd
    import sympy

__all__ = ["InfluenceLine", "Piece", "Ordinate"]

Number = Fraction | float


@dataclass(frozen=True)
class Piece:
    """One polynomial piece of a line, ``start <= x < end``.

    ``coefficients`` are ascending powers of the local coordinate
    ``t = x - start``; ``exact`` holds the same as :class:`Fraction` for exact
    lines and is ``None`` otherwise.
    """

    start: float
    end: float
    coefficients: tuple[float, ...]
    exact: tuple[Fraction, ...] | None = None
    exact_start: Fraction | None = None

    def polynomial(self) -> sympy.Expr:
        """The piece as a sympy polynomial in the global coordinate :data:`ilkit.x`."""
        import sympy

        from ilkit._symbols import x

        if self.exact is not None and self.exact_start is not None:
            coeffs = [sympy.Rational(c.numerator, c.denominator) for c in self.exact]
            start: Any = sympy.Rational(self.exact_start.numerator, self.exact_start.denominator)
        else:
            coeffs = [sympy.Float(c) for c in self.coefficients]
            start = sympy.Float(self.start)
        return sympy.expand(sum(c * (x - start) ** p for p, c in enumerate(coeffs)))


@dataclass(frozen=True)
class Ordinate:
    """A value of a line at a position; ``side`` tells which one-sided limit."""

    value: float
    x: float
    side: Literal["left", "right"] | None = None

    def __repr__(self) -> str:
        side = f", side={self.side!r}" if self.side else ""
        return f"Ordinate(value={fmt(self.value)}, x={fmt(self.x)}{side})"


class InfluenceLine(RichDisplay):
    """Influence line of one quantity of one beam.

    Call it on a float or a numpy array of load positions to get ordinates
    (0 off the beam; right-hand value at a jump, left-hand value at the right
    end).  Use :meth:`left` and :meth:`right` for one-sided values.  Positions
    may be pint quantities when the beam declares its units; they are
    converted into the beam's length unit.

    Ordinates are the quantity per unit downward load, in :attr:`unit` (for
    example kN/kN for a force, kN·m/kN for a moment, m/kN for a deflection),
    with the sign conventions of :mod:`ilkit.model` (reactions upward, moments
    sagging, deflections downward positive); areas are in that unit times the
    length unit.

    Build lines with the beam's methods (``beam.reaction(x)``, ``beam.shear(x)``
    ...), not with this constructor.
    """

    __slots__ = (
        "__dict__",
        "_c",
        "_coef_exact",
        "_degree",
        "_knot_list",
        "_knots",
        "_knots_exact",
        "_origin",
        "length",
        "quantity",
        "units",
    )

    def __init__(
        self,
        *,
        quantity: Quantity,
        knots: tuple[Number, ...],
        coefficients: tuple[tuple[Number, ...], ...],
        units: UnitSystem | None = None,
        origin: object = None,
    ) -> None:
        if not isinstance(quantity, Quantity):
            raise BeamInputError(
                f"InfluenceLine: quantity must be an ilkit.Quantity, got {quantity!r}; build lines with the "
                "beam's methods (beam.moment(x) ...).",
                field="quantity",
                value=quantity,
            )
        if len(knots) < 2 or len(coefficients) != len(knots) - 1:
            raise BeamInputError(
                f"InfluenceLine: {len(knots)} knots need {max(len(knots) - 1, 1)} pieces of coefficients, "
                f"got {len(coefficients)}; give knots from 0 to L and one coefficient tuple per piece.",
                field="coefficients",
                value=coefficients,
            )
        exact = all(isinstance(k, Fraction) for k in knots) and all(
            isinstance(c, Fraction) for cs in coefficients for c in cs
        )
        self.quantity = quantity
        self._knots_exact = tuple(knots) if exact else None
        self._coef_exact = tuple(tuple(cs) for cs in coefficients) if exact else None
        self._knots = _finite_floats(knots, "knots")
        if self._knots[0] != 0.0 or np.any(np.diff(self._knots) <= 0):
            raise BeamInputError(
                f"InfluenceLine: the knots must run from 0 (the left end) upward, strictly increasing; got {knots!r}.",
                field="knots",
                value=knots,
            )
        degree = max((len(cs) for cs in coefficients), default=1) - 1
        self._degree = max(degree, 0)
        width = self._degree + 1
        table = np.zeros((width, len(coefficients)))
        for j, cs in enumerate(coefficients):
            if exact:
                cs = _stretched(cs, knots[j + 1] - knots[j], self._knots[j + 1] - self._knots[j])  # type: ignore[operator]
            table[: len(cs), j] = _finite_floats(cs, f"coefficients of piece {j + 1}")
        self._c = table
        self._knot_list = self._knots.tolist()
        self.length = float(self._knots[-1])
        self.units = units
        self._origin = origin

    # ------------------------------------------------------------------ basics
    @property
    def is_exact(self) -> bool:
        """True when knots and coefficients are exact rationals."""
        return self._knots_exact is not None

    @property
    def degree(self) -> int:
        """Highest polynomial degree of the pieces (1 for determinate lines, 3 for continuous)."""
        return self._degree

    @property
    def origin(self) -> object:
        """What produced the line (the beam analysis), for derivations; may be ``None``."""
        return self._origin

    @property
    def breakpoints(self) -> tuple[float, ...]:
        """Knots of the line: beam ends, supports, releases and the section, in order."""
        return tuple(self._knot_list)

    @property
    def exact_breakpoints(self) -> tuple[Fraction, ...] | None:
        """The knots as exact fractions (``None`` for numeric lines)."""
        return self._knots_exact

    @cached_property
    def pieces(self) -> tuple[Piece, ...]:
        """The polynomial pieces of the line."""
        out = []
        for j in range(len(self._knot_list) - 1):
            coeffs = tuple(float(v) for v in self._c[:, j])
            exact = self._coef_exact[j] if self._coef_exact is not None else None
            start_exact = self._knots_exact[j] if self._knots_exact is not None else None
            out.append(Piece(self._knot_list[j], self._knot_list[j + 1], coeffs, exact, start_exact))
        return tuple(out)

    @property
    def unit(self) -> str:
        """Unit of the ordinates, e.g. ``"kN·m/kN"``; empty when the beam has no units."""
        u = self.units
        if u is None:
            return ""
        q = self.quantity
        if q.is_force:
            return f"{u.force}/{u.force}"
        if q.is_moment:
            return f"{u.moment}/{u.force}"
        if q.kind == "deflection":
            return f"{u.length}/{u.force}"
        return f"rad/{u.force}"

    def __repr__(self) -> str:
        kind = "exact" if self.is_exact else "numeric"
        return (
            f"<InfluenceLine {self.quantity.label}, {kind}, {len(self._knot_list) - 1} pieces "
            f"on 0..{fmt_precise(self.length)}>"
        )

    # -------------------------------------------------------------- evaluation
    def __call__(self, x: float | np.ndarray) -> float | np.ndarray:
        """Ordinate(s) at load position(s) ``x``; right-hand value at a jump."""
        return self._evaluate(x, "right")

    def left(self, x: float | np.ndarray) -> float | np.ndarray:
        """Left-hand limit of the ordinate at ``x`` (0 at and left of the left end)."""
        return self._evaluate(x, "left")

    def right(self, x: float | np.ndarray) -> float | np.ndarray:
        """Right-hand limit of the ordinate at ``x`` (0 at and right of the right end)."""
        return self._evaluate(x, "right_strict")

    def _positions(self, x: Any) -> float | np.ndarray:
        """Load positions ``x`` as floats in the beam's length unit: a number, an array of numbers or a
        pint quantity.  NaN is refused; ``±inf`` is a position off the beam."""
        if type(x) is float and x == x:
            return x
        given = x
        if is_quantity(x):
            x = x.magnitude * float(factor_to(x, dims=LENGTH, system=self.units, field="load position"))
        xs = np.asarray(x)
        readable = xs.dtype.kind in "fiuU" or (xs.dtype.kind == "O" and not any(v is None for v in xs.flat))
        if readable:
            try:
                xs = xs.astype(float, copy=False)
            except (TypeError, ValueError, OverflowError, ArithmeticError):
                readable = False
        if not readable:
            raise BeamInputError(
                f"load position: cannot read {given!r} as positions; give a number or an array of numbers in the "
                "beam's length unit, from 0 to the beam's length.",
                field="x",
                value=given,
            )
        if np.isnan(xs).any():
            raise BeamInputError(
                "load position: NaN is not a position on the beam; give numbers from 0 to the beam's length.",
                field="x",
                value=given,
            )
        return float(xs) if xs.ndim == 0 else xs

    def _position(self, x: Any, what: str) -> float:
        """One load position (see :meth:`_positions`)."""
        out = self._positions(x)
        if isinstance(out, np.ndarray):
            raise BeamInputError(f"{what}: give one position, got {x!r}.", field=what, value=x)
        return out

    def _evaluate(self, x: Any, mode: str) -> Any:
        xs = self._positions(x)
        if isinstance(xs, float):
            return self._scalar(xs, mode)
        knots = self._knots
        npieces = knots.size - 1
        if mode == "left":
            idx = np.searchsorted(knots, xs, side="left") - 1
            off = (xs <= 0.0) | (xs > self.length)
        else:
            idx = np.searchsorted(knots, xs, side="right") - 1
            off = (xs < 0.0) | (xs > self.length)
            if mode == "right_strict":
                off |= xs >= self.length
        np.clip(idx, 0, npieces - 1, out=idx)
        t = np.where(off, 0.0, xs - knots[idx])  # no polynomial is evaluated far off the beam
        c = self._c
        y = c[self._degree][idx]
        for p in range(self._degree - 1, -1, -1):
            y = y * t + c[p][idx]
        return np.where(off, 0.0, y)

    def _scalar(self, x: float, mode: str) -> float:
        length = self.length
        if x < 0.0 or x > length:
            return 0.0
        knots = self._knot_list
        if mode == "left":
            if x <= 0.0:
                return 0.0
            j = bisect.bisect_left(knots, x) - 1
        else:
            if mode == "right_strict" and x >= length:
                return 0.0
            j = bisect.bisect_right(knots, x) - 1
        j = min(max(j, 0), len(knots) - 2)
        return float(self._piece_value(j, x - knots[j]))

    def slope(self, x: float | np.ndarray, side: Literal["left", "right"] = "right") -> float | np.ndarray:
        """Slope ``d(ordinate)/dx`` at ``x``, one-sided at knots (0 off the beam).

        Units: the ordinate's unit per length unit of the beam.
        """
        choice(side, ("left", "right"), what="slope: side", field="side")
        xs = np.atleast_1d(self._positions(x))
        knots = self._knots
        if side == "left":
            idx = np.searchsorted(knots, xs, side="left") - 1
            off = (xs <= 0.0) | (xs > self.length)
        else:
            idx = np.searchsorted(knots, xs, side="right") - 1
            off = (xs < 0.0) | (xs >= self.length)
        np.clip(idx, 0, knots.size - 2, out=idx)
        t = np.where(off, 0.0, xs - knots[idx])
        c = self._c
        y = np.zeros_like(t)
        for p in range(self._degree, 0, -1):
            y = y * t + p * c[p][idx]
        y = np.where(off, 0.0, y)
        return float(y[0]) if np.ndim(x) == 0 else y

    @cached_property
    def _cumulative_at_knots(self) -> np.ndarray:
        k = self._knot_list
        with np.errstate(over="ignore", invalid="ignore"):  # an overflow is refused in cumulative()
            steps = [self._piece_integral(j, 0.0, k[j + 1] - k[j]) for j in range(len(k) - 1)]
            return np.concatenate(([0.0], np.cumsum(steps)))

    def cumulative(self, x: float | np.ndarray) -> float | np.ndarray:
        """Integral of the line from the left end to ``x`` (vectorised).

        Equals the effect of a uniform unit load over ``[0, x]``; constant
        beyond the right end (the whole net area), 0 left of the left end.
        ``x`` may be ``±inf``.
        """
        xs = np.clip(np.atleast_1d(self._positions(x)), 0.0, self.length)
        knots = self._knots
        idx = np.clip(np.searchsorted(knots, xs, side="right") - 1, 0, knots.size - 2)
        t = xs - knots[idx]
        c = self._c
        y = np.zeros_like(t)
        with np.errstate(over="ignore", invalid="ignore"):  # an overflow is refused below
            for p in range(self._degree, -1, -1):
                y = (y + c[p][idx] / (p + 1)) * t
            y = y + self._cumulative_at_knots[idx]
        self._finite(y, "the integral from the left end")
        return float(y[0]) if np.ndim(x) == 0 else y

    def part(self, sign: Literal["positive", "negative"]) -> InfluenceLine:
        """The line with its parts of the other sign set to zero.

        ``part("positive")`` is ``max(line, 0)``, ``part("negative")`` is
        ``min(line, 0)``: the line as seen by a load that is placed only where
        it adds to the wanted extreme.  Zero crossings inside pieces become
        knots; exact piecewise-linear lines stay exact.
        """
        choice(sign, ("positive", "negative"), what="part: sign", field="sign")
        cache: dict[str, InfluenceLine] = self.__dict__.setdefault("_signed_parts", {})
        if sign not in cache:
            want = 1 if sign == "positive" else -1
            exact = self._coef_exact is not None and self._knots_exact is not None and self._degree <= 1
            knots, coefficients = self._exact_part(want) if exact else self._numeric_part(want)
            cache[sign] = InfluenceLine(
                quantity=self.quantity,
                knots=tuple(knots),
                coefficients=tuple(coefficients),
                units=self.units,
                origin=self._origin,
            )
        return cache[sign]

    def _exact_part(self, want: int) -> tuple[list[Number], list[tuple[Number, ...]]]:
        assert self._coef_exact is not None and self._knots_exact is not None
        zero = (Fraction(0), Fraction(0))
        knots: list[Number] = []
        coefficients: list[tuple[Number, ...]] = []
        for j, cs in enumerate(self._coef_exact):
            a, h = self._knots_exact[j], self._knots_exact[j + 1] - self._knots_exact[j]
            c0, c1 = cs[0], (cs[1] if len(cs) > 1 else Fraction(0))
            cuts = [Fraction(0), h]
            if c1 and 0 < -c0 / c1 < h:
                cuts.insert(1, -c0 / c1)
            for t0, t1 in zip(cuts[:-1], cuts[1:]):
                v0 = c0 + c1 * t0
                keep = (v0 + c1 * (t1 - t0) / 2) * want > 0
                _append_piece(knots, coefficients, a + t0, (v0, c1) if keep else zero)
        knots.append(self._knots_exact[-1])
        return knots, coefficients

    def _numeric_part(self, want: int) -> tuple[list[Number], list[tuple[Number, ...]]]:
        zero = tuple(0.0 for _ in range(self._degree + 1))
        knots: list[Number] = []
        coefficients: list[tuple[Number, ...]] = []
        for j in range(len(self._knot_list) - 1):
            a, h = self._knot_list[j], self._knot_list[j + 1] - self._knot_list[j]
            cs = tuple(float(v) for v in self._c[:, j])
            cuts = [0.0, *self._piece_roots(j), h]
            for t0, t1 in zip(cuts[:-1], cuts[1:]):
                shifted = _taylor_shift(cs, t0)
                mid = 0.5 * (t1 - t0)
                keep = sum(c * mid**p for p, c in enumerate(shifted)) * want > 0
                _append_piece(knots, coefficients, a + t0, shifted if keep else zero)
        knots.append(self.length)
        return knots, coefficients

    def intervals(self, sign: Literal["positive", "negative"]) -> tuple[tuple[float, float], ...]:
        """The stretches ``(start, end)`` of the beam where the line has the given sign.

        These are the patches a breakable uniform load covers for the largest
        (``"positive"``) or smallest (``"negative"``) effect.  Adjacent
        stretches are merged; a stretch where the line is 0 is not included.
        """
        choice(sign, ("positive", "negative"), what="intervals: sign", field="sign")
        clipped = self.part(sign)
        out: list[list[float]] = []
        for j, piece in enumerate(clipped.pieces):
            if not np.any(clipped._c[:, j]):
                continue
            if out and out[-1][1] == piece.start:
                out[-1][1] = piece.end
            else:
                out.append([piece.start, piece.end])
        return tuple((a, b) for a, b in out)

    # ----------------------------------------------------------- exact forms
    @cached_property
    def expr(self) -> sympy.Expr:
        """The line as a sympy ``Piecewise`` in :data:`ilkit.x` (0 off the beam).

        Exact rationals for exact lines, floats for numeric ones.
        """
        import sympy

        from ilkit._symbols import x

        args: list[tuple[Any, Any]] = [(sympy.Integer(0), x < 0)]
        pieces = self.pieces
        polys = [piece.polynomial() for piece in pieces]
        for j, piece in enumerate(pieces):
            if j < len(pieces) - 1 and polys[j + 1] == polys[j]:
                continue  # same law on both sides of a knot: one piece
            end = _sym(self._knots_exact[j + 1]) if self._knots_exact else sympy.Float(piece.end)
            cond = x < end if j < len(pieces) - 1 else x <= end
            args.append((polys[j], cond))
        args.append((sympy.Integer(0), True))
        return sympy.Piecewise(*args, evaluate=False)

    def ordinate_exact(self, x: Number, side: Literal["left", "right"] | None = None) -> Fraction:
        """Exact ordinate at ``x`` of an exact line (one-sided if ``side`` is given)."""
        if self._knots_exact is None or self._coef_exact is None:
            raise IlkitError(
                f"{self.quantity.label}: this line is numeric; use line(x) for a float ordinate."
            )
        choice(side, ("left", "right"), what="ordinate_exact: side", field="side", optional=True)
        xe = to_exact(x, field="x")
        knots = self._knots_exact
        if xe < 0 or xe > knots[-1] or (side == "left" and xe == 0) or (side == "right" and xe == knots[-1]):
            return Fraction(0)
        if side == "left":
            j = bisect.bisect_left(knots, xe) - 1
        else:
            j = bisect.bisect_right(knots, xe) - 1
        j = min(max(j, 0), len(knots) - 2)
        t = xe - knots[j]
        return sum((c * t**p for p, c in enumerate(self._coef_exact[j])), Fraction(0))

    # -------------------------------------------------------------- ordinates
    def knot_values(self) -> list[tuple[float, float, float]]:
        """``(x, left, right)`` at every knot; 0 for the side that is off the beam."""
        out = []
        n = len(self._knot_list)
        for j, xk in enumerate(self._knot_list):
            left = float(self._piece_value(j - 1, xk - self._knot_list[j - 1])) if j > 0 else 0.0
            right = float(self._piece_value(j, 0.0)) if j < n - 1 else 0.0
            out.append((xk, left, right))
        return out

    def _piece_value(self, j: int, t: Any) -> Any:
        """Piece ``j`` at local coordinate(s) ``t`` (Horner; a float or an array like ``t``)."""
        c = self._c
        y = c[self._degree, j] + 0.0 * t
        for p in range(self._degree - 1, -1, -1):
            y = y * t + c[p, j]
        return y

    def ordinates(self) -> pd.DataFrame:
        """Table of the position and the ordinates just left and right of each breakpoint.

        Column names carry the units when the beam declares them.  The side that
        is off the beam (left of the left end, right of the right end) reads 0.
        """
        import pandas as pd

        length_unit = f" [{self.units.length}]" if self.units else ""
        unit = f" [{self.unit}]" if self.unit else ""
        rows = self.knot_values()
        return pd.DataFrame(
            {
                f"x{length_unit}": [r[0] for r in rows],
                f"left{unit}": [r[1] for r in rows],
                f"right{unit}": [r[2] for r in rows],
            }
        )

    def sample(self, points_per_piece: int = 41) -> tuple[np.ndarray, np.ndarray]:
        """Points for drawing: each piece sampled with both one-sided values at jumps."""
        points = whole(
            points_per_piece, what="sample: points_per_piece", field="points_per_piece", minimum=2, maximum=100_000
        )
        xs: list[np.ndarray] = []
        ys: list[np.ndarray] = []
        n = 2 if self._degree <= 1 else points
        for j in range(len(self._knot_list) - 1):
            a, b = self._knot_list[j], self._knot_list[j + 1]
            t = np.linspace(0.0, b - a, n)
            y = self._piece_value(j, t)
            xs.append(a + t)
            ys.append(y)
        return np.concatenate(xs), np.concatenate(ys)

    # ------------------------------------------------------------------ roots
    def _piece_roots(self, j: int) -> list[float]:
        """Local coordinates t in (0, h) where piece j crosses zero."""
        return self._roots_by_piece[j]

    @cached_property
    def _roots_by_piece(self) -> list[list[float]]:
        from ilkit._poly import roots_in_pieces

        widths = np.diff(self._knots)
        rows, ts = roots_in_pieces(self._c.T.copy(), widths)
        out: list[list[float]] = [[] for _ in widths]
        for j, t in zip(rows.tolist(), ts.tolist()):
            tol = 1e-12 * max(widths[j], 1.0)
            if tol < t < widths[j] - tol:
                out[j].append(t)
        return out

    def roots(self) -> tuple[float, ...]:
        """Positions inside pieces where the line crosses zero (jumps through 0 not included)."""
        out = []
        for j in range(len(self._knot_list) - 1):
            a = self._knot_list[j]
            out.extend(a + t for t in self._piece_roots(j))
        return tuple(out)

    # ------------------------------------------------------------------ areas
    def _piece_integral(self, j: int, t0: float, t1: float) -> float:
        """Integral of piece ``j`` from ``t0`` to ``t1`` (local coordinates), by Horner's rule, so that no
        power of a coordinate overflows where the integral itself is within the float range."""
        return self._piece_antiderivative(j, t1) - self._piece_antiderivative(j, t0)

    def _piece_antiderivative(self, j: int, t: float) -> float:
        total = 0.0
        for p in range(self._degree, -1, -1):
            total = (total + self._c[p, j] / (p + 1)) * t
        return float(total)

    def _finite(self, value: Any, what: str) -> Any:
        """``value`` when every entry is finite; a typed error naming ``what`` when the float range is left."""
        if np.all(np.isfinite(value)):
            return value
        raise BeamInputError(
            f"{self.quantity.label}: {what} is beyond the range of floats (about 1e308) on a beam "
            f"{fmt_precise(self.length)} long; give the beam's lengths in a larger unit (m rather than mm) so that "
            "areas stay within it.",
            field="x",
            value=value,
        )

    def integral(self, a: float, b: float) -> float:
        """Integral of the line from ``a`` to ``b`` (a uniform unit load over [a, b]; ``±inf`` allowed)."""
        a, b = self._position(a, "integral: a"), self._position(b, "integral: b")
        if b < a:
            return -self.integral(b, a)
        a = max(a, 0.0)
        b = min(b, self.length)
        total = 0.0
        with np.errstate(over="ignore", invalid="ignore"):  # an overflow is refused below
            for j in range(len(self._knot_list) - 1):
                k0, k1 = self._knot_list[j], self._knot_list[j + 1]
                lo, hi = max(a, k0), min(b, k1)
                if hi > lo:
                    total += self._piece_integral(j, lo - k0, hi - k0)
        return float(self._finite(total, f"the integral from x={fmt_precise(a)} to x={fmt_precise(b)}"))

    @cached_property
    def _signed_areas(self) -> tuple[float, float]:
        if self._coef_exact is not None and self._degree <= 1:
            areas: tuple[Any, Any] = self.exact_areas()
        else:
            pos = neg = 0.0
            with np.errstate(over="ignore", invalid="ignore"):  # an overflow is refused below
                for j in range(len(self._knot_list) - 1):
                    h = self._knot_list[j + 1] - self._knot_list[j]
                    cuts = [0.0, *self._piece_roots(j), h]
                    for t0, t1 in zip(cuts[:-1], cuts[1:]):
                        part = self._piece_integral(j, t0, t1)
                        if part > 0:
                            pos += part
                        else:
                            neg += part
            areas = (pos, neg)
        pos_f, neg_f = _finite_floats(areas, "areas")
        return float(pos_f), float(neg_f)

    @property
    def positive_area(self) -> float:
        """Area under the positive parts of the line (uniform unit load on them)."""
        return self._signed_areas[0]

    @property
    def negative_area(self) -> float:
        """Area under the negative parts of the line (a value <= 0)."""
        return self._signed_areas[1]

    @property
    def area(self) -> float:
        """Net area (uniform unit load over the whole beam)."""
        return self._signed_areas[0] + self._signed_areas[1]

    def exact_areas(self) -> tuple[Fraction, Fraction]:
        """Exact ``(positive, negative)`` areas of an exact piecewise-linear line."""
        if self._knots_exact is None or self._coef_exact is None or self._degree > 1:
            raise IlkitError(
                f"{self.quantity.label}: exact areas need an exact piecewise-linear line; "
                "use positive_area / negative_area for floats."
            )
        pos = neg = Fraction(0)
        knots = self._knots_exact
        for j, cs in enumerate(self._coef_exact):
            h = knots[j + 1] - knots[j]
            c0 = cs[0]
            c1 = cs[1] if len(cs) > 1 else Fraction(0)
            cuts = [Fraction(0), h]
            if c1 and 0 < -c0 / c1 < h:
                cuts.insert(1, -c0 / c1)
            for t0, t1 in zip(cuts[:-1], cuts[1:]):
                part = c0 * (t1 - t0) + c1 * (t1 * t1 - t0 * t0) / 2
                if part > 0:
                    pos += part
                else:
                    neg += part
        return pos, neg

    # --------------------------------------------------------------- extremes
    def _candidates(self) -> list[Ordinate]:
        out = []
        n = len(self._knot_list)
        for j, (xk, left, right) in enumerate(self.knot_values()):
            if j > 0:
                out.append(Ordinate(left, xk, "left" if j < n - 1 else None))
            if j < n - 1:
                out.append(Ordinate(right, xk, "right" if j > 0 else None))
        if self._degree >= 2:
            for j in range(n - 1):
                a, h = self._knot_list[j], self._knot_list[j + 1] - self._knot_list[j]
                deriv = [p * self._c[p, j] for p in range(1, self._degree + 1)]
                if not any(deriv):
                    continue
                coeffs = np.trim_zeros(np.array(deriv[::-1]), "f")
                if coeffs.size < 2:
                    continue
                for r in np.roots(coeffs):
                    if abs(r.imag) < 1e-12 and 0 < r.real < h:
                        out.append(Ordinate(float(self._piece_value(j, float(r.real))), a + float(r.real)))
        # unify jumps: a one-sided value equal to the other side needs no side
        cleaned = []
        for o in out:
            if o.side is not None and abs(self.left(o.x) - self.right(o.x)) <= 1e-14 * max(1.0, abs(o.value)):
                o = Ordinate(o.value, o.x, None)
            cleaned.append(o)
        return cleaned

    @cached_property
    def maximum(self) -> Ordinate:
        """Largest ordinate with its position (and side, at a jump)."""
        return max(self._candidates(), key=lambda o: o.value)

    @cached_property
    def minimum(self) -> Ordinate:
        """Smallest ordinate with its position (and side, at a jump)."""
        return min(self._candidates(), key=lambda o: o.value)


def _finite_floats(values: Any, what: str) -> np.ndarray:
    """``values`` as a 1-d array of finite floats (an exact number beyond the float range is refused too)."""
    try:
        out = np.array([float(v) for v in values], dtype=float)
    except (TypeError, ValueError, OverflowError):
        out = None
    if out is None or not np.all(np.isfinite(out)):
        raise BeamInputError(
            f"InfluenceLine: the {what} must be finite numbers within the range of floats, got "
            f"{', '.join(fmt_precise(v) if isinstance(v, (Fraction, float)) else repr(v) for v in values)}. "
            "For a line of a beam: give its lengths, EI and springs in units that keep them nearer to 1 "
            "(e.g. m and kN·m² rather than mm and N·mm²).",
            field=what.split()[0],
            value=values,
        )
    return out


def _stretched(coefficients: tuple[Number, ...], exact_width: Fraction, float_width: float) -> tuple[Number, ...]:
    """Exact coefficients of a piece for the local coordinate of its float knots.

    The float knots of an exact line are rounded, so a piece's float width differs from its exact
    width by a rounding.  On a short steep piece (a hinge 1e-8 from a support) evaluating the exact
    polynomial over the float width would miss the end value by slope times that rounding; stretching
    the polynomial to the float width makes both ends evaluate to the exact end values (rounded)."""
    ratio = exact_width / Fraction(float_width)
    if ratio == 1:
        return coefficients
    return tuple(c * ratio**p for p, c in enumerate(coefficients))  # type: ignore[operator]


def _taylor_shift(coefficients: tuple[float, ...], shift: float) -> tuple[float, ...]:
    """Coefficients of ``p(shift + u)`` in ``u`` for ``p(t) = sum c_k t^k`` (repeated synthetic division)."""
    out = list(coefficients)
    n = len(out)
    for i in range(n - 1):
        for k in range(n - 2, i - 1, -1):
            out[k] += shift * out[k + 1]
    return tuple(out)


def _append_piece(knots: list[Number], coefficients: list[tuple[Number, ...]], start: Number, cs: tuple) -> None:
    """Add a piece, merging it into the previous one when both are zero."""
    if coefficients and not any(cs) and not any(coefficients[-1]):
        return
    knots.append(start)
    coefficients.append(cs)


def _sym(value: Fraction) -> Any:
    import sympy

    return sympy.Rational(value.numerator, value.denominator)
