"""Batch runs (ilkit.batch.run): the same numbers as single-girder calls, with any number of workers;
chunks written atomically, a killed run resumed with nothing computed twice; a failing girder is an
error row and the run goes on; outputs stay in their folder.

The single-girder references are built here by hand from the records' numbers with ilkit.Beam and
ilkit.design (whose own tests check them against outside sources); the batch must equal them exactly.
"""

from __future__ import annotations

import os
import subprocess
import sys
import textwrap
from pathlib import Path

import numpy as np
import pandas as pd
import pytest

import ilkit
from ilkit import batch, design, loads

pytest.importorskip("pyarrow")

ROOT = Path(__file__).resolve().parents[1]
SAMPLE = batch.sample_inventory(8, seed=11, spans=(1, 3), lengths=(30.0, 90.0))


def hand_made(record: dict) -> tuple[ilkit.Beam, design.GirderLiveLoad, design.PermanentEffects]:
    """The girder of a sample record, typed as an engineer would for a single-girder study."""
    spans = record["spans"]
    supports = {0: "pin"}
    at = 0.0
    for s in spans:
        at += s
        supports[at] = "roller"
    ei = record["EI"] if not isinstance(record["EI"], list) else [tuple(r) for r in record["EI"]]
    beam = ilkit.Beam(at, supports, EI=ei, units="kip-ft")
    d = record["distribution"]
    live = design.GirderLiveLoad(loads.hl93(), distribution=design.given_distribution(
        d["moment"], d["shear"], includes_multiple_presence=True))
    dead = [design.DistributedLoad(p["name"], p["category"], p["intensity"]) for p in record["permanent"]]
    return beam, live, design.permanent_effects(beam, dead, quantities=["moment", "shear", "reaction"])


@pytest.fixture(scope="module")
def inline_run(tmp_path_factory):
    out = tmp_path_factory.mktemp("batch") / "one"
    return batch.run(SAMPLE, out, models=["HL-93"], limit_states=["Strength I", "Service II"], workers=1,
                     progress=False, chunk_size=3)


def test_batch_rows_equal_single_girder_calls_exactly(inline_run):
    rows = inline_run.results()
    assert list(rows.columns) == list(batch.ROW_COLUMNS)
    for record in (SAMPLE[0], SAMPLE[5], SAMPLE[3]):
        beam, live, dead = hand_made(record)
        mine = rows[rows["girder"] == record["id"]]
        lane = design.live_envelope(beam, live).frame
        part = mine[mine["kind"] == "load model"]
        assert part["load"].unique().tolist() == ["HL-93"]
        np.testing.assert_array_equal(part["max"].to_numpy(), lane["max"].to_numpy())
        np.testing.assert_array_equal(part["min"].to_numpy(), lane["min"].to_numpy())
        assert part["x"].tolist() == lane["x"].tolist() and part["side"].tolist() == lane["side"].tolist()
        factored = design.factored_envelope(beam, permanent=dead, live=live,
                                            limit_states=["Strength I", "Service II"]).frame
        part = mine[mine["kind"] == "limit state"]
        assert part["load"].tolist() == factored["limit_state"].tolist()
        np.testing.assert_array_equal(part["max"].to_numpy(), factored["max"].to_numpy())
        np.testing.assert_array_equal(part["min"].to_numpy(), factored["min"].to_numpy())
        assert part["max_case"].tolist() == factored["max_case"].tolist()


def test_the_summary_holds_the_governing_rows(inline_run):
    summary = inline_run.summary()
    rows = inline_run.results()
    assert summary["girder"].tolist() == [r["id"] for r in SAMPLE]
    assert (summary["status"] == "done").all()
    for _, s in summary.iterrows():
        mine = rows[(rows["girder"] == s["girder"]) & (rows["quantity"] == "moment")]
        assert s["moment_max"] == mine["max"].max() and s["moment_min"] == mine["min"].min()
        top = mine.loc[mine["max"].idxmax()]
        assert (s["moment_max_x"], s["moment_max_load"]) == (top["x"], top["load"])


def test_sections_are_tenth_points_named_by_span(inline_run):
    rows = inline_run.girder(SAMPLE[5]["id"])
    spans = len(SAMPLE[5]["spans"])
    moments = rows[(rows["quantity"] == "moment") & (rows["load"] == "HL-93")]
    assert len(moments) == 11 * spans + (spans - 1) * 0  # ends shared: both faces at each pier
    assert moments["section"].iloc[3] == "span 1 at 0.30"
    reactions = rows[(rows["quantity"] == "reaction") & (rows["load"] == "HL-93")]
    assert reactions["section"].tolist() == [f"support {i + 1}" for i in range(spans + 1)]


def test_two_workers_give_the_same_tables(inline_run, tmp_path):
    two = batch.run(SAMPLE, tmp_path / "two", models=["HL-93"], limit_states=["Strength I", "Service II"],
                    workers=2, progress=False, chunk_size=2)
    pd.testing.assert_frame_equal(two.results(), inline_run.results())
    pd.testing.assert_frame_equal(two.summary(), inline_run.summary())


def test_bad_records_give_error_rows_and_the_others_results(tmp_path):
    path = tmp_path / "inv.toml"
    path.write_text(textwrap.dedent("""
        [defaults]
        units = "kip-ft"
        live = "HL-93"
        [[girders]]
        id = "good"
        spans = [40]
        [[girders]]
        id = "no spans"
        [[girders]]
        id = "mechanism"
        spans = [40]
        hinges = [20]
        [[girders]]
        id = "unknown model"
        spans = [40]
        live = "HL-99"
        [[girders]]
        id = "wrong units"
        units = "furlongs"
        spans = [40]
        [[girders]]
        id = "rail under Strength I"
        spans = [40]
        live = { model = "Cooper", n = 80, impact = 0.3 }
        [[girders]]
        id = "also good"
        spans = [50]
        """), encoding="utf-8")
    result = batch.run(path, tmp_path / "out", limit_states=["Strength I"], divisions=4, workers=1,
                       progress=False)
    summary = result.summary().set_index("girder")
    assert summary.loc[["good", "also good"], "status"].tolist() == ["done", "done"]
    assert summary.loc["no spans", ["status", "field"]].tolist() == ["invalid", "spans"]
    assert summary.loc["mechanism", ["status", "field", "error"]].tolist() == ["invalid", "hinges",
                                                                             "UnstableBeamError"]
    assert summary.loc["unknown model", ["status", "field"]].tolist() == ["invalid", "live"]
    assert summary.loc["wrong units", ["status", "field"]].tolist() == ["invalid", "units"]
    # valid data, but Strength I calls for IM = 33 %: the rail load's task fails, the run goes on
    failed = summary.loc["rail under Strength I"]
    assert (failed["status"], failed["field"], failed["error"]) == ("failed", "live", "DesignInputError")
    assert "33 %" in failed["message"]
    assert (result.failed, result.invalid, result.computed) == (1, 4, 3)
    assert summary.index.tolist() == ["good", "no spans", "mechanism", "unknown model", "wrong units",
                                      "rail under Strength I", "also good"]
    assert set(result.results()["girder"]) == {"good", "also good"}
    assert result.errors()["girder"].tolist() == summary.index[summary["status"] != "done"].tolist()


def test_another_task_into_the_same_folder_is_refused(tmp_path):
    batch.run(SAMPLE[:1], tmp_path, models=["HL-93"], divisions=2, workers=1, progress=False)
    with pytest.raises(ilkit.BatchInputError, match="another run"):
        batch.run(SAMPLE[:1], tmp_path, models=["HL-93"], divisions=4, workers=1, progress=False)
    again = batch.run(SAMPLE[:1], tmp_path, models=["HL-93"], divisions=4, workers=1, progress=False, fresh=True)
    assert again.computed == 1


def test_a_changed_record_is_computed_again_and_the_rest_skipped(tmp_path):
    first = batch.run(SAMPLE[:3], tmp_path, models=["HL-93"], divisions=2, workers=1, progress=False).results()
    changed = [dict(r) for r in SAMPLE[:3]]
    changed[1]["distribution"] = {**changed[1]["distribution"], "moment": 0.5}
    second = batch.run(changed, tmp_path, models=["HL-93"], divisions=2, workers=1, progress=False)
    assert (second.computed, second.skipped) == (1, 2)
    fresh = batch.run(changed, tmp_path / "fresh", models=["HL-93"], divisions=2, workers=1, progress=False)
    pd.testing.assert_frame_equal(second.results(), fresh.results())
    assert not first.equals(second.results())


def test_outputs_of_ids_that_look_like_paths_stay_in_the_folder(tmp_path):
    out = tmp_path / "deep" / "out"
    records = [{**SAMPLE[0], "id": "../escaped"}, {**SAMPLE[1], "id": str(tmp_path / "absolute")}]
    result = batch.run(records, out, models=["HL-93"], divisions=2, workers=1, progress=False)
    assert result.summary()["girder"].tolist() == ["../escaped", str(tmp_path / "absolute")]
    outside = [p for p in tmp_path.rglob("*") if out not in p.parents and p != out and p not in out.parents]
    assert outside == []


RESUME_SCRIPT = """
import sys
sys.path.insert(0, {tests!r})
from batch_tasks import KillProcess
from ilkit import batch

if __name__ == "__main__":
    records = batch.sample_inventory(9, seed=11, spans=(1, 3), lengths=(30.0, 90.0))
    task = KillProcess(batch.EnvelopeTask(models=["HL-93"], divisions=4), victim=records[6]["id"],
                       marker={marker!r})
    batch.run(records, {out!r}, task=task, workers={workers}, chunk_size=2, progress=False)
"""


@pytest.mark.parametrize("workers", [1, 2], ids=["driver killed", "worker killed"])
def test_a_killed_run_resumes_with_nothing_done_twice(tmp_path, workers):
    out, marker = tmp_path / "out", tmp_path / "killed"
    script = tmp_path / "run.py"
    script.write_text(RESUME_SCRIPT.format(tests=str(ROOT / "tests"), marker=str(marker), out=str(out),
                                           workers=workers), encoding="utf-8")
    env = {**os.environ, "PYTHONPATH": str(ROOT)}
    done = subprocess.run([sys.executable, str(script)], env=env, capture_output=True, text=True, timeout=600)
    assert marker.exists(), done.stderr
    records = batch.sample_inventory(9, seed=11, spans=(1, 3), lengths=(30.0, 90.0))
    task = batch.EnvelopeTask(models=["HL-93"], divisions=4)
    chunks = sorted((out / "chunks").glob("part-*.summary.parquet"))
    if workers == 1:  # the driver died at girder 7: three chunks of two girders were written, nothing else
        assert done.returncode == -9
        assert len(chunks) == 3 and not (out / "results.parquet").exists()
        before = set(pd.concat([pd.read_parquet(c) for c in chunks])["girder"])
        assert before == {r["id"] for r in records[:6]}
        resumed = batch.run(records, out, task=task, workers=1, progress=False, chunk_size=2)
        assert (resumed.computed, resumed.skipped) == (3, 6)
    else:  # the worker died: its pool was replaced and the girders it held computed on a new one
        assert done.returncode == 0, done.stderr
        resumed = batch.run(records, out, task=task, workers=1, progress=False)
        assert (resumed.computed, resumed.skipped) == (0, 9)
    every = pd.concat([pd.read_parquet(c) for c in sorted((out / "chunks").glob("part-*.summary.parquet"))])
    assert sorted(every["girder"]) == sorted(r["id"] for r in records)  # each girder in one chunk: done once
    clean = batch.run(records, tmp_path / "clean", task=task, workers=1, progress=False)
    pd.testing.assert_frame_equal(resumed.results(), clean.results())
    pd.testing.assert_frame_equal(resumed.summary(), clean.summary())
    assert (resumed.summary()["status"] == "done").all()


def test_a_girder_that_kills_its_worker_every_time_is_one_error_row(tmp_path):
    sys.path.insert(0, str(ROOT / "tests"))
    from batch_tasks import KillProcess

    records = SAMPLE[:3]
    task = KillProcess(batch.EnvelopeTask(models=["HL-93"], divisions=2), victim=records[1]["id"],
                       marker=str(tmp_path / "killed"), always=True)
    result = batch.run(records, tmp_path / "out", task=task, workers=2, progress=False)
    summary = result.summary()
    assert summary["status"].tolist() == ["done", "failed", "done"]
    assert summary.loc[1, "error"] == "WorkerDied" and "worker process ended" in summary.loc[1, "message"]
    assert set(result.results()["girder"]) == {records[0]["id"], records[2]["id"]}


def test_a_task_must_describe_itself_and_take_a_record(tmp_path):
    with pytest.raises(ilkit.BatchInputError, match="GirderTask"):
        batch.run(SAMPLE[:1], tmp_path, task=len, progress=False)
    with pytest.raises(ilkit.BatchInputError, match="not both"):
        batch.run(SAMPLE[:1], tmp_path, task=batch.EnvelopeTask(models=["HL-93"]), models=["HL-93"])
