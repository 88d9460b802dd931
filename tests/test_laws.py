"""Laws that every exact influence line of a determinate beam obeys (hypothesis).

Sources: statics of rigid bodies (common practice): the vertical reactions
balance the unit load; a shear line jumps by 1 at its own section; a hinge
carries no moment; a reaction line reads 1 under its own support and 0 under
every other rigid support.
"""

from __future__ import annotations

from fractions import Fraction

import numpy as np
from hypothesis import HealthCheck, given, settings
from hypothesis import strategies as st
from strategies import determinate_beams

SETTINGS = settings(max_examples=80, deadline=None, suppress_health_check=[HealthCheck.too_slow])


@SETTINGS
@given(beam=determinate_beams())
def test_reactions_sum_to_one(beam):
    xs = np.linspace(0, float(beam.length), 57)
    total = sum(beam.reaction(s.at)(xs) for s in beam.supports)
    np.testing.assert_allclose(total, 1.0, rtol=0, atol=1e-12)
    # and exactly, at the knots and between them
    for x in [Fraction(0), beam.length / 3, beam.length]:
        assert sum(beam.reaction(s.at).ordinate_exact(x) for s in beam.supports) == 1


@SETTINGS
@given(beam=determinate_beams(), data=st.data())
def test_shear_jumps_by_one_at_its_section(beam, data):
    L = beam.length
    a = data.draw(st.integers(1, 59).map(lambda k: L * Fraction(k, 60)))
    if any(s.at == a for s in beam.supports) or a in beam.shear_releases:
        return
    line = beam.shear(a)
    assert line.ordinate_exact(a, side="right") - line.ordinate_exact(a, side="left") == 1
    assert abs((line.right(float(a)) - line.left(float(a))) - 1) < 1e-12


@SETTINGS
@given(beam=determinate_beams())
def test_moment_is_zero_at_hinges(beam):
    xs = np.linspace(0, float(beam.length), 41)
    for h in beam.hinges:
        line = beam.moment(h)
        assert all(c == 0 for piece in line.pieces for c in piece.exact)
        np.testing.assert_array_equal(line(xs), 0.0)
    for h in beam.shear_releases:
        np.testing.assert_array_equal(beam.shear(h)(xs), 0.0)


@SETTINGS
@given(beam=determinate_beams())
def test_reaction_is_one_at_own_support_zero_at_others(beam):
    for s in beam.supports:
        line = beam.reaction(s.at)
        for other in beam.supports:
            expected = 1 if other.at == s.at else 0
            assert line.ordinate_exact(other.at) == expected


@SETTINGS
@given(beam=determinate_beams())
def test_expr_agrees_with_numeric_evaluation(beam):
    import sympy

    from ilkit import x

    line = beam.moment(beam.length / 3)
    f = sympy.lambdify(x, line.expr, "math")
    for xv in np.linspace(-1, float(beam.length) + 1, 23):
        assert abs(f(float(xv)) - line(float(xv))) < 1e-9 * max(1.0, float(beam.length))
