"""Published load models against hand calculations from their definitions.

Each test names the clause; values the project recalled rather than read are
marked "from memory" (see the docstrings of ilkit.loads.models).  Hand
calculations use the closed-form lines of a simple span (M(a) ordinate
x (L - a) / L left of the section, a (L - x) / L right of it) and of two
equal continuous spans (tests/closed_forms.py).
"""

from __future__ import annotations

import math

import numpy as np
import pytest
import sympy as sp
from closed_forms import moment as cmoment
from closed_forms import reaction as creaction

import ilkit
from ilkit.loads import (
    ALPHA_VALUES,
    alternate_live_load,
    cooper,
    cooper_train,
    design_tandem,
    design_truck,
    envelope,
    extremes,
    fatigue_truck,
    hl93,
    lm1,
    lm2,
    lm71,
    multiple_presence,
    phi2,
    phi3,
    place,
    sw0,
    sw2,
    two_design_trucks,
)

AASHTO = "AASHTO LRFD Bridge Design Specifications"
EN = "EN 1991-2 (Eurocode 1, traffic loads on bridges)"
AREMA = "AREMA Manual for Railway Engineering, Chapter 15"
HAND = "; hand calculation from the definition (simple-span lines in closed form)"


def simple(L, units="kip-ft"):
    return ilkit.Beam(L, {0: "pin", L: "roller"}, units=units)


def ordinate(L, a, x):
    """Moment influence ordinate of a simple span at section a for a load at x (0 off the span)."""
    x = np.asarray(x, dtype=float)
    inside = (x >= 0) & (x <= L)
    return np.where(inside, np.where(x < a, x * (L - a) / L, a * (L - x) / L), 0.0)


# ====================================================================== AASHTO
def test_definitions_of_the_aashto_vehicles(reference):
    # 3.6.1.2.2 (seen): 8, 32, 32 kip; 14 ft; 14 to 30 ft.  3.6.1.2.3 (seen): 2 x 25 kip at 4 ft
    truck = design_truck()
    reference("design truck axles [kip]", expected=(8.0, 32.0, 32.0), computed=truck.loads, source=AASHTO,
              clause="3.6.1.2.2")
    reference("design truck spacings [ft]: 14; 14 to 30", expected=((14.0, 14.0), (14.0, 30.0)),
              computed=truck.spacings, source=AASHTO, clause="3.6.1.2.2")
    reference("design tandem: 2 x 25 kip at 4 ft", expected=((25.0, 25.0), ((4.0, 4.0),)),
              computed=(design_tandem().loads, design_tandem().spacings), source=AASHTO, clause="3.6.1.2.3")
    # 3.6.1.3.1 (from memory): two trucks at least 50 ft apart, rear spacing 14 ft
    two = two_design_trucks()
    reference("two design trucks: rear spacing 14 ft, at least 50 ft apart", expected=((14.0, 14.0), (50.0, math.inf)),
              computed=(two.spacings[1], two.spacings[2]), source=AASHTO, clause="3.6.1.3.1", from_memory=True)
    assert truck.units.name == "kip-ft"


def test_hl93_midspan_moment_of_a_100_ft_span_by_hand(reference):
    # 3.6.1.2: truck with the 32 kip axle at the section and the other 32 kip axle 14 ft away (the
    # 14 ft rear spacing governs on a simple span), 8 kip axle 14 ft beyond on the heavy side:
    # 32 x 25 + 32 x 18 + 8 x 18 = 1520 kip-ft; IM 33 % (Table 3.6.2.1-1, seen); lane 0.64 L^2 / 8 = 800
    found = place(simple(100).moment(50), hl93())
    reference("HL-93, 100 ft simple span, midspan moment: 1.33 x 1520 + 800", expected=1.33 * 1520 + 800,
              computed=found.value, rel=1e-12, unit="kip·ft", source=AASHTO + HAND,
              clause="3.6.1.2.2, 3.6.1.2.4, Table 3.6.2.1-1")
    reference("HL-93 governing case, 100 ft midspan moment", expected="design truck + lane", computed=found.case,
              source=AASHTO, clause="3.6.1.2.1")
    truck, lane = found.placements
    reference("IM on the truck 33 %, none on the lane", expected=[1.33, 1.0], computed=[truck.factor, lane.factor],
              rel=1e-12, source=AASHTO, clause="Table 3.6.2.1-1, 3.6.1.2.4")
    assert truck.spacings == pytest.approx((14.0, 14.0))
    reference("lane load 0.64 L² / 8", expected=800.0, computed=lane.effect, rel=1e-12, unit="kip·ft",
              source=AASHTO + HAND, clause="3.6.1.2.4")


def test_hl93_end_shear_of_a_100_ft_span_by_hand(reference):
    # Sources: AASHTO LRFD 3.6.1.2.2 (seen): design truck 8, 32, 32 kip, 14 ft, then 14 to 30 ft;
    # 3.6.1.2.4 (seen): design lane 0.64 kip/ft, no dynamic allowance; Table 3.6.2.1-1 (seen): IM 33 % on
    # the truck.  Derived in this test: the end-shear line of a simple span is 1 - x/L, so the truck stands
    # with a 32 kip axle at the support, the other 32 kip axle 14 ft in (the shortest rear spacing) and the
    # 8 kip axle 14 ft further: 32 + 32 x 0.86 + 8 x 0.72 = 65.28 kip (the HS20 shear of a 100 ft span in
    # the appendix of the AASHTO Standard Specifications, 17th ed., 65.3 kip, agrees: from memory); the
    # lane over the whole span: 0.64 x 100 / 2 = 32 kip.
    found = place(simple(100).shear(0), hl93())
    reference("HL-93, 100 ft simple span, end shear: 1.33 x 65.28 + 32", expected=1.33 * 65.28 + 32.0,
              computed=found.value, rel=1e-12, unit="kip", source=AASHTO + HAND, clause="3.6.1.2")


def test_tandem_governs_the_midspan_moment_of_a_20_ft_span(reference):
    # Sources: AASHTO LRFD 3.6.1.2.3 (seen): design tandem 2 x 25 kip, 4 ft apart; 3.6.1.2.2 (seen): design
    # truck; 3.6.1.2.4 (seen): lane 0.64 kip/ft; Table 3.6.2.1-1 (seen): IM 33 % on tandem and truck.
    # Derived in this test from the midspan moment line of a simple span (ordinate x/2, peak L/4 = 5 ft at
    # midspan, 3 ft at 4 ft from it): tandem with one axle at midspan: 25 x 5 + 25 x 3 = 200 kip-ft; truck:
    # one 32 kip axle at midspan, 32 x 5 = 160 kip-ft (every other axle is 14 ft or more away, off the
    # span); lane 0.64 x 20^2 / 8 = 32 kip-ft.  So the tandem governs: 1.33 x 200 + 32.
    found = place(simple(20).moment(10), hl93())
    reference("HL-93, 20 ft simple span: the tandem governs", expected="design tandem + lane", computed=found.case,
              source=AASHTO + HAND, clause="3.6.1.2.1")
    reference("HL-93, 20 ft midspan moment: 1.33 x 200 + 32", expected=1.33 * 200 + 32, computed=found.value,
              rel=1e-12, unit="kip·ft", source=AASHTO + HAND, clause="3.6.1.2.3, 3.6.1.2.4")


def test_fatigue_truck_on_a_100_ft_span(reference):
    # 3.6.1.4.1 (seen): rear spacing 30 ft; IM 15 % (from memory); no lane.  32 kip axle at midspan,
    # the other 32 kip axle 30 ft away (ordinate 10), the 8 kip axle 14 ft on the other side (18):
    # 800 + 320 + 144 = 1264 kip-ft
    found = place(simple(100).moment(50), fatigue_truck())
    reference("fatigue truck, 100 ft midspan moment: 1.15 x 1264", expected=1.15 * 1264, computed=found.value,
              rel=1e-12, unit="kip·ft", source=AASHTO + HAND, clause="3.6.1.4.1; IM 15 % from memory",
              from_memory=True)
    assert sorted(found.placements[0].spacings) == pytest.approx([14.0, 30.0])


def test_multiple_presence_factors_from_memory(reference):
    # Table 3.6.1.1.2-1, from memory
    reference("multiple presence factors for 1, 2, 3, 4, 6 lanes", expected=[1.20, 1.00, 0.85, 0.65, 0.65],
              computed=[multiple_presence(n) for n in (1, 2, 3, 4, 6)], source=AASHTO, clause="Table 3.6.1.1.2-1",
              from_memory=True)
    base = place(simple(60).moment(30), hl93()).value
    assert place(simple(60).moment(30), hl93(factor=multiple_presence(1))).value == pytest.approx(1.2 * base)


def test_memory_values_can_be_overridden():
    base = hl93()
    changed = hl93(two_truck_factor=1.0, two_truck_gap=60, dynamic_allowance=0.0)
    names = [c.name for c in changed.cases]
    assert names[2] == "100 % (two design trucks + lane)" and [c.name for c in base.cases][2].startswith("90 %")
    assert changed.cases[2].parts[0].spacings[2] == (60.0, math.inf)
    assert place(simple(100).moment(50), changed).value == pytest.approx(1520 + 800)


def test_rear_spacing_longer_than_14_ft_can_govern_on_continuous_spans(reference):
    # negative moment over the pier of two 40 ft spans (handbook closed form, tests/closed_forms.py):
    # M_B = -x (L^2 - x^2) / (4 L^2) in span 1 and mirrored in span 2; the line is negative in both
    # spans, so a truck straddling the pier wants its rear axle in the far span: the search must pick a
    # rear spacing above 14 ft.  Checked against a dense grid of positions and spacings.
    L = 40
    line = cmoment(L, L)
    found = place(line, design_truck(), "min")
    (spacing_rear,) = [s for s in found.placements[0].spacings if abs(s - 14.0) > 1e-9] or [14.0]
    best = 0.0
    xs = np.arange(-60, 2 * L + 1, 0.01)
    for rear in np.arange(14, 30.001, 0.25):
        for offsets in (np.array([0, 14, 14 + rear]), np.array([0, rear, rear + 14])):
            eff = line(xs[:, None] + offsets[None, :]) @ (
                np.array([8, 32, 32]) if offsets[1] == 14 else np.array([32, 32, 8])
            )
            best = min(best, float(eff.min()))
    assert found.value <= best + 1e-9
    reference("design truck, two 40 ft spans, least pier moment vs a grid of positions and rear spacings",
              expected=best, computed=found.value, rel=2e-4, unit="kip·ft",
              source="brute force over a 0.01 ft grid of positions and 0.25 ft rear spacings, on the handbook "
              "closed form of M_B (two equal spans)", clause="AASHTO 3.6.1.2.2: rear spacing 14 to 30 ft")
    assert 14.0 < spacing_rear <= 30.0


def two_span_truck_minimum(L: int, orientation: int) -> tuple[sp.Expr, sp.Expr]:
    """Least effect on M_B of one design truck (14 ft rear spacing) entirely in span 1, by calculus.

    Returns the effect and the position p of the lead axle.  The effect is a cubic in p (the closed
    form of M_B); its minimum is at a root of the derivative or at an end of 0 <= p <= L - 28.
    """
    p = sp.Symbol("p", real=True)
    x = sp.Symbol("x", real=True)
    il = -x * (L**2 - x**2) / (4 * sp.Integer(L) ** 2)
    axles = [(8, 0), (32, 14), (32, 28)] if orientation > 0 else [(32, 0), (32, 14), (8, 28)]
    f = sum(P * il.subs(x, p + a) for P, a in axles)
    candidates = [sp.Integer(0), sp.Integer(L - 28)]
    candidates += [r for r in sp.solve(sp.diff(f, p), p) if r.is_real and 0 <= r <= L - 28]
    best = min(candidates, key=lambda r: float(f.subs(p, r)))
    return f.subs(p, best), best


def test_two_truck_rule_for_negative_moment_over_the_pier_by_hand(reference):
    # two equal continuous spans of 120 ft; M_B line negative in both spans (handbook closed form).
    # 3.6.1.3.1 (from memory): 90 % of two trucks >= 50 ft apart (14 ft rear spacing) with IM, plus
    # 90 % of the lane load.  One truck per span, each at its own best place; a train travelling in
    # either direction puts one truck in each orientation in span 1 (by the symmetry of the line).
    L = 120
    f_fwd, p_fwd = two_span_truck_minimum(L, +1)
    f_bwd, p_bwd = two_span_truck_minimum(L, -1)
    # the trucks are far enough apart: truck in span 1 ends at p + 28, the mirrored one starts at
    # 2L - (p' + 28); the gap between them must be at least 50 ft
    assert float((2 * L - (p_bwd + 28)) - (p_fwd + 28)) >= 50
    lane_area = -sp.Rational(L**2, 8)  # 2 x integral of x (L^2 - x^2) / (4 L^2) over one span
    hand = 0.9 * (1.33 * float(f_fwd + f_bwd) + 0.64 * float(lane_area))
    line = cmoment(L, L)
    reference("negative area of M_B, two 120 ft spans: -L²/8", expected=float(lane_area),
              computed=line.negative_area, rel=1e-12, source="handbook closed form of two equal spans, integrated",
              clause="M_B = -x (L² - x²) / (4L²)")
    found = place(line, hl93(), "min")
    reference("HL-93 pier moment of two 120 ft spans: the two-truck rule governs",
              expected="90 % (two design trucks + lane)", computed=found.case, source=AASHTO, clause="3.6.1.3.1",
              from_memory=True)
    reference("HL-93 pier moment of two 120 ft spans: 0.9 (1.33 trucks + lane), trucks by calculus", expected=hand,
              computed=found.value, rel=1e-9, unit="kip·ft", source=AASHTO + HAND, clause="3.6.1.3.1",
              from_memory=True)
    # and it beats one truck with the lane (1.33 x worse truck + lane)
    single = 1.33 * float(min(f_fwd, f_bwd)) + 0.64 * float(lane_area)
    assert found.value < single


def test_two_truck_rule_over_the_pier_of_a_real_continuous_girder(reference):
    # the same hand calculation as above, now on the stiffness solution of two 120 ft spans
    L = 120
    beam = ilkit.Beam(2 * L, {0: "pin", L: "roller", 2 * L: "roller"}, EI=1, units="kip-ft")
    f_fwd, _ = two_span_truck_minimum(L, +1)
    f_bwd, _ = two_span_truck_minimum(L, -1)
    hand = 0.9 * (1.33 * float(f_fwd + f_bwd) + 0.64 * float(-sp.Rational(L**2, 8)))
    found = place(beam.moment(L), hl93(), "min", beam=beam)
    assert found.case == "90 % (two design trucks + lane)"
    reference("HL-93 pier moment, stiffness solution of two 120 ft spans, by hand", expected=hand,
              computed=found.value, rel=1e-9, unit="kip·ft", source=AASHTO + HAND, clause="3.6.1.3.1",
              from_memory=True)


def test_two_truck_rule_for_the_interior_reaction_of_a_continuous_girder_by_hand(reference):
    # R_B of two equal spans (handbook closed form x (3L^2 - x^2) / (2L^3), mirrored in span 2) peaks at
    # the pier, so the two trucks close in on it from both sides until the 50 ft gap binds: the train is
    # rigid, and its effect is a cubic in the train position between the positions where an axle
    # crosses the pier.  Its maximum by calculus, for both travel directions:
    L = 120
    p = sp.Symbol("p", real=True)
    x = sp.Symbol("x", real=True)
    span1 = x * (3 * L**2 - x**2) / (2 * sp.Integer(L) ** 3)
    span2 = span1.subs(x, 2 * L - x)
    best = 0.0
    for loads in ([8, 32, 32, 8, 32, 32], [32, 32, 8, 32, 32, 8]):
        offsets = [0, 14, 28, 78, 92, 106]
        crossings = sorted({L - a for a in offsets} | {-106, 2 * L})
        for lo, hi in zip(crossings[:-1], crossings[1:]):
            mid = (lo + hi) / 2
            f = sum(
                P * (span1 if 0 <= mid + a <= L else span2 if L < mid + a <= 2 * L else sp.Integer(0)).subs(x, p + a)
                for P, a in zip(loads, offsets)
            )
            points = [sp.Integer(lo), sp.Integer(hi)]
            points += [r for r in sp.solve(sp.diff(f, p), p) if r.is_real and lo <= r <= hi]
            best = max(best, max(float(f.subs(p, r)) for r in points))
    lane = 0.64 * 2 * float(sp.integrate(span1, (x, 0, L)))  # = 0.64 x 5L/4
    hand = 0.9 * (1.33 * best + lane)
    beam = ilkit.Beam(2 * L, {0: "pin", L: "roller", 2 * L: "roller"}, EI=1, units="kip-ft")
    found = place(beam.reaction(L), hl93(), beam=beam)
    assert found.case == "90 % (two design trucks + lane)"
    reference("HL-93 interior reaction of two 120 ft spans, trucks by calculus", expected=hand, computed=found.value,
              rel=1e-9, unit="kip", source=AASHTO + HAND, clause="3.6.1.3.1", from_memory=True)
    assert found.placements[0].spacings[2] == pytest.approx(50.0)


def test_two_truck_rule_is_not_used_for_positive_moment_or_end_reactions():
    line = cmoment(120, 48)
    e = extremes(line, hl93())
    assert e.maximum.case != "90 % (two design trucks + lane)"
    assert extremes(creaction(120, "A"), hl93()).maximum.case != "90 % (two design trucks + lane)"


def test_two_truck_rule_for_the_interior_reaction_needs_the_beam_or_an_end():
    line = creaction(120, "B")
    with pytest.raises(ilkit.IlkitError, match="pass beam=beam"):
        place(line, hl93())


# ================================================================== EN 1991-2
def test_lm1_lane_1_midspan_moment_by_hand(reference):
    # Table 4.2 (seen): Q = 300 kN per axle, q = 9 kN/m^2 on a 3 m lane = 27 kN/m; axles 1.2 m apart
    # (from memory).  20 m span, midspan: 300 x 5 + 300 x (10 - 1.2) / 2 + 27 x 20^2 / 8
    found = place(simple(20, "kN-m").moment(10), lm1())
    reference("LM1 lane 1, 20 m midspan moment: 300 x 5 + 300 x 4.4 + 27 x 400 / 8",
              expected=300 * 5 + 300 * 8.8 / 2 + 27 * 400 / 8, computed=found.value, rel=1e-12, unit="kN·m",
              source=EN + HAND, clause="4.3.2, Table 4.2; axle spacing 1.2 m from memory", from_memory=True)


def test_lm1_other_lanes_and_adjustment_factors(reference):
    # lane 2: 200 kN, 2.5 kN/m^2; lane 'other': uniform only (Table 4.2, seen); alpha factors multiply
    line = simple(20, "kN-m").moment(10)
    ref = dict(rel=1e-12, unit="kN·m", source=EN + HAND, clause="4.3.2, Table 4.2")
    reference("LM1 lane 2 (3.5 m wide), 20 m midspan moment", expected=200 * 5 + 200 * 4.4 + 2.5 * 3.5 * 50,
              computed=place(line, lm1(2, lane_width=3.5)).value, **ref)
    reference("LM1 remaining area, 20 m midspan moment", expected=2.5 * 3 * 50,
              computed=place(line, lm1("other")).value, **ref)
    reference("LM1 lane 1 with αQ = 0.8, αq = 0.7", expected=0.8 * 2820 + 0.7 * 1350,
              computed=place(line, lm1(1, alpha_Q=0.8, alpha_q=0.7)).value, **ref)


def test_lm2_single_axle(reference):
    # 4.3.3 (seen): one axle of 400 kN; midspan of a 12 m span: 400 x 12 / 4
    ref = dict(rel=1e-12, unit="kN·m", source=EN + HAND, clause="4.3.3")
    reference("LM2, 12 m midspan moment: 400 x 12 / 4", expected=1200.0,
              computed=place(simple(12, "kN-m").moment(6), lm2()).value, **ref)
    reference("LM2 with βQ = 0.9", expected=1080.0, computed=place(simple(12, "kN-m").moment(6), lm2(beta_Q=0.9)).value,
              **ref)


def lm71_by_hand(L: float, a: float, lead: float, orientation: int) -> float:
    """LM71 on a simple span: four 250 kN axles + 80 kN/m beyond 0.8 m, where the line is positive (all of it)."""
    xs = lead + orientation * np.array([0, 1.6, 3.2, 4.8])
    zone = (min(xs) - 0.8, max(xs) + 0.8)

    def area(x0, x1):  # integral of the moment ordinate of a simple span, in closed form (two triangles)
        def F(x):
            x = min(max(x, 0.0), L)
            return x * x * (L - a) / (2 * L) if x <= a else a * (L - a) / 2 - a * (L - x) ** 2 / (2 * L) + 0.0

        return F(x1) - F(x0)

    return float(250 * ordinate(L, a, xs).sum() + 80 * (area(-1e9, zone[0]) + area(zone[1], 1e9)))


def test_lm71_on_a_simple_span_by_hand(reference):
    # 6.3.2 (from memory).  30 m span, section at midspan: the extreme has an axle at the section (the
    # effect is piecewise quadratic in the train position; between the axles' crossings of the section it
    # is a quadratic whose stationary point is checked on a fine grid below)
    L, a = 30.0, 15.0
    candidates = [lm71_by_hand(L, a, a - k * 1.6 * o, o) for k in range(4) for o in (1, -1)]
    grid = [lm71_by_hand(L, a, lead, 1) for lead in np.arange(5.0, 25.0, 0.001)]
    hand = max(max(candidates), max(grid))
    found = place(simple(L, "kN-m").moment(a), lm71())
    ref = dict(unit="kN·m", source=EN + HAND, clause="6.3.2", from_memory=True)
    reference("LM71, 30 m midspan moment vs axle-at-section candidates and a 1 mm grid", expected=hand,
              computed=found.value, rel=1e-7, **ref)
    reference("LM71, 30 m midspan moment, axle 2 at the section", expected=12295.2, computed=found.value, rel=1e-12,
              **ref)
    reference("LM71 with α = 1.21 and Φ = 1.1", expected=1.21 * 1.1 * 12295.2,
              computed=place(simple(L, "kN-m").moment(a), lm71(1.21, dynamic_factor=1.1)).value, rel=1e-12, **ref)


def test_lm71_uniform_part_only_where_unfavourable():
    # reaction at A of two equal continuous spans: positive in span 1, negative in span 2 (handbook closed
    # form); for the largest reaction the 80 kN/m may stand only on span 1
    line = creaction(25, "A", units="kN-m")
    found = place(line, lm71())
    (train,) = found.placements
    assert train.patches and all(p.end <= 25.0 + 1e-12 for p in train.patches)
    assert all(p.effect > 0 for p in train.patches)


def test_alpha_values_and_the_override(reference):
    # 6.3.2: the rule is seen, the values from memory
    reference("values of α for classified loads", expected=(0.75, 0.83, 0.91, 1.00, 1.10, 1.21, 1.33, 1.46),
              computed=ALPHA_VALUES, source=EN, clause="6.3.2", from_memory=True)
    with pytest.raises(ilkit.IlkitError, match="any_alpha=True"):
        lm71(1.05)
    assert lm71(1.05, any_alpha=True).cases[0].parts[0].loads[0] == pytest.approx(262.5)


def covered_area(L: float, b: float, g: float, y: float) -> float:
    """Integral of the midspan-moment line of a simple span over two blocks [y, y+b], [y+b+g, y+2b+g].

    Closed form: the antiderivative of x/2 (x < L/2) and (L - x)/2 (x > L/2), clipped to the span.
    """

    def F(x):
        x = min(max(x, 0.0), L)
        c = L / 2
        return x * x / 4 if x <= c else c * c / 4 + (c * c - (L - x) ** 2) / 4

    return F(y + b) - F(y) + F(y + 2 * b + g) - F(y + b + g)


@pytest.mark.parametrize(
    ("model", "q", "L", "b", "g"),
    [
        (sw0(), 133.0, 40.0, 15.0, 5.3),  # SW/0 (Table 6.1, from memory): 133 kN/m, 15 m + 15 m, 5.3 m apart
        (sw2(), 150.0, 60.0, 25.0, 7.0),  # SW/2 (Table 6.1, from memory): 150 kN/m, 25 m + 25 m, 7 m apart
    ],
)
def test_sw_blocks_on_a_simple_span_by_hand(model, q, L, b, g, reference):
    # Centred blocks are only a local plateau.  Better: the first block partly off the span, the gap
    # left of the section, the second block over it.  There the covered area is
    #   A(y) = (y + b)^2/4 + ((L/2)^2 - (y + b + g)^2)/4 + ((L/2)^2 - (L - y - 2b - g)^2)/4
    # and A'(y) = ((y + b) - (y + b + g) + (L - y - 2b - g)) / 2 = 0 gives y = L - 2b - 2g.
    # (SW/2 on 60 m: y = -4, A = 352 m^2; SW/0 on 40 m: y = -0.6, A = 147.795 m^2.)
    y = L - 2 * b - 2 * g
    hand = q * covered_area(L, b, g, y)
    assert -b < y < 0 and y + b + g <= L / 2 <= y + 2 * b + g <= L  # the configuration assumed above
    scan = max(covered_area(L, b, g, t) for t in np.arange(-2 * b - g, L, 0.001))
    assert q * scan <= hand + 1e-9
    found = place(simple(L, "kN-m").moment(L / 2), model)
    reference(f"{model.name}, {L:g} m midspan moment, blocks placed by calculus", expected=hand, computed=found.value,
              rel=1e-12, unit="kN·m", source=EN + HAND, clause="6.3.3, Table 6.1", from_memory=True)
    assert len(found.placements[0].patches) == 2


def test_dynamic_factors_phi2_phi3(reference):
    # 6.4.5.2 (from memory): Phi2 = 1.44 / (sqrt L - 0.2) + 0.82 in [1.00, 1.67];
    # Phi3 = 2.16 / (sqrt L - 0.2) + 0.73 in [1.00, 2.00]
    ref = dict(source=EN, clause="6.4.5.2", from_memory=True)
    reference("Φ2 at LΦ = 4 m: 1.44 / (√4 - 0.2) + 0.82", expected=1.44 / 1.8 + 0.82, computed=phi2(4.0), rel=1e-12,
              **ref)
    reference("Φ3 at LΦ = 9 m: 2.16 / (√9 - 0.2) + 0.73", expected=2.16 / 2.8 + 0.73, computed=phi3(9.0), rel=1e-12,
              **ref)
    reference("Φ2, Φ3 bounds: 1.67 and 2.00 at 1 m; 1.00 at 400 m and 1000 m", expected=[1.67, 2.00, 1.00, 1.00],
              computed=[phi2(1.0), phi3(1.0), phi2(400.0), phi3(1000.0)], **ref)
    with pytest.raises(ilkit.IlkitError):
        phi2(0)


# ======================================================================= AREMA
def test_cooper_e80_definition_and_scaling(reference):
    # Chapter 15: axles 40, 80 x 4, 52 x 4 per locomotive, spacings 8, 5, 5, 5, 9, 5, 6, 5 (from memory),
    # 8 ft between locomotives, 5 ft to 8 kip/ft
    e80 = cooper_train()
    ref = dict(source=AREMA, clause="Cooper E80", from_memory=True)
    reference("E80: total of the axle loads of two locomotives [kip]", expected=2 * (40 + 4 * 80 + 4 * 52),
              computed=sum(e80.loads), rel=1e-12, **ref)
    reference("E80: axle spacings [ft]", expected=[8, 5, 5, 5, 9, 5, 6, 5, 8, 8, 5, 5, 5, 9, 5, 6, 5],
              computed=[s[0] for s in e80.spacings], **ref)
    reference("E80: trailing load 8 kip/ft, 5 ft behind the last axle", expected=[8.0, 5.0],
              computed=[e80.behind.intensity, e80.behind.clearance], **ref)
    e60 = cooper_train(60, per="rail")
    assert e60.loads[1] == pytest.approx(80 * 60 / 80 / 2) and e60.behind.intensity == pytest.approx(3.0)
    assert alternate_live_load().loads == (100.0, 100.0, 100.0, 100.0)


def test_alternate_live_load_governs_a_10_ft_span(reference):
    # two 100 kip axles 5 ft apart (alternate live load, from memory) on a 10 ft span, crane formula
    # P (2L - d)^2 / (8L) = 100 x 15^2 / 80 = 281.25 kip-ft; E80's two 80 kip drivers give 225 kip-ft
    env = envelope(simple(10), cooper(), divisions=10)
    best = env.absolute_maximum_moment
    ref = dict(source=AREMA + "; crane-wheel formula P (2L - d)² / (8L) (handbook beam tables)",
               clause="alternate live load, Cooper E80", from_memory=True, unit="kip·ft")
    reference("alternate live load, 10 ft span, absolute maximum moment", expected=281.25, computed=best.value,
              rel=1e-9, **ref)
    assert best.case == "alternate live load"
    e80_only = envelope(simple(10), cooper_train(), divisions=10).absolute_maximum_moment
    reference("E80 alone, 10 ft span: two 80 kip drivers 5 ft apart", expected=225.0, computed=e80_only.value,
              rel=1e-9, **ref)


def test_memory_values_of_the_rail_models_can_be_overridden():
    # every value recalled from memory is an argument of the model's function (each docstring names the
    # clause; `model.from_memory` lists them), so a user can set it from the licensed current edition
    blocks = sw2(intensity=140, length=20, gap=6).cases[0].parts[0]
    assert (blocks.intensity, blocks.lengths, blocks.gaps) == (140.0, (20.0, 20.0), (6.0,))
    assert sw0(intensity=120).cases[0].parts[0].intensity == 120.0
    short = cooper_train(axles=(40, 80, 80), spacings=(8, 5), between=10)
    assert short.loads == (40, 80, 80, 40, 80, 80) and [s[0] for s in short.spacings] == [8, 5, 10, 8, 5]
    assert alternate_live_load(axle=90, spacings=(5, 6)).loads == (90.0, 90.0, 90.0)
    with pytest.raises(ilkit.IlkitError, match="3 axles per locomotive need 2 spacings"):
        cooper_train(axles=(40, 80, 80), spacings=(8,))


def test_cooper_impact_is_on_the_whole_live_load():
    line = simple(50).moment(25)
    assert place(line, cooper(impact=0.3)).value == pytest.approx(1.3 * place(line, cooper()).value)


# ======================================================================= units
def test_a_kip_ft_model_on_a_kn_m_beam_is_converted_exactly(reference):
    # exact definitions: 1 ft = 0.3048 m, 1 kip = 4.4482216152605 kN (ilkit.units)
    ft, kip = 0.3048, 4.4482216152605
    metric = ilkit.Beam(100 * ft, {0: "pin", 100 * ft: "roller"}, units="kN-m")
    found = place(metric.moment(50 * ft), hl93())
    reference("HL-93 on a 30.48 m span in kN·m: the kip·ft result converted", expected=(1.33 * 1520 + 800) * kip * ft,
              computed=found.value, rel=1e-12, unit="kN·m",
              source="exact unit definitions: 1 ft = 0.3048 m (international foot), 1 lbf = 4.4482216152605 N",
              clause="AASHTO 3.6.1.2 hand calculation above, converted")
    assert found.unit == "kN·m"
    (truck, _lane) = found.placements
    assert truck.axles[1].load == pytest.approx(32 * kip)
    assert truck.spacings[0] == pytest.approx(14 * ft)


def test_a_kn_m_model_on_a_kip_ft_beam(reference):
    ft, kip = 0.3048, 4.4482216152605
    imperial = simple(20 / ft)
    found = place(imperial.moment(10 / ft), lm2())
    reference("LM2 on a 20 m span given in ft: 400 x 20 / 4 kN·m in kip·ft", expected=400 * 20 / 4 / (kip * ft),
              computed=found.value, rel=1e-12, unit="kip·ft",
              source="exact unit definitions: 1 ft = 0.3048 m (international foot), 1 lbf = 4.4482216152605 N",
              clause="EN 1991-2 4.3.3 hand calculation, converted")


def test_a_beam_without_units_is_an_error_that_says_how_to_declare_them():
    beam = ilkit.Beam(20, {0: "pin", 20: "roller"})
    with pytest.raises(ilkit.UnitsError, match=r"Beam\(\.\.\., units='kip-ft'\)"):
        place(beam.moment(10), hl93())
    with pytest.raises(ilkit.UnitsError, match="units="):
        envelope(beam, lm71())
