import os
import sys

sys.path.insert(0, os.path.dirname(__file__))

from hypothesis import settings

# In CI the property tests run the same examples every time (a failure there is
# reproducible); locally hypothesis explores new examples on every run.  The
# "nightly" profile (ILKIT_HYPOTHESIS_PROFILE=nightly) runs many more examples
# of the property tests that ask for them (tests/profiles.py), with new ones
# every run.
settings.register_profile("ci", derandomize=True, database=None, print_blob=True)
settings.register_profile("nightly", deadline=None, print_blob=True, max_examples=2000)
_profile = os.environ.get("ILKIT_HYPOTHESIS_PROFILE") or ("ci" if os.environ.get("CI") else None)
if _profile:
    settings.load_profile(_profile)

# The verification record: the ``reference`` fixture of reference tests and the hooks that write
# ``--verification-json`` (the documentation's verification manual), in tests/_verification.py.
from _verification import (  # noqa: E402, F401
    pytest_addoption,
    pytest_collection_modifyitems,
    pytest_configure,
    pytest_runtest_makereport,
    pytest_sessionfinish,
    reference,
)
