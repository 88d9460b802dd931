"""Girder inventories (ilkit.batch): the file formats, validation with typed errors, ids and file names.

The engineering checks of the girders themselves are those of ilkit.Beam and ilkit.design (their own
tests); here: every format gives the same records, a bad record is reported with its id and field and
does not stop the others, files are data only, and ids never lead a file out of its folder.
"""

from __future__ import annotations

import builtins
import json
import pickle

import pandas as pd
import pytest

import ilkit
from ilkit import batch

pytest.importorskip("pyarrow")

GOOD = [
    {"id": "A-1", "units": "kip-ft", "spans": [60, 75.5, 60], "EI": 4e7, "live": "HL-93",
     "distribution": {"moment": 0.62, "shear": 0.78, "includes_multiple_presence": True},
     "permanent": [{"name": "deck", "category": "DC", "intensity": 1.2},
                   {"name": "overlay", "category": "DW", "intensity": 0.25, "span": 2}]},
    {"id": "A-2", "units": "kN-m", "length": 108, "supports": {"0": "pin", "32": "roller", "76": "roller",
                                                               "108": "roller"},
     "hinges": [41, 67], "live": {"model": "LM71", "dynamic_factor": 1.1}, "lanes": 1,
     "permanent": [{"name": "ballast", "category": "G", "intensity": 35.0},
                   {"name": "signal", "category": "G", "load": 12, "at": 54}]},
]

TOML = """
[defaults]
units = "kip-ft"
live = "HL-93"

[[girders]]
id = "ok-1"
spans = [40, 40]
EI = 2.5e7

[[girders]]
id = "no-spans"
EI = 2.5e7

[[girders]]
id = "unstable"
spans = [50]
hinges = [20, 30]

[[girders]]
id = "unknown-model"
spans = [30]
live = "HL-95"

[[girders]]
id = "wrong-units"
units = "kips-feet"
spans = [30]

[[girders]]
id = "bad-load"
spans = [30]
permanent = [{ name = "deck", category = "DC", intensity = 1.0, start = 10, end = 45 }]

[[girders]]
id = "typo"
spans = [30]
spanz = [30]

[[girders]]
id = "ok-2"
spans = [35]
"""


def test_toml_json_csv_and_parquet_give_the_same_records(tmp_path):
    json_path = tmp_path / "inv.json"
    json_path.write_text(json.dumps({"girders": GOOD}), encoding="utf-8")
    frame = pd.DataFrame([{k: json.dumps(v) if isinstance(v, (list, dict)) else v for k, v in r.items()}
                          for r in GOOD])
    frame.to_csv(tmp_path / "inv.csv", index=False)
    frame.to_parquet(tmp_path / "inv.parquet", index=False)
    toml_path = tmp_path / "inv.toml"
    toml_path.write_text(
        '[[girders]]\nid = "A-1"\nunits = "kip-ft"\nspans = [60, 75.5, 60]\nEI = 4e7\nlive = "HL-93"\n'
        'distribution = { moment = 0.62, shear = 0.78, includes_multiple_presence = true }\n'
        'permanent = [{ name = "deck", category = "DC", intensity = 1.2 },\n'
        '             { name = "overlay", category = "DW", intensity = 0.25, span = 2 }]\n', encoding="utf-8")
    beams = {}
    for path in (json_path, tmp_path / "inv.csv", tmp_path / "inv.parquet", toml_path):
        inv = batch.read_inventory(path)
        assert not inv.errors, inv.errors
        beams[path.suffix] = inv.records[0].beam()
        assert inv.records[0].id == "A-1"
    reference = ilkit.Beam(195.5, {0: "pin", 60: "roller", 135.5: "roller", 195.5: "roller"}, EI=4e7, units="kip-ft")
    for suffix, beam in beams.items():
        assert beam.supports == reference.supports, suffix
        assert beam.EI == reference.EI and beam.units == reference.units, suffix


def test_csv_cells_stay_exact_decimals(tmp_path):
    # a CSV cell is read as text: 0.1 + 0.2 spans give a support at exactly 3/10 (floats would give
    # 0.30000000000000004, merged by the beam's tolerance; as text it is exact from the start)
    (tmp_path / "inv.csv").write_text('id,units,spans\nx,kN-m,"[0.1, 0.2]"\n', encoding="utf-8")
    beam = batch.read_inventory(tmp_path / "inv.csv").records[0].beam()
    assert [s.at for s in beam.supports][-1] == ilkit.Beam("0.3", {0: "pin", "0.3": "roller"}).length


def test_bad_records_are_reported_with_id_and_field_and_the_others_are_kept(tmp_path):
    path = tmp_path / "inv.toml"
    path.write_text(TOML, encoding="utf-8")
    inv = batch.read_inventory(path)
    assert [r.id for r in inv.records] == ["ok-1", "ok-2"]
    errors = {e.id: e for e in inv.errors}
    assert set(errors) == {"no-spans", "unstable", "unknown-model", "wrong-units", "bad-load", "typo"}
    assert (errors["no-spans"].field, errors["no-spans"].error) == ("spans", "InventoryError")
    assert (errors["unstable"].field, errors["unstable"].error) == ("hinges", "UnstableBeamError")
    assert errors["unknown-model"].field == "live" and "HL-95" in errors["unknown-model"].message
    with pytest.raises(ilkit.IlkitError) as given:  # the same typed error as ilkit.Beam gives
        ilkit.Beam(30, {0: "pin", 30: "roller"}, units="kips-feet")
    assert (errors["wrong-units"].field, errors["wrong-units"].error) == ("units", type(given.value).__name__)
    assert errors["wrong-units"].message == str(given.value)
    assert errors["bad-load"].field.startswith("permanent[0]") and errors["bad-load"].error == "LoadInputError"
    assert errors["typo"].field == "spanz" and "spans" in errors["typo"].message
    frame = inv.errors_frame()
    assert list(frame.columns) == ["girder", "index", "field", "error", "message"]
    assert frame["index"].tolist() == [1, 2, 3, 4, 5, 6]


def test_missing_and_repeated_ids_are_errors_naming_the_place():
    inv = batch.read_inventory([{"units": "kN-m", "spans": [10]}, {"id": "x", "units": "kN-m", "spans": [10]},
                                {"id": "x", "units": "kN-m", "spans": [12]}])
    assert [(e.id, e.field) for e in inv.errors] == [("#1", "id"), ("x", "id")]
    assert [r.id for r in inv.records] == ["x"]


def test_a_file_of_another_kind_is_refused_and_nothing_is_evaluated(tmp_path, monkeypatch):
    (tmp_path / "inv.pkl").write_bytes(pickle.dumps([{"id": "x"}]))
    with pytest.raises(ilkit.InventoryError, match=r"\.toml, \.json, \.csv or \.parquet"):
        batch.read_inventory(tmp_path / "inv.pkl")

    def refuse(*args, **kwargs):
        raise AssertionError("evaluated or unpickled")

    monkeypatch.setattr(builtins, "eval", refuse)
    monkeypatch.setattr(builtins, "exec", refuse)
    monkeypatch.setattr(pickle, "loads", refuse)
    monkeypatch.setattr(pickle, "load", refuse)
    marker = tmp_path / "pwned"
    code = f"__import__('pathlib').Path({str(marker)!r}).write_text('x')"
    (tmp_path / "inv.toml").write_text(f'[[girders]]\nid = "c"\nunits = "kN-m"\nspans = ["{code}"]\n'
                                       f'live = "{code}"\n', encoding="utf-8")
    frame = pd.DataFrame({"id": ["c"], "units": ["kN-m"], "spans": [json.dumps([code])], "EI": [code]})
    frame.to_parquet(tmp_path / "inv.parquet", index=False)
    frame.to_csv(tmp_path / "inv.csv", index=False)
    for name in ("inv.toml", "inv.parquet", "inv.csv"):
        inv = batch.read_inventory(tmp_path / name)
        assert not inv.records and inv.errors[0].id == "c", name
    assert not marker.exists()


def test_unreadable_json_in_a_cell_is_an_error_of_that_field(tmp_path):
    (tmp_path / "inv.csv").write_text('id,units,spans\nx,kN-m,"[10, 20"\n', encoding="utf-8")
    inv = batch.read_inventory(tmp_path / "inv.csv")
    assert (inv.errors[0].id, inv.errors[0].field) == ("x", "spans")


@pytest.mark.parametrize("girder", ["../x", "../../etc/passwd", "/tmp/absolute", "C:\\x", ".hidden", "a/b", "..",
                                    "."])
def test_file_names_from_ids_stay_in_their_folder(tmp_path, girder):
    folder = tmp_path / "sheets"
    path = batch.file_name(folder, girder, ".html")
    assert path.parent == folder
    assert not path.name.startswith(".")
    assert "/" not in path.name and "\\" not in path.name
    assert path.resolve().parent == folder.resolve()


def test_two_ids_never_share_a_file_name(tmp_path):
    ids = ["a/b", "a%2Fb", "a b", "a_b", ".x", "%2Ex", "é", "%C3%A9"]
    names = {batch.file_name(tmp_path, i).name for i in ids}
    assert len(names) == len(ids)


def test_live_load_errors_name_the_record_field_they_come_from():
    inv = batch.read_inventory([
        {"id": "no dynamic factor", "units": "kN-m", "spans": [10], "live": {"model": "LM71"}},
        {"id": "unknown argument", "units": "kN-m", "spans": [10], "live": {"model": "LM71", "speed": 3}},
        {"id": "lanes", "units": "kN-m", "spans": [10], "live": "LM1", "lanes": 0},
        {"id": "presence", "units": "kN-m", "spans": [10], "live": "LM1", "multiple_presence": -1},
        {"id": "both", "units": "kN-m", "spans": [10], "live": "LM1", "lanes": 2,
         "distribution": {"moment": 0.5}},
        {"id": "share", "units": "kN-m", "spans": [10], "live": "LM1", "distribution": {"moment": -1}},
    ])
    fields = {e.id: e.field for e in inv.errors}
    assert fields == {"no dynamic factor": "live.dynamic_factor", "unknown argument": "live", "lanes": "lanes",
                      "presence": "multiple_presence", "both": "lanes", "share": fields["share"]}
    assert fields["share"].startswith("distribution")
    assert not inv.records
