"""Views of a batch run: the summary table and display, the histogram across the inventory, one girder's
sheet on demand (named after an escaped id, inside its folder)."""

from __future__ import annotations

import pytest

import ilkit
from ilkit import batch, views

pytest.importorskip("pyarrow")
pytest.importorskip("matplotlib")

RECORDS = [*batch.sample_inventory(5, seed=3, spans=(1, 2), lengths=(30.0, 60.0)),
           {"id": "../escaped", "units": "kN-m", "spans": [20, 20], "EI": 1e6, "live": "LM1"},
           {"id": "/absolute/girder", "units": "kip-ft", "spans": [40], "live": "HL-93"},
           {"id": "broken", "units": "kip-ft", "spans": [40], "hinges": [20], "live": "HL-93"}]


@pytest.fixture(scope="module")
def result(tmp_path_factory):
    return batch.run(RECORDS, tmp_path_factory.mktemp("views") / "run", models=["HL-93"], divisions=4,
                     workers=1, progress=False)


def test_the_table_is_the_summary_and_the_display_names_what_is_not_done(result):
    assert views.table(result).equals(result.summary())
    bundle = result._repr_mimebundle_()
    assert "7 done" in bundle["text/html"] and "1 invalid" in bundle["text/html"]
    assert "broken" in bundle["text/html"] and "hinges" in bundle["text/html"]
    assert "qualified engineer" in bundle["text/html"]


def test_the_histogram_counts_every_girder_done_once_per_unit_system(result):
    ax = views.plot_inventory(result, "moment", "max", bins=5)
    labels = [t.get_text() for t in ax.get_legend().get_texts()]
    heights = {label: sum(b.get_height() for b in bars) for label, bars in zip(labels, ax.containers)}
    assert heights == {"kN-m: 1 girders (kN·m)": 1, "kip-ft: 6 girders (kip·ft)": 6}
    assert "7 girders done, 1 not done" in ax.get_title(loc="left")
    with pytest.raises(ilkit.BatchInputError, match="quantity"):
        views.plot_inventory(result, "torque")


@pytest.mark.parametrize("girder", ["../escaped", "/absolute/girder"])
def test_a_girder_sheet_is_written_inside_the_folder_whatever_its_id(result, tmp_path, girder):
    folder = tmp_path / "sheets"
    sheet = views.write_girder_sheet(result, girder, folder)
    assert sheet.html.parent == folder and sheet.html.exists()
    assert all(folder in p.parents for p in tmp_path.rglob("*") if p != folder)
    page = sheet.html.read_text(encoding="utf-8")
    assert f"Girder {girder}" in page and "qualified engineer" in page


def test_a_reopened_run_gives_the_same_sheet_numbers(result):
    again = batch.open_run(result.folder)
    assert again.summary().equals(result.summary())
    computed = again.compute(RECORDS[0]["id"])
    rows = result.girder(RECORDS[0]["id"])
    frame = computed[0][2].frame
    assert rows["max"].tolist() == frame["max"].tolist()


def test_the_demo_page_of_an_inventory_run(tmp_path):
    from ilkit.views.inventory import write_inventory_demo

    page = write_inventory_demo(tmp_path, 4, workers=1, progress=False)
    text = page.read_text(encoding="utf-8")
    assert page.name == "inventory_run.html" and "qualified engineer" in text
    assert text.count("<img src=\"data:image/svg+xml;base64,") == 4
    assert all(f"<td>G000{i}</td>" in text for i in range(1, 5))
    assert (tmp_path / "inventory_run_summary.csv").read_text(encoding="utf-8").count("\nG000") == 4
    again = batch.open_run(tmp_path / "inventory_run")
    assert len(again.summary()) == 4
    # the rating of the girders with resistances (G0001 of four), linked from the page
    assert "<a href='inventory_rating.html'>" in text
    rating_page = (tmp_path / "inventory_rating.html").read_text(encoding="utf-8")
    assert "<td>G0001</td>" in rating_page and "<td>G0002</td>" not in rating_page
    assert "licensed engineer" in rating_page and rating_page.count("data:image/svg+xml;base64,") == 1
    assert "<td>Type 3S2</td>" in rating_page and "girders with RF &lt; 1" in rating_page
    rated = batch.open_run(tmp_path / "inventory_rating").summary()
    assert rated["girder"].tolist() == ["G0001"] and rated["status"].tolist() == ["done"]
