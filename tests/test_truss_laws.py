"""Laws of truss influence lines on random stable trusses (hypothesis), against an independent solver.

* Determinate trusses: every member force and reaction at every panel point
  equals the solution of an independent joint-equilibrium solver written here
  (direction cosines, numpy, no code shared with ilkit); the lines are exact
  where the member's length is rational; the vertical reactions add up to
  the unit load.
* The line is straight between panel points and 0 off the deck.
* Müller-Breslau and Betti's reciprocal theorem: the deck's upward movement
  when the member is shortened by 1 (``line.origin.shape()``, a separate
  computation: compatibility rather than equilibrium) equals the line's
  ordinates, for determinate (exact mechanism) and indeterminate (stiffness
  method, a dislocation) trusses; likewise a support moved up by 1 for a
  reaction.
"""

from __future__ import annotations

import math
import sys
from fractions import Fraction

import numpy as np
from hypothesis import given, settings
from profiles import examples
from truss_strategies import simple_trusses

from ilkit import trusses


def joint_equilibrium(truss, load_joint):
    """Member forces and vertical reactions for a unit downward load at ``load_joint``: the equilibrium of
    every joint, with the members' direction cosines, solved by numpy (independent of ilkit's solver)."""
    names = list(truss.joints)
    index = {n: k for k, n in enumerate(names)}
    members = list(truss.members)
    columns = [("member", m) for m in members]
    for joint, kind in truss.supports.items():
        if kind == "pin":
            columns.append(("rx", joint))
        columns.append(("ry", joint))
    A = np.zeros((2 * len(names), len(columns)))
    for c, (kind, name) in enumerate(columns):
        if kind == "member":
            a, b = truss.members[name]
            (xa, ya), (xb, yb) = (tuple(map(float, truss.joints[j])) for j in (a, b))
            length = math.hypot(xb - xa, yb - ya)
            ex, ey = (xb - xa) / length, (yb - ya) / length
            A[2 * index[a], c], A[2 * index[a] + 1, c] = ex, ey  # tension pulls joint a towards b
            A[2 * index[b], c], A[2 * index[b] + 1, c] = -ex, -ey
        else:
            A[2 * index[name] + (0 if kind == "rx" else 1), c] = 1.0
    P = np.zeros(2 * len(names))
    P[2 * index[load_joint] + 1] = -1.0
    s = np.linalg.solve(A, -P)
    forces = {name: s[c] for c, (kind, name) in enumerate(columns) if kind == "member"}
    reactions = {name: s[c] for c, (kind, name) in enumerate(columns) if kind == "ry"}
    return forces, reactions


def at_panel_point(truss, line, k):
    """The ordinate for a load on the floor beam of panel point ``k``: where the deck ends before the end of
    the line, the line drops to 0 beyond its last panel point, and the floor beam's value is the left one."""
    x = float(truss.panel_points[k])
    return line.left(x) if k == len(truss.deck) - 1 else line(x)


@settings(max_examples=examples(60))
@given(truss=simple_trusses())
def test_determinate_lines_equal_an_independent_joint_equilibrium_solution(truss):
    assert truss.is_determinate
    for k, joint in enumerate(truss.deck):
        forces, reactions = joint_equilibrium(truss, joint)
        scale = max(1.0, *(abs(v) for v in forces.values()))
        for name, expected in forces.items():
            assert abs(at_panel_point(truss, truss.member_force(name), k) - expected) <= 1e-9 * scale, (name, joint)
        for name, expected in reactions.items():
            assert abs(at_panel_point(truss, truss.reaction(name), k) - expected) <= 1e-9 * scale, (name, joint)


@settings(max_examples=examples(40))
@given(truss=simple_trusses(decimals=True))
def test_determinate_lines_are_exact_where_the_member_length_is_rational(truss):
    for name, (a, b) in truss.members.items():
        (xa, ya), (xb, yb) = truss.joints[a], truss.joints[b]
        square = (xb - xa) ** 2 + (yb - ya) ** 2
        rational = math.isqrt(square.numerator) ** 2 == square.numerator and math.isqrt(
            square.denominator) ** 2 == square.denominator
        line = truss.member_force(name)
        assert line.is_exact == rational
        if not rational:  # exact force density times the length, rounded once
            t = line.origin.density
            # evaluating a straight piece at its end rounds once or twice relative to the ordinates it joins
            scale = max(1.0, *(abs(v) for v in line.origin.ordinates))
            for k in range(len(truss.deck)):
                assert line.origin.ordinates[k] == float(t[k]) * math.sqrt(square)
                assert math.isclose(at_panel_point(truss, line, k), line.origin.ordinates[k], rel_tol=1e-14,
                                    abs_tol=4 * sys.float_info.epsilon * scale)


@settings(max_examples=examples(40))
@given(truss=simple_trusses())
def test_the_vertical_reactions_carry_the_unit_load_and_lines_are_straight_between_panel_points(truss):
    for k in range(len(truss.deck)):
        assert sum(truss.reaction(j).origin.ordinates[k] for j in truss.supports) == 1
        assert abs(sum(at_panel_point(truss, truss.reaction(j), k) for j in truss.supports) - 1) <= 1e-12
    points = [float(p) for p in truss.panel_points]
    for line in list(truss.member_forces().values())[:6]:
        for k, (a, b) in enumerate(zip(points, points[1:])):
            ya, yb = at_panel_point(truss, line, k), at_panel_point(truss, line, k + 1)
            assert abs(line((a + b) / 2) - (ya + yb) / 2) <= 1e-12 * max(1.0, abs(ya), abs(yb))
        assert line(-1e-9 - points[0]) == 0.0 or points[0] == 0
        assert line(float(truss.length) + 1.0) == 0.0


def _deck_upward(truss, shape):
    return [shape[j][1] for j in truss.deck]


@settings(max_examples=examples(30))
@given(truss=simple_trusses())
def test_mueller_breslau_mechanism_of_a_determinate_truss_is_the_line(truss):
    """Betti: the deck's upward movement under a unit shortening of the member is its influence line."""
    for line in list(truss.member_forces().values())[:5] + [truss.reaction(j) for j in truss.supports]:
        moved = _deck_upward(truss, line.origin.shape())
        expected = [float(v) for v in line.origin.ordinates]
        scale = max(1.0, *(abs(v) for v in expected))
        assert np.allclose(moved, expected, rtol=0, atol=1e-9 * scale), line.quantity.label


@settings(max_examples=examples(20))
@given(truss=simple_trusses(extra_members=2))
def test_mueller_breslau_dislocation_of_an_indeterminate_truss_is_the_line(truss):
    """Betti with a dislocation: made shorter by 1, the member moves the deck up by its influence ordinates."""
    assert truss.degree == 2
    for line in list(truss.member_forces().values())[:6] + [truss.reaction(j) for j in truss.supports]:
        moved = _deck_upward(truss, line.origin.shape())
        expected = list(line.origin.ordinates)
        scale = max(1.0, *(abs(v) for v in expected))
        assert np.allclose(moved, expected, rtol=0, atol=1e-8 * scale), line.quantity.label


@settings(max_examples=examples(20))
@given(truss=simple_trusses(extra_members=1))
def test_indeterminate_reactions_carry_the_unit_load(truss):
    for k in range(len(truss.deck)):
        total = sum(at_panel_point(truss, truss.reaction(j), k) for j in truss.supports)
        assert abs(total - 1.0) <= 1e-9


def test_a_layout_given_as_floats_is_the_same_truss_as_given_exactly():
    exact = trusses.pratt(Fraction(96), 12, Fraction(9), units="kN-m")
    typed = trusses.pratt(96.0, 12, "9.0", units="kN-m")
    assert exact == typed
    assert exact.member_force("U5-U6").expr == typed.member_force("U5-U6").expr
