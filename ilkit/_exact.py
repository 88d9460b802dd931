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

import numpy as np

from ilkit.errors import BeamInputError

Row = dict[int, Fraction]


def to_exact(
    value: object, *, field: str, error: type[BeamInputError] = BeamInputError, units: str = "the beam's units"
) -> Fraction:
    """Return ``value`` as an exact :class:`Fraction`.

    Accepts ints, :class:`Fraction`, :class:`Decimal`, decimal or ratio strings
    (``"12.5"``, ``"3/4"``), floats (by their decimal text), sympy rationals and
    numpy scalars (0-d arrays too).  Refuses booleans, complex numbers,
    arrays, NaN, infinities and numbers beyond the range of floats (every
    result is evaluated in float arithmetic), with ``error`` (a
    :class:`BeamInputError` unless the caller says otherwise) naming
    ``field``.  ``units`` says, for a pint quantity given where a plain number
    is wanted, which units the number is taken in.
    """
    exact = _read_exact(value, field, error, units)
    try:
        as_float = float(exact)
    except OverflowError:
        as_float = math.inf
    if math.isinf(as_float) or (exact and not as_float):
        size = "large" if math.isinf(as_float) else "small"
        raise error(
            f"{field}: the value given ({fmt_precise(exact)}) is too {size} for float arithmetic (magnitudes "
            "from about 1e-300 to 1e300 work); check the value, or give it in other units.",
            field=field,
            value=value,
        )
    return exact


def _read_exact(value: object, field: str, error: type[BeamInputError], units: str) -> Fraction:
    if isinstance(value, (bool, np.bool_)):
        raise error(
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
            raise _not_finite(field, value, error)
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
                raise _not_finite(field, value, error) from None
            raise error(
                f"{field}: cannot read {value!r} as a number; write it like 12, '12.5' or '25/2'.",
                field=field,
                value=value,
            ) from None
    if isinstance(value, numbers.Rational):  # sympy Rational, other rationals
        return Fraction(int(value.numerator), int(value.denominator))
    if is_quantity(value):
        raise error(
            f"{field}: got the quantity {value!r}, but this value takes a plain number; give it in "
            f"{units} (value.to(...).magnitude).",
            field=field,
            value=value,
        )
    if getattr(value, "ndim", 0) != 0:
        raise error(
            f"{field}: got {type(value).__name__} {value!r}; give one number, not an array or a list.",
            field=field,
            value=value,
        )
    complex_type = isinstance(value, numbers.Complex) and not isinstance(value, numbers.Real)
    if not complex_type and (isinstance(value, numbers.Real) or hasattr(value, "__float__")):
        if getattr(getattr(value, "dtype", None), "kind", "f") not in "fiu":  # a 0-d array of text, objects ...
            return _read_exact(value.item(), field, error, units)  # type: ignore[attr-defined]
        try:
            as_float = float(value)  # type: ignore[arg-type]
        except (TypeError, ValueError):
            as_float = None
        if as_float is None:
            raise error(f"{field}: {value!r} is not a number.", field=field, value=value)
        if not math.isfinite(as_float):
            raise _not_finite(field, value, error)
        return Fraction(repr(as_float))
    raise error(
        f"{field}: expected a number, got {type(value).__name__} {value!r}.",
        field=field,
        value=value,
    )


def is_quantity(value: object) -> bool:
    """True for a pint quantity (recognised by its ``magnitude`` and ``unit_items``, without importing pint)."""
    return hasattr(value, "magnitude") and hasattr(value, "unit_items")


def _not_finite(field: str, value: object, error: type[BeamInputError] = BeamInputError) -> BeamInputError:
    return error(
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


def fmt_precise(value: Fraction | float) -> str:
    """Text for a number in a message that compares it with another: every digit a float keeps
    (``20.0000000001``, not ``20``), integers without a point; ``about 1e+400`` beyond the floats."""
    if isinstance(value, Fraction) and value.denominator == 1 and abs(value) < 10**15:
        return str(value.numerator)
    try:
        as_float = float(value)
    except OverflowError:
        as_float = math.inf
    if isinstance(value, Fraction) and (math.isinf(as_float) or (value and not as_float)):
        return f"about 1e{len(str(abs(value.numerator))) - len(str(value.denominator)):+d}"
    return str(int(as_float)) if as_float.is_integer() and abs(as_float) < 1e15 else repr(as_float)


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
