"""Exact numbers and exact sparse linear algebra over the rationals.

Inputs given as ints, fractions or decimal strings stay exact; floats are taken
by their shortest decimal text (``12.5`` becomes ``25/2``, ``0.1`` becomes
``1/10``).  The solver works on sparse rows of :class:`fractions.Fraction`; the
kinematic systems of a beam are banded, so elimination stays cheap.
"""

from __future__ import annotations

import math
import numbers
from decimal import Decimal, InvalidOperation
from fractions import Fraction

from ilkit.errors import BeamInputError

Row = dict[int, Fraction]


def to_exact(value: object, *, field: str) -> Fraction:
    """Return ``value`` as an exact :class:`Fraction`.

    Accepts ints, :class:`Fraction`, :class:`Decimal`, decimal or ratio strings
    (``"12.5"``, ``"3/4"``), floats (by their decimal text), sympy rationals and
    numpy scalars.  Raises :class:`BeamInputError` naming ``field`` otherwise.
    """
    if isinstance(value, bool):
        raise BeamInputError(
            f"{field}: got the boolean {value!r}; give a number such as 12 or '12.5'.",
            field=field,
            value=value,
        )
    if isinstance(value, Fraction):
        return value
    if isinstance(value, numbers.Integral):
        return Fraction(int(value))
    if isinstance(value, Decimal):
        if not value.is_finite():
            raise _not_finite(field, value)
        return Fraction(value)
    if isinstance(value, str):
        text = value.strip().replace("_", "")
        try:
            return Fraction(text)
        except (ValueError, ZeroDivisionError):
            try:
                dec = Decimal(text)
            except InvalidOperation:
                dec = None
            if dec is not None and not dec.is_finite():
                raise _not_finite(field, value) from None
            raise BeamInputError(
                f"{field}: cannot read {value!r} as a number; write it like 12, '12.5' or '25/2'.",
                field=field,
                value=value,
            ) from None
    if isinstance(value, numbers.Rational):  # sympy Rational, other rationals
        return Fraction(int(value.numerator), int(value.denominator))
    if isinstance(value, numbers.Real) or hasattr(value, "__float__"):
        if is_quantity(value):
            raise BeamInputError(
                f"{field}: got the quantity {value!r}, but this value takes a plain number; give it in "
                "the beam's units (value.to(...).magnitude).",
                field=field,
                value=value,
            )
        try:
            as_float = float(value)  # type: ignore[arg-type]
        except (TypeError, ValueError):
            as_float = None
        if as_float is None:
            raise BeamInputError(
                f"{field}: {value!r} is not a number.", field=field, value=value
            )
        if not math.isfinite(as_float):
            raise _not_finite(field, value)
        return Fraction(repr(as_float))
    raise BeamInputError(
        f"{field}: expected a number, got {type(value).__name__} {value!r}.",
        field=field,
        value=value,
    )


def is_quantity(value: object) -> bool:
    """True for a pint quantity (recognised by its ``magnitude`` and ``unit_items``, without importing pint)."""
    return hasattr(value, "magnitude") and hasattr(value, "unit_items")


def _not_finite(field: str, value: object) -> BeamInputError:
    return BeamInputError(
        f"{field}: {value!r} is not a finite number; give a finite value.",
        field=field,
        value=value,
    )


def fmt(value: Fraction | float) -> str:
    """Short text for a number: integers without a point, others as decimals."""
    if isinstance(value, Fraction):
        if value.denominator == 1:
            return str(value.numerator)
        as_float = float(value)
        text = f"{as_float:.6g}"
        return text
    if float(value).is_integer() and abs(value) < 1e15:
        return str(int(value))
    return f"{value:.6g}"


class SingularSystemError(ArithmeticError):
    """The exact system has no unique solution (internal; callers translate it)."""


def eliminate(rows: list[Row], ncols: int) -> tuple[list[Row], list[int]]:
    """Reduce sparse rows to reduced row echelon form, exactly.

    Returns the nonzero reduced rows and their pivot columns.  Columns are
    eliminated left to right, so banded systems keep their band.
    """
    work = [dict(r) for r in rows if r]
    pivots: list[int] = []
    reduced: list[Row] = []
    for col in range(ncols):
        pivot_index = next((i for i, r in enumerate(work) if r.get(col)), None)
        if pivot_index is None:
            continue
        prow = work.pop(pivot_index)
        inv = 1 / prow[col]
        prow = {c: v * inv for c, v in prow.items() if v}
        for r in work:
            _subtract(r, prow, col)
        for r in reduced:
            _subtract(r, prow, col)
        reduced.append(prow)
        pivots.append(col)
        work = [r for r in work if r]
    return reduced, pivots


def _subtract(row: Row, pivot_row: Row, col: int) -> None:
    """Eliminate ``col`` from ``row`` with the normalised ``pivot_row`` (in place)."""
    factor = row.get(col)
    if not factor:
        return
    for c, v in pivot_row.items():
        nv = row.get(c, 0) - factor * v
        if nv:
            row[c] = nv
        else:
            row.pop(c, None)


def nullspace(rows: list[Row], ncols: int) -> tuple[int, list[list[Fraction]]]:
    """Rank of the rows and a basis of their null space (exact)."""
    reduced, pivots = eliminate(rows, ncols)
    free = [c for c in range(ncols) if c not in set(pivots)]
    basis: list[list[Fraction]] = []
    for f in free:
        vec = [Fraction(0)] * ncols
        vec[f] = Fraction(1)
        for r, p in zip(reduced, pivots):
            vec[p] = -r.get(f, Fraction(0))
        basis.append(vec)
    return len(pivots), basis


def solve(rows: list[Row], rhs: list[Fraction], ncols: int) -> list[Fraction]:
    """Solve a square, nonsingular sparse system exactly.

    The right-hand side rides along as column ``ncols``.  Raises
    :class:`SingularSystemError` if the solution is not unique or the system
    is inconsistent.
    """
    augmented = []
    for r, b in zip(rows, rhs):
        row = dict(r)
        if b:
            row[ncols] = Fraction(b)
        augmented.append(row)
    reduced, pivots = eliminate(augmented, ncols + 1)
    if ncols in pivots or len(pivots) != ncols:
        raise SingularSystemError("system is singular or inconsistent")
    solution = [Fraction(0)] * ncols
    for r, p in zip(reduced, pivots):
        solution[p] = r.get(ncols, Fraction(0))
    return solution
