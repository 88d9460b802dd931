"""Reference values name sources a reader of the repository can find.

Regression: some tests named as their source a formula quoted in the project's
tracker (which users cannot see) or a notes file that is not in the repository.
A check names a published standard and clause, a handbook, a reference
library, "derived in this test", "from memory" or "common practice".
"""

from __future__ import annotations

import re
from pathlib import Path

ROOT = Path(__file__).resolve().parents[1]
# sources that are not in the repository (spelled in pieces so that this file does not match itself)
UNREACHABLE = re.compile(
    r"\bthe (form|formula|values?) in the " "issue\\b"
    r"|\bthe " "issue's\\b"
    r"|\b(load-models|design|style|browser-testing)\." "md\\b"
    r"|/work/" "shared"
)


def test_no_check_cites_a_source_outside_the_repository() -> None:
    found = []
    for folder in ("tests", "ilkit", "benchmarks", "tools"):
        for path in sorted((ROOT / folder).rglob("*.py")):
            for number, line in enumerate(path.read_text(encoding="utf-8").splitlines(), 1):
                if UNREACHABLE.search(line):
                    found.append(f"{path.relative_to(ROOT)}:{number}: {line.strip()}")
    assert found == [], "name the standard, handbook or derivation instead:\n" + "\n".join(found)
