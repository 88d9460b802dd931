"""Limit states as data: load factors and combinations with their clauses and from-memory status.

A :class:`LimitState` holds the factors of one load combination: for each
permanent load category its maximum and minimum factor (γmax, γmin), the
factor on the live load, optional factors on the live load's parts (the ψ
of EN 1990 differ for the tandem system and the uniform load), the dynamic
allowance the combination calls for, and whether multiple presence applies.
When a combination is evaluated the permanent factor is chosen per sign of
each category's total effect, so that every combination gives its extreme:
for the largest value γmax where the category's effect is positive and γmin
where it is negative, and the reverse for the smallest.

Published sets (each value from memory unless marked otherwise: check them
against the licensed current edition):

* :data:`AASHTO_LIMIT_STATES`: AASHTO LRFD Strength I and II, Service I, II
  and III, Fatigue I and II (Tables 3.4.1-1 and 3.4.1-2);
* :data:`EN1990_LIMIT_STATES`: EN 1990 Annex A2 road bridges: ULS
  fundamental (6.10, Table A2.4(B)), SLS characteristic, frequent and
  quasi-permanent (Table A2.6) with the ψ factors of traffic group gr1a
  (Table A2.1).

Users define their own with :class:`LimitState`; :func:`limit_states` reads
names, objects and the set names ``"AASHTO"`` and ``"EN 1990"``.
"""

from __future__ import annotations

from collections.abc import Mapping
from dataclasses import dataclass, field
from types import MappingProxyType
from typing import Any

from ilkit._check import flag, listed
from ilkit._display import RichDisplay
from ilkit._exact import fmt
from ilkit.design._inputs import amount, text
from ilkit.design.factors import Factor
from ilkit.design.lanes import AASHTO_LRFD
from ilkit.errors import DesignInputError

__all__ = [
    "LimitState",
    "AASHTO_LIMIT_STATES",
    "EN1990_LIMIT_STATES",
    "LIMIT_STATES",
    "limit_states",
    "EN_1990",
    "LIVE_PARTS",
]

EN_1990 = "EN 1990 (Eurocode, basis of structural design), Annex A2"
"""The document the EN 1990 limit states cite (with its National Annex)."""

LIVE_PARTS = ("axles", "uniform")
"""The parts of a live load a limit state may factor apart: its axle trains (the tandem system of EN 1991-2
LM1, a design truck) and its uniform loads (a lane load, the UDL of LM1)."""

ANY = "*"
"""The key of :attr:`LimitState.permanent` that gives the factors of every other category."""


def _pair(value: object, what: str) -> tuple[float, float]:
    items = listed(value, wanted=f"{what}: give (γmax, γmin), e.g. (1.25, 0.90)", field="permanent",
                   error=DesignInputError) if not isinstance(value, (int, float)) else [value, value]
    if len(items) != 2:
        raise DesignInputError(f"{what}: give two factors (γmax, γmin), got {value!r}.", field="permanent",
                               value=value)
    fix = (" (a load factor is never negative: the sign of an effect comes from the influence line; a "
           "relieving load takes the smaller factor γmin, chosen by sign)")
    hi = amount(items[0], f"{what}: γmax", minimum=0.0, fix=fix)
    lo = amount(items[1], f"{what}: γmin", minimum=0.0, fix=fix)
    if lo > hi:
        raise DesignInputError(
            f"{what}: γmin = {fmt(lo)} is larger than γmax = {fmt(hi)}; give (γmax, γmin) in that order.",
            field="permanent", value=value)
    return hi, lo


@dataclass(frozen=True, init=False, repr=False)
class LimitState(RichDisplay):
    """One load combination of a limit state.

    Parameters
    ----------
    name:
        Its name (``"Strength I"``).
    permanent:
        Load category -> (γmax, γmin), or one factor for both; categories are
        those of the permanent loads (``"DC"``, ``"DW"``, ``"G"``,
        ``"settlement"`` ...); the key ``"*"`` gives every other category.
        A category not listed is an error when the combination is used.
    live:
        The factor on the live load (γLL, or γQ × ψ), at least 0.
    live_parts:
        Further factors on parts of the live load, by kind
        (:data:`LIVE_PARTS`): ``{"axles": 0.75, "uniform": 0.40}`` for the
        frequent combination of EN 1991-2 LM1.
    dynamic_allowance:
        The dynamic allowance the combination calls for (0.33 for AASHTO
        strength and service, 0.15 for fatigue); a live load whose model
        contains another is refused.  ``None``: any.
    multiple_presence:
        False where the multiple presence factor must not be applied (AASHTO
        fatigue, 3.6.1.1.2).
    source, from_memory, notes:
        Where the factors come from, whether they were recalled rather than
        read, and any remark.
    """

    name: str
    permanent: Mapping[str, tuple[float, float]]
    live: float
    source: str = ""
    from_memory: bool = False
    notes: str = ""
    dynamic_allowance: float | None = None
    live_parts: Mapping[str, float] = field(default_factory=dict)
    multiple_presence: bool = True

    def __init__(
        self,
        name: str,
        permanent: Mapping[str, object],
        live: float,
        *,
        source: str = "",
        from_memory: bool = False,
        notes: str = "",
        dynamic_allowance: float | None = None,
        live_parts: Mapping[str, float] | None = None,
        multiple_presence: bool = True,
    ) -> None:
        label = text(name, "LimitState: name")
        if not isinstance(permanent, Mapping):
            raise DesignInputError(
                f"LimitState {label}: give permanent as a mapping of load categories to (γmax, γmin), e.g. "
                "{'DC': (1.25, 0.90), 'DW': (1.50, 0.65)}.", field="permanent", value=permanent)
        factors = {text(k, f"LimitState {label}: a permanent load category"): _pair(v, f"LimitState {label}: {k}")
                   for k, v in permanent.items()}
        parts = {} if live_parts is None else live_parts
        if not isinstance(parts, Mapping):
            raise DesignInputError(f"LimitState {label}: live_parts: give a mapping such as {{'axles': 0.75}}.",
                                   field="live_parts", value=live_parts)
        for key in parts:
            if key not in LIVE_PARTS:
                raise DesignInputError(
                    f"LimitState {label}: live_parts: {key!r} is not a part kind; use "
                    f"{' or '.join(map(repr, LIVE_PARTS))}.",
                    field="live_parts", value=key)
        object.__setattr__(self, "name", label)
        object.__setattr__(self, "permanent", MappingProxyType(factors))
        object.__setattr__(self, "live", amount(live, f"LimitState {label}: live", minimum=0.0,
                                                fix=" (a load factor is never negative)"))
        object.__setattr__(self, "source", text(source, "source", empty=True))
        object.__setattr__(self, "from_memory", flag(from_memory, what="from_memory", field="from_memory",
                                                     error=DesignInputError))
        object.__setattr__(self, "notes", text(notes, "notes", empty=True))
        object.__setattr__(self, "dynamic_allowance", None if dynamic_allowance is None else
                           amount(dynamic_allowance, f"LimitState {label}: dynamic_allowance", minimum=0.0))
        object.__setattr__(self, "live_parts", MappingProxyType(
            {k: amount(v, f"LimitState {label}: live_parts {k}", minimum=0.0) for k, v in parts.items()}))
        object.__setattr__(self, "multiple_presence", flag(multiple_presence, what="multiple_presence",
                                                           field="multiple_presence", error=DesignInputError))

    def __eq__(self, other: object) -> bool:
        return isinstance(other, LimitState) and self._key() == other._key()

    def __hash__(self) -> int:
        return hash(self._key())

    def _key(self) -> tuple[Any, ...]:
        return (self.name, tuple(self.permanent.items()), self.live, self.source, self.from_memory, self.notes,
                self.dynamic_allowance, tuple(self.live_parts.items()), self.multiple_presence)

    def factors_of(self, category: str) -> tuple[float, float]:
        """(γmax, γmin) of a permanent load category (dimensionless); an unknown category is an error that
        lists the known ones and the fix."""
        if category in self.permanent:
            return self.permanent[category]
        if ANY in self.permanent:
            return self.permanent[ANY]
        known = ", ".join(repr(k) for k in self.permanent) or "none"
        raise DesignInputError(
            f"{self.name}: no load factors for the permanent load category {category!r} (it has {known}); name the "
            f"loads with one of these categories, or define the combination with it: LimitState({self.name!r}, "
            f"permanent={{..., {category!r}: (γmax, γmin)}}, ...).", field="category", value=category)

    def permanent_factor(self, category: str, effect: float, extreme: str) -> float:
        """The factor on a category whose total effect is ``effect`` for the ``extreme`` (``"max"`` or
        ``"min"``): γmax where the effect adds to the extreme, γmin where it relieves it (dimensionless)."""
        hi, lo = self.factors_of(category)
        adds = effect > 0 if extreme == "max" else effect < 0
        return hi if adds else lo

    def live_factor(self) -> Factor:
        """γLL as a :class:`~ilkit.design.Factor` of kind ``"load factor"`` (dimensionless)."""
        parts = ", ".join(f"{k} × {fmt(v)}" for k, v in self.live_parts.items())
        return Factor("load factor", self.live, "γLL", source=self.source, from_memory=self.from_memory,
                      note=f"{self.name}" + (f"; {parts}" if parts else ""))

    def permanent_factors(self) -> tuple[Factor, ...]:
        """Every (γmax, γmin) as :class:`~ilkit.design.Factor` objects of kind ``"load factor"``, for a
        calculation sheet (dimensionless)."""
        out = []
        for category, (hi, lo) in self.permanent.items():
            name = "other" if category == ANY else category
            out.append(Factor("load factor", hi, f"γ{name},max", source=self.source, from_memory=self.from_memory,
                              note=self.name))
            out.append(Factor("load factor", lo, f"γ{name},min", source=self.source, from_memory=self.from_memory,
                              note=self.name))
        return tuple(out)

    def __repr__(self) -> str:
        perm = ", ".join(f"{'other' if k == ANY else k} {fmt(hi)}/{fmt(lo)}" for k, (hi, lo) in self.permanent.items())
        parts = "".join(f", {k} × {fmt(v)}" for k, v in self.live_parts.items())
        return f"LimitState({self.name}: {perm or 'no permanent loads'}; live {fmt(self.live)}{parts})"

    def to_frame(self) -> Any:
        """One row per factor: ``load`` (category or ``live``), ``γmax``, ``γmin`` (dimensionless)."""
        import pandas as pd

        rows = [{"load": "other" if k == ANY else k, "γmax": hi, "γmin": lo} for k, (hi, lo) in self.permanent.items()]
        rows.append({"load": "live", "γmax": self.live, "γmin": self.live})
        for k, v in self.live_parts.items():
            rows.append({"load": f"live: {k} (× γLL)", "γmax": v, "γmin": v})
        return pd.DataFrame(rows)


# ------------------------------------------------------------ AASHTO LRFD
_AASHTO_3_4 = f"{AASHTO_LRFD}, Tables 3.4.1-1 and 3.4.1-2"
_STRENGTH_PERMANENT = {
    "DC": (1.25, 0.90),  # components and attachments, Table 3.4.1-2
    "DW": (1.50, 0.65),  # wearing surfaces and utilities
    "EL": (1.00, 1.00),  # locked-in construction stresses
    "EV": (1.35, 1.00),  # vertical earth pressure, retaining walls and abutments
    "ES": (1.50, 0.75),  # earth surcharge
    "settlement": (1.00, 0.00),  # SE, γSE = 1.00 where it adds (common practice: left out where it relieves)
}
_SERVICE_PERMANENT = {k: (1.0, 1.0) for k in ("DC", "DW", "EL", "EV", "ES")} | {"settlement": (1.0, 0.0)}

AASHTO_LIMIT_STATES: tuple[LimitState, ...] = (
    LimitState("Strength I", _STRENGTH_PERMANENT, 1.75, source=_AASHTO_3_4, from_memory=True,
               dynamic_allowance=0.33, notes="normal vehicular use; γp chosen per sign (Table 3.4.1-2)"),
    LimitState("Strength II", _STRENGTH_PERMANENT, 1.35, source=_AASHTO_3_4, from_memory=True,
               dynamic_allowance=0.33, notes="owner-specified special design vehicles or permit vehicles"),
    LimitState("Service I", _SERVICE_PERMANENT, 1.00, source=_AASHTO_3_4, from_memory=True,
               dynamic_allowance=0.33, notes="normal operational use; deflection, crack control"),
    LimitState("Service II", _SERVICE_PERMANENT, 1.30, source=_AASHTO_3_4, from_memory=True,
               dynamic_allowance=0.33, notes="yielding of steel structures and slip of slip-critical connections"),
    LimitState("Service III", _SERVICE_PERMANENT, 0.80, source=f"{_AASHTO_3_4}, 3.4.1-4", from_memory=True,
               dynamic_allowance=0.33, notes="tension in prestressed concrete superstructures; γLL = 0.80 (1.0 "
                                             "with refined time-dependent losses, Table 3.4.1-4)"),
    LimitState("Fatigue I", {ANY: (0.0, 0.0)}, 1.75, source=f"{_AASHTO_3_4}, 3.6.1.4, 3.6.2.1", from_memory=True,
               dynamic_allowance=0.15, multiple_presence=False,
               notes="infinite load-induced fatigue life; the fatigue truck, IM 15 %, no multiple presence; "
                     "permanent loads not included"),
    LimitState("Fatigue II", {ANY: (0.0, 0.0)}, 0.80, source=f"{_AASHTO_3_4}, 3.6.1.4, 3.6.2.1", from_memory=True,
               dynamic_allowance=0.15, multiple_presence=False,
               notes="finite load-induced fatigue life; the fatigue truck, IM 15 %, no multiple presence; "
                     "permanent loads not included"),
)
"""AASHTO LRFD load combinations (Tables 3.4.1-1 and 3.4.1-2, from memory): Strength I and II, Service I,
II and III, Fatigue I and II.  Permanent factors γp: DC 1.25/0.90, DW 1.50/0.65, EL 1.00/1.00, EV
(retaining walls and abutments) 1.35/1.00, ES 1.50/0.75; settlement 1.00 where it adds."""

# ------------------------------------------------------------- EN 1990 A2
_PSI = {"frequent": {"axles": 0.75, "uniform": 0.40}, "quasi-permanent": {"axles": 0.0, "uniform": 0.0}}
EN1990_LIMIT_STATES: tuple[LimitState, ...] = (
    LimitState("ULS fundamental (6.10)", {"settlement": (1.20, 0.0), ANY: (1.35, 1.00)}, 1.35,
               source=f"{EN_1990}, 6.10, Table A2.4(B)", from_memory=True,
               notes="set B; γG,sup 1.35, γG,inf 1.00, γQ 1.35 for road traffic (leading), γGset 1.20 where "
                     "unfavourable (linear analysis); check the National Annex"),
    LimitState("SLS characteristic", {"settlement": (1.0, 0.0), ANY: (1.0, 1.0)}, 1.0,
               source=f"{EN_1990}, Table A2.6", from_memory=True, notes="traffic leading"),
    LimitState("SLS frequent", {"settlement": (1.0, 0.0), ANY: (1.0, 1.0)}, 1.0, live_parts=_PSI["frequent"],
               source=f"{EN_1990}, Tables A2.6 and A2.1", from_memory=True,
               notes="traffic leading with ψ1: tandem system 0.75, uniform load 0.40 (gr1a)"),
    LimitState("SLS quasi-permanent", {"settlement": (1.0, 0.0), ANY: (1.0, 1.0)}, 1.0,
               live_parts=_PSI["quasi-permanent"], source=f"{EN_1990}, Tables A2.6 and A2.1", from_memory=True,
               notes="ψ2 of road traffic is 0 (gr1a)"),
)
"""EN 1990 Annex A2 road-bridge combinations (from memory): ULS fundamental 6.10 (γG 1.35/1.00, γQ 1.35),
SLS characteristic, frequent (ψ1: TS 0.75, UDL 0.40) and quasi-permanent (ψ2 = 0)."""

LIMIT_STATES: Mapping[str, LimitState] = MappingProxyType(
    {s.name: s for s in (*AASHTO_LIMIT_STATES, *EN1990_LIMIT_STATES)})
"""Every published limit state by name."""

_SETS = {"AASHTO": AASHTO_LIMIT_STATES, "EN 1990": EN1990_LIMIT_STATES}


def limit_states(chosen: object) -> tuple[LimitState, ...]:
    """The limit states named or given in ``chosen``: a name of :data:`LIMIT_STATES`, ``"AASHTO"`` or ``"EN
    1990"`` (the whole set), a :class:`LimitState`, or a list of these.  An unknown name is an error that
    lists the known ones; two limit states with one name are an error."""
    items = [chosen] if isinstance(chosen, (str, LimitState)) else listed(
        chosen, wanted="limit_states: give names (e.g. 'Strength I'), LimitState objects or 'AASHTO'",
        field="limit_states", error=DesignInputError)
    out: list[LimitState] = []
    for item in items:
        if isinstance(item, LimitState):
            out.append(item)
        elif isinstance(item, str) and item in _SETS:
            out.extend(_SETS[item])
        elif isinstance(item, str) and item in LIMIT_STATES:
            out.append(LIMIT_STATES[item])
        else:
            names = ", ".join(repr(n) for n in (*_SETS, *LIMIT_STATES))
            raise DesignInputError(
                f"limit_states: unknown limit state {item!r}; choose from {names}, or define one with "
                "LimitState(name, permanent={...}, live=...).", field="limit_states", value=item)
    names = [s.name for s in out]
    twice = sorted({n for n in names if names.count(n) > 1})
    if twice:
        raise DesignInputError(f"limit_states: {twice} given more than once.", field="limit_states", value=twice)
    if not out:
        raise DesignInputError("limit_states: give at least one limit state, e.g. 'Strength I' or 'AASHTO'.",
                               field="limit_states")
    return tuple(out)

