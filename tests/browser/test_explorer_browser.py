"""The explorer notebook in a real browser: JupyterLab and Voilà, driven by Playwright.

Each test moves the load slider with the keyboard and types a section into
the location box, and checks that the read-out changes to the value the core
computes for the same beam, section and load position.  A screenshot of each
is saved under ``tests/artifacts/``.
"""

from __future__ import annotations

import time

import pytest

import ilkit

from .servers import copy_notebooks, jupyter_lab, run_all_cells, voila

NOTEBOOK = "explorer.ipynb"
# the girder and the vehicle of notebooks/explorer.ipynb (checked against the notebook's source below)
GIRDER = ilkit.Beam(
    length=96,
    supports={0: "pin", 28: "roller", 68: "roller", 96: "roller"},
    EI=[(0, 24, 4.2e6), (24, 32, 6.3e6), (32, 64, 4.2e6), (64, 72, 6.3e6), (72, 96, 4.2e6)],
    units="kN-m",
)
VEHICLE = ilkit.AxleTrain([60, 110, 110, 95, 95], [3.4, 1.35, 5.8, 1.35], units="kN-m")
SMALL = ilkit.Beam(length=62, supports={0: "pin", 24: "roller", 50: "roller"}, hinges=[30], units="kN-m")


def _number(text: str) -> float:
    return float(text.replace("\u2212", "-").strip())


def _wait_for(read, want: float, timeout: float = 20.0) -> float:
    """Poll ``read()`` until it shows ``want`` to the read-out's precision (five significant figures)."""
    deadline = time.monotonic() + timeout
    got = None
    while time.monotonic() < deadline:
        try:
            got = _number(read())
        except ValueError:
            got = None
        if got is not None and got == pytest.approx(want, rel=1e-4, abs=1e-4):
            return got
        time.sleep(0.1)
    raise AssertionError(f"the page shows {got}, the core gives {want}")


def _settle_figure(explorer) -> None:
    """Wait until the figure's image stops changing (the redraw is coalesced and sent after the read-out)."""
    image = explorer.locator("img").first
    last, stable_since = None, time.monotonic()
    deadline = time.monotonic() + 10
    while time.monotonic() < deadline:
        src = image.get_attribute("src")
        if src != last:
            last, stable_since = src, time.monotonic()
        elif time.monotonic() - stable_since > 0.6:
            return
        time.sleep(0.1)


def drive_explorer(page, screenshot) -> None:
    """The notebook leaves the vehicle at x = 45 m travelling left to right, on the moment over pier B."""
    explorer = page.locator(".ilkit-explorer").first
    explorer.wait_for(timeout=60_000)
    explorer.scroll_into_view_if_needed()
    value = explorer.locator(".ilkit-readout .ilkit-value")
    where = explorer.locator(".ilkit-readout .ilkit-at")
    location = explorer.locator(".ilkit-location input")

    def effect(section: float, x: float) -> float:
        return ilkit.stand(GIRDER.moment(section), VEHICLE, x, direction="left to right").effect

    _wait_for(value.inner_text, effect(28, 45.0))
    assert float(where.get_attribute("data-x")) == 45.0

    # move the vehicle with the keyboard: three steps to the right
    handle = explorer.locator(".ilkit-slider .noUi-handle")
    handle.focus()
    for _ in range(3):
        handle.press("ArrowRight")
    _wait_for(lambda: where.get_attribute("data-x"), 45.6)
    x = float(where.get_attribute("data-x"))  # the position the kernel used
    _wait_for(value.inner_text, effect(28, x))

    # type another section into the location box
    location.fill("48")
    location.press("Enter")
    _wait_for(value.inner_text, effect(48, x))
    assert location.input_value() == "48"

    # a bad entry is a message in the widget, and the read-out stays
    location.fill("120")
    location.press("Enter")
    explorer.locator(".ilkit-message .ilkit-error").wait_for(timeout=20_000)
    assert "off the beam" in explorer.locator(".ilkit-message").inner_text()
    assert _number(value.inner_text()) == pytest.approx(effect(48, x), rel=1e-4)
    assert page.locator(".jp-RenderedText[data-mime-type='application/vnd.jupyter.stderr']").count() == 0

    _settle_figure(explorer)
    explorer.screenshot(path=str(screenshot))


def one_cell_notebook(tmp_path, name: str, source: str):
    """A folder ``work`` in ``tmp_path`` holding the notebook ``name`` of one code cell; returns the folder."""
    import nbformat

    folder = tmp_path / "work"
    folder.mkdir()
    nb = nbformat.v4.new_notebook()
    nb.metadata["kernelspec"] = {"name": "python3", "display_name": "Python 3", "language": "python"}
    nb.cells = [nbformat.v4.new_code_cell(source)]
    nbformat.write(nb, folder / name)
    return folder


def test_notebook_defines_the_girder_and_vehicle_of_this_test():
    import nbformat

    from .servers import ROOT

    source = nbformat.read(ROOT / "notebooks" / NOTEBOOK, as_version=4).cells[1].source
    assert 'supports={0: "pin", 28: "roller", 68: "roller", 96: "roller"}' in source
    assert "(24, 32, 6.3e6), (32, 64, 4.2e6), (64, 72, 6.3e6)" in source
    assert "[60, 110, 110, 95, 95], [3.4, 1.35, 5.8, 1.35]" in source


def test_explorer_in_jupyterlab(page, tmp_path, artifacts):
    folder = copy_notebooks(tmp_path, [NOTEBOOK])
    with jupyter_lab(tmp_path, folder) as (base, token):
        run_all_cells(page, base, token, NOTEBOOK)
        drive_explorer(page, artifacts / "lab-explorer.png")


def test_explorer_with_ipympl_updates_the_canvas_in_place(page, tmp_path, artifacts):
    """With ``%matplotlib widget`` the figure is an ipympl canvas; a slider step repaints it in place."""
    folder = one_cell_notebook(
        tmp_path, "widget.ipynb",
        "%matplotlib widget\nimport ilkit\n"
        "girder = ilkit.Beam(length=62, supports={0: 'pin', 24: 'roller', 50: 'roller'}, hinges=[30], "
        "units='kN-m')\nexplorer = girder.explore(quantity='shear', at=10)\nexplorer.position.value = 0.0\n"
        "explorer",
    )
    with jupyter_lab(tmp_path, folder) as (base, token):
        run_all_cells(page, base, token, "widget.ipynb")
        explorer = page.locator(".ilkit-explorer").first
        canvas = explorer.locator(".jupyter-matplotlib canvas").first
        canvas.wait_for(timeout=60_000)

        def picture() -> str:
            last, since = None, time.monotonic()
            while time.monotonic() - since < 0.8:
                now = canvas.evaluate("c => c.toDataURL()")
                if now != last:
                    last, since = now, time.monotonic()
                time.sleep(0.1)
            return last

        before = picture()
        handle = explorer.locator(".ilkit-slider .noUi-handle")
        handle.focus()
        for _ in range(40):
            handle.press("ArrowRight")
        x = _wait_for(lambda: explorer.locator(".ilkit-readout .ilkit-at").get_attribute("data-x"), 4.0)
        _wait_for(explorer.locator(".ilkit-readout .ilkit-value").inner_text, float(SMALL.shear(10)(x)))
        after = picture()
        assert after != before
        assert explorer.locator(".jupyter-matplotlib").count() == 1  # one canvas, updated in place
        explorer.screenshot(path=str(artifacts / "lab-explorer-ipympl.png"))


def test_explorer_as_a_voila_page(page, tmp_path, artifacts):
    folder = copy_notebooks(tmp_path, [NOTEBOOK])
    with voila(tmp_path, folder) as base:
        page.goto(f"{base}/voila/render/{NOTEBOOK}", timeout=120_000)
        drive_explorer(page, artifacts / "voila-explorer.png")


def test_explorer_reads_out_the_factored_effect_for_a_limit_state(page, tmp_path, artifacts):
    """Choose a limit state in the page, move the truck with the keyboard: the factored effect follows, equal to
    the core's effect times the factors named (γLL 1.75 Strength I, AASHTO LRFD Table 3.4.1-1, from memory; IM
    33 % on the truck, Table 3.6.2.1-1, from memory; gM 0.68 given)."""
    from ilkit import loads

    beam = ilkit.Beam(295, {0: "pin", 90: "roller", 205: "roller", 295: "roller"}, EI=1e8, units="kip-ft")
    truck = loads.hl93().cases[0].parts[0]
    assert truck.name == "design truck"
    folder = one_cell_notebook(
        tmp_path, "factored.ipynb",
        "%matplotlib inline\nimport ilkit\nfrom ilkit import design, loads\n"
        "beam = ilkit.Beam(295, {0: 'pin', 90: 'roller', 205: 'roller', 295: 'roller'}, EI=1e8, units='kip-ft')\n"
        "live = design.GirderLiveLoad(loads.hl93(), distribution=design.given_distribution(0.68, 0.88, "
        "includes_multiple_presence=True), name='HL-93, girder 2')\n"
        "explorer = beam.explore(live=live, limit_state=['Strength I', 'Service II'], quantity='moment', at=36)\n"
        "explorer.load.value = 'HL-93, girder 2: design truck'\nexplorer.position.value = 40.0\n"
        "explorer.limit_state.value = ''\nexplorer",
    )
    with jupyter_lab(tmp_path, folder) as (base, token):
        run_all_cells(page, base, token, "factored.ipynb")
        explorer = page.locator(".ilkit-explorer").first
        explorer.wait_for(timeout=60_000)
        explorer.scroll_into_view_if_needed()
        value = explorer.locator(".ilkit-readout .ilkit-value")
        where = explorer.locator(".ilkit-readout .ilkit-at")
        _wait_for(value.inner_text, ilkit.stand(beam.moment(36), truck, 40.0).effect)
        assert explorer.locator(".ilkit-factored").count() == 0  # unfactored until a limit state is chosen
        explorer.locator(".ilkit-limit_state select").select_option("Strength I")
        factored = explorer.locator(".ilkit-readout .ilkit-factored")
        _wait_for(factored.inner_text, 1.75 * 1.33 * 0.68 * ilkit.stand(beam.moment(36), truck, 40.0).effect)
        handle = explorer.locator(".ilkit-slider .noUi-handle")
        handle.focus()
        for _ in range(4):
            handle.press("ArrowRight")
        _wait_for(lambda: where.get_attribute("data-x"), 42.0)  # four steps of 0.5 ft (295 ft / 400, rounded down)
        x = float(where.get_attribute("data-x"))
        _wait_for(factored.inner_text, 1.75 * 1.33 * 0.68 * ilkit.stand(beam.moment(36), truck, x).effect)
        assert "γLL 1.75" in explorer.locator(".ilkit-readout").inner_text()
        explorer.locator(".ilkit-limit_state select").select_option("Service II")
        _wait_for(factored.inner_text, 1.30 * 1.33 * 0.68 * ilkit.stand(beam.moment(36), truck, x).effect)
        _settle_figure(explorer)
        explorer.screenshot(path=str(artifacts / "lab-explorer-limit-state.png"))
