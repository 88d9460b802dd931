"""Source of notebooks/truss_bridge.ipynb (run it to rebuild the notebook)."""

from pathlib import Path

from make_notebook import build

CELLS = [
    ("md", """
# A through-truss bridge: member forces under HL-93

A study of our own: a two-lane road bridge of 240 ft span carried by two Pratt
through trusses of 10 panels (24 ft panels, 32 ft deep, so the diagonals are
40 ft long). The deck rests on stringers, the stringers span simply from floor
beam to floor beam, and the floor beams hang from the panel points of the
lower chord: the load reaches each truss only at the panel points, and every
influence line is straight between them.

We draw the truss, derive the influence lines of a few members (exactly: the
truss is statically determinate), sketch them by Müller-Breslau, find the
largest tension and compression of every member under AASHTO LRFD HL-93 and
write the calculation sheet.

> **Caution.** ilkit is an aid to calculation. Every result must be checked by
> a qualified engineer; the licensed current editions of the standards, the
> local design codes and licensed professional practice govern. Some load
> model values are recalled from memory and are marked so in
> `ilkit.loads.models`: check them against the standard.

Sign conventions: member forces positive in tension, negative in compression;
reactions positive upward; the load acts downward; x is measured along the
deck from the left support.
"""),
    ("code", """
%matplotlib inline
import tempfile
from pathlib import Path

import pandas as pd

import ilkit
from ilkit import loads, trusses, views

pd.set_option("display.precision", 3)

truss = trusses.pratt(240, 10, 32, units="kip-ft")   # span, panels, depth (ft); a pin at L0, a roller at L10
truss, truss.degree
"""),
    ("code", """
ax = views.draw_truss(truss, title="Pratt through truss: 10 panels of 24 ft, 32 ft deep")
"""),
    ("md", """
## Member force influence lines

The top chord at mid-span, the bottom chord beside it, the first diagonal, the
hip vertical and the left reaction. By the method of sections a chord force is
the panel-point moment over the depth and a diagonal force the panel shear over
the sine of its slope; ilkit solves the equilibrium of every joint exactly, so
the ordinates are rationals.
"""),
    ("code", """
names = ["U4-U5", "L4-L5", "U1-L2", "U1-L1"]
lines = {name: truss.member_force(name) for name in names}
lines["R at L0"] = truss.reaction("L0")
views.summary(lines)
"""),
    ("code", """
top = lines["U4-U5"]
# the top chord at mid-span: moment at the panel point L5 over the depth, in compression
top.ordinate_exact(120), -(120 * 120 / 240) / 32
"""),
    ("md", """
## Müller-Breslau sketches

Give the member a unit shortening and let the rest of the truss follow (the
released truss is a mechanism): the deck's upward movement is the member's
influence line. The drawing exaggerates the movement.
"""),
    ("code", """
ax = views.sketch(lines["U1-L2"])
"""),
    ("code", """
ax = views.sketch(lines["U4-U5"])
"""),
    ("md", """
## Live load on one truss

Two 12 ft lanes between curbs 2 ft inside the trusses, which stand 32 ft
apart. By the lever rule across the floor beam, a lane whose centre is 8 ft
from a truss puts 24/32 of its load on that truss, the other lane (centre
20 ft from it) 12/32: 1.125 lanes on the nearer truss, with a multiple
presence factor of 1.00 for two loaded lanes (AASHTO LRFD Table 3.6.1.1.2-1,
from memory). One loaded lane gives 0.75 × 1.20 = 0.90, less.
"""),
    ("code", """
lanes = (32 - 8) / 32 + (32 - 20) / 32
factor = lanes * loads.multiple_presence(2)
hl93 = loads.hl93(factor=factor)
factor, [case.name for case in hl93.cases]
"""),
    ("md", """
## The member envelope

For every member the largest tension and the largest compression with the
governing case: the design truck (rear spacing searched from 14 to 30 ft,
both directions) or the tandem, with 33 % dynamic allowance, plus the lane
load on the parts of the line of the wanted sign.
"""),
    ("code", """
envelope = trusses.member_envelope(truss, hl93)
views.table(envelope).round(1)
"""),
    ("code", """
ax = views.plot_member_forces(envelope, extreme="max")
"""),
    ("code", """
ax = views.plot_member_forces(envelope, extreme="min")
"""),
    ("md", """
The governing placement behind one entry: where the trucks and the lane stand
for the largest compression in the top chord at mid-span.
"""),
    ("code", """
worst = envelope.extreme("U4-U5", "min")
ax = views.plot_placement(worst)
round(worst.value, 1), worst.case
"""),
    ("md", """
## Exploring the truss

Move a vehicle along the deck and watch every member's force (in JupyterLab;
a rendered page shows a still image). Below, the design truck stands where it
gives the largest compression in the top chord U4-U5.
"""),
    ("code", """
explorer = truss.explore({"HL-93": loads.hl93()}, member="U4-U5")
explorer.load.value = "HL-93: design truck"
explorer.jump("min")
explorer
"""),
    ("code", """
round(explorer.value, 2), round(explorer.forces["L4-L5"], 2)
"""),
    ("md", """
## The calculation sheet

One call writes the record of the truss for the calculation package, as HTML
and Markdown: the truss and its members, the load model, each influence line
with its sketch and derivation, the governing placements and the member
envelope. (`make demo` writes this sheet to `out/demo/through_truss.html`.)
"""),
    ("code", """
folder = Path(tempfile.mkdtemp())
sheet = views.write_calculation_sheet(truss, folder / "truss", lines=list(lines.values()), load=hl93,
                                      title="Pratt through truss under HL-93: member forces")
print(sheet.html.name, sheet.markdown.name, len(list(sheet.figures.iterdir())), "figures")
"""),
]

if __name__ == "__main__":
    build(Path(__file__).resolve().parent.parent / "notebooks" / "truss_bridge.ipynb", CELLS)
