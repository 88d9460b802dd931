"""Loads that reach a girder through a floor system: stringers on floor beams at panel points.

On a through-girder or deck-girder bridge with a floor system, and on every
truss, the deck slab rests on stringers, the stringers span simply from floor
beam to floor beam, and the floor beams bring their reactions to the girder
(or the truss) only at the panel points.  A load at ``x`` between the panel
points ``p_i < x < p_(i+1)`` therefore reaches the girder as two loads, at
``p_i`` and ``p_(i+1)``, in the ratio of the stringer's reactions
(statics of a simple span).  So every influence line of the girder, whatever
its own shape (straight pieces of a determinate girder, cubic pieces of a
continuous one), becomes the chord between its ordinates at the panel points:
straight between panel points, equal to the girder's own ordinate at each
panel point.  Loads beyond the first and the last panel point have no deck to
stand on and count nothing.

At a panel point where the girder's line jumps (the shear at a section that
is a floor beam, named by its face), a load on that floor beam reaches the
girder at the floor beam itself, that is on the other side of the face: the
shear just right of a floor beam takes the load of that floor beam as a load
on its left.  The floor line takes that one-sided value there.

Exact lines stay exact (rational ordinates at the panel points); numeric
lines give numeric ordinates.  Sign conventions are the girder's
(:mod:`ilkit.model`).
"""

from __future__ import annotations

from collections.abc import Sequence
from dataclasses import dataclass
from fractions import Fraction
from typing import TYPE_CHECKING, Any

from ilkit._exact import fmt_precise
from ilkit.errors import BeamInputError, SideRequiredError
from ilkit.influence import InfluenceLine
from ilkit.quantity import Quantity
from ilkit.units import UnitSystem

if TYPE_CHECKING:  # pragma: no cover
    from ilkit.model import Beam

__all__ = ["FloorLine", "through_floor", "panel_line"]

Number = Fraction | float


@dataclass(frozen=True)
class FloorLine:
    """The origin of a line of a girder loaded through a floor system (``line.origin``).

    ``girder`` is the girder's own line (a load standing directly on the
    girder), ``panel_points`` the positions of the floor beams, ``ordinates``
    the line's values there (exact fractions for an exact line), ``beam`` the
    girder.
    """

    beam: Beam | None
    girder: InfluenceLine
    panel_points: tuple[Fraction, ...]
    ordinates: tuple[Number, ...]


def panel_line(
    quantity: Quantity,
    panel_points: Sequence[Fraction],
    ordinates: Sequence[Number],
    length: Fraction,
    *,
    units: UnitSystem | None,
    origin: object,
) -> InfluenceLine:
    """The line that is straight between ``ordinates`` at the sorted ``panel_points`` and 0 beyond them.

    ``length`` is the length of the line (0 to ``length``); the panel points lie
    within it.  Exact when every ordinate is a :class:`Fraction`.
    """
    exact = all(isinstance(y, Fraction) for y in ordinates)
    zero: Number = Fraction(0) if exact else 0.0
    knots: list[Number] = []
    coefficients: list[tuple[Number, ...]] = []
    points = [p if exact else float(p) for p in panel_points]
    if panel_points[0] > 0:
        knots.append(Fraction(0) if exact else 0.0)
        coefficients.append((zero,))
    for j in range(len(points) - 1):
        a, b = points[j], points[j + 1]
        ya, yb = ordinates[j], ordinates[j + 1]
        knots.append(a)
        coefficients.append((ya, (yb - ya) / (b - a)))  # type: ignore[operator]
    end = length if exact else float(length)
    if panel_points[-1] < length:
        knots.append(points[-1])
        coefficients.append((zero,))
    knots.append(end)
    return InfluenceLine(quantity=quantity, knots=tuple(knots), coefficients=tuple(coefficients), units=units,
                         origin=origin)


def _ordinate(line: InfluenceLine, p: Fraction) -> Number:
    """The girder's ordinate for a load on the floor beam at ``p`` (see the module notes on jumps)."""
    q = line.quantity
    exact = line.is_exact

    def side_value(side: str) -> Number:
        if exact:
            return line.ordinate_exact(p, side)  # type: ignore[arg-type]
        return float(line.left(float(p)) if side == "left" else line.right(float(p)))

    if q.side is not None and p == q.at:
        return side_value("left" if q.side == "right" else "right")  # the floor beam is on the other face
    if p == 0:
        return side_value("right")
    end = line.exact_breakpoints[-1] if exact else line.length  # type: ignore[index]
    if p == end:
        return side_value("left")
    left, right = side_value("left"), side_value("right")
    if left != right and (exact or abs(left - right) > 1e-12 * max(1.0, abs(left), abs(right))):  # type: ignore[operator]
        if p == q.at:
            raise SideRequiredError(
                f"{q.label}: the line jumps at its own section x={fmt_precise(p)}, which is a panel point; the "
                "floor beam there loads the girder on one face of the section or the other: name the face with "
                "side='left' or side='right'."
            )
        raise BeamInputError(
            f"{q.label}: the line jumps at the panel point x={fmt_precise(p)} (a shear release stands there), so it "
            "is not clear which side the floor beam loads; move the panel point off the release.",
            field="panel_points",
            value=p,
        )
    return left


def through_floor(line: InfluenceLine, panel_points: Sequence[Any], *, beam: Beam | None = None) -> InfluenceLine:
    """The influence line of the same quantity when the load reaches the girder through a floor system.

    ``panel_points`` are the positions of the floor beams (the girder's length
    unit, exact numbers or floats read by their decimal text), at least two,
    within the girder; the stringers span simply between consecutive ones.
    The result is straight between panel points, equal to ``line`` at each of
    them, and 0 beyond the first and the last (no deck there).  Its origin is a
    :class:`FloorLine`.  ``beam`` is the girder (for drawings and sheets).

    Usually called for you: ``ilkit.Beam(..., panel_points=[...])`` returns
    every line through its floor system.
    """
    from ilkit._check import listed
    from ilkit._exact import to_exact

    if not isinstance(line, InfluenceLine):
        raise BeamInputError(
            f"through_floor: give an influence line (e.g. beam.moment(12)), got {type(line).__name__} {line!r}.",
            field="line",
            value=line,
        )
    raw = listed(panel_points, wanted="panel_points: give a list of positions, e.g. [0, 8, 16, 24]",
                 field="panel_points", ordered=False)
    points = sorted({to_exact(p, field="panel_points") for p in raw})
    length = line.exact_breakpoints[-1] if line.exact_breakpoints else to_exact(line.length, field="length")
    if len(points) < 2 or points[0] < 0 or points[-1] > length:
        raise BeamInputError(
            f"panel_points: give at least two positions from 0 to {fmt_precise(length)} (the floor beams), got "
            f"{raw!r}.",
            field="panel_points",
            value=panel_points,
        )
    ordinates = tuple(_ordinate(line, p) for p in points)
    origin = FloorLine(beam, line, tuple(points), ordinates)
    return panel_line(line.quantity, points, ordinates, length, units=line.units, origin=origin)
