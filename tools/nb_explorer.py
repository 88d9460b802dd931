"""Source of notebooks/explorer.ipynb (run it to rebuild the notebook)."""

from pathlib import Path

from make_notebook import build

CELLS = [
    ("md", """
# Exploring a continuous road girder with a moving vehicle

A scenario of our own: a three-span continuous girder of 28 m, 40 m and 28 m,
stiffer over the piers (haunches 4 m either side), carrying a five-axle
service vehicle of our own and the EN 1991-2 Load Model 1 on notional lane 1.
Units kN and m.

Move the vehicle with the slider, type a section into the box, pick another
quantity, jump to the worst placement, or switch to the envelope. To drive it,
open this notebook in JupyterLab: `.venv/bin/jupyter lab notebooks/explorer.ipynb`
(or serve it as a page: `.venv/bin/voila notebooks/explorer.ipynb`). On a page
rendered without a kernel the explorer shows as a still.

> Results must be checked by a qualified engineer; the local design codes, the
> licensed current editions of the standards and licensed practice govern.
"""),
    ("code", """
%matplotlib inline
import ilkit

girder = ilkit.Beam(
    length=96,
    supports={0: "pin", 28: "roller", 68: "roller", 96: "roller"},
    EI=[(0, 24, 4.2e6), (24, 32, 6.3e6), (32, 64, 4.2e6), (64, 72, 6.3e6), (72, 96, 4.2e6)],
    units="kN-m",
)
vehicle = ilkit.AxleTrain(
    [60, 110, 110, 95, 95], [3.4, 1.35, 5.8, 1.35], units="kN-m", name="five-axle service vehicle"
)
explorer = girder.explore(
    {"service vehicle": vehicle, "LM1 lane 1": ilkit.loads.lm1()}, quantity="moment", at=28
)
explorer
"""),
    ("md", """
## The envelope over the first pier

The envelope view draws the largest and smallest moment of a load model at
every section; the read-out adds the extremes at the chosen section, the same
numbers `ilkit.extremes` gives.
"""),
    ("code", """
explorer.model.value = "LM1 lane 1"
explorer.envelope.value = True
ilkit.extremes(girder.moment(28), ilkit.loads.lm1(), beam=girder)
"""),
    ("code", """
explorer.still()
"""),
    ("md", """
## The worst placement of the service vehicle

The *smallest* button moves the vehicle to where the hogging moment over the
first pier is largest in magnitude; the read-out is the core's placement.
"""),
    ("code", """
explorer.envelope.value = False
explorer.load.value = "service vehicle"
explorer.smallest.click()
worst = ilkit.place(girder.moment(28), vehicle, "min", beam=girder)
assert abs(explorer.value - worst.value) <= 1e-9 * abs(worst.value)
placed = worst.placements[0]
print(f"M over pier B: {worst.value:.1f} kN·m, travelling {placed.direction}, lead axle at x = {placed.front:.2f} m")
"""),
    ("md", """
## Moving the vehicle from code

The controls are widgets: setting their values moves the vehicle; the
read-out follows at once and equals `ilkit.stand`, the effect of the vehicle
standing there.
"""),
    ("code", """
explorer.direction.value = "left to right"
explorer.position.value = 45.0
standing = ilkit.stand(girder.moment(28), vehicle, 45.0, direction="left to right")
assert explorer.value == standing.effect
print(f"M over pier B with the lead axle at x = 45 m: {explorer.value:.1f} kN·m")
"""),
]

if __name__ == "__main__":
    build(Path(__file__).resolve().parent.parent / "notebooks" / "explorer.ipynb", CELLS)
