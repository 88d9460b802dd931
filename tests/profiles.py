"""How many examples a property test runs: its usual count, or many more in the nightly profile.

Select the nightly profile with ``ILKIT_HYPOTHESIS_PROFILE=nightly`` (see
DEVELOPERS.md); CI runs the usual counts derandomized (``CI`` set).
"""

from __future__ import annotations

import os

NIGHTLY_FACTOR = 25


def nightly() -> bool:
    return os.environ.get("ILKIT_HYPOTHESIS_PROFILE") == "nightly"


def examples(usual: int) -> int:
    """``usual`` examples, ``NIGHTLY_FACTOR`` times as many in the nightly profile."""
    return usual * NIGHTLY_FACTOR if nightly() else usual
