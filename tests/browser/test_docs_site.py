"""The documentation site (``make docs``, out/docs/) opened offline in Chromium.

Every request that is not a file of the site (or ``data:``/``about:``) is blocked and recorded:
the site must need nothing from the network.  Checks: the mathematics is typeset (no raw TeX
visible), the gallery's figures load, the verification manual lists every reference test with
its source and a pass, and every public name has its API page.
"""

from __future__ import annotations

import importlib
import os
import re
import subprocess
import sys
from pathlib import Path

import pytest

from .servers import ROOT

SITE = ROOT / "out" / "docs"
RAW_TEX = re.compile(r"\\frac|\\begin\{|\$\$|\\\[|\\\(|\\displaystyle|\\text\{")


@pytest.fixture(scope="module")
def site() -> Path:
    if not (SITE / "index.html").exists():
        message = f"no documentation site at {SITE}: build it with `make docs`"
        if os.environ.get("ILKIT_REQUIRE_BROWSER"):
            pytest.fail(message)
        pytest.skip(message)
    return SITE


@pytest.fixture
def offline(page):
    """The page with every request outside the site blocked; yields the list of blocked URLs."""
    blocked: list[str] = []

    def route(request_route):
        url = request_route.request.url
        if url.startswith(("file://", "data:", "about:")) or url.startswith("http://127.0.0.1"):
            request_route.continue_()
        else:
            blocked.append(url)
            request_route.abort()

    page.context.route("**/*", route)
    errors: list[str] = []
    page.on("pageerror", lambda err: errors.append(str(err)))
    yield page, blocked, errors


def _open(page, path: Path) -> None:
    page.goto(path.as_uri())
    page.wait_for_load_state("load")


def _typeset(page) -> None:
    """Wait until MathJax (3) has typeset the page: its start-up promise has settled."""
    page.wait_for_function("window.MathJax !== undefined && MathJax.startup !== undefined "
                           "&& MathJax.startup.promise !== undefined", timeout=30_000)
    page.evaluate("() => MathJax.startup.promise.then(() => true)")


# the text a reader sees as prose and formulas: code blocks and printed outputs (which may show LaTeX
# source on purpose, e.g. views.to_latex) and the TeX kept by MathJax or MathML for copying left out
_PROSE = """() => {
    const article = document.querySelector("article").cloneNode(true);
    article.querySelectorAll("pre, code, script, annotation, mjx-assistive-mml").forEach(e => e.remove());
    return article.textContent;
}"""


def _pages_with_math(site: Path) -> list[Path]:
    found = []
    for path in sorted(site.rglob("*.html")):
        if "_static" in path.parts or "sheets" in path.parts:
            continue
        if 'class="math' in path.read_text(encoding="utf-8"):
            found.append(path)
    return found


def test_mathematics_is_typeset_on_every_page_with_math(site, offline, artifacts):
    page, blocked, errors = offline
    pages = _pages_with_math(site)
    names = {p.relative_to(site).as_posix() for p in pages}
    assert {"theory/muller-breslau.html", "theory/stiffness-and-force.html", "getting-started.html"} <= names
    for path in pages:
        _open(page, path)
        _typeset(page)
        raw = RAW_TEX.findall(page.evaluate(_PROSE))
        assert not raw, f"{path.name}: raw TeX visible: {raw[:5]}"
        # every element Sphinx or myst marked as math holds a typeset formula (an SVG), none an error
        marked = page.locator("article .math")
        typeset = page.locator("article .math:has(mjx-container svg)")
        assert marked.count() > 0 and typeset.count() == marked.count(), (
            f"{path.name}: {marked.count()} formulas, {typeset.count()} typeset")
        assert page.locator("mjx-merror, merror").count() == 0, path.name
        width = page.locator("mjx-container").first.evaluate("e => e.getBoundingClientRect().width")
        assert width > 5, path.name
    _open(page, site / "theory" / "stiffness-and-force.html")
    _typeset(page)
    page.locator("mjx-container[display='true']").nth(2).scroll_into_view_if_needed()
    page.screenshot(path=str(artifacts / "docs-theory-math.png"))
    assert blocked == [] and errors == []


def test_gallery_notebooks_and_figures_load(site, offline, artifacts):
    page, blocked, errors = offline
    gallery = sorted((site / "generated" / "gallery").glob("*.html"))
    notebooks = sorted(p.stem for p in (ROOT / "notebooks").glob("*.ipynb"))
    assert [p.stem for p in gallery] == notebooks
    for path in gallery:
        _open(page, path)
        images = page.locator("article img")
        assert images.count() >= 1, f"{path.name}: no figure"
        sizes = images.evaluate_all("imgs => imgs.map(i => [i.complete, i.naturalWidth, i.getAttribute('src')])")
        broken = [src[:80] for complete, width, src in sizes if not (complete and width > 0)]
        assert not broken, f"{path.name}: figures that do not load: {broken}"
        assert page.locator(".cell_output .traceback, .output.traceback").count() == 0, path.name
    _open(page, site / "generated" / "gallery" / "moving_loads.html")
    page.locator("article img").nth(1).scroll_into_view_if_needed()
    page.screenshot(path=str(artifacts / "docs-gallery.png"))
    assert blocked == [] and errors == []


def _reference_tests() -> list[str]:
    """Node ids of every reference test, collected by pytest itself."""
    run = subprocess.run(
        [sys.executable, "-m", "pytest", "--collect-only", "-q", "-m", "reference", "-p", "no:cacheprovider",
         "tests"],
        cwd=ROOT, capture_output=True, text=True, check=False,
    )
    ids = [line.strip() for line in run.stdout.splitlines() if "::" in line]
    assert ids, run.stdout + run.stderr
    return ids


def test_verification_manual_lists_every_reference_test_with_a_source(site, offline, artifacts):
    from docutils.nodes import make_id

    page, blocked, errors = offline
    _open(page, site / "verification.html")
    summary = page.locator(".verification-summary").inner_text()
    assert "all passed" in summary, summary
    for nodeid in _reference_tests():
        row = page.locator(f"tr#{make_id('row ' + nodeid)}")
        assert row.count() == 1, f"{nodeid} is not in the verification manual"
        cells = row.locator("td")
        source = cells.nth(2).inner_text().strip()
        assert source, f"{nodeid}: no source"
        assert cells.nth(6).inner_text().strip() == "pass", f"{nodeid}: not passed"
    assert page.locator("td.result-fail").count() == 0
    page.screenshot(path=str(artifacts / "docs-verification.png"))
    assert blocked == [] and errors == []


def test_every_public_name_has_its_api_page(site):
    html = "".join(p.read_text(encoding="utf-8") for p in (site / "generated" / "api").glob("*.html"))
    for package in ("ilkit", "ilkit.loads", "ilkit.design", "ilkit.rating", "ilkit.views"):
        module = importlib.import_module(package)
        for name in module.__all__:
            obj = getattr(module, name)
            anchors = {f'id="{package}.{name}"', f'id="{getattr(obj, "__name__", "")}"',
                       f'id="ilkit.loads.{name}"', f'id="ilkit.design.{name}"', f'id="ilkit.rating.{name}"',
                       f'id="ilkit.views.{name}"',
                       f'id="module-{package}.{name}"'}
            assert any(a in html for a in anchors), f"{package}.{name} has no API entry"


def test_load_model_pages_and_readme_link(site):
    from ilkit import LoadInputError, loads
    from ilkit.loads.combination import LoadModel

    models = [n for n in loads.__all__ if callable(getattr(loads, n))]
    pages = {p.stem for p in (site / "generated" / "load-models").glob("*.html")}
    for name in models:
        try:
            made = getattr(loads, name)()
        except TypeError:
            continue
        except LoadInputError as err:  # a rail model needs its dynamic factor or impact, given explicitly
            made = getattr(loads, name)(**{err.field: 1.0 if err.field == "dynamic_factor" else 0})
        if isinstance(made, LoadModel):
            assert name.replace("_", "-") in pages, f"no page for the load model {name}"
    readme = (ROOT / "README.md").read_text(encoding="utf-8")
    assert "out/docs/index.html" in readme and "make docs" in readme
