"""The prismatic element: stiffness, Hermite shape and the clamped response to unit actions."""

from __future__ import annotations

from fractions import Fraction as F

import pytest

from ilkit.elements import clamped_response, hermite, shift, stiffness_matrix


def _value(c, t):
    return c[0] + t * (c[1] + t * (c[2] + t * c[3]))


def _slope(c, t):
    return c[1] + t * (2 * c[2] + 3 * c[3] * t)


@pytest.mark.parametrize("a", [F(0), F(1), F(5, 2), F(6), F(8)])
def test_point_load_fixed_end_forces(a):
    """Handbook fixed-end actions of a beam clamped at both ends under a point load P at a
    (b = L - a): M_left = P a b² / L², M_right = P a² b / L² (both hogging),
    R_left = P b² (3a + b) / L³, R_right = P a² (a + 3b) / L³ (common practice)."""
    L, EI = F(8), F(7)
    b = L - a
    r = clamped_response("force", a, L, EI)
    # equivalent nodal loads are the clamp forces reversed, in (down, clockwise) directions
    assert r.loads == (
        b**2 * (3 * a + b) / L**3,
        a * b**2 / L**2,
        a**2 * (a + 3 * b) / L**3,
        -(a**2) * b / L**2,
    )


@pytest.mark.parametrize("action", ["force", "couple", "kink", "slip"])
@pytest.mark.parametrize("xi", [F(0), F(3, 2), F(4), F(5)])
def test_clamped_response_keeps_both_ends_clamped_and_carries_the_action(action, xi):
    h, EI = F(5), F(3)
    r = clamped_response(action, xi, h, EI)
    # the right-hand shape, in t - xi, at t = h
    assert _value(r.right, h - xi) == 0 and _slope(r.right, h - xi) == 0
    assert r.left[0] == 0 and r.left[1] == 0
    if xi in (0, h):
        return
    jump_v = r.right[0] - _value(r.left, xi)
    jump_slope = r.right[1] - _slope(r.left, xi)
    jump_curv = 2 * r.right[2] - (2 * r.left[2] + 6 * r.left[3] * xi)
    jump_third = 6 * r.right[3] - 6 * r.left[3]
    expected = {
        "force": (0, 0, 0, 1 / EI),  # EI v''' jumps by the load
        "couple": (0, 0, -1 / EI, 0),  # the sagging moment -EI v'' jumps by the couple
        "kink": (0, -1, 0, 0),
        "slip": (1, 0, 0, 0),
    }[action]
    assert (jump_v, jump_slope, jump_curv, jump_third) == expected


def test_stiffness_matrix_is_symmetric_and_rigid_motions_cost_nothing():
    h, EI = F(3), F(11)
    k = stiffness_matrix(h, EI)
    assert all(k[i][j] == k[j][i] for i in range(4) for j in range(4))
    for motion in ((1, 0, 1, 0), (0, 1, h, 1)):  # translation, rotation about the left end
        assert [sum(k[i][j] * motion[j] for j in range(4)) for i in range(4)] == [0, 0, 0, 0]


def test_hermite_and_shift():
    c = hermite(F(1), F(2), F(-3), F(1, 2), F(4))
    assert (_value(c, 0), _slope(c, 0), _value(c, 4), _slope(c, 4)) == (1, 2, -3, F(1, 2))
    moved = shift(c, F(3, 2))
    for t in (F(0), F(1), F(5, 2)):
        assert _value(moved, t) == _value(c, t + F(3, 2))
