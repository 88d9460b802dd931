"""Beam diagrams and the symbols they are made of.

Symbols are drawn at a point of the beam in data coordinates, with their
shape in typographic points, so they keep their size and proportions however
the axes are scaled (a sketch's vertical scale is an ordinate, not a length).
Every artist carries a ``gid`` naming what it shows (``"support:pin:25"``,
``"hinge:10"`` ...), for tests and for styling of SVG output.

Functions take ``ax=`` (new axes on a new figure when omitted) and return
what they drew; they keep no state.  Symbols:

* pin: a triangle on a hatched ground line;
* roller: a triangle on two rollers;
* fixed: a hatched wall (at an end) or a hatched clamp (inside the beam);
* hinge: an open circle on the beam;
* shear release: two parallel bars across a break of the beam;
* spring: a zig-zag to the ground (vertical) or a coil (rotational);
* floor system: the stringers as a thin line above the beam, resting on
  short posts (the floor beams) at the panel points.
"""

from __future__ import annotations

from collections.abc import Sequence
from fractions import Fraction
from typing import TYPE_CHECKING, Any, Literal

from ilkit._exact import fmt
from ilkit.views import style

if TYPE_CHECKING:  # pragma: no cover
    from matplotlib.artist import Artist
    from matplotlib.axes import Axes

    from ilkit.model import Beam

__all__ = [
    "draw_beam",
    "draw_support",
    "draw_hinge",
    "draw_shear_release",
    "draw_spring",
    "draw_dimensions",
    "draw_structure",
    "draw_floor",
    "point_transform",
]

SupportSymbol = Literal["fixed", "pin", "roller"]


def point_transform(ax: Axes, x: float, y: float) -> Any:
    """Transform for shapes given in points around the data point ``(x, y)``."""
    from matplotlib import transforms

    fig = ax.figure
    return transforms.Affine2D().scale(1 / 72) + fig.dpi_scale_trans + transforms.ScaledTranslation(x, y, ax.transData)


def _line(ax: Axes, xs: Sequence[float], ys: Sequence[float], trans: Any, gid: str, **kw: Any) -> Artist:
    from matplotlib.lines import Line2D

    kw.setdefault("color", style.INK)
    kw.setdefault("linewidth", 0.9)
    artist = Line2D(xs, ys, transform=trans, gid=gid, solid_capstyle="butt", **kw)
    artist.set_clip_on(False)
    ax.add_artist(artist)
    return artist


def _patch(ax: Axes, patch: Any, gid: str) -> Artist:
    patch.set_gid(gid)
    patch.set_clip_on(False)
    ax.add_patch(patch)
    return patch


def _ground(ax: Axes, trans: Any, y: float, half: float, gid: str, color: str) -> list[Artist]:
    """A ground line at ``y`` points with short hatch strokes below it."""
    out = [_line(ax, [-half, half], [y, y], trans, gid, color=color)]
    step = 3.5
    x = -half + step
    while x <= half + 1e-9:
        out.append(_line(ax, [x, x - 3.0], [y, y - 3.5], trans, gid, color=color, linewidth=0.6))
        x += step
    return out


def draw_support(
    ax: Axes, x: float, kind: SupportSymbol, *, y: float = 0.0, end: Literal["left", "right"] | None = None,
    color: str = style.INK,
) -> list[Artist]:
    """Draw a support symbol under the beam point ``(x, y)``.

    ``end`` says whether a fixed support is at the left or right end of the
    beam (a wall); inside the beam a fixed support is drawn as a clamp.
    """
    from matplotlib.patches import Circle, Polygon, Rectangle

    trans = point_transform(ax, x, y)
    gid = f"support:{kind}:{fmt(x)}"
    out: list[Artist] = []
    if kind == "pin":
        out.append(_patch(ax, Polygon([(0, 0), (-6, -10), (6, -10)], closed=True, facecolor="white",
                                      edgecolor=color, linewidth=0.9, transform=trans, zorder=4), gid))
        out += _ground(ax, trans, -10, 9, gid, color)
    elif kind == "roller":
        out.append(_patch(ax, Polygon([(0, 0), (-6, -8), (6, -8)], closed=True, facecolor="white",
                                      edgecolor=color, linewidth=0.9, transform=trans, zorder=4), gid))
        for cx in (-3.2, 3.2):
            out.append(_patch(ax, Circle((cx, -9.6), 1.6, facecolor="white", edgecolor=color, linewidth=0.8,
                                         transform=trans, zorder=4), gid))
        out += _ground(ax, trans, -11.2, 9, gid, color)
    elif kind == "fixed":
        if end is None:
            out.append(_patch(ax, Rectangle((-4, -9), 8, 18, facecolor="white", edgecolor=color, hatch="/////",
                                            linewidth=0.9, transform=trans, zorder=4), gid))
        else:
            sign = -1 if end == "left" else 1
            out.append(_line(ax, [0, 0], [-11, 11], trans, gid, color=color, linewidth=1.2))
            for yy in range(-9, 12, 4):
                out.append(_line(ax, [0, 3.5 * sign], [yy, yy - 3.5], trans, gid, color=color, linewidth=0.6))
    else:
        raise ValueError(f"unknown support symbol {kind!r}")
    return out


def draw_hinge(ax: Axes, x: float, y: float = 0.0, *, gid: str | None = None, color: str = style.INK) -> Artist:
    """An open circle: a moment release (hinge) at ``(x, y)``."""
    from matplotlib.patches import Circle

    trans = point_transform(ax, x, y)
    return _patch(ax, Circle((0, 0), 3.2, facecolor="white", edgecolor=color, linewidth=1.0, transform=trans,
                             zorder=6), gid or f"hinge:{fmt(x)}")


def draw_shear_release(
    ax: Axes, x: float, y: float = 0.0, *, gid: str | None = None, color: str = style.INK
) -> list[Artist]:
    """Two parallel bars across a gap in the beam: a shear release (sliding joint) at ``(x, y)``."""
    from matplotlib.patches import Rectangle

    trans = point_transform(ax, x, y)
    gid = gid or f"shear-release:{fmt(x)}"
    out = [_patch(ax, Rectangle((-2.4, -2.5), 4.8, 5.0, facecolor="white", edgecolor="none", transform=trans,
                                zorder=5), gid)]
    for bx in (-2.4, 2.4):
        out.append(_line(ax, [bx, bx], [-6.5, 6.5], trans, gid, color=color, linewidth=1.1, zorder=6))
    return out


def draw_spring(
    ax: Axes, x: float, kind: Literal["vertical", "rotational"] = "vertical", *, y: float = 0.0,
    color: str = style.INK,
) -> list[Artist]:
    """A spring support at ``(x, y)``: a zig-zag to the ground, or a coil for a rotational spring."""
    import numpy as np

    trans = point_transform(ax, x, y)
    gid = f"spring:{kind}:{fmt(x)}"
    if kind == "vertical":
        ys = [0.0, -3.0] + [-3.0 - 1.6 * i for i in range(1, 8)] + [-17.0]
        xs = [0.0, 0.0] + [(-4.0 if i % 2 else 4.0) if i < 7 else 0.0 for i in range(1, 8)] + [0.0]
        return [_line(ax, xs, ys, trans, gid, color=color), *_ground(ax, trans, -17.0, 8, gid, color)]
    if kind == "rotational":
        t = np.linspace(0.0, 2.75 * np.pi, 80)
        radius = 2.0 + 2.2 * t / np.pi
        coil = _line(ax, list(radius * np.cos(t)), list(radius * np.sin(t)), trans, gid, color=color)
        anchor = radius[-1] * np.sin(t[-1])
        return [coil, _line(ax, [radius[-1] * np.cos(t[-1])] * 2, [anchor, -16.0], trans, gid, color=color),
                *_ground(ax, trans, -16.0, 7, gid, color)]
    raise ValueError(f"unknown spring kind {kind!r}; choose 'vertical' or 'rotational'")


def draw_dimensions(
    ax: Axes, points: Sequence[Fraction], *, offset: float = -30.0, unit: str = "", color: str = style.MUTED
) -> list[Artist]:
    """A dimension chain ``offset`` points below the beam axis: ticks at ``points``, lengths between them."""
    from matplotlib import transforms

    trans = transforms.offset_copy(ax.transData, fig=ax.figure, y=offset, units="points")
    tick = transforms.offset_copy(ax.transData, fig=ax.figure, y=offset, units="points")
    xs = [float(p) for p in points]
    out = [_line(ax, [xs[0], xs[-1]], [0, 0], trans, "dimension", color=color, linewidth=0.6)]
    for p in xs:
        out.append(_line(ax, [p, p], [0, 0], tick, "dimension", color=color, marker="|", markersize=6,
                         markeredgewidth=0.6))
    suffix = f" {unit}" if unit else ""
    for a, b in zip(points[:-1], points[1:]):
        text = ax.annotate(f"{fmt(b - a)}{suffix}", xy=((float(a) + float(b)) / 2, 0), xytext=(0, offset - 2),
                           textcoords="offset points", ha="center", va="top", fontsize=7.5, color=style.INK,
                           gid="dimension-text", annotation_clip=False)
        out.append(text)
    return out


def _end(beam: Beam, x: Fraction) -> Literal["left", "right"] | None:
    if x == 0:
        return "left"
    if x == beam.length:
        return "right"
    return None


def draw_structure(ax: Axes, beam: Beam, *, muted: Sequence[Fraction] = ()) -> list[Artist]:
    """Supports of ``beam`` on its axis (``y = 0``); those at ``muted`` positions in the reference colour.

    An elastic support is drawn as what it is made of: a vertical spring (or a
    pin where the bearing is rigid), and a rotational spring (or a wall or
    clamp where rotation is fully restrained).
    """
    out: list[Artist] = []
    for s in beam.supports:
        x, end = float(s.at), _end(beam, s.at)
        color = style.MUTED if s.at in muted else style.INK
        if s.spring is None:
            out += draw_support(ax, x, s.kind, end=end, color=color)
            continue
        if s.vertical_stiffness is not None:
            out += draw_spring(ax, x, "vertical", color=color)
        else:
            out += draw_support(ax, x, "pin", color=color)
        if s.rotational_stiffness is not None:
            out += draw_spring(ax, x, "rotational", color=color)
        elif s.restrains_rotation:
            out += draw_support(ax, x, "fixed", end=end, color=color)
    return out


def draw_floor(ax: Axes, panel_points: Sequence[float], y: float = 0.0, *, height: float = 9.0) -> list[Artist]:
    """The floor system above the girder line at ``y``: stringers ``height`` points above it on posts (the floor
    beams) at ``panel_points``.  Gids ``"stringers"`` and ``"floor-beam:<x>"``."""
    from matplotlib import transforms

    lifted = transforms.offset_copy(ax.transData, fig=ax.figure, y=height, units="points")
    xs = [float(p) for p in panel_points]
    (stringers,) = ax.plot([xs[0], xs[-1]], [y, y], transform=lifted, color=style.INK, linewidth=1.0,
                           gid="stringers", zorder=3, solid_capstyle="butt")
    out: list[Artist] = [stringers]
    for x in xs:
        out.append(_line(ax, [0, 0], [2.5, height], point_transform(ax, x, y), f"floor-beam:{fmt(x)}",
                         linewidth=1.6))
    return out


def draw_beam(beam: Beam, ax: Axes | None = None, *, dimensions: bool = True, title: str | None = None) -> Axes:
    """Draw the beam: its axis, supports, hinges, shear releases, the floor system (where the beam has panel
    points) and a dimension chain.

    Returns the axes.  The horizontal scale is the beam's length unit; the
    vertical direction carries only the symbols.
    """
    with style.context():
        from ilkit.model import Beam as _Beam
        from ilkit.views._args import expect

        expect(beam, _Beam, what="draw_beam", hint="give an ilkit.Beam")
        ax = style.axes(ax, 1.4)
        L = float(beam.length)
        ax.plot([0, L], [0, 0], color=style.INK, linewidth=2.6, solid_capstyle="butt", gid="beam", zorder=3)
        draw_structure(ax, beam)
        for h in beam.hinges:
            draw_hinge(ax, float(h))
        for h in beam.shear_releases:
            draw_shear_release(ax, float(h))
        if beam.panel_points is not None:
            draw_floor(ax, beam.panel_points)
        if dimensions:
            points = sorted({Fraction(0), beam.length, *(s.at for s in beam.supports), *(p for p, _ in beam.releases),
                             *(beam.panel_points or ())})
            draw_dimensions(ax, points, unit=beam.units.length if beam.units else "")
        ax.set_xlim(-0.04 * L, 1.04 * L)
        ax.set_ylim(-1.4, 0.6)
        ax.set_axis_off()
        if title is not None:
            ax.set_title(title)
        return ax
