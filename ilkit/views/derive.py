"""Derivations: how an influence line was obtained, written out step by step.

``derivation(line)`` returns a :class:`Derivation` that renders as Markdown
with LaTeX (a notebook shows it typeset), as plain text (``str(d)``) and as
HTML with MathML (for calculation sheets).  Every number in it is an exact
value taken from the analysis that produced the line (``line.origin``).

What is written depends on the origin:

* :class:`ilkit.kinematics.Mechanism` (determinate beams, Müller-Breslau):
  the release inserted, the rigid parts of the mechanism it leaves, the
  conditions solved (the imposed unit displacement among them), the movement
  of each part, the ordinates at the breakpoints by small-angle geometry and
  the final piecewise expression.
* lines of statically indeterminate beams (springs included): by default
  the force (flexibility) method, :mod:`ilkit.views.derive_force` (primary
  structure, redundants, flexibility coefficients, the resulting ordinates
  beside the stiffness method's, the expression);
* :class:`ilkit.stiffness.UnitShape` with ``method="stiffness"``, and the
  deflection and rotation lines of determinate beams: the stiffness method,
  :mod:`ilkit.views.derive_elastic`.

Other analyses add their own writer with ``derive_origin.register(TheirOriginType)``:
a function ``(origin, line) -> Derivation``.  A line whose origin has no writer
raises :class:`ilkit.NoDerivationError`; there is no generic fallback.
"""

from __future__ import annotations

from collections.abc import Sequence
from dataclasses import dataclass
from fractions import Fraction
from functools import singledispatch
from typing import TYPE_CHECKING, Any, Literal

from ilkit._exact import fmt
from ilkit.errors import BeamInputError, NoDerivationError
from ilkit.kinematics import Mechanism, PartMotion
from ilkit.views import _doc
from ilkit.views._doc import Block, Cases, Heading, Math, Para, Table, ident, num, op, paren, word

if TYPE_CHECKING:  # pragma: no cover
    import sympy

    from ilkit.influence import InfluenceLine
    from ilkit.quantity import Quantity

__all__ = ["Derivation", "derivation", "derive_origin", "header", "SIGN_CONVENTIONS", "quantity_title", "METHODS"]

SIGN_CONVENTIONS: dict[str, str] = {
    "reaction": "positive upward",
    "moment_reaction": "positive counter-clockwise",
    "shear": "positive when the forces on the part left of the section add up to an upward resultant",
    "moment": "positive when sagging",
    "hinge_shear": "positive when the forces on the part left of the hinge add up to an upward resultant",
    "deflection": "positive downward",
    "rotation": "positive clockwise",
    "member_force": "positive in tension, negative in compression",
}
"""The sign convention of each quantity kind, in words (see :mod:`ilkit.model`)."""


def quantity_title(quantity: Quantity, length_unit: str = "") -> str:
    """Words such as ``"bending moment M at x = 5 m (left side)"`` (``side`` as in the API); a truss
    quantity names its member or joint (``"member force N in U2-U3"``, ``"vertical reaction R at L0"``)."""
    if quantity.element is not None:
        return f"{quantity.words} {quantity.label}"
    unit = f" {length_unit}" if length_unit else ""
    side = f" ({quantity.side} side)" if quantity.side else ""
    return f"{quantity.words} {quantity.symbol} at x = {fmt(quantity.at)}{unit}{side}"


def _symbol(quantity: Quantity) -> Math:
    name, _, sub = quantity.symbol.partition("_")
    return ident(name, sub or None)


ETA = Math(r"\eta(x)", "η(x)",
           '<mrow><mi>η</mi><mo stretchy="false">(</mo><mi>x</mi><mo stretchy="false">)</mo></mrow>')


@dataclass(frozen=True)
class Derivation:
    """A derivation of one influence line, renderable as Markdown, text and HTML.

    ``expression`` is the final expression as the derivation assembles it
    (a sympy ``Piecewise`` in :data:`ilkit.x`, exact); it equals ``line.expr``.
    """

    title: str
    blocks: tuple[Block, ...]
    expression: Any

    def to_markdown(self) -> str:
        """Markdown with LaTeX formulas (renders in a notebook and on most code hosts)."""
        return _doc.to_markdown(self.blocks)

    def to_text(self) -> str:
        """Plain text; the final expression's pieces are in sympy's syntax."""
        return _doc.to_text(self.blocks)

    def to_html(self, heading_offset: int = 0) -> str:
        """An HTML fragment with MathML formulas (no scripts needed)."""
        return _doc.to_html(self.blocks, heading_offset)

    def __str__(self) -> str:
        return self.to_text()

    def __repr__(self) -> str:
        return f"<Derivation {self.title!r}>"

    def _repr_markdown_(self) -> str:
        return self.to_markdown()


Method = Literal["auto", "stiffness", "flexibility"]
METHODS: tuple[str, ...] = ("auto", "stiffness", "flexibility")


def derivation(line: InfluenceLine, method: Method = "auto") -> Derivation:
    """How ``line`` was obtained, written out step by step.

    ``method``:

    * ``"auto"`` (default): for a line of a statically indeterminate beam,
      the force (flexibility) method; otherwise the analysis that produced the
      line (``line.origin``): the Müller-Breslau mechanism of a determinate
      beam's force line, the stiffness method for deflection and rotation
      lines.  The force method is the default for indeterminate beams because
      it is the form in which such lines are checked by hand (primary
      structure, redundants, flexibility coefficients), and because it is a
      second, independent solution: it sets its ordinates beside those of the
      stiffness method that computed the line.
    * ``"flexibility"``: the force method (indeterminate beams only);
    * ``"stiffness"``: the stiffness method, as ilkit computed the line
      (elements, nodal displacements, Hermite shapes).

    Raises :class:`ilkit.NoDerivationError` when the line cannot be written
    out that way (a line built by hand, or the force method asked of a
    determinate beam).
    """
    from ilkit.influence import InfluenceLine
    from ilkit.stiffness import UnitShape
    from ilkit.views._args import expect

    expect(line, InfluenceLine, what="derivation", hint="give an influence line, e.g. beam.moment(12)")
    if not isinstance(method, str) or method not in METHODS:
        raise BeamInputError(
            f"derivation: method must be one of {', '.join(repr(m) for m in METHODS)}, got {method!r}.",
            field="method",
            value=method,
        )
    origin = line.origin
    beam = getattr(origin, "beam", None)
    if method == "auto":
        indeterminate = isinstance(origin, UnitShape) and beam is not None and beam.degree > 0
        if not indeterminate:
            return derive_origin(origin, line)
        method = "flexibility"
    if method == "flexibility":
        from ilkit.flexibility import ForceMethod, force_method

        if isinstance(origin, ForceMethod) or beam is None:  # without a beam: derive_origin says why not
            return derive_origin(origin, line)
        # a float line that had to be solved exactly (points very close together) is checked exactly too
        exact = line.is_exact or bool(getattr(origin, "exact_because", ""))
        return derive_origin(force_method(beam, line.quantity, exact=exact), line)
    if not isinstance(origin, UnitShape):
        made_by = "nothing (origin=None)" if origin is None else type(origin).__name__
        raise NoDerivationError(
            f"{line.quantity.label}: method='stiffness' writes out lines of the stiffness method, and this line "
            f"was produced by {made_by}; use derivation(line) for its own derivation."
        )
    return derive_origin(origin, line)


@singledispatch
def derive_origin(origin: object, line: InfluenceLine) -> Derivation:
    """Write the derivation of ``line`` from its ``origin``; extend with ``.register``."""
    made_by = "nothing (origin=None)" if origin is None else type(origin).__name__
    raise NoDerivationError(
        f"{line.quantity.label}: no derivation can be written for this line: it was produced by {made_by}, "
        "and derivations are written for lines of determinate beams (Müller-Breslau mechanism). "
        "Get the line from the beam (beam.reaction(x), beam.shear(x), beam.moment(x) ...) of a "
        "determinate beam, or use ilkit.views.table(line) for its ordinates."
    )


# ------------------------------------------------------------------ Müller-Breslau
def _w(k: int) -> Math:
    return ident("w", k + 1)


def _r(k: int) -> Math:
    return ident("r", k + 1)


def _column_symbol(col: int) -> Math:
    return _w(col // 2) if col % 2 == 0 else _r(col // 2)


def _x_minus(a: Fraction) -> Math:
    """``(x − a)`` or ``x`` when a = 0."""
    if a == 0:
        return ident("x")
    return paren(ident("x") + (op("-") if a > 0 else op("+")) + num(abs(a)))


def _motion(part: PartMotion) -> Math:
    """``w + r (x − a)`` with the part's exact numbers."""
    return _doc.lincomb([(part.w, None), (part.r, _x_minus(part.start))])


def _geometry(k: int, part: PartMotion, x: Fraction) -> Math:
    """Small-angle geometry of part ``k`` at ``x``: how its displacement there follows."""
    if part.r == 0:
        return word("does not move") if part.w == 0 else word("translates: ") + _w(k)
    pivot = part.pivot
    assert pivot is not None
    distance = paren(num(x) + (op("-") if pivot >= 0 else op("+")) + num(abs(pivot)))
    return _r(k) + paren(ident("x") + op("-") + ident("p", k + 1)) + op("=") + num(part.r) + op("·") + distance


def _polynomial(part: PartMotion) -> sympy.Expr:
    import sympy

    from ilkit._symbols import x

    def rat(v: Fraction) -> sympy.Rational:
        return sympy.Rational(v.numerator, v.denominator)

    return sympy.expand(rat(part.w) + rat(part.r) * (x - rat(part.start)))


def _interval(a: Fraction, b: Fraction, last: bool) -> Math:
    return num(a) + op("≤") + ident("x") + op("≤" if last else "<") + num(b)


def _pieces(parts: Sequence[PartMotion]) -> list[tuple[Fraction, Fraction, Any]]:
    """``(start, end, polynomial)`` per run of parts with the same law."""
    out: list[tuple[Fraction, Fraction, Any]] = []
    for part in parts:
        poly = _polynomial(part)
        if out and out[-1][2] == poly and out[-1][1] == part.start:
            out[-1] = (out[-1][0], part.end, poly)
        else:
            out.append((part.start, part.end, poly))
    return out


def _final(parts: Sequence[PartMotion], length: Fraction) -> tuple[Cases, Any]:
    import sympy

    from ilkit._symbols import x

    pieces = _pieces(parts)
    rows = []
    args: list[tuple[Any, Any]] = [(sympy.Integer(0), x < 0)]
    for i, (a, b, poly) in enumerate(pieces):
        last = i == len(pieces) - 1
        rows.append((_doc.sympy_math(poly), _interval(a, b, last)))
        end = sympy.Rational(b.numerator, b.denominator)
        args.append((poly, x <= end if last else x < end))
    args.append((sympy.Integer(0), True))
    off = ident("x") + op("<") + num(0) + word(" or ") + ident("x") + Math(">", " > ", "<mo>&gt;</mo>") + num(length)
    rows.append((num(0), off + word(" (load off the beam)")))
    return Cases(ETA, tuple(rows)), sympy.Piecewise(*args, evaluate=False)


def _breakpoint_rows(
    mech: Mechanism, knots: Sequence[Fraction], parts: Sequence[PartMotion]
) -> list[tuple[Math | str, ...]]:
    index = {id(p): k for k, p in enumerate(mech.parts)}
    rows: list[tuple[Math | str, ...]] = []
    for xk in knots:
        left = next((p for p in parts if p.start < xk <= p.end), None)
        right = next((p for p in parts if p.start <= xk < p.end), None)
        sides: list[tuple[str, PartMotion]] = []
        if left is right or left is None or right is None or left.at(xk) == right.at(xk):
            only = right if right is not None else left
            assert only is not None
            sides.append(("", only))
        else:
            sides += [("left", left), ("right", right)]
        for side, part in sides:
            k = index[id(part)]
            rows.append((num(xk), side, str(k + 1), _geometry(k, part, xk), num(part.at(xk))))
    return rows


def header(line: InfluenceLine) -> tuple[str, list[Block]]:
    """The title of a line's derivation and its opening paragraph (quantity, sign convention, units)."""
    q, units = line.quantity, line.units
    title = f"Influence line of the {quantity_title(q, units.length if units else '')}"
    unit_words = f"; positions x in {units.length}, ordinates in {line.unit}" if units else ""
    sign = Para((
        f"Sign convention: the {q.words} ",
        _symbol(q),
        f" is {SIGN_CONVENTIONS[q.kind]}; the unit load acts downward at x{unit_words}.",
    ))
    return title, [Heading(title, 2), sign]


@derive_origin.register(Mechanism)
def _(origin: Mechanism, line: InfluenceLine) -> Derivation:
    q = origin.quantity
    parts = [p for p in origin.parts if p.end > p.start]
    length = parts[-1].end
    knots = line.exact_breakpoints or ()
    title, blocks = header(line)
    blocks.append(
        Para(
            (
                "Müller-Breslau principle: remove the restraint that carries ",
                _symbol(q),
                ", impose a unit displacement in its positive sense and let the beam move. "
                "For a unit load at x, virtual work on the released beam gives ",
                _symbol(q) + op("·") + num(1) + op("-") + num(1) + op("·") + ident("u") + paren(ident("x"))
                + op("=") + num(0),
                ", so the ordinate is the upward displacement: ",
                ETA + op("=") + ident("u") + paren(ident("x")),
                ".",
            )
        )
    )
    if not origin.release:
        why = origin.imposed.removeprefix("none: ")
        blocks += [
            Heading("1. Release", 3),
            Para((f"Nothing to release: {why} at x = {fmt(q.at)}. ", _symbol(q), " is zero for every load position.")),
            Heading("2. Influence line", 3),
        ]
        cases, expression = _final(parts, length)
        blocks.append(cases)
        return Derivation(title, tuple(blocks), expression)

    n = len(origin.parts)
    cuts = sorted({p.start for p in origin.parts[1:]})
    blocks += [
        Heading("1. Release", 3),
        Para((f"Release: {origin.release}. Imposed: {origin.imposed}.",)),
        Heading("2. The mechanism", 3),
        Para(
            (
                f"The released beam is {n} rigid part{'s' if n > 1 else ''}, divided at x = "
                f"{', '.join(fmt(c) for c in cuts) or '(none)'}. Part i moves as a rigid body, ",
                ident("u", "i") + paren(ident("x")) + op("=") + ident("w", "i") + op("+") + ident("r", "i")
                + paren(ident("x") + op("-") + ident("a", "i")),
                ", where ",
                ident("a", "i"),
                " is its left end, ",
                ident("w", "i"),
                " the upward movement of that end and ",
                ident("r", "i"),
                " its counter-clockwise rotation (small angles). Removing one restraint from a "
                "determinate beam leaves one degree of freedom, which the imposed unit displacement fixes.",
            )
        ),
        Table(
            ("part", "from x", "to x"),
            tuple((str(k + 1), num(p.start), num(p.end)) for k, p in enumerate(origin.parts)),
            "rrr",
        ),
        Heading("3. Conditions", 3),
        Para(("Each support and each connection between parts gives its conditions; the imposed displacement "
              "is the one with 1 on the right-hand side:",)),
        Table(
            ("condition", "equation"),
            tuple(
                (
                    c.text + (" (imposed)" if c.rhs else ""),
                    _doc.lincomb([(v, _column_symbol(col)) for col, v in c.row.items()]) + op("=") + num(c.rhs),
                )
                for c in origin.constraints
            ),
            "ll",
        ),
        Heading("4. Movement of each part", 3),
        Para((f"Solving the {len(origin.constraints)} equations exactly gives each part's movement; ",
              ident("p", "i"), " is the point about which the part turns (where its displacement is zero):")),
        Table(
            ("part", ident("w", "i"), ident("r", "i"), ident("u", "i") + paren(ident("x")), ident("p", "i")),
            tuple(
                (
                    str(k + 1),
                    num(p.w),
                    num(p.r),
                    _motion(p),
                    num(p.pivot) if p.pivot is not None else ("does not move" if not p.w else "translates"),
                )
                for k, p in enumerate(origin.parts)
            ),
            "rrrll",
        ),
        Heading("5. Ordinates at the breakpoints", 3),
        Para(
            (
                "By small-angle geometry a part turned by ",
                ident("r", "i"),
                " about ",
                ident("p", "i"),
                " moves up by ",
                ident("r", "i") + paren(ident("x") + op("-") + ident("p", "i")),
                " (a part that only translates moves by ",
                ident("w", "i"),
                "). Where the line jumps both faces are given.",
            )
        ),
        Table(("x", "side", "part", "small-angle geometry", ETA), tuple(_breakpoint_rows(origin, knots, parts)),
              "rlrlr"),
        Heading("6. Influence line", 3),
    ]
    cases, expression = _final(parts, length)
    blocks.append(cases)
    return Derivation(title, tuple(blocks), expression)


# the writers for lines of the stiffness method and of the force method register themselves with derive_origin
from ilkit.views import derive_elastic, derive_force, derive_panels  # noqa: E402, F401
