"""Rail ratings (ilkit.rating.rail): AREMA impact and the Cooper E-rating, EN 1991-2 classified load α."""

from __future__ import annotations

import math

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

import ilkit
from ilkit import loads, rating
from ilkit.design import DistributedLoad, permanent_effects
from ilkit.errors import RatingInputError

AREMA = "AREMA Manual for Railway Engineering, Chapter 15 (a recent annual edition)"
EN = "EN 1991-2:2003"

SPAN = ilkit.Beam(60, {0: "pin", 60: "roller"}, units="kip-ft")
DECK = [DistributedLoad("steel and open deck", "DC", 1.0)]


@pytest.mark.parametrize(("span", "structure", "spacing", "percent"), [
    # by hand: L < 80 ft: 40 − 3L²/1600; L ≥ 80 ft: 16 + 600/(L − 30); rocking 100/S; ballasted × 0.90
    (50.0, "steel open deck", None, 40 - 3 * 50**2 / 1600),          # 35.3125 %
    (80.0, "steel open deck", None, 16 + 600 / 50),                  # 28 % (both formulas agree at 80 ft)
    (120.0, "steel open deck", 7.0, 16 + 600 / 90 + 100 / 7),        # 22.667 % + 14.286 %
    (40.0, "steel ballasted deck", 6.5, 0.9 * (40 - 3 * 40**2 / 1600 + 100 / 6.5)),
])
def test_arema_impact_by_hand(reference, span, structure, spacing, percent):
    f = rating.arema_impact(span, structure, girder_spacing=spacing)
    reference(f"AREMA impact, {structure}, L = {span:g} ft", expected=1 + percent / 100, computed=f.value,
              source=AREMA, clause="1.3.5, impact load (from memory)", from_memory=True, rel=1e-12)
    assert f.kind == "dynamic allowance" and f.from_memory


def test_cooper_rating_formula_on_a_simple_span(reference):
    # E = 80 (C − D) / (share × E80 effect with impact): the E80 effect is the exact placement of the
    # Cooper E80 train and alternate live load (ilkit.loads.place); the dead load is w L² / 8 at midspan.
    perm = permanent_effects(SPAN, DECK, divisions=2, quantities=("moment", "shear"))
    cap = rating.Resistances(positive_moment=4000, shear=400, name="allowable at the normal level")
    r = rating.cooper_rating(SPAN, permanent=perm, capacity={"normal": cap}, girder_spacing=6.5, divisions=2)
    impact = rating.arema_impact(60, girder_spacing=6.5).value
    e80 = loads.place(SPAN.moment(30), loads.cooper(80, impact=impact - 1), "max").value
    expected = 80 * (4000 - 1.0 * 60**2 / 8) / (0.5 * e80)
    row = r.frame[(r.frame["quantity"] == "moment") & (r.frame["x"] == 30.0)].iloc[0]
    reference("Cooper E-rating at midspan, normal level", expected=expected, computed=row["rating"], source=AREMA,
              clause="Chapter 15, rating: E = 80 (C − D) / (L80 (1 + I)) (from memory)", from_memory=True, rel=1e-12)
    assert row["live"] == pytest.approx(0.5 * e80)
    assert r.controlling().iloc[0]["rating"] <= row["rating"]


@settings(max_examples=10, deadline=None)
@given(room=st.floats(200.0, 5000.0))
def test_e_rating_scales_with_capacity_minus_dead_load(room):
    """Law: doubling C − D doubles the E-n (effects scale with n; the placement does not change)."""
    perm = permanent_effects(SPAN, DECK, divisions=2, quantities=("moment",))

    def dead(x: float) -> float:
        return 1.0 * x * (60 - x) / 2

    def e(k: float) -> float:
        cap = rating.Resistances(positive_moment=lambda x: dead(x) + k)
        r = rating.cooper_rating(SPAN, permanent=perm, capacity={"maximum": cap}, impact=0.3, divisions=2)
        return r.frame.set_index(["x"])["rating"]

    assert (e(2 * room) / e(room)).to_numpy() == pytest.approx(2.0, rel=1e-12)


def test_determinant_length_and_dynamic_factor(reference):
    # EN 1991-2 Table 6.2 (from memory): three continuous spans 20, 25, 20 m: LΦ = 1.3 × mean span = 28.17 m
    # (not less than the longest span); Φ3 = 2.16 / (√LΦ − 0.2) + 0.73 (6.4.5.2, from memory)
    beam = ilkit.Beam(65, {0: "pin", 20: "roller", 45: "roller", 65: "roller"}, EI=1e7, units="kN-m")
    length = rating.determinant_length(beam)
    reference("determinant length, three continuous spans", expected=1.3 * 65 / 3, computed=length, source=EN,
              clause="Table 6.2, case 5.1 (from memory)", from_memory=True, rel=1e-12)
    assert rating.determinant_length(ilkit.Beam(12, {0: "pin", 12: "roller"}, units="kN-m")) == 12
    assert rating.determinant_length(ilkit.Beam(50, {0: "pin", 5: "roller", 50: "roller"}, EI=1, units="kN-m")) == 45
    perm = permanent_effects(beam, [DistributedLoad("deck", "G", 60.0)], divisions=2, quantities=("moment",))
    r = rating.classified_rating(beam, permanent=perm, divisions=2,
                                 resistances=rating.Resistances(positive_moment=20000, negative_moment=20000))
    phi = 2.16 / (math.sqrt(length) - 0.2) + 0.73
    reference("Φ3 for the determinant length", expected=phi, computed=r.frame["dynamic"].iloc[0], source=EN,
              clause="6.4.5.2 (3) (from memory)", from_memory=True, rel=1e-12)
    # α = (Rd − γG G) / (γQ × share × Φ LM71 effect); the classified value is the largest listed α below it
    row = r.frame.loc[r.frame["rating"].idxmin()]
    sign = 1 if row["sense"] == "positive" else -1
    assert row["rating"] == pytest.approx((20000 - sign * row["dead"]) / (1.45 * sign * row["live"]))
    top = r.controlling().iloc[0]
    assert top["alpha_class"] == max(a for a in loads.ALPHA_VALUES if a <= top["rating"])
    assert "SW/0" in " ".join(r.notes)


def test_bad_rail_input():
    perm = permanent_effects(SPAN, DECK, divisions=2, quantities=("moment",))
    cap = rating.Resistances(positive_moment=4000)
    with pytest.raises(RatingInputError, match="capacity level"):
        rating.cooper_rating(SPAN, permanent=perm, capacity={"ultimate": cap}, divisions=2)
    with pytest.raises(RatingInputError, match="structure"):
        rating.arema_impact(50, "timber trestle")
    with pytest.raises(RatingInputError):
        rating.arema_impact(-3)
