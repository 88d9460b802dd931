"""Distribution factors: given, lever rule, rigid section and the AASHTO approximate formulas.

The formulas are checked against the worked values of a published design aid: the TxDOT Bridge Division
spreadsheet "LRFD Live Load Distribution Factors" (distribution_factors.xls, I-beam superstructure, AASHTO
LRFD 8th edition 2017), two filled-in copies read for these values (seen, not recalled).
"""

from __future__ import annotations

import math

import pytest

import ilkit
from ilkit.design import (
    Applied,
    CrossSection,
    FactorAppliedTwiceError,
    GirderLiveLoad,
    aashto_distribution,
    given_distribution,
    lever_rule,
    longitudinal_stiffness,
    multiple_presence_factor,
    rigid_section,
)
from ilkit.loads import hl93

TXDOT = "TxDOT Bridge Division, LRFD Live Load Distribution Factors spreadsheet (I-beam superstructure)"
AASHTO = "AASHTO LRFD Bridge Design Specifications, 9th edition (2020)"
IN4 = 1 / 12**4  # ft⁴ per in⁴


def test_interior_girder_against_a_published_design_aid(reference):
    # TxDOT, filled-in copy 1: Nb = 5, L = 65.62 ft, S = 6.56 ft, ts = 8.00 in, Kg = 1,132,028 in⁴, no skew,
    # overhang 3 ft, rail 1 ft (roadway 31 ft in the sheet): gM interior 0.635, gV interior 0.712 (seen)
    section = CrossSection(5, 6.56, 3.0, 1.0)
    d = aashto_distribution(section, 3, span=65.62, slab_thickness=8 / 12, Kg=1_132_028 * IN4, deck_type="k")
    reference("interior girder, moment, two or more lanes", expected=0.635, computed=d.moment.value, source=TXDOT,
              clause="copy 1, Interior Moment LLDF (AASHTO LRFD Table 4.6.2.2.2b-1)", abs=5e-4)
    reference("interior girder, shear, two or more lanes", expected=0.712, computed=d.shear.value, source=TXDOT,
              clause="copy 1, Interior Shear LLDF (AASHTO LRFD Table 4.6.2.2.3a-1)", abs=5e-4)
    assert d.moment.includes == ("lanes", "multiple presence") and d.moment.from_memory


def test_skewed_interior_girder_against_a_published_design_aid(reference):
    # TxDOT, filled-in copy 2: Nb = 6, L = 88.58 ft, S = 7.00 ft, ts = 8.00 in, Kg = 1,132,028 in⁴, skew 15°:
    # gM interior 0.614 (no moment reduction below 30°), gV interior 0.775 (with the skew correction) (seen)
    section = CrossSection(6, 7.0, 3.0, 1.0)
    d = aashto_distribution(section, 3, span=88.58, slab_thickness=8 / 12, Kg=1_132_028 * IN4, deck_type="k",
                            skew=15)
    reference("interior girder, moment, skew 15°", expected=0.614, computed=d.moment.value, source=TXDOT,
              clause="copy 2, Interior Moment LLDF (AASHTO LRFD 4.6.2.2.2e: no reduction below 30°)", abs=5e-4)
    reference("interior girder, shear, skew 15°", expected=0.775, computed=d.shear.value, source=TXDOT,
              clause="copy 2, Interior Shear LLDF (AASHTO LRFD Table 4.6.2.2.3c-1)", abs=5e-4)


def test_the_formulas_written_out(reference):
    # every candidate by hand from the formulas of AASHTO LRFD (from memory), S = 9 ft, L = 100 ft, ts = 8 in,
    # Kg = 500,000 in⁴, a deck of five girders with 3.5 ft overhangs and 1.5 ft barriers (de = 2 ft)
    S, L, ts, Kg = 9.0, 100.0, 8.0, 500_000.0
    section = CrossSection(5, S, 3.5, 1.5)
    stiff = Kg / (12 * L * ts**3)
    m2 = 0.075 + (S / 9.5) ** 0.6 * (S / L) ** 0.2 * stiff**0.1
    m1 = 0.06 + (S / 14) ** 0.4 * (S / L) ** 0.3 * stiff**0.1
    v2 = 0.2 + S / 12 - (S / 35) ** 2
    v1 = 0.36 + S / 25
    interior = aashto_distribution(section, 2, span=L, slab_thickness=ts / 12, Kg=Kg * IN4)
    steps = {(a, c): v for a, c, v, _, _ in interior.steps}
    for (action, case), expected in {("moment", "one lane loaded"): m1, ("moment", "two or more lanes loaded"): m2,
                                     ("shear", "one lane loaded"): v1,
                                     ("shear", "two or more lanes loaded"): v2}.items():
        reference(f"interior {action}, {case}", expected=expected, computed=steps[(action, case)], source=AASHTO,
                  clause="Tables 4.6.2.2.2b-1 and 4.6.2.2.3a-1", from_memory=True, rel=1e-12)
    assert interior.moment.value == max(m1, m2) and interior.shear.value == max(v1, v2)
    # exterior: e = 0.77 + de/9.1 (moment), 0.6 + de/10 (shear); one lane by the lever rule with m = 1.20:
    # wheels at 3.5 and 9.5 ft, girder 1 at 3.5 ft, girder 2 at 12.5 ft: share (1 + 3/9)/2
    exterior = aashto_distribution(section, 1, span=L, slab_thickness=ts / 12, Kg=Kg * IN4)
    lever = 1.20 * (1 + 3 / 9) / 2
    reference("exterior moment", expected=max(lever, (0.77 + 2 / 9.1) * m2), computed=exterior.moment.value,
              source=AASHTO, clause="Table 4.6.2.2.2d-1 (lever rule; e × interior)", from_memory=True, rel=1e-12)
    reference("exterior shear", expected=max(lever, (0.6 + 2 / 10) * v2), computed=exterior.shear.value,
              source=AASHTO, clause="Table 4.6.2.2.3b-1 (lever rule; e × interior)", from_memory=True, rel=1e-12)
    # the deflection factor (2.5.2.6.2): the roadway is 43 - 3 = 40 ft, three lanes, m = 0.85, five girders
    assert interior.deflection is not None and interior.deflection.value == pytest.approx(3 * 0.85 / 5)


def test_rigid_section_check_governs_a_steel_exterior_girder_with_diaphragms(reference):
    # girders 10 ft apart, a wide overhang: the rigid cross-section (4.6.2.2.2d-1) with m, by hand: six girders
    # at x = ±5, ±15, ±25 ft from their centre (Σx² = 2 (25 + 225 + 625) = 1750), roadway 2 to 62 ft (y from
    # the deck edge; the centre at 32 ft): vehicles with their outer wheel 2 ft from the barrier, the next
    # vehicle's wheel 4 ft further; R = NL/Nb + X_ext Σe / Σx² with X_ext = 25 ft
    section = CrossSection(6, 10.0, 7.0, 2.0)
    centres = [2 + 2 + 3 + 12 * k for k in range(5)]  # vehicle centres 7, 19, 31, 43, 55 ft
    best = 0.0
    for n in range(1, 6):
        e = sum(32.0 - c for c in centres[:n])
        best = max(best, multiple_presence_factor(n).value * (n / 6 + 25.0 * e / 1750.0))
    rigid = rigid_section(section, 1)
    reference("rigid cross-section, exterior girder, with m", expected=best, computed=rigid.moment.value,
              source=AASHTO, clause="4.6.2.2.2d-1 with Table 3.6.1.1.2-1", from_memory=True, rel=1e-12)
    with_diaphragms = aashto_distribution(section, 1, span=120.0, slab_thickness=8.5 / 12, Kg=900_000 * IN4,
                                          diaphragms=True)
    assert with_diaphragms.moment.value >= rigid.moment.value - 1e-12
    without = aashto_distribution(section, 1, span=120.0, slab_thickness=8.5 / 12, Kg=900_000 * IN4)
    assert with_diaphragms.moment.value >= without.moment.value


def test_three_girders_use_the_lesser_of_formula_and_lever_rule_for_moment_and_the_lever_rule_for_shear():
    section = CrossSection(3, 8.0, 3.0, 1.5)
    d = aashto_distribution(section, 2, span=80.0, slab_thickness=8 / 12, Kg=400_000 * IN4)
    formula = max(v for a, c, v, _, _ in d.steps if a == "moment" and "lever" not in c)
    assert d.moment.value == pytest.approx(min(formula, lever_rule(section, 2).moment.value))
    assert d.shear.value == pytest.approx(lever_rule(section, 2).shear.value)


@pytest.mark.parametrize(
    ("kwargs", "field"),
    [
        ({"span": 250.0}, "L"),
        ({"span": 15.0}, "L"),
        ({"slab_thickness": 13 / 12}, "ts"),
        ({"Kg": 5_000 * IN4}, "Kg"),
        ({"Kg": 8_000_000 * IN4}, "Kg"),
        ({"skew": 65.0}, "skew"),
    ],
)
def test_inputs_outside_the_range_name_the_lever_rule_or_a_refined_analysis(kwargs, field):
    args = {"span": 100.0, "slab_thickness": 8 / 12, "Kg": 500_000 * IN4} | kwargs
    with pytest.raises(ilkit.OutsideRangeError, match=r"use the lever rule .* or a refined analysis") as err:
        aashto_distribution(CrossSection(5, 9.0, 3.0, 1.0), 2, **args)
    assert err.value.field == field


def test_spacing_and_curb_distance_outside_the_range():
    with pytest.raises(ilkit.OutsideRangeError, match=r"S = 17 ft .* from 3.5 to 16 ft"):
        aashto_distribution(CrossSection(4, 17.0, 3.0, 1.0), 2, span=100.0, slab_thickness=0.7, Kg=500_000 * IN4)
    with pytest.raises(ilkit.OutsideRangeError, match="de = 6 ft"):  # overhang 7.5 ft, barrier 1.5 ft
        aashto_distribution(CrossSection(4, 9.0, 7.5, 1.5), 1, span=100.0, slab_thickness=0.7, Kg=500_000 * IN4)
    with pytest.raises(ilkit.OutsideRangeError, match="Nb = 2"):
        aashto_distribution(CrossSection(2, 9.0, 3.0, 1.0), 1, span=100.0, slab_thickness=0.7, Kg=500_000 * IN4)


def test_multiple_presence_is_never_applied_twice():
    section = CrossSection(5, 9.0, 3.5, 1.5)
    formula = aashto_distribution(section, 2, span=100.0, slab_thickness=8 / 12, Kg=500_000 * IN4)
    with pytest.raises(FactorAppliedTwiceError, match="includes multiple presence, which the result already"):
        GirderLiveLoad(hl93(), distribution=formula, multiple_presence=multiple_presence_factor(2))
    with pytest.raises(FactorAppliedTwiceError, match="lanes"):
        GirderLiveLoad(hl93(), distribution=lever_rule(section, 1), lanes=2)
    # a share given without multiple presence takes m once
    plain = given_distribution(0.5, 0.6, girder="G2")
    live = GirderLiveLoad(hl93(), distribution=plain, multiple_presence=1.2)
    assert live.scale("moment") == pytest.approx(0.6) and live.scale("shear") == pytest.approx(0.72)
    with pytest.raises(FactorAppliedTwiceError):
        GirderLiveLoad(hl93(), distribution=given_distribution(0.6, includes_multiple_presence=True),
                       multiple_presence=1.2)


def test_fatigue_factors_are_the_one_lane_factors_without_m():
    section = CrossSection(5, 9.0, 3.5, 1.5)
    d = aashto_distribution(section, 2, span=100.0, slab_thickness=8 / 12, Kg=500_000 * IN4)
    one = {a: v for a, c, v, _, _ in d.steps if c == "one lane loaded"}
    fatigue = d.fatigue()
    assert fatigue.moment.value == pytest.approx(one["moment"] / 1.2)
    assert fatigue.shear.value == pytest.approx(one["shear"] / 1.2)
    assert fatigue.moment.includes == ("lanes",)
    with pytest.raises(ilkit.DesignInputError, match="one-lane factors are not known"):
        given_distribution(0.5).fatigue()


def test_given_distribution_and_its_record():
    d = given_distribution(0.55, 0.7, 0.3, girder="G3", source="grillage model of the deck")
    assert (d.factor("moment").value, d.factor("reaction").value, d.factor("deflection").value) == (0.55, 0.7, 0.3)
    assert d.moment.status == "read" and Applied.of(d.moment).describe() == "gM 0.55"
    with pytest.raises(ilkit.DesignInputError, match="must be at least 0"):
        given_distribution(-0.5)
    with pytest.raises(ilkit.DesignInputError, match="no distribution factor for deflection"):
        given_distribution(0.5).factor("deflection")
    assert len(d.to_frame()) == 3


def test_longitudinal_stiffness(reference):
    # Kg = n (I + A eg²), AASHTO LRFD 4.6.2.2.1-1 (from memory); TxDOT copy 1: n = 1.000, I = 260,403 in⁴,
    # A = 788.4 in², eg = 33.25 in: Kg = 1,132,028 in⁴ (seen)
    reference("Kg of a Tx54 girder", expected=1_132_028, computed=longitudinal_stiffness(1.0, 260_403, 788.4, 33.25),
              source=TXDOT, clause="copy 1, Kg = n(I + A eg²)", abs=1.0)
    assert math.isclose(longitudinal_stiffness(2, 1, 1, 1), 4.0)


def test_the_ranges_checked_are_listed_with_their_tables():
    """Every parameter of the formulas is listed with its range (the ranges of aashto_distribution's docstring,
    AASHTO LRFD Tables 4.6.2.2.2b-1 and 4.6.2.2.2d-1, from memory), values at a bound pass."""
    section = CrossSection(5, 16.0, 5.5 + 1.25, 1.25)  # S at its upper bound, de = 5.5 ft at its upper bound
    g = aashto_distribution(section, 1, span=240, slab_thickness=4.5 / 12, Kg=7_000_000 * IN4)
    frame = g.ranges()
    assert list(frame.columns) == ["parameter", "value", "from", "to", "unit", "table"]
    got = {row.parameter: (row.value, row.to) for row in frame.itertuples()}
    assert got["S"] == pytest.approx((16.0, 16.0)) and got["de"] == pytest.approx((5.5, 5.5))
    assert got["L"] == pytest.approx((240.0, 240.0)) and got["ts"] == pytest.approx((4.5, 12.0))
    assert got["Kg"][0] == pytest.approx(7_000_000) and got["Nb"] == (5, "")
    assert set(frame["table"]) >= {"Table 4.6.2.2.2d-1", "Tables 4.6.2.2.2d-1, 4.6.2.2.3b-1"}
    interior = aashto_distribution(section, 3, span=240, slab_thickness=4.5 / 12, Kg=7_000_000 * IN4)
    assert "de" not in set(interior.ranges()["parameter"])  # the curb distance belongs to the exterior girder
    assert given_distribution(0.7).ranges().empty and lever_rule(section, 1).ranges().empty
