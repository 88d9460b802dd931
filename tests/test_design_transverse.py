"""Transverse lines across a deck and the lanes placed across them (ilkit.design.transverse).

The lever rule is checked by statics written out here; the rigid cross-section by its formula; the exact
lane search against brute force over every placement on a grid that holds the exact optimum (geometry in
multiples of the grid step, so every vertex of the search lies on it: 0.25 ft, which also holds lanes of
half a roadway of 20 to 24 ft).
"""

from __future__ import annotations

import itertools

import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

import ilkit
from ilkit.design import (
    CrossSection,
    design_lanes,
    multiple_presence_factor,
    place_design_lanes,
    place_notional_lanes,
    transverse_line,
)
from tests.profiles import examples

SECTION = CrossSection(4, 8.0, 3.0, 1.5)  # girders at y = 3, 11, 19, 27 ft; roadway 1.5 to 28.5 ft


def test_lever_rule_by_statics(reference):
    # the deck between girders 1 and 2 is a simple span with the left overhang as a cantilever: a load P at y
    # gives R1 = P (y2 - y) / S (moments about girder 2), for any y left of girder 2; R2 = P (y - y1) / S there,
    # and by the span between girders 2 and 3, R2 = P (y3 - y) / S right of girder 2 (derived in this test)
    y1, y2, y3, S = 3.0, 11.0, 19.0, 8.0
    exterior, interior = transverse_line(SECTION, 1), transverse_line(SECTION, 2)
    for y in (0.0, 1.5, 3.0, 6.2, 10.9, 11.0):
        reference(f"lever rule, girder 1, load at y = {y} ft", expected=(y2 - y) / S, computed=exterior(y),
                  source="statics of the deck (derived in this test)", clause="moments about girder 2", rel=1e-12)
        reference(f"lever rule, girder 2, load at y = {y} ft", expected=(y - y1) / S, computed=interior(y),
                  source="statics of the deck (derived in this test)", clause="moments about girder 1",
                  rel=1e-12, abs=1e-15)
    for y in (11.0, 14.0, 19.0):
        reference(f"lever rule, girder 2, load at y = {y} ft", expected=(y3 - y) / S, computed=interior(y),
                  source="statics of the deck (derived in this test)", clause="moments about girder 3",
                  rel=1e-12, abs=1e-15)
    for y in (19.0, 25.0, 30.0):
        assert exterior(y) == 0.0 and interior(y) == 0.0  # the deck beyond the neighbouring girders
    # the exterior girder, one lane: the outer wheel 2 ft from the barrier (y = 3.5), the other 6 ft further;
    # the share of one lane is the mean of the two wheel lines' reactions, times m = 1.20
    e1, e2 = 1.5 + 2.0, 1.5 + 8.0
    placed = place_design_lanes(exterior, loaded=1)
    reference("lever rule, exterior girder, one lane (share × m)",
              expected=1.20 * ((y2 - e1) + (y2 - e2)) / (2 * S), computed=placed.share,
              source="statics of the deck (derived in this test); AASHTO LRFD 3.6.1.3.1 (wheel 2 ft from the "
                     "lane edge) and Table 3.6.1.1.2-1 (m = 1.20), from memory", clause="lever rule", rel=1e-12)
    assert placed.wheels == ((e1, e2),) and placed.factor.includes == ("lanes", "multiple presence")
    # interior girder, two lanes: one wheel on the girder, the other 6 ft away, the second vehicle's wheel 4 ft
    # from it (2 ft to each lane edge): shares (1 + 2/8)/2 and (4/8 + 0)/2 ... the search finds the best
    both = place_design_lanes(interior, loaded=2)
    assert both.share == pytest.approx(max(_brute(interior, 2)), rel=1e-12)


def test_rigid_cross_section_formula(reference):
    # R = NL/Nb + X_ext Σe / Σx² (AASHTO LRFD 4.6.2.2.2d-1, from memory): girders at x = -12, -4, 4, 12 ft from
    # their centre (y = 15 ft), Σx² = 2 (144 + 16) = 320
    line = transverse_line(SECTION, 1, "rigid")
    for y in (1.5, 6.5, 15.0, 28.5):
        e = y - 15.0
        reference(f"rigid section, girder 1, load at y = {y} ft", expected=1 / 4 + (-12.0) * e / 320.0,
                  computed=line(y), source="AASHTO LRFD Bridge Design Specifications, 9th edition",
                  clause="4.6.2.2.2d-1, one load", from_memory=True, rel=1e-12, abs=1e-15)
    # one lane, the vehicle's wheel lines at 3.5 and 9.5 ft (its centre 6.5 ft, e = -8.5): m (1/4 + 12 × 8.5 / 320)
    one = place_design_lanes(line, loaded=1)
    reference("rigid section, exterior girder, one lane, with m", expected=1.20 * (0.25 + 12 * 8.5 / 320),
              computed=one.share, source="AASHTO LRFD Bridge Design Specifications, 9th edition",
              clause="4.6.2.2.2d-1 with Table 3.6.1.1.2-1", from_memory=True, rel=1e-12)


def test_ordinates_given_from_a_grillage():
    # ordinates of a refined model (input data of this test), linear between the points
    points = [(0.0, 1.3), (3.0, 1.0), (11.0, 0.45), (19.0, 0.1), (30.0, -0.1)]
    line = transverse_line(SECTION, 1, ordinates=points)
    assert line.method == "given" and line(7.0) == pytest.approx(0.725) and line(30.0) == pytest.approx(-0.1)
    assert place_design_lanes(line).share == pytest.approx(max(
        multiple_presence_factor(n).value * max(_brute(line, n)) for n in (1, 2)), rel=1e-12)


@pytest.mark.parametrize(
    ("call", "match"),
    [
        (lambda: CrossSection(1, 8.0, 3.0), "whole number from 2 to 200"),
        (lambda: CrossSection(4, [8.0, 8.0], 3.0), "4 girders need 3 spacings"),
        (lambda: CrossSection(4, -8.0, 3.0), "spacing: must be greater than 0"),
        (lambda: CrossSection(2, 4.0, 1.0, 3.0), "leave no roadway"),
        (lambda: transverse_line(SECTION, 5), "from 1 to 4"),
        (lambda: transverse_line(SECTION, 1, "grillage"), "method must be"),
        (lambda: transverse_line(SECTION, 1, "given"), "needs ordinates"),
        (lambda: transverse_line(SECTION, 1, ordinates=[(5.0, 1.0), (20.0, 0.0)]), "must cover the roadway"),
        (lambda: transverse_line(SECTION, 1, ordinates=[(0, 1), (0, 2), (30, 0)]), "same y"),
        (lambda: place_design_lanes(transverse_line(SECTION, 1), multiple_presence=False), "give loaded="),
        (lambda: place_design_lanes(transverse_line(SECTION, 1), loaded=3), "from 1 to 2"),
        (lambda: place_design_lanes(transverse_line(SECTION, 1), wheel_spacing=10.0), "needs a lane 14 wide"),
    ],
)
def test_bad_transverse_input_is_refused(call, match):
    with pytest.raises(ilkit.DesignInputError, match=match):
        call()


# ------------------------------------------------------------------ brute force
def _brute(line, n, step=0.25, s=6.0, c=2.0):
    """Every placement of n vehicles on the grid: lanes of the design width anywhere on the roadway (their
    left edges on the grid), each vehicle anywhere in its lane with 2 ft to the lane edges."""
    r0, r1 = line.section.roadway
    width = design_lanes(line.section.roadway_width).width
    edges = np.arange(r0, r1 - width + 1e-9, step)
    offsets = np.arange(c, width - s - c + 1e-9, step)
    best = []
    for lanes in itertools.combinations(edges, n):
        if any(b - a < width - 1e-9 for a, b in zip(lanes, lanes[1:])):
            continue
        total = 0.0
        for lane in lanes:
            wheels = lane + offsets
            total += max((line(wheels) + line(wheels + s)) / 2)
        best.append(total)
    return best


@settings(max_examples=examples(25), deadline=None)
@given(
    girders=st.integers(3, 6),
    spacing=st.integers(8, 24).map(lambda k: k / 2),  # 4.0 to 12.0 ft in steps of 0.5
    overhang=st.integers(2, 8).map(lambda k: k / 2),
    barrier=st.integers(1, 4).map(lambda k: k / 2),
    method=st.sampled_from(["lever rule", "rigid"]),
    data=st.data(),
)
def test_lane_search_equals_brute_force(girders, spacing, overhang, barrier, method, data):
    section = CrossSection(girders, spacing, overhang, barrier)
    if section.roadway_width < 12.0:
        return
    girder = data.draw(st.integers(1, girders))
    line = transverse_line(section, girder, method)
    count = min(design_lanes(section.roadway_width).count, 2)
    for n in range(1, count + 1):
        found = place_design_lanes(line, loaded=n, multiple_presence=False)
        brute = _brute(line, n)
        assert found.share == pytest.approx(max(brute), rel=1e-9, abs=1e-12), (n, found)
        # the placement found is one the rules allow, and its value is the share reported
        shares = [(line(a) + line(b)) / 2 for a, b in found.wheels]
        assert sum(shares) == pytest.approx(found.share, rel=1e-12, abs=1e-12)
        r0, r1 = section.roadway
        for (a, b), (w1, w2) in zip(found.lanes, found.wheels):
            assert r0 - 1e-9 <= a and b <= r1 + 1e-9 and a + 2 - 1e-9 <= w1 and w2 <= b - 2 + 1e-9
        assert all(p[1] <= q[0] + 1e-9 for p, q in zip(found.lanes, found.lanes[1:]))


def test_three_lanes_at_least_as_good_as_any_sampled_placement():
    section = CrossSection(6, 8.0, 3.0, 1.5)  # roadway 40 ft: three lanes
    line = transverse_line(section, 3, "lever rule")
    found = place_design_lanes(line, loaded=3, multiple_presence=False)
    rng = np.random.default_rng(7)
    r0, r1 = section.roadway
    for _ in range(2000):
        lanes = np.sort(rng.uniform(r0, r1 - 12.0, 3))
        if np.any(np.diff(lanes) < 12.0):
            continue
        wheels = lanes + rng.uniform(2.0, 4.0, 3)
        value = sum((line(w) + line(w + 6.0)) / 2 for w in wheels)
        assert value <= found.share + 1e-12


# ---------------------------------------------------------------- EN 1991-2
def _brute_en(line, step=0.1):
    r0, r1 = line.section.roadway
    best = 0.0
    edges = np.arange(r0, r1 - 3.0 + 1e-9, step)
    share = {p: (line(p + 0.5) + line(p + 2.5)) / 2 for p in edges}
    for n in (1, 2, 3):
        for lanes in itertools.combinations(edges, n):
            if any(b - a < 3.0 - 1e-9 for a, b in zip(lanes, lanes[1:])):
                continue
            values = sorted((share[p] for p in lanes), reverse=True)
            best = max(best, sum(q * v for q, v in zip((300.0, 200.0, 100.0), values)))
    return best


def test_notional_lanes_tandems_by_brute_force_and_uniform_load_by_hand(reference):
    section = CrossSection(4, 2.5, 1.0, 0.5, units="kN-m")  # girders at 1, 3.5, 6, 8.5 m; carriageway 0.5 to 9 m
    line = transverse_line(section, 2, "lever rule")
    placed = place_notional_lanes(line)
    assert placed.axle == pytest.approx(_brute_en(line), rel=1e-9)
    # the uniform load: 9 kN/m² on lane 1, 2.5 kN/m² elsewhere, only where the share is positive (1 to 6 m: a
    # triangle of height 1 over 5 m, area 2.5 m); lane 1 (3 m) is best centred on girder 2 (3.5 m): its area
    # 2.5 - 2 × (1/2 × 1 × 1/2.5) = 2.1 m (derived in this test)
    reference("LM1 uniform load on girder 2 by the lever rule", expected=(9.0 - 2.5) * 2.1 + 2.5 * 2.5,
              computed=placed.uniform, source="EN 1991-2:2003 (from memory); the area derived in this test",
              clause="4.3.2, Table 4.2: q1 = 9, qr = 2.5 kN/m²", rel=1e-12)
    model = placed.model()
    assert model.cases[0].dynamic.kind == "included"
    assert model.cases[0].parts[0].loads == (pytest.approx(placed.axle),) * 2
