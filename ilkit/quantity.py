"""What an influence line is for: the quantity, where it is taken, and its side."""

from __future__ import annotations

from dataclasses import dataclass
from fractions import Fraction
from typing import Literal

from ilkit._check import choice
from ilkit._exact import fmt_precise, to_exact

__all__ = ["Quantity", "QuantityKind", "Side", "KINDS"]

QuantityKind = Literal[
    "reaction", "moment_reaction", "shear", "moment", "hinge_shear", "deflection", "rotation"
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


@dataclass(frozen=True)
class Quantity:
    """A response quantity of a beam.

    ``kind`` is one of :data:`KINDS`; ``at`` is the position along the beam in
    the beam's length unit; ``side`` says which face of a section is meant
    where the quantity jumps (``None`` where it does not).
    """

    kind: QuantityKind
    at: Fraction
    side: Side | None = None

    def __post_init__(self) -> None:
        choice(self.kind, tuple(KINDS), what="Quantity: kind", field="kind")
        object.__setattr__(self, "at", to_exact(self.at, field="Quantity: at"))
        choice(self.side, ("left", "right"), what="Quantity: side", field="side", optional=True)

    @property
    def symbol(self) -> str:
        """Short symbol: R, M_R, V, M, V_h, δ or θ."""
        return KINDS[self.kind][0]

    @property
    def words(self) -> str:
        """Plain words for the quantity, e.g. ``"bending moment"``."""
        return KINDS[self.kind][1]

    @property
    def label(self) -> str:
        """Text such as ``"V at x=18 (left)"``; the position at full precision (``x=3.3333333333333335``
        for 10/3), so that two sections a rounding apart read differently."""
        side = f" ({self.side})" if self.side else ""
        return f"{self.symbol} at x={fmt_precise(self.at)}{side}"

    @property
    def is_force(self) -> bool:
        """True for force-like quantities (reactions, shears)."""
        return self.kind in ("reaction", "shear", "hinge_shear")

    @property
    def is_moment(self) -> bool:
        """True for moment-like quantities (bending moment, moment reaction)."""
        return self.kind in ("moment", "moment_reaction")
