"""Design results in the views: tables, notebook displays, sheet sections and drawings (tested on their artists)."""

from __future__ import annotations

import numpy as np
import pytest

import ilkit
from ilkit.design import (
    DistributedLoad,
    PointLoad,
    Settlement,
    SpanLoad,
    Stage,
    concurrent_forces,
    deflection_check,
    permanent_effects,
)
from ilkit.loads import envelope, hl93
from ilkit.views import plot_deflection_check, plot_permanent_effects, table, write_calculation_sheet
from ilkit.views.caution import CAUTION_SHORT

pytest.importorskip("matplotlib")

BEAM = ilkit.Beam(60, {0: "pin", 27: "roller", 60: "roller"}, EI=1.8e6, units="kN-m")


@pytest.fixture(scope="module")
def effects():
    return permanent_effects([
        Stage("wet deck", BEAM, [DistributedLoad("slab", "DC", 14), PointLoad("diaphragm", "DC", 12, 40)]),
        Stage("composite", BEAM.replace(EI=4.0e6), [SpanLoad("surfacing", "DW", 3.5, 2),
                                                   Settlement("pier settles", 27, 0.01)]),
    ])


@pytest.fixture(scope="module")
def check():
    return deflection_check(BEAM.in_units("kip-ft"), lanes=2, girders=5, divisions=4)


def test_tables_are_the_results_frames(effects, check):
    assert table(effects).equals(effects.to_frame())
    assert table(check).equals(check.spans)
    found = concurrent_forces(envelope(BEAM, hl93(), divisions=2))
    assert table(found).equals(found.frame)


def test_displays_carry_the_loads_the_factors_and_the_caution(effects, check):
    html = effects._repr_mimebundle_()["text/html"]
    for text in ("Permanent loads", "wet deck", "composite", "14 kN/m over the whole beam", "12 kN at x = 40",
                 "3.5 kN/m over span 2", "settles by 0.01 m", "Bending moment [kN·m] by load category", CAUTION_SHORT):
        assert text in html, text
    html = check._repr_mimebundle_()["text/html"]
    for text in ("Live-load deflection", "AASHTO deflection load", "multiple presence", "Table 3.6.1.1.2-1",
                 "from memory: check it", "L/800", CAUTION_SHORT):
        assert text in html, text
    found = concurrent_forces(envelope(BEAM, hl93(), divisions=2))
    html = found._repr_mimebundle_()["text/html"]
    assert "Bending moment with the concurrent shear" in html and "Concurrent reactions" in html


def test_determinate_settlement_note_reaches_the_sheet(tmp_path):
    simple = ilkit.Beam(20, {0: "pin", 20: "roller"}, EI=1e5, units="kN-m")
    e = permanent_effects(simple, [Settlement("abutment", 20, 0.02)])
    sheet = write_calculation_sheet(simple, tmp_path / "sheet", results=[e])
    text = sheet.markdown.read_text(encoding="utf-8")
    assert "statically determinate, so the settlement moves it as a rigid body" in text
    assert "Permanent loads" in text


def test_sheet_sections(effects, check, tmp_path):
    found = concurrent_forces(envelope(BEAM, hl93(), divisions=2))
    sheet = write_calculation_sheet(BEAM, tmp_path / "design", results=[effects, found, check])
    text = sheet.markdown.read_text(encoding="utf-8")
    for heading in ("Permanent loads", "Concurrent forces", "Live-load deflection"):
        assert heading in text
    names = sorted(p.name for p in sheet.figures.iterdir())
    assert "permanent-3-1-moment.svg" in names and "deflection-3-3.svg" in names


def test_permanent_drawing_shows_each_category_and_the_total(effects):
    ax = plot_permanent_effects(effects, "moment")
    lines = {line.get_gid(): line for line in ax.get_lines()}
    assert {"category:DC", "category:DW", "category:settlement", "total"} <= set(lines)
    by = effects.by_category()
    rows = by[by["quantity"] == "moment"]
    total = lines["total"].get_ydata()
    assert np.allclose(sorted(total), sorted(rows[["DC", "DW", "settlement"]].sum(axis=1)))
    ax = plot_permanent_effects(effects, "reaction")
    assert {t.get_gid() for t in ax.texts} == {"total-value:0", "total-value:27", "total-value:60"}
    assert ax.get_ylabel() == "R [kN]"
    ax = plot_permanent_effects(effects, "deflection")
    assert ax.yaxis_inverted()
    with pytest.raises(ilkit.IlkitError, match="plot_permanent_effects: kind"):
        plot_permanent_effects(effects, "torque")
    with pytest.raises(ilkit.UnsupportedResultError, match=r"give the result of ilkit\.design\.permanent_effects"):
        plot_permanent_effects("effects")


def test_deflection_drawing_shows_the_limits(check):
    ax = plot_deflection_check(check)
    gids = {line.get_gid(): line for line in ax.get_lines()}
    for _, row in check.spans.iterrows():
        down = gids[f"allowed:{row['span']}:down"]
        assert np.allclose(down.get_ydata(), row["allowed [ft]"])
        assert np.allclose(gids[f"allowed:{row['span']}:up"].get_ydata(), -row["allowed [ft]"])
        assert gids[f"largest:{row['span']}"].get_ydata()[0] == pytest.approx(row["deflection [ft]"])
    assert ax.yaxis_inverted()
    with pytest.raises(ilkit.UnsupportedResultError, match="deflection_check"):
        plot_deflection_check("check")


@pytest.fixture(scope="module")
def factored():
    from ilkit.design import GirderLiveLoad, factored_envelope, given_distribution

    beam = BEAM.in_units("kip-ft")
    dead = permanent_effects(beam, [DistributedLoad("slab", "DC", 1.1), DistributedLoad("surfacing", "DW", 0.2)],
                             divisions=4, quantities=("moment", "shear", "reaction"))
    live = GirderLiveLoad(hl93(), distribution=given_distribution(0.7, 0.8, includes_multiple_presence=True),
                          name="HL-93, girder 2")
    return factored_envelope(beam, permanent=dead, live=live, limit_states=["Strength I", "Service II"], divisions=4)


def test_factored_drawing_shows_each_limit_state_over_its_components(factored):
    """The factored values drawn are the envelope's, and the figure shows in a notebook (a pyplot figure:
    regression, it was drawn on a figure pyplot did not know, so nothing showed)."""
    import matplotlib.pyplot as plt

    from ilkit.views import plot_factored_envelope

    before = set(plt.get_fignums())
    top, bottom = plot_factored_envelope(factored, "moment")
    assert set(plt.get_fignums()) - before
    lines = {a.get_gid(): a for a in top.lines}
    rows = factored.frame[(factored.frame["quantity"] == "moment") & (factored.frame["limit_state"] == "Strength I")]
    assert np.allclose(np.sort(lines["max:Strength I"].get_ydata()), np.sort(rows["max"].to_numpy()))
    assert {"max:Service II", "min:Service II", "min:Strength I"} <= set(lines)
    below = {a.get_gid() for a in (*bottom.lines, *bottom.collections)}
    assert {"permanent:DC", "permanent:DW", "live:HL-93, girder 2"} <= below
    plt.close("all")
    with pytest.raises(ilkit.DesignInputError, match="two axes"):
        plot_factored_envelope(factored, "moment", axes=[top])


def test_factored_sheet_section_names_the_live_load_and_every_factor(factored):
    from ilkit.views.report import report_section

    blocks = report_section(factored, "4.1")
    assert blocks[0].text == "4.1 Factored envelopes: HL-93, girder 2"
    html = factored._repr_mimebundle_()["text/html"]
    for text in ("γLL", "γDC,max / γDC,min", "1.25 / 0.9", "gM", "recalled from memory: check it",
                 "Tables 3.4.1-1 and 3.4.1-2", "qualified engineer"):
        assert text in html, text
