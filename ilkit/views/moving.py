"""Drawings of moving-load results: governing placements and envelopes along the beam.

The numbers are the core's (:func:`ilkit.loads.place`, :func:`ilkit.loads.stand`,
:func:`ilkit.loads.envelope`); this module only draws them:

* :func:`plot_placement`: where the loads of a governing case stand, on the
  beam and on the influence line (the same drawing of the load as the
  explorer's, :mod:`ilkit.views.loaddraw`), with the ordinate under every
  axle, the loaded stretches and the direction of travel;
* :func:`plot_envelope`: the largest and smallest bending moment or shear at
  every section of an envelope (both sides at supports and releases, so
  jumps show as vertical steps), or the largest and smallest reaction at
  every support.
"""

from __future__ import annotations

from typing import TYPE_CHECKING, Any, Literal

import numpy as np

from ilkit._exact import fmt
from ilkit.errors import UnsupportedResultError
from ilkit.loads.results import Extreme, LoadPlacement, effect_unit
from ilkit.views import style
from ilkit.views.derive import quantity_title
from ilkit.views.loaddraw import ARROW_BASE, PATCH_TOP, LoadArtists, Loading, arrow_tip
from ilkit.views.numbers import ordinate_unit
from ilkit.views.plot import (
    LABEL_BOX,
    breakpoint_ticks,
    draw_line,
    ordinate_axis,
    points_per_unit,
    short,
    text_width,
)

if TYPE_CHECKING:  # pragma: no cover
    from matplotlib.axes import Axes

    from ilkit.influence import InfluenceLine
    from ilkit.loads.envelope import Envelope
    from ilkit.model import Beam

__all__ = ["plot_envelope", "plot_placement", "placement_title", "ENVELOPE_KINDS"]

ENVELOPE_KINDS: dict[str, tuple[str, str]] = {
    # kind: (column symbol, plain words)
    "moment": ("M", "bending moment"),
    "shear": ("V", "shear"),
    "reaction": ("R", "reaction"),
}


def plot_envelope(
    envelope: Envelope,
    kind: Literal["moment", "shear", "reaction"] = "moment",
    ax: Axes | None = None,
    *,
    title: str | None = None,
) -> Axes:
    """Plot the largest and smallest ``kind`` of an envelope along the beam; returns the axes.

    Moments and shears are drawn at the envelope's sections, the band between
    the two curves shaded, with the absolute maximum moment marked; reactions
    as bars at the supports, from the smallest to the largest value, both
    written.  The vertical axis carries the unit of the envelope's columns
    (positive up: sagging moment, shear positive as in :mod:`ilkit.model`,
    reaction upward).
    """
    from ilkit._check import choice
    from ilkit.loads.envelope import Envelope
    from ilkit.views._args import expect

    expect(envelope, Envelope, what="plot_envelope", hint="give the result of ilkit.loads.envelope(beam, load)")
    choice(kind, tuple(ENVELOPE_KINDS), what="plot_envelope: kind", field="kind")
    symbol, words = ENVELOPE_KINDS[kind]
    table = envelope.reactions if kind == "reaction" else envelope.sections
    x_col = next(c for c in table.columns if c.startswith("x"))
    hi_col = next(c for c in table.columns if c.startswith(f"{symbol} max"))
    lo_col = next(c for c in table.columns if c.startswith(f"{symbol} min") and not c.endswith("case"))
    unit = hi_col[hi_col.find("[") + 1 : hi_col.find("]")] if "[" in hi_col else ""
    with style.context():
        ax = style.axes(ax, 2.6)
        xs = table[x_col].to_numpy(dtype=float)
        hi = table[hi_col].to_numpy(dtype=float)
        lo = table[lo_col].to_numpy(dtype=float)
        ax.axhline(0.0, color=style.MUTED, linewidth=0.7, zorder=2, gid="axis")
        if kind == "reaction":
            for x, a, b in zip(xs, lo, hi):
                ax.plot([x, x], [a, b], color=style.INK, linewidth=4, solid_capstyle="butt", gid=f"reaction:{x:g}")
                for value, where, gid in ((b, 1, "max"), (a, -1, "min")):
                    ax.annotate(short(value), xy=(x, value), xytext=(0, 3 * where), textcoords="offset points",
                                ha="center", va="bottom" if where > 0 else "top", fontsize=7,
                                gid=f"reaction-{gid}:{x:g}", annotation_clip=False)
            ax.margins(y=0.18)
        else:
            order = np.lexsort((_face_order(table), xs))
            xs, hi, lo = xs[order], hi[order], lo[order]
            ax.fill_between(xs, lo, hi, facecolor="#dfe3e8", edgecolor="none", zorder=1, gid="band")
            ax.plot(xs, hi, color=style.INK, linewidth=1.6, gid="largest")
            ax.plot(xs, lo, color=style.INK, linewidth=1.0, linestyle=(0, (5, 2)), gid="smallest")
            if kind == "moment":
                best = envelope.absolute_maximum_moment
                where = envelope.absolute_maximum_positions or (float(best.quantity.at),)
                ax.plot(where, [best.value] * len(where), "o", color=style.INK, markersize=4, gid="absolute-maximum")
                at = " and ".join(short(p, 5) for p in where)
                ax.annotate(f"absolute maximum {short(best.value)} at x = {at}", xy=(sum(where) / len(where),
                            best.value), xytext=(0, 5), textcoords="offset points", ha="center", va="bottom",
                            fontsize=7, gid="absolute-maximum-words", annotation_clip=False)
                ax.margins(y=0.15)
        length_unit = x_col[x_col.find("[") + 1 : x_col.find("]")] if "[" in x_col else ""
        ax.set_xlabel(f"section x [{length_unit}]" if length_unit else "section x")
        ax.set_ylabel(f"{symbol} [{unit}]" if unit else symbol)
        ax.set_title(title if title is not None else f"Envelope of {words}: {envelope.model}")
        return ax


def _face_order(table: Any) -> np.ndarray:
    """Left side before right side at a section that has both (0 left, 1 no side, 2 right)."""
    if "side" not in table.columns:
        return np.ones(len(table))
    return table["side"].map({"left": 0, "right": 2}).fillna(1).to_numpy(dtype=float)


def placement_title(result: Extreme | LoadPlacement) -> str:
    """Two lines of words for a placement: the quantity with the value and its unit, then the case or load."""
    line = result.line
    assert line is not None
    units = line.units
    what = quantity_title(line.quantity, units.length if units else "")
    if isinstance(result, Extreme):
        word = "Largest" if result.extreme == "max" else "Smallest"
        return f"{word} {what}: {short(result.value, 5)} {result.unit}\ngoverning case: {result.case}"
    unit = f" {effect_unit(line.quantity, units)}" if units else ""
    front = f", front at x = {short(result.front, 6)}" if result.front is not None else ""
    return f"{what.capitalize()}: {short(result.effect, 5)}{unit}\n{result.load}{front}"


def _line_of(result: object) -> InfluenceLine:
    if not isinstance(result, (Extreme, LoadPlacement)):
        raise UnsupportedResultError(
            f"plot_placement: give the result of ilkit.place or ilkit.stand (an Extreme or a LoadPlacement), "
            f"got {type(result).__name__}."
        )
    line = result.line
    if line is None:
        raise UnsupportedResultError(
            "plot_placement: this placement does not know the influence line it stands on (it was built by "
            "hand); get it from ilkit.place(line, load) or ilkit.stand(line, load, x)."
        )
    return line


def plot_placement(
    result: Extreme | LoadPlacement, ax: Axes | None = None, *, title: str | None = None
) -> Axes:
    """Draw where the loads stand: on the beam and on the influence line; returns the axes.

    ``result`` is a governing placement (:func:`ilkit.loads.place`, an
    :class:`~ilkit.Extreme`, every load of its case drawn) or one load
    standing somewhere (:func:`ilkit.loads.stand`, a
    :class:`~ilkit.loads.LoadPlacement`).  The influence line is drawn on
    ``ax`` (new axes when omitted) with its parts shaded; the beam with the
    loads is drawn in a band above it, on axes twinned with ``ax``: an arrow
    per axle, its length growing with the load and its load written above it,
    axles that do not count in grey, loaded stretches hatched with their
    intensity, and the direction of travel (in words with an arrow, under the
    beam in its widest span; gid ``"travel"``).  On the line, the ordinate under
    every counted axle is marked and labelled, and the loaded areas are
    dotted.  Positions in the beam's length unit; ordinates positive up (the
    line's sign convention).
    """
    line = _line_of(result)
    placements = result.placements if isinstance(result, Extreme) else (result,)
    loading = _in_view(Loading.of(placements), line.length)
    beam: Beam | None = getattr(line.origin, "beam", None)
    units = line.units
    length = line.length
    with style.context():
        ax = style.axes(ax, 3.3)
        ax.axhline(0.0, color=style.MUTED, linewidth=0.7, zorder=2, gid="axis")
        draw_line(ax, line, labels=False)
        strip = ax.twinx()
        strip.set_gid("beam-band")
        _draw_beam(strip, beam, length)
        LoadArtists(strip, ax).update(loading, line)
        ax.set_xlim(-0.03 * length, 1.03 * length)
        for side in ("top", "right"):
            ax.spines[side].set_visible(False)  # the band of the loads takes the top of the axes
        _share_height(ax, strip, line, loading)
        _label_axles(strip, ax, loading, units.force if units else "", ordinate_unit(line)[0])
        _label_patches(strip, loading, points_per_unit(ax), units.line_load if units else "")
        direction = next((p.direction for p in placements if p.direction), None)
        if direction is not None:
            _travel_words(strip, direction, beam, length)
        breakpoint_ticks(ax, line)
        ax.set_xlabel(f"x [{units.length}]" if units else "x")
        unit = ordinate_unit(line)[1]
        ax.set_ylabel(f"ordinate [{unit}]" if unit else "ordinate")
        ax.yaxis.label.set_y((1 - _BAND) / 2)  # beside the line, not the band
        ax.set_title(title if title is not None else placement_title(result))
        return ax


_BAND = 0.4
"""Share of the axes' height given to the beam and the loads, at the top."""
_BAND_RANGE = (-0.42, 0.85)
"""What the band shows, in the beam diagram's data units (supports below 0, arrows above)."""


def _share_height(ax: Axes, strip: Axes, line: InfluenceLine, loading: Loading) -> None:
    """The line in the lower part of the axes, the beam band in the upper part; the y axis drawn
    only along the line's range."""
    values = [0.0, line.maximum.value, line.minimum.value, *(a.ordinate for a in loading.axles if a.counted)]
    lo, hi = min(values), max(values)
    size = (hi - lo) or 1.0
    lo, hi = lo - 0.22 * size, hi + 0.22 * size
    top = hi + (hi - lo) * _BAND / (1 - _BAND)
    ax.set_ylim(lo, top)
    ordinate_axis(ax, line, lo=lo, hi=hi)
    ax.spines["left"].set_bounds(lo, hi)
    b0, b1 = _BAND_RANGE
    strip.set_ylim(b1 - (b1 - b0) / _BAND, b1)
    strip.set_axis_off()


def _draw_beam(strip: Axes, beam: Beam | None, length: float) -> None:
    """The beam axis with its supports and releases (a plain axis for a line without its beam)."""
    from ilkit.views.draw import draw_beam

    if beam is not None:
        draw_beam(beam, strip, dimensions=False)
    else:
        strip.plot([0, length], [0, 0], color=style.INK, linewidth=2.6, solid_capstyle="butt", gid="beam")


def _in_view(loading: Loading, length: float) -> Loading:
    """The loading as a still figure shows it: axles (off the beam, not counted) beyond the drawn margin are
    left out rather than drawn cut by the frame; loaded stretches end at the beam's ends."""
    from dataclasses import replace

    margin = 0.02 * length
    axles = tuple(a for a in loading.axles if -margin <= a.x <= length + margin)
    patches = tuple((max(s, 0.0), min(e, length), q) for s, e, q in loading.patches if e > 0 and s < length)
    return replace(loading, axles=axles, patches=patches)


def _clusters(xs: list[float], widths: list[float], per_unit: float) -> list[list[int]]:
    """Runs of consecutive labels (by position) that would touch: closer than half their widths."""
    groups: list[list[int]] = []
    for k, x in enumerate(xs):
        if groups and (x - xs[groups[-1][-1]]) * per_unit < (widths[k] + widths[groups[-1][-1]]) / 2 + 2:
            groups[-1].append(k)
        else:
            groups.append([k])
    return groups


def _label_axles(strip: Axes, ax: Axes, loading: Loading, force: str, factor: float) -> None:
    """The loads above the arrows and the ordinate under every counted axle on the line.

    Axles too close for a label each share one: ``4 × 355.9 kN`` for equal
    loads, ``25 + 32 kip`` otherwise.  An ordinate whose label would cover
    another is left to the table (the largest ordinates are labelled first);
    labels are never stacked.  Load labels stand above the hatching of a
    loaded stretch.
    """
    counted = sorted((a for a in loading.axles if a.counted), key=lambda a: a.x)
    if not counted:
        return
    heaviest = max((a.load for a in loading.axles), default=1.0)
    unit = f" {force}" if force else ""
    per_unit = points_per_unit(ax)
    hatch_top = PATCH_TOP if loading.patches else 0.0
    widths = [text_width(short(a.load), 6.5) for a in counted]
    for group in _clusters([a.x for a in counted], widths, per_unit):
        members = [counted[k] for k in group]
        loads = [short(a.load) for a in members]
        text = f"{len(loads)} × {loads[0]}" if len(set(loads)) == 1 and len(loads) > 1 else " + ".join(loads)
        top = max(max(arrow_tip(a.load, heaviest) for a in members), hatch_top)
        x = (members[0].x + members[-1].x) / 2
        strip.annotate(text + unit, xy=(x, top), xytext=(0, 2), textcoords="offset points", ha="center",
                       va="bottom", fontsize=6.5, gid=f"load:{fmt(members[0].x)}", annotation_clip=False,
                       bbox=LABEL_BOX)
    placed: list[tuple[float, float, float, float]] = []
    to_points = 72.0 / ax.figure.dpi
    for a in sorted(counted, key=lambda a: -abs(a.ordinate)):
        text = short(a.ordinate * factor)
        px, py = (v * to_points for v in ax.transData.transform((a.x, a.ordinate)))
        width, height, up = text_width(text, 7.0) + 1, 8.0, a.ordinate >= 0
        box = (px - width / 2, px + width / 2, py + 5 if up else py - 5 - height, py + 5 + height if up else py - 5)
        if any(not (box[1] <= b[0] or box[0] >= b[1] or box[3] <= b[2] or box[2] >= b[3]) for b in placed):
            continue  # no room: the table gives it
        placed.append(box)
        ax.annotate(text, xy=(a.x, a.ordinate), xytext=(0, 5 if up else -5), textcoords="offset points",
                    ha="center", va="bottom" if up else "top", fontsize=7, gid=f"axle-ordinate:{fmt(a.x)}",
                    annotation_clip=False, bbox=LABEL_BOX)


def _label_patches(strip: Axes, loading: Loading, points: float, line_load: str) -> None:
    """The intensity of each loaded stretch: inside its band where no counted axle crosses it, or above a
    stretch too short to carry it."""
    unit = f" {line_load}" if line_load else ""
    axles = [a.x for a in loading.axles if a.counted]
    for s, e, q in loading.patches:
        text = f"{short(q)}{unit}"
        half = (text_width(text, 6.5) + 4) / 2 / points
        if e - s < 2 * half:
            strip.annotate(text, xy=((s + e) / 2, PATCH_TOP), xytext=(0, 2), textcoords="offset points",
                           ha="center", va="bottom", fontsize=6.5, gid=f"patch:{fmt(s)}", annotation_clip=False,
                           bbox=LABEL_BOX)
            continue
        spots = np.linspace(s + half, e - half, 9)
        x = max(spots, key=lambda c: min((abs(c - a) for a in axles), default=np.inf))
        strip.annotate(text, xy=(float(x), ARROW_BASE + 0.15), ha="center", va="center", fontsize=6.5,
                       gid=f"patch:{fmt(s)}", annotation_clip=False, bbox=LABEL_BOX)


def _travel_words(strip: Axes, direction: str, beam: Beam | None, length: float) -> None:
    """The direction of travel in words with an arrow, under the beam in its widest span (clear of the
    loads above the beam and of the supports)."""
    stops = sorted({0.0, length, *(float(s.at) for s in beam.supports)} if beam is not None else {0.0, length})
    a, b = max(zip(stops[:-1], stops[1:]), key=lambda ab: ab[1] - ab[0])
    words = f"travelling {direction} →" if direction == "left to right" else f"← travelling {direction}"
    strip.annotate(words, xy=((a + b) / 2, -0.28), ha="center", va="center", fontsize=7.5, fontstyle="italic",
                   gid="travel", annotation_clip=False)
