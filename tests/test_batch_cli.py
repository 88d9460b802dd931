"""`python -m ilkit batch`: the batch run from a shell; bad arguments are a message and status 2."""

from __future__ import annotations

import json
import os
import subprocess
import sys
from pathlib import Path

import pandas as pd
import pytest

from ilkit import batch

pytest.importorskip("pyarrow")

ROOT = Path(__file__).resolve().parents[1]
INVENTORY = """
[defaults]
units = "kip-ft"
live = "HL-93"

[[girders]]
id = "span 40"
spans = [40]

[[girders]]
id = "two spans"
spans = [45, 45]
EI = 3e7

[[girders]]
id = "mechanism"
spans = [40]
hinges = [10]
"""


RATING_SAMPLE = batch.sample_inventory(2, seed=11, spans=(1, 3), lengths=(30.0, 90.0), rated=2)
"""Two generated girders of our own, the first with resistances, the second without."""


def cli(*args: str) -> subprocess.CompletedProcess:
    env = {**os.environ, "PYTHONPATH": str(ROOT)}
    return subprocess.run([sys.executable, "-m", "ilkit", *args], capture_output=True, text=True, env=env,
                          timeout=600)


def test_the_command_writes_the_tables_of_the_python_call(tmp_path):
    path = tmp_path / "girders.toml"
    path.write_text(INVENTORY, encoding="utf-8")
    done = cli("batch", str(path), "--out", str(tmp_path / "cli"), "--model", "HL-93", "--limit-state", "Strength I",
               "--divisions", "4", "--workers", "1", "--no-progress")
    assert done.returncode == 0, done.stderr
    assert "2 girders computed, 0 already done, 0 failed, 1 invalid records" in done.stdout
    assert "mechanism: invalid (hinges)" in done.stdout
    same = batch.run(path, tmp_path / "py", models=["HL-93"], limit_states=["Strength I"], divisions=4, workers=1,
                     progress=False)
    pd.testing.assert_frame_equal(pd.read_parquet(tmp_path / "cli" / "results.parquet"), same.results())
    pd.testing.assert_frame_equal(pd.read_parquet(tmp_path / "cli" / "summary.parquet"), same.summary())
    again = cli("batch", str(path), "--out", str(tmp_path / "cli"), "--model", "HL-93", "--limit-state",
                "Strength I", "--divisions", "4", "--workers", "1", "--no-progress")
    assert "0 girders computed, 2 already done" in again.stdout


def test_bad_arguments_are_a_message_and_status_2(tmp_path):
    path = tmp_path / "girders.toml"
    path.write_text(INVENTORY, encoding="utf-8")
    done = cli("batch", str(path), "--out", str(tmp_path / "x"), "--model", "HL-39", "--no-progress")
    assert done.returncode == 2 and "unknown load model 'HL-39'" in done.stderr
    assert "Traceback" not in done.stderr
    assert cli("frobnicate").returncode == 2
    assert cli("--help").returncode == 0


def test_the_rating_command_writes_the_tables_of_the_python_call(tmp_path):
    path = tmp_path / "girders.json"
    path.write_text(json.dumps({"girders": RATING_SAMPLE}), encoding="utf-8")
    done = cli("batch", str(path), "--out", str(tmp_path / "cli"), "--rate", "design, Type 3", "--adtt", "1500",
               "--condition", "fair", "--divisions", "4", "--workers", "1", "--no-progress")
    assert done.returncode == 0, done.stderr
    assert "2 girders computed, 0 already done, 1 failed" in done.stdout
    assert f"{RATING_SAMPLE[1]['id']}: failed (resistance)" in done.stdout
    same = batch.run(path, tmp_path / "py", workers=1, progress=False, task=batch.RatingTask(
        loads=["design", "Type 3"], adtt=1500.0, condition="fair", divisions=4))
    pd.testing.assert_frame_equal(pd.read_parquet(tmp_path / "cli" / "results.parquet"), same.results())
    pd.testing.assert_frame_equal(pd.read_parquet(tmp_path / "cli" / "summary.parquet"), same.summary())
    bad = cli("batch", str(path), "--out", str(tmp_path / "x"), "--rate", "design,Type 9", "--no-progress")
    assert bad.returncode == 2 and "unknown rating load 'Type 9'" in bad.stderr and "Traceback" not in bad.stderr
    stray = cli("batch", str(path), "--out", str(tmp_path / "y"), "--adtt", "500", "--no-progress")
    assert stray.returncode == 2 and "--adtt belong to a rating run" in stray.stderr
    both = cli("batch", str(path), "--out", str(tmp_path / "z"), "--rate", "design", "--model", "HL-93")
    assert both.returncode == 2 and "not both" in both.stderr
