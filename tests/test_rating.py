"""Load rating (ilkit.rating): LRFR rating factors worked by hand, vehicles, factors, laws, bad input."""

from __future__ import annotations

import math

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

import ilkit
from ilkit import design, rating
from ilkit.design import DistributedLoad, FactorAppliedTwiceError, given_distribution, permanent_effects
from ilkit.errors import DesignInputError, MissingResistanceError, RatingInputError

MBE = "AASHTO Manual for Bridge Evaluation, 3rd edition (2018), LRFR"
AASHTO = "AASHTO LRFD Bridge Design Specifications, 9th edition (2020)"
KIP_KN = 4.4482216152605
FT_M = 0.3048

SPAN = ilkit.Beam(100, {0: "pin", 100: "roller"}, units="kip-ft")
DEAD = [DistributedLoad("girder and deck", "DC", 1.2), DistributedLoad("wearing surface", "DW", 0.3)]
G = given_distribution(0.6, girder="G2")


@pytest.fixture(scope="module")
def permanent():
    return permanent_effects(SPAN, DEAD, divisions=4, quantities=("moment", "shear"))


def _rate(permanent, loads, **options):
    options.setdefault("resistances", rating.Resistances(positive_moment=8000, shear=400))
    options.setdefault("distribution", G)
    return rating.rate_girder(SPAN, permanent=permanent, loads=loads, divisions=4, **options)


# ------------------------------------------------------------------------------------------ worked by hand
def test_design_load_rating_worked_by_hand(reference, permanent):
    # a 100 ft simple span, midspan moment (statics): DC 1.2 kip/ft: 1500 kip·ft; DW 0.3 kip/ft: 375 kip·ft.
    # HL-93 in one lane (AASHTO LRFD 3.6.1.2): the design truck with its middle axle at midspan and 14 ft
    # spacings, 32 × 25 + 32 × 18 + 8 × 18 = 1520 kip·ft, × (1 + IM) = 1.33; lane 0.64 × 100² / 8 = 800 kip·ft.
    # The girder's share 0.6 lanes (given).  C = φc φs φ Rn = 0.95 × 1.00 × 1.00 × 8000 (fair condition,
    # MBE Table 6A.4.2.3-1, from memory).  RF = (C − 1.25 DC − 1.50 DW) / (γLL (LL + IM)), γLL 1.75 at the
    # inventory level and 1.35 at the operating level (MBE 6A.4.2.1, Table 6A.4.2.2-1, from memory).
    r = _rate(permanent, "design", condition="fair")
    live = 0.6 * (1.33 * 1520 + 800)
    room = 0.95 * 8000 - 1.25 * 1500 - 1.50 * 375
    for level, gamma in (("inventory", 1.75), ("operating", 1.35)):
        reference(f"HL-93 {level} rating factor, midspan moment", expected=room / (gamma * live),
                  computed=r.rf(f"HL-93 {level}", "moment", 50, "positive"), source=MBE,
                  clause="6A.4.2.1 (RF), Tables 6A.4.2.2-1 and 6A.4.2.3-1 (from memory); AASHTO LRFD 3.6.1.2",
                  from_memory=True, rel=1e-12)
    row = r.frame[(r.frame["vehicle"] == "HL-93 inventory") & (r.frame["x"] == 50.0)
                  & (r.frame["quantity"] == "moment")].iloc[0]
    assert row["capacity"] == pytest.approx(7600) and row["dead"] == pytest.approx(1.25 * 1500 + 1.5 * 375)
    assert row["case"] == "design truck + lane"
    assert "design truck" in row["placement"] and "design lane on 0–100" in row["placement"]


def test_legal_load_rating_in_tons_and_posting_worked_by_hand(reference, permanent):
    # Type 3 (16, 17, 17 kip at 15, 4 ft; MBE 6A.4.4.2.1, from memory) on the 100 ft span, midspan moment:
    # the middle axle at midspan, the front one 15 ft ahead: 16 × 17.5 + 17 × 25 + 17 × 23 = 1096 kip·ft
    # (the rear axle at midspan gives 1064, the front one 961).  × 1.33 (IM), × 0.6 (share).
    # γLL for ADTT 1000: 1.30 (MBE Table 6A.4.4.2.3a-1, from memory).  Rating in tons RF × 25 tons.
    r = _rate(permanent, ["Type 3"], adtt=1000)
    live = 0.6 * 1.33 * 1096
    room = 8000 - 1.25 * 1500 - 1.50 * 375
    rf = room / (1.30 * live)
    reference("Type 3 rating factor, midspan moment", expected=rf, computed=r.rf("Type 3", "moment", 50),
              source=MBE, clause="6A.4.4.2.1 (Type 3), Table 6A.4.4.2.3a-1 (γLL by ADTT), from memory",
              from_memory=True, rel=1e-12)
    top = r.controlling().iloc[0]
    assert top["vehicle"] == "Type 3" and top["weight"] == 25.0
    assert top["rating_tons"] == pytest.approx(top["RF"] * 25.0)
    # a weak girder: RF below 1 gives a posting load W / 0.7 × (RF − 0.3) (MBE 6A.8.3, from memory)
    weak = _rate(permanent, ["Type 3"], adtt=1000,
                 resistances=rating.Resistances(positive_moment=3500, shear=400))
    rf = (3500 - 1.25 * 1500 - 1.50 * 375) / (1.30 * live)
    assert 0.3 < rf < 1
    top = weak.controlling().iloc[0]
    reference("Type 3 safe posting load", expected=25 / 0.7 * (rf - 0.3), computed=top["posting"], source=MBE,
              clause="6A.8.3, posting relation (from memory)", from_memory=True, rel=1e-12)
    assert top["action"].startswith("post for")
    assert rating.posting_load(0.25, 25).load is None and "closing" in rating.posting_load(0.25, 25).words
    assert rating.posting_load(1.2, 25).load is None


def test_permit_rating_worked_by_hand(reference, permanent):
    # a permit of our own, two 40 kip axles 4 ft apart, on the 100 ft span: one axle at midspan, the other
    # 4 ft away: 40 × 25 + 40 × 23 = 1920 kip·ft; × 1.33 (IM, MBE 6A.4.5.5); a special permit, single trip,
    # escorted with no other vehicle on the bridge: γLL 1.15 (MBE Table 6A.4.5.4.2a-1, from memory), the
    # one-lane share without multiple presence given as 0.5 lanes (6A.4.5.4.2b); Strength II dead-load factors
    # as Strength I (Table 6A.4.2.2-1).  Rating in tons: RF × 40 tons.
    permit = rating.permit_load(rating.permit_vehicle([40, 40], [4], name="twin-axle permit"),
                                "special single trip escorted")
    r = _rate(permanent, [permit], single_lane=given_distribution(0.5))
    rf = (8000 - 1.25 * 1500 - 1.50 * 375) / (1.15 * 0.5 * 1.33 * 1920)
    reference("special permit rating factor, midspan moment", expected=rf,
              computed=r.rf("twin-axle permit", "moment", 50), source=MBE,
              clause="6A.4.5.4.2a (γLL), 6A.4.5.4.2b (one lane, m taken out), 6A.4.5.5 (IM), from memory",
              from_memory=True, rel=1e-12)
    top = r.controlling().iloc[0]
    assert top["limit_state"] == "Strength II" and top["rating_tons"] == pytest.approx(top["RF"] * 40)


def test_the_lane_type_long_span_case_applies_from_200_ft():
    # MBE 6A.4.4.2.1 (from memory): the 0.75 × Type 3-3 + 0.2 kip/ft case for spans of 200 ft and more
    for length, long_case in ((190, False), (210, True)):
        beam = ilkit.Beam(length, {0: "pin", length: "roller"}, units="kip-ft")
        perm = permanent_effects(beam, DEAD, divisions=2, quantities=("moment", "shear"))
        r = rating.rate_girder(beam, permanent=perm, loads="lane-type", distribution=G, divisions=2,
                               resistances=rating.Resistances(positive_moment=20000, shear=900))
        cases = [c.name for c in r.load("lane-type").model.cases]
        assert ("0.75 × Type 3-3 + lane" in cases) is long_case
        assert any("200 ft" in n for n in r.notes) is not long_case


def test_service_ii_check_of_a_steel_girder_worked_by_hand(reference, permanent):
    # MBE 6A.6.4.2.2 and Table 6A.4.2.2-1 (from memory): Service II of steel, legal loads γLL 1.30, dead loads
    # unfactored, no φ, φc, φs; the limit moment 5000 kip·ft given.  Type 3 at midspan as above.
    r = _rate(permanent, ["Type 3"], adtt=1000, condition="fair",
              resistances=rating.Resistances(positive_moment=8000, shear=2000),
              service=rating.Resistances(positive_moment=5000, name="0.80 Fy, non-composite"))
    live = 0.6 * 1.33 * 1096
    rows = r.frame[(r.frame["quantity"] == "moment") & (r.frame["x"] == 50.0)].set_index("limit_state")
    reference("Type 3 Service II rating factor, midspan moment", expected=(5000 - 1500 - 375) / (1.30 * live),
              computed=rows.loc["Service II", "RF"], source=MBE,
              clause="6A.6.4.2.2, Table 6A.4.2.2-1, Service II (from memory)", from_memory=True, rel=1e-12)
    assert rows.loc["Strength I", "RF"] == pytest.approx((0.95 * 8000 - 1.25 * 1500 - 1.5 * 375) / (1.30 * live))
    top = r.controlling().iloc[0]
    assert top["limit_state"] == "Service II" and top["RF"] == pytest.approx(rows.loc["Service II", "RF"])
    assert r.service_factors["Type 3"]["moment"].describe() == "IM 33 % (Type 3) × gM 0.60 × γLL 1.30"
    # the standing vehicle gives the smaller of the two checks
    placement = r.extreme("Type 3", "moment", 50).placements[0]
    assert r.standing("Type 3", "moment", 50, placement.front, direction=placement.direction).rf == pytest.approx(
        rows.loc["Service II", "RF"])
    assert "shear" not in set(r.frame.loc[r.frame["limit_state"] == "Service II", "quantity"])


def test_negative_moment_rating_uses_the_relieving_dead_load_factor():
    # two 60 ft spans: at the pier the dead moment is hogging (adds to the negative live moment: γmax 1.25);
    # in the span near the end support it is sagging and relieves a negative live moment (γmin 0.90;
    # AASHTO LRFD Table 3.4.1-2, from memory).  Checked against the formula on the table's own columns.
    beam = ilkit.Beam(120, {0: "pin", 60: "roller", 120: "roller"}, EI=1e6, units="kip-ft")
    perm = permanent_effects(beam, [DistributedLoad("deck", "DC", 1.0)], divisions=4, quantities=("moment", "shear"))
    r = rating.rate_girder(beam, permanent=perm, loads="Type 3-3", distribution=G, divisions=4,
                           resistances=rating.Resistances(positive_moment=5000, negative_moment=4000, shear=300))
    f = r.frame
    pier = f[(f["quantity"] == "moment") & (f["x"] == 60.0) & (f["sense"] == "negative")].iloc[0]
    dc = perm.value("moment", 60, side="left")
    assert dc < 0 and pier["dead"] == pytest.approx(1.25 * dc)
    assert pier["RF"] == pytest.approx((4000 + 1.25 * dc) / (pier["gamma_LL"] * -pier["live"]))
    near = f[(f["quantity"] == "moment") & (f["x"] == 15.0) & (f["sense"] == "negative")].iloc[0]
    assert perm.value("moment", 15) > 0 and near["dead"] == pytest.approx(0.90 * perm.value("moment", 15))
    assert near["RF"] == pytest.approx((4000 + near["dead"]) / (near["gamma_LL"] * -near["live"]))


def test_special_permit_takes_one_lane_without_multiple_presence(permanent):
    # MBE 6A.4.5.4.2b (from memory): a special permit is rated with the one-lane distribution factor with the
    # multiple presence factor 1.20 divided out; a routine permit with the girder's factor.
    section = design.CrossSection(girders=5, spacing=8, overhang=3, barrier=1.5, units="kip-ft")
    dist = design.lever_rule(section, 1)
    vehicle = rating.permit_vehicle([15, 30, 30, 30], [12, 4, 20], name="our permit")
    routine = rating.permit_load(vehicle, "routine", adtt=1000)
    special = rating.permit_load(vehicle, "special single trip escorted", name="escorted permit")
    r = _rate(permanent, [routine, special], distribution=dist)
    one = dist.one_lane[0].value / 1.2
    assert r.live_factors["escorted permit"]["moment"].get("distribution").value == pytest.approx(one)
    assert r.live_factors["our permit"]["moment"].get("distribution").value == pytest.approx(dist.moment.value)
    f = r.frame[(r.frame["quantity"] == "moment") & (r.frame["x"] == 50.0)]
    lives = dict(zip(f["vehicle"], f["live"]))
    assert lives["escorted permit"] / lives["our permit"] == pytest.approx(one / dist.moment.value)
    assert special.live_factor.value == 1.15 and routine.live_factor.value == pytest.approx(1.20)
    assert set(f["limit_state"]) == {"Strength II"}


def test_factors_are_applied_once_and_recorded(permanent):
    r = _rate(permanent, ["Type 3"], condition="poor", system="welded members in two-girder, truss or arch bridges")
    record = r.live_factors["Type 3"]["moment"]
    assert record.describe() == "IM 33 % (Type 3) × gM 0.60 × γLL 1.45"
    with pytest.raises(FactorAppliedTwiceError):
        record.then(rating.legal_live_factor(500))
    # φc φs = 0.85 × 0.85 < 0.85: raised to 0.85 (MBE 6A.4.2.1, from memory)
    cap = r.capacity_factors["moment"]
    assert cap.product == pytest.approx(0.85) and any("0.85" in n for n in r.notes)
    with pytest.raises(DesignInputError):  # a model that carries a share of its own
        _rate(permanent, [rating.RatingLoad("HL-93 × 1.2", ilkit.loads.hl93(factor=1.2), "legal",
                                            rating.legal_live_factor())])


# ------------------------------------------------------------------------------------------------- vehicles
@pytest.mark.parametrize(("make", "total", "spacing"), [
    (rating.type_3, 50.0, 19.0),
    (rating.type_3s2, 72.0, 41.0),
    (rating.type_3_3, 80.0, 54.0),
    (lambda: rating.specialized_hauling_vehicle("SU4"), 54.0, 18.0),
    (lambda: rating.specialized_hauling_vehicle("SU5"), 62.0, 22.0),
    (lambda: rating.specialized_hauling_vehicle("SU6"), 69.5, 26.0),
    (lambda: rating.specialized_hauling_vehicle("SU7"), 77.5, 30.0),
    (rating.notional_rating_load, 80.0, 32.0),
    (lambda: rating.emergency_vehicle("EV2"), 57.5, 15.0),
    (lambda: rating.emergency_vehicle("EV3"), 86.0, 19.0),
])
def test_vehicle_weights_and_lengths(reference, make, total, spacing):
    # totals and wheel bases from memory (MBE 6A.4.4.2.1 and its figures, Appendix D6A); the NRL's varying
    # gap counted at its smallest, 6 ft
    model = make()
    train = model.cases[0].parts[0]
    reference(f"{model.name}: gross weight (kip)", expected=total, computed=train.total_load, source=MBE,
              clause="6A.4.4.2.1 (from memory)", from_memory=True, abs=1e-12)
    assert sum(lo for lo, _ in train.spacings) == pytest.approx(spacing)
    assert model.source.startswith("AASHTO Manual for Bridge Evaluation") and model.from_memory
    assert model.cases[0].dynamic_allowance == 0.33


def test_lane_type_legal_load_rule_for_long_spans():
    # MBE 6A.4.4.2.1 (from memory): spans of 200 ft and more: 0.75 × Type 3-3 + 0.2 kip/ft; negative moment
    # and interior reactions: two Type 3-3 × 0.75, 30 ft apart, + 0.2 kip/ft.
    model = rating.lane_type_legal_load()
    long_case, two_case = model.cases
    truck, lane = long_case.parts
    assert sum(truck.loads) == pytest.approx(0.75 * 80) and lane.intensity == 0.2
    assert long_case.dynamic_on == (truck.name,)
    two = two_case.parts[0]
    assert sum(two.loads) == pytest.approx(2 * 0.75 * 80) and two.spacings[5] == (30.0, 30.0)
    assert two_case.applies_to == "negative moment and interior reactions"
    short = rating.lane_type_legal_load(long_span=False)
    assert [c.applies_to for c in short.cases] == ["all", "negative moment and interior reactions"]
    # rate_girder includes the long-span case only where a span reaches 200 ft
    short_beam = next(r for r in rating.rating_loads("legal", long_span=False) if r.name == "lane-type")
    assert "0.75 × Type 3-3 + lane" not in [c.name for c in short_beam.model.cases]


def test_live_load_factors_from_adtt():
    # MBE Table 6A.4.4.2.3a-1 (from memory): 1.30 up to ADTT 1000, 1.45 from 5000, straight-line between
    assert rating.legal_live_factor(500).value == 1.30
    assert rating.legal_live_factor(3000).value == pytest.approx(1.375)
    assert rating.legal_live_factor(9000).value == 1.45 and rating.legal_live_factor().value == 1.45
    assert rating.legal_live_factor().from_memory
    # permits, Table 6A.4.5.4.2a-1 (from memory)
    assert rating.permit_live_factor("routine", 5000).value == 1.30
    assert rating.permit_live_factor("special single trip", 100).value == 1.35
    assert rating.design_live_factor("inventory").value == 1.75 and rating.emergency_live_factor().value == 1.30
    assert rating.condition_factor("fair").value == 0.95 and rating.condition_factor(0.9).status == "given"


def test_permit_vehicle_from_a_csv_table(tmp_path, permanent):
    path = tmp_path / "permit.csv"
    path.write_text("load,spacing\n20,\n40,14\n40,4\n", encoding="utf-8")
    model = rating.permit_vehicle(path, name="crane carrier")
    assert model.cases[0].parts[0].loads == (20.0, 40.0, 40.0)
    assert rating.vehicle_tons(model) == 50.0
    r = _rate(permanent, [rating.permit_load(model, "routine", adtt=100)])
    assert r.controlling().iloc[0]["weight"] == 50.0


# ----------------------------------------------------------------------------------------------- resistance
def test_resistances_as_ranges_functions_and_tables(permanent):
    ranges = rating.Resistances(positive_moment=[(0, 40, 6000), (40, 100, 7000)], shear=lambda x: 300 + x)
    assert ranges.nominal("moment", "positive", 40) == 6000  # where two ranges meet: the smaller (no face)
    assert ranges.nominal("moment", "positive", 70) == 7000
    assert ranges.nominal("shear", "negative", 25) == 325
    import pandas as pd

    table = pd.DataFrame({"start": [0, 0], "end": [100, 100], "action": ["positive moment", "shear"],
                          "Rn": [8000, 400]})
    a = _rate(permanent, "Type 3", resistances=rating.Resistances.from_frame(table))
    b = _rate(permanent, "Type 3")
    pd.testing.assert_frame_equal(a.frame, b.frame)


# -------------------------------------------------------------------------------------------------- laws
@settings(max_examples=15, deadline=None)
@given(share=st.floats(0.2, 1.5), more=st.floats(1.01, 3.0), rn=st.floats(4000, 20000))
def test_rf_falls_with_live_load_and_rises_with_capacity(share, more, rn):
    """Law: RF falls when the live load grows; RF rises with the capacity."""
    perm = permanent_effects(SPAN, DEAD, divisions=2, quantities=("moment", "shear"))

    def rf(g, cap):
        return rating.rate_girder(SPAN, permanent=perm, loads="Type 3", divisions=2,
                                  distribution=given_distribution(g),
                                  resistances=rating.Resistances(positive_moment=cap, shear=cap / 20)).frame["RF"]

    base = rf(share, rn)
    assert (rf(share * more, rn) < base).all()
    assert (rf(share, rn * more) > base).all()


def test_rf_is_unchanged_by_a_change_of_units():
    """Law: the same girder in kN and m has the same rating factors (exact unit factors, 1 ft = 0.3048 m)."""
    kip_ft = rating.rate_girder(SPAN, permanent=permanent_effects(SPAN, DEAD, divisions=4,
                                                                  quantities=("moment", "shear")),
                                loads=["design", "Type 3S2"], distribution=G, divisions=4,
                                resistances=rating.Resistances(positive_moment=8000, shear=400))
    metric = ilkit.Beam("30.48", {0: "pin", "30.48": "roller"}, units="kN-m")
    line = KIP_KN / FT_M
    dead = [DistributedLoad("girder and deck", "DC", 1.2 * line), DistributedLoad("wearing surface", "DW", 0.3 * line)]
    kn_m = rating.rate_girder(metric, permanent=permanent_effects(metric, dead, divisions=4,
                                                                  quantities=("moment", "shear")),
                              loads=["design", "Type 3S2"], distribution=G, divisions=4,
                              resistances=rating.Resistances(positive_moment=8000 * KIP_KN * FT_M, shear=400 * KIP_KN))
    assert list(kip_ft.frame["vehicle"]) == list(kn_m.frame["vehicle"])
    assert kn_m.frame["RF"].to_numpy() == pytest.approx(kip_ft.frame["RF"].to_numpy(), rel=1e-9)


def test_the_standing_vehicle_gives_the_table_at_its_governing_position(permanent):
    r = _rate(permanent, ["Type 3"])
    best = r.extreme("Type 3", "moment", 50)
    placement = best.placements[0]
    standing = r.standing("Type 3", "moment", 50, placement.front, direction=placement.direction)
    assert standing.rf == pytest.approx(r.rf("Type 3", "moment", 50, "positive"), rel=1e-12)
    away = r.standing("Type 3", "moment", 50, -100.0)
    assert away.rf == math.inf and away.live == 0


# ----------------------------------------------------------------------------------------------- bad input
def test_bad_rating_input_names_the_fix(permanent):
    with pytest.raises(MissingResistanceError, match="covers the rated section"):
        _rate(permanent, "Type 3", resistances=rating.Resistances(positive_moment=[(0, 60, 8000)], shear=400))
    with pytest.raises(MissingResistanceError, match="negative_moment="):
        beam = ilkit.Beam(120, {0: "pin", 60: "roller", 120: "roller"}, EI=1e6, units="kip-ft")
        perm = permanent_effects(beam, DEAD, divisions=2, quantities=("moment", "shear"))
        rating.rate_girder(beam, permanent=perm, loads="Type 3", distribution=G, divisions=2,
                           resistances=rating.Resistances(positive_moment=8000))
    with pytest.raises(RatingInputError, match="negative capacity"):
        rating.Resistances(positive_moment=-5)
    with pytest.raises(RatingInputError, match="unknown rating load 'Type 9'"):
        _rate(permanent, ["Type 9"])
    with pytest.raises(RatingInputError, match="unknown vehicle"):
        rating.emergency_vehicle("EV4")
    with pytest.raises(RatingInputError, match="single_lane="):
        _rate(permanent, [rating.permit_load(rating.type_3(), "special single trip")])
    with pytest.raises(RatingInputError, match="permanent effects have no"):
        _rate(permanent_effects(SPAN, DEAD, divisions=2, quantities=("moment", "shear")), "Type 3")
    with pytest.raises(RatingInputError, match="dead_factors"):
        _rate(permanent_effects(SPAN, [DistributedLoad("soil", "EV", 1.0)], divisions=4,
                                quantities=("moment", "shear")), "Type 3")
    with pytest.raises(RatingInputError, match="φc"):
        rating.condition_factor("excellent")
    with pytest.raises(RatingInputError):
        rating.Resistances()


def test_the_rating_core_imports_no_plotting_widgets_or_pdf():
    import subprocess
    import sys

    code = ("import sys, ilkit.rating; "
            "print([m for m in ('matplotlib', 'ipywidgets', 'weasyprint', 'ilkit.views') if m in sys.modules])")
    out = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True, check=True)
    assert out.stdout.strip() == "[]"
