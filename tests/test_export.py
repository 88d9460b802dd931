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
    back = pd.read_csv(path, encoding="utf-8", skiprows=1)
    pd.testing.assert_frame_equal(back, table(line))  # floats written in full precision
    first, header = path.read_text(encoding="utf-8").splitlines()[:2]
    assert header == "x [m],left [kN/kN],right [kN/kN]"
    assert first.startswith("# Caution: ") and "qualified engineer" in first  # the caution heads the file
    plain = to_csv(line, tmp_path / "plain.csv", caution=False)
    pd.testing.assert_frame_equal(pd.read_csv(plain), table(line))


def test_excel_round_trip_with_several_sheets(tmp_path) -> None:
    beam = girder()
    path = to_excel({"M at 4.8 m": beam.moment(4.8), "V at 15/left?": beam.shear(15), "beam": beam},
                    tmp_path / "g.xlsx")
    sheets = pd.read_excel(path, sheet_name=None)
    assert list(sheets) == ["M at 4.8 m", "V at 15_left_", "beam", "caution"]
    assert "qualified engineer" in sheets["caution"].iloc[0, 0]  # the workbook carries the caution
    plain = to_excel({"beam": beam}, tmp_path / "plain.xlsx", caution=False)
    assert list(pd.read_excel(plain, sheet_name=None)) == ["beam"]
    with pytest.raises(ilkit.ExportError, match="'caution' and 'caution' both become the sheet"):
        to_excel({"caution": beam}, tmp_path / "clash.xlsx")
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
    caution, *lines = text.splitlines()
    assert caution.startswith("% Caution: ") and "qualified engineer" in caution
    assert lines[:4] == [r"\begin{table}[htbp]", r"\centering", r"\begin{tabular}{rrr}", r"\toprule"]
    note = lines[lines.index(r"\bottomrule") + 1]
    assert note.startswith(r"\multicolumn{3}{@{}l}{\footnotesize\itshape Results to be checked by a qualified")
    assert "Caution" not in to_latex(line, caution=False) and "qualified" not in to_latex(line, caution=False)
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


# --------------------------------------------------- writes that lose no data (regressions: each fault by name)
def _files(folder) -> dict[str, bytes]:
    """Every file under ``folder`` (hidden temporaries included) with its bytes."""
    return {str(p.relative_to(folder)): p.read_bytes() for p in sorted(folder.rglob("*")) if p.is_file()}


@pytest.mark.parametrize(
    ("first", "second", "sheet"),
    [
        ("V at 18/left", "V at 18_left", "V at 18_left"),  # cleaned: / becomes _
        ("moment over the pier, largest (truck)", "moment over the pier, largest (lane)",
         "moment over the pier, largest ("),
        ("Beam", "beam", "beam"),  # Excel ignores case
    ],
    ids=["cleaned", "truncated to 31 characters", "case"],
)
def test_excel_names_that_become_the_same_sheet_are_refused_naming_both(tmp_path, first, second, sheet) -> None:
    beam = girder()
    path = tmp_path / "g.xlsx"
    to_excel({"old": beam}, path)
    before = path.read_bytes()
    with pytest.raises(ilkit.ExportError, match="both become the sheet") as caught:
        to_excel({first: beam.moment(5), second: beam.shear(18)}, path)
    assert repr(first) in str(caught.value) and repr(second) in str(caught.value) and repr(sheet) in str(caught.value)
    assert caught.value.value == (first, second)
    assert path.read_bytes() == before


@pytest.mark.parametrize("name", ["", "  ", "'quoted'", "History"])
def test_excel_sheet_names_excel_refuses_are_refused(tmp_path, name) -> None:
    with pytest.raises(ilkit.ExportError, match="Excel refuses the sheet name"):
        to_excel({name: girder()}, tmp_path / "g.xlsx")
    assert _files(tmp_path) == {}


def test_failing_to_excel_leaves_an_existing_workbook_untouched(tmp_path, monkeypatch: pytest.MonkeyPatch) -> None:
    beam = girder()
    path = to_excel({"beam": beam}, tmp_path / "g.xlsx")
    before = _files(tmp_path)
    # a result with no table, after a good one: nothing is written
    with pytest.raises(ilkit.UnsupportedResultError):
        to_excel({"M": beam.moment(5), "bad": object()}, path)
    assert _files(tmp_path) == before
    # a failure half-way through writing the sheets: nothing is written either
    calls = []

    def fail_on_second(self, *args, **kwargs):
        calls.append(1)
        if len(calls) == 2:
            raise RuntimeError("disk trouble")
        return original(self, *args, **kwargs)

    original = pd.DataFrame.to_excel
    monkeypatch.setattr(pd.DataFrame, "to_excel", fail_on_second)
    with pytest.raises(RuntimeError, match="disk trouble"):
        to_excel({"M": beam.moment(5), "V": beam.shear(18)}, path)
    assert _files(tmp_path) == before
    assert list(pd.read_excel(path, sheet_name=None)) == ["beam", "caution"]


def test_to_excel_of_an_empty_mapping_is_refused_and_writes_nothing(tmp_path) -> None:
    with pytest.raises(ilkit.ExportError, match="no sheets to write"):
        to_excel({}, tmp_path / "empty.xlsx")
    assert _files(tmp_path) == {}


WRITERS = {
    "to_csv": lambda path: to_csv(girder().moment(5), path),
    "to_excel": lambda path: to_excel(girder().moment(5), path),
    "to_latex": lambda path: to_latex(girder().moment(5), path),
}


@pytest.mark.parametrize("write", list(WRITERS))
def test_export_creates_missing_folders(tmp_path, write) -> None:
    path = tmp_path / "new" / "deeper" / "table.out"
    assert WRITERS[write](path) is not None and path.is_file()
    assert [p.name for p in path.parent.iterdir()] == ["table.out"]  # no temporary file left beside it


@pytest.mark.parametrize("write", list(WRITERS))
def test_export_to_a_folder_is_a_write_error(tmp_path, write) -> None:
    (tmp_path / "tables").mkdir()
    with pytest.raises(ilkit.WriteError, match=r"it is a folder\. Give a file name") as caught:
        WRITERS[write](tmp_path / "tables")
    assert isinstance(caught.value, OSError) and caught.value.path == tmp_path / "tables"
    assert _files(tmp_path) == {}


@pytest.mark.parametrize("write", list(WRITERS))
def test_export_into_a_file_taken_for_a_folder_is_a_write_error(tmp_path, write) -> None:
    (tmp_path / "notes").write_text("mine", encoding="utf-8")
    with pytest.raises(ilkit.WriteError, match="is a file, not a folder"):
        WRITERS[write](tmp_path / "notes" / "table.out")
    assert _files(tmp_path) == {"notes": b"mine"}


@pytest.mark.parametrize("write", list(WRITERS))
def test_export_over_a_read_only_file_is_a_write_error_and_leaves_it(tmp_path, write) -> None:
    path = tmp_path / "issued.out"
    path.write_text("issued", encoding="utf-8")
    path.chmod(0o444)
    with pytest.raises(ilkit.WriteError, match="read-only, and it is left as it is"):
        WRITERS[write](path)
    assert _files(tmp_path) == {"issued.out": b"issued"}


@pytest.mark.parametrize("write", list(WRITERS))
def test_export_without_permission_is_a_write_error(tmp_path, write, monkeypatch: pytest.MonkeyPatch) -> None:
    # a folder the user may not write to (simulated: the tests may run as root, who may write anywhere)
    import os

    path = tmp_path / "table.out"
    path.write_text("old", encoding="utf-8")

    real_open = os.open

    def denied(name, *args, **kwargs):
        if str(tmp_path) in str(name):
            raise PermissionError(13, "Permission denied", str(name))
        return real_open(name, *args, **kwargs)

    monkeypatch.setattr(os, "open", denied)
    with pytest.raises(ilkit.WriteError, match="permission denied") as caught:
        WRITERS[write](path)
    assert caught.value.path == path  # the file asked for, not the temporary beside it
    monkeypatch.undo()
    assert _files(tmp_path) == {"table.out": b"old"}


def test_a_full_disk_leaves_the_old_file_and_no_temporary(tmp_path, monkeypatch: pytest.MonkeyPatch) -> None:
    import errno
    import os

    path = to_csv(girder().moment(5), tmp_path / "m.csv")
    before = _files(tmp_path)

    def full(fd):
        raise OSError(errno.ENOSPC, "No space left on device")

    monkeypatch.setattr(os, "fsync", full)
    with pytest.raises(ilkit.WriteError, match="the disk is full"):
        to_csv(girder().shear(18), path)
    monkeypatch.undo()
    assert _files(tmp_path) == before


def test_export_keeps_the_permissions_of_the_file_it_replaces(tmp_path) -> None:
    path = to_csv(girder().moment(5), tmp_path / "m.csv")
    path.chmod(0o640)
    to_csv(girder().shear(18), path)
    assert path.stat().st_mode & 0o777 == 0o640
    assert path.read_text(encoding="utf-8").splitlines()[1].startswith("x [m],left [kN/kN]")


def test_export_through_a_link_writes_the_file_it_names(tmp_path) -> None:
    target = tmp_path / "real.csv"
    target.write_text("old", encoding="utf-8")
    (tmp_path / "link.csv").symlink_to(target)
    to_csv(girder().moment(5), tmp_path / "link.csv")
    assert (tmp_path / "link.csv").is_symlink()
    assert target.read_text(encoding="utf-8").splitlines()[1].startswith("x [m]")


def test_exports_carry_the_caution(tmp_path) -> None:
    # regression: CSV, Excel and LaTeX exports left the caution behind (a line, a sheet, a table note)
    from ilkit.views.caution import CAUTION, CAUTION_SHORT

    line = girder().moment(5)
    assert to_csv(line, tmp_path / "m.csv").read_text(encoding="utf-8").splitlines()[0] == f"# Caution: {CAUTION}"
    sheets = pd.read_excel(to_excel(line, tmp_path / "m.xlsx"), sheet_name=None)
    assert list(sheets) == ["ilkit", "caution"] and sheets["caution"].iloc[0, 0] == CAUTION
    text = to_latex(line)
    assert text.startswith(f"% Caution: {CAUTION}\n") and CAUTION_SHORT.split(";")[0] in text
    with pytest.raises(ilkit.IlkitError, match="caution: give True or False"):
        to_csv(line, tmp_path / "x.csv", caution="no")
