"""Drawings of moving-load results: envelopes along the beam.

The numbers are the core's (:func:`ilkit.loads.envelope`); this module only
draws them: the largest and smallest bending moment or shear at every
section of the envelope (both faces at supports and releases, so jumps show
as vertical steps), or the largest and smallest reaction at every support.
"""

from __future__ import annotations

from typing import TYPE_CHECKING, Any, Literal

import numpy as np

from ilkit.errors import BeamInputError
from ilkit.views import style

if TYPE_CHECKING:  # pragma: no cover
    from matplotlib.axes import Axes

    from ilkit.loads.envelope import Envelope

__all__ = ["plot_envelope", "ENVELOPE_KINDS"]

ENVELOPE_KINDS: dict[str, tuple[str, str]] = {
    # kind: (column symbol, plain words)
    "moment": ("M", "bending moment"),
    "shear": ("V", "shear"),
    "reaction": ("R", "reaction"),
}


def plot_envelope(
    envelope: Envelope,
    kind: Literal["moment", "shear", "reaction"] = "moment",
    ax: Axes | None = None,
    *,
    title: str | None = None,
) -> Axes:
    """Plot the largest and smallest ``kind`` of an envelope along the beam; returns the axes.

    Moments and shears are drawn at the envelope's sections, the band between
    the two curves shaded; reactions as bars at the supports.  The vertical
    axis carries the unit of the envelope's columns (positive up: sagging
    moment, shear positive as in :mod:`ilkit.model`, reaction upward).
    """
    if kind not in ENVELOPE_KINDS:
        raise BeamInputError(
            f"plot_envelope: kind must be one of {', '.join(repr(k) for k in ENVELOPE_KINDS)}, got {kind!r}.",
            field="kind",
            value=kind,
        )
    symbol, words = ENVELOPE_KINDS[kind]
    table = envelope.reactions if kind == "reaction" else envelope.sections
    x_col = next(c for c in table.columns if c.startswith("x"))
    hi_col = next(c for c in table.columns if c.startswith(f"{symbol} max"))
    lo_col = next(c for c in table.columns if c.startswith(f"{symbol} min") and not c.endswith("case"))
    unit = hi_col[hi_col.find("[") + 1 : hi_col.find("]")] if "[" in hi_col else ""
    with style.context():
        if ax is None:
            import matplotlib.pyplot as plt

            _, ax = plt.subplots(figsize=(7.0, 2.6), layout="constrained")
        xs = table[x_col].to_numpy(dtype=float)
        hi = table[hi_col].to_numpy(dtype=float)
        lo = table[lo_col].to_numpy(dtype=float)
        ax.axhline(0.0, color=style.MUTED, linewidth=0.7, zorder=2, gid="axis")
        if kind == "reaction":
            for x, a, b in zip(xs, lo, hi):
                ax.plot([x, x], [a, b], color=style.INK, linewidth=4, solid_capstyle="butt", gid=f"reaction:{x:g}")
        else:
            order = np.lexsort((_face_order(table), xs))
            xs, hi, lo = xs[order], hi[order], lo[order]
            ax.fill_between(xs, lo, hi, facecolor="#dfe3e8", edgecolor="none", zorder=1, gid="band")
            ax.plot(xs, hi, color=style.INK, linewidth=1.6, gid="largest")
            ax.plot(xs, lo, color=style.INK, linewidth=1.0, linestyle=(0, (5, 2)), gid="smallest")
        length_unit = x_col[x_col.find("[") + 1 : x_col.find("]")] if "[" in x_col else ""
        ax.set_xlabel(f"section x [{length_unit}]" if length_unit else "section x")
        ax.set_ylabel(f"{symbol} [{unit}]" if unit else symbol)
        ax.set_title(title if title is not None else f"Envelope of {words}: {envelope.model}")
        return ax


def _face_order(table: Any) -> np.ndarray:
    """Left face before right face at a section that has both (0 left, 1 no side, 2 right)."""
    if "side" not in table.columns:
        return np.ones(len(table))
    return table["side"].map({"left": 0, "right": 2}).fillna(1).to_numpy(dtype=float)
