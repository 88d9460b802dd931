"""Dynamic effects are an explicit choice (issue 10 item 4): every combination, extreme, envelope and
table says what dynamic effect its values contain, and the rail models have no silent default."""

from __future__ import annotations

import pytest

import ilkit
from ilkit import loads
from ilkit.loads import Combination, DynamicEffect, KnifeEdge, UniformLoad

KNIFE = KnifeEdge(100.0, units="kN-m", name="k")
LANE = UniformLoad(10.0, units="kN-m", name="q")


@pytest.fixture(scope="module")
def span() -> ilkit.Beam:
    return ilkit.Beam(24, {0: "pin", 24: "roller"}, units="kN-m")


# ------------------------------------------------------------------ the data
def test_published_models_say_which_dynamic_effect_they_contain() -> None:
    # AASHTO LRFD Table 3.6.2.1-1 (33 % seen, 15 % fatigue from memory): IM on truck and tandem, not on lane
    hl93 = loads.hl93()
    for case in hl93.cases:
        assert case.dynamic.kind == "allowance" and case.dynamic.value == 0.33
        assert "design lane" not in case.dynamic.on
    assert hl93.dynamic == (
        "dynamic allowance 33 % on design truck, design tandem, two design trucks (not on design lane)"
    )
    assert loads.fatigue_truck().cases[0].dynamic == DynamicEffect("allowance", 0.15, ("fatigue truck",))
    # EN 1991-2 4.3.2 and 4.3.3 (seen): the LM1 and LM2 values include dynamic amplification
    for model in (loads.lm1(), loads.lm1(2), loads.lm2()):
        assert model.cases[0].dynamic.kind == "included"
        assert model.dynamic == "dynamic effect included in the load values"
    # EN 1991-2 6.4.5.2 (from memory): Φ multiplies LM71 and SW/0, SW/2
    phi = loads.phi2(24.0)
    for model in (loads.lm71(dynamic_factor=phi), loads.sw0(dynamic_factor=phi), loads.sw2(dynamic_factor=phi)):
        (case,) = model.cases
        assert case.dynamic.kind == "factor" and case.dynamic.value == phi and case.factor == 1.0
        assert case.part_factor(case.parts[0]) == phi
    # AREMA impact: on the train and on the alternate live load
    cooper = loads.cooper(80, impact=0.25)
    assert [c.dynamic.kind for c in cooper.cases] == ["allowance", "allowance"]
    assert cooper.dynamic == "dynamic allowance 25 % on Cooper E80, alternate live load"


def test_leaving_the_dynamic_effect_out_is_said_not_silent() -> None:
    assert loads.cooper(80, impact=0).dynamic == "no dynamic effect"
    assert loads.lm71(dynamic_factor=1.0).cases[0].dynamic == DynamicEffect("none")
    assert loads.hl93(dynamic_allowance=0).dynamic == "no dynamic effect"
    assert Combination("c", [KNIFE]).dynamic.kind == "none"


@pytest.mark.parametrize(
    ("build", "fix"),
    [
        (lambda: loads.lm71(), r"lm71: dynamic_factor must be given.*loads\.phi2\(L\).*dynamic_factor=1\.0"),
        (lambda: loads.lm71(1.10), "lm71: dynamic_factor must be given"),
        (lambda: loads.sw0(), r"sw0: dynamic_factor must be given.*sw0\(dynamic_factor=loads\.phi2\(L\)\)"),
        (lambda: loads.sw2(), "sw2: dynamic_factor must be given"),
        (lambda: loads.cooper(), r"cooper: impact must be given.*cooper\(80, impact=0\.25\).*impact=0 to leave"),
        (lambda: loads.cooper(60, per="rail"), "cooper: impact must be given"),
    ],
)
def test_rail_models_have_no_silent_dynamic_default(build, fix) -> None:
    # regression: cooper() had impact 0 and lm71() a dynamic factor of 1.0 by default, unnoticed in results
    with pytest.raises(ilkit.LoadInputError, match=fix):
        build()


@pytest.mark.parametrize(
    ("kwargs", "match"),
    [
        ({"dynamic_allowance": 0.2, "dynamic_factor": 1.2, "dynamic_on": ["k"]}, "both a dynamic allowance"),
        ({"dynamic_allowance": 0.2, "dynamic_included": True, "dynamic_on": ["k"]}, "already contain"),
        ({"dynamic_factor": 1.2, "dynamic_included": True, "dynamic_on": ["k"]}, "already contain"),
        ({"dynamic_factor": 1.2}, "a dynamic factor of 1.2 is given but dynamic_on names no part"),
        ({"dynamic_factor": 0.9, "dynamic_on": ["k"]}, "dynamic_factor: must be at least 1, got 0.9"),
        ({"dynamic_allowance": -0.1, "dynamic_on": ["k"]}, "dynamic_allowance: must be at least 0"),
        ({"dynamic_included": "yes"}, "dynamic_included: give True or False"),
    ],
)
def test_contradictory_or_bad_dynamic_input_is_refused(kwargs, match) -> None:
    with pytest.raises(ilkit.LoadInputError, match=match):
        Combination("c", [KNIFE, LANE], **kwargs)


def test_a_dynamic_factor_is_on_the_parts_it_names_only(span) -> None:
    line = span.moment(12)
    static = Combination("static", [KNIFE, LANE])
    phi = Combination("phi", [KNIFE, LANE], dynamic_factor=1.25, dynamic_on=["k"])
    # by hand: the knife edge at midspan gives P L / 4 = 600, the lane q L^2 / 8 = 720; Φ on the knife only
    assert loads.place(line, static).value == pytest.approx(600 + 720)
    found = loads.place(line, phi)
    assert found.value == pytest.approx(1.25 * 600 + 720)
    assert list(found.to_frame()["dynamic"]) == ["dynamic factor 1.25", "none"]
    assert phi.converted("kip-ft").dynamic == phi.dynamic
    assert repr(phi) == "Combination('phi', [k, q], dynamic_factor=1.25, dynamic_on=['k'])"


# ---------------------------------------------------------- results and tables
def test_extremes_envelopes_and_their_tables_say_the_dynamic_effect(span) -> None:
    found = loads.extremes(span.moment(12), loads.lm71(1.10, dynamic_factor=1.12))
    assert found.maximum.dynamic == DynamicEffect("factor", 1.12, ("LM71",))
    assert repr(found).endswith("; dynamic factor 1.12 on LM71)")
    assert "dynamic factor 1.12 on LM71" in repr(found.maximum)
    assert set(found.maximum.to_frame()["dynamic"]) == {"dynamic factor 1.12"}
    env = loads.envelope(span, loads.cooper(80, impact=0), divisions=4)
    assert repr(env).endswith("; no dynamic effect)")
    assert set(env.to_frame()["dynamic"]) == {"no dynamic effect"}
    lm1 = loads.envelope(span, loads.lm1(), divisions=2)
    assert set(lm1.to_frame()["dynamic"]) == {"dynamic effect included in the load values"}


def test_sheet_sections_say_the_dynamic_effect(span) -> None:
    from ilkit.views._doc import to_text
    from ilkit.views.moving_records import envelope_blocks, model_blocks, placement_blocks

    found = loads.place(span.moment(12), loads.hl93().converted("kN-m"))
    assert "It contains dynamic allowance 33 % on design" in to_text(placement_blocks(found))
    env = loads.envelope(span, loads.lm71(dynamic_factor=1.12), divisions=2)
    assert "The values contain dynamic factor 1.12 on LM71." in to_text(envelope_blocks(env))
    assert "dynamic effect included in the load values" in to_text(model_blocks(loads.lm2()))


def test_the_notebook_comparison_table_says_the_dynamic_effect_of_every_row() -> None:
    # regression: the moving-loads notebook compared LM71/SW0 with Φ2 and E80 without impact, unsaid
    import json
    from pathlib import Path

    nb = json.loads((Path(__file__).parent.parent / "notebooks" / "moving_loads.ipynb").read_text("utf-8"))
    cell = next(c for c in nb["cells"] if c["cell_type"] == "code" and "summary = pd.DataFrame" in "".join(c["source"]))
    source = "".join(cell["source"])
    assert '"LM71/SW0 dynamic"' in source and '"E80 dynamic"' in source and "impact=0" in source
    shown = "".join(cell["outputs"][0]["data"]["text/plain"])
    assert "dynamic factor 1.126" in shown and "no dynamic effect" in shown
