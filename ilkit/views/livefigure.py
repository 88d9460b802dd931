"""A matplotlib figure shown live inside a notebook widget, updated in place.

Why this exists: an explorer redraws its figure on every slider step, and a
full matplotlib draw of a hatched influence line takes longer than a step may.
The figure is split into a *background* (everything that changes only when
the quantity or the load changes) and *animated* artists (the load's axles,
the ordinates under them).  A full draw caches the background as pixels; a
step restores those pixels and draws only the animated artists on top
(blitting), which takes a fraction of a millisecond.

Two ways to show the figure, chosen from matplotlib's current backend:

* ``"ipympl"`` (``%matplotlib widget``): the figure lives in an ipympl canvas
  widget; a step blits and ipympl sends only the changed pixels.
* ``"inline"`` (any other backend): the figure is drawn by Agg and shown as a
  PNG in an :class:`ipywidgets.Output` whose ``outputs`` are replaced in one
  assignment, so the page never shows an empty or a stacked figure (the
  common ``clear_output(); plt.show()`` pattern flickers, and under nbval it
  leaks the figure into the cell's own outputs).

Neither figure is registered with pyplot: ``plt.show()`` and the inline
backend's end-of-cell display never show it a second time.

:class:`Coalescer` runs an expensive callback once for a burst of requests:
slider events that arrive while a draw is pending are folded into one draw.
"""

from __future__ import annotations

import asyncio
import base64
import io
from collections.abc import Callable
from typing import TYPE_CHECKING, Any, Literal

from ilkit.errors import BeamInputError, MissingDependencyError

if TYPE_CHECKING:  # pragma: no cover
    from matplotlib.artist import Artist
    from matplotlib.figure import Figure

__all__ = ["LiveFigure", "Coalescer", "Backend", "current_backend"]

Backend = Literal["inline", "ipympl"]
BACKENDS: tuple[str, ...] = ("inline", "ipympl")
_IPYMPL_NAMES = ("widget", "ipympl", "module://ipympl.backend_nbagg")


def current_backend() -> Backend:
    """``"ipympl"`` when matplotlib's backend is ipympl (``%matplotlib widget``), else ``"inline"``."""
    import matplotlib

    name = str(matplotlib.get_backend()).lower()
    return "ipympl" if name in _IPYMPL_NAMES else "inline"


def _require(module: str) -> Any:
    import importlib

    try:
        return importlib.import_module(module)
    except ImportError as err:
        raise MissingDependencyError(
            f"the explorer needs {module.split('.')[0]} ({err.name} is missing); "
            "run: pip install 'ilkit[notebook]'"
        ) from err


class LiveFigure:
    """A figure with a cached background and animated artists, shown in a widget.

    Parameters
    ----------
    size:
        Figure size in inches ``(width, height)``.
    dpi:
        Pixels per inch of the drawn image.
    backend:
        ``"inline"`` or ``"ipympl"``; ``None`` follows matplotlib's current
        backend (see :func:`current_backend`).  Asking for ``"ipympl"``
        imports ipympl, which makes it matplotlib's backend (as
        ``%matplotlib widget`` does).

    Use: draw the background on :attr:`figure`, register the artists that move
    with :meth:`animate`, then call :meth:`draw` after a background change and
    :meth:`refresh` after moving animated artists.  :attr:`widget` is the
    widget to put in a layout.
    """

    def __init__(
        self, size: tuple[float, float] = (8.6, 4.8), *, dpi: float = 100, backend: Backend | None = None
    ) -> None:
        if backend is None:
            backend = current_backend()
        if backend not in BACKENDS:
            raise BeamInputError(
                f"backend: unknown figure backend {backend!r}; choose one of "
                f"{', '.join(repr(b) for b in BACKENDS)} (or None to follow matplotlib).",
                field="backend",
                value=backend,
            )
        _require("matplotlib")
        widgets = _require("ipywidgets")
        from matplotlib.figure import Figure

        self.backend: Backend = backend
        self.figure: Figure = Figure(figsize=size, dpi=dpi)
        if backend == "ipympl":
            nbagg = _require("ipympl.backend_nbagg")
            canvas = nbagg.Canvas(self.figure)
            self._manager = nbagg.FigureManager(canvas, num=0)
            canvas.header_visible = False
            canvas.footer_visible = False
            canvas.toolbar_visible = False
            canvas.resizable = False
            canvas.capture_scroll = False
            canvas._size = tuple(self.figure.bbox.size)  # as ipympl's own display would set it
            self.widget: Any = canvas
        else:
            from matplotlib.backends.backend_agg import FigureCanvasAgg

            FigureCanvasAgg(self.figure)
            self.widget = widgets.Output()
        self._animated: list[Artist] = []
        self._background: Any = None
        self._png: bytes = b""
        self.figure.canvas.mpl_connect("draw_event", self._on_draw)

    # ------------------------------------------------------------------ artists
    def animate(self, *artists: Artist) -> None:
        """Mark artists as moving: they are left out of the cached background and blitted on top."""
        for artist in artists:
            artist.set_animated(True)
            self._animated.append(artist)

    def forget(self, *artists: Artist) -> None:
        """Stop tracking animated artists (call before removing them from the figure)."""
        for artist in artists:
            if artist in self._animated:
                self._animated.remove(artist)

    def _on_draw(self, event: Any) -> None:
        # every full draw (ours, or one the browser asks ipympl for) re-caches the
        # background and puts the animated artists back on top of it
        canvas = self.figure.canvas
        self._background = canvas.copy_from_bbox(self.figure.bbox)
        self._draw_animated()

    def _draw_animated(self) -> None:
        for artist in self._animated:
            if artist.get_visible() and artist.axes is not None:
                artist.axes.draw_artist(artist)
            elif artist.get_visible():
                self.figure.draw_artist(artist)

    # ----------------------------------------------------------------- drawing
    def draw(self) -> None:
        """Full draw after the background changed, then show it."""
        self.figure.canvas.draw()  # ipympl: also sends the image to the browser
        if self.backend == "inline":
            self._publish()
        else:
            self._fix_still()

    def refresh(self) -> None:
        """Redraw only the animated artists on the cached background, then show it."""
        if self._background is None:
            self.draw()
            return
        canvas = self.figure.canvas
        canvas.restore_region(self._background)
        self._draw_animated()
        if self.backend == "ipympl":
            canvas.blit(self.figure.bbox)  # ipympl sends the changed pixels only
            self._fix_still()
        else:
            self._publish()

    def _fix_still(self) -> None:
        # Until a browser shows the canvas, ipympl keeps a still of each frame in the
        # widget's ``_data_url`` for pages without a kernel, but stores it without the
        # ``data:`` prefix (its own display adds it); a browser that reads it then fails
        # to draw the canvas at all.
        canvas = self.widget
        url = canvas._data_url
        if getattr(canvas, "syncing_data_url", False) and isinstance(url, str) and not url.startswith("data:"):
            canvas._data_url = "data:image/png;base64," + url

    def png(self) -> bytes:
        """The figure as it is drawn now, as PNG bytes."""
        if self.backend == "inline" and self._png:
            return self._png
        if self._background is None:
            self.figure.canvas.draw()
        return _encode_png(self.figure.canvas)

    def _publish(self) -> None:
        self._png = _encode_png(self.figure.canvas)
        # one assignment replaces the shown image: no empty frame, no stacked figures
        self.widget.outputs = (
            {
                "output_type": "display_data",
                "data": {"image/png": base64.b64encode(self._png).decode("ascii"), "text/plain": "<explorer figure>"},
                "metadata": {},
            },
        )

    def close(self) -> None:
        """Release the figure (and the ipympl canvas widget)."""
        if self.backend == "ipympl":
            self.widget.close()
        self._animated.clear()
        self._background = None


def _encode_png(canvas: Any) -> bytes:
    """PNG of the canvas's pixels; fast compression (the image is redrawn on every step)."""
    import numpy as np
    from PIL import Image

    pixels = np.asarray(canvas.buffer_rgba())
    with io.BytesIO() as out:
        Image.fromarray(pixels[..., :3]).save(out, format="png", compress_level=1)
        return out.getvalue()


class Coalescer:
    """Runs ``callback`` once for a burst of :meth:`request` calls.

    In a Jupyter kernel the callback is scheduled on the kernel's event loop
    ``delay`` seconds after the first request of a burst; requests that arrive
    before it runs (slider events queued behind a draw) add nothing.  Outside
    a kernel (scripts, headless tests, benchmarks) it runs at once.
    :meth:`flush` runs a pending callback now.
    """

    def __init__(self, callback: Callable[[], None], delay: float = 0.02) -> None:
        self._callback = callback
        self._delay = delay
        self._handle: asyncio.TimerHandle | None = None
        self.runs = 0
        """How many times the callback has run (for tests and benchmarks)."""

    @property
    def pending(self) -> bool:
        """True while a run is scheduled and has not happened yet."""
        return self._handle is not None

    def request(self) -> None:
        """Ask for a run; coalesced with the requests before it that have not run yet."""
        if self._handle is not None:
            return
        loop = _kernel_loop()
        if loop is None:
            self._run()
            return
        self._handle = loop.call_later(self._delay, self._run)

    def flush(self) -> None:
        """Run a pending callback now."""
        if self._handle is not None:
            self._handle.cancel()
            self._run()

    def _run(self) -> None:
        self._handle = None
        self.runs += 1
        self._callback()


def _kernel_loop() -> asyncio.AbstractEventLoop | None:
    """The running event loop when this runs in a Jupyter kernel, else ``None``.

    Other running loops (a test's, or the one Playwright's synchronous API keeps)
    do not count: nothing guarantees that they will get to run a scheduled draw.
    """
    import sys

    ipython = sys.modules.get("IPython")
    shell = ipython.get_ipython() if ipython is not None else None
    if getattr(shell, "kernel", None) is None:
        return None
    try:
        return asyncio.get_running_loop()
    except RuntimeError:
        return None
