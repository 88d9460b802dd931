"""The design demo: the study behind `make demo`'s sheet is the notebook's, and the sheet says what it must."""

from __future__ import annotations

import re
from pathlib import Path

import pytest

nbformat = pytest.importorskip("nbformat")
pytest.importorskip("matplotlib")
pytest.importorskip("pint")

from ilkit.views.caution import CAUTION  # noqa: E402
from ilkit.views.demo_girder import composite_girder_study, write_composite_girder_sheet  # noqa: E402

ROOT = Path(__file__).resolve().parents[1]
NOTEBOOK = ROOT / "notebooks" / "design_girder.ipynb"


@pytest.fixture(scope="module")
def study():
    return composite_girder_study()


def _source() -> str:
    return "\n".join(c.source for c in nbformat.read(NOTEBOOK, as_version=4).cells if c.cell_type == "code")


def _printed() -> str:
    nb = nbformat.read(NOTEBOOK, as_version=4)
    return "\n".join(o.get("text", "") for c in nb.cells if c.cell_type == "code" for o in c.outputs)


def test_the_notebook_defines_the_bridge_of_the_sheet():
    source = _source()
    for text in ('CrossSection(girders=5, spacing=9.0, overhang=3.5, barrier=1.25, units="kip-ft")',
                 "eg = (56.375 - 24.9) + 2.0 + 8.5 / 2",
                 "longitudinal_stiffness(n=8, inertia=37_600, area=71.1, eccentricity=eg)",
                 '"steel alone": (37_600, 68_000)', '"composite, long-term (3n)": (82_000, 76_000)',
                 '"composite, short-term (n)": (110_000, 76_000)',
                 'supports = {0: "pin", 110: "roller", 250: "roller", 360: "roller"}',
                 "(0, 88, a), (88, 138, b), (138, 222, a), (222, 272, b), (272, 360, a)",
                 'DistributedLoad("DC1 steel and cross-frames", "DC", 0.22)',
                 'DistributedLoad("DC2 barriers", "DC", 0.16)', 'DistributedLoad("DW wearing surface", "DW", 0.20)',
                 'dead_loads("interior", 1.00)', 'dead_loads("exterior", 0.93)', "span=110", "diaphragms=True"):
        assert text in source, text


def test_the_sheets_numbers_are_the_notebooks(study):
    """The worked value the notebook prints (Strength I moment at x = 44 ft, interior girder) and its deflection
    check are the study's."""
    printed = _printed()
    shown = float(re.search(r"ilkit ([-\d.]+) kip·ft", printed).group(1))
    interior = study.girders["interior"]["factored"]
    assert interior.value("moment", 44, "Strength I") == pytest.approx(shown, abs=0.05)
    assert study.girders["interior"]["distribution"].moment.value == pytest.approx(
        float(re.search(r"gM = ([\d.]+)", printed).group(1)), abs=5e-5)
    assert "N_L 3.00 × m 0.85 × 1/N_b 0.20" in printed and study.deflection.passes


def test_the_study_covers_both_girders_every_limit_state_and_the_governing_sections(study):
    names = ["Strength I", "Strength II", "Service I", "Service II", "Service III", "Fatigue I", "Fatigue II"]
    for where in ("interior", "exterior"):
        g = study.girders[where]
        assert [s.name for s in g["factored"].limit_states] == names
        assert not g["factored"].factors["Fatigue I"]["moment"].contains("multiple presence")
        assert g["concurrent"].girder == f"HL-93, {where} girder"
        # the governing sections: largest sagging moment in the middle span, hogging over the first pier
        moments = set(g["concurrent"].frame.loc[g["concurrent"].frame["quantity"] == "moment", "x"])
        assert moments == {110.0, 180.0}
    # the exterior girder's one-lane lever-rule share governs it, by statics: girders at 3.5 and 12.5 ft from the
    # deck edge, wheel lines 2 ft from the barrier (1.25 ft) and 6 ft apart, half the lane load on each, times
    # m = 1.20 (AASHTO LRFD 3.6.1.3.1 and Table 3.6.1.1.2-1, from memory), applied once
    by_statics = 1.2 * ((12.5 - 3.25) / 9 + (12.5 - 9.25) / 9) / 2
    assert study.lever.factor.value == pytest.approx(by_statics, rel=1e-12)
    assert study.girders["exterior"]["distribution"].moment.value == pytest.approx(by_statics, rel=1e-12)


def test_the_sheet_lists_every_factor_its_source_and_status_and_the_caution(tmp_path):
    sheet = write_composite_girder_sheet(tmp_path)
    assert sheet.html.exists() and sheet.html.name == "composite_girder.html"
    text = sheet.markdown.read_text(encoding="utf-8")
    for words in ("Distribution to girder 3 (interior)", "Distribution to girder 1 (exterior)",
                  "within the range of applicability", "Lanes across the deck: girder 1",
                  "Permanent loads: interior girder", "Permanent loads: exterior girder",
                  "Factored envelopes: HL-93, interior girder; fatigue truck, interior girder",
                  "Factored envelopes: HL-93, exterior girder; fatigue truck, exterior girder",
                  "Concurrent forces: HL-93, interior girder", "Concurrent forces: HL-93, exterior girder",
                  "Live-load deflection", "Tables 3.4.1-1 and 3.4.1-2", "Table 3.6.1.1.2-1",
                  "recalled from memory: check it", "Fatigue II", "Service III", CAUTION):
        assert words in text, words
