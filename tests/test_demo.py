"""The demo runner executes notebooks and writes pages a person can open."""

from __future__ import annotations

import nbformat
import pytest

from ilkit import demo
from ilkit._files import write_file


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
    text = index.read_text(encoding="utf-8")
    assert "small.html" in text and "A small study" in text
    assert "qualified engineer" in text
    assert (tmp_path / "out" / "figures" / "small-1.png").stat().st_size > 1000
    executed = nbformat.read(tmp_path / "out" / "small.ipynb", as_version=4)
    assert executed.cells[1].outputs[-1]["data"]["text/plain"] == "2.4"


def test_pages_show_the_still_of_the_explorer(tmp_path):
    """A page read without a kernel cannot drive widgets: the explorer shows its still image there;
    a widget without a still shows its text (its view would need a widget manager from the network)."""
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
    page = (tmp_path / "out" / "live.html").read_text(encoding="utf-8")
    outputs = re.findall(r'<div class="jp-OutputArea-child.*?</div>\s*</div>', page, flags=re.S)
    assert len(outputs) == 2
    assert "data:image/png;base64," in outputs[0] and "widget-view+json" not in outputs[0]
    assert "IntSlider(value=0)" in outputs[1] and "widget-view+json" not in outputs[1]
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


def test_demo_kernels_do_not_warn_of_unencrypted_tcp(tmp_path, capfd, monkeypatch):
    """Regression: `make demo` printed the kernel's "running over TCP without encryption" warning once
    per notebook; the kernels now talk over local sockets, and each is shut down after its notebook."""
    runtime = tmp_path / "runtime"
    monkeypatch.setenv("JUPYTER_RUNTIME_DIR", str(runtime))
    folder = tmp_path / "nbs"
    folder.mkdir()
    for name in ("a", "b"):
        nb = nbformat.v4.new_notebook()
        nb.cells = [nbformat.v4.new_markdown_cell(f"# Study {name}"), nbformat.v4.new_code_cell("1 + 1")]
        nbformat.write(nb, folder / f"{name}.ipynb")
    assert demo.main(["--out", str(tmp_path / "out"), "--notebooks", str(folder)]) == 0
    out, err = capfd.readouterr()
    assert "running a.ipynb" in out and "running b.ipynb" in out
    assert "without encryption" not in out + err and "WARNING" not in out + err
    assert sorted(p.name for p in runtime.iterdir()) == []  # no connection file or socket left: kernels shut down


def test_pages_load_nothing_from_the_network_and_have_their_study_as_title(tmp_path):
    """Pages are read offline: MathJax is copied beside them, no script, style or font comes from a host."""
    import re

    folder = tmp_path / "nbs"
    folder.mkdir()
    nb = nbformat.v4.new_notebook()
    nb.cells = [
        nbformat.v4.new_markdown_cell("# Moment over the pier\n\nThe line $\\eta(x)$."),
        nbformat.v4.new_code_cell(
            "import ilkit\nfrom ilkit import views\n"
            "views.derivation(ilkit.Beam(10, {0: 'pin', 10: 'roller'}, units='kN-m').moment(4))"
        ),
    ]
    nbformat.write(nb, folder / "pier.ipynb")
    demo.run(tmp_path / "out", notebooks=folder)
    out = tmp_path / "out"
    assert (out / "_static" / "mathjax" / "tex-svg-full.js").stat().st_size > 1_000_000
    assert (out / "_static" / "mathjax" / "LICENSE").exists()
    for page in sorted(out.glob("*.html")):
        text = page.read_text(encoding="utf-8")
        remote = re.findall(r"""(?:src|href)\s*=\s*["']?((?:https?:)?//[^"' >]+)""", text)
        remote += re.findall(r"""(?:import\(|url\()\s*["']?((?:https?:)?//[^"' )]+)""", text)
        assert remote == [], f"{page.name} loads {remote}"
    page = (out / "pier.html").read_text(encoding="utf-8")
    assert 'src="_static/mathjax/tex-svg-full.js"' in page
    assert "<title>Moment over the pier</title>" in page


def test_demo_runs_the_notebooks_in_this_python(tmp_path, monkeypatch):
    """A kernelspec named python3 in the machine's Jupyter folders (another Python, without ilkit) does not
    decide where the demo runs: its kernels are this interpreter."""
    import json
    import sys

    spec = tmp_path / "jupyter" / "kernels" / "python3"
    spec.mkdir(parents=True)
    (spec / "kernel.json").write_text(json.dumps({"argv": ["/nonexistent/python", "-m", "ipykernel_launcher", "-f",
                                                            "{connection_file}"],
                                                   "display_name": "Python 3 (elsewhere)", "language": "python"}))
    monkeypatch.setenv("JUPYTER_PATH", str(tmp_path / "jupyter"))
    folder = tmp_path / "nbs"
    folder.mkdir()
    nb = nbformat.v4.new_notebook()
    nb.cells = [nbformat.v4.new_code_cell("import sys, ilkit\nprint(sys.executable)")]
    nbformat.write(nb, folder / "where.ipynb")
    demo.run(tmp_path / "out", notebooks=folder)
    executed = nbformat.read(tmp_path / "out" / "where.ipynb", as_version=4)
    assert executed.cells[0].outputs[0]["text"].strip() == sys.executable


def test_a_failed_page_write_leaves_the_existing_page_untouched(tmp_path):
    page = tmp_path / "study.html"
    page.write_text("the page of the last run", encoding="utf-8")
    with pytest.raises(UnicodeEncodeError):  # a lone surrogate cannot be written as UTF-8
        write_file(page, "half a page \ud800", what="demo")
    assert page.read_text(encoding="utf-8") == "the page of the last run"
    assert [p.name for p in tmp_path.iterdir()] == ["study.html"]  # no temporary file left
    write_file(page, "the new page", what="demo")
    assert page.read_text(encoding="utf-8") == "the new page"
