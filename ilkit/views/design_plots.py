"""Drawings of design results: permanent-load diagrams and the live-load deflection check.

The numbers are the core's (:func:`ilkit.design.permanent_effects`, :func:`ilkit.design.deflection_check`);
this module only draws them:

* :func:`plot_permanent_effects`: the moment, shear or deflection diagram of each load category and
  their sum along the beam (both faces at supports and releases, so jumps show as steps), or the
  reactions of each category at the supports;
* :func:`plot_deflection_check`: the largest downward and upward live-load deflection along the
  beam with the allowed deflection of every span and overhang, and the largest of each marked.
"""

from __future__ import annotations

from typing import TYPE_CHECKING, Literal

import numpy as np

from ilkit.design.deflection import DeflectionCheck
from ilkit.design.permanent import PermanentEffects
from ilkit.views import style
from ilkit.views.numbers import short

if TYPE_CHECKING:  # pragma: no cover
    from matplotlib.axes import Axes

__all__ = ["plot_permanent_effects", "plot_deflection_check", "PERMANENT_KINDS"]

PERMANENT_KINDS: dict[str, tuple[str, str]] = {
    # quantity: (symbol, words)
    "moment": ("M", "bending moment"),
    "shear": ("V", "shear"),
    "reaction": ("R", "reaction"),
    "deflection": ("δ", "deflection"),
}
_DASHES = ["-", (0, (5, 2)), (0, (1, 1.5)), (0, (6, 2, 1, 2)), (0, (3, 1))]
_MARKERS = ["o", "^", "v", "D", "x", "+"]
_FACE = {"left": 0, "": 1, "right": 2}


def _unit(effects: PermanentEffects, kind: str) -> str:
    u = effects.units
    if u is None:
        return ""
    return {"moment": u.moment, "shear": u.force, "reaction": u.force, "deflection": u.length}[kind]


def plot_permanent_effects(
    effects: PermanentEffects,
    kind: Literal["moment", "shear", "reaction", "deflection"] = "moment",
    ax: Axes | None = None,
    *,
    title: str | None = None,
) -> Axes:
    """Draw the ``kind`` of each load category and their total along the beam; returns the axes.

    Moments, shears and deflections as diagrams through the sections (both
    faces at supports and releases), reactions as markers at the supports.
    Values in the beam's units, positive up on the drawing: sagging moment,
    shear positive when the part left of the section is pushed up, upward
    reaction, downward deflection (:mod:`ilkit.model`).
    """
    from ilkit._check import choice
    from ilkit.views._args import expect

    expect(effects, PermanentEffects, what="plot_permanent_effects",
           hint="give the result of ilkit.design.permanent_effects(...)")
    choice(kind, effects.quantities, what="plot_permanent_effects: kind", field="kind")
    symbol, words = PERMANENT_KINDS[kind]
    table = effects.by_category()
    rows = table[table["quantity"] == kind]
    order = np.lexsort((rows["side"].map(_FACE).to_numpy(), rows["x"].to_numpy()))
    rows = rows.iloc[order]
    xs = rows["x"].to_numpy(dtype=float)
    with style.context():
        ax = style.axes(ax, 2.6)
        ax.axhline(0.0, color=style.MUTED, linewidth=0.7, zorder=2, gid="axis")
        total = np.zeros(len(rows))
        categories = list(effects.categories)
        for k, category in enumerate(categories):
            values = rows[category].to_numpy(dtype=float)
            total += values
            if len(categories) == 1:
                continue
            style_args = {"linestyle": _DASHES[(k + 1) % len(_DASHES)], "linewidth": 1.0, "color": style.MUTED}
            if kind == "reaction":
                ax.plot(xs, values, _MARKERS[k % len(_MARKERS)], markersize=3.5, color=style.MUTED,
                        gid=f"category:{category}", label=category)
            else:
                ax.plot(xs, values, gid=f"category:{category}", label=category, **style_args)  # type: ignore[arg-type]
        label = "total" if len(categories) > 1 else categories[0]
        if kind == "reaction":
            ax.plot(xs, total, "s", markersize=4.5, color=style.INK, gid="total", label=label)
            for x, value in zip(xs, total):
                ax.annotate(short(value), xy=(x, value), xytext=(0, 4), textcoords="offset points", ha="center",
                            va="bottom", fontsize=7, gid=f"total-value:{x:g}", annotation_clip=False)
            ax.margins(y=0.2)
        else:
            ax.plot(xs, total, color=style.INK, linewidth=1.6, gid="total", label=label)
            if kind == "deflection":
                ax.invert_yaxis()  # downward deflection drawn downward
        if len(categories) > 1:
            ax.legend(fontsize=7, frameon=False)
        u = effects.units
        ax.set_xlabel(f"section x [{u.length}]" if u else "section x")
        unit = _unit(effects, kind)
        ax.set_ylabel(f"{symbol} [{unit}]" if unit else symbol)
        ax.set_title(title if title is not None else f"Permanent loads: {words}")
    return ax


def plot_deflection_check(check: DeflectionCheck, ax: Axes | None = None, *, title: str | None = None) -> Axes:
    """Draw the live-load deflection envelope with the allowed deflection of every span; returns the axes.

    Deflections downward positive, drawn downward, in the beam's length unit,
    times the girder's share; the allowed deflection ``±length/limit`` of each
    span and overhang as dashed lines, the largest deflection of each marked.
    """
    from ilkit.views._args import expect

    expect(check, DeflectionCheck, what="plot_deflection_check",
           hint="give the result of ilkit.design.deflection_check(...)")
    env = check.envelope
    x_col = next(c for c in env.columns if c.startswith("x"))
    hi_col = next(c for c in env.columns if c.startswith("max ["))
    lo_col = next(c for c in env.columns if c.startswith("min ["))
    spans = check.spans
    unit = hi_col[hi_col.find("[") + 1 : hi_col.find("]")]
    col = {name: next(c for c in spans.columns if c.startswith(name)) for name in
           ("from", "to", "allowed", "deflection", "at")}
    with style.context():
        ax = style.axes(ax, 2.6)
        order = np.lexsort((env["side"].map(_FACE).to_numpy(), env[x_col].to_numpy()))
        xs = env[x_col].to_numpy(dtype=float)[order]
        ax.axhline(0.0, color=style.MUTED, linewidth=0.7, zorder=2, gid="axis")
        ax.fill_between(xs, env[lo_col].to_numpy(dtype=float)[order], env[hi_col].to_numpy(dtype=float)[order],
                        facecolor="#dfe3e8", edgecolor="none", zorder=1, gid="band")
        ax.plot(xs, env[hi_col].to_numpy(dtype=float)[order], color=style.INK, linewidth=1.6, gid="largest")
        ax.plot(xs, env[lo_col].to_numpy(dtype=float)[order], color=style.INK, linewidth=1.0,
                linestyle=(0, (5, 2)), gid="smallest")
        for _, row in spans.iterrows():
            a, b, allowed = row[col["from"]], row[col["to"]], row[col["allowed"]]
            for sign in (1, -1):
                ax.plot([a, b], [sign * allowed, sign * allowed], color=style.MUTED, linewidth=0.9,
                        linestyle=(0, (2, 2)), gid=f"allowed:{row['span']}:{'down' if sign > 0 else 'up'}")
            value, at = row[col["deflection"]], row[col["at"]]
            ax.plot([at], [value], "o", color=style.INK, markersize=4, gid=f"largest:{row['span']}")
            down = value >= 0  # drawn downward: the words below the marker, else above it
            ax.annotate(f"{short(value)} ({row['limit']}: {short(allowed)})", xy=(at, value),
                        xytext=(0, -6 if down else 6), textcoords="offset points", ha="center",
                        va="top" if down else "bottom", fontsize=7, gid=f"largest-words:{row['span']}",
                        annotation_clip=False)
        ax.invert_yaxis()  # downward deflection drawn downward
        ax.margins(y=0.2)
        length_unit = x_col[x_col.find("[") + 1 : x_col.find("]")] if "[" in x_col else ""
        ax.set_xlabel(f"section x [{length_unit}]")
        ax.set_ylabel(f"δ [{unit}]")
        ax.set_title(title if title is not None else f"Live-load deflection: {check.load_model.name}, share "
                     f"{short(check.share, 4)}")
    return ax
