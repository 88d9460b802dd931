"""A load standing at a chosen position (``ilkit.stand``) against statics written out by hand.

Sources, beside each check:

* simple span of length L, section at a, unit load at x (statics of a simple
  span, common practice): M(a) = x (L - a) / L for x <= a, a (L - x) / L for
  x >= a; V(a) = -x / L left of the section, (L - x) / L right of it;
* a uniform load w on [c, d] is the integral of the line over [c, d] times w
  (superposition of point loads, common practice), written out as a
  trapezoid area because the line is straight between breakpoints.
"""

from __future__ import annotations

import math

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

import ilkit
from ilkit.loads import AxleTrain, KnifeEdge, TrainUniform, UniformBlocks, UniformLoad, place, stand, train_length

L, A = 20.0, 8.0


@pytest.fixture(scope="module")
def span():
    return ilkit.Beam(L, {0: "pin", L: "roller"}, units="kN-m")


def m_simple(x: float, a: float = A) -> float:
    """Moment at a on a simple span for a unit load at x (0 off the span)."""
    if not 0 <= x <= L:
        return 0.0
    return x * (L - a) / L if x <= a else a * (L - x) / L


TRAIN = AxleTrain([100, 50], [4], units="kN-m", name="two-axle carrier")


def test_train_travelling_left_to_right_trails_behind_its_lead_axle(span):
    placed = stand(span.moment(A), TRAIN, 12.0, direction="left to right")
    assert [a.x for a in placed.axles] == [12.0, 8.0]
    # 100 x 8 (20 - 12) / 20 + 50 x 8 x (20 - 8) / 20 = 320 + 240
    assert placed.effect == pytest.approx(560.0, rel=1e-14)
    assert placed.direction == "left to right" and placed.spacings == (4.0,)


def test_train_travelling_right_to_left(span):
    placed = stand(span.moment(A), TRAIN, 12.0, direction="right to left")
    assert [a.x for a in placed.axles] == [12.0, 16.0]
    # 100 x 3.2 + 50 x 8 x (20 - 16) / 20 = 320 + 80
    assert placed.effect == pytest.approx(400.0, rel=1e-14)


def test_axles_off_the_beam_carry_nothing(span):
    placed = stand(span.moment(A), TRAIN, 22.0)
    assert [a.counted for a in placed.axles] == [False, True]
    assert placed.effect == pytest.approx(50 * m_simple(18.0), rel=1e-14)
    assert stand(span.moment(A), TRAIN, -0.5).effect == 0.0


@settings(max_examples=60, deadline=None)
@given(
    st.floats(-15, 35),
    st.lists(st.floats(1, 300), min_size=1, max_size=5),
    st.data(),
    st.sampled_from(["left to right", "right to left"]),
)
def test_any_train_anywhere_matches_the_closed_form(span, at, loads, data, direction):
    spacings = data.draw(st.lists(st.floats(0.5, 6), min_size=len(loads) - 1, max_size=len(loads) - 1))
    train = AxleTrain(loads, spacings, units="kN-m")
    placed = stand(span.moment(A), train, at, direction=direction)
    sign = -1 if direction == "left to right" else 1
    xs, x = [at], at
    for s in spacings:
        x += sign * s
        xs.append(x)
    expected = sum(p * m_simple(xi) for p, xi in zip(loads, xs))
    assert placed.effect == pytest.approx(expected, rel=1e-12, abs=1e-9)
    assert [a.x for a in placed.axles] == pytest.approx(xs)


def test_shear_reads_the_line_where_the_axle_stands(span):
    # V(8) for a unit load at 10 (right of the section): (20 - 10) / 20
    placed = stand(span.shear(A), KnifeEdge(40, units="kN-m"), 10.0)
    assert placed.effect == pytest.approx(40 * 0.5, rel=1e-14)
    assert placed.direction is None


def test_uniform_block_covers_its_length(span):
    # one 6 m block of 10 kN/m, front at 12 travelling right: it covers 6..12 m.
    # The moment line is straight on 6..8 and 8..12: trapezoids (2/2)(m(6) + m(8)) + (4/2)(m(8) + m(12))
    block = UniformBlocks(10, [6], units="kN-m")
    placed = stand(span.moment(A), block, 12.0)
    area = 1.0 * (m_simple(6) + m_simple(8)) + 2.0 * (m_simple(8) + m_simple(12))
    assert placed.effect == pytest.approx(10 * area, rel=1e-12)
    assert [(p.start, p.end) for p in placed.patches] == [(6.0, 12.0)]
    assert train_length(block) == 6.0


def test_uniform_part_behind_a_train_runs_to_the_end_of_the_beam(span):
    # one 100 kN axle with 20 kN/m starting 2 m behind it, travelling right to left with the axle at 10:
    # the uniform load covers 12..20, where M(8) = 8 (20 - x) / 20: area (8/2) x m(12)
    train = AxleTrain([100], [], units="kN-m", behind=TrainUniform(20, clearance=2))
    placed = stand(span.moment(A), train, 10.0, direction="right to left")
    expected = 100 * m_simple(10) + 20 * 4.0 * m_simple(12)
    assert placed.effect == pytest.approx(expected, rel=1e-12)
    assert train_length(train) == 0.0


def test_chosen_spacing_within_the_range(span):
    truck = AxleTrain([35, 145, 145], [4.3, (4.3, 9.0)], units="kN-m", name="our truck")
    assert [a.x for a in stand(span.moment(A), truck, 15.0).axles] == [15.0, 10.7, 6.4]
    placed = stand(span.moment(A), truck, 15.0, spacings=[4.3, 6.0])
    assert [a.x for a in placed.axles] == pytest.approx([15.0, 10.7, 4.7])
    assert train_length(truck, [4.3, 6.0]) == pytest.approx(10.3)


def test_units_are_converted(span):
    # a 10 kip knife-edge load on a kN-m beam: 10 x 4.4482216152605 kN (exact definition of the kip)
    placed = stand(span.moment(A), KnifeEdge(10, units="kip-ft"), 8.0)
    assert placed.effect == pytest.approx(44.482216152605 * m_simple(8.0), rel=1e-13)


def test_agrees_with_critical_placement(span):
    """Standing the train where place() puts it gives place()'s effect (no axle at a jump on a moment line)."""
    truck = AxleTrain([30, 120, 120], [4, (4, 8)], units="kN-m")
    best = place(span.moment(A), truck, "max").placements[0]
    lead = best.axles[0]
    again = stand(span.moment(A), truck, lead.x, direction=best.direction, spacings=best.spacings)
    assert again.effect == pytest.approx(best.effect, rel=1e-12)


# ------------------------------------------------------------------ bad input
def test_a_breakable_uniform_load_does_not_stand(span):
    with pytest.raises(ilkit.LoadInputError, match=r"does not travel as one load.*use ilkit\.place"):
        stand(span.moment(A), UniformLoad(9, units="kN-m"), 3.0)


def test_bad_direction_position_or_spacing(span):
    line = span.moment(A)
    with pytest.raises(ilkit.LoadInputError, match="direction must be 'left to right' or 'right to left'"):
        stand(line, TRAIN, 3.0, direction="east")
    with pytest.raises(ilkit.LoadInputError, match="not a finite number"):
        stand(line, TRAIN, math.nan)
    with pytest.raises(ilkit.LoadInputError, match=r"spacing 1 of two-axle carrier .* must be 4, got 5"):
        stand(line, TRAIN, 3.0, spacings=[5])
    with pytest.raises(ilkit.LoadInputError, match="give 1 spacings"):
        stand(line, TRAIN, 3.0, spacings=[4, 4])


def test_beam_without_units(span):
    bare = ilkit.Beam(L, {0: "pin", L: "roller"})
    with pytest.raises(ilkit.UnitsError, match="declares no units"):
        stand(bare.moment(A), TRAIN, 3.0)


@pytest.mark.parametrize("extreme", ["max", "min"])
def test_standing_at_the_front_of_a_critical_placement_gives_its_effect(extreme):
    """place() reports the front of the load; standing it there again gives the same effect:
    for axle trains and for unbreakable blocks (EN 1991-2 SW/0-like layout, our own numbers)."""
    beam = ilkit.Beam(30, {0: "pin", 12: "roller", 30: "roller"}, EI=1, units="kN-m")
    line = beam.moment(6)
    for load in (
        AxleTrain([30, 120, 120], [4, (4, 8)], units="kN-m"),
        UniformBlocks(50, [5, 5], [3], units="kN-m"),
    ):
        best = place(line, load, extreme).placements[0]
        again = stand(line, load, best.front, direction=best.direction, spacings=best.spacings)
        assert again.effect == pytest.approx(best.effect, rel=1e-9, abs=1e-9)
        assert again.front == best.front
