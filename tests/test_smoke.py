"""Smoke test: the public names exist and the core imports without the extras."""

import subprocess
import sys

import ilkit


def test_public_names():
    for name in ilkit.__all__:
        assert getattr(ilkit, name) is not None


def test_core_imports_without_plotting_or_widgets():
    code = (
        "import sys, ilkit; b = ilkit.Beam(10, {0: 'pin', 10: 'roller'}); b.moment(5)(2.0);"
        "bad = [m for m in ('matplotlib', 'ipywidgets', 'pandas', 'sympy') if m in sys.modules];"
        "print(bad)"
    )
    out = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True, check=True)
    assert out.stdout.strip() == "[]"
