"""The demo runner executes notebooks and writes pages a person can open."""

from __future__ import annotations

import nbformat

from ilkit import demo


def test_demo_writes_index_pages_and_figures(tmp_path):
    folder = tmp_path / "nbs"
    folder.mkdir()
    nb = nbformat.v4.new_notebook()
    nb.cells = [
        nbformat.v4.new_markdown_cell("# A small study"),
        nbformat.v4.new_code_cell(
            "%matplotlib inline\nimport matplotlib.pyplot as plt\nimport ilkit\n"
            "line = ilkit.Beam(10, {0: 'pin', 10: 'roller'}).moment(4)\n"
            "plt.plot(*line.sample()); plt.show()\nline(4.0)"
        ),
    ]
    nbformat.write(nb, folder / "small.ipynb")
    index = demo.run(tmp_path / "out", notebooks=folder)
    text = index.read_text()
    assert "small.html" in text and "A small study" in text
    assert "qualified engineer" in text
    assert (tmp_path / "out" / "figures" / "small-1.png").stat().st_size > 1000
    executed = nbformat.read(tmp_path / "out" / "small.ipynb", as_version=4)
    assert executed.cells[1].outputs[-1]["data"]["text/plain"] == "2.4"


def test_pages_show_the_still_of_the_explorer(tmp_path):
    """A page read without a kernel cannot drive widgets: the explorer shows its still image there;
    a widget without a still keeps its view."""
    import re

    folder = tmp_path / "nbs"
    folder.mkdir()
    nb = nbformat.v4.new_notebook()
    nb.cells = [
        nbformat.v4.new_code_cell(
            "%matplotlib inline\nimport ilkit\nilkit.Beam(10, {0: 'pin', 10: 'roller'}, units='kN-m').explore()"
        ),
        nbformat.v4.new_code_cell("import ipywidgets\nipywidgets.IntSlider()"),
    ]
    nbformat.write(nb, folder / "live.ipynb")
    demo.run(tmp_path / "out", notebooks=folder)
    page = (tmp_path / "out" / "live.html").read_text()
    outputs = re.findall(r'<div class="jp-OutputArea-child.*?</div>\s*</div>', page, flags=re.S)
    assert len(outputs) == 2
    assert "data:image/png;base64," in outputs[0] and "widget-view+json" not in outputs[0]
    assert "widget-view+json" in outputs[1]
    assert (tmp_path / "out" / "figures" / "live-1.png").stat().st_size > 10_000


def test_demo_pages_carry_the_notebook_title_not_notebook(tmp_path):
    # regression: every page the demo wrote was titled "Notebook" in the browser
    folder = tmp_path / "nbs"
    folder.mkdir()
    nb = nbformat.v4.new_notebook()
    nb.cells = [nbformat.v4.new_markdown_cell("Some words first.\n\n# Girder over the creek\n\nMore."),
                nbformat.v4.new_code_cell("1 + 1")]
    nbformat.write(nb, folder / "creek.ipynb")
    demo.run(tmp_path / "out", notebooks=folder)
    page = (tmp_path / "out" / "creek.html").read_text(encoding="utf-8")
    assert "<title>Girder over the creek</title>" in page
    assert "Girder over the creek" in (tmp_path / "out" / "index.html").read_text(encoding="utf-8")
