"""Lanes on a deck: AASHTO design lanes and multiple presence, EN 1991-2 notional lanes (ilkit.design.lanes)."""

from __future__ import annotations

import pytest

import ilkit
from ilkit.design import design_lanes, multiple_presence_factor, notional_lanes
from ilkit.loads import multiple_presence

AASHTO = "AASHTO LRFD Bridge Design Specifications, 9th edition (2020)"
EN = "EN 1991-2:2003"


@pytest.mark.parametrize(
    ("width", "count", "lane"),
    [
        (11.0, 1, 11.0),  # narrower than one lane: one lane as wide as the roadway (common practice)
        (12.0, 1, 12.0),  # INT(12/12) = 1
        (19.99, 1, 12.0),  # INT(19.99/12) = 1
        (20.0, 2, 10.0),  # 20 to 24 ft: two lanes, each half the roadway
        (22.0, 2, 11.0),
        (24.0, 2, 12.0),
        (35.0, 2, 12.0),  # INT(35/12) = 2
        (36.0, 3, 12.0),
        (44.0, 3, 12.0),
        (48.0, 4, 12.0),
    ],
)
def test_design_lanes_from_the_roadway_width(reference, width, count, lane):
    lanes = design_lanes(width)
    reference(f"design lanes on a {width} ft roadway", expected=(count, lane), computed=(lanes.count, lanes.width),
              source=AASHTO, clause="3.6.1.1.1 (number of design lanes INT(w/12); 20-24 ft: two lanes of w/2)",
              from_memory=True, rel=1e-12)
    assert lanes.from_memory and "3.6.1.1.1" in lanes.source


def test_design_lanes_in_metres_and_as_a_quantity():
    # 36 ft = 10.9728 m: three lanes of 12 ft = 3.6576 m
    metric = design_lanes(10.9728, units="kN-m")
    assert (metric.count, metric.width) == (3, pytest.approx(3.6576))
    pint = pytest.importorskip("pint")
    u = pint.UnitRegistry()
    assert design_lanes(36 * u.ft).count == 3
    assert design_lanes(10.9728 * u.m).count == 3  # converted exactly to 36 ft
    assert repr(design_lanes(36)) == "DesignLanes(3 lanes of 12 ft on a 36 ft roadway)"


def test_multiple_presence_factors(reference):
    for lanes, m in ((1, 1.20), (2, 1.00), (3, 0.85), (4, 0.65), (6, 0.65)):
        factor = multiple_presence_factor(lanes)
        reference(f"m for {lanes} loaded lanes", expected=m, computed=factor.value, source=AASHTO,
                  clause="Table 3.6.1.1.2-1", from_memory=True)
        assert factor.kind == "multiple presence" and factor.from_memory and factor.value == multiple_presence(lanes)
    assert design_lanes(36).multiple_presence().value == 0.85
    assert design_lanes(36).multiple_presence(1).value == 1.20


@pytest.mark.parametrize(
    ("width", "count", "lane", "remaining"),
    [
        (4.0, 1, 3.0, 1.0),  # w < 5.4 m: one lane of 3 m, remaining w - 3
        (5.4, 2, 2.7, 0.0),  # 5.4 <= w < 6 m: two lanes of w/2
        (5.8, 2, 2.9, 0.0),
        (6.0, 2, 3.0, 0.0),  # w >= 6 m: INT(w/3) lanes of 3 m
        (11.0, 3, 3.0, 2.0),
        (12.0, 4, 3.0, 0.0),
    ],
)
def test_notional_lanes(reference, width, count, lane, remaining):
    lanes = notional_lanes(width)
    reference(f"notional lanes on a {width} m carriageway", expected=(count, lane, remaining),
              computed=(lanes.count, lanes.width, lanes.remaining), source=EN, clause="4.2.3, Table 4.1",
              from_memory=True, abs=1e-12)


@pytest.mark.parametrize(
    ("call", "match"),
    [
        (lambda: design_lanes(-3), "roadway_width: must be greater than 0"),
        (lambda: design_lanes("wide"), "cannot read"),
        (lambda: design_lanes(36, units="furlongs"), "units must be one of"),
        (lambda: notional_lanes(2.0), "narrower than one notional lane"),
        (lambda: multiple_presence_factor(0), "whole number >= 1"),
        (lambda: design_lanes(36).multiple_presence(4), "from 1 to 3"),
    ],
)
def test_bad_lane_input_is_refused(call, match):
    with pytest.raises(ilkit.DesignInputError, match=match):
        call()
