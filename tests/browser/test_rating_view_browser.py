"""The rating view of notebooks/load_rating.ipynb in a real browser (JupyterLab, Playwright).

The notebook leaves the NRL at its worst placement for the moment at x = 28 ft.  The test moves it three
slider steps with the keyboard and checks that the RF at the section changes to the value the core gives
for the same girder, vehicle and position; then it picks another vehicle and checks the rated RF.  A
screenshot is saved under ``tests/artifacts/``.
"""

from __future__ import annotations

import time

import pytest

from .servers import copy_notebooks, jupyter_lab, run_all_cells

NOTEBOOK = "load_rating.ipynb"


def _wait_for(read, want: float, timeout: float = 30.0) -> float:
    deadline = time.monotonic() + timeout
    got = None
    while time.monotonic() < deadline:
        try:
            got = float(read())
        except (TypeError, ValueError):
            got = None
        if got is not None and got == pytest.approx(want, rel=1e-9):
            return got
        time.sleep(0.1)
    raise AssertionError(f"the page shows {got}, the core gives {want}")


def test_notebook_rates_the_demo_girder():
    """The notebook's girder, loads and resistances are those of ilkit.views.demo (the demo's sheet)."""
    import nbformat

    from .servers import ROOT

    cells = nbformat.read(ROOT / "notebooks" / NOTEBOOK, as_version=4).cells
    source = "\n".join(c.source for c in cells if c.cell_type == "code")
    for text in ('{0: "pin", 70: "roller", 160: "roller", 230: "roller"}', "EI=[(0, 70, 3.4e6), (70, 230, 4.0e6)]",
                 'positive_moment=[(0, 70, 1800), (70, 230, 2900)]', "negative_moment=2700",
                 "shear=[(0, 8, 300), (8, 230, 420)]", '"load": [14, 36, 36, 34, 34, 34]',
                 '"spacing": [None, 13, 4.5, 26, 4.5, 4.5]', 'condition="fair"', "adtt=1200",
                 'design.DistributedLoad("steel, slab and haunch", "DC", 1.05)',
                 "positive_moment=[(0, 70, 1450), (70, 230, 2300)]", "negative_moment=2150", "service=service"):
        assert text in source, text


def test_rating_view_in_jupyterlab(page, tmp_path, artifacts):
    from ilkit import views
    from ilkit.views.demo import corroded_girder_rating

    rated = corroded_girder_rating()
    expected = views.RatingView(rated, vehicle="NRL", quantity="moment", at=28, backend="inline")
    start_front = expected.front
    expected.slider.value = expected.slider.value + 3
    moved = expected.standing.rf

    folder = copy_notebooks(tmp_path, [NOTEBOOK])
    with jupyter_lab(tmp_path, folder) as (base, token):
        run_all_cells(page, base, token, NOTEBOOK)
        view = page.locator(".ilkit-rating-view").first
        view.wait_for(timeout=90_000)
        view.scroll_into_view_if_needed()
        readout = view.locator(".ilkit-rating-readout div[data-rf]")
        _wait_for(lambda: readout.get_attribute("data-front"), start_front)
        _wait_for(lambda: readout.get_attribute("data-rf"), expected.rated)

        handle = view.locator(".ilkit-rating-slider .noUi-handle")
        handle.focus()
        for _ in range(3):
            handle.press("ArrowRight")
        _wait_for(lambda: readout.get_attribute("data-front"), expected.front)
        _wait_for(lambda: readout.get_attribute("data-rf"), moved)
        assert moved != pytest.approx(expected.rated)

        # another vehicle: the view moves it to its worst placement for the section
        view.locator(".ilkit-rating-vehicle select").select_option("EV3")
        _wait_for(lambda: readout.get_attribute("data-rf"), rated.rf("EV3", "moment", 28))
        assert page.locator(".jp-RenderedText[data-mime-type='application/vnd.jupyter.stderr']").count() == 0
        time.sleep(1.0)  # the coalesced redraw follows the read-out
        view.screenshot(path=str(artifacts / "lab-rating-view.png"))
