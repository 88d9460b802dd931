"""Girders loaded through a floor system (stringers on floor beams at panel points).

Laws (hypothesis): the line through the floor equals the girder's own line
at every panel point (a load on a floor beam reaches the girder there) and is
straight between panel points (a stringer is a simple span: statics of a
simple span, common practice), for random determinate beams (exact) and
continuous beams (the stiffness method); it is 0 beyond the first and the
last floor beam.  Jumps: the shear at a floor beam names its face, and a
load on that floor beam counts on the other face.  The floor line of a
simple span at a section inside a panel is the classic panel-shear line
(written out below).  Placement, envelopes, the explorer's core calls and
sketches take the lines unchanged.
"""

from __future__ import annotations

from fractions import Fraction as F

import numpy as np
import pytest
from continuous_strategies import elastic_beams
from hypothesis import given, settings
from hypothesis import strategies as st
from profiles import examples
from strategies import determinate_beams

import ilkit
from ilkit import loads
from ilkit.floor import FloorLine, through_floor


@st.composite
def floor_beams(draw, beams):
    beam = draw(beams)
    cells = [F(k, 4) * beam.length / 6 for k in range(25)]
    points = sorted(draw(st.lists(st.sampled_from(cells), min_size=2, max_size=9, unique=True)))
    shear = set(beam.shear_releases)
    points = [p for p in points if p not in shear]
    if len(points) < 2:
        points = [F(0), beam.length]
    return beam.replace(panel_points=points)


def _quantities(beam):
    inside = beam.length * F(7, 19)
    out = [("moment", inside, None), ("shear", inside, None)]
    out += [("reaction", s.at, None) for s in beam.supports]
    return out


def _line(beam, kind, at, side):
    try:
        return beam.line(kind, at, side=side)
    except ilkit.SideRequiredError:
        return beam.line(kind, at, side="right")


def _check_floor_law(floored):
    girder = floored.replace(panel_points=None)
    points = floored.panel_points
    for kind, at, side in _quantities(floored):
        line = _line(floored, kind, at, side)
        own = _line(girder, kind, at, side if side else line.quantity.side)
        assert isinstance(line.origin, FloorLine)
        for k, p in enumerate(points):
            expected = line.origin.ordinates[k]
            if p == at and line.quantity.side is not None:  # the floor beam is on the other face of the section
                value = own.left(float(p)) if line.quantity.side == "right" else own.right(float(p))
            elif p == floored.length:
                value = own.left(float(p))
            else:
                value = own(float(p))
            assert abs(float(expected) - value) <= 1e-9 * max(1.0, abs(value)), (kind, at, p)
        for a, b in zip(points, points[1:]):
            t = np.linspace(float(a), float(b), 7)[1:-1]
            ya, yb = float(line.origin.ordinates[points.index(a)]), float(line.origin.ordinates[points.index(b)])
            chord = ya + (yb - ya) * (t - float(a)) / float(b - a)
            assert np.allclose(line(t), chord, rtol=0, atol=1e-9 * max(1.0, abs(ya), abs(yb)))
        outside = [x for x in (float(points[0]) / 2, (float(points[-1]) + float(floored.length)) / 2)
                   if not (float(points[0]) <= x <= float(points[-1]))]
        assert all(line(x) == 0.0 for x in outside)


@settings(max_examples=examples(40))
@given(floored=floor_beams(determinate_beams()))
def test_a_floor_line_of_a_determinate_girder_is_exact_equal_at_panel_points_and_straight_between(floored):
    _check_floor_law(floored)
    assert all(line.is_exact for line in (floored.moment(floored.length / 3), floored.reaction(floored.supports[0].at)))


@settings(max_examples=examples(15))
@given(floored=floor_beams(elastic_beams(max_spans=3, springs=False)))
def test_a_floor_line_of_a_continuous_girder_is_equal_at_panel_points_and_straight_between(floored):
    _check_floor_law(floored)


def test_panel_shear_of_a_simple_span_through_a_floor_is_the_classic_line(reference):
    """A 40 m span with floor beams every 10 m; shear at 15 m (inside the second panel)."""
    beam = ilkit.Beam(40, {0: "pin", 40: "roller"}, units="kN-m", panel_points=[0, 10, 20, 30, 40])
    line = beam.shear(15)
    # the load reaches the girder at the floor beams: at 10 m it is left of the panel (shear -10/40), at 20 m right
    # of it (shear 1 - 20/40); the panel's shear does not depend on where the section is inside the panel
    reference("panel shear, load at the floor beams 0, 10, 20, 30, 40 m",
              expected=[F(0), F(-1, 4), F(1, 2), F(1, 4), F(0)],
              computed=[line.ordinate_exact(x) for x in (0, 10, 20, 30, 40)],
              source="statics of a simple span loaded at panel points (common practice)",
              clause="V = R_A - loads left of the panel")
    reference("panel shear crosses zero inside the panel (x = 40/3 m)", expected=F(0),
              computed=line.ordinate_exact(F(40, 3)), source="the straight line from -1/4 at 10 m to 1/2 at 20 m",
              clause="-1/4 + (3/4)(x - 10)/10 = 0")
    assert beam.shear(12).expr == line.expr  # any section inside the panel


def test_shear_at_a_floor_beam_names_its_face_and_the_floor_beam_loads_the_other_face():
    beam = ilkit.Beam(40, {0: "pin", 40: "roller"}, units="kN-m", panel_points=[0, 10, 20, 30, 40])
    with pytest.raises(ilkit.SideRequiredError, match="floor beam at x=20"):
        beam.shear(20)
    right = beam.shear(20, side="right")  # just right of the floor beam: its load is on the left
    left = beam.shear(20, side="left")
    assert right.ordinate_exact(20) == F(-1, 2) and left.ordinate_exact(20) == F(1, 2)
    assert right.ordinate_exact(30) == left.ordinate_exact(30) == F(1, 4)
    # at the supports the end floor beams load the bearings: no shear in the girder
    assert beam.shear(0).ordinate_exact(0) == 0 and beam.shear(40).ordinate_exact(40) == 0


def test_placement_envelope_and_sketch_take_floor_lines_unchanged():
    pytest.importorskip("matplotlib")
    import matplotlib

    matplotlib.use("Agg")
    from ilkit import views

    beam = ilkit.Beam(120, {0: "pin", 120: "roller"}, units="kip-ft", panel_points=[12 * k for k in range(11)])
    girder = beam.replace(panel_points=None)
    hl93 = loads.hl93()
    through = loads.place(beam.moment(60), hl93, "max")
    direct = loads.place(girder.moment(60), hl93, "max")
    assert through.value <= direct.value + 1e-9  # stringers spread the axles to the floor beams
    # every axle of the governing placement stands on the deck; the value is the sum of its table
    assert all(0 <= a.x <= 120 for p in through.placements for a in p.axles if a.counted)
    ax = views.sketch(beam.moment(60))
    gids = {a.get_gid() for a in ax.get_children()}
    assert "girder-shape" in gids and "panel-point:60" in gids
    ax = views.draw_beam(beam)
    assert {f"floor-beam:{12 * k}" for k in range(11)} <= {a.get_gid() for a in ax.get_children()}
    text = str(views.derivation(beam.moment(60)))
    assert "floor beam" in text


def test_envelope_of_a_girder_with_a_floor_system_lists_both_faces_at_floor_beams():
    beam = ilkit.Beam(40, {0: "pin", 40: "roller"}, units="kN-m", panel_points=[0, 10, 20, 30, 40])
    found = loads.envelope(beam, loads.lm2(), divisions=4)
    assert len(found.sections) == 5 + 3


def test_envelope_of_a_girder_with_a_floor_system_between_floor_beams():
    beam = ilkit.Beam(40, {0: "pin", 40: "roller"}, units="kN-m", panel_points=[0, 10, 20, 30, 40])
    found = loads.envelope(beam, loads.lm2(), divisions=3)
    m = found.extreme("moment", F(40, 3))
    assert m.value == pytest.approx(400 * float(beam.moment(F(40, 3)).maximum.value))


def test_bad_panel_points_are_refused_with_the_fix():
    with pytest.raises(ilkit.BeamInputError, match="at least two floor beams"):
        ilkit.Beam(40, {0: "pin", 40: "roller"}, panel_points=[20])
    with pytest.raises(ilkit.BeamInputError, match="off the beam"):
        ilkit.Beam(40, {0: "pin", 40: "roller"}, panel_points=[0, 50])
    with pytest.raises(ilkit.BeamInputError, match="shear release"):
        ilkit.Beam(40, {0: "fixed", 40: "roller"}, shear_releases=[20], panel_points=[0, 20, 40])
    with pytest.raises(ilkit.BeamInputError, match="two panel points"):
        ilkit.Beam(40, {0: "pin", 40: "roller"}, panel_points=[0, 10, 10.00000000001, 40])
    with pytest.raises(ilkit.BeamInputError, match="list of positions"):
        ilkit.Beam(40, {0: "pin", 40: "roller"}, panel_points=10)
    with pytest.raises(ilkit.BeamInputError, match="influence line"):
        through_floor("M", [0, 10])


def test_a_floor_system_survives_replace_and_in_units_and_reads_back_in_repr():
    beam = ilkit.Beam(40, {0: "pin", 40: "roller"}, units="kN-m", panel_points=[0, "12.5", 25, 40])
    assert "panel_points=[0, 12.5, 25, 40]" in repr(beam)
    assert beam.replace(units="kN-m").panel_points == beam.panel_points
    feet = beam.in_units("kip-ft")
    assert feet.panel_points[1] == F("12.5") / F("0.3048")
    assert beam != beam.replace(panel_points=None)
