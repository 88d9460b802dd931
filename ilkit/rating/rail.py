"""Rail ratings: the Cooper E-rating (AREMA) and the classified load α (EN 1991-2).

**Cooper E-rating** (AREMA Manual for Railway Engineering, Chapter 15, allowable-stress rating; from
memory): at every rated section, action and sense the largest Cooper E-n whose effect with impact, added to
the dead load's, fits the capacity of the rating level::

    E = 80 · (C − D) / (L80 · (1 + I))

with C the capacity at the ``"normal"`` or ``"maximum"`` rating level (an allowable force or moment, given:
:class:`~ilkit.rating.Resistances` per level), D the unfactored dead-load effect of the sense, L80 the
girder's share of the Cooper E80 effect (the worse of the E80 train and the alternate live load, both scale
with n) and I the impact fraction from :func:`arema_impact` for the span of the section.  E scales linearly
with C − D (the placement does not depend on n).

**EN 1991-2 classified loads** (from memory): the largest α for which ``γG·G + γQ·α·Φ·LM71 ≤ Rd`` (and
SW/0 for continuous girders, EN 1991-2 6.3.3), with Φ2 or Φ3 (6.4.5.2) from the determinant length of
Table 6.2 (:func:`determinant_length`), γG 1.35/1.00 and γQ 1.45 (EN 1990 Annex A2, Table A2.4(B));
the result lists the exact ratio and the largest classified value of :data:`ilkit.loads.ALPHA_VALUES` not
above it.

Effects in the beam's units with the signs of :mod:`ilkit.model`; ratings dimensionless.
"""

from __future__ import annotations

import math
from collections.abc import Mapping, Sequence
from dataclasses import dataclass, field
from fractions import Fraction
from types import MappingProxyType
from typing import TYPE_CHECKING, Any, Literal

from ilkit._check import choice
from ilkit._display import RichDisplay
from ilkit._exact import fmt
from ilkit.design.factors import Applied, Factor
from ilkit.design.lanes import in_feet
from ilkit.design.permanent import PermanentEffects
from ilkit.design.sections import Section, envelope_sections
from ilkit.errors import DesignInputError, RatingInputError
from ilkit.loads.combination import LoadModel
from ilkit.loads.models import ALPHA_VALUES, cooper, lm71, phi2, phi3, sw0
from ilkit.loads.placement import extremes_of
from ilkit.model import Beam
from ilkit.rating._inputs import amount
from ilkit.rating.resistance import Resistances

if TYPE_CHECKING:  # pragma: no cover
    import pandas as pd

__all__ = [
    "AREMA",
    "EN_1991_2",
    "STRUCTURE_TYPES",
    "arema_impact",
    "cooper_rating",
    "determinant_length",
    "classified_rating",
    "RailRating",
]

AREMA = "AREMA Manual for Railway Engineering, Chapter 15"
EN_1991_2 = "EN 1991-2 (Eurocode 1, traffic loads on bridges)"
STRUCTURE_TYPES = ("steel open deck", "steel ballasted deck")
"""The structure types :func:`arema_impact` knows."""


def arema_impact(span: float, structure: str = "steel open deck", *, girder_spacing: float | None = None) -> Factor:
    """The AREMA impact fraction for a steel span (Chapter 15, 1.3.5, from memory), as a dynamic-allowance factor.

    Vertical effect (diesel and electric locomotives), in percent of the live load, with ``span`` L in ft
    (centre to centre of supports): 40 − 3L²/1600 for L < 80 ft, 16 + 600/(L − 30) for L ≥ 80 ft; plus the
    rocking effect 100/S percent where ``girder_spacing`` S (ft, centre to centre of the girders) is given;
    a ``"steel ballasted deck"`` takes 90 % of the total.  Returns ``Factor("dynamic allowance", 1 + I, "I")``
    (dimensionless).
    """
    L = amount(span, "arema_impact: span (ft)", minimum=0.0, strict=True)
    choice(structure, STRUCTURE_TYPES, what="arema_impact: structure", field="structure", error=RatingInputError)
    vertical = 40.0 - 3.0 * L * L / 1600.0 if L < 80.0 else 16.0 + 600.0 / (L - 30.0)
    words = (f"vertical {vertical:.4g} % ({'40 − 3L²/1600' if L < 80 else '16 + 600/(L − 30)'}, L = {L:.5g} ft)")
    rocking = 0.0
    if girder_spacing is not None:
        s = amount(girder_spacing, "arema_impact: girder_spacing (ft)", minimum=0.0, strict=True)
        rocking = 100.0 / s
        words += f" + rocking {rocking:.4g} % (100/S, S = {s:.4g} ft)"
    else:
        words += "; rocking effect not included (no girder spacing given)"
    percent = vertical + rocking
    if structure == "steel ballasted deck":
        percent *= 0.9
        words += "; × 0.90 for a ballasted deck"
    return Factor("dynamic allowance", 1.0 + percent / 100.0, "I", source=f"{AREMA}, 1.3.5", from_memory=True,
                  note=words)


def determinant_length(beam: Beam) -> float:
    """The determinant length LΦ of a main girder (EN 1991-2 Table 6.2, from memory), in metres.

    A single span: its length.  A girder continuous over n spans: LΦ = k · Lm, Lm the mean span and k = 1.2,
    1.3, 1.4 for 2, 3, 4 spans and 1.5 for five or more, but not less than the longest span.  Overhangs are
    not spans here.  A length: positive, of no sign convention.
    """
    if not isinstance(beam, Beam):
        raise RatingInputError(f"determinant_length: give a Beam, got {type(beam).__name__}.", field="beam")
    if beam.units is None:
        raise RatingInputError("determinant_length: the beam declares no units; give Beam(..., units='kN-m').",
                               field="units")
    metres = float(beam.units.metres_per_length)
    spans = [float(b - a) * metres for a, b in beam.spans]
    n = len(spans)
    if n == 1:
        return spans[0]
    k = {2: 1.2, 3: 1.3, 4: 1.4}.get(n, 1.5)
    return max(k * sum(spans) / n, max(spans))


@dataclass(frozen=True, eq=False)
class RailRating(RichDisplay):
    """A rail rating of one girder: the Cooper E-rating or the EN 1991-2 classified load α.

    ``frame`` (tidy): one row per (``level``, ``quantity``, ``x``, ``side``, ``sense``) with ``rating`` (E-n
    or α, dimensionless), ``capacity`` (beam units, a magnitude), ``dead`` (the permanent effect of the
    sense with its factor, signed), ``live`` (the girder's share of the unit rating load, E80 or α = 1, with
    its dynamic effect, signed), ``dynamic`` (1 + I or Φ) and ``case``.  ``kind``: ``"Cooper"`` or
    ``"classified"``.  ``factors``: what the live part contains (:class:`~ilkit.design.Applied`), per
    dynamic factor used.
    """

    beam: Beam = field(repr=False)
    kind: Literal["Cooper", "classified"]
    frame: pd.DataFrame = field(repr=False)
    levels: tuple[str, ...]
    factors: Mapping[str, Applied] = field(repr=False)
    notes: tuple[str, ...] = field(repr=False, default=())

    def __repr__(self) -> str:
        worst = self.controlling()
        words = ", ".join(f"{r.level} {self._value(r.rating)}" for r in worst.itertuples())
        return f"RailRating({self.kind}: {words})"

    def _value(self, value: float) -> str:
        return f"E{value:.1f}" if self.kind == "Cooper" else f"α {value:.3f}"

    def to_frame(self) -> pd.DataFrame:
        """The tidy table (a copy); see the class notes."""
        return self.frame.copy()

    def controlling(self) -> pd.DataFrame:
        """Per level the smallest rating and where (``quantity``, ``x``, ``side``, ``sense``, ``case``); for a
        classified rating also ``alpha_class``: the largest value of :data:`ilkit.loads.ALPHA_VALUES` not above
        it (NaN below the smallest)."""
        import pandas as pd

        rows = []
        for level in self.levels:
            part = self.frame[self.frame["level"] == level]
            best = part.loc[part["rating"].idxmin()]
            row = {k: best[k] for k in ("level", "rating", "quantity", "x", "side", "sense", "case")}
            if self.kind == "classified":
                fits = [a for a in ALPHA_VALUES if a <= best["rating"] + 1e-12]
                row["alpha_class"] = max(fits) if fits else math.nan
            rows.append(row)
        return pd.DataFrame(rows)


def _span_of(beam: Beam, s: Section) -> tuple[Fraction, Fraction]:
    """The span a section belongs to: the one it lies in; at a support, the one on the side of its face."""
    spans = list(beam.spans)
    for a, b in spans:
        if a < s.x < b:
            return a, b
    for a, b in spans:
        if (s.side == "left" and s.x == b) or (s.side == "right" and s.x == a) or (s.side is None and s.x in (a, b)):
            return a, b
    return spans[0] if s.x <= spans[0][0] else spans[-1]  # an overhang: the span beside it


def _rows(beam: Beam, sections: Sequence[Section], actions: Sequence[str], model_of: Any,
          dead: Mapping[tuple[str, float, str], float], dead_factor: Any, capacity: Any, level: str,
          rating_of: Any) -> list[dict[str, Any]]:
    """The rating rows of one level: every section and action, both senses of the live effect."""
    groups: dict[LoadModel, list[tuple[str, Section]]] = {}
    for s in sections:
        for a in actions:
            groups.setdefault(model_of(s), []).append((a, s))
    rows = []
    for model, items in groups.items():
        found = extremes_of([beam.line(a, s.x, s.side) for a, s in items], model, beam=beam)
        noise = 1e-9 * max((max(abs(e.maximum.value), abs(e.minimum.value)) for e in found), default=0.0)
        for (a, s), e in zip(items, found):
            d_raw = dead[(a, float(s.x), s.side or "")]
            for sense, extreme in (("positive", e.maximum), ("negative", e.minimum)):
                live = extreme.value
                if (live <= noise) if sense == "positive" else (live >= -noise):
                    continue
                d = dead_factor(d_raw, sense) * d_raw
                c = capacity(a, sense, float(s.x), s.side)
                sign = 1.0 if sense == "positive" else -1.0
                rows.append({"level": level, "quantity": a, "x": float(s.x), "side": s.side or "", "sense": sense,
                             "rating": rating_of(c - sign * d, sign * live), "capacity": c, "dead": d, "live": live,
                             "dynamic": model.cases[0].dynamic.multiplier(model.cases[0].parts[0].name),
                             "case": extreme.case})
    return rows


def _dead_totals(permanent: PermanentEffects, actions: Sequence[str], sections: Sequence[Section]
                 ) -> dict[tuple[str, float, str], float]:
    if not isinstance(permanent, PermanentEffects):
        raise RatingInputError(f"give permanent=ilkit.design.permanent_effects(...), got {type(permanent).__name__}.",
                               field="permanent", value=permanent)
    frame = permanent.frame
    frame = frame[frame["quantity"].isin(actions)]
    totals = frame.groupby(["quantity", "x", "side"], sort=False)["value"].sum()
    out = {(q, float(x), side): float(v) for (q, x, side), v in totals.items()}
    for a in actions:
        for s in sections:
            if (a, float(s.x), s.side or "") not in out:
                raise RatingInputError(f"the permanent effects have no {a} at {s.label}; compute them at the rated "
                                       "sections (same divisions and at).", field="permanent")
    return out


def _share_factor(share: float) -> Factor:
    v = amount(share, "share: the girder's share of one track", minimum=0.0, strict=True)
    return Factor("distribution", v, "share", note="the girder's share of one track's load, given")


def _check(beam: object, resistances: object, what: str) -> None:
    if not isinstance(beam, Beam) or beam.units is None:
        raise RatingInputError(f"{what}: give a Beam with units, got {beam!r}.", field="beam", value=beam)
    if not isinstance(resistances, Resistances):
        raise RatingInputError(f"{what}: give Resistances, got {type(resistances).__name__}.", field="capacity",
                               value=resistances)


def cooper_rating(
    beam: Beam,
    *,
    permanent: PermanentEffects,
    capacity: Mapping[str, Resistances],
    structure: str = "steel open deck",
    girder_spacing: float | None = None,
    share: float = 0.5,
    impact: float | None = None,
    divisions: int = 10,
    at: Sequence[object] = (),
) -> RailRating:
    """The Cooper E-rating of a girder at the ``"normal"`` and ``"maximum"`` rating levels (AREMA Chapter 15,
    from memory; see the module notes).

    ``capacity``: ``{"normal": Resistances(...), "maximum": Resistances(...)}`` (either level may be left
    out), allowable moments and shears in the beam's units.  ``structure`` and ``girder_spacing`` (ft) give
    the impact by :func:`arema_impact` from the span of each section; ``impact`` (a fraction) gives one
    value instead.  ``share``: the girder's share of one track (0.5 for one of two girders under the track).
    ``permanent``: unfactored dead-load effects at the rated sections.
    """
    if not isinstance(capacity, Mapping) or not capacity:
        raise RatingInputError("cooper_rating: give capacity={'normal': Resistances(...), 'maximum': "
                               "Resistances(...)}.", field="capacity", value=capacity)
    for level, r in capacity.items():
        choice(level, ("normal", "maximum"), what="cooper_rating: capacity level", field="capacity",
               error=RatingInputError)
        _check(beam, r, "cooper_rating")
    g = _share_factor(share)
    sections = envelope_sections(beam, divisions, at)
    actions = sorted({a for r in capacity.values() for a in r.actions}, key=("moment", "shear").index)
    dead = _dead_totals(permanent, actions, sections)
    fixed = None if impact is None else amount(impact, "cooper_rating: impact", minimum=0.0)
    impacts: dict[tuple[Fraction, Fraction], Factor] = {}
    models: dict[tuple[Fraction, Fraction], LoadModel] = {}
    for a, b in beam.spans:
        if fixed is not None:
            f = Factor("dynamic allowance", 1.0 + fixed, "I", note="impact given")
        else:
            f = arema_impact(in_feet(float(b - a), beam.units), structure, girder_spacing=girder_spacing)
        impacts[(a, b)] = f
        models[(a, b)] = cooper(80, impact=f.value - 1.0)
    rows = []
    for level, r in capacity.items():
        rows += _rows(beam, sections, actions, lambda s: models[_span_of(beam, s)], dead, lambda d, sense: 1.0,
                      lambda a, sense, x, side, r=r: r.nominal(a, sense, x, side), level,
                      lambda room, live: 80.0 * room / (g.value * live))
    frame = _frame(rows)
    frame["live"] *= g.value
    factors = {f"span {fmt(a)}–{fmt(b)}": Applied.of(f, g) for (a, b), f in impacts.items()}
    notes = ("Dead loads unfactored; allowable capacities at each rating level (AREMA Chapter 15, allowable "
             "stress rating).",
             "The impact of each section is that of the span it lies in (at a pier, the span on the face's "
             "side): common practice.",
             "At the maximum rating level the Manual allows a smaller impact for a restricted speed; give "
             "impact= for that case.")
    return RailRating(beam, "Cooper", frame, tuple(capacity), MappingProxyType(factors), notes)


def _frame(rows: list[dict[str, Any]]) -> pd.DataFrame:
    import pandas as pd

    frame = pd.DataFrame(rows, columns=["level", "quantity", "x", "side", "sense", "rating", "capacity", "dead",
                                        "live", "dynamic", "case"])
    if frame.empty:
        raise RatingInputError("the rating load causes no effect at the rated sections.", field="beam")
    return frame


def classified_rating(
    beam: Beam,
    *,
    permanent: PermanentEffects,
    resistances: Resistances,
    maintenance: Literal["careful", "standard"] = "standard",
    share: float = 0.5,
    gamma_G: tuple[float, float] = (1.35, 1.00),
    gamma_Q: float = 1.45,
    sw0_too: bool | None = None,
    divisions: int = 10,
    at: Sequence[object] = (),
) -> RailRating:
    """The classified load α a girder carries at the ultimate limit state (EN 1991-2, EN 1990 Annex A2; from
    memory; see the module notes).

    ``resistances``: design resistances Rd (beam units; φ of the Resistances multiplies them, 1.0 by
    default).  ``maintenance``: ``"careful"`` track (Φ2) or ``"standard"`` (Φ3), from the determinant
    length (:func:`determinant_length`).  ``share``: the girder's share of one track.  ``gamma_G``: (γG,sup,
    γG,inf); ``gamma_Q``: γQ for rail traffic.  ``sw0_too``: also SW/0 (default: for continuous girders).
    """
    _check(beam, resistances, "classified_rating")
    choice(maintenance, ("careful", "standard"), what="classified_rating: maintenance", field="maintenance",
           error=RatingInputError)
    g = _share_factor(share)
    try:
        g_sup = amount(gamma_G[0], "gamma_G[0]", minimum=0.0)
        g_inf = amount(gamma_G[1], "gamma_G[1]", minimum=0.0)
    except (TypeError, IndexError, KeyError):
        raise RatingInputError("classified_rating: gamma_G is (γG,sup, γG,inf), e.g. (1.35, 1.00).",
                               field="gamma_G", value=gamma_G) from None
    except DesignInputError as err:
        raise RatingInputError(str(err), field="gamma_G", value=gamma_G) from None
    gq = amount(gamma_Q, "gamma_Q", minimum=0.0, strict=True)
    length = determinant_length(beam)
    phi = (phi2 if maintenance == "careful" else phi3)(length)
    dyn = Factor("dynamic allowance", phi, "Φ2" if maintenance == "careful" else "Φ3",
                 source=f"{EN_1991_2}, 6.4.5.2, Table 6.2", from_memory=True,
                 note=f"LΦ = {length:.4g} m ({maintenance} maintenance)")
    sw = (len(beam.spans) > 1) if sw0_too is None else bool(sw0_too)
    model = lm71(1.0, dynamic_factor=phi)
    if sw:
        block = sw0(1.0, dynamic_factor=phi)
        model = LoadModel("LM71 and SW/0", [*model.cases, *block.cases], source=f"{EN_1991_2}, 6.3.2, 6.3.3",
                          from_memory=(*model.from_memory, *block.from_memory))
    sections = envelope_sections(beam, divisions, at)
    actions = resistances.actions
    dead = _dead_totals(permanent, actions, sections)

    def dead_factor(d: float, sense: str) -> float:
        adds = d > 0 if sense == "positive" else d < 0
        return g_sup if adds else g_inf

    rows = _rows(beam, sections, actions, lambda s: model, dead, dead_factor,
                 lambda a, sense, x, side: resistances.phi[a].value * resistances.nominal(a, sense, x, side), "ULS",
                 lambda room, live: room / (gq * g.value * live))
    frame = _frame(rows)
    frame["live"] *= g.value
    gamma = Factor("load factor", gq, "γQ", source="EN 1990 Annex A2, Table A2.4(B)", from_memory=True,
                   note="rail traffic")
    notes = (f"Determinant length LΦ = {length:.4g} m (EN 1991-2 Table 6.2, from memory); Φ = {phi:.4g}.",
             f"Permanent loads γG,sup = {fmt(g_sup)}, γG,inf = {fmt(g_inf)} by the sign of their effect; rail "
             f"traffic γQ = {fmt(gq)} (EN 1990 Annex A2, Table A2.4(B), from memory).",
             "SW/0 is included (continuous girder, EN 1991-2 6.3.3)." if sw else "LM71 only (SW/0 not included).")
    return RailRating(beam, "classified", frame, ("ULS",), MappingProxyType({"LM71": Applied.of(dyn, g, gamma)}),
                      notes)

