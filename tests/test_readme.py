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
    if "dead" in namespace:
        # the pier moment of the deck slab and barriers (1.45 kip/ft on three spans of 90, 115 and 90 ft):
        # by the three-moment equation, 2·M·(90 + 115) + M·115 = -w(90³ + 115³)/4 with equal pier moments
        # M by symmetry, so M = -w(90³ + 115³)/(4·525)
        w = 1.45
        assert namespace["dead"].value("moment", 90, category="DC") == pytest.approx(
            -w * (90**3 + 115**3) / (4 * 525), rel=1e-9)
        assert round(namespace["dead"].value("moment", 90, category="DC"), 1) == -1553.5
        assert namespace["check"].passes
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


def section(title: str) -> str:
    text = README.read_text(encoding="utf-8")
    start = text.index(f"\n## {title}\n")
    end = text.find("\n## ", start + 1)
    return text[start:end if end > 0 else None]


def test_readme_says_what_first_use_needs_and_how_to_install_each_extra():
    """Regression: the README did not say that the two commands need the package index, how long they take
    or how big the environment is, nor how to install ilkit elsewhere with only the extras needed."""
    import sys

    if sys.version_info >= (3, 11):
        import tomllib
    else:  # pragma: no cover - Python 3.10
        tomllib = pytest.importorskip("tomli")
    first_use = section("Two commands")
    assert "package index (PyPI)" in first_use
    assert re.search(r"\d+(\.\d+)?\s+GB\s+on\s+disk", first_use) and re.search(r"\d+\s+MB", first_use)
    assert re.search(r"about\s+\d+\s+minutes?", first_use) and re.search(r"about\s+\d+\s+packages", first_use)
    install = section("Installing ilkit in your own environment")
    extras = tomllib.loads((README.parent / "pyproject.toml").read_text(encoding="utf-8"))["project"][
        "optional-dependencies"]
    for extra in set(extras) - {"test"}:
        assert f'pip install -e ".[{extra}]"' in install, extra
    assert "pip install -e ." in install and ".whl[notebook]" in install


def test_readme_lists_the_versions_the_suite_was_run_with():
    tested = section("Tested with")
    for name in ("Python", "numpy", "sympy", "pandas", "matplotlib", "jupyterlab", "ipywidgets", "nbval",
                 "pytest", "Chromium"):
        assert re.search(rf"\b{name} \d+\.\d+", tested), name
