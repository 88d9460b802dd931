"""Calculation sheets: contents, files and errors (tests/browser/test_calculation_sheet.py opens one)."""

from __future__ import annotations

import re
from fractions import Fraction
from html.parser import HTMLParser
from pathlib import Path

import pytest

import ilkit
from ilkit.views import _doc, derivation, write_calculation_sheet
from ilkit.views.demo import demo_lines, suspended_span_girder, write_demo_sheet
from ilkit.views.plot import short
from ilkit.views.report import CAUTION, default_lines, report_section


@pytest.fixture(scope="module")
def demo_sheet(tmp_path_factory: pytest.TempPathFactory):
    return write_demo_sheet(tmp_path_factory.mktemp("sheet"))


class _Tags(HTMLParser):
    VOID = frozenset({"meta", "img", "br", "hr", "link", "input"})

    def __init__(self) -> None:
        super().__init__()
        self.stack: list[str] = []
        self.errors: list[str] = []

    def handle_starttag(self, tag: str, attrs: list) -> None:
        if tag not in self.VOID:
            self.stack.append(tag)

    def handle_endtag(self, tag: str) -> None:
        if not self.stack or self.stack[-1] != tag:
            self.errors.append(f"</{tag}> closes {self.stack[-1:] or 'nothing'}")
        else:
            self.stack.pop()


def test_sheet_files_and_balanced_html(demo_sheet) -> None:
    assert demo_sheet.html.name == "girder.html" and demo_sheet.markdown.name == "girder.md"
    page = demo_sheet.html.read_text(encoding="utf-8")
    parser = _Tags()
    parser.feed(page)
    assert parser.errors == [] and parser.stack == []
    assert "http://" not in page.replace("http://www.w3.org", "") and "<script" not in page  # self-contained


def test_sheet_carries_the_caution_inputs_lines_and_derivations(demo_sheet) -> None:
    beam = suspended_span_girder()
    page = demo_sheet.html.read_text(encoding="utf-8")
    markdown = demo_sheet.markdown.read_text(encoding="utf-8")
    for text in (page, markdown):
        assert text.count(CAUTION) == 2  # at the start and at the end
        assert "qualified engineer" in CAUTION and "governing design codes" in CAUTION
        assert "degree of indeterminacy" in text and "32 m (0 to 32 m), 44 m (32 to 76 m)" in text
    for i, line in enumerate(demo_lines(beam), start=1):
        d = derivation(line)
        assert f"2.{i} {_doc._md_text(d.title)}" in markdown
        # the derivation's final expression is in the Markdown, as LaTeX
        cases = d.to_markdown().split("$$")[-2].strip()
        assert cases in markdown
        # the ordinate table holds the core values
        for x, left, right in line.knot_values():
            assert f"| {short(x)} | {short(left)} | {short(right)} |" in markdown
    assert page.count("<math") > 50 and "<mtable" in page


def test_markdown_figures_are_files_beside_it(demo_sheet) -> None:
    markdown = demo_sheet.markdown.read_text(encoding="utf-8")
    links = re.findall(r"!\[[^\]]*\]\(([^)]+)\)", markdown)
    assert len(links) == 1 + len(demo_lines(suspended_span_girder()))
    for link in links:
        target = demo_sheet.markdown.parent / link
        assert target.is_file() and target.read_text(encoding="utf-8").lstrip().startswith("<?xml")


def test_paths_suffixes_and_default_lines(tmp_path: Path) -> None:
    beam = ilkit.Beam(20, {0: "fixed", 12: "roller"}, hinges=[8], units="kip-ft")
    lines = default_lines(beam)
    assert [line.quantity.label for line in lines] == ["R at x=0", "R at x=12", "M_R at x=0", "M at x=6"]
    for given in ("a/sheet", "a/sheet.html", "a/sheet.md"):
        out = write_calculation_sheet(beam, tmp_path / given, lines=lines[:1])
        assert out.html == tmp_path / "a" / "sheet.html" and out.markdown.exists()
    with pytest.raises(ilkit.BeamInputError, match=r"ends in '\.pdf'.*'\.html' or '\.md'"):
        write_calculation_sheet(beam, tmp_path / "sheet.pdf")


def test_results_and_lines_the_sheet_cannot_explain_are_errors(tmp_path: Path) -> None:
    beam = suspended_span_girder()
    with pytest.raises(ilkit.UnsupportedResultError, match="no sheet section for object"):
        write_calculation_sheet(beam, tmp_path / "s", lines=[], results=[object()])
    from ilkit.influence import InfluenceLine
    from ilkit.quantity import Quantity

    numeric = InfluenceLine(quantity=Quantity("moment", Fraction(5)), knots=(0.0, 10.0), coefficients=((0.0, 1.0),))
    with pytest.raises(ilkit.NoDerivationError):
        write_calculation_sheet(beam, tmp_path / "s", lines=[numeric])
    with pytest.raises(ilkit.UnsupportedResultError):
        report_section(3.5, "3.1")


def test_demo_runner_writes_the_sheet_and_links_it(tmp_path: Path) -> None:
    from ilkit import demo

    (tmp_path / "no-notebooks").mkdir()
    index = demo.run(tmp_path / "out", notebooks=tmp_path / "no-notebooks")
    assert 'href="girder.html"' in index.read_text(encoding="utf-8")
    assert (tmp_path / "out" / "girder.md").is_file() and (tmp_path / "out" / "girder_figures" / "beam.svg").is_file()


def test_sheet_of_a_continuous_beam_writes_the_force_method(tmp_path: Path) -> None:
    beam = ilkit.Beam(60, {0: "pin", 20: "roller", 40: "roller", 60: "roller"}, EI=2_000_000, units="kN-m")
    lines = default_lines(beam)
    assert [line.quantity.label for line in lines][:4] == ["R at x=0", "R at x=20", "R at x=40", "R at x=60"]
    sheet = write_calculation_sheet(beam, tmp_path / "continuous", lines=lines[:2])
    markdown = sheet.markdown.read_text(encoding="utf-8")
    assert "3 (indeterminate)" not in markdown and "2 (indeterminate)" in markdown
    assert "stiffness method with prismatic beam elements" in markdown and "Müller-Breslau principle (virtual" \
        not in markdown
    # the derivations are the force method's: primary structure, redundants, flexibility coefficients
    assert "Redundants and primary structure" in markdown and "Flexibility coefficients" in markdown
    assert "vertical reaction at x=20" in markdown and "supports pin at 0 m, roller at 60 m" in markdown
    assert "force (flexibility) method on a determinate primary structure" in markdown


@pytest.mark.parametrize(
    "supports",
    [{0: "pin", 10: "fixed", 26: "roller"}, {0: "pin", 10: ilkit.Spring(rotational=2e4), 26: "roller"}],
    ids=["interior fixed support", "interior rotational spring"],
)
def test_sheet_with_a_load_model_on_a_beam_whose_moment_jumps_at_a_support(tmp_path: Path, supports) -> None:
    # regression: the envelope behind the sheet sorted ties of two faces on result objects (TypeError)
    beam = ilkit.Beam(26, supports, EI=1e5, units="kN-m")
    lane = ilkit.UniformLoad(5, units="kN-m", name="lane")
    sheet = write_calculation_sheet(beam, tmp_path / "s", lines=[beam.moment(5)], load=lane, divisions=4)
    markdown = sheet.markdown.read_text(encoding="utf-8")
    env = ilkit.envelope(beam, lane, divisions=4)
    best = env.absolute_maximum_moment
    assert "Envelope" in markdown and short(best.value, 5) in markdown


def _files(folder: Path) -> dict[str, bytes]:
    """Every file under ``folder`` (hidden temporaries included) with its bytes."""
    return {str(p.relative_to(folder)): p.read_bytes() for p in sorted(folder.rglob("*")) if p.is_file()}


@pytest.fixture
def small_sheet(tmp_path: Path):
    beam = ilkit.Beam(20, {0: "pin", 20: "roller"}, units="kN-m")
    write_calculation_sheet(beam, tmp_path / "s", lines=[beam.moment(5)], title="first")
    return beam, tmp_path, _files(tmp_path)


def test_sheet_whose_markdown_fails_keeps_the_old_html_and_markdown(small_sheet, monkeypatch) -> None:
    from ilkit.views import _doc

    beam, folder, before = small_sheet

    def broken(*args, **kwargs):
        raise RuntimeError("markdown trouble")

    monkeypatch.setattr(_doc, "to_markdown", broken)
    with pytest.raises(RuntimeError, match="markdown trouble"):
        write_calculation_sheet(beam, folder / "s", lines=[beam.moment(8)], title="second")
    assert _files(folder) == before  # never new HTML beside old Markdown


def test_sheet_whose_rename_fails_half_way_puts_every_file_back(small_sheet, monkeypatch) -> None:
    import os

    beam, folder, before = small_sheet
    real_replace = os.replace
    calls = []

    def fail_on_third(src, dst):
        calls.append(dst)
        if len(calls) == 3:
            raise OSError(5, "Input/output error", str(src))
        return real_replace(src, dst)

    monkeypatch.setattr(os, "replace", fail_on_third)
    with pytest.raises(ilkit.WriteError, match="Existing files were left as they were"):
        write_calculation_sheet(beam, folder / "s", lines=[beam.moment(8), beam.shear(8, side="left")], title="2")
    monkeypatch.undo()
    assert _files(folder) == before  # the HTML and Markdown renamed first are put back; no new figure stays


def test_sheet_over_a_folder_or_read_only_file_is_a_write_error(small_sheet) -> None:
    beam, folder, before = small_sheet
    (folder / "t.md").mkdir()
    with pytest.raises(ilkit.WriteError, match="it is a folder"):
        write_calculation_sheet(beam, folder / "t", lines=[])
    (folder / "s.md").chmod(0o444)
    with pytest.raises(ilkit.WriteError, match="read-only"):
        write_calculation_sheet(beam, folder / "s", lines=[beam.moment(8)])
    assert _files(folder) == before
    (folder / "u_figures").write_text("mine", encoding="utf-8")
    with pytest.raises(ilkit.WriteError, match="a part of the path is a file, not a folder"):
        write_calculation_sheet(beam, folder / "u", lines=[])
    assert not (folder / "u.html").exists()


def test_demo_into_a_file_taken_for_a_folder_is_a_write_error(tmp_path: Path) -> None:
    from ilkit import demo

    (tmp_path / "out").write_text("mine", encoding="utf-8")
    (tmp_path / "no-notebooks").mkdir()
    with pytest.raises(ilkit.WriteError, match="a part of the path is a file, not a folder"):
        demo.run(tmp_path / "out", notebooks=tmp_path / "no-notebooks")
    assert (tmp_path / "out").read_text(encoding="utf-8") == "mine"


def test_sheet_with_a_line_of_another_beam_is_refused(tmp_path: Path) -> None:
    # regression: the sheet of one beam showed a line of another beam, mixing two structures in one record
    beam = ilkit.Beam(20, {0: "pin", 20: "roller"}, units="kN-m")
    other = ilkit.Beam(24, {0: "pin", 24: "roller"}, units="kN-m")
    with pytest.raises(ilkit.BeamInputError, match=r"lines\[1\] \(M at x=5\) belongs to another beam") as caught:
        write_calculation_sheet(beam, tmp_path / "s", lines=[beam.moment(5), other.moment(5)])
    assert caught.value.field == "lines"
    # the same beam in other units is another beam in numbers: refused too
    with pytest.raises(ilkit.BeamInputError, match="belongs to another beam"):
        write_calculation_sheet(beam, tmp_path / "s", lines=[beam.in_units("kip-ft").moment(5)])
    # results (placements, envelopes) of another beam likewise
    lane = ilkit.UniformLoad(5, units="kN-m", name="lane")
    for result in (ilkit.extremes(other.moment(5), lane, beam=other), ilkit.envelope(other, lane, divisions=2),
                   ilkit.place(other.moment(5), lane, beam=other)):
        with pytest.raises(ilkit.BeamInputError, match=r"results\[0\] .* belongs to another beam"):
            write_calculation_sheet(beam, tmp_path / "s", lines=[], results=[result])
    assert not any(tmp_path.iterdir())
    # an equal beam built again is the same beam
    twin = ilkit.Beam(20, {0: "pin", 20: "roller"}, units="kN-m")
    write_calculation_sheet(beam, tmp_path / "s", lines=[twin.moment(5)],
                            results=[ilkit.extremes(twin.moment(5), lane, beam=twin)])


def test_sheet_headings_write_symbols_with_subscripts_not_underscores(demo_sheet) -> None:
    # regression: the sheet showed "V_h" literally in its headings
    page = demo_sheet.html.read_text(encoding="utf-8")
    markdown = demo_sheet.markdown.read_text(encoding="utf-8")
    heading = "### 2.4 Influence line of the shear through the hinge $V_{h}$ at x = 41 m"
    assert heading in markdown and "V_h" not in markdown
    assert "shear through the hinge <i>V</i><sub>h</sub> at x = 41 m</h3>" in page
    assert "V_h" not in re.sub(r"<math.*?</math>", "", page, flags=re.S)


def test_sheet_title_block_and_printed_page_numbers(tmp_path: Path) -> None:
    # regression: the sheet had no title block (project, structure, girder, prepared by, checked by, date,
    # revision) and no page numbers in print
    from ilkit.views import TitleBlock

    beam = ilkit.Beam(20, {0: "pin", 20: "roller"}, units="kN-m")
    sheet = write_calculation_sheet(
        beam, tmp_path / "s", lines=[beam.moment(5)], title="Footbridge girder",
        title_block={"project": "Mill Lane footbridge", "Prepared_by": "A. Engineer", "revision": "B"},
    )
    markdown = sheet.markdown.read_text(encoding="utf-8")
    page = sheet.html.read_text(encoding="utf-8")
    assert "| project | Mill Lane footbridge | revision | B |" in markdown
    assert "| girder |  | prepared by | A. Engineer |" in markdown  # a field not given: an empty box
    assert "| calculation | Footbridge girder | checked by |  |" in markdown
    assert '<table class="title-block">' in page and "<td style=\"text-align:left\">Mill Lane footbridge</td>" in page
    assert 'content: "page " counter(page) " of " counter(pages)' in page
    assert 'content: "Footbridge girder · Mill Lane footbridge · revision B"' in page
    # a footer with quotes or markup stays a CSS string
    quoted = write_calculation_sheet(beam, tmp_path / "q", lines=[], title='The "</style>" girder')
    assert "</style>\" girder" not in quoted.html.read_text(encoding="utf-8")
    with pytest.raises(ilkit.BeamInputError, match="title_block has no field 'engineer'; the fields are 'project'"):
        write_calculation_sheet(beam, tmp_path / "x", title_block={"engineer": "me"})
    with pytest.raises(ilkit.BeamInputError, match="TitleBlock: date must be text"):
        TitleBlock(date=2025)
    with pytest.raises(ilkit.BeamInputError, match="title_block must be a TitleBlock or a mapping"):
        write_calculation_sheet(beam, tmp_path / "x", title_block="Mill Lane")
    assert not (tmp_path / "x.html").exists()


def test_demo_sheets_show_the_title_block_filled_in(demo_sheet) -> None:
    markdown = demo_sheet.markdown.read_text(encoding="utf-8")
    assert "| project | ilkit demo study (invented data) | revision | A |" in markdown
    assert "| girder | Main girder, spans 32 + 44 + 32 m | prepared by | ilkit demo |" in markdown
