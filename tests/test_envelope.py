"""Envelopes along a beam: sections, both faces at supports and releases, reactions, absolute maximum.

Sources: hand calculations from the influence lines (written out below),
AASHTO LRFD clause definitions (3.6.1.2, 3.6.1.3.1 from memory), and the
statics of a section (shear jumps by the support reaction).
"""

from __future__ import annotations

import numpy as np
import pytest

import ilkit
from ilkit.loads import AxleTrain, UniformLoad, design_truck, envelope, extremes, hl93, place


@pytest.fixture(scope="module")
def gerber():
    # our own three-span hinged girder (determinate): anchor spans with cantilevers, a 10 ft drop-in span
    return ilkit.Beam(250, {0: "pin", 100: "roller", 150: "roller", 250: "roller"}, hinges=[120, 130], units="kip-ft")


@pytest.fixture(scope="module")
def gerber_env(gerber):
    return envelope(gerber, hl93(), divisions=10)


def test_sections_include_tenth_points_supports_and_releases(gerber, gerber_env):
    table = gerber_env.sections
    xs = table["x [ft]"].to_numpy()
    # tenth points of each span, and the hinges
    for a, b in [(0, 100), (100, 150), (150, 250)]:
        for k in range(11):
            assert np.any(np.isclose(xs, a + (b - a) * k / 10))
    for h in (120, 130):
        assert np.isclose(xs, h).sum() == 2
    # both faces at interior supports and releases, one row at the ends
    for p in (100, 150, 120, 130):
        assert sorted(table.loc[np.isclose(xs, p), "side"]) == ["left", "right"]
    assert list(table.loc[np.isclose(xs, 0), "side"]) == [""]


def test_column_names_carry_units(gerber_env):
    assert list(gerber_env.sections.columns) == [
        "x [ft]",
        "side",
        "M max [kip·ft]",
        "M max case",
        "M min [kip·ft]",
        "M min case",
        "V max [kip]",
        "V max case",
        "V min [kip]",
        "V min case",
    ]
    assert list(gerber_env.reactions.columns) == [
        "x [ft]",
        "support",
        "R max [kip]",
        "R max case",
        "R min [kip]",
        "R min case",
    ]
    assert gerber_env.to_frame().equals(gerber_env.sections)


def test_rows_match_placement_on_each_line(gerber, gerber_env):
    model = hl93()
    table = gerber_env.sections
    for _, row in table.iloc[::7].iterrows():
        side = row["side"] or None
        m = extremes(gerber.moment(row["x [ft]"], side=side), model, beam=gerber)
        v = extremes(gerber.shear(row["x [ft]"], side=side), model, beam=gerber)
        assert row["M max [kip·ft]"] == m.maximum.value and row["M min case"] == m.minimum.case
        assert row["V max [kip]"] == v.maximum.value and row["V min [kip]"] == v.minimum.value


def test_moment_is_zero_at_hinges(gerber_env):
    at_hinges = gerber_env.sections[np.isin(gerber_env.sections["x [ft]"], [120.0, 130.0])]
    assert (at_hinges[["M max [kip·ft]", "M min [kip·ft]"]] == 0).all().all()


def test_shear_faces_at_a_support_differ_by_the_reaction(gerber):
    # statics of a thin slice over the support: V(right face) - V(left face) = R for every load position
    xs = np.linspace(0, 250, 2001)
    left, right = gerber.shear(100, side="left"), gerber.shear(100, side="right")
    assert right(xs) - left(xs) == pytest.approx(gerber.reaction(100)(xs), abs=1e-12)


def test_interior_reaction_two_truck_rule_by_hand(gerber, gerber_env, reference):
    # R at x=100 (influence line: x/100 on 0..120 up to 1.2 at the hinge, down to 0 at x=130 over the
    # drop-in span, 0 beyond).  Lane area 120 x 1.2 / 2 + 10 x 1.2 / 2 = 78 ft -> 0.64 x 78 = 49.92 kip.
    # One truck: 32 at 120, 32 at 106, 8 at 92 -> 38.4 + 33.92 + 7.36 = 79.68 kip -> 1.33 x 79.68 + 49.92.
    # Two trucks 50 ft apart (3.6.1.3.1, from memory): the rear truck's rear axle at 120 and the lead truck
    # 50 ft ahead of it: 79.68 + (8 x 0.14 + 32 x 0.28 + 32 x 0.42) = 103.2 kip -> 0.9 (1.33 x 103.2 + 49.92)
    row = gerber_env.reactions.set_index("x [ft]").loc[100.0]
    one = 1.33 * 79.68 + 49.92
    two = 0.9 * (1.33 * 103.2 + 49.92)
    assert two > one
    reference("HL-93, hinged girder, interior reaction at 100 ft: 0.9 (1.33 x 103.2 + 49.92)", expected=two,
              computed=row["R max [kip]"], rel=1e-12, unit="kip",
              source="AASHTO LRFD Bridge Design Specifications; hand calculation from the influence line",
              clause="3.6.1.2, 3.6.1.3.1 (two-truck rule, from memory)", from_memory=True)
    reference("the two-truck rule governs the interior reaction", expected="90 % (two design trucks + lane)",
              computed=row["R max case"], source="AASHTO LRFD Bridge Design Specifications", clause="3.6.1.3.1",
              from_memory=True)
    # end supports: the rule does not apply
    assert "two design trucks" not in gerber_env.reactions.set_index("x [ft]").loc[0.0, "R max case"]


def test_end_reaction_equals_end_shear(gerber_env):
    # statics: the shear just right of the left end is the left reaction
    first = gerber_env.sections.iloc[0]
    r0 = gerber_env.reactions.iloc[0]
    assert r0["R max [kip]"] == pytest.approx(first["V max [kip]"]) and r0["R min [kip]"] == pytest.approx(
        first["V min [kip]"]
    )


def test_absolute_maximum_moment_is_at_least_every_section(gerber_env):
    best = gerber_env.absolute_maximum_moment
    assert best.value >= gerber_env.sections["M max [kip·ft]"].max() - 1e-9
    assert 0 < float(best.quantity.at) < 250 and best.quantity.kind == "moment"


def test_simple_span_envelope_under_a_uniform_load(reference):
    # closed form: M max(x) = w x (L - x) / 2, V max(x) = w (L - x)^2 / (2L), V min(x) = -w x^2 / (2L);
    # absolute maximum w L^2 / 8 at midspan
    L, w = 36.0, 2.5
    env = envelope(ilkit.Beam(L, {0: "pin", L: "roller"}, units="kN-m"), UniformLoad(w, units="kN-m"), divisions=12)
    x = env.sections["x [m]"].to_numpy()
    ref = dict(rel=1e-12, abs=1e-12, source="closed forms for a uniform load on a simple span (common practice)",
               clause="areas of the influence lines")
    reference("M max(x) = w x (L - x) / 2 at twelfth points", expected=w * x * (L - x) / 2,
              computed=env.sections["M max [kN·m]"].to_numpy(), unit="kN·m", **ref)
    reference("V max(x) = w (L - x)² / (2L)", expected=w * (L - x) ** 2 / (2 * L),
              computed=env.sections["V max [kN]"].to_numpy(), unit="kN", **ref)
    reference("V min(x) = -w x² / (2L)", expected=-w * x**2 / (2 * L), computed=env.sections["V min [kN]"].to_numpy(),
              unit="kN", **ref)
    reference("absolute maximum moment w L² / 8", expected=w * L**2 / 8, computed=env.absolute_maximum_moment.value,
              unit="kN·m", **ref)


def test_extra_sections_and_lookup_of_a_governing_placement(gerber):
    env = envelope(gerber, design_truck(), divisions=2, at=[33.3])
    assert np.isclose(env.sections["x [ft]"], 33.3).any()
    e = env.extreme("moment", 33.3, "max")
    assert e.quantity.kind == "moment" and e.value == pytest.approx(
        env.sections.loc[np.isclose(env.sections["x [ft]"], 33.3), "M max [kip·ft]"].iloc[0]
    )
    r = env.extreme("reaction", 150, "min")
    assert r.value == env.reactions.set_index("x [ft]").loc[150.0, "R min [kip]"]
    with pytest.raises(ilkit.IlkitError, match=r"no moment at x=34 in this envelope; it has x = 0, 33\.3, 50, 100"):
        env.extreme("moment", 34)
    with pytest.raises(ilkit.IlkitError, match="'moment', 'shear' or 'reaction'"):
        env.extreme("moments", 50)
    assert "absolute maximum moment" in repr(env)


def test_envelope_input_errors(gerber):
    train = AxleTrain([10], [], units="kip-ft")
    with pytest.raises(ilkit.IlkitError, match="divisions"):
        envelope(gerber, train, divisions=0)
    with pytest.raises(ilkit.IlkitError, match="off the beam"):
        envelope(gerber, train, at=[260])
    with pytest.raises(ilkit.IlkitError, match="expected a load"):
        envelope(gerber, "HL-93")


def test_continuous_girder_envelope():
    # two 120 ft spans from the stiffness solver; the hand values of the two-truck rule are in
    # tests/test_load_models.py; here: faces at the pier, the pier rows and the absolute maximum
    L = 120
    beam = ilkit.Beam(2 * L, {0: "pin", L: "roller", 2 * L: "roller"}, EI=1, units="kip-ft")
    env = envelope(beam, hl93(), divisions=12)
    pier = env.sections[np.isclose(env.sections["x [ft]"], L)]
    assert list(pier["side"]) == ["left", "right"]
    assert (pier["M min case"] == "90 % (two design trucks + lane)").all()
    # the moment does not jump over a pin support: both faces carry the same moment envelope
    assert pier["M min [kip·ft]"].iloc[0] == pier["M min [kip·ft]"].iloc[1]
    # shear just left and right of the pier differ in sign
    assert pier["V min [kip]"].iloc[0] < 0 < pier["V max [kip]"].iloc[1]
    reactions = env.reactions.set_index("x [ft]")
    assert reactions.loc[float(L), "R max case"] == "90 % (two design trucks + lane)"
    # symmetry of the girder and of the model (both travel directions)
    assert reactions.loc[0.0, "R max [kip]"] == pytest.approx(reactions.loc[2.0 * L, "R max [kip]"], rel=1e-12)
    # the absolute maximum is at least as large as a dense scan of sections near it
    best = env.absolute_maximum_moment
    at = float(best.quantity.at)
    scan = [place(beam.moment(a), hl93(), beam=beam).value for a in np.arange(at - 2, at + 2.01, 0.25)]
    assert best.value >= max(scan) - 1e-9
    assert best.value - max(scan) < 1e-3 * best.value


# ------------------------------------------- every support kind (regression: ties were sorted on result objects)
# Our own beams (kN, m), one per kind of support or release.  Where the moment jumps over a support (an
# interior fixed support, a rotational spring) the two faces at one position carry different extremes, and
# ordering the samples by position once fell through to comparing Extreme objects: TypeError.
EVERY_SUPPORT_KIND = {
    "pin and roller": ilkit.Beam(24, {0: "pin", 24: "roller"}, units="kN-m"),
    "fixed at both ends": ilkit.Beam(24, {0: "fixed", 24: "fixed"}, EI=1e5, units="kN-m"),
    "fixed end and roller": ilkit.Beam(24, {0: "fixed", 24: "roller"}, EI=1e5, units="kN-m"),
    "interior fixed support": ilkit.Beam(26, {0: "pin", 10: "fixed", 26: "roller"}, EI=1e5, units="kN-m"),
    "interior vertical spring": ilkit.Beam(
        30, {0: "pin", 12: ilkit.Spring(vertical=4000), 30: "roller"}, EI=1e5, units="kN-m"
    ),
    "interior rotational spring": ilkit.Beam(
        30, {0: "pin", 12: ilkit.Spring(rotational=2e4), 30: "roller"}, EI=1e5, units="kN-m"
    ),
    "end rotational spring": ilkit.Beam(
        20, {0: ilkit.Spring(rotational=3e4), 20: "roller"}, EI=1e5, units="kN-m"
    ),
    "settling fixed end": ilkit.Beam(
        20, {0: ilkit.Spring(vertical=5000, rotational="rigid"), 14: "roller"}, EI=1e5, units="kN-m"
    ),
    "hinge": ilkit.Beam(30, {0: "fixed", 24: "roller"}, hinges=[9], units="kN-m"),
    "shear release": ilkit.Beam(30, {0: "fixed", 20: "roller", 30: "roller"}, shear_releases=[8], EI=1e5,
                                units="kN-m"),
}
# our own two-axle vehicle and lane load, placed together
PAIR = ilkit.Combination(
    "pair and lane",
    [AxleTrain([80, 120], [3.5], units="kN-m", name="pair"), UniformLoad(6, units="kN-m", name="lane")],
)


@pytest.mark.parametrize("name", list(EVERY_SUPPORT_KIND))
def test_envelope_on_every_support_kind_matches_placement_on_each_line(name):
    beam = EVERY_SUPPORT_KIND[name]
    env = envelope(beam, PAIR, divisions=4)
    for _, row in env.sections.iterrows():
        side = row["side"] or None
        m = extremes(beam.moment(row["x [m]"], side=side), PAIR, beam=beam)
        v = extremes(beam.shear(row["x [m]"], side=side), PAIR, beam=beam)
        assert (row["M max [kN·m]"], row["M min [kN·m]"]) == (m.maximum.value, m.minimum.value)
        assert (row["V max [kN]"], row["V min [kN]"]) == (v.maximum.value, v.minimum.value)
    assert list(env.reactions["x [m]"]) == [float(s.at) for s in beam.supports]
    for _, row in env.reactions.iterrows():
        r = extremes(beam.reaction(row["x [m]"]), PAIR, beam=beam)
        assert (row["R max [kN]"], row["R min [kN]"]) == (r.maximum.value, r.minimum.value)
    best = env.absolute_maximum_moment
    assert best.value >= env.sections["M max [kN·m]"].max()
    assert best.value == place(beam.moment(best.quantity.at), PAIR, beam=beam).value


def test_envelope_ties_at_an_interior_fixed_support_do_not_compare_results(reference):
    # Propped cantilevers on either side of the fixed support at x = 10: spans of 10 m and 16 m.  Beam fixed at
    # one end and simply supported at the other under a uniform load w (AISC Steel Construction Manual, Table
    # 3-23, case 12, from memory; also the compatibility of the prop): fixed-end moment -w l^2 / 8, largest
    # sagging moment 9 w l^2 / 128 at 3 l / 8 from the simple support.  Each line is single-signed, so a lane
    # load that may be broken covers the whole span.
    beam = EVERY_SUPPORT_KIND["interior fixed support"]
    w = 5
    env = envelope(beam, UniformLoad(w, units="kN-m"), divisions=8)
    rows = env.sections.set_index(["x [m]", "side"])
    aisc = dict(source="AISC Steel Construction Manual, Table 3-23 (beam diagrams and formulas)",
                clause="case 12: beam fixed at one end, supported at the other, uniformly distributed load",
                from_memory=True, rel=1e-12)
    reference("fixed-end moment of the 10 m propped span, w = 5 kN/m: -w l²/8",
              computed=rows.loc[(10.0, "left"), "M min [kN·m]"], expected=-w * 10**2 / 8, **aisc)
    reference("fixed-end moment of the 16 m propped span, w = 5 kN/m: -w l²/8",
              computed=rows.loc[(10.0, "right"), "M min [kN·m]"], expected=-w * 16**2 / 8, **aisc)
    reference("largest sagging moment of the 10 m propped span at 3l/8: 9 w l²/128",
              computed=rows.loc[(3.75, ""), "M max [kN·m]"], expected=9 * w * 10**2 / 128, **aisc)
    reference("largest sagging moment of the 16 m propped span at 3l/8: 9 w l²/128",
              computed=rows.loc[(20.0, ""), "M max [kN·m]"], expected=9 * w * 16**2 / 128, **aisc)
    best = env.absolute_maximum_moment
    assert best.value == pytest.approx(9 * w * 16**2 / 128, rel=1e-9)
    assert float(best.quantity.at) == pytest.approx(20, abs=1e-4)
    # each face's placement is the one behind its own row
    assert env.extreme("moment", 10, "min", side="right").value == rows.loc[(10.0, "right"), "M min [kN·m]"]


def test_symmetric_girder_reports_both_mirror_positions_of_the_absolute_maximum(reference):
    # regression: a symmetric girder's absolute maximum was given at one of two mirror positions without a word.
    # Two equal moving loads P at d on a simple span L (AISC Steel Construction Manual, Table 3-23, case 44,
    # from memory): M max = P (2L - d)^2 / (8L), under one load at d/4 from midspan, on either side.
    P, d, L = 180, 3.2, 12
    trolley = AxleTrain([P, P], [d], units="kN-m", name="trolley")
    env = envelope(ilkit.Beam(L, {0: "pin", L: "roller"}, units="kN-m"), trolley, divisions=12)
    reference("absolute maximum moment of two 180 kN loads 3.2 m apart on a 12 m span: P (2L - d)² / (8L)",
              computed=env.absolute_maximum_moment.value, expected=P * (2 * L - d) ** 2 / (8 * L), rel=1e-9,
              source="AISC Steel Construction Manual, Table 3-23 (beam diagrams and formulas)",
              clause="case 44: simple beam, two equal concentrated moving loads", from_memory=True)
    assert env.absolute_maximum_positions == pytest.approx((L / 2 - d / 4, L / 2 + d / 4), abs=1e-5 * L)
    # the continuous girder of the demo is symmetric too (90 + 115 + 90 ft): mirror positions about 147.5
    env = envelope(ilkit.Beam(295, {0: "pin", 90: "roller", 205: "roller", 295: "roller"}, EI=1, units="kip-ft"),
                   hl93(), divisions=10)
    a, b = env.absolute_maximum_positions
    assert a + b == pytest.approx(295, abs=1e-4) and a < 147.5 < b
    # a girder that is not symmetric has one
    env = envelope(ilkit.Beam(30, {0: "pin", 12: "roller", 30: "roller"}, EI=1, units="kN-m"),
                   UniformLoad(5, units="kN-m"), divisions=10)
    assert len(env.absolute_maximum_positions) == 1


def test_envelope_extreme_at_a_jump_asks_for_the_side():
    # regression: env.extreme("shear", 105) at a pier silently returned the left side
    beam = ilkit.Beam(200, {0: "pin", 105: "roller", 200: "roller"}, EI=1e6, units="kip-ft")
    env = envelope(beam, hl93(), divisions=2)
    with pytest.raises(ilkit.SideRequiredError, match="side='left'"):
        env.extreme("shear", 105)
    left, right = env.extreme("shear", 105, side="left"), env.extreme("shear", 105, side="right")
    assert left.quantity.side == "left" and right.quantity.side == "right"
    assert left.value != right.value
    # the moment does not jump over a roller: both sides hold one value and no side is needed
    assert env.extreme("moment", 105, "min").value == env.extreme("moment", 105, "min", side="right").value
