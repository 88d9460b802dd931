"""Transverse influence lines across a deck, and the lanes placed across them for the worst share of a girder.

A :class:`CrossSection` holds the girders, the deck overhangs and the
barriers (positions ``y`` across the deck from its left edge, in the length
unit of ``units``).  :func:`transverse_line` gives the share of one girder of
a unit load standing at ``y`` (dimensionless, positive when the load presses
the girder down) by

* the **lever rule** (``method="lever rule"``): the deck is a chain of
  simple spans between the girders, hinged over each interior girder, with
  the overhangs as cantilevers: the share is 1 at the girder, 0 at the
  neighbouring girders and beyond, linear between, and extended linearly over
  an overhang (statics);
* the **rigid cross-section** (``method="rigid"``): the deck moves as a rigid
  body on girders of equal stiffness: share 1/N + e x_k / Σ x² (x measured
  from the centre of the girders, e the position of the load; the formula of
  AASHTO LRFD 4.6.2.2.2d, from memory);
* **ordinates given** (``ordinates=[(y, share), ...]``), e.g. from a
  grillage: linear between the points.

Every line is piecewise linear.  :func:`place_design_lanes` places AASHTO
design lanes with one design vehicle each (two wheel lines 6 ft apart, 2 ft
from the edges of their lane, so 2 ft from a barrier: 3.6.1.3.1, from
memory) for the largest share, with the multiple presence factor of each
number of loaded lanes; :func:`place_notional_lanes` places EN 1991-2
notional lanes (the tandem system centred in its lane, the uniform load on
the parts of the lanes and the remaining area where it is unfavourable).
Both searches are exact: the optimum of a piecewise-linear objective over the
lane positions is at a vertex, and every vertex is enumerated by a dynamic
programme over the lanes (:func:`_chain_optimum`).
"""

from __future__ import annotations

import itertools
import math
from collections.abc import Callable, Sequence
from dataclasses import dataclass
from fractions import Fraction
from typing import TYPE_CHECKING, Literal

import numpy as np

from ilkit._check import choice, listed, whole
from ilkit._display import RichDisplay
from ilkit._exact import fmt
from ilkit.design._inputs import amount
from ilkit.design.factors import Factor
from ilkit.design.lanes import (
    AASHTO_LRFD,
    EN_1991_2,
    FT,
    DesignLanes,
    NotionalLanes,
    design_lanes,
    multiple_presence_factor,
    notional_lanes,
    read_length,
    read_units,
)
from ilkit.errors import DesignInputError
from ilkit.units import UnitSystem

if TYPE_CHECKING:  # pragma: no cover
    import pandas as pd

    from ilkit.loads.combination import LoadModel

__all__ = [
    "CrossSection",
    "TransverseLine",
    "transverse_line",
    "LanePlacement",
    "place_design_lanes",
    "NotionalPlacement",
    "place_notional_lanes",
    "TransverseMethod",
]

TransverseMethod = Literal["lever rule", "rigid", "given"]
"""How a transverse line is found: the lever rule, a rigid cross-section, or ordinates given."""

MAX_GIRDERS = 200
"""Most girders a cross-section may have (more is a typing error, not a deck)."""

_TOL = 1e-9
"""Relative tolerance (of the deck width) below which two positions across the deck are one."""


# ------------------------------------------------------------------ the deck
@dataclass(frozen=True, init=False)
class CrossSection:
    """A deck on girders: girder positions, deck edges and the roadway between the barriers.

    Parameters
    ----------
    girders:
        The number of girders (at least 2).
    spacing:
        The girder spacing, or a list of the ``girders - 1`` spacings from
        left to right (length unit of ``units``).
    overhang:
        The deck overhang beyond the centreline of each exterior girder.
    barrier:
        The width of the barrier (or curb) at each deck edge: the roadway
        runs from ``barrier`` to ``width - barrier``.
    units:
        ``"kip-ft"`` (ft) or ``"kN-m"`` (m), or any unit system of
        :data:`ilkit.SYSTEMS`; pint lengths are converted exactly.

    ``positions`` are the girders' positions ``y`` from the left deck edge;
    girders are numbered from 1 at the left.
    """

    girders: int
    spacings: tuple[float, ...]
    overhang: float
    barrier: float
    units: UnitSystem

    def __init__(
        self,
        girders: int,
        spacing: float | Sequence[float],
        overhang: float,
        barrier: float = 0.0,
        *,
        units: str = "kip-ft",
    ) -> None:
        system = read_units(units, "CrossSection")
        n = whole(girders, what="CrossSection: girders", field="girders", minimum=2, maximum=MAX_GIRDERS,
                  error=DesignInputError)
        if (isinstance(spacing, Sequence) and not isinstance(spacing, str)) or hasattr(spacing, "ndim"):
            items = listed(spacing, wanted="CrossSection: spacing: give one spacing or a list of them",
                           field="spacing", error=DesignInputError)
            if len(items) != n - 1:
                raise DesignInputError(
                    f"CrossSection: {n} girders need {n - 1} spacings, got {len(items)}.", field="spacing",
                    value=spacing)
            spacings = tuple(read_length(s, f"CrossSection: spacing {k}", system) for k, s in enumerate(items, 1))
        else:
            spacings = (read_length(spacing, "CrossSection: spacing", system),) * (n - 1)
        over = read_length(overhang, "CrossSection: overhang", system, strict=False)
        bar = read_length(barrier, "CrossSection: barrier", system, strict=False)
        width = 2 * over + sum(spacings)
        if 2 * bar >= width:
            raise DesignInputError(
                f"CrossSection: barriers of {fmt(bar)} {system.length} at both edges leave no roadway on a deck "
                f"{fmt(round(width, 9))} {system.length} wide; check the barrier width and the overhang.",
                field="barrier", value=barrier)
        object.__setattr__(self, "girders", n)
        object.__setattr__(self, "spacings", spacings)
        object.__setattr__(self, "overhang", over)
        object.__setattr__(self, "barrier", bar)
        object.__setattr__(self, "units", system)

    @property
    def positions(self) -> tuple[float, ...]:
        """The girders' positions from the left deck edge (length unit)."""
        return tuple(self.overhang + s for s in itertools.accumulate((0.0, *self.spacings)))

    @property
    def width(self) -> float:
        """The deck width (length unit, positive)."""
        return 2 * self.overhang + sum(self.spacings)

    @property
    def roadway(self) -> tuple[float, float]:
        """The roadway's edges (the barriers' faces) from the left deck edge (length unit)."""
        return (self.barrier, self.width - self.barrier)

    @property
    def roadway_width(self) -> float:
        """The clear roadway width between the barriers (length unit, positive)."""
        return self.width - 2 * self.barrier

    @property
    def curb_distance(self) -> float:
        """de: from the centreline of an exterior girder to the face of the barrier, positive when the barrier
        face is outboard of the girder (length unit; AASHTO LRFD 4.6.2.2.2d)."""
        return self.overhang - self.barrier

    def girder(self, number: int) -> int:
        """``number`` checked to be a girder of this section (1 .. girders)."""
        return whole(number, what="girder: the girder's number, from 1 at the left", field="girder", minimum=1,
                     maximum=self.girders, error=DesignInputError)

    def is_exterior(self, number: int) -> bool:
        """True for the first and the last girder."""
        return self.girder(number) in (1, self.girders)

    def __repr__(self) -> str:
        u = self.units.length
        same = len(set(self.spacings)) == 1
        spacing = fmt(self.spacings[0]) if same else "[" + ", ".join(fmt(s) for s in self.spacings) + "]"
        return (f"CrossSection({self.girders} girders at {spacing} {u}, overhang {fmt(self.overhang)} {u}, "
                f"barrier {fmt(self.barrier)} {u}, roadway {fmt(round(self.roadway_width, 9))} {u})")


# --------------------------------------------------------- transverse lines
@dataclass(frozen=True)
class TransverseLine:
    """The share of one girder of a unit load standing at ``y`` across the deck (dimensionless).

    Piecewise linear through the points ``(y[i], share[i])``, ``y`` from the
    left deck edge in the length unit of ``section.units``; positive when the
    load presses the girder down.  Call it with positions (a number or an
    array) inside the deck.
    """

    section: CrossSection
    girder: int
    method: TransverseMethod
    y: tuple[float, ...]
    share: tuple[float, ...]
    source: str = ""
    from_memory: bool = False

    def __call__(self, y: float | np.ndarray) -> float | np.ndarray:
        """The share at ``y`` (linear between the points; 0 outside the deck), dimensionless, positive when
        the girder is pressed down."""
        out = np.interp(np.asarray(y, dtype=float), self.y, self.share, left=0.0, right=0.0)
        return float(out) if np.ndim(out) == 0 else out

    def positive_integral(self, a: float, b: float) -> float:
        """∫ max(share, 0) dy from ``a`` to ``b`` (length unit): the share of a uniform load of unit
        intensity per area over ``a .. b`` where it is unfavourable."""
        ys, vs = self._positive_knots()
        inside = (ys > a) & (ys < b)
        xs = np.concatenate(([a], ys[inside], [b]))
        fs = np.interp(xs, ys, vs, left=0.0, right=0.0)
        return float(np.sum((fs[1:] + fs[:-1]) * np.diff(xs)) / 2)

    def _positive_knots(self) -> tuple[np.ndarray, np.ndarray]:
        """The knots of max(share, 0): the line's points and its zero crossings."""
        ys, vs = np.asarray(self.y), np.asarray(self.share)
        extra = [ys[i] - vs[i] * (ys[i + 1] - ys[i]) / (vs[i + 1] - vs[i])
                 for i in range(len(ys) - 1) if vs[i] * vs[i + 1] < 0]
        knots = np.unique(np.concatenate((ys, extra)))
        return knots, np.maximum(np.interp(knots, ys, vs), 0.0)

    def __repr__(self) -> str:
        return (f"TransverseLine(girder {self.girder} of {self.section.girders}, {self.method}, "
                f"share {fmt(round(self.share[0], 6))} .. {fmt(round(self.share[-1], 6))} from edge to edge)")

    def to_frame(self) -> pd.DataFrame:
        """The line's points: ``y`` (length unit) and ``share`` (dimensionless)."""
        import pandas as pd

        return pd.DataFrame({f"y [{self.section.units.length}]": self.y, "share": self.share})


def transverse_line(
    section: CrossSection,
    girder: int,
    method: TransverseMethod = "lever rule",
    *,
    ordinates: Sequence[tuple[float, float]] | None = None,
) -> TransverseLine:
    """The transverse influence line of ``girder`` (numbered from 1 at the left) across ``section``.

    ``method``: ``"lever rule"`` (statics of the deck as simple spans between
    the girders with cantilever overhangs), ``"rigid"`` (a rigid
    cross-section on girders of equal stiffness), or ``"given"`` with
    ``ordinates`` (points ``(y, share)`` from the left deck edge, e.g. from a
    grillage, covering the roadway; linear between them).  The share is
    dimensionless, positive when the girder is pressed down.
    """
    if not isinstance(section, CrossSection):
        raise DesignInputError(f"transverse_line: give a CrossSection, got {type(section).__name__} {section!r}.",
                               field="section", value=section)
    k = section.girder(girder)
    if ordinates is not None and method == "lever rule":
        method = "given"
    choice(method, ("lever rule", "rigid", "given"), what="transverse_line: method", field="method",
           error=DesignInputError)
    ys = section.positions
    width = section.width
    if method == "lever rule":
        share = [1.0 if i == k - 1 else 0.0 for i in range(len(ys))]
        points = [(y, s) for y, s in zip(ys, share)]
        # the overhangs: the end spans extended as cantilevers (statics of a simple span with an overhang)
        left = share[0] + (share[0] - share[1]) * ys[0] / (ys[1] - ys[0])
        right = share[-1] + (share[-1] - share[-2]) * (width - ys[-1]) / (ys[-1] - ys[-2])
        points = [(0.0, left), *points, (width, right)]
        return _line(section, k, "lever rule", points, "statics of the deck: simple spans between the girders, "
                     "cantilever overhangs (the lever rule of AASHTO LRFD 4.6.2.2)", False)
    if method == "rigid":
        centre = sum(ys) / len(ys)
        sxx = sum((y - centre) ** 2 for y in ys)
        xk = ys[k - 1] - centre
        ends = [(y, 1 / len(ys) + (y - centre) * xk / sxx) for y in (0.0, width)]
        return _line(section, k, "rigid", ends,
                     f"{AASHTO_LRFD}, 4.6.2.2.2d (rigid cross-section: R = NL/Nb + X e / Σx²)", True)
    if ordinates is None:
        raise DesignInputError("transverse_line: method='given' needs ordinates=[(y, share), ...] (e.g. from a "
                               "grillage), from the left deck edge.", field="ordinates")
    rows = listed(ordinates, wanted="transverse_line: ordinates: give a list of (y, share) pairs",
                  field="ordinates", error=DesignInputError)
    points = []
    for i, row in enumerate(rows, 1):
        pair = listed(row, wanted=f"transverse_line: ordinate {i}: give a pair (y, share)", field="ordinates",
                      error=DesignInputError)
        if len(pair) != 2:
            raise DesignInputError(f"transverse_line: ordinate {i}: give a pair (y, share), got {row!r}.",
                                   field="ordinates", value=row)
        y = read_length(pair[0], f"transverse_line: ordinate {i}: y", section.units, strict=False)
        points.append((y, amount(pair[1], f"transverse_line: ordinate {i}: share", minimum=None)))
    points.sort()
    if any(b[0] - a[0] <= _TOL * width for a, b in zip(points, points[1:])):
        raise DesignInputError("transverse_line: two ordinates are given at the same y; give one value per "
                               "position.", field="ordinates")
    r0, r1 = section.roadway
    if points[0][0] > r0 + _TOL * width or points[-1][0] < r1 - _TOL * width or points[-1][0] > width * (1 + _TOL):
        raise DesignInputError(
            f"transverse_line: the ordinates cover y = {fmt(points[0][0])} to {fmt(points[-1][0])}; they must "
            f"cover the roadway, y = {fmt(round(r0, 9))} to {fmt(round(r1, 9))} {section.units.length}, and stay "
            "on the deck.", field="ordinates")
    return _line(section, k, "given", points, "", False)


def _line(section: CrossSection, girder: int, method: TransverseMethod, points: list[tuple[float, float]],
          source: str, memory: bool) -> TransverseLine:
    return TransverseLine(section, girder, method, tuple(float(p[0]) for p in points),
                          tuple(float(p[1]) for p in points), source, memory)


# ------------------------------------------------------ the exact lane search
def _chain_optimum(
    n: int, lo: float, hi: float, delta: float, anchors: np.ndarray, gain: Callable[[int, np.ndarray], np.ndarray],
) -> tuple[float, list[float]]:
    """The largest Σ gain(j, b_j) over b_1..b_n in [lo, hi] with b_k >= b_j - delta for every j < k.

    ``gain(j, b)`` is piecewise linear in ``b`` with its knots among
    ``anchors``; the optimum is then at a vertex of the feasible set: every
    b_j is an anchor, a bound, or tied to such a value through constraints
    b_k = b_j - delta, so it lies in {anchor + t delta}.  A dynamic programme
    over j with the running maximum of the b's as its state finds it.
    """
    base = np.unique(np.clip(np.concatenate((anchors, [lo, hi])), lo, hi))
    steps = np.arange(-(n - 1), n) * delta if delta > 0 else np.zeros(1)
    cands = np.unique(np.clip((base[:, None] + steps[None, :]).ravel(), lo, hi))
    tol = _TOL * max(1.0, abs(hi), abs(lo))
    if cands.size > 1:  # merge candidates within rounding
        keep = np.concatenate(([True], np.diff(cands) > tol))
        cands = cands[keep]
    size = cands.size
    value = gain(0, cands).astype(float)
    choice_rows: list[np.ndarray] = []
    allowed = cands[None, :] >= cands[:, None] - delta - tol  # [state i, next c]
    lower = np.tril(np.ones((size, size), dtype=bool))  # c <= i: the state stays i
    upper = lower.T  # i <= c: the state becomes c
    for j in range(1, n):
        total = np.where(allowed, value[:, None] + gain(j, cands)[None, :], -np.inf)
        stay = np.where(lower, total, -np.inf)  # new state i (the running maximum is still C[i])
        move = np.where(upper, total, -np.inf)  # new state c
        best_stay, arg_stay = stay.max(axis=1), stay.argmax(axis=1)
        best_move, arg_move = move.max(axis=0), move.argmax(axis=0)
        take_stay = best_stay >= best_move
        value = np.where(take_stay, best_stay, best_move)
        # for backtracking: (previous state, chosen candidate) of each new state
        prev = np.where(take_stay, np.arange(size), arg_move)
        chosen = np.where(take_stay, arg_stay, np.arange(size))
        choice_rows.append(np.stack((prev, chosen)))
    state = int(np.argmax(value))
    best = float(value[state])
    if not math.isfinite(best):
        raise DesignInputError(f"{n} lanes do not fit on the roadway.", field="loaded")
    picks = []
    for prev_chosen in reversed(choice_rows):
        prev, chosen = prev_chosen[:, state]
        picks.append(float(cands[chosen]))
        state = int(prev)
    picks.append(float(cands[state]))
    return best, picks[::-1]


# ------------------------------------------------------------ AASHTO lanes
@dataclass(frozen=True)
class LanePlacement(RichDisplay):
    """The worst placement of AASHTO design lanes across a transverse line.

    ``share`` is the girder's share of one lane's load (in lanes):
    ``multiple presence`` × Σ over the loaded lanes of the mean share of the
    vehicle's two wheel lines.  ``loaded`` lanes govern; ``wheels`` are the
    wheel lines' positions (length unit, from the left deck edge) and
    ``lanes`` the lanes' edges, one pair per loaded lane.  ``trials`` lists,
    for every number of loaded lanes tried, the best share without and with
    m.  ``factor`` is the share as a :class:`~ilkit.design.Factor` of kind
    ``"distribution"`` (it includes ``"lanes"``, and ``"multiple presence"``
    when m was applied).
    """

    line: TransverseLine
    loaded: int
    share: float
    wheels: tuple[tuple[float, float], ...]
    lanes: tuple[tuple[float, float], ...]
    multiple_presence: Factor | None
    trials: tuple[tuple[int, float, float], ...]
    design_lanes: DesignLanes
    note: str = ""

    @property
    def factor(self) -> Factor:
        """The girder's share of one lane's load as a distribution factor (dimensionless, lanes)."""
        m = self.multiple_presence
        words = f"{self.line.method}, {self.loaded} loaded lane{'s' if self.loaded > 1 else ''}"
        if m is not None:
            words += f", m = {m.value:.2f} included"
        source = (f"{self.line.source}; lanes and wheel lines placed as in {AASHTO_LRFD}, 3.6.1.1.1, 3.6.1.3.1"
                  + (", Table 3.6.1.1.2-1" if m is not None else "")).lstrip("; ")
        return Factor("distribution", self.share, "g", source=source, from_memory=True,
                      includes=("lanes", "multiple presence") if m is not None else ("lanes",), note=words)

    def __repr__(self) -> str:
        m = f" with m {self.multiple_presence.value:.2f}" if self.multiple_presence is not None else ""
        return (f"LanePlacement(girder {self.line.girder}, {self.line.method}: {self.loaded} loaded "
                f"lane{'s' if self.loaded > 1 else ''}{m}, share {self.share:.4f} lanes)")

    def to_frame(self) -> pd.DataFrame:
        """One row per loaded lane: its edges, its wheel lines, their shares and the lane's share."""
        import pandas as pd

        u = self.line.section.units.length
        rows = []
        for k, ((a, b), (w1, w2)) in enumerate(zip(self.lanes, self.wheels), 1):
            s1, s2 = self.line(w1), self.line(w2)
            rows.append({"lane": k, f"from [{u}]": a, f"to [{u}]": b, f"wheel 1 [{u}]": w1, f"wheel 2 [{u}]": w2,
                         "share 1": s1, "share 2": s2, "lane share": (s1 + s2) / 2})
        return pd.DataFrame(rows)


def _aashto_geometry(section: CrossSection, wheel_spacing: float | None, clearance: float | None
                     ) -> tuple[float, float, float]:
    scale = float(FT / section.units.metres_per_length)  # ft in the section's length unit
    s = 6.0 * scale if wheel_spacing is None else read_length(wheel_spacing, "wheel_spacing", section.units)
    c = 2.0 * scale if clearance is None else read_length(clearance, "clearance", section.units, strict=False)
    return s, c, scale


def place_design_lanes(
    line: TransverseLine,
    *,
    loaded: int | None = None,
    multiple_presence: bool = True,
    lanes: DesignLanes | None = None,
    wheel_spacing: float | None = None,
    clearance: float | None = None,
) -> LanePlacement:
    """The AASHTO design lanes placed across ``line`` for the largest share of its girder.

    Each loaded design lane carries one vehicle of two wheel lines
    ``wheel_spacing`` apart (6 ft, 3.6.1.2.2), each at least ``clearance``
    from the edges of its lane (2 ft, 3.6.1.3.1, from memory), so 2 ft from a
    barrier; lanes are ``lanes.width`` wide (:func:`~ilkit.design.design_lanes`
    of the section's roadway by default), do not overlap and stay on the
    roadway, and stand wherever they give the largest share.  The share of a
    lane is the mean of its wheel lines' shares (a lane's load is one lane).

    With ``multiple_presence=True`` every number of loaded lanes from 1 to
    the number of design lanes (or only ``loaded``) is tried with its factor
    m (Table 3.6.1.1.2-1) and the largest m × share governs; with ``False``
    give ``loaded`` and the share has no m (apply it later, once).  The
    result's share is in lanes (dimensionless).
    """
    if not isinstance(line, TransverseLine):
        raise DesignInputError(f"place_design_lanes: give a TransverseLine, got {type(line).__name__} {line!r}.",
                               field="line", value=line)
    section = line.section
    lanes = design_lanes(section.roadway_width, units=section.units.name) if lanes is None else lanes
    if not isinstance(lanes, DesignLanes):
        raise DesignInputError(f"place_design_lanes: lanes must be DesignLanes, got {lanes!r}.", field="lanes",
                               value=lanes)
    s, c, _ = _aashto_geometry(section, wheel_spacing, clearance)
    width = lanes.width
    play = width - s - 2 * c
    if play < -_TOL * width:
        raise DesignInputError(
            f"place_design_lanes: a vehicle with wheel lines {fmt(s)} apart and {fmt(c)} from the lane edges needs "
            f"a lane {fmt(s + 2 * c)} wide; the lanes are {fmt(round(width, 9))} {section.units.length}.",
            field="lanes")
    play = max(play, 0.0)
    flag_m = multiple_presence if isinstance(multiple_presence, bool) else None
    if flag_m is None:
        raise DesignInputError(f"place_design_lanes: multiple_presence: give True or False, got "
                               f"{multiple_presence!r}.", field="multiple_presence", value=multiple_presence)
    counts: Sequence[int]
    if loaded is None:
        if not flag_m:
            raise DesignInputError(
                "place_design_lanes: without multiple presence the number of loaded lanes is not chosen for you: "
                "give loaded=1, 2, ... (and apply m once, later), or multiple_presence=True.", field="loaded")
        counts = range(1, lanes.count + 1)
    else:
        counts = (whole(loaded, what="place_design_lanes: loaded lanes", field="loaded", minimum=1,
                        maximum=lanes.count, error=DesignInputError),)
    r0, r1 = section.roadway
    knots = np.asarray(line.y)

    def wheel_share(a: np.ndarray) -> np.ndarray:
        return (np.asarray(line(a)) + np.asarray(line(a + s))) / 2

    best: tuple[float, int, list[float], Factor | None] | None = None
    trials = []
    for n in counts:
        lo, hi = r0 + c, r1 - s - c - (n - 1) * width
        if hi < lo - _TOL * section.width:
            continue
        hi = max(hi, lo)
        anchors = np.concatenate([knots - j * width for j in range(n)] + [knots - s - j * width for j in range(n)])
        raw, bs = _chain_optimum(n, lo, hi, play, anchors, lambda j, b: wheel_share(b + j * width))
        m = multiple_presence_factor(n) if flag_m else None
        total = raw * (m.value if m is not None else 1.0)
        trials.append((n, raw, total))
        if best is None or total > best[0] + 1e-12 * abs(best[0]):
            best = (total, n, [b + j * width for j, b in enumerate(bs)], m)
    if best is None:
        raise DesignInputError("place_design_lanes: no design vehicle fits on the roadway.", field="lanes")
    total, n, wheels_left, m = best
    lane_edges = _lane_edges(wheels_left, s, c, width, r0)
    u = section.units.length
    return LanePlacement(line, n, total, tuple((a, a + s) for a in wheels_left), lane_edges, m, tuple(trials),
                         lanes, f"wheel lines {fmt(round(s, 9))} {u} apart, {fmt(round(c, 9))} {u} from the lane "
                                f"edges")


def _lane_edges(wheels: list[float], s: float, c: float, width: float, r0: float) -> tuple[tuple[float, float], ...]:
    """Lanes that hold the wheel lines found (leftmost feasible, greedy)."""
    edges = []
    left = r0
    for a in wheels:
        start = max(left, a + s + c - width)
        edges.append((start, start + width))
        left = start + width
    return tuple(edges)


# ---------------------------------------------------------- EN 1991-2 lanes
_LM1_Q = (300.0, 200.0, 100.0)
_LM1_Q_UDL = (9.0, 2.5)


@dataclass(frozen=True)
class NotionalPlacement(RichDisplay):
    """The worst placement of EN 1991-2 notional lanes (Load Model 1) across a transverse line.

    ``axle`` is the girder's load per axle of the tandem systems (force
    unit): Σ over the loaded lanes of α_Q Q_i × the mean share of the
    tandem's two wheel lines (2.0 m apart, centred in the lane, from memory).
    ``uniform`` is the girder's uniform line load (force per length):
    α_q q_i over each lane and the remaining area, on the parts where the
    share is positive (EN 1991-2 4.3.2, from memory).  The tandem and the
    uniform load are each placed for their own largest share
    (``same_arrangement`` says whether one arrangement gives both; if not,
    the sum is on the safe side).  ``tandem_lanes`` and ``uniform_lane`` give
    the lanes' edges (from the left deck edge).
    """

    line: TransverseLine
    notional: NotionalLanes
    axle: float
    uniform: float
    tandem_lanes: tuple[tuple[int, float, float], ...]
    uniform_lane: tuple[float, float]
    same_arrangement: bool
    alpha_Q: tuple[float, ...]
    alpha_q: tuple[float, float]

    def __repr__(self) -> str:
        u = self.line.section.units
        return (f"NotionalPlacement(girder {self.line.girder}, {self.line.method}: axle {self.axle:.6g} {u.force}, "
                f"uniform {self.uniform:.6g} {u.line_load})")

    def model(self, *, tandem_spacing: float | None = None) -> LoadModel:
        """The girder's Load Model 1 as a line load: two axles of ``axle`` ``tandem_spacing`` apart (1.2 m, from
        memory) and the uniform load ``uniform`` where unfavourable; dynamic amplification included in the
        values (EN 1991-2 4.3.2).  Force and length units of the section."""
        from ilkit.loads.combination import Combination, LoadModel
        from ilkit.loads.primitives import AxleTrain, UniformLoad

        u = self.line.section.units
        spacing = (float(Fraction("1.2") / u.metres_per_length) if tandem_spacing is None
                   else read_length(tandem_spacing, "tandem_spacing", u))
        parts: list = []
        if self.axle > 0:
            parts.append(AxleTrain([self.axle, self.axle], [spacing], units=u.name, name="LM1 tandems (girder)"))
        parts.append(UniformLoad(max(self.uniform, 0.0), units=u.name, name="LM1 uniform load (girder)"))
        return LoadModel(
            f"LM1 on girder {self.line.girder}",
            [Combination(f"LM1 on girder {self.line.girder}", parts, dynamic_included=True)],
            source=f"{EN_1991_2}, 4.2.3, 4.3.2, Tables 4.1 and 4.2; transverse share: {self.line.method}",
            from_memory=("tandem wheel lines 2.0 m apart, centred in the notional lane; tandem axles 1.2 m apart "
                         "(4.3.2)", "notional lanes and the remaining area (Table 4.1)"),
            notes="Check every value against the licensed current edition and its National Annex; results must "
                  "be checked by a qualified engineer.",
        )


def place_notional_lanes(
    line: TransverseLine,
    *,
    alpha_Q: Sequence[float] = (1.0, 1.0, 1.0),
    alpha_q: Sequence[float] = (1.0, 1.0),
    notional: NotionalLanes | None = None,
    wheel_spacing: float | None = None,
) -> NotionalPlacement:
    """EN 1991-2 notional lanes placed across ``line`` for the largest share of its girder (Load Model 1).

    Tandem systems: lane i carries two axles of α_Q,i × Q_i (300, 200, 100
    kN, Table 4.2, seen), each with two wheel lines ``wheel_spacing`` = 2.0 m
    apart centred in the lane (from memory); lanes are numbered for the most
    adverse effect, so the heaviest tandem goes where the share is largest;
    a lane whose tandem would relieve the girder is left unloaded.  Uniform
    load: α_q,1 × 9 kN/m² on lane 1 and α_q × 2.5 kN/m² on the other lanes
    and the remaining area (``alpha_q`` = (α_q1, α_q for the rest)), on the
    parts where the share is positive.  ``notional``: the lanes
    (:func:`~ilkit.design.notional_lanes` of the roadway by default).  The
    loads (kN, m) are converted to the section's units.
    """
    if not isinstance(line, TransverseLine):
        raise DesignInputError(f"place_notional_lanes: give a TransverseLine, got {type(line).__name__}.",
                               field="line", value=line)
    section = line.section
    u = section.units
    lanes = notional_lanes(section.roadway_width, units=u.name) if notional is None else notional
    aQ = tuple(amount(a, f"alpha_Q {i}", minimum=0.0) for i, a in
               enumerate(listed(alpha_Q, wanted="alpha_Q: give three factors", field="alpha_Q",
                                error=DesignInputError), 1))
    aq = tuple(amount(a, f"alpha_q {i}", minimum=0.0) for i, a in
               enumerate(listed(alpha_q, wanted="alpha_q: give two factors (lane 1, the rest)", field="alpha_q",
                                error=DesignInputError), 1))
    if len(aQ) != 3 or len(aq) != 2:
        raise DesignInputError("place_notional_lanes: give alpha_Q for lanes 1, 2, 3 and alpha_q for lane 1 and the "
                               "rest.", field="alpha_Q")
    metre = float(1 / u.metres_per_length)  # one metre in the section's length unit
    kN = float(1000 / u.newtons_per_force)  # one kN in the section's force unit
    spacing = 2.0 * metre if wheel_spacing is None else read_length(wheel_spacing, "wheel_spacing", u)
    width = lanes.width
    offset = (width - spacing) / 2
    if offset < 0:
        raise DesignInputError(f"place_notional_lanes: wheel lines {fmt(spacing)} apart do not fit in lanes "
                               f"{fmt(width)} wide.", field="wheel_spacing")
    r0, r1 = section.roadway
    knots = np.asarray(line.y)

    def tandem_share(p: np.ndarray) -> np.ndarray:
        return (np.asarray(line(p + offset)) + np.asarray(line(p + offset + spacing))) / 2

    loads = [aQ[i] * _LM1_Q[i] * kN for i in range(3)]
    best_tandem: tuple[float, list[tuple[int, float]]] = (0.0, [])
    for n in range(1, min(3, lanes.count) + 1):
        lo, hi = r0, r1 - n * width
        if hi < lo - _TOL * section.width:
            break
        hi = max(hi, lo)
        anchors = np.concatenate([knots - offset - j * width for j in range(n)]
                                 + [knots - offset - spacing - j * width for j in range(n)])
        for order in itertools.permutations(range(n)):  # the lane number of each lane from left to right
            value, bs = _chain_optimum(n, lo, hi, 0.0, anchors,
                                       lambda j, b, o=order: loads[o[j]] * tandem_share(b + j * width))
            if value > best_tandem[0] + 1e-12 * abs(best_tandem[0]):
                best_tandem = (value, [(order[j] + 1, b + j * width) for j, b in enumerate(bs)])
    q1, qr = aq[0] * _LM1_Q_UDL[0] * kN / metre**2, aq[1] * _LM1_Q_UDL[1] * kN / metre**2
    if q1 < qr:
        raise DesignInputError(
            "place_notional_lanes: α_q1 q1 is smaller than the load on the other lanes and the remaining area; "
            "this arrangement is not supported: place the lanes yourself and give the shares with "
            "ilkit.design.given_distribution.", field="alpha_q", value=alpha_q)
    start = _best_window(line, r0, r1, width)
    uniform = (q1 - qr) * line.positive_integral(start, start + width) + qr * line.positive_integral(r0, r1)
    tandem_lanes = tuple(sorted((k, p, p + width) for k, p in best_tandem[1]))
    lane1 = next((p for k, p, _ in tandem_lanes if k == 1), None)
    same = lane1 is not None and abs(lane1 - start) <= _TOL * section.width
    return NotionalPlacement(line, lanes, best_tandem[0], uniform, tandem_lanes, (start, start + width), same, aQ,
                             (aq[0], aq[1]))


def _best_window(line: TransverseLine, r0: float, r1: float, width: float) -> float:
    """The start p in [r0, r1 - width] of the window of ``width`` with the largest ∫ max(share, 0): at a knot
    of the window's ends or where the share is the same at both ends (exact for a piecewise-linear line)."""
    ys, vs = line._positive_knots()
    lo, hi = r0, max(r1 - width, r0)
    cuts = np.unique(np.clip(np.concatenate((ys, ys - width, [lo, hi])), lo, hi))
    cands = list(cuts)
    for a, b in zip(cuts[:-1], cuts[1:]):  # d/dp of the integral is linear here: its root
        fa = np.interp(a + width, ys, vs) - np.interp(a, ys, vs)
        fb = np.interp(b + width, ys, vs) - np.interp(b, ys, vs)
        if fa * fb < 0:
            cands.append(a + (b - a) * fa / (fa - fb))
    values = [line.positive_integral(p, p + width) for p in cands]
    return float(cands[int(np.argmax(values))])
