"""Rich notebook displays: what a notebook shows, the short repr kept, and the core left alone."""

from __future__ import annotations

import base64
import re
import subprocess
import sys
from fractions import Fraction

import pytest
from IPython.core.formatters import DisplayFormatter
from scenarios import built_in_girder

import ilkit
from ilkit.views.plot import short


def girder() -> ilkit.Beam:
    return built_in_girder()


def svg_of(html: str) -> str:
    (data,) = re.findall(r'src="data:image/svg\+xml;base64,([^"]+)"', html)
    return base64.b64decode(data).decode("utf-8")


def test_notebook_shows_a_beam_with_its_diagram_and_summary() -> None:
    beam = girder()
    data, _ = DisplayFormatter().format(beam)
    assert data["text/plain"] == repr(beam)
    page = data["text/html"]
    assert "degree of indeterminacy" in page and "0 (determinate)" in page
    assert "fixed at 0 m, roller at 31.2 m" in page and "31.2 m (0 to 31.2 m)" in page and "right 6 m" in page
    assert 'id="support:fixed:0"' in svg_of(page)  # the drawing's artists keep their gids


def test_repr_stays_short_and_constructor_like() -> None:
    beam = ilkit.Beam(37.2, {0: "fixed", 31.2: "roller"}, hinges=[9.6], EI=2.1e5, units="kN-m")
    assert repr(beam) == ("Beam(length=37.2, supports={0: 'fixed', 31.2: 'roller'}, hinges=[9.6], EI=210000, "
                          "units='kN-m')")
    assert eval(repr(beam), {"Beam": ilkit.Beam}) == beam
    assert repr(beam.moment(4.8)) == "<InfluenceLine M at x=4.8, exact, 4 pieces on 0..37.2>"


def test_notebook_shows_a_line_with_its_sketch_and_key_values() -> None:
    line = girder().shear(15)
    data, _ = DisplayFormatter().format(line)
    assert data["text/plain"] == repr(line)
    page = data["text/html"]
    svg = svg_of(page)
    # derived by hand: the part from the hinge (9.6) to the pier (31.2) is a simple span of 21.6 m, so the
    # shear at 15 is -5.4/21.6 = -0.25 just left of the section and 16.2/21.6 = 0.75 just right of it; a load
    # at the cantilever end (37.2) lifts the hinge by 6/21.6: -5/18 there, the smallest ordinate
    assert "Müller-Breslau" in svg and ">-0.25<" in svg and ">0.75<" in svg and ">-0.2778<" in svg
    assert line.minimum.value == pytest.approx(-5 / 18) and line.maximum.value == pytest.approx(3 / 4)
    assert f"{short(line.maximum.value)} kN/kN at x = 15 m, right side" in page
    assert f"{short(line.minimum.value)} kN/kN at x = 37.2 m" in page
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
        "b = ilkit.Beam(37.2, {0: 'fixed', 31.2: 'roller'}, hinges=[9.6], units='kN-m')\n"
        "line = b.moment(4.8); line(3.0); repr(b); repr(line); line.ordinates()\n"
        "print(sorted(m for m in sys.modules if m.startswith('ilkit.views') or m == 'matplotlib'))"
    )
    out = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True, check=True)
    assert out.stdout.strip() == "[]"
