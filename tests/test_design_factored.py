"""The girder's live load and its factored envelopes (ilkit.design.live, ilkit.design.factored)."""

from __future__ import annotations

import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

import ilkit
from ilkit import loads
from ilkit.design import (
    DistributedLoad,
    FactorAppliedTwiceError,
    GirderLiveLoad,
    factored_envelope,
    given_distribution,
    live_envelope,
    permanent_effects,
)
from tests.profiles import examples

AASHTO = "AASHTO LRFD Bridge Design Specifications, 9th edition (2020)"
SPAN = ilkit.Beam(100, {0: "pin", 100: "roller"}, units="kip-ft")
DEAD = [DistributedLoad("girder and deck", "DC", 1.2), DistributedLoad("wearing surface", "DW", 0.3)]


@pytest.fixture(scope="module")
def permanent():
    return permanent_effects(SPAN, DEAD, divisions=4, quantities=("moment", "shear", "reaction"))


def test_a_factored_value_worked_by_hand(reference, permanent):
    # a 100 ft simple span, midspan moment (derived in this test):
    #   DC 1.2 kip/ft: w L² / 8 = 1500 kip·ft; DW 0.3 kip/ft: 375 kip·ft
    #   HL-93, one lane (AASHTO LRFD 3.6.1.2): the design truck with its middle axle at midspan, 14 ft spacings:
    #   32 × 25 + 32 × 18 + 8 × 18 = 1520 kip·ft, times 1 + IM = 1.33; the lane 0.64 × 100² / 8 = 800 kip·ft
    #   (the tandem gives less: 25 × 25 + 25 × 23 = 1200)
    #   the girder's share 0.6 lanes (given); Strength I (Tables 3.4.1-1 and 3.4.1-2, from memory):
    #   1.25 × 1500 + 1.50 × 375 + 1.75 × 0.6 × (1.33 × 1520 + 800); the smallest: 0.90 × 1500 + 0.65 × 375
    live = GirderLiveLoad(loads.hl93(), distribution=given_distribution(0.6, girder="G2"))
    env = factored_envelope(SPAN, permanent=permanent, live=live, limit_states=["Strength I", "Service I"],
                            divisions=4)
    lane = 1.33 * 1520 + 800
    reference("Strength I, largest midspan moment", expected=1.25 * 1500 + 1.50 * 375 + 1.75 * 0.6 * lane,
              computed=env.value("moment", 50, "Strength I"), source=AASHTO,
              clause="Tables 3.4.1-1 and 3.4.1-2 (from memory); 3.6.1.2 HL-93; statics of a simple span",
              from_memory=True, rel=1e-12)
    reference("Strength I, smallest midspan moment", expected=0.90 * 1500 + 0.65 * 375,
              computed=env.value("moment", 50, "Strength I", "min"), source=AASHTO,
              clause="Table 3.4.1-2, γp,min (from memory)", from_memory=True, rel=1e-12)
    reference("Service I, largest midspan moment", expected=1500 + 375 + 0.6 * lane,
              computed=env.value("moment", 50, "Service I"), source=AASHTO, clause="Table 3.4.1-1, Service I",
              from_memory=True, rel=1e-12)
    row = env.frame[(env.frame["quantity"] == "moment") & (env.frame["x"] == 50.0)
                    & (env.frame["limit_state"] == "Strength I")].iloc[0]
    assert row["max_case"] == "design truck + lane" and row["min_case"] == "no live load"
    assert row["permanent_max"] + row["live_max"] == pytest.approx(row["max"])
    assert env.factors["Strength I"]["moment"].describe() == (
        "IM 33 % (design truck, design tandem, two design trucks) × gM 0.60 × γLL 1.75")


def test_en1990_frequent_takes_psi_per_part(reference):
    # LM1 lane 1 on a 20 m simple span, midspan moment (derived in this test): the tandem, two 300 kN axles
    # 1.2 m apart, one at midspan (ordinate 5), the other 1.2 m from it (ordinate 8.8 × 10 / 20 = 4.4):
    # 300 × 5 + 300 × 4.4 = 2820 kN·m; the uniform 9 kN/m² × 3 m = 27 kN/m: 27 × 20² / 8 = 1350 kN·m;
    # frequent (EN 1990 Table A2.1, ψ1 from memory): 0.75 × 2820 + 0.40 × 1350
    beam = ilkit.Beam(20, {0: "pin", 20: "roller"}, units="kN-m")
    dead = permanent_effects(beam, [DistributedLoad("self weight", "G", 50.0)], divisions=2,
                             quantities=("moment", "shear", "reaction"))
    live = GirderLiveLoad(loads.lm1(), distribution=given_distribution(1.0))
    env = factored_envelope(beam, permanent=dead, live=live, limit_states="EN 1990", divisions=2)
    reference("SLS frequent, midspan moment", expected=50 * 400 / 8 + 0.75 * 2820 + 0.40 * 1350,
              computed=env.value("moment", 10, "SLS frequent"), source="EN 1990:2002, Annex A2",
              clause="Tables A2.1 and A2.6 (from memory); statics of a simple span", from_memory=True, rel=1e-12)
    reference("ULS 6.10, midspan moment", expected=1.35 * 2500 + 1.35 * (2820 + 1350),
              computed=env.value("moment", 10, "ULS fundamental (6.10)"), source="EN 1990:2002, Annex A2",
              clause="6.10, Table A2.4(B) (from memory)", from_memory=True, rel=1e-12)
    assert env.value("moment", 10, "SLS quasi-permanent") == pytest.approx(2500)


def test_fatigue_needs_its_own_live_load(permanent):
    hl93 = GirderLiveLoad(loads.hl93(), distribution=given_distribution(0.6))
    with pytest.raises(ilkit.DesignInputError, match=r"Fatigue I calls for a dynamic allowance of 15 %.*fatigue_truck"):
        factored_envelope(SPAN, permanent=permanent, live=hl93, limit_states="AASHTO", divisions=4)
    fatigue_m = GirderLiveLoad(loads.fatigue_truck(), distribution=given_distribution(0.6), multiple_presence=1.2)
    with pytest.raises(ilkit.DesignInputError, match="multiple presence factor is not applied"):
        factored_envelope(SPAN, permanent=permanent, live={"*": hl93, "Fatigue I": fatigue_m},
                          limit_states=["Strength I", "Fatigue I"], divisions=4)
    fatigue = GirderLiveLoad(loads.fatigue_truck(), distribution=given_distribution(0.5))
    env = factored_envelope(SPAN, permanent=permanent, live={"*": hl93, "Fatigue I": fatigue, "Fatigue II": fatigue},
                            limit_states="AASHTO", divisions=4)
    fat = env.frame[env.frame["limit_state"] == "Fatigue I"]
    assert (fat["permanent_max"] == 0).all()  # permanent loads are not part of the fatigue combinations
    assert set(env.governing(["Strength I", "Strength II"])["max_limit_state"]) <= {"Strength I"}


@pytest.mark.parametrize(
    ("kwargs", "match"),
    [
        ({"limit_states": "Strength VI"}, "unknown limit state"),
        ({"live": 3}, "give live as a GirderLiveLoad"),
        ({"live": {"Service I": None}}, "no live load for 'Strength I'"),
        ({"divisions": 5}, "computed at other sections"),
        ({"permanent": "DC"}, "give permanent="),
    ],
)
def test_bad_factored_input_is_refused(permanent, kwargs, match):
    live = GirderLiveLoad(loads.hl93(), distribution=given_distribution(0.6))
    args = {"permanent": permanent, "live": live, "limit_states": ["Strength I"], "divisions": 4} | kwargs
    with pytest.raises(ilkit.DesignInputError, match=match):
        factored_envelope(SPAN, **args)


def test_an_unknown_permanent_category_names_the_fix():
    beam = SPAN
    dead = permanent_effects(beam, [DistributedLoad("self weight", "G", 1.0)], divisions=2,
                             quantities=("moment", "shear", "reaction"))
    live = GirderLiveLoad(loads.hl93(), distribution=given_distribution(0.6))
    with pytest.raises(ilkit.DesignInputError, match="no load factors for the permanent load category 'G'"):
        factored_envelope(beam, permanent=dead, live=live, limit_states="Strength I", divisions=2)


def test_the_live_load_records_its_factors_once():
    live = GirderLiveLoad(loads.hl93(), lanes=2, multiple_presence=1.0)
    assert live.factors("moment").describe() == (
        "IM 33 % (design truck, design tandem, two design trucks) × NL 2.00 × m 1.00")
    assert live.scale("reaction") == 2.0
    with pytest.raises(ilkit.DesignInputError, match=r"hl93\(factor=\.\.\.\)"):
        GirderLiveLoad(loads.hl93(factor=1.2))
    with pytest.raises(FactorAppliedTwiceError, match="multiple presence"):
        GirderLiveLoad(loads.hl93(), multiple_presence=1.2, distribution=given_distribution(
            0.5, includes_multiple_presence=True))
    lm1 = GirderLiveLoad(loads.lm1(), distribution=given_distribution(1.0))
    assert lm1.dynamic.note == "dynamic amplification included in the load values"
    rail = GirderLiveLoad(loads.lm71(dynamic_factor=1.12), lanes=1)
    assert rail.dynamic.describe() == "Φ 1.12 (LM71)"


TWO_SPANS = ilkit.Beam(150, {0: "pin", 60: "roller", 150: "roller"}, EI=1e6, units="kip-ft")


@pytest.fixture(scope="module")
def lane_envelope():
    return live_envelope(TWO_SPANS, GirderLiveLoad(loads.hl93(), distribution=given_distribution(1.0)), divisions=2)


@settings(max_examples=examples(25), deadline=None)
@given(
    dc=st.floats(-3.0, 3.0).filter(lambda v: abs(v) > 1e-3),
    dw=st.floats(0.0, 1.0),
    share=st.floats(0.1, 2.0),
    name=st.sampled_from(["Strength I", "Strength II", "Service I", "Service II", "Service III"]),
)
def test_laws_of_the_factored_envelope(lane_envelope, dc, dw, share, name):
    # laws: the factored max is never below the min; scaling the girder's share scales the live part only
    dead = permanent_effects(TWO_SPANS, [DistributedLoad("deck", "DC", dc), DistributedLoad("wearing", "DW", dw)],
                             divisions=2, quantities=("moment", "shear", "reaction"))
    one = lane_envelope.for_girder(GirderLiveLoad(loads.hl93(), distribution=given_distribution(share)))
    two = lane_envelope.for_girder(GirderLiveLoad(loads.hl93(), distribution=given_distribution(2 * share)))
    a = factored_envelope(TWO_SPANS, permanent=dead, live=one, limit_states=name, divisions=2).frame
    b = factored_envelope(TWO_SPANS, permanent=dead, live=two, limit_states=name, divisions=2).frame
    assert (a["max"] >= a["min"] - 1e-9 * a["max"].abs().max()).all()
    np.testing.assert_allclose(b["live_max"], 2 * a["live_max"], rtol=1e-12)
    np.testing.assert_allclose(b["live_min"], 2 * a["live_min"], rtol=1e-12)
    np.testing.assert_array_equal(b["permanent_max"], a["permanent_max"])


def test_live_envelope_is_one_lane_times_the_share():
    live = GirderLiveLoad(loads.hl93(), distribution=given_distribution(0.5, 0.8))
    env = live_envelope(SPAN, live, divisions=4)
    lane = loads.envelope(SPAN, loads.hl93(), divisions=4)
    mid = env.frame[(env.frame["quantity"] == "moment") & (env.frame["x"] == 50.0)].iloc[0]
    assert mid["max"] == pytest.approx(0.5 * lane.extreme("moment", 50).value, rel=1e-12)
    end = env.frame[(env.frame["quantity"] == "reaction") & (env.frame["x"] == 0.0)].iloc[0]
    assert end["max"] == pytest.approx(0.8 * lane.extreme("reaction", 0).value, rel=1e-12)
    assert env.extremes("moment", 50).maximum.value == lane.extreme("moment", 50).value


def test_the_factor_on_one_part_standing_alone():
    """part_factor: the part's case factor and dynamic effect, the share of the action, γLL and ψ of its kind
    (values: AASHTO LRFD Tables 3.4.1-1, 3.6.2.1-1 and 3.6.1.3.1, EN 1990 Table A2.1 ψ1, all from memory)."""
    from ilkit.design import LIMIT_STATES

    live = GirderLiveLoad(loads.hl93(), distribution=given_distribution(0.6, 0.8, includes_multiple_presence=True))
    assert live.part_factor("design truck", "moment") == (pytest.approx(1.33 * 0.6), "IM 33 % × gM 0.60")
    value, words = live.part_factor("two design trucks", "reaction", LIMIT_STATES["Strength I"])
    assert value == pytest.approx(1.33 * 0.9 * 0.8 * 1.75) and words == "IM 33 % × case factor 0.9 × gV 0.80 × γLL 1.75"
    assert live.part_factor("design lane", "moment")[0] == pytest.approx(0.6)  # no IM on the lane
    en = GirderLiveLoad(loads.lm1(), lanes=1)
    tandem = next(p.name for c in en.model.cases for p in c.parts if "tandem" in p.name.lower())
    value, words = en.part_factor(tandem, "moment", LIMIT_STATES["SLS frequent"])
    assert value == pytest.approx(0.75) and "ψ 0.75 (axles)" in words
    with pytest.raises(ilkit.DesignInputError, match="'fatigue truck' is not a part of"):
        live.part_factor("fatigue truck")
    with pytest.raises(ilkit.DesignInputError, match="Fatigue I calls for a dynamic allowance"):
        live.part_factor("design truck", "moment", LIMIT_STATES["Fatigue I"])


def test_a_settlement_counts_only_where_it_adds_and_a_determinate_beams_is_no_effect_said_so():
    """AASHTO LRFD Table 3.4.1-1 (from memory): γSE = 1.00 for settlement, taken where it adds to the extreme and
    left out where it relieves (γ 0, common practice).  On a determinate beam a settlement moves the beam as a
    rigid body: no force (statics), and the factored envelope says so in its notes."""
    from ilkit.design import Settlement

    live = GirderLiveLoad(loads.hl93(), distribution=given_distribution(0.6, includes_multiple_presence=True))
    two = ilkit.Beam(160, {0: "pin", 80: "roller", 160: "roller"}, EI=4e6, units="kip-ft")
    base = permanent_effects(two, DEAD, divisions=4, quantities=("moment", "shear", "reaction"))
    settled = permanent_effects(two, [*DEAD, Settlement("pier settles", 80, 0.05)], divisions=4,
                                quantities=("moment", "shear", "reaction"))
    lane = live_envelope(two, live, divisions=4)
    plain = factored_envelope(two, permanent=base, live=lane, limit_states="Strength I", divisions=4).frame
    moved = factored_envelope(two, permanent=settled, live=lane, limit_states="Strength I", divisions=4).frame
    s = settled.by_category()["settlement"].to_numpy()
    order = settled.by_category()[["quantity", "x", "side"]]
    key = ["quantity", "x", "side"]
    a = order.merge(plain, on=key)
    b = order.merge(moved, on=key)
    assert np.allclose(b["max"] - a["max"], np.where(s > 0, s, 0.0), rtol=1e-12, atol=1e-9)
    assert np.allclose(b["min"] - a["min"], np.where(s < 0, s, 0.0), rtol=1e-12, atol=1e-9)
    # the settlement of the middle bearing of two equal spans: M = 3EIΔ/L² over it (sagging), derived in
    # tests/test_design_permanent.py; here it raises the largest moment over the pier by exactly that
    assert settled.value("moment", 80, category="settlement") == pytest.approx(3 * 4e6 * 0.05 / 80**2, rel=1e-9)

    simple = SPAN.replace(EI=4e6)
    quiet = permanent_effects(simple, [*DEAD, Settlement("bearing settles", 100, 0.05)], divisions=4,
                              quantities=("moment", "shear", "reaction"))
    env = factored_envelope(simple, permanent=quiet, live=live, limit_states="Strength I", divisions=4)
    ref = factored_envelope(simple, permanent=permanent_effects(simple, DEAD, divisions=4,
                                                                quantities=("moment", "shear", "reaction")),
                            live=live, limit_states="Strength I", divisions=4)
    assert np.array_equal(env.frame["max"].to_numpy(), ref.frame["max"].to_numpy())
    assert any("statically determinate" in n and "no moment, shear or reaction" in n for n in env.notes)


def test_the_extremes_behind_the_governing_sections(permanent):
    """Simple span of 100 ft at quarter points: the largest factored moment is at midspan (statics); the smallest
    (zero at both ends, positive inside) is taken at the first of the equal sections, the left end."""
    live = GirderLiveLoad(loads.hl93(), distribution=given_distribution(0.6, 0.7, includes_multiple_presence=True))
    env = factored_envelope(SPAN, permanent=permanent, live=live, limit_states=["Strength I", "Service I"],
                            divisions=4)
    found = env.governing_extremes("Strength I")
    keys = [(e.maximum.quantity.kind, float(e.maximum.quantity.at), e.maximum.quantity.side) for e in found]
    assert keys[:2] == [("moment", 50.0, None), ("moment", 0.0, None)]
    assert {k[0] for k in keys} == {"moment", "shear", "reaction"}
    lane = env.live["Strength I"]
    assert found[0].maximum.value * 0.6 == pytest.approx(lane.frame.loc[
        (lane.frame["quantity"] == "moment") & (lane.frame["x"] == 50), "max"].iloc[0], rel=1e-12)
    with pytest.raises(ilkit.DesignInputError, match="governing_extremes: limit_state"):
        env.governing_extremes("Strength II")
