"""Derivations of lines from the stiffness method: the printed numbers are the analysis' own and
reproduce the line; reference values from closed forms."""

from __future__ import annotations

import bisect
from fractions import Fraction

import pytest
import sympy
from continuous_strategies import elastic_beams
from hypothesis import HealthCheck, given, settings
from hypothesis import strategies as st
from sympy.parsing.sympy_parser import parse_expr

import ilkit
from ilkit.views import derivation
from ilkit.views._doc import Table

X = ilkit.x


def table_after(d, heading: str) -> Table:
    blocks = list(d.blocks)
    start = next(i for i, b in enumerate(blocks) if getattr(b, "text", "").endswith(heading))
    return next(b for b in blocks[start:] if isinstance(b, Table))


def hermite(v1, r1, v2, r2, a, b):
    """The cubic through (a, v1) and (b, v2) with slopes r1, r2 (written out here, independently)."""
    h = b - a
    xi = (X - a) / h
    return sympy.expand(
        v1 * (1 - 3 * xi**2 + 2 * xi**3) + h * r1 * (xi - 2 * xi**2 + xi**3)
        + v2 * (3 * xi**2 - 2 * xi**3) + h * r2 * (-(xi**2) + xi**3)
    )


def test_simple_span_deflection_matches_the_handbook(reference) -> None:
    # Simply supported span L = 20, EI = 1000, unit load at midspan (closed forms, common practice):
    # end slopes P L² / (16 EI) = 1/40, clamped-end moments P L / 8 = 5/2, midspan deflection
    # P L³ / (48 EI) = 1/6 (Maxwell: the deflection line's ordinate at midspan).
    beam = ilkit.Beam(20, {0: "pin", 20: "roller"}, EI=1000, units="kN-m")
    line = beam.deflection(10, exact=True)
    d = derivation(line)
    nodal = table_after(d, "Nodal displacements")
    assert [(r[1].text, r[2].text, r[3].text) for r in nodal.rows] == [("0", "0", "1/40"), ("20", "0", "-1/40")]
    loads = table_after(d, "Loads")
    assert [c.text for c in loads.rows[0]] == ["1/2", "5/2", "1/2", "-5/2"]
    reference("derived midspan deflection line of a 20 span, EI = 1000, load at midspan",
              computed=d.expression.subs(X, 10), expected=sympy.Rational(20**3, 48 * 1000),
              source="AISC Steel Construction Manual, Table 3-23 (beam diagrams and formulas)",
              clause="simple beam, concentrated load at center: Δmax = P l³ / (48 EI)", from_memory=True)
    text = d.to_text()
    assert "a unit downward force at x=10" in text and "exactly, in rational arithmetic" in text


def test_two_span_middle_reaction_matches_the_closed_form(reference) -> None:
    # Two equal spans L: R_B(x) = x (3L² - x²) / (2L³) for 0 <= x <= L (flexibility method written out:
    # deflection of the 2L span at B under a unit load at x, x (3L² - x²)/(12 EI), over that under a
    # unit load at B, L³/(6 EI)).
    L = 10
    beam = ilkit.Beam(2 * L, {0: "pin", L: "roller", 2 * L: "roller"}, EI=1)
    d = derivation(beam.reaction(L, exact=True), method="stiffness")
    xs = (Fraction(1), Fraction(5, 2), Fraction(7))
    reference("derived middle reaction of two equal 10 spans, load at x = 1, 5/2, 7",
              computed=[d.expression.subs(X, x) for x in xs], expected=[x * (3 * L**2 - x**2) / (2 * L**3) for x in xs],
              source="AISC Steel Construction Manual, Table 3-23 (beam diagrams and formulas)",
              clause="continuous beam, two equal spans, concentrated load at any point", from_memory=True)
    assert "the bearing at x=10 settles by 1" in d.to_text()


@settings(max_examples=25, deadline=None, suppress_health_check=[HealthCheck.filter_too_much, HealthCheck.too_slow])
@given(elastic_beams(max_spans=3), st.data())
def test_printed_nodal_values_are_the_analysis_and_rebuild_the_line(beam: ilkit.Beam, data: st.DataObject) -> None:
    supports = [s.at for s in beam.supports]
    kind = data.draw(st.sampled_from(["reaction", "moment", "deflection"]))
    if kind == "reaction":
        line = beam.reaction(data.draw(st.sampled_from(supports)), exact=True)
    else:
        grid = [Fraction(i, 2) * beam.length / 8 for i in range(1, 16)]
        at = data.draw(st.sampled_from([g for g in grid if g not in supports and g not in beam.hinges]))
        line = getattr(beam, kind)(at, exact=True)
    d = derivation(line, method="stiffness")
    origin = line.origin
    nodal = table_after(d, "Nodal displacements")
    nodes = [Fraction(r[1].text) for r in nodal.rows]
    v = [Fraction(r[2].text) for r in nodal.rows]
    theta = [Fraction(r[3].text) for r in nodal.rows]
    assert nodes == list(origin.nodes) and v == list(origin.deflections) and theta == list(origin.rotations)
    # printed ordinates at the nodes are the line's (left face; right face at x = 0)
    ordinates = table_after(d, "Ordinates at the nodes")
    for (x_cell, eta_cell), x in zip(ordinates.rows, nodes):
        side = "left" if x > 0 else "right"
        assert Fraction(x_cell.text) == x and Fraction(eta_cell.text) == line.ordinate_exact(x, side)
    # on every element without the action or a release at its ends, the Hermite cubic of the printed
    # end values is the line (an independent rebuild of the pieces)
    released = set(beam.hinges) | set(beam.shear_releases)
    c = origin.factor
    for i in range(len(nodes) - 1):
        a, b = nodes[i], nodes[i + 1]
        if a <= line.quantity.at <= b or a in released or b in released:
            continue
        mid = (a + b) / 2
        rebuilt = hermite(c * v[i], c * theta[i], c * v[i + 1], c * theta[i + 1], a, b)
        piece = line.pieces[bisect.bisect_right(line.exact_breakpoints, mid) - 1]
        assert sympy.expand(rebuilt - piece.polynomial()) == 0
    # the final pieces, parsed back from the text, are the line
    final = d.to_text().split("Influence line\n--------------")[-1]
    rows = [ln.split("  for ") for ln in final.splitlines() if "  for " in ln and "off the beam" not in ln]
    exprs = [parse_expr(r[0].replace("η(x) = ", "").strip(), local_dict={"x": X}) for r in rows]
    assert [sympy.expand(e - p.polynomial()) for e, p in zip(exprs, line.pieces)] == [0] * len(line.pieces)


def test_float_line_prints_six_figures_of_the_analysis() -> None:
    beam = ilkit.Beam(30, {0: "pin", 15: ilkit.Spring(vertical=5000), 30: ilkit.Spring(rotational=2e5)},
                      EI=100000, units="kN-m")
    line = beam.reaction(15)
    d = derivation(line, method="stiffness")
    text = d.to_text()
    assert "a unit downward force at x=15, times k" in text and "c = 5000" in text
    assert "a vertical spring k = 5000 kN/m" in text and "a rotational spring k = 200000 kN·m/rad" in text
    ordinates = table_after(d, "Ordinates at the nodes")
    for x_cell, eta_cell in ordinates.rows:
        x = float(Fraction(x_cell.text))
        expected = line.left(x) if x > 0 else line(x)
        assert float(eta_cell.text) == pytest.approx(expected, rel=5e-6, abs=1e-12)
    assert "rounded to six significant figures" in text
    assert d.expression == line.expr
    assert "<math" in d.to_html() and r"\begin{cases}" in d.to_markdown()
