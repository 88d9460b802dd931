"""Limit states as data: each factor against the table it comes from (ilkit.design.combinations)."""

from __future__ import annotations

import pytest
from hypothesis import given
from hypothesis import strategies as st

import ilkit
from ilkit.design import AASHTO_LIMIT_STATES, EN1990_LIMIT_STATES, LIMIT_STATES, LimitState, limit_states

AASHTO = "AASHTO LRFD Bridge Design Specifications, 9th edition (2020)"
EN1990 = "EN 1990:2002 with A1:2005, Annex A2"

# (limit state, category or "live", expected (γmax, γmin) or γ, clause), every value recalled from memory
AASHTO_TABLE = [
    ("Strength I", "DC", (1.25, 0.90), "Table 3.4.1-2, DC: components and attachments"),
    ("Strength I", "DW", (1.50, 0.65), "Table 3.4.1-2, DW: wearing surfaces and utilities"),
    ("Strength I", "EL", (1.00, 1.00), "Table 3.4.1-2, EL: locked-in construction stresses"),
    ("Strength I", "EV", (1.35, 1.00), "Table 3.4.1-2, EV: retaining walls and abutments"),
    ("Strength I", "ES", (1.50, 0.75), "Table 3.4.1-2, ES: earth surcharge"),
    ("Strength I", "live", 1.75, "Table 3.4.1-1, Strength I, LL + IM"),
    ("Strength II", "DC", (1.25, 0.90), "Table 3.4.1-2"),
    ("Strength II", "live", 1.35, "Table 3.4.1-1, Strength II, LL + IM"),
    ("Service I", "DC", (1.00, 1.00), "Table 3.4.1-1, Service I, DC"),
    ("Service I", "DW", (1.00, 1.00), "Table 3.4.1-1, Service I, DW"),
    ("Service I", "live", 1.00, "Table 3.4.1-1, Service I, LL + IM"),
    ("Service II", "live", 1.30, "Table 3.4.1-1, Service II, LL + IM"),
    ("Service III", "live", 0.80, "Tables 3.4.1-1 and 3.4.1-4, Service III, LL + IM"),
    ("Fatigue I", "live", 1.75, "Table 3.4.1-1, Fatigue I, LL + IM"),
    ("Fatigue II", "live", 0.80, "Table 3.4.1-1, Fatigue II, LL + IM"),
    ("Fatigue I", "DC", (0.0, 0.0), "Table 3.4.1-1, Fatigue I: no permanent loads"),
]
EN_TABLE = [
    ("ULS fundamental (6.10)", "G", (1.35, 1.00), "Table A2.4(B), γG,sup and γG,inf"),
    ("ULS fundamental (6.10)", "settlement", (1.20, 0.0), "Table A2.4(B), γGset, linear analysis"),
    ("ULS fundamental (6.10)", "live", 1.35, "Table A2.4(B), γQ road traffic"),
    ("SLS characteristic", "G", (1.0, 1.0), "Table A2.6"),
    ("SLS characteristic", "live", 1.0, "Table A2.6"),
    ("SLS frequent", "axles", 0.75, "Table A2.1, gr1a TS, ψ1"),
    ("SLS frequent", "uniform", 0.40, "Table A2.1, gr1a UDL, ψ1"),
    ("SLS quasi-permanent", "axles", 0.0, "Table A2.1, gr1a TS, ψ2"),
    ("SLS quasi-permanent", "uniform", 0.0, "Table A2.1, gr1a UDL, ψ2"),
]


def _value(state: LimitState, what: str):
    if what == "live":
        return state.live
    if what in ("axles", "uniform"):
        return state.live_parts[what]
    return state.factors_of(what)


@pytest.mark.parametrize(("name", "what", "expected", "clause"), AASHTO_TABLE)
def test_aashto_factors(reference, name, what, expected, clause):
    state = LIMIT_STATES[name]
    reference(f"{name}: {what}", expected=expected, computed=_value(state, what), source=AASHTO, clause=clause,
              from_memory=True)
    assert state.from_memory and "3.4.1" in state.source


@pytest.mark.parametrize(("name", "what", "expected", "clause"), EN_TABLE)
def test_en1990_factors(reference, name, what, expected, clause):
    state = LIMIT_STATES[name]
    reference(f"{name}: {what}", expected=expected, computed=_value(state, what), source=EN1990, clause=clause,
              from_memory=True)


def test_the_dynamic_allowance_and_multiple_presence_each_combination_calls_for(reference):
    # AASHTO LRFD Table 3.6.2.1-1: IM 33 % (seen) except fatigue 15 % (from memory); 3.6.1.1.2: no m for fatigue
    for state in AASHTO_LIMIT_STATES:
        fatigue = state.name.startswith("Fatigue")
        reference(f"{state.name}: dynamic allowance", expected=0.15 if fatigue else 0.33,
                  computed=state.dynamic_allowance, source=AASHTO, clause="Table 3.6.2.1-1", from_memory=fatigue)
        assert state.multiple_presence is not fatigue
    assert all(s.dynamic_allowance is None for s in EN1990_LIMIT_STATES)  # LM1 includes it


def test_sets_and_names():
    assert [s.name for s in limit_states("AASHTO")] == ["Strength I", "Strength II", "Service I", "Service II",
                                                        "Service III", "Fatigue I", "Fatigue II"]
    assert len(limit_states(["EN 1990"])) == 4
    mine = LimitState("Construction", {"DC": (1.25, 0.9)}, 1.5, source="owner's criteria")
    assert limit_states(["Strength I", mine])[1] is mine
    assert "Construction: DC 1.25/0.9; live 1.5" in repr(mine)
    assert list(mine.to_frame()["load"]) == ["DC", "live"]


@pytest.mark.parametrize(
    ("call", "match"),
    [
        (lambda: limit_states("Strength VI"), "unknown limit state 'Strength VI'; choose from 'AASHTO'"),
        (lambda: limit_states(["Strength I", "Strength I"]), "given more than once"),
        (lambda: limit_states([]), "at least one"),
        (lambda: LimitState("x", {"DC": (-1.25, 0.9)}, 1.75), r"γmax: must be at least 0, got -1.25 \(a load factor"),
        (lambda: LimitState("x", {"DC": (1.25, -0.9)}, 1.75), "γmin: must be at least 0"),
        (lambda: LimitState("x", {"DC": (0.9, 1.25)}, 1.75), "γmin = 1.25 is larger than γmax = 0.9"),
        (lambda: LimitState("x", {"DC": 1.25}, -1.75), "live: must be at least 0"),
        (lambda: LimitState("x", {"DC": (1, 2, 3)}, 1.0), "give two factors"),
        (lambda: LimitState("x", [1.25], 1.0), "mapping of load categories"),
        (lambda: LimitState("x", {}, 1.0, live_parts={"tandem": 0.75}), "not a part kind"),
        (lambda: LIMIT_STATES["Strength I"].factors_of("G"), r"no load factors for the permanent load category 'G'"),
    ],
)
def test_bad_limit_states_are_refused(call, match):
    with pytest.raises(ilkit.DesignInputError, match=match):
        call()


@given(effect=st.floats(-1e6, 1e6, allow_nan=False), name=st.sampled_from(sorted(LIMIT_STATES)))
def test_the_permanent_factor_is_chosen_by_sign_for_each_extreme(effect, name):
    # law: γ × P for the largest value is never below γ × P for the smallest one, and each is a factor of the table
    state = LIMIT_STATES[name]
    category = "DC" if "DC" in state.permanent else "G"
    hi, lo = state.factors_of(category)
    up, down = (state.permanent_factor(category, effect, e) for e in ("max", "min"))
    assert {up, down} <= {hi, lo}
    assert up * effect >= down * effect
