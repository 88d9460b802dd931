"""Views of load ratings: the RF plot, tables, displays, sheet sections, the rating sheet in HTML, Markdown and PDF."""

from __future__ import annotations

import io

import pytest

import ilkit
from ilkit import rating, views
from ilkit.design import DistributedLoad, given_distribution, permanent_effects

pytest.importorskip("matplotlib")

BEAM = ilkit.Beam(150, {0: "pin", 45: "roller", 105: "roller", 150: "roller"}, EI=5e7, units="kip-ft")
DEAD = [DistributedLoad("steel and deck", "DC", 1.1), DistributedLoad("overlay", "DW", 0.2)]


@pytest.fixture(scope="module")
def rated():
    perm = permanent_effects(BEAM, DEAD, divisions=4, quantities=("moment", "shear"))
    permit = rating.permit_load(rating.permit_vehicle([18, 36, 36, 36], [13, 4.5, 24], name="mill transformer"),
                                "routine", adtt=800)
    return rating.rate_girder(
        BEAM, permanent=perm, distribution=given_distribution(0.65, 0.75), divisions=4, adtt=800,
        loads=["design", "Type 3", "Type 3S2", "lane-type", permit],
        resistances=rating.Resistances(positive_moment=[(0, 150, 3200)], negative_moment=2900, shear=260,
                                       name="our girder"))


def test_rf_plot_draws_every_vehicle_and_the_line_of_one(rated):
    ax = views.plot_rating(rated)
    gids = {a.get_gid() for a in ax.lines}
    assert {f"rf:{r.name}" for r in rated.loads} <= gids and "rf-one" in gids
    # the plotted values are the table's smallest RF per section
    line = next(a for a in ax.lines if a.get_gid() == "rf:Type 3")
    assert min(line.get_ydata()) == pytest.approx(rated.controlling().set_index("vehicle").loc["Type 3", "RF"])
    with pytest.raises(ilkit.RatingInputError):
        views.plot_rating(rated, "Type 9")


def test_tables_and_displays(rated):
    frame = views.table(rated)
    assert {"vehicle", "quantity", "x", "side", "sense", "RF", "limit_state", "placement"} <= set(frame.columns)
    html = rated._repr_mimebundle_()["text/html"]
    for name in ("HL-93 inventory", "Type 3S2", "mill transformer", "sealed, by a licensed professional engineer"):
        assert name in html
    assert "Strength II" in html and "recalled from memory" in html


def test_rating_sheet_in_html_markdown_and_pdf(rated, tmp_path):
    pypdf = pytest.importorskip("pypdf")
    pytest.importorskip("weasyprint")
    sheet = views.write_rating_sheet(
        rated, tmp_path / "rating", pdf=True,
        title_block={"bridge": "Quarry Road overpass", "girder": "G3", "engineer": "J. Doe", "checker": "R. Roe",
                     "date": "2026-12-04", "revision": "B"})
    text_html = sheet.html.read_text(encoding="utf-8")
    text_md = sheet.markdown.read_text(encoding="utf-8")
    reader = pypdf.PdfReader(io.BytesIO(sheet.pdf.read_bytes()))
    text_pdf = " ".join(page.extract_text() for page in reader.pages)
    text_pdf = " ".join(text_pdf.split())
    for text in (text_html, text_md, text_pdf):
        for words in ("Quarry Road overpass", "J. Doe", "R. Roe", "revision", "Load rating sheet",
                      "sealed, by a licensed professional engineer", "mill transformer", "Governing placements",
                      "recalled from memory"):
            assert words in text or words.upper() in text, words
    # the controlling RF of each vehicle is printed as the table rounds it
    for _, row in rated.controlling().iterrows():
        assert f"{row['RF']:.3g}" in text_pdf
    assert "<script" not in text_html and "http" not in text_html.replace("http://www.w3.org", "")
    assert len(list(sheet.figures.glob("*.svg"))) == 2 + len(rated.loads)  # the beam, RF along, placements


def test_rating_sheet_without_pdf_and_bad_input(rated, tmp_path):
    sheet = views.write_rating_sheet(rated, tmp_path / "no-pdf.html", pdf=False)
    assert sheet.pdf is None and sheet.html.exists() and not (tmp_path / "no-pdf.pdf").exists()
    with pytest.raises(ilkit.RatingInputError):
        views.write_rating_sheet("not a rating", tmp_path / "x")


def test_rail_rating_views(rated, tmp_path):
    perm = permanent_effects(BEAM, DEAD, divisions=4, quantities=("moment", "shear"))
    cap = rating.Resistances(positive_moment=2600, negative_moment=2400, shear=220)
    rail = rating.cooper_rating(BEAM, permanent=perm, capacity={"normal": cap}, girder_spacing=7, divisions=4)
    ax = views.plot_rail_rating(rail)
    assert "rating:normal" in {a.get_gid() for a in ax.lines}
    assert "Cooper E-rating" in rail._repr_mimebundle_()["text/html"]
    sheet = views.write_rating_sheet(rated, tmp_path / "with-rail", rail=rail, pdf=False)
    assert "Cooper E-rating (AREMA)" in sheet.markdown.read_text(encoding="utf-8")
    # a sheet section through the calculation sheet's results=
    calc = views.write_calculation_sheet(BEAM, tmp_path / "calc", lines=[], results=[rated, rail])
    assert "Load rating (LRFR)" in calc.html.read_text(encoding="utf-8")
