import os
import sys

sys.path.insert(0, os.path.dirname(__file__))

from hypothesis import HealthCheck, settings

# No test depends on the speed of the machine: hypothesis neither fails an
# example that runs slowly (deadline) nor a strategy that generates slowly
# (too_slow) on a busy or slow machine.  Tests may still tighten their own settings.
ANY_MACHINE = {"deadline": None, "suppress_health_check": [HealthCheck.too_slow]}
settings.register_profile("any-machine", **ANY_MACHINE)
# In CI the property tests run the same examples every time (a failure there is
# reproducible); locally hypothesis explores new examples on every run.
settings.register_profile("ci", derandomize=True, database=None, print_blob=True, **ANY_MACHINE)
settings.load_profile("ci" if os.environ.get("CI") else "any-machine")
