"""Sketches, plots and beam diagrams, checked by inspecting the artists they draw."""

from __future__ import annotations

import sys

import matplotlib
import numpy as np
import pytest
from hypothesis import HealthCheck, given, settings
from scenarios import built_in_girder
from views_strategies import determinate_lines

matplotlib.use("Agg")
import matplotlib.pyplot as plt

import ilkit
from ilkit.influence import InfluenceLine
from ilkit.quantity import Quantity
from ilkit.views import draw_beam, plot_line, sketch, style
from ilkit.views.draw import draw_spring
from ilkit.views.plot import key_ordinates, short


@pytest.fixture(autouse=True)
def _close_figures():
    yield
    plt.close("all")


def gids(ax, prefix: str) -> list:
    return [a for a in ax.findobj() if (a.get_gid() or "").startswith(prefix)]


def polygon_area(collection) -> float:
    """Signed area (shoelace) of the polygons of a fill_between collection, as absolute sum."""
    total = 0.0
    for path in collection.get_paths():
        for poly in path.to_polygons():
            x, y = poly[:, 0], poly[:, 1]
            total += abs(np.dot(x, np.roll(y, -1)) - np.dot(y, np.roll(x, -1))) / 2
    return total


def girder() -> ilkit.Beam:
    return built_in_girder()


@settings(max_examples=25, deadline=None, suppress_health_check=[HealthCheck.filter_too_much, HealthCheck.too_slow])
@given(determinate_lines())
def test_sketch_labels_shape_and_shading_are_the_core_values(line: InfluenceLine) -> None:
    fig, ax = plt.subplots()
    sketch(line, ax)
    # every key ordinate is labelled with the core's value, and nothing else is
    labels = {a.get_gid(): a.get_text() for a in gids(ax, "ordinate:")}
    expected = {f"ordinate:{ilkit._exact.fmt(x)}:{side}": short(v) for x, side, v in key_ordinates(line)}
    assert labels == expected
    for x, side, value in key_ordinates(line):
        exact = line.ordinate_exact(x, None if side == "both" else side)
        if side == "both" and x == line.breakpoints[-1]:
            exact = line.ordinate_exact(x, "left")
        assert value == pytest.approx(float(exact), rel=1e-14, abs=1e-14)
    # the drawn shape passes through the core ordinates at every breakpoint, both faces
    (shape,) = gids(ax, "shape")
    xs, ys = shape.get_xdata(), shape.get_ydata()
    for x, left, right in line.knot_values():
        at = ys[np.isclose(xs, x, rtol=0, atol=1e-12)]
        for v in (left, right):
            if (x == line.breakpoints[0] and v is left) or (x == line.breakpoints[-1] and v is right):
                continue
            assert np.any(np.isclose(at, v, rtol=0, atol=1e-12))
    # the shaded areas are the line's positive and negative areas
    (pos,), (neg,) = gids(ax, "positive"), gids(ax, "negative")
    assert polygon_area(pos) == pytest.approx(line.positive_area, rel=1e-9, abs=1e-9)
    assert polygon_area(neg) == pytest.approx(-line.negative_area, rel=1e-9, abs=1e-9)
    # a support symbol for every support
    for s in line.origin.beam.supports:
        assert gids(ax, f"support:{s.kind}:{ilkit._exact.fmt(s.at)}")
    plt.close(fig)


def test_moment_sketch_shows_the_hinge_and_the_unit_kink() -> None:
    line = girder().moment(4.8)
    ax = sketch(line)
    (release,) = gids(ax, "release")
    assert release.get_gid() == "release"
    assert "kink 1 rad" in [a.get_text() for a in gids(ax, "imposed")]
    # the existing hinge at x=9.6 sits on the displaced shape, at the core ordinate -4.8
    (hinge,) = gids(ax, "hinge:9.6")
    anchor = hinge.get_transform().transform((0, 0))
    assert np.allclose(anchor, ax.transData.transform((9.6, line(9.6))))
    assert line(9.6) == pytest.approx(-4.8)  # derived by hand: the cantilever arm from the section to the hinge
    title = ax.get_title(loc="left")
    assert "Müller-Breslau" in title and "kN·m/kN" in title


def test_shear_sketch_shows_the_release_and_the_unit_jump() -> None:
    line = girder().shear(15)
    ax = sketch(line)
    assert gids(ax, "release")
    imposed = gids(ax, "imposed")
    arrows = [a for a in imposed if a.get_text() == "" and a.arrow_patch is not None]
    (arrow,) = arrows
    (x0, y0), (x1, y1) = arrow.xyann, arrow.xy
    assert (x0, x1) == (15.0, 15.0)
    assert y1 - y0 == pytest.approx(1.0)  # the faces slide apart by the imposed unit displacement
    assert (y0, y1) == (line.left(15.0), line.right(15.0))
    assert "1" in [a.get_text() for a in imposed]


def test_reaction_sketch_lifts_the_released_support_by_one() -> None:
    line = girder().reaction(31.2)
    ax = sketch(line)
    released = gids(ax, "support:roller:31.2")
    assert released and all(
        matplotlib.colors.same_color(a.get_edgecolor() if hasattr(a, "get_edgecolor") else a.get_color(), style.MUTED)
        for a in released
    )
    (arrow,) = [a for a in gids(ax, "imposed") if a.get_text() == ""]
    assert arrow.xyann == (31.2, 0.0) and arrow.xy == (31.2, 1.0)
    fixed = gids(ax, "support:fixed:0")
    assert fixed and not matplotlib.colors.same_color(fixed[0].get_color(), style.MUTED)


def test_moment_reaction_sketch_turns_the_support_by_one_radian() -> None:
    ax = sketch(girder().moment_reaction(0))
    imposed = gids(ax, "imposed")
    assert "1 rad" in [a.get_text() for a in imposed if hasattr(a, "get_text")]
    assert any(isinstance(a, matplotlib.patches.FancyArrowPatch) for a in imposed)  # the turning arrow
    assert gids(ax, "release")  # a pin replaces the fixed support's rotational restraint


def test_sketch_needs_a_mechanism() -> None:
    hand_made = InfluenceLine(quantity=Quantity("moment", ilkit._exact.to_exact(5, field="x")),
                              knots=(0.0, 10.0), coefficients=((0.0, 1.0),))
    with pytest.raises(ilkit.UnsupportedResultError, match="plot_line"):
        sketch(hand_made)
    ax = plot_line(hand_made)  # the plain plot works for any line
    assert gids(ax, "shape")


def test_plot_line_labels_extremes_and_units() -> None:
    line = girder().shear(15)
    ax = plot_line(line)
    texts = {a.get_gid(): a.get_text() for a in gids(ax, "ordinate:")}
    assert texts == {"ordinate:15:left": short(line.left(15.0)), "ordinate:15:right": short(line.right(15.0)),
                     "ordinate:37.2:both": short(line.left(37.2))}
    assert ax.get_xlabel() == "load position x [m]" and ax.get_ylabel() == "ordinate [kN/kN]"


def test_beam_diagram_has_every_symbol_and_the_span_lengths() -> None:
    beam = built_in_girder(supports={0: "fixed", 16.8: "pin", 31.2: "roller"}, shear_releases=[22.8], units="kip-ft")
    ax = draw_beam(beam)
    for gid in ("support:fixed:0", "support:pin:16.8", "support:roller:31.2", "hinge:9.6", "shear-release:22.8",
                "beam"):
        assert gids(ax, gid), gid
    assert [a.get_text() for a in gids(ax, "dimension-text")] == ["9.6 ft", "7.2 ft", "6 ft", "8.4 ft", "6 ft"]
    assert len(draw_spring(ax, 5.0)) > 1 and gids(ax, "spring:vertical:5")
    assert gids(ax, "spring:rotational:20") == [] and draw_spring(ax, 20.0, "rotational")
    with pytest.raises(ValueError, match="rotational"):
        draw_spring(ax, 3.0, "diagonal")  # type: ignore[arg-type]


def test_drawing_keeps_global_style_untouched_and_svg_is_reproducible() -> None:
    before = dict(matplotlib.rcParams)
    from ilkit.views.display import line_figure

    svg1 = style.figure_svg(line_figure(girder().moment(4.8)))
    svg2 = style.figure_svg(line_figure(girder().moment(4.8)))
    assert svg1 == svg2
    assert "kink 1 rad" in svg1 and ">-4.8<" in svg1  # text stays text; the label is the core value
    assert dict(matplotlib.rcParams) == before


def test_missing_matplotlib_names_the_install(monkeypatch: pytest.MonkeyPatch) -> None:
    for name in [m for m in sys.modules if m == "matplotlib" or m.startswith("matplotlib.")]:
        monkeypatch.delitem(sys.modules, name)
    monkeypatch.setitem(sys.modules, "matplotlib", None)
    with pytest.raises(ilkit.MissingDependencyError, match=r"pip install ilkit\[plot\]"):
        draw_beam(girder())
    with pytest.raises(ImportError):  # MissingDependencyError is also an ImportError
        sketch(girder().moment(4.8))


def springs_beam() -> ilkit.Beam:
    return ilkit.Beam(30, {0: "pin", 15: ilkit.Spring(vertical=5000), 30: ilkit.Spring(rotational=200000)},
                      EI=100000, units="kN-m")


def test_springs_are_drawn_as_springs() -> None:
    beam = springs_beam()
    ax = draw_beam(beam)
    assert gids(ax, "support:pin:0") and gids(ax, "spring:vertical:15") and gids(ax, "spring:rotational:30")
    assert gids(ax, "support:pin:30")  # the rigid bearing under the rotational spring
    settling_fixed_end = ilkit.Beam(30, {0: ilkit.Spring(vertical=5000, rotational="rigid"), 30: "roller"}, EI=1)
    ax = draw_beam(settling_fixed_end)
    assert gids(ax, "spring:vertical:0") and gids(ax, "support:fixed:0")


def test_sketch_of_an_elastic_line_shows_the_unit_action_and_core_values() -> None:
    line = springs_beam().moment(7.5)
    ax = sketch(line)
    labels = {a.get_gid(): a.get_text() for a in gids(ax, "ordinate:")}
    assert labels == {f"ordinate:{ilkit._exact.fmt(x)}:{side}": short(v) for x, side, v in key_ordinates(line)}
    assert labels["ordinate:7.5:both"] == short(line(7.5))
    assert "kink 1 rad" in [a.get_text() for a in gids(ax, "imposed")]
    assert gids(ax, "spring:vertical:15") and gids(ax, "release")
    # the shading follows the cubic pieces closely (41 points a piece)
    (pos,), (neg,) = gids(ax, "positive"), gids(ax, "negative")
    assert polygon_area(pos) == pytest.approx(line.positive_area, rel=1e-3)
    assert polygon_area(neg) == pytest.approx(-line.negative_area, rel=1e-3)


def test_sketch_of_a_spring_force_and_a_deflection_names_the_unit_action() -> None:
    beam = springs_beam()
    ax = sketch(beam.reaction(15))
    assert [a.get_text() for a in gids(ax, "imposed")] == ["unit force, × k"]
    assert not any(matplotlib.colors.same_color(a.get_color(), style.MUTED)
                   for a in gids(ax, "spring:vertical:15"))  # the spring stays: it is not released
    ax = sketch(beam.deflection(20))
    assert [a.get_text() for a in gids(ax, "imposed")] == ["unit force"]
