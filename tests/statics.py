"""An independent statics solver for tests.

Equilibrium of the whole beam and the release conditions (no moment at a
hinge, no shear at a shear release) for a unit downward load at a given x,
solved with sympy's own linear algebra.  It shares no code with the kinematic
(Müller-Breslau) solver of ilkit: it works with forces, not displacements.

Conventions match ilkit: reactions up, fixed-end moments counter-clockwise,
shear positive when the forces left of the section add up to an upward
resultant, sagging moment positive.
"""

from __future__ import annotations

from fractions import Fraction

import sympy


def _left_forces(beam, reactions, load_x, a, include_at_a):
    """Forces and couples acting on the part left of section ``a``."""
    forces = []  # (position, upward force)
    couples = []  # counter-clockwise couples
    for s in beam.supports:
        if s.at < a or (include_at_a and s.at == a):
            forces.append((s.at, reactions[("R", s.at)]))
            if s.kind == "fixed":
                couples.append(reactions[("C", s.at)])
    if load_x < a or (include_at_a and load_x == a):
        forces.append((load_x, -1))
    return forces, couples


def shear_left(beam, reactions, load_x, a, include_at_a=False):
    forces, _ = _left_forces(beam, reactions, load_x, a, include_at_a)
    return sum((f for _, f in forces), sympy.Integer(0))


def moment_left(beam, reactions, load_x, a, include_at_a=False):
    forces, couples = _left_forces(beam, reactions, load_x, a, include_at_a)
    return sum((f * (a - p) for p, f in forces), sympy.Integer(0)) - sum(couples, sympy.Integer(0))


def solve_reactions(beam, load_x):
    """Reactions of a determinate beam under a unit downward load at ``load_x`` (exact)."""
    load_x = sympy.Rational(Fraction(load_x).numerator, Fraction(load_x).denominator)
    symbols = {}
    for s in beam.supports:
        symbols[("R", s.at)] = sympy.Symbol(f"R_{s.at}")
        if s.kind == "fixed":
            symbols[("C", s.at)] = sympy.Symbol(f"C_{s.at}")
    L = beam.length
    equations = [
        # vertical equilibrium and moments about the right end of the whole beam
        shear_left(beam, symbols, load_x, L, include_at_a=True),
        moment_left(beam, symbols, load_x, L, include_at_a=True),
    ]
    for h in beam.hinges:
        equations.append(moment_left(beam, symbols, load_x, h))
    for h in beam.shear_releases:
        equations.append(shear_left(beam, symbols, load_x, h))
    unknowns = list(symbols.values())
    A, b = sympy.linear_eq_to_matrix(equations, unknowns)
    if A.shape[0] != A.shape[1] or A.det() == 0:
        raise ValueError("not a stable determinate beam")
    solution = A.LUsolve(b)
    return {key: solution[i] for i, key in enumerate(symbols)}
