"""Derivations of the lines of indeterminate beams by the force (flexibility) method.

Writes out a :class:`ilkit.flexibility.ForceMethod` solution: the redundants
and the primary structure; the load terms ``δ_i(x)`` (the primary structure's
deflection or rotation lines at the released restraints, by Maxwell); the
flexibility coefficients ``f_ij`` with their values (and ``1/k`` of elastic
restraints); the compatibility equations and their solution; the quantity as
``η₀(x) + Σ q_j X_j(x)``; a table of ordinates that sets the result beside
the stiffness method's (the line ilkit computes), and the final piecewise
expression.  Exact solutions print rationals, float ones six significant
figures.
"""

from __future__ import annotations

from fractions import Fraction
from typing import TYPE_CHECKING, Any

from ilkit._exact import fmt
from ilkit.flexibility import ForceMethod, Redundant
from ilkit.views._doc import Block, Equation, Heading, Math, Para, Table, ident, op, paren, value_math, word
from ilkit.views.derive import ETA, Derivation, _symbol, derive_origin, header
from ilkit.views.derive_elastic import line_cases
from ilkit.views.tables import beam_facts

if TYPE_CHECKING:  # pragma: no cover
    from ilkit.influence import InfluenceLine

__all__: list[str] = []

_X = ident("x")


def _of_x(symbol: Math) -> Math:
    return symbol + paren(_X)


def _redundant(j: int) -> Math:
    return ident("X", j + 1)


def _delta(i: int) -> Math:
    return ident("δ", i + 1)


def _number(v: Any, scale: float = 1.0) -> Math:
    return value_math(v, scale)


def _sense(r: Redundant) -> str:
    return "upward" if r.kind == "reaction" else "counter-clockwise"


def _against(r: Redundant) -> str:
    return "downward deflection" if r.kind == "reaction" else "clockwise rotation"


def _unit_words(fm: ForceMethod) -> str:
    units = fm.beam.units
    if units is None:
        return ""
    f, length = units.force, units.length
    return (f" Units: {length}/{f} between two forces, rad/{f} between a force and a couple, rad/({f}·{length}) "
            "between two couples.")


def _primary_words(fm: ForceMethod) -> str:
    facts = dict(beam_facts(fm.primary))
    words = f"supports {facts['supports']}"
    if fm.primary.hinges:
        words += f"; hinges at {facts['hinges']}"
    if fm.primary.shear_releases:
        words += f"; shear releases at {facts['shear releases']}"
    return words


def _dot(a: Math, b: Math) -> Math:
    return a + Math("", "·", "<mo>&InvisibleTimes;</mo>") + b


def _sum_math(coefficients: list[Any], symbols: list[Math], scale: float, lead: Math | None = None) -> Math:
    """``lead + c1 s1 + c2 s2 ...`` (signs folded in), exact or six-figure coefficients; zero terms left out."""
    out = lead
    for c, s in zip(coefficients, symbols):
        if not c:
            continue
        exact = isinstance(c, Fraction)
        size = abs(c)
        term = s if exact and size == 1 else _dot(_number(size, scale), s)
        if out is None:
            out = (Math("-", "-", "<mo>-</mo>") + term) if c < 0 else term
        else:
            out = out + op("-" if c < 0 else "+") + term
    return out if out is not None else _number(0)


@derive_origin.register(ForceMethod)
def _(fm: ForceMethod, line: InfluenceLine) -> Derivation:
    q = fm.quantity
    n = len(fm.redundants)
    title, blocks = header(line)
    exact = fm.exact
    own = line.origin is not fm and line.is_exact == exact
    reference = line if own else fm.beam.line(q.kind, q.at, q.side, exact=exact)
    blocks.append(Para((
        f"Force (flexibility) method. The beam is statically indeterminate to degree {fm.beam.degree}: release "
        f"{n} restraint{'s' if n > 1 else ''} to leave a statically determinate primary structure; the forces "
        f"in the released restraints, the redundant{'s' if n > 1 else ''} ",
        _redundant(0) if n == 1 else _redundant(0) + word(", " if n == 2 else " … ") + _redundant(n - 1),
        ", follow for each position x of the unit load from the condition that the released points move as "
        "the restraints let them. The line is then ",
        _symbol(q), " on the primary structure plus the effect of the redundants. ilkit computes the line by the "
        "stiffness method; step 6 sets the two side by side.",
    )))

    # 1. redundants and primary structure
    blocks += [
        Heading("1. Redundants and primary structure", 3),
        Table(
            ("redundant", "restraint released", "positive", "restraint"),
            tuple((_redundant(j), r.words.split(" (spring")[0], _sense(r),
                   "rigid" if r.stiffness is None else f"spring, k = {fmt(r.stiffness)}")
                  for j, r in enumerate(fm.redundants)),
            "llll",
        ),
        Para((f"Primary structure: the beam with these restraints released, the same EI, springs and releases: "
              f"{_primary_words(fm)}. It is statically determinate (degree 0).",)),
    ]

    # 2. load terms
    blocks += [
        Heading("2. Load terms", 3),
        Para((
            _of_x(ident("δ", "i")),
            ": how far the unit load at x moves the primary structure at restraint i, against ",
            ident("X", "i"),
            " (a downward deflection at a released bearing, a clockwise rotation at a released fixity). By "
            "Maxwell's reciprocal theorem it is the deflection (rotation) line of the primary structure at that "
            "point: a cubic between breakpoints, from the elastic analysis of the determinate primary structure "
            "(by hand: virtual work, the integral of the product of the two moment diagrams over EI).",
        )),
        Table(("load term", "is the primary structure's"),
              tuple((_of_x(_delta(i)), f"{_against(r)} at x={fmt(r.at)}") for i, r in enumerate(fm.redundants)),
              "ll"),
    ]

    # 3. flexibility coefficients
    scale = max([1e-300, *(abs(float(v)) for row in fm.flexibility for v in row)])
    header_row = ("", *(_redundant(j) + op("=") + _number(1) for j in range(n)))
    blocks += [
        Heading("3. Flexibility coefficients", 3),
        Para((
            ident("f", "ij"),
            ": the movement at restraint i, in the sense of ",
            ident("X", "i"),
            ", caused by ",
            ident("X", "j") + op("=") + _number(1),
            " on the primary structure: ",
            _of_x(ident("δ", "i")),
            " read at ",
            ident("x", "j"),
            " for a force, its slope there for a couple (a clockwise couple is a downward and an upward force "
            "close together). Maxwell: ",
            ident("f", "ij") + op("=") + ident("f", "ji"),
            "." + _unit_words(fm),
        )),
        Table(header_row,
              tuple((f"restraint {i + 1}", *(_number(v, scale) for v in row)) for i, row in enumerate(fm.flexibility)),
              "l" + "r" * n),
    ]
    if any(r.stiffness is not None for r in fm.redundants):
        blocks += [
            Para(("An elastic restraint gives way by ", ident("X", "i") + Math("/", "/", "<mo>/</mo>")
                  + ident("k", "i"), ", so ", Math("1/", "1/", "<mn>1</mn><mo>/</mo>") + ident("k", "i"),
                  " is added to ", ident("f", "ii"), ":")),
            Table(("restraint", "k", "1/k"),
                  tuple((str(i + 1), fmt(r.stiffness), _number(fm.springs[i], scale))
                        for i, r in enumerate(fm.redundants) if r.stiffness is not None), "rrr"),
        ]

    # 4. compatibility and its solution
    blocks.append(Heading("4. Compatibility", 3))
    blocks.append(Para(("For every restraint the redundants push the released point back by what the unit load "
                        "moved it:",)))
    for i in range(n):
        row = [fm.flexibility[i][j] + (fm.springs[i] if i == j else 0) for j in range(n)]
        blocks.append(Equation(_sum_math(row, [_of_x(_redundant(j)) for j in range(n)], scale)
                               + op("=") + _of_x(_delta(i))))
    inv_scale = max([1e-300, *(abs(float(v)) for row in fm.inverse for v in row)])
    blocks.append(Para(("Solved for the redundants:",)))
    for j in range(n):
        blocks.append(Equation(_of_x(_redundant(j)) + op("=")
                               + _sum_math(list(fm.inverse[j]), [_of_x(_delta(i)) for i in range(n)], inv_scale)))

    # 5. the quantity
    blocks.append(Heading("5. The quantity", 3))
    eta0 = _of_x(ident("η", 0))
    if fm.redundant_index is not None:
        k = fm.redundant_index
        blocks.append(Para((_symbol(q), " is the redundant ", _redundant(k), " itself: ",
                            ETA + op("=") + _of_x(_redundant(k)), ".")))
    else:
        share_scale = max([1e-300, *(abs(float(v)) for v in fm.shares)])
        assert fm.primary_line is not None
        how = ("statics of the determinate primary structure (Müller-Breslau)" if q.kind not in
               ("deflection", "rotation") else "the elastic analysis of the primary structure")
        blocks += [
            Para((f"On the primary structure the {q.words} has the line ", eta0, f", by {how}:")),
            line_cases(fm.primary_line, eta0),
            Para(("and ", ident("X", "j") + op("=") + _number(1), " gives it the value ", ident("q", "j"),
                  " (the line's ordinate at the restraint, or its slope for a couple, with the sign of a force "
                  "acting up or a couple acting counter-clockwise):")),
            Table(("redundant", ident("q", "j")),
                  tuple((_redundant(j), _number(v, share_scale)) for j, v in enumerate(fm.shares)), "lr"),
            Equation(ETA + op("=")
                     + _sum_math(list(fm.shares), [_of_x(_redundant(j)) for j in range(n)], share_scale, eta0)),
        ]
    weight_scale = max([1e-300, *(abs(float(v)) for v in fm.weights)])
    blocks += [
        Para(("With the solution of step 4:",)),
        Equation(ETA + op("=") + _sum_math(list(fm.weights), [_of_x(_delta(i)) for i in range(n)], weight_scale,
                                           None if fm.primary_line is None else eta0)),
    ]

    # 6. ordinates
    blocks += [Heading("6. Ordinates", 3), *_ordinates(fm, reference)]

    # 7. the line
    blocks += [Heading("7. Influence line", 3), line_cases(fm.line)]
    if not exact:
        blocks.append(Para(("Coefficients rounded to six significant figures for display; ask for the exact line "
                            "with exact=True.",)))
    return Derivation(title, tuple(blocks), fm.line.expr)


def _ordinates(fm: ForceMethod, reference: InfluenceLine) -> list[Block]:
    """Values at the breakpoints (both faces at a jump): load terms, redundants, η₀, η and the stiffness line."""
    result = fm.line
    n = len(fm.redundants)
    rows: list[tuple[Any, ...]] = []
    worst = 0.0
    size = max(1e-300, abs(result.maximum.value), abs(result.minimum.value))
    exact_knots = result.exact_breakpoints if fm.exact else None
    for k, (x, left, right) in enumerate(result.knot_values()):
        at = exact_knots[k] if exact_knots is not None else x
        faces = [("right", right)] if x < result.length else [("left", left)]
        if 0 < x < result.length and abs(left - right) > 1e-12 * size:
            faces = [("left", left), ("right", right)]
        for side, _ in faces:
            deltas = [_at(line, at, side, fm.exact) for line in fm.load_lines]
            reds = [sum((a * d for a, d in zip(row, deltas)), Fraction(0) if fm.exact else 0.0) for row in fm.inverse]
            base = _at(fm.primary_line, at, side, fm.exact) if fm.primary_line is not None else None
            mine = _at(result, at, side, fm.exact)
            theirs = _at(reference, at, side, fm.exact)
            worst = max(worst, abs(float(mine) - float(theirs)))
            rows.append((_number(at), "" if len(faces) == 1 else side, *(_number(d, size) for d in deltas),
                         *(_number(r, size) for r in reds),
                         *(() if base is None else (_number(base, size),)), _number(mine, size),
                         _number(theirs, size)))
    header = ("x", "face", *(_of_x(_delta(i)) for i in range(n)), *(_of_x(_redundant(j)) for j in range(n)),
              *(() if fm.primary_line is None else (_of_x(ident("η", 0)),)), ETA,
              word("stiffness method"))
    if fm.exact:
        check = ("The exact ordinates equal those of the stiffness method's exact line (and so does every piece "
                 "of the line in step 7).") if worst == 0 else f"Largest difference: {worst:.3g}."
    elif size <= 1e-300:
        check = f"Largest difference from the stiffness method: {worst:.2g} (the line is zero)."
    else:
        check = (f"Largest difference from the stiffness method: {worst:.2g} (the largest ordinate is "
                 f"{size:.4g}): rounding.")
    return [
        Para(("At the breakpoints (both faces where the line jumps), the load terms, the redundants and the "
              "ordinate, beside the ordinate of the line computed by the stiffness method:",)),
        Table(header, tuple(rows), "rl" + "r" * (len(header) - 2)),
        Para((check,)),
    ]


def _at(line: InfluenceLine, x: Any, side: str, exact: bool) -> Any:
    """One-sided ordinate at ``x`` (exact for exact lines; the end values at the ends of the beam)."""
    if exact:
        return line.ordinate_exact(x, side)  # type: ignore[arg-type]
    return float(line.left(x)) if side == "left" else float(line.right(x) if x < line.length else line(x))
