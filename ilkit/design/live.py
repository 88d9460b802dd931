"""The live load of one girder: one lane's load model times the girder's share, each factor applied once.

:class:`GirderLiveLoad` joins a load model of one lane (HL-93, the fatigue
truck, a girder's LM1 ...) with what turns it into the load of one girder:
the distribution factor (:class:`~ilkit.design.Distribution`), or a number
of lanes and a multiple presence factor.  It keeps the record of the
factors its effects contain, per action (:meth:`GirderLiveLoad.factors`):
the dynamic effect read from the model's cases, then lanes, multiple
presence and distribution, each at most once; a multiple presence factor on
top of a distribution factor that includes it raises
:class:`~ilkit.FactorAppliedTwiceError`.

:func:`live_envelope` gives the girder's live-load envelope at the sections
of :func:`~ilkit.design.envelope_sections`: the one-lane envelope of
:func:`ilkit.loads.envelope` (exact placement) times the girder's share of
each action.  Scaling is exact: a factor on the whole does not move the
worst placement.
"""

from __future__ import annotations

from collections.abc import Sequence
from dataclasses import dataclass, field
from typing import TYPE_CHECKING, Any

from ilkit._check import choice, whole
from ilkit._display import RichDisplay
from ilkit._exact import fmt
from ilkit.design._dynamic import dynamic_factor
from ilkit.design._inputs import amount, text
from ilkit.design.distribution import Action, Distribution
from ilkit.design.factors import Applied, Factor
from ilkit.errors import DesignInputError
from ilkit.loads.combination import LoadModel, as_model
from ilkit.loads.primitives import UniformLoad
from ilkit.model import Beam

if TYPE_CHECKING:  # pragma: no cover
    import pandas as pd

    from ilkit.design.combinations import LimitState
    from ilkit.loads.envelope import Envelope
    from ilkit.loads.results import Extreme, Extremes

__all__ = ["GirderLiveLoad", "LiveEnvelope", "live_envelope", "part_kind"]

_ACTIONS = ("moment", "shear", "reaction", "deflection")


def part_kind(load: object) -> str:
    """``"uniform"`` for a uniform load (a lane load, the UDL of LM1), ``"axles"`` for any other part (an axle
    train, the tandem system, a knife-edge load, blocks): the kinds :data:`ilkit.design.LIVE_PARTS` factors."""
    return "uniform" if isinstance(load, UniformLoad) else "axles"


def _dynamic(model: LoadModel) -> Factor:
    """The dynamic effect of the model's cases as one factor (:func:`~ilkit.design._dynamic.dynamic_factor`);
    a model without one records a neutral factor, so that every result says what it contains."""
    found = dynamic_factor((c.dynamic for c in model.cases), source=model.source)
    if found is None:
        return Factor("dynamic allowance", 1.0, "IM", source=model.source, note="none in the model")
    return found


@dataclass(frozen=True, init=False, repr=False)
class GirderLiveLoad(RichDisplay):
    """The live load of one girder: one lane's ``model`` times the girder's share.

    Parameters
    ----------
    model:
        The load model of one lane (or one track), e.g.
        :func:`ilkit.loads.hl93`; its cases' dynamic effects are part of it.
        Its cases must carry no factor of their own (``hl93(factor=...)``):
        give multiple presence and distribution here, so each is applied
        once (the 90 % of AASHTO's two-truck case is part of the model).
    distribution:
        The girder's share per action (:class:`~ilkit.design.Distribution`),
        in lanes: it contains the lanes and, for the AASHTO formulas and the
        lever rule, the multiple presence factor.
    lanes:
        Without a distribution: the number of lanes on the girder line (a
        whole-bridge line, a single-girder study).
    multiple_presence:
        A multiple presence factor (a :class:`~ilkit.design.Factor`, e.g.
        :func:`~ilkit.design.multiple_presence_factor`, or a number); refused
        when the distribution already includes one.
    name:
        The name in tables (the model's name by default).
    """

    model: LoadModel
    distribution: Distribution | None
    lanes: Factor | None
    multiple_presence: Factor | None
    name: str
    _applied: dict[str, Applied] = field(repr=False, compare=False)

    def __init__(
        self,
        model: Any,
        *,
        distribution: Distribution | None = None,
        lanes: int | None = None,
        multiple_presence: Factor | float | None = None,
        name: str | None = None,
    ) -> None:
        load_model = as_model(model)
        _check_case_factors(load_model)
        if distribution is not None and not isinstance(distribution, Distribution):
            raise DesignInputError(
                f"GirderLiveLoad: distribution must be a Distribution (e.g. ilkit.design.lever_rule(...)), got "
                f"{type(distribution).__name__} {distribution!r}.", field="distribution", value=distribution)
        lane_factor = None
        if lanes is not None:
            n = whole(lanes, what="GirderLiveLoad: lanes", field="lanes", minimum=1, error=DesignInputError)
            lane_factor = Factor("lanes", n, "NL", note=f"{n} lane{'s' if n > 1 else ''} on the girder line")
        m = multiple_presence
        if m is not None and not isinstance(m, Factor):
            m = Factor("multiple presence", amount(m, "GirderLiveLoad: multiple_presence", strict=True), "m")
        if m is not None and m.kind != "multiple presence":
            raise DesignInputError(f"GirderLiveLoad: multiple_presence must be a factor of kind 'multiple "
                                   f"presence', got {m.kind!r}.", field="multiple_presence", value=m)
        object.__setattr__(self, "model", load_model)
        object.__setattr__(self, "distribution", distribution)
        object.__setattr__(self, "lanes", lane_factor)
        object.__setattr__(self, "multiple_presence", m)
        object.__setattr__(self, "name", load_model.name if name is None else text(name, "GirderLiveLoad: name"))
        applied = {}
        for action in ("moment", "shear", "deflection"):
            record = Applied().then(_dynamic(load_model))
            for f in (lane_factor, m):
                if f is not None:
                    record = record.then(f)
            if distribution is not None:
                if action == "deflection" and distribution.deflection is None:
                    continue
                record = record.then(distribution.factor(action))  # type: ignore[arg-type]
            applied[action] = record
        object.__setattr__(self, "_applied", applied)

    def factors(self, action: Action = "moment") -> Applied:
        """The factors the girder's effects on ``action`` contain, in the order applied (a reaction takes the
        shear's)."""
        choice(action, _ACTIONS, what="factors: action", field="action", error=DesignInputError)
        key = "shear" if action == "reaction" else action
        if key not in self._applied:
            raise DesignInputError(f"{self.name}: the distribution gives no factor for deflection; give "
                                   "Distribution(..., deflection=...) or given_distribution(..., deflection=...).",
                                   field="action", value=action)
        return self._applied[key]

    def scale(self, action: Action = "moment") -> float:
        """The multiplier on one lane's effect on ``action`` (lanes, m, g: dimensionless; the dynamic effect is
        already in the lane's values)."""
        return self.factors(action).product

    def part_factor(self, part: str, action: Action = "moment", limit_state: LimitState | None = None
                    ) -> tuple[float, str]:
        """The multiplier on the unfactored effect of the model's part named ``part`` standing alone (as
        :func:`ilkit.loads.stand` and :func:`ilkit.loads.place` give it), and its words.

        The multiplier is that part's factor in the first case of the model that holds it (the dynamic effect
        on it times the case factor, e.g. 1.33 × 0.90 for a truck of AASHTO's two-truck case), times the
        girder's share of ``action`` (:meth:`scale`) and, with a ``limit_state``, its γLL and its factor on
        the part's kind (``live_parts``: ψ of the axles or of the uniform load).  Dimensionless; the words
        read like ``"IM 33 % × gM 0.6805 × γLL 1.75"``.  A limit state that does not suit this live load
        (:meth:`check`) is refused.
        """
        from ilkit.design.combinations import LimitState

        owner = next(((c, p) for c in self.model.cases for p in c.parts if p.name == part), None)
        if owner is None:
            names = ", ".join(dict.fromkeys(p.name for c in self.model.cases for p in c.parts))
            raise DesignInputError(f"part_factor: {part!r} is not a part of {self.name!r} (its parts: {names}).",
                                   field="part", value=part)
        case, load = owner
        words = []
        dynamic = case.dynamic
        if dynamic.multiplier(part) != 1.0:
            words.append(f"IM {100 * dynamic.value:.4g} %" if dynamic.kind == "allowance" else f"Φ {dynamic.value:.4g}")
        if case.factor != 1.0:
            words.append(f"case factor {fmt(case.factor)}")
        value = case.part_factor(load) * self.scale(action)
        words += [f.describe() for f in self.factors(action) if not f.parts]
        if limit_state is not None:
            if not isinstance(limit_state, LimitState):
                raise DesignInputError(f"part_factor: give a LimitState, got {type(limit_state).__name__}.",
                                       field="limit_state", value=limit_state)
            self.check(limit_state)
            psi = limit_state.live_parts.get(part_kind(load), 1.0)
            value *= limit_state.live * psi
            words.append(f"γLL {fmt(limit_state.live)}")
            if part_kind(load) in limit_state.live_parts:
                words.append(f"ψ {fmt(psi)} ({part_kind(load)})")
        return value, " × ".join(words) or "no factors"

    @property
    def dynamic(self) -> Factor:
        """The dynamic effect the model's values contain, as a factor."""
        return self.factors("moment").factors[0]

    def check(self, limit_state: LimitState) -> None:
        """Refuse a live load that does not suit ``limit_state``: another dynamic allowance than it calls for,
        or a multiple presence factor where it must not be applied (AASHTO fatigue)."""
        want = limit_state.dynamic_allowance
        dyn = self.dynamic
        have = dyn.value - 1.0 if dyn.symbol == "IM" else None
        if want is not None and (have is None or abs(have - want) > 1e-9):
            contains = f"contains {dyn.describe()}" + (f" ({dyn.note})" if dyn.note else "")
            example = ("GirderLiveLoad(loads.fatigue_truck(), distribution=distribution.fatigue())" if want < 0.33
                       else "GirderLiveLoad(loads.hl93(), distribution=distribution)")
            raise DesignInputError(
                f"{limit_state.name} calls for a dynamic allowance of {fmt(round(100 * want, 9))} %; the live load "
                f"{self.name!r} {contains}. Give a live load for it: live={{{limit_state.name!r}: {example}, ...}}.",
                field="live", value=self.name)
        if not limit_state.multiple_presence and any(self.factors(a).contains("multiple presence")
                                                     for a in ("moment", "shear")):
            raise DesignInputError(
                f"{limit_state.name}: the multiple presence factor is not applied (AASHTO LRFD 3.6.1.1.2), but the "
                f"live load {self.name!r} contains it; use the distribution without it (distribution.fatigue(): "
                "the one-lane factor divided by 1.20).", field="live", value=self.name)

    def __repr__(self) -> str:
        return f"GirderLiveLoad({self.name}: moment {self.factors('moment').describe()}; " \
               f"shear {self.factors('shear').describe()})"


def _check_case_factors(model: LoadModel) -> None:
    """A model whose every general case carries a factor ≠ 1 had a share applied inside it: refused."""
    general = [c for c in model.cases if c.applies_to == "all"]
    if general and all(c.factor != 1.0 for c in general):
        raise DesignInputError(
            f"{model.name}: its cases carry a factor of {fmt(general[0].factor)} (e.g. hl93(factor=...)); give the "
            "multiple presence and distribution to GirderLiveLoad instead, so that each factor is applied once "
            "and recorded: GirderLiveLoad(loads.hl93(), distribution=...).", field="model", value=model.name)


# ------------------------------------------------------------------ envelope
@dataclass(frozen=True)
class LiveEnvelope(RichDisplay):
    """The live-load envelope of one girder at the sections of a beam.

    ``frame``: one row per (``quantity``, ``x``, ``side``) for moment,
    shear and reaction, with ``max``, ``min`` (the girder's values: one
    lane's extreme times :meth:`GirderLiveLoad.scale` of the action) and
    ``max_case``, ``min_case`` (the governing case of the model); with parts,
    also ``max_axles``, ``max_uniform``, ``min_axles``, ``min_uniform`` (the
    part of each extreme from the axle trains and from the uniform loads).
    Units of the beam, signs of :mod:`ilkit.model`.  ``lane`` is the one-lane
    envelope of :func:`ilkit.loads.envelope`, whose extremes
    (:meth:`extremes`) keep the placements for concurrent forces and
    drawings.
    """

    live: GirderLiveLoad
    frame: pd.DataFrame = field(repr=False)
    lane: Envelope = field(repr=False)

    def extremes(self, quantity: str, at: float, side: str | None = None) -> Extremes:
        """The one-lane extremes (with their placements) behind a row: ``quantity`` ``"moment"``, ``"shear"``
        or ``"reaction"`` at a section ``at`` (``side`` where there are two); values of one lane, in the
        beam's units with the signs of :mod:`ilkit.model`."""
        best = self.lane.extreme(quantity, at, "max", side=side)  # type: ignore[arg-type]
        worst = self.lane.extreme(quantity, at, "min", side=side)  # type: ignore[arg-type]
        from ilkit.loads.results import Extremes

        return Extremes(best, worst)

    def for_girder(self, live: GirderLiveLoad) -> LiveEnvelope:
        """The envelope of another girder loaded by the same model (another share): the one-lane envelope is
        reused and scaled, no placement is searched again.  Units of the beam, signs of :mod:`ilkit.model`."""
        if not isinstance(live, GirderLiveLoad):
            raise DesignInputError(f"for_girder: give a GirderLiveLoad, got {type(live).__name__}.", field="live",
                                   value=live)
        if live.model != self.live.model:
            raise DesignInputError(
                f"for_girder: {live.name!r} has another load model than this envelope ({self.live.name!r}); compute "
                "its envelope with live_envelope(...).", field="live", value=live.name)
        return _from_lane(self.lane, live, "max_axles" in self.frame)

    def __repr__(self) -> str:
        return f"LiveEnvelope({self.live.name}: {len(self.frame)} rows)"

    def to_frame(self) -> pd.DataFrame:
        """The table (a copy)."""
        return self.frame.copy()


def _split(extreme: Extreme, model: LoadModel) -> tuple[float, float]:
    """(axles, uniform): the parts of an extreme's value from axle loads and from uniform loads."""
    kinds = {p.name: part_kind(p) for c in model.cases for p in c.parts}
    axles = uniform = 0.0
    for p in extreme.placements:
        if kinds.get(p.load, "axles") == "uniform":
            uniform += p.factored
        else:
            axles += p.factored
    return axles, uniform


def live_envelope(
    beam: Beam,
    live: GirderLiveLoad,
    *,
    divisions: int = 10,
    at: Sequence[object] = (),
    parts: bool = False,
) -> LiveEnvelope:
    """The live-load envelope of the girder ``live`` on ``beam``: moment, shear and reaction at the sections of
    :func:`~ilkit.design.envelope_sections` (``divisions`` parts per span, further sections ``at``).

    Values are one lane's extremes (exact placement, :func:`ilkit.loads.envelope`) times the girder's share
    of each action; units of the beam, signs of :mod:`ilkit.model`.  ``parts=True`` also splits each extreme
    into its axle and uniform parts (for limit states that factor them apart).  Another girder loaded by the
    same model: :meth:`LiveEnvelope.for_girder` (no second search).
    """
    from ilkit.loads.envelope import envelope

    if not isinstance(live, GirderLiveLoad):
        raise DesignInputError(f"live_envelope: give a GirderLiveLoad, got {type(live).__name__} {live!r}.",
                               field="live", value=live)
    lane = envelope(beam, live.model, divisions=divisions, at=list(at))
    return _from_lane(lane, live, parts)


def _from_lane(lane: Envelope, live: GirderLiveLoad, parts: bool) -> LiveEnvelope:
    """The girder's envelope from one lane's: every extreme times the share of its action."""
    import pandas as pd

    model = lane.load_model or live.model
    scale = {"moment": live.scale("moment"), "shear": live.scale("shear"), "reaction": live.scale("shear")}
    order = {"left": 0, None: 1, "right": 2}
    keys = sorted(lane._found, key=lambda k: (("moment", "shear", "reaction").index(k[0]), k[1], order[k[2]]))
    rows = []
    for key in keys:
        quantity, x, side = key
        found = lane._found[key]
        s = scale[quantity]
        row: dict[str, Any] = {"quantity": quantity, "x": float(x), "side": side or "",
                               "max": s * found.maximum.value, "min": s * found.minimum.value,
                               "max_case": found.maximum.case, "min_case": found.minimum.case}
        if parts:
            for which, e in (("max", found.maximum), ("min", found.minimum)):
                a, u = _split(e, model)
                row[f"{which}_axles"], row[f"{which}_uniform"] = s * a, s * u
        rows.append(row)
    return LiveEnvelope(live, pd.DataFrame(rows), lane)
