"""Influence lines of a truss: a unit load at every panel point, then straight between them.

The deck carries the load to the truss only at the panel points (floor beams
on stringers, :mod:`ilkit.floor`), so the influence line of a member force or
a reaction is the chord between its values for a unit load at each panel
point.  Those values come from one solution for all panel points at once:

* determinate truss: the equilibrium of the joints, exactly
  (:mod:`ilkit.trusses.statics`): force densities ``t = N / L`` and
  reactions are rationals; ``N = t L`` is rational where the member's length
  is, else the float nearest to it;
* indeterminate truss: the stiffness method with ``EA``
  (:mod:`ilkit.trusses.stiffness`), floats.

Every line is an :class:`ilkit.InfluenceLine` on the deck coordinate, so
placement, envelopes, tables and exports work as for beams.  Its origin is a
:class:`TrussLine`, which also gives the Müller-Breslau shape of the truss
(:meth:`TrussLine.shape`).
"""

from __future__ import annotations

import math
from dataclasses import dataclass, field
from fractions import Fraction
from typing import TYPE_CHECKING, Literal

import numpy as np

from ilkit.floor import panel_line
from ilkit.influence import InfluenceLine
from ilkit.quantity import Quantity
from ilkit.trusses import statics

if TYPE_CHECKING:  # pragma: no cover
    from ilkit.trusses.model import Truss

__all__ = ["Solution", "TrussLine", "solve", "truss_line"]

Number = Fraction | float
Method = Literal["statics", "stiffness"]


@dataclass(frozen=True)
class Solution:
    """Every member force and vertical reaction for a unit downward load at each panel point.

    ``members[name]`` and ``reactions[joint]`` hold one value per panel point
    (left to right): exact fractions from statics where they are rational,
    floats otherwise.  ``densities[name]`` (statics only) holds the exact force
    densities ``N / L``; ``squares[name]`` the exact ``L²``.
    """

    method: Method
    members: dict[str, tuple[Number, ...]]
    reactions: dict[str, tuple[Number, ...]]
    densities: dict[str, tuple[Fraction, ...]] = field(default_factory=dict)
    squares: dict[str, Fraction] = field(default_factory=dict)


def solve(truss: Truss) -> Solution:
    """The unit-load solution of ``truss`` (statics for a determinate truss, else the stiffness method)."""
    layout = truss.layout
    index = {name: k for k, name in enumerate(layout.joints)}
    loaded = [index[j] for j in truss.deck]
    base = len(layout.members)
    vertical = {layout.joints[j]: base + r for r, (j, d) in enumerate(layout.reactions) if d == "y"}
    squares = dict(statics.member_lengths(layout))
    if truss.is_determinate:
        values = statics.solve_unit_loads(layout, loaded)
        densities = {name: tuple(values[m]) for m, (name, _, _) in enumerate(layout.members)}
        members: dict[str, tuple[Number, ...]] = {}
        for name, t in densities.items():
            root = statics.exact_sqrt(squares[name])
            if root is not None:
                members[name] = tuple(v * root for v in t)
            else:
                length = math.sqrt(squares[name])
                members[name] = tuple(float(v) * length for v in t)
        reactions = {joint: tuple(values[col]) for joint, col in vertical.items()}
        return Solution("statics", members, reactions, densities, squares)
    from ilkit.trusses.stiffness import StiffnessModel

    ea = truss.EA
    assert ea is not None  # the model asks for EA of an indeterminate truss
    model = StiffnessModel(layout, tuple(float(ea[name]) for name, _, _ in layout.members))
    forces, reacts = model.unit_loads(loaded)
    members = {name: tuple(forces[m].tolist()) for m, (name, _, _) in enumerate(layout.members)}
    rows = {layout.joints[j]: r for r, (j, d) in enumerate(layout.reactions) if d == "y"}
    reactions = {joint: tuple(reacts[r].tolist()) for joint, r in rows.items()}
    return Solution("stiffness", members, reactions, squares=squares)


@dataclass(frozen=True)
class TrussLine:
    """The origin of a truss's influence line (``line.origin``).

    ``truss`` and ``quantity`` say whose line it is; ``ordinates`` are its
    values for a unit load at each panel point (``truss.deck``), ``method``
    how they were found (``"statics"``: equilibrium of the joints, exact;
    ``"stiffness"``: the stiffness method with ``EA``).  For a member,
    ``density`` holds the exact force densities ``N / L`` (statics) and
    ``length_squared`` the exact ``L²``.
    """

    truss: Truss
    quantity: Quantity
    ordinates: tuple[Number, ...]
    method: Method
    density: tuple[Fraction, ...] | None = None
    length_squared: Fraction | None = None

    @property
    def element(self) -> str:
        """The member or the support joint."""
        assert self.quantity.element is not None
        return self.quantity.element

    def shape(self) -> dict[str, tuple[float, float]]:
        """Müller-Breslau: how every joint moves ``{joint: (u, v)}`` (right and up positive, length unit)
        when the member is made shorter by 1 (or the support moved up by 1) and the rest of the truss
        follows (a mechanism for a determinate truss, elastically with ``EA`` for an indeterminate one).

        The upward movement ``v`` of each panel point is the line's ordinate there (virtual work)."""
        truss = self.truss
        layout = truss.layout
        names = [name for name, _, _ in layout.members]
        if self.quantity.kind == "member_force":
            column = names.index(self.element)
        else:
            column = len(names) + next(
                r for r, (j, d) in enumerate(layout.reactions) if layout.joints[j] == self.element and d == "y"
            )
        if self.method == "statics":
            d = statics.released_shape(layout, column)
            scale = 1.0
            if self.quantity.kind == "member_force":
                assert self.length_squared is not None
                scale = math.sqrt(self.length_squared)
            moves = np.array([float(v) for v in d]) * scale
        else:
            from ilkit.trusses.stiffness import StiffnessModel

            ea = truss.EA
            assert ea is not None
            model = StiffnessModel(layout, tuple(float(ea[name]) for name in names))
            if self.quantity.kind == "member_force":
                moves = model.shortened(column)
            else:
                moves = model.support_moved(column - len(names))
        return {name: (float(moves[2 * k]), float(moves[2 * k + 1])) for k, name in enumerate(layout.joints)}


def truss_line(truss: Truss, kind: str, name: str) -> InfluenceLine:
    """The influence line of ``kind`` (``"member_force"`` or ``"reaction"``) of member or joint ``name``."""
    solution = truss._solution
    if kind == "member_force":
        a, b = truss.members[name]
        mid = (truss.joints[a][0] + truss.joints[b][0]) / 2 - truss.origin
        at = min(max(mid, Fraction(0)), truss.length)
        values = solution.members[name]
        density = solution.densities.get(name)
        squared = solution.squares[name]
    else:
        at = truss.deck_x(name)
        values = solution.reactions[name]
        density, squared = None, None
    quantity = Quantity(kind, at, None, name)  # type: ignore[arg-type]
    origin = TrussLine(truss, quantity, values, solution.method, density, squared)
    return panel_line(quantity, truss.panel_points, values, truss.length, units=truss.units, origin=origin)
