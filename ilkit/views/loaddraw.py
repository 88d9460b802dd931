"""The drawing of a load standing on a beam, shared by the explorer and the placement plots.

A :class:`Loading` is what stands on the beam: axles (position, load, the
ordinate under it, whether it counts) and uniformly loaded stretches.
:class:`LoadArtists` draws it on a pair of axes, the beam diagram above and
the influence line below:

* on the beam, an arrow per axle whose length grows with its load (axles
  that do not count, being off the beam or left off because they would
  reduce the extreme, in the reference grey) and a hatched band over each
  loaded stretch;
* on the line, a drop from the axis to the ordinate under each counted axle
  (with a dot) and the area under the line over each loaded stretch, dotted.

The artists are made once and moved with :meth:`LoadArtists.update`, so the
explorer can animate them on a cached background; a still figure (the
placement plot of :mod:`ilkit.views.moving`) draws them once.  Every number
drawn is the core's (:class:`ilkit.loads.LoadPlacement`).

Artist gids: ``"load:stems"``, ``"load:heads"``, ``"load:not-counted"``,
``"load:not-counted-heads"``, ``"load:patches"`` (beam), ``"load:ordinates"``,
``"load:dots"``, ``"load:area"`` (line).
"""

from __future__ import annotations

from collections.abc import Iterable, Sequence
from dataclasses import dataclass
from typing import TYPE_CHECKING

import numpy as np

from ilkit.views import style

if TYPE_CHECKING:  # pragma: no cover
    from matplotlib.artist import Artist
    from matplotlib.axes import Axes

    from ilkit.influence import InfluenceLine
    from ilkit.loads.results import LoadPlacement

__all__ = ["Axle", "Loading", "LoadArtists", "ARROW_TOP", "ARROW_BASE", "PATCH_TOP"]

ARROW_TOP = 0.55
"""Height of the tallest axle arrow above the beam axis (the beam diagram's data units)."""
ARROW_BASE = 0.08
"""Where the arrows end, just above the beam axis (the beam diagram's data units)."""
PATCH_TOP = ARROW_TOP * 0.7
"""Top of the hatched band of a loaded stretch (the beam diagram's data units)."""


@dataclass(frozen=True)
class Axle:
    """An axle as drawn: position, load (force unit), ordinate under it, and whether it counts."""

    x: float
    load: float
    ordinate: float
    counted: bool = True


@dataclass(frozen=True)
class Loading:
    """What stands on the beam: axles and uniformly loaded stretches ``(start, end, intensity)``."""

    axles: tuple[Axle, ...] = ()
    patches: tuple[tuple[float, float, float], ...] = ()

    @classmethod
    def of(cls, placements: Iterable[LoadPlacement]) -> Loading:
        """The axles and loaded stretches of placed loads (:class:`ilkit.loads.LoadPlacement`)."""
        axles: list[Axle] = []
        patches: list[tuple[float, float, float]] = []
        for p in placements:
            axles += [Axle(a.x, a.load, a.ordinate, a.counted) for a in p.axles]
            patches += [(s.start, s.end, s.intensity) for s in p.patches]
        return cls(tuple(axles), tuple(patches))


def arrow_tip(load: float, heaviest: float) -> float:
    """Height of the top of an axle's arrow: from 0.2 for no load to :data:`ARROW_TOP` for the heaviest."""
    return 0.2 + (ARROW_TOP - 0.2) * load / (heaviest or 1.0)


class LoadArtists:
    """The artists of a loading on a beam diagram (``ax_beam``) and an influence line (``ax_line``)."""

    def __init__(self, ax_beam: Axes, ax_line: Axes) -> None:
        from matplotlib.collections import PolyCollection

        ink, muted = style.INK, style.MUTED
        self.stems = ax_beam.plot([], [], color=ink, linewidth=1.4, gid="load:stems", clip_on=True)[0]
        self.heads = ax_beam.plot([], [], "v", color=ink, markersize=6, gid="load:heads")[0]
        self.idle = ax_beam.plot([], [], color=muted, linewidth=1.2, gid="load:not-counted")[0]
        self.idle_heads = ax_beam.plot([], [], "v", color=muted, markersize=6, gid="load:not-counted-heads")[0]
        self.band = PolyCollection([], facecolor="none", edgecolor=ink, hatch="||", linewidth=0.8,
                                   gid="load:patches")
        ax_beam.add_collection(self.band)
        self.drops = ax_line.plot([], [], color=ink, linewidth=1.0, gid="load:ordinates")[0]
        self.dots = ax_line.plot([], [], "o", color=ink, markersize=4.5, markerfacecolor="white",
                                 gid="load:dots", zorder=6)[0]
        self.area = PolyCollection([], facecolor="none", edgecolor=ink, hatch="..", linewidth=0.0, gid="load:area")
        ax_line.add_collection(self.area)

    @property
    def artists(self) -> list[Artist]:
        """Every artist, in drawing order."""
        return [self.band, self.stems, self.heads, self.idle, self.idle_heads, self.area, self.drops, self.dots]

    def update(self, loading: Loading, line: InfluenceLine | None) -> None:
        """Move the artists to ``loading``; without a ``line`` (an envelope is shown) only the beam part."""
        counted = [a for a in loading.axles if a.counted]
        idle = [a for a in loading.axles if not a.counted]
        heaviest = max((a.load for a in loading.axles), default=1.0)
        base = ARROW_BASE

        def stems(axles: list[Axle]) -> tuple[list[float], list[float]]:
            return _segments([(a.x, base, a.x, arrow_tip(a.load, heaviest)) for a in axles])

        self.stems.set_data(*stems(counted))
        self.heads.set_data([a.x for a in counted], [base + 0.02] * len(counted))
        self.idle.set_data(*stems(idle))
        self.idle_heads.set_data([a.x for a in idle], [base + 0.02] * len(idle))
        top = PATCH_TOP
        self.band.set_verts([[(s, base), (e, base), (e, top), (s, top)] for s, e, _ in loading.patches])
        if line is None:
            self.drops.set_data([], [])
            self.dots.set_data([], [])
            self.area.set_verts([])
            return
        self.drops.set_data(*_segments([(a.x, 0.0, a.x, a.ordinate) for a in counted]))
        self.dots.set_data([a.x for a in counted], [a.ordinate for a in counted])
        self.area.set_verts([_area(line, s, e) for s, e, _ in loading.patches])


def _segments(rows: Sequence[tuple[float, float, float, float]]) -> tuple[list[float], list[float]]:
    """Vertical or sloping segments as one polyline broken by NaN."""
    xs: list[float] = []
    ys: list[float] = []
    for x0, y0, x1, y1 in rows:
        xs += [x0, x1, np.nan]
        ys += [y0, y1, np.nan]
    return xs, ys


def _area(line: InfluenceLine, start: float, end: float) -> list[tuple[float, float]]:
    """Outline of the area under ``line`` from ``start`` to ``end`` (for a loaded stretch).

    Both one-sided values are taken at a jump inside the stretch, so the
    outline follows the line up and down the jump.
    """
    a, b = max(start, 0.0), min(end, line.length)
    if b <= a:
        return []
    cuts = [a, *(x for x in line.breakpoints if a < x < b), b]
    points: list[tuple[float, float]] = [(a, 0.0)]
    for p, q in zip(cuts[:-1], cuts[1:]):
        inner = np.linspace(p, q, 12)[1:-1]
        points.append((p, float(line.right(p))))
        points += zip(inner.tolist(), np.asarray(line(inner), dtype=float).tolist())
        points.append((q, float(line.left(q))))
    return [*points, (b, 0.0)]
