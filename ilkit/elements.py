"""The prismatic beam element: its stiffness, its deflected shape and its response to unit actions.

An element runs from its left end (local coordinate ``t = 0``) to its right
end (``t = h``) with constant flexural stiffness ``EI``.  Each end has two
degrees of freedom: the deflection ``v`` (positive downward) and the rotation
``θ = dv/dt`` (positive clockwise).  End forces are in the same directions
(force downward, couple clockwise).

Without load inside it, an element deflects as the cubic (Hermite)
interpolation of its end displacements; that is the exact solution of
``EI v'''' = 0``, so nodal displacements from these elements are exact, and
so is the shape between nodes.  A unit action at ``t = ξ`` inside the
element (a force, a couple, or an imposed kink or slip) adds the response of
the element clamped at both ends, a cubic on each side of ``ξ``.

Every function here works with floats and with :class:`fractions.Fraction`
alike (numpy arrays of either, in the vectorised ones), so one code path gives
float lines and exact ones.
"""

from __future__ import annotations

from dataclasses import dataclass
from typing import Any, Literal

__all__ = ["Action", "ACTIONS", "ClampedResponse", "stiffness_matrix", "hermite", "shift", "clamped_response"]

Action = Literal["force", "couple", "kink", "slip"]
ACTIONS: dict[str, str] = {
    "force": "a unit downward force",
    "couple": "a unit clockwise couple",
    "kink": "a unit sagging kink (the faces turn by 1 rad relative to each other)",
    "slip": "a unit slip (the right face moves down by 1 relative to the left face, slopes equal)",
}


def stiffness_matrix(h: Any, EI: Any) -> list[list[Any]]:
    """The 4x4 stiffness matrix of the element, degrees of freedom ``(v1, θ1, v2, θ2)``."""
    a = EI / h**3
    b = EI / h**2
    c = EI / h
    return [
        [12 * a, 6 * b, -12 * a, 6 * b],
        [6 * b, 4 * c, -6 * b, 2 * c],
        [-12 * a, -6 * b, 12 * a, -6 * b],
        [6 * b, 2 * c, -6 * b, 4 * c],
    ]


def hermite(v1: Any, r1: Any, v2: Any, r2: Any, h: Any) -> tuple[Any, Any, Any, Any]:
    """Ascending coefficients in ``t`` of the cubic with end values ``v1, v2`` and slopes ``r1, r2``.

    Works elementwise on numpy arrays (one element per entry).
    """
    chord = (v2 - v1) / h
    c2 = (3 * chord - 2 * r1 - r2) / h
    c3 = (r1 + r2 - 2 * chord) / (h * h)
    return v1, r1, c2, c3


def shift(coefficients: tuple[Any, ...], s: Any) -> tuple[Any, Any, Any, Any]:
    """Coefficients of the cubic ``p(t)`` rewritten in ``u = t - s`` (Taylor shift)."""
    a0, a1, a2, a3 = coefficients
    return (
        a0 + s * (a1 + s * (a2 + s * a3)),
        a1 + s * (2 * a2 + 3 * a3 * s),
        a2 + 3 * a3 * s,
        a3,
    )


@dataclass(frozen=True)
class ClampedResponse:
    """Response of an element clamped at both ends to a unit action at ``t = ξ``.

    ``left``: the deflected shape on ``0 <= t <= ξ`` (ascending coefficients in
    ``t``); ``right``: the shape on ``ξ <= t <= h`` (coefficients in
    ``t - ξ``); ``loads``: the equivalent nodal loads ``(F1, M1, F2, M2)``,
    the clamping forces reversed, to apply to the structure.
    """

    left: tuple[Any, Any, Any, Any]
    right: tuple[Any, Any, Any, Any]
    loads: tuple[Any, Any, Any, Any]


def _free_term(action: Action, EI: Any) -> tuple[Any, Any, Any, Any]:
    """The change ``g(s)`` the action makes to the shape, ``s = t - ξ >= 0``, ascending in ``s``.

    A force ``P = 1`` makes ``EI v'''`` jump by 1; a clockwise couple makes
    ``EI v''`` jump by -1 (sagging moment +1); a kink makes ``v'`` jump by -1;
    a slip makes ``v`` jump by +1.
    """
    zero = EI * 0
    if action == "force":
        return zero, zero, zero, 1 / (6 * EI)
    if action == "couple":
        return zero, zero, -1 / (2 * EI), zero
    if action == "kink":
        return zero, zero - 1, zero, zero
    if action == "slip":
        return zero + 1, zero, zero, zero
    raise ValueError(f"unknown action {action!r}; choose one of {sorted(ACTIONS)}")  # pragma: no cover


def clamped_response(action: Action, xi: Any, h: Any, EI: Any) -> ClampedResponse:
    """The clamped-element response to a unit ``action`` at ``t = xi`` (``0 <= xi <= h``).

    The shape is ``p(t) = c2 t² + c3 t³ + [t >= ξ] g(t - ξ)`` with the four
    end conditions ``v = θ = 0`` at both ends.  End forces follow from the
    shape: ``F1 = EI p'''(0)``, ``M1 = -EI p''(0)``, ``F2 = -EI p'''(h)``,
    ``M2 = EI p''(h)`` (the forces the clamps exert, in degree-of-freedom
    directions); the equivalent nodal loads are their negatives.
    """
    g = _free_term(action, EI)
    zero = EI * 0
    if action in ("force", "couple") and (xi == 0 or xi == h):
        # the load stands on a node: it goes straight into that node, the clamped element does not move
        # (written out, not computed, so that no rounding noise is left in the shape)
        unit = [zero, zero, zero, zero]
        unit[(0 if xi == 0 else 2) + (action == "couple")] = zero + 1
        none = (zero, zero, zero, zero)
        return ClampedResponse(none, none, (unit[0], unit[1], unit[2], unit[3]))
    r = h - xi
    # g and its first three derivatives at s = h - ξ
    g0 = g[0] + r * (g[1] + r * (g[2] + r * g[3]))
    g1 = g[1] + r * (2 * g[2] + 3 * g[3] * r)
    g2 = 2 * g[2] + 6 * g[3] * r
    g3 = 6 * g[3]
    c2 = (g1 * h - 3 * g0) / (h * h)
    c3 = (2 * g0 - g1 * h) / (h * h * h)
    left = (zero, zero, c2, c3)
    at_xi = shift(left, xi)
    right = (at_xi[0] + g[0], at_xi[1] + g[1], at_xi[2] + g[2], at_xi[3] + g[3])
    f1 = EI * 6 * c3
    m1 = -EI * 2 * c2
    f2 = -EI * (6 * c3 + g3)
    m2 = EI * (2 * c2 + 6 * c3 * h + g2)
    return ClampedResponse(left, right, (-f1, -m1, -f2, -m2))
