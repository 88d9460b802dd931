"""Numbers as an engineer reads them: noise, signs, units and notation the same in tables, plots and sheets.

Each test is named after the fault it pins.  Reference values: the closed forms written out beside them.
"""

from __future__ import annotations

import re
from pathlib import Path

import numpy as np
import pandas as pd
import pytest

import ilkit
from ilkit.views import formula, plain_names, summary, table, write_calculation_sheet
from ilkit.views.display import line_facts
from ilkit.views.numbers import engineering, short
from ilkit.views.tables import beam_facts, doc_table

pytest.importorskip("matplotlib")


@pytest.fixture(scope="module")
def highway():
    # our own continuous girder, spans 90 + 115 + 90 ft (the demo's)
    return ilkit.Beam(295, {0: "pin", 90: "roller", 205: "roller", 295: "roller"}, EI=1.0e8, units="kip-ft")


def test_sheet_ordinates_at_supports_show_zero_not_rounding_noise(highway, tmp_path: Path) -> None:
    # regression: "| 90 | 2.498e-15 | 0 |": the noise threshold was relative to a column of noise.  The moment
    # over a support is zero for a load standing on any support (statics of the load on the bearing).
    sheet = write_calculation_sheet(highway, tmp_path / "s", lines=[highway.moment(90), highway.shear(205, "left")])
    markdown = sheet.markdown.read_text(encoding="utf-8")
    assert "| 90 | 0 | 0 |" in markdown and "| 205 | 0 | 0 |" in markdown
    cells = [c.strip() for row in re.findall(r"^\|.*\|$", markdown, flags=re.M) for c in row.split("|")]
    assert not [c for c in cells if re.fullmatch(r"-?[\d.]+e-\d+", c)]  # no 1e-15 and the like
    assert "-0" not in cells and "-0.0" not in cells


def test_no_minus_zero_anywhere() -> None:
    # regression: "-0.0" in tables and read-outs
    assert short(-0.0) == "0" and engineering(-0.0) == "0" and short(-1e-20, 4) != "-0"
    frame = pd.DataFrame({"M [kN·m]": [-0.0, 12.5, -1e-14]})
    assert [row[0] for row in doc_table(frame).rows] == ["0", "12.5", "0"]


def test_big_and_small_numbers_in_engineering_notation() -> None:
    # regression: EI printed as "100000000 kip·ft²"; 4-figure cells as "1.234e+04"
    assert engineering(1.0e8) == "100 × 10⁶" and engineering(2.4e7) == "24 × 10⁶"
    assert engineering(4.56e-5) == "45.6 × 10⁻⁶" and engineering(12345.6) == "12350"
    assert engineering(0.0749) == "0.0749" and engineering(-1990.12, 5) == "-1990.1"
    assert [row[0] for row in doc_table(pd.DataFrame({"v": [123456.0]})).rows] == ["123500"]


def test_beam_facts_give_positions_with_units_springs_in_words_and_stiffness_readably(highway) -> None:
    # regression: "pin at 0, roller at 90", springs as Python code "Spring(vertical=4000)", EI unreadable
    facts = dict(beam_facts(highway))
    assert facts["supports"] == "pin at 0 ft, roller at 90 ft, roller at 205 ft, roller at 295 ft"
    assert facts["EI"] == "100 × 10⁶ kip·ft²"
    sprung = ilkit.Beam(30, {0: "pin", 12: ilkit.Spring(vertical=4000), 30: "roller"}, hinges=[20], EI=2.4e7,
                        units="kN-m")
    facts = dict(beam_facts(sprung))
    assert facts["supports"] == "pin at 0 m, spring at 12 m (vertical 4000 kN/m, rotational free), roller at 30 m"
    assert facts["hinges"] == "20 m" and "Spring(" not in str(facts)


def test_area_units_are_what_a_uniform_load_multiplies(highway) -> None:
    # regression: areas as "kN/kN × m"; a line's area times a uniform load (force per length) is the effect,
    # so a reaction line's area is a length and a moment line's a length squared
    cases = ((highway.reaction(90), "ft"), (highway.moment(36), "ft²"), (highway.deflection(36), "in·ft/kip"))
    for line, unit in cases:
        facts = dict(line_facts(line))
        assert facts["positive area"].endswith(f" {unit}"), facts["positive area"]
    # the closed form of a simple span's midspan moment line: a triangle of height L/4, area L²/8
    span = ilkit.Beam(20, {0: "pin", 20: "roller"}, units="kN-m")
    assert dict(line_facts(span.moment(10)))["positive area"] == "50 m²"


def test_deflection_lines_are_shown_in_millimetres_in_tables_plots_and_facts() -> None:
    # regression: plotted in m/kN with a 1e-5 axis offset while a table beside it used mm per 100 kN.
    # Simple span L, EI: deflection at midspan under a unit load at midspan L³/(48 EI) (beam tables).
    L, EI = 20.0, 4.0e6
    line = ilkit.Beam(L, {0: "pin", L: "roller"}, EI=EI, units="kN-m").deflection(10)
    frame = table(line)
    assert list(frame.columns) == ["x [m]", "left [mm/kN]", "right [mm/kN]"]
    assert frame.set_index("x [m]").loc[10.0, "left [mm/kN]"] == pytest.approx(1000 * L**3 / (48 * EI))
    facts = dict(line_facts(line))
    assert facts["largest ordinate"].startswith(f"{short(1000 * L**3 / (48 * EI))} mm/kN at x = 10 m")
    from ilkit.views import plot_line

    ax = plot_line(line)
    ax.figure.canvas.draw()
    assert ax.get_ylabel() == "ordinate [mm/kN]" and ax.yaxis.get_offset_text().get_text() == ""
    written = {t.get_text() for t in ax.texts if (t.get_gid() or "").startswith("ordinate:")}
    assert short(1000 * L**3 / (48 * EI)) in written


def test_formula_merges_repeated_pieces_and_offers_decimals() -> None:
    # regression: Piecewise text with repeated zero pieces and rationals such as 480700569*x**3/1532517845150
    import sympy

    from ilkit import x

    girder = ilkit.Beam(108, {0: "pin", 32: "roller", 76: "roller", 108: "roller"}, hinges=[41, 67], units="kN-m")
    line = girder.moment(32)
    exact = formula(line, None)
    assert str(exact) == "Piecewise((0, x < 32), (32 - x, x < 41), (9*x/26 - 603/26, x < 67), (0, True))"
    assert str(formula(line, 4)) == "Piecewise((0, x < 32), (32 - x, x < 41), (0.3462*x - 23.19, x < 67), (0, True))"
    for at in (10, 35.5, 50, 70, 120):  # the same law as the exact record
        assert float(exact.subs(x, at)) == float(line.expr.subs(x, at))
    cubic = ilkit.Beam(20, {0: "pin", 8: "roller", 20: "roller"}, EI=[(0, 6, 2), (6, 10, 3), (10, 20, 2)])
    readable = formula(cubic.moment(8, exact=True), 5)
    assert all(len(str(n).replace("-", "").replace(".", "").lstrip("0")) <= 5 for n in readable.atoms(sympy.Float))
    with pytest.raises(ilkit.IlkitError, match="formula: digits"):
        formula(line, 0)


def test_summary_of_lines_has_units_and_distinct_headers(highway) -> None:
    # regression: hand-built tables without units, duplicate headers dodged with a trailing space ("at x ")
    found = summary({"R at pier": highway.reaction(90), "M at 36": highway.moment(36),
                     "deflection at 36": highway.deflection(36)})
    assert list(found.columns) == ["largest", "x of largest [ft]", "smallest (most negative)", "x of smallest [ft]",
                                   "positive area", "negative area", "ordinate unit", "area unit"]
    assert all(c == c.strip() for c in found.columns) and found.columns.is_unique
    assert list(found["ordinate unit"]) == ["kip/kip", "kip·ft/kip", "in/kip"]
    line = highway.moment(36)
    assert found.loc["M at 36", "largest"] == line.maximum.value
    assert found.loc["M at 36", "x of largest [ft]"] == line.maximum.x
    assert found.loc["deflection at 36", "largest"] == pytest.approx(12 * highway.deflection(36).maximum.value)
    assert list(summary([highway.reaction(90)]).index) == ["R at x=90"]


def test_plain_names_address_columns_without_typing_units(highway) -> None:
    # regression: "M max [kip·ft]" needed a middle dot to type
    env = ilkit.envelope(highway, ilkit.loads.design_tandem(), divisions=2)
    frame = plain_names(env)
    assert list(frame.columns) == ["x", "side", "M_max", "M_max_case", "M_min", "M_min_case", "V_max",
                                   "V_max_case", "V_min", "V_min_case"]
    assert frame.attrs["units"]["M_max"] == "kip·ft" and frame.attrs["units"]["x"] == "ft"
    assert np.array_equal(frame["M_max"].to_numpy(), env.sections["M max [kip·ft]"].to_numpy())
    assert list(env.sections.columns)[2] == "M max [kip·ft]"  # the readable names stay where they were
    placed = plain_names(ilkit.place(highway.moment(36), ilkit.loads.design_tandem()))
    assert {"load", "load_kip", "factored_effect"} <= set(placed.columns)
