"""Girder inventories: the file format, reading and validation of every record.

An inventory is a list of girder records; each record is data (numbers,
words, lists and tables), never code.  Files:

* ``.toml`` or ``.json`` for hand-written inventories: a table ``defaults``
  (fields every record takes unless it gives its own) and a list
  ``girders`` of records (a JSON file may also be the bare list);
* ``.csv`` or ``.parquet`` for large tables: one row per girder, one column
  per field; a cell holding a list or a table is JSON text (``[90, 115,
  90]``, ``{"moment": 0.62}``); an empty cell leaves the field out.  CSV
  cells are read as text, so decimals stay exact (``0.1`` is 1/10).

Nothing in a file is evaluated: TOML and JSON are parsed as data, Parquet
columns are read as values (no pickled objects), and load models are named
from a closed list (:data:`LIVE_MODELS`).

A record (the fields, their units and meaning are in :data:`FIELDS` and the
README):

``id`` (required)
    The girder's id, free text (``"B-1021 G3"``); unique in the inventory.
``units`` (required)
    ``"kip-ft"`` or ``"kN-m"`` (:data:`ilkit.SYSTEMS`): every number of the
    record is in these units.
``spans`` or ``length`` + ``supports``
    ``spans``: the span lengths of a girder continuous over its supports (a
    pin at the left end, rollers elsewhere); or ``length`` and ``supports``
    as for :class:`ilkit.Beam` (``{"0": "pin", "90": "roller"}`` or
    ``[[0, "pin"], [90, "roller"]]``).
``hinges``, ``shear_releases``, ``EI``, ``panel_points``
    As for :class:`ilkit.Beam` (``EI``: one number or ``[[start, end, EI],
    ...]``).
``live``
    The girder's live load: a name of :data:`LIVE_MODELS` (``"HL-93"``) or a
    table ``{model = "cooper", n = 80, impact = 0.25}`` whose other keys are
    the model function's arguments.
``distribution`` or ``lanes`` (+ ``multiple_presence``)
    The girder's share of one lane's load: ``{moment = 0.62, shear = 0.78,
    deflection = 0.5, includes_multiple_presence = true}``
    (:func:`ilkit.design.given_distribution`), or a number of lanes on the
    girder line and a multiple presence factor.  Neither: one lane.
``permanent``
    A list of permanent loads, each a table with ``name``, ``category``
    (``"DC"``, ``"DW"`` ...) and one of ``intensity`` (force/length; with
    ``start``/``end`` or ``span``), ``load`` + ``at`` (a point load), or
    ``settlement`` + ``at`` (a support settles, length, downward).
``resistance``
    Optional, for rating runs (:class:`ilkit.batch.RatingTask`): the nominal
    resistances Rn (:class:`ilkit.rating.Resistances`), magnitudes in the
    record's units: ``{positive_moment = [[0, 90, 5200], [90, 205, 6100]],
    negative_moment = 6000, shear = 520, phi_moment = 1.0, phi_shear =
    1.0}``: each action a number or ``[[start, end, value], ...]`` ranges,
    ``moment`` for both senses at once, the resistance factors φ optional
    (1.0).

Validation builds the record's beam, loads and live load exactly as a
single-girder study would, so a bad record raises the same typed errors as
:class:`ilkit.Beam` and the design layer (:class:`ilkit.BeamInputError`,
:class:`ilkit.UnstableBeamError`, :class:`ilkit.UnitsError`,
:class:`ilkit.LoadInputError` ...); :func:`read_inventory` keeps the valid
records and reports each bad one with its id and field
(:class:`RecordError`) without stopping at it.
"""

from __future__ import annotations

import hashlib
import json
import math
import sys
from collections.abc import Callable, Mapping, Sequence
from dataclasses import dataclass, field
from pathlib import Path
from typing import TYPE_CHECKING, Any

from ilkit.errors import BatchInputError, IlkitError, InventoryError, UnstableBeamError

if TYPE_CHECKING:  # pragma: no cover
    import pandas as pd

    from ilkit.design import Distribution, GirderLiveLoad, PermanentLoad
    from ilkit.loads import LoadModel
    from ilkit.model import Beam
    from ilkit.rating import Resistances

__all__ = [
    "FIELDS",
    "LIVE_MODELS",
    "Inventory",
    "Record",
    "RecordError",
    "read_inventory",
    "validate_record",
    "live_model",
]

FIELDS: Mapping[str, str] = {
    "id": "the girder's id, free text, unique in the inventory (required)",
    "units": "'kip-ft' or 'kN-m': the units of every number of the record (required)",
    "spans": "span lengths of a girder continuous over its supports: pin at the left end, rollers elsewhere",
    "length": "total length, overhangs included (with supports, instead of spans)",
    "supports": "{position: 'fixed' | 'pin' | 'roller'} or [[position, kind], ...] (with length)",
    "hinges": "positions of internal moment releases",
    "shear_releases": "positions of internal shear releases",
    "EI": "flexural stiffness (force x length²): one number, or [[start, end, EI], ...]",
    "panel_points": "positions of the floor beams of a floor system",
    "live": "the live load: a name of LIVE_MODELS, or {model = name, argument = value, ...}",
    "distribution": "{moment, shear, deflection, includes_multiple_presence, one_lane}: the girder's share in lanes",
    "lanes": "number of lanes on the girder line (without a distribution)",
    "multiple_presence": "multiple presence factor (with lanes)",
    "permanent": "permanent loads: [{name, category, intensity [start, end | span] | load, at | settlement, at}]",
    "resistance": "nominal resistances for rating: {positive_moment, negative_moment, shear (a number or [[start, "
                  "end, value], ...]), moment (both senses), phi_moment, phi_shear}",
}
"""Every field of a record and what it holds (units: the record's ``units``)."""

_JSON_FIELDS = ("spans", "supports", "hinges", "shear_releases", "EI", "panel_points", "live", "distribution",
                "permanent", "resistance")
"""Fields whose value may be a list or a table: in a CSV or Parquet cell, JSON text."""


def _models() -> dict[str, Callable[..., LoadModel]]:
    from ilkit import loads

    return {"HL-93": loads.hl93, "fatigue truck": loads.fatigue_truck, "LM1": loads.lm1, "LM2": loads.lm2,
            "LM71": loads.lm71, "SW/0": loads.sw0, "SW/2": loads.sw2, "Cooper": loads.cooper}


LIVE_MODELS: tuple[str, ...] = ("HL-93", "fatigue truck", "LM1", "LM2", "LM71", "SW/0", "SW/2", "Cooper")
"""The load models a record or a run may name (:mod:`ilkit.loads`: ``hl93``, ``fatigue_truck``, ``lm1``,
``lm2``, ``lm71``, ``sw0``, ``sw2``, ``cooper``); the rail models need their dynamic factor or impact
(``{model = "LM71", dynamic_factor = 1.2}``, ``{model = "Cooper", n = 80, impact = 0.25}``)."""


def live_model(spec: object, *, field: str = "live", record: str | None = None) -> LoadModel:
    """The load model named by ``spec``: a name of :data:`LIVE_MODELS` or a mapping ``{"model": name,
    argument: value, ...}``; an unknown name or argument is an :class:`ilkit.InventoryError` naming the
    known ones (the model's own errors keep their types)."""
    factories = _models()
    if isinstance(spec, str):
        name, arguments = spec, {}
    elif isinstance(spec, Mapping) and isinstance(spec.get("model"), str):
        name, arguments = spec["model"], {k: v for k, v in spec.items() if k != "model"}
    else:
        raise InventoryError(
            f"{field}: give a load model name ({', '.join(LIVE_MODELS)}) or a table such as "
            f"{{model = 'Cooper', n = 80, impact = 0.25}}, got {spec!r}.", record=record, field=field, value=spec)
    if name not in factories:
        raise InventoryError(f"{field}: unknown load model {name!r}; choose from {', '.join(LIVE_MODELS)}.",
                             record=record, field=field, value=name)
    factory = factories[name]
    import inspect

    known = [p for p in inspect.signature(factory).parameters]
    unknown = sorted(set(arguments) - set(known))
    if unknown:
        raise InventoryError(f"{field}: {name} takes no argument {unknown}; it takes {', '.join(known)}.",
                             record=record, field=field, value=unknown)
    try:
        return factory(**arguments)
    except IlkitError as err:  # an argument of the model: named under the field
        given = getattr(err, "field", None)
        _set_field(err, f"{field}.{given}" if isinstance(given, str) and given in known else field)
        raise


@dataclass(frozen=True)
class Record:
    """One validated girder record: its ``id``, its fields as given (``data``, plain values) and ``digest``, a
    fingerprint of the fields (a changed record is computed again by a resumed run).

    The builders give the objects of a single-girder study: :meth:`beam`, :meth:`permanent_loads`,
    :meth:`live_load`.
    """

    id: str
    data: dict[str, Any] = field(repr=False)
    digest: str = field(repr=False)
    index: int = field(default=0, repr=False)

    def beam(self) -> Beam:
        """The girder's :class:`ilkit.Beam` (units of the record)."""
        from ilkit.model import Beam

        d = self.data
        args: dict[str, Any] = {"units": d["units"]}
        if "spans" in d:
            spans = d["spans"]
            positions: list[Any] = [0]
            for s in spans:
                positions.append(_add(positions[-1], s))
            args["length"] = positions[-1]
            args["supports"] = {p: ("pin" if i == 0 else "roller") for i, p in enumerate(positions)}
        else:
            args["length"] = d["length"]
            supports = d["supports"]
            args["supports"] = dict(supports) if isinstance(supports, Mapping) else {p: k for p, k in supports}
        for name in ("hinges", "shear_releases", "panel_points"):
            if name in d:
                args[name] = d[name]
        if "EI" in d:
            ei = d["EI"]
            args["EI"] = [tuple(r) for r in ei] if isinstance(ei, list) else ei
        return Beam(**args)

    def permanent_loads(self) -> list[PermanentLoad]:
        """The permanent loads of the record (:mod:`ilkit.design`), in the record's units."""
        from ilkit import design

        out: list[PermanentLoad] = []
        given = self.data.get("permanent", [])
        if not isinstance(given, list):
            raise InventoryError(f"permanent: give a list of loads, e.g. [{{name = 'deck', category = 'DC', intensity "
                                 f"= 1.2}}], got {given!r}.", record=self.id, field="permanent", value=given)
        for i, item in enumerate(given):
            where = f"permanent[{i}]"
            if not isinstance(item, Mapping):
                raise InventoryError(f"{where}: give a table with name, category and intensity, load or settlement, "
                                     f"got {item!r}.", record=self.id, field=where, value=item)
            keys = set(item)
            kinds = [k for k in ("intensity", "load", "settlement") if k in keys]
            if len(kinds) != 1:
                raise InventoryError(f"{where}: give exactly one of intensity (a distributed load), load (a point "
                                     f"load) or settlement, got {sorted(keys)}.", record=self.id, field=where,
                                     value=sorted(keys))
            kind = kinds[0]
            allowed = {"intensity": {"name", "category", "intensity", "start", "end", "span"},
                       "load": {"name", "category", "load", "at"},
                       "settlement": {"name", "category", "settlement", "at"}}[kind]
            extra = sorted(keys - allowed)
            if extra:
                raise InventoryError(f"{where}: unknown field(s) {extra} for a load given by {kind}; allowed: "
                                     f"{sorted(allowed)}.", record=self.id, field=f"{where}.{extra[0]}", value=extra)
            missing = sorted({"name", "at"} & allowed - keys) + ([] if kind == "settlement" or "category" in keys
                                                                  else ["category"])
            if missing:
                raise InventoryError(f"{where}: missing {missing}.", record=self.id, field=f"{where}.{missing[0]}")
            try:
                if kind == "settlement":
                    load: PermanentLoad = design.Settlement(item["name"], item["at"], item["settlement"],
                                                            category=item.get("category", "settlement"))
                elif kind == "load":
                    load = design.PointLoad(item["name"], item["category"], item["load"], item["at"])
                elif "span" in item:
                    if "start" in item or "end" in item:
                        raise InventoryError(f"{where}: give span or start/end, not both.", record=self.id,
                                             field=f"{where}.span", value=item["span"])
                    load = design.SpanLoad(item["name"], item["category"], item["intensity"], item["span"])
                else:
                    load = design.DistributedLoad(item["name"], item["category"], item["intensity"],
                                                  item.get("start"), item.get("end"))
            except IlkitError as err:
                _prefix(err, where)
                raise
            out.append(load)
        return out

    def distribution(self) -> Distribution | None:
        """The girder's distribution factors (:func:`ilkit.design.given_distribution`), or ``None``."""
        from ilkit import design

        given = self.data.get("distribution")
        if given is None:
            return None
        if not isinstance(given, Mapping) or "moment" not in given:
            raise InventoryError(f"distribution: give a table with at least moment (lanes), e.g. {{moment = 0.62, "
                                 f"shear = 0.78}}, got {given!r}.", record=self.id, field="distribution", value=given)
        allowed = ("moment", "shear", "deflection", "includes_multiple_presence", "source", "one_lane")
        extra = sorted(set(given) - set(allowed))
        if extra:
            raise InventoryError(f"distribution: unknown field(s) {extra}; allowed: {list(allowed)}.",
                                 record=self.id, field=f"distribution.{extra[0]}", value=extra)
        try:
            found = design.given_distribution(
                given["moment"], given.get("shear"), given.get("deflection"),
                includes_multiple_presence=given.get("includes_multiple_presence", False), girder=self.id,
                source=given.get("source", "inventory"))
        except IlkitError as err:
            _prefix(err, "distribution")
            raise
        if "one_lane" not in given:
            return found
        one = given["one_lane"]
        if not isinstance(one, Mapping) or "moment" not in one or set(one) - {"moment", "shear"}:
            raise InventoryError(f"distribution.one_lane: give the one-lane factors, multiple presence m = 1.20 in "
                                 f"them, as {{moment = 0.45, shear = 0.6}}, got {one!r}.", record=self.id,
                                 field="distribution.one_lane", value=one)
        try:
            single = design.given_distribution(one["moment"], one.get("shear"), includes_multiple_presence=True,
                                               girder=self.id, source=given.get("source", "inventory"),
                                               note="one lane loaded, m = 1.20 in it")
        except IlkitError as err:
            _set_field(err, "distribution.one_lane")
            raise
        from dataclasses import replace

        return replace(found, one_lane=(single.moment, single.shear))

    def live_load(self, model: LoadModel | None = None) -> GirderLiveLoad:
        """The girder's live load: ``model`` (by default the record's ``live``) times its share
        (distribution, or lanes and multiple presence; one lane when neither is given)."""
        from ilkit.design import GirderLiveLoad

        if model is None:
            if "live" not in self.data:
                raise InventoryError("live: the record names no live load; give live = 'HL-93' (or another of "
                                     f"{', '.join(LIVE_MODELS)}), or give the run its models.", record=self.id,
                                     field="live")
            model = live_model(self.data["live"], record=self.id)
        distribution = self.distribution()
        lanes = self.data.get("lanes")
        m = self.data.get("multiple_presence")
        if distribution is not None and (lanes is not None or m is not None):
            raise InventoryError("lanes: give either a distribution or lanes (and multiple_presence), not both.",
                                 record=self.id, field="lanes", value=lanes)
        try:
            return GirderLiveLoad(model, distribution=distribution, lanes=_whole_text(lanes), multiple_presence=m)
        except IlkitError as err:  # named by the record's field it comes from
            given = str(getattr(err, "field", None))
            named = [f for f in ("lanes", "multiple_presence") if f in given]
            _set_field(err, named[0] if named else ("multiple_presence" if given == "factors" else "live"))
            raise

    def fatigue_live_load(self) -> GirderLiveLoad:
        """The girder's fatigue live load for the AASHTO fatigue limit states: the fatigue truck
        (:func:`ilkit.loads.fatigue_truck`, IM 15 %) in one lane, without multiple presence (AASHTO LRFD
        3.6.1.4, 3.6.1.1.2, from memory).  With a ``distribution``, its one-lane factors (``one_lane``) divided
        by 1.20 (:meth:`ilkit.design.Distribution.fatigue`); with ``lanes`` or neither, one lane on the girder
        line.  A distribution without ``one_lane`` raises :class:`ilkit.InventoryError` naming that field."""
        from ilkit.design import GirderLiveLoad
        from ilkit.loads import fatigue_truck

        distribution = self.distribution()
        if distribution is None:
            return GirderLiveLoad(fatigue_truck(), name="fatigue truck, one lane")
        if distribution.one_lane is None:
            raise InventoryError(
                "distribution.one_lane: the fatigue limit states take the fatigue truck with the one-lane factors "
                "and multiple presence removed; give them: distribution = {moment = ..., one_lane = {moment = 0.45, "
                "shear = 0.6}} (one lane loaded, m = 1.20 in them).", record=self.id, field="distribution.one_lane")
        return GirderLiveLoad(fatigue_truck(), distribution=distribution.fatigue(), name="fatigue truck")

    def resistance(self) -> Resistances | None:
        """The nominal resistances for rating (:class:`ilkit.rating.Resistances`, the record's units), or
        ``None`` when the record gives none.  A bad value raises :class:`ilkit.RatingInputError` (a negative
        resistance ...) or :class:`ilkit.InventoryError` (an unknown name), with ``field`` naming it
        (``"resistance.shear"``)."""
        from ilkit.rating import Resistances

        given = self.data.get("resistance")
        if given is None:
            return None
        if not isinstance(given, Mapping) or not given:
            raise InventoryError(f"resistance: give a table of nominal resistances, e.g. {{positive_moment = 5200, "
                                 f"negative_moment = 4800, shear = 610}}, got {given!r}.", record=self.id,
                                 field="resistance", value=given)
        unknown = sorted(set(map(str, given)) - set(RESISTANCE_FIELDS))
        if unknown:
            raise InventoryError(f"resistance: unknown name {unknown[0]!r}; the names are "
                                 f"{', '.join(RESISTANCE_FIELDS)}.", record=self.id,
                                 field=f"resistance.{unknown[0]}", value=unknown)
        values = {str(k): (_ranges(v) if isinstance(v, list) else v) for k, v in given.items()}
        both = values.pop("moment", None)
        if both is not None:
            for sense in ("positive_moment", "negative_moment"):
                if sense in values:
                    raise InventoryError(f"resistance: give moment (both senses) or {sense}, not both.",
                                         record=self.id, field=f"resistance.{sense}", value=values[sense])
                values[sense] = both
        try:
            return Resistances(**values, name=f"{self.id}, from the inventory")
        except IlkitError as err:  # named by the record's own name of the value
            said = str(getattr(err, "field", "") or "").replace(" ", "_")
            name = next((n for n in sorted(RESISTANCE_FIELDS, key=len, reverse=True) if n in said), None)
            if name in ("positive_moment", "negative_moment") and both is not None:
                name = "moment"
            _set_field(err, f"resistance.{name}" if name else "resistance")
            raise


RESISTANCE_FIELDS = ("positive_moment", "negative_moment", "moment", "shear", "phi_moment", "phi_shear")
"""The names a record's ``resistance`` table may hold (:class:`ilkit.rating.Resistances`; ``moment`` gives
both senses)."""

def _ranges(value: list[Any]) -> Any:
    """``[[start, end, value], ...]`` as a list of tuples (a range of another length is left for
    :class:`ilkit.rating.Resistances` to refuse)."""
    return [tuple(r) if isinstance(r, list) else r for r in value]


@dataclass(frozen=True)
class RecordError:
    """A record that failed validation: its ``id`` (``"#n"``, its place in the inventory from 1, when it has
    none), ``index`` (place from 0), the ``field`` at fault, the error's type name (``error``) and its
    ``message``."""

    id: str
    index: int
    field: str
    error: str
    message: str


@dataclass(frozen=True)
class Inventory:
    """A validated inventory: the valid ``records`` and the ``errors`` of the bad ones, in file order;
    ``source`` names where it was read from."""

    records: tuple[Record, ...]
    errors: tuple[RecordError, ...] = ()
    source: str = ""

    def __len__(self) -> int:
        return len(self.records) + len(self.errors)

    def __repr__(self) -> str:
        return f"Inventory({len(self.records)} valid records, {len(self.errors)} with errors{self._from})"

    @property
    def _from(self) -> str:
        return f", from {self.source}" if self.source else ""

    def record(self, girder: str) -> Record:
        """The valid record with id ``girder``."""
        for r in self.records:
            if r.id == girder:
                return r
        bad = [e for e in self.errors if e.id == girder]
        why = f" (it has an error in {bad[0].field}: {bad[0].message})" if bad else ""
        raise InventoryError(f"record: no valid girder {girder!r} in this inventory{why}.", record=girder,
                             field="id", value=girder)

    def errors_frame(self) -> pd.DataFrame:
        """The errors as a table: ``girder``, ``index``, ``field``, ``error``, ``message``."""
        import pandas as pd

        return pd.DataFrame([(e.id, e.index, e.field, e.error, e.message) for e in self.errors],
                            columns=["girder", "index", "field", "error", "message"])


# ------------------------------------------------------------------------------------------------ validation
def validate_record(raw: Mapping[str, Any], index: int = 0, defaults: Mapping[str, Any] | None = None) -> Record:
    """Check one record (a mapping of fields, with ``defaults`` for the fields it leaves out) by building its
    beam, permanent loads and live load; returns the :class:`Record`.  A bad field raises the typed error of
    the object it builds (:class:`ilkit.BeamInputError` ...), or :class:`ilkit.InventoryError`, with
    ``field`` naming the record's field."""
    if not isinstance(raw, Mapping):
        raise InventoryError(f"record #{index + 1}: give a table of fields, got {type(raw).__name__} {raw!r}.",
                             field="record", value=raw)
    data = {**(defaults or {}), **{k: v for k, v in raw.items()}}
    rid = _read_id(data.get("id"), index)
    unknown = sorted(set(data) - set(FIELDS), key=str)
    if unknown:
        raise InventoryError(f"unknown field {unknown[0]!r}; the fields are {', '.join(FIELDS)}.", record=rid,
                             field=str(unknown[0]), value=unknown)
    if "units" not in data:
        raise InventoryError("units: missing; give units = 'kip-ft' or 'kN-m' (every number of the record is in "
                             "them).", record=rid, field="units")
    if "spans" in data:
        if "length" in data or "supports" in data:
            raise InventoryError("spans: give spans, or length and supports, not both.", record=rid, field="spans",
                                 value=data["spans"])
        spans = data["spans"]
        if not isinstance(spans, list) or not spans:
            raise InventoryError(f"spans: give a list of span lengths, e.g. [90, 115, 90], got {spans!r}.",
                                 record=rid, field="spans", value=spans)
    elif "length" not in data or "supports" not in data:
        missing = "spans" if "length" not in data and "supports" not in data else (
            "length" if "length" not in data else "supports")
        raise InventoryError(f"{missing}: missing; give spans = [..] (a continuous girder), or length and supports.",
                             record=rid, field=missing)
    record = Record(rid, data, _digest(data), index)
    try:
        beam = record.beam()
    except UnstableBeamError as err:
        err.field = "hinges" if "hinges" in data else ("spans" if "spans" in data else "supports")  # type: ignore
        raise
    except IlkitError as err:
        f = getattr(err, "field", None)
        if "spans" in data and f in ("length", "supports", None):
            _set_field(err, "spans")
        elif f in FIELDS or f is None:
            _set_field(err, f or "units")
        else:
            _set_field(err, str(f).split(".")[0].split("[")[0])
        raise
    except (TypeError, ValueError) as err:  # a list of the wrong shape (e.g. an EI range of two numbers)
        raise InventoryError(f"the beam's fields are not of the form FIELDS describes: {err}", record=rid,
                             field="EI" if "EI" in data else "supports") from None
    from ilkit.design.permanent import _applied

    for i, load in enumerate(record.permanent_loads()):
        try:
            _applied(load, beam)
        except IlkitError as err:
            _prefix(err, f"permanent[{i}]")
            raise
    if "live" in data:
        record.live_load()
    elif "lanes" in data or "multiple_presence" in data:  # the share, checked with a model the run may give
        record.live_load(_models()["HL-93"]())
    else:
        record.distribution()
    record.resistance()
    return record


def read_inventory(source: str | Path | Sequence[Mapping[str, Any]] | pd.DataFrame | Inventory) -> Inventory:
    """Read and validate an inventory: a file (``.toml``, ``.json``, ``.csv``, ``.parquet``), a list of
    record mappings or a DataFrame (one row per record).  Returns an :class:`Inventory` with the valid
    records and one :class:`RecordError` per bad record (id, field, error type, message); a bad record
    never stops the others.  A file that cannot be read as a whole raises :class:`ilkit.InventoryError`."""
    if isinstance(source, Inventory):
        return source
    name = ""
    defaults: Mapping[str, Any] = {}
    if isinstance(source, (str, Path)):
        path = Path(source)
        name = str(path)
        rows, defaults = _read_file(path)
    elif _is_frame(source):
        rows = _table_rows(source)  # type: ignore[arg-type]
    elif isinstance(source, Sequence) and not isinstance(source, (bytes, bytearray)):
        rows = list(source)
    else:
        raise BatchInputError(f"read_inventory: give a file (.toml, .json, .csv, .parquet), a list of records or a "
                              f"DataFrame, got {type(source).__name__} {source!r}.", field="inventory", value=source)
    records: list[Record] = []
    errors: list[RecordError] = []
    seen: set[str] = set()
    for index, raw in enumerate(rows):
        try:
            record = validate_record(raw, index, defaults)
            if record.id in seen:
                raise InventoryError(f"id: {record.id!r} is given to more than one record; ids must be unique.",
                                     record=record.id, field="id", value=record.id)
            seen.add(record.id)
            records.append(record)
        except IlkitError as err:
            rid = _id_or_place(raw, index, defaults)
            errors.append(RecordError(rid, index, str(getattr(err, "field", None) or "record"), type(err).__name__,
                                      str(err)))
    return Inventory(tuple(records), tuple(errors), name)


# --------------------------------------------------------------------------------------------------- helpers
def _read_id(value: object, index: int) -> str:
    if isinstance(value, bool) or value is None:
        raise InventoryError(f"id: missing; give every record an id (record #{index + 1}).", record=f"#{index + 1}",
                             field="id", value=value)
    if isinstance(value, int):
        value = str(value)
    if not isinstance(value, str) or not value.strip():
        raise InventoryError(f"id: give a non-empty text, got {value!r} (record #{index + 1}).",
                             record=f"#{index + 1}", field="id", value=value)
    if any(ord(c) < 32 or ord(c) == 127 for c in value):
        raise InventoryError(f"id: {value!r} holds control characters; give printable text.", record=f"#{index + 1}",
                             field="id", value=value)
    return value


def _id_or_place(raw: object, index: int, defaults: Mapping[str, Any]) -> str:
    try:
        return _read_id(raw.get("id") if isinstance(raw, Mapping) else None, index)
    except InventoryError:
        return f"#{index + 1}"


def _digest(data: Mapping[str, Any]) -> str:
    text = json.dumps(data, sort_keys=True, default=str, ensure_ascii=False)
    return hashlib.sha256(text.encode("utf-8")).hexdigest()[:20]


def _add(a: Any, b: Any) -> Any:
    """A sum of two positions, exact (numbers read as ilkit reads them)."""
    from ilkit._exact import to_exact

    return to_exact(a, field="spans", error=InventoryError) + to_exact(b, field="spans", error=InventoryError)


def _whole_text(value: object) -> object:
    """A whole number written as text or as a float in a table column (``"2"``, ``"2.0"``, ``2.0``: a column
    with empty cells is a float column) as an int; anything else as it is, for the reader to refuse."""
    from fractions import Fraction

    try:
        number = Fraction(value.strip()) if isinstance(value, str) else (
            Fraction(value) if isinstance(value, float) and value.is_integer() else None)
    except ValueError:
        return value
    return int(number) if number is not None and number.denominator == 1 else value


def _set_field(err: BaseException, name: str | None) -> None:
    try:
        err.field = name  # type: ignore[attr-defined]
    except AttributeError:  # pragma: no cover
        pass


def _prefix(err: BaseException, where: str) -> None:
    f = getattr(err, "field", None)
    if isinstance(f, str) and f.startswith(where):
        return
    inner = f.split(": ")[-1] if isinstance(f, str) else None
    _set_field(err, f"{where}.{inner}" if inner and inner not in ("record",) else where)


def _is_frame(value: object) -> bool:
    return type(value).__name__ == "DataFrame" and hasattr(value, "to_dict")


def _read_file(path: Path) -> tuple[list[Any], Mapping[str, Any]]:
    suffix = path.suffix.lower()
    readers = {".toml": _read_toml, ".json": _read_json, ".csv": _read_csv, ".parquet": _read_parquet}
    if suffix not in readers:
        raise InventoryError(f"read_inventory: {str(path)!r}: give a .toml, .json, .csv or .parquet file (data only; "
                             "nothing else is read).", field="inventory", value=str(path))
    if not path.is_file():
        raise InventoryError(f"read_inventory: {str(path)!r} is not a file.", field="inventory", value=str(path))
    try:
        return readers[suffix](path)
    except InventoryError:
        raise
    except (ValueError, OSError, UnicodeDecodeError) as err:
        raise InventoryError(f"read_inventory: cannot read {str(path)!r}: {err}", field="inventory",
                             value=str(path)) from None


def _document(doc: object, path: Path) -> tuple[list[Any], Mapping[str, Any]]:
    if isinstance(doc, list):
        return doc, {}
    if not isinstance(doc, Mapping) or not isinstance(doc.get("girders"), list):
        raise InventoryError(f"read_inventory: {str(path)!r} must hold a list 'girders' of records (and optionally "
                             "a table 'defaults').", field="girders", value=str(path))
    defaults = doc.get("defaults", {})
    extra = sorted(set(doc) - {"girders", "defaults"})
    if not isinstance(defaults, Mapping) or extra:
        raise InventoryError(f"read_inventory: {str(path)!r}: only 'girders' and 'defaults' (a table) are read at "
                             f"the top, got {extra or 'defaults = ' + repr(defaults)}.", field="defaults")
    if "id" in defaults:
        raise InventoryError("read_inventory: an id cannot be a default.", field="defaults.id")
    return doc["girders"], defaults


def _read_toml(path: Path) -> tuple[list[Any], Mapping[str, Any]]:
    if sys.version_info >= (3, 11):
        import tomllib
    else:  # pragma: no cover - Python 3.10
        try:
            import tomli as tomllib
        except ImportError as err:
            from ilkit.errors import MissingDependencyError

            raise MissingDependencyError('reading TOML on Python 3.10 needs tomli: pip install "ilkit[batch]"') from err
    return _document(tomllib.loads(path.read_text(encoding="utf-8")), path)


def _refuse_constant(text: str) -> float:
    raise InventoryError(f"read_inventory: {text} is not a number; give a finite number.", field="inventory",
                         value=text)


def _read_json(path: Path) -> tuple[list[Any], Mapping[str, Any]]:
    return _document(json.loads(path.read_text(encoding="utf-8"), parse_constant=_refuse_constant), path)


def _read_csv(path: Path) -> tuple[list[Any], Mapping[str, Any]]:
    import pandas as pd

    frame = pd.read_csv(path, dtype=str, keep_default_na=False, encoding="utf-8")
    return _table_rows(frame), {}


def _read_parquet(path: Path) -> tuple[list[Any], Mapping[str, Any]]:
    from ilkit.batch._parquet import read_table

    return _table_rows(read_table(path)), {}


def _table_rows(frame: pd.DataFrame) -> list[dict[str, Any]]:
    """Records from a table: empty cells left out, JSON text in the list and table fields read as data."""
    rows = []
    columns = [str(c) for c in frame.columns]
    for values in frame.itertuples(index=False, name=None):
        row: dict[str, Any] = {}
        for name, value in zip(columns, values):
            value = _plain(value)
            if value is None or (isinstance(value, str) and not value.strip()):
                continue
            if name in _JSON_FIELDS and isinstance(value, str) and value.lstrip()[:1] in ("[", "{", '"'):
                try:
                    value = json.loads(value, parse_constant=_refuse_constant)
                except ValueError as err:
                    value = _Unreadable(value, str(err))
            row[name] = value
        rows.append(row)
    return rows


def _plain(value: Any) -> Any:
    """A cell as a plain Python value (numpy scalars and arrays to numbers and lists; NaN to None)."""
    if hasattr(value, "tolist"):
        value = value.tolist()
    if isinstance(value, float) and math.isnan(value):
        return None
    if isinstance(value, list):
        return [_plain(v) for v in value]
    if isinstance(value, dict):
        return {k: _plain(v) for k, v in value.items()}
    return value


@dataclass(frozen=True)
class _Unreadable:
    """A cell that is not JSON; validation names its field."""

    text: str
    reason: str

    def __repr__(self) -> str:
        return f"{self.text!r} (not JSON: {self.reason})"

