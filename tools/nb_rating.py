"""Source of notebooks/load_rating.ipynb (run it to rebuild the notebook)."""

from pathlib import Path

from make_notebook import build

CELLS = [
    ("md", """
# Load rating of a three-span steel girder with a corroded span

A scenario of our own (invented numbers): a 1960s-style bridge of five rolled-and-plated steel girders
7.5 ft apart, continuous over three spans of 70, 90 and 70 ft, with a cast-in-place slab that was never
made composite. The last inspection found section loss in the bottom flange of the first span and in the
web at the left bearing. We rate the second girder (G2) for the design load, the AASHTO legal loads, the
emergency vehicles and a permit vehicle of our own, following the load and resistance factor rating of
the AASHTO Manual for Bridge Evaluation (LRFR):

RF = (C − Σ γp P) / (γLL (LL + IM)), with C = φc φs φ Rn and φc φs ≥ 0.85.

ilkit computes the demands (exact worst placements on the influence lines) and the rating factors; the
nominal resistances Rn are the engineer's input. Every factor recalled from the Manual is marked as such.

> A load rating must be checked, and sealed, by a licensed engineer under the bridge owner's rules; the
> licensed current edition of the Manual governs.
"""),
    ("code", """
%matplotlib inline
import tempfile
from pathlib import Path

import pandas as pd

import ilkit
from ilkit import design, rating, views

pd.set_option("display.precision", 3)
pd.set_option("display.width", 140)
girder = ilkit.Beam(
    230,
    {0: "pin", 70: "roller", 160: "roller", 230: "roller"},
    EI=[(0, 70, 3.4e6), (70, 230, 4.0e6)],  # kip·ft²: the corroded first span is less stiff
    units="kip-ft",
)
ax = views.draw_beam(girder)
"""),
    ("md", """
## Dead loads and the girder's share of the live load

All dead load acts on the steel alone (non-composite): the steel, slab and haunch and a share of the
parapets (DC), and the asphalt overlay (DW). The girder's share of one lane comes from the lever rule
across the deck (with the multiple presence factor in it); its one-lane value without multiple presence
is kept for the special permit.
"""),
    ("code", """
dead = [
    design.DistributedLoad("steel, slab and haunch", "DC", 1.05),
    design.DistributedLoad("parapets (share)", "DC", 0.10),
    design.DistributedLoad("asphalt overlay", "DW", 0.22),
]
permanent = design.permanent_effects(girder, dead, quantities=("moment", "shear"))
deck = design.CrossSection(girders=5, spacing=7.5, overhang=2.5, barrier=1.25, units="kip-ft")
share = design.lever_rule(deck, 2)
share
"""),
    ("md", """
## Nominal resistances, with the section loss

Given per action along the girder (kip·ft and kip): the corroded first span carries a smaller sagging
moment, the web at the left bearing a smaller shear. A section no value covers would be refused. For
the steel, the Service II check (permanent deformations) takes the moments at which the flanges reach
0.80 Fy, also given.
"""),
    ("code", """
resistances = rating.Resistances(
    positive_moment=[(0, 70, 1800), (70, 230, 2900)],
    negative_moment=2700,
    shear=[(0, 8, 300), (8, 230, 420)],
    name="G2, 1964 plans with the section loss of the last inspection",
)
service = rating.Resistances(  # the Service II limits of the steel: 0.80 Fy in the flanges (non-composite)
    positive_moment=[(0, 70, 1450), (70, 230, 2300)],
    negative_moment=2150,
    name="0.80 Fy in the flanges (non-composite)",
)
resistances
"""),
    ("md", """
## The vehicles

The design load (HL-93) at the inventory and operating levels, the legal loads (Type 3, 3S2, 3-3, the
lane-type legal load, the specialised hauling vehicles SU4 to SU7 and the notional rating load), the
emergency vehicles EV2 and EV3, and our permit vehicle: a six-axle transformer hauler given as a table,
rated as a special single trip with other traffic (one lane, multiple presence taken out).
"""),
    ("code", """
hauler = rating.permit_vehicle(
    pd.DataFrame({"load": [14, 36, 36, 34, 34, 34], "spacing": [None, 13, 4.5, 26, 4.5, 4.5]}),
    name="transformer hauler",
)
permit = rating.permit_load(hauler, "special single trip", adtt=1200)
loads = ["design", "legal", "emergency", permit]
[(r.name, r.level, r.live_factor.value) for r in rating.rating_loads(loads, adtt=1200)]
"""),
    ("md", """
## Rating

One call rates every vehicle at every tenth point of each span (both faces at the piers), for moment and
shear and both senses, at the strength limit state (Strength I; Strength II for the permit) and at
Service II; the fair condition gives φc = 0.95.
"""),
    ("code", """
rated = rating.rate_girder(
    girder, permanent=permanent, resistances=resistances, distribution=share,
    loads=loads, adtt=1200, condition="fair", service=service,
)
controlling = rated.controlling()
controlling[["vehicle", "limit_state", "RF", "quantity", "x", "side", "sense", "rating_tons", "posting",
             "action"]].round(3)
"""),
    ("code", """
ax = views.plot_rating(rated, ["HL-93 inventory", "Type 3S2", "NRL", "EV3", "transformer hauler"])
"""),
    ("md", """
The corroded first span controls: the design load does not pass even at the operating level; Service II
governs the legal loads, and the SU6, SU7, the notional rating load and the EV3 call for posting
(W / 0.7 × (RF − 0.3) tons); the transformer hauler cannot cross as asked. Where the NRL stands for its
controlling rating:
"""),
    ("code", """
row = controlling.set_index("vehicle").loc["NRL"]
worst = rated.extreme("NRL", row["quantity"], row["x"], row["sense"])
ax = views.plot_placement(worst)
"""),
    ("md", """
## Every factor, once

The live part of each rating records its factors in the order applied (the dynamic allowance on the
axles, the distribution factor with its lanes and multiple presence, γLL); the capacity its φc, φs and φ.
Applying one of them a second time is refused.
"""),
    ("code", """
print(rated.live_factors["NRL"]["moment"].describe())
print(rated.service_factors["NRL"]["moment"].describe())
print(rated.live_factors["transformer hauler"]["moment"].describe())
print(rated.capacity_factors["moment"].describe())
try:
    rated.live_factors["NRL"]["moment"].then(rating.legal_live_factor(1200))
except ilkit.FactorAppliedTwiceError as err:
    print("refused:", type(err).__name__)
"""),
    ("md", """
## The rating view

Pick a vehicle and see its rating factor along the girder; move it with the slider and watch the RF at the
chosen section change (the red dot); the button puts it back where it gives the rated value. The figure
below the controls is drawn by the kernel: run the notebook to drive it.
"""),
    ("code", """
view = views.RatingView(rated, vehicle="NRL", quantity="moment", at=28, backend="inline")
view
"""),
    ("code", """
view.slider.value = view.slider.value + 3  # move the vehicle three steps to the right
print(f"front at x = {view.front:.1f} ft: RF at x = 28 ft is {view.standing.rf:.3f} (rated {view.rated:.3f})")
view.worst.click()
print(f"back at the worst placement: RF {view.standing.rf:.3f}")
"""),
    ("md", """
## The rating sheet

The rating sheet holds the title block, the caution, the inputs, every factor with its source and status,
the vehicles, the controlling ratings with the rating in tons and the posting loads, the RF along the
girder and the governing placements drawn, as HTML and Markdown (and as PDF with
`pip install "ilkit[pdf]"`: `pdf=True`).
"""),
    ("code", """
folder = Path(tempfile.mkdtemp())
sheet = views.write_rating_sheet(
    rated, folder / "rating_G2", pdf=False,
    title_block={"bridge": "Three-span steel girder bridge (1960s style)", "girder": "G2",
                 "engineer": "our engineer", "checker": "", "date": "2025-01-15", "revision": "A"},
)
sheet.html.name, sheet.markdown.name, len(list(sheet.figures.glob("*.svg")))
"""),
]

if __name__ == "__main__":
    build(Path(__file__).resolve().parent.parent / "notebooks" / "load_rating.ipynb", CELLS)
