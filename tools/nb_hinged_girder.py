"""Source of notebooks/hinged_girder.ipynb (run it to rebuild the notebook)."""

from pathlib import Path

from make_notebook import build

CELLS = [
    ("md", """
# Three-span highway girder with a suspended span

A scenario of our own: anchor spans of 32 m, a 44 m centre span made of two
9 m cantilevers and a 26 m suspended (drop-in) span on hinges. Units kN and m.

> Results must be checked by a qualified engineer; local codes and licensed practice govern.
"""),
    ("code", """
%matplotlib inline
import matplotlib.pyplot as plt
import pandas as pd

import ilkit

pd.set_option("display.precision", 4)
girder = ilkit.Beam(
    length=108,
    supports={0: "pin", 32: "roller", 76: "roller", 108: "roller"},
    hinges=[41, 67],
    units="kN-m",
)
girder
"""),
    ("md", """
## Determinacy

Three rigid parts (6 unknown movements) held by four supports and two hinges
(6 conditions): the girder is statically determinate and stable.
"""),
    ("code", """
print(f"determinate: {girder.is_determinate}, degree of indeterminacy: {girder.degree}")
print("rigid parts:", ", ".join(f"{float(a):g} to {float(b):g} m" for a, b in girder.parts))
"""),
    ("md", """
## Influence lines

The governing quantities: the reaction at the first pier, the hogging moment
over it, the shear just right of it, the shear passed through the left hinge,
the sagging moment at the middle of the anchor span and at the middle of the
suspended span.
"""),
    ("code", """
from ilkit import views

lines = {
    "R at pier B (x=32)": girder.reaction(32),
    "M over pier B (x=32)": girder.moment(32),
    "V right of pier B": girder.shear(32, side="right"),
    "V through hinge (x=41)": girder.hinge_shear(41),
    "M mid anchor span (x=16)": girder.moment(16),
    "M mid suspended span (x=54)": girder.moment(54),
}
for name, line in lines.items():
    print(f"{name:30s} {views.formula(line, None)}")   # the exact line, each stretch once
"""),
    ("code", """
fig, axes = plt.subplots(len(lines) + 1, 1, figsize=(9, 2.2 * (len(lines) + 1)), sharex=True)
views.draw_beam(girder, ax=axes[0], title="The girder")
for ax, (name, line) in zip(axes[1:], lines.items()):
    views.plot_line(line, ax=ax, title=name)
fig.tight_layout()
plt.show()
"""),
    ("md", """
## Key ordinates

Ordinates just left and right of every breakpoint, and the areas for uniform loads.
"""),
    ("code", """
girder.moment(32).ordinates().round(4)
"""),
    ("code", """
views.summary(lines).round(4)   # extremes with their positions, areas, and the units of each
"""),
    ("md", """
## A check by hand

The moment over pier B from a load on the suspended span: the hinge at 41
carries H = (67 − x)/26 (simple span on the hinges), the 9 m cantilever gives
M_B = −9 H; at x = 54 that is −9 · 13/26 = −4.5 m.
"""),
    ("code", """
from fractions import Fraction

assert girder.moment(32).ordinate_exact(54) == Fraction(-9, 2)
girder.moment(32)(54.0)
"""),
]

if __name__ == "__main__":
    build(Path(__file__).resolve().parent.parent / "notebooks" / "hinged_girder.ipynb", CELLS)
