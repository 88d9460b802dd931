"""Exact influence lines against closed forms derived by hand.

Each expected expression is derived in the docstring or comment beside it
from the statics of the beam (moments about a support or a hinge), the
standard textbook results for determinate beams (common practice).
"""

from __future__ import annotations

from fractions import Fraction

import numpy as np
import pytest
import sympy

import ilkit
from ilkit import x

STATICS = "closed form by statics (moments about a support or a hinge), derived in the test"
COMMON = "common practice (standard results for determinate beams)"


def same(reference, line, expected_pieces, source=STATICS, clause=COMMON):
    """Compare a line with [(start, end, expression in x)] at exact sample points (quarter points of
    each piece), one recorded check per piece."""
    for start, end, expr in expected_pieces:
        start, end = Fraction(start), Fraction(end)
        points = [start + (end - start) * Fraction(k, 4) for k in (1, 2, 3)]
        want = [Fraction(str(sympy.Rational(str(expr.subs(x, sympy.Rational(p.numerator, p.denominator))))))
                for p in points]
        reference(
            f"{line.quantity.label}: {sympy.sstr(expr)} for {start} < x < {end} (quarter points)",
            expected=want, computed=[line.ordinate_exact(p) for p in points], source=source, clause=clause,
        )


def test_simple_span(reference):
    """Simple span L, section a: R_A = (L-x)/L, R_B = x/L; V = -x/L left of a,
    (L-x)/L right of it; M = x(L-a)/L left of a, a(L-x)/L right of it."""
    L, a = 20, Fraction(15, 2)
    beam = ilkit.Beam(L, {0: "pin", L: "roller"})
    same(reference, beam.reaction(0), [(0, L, (L - x) / L)])
    same(reference, beam.reaction(L), [(0, L, x / L)])
    same(reference, beam.shear(a), [(0, a, -x / L), (a, L, (L - x) / L)])
    same(reference, beam.moment(a), [(0, a, x * (L - a) / L), (a, L, a * (L - x) / L)])
    m = beam.moment(a)
    reference("largest moment ordinate a (L - a) / L, simple span", expected=float(a * (L - a) / L),
              computed=m.maximum.value, rel=1e-12, source=STATICS, clause=COMMON)
    assert m.maximum.x == float(a)
    reference("area of the moment line a (L - a) / 2 (a triangle)", expected=(a * (L - a) / 2, 0),
              computed=m.exact_areas(), source=STATICS, clause=COMMON)
    reference("end shear line at the support: 1", expected=1.0, computed=beam.shear(0)(0.0), source=STATICS,
              clause=COMMON)


def test_cantilever(reference):
    """Cantilever fixed at 0, free at L: R = 1, M_R (ccw) = x; V(a) = 1 for x > a, 0 for x < a;
    M(a) = -(x - a) for x > a, 0 for x < a."""
    L, a = 8, 3
    beam = ilkit.Beam(L, {0: "fixed"})
    same(reference, beam.reaction(0), [(0, L, sympy.Integer(1) + 0 * x)])
    same(reference, beam.moment_reaction(0), [(0, L, x)])
    same(reference, beam.shear(a), [(0, a, 0 * x), (a, L, 1 + 0 * x)])
    same(reference, beam.moment(a), [(0, a, 0 * x), (a, L, -(x - a))])
    # fixed end moment at the root: M(0+) = -x
    same(reference, beam.moment(0), [(0, L, -x)])
    # right-fixed cantilever: moment reaction ccw = -(L - x)
    mirrored = ilkit.Beam(L, {L: "fixed"})
    same(reference, mirrored.moment_reaction(L), [(0, L, -(L - x))])


def test_beam_with_two_overhangs(reference):
    """Supports at A=c and B=c+s, overhangs c (left) and d (right):
    R_A = (c + s - x)/s and R_B = (x - c)/s along the whole beam (lines extend
    over the overhangs); moment over support B: 0 for x < c + s, -(x - c - s) beyond;
    moment at mid-span m = c + s/2: (x - c)/2 ... derived from R_A at left."""
    c, s, d = 3, 12, 4
    L = c + s + d
    beam = ilkit.Beam(L, {c: "pin", c + s: "roller"})
    same(reference, beam.reaction(c), [(0, L, (c + s - x) / s)])
    same(reference, beam.reaction(c + s), [(0, L, (x - c) / s)])
    same(reference, beam.moment(c + s), [(0, c + s, 0 * x), (c + s, L, -(x - c - s))])
    m = Fraction(c) + Fraction(s, 2)
    # M(m) = R_A (m - c) - (m - x) for x < m ; = R_A (m - c) for x > m
    ra = (c + s - x) / s
    same(reference, beam.moment(m), [(0, m, ra * (m - c) - (m - x)), (m, L, ra * (m - c))])
    # the left overhang tip moves opposite to the span: ordinate -c/2 at x = 0
    reference("midspan moment, load at the left tip: -c/2", expected=-c / 2, computed=beam.moment(m)(0.0),
              abs=1e-12, source=STATICS, clause=COMMON)
    reference("midspan moment, load at the right tip: -d/2", expected=-d / 2, computed=beam.moment(m)(float(L)),
              abs=1e-12, source=STATICS, clause=COMMON)


def test_cantilever_and_suspended_span_girder(reference):
    """Three-span girder: anchor spans A-B (0..20) and C-D (45..65) with
    cantilevers to hinges at 25 and 40 carrying a suspended span 25..40.

    Derivation (moments about the supports and hinges):
    * suspended span 25..40 is simply supported on the hinges: hinge forces
      H1 = (40 - x)/15, H2 = (x - 25)/15 for 25 <= x <= 40;
    * left anchor span with overhang: R_B = x/20 for x <= 25 and
      R_B = H1 * 25/20 for the suspended span; R_A = 1 - x/20 for x <= 25,
      R_A = -H1 * 5/20 on the suspended span;
    * moment over support B: 0 for x <= 20, -(x - 20) on the cantilever
      20..25, -5 H1 on the suspended span, 0 beyond 40.
    """
    beam = ilkit.Beam(65, {0: "pin", 20: "roller", 45: "roller", 65: "roller"}, hinges=[25, 40])
    assert beam.is_determinate
    h1 = (40 - x) / 15
    same(reference, beam.reaction(20), [(0, 25, x / 20), (25, 40, h1 * 25 / 20), (40, 65, 0 * x)])
    same(reference, beam.reaction(0), [(0, 25, 1 - x / 20), (25, 40, -h1 * 5 / 20), (40, 65, 0 * x)])
    same(reference, beam.moment(20), [(0, 20, 0 * x), (20, 25, -(x - 20)), (25, 40, -5 * h1), (40, 65, 0 * x)])
    same(reference, beam.hinge_shear(25), [(0, 25, 0 * x), (25, 40, h1), (40, 65, 0 * x)])
    # moment at midspan of the suspended span: simple-span triangle, peak 15/4 at 32.5
    mid = beam.moment("32.5")
    reference("suspended span, midspan moment: peak L/4 = 15/4", expected=15 / 4, computed=mid.maximum.value,
              rel=1e-12, source=STATICS, clause=COMMON)
    assert mid.maximum.x == 32.5
    # the zero line at the hinge
    assert np.all(beam.moment(25)(np.linspace(0, 65, 131)) == 0)


def test_inputs_stay_exact():
    """Ints, fractions and decimal strings stay exact; floats are read by their decimal text."""
    beam = ilkit.Beam("12.5", {0: "pin", Fraction(25, 2): "roller"})
    line = beam.moment("0.1")
    assert line.exact_breakpoints == (Fraction(0), Fraction(1, 10), Fraction(25, 2))
    expr = line.expr
    assert not any(isinstance(a, sympy.Float) for a in expr.atoms(sympy.Number))
    floats = ilkit.Beam(12.5, {0: "pin", 12.5: "roller"})
    assert floats.moment(0.1).exact_breakpoints == line.exact_breakpoints
    assert floats.moment(0.1).ordinate_exact(Fraction(5)) == Fraction(1, 10) * (Fraction(25, 2) - 5) / Fraction(25, 2)


def test_ordinates_table_and_jumps(reference):
    beam = ilkit.Beam(10, {0: "pin", 10: "roller"}, units="kN-m")
    table = beam.shear(4).ordinates()
    assert list(table.columns) == ["x [m]", "left [kN/kN]", "right [kN/kN]"]
    row = table[table["x [m]"] == 4.0].iloc[0]
    reference("simple span 10 m, shear at 4 m, both faces at the section: -a/L, (L - a)/L",
              expected=[-0.4, 0.6], computed=[row["left [kN/kN]"], row["right [kN/kN]"]], abs=1e-12,
              source=STATICS, clause=COMMON)
    line = beam.shear(4)
    assert line.left(4.0) == pytest.approx(-0.4) and line.right(4.0) == pytest.approx(0.6)
    assert line(4.0) == pytest.approx(0.6)  # right-hand value at a jump
    assert line(np.array([-1.0, 11.0])).tolist() == [0.0, 0.0]  # off the beam
    assert line.minimum.value == pytest.approx(-0.4) and line.minimum.side == "left"
    assert line.maximum.value == pytest.approx(0.6) and line.maximum.side == "right"
    reference("areas of the shear line: (L - a)^2 / (2L) and -a^2 / (2L)",
              expected=(Fraction(18, 10), Fraction(-8, 10)), computed=line.exact_areas(), source=STATICS,
              clause=COMMON)
    assert beam.moment(4).ordinates().columns[1] == "left [kN·m/kN]"


def test_sections_at_the_beam_ends(reference):
    """At an end support the end shear equals the reaction (left end) or minus it
    (right end), and the moment at a pinned end is zero (statics, common practice)."""
    beam = ilkit.Beam(24, {0: "pin", 16: "roller", 24: "roller"}, hinges=[20])
    xs = np.linspace(0, 24, 97)
    reference("shear at the left end = the reaction there (97 load positions)", expected=beam.reaction(0)(xs),
              computed=beam.shear(0)(xs), abs=1e-12, source=STATICS, clause=COMMON)
    reference("shear at the right end = minus the reaction there", expected=-beam.reaction(24)(xs[:-1]),
              computed=beam.shear(24)(xs[:-1]), abs=1e-12, source=STATICS, clause=COMMON)
    np.testing.assert_array_equal(beam.moment(0)(xs), 0.0)
    np.testing.assert_array_equal(beam.moment(24)(xs), 0.0)
    # free end of an overhang: no shear, no moment
    overhang = ilkit.Beam(14, {0: "pin", 10: "roller"})
    np.testing.assert_array_equal(overhang.moment(14)(xs), 0.0)
    np.testing.assert_array_equal(overhang.shear(14)(np.linspace(0, 13.9, 50)), 0.0)
