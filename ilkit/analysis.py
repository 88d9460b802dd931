"""Dispatch from a quantity to the method that gives its influence line."""

from __future__ import annotations

from typing import TYPE_CHECKING

from ilkit.errors import IndeterminateBeamError
from ilkit.influence import InfluenceLine
from ilkit.quantity import Quantity

if TYPE_CHECKING:  # pragma: no cover
    from ilkit.model import Beam

__all__ = ["influence_line"]


def influence_line(beam: Beam, quantity: Quantity) -> InfluenceLine:
    """Influence line of ``quantity``: exact for determinate beams."""
    if beam.degree == 0 and quantity.kind not in ("deflection", "rotation"):
        from ilkit.kinematics import exact_line

        return exact_line(beam, quantity)
    raise IndeterminateBeamError(
        f"{quantity.label}: the beam is statically indeterminate (degree {beam.degree}); "
        "exact kinematic lines exist only for determinate beams. Remove redundant supports "
        "or add hinges to make it determinate."
    )
