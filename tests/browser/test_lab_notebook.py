"""A study notebook runs in JupyterLab in a real browser and shows its results."""

from __future__ import annotations

from .servers import copy_notebooks, jupyter_lab, run_all_cells


def test_hinged_girder_runs_in_jupyterlab(page, tmp_path, artifacts):
    folder = copy_notebooks(tmp_path, ["hinged_girder.ipynb"])
    with jupyter_lab(tmp_path, folder) as (base, token):
        run_all_cells(page, base, token, "hinged_girder.ipynb")
        outputs = page.locator(".jp-OutputArea-output")
        # the hand check at the end: moment over pier B for a load at x=54 is -4.5 m
        last = outputs.last
        last.scroll_into_view_if_needed()
        assert last.inner_text().strip() == "-4.5"
        # the figure rendered as an image
        assert page.locator(".jp-RenderedImage img").count() >= 1
        page.screenshot(path=str(artifacts / "lab-hinged-girder.png"), full_page=False)
