"""Every page `make demo` writes renders fully offline.

Regression: the executed notebooks' pages loaded MathJax and require.js from a
CDN; read offline (an archived calculation package), the derivations showed raw
TeX such as ``$\\frac{…}$``.  The demo here is the one a user gets: run from the
built wheel in a clean environment (fixture ``installed_demo``), then every
page is opened from disk with every request that leaves the machine aborted.
"""

from __future__ import annotations

import re
from pathlib import Path

import pytest

RAW_TEX = re.compile(r"\\(?:frac|begin|end|left|right|cdot|eta|delta|text)\b|\$\$|\$\\")
# the page's prose: what is left when code, printed output (a LaTeX table printed as text) and typeset
# formulas are taken out
PROSE = """() => {
  const body = document.body.cloneNode(true);
  body.querySelectorAll('pre, code, script, style, mjx-container, math').forEach(e => e.remove());
  return body.textContent;
}"""
MATH_PAGES = {"calculation_record.html", "continuous_girder.html"}  # pages with derivations


def local(url: str) -> bool:
    on_disk = url.startswith(("file:", "data:", "blob:", "about:"))
    return on_disk or re.match(r"https?://(127\.0\.0\.1|localhost)[:/]", url) is not None


@pytest.fixture
def offline_page(browser):
    """A page whose requests off this machine are aborted (and listed), with its errors collected."""
    context = browser.new_context(viewport={"width": 1280, "height": 900})
    blocked: list[str] = []

    def route(r):
        if local(r.request.url):
            r.continue_()
        else:
            blocked.append(r.request.url)
            r.abort()

    context.route("**/*", route)
    page = context.new_page()
    errors: list[str] = []
    page.on("pageerror", lambda e: errors.append(str(e)))
    page.on("console", lambda m: errors.append(m.text) if m.type == "error" else None)
    yield page, blocked, errors
    context.close()


@pytest.mark.slow
def test_every_demo_page_renders_offline(offline_page, installed_demo, artifacts) -> None:
    page, blocked, errors = offline_page
    out, _ = installed_demo
    pages = sorted(out.glob("*.html"))
    names = {p.name for p in pages}
    notebooks = {f"{p.stem}.html" for p in (Path(__file__).resolve().parents[2] / "notebooks").glob("*.ipynb")}
    assert notebooks | {"index.html", "girder.html", "highway_girder.html", "composite_girder.html",
                        "rating_sheet.html"} <= names
    for name in notebooks:  # each notebook's page is the notebook, not a sheet written over it
        assert "jp-Notebook" in (out / name).read_text(encoding="utf-8"), name
    assert MATH_PAGES <= names
    for path in pages:
        page.goto(path.as_uri())
        page.wait_for_load_state("load")
        if path.name in MATH_PAGES:
            # MathJax typesets from beside the page: wait for it, then count what it drew
            page.wait_for_function("() => window.MathJax && window.MathJax.startup && window.MathJax.startup.promise",
                                   timeout=30_000)
            page.evaluate("() => window.MathJax.startup.promise")
            assert page.locator("mjx-container svg").count() > 20, path.name
            # and only formulas: no prompt, printed output or ilkit table read as TeX
            stray = ".jp-InputPrompt mjx-container, .jp-OutputPrompt mjx-container, pre mjx-container, " \
                    ".ilkit-view mjx-container"
            assert page.locator(stray).count() == 0, path.name
        text = page.evaluate(PROSE)
        assert not RAW_TEX.search(text), f"{path.name} shows raw TeX: {RAW_TEX.search(text).group(0)!r}"
        images = page.eval_on_selector_all("img", "imgs => imgs.map(i => [i.complete, i.naturalWidth, i.alt])")
        assert all(done and width > 0 for done, width, _ in images), (path.name, images)
        links = page.eval_on_selector_all("a[href]", "links => links.map(a => a.getAttribute('href'))")
        for href in links:
            if not href.startswith(("#", "http", "mailto:")):
                assert (path.parent / href.split("#")[0]).exists(), (path.name, href)
        if path.name == "calculation_record.html":
            page.locator("mjx-container").nth(10).scroll_into_view_if_needed()
            page.screenshot(path=str(artifacts / "offline-derivation.png"))
    assert blocked == [], f"requests that left the machine: {blocked}"
    assert errors == []
