"""Exact kinematic (Müller-Breslau) analysis of beams made of rigid parts.

The beam is cut at its internal releases into rigid parts.  Part ``i`` from
``a_i`` to ``b_i`` moves by an upward translation and a counter-clockwise
rotation, so that its upward displacement is ``u(x) = w_i + r_i (x - a_i)``.
Supports and releases are linear constraints on ``(w_i, r_i)``:

* a support: ``u(s) = 0``; a fixed support also ``u'(s) = 0``; a spring
  support counts as the restraint it makes elastic (for stability, the degree
  of indeterminacy and the statics of a determinate beam a spring carries load
  like a support);
* a hinge at ``h``: ``u`` continuous (slopes free);
* a shear release at ``h``: slopes equal (``u`` may jump).

The rank of the constraint matrix tells stability (a null space means a
mechanism) and the degree of static indeterminacy (constraints beyond the
rank).  For a determinate beam, the influence line of a force quantity comes
from inserting its release, imposing the unit displacement conjugate to it
and reading the upward displacement of the mechanism (Müller-Breslau):

* reaction: the support moves up by 1;
* moment reaction: the fixed support rotates counter-clockwise by 1;
* shear at ``a``: the part right of ``a`` moves up by 1 relative to the left
  part, slopes equal;
* bending moment at ``a``: the faces rotate so that ``u'(a-) - u'(a+) = 1``
  (a unit sagging kink), ``u`` continuous.

All arithmetic is exact (:class:`fractions.Fraction`).
"""

from __future__ import annotations

from dataclasses import dataclass, field
from fractions import Fraction
from typing import TYPE_CHECKING

from ilkit import _exact
from ilkit._exact import Row, fmt, fmt_precise
from ilkit.errors import IlkitError, IndeterminateBeamError, UnstableBeamError
from ilkit.influence import InfluenceLine
from ilkit.quantity import Quantity

if TYPE_CHECKING:  # pragma: no cover
    from ilkit.model import Beam

__all__ = [
    "Stability", "Mechanism", "PartMotion", "analyse_stability", "solve_mechanism", "exact_line", "nothing_released"
]


@dataclass(frozen=True)
class PartMotion:
    """Movement of one rigid part: ``u(x) = w + r (x - start)`` (upward)."""

    start: Fraction
    end: Fraction
    w: Fraction
    r: Fraction

    def at(self, x: Fraction) -> Fraction:
        """Upward displacement of the part at ``x``."""
        return self.w + self.r * (x - self.start)

    @property
    def pivot(self) -> Fraction | None:
        """Point about which the part turns (``None`` for a pure translation)."""
        if self.r == 0:
            return None
        return self.start - self.w / self.r


@dataclass(frozen=True)
class Constraint:
    """One row of the kinematic system, with words for derivations."""

    row: Row
    rhs: Fraction
    text: str


@dataclass(frozen=True)
class Stability:
    """Stability and determinacy of a beam.

    ``unknowns`` is twice the number of rigid parts; ``constraints`` counts
    the support and release conditions; ``rank`` is the rank of their matrix.
    ``degree = constraints - rank``; the beam is a mechanism when
    ``rank < unknowns``, with ``motions`` describing how it moves.
    """

    unknowns: int
    constraints: int
    rank: int
    motions: tuple[str, ...] = ()
    message: str = ""

    @property
    def degree(self) -> int:
        """Degree of static indeterminacy."""
        return self.constraints - self.rank

    @property
    def is_stable(self) -> bool:
        """False when the beam can move as a mechanism."""
        return self.rank == self.unknowns

    def raise_if_unstable(self) -> None:
        """Raise :class:`UnstableBeamError` for a mechanism."""
        if not self.is_stable:
            raise UnstableBeamError(self.message, motions=self.motions)


@dataclass(frozen=True)
class Mechanism:
    """The released beam and its displaced shape for one quantity.

    ``parts`` are the rigid parts of the released beam with their movement
    (column ``2k`` of a constraint row is ``w`` of part ``k``, column
    ``2k + 1`` its ``r``); ``constraints`` the conditions solved, the imposed
    one included; ``imposed`` the words for the unit displacement;
    ``release`` the words for the restraint removed; ``beam`` the beam
    analysed (for drawings of the released beam).
    """

    quantity: Quantity
    parts: tuple[PartMotion, ...]
    constraints: tuple[Constraint, ...] = field(repr=False)
    imposed: str = ""
    release: str = ""
    beam: Beam | None = field(default=None, repr=False, compare=False)


# --------------------------------------------------------------------- building
def _bounds(beam: Beam, cut: Fraction | None) -> list[Fraction]:
    points = sorted({p for p, _ in beam.releases} | ({cut} if cut is not None and 0 < cut < beam.length else set()))
    bounds = [Fraction(0), *points, beam.length]
    if cut is not None and cut == 0:
        bounds.insert(0, Fraction(0))
    if cut is not None and cut == beam.length:
        bounds.append(beam.length)
    return bounds


def _u(part: int, start: Fraction, x: Fraction) -> Row:
    row: Row = {2 * part: Fraction(1)}
    if x != start:
        row[2 * part + 1] = x - start
    return row


def _slope(part: int) -> Row:
    return {2 * part + 1: Fraction(1)}


def _diff(a: Row, b: Row) -> Row:
    out = dict(a)
    for k, v in b.items():
        out[k] = out.get(k, Fraction(0)) - v
        if not out[k]:
            del out[k]
    return out


def _constraints(beam: Beam, quantity: Quantity | None) -> tuple[list[Fraction], list[Constraint], str, str]:
    """Constraints of the beam, released and displaced for ``quantity`` (if any)."""
    kind = quantity.kind if quantity else None
    cut = quantity.at if kind in ("shear", "moment", "hinge_shear") else None
    assert quantity is None or kind is not None
    bounds = _bounds(beam, cut)
    nparts = len(bounds) - 1
    hinge_set = set(beam.hinges)
    shear_set = set(beam.shear_releases)
    rows: list[Constraint] = []
    imposed = release = ""

    # connections at interior bounds (index k joins part k-1 and part k)
    cut_index: int | None = None
    for k in range(1, nparts):
        p = bounds[k]
        left, right = k - 1, k
        is_cut = cut is not None and p == cut and (cut_index is None)
        if is_cut:
            cut_index = k
        disp = p in hinge_set or (is_cut and p not in shear_set)
        slope = p in shear_set or (is_cut and p not in hinge_set)
        du = _diff(_u(right, bounds[right], p), _u(left, bounds[left], p))
        ds = _diff(_slope(left), _slope(right))
        if disp:
            if is_cut and kind in ("shear", "hinge_shear"):
                rows.append(Constraint(du, Fraction(1), f"u(x={fmt(p)}+) − u(x={fmt(p)}−) = 1"))
                release = f"a shear release (sliding, equal slopes) at x={fmt(p)}"
                if p in hinge_set:
                    release = f"the hinge at x={fmt(p)} also freed to slide (the beam is cut through)"
                imposed = f"the part right of x={fmt(p)} is moved up by 1 relative to the part left of it"
            else:
                rows.append(Constraint(du, Fraction(0), f"u continuous at x={fmt(p)}"))
        if slope:
            if is_cut and kind == "moment":
                rows.append(Constraint(ds, Fraction(1), f"u'(x={fmt(p)}−) − u'(x={fmt(p)}+) = 1"))
                release = f"a hinge at x={fmt(p)}"
                if p in shear_set:
                    release = f"the shear release at x={fmt(p)} also freed to rotate (the beam is cut through)"
                imposed = f"a unit sagging kink at x={fmt(p)}: the faces rotate by 1 rad relative to each other"
            else:
                rows.append(Constraint(ds, Fraction(0), f"equal slopes at x={fmt(p)}"))

    side = quantity.side if quantity else None
    for s in beam.supports:
        part = _part_of(bounds, s.at, cut_index, side)
        target_u = kind == "reaction" and quantity is not None and s.at == quantity.at
        target_r = kind == "moment_reaction" and quantity is not None and s.at == quantity.at
        rows.append(
            Constraint(
                _u(part, bounds[part], s.at),
                Fraction(1 if target_u else 0),
                f"u(x={fmt(s.at)}) = {1 if target_u else 0} at the {s.kind} support",
            )
        )
        if target_u:
            release = f"the vertical restraint of the support at x={fmt(s.at)} removed"
            imposed = f"the support point x={fmt(s.at)} is moved up by 1"
        if s.restrains_rotation:
            rows.append(
                Constraint(
                    _slope(part),
                    Fraction(1 if target_r else 0),
                    f"u'(x={fmt(s.at)}) = {1 if target_r else 0} at the {s.kind} support",
                )
            )
            if target_r:
                release = f"the rotational restraint of the {s.kind} support at x={fmt(s.at)} removed"
                imposed = f"the {s.kind} support x={fmt(s.at)} is rotated counter-clockwise by 1 rad"
    return bounds, rows, imposed, release


def _part_of(bounds: list[Fraction], x: Fraction, cut_index: int | None, side: str | None) -> int:
    """Index of the part that carries a support at ``x``."""
    nparts = len(bounds) - 1
    if cut_index is not None and bounds[cut_index] == x:
        # a section at the support: for the face left of the support, the
        # support belongs to the right part, and vice versa
        return cut_index if side == "left" else cut_index - 1
    for k in range(nparts):
        if bounds[k] <= x <= bounds[k + 1]:
            return k
    raise AssertionError("support outside the beam")  # pragma: no cover


# -------------------------------------------------------------------- stability
def analyse_stability(beam: Beam) -> Stability:
    """Rank, degree of indeterminacy and, for a mechanism, how it moves."""
    bounds, constraints, _, _ = _constraints(beam, None)
    nparts = len(bounds) - 1
    n = 2 * nparts
    rank, basis = _exact.nullspace([c.row for c in constraints], n)
    if not basis:
        return Stability(n, len(constraints), rank)
    motions, message = _describe_mechanism(beam, bounds, basis)
    return Stability(n, len(constraints), rank, motions, message)


def _describe_mechanism(
    beam: Beam, bounds: list[Fraction], basis: list[list[Fraction]]
) -> tuple[tuple[str, ...], str]:
    vec = basis[0]
    moving: list[PartMotion] = []
    for k in range(len(bounds) - 1):
        w, r = vec[2 * k], vec[2 * k + 1]
        if w or r:
            moving.append(PartMotion(bounds[k], bounds[k + 1], w, r))
    names = _point_names(beam)
    motions = []
    for m in moving:
        what = f"the part from x={fmt_precise(m.start)} to x={fmt_precise(m.end)}"
        if m.pivot is None:
            motions.append(f"{what} can move up and down without rotating")
        else:
            at = names.get(m.pivot, f"the point x={fmt_precise(m.pivot)}")
            motions.append(f"{what} can rotate about {at}")
    fixes = []
    if not beam.supports:
        fixes.append("add supports")
    first = moving[0]
    fixes.append(f"add a support between x={fmt_precise(first.start)} and x={fmt_precise(first.end)}")
    ends = [p for p in (first.start, first.end) if p in beam.hinges or p in beam.shear_releases]
    for p in ends:
        fixes.append(f"remove the {names[p].split(' at ')[0].removeprefix('the ')} at x={fmt_precise(p)}")
    pinned = [s for s in beam.supports if s.kind != "fixed" and first.start <= s.at <= first.end]
    if pinned and (pinned[0].at in (Fraction(0), beam.length)):
        fixes.append(f"make the support at x={fmt_precise(pinned[0].at)} fixed")
    extra = len(basis) - 1
    more = f" ({extra} further independent way{'s' if extra > 1 else ''} to move)" if extra else ""
    message = (
        "the beam is unstable (a mechanism): "
        + "; ".join(motions)
        + more
        + ". To fix it, "
        + ", or ".join(fixes)
        + "."
    )
    return tuple(motions), message


def _point_names(beam: Beam) -> dict[Fraction, str]:
    names: dict[Fraction, str] = {}
    for h in beam.hinges:
        names[h] = f"the hinge at x={fmt_precise(h)}"
    for h in beam.shear_releases:
        names[h] = f"the shear release at x={fmt_precise(h)}"
    for s in beam.supports:
        names[s.at] = f"the {s.kind} support at x={fmt_precise(s.at)}" + (
            f" (with {names[s.at]})" if s.at in names else ""
        )
    return names


# ---------------------------------------------------------------- exact lines
def solve_mechanism(beam: Beam, quantity: Quantity) -> Mechanism:
    """Released beam, imposed unit displacement and the resulting movement of every part.

    Only for determinate beams (``beam.degree == 0``); an indeterminate beam
    raises :class:`IndeterminateBeamError` (its lines come from
    :mod:`ilkit.stiffness`, which the beam's own methods use).
    """
    if beam.degree > 0:
        raise IndeterminateBeamError(
            f"{quantity.label}: the beam is statically indeterminate (degree {beam.degree}), so it has no "
            "rigid-part mechanism; ask the beam itself (beam.moment(...), beam.reaction(...)), which uses "
            "the stiffness method."
        )
    bounds, constraints, imposed, release = _constraints(beam, quantity)
    nparts = len(bounds) - 1
    n = 2 * nparts
    if not imposed:
        return _no_release(beam, quantity)
    try:
        solution = _exact.solve([c.row for c in constraints], [c.rhs for c in constraints], n)
    except _exact.SingularSystemError:  # pragma: no cover - guarded by the stability check
        raise IlkitError(
            f"{quantity.label}: the released beam has no unique displaced shape; "
            "check that the beam is determinate (beam.degree == 0)."
        ) from None
    parts = tuple(
        PartMotion(bounds[k], bounds[k + 1], solution[2 * k], solution[2 * k + 1]) for k in range(nparts)
    )
    return Mechanism(quantity, parts, tuple(constraints), imposed, release, beam=beam)


def _no_release(beam: Beam, quantity: Quantity) -> Mechanism:
    """The "mechanism" of a quantity that no restraint carries (moment at a hinge, shear at a shear
    release): nothing to release, nothing moves."""
    bounds, constraints, _, _ = _constraints(beam, quantity)
    parts = tuple(PartMotion(a, b, Fraction(0), Fraction(0)) for a, b in zip(bounds[:-1], bounds[1:]))
    why = "a hinge carries no moment" if quantity.kind == "moment" else "a shear release carries no shear"
    return Mechanism(quantity, parts, tuple(constraints), f"none: {why}", release="", beam=beam)


def nothing_released(beam: Beam, quantity: Quantity, *, exact: bool = True) -> InfluenceLine:
    """The line of a quantity that no restraint carries: the moment at a hinge, the shear at a shear
    release.  It is identically zero, for determinate and indeterminate beams alike; its origin is a
    :class:`Mechanism` with nothing released, so that derivations and sketches say why."""
    zero = Fraction(0) if exact else 0.0
    knots = (Fraction(0), beam.length) if exact else (0.0, float(beam.length))
    return InfluenceLine(
        quantity=quantity, knots=knots, coefficients=((zero,),), units=beam.units, origin=_no_release(beam, quantity)
    )


def exact_line(beam: Beam, quantity: Quantity) -> InfluenceLine:
    """The exact, piecewise-linear influence line of ``quantity`` for a determinate beam."""
    mech = solve_mechanism(beam, quantity)
    knots_set = {Fraction(0), beam.length, quantity.at}
    knots_set.update(s.at for s in beam.supports)
    knots_set.update(p for p, _ in beam.releases)
    knots = sorted(knots_set)
    coefficients = []
    parts = [p for p in mech.parts if p.end > p.start]
    k = 0
    for j in range(len(knots) - 1):
        a = knots[j]
        while parts[k].end <= a:
            k += 1
        part = parts[k]
        coefficients.append((part.at(a), part.r))
    return InfluenceLine(
        quantity=quantity,
        knots=tuple(knots),
        coefficients=tuple(coefficients),
        units=beam.units,
        origin=mech,
    )
