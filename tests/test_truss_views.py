"""Truss views: drawings (checked on their artists), member envelope and table, sheets, displays, explorer.

The member envelope's values come from the placement search on each member's
line, so they are checked against :func:`ilkit.loads.extremes` on the same
line; the drawings are checked by what they draw (gids, line styles), never
by image bytes.  The explorer is driven headless through its controls.
"""

from __future__ import annotations

import pytest

pytest.importorskip("matplotlib")
import matplotlib

matplotlib.use("Agg")

import ilkit
from ilkit import loads, trusses, views


@pytest.fixture(scope="module")
def truss():
    """A 10-panel Pratt through truss of our own: 240 ft, 24 ft panels, 32 ft deep (diagonals 40 ft)."""
    return trusses.pratt(240, 10, 32, units="kip-ft")


@pytest.fixture(scope="module")
def envelope(truss):
    return trusses.member_envelope(truss, loads.hl93())


def gids(ax):
    found = set()
    for artist in ax.get_children():
        found.add(artist.get_gid())
    return found


def test_draw_truss_draws_every_member_joint_and_support(truss):
    ax = views.draw_truss(truss)
    found = gids(ax)
    assert {f"member:{m}" for m in truss.members} <= found
    assert {f"joint:{j}" for j in truss.joints} <= found
    assert {"support:pin:0", "support:roller:240", "deck"} <= found


def test_member_forces_are_drawn_solid_in_tension_and_hollow_in_compression(truss, envelope):
    ax = views.plot_member_forces(envelope, extreme="max")
    found = gids(ax)
    tension = {m for m, v in envelope.forces("max").items() if v > 1e-9}
    assert {f"tension:{m}" for m in tension} <= found
    ax = views.plot_member_forces(envelope, extreme="min")
    lines = {a.get_gid(): a for a in ax.get_lines()}
    compression = [m for m, v in envelope.forces("min").items() if v < -1e-9]
    assert compression and all(f"compression:{m}" in lines for m in compression)
    hollow = lines[f"compression:{compression[0]}"]
    assert hollow.get_color() == "white" and len(hollow.get_path_effects()) == 2  # an outline, not a colour
    texts = {a.get_gid(): a.get_text() for a in ax.texts}
    assert texts[f"force:{compression[0]}"].startswith("-")
    # a mapping of forces with its truss
    ax = views.plot_member_forces({"U4-U5": -2.0, "L4-L5": 1.0}, truss=truss)
    assert {"compression:U4-U5", "tension:L4-L5", "no-force:U1-U2"} <= gids(ax)
    with pytest.raises(ilkit.UnsupportedResultError):
        views.plot_member_forces({"U4-U5": 1.0})


def test_member_envelope_equals_the_placement_search_on_each_line(truss, envelope):
    hl93 = loads.hl93()
    for name in ("U4-U5", "U1-L2", "L4-L5", "U5-L5"):
        both = loads.extremes(truss.member_force(name), hl93)
        assert envelope.extreme(name, "max").value == both.maximum.value
        assert envelope.extreme(name, "min").value == both.minimum.value
    table = views.table(envelope)
    assert list(table.columns) == ["member", "role", "length [ft]", "max tension [kip]", "tension case",
                                   "max compression [kip]", "compression case"]
    assert len(table) == len(truss.members)
    row = table.set_index("member").loc["U4-U5"]
    assert row["max tension [kip]"] == 0 and row["tension case"] == "—"
    assert row["max compression [kip]"] == envelope.extreme("U4-U5", "min").value < 0
    assert envelope.reactions["R max [kip]"].iloc[0] == loads.extremes(truss.reaction("L0"), hl93).maximum.value
    with pytest.raises(ilkit.LoadInputError, match="no member"):
        envelope.extreme("Q")


def test_the_truss_sketch_moves_the_truss_and_draws_the_line(truss):
    line = truss.member_force("U3-L4")
    ax = views.sketch(line)
    fig = ax.figure
    every = {a.get_gid() for top in fig.axes for a_ in (top, *top.child_axes) for a in a_.get_children()}
    assert "shortened" in every and "moved:U1-U2" in every and "panel-point:96" in every


def test_a_truss_line_gives_its_table_export_and_derivation(truss, tmp_path):
    line = truss.member_force("U1-L2")
    assert line.is_exact  # 24 by 32 panels: diagonals 40 ft
    frame = views.table(line)
    assert len(frame) == len(line.breakpoints)
    views.to_csv(line, tmp_path / "n.csv")
    text = str(views.derivation(line))
    assert "Method of joints" in text and "N = t·L" in text
    assert views.derivation(line).expression == line.expr


def test_displays_of_a_truss_its_lines_and_its_envelope(truss, envelope):
    assert "Truss" in truss._repr_mimebundle_()["text/html"]
    assert "<img" in truss.member_force("U4-U5")._repr_mimebundle_()["text/html"]
    html = envelope._repr_mimebundle_()["text/html"]
    assert "max compression" in html and "checked by a qualified engineer" in html


def test_a_calculation_sheet_of_a_truss(truss, tmp_path):
    lines = [truss.member_force("U4-U5"), truss.member_force("U1-L2"), truss.reaction("L0")]
    sheet = views.write_calculation_sheet(truss, tmp_path / "truss", lines=lines, load=loads.hl93())
    page = sheet.html.read_text(encoding="utf-8")
    for words in ("The truss: joints, members, supports and the deck", "member force N in U4-U5",
                  "Member forces under HL-93", "max tension", "Method of joints", "qualified engineer"):
        assert words in page
    other = trusses.pratt(240, 10, 30, units="kip-ft")
    with pytest.raises(ilkit.BeamInputError, match="belongs to another beam"):
        views.write_calculation_sheet(truss, tmp_path / "bad", lines=[other.member_force("U4-U5")])


def test_the_truss_explorer_moves_the_load_and_reads_every_member(truss):
    pytest.importorskip("ipywidgets")
    hl93 = loads.hl93()
    explorer = truss.explore({"HL-93": hl93}, member="U4-U5", backend="inline")
    explorer.load.value = "HL-93: design truck"
    explorer.position.value = 130.0
    placed = loads.stand(truss.member_force("U4-U5"), explorer._travelling["HL-93: design truck"], 130.0)
    assert explorer.value == placed.effect
    assert explorer.forces["L4-L5"] == loads.stand(truss.member_force("L4-L5"),
                                                   explorer._travelling["HL-93: design truck"], 130.0).effect
    explorer.redraw()
    styles = {a.get_gid() for a in explorer._ax_truss.get_lines()}
    assert "compression:U4-U5" in styles and "tension:L4-L5" in styles
    explorer.jump("min")
    found = loads.place(truss.member_force("U4-U5"), explorer._travelling["HL-93: design truck"], "min")
    assert explorer.value == pytest.approx(found.value, rel=1e-12)
    explorer.member.value = "R at L0"
    explorer.redraw()
    assert explorer.line is truss.reaction("L0")
    explorer.position.value = 1e6  # off the travel: a message, nothing moves
    assert "is outside the load" in explorer.message.value
    assert "<ilkit truss explorer" in repr(explorer)
    explorer.close()
