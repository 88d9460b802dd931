"""Concurrent forces: the other actions under the placement that gives an extreme.

For each extreme (the largest or smallest moment, shear or reaction at a section, an
:class:`ilkit.Extreme`), the same loads standing where they stand for it give, at the same section,
the bending moment and the shear, and at every support the reaction.  Each load of the governing
case counts with its factor (dynamic allowance times the case factor, as in the extreme): the
concurrent value of a quantity is the sum over the placement's counted axles of load times the
quantity's ordinate under the axle, plus, for every loaded stretch, intensity times the integral of
the quantity's line over it.

Faces.  An axle the placement put just left or right of a point where the extreme's line jumps
(``AxlePosition.side``) takes the one-sided ordinate of that side on every other line too.  An axle
standing exactly at the section (the largest moment usually has one there) is on neither face of a
cut through the section: the shear there is then given on both faces, the left face (the axle right
of the cut) and the right face (the axle left of it), as rows with ``concurrent side`` ``"left"`` and
``"right"``; likewise the shear and moment at a support are given on both faces where they jump.

Values are in the beam's units with the signs of :mod:`ilkit.model` (sagging moment positive, shear
positive when the part left of the section is pushed up, reactions upward).
"""

from __future__ import annotations

from collections.abc import Iterable
from dataclasses import dataclass, field
from fractions import Fraction
from typing import TYPE_CHECKING, Any

import numpy as np

from ilkit._check import listed
from ilkit._display import RichDisplay
from ilkit._exact import fmt, fmt_precise
from ilkit.design._dynamic import dynamic_factor
from ilkit.design.factors import Applied
from ilkit.design.sections import load_ordinate
from ilkit.errors import LoadInputError, SideRequiredError
from ilkit.loads._search import COINCIDENT
from ilkit.loads.envelope import Envelope
from ilkit.loads.results import Extreme, Extremes, LoadPlacement
from ilkit.model import Beam
from ilkit.quantity import Side
from ilkit.units import UnitSystem

if TYPE_CHECKING:  # pragma: no cover
    import pandas as pd

    from ilkit.design.live import GirderLiveLoad
    from ilkit.influence import InfluenceLine

__all__ = ["ConcurrentForces", "concurrent_forces", "concurrent_value"]

_COLUMNS = ["quantity", "x", "side", "extreme", "case", "dynamic", "value", "concurrent quantity", "concurrent x",
            "concurrent side", "concurrent value"]


@dataclass(frozen=True, eq=False)
class ConcurrentForces(RichDisplay):
    """Concurrent forces of a set of extremes on one beam.

    ``frame``: a tidy table, one row per extreme and concurrent action, with
    columns ``quantity``, ``x``, ``side``, ``extreme`` (``"max"``/``"min"``),
    ``case``, ``dynamic`` (the dynamic effect the case's values contain) and
    ``value`` (the extreme, in the beam's units), then
    ``concurrent quantity`` (``"moment"``, ``"shear"`` or ``"reaction"``),
    ``concurrent x`` (the section, or the support for a reaction),
    ``concurrent side`` (``"left"``, ``"right"`` or ``""``) and ``concurrent
    value``: the action under the same placement of the same loads, each
    with its factor.  The extreme's own quantity is among the concurrent
    ones (it reproduces ``value``).  Units are those of the beam
    (``units``); signs those of :mod:`ilkit.model`.  ``factors``: the
    factors inside the values (an :class:`~ilkit.design.Applied`; the dynamic
    effect of the load model, already in its values).  ``notes`` say where an
    axle stood exactly at a point where another line jumps for a reason
    other than its own section (a shear release).  ``girder``: the name of
    the girder's live load when the values are one girder's
    (:meth:`for_girder`), empty for one lane's.
    """

    frame: pd.DataFrame = field(repr=False)
    beam: Beam = field(repr=False)
    units: UnitSystem | None
    extremes: tuple[Extreme, ...] = field(repr=False)
    notes: tuple[str, ...] = ()
    factors: Applied = field(default_factory=Applied)
    girder: str = ""

    def __repr__(self) -> str:
        units = f", units={self.units.name!r}" if self.units else ""
        girder = f", girder {self.girder!r}" if self.girder else ""
        return f"ConcurrentForces({len(self.extremes)} extremes, {len(self.frame)} rows{units}{girder})"

    def to_frame(self) -> pd.DataFrame:
        """The tidy table (a copy); columns, units and signs in the class notes."""
        return self.frame.copy()

    def _wide(self, quantity: str, other: str) -> pd.DataFrame:
        frame = self.frame
        rows = frame[(frame["quantity"] == quantity) & (frame["concurrent quantity"] == other)]
        u = self.units
        unit = {"moment": u.moment, "shear": u.force, "reaction": u.force} if u else {}
        symbol = {"moment": "M", "shear": "V", "reaction": "R"}

        def named(kind: str) -> str:
            return f"{symbol[kind]} [{unit[kind]}]" if u else symbol[kind]

        out = rows[["x", "side", "extreme", "case", "dynamic", "value", "concurrent side", "concurrent value"]].rename(
            columns={
                "x": f"x [{u.length}]" if u else "x",
                "value": named(quantity),
                "concurrent side": f"{symbol[other]} side",
                "concurrent value": named(other),
            }
        )
        return out.reset_index(drop=True)

    def for_girder(self, live: GirderLiveLoad) -> ConcurrentForces:
        """The same forces on one girder: every value times the girder's share of its own action (moments
        × gM, shears and reactions × gV of ``live``, a :class:`~ilkit.design.GirderLiveLoad` whose model the
        extremes are of).

        One lane's extremes, and so their concurrent forces, are scaled exactly: a factor on the whole load
        does not move its placement.  ``factors`` keeps the dynamic effect; the shares are stated in
        ``notes``.  Units of the beam, signs of :mod:`ilkit.model`.
        """
        from ilkit.design.live import GirderLiveLoad

        if not isinstance(live, GirderLiveLoad):
            raise LoadInputError(f"for_girder: give a GirderLiveLoad, got {type(live).__name__} {live!r}.",
                                 field="live", value=live)
        if self.girder:
            raise LoadInputError(f"for_girder: these forces are already those of {self.girder!r}; scale one "
                                 "lane's forces, once.", field="live", value=live.name)
        frame = self.frame.copy()
        scale = {a: live.scale(a) for a in ("moment", "shear", "reaction")}  # type: ignore[arg-type]
        frame["value"] = frame["value"] * frame["quantity"].map(scale)
        frame["concurrent value"] = frame["concurrent value"] * frame["concurrent quantity"].map(scale)

        def share(action: str) -> str:
            return " × ".join(f.describe() for f in live.factors(action) if not f.parts)  # type: ignore[arg-type]

        note = (f"Values of one girder ({live.name}): one lane's times the share of each action, moments × "
                f"{share('moment')}, shears and reactions × {share('shear')}")
        return ConcurrentForces(frame, self.beam, self.units, self.extremes, (*self.notes, note), self.factors,
                                live.name)

    def moment_with_shear(self) -> pd.DataFrame:
        """Each moment extreme with the concurrent shear at its section.

        One row per extreme and face of the shear: where an axle stands
        exactly at the section the shear jumps there and both faces are
        given (``V side`` ``"left"`` and ``"right"``).  Units in the column
        names; signs of :mod:`ilkit.model`.
        """
        return self._wide("moment", "shear")

    def shear_with_moment(self) -> pd.DataFrame:
        """Each shear extreme with the concurrent moment at its section (units in the column names; signs of
        :mod:`ilkit.model`)."""
        return self._wide("shear", "moment")

    def reactions(self) -> pd.DataFrame:
        """One row per extreme, one column per support: the concurrent reactions (force, upward positive)."""
        import pandas as pd

        frame = self.frame
        u = self.units
        rows = frame[frame["concurrent quantity"] == "reaction"]
        keys = ["quantity", "x", "side", "extreme", "case", "dynamic", "value"]
        table = rows.pivot_table(index=keys, columns="concurrent x", values="concurrent value", aggfunc="sum",
                                 sort=False)
        table.columns = [f"R at x={fmt(x)}" + (f" [{u.force}]" if u else "") for x in table.columns]
        out = table.reset_index()
        if u:
            out = out.rename(columns={"x": f"x [{u.length}]"})
        return pd.DataFrame(out)


def concurrent_value(line: InfluenceLine, placements: Iterable[LoadPlacement], *, face: Side | None = None) -> float:
    """The effect on ``line`` of loads standing as in ``placements``, each with its factor.

    ``face``, for a shear line at its own section where an axle stands
    exactly at the section: ``"left"`` (the cut left of the axle) or
    ``"right"``; needed only there (:class:`ilkit.SideRequiredError`
    otherwise).  In the unit of the line's quantity (force, force·length,
    length) with the signs of :mod:`ilkit.model`.
    """
    return _effect(line, placements, face)[0]


def _effect(line: InfluenceLine, placements: Iterable[LoadPlacement], face: Side | None) -> tuple[float, list[str]]:
    """The factored effect of the placed loads on ``line``, and notes."""
    total = 0.0
    notes: list[str] = []
    for p in placements:
        effect, said = _placed(line, p, face)
        total += p.factor * effect
        notes += said
    return total, notes


def _placed(line: InfluenceLine, p: LoadPlacement, face: Side | None) -> tuple[float, list[str]]:
    """Unfactored effect of one placed load on ``line``, and notes."""
    notes: list[str] = []
    q = line.quantity
    at = float(q.at)
    tol = COINCIDENT * line.length
    effect = 0.0
    for a in p.axles:
        if not a.counted:
            continue
        if a.side is not None:
            ordinate = load_ordinate(line, a.x, a.side)
        elif q.kind == "shear" and abs(a.x - at) <= tol:
            cut = face or q.side or ("right" if at == 0 else "left" if at == line.length else None)
            if cut is None:
                raise SideRequiredError(
                    f"{q.label}: axle {a.number} of {p.load} stands exactly at the section, where the shear jumps by "
                    "its load; name the face: face='left' or face='right'."
                )
            ordinate = load_ordinate(line, at, "right" if cut == "left" else "left", own_section=True)
        else:
            left, right = float(line.left(a.x)), float(line.right(a.x))
            ordinate = float(line(a.x))
            if 0 < a.x < line.length and abs(left - right) > 1e-9 * max(abs(left), abs(right)):
                notes.append(
                    f"{p.load}, axle {a.number} stands exactly at x={fmt(a.x)}, where the line of {q.label} jumps; "
                    "its right-hand ordinate is taken"
                )
        effect += a.load * ordinate
    for patch in p.patches:
        effect += patch.intensity * line.integral(patch.start, patch.end)
    return effect, notes


def concurrent_forces(
    source: Envelope | Extreme | Extremes | Iterable[Extreme | Extremes],
    beam: Beam | None = None,
) -> ConcurrentForces:
    """Concurrent moments, shears and reactions of extremes.

    ``source``: an :class:`ilkit.Envelope` (every moment, shear and reaction
    extreme it tabulates; its beam is used), or an :class:`ilkit.Extreme`,
    :class:`ilkit.Extremes` or a list of them with the ``beam`` they were
    found on.  For each extreme, the bending moment and the shear at its
    section and the reaction at every support under the same placement of
    the same loads (see the module notes for faces).  Values in the beam's
    units, signs of :mod:`ilkit.model`.
    """
    import pandas as pd

    found, beam = _read_source(source, beam)
    rows: list[dict[str, Any]] = []
    notes: list[str] = []
    for e, side in found:
        q = e.quantity
        base = {"quantity": q.kind, "x": float(q.at), "side": side or "", "extreme": e.extreme, "case": e.case,
                "dynamic": str(e.dynamic) if e.dynamic is not None else "", "value": e.value}
        for kind, at, face in _targets(beam, e, side):
            total, said = _effect(beam.line(kind, at, face), e.placements, face)
            notes += said
            rows.append({**base, "concurrent quantity": kind, "concurrent x": float(at), "concurrent side": face or "",
                         "concurrent value": total})
    dynamic = dynamic_factor(e.dynamic for e, _ in found)
    return ConcurrentForces(pd.DataFrame(rows, columns=_COLUMNS), beam, beam.units, tuple(e for e, _ in found),
                            tuple(dict.fromkeys(notes)), Applied() if dynamic is None else Applied.of(dynamic))


def _targets(beam: Beam, e: Extreme, side: Side | None) -> list[tuple[str, Fraction, Side | None]]:
    """The concurrent actions of one extreme tabulated at the face ``side`` of its section:
    ``(quantity, position, face)``."""
    q = e.quantity
    x = q.at
    out: list[tuple[str, Fraction, Side | None]] = []
    tol = COINCIDENT * float(beam.length)
    axle_here = any(a.counted and a.side is None and abs(a.x - float(x)) <= tol for p in e.placements for a in p.axles)
    for kind in ("moment", "shear"):
        if side is not None:
            faces: tuple[Side | None, ...] = (side,)
        elif _jumps(beam, kind, x) or (kind == "shear" and axle_here and 0 < x < beam.length):
            faces = ("left", "right")
        else:
            faces = (None,)
        out += [(kind, x, face) for face in faces]
    out += [("reaction", s.at, None) for s in beam.supports]
    return out


def _jumps(beam: Beam, kind: str, x: Fraction) -> bool:
    try:
        beam.line(kind, x)
    except SideRequiredError:
        return True
    return False


Found = list[tuple[Extreme, Side | None]]
"""Extremes with the face of the section they are tabulated at (an envelope lists both faces of a support
even where the quantity does not jump there)."""


def _read_source(source: object, beam: Beam | None) -> tuple[Found, Beam]:
    if beam is not None and not isinstance(beam, Beam):
        raise LoadInputError(f"concurrent_forces: beam must be a Beam, got {type(beam).__name__} {beam!r}.",
                             field="beam", value=beam)
    if isinstance(source, Envelope):
        if beam is not None and beam != source.beam:
            raise LoadInputError("concurrent_forces: the envelope was computed on another beam than the one given; "
                                 "leave beam out (the envelope's is used).", field="beam", value=beam)
        return _from_envelope(source), source.beam
    items = [source] if isinstance(source, (Extreme, Extremes)) else listed(
        source, wanted="concurrent_forces: give an Envelope, an Extreme, an Extremes or a list of them",
        field="source", error=LoadInputError)
    extremes: list[Extreme] = []
    for item in items:
        if isinstance(item, Extremes):
            extremes += [item.maximum, item.minimum]
        elif isinstance(item, Extreme):
            extremes.append(item)
        else:
            raise LoadInputError(
                f"concurrent_forces: give an Envelope, an Extreme, an Extremes or a list of them, got "
                f"{type(item).__name__} {item!r}.", field="source", value=item)
    if not extremes:
        raise LoadInputError("concurrent_forces: no extremes given.", field="source", value=source)
    if beam is None:
        raise LoadInputError(
            "concurrent_forces: give the beam the extremes were found on, concurrent_forces(extremes, beam); "
            "an Envelope carries its own.", field="beam")
    for e in extremes:
        _check_line(beam, e)
    return [(e, e.quantity.side) for e in extremes], beam


def _check_line(beam: Beam, e: Extreme) -> None:
    """The extreme was found on a line of ``beam`` (same quantity, same ordinates)."""
    q = e.quantity
    if e.units != beam.units:
        raise LoadInputError(
            f"concurrent_forces: {e!r} is in {e.units.name} and the beam in "
            f"{beam.units.name if beam.units else 'no units'}; give the beam the extreme was found on.",
            field="beam")
    try:
        mine = beam.line(q.kind, q.at, q.side)
    except ValueError as err:
        raise LoadInputError(
            f"concurrent_forces: {q.label} is not a quantity of the beam given ({err}); give the beam the extreme was "
            "found on.", field="beam", value=beam) from err
    line = e.line
    if line is None or line is mine:
        return
    xs = np.array(sorted({*mine.breakpoints, *line.breakpoints}))
    scale = max(float(np.abs(mine(xs)).max(initial=0.0)), 1e-300)
    same = mine.length == line.length and np.allclose(mine.left(xs), line.left(xs), rtol=0, atol=1e-9 * scale) and \
        np.allclose(mine.right(xs), line.right(xs), rtol=0, atol=1e-9 * scale)
    if not same:
        raise LoadInputError(
            f"concurrent_forces: the extreme of {q.label} was found on another beam (its influence line differs from "
            f"this beam's at x={fmt_precise(Fraction(float(xs[0])))}...); give the beam it was found on.",
            field="beam", value=beam)


def _from_envelope(env: Envelope) -> Found:
    """Every extreme the envelope tabulates, with the face of its row: moments and shears at its sections,
    reactions at its supports."""
    u = env.beam.units
    x_column = f"x [{u.length}]" if u else "x"
    out: Found = []
    for _, row in env.sections.iterrows():
        side = row["side"] or None
        for kind in ("moment", "shear"):
            out += [(env.extreme(kind, row[x_column], which, side=side), side)  # type: ignore[arg-type]
                    for which in ("max", "min")]
    for _, row in env.reactions.iterrows():
        out += [(env.extreme("reaction", row[x_column], which), None) for which in ("max", "min")]  # type: ignore[arg-type]
    return out
