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
import numpy as np
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
girder.is_determinate, girder.degree, girder.parts
"""),
    ("md", """
## Influence lines

The governing quantities: the reaction at the first pier, the hogging moment
over it, the shear just right of it, the shear passed through the left hinge,
the sagging moment at the middle of the anchor span and at the middle of the
suspended span.
"""),
    ("code", """
lines = {
    "R at pier B (x=32)": girder.reaction(32),
    "M over pier B (x=32)": girder.moment(32),
    "V right of pier B": girder.shear(32, side="right"),
    "V through hinge (x=41)": girder.hinge_shear(41),
    "M mid anchor span (x=16)": girder.moment(16),
    "M mid suspended span (x=54)": girder.moment(54),
}
for name, line in lines.items():
    print(f"{name:30s} {line.expr}")
"""),
    ("code", """
fig, axes = plt.subplots(len(lines), 1, figsize=(9, 2.1 * len(lines)), sharex=True)
for ax, (name, line) in zip(axes, lines.items()):
    xs, ys = line.sample()
    ax.plot(xs, ys, color="black", lw=1.2)
    ax.fill_between(xs, ys, 0, where=ys >= 0, color="0.8", interpolate=True, lw=0)
    ax.fill_between(xs, ys, 0, where=ys <= 0, color="0.93", interpolate=True, lw=0)
    ax.axhline(0, color="black", lw=0.6)
    for xk, left, right in line.knot_values():
        for value in {round(left, 9), round(right, 9)}:
            if value and 0 < xk < float(girder.length) or (value and xk in (0.0, float(girder.length))):
                ax.annotate(f"{value:.3g}", (xk, value), textcoords="offset points", xytext=(3, 3), fontsize=8)
    for s in girder.supports:
        ax.plot(float(s.at), 0, marker="^", color="black", ms=6)
    for h in girder.hinges:
        ax.plot(float(h), 0, marker="o", mfc="white", mec="black", ms=5)
    ax.set_ylabel(line.unit, fontsize=8)
    ax.set_title(name, fontsize=9, loc="left")
axes[-1].set_xlabel("load position x [m]")
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
summary = pd.DataFrame(
    {
        "max": [line.maximum.value for line in lines.values()],
        "at x [m]": [line.maximum.x for line in lines.values()],
        "min": [line.minimum.value for line in lines.values()],
        "at x [m] ": [line.minimum.x for line in lines.values()],
        "positive area": [line.positive_area for line in lines.values()],
        "negative area": [line.negative_area for line in lines.values()],
    },
    index=list(lines),
).round(4)
summary
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
