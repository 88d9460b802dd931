"""Derivations of lines from the stiffness method (:class:`ilkit.stiffness.UnitShape`).

Continuous beams, beams on springs, and the deflection and rotation lines of
any beam come from the elastic analysis: the line is the beam's deflected
shape under a unit action conjugate to the quantity.  The derivation writes
out: the unit action; the stiffness model (elements, their ``EI``, the
restraints and springs); for an action inside an element, the nodal loads of
that element held clamped; the nodal deflections and rotations solved from
``K d = f``; the ordinates at the nodes; the cubic (Hermite) shape between
nodes; and the line's pieces.  Numbers are the analysis' own: exact rationals
for exact lines (``exact=True``), floats to six significant figures otherwise.
"""

from __future__ import annotations

import bisect
from fractions import Fraction
from typing import TYPE_CHECKING, Any

from ilkit._exact import fmt
from ilkit.elements import clamped_response
from ilkit.stiffness import UnitShape
from ilkit.views import _doc
from ilkit.views._doc import (
    Block,
    Cases,
    Equation,
    Heading,
    Math,
    Para,
    Table,
    ident,
    num,
    op,
    paren,
    rounded_poly,
    value_math,
)
from ilkit.views.derive import ETA, Derivation, _interval, _symbol, derive_origin, header

if TYPE_CHECKING:  # pragma: no cover
    from ilkit.influence import InfluenceLine
    from ilkit.model import Beam

__all__ = ["line_cases"]


def _restraint_words(beam: Beam) -> str:
    units = beam.units
    k_v = f" {units.force}/{units.length}" if units else ""
    k_r = f" {units.force}·{units.length}/rad" if units else ""
    words = []
    for s in beam.supports:
        at = f"x = {fmt(s.at)}"
        parts = ["v = 0" if s.vertical_stiffness is None else f"a vertical spring k = {fmt(s.vertical_stiffness)}{k_v}"]
        if s.rotational_stiffness is not None:
            parts.append(f"a rotational spring k = {fmt(s.rotational_stiffness)}{k_r}")
        elif s.restrains_rotation:
            parts.append("θ = 0")
        words.append(f"at {at}: {' and '.join(parts)}")
    return "; ".join(words)


def _hermite_equation() -> list[Block]:
    """``v(x) = v_a H1 + h θ_a H2 + v_b H3 + h θ_b H4`` and the four cubic Hermite functions of ξ."""
    import sympy

    xi, h = ident("ξ"), ident("h")
    v = ident("v") + paren(ident("x"))
    dot = Math("", "·", "<mo>&InvisibleTimes;</mo>")
    terms = (
        ident("v", "a") + dot + ident("H", 1) + paren(xi) + op("+") + h + dot + ident("θ", "a") + dot
        + ident("H", 2) + paren(xi) + op("+") + ident("v", "b") + dot + ident("H", 3) + paren(xi) + op("+") + h
        + dot + ident("θ", "b") + dot + ident("H", 4) + paren(xi)
    )
    s = sympy.Symbol("xi")
    shapes = [1 - 3 * s**2 + 2 * s**3, s - 2 * s**2 + s**3, 3 * s**2 - 2 * s**3, -(s**2) + s**3]
    functions = []
    for i, shape in enumerate(shapes, start=1):
        m = _doc.sympy_math(shape)
        functions.append(ident("H", i) + op("=") + Math(m.latex, m.text.replace("xi", "ξ"), m.mathml))
    listed = functions[0]
    for f in functions[1:]:
        listed = listed + op(",") + f
    return [Equation(v + op("=") + terms), Equation(listed)]


@derive_origin.register(UnitShape)
def _(origin: UnitShape, line: InfluenceLine) -> Derivation:
    q = origin.quantity
    beam = origin.beam
    exact = line.is_exact
    factor = origin.factor
    title, blocks = header(line)
    c_is_one = factor == 1
    scale = max([1.0, *(abs(float(v)) for v in origin.deflections)])
    eta = ETA + op("=") + (Math("", "", "") if c_is_one else ident("c") + op("·")) + ident("v") + paren(ident("x"))
    blocks.append(Para((
        "Elastic analysis (stiffness method): the influence line of ",
        _symbol(q),
        " is the deflected shape of the beam under the unit action conjugate to it (Müller-Breslau's "
        "principle; for a deflection or a rotation, Maxwell's reciprocal theorem), measured downward: ",
        eta,
        "" if c_is_one else ", with the factor c given below",
        ".",
    )))
    blocks += [Heading("1. Unit action", 3), Para((f"Applied: {origin.action}.",))]
    if not c_is_one:
        blocks.append(Para(("The spring's force is its stiffness times the movement at the spring: ",
                            ident("c") + op("=") + value_math(factor), ".")))
    nodes = list(origin.nodes)
    if beam is not None:
        ranges = beam.EI_ranges
        elements = list(zip(nodes[:-1], nodes[1:]))

        def ei_of(a: Fraction, b: Fraction) -> Fraction:
            mid = (a + b) / 2
            return next(ei for lo, hi, ei in ranges if lo <= mid <= hi)

        blocks += [
            Heading("2. Stiffness model", 3),
            Para((
                f"The beam is divided at its ends, supports, releases and changes of EI into {len(elements)} "
                "prismatic elements. Each node has a deflection ",
                ident("v", "i"), " (downward) and a rotation ", ident("θ", "i"),
                " (clockwise, the slope dv/dx); a hinge gives its node a rotation on each face, a shear "
                f"release a deflection on each face. Restraints: {_restraint_words(beam)}.",
            )),
            Table(("element", "from x", "to x", "EI"),
                  tuple((str(j + 1), num(a), num(b), num(ei_of(a, b))) for j, (a, b) in enumerate(elements)),
                  "rrrr"),
        ]
        blocks += _loads(origin, line, nodes, ei_of)
    blocks += [
        Heading("4. Nodal displacements", 3),
        Para((f"Solving K d = f {_solved(exact, origin.exact_because)} gives the deflection and rotation of every "
              "node (left face where a release separates the faces):",)),
        Table(("node", "x", ident("v", "i"), ident("θ", "i")),
              tuple((str(i + 1), num(x), value_math(v, scale), value_math(r, scale))
                    for i, (x, v, r) in enumerate(zip(nodes, origin.deflections, origin.rotations))),
              "rrrr"),
        Heading("5. Ordinates at the nodes", 3),
        Para((ETA + op("=") + (Math("", "", "") if c_is_one else ident("c") + op("·")) + ident("v", "i"), ":")),
        Table(("x", ETA), tuple((num(x), value_math(factor * v, scale * abs(float(factor))))
                                for x, v in zip(nodes, origin.deflections)), "rr"),
        Heading("6. Shape between the nodes", 3),
        Para(("Between nodes a and b (length h, ", ident("ξ") + op("=") + paren(ident("x") + op("-") + ident("x", "a"))
              + Math("/h", "/h", "<mo>/</mo><mi>h</mi>"),
              ") an element without load deflects as the cubic that matches the end values and slopes:")),
        *_hermite_equation(),
        Para(("In the element that carries the unit action, the shape of that element held clamped is added; "
              "the line is therefore a cubic between consecutive knots.",)),
        Heading("7. Influence line", 3),
    ]
    blocks.append(line_cases(line))
    if not exact:
        blocks.append(Para(("Coefficients rounded to six significant figures for display; ask for the exact line "
                            "with exact=True.",)))
    return Derivation(title, _numbered(blocks), line.expr)


def _solved(exact: bool, because: str) -> str:
    if exact:
        return "exactly, in rational arithmetic,"
    if because:
        return (f"exactly, in rational arithmetic, then rounded to floats (floating point alone would not do: "
                f"{because})")
    return "in floating point"


def line_cases(line: InfluenceLine, lhs: Math = ETA) -> Cases:
    """The line's pieces as ``lhs = { polynomial for interval }`` (floats rounded to six significant figures),
    with the zero off the beam."""
    exact = line.is_exact
    rows = []
    pieces = line.pieces
    for j, piece in enumerate(pieces):
        poly = piece.polynomial()
        poly = poly if exact else rounded_poly(poly, line.length)
        a = piece.exact_start if exact else Fraction(repr(piece.start))
        b = line.exact_breakpoints[j + 1] if exact else Fraction(repr(piece.end))  # type: ignore[index]
        rows.append((_doc.sympy_math(poly), _interval(a, b, j == len(pieces) - 1)))
    length = line.exact_breakpoints[-1] if exact else Fraction(repr(line.length))  # type: ignore[index]
    off = (ident("x") + op("<") + num(0) + _doc.word(" or ") + ident("x") + Math(">", " > ", "<mo>&gt;</mo>")
           + num(length))
    rows.append((num(0), off + _doc.word(" (load off the beam)")))
    return Cases(lhs, tuple(rows))


def _numbered(blocks: list[Block]) -> tuple[Block, ...]:
    """Number the steps 1, 2, 3 ... in order (a step is left out when the beam is not known)."""
    out: list[Block] = []
    step = 0
    for b in blocks:
        if isinstance(b, Heading) and b.level == 3:
            step += 1
            b = Heading(f"{step}. {b.text.split('. ', 1)[1]}", 3)
        out.append(b)
    return tuple(out)


def _loads(origin: UnitShape, line: InfluenceLine, nodes: list[Fraction], ei_of: Any) -> list[Block]:
    """Step 3: the nodal loads of the unit action, or the restraint moved by 1."""
    out: list[Block] = [Heading("3. Loads", 3)]
    q = origin.quantity
    if origin.unit_action is None:
        out.append(Para((f"No load: {origin.action}, every other restraint holding; the stiffness terms that "
                         "couple the moved restraint to the free displacements are the load vector f.",)))
        return out
    k = bisect.bisect_left(nodes, q.at)
    if k < len(nodes) and nodes[k] == q.at:
        j = k - 1 if (q.side == "left" and k > 0) or k == len(nodes) - 1 else k
    else:
        j = k - 1
    a, b = nodes[j], nodes[j + 1]
    h, ei = b - a, ei_of(a, b)
    xi = q.at - a
    num_type: Any = Fraction if line.is_exact else float
    where = {0: "at its left end", h: "at its right end"}.get(xi, f"{fmt(xi)} from its left end")
    response = clamped_response(origin.unit_action, num_type(xi), num_type(h), num_type(ei))
    names = (ident("F", "a"), ident("M", "a"), ident("F", "b"), ident("M", "b"))
    out += [
        Para((f"The action stands in the element from x = {fmt(a)} to x = {fmt(b)} (h = {fmt(h)}, EI = {fmt(ei)}), "
              f"{where}. Held clamped at both ends, that element takes the action alone; "
              "its clamping forces, reversed, are the loads f on the beam's nodes (forces downward, couples "
              "clockwise):",)),
        Table(tuple(names), (tuple(value_math(v) for v in response.loads),), "rrrr"),
    ]
    return out
