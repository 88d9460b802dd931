"""Critical placement against the classic rules and closed forms for a simple span.

Sources, written out in each test:

* the classic rules for a series of moving concentrated loads on a simple
  span (structural-analysis handbooks; common practice): the absolute
  maximum moment occurs under a load when the span centre bisects the
  distance between that load and the resultant of the loads on the span;
  the criterion for the maximum moment at a given section; the maximum end
  shear by moving successive loads onto the support;
* two equal moving loads on a simple span (crane-wheel formula, handbook
  beam tables): M = P (2L - d)^2 / (8L) while d < (2 - sqrt 2) L, else P L / 4;
* a uniform load on the parts of the wanted sign: w times the area of those
  parts, with the areas of a simple span's lines in closed form.
"""

from fractions import Fraction

import numpy as np
import pytest

import ilkit
from ilkit.loads import AxleTrain, KnifeEdge, UniformLoad, envelope, extremes, place

RULES = "classic rules for moving concentrated loads on a simple span (structural-analysis handbooks)"
COMMON = "common practice"


def simple(L, units="kip-ft"):
    return ilkit.Beam(L, {0: "pin", L: "roller"}, units=units)


def positions(spacings):
    return np.concatenate(([0.0], np.cumsum(spacings)))


def moment_on_simple_span(L, xs, loads, a):
    """Closed form: M(a) = sum of P (L - x) a / L for x >= a, P x (L - a) / L for x < a (loads on 0..L)."""
    total = 0.0
    for x, p in zip(xs, loads):
        if 0 <= x <= L:
            total += p * (x * (L - a) / L if x < a else a * (L - x) / L)
    return total


# --------------------------------------------------------- absolute maximum
def rule_absolute_maximum(L, loads, spacings):
    """The classic rule, tried for every load in both orientations; all loads must stay on the span."""
    best = -np.inf
    for orientation in (1, -1):
        ps = np.array(loads[::orientation], dtype=float)
        xs = positions(spacings[::orientation])
        resultant = float(ps @ xs / ps.sum())
        for k in range(len(ps)):
            # span centre halfway between load k and the resultant
            shift = L / 2 - (xs[k] + resultant) / 2
            placed = xs + shift
            assert placed[0] >= 0 and placed[-1] <= L, "the rule needs every load on the span"
            best = max(best, moment_on_simple_span(L, placed, ps, placed[k]))
    return best


@pytest.mark.parametrize(
    ("L", "loads", "spacings"),
    [
        (100, [8, 32, 32], [14, 14]),  # AASHTO design truck at 14 ft (clause 3.6.1.2.2)
        (60, [10, 20, 20, 15], [6, 4, 8]),  # our own four-axle crane trolley
        (45, [12, 12, 30, 5], [3, 9, 2.5]),  # our own permit vehicle
    ],
)
def test_absolute_maximum_moment_follows_the_classic_rule(L, loads, spacings, reference):
    train = AxleTrain(loads, spacings, units="kip-ft")
    env = envelope(simple(L), train, divisions=20)
    expected = rule_absolute_maximum(L, loads, spacings)
    reference(f"absolute maximum moment, {L} ft span, axles {loads} at {spacings} ft", expected=expected,
              computed=env.absolute_maximum_moment.value, rel=1e-9, unit="kip·ft", source=RULES,
              clause="span centre bisects the distance between a load and the resultant; " + COMMON)


def test_design_truck_absolute_maximum_at_100_ft(reference):
    # hand calculation from 3.6.1.2.2: resultant 72 kip at 14/3 ft behind the middle axle; with the
    # span centre halfway, M = 72/L (L/2 - 7/3)^2 - 8 x 14 = 1523.92 kip-ft at x = 50 -+ 7/3
    # (AASHTO Standard Specifications, 17th ed., Appendix A, HS20 truck, 100 ft span: 1524.0 kip-ft,
    # from memory)
    env = envelope(simple(100), AxleTrain([8, 32, 32], [14, 14], units="kip-ft"), divisions=10)
    best = env.absolute_maximum_moment
    L = 100
    hand = 72 / L * (L / 2 - 7 / 3) ** 2 - 8 * 14
    reference("design truck (14 ft), 100 ft span, absolute maximum moment: 72/L (L/2 - 7/3)² - 112", expected=hand,
              computed=best.value, rel=1e-10, unit="kip·ft", source=RULES + "; AASHTO LRFD 3.6.1.2.2 axles",
              clause="hand calculation in the test")
    reference("the same, rounded: HS20 truck, 100 ft span", expected=1524.0, computed=round(best.value, 0),
              unit="kip·ft", source="AASHTO Standard Specifications for Highway Bridges, 17th ed.",
              clause="Appendix A, HS20 truck, 100 ft span", from_memory=True)
    assert min(abs(float(best.quantity.at) - (50 - 7 / 3)), abs(float(best.quantity.at) - (50 + 7 / 3))) < 1e-4


def test_short_span_where_loads_leave_and_the_rule_alone_is_wrong(reference):
    # design truck on a 20 ft span: the rule with all three axles puts the middle axle at
    # L/2 - 7/3 and the front axle 14 ft further, off the span, and would give 99.6 kip-ft.
    # With the axles that stay on: one 32 kip axle at midspan, P L / 4 = 160 kip-ft; two 32 kip axles
    # 14 ft apart give 32 (2L - 14)^2 / (8L) = 135.2 kip-ft (crane formula), less.
    L = 20
    rule_value = 72 / L * (L / 2 - 7 / 3) ** 2 - 8 * 14
    front_axle = L / 2 - 7 / 3 - 14
    assert front_axle < 0 and rule_value == pytest.approx(99.6, abs=0.05)
    env = envelope(simple(L), AxleTrain([8, 32, 32], [14, 14], units="kip-ft"), divisions=10)
    best = env.absolute_maximum_moment
    reference("design truck, 20 ft span: one 32 kip axle at midspan, P L / 4", expected=160.0, computed=best.value,
              rel=1e-12, unit="kip·ft", source=RULES, clause="P L / 4; " + COMMON)
    assert float(best.quantity.at) == 10.0
    counted = [a for a in best.placements[0].axles if a.counted]
    assert [a.load for a in counted] == [32.0] and counted[0].x == pytest.approx(10.0)


# ------------------------------------------------------ criterion at a section
def criterion_maximum_at_section(L, a, loads, spacings):
    """Classic criterion: load k at the section is critical when W_left / a <= W / L <= (W_left + P_k) / a."""
    best = -np.inf
    for orientation in (1, -1):
        ps = np.array(loads[::orientation], dtype=float)
        xs = positions(spacings[::orientation])
        W = ps.sum()
        for k in range(len(ps)):
            placed = xs - xs[k] + a
            assert placed[0] >= 0 and placed[-1] <= L
            w_left = ps[:k].sum()
            if w_left / a <= W / L <= (w_left + ps[k]) / a:
                best = max(best, moment_on_simple_span(L, placed, ps, a))
    return best


@pytest.mark.parametrize(
    ("L", "a", "loads", "spacings"),
    [
        (100, 30, [8, 32, 32], [14, 14]),
        (100, 50, [8, 32, 32], [14, 14]),
        (80, 35, [10, 20, 20, 15], [6, 4, 8]),
        (90, 45, [12, 12, 30, 5], [3, 9, 2.5]),
    ],
)
def test_maximum_at_a_section_follows_the_criterion(L, a, loads, spacings, reference):
    line = simple(L).moment(a)
    found = place(line, AxleTrain(loads, spacings, units="kip-ft"))
    reference(f"largest moment at {a} ft of a {L} ft span, axles {loads} at {spacings} ft",
              expected=criterion_maximum_at_section(L, a, loads, spacings), computed=found.value, rel=1e-12,
              unit="kip·ft", source=RULES, clause="criterion W_left / a <= W / L <= (W_left + P_k) / a; " + COMMON)
    # the governing placement has an axle exactly at the section
    assert any(abs(ax.x - a) < 1e-9 for ax in found.placements[0].axles)


# ------------------------------------------------------------- end shear
def rule_end_shear(L, loads, spacings):
    """Move successive loads onto the left support; loads beyond the span leave it."""
    best = -np.inf
    for orientation in (1, -1):
        ps = np.array(loads[::orientation], dtype=float)
        xs = positions(spacings[::orientation])
        for k in range(len(ps)):
            placed = xs - xs[k]  # load k at the support, the loads before it have left the span
            on = (placed >= 0) & (placed <= L)
            best = max(best, float(ps[on] @ ((L - placed[on]) / L)))
    return best


@pytest.mark.parametrize(
    ("L", "loads", "spacings"),
    [
        (100, [8, 32, 32], [14, 14]),
        (20, [8, 32, 32], [14, 14]),  # short span: the front axle leaves the span
        (30, [40, 80, 80, 80, 80], [8, 5, 5, 5]),
        (12, [10, 25, 25], [9, 4]),
    ],
)
def test_maximum_end_shear_follows_the_rule(L, loads, spacings, reference):
    line = simple(L).shear(0)
    found = place(line, AxleTrain(loads, spacings, units="kip-ft"))
    reference(f"largest end shear, {L} ft span, axles {loads} at {spacings} ft",
              expected=rule_end_shear(L, loads, spacings), computed=found.value, rel=1e-12, unit="kip",
              source=RULES, clause="successive loads moved onto the support; " + COMMON)


def test_design_truck_end_shear_at_100_ft(reference):
    # hand calculation: rear axle at the support, V = 32 + 32 x 86/100 + 8 x 72/100 = 65.28 kip
    # (AASHTO Standard Specifications, 17th ed., Appendix A, HS20, 100 ft: 65.3 kip, from memory)
    found = place(simple(100).shear(0), AxleTrain([8, 32, 32], [14, 14], units="kip-ft"))
    reference("design truck (14 ft), 100 ft span, end shear: 32 + 32 x 0.86 + 8 x 0.72", expected=65.28,
              computed=found.value, rel=1e-12, unit="kip", source=RULES, clause="hand calculation in the test")
    reference("the same, rounded: HS20 truck, 100 ft span", expected=65.3, computed=round(found.value, 1), unit="kip",
              source="AASHTO Standard Specifications for Highway Bridges, 17th ed.",
              clause="Appendix A, HS20 truck, 100 ft span", from_memory=True)


# ------------------------------------------------------------- crane wheels
@pytest.mark.parametrize(("L", "d"), [(20, 3), (12, 4), (30, 10), (10, 5.5), (10, 8), (7, 6)])
def test_two_equal_moving_loads_crane_wheel_formula(L, d, reference):
    # two equal loads P at d: the span centre bisects the distance between one load and the resultant
    # (d/2 away), so the load stands at L/2 - d/4 and M = P (2L - d)^2 / (8L); this beats one load at
    # midspan (P L / 4) only while d < (2 - sqrt 2) L
    P = 50.0
    expected = P * (2 * L - d) ** 2 / (8 * L) if d < (2 - 2**0.5) * L else P * L / 4
    env = envelope(simple(L, "kN-m"), AxleTrain([P, P], [d], units="kN-m"), divisions=8)
    ref = dict(unit="kN·m", source="two equal moving loads on a simple span (crane-wheel formula, handbook beam "
               "tables)", clause="P (2L - d)² / (8L) while d < (2 - √2) L, else P L / 4")
    reference(f"absolute maximum moment, L = {L} m, d = {d} m", expected=expected,
              computed=env.absolute_maximum_moment.value, rel=1e-9, **ref)
    section = L / 2 - d / 4 if d < (2 - 2**0.5) * L else L / 2
    reference(f"largest moment at {section:g} m, L = {L} m, d = {d} m", expected=expected,
              computed=place(simple(L, "kN-m").moment(section), AxleTrain([P, P], [d], units="kN-m")).value,
              rel=1e-12, **ref)


# ------------------------------------------------------------- uniform loads
@pytest.mark.parametrize(("L", "a"), [(20, 5), (20, 10), (33, 2.5), (8, 7)])
def test_uniform_load_over_the_parts_of_each_sign(L, a, reference):
    # simple span: M(a) line area a (L - a) / 2; V(a) line areas (L - a)^2 / (2L) and -a^2 / (2L)
    w = 12.5
    beam = simple(L, "kN-m")
    lane = UniformLoad(w, units="kN-m")
    m = extremes(beam.moment(a), lane)
    ref = dict(rel=1e-12, source="areas of a simple span's influence lines in closed form", clause=COMMON)
    reference(f"uniform load, L = {L}, moment at {a}: w a (L - a) / 2", expected=w * a * (L - a) / 2,
              computed=m.maximum.value, unit="kN·m", **ref)
    assert m.minimum.value == 0.0 and m.minimum.placements[0].patches == ()
    v = extremes(beam.shear(a), lane)
    reference(f"uniform load, L = {L}, shear at {a}: w (L - a)² / (2L) and -w a² / (2L)",
              expected=[w * (L - a) ** 2 / (2 * L), -w * a**2 / (2 * L)], computed=[v.maximum.value, v.minimum.value],
              unit="kN", **ref)
    (patch,) = v.minimum.placements[0].patches
    assert (patch.start, patch.end) == (0.0, a)


def test_uniform_load_equals_load_times_signed_area_on_hinged_beam():
    # any line: the breakable uniform load gives w x positive area and w x negative area
    beam = ilkit.Beam(50, {0: "fixed", 40: "roller"}, hinges=[20], units="kN-m")
    lane = UniformLoad(9.0, units="kN-m")
    for line in (beam.moment(25), beam.shear(35), beam.reaction(40), beam.moment(0), beam.shear(10)):
        e = extremes(line, lane)
        assert e.maximum.value == pytest.approx(9.0 * line.positive_area, rel=1e-12)
        assert e.minimum.value == pytest.approx(9.0 * line.negative_area, rel=1e-12)
        assert sum(p.end - p.start for p in e.maximum.placements[0].patches) <= 50


def test_knife_edge_goes_to_the_largest_ordinate(reference):
    beam = ilkit.Beam(Fraction(30), {0: "pin", 20: "roller"}, units="kN-m")
    line = beam.moment(10)  # largest ordinate L a (L - a) / L = 5 at x = 10; smallest -5 at the tip x = 30
    e = extremes(line, KnifeEdge(120, units="kN-m"))
    reference("knife edge 120 kN: 120 x 5 at the section, 120 x (-5) at the tip", expected=[600.0, -600.0],
              computed=[e.maximum.value, e.minimum.value], rel=1e-12, unit="kN·m",
              source="closed-form moment line of a simple span with an overhang", clause=COMMON)
    assert e.minimum.placements[0].axles[0].x == 30.0
    assert e.maximum.placements[0].direction is None
