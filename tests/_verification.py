"""The verification record: reference tests state what they check against which outside source.

A reference test takes the ``reference`` fixture and calls it once per check::

    def test_two_equal_spans(reference):
        reference(
            "middle reaction, load at 2.5 m",
            expected=F(...), computed=line.ordinate_exact(F(5, 2)),
            source="AISC Steel Construction Manual, Beam Diagrams and Formulas",
            clause="continuous beam, two equal spans, concentrated load at any point",
            from_memory=True,
        )

Each call compares ``computed`` with ``expected`` (exactly, or within ``abs``/``rel``; numbers,
fractions, sympy numbers, arrays and texts), records the check, and fails the test when they
differ.  A test that takes the fixture is marked ``reference`` (select them with
``pytest -m reference``) and must record at least one check.  With
``--verification-json PATH`` the run writes every reference test, its outcome and its checks to
``PATH`` (atomically); the documentation's verification manual is generated from that file.
"""

from __future__ import annotations

import datetime
import inspect
import json
import math
import os
import platform
import tempfile
from dataclasses import dataclass, field
from fractions import Fraction
from pathlib import Path
from typing import Any

import numpy as np
import pytest

_RECORDS = pytest.StashKey[dict[str, dict[str, Any]]]()
_CALL = pytest.StashKey[Any]()


# --------------------------------------------------------------------- comparing and writing values
def _is_exact(value: Any) -> bool:
    if isinstance(value, bool):
        return False
    if isinstance(value, (int, Fraction)):
        return True
    try:
        import sympy
    except ImportError:  # pragma: no cover
        return False
    return isinstance(value, sympy.Basic)


def _plain(value: Any) -> Any:
    """A JSON value for the record: exact numbers as text (``7/10``), floats as numbers."""
    if isinstance(value, np.ndarray):
        return [_plain(v) for v in value.tolist()]
    if isinstance(value, (list, tuple)):
        return [_plain(v) for v in value]
    if isinstance(value, (bool, np.bool_)):
        return bool(value)
    if isinstance(value, (float, np.floating)):
        value = float(value)
        return value if math.isfinite(value) else str(value)
    if isinstance(value, (int, np.integer)):
        return int(value)
    if isinstance(value, str):
        return value
    return str(value)


def _same(expected: Any, computed: Any, abs_tol: float, rel_tol: float) -> bool:
    if isinstance(expected, str) or isinstance(computed, str):
        return expected == computed
    if isinstance(expected, (list, tuple, np.ndarray)) or isinstance(computed, (list, tuple, np.ndarray)):
        e, c = list(np.ravel(np.asarray(expected, dtype=object))), list(np.ravel(np.asarray(computed, dtype=object)))
        return len(e) == len(c) and all(_same(a, b, abs_tol, rel_tol) for a, b in zip(e, c))
    if not abs_tol and not rel_tol:
        if expected == computed:
            return True
        if _is_exact(expected) and _is_exact(computed):
            import sympy

            return sympy.simplify(sympy.sympify(expected) - sympy.sympify(computed)) == 0
        return False
    e, c = float(expected), float(computed)
    if not (math.isfinite(e) and math.isfinite(c)):
        return e == c
    return abs(c - e) <= abs_tol + rel_tol * abs(e)


@dataclass
class Reference:
    """The ``reference`` fixture: ``reference(what, expected=, computed=, source=, ...)``."""

    checks: list[dict[str, Any]] = field(default_factory=list)

    def __call__(
        self,
        what: str,
        *,
        expected: Any,
        computed: Any,
        source: str,
        clause: str = "",
        from_memory: bool = False,
        abs: float = 0.0,
        rel: float = 0.0,
        unit: str = "",
    ) -> Any:
        """Compare ``computed`` with ``expected``, record the check, fail the test if they differ.

        ``source`` names the outside source (document and edition, handbook, reference library or
        the derivation written in the test); ``clause`` the clause, table, page or formula;
        ``from_memory`` says the expected value was recalled rather than read.  ``abs``/``rel``:
        the tolerance (none: equal exactly).  Returns ``computed``.
        """
        if not isinstance(what, str) or not what.strip():
            raise TypeError("reference(...): say what is checked, e.g. 'R_A at x = 7/3'")
        if not isinstance(source, str) or not source.strip():
            raise TypeError(f"reference({what!r}): name the source (document, clause or table)")
        passed = _same(expected, computed, abs, rel)
        self.checks.append(
            {
                "what": what,
                "source": source,
                "clause": clause,
                "from_memory": bool(from_memory),
                "expected": _plain(expected),
                "computed": _plain(computed),
                "abs": float(abs),
                "rel": float(rel),
                "unit": unit,
                "passed": bool(passed),
            }
        )
        if not passed:
            tolerance = f"abs {abs:g}, rel {rel:g}" if abs or rel else "exact"
            raise AssertionError(
                f"{what}: expected {expected!r}, computed {computed!r} (tolerance {tolerance}; "
                f"source: {source}{', ' + clause if clause else ''})"
            )
        return computed


# --------------------------------------------------------------------- pytest hooks
def pytest_addoption(parser: pytest.Parser) -> None:
    parser.addoption(
        "--verification-json",
        default=None,
        metavar="PATH",
        help="write the reference tests, their sources and results to PATH (the verification manual)",
    )


def pytest_configure(config: pytest.Config) -> None:
    config.addinivalue_line("markers", "reference: a check against a source outside the project (verification manual)")
    config.stash[_RECORDS] = {}


def pytest_collection_modifyitems(items: list[pytest.Item]) -> None:
    for item in items:
        if "reference" in getattr(item, "fixturenames", ()):
            item.add_marker(pytest.mark.reference)


def _file_title(item: pytest.Item) -> str:
    module = getattr(item, "module", None)
    doc = inspect.getdoc(module) if module is not None else ""
    return (doc or "").split("\n\n")[0].replace("\n", " ").strip()


def _entry(item: pytest.Item) -> dict[str, Any]:
    records = item.config.stash[_RECORDS]
    if item.nodeid not in records:
        function = getattr(item, "function", None)
        doc = inspect.getdoc(function) if function is not None else ""
        records[item.nodeid] = {
            "nodeid": item.nodeid,
            "file": item.nodeid.split("::")[0],
            "file_title": _file_title(item),
            "name": item.name,
            "doc": (doc or "").split("\n\n")[0].replace("\n", " "),
            "outcome": "not run",
            "checks": [],
        }
    return records[item.nodeid]


@pytest.fixture
def reference(request: pytest.FixtureRequest) -> Any:
    """Record checks against outside sources (see :class:`Reference`)."""
    recorder = Reference()
    entry = _entry(request.node)
    entry["checks"] = recorder.checks
    yield recorder
    call = request.node.stash.get(_CALL, None)
    if call is not None and call.passed and not recorder.checks:
        pytest.fail("a reference test must record at least one check with reference(...)")


@pytest.hookimpl(wrapper=True)
def pytest_runtest_makereport(item: pytest.Item, call: pytest.CallInfo[Any]) -> Any:
    report = yield
    if "reference" not in getattr(item, "fixturenames", ()):
        return report
    entry = _entry(item)
    if report.when == "call":
        item.stash[_CALL] = report
        entry["outcome"] = report.outcome
    elif report.failed:  # setup or teardown
        entry["outcome"] = "error" if report.when == "setup" else "failed"
    elif report.skipped and report.when == "setup":
        entry["outcome"] = "skipped"
    return report


def pytest_sessionfinish(session: pytest.Session, exitstatus: int) -> None:
    target = session.config.getoption("--verification-json", default=None)
    if not target:
        return
    import ilkit

    record = {
        "finished": datetime.datetime.now(datetime.timezone.utc).strftime("%Y-%m-%d %H:%M UTC"),
        "ilkit_version": ilkit.__version__,
        "python": platform.python_version(),
        "exitstatus": int(exitstatus),
        "tests": sorted(session.config.stash[_RECORDS].values(), key=lambda t: t["nodeid"]),
    }
    path = Path(target)
    path.parent.mkdir(parents=True, exist_ok=True)
    fd, tmp = tempfile.mkstemp(dir=path.parent, prefix=path.name, suffix=".tmp")
    with os.fdopen(fd, "w") as handle:
        json.dump(record, handle, indent=1, ensure_ascii=False)
    os.replace(tmp, path)
