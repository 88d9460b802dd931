"""The force (flexibility) method for the influence lines of statically indeterminate beams.

ilkit computes the lines of indeterminate beams by the stiffness method
(:mod:`ilkit.stiffness`).  This module obtains the same lines the way a
calculation by hand does, from the beam's own calls, so that a derivation can
show a checker the classical steps and so that the two methods check each
other:

1. **Redundants and primary structure.**  Restraints are released one at a
   time, while the beam stays stable, until it is statically determinate:
   first the vertical restraints of interior supports that do not restrain
   rotation, then the rotational restraints (a fixed support becomes a pin, a
   rotational spring is removed), then the vertical restraints of the
   remaining supports, each from left to right.  The forces of the released
   restraints are the redundants ``X_1 .. X_n`` (reactions positive upward,
   moment reactions positive counter-clockwise, as everywhere in ilkit); the
   released beam, with the same ``EI``, springs and releases, is the primary
   structure.
2. **Load terms.**  ``δ_i(x)``: how far a unit downward load at ``x`` moves
   the primary structure at restraint ``i``, against ``X_i`` (down for a
   reaction, clockwise for a moment reaction).  By Maxwell's theorem it is
   the primary structure's deflection line (or rotation line) at the
   restraint: ``primary.deflection(x_i)`` or ``primary.rotation(x_i)``.
3. **Flexibility coefficients.**  ``f_ij``: the movement at restraint ``i``,
   in the sense of ``X_i``, caused by ``X_j = 1``.  For a force ``X_j`` it is
   ``δ_i(x_j)``; for a couple ``X_j`` it is ``dδ_i/dx`` at ``x_j`` (a
   clockwise couple is the limit of a downward and an upward force close
   together).  ``f_ij = f_ji`` (Maxwell).  An elastic restraint adds ``1/k_i``
   to ``f_ii``: its spring gives way by ``X_i / k_i``.
4. **Compatibility.**  ``Σ_j f_ij X_j(x) = δ_i(x)`` for every ``i``: the
   redundants push each released point back to where the restraint holds it.
   So ``X(x) = F⁻¹ δ(x)``.
5. **The quantity.**  ``η(x) = η₀(x) + Σ_j q_j X_j(x)``: ``η₀`` is the line
   of the quantity on the primary structure (exact, straight between
   breakpoints for a force quantity), ``q_j`` the value of the quantity on the
   primary structure for ``X_j = 1``.  When the quantity is itself a
   redundant, ``η(x) = X_k(x)``.

Every step uses public calls of the core (lines of the primary structure,
their ordinates and slopes); with ``exact=True`` every number is a rational
and the result equals the stiffness method's exact line piece by piece.
Springs and varying ``EI`` are handled (they live in the primary structure's
lines and in the ``1/k`` terms).
"""

from __future__ import annotations

import bisect
from dataclasses import dataclass
from fractions import Fraction
from functools import cached_property
from typing import TYPE_CHECKING, Any, Literal

import numpy as np

from ilkit._exact import fmt
from ilkit.elements import shift
from ilkit.errors import IllConditionedError, NoDerivationError, UnstableBeamError
from ilkit.influence import InfluenceLine
from ilkit.quantity import Quantity

if TYPE_CHECKING:  # pragma: no cover
    from ilkit.model import Beam, Support

__all__ = ["Redundant", "ForceMethod", "force_method", "primary_structure"]

Number = Fraction | float


@dataclass(frozen=True)
class Redundant:
    """A released restraint: the vertical reaction (``kind="reaction"``, positive upward) or the moment
    reaction (``"moment_reaction"``, positive counter-clockwise) of the support at ``at``.

    ``stiffness`` is the spring stiffness of an elastic restraint (force per
    length, or moment per radian), ``None`` for a rigid one.
    """

    kind: Literal["reaction", "moment_reaction"]
    at: Fraction
    stiffness: Fraction | None = None

    @property
    def words(self) -> str:
        """``"vertical reaction at x=30"``, with the spring where there is one."""
        what = "vertical reaction" if self.kind == "reaction" else "moment reaction"
        spring = "" if self.stiffness is None else f" (spring k = {fmt(self.stiffness)})"
        return f"{what} at x={fmt(self.at)}{spring}"


def primary_structure(beam: Beam) -> tuple[Beam, tuple[Redundant, ...]]:
    """A statically determinate primary structure of ``beam`` and the redundants released to get it.

    See the module notes for the order in which restraints are released.
    Raises :class:`ilkit.NoDerivationError` for a determinate beam (it has no
    redundants).
    """
    if beam.degree == 0:
        raise NoDerivationError(
            "force method: the beam is statically determinate, so it has no redundants; its force lines come "
            "from statics (derivation(line) writes the Müller-Breslau mechanism), and its deflection lines from "
            "the elastic analysis (derivation(line, method='stiffness'))."
        )
    current = beam
    released: list[Redundant] = []
    for step in ("interior vertical", "rotation", "vertical"):
        for at in [s.at for s in beam.supports]:
            if current.degree == 0:
                break
            support = next((s for s in current.supports if s.at == at), None)
            if support is None:
                continue
            change = _release(current, support, step)
            if change is None:
                continue
            supports, redundant = change
            try:
                candidate = current.replace(supports=supports)
            except UnstableBeamError:
                continue
            if candidate.degree == current.degree - 1:
                current = candidate
                released.append(redundant)
    if current.degree != 0:  # pragma: no cover - every restraint of a beam is a support; see the module notes
        raise NoDerivationError(
            f"force method: no determinate primary structure found for {beam!r}; use "
            "derivation(line, method='stiffness')."
        )
    return current, tuple(sorted(released, key=lambda r: (r.at, r.kind)))


def _release(beam: Beam, s: Support, step: str) -> tuple[dict[Any, Any], Redundant] | None:
    """The supports of ``beam`` with one restraint of ``s`` released in this ``step``, and its redundant."""
    from ilkit.model import Spring

    supports: dict[Any, Any] = {t.at: t.spec for t in beam.supports}
    ends = (beam.supports[0].at, beam.supports[-1].at)
    if step == "rotation":
        if not s.restrains_rotation:
            return None
        vertical = s.spring.vertical if s.spring is not None else "rigid"
        supports[s.at] = "pin" if vertical == "rigid" else Spring(vertical=vertical)
        return supports, Redundant("moment_reaction", s.at, s.rotational_stiffness)
    if s.restrains_rotation or (step == "interior vertical" and s.at in ends):
        return None
    del supports[s.at]
    return supports, Redundant("reaction", s.at, s.vertical_stiffness)


@dataclass(frozen=True)
class ForceMethod:
    """The force-method solution of one influence line (the ``origin`` of :attr:`line`).

    Attributes
    ----------
    beam, quantity:
        The beam and the quantity.
    primary:
        The determinate primary structure; ``redundants`` the restraints released.
    load_lines:
        ``δ_i(x)`` per redundant: the primary structure's deflection (rotation)
        line at the restraint.
    flexibility:
        ``f_ij`` (rows ``i``), without the springs; ``springs`` the ``1/k_i``
        terms (0 for rigid restraints).
    inverse:
        ``(F + diag(1/k))⁻¹``, so ``X(x) = inverse · δ(x)``.
    primary_line:
        ``η₀``: the quantity's line on the primary structure; ``None`` when
        the quantity is the redundant ``X_k`` (``redundant_index = k``).
    shares:
        ``q_j``: the quantity on the primary structure for ``X_j = 1``.
    weights:
        ``c = inverse · q``: the line is ``η₀(x) + Σ_i c_i δ_i(x)``.
    exact:
        True: every number a :class:`~fractions.Fraction`.
    """

    beam: Beam
    quantity: Quantity
    primary: Beam
    redundants: tuple[Redundant, ...]
    load_lines: tuple[InfluenceLine, ...]
    flexibility: tuple[tuple[Number, ...], ...]
    springs: tuple[Number, ...]
    inverse: tuple[tuple[Number, ...], ...]
    primary_line: InfluenceLine | None
    redundant_index: int | None
    shares: tuple[Number, ...]
    weights: tuple[Number, ...]
    exact: bool

    def redundant_values(self, x: float) -> tuple[Number, ...]:
        """``X_j`` for a unit load at ``x`` (right-hand value where a line jumps); exact for exact solutions."""
        deltas = [_value(line, x, None, self.exact) for line in self.load_lines]
        return tuple(sum((a * d for a, d in zip(row, deltas)), self._zero) for row in self.inverse)

    @property
    def _zero(self) -> Number:
        return Fraction(0) if self.exact else 0.0

    @cached_property
    def line(self) -> InfluenceLine:
        """The influence line assembled from the primary structure's lines: ``η₀ + Σ c_i δ_i``."""
        terms: list[tuple[Number, InfluenceLine]] = list(zip(self.weights, self.load_lines))
        if self.primary_line is not None:
            terms.insert(0, (Fraction(1) if self.exact else 1.0, self.primary_line))
        knots, coefficients = _combine(terms, self.exact)
        return InfluenceLine(quantity=self.quantity, knots=knots, coefficients=coefficients,
                             units=self.beam.units, origin=self)


def force_method(beam: Beam, quantity: Quantity, *, exact: bool = False) -> ForceMethod:
    """Solve the influence line of ``quantity`` on the indeterminate ``beam`` by the force method.

    ``exact=True`` works in rational arithmetic (small beams); otherwise in
    floats.  Raises :class:`ilkit.NoDerivationError` for a determinate beam
    and :class:`ilkit.IllConditionedError` when the flexibility matrix is too
    ill-conditioned for floats (use ``exact=True``).
    """
    primary, redundants = primary_structure(beam)
    load_lines = tuple(
        (primary.deflection(r.at, exact=exact) if r.kind == "reaction" else primary.rotation(r.at, exact=exact))
        for r in redundants
    )
    n = len(redundants)
    flexibility = tuple(
        tuple(_response(load_lines[i], r_j, None, exact) for r_j in redundants) for i in range(n)
    )
    springs = tuple(
        (1 / r.stiffness if exact else 1.0 / float(r.stiffness)) if r.stiffness is not None else _num(0, exact)
        for r in redundants
    )
    system = [[flexibility[i][j] + (springs[i] if i == j else 0) for j in range(n)] for i in range(n)]
    inverse = _inverse(system, exact)
    own = next((k for k, r in enumerate(redundants) if r.kind == quantity.kind and r.at == quantity.at), None)
    if own is not None:
        primary_line = None
        shares = tuple(_num(1 if j == own else 0, exact) for j in range(n))
    else:
        primary_line = primary.line(quantity.kind, quantity.at, _side_for(primary, quantity), exact=exact)
        shares = tuple(-_response(primary_line, r, quantity, exact) for r in redundants)
    weights = tuple(sum((inverse[j][i] * shares[j] for j in range(n)), _num(0, exact)) for i in range(n))
    return ForceMethod(beam, quantity, primary, redundants, load_lines, flexibility, springs,
                       tuple(tuple(row) for row in inverse), primary_line, own, shares, weights, exact)


# ------------------------------------------------------------------ helpers
def _num(value: int, exact: bool) -> Number:
    return Fraction(value) if exact else float(value)


def _side_for(primary: Beam, quantity: Quantity) -> Any:
    """The face to ask of the primary structure: the quantity's own, where it still jumps there."""
    if quantity.kind in ("reaction", "moment_reaction"):
        return None
    return quantity.side


def _response(line: InfluenceLine, redundant: Redundant, quantity: Quantity | None, exact: bool) -> Number:
    """The value of ``line``'s quantity on the primary structure under ``X = 1`` acting downward
    (a force) or clockwise (a couple) at the redundant's point: the line's ordinate, or its slope, there.

    At the quantity's own section the force stands between the two faces: the
    left face sees it on its right, the right face on its left.
    """
    x = redundant.at
    if quantity is not None and quantity.at == x and quantity.side is not None:
        side: str | None = "right" if quantity.side == "left" else "left"
    else:
        side = "left" if float(x) == line.length else "right"
    if redundant.kind == "reaction":
        return _value(line, x, side, exact)
    return _slope(line, x, side, exact)


def _value(line: InfluenceLine, x: Any, side: str | None, exact: bool) -> Number:
    if exact:
        return line.ordinate_exact(x, side)  # type: ignore[arg-type]
    xf = float(x)
    if side == "left":
        return float(line.left(xf))
    return float(line.right(xf)) if xf < line.length else float(line(xf))


def _slope(line: InfluenceLine, x: Fraction, side: str | None, exact: bool) -> Number:
    if not exact:
        return float(line.slope(float(x), "left" if side == "left" else "right"))
    knots = line.exact_breakpoints
    assert knots is not None
    j = bisect.bisect_left(knots, x) - 1 if side == "left" else bisect.bisect_right(knots, x) - 1
    j = min(max(j, 0), len(knots) - 2)
    piece = line.pieces[j]
    assert piece.exact is not None
    t = x - knots[j]
    return sum((p * c * t ** (p - 1) for p, c in enumerate(piece.exact) if p), Fraction(0))


def _inverse(matrix: list[list[Number]], exact: bool) -> list[list[Number]]:
    n = len(matrix)
    if not exact:
        a = np.array(matrix, dtype=float)
        scale = 1.0 / np.sqrt(np.abs(np.diag(a)))
        scaled = a * scale[:, None] * scale[None, :]
        condition = float(np.linalg.cond(scaled))
        if not np.isfinite(condition) or condition > 1e10:
            raise IllConditionedError(
                f"force method: the flexibility matrix is too ill-conditioned for float arithmetic (condition "
                f"number about {condition:.1e}); ask for the exact line (exact=True) or for the stiffness-method "
                "derivation (method='stiffness').",
                condition=condition,
                limit=1e10,
            )
        return (np.linalg.inv(scaled) * scale[:, None] * scale[None, :]).tolist()
    rows = [[Fraction(v) for v in row] + [Fraction(int(i == k)) for k in range(n)] for i, row in enumerate(matrix)]
    for col in range(n):
        pivot = next(r for r in range(col, n) if rows[r][col] != 0)  # F + diag(1/k) is positive definite
        rows[col], rows[pivot] = rows[pivot], rows[col]
        head = rows[col][col]
        rows[col] = [v / head for v in rows[col]]
        for r in range(n):
            if r != col and rows[r][col] != 0:
                factor = rows[r][col]
                rows[r] = [a - factor * b for a, b in zip(rows[r], rows[col])]
    return [row[n:] for row in rows]


def _combine(terms: list[tuple[Number, InfluenceLine]], exact: bool) -> tuple[tuple[Number, ...], tuple]:
    """Knots and cubic coefficients of ``Σ weight · line`` (pieces added on the union of the knots)."""
    if exact:
        knot_sets = [line.exact_breakpoints for _, line in terms]
        assert all(k is not None for k in knot_sets)
    else:
        knot_sets = [line.breakpoints for _, line in terms]
    knots = sorted(set().union(*knot_sets))  # type: ignore[arg-type]
    zero = _num(0, exact)
    out = []
    for a in knots[:-1]:
        total = [zero] * 4
        for (weight, line), own in zip(terms, knot_sets):
            j = bisect.bisect_right(own, a) - 1  # type: ignore[arg-type]
            piece = line.pieces[j]
            local = (piece.exact if exact else piece.coefficients) or ()
            padded = tuple(local) + (zero,) * (4 - len(local))
            start = piece.exact_start if exact else piece.start
            moved = shift(padded, a - start)  # type: ignore[operator]
            total = [s + weight * c for s, c in zip(total, moved)]
        out.append(tuple(total))
    return tuple(knots), tuple(out)
