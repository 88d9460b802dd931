"""Derivations of lines whose load arrives at panel points: girders with a floor system, and trusses.

* :class:`ilkit.floor.FloorLine` (a girder loaded through stringers and floor
  beams): the girder's own line (its derivation, written out), its ordinates
  at the floor beams, the stringer's statics that make the line straight
  between them, and the resulting pieces.
* :class:`ilkit.trusses.TrussLine` (a member force or a reaction of a truss):
  the truss (joints, members, supports, determinacy), the method (the
  equilibrium of the joints solved exactly, the member force as force
  density times length; or the stiffness method with ``EA``), the value for a
  unit load on each floor beam in turn, and the line straight between them.

Every number is the core's: exact rationals where the line is exact (a
member of irrational length as ``t·√(L²)``), floats to six significant
figures otherwise.
"""

from __future__ import annotations

from fractions import Fraction
from typing import TYPE_CHECKING, Any

from ilkit.floor import FloorLine
from ilkit.trusses.lines import TrussLine
from ilkit.views import _doc
from ilkit.views._doc import Block, Heading, Math, Para, Table, ident, num, op, paren, value_math
from ilkit.views.derive import ETA, Derivation, derivation, derive_origin, header
from ilkit.views.derive_elastic import line_cases

if TYPE_CHECKING:  # pragma: no cover
    from ilkit.influence import InfluenceLine

__all__: list[str] = []


def _value(v: Any, scale: float) -> Math:
    return num(v) if isinstance(v, Fraction) else value_math(v, scale)


def _stringer_law() -> Math:
    """η(x) = η(p_i)·(p_{i+1} − x)/ℓ_i + η(p_{i+1})·(x − p_i)/ℓ_i."""
    p0, p1, ell = ident("p", "i"), ident("p", "i+1"), ident("ℓ", "i")

    def frac(top: Math) -> Math:
        return Math(rf"\frac{{{top.latex}}}{{{ell.latex}}}", f"({top.text})/{ell.text}",
                    f"<mfrac><mrow>{top.mathml}</mrow>{ell.mathml}</mfrac>")

    return (ETA + op("=") + ident("η") + paren(p0) + op("·") + frac(p1 + op("-") + ident("x")) + op("+")
            + ident("η") + paren(p1) + op("·") + frac(ident("x") + op("-") + p0))


def _through_deck(points: list[str]) -> Para:
    return Para((
        "The deck rests on stringers that span simply from floor beam to floor beam, so a load at x between the "
        "floor beams at ", ident("p", "i"), " and ", ident("p", "i+1"), f" ({', '.join(points)}) reaches the "
        "structure as two loads, in the ratio of the stringer's reactions (statics of a simple span): ",
        _stringer_law(), ", with ", ident("ℓ", "i") + op("=") + ident("p", "i+1") + op("-") + ident("p", "i"),
        ". Between floor beams the line is straight; beyond the first and the last it is 0 (no deck).",
    ))


def _shifted(blocks: tuple[Block, ...]) -> list[Block]:
    """Blocks of an embedded derivation, its headings one level down (its title left out)."""
    out: list[Block] = []
    for b in blocks[1:]:
        out.append(Heading(b.text, b.level + 1) if isinstance(b, Heading) else b)
    return out


@derive_origin.register(FloorLine)
def _(origin: FloorLine, line: InfluenceLine) -> Derivation:
    title, blocks = header(line)
    points = [_doc.num(p).text for p in origin.panel_points]
    girder = derivation(origin.girder)
    scale = max([abs(float(v)) for v in origin.ordinates] + [1e-300])
    q = line.quantity
    rows = []
    for p, v in zip(origin.panel_points, origin.ordinates):
        note = ""
        if q.side is not None and p == q.at:
            note = f"the floor beam loads the {'left' if q.side == 'right' else 'right'} face of the section"
        rows.append((num(p), _value(v, scale), note))
    blocks += [
        _through_deck(points),
        Heading("1. The girder's own line (a load standing on the girder)", 3),
        *_shifted(girder.blocks),
        Heading("2. Ordinates at the floor beams", 3),
        Para(("A load on a floor beam reaches the girder at the floor beam itself: the ordinate there is the "
              "girder's own.",)),
        Table(("floor beam at x", ident("η") + paren(ident("p")), "note"), tuple(rows), "rrl"),
        Heading("3. Influence line through the floor system", 3),
        line_cases(line),
    ]
    return Derivation(title, tuple(blocks), line.expr)


def _sqrt(square: Fraction) -> Math:
    inner = num(square)
    return Math(rf"\sqrt{{{inner.latex}}}", f"√({inner.text})", f"<msqrt>{inner.mathml}</msqrt>")


def _truss_expression(origin: TrussLine, line: InfluenceLine) -> Any:
    """The line as a sympy ``Piecewise``: exact with the member's length as a square root where the force is
    a rational density times an irrational length."""
    if line.is_exact or origin.density is None or origin.length_squared is None:
        return line.expr
    import sympy

    from ilkit._symbols import x

    root = sympy.sqrt(sympy.Rational(origin.length_squared.numerator, origin.length_squared.denominator))
    truss = origin.truss
    points = [sympy.Rational(p.numerator, p.denominator) for p in truss.panel_points]
    values = [sympy.Rational(t.numerator, t.denominator) for t in origin.density]
    length = sympy.Rational(truss.length.numerator, truss.length.denominator)
    args: list[tuple[Any, Any]] = [(sympy.Integer(0), x < points[0])]
    for k in range(len(points) - 1):
        a, b = points[k], points[k + 1]
        poly = values[k] + (values[k + 1] - values[k]) * (x - a) / (b - a)
        args.append((sympy.expand(root * poly), x <= b if k == len(points) - 2 and b == length else x < b))
    args.append((sympy.Integer(0), True))
    return sympy.Piecewise(*args, evaluate=False)


@derive_origin.register(TrussLine)
def _(origin: TrussLine, line: InfluenceLine) -> Derivation:
    title, blocks = header(line)
    truss = origin.truss
    stability = truss.stability
    units = truss.units
    length_unit = f" {units.length}" if units else ""
    supports = ", ".join(f"{kind} at {joint}" for joint, kind in truss.supports.items())
    determinacy = ("statically determinate" if stability.degree == 0
                   else f"statically indeterminate to the degree {stability.degree}")
    blocks += [
        Heading("1. The truss", 3),
        Para((f"{len(truss.joints)} pin joints, {len(truss.members)} members, supports: {supports}; "
              f"{2 * len(truss.joints)} equations of joint equilibrium for {stability.unknowns} member forces and "
              f"reaction components, of rank {stability.rank}: the truss is stable and {determinacy}. The deck "
              f"carries the load to the panel points {', '.join(truss.deck)}; x is measured from the left support "
              f"along the loaded chord{length_unit and ' in' + length_unit}.",)),
    ]
    q = line.quantity
    scale = max([abs(float(v)) for v in origin.ordinates] + [1e-300])
    element = origin.element
    rows: list[tuple[Any, ...]] = []
    if origin.method == "statics":
        method = ("Method of joints, all joints at once: every joint is in equilibrium horizontally and "
                  "vertically. A member a-b in tension N pulls joint a by ")
        law: list[Any] = [
            method, ident("t") + paren(ident("x", "b") + op("-") + ident("x", "a") + op(",") + ident("y", "b")
                                     + op("-") + ident("y", "a")),
            " with the force density ", ident("t") + op("=") + ident("N") + Math("/", "/", "<mo>/</mo>")
            + ident("L"), ", so every coefficient is a difference of coordinates and the equations are solved "
            "in exact rational arithmetic for a unit downward load on each floor beam in turn.",
        ]
        if q.kind == "member_force":
            assert origin.length_squared is not None and origin.density is not None
            law += [" Then ", ident("N") + op("=") + ident("t") + op("·") + ident("L"), ", with ",
                    ident("L") + op("=") + _sqrt(origin.length_squared), f"{length_unit} for {element}."]
            exact_length = line.is_exact
            for joint, x, t, n in zip(truss.deck, truss.panel_points, origin.density, origin.ordinates):
                force = num(n) if exact_length else num(t) + op("·") + _sqrt(origin.length_squared) + op("=") + (
                    value_math(n, scale))
                rows.append((joint, num(x), num(t), force))
            header_row: tuple[Any, ...] = ("unit load at", "x", ident("t"), ident("N"))
        else:
            law.append(f" The vertical reaction at {element} is one of the unknowns.")
            for joint, x, r in zip(truss.deck, truss.panel_points, origin.ordinates):
                rows.append((joint, num(x), num(r)))
            header_row = ("unit load at", "x", ident("R"))
        blocks += [Heading("2. Unit load on each floor beam", 3), Para(tuple(law))]
    else:
        blocks += [
            Heading("2. Unit load on each floor beam", 3),
            Para(("Stiffness method: each member is a bar of stiffness EA/L; the joints' displacements solve ",
                  ident("K") + ident("d") + op("=") + ident("f"),
                  " for a unit downward load on each floor beam in turn, the member force is ",
                  ident("N") + op("=") + ident("EA") + Math("/", "/", "<mo>/</mo>") + ident("L") + op("·")
                  + ident("e"), " with e the member's elongation, and the reactions follow from the equilibrium "
                  "of the supported joints (floats).",)),
        ]
        symbol = ident("N") if q.kind == "member_force" else ident("R")
        for joint, x, v in zip(truss.deck, truss.panel_points, origin.ordinates):
            rows.append((joint, num(x), value_math(v, scale)))
        header_row = ("unit load at", "x", symbol)
    blocks.append(Table(header_row, tuple(rows), "l" + "r" * (len(header_row) - 1)))
    blocks += [
        Heading("3. Through the deck", 3),
        _through_deck([f"{j} (x = {_doc.num(x).text})" for j, x in zip(truss.deck, truss.panel_points)]),
        Heading("4. Influence line", 3),
        line_cases(line),
    ]
    expression = _truss_expression(origin, line)
    if not line.is_exact and expression is not line.expr:
        blocks.append(Para(("Exactly: ", _doc.sympy_math(expression), ".")))
    return Derivation(title, tuple(blocks), expression)
