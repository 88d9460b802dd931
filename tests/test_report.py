"""Calculation sheets: contents, files, errors, and a real browser opening the HTML."""

from __future__ import annotations

import os
import re
import shutil
from fractions import Fraction
from html.parser import HTMLParser
from pathlib import Path

import pytest

import ilkit
from ilkit.views import derivation, write_calculation_sheet
from ilkit.views.demo import demo_lines, suspended_span_girder, write_demo_sheet
from ilkit.views.plot import short
from ilkit.views.report import CAUTION, default_lines, report_section


@pytest.fixture(scope="module")
def demo_sheet(tmp_path_factory: pytest.TempPathFactory):
    return write_demo_sheet(tmp_path_factory.mktemp("sheet"))


class _Tags(HTMLParser):
    VOID = frozenset({"meta", "img", "br", "hr", "link", "input"})

    def __init__(self) -> None:
        super().__init__()
        self.stack: list[str] = []
        self.errors: list[str] = []

    def handle_starttag(self, tag: str, attrs: list) -> None:
        if tag not in self.VOID:
            self.stack.append(tag)

    def handle_endtag(self, tag: str) -> None:
        if not self.stack or self.stack[-1] != tag:
            self.errors.append(f"</{tag}> closes {self.stack[-1:] or 'nothing'}")
        else:
            self.stack.pop()


def test_sheet_files_and_balanced_html(demo_sheet) -> None:
    assert demo_sheet.html.name == "girder.html" and demo_sheet.markdown.name == "girder.md"
    page = demo_sheet.html.read_text(encoding="utf-8")
    parser = _Tags()
    parser.feed(page)
    assert parser.errors == [] and parser.stack == []
    assert "http://" not in page.replace("http://www.w3.org", "") and "<script" not in page  # self-contained


def test_sheet_carries_the_caution_inputs_lines_and_derivations(demo_sheet) -> None:
    beam = suspended_span_girder()
    page = demo_sheet.html.read_text(encoding="utf-8")
    markdown = demo_sheet.markdown.read_text(encoding="utf-8")
    for text in (page, markdown):
        assert text.count(CAUTION) == 2  # at the start and at the end
        assert "qualified engineer" in CAUTION and "governing design codes" in CAUTION
        assert "degree of indeterminacy" in text and "24 m (0 to 24), 26 m (24 to 50)" in text
    for i, line in enumerate(demo_lines(beam), start=1):
        d = derivation(line)
        assert f"2.{i} {d.title}" in markdown
        # the derivation's final expression is in the Markdown, as LaTeX
        cases = d.to_markdown().split("$$")[-2].strip()
        assert cases in markdown
        # the ordinate table holds the core values
        for x, left, right in line.knot_values():
            assert f"| {short(x)} | {short(left)} | {short(right)} |" in markdown
    assert page.count("<math") > 50 and "<mtable" in page


def test_markdown_figures_are_files_beside_it(demo_sheet) -> None:
    markdown = demo_sheet.markdown.read_text(encoding="utf-8")
    links = re.findall(r"!\[[^\]]*\]\(([^)]+)\)", markdown)
    assert len(links) == 1 + len(demo_lines(suspended_span_girder()))
    for link in links:
        target = demo_sheet.markdown.parent / link
        assert target.is_file() and target.read_text(encoding="utf-8").lstrip().startswith("<?xml")


def test_paths_suffixes_and_default_lines(tmp_path: Path) -> None:
    beam = ilkit.Beam(20, {0: "fixed", 12: "roller"}, hinges=[8], units="kip-ft")
    lines = default_lines(beam)
    assert [line.quantity.label for line in lines] == ["R at x=0", "R at x=12", "M_R at x=0", "M at x=6"]
    for given in ("a/sheet", "a/sheet.html", "a/sheet.md"):
        out = write_calculation_sheet(beam, tmp_path / given, lines=lines[:1])
        assert out.html == tmp_path / "a" / "sheet.html" and out.markdown.exists()
    with pytest.raises(ilkit.BeamInputError, match=r"ends in '\.pdf'.*'\.html' or '\.md'"):
        write_calculation_sheet(beam, tmp_path / "sheet.pdf")


def test_results_and_lines_the_sheet_cannot_explain_are_errors(tmp_path: Path) -> None:
    beam = suspended_span_girder()
    with pytest.raises(ilkit.UnsupportedResultError, match="no sheet section for object"):
        write_calculation_sheet(beam, tmp_path / "s", lines=[], results=[object()])
    from ilkit.influence import InfluenceLine
    from ilkit.quantity import Quantity

    numeric = InfluenceLine(quantity=Quantity("moment", Fraction(5)), knots=(0.0, 10.0), coefficients=((0.0, 1.0),))
    with pytest.raises(ilkit.NoDerivationError):
        write_calculation_sheet(beam, tmp_path / "s", lines=[numeric])
    with pytest.raises(ilkit.UnsupportedResultError):
        report_section(3.5, "3.1")


# ------------------------------------------------------------------ real browser
CHROMIUM = "/usr/bin/chromium"
ARGS = ["--headless", "--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run",
        "--disable-background-networking", "--disable-component-update", "--disable-sync", "--disable-dev-shm-usage"]


def _browser_or_skip() -> str:
    """Chromium's path; skip without it unless ILKIT_REQUIRE_BROWSER is set (then fail)."""
    path = CHROMIUM if os.path.exists(CHROMIUM) else shutil.which("chromium")
    missing = []
    if path is None:
        missing.append("Chromium (apt-get install chromium)")
    try:
        import playwright.sync_api  # noqa: F401
    except ImportError:
        missing.append("the playwright package (pip install playwright)")
    if missing:
        if os.environ.get("ILKIT_REQUIRE_BROWSER"):
            pytest.fail(f"ILKIT_REQUIRE_BROWSER is set but {' and '.join(missing)} is missing")
        pytest.skip(f"{' and '.join(missing)} not available")
    assert path is not None
    return path


@pytest.mark.browser
def test_browser_opens_the_sheet_and_renders_figures_and_formulas(demo_sheet) -> None:
    executable = _browser_or_skip()
    from playwright.sync_api import sync_playwright

    requests: list[str] = []
    errors: list[str] = []
    with sync_playwright() as pw:
        browser = pw.chromium.launch(executable_path=executable, args=ARGS)
        try:
            page = browser.new_page(viewport={"width": 1100, "height": 900})
            page.on("request", lambda r: requests.append(r.url))
            page.on("console", lambda m: errors.append(m.text) if m.type == "error" else None)
            page.on("pageerror", lambda e: errors.append(str(e)))
            page.goto(demo_sheet.html.as_uri())
            page.wait_for_load_state("load")
            assert page.title() == "Suspended-span girder: influence lines"
            assert page.locator("h1").inner_text() == "Suspended-span girder: influence lines"
            assert page.locator("aside.caution").count() == 2
            assert page.locator("aside.caution").first.is_visible()
            n_lines = len(demo_lines(suspended_span_girder()))
            assert page.locator("h3").count() == n_lines
            # every figure decoded and drawn at a real size
            sizes = page.eval_on_selector_all(
                "figure img", "imgs => imgs.map(i => [i.complete, i.naturalWidth, i.getBoundingClientRect().height])"
            )
            assert len(sizes) == 1 + n_lines
            assert all(done and width > 0 and height > 50 for done, width, height in sizes)
            # formulas are laid out as MathML (a fraction is taller than a line of text)
            frac_heights = page.eval_on_selector_all("mfrac", "fs => fs.map(f => f.getBoundingClientRect().height)")
            assert frac_heights and max(frac_heights) > 15
            cases = page.locator("mtable.cases").first.bounding_box()
            assert cases is not None and cases["height"] > 60
            # the printed ordinates match the core (largest ordinate of the pier reaction: 5/4 at the hinge)
            assert "1.25 kN/kN at x = 30 m" in page.locator("main").inner_text()
        finally:
            browser.close()
    assert errors == []
    assert all(url.startswith(("file:", "data:")) for url in requests), requests
