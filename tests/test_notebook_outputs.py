"""The notebook tests compare text strictly and figures by what a reader checks, on any machine.

Regression: on another machine ``make test`` failed on two notebook cells whose
HTML display embeds an SVG figure: the pictures were the same, but one path had
a repeated vertex, and nbval compared the bytes.  notebooks/conftest.py makes
nbval compare a figure by its size and texts (an SVG) or its presence (a PNG).
"""

from __future__ import annotations

import base64
import importlib.util
import re
import shutil
import subprocess
import sys
import xml.etree.ElementTree as ET
from pathlib import Path

import pytest

nbformat = pytest.importorskip("nbformat")
pytest.importorskip("nbval")
pytest.importorskip("nbclient")

ROOT = Path(__file__).resolve().parents[1]


def notebook_conftest():
    """notebooks/conftest.py, the module that sets up nbval's comparison."""
    spec = importlib.util.spec_from_file_location("notebook_conftest", ROOT / "notebooks" / "conftest.py")
    module = importlib.util.module_from_spec(spec)
    spec.loader.exec_module(module)
    return module


svg_summary = notebook_conftest().svg_summary

BEAM_CELL = """\
import ilkit
ilkit.Beam(108, {0: "pin", 32: "roller", 76: "roller", 108: "roller"}, hinges=[41, 67], units="kN-m")"""
PLOT_CELL = """\
%matplotlib inline
import matplotlib.pyplot as plt
plt.plot([0, 1], [0, 1]); plt.show()"""


def svg_of(html: str) -> str:
    (data,) = re.findall(r"data:image/svg\+xml;base64,([A-Za-z0-9+/=]+)", html)
    return base64.b64decode(data).decode("utf-8")


def with_svg(html: str, svg: str) -> str:
    uri = "data:image/svg+xml;base64," + base64.b64encode(svg.encode("utf-8")).decode("ascii")
    return re.sub(r"data:image/svg\+xml;base64,[A-Za-z0-9+/=]+", uri, html)


def repeat_a_vertex(svg: str) -> str:
    """The same drawing with one vertex of one path given twice (what another machine wrote)."""
    match = re.search(r'd="M ([-\d.]+ [-\d.]+)\s+L ', svg)
    assert match, "no path to edit"
    vertex = match.group(1)
    return svg[: match.start()] + f'd="M {vertex} \nL {vertex} \nL ' + svg[match.end():]


def executed(tmp_path: Path) -> nbformat.NotebookNode:
    from ilkit.demo import execute

    nb = nbformat.v4.new_notebook()
    nb.metadata["kernelspec"] = {"name": "python3", "display_name": "Python 3", "language": "python"}
    nb.cells = [nbformat.v4.new_code_cell(src) for src in (BEAM_CELL, BEAM_CELL, PLOT_CELL, PLOT_CELL, BEAM_CELL)]
    execute(nb, cwd=tmp_path, timeout=120)
    return nb


def outcomes(folder: Path, notebook: Path) -> dict[int, str]:
    """Run nbval (with the project's notebooks/conftest.py) on a notebook; outcome of each cell."""
    shutil.copy(ROOT / "notebooks" / "conftest.py", folder / "conftest.py")
    report = folder / "report.xml"
    subprocess.run(
        [sys.executable, "-m", "pytest", "--nbval", "--nbval-current-env", "-p", "no:cacheprovider",
         "-q", f"--junitxml={report}", "--rootdir", str(folder), str(notebook)],
        cwd=folder, capture_output=True, text=True, timeout=300,
    )
    result = {}
    for case in ET.parse(report).getroot().iter("testcase"):
        cell = int(re.search(r"Cell (\d+)", case.get("name", "")).group(1))
        result[cell] = "failed" if case.find("failure") is not None or case.find("error") is not None else "passed"
    return result


def test_summary_is_the_size_and_texts_of_the_figure() -> None:
    svg = (
        '<svg xmlns="http://www.w3.org/2000/svg" width="504pt" height="237.6pt"><path d="M 0 0 L 1 1"/>'
        '<text x="1" y="2">x [m]</text><g><text>&#8722;4.5</text></g></svg>'
    )
    assert svg_summary(svg) == "[figure 504pt × 237.6pt; texts: x [m] | −4.5]"
    assert svg_summary(repeat_a_vertex(svg)) == svg_summary(svg)


@pytest.mark.slow
def test_svg_figures_with_a_repeated_vertex_pass_and_changed_texts_fail(tmp_path: Path) -> None:
    """The regression: a repeated vertex in an embedded SVG failed nbval; now only what a reader sees counts."""
    nb = executed(tmp_path)
    page = nb.cells[0].outputs[0]["data"]["text/html"]
    svg = svg_of(page)
    assert "<svg" in svg
    # cell 0: the same figure written with a repeated vertex, as another machine wrote it
    nb.cells[0].outputs[0]["data"]["text/html"] = with_svg(page, repeat_a_vertex(svg))
    # cell 1: a dimension drawn with another number: a real difference
    changed = svg.replace(">26 m<", ">27 m<", 1)
    assert changed != svg
    nb.cells[1].outputs[0]["data"]["text/html"] = with_svg(page, changed)
    # cell 2: a PNG with other bytes (another renderer): passes; cell 3: the figure is missing: fails
    nb.cells[2].outputs[0]["data"]["image/png"] = "iVBORw0KGgo" + "A" * 200
    nb.cells[3].outputs = []
    # cell 4: the summary table changed: text is compared strictly
    nb.cells[4].outputs[0]["data"]["text/html"] = page.replace("0 (determinate)", "1")
    path = tmp_path / "figures.ipynb"
    nbformat.write(nb, path)
    assert outcomes(tmp_path, path) == {0: "passed", 1: "failed", 2: "passed", 3: "failed", 4: "failed"}
