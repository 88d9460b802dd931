"""Derivations of determinate influence lines: their final expression, parsed back, is the line;
the numbers they print are the core's."""

from __future__ import annotations

import re
from fractions import Fraction

import pytest
import sympy
from hypothesis import HealthCheck, given, settings
from scenarios import built_in_girder
from sympy.parsing.sympy_parser import parse_expr
from views_strategies import determinate_lines

import ilkit
from ilkit.influence import InfluenceLine
from ilkit.quantity import Quantity
from ilkit.views import derivation
from ilkit.views._doc import Cases, Table

X = ilkit.x
ROW = re.compile(r"^\s*(?:η\(x\) = )?(?P<expr>.+?)\s+for (?P<a>\S+) ≤ x (?P<op>[<≤]) (?P<b>\S+)$")


def parse_text_expression(text: str) -> sympy.Piecewise:
    """Rebuild the final piecewise expression from the derivation's plain text (section 6)."""
    final = text.split("Influence line\n--------------")[-1]
    args = [(sympy.Integer(0), X < 0)]
    for line in final.splitlines():
        m = ROW.match(line)
        if not m:
            continue
        expr = parse_expr(m["expr"], local_dict={"x": X})
        b = sympy.Rational(str(Fraction(m["b"])))
        args.append((expr, X < b if m["op"] == "<" else X <= b))
    args.append((sympy.Integer(0), True))
    return sympy.Piecewise(*args)


def same_piecewise_linear(p: sympy.Expr, q: sympy.Expr, knots: list[Fraction]) -> bool:
    """Exact equality of two piecewise-linear functions of x with breaks only at ``knots``.

    Equal values at every knot and at two interior points of every interval
    between knots (and outside the beam) prove equality: two straight lines
    that agree at two points are the same line.
    """
    lo, hi = knots[0], knots[-1]
    points = [lo - 1, lo - Fraction(1, 2), hi + Fraction(1, 2), hi + 1, *knots]
    for a, b in zip(knots[:-1], knots[1:]):
        points += [a + (b - a) / 3, a + 2 * (b - a) / 3]
    for pt in points:
        val = sympy.Rational(pt.numerator, pt.denominator)
        if sympy.nsimplify(p.subs(X, val)) != sympy.nsimplify(q.subs(X, val)):
            return False
    return True


@settings(max_examples=60, deadline=None, suppress_health_check=[HealthCheck.filter_too_much, HealthCheck.too_slow])
@given(determinate_lines())
def test_final_expression_parsed_back_equals_line_expr(line: InfluenceLine) -> None:
    d = derivation(line)
    parsed = parse_text_expression(d.to_text())
    knots = list(line.exact_breakpoints)
    # the derivation builds its expression from the mechanism's parts, not from line.expr
    assert same_piecewise_linear(parsed, line.expr, knots)
    assert same_piecewise_linear(d.expression, line.expr, knots)


@settings(max_examples=40, deadline=None, suppress_health_check=[HealthCheck.filter_too_much, HealthCheck.too_slow])
@given(determinate_lines())
def test_latex_pieces_parse_to_the_same_polynomials(line: InfluenceLine) -> None:
    pytest.importorskip("lark")
    from sympy.parsing.latex import parse_latex

    d = derivation(line)
    (cases,) = [b for b in d.blocks if isinstance(b, Cases)]
    for value, _ in cases.rows:
        from_latex = parse_latex(value.latex, backend="lark").subs(sympy.Symbol("x"), X)
        from_text = parse_expr(value.text, local_dict={"x": X})
        assert sympy.expand(from_latex - from_text) == 0
    markdown = d.to_markdown()
    assert all(v.latex in markdown for v, _ in cases.rows)


@settings(max_examples=60, deadline=None, suppress_health_check=[HealthCheck.filter_too_much, HealthCheck.too_slow])
@given(determinate_lines())
def test_printed_breakpoint_ordinates_are_the_core_values(line: InfluenceLine) -> None:
    d = derivation(line)
    tables = [b for b in d.blocks if isinstance(b, Table) and "small-angle geometry" in b.header]
    if not tables:  # a quantity carried by no restraint (moment at a hinge): the line is zero
        assert line.maximum.value == line.minimum.value == 0
        return
    text = d.to_text()
    seen = set()
    for x_cell, side, _, geometry, eta in tables[0].rows:
        x = Fraction(x_cell.text)
        value = Fraction(eta.text)
        core = line.ordinate_exact(x, side or None) if side else line.ordinate_exact(x)
        if x == line.exact_breakpoints[-1]:
            core = line.ordinate_exact(x, "left")
        assert value == core, (x, side)
        assert float(value) == pytest.approx(line(float(x)) if side != "left" else line.left(float(x)), abs=1e-12)
        # the small-angle geometry written beside it evaluates to the same number
        if "=" in geometry.text:
            rhs = geometry.text.split(" = ")[-1].replace("·", "*")
            assert sympy.nsimplify(parse_expr(rhs)) == sympy.Rational(value.numerator, value.denominator)
        assert eta.text in text
        seen.add((x, side))
    assert {x for x, _ in seen} == set(line.exact_breakpoints)


def test_simple_span_moment_matches_the_handbook_formula(reference) -> None:
    # Simple span L, section a: M-line = x (L - a) / L for x <= a, a (L - x) / L for x >= a
    # (the handbook case "simple beam, concentrated load at any point", read at the section by Maxwell).
    L, a = Fraction(20), Fraction(15, 2)
    beam = ilkit.Beam(L, {0: "pin", L: "roller"})
    d = derivation(beam.moment(a))
    xs = (Fraction(3), a, Fraction(12))
    reference("derived moment line at a = 15/2 of a 20 span, load at x = 3, 15/2, 12",
              computed=[d.expression.subs(X, x) for x in xs],
              expected=[x * (L - a) / L if x <= a else a * (L - x) / L for x in xs],
              source="AISC Steel Construction Manual, Table 3-23 (beam diagrams and formulas)",
              clause="simple beam, concentrated load at any point: M = P a b / l", from_memory=True)
    expected = sympy.Piecewise(
        (0, X < 0), (X * (L - a) / L, X < a), (a * (L - X) / L, X <= L), (0, True)
    )
    assert same_piecewise_linear(d.expression, expected, [Fraction(0), a, L])
    # the peak ordinate a (L - a) / L = (15/2)(25/2)/20 = 75/16, printed exactly at x = a
    (table,) = [b for b in d.blocks if isinstance(b, Table) and "small-angle geometry" in b.header]
    assert [row[-1].text for row in table.rows if row[0].text == "15/2"] == ["75/16"]


def test_suspended_span_reaction_written_out() -> None:
    # Girder 0..74 m, supports 0, 24, 50, 74, hinges 30 and 44.  Closed form derived here:
    # the left cantilever girder (0..30) pivots about x=0 when its support at 24 rises by 1,
    # so u = x/24, reaching 30/24 = 5/4 at the hinge; the suspended span (30..44) hangs on the
    # hinges and falls linearly from 5/4 to 0 at x=44; the right girder does not move.
    beam = ilkit.Beam(74, {0: "pin", 24: "roller", 50: "roller", 74: "roller"}, hinges=[30, 44], units="kN-m")
    d = derivation(beam.reaction(24))
    expected = sympy.Piecewise(
        (0, X < 0), (X / 24, X < 30), (sympy.Rational(5, 4) * (44 - X) / 14, X < 44), (0, True)
    )
    assert same_piecewise_linear(d.expression, expected, [Fraction(p) for p in (0, 24, 30, 44, 50, 74)])
    text = d.to_text()
    assert "the vertical restraint of the support at x=24 removed" in text
    assert "5/4" in text
    assert "kN/kN" in text and "positions x in m" in text


def test_moment_at_a_hinge_is_zero_and_says_why() -> None:
    beam = built_in_girder(units=None)
    d = derivation(beam.moment(9.6))
    assert "a hinge carries no moment" in d.to_text()
    assert same_piecewise_linear(d.expression, beam.moment(9.6).expr, [Fraction(0), Fraction("9.6"), Fraction("37.2")])


def test_renderings_agree_and_display_in_a_notebook() -> None:
    beam = built_in_girder()
    d = derivation(beam.shear(15))
    assert str(d) == d.to_text()
    assert d._repr_markdown_() == d.to_markdown()
    md = d.to_markdown()
    assert r"\begin{cases}" in md and "$$" in md
    html = d.to_html()
    assert "<math" in html and "<mfrac>" in html
    assert repr(d) == "<Derivation 'Influence line of the shear V at x = 15 m'>"
    # the imposed condition is marked, and its right-hand side is 1
    assert "u(x=15+) − u(x=15−) = 1 (imposed)" in d.to_text()


def test_line_without_a_mechanism_has_no_derivation() -> None:
    hand_made = InfluenceLine(
        quantity=Quantity("moment", Fraction(5)),
        knots=(Fraction(0), Fraction(5), Fraction(10)),
        coefficients=((Fraction(0), Fraction(1, 2)), (Fraction(5, 2), Fraction(-1, 2))),
    )
    with pytest.raises(ilkit.NoDerivationError, match=r"origin=None.*beam\.moment\(x\)"):
        derivation(hand_made)

    class FlexibilityResult:  # what an analysis without a registered writer might attach
        pass

    foreign = InfluenceLine(
        quantity=Quantity("moment", Fraction(5)),
        knots=(0.0, 10.0),
        coefficients=((0.0, 1.0),),
        origin=FlexibilityResult(),
    )
    with pytest.raises(ilkit.NoDerivationError, match="FlexibilityResult"):
        derivation(foreign)
    assert issubclass(ilkit.NoDerivationError, ilkit.IlkitError)
