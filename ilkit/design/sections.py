"""The sections of a design study: where effects are tabulated along a beam.

:func:`envelope_sections` gives the same sections as :func:`ilkit.loads.envelope`: the beam's ends,
every support, every internal release and ``divisions`` equal parts of every span and overhang,
with both faces (``side="left"`` and ``side="right"``) at interior supports and releases, where
shears (and, at a fixed support, moments) jump.  Permanent effects, live-load envelopes and
factored envelopes share them, so their tables join on ``(x, side)``.

:func:`load_ordinate` is the one rule for a point load (an axle, a column load) standing exactly
at a section where the influence line jumps: which one-sided ordinate it takes.
"""

from __future__ import annotations

from collections.abc import Iterable
from dataclasses import dataclass
from fractions import Fraction
from typing import TYPE_CHECKING

from ilkit._check import choice
from ilkit._exact import fmt, fmt_precise, to_exact
from ilkit.errors import LoadInputError
from ilkit.floor import FloorLine
from ilkit.loads.envelope import MAX_DIVISIONS, section_faces
from ilkit.model import Beam
from ilkit.quantity import Side

if TYPE_CHECKING:  # pragma: no cover
    from ilkit.influence import InfluenceLine

__all__ = ["Section", "envelope_sections", "load_ordinate", "MAX_DIVISIONS"]


@dataclass(frozen=True)
class Section:
    """A section of a beam: position ``x`` (in the beam's length unit, from the left end; kept exact) and
    the face ``side`` (``"left"`` or ``"right"`` at interior supports and releases, where shears jump;
    ``None`` elsewhere and at the ends).

    Sections sort left to right, the left face before the right one.
    """

    x: Fraction
    side: Side | None = None

    def __post_init__(self) -> None:
        object.__setattr__(self, "x", to_exact(self.x, field="Section: x", error=LoadInputError))
        choice(self.side, ("left", "right"), what="Section: side", field="side", error=LoadInputError, optional=True)

    def __lt__(self, other: object) -> bool:  # the left face first, then no side, then the right face
        if not isinstance(other, Section):
            return NotImplemented
        return (self.x, _FACE[self.side]) < (other.x, _FACE[other.side])

    @property
    def label(self) -> str:
        """``"x=12.5"`` or ``"x=24 (left)"``."""
        return f"x={fmt(self.x)}" + (f" ({self.side})" if self.side else "")

    def __repr__(self) -> str:
        side = f", {self.side!r}" if self.side else ""
        return f"Section({fmt_precise(self.x)}{side})"


_FACE = {"left": 0, None: 1, "right": 2}


def envelope_sections(
    beam: Beam, divisions: int = 10, at: Iterable[object] = ()
) -> tuple[Section, ...]:
    """The sections of ``beam`` where envelopes are tabulated, left to right.

    The ends, every support, every hinge and shear release, every floor beam
    of a floor system (``Beam(panel_points=...)``), ``divisions`` equal parts
    of each span and overhang (10: tenth points), and the further positions
    ``at`` (in the beam's length unit, or pint quantities); a position within
    the merge tolerance of a support or release is that point
    (:meth:`ilkit.Beam.position`).  At interior supports, releases and floor
    beams both faces are listed (``side="left"`` and ``"right"``), elsewhere
    one section with ``side=None``.  These are exactly the sections of
    :func:`ilkit.loads.envelope` with the same arguments.
    """
    if not isinstance(beam, Beam):
        raise LoadInputError(f"envelope_sections: give a Beam, got {type(beam).__name__} {beam!r}.", field="beam",
                             value=beam)
    return tuple(Section(p, side) for p, side in section_faces(beam, divisions, at))


def load_ordinate(line: InfluenceLine, x: float, side: Side | None, *, own_section: bool = False) -> float:
    """The ordinate of ``line`` for a point load at ``x`` standing on ``side`` of it.

    ``side="left"``: the load stands just left of ``x`` (the line's left-hand
    value there), ``"right"``: just right of it, ``None``: at ``x`` where the
    line does not jump (its value there).

    ``own_section=True`` says that ``x`` is the section of ``line`` itself (a
    shear line at its own section jumps by -1 as the load crosses it from
    right to left); ``side`` then says on which side of the cut the load
    stands, and at the beam's ends, where one side of the cut is off the
    beam, the value comes from the other side and the unit jump: a load at
    the left end, left of a cut just inside the beam, takes the right-hand
    value minus 1; a load at the right end, right of a cut just inside it,
    the left-hand value plus 1.  A line of a girder loaded through a floor
    system (:mod:`ilkit.floor`) does not jump at its own section: the floor
    beam there already loads the other face, so its value is taken.  In the
    line's unit per unit downward load, with the signs of :mod:`ilkit.model`.
    """
    if own_section and isinstance(line.origin, FloorLine):
        return float(line(x))
    if not own_section or side is None:
        if side == "left":
            return float(line.left(x))
        if side == "right":
            return float(line.right(x))
        return float(line(x))
    if side == "right":
        return float(line.right(x)) if x < line.length else float(line.left(x)) + 1.0
    return float(line.left(x)) if x > 0 else float(line.right(x)) - 1.0
