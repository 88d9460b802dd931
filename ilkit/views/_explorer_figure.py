"""The explorer's figure: the beam above, the influence line (or an envelope) below,
and the travelling load drawn on both (internal).

The beam and the line come from the drawing functions of the views layer,
the load from :class:`ilkit.views.loaddraw.LoadArtists` (the same drawing as
the placement plots); this module only arranges them and keeps the load's
artists up to date in place (see :class:`ilkit.views.livefigure.LiveFigure`).
"""

from __future__ import annotations

from typing import TYPE_CHECKING, Any

from ilkit.views import style
from ilkit.views.draw import draw_beam
from ilkit.views.livefigure import Backend, LiveFigure
from ilkit.views.loaddraw import Axle, LoadArtists, Loading
from ilkit.views.moving import plot_envelope
from ilkit.views.plot import plot_line

if TYPE_CHECKING:  # pragma: no cover
    from ilkit.influence import InfluenceLine
    from ilkit.model import Beam

__all__ = ["Axle", "Loading", "ExplorerFigure"]


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
        self._load = LoadArtists(self.ax_beam, self.ax_line)
        self._moving = self._load.artists
        self.live.animate(*self._moving)
        self._load.update(self._loading, self._line)

    # ----------------------------------------------------------------- the load
    def set_loading(self, loading: Loading) -> None:
        """Move the drawn load (call :meth:`refresh` to show it)."""
        self._loading = loading
        if self._moving:
            self._load.update(loading, self._line)

    # ------------------------------------------------------------------ showing
    def draw(self) -> None:
        """Full draw (after the background changed)."""
        with style.context():
            self.live.draw()

    def refresh(self) -> None:
        """Redraw the moving load only."""
        self.live.refresh()

