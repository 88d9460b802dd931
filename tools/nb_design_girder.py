"""Source of notebooks/design_girder.ipynb (run it to rebuild the notebook)."""

from pathlib import Path

from make_notebook import build

CELLS = [
    ("md", """
# Design effects of a composite steel girder: from the cross-section to factored envelopes

A bridge of our own (invented numbers): three continuous spans of 110, 140 and
110 ft; a 43 ft deck on five steel plate girders 9 ft apart, with 3.5 ft
overhangs and 1.25 ft barriers; an 8.5 in concrete slab acting compositely
with the girders. For an interior and an exterior girder we find:

1. the design lanes and each girder's share of them (AASHTO LRFD approximate
   formulas, the lever rule, the rigid cross-section check), with the ranges of
   applicability checked;
2. the permanent loads in two stages: the wet deck on the steel girder alone
   (DC1), the barriers (DC2) and the wearing surface (DW) on the composite
   girder;
3. the factored envelopes for every AASHTO limit state (HL-93, and the fatigue
   truck for fatigue), with the governing limit state and live-load case;
4. the forces that act together at the governing sections, and the live-load
   deflection check.

> **Caution.** ilkit is an aid to calculation. Every result must be checked by
> a qualified engineer; the licensed current editions of the standards, the
> local design codes and licensed professional practice govern. Many factors
> below are recalled from memory and are marked so: check them against the
> standard.

Sign conventions: loads act downward; moments positive sagging, shear positive
when the forces left of the section add up to an upward resultant, reactions
positive upward, deflections positive downward. Units: kip and ft (inches
where the formulas want them, through pint).
"""),
    ("code", """
%matplotlib inline
import tempfile
from pathlib import Path

import pandas as pd
import pint

import ilkit
from ilkit import design, loads, views

pd.set_option("display.precision", 4)
ureg = pint.UnitRegistry()


def rounded(frame, digits=1):
    \"\"\"A table for reading: numbers rounded, rounding noise shown as 0 (never -0).\"\"\"
    out = frame.copy()
    numbers = out.select_dtypes("number").columns
    out[numbers] = out[numbers].round(digits) + 0.0
    return out
"""),
    ("md", """
## 1. The cross-section and the design lanes

Girder 1 is the left exterior girder, girder 3 the middle one. The roadway is
the deck between the barriers.
"""),
    ("code", """
section = design.CrossSection(girders=5, spacing=9.0, overhang=3.5, barrier=1.25, units="kip-ft")
lanes = design.design_lanes(section.roadway_width)
print(section)
print(lanes, "-", lanes.note)
print("distance from the exterior girder to the barrier's inner face, de =", section.curb_distance, "ft")
"""),
    ("md", """
### The girder's longitudinal stiffness Kg

Kg = n (I + A eg²) (AASHTO LRFD 4.6.2.2.1-1, from memory) with the steel
girder's own properties (invented: a plate girder 56.375 in deep, its centroid
24.9 in above the bottom), the modular ratio n = 8 and eg from the girder's
centroid to the middle of the slab (2 in haunch).
"""),
    ("code", """
eg = (56.375 - 24.9) + 2.0 + 8.5 / 2          # in
Kg = design.longitudinal_stiffness(n=8, inertia=37_600, area=71.1, eccentricity=eg)   # in⁴
print(f"eg = {eg:.3f} in, Kg = {Kg:,.0f} in⁴")
"""),
    ("md", """
## 2. Distribution to the girders

### Interior girder: the approximate formulas

Cross-section type (a), steel girders with cross-frames. The factors fall as
the span grows, so the shortest span (110 ft) gives the largest ones; we use
them for the whole girder line (on the safe side; the 140 ft span's are shown
for comparison). Each candidate is listed; the largest governs.
"""),
    ("code", """
formulas = dict(slab_thickness=8.5 * ureg.inch, Kg=Kg * ureg.inch**4, diaphragms=True)
g_interior = design.aashto_distribution(section, 3, span=110, **formulas)
pd.DataFrame({L: [d.moment.value, d.shear.value] for L, d in
              {110: g_interior, 140: design.aashto_distribution(section, 3, span=140, **formulas)}.items()},
             index=["gM", "gV"]).rename(columns=lambda L: f"L = {L} ft").round(4)
"""),
    ("code", """
g_interior.to_frame().round(4)
"""),
    ("md", """
Every parameter is inside the range the formulas were fitted for (outside it
ilkit refuses them with an `OutsideRangeError` that says to use the lever rule
or a refined analysis):
"""),
    ("code", """
g_interior.ranges().assign(value=lambda f: f["value"].map("{:,.6g}".format))
"""),
    ("md", """
### Exterior girder: the lever rule and the rigid cross-section

With one lane loaded the exterior girder's share comes from the lever rule:
the deck is hinged over the first interior girder and the wheel lines, 6 ft
apart, stand 2 ft from the barrier. With two or more lanes, the interior
formula times e = 0.77 + de/9.1. With cross-frames, the factor may not be less
than that of a rigid cross-section.
"""),
    ("code", """
lever = design.place_design_lanes(design.transverse_line(section, 1, "lever rule"), loaded=1)
ax = views.plot_transverse(lever)
lever.to_frame().round(4)
"""),
    ("code", """
g_exterior = design.aashto_distribution(section, 1, span=110, **formulas)
g_exterior.to_frame().round(4)
"""),
    ("code", """
g_exterior.ranges().assign(value=lambda f: f["value"].map("{:,.6g}".format))
"""),
    ("md", """
### Multiple presence: applied once

The formulas, the lever rule and the rigid check already contain the multiple
presence factor m (AASHTO LRFD Table 3.6.1.1.2-1: 1.20 for one lane, 1.00 for
two, 0.85 for three). The girder's live load records every factor it
contains; applying m a second time is refused.
"""),
    ("code", """
hl93 = loads.hl93()                     # one lane; IM = 33 % on the design truck and tandem
live_interior = design.GirderLiveLoad(hl93, distribution=g_interior, name="HL-93, interior girder")
live_exterior = design.GirderLiveLoad(hl93, distribution=g_exterior, name="HL-93, exterior girder")
for live in (live_interior, live_exterior):
    print(f"{live.name}: moment {live.factors('moment').describe()}; shear {live.factors('shear').describe()}")
try:
    design.GirderLiveLoad(hl93, distribution=g_interior, multiple_presence=design.multiple_presence_factor(3))
except ilkit.FactorAppliedTwiceError as err:
    print("refused:", err)
"""),
    ("md", """
For fatigue the fatigue truck (IM 15 %) is carried by one lane, without the
multiple presence factor: the one-lane factors divided by 1.20.
"""),
    ("code", """
fatigue = loads.fatigue_truck()
fatigue_interior = design.GirderLiveLoad(fatigue, distribution=g_interior.fatigue(),
                                         name="fatigue truck, interior girder")
fatigue_exterior = design.GirderLiveLoad(fatigue, distribution=g_exterior.fatigue(),
                                         name="fatigue truck, exterior girder")
for live in (fatigue_interior, fatigue_exterior):
    print(f"{live.name}: moment {live.factors('moment').describe()}; shear {live.factors('shear').describe()}")
"""),
    ("md", """
## 3. The girder line in its stages

The same geometry with three stiffnesses, EI = E I (E = 29,000 ksi): the steel
girder alone, the composite girder under long-term loads (modular ratio 3n)
and under live load (n). Over the piers the composite section is the steel
girder with the slab's reinforcement. The moments of a continuous girder
depend on how its stiffness varies, so each stage has its own lines.
"""),
    ("code", """
E = 29_000.0                                               # ksi
inertia = {                                                # in⁴: in the spans, over the piers (invented)
    "steel alone": (37_600, 68_000),
    "composite, long-term (3n)": (82_000, 76_000),
    "composite, short-term (n)": (110_000, 76_000),
}
supports = {0: "pin", 110: "roller", 250: "roller", 360: "roller"}


def girder_line(span_inertia, pier_inertia):
    a, b = E * span_inertia / 144, E * pier_inertia / 144    # kip·ft²
    return ilkit.Beam(360, supports, EI=[(0, 88, a), (88, 138, b), (138, 222, a), (222, 272, b), (272, 360, a)],
                      units="kip-ft")


steel, long_term, short_term = (girder_line(*i) for i in inertia.values())
ax = views.draw_beam(short_term, title="Three-span composite girder, spans 110 + 140 + 110 ft")
"""),
    ("md", """
## 4. Permanent loads in two stages

Per girder (kip/ft): the slab and haunch over its width (the exterior girder
carries less), the steel with its cross-frames, the barriers shared equally by
the five girders, and a future wearing surface of 25 psf over the roadway,
also shared equally (common practice for slabs on girders).
"""),
    ("code", """
def dead_loads(where, slab):
    return design.permanent_effects([
        design.Stage("steel alone", steel, [
            design.DistributedLoad("DC1 deck slab and haunch", "DC", slab),
            design.DistributedLoad("DC1 steel and cross-frames", "DC", 0.22)]),
        design.Stage("composite, long-term", long_term, [
            design.DistributedLoad("DC2 barriers", "DC", 0.16),
            design.DistributedLoad("DW wearing surface", "DW", 0.20)]),
    ], quantities=("moment", "shear", "reaction"), name=f"{where} girder")


dead_interior = dead_loads("interior", 1.00)
dead_exterior = dead_loads("exterior", 0.93)
dead = dead_interior.by_category()
rounded(dead[dead["quantity"] == "moment"].set_index(["x", "side"])[["DC", "DW"]])
"""),
    ("code", """
ax = views.plot_permanent_effects(dead_interior, "moment")
"""),
    ("md", """
## 5. Factored envelopes for every AASHTO limit state

One lane's exact envelope is searched once and scaled for each girder (a factor
on the whole load does not move the worst placement). At each section each
limit state's largest value is Σ γ P with γmax where a category's effect adds
and γmin where it relieves, plus γLL times the girder's live-load extreme.
"""),
    ("code", """
hl93_envelope = design.live_envelope(short_term, live_interior)         # searched once, for one lane
fatigue_envelope = design.live_envelope(short_term, fatigue_interior)


def factored(dead, live, fatigue):
    girder_fatigue = fatigue_envelope.for_girder(fatigue)
    return design.factored_envelope(short_term, permanent=dead, limit_states="AASHTO",
                                    live={"*": hl93_envelope.for_girder(live), "Fatigue I": girder_fatigue,
                                          "Fatigue II": girder_fatigue})


factored_interior = factored(dead_interior, live_interior, fatigue_interior)
factored_exterior = factored(dead_exterior, live_exterior, fatigue_exterior)
factored_interior
"""),
    ("code", """
top, bottom = views.plot_factored_envelope(factored_interior, "moment",
                                           limit_states=["Strength I", "Service II", "Fatigue I"])
"""),
    ("md", """
The moment envelopes of the interior girder (kip·ft), every limit state:
"""),
    ("code", """
rounded(factored_interior.table("moment").set_index(["x", "side"]), 0)
"""),
    ("md", """
The governing strength limit state and live-load case at every section of the
exterior girder:
"""),
    ("code", """
governing = factored_exterior.governing(["Strength I", "Strength II"])
rounded(governing[governing["quantity"] == "moment"].set_index(["x", "side"]).drop(columns="quantity"))
"""),
    ("md", """
### Interior and exterior girder side by side

Strength I at the sections that govern the design: the largest sagging moment
in each span, the hogging moment over the first pier, the shear beside it and
the pier reaction.
"""),
    ("code", """
cases = [("moment", 44, None, "max"), ("moment", 180, None, "max"), ("moment", 110, "left", "min"),
         ("shear", 110, "right", "max"), ("shear", 110, "left", "min"), ("reaction", 110, None, "max")]
pd.DataFrame([
    {"quantity": q, "x [ft]": x, "side": side or "", "extreme": e,
     "interior": factored_interior.value(q, x, "Strength I", e, side=side),
     "exterior": factored_exterior.value(q, x, "Strength I", e, side=side)}
    for q, x, side, e in cases
]).round(1)
"""),
    ("md", """
### One value by hand

The largest Strength I moment of the interior girder at x = 44 ft, from its
components: 1.25 DC + 1.50 DW + 1.75 × (one lane's HL-93 moment, IM included)
× gM (AASHTO LRFD Tables 3.4.1-1 and 3.4.1-2, from memory).
"""),
    ("code", """
DC, DW = (dead_interior.value("moment", 44, category=c) for c in ("DC", "DW"))
lane = hl93_envelope.lane.extreme("moment", 44, "max").value
by_hand = 1.25 * DC + 1.50 * DW + 1.75 * lane * g_interior.moment.value
print(f"DC = {DC:.1f}, DW = {DW:.1f}, one lane {lane:.1f} kip·ft; gM = {g_interior.moment.value:.4f}")
print(f"by hand {by_hand:.1f} kip·ft, ilkit {factored_interior.value('moment', 44, 'Strength I'):.1f} kip·ft")
assert abs(by_hand - factored_interior.value("moment", 44, "Strength I")) < 1e-9 * abs(by_hand)
"""),
    ("md", """
## 6. Concurrent forces at the governing sections

At the sections of the largest and smallest Strength I moment, shear and
reaction, the live load's other actions under the
same placement of the same loads (each load with its dynamic allowance and
case factor), for the interior girder: moments times gM, shears and reactions
times gV. Where an axle stands exactly at the section the shear jumps by its
load, so both faces are given.
"""),
    ("code", """
together = design.concurrent_forces(factored_interior.governing_extremes("Strength I"), short_term)
together_interior = together.for_girder(live_interior)
rounded(together_interior.moment_with_shear())
"""),
    ("code", """
rounded(together_interior.shear_with_moment())
"""),
    ("code", """
rounded(together_interior.reactions())
"""),
    ("md", """
## 7. Live-load deflection

The AASHTO optional check: the larger of the design truck alone and 25 % of
it with the lane load, IM on the truck, all three lanes loaded with their
multiple presence factor, shared by the five girders (AASHTO LRFD 2.5.2.6.2 and
3.6.1.3.2, from memory), against span/800.
"""),
    ("code", """
check = design.deflection_check(short_term, lanes=lanes.count, girders=section.girders)
print(check.factors.describe())
rounded(check.spans.set_index("span"), 4).round({"at [ft]": 1})   # where: to 0.1 ft (searched to 1e-4 of the span)
"""),
    ("code", """
ax = views.plot_deflection_check(check)
"""),
    ("md", """
## 8. Exploring the factored effect of a truck

The explorer moves one vehicle of the girder's live load along the girder;
with a limit state it reads out, beside the truck's unfactored effect, its
factored effect on the girder with the factors named (IM, case factor, the
girder's share, γLL). Open the notebook in JupyterLab to move it; here the
controls are set from code.
"""),
    ("code", """
explorer = short_term.explore(live=live_interior, limit_state=["Strength I", "Service II"], quantity="moment",
                              at=110)
explorer.load.value = "HL-93, interior girder: two design trucks"
explorer.smallest.click()                                   # the worst placement for the hogging moment
print(f"two trucks alone: {explorer.value:.1f} kip·ft; Strength I on the interior girder: "
      f"{explorer.factored:.1f} kip·ft")
explorer
"""),
    ("md", """
## 9. The calculation sheet

One call writes the sheet: inputs, the load model and its sources, the
distribution, the permanent loads, the factored envelopes with every factor,
its source and whether it was recalled from memory, the concurrent forces,
the deflection check, and the caution. `make demo` writes the same study's
sheet to `out/demo/composite_girder.html`.
"""),
    ("code", """
folder = Path(tempfile.mkdtemp())
sheet = views.write_calculation_sheet(
    short_term, folder / "composite_girder", lines=[short_term.moment(44)], load=hl93,
    results=[lever, g_interior, g_exterior, dead_interior, dead_exterior, factored_interior, factored_exterior,
             together_interior, check],
    title="Three-span composite steel girder: factored envelopes")
text = sheet.markdown.read_text(encoding="utf-8")
print(sheet.html.name, sheet.markdown.name)
print("recalled from memory" in text, "qualified engineer" in text)
"""),
]

if __name__ == "__main__":
    build(Path(__file__).resolve().parent.parent / "notebooks" / "design_girder.ipynb", CELLS)
