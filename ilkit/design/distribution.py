"""A girder's share of the lane loads (distribution factors), three ways.

* :func:`given_distribution`: numbers the engineer gives per action
  (moment, shear, deflection), e.g. from a refined analysis;
* :func:`lever_rule` (and :func:`rigid_section`): computed from the
  cross-section by statics, with the design lanes placed across the deck for
  the largest share (:mod:`ilkit.design.transverse`);
* :func:`aashto_distribution`: the AASHTO LRFD approximate live-load
  distribution formulas for decks on girders (cross-sections a, e, k, and i,
  j connected to act as a unit, Table 4.6.2.2.1-1): interior and exterior
  girders, moment (4.6.2.2.2b, 4.6.2.2.2d) and shear (4.6.2.2.3a,
  4.6.2.2.3b), one lane and two or more lanes loaded, the exterior-girder
  correction e, the rigid-section check for steel girders with diaphragms or
  cross-frames (4.6.2.2.2d) and the skew corrections (4.6.2.2.2e,
  4.6.2.2.3c).  Every input is checked against the formulas' range of
  applicability: outside it, :class:`~ilkit.OutsideRangeError` says to use
  the lever rule or a refined analysis.  The formulas are recalled from
  memory and checked against a published design aid's worked values (see the
  tests); the licensed current edition governs.

A :class:`Distribution` holds one :class:`~ilkit.design.Factor` of kind
``"distribution"`` per action, in lanes (a girder's share of one lane's
load, dimensionless).  Every distribution factor contains the lanes (it is
the share of all the loaded lanes); the AASHTO formulas, the lever rule and
the rigid check also include the multiple presence factor: their factors say
so (``includes=("lanes", "multiple presence")``), so that neither is applied
twice.
"""

from __future__ import annotations

import math
from dataclasses import dataclass, field, replace
from typing import TYPE_CHECKING, Literal

from ilkit._check import choice, flag
from ilkit._display import RichDisplay
from ilkit._exact import fmt
from ilkit.design._inputs import amount, text
from ilkit.design.factors import Factor
from ilkit.design.lanes import AASHTO_LRFD, FT, design_lanes, multiple_presence_factor, read_length
from ilkit.design.transverse import CrossSection, TransverseLine, place_design_lanes, transverse_line
from ilkit.errors import DesignInputError, OutsideRangeError

if TYPE_CHECKING:  # pragma: no cover
    import pandas as pd

__all__ = [
    "Action",
    "Distribution",
    "given_distribution",
    "lever_rule",
    "rigid_section",
    "distribution_from_line",
    "aashto_distribution",
    "longitudinal_stiffness",
]

Action = Literal["moment", "shear", "reaction", "deflection"]
"""The actions a distribution factor is given for (a reaction takes the shear factor)."""

_SOURCE_M = f"{AASHTO_LRFD}, 4.6.2.2.2b, Table 4.6.2.2.2b-1"
_SOURCE_MX = f"{AASHTO_LRFD}, 4.6.2.2.2d, Table 4.6.2.2.2d-1"
_SOURCE_V = f"{AASHTO_LRFD}, 4.6.2.2.3a, Table 4.6.2.2.3a-1"
_SOURCE_VX = f"{AASHTO_LRFD}, 4.6.2.2.3b, Table 4.6.2.2.3b-1"
_SOURCE_D = f"{AASHTO_LRFD}, 2.5.2.6.2 and Table 3.6.1.1.2-1"
_MP = ("lanes", "multiple presence")
"""What a factor found by the formulas, the lever rule or the rigid check contains besides the share."""


@dataclass(frozen=True)
class Distribution(RichDisplay):
    """A girder's share of one lane's load, per action (dimensionless, lanes).

    ``moment``, ``shear`` and ``deflection`` are :class:`~ilkit.design.Factor`
    objects of kind ``"distribution"`` (``deflection`` may be ``None``: not
    given); a reaction takes the shear factor.  ``steps`` lists how each was
    found: one row ``(action, case, value, governs, note)`` per candidate
    (one lane, two or more lanes, the lever rule, the rigid check ...).
    ``one_lane`` holds the one-lane factors with m = 1.20 in them, for
    :meth:`fatigue`.  ``checks`` lists the ranges of applicability checked
    (the AASHTO formulas): one row ``(name, value, low, high, unit, table)``
    per parameter, ``low`` or ``high`` ``None`` where the range is open.
    """

    girder: str
    method: str
    moment: Factor
    shear: Factor
    deflection: Factor | None = None
    steps: tuple[tuple[str, str, float, bool, str], ...] = ()
    one_lane: tuple[Factor, Factor] | None = field(default=None, repr=False)
    checks: tuple[tuple[str, float, float | None, float | None, str, str], ...] = field(default=(), repr=False)

    def factor(self, action: Action) -> Factor:
        """The factor for ``action``: ``"moment"``, ``"shear"`` (also for ``"reaction"``) or ``"deflection"``
        (dimensionless)."""
        choice(action, ("moment", "shear", "reaction", "deflection"), what="factor: action", field="action",
               error=DesignInputError)
        if action == "moment":
            return self.moment
        if action in ("shear", "reaction"):
            return self.shear
        if self.deflection is None:
            raise DesignInputError(
                f"{self.girder}: no distribution factor for deflection was given; give deflection= (e.g. the "
                "number of lanes times m divided by the number of girders, AASHTO LRFD 2.5.2.6.2).",
                field="deflection")
        return self.deflection

    def fatigue(self) -> Distribution:
        """The factors for the fatigue limit state: the one-lane factors with the multiple presence factor
        removed (divided by 1.20, AASHTO LRFD 3.6.1.1.2, from memory), dimensionless."""
        if self.one_lane is None:
            raise DesignInputError(
                f"{self.girder}: the one-lane factors are not known for this distribution ({self.method}); give the "
                "fatigue factors with given_distribution(...).", field="fatigue")
        m = multiple_presence_factor(1).value
        moment, shear = (Factor("distribution", f.value / m, f.symbol, source=f"{f.source}; 3.6.1.1.2",
                                from_memory=True, includes=("lanes",),
                                note="one lane loaded, m = 1.20 removed (fatigue)")
                         for f in self.one_lane)
        return replace(self, method=f"{self.method}, for fatigue", moment=moment, shear=shear, deflection=None,
                       steps=(), one_lane=None)

    def __repr__(self) -> str:
        return (f"Distribution({self.girder}: {self.method}; moment {self.moment.value:.4f}, shear "
                f"{self.shear.value:.4f}"
                + (f", deflection {self.deflection.value:.4f}" if self.deflection is not None else "") + " lanes)")

    def to_frame(self) -> pd.DataFrame:
        """How each factor was found: one row per candidate (``action``, ``case``, ``value`` in lanes,
        ``governs``, ``note``)."""
        import pandas as pd

        return pd.DataFrame(self.steps, columns=["action", "case", "value", "governs", "note"])

    def ranges(self) -> pd.DataFrame:
        """The ranges of applicability checked (AASHTO formulas): one row per parameter with its ``value``, the
        range ``from`` .. ``to`` (empty where open), its ``unit`` and the ``table`` that sets it; empty for
        a distribution found without the formulas."""
        import pandas as pd

        rows = [(n, v, "" if lo is None else lo, "" if hi is None else hi, u, t) for n, v, lo, hi, u, t in self.checks]
        return pd.DataFrame(rows, columns=["parameter", "value", "from", "to", "unit", "table"])


def _label(girder: object) -> str:
    if isinstance(girder, int) and not isinstance(girder, bool):
        return f"girder {girder}"
    return text(girder, "girder", empty=True) or "girder"


def given_distribution(
    moment: float,
    shear: float | None = None,
    deflection: float | None = None,
    *,
    includes_multiple_presence: bool = False,
    girder: str = "girder",
    source: str = "",
    note: str = "",
) -> Distribution:
    """A distribution the engineer gives: the girder's share of one lane's load per action (lanes,
    dimensionless, at least 0).

    ``shear`` defaults to ``moment``; ``deflection`` may be left out.
    ``includes_multiple_presence=True`` says the values already contain the
    multiple presence factor (as a refined analysis with the lanes loaded
    often does), so that it is not applied again.  ``source`` names where the
    numbers come from (a grillage model, a calculation).
    """
    mp = flag(includes_multiple_presence, what="given_distribution: includes_multiple_presence",
              field="includes_multiple_presence", error=DesignInputError)
    src, words = text(source, "source", empty=True), text(note, "note", empty=True)

    def make(value: float, symbol: str) -> Factor:
        return Factor("distribution", amount(value, f"given_distribution: {symbol}", minimum=0.0), symbol,
                      source=src, includes=_MP if mp else ("lanes",), note=words)

    m = make(moment, "gM")
    v = make(moment if shear is None else shear, "gV")
    d = None if deflection is None else make(deflection, "gΔ")
    steps = [("moment", "given", m.value, True, words), ("shear", "given", v.value, True, words)]
    if d is not None:
        steps.append(("deflection", "given", d.value, True, words))
    return Distribution(_label(girder), "given", m, v, d, tuple(steps))


def _deflection(section: CrossSection) -> Factor:
    """All design lanes loaded, every girder sharing equally: m × NL / Nb (AASHTO LRFD 2.5.2.6.2)."""
    lanes = design_lanes(section.roadway_width, units=section.units.name).count
    m = multiple_presence_factor(lanes)
    return Factor("distribution", m.value * lanes / section.girders, "gΔ", source=_SOURCE_D, from_memory=True,
                  includes=_MP, note=f"{lanes} lanes × m {m.value:.2f} / {section.girders} girders")


def distribution_from_line(
    line: TransverseLine,
    *,
    loaded: int | None = None,
    multiple_presence: bool = True,
    wheel_spacing: float | None = None,
    clearance: float | None = None,
) -> Distribution:
    """The distribution of a girder from its transverse line (:func:`~ilkit.design.transverse_line`): the
    AASHTO design lanes placed for the largest share (:func:`~ilkit.design.place_design_lanes`), the same
    factor for moment and shear; the deflection factor m NL / Nb.  Lanes, dimensionless."""
    placed = place_design_lanes(line, loaded=loaded, multiple_presence=multiple_presence,
                                wheel_spacing=wheel_spacing, clearance=clearance)
    g = placed.factor
    steps = []
    for n, raw, total in placed.trials:
        m = multiple_presence_factor(n).value if multiple_presence else 1.0
        steps.append(("moment and shear", f"{n} lane{'s' if n > 1 else ''} loaded", total, n == placed.loaded,
                      f"share {raw:.4f} × m {m:.2f}"))
    one = next((t for t in placed.trials if t[0] == 1), None)
    one_lane = None
    if one is not None and multiple_presence:
        f1 = Factor("distribution", one[2], "g", source=line.source, from_memory=line.from_memory, includes=_MP)
        one_lane = (f1, f1)
    moment = replace(g, symbol="gM")
    shear = replace(g, symbol="gV")
    return Distribution(f"girder {line.girder}", line.method, moment, shear, _deflection(line.section),
                        tuple(steps), one_lane)


def lever_rule(section: CrossSection, girder: int, **options: object) -> Distribution:
    """The lever rule: the girder's share of the design lanes by statics of the deck (simple spans between the
    girders, cantilever overhangs), wheel lines 6 ft apart and 2 ft from the lane edges and the barrier,
    with the multiple presence factor (lanes, dimensionless).  ``options`` as for
    :func:`distribution_from_line` (``loaded``, ``multiple_presence``, ``wheel_spacing``, ``clearance``)."""
    return distribution_from_line(transverse_line(section, girder, "lever rule"), **options)  # type: ignore[arg-type]


def rigid_section(section: CrossSection, girder: int, **options: object) -> Distribution:
    """The girder's share of the design lanes on a rigid cross-section (R = NL/Nb + X e / Σx², AASHTO LRFD
    4.6.2.2.2d, from memory), with the multiple presence factor (lanes, dimensionless); ``options`` as for
    :func:`distribution_from_line`."""
    return distribution_from_line(transverse_line(section, girder, "rigid"), **options)  # type: ignore[arg-type]


def longitudinal_stiffness(n: float, inertia: float, area: float, eccentricity: float) -> float:
    """Kg = n (I + A eg²), AASHTO LRFD 4.6.2.2.1-1 (from memory): ``n`` the modular ratio of the girder to the
    deck, ``inertia`` I (length⁴) and ``area`` A (length²) of the girder alone, ``eccentricity`` eg (length)
    between the centres of gravity of the girder and the deck.  Length⁴ in the units given (in⁴ for the
    formulas of :func:`aashto_distribution`); positive."""
    ratio = amount(n, "longitudinal_stiffness: n", strict=True)
    i = amount(inertia, "longitudinal_stiffness: inertia", strict=True)
    a = amount(area, "longitudinal_stiffness: area", strict=True)
    e = amount(eccentricity, "longitudinal_stiffness: eccentricity", minimum=None)
    return ratio * (i + a * e * e)


# ----------------------------------------------------- the approximate formulas
DeckType = Literal["a", "e", "k", "i", "j"]

_RANGE_FIX = ("use the lever rule (ilkit.design.lever_rule) or a refined analysis (a transverse line from a "
              "grillage: ilkit.design.transverse_line(section, girder, ordinates=[...]))")


def _check_range(name: str, value: float, low: float | None, high: float | None, unit: str, table: str
                 ) -> tuple[str, float, float | None, float | None, str, str]:
    """The row of a parameter within its range; outside it, :class:`~ilkit.OutsideRangeError`."""
    if (low is not None and value < low) or (high is not None and value > high):
        span = (f"from {fmt(low)} to {fmt(high)}" if low is not None and high is not None
                else f"at least {fmt(low)}" if low is not None else f"at most {fmt(high)}")
        raise OutsideRangeError(
            f"aashto_distribution: {name} = {value:.6g}{' ' + unit if unit else ''} is outside the range of "
            f"applicability of the approximate formulas ({name} {span}{' ' + unit if unit else ''}, {table}); "
            f"{_RANGE_FIX}.",
            field=name, value=value, low=low, high=high)
    return name, value, low, high, unit, table


def aashto_distribution(
    section: CrossSection,
    girder: int,
    *,
    span: float,
    slab_thickness: float,
    Kg: float,
    deck_type: DeckType = "a",
    skew: float = 0.0,
    diaphragms: bool = False,
) -> Distribution:
    """The AASHTO LRFD approximate live-load distribution factors of ``girder`` (recalled from memory).

    For decks on girders of cross-section ``deck_type`` a (steel girders), e
    (concrete T-beams), k (precast concrete I or bulb-tee), i, j (connected
    to act as a unit), Table 4.6.2.2.1-1.  S is the girder spacing (ft; for
    an interior girder the mean of its two spacings), L the ``span`` (ft),
    ts the ``slab_thickness`` (in), Kg = n (I + A eg²) the longitudinal
    stiffness (in⁴, :func:`longitudinal_stiffness`); lengths in the section's
    length unit (or pint quantities), Kg in that unit to the fourth power.

    Interior girder (4.6.2.2.2b, 4.6.2.2.3a): moment, one lane
    0.06 + (S/14)^0.4 (S/L)^0.3 (Kg/12Lts³)^0.1; two or more lanes
    0.075 + (S/9.5)^0.6 (S/L)^0.2 (Kg/12Lts³)^0.1; shear, one lane
    0.36 + S/25; two or more 0.2 + S/12 - (S/35)².  Range: 3.5 <= S <= 16.0
    ft, 4.5 <= ts <= 12.0 in, 20 <= L <= 240 ft, Nb >= 4, 10,000 <= Kg <=
    7,000,000 in⁴ (moment).  With three girders the moment factor is the
    lesser of the formula and the lever rule, and shear is by the lever rule.

    Exterior girder (4.6.2.2.2d, 4.6.2.2.3b): one lane by the lever rule;
    two or more lanes e × the interior formula with e = 0.77 + de/9.1
    (moment) and 0.6 + de/10 (shear), -1.0 <= de <= 5.5 ft
    (:attr:`~ilkit.design.CrossSection.curb_distance`).  With
    ``diaphragms=True`` (steel girders with diaphragms or cross-frames) the
    factor is not less than the rigid cross-section's m × R, R = NL/Nb +
    X_ext Σe / Σx² (4.6.2.2.2d-1).

    Skew ``skew`` (degrees): moment × (1 - c1 (tan θ)^1.5), c1 = 0.25
    (Kg/12Lts³)^0.25 (S/L)^0.5, c1 = 0 below 30°, θ = 60° above 60°
    (4.6.2.2.2e); shear × (1 + 0.20 (12Lts³/Kg)^0.3 tan θ), θ <= 60°
    (4.6.2.2.3c).

    The factors include the multiple presence factor (lanes, dimensionless);
    the largest candidate governs.  The deflection factor is m × NL / Nb
    (2.5.2.6.2).  Outside a range: :class:`~ilkit.OutsideRangeError`.
    """
    if not isinstance(section, CrossSection):
        raise DesignInputError(f"aashto_distribution: give a CrossSection, got {type(section).__name__}.",
                               field="section", value=section)
    k = section.girder(girder)
    kind = choice(deck_type, ("a", "e", "k", "i", "j"), what="aashto_distribution: deck_type", field="deck_type",
                  error=DesignInputError)
    u = section.units
    to_ft = float(u.metres_per_length / FT)
    L = read_length(span, "span", u) * to_ft
    ts = read_length(slab_thickness, "slab_thickness", u) * to_ft * 12.0
    kg = read_length(Kg, "Kg", u, dims=(4, 0)) * to_ft**4 * 12.0**4
    theta = amount(skew, "skew (degrees)", minimum=0.0)
    steel = flag(diaphragms, what="aashto_distribution: diaphragms", field="diaphragms", error=DesignInputError)
    exterior = section.is_exterior(k)
    spacings = section.spacings
    near = [spacings[i] for i in (k - 2, k - 1) if 0 <= i < len(spacings)]
    S = sum(near) / len(near) * to_ft
    nb = section.girders
    table_m = "Table 4.6.2.2.2b-1" if not exterior else "Table 4.6.2.2.2d-1"
    checks = [
        _check_range("S", S, 3.5, 16.0, "ft", table_m),
        _check_range("ts", ts, 4.5, 12.0, "in", table_m),
        _check_range("L", L, 20.0, 240.0, "ft", table_m),
        _check_range("Kg", kg, 10_000.0, 7_000_000.0, "in⁴", table_m),
        _check_range("Nb", nb, 3, None, "", table_m),
        _check_range("skew", theta, 0.0, 60.0, "degrees", "4.6.2.2.2e and 4.6.2.2.3c"),
    ]
    if exterior:
        checks.append(_check_range("de", section.curb_distance * to_ft, -1.0, 5.5, "ft",
                                   "Tables 4.6.2.2.2d-1, 4.6.2.2.3b-1"))
    stiff = kg / (12.0 * L * ts**3)
    lanes = design_lanes(section.roadway_width, units=u.name).count
    several = lanes >= 2
    tan = math.tan(math.radians(theta))
    c1 = 0.0 if theta < 30.0 else 0.25 * stiff**0.25 * (S / L) ** 0.5
    skew_m = 1.0 - c1 * math.tan(math.radians(min(theta, 60.0))) ** 1.5
    skew_v = 1.0 + 0.20 * (1.0 / stiff) ** 0.3 * tan
    m1 = 0.06 + (S / 14.0) ** 0.4 * (S / L) ** 0.3 * stiff**0.1
    m2 = 0.075 + (S / 9.5) ** 0.6 * (S / L) ** 0.2 * stiff**0.1
    v1 = 0.36 + S / 25.0
    v2 = 0.2 + S / 12.0 - (S / 35.0) ** 2
    lever = lever_rule(section, k) if nb == 3 else None
    lever_one = lever_rule(section, k, loaded=1) if exterior else None  # m = 1.20 included
    rigid = rigid_section(section, k) if exterior and steel else None
    head = f"S = {S:.4g} ft, L = {L:.4g} ft, ts = {ts:.4g} in, Kg/(12 L ts³) = {stiff:.4g}"
    rows: list[tuple[str, str, float, str]] = []  # action, case, value, note
    if not exterior:
        rows += [("moment", "one lane loaded", m1, "0.06 + (S/14)^0.4 (S/L)^0.3 (Kg/12Lts³)^0.1")]
        if several:
            rows += [("moment", "two or more lanes loaded", m2, "0.075 + (S/9.5)^0.6 (S/L)^0.2 (Kg/12Lts³)^0.1")]
        if nb > 3:
            rows += [("shear", "one lane loaded", v1, "0.36 + S/25")]
            if several:
                rows += [("shear", "two or more lanes loaded", v2, "0.2 + S/12 - (S/35)²")]
    else:
        assert lever_one is not None
        e_m = 0.77 + section.curb_distance * to_ft / 9.1
        e_v = 0.6 + section.curb_distance * to_ft / 10.0
        one = lever_one.moment.value
        rows += [("moment", "one lane loaded: lever rule", one, "lever rule share × m 1.20")]
        if several:
            rows += [("moment", "two or more lanes loaded: e × interior", e_m * m2,
                      f"e = 0.77 + de/9.1 = {e_m:.4f}; interior {m2:.4f}")]
        rows += [("shear", "one lane loaded: lever rule", one, "lever rule share × m 1.20")]
        if several and nb > 3:
            rows += [("shear", "two or more lanes loaded: e × interior", e_v * v2,
                      f"e = 0.6 + de/10 = {e_v:.4f}; interior {v2:.4f}")]
    if lever is not None:  # three girders: shear by the lever rule (Tables 4.6.2.2.3a-1, 4.6.2.2.3b-1)
        rows += [("shear", "three girders: lever rule", lever.shear.value, "lever rule, all lane counts, with m")]
    if theta:
        rows = [(a, f"{c}, skew", v * (skew_m if a == "moment" else skew_v),
                 f"{n}; × {'1 - c1 tan^1.5 θ' if a == 'moment' else '1 + 0.2 (12Lts³/Kg)^0.3 tan θ'} = "
                 f"{skew_m if a == 'moment' else skew_v:.4f}") for a, c, v, n in rows]
    candidates = {"moment": [r for r in rows if r[0] == "moment"], "shear": [r for r in rows if r[0] == "shear"]}
    if lever is not None:  # three girders: the lesser of the formula and the lever rule (moment)
        top = max(candidates["moment"], key=lambda r: r[2])
        lev = ("moment", "three girders: lever rule", lever.moment.value, "the lesser of the formula and this")
        candidates["moment"] = [min(top, lev, key=lambda r: r[2])]
        rows.append(lev)
    if rigid is not None:
        for action in ("moment", "shear"):
            check = (action, "rigid cross-section (diaphragms)", rigid.moment.value,
                     "m × (NL/Nb + X e / Σx²), 4.6.2.2.2d-1; the factor is not less than this")
            candidates[action].append(check)
            rows.append(check)
    chosen = {a: max(c, key=lambda r: r[2]) for a, c in candidates.items()}
    where = "exterior" if exterior else "interior"
    src_m, src_v = (_SOURCE_MX, _SOURCE_VX) if exterior else (_SOURCE_M, _SOURCE_V)
    moment = Factor("distribution", chosen["moment"][2], "gM", source=src_m, from_memory=True, includes=_MP,
                    note=f"{where} girder, {chosen['moment'][1]}; {head}")
    shear = Factor("distribution", chosen["shear"][2], "gV", source=src_v, from_memory=True, includes=_MP,
                   note=f"{where} girder, {chosen['shear'][1]}; {head}")
    steps = tuple((a, c, v, (a, c, v, n) == chosen.get(a), n) for a, c, v, n in rows)
    ones = [r for r in rows if "one lane" in r[1]]
    one_lane = None
    if len(ones) == 2:
        f1m = Factor("distribution", ones[0][2], "gM", source=src_m, from_memory=True, includes=_MP)
        f1v = Factor("distribution", ones[1][2], "gV", source=src_v, from_memory=True, includes=_MP)
        one_lane = (f1m, f1v)
    return Distribution(f"girder {k} ({where})", f"AASHTO approximate formulas, cross-section {kind}",
                        moment, shear, _deflection(section), steps, one_lane, tuple(checks))
