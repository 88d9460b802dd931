"""The explorer's figure: the beam above, the influence line (or an envelope) below,
and the travelling load drawn on both (internal).

The beam and the line come from the drawing functions of the views layer;
this module only arranges them and keeps the few artists that move with the
load (axle arrows on the beam, ordinates under the axles on the line, loaded
patches) up to date in place (see :class:`ilkit.views.livefigure.LiveFigure`).
"""

from __future__ import annotations

from collections.abc import Sequence
from dataclasses import dataclass
from typing import TYPE_CHECKING, Any

import numpy as np

from ilkit.views import style
from ilkit.views.draw import draw_beam
from ilkit.views.livefigure import Backend, LiveFigure
from ilkit.views.moving import plot_envelope
from ilkit.views.plot import plot_line

if TYPE_CHECKING:  # pragma: no cover
    from ilkit.influence import InfluenceLine
    from ilkit.model import Beam

__all__ = ["Axle", "Loading", "ExplorerFigure"]

ARROW_TOP = 0.55
"""Height of the axle arrows above the beam axis (the beam diagram's data units)."""


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


class ExplorerFigure:
    """Beam diagram and influence line (or envelope), with the load drawn in place."""

    def __init__(self, beam: Beam, *, backend: Backend | None = None, size: tuple[float, float] = (8.6, 4.9)):
        self.beam = beam
        self.live = LiveFigure(size, backend=backend)
        fig = self.live.figure
        with style.context():
            self.ax_beam, self.ax_line = fig.subplots(2, 1, height_ratios=[1.0, 2.4])
        fig.subplots_adjust(left=0.09, right=0.98, top=0.95, bottom=0.11, hspace=0.32)
        length = float(beam.length)
        self._xlim = (-0.05 * length, 1.05 * length)
        self._moving: list[Any] = []
        self._line: InfluenceLine | None = None
        self._loading = Loading()

    # -------------------------------------------------------------- background
    def show_line(self, line: InfluenceLine, *, title: str) -> None:
        """Draw the beam and ``line`` as the background (call :meth:`draw` to show it)."""
        self._line = line
        self._reset()
        with style.context():
            draw_beam(self.beam, ax=self.ax_beam)
            plot_line(line, ax=self.ax_line, title=title)
            self._mark_section(float(line.quantity.at))
            self._make_moving()

    def show_envelope(self, envelope: Any, kind: str, *, at: float) -> None:
        """Draw the beam and the envelope of ``kind`` as the background, the section marked."""
        self._line = None
        self._reset()
        with style.context():
            draw_beam(self.beam, ax=self.ax_beam)
            plot_envelope(envelope, kind, ax=self.ax_line)  # type: ignore[arg-type]
            self._mark_section(at)
            self._make_moving()

    def _reset(self) -> None:
        self.live.forget(*self._moving)
        self._moving = []
        self.ax_beam.clear()
        self.ax_line.clear()

    def _mark_section(self, at: float) -> None:
        self.ax_line.axvline(at, color=style.MUTED, linewidth=0.8, linestyle=(0, (4, 3)), zorder=0, gid="section")
        for ax in (self.ax_beam, self.ax_line):
            ax.set_xlim(*self._xlim)

    def _make_moving(self) -> None:
        from matplotlib.collections import PolyCollection

        ink, muted = style.INK, style.MUTED
        beam, line = self.ax_beam, self.ax_line
        self._stems = beam.plot([], [], color=ink, linewidth=1.4, gid="load:stems", clip_on=True)[0]
        self._heads = beam.plot([], [], "v", color=ink, markersize=6, gid="load:heads")[0]
        self._idle = beam.plot([], [], color=muted, linewidth=1.2, gid="load:not-counted")[0]
        self._idle_heads = beam.plot([], [], "v", color=muted, markersize=6, gid="load:not-counted-heads")[0]
        self._band = PolyCollection([], facecolor="none", edgecolor=ink, hatch="||", linewidth=0.8, gid="load:patches")
        beam.add_collection(self._band)
        self._drops = line.plot([], [], color=ink, linewidth=1.0, gid="load:ordinates")[0]
        self._dots = line.plot([], [], "o", color=ink, markersize=4.5, markerfacecolor="white", gid="load:dots",
                               zorder=6)[0]
        self._under = PolyCollection([], facecolor="none", edgecolor=ink, hatch="..", linewidth=0.0,
                                     gid="load:area")
        line.add_collection(self._under)
        self._moving = [self._band, self._stems, self._heads, self._idle, self._idle_heads, self._under,
                        self._drops, self._dots]
        self.live.animate(*self._moving)
        self._apply(self._loading)

    # ----------------------------------------------------------------- the load
    def set_loading(self, loading: Loading) -> None:
        """Move the drawn load (call :meth:`refresh` to show it)."""
        self._loading = loading
        if self._moving:
            self._apply(loading)

    def _apply(self, loading: Loading) -> None:
        counted = [a for a in loading.axles if a.counted]
        idle = [a for a in loading.axles if not a.counted]
        heaviest = max((a.load for a in loading.axles), default=1.0) or 1.0
        top = ARROW_TOP

        def tip(a: Axle) -> float:  # arrow length grows with the axle load
            return 0.2 + (top - 0.2) * a.load / heaviest

        self._stems.set_data(*_segments([(a.x, 0.08, a.x, tip(a)) for a in counted]))
        self._heads.set_data([a.x for a in counted], [0.1] * len(counted))
        self._idle.set_data(*_segments([(a.x, 0.08, a.x, tip(a)) for a in idle]))
        self._idle_heads.set_data([a.x for a in idle], [0.1] * len(idle))
        self._band.set_verts([[(s, 0.08), (e, 0.08), (e, top * 0.7), (s, top * 0.7)] for s, e, _ in loading.patches])
        if self._line is not None:
            self._drops.set_data(*_segments([(a.x, 0.0, a.x, a.ordinate) for a in counted]))
            self._dots.set_data([a.x for a in counted], [a.ordinate for a in counted])
            self._under.set_verts([_area(self._line, s, e) for s, e, _ in loading.patches])
        else:
            self._drops.set_data([], [])
            self._dots.set_data([], [])
            self._under.set_verts([])

    # ------------------------------------------------------------------ showing
    def draw(self) -> None:
        """Full draw (after the background changed)."""
        with style.context():
            self.live.draw()

    def refresh(self) -> None:
        """Redraw the moving load only."""
        self.live.refresh()


def _segments(rows: Sequence[tuple[float, float, float, float]]) -> tuple[list[float], list[float]]:
    """Vertical or sloping segments as one polyline broken by NaN."""
    xs: list[float] = []
    ys: list[float] = []
    for x0, y0, x1, y1 in rows:
        xs += [x0, x1, np.nan]
        ys += [y0, y1, np.nan]
    return xs, ys


def _area(line: InfluenceLine, start: float, end: float) -> list[tuple[float, float]]:
    """Outline of the area under ``line`` from ``start`` to ``end`` (for a loaded patch)."""
    a, b = max(start, 0.0), min(end, line.length)
    if b <= a:
        return []
    inner = [x for x in line.breakpoints if a < x < b]
    xs = np.array([a, *inner, b])
    xs = np.concatenate([np.linspace(p, q, 12) for p, q in zip(xs[:-1], xs[1:])])
    ys = np.asarray(line(xs), dtype=float)
    return [(a, 0.0), *zip(xs.tolist(), ys.tolist()), (b, 0.0)]

