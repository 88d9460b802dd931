"""The README's Python examples run as written, and print what their comments say."""

from __future__ import annotations

import re
from pathlib import Path

import pytest

README = Path(__file__).resolve().parents[1] / "README.md"


def blocks() -> list[str]:
    return re.findall(r"```python\n(.*?)```", README.read_text(encoding="utf-8"), flags=re.S)


def test_readme_examples_run(tmp_path, monkeypatch):
    pytest.importorskip("matplotlib")
    import matplotlib

    matplotlib.use("Agg")
    monkeypatch.chdir(tmp_path)
    namespace: dict = {}
    found = blocks()
    assert len(found) >= 4
    for code in found:
        exec(compile(code, str(README), "exec"), namespace)
    # the numbers quoted in the comments, derived by hand: the anchor part (pin at 0, pier at 32) carries
    # the hinge at 41, so the pier reaction is x/32 on it (41/32 under the hinge); the suspended span is a
    # simple span of 26 m between the hinges, so its midspan moment peaks at 26/4 = 6.5 m
    assert namespace["beam"].is_determinate and namespace["beam"].degree == 0
    r, m = namespace["r"], namespace["m"]
    assert r(41.0) == 1.28125 and list(r([0, 16, 108])) == [0, 0.5, 0]
    assert (m.maximum.value, m.maximum.x) == (6.5, 54)
    if "best" in namespace:
        assert round(namespace["best"].value, 1) == -2218.3
    if "explorer" in namespace:
        import ilkit

        explorer = namespace["explorer"]
        girder, vehicle = namespace["girder"], namespace["vehicle"]
        assert explorer.value == pytest.approx(ilkit.stand(girder.moment(28), vehicle, 45.0).effect)
        explorer.close()


def test_quick_start_girder_is_the_girder_of_the_notebooks():
    """Regression: the first example was a stock short beam (fixed end, hinge, roller, overhang, round
    numbers) unrelated to the studies; it is now the suspended-span girder the notebooks study."""
    from ilkit.views.demo import suspended_span_girder

    namespace: dict = {}
    exec(compile(blocks()[0], str(README), "exec"), namespace)
    assert namespace["beam"] == suspended_span_girder()
    notebook = (README.parent / "tools" / "nb_hinged_girder.py").read_text(encoding="utf-8")
    assert 'supports={0: "pin", 32: "roller", 76: "roller", 108: "roller"}' in notebook
    assert "hinges=[41, 67]" in notebook
