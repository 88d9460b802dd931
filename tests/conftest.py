import os
import sys

sys.path.insert(0, os.path.dirname(__file__))

from hypothesis import settings

# In CI the property tests run the same examples every time (a failure there is
# reproducible); locally hypothesis explores new examples on every run.
settings.register_profile("ci", derandomize=True, database=None, print_blob=True)
if os.environ.get("CI"):
    settings.load_profile("ci")
