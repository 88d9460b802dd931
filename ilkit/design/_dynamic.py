"""The dynamic effect inside moving-load results, as a :class:`~ilkit.design.Factor` for their record."""

from __future__ import annotations

from collections.abc import Iterable

from ilkit.design.factors import Factor
from ilkit.loads.combination import DynamicEffect

__all__ = ["dynamic_factor"]


def dynamic_factor(effects: Iterable[DynamicEffect | None], *, source: str = "", from_memory: bool = False
                   ) -> Factor | None:
    """The dynamic effect that the values of the governing cases contain, as one factor on named parts.

    An allowance IM becomes the multiplier ``1 + IM`` (symbol ``IM``), a factor Φ itself (symbol ``Φ``),
    on the parts it applies to; it is already in the effect values, so it is listed, not multiplied
    (:attr:`ilkit.design.Applied.product` leaves factors on parts out).  Dynamic amplification included
    in the load values is recorded with the value 1 and a note.  ``None`` when no case contains a dynamic
    effect.  Where the cases differ (another allowance in another case) the largest multiplier is
    recorded and the note lists them all.
    """
    found = [e for e in dict.fromkeys(effects) if e is not None and e.kind != "none"]
    if not found:
        return None
    added = [e for e in found if e.kind in ("allowance", "factor")]
    parts = tuple(dict.fromkeys(p for e in added for p in e.on))
    distinct = {(e.kind, e.value) for e in found}  # the same allowance on other parts needs no note
    note = "; ".join(dict.fromkeys(e.words for e in found)) if len(distinct) > 1 else ""
    if not added:
        return Factor("dynamic allowance", 1.0, "dynamic", source, from_memory,
                      note="dynamic amplification included in the load values", parts=("all",))
    top = max(added, key=lambda e: e.multiplier(e.on[0]))
    symbol = "IM" if top.kind == "allowance" else "Φ"
    return Factor("dynamic allowance", top.multiplier(top.on[0]), symbol, source, from_memory, note=note, parts=parts)
