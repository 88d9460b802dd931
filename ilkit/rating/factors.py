"""Rating constants as data: condition, system and live-load factors, the dead-load factors, posting.

Every factor is a :class:`~ilkit.design.Factor` with its ``source`` and ``from_memory`` status, so that a
rating sheet lists it and a user can give another value.  All values below are recalled from the AASHTO
Manual for Bridge Evaluation (LRFR, Section 6A), not read in a copy: check them against the licensed
current edition and the owner's rules.

* condition factor φc (Table 6A.4.2.3-1): good or satisfactory 1.00, fair 0.95, poor 0.85;
* system factor φs (Table 6A.4.2.4-1): :data:`SYSTEM_FACTORS`;
* φc·φs is taken not less than 0.85 (6A.4.2.1);
* design load rating (Table 6A.4.2.2-1): γLL 1.75 at the inventory level, 1.35 at the operating level;
* legal loads (Table 6A.4.4.2.3a-1): γLL 1.45 for ADTT ≥ 5000, 1.30 for ADTT ≤ 1000, straight-line between;
  1.45 when the ADTT is not known (earlier editions gave 1.80, 1.65 and 1.40: give ``live_factor=`` where
  the owner keeps them);
* emergency vehicles: γLL 1.30;
* permits (Table 6A.4.5.4.2a-1): routine (annual, unlimited crossings, with other traffic, two or more lanes
  loaded) 1.30 for ADTT ≥ 5000, 1.20 at 1000, 1.10 at 100 or less; special, single trip, escorted with no
  other vehicle on the bridge 1.15; special, single trip with other traffic 1.50, 1.40, 1.35; special,
  multiple trips (fewer than 100 crossings) with other traffic 1.85, 1.75, 1.55; special permits take the
  one-lane distribution factor with the multiple presence factor taken out (6A.4.5.4.2b);
* Service II of steel girders (Table 6A.4.2.2-1, 6A.6.4.2.2): γLL 1.30 (design inventory, legal), 1.00
  (design operating, permits), dead loads unfactored, the limits given by the engineer;
* dead loads (Table 6A.4.2.2-1): γDC 1.25, γDW 1.50 (1.25 where the wearing surface thickness is
  measured); where a category's effect relieves the live load's, its minimum factor of AASHTO LRFD Table
  3.4.1-2 is used (0.90, 0.65) as in design (common practice);
* posting (6A.8.3): for 0.3 < RF < 1.0 the safe posting load is W / 0.7 × (RF − 0.3), W the weight of the
  rating vehicle in tons; RF ≤ 0.3: consider closing the bridge.
"""

from __future__ import annotations

from collections.abc import Mapping
from types import MappingProxyType
from typing import Literal, get_args

from ilkit._check import choice
from ilkit._exact import fmt
from ilkit.design.combinations import LimitState
from ilkit.design.factors import Factor
from ilkit.design.lanes import AASHTO_LRFD
from ilkit.errors import RatingInputError
from ilkit.rating._inputs import amount
from ilkit.rating.vehicles import MBE

__all__ = [
    "CONDITION_FACTORS",
    "SYSTEM_FACTORS",
    "PHI_CS_MINIMUM",
    "condition_factor",
    "system_factor",
    "design_live_factor",
    "legal_live_factor",
    "emergency_live_factor",
    "permit_live_factor",
    "PermitKind",
    "rating_limit_state",
    "service_live_factor",
    "posting_load",
    "Posting",
]

CONDITION_FACTORS: Mapping[str, float] = MappingProxyType({"good": 1.00, "satisfactory": 1.00, "fair": 0.95,
                                                           "poor": 0.85})
"""Condition factor φc by the member's structural condition (MBE Table 6A.4.2.3-1, from memory)."""

SYSTEM_FACTORS: Mapping[str, float] = MappingProxyType({
    "welded members in two-girder, truss or arch bridges": 0.85,
    "riveted members in two-girder, truss or arch bridges": 0.90,
    "multiple eyebar members in truss bridges": 0.90,
    "three-girder bridges with girder spacing 6 ft or less": 0.85,
    "four-girder bridges with girder spacing 4 ft or less": 0.95,
    "all other girder bridges and slab bridges": 1.00,
    "floor beams spaced more than 12 ft with non-continuous stringers": 0.85,
    "redundant stringer subsystems between floor beams": 1.00,
})
"""System factor φs for flexure and axial effects by the kind of structure (MBE Table 6A.4.2.4-1, from
memory)."""

PHI_CS_MINIMUM = 0.85
"""The lower bound of the product φc·φs (MBE 6A.4.2.1, from memory)."""

_T_CONDITION = f"{MBE}, Table 6A.4.2.3-1"
_T_SYSTEM = f"{MBE}, Table 6A.4.2.4-1"
_T_LOADS = f"{MBE}, Table 6A.4.2.2-1"
_T_LEGAL = f"{MBE}, Table 6A.4.4.2.3a-1"
_T_PERMIT = f"{MBE}, Table 6A.4.5.4.2a-1"


def condition_factor(condition: str | float | Factor = "good") -> Factor:
    """The condition factor φc: a word of :data:`CONDITION_FACTORS` (``"good"``, ``"satisfactory"``,
    ``"fair"``, ``"poor"``), a number (the owner's value), or a :class:`~ilkit.design.Factor` of kind
    ``"condition"``.  Dimensionless."""
    return _factor(condition, "condition", "φc", CONDITION_FACTORS, _T_CONDITION)


def system_factor(system: str | float | Factor = "all other girder bridges and slab bridges") -> Factor:
    """The system factor φs: a description of :data:`SYSTEM_FACTORS`, a number, or a
    :class:`~ilkit.design.Factor` of kind ``"system"``.  Dimensionless."""
    return _factor(system, "system", "φs", SYSTEM_FACTORS, _T_SYSTEM)


def _factor(value: object, kind: str, symbol: str, table: Mapping[str, float], source: str) -> Factor:
    if isinstance(value, Factor):
        if value.kind != kind:
            raise RatingInputError(f"{symbol}: give a factor of kind {kind!r}, got one of kind {value.kind!r}.",
                                   field=kind, value=value)
        return value
    if isinstance(value, str):
        if value not in table:
            raise RatingInputError(
                f"{symbol}: unknown {kind} {value!r}; choose one of {', '.join(map(repr, table))}, or give the "
                "number.", field=kind, value=value)
        return Factor(kind, table[value], symbol, source=source, from_memory=True, note=value)  # type: ignore[arg-type]
    v = amount(value, f"{symbol} ({kind} factor)", minimum=0.0, strict=True, maximum=1.0,
               fix=" (a capacity factor lies between 0 and 1)")
    return Factor(kind, v, symbol, note="given by the user")  # type: ignore[arg-type]


DesignLevel = Literal["inventory", "operating"]


def design_live_factor(level: DesignLevel) -> Factor:
    """γLL of the design load rating (HL-93): 1.75 at the ``"inventory"`` level, 1.35 at the ``"operating"``
    level (MBE Table 6A.4.2.2-1, from memory).  Dimensionless."""
    choice(level, get_args(DesignLevel), what="design_live_factor: level", field="level", error=RatingInputError)
    value = 1.75 if level == "inventory" else 1.35
    return Factor("load factor", value, "γLL", source=_T_LOADS, from_memory=True, note=f"design load, {level}")


def _adtt(adtt: object) -> float | None:
    if adtt is None:
        return None
    return amount(adtt, "adtt (average daily truck traffic, one direction)", minimum=0.0)


def _between(adtt: float, points: tuple[tuple[float, float], ...]) -> float:
    """Straight-line interpolation in a table of (ADTT, γ), flat beyond its ends."""
    if adtt <= points[0][0]:
        return points[0][1]
    for (a0, g0), (a1, g1) in zip(points[:-1], points[1:]):
        if adtt <= a1:
            return g0 + (g1 - g0) * (adtt - a0) / (a1 - a0)
    return points[-1][1]


def legal_live_factor(adtt: float | None = None) -> Factor:
    """γLL for the legal loads from the ADTT (trucks a day in one direction): 1.30 up to 1000, 1.45 from 5000,
    straight-line between; 1.45 when ``adtt`` is ``None`` (not known) (MBE Table 6A.4.4.2.3a-1, from memory;
    earlier editions gave 1.40, 1.65, 1.80).  Dimensionless."""
    a = _adtt(adtt)
    value = 1.45 if a is None else _between(a, ((1000.0, 1.30), (5000.0, 1.45)))
    note = "ADTT not known" if a is None else f"ADTT {fmt(round(a, 6))}"
    return Factor("load factor", round(value, 6), "γLL", source=_T_LEGAL, from_memory=True,
                  note=f"legal loads, {note}")


def emergency_live_factor() -> Factor:
    """γLL for the emergency vehicles: 1.30 (MBE 6A.4.4.2.3, from memory).  Dimensionless."""
    return Factor("load factor", 1.30, "γLL", source=f"{MBE}, 6A.4.4.2.3", from_memory=True,
                  note="emergency vehicles")


PermitKind = Literal["routine", "special single trip escorted", "special single trip", "special multiple trips"]
"""The kinds of permit of MBE Table 6A.4.5.4.2a-1: routine (annual, unlimited crossings, with other traffic),
special single trip escorted with no other vehicle on the bridge, special single trip with other traffic,
special multiple trips (fewer than 100 crossings) with other traffic."""

_PERMIT_POINTS: Mapping[str, tuple[tuple[float, float], ...]] = MappingProxyType({
    "routine": ((100.0, 1.10), (1000.0, 1.20), (5000.0, 1.30)),
    "special single trip escorted": ((0.0, 1.15),),
    "special single trip": ((100.0, 1.35), (1000.0, 1.40), (5000.0, 1.50)),
    "special multiple trips": ((100.0, 1.55), (1000.0, 1.75), (5000.0, 1.85)),
})


def permit_live_factor(kind: PermitKind, adtt: float | None = None) -> Factor:
    """γLL for a permit vehicle (MBE Table 6A.4.5.4.2a-1, from memory): see :data:`PermitKind`; straight-line
    between the tabulated ADTT of 100, 1000 and 5000, flat beyond them; the largest value when ``adtt`` is
    ``None``.  Dimensionless."""
    choice(kind, get_args(PermitKind), what="permit: kind", field="kind", error=RatingInputError)
    a = _adtt(adtt)
    points = _PERMIT_POINTS[kind]
    value = points[-1][1] if a is None else _between(a, points)
    note = f"{kind} permit, " + ("ADTT not known" if a is None else f"ADTT {fmt(round(a, 6))}")
    return Factor("load factor", round(value, 6), "γLL", source=_T_PERMIT, from_memory=True, note=note)


def service_live_factor(level: str) -> Factor:
    """γLL of the Service II check of steel girders (MBE Table 6A.4.2.2-1, from memory): 1.30 for the design load
    at the inventory level, 1.00 at the operating level, 1.30 for legal loads (and, here, emergency vehicles),
    1.00 for permits.  ``level``: the level of a :class:`~ilkit.rating.RatingLoad`.  Dimensionless."""
    values = {"design inventory": 1.30, "design operating": 1.00, "legal": 1.30, "emergency": 1.30, "permit": 1.00}
    choice(level, tuple(values), what="service_live_factor: level", field="level", error=RatingInputError)
    return Factor("load factor", values[level], "γLL", source=_T_LOADS, from_memory=True,
                  note=f"Service II, {level}")


def rating_limit_state(name: str, live: Factor, *, wearing_surface_measured: bool = False,
                       permanent: Mapping[str, object] | None = None) -> LimitState:
    """The load combination of one rating: ``live`` (γLL) on the live load and the dead-load factors
    (γmax, γmin): DC 1.25/0.90, DW 1.50/0.65 (1.25/0.65 where the wearing surface thickness was measured)
    (MBE Table 6A.4.2.2-1 and AASHTO LRFD Table 3.4.1-2, from memory); ``permanent`` gives other or more
    categories (``{"DC": (1.25, 0.90), ...}``).  Dimensionless."""
    dw = 1.25 if wearing_surface_measured else 1.50
    factors: dict[str, object] = {"DC": (1.25, 0.90), "DW": (dw, 0.65)}
    if permanent is not None:
        if not isinstance(permanent, Mapping):
            raise RatingInputError("dead_factors: give a mapping of load categories to (γmax, γmin), e.g. "
                                   "{'DC': (1.25, 0.90)}.", field="dead_factors", value=permanent)
        factors.update(permanent)
    return LimitState(name, factors, live.value, source=f"{_T_LOADS}; {AASHTO_LRFD}, Table 3.4.1-2",
                      from_memory=True, notes=live.note)


class Posting(tuple):  # type: ignore[type-arg]
    """``(load, words)``: the safe posting load in tons (``None`` where no posting follows) and what to do."""

    __slots__ = ()

    @property
    def load(self) -> float | None:
        """The safe posting load in tons (the vehicle's weight unit), or ``None``."""
        return self[0]  # type: ignore[no-any-return]

    @property
    def words(self) -> str:
        """What the rating factor calls for, in words."""
        return self[1]  # type: ignore[no-any-return]


def posting_load(rf: float, weight: float) -> Posting:
    """The safe posting load of a legal vehicle of ``weight`` (tons) with rating factor ``rf`` (MBE 6A.8.3,
    from memory): none needed for RF ≥ 1; W / 0.7 × (RF − 0.3) tons for 0.3 < RF < 1; for RF ≤ 0.3 none (the
    bridge should be considered for closing)."""
    r = float(rf)
    w = amount(weight, "posting_load: weight (tons)", minimum=0.0, strict=True)
    if r >= 1.0:
        return Posting((None, "no posting needed (RF ≥ 1)"))
    if r <= 0.3:
        return Posting((None, "RF ≤ 0.3: consider closing the bridge to this vehicle"))
    load = w / 0.7 * (r - 0.3)
    return Posting((load, f"post for {load:.1f} tons (W/0.7 × (RF − 0.3), MBE 6A.8.3)"))
