"""Laws that every elastic (stiffness-method) influence line must obey, over random beams.

Sources: the laws of statics (vertical equilibrium and moment equilibrium of
the whole beam), Maxwell's and Betti's reciprocal theorems, and the
Müller-Breslau principle (a shear line jumps by 1 at its section, a moment
line has a unit kink there, a reaction line is 1 at its own bearing).  All
common practice in structural analysis.
"""

from __future__ import annotations

from fractions import Fraction

import numpy as np
import pytest
from continuous_strategies import EI_VALUES, elastic_beams, positions
from hypothesis import HealthCheck, given, settings
from hypothesis import strategies as st

import ilkit
from ilkit.kinematics import exact_line
from ilkit.quantity import Quantity
from ilkit.stiffness import elastic_line

SETTINGS = settings(max_examples=60, deadline=None, suppress_health_check=[HealthCheck.too_slow])


def _scale(values) -> float:
    return max(1.0, float(np.max(np.abs(values))))


@SETTINGS
@given(st.data())
def test_vertical_reactions_sum_to_one(data):
    """Vertical equilibrium: the reactions (bearings and springs) carry the unit load."""
    beam = data.draw(elastic_beams())
    xs = np.array([float(data.draw(positions(beam))) for _ in range(5)] + [0.0, float(beam.length)])
    total = sum(beam.reaction(s.at)(xs) for s in beam.supports)
    np.testing.assert_allclose(total, 1.0, rtol=0, atol=1e-9)


@SETTINGS
@given(st.data())
def test_reactions_balance_the_moment_of_the_load(data):
    """Moment equilibrium about the left end: Σ R_i s_i + Σ M_R,j = x for a unit load at x."""
    beam = data.draw(elastic_beams())
    xs = np.array([float(data.draw(positions(beam))) for _ in range(5)])
    total = sum(float(s.at) * beam.reaction(s.at)(xs) for s in beam.supports)
    total = total + sum(beam.moment_reaction(s.at)(xs) for s in beam.supports if s.restrains_rotation)
    np.testing.assert_allclose(total, xs, rtol=0, atol=1e-9 * float(beam.length))


@settings(max_examples=25, deadline=None, suppress_health_check=[HealthCheck.too_slow])
@given(st.data())
def test_exact_reactions_sum_to_exactly_one(data):
    """Vertical equilibrium holds exactly in rational arithmetic."""
    beam = data.draw(elastic_beams(max_spans=3))
    x = data.draw(positions(beam))
    total = sum(beam.reaction(s.at, exact=True).ordinate_exact(x) for s in beam.supports)
    assert total == 1


@SETTINGS
@given(st.data())
def test_maxwell_betti_reciprocity(data):
    """Maxwell: the deflection at a due to a unit load at b equals the deflection at b due to one at a."""
    beam = data.draw(elastic_beams(min_degree=0))
    a = data.draw(positions(beam))
    b = data.draw(positions(beam))
    dab = beam.deflection(a)(float(b))
    dba = beam.deflection(b)(float(a))
    assert dab == pytest.approx(dba, rel=1e-9, abs=1e-12 * _scale([dab, dba]))


@SETTINGS
@given(st.data())
def test_shear_line_jumps_by_one_and_moment_line_kinks_by_one(data):
    """Müller-Breslau: at its section a shear line jumps by +1, a moment line's slope drops by 1."""
    beam = data.draw(elastic_beams())
    avoid = [s.at for s in beam.supports] + list(beam.hinges)
    a = data.draw(positions(beam, avoid=avoid))
    v = beam.shear(a)
    assert v.right(float(a)) - v.left(float(a)) == pytest.approx(1.0, abs=1e-12 * _scale(v.sample()[1]))
    m = beam.moment(a)
    before = next(p for p in m.pieces if p.end == float(a))
    after = next(p for p in m.pieces if p.start == float(a))
    h = before.end - before.start
    slope_before = before.coefficients[1] + 2 * before.coefficients[2] * h + 3 * before.coefficients[3] * h * h
    assert slope_before - after.coefficients[1] == pytest.approx(1.0, abs=1e-9)


@SETTINGS
@given(st.data())
def test_hinge_force_line_jumps_by_one_and_moment_at_a_hinge_is_zero(data):
    """At a hinge (no support under it) the hinge-force line is the shear line: a jump of +1;
    the hinge carries no moment, so the moment line there is zero everywhere."""
    beam = data.draw(elastic_beams())
    free_hinges = [h for h in beam.hinges if not any(s.at == h for s in beam.supports)]
    if not free_hinges:
        return
    h = data.draw(st.sampled_from(free_hinges))
    line = beam.hinge_shear(h)
    assert line.right(float(h)) - line.left(float(h)) == pytest.approx(1.0, abs=1e-12 * _scale(line.sample()[1]))
    xs = np.linspace(0.0, float(beam.length), 41)
    np.testing.assert_allclose(line(xs), beam.shear(h)(xs), rtol=0, atol=1e-12)
    assert np.all(beam.moment(h)(xs) == 0.0)


@settings(max_examples=25, deadline=None, suppress_health_check=[HealthCheck.too_slow])
@given(st.data())
def test_exact_shear_line_jumps_by_exactly_one(data):
    beam = data.draw(elastic_beams(max_spans=3))
    avoid = [s.at for s in beam.supports] + list(beam.hinges)
    a = data.draw(positions(beam, avoid=avoid))
    v = beam.shear(a, exact=True)
    assert v.is_exact
    assert v.ordinate_exact(a, "right") - v.ordinate_exact(a, "left") == 1


@SETTINGS
@given(st.data())
def test_reaction_line_is_one_at_its_own_bearing(data):
    """A rigid bearing's reaction line is 1 at the bearing and 0 at every other rigid bearing."""
    beam = data.draw(elastic_beams())
    rigid = [s for s in beam.supports if s.vertical_stiffness is None]
    if not rigid:
        return
    own = data.draw(st.sampled_from(rigid))
    line = beam.reaction(own.at)
    assert line(float(own.at)) == pytest.approx(1.0, abs=1e-12)
    for s in rigid:
        if s is not own:
            assert line(float(s.at)) == pytest.approx(0.0, abs=1e-12)


@SETTINGS
@given(st.data())
def test_float_and_exact_lines_agree(data):
    beam = data.draw(elastic_beams(max_spans=3))
    a = data.draw(positions(beam, avoid=[s.at for s in beam.supports]))
    xs = np.linspace(0.0, float(beam.length), 97)
    for kind in ("moment", "shear", "deflection", "rotation"):
        if kind == "rotation" and a in beam.hinges:
            continue
        f = getattr(beam, kind)(a)
        e = getattr(beam, kind)(a, exact=True)
        assert e.is_exact and not f.is_exact
        np.testing.assert_allclose(f(xs), e(xs), rtol=0, atol=1e-9 * _scale(e(xs)))


# ----------------------------------------------------- determinate beams, two paths
@st.composite
def determinate_elastic_beams(draw):
    """Random determinate beams with EI (layouts known to be determinate; springs allowed)."""
    scale = draw(st.sampled_from([Fraction(1), Fraction(1, 2), Fraction(3)]))
    layout = draw(st.sampled_from(["simple", "cantilever", "hinged"]))
    bearing = ["pin", "roller", ilkit.Spring(vertical=Fraction(3))]
    if layout == "simple":
        left, span, right = draw(st.integers(0, 2)), draw(st.integers(2, 9)), draw(st.integers(0, 2))
        cells = left + span + right
        supports = {left: draw(st.sampled_from(bearing)), left + span: draw(st.sampled_from(bearing))}
        hinges = []
    elif layout == "cantilever":
        cells = draw(st.integers(2, 9))
        roots = ["fixed", ilkit.Spring(rotational=Fraction(7)), ilkit.Spring(vertical=9, rotational="rigid")]
        root = draw(st.sampled_from(roots))
        supports = {0: root} if draw(st.booleans()) else {cells: root}
        hinges = []
    else:  # fixed end, hinge, bearing (a propped cantilever made determinate by a hinge) or a two-span Gerber beam
        s1, s2 = draw(st.integers(2, 6)), draw(st.integers(2, 6))
        cells = s1 + s2
        hinge = draw(st.integers(1, s1 - 1)) if draw(st.booleans()) else s1 + draw(st.integers(1, s2 - 1))
        if draw(st.booleans()):
            supports = {0: "fixed", cells: draw(st.sampled_from(bearing))}
            hinge = draw(st.integers(1, cells - 1))
        else:
            supports = {0: "pin", s1: draw(st.sampled_from(bearing)), cells: draw(st.sampled_from(bearing))}
        hinges = [hinge]
    cuts = draw(st.lists(st.integers(1, cells - 1), max_size=2, unique=True))
    bounds = [0, *sorted(cuts), cells]
    ranges = [(a * scale, b * scale, draw(st.sampled_from(EI_VALUES))) for a, b in zip(bounds[:-1], bounds[1:])]
    beam = ilkit.Beam(
        cells * scale,
        {p * scale: k for p, k in supports.items()},
        hinges=[h * scale for h in hinges],
        EI=ranges,
    )
    assert beam.is_determinate
    return beam


@SETTINGS
@given(st.data())
def test_determinate_beam_gives_the_same_lines_through_both_paths(data):
    """The stiffness path reproduces the exact kinematic lines of a determinate beam (exactly, with exact=True)."""
    beam = data.draw(determinate_elastic_beams())
    a = data.draw(positions(beam, avoid=[s.at for s in beam.supports]))
    quantities = [Quantity("moment", a), Quantity("shear", a)] + [Quantity("reaction", s.at) for s in beam.supports]
    quantities += [Quantity("moment_reaction", s.at) for s in beam.supports if s.restrains_rotation]
    quantities += [Quantity("hinge_shear", h) for h in beam.hinges]
    xs = np.linspace(0.0, float(beam.length), 61)
    for q in quantities:
        reference = exact_line(beam, q)
        numeric = elastic_line(beam, q)
        np.testing.assert_allclose(numeric(xs), reference(xs), rtol=0, atol=1e-9 * _scale(reference(xs)))
        exact = elastic_line(beam, q, exact=True)
        for x in (Fraction(0), a / 3, a, (a + beam.length) / 2, beam.length):
            assert exact.ordinate_exact(x) == reference.ordinate_exact(x)
            assert exact.ordinate_exact(x, "left") == reference.ordinate_exact(x, "left")


@SETTINGS
@given(st.data())
def test_very_stiff_spring_tends_to_a_rigid_bearing(data):
    """A vertical spring far stiffer than the beam acts like a rigid bearing; the gap shrinks like 1/k."""
    beam = data.draw(elastic_beams(springs=False))
    candidates = [s for s in beam.supports if s.kind in ("pin", "roller")]
    if not candidates:
        return
    target = data.draw(st.sampled_from(candidates))
    a = data.draw(positions(beam, avoid=[s.at for s in beam.supports] + list(beam.hinges)))
    ei = max(e for _, _, e in beam.EI_ranges)
    h = min([b - a for a, b in beam.spans] or [beam.length])
    unit = float(ei / h**3)  # the beam's own vertical stiffness scale
    xs = np.linspace(0.0, float(beam.length), 81)
    rigid = [beam.reaction(target.at)(xs), beam.moment(a)(xs)]
    gaps = []
    for k in (1e4, 1e7):
        supports = {s.at: s.spec for s in beam.supports}
        supports[target.at] = ilkit.Spring(vertical=k * unit)
        soft = beam.replace(supports=supports)
        lines = [soft.reaction(target.at)(xs), soft.moment(a)(xs)]
        gaps.append(max(np.max(np.abs(x - y)) / _scale(y) for x, y in zip(lines, rigid)))
    assert gaps[1] < 1e-5
    assert gaps[1] < gaps[0] / 100 or gaps[0] < 1e-9
