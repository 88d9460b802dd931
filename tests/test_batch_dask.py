"""Batch runs on a real dask.distributed cluster: a LocalCluster of two worker processes on 127.0.0.1.

The same call as the local run with a Client (or the scheduler's address) gives the same tables,
byte for byte in their values, as one local process.
"""

from __future__ import annotations

import pandas as pd
import pytest

from ilkit import batch

pytest.importorskip("pyarrow")
distributed = pytest.importorskip("distributed")

RECORDS = batch.sample_inventory(6, seed=5, spans=(1, 3), lengths=(30.0, 80.0))
ARGS = {"models": ["HL-93"], "limit_states": ["Strength I"], "divisions": 5, "progress": False, "chunk_size": 2}


@pytest.fixture(scope="module")
def cluster():
    with distributed.LocalCluster(n_workers=2, threads_per_worker=1, processes=True, host="127.0.0.1",
                                  dashboard_address=None, silence_logs=40) as local:
        yield local


def test_a_dask_client_gives_the_tables_of_one_local_process(cluster, tmp_path):
    local = batch.run(RECORDS, tmp_path / "local", workers=1, **ARGS)
    with distributed.Client(cluster) as client:
        assert len(client.scheduler_info()["workers"]) == 2
        remote = batch.run(RECORDS, tmp_path / "dask", client=client, **ARGS)
    assert (remote.computed, remote.failed) == (len(RECORDS), 0)
    pd.testing.assert_frame_equal(remote.results(), local.results())
    pd.testing.assert_frame_equal(remote.summary(), local.summary())


def test_a_scheduler_address_resumes_a_local_run(cluster, tmp_path):
    local = batch.run(RECORDS[:3], tmp_path / "out", workers=1, **ARGS)
    assert local.computed == 3
    resumed = batch.run(RECORDS, tmp_path / "out", scheduler=cluster.scheduler_address, **ARGS)
    assert (resumed.computed, resumed.skipped) == (3, 3)
    whole = batch.run(RECORDS, tmp_path / "whole", workers=1, **ARGS)
    pd.testing.assert_frame_equal(resumed.results(), whole.results())


def test_a_failing_girder_on_the_cluster_is_an_error_row(cluster, tmp_path):
    bad = [*RECORDS[:2], {**RECORDS[2], "live": {"model": "Cooper", "n": 80, "impact": 0.3}}]
    with distributed.Client(cluster) as client:
        result = batch.run(bad, tmp_path / "out", client=client, **ARGS)
    assert result.summary()["status"].tolist() == ["done", "done", "failed"]


def test_a_rating_run_on_the_cluster_gives_the_tables_of_one_local_process(cluster, tmp_path):
    rated = [r for r in RECORDS if "resistance" in r] + [RECORDS[1]]  # the last one has none: an error row
    task = batch.RatingTask(loads=["design", "Type 3S2"], adtt=2500, divisions=5)
    local = batch.run(rated, tmp_path / "local", task=task, workers=1, progress=False)
    with distributed.Client(cluster) as client:
        remote = batch.run(rated, tmp_path / "dask", task=task, client=client, progress=False)
    assert remote.summary()["status"].tolist() == ["done", "done", "failed"]
    pd.testing.assert_frame_equal(remote.results(), local.results())
    pd.testing.assert_frame_equal(remote.summary(), local.summary())
