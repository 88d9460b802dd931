"""Drawings of load ratings: the rating factor along the girder.

The numbers are the core's (:func:`ilkit.rating.rate_girder`, :func:`ilkit.rating.cooper_rating`,
:func:`ilkit.rating.classified_rating`); this module only draws them.
"""

from __future__ import annotations

from collections.abc import Sequence
from typing import TYPE_CHECKING

import numpy as np

from ilkit._check import choice, listed
from ilkit.errors import RatingInputError
from ilkit.rating.lrfr import GirderRating
from ilkit.rating.rail import RailRating
from ilkit.views import style
from ilkit.views._args import expect

if TYPE_CHECKING:  # pragma: no cover
    from matplotlib.axes import Axes

__all__ = ["plot_rating", "plot_rail_rating"]

_DASHES = ["-", (0, (5, 2)), (0, (1, 1.5)), (0, (6, 2, 1, 2)), (0, (3, 1)), (0, (8, 2)), (0, (2, 2))]
_GREYS = ["#1c1c1c", "#4a5a6a", "#7d8b99", "#2f6f8f", "#8f5f2f", "#5f8f4f", "#6f4f8f"]


def _top(values: Sequence[float]) -> float:
    """The upper end of the RF axis: room above the smallest ratings, without the huge values near the
    points where an effect changes sign (they are drawn off the axes)."""
    low = max(float(np.min(values)), 0.0) if len(values) else 1.0
    return max(2.0, 3.0 * low, 1.25)


def plot_rating(rating: GirderRating, vehicles: str | Sequence[str] | None = None, ax: Axes | None = None, *,
                quantity: str | None = None) -> Axes:
    """Draw the rating factor along the girder for ``vehicles`` (all by default): at every section the
    smaller RF of the rated actions and senses (or of one ``quantity``), with RF = 1 drawn as a line and
    each vehicle's controlling section marked.  Sections in the beam's length unit; RF dimensionless.
    Returns the axes (artists with gid ``"rf:<vehicle>"``, ``"controlling:<vehicle>"``, ``"rf-one"``)."""
    expect(rating, GirderRating, what="plot_rating", hint="give ilkit.rating.rate_girder(...)")
    names = [r.name for r in rating.loads]
    chosen = names if vehicles is None else (
        [vehicles] if isinstance(vehicles, str) else listed(vehicles, wanted="plot_rating: vehicles: give names",
                                                            field="vehicles", error=RatingInputError))
    for v in chosen:
        choice(v, names, what="plot_rating: vehicle", field="vehicles", error=RatingInputError)
    u = rating.beam.units
    with style.context():
        ax = style.axes(ax, 3.0)
        lows = []
        for k, name in enumerate(chosen):
            rows = rating.along(name, quantity)
            best = rows.loc[rows.groupby(["x", "side"], sort=False)["RF"].idxmin()]
            face = best["side"].map({"left": 0, "": 1, "right": 2}).to_numpy()
            best = best.iloc[np.lexsort((face, best["x"].to_numpy()))]
            xs, rf = best["x"].to_numpy(dtype=float), best["RF"].to_numpy(dtype=float)
            ax.plot(xs, rf, color=_GREYS[k % len(_GREYS)], linestyle=_DASHES[k % len(_DASHES)], linewidth=1.2,
                    marker="o", markersize=2.5, gid=f"rf:{name}", label=name)
            i = int(np.argmin(rf))
            lows.append(rf[i])
            ax.plot([xs[i]], [rf[i]], marker="v", markersize=6, color=_GREYS[k % len(_GREYS)], linestyle="none",
                    gid=f"controlling:{name}")
        ax.axhline(1.0, color="#b03030", linewidth=0.9, zorder=1, gid="rf-one")
        ax.set_ylim(0.0 if min(lows, default=1.0) >= 0 else min(lows) * 1.1, _top(lows))
        ax.set_xlim(0.0, float(rating.beam.length))
        ax.set_xlabel(f"section x [{u.length}]" if u else "section x")
        ax.set_ylabel("rating factor RF")
        what = f"{quantity}" if quantity else "moment and shear"
        ax.set_title(f"Rating factor along the girder ({what}; the smaller of both senses)")
        if len(chosen) > 4:  # many vehicles: the legend below the axes, clear of the lines
            ax.legend(fontsize=6.5, frameon=False, ncols=min(5, len(chosen)), loc="upper center",
                      bbox_to_anchor=(0.5, -0.2))
        else:
            ax.legend(fontsize=6.5, frameon=False, ncols=len(chosen))
    return ax


def plot_rail_rating(rating: RailRating, ax: Axes | None = None) -> Axes:
    """Draw a rail rating along the girder: per level the smallest Cooper E-n (or classified α) of the rated
    actions and senses at every section, the controlling section marked.  Sections in the beam's length
    unit.  Returns the axes (gid ``"rating:<level>"``)."""
    expect(rating, RailRating, what="plot_rail_rating", hint="give ilkit.rating.cooper_rating(...)")
    u = rating.beam.units
    with style.context():
        ax = style.axes(ax, 3.0)
        lows = []
        for k, level in enumerate(rating.levels):
            rows = rating.frame[rating.frame["level"] == level]
            best = rows.loc[rows.groupby(["x", "side"], sort=False)["rating"].idxmin()]
            face = best["side"].map({"left": 0, "": 1, "right": 2}).to_numpy()
            best = best.iloc[np.lexsort((face, best["x"].to_numpy()))]
            xs, values = best["x"].to_numpy(dtype=float), best["rating"].to_numpy(dtype=float)
            ax.plot(xs, values, color=_GREYS[k], linestyle=_DASHES[k], marker="o", markersize=2.5, linewidth=1.2,
                    gid=f"rating:{level}", label=level)
            i = int(np.argmin(values))
            lows.append(values[i])
            ax.plot([xs[i]], [values[i]], marker="v", markersize=6, color=_GREYS[k], linestyle="none")
        top = max(3.0 * max(min(lows), 0.0), 1.0)
        ax.set_ylim(0.0, top)
        ax.set_xlim(0.0, float(rating.beam.length))
        ax.set_xlabel(f"section x [{u.length}]" if u else "section x")
        ax.set_ylabel("Cooper E-n" if rating.kind == "Cooper" else "classified load α")
        ax.set_title("Cooper E-rating along the girder" if rating.kind == "Cooper" else "Classified load α along "
                     "the girder")
        ax.legend(fontsize=6.5, frameon=False)
    return ax
