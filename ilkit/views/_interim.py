"""Stand-ins for the views layer's drawing functions until that work is merged (internal, temporary)."""

from __future__ import annotations

from contextlib import contextmanager
from typing import Any

INK = "#1c1c1c"
MUTED = "#8c8c8c"


@contextmanager
def context():
    yield


def draw_beam(beam: Any, ax: Any) -> Any:
    L = float(beam.length)
    ax.plot([0, L], [0, 0], color=INK, linewidth=2.6)
    ax.plot([float(s.at) for s in beam.supports], [-0.15] * len(beam.supports), "^", color=INK, markersize=9)
    ax.plot([float(h) for h in beam.hinges], [0] * len(beam.hinges), "o", color=INK, mfc="white")
    ax.set_ylim(-1.4, 0.6)
    ax.set_axis_off()
    return ax


def plot_line(line: Any, ax: Any, title: str = "") -> Any:
    xs, ys = line.sample()
    ax.axhline(0.0, color=MUTED, linewidth=0.7)
    ax.fill_between(xs, ys, 0, where=ys >= 0, interpolate=True, facecolor="#c3ccd6", hatch="///", linewidth=0)
    ax.fill_between(xs, ys, 0, where=ys <= 0, interpolate=True, facecolor="#e6dccd", hatch="\\\\\\", linewidth=0)
    ax.plot(xs, ys, color=INK, linewidth=1.8)
    for x, a, b in line.knot_values():
        if a or b:
            ax.annotate(f"{b if b else a:.4g}", (x, b if b else a), fontsize=7.5)
    ax.set_title(title, loc="left", fontsize=9.5)
    return ax
