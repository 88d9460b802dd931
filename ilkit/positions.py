"""Which positions along a beam are the same point (the merge tolerance).

Positions typed as float arithmetic land a few units in the last place away
from the point meant: with ``s = 92``, ``2*s + 1.3*s`` is 303.6 but ``3.3*s``
is 303.59999999999997; a support read back from a beam converted with
``in_units`` and typed as a float misses the exact support by about 1e-15 of
its value.  Taken literally such a pair makes a phantom segment 6e-14 long
(an overhang, a stub between a support and a hinge), which changes the
structure and ruins float arithmetic.

So ilkit treats two positions of one beam that lie within
:data:`MERGE_TOLERANCE` times the beam's length of each other as the same
point, and moves them onto one exact value: the beam end if one of them is an
end, else the support, else the hinge or shear release, else (ends of ``EI``
ranges only) the simplest of the values (the one with the smallest
denominator: 10 rather than 9.999999999999998).  This applies to supports,
hinges, shear releases, the ends of ``EI`` ranges and the sections asked for
(``beam.moment(x)`` with ``x`` within the tolerance of a support is the
moment at the support).  Where two positions of the same kind would become
one (two supports, two releases) or a run of close positions is longer than
the tolerance, the merge would be ambiguous and the beam is refused with a
:class:`~ilkit.BeamInputError` that gives the positions at full precision.

The tolerance is far above the rounding of float arithmetic (about 1e-16 of a
value per operation) and far below any distance an engineer means (1e-9 of a
100 m girder is 0.1 micrometre).
"""

from __future__ import annotations

import bisect
from collections.abc import Iterable, Sequence
from dataclasses import dataclass
from fractions import Fraction

from ilkit._exact import fmt_precise
from ilkit.errors import BeamInputError

__all__ = ["MERGE_TOLERANCE", "Point", "merge_points", "nearest", "snap", "tolerance"]

MERGE_TOLERANCE = Fraction(1, 10**9)
"""Positions of one beam closer than this fraction of its length are one point."""

END, SUPPORT, RELEASE, STIFFNESS, PANEL = 0, 1, 2, 3, 4
"""Ranks of points: the lower rank keeps its position when points merge."""


@dataclass(frozen=True)
class Point:
    """A position of a beam as read (exact), with what stands there.

    ``rank`` is one of ``END``, ``SUPPORT``, ``RELEASE``, ``STIFFNESS``, ``PANEL`` (a floor beam);
    ``what`` names the thing in words (``"the support"``); ``field`` the
    argument of :class:`ilkit.Beam` it came from.
    """

    at: Fraction
    rank: int
    what: str
    field: str


def tolerance(length: Fraction) -> Fraction:
    """The largest distance between two positions that are one point, on a beam of ``length``."""
    return length * MERGE_TOLERANCE


def merge_points(length: Fraction, points: Iterable[Point]) -> dict[Fraction, Fraction]:
    """Where each position goes: ``{given: merged}`` for the positions that move.

    The beam's ends (0 and ``length``) are added as points.  Raises
    :class:`~ilkit.BeamInputError` where a merge is ambiguous (see the module
    notes).
    """
    tol = tolerance(length)
    ends = [Point(Fraction(0), END, "the left end", "length"), Point(length, END, "the right end", "length")]
    ordered = sorted([*ends, *points], key=lambda p: (p.at, p.rank))
    moved: dict[Fraction, Fraction] = {}
    start = 0
    for k in range(1, len(ordered) + 1):
        if k < len(ordered) and ordered[k].at - ordered[k - 1].at <= tol:
            continue
        cluster = ordered[start:k]
        start = k
        if len({p.at for p in cluster}) > 1:
            target = _target(cluster, tol)
            moved.update({p.at: target for p in cluster if p.at != target})
    return moved


def _target(cluster: Sequence[Point], tol: Fraction) -> Fraction:
    """The one position of a run of close points (or an error naming them)."""
    first, last = cluster[0], cluster[-1]
    if last.at - first.at > tol:
        listed = ", ".join(dict.fromkeys(f"{p.what} at x={fmt_precise(p.at)}" for p in cluster))
        raise BeamInputError(
            f"{last.field}: {listed} follow each other closer than {_tolerance_words(tol)} but span "
            f"{fmt_precise(last.at - first.at)}, so it is not clear which of them are one point. Give the points "
            "that are meant to coincide the same value, and place the others further apart.",
            field=last.field,
            value=last.at,
        )
    for rank in (SUPPORT, RELEASE):  # two supports, or two releases, cannot become one point
        values = sorted({p.at for p in cluster if p.rank == rank})
        if len(values) > 1:
            a = next(p for p in cluster if p.rank == rank and p.at == values[0])
            b = next(p for p in cluster if p.rank == rank and p.at == values[1])
            keep = "keep one of them (use 'fixed' for a support that also restrains rotation)"
            if rank == RELEASE:
                keep = ("keep one of them (a hinge and a shear release at one point would cut the beam in two)"
                        if a.what != b.what else "keep one of them")
            raise BeamInputError(
                f"{b.field}: {a.what} at x={fmt_precise(a.at)} and {b.what} at x={fmt_precise(b.at)} are "
                f"{fmt_precise(b.at - a.at)} apart, closer than {_tolerance_words(tol)}, so they would be one "
                f"point; {keep}, or place them further apart.",
                field=b.field,
                value=b.at,
            )
    best = min(p.rank for p in cluster)
    anchors = [p.at for p in cluster if p.rank == best]
    return min(anchors, key=lambda v: (v.denominator, abs(v)))


def _tolerance_words(tol: Fraction) -> str:
    return f"the merge tolerance ({fmt_precise(tol)}: {float(MERGE_TOLERANCE):.0e} of the beam's length)"


def snap(position: Fraction, points: Sequence[Fraction], length: Fraction) -> Fraction:
    """``position`` moved onto the nearest of the sorted ``points`` when it lies within the merge tolerance."""
    near = nearest(position, points)
    if near is not None and abs(near - position) <= tolerance(length):
        return near
    return position


def nearest(position: Fraction, points: Sequence[Fraction]) -> Fraction | None:
    """The one of the sorted ``points`` nearest to ``position`` (``None`` when there are none)."""
    k = bisect.bisect_left(points, position)
    around = points[max(k - 1, 0) : k + 1]
    return min(around, key=lambda p: abs(p - position), default=None)
