"""Checks of arguments shared by the core: words from a closed set, flags, whole numbers and lists.

Every check returns the value in the form the caller keeps (a word, a
``bool``, an ``int``, a list) or raises the caller's error class (a subclass
of :class:`ilkit.IlkitError`, :class:`~ilkit.BeamInputError` by default)
whose message names the argument, the value given and what is allowed.
Numbers are read by :func:`ilkit._exact.to_exact` and the readers built on it.
"""

from __future__ import annotations

import math
import numbers
from collections.abc import Iterable, Mapping, Sequence
from typing import Any

import numpy as np

from ilkit.errors import BeamInputError

__all__ = ["choice", "flag", "whole", "listed", "finite"]

Error = Any
"""An :class:`ilkit.errors._InputError` subclass (takes ``field=`` and ``value=``)."""


def choice(
    value: object,
    allowed: Sequence[str],
    *,
    what: str,
    field: str,
    error: Error = BeamInputError,
    optional: bool = False,
) -> Any:
    """``value`` when it is one of the words ``allowed`` (or ``None`` when ``optional``).

    ``what`` starts the message, e.g. ``"shear: side"``.  Only a string
    matches: an array, a list or a boolean never does.
    """
    if (optional and value is None) or (isinstance(value, str) and value in allowed):
        return value
    words = [repr(a) for a in allowed]
    wanted = " or ".join(words) if len(words) <= 2 else "one of " + ", ".join(words[:-1]) + " or " + words[-1]
    if optional:
        wanted += " (or leave it out)"
    raise error(f"{what} must be {wanted}, got {value!r}.", field=field, value=value)


def flag(value: object, *, what: str, field: str, error: Error = BeamInputError) -> bool:
    """``value`` as a ``bool``: ``True`` or ``False`` (a numpy boolean too), nothing else."""
    if isinstance(value, (bool, np.bool_)):
        return bool(value)
    raise error(f"{what}: give True or False, got {value!r}.", field=field, value=value)


def whole(
    value: object,
    *,
    what: str,
    field: str,
    minimum: int,
    maximum: int | None = None,
    error: Error = BeamInputError,
    hint: str = "",
) -> int:
    """``value`` as an ``int`` from ``minimum`` to ``maximum``: any integer type except a boolean."""
    if isinstance(value, numbers.Integral) and not isinstance(value, (bool, np.bool_)):
        out = int(value)
        if out >= minimum and (maximum is None or out <= maximum):
            return out
    bound = f">= {minimum}" if maximum is None else f"from {minimum} to {maximum}"
    raise error(f"{what}: give a whole number {bound}, got {value!r}{hint}.", field=field, value=value)


def listed(
    values: object,
    *,
    wanted: str,
    field: str,
    ordered: bool = True,
    error: Error = BeamInputError,
) -> list[Any]:
    """``values`` as a list.

    Accepts a list, a tuple, a 1-d numpy array or a pandas Series (and, when
    not ``ordered``, any other iterable such as a set).  A string, a mapping,
    a single number or a 0-d array is refused with ``wanted`` (e.g.
    ``"hinges: give a list of positions, e.g. [12.5]"``) and the value given.
    """
    ok = isinstance(values, Iterable) and not isinstance(values, (str, bytes, Mapping))
    ok = ok and getattr(values, "ndim", 1) == 1
    if ok and ordered:
        ok = isinstance(values, Sequence) or hasattr(values, "ndim")  # numpy arrays, pandas Series
    if ok:
        return list(values)  # type: ignore[call-overload]
    raise error(f"{wanted}; got {values!r}.", field=field, value=values)


def finite(value: float, *, what: str, why: str, field: str, error: Error = BeamInputError) -> float:
    """``value`` when it is a finite float; else the error says that ``what`` overflowed and ``why``."""
    if math.isfinite(value):
        return value
    raise error(f"{what} is {value!r}: {why}", field=field, value=value)
