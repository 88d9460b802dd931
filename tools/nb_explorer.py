"""Source of notebooks/explorer.ipynb (run it to rebuild the notebook)."""

from pathlib import Path

from make_notebook import build

CELLS = [
    ("md", """
# Exploring a girder by moving a load

A scenario of our own: a two-span girder of 24 m and 26 m with a hinge 6 m
into the second span and a 12 m cantilever beyond the last pier. Units kN and m.

Move the load with the slider, type a section into the box, pick another
quantity, or jump to the worst placement. Open this notebook in JupyterLab
(`.venv/bin/jupyter lab notebooks/explorer.ipynb`) to drive it; on a page
without a kernel the figure shows as a still.

> Results must be checked by a qualified engineer; local codes and licensed practice govern.
"""),
    ("code", """
%matplotlib inline
import ilkit

girder = ilkit.Beam(
    length=62,
    supports={0: "pin", 24: "roller", 50: "roller"},
    hinges=[30],
    units="kN-m",
)
explorer = girder.explore(quantity="moment", at=12)
explorer
"""),
    ("md", """
## Driving the explorer from code

The controls are widgets: setting their values moves the load and changes the
section. The read-out follows at once and equals the core's ordinate.
"""),
    ("code", """
explorer.position.value = 20.0
assert explorer.value == girder.moment(12)(20.0)
explorer.value
"""),
    ("code", """
explorer.location.value = "24"
explorer.largest.click()
line = girder.moment(24)
assert (explorer.position.value, explorer.value) == (line.maximum.x, line.maximum.value)
explorer.position.value, explorer.value
"""),
    ("code", """
explorer.smallest.click()
explorer.position.value, explorer.value
"""),
]

if __name__ == "__main__":
    build(Path(__file__).resolve().parent.parent / "notebooks" / "explorer.ipynb", CELLS)
