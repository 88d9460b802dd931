import os
import sys

sys.path.insert(0, os.path.dirname(__file__))

import pytest
from hypothesis import HealthCheck, settings

# No test depends on the speed of the machine: hypothesis neither fails an
# example that runs slowly (deadline) nor a strategy that generates slowly
# (too_slow) on a busy or slow machine.  Tests may still tighten their own settings.
ANY_MACHINE = {"deadline": None, "suppress_health_check": [HealthCheck.too_slow]}
settings.register_profile("any-machine", **ANY_MACHINE)
# In CI the property tests run the same examples every time (a failure there is
# reproducible); locally hypothesis explores new examples on every run.  The
# "nightly" profile (ILKIT_HYPOTHESIS_PROFILE=nightly) runs many more examples
# of the property tests that ask for them (tests/profiles.py), with new ones
# every run.
settings.register_profile("ci", derandomize=True, database=None, print_blob=True, **ANY_MACHINE)
settings.register_profile("nightly", print_blob=True, max_examples=2000, **ANY_MACHINE)
_profile = os.environ.get("ILKIT_HYPOTHESIS_PROFILE") or ("ci" if os.environ.get("CI") else "any-machine")
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


# ilkit as a user installs it (tests/installed.py): built once per session, shared by
# tests/test_install.py and the offline-page browser test.
@pytest.fixture(scope="session")
def built_dist(tmp_path_factory):
    """The sdist and the wheel of the checkout (``python -m build``)."""
    import installed

    return installed.build(tmp_path_factory.mktemp("dist"))


@pytest.fixture(scope="session")
def clean_install(built_dist, tmp_path_factory):
    """A clean virtual environment with the wheel and its notebook extra, nothing else."""
    import installed

    return installed.install(*built_dist, tmp_path_factory.mktemp("clean"))


@pytest.fixture(scope="session")
def installed_demo(clean_install):
    """``python -m ilkit.demo`` run in the clean environment on the shipped notebooks: (output folder, run)."""
    import installed

    out = clean_install.workdir / "demo"
    done = clean_install.run("-m", "ilkit.demo", "--out", out, "--notebooks", installed.ROOT / "notebooks",
                             timeout=1800)
    return out, done
