"""Published moving-load models.

Each function builds a model from the definitions of the standard it names,
with the clause in its docstring.  Where a value was read in a copy of the
standard (or in a document quoting it), the docstring says **seen** after
the clause; where it was recalled rather than read, it says **from memory**;
every such value is an argument you can override.  Each model also carries this as
plain data, for calculation sheets: ``model.source`` (document and clauses)
and ``model.from_memory`` (the values recalled, each with its clause).  The
licensed current edition of each standard (and its National Annex, for the
Eurocodes) governs: check the values against it.

Units: AASHTO and AREMA models are in kip and ft (``"kip-ft"``), EN 1991-2
models in kN and m (``"kN-m"``).  They are converted when applied to a beam
in another system.  Models give the load of one lane or one track, acting as
a line load along the girder line.
"""

from __future__ import annotations

import math
import numbers
from typing import Literal

from ilkit._check import choice, flag, whole
from ilkit._exact import fmt
from ilkit.errors import LoadInputError
from ilkit.loads.combination import Combination, LoadModel
from ilkit.loads.primitives import AxleTrain, TrainUniform, UniformBlocks, UniformLoad, number, numbers_of

__all__ = [
    "design_truck",
    "design_tandem",
    "design_lane",
    "two_design_trucks",
    "hl93",
    "fatigue_truck",
    "multiple_presence",
    "lm1",
    "lm2",
    "lm71",
    "sw0",
    "sw2",
    "phi2",
    "phi3",
    "ALPHA_VALUES",
    "cooper_train",
    "alternate_live_load",
    "cooper",
]

_AASHTO = "AASHTO LRFD Bridge Design Specifications"
_EN = "EN 1991-2 (Eurocode 1, traffic loads on bridges)"
_AREMA = "AREMA Manual for Railway Engineering, Chapter 15"
_CAUTION = (
    "Check every value against the licensed current edition of the standard and the governing "
    "local code; results must be checked by a qualified engineer."
)


# ====================================================================== AASHTO
def design_truck(rear_spacing: float | tuple[float, float] = (14.0, 30.0)) -> AxleTrain:
    """AASHTO LRFD design truck (3.6.1.2.2, seen): axles 8.0, 32.0, 32.0 kip.

    14.0 ft from the front to the middle axle; middle to rear axle varied
    from 14.0 to 30.0 ft to produce the extreme (``rear_spacing``: a range
    or a fixed value).  Axles that do not add to the extreme are left out
    (3.6.1.3.1, from memory).  kip, ft.
    """
    return AxleTrain(
        [8.0, 32.0, 32.0], [14.0, rear_spacing], units="kip-ft", name="design truck", drop_adverse_axles=True
    )


def design_tandem() -> AxleTrain:
    """AASHTO LRFD design tandem (3.6.1.2.3, seen): two 25.0 kip axles 4.0 ft apart. kip, ft."""
    return AxleTrain([25.0, 25.0], [4.0], units="kip-ft", name="design tandem", drop_adverse_axles=True)


def design_lane(intensity: float = 0.64) -> UniformLoad:
    """AASHTO LRFD design lane load (3.6.1.2.4, seen): 0.64 kip/ft, on any parts that give the extreme.

    No dynamic allowance.  kip/ft.
    """
    return UniformLoad(intensity, units="kip-ft", name="design lane")


def two_design_trucks(gap: float = 50.0, rear_spacing: float = 14.0) -> AxleTrain:
    """Two AASHTO design trucks in one lane (3.6.1.3.1, from memory).

    At least ``gap`` = 50.0 ft from the lead axle of the following truck to
    the rear axle of the leading one; rear axle spacing 14.0 ft in both.
    Axles that do not add to the extreme are left out. kip, ft.
    """
    g = number(gap, "gap")
    truck = [8.0, 32.0, 32.0]
    return AxleTrain(
        truck + truck,
        [14.0, rear_spacing, (g, math.inf), 14.0, rear_spacing],
        units="kip-ft",
        name="two design trucks",
        drop_adverse_axles=True,
    )


def multiple_presence(lanes: int) -> float:
    """AASHTO LRFD multiple presence factor m (Table 3.6.1.1.2-1, from memory).

    1.20 for one loaded lane, 1.00 for two, 0.85 for three, 0.65 for more.
    Not applied for fatigue.
    """
    n = whole(
        lanes, what="multiple_presence: the number of loaded lanes", field="lanes", minimum=1, error=LoadInputError
    )
    return {1: 1.20, 2: 1.00, 3: 0.85}.get(n, 0.65)


def hl93(
    *,
    dynamic_allowance: float = 0.33,
    factor: float = 1.0,
    rear_spacing: float | tuple[float, float] = (14.0, 30.0),
    lane_intensity: float = 0.64,
    two_truck_factor: float = 0.90,
    two_truck_gap: float = 50.0,
) -> LoadModel:
    """AASHTO LRFD HL-93 vehicular live load for one lane (3.6.1.2.1, seen).

    The extreme of:

    * design truck (3.6.1.2.2) with ``dynamic_allowance`` IM = 33 % (Table
      3.6.2.1-1, seen) plus the design lane load (3.6.1.2.4, no IM);
    * design tandem (3.6.1.2.3) with IM plus the design lane load;
    * for negative moment between points of contraflexure (under a uniform
      load on all spans) and for reactions at interior supports only:
      ``two_truck_factor`` = 90 % of two design trucks at least
      ``two_truck_gap`` = 50 ft apart with 14 ft rear spacings, with IM, plus
      90 % of the design lane load (3.6.1.3.1, from memory).

    Axles that do not add to the extreme are left out (3.6.1.3.1, from
    memory).  ``factor`` multiplies everything: a multiple presence factor
    (:func:`multiple_presence`) or a distribution factor.  kip, ft.
    """
    truck = design_truck(rear_spacing)
    tandem = design_tandem()
    lane = design_lane(lane_intensity)
    two = two_design_trucks(two_truck_gap)
    im = number(dynamic_allowance, "dynamic_allowance", strict=False)
    f = number(factor, "factor")
    tf = number(two_truck_factor, "two_truck_factor")
    return LoadModel(
        "HL-93",
        [
            Combination("design truck + lane", [truck, lane], dynamic_allowance=im, dynamic_on=[truck.name], factor=f),
            Combination(
                "design tandem + lane", [tandem, lane], dynamic_allowance=im, dynamic_on=[tandem.name], factor=f
            ),
            Combination(
                f"{fmt(100 * tf)} % (two design trucks + lane)",
                [two, lane],
                dynamic_allowance=im,
                dynamic_on=[two.name],
                factor=tf * f,
                applies_to="negative moment and interior reactions",
            ),
        ],
        source=f"{_AASHTO}, 3.6.1.2, 3.6.1.3.1, Table 3.6.2.1-1",
        notes=_CAUTION,
        from_memory=(
            "two-truck rule: 90 % of two design trucks (lead axle of one at least 50 ft from the rear axle of "
            "the other, rear spacings 14 ft) plus 90 % of the lane load, for negative moment between points of "
            "contraflexure and for reactions at interior supports (3.6.1.3.1)",
            "axles that do not add to the extreme are left off (3.6.1.3.1)",
        ),
    )


def fatigue_truck(dynamic_allowance: float = 0.15, factor: float = 1.0) -> LoadModel:
    """AASHTO LRFD fatigue truck (3.6.1.4.1, seen): one design truck with the rear spacing fixed at 30.0 ft.

    No lane load, no multiple presence.  ``dynamic_allowance`` 15 % (Table
    3.6.2.1-1, from memory).  kip, ft.
    """
    truck = design_truck(30.0).renamed("fatigue truck")
    return LoadModel(
        "fatigue truck",
        [
            Combination(
                "fatigue truck",
                [truck],
                dynamic_allowance=number(dynamic_allowance, "dynamic_allowance", strict=False),
                dynamic_on=[truck.name],
                factor=factor,
            )
        ],
        source=f"{_AASHTO}, 3.6.1.4.1, Table 3.6.2.1-1",
        notes=_CAUTION,
        from_memory=("dynamic load allowance IM = 15 % for fatigue (Table 3.6.2.1-1)",),
    )


# ================================================================== EN 1991-2
_LM1 = {1: (300.0, 9.0), 2: (200.0, 2.5), 3: (100.0, 2.5), "other": (0.0, 2.5)}

ALPHA_VALUES: tuple[float, ...] = (0.75, 0.83, 0.91, 1.00, 1.10, 1.21, 1.33, 1.46)
"""Values of α for classified rail loads (EN 1991-2 6.3.2, from memory)."""


def lm1(
    lane: Literal[1, 2, 3, "other"] = 1,
    *,
    lane_width: float = 3.0,
    alpha_Q: float = 1.0,
    alpha_q: float = 1.0,
    tandem_spacing: float = 1.2,
) -> LoadModel:
    """EN 1991-2 Load Model 1 on one notional lane, as line loads (4.3.2, Table 4.2).

    Tandem system: two axles of ``alpha_Q`` x Q (Q = 300, 200, 100 kN in
    lanes 1, 2, 3, seen), ``tandem_spacing`` = 1.2 m apart (from memory);
    only the complete tandem counts (from memory).  Uniform load ``alpha_q``
    x q x ``lane_width`` (q = 9 kN/m² in lane 1, 2.5 kN/m² elsewhere, seen;
    notional lane 3 m wide, seen) on the parts where it is unfavourable.
    Lane ``"other"`` carries the uniform load only.  The adjustment factors
    are 1.0 unless the National Annex sets them (seen).  Dynamic
    amplification is included in the values.  kN, m.
    """
    if isinstance(lane, numbers.Integral) and not isinstance(lane, bool) and int(lane) in _LM1:
        lane = int(lane)  # type: ignore[assignment]
    elif not isinstance(lane, str) or lane != "other":
        raise LoadInputError(f"lm1: lane must be one of 1, 2, 3 or 'other', got {lane!r}.", field="lane", value=lane)
    Q, q = _LM1[lane]
    width = number(lane_width, "lane_width")
    parts: list = []
    if Q:
        parts.append(
            AxleTrain(
                [number(alpha_Q, "alpha_Q") * Q] * 2,
                [tandem_spacing],
                units="kN-m",
                name="LM1 tandem",
            )
        )
    parts.append(UniformLoad(number(alpha_q, "alpha_q") * q * width, units="kN-m", name="LM1 uniform load"))
    return LoadModel(
        f"LM1 lane {lane}",
        [Combination(f"LM1 lane {lane}", parts)],
        source=f"{_EN}, 4.3.2, Table 4.2",
        notes=_CAUTION,
        from_memory=("tandem axle spacing 1.2 m; only the complete tandem counts (4.3.2)",),
    )


def lm2(beta_Q: float = 1.0) -> LoadModel:
    """EN 1991-2 Load Model 2 (4.3.3, seen): a single axle of ``beta_Q`` x 400 kN.

    Dynamic amplification included.  kN, m.
    """
    axle = AxleTrain([number(beta_Q, "beta_Q") * 400.0], [], units="kN-m", name="LM2 axle")
    return LoadModel("LM2", [Combination("LM2", [axle])], source=f"{_EN}, 4.3.3", notes=_CAUTION)


def _alpha(alpha: float, any_alpha: bool) -> float:
    a = number(alpha, "alpha")
    listed_value = any(abs(a - v) < 1e-12 for v in ALPHA_VALUES)
    if not flag(any_alpha, what="any_alpha", field="any_alpha", error=LoadInputError) and not listed_value:
        raise LoadInputError(
            f"alpha: {fmt(a)} is not one of the values of EN 1991-2 6.3.2 ({', '.join(fmt(v) for v in ALPHA_VALUES)}, "
            "from memory); pass any_alpha=True to use another value.",
            field="alpha",
            value=alpha,
        )
    return a


def lm71(
    alpha: float = 1.0,
    *,
    dynamic_factor: float = 1.0,
    any_alpha: bool = False,
    axle: float = 250.0,
    spacing: float = 1.6,
    uniform: float = 80.0,
    clearance: float = 0.8,
) -> LoadModel:
    """EN 1991-2 Load Model 71 for one track (6.3.2, from memory).

    Four ``axle`` = 250 kN axles at ``spacing`` = 1.6 m, with ``uniform`` =
    80 kN/m on both sides beyond ``clearance`` = 0.8 m from the outer axles,
    of unlimited length and applied only where unfavourable.  All loads
    times ``alpha`` (one of :data:`ALPHA_VALUES`, 1.00 unless specified; the
    rule is seen, the values from memory).  ``dynamic_factor`` multiplies the
    whole: Φ2 or Φ3 (:func:`phi2`, :func:`phi3`).  kN, m.
    """
    a = _alpha(alpha, any_alpha)
    q = TrainUniform(a * number(uniform, "uniform"), number(clearance, "clearance", strict=False), breakable=True)
    train = AxleTrain([a * number(axle, "axle")] * 4, [spacing] * 3, units="kN-m", name="LM71", ahead=q, behind=q)
    return LoadModel(
        "LM71",
        [Combination("LM71", [train], factor=number(dynamic_factor, "dynamic_factor"))],
        source=f"{_EN}, 6.3.2",
        notes=_CAUTION,
        from_memory=(
            "the definition: four 250 kN axles at 1.6 m, 80 kN/m beyond 0.8 m from the outer axles, applied "
            "where unfavourable (6.3.2)",
            "the values of α (6.3.2)",
        ),
    )


def _sw(name: str, q: float, length: float, gap: float, factor: float) -> LoadModel:
    blocks = UniformBlocks(q, [length, length], [gap], units="kN-m", name=name)
    return LoadModel(
        name,
        [Combination(name, [blocks], factor=number(factor, "dynamic_factor"))],
        source=f"{_EN}, 6.3.3, Table 6.1",
        notes=_CAUTION,
        from_memory=("intensity, block length and distance between the blocks (6.3.3, Table 6.1)",),
    )


def sw0(
    alpha: float = 1.0,
    *,
    dynamic_factor: float = 1.0,
    any_alpha: bool = False,
    intensity: float = 133.0,
    length: float = 15.0,
    gap: float = 5.3,
) -> LoadModel:
    """EN 1991-2 Load Model SW/0 for one track (6.3.3, Table 6.1, from memory).

    ``alpha`` x ``intensity`` = 133 kN/m over two blocks of ``length`` =
    15.0 m, ``gap`` = 5.3 m apart, placed as whole blocks.
    ``dynamic_factor``: Φ2 or Φ3.  kN, m.
    """
    return _sw("SW/0", _alpha(alpha, any_alpha) * number(intensity, "intensity"), length, gap, dynamic_factor)


def sw2(
    *, dynamic_factor: float = 1.0, intensity: float = 150.0, length: float = 25.0, gap: float = 7.0
) -> LoadModel:
    """EN 1991-2 Load Model SW/2 for one track (6.3.3, Table 6.1, from memory).

    ``intensity`` = 150 kN/m over two blocks of ``length`` = 25.0 m, ``gap`` =
    7.0 m apart, placed as whole blocks.  ``dynamic_factor``: Φ2 or Φ3.
    kN, m.
    """
    return _sw("SW/2", number(intensity, "intensity"), length, gap, dynamic_factor)


def _phi(length: float, a: float, b: float, top: float) -> float:
    root = math.sqrt(number(length, "determinant length L_Φ (m)"))
    if root <= 0.2:
        return top
    return min(max(a / (root - 0.2) + b, 1.0), top)


def phi2(length: float) -> float:
    """EN 1991-2 dynamic factor Φ2 for carefully maintained track (6.4.5.2, from memory).

    Φ2 = 1.44 / (√L_Φ − 0.2) + 0.82, within 1.00 and 1.67; ``length`` is the
    determinant length L_Φ in m.
    """
    return _phi(length, 1.44, 0.82, 1.67)


def phi3(length: float) -> float:
    """EN 1991-2 dynamic factor Φ3 for track with standard maintenance (6.4.5.2, from memory).

    Φ3 = 2.16 / (√L_Φ − 0.2) + 0.73, within 1.00 and 2.00; ``length`` is the
    determinant length L_Φ in m.
    """
    return _phi(length, 2.16, 0.73, 2.00)


# ======================================================================= AREMA
_COOPER_AXLES = (40.0, 80.0, 80.0, 80.0, 80.0, 52.0, 52.0, 52.0, 52.0)
_COOPER_SPACINGS = (8.0, 5.0, 5.0, 5.0, 9.0, 5.0, 6.0, 5.0)


def _per(per: str) -> float:
    return 1.0 if choice(per, ("track", "rail"), what="per", field="per", error=LoadInputError) == "track" else 0.5


def cooper_train(
    n: float = 80,
    *,
    per: Literal["track", "rail"] = "track",
    uniform_breakable: bool = False,
    axles: tuple[float, ...] = _COOPER_AXLES,
    spacings: tuple[float, ...] = _COOPER_SPACINGS,
    between: float = 8.0,
    uniform: float = 8.0,
    uniform_clearance: float = 5.0,
) -> AxleTrain:
    """AREMA Cooper E-n train (Chapter 15; axle loads as 8 x E10 seen, the sequence from memory).

    Two locomotives, each with ``axles`` 40, 80, 80, 80, 80, 52, 52, 52, 52
    kip at ``spacings`` 8, 5, 5, 5, 9, 5, 6, 5 ft, ``between`` = 8 ft between
    them, then ``uniform_clearance`` = 5 ft to a trailing ``uniform`` load of
    8 kip/ft of unlimited length, all for E80 and scaled by n/80.  Per track;
    ``per="rail"`` halves every load (the Manual's tables are per rail).  The
    trailing load stands wherever the train puts it;
    ``uniform_breakable=True`` applies it only where it adds to the extreme.
    kip, ft.
    """
    scale = number(n, "n") / 80.0 * _per(per)
    axles = numbers_of(axles, what="axles", item="axle", wanted="axles: give the axle loads of a locomotive as a list")
    if not axles:
        raise LoadInputError("cooper_train: axles is empty; give the axle loads of a locomotive.", field="axles")
    spacings = numbers_of(
        spacings, what="spacings", item="spacing", wanted="spacings: give the axle spacings of a locomotive as a list"
    )
    if len(spacings) != len(axles) - 1:
        raise LoadInputError(
            f"cooper_train: {len(axles)} axles per locomotive need {len(axles) - 1} spacings, got {len(spacings)}.",
            field="spacings",
            value=spacings,
        )
    return AxleTrain(
        [scale * v for v in (*axles, *axles)],
        [*spacings, between, *spacings],
        units="kip-ft",
        name=f"Cooper E{fmt(number(n, 'n'))}",
        behind=TrainUniform(number(uniform, "uniform") * scale, uniform_clearance, breakable=uniform_breakable),
    )


def alternate_live_load(
    n: float = 80,
    *,
    per: Literal["track", "rail"] = "track",
    axle: float = 100.0,
    spacings: tuple[float, ...] = (5.0, 6.0, 5.0),
) -> AxleTrain:
    """AREMA alternate live load (Chapter 15, from memory): four ``axle`` = 100 kip axles at 5, 6, 5 ft, for E80.

    Scaled by n/80; ``per="rail"`` halves the loads.  kip, ft.
    """
    scale = number(n, "n") / 80.0 * _per(per)
    spacings = numbers_of(
        spacings, what="spacings", item="spacing", wanted="spacings: give the axle spacings as a list"
    )
    loads = [number(axle, "axle") * scale] * (len(spacings) + 1)
    return AxleTrain(loads, list(spacings), units="kip-ft", name="alternate live load")


def cooper(
    n: float = 80,
    *,
    impact: float = 0.0,
    per: Literal["track", "rail"] = "track",
    uniform_breakable: bool = False,
) -> LoadModel:
    """AREMA Cooper E-n live load (Chapter 15): the worse of the E-n train and the alternate live load.

    The axle loads are seen (8 x E10), the axle sequence and the alternate live
    load are from memory: see :func:`cooper_train` and
    :func:`alternate_live_load` to override them and build a
    :class:`LoadModel` of your own.  ``impact`` is the impact fraction added to
    both (compute it from the Manual for the span and the structure type; 0
    by default).  kip, ft.
    """
    train = cooper_train(n, per=per, uniform_breakable=uniform_breakable)
    alternate = alternate_live_load(n, per=per)
    im = number(impact, "impact", strict=False)
    name = f"Cooper E{fmt(number(n, 'n'))}"
    return LoadModel(
        name,
        [
            Combination(name, [train], dynamic_allowance=im, dynamic_on=[train.name] if im else ()),
            Combination(
                "alternate live load", [alternate], dynamic_allowance=im, dynamic_on=[alternate.name] if im else ()
            ),
        ],
        source=_AREMA,
        notes=_CAUTION,
        from_memory=(
            "axle sequence and spacings of the E-n locomotives (Chapter 15)",
            "alternate live load: four 100 kip axles at 5, 6 and 5 ft (Chapter 15)",
        ),
    )
