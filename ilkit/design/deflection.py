"""Live-load deflection: an envelope of deflections along every span and overhang, checked against limits.

:func:`aashto_deflection_load` is the AASHTO LRFD optional live-load deflection loading (3.6.1.3.2, from
memory): the larger of the design truck alone and 25 % of the design truck together with the design
lane load, the dynamic load allowance on the truck (2.5.2.6.2, from memory).

:func:`deflection_check` places a load model on the deflection line of every section (the same
sections as an envelope), keeps the largest downward and upward deflections, refines the largest of each
span and overhang between the sections, multiplies by the girder's share of one lane's load and
compares the largest magnitude with ``span / limit``.  AASHTO (2.5.2.6.2, from memory): all design
lanes loaded and all girders deflecting equally, so the girder's share of one lane's load is
``lanes × m / girders`` with the multiple presence factor ``m`` of the number of loaded lanes (Table
3.6.1.1.2-1, from memory); the criteria are span/800 for vehicular load, span/1000 for vehicular and
pedestrian load, and for cantilever arms (overhangs) span/300 and span/375.  Every one of these values
is an argument the user can override.

Deflections are positive downward, in the beam's length unit.
"""

from __future__ import annotations

import math
from collections.abc import Sequence
from dataclasses import dataclass, field
from fractions import Fraction
from typing import TYPE_CHECKING

from ilkit._check import flag, whole
from ilkit._display import RichDisplay
from ilkit._exact import fmt
from ilkit.design._dynamic import dynamic_factor
from ilkit.design._inputs import amount
from ilkit.design.factors import Applied, Factor
from ilkit.design.sections import Section, envelope_sections
from ilkit.errors import DesignInputError, StiffnessRequiredError, UnitsError
from ilkit.loads.combination import Combination, LoadModel, as_model
from ilkit.loads.models import design_lane, design_truck, multiple_presence
from ilkit.loads.placement import extremes, place
from ilkit.loads.primitives import AxleTrain, Load, number
from ilkit.loads.results import Extreme
from ilkit.model import Beam

if TYPE_CHECKING:  # pragma: no cover
    import pandas as pd

__all__ = ["aashto_deflection_load", "deflection_check", "DeflectionCheck"]

_AASHTO = "AASHTO LRFD Bridge Design Specifications"
_GOLDEN = (math.sqrt(5.0) - 1.0) / 2.0
REFINE = 1e-4
"""The largest deflection of a span is searched between the sections to this fraction of the span (near a smooth
maximum the deflection is flat: the value is then within about 1e-7 of the largest)."""


def aashto_deflection_load(dynamic_allowance: float = 0.33) -> LoadModel:
    """The AASHTO LRFD live-load deflection loading for one lane (3.6.1.3.2, from memory).

    The larger of the design truck alone (3.6.1.2.2) and 25 % of the design
    truck together with the design lane load (3.6.1.2.4); ``dynamic_allowance``
    IM = 33 % on the truck, not on the lane load (Table 3.6.2.1-1, seen;
    2.5.2.6.2, from memory).  Axles that do not add to the extreme are left
    out (3.6.1.3.1, from memory).  kip, ft; one lane: multiply by the
    girder's share (:func:`deflection_check`).
    """
    im = number(dynamic_allowance, "dynamic_allowance", strict=False)
    truck = design_truck()
    quarter = AxleTrain([0.25 * p for p in truck.loads], [14.0, (14.0, 30.0)], units="kip-ft",
                        name="25 % design truck", drop_adverse_axles=True)
    return LoadModel(
        "AASHTO deflection load",
        [
            Combination("design truck", [truck], dynamic_allowance=im, dynamic_on=[truck.name]),
            Combination("25 % design truck + lane", [quarter, design_lane()], dynamic_allowance=im,
                        dynamic_on=[quarter.name]),
        ],
        source=f"{_AASHTO}, 3.6.1.3.2, 2.5.2.6.2, Table 3.6.2.1-1",
        notes="The licensed current edition governs; results must be checked by a qualified engineer.",
        from_memory=(
            "deflection loading: the larger of the design truck alone and 25 % of the design truck with the "
            "design lane load (3.6.1.3.2)",
            "the dynamic load allowance is included in the deflection loading (2.5.2.6.2)",
            "axles that do not add to the extreme are left off (3.6.1.3.1)",
        ),
    )


@dataclass(frozen=True, eq=False)
class DeflectionCheck(RichDisplay):
    """Live-load deflections of one girder along a beam, and their check against ``span / limit``.

    ``envelope``: one row per section, the largest downward (``max``) and
    upward (``min``, negative) deflection with the governing case, in the
    beam's length unit, times the girder's share.  ``spans``: one row per
    span and overhang, its largest deflection of either sign (searched
    between the sections), where it occurs, the allowed deflection
    ``length / limit``, the ratio of the two and whether it passes.
    ``factors``: the factors inside the numbers (an :class:`~ilkit.design.Applied`:
    the dynamic allowance, already in the load model's values, then the
    lanes, multiple presence and distribution whose product is ``share``,
    the girder's share of one lane's load).  Deflections positive downward.
    """

    beam: Beam = field(repr=False)
    load_model: LoadModel = field(repr=False)
    share: float
    factors: Applied
    envelope: pd.DataFrame = field(repr=False)
    spans: pd.DataFrame = field(repr=False)
    largest: tuple[Extreme, ...] = field(repr=False)
    """The governing placement of each row of ``spans`` (one lane, before the girder's share)."""

    @property
    def passes(self) -> bool:
        """True when every span and overhang is within its limit."""
        return bool(self.spans["passes"].all())

    def __repr__(self) -> str:
        worst = self.spans.loc[self.spans["ratio"].idxmax()]
        return (
            f"DeflectionCheck({self.load_model.name}, share {fmt(self.share)}: "
            f"{'passes' if self.passes else 'FAILS'}; largest ratio {worst['ratio']:.3f} in {worst['span']})"
        )

    def to_frame(self) -> pd.DataFrame:
        """The table of spans (a copy): largest deflection, allowed deflection, ratio, passes."""
        return self.spans.copy()


def deflection_check(
    beam: Beam,
    load: Load | Combination | LoadModel | None = None,
    *,
    lanes: int | None = None,
    girders: int | None = None,
    multiple_presence_factor: float | Factor | None = None,
    share: float | Factor | None = None,
    dynamic_allowance: float = 0.33,
    limit: float | None = None,
    overhang_limit: float | None = None,
    pedestrians: bool = False,
    divisions: int = 10,
    at: Sequence[object] = (),
) -> DeflectionCheck:
    """Live-load deflections of a girder along every span and overhang, checked against ``span / limit``.

    ``load``: the load model of one lane; ``None`` is the AASHTO deflection
    loading (:func:`aashto_deflection_load` with ``dynamic_allowance``).
    The girder's ``share`` of one lane's load multiplies the deflections; by
    default ``lanes × m / girders`` (AASHTO 2.5.2.6.2, from memory: all design
    lanes loaded, all girders deflecting equally), with ``m`` the multiple
    presence factor of ``lanes`` loaded lanes (Table 3.6.1.1.2-1, from memory)
    unless ``multiple_presence_factor`` is given.  ``share`` and
    ``multiple_presence_factor`` may be :class:`~ilkit.design.Factor` objects
    (with their source; a share that includes multiple presence says so in
    its ``includes``).  ``limit``: the span is
    divided by it for the allowed deflection, 800 by default or 1000 with
    ``pedestrians=True``; ``overhang_limit`` likewise for overhangs (cantilever
    arms), 300 or 375 (AASHTO 2.5.2.6.2, from memory).  ``divisions`` and
    ``at``: the sections, as for :func:`ilkit.loads.envelope`.

    The beam needs ``EI`` and units.  Deflections positive downward, in the
    beam's length unit; the check compares the largest magnitude of either
    sign with the allowed deflection.
    """
    import pandas as pd

    if not isinstance(beam, Beam):
        raise DesignInputError(f"deflection_check: give a Beam, got {type(beam).__name__} {beam!r}.", field="beam",
                             value=beam)
    if beam.EI is None:
        raise StiffnessRequiredError(
            "deflection_check: deflections need the flexural stiffness; give the beam EI=... (for a composite "
            "girder, the stiffness of the section that carries the live load).", field="EI")
    if beam.units is None:
        raise UnitsError("deflection_check: the beam declares no units, so the load model cannot be applied; "
                         "declare them: Beam(..., units='kip-ft') or units='kN-m'.", field="units")
    pedestrians = flag(pedestrians, what="pedestrians", field="pedestrians", error=DesignInputError)
    model = aashto_deflection_load(dynamic_allowance) if load is None else as_model(load)
    model = model.converted(beam.units)
    factors = _factors(load is None, model, lanes, girders, multiple_presence_factor, share)
    g = factors.product
    span_limit = _limit(limit, 1000 if pedestrians else 800, "limit")
    arm_limit = _limit(overhang_limit, 375 if pedestrians else 300, "overhang_limit")
    sections = envelope_sections(beam, divisions, at)

    found: dict[Section, tuple[Extreme, Extreme]] = {}
    rows = []
    u = beam.units
    for s in sections:
        both = extremes(beam.deflection(s.x, side=s.side), model, beam=beam)
        top, bottom = both.maximum, both.minimum
        found[s] = (top, bottom)
        rows.append({f"x [{u.length}]": float(s.x), "side": s.side or "", f"max [{u.length}]": g * top.value,
                     "max case": top.case, f"min [{u.length}]": g * bottom.value, "min case": bottom.case})
    envelope = pd.DataFrame(rows)

    span_rows = []
    largest = []
    for name, a, b, criterion in _stretches(beam, span_limit, arm_limit):
        inside = [s for s in sections if a <= s.x <= b]
        best = max((e for s in inside for e in found[s]), key=lambda e: abs(e.value))
        best = _refine(beam, model, inside, found, best, a, b)
        largest.append(best)
        length = float(b - a)
        allowed = length / criterion
        value = g * best.value
        span_rows.append({
            "span": name, f"from [{u.length}]": float(a), f"to [{u.length}]": float(b),
            f"length [{u.length}]": length, "limit": f"L/{fmt(criterion)}", f"allowed [{u.length}]": allowed,
            f"deflection [{u.length}]": value, f"at [{u.length}]": float(best.quantity.at), "case": best.case,
            "ratio": abs(value) / allowed, "passes": abs(value) <= allowed,
        })
    return DeflectionCheck(beam, model, g, factors, envelope, pd.DataFrame(span_rows), tuple(largest))


def _limit(value: object, default: int, what: str) -> float:
    if value is None:
        return float(default)
    return amount(value, what, strict=True)


def _factors(aashto: bool, model: LoadModel, lanes: object, girders: object, m: object, share: object) -> Applied:
    """The factors inside the deflections: the model's dynamic effect (listed: it is in the load values),
    then the girder's share of one lane's load (multiplied)."""
    dynamic = dynamic_factor((c.dynamic for c in model.cases),
                             source=f"{_AASHTO}, Table 3.6.2.1-1; 2.5.2.6.2" if aashto else model.source,
                             from_memory=aashto)
    out = Applied() if dynamic is None else Applied.of(dynamic)
    if share is not None:
        if lanes is not None or girders is not None or m is not None:
            raise DesignInputError(
                "deflection_check: give either share= (the girder's share of one lane's load) or lanes= and "
                "girders= (share = lanes × m / girders), not both.", field="share", value=share)
        given = share if isinstance(share, Factor) else Factor("distribution", amount(share, "share", strict=True), "g")
        return out.then(given)
    if lanes is None or girders is None:
        raise DesignInputError(
            "deflection_check: give the number of design lanes and of girders (lanes=2, girders=5: all lanes loaded, "
            "all girders deflecting equally), or the girder's share of one lane's load directly (share=0.4).",
            field="lanes" if lanes is None else "girders")
    n = whole(lanes, what="lanes: the number of design lanes", field="lanes", minimum=1, maximum=100,
              error=DesignInputError)
    ng = whole(girders, what="girders: the number of girders", field="girders", minimum=1, maximum=1000,
               error=DesignInputError)
    out = out.then(Factor("lanes", n, "N_L", f"{_AASHTO}, 2.5.2.6.2", True, note="all design lanes loaded"))
    if isinstance(m, Factor):
        out = out.then(m)
    elif m is None:
        out = out.then(Factor("multiple presence", multiple_presence(n), "m", f"{_AASHTO}, Table 3.6.1.1.2-1", True))
    else:
        out = out.then(Factor("multiple presence", amount(m, "multiple_presence_factor", strict=True), "m"))
    return out.then(Factor("distribution", 1 / ng, "1/N_b", f"{_AASHTO}, 2.5.2.6.2", True,
                           note="all girders deflect equally"))


def _stretches(beam: Beam, span_limit: float, arm_limit: float) -> list[tuple[str, Fraction, Fraction, float]]:
    """``(name, start, end, limit)`` of every span and overhang."""
    out: list[tuple[str, Fraction, Fraction, float]] = []
    first, last = beam.supports[0].at, beam.supports[-1].at
    if first > 0:
        out.append(("left overhang", Fraction(0), first, arm_limit))
    out += [(f"span {k}", a, b, span_limit) for k, (a, b) in enumerate(beam.spans, start=1)]
    if last < beam.length:
        out.append(("right overhang", last, beam.length, arm_limit))
    return out


def _refine(
    beam: Beam, model: LoadModel, inside: list[Section], found: dict[Section, tuple[Extreme, Extreme]],
    best: Extreme, a: Fraction, b: Fraction,
) -> Extreme:
    """The largest deflection of the sign of ``best`` between the sections beside the one that gave it,
    by golden-section search to :data:`REFINE` of the stretch (the deflection envelope is smooth there)."""
    if best.value == 0:
        return best
    sense = 1 if best.value > 0 else -1
    xs = sorted({float(s.x) for s in inside})
    k = xs.index(float(best.quantity.at))
    lo, hi = xs[max(k - 1, 0)], xs[min(k + 1, len(xs) - 1)]

    def at(x: float) -> Extreme:
        return place(beam.deflection(x), model, "max" if sense > 0 else "min", beam=beam)

    tol = REFINE * float(b - a)
    c, d = hi - _GOLDEN * (hi - lo), lo + _GOLDEN * (hi - lo)
    fc, fd = at(c), at(d)
    while hi - lo > tol:
        if sense * fc.value >= sense * fd.value:
            hi, d, fd = d, c, fc
            c = hi - _GOLDEN * (hi - lo)
            fc = at(c)
        else:
            lo, c, fc = c, d, fd
            d = lo + _GOLDEN * (hi - lo)
            fd = at(d)
    return max((best, fc, fd), key=lambda e: sense * e.value)
