"""Moving-load results in the views: the placement plot, tables and export, notebook displays, sheet
sections and the calculation sheet with a load model.  Every number shown is compared with the core's."""

from __future__ import annotations

import base64
import re
from pathlib import Path

import pandas as pd
import pytest
from IPython.core.formatters import DisplayFormatter

pytest.importorskip("matplotlib")

import ilkit
from ilkit import loads
from ilkit.views import plot_envelope, plot_placement, table, to_csv, to_latex, write_calculation_sheet
from ilkit.views._doc import Para
from ilkit.views.demo import highway_girder, highway_lines
from ilkit.views.derive import quantity_title
from ilkit.views.loaddraw import LoadArtists
from ilkit.views.moving_records import model_blocks, placement_blocks, placement_table
from ilkit.views.plot import short
from ilkit.views.report import CAUTION


@pytest.fixture(scope="module")
def girder() -> ilkit.Beam:
    return highway_girder()  # spans 90, 115, 90 ft, kip-ft


@pytest.fixture(scope="module")
def hl93() -> loads.LoadModel:
    return loads.hl93()


@pytest.fixture(scope="module")
def pier_moment(girder, hl93) -> ilkit.Extreme:
    return loads.place(girder.moment(90), hl93, "min", beam=girder)


def gid_artists(ax, prefix: str) -> list:
    found = [a for a in ax.findobj() if (a.get_gid() or "").startswith(prefix)]
    for twin in ax.figure.axes:
        if twin is not ax:
            found += [a for a in twin.findobj() if (a.get_gid() or "").startswith(prefix)]
    return found


# --------------------------------------------------------------------- the plot
def test_placement_plot_draws_the_core_positions_ordinates_and_patches(pier_moment) -> None:
    import matplotlib.pyplot as plt

    ax = plot_placement(pier_moment)
    counted = [a for p in pier_moment.placements for a in p.axles if a.counted]
    # the dots on the line are the counted axles at their ordinates (the two-truck case: six axles)
    (dots,) = gid_artists(ax, "load:dots")
    assert list(dots.get_xdata()) == [a.x for a in counted] and list(dots.get_ydata()) == [a.ordinate for a in counted]
    # the ordinates written are the core's numbers rounded, the largest first; a label that would cover
    # another is left to the table (regression: near-coincident axles stacked their labels)
    labels = [t for t in gid_artists(ax, "axle-ordinate:")]
    written = [t.get_text() for t in labels]
    assert set(written) <= {short(a.ordinate) for a in counted}
    assert short(max(counted, key=lambda a: abs(a.ordinate)).ordinate) in written
    ax.figure.canvas.draw()
    boxes = [t.get_window_extent() for t in labels]
    assert not any(a.overlaps(b) for i, a in enumerate(boxes) for b in boxes[i + 1:])
    # every counted axle's load is written, axles too close for a label each sharing one ("3 × 32 kip")
    loads_written = []
    for t in gid_artists(ax, "load:"):
        if hasattr(t, "get_text"):
            text = t.get_text().removesuffix(" kip")
            count, times, load = text.partition(" × ")
            loads_written += [load] * int(count) if times else text.split(" + ")
    assert sorted(loads_written) == sorted(short(a.load) for a in counted)
    # the lane covers the negative part of the line: one hatched band on the beam per patch
    lane = pier_moment.placements[1]
    (band,) = gid_artists(ax, "load:patches")
    corners = [(min(v[:, 0]), max(v[:, 0])) for v in (p.vertices for p in band.get_paths())]
    assert corners == [(p.start, p.end) for p in lane.patches]
    # the direction of travel
    (words,) = gid_artists(ax, "travel")
    assert words.get_text() == "travelling left to right →" == f"travelling {pier_moment.placements[0].direction} →"
    assert "Smallest bending moment M at x = 90 ft: -2218.3 kip·ft" in ax.get_title("left")
    plt.close(ax.figure)


def test_axles_that_do_not_count_are_drawn_apart_and_stand_loads_plot_too(girder) -> None:
    import matplotlib.pyplot as plt

    line = girder.moment(36)
    placed = ilkit.stand(line, loads.design_truck(), 10.0, direction="left to right")  # axles 2, 3 off the beam
    assert [a.counted for a in placed.axles] == [True, False, False]
    ax = plot_placement(placed)
    (idle,) = gid_artists(ax, "load:not-counted-heads")
    # off-beam axles within the frame are drawn whole; those beyond it are left out, never drawn cut by the
    # frame (regression: a train's arrow past the last support was clipped)
    assert [a.x for a in placed.axles] == [10.0, -4.0, -18.0]
    assert list(idle.get_xdata()) == [-4.0]
    lo, _ = ax.get_xlim()
    assert lo < -4.0
    assert "front at x = 10" in ax.get_title("left") and short(placed.effect, 5) in ax.get_title("left")
    plt.close(ax.figure)


def test_the_explorer_draws_the_load_with_the_same_artists(girder) -> None:
    pytest.importorskip("ipywidgets")
    from ilkit.views.explorer import Explorer

    explorer = Explorer(girder, {"truck": loads.design_truck(30.0)}, backend="inline")
    assert isinstance(explorer._figure._load, LoadArtists)
    explorer.close()


def test_placement_plot_refuses_what_it_cannot_draw() -> None:
    from ilkit.loads.results import LoadPlacement

    with pytest.raises(ilkit.UnsupportedResultError, match="an Extreme or a LoadPlacement"):
        plot_placement(object())  # type: ignore[arg-type]
    by_hand = LoadPlacement("truck", 1.0, 1.0, None, (), (), ())
    with pytest.raises(ilkit.UnsupportedResultError, match="does not know the influence line"):
        plot_placement(by_hand)


def test_envelope_plot_marks_the_absolute_maximum_and_writes_the_reactions(girder, hl93) -> None:
    import matplotlib.pyplot as plt

    env = loads.envelope(girder, hl93, divisions=5)
    ax = plot_envelope(env, "moment")
    (dot,) = [a for a in gid_artists(ax, "absolute-maximum") if a.get_gid() == "absolute-maximum"]
    best = env.absolute_maximum_moment
    assert dot.get_xdata()[0] == float(best.quantity.at) and dot.get_ydata()[0] == best.value
    ax = plot_envelope(env, "reaction")
    written = {t.get_gid(): t.get_text() for t in gid_artists(ax, "reaction-")}
    for _, row in env.reactions.iterrows():
        x = f"{row['x [ft]']:g}"
        assert written[f"reaction-max:{x}"] == short(row["R max [kip]"])
        assert written[f"reaction-min:{x}"] == short(row["R min [kip]"])
    plt.close("all")


# ------------------------------------------------------------- tables, export
def test_tables_are_the_core_frames_and_export(girder, hl93, pier_moment, tmp_path: Path) -> None:
    both = loads.extremes(girder.moment(36), hl93, beam=girder)
    pd.testing.assert_frame_equal(table(pier_moment), pier_moment.to_frame())
    pd.testing.assert_frame_equal(table(both), both.to_frame())
    env = loads.envelope(girder, hl93, divisions=4)
    pd.testing.assert_frame_equal(table(env), env.sections)
    placed = ilkit.stand(girder.moment(36), loads.design_truck(), 60.0)
    frame = table(placed)
    assert "x [ft]" in frame.columns and "effect [kip·ft]" in frame.columns
    assert frame["effect [kip·ft]"].sum() == pytest.approx(placed.effect)
    # CSV keeps full precision; LaTeX leaves missing cells empty
    back = pd.read_csv(to_csv(pier_moment, tmp_path / "pier.csv"), skiprows=1)  # the first line: the caution
    assert back["factored effect [kip·ft]"].sum() == pytest.approx(pier_moment.value, rel=1e-12)
    latex = to_latex(pier_moment)
    assert "nan" not in latex and r"factored effect [kip\ensuremath{\cdot}ft]" in latex
    assert "& yes &" in latex and "True" not in latex  # the counted column in words, not in math mode
    assert r"M max [kip\ensuremath{\cdot}ft]" in to_latex(env)


def test_excel_export_of_placements_and_envelopes(girder, hl93, pier_moment, tmp_path: Path) -> None:
    pytest.importorskip("openpyxl")
    from ilkit.views import to_excel

    env = loads.envelope(girder, hl93, divisions=4)
    path = to_excel({"pier moment": pier_moment, "sections": env, "reactions": env.reactions}, tmp_path / "r.xlsx")
    sheets = pd.read_excel(path, sheet_name=None)
    assert list(sheets) == ["pier moment", "sections", "reactions", "caution"]
    assert sheets["sections"]["M min [kip·ft]"].min() == pytest.approx(env.sections["M min [kip·ft]"].min())


def test_placement_table_prints_the_core_numbers(pier_moment) -> None:
    shown = placement_table(pier_moment)
    # one number per column, each with its unit (regression: "P [kip], q [kip/ft]" shared a column and the
    # area of a loaded stretch stood in the ordinate column without a unit)
    assert shown.header == ("load", "x [ft]", "P [kip]", "q [kip/ft]", "ordinate [kip·ft/kip]", "area [ft²]",
                            "counted", "factor (dynamic allowance × case factor)", "factored effect [kip·ft]")
    rows = iter(shown.rows)
    for p in pier_moment.placements:
        for a in p.axles:
            row = next(rows)
            assert row[0] == f"{p.load}, axle {a.number}" and row[1].split()[0] == short(a.x, 6)
            assert (row[2], row[3], row[5]) == (short(a.load, 5), "", "")
            assert row[4] == short(a.ordinate, 4) and row[8] == short(a.effect * p.factor, 5)
        for k, patch in enumerate(p.patches, start=1):
            row = next(rows)
            assert row[0] == f"{p.load}, patch {k}" and row[1] == f"{short(patch.start, 6)} to {short(patch.end, 6)}"
            assert (row[2], row[3], row[4]) == ("", short(patch.intensity, 5), "")
            assert row[5] == short(patch.effect / patch.intensity, 5) and row[8] == short(patch.effect * p.factor, 5)
    assert next(rows) == ("total", "", "", "", "", "", "", "", short(pier_moment.value, 5))


def test_placement_factor_is_written_with_its_parts_where_the_model_is_known(pier_moment, hl93) -> None:
    # regression: a factor of 1.197 appeared without its parts; HL-93's two-truck case: dynamic allowance
    # 33 % on the trucks times the case factor 0.90 (AASHTO LRFD 3.6.1.3.1 and 3.6.2.1, from memory)
    assert pier_moment.case == "90 % (two design trucks + lane)"
    trucks, lane = pier_moment.placements
    assert lane.factor == pytest.approx(0.9)
    assert trucks.factor == pytest.approx(1.33 * 0.9)
    shown = placement_table(pier_moment, hl93)
    assert {row[7] for row in shown.rows if row[0].startswith("two design trucks")} == {"1.33 × 0.9"}
    assert {row[7] for row in shown.rows if row[0].startswith("design lane")} == {"0.9"}
    blocks = placement_blocks(pier_moment, "4.2b", hl93)
    words = " ".join(b.items[0] for b in blocks if isinstance(b, Para))
    assert "× dynamic factor 1.33 × case factor 0.9 =" in words
    # without the model the column says what the factor holds
    assert placement_table(pier_moment).rows[0][7] == short(1.33 * 0.9, 4)


# ------------------------------------------------------------------- displays
def test_notebook_shows_placements_and_envelopes(girder, hl93, pier_moment) -> None:
    data, _ = DisplayFormatter().format(pier_moment)
    assert data["text/plain"] == repr(pier_moment)
    page = data["text/html"]
    (svg,) = re.findall(r'src="data:image/svg\+xml;base64,([^"]+)"', page)
    assert "travelling left to right" in base64.b64decode(svg).decode("utf-8")
    assert "Governing case: 90 % (two design trucks + lane)" in page and short(pier_moment.value, 5) in page
    both = loads.extremes(girder.reaction(90), hl93, beam=girder)
    page = DisplayFormatter().format(both)[0]["text/html"]
    assert page.count("<img") == 2 and short(both.maximum.value, 5) in page and short(both.minimum.value, 5) in page
    env = loads.envelope(girder, hl93, divisions=4)
    page = DisplayFormatter().format(env)[0]["text/html"]
    assert page.count("<img") == 4  # moment, shear, reactions, placement of the absolute maximum
    assert f"Absolute maximum (sagging) moment: {short(env.absolute_maximum_moment.value, 5)} kip·ft" in page
    placed = ilkit.stand(girder.moment(36), loads.design_truck(), 60.0)
    page = DisplayFormatter().format(placed)[0]["text/html"]
    assert "<img" in page and short(placed.effect, 5) in page


# ----------------------------------------------------------------- load models
def test_published_models_carry_their_sources_and_what_is_from_memory() -> None:
    # the data says what the docstrings say: a model built from values recalled from memory lists them
    for build in (loads.hl93, loads.fatigue_truck, loads.lm1, loads.lm2, loads.lm71, loads.sw0, loads.sw2,
                  loads.cooper):
        model = build()
        assert model.source and model.edition == ""
        assert bool(model.from_memory) == ("from memory" in (build.__doc__ or "")), build.__name__
        assert model.converted("kN-m" if model.units.name == "kip-ft" else "kip-ft").from_memory == model.from_memory
    assert any("3.6.1.3.1" in item for item in loads.hl93().from_memory)
    custom = loads.LoadModel("mine", [loads.Combination("mine", [loads.design_tandem()])], edition="2020",
                             from_memory="tandem spacing")
    assert custom.from_memory == ("tandem spacing",) and custom.edition == "2020"
    for bad in (3, [1.2], {"spacing": "1.2 m"}):
        with pytest.raises(ilkit.LoadInputError, match="from_memory"):
            loads.LoadModel("mine", [loads.Combination("mine", [loads.design_tandem()])], from_memory=bad)


def test_model_section_lists_definition_source_and_memory_items(girder) -> None:
    from ilkit.views._doc import to_text

    text = to_text(model_blocks(loads.hl93(), girder.units))
    assert "AASHTO LRFD Bridge Design Specifications, 3.6.1.2" in text
    assert "not recorded: the licensed current edition governs" in text
    assert "axles that do not add to the extreme are left off (3.6.1.3.1)" in text
    assert "3 axles of 8, 32, 32 kip (lead axle first), spaced 14, 14 to 30 ft" in text
    assert "33 % on design truck" in text and "negative moment and interior reactions" in text
    text = to_text(model_blocks(loads.lm2(), ilkit.Beam(10, {0: "pin", 10: "roller"}, units="kip-ft").units))
    assert "kN-m; converted exactly to the beam's kip-ft" in text and "Every value of this model was read" in text
    truck = to_text(model_blocks(loads.LoadModel("my truck", [loads.Combination("t", [loads.design_truck()])])))
    assert "not recorded (a load defined for this study)" in truck
    # a notebook shows a model with the same section
    data, _ = DisplayFormatter().format(loads.lm71())
    assert data["text/plain"] == repr(loads.lm71())
    assert "EN 1991-2 (Eurocode 1, traffic loads on bridges), 6.3.2" in data["text/html"]
    assert "the values of α (6.3.2)" in data["text/html"]


# ------------------------------------------------------------------ the sheet
@pytest.fixture(scope="module")
def highway_sheet(tmp_path_factory, girder, hl93):
    lines = highway_lines(girder)
    sheet = write_calculation_sheet(girder, tmp_path_factory.mktemp("hw") / "hw", lines=lines, load=hl93,
                                    divisions=6)
    return sheet, lines


def test_sheet_with_a_load_model_holds_model_placements_and_envelope(highway_sheet, girder, hl93) -> None:
    sheet, lines = highway_sheet
    markdown = sheet.markdown.read_text(encoding="utf-8")
    page = sheet.html.read_text(encoding="utf-8")
    for text in (markdown, page):
        assert text.count(CAUTION) == 2
    headings = re.findall(r"^## (.+)$", markdown, flags=re.M)
    assert headings == ["1. Inputs", "2. Load model", "3. Influence lines", "4. Governing placements",
                        "5. Envelope", "6. Method and sources"]
    assert "two-truck rule: 90 % of two design trucks" in markdown and "Table 3.6.2.1-1" in markdown
    # every line's governing placements, with the core's values
    for i, line in enumerate(lines, start=1):
        both = loads.extremes(line, hl93, beam=girder)
        for tag, found in (("a", both.maximum), ("b", both.minimum)):
            word = "Largest" if found.extreme == "max" else "Smallest"
            assert re.search(rf"### 4\.{i}{tag} {word} .*: {re.escape(short(found.value, 5))} ", markdown)
            assert f"| total |  |  |  |  |  |  |  | {short(found.value, 5)} |" in markdown
        # the summary row at the head of the chapter
        hi, lo = both.maximum, both.minimum
        assert (f"| 4.{i} | {quantity_title(line.quantity, 'ft')} | {short(hi.value, 5)} {hi.unit} | {hi.case} | "
                f"{short(lo.value, 5)} {lo.unit} | {lo.case} |") in markdown
    assert "| see | quantity | largest | governing case | smallest (most negative) | governing case |" in markdown
    # the envelope: its tables hold the core's values, and the absolute maximum is placed
    env = loads.envelope(girder, hl93, divisions=6)
    for _, row in env.sections.iterrows():
        if abs(row["M max [kip·ft]"]) > 1e-6:
            assert f"| {short(row['M max [kip·ft]'], 5)} | {row['M max case']} |" in markdown
    best = env.absolute_maximum_moment
    assert f"### 5.1.1 Largest bending moment M at x = {short(float(best.quantity.at), 6)} ft" in markdown
    # figures: beam, one sketch per line, two placements per line, three envelopes, the absolute maximum
    figures = re.findall(r"!\[[^\]]*\]\(([^)]+)\)", markdown)
    assert len(figures) == 1 + len(lines) + 2 * len(lines) + 3 + 1
    assert all((sheet.markdown.parent / f).is_file() for f in figures)
    assert "every axle train is tried in both directions" in markdown


def test_sheet_with_a_load_needs_units_and_skips_deflections(tmp_path: Path, hl93) -> None:
    bare = ilkit.Beam(20, {0: "pin", 20: "roller"})
    with pytest.raises(ilkit.UnitsError, match="declares no units"):
        write_calculation_sheet(bare, tmp_path / "bare", load=hl93)
    assert not (tmp_path / "bare.html").exists()
    beam = ilkit.Beam(20, {0: "pin", 20: "roller"}, EI=4e6, units="kN-m")
    sheet = write_calculation_sheet(beam, tmp_path / "defl", lines=[beam.deflection(10), beam.moment(10)],
                                    load=loads.lm1(), divisions=2)
    markdown = sheet.markdown.read_text(encoding="utf-8")
    assert "### 4.1a Largest bending moment M at x = 10 m" in markdown and "deflection δ at x = 10 m:" not in markdown
    # LM1 lane 1 on a 20 m simple span, moment at midspan (closed form written out here): the midspan
    # line is a triangle of height L/4 = 5; the tandem (2 x 300 kN, EN 1991-2 Table 4.2; 1.2 m apart, from
    # memory) gives 300 (5 + 4.4) = 2820 kN·m with an axle at midspan; the uniform 9 kN/m² x 3 m = 27 kN/m
    # covers the whole span, area L²/8 = 50 m²: 1350 kN·m.  Total 4170 kN·m.
    found = loads.place(beam.moment(10), loads.lm1(), "max")
    assert found.value == pytest.approx(4170.0, rel=1e-12)
    assert f"| total |  |  |  |  |  |  |  | {short(found.value, 5)} |" in markdown


def test_placement_labels_of_near_coincident_axles_are_one_label_not_a_stack(girder) -> None:
    import matplotlib.pyplot as plt

    # the tandem's two axles 4 ft apart on a 295 ft girder (regression: their labels stacked, 16.94 over 18.72)
    found = loads.place(girder.moment(36), loads.design_tandem(), "max", beam=girder)
    ax = plot_placement(found)
    assert [t.get_text() for t in gid_artists(ax, "load:") if hasattr(t, "get_text")] == ["2 × 25 kip"]
    largest = max(found.placements[0].axles, key=lambda a: abs(a.ordinate))
    assert [t.get_text() for t in gid_artists(ax, "axle-ordinate:")] == [short(largest.ordinate)]
    plt.close(ax.figure)


def test_cooper_placement_draws_no_cut_arrow_and_labels_every_loaded_stretch() -> None:
    import matplotlib.pyplot as plt

    from ilkit.views.loaddraw import PATCH_TOP

    rail = ilkit.Beam(24, {0: "pin", 24: "roller"}, units="kN-m")
    found = loads.place(rail.moment(12), loads.cooper(80))
    ax = plot_placement(found)
    lo, hi = ax.get_xlim()
    for gid in ("load:not-counted-heads", "load:heads"):
        (heads,) = gid_artists(ax, gid)
        assert all(lo < x < hi for x in heads.get_xdata())  # regression: an arrow past the support was cut
    # the trailing uniform load's stretch is short: its label stands above it (regression: no room, no label)
    stretches = [s for p in found.placements for s in p.patches]
    assert stretches and len([t for t in gid_artists(ax, "patch:")]) == len(stretches)
    # load labels stand above the hatching of a loaded stretch (regression: drawn over it)
    for t in gid_artists(ax, "load:"):
        if hasattr(t, "get_text"):
            assert t.xy[1] >= PATCH_TOP
    plt.close(ax.figure)


def test_notebook_displays_of_placements_and_envelopes_carry_the_caution(girder, hl93, pier_moment) -> None:
    # regression: the caution was in the sheets only, not where results are used in a notebook
    from ilkit.views.caution import CAUTION_SHORT

    env = loads.envelope(girder, hl93, divisions=2)
    placed = ilkit.stand(girder.moment(36), loads.design_truck(), 60.0)
    for result in (pier_moment, loads.extremes(girder.moment(36), hl93, beam=girder), env, placed):
        assert CAUTION_SHORT in DisplayFormatter().format(result)[0]["text/html"], type(result).__name__


def test_the_word_seen_in_the_load_model_docstrings_is_defined() -> None:
    # regression: the docstrings marked values "seen" without saying what it means
    from ilkit.loads import models

    uses = [name for name in models.__all__ if "seen" in (getattr(models, name).__doc__ or "")]
    words = " ".join(models.__doc__.split())
    assert uses and "says **seen**" in words and "read in a copy of the standard" in words


def test_placement_figure_files_are_named_without_values(highway_sheet) -> None:
    # regression: names such as "...-M-at-x---36-ft---561-88-kip-ft.svg" lost the minus signs of the values
    sheet, _ = highway_sheet
    names = sorted(p.name for p in sheet.figures.iterdir())
    placements = [n for n in names if n.startswith("placement-")]
    assert "placement-4-1b-smallest-M-at-x-36.svg" in placements
    assert "placement-4-3a-largest-V-at-x-90-right.svg" in placements
    pattern = r"placement-[\d-]+[ab]?-(largest|smallest)-\w+-at-x-[\d.]+(-left|-right)?\.svg"
    assert all(re.fullmatch(pattern, n) for n in placements), placements  # no values, units or signs to lose
    assert len(set(names)) == len(names)


def test_zero_extremes_name_no_governing_case(highway_sheet) -> None:
    # regression: the envelope named a governing case beside a moment of 0 at an end support
    from ilkit.views.moving_records import NO_CASE

    sheet, _ = highway_sheet
    markdown = sheet.markdown.read_text(encoding="utf-8")
    assert f"| 0 |  | 0 | {NO_CASE} | 0 | {NO_CASE} |" in markdown  # x = 0: M max and M min are zero
