"""The verification record (tests/_verification.py): checks compare, record and fail as they say."""

from __future__ import annotations

import json
import subprocess
import sys
from fractions import Fraction
from pathlib import Path

import numpy as np
import pytest
import sympy
from _verification import Reference, _plain, _same

HERE = Path(__file__).resolve().parent


def test_exact_and_tolerant_comparisons():
    assert _same(Fraction(7, 10), Fraction(7, 10), 0, 0)
    assert _same(sympy.Rational(7, 10), Fraction(7, 10), 0, 0)
    assert _same(sympy.sqrt(2) ** 2, 2, 0, 0)
    assert not _same(Fraction(7, 10), 0.7000001, 0, 0)
    assert _same(1.0, 1.0 + 1e-13, 0, 1e-12) and not _same(1.0, 1.0 + 1e-11, 0, 1e-12)
    assert _same([0.1, 0.2], np.array([0.1, 0.2 + 1e-5]), 2e-4, 0)
    assert not _same([0.1, 0.2], [0.1], 1, 0)  # lengths differ
    assert _same("design truck + lane", "design truck + lane", 0, 0)
    assert not _same(float("nan"), float("nan"), 1, 1)
    assert _plain(Fraction(7, 10)) == "7/10" and _plain(np.array([1.5, 2])) == [1.5, 2.0]
    assert _plain(float("inf")) == "inf" and _plain((sympy.Rational(1, 3),)) == ["1/3"]


def test_a_failed_check_is_recorded_and_raises():
    ref = Reference()
    assert ref("R_A", expected=Fraction(1, 2), computed=Fraction(1, 2), source="statics") == Fraction(1, 2)
    with pytest.raises(AssertionError, match=r"M_B: expected 1\.0, computed 1\.1 \(tolerance abs 0\.01"):
        ref("M_B", expected=1.0, computed=1.1, abs=0.01, source="handbook", clause="Table 3")
    assert [c["passed"] for c in ref.checks] == [True, False]
    assert ref.checks[1]["clause"] == "Table 3" and ref.checks[1]["abs"] == 0.01
    with pytest.raises(TypeError, match="name the source"):
        ref("M_B", expected=1, computed=1, source="")


def test_the_run_writes_every_reference_test_with_its_checks(tmp_path):
    (tmp_path / "conftest.py").write_text(
        f"import sys\nsys.path.insert(0, {str(HERE)!r})\n"
        "from _verification import (pytest_addoption, pytest_collection_modifyitems, pytest_configure,\n"
        "    pytest_runtest_makereport, pytest_sessionfinish, reference)\n"
    )
    (tmp_path / "test_demo.py").write_text(
        '"""Demo checks."""\n'
        "def test_good(reference):\n"
        "    reference('one', expected=1, computed=1, source='arithmetic', clause='1 = 1')\n"
        "def test_bad(reference):\n"
        "    reference('two', expected=2, computed=3, source='arithmetic')\n"
        "def test_silent(reference):\n"
        "    pass\n"
        "def test_other():\n"
        "    pass\n"
    )
    out = tmp_path / "record.json"
    run = subprocess.run(
        [sys.executable, "-m", "pytest", "-q", "-p", "no:cacheprovider", "-p", "no:randomly", str(tmp_path),
         f"--verification-json={out}", "--rootdir", str(tmp_path), "-c", "/dev/null"],
        capture_output=True, text=True, cwd=tmp_path,
    )
    assert run.returncode == 1, run.stdout + run.stderr
    record = json.loads(out.read_text())
    tests = {t["name"]: t for t in record["tests"]}
    assert set(tests) == {"test_good", "test_bad", "test_silent"}  # only tests that take the fixture
    assert tests["test_good"]["outcome"] == "passed" and tests["test_good"]["checks"][0]["clause"] == "1 = 1"
    assert tests["test_bad"]["outcome"] == "failed" and tests["test_bad"]["checks"][0]["passed"] is False
    assert tests["test_silent"]["outcome"] == "failed"  # a reference test must record a check
    assert "must record at least one check" in run.stdout
    assert tests["test_good"]["file_title"] == "Demo checks."
    # -m reference selects the tests that take the fixture
    selected = subprocess.run(
        [sys.executable, "-m", "pytest", "-q", "--collect-only", "-m", "reference", "-p", "no:cacheprovider",
         str(tmp_path), "--rootdir", str(tmp_path), "-c", "/dev/null"],
        capture_output=True, text=True, cwd=tmp_path,
    )
    assert "test_other" not in selected.stdout and "test_good" in selected.stdout
