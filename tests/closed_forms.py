"""Influence lines of two equal continuous spans, written as exact cubic pieces.

Source: the handbook closed form for two equal continuous spans L, L with
constant EI (e.g. the beam tables of steel design manuals): for a unit load
at x in span 1, the interior reaction is

    R_B = x (3 L^2 - x^2) / (2 L^3),

derived by compatibility (the deflection at B of the simple span 2L under
the unit load, divided by its deflection under a unit load at B).  Statics
then gives R_C = (x - R_B L) / (2 L) (moments about A), R_A = 1 - R_B - R_C,
and span 2 follows by symmetry.  ``test_closed_forms_agree_with_sympy_beam``
checks these against ``sympy.physics.continuum_mechanics.beam``.

These stand in for the continuous-beam solver until it is on main.
"""

from __future__ import annotations

from fractions import Fraction

import sympy as sp

from ilkit import InfluenceLine, Quantity

X = sp.Symbol("x", real=True)


def _reactions(L: sp.Rational) -> dict[str, tuple[sp.Expr, sp.Expr]]:
    rb1 = X * (3 * L**2 - X**2) / (2 * L**3)
    rc1 = (X - rb1 * L) / (2 * L)
    ra1 = 1 - rb1 - rc1
    mirror = {X: 2 * L - X}
    return {
        "A": (ra1, rc1.subs(mirror)),
        "B": (rb1, rb1.subs(mirror)),
        "C": (rc1, ra1.subs(mirror)),
    }


def _line(quantity: Quantity, knots: list[sp.Rational], exprs: list[sp.Expr], units: str | None) -> InfluenceLine:
    from ilkit.units import unit_system

    coefficients = []
    t = sp.Symbol("t")
    for start, expr in zip(knots[:-1], exprs):
        poly = sp.Poly(sp.expand(expr.subs(X, t + start)), t)
        cs = [Fraction(int(c.p), int(c.q)) for c in reversed(poly.all_coeffs())]
        cs += [Fraction(0)] * (4 - len(cs))
        coefficients.append(tuple(cs))
    return InfluenceLine(
        quantity=quantity,
        knots=tuple(Fraction(int(k.p), int(k.q)) for k in knots),
        coefficients=tuple(coefficients),
        units=unit_system(units),
    )


def reaction(L: int | Fraction, support: str, units: str | None = "kip-ft") -> InfluenceLine:
    """Reaction at A (x=0), B (x=L) or C (x=2L) of two equal continuous spans."""
    Ls = sp.Rational(str(L))
    at = {"A": 0, "B": Ls, "C": 2 * Ls}[support]
    e1, e2 = _reactions(Ls)[support]
    return _line(Quantity("reaction", Fraction(str(at))), [sp.Integer(0), Ls, 2 * Ls], [e1, e2], units)


def _section_line(kind: str, L: int | Fraction, a: int | Fraction, units: str | None) -> InfluenceLine:
    """Moment or shear at section a from statics of the part left of it.

    M(a) = R_A a + R_B (a - L) [if the section is beyond B] - (a - x) [if the load is left of the section];
    V(a) = R_A + R_B [if beyond B] - 1 [if the load is left of the section].
    """
    Ls, As = sp.Rational(str(L)), sp.Rational(str(a))
    r = _reactions(Ls)
    knots = sorted({sp.Integer(0), Ls, 2 * Ls, As})
    exprs = []
    for end in knots[1:]:
        span = 0 if end <= Ls else 1
        ra, rb = r["A"][span], (r["B"][span] if As > Ls else 0)
        load_left = end <= As
        if kind == "moment":
            exprs.append(ra * As + rb * (As - Ls) - (As - X if load_left else 0))
        else:
            exprs.append(ra + rb - (1 if load_left else 0))
    return _line(Quantity(kind, Fraction(str(a))), knots, exprs, units)


def moment(L: int | Fraction, a: int | Fraction, units: str | None = "kip-ft") -> InfluenceLine:
    """Bending moment (sagging positive) at section a of two equal continuous spans."""
    return _section_line("moment", L, a, units)


def shear(L: int | Fraction, a: int | Fraction, units: str | None = "kip-ft") -> InfluenceLine:
    """Shear at section a (0 < a < 2L, a != L) of two equal continuous spans (ilkit sign convention)."""
    return _section_line("shear", L, a, units)
