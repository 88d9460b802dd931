"""Views of trusses: the truss drawing, member forces, Müller-Breslau sketches, tables and displays.

* :func:`draw_truss`: joints, members, supports and the deck (the panel
  points where the floor beams stand), with joint names and the panel
  lengths.
* :func:`plot_member_forces`: the members drawn by their force, in a style
  readable in black and white: a member in **tension** as a solid bar, one in
  **compression** as a hollow bar (an outline), the weight of the bar growing
  with the size of the force, a member without force dotted; every force
  written beside its member.  Takes a :class:`~ilkit.trusses.MemberEnvelope`
  (its largest or smallest forces) or a mapping ``{member: force}`` with the
  truss.
* Müller-Breslau sketch of a truss's line (``ilkit.views.sketch(line)``): the
  truss moved by a unit shortening of the member (or a unit upward movement
  of the support), exaggerated to be seen, over its outline, and below it the
  deck's movement, which is the influence line, with its ordinates at the
  panel points.
* ``views.table(truss)``: one row per member (joints, role, length, ``EA``);
  ``views.table(envelope)``: the member table (largest tension, largest
  compression, governing cases) for every member.

Artist gids: ``"member:<name>"``, ``"joint:<name>"``, ``"support:<kind>:<x>"``,
``"deck"``, ``"tension:<name>"``, ``"compression:<name>"``, ``"no-force:<name>"``,
``"force:<name>"`` (the written value), ``"moved:<name>"`` (a member in the
sketch), ``"shortened"`` (the member given the unit shortening).
"""

from __future__ import annotations

import html
from collections.abc import Mapping
from typing import TYPE_CHECKING, Any, Literal

from ilkit._exact import fmt
from ilkit.errors import LoadInputError
from ilkit.trusses.envelope import MemberEnvelope
from ilkit.trusses.lines import TrussLine
from ilkit.trusses.model import Truss
from ilkit.views import _doc, style
from ilkit.views._args import expect
from ilkit.views.display import _CSS, figure_html, mimebundle
from ilkit.views.numbers import clean, short
from ilkit.views.report import report_section
from ilkit.views.tables import table

if TYPE_CHECKING:  # pragma: no cover
    import pandas as pd
    from matplotlib.axes import Axes

    from ilkit.influence import InfluenceLine

__all__ = ["draw_truss", "plot_member_forces", "draw_member_forces", "truss_sketch", "truss_facts",
           "member_table", "envelope_blocks", "truss_figure"]

NO_CASE = "—"


def _xy(truss: Truss, joint: str) -> tuple[float, float]:
    x, y = truss.joints[joint]
    return float(x - truss.origin), float(y)


def _frame(ax: Axes, truss: Truss, pad_below: float = 0.22) -> None:
    xs = [_xy(truss, j)[0] for j in truss.joints]
    ys = [_xy(truss, j)[1] for j in truss.joints]
    w, h = max(xs) - min(xs), max(ys) - min(ys)
    room = max(w * 0.25, h)
    ax.set_aspect("equal", adjustable="datalim")  # drawn to scale: the limits follow the data and this room
    ax.update_datalim([(min(xs) - 0.04 * w, min(ys) - pad_below * room), (max(xs) + 0.04 * w, max(ys) + 0.12 * room)])
    ax.autoscale_view()
    ax.set_axis_off()


def _supports(ax: Axes, truss: Truss, color: str = style.INK) -> None:
    from ilkit.views.draw import draw_support

    for joint, kind in truss.supports.items():
        x, y = _xy(truss, joint)
        draw_support(ax, x, kind, y=y, color=color)  # type: ignore[arg-type]


def _deck(ax: Axes, truss: Truss) -> None:
    pts = [_xy(truss, j) for j in truss.deck]
    ax.plot([p[0] for p in pts], [p[1] for p in pts], color="#d9d9d9", linewidth=7, solid_capstyle="butt",
            zorder=1, gid="deck")


def draw_truss(truss: Truss, ax: Axes | None = None, *, names: bool = True, dimensions: bool = True,
               title: str | None = None) -> Axes:
    """Draw the truss: members, joints (named), supports, the deck (a grey band along the panel points) and
    the panel lengths; returns the axes.  Coordinates are the deck coordinate ``x`` and the height ``y``
    (length unit), drawn to scale."""
    expect(truss, Truss, what="draw_truss", hint="give an ilkit.trusses.Truss")
    with style.context():
        ax = style.axes(ax, 2.4)
        _deck(ax, truss)
        for name, (a, b) in truss.members.items():
            (xa, ya), (xb, yb) = _xy(truss, a), _xy(truss, b)
            ax.plot([xa, xb], [ya, yb], color=style.INK, linewidth=1.4, zorder=3, gid=f"member:{name}",
                    solid_capstyle="round")
        _joints(ax, truss, names)
        _supports(ax, truss)
        if dimensions:
            from ilkit.views.draw import draw_dimensions

            dims = draw_dimensions(ax, list(truss.panel_points), unit=truss.units.length if truss.units else "",
                                   offset=-26.0)
            low = min(_xy(truss, j)[1] for j in truss.joints)
            for artist in dims:  # below the lowest joint, not below the deck
                if hasattr(artist, "xy"):
                    artist.xy = (artist.xy[0], low)
                elif hasattr(artist, "get_ydata"):
                    artist.set_ydata([low] * len(artist.get_ydata()))
        _frame(ax, truss)
        if title is not None:
            ax.set_title(title)
        return ax


def _joints(ax: Axes, truss: Truss, names: bool, moved: Mapping[str, tuple[float, float]] | None = None) -> None:
    top = max(_xy(truss, j)[1] for j in truss.joints)
    for joint in truss.joints:
        x, y = moved[joint] if moved is not None else _xy(truss, joint)
        ax.plot([x], [y], marker="o", markersize=3.6, markerfacecolor="white", markeredgecolor=style.INK,
                markeredgewidth=0.9, linestyle="none", zorder=5, gid=f"joint:{joint}")
        if names:
            above = _xy(truss, joint)[1] >= top or joint not in truss.deck
            ax.annotate(joint, (x, y), xytext=(0, 5 if above else -6), textcoords="offset points", ha="center",
                        va="bottom" if above else "top", fontsize=6.5, color=style.INK, zorder=6,
                        gid=f"joint-name:{joint}")


# ----------------------------------------------------------------- member forces
def draw_member_forces(ax: Axes, truss: Truss, forces: Mapping[str, float], *, unit: str = "",
                       labels: bool = True) -> dict[str, list[Any]]:
    """Draw ``forces`` ``{member: N}`` on the truss: tension solid, compression hollow, none dotted; the weight
    grows with ``|N|``.  Returns the artists by member."""
    from matplotlib.patheffects import Stroke

    from ilkit.views.plot import LABEL_BOX

    values = {m: float(forces.get(m, 0.0)) for m in truss.members}
    scale = max((abs(v) for v in values.values()), default=0.0)
    out: dict[str, list[Any]] = {}
    for name, (a, b) in truss.members.items():
        (xa, ya), (xb, yb) = _xy(truss, a), _xy(truss, b)
        n = clean(values[name], scale) if scale else 0.0
        weight = 1.2 + 4.2 * abs(n) / scale if scale else 1.2
        if n > 0:
            artists = ax.plot([xa, xb], [ya, yb], color=style.INK, linewidth=weight, solid_capstyle="butt",
                              zorder=3, gid=f"tension:{name}")
        elif n < 0:
            outer = weight + 1.6
            (line,) = ax.plot([xa, xb], [ya, yb], color="white", linewidth=outer - 1.6, solid_capstyle="butt",
                              zorder=3, gid=f"compression:{name}")
            line.set_path_effects([Stroke(linewidth=outer, foreground=style.INK), Stroke(linewidth=outer - 1.6,
                                                                                          foreground="white")])
            artists = [line]
        else:
            artists = ax.plot([xa, xb], [ya, yb], color=style.MUTED, linewidth=0.8, linestyle=(0, (1, 2)),
                              zorder=2, gid=f"no-force:{name}")
        if labels and n:
            artists.append(ax.annotate(short(n, 3), ((xa + xb) / 2, (ya + yb) / 2), ha="center", va="center",
                                       fontsize=5.8, zorder=7, gid=f"force:{name}", bbox=LABEL_BOX))
        out[name] = artists
    return out


def _legend(ax: Axes, unit: str) -> None:
    from matplotlib.lines import Line2D
    from matplotlib.patheffects import Stroke

    tension = Line2D([], [], color=style.INK, linewidth=3.0)
    compression = Line2D([], [], color="white", linewidth=2.4)
    compression.set_path_effects([Stroke(linewidth=4.0, foreground=style.INK), Stroke(linewidth=2.4,
                                                                                       foreground="white")])
    none = Line2D([], [], color=style.MUTED, linewidth=0.8, linestyle=(0, (1, 2)))
    suffix = f" [{unit}]" if unit else ""
    ax.legend([tension, compression, none], [f"tension (solid){suffix}", f"compression (hollow){suffix}",
                                             "no force (dotted)"],
              loc="lower center", bbox_to_anchor=(0.5, -0.02), ncol=3, fontsize=7, frameon=False)


def plot_member_forces(
    result: MemberEnvelope | Mapping[str, float],
    ax: Axes | None = None,
    *,
    extreme: Literal["max", "min"] = "max",
    truss: Truss | None = None,
    title: str | None = None,
) -> Axes:
    """Draw member forces on the truss; returns the axes.

    ``result`` is a :class:`~ilkit.trusses.MemberEnvelope` (then ``extreme``
    ``"max"`` draws every member's largest force, the most tension, and
    ``"min"`` its smallest, the most compression) or a mapping
    ``{member: force}`` (then give ``truss``).  Forces in the truss's force
    unit, tension positive: tension drawn solid, compression hollow, the
    weight of a bar growing with its force, members without force dotted.
    """
    from ilkit._check import choice

    if isinstance(result, MemberEnvelope):
        choice(extreme, ("max", "min"), what="plot_member_forces: extreme", field="extreme", error=LoadInputError)
        truss = result.truss
        forces = result.forces(extreme)
        what = "largest forces (most tension)" if extreme == "max" else "smallest forces (most compression)"
        default = f"{result.model}: {what}"
    else:
        expect(truss, Truss, what="plot_member_forces: truss", hint="give the truss the forces belong to")
        if not isinstance(result, Mapping):
            raise LoadInputError(
                f"plot_member_forces: give a MemberEnvelope or a mapping {{member: force}}, got "
                f"{type(result).__name__}.",
                field="result",
                value=result,
            )
        assert truss is not None
        forces = dict(result)
        default = "Member forces"
    unit = truss.units.force if truss.units else ""
    with style.context():
        ax = style.axes(ax, 2.6)
        draw_member_forces(ax, truss, forces, unit=unit)
        _joints(ax, truss, names=False)
        _supports(ax, truss)
        _frame(ax, truss, pad_below=0.32)
        _legend(ax, unit)
        ax.set_title(title if title is not None else default)
        return ax


# -------------------------------------------------------------------- the sketch
def truss_sketch(line: InfluenceLine, ax: Axes | None = None, *, title: str | None = None) -> Axes:
    """The Müller-Breslau sketch of a truss's line: the truss moved by a unit shortening of the member (or the
    support moved up by 1), over its outline, and the deck's movement below, which is the line (upward =
    positive: tension, or an upward reaction) with its ordinates at the panel points.

    Both drawings go inside ``ax`` (new axes when omitted), the truss above the line; returns the axes of
    the line."""
    from ilkit.views.plot import breakpoint_ticks, draw_line, label_ordinates

    origin = line.origin
    assert isinstance(origin, TrussLine)
    truss = origin.truss
    shape = origin.shape()
    with style.context():
        ax = style.axes(ax, 4.2)
        ax.set_axis_off()  # the given axes hold the two drawings, one above the other
        ax_truss = ax.inset_axes((0.0, 0.5, 1.0, 0.5))
        ax_line = ax.inset_axes((0.0, 0.08, 1.0, 0.36))
        _draw_moved(ax_truss, truss, shape, origin)
        ax_truss.apply_aspect()
        ax_line.axhline(0.0, color=style.MUTED, linewidth=0.7, zorder=2, gid="axis")
        draw_line(ax_line, line, labels=False)
        for x, y in zip(truss.panel_points, origin.ordinates):
            ax_line.plot([float(x)], [float(y)], marker="o", markersize=3, color=style.INK, linestyle="none",
                         zorder=4, gid=f"panel-point:{fmt(x)}")
        ax_line.set_xlim(*ax_truss.get_xlim())  # the deck below the truss, to the same scale along x
        ax_line.margins(y=0.25)
        for side in ("left", "top", "right"):
            ax_line.spines[side].set_visible(False)
        ax_line.set_yticks([])
        breakpoint_ticks(ax_line, line)
        label_ordinates(ax_line, line)
        units = truss.units
        ax_line.set_xlabel(f"x [{units.length}]" if units else "x")
        unit = f" [{line.unit}]" if line.unit else ""
        words = "shortened by 1" if line.quantity.kind == "member_force" else "moved up by 1"
        ax_truss.set_title(title if title is not None else
                           f"Müller-Breslau: {line.quantity.label} {words}; the deck's upward movement is the "
                           f"line{unit}")
        return ax_line


def _draw_moved(ax: Axes, truss: Truss, shape: Mapping[str, tuple[float, float]], origin: TrussLine) -> None:
    """The outline of the truss (muted) and the truss moved by ``shape``, scaled to a readable size."""
    xs = [_xy(truss, j) for j in truss.joints]
    width = max(p[0] for p in xs) - min(p[0] for p in xs)
    biggest = max((max(abs(u), abs(v)) for u, v in shape.values()), default=0.0)
    factor = 0.06 * width / biggest if biggest else 0.0
    moved = {j: (_xy(truss, j)[0] + factor * u, _xy(truss, j)[1] + factor * v) for j, (u, v) in shape.items()}
    for name, (a, b) in truss.members.items():
        (xa, ya), (xb, yb) = _xy(truss, a), _xy(truss, b)
        ax.plot([xa, xb], [ya, yb], color=style.MUTED, linewidth=0.8, linestyle=(0, (4, 2)), zorder=2,
                gid=f"member:{name}")
        (xa, ya), (xb, yb) = moved[a], moved[b]
        target = origin.quantity.kind == "member_force" and name == origin.element
        ax.plot([xa, xb], [ya, yb], color=style.INK, linewidth=2.6 if target else 1.2, zorder=4 if target else 3,
                gid="shortened" if target else f"moved:{name}", linestyle=(0, (6, 2)) if target else "-")
    _joints(ax, truss, names=True, moved=moved)
    _supports(ax, truss, color=style.MUTED)
    _frame(ax, truss, pad_below=0.12)


# ------------------------------------------------------------------------ tables
def truss_facts(truss: Truss) -> list[tuple[str, str]]:
    """The truss in a few lines: ``(label, value)`` for displays and calculation sheets."""
    u = truss.units
    at = f" {u.length}" if u else ""
    degree = truss.degree
    points = ", ".join(f"{j} ({fmt(x)})" for j, x in zip(truss.deck, truss.panel_points))
    supports = ", ".join(f"{kind} at {j} (x = {fmt(truss.deck_x(j))}{at})" for j, kind in truss.supports.items())
    method = "determinate: statics, exact" if degree == 0 else "indeterminate: stiffness method with EA"
    return [
        ("span (deck)", f"{fmt(truss.length)}{at}"),
        ("joints, members", f"{len(truss.joints)}, {len(truss.members)}"),
        ("supports", supports),
        ("deck: panel points (x)", points),
        ("degree of indeterminacy", f"{degree} ({method})"),
        ("units", f"{u.name} (lengths in {u.length}, forces in {u.force})" if u else "not declared"),
    ]


@table.register(Truss)
def _(truss: Truss) -> pd.DataFrame:
    import pandas as pd

    u = truss.units
    length = f"length [{u.length}]" if u else "length"
    ea_col = f"EA [{u.force}]" if u else "EA"
    ea = truss.EA
    rows = []
    for name, (a, b) in truss.members.items():
        row: dict[str, Any] = {"member": name, "from": a, "to": b, "role": truss.roles[name],
                               length: truss.member_length(name)}
        if ea is not None:
            row[ea_col] = float(ea[name])
        rows.append(row)
    return pd.DataFrame(rows)


def member_table(envelope: MemberEnvelope) -> pd.DataFrame:
    """One row per member: role, length, the largest tension and the largest compression (tension positive,
    compression negative; 0 where the member never carries it) and the governing case of each."""
    import pandas as pd

    u = envelope.truss.units
    assert u is not None
    rows = []
    scale = max((abs(v) for k in ("max", "min") for v in envelope.forces(k).values()), default=1.0)  # type: ignore[arg-type]
    for (kind, name), found in envelope._found.items():
        if kind != "member_force":
            continue
        hi, lo = clean(found.maximum.value, scale), clean(found.minimum.value, scale)
        rows.append({
            "member": name, "role": envelope.truss.roles[name],
            f"length [{u.length}]": envelope.truss.member_length(name),
            f"max tension [{u.force}]": max(hi, 0.0), "tension case": found.maximum.case if hi > 0 else NO_CASE,
            f"max compression [{u.force}]": min(lo, 0.0), "compression case": found.minimum.case if lo < 0 else NO_CASE,
        })
    return pd.DataFrame(rows)


@table.register(MemberEnvelope)
def _(envelope: MemberEnvelope) -> pd.DataFrame:
    return member_table(envelope)


# ---------------------------------------------------------- displays and sheets
def truss_figure(truss: Truss) -> Any:
    """A new (pyplot-free) figure with the truss drawing."""
    with style.context():
        fig = style.new_figure(2.4)
        draw_truss(truss, fig.add_subplot())
    return fig


def envelope_blocks(envelope: MemberEnvelope, number: str = "") -> list[_doc.Block]:
    """The member envelope as document blocks: the two force drawings, the member table and the reactions."""
    from ilkit.views.moving_records import figure_block
    from ilkit.views.tables import doc_table

    prefix = f"{number} " if number else ""
    blocks: list[_doc.Block] = [
        _doc.Heading(f"{prefix}Member forces under {envelope.model}", 3),
        _doc.Para((f"For every member, the largest force (tension, positive) and the smallest (compression, "
                   f"negative) under {envelope.model}, each with the load case that governs it (the worst "
                   "placement of its own; factors and dynamic allowance as the model says). Drawn: tension solid, "
                   "compression hollow, the weight of a bar growing with its force.",)),
    ]
    for extreme in ("max", "min"):
        words = "largest forces (tension)" if extreme == "max" else "smallest forces (compression)"
        blocks.append(figure_block(lambda ax, e=extreme: plot_member_forces(envelope, ax, extreme=e), 2.6,
                                   f"{prefix}{words}", f"members-{extreme}-{number.replace('.', '-')}"))
    blocks += [doc_table(member_table(envelope)), _doc.Para(("Support reactions (upward positive):",)),
               doc_table(envelope.reactions)]
    return blocks


@report_section.register(MemberEnvelope)
def _(envelope: MemberEnvelope, number: str) -> list[_doc.Block]:
    return envelope_blocks(envelope, number)


@mimebundle.register(Truss)
def _(truss: Truss, include: Any = None, exclude: Any = None) -> dict[str, Any]:
    rows = "".join(f"<tr><th>{html.escape(k)}</th><td>{html.escape(v)}</td></tr>" for k, v in truss_facts(truss))
    body = figure_html(lambda: truss_figure(truss), "truss drawing") + f"<table>{rows}</table>"
    return {"text/html": f'{_CSS}<div class="ilkit-view"><strong>Truss</strong>{body}</div>'}


@mimebundle.register(MemberEnvelope)
def _(envelope: MemberEnvelope, include: Any = None, exclude: Any = None) -> dict[str, Any]:
    from ilkit.views.caution import CAUTION_SHORT

    blocks = [_doc.Heading(b.text, 4) if isinstance(b, _doc.Heading) else b for b in envelope_blocks(envelope)]
    caution = f'<p class="note">{html.escape(CAUTION_SHORT)}</p>'
    return {"text/html": f'{_CSS}<div class="ilkit-view">{_doc.to_html(blocks)}{caution}</div>'}
