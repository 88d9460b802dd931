"""Per-girder tasks: one pure function of one validated record gives that girder's result rows.

A task is a picklable object with

* ``describe() -> dict``: its settings as plain data (a resumed run must have the same);
* ``__call__(record) -> GirderResult``: the girder's tidy rows and its summary row, computed from the
  record alone (no files, no shared state), so that the runner may call it in any process, in any
  order, and get the same numbers.

:class:`EnvelopeTask` is the design-effects task (live-load envelopes of load models, factored
envelopes of limit states); another kind of task (a load rating) is one more class with the same two
methods, and the runner does not change.  Signs and units are those of :mod:`ilkit.model` and of the
record's unit system.
"""

from __future__ import annotations

from collections.abc import Sequence
from dataclasses import dataclass, field
from fractions import Fraction
from typing import TYPE_CHECKING, Any, Protocol

from ilkit._check import listed, whole
from ilkit.batch.inventory import LIVE_MODELS, Record, live_model
from ilkit.errors import BatchInputError, InventoryError

if TYPE_CHECKING:  # pragma: no cover
    import pandas as pd

    from ilkit.design import FactoredEnvelope, LiveEnvelope
    from ilkit.model import Beam

__all__ = ["GirderResult", "GirderTask", "EnvelopeTask", "RatingTask", "girder_results", "ROW_COLUMNS",
           "RATING_COLUMNS", "QUANTITIES"]

ROW_COLUMNS = ("girder", "section", "x", "side", "quantity", "load", "kind", "max", "min", "max_case", "min_case")
"""The columns of the envelope task's rows: the girder's id; the section (``"span 2 at 0.30"``, ``"support
3"``), its position ``x`` (record units) and face ``side`` (``"left"``, ``"right"`` or ``""``); the
``quantity`` (``"moment"``, ``"shear"``, ``"reaction"``); the ``load`` (a load model's or a limit state's
name) and its ``kind`` (``"load model"``: the girder's unfactored live load; ``"limit state"``: factored
permanent and live loads); the extremes ``max`` and ``min`` (force·length or force) and the governing
live-load case of each."""

QUANTITIES = ("moment", "shear", "reaction")


@dataclass(frozen=True)
class GirderResult:
    """One girder's result: ``rows`` (a tidy DataFrame) and ``summary`` (one row, a dict of plain values)."""

    rows: pd.DataFrame = field(repr=False)
    summary: dict[str, Any]


class GirderTask(Protocol):
    """What the runner needs of a per-girder task: ``describe()``, its settings as plain data (a resumed run
    must have the same), and ``task(record)``, the girder's :class:`GirderResult` computed from the validated
    record alone (values in the record's units, signs of :mod:`ilkit.model`)."""

    def describe(self) -> dict[str, Any]:
        """The task's settings as plain data (JSON-able)."""
        ...

    def __call__(self, record: Record) -> GirderResult:
        """One girder's rows and summary (record units, signs of :mod:`ilkit.model`)."""
        ...


def girder_results(record: Record, task: GirderTask) -> GirderResult:
    """One girder's results: ``task`` applied to the validated ``record`` (pure: the same record and task
    give the same rows in any process)."""
    return task(record)


@dataclass(frozen=True)
class EnvelopeTask:
    """Design effects of each girder at the sections of an envelope (``divisions`` parts per span and
    overhang: tenth points by default; both faces at interior supports and releases).

    ``models``: load models (names of :data:`~ilkit.batch.LIVE_MODELS`, tables ``{"model": ...}``, or
    :class:`ilkit.LoadModel` objects); each gives the girder's live-load envelope (one lane's exact
    envelope times the girder's share: :func:`ilkit.design.live_envelope`).  ``limit_states``: names
    (``"Strength I"``) or :class:`ilkit.design.LimitState` objects; they combine the record's permanent
    loads with its live load (the record's ``live``, else the first of ``models``) in a factored envelope
    (:func:`ilkit.design.factored_envelope`); where that live load is HL-93, the AASHTO fatigue limit states
    (``"Fatigue I"``, ``"Fatigue II"``) take the fatigue truck in one lane without multiple presence instead
    (:meth:`ilkit.batch.Record.fatigue_live_load`; a record with a ``distribution`` gives its ``one_lane``
    factors).  A limit state that does not suit the live load (a fatigue limit state with LM1) fails the
    girder with a typed error.  With neither, each girder's own ``live`` is enveloped.
    """

    models: tuple[Any, ...] = ()
    limit_states: tuple[Any, ...] = ()
    divisions: int = 10

    def __post_init__(self) -> None:
        from ilkit.design import limit_states
        from ilkit.loads import LoadModel

        models = tuple(_sequence(self.models, "models"))
        for m in models:
            if not isinstance(m, LoadModel):
                try:
                    live_model(m, field="models")
                except InventoryError as err:
                    raise BatchInputError(str(err), field="models", value=m) from None
        states = tuple(_sequence(self.limit_states, "limit_states"))
        if states:
            limit_states(list(states))  # an unknown name is refused now, before any girder
        n = whole(self.divisions, what="EnvelopeTask: divisions", field="divisions", minimum=1,
                  error=BatchInputError)
        object.__setattr__(self, "models", models)
        object.__setattr__(self, "limit_states", states)
        object.__setattr__(self, "divisions", n)

    def describe(self) -> dict[str, Any]:
        """The settings as plain data: ``{"task": "envelope", "models": [...], "limit_states": [...],
        "divisions": n}``."""
        from ilkit.loads import LoadModel

        return {"task": "envelope",
                "models": [repr(m) if isinstance(m, LoadModel) else m for m in self.models],
                "limit_states": [s if isinstance(s, str) else repr(s) for s in self.limit_states],
                "divisions": self.divisions}

    def compute(self, record: Record) -> list[tuple[str, str, LiveEnvelope | FactoredEnvelope]]:
        """The design results of one girder: ``(load, kind, result)`` per load model
        (:class:`~ilkit.design.LiveEnvelope`) and one for the limit states
        (:class:`~ilkit.design.FactoredEnvelope`); the objects a calculation sheet shows."""
        from ilkit.design import factored_envelope, limit_states, live_envelope, permanent_effects
        from ilkit.loads import LoadModel

        beam = record.beam()
        n = self.divisions
        out: list[tuple[str, str, Any]] = []
        specs = list(self.models)
        if not specs and not self.limit_states:
            if "live" not in record.data:
                raise InventoryError(f"live: the record names no live load and the run gives no models; give live = "
                                     f"'HL-93' (or another of {', '.join(LIVE_MODELS)}).", record=record.id,
                                     field="live")
            specs = [record.data["live"]]
        states = limit_states(list(self.limit_states)) if self.limit_states else ()
        parts = any(s.live_parts for s in states)
        envelopes: dict[str, LiveEnvelope] = {}
        for spec in specs:
            model = spec if isinstance(spec, LoadModel) else live_model(spec, field="models")
            env = live_envelope(beam, record.live_load(model), divisions=n, parts=parts)
            envelopes[repr(spec)] = env
            out.append((env.live.name, "load model", env))
        if states:
            own = record.data.get("live")
            if own is None and not specs:
                raise InventoryError("live: the limit states need the girder's live load; give the record a live "
                                     "load (live = 'HL-93') or the run a model.", record=record.id, field="live")
            spec = own if own is not None else specs[0]
            live: dict[str, LiveEnvelope] = {}
            fatigue = [s for s in states if _is_fatigue(s)] if _is_hl93(spec) else []
            if fatigue:  # AASHTO fatigue: the fatigue truck, one lane, no multiple presence
                truck = live_envelope(beam, record.fatigue_live_load(), divisions=n,
                                      parts=any(s.live_parts for s in fatigue))
                live.update({s.name: truck for s in fatigue})
            if len(live) < len(states):
                env = envelopes.get(repr(spec))
                if env is None:
                    model = live_model(own, record=record.id) if own is not None else live_model(specs[0])
                    env = live_envelope(beam, record.live_load(model), divisions=n, parts=parts)
                live["*"] = env
            loads = record.permanent_loads()
            if not loads:  # no permanent load given: a zero one, so that every section has its (zero) row
                from ilkit.design import DistributedLoad

                loads = [DistributedLoad("no permanent load", "DC", 0)]
            permanent = permanent_effects(beam, loads, divisions=n, quantities=list(QUANTITIES))
            out.append(("limit states", "limit state",
                        factored_envelope(beam, permanent=permanent, live=live, limit_states=states, divisions=n)))
        return out

    def __call__(self, record: Record) -> GirderResult:
        """The girder's rows (:data:`ROW_COLUMNS`) and summary (the governing extremes of each quantity)."""
        import pandas as pd

        beam = record.beam()
        frames = []
        for load, kind, result in self.compute(record):
            f = result.frame
            names = f["limit_state"] if kind == "limit state" else load
            frames.append(pd.DataFrame({
                "girder": record.id, "section": _labels(beam, f), "x": f["x"].to_numpy(dtype=float),
                "side": f["side"].to_numpy(), "quantity": f["quantity"].to_numpy(), "load": names, "kind": kind,
                "max": f["max"].to_numpy(dtype=float), "min": f["min"].to_numpy(dtype=float),
                "max_case": f["max_case"].astype(str).to_numpy(), "min_case": f["min_case"].astype(str).to_numpy(),
            }))
        rows = pd.concat(frames, ignore_index=True)[list(ROW_COLUMNS)]
        return GirderResult(rows, _summary(record, beam, rows))


def _is_fatigue(state: Any) -> bool:
    """An AASHTO fatigue limit state: the fatigue truck's dynamic allowance (15 %), no multiple presence."""
    return (not state.multiple_presence and state.dynamic_allowance is not None
            and abs(state.dynamic_allowance - 0.15) < 1e-9)


def _is_hl93(spec: object) -> bool:
    """True when a live-load spec (a name, a table or a LoadModel) is AASHTO's HL-93."""
    from ilkit.loads import LoadModel

    if isinstance(spec, LoadModel):
        from ilkit.loads import hl93

        return spec.name == hl93().name
    name = spec.get("model") if isinstance(spec, dict) else spec
    return name == "HL-93"


def _sequence(value: object, name: str) -> list[Any]:
    if value is None:
        return []
    if isinstance(value, (str, dict)) or not isinstance(value, Sequence):
        return [value]
    return listed(value, wanted=f"{name}: give a list", field=name, error=BatchInputError)


def _labels(beam: Beam, frame: pd.DataFrame) -> list[str]:
    """Readable names of the sections: ``"span 2 at 0.30"`` (the fraction of the span), ``"left overhang at
    0.50"``, ``"support 3"`` for reactions."""
    supports = [float(s.at) for s in beam.supports]
    length = float(beam.length)
    out = []
    for q, x, side in zip(frame["quantity"], frame["x"], frame["side"]):
        if q == "reaction":
            out.append(f"support {supports.index(min(supports, key=lambda s: abs(s - x))) + 1}")
            continue
        out.append(_section_label(supports, length, float(x), side))
    return out


def _section_label(supports: list[float], length: float, x: float, side: str) -> str:
    tol = 1e-9 * length
    ends = [0.0, *supports, length] if supports[0] > tol else [*supports, length]
    if ends[-2] >= length - tol:
        ends = ends[:-1]
    for i in range(len(ends) - 1):
        a, b = ends[i], ends[i + 1]
        inside = a - tol <= x <= b + tol
        at_end = abs(x - b) <= tol
        if inside and not (at_end and side == "right" and i + 2 < len(ends)):
            span = b - a
            frac = (x - a) / span if span > 0 else 0.0
            if a < supports[0] - tol:
                name = "left overhang"
            elif b > supports[-1] + tol:
                name = "right overhang"
            else:
                name = f"span {supports.index(a) + 1}"
            return f"{name} at {frac:.2f}"
    return f"x = {x:g}"  # pragma: no cover - every section is on the beam


def _summary_head(record: Record, beam: Beam, rows: pd.DataFrame) -> dict[str, Any]:
    """The first fields of a girder's summary: id, units, length, spans and the number of rows."""
    supports = [s.at for s in beam.supports]
    spans = [supports[i + 1] - supports[i] for i in range(len(supports) - 1)]
    return {"girder": record.id, "units": beam.units.name if beam.units else "", "length": float(beam.length),
            "spans": ", ".join(_fmt(s) for s in spans), "rows": len(rows)}


def _summary(record: Record, beam: Beam, rows: pd.DataFrame) -> dict[str, Any]:
    """The governing extremes of each quantity over every section and load: value, ``x``, load and case."""
    out = _summary_head(record, beam, rows)
    for q in QUANTITIES:
        part = rows[rows["quantity"] == q]
        for which in ("max", "min"):
            if part.empty:
                out.update({f"{q}_{which}": float("nan"), f"{q}_{which}_x": float("nan"), f"{q}_{which}_load": "",
                            f"{q}_{which}_case": ""})
                continue
            i = part[which].idxmax() if which == "max" else part[which].idxmin()
            out.update({f"{q}_{which}": float(part.at[i, which]), f"{q}_{which}_x": float(part.at[i, "x"]),
                        f"{q}_{which}_load": str(part.at[i, "load"]),
                        f"{q}_{which}_case": str(part.at[i, f"{which}_case"])})
    return out


def _fmt(value: Fraction) -> str:
    return f"{float(value):g}"


RATING_COLUMNS = ("girder", "section", "x", "side", "quantity", "sense", "vehicle", "level", "limit_state", "RF",
                  "Rn", "capacity", "dead", "live", "gamma_LL", "case", "placement")
"""The columns of the rating task's rows (``frame`` of :class:`ilkit.rating.GirderRating`, one row per section, face,
action, sense and vehicle): the girder's id, the ``section`` (``"span 2 at 0.30"``), ``x`` (record units) and
``side``; ``quantity`` (``"moment"``, ``"shear"``) and ``sense`` (``"positive"``: sagging moment, positive
shear; ``"negative"``); the ``vehicle``, its ``level`` (``"design inventory"``, ``"legal"``, ``"permit"`` ...)
and ``limit_state``; the rating factor ``RF`` (dimensionless); ``Rn`` and ``capacity`` (C = φc φs φ Rn,
magnitudes), ``dead`` (Σ γp P of the sense, signed) and ``live`` (LL + IM, the girder's share, unfactored,
signed), in the record's units; ``gamma_LL``; the governing ``case`` of the vehicle's model and its
``placement`` in words."""


@dataclass(frozen=True)
class RatingTask:
    """The load rating of each girder (LRFR, :func:`ilkit.rating.rate_girder`) from its record: its beam,
    permanent loads (``permanent``), share of a lane (``distribution``, or ``lanes`` and
    ``multiple_presence``, or one lane) and nominal resistances (``resistance``, required: a record without
    one fails with an error naming the field ``resistance``).

    ``loads``: rating loads, names of :func:`ilkit.rating.rating_loads` (``"design"``, ``"legal"``,
    ``"emergency"``, ``"Type 3"`` ...) or :class:`ilkit.rating.RatingLoad` objects (a permit:
    :func:`ilkit.rating.permit_load`).  ``adtt`` (trucks a day in one direction) sets γLL of the legal loads;
    ``condition`` and ``system``: φc and φs (:func:`ilkit.rating.condition_factor`,
    :func:`ilkit.rating.system_factor`), the same for every girder; ``divisions``: parts per span (tenth points);
    ``wearing_surface_measured``: γDW 1.25 instead of 1.50.  A special permit takes the one-lane distribution
    with multiple presence taken out: a record's ``distribution.one_lane``, or one lane.

    The rows (:data:`RATING_COLUMNS`) hold every rating factor; the summary the controlling one of the girder
    (``RF``, with ``RF_vehicle``, ``RF_where``, ``RF_x``) and of each vehicle (``"RF: Type 3"``,
    ``"where: Type 3"``, ``"x: Type 3"``, ``"rating tons: Type 3"`` and ``"posting: Type 3"``, the posting load
    in tons where the Manual's relation gives one; NaN where it does not apply).  Values recalled from the
    Manual are marked from memory in :mod:`ilkit.rating.factors`; a rating must be checked and sealed by a
    licensed engineer under the owner's rules.
    """

    loads: tuple[Any, ...] = ("design", "legal")
    adtt: float | None = None
    condition: Any = "good"
    system: Any = "all other girder bridges and slab bridges"
    divisions: int = 10
    wearing_surface_measured: bool = False

    def __post_init__(self) -> None:
        from ilkit._check import flag
        from ilkit.rating import condition_factor, rating_loads, system_factor

        loads = tuple(_sequence(self.loads, "loads"))
        rating_loads(list(loads), adtt=self.adtt)  # an unknown vehicle or a bad ADTT is refused before any girder
        condition_factor(self.condition)
        system_factor(self.system)
        n = whole(self.divisions, what="RatingTask: divisions", field="divisions", minimum=1, error=BatchInputError)
        measured = flag(self.wearing_surface_measured, what="RatingTask: wearing_surface_measured",
                        field="wearing_surface_measured", error=BatchInputError)
        object.__setattr__(self, "loads", loads)
        object.__setattr__(self, "divisions", n)
        object.__setattr__(self, "wearing_surface_measured", measured)

    def describe(self) -> dict[str, Any]:
        """The settings as plain data: ``{"task": "rating", "loads": [...], "adtt": ..., "condition": ...,
        "system": ..., "divisions": n, "wearing_surface_measured": ...}``."""
        def plain(value: Any) -> Any:
            return value if value is None or isinstance(value, (str, int, float)) else repr(value)

        return {"task": "rating", "loads": [plain(x) for x in self.loads], "adtt": plain(self.adtt),
                "condition": plain(self.condition), "system": plain(self.system), "divisions": self.divisions,
                "wearing_surface_measured": self.wearing_surface_measured}

    def compute(self, record: Record) -> list[tuple[str, str, Any]]:
        """The rating of one girder: ``[("rating", "rating", GirderRating)]`` (the object a rating sheet shows,
        :class:`ilkit.rating.GirderRating`)."""
        from ilkit.design import DistributedLoad, permanent_effects
        from ilkit.errors import RatingInputError
        from ilkit.rating import rate_girder

        resistances = record.resistance()
        if resistances is None:
            raise InventoryError("resistance: a rating run needs the girder's nominal resistances; give resistance = "
                                 "{positive_moment = ..., negative_moment = ..., shear = ...} (record units).",
                                 record=record.id, field="resistance")
        beam = record.beam()
        loads = record.permanent_loads() or [DistributedLoad("no permanent load", "DC", 0)]
        permanent = permanent_effects(beam, loads, divisions=self.divisions, quantities=["moment", "shear"])
        distribution, single_lane = _rating_shares(record)
        try:
            rated = rate_girder(beam, permanent=permanent, resistances=resistances, distribution=distribution,
                                loads=list(self.loads), adtt=self.adtt, condition=self.condition, system=self.system,
                                single_lane=single_lane, divisions=self.divisions,
                                wearing_surface_measured=self.wearing_surface_measured)
        except RatingInputError as err:  # named by the record's field where one is at fault
            if err.field == "single_lane":
                err.field = "distribution.one_lane"
            elif err.field == "dead_factors":
                err.field = "permanent"
            raise
        return [("rating", "rating", rated)]

    def __call__(self, record: Record) -> GirderResult:
        """The girder's rows (:data:`RATING_COLUMNS`) and summary (the controlling rating, overall and per
        vehicle)."""
        import pandas as pd

        rated = self.compute(record)[0][2]
        beam = rated.beam
        f = rated.frame
        rows = pd.DataFrame({"girder": record.id, "section": _labels(beam, f), **{c: f[c] for c in RATING_COLUMNS[2:]}})
        supports = [float(s.at) for s in beam.supports]
        out = _summary_head(record, beam, rows)
        controlling = rated.controlling()
        where = [f"{_section_label(supports, float(beam.length), float(c.x), str(c.side))}, {c.sense} {c.quantity}"
                 for c in controlling.itertuples(index=False)]
        worst = int(controlling["RF"].to_numpy().argmin())  # the first vehicle rated of the smallest RF
        out.update({"RF": float(controlling["RF"].iat[worst]), "RF_vehicle": str(controlling["vehicle"].iat[worst]),
                    "RF_where": where[worst], "RF_x": float(controlling["x"].iat[worst])})
        for c, words in zip(controlling.itertuples(index=False), where):
            out.update({f"RF: {c.vehicle}": float(c.RF), f"where: {c.vehicle}": words, f"x: {c.vehicle}": float(c.x),
                        f"rating tons: {c.vehicle}": float(c.rating_tons), f"posting: {c.vehicle}": float(c.posting)})
        return GirderResult(rows.reset_index(drop=True), out)


def _rating_shares(record: Record) -> tuple[Any, Any]:
    """The distribution a rating takes from a record, and the one-lane one for special permits (``None``: from
    the distribution's ``one_lane``): a ``distribution`` as given; ``lanes`` × ``multiple_presence`` (one lane
    without multiple presence for special permits); one lane where neither is given."""
    from ilkit._exact import to_exact
    from ilkit.batch.inventory import _whole_text
    from ilkit.design import given_distribution

    given = record.distribution()
    if given is not None:
        return given, None
    lanes = int(_whole_text(record.data.get("lanes", 1)))  # type: ignore[call-overload]
    m = record.data.get("multiple_presence")
    share = lanes * (1.0 if m is None else float(to_exact(m, field="multiple_presence", error=InventoryError)))
    words = f"{lanes} lane{'s' if lanes > 1 else ''} on the girder line" + ("" if m is None else f" × m {m}")
    return (given_distribution(share, includes_multiple_presence=m is not None, girder=record.id,
                               source="inventory", note=words),
            given_distribution(1, girder=record.id, source="inventory", note="one lane, no multiple presence"))
