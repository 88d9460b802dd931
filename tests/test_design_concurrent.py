"""Concurrent forces: the other actions under the placement of an extreme, checked by independent routes."""

from __future__ import annotations

from fractions import Fraction

import numpy as np
import pytest
from continuous_strategies import elastic_beams
from hypothesis import HealthCheck, given, settings
from scenarios import built_in_girder
from statics import solve_reactions

import ilkit
from ilkit.design import ConcurrentForces, concurrent_forces, concurrent_value
from ilkit.loads import AxleTrain, Combination, LoadModel, UniformLoad, envelope, extremes, hl93, place

# a load model of our own: a four-axle vehicle with a 70 % dynamic allowance on it, and a lane load
VEHICLE = AxleTrain([60, 120, 120, 90], [3.6, (1.2, 4.0), 1.5], units="kN-m", name="four-axle vehicle")
LANE = UniformLoad(9, units="kN-m", name="lane")
OURS = LoadModel("ours", [
    Combination("vehicle + lane", [VEHICLE, LANE], dynamic_allowance=0.7, dynamic_on=["four-axle vehicle"],
                factor=1.1),
    Combination("vehicle alone", [VEHICLE], factor=1.25),
])


# ----------------------------------------------------------------------------- independent statics
def _forces(extreme):
    """The placed loads as point forces ``(x, offset, force)`` (offset -1/+1: just left/right of x) and
    patches ``(start, end, intensity)``, each times its factor."""
    points, patches = [], []
    for p in extreme.placements:
        for a in p.axles:
            if a.counted:
                points.append((_exact(a.x), {"left": -1, "right": 1, None: 0}[a.side], a.load * p.factor))
        patches += [(_exact(s.start), _exact(s.end), s.intensity * p.factor) for s in p.patches]
    return points, patches


def _exact(x):
    """A float position by its decimal text, as ilkit reads floats (37.2 is 186/5, the beam's end)."""
    return Fraction(repr(float(x)))


def _statics(beam, extreme, kind, at, face):
    """``kind`` at ``at`` (``face``) by the statics of the loaded determinate beam, written here: reactions
    of every force from the independent solver of tests/statics.py (a patch by Simpson's rule between the
    beam's points, exact for reactions linear in the load position), then the forces left of the cut."""
    points, patches = _forces(extreme)
    reactions: dict[tuple[str, Fraction], float] = {}

    def add(x, force):
        for key, value in solve_reactions(beam, x).items():
            reactions[key] = reactions.get(key, 0.0) + force * float(value)

    for x, _, force in points:
        add(x, force)
    cuts = sorted({Fraction(0), beam.length, *(s.at for s in beam.supports), *beam.hinges})
    for a, b, w in patches:
        nodes = sorted({a, b, *(c for c in cuts if a < c < b)})
        for p, q in zip(nodes[:-1], nodes[1:]):
            for x, weight in ((p, (q - p) / 6), ((p + q) / 2, 2 * (q - p) / 3), (q, (q - p) / 6)):
                add(x, w * float(weight))
    if kind == "reaction":
        return reactions.get(("R", at), 0.0)
    # the cut: just left of ``at`` on the left face, just right on the right face, at ``at`` otherwise (where
    # only loads placed just left or right of it can stand)
    cut = (at, {"left": -0.5, "right": 0.5, None: 0.0}[face])
    if face is None and at == 0:
        cut = (at, 0.5)
    if face is None and at == beam.length:
        cut = (at, -0.5)
    shear = moment = 0.0
    for s in beam.supports:
        if (s.at, 0) < cut:
            shear += reactions.get(("R", s.at), 0.0)
            moment += reactions.get(("R", s.at), 0.0) * float(at - s.at)
            moment -= reactions.get(("C", s.at), 0.0)  # counter-clockwise couple of a fixed support
    for x, offset, force in points:
        if (x, offset) < cut:
            shear -= force
            moment -= force * float(at - x)
    for a, b, w in patches:
        hi = min(b, at)
        if hi > a:
            shear -= w * float(hi - a)
            moment -= w * float(hi - a) * float(at - (a + hi) / 2)
    return shear if kind == "shear" else moment


@pytest.fixture(scope="module")
def girder_concurrent():
    beam = built_in_girder()
    env = envelope(beam, OURS, divisions=4)
    return beam, env, concurrent_forces(env)


def _extreme_of(env, row):
    """The envelope's extreme behind a row of the concurrent table."""
    return env.extreme(row["quantity"], row["x"], row["extreme"], side=row["side"] or None)


def test_concurrent_forces_equal_the_statics_of_the_placed_loads(girder_concurrent, reference):
    beam, env, found = girder_concurrent
    assert not found.notes
    expected, computed = [], []
    for r in found.frame.to_dict("records"):
        at = beam.position(r["concurrent x"])
        face = r["concurrent side"] or None
        expected.append(_statics(beam, _extreme_of(env, r), r["concurrent quantity"], at, face))
        computed.append(r["concurrent value"])
    reference(f"concurrent moments, shears and reactions of {len(found.extremes)} extremes on a girder built into the "
              "abutment with a hinge (our load model)", expected=expected, computed=computed,
              source="statics of the loaded beam, written in the test (reactions from the independent solver of "
              "tests/statics.py)", clause="equilibrium of the beam and of the part left of each cut", abs=1e-7,
              rel=1e-9)


def test_own_quantity_reproduces_the_extreme_and_faces_differ_by_the_axle(girder_concurrent):
    _, env, found = girder_concurrent
    f = found.frame
    own = f[(f["quantity"] == f["concurrent quantity"]) & (f["x"] == f["concurrent x"])
            & ((f["side"] == f["concurrent side"]) | (f["concurrent side"] == ""))]
    assert len(own) == len(found.extremes)
    assert np.allclose(own["value"], own["concurrent value"], rtol=1e-12, atol=1e-9)
    split = found.moment_with_shear()
    two = split.groupby(["x [m]", "side", "extreme"]).filter(lambda g: len(g) == 2)
    assert len(two) > 0  # the largest moments have an axle at their section
    for _, g in two.groupby(["x [m]", "side", "extreme"]):
        left, right = g.loc[g["V side"] == "left", "V [kN]"].iloc[0], g.loc[g["V side"] == "right", "V [kN]"].iloc[0]
        e = env.extreme("moment", g["x [m]"].iloc[0], g["extreme"].iloc[0], side=g["side"].iloc[0] or None)
        here = [a.load * p.factor for p in e.placements for a in p.axles
                if a.counted and a.side is None and abs(a.x - float(e.quantity.at)) < 1e-9]
        assert left - right == pytest.approx(sum(here), rel=1e-12)


def test_tables(girder_concurrent):
    _, _, found = girder_concurrent
    assert list(found.moment_with_shear().columns) == ["x [m]", "side", "extreme", "case", "dynamic", "M [kN·m]",
                                                       "V side", "V [kN]"]
    assert list(found.shear_with_moment().columns) == ["x [m]", "side", "extreme", "case", "dynamic", "V [kN]",
                                                       "M side", "M [kN·m]"]
    reactions = found.reactions()
    assert list(reactions.columns) == ["quantity", "x [m]", "side", "extreme", "case", "dynamic", "value",
                                       "R at x=0 [kN]", "R at x=31.2 [kN]"]
    assert set(found.frame["dynamic"]) <= {"dynamic allowance 70 %", "no dynamic effect"}
    # the record of factors: the allowance on the vehicle, in the values already (listed, not multiplied)
    assert found.factors.describe() == "IM 70 % (four-axle vehicle)" and found.factors.product == 1.0
    assert len(reactions) == len(found.extremes)
    assert repr(found).startswith("ConcurrentForces(") and "units='kN-m'" in repr(found)
    assert isinstance(found, ConcurrentForces)


# ----------------------------------------------------------------------------- continuous beams
def _gauss(line, a, b):
    """The integral of a piecewise-cubic line by two-point Gauss-Legendre on each piece (exact for cubics)."""
    knots = [k for k in line.breakpoints if a < k < b]
    total = 0.0
    for p, q in zip([a, *knots], [*knots, b]):
        mid, half = (p + q) / 2, (q - p) / 2
        for t in (-1 / np.sqrt(3), 1 / np.sqrt(3)):
            total += half * float(line(mid + half * t))
    return total


def _by_definition(line, extreme, face):
    """The placement's loads times the line's ordinates, written out here."""
    at = float(line.quantity.at)
    total = 0.0
    for p in extreme.placements:
        for a in p.axles:
            if not a.counted:
                continue
            if a.side == "left":
                ordinate = line.left(a.x)
            elif a.side == "right":
                ordinate = line.right(a.x)
            elif line.quantity.kind == "shear" and a.x == at:
                # the cut left of the axle gives the right-hand ordinate, right of it the left-hand one
                ordinate = line.right(a.x) if face == "left" else line.left(a.x)
            else:
                ordinate = line(a.x)
            total += p.factor * a.load * float(ordinate)
        total += sum(p.factor * s.intensity * _gauss(line, s.start, s.end) for s in p.patches)
    return total


@pytest.mark.parametrize("model", [hl93(), OURS], ids=["HL-93", "ours"])
def test_continuous_girder_concurrent_forces_by_definition(model, reference):
    beam = ilkit.Beam(96, {0: "pin", 28.5: "roller", 67.5: "roller", 96: "roller"}, EI=6.4e6, units="kN-m")
    env = envelope(beam, model, divisions=5)
    found = concurrent_forces(env)
    expected, computed = [], []
    for r in found.frame.to_dict("records"):
        e = _extreme_of(env, r)
        face = r["concurrent side"] or None
        kind = r["concurrent quantity"]
        line = beam.line(kind, r["concurrent x"], face if kind != "reaction" else None)
        expected.append(_by_definition(line, e, face))
        computed.append(r["concurrent value"])
    reference(f"{model.name} on a three-span continuous girder: concurrent moments, shears and reactions of every "
              "extreme", expected=expected, computed=computed, source="the definition, written in the test: loads "
              "times ordinates, stretches by Gauss-Legendre quadrature on each cubic piece",
              clause="Müller-Breslau: effect = Σ P·η(x) + ∫ q·η dx", abs=1e-7, rel=1e-9)


@settings(max_examples=15, deadline=None, suppress_health_check=[HealthCheck.too_slow])
@given(beam=elastic_beams(max_spans=3, min_degree=0))
def test_concurrent_reactions_balance_the_placed_loads(beam):
    """Law: under any placement the concurrent reactions add up to the factored loads on the beam."""
    beam = beam.replace(units="kN-m")
    at = beam.length * Fraction(3, 7)
    try:
        line = beam.moment(at)
    except ilkit.SideRequiredError:  # regression: the section fell on a rotational spring, where M jumps
        line = beam.moment(at, side="left")
    for e in (place(line, OURS, "max", beam=beam), place(line, OURS, "min", beam=beam)):
        found = concurrent_forces(e, beam)
        reactions = found.frame.loc[found.frame["concurrent quantity"] == "reaction", "concurrent value"].sum()
        points, patches = _forces(e)
        total = sum(f for _, _, f in points) + sum(w * float(b - a) for a, b, w in patches)
        assert reactions == pytest.approx(total, rel=1e-9, abs=1e-9 * max(total, 1))


def test_one_extreme_and_the_value_of_one_line():
    beam = ilkit.Beam(40, {0: "pin", 18: "roller", 40: "roller"}, EI=1e6, units="kN-m")
    both = extremes(beam.moment(9), OURS, beam=beam)
    found = concurrent_forces(both, beam)
    assert set(found.frame["extreme"]) == {"max", "min"}
    m = both.maximum
    assert concurrent_value(beam.moment(9), m.placements) == pytest.approx(m.value, rel=1e-12)
    assert concurrent_value(beam.reaction(18), m.placements) == pytest.approx(
        found.frame.loc[(found.frame["extreme"] == "max") & (found.frame["concurrent x"] == 18)
                        & (found.frame["concurrent quantity"] == "reaction"), "concurrent value"].iloc[0])
    with pytest.raises(ilkit.SideRequiredError, match="stands exactly at the section"):
        concurrent_value(beam.shear(9), m.placements)
    # at an interior support the shear jumps: both faces, for a reaction extreme too
    r = concurrent_forces(place(beam.reaction(18), OURS, beam=beam), beam)
    assert set(r.frame.loc[r.frame["concurrent quantity"] == "shear", "concurrent side"]) == {"left", "right"}


def test_bad_input():
    beam = ilkit.Beam(40, {0: "pin", 18: "roller", 40: "roller"}, EI=1e6, units="kN-m")
    other = ilkit.Beam(40, {0: "pin", 20: "roller", 40: "roller"}, EI=1e6, units="kN-m")
    e = place(beam.moment(9), OURS)
    with pytest.raises(ilkit.LoadInputError, match="give the beam the extremes were found on"):
        concurrent_forces(e)
    with pytest.raises(ilkit.LoadInputError, match="found on another beam"):
        concurrent_forces(e, other)
    with pytest.raises(ilkit.LoadInputError, match="is in kN-m and the beam in kip-ft"):
        concurrent_forces(e, beam.in_units("kip-ft"))
    with pytest.raises(ilkit.LoadInputError, match="give an Envelope, an Extreme"):
        concurrent_forces([beam.moment(9)], beam)
    with pytest.raises(ilkit.LoadInputError, match="give an Envelope, an Extreme"):
        concurrent_forces("max", beam)
    with pytest.raises(ilkit.LoadInputError, match="no extremes given"):
        concurrent_forces([], beam)
    with pytest.raises(ilkit.LoadInputError, match="beam must be a Beam"):
        concurrent_forces(e, "beam")
    with pytest.raises(ilkit.LoadInputError, match="another beam than the one given"):
        concurrent_forces(envelope(beam, OURS, divisions=1), other)


def test_girder_loaded_through_a_floor_system():
    """On a girder loaded through floor beams every 12 m: each extreme's own quantity is reproduced, the
    reactions balance the loads on the deck, and at a floor beam the shear's faces differ by what the floor
    beam brings down (statics of the part between the faces)."""
    beam = ilkit.Beam(72, {0: "pin", 36: "roller", 72: "roller"}, EI=2e6, units="kN-m",
                      panel_points=list(range(0, 73, 12)))
    found = concurrent_forces(envelope(beam, OURS, divisions=3))
    f = found.frame
    own = f[(f["quantity"] == f["concurrent quantity"]) & (f["x"] == f["concurrent x"])
            & ((f["side"] == f["concurrent side"]) | (f["concurrent side"] == ""))]
    assert np.allclose(own["value"], own["concurrent value"], rtol=1e-12, atol=1e-9)
    for e in found.extremes:
        total = sum(f for _, _, f in _forces(e)[0]) + sum(w * float(b - a) for a, b, w in _forces(e)[1])
        reactions = concurrent_forces(e, beam).frame
        assert reactions.loc[reactions["concurrent quantity"] == "reaction", "concurrent value"].sum() == \
            pytest.approx(total, rel=1e-9, abs=1e-9)

    def brought_down(e, p):
        """What the floor beam at p carries: each load times its stringer's reaction there (simple spans of 12)."""
        def share(x):
            return max(0.0, 1 - abs(float(x) - p) / 12)
        points, patches = _forces(e)
        out = sum(f * share(x) for x, _, f in points)
        for a, b, w in patches:  # the share is linear between p - 12, p and p + 12: Simpson is exact
            cuts = sorted({float(a), float(b), *(c for c in (p - 12, p, p + 12) if float(a) < c < float(b))})
            out += sum(w * (hi - lo) / 6 * (share(lo) + 4 * share((lo + hi) / 2) + share(hi))
                       for lo, hi in zip(cuts[:-1], cuts[1:]))
        return out

    checked = 0
    for p in (12, 24, 48, 60):
        for which in ("max", "min"):
            e = envelope(beam, OURS, divisions=3, at=[p]).extreme("moment", p, which)
            faces = concurrent_forces(e, beam).frame
            v = faces[faces["concurrent quantity"] == "shear"].set_index("concurrent side")["concurrent value"]
            assert v["left"] - v["right"] == pytest.approx(brought_down(e, p), rel=1e-9, abs=1e-9)
            checked += 1
    assert checked == 8


def test_a_girders_concurrent_forces_are_one_lanes_times_the_share_of_each_action():
    """Moments × gM, shears and reactions × gV: a factor on the whole load does not move the placement, so the
    girder's concurrent forces are one lane's scaled (derived: every effect is linear in the loads)."""
    from ilkit.design import GirderLiveLoad, given_distribution

    beam = ilkit.Beam(150, {0: "pin", 70: "roller", 150: "roller"}, EI=2e6, units="kip-ft")
    lane = concurrent_forces([extremes(beam.moment(70), hl93(), beam=beam),
                              extremes(beam.shear(70, side="right"), hl93(), beam=beam)], beam)
    live = GirderLiveLoad(hl93(), distribution=given_distribution(0.62, 0.81, includes_multiple_presence=True))
    girder = lane.for_girder(live)
    share = {"moment": 0.62, "shear": 0.81, "reaction": 0.81}
    a, b = lane.frame, girder.frame
    assert np.allclose(b["value"], a["value"] * a["quantity"].map(share), rtol=1e-15)
    assert np.allclose(b["concurrent value"], a["concurrent value"] * a["concurrent quantity"].map(share),
                       rtol=1e-15)
    assert girder.girder == live.name and lane.girder == ""
    assert girder.factors == lane.factors  # the dynamic allowance, already in the values
    assert "moments × gM 0.62, shears and reactions × gV 0.81" in girder.notes[-1]
    with pytest.raises(ilkit.LoadInputError, match="already those of"):
        girder.for_girder(live)
    with pytest.raises(ilkit.LoadInputError, match="give a GirderLiveLoad"):
        lane.for_girder(0.62)
