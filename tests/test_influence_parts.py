"""The line primitives used by placement: slope, cumulative integral, signed parts, signed intervals.

Expected values are closed forms derived here for a simple span with an
overhang and for two equal continuous spans (handbook closed form, see
tests/closed_forms.py).
"""

from fractions import Fraction

import numpy as np
import pytest
from closed_forms import moment as cmoment

import ilkit


@pytest.fixture
def overhang():
    # simple span 0..20 with an overhang to 30 (units declared so the lines carry them)
    return ilkit.Beam(30, {0: "pin", 20: "roller"}, units="kN-m")


def test_slope_of_shear_line(overhang):
    # closed form: V(10) = -x/20 left of the section, (20-x)/20 right of it, both slopes -1/20;
    # the overhang continues with the same slope; 0 off the beam
    v = overhang.shear(10)
    assert v.slope(np.array([5.0, 15.0, 25.0])) == pytest.approx([-0.05, -0.05, -0.05])
    assert v.slope(-1.0) == 0.0 and v.slope(31.0) == 0.0
    assert v.slope(10.0, side="left") == pytest.approx(-0.05)


def test_slope_of_cubic_line():
    # M at a=4 of two 10-unit spans, load at x > a in span 1: M = R_A a with
    # R_A = 1 - x/(2L) - x(3L^2 - x^2)/(4L^3) ... derivative checked by central difference of the closed form
    m = cmoment(10, 4)
    xs = np.array([1.0, 6.0, 13.0, 18.0])
    h = 1e-6
    numeric = (m(xs + h) - m(xs - h)) / (2 * h)
    assert m.slope(xs) == pytest.approx(numeric, rel=1e-6)


def test_cumulative_equals_integral_and_areas(overhang):
    # closed form: area of V(10) = -2.5 (left triangle) + 2.5 (right) - 2.5 (overhang) = -2.5
    v = overhang.shear(10)
    xs = np.array([-5.0, 0.0, 5.0, 10.0, 20.0, 30.0, 45.0, np.inf, -np.inf])
    expected = [0.0, 0.0, -0.625, -2.5, 0.0, -2.5, -2.5, -2.5, 0.0]
    assert v.cumulative(xs) == pytest.approx(expected)
    assert v.cumulative(7.5) == pytest.approx(v.integral(0, 7.5))


def test_cumulative_of_cubic_matches_quadrature():
    m = cmoment(10, 4)
    xs = np.linspace(0, 20, 20001)
    trapezoid = np.concatenate(([0.0], np.cumsum((m(xs[1:]) + m(xs[:-1])) / 2 * np.diff(xs))))
    assert m.cumulative(xs[::1000]) == pytest.approx(trapezoid[::1000], abs=1e-6)


def test_positive_part_of_exact_line_stays_exact(overhang):
    # M at 25 (on the overhang) is -(x - 25) for x > 25 and 0 elsewhere: no positive part
    m = overhang.moment(25)
    assert m.part("positive").positive_area == 0.0
    neg = m.part("negative")
    assert neg.is_exact
    assert neg.exact_areas() == (Fraction(0), Fraction(-25, 2))


def test_parts_split_at_zero_crossings(overhang):
    # M at 10: x/2 for x < 10, (20 - x)/2 up to 20, then (20 - x)/2 < 0 on the overhang
    m = overhang.moment(10)
    pos, neg = m.part("positive"), m.part("negative")
    xs = np.linspace(-2, 32, 341)
    assert pos(xs) == pytest.approx(np.maximum(m(xs), 0.0))
    assert neg(xs) == pytest.approx(np.minimum(m(xs), 0.0))
    assert pos.positive_area == pytest.approx(m.positive_area) == pytest.approx(50.0)
    assert neg.negative_area == pytest.approx(m.negative_area) == pytest.approx(-25.0)


def test_parts_of_a_cubic_line_crossing_zero_inside_a_piece():
    # M at a=9 of two 10-unit spans (closed form R_A a - (a - x) for x < a) changes sign inside
    # the piece 0..9; the split must put the root in the knots and keep each side's cubic
    m = cmoment(10, 9)
    (root,) = m.roots()
    assert 0 < root < 9 and m(root) == pytest.approx(0.0, abs=1e-12)
    pos, neg = m.part("positive"), m.part("negative")
    assert root in pos.breakpoints
    xs = np.linspace(0, 20, 401)
    assert pos(xs) == pytest.approx(np.maximum(m(xs), 0.0), abs=1e-12)
    assert neg(xs) == pytest.approx(np.minimum(m(xs), 0.0), abs=1e-12)
    assert pos.degree == 3
    assert pos.positive_area + neg.negative_area == pytest.approx(m.area)


def test_part_rejects_unknown_sign(overhang):
    with pytest.raises(ilkit.IlkitError, match="'positive' or 'negative'"):
        overhang.moment(10).part("upward")


def test_intervals_are_the_loaded_patches(overhang):
    m = overhang.moment(10)
    assert m.intervals("positive") == ((0.0, 20.0),)
    assert m.intervals("negative") == ((20.0, 30.0),)
    v = overhang.shear(10)
    assert v.intervals("positive") == ((10.0, 20.0),)
    assert v.intervals("negative") == ((0.0, 10.0), (20.0, 30.0))
