"""Dispatch from a quantity to the method that gives its influence line.

* Force quantities (reactions, moment reactions, shears, moments, hinge
  shears) of a determinate beam: the exact kinematic (Müller-Breslau) solver,
  :mod:`ilkit.kinematics`.  Springs count as supports there: the forces of a
  determinate beam follow from statics alone, whatever the stiffnesses, so
  these lines stay exact and piecewise linear and need no ``EI``.
* Everything else, that is every quantity of an indeterminate beam and the
  deflection and rotation of any beam (springs and varying ``EI`` included):
  the stiffness method, :mod:`ilkit.stiffness`, cubic between knots, floats
  or (``exact=True``) rationals.  These need ``EI``.
"""

from __future__ import annotations

from typing import TYPE_CHECKING

from ilkit.influence import InfluenceLine
from ilkit.quantity import Quantity

if TYPE_CHECKING:  # pragma: no cover
    from ilkit.model import Beam

__all__ = ["influence_line", "method_for"]


def method_for(beam: Beam, quantity: Quantity) -> str:
    """``"kinematic"`` or ``"stiffness"``: which solver gives the line of ``quantity``."""
    if beam.degree == 0 and quantity.kind not in ("deflection", "rotation"):
        return "kinematic"
    return "stiffness"


def influence_line(beam: Beam, quantity: Quantity, *, exact: bool = False) -> InfluenceLine:
    """Influence line of ``quantity``; see the module notes for which method answers.

    ``exact=True`` asks for rational pieces where the method would otherwise
    give floats (kinematic lines are always exact).
    """
    if method_for(beam, quantity) == "kinematic":
        from ilkit.kinematics import exact_line

        return exact_line(beam, quantity)
    from ilkit.stiffness import elastic_line

    return elastic_line(beam, quantity, exact=exact)
