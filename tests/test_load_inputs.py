"""Bad load input gives a typed error whose message names the value and the fix; tables and CSV files."""

from __future__ import annotations

import math

import pandas as pd
import pytest

import ilkit
from ilkit.loads import (
    AxleTrain,
    Combination,
    KnifeEdge,
    LoadModel,
    TrainUniform,
    UniformBlocks,
    UniformLoad,
    lm1,
    multiple_presence,
    place,
)


def bad(match):
    return pytest.raises(ilkit.LoadInputError, match=match)


# ------------------------------------------------------------------ trains
@pytest.mark.parametrize(
    ("kwargs", "match"),
    [
        ({"loads": [], "spacings": []}, "give the axle loads"),
        ({"loads": "8,32", "spacings": []}, "give the axle loads"),
        ({"loads": [8, -32], "spacings": [14]}, r"axle 2: must be greater than 0, got -32"),
        ({"loads": [8, float("nan")], "spacings": [14]}, "not a finite number"),
        ({"loads": [8, True], "spacings": [14]}, "axle 2: got the boolean True"),
        ({"loads": [8, "heavy"], "spacings": [14]}, "cannot read 'heavy'"),
        ({"loads": [8, 32, 32], "spacings": [14]}, "3 axles need 2 spacings, got 1"),
        ({"loads": [8, 32], "spacings": [0]}, r"spacing 1 \(axle 1 to 2\): must be greater than 0"),
        ({"loads": [8, 32], "spacings": [(30, 14)]}, "runs backwards"),
        ({"loads": [8, 32], "spacings": [(14, 20, 30)]}, r"a pair \(lo, hi\)"),
        ({"loads": [8, 32], "spacings": [math.inf]}, "not a finite number"),
    ],
)
def test_axle_train_errors(kwargs, match):
    with bad(match):
        AxleTrain(**kwargs, units="kip-ft")


def test_axle_train_needs_units_and_a_known_system():
    with bad("give the unit system"):
        AxleTrain([10], [], units=None)
    with bad("unknown unit system 'kN-cm'"):
        AxleTrain([10], [], units="kN-cm")


def test_axle_train_accepts_ranges_with_open_end_and_fraction_text():
    t = AxleTrain([8, "32", 32], ["14", (50, math.inf)], units="kip-ft", name="t")
    assert t.spacings == ((14.0, 14.0), (50.0, math.inf)) and t.is_variable
    assert repr(t) == "AxleTrain([8, 32, 32], [14, (50, inf)], units='kip-ft', name='t')"
    assert AxleTrain([1, 1], ["3/2"], units="kN-m").spacings == ((1.5, 1.5),)


def test_train_uniform_and_other_primitives_errors():
    with bad("intensity: must be greater than 0"):
        TrainUniform(0)
    with bad("clearance: must be at least 0"):
        TrainUniform(5, -1)
    with bad("breakable: give True or False"):
        TrainUniform(5, 0, "yes")
    with bad("ahead: give a TrainUniform"):
        AxleTrain([1], [], units="kN-m", ahead=5.0)
    with bad("intensity"):
        UniformLoad(-1, units="kN-m")
    with bad("2 blocks need 1 gaps"):
        UniformBlocks(10, [5, 5], [], units="kN-m")
    with bad("give the block lengths"):
        UniformBlocks(10, [], [], units="kN-m")
    with bad("load: must be greater than 0"):
        KnifeEdge(0, units="kN-m")


# ------------------------------------------------------------- tables and CSV
def test_train_from_a_table():
    frame = pd.DataFrame(
        {"Load": [20.0, 40.0, 40.0], "spacing": [None, 3.5, 8.0], "spacing_max": [None, None, 12.0], "note": "x"}
    )
    train = AxleTrain.from_frame(frame, units="kN-m", name="crane")
    assert train.loads == (20.0, 40.0, 40.0)
    assert train.spacings == ((3.5, 3.5), (8.0, 12.0))
    assert train.name == "crane"


@pytest.mark.parametrize(
    ("frame", "match"),
    [
        (pd.DataFrame({"load": [10.0]}), "no 'spacing' column"),
        (pd.DataFrame({"load": [], "spacing": []}), "has no rows"),
        (pd.DataFrame({"load": [10.0, None], "spacing": [None, 2.0]}), "row 2 has no 'load'"),
        (pd.DataFrame({"load": [10.0, 5.0], "spacing": [None, None]}), "row 2 has no 'spacing'"),
        (pd.DataFrame({"load": [10.0, 5.0], "spacing": [None, -2.0]}), "row 2, spacing: must be greater than 0"),
        (pd.DataFrame({"load": [10.0, "five"], "spacing": [None, 2.0]}), "row 2, load: cannot read 'five'"),
        (pd.DataFrame({"load": [10.0, 5.0], "spacing": [4.0, 2.0]}), "row 1 .* leave it empty or 0"),
        (pd.DataFrame({"load": [1.0, 5.0], "spacing": [0, 4.0], "spacing_max": [None, 3.0]}), "runs backwards"),
    ],
)
def test_table_errors_name_the_row_and_the_fix(frame, match):
    with bad(match):
        AxleTrain.from_frame(frame, units="kN-m", name="crane")


def test_from_frame_needs_a_frame():
    with bad("expected a pandas DataFrame"):
        AxleTrain.from_frame({"load": [1]}, units="kN-m")


def test_train_from_csv(tmp_path):
    path = tmp_path / "permit.csv"
    path.write_text("load,spacing\n12,\n24,4.2\n24,1.4\n")
    train = AxleTrain.from_csv(path, units="kip-ft")
    assert train.name == "permit" and train.loads == (12.0, 24.0, 24.0)
    assert train.spacings == ((4.2, 4.2), (1.4, 1.4))


def test_csv_errors(tmp_path):
    with bad("no file at"):
        AxleTrain.from_csv(tmp_path / "missing.csv", units="kip-ft")
    empty = tmp_path / "empty.csv"
    empty.write_text("")
    with bad("cannot read .* as CSV"):
        AxleTrain.from_csv(empty, units="kip-ft")
    wrong = tmp_path / "wrong.csv"
    wrong.write_text("weight;gap\n1;2\n")
    with bad("no 'load' column"):
        AxleTrain.from_csv(wrong, units="kip-ft")


# ---------------------------------------------------- combinations and models
def test_combination_errors():
    a = AxleTrain([10], [], units="kN-m", name="a")
    b = UniformLoad(2, units="kN-m", name="b")
    with bad("distinct names"):
        Combination("c", [a, a])
    with bad(r"dynamic_on names \['z'\]"):
        Combination("c", [a, b], dynamic_allowance=0.2, dynamic_on=["z"])
    with bad("name the parts it applies to"):
        Combination("c", [a, b], dynamic_allowance=0.2)
    with bad("applies_to must be 'all' or 'negative moment and interior reactions'"):
        Combination("c", [a], applies_to="piers")
    with bad("a part must be"):
        Combination("c", [a, 5])
    with bad("factor: must be greater than 0"):
        Combination("c", [a], factor=0)
    restricted = Combination("c", [a], applies_to="negative moment and interior reactions")
    with bad("add a case with applies_to='all'"):
        LoadModel("m", [restricted])
    with bad("distinct names"):
        LoadModel("m", [Combination("c", [a]), Combination("c", [b])])


def test_combination_converts_parts_to_the_first_units():
    a = AxleTrain([10], [], units="kN-m", name="a")
    b = UniformLoad(1, units="kip-ft", name="b")
    c = Combination("c", [a, b])
    assert c.parts[1].units.name == "kN-m"
    assert c.parts[1].intensity == pytest.approx(4.4482216152605 / 0.3048)


def test_model_argument_errors():
    with bad("lane must be one of"):
        lm1(4)
    with bad("number of loaded lanes"):
        multiple_presence(0)


def test_place_errors():
    beam = ilkit.Beam(10, {0: "pin", 10: "roller"}, units="kN-m")
    with bad("extreme must be 'max' or 'min'"):
        place(beam.moment(5), KnifeEdge(1, units="kN-m"), "largest")
    with bad("expected an InfluenceLine"):
        place(beam, KnifeEdge(1, units="kN-m"))
