"""Rating runs over an inventory (ilkit.batch.RatingTask) and the fatigue limit states of envelope runs.

The references are single-girder calls built here by hand from the records' numbers with ilkit.Beam,
ilkit.design and ilkit.rating (whose own tests check them against the Manual and AASHTO LRFD); the batch
must equal them exactly, with one or two worker processes.
"""

from __future__ import annotations

import math

import pandas as pd
import pytest

import ilkit
from ilkit import batch, design, loads, rating

pytest.importorskip("pyarrow")

SAMPLE = batch.sample_inventory(6, seed=11, spans=(1, 3), lengths=(30.0, 90.0), rated=2)
RATED = [r for r in SAMPLE if "resistance" in r]
TASK = {"loads": ("design", "legal"), "adtt": 1500, "condition": "fair"}


def hand_made(record: dict) -> tuple[ilkit.Beam, design.PermanentEffects, design.Distribution, rating.Resistances]:
    """The girder of a sample record, typed as an engineer would for a single-girder rating."""
    at, supports = 0.0, {0: "pin"}
    for s in record["spans"]:
        at += s
        supports[at] = "roller"
    ei = record["EI"] if not isinstance(record["EI"], list) else [tuple(r) for r in record["EI"]]
    beam = ilkit.Beam(at, supports, EI=ei, units="kip-ft")
    dead = [design.DistributedLoad(p["name"], p["category"], p["intensity"]) for p in record["permanent"]]
    d = record["distribution"]
    share = design.given_distribution(d["moment"], d["shear"], includes_multiple_presence=True)
    given = record["resistance"]
    positive = given["positive_moment"]
    resistances = rating.Resistances(
        positive_moment=[tuple(r) for r in positive] if isinstance(positive, list) else positive,
        negative_moment=given["negative_moment"], shear=given["shear"])
    return beam, design.permanent_effects(beam, dead, quantities=["moment", "shear"]), share, resistances


@pytest.fixture(scope="module")
def rated_run(tmp_path_factory):
    out = tmp_path_factory.mktemp("rating") / "one"
    return batch.run(SAMPLE, out, task=batch.RatingTask(**TASK), workers=1, progress=False, chunk_size=2)


def test_rating_rows_equal_direct_rate_girder_calls_exactly(rated_run):
    rows = rated_run.results()
    assert list(rows.columns) == list(batch.RATING_COLUMNS)
    assert len(RATED) == 3 and any(isinstance(r["resistance"]["positive_moment"], list) for r in RATED)
    summary = rated_run.summary().set_index("girder")
    for record in RATED:
        beam, dead, share, resistances = hand_made(record)
        direct = rating.rate_girder(beam, permanent=dead, resistances=resistances, distribution=share,
                                    loads=["design", "legal"], adtt=1500, condition="fair")
        mine = rows[rows["girder"] == record["id"]].reset_index(drop=True)
        columns = list(batch.RATING_COLUMNS[2:])
        pd.testing.assert_frame_equal(mine[columns], direct.frame[columns], check_exact=True)
        row = summary.loc[record["id"]]
        assert row["status"] == "done" and row["RF"] == direct.frame["RF"].min()
        for c in direct.controlling().itertuples(index=False):
            assert row[f"RF: {c.vehicle}"] == c.RF and row[f"x: {c.vehicle}"] == c.x
            for name, value in (("rating tons", c.rating_tons), ("posting", c.posting)):
                mine_value = row[f"{name}: {c.vehicle}"]
                assert mine_value == value or (math.isnan(value) and math.isnan(mine_value))
        assert row["RF_vehicle"] in {r.name for r in direct.loads}


def test_sections_are_named_and_a_girder_without_resistances_is_an_error_row(rated_run):
    rows = rated_run.results()
    first = rows[rows["girder"] == RATED[0]["id"]]
    assert set(first["vehicle"]) == {"HL-93 inventory", "HL-93 operating", *rating.LEGAL_SET}
    assert first["section"].iloc[0].startswith("span 1 at 0.")
    summary = rated_run.summary()
    unrated = summary[~summary["girder"].isin([r["id"] for r in RATED])]
    assert len(unrated) == 3
    assert set(unrated["status"]) == {"failed"} and set(unrated["field"]) == {"resistance"}
    assert set(unrated["error"]) == {"InventoryError"}
    assert rated_run.failed == 3


def test_two_workers_give_the_same_rating_tables(rated_run, tmp_path):
    two = batch.run(SAMPLE, tmp_path / "two", task=batch.RatingTask(**TASK), workers=2, progress=False,
                    chunk_size=2)
    pd.testing.assert_frame_equal(two.results(), rated_run.results())
    pd.testing.assert_frame_equal(two.summary(), rated_run.summary())


def test_a_reopened_rating_run_rebuilds_its_task_and_resumes(rated_run):
    again = batch.open_run(rated_run.folder)
    assert isinstance(again.task, batch.RatingTask) and again.task == batch.RatingTask(**TASK)
    (label, kind, found), = again.compute(RATED[1]["id"])
    assert (label, kind) == ("rating", "rating") and isinstance(found, rating.GirderRating)
    rows = rated_run.girder(RATED[1]["id"])
    assert rows["RF"].tolist() == found.frame["RF"].tolist()
    resumed = batch.run(SAMPLE, rated_run.folder, task=batch.RatingTask(**TASK), workers=1, progress=False)
    assert (resumed.computed, resumed.skipped) == (0, len(SAMPLE))


def test_bad_resistances_and_unknown_vehicles_name_the_record_and_field(tmp_path):
    base = {"units": "kip-ft", "spans": [40], "live": "HL-93"}
    records = [
        {"id": "negative", **base, "resistance": {"moment": 900, "shear": -80}},
        {"id": "unknown name", **base, "resistance": {"moment": 900, "torsion": 10}},
        {"id": "short range", **base, "resistance": {"positive_moment": [[0, 40]], "shear": 90}},
        {"id": "both senses twice", **base, "resistance": {"moment": 900, "negative_moment": 800}},
        {"id": "phi above one", **base, "resistance": {"moment": 900, "phi_moment": 1.2}},
        {"id": "not a table", **base, "resistance": 900},
        {"id": "uncovered", **base, "resistance": {"positive_moment": [[0, 20, 900]], "shear": 90}},
        {"id": "good", **base, "resistance": {"moment": 900, "shear": 90}},
        {"id": "none", **base},
    ]
    inv = batch.read_inventory(records)
    assert dict(zip(inv.errors_frame()["girder"], inv.errors_frame()["field"])) == {
        "negative": "resistance.shear", "unknown name": "resistance.torsion",
        "short range": "resistance.positive_moment", "both senses twice": "resistance.negative_moment",
        "phi above one": "resistance.phi_moment", "not a table": "resistance"}
    assert "a resistance is a magnitude" in inv.errors_frame().set_index("girder").loc["negative", "message"]
    result = batch.run(records, tmp_path / "bad", task=batch.RatingTask(loads="design", divisions=4), workers=1,
                       progress=False)
    s = result.summary().set_index("girder")
    assert s.loc["good", "status"] == "done"
    assert (s.loc["none", "status"], s.loc["none", "field"]) == ("failed", "resistance")
    assert (s.loc["uncovered", "status"], s.loc["uncovered", "error"]) == ("failed", "MissingResistanceError")
    assert s.loc["negative", "status"] == "invalid"
    with pytest.raises(ilkit.RatingInputError, match="unknown rating load 'Type 9'") as err:
        batch.RatingTask(loads=["design", "Type 9"])
    assert err.value.field == "loads"
    with pytest.raises(ilkit.IlkitError):
        batch.run(records, tmp_path / "never", task=batch.RatingTask(condition="splendid"), progress=False)
    assert not (tmp_path / "never").exists()


def test_lanes_on_the_girder_line_rate_with_their_share_and_one_lane_for_special_permits(tmp_path):
    permit = rating.permit_load(rating.permit_vehicle([20, 40, 40], [14, 4]), "special single trip", adtt=500)
    record = {"id": "two lanes", "units": "kip-ft", "spans": [50, 50], "EI": 4e7, "lanes": 2, "multiple_presence": 1.0,
              "resistance": {"moment": 2500, "shear": 260},
              "permanent": [{"name": "deck", "category": "DC", "intensity": 1.1}]}
    task = batch.RatingTask(loads=["HL-93 inventory", permit], divisions=5)
    rows = task(batch.validate_record(record)).rows
    beam = ilkit.Beam(100, {0: "pin", 50: "roller", 100: "roller"}, EI=4e7, units="kip-ft")
    dead = design.permanent_effects(beam, [design.DistributedLoad("deck", "DC", 1.1)], divisions=5,
                                    quantities=["moment", "shear"])
    direct = rating.rate_girder(beam, permanent=dead,
                                resistances=rating.Resistances(positive_moment=2500, negative_moment=2500, shear=260),
                                distribution=design.given_distribution(2.0, includes_multiple_presence=True),
                                single_lane=design.given_distribution(1), loads=["HL-93 inventory", permit],
                                divisions=5)
    assert rows["RF"].tolist() == direct.frame["RF"].tolist()
    assert permit.single_lane and set(rows["vehicle"]) == {"HL-93 inventory", permit.name}


# ------------------------------------------------------------------------------------------------ fatigue
FATIGUE = [
    {"id": "one lane factor", "units": "kip-ft", "spans": [48, 60], "EI": 2.2e7, "live": "HL-93",
     "distribution": {"moment": 0.62, "shear": 0.8, "includes_multiple_presence": True,
                      "one_lane": {"moment": 0.45, "shear": 0.66}},
     "permanent": [{"name": "deck", "category": "DC", "intensity": 1.3}]},
    {"id": "lanes", "units": "kip-ft", "spans": [70], "live": "HL-93", "lanes": 2, "multiple_presence": 1.0},
    {"id": "no one-lane factor", "units": "kip-ft", "spans": [70], "live": "HL-93", "distribution": {"moment": 0.6}},
    {"id": "LM1", "units": "kN-m", "spans": [25], "live": "LM1"},
]


def test_fatigue_limit_states_take_the_fatigue_truck_as_a_direct_factored_envelope_does(tmp_path):
    result = batch.run(FATIGUE, tmp_path / "fatigue", limit_states=["Strength I", "Fatigue I", "Fatigue II"],
                       divisions=5, workers=1, progress=False)
    rows = result.results()
    # the first girder by hand: HL-93 with its distribution, the fatigue truck with the one-lane factors
    # divided by m = 1.20 (AASHTO LRFD 3.6.1.1.2 and 3.6.1.4, from memory), IM 15 %
    beam = ilkit.Beam(108, {0: "pin", 48: "roller", 108: "roller"}, EI=2.2e7, units="kip-ft")
    dead = design.permanent_effects(beam, [design.DistributedLoad("deck", "DC", 1.3)], divisions=5,
                                    quantities=["moment", "shear", "reaction"])
    hl93 = design.GirderLiveLoad(loads.hl93(), distribution=design.given_distribution(
        0.62, 0.8, includes_multiple_presence=True))
    truck = design.GirderLiveLoad(loads.fatigue_truck(),
                                  distribution=design.given_distribution(0.45 / 1.2, 0.66 / 1.2))
    direct = design.factored_envelope(beam, permanent=dead, divisions=5,
                                      limit_states=["Strength I", "Fatigue I", "Fatigue II"],
                                      live={"*": hl93, "Fatigue I": truck, "Fatigue II": truck}).frame
    mine = rows[rows["girder"] == "one lane factor"].reset_index(drop=True)
    assert mine["load"].tolist() == direct["limit_state"].tolist()
    for col in ("max", "min", "x"):
        assert mine[col].tolist() == direct[col].astype(float).tolist()
    fatigue = mine[mine["load"] == "Fatigue I"]
    assert set(fatigue["max_case"]) <= {"fatigue truck", "no live load"} and fatigue["max"].max() > 0
    # one lane on the girder line, without multiple presence
    lanes = rows[(rows["girder"] == "lanes") & (rows["load"] == "Fatigue II")]
    span = ilkit.Beam(70, {0: "pin", 70: "roller"}, units="kip-ft")
    one = design.factored_envelope(
        span, permanent=design.permanent_effects(span, [design.DistributedLoad("no permanent load", "DC", 0)],
                                                 divisions=5, quantities=["moment", "shear", "reaction"]),
        live=design.GirderLiveLoad(loads.fatigue_truck()), limit_states=["Fatigue II"], divisions=5).frame
    assert lanes["max"].tolist() == one["max"].astype(float).tolist()
    s = result.summary().set_index("girder")
    assert (s.loc["no one-lane factor", "status"], s.loc["no one-lane factor", "field"]) == (
        "failed", "distribution.one_lane")
    assert (s.loc["LM1", "status"], s.loc["LM1", "error"], s.loc["LM1", "field"]) == (
        "failed", "DesignInputError", "live")


# ---------------------------------------------------------------------------------------------------- views
def test_a_histogram_of_the_controlling_rating_factors(rated_run):
    from ilkit import views

    ax = views.plot_inventory(rated_run, "RF")
    assert "rating factor" in ax.get_xlabel() and "3 girders done" in ax.get_title(loc="left")
    assert sum(p.get_height() for p in ax.patches) == 3
    assert [line.get_xdata()[0] for line in ax.get_lines()] == [1.0]
    one = views.plot_inventory(rated_run, "RF", vehicle="Type 3")
    assert "Type 3" in one.get_xlabel()
    with pytest.raises(ilkit.BatchInputError, match="no rating factors of 'Type 9'"):
        views.plot_inventory(rated_run, "RF", vehicle="Type 9")
    import matplotlib.pyplot as plt

    plt.close("all")


def test_one_girders_rating_sheet_from_a_rating_run(rated_run, tmp_path):
    from ilkit import views

    sheet = views.write_girder_sheet(rated_run, RATED[0]["id"], tmp_path / "sheets")
    text = sheet.html.read_text(encoding="utf-8")
    assert sheet.html.parent == tmp_path / "sheets" and f"Load rating of girder {RATED[0]['id']}" in text
    assert "licensed professional engineer" in text and sheet.pdf is None


def test_sheets_of_ids_with_a_dot_keep_the_whole_id(tmp_path):
    from ilkit import views

    records = [{**RATED[0], "id": "Creek Rd G2.1"}, {**RATED[0], "id": "Creek Rd G2.2"}]
    result = batch.run(records, tmp_path / "dots", task=batch.RatingTask(loads="HL-93 inventory", divisions=2),
                       workers=1, progress=False)
    names = {views.write_girder_sheet(result, r["id"], tmp_path / "sheets").html.name for r in records}
    assert names == {"Creek%20Rd%20G2.1.html", "Creek%20Rd%20G2.2.html"}
