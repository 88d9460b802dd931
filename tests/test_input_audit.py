"""Regression tests from the audit of the core for bad input and robustness.

Each test is named after the defect it pins: before the fix the call gave a raw
library traceback (numpy, pandas, pint, Python), a warning, a silent NaN or
infinity, or a plausible but wrong number.  Now every bad input raises a
subclass of :class:`ilkit.IlkitError` whose message names the value and the
fix.  The last tests feed random junk (hypothesis) to every public entry point
and check that nothing but an :class:`ilkit.IlkitError` comes out.
"""

from __future__ import annotations

import math
import warnings
from decimal import Decimal
from fractions import Fraction

import numpy as np
import pandas as pd
import pytest
from hypothesis import HealthCheck, given, settings
from hypothesis import strategies as st

import ilkit
from ilkit import (
    BeamInputError,
    IlkitError,
    IllConditionedError,
    LoadInputError,
    Quantity,
    Spring,
    Support,
    batch,
    rating,
    trusses,
)
from ilkit.design import (
    Applied,
    CrossSection,
    DistributedLoad,
    Factor,
    GirderLiveLoad,
    LimitState,
    PointLoad,
    Section,
    Settlement,
    SpanLoad,
    Stage,
    aashto_deflection_load,
    aashto_distribution,
    concurrent_forces,
    deflection_check,
    design_lanes,
    envelope_sections,
    given_distribution,
    limit_states,
    notional_lanes,
    permanent_effects,
    place_design_lanes,
    transverse_line,
)
from ilkit.influence import InfluenceLine
from ilkit.loads import (
    AxleTrain,
    Combination,
    KnifeEdge,
    LoadModel,
    UniformBlocks,
    UniformLoad,
    alternate_live_load,
    cooper,
    cooper_train,
    envelope,
    extremes,
    hl93,
    lm1,
    lm71,
    multiple_presence,
    place,
    stand,
    train_length,
)
from ilkit.units import UnitSystem

SPAN = ilkit.Beam(10, {0: "pin", 10: "roller"}, EI=1, units="kN-m")
TWO_SPANS = ilkit.Beam(20, {0: "pin", 10: "pin", 20: "roller"}, EI=1, units="kN-m")
KNIFE = KnifeEdge(1, units="kN-m", name="k")


def beam_error(match):
    return pytest.raises(BeamInputError, match=match)


def load_error(match):
    return pytest.raises(LoadInputError, match=match)


# =========================================================================== beam
def test_release_list_given_as_a_0d_array_is_refused_not_a_raw_iteration_error():
    with beam_error(r"hinges: give a list of positions, e.g. \[12.5\]; got array\(5"):
        ilkit.Beam(10, {0: "fixed", 10: "roller"}, hinges=np.array(5.0))
    with beam_error("shear_releases: give a list of positions"):
        ilkit.Beam(10, {0: "fixed", 10: "fixed"}, shear_releases=np.array(5.0))


def test_release_list_given_as_a_mapping_is_refused_not_read_by_its_keys():
    with beam_error(r"hinges: give a list of positions.*got \{5: 'x'\}"):
        ilkit.Beam(10, {0: "fixed", 10: "roller"}, hinges={5: "x"})
    # a set, a numpy array and a Series are lists of positions
    for positions in ({5}, np.array([5.0]), pd.Series([5.0])):
        assert ilkit.Beam(10, {0: "fixed", 10: "roller"}, hinges=positions).hinges == (5,)


def test_ei_given_as_a_0d_array_is_one_number():
    assert ilkit.Beam(10, {0: "pin", 10: "roller"}, EI=np.array(2.5)).EI == Fraction(5, 2)


def test_ei_range_given_as_a_0d_array_is_refused_not_a_raw_iteration_error():
    with beam_error(r"EI: each range must be \(start, end, EI\), got array\(5"):
        ilkit.Beam(10, {0: "pin", 10: "roller"}, EI=[np.array(5.0)])


@pytest.mark.parametrize("side", [np.array(["left", "right"]), pd.Series(["left"]), pd.NA, ["left"], "Left"])
def test_side_that_is_not_a_word_is_refused_not_a_raw_truth_value_error(side):
    with beam_error(r"shear: side must be 'left' or 'right' \(or leave it out\), got"):
        TWO_SPANS.shear(10, side=side)


@pytest.mark.parametrize("kind", [["moment"], {"moment": 1}, np.array(["moment"]), None])
def test_quantity_kind_that_is_not_a_word_is_refused_not_unhashable(kind):
    with beam_error("quantity: unknown kind"):
        SPAN.line(kind, 5)
    with beam_error("quantity: unknown kind"):
        SPAN.locations(kind)


def test_support_object_with_an_unknown_kind_no_longer_acts_as_a_pin():
    with beam_error(r"Support: kind must be one of 'fixed', 'pin', 'roller' or 'spring', got 'bogus'"):
        Support(Fraction(10), "bogus")  # type: ignore[arg-type]


def test_support_object_of_kind_spring_needs_a_spring_and_only_it_takes_one():
    with beam_error("a 'spring' support needs spring=ilkit.Spring"):
        Support(Fraction(10), "spring")
    with beam_error("a 'spring' support needs spring=ilkit.Spring"):
        Support(Fraction(10), "spring", 5)  # type: ignore[arg-type]
    with beam_error("only a 'spring' support takes one"):
        Support(Fraction(0), "fixed", Spring(vertical=5))


def test_support_object_at_another_position_than_its_key_is_refused_not_moved():
    with beam_error(r"the Support at key x=10 says at=3"):
        ilkit.Beam(10, {0: "pin", 10: Support(Fraction(3), "roller")})
    beam = ilkit.Beam(10, {0: "pin", 10: Support(Fraction(10), "spring", Spring(vertical=5))}, EI=1)
    assert beam.supports[1].vertical_stiffness == 5


def test_unit_system_with_unusable_factors_or_names_is_refused_at_once():
    with beam_error("UnitSystem.metres_per_length: cannot read 'a'"):
        UnitSystem("z", "m", "kN", "a", Fraction(1000))  # type: ignore[arg-type]
    with beam_error("metres_per_length must be greater than 0"):
        UnitSystem("z", "m", "kN", Fraction(0), Fraction(1000))
    with beam_error("UnitSystem: force must be a non-empty text"):
        UnitSystem("z", "m", "", Fraction(1), Fraction(1000))
    assert UnitSystem("z", "m", "kN", 0.5, 1000).metres_per_length == Fraction(1, 2)


def test_custom_unit_system_names_no_longer_break_the_dimension_message():
    pint = pytest.importorskip("pint")
    ureg = pint.UnitRegistry()
    chains = UnitSystem("chain-kN", "chain", "kN", Fraction("20.1168"), Fraction(1000))
    with pytest.raises(ilkit.UnitsError, match=r"must be a length; give it in chain or an equivalent unit"):
        ilkit.Beam(5 * ureg.kN, {0: "fixed"}, units=chains)


def test_quantity_is_checked_where_it_is_made():
    with beam_error(r"Quantity: kind must be one of 'reaction', .* got 'torque'"):
        Quantity("torque", Fraction(1))  # type: ignore[arg-type]
    with beam_error(r"Quantity: side must be 'left' or 'right'"):
        Quantity("moment", Fraction(1), "up")  # type: ignore[arg-type]
    assert Quantity("moment", 1.5).at == Fraction(3, 2)  # type: ignore[arg-type]


@pytest.mark.parametrize("huge", [10**400, "1e400", Fraction(10**400, 3), Decimal("1e400")])
def test_numbers_beyond_the_float_range_are_refused_not_an_overflow_later(huge):
    with beam_error(r"length: the value given \(about 1e\+\d+\) is too large for float arithmetic"):
        ilkit.Beam(huge, {0: "fixed"})


def test_nonzero_numbers_that_vanish_as_floats_are_refused():
    with beam_error(r"too small for float arithmetic"):
        ilkit.Beam(10, {0: "pin", 10: "roller"}, hinges=["1e-400"])


def test_complex_numbers_are_refused_not_cut_to_their_real_part():
    with beam_error("expected a number, got complex128"):
        ilkit.Beam(10, {0: "pin", np.complex128(10 + 1j): "roller"})
    with beam_error("expected a number, got complex"):
        ilkit.Beam(10 + 1j, {0: "fixed"})  # type: ignore[arg-type]


def test_one_element_arrays_are_refused_where_one_number_is_wanted():
    with beam_error(r"length: got ndarray array\(\[10.\]\); give one number"):
        ilkit.Beam(np.array([10.0]), {0: "fixed"})  # type: ignore[arg-type]
    with beam_error("give one number"):
        SPAN.moment(pd.Series([5.0]))  # type: ignore[arg-type]


def test_off_the_beam_message_shows_the_digits_that_put_the_position_off():
    # it used to read "x=10 is off the beam; give a position from 0 to 10"
    with beam_error(r"moment: x=10.0000001 is off the beam; give a position from 0 to 10"):
        SPAN.moment(10.0000001)


def test_messages_tell_two_close_points_apart():
    # closer than the merge tolerance: one point, and two supports cannot share it
    with beam_error(r"the support at x=10 and the support at x=10.000000000001 are 1e-12 apart, closer than the merge"):
        ilkit.Beam(20, {0: "fixed", 10: "roller", Fraction(10) + Fraction(1, 10**12): "roller", 20: "roller"})
    # further apart: the float line is solved exactly, and says why with the two points at full precision
    beam = ilkit.Beam(20, {0: "fixed", 10: "roller", 20: "roller"}, hinges=[Fraction(10) + Fraction(1, 10**7)], EI=1)
    assert "from x=10 to x=10.0000001 is" in beam.deflection(15).origin.exact_because


@pytest.mark.parametrize(("length", "what"), [(1e-300, "length 1e-300"), (1e150, "length 1e\\+150")])
def test_stiffness_terms_beyond_the_float_range_are_reported_not_a_zero_division(length, what):
    beam = ilkit.Beam(length, {0: "pin", length: "roller"}, EI=1)
    with pytest.raises(IllConditionedError, match=rf"element from x=0 .*\({what}, EI=1\) has stiffness terms EI/h³"):
        beam.deflection(Fraction(length) / 2)


def test_areas_beyond_the_float_range_are_refused_not_an_overflow():
    beam = ilkit.Beam(1e300, {0: "pin", 1e300: "roller"})
    with beam_error(r"the areas must be finite numbers .* about 1e\+599"):
        _ = beam.moment(5e299).positive_area


def test_an_exact_flag_may_be_a_numpy_boolean():
    assert SPAN.moment(5, exact=np.True_).is_exact


# ================================================================= influence line
def test_hand_built_line_with_bad_knots_raises_a_typed_error_not_a_raw_value_error():
    q = Quantity("moment", Fraction(1))
    with beam_error("the knots must run from 0"):
        InfluenceLine(quantity=q, knots=(2.0, 0.0), coefficients=((1.0,),))
    with beam_error("the knots must run from 0"):  # it used to extrapolate the first piece to the left of it
        InfluenceLine(quantity=q, knots=(1.0, 2.0), coefficients=((1.0,),))
    with beam_error("the knots must be finite numbers"):  # it used to give ordinates from a NaN knot
        InfluenceLine(quantity=q, knots=(0.0, math.nan, 2.0), coefficients=((1.0,), (1.0,)))
    with beam_error("2 knots need 1 pieces of coefficients, got 2"):
        InfluenceLine(quantity=q, knots=(0.0, 2.0), coefficients=((1.0,), (2.0,)))
    with beam_error("quantity must be an ilkit.Quantity"):
        InfluenceLine(quantity="moment", knots=(0.0, 2.0), coefficients=((1.0,),))  # type: ignore[arg-type]


def test_hand_built_line_with_infinite_coefficients_is_refused_not_infinite_ordinates():
    q = Quantity("moment", Fraction(1))
    with beam_error(r"the coefficients of piece 1 must be finite numbers"):
        InfluenceLine(quantity=q, knots=(0.0, 2.0), coefficients=((math.inf,),))
    with beam_error(r"the coefficients of piece 1 must be finite .* about 1e\+400"):
        InfluenceLine(quantity=q, knots=(Fraction(0), Fraction(2)), coefficients=((Fraction(10**400),),))


@pytest.mark.parametrize("x", [None, "abc", "", 1 + 2j, {1: 2}, object(), pd.NA, b"5", True, 10**400, [1, "x"]])
@pytest.mark.parametrize("method", ["__call__", "left", "right", "slope", "cumulative"])
def test_load_position_that_is_not_a_number_is_refused_not_a_raw_float_error(method, x):
    for line in (SPAN.moment(5), TWO_SPANS.moment(5)):
        with beam_error("load position: cannot read"):
            getattr(line, method)(x)


@pytest.mark.parametrize("method", ["__call__", "left", "right", "slope", "cumulative"])
@pytest.mark.parametrize("x", [math.nan, np.float64("nan"), Decimal("nan"), "nan", np.array([1.0, np.nan])])
def test_nan_load_position_is_refused_not_a_silent_nan(method, x):
    with beam_error("load position: NaN is not a position on the beam"):
        getattr(TWO_SPANS.moment(5), method)(x)


def test_positions_far_off_the_beam_give_zero_without_overflow_warnings():
    line = TWO_SPANS.moment(5)  # cubic pieces: evaluating them at 1e300 overflowed
    xs = np.array([2.5, 1e300, -1e300, np.inf, -np.inf])
    with warnings.catch_warnings():
        warnings.simplefilter("error")
        for values in (line(xs), line.left(xs), line.right(xs), line.slope(xs)):
            assert values[0] != 0 and not np.any(values[1:])
        assert line.slope(math.inf) == 0.0


def test_slope_side_is_checked_not_read_as_right():
    with beam_error(r"slope: side must be 'left' or 'right', got 'up'"):
        SPAN.moment(5).slope(5, side="up")  # type: ignore[arg-type]
    # at the section of a simple-span moment line the slope jumps from (L-a)/L to -a/L (closed form, a = 5)
    assert SPAN.moment(5).slope(5, side="left") == pytest.approx(0.5)
    assert SPAN.moment(5).slope(5, side="right") == pytest.approx(-0.5)


@pytest.mark.parametrize("bound", [None, "abc", np.array([1.0, 2.0]), math.nan])
def test_integral_bounds_are_checked_not_a_raw_comparison_error_or_a_silent_zero(bound):
    with beam_error(r"integral: a: give one position|load position"):
        SPAN.moment(5).integral(bound, 5)


def test_integral_takes_quantities_and_infinite_bounds():
    pint = pytest.importorskip("pint")
    ureg = pint.UnitRegistry()
    line = SPAN.moment(5)
    # area of the simple-span moment line, a (L - a) / 2 = 12.5 (closed form), all of it from -inf to +inf
    assert line.integral(-math.inf, math.inf) == pytest.approx(12.5)
    assert line.integral(0, 5 * ureg.m) == pytest.approx(6.25)


@pytest.mark.parametrize("points", [None, 1, 2.5, "41", 10**6, True])
def test_sample_points_are_a_whole_number_from_2(points):
    with beam_error("sample: points_per_piece: give a whole number from 2 to 100000"):
        TWO_SPANS.moment(5).sample(points)


def test_exact_ordinate_side_and_sign_words_are_checked():
    line = SPAN.moment(5, exact=True)
    with beam_error(r"ordinate_exact: side must be 'left' or 'right'"):
        line.ordinate_exact(5, side="up")  # type: ignore[arg-type]
    for method in ("part", "intervals"):
        with beam_error(rf"{method}: sign must be 'positive' or 'negative', got array"):
            getattr(line, method)(np.array(["positive"]))


# ========================================================================== loads
@pytest.mark.parametrize(
    ("value", "match"),
    [
        (10**400, "too large for float arithmetic"),
        (Decimal("sNaN"), "not a finite number"),
        (np.complex128(5), "expected a number"),
        (np.array([5.0]), "give one number"),
    ],
)
def test_load_numbers_are_read_like_beam_numbers_not_a_raw_overflow(value, match):
    with load_error(match):
        KnifeEdge(value, units="kN-m")


def test_load_given_as_a_quantity_says_to_give_it_in_the_loads_units():
    pint = pytest.importorskip("pint")
    with load_error("give it in the load's units"):
        KnifeEdge(5 * pint.UnitRegistry().kN, units="kN-m")


@pytest.mark.parametrize("name", [None, 5, "", "  ", ["crane"]])
def test_load_names_must_be_text_not_turned_into_none_text(name):
    for make in (
        lambda: AxleTrain([1], [], units="kN-m", name=name),
        lambda: UniformLoad(1, units="kN-m", name=name),
        lambda: UniformBlocks(1, [5], units="kN-m", name=name),
        lambda: KnifeEdge(1, units="kN-m", name=name),
        lambda: Combination(name, [KNIFE]),
        lambda: LoadModel(name, [Combination("c", [KNIFE])]),
    ):
        with load_error("the name must be a non-empty string"):
            make()


def test_axle_loads_and_block_lengths_may_be_numpy_arrays_or_series():
    train = AxleTrain(np.array([10.0, 20.0]), pd.Series([3.0]), units="kN-m")
    assert train.loads == (10.0, 20.0) and train.spacings == ((3.0, 3.0),)
    assert UniformBlocks(2, np.array([5.0, 5.0]), np.array([1.0]), units="kN-m").gaps == (1.0,)


@pytest.mark.parametrize("dynamic_on", [None, 5, 1.5, np.array(5.0)])
def test_dynamic_on_that_is_not_a_list_of_names_is_refused_not_a_raw_iteration_error(dynamic_on):
    with load_error("dynamic_on: give the names of the parts"):
        Combination("c", [KNIFE], dynamic_allowance=0.2, dynamic_on=dynamic_on)


def test_dynamic_on_naming_a_number_says_it_is_not_a_part():
    with load_error(r"dynamic_on names \[5\], which are not parts; the parts are \['k'\]"):
        Combination("c", [KNIFE], dynamic_allowance=0.2, dynamic_on=[5])


def test_closed_word_arguments_of_loads_refuse_arrays_not_a_raw_truth_value_error():
    words = np.array(["max", "min"])
    with load_error("applies_to must be"):
        Combination("c", [KNIFE], applies_to=words)  # type: ignore[arg-type]
    with load_error("extreme must be 'max' or 'min'"):
        place(SPAN.moment(5), KNIFE, words)  # type: ignore[arg-type]
    with load_error("stand: direction must be"):
        stand(SPAN.moment(5), KNIFE, 5, direction=words)  # type: ignore[arg-type]
    with load_error(r"per must be 'track' or 'rail'"):
        cooper(per=words, impact=0)  # type: ignore[arg-type]


def test_lm1_lane_is_a_lane_number_not_any_value_equal_to_it():
    with load_error("lane must be one of 1, 2, 3 or 'other', got True"):
        lm1(True)  # type: ignore[arg-type]
    with load_error("lane must be one of"):
        lm1([1])  # type: ignore[arg-type]
    assert lm1(np.int64(2)).name == "LM1 lane 2"


def test_any_alpha_must_be_a_flag_not_any_truthy_text():
    with load_error("any_alpha: give True or False, got 'no'"):
        lm71(1.1, any_alpha="no", dynamic_factor=1.0)  # type: ignore[arg-type]


def test_cooper_and_alternate_sequences_are_checked_not_multiplied_as_text():
    with load_error("axles: give the axle loads of a locomotive as a list"):
        cooper_train(axles=None)  # type: ignore[arg-type]
    with load_error("cooper_train: axles is empty"):
        cooper_train(axles=(), spacings=())
    with load_error("axles: axle 1: cannot read 'a'"):
        cooper_train(axles=("a", "b"), spacings=(5,))  # type: ignore[arg-type]
    # bytes used to be read as their character codes: a 5 ft spacing became 53 ft
    with load_error("spacings: give the axle spacings as a list"):
        alternate_live_load(spacings=b"5")  # type: ignore[arg-type]


def test_multiple_presence_takes_numpy_integers():
    # AASHTO LRFD Table 3.6.1.1.2-1 (from memory): two loaded lanes, m = 1.00
    assert multiple_presence(np.int64(2)) == 1.00


def test_table_with_duplicate_columns_is_refused_not_a_raw_pandas_error():
    frame = pd.DataFrame([[1.0, None, 5.0], [2.0, 3.0, 6.0]], columns=["load", "spacing", " Load"])
    with load_error(r"crane: the table has more than one column named 'load'"):
        AxleTrain.from_frame(frame, units="kN-m", name="crane")


def test_table_cells_complex_or_na_or_huge_are_typed_errors():
    with warnings.catch_warnings():
        warnings.simplefilter("error")
        with load_error("row 1, load: expected a number, got complex"):
            AxleTrain.from_frame(pd.DataFrame({"load": [1 + 1j, 2], "spacing": [None, 2]}), units="kN-m")
    na = pd.DataFrame({"load": pd.array([1, pd.NA], dtype="Int64"), "spacing": [None, 2.0]})
    with load_error("row 2 has no 'load'; fill it in"):
        AxleTrain.from_frame(na, units="kN-m")
    with load_error("row 1, load: the value given .* too large"):
        AxleTrain.from_frame(pd.DataFrame({"load": [10**400, 2], "spacing": [None, 2]}), units="kN-m")


def test_spacing_max_on_the_lead_axle_is_refused_not_ignored():
    frame = pd.DataFrame({"load": [1.0, 2.0], "spacing": [None, 2.0], "spacing_max": [4.0, None]})
    with load_error("row 1 .* has spacing_max 4.0; leave it empty"):
        AxleTrain.from_frame(frame, units="kN-m", name="crane")


def test_table_without_units_names_the_train_once():
    with pytest.raises(LoadInputError) as info:
        AxleTrain.from_frame(pd.DataFrame({"load": [1.0], "spacing": [None]}), units=None, name="crane")
    assert str(info.value) == "crane: give the unit system of the load, e.g. units='kip-ft' or units='kN-m'."


@pytest.mark.parametrize("path", [None, 5, ["a.csv"]])
def test_csv_path_of_the_wrong_type_is_refused_not_a_raw_type_error(path):
    with load_error("from_csv: give the path of a CSV file as a string or a pathlib.Path"):
        AxleTrain.from_csv(path, units="kN-m")


def test_csv_that_cannot_be_opened_is_a_typed_error(tmp_path, monkeypatch):
    path = tmp_path / "locked.csv"
    path.write_text("load,spacing\n1,\n")

    def refuse(*args, **kwargs):
        raise PermissionError(13, "Permission denied")

    monkeypatch.setattr(pd, "read_csv", refuse)
    with load_error("from_csv: cannot read .*locked.csv.* as CSV"):
        AxleTrain.from_csv(path, units="kN-m")


def test_stand_spacings_for_a_knife_edge_as_an_array_and_for_a_train_as_an_array():
    with load_error("knife-edge load has no axle spacings; leave spacings out"):
        stand(SPAN.moment(5), KnifeEdge(1, units="kN-m"), 5, spacings=np.array([1.0, 2.0]))
    train = AxleTrain([1, 1], [2], units="kN-m")
    # two unit axles 2 apart, front at 5 travelling right: axles at 5 and 3 on the simple-span line of M at 5,
    # ordinates a(L-x)/L = 2.5 and x(L-a)/L = 1.5 (closed form, L = 10, a = 5): effect 4
    assert stand(SPAN.moment(5), train, 5, spacings=np.array([2.0])).effect == pytest.approx(4.0)


def test_stand_spacings_for_a_knife_edge_as_a_0d_array_is_refused_not_a_raw_len_error():
    with load_error("knife-edge load has no axle spacings; leave spacings out"):
        stand(SPAN.moment(5), KnifeEdge(1, units="kN-m"), 5, spacings=np.array(5.0))


def test_table_cell_holding_an_array_is_a_typed_error_not_a_raw_item_error():
    frame = pd.DataFrame({"load": [np.array([1.0, 2.0]), 1.0], "spacing": [None, 2.0]}, dtype=object)
    with load_error("row 1, load: got ndarray .*give one number"):
        AxleTrain.from_frame(frame, units="kN-m")


def test_stand_position_may_be_a_length_quantity_like_a_line_position():
    pint = pytest.importorskip("pint")
    ureg = pint.UnitRegistry()
    # unit knife-edge load at midspan of a 10 m simple span: M = L/4 = 2.5 kN·m (closed form)
    assert stand(SPAN.moment(5), KNIFE, 500 * ureg.cm).effect == pytest.approx(2.5)
    with pytest.raises(ilkit.UnitsError, match="stand: position at: 5 kilonewton is a force"):
        stand(SPAN.moment(5), KNIFE, 5 * ureg.kN)


def test_train_length_of_something_that_is_not_a_load_is_a_typed_error():
    with load_error("train_length: 5 does not travel as one load"):
        train_length(5)  # type: ignore[arg-type]


def test_place_beam_must_be_the_beam_of_the_line():
    beam = ilkit.Beam(20, {0: "pin", 10: "roller", 20: "roller"}, EI=1, units="kip-ft")
    with load_error("beam: give the Beam the line belongs to"):
        place(beam.reaction(10), hl93(), beam=5)  # type: ignore[arg-type]
    with load_error(r"the beam given has no support at x=10 \(supports at x=0, 5\)"):
        place(beam.reaction(10), hl93(), beam=ilkit.Beam(10, {0: "pin", 5: "roller"}, units="kip-ft"))


def test_envelope_beam_and_sections_are_checked_not_a_raw_attribute_error():
    with load_error("envelope: give a Beam, got str"):
        envelope("beam", KNIFE)  # type: ignore[arg-type]
    with beam_error(r"at: give a list of section positions"):
        envelope(SPAN, KNIFE, at=5)  # type: ignore[arg-type]
    with beam_error(r"at: give a list of section positions"):
        envelope(SPAN, KNIFE, at={5: 1})  # type: ignore[arg-type]
    with load_error(r"at: x=10.0000000001 is off the beam"):
        envelope(SPAN, KNIFE, divisions=1, at=[10.0000000001])


def test_envelope_sections_may_be_quantities():
    pint = pytest.importorskip("pint")
    ureg = pint.UnitRegistry()
    env = envelope(SPAN, KNIFE, divisions=1, at=[500 * ureg.cm])
    # unit knife-edge load at midspan of a 10 m simple span: M = L/4 = 2.5 kN·m (closed form)
    assert env.extreme("moment", 5 * ureg.m).value == pytest.approx(2.5)


def test_envelope_divisions_have_an_upper_bound_instead_of_running_for_hours():
    with load_error(r"divisions: the parts per span: give a whole number from 1 to 1000, got 1000000"):
        envelope(SPAN, KNIFE, divisions=10**6)
    assert len(envelope(SPAN, KNIFE, divisions=np.int64(2)).sections) == 3


def test_envelope_lookup_finds_a_section_given_as_a_float():
    env = envelope(SPAN, KNIFE, divisions=3)
    # it used to say "no moment at x=6.66667 ... it has x = 0, 3.33333, 6.66667, 10"
    found = env.extreme("moment", 20 / 3)
    # unit load on a simple span, M at a = a (L - a) / L = (20/3)(10/3)/10 (closed form)
    assert found.quantity.at == Fraction(20, 3) and found.value == pytest.approx(20 / 9)
    with load_error(r"extreme: side must be 'left' or 'right' \(or leave it out\)"):
        env.extreme("moment", 5, side="up")  # type: ignore[arg-type]


@pytest.mark.parametrize("load", [KnifeEdge(1e308, units="kN-m"), UniformLoad(1e308, units="kN-m")])
def test_effects_that_overflow_are_reported_not_inf_with_a_warning(load):
    with warnings.catch_warnings():
        warnings.simplefilter("error")
        with load_error(r"effect of .* is inf: loads times ordinates overflow float arithmetic"):
            place(SPAN.moment(5), load)
    with load_error("stand: the effect of .* is inf"):
        stand(SPAN.moment(5), KnifeEdge(1e308, units="kN-m"), 5)


def test_loads_far_off_the_beam_do_not_overflow():
    far = AxleTrain([1, 1], [1e300], units="kN-m")
    with warnings.catch_warnings():
        warnings.simplefilter("error")
        # the second axle never reaches the beam: the extreme is one unit load at the section, L/4 (closed form)
        assert place(TWO_SPANS.moment(5), far).value == pytest.approx(TWO_SPANS.moment(5)(5.0))
        assert stand(SPAN.moment(5), far, 1e300).effect == 0.0


# ================================================================ property: junk in
JUNK = st.one_of(
    st.none(),
    st.booleans(),
    st.text(max_size=6),
    st.binary(max_size=3),
    st.complex_numbers(allow_nan=True, allow_infinity=True),
    st.floats(allow_nan=True, allow_infinity=True),
    st.integers(min_value=-(10**400), max_value=10**400),
    st.decimals(allow_nan=True, allow_infinity=True),
    st.fractions(),
    st.lists(st.one_of(st.integers(-5, 50), st.text(max_size=2), st.none()), max_size=3),
    st.dictionaries(st.integers(-5, 50), st.integers(-5, 50), max_size=2),
    st.sampled_from(
        [np.array(5.0), np.array([1.0, 2.0]), np.float64("nan"), np.int64(3), np.complex128(1j), pd.NA, object()]
    ),
    st.sampled_from(["left", "right", "max", "min", "moment", "reaction", "kN-m", "pin", "positive", "1e400"]),
)

_LINE = TWO_SPANS.moment(5)
_DECK = CrossSection(4, 8.0, 3.0, 1.0)
_ENVELOPE = envelope(SPAN, KNIFE, divisions=2)
_TRUSS = trusses.pratt(40, 4, 3, units="kN-m")
_TRUSS_ENVELOPE = trusses.member_envelope(_TRUSS, KNIFE)
_DEAD = DistributedLoad("w", "DC", 1)
_PERMANENT = permanent_effects(TWO_SPANS, [_DEAD], divisions=2)
_RATED = permanent_effects(SPAN, [_DEAD], divisions=1, quantities=("moment", "shear"))
_EXTREME = place(TWO_SPANS.moment(5), KNIFE)


def _permanent(load, **options):
    return permanent_effects(TWO_SPANS, [load], divisions=1, quantities=("moment", "reaction"), **options)


ENTRY_POINTS = {
    "Beam.length": lambda v: ilkit.Beam(v, {0: "fixed"}),
    "Beam.supports": lambda v: ilkit.Beam(10, v),
    "Beam.support kind": lambda v: ilkit.Beam(10, {0: "pin", 10: v}),
    "Beam.hinges": lambda v: ilkit.Beam(10, {0: "fixed", 10: "roller"}, hinges=v),
    "Beam.EI": lambda v: ilkit.Beam(10, {0: "pin", 10: "roller"}, EI=v),
    "Beam.units": lambda v: ilkit.Beam(10, {0: "pin", 10: "roller"}, units=v),
    "Beam.EI range": lambda v: ilkit.Beam(10, {0: "pin", 10: "roller"}, EI=[v]),
    "Spring": lambda v: Spring(vertical=v),
    "Support kind": lambda v: Support(Fraction(0), v),
    "UnitSystem factor": lambda v: UnitSystem("u", "m", "kN", v, 1),
    "beam.moment": lambda v: TWO_SPANS.moment(v),
    "beam.position": lambda v: TWO_SPANS.position(v),
    "beam.shear side": lambda v: TWO_SPANS.shear(10, side=v),
    "beam.line": lambda v: TWO_SPANS.line(v, 5),
    "line()": lambda v: _LINE(v),
    "line.left": lambda v: _LINE.left(v),
    "line.slope": lambda v: _LINE.slope(v),
    "line.cumulative": lambda v: _LINE.cumulative(v),
    "line.integral": lambda v: _LINE.integral(0, v),
    "line.part": lambda v: _LINE.part(v),
    "line.sample": lambda v: _LINE.sample(v),
    "Quantity": lambda v: Quantity("moment", v),
    "AxleTrain loads": lambda v: AxleTrain(v, [], units="kN-m"),
    "AxleTrain spacings": lambda v: AxleTrain([1, 1], v, units="kN-m"),
    "UniformLoad": lambda v: UniformLoad(v, units="kN-m"),
    "UniformBlocks lengths": lambda v: UniformBlocks(1, v, units="kN-m"),
    "Combination dynamic_on": lambda v: Combination("c", [KNIFE], dynamic_on=v),
    "Combination factor": lambda v: Combination("c", [KNIFE], factor=v),
    "place extreme": lambda v: place(_LINE, KNIFE, v),
    "place load": lambda v: place(_LINE, v),
    "extremes beam": lambda v: extremes(TWO_SPANS.reaction(10), KNIFE, beam=v),
    "stand at": lambda v: stand(_LINE, KNIFE, v),
    "stand direction": lambda v: stand(_LINE, KNIFE, 5, direction=v),
    "stand spacings": lambda v: stand(_LINE, KNIFE, 5, spacings=v),
    "train_length": lambda v: train_length(v),
    "from_frame cell": lambda v: AxleTrain.from_frame(
        pd.DataFrame({"load": [v, 1], "spacing": [None, v]}, dtype=object), units="kN-m"
    ),
    "envelope at": lambda v: envelope(SPAN, KNIFE, divisions=1, at=[v]),
    "Envelope.extreme at": lambda v: _ENVELOPE.extreme("moment", v),
    "Envelope.extreme side": lambda v: _ENVELOPE.extreme("moment", 5, side=v),
    "lm1 lane": lambda v: lm1(v),
    "hl93 factor": lambda v: hl93(factor=v),
    "multiple_presence": lambda v: multiple_presence(v),
    "cooper per": lambda v: cooper(per=v, impact=0),
    "cooper impact": lambda v: cooper(impact=v),
    "lm71 dynamic_factor": lambda v: lm71(dynamic_factor=v),
    "Combination dynamic_factor": lambda v: Combination("c", [KNIFE], dynamic_factor=v, dynamic_on=["k"]),
    "Combination dynamic_included": lambda v: Combination("c", [KNIFE], dynamic_included=v),
    "Factor value": lambda v: Factor("load factor", v, "γ"),
    "Factor kind": lambda v: Factor(v, 1.0, "γ"),
    "Factor includes": lambda v: Factor("distribution", 1.0, "g", includes=v),
    "Applied.then": lambda v: Applied().then(v),
    "Applied.contains": lambda v: Applied().contains(v),
    "design_lanes": lambda v: design_lanes(v),
    "notional_lanes": lambda v: notional_lanes(v),
    "CrossSection spacing": lambda v: CrossSection(4, v, 3.0, 1.0),
    "CrossSection girders": lambda v: CrossSection(v, 8.0, 3.0, 1.0),
    "transverse_line girder": lambda v: transverse_line(_DECK, v),
    "transverse_line ordinates": lambda v: transverse_line(_DECK, 1, ordinates=v),
    "place_design_lanes loaded": lambda v: place_design_lanes(transverse_line(_DECK, 2), loaded=v),
    "given_distribution": lambda v: given_distribution(v),
    "aashto_distribution span": lambda v: aashto_distribution(_DECK, 2, span=v, slab_thickness=0.7, Kg=30.0),
    "LimitState live": lambda v: LimitState("x", {"DC": (1.25, 0.9)}, v),
    "LimitState permanent": lambda v: LimitState("x", {"DC": v}, 1.0),
    "limit_states": lambda v: limit_states(v),
    "GirderLiveLoad lanes": lambda v: GirderLiveLoad(hl93(), lanes=v),
    "GirderLiveLoad multiple_presence": lambda v: GirderLiveLoad(hl93(), multiple_presence=v),
    "Section": lambda v: Section(v),
    "Section side": lambda v: Section(1, v),
    "envelope_sections at": lambda v: envelope_sections(TWO_SPANS, 2, at=[v]),
    "envelope_sections divisions": lambda v: envelope_sections(TWO_SPANS, v),
    "DistributedLoad intensity": lambda v: _permanent(DistributedLoad("w", "DC", v)),
    "DistributedLoad start": lambda v: _permanent(DistributedLoad("w", "DC", 1, start=v)),
    "DistributedLoad category": lambda v: DistributedLoad("w", v, 1),
    "SpanLoad span": lambda v: _permanent(SpanLoad("w", "DC", 1, v)),
    "PointLoad load": lambda v: _permanent(PointLoad("p", "DC", v, 5)),
    "PointLoad at": lambda v: _permanent(PointLoad("p", "DC", 1, v)),
    "Settlement at": lambda v: _permanent(Settlement("s", v, 0.01)),
    "Settlement displacement": lambda v: _permanent(Settlement("s", 10, v)),
    "Stage loads": lambda v: Stage("s", TWO_SPANS, v),
    "permanent_effects stages": lambda v: permanent_effects(v),
    "permanent_effects quantities": lambda v: permanent_effects(TWO_SPANS, [_DEAD], divisions=1, quantities=v),
    "permanent_effects sections": lambda v: permanent_effects(TWO_SPANS, [_DEAD], sections=v),
    "PermanentEffects.value at": lambda v: _PERMANENT.value("moment", v),
    "PermanentEffects.value side": lambda v: _PERMANENT.value("shear", 10, side=v),
    "concurrent_forces source": lambda v: concurrent_forces(v, TWO_SPANS),
    "concurrent_forces beam": lambda v: concurrent_forces(_EXTREME, v),
    "deflection_check share": lambda v: deflection_check(SPAN, KNIFE, share=v, divisions=1),
    "deflection_check lanes": lambda v: deflection_check(SPAN, KNIFE, lanes=v, girders=3, divisions=1),
    "deflection_check limit": lambda v: deflection_check(SPAN, KNIFE, share=1, limit=v, divisions=1),
    "aashto_deflection_load": lambda v: aashto_deflection_load(v),
    # trusses and floor systems
    "Beam.panel_points": lambda v: ilkit.Beam(10, {0: "pin", 10: "roller"}, panel_points=v),
    "Beam.panel_points item": lambda v: ilkit.Beam(10, {0: "pin", 10: "roller"}, panel_points=[0, v, 10]),
    "Truss joints": lambda v: trusses.Truss(v, [("A", "B")], {"A": "pin"}),
    "Truss joint": lambda v: trusses.Truss({"A": (0, 0), "B": v, "C": (2, 1)},
                                           [("A", "B"), ("B", "C"), ("A", "C")], {"A": "pin", "C": "roller"}),
    "Truss members": lambda v: trusses.Truss({"A": (0, 0), "B": (1, 0)}, v, {"A": "pin"}),
    "Truss supports": lambda v: trusses.Truss({"A": (0, 0), "B": (2, 0), "C": (1, 1)},
                                              [("A", "B"), ("B", "C"), ("A", "C")], v),
    "Truss deck": lambda v: trusses.Truss({"A": (0, 0), "B": (2, 0), "C": (1, 1)},
                                          [("A", "B"), ("B", "C"), ("A", "C")], {"A": "pin", "B": "roller"}, v),
    "Truss EA": lambda v: trusses.Truss({"A": (0, 0), "B": (2, 0), "C": (1, 1)},
                                        [("A", "B"), ("B", "C"), ("A", "C")], {"A": "pin", "B": "roller"}, EA=v),
    "pratt span": lambda v: trusses.pratt(v, 4, 3),
    "pratt panels": lambda v: trusses.pratt(40, v, 3),
    "pratt depth": lambda v: trusses.pratt(40, 4, v),
    "warren verticals": lambda v: trusses.warren(40, 4, 3, verticals=v),
    "parker end_depth": lambda v: trusses.parker(40, 4, 3, v),
    "truss.member_force": lambda v: _TRUSS.member_force(v),
    "truss.reaction": lambda v: _TRUSS.reaction(v),
    "member_envelope load": lambda v: trusses.member_envelope(_TRUSS, v),
    "MemberEnvelope.extreme": lambda v: _TRUSS_ENVELOPE.extreme(v),
    "inventory record": lambda v: batch.validate_record(v),
    "inventory id": lambda v: batch.validate_record({"id": v, "units": "kN-m", "spans": [10]}),
    "inventory units": lambda v: batch.validate_record({"id": "g", "units": v, "spans": [10]}),
    "inventory spans": lambda v: batch.validate_record({"id": "g", "units": "kN-m", "spans": v}),
    "inventory span": lambda v: batch.validate_record({"id": "g", "units": "kN-m", "spans": [10, v]}),
    "inventory supports": lambda v: batch.validate_record({"id": "g", "units": "kN-m", "length": 10, "supports": v}),
    "inventory EI": lambda v: batch.validate_record({"id": "g", "units": "kN-m", "spans": [10], "EI": v}),
    "inventory EI range": lambda v: batch.validate_record({"id": "g", "units": "kN-m", "spans": [10], "EI": [v]}),
    "inventory live": lambda v: batch.validate_record({"id": "g", "units": "kN-m", "spans": [10], "live": v}),
    "inventory live argument": lambda v: batch.validate_record(
        {"id": "g", "units": "kN-m", "spans": [10], "live": {"model": "LM71", "dynamic_factor": v}}),
    "inventory distribution": lambda v: batch.validate_record(
        {"id": "g", "units": "kN-m", "spans": [10], "live": "LM1", "distribution": v}),
    "inventory distribution moment": lambda v: batch.validate_record(
        {"id": "g", "units": "kN-m", "spans": [10], "live": "LM1", "distribution": {"moment": v}}),
    "inventory lanes": lambda v: batch.validate_record(
        {"id": "g", "units": "kN-m", "spans": [10], "live": "LM1", "lanes": v}),
    "inventory permanent": lambda v: batch.validate_record({"id": "g", "units": "kN-m", "spans": [10], "permanent": v}),
    "inventory permanent load": lambda v: batch.validate_record(
        {"id": "g", "units": "kN-m", "spans": [10], "permanent": [v]}),
    "inventory permanent intensity": lambda v: batch.validate_record(
        {"id": "g", "units": "kN-m", "spans": [10], "permanent": [{"name": "d", "category": "DC", "intensity": v}]}),
    "inventory permanent at": lambda v: batch.validate_record(
        {"id": "g", "units": "kN-m", "spans": [10], "permanent": [{"name": "d", "category": "DC", "load": 1,
                                                                   "at": v}]}),
    "inventory resistance": lambda v: batch.validate_record({"id": "g", "units": "kN-m", "spans": [10],
                                                             "resistance": v}),
    "inventory resistance value": lambda v: batch.validate_record({"id": "g", "units": "kN-m", "spans": [10],
                                                                   "resistance": {"shear": v}}),
    "inventory resistance range": lambda v: batch.validate_record({"id": "g", "units": "kN-m", "spans": [10],
                                                                   "resistance": {"moment": [[0, 10, v]]}}),
    "inventory one-lane distribution": lambda v: batch.validate_record(
        {"id": "g", "units": "kN-m", "spans": [10], "live": "LM1", "distribution": {"moment": 0.5, "one_lane": v}}),
    "read_inventory": lambda v: batch.read_inventory(v),
    "RatingTask loads": lambda v: batch.RatingTask(loads=v),
    "RatingTask adtt": lambda v: batch.RatingTask(adtt=v),
    "RatingTask condition": lambda v: batch.RatingTask(condition=v),
    "RatingTask system": lambda v: batch.RatingTask(system=v),
    "RatingTask divisions": lambda v: batch.RatingTask(divisions=v),
    "RatingTask wearing_surface_measured": lambda v: batch.RatingTask(wearing_surface_measured=v),
    "EnvelopeTask models": lambda v: batch.EnvelopeTask(models=v),
    "EnvelopeTask limit_states": lambda v: batch.EnvelopeTask(limit_states=v),
    "EnvelopeTask divisions": lambda v: batch.EnvelopeTask(divisions=v),
    "batch file_name": lambda v: batch.file_name("sheets", v),
    # load rating
    "Resistances positive_moment": lambda v: rating.Resistances(positive_moment=v),
    "Resistances ranges": lambda v: rating.Resistances(shear=[(0, 10, v)]),
    "Resistances phi": lambda v: rating.Resistances(shear=1, phi_shear=v),
    "Resistances.nominal at": lambda v: rating.Resistances(shear=[(0, 10, 5)]).nominal("shear", "positive", v),
    "condition_factor": lambda v: rating.condition_factor(v),
    "system_factor": lambda v: rating.system_factor(v),
    "legal_live_factor adtt": lambda v: rating.legal_live_factor(v),
    "permit_live_factor kind": lambda v: rating.permit_live_factor(v),
    "posting_load weight": lambda v: rating.posting_load(0.5, v),
    "permit_vehicle axles": lambda v: rating.permit_vehicle(v, [4.0]),
    "permit_vehicle spacings": lambda v: rating.permit_vehicle([10.0, 10.0], v),
    "rating_loads": lambda v: rating.rating_loads(v),
    "legal_load adtt": lambda v: rating.legal_load("Type 3", adtt=v),
    "arema_impact span": lambda v: rating.arema_impact(v),
    "arema_impact girder_spacing": lambda v: rating.arema_impact(50, girder_spacing=v),
    "rate_girder loads": lambda v: rating.rate_girder(SPAN, permanent=_RATED, loads=v, divisions=1,
                                                      distribution=given_distribution(0.5),
                                                      resistances=rating.Resistances(positive_moment=100)),
    "rate_girder condition": lambda v: rating.rate_girder(SPAN, permanent=_RATED, loads="Type 3", divisions=1,
                                                          condition=v, distribution=given_distribution(0.5),
                                                          resistances=rating.Resistances(positive_moment=100)),
}


def _finite_or_zero_off_the_beam(out: object) -> bool:
    values = out[1] if isinstance(out, tuple) and len(out) == 2 and isinstance(out[1], np.ndarray) else out
    if isinstance(values, (float, np.floating, np.ndarray)):
        return bool(np.all(np.isfinite(values)))
    return True


@settings(max_examples=150, deadline=None, suppress_health_check=[HealthCheck.too_slow])
@given(value=JUNK, entry=st.sampled_from(sorted(ENTRY_POINTS)))
def test_junk_in_any_public_entry_point_gives_an_ilkit_error_or_a_finite_result(value, entry):
    with warnings.catch_warnings():
        warnings.simplefilter("error")
        try:
            out = ENTRY_POINTS[entry](value)
        except IlkitError:
            return
    assert _finite_or_zero_off_the_beam(out), (entry, value, out)


@settings(max_examples=40, deadline=None)
@given(
    xs=st.lists(
        st.one_of(st.floats(allow_nan=False), st.integers(-(10**300), 10**300), st.fractions()), min_size=1, max_size=5
    )
)
def test_ordinates_are_finite_and_zero_off_the_beam_for_any_finite_or_infinite_positions(xs):
    """Law: a line's ordinate is finite everywhere and 0 where the load is off the beam (design notes)."""
    with warnings.catch_warnings():
        warnings.simplefilter("error")
        for line in (SPAN.moment(5), TWO_SPANS.moment(5), TWO_SPANS.deflection(15)):
            values = line(np.array([float(x) for x in xs]))
            assert np.all(np.isfinite(values))
            off = np.array([float(x) < 0 or float(x) > float(line.length) for x in xs])
            assert not np.any(values[off])
