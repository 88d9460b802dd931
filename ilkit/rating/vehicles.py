"""Rating vehicles as load models: the AASHTO legal loads, the emergency vehicles, permit vehicles.

Every function returns an :class:`ilkit.LoadModel` of one lane (kip, ft) with its ``source`` and the values
recalled rather than read in ``from_memory``; the dynamic load allowance IM is part of the model (33 % by
default, on the axles, not on a lane load: AASHTO Manual for Bridge Evaluation 6A.4.4.3, from memory) and
can be given (a smooth approach may justify less).

From memory (AASHTO Manual for Bridge Evaluation, LRFR, Section 6A and its Appendix D6A; check every value
against the licensed current edition):

* Type 3: 16, 17, 17 kip at 15, 4 ft (50 kip, 25 tons);
* Type 3S2: 10, 15.5, 15.5, 15.5, 15.5 kip at 11, 4, 22, 4 ft (72 kip, 36 tons);
* Type 3-3: 12, 12, 12, 16, 14, 14 kip at 15, 4, 15, 16, 4 ft (80 kip, 40 tons);
* the lane-type legal load (6A.4.4.2.1): for spans of 200 ft and more, 0.75 × Type 3-3 with a lane load of
  0.2 kip/ft; for negative moment and reactions at interior supports, two Type 3-3 × 0.75 heading the same
  way, 30 ft apart (rear axle of the first to the front axle of the second), with 0.2 kip/ft;
* the specialised hauling vehicles (single-unit trucks, 6A.4.4.2.1): SU4 12, 8, 17, 17 kip at 10, 4, 4 ft
  (54 kip); SU5 12, 8, 8, 17, 17 kip at 10, 4, 4, 4 ft (62 kip); SU6 11.5, 8, 8, 17, 17, 8 kip at 10, 4, 4,
  4, 4 ft (69.5 kip); SU7 11.5, 8, 8, 17, 17, 8, 8 kip at 10, 4, 4, 4, 4, 4 ft (77.5 kip);
* the notional rating load NRL: 6, 8, 8, 17, 17, 8, 8, 8 kip at 6, 4, 4, 4, 6 to 14, 4, 4 ft (80 kip; the
  gap after the fifth axle varies to give the extreme);
* the emergency vehicles (FAST Act vehicles, 6A.4.4.2.1): EV2 24, 33.5 kip at 15 ft (57.5 kip); EV3 24, 31,
  31 kip at 15, 4 ft (86 kip).

A permit vehicle is the user's own: :func:`permit_vehicle` takes its axles and spacings (a list, a table or a
CSV file with the columns of :meth:`ilkit.AxleTrain.from_frame`).
"""

from __future__ import annotations

from collections.abc import Mapping, Sequence
from pathlib import Path
from types import MappingProxyType
from typing import Any

from ilkit._exact import fmt
from ilkit.errors import LoadInputError, RatingInputError
from ilkit.loads.combination import Combination, LoadModel
from ilkit.loads.primitives import AxleTrain, UniformLoad, number

__all__ = [
    "MBE",
    "type_3",
    "type_3s2",
    "type_3_3",
    "lane_type_legal_load",
    "specialized_hauling_vehicle",
    "notional_rating_load",
    "emergency_vehicle",
    "permit_vehicle",
    "LEGAL_TRUCKS",
    "vehicle_weight",
]

MBE = "AASHTO Manual for Bridge Evaluation (LRFR), Section 6A"
"""The document the rating vehicles and factors cite (the licensed current edition governs)."""

_IM = 0.33
_IM_NOTE = "dynamic load allowance IM 33 % on the axles (6A.4.4.3; less for smooth approaches at the owner's rule)"

LEGAL_TRUCKS: Mapping[str, tuple[tuple[float, ...], tuple[Any, ...]]] = MappingProxyType({
    "Type 3": ((16.0, 17.0, 17.0), (15.0, 4.0)),
    "Type 3S2": ((10.0, 15.5, 15.5, 15.5, 15.5), (11.0, 4.0, 22.0, 4.0)),
    "Type 3-3": ((12.0, 12.0, 12.0, 16.0, 14.0, 14.0), (15.0, 4.0, 15.0, 16.0, 4.0)),
    "SU4": ((12.0, 8.0, 17.0, 17.0), (10.0, 4.0, 4.0)),
    "SU5": ((12.0, 8.0, 8.0, 17.0, 17.0), (10.0, 4.0, 4.0, 4.0)),
    "SU6": ((11.5, 8.0, 8.0, 17.0, 17.0, 8.0), (10.0, 4.0, 4.0, 4.0, 4.0)),
    "SU7": ((11.5, 8.0, 8.0, 17.0, 17.0, 8.0, 8.0), (10.0, 4.0, 4.0, 4.0, 4.0, 4.0)),
    "NRL": ((6.0, 8.0, 8.0, 17.0, 17.0, 8.0, 8.0, 8.0), (6.0, 4.0, 4.0, 4.0, (6.0, 14.0), 4.0, 4.0)),
    "EV2": ((24.0, 33.5), (15.0,)),
    "EV3": ((24.0, 31.0, 31.0), (15.0, 4.0)),
})
"""Axle loads (kip, lead axle first) and spacings (ft; a pair is a range) of the AASHTO legal, specialised
hauling, notional and emergency vehicles, from memory (Manual for Bridge Evaluation 6A.4.4.2.1 and its
figures)."""

_CLAUSE = {
    "Type 3": "6A.4.4.2.1, Figure D6A-1", "Type 3S2": "6A.4.4.2.1, Figure D6A-2",
    "Type 3-3": "6A.4.4.2.1, Figure D6A-3", "SU4": "6A.4.4.2.1, Figure D6A-5", "SU5": "6A.4.4.2.1, Figure D6A-6",
    "SU6": "6A.4.4.2.1, Figure D6A-7", "SU7": "6A.4.4.2.1, Figure D6A-8", "NRL": "6A.4.4.2.1, Figure D6A-4",
    "EV2": "6A.4.4.2.1 (emergency vehicles)", "EV3": "6A.4.4.2.1 (emergency vehicles)",
}


def _truck(name: str, scale: float = 1.0, label: str | None = None) -> AxleTrain:
    loads, spacings = LEGAL_TRUCKS[name]
    return AxleTrain([scale * w for w in loads], list(spacings), units="kip-ft", name=label or name)


def _words(name: str) -> str:
    loads, spacings = LEGAL_TRUCKS[name]
    gaps = ", ".join(f"{fmt(s[0])} to {fmt(s[1])}" if isinstance(s, tuple) else fmt(s) for s in spacings)
    return (f"{name}: axles {', '.join(fmt(w) for w in loads)} kip at {gaps} ft ({fmt(sum(loads))} kip) "
            f"({_CLAUSE[name]})")


def _model(name: str, dynamic_allowance: float) -> LoadModel:
    im = number(dynamic_allowance, "dynamic_allowance", strict=False)
    truck = _truck(name)
    return LoadModel(
        name,
        [Combination(name, [truck], dynamic_allowance=im, dynamic_on=[truck.name] if im else ())],
        source=f"{MBE}, {_CLAUSE[name]}",
        notes=_IM_NOTE,
        from_memory=(_words(name), "dynamic load allowance IM = 33 % (6A.4.4.3)"),
    )


def type_3(dynamic_allowance: float = _IM) -> LoadModel:
    """AASHTO legal load Type 3 (MBE 6A.4.4.2.1, from memory): 16, 17, 17 kip at 15, 4 ft (50 kip, 25 tons),
    with the dynamic load allowance IM (33 %) on the axles.  kip, ft."""
    return _model("Type 3", dynamic_allowance)


def type_3s2(dynamic_allowance: float = _IM) -> LoadModel:
    """AASHTO legal load Type 3S2 (MBE 6A.4.4.2.1, from memory): 10, 15.5, 15.5, 15.5, 15.5 kip at 11, 4, 22,
    4 ft (72 kip, 36 tons), with IM (33 %).  kip, ft."""
    return _model("Type 3S2", dynamic_allowance)


def type_3_3(dynamic_allowance: float = _IM) -> LoadModel:
    """AASHTO legal load Type 3-3 (MBE 6A.4.4.2.1, from memory): 12, 12, 12, 16, 14, 14 kip at 15, 4, 15, 16,
    4 ft (80 kip, 40 tons), with IM (33 %).  kip, ft."""
    return _model("Type 3-3", dynamic_allowance)


def specialized_hauling_vehicle(name: str, dynamic_allowance: float = _IM) -> LoadModel:
    """A specialised hauling vehicle ``"SU4"``, ``"SU5"``, ``"SU6"`` or ``"SU7"`` (MBE 6A.4.4.2.1, from memory;
    54, 62, 69.5 and 77.5 kip), with IM (33 %).  kip, ft."""
    return _model(_named(name, ("SU4", "SU5", "SU6", "SU7"), "specialized_hauling_vehicle"), dynamic_allowance)


def notional_rating_load(dynamic_allowance: float = _IM) -> LoadModel:
    """The notional rating load NRL (MBE 6A.4.4.2.1, from memory): 6, 8, 8, 17, 17, 8, 8, 8 kip at 6, 4, 4, 4,
    6 to 14, 4, 4 ft (80 kip, 40 tons), the varying gap chosen for the extreme; with IM (33 %).  kip, ft."""
    return _model("NRL", dynamic_allowance)


def emergency_vehicle(name: str, dynamic_allowance: float = _IM) -> LoadModel:
    """An emergency vehicle ``"EV2"`` (24, 33.5 kip at 15 ft; 57.5 kip) or ``"EV3"`` (24, 31, 31 kip at 15,
    4 ft; 86 kip) (MBE 6A.4.4.2.1, from memory), with IM (33 %).  kip, ft."""
    return _model(_named(name, ("EV2", "EV3"), "emergency_vehicle"), dynamic_allowance)


def _named(name: object, allowed: Sequence[str], what: str) -> str:
    if isinstance(name, str) and name in allowed:
        return name
    raise RatingInputError(f"{what}: unknown vehicle {name!r}; choose one of {', '.join(map(repr, allowed))}.",
                           field="name", value=name)


def lane_type_legal_load(*, long_span: bool = True, dynamic_allowance: float = _IM, factor: float = 0.75,
                         lane: float = 0.2, gap: float = 30.0) -> LoadModel:
    """The lane-type legal load (MBE 6A.4.4.2.1, from memory), one lane.

    Cases: ``factor`` = 0.75 × Type 3-3 with a lane load of ``lane`` = 0.2 kip/ft, for spans of 200 ft and
    more (``long_span``: include it; :func:`~ilkit.rating.rate_girder` includes it where a span of the girder
    is at least 200 ft long); and, for negative moment between points of contraflexure and reactions at
    interior supports, two Type 3-3 × 0.75 heading the same way, ``gap`` = 30 ft apart (rear axle of the
    first to the front axle of the second), with the lane load.  IM on the trucks, not on the lane.  kip, ft.
    """
    im = number(dynamic_allowance, "dynamic_allowance", strict=False)
    f = number(factor, "factor")
    w = number(lane, "lane")
    g = number(gap, "gap")
    loads, spacings = LEGAL_TRUCKS["Type 3-3"]
    one = AxleTrain([f * v for v in loads], list(spacings), units="kip-ft", name=f"{fmt(f)} × Type 3-3",
                    drop_adverse_axles=True)
    two = AxleTrain([f * v for v in (*loads, *loads)], [*spacings, g, *spacings], units="kip-ft",
                    name=f"{fmt(f)} × two Type 3-3", drop_adverse_axles=True)
    q = UniformLoad(w, units="kip-ft", name="legal lane load")
    cases = []
    if long_span:
        cases.append(Combination(f"{fmt(f)} × Type 3-3 + lane", [one, q], dynamic_allowance=im,
                                 dynamic_on=[one.name] if im else ()))
    cases.append(Combination(f"{fmt(f)} × two Type 3-3 + lane", [two, q], dynamic_allowance=im,
                             dynamic_on=[two.name] if im else (),
                             applies_to="negative moment and interior reactions"))
    if not long_span:  # a model needs a general case: the short-span lane-type load is the truck alone
        cases.insert(0, Combination("Type 3-3 (spans under 200 ft)", [_truck("Type 3-3")], dynamic_allowance=im,
                                    dynamic_on=["Type 3-3"] if im else ()))
    return LoadModel(
        "lane-type legal load",
        cases,
        source=f"{MBE}, 6A.4.4.2.1",
        notes=_IM_NOTE,
        from_memory=(
            f"for spans of 200 ft and more: {fmt(f)} × Type 3-3 with a lane load of {fmt(w)} kip/ft "
            "(6A.4.4.2.1)",
            f"for negative moment and interior reactions: two Type 3-3 × {fmt(f)}, {fmt(g)} ft apart, with "
            f"{fmt(w)} kip/ft (6A.4.4.2.1)",
            "dynamic load allowance IM = 33 % on the trucks, not on the lane load (6A.4.4.3)",
        ),
    )


def permit_vehicle(
    axles: Sequence[float] | Any | str | Path,
    spacings: Sequence[Any] | None = None,
    *,
    name: str = "permit vehicle",
    units: str = "kip-ft",
    dynamic_allowance: float = _IM,
) -> LoadModel:
    """A permit vehicle of the user's own, as a load model of one lane.

    ``axles``: the axle loads (lead axle first) with ``spacings`` (one fewer; a pair ``(lo, hi)`` is a range);
    or a table (a pandas DataFrame) or the path of a CSV file with one row per axle and the columns ``load``,
    ``spacing`` (from the previous axle; empty on the first row) and optionally ``spacing_max``
    (:meth:`ilkit.AxleTrain.from_frame`).  ``units``: of the numbers (``"kip-ft"``, ``"kN-m"`` ...).
    ``dynamic_allowance``: IM on the axles (33 %, MBE 6A.4.5.5, from memory; an escorted crossing at
    walking speed may take less, at the owner's rule).  Force and length units of ``units``.
    """
    import pandas as pd

    try:
        if isinstance(axles, (str, Path)):
            train = AxleTrain.from_csv(axles, units=units, name=name)
        elif isinstance(axles, pd.DataFrame):
            train = AxleTrain.from_frame(axles, units=units, name=name)
        else:
            if spacings is None:
                raise RatingInputError(
                    f"permit_vehicle: give the spacings between the axles (one fewer than the {len(axles)} axles), "
                    "or a table with the columns load, spacing.", field="spacings")
            train = AxleTrain(axles, spacings, units=units, name=name)
    except LoadInputError as err:
        raise RatingInputError(f"permit_vehicle: {err}", field=err.field, value=err.value) from None
    im = number(dynamic_allowance, "dynamic_allowance", strict=False)
    return LoadModel(
        train.name,
        [Combination(train.name, [train], dynamic_allowance=im, dynamic_on=[train.name] if im else ())],
        source="given by the user",
        notes=f"dynamic load allowance IM {fmt(100 * im)} % on the axles (MBE 6A.4.5.5)",
        from_memory=("dynamic load allowance IM = 33 % for permit vehicles (6A.4.5.5)",) if im == _IM else (),
    )


def vehicle_weight(model: LoadModel) -> float | None:
    """The gross weight of a rating vehicle (the sum of the axle loads of its first case, in the model's force
    unit), or ``None`` when that case holds anything but one axle train (a lane load)."""
    case = model.cases[0]
    if len(case.parts) != 1 or not isinstance(case.parts[0], AxleTrain):
        return None
    return float(case.parts[0].total_load)
