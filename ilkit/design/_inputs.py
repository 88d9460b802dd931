"""Readers of the design layer's arguments: numbers and texts, refused with :class:`ilkit.DesignInputError`.

Numbers are read like every number of ilkit (:func:`ilkit._exact.to_exact`: ints, floats by their decimal
text, fractions, decimals, decimal strings; no booleans, NaN or arrays).
"""

from __future__ import annotations

from ilkit._exact import fmt, to_exact
from ilkit.errors import DesignInputError

__all__ = ["amount", "text"]


def amount(
    value: object,
    what: str,
    *,
    minimum: float | None = 0.0,
    strict: bool = False,
    maximum: float | None = None,
    fix: str = "",
) -> float:
    """``value`` as a finite float within ``minimum`` .. ``maximum`` (``minimum`` excluded when ``strict``).

    ``what`` names the argument in the message; ``fix`` is added to a message about a bound.
    """
    out = float(to_exact(value, field=what, error=DesignInputError, units="the design input's units"))
    low = minimum is not None and (out < minimum or (strict and out == minimum))
    if low or (maximum is not None and out > maximum):
        bound = (
            f"{'greater than' if strict else 'at least'} {fmt(minimum)}" if low else f"at most {fmt(maximum)}"
        )
        raise DesignInputError(f"{what}: must be {bound}, got {value!r}{fix}.", field=what, value=value)
    return out


def text(value: object, what: str, *, empty: bool = False) -> str:
    """``value`` when it is a string (non-empty unless ``empty``)."""
    if isinstance(value, str) and (empty or value.strip()):
        return value
    raise DesignInputError(
        f"{what}: give a {'' if empty else 'non-empty '}text, got {value!r}.", field=what, value=value
    )
