"""Influence-line plots: the line, its positive and negative parts shaded, and
its key ordinates labelled with the values the core computes.

Works for every :class:`~ilkit.InfluenceLine`, exact or numeric, straight or
curved pieces.  Labels: the ordinate at every breakpoint where it is not zero
(both faces where the line jumps) and, for curved lines, the largest and
smallest ordinates inside pieces.  Every label artist has the gid
``"ordinate:<x>:<side>"`` (side ``left``, ``right`` or ``both``).
"""

from __future__ import annotations

from typing import TYPE_CHECKING, Any

import numpy as np

from ilkit._exact import fmt
from ilkit.views import style
from ilkit.views.derive import quantity_title

if TYPE_CHECKING:  # pragma: no cover
    from matplotlib.artist import Artist
    from matplotlib.axes import Axes

    from ilkit.influence import InfluenceLine

__all__ = ["plot_line", "draw_line", "label_ordinates", "key_ordinates", "short"]


def short(value: float, digits: int = 4) -> str:
    """A figure label for a number: ``digits`` significant figures, no ``-0``."""
    text = f"{value:.{digits}g}"
    return "0" if text in ("-0", "0") else text


def key_ordinates(line: InfluenceLine, *, tol: float = 1e-12) -> list[tuple[float, str, float]]:
    """``(x, side, value)`` of the ordinates worth labelling; side is ``left``, ``right`` or ``both``.

    Breakpoints where the line is not zero (both faces at a jump; only the
    face on the beam at its ends), and the extremes inside curved pieces
    (unless a labelled breakpoint is close by).
    Values are the core's (``line.knot_values()``, ``line.maximum``, ``line.minimum``).
    """
    rows = line.knot_values()
    out: list[tuple[float, str, float]] = []
    scale = max(1.0, *(max(abs(a), abs(b)) for _, a, b in rows))
    for j, (x, left, right) in enumerate(rows):
        if j == 0:
            left = right
        elif j == len(rows) - 1:
            right = left
        if abs(left - right) > tol * scale:
            out += [(x, "left", left), (x, "right", right)]
        elif abs(left) > tol * scale:
            out.append((x, "both", left))
    knots = set(line.breakpoints)
    near = 0.08 * (line.breakpoints[-1] - line.breakpoints[0])  # closer than this to a labelled knot: crowded
    for extreme in (line.maximum, line.minimum):
        crowded = any(abs(extreme.x - x) < near for x, _, _ in out)
        if extreme.x not in knots and abs(extreme.value) > tol * scale and not crowded:
            out.append((extreme.x, "both", extreme.value))
    return out


def label_ordinates(ax: Axes, line: InfluenceLine) -> list[Artist]:
    """Write the key ordinates (:func:`key_ordinates`) next to the line."""
    out = []
    for x, side, value in key_ordinates(line):
        dx = {"left": -3, "right": 3, "both": 0}[side]
        dy = 4 if value >= 0 else -4
        out.append(
            ax.annotate(
                short(value), xy=(x, value), xytext=(dx, dy), textcoords="offset points",
                ha={"left": "right", "right": "left", "both": "center"}[side],
                va="bottom" if value >= 0 else "top", fontsize=7.5, gid=f"ordinate:{fmt(x)}:{side}",
                annotation_clip=False,
            )
        )
    return out


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
    vertical axis the ordinate (quantity per unit load, positive up).
    """
    with style.context():
        ax = style.axes(ax, 2.4)
        ax.axhline(0.0, color=style.MUTED, linewidth=0.7, zorder=2, gid="axis")
        draw_line(ax, line)
        units = line.units
        ax.set_xlabel(f"load position x [{units.length}]" if units else "load position x")
        ax.set_ylabel(f"ordinate [{line.unit}]" if line.unit else "ordinate")
        ax.set_xticks(line.breakpoints, [fmt(b) for b in line.breakpoints])
        ax.set_xlim(line.breakpoints[0], line.breakpoints[-1])
        ax.margins(y=0.2)
        ax.set_title(title if title is not None else "Influence line: " + quantity_title(line.quantity, units.length
                                                                                         if units else ""))
        return ax
