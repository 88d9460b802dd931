"""Load and resistance factor rating (LRFR) of a girder: rating factors for design, legal and permit loads.

At every rated section, for every rated action (moment, shear) and for each sense of the live load's effect
(positive, negative)::

    RF = (C − Σ γp·P) / (γLL · (LL + IM)),    C = φc · φs · φ · Rn,   φc · φs ≥ 0.85

(AASHTO Manual for Bridge Evaluation 6A.4.2.1, from memory).  ``LL + IM`` is the girder's live-load
extreme of that sense: one lane's exact extreme (:func:`ilkit.loads.extremes`, with the vehicle's dynamic
allowance IM in it) times the girder's share (the distribution factor of :mod:`ilkit.design`; the one-lane
factor with the multiple presence factor taken out for special permits).  ``Σ γp·P`` is the factored
permanent effect of the same sense: each category (DC, DW ...) with its maximum factor where its effect
adds to the live load's and its minimum factor where it relieves it.  Rn is given
(:class:`~ilkit.rating.Resistances`); ilkit never computes the resistance of a cross-section.  Signs follow
:mod:`ilkit.model`: a positive sense is a sagging moment or a positive shear; capacities are magnitudes.

Every factor is applied once and recorded (:class:`~ilkit.design.Applied`): the live part's dynamic
allowance, distribution (with its lanes and multiple presence) and γLL; the capacity's φc, φs and φ.

:func:`rate_girder` is the one pure entry point (a batch runner calls it per girder); it returns a frozen
:class:`GirderRating` with a tidy table (:meth:`GirderRating.to_frame`), the controlling rating per vehicle
with the rating in tons and the posting load (:meth:`GirderRating.controlling`), and the governing
placements.
"""

from __future__ import annotations

import math
from collections.abc import Mapping, Sequence
from dataclasses import dataclass, field, replace
from fractions import Fraction
from types import MappingProxyType
from typing import TYPE_CHECKING, Any, Literal, get_args

import numpy as np

from ilkit._check import choice, listed
from ilkit._display import RichDisplay
from ilkit._exact import fmt
from ilkit.design.combinations import LimitState
from ilkit.design.distribution import Distribution
from ilkit.design.factors import Applied, Factor
from ilkit.design.lanes import in_feet
from ilkit.design.live import GirderLiveLoad
from ilkit.design.permanent import PermanentEffects
from ilkit.design.sections import Section, envelope_sections
from ilkit.errors import DesignInputError, LoadInputError, RatingInputError, SideRequiredError
from ilkit.loads.combination import LoadModel
from ilkit.loads.models import hl93
from ilkit.loads.placement import extremes_of
from ilkit.loads.primitives import AxleTrain
from ilkit.loads.standing import stand
from ilkit.model import Beam
from ilkit.rating import vehicles as veh
from ilkit.rating._inputs import amount
from ilkit.rating.factors import (
    PHI_CS_MINIMUM,
    PermitKind,
    Posting,
    condition_factor,
    design_live_factor,
    emergency_live_factor,
    legal_live_factor,
    permit_live_factor,
    posting_load,
    rating_limit_state,
    service_live_factor,
    system_factor,
)
from ilkit.rating.resistance import Resistances
from ilkit.units import LENGTH, magnitude_in

if TYPE_CHECKING:  # pragma: no cover
    import pandas as pd

    from ilkit.loads.results import Extreme, Extremes, LoadPlacement

__all__ = [
    "RatingLevel",
    "RatingLoad",
    "design_load",
    "legal_load",
    "permit_load",
    "rating_loads",
    "LEGAL_SET",
    "rate_girder",
    "GirderRating",
    "StandingRating",
    "vehicle_tons",
]

RatingLevel = Literal["design inventory", "design operating", "legal", "emergency", "permit"]
"""The levels of an LRFR rating."""

LEGAL_SET = ("Type 3", "Type 3S2", "Type 3-3", "lane-type", "SU4", "SU5", "SU6", "SU7", "NRL")
"""The legal loads of ``rating_loads("legal")``: the AASHTO legal trucks, the lane-type legal load, the
specialised hauling vehicles and the notional rating load."""

_GROUPS: Mapping[str, tuple[str, ...]] = MappingProxyType({
    "design": ("HL-93 inventory", "HL-93 operating"),
    "legal": LEGAL_SET,
    "AASHTO legal": ("Type 3", "Type 3S2", "Type 3-3", "lane-type"),
    "specialized hauling": ("SU4", "SU5", "SU6", "SU7"),
    "emergency": ("EV2", "EV3"),
})
LONG_SPAN_FT = 200.0
"""Span from which the lane-type legal load's long-span case applies (MBE 6A.4.4.2.1, from memory), ft."""

Action = Literal["moment", "shear"]
Sense = Literal["positive", "negative"]


@dataclass(frozen=True)
class RatingLoad:
    """One vehicle (or lane load) to rate for, with its level and live-load factor.

    ``model``: the load model of one lane (kip, ft for the AASHTO vehicles), its dynamic allowance in it.
    ``level``: one of :data:`RatingLevel`.  ``live_factor``: γLL as a :class:`~ilkit.design.Factor`.
    ``limit_state``: ``"Strength I"`` (design, legal, emergency) or ``"Strength II"`` (permits).
    ``single_lane``: rated with the one-lane distribution factor, multiple presence taken out (special
    permits, MBE 6A.4.5.4.2b, from memory).  ``weight``: the vehicle's gross weight in tons (short tons of
    2 kip for a vehicle in kip, metric tonnes for one in kN), for the rating in tons and posting; ``None``
    for a lane load.  ``name``: the name in tables.
    """

    name: str
    model: LoadModel
    level: RatingLevel
    live_factor: Factor
    limit_state: str = "Strength I"
    single_lane: bool = False
    weight: float | None = None

    def __post_init__(self) -> None:
        if not isinstance(self.name, str) or not self.name.strip():
            raise RatingInputError(f"RatingLoad: name must be a non-empty text, got {self.name!r}.", field="name",
                                   value=self.name)
        if self.weight is not None:
            object.__setattr__(self, "weight", amount(self.weight, f"RatingLoad {self.name!r}: weight (tons)",
                                                      minimum=0.0, strict=True))
        if not isinstance(self.single_lane, bool):
            raise RatingInputError(f"RatingLoad {self.name!r}: single_lane must be True or False.",
                                   field="single_lane", value=self.single_lane)
        if not isinstance(self.model, LoadModel):
            raise RatingInputError(f"RatingLoad {self.name!r}: model must be a LoadModel, got "
                                   f"{type(self.model).__name__}.", field="model", value=self.model)
        choice(self.level, get_args(RatingLevel), what="RatingLoad: level", field="level", error=RatingInputError)
        if not isinstance(self.live_factor, Factor) or self.live_factor.kind != "load factor":
            raise RatingInputError(f"RatingLoad {self.name!r}: live_factor must be a Factor of kind 'load factor' "
                                   "(e.g. ilkit.rating.legal_live_factor(adtt)).", field="live_factor",
                                   value=self.live_factor)

    @property
    def posted(self) -> bool:
        """True for a vehicle whose rating may lead to posting (a legal or emergency vehicle with a weight)."""
        return self.level in ("legal", "emergency") and self.weight is not None


def vehicle_tons(model: LoadModel) -> float | None:
    """The gross weight of a vehicle model in tons: short tons (2 kip) for a model in kip, metric tonnes
    (9.80665 kN) otherwise; ``None`` for a model that is not one axle train (a lane load)."""
    w = veh.vehicle_weight(model)
    if w is None:
        return None
    u = model.units
    if u.force == "kip":
        return w / 2.0
    return w * float(u.newtons_per_force) / 9806.65


def design_load(level: Literal["inventory", "operating"], *, dynamic_allowance: float = 0.33) -> RatingLoad:
    """The design load rating's HL-93 (:func:`ilkit.loads.hl93`) at the ``"inventory"`` (γLL 1.75) or
    ``"operating"`` (γLL 1.35) level (MBE 6A.4.3, from memory)."""
    gamma = design_live_factor(level)
    return RatingLoad(f"HL-93 {level}", hl93(dynamic_allowance=dynamic_allowance), f"design {level}",  # type: ignore[arg-type]
                      gamma)


def legal_load(name: str, *, adtt: float | None = None, live_factor: float | Factor | None = None,
               long_span: bool = True, dynamic_allowance: float = 0.33) -> RatingLoad:
    """A legal (or emergency) rating load by name: ``"Type 3"``, ``"Type 3S2"``, ``"Type 3-3"``,
    ``"lane-type"`` (:func:`~ilkit.rating.lane_type_legal_load`; ``long_span`` includes its case for spans
    of 200 ft and more), ``"SU4"`` to ``"SU7"``, ``"NRL"``, ``"EV2"``, ``"EV3"``.

    γLL from the ADTT (:func:`~ilkit.rating.legal_live_factor`; emergency vehicles 1.30) unless
    ``live_factor`` is given (a number or a Factor)."""
    emergency = name in ("EV2", "EV3")
    if name == "lane-type":
        model = veh.lane_type_legal_load(long_span=long_span, dynamic_allowance=dynamic_allowance)
    elif name in veh.LEGAL_TRUCKS:
        model = veh._model(name, dynamic_allowance)
    else:
        known = [n for n in veh.LEGAL_TRUCKS] + ["lane-type"]
        raise RatingInputError(f"legal_load: unknown vehicle {name!r}; choose one of {', '.join(map(repr, known))}.",
                               field="name", value=name)
    gamma = _gamma(live_factor, emergency_live_factor() if emergency else legal_live_factor(adtt))
    return RatingLoad(name, model, "emergency" if emergency else "legal", gamma, weight=vehicle_tons(model))


def _gamma(given: float | Factor | None, default: Factor) -> Factor:
    if given is None:
        return default
    if isinstance(given, Factor):
        return given
    try:
        return Factor("load factor", given, "γLL", note="given by the user")
    except DesignInputError as err:
        raise RatingInputError(f"live_factor: {err}", field="live_factor", value=given) from None


def permit_load(vehicle: LoadModel | AxleTrain, kind: PermitKind = "routine", *, adtt: float | None = None,
                live_factor: float | Factor | None = None, name: str | None = None) -> RatingLoad:
    """A permit vehicle (a :class:`~ilkit.LoadModel`, e.g. :func:`~ilkit.rating.permit_vehicle`, or an axle
    train) rated at Strength II with γLL of :func:`~ilkit.rating.permit_live_factor` for ``kind`` and
    ``adtt`` (or ``live_factor``).  A routine permit takes the girder's distribution factor (two or more
    lanes, with other traffic); a special permit the one-lane factor with multiple presence taken out (MBE
    6A.4.5.4.2b, from memory)."""
    if isinstance(vehicle, AxleTrain):
        vehicle = veh.permit_vehicle(list(vehicle.loads), list(vehicle.spacings), name=vehicle.name,
                                     units=vehicle.units.name)
    if not isinstance(vehicle, LoadModel):
        raise RatingInputError(f"permit_load: give the vehicle as a LoadModel (ilkit.rating.permit_vehicle(...)) or "
                               f"an AxleTrain, got {type(vehicle).__name__}.", field="vehicle", value=vehicle)
    gamma = _gamma(live_factor, permit_live_factor(kind, adtt))
    return RatingLoad(name or vehicle.name, vehicle, "permit", gamma, "Strength II",
                      single_lane=kind != "routine", weight=vehicle_tons(vehicle))


def rating_loads(names: str | Sequence[str | RatingLoad], *, adtt: float | None = None,
                 long_span: bool = True) -> tuple[RatingLoad, ...]:
    """Rating loads by name: ``"design"`` (HL-93 inventory and operating), ``"HL-93 inventory"``,
    ``"HL-93 operating"``, ``"legal"`` (:data:`LEGAL_SET`), ``"AASHTO legal"`` (Type 3, 3S2, 3-3 and the
    lane-type load), ``"specialized hauling"`` (SU4 to SU7), ``"emergency"`` (EV2, EV3), or one vehicle name
    of :func:`legal_load`; :class:`RatingLoad` objects are kept.  ``adtt``: for the legal live-load factor."""
    items = [names] if isinstance(names, (str, RatingLoad)) else listed(
        names, wanted="loads: give names ('design', 'legal', 'Type 3' ...) or RatingLoad objects", field="loads",
        error=RatingInputError)
    out: list[RatingLoad] = []
    for item in items:
        if isinstance(item, RatingLoad):
            out.append(item)
            continue
        if not isinstance(item, str):
            raise RatingInputError(f"loads: {item!r} is neither a name nor a RatingLoad.", field="loads", value=item)
        for name in _GROUPS.get(item, (item,)):
            if name.startswith("HL-93 "):
                level = name.removeprefix("HL-93 ")
                if level not in ("inventory", "operating"):
                    raise RatingInputError(f"loads: unknown design level in {name!r}; use 'HL-93 inventory' or "
                                           "'HL-93 operating'.", field="loads", value=name)
                out.append(design_load(level))  # type: ignore[arg-type]
            elif name in veh.LEGAL_TRUCKS or name == "lane-type":
                out.append(legal_load(name, adtt=adtt, long_span=long_span))
            else:
                groups = ", ".join(map(repr, _GROUPS))
                vehicles = ", ".join(map(repr, [*veh.LEGAL_TRUCKS, "lane-type"]))
                raise RatingInputError(
                    f"loads: unknown rating load {name!r}; use a group ({groups}), 'HL-93 inventory', "
                    f"'HL-93 operating', a vehicle ({vehicles}), or a RatingLoad (permit_load(...)).",
                    field="loads", value=name)
    names_seen = [r.name for r in out]
    twice = sorted({n for n in names_seen if names_seen.count(n) > 1})
    if twice:
        raise RatingInputError(f"loads: {twice} given more than once; rename one (RatingLoad(name=...)).",
                               field="loads", value=twice)
    if not out:
        raise RatingInputError("loads: give at least one rating load, e.g. 'design'.", field="loads")
    return tuple(out)


# ------------------------------------------------------------------------------------------------ the rating
@dataclass(frozen=True)
class StandingRating:
    """The rating factor at one section for a vehicle standing at one position (the rating view's readout).

    ``rf``: the rating factor (``math.inf`` where the vehicle causes nothing there); ``live``: the girder's
    live effect (with IM and share, unfactored; beam units, signs of :mod:`ilkit.model`); ``sense``:
    ``"positive"`` or ``"negative"`` (the sense of the live effect); ``capacity`` and ``dead``: C and the
    factored permanent effect of that sense (beam units); ``placement``: where the axles stand (one lane,
    without IM).  Lane loads are left out: only the vehicle's axles stand.
    """

    rf: float
    live: float
    sense: Sense
    capacity: float
    dead: float
    placement: LoadPlacement = field(repr=False)


@dataclass(frozen=True, eq=False)
class GirderRating(RichDisplay):
    """The LRFR rating of one girder.

    ``frame`` (tidy; :meth:`to_frame`): one row per (``vehicle``, ``quantity``, ``x``, ``side``, ``sense``)
    with ``level``, ``limit_state``, ``RF``, ``capacity`` (C = φc φs φ Rn), ``Rn``, ``dead`` (Σ γp P of the
    sense), ``live`` (LL + IM, the girder's share, unfactored), ``gamma_LL``, ``case`` (the governing case of
    the model), ``placement`` (where the vehicle stands, in words).  ``quantity`` is ``"moment"`` or
    ``"shear"``; ``x`` in the beam's length unit; ``side`` ``"left"``, ``"right"`` or ``""``; ``sense``
    ``"positive"`` (sagging moment, positive shear) or ``"negative"``; effects in the beam's units, signed
    as in :mod:`ilkit.model` (``dead`` and ``live`` with their signs, ``capacity`` and ``Rn`` magnitudes).
    Rows where the vehicle causes no effect of a sense are left out.

    ``live_factors[vehicle][action]``: the :class:`~ilkit.design.Applied` record of the live part (dynamic
    allowance, distribution, γLL); ``capacity_factors[action]``: that of the capacity (φc, φs, the bound,
    φ); ``limit_states[vehicle]``: the load combination used (dead-load factors and γLL).  With a Service II
    check (``service``, the limits given), ``service_states[vehicle]`` and ``service_factors[vehicle][action]``
    are its combination and live-part record, and its rows read ``"Service II"``.
    """

    beam: Beam = field(repr=False)
    frame: pd.DataFrame = field(repr=False)
    loads: tuple[RatingLoad, ...]
    resistances: Resistances = field(repr=False)
    permanent: PermanentEffects = field(repr=False)
    distribution: Distribution = field(repr=False)
    single_lane: Distribution | None = field(repr=False)
    condition: Factor = field(repr=False)
    system: Factor = field(repr=False)
    capacity_factors: Mapping[str, Applied] = field(repr=False)
    live_factors: Mapping[str, Mapping[str, Applied]] = field(repr=False)
    limit_states: Mapping[str, LimitState] = field(repr=False)
    sections: tuple[Section, ...] = field(repr=False)
    notes: tuple[str, ...] = field(repr=False, default=())
    _found: Mapping[tuple[str, str, Fraction, str | None], Extremes] = field(repr=False, default_factory=dict)
    _dead: Mapping[tuple[str, float, str], Mapping[str, float]] = field(repr=False, default_factory=dict)
    service: Resistances | None = field(repr=False, default=None)
    service_states: Mapping[str, LimitState] = field(repr=False, default_factory=dict)
    service_factors: Mapping[str, Mapping[str, Applied]] = field(repr=False, default_factory=dict)

    def __repr__(self) -> str:
        worst = self.controlling()
        words = ", ".join(f"{r.vehicle} {r.RF:.3g}" for r in worst.itertuples())
        return f"GirderRating({len(self.loads)} rating loads at {len(self.sections)} sections: {words})"

    def to_frame(self) -> pd.DataFrame:
        """The tidy table (a copy); see the class notes for its columns, units and signs."""
        return self.frame.copy()

    def load(self, vehicle: str) -> RatingLoad:
        """The rating load named ``vehicle``."""
        names = [r.name for r in self.loads]
        choice(vehicle, names, what="vehicle", field="vehicle", error=RatingInputError)
        return self.loads[names.index(vehicle)]

    def controlling(self) -> pd.DataFrame:
        """The controlling rating of every vehicle: its smallest RF and where (``quantity``, ``x``, ``side``,
        ``sense``, ``case``, ``placement``), with ``weight`` (tons), ``rating_tons`` (RF × weight), and for
        legal and emergency vehicles ``posting`` (the safe posting load in tons, MBE 6A.8.3, from memory;
        empty where none follows) and ``action`` (what to do, in words).  One row per vehicle, in the order
        rated."""
        import pandas as pd

        rows = []
        f = self.frame
        for r in self.loads:
            part = f[f["vehicle"] == r.name]
            if part.empty:
                continue
            best = part.loc[part["RF"].idxmin()]
            post: Posting | None = posting_load(best["RF"], r.weight) if r.posted and r.weight else None
            rows.append({
                "vehicle": r.name, "level": r.level, "limit_state": best["limit_state"], "RF": float(best["RF"]),
                "quantity": best["quantity"], "x": float(best["x"]), "side": best["side"], "sense": best["sense"],
                "case": best["case"], "placement": best["placement"],
                "weight": r.weight if r.weight is not None else math.nan,
                "rating_tons": float(best["RF"]) * r.weight if r.weight is not None else math.nan,
                "posting": post.load if post is not None and post.load is not None else math.nan,
                "action": post.words if post is not None else
                ("passes (RF ≥ 1)" if best["RF"] >= 1 else "does not pass (RF < 1)"),
            })
        return pd.DataFrame(rows)

    def along(self, vehicle: str, quantity: str | None = None) -> pd.DataFrame:
        """RF along the girder for ``vehicle``: per section (``x``, ``side``) and ``quantity`` the smaller RF of
        the two senses (columns ``quantity``, ``x``, ``side``, ``RF``, ``sense``), left to right."""
        self.load(vehicle)
        f = self.frame[self.frame["vehicle"] == vehicle]
        if quantity is not None:
            choice(quantity, ("moment", "shear"), what="along: quantity", field="quantity", error=RatingInputError)
            f = f[f["quantity"] == quantity]
        order = f.assign(_face=f["side"].map({"left": 0, "": 1, "right": 2}))
        best = order.loc[order.groupby(["quantity", "x", "side"], sort=False)["RF"].idxmin()]
        best = best.sort_values(["quantity", "x", "_face"])
        return best[["quantity", "x", "side", "RF", "sense"]].reset_index(drop=True)

    def extreme(self, vehicle: str, quantity: Action, at: object, sense: Sense = "positive",
                side: Literal["left", "right"] | None = None) -> Extreme:
        """The governing placement behind a row (one lane's extreme, with IM, without the girder's share):
        ``quantity`` at the section ``at`` (``side`` at a face), of ``sense``."""
        r = self.load(vehicle)
        choice(sense, ("positive", "negative"), what="extreme: sense", field="sense", error=RatingInputError)
        key = self._key(quantity, at, side)
        found = self._found[(r.name, *key)]
        return found.maximum if sense == "positive" else found.minimum

    def _key(self, quantity: str, at: object, side: str | None) -> tuple[str, Fraction, str | None]:
        choice(quantity, ("moment", "shear"), what="quantity", field="quantity", error=RatingInputError)
        choice(side, ("left", "right"), what="side", field="side", error=RatingInputError, optional=True)
        pos = magnitude_in(at, dims=LENGTH, system=self.beam.units, field="at")
        tol = Fraction(1, 10**9) * self.beam.length
        near = [s for s in self.sections if abs(s.x - pos) <= tol]
        if not near:
            raise RatingInputError(f"no rated section at x={fmt(pos)}; the sections are at x = "
                                   f"{', '.join(fmt(s.x) for s in self.sections[:12])} ...", field="at", value=at)
        faces = {s.side for s in near}
        if faces == {None}:
            return quantity, near[0].x, None
        if side is None:
            raise SideRequiredError(f"x={fmt(pos)} has two faces; name the side: side='left' or side='right'.")
        return quantity, near[0].x, side

    def rf(self, vehicle: str, quantity: Action, at: object, sense: Sense | None = None,
           side: Literal["left", "right"] | None = None) -> float:
        """The rating factor of ``vehicle`` for ``quantity`` at the section ``at`` (``side`` at a face): of
        ``sense``, or the smaller of the two (``math.inf`` where the vehicle causes nothing there).
        Dimensionless."""
        self.load(vehicle)
        quantity, x, face = self._key(quantity, at, side)
        f = self.frame
        rows = f[(f["vehicle"] == vehicle) & (f["quantity"] == quantity) & (f["x"] == float(x))
                 & (f["side"] == (face or ""))]
        if sense is not None:
            choice(sense, ("positive", "negative"), what="rf: sense", field="sense", error=RatingInputError)
            rows = rows[rows["sense"] == sense]
        return float(rows["RF"].min()) if not rows.empty else math.inf

    def standing(self, vehicle: str, quantity: Action, at: object, front: float, *,
                 side: Literal["left", "right"] | None = None,
                 direction: Literal["left to right", "right to left"] = "left to right") -> StandingRating:
        """The rating factor at the section ``at`` for ``quantity`` with ``vehicle``'s axles standing with the
        front at ``front`` (beam length unit), travelling in ``direction`` (varying spacings at their
        smallest value; lane loads left out).  See :class:`StandingRating`."""
        r = self.load(vehicle)
        quantity, x, face = self._key(quantity, at, side)
        case = r.model.cases[0]
        train = next((p for p in case.parts if isinstance(p, AxleTrain)), None)
        if train is None:
            raise RatingInputError(f"standing: {vehicle} has no axles to stand on the girder (a lane load).",
                                   field="vehicle", value=vehicle)
        line = self.beam.line(quantity, x, face)
        placed = stand(line, train, front, direction=direction)
        share = self._share(r, quantity)
        live = placed.effect * case.part_factor(train) * share
        sense: Sense = "positive" if live >= 0 else "negative"
        by = self._dead[(quantity, float(x), face or "")]
        best = StandingRating(math.inf, live, sense, math.nan, math.nan, placed)
        checks = []
        if quantity in self.resistances.actions:
            checks.append((self.limit_states[r.name], self.capacity_factors[quantity].product, self.resistances))
        if self.service is not None and self.service.covers(quantity, sense):
            checks.append((self.service_states[r.name], 1.0, self.service))
        for state, factor, given in checks:
            capacity = factor * given.nominal(quantity, sense, float(x), face)  # type: ignore[arg-type]
            dead = _dead_of(by, state, sense)
            rf = _rf(capacity, dead, live, state.live, sense) if abs(live) > 0 else math.inf
            if rf < best.rf or math.isnan(best.capacity):
                best = StandingRating(rf, live, sense, capacity, dead, placed)
        return best

    def _share(self, r: RatingLoad, quantity: str) -> float:
        return self.live_factors[r.name][quantity].product / self.limit_states[r.name].live


def _dead_of(by_category: Mapping[str, float], state: LimitState, sense: Sense) -> float:
    """Σ γ P of the sense: γmax where a category's effect has the sense's sign, γmin where it relieves."""
    total = 0.0
    for category, p in by_category.items():
        hi, lo = state.factors_of(category)
        adds = p > 0 if sense == "positive" else p < 0
        total += (hi if adds else lo) * p
    return total


def _rf(capacity: float, dead: float, live: float, gamma: float, sense: Sense) -> float:
    """RF = (C − γp P) / (γLL L) with the effects of ``sense`` as magnitudes (a dead load of the other sign
    adds to the capacity)."""
    if sense == "positive":
        return (capacity - dead) / (gamma * live)
    return (capacity + dead) / (gamma * -live)


def _capacity_record(condition: Factor, system: Factor, phi: Factor) -> Applied:
    record = Applied.of(condition, system)
    if condition.value * system.value < PHI_CS_MINIMUM:
        bound = PHI_CS_MINIMUM / (condition.value * system.value)
        record = record.then(Factor(
            "adjustment", bound, "φc·φs ≥ 0.85", source=f"{veh.MBE}, 6A.4.2.1", from_memory=True,
            note=f"φc·φs = {condition.value * system.value:.4g} is raised to 0.85"))
    return record.then(phi)


def _placement_words(extreme: Extreme) -> str:
    """Where the loads of an extreme stand, in short words."""
    words = []
    for p in extreme.placements:
        if p.axles:
            on = [a for a in p.axles if a.counted]
            lead = p.axles[0]
            text = f"{p.load} {p.direction or ''}".strip() + f", lead axle at x={lead.x:.5g}"
            if len(on) < len(p.axles):
                text += f" ({len(on)} of {len(p.axles)} axles counted)"
            words.append(text)
        elif p.patches:
            words.append(f"{p.load} on " + ", ".join(f"{q.start:.5g}–{q.end:.5g}" for q in p.patches))
    return "; ".join(words)


def _distribution(distribution: object, what: str) -> Distribution:
    if not isinstance(distribution, Distribution):
        raise RatingInputError(
            f"rate_girder: {what} must be a Distribution (ilkit.design.given_distribution(...), "
            f"aashto_distribution(...), lever_rule(...)), got {type(distribution).__name__} {distribution!r}.",
            field=what.split(" ")[0], value=distribution)
    return distribution


def _single_lane(distribution: Distribution, given: object) -> Distribution:
    if given is not None:
        return _distribution(given, "single_lane")
    try:
        one = distribution.fatigue()
    except DesignInputError:
        raise RatingInputError(
            f"rate_girder: a special permit is rated with the one-lane distribution factor without multiple "
            f"presence (MBE 6A.4.5.4.2b), which {distribution.method!r} does not know; give it: "
            "single_lane=ilkit.design.given_distribution(g1 / 1.2, ...).", field="single_lane") from None
    return replace(one, method=f"{distribution.method}, one lane, multiple presence taken out (special permit)",
                   moment=replace(one.moment, note="one lane loaded, m = 1.20 taken out (special permit)"),
                   shear=replace(one.shear, note="one lane loaded, m = 1.20 taken out (special permit)"))


def rate_girder(
    beam: Beam,
    *,
    permanent: PermanentEffects,
    resistances: Resistances,
    distribution: Distribution,
    loads: str | Sequence[str | RatingLoad] = ("design", "legal"),
    adtt: float | None = None,
    condition: str | float | Factor = "good",
    system: str | float | Factor = "all other girder bridges and slab bridges",
    single_lane: Distribution | None = None,
    divisions: int = 10,
    at: Sequence[object] = (),
    wearing_surface_measured: bool = False,
    dead_factors: Mapping[str, object] | None = None,
    service: Resistances | None = None,
) -> GirderRating:
    """Rate one girder on ``beam`` for ``loads`` (LRFR; see the module notes for the rule).

    Parameters
    ----------
    beam:
        The girder line (with units; ``EI`` for a continuous girder).
    permanent:
        Its permanent effects (:func:`ilkit.design.permanent_effects`) at the same sections (``divisions``,
        ``at``), with moment and shear; categories ``"DC"`` and ``"DW"`` (others need ``dead_factors``).
    resistances:
        The nominal resistances and φ (:class:`~ilkit.rating.Resistances`); the actions given are rated.
    distribution:
        The girder's share of one lane's load (:mod:`ilkit.design`): used for design, legal and routine permit
        loads; ``single_lane`` for special permits (default: its one-lane factor divided by 1.20, where known).
    loads:
        Names or :class:`RatingLoad` objects (:func:`rating_loads`): by default the design load at both
        levels and the legal loads; ``adtt`` sets the legal live-load factor.  The lane-type legal load's
        long-span case is included where a span is 200 ft or longer.
    condition, system:
        φc and φs (:func:`~ilkit.rating.condition_factor`, :func:`~ilkit.rating.system_factor`).
    divisions, at:
        The rated sections (:func:`ilkit.design.envelope_sections`: tenth points by default).
    wearing_surface_measured, dead_factors:
        γDW 1.25 instead of 1.50; (γmax, γmin) of other permanent load categories.
    service:
        For steel girders, the Service II check (MBE 6A.6.4.2.2, from memory): the moments (and shears) at
        the permanent-deformation limit, given as :class:`~ilkit.rating.Resistances` (e.g. from 0.95 Fy in
        the flanges of a composite girder, 0.80 Fy of a non-composite one); rated with the dead loads
        unfactored, no φ, φc or φs, and γLL of :func:`~ilkit.rating.service_live_factor`.  Only the
        resistances given are checked.  Rows with ``limit_state`` ``"Service II"``.

    Returns a :class:`GirderRating`; rating factors are dimensionless, effects in the beam's units with the
    signs of :mod:`ilkit.model`.
    """
    import pandas as pd

    if not isinstance(beam, Beam):
        raise RatingInputError(f"rate_girder: give a Beam, got {type(beam).__name__} {beam!r}.", field="beam",
                               value=beam)
    if beam.units is None:
        raise RatingInputError("rate_girder: the beam declares no units; give Beam(..., units='kip-ft').",
                               field="units")
    if not isinstance(permanent, PermanentEffects):
        raise RatingInputError(f"rate_girder: give permanent=ilkit.design.permanent_effects(...), got "
                               f"{type(permanent).__name__}.", field="permanent", value=permanent)
    if not isinstance(resistances, Resistances):
        raise RatingInputError(f"rate_girder: give resistances=ilkit.rating.Resistances(...), got "
                               f"{type(resistances).__name__}.", field="resistances", value=resistances)
    if service is not None and not isinstance(service, Resistances):
        raise RatingInputError(f"rate_girder: give service=ilkit.rating.Resistances(...) (the Service II limits), "
                               f"got {type(service).__name__}.", field="service", value=service)
    dist = _distribution(distribution, "distribution")
    longest = max(in_feet(float(b - a), beam.units) for a, b in beam.spans)
    chosen = rating_loads(loads, adtt=adtt, long_span=longest >= LONG_SPAN_FT)
    one_lane = _single_lane(dist, single_lane) if any(r.single_lane for r in chosen) else None
    phi_c, phi_s = condition_factor(condition), system_factor(system)
    sections = envelope_sections(beam, divisions, at)
    actions = tuple(a for a in ("moment", "shear")
                    if a in resistances.actions or (service is not None and a in service.actions))
    capacity = {a: _capacity_record(phi_c, phi_s, resistances.phi[a]) for a in resistances.actions}
    # the permanent effects of every rated row, by category
    by_cat = permanent.by_category()
    by_cat = by_cat[by_cat["quantity"].isin(actions)]
    categories = [c for c in by_cat.columns if c not in ("quantity", "x", "side")]
    dead: dict[tuple[str, float, str], dict[str, float]] = {
        (row[0], float(row[1]), row[2]): dict(zip(categories, map(float, row[3:])))
        for row in by_cat.itertuples(index=False)}
    keys = [(a, s.x, s.side) for a in actions for s in sections]
    missing = [k for k in keys if (k[0], float(k[1]), k[2] or "") not in dead]
    if missing:
        a, x, side = missing[0]
        raise RatingInputError(
            f"rate_girder: the permanent effects have no {a} at x={fmt(x)}{f' ({side})' if side else ''}; "
            f"compute them at the rated sections: permanent_effects(..., divisions={divisions}, at=...), with "
            "moment and shear.", field="permanent")
    lines = [beam.line(a, x, side) for a, x, side in keys]
    states = {r.name: rating_limit_state(r.limit_state, r.live_factor, permanent=dead_factors,
                                         wearing_surface_measured=wearing_surface_measured) for r in chosen}
    service_states = {} if service is None else {
        r.name: LimitState("Service II", {"*": (1.0, 1.0)}, service_live_factor(r.level).value,
                           source=service_live_factor(r.level).source, from_memory=True,
                           notes="dead loads unfactored; no φ, φc or φs") for r in chosen}
    for state in states.values():  # an unknown category is named before any search
        for c in categories:
            try:
                state.factors_of(c)
            except DesignInputError as err:
                raise RatingInputError(f"{err} (rate_girder: dead_factors={{{c!r}: (γmax, γmin)}})",
                                       field="dead_factors", value=c) from None
    searched: dict[LoadModel, list[Extremes]] = {}
    found: dict[tuple[str, str, Fraction, str | None], Extremes] = {}
    live_factors: dict[str, Mapping[str, Applied]] = {}
    service_factors: dict[str, Mapping[str, Applied]] = {}
    rows: list[dict[str, Any]] = []
    notes: list[str] = []
    for r in chosen:
        if r.model not in searched:
            try:
                searched[r.model] = extremes_of(lines, r.model, beam=beam)
            except LoadInputError as err:
                raise RatingInputError(f"{r.name}: {err}", field="loads", value=r.name) from None
        ext = searched[r.model]
        girder = GirderLiveLoad(r.model, distribution=one_lane if r.single_lane else dist, name=r.name)
        record = {a: girder.factors(a).then(r.live_factor) for a in actions}  # type: ignore[arg-type]
        live_factors[r.name] = MappingProxyType(record)
        checks = [(r.limit_state, states[r.name], resistances, capacity, resistances.actions)]
        if service is not None:
            gamma = service_live_factor(r.level)
            service_factors[r.name] = MappingProxyType(
                {a: girder.factors(a).then(gamma) for a in service.actions})  # type: ignore[arg-type]
            checks.append(("Service II", service_states[r.name], service, None, service.actions))
        scale = {a: girder.scale(a) for a in actions}  # type: ignore[arg-type]
        noise = 1e-9 * max((max(abs(e.maximum.value), abs(e.minimum.value)) for e in ext), default=0.0)
        for (a, x, side), e in zip(keys, ext):
            found[(r.name, a, x, side)] = e
            by = dead[(a, float(x), side or "")]
            for sense, extreme in (("positive", e.maximum), ("negative", e.minimum)):
                value = extreme.value
                if (value <= noise) if sense == "positive" else (value >= -noise):
                    continue
                live = scale[a] * value
                for name, state, given, record_of, rated in checks:
                    if a not in rated or (record_of is None and not given.covers(a, sense)):  # type: ignore[union-attr]
                        continue
                    rn = given.nominal(a, sense, float(x), side)  # type: ignore[union-attr, arg-type]
                    c = (record_of[a].product if record_of is not None else 1.0) * rn
                    d = _dead_of(by, state, sense)  # type: ignore[arg-type]
                    rows.append({
                        "vehicle": r.name, "level": r.level, "limit_state": name, "quantity": a,
                        "x": float(x), "side": side or "", "sense": sense,
                        "RF": _rf(c, d, live, state.live, sense),  # type: ignore[arg-type]
                        "capacity": c, "Rn": rn, "dead": d, "live": live, "gamma_LL": state.live,
                        "case": extreme.case, "placement": _placement_words(extreme),
                    })
        if r.level == "legal" and r.model.name == "lane-type legal load" and longest < LONG_SPAN_FT:
            notes.append(f"{r.name}: every span is shorter than {fmt(LONG_SPAN_FT)} ft, so only the two-truck case "
                         "for negative moment and interior reactions applies (MBE 6A.4.4.2.1, from memory).")
    if one_lane is not None:
        notes.append(f"Special permits: {one_lane.method}.")
    if phi_c.value * phi_s.value < PHI_CS_MINIMUM:
        notes.append(f"φc·φs = {phi_c.value * phi_s.value:.4g} is taken as 0.85 (MBE 6A.4.2.1, from memory).")
    frame = pd.DataFrame(rows, columns=["vehicle", "level", "limit_state", "quantity", "x", "side", "sense", "RF",
                                        "capacity", "Rn", "dead", "live", "gamma_LL", "case", "placement"])
    if frame.empty:
        raise RatingInputError("rate_girder: no rating load causes any effect at the rated sections.", field="loads")
    finite = np.isfinite(frame["RF"].to_numpy(dtype=float))
    if not finite.all():
        raise RatingInputError("rate_girder: a rating factor is not finite; check the resistances and loads.",
                               field="resistances")
    return GirderRating(
        beam, frame, chosen, resistances, permanent, dist, one_lane, phi_c, phi_s, MappingProxyType(capacity),
        MappingProxyType(live_factors), MappingProxyType(states), sections, tuple(notes), MappingProxyType(found),
        MappingProxyType({k: MappingProxyType(v) for k, v in dead.items()}), service,
        MappingProxyType(service_states), MappingProxyType(service_factors))
