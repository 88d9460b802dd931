import os
import sys

sys.path.insert(0, os.path.dirname(__file__))

from hypothesis import settings

# In CI the property tests run the same examples every time (a failure there is
# reproducible); locally hypothesis explores new examples on every run.
settings.register_profile("ci", derandomize=True, database=None, print_blob=True)
if os.environ.get("CI"):
    settings.load_profile("ci")

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
