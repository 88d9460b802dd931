"""Drawings of factored envelopes and of lanes across a deck.

The numbers are the core's (:func:`ilkit.design.factored_envelope`,
:func:`ilkit.design.place_design_lanes`); this module only draws them:

* :func:`plot_factored_envelope`: the factored largest and smallest values of
  each limit state along the beam, with the unfactored components underneath
  (the permanent effect of each load category and the girder's live-load
  envelope);
* :func:`plot_transverse`: a girder's transverse influence line across the
  deck, with the girders, the barriers and the lanes and wheel lines placed
  for its largest share.
"""

from __future__ import annotations

from collections.abc import Sequence
from typing import TYPE_CHECKING, Any, Literal

import numpy as np

from ilkit._check import choice
from ilkit.design.factored import QUANTITIES, FactoredEnvelope
from ilkit.design.transverse import LanePlacement, TransverseLine
from ilkit.errors import DesignInputError
from ilkit.views import style
from ilkit.views._args import axes_or_none, expect

if TYPE_CHECKING:  # pragma: no cover
    from matplotlib.axes import Axes

__all__ = ["plot_factored_envelope", "plot_transverse"]

_WORDS = {"moment": ("M", "bending moment"), "shear": ("V", "shear"), "reaction": ("R", "reaction")}
_DASHES = ["-", (0, (5, 2)), (0, (1, 1.5)), (0, (6, 2, 1, 2)), (0, (3, 1)), (0, (8, 2))]
_FACE = {"left": 0, "": 1, "right": 2}


def _ordered(frame: Any) -> Any:
    order = np.lexsort((frame["side"].map(_FACE).to_numpy(), frame["x"].to_numpy()))
    return frame.iloc[order]


def _unit(envelope: FactoredEnvelope, quantity: str) -> str:
    u = envelope.units
    if u is None:
        return ""
    return u.moment if quantity == "moment" else u.force


def plot_factored_envelope(
    envelope: FactoredEnvelope,
    quantity: Literal["moment", "shear", "reaction"] = "moment",
    axes: Sequence[Axes] | None = None,
    *,
    limit_states: Sequence[str] | None = None,
) -> tuple[Axes, Axes]:
    """Draw the factored envelopes of ``quantity`` and, underneath, their unfactored components.

    Upper axes: the largest (solid) and smallest (dashed) factored value of
    each limit state (``limit_states``: names, all by default) along the
    beam.  Lower axes: the permanent effect of each load category and the
    girder's live-load envelope (with its dynamic effect and share, without
    load factors).  Values in the beam's units, positive up: sagging moment,
    shear positive when the part left of the section is pushed up, upward
    reaction (:mod:`ilkit.model`).  ``axes``: two axes to draw on (a new
    figure by default); returns them.
    """
    expect(envelope, FactoredEnvelope, what="plot_factored_envelope",
           hint="give the result of ilkit.design.factored_envelope(...)")
    choice(quantity, QUANTITIES, what="plot_factored_envelope: quantity", field="quantity", error=DesignInputError)
    names = [s.name for s in envelope.limit_states] if limit_states is None else list(limit_states)
    for n in names:
        choice(n, [s.name for s in envelope.limit_states], what="plot_factored_envelope: limit state",
               field="limit_states", error=DesignInputError)
    symbol, words = _WORDS[quantity]
    unit = _unit(envelope, quantity)
    u = envelope.units
    frame = envelope.frame[envelope.frame["quantity"] == quantity]
    marker = quantity == "reaction"
    with style.context():
        if axes is None:  # a pyplot figure, so that it shows in a notebook (regression: it did not)
            import matplotlib.pyplot as plt

            _, (top, bottom) = plt.subplots(2, 1, sharex=True, figsize=(style.WIDTH, 5.2), layout="constrained")
        else:
            pair = list(axes) if isinstance(axes, (list, tuple)) or hasattr(axes, "ravel") else [axes]
            if hasattr(axes, "ravel"):
                pair = list(axes.ravel())  # type: ignore[union-attr]
            if len(pair) != 2:
                raise DesignInputError("plot_factored_envelope: axes must be two axes (factored above, components "
                                       "below), e.g. plt.subplots(2, 1)[1], or left out.", field="axes", value=axes)
            top, bottom = (axes_or_none(a, what="plot_factored_envelope") for a in pair)
        for k, name in enumerate(names):
            rows = _ordered(frame[frame["limit_state"] == name])
            xs = rows["x"].to_numpy(dtype=float)
            grey = style.INK if k == 0 else style.MUTED
            fmt = dict(marker="o" if marker else None, markersize=3.5, linestyle="none" if marker else "-")
            top.plot(xs, rows["max"].to_numpy(dtype=float), color=grey, linewidth=1.5 if k == 0 else 1.0,
                     gid=f"max:{name}", label=f"{name} max", **fmt)  # type: ignore[arg-type]
            top.plot(xs, rows["min"].to_numpy(dtype=float), color=grey, linewidth=1.0,
                     **(fmt | ({} if marker else {"linestyle": _DASHES[1 + k % (len(_DASHES) - 1)]})),
                     gid=f"min:{name}", label=f"{name} min")  # type: ignore[arg-type]
        top.axhline(0.0, color=style.MUTED, linewidth=0.7, zorder=2, gid="axis")
        top.set_ylabel(f"{symbol} [{unit}]" if unit else symbol)
        top.set_title(f"Factored {words}: {', '.join(names)}")
        top.legend(fontsize=6.5, frameon=False, ncols=2)
        # the unfactored components: permanent effect of each category, the girder's live-load envelope
        permanent = envelope.permanent.by_category()
        permanent = _ordered(permanent[permanent["quantity"] == quantity])
        xs = permanent["x"].to_numpy(dtype=float)
        for k, category in enumerate(envelope.permanent.categories):
            values = permanent[category].to_numpy(dtype=float)
            bottom.plot(xs, values, color=style.MUTED, linestyle="none" if marker else _DASHES[k % len(_DASHES)],
                        marker="s" if marker else None, markersize=3, linewidth=1.0, gid=f"permanent:{category}",
                        label=f"{category} (unfactored)")
        shown: set[int] = set()
        for name in names:
            live = envelope.live[name]
            if id(live) in shown:
                continue
            shown.add(id(live))
            rows = _ordered(live.frame[live.frame["quantity"] == quantity])
            lx = rows["x"].to_numpy(dtype=float)
            lo, hi = rows["min"].to_numpy(dtype=float), rows["max"].to_numpy(dtype=float)
            if marker:
                bottom.vlines(lx, lo, hi, color=style.INK, linewidth=1.2, gid=f"live:{live.live.name}",
                              label=f"{live.live.name} (girder, no γ)")
            else:
                bottom.fill_between(lx, lo, hi, facecolor="#dfe3e8", edgecolor=style.INK, linewidth=0.8, zorder=1,
                                    gid=f"live:{live.live.name}", label=f"{live.live.name} (girder, no γ)")
        bottom.axhline(0.0, color=style.MUTED, linewidth=0.7, zorder=2, gid="axis")
        bottom.set_ylabel(f"{symbol} [{unit}]" if unit else symbol)
        bottom.set_xlabel(f"section x [{u.length}]" if u else "section x")
        bottom.set_title("Unfactored components", fontsize=8)
        bottom.legend(fontsize=6.5, frameon=False)
    return top, bottom


def plot_transverse(result: TransverseLine | LanePlacement, ax: Axes | None = None, *,
                    title: str | None = None) -> Axes:
    """Draw a girder's transverse influence line across the deck; with a lane placement, also the lanes and
    wheel lines placed for its largest share.  Returns the axes.

    The share (dimensionless, positive when the girder is pressed down) is
    drawn upward against ``y`` across the deck from its left edge (length
    unit of the section); girders are triangles on the axis, barriers shaded
    at the deck edges, lanes as brackets above the line with their wheel
    lines as arrows.
    """
    placement = result if isinstance(result, LanePlacement) else None
    line = placement.line if placement is not None else result
    expect(line, TransverseLine, what="plot_transverse",
           hint="give ilkit.design.transverse_line(...) or place_design_lanes(...)")
    section = line.section
    unit = section.units.length
    with style.context():
        ax = style.axes(ax, 2.6)
        ys = np.asarray(line.y)
        ax.plot(ys, line.share, color=style.INK, linewidth=1.5, gid="share")
        ax.axhline(0.0, color=style.MUTED, linewidth=0.7, zorder=2, gid="axis")
        for k, y in enumerate(section.positions, 1):
            ax.plot([y], [0.0], marker="^", markersize=7, color=style.INK if k == line.girder else style.MUTED,
                    linestyle="none", gid=f"girder:{k}")
        for a, b in ((0.0, section.barrier), (section.width - section.barrier, section.width)):
            ax.axvspan(a, b, facecolor="#dfe3e8", edgecolor="none", zorder=0, gid="barrier")
        top = max(max(line.share), 1.0)
        if placement is not None:
            for k, ((a, b), (w1, w2)) in enumerate(zip(placement.lanes, placement.wheels), 1):
                level = top * (1.12 + 0.1 * (k % 2))
                ax.plot([a, a, b, b], [level - 0.04 * top, level, level, level - 0.04 * top], color=style.MUTED,
                        linewidth=0.9, gid=f"lane:{k}")
                ax.annotate(f"lane {k}", xy=((a + b) / 2, level), xytext=(0, 2), textcoords="offset points",
                            ha="center", va="bottom", fontsize=7, gid=f"lane-label:{k}")
                for w in (w1, w2):
                    ax.annotate("", xy=(w, line(w)), xytext=(w, level - 0.06 * top),
                                arrowprops={"arrowstyle": "-|>", "color": style.INK, "linewidth": 0.9},
                                gid=f"wheel:{k}")
        ax.set_xlim(0.0, section.width)
        ax.margins(y=0.25)
        ax.set_xlabel(f"y across the deck [{unit}]")
        ax.set_ylabel(f"share of girder {line.girder}")
        words = f"Girder {line.girder} of {section.girders}: {line.method}"
        if placement is not None:
            words += f", {placement.loaded} lane{'s' if placement.loaded > 1 else ''}, share {placement.share:.4f}"
        ax.set_title(title if title is not None else words)
    return ax
