"""Factors as data: what a design result contains, each factor applied exactly once.

A :class:`Factor` is one number that multiplies an effect (a dynamic
allowance, a multiple presence factor, a girder's distribution factor, a
load factor ...) with where it comes from: ``source`` (document and clause;
empty when the user gave it) and ``from_memory`` (recalled rather than read
in a copy of the standard).  Some factors contain others: an AASHTO
approximate distribution factor includes multiple presence
(``includes=("multiple presence",)``).

An :class:`Applied` is the ordered record of the factors a result contains.
:meth:`Applied.then` adds one and refuses a factor of a kind already
contained, directly or through ``includes``, with
:class:`~ilkit.FactorAppliedTwiceError`: a multiple presence factor on top
of an AASHTO formula factor, or a second dynamic allowance, is an error, not
a silently larger number.

Factors are dimensionless and positive (the sign of an effect comes from the
influence line, never from a factor).
"""

from __future__ import annotations

import math
from collections.abc import Iterator
from dataclasses import dataclass
from typing import Literal, get_args

from ilkit._check import choice, flag, listed
from ilkit.design._inputs import amount, text
from ilkit.errors import DesignInputError, FactorAppliedTwiceError

__all__ = ["FactorKind", "FACTOR_KINDS", "Factor", "Applied", "FactorAppliedTwiceError"]

FactorKind = Literal["dynamic allowance", "multiple presence", "distribution", "load factor", "lanes", "adjustment",
                     "resistance", "condition", "system"]
"""The kinds of factor a result can contain; each at most once (``"resistance"``, ``"condition"`` and
``"system"`` are the factors φ, φc and φs of a capacity in a load rating)."""

FACTOR_KINDS: tuple[str, ...] = get_args(FactorKind)
"""Every :data:`FactorKind`, in the order a live load usually receives them."""


def _kind(value: object, what: str) -> str:
    return choice(value, FACTOR_KINDS, what=what, field="kind", error=DesignInputError)  # type: ignore[no-any-return]


def _number(value: float) -> str:
    """A factor for reading: at least two decimals, at most four significant figures (1.20, 0.6234, 12.5)."""
    out = f"{value:.4g}"
    if "e" in out:
        return out
    decimals = len(out.partition(".")[2])
    return f"{value:.{max(decimals, 2)}f}" if abs(value) < 100 else out


@dataclass(frozen=True)
class Factor:
    """One factor on an effect, with its source.

    Parameters
    ----------
    kind:
        One of :data:`FactorKind`: ``"dynamic allowance"``, ``"multiple
        presence"``, ``"distribution"``, ``"load factor"``, ``"lanes"``,
        ``"adjustment"``; for a capacity ``"resistance"`` (φ), ``"condition"``
        (φc), ``"system"`` (φs).
    value:
        The multiplier (dimensionless, at least 0): 1.33 for a dynamic
        allowance IM of 33 %, 1.20 for m, 0.62 for g, 1.75 for γLL.
    symbol:
        Its symbol as the standard writes it (``"IM"``, ``"m"``, ``"g"``,
        ``"γLL"``, ``"γDC,max"``, ``"ψ1"``).
    source:
        Document and clause or table; empty when the user gave the value.
    from_memory:
        True when the value was recalled rather than read in a copy of the
        standard: check it against the licensed current edition.
    includes:
        Kinds of factor this one already contains (an AASHTO approximate
        distribution factor includes ``"multiple presence"``).
    note:
        Any further remark (how it was found, a range checked).
    parts:
        Names of the load parts the factor applies to (a dynamic allowance on
        the design truck and tandem, not on the lane); empty when it
        multiplies the whole effect.
    """

    kind: FactorKind
    value: float
    symbol: str
    source: str = ""
    from_memory: bool = False
    includes: tuple[FactorKind, ...] = ()
    note: str = ""
    parts: tuple[str, ...] = ()

    def __post_init__(self) -> None:
        kind = _kind(self.kind, "Factor: kind")
        symbol = text(self.symbol, f"Factor ({kind}): symbol")
        value = float(self.value) if isinstance(self.value, float) and math.isfinite(self.value) else None
        if value is None or value < 0:
            value = amount(
                self.value, f"Factor {symbol}: value", minimum=0.0,
                fix=" (a factor multiplies an effect and is never negative: the sign of the effect comes from the "
                    "influence line; for a relieving load give the minimum factor, e.g. γDC,min = 0.90)",
            )
        includes = tuple(
            _kind(k, f"Factor {symbol}: includes")
            for k in listed((self.includes,) if isinstance(self.includes, str) else self.includes,
                            wanted=f"Factor {symbol}: includes: give a list of factor kinds, e.g. "
                                   "['multiple presence']", field="includes", error=DesignInputError)
        )
        if kind in includes:
            raise DesignInputError(
                f"Factor {symbol}: a {kind} factor cannot include its own kind; list only the other kinds it "
                "contains.", field="includes", value=self.includes)
        parts = listed((self.parts,) if isinstance(self.parts, str) else self.parts,
                       wanted=f"Factor {symbol}: parts: give the names of the load parts, e.g. ['design truck']",
                       field="parts", error=DesignInputError)
        object.__setattr__(self, "kind", kind)
        object.__setattr__(self, "value", value)
        object.__setattr__(self, "symbol", symbol)
        object.__setattr__(self, "source", text(self.source, f"Factor {symbol}: source", empty=True))
        object.__setattr__(self, "from_memory",
                           flag(self.from_memory, what=f"Factor {symbol}: from_memory", field="from_memory",
                                error=DesignInputError))
        object.__setattr__(self, "includes", includes)
        object.__setattr__(self, "note", text(self.note, f"Factor {symbol}: note", empty=True))
        object.__setattr__(self, "parts", tuple(text(p, f"Factor {symbol}: parts") for p in parts))

    @property
    def kinds(self) -> frozenset[str]:
        """Its own kind and the kinds it includes."""
        return frozenset((self.kind, *self.includes))

    def describe(self) -> str:
        """The factor in short words: ``"IM 33 % (design truck, design tandem)"`` (an allowance IM as its
        percentage), ``"Φ 1.12 (LM71)"``, ``"m 1.20"``, ``"g 0.62"``."""
        if self.kind == "dynamic allowance" and self.symbol == "IM" and self.value >= 1:
            words = f"{self.symbol} {100 * (self.value - 1):.4g} %"
        else:
            words = f"{self.symbol} {_number(self.value)}"
        return f"{words} ({', '.join(self.parts)})" if self.parts else words

    @property
    def status(self) -> str:
        """Where the value comes from, for a calculation sheet: ``"from memory"``, ``"read"`` or ``"given"``."""
        if not self.source:
            return "given"
        return "from memory" if self.from_memory else "read"


@dataclass(frozen=True)
class Applied:
    """The factors a result contains, in the order applied; each kind at most once.

    Build it with :meth:`then` (or :meth:`of`); ``Applied()`` contains
    nothing.  ``product`` is the multiplier on the whole effect (factors on
    named parts only, such as a dynamic allowance on the truck, are already in
    the effect values and are listed, not multiplied).
    """

    factors: tuple[Factor, ...] = ()

    def __post_init__(self) -> None:
        items = listed(self.factors, wanted="Applied: give a list of Factor objects", field="factors",
                       error=DesignInputError)
        out = Applied._unchecked(())
        for f in items:
            out = out.then(f)
        object.__setattr__(self, "factors", out.factors)

    @staticmethod
    def _unchecked(factors: tuple[Factor, ...]) -> Applied:
        out = object.__new__(Applied)
        object.__setattr__(out, "factors", factors)
        return out

    @classmethod
    def of(cls, *factors: Factor) -> Applied:
        """The record of ``factors`` applied in this order (refused like :meth:`then`)."""
        return cls(factors)

    def then(self, factor: Factor) -> Applied:
        """A new record with ``factor`` applied after the others.

        Raises :class:`~ilkit.FactorAppliedTwiceError` when the record already
        contains a factor of ``factor.kind`` or of any kind ``factor``
        includes (directly, or through the ``includes`` of a factor applied
        before).
        """
        if not isinstance(factor, Factor):
            raise DesignInputError(f"Applied.then: give a Factor, got {type(factor).__name__} {factor!r}.",
                                   field="factor", value=factor)
        twice = sorted(factor.kinds & self.kinds)
        if twice:
            kind = twice[0]
            holder = next(f for f in self.factors if kind in f.kinds)
            if kind != factor.kind:  # the new factor includes a kind the result already has
                message = (
                    f"{factor.describe()} includes {kind}, which the result already contains ({holder.describe()}). "
                    f"Apply each factor once: apply {factor.symbol} to the effect without {holder.symbol}, or use a "
                    f"{factor.kind} factor that does not include {kind}."
                )
            else:
                via = "" if holder.kind == kind else f" (included in {holder.symbol}, the {holder.kind} factor)"
                other = (", or use a factor that does not include it (e.g. the lever rule's share, to which "
                         f"{kind} is then applied once)" if holder.kind != kind else "")
                message = (
                    f"{factor.describe()} would apply {kind} a second time: the result already contains "
                    f"{holder.describe()}{via}. Apply each factor once: leave {factor.symbol} out{other}."
                )
            raise FactorAppliedTwiceError(message, kind=kind)
        return Applied._unchecked((*self.factors, factor))

    @property
    def kinds(self) -> frozenset[str]:
        """Every kind of factor contained, directly or through ``includes``."""
        return frozenset(k for f in self.factors for k in f.kinds)

    def contains(self, kind: FactorKind) -> bool:
        """True when a factor of ``kind`` is contained, directly or through another's ``includes``."""
        return _kind(kind, "contains: kind") in self.kinds

    def get(self, kind: FactorKind) -> Factor | None:
        """The factor of ``kind`` applied directly, or ``None``."""
        _kind(kind, "get: kind")
        return next((f for f in self.factors if f.kind == kind), None)

    @property
    def product(self) -> float:
        """The multiplier on the whole effect: the product of the factors without ``parts`` (dimensionless,
        positive or zero: factors carry no sign)."""
        return math.prod(f.value for f in self.factors if not f.parts)

    def describe(self) -> str:
        """``"IM 33 % (design truck) × m 1.20 × g 0.620 × γLL 1.75"``; ``"no factors"`` when empty."""
        return " × ".join(f.describe() for f in self.factors) or "no factors"

    def __iter__(self) -> Iterator[Factor]:
        return iter(self.factors)

    def __len__(self) -> int:
        return len(self.factors)

    def __repr__(self) -> str:
        return f"Applied({self.describe()})"

