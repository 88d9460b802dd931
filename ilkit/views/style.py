"""ilkit's figure style: one print-quality look for every drawing.

Ink is near-black on white; the two signs of an influence line differ in
both tone and hatching (positive: cool grey with rising hatches, negative:
warm grey with falling hatches), so a figure reads the same when printed in black and
white.  Text is DejaVu Sans (shipped with matplotlib, so figures render the
same everywhere); SVG output keeps text as text and uses a fixed id salt, so
the same figure gives the same file.

The style is applied inside each drawing function (``with style.context():``)
and never changes matplotlib's global settings.  ``RC`` may be used directly:
``matplotlib.pyplot.style.use(ilkit.views.style.RC)``.
"""

from __future__ import annotations

import io
from collections.abc import Iterator
from contextlib import contextmanager
from types import ModuleType
from typing import TYPE_CHECKING, Any

from ilkit.errors import MissingDependencyError

if TYPE_CHECKING:  # pragma: no cover
    from matplotlib.axes import Axes
    from matplotlib.figure import Figure

__all__ = [
    "RC",
    "INK",
    "MUTED",
    "POSITIVE",
    "NEGATIVE",
    "context",
    "axes",
    "require_matplotlib",
    "figure_svg",
    "new_figure",
]

INK = "#1c1c1c"
"""Lines, symbols and text."""
MUTED = "#8c8c8c"
"""Reference lines: the undeformed beam axis, the released restraint, dimension lines."""
POSITIVE: dict[str, Any] = {"facecolor": "#c3ccd6", "edgecolor": "#3a4654", "hatch": "///", "linewidth": 0.0}
"""Fill of the positive parts of a line."""
NEGATIVE: dict[str, Any] = {"facecolor": "#e6dccd", "edgecolor": "#5a4c3a", "hatch": "\\\\\\", "linewidth": 0.0}
"""Fill of the negative parts of a line."""

RC: dict[str, Any] = {
    "font.family": "DejaVu Sans",
    "font.size": 8.5,
    "axes.titlesize": 9.5,
    "axes.titleweight": "bold",
    "axes.titlelocation": "left",
    "axes.labelsize": 8.5,
    "axes.linewidth": 0.7,
    "axes.edgecolor": INK,
    "axes.labelcolor": INK,
    "axes.facecolor": "white",
    "axes.spines.top": False,
    "axes.spines.right": False,
    "axes.grid": False,
    "text.color": INK,
    "xtick.color": INK,
    "ytick.color": INK,
    "xtick.direction": "out",
    "ytick.direction": "out",
    "xtick.major.size": 3.0,
    "ytick.major.size": 3.0,
    "xtick.labelsize": 7.5,
    "ytick.labelsize": 7.5,
    "lines.linewidth": 1.6,
    "lines.solid_capstyle": "round",
    "hatch.linewidth": 0.5,
    "figure.facecolor": "white",
    "figure.dpi": 100,
    "savefig.dpi": 200,
    "savefig.facecolor": "white",
    "svg.fonttype": "none",
    "svg.hashsalt": "ilkit",
    "legend.frameon": False,
}
"""matplotlib settings of the ilkit look."""

WIDTH = 7.0
"""Default figure width in inches (fits a portrait page with margins)."""


def require_matplotlib() -> ModuleType:
    """Import matplotlib, or raise :class:`ilkit.MissingDependencyError` naming the install."""
    try:
        import matplotlib
    except ImportError:
        raise MissingDependencyError(
            "drawing needs matplotlib, which is not installed; install it with: pip install ilkit[plot]"
        ) from None
    return matplotlib


@contextmanager
def context() -> Iterator[None]:
    """Apply :data:`RC` for the figures drawn inside the block only."""
    mpl = require_matplotlib()
    with mpl.rc_context(RC):
        yield


def new_figure(height: float, width: float = WIDTH) -> Figure:
    """A figure that is not registered with pyplot (no global state; for files and displays)."""
    require_matplotlib()
    from matplotlib.figure import Figure

    return Figure(figsize=(width, height), layout="constrained")


def axes(ax: Axes | None, height: float) -> Axes:
    """``ax`` itself, or new axes on a new pyplot figure (so it shows in a notebook)."""
    from ilkit.views._args import axes_or_none

    require_matplotlib()
    if axes_or_none(ax, what="drawing") is not None:
        return ax
    require_matplotlib()
    import matplotlib.pyplot as plt

    _, new_ax = plt.subplots(figsize=(WIDTH, height), layout="constrained")
    return new_ax


def figure_svg(fig: Figure) -> str:
    """The figure as SVG text, reproducible (no date, fixed ids)."""
    buffer = io.StringIO()
    with context():
        fig.savefig(buffer, format="svg", metadata={"Date": None, "Creator": None})
    return buffer.getvalue()
