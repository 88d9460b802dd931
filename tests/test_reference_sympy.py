"""Exact influence-line ordinates against sympy's beam module.

Reference: ``sympy.physics.continuum_mechanics.beam.Beam`` (sympy >= 1.13, a
general-purpose library from the package registry), solving the statics of
the same beam for a unit point load at interior positions.  sympy's
conventions differ from ilkit's: its moment reactions are clockwise positive,
and its ``shear_force()`` and ``bending_moment()`` have the opposite sign of
ilkit's shear (left resultant upward) and sagging moment, so they are negated
here.  sympy is not used with the load exactly at a beam end, where its
singularity functions give wrong results.  We use its statics only, not its
own influence-line helpers.
"""

from __future__ import annotations

from fractions import Fraction

import pytest
import sympy
from sympy.physics.continuum_mechanics.beam import Beam as SympyBeam

import ilkit


def _sympy_solution(case, load_x):
    sb = SympyBeam(case["length"], 1, 1)
    unknowns = []
    symbols = {}
    for pos, kind in case["supports"].items():
        out = sb.apply_support(pos, kind)
        if kind == "fixed":
            symbols[("R", pos)], symbols[("C", pos)] = out
            unknowns += list(out)
        else:
            symbols[("R", pos)] = out
            unknowns.append(out)
    for h in case.get("hinges", []):
        sb.apply_rotation_hinge(h)
    for h in case.get("shear_releases", []):
        sb.apply_sliding_hinge(h)
    sb.apply_load(-1, load_x, -1)  # unit load, downward (sympy: upward positive)
    sb.solve_for_reaction_loads(*unknowns)
    return sb, symbols


CASES = {
    "simple span": {"length": 12, "supports": {0: "pin", 12: "roller"}, "sections": [Fraction(9, 2)]},
    "two overhangs": {
        "length": 17,
        "supports": {3: "pin", 14: "roller"},
        "sections": [Fraction(3, 2), Fraction(8), Fraction(16)],
    },
    "girder built into the abutment, hinge, pier and cantilever end (rotation hinge)": {
        "length": Fraction("37.2"),
        "supports": {0: "fixed", Fraction("31.2"): "roller"},
        "hinges": [Fraction("9.6")],
        "sections": [Fraction("4.8"), Fraction(15), Fraction("34.2")],
    },
    "three spans, suspended centre span (two rotation hinges)": {
        "length": 65,
        "supports": {0: "pin", 20: "roller", 45: "roller", 65: "roller"},
        "hinges": [25, 40],
        "sections": [Fraction(10), Fraction(22), Fraction(32), Fraction(55)],
    },
    "propped cantilever with a sliding hinge (shear release)": {
        "length": 10,
        "supports": {0: "fixed", 10: "roller"},
        "shear_releases": [6],
        "sections": [Fraction(3), Fraction(8)],
    },
}

LOADS = [Fraction(7, 3), Fraction(23, 2), Fraction(61, 3)]
SYMPY = "sympy.physics.continuum_mechanics.beam.Beam (sympy >= 1.13), statics of a unit point load"


@pytest.mark.parametrize("name", list(CASES))
def test_against_sympy_beam(name, reference):
    case = CASES[name]
    beam = ilkit.Beam(
        case["length"],
        case["supports"],
        hinges=case.get("hinges", []),
        shear_releases=case.get("shear_releases", []),
    )
    assert beam.is_determinate
    L = Fraction(case["length"])
    loads = [x * L / 30 for x in LOADS] + [L * Fraction(11, 13)]
    # one recorded check per quantity: its ordinates for every load position, against sympy's statics
    checks: dict[str, tuple[list, list]] = {}

    def add(label, expected, computed):
        want, got = checks.setdefault(label, ([], []))
        want.append(expected)
        got.append(computed)

    for x in loads:
        xs = sympy.Rational(x.numerator, x.denominator)
        sb, symbols = _sympy_solution(case, xs)
        for (kind, pos), sym in symbols.items():
            expected = sb.reaction_loads[sym]
            if kind == "R":
                add(f"reaction at {pos}", Fraction(str(expected)), beam.reaction(pos).ordinate_exact(x))
            else:  # sympy's moment reaction is clockwise positive, ilkit's counter-clockwise
                add(f"moment reaction at {pos}", -Fraction(str(expected)), beam.moment_reaction(pos).ordinate_exact(x))
        for a in case["sections"]:
            if a == x:
                continue
            v = -sb.shear_force().subs(sb.variable, sympy.Rational(a.numerator, a.denominator))
            m = -sb.bending_moment().subs(sb.variable, sympy.Rational(a.numerator, a.denominator))
            if a not in case.get("shear_releases", []):
                add(f"shear at {a}", Fraction(str(sympy.nsimplify(v))), beam.shear(a).ordinate_exact(x))
            add(f"moment at {a}", Fraction(str(sympy.nsimplify(m))), beam.moment(a).ordinate_exact(x))
    positions = ", ".join(str(x) for x in loads)
    for label, (want, got) in checks.items():
        reference(f"{name}: {label}, unit load at x = {positions} (where not at the section)", expected=want,
                  computed=got, source=SYMPY, clause="reaction_loads, shear_force(), bending_moment(); signs "
                  "converted to ilkit's")
