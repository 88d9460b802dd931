"""The calculation sheet opens in a real browser, and rich displays render in JupyterLab."""

from __future__ import annotations

import pytest

from ilkit.views.demo import (
    demo_lines,
    highway_girder,
    highway_lines,
    suspended_span_girder,
    write_demo_sheet,
    write_highway_sheet,
)

from .servers import copy_notebooks, jupyter_lab, run_all_cells


@pytest.fixture(scope="module")
def sheet(tmp_path_factory):
    return write_demo_sheet(tmp_path_factory.mktemp("sheet"))


def open_sheet(page, path) -> tuple[list[str], list[str]]:
    """Open a sheet; returns the lists that collect its requests and its console and page errors."""
    requests: list[str] = []
    errors: list[str] = []
    page.on("request", lambda r: requests.append(r.url))
    page.on("console", lambda m: errors.append(m.text) if m.type == "error" else None)
    page.on("pageerror", lambda e: errors.append(str(e)))
    page.goto(path.as_uri())
    page.wait_for_load_state("load")
    return requests, errors


def drawn_figures(page) -> list[tuple[bool, int, float]]:
    """Every figure of the page: decoded, its natural width, its height on the page."""
    return page.eval_on_selector_all(
        "figure img", "imgs => imgs.map(i => [i.complete, i.naturalWidth, i.getBoundingClientRect().height])"
    )


def test_calculation_sheet_renders_figures_and_formulas(page, sheet, artifacts):
    requests, errors = open_sheet(page, sheet.html)
    title = "Three-span girder with a suspended span: influence lines"
    assert page.title() == title and page.locator("h1").inner_text() == title
    assert page.locator("aside.caution").count() == 2
    assert page.locator("aside.caution").first.is_visible()
    n_lines = len(demo_lines(suspended_span_girder()))
    assert page.locator("h3").count() == n_lines
    # every figure decoded and drawn at a real size
    sizes = drawn_figures(page)
    assert len(sizes) == 1 + n_lines
    assert all(done and width > 0 and height > 50 for done, width, height in sizes)
    # formulas are laid out as MathML: a fraction is taller than a line of text, the cases span rows
    heights = page.eval_on_selector_all("mfrac", "fs => fs.map(f => f.getBoundingClientRect().height)")
    assert heights and max(heights) > 15
    cases = page.locator("mtable.cases").first.bounding_box()
    assert cases is not None and cases["height"] > 60
    # the printed ordinates are the core's: the anchor part turns about x=0 when the pier at 32 rises
    # by 1, so the pier reaction's largest ordinate is 41/32 = 1.28125, at the hinge
    assert "1.281 kN/kN at x = 41 m" in page.locator("main").inner_text()
    page.locator("mtable.cases").first.scroll_into_view_if_needed()
    page.screenshot(path=str(artifacts / "calculation-sheet.png"))
    assert errors == []
    assert all(url.startswith(("file:", "data:")) for url in requests), requests  # self-contained


@pytest.fixture(scope="module")
def highway_sheet(tmp_path_factory):
    return write_highway_sheet(tmp_path_factory.mktemp("highway"))


def test_sheet_with_a_load_model_renders(page, highway_sheet, artifacts):
    requests, errors = open_sheet(page, highway_sheet.html)
    assert page.locator("h1").inner_text() == "Three-span continuous highway girder under HL-93"
    assert page.locator("aside.caution").count() == 2
    chapters = page.locator("h2").all_inner_texts()
    assert chapters == ["1. Inputs", "2. Load model", "3. Influence lines", "4. Governing placements",
                        "5. Envelope", "6. Method and sources"]
    # every figure decoded and drawn at a real size: beam, sketches, two placements per line, envelopes
    n = len(highway_lines(highway_girder()))
    sizes = drawn_figures(page)
    assert len(sizes) == 1 + n + 2 * n + 3 + 1
    assert all(done and width > 0 and height > 50 for done, width, height in sizes)
    # the load model's source and the values recalled from memory are on the page
    text = page.locator("main").inner_text()
    assert "AASHTO LRFD Bridge Design Specifications" in text and "recalled from memory" in text
    # the pier moment under the two-truck rule, as the README quotes it
    assert "Smallest bending moment M at x = 90 ft: -2218.3 kip·ft" in text
    page.locator("h3", has_text="4.2b").scroll_into_view_if_needed()
    page.screenshot(path=str(artifacts / "calculation-sheet-loads.png"))
    assert errors == []
    assert all(url.startswith(("file:", "data:")) for url in requests), requests  # self-contained


def test_rich_displays_render_in_jupyterlab(page, tmp_path, artifacts):
    folder = copy_notebooks(tmp_path, ["calculation_record.ipynb"])
    with jupyter_lab(tmp_path, folder) as (base, token):
        run_all_cells(page, base, token, "calculation_record.ipynb")
        # the beam's rich display: its diagram (an SVG image) and the summary table
        first = page.locator(".jp-OutputArea-output").first
        first.scroll_into_view_if_needed()
        image = first.locator("img[alt='beam diagram']")
        assert image.count() == 1 and image.evaluate("i => i.complete && i.naturalWidth > 0")
        assert "degree of indeterminacy" in first.text_content()
        # the derivation renders as Markdown with typeset mathematics
        derivation = page.locator(".jp-OutputArea-output.jp-RenderedMarkdown", has_text="Müller-Breslau principle")
        assert derivation.count() == 1
        derivation.scroll_into_view_if_needed()
        assert derivation.locator("mjx-container, .MathJax").count() > 10
        assert "Ordinates at the breakpoints" in derivation.text_content()
        page.screenshot(path=str(artifacts / "lab-calculation-record.png"), full_page=False)


def test_printed_sheet_has_its_title_block_and_page_numbers(page, sheet, artifacts):
    # regression: the sheet had no title block and its printed pages no numbers
    import io
    import unicodedata

    from pypdf import PdfReader

    open_sheet(page, sheet.html)
    block = page.locator("table.title-block")
    assert block.count() == 1 and block.is_visible()
    cells = block.locator("td").all_inner_texts()
    for label in ("project", "structure", "girder", "prepared by", "checked by", "date", "revision"):
        assert label.upper() in cells or label in cells
    assert "ilkit demo study (invented data)" in cells and "2025-01-15" in cells
    pdf = page.pdf(format="A4", print_background=True)
    (artifacts / "calculation-sheet.pdf").write_bytes(pdf)
    pages = PdfReader(io.BytesIO(pdf)).pages
    assert len(pages) > 3
    for number, printed in enumerate(pages, start=1):
        text = " ".join(unicodedata.normalize("NFKC", printed.extract_text()).split())  # ligatures as letters
        assert f"page {number} of {len(pages)}" in text, (number, text[-200:])
        assert "Three-span girder with a suspended span: influence lines" in text
        assert "revision A" in text
