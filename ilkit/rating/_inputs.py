"""The rating's reader of numbers: :func:`ilkit.design._inputs.amount`, refused with
:class:`ilkit.RatingInputError` (a :class:`ilkit.DesignInputError`)."""

from __future__ import annotations

from typing import Any

from ilkit.design._inputs import amount as _amount
from ilkit.errors import DesignInputError, RatingInputError

__all__ = ["amount"]


def amount(value: object, what: str, **limits: Any) -> float:
    """``value`` as a finite float within the limits of :func:`ilkit.design._inputs.amount`."""
    try:
        return _amount(value, what, **limits)
    except RatingInputError:
        raise
    except DesignInputError as err:
        raise RatingInputError(str(err), field=err.field, value=err.value) from None
