"""Source of notebooks/moving_loads.ipynb (run it to rebuild the notebook)."""

from pathlib import Path

from make_notebook import build

CELLS = [
    ("md", """
# Moving loads: governing placements and envelopes

Two studies of our own:

1. a three-span continuous highway girder (spans 90, 115 and 90 ft) under the
   AASHTO LRFD HL-93 live load of one lane;
2. a 24 m simply supported rail girder under EN 1991-2 Load Model 71 (with
   SW/0 as the alternative for continuity) and, for comparison, the AREMA
   Cooper E80 train.

For each we find where the vehicles must stand for the largest and smallest
reaction, shear and moment, draw those placements on the influence lines and
plot the envelopes along the girder.

> **Caution.** ilkit is an aid to calculation. Every result must be checked by
> a qualified engineer; the licensed current editions of the standards, the
> local design codes and licensed professional practice govern. Some load
> model values are recalled from memory and are marked so in
> `ilkit.loads.models`: check them against the standard.

Sign conventions: loads act downward; reactions positive upward, moments
positive sagging, shear positive when the forces left of the section add up to
an upward resultant.
"""),
    ("code", """
%matplotlib inline
import tempfile
from pathlib import Path

import matplotlib.pyplot as plt
import numpy as np
import pandas as pd

import ilkit
from ilkit import loads, views

pd.set_option("display.precision", 2)

spans = [90, 115, 90]                       # ft
piers = np.cumsum([0, *spans]).tolist()     # 0, 90, 205, 295
girder = ilkit.Beam(
    length=piers[-1],
    supports={p: ("pin" if p == 0 else "roller") for p in piers},
    EI=1.0e8,                               # kip·ft², constant (force effects do not depend on its value)
    units="kip-ft",
)
hl93 = loads.hl93()                         # one lane, IM = 33 % on truck and tandem, no multiple presence
hl93, [case.name for case in hl93.cases]
"""),
    ("code", """
ax = views.draw_beam(girder, title="Three-span continuous girder (kip, ft)")
"""),
    ("md", """
## Governing placements at four sections

The sagging moment at 0.4 of the first span, the hogging moment over the
first pier, the shear just right of that pier and the pier reaction. The
design truck's rear axle spacing is searched from 14 to 30 ft, both travel
directions are tried, axles that would reduce the extreme are left off, and
the lane load covers the parts of the line of the wanted sign. For the
hogging moment and the pier reaction, 90 % of two trucks at least 50 ft apart
plus 90 % of the lane is also tried (AASHTO LRFD 3.6.1.3.1).
"""),
    ("code", """
studies = {
    "M at x=36 (0.4 of span 1), max": (girder.moment(36), "max"),
    "M over pier at x=90, min": (girder.moment(90), "min"),
    "V right of pier at x=90, max": (girder.shear(90, side="right"), "max"),
    "R at pier x=90, max": (girder.reaction(90), "max"),
}
found = {name: loads.place(line, hl93, sense, beam=girder) for name, (line, sense) in studies.items()}

def describe(extreme):
    vehicle = extreme.placements[0]
    return {
        "value": round(extreme.value, 1),
        "unit": extreme.unit,
        "case": extreme.case,
        "travel": vehicle.direction,
        "lead axle x [ft]": round(vehicle.axles[0].x, 2),
        "spacings [ft]": ", ".join(f"{s:.1f}" for s in vehicle.spacings),
    }

pd.DataFrame({name: describe(e) for name, e in found.items()}).T
"""),
    ("md", """
Where the loads stand for each of the four extremes: the beam with the axles
(arrow length growing with the load, load written above), the lane load
hatched, and the direction of travel; below, the influence line with the
ordinate under every counted axle and the loaded areas dotted.
"""),
    ("code", """
fig, axes = plt.subplots(len(studies), 1, figsize=(7.5, 3.4 * len(studies)), layout="constrained")
for ax, extreme in zip(axes, found.values()):
    views.plot_placement(extreme, ax=ax)
plt.show()
"""),
    ("md", """
A placement is shown in a notebook with its plot and its table (the same as
in a calculation sheet); `views.table` gives its DataFrame, with the units in
the column names, for CSV, Excel or LaTeX.
"""),
    ("code", """
found["M over pier at x=90, min"]
"""),
    ("code", """
views.table(found["M over pier at x=90, min"])[["load", "item", "x [ft]", "ordinate", "factored effect [kip·ft]"]]
"""),
    ("md", """
A check by hand of the first table row: the lane load covers the positive
part of the moment line, so its share of the extreme is 0.64 kip/ft times the
positive area of the line.
"""),
    ("code", """
line = girder.moment(36)
lane = next(p for p in found["M at x=36 (0.4 of span 1), max"].placements if p.load == "design lane")
assert abs(lane.effect - 0.64 * line.positive_area) < 1e-9 * lane.effect
round(float(lane.effect), 2), round(float(0.64 * line.positive_area), 2)
"""),
    ("md", """
## Envelope along the girder

Largest and smallest moment and shear at twentieth points of every span (both
sides of the piers), the reaction envelope and the absolute maximum moment,
searched between the sections to 1e-6 of the girder length. The girder and
the load model are symmetric, so the absolute maximum is attained at two
mirror positions; both are listed.
"""),
    ("code", """
env = loads.envelope(girder, hl93, divisions=20)
env.reactions.round(1)
"""),
    ("code", """
best = env.absolute_maximum_moment
round(best.value, 1), [round(p, 3) for p in env.absolute_maximum_positions], best.case
"""),
    ("code", """
fig, (top, middle, bottom) = plt.subplots(3, 1, figsize=(7.5, 8), layout="constrained")
views.plot_envelope(env, "moment", ax=top, title="HL-93 envelope of bending moment, one lane (IM included)")
views.plot_envelope(env, "shear", ax=middle, title="HL-93 envelope of shear")
views.plot_envelope(env, "reaction", ax=bottom, title="HL-93 envelope of reactions")
plt.show()
"""),
    ("code", """
ax = views.plot_placement(best)
"""),
    ("code", """
# the sections where the two-truck rule governs the smallest moment: around the piers
table = env.sections
two_truck = table[table["M min case"].str.startswith("90 %")]
", ".join(f"{x:g}" for x in two_truck["x [ft]"].unique())
"""),
    ("md", """
## A rail girder: LM71, SW/0 and Cooper E80

A 24 m simply supported girder carrying one track. Load Model 71 with
α = 1.10 and the dynamic factor Φ2 for a determinant length equal to the
span; SW/0 with the same α and factor, as the alternative considered for
continuous structures, is included to show the block loads. The AREMA Cooper
E80 train (kip, ft) is converted to kN and m when applied.
"""),
    ("code", """
rail = ilkit.Beam(24, {0: "pin", 24: "roller"}, units="kN-m")
phi = loads.phi2(24.0)
lm71 = loads.lm71(1.10, dynamic_factor=phi)
sw0 = loads.sw0(1.10, dynamic_factor=phi)
rail_model = loads.LoadModel("LM71 or SW/0", [*lm71.cases, *sw0.cases])
round(phi, 4), rail_model
"""),
    ("code", """
rail_env = loads.envelope(rail, rail_model, divisions=12)
e80_env = loads.envelope(rail, loads.cooper(80), divisions=12)
summary = pd.DataFrame(
    {
        "x [m]": rail_env.sections["x [m]"],
        "LM71/SW0 M max [kN·m]": rail_env.sections["M max [kN·m]"],
        "case": rail_env.sections["M max case"],
        "E80 M max [kN·m]": e80_env.sections["M max [kN·m]"],
        "LM71/SW0 V max [kN]": rail_env.sections["V max [kN]"],
        "E80 V max [kN]": e80_env.sections["V max [kN]"],
    }
)
summary.round(1)
"""),
    ("code", """
mid, end = rail.moment(12), rail.shear(0)
fig, axes = plt.subplots(3, 1, figsize=(7.5, 10), layout="constrained")
views.plot_placement(loads.place(mid, rail_model), ax=axes[0])
views.plot_placement(loads.place(end, rail_model), ax=axes[1])
views.plot_placement(loads.place(mid, loads.cooper(80)), ax=axes[2])
plt.show()
"""),
    ("md", """
## A vehicle of your own, from a table

A two-wheel crane trolley on a runway girder, read from a table (one row per
wheel, distance from the previous wheel). The same table could come from a
CSV file with `AxleTrain.from_csv`.
"""),
    ("code", """
trolley = loads.AxleTrain.from_frame(
    pd.DataFrame({"load": [180.0, 180.0], "spacing": [None, 3.2]}),
    units="kN-m",
    name="crane trolley",
)
runway = ilkit.Beam(12, {0: "pin", 12: "roller"}, units="kN-m")
crane = loads.envelope(runway, trolley, divisions=12)
best = crane.absolute_maximum_moment
# two equal moving loads P at d on a simple span L (handbook formula): P (2L - d)^2 / (8L),
# under the load that stands at L/2 - d/4
hand, at = 180 * (2 * 12 - 3.2) ** 2 / (8 * 12), 12 / 2 - 3.2 / 4
# the runway is symmetric: the maximum is attained under either load, d/4 either side of midspan
round(best.value, 2), round(hand, 2), [round(p, 4) for p in crane.absolute_maximum_positions], (at, 12 - at)
"""),
    ("md", """
## The calculation sheet

One call writes the record of the highway girder for the calculation package,
as HTML and Markdown: the inputs; HL-93 with its definition, its source and
the values recalled from memory; the influence lines with their sketches and
derivations (the force method for this continuous girder); the governing
placements of every line, plotted and tabulated; the envelope; the method and
the caution. (`make demo` writes this sheet to `out/demo/highway_girder.html`.)
"""),
    ("code", """
folder = Path(tempfile.mkdtemp())
lines = [girder.moment(36), girder.moment(90), girder.shear(90, side="right"), girder.reaction(90)]
sheet = views.write_calculation_sheet(girder, folder / "highway", lines=lines, load=hl93, divisions=10)
print(sheet.html.name, sheet.markdown.name, len(list(sheet.figures.iterdir())), "figures")
"""),
]

if __name__ == "__main__":
    build(Path(__file__).resolve().parent.parent / "notebooks" / "moving_loads.ipynb", CELLS)
