"""What an influence line is for: the quantity, where it is taken, and its side."""

from __future__ import annotations

from dataclasses import dataclass
from fractions import Fraction
from typing import Literal

from ilkit._check import choice
from ilkit._exact import fmt_precise, to_exact
from ilkit.errors import BeamInputError

__all__ = ["Quantity", "QuantityKind", "Side", "KINDS", "TRUSS_KINDS"]

QuantityKind = Literal[
    "reaction", "moment_reaction", "shear", "moment", "hinge_shear", "deflection", "rotation", "member_force"
]
Side = Literal["left", "right"]

KINDS: dict[str, tuple[str, str]] = {
    # kind: (symbol, plain words)
    "reaction": ("R", "vertical reaction"),
    "moment_reaction": ("M_R", "moment reaction"),
    "shear": ("V", "shear"),
    "moment": ("M", "bending moment"),
    "hinge_shear": ("V_h", "shear through the hinge"),
    "deflection": ("δ", "deflection"),
    "rotation": ("θ", "rotation"),
}
"""The quantities a line can be asked for: ``kind -> (symbol, words)``; each is a method of
:class:`~ilkit.Beam` of the same name (``beam.moment(at)``).  Units and signs: see
:mod:`ilkit.model`."""

TRUSS_KINDS: dict[str, tuple[str, str]] = {
    "member_force": ("N", "member force"),
}
"""Quantities of a truss beyond the reactions (:mod:`ilkit.trusses`): ``kind -> (symbol, words)``.
A member force is positive in tension."""

_ALL_KINDS = {**KINDS, **TRUSS_KINDS}


@dataclass(frozen=True)
class Quantity:
    """A response quantity of a beam.

    ``kind`` is one of :data:`KINDS` (or, for a truss, :data:`TRUSS_KINDS`);
    ``at`` is the position along the beam (the deck of a truss) in the length
    unit; ``side`` says which face of a section is meant where the quantity
    jumps (``None`` where it does not).  ``element`` names the part of a
    truss the quantity belongs to: the member of a member force, the joint of
    a reaction (``None`` for beams); ``at`` is then the deck position of the
    joint, or of the middle of the member.
    """

    kind: QuantityKind
    at: Fraction
    side: Side | None = None
    element: str | None = None

    def __post_init__(self) -> None:
        choice(self.kind, tuple(_ALL_KINDS), what="Quantity: kind", field="kind")
        object.__setattr__(self, "at", to_exact(self.at, field="Quantity: at"))
        choice(self.side, ("left", "right"), what="Quantity: side", field="side", optional=True)
        if self.element is not None and not isinstance(self.element, str):
            raise BeamInputError(
                f"Quantity: element must be the name of a member or joint (text), got {self.element!r}.",
                field="element",
                value=self.element,
            )

    @property
    def symbol(self) -> str:
        """Short symbol: R, M_R, V, M, V_h, δ, θ or N (member force)."""
        return _ALL_KINDS[self.kind][0]

    @property
    def words(self) -> str:
        """Plain words for the quantity, e.g. ``"bending moment"``."""
        return _ALL_KINDS[self.kind][1]

    @property
    def label(self) -> str:
        """Text such as ``"V at x=18 (left)"``; the position at full precision (``x=3.3333333333333335``
        for 10/3), so that two sections a rounding apart read differently.  A truss quantity names its
        member or joint: ``"N in U2-U3"``, ``"R at L0"``."""
        if self.element is not None:
            return f"{self.symbol} {'in' if self.kind == 'member_force' else 'at'} {self.element}"
        side = f" ({self.side})" if self.side else ""
        return f"{self.symbol} at x={fmt_precise(self.at)}{side}"

    @property
    def is_force(self) -> bool:
        """True for force-like quantities (reactions, shears, member forces)."""
        return self.kind in ("reaction", "shear", "hinge_shear", "member_force")

    @property
    def is_moment(self) -> bool:
        """True for moment-like quantities (bending moment, moment reaction)."""
        return self.kind in ("moment", "moment_reaction")
