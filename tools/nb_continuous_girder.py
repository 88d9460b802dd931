"""Source of notebooks/continuous_girder.ipynb (run it to rebuild the notebook)."""

from pathlib import Path

from make_notebook import build

CELLS = [
    ("md", """
# A continuous girder with haunched piers

A study of our own: a four-span continuous road girder, spans 24, 36, 40 and
28 m, on a pinned abutment bearing and sliding bearings elsewhere. Over the
three piers the girder is haunched: for 5 m either side of each pier its
flexural stiffness is 1.8 times that of the spans. We draw the influence lines
that govern the design of such a girder:

* the reaction at the middle pier,
* the hogging moment over that pier,
* the sagging moment at midspan of the longest span,
* the shear at the face of the pier,
* the deflection at midspan of the longest span,

and show how the haunches and an elastic pier bearing change them.

> **Caution.** ilkit is an aid to calculation. Every result must be checked by
> a qualified engineer; local design codes and licensed professional practice
> govern.

Sign conventions: the unit load travels downward at position *x*; reactions
are positive upward, moments positive sagging, shear positive when the forces
left of the section add up to an upward resultant, deflection positive
downward.
"""),
    ("code", """
%matplotlib inline
import matplotlib.pyplot as plt
import numpy as np
import pandas as pd

import ilkit
from ilkit import views

spans = [24, 36, 40, 28]                       # m
piers = np.cumsum([0, *spans]).tolist()        # bearing positions: 0, 24, 60, 100, 128
EI_span, EI_haunch, haunch = 2.4e7, 4.32e7, 5  # kN·m², kN·m², m either side of a pier

def stiffness_ranges(haunched=True):
    # piecewise constant EI as (start, end, EI) ranges covering the girder
    cuts = sorted({0, piers[-1], *[p + s for p in piers[1:-1] for s in (-haunch, haunch)]})
    ranges = []
    for a, b in zip(cuts[:-1], cuts[1:]):
        over_pier = any(abs((a + b) / 2 - p) < haunch for p in piers[1:-1])
        ranges.append((a, b, EI_haunch if (haunched and over_pier) else EI_span))
    return ranges

girder = ilkit.Beam(
    length=piers[-1],
    supports={p: ("pin" if p == 0 else "roller") for p in piers},
    EI=stiffness_ranges(),
    units="kN-m",
)
print(girder)
print("degree of indeterminacy:", girder.degree)
"""),
    ("code", """
ax = views.draw_beam(girder, title="Four-span girder, haunched over the piers (kN, m)")
"""),
    ("md", """
## The influence lines

Each line of a continuous girder is a curve: a cubic between consecutive
breakpoints (bearings, changes of stiffness and the section itself), exact for
the prismatic pieces, so the ordinates at any load position are as precise as
a closed form.
"""),
    ("code", """
pier, mid = 60, 80   # the middle pier, and midspan of the 40 m span
lines = {
    "R at pier x=60 [kN/kN]": girder.reaction(pier),
    "M over pier x=60 [kN·m/kN]": girder.moment(pier),
    "M at midspan x=80 [kN·m/kN]": girder.moment(mid),
    "V right of pier x=60 [kN/kN]": girder.shear(pier, side="right"),
    "deflection at x=80 [mm/kN]": girder.deflection(mid),
}

fig, axes = plt.subplots(len(lines), 1, figsize=(7.5, 12), layout="constrained")
for ax, line in zip(axes, lines.values()):
    views.plot_line(line, ax=ax)
    for p in piers[1:-1]:   # the haunches, as light bands behind the line
        ax.axvspan(p - haunch, p + haunch, color=views.style.MUTED, alpha=0.12, linewidth=0, zorder=0)
plt.show()
"""),
    ("md", """
The Müller-Breslau picture of the pier moment: the girder's deflected shape
under a unit kink at the pier, which is the influence line.
"""),
    ("code", """
ax = views.sketch(girder.moment(pier))
"""),
    ("md", """
## Key ordinates

The largest and smallest ordinates with their positions, and the areas of the
positive and negative parts (a uniform lane load of 1 kN/m on those parts).
"""),
    ("code", """
# deflections in mm/kN, as in the plots; each row says its units
print(views.summary(lines).round(4).to_string())
"""),
    ("md", """
Each line is stored as exact cubic pieces between its breakpoints; here are
the pieces of the pier moment line in the 40 m span (local coordinate
*t* from the start of each piece):
"""),
    ("code", """
for piece in girder.moment(pier).pieces:
    if 60 <= piece.start < 100:
        c = piece.coefficients
        print(f"{piece.start:6.1f} .. {piece.end:6.1f} m:  "
              f"{c[0]:+.5f} {c[1]:+.5f} t {c[2]:+.6f} t² {c[3]:+.3e} t³")
"""),
    ("md", """
## What the haunches do

Stiffening the girder over the piers draws moment to them: the hogging pier
moment grows and the sagging midspan moment shrinks, compared with a prismatic
girder of the span stiffness.
"""),
    ("code", """
prismatic = girder.replace(EI=EI_span)
compare = []
for label, beam in (("haunched", girder), ("prismatic", prismatic)):
    m_pier, m_mid = beam.moment(pier), beam.moment(mid)
    compare.append({
        "girder": label,
        "min M over pier": m_pier.minimum.value,
        "neg. area M over pier": m_pier.negative_area,
        "max M at midspan": m_mid.maximum.value,
        "pos. area M at midspan": m_mid.positive_area,
    })
print(pd.DataFrame(compare).set_index("girder").round(3).to_string())
"""),
    ("md", """
## An elastic pier bearing

If the middle pier stands on a bearing and foundation that yield, with a
vertical stiffness of 150 MN/m, model it with `ilkit.Spring(vertical=...)`.
The pier then carries less, and the moment over it relaxes.
"""),
    ("code", """
soft = girder.replace(supports={**{p: ("pin" if p == 0 else "roller") for p in piers},
                               pier: ilkit.Spring(vertical=1.5e5)})
fig, axes = plt.subplots(2, 1, figsize=(7.5, 5.6), layout="constrained")
for ax, what in zip(axes, ("reaction", "moment")):
    views.plot_line(getattr(soft, what)(pier), ax=ax,
                    title=f"{what} at the pier x=60 on an elastic bearing (rigid bearing dashed)")
    xs, ys = getattr(girder, what)(pier).sample()
    ax.plot(xs, ys, color=views.style.INK, linewidth=0.9, linestyle=(0, (4, 2)), label="rigid pier")
plt.show()

for label, beam in (("rigid pier", girder), ("elastic pier", soft)):
    print(f"{label:13s}: max R = {beam.reaction(pier).maximum.value:.3f},  "
          f"min M over pier = {beam.moment(pier).minimum.value:.3f} kN·m/kN")
"""),
    ("md", """
## A line as a formula

For a small beam with exact inputs, ask for `exact=True`: the line comes in
rational arithmetic and `line.expr` is a piecewise cubic that can go into a
calculation as it stands. Another scenario of our own: a two-span footbridge
girder of 16.5 m and 21 m, with a plate welded over the pier that raises its
flexural stiffness from 120 to 180 MN·m² for 3 m either side of it. The moment
over the pier for a unit load at *x* (kN·m per kN):
"""),
    ("code", """
footbridge = ilkit.Beam(
    37.5, {0: "pin", 16.5: "roller", 37.5: "roller"},
    EI=[(0, 13.5, 1.2e5), (13.5, 19.5, 1.8e5), (19.5, 37.5, 1.2e5)],   # kN·m²
    units="kN-m",
)
exact_line = footbridge.moment(16.5, exact=True)
print(exact_line.is_exact)
print(exact_line.expr)
eta = exact_line.ordinate_exact(8.25)   # the load at midspan of the first span
print(f"ordinate for the load at x = 8.25 m: {eta} = {float(eta):.4f} kN·m/kN")
"""),
    ("code", """
views.formula(exact_line, 5)   # the same line with decimal coefficients, for reading
"""),
    ("md", """
How that line is obtained, written out for the calculation package by the
force method: the pier reaction is released, leaving a simple span of 37.5 m
(the primary structure); the flexibility coefficient is the primary
structure's deflection at the pier under a unit force there; compatibility
gives the redundant for every load position; the pier moment follows by
statics. The ordinates are set beside those of the stiffness method, which
computed the line. (`views.derivation(line, method="stiffness")` writes out
the stiffness method instead.)
"""),
    ("code", """
views.derivation(exact_line)
"""),
]

if __name__ == "__main__":
    build(Path(__file__).resolve().parent.parent / "notebooks" / "continuous_girder.ipynb", CELLS)
