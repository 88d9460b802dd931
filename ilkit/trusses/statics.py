"""Statics of a pin-jointed plane truss, exactly: equilibrium of the joints, stability, mechanisms.

Unknowns are the member forces and the support reactions.  A member force
enters the equilibrium of its joints through its *force density*
``t = N / L``: member ``a-b`` pulls joint ``a`` by ``t (x_b - x_a, y_b - y_a)``
(tension positive), so every coefficient is a difference of joint
coordinates, rational when the coordinates are, and the member force is
``N = t L``.  The equilibrium matrix ``A`` has two rows per joint
(horizontal, vertical) and one column per member and per reaction
component (a pin gives a horizontal and a vertical reaction, a roller a
vertical one); for loads ``P`` on the joints, ``A s + P = 0``.

* The rank of ``A`` tells stability (rank ``2J``: no mechanism) and the
  degree of static indeterminacy (columns beyond the rank).
* The mechanisms of an unstable truss are the joint movements ``d`` with
  ``A^T d = 0``: every member keeps its length (to first order) and every
  support holds.  They are named by the joints that move, the rigid parts
  that move against each other and the members that join them, or, when the
  supports are what is missing, by the rigid-body movement of the whole truss.
* A determinate truss (``A`` square, full rank) is solved exactly, for every
  unit load on the deck at once (method of joints, all joints together;
  :class:`fractions.Fraction`).
* Müller-Breslau: the joint movements ``d`` with ``A^T d = L e_m`` are those of
  the truss with member ``m`` shortened by 1 and every other member and
  support unchanged (the released truss is a mechanism of one degree of
  freedom); the deck's upward movement at each panel point is then the
  member's influence ordinate there.

Everything here is exact; member forces whose length is irrational (the
square root of a rational) are returned as ``t`` and ``L²`` for the caller to
combine.
"""

from __future__ import annotations

import math
from collections.abc import Mapping, Sequence
from dataclasses import dataclass
from fractions import Fraction

from ilkit import _exact
from ilkit._exact import Row, fmt

__all__ = ["Layout", "TrussStability", "equilibrium", "analyse", "solve_unit_loads", "released_shape",
           "exact_sqrt"]

Point = tuple[Fraction, Fraction]


@dataclass(frozen=True)
class Layout:
    """The numbers of a truss the statics need (names in a fixed order).

    ``joints`` names and ``coordinates`` in the same order; ``members`` as
    ``(name, a, b)`` with joint indices; ``reactions`` as ``(joint index,
    direction)`` with direction ``"x"`` or ``"y"``.
    """

    joints: tuple[str, ...]
    coordinates: tuple[Point, ...]
    members: tuple[tuple[str, int, int], ...]
    reactions: tuple[tuple[int, str], ...]

    @property
    def unknowns(self) -> int:
        """Member forces and reaction components."""
        return len(self.members) + len(self.reactions)


def equilibrium(layout: Layout) -> list[Row]:
    """The rows of ``A`` (two per joint: horizontal then vertical); columns: members, then reactions."""
    rows: list[Row] = [{} for _ in range(2 * len(layout.joints))]
    xy = layout.coordinates
    for m, (_, a, b) in enumerate(layout.members):
        dx, dy = xy[b][0] - xy[a][0], xy[b][1] - xy[a][1]
        for joint, sign in ((a, 1), (b, -1)):
            if dx:
                rows[2 * joint][m] = sign * dx
            if dy:
                rows[2 * joint + 1][m] = sign * dy
    base = len(layout.members)
    for r, (joint, direction) in enumerate(layout.reactions):
        rows[2 * joint + (0 if direction == "x" else 1)][base + r] = Fraction(1)
    return rows


def _transpose(rows: list[Row], ncols: int) -> list[Row]:
    out: list[Row] = [{} for _ in range(ncols)]
    for i, row in enumerate(rows):
        for j, v in row.items():
            out[j][i] = v
    return out


# ----------------------------------------------------------------------- stability
@dataclass(frozen=True)
class TrussStability:
    """Stability and determinacy of a truss.

    ``degree`` is the degree of static indeterminacy (member forces and
    reaction components beyond what the joints' equilibrium fixes);
    ``motions`` the number of independent ways the truss can move as a
    mechanism (0 for a stable truss).  For a mechanism ``joints`` names the
    joints that move, ``parts`` the rigid parts that move against each other,
    ``members`` the members that join those parts (or, without such parts,
    the members that turn), and ``message`` says it all in words with the
    fix.
    """

    joints_count: int
    unknowns: int
    rank: int
    motions: int = 0
    joints: tuple[str, ...] = ()
    members: tuple[str, ...] = ()
    parts: tuple[tuple[str, ...], ...] = ()
    message: str = ""

    @property
    def degree(self) -> int:
        """Degree of static indeterminacy (0 for a determinate truss)."""
        return self.unknowns - self.rank

    @property
    def is_stable(self) -> bool:
        """False when the truss can move as a mechanism."""
        return self.motions == 0


def analyse(layout: Layout) -> TrussStability:
    """Rank, degree and, for a mechanism, a description of how it moves."""
    rows = equilibrium(layout)
    ncols = layout.unknowns
    rank, _ = _exact.nullspace(rows, ncols) if ncols else (0, [])
    nj = len(layout.joints)
    if rank == 2 * nj:
        return TrussStability(nj, ncols, rank)
    _, modes = _exact.nullspace(_transpose(rows, ncols), 2 * nj)
    return _describe(layout, rank, modes)


def _rigid_modes(layout: Layout) -> list[tuple[Fraction, Fraction, Fraction]]:
    """Rigid-body movements of the whole truss that the supports allow: ``(a, b, c)`` for
    ``u = a - c y``, ``v = b + c x`` (translation ``(a, b)``, counter-clockwise rotation ``c``)."""
    rows: list[Row] = []
    for joint, direction in layout.reactions:
        x, y = layout.coordinates[joint]
        rows.append({0: Fraction(1), 2: -y} if direction == "x" else {1: Fraction(1), 2: x})
    _, basis = _exact.nullspace([{k: v for k, v in r.items() if v} for r in rows], 3)
    return [(v[0], v[1], v[2]) for v in basis]


def _moves(mode: Sequence[Fraction], j: int) -> bool:
    return bool(mode[2 * j] or mode[2 * j + 1])


def _describe(layout: Layout, rank: int, modes: list[list[Fraction]]) -> TrussStability:
    names = layout.joints
    xy = layout.coordinates
    nj = len(names)
    moving = [j for j in range(nj) if any(_moves(d, j) for d in modes)]

    def turns(a: int, b: int) -> bool:  # the member's ends move differently across it
        dx, dy = xy[b][0] - xy[a][0], xy[b][1] - xy[a][1]
        return any((d[2 * b + 1] - d[2 * a + 1]) * dx - (d[2 * b] - d[2 * a]) * dy for d in modes)

    turning = tuple(name for name, a, b in layout.members if turns(a, b))
    parts = _rigid_parts(layout, modes, moving)
    links = tuple(name for name, a, b in layout.members
                  if len(parts) > 1 and not any(a in part and b in part for part in parts))
    count = len(modes)
    ways = "one way" if count == 1 else f"{count} independent ways"
    rigid = _rigid_modes(layout)
    if rigid:
        words = "; or ".join(_rigid_words(layout, mode) for mode in rigid)
        message = (
            f"the truss is a mechanism ({ways}): the supports do not hold it in place, the whole truss can {words}. "
            "Add a support or change one (a 'pin' holds both ways, a 'roller' only vertically), so that the "
            "support reactions neither all run parallel nor all pass through one point."
        )
        if count > len(rigid):
            message += " Besides, " + _internal_words(layout, parts, links, moving)
    else:
        message = f"the truss is a mechanism ({ways}): " + _internal_words(layout, parts, links, moving)
    return TrussStability(
        nj, layout.unknowns, rank, count, tuple(names[j] for j in moving), links or turning,
        tuple(tuple(names[j] for j in part) for part in parts), message,
    )


def _rigid_words(layout: Layout, mode: tuple[Fraction, Fraction, Fraction]) -> str:
    a, b, c = mode
    if c == 0:
        if a and b:
            return "slide (both horizontally and vertically: no support holds it)"
        return "slide horizontally (no support holds it horizontally)" if a else "move vertically"
    cx, cy = -b / c, a / c
    at = next((n for n, p in zip(layout.joints, layout.coordinates) if p == (cx, cy)), None)
    where = f"joint {at}" if at else f"the point ({fmt(cx)}, {fmt(cy)})"
    return f"turn about {where} (every support reaction passes through it)"


def _internal_words(layout: Layout, parts: list[tuple[int, ...]], links: tuple[str, ...], moving: list[int]) -> str:
    names = layout.joints
    if len(moving) <= 2 and len(parts) <= 1:
        joints = " and ".join(names[j] for j in moving)
        held = [name for name, a, b in layout.members if a in moving or b in moving]
        by = f"member{'s' if len(held) != 1 else ''} {', '.join(held)}" if held else "no member"
        return (f"joint{'s' if len(moving) > 1 else ''} {joints} can move while every member keeps its length: "
                f"{'they are' if len(moving) > 1 else 'it is'} held only by {by}"
                f"{', in one line' if len(held) > 1 else ''}. Add a member to brace "
                f"{'them' if len(moving) > 1 else 'it'} (or a support there).")
    listed = "; ".join("joints " + ", ".join(names[j] for j in part) for part in parts)
    joined = (f": they are joined only by member{'s' if len(links) > 1 else ''} {', '.join(links)}, which turn"
              f"{'s' if len(links) == 1 else ''} like links") if links else ""
    return (f"its rigid parts ({listed}) can move against each other while every member keeps its length"
            f"{joined}. Add a member that braces the parts against each other (for example the diagonal of a "
            "panel that has none), or a support.")


def _rigid_parts(layout: Layout, modes: list[list[Fraction]], moving: list[int]) -> list[tuple[int, ...]]:
    """Groups of three or more joints (at least one of them moving) that keep their distances in every
    mechanism: the rigid parts that move against each other (the held part of the truss counts as one)."""
    xy = layout.coordinates

    def keeps(i: int, j: int) -> bool:
        dx, dy = xy[j][0] - xy[i][0], xy[j][1] - xy[i][1]
        return all((d[2 * j] - d[2 * i]) * dx + (d[2 * j + 1] - d[2 * i + 1]) * dy == 0 for d in modes)

    nj = len(layout.joints)
    order = sorted(range(nj), key=lambda j: (xy[j][0], xy[j][1]))
    parts: list[list[int]] = []
    for j in order:
        for part in parts:
            if all(keeps(i, j) for i in part):
                part.append(j)
                break
        else:
            parts.append([j])
    moving_set = set(moving)
    big = [tuple(p) for p in parts if len(p) >= 3]
    return [p for p in big if moving_set & set(p)] + [p for p in big if not moving_set & set(p)][:1]


# ------------------------------------------------------------------------- solving
def _eliminate(rows: list[Row], ncols: int) -> list[tuple[int, Row]] | None:
    """Forward elimination (exact) of a square system whose right-hand sides ride along as columns
    ``ncols, ncols + 1, ...``; the pivot rows with their pivot columns, or ``None`` when singular."""
    work = [dict(r) for r in rows]
    pivots: list[tuple[int, Row]] = []
    for col in range(ncols):
        having = [i for i, r in enumerate(work) if col in r]
        if not having:
            return None
        best = min(having, key=lambda i: len(work[i]))
        prow = work[best]
        pv = prow[col]
        for i in having:
            if i == best:
                continue
            row = work[i]
            factor = row[col] / pv
            for c, v in prow.items():
                nv = row.get(c, 0) - factor * v
                if nv:
                    row[c] = nv
                else:
                    row.pop(c, None)
        pivots.append((col, prow))
        work[best] = work[-1]
        work.pop()
    return pivots


def _back(pivots: list[tuple[int, Row]], ncols: int, rhs: int) -> list[list[Fraction]]:
    """Solutions ``[column][right-hand side]`` from the pivot rows of :func:`_eliminate`."""
    sol: list[list[Fraction]] = [[Fraction(0)] * rhs for _ in range(ncols)]
    for col, row in reversed(pivots):
        pv = row[col]
        values = [row.get(ncols + k, Fraction(0)) for k in range(rhs)]
        for c, v in row.items():
            if c == col or c >= ncols:
                continue
            known = sol[c]
            for k in range(rhs):
                if known[k]:
                    values[k] -= v * known[k]
        sol[col] = [value / pv for value in values]
    return sol


def solve_unit_loads(layout: Layout, loaded: Sequence[int]) -> list[list[Fraction]]:
    """Member force densities and reactions for a unit downward load at each joint of ``loaded``.

    Returns ``[unknown][case]``: columns of :func:`equilibrium` (force density
    ``t = N / L`` of each member, then each reaction component), one value per
    loaded joint.  The truss must be stable and determinate.
    """
    rows = equilibrium(layout)
    ncols = layout.unknowns
    for k, joint in enumerate(loaded):
        rows[2 * joint + 1][ncols + k] = Fraction(1)  # A s = -P, P = -1 vertically
    pivots = _eliminate(rows, ncols)
    if pivots is None:  # pragma: no cover - the model checks stability and determinacy first
        raise ArithmeticError("the truss is not stable and determinate")
    return _back(pivots, ncols, len(loaded))


def released_shape(layout: Layout, column: int) -> list[Fraction]:
    """Joint movements ``[u0, v0, u1, v1, ...]`` with ``A^T d = e_column`` (exact), for a stable determinate
    truss.  For a member column the member shortens by ``1 / L`` and every other member keeps its length
    (``L`` times this is the shape for a unit shortening); for a reaction column the support moves by 1 in
    the direction of its reaction (up for a vertical one) and the other supports hold."""
    rows = _transpose(equilibrium(layout), layout.unknowns)
    n = 2 * len(layout.joints)
    rows[column][n] = Fraction(1)
    pivots = _eliminate(rows, n)
    if pivots is None:  # pragma: no cover
        raise ArithmeticError("the truss is not stable and determinate")
    return [v[0] for v in _back(pivots, n, 1)]


def exact_sqrt(square: Fraction) -> Fraction | None:
    """The exact square root of a non-negative rational, or ``None`` when it is irrational."""
    num, den = math.isqrt(square.numerator), math.isqrt(square.denominator)
    if num * num == square.numerator and den * den == square.denominator:
        return Fraction(num, den)
    return None


def member_lengths(layout: Layout) -> Mapping[str, Fraction]:
    """``L²`` of every member, by name."""
    xy = layout.coordinates
    return {
        name: (xy[b][0] - xy[a][0]) ** 2 + (xy[b][1] - xy[a][1]) ** 2 for name, a, b in layout.members
    }
