"""Factors as data: each factor applied exactly once, with its source (ilkit.design.factors)."""

from __future__ import annotations

import math

import pytest
from hypothesis import given
from hypothesis import strategies as st

import ilkit
from ilkit.design import FACTOR_KINDS, Applied, Factor, FactorAppliedTwiceError

IM = Factor("dynamic allowance", 1.33, "IM", source="AASHTO LRFD, Table 3.6.2.1-1", parts=("design truck",))
M1 = Factor("multiple presence", 1.20, "m", source="AASHTO LRFD, Table 3.6.1.1.2-1", from_memory=True)
G_FORMULA = Factor("distribution", 0.62, "g", source="AASHTO LRFD, Table 4.6.2.2.2b-1",
                   includes=("multiple presence",))
G_LEVER = Factor("distribution", 0.5, "g", note="lever rule")
GAMMA = Factor("load factor", 1.75, "γLL", source="AASHTO LRFD, Table 3.4.1-1")


def test_a_record_lists_its_factors_in_order_and_multiplies_the_whole_ones():
    record = Applied().then(IM).then(M1).then(G_LEVER).then(GAMMA)
    assert [f.symbol for f in record] == ["IM", "m", "g", "γLL"] and len(record) == 4
    assert record.describe() == "IM 33 % (design truck) × m 1.20 × g 0.50 × γLL 1.75"
    # IM is on the truck only: it is inside the effect values, listed but not multiplied
    assert record.product == pytest.approx(1.20 * 0.5 * 1.75)
    assert record.contains("multiple presence") and record.get("distribution") is G_LEVER
    assert Applied.of(IM, M1, G_LEVER, GAMMA) == record
    assert Applied().describe() == "no factors" and Applied().product == 1.0
    assert repr(Applied.of(M1)) == "Applied(m 1.20)"


def test_the_formula_factor_contains_multiple_presence():
    record = Applied.of(IM, G_FORMULA)
    assert record.contains("multiple presence") and record.get("multiple presence") is None


@pytest.mark.parametrize(
    ("first", "second", "match"),
    [
        # multiple presence on top of an AASHTO formula factor (which includes it)
        ((IM, G_FORMULA), M1, r"m 1.20 would apply multiple presence a second time.*included in g"),
        # an AASHTO formula factor on top of m
        ((M1,), G_FORMULA, r"g 0.62 includes multiple presence, which the result already contains \(m 1.20\)"),
        # IM twice
        ((IM,), Factor("dynamic allowance", 1.33, "IM"), r"IM 33 % would apply dynamic allowance a second time"),
        ((GAMMA,), Factor("load factor", 1.5, "γLL"), "load factor a second time"),
        ((G_LEVER,), G_FORMULA, "distribution a second time"),
    ],
)
def test_a_factor_applied_twice_is_refused(first, second, match):
    record = Applied.of(*first)
    with pytest.raises(FactorAppliedTwiceError, match=match) as err:
        record.then(second)
    assert err.value.kind in FACTOR_KINDS and isinstance(err.value, ilkit.IlkitError)
    with pytest.raises(FactorAppliedTwiceError):
        Applied((*first, second))


@pytest.mark.parametrize(
    ("kwargs", "match"),
    [
        ({"kind": "impact", "value": 1.2, "symbol": "I"}, "kind must be one of 'dynamic allowance'"),
        ({"kind": "load factor", "value": -1.25, "symbol": "γDC"}, r"must be at least 0, got -1.25 \(a factor"),
        ({"kind": "load factor", "value": float("nan"), "symbol": "γDC"}, "not a finite number"),
        ({"kind": "load factor", "value": True, "symbol": "γDC"}, "boolean"),
        ({"kind": "load factor", "value": 1.25, "symbol": ""}, "symbol: give a non-empty text"),
        ({"kind": "distribution", "value": 0.5, "symbol": "g", "includes": ["distribution"]}, "its own kind"),
        ({"kind": "distribution", "value": 0.5, "symbol": "g", "includes": ["presence"]}, "includes must be one"),
        ({"kind": "distribution", "value": 0.5, "symbol": "g", "from_memory": "yes"}, "give True or False"),
    ],
)
def test_bad_factors_are_refused_with_the_fix(kwargs, match):
    with pytest.raises(ilkit.DesignInputError, match=match):
        Factor(**kwargs)


def test_bad_records_are_refused():
    with pytest.raises(ilkit.DesignInputError, match="give a Factor"):
        Applied().then(1.2)  # type: ignore[arg-type]
    with pytest.raises(ilkit.DesignInputError, match="list of Factor"):
        Applied(M1)  # type: ignore[arg-type]
    with pytest.raises(ilkit.DesignInputError, match="kind must be one of"):
        Applied().contains("presence")  # type: ignore[arg-type]


def test_status_says_where_the_value_comes_from():
    assert (M1.status, GAMMA.status, G_LEVER.status) == ("from memory", "read", "given")
    assert Factor("load factor", "1.25", "γDC").value == 1.25  # read like every number of ilkit


@st.composite
def _factor(draw):
    kind = draw(st.sampled_from(FACTOR_KINDS))
    others = [k for k in FACTOR_KINDS if k != kind]
    return Factor(kind, draw(st.floats(0.0, 10.0)), draw(st.sampled_from(["a", "b", "c"])),
                  includes=tuple(draw(st.lists(st.sampled_from(others), max_size=2, unique=True))))


_FACTOR = _factor()


@given(st.lists(_FACTOR, max_size=6))
def test_a_record_holds_each_kind_at_most_once_and_its_product_is_that_of_its_factors(factors):
    # law: a sequence of factors builds a record exactly when no kind is contained twice
    kinds = [k for f in factors for k in f.kinds]
    if len(kinds) == len(set(kinds)):
        record = Applied(tuple(factors))
        assert record.kinds == set(kinds)
        assert record.product == pytest.approx(math.prod(f.value for f in factors))
    else:
        with pytest.raises(FactorAppliedTwiceError):
            Applied(tuple(factors))
