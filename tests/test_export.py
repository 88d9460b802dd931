"""Tables and their export: units in the column names, the core's numbers in every format."""

from __future__ import annotations

import re
import sys

import pandas as pd
import pytest
from scenarios import built_in_girder

import ilkit
from ilkit.views import table, to_csv, to_excel, to_latex
from ilkit.views.plot import short


def girder() -> ilkit.Beam:
    return built_in_girder()


def test_line_table_has_units_and_the_core_ordinates() -> None:
    line = girder().moment(4.8)
    frame = table(line)
    assert list(frame.columns) == ["x [m]", "left [kN·m/kN]", "right [kN·m/kN]"]
    for (x, left, right), (_, a, b) in zip(line.knot_values(), frame.itertuples(index=False, name=None)):
        assert (x, left, right)[1:] == (a, b)
    # derived by hand: a load at the hinge (9.6) hangs on the cantilever arm of 9.6 - 4.8 m
    assert frame.iloc[2].tolist() == [9.6, -4.8, -4.8]


def test_beam_table_lists_supports_and_releases() -> None:
    beam = built_in_girder(supports={0: "fixed", 16.8: "pin", 31.2: "roller"}, shear_releases=[22.8], units="kip-ft")
    frame = table(beam)
    assert list(frame.columns) == ["x [ft]", "item"]
    assert frame.values.tolist() == [
        [0.0, "fixed support"], [9.6, "hinge"], [16.8, "pin support"], [22.8, "shear release"],
        [31.2, "roller support"],
    ]


def test_unknown_object_has_no_table() -> None:
    with pytest.raises(ilkit.UnsupportedResultError, match="InfluenceLine, a Beam or a pandas DataFrame"):
        table(object())


def test_csv_round_trip_is_exact(tmp_path) -> None:
    line = girder().shear(15)
    path = to_csv(line, tmp_path / "v15.csv")
    back = pd.read_csv(path, encoding="utf-8")
    pd.testing.assert_frame_equal(back, table(line))  # floats written in full precision
    assert path.read_text(encoding="utf-8").splitlines()[0] == "x [m],left [kN/kN],right [kN/kN]"


def test_excel_round_trip_with_several_sheets(tmp_path) -> None:
    beam = girder()
    path = to_excel({"M at 4.8 m": beam.moment(4.8), "V at 15/left?": beam.shear(15), "beam": beam},
                    tmp_path / "g.xlsx")
    sheets = pd.read_excel(path, sheet_name=None)
    assert list(sheets) == ["M at 4.8 m", "V at 15_left_", "beam"]
    pd.testing.assert_frame_equal(sheets["M at 4.8 m"], table(beam.moment(4.8)), check_dtype=False)
    pd.testing.assert_frame_equal(sheets["beam"], table(beam), check_dtype=False)


def test_excel_without_openpyxl_names_the_install(monkeypatch: pytest.MonkeyPatch, tmp_path) -> None:
    monkeypatch.setitem(sys.modules, "openpyxl", None)
    with pytest.raises(ilkit.MissingDependencyError, match="pip install openpyxl"):
        to_excel(girder().moment(4.8), tmp_path / "x.xlsx")
    assert not (tmp_path / "x.xlsx").exists()


def test_latex_table_numbers_are_the_core_values(tmp_path) -> None:
    line = girder().shear(15)
    text = to_latex(line, tmp_path / "v15.tex", caption="Shear at x = 15 m", label="tab:v15")
    assert (tmp_path / "v15.tex").read_text(encoding="utf-8") == text
    lines = text.splitlines()
    assert lines[:4] == [r"\begin{table}[htbp]", r"\centering", r"\begin{tabular}{rrr}", r"\toprule"]
    assert lines[4] == r"x [m] & left [kN/kN] & right [kN/kN] \\"
    body = lines[lines.index(r"\midrule") + 1: lines.index(r"\bottomrule")]
    cells = [[c.strip().strip("$") for c in re.sub(r"\\\\$", "", row).split("&")] for row in body]
    expected = [[short(v) for v in row] for row in line.knot_values()]
    assert cells == expected
    assert r"\caption{Shear at x = 15 m}" in text and r"\label{tab:v15}" in text


def test_latex_escapes_units_and_text() -> None:
    text = to_latex(girder().moment(4.8))
    assert r"left [kN\ensuremath{\cdot}m/kN]" in text
    beam_text = to_latex(ilkit.Beam(10, {0: "pin", 10: "roller"}, shear_releases=[], units="kN-m"))
    assert "pin support" in beam_text and r"\begin{table}" not in beam_text
    frame = pd.DataFrame({"a_b %": ["50% & more"], "n": [1.5]})
    assert r"a\_b \% & n \\" in to_latex(frame) and r"50\% \& more & $1.5$ \\" in to_latex(frame)
