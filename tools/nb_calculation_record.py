"""Source of notebooks/calculation_record.ipynb (run it to rebuild the notebook)."""

from pathlib import Path

from make_notebook import build

CELLS = [
    ("md", """
# Calculation record: derivations, sketches, tables and a calculation sheet

The girder of `hinged_girder.ipynb` (a scenario of our own: anchor spans of
32 m, a 44 m centre span of two 9 m cantilevers and a 26 m suspended span on
hinges; kN and m), written up for a calculation package: every influence line
explains how it was obtained, draws its Müller-Breslau sketch and exports its
ordinates.

> Results must be checked by a qualified engineer; local codes and licensed practice govern.
"""),
    ("code", """
%matplotlib inline
import tempfile
from pathlib import Path

import pandas as pd
import pint

import ilkit
from ilkit import views

pd.set_option("display.precision", 4)
girder = ilkit.Beam(
    length=108,
    supports={0: "pin", 32: "roller", 76: "roller", 108: "roller"},
    hinges=[41, 67],
    units="kN-m",
)
girder  # a notebook shows the diagram and a summary; repr(girder) stays short
"""),
    ("md", """
## How the line of the moment over pier B is obtained

The derivation is written from the analysis itself: the release inserted, the
rigid parts of the mechanism, the conditions solved, each part's movement, the
ordinates by small-angle geometry, and the final expression (exact rationals).
"""),
    ("code", """
m_b = girder.moment(32)
views.derivation(m_b)
"""),
    ("md", """
## The Müller-Breslau sketch

The released beam in its displaced shape: a hinge at the section with a unit
kink, the supports, the ordinates at the breakpoints, positive and negative
parts shaded.
"""),
    ("code", """
ax = views.sketch(m_b)
"""),
    ("code", """
ax = views.sketch(girder.shear(32, side="right"))
"""),
    ("md", """
## Tables for the calculation package

Units are in the column names. The same table goes to CSV, Excel and LaTeX.
"""),
    ("code", """
views.table(m_b)
"""),
    ("code", """
print(views.to_latex(m_b, caption="Moment over pier B", label="tab:mb"))
"""),
    ("md", """
## Units

Lengths may be given as pint quantities; they are converted exactly
(1 ft = 0.3048 m) into the beam's system. Changing the system of an existing
beam converts every number.
"""),
    ("code", """
ureg = pint.UnitRegistry()
metric = ilkit.Beam(
    length=354 * ureg.ft,
    supports={0: "pin", 105 * ureg.ft: "roller", 249 * ureg.ft: "roller", 354 * ureg.ft: "roller"},
    hinges=[135 * ureg.ft, 219 * ureg.ft],
    units="kN-m",
)
print(repr(metric))
print(repr(girder.in_units("kip-ft")))
"""),
    ("md", """
## The calculation sheet

One call writes the sheet as HTML (self-contained) and Markdown (figures as
SVG files beside it): inputs, every line with its sketch, table and
derivation, method and the caution.
"""),
    ("code", """
folder = Path(tempfile.mkdtemp())
lines = [girder.reaction(32), m_b, girder.shear(32, side="right"), girder.hinge_shear(41), girder.moment(54)]
sheet = views.write_calculation_sheet(girder, folder / "girder", lines=lines, title="Suspended-span girder")
print(sheet.html.name, sheet.markdown.name)
print(sorted(p.name for p in sheet.figures.iterdir()))
"""),
]

if __name__ == "__main__":
    build(Path(__file__).resolve().parent.parent / "notebooks" / "calculation_record.ipynb", CELLS)
