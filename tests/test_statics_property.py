"""Exact influence lines against an independent statics solver (tests/statics.py),
for random stable determinate beams generated with hypothesis.

The kinematic solver of ilkit (Müller-Breslau, displacements) and the statics
solver here (equilibrium and release conditions, forces) share no code; their
agreement for every generated beam, load position and section is the check.
"""

from __future__ import annotations

from fractions import Fraction

import sympy
from hypothesis import HealthCheck, given, settings
from hypothesis import strategies as st
from statics import moment_left, shear_left, solve_reactions
from strategies import determinate_beams

SETTINGS = settings(max_examples=60, deadline=None, suppress_health_check=[HealthCheck.too_slow])


def _grid(beam, k):
    """k load positions strictly inside the beam, off every knot."""
    L = beam.length
    return [L * Fraction(2 * i + 1, 2 * k) + Fraction(1, 97) * L / k for i in range(k)]


@SETTINGS
@given(beam=determinate_beams(), data=st.data())
def test_reactions_shears_moments_match_statics(beam, data):
    L = beam.length
    section = data.draw(st.integers(1, 39).map(lambda k: L * Fraction(k, 40)), label="section")
    on_support = any(s.at == section for s in beam.supports)
    side = "left" if on_support else None
    shear = beam.shear(section, side=side)
    moment_jumps = any(s.at == section and s.kind == "fixed" for s in beam.supports)
    moment = beam.moment(section, side="left" if moment_jumps else None)
    for x in _grid(beam, 9):
        if x == section:
            continue
        reactions = solve_reactions(beam, x)
        for s in beam.supports:
            assert beam.reaction(s.at).ordinate_exact(x) == Fraction(str(reactions[("R", s.at)]))
            if s.kind == "fixed":
                assert beam.moment_reaction(s.at).ordinate_exact(x) == Fraction(str(reactions[("C", s.at)]))
        xs = sympy.Rational(x.numerator, x.denominator)
        expected_v = shear_left(beam, reactions, xs, section)
        expected_m = moment_left(beam, reactions, xs, section)
        assert shear.ordinate_exact(x) == Fraction(str(expected_v))
        assert moment.ordinate_exact(x) == Fraction(str(expected_m))
        # float evaluation agrees with the exact value
        assert abs(shear(float(x)) - float(expected_v)) < 1e-9
        assert abs(moment(float(x)) - float(expected_m)) < 1e-9 * max(1, float(L))


@SETTINGS
@given(beam=determinate_beams())
def test_hinge_shear_matches_statics(beam):
    for h in beam.hinges:
        supported = any(s.at == h for s in beam.supports)
        line = beam.hinge_shear(h, side="left" if supported else None)
        for x in _grid(beam, 7):
            reactions = solve_reactions(beam, x)
            xs = sympy.Rational(x.numerator, x.denominator)
            assert line.ordinate_exact(x) == Fraction(str(shear_left(beam, reactions, xs, h)))
