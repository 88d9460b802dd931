"""Rich notebook displays: what a notebook shows, the short repr kept, and the core left alone."""

from __future__ import annotations

import base64
import re
import subprocess
import sys
from fractions import Fraction

import pytest
from IPython.core.formatters import DisplayFormatter

import ilkit
from ilkit.views.plot import short


def girder() -> ilkit.Beam:
    return ilkit.Beam(30, {0: "fixed", 25: "roller"}, hinges=[10], units="kN-m")


def svg_of(html: str) -> str:
    (data,) = re.findall(r'src="data:image/svg\+xml;base64,([^"]+)"', html)
    return base64.b64decode(data).decode("utf-8")


def test_notebook_shows_a_beam_with_its_diagram_and_summary() -> None:
    beam = girder()
    data, _ = DisplayFormatter().format(beam)
    assert data["text/plain"] == repr(beam)
    page = data["text/html"]
    assert "degree of indeterminacy" in page and "0 (determinate)" in page
    assert "fixed at 0 m, roller at 25 m" in page and "25 m (0 to 25 m)" in page and "right 5 m" in page
    assert 'id="support:fixed:0"' in svg_of(page)  # the drawing's artists keep their gids


def test_repr_stays_short_and_constructor_like() -> None:
    beam = ilkit.Beam(30, {0: "fixed", 25: "roller"}, hinges=[10], EI=20000, units="kN-m")
    assert repr(beam) == "Beam(length=30, supports={0: 'fixed', 25: 'roller'}, hinges=[10], EI=20000, units='kN-m')"
    assert eval(repr(beam), {"Beam": ilkit.Beam}) == beam
    assert repr(beam.moment(5)) == "<InfluenceLine M at x=5, exact, 4 pieces on 0..30>"


def test_notebook_shows_a_line_with_its_sketch_and_key_values() -> None:
    line = girder().shear(18)
    data, _ = DisplayFormatter().format(line)
    assert data["text/plain"] == repr(line)
    page = data["text/html"]
    svg = svg_of(page)
    assert "Müller-Breslau" in svg and ">-0.5333<" in svg and ">0.4667<" in svg
    # extremes and areas are the core values (shear just left and right of x=18: -8/15 and 7/15)
    assert line.minimum.value == pytest.approx(-8 / 15) and line.maximum.value == pytest.approx(7 / 15)
    assert f"{short(line.maximum.value)} kN/kN at x = 18 m, right side" in page
    assert f"{short(line.minimum.value)} kN/kN at x = 18 m, left side" in page
    # the area of a shear line times a uniform load (kN/m) is a force: its unit is m (regression: kN/kN × m)
    assert f"positive area</th><td>{short(line.positive_area)} m<" in page
    assert "<th style=\"text-align:right\">left [kN/kN]</th>" in page


def test_a_numeric_line_without_mechanism_is_plotted_not_sketched() -> None:
    from ilkit.influence import InfluenceLine
    from ilkit.quantity import Quantity

    line = InfluenceLine(quantity=Quantity("moment", Fraction(5)), knots=(0.0, 5.0, 10.0),
                         coefficients=((0.0, 0.5, 0.0, -0.001), (2.375, -0.5, 0.0, 0.0)))
    page = line._repr_mimebundle_()["text/html"]
    assert "Influence line: bending moment M at x = 5" in svg_of(page)
    assert "numeric" in page


def test_display_without_matplotlib_says_how_to_get_the_drawing(monkeypatch: pytest.MonkeyPatch) -> None:
    for name in [m for m in sys.modules if m == "matplotlib" or m.startswith("matplotlib.")]:
        monkeypatch.delitem(sys.modules, name)
    monkeypatch.setitem(sys.modules, "matplotlib", None)
    page = girder()._repr_mimebundle_()["text/html"]
    assert "pip install ilkit[plot]" in page and "<img" not in page
    assert "degree of indeterminacy" in page


def test_core_does_not_import_the_views() -> None:
    code = (
        "import sys, ilkit\n"
        "b = ilkit.Beam(30, {0: 'fixed', 25: 'roller'}, hinges=[10], units='kN-m')\n"
        "line = b.moment(5); line(3.0); repr(b); repr(line); line.ordinates()\n"
        "print(sorted(m for m in sys.modules if m.startswith('ilkit.views') or m == 'matplotlib'))"
    )
    out = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True, check=True)
    assert out.stdout.strip() == "[]"
