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

__all__ = ["GirderResult", "GirderTask", "EnvelopeTask", "girder_results", "ROW_COLUMNS", "QUANTITIES"]

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
    (:func:`ilkit.design.factored_envelope`).  With neither, each girder's own ``live`` is enveloped.
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
            key = repr(own) if own is not None else repr(specs[0])
            env = envelopes.get(key)
            if env is None:
                model = live_model(own, record=record.id) if own is not None else live_model(specs[0])
                env = live_envelope(beam, record.live_load(model), divisions=n, parts=parts)
            loads = record.permanent_loads()
            if not loads:  # no permanent load given: a zero one, so that every section has its (zero) row
                from ilkit.design import DistributedLoad

                loads = [DistributedLoad("no permanent load", "DC", 0)]
            permanent = permanent_effects(beam, loads, divisions=n, quantities=list(QUANTITIES))
            out.append(("limit states", "limit state",
                        factored_envelope(beam, permanent=permanent, live=env, limit_states=states, divisions=n)))
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


def _summary(record: Record, beam: Beam, rows: pd.DataFrame) -> dict[str, Any]:
    """The governing extremes of each quantity over every section and load: value, ``x``, load and case."""
    supports = [s.at for s in beam.supports]
    spans = [supports[i + 1] - supports[i] for i in range(len(supports) - 1)]
    out: dict[str, Any] = {
        "girder": record.id, "units": beam.units.name if beam.units else "", "length": float(beam.length),
        "spans": ", ".join(_fmt(s) for s in spans), "rows": len(rows),
    }
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

