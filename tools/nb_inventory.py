"""Source of notebooks/inventory.ipynb (run it to rebuild the notebook)."""

from pathlib import Path

from make_notebook import build

CELLS = [
    ("md", """
# An inventory of girders: HL-93, Strength I and load ratings over every girder at once

A study of our own: an owner's engineer checks the design effects of a corridor's
girder lines (invented: one to three continuous spans of 30 to 120 ft) under
AASHTO LRFD HL-93 and the Strength I and Service II limit states. Each girder is one
record of an inventory file; `ilkit.batch.run` computes every girder's envelopes at
tenth points, in worker processes, and writes the results as Parquet tables that
pandas reads. A bad record is reported with its id and field; the others go on.

> **Caution.** ilkit is an aid to calculation. Every result must be checked by
> a qualified engineer; the licensed current editions of the standards, the
> local design codes and licensed professional practice govern. Some load
> model and limit-state values are recalled from memory and are marked so in
> `ilkit.loads.models` and `ilkit.design.combinations`: check them against the standard.

Sign conventions: sagging moment positive; shear positive when the part left of the
section is pushed up; reactions positive upward; x is measured from the left end of
each girder. Values are in each girder's units (kip, ft here).
"""),
    ("code", """
%matplotlib inline
import json
import tempfile
from pathlib import Path

import pandas as pd

from ilkit import batch, views

pd.set_option("display.precision", 1)
pd.set_option("display.width", 120)
work = Path(tempfile.mkdtemp())
"""),
    ("md", """
## The inventory file

A hand-written inventory is TOML (or JSON): a table of defaults and one record per
girder. Three records, one of them with a hinge that makes its single span a
mechanism:
"""),
    ("code", """
(work / "three.toml").write_text('''
[defaults]
units = "kip-ft"
live = "HL-93"

[[girders]]
id = "Creek Rd G2"
spans = [62, 80, 62]
EI = 2.9e7
distribution = { moment = 0.64, shear = 0.81, includes_multiple_presence = true }
permanent = [
  { name = "deck and girder", category = "DC", intensity = 1.45 },
  { name = "wearing surface", category = "DW", intensity = 0.26 },
]

[[girders]]
id = "Mill St G1"
spans = [48]
hinges = [24]

[[girders]]
id = "Mill St G2"
spans = [48]
distribution = { moment = 0.58, shear = 0.74 }
''', encoding="utf-8")
three = batch.read_inventory(work / "three.toml")
three.errors_frame()[["girder", "field", "error"]]
"""),
    ("md", """
Large inventories are tables: Parquet (or CSV) with one row per girder and JSON text in
the cells that hold lists and tables. Here a generated corridor of 40 girders of our own,
with the three records above:
"""),
    ("code", """
records = batch.sample_inventory(40, seed=7, spans=(1, 3), lengths=(30.0, 120.0))
records += [{"units": "kip-ft", "live": "HL-93", **r.data} for r in three.records]
records.append({"id": "Mill St G1", "units": "kip-ft", "live": "HL-93", "spans": [48], "hinges": [24]})
table = pd.DataFrame([{k: v if isinstance(v, str) else json.dumps(v) for k, v in r.items()} for r in records])
table.to_parquet(work / "corridor.parquet", index=False)
table[["id", "units", "spans", "distribution"]].head(4)
"""),
    ("md", """
## The run

`batch.run` takes the inventory, the load models and the limit states (tenth points by
default). It uses every core of the machine and shows a progress bar; here one process
and no bar, so that the page reads the same on every machine. On a cluster the same call
takes `client=` (a `dask.distributed.Client`) or `scheduler="tcp://..."`. Started again
into the same folder, it skips the girders already done.
"""),
    ("code", """
result = batch.run(work / "corridor.parquet", work / "run", models=["HL-93"],
                   limit_states=["Strength I", "Service II"], workers=1, progress=False)
result.computed, result.failed, result.invalid
"""),
    ("code", """
result.errors()[["girder", "status", "field", "error"]]
"""),
    ("md", """
The summary has one row per girder: its status and the governing values of every
quantity over all sections, load models and limit states, with where they occur.
"""),
    ("code", """
summary = result.summary()
summary[["girder", "spans", "moment_max", "moment_max_x", "moment_max_load", "moment_min", "shear_max"]].head(8)
"""),
    ("code", """
ax = views.plot_inventory(result, "moment", "max", bins=12)
"""),
    ("md", """
## One girder

The tidy table holds every section of every girder (girder, section, quantity, side,
limit state or load model, max, min, governing case); one girder's Strength I moments:
"""),
    ("code", """
rows = result.girder("Creek Rd G2")
strength = rows[(rows["load"] == "Strength I") & (rows["quantity"] == "moment")]
shown = strength[["section", "x", "side", "max", "min", "max_case", "min_case"]].head(12).copy()
# rounded to 0.1 kip·ft for reading (+ 0.0: no "-0.0" where the permanent effect is a float zero)
shown[["max", "min"]] = shown[["max", "min"]].round(1) + 0.0
shown
"""),
    ("md", """
Its envelopes again, with their placements, and its calculation sheet (written next to
the run; the file is named after the id, escaped so that it stays in its folder):
"""),
    ("code", """
computed = dict((load, found) for load, _, found in result.compute("Creek Rd G2"))
axes = views.plot_factored_envelope(computed["limit states"], "moment")
"""),
    ("code", """
sheet = views.write_girder_sheet(result, "Creek Rd G2", work / "sheets")
print(sheet.html.name)
"""),
    ("md", """
## Load rating of the girders with resistances

A record may carry the girder's nominal resistances (`resistance`: sagging and hogging
moment and shear, numbers or ranges along the girder, in the record's units; here every
fourth generated girder has invented ones). `batch.RatingTask` rates each girder for the
design load and the AASHTO legal loads (LRFR, `ilkit.rating.rate_girder`); a girder
without resistances is an error row naming the field, and the others go on. The factors
recalled from the Manual for Bridge Evaluation are marked from memory in `ilkit.rating`;
a rating must be checked and sealed by a licensed engineer under the owner's rules.
"""),
    ("code", """
rated = batch.run(work / "corridor.parquet", work / "rating", workers=1, progress=False,
                  task=batch.RatingTask(loads=["design", "legal"], adtt=1500, condition="fair"))
rated.errors()["field"].value_counts()
"""),
    ("md", """
The summary holds each girder's controlling rating factor, its vehicle and where it
occurs, and per vehicle the rating factor, the rating in tons and the posting load where
the Manual's posting relation gives one:
"""),
    ("code", """
ratings = rated.summary()
ratings = ratings[ratings["status"] == "done"].reset_index(drop=True)
with pd.option_context("display.precision", 2):  # rating factors to two decimals
    display(ratings[["girder", "spans", "RF", "RF_vehicle", "RF_where", "RF: Type 3S2", "rating tons: Type 3S2"]])
"""),
    ("code", """
ax = views.plot_inventory(rated, "RF", bins=8)
"""),
]

if __name__ == "__main__":
    build(Path(__file__).resolve().parent.parent / "notebooks" / "inventory.ipynb", CELLS)
