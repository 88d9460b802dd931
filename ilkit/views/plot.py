"""Influence-line plots: the line, its positive and negative parts shaded, and
its key ordinates labelled with the values the core computes.

Works for every :class:`~ilkit.InfluenceLine`, exact or numeric, straight or
curved pieces.  Labels: the ordinate at every breakpoint where it is not zero
(both sides where the line jumps) and, for curved lines, the largest and
smallest ordinates inside pieces.  Every label artist has the gid
``"ordinate:<x>:<side>"`` (side ``left``, ``right`` or ``both``).
"""

from __future__ import annotations

from collections.abc import Sequence
from typing import TYPE_CHECKING, Any

import numpy as np

from ilkit._exact import fmt
from ilkit.views import style
from ilkit.views._args import expect
from ilkit.views.derive import quantity_title
from ilkit.views.numbers import ordinate_unit, short

if TYPE_CHECKING:  # pragma: no cover
    from matplotlib.artist import Artist
    from matplotlib.axes import Axes

    from ilkit.influence import InfluenceLine

__all__ = [
    "plot_line",
    "draw_line",
    "label_ordinates",
    "key_ordinates",
    "breakpoint_ticks",
    "free_offsets",
    "text_width",
    "points_per_unit",
    "LABEL_BOX",
    "short",
    "ordinate_axis",
]


def ordinate_axis(ax: Axes, line: InfluenceLine, *, lo: float | None = None, hi: float | None = None) -> None:
    """The vertical axis of ``ax`` in the display unit of ``line``'s ordinates (:func:`ordinate_unit`).

    Ticks at round numbers of that unit (mm/kN for a deflection line, not
    m/kN with a ``1e-5`` offset), written without an offset.  With ``lo`` and
    ``hi`` the ticks are set once, between them; else they follow the limits.
    """
    from matplotlib.ticker import FuncFormatter, MaxNLocator

    factor, _ = ordinate_unit(line)

    class Scaled(MaxNLocator):  # type: ignore[misc]
        def tick_values(self, vmin: float, vmax: float) -> Any:
            return super().tick_values(vmin * factor, vmax * factor) / factor

    locator = Scaled(5 if lo is not None else "auto")
    if lo is not None and hi is not None:
        ax.set_yticks([t for t in locator.tick_values(lo, hi) if lo <= t <= hi])
    else:
        ax.yaxis.set_major_locator(locator)
    ax.yaxis.set_major_formatter(FuncFormatter(lambda v, _: short(v * factor, 6)))


def key_ordinates(line: InfluenceLine, *, tol: float = 1e-12) -> list[tuple[float, str, float]]:
    """``(x, side, value)`` of the ordinates worth labelling; side is ``left``, ``right`` or ``both``.

    Breakpoints where the line is not zero (both sides at a jump; only the
    side on the beam at its ends), and the extremes inside curved pieces
    (unless a labelled breakpoint is close by).  For a line of a beam's
    analysis, breakpoints that are only changes of ``EI`` are left out (they
    are element ends, not points of the structure).
    Values are the core's (``line.knot_values()``, ``line.maximum``, ``line.minimum``).
    """
    rows = line.knot_values()
    out: list[tuple[float, str, float]] = []
    scale = max(1.0, *(max(abs(a), abs(b)) for _, a, b in rows))
    beam = getattr(line.origin, "beam", None)
    structural = None if beam is None else {
        float(p) for p in (0, beam.length, line.quantity.at, *(s.at for s in beam.supports),
                           *(r for r, _ in beam.releases), *(beam.panel_points or ()))
    }
    for j, (x, left, right) in enumerate(rows):
        if structural is not None and x not in structural:
            continue
        if j == 0:
            left = right
        elif j == len(rows) - 1:
            right = left
        if abs(left - right) > tol * scale:
            out += [(x, side, v) for side, v in (("left", left), ("right", right)) if abs(v) > tol * scale]
        elif abs(left) > tol * scale:
            out.append((x, "both", left))
    knots = set(line.breakpoints)
    near = 0.08 * (line.breakpoints[-1] - line.breakpoints[0])  # closer than this to a labelled knot: crowded
    for extreme in (line.maximum, line.minimum):
        crowded = any(abs(extreme.x - x) < near for x, _, _ in out)
        if extreme.x not in knots and abs(extreme.value) > tol * scale and not crowded:
            out.append((extreme.x, "both", extreme.value))
    return out


def free_offsets(
    ax: Axes,
    anchors: Sequence[tuple[float, float]],
    widths: Sequence[float],
    up: Sequence[bool],
    *,
    align: Sequence[str] | None = None,
    dx: Sequence[float] | None = None,
    first: float = 4.0,
    step: float = 9.0,
    height: float = 8.0,
) -> list[float]:
    """Vertical offsets in points (up positive) that keep labels at ``anchors`` clear of each other.

    Each label (``widths`` in points, horizontal alignment ``align`` and
    offset ``dx`` per label) goes ``first`` points from its anchor (data
    coordinates of ``ax``), above it where ``up`` and below it otherwise,
    and moves out by ``step`` until it overlaps no label placed before it.
    Call it once the axes' limits are set.
    """
    to_points = 72.0 / ax.figure.dpi
    placed: list[tuple[float, float, float, float]] = []
    out = []
    for k, ((x, y), width, upward) in enumerate(zip(anchors, widths, up)):
        px, py = (v * to_points for v in ax.transData.transform((x, y)))
        px += dx[k] if dx is not None else 0.0
        ha = align[k] if align is not None else "center"
        left = {"center": px - width / 2, "left": px, "right": px - width}[ha]
        for n in range(8):
            offset = first + step * n
            bottom = py + offset if upward else py - offset - height
            box = (left, left + width, bottom, bottom + height)
            if all(box[1] <= b[0] or box[0] >= b[1] or box[3] <= b[2] or box[2] >= b[3] for b in placed):
                break
        placed.append(box)
        out.append(offset if upward else -offset)
    return out


LABEL_BOX: dict[str, Any] = {"boxstyle": "square,pad=0.08", "facecolor": "white", "edgecolor": "none", "alpha": 0.85}
"""A white ground under a label, so that hatching and lines behind it do not cross the figures."""


def text_width(text: str, size: float = 7.5) -> float:
    """Approximate width in points of ``text`` in the figure font at ``size`` points (for spacing labels)."""
    return 0.6 * size * len(text) + 2.0


def points_per_unit(ax: Axes) -> float:
    """Typographic points per data unit along x, from the axes' current size and limits."""
    lo, hi = ax.get_xlim()
    return ax.get_window_extent().width * 72.0 / ax.figure.dpi / (hi - lo)


def label_ordinates(ax: Axes, line: InfluenceLine) -> list[Artist]:
    """Write the key ordinates (:func:`key_ordinates`) next to the line, clear of each other.

    Call it once the axes' limits are set (the labels are spaced in points).
    """
    found = key_ordinates(line)
    factor, _ = ordinate_unit(line)
    texts = [short(v * factor) for _, _, v in found]
    align = [{"left": "right", "right": "left", "both": "center"}[side] for _, side, _ in found]
    shift = [{"left": -3.0, "right": 3.0, "both": 0.0}[side] for _, side, _ in found]
    offsets = free_offsets(ax, [(x, v) for x, _, v in found], [text_width(t) for t in texts],
                           [v >= 0 for _, _, v in found], align=align, dx=shift)
    return [
        ax.annotate(
            text, xy=(x, value), xytext=(dx, dy), textcoords="offset points", ha=ha,
            va="bottom" if dy > 0 else "top", fontsize=7.5, gid=f"ordinate:{fmt(x)}:{side}",
            annotation_clip=False, bbox=LABEL_BOX,
        )
        for (x, side, value), text, ha, dx, dy in zip(found, texts, align, shift, offsets)
    ]


def breakpoint_ticks(ax: Axes, line: InfluenceLine, *, size: float = 7.5) -> None:
    """Ticks at the line's breakpoints, labelled where the labels have room.

    The ends of the beam, its supports and the section come first; a
    breakpoint closer to a labelled one than its label is wide keeps its
    tick without a label.  Call it once the x limits are set.
    """
    beam = getattr(line.origin, "beam", None)
    points = list(line.breakpoints)
    first = {points[0], points[-1], float(line.quantity.at)}
    if beam is not None:
        first |= {float(s.at) for s in beam.supports}
    order = sorted(points, key=lambda b: (b not in first, points.index(b)))
    per_unit = points_per_unit(ax)
    shown: list[float] = []
    for b in order:
        room = (text_width(fmt(b), size) + 3.0) / per_unit
        if all(abs(b - c) >= room for c in shown):
            shown.append(b)
    ax.set_xticks(points, [fmt(b) if b in shown else "" for b in points])


def _shape(line: InfluenceLine) -> tuple[np.ndarray, np.ndarray, np.ndarray, np.ndarray]:
    """Points of the line for filling, and the same broken at jumps for drawing."""
    xs, ys = line.sample()
    if line.degree <= 1 and line.roots():
        roots = np.array(line.roots())
        xs = np.concatenate([xs, roots])
        ys = np.concatenate([ys, np.zeros_like(roots)])
        order = np.argsort(xs, kind="stable")
        xs, ys = xs[order], ys[order]
    jump = np.nonzero((np.diff(xs) == 0) & (np.diff(ys) != 0))[0]
    bx = np.insert(xs, jump + 1, np.nan)
    by = np.insert(ys, jump + 1, np.nan)
    return xs, ys, bx, by


def draw_line(ax: Axes, line: InfluenceLine, *, labels: bool = True) -> dict[str, Any]:
    """Draw the line with its shaded parts on ``ax``; returns the artists by role.

    Keys: ``"positive"`` and ``"negative"`` (fills), ``"shape"`` (the line),
    ``"labels"`` (the key ordinates' labels; none with ``labels=False``).
    """
    xs, ys, bx, by = _shape(line)
    positive = ax.fill_between(xs, ys, 0, where=ys >= 0, interpolate=True, gid="positive", zorder=1, **style.POSITIVE)
    negative = ax.fill_between(xs, ys, 0, where=ys <= 0, interpolate=True, gid="negative", zorder=1, **style.NEGATIVE)
    (shape,) = ax.plot(bx, by, color=style.INK, linewidth=1.8, gid="shape", zorder=3)
    return {"positive": positive, "negative": negative, "shape": shape,
            "labels": label_ordinates(ax, line) if labels else []}


def plot_line(line: InfluenceLine, ax: Axes | None = None, *, title: str | None = None) -> Axes:
    """Plot an influence line with its parts shaded and key ordinates labelled; returns the axes.

    The horizontal axis is the load position ``x`` (beam length unit), the
    vertical axis the ordinate (quantity per unit load, positive up; a
    deflection in mm or in, a rotation in mrad per unit load, as in the
    tables: :func:`ilkit.views.numbers.ordinate_unit`).
    """
    from ilkit.influence import InfluenceLine

    expect(line, InfluenceLine, what="plot_line", hint="give an influence line, e.g. beam.moment(12)")
    with style.context():
        ax = style.axes(ax, 2.4)
        ax.axhline(0.0, color=style.MUTED, linewidth=0.7, zorder=2, gid="axis")
        draw_line(ax, line, labels=False)
        units = line.units
        ax.set_xlabel(f"load position x [{units.length}]" if units else "load position x")
        unit = ordinate_unit(line)[1]
        ax.set_ylabel(f"ordinate [{unit}]" if unit else "ordinate")
        ordinate_axis(ax, line)
        ax.set_xlim(line.breakpoints[0], line.breakpoints[-1])
        ax.margins(y=0.2)
        breakpoint_ticks(ax, line)
        label_ordinates(ax, line)
        ax.set_title(title if title is not None else "Influence line: " + quantity_title(line.quantity, units.length
                                                                                         if units else ""))
        return ax
