"""Elastic supports: vertical and rotational springs.

Closed forms are derived in each test by the force method (compatibility of
one redundant) from handbook deflections of simple beams and cantilevers
(common practice), named beside each.
"""

from __future__ import annotations

from fractions import Fraction as F

import numpy as np
import pytest

import ilkit
from ilkit import Spring
from ilkit.analysis import method_for
from ilkit.quantity import Quantity

HANDBOOK = "handbook deflections of simple beams and cantilevers (common practice), force method in the test"


def test_midspan_spring_under_a_simple_span(reference):
    """Simple span L with a vertical spring k at midspan.

    Handbook: midspan deflection of a simple beam under a unit load at x <= L/2
    is x (3 L² - 4 x²) / (48 EI); under a unit midspan force, L³ / (48 EI).
    Compatibility: R (1/k + L³/(48 EI)) = x (3L² - 4x²) / (48 EI).
    """
    L, EI, k = F(12), F(3000), F(800)
    beam = ilkit.Beam(L, {0: "pin", L / 2: Spring(vertical=k), L: "roller"}, EI=EI)
    assert beam.degree == 1
    line = beam.reaction(L / 2, exact=True)
    xs = [F(1), F(5, 2), F(4), F(6)]
    want = [x * (3 * L**2 - 4 * x**2) / (48 * EI) / (1 / k + L**3 / (48 * EI)) for x in xs]
    clause = "R (1/k + L³/(48 EI)) = x (3L² - 4x²) / (48 EI)"
    reference("spring force at midspan, load at 1, 5/2, 4, 6", expected=want,
              computed=[line.ordinate_exact(x) for x in xs], source=HANDBOOK, clause=clause)
    reference("spring force at midspan, mirrored loads (symmetry)", expected=want,
              computed=[line.ordinate_exact(L - x) for x in xs], source=HANDBOOK, clause=clause)
    # the spring's settlement is its force over k: the deflection line at the spring
    xs = np.linspace(0, 12, 25)
    np.testing.assert_allclose(beam.deflection(L / 2)(xs), beam.reaction(L / 2)(xs) / float(k), atol=1e-15)


def test_rotational_spring_at_the_end_of_a_propped_span(reference):
    """Pin with a rotational spring k_r at x=0, roller at L.

    Handbook end rotation of a simple beam under a unit load at x:
    θ0 = x (L - x)(2L - x) / (6 EI L); under an end couple M: M L / (3 EI).
    Compatibility: M (1/k_r + L/(3EI)) = θ0.  As k_r grows, M tends to the
    fixed-end moment of a propped cantilever, x (L - x)(2L - x) / (2 L²).
    """
    L, EI, kr = F(12), F(3000), F(5000)
    beam = ilkit.Beam(L, {0: Spring(rotational=kr), L: "roller"}, EI=EI)
    assert beam.degree == 1
    line = beam.moment_reaction(0, exact=True)
    xs = [F(1), F(5, 2), F(6), F(11)]
    reference("spring moment at 0, load at 1, 5/2, 6, 11", computed=[line.ordinate_exact(x) for x in xs],
              expected=[x * (L - x) * (2 * L - x) / (6 * EI * L) / (1 / kr + L / (3 * EI)) for x in xs],
              source=HANDBOOK, clause="M (1/k_r + L/(3EI)) = θ0 = x (L - x)(2L - x) / (6 EI L)")
    # the spring moment is k_r times the rotation line at the support (counter-clockwise = resisting)
    xs = np.linspace(0, 12, 25)
    np.testing.assert_allclose(beam.moment_reaction(0)(xs), float(kr) * beam.rotation(0)(xs), atol=1e-12)
    # the hogging moment at the support face equals minus the moment reaction
    np.testing.assert_allclose(beam.moment(0)(xs), -beam.moment_reaction(0)(xs), atol=1e-12)
    stiff = beam.replace(supports={0: Spring(rotational=F(10) ** 12), L: "roller"})
    fixed_end = np.array([x * (12 - x) * (24 - x) / (2 * 144) for x in xs])
    reference("very stiff rotational spring: the fixed-end moment of a propped cantilever", expected=fixed_end,
              computed=stiff.moment_reaction(0)(xs), abs=1e-6, source=HANDBOOK,
              clause="x (L - x)(2L - x) / (2L²), 25 load positions")


def test_cantilever_on_a_settling_fixed_support(reference):
    """A fixed end on a vertical spring: the tip deflection under a unit load at x is the
    handbook cantilever value x² (3L - x) / (6 EI) plus the settlement 1/k (the support carries 1)."""
    L, EI, k = F(5), F(400), F(250)
    beam = ilkit.Beam(L, {0: Spring(vertical=k, rotational="rigid")}, EI=EI)
    assert beam.is_determinate
    tip = beam.deflection(L, exact=True)
    xs = [F(1), F(5, 2), F(5)]
    reference("tip deflection, load at 1, 5/2, 5: x² (3L - x) / (6 EI) + 1/k",
              computed=[tip.ordinate_exact(x) for x in xs],
              expected=[x**2 * (3 * L - x) / (6 * EI) + 1 / k for x in xs], source=HANDBOOK,
              clause="cantilever deflection at the tip under a load at x, plus the settlement")
    assert beam.reaction(0)(2.0) == 1.0  # statics, exact kinematic line
    assert beam.moment_reaction(0)(2.0) == 2.0


def test_determinate_beam_on_two_springs(reference):
    """A simple span on two springs: force lines are those of statics (the exact
    kinematic path, springs or not); the deflection line adds the rigid-body settlement
    (1 - a/L)(1 - x/L)/k1 + (a/L)(x/L)/k2 to the handbook simple-span value."""
    L, EI, k1, k2, a = F(10), F(2000), F(300), F(700), F(4)
    beam = ilkit.Beam(L, {0: Spring(vertical=k1), L: Spring(vertical=k2)}, EI=EI)
    assert beam.is_determinate and beam.stability.is_stable
    assert method_for(beam, Quantity("moment", a)) == "kinematic"
    assert method_for(beam, Quantity("deflection", a)) == "stiffness"
    assert beam.reaction(0).is_exact and beam.moment(a).is_exact
    assert beam.reaction(0).ordinate_exact(3) == F(7, 10)
    line = beam.deflection(a, exact=True)
    xs = [F(1), F(4), F(15, 2)]
    want = []
    for x in xs:
        if x >= a:
            bending = (L - x) * a * (L**2 - (L - x) ** 2 - a**2) / (6 * EI * L)
        else:
            bending = x * (L - a) * (L**2 - x**2 - (L - a) ** 2) / (6 * EI * L)
        want.append(bending + (1 - a / L) * (1 - x / L) / k1 + (a / L) * (x / L) / k2)
    reference("simple span on two springs, deflection at 4, load at 1, 4, 15/2", expected=want,
              computed=[line.ordinate_exact(x) for x in xs], source=HANDBOOK,
              clause="simple-beam deflection P b x (L² - b² - x²) / (6 EI L) plus the rigid-body settlement")


def test_stiff_springs_make_a_rigid_continuous_beam(reference):
    """Two-span beam: stiff springs under the pier tend to the rigid-pier closed form
    R2 = x (3L² - x²)/(2L³) (handbook, two equal spans)."""
    L = 10.0
    xs = np.linspace(0, 10, 21)
    want = xs * (3 * L**2 - xs**2) / (2 * L**3)
    gaps = []
    for k in (1e3, 1e6, 1e9):
        beam = ilkit.Beam(20, {0: "pin", 10: Spring(vertical=k), 20: "roller"}, EI=1000)
        gaps.append(np.max(np.abs(beam.reaction(10)(xs) - want)))
    reference("stiff pier spring (k = 1e9): R2 = x (3L² - x²)/(2L³), 21 load positions", expected=want,
              computed=ilkit.Beam(20, {0: "pin", 10: Spring(vertical=1e9), 20: "roller"}, EI=1000).reaction(10)(xs),
              abs=1e-8, source="handbook beam formulas (AISC, Beam Diagrams and Formulas)",
              clause="continuous beam, two equal spans, concentrated load at any point", from_memory=True)
    assert gaps[0] > 100 * gaps[1] > 1e4 * gaps[2]


# ------------------------------------------------------------------ stability
def test_springs_count_like_supports_in_stability_and_degree():
    # two vertical springs carry a beam like two bearings: stable, determinate
    assert ilkit.Beam(10, {0: Spring(vertical=5), 10: Spring(vertical=5)}).degree == 0
    # a spring added to a simple span makes it indeterminate by one
    assert ilkit.Beam(20, {0: "pin", 10: Spring(vertical=5), 20: "roller"}).degree == 1
    # a rotational spring counts like fixity
    assert ilkit.Beam(10, {0: Spring(rotational=5), 10: "roller"}).degree == 1
    # a fixed end on springs is a cantilever (no rigid support at all)
    cantilever = ilkit.Beam(10, {0: Spring(vertical=5, rotational=7)})
    assert cantilever.stability.is_stable and cantilever.is_determinate
    # one vertical spring alone lets the beam rotate
    with pytest.raises(ilkit.UnstableBeamError, match="rotate"):
        ilkit.Beam(10, {5: Spring(vertical=5)})


def test_spring_reactions_balance_the_load():
    beam = ilkit.Beam(
        30,
        {0: Spring(vertical=400, rotational=9000), 12: Spring(vertical=800), 22: "pin", 30: Spring(vertical=300)},
        hinges=[26],
        EI=[(0, 10, 5000), (10, 14, 8000), (14, 30, 5000)],
    )
    xs = np.linspace(0, 30, 61)
    total = sum(beam.reaction(s.at)(xs) for s in beam.supports)
    np.testing.assert_allclose(total, 1.0, atol=1e-12)
    moments = sum(float(s.at) * beam.reaction(s.at)(xs) for s in beam.supports) + beam.moment_reaction(0)(xs)
    np.testing.assert_allclose(moments, xs, atol=1e-10)
