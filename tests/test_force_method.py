"""The force (flexibility) method: the derivation written for indeterminate beams reproduces the
stiffness method's lines, and its printed numbers are the primary structure's; closed forms for two
equal spans."""

from __future__ import annotations

from fractions import Fraction

import numpy as np
import pytest
import sympy
from continuous_strategies import elastic_beams
from hypothesis import HealthCheck, given, settings
from hypothesis import strategies as st

import ilkit
from ilkit.flexibility import force_method, primary_structure
from ilkit.quantity import Quantity
from ilkit.views import derivation
from ilkit.views._doc import Table

X = ilkit.x


def table_after(d, heading: str) -> Table:
    blocks = list(d.blocks)
    start = next(i for i, b in enumerate(blocks) if getattr(b, "text", "").endswith(heading))
    return next(b for b in blocks[start:] if isinstance(b, Table))


def same_pieces(a: ilkit.InfluenceLine, b: ilkit.InfluenceLine) -> bool:
    """Two exact lines are the same polynomial on every interval between their knots."""
    knots = sorted(set(a.exact_breakpoints) | set(b.exact_breakpoints))
    for lo, hi in zip(knots[:-1], knots[1:]):
        mid = (lo + hi) / 2
        pa = a.pieces[sum(k <= mid for k in a.exact_breakpoints) - 1].polynomial()
        pb = b.pieces[sum(k <= mid for k in b.exact_breakpoints) - 1].polynomial()
        if sympy.expand(pa - pb) != 0:
            return False
    return True


# ----------------------------------------------------------------- closed forms
L = 10


@pytest.fixture(scope="module")
def two_spans():
    return ilkit.Beam(2 * L, {0: "pin", L: "roller", 2 * L: "roller"}, EI=1, units="kN-m")


HANDBOOK = "handbook formulas for a simple span (common practice), the force method written out in the test"


def test_two_equal_spans_middle_reaction(two_spans, reference) -> None:
    # Closed forms (flexibility method written out here): the primary structure is the simple span 2L;
    # its midspan deflection under a unit load at midspan is (2L)^3 / (48 EI) = L^3 / (6 EI) (handbook
    # formula), the flexibility coefficient; the deflection there under a unit load at x <= L is
    # x (3 (2L)^2 - 4 x^2) / (48 EI) (handbook formula), so R_B(x) = x (3L^2 - x^2) / (2L^3).
    d = derivation(two_spans.reaction(L, exact=True))
    flexibility = table_after(d, "Flexibility coefficients")
    reference("printed flexibility coefficient: midspan deflection (2L)³ / (48 EI) = L³ / (6 EI)",
              expected=str(Fraction(L**3, 6)), computed=flexibility.rows[0][1].text, source=HANDBOOK,
              clause="simple span, load at midspan: P l³ / (48 EI)")
    assert "Redundants and primary structure" in d.to_text() and "supports pin at 0 m, roller at 20 m" in d.to_text()
    xs = (Fraction(1), Fraction(5, 2), Fraction(7), Fraction(L))
    reference("derived R_B(x) = x (3L² - x²) / (2L³), x = 1, 5/2, 7, 10",
              computed=[d.expression.subs(X, x) for x in xs],
              expected=[x * (3 * L**2 - x**2) / (2 * L**3) for x in xs], source=HANDBOOK,
              clause="simple span deflection x (3 l² - 4 x²) / (48 EI), l = 2L")
    # symmetric about the middle support
    assert d.expression.subs(X, 2 * L - Fraction(3)) == d.expression.subs(X, Fraction(3))


def test_two_equal_spans_moment_over_the_support(two_spans, reference) -> None:
    # Three-moment equation for two equal spans, unit load at a in the first span (common practice):
    # 2 M_B (L + L) = -a (L^2 - a^2) / L, so M_B(a) = -a (L^2 - a^2) / (4 L^2) (hogging negative).
    line = two_spans.moment(L, exact=True)
    d = derivation(line)
    loads = (Fraction(2), Fraction(5), Fraction(17, 2))
    reference("derived M_B(a) = -a (L² - a²) / (4L²), a = 2, 5, 17/2",
              computed=[d.expression.subs(X, a) for a in loads],
              expected=[-a * (L**2 - a**2) / (4 * L**2) for a in loads],
              source="three-moment equation for two equal spans (common practice)",
              clause="2 M_B (L + L) = -a (L² - a²) / L")
    assert same_pieces(force_method(two_spans, line.quantity, exact=True).line, line)
    # the float derivation prints the same numbers to six figures
    text = derivation(two_spans.moment(L)).to_text()
    assert "166.667·X_1(x) = δ_1(x)" in text and "Largest difference from the stiffness method" in text


def test_spring_adds_one_over_k_and_fixed_end_releases_a_moment(reference) -> None:
    # A span fixed at 0 and on a vertical spring k at L (EI = 1, L = 6).  The released restraint is the
    # fixity; the primary structure is the span pinned at 0 on the spring.  Closed form (written out here):
    # a unit couple at 0 turns the end by L/(3 EI) (handbook formula for a simple span) plus the rigid
    # turn of the span as the spring, loaded by 1/L, settles by 1/(k L): 1/(k L^2).
    k = Fraction(1, 4)
    beam = ilkit.Beam(6, {0: "fixed", 6: ilkit.Spring(vertical=k)}, EI=1)
    fm = force_method(beam, Quantity("moment_reaction", Fraction(0)), exact=True)
    assert [r.words for r in fm.redundants] == ["moment reaction at x=0"]
    reference("flexibility of the fixity: L/(3 EI) + 1/(k L²), L = 6, EI = 1, k = 1/4",
              expected=Fraction(6, 3) + 1 / (k * 36), computed=fm.flexibility[0][0],
              source="handbook end rotation of a simple span under an end couple, L/(3 EI), plus the rigid turn "
              "on the spring (common practice)", clause="written out in the test")
    assert same_pieces(fm.line, beam.moment_reaction(0, exact=True))
    # a spring that is itself released: 1/k on the diagonal, printed
    beam = ilkit.Beam(20, {0: "pin", 8: ilkit.Spring(vertical=3), 20: "roller"}, EI=[(0, 8, 2), (8, 20, 5)])
    fm = force_method(beam, Quantity("reaction", Fraction(8)), exact=True)
    assert fm.springs == (Fraction(1, 3),) and fm.redundants[0].stiffness == 3
    d = derivation(beam.reaction(8, exact=True))
    springs = table_after(d, "Flexibility coefficients")
    assert "1/k" in d.to_text() and springs.rows[0][1].text == str(fm.flexibility[0][0])
    assert same_pieces(fm.line, beam.reaction(8, exact=True))


# --------------------------------------------------------------- property tests
@settings(max_examples=30, deadline=None, suppress_health_check=[HealthCheck.filter_too_much, HealthCheck.too_slow])
@given(elastic_beams(max_spans=3), st.data())
def test_force_method_reproduces_the_exact_line(beam: ilkit.Beam, data: st.DataObject) -> None:
    supports = [s.at for s in beam.supports]
    kind = data.draw(st.sampled_from(["reaction", "moment", "shear", "deflection"]))
    if kind == "reaction":
        line = beam.reaction(data.draw(st.sampled_from(supports)), exact=True)
    else:
        grid = [Fraction(i, 2) * beam.length / 8 for i in range(1, 16)]
        at = data.draw(st.sampled_from([g for g in grid if g not in supports and g not in beam.hinges]))
        line = beam.line(kind, at, exact=True)
    fm = force_method(beam, line.quantity, exact=True)
    # the primary structure is determinate and the redundants are as many as the degree
    assert fm.primary.degree == 0 and len(fm.redundants) == beam.degree
    # Maxwell: the flexibility matrix is symmetric
    n = len(fm.redundants)
    assert all(fm.flexibility[i][j] == fm.flexibility[j][i] for i in range(n) for j in range(n))
    assert same_pieces(fm.line, line)
    d = derivation(line)
    # the printed ordinates are the line's, and the stiffness method's column equals the force method's
    ordinates = table_after(d, "Ordinates")
    for row in ordinates.rows:
        x = Fraction(row[0].text)
        side = "left" if row[1] == "left" or x == line.exact_breakpoints[-1] else "right"
        assert Fraction(row[-1].text) == Fraction(row[-2].text) == line.ordinate_exact(x, side)
    # the printed flexibility coefficients are the primary structure's deflections (Maxwell)
    flexibility = table_after(d, "Flexibility coefficients")
    for i, r in enumerate(fm.redundants):
        for j, s in enumerate(fm.redundants):
            if r.kind == s.kind == "reaction":
                assert Fraction(flexibility.rows[i][j + 1].text) == fm.primary.deflection(r.at, exact=True)\
                    .ordinate_exact(s.at)


@settings(max_examples=20, deadline=None, suppress_health_check=[HealthCheck.filter_too_much, HealthCheck.too_slow])
@given(elastic_beams(max_spans=4), st.data())
def test_float_force_method_matches_the_stiffness_line(beam: ilkit.Beam, data: st.DataObject) -> None:
    at = data.draw(st.sampled_from([Fraction(i, 7) * beam.length for i in range(1, 7)]))
    jumps = any(s.at == at and s.restrains_rotation for s in beam.supports)  # a rotational spring at the section
    line = beam.moment(at, side="left" if jumps else None) if at not in beam.hinges else beam.shear(at)
    fm = force_method(beam, line.quantity)
    xs = np.linspace(0, float(beam.length), 301)
    scale = max(1.0, float(np.max(np.abs(line(xs)))))
    assert np.max(np.abs(fm.line(xs) - line(xs))) < 1e-9 * scale


# ------------------------------------------------------------------- refusals
def test_determinate_beams_have_no_redundants_and_bad_methods_are_named() -> None:
    beam = ilkit.Beam(20, {0: "pin", 20: "roller"}, EI=3)
    with pytest.raises(ilkit.NoDerivationError, match="statically determinate, so it has no redundants"):
        derivation(beam.deflection(5), method="flexibility")
    with pytest.raises(ilkit.NoDerivationError, match="statically determinate"):
        primary_structure(beam)
    with pytest.raises(ilkit.BeamInputError, match="method must be one of 'auto', 'stiffness', 'flexibility'"):
        derivation(beam.moment(5), method="virtual work")
    with pytest.raises(ilkit.NoDerivationError, match="method='stiffness' writes out lines of the stiffness method"):
        derivation(beam.moment(5), method="stiffness")
    # the stiffness write-up stays available for indeterminate beams
    continuous = ilkit.Beam(20, {0: "pin", 10: "roller", 20: "roller"}, EI=3)
    assert "Nodal displacements" in derivation(continuous.moment(5), method="stiffness").to_text()


@pytest.mark.parametrize(
    ("beam", "quantities"),
    [
        # an interior fixed support (a clamp in the beam): its moment is a redundant, and the moment and
        # the shear jump there
        (ilkit.Beam(20, {0: "pin", 10: "fixed", 20: "roller"}, EI=3),
         [("moment", 5, None), ("moment", 10, "left"), ("moment", 10, "right"), ("shear", 10, "right")]),
        # fixed ends, rotational springs (one on a settling bearing), a hinge and two stiffnesses
        (ilkit.Beam(24, {0: "fixed", 8: ilkit.Spring(rotational=5), 16: ilkit.Spring(vertical=2, rotational=7),
                         24: "fixed"}, hinges=[4], EI=[(0, 12, 3), (12, 24, 5)]),
         [("moment", 5, None), ("moment_reaction", 16, None), ("reaction", 24, None), ("hinge_shear", 4, None)]),
    ],
)
def test_fixities_and_rotational_springs_become_moment_redundants(beam, quantities) -> None:
    for kind, at, side in quantities:
        line = beam.line(kind, at, side, exact=True)
        fm = force_method(beam, line.quantity, exact=True)
        assert any(r.kind == "moment_reaction" for r in fm.redundants)
        assert same_pieces(fm.line, line), (kind, at, side)
