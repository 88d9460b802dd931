"""Müller-Breslau sketches: the released beam in its displaced shape.

The sketch of a determinate line shows, on one drawing: the undeformed beam
axis and the supports; the release inserted for the quantity at its section
(a hinge for a bending moment, a shear release for a shear, the support's
restraint drawn faint for a reaction); the imposed unit displacement (an
arrow or a label marked ``1``); the displaced shape, which is the influence
line, with its positive and negative parts shaded; and the ordinates at the
breakpoints.  Every value shown is the core's (``line.knot_values()``).

Artist gids (for tests and SVG styling): ``"axis"``, ``"shape"``,
``"positive"``, ``"negative"``, ``"support:<kind>:<x>"``, ``"hinge:<x>"``,
``"shear-release:<x>"``, ``"release"`` (the release for the quantity),
``"imposed"`` (the unit displacement) and ``"ordinate:<x>:<side>"``.

A line of a girder loaded through a floor system (``line.origin`` a
:class:`~ilkit.floor.FloorLine`) shows the girder's own displaced shape as a
thin dashed line (``"girder-shape"``) and, as the influence line, the deck:
the stringers as chords between the floor beams, marked at the panel points
(``"panel-point:<x>"``).
"""

from __future__ import annotations

from typing import TYPE_CHECKING

from ilkit.errors import UnsupportedResultError
from ilkit.floor import FloorLine
from ilkit.kinematics import Mechanism
from ilkit.stiffness import UnitShape
from ilkit.views import style
from ilkit.views.derive import quantity_title
from ilkit.views.draw import draw_hinge, draw_shear_release, draw_structure, draw_support, point_transform
from ilkit.views.plot import breakpoint_ticks, draw_line, label_ordinates

if TYPE_CHECKING:  # pragma: no cover
    from matplotlib.axes import Axes

    from ilkit.influence import InfluenceLine
    from ilkit.model import Beam

__all__ = ["sketch"]


def _arrow(ax: Axes, start: tuple[float, float], end: tuple[float, float], both: bool = False) -> None:
    ax.annotate("", xy=end, xytext=start, gid="imposed", annotation_clip=False,
                arrowprops={"arrowstyle": "<|-|>" if both else "-|>", "color": style.INK, "linewidth": 0.9,
                            "shrinkA": 0, "shrinkB": 0, "mutation_scale": 8})


def _note(ax: Axes, xy: tuple[float, float], text: str, dx: float, dy: float, ha: str = "left") -> None:
    ax.annotate(text, xy=xy, xytext=(dx, dy), textcoords="offset points", ha=ha, va="center", fontsize=7.5,
                fontstyle="italic", gid="imposed", annotation_clip=False)


def _beam_of(line: InfluenceLine) -> Beam:
    """The beam a sketch can be drawn for: lines of the kinematic or the elastic analysis of a beam."""
    from ilkit.influence import InfluenceLine
    from ilkit.views._args import expect

    expect(line, InfluenceLine, what="sketch", hint="give an influence line, e.g. beam.moment(12)")
    origin = line.origin
    beam = origin.beam if isinstance(origin, (Mechanism, UnitShape, FloorLine)) else None
    if beam is None:
        raise UnsupportedResultError(
            f"{line.quantity.label}: a Müller-Breslau sketch needs a line from the analysis of a beam "
            "(beam.reaction(x), beam.shear(x), beam.moment(x) ...); draw this one with ilkit.views.plot_line(line)."
        )
    return beam


def sketch(line: InfluenceLine, ax: Axes | None = None, *, title: str | None = None) -> Axes:
    """Draw the Müller-Breslau sketch of a beam's influence line; returns the axes.

    For a determinate beam the drawing is the released beam moved by the unit
    displacement (``line.origin`` a :class:`~ilkit.kinematics.Mechanism`); for
    an indeterminate one, or a deflection or rotation line, it is the elastic
    beam's shape under the unit action (``line.origin`` a
    :class:`~ilkit.stiffness.UnitShape`), drawn with the line's sign (positive
    up).  Raises :class:`ilkit.UnsupportedResultError` for a line that did not
    come from the analysis of a beam (use :func:`ilkit.views.plot_line`).

    A line of a truss (``line.origin`` a :class:`~ilkit.trusses.TrussLine`)
    is sketched as the truss moved by a unit shortening of its member (or its
    support moved up by 1) above the deck's movement, which is the line
    (:func:`ilkit.views.truss.truss_sketch`); a girder loaded through a floor
    system shows the girder's shape and the deck's chords.
    """
    from ilkit.trusses.lines import TrussLine

    if isinstance(getattr(line, "origin", None), TrussLine):
        from ilkit.views.truss import truss_sketch

        return truss_sketch(line, ax, title=title)
    beam = _beam_of(line)
    q = line.quantity
    at = float(q.at)
    floor = line.origin if isinstance(line.origin, FloorLine) else None
    shape = floor.girder if floor is not None else line  # the girder's own displaced shape
    with style.context():
        ax = style.axes(ax, 2.6)
        L = float(beam.length)
        ax.plot([0, L], [0, 0], color=style.MUTED, linewidth=0.8, linestyle=(0, (5, 3)), gid="axis", zorder=2)
        draw_line(ax, line, labels=False)
        if floor is not None:
            xs, ys_girder = shape.sample()
            ax.plot(xs, ys_girder, color=style.INK, linewidth=0.8, linestyle=(0, (3, 2)), gid="girder-shape",
                    zorder=3)
            for p, y in zip(floor.panel_points, floor.ordinates):
                ax.plot([float(p)], [float(y)], marker="o", markersize=3.2, color=style.INK, linestyle="none",
                        gid=f"panel-point:{float(p):g}", zorder=4)
        support = q.kind in ("reaction", "moment_reaction")
        spring = support and any(s.at == q.at and s.spring is not None for s in beam.supports)
        released = [q.at] if support and not spring else []
        draw_structure(ax, beam, muted=released)
        for h in beam.hinges:
            if not (h == q.at and q.kind == "hinge_shear"):
                draw_hinge(ax, float(h), float(shape(float(h))))
        for h in beam.shear_releases:
            draw_shear_release(ax, float(h), (float(shape.left(float(h))) + float(shape.right(float(h)))) / 2)
        if not (isinstance(shape.origin, Mechanism) and not shape.origin.release):  # nothing to release
            _draw_release(ax, shape, at, spring)
        ys = [v for _, a, b in line.knot_values() for v in (a, b)] + [0.0, line.maximum.value, line.minimum.value]
        ys += [shape.maximum.value, shape.minimum.value]
        lo, hi = min(ys), max(ys)
        span = (hi - lo) or 1.0
        ax.set_ylim(lo - 0.32 * span, hi + 0.25 * span)
        ax.set_xlim(-0.03 * L, 1.03 * L)
        for side in ("left", "top", "right"):
            ax.spines[side].set_visible(False)
        ax.set_yticks([])
        breakpoint_ticks(ax, line)
        label_ordinates(ax, line)
        ax.set_xlabel(f"x [{beam.units.length}]" if beam.units else "x")
        unit = f" [{line.unit}]" if line.unit else ""
        through = ", load through the floor system" if floor is not None else ""
        ax.set_title(title if title is not None else
                     f"Müller-Breslau: {quantity_title(q, beam.units.length if beam.units else '')}{unit}{through}")
        return ax


def _draw_release(ax: Axes, line: InfluenceLine, at: float, spring: bool) -> None:
    """The release inserted for the quantity and the unit displacement imposed there."""
    q = line.quantity
    # a spring stays in place: its force is k times the movement under a unit action there
    words = {"deflection": "unit force", "rotation": "unit couple"}.get(q.kind)
    if spring:
        words = "unit force, × k" if q.kind == "reaction" else "unit couple, × k"
    if words is not None:
        _note(ax, (at, 0.0), words, 6, -16)  # beside the section, below the beam axis
    elif q.kind == "reaction":
        _arrow(ax, (at, 0.0), (at, float(line(at))))
        _note(ax, (at, float(line(at)) / 2), "1", 5, 0)
    elif q.kind == "moment_reaction":
        for artist in draw_support(ax, at, "pin"):
            artist.set_gid("release")
        from matplotlib.patches import FancyArrowPatch

        sign = 1 if q.at == 0 else -1
        trans = point_transform(ax, at, 0.0)
        arc = FancyArrowPatch((14 * sign, -9), (14 * sign, 9), connectionstyle=f"arc3,rad={0.6 * sign}",
                              arrowstyle="-|>", mutation_scale=8, color=style.INK, linewidth=0.9,
                              transform=trans, gid="imposed")
        arc.set_clip_on(False)
        ax.add_patch(arc)
        _note(ax, (at, 0.0), "1 rad", 24 * sign, 0, "left" if sign > 0 else "right")
    elif q.kind == "moment":
        y = float(line(at))
        draw_hinge(ax, at, y, gid="release")
        _note(ax, (at, y), "kink 1 rad", 0, 20, "center")  # a sagging kink points up: room above
    else:  # shear, hinge_shear: the faces slide apart by 1
        # the faces either side of the section; at an end of the beam the outer face is the end point
        left, right = float(line.left(at)), float(line.right(at))
        if at == line.breakpoints[0]:
            left, right = 0.0, float(line(at))
        elif at == line.breakpoints[-1]:
            left, right = float(line.left(at)), 0.0
        if q.kind == "hinge_shear":
            draw_hinge(ax, at, left, gid="release")
            draw_hinge(ax, at, right, gid="release")
        else:
            draw_shear_release(ax, at, (left + right) / 2, gid="release")
        _arrow(ax, (at, left), (at, right), both=True)
        _note(ax, (at, (left + right) / 2), "1", 7, 0)
