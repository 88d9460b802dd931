"""Kernel-side time of one slider step of the explorer.

The three-span continuous girder of ``notebooks/explorer.ipynb`` (28 + 40 +
28 m, haunched over the piers; our own demo girder) under our own five-axle
service vehicle.  The explorer is driven headless: the load slider
is stepped across the girder and back, in both travel directions, for the
pier moment, a mid-span moment and the shear at a pier, and each step is
timed from setting ``slider.value`` to the figure being ready to send:

* ``inline``: core call, read-out, blit of the moving load on the cached
  background, PNG of the figure placed in the output widget;
* ``ipympl``: core call, read-out, blit and the changed pixels encoded for
  the browser (as in a live session, after the browser has connected).

Outside a kernel the coalesced redraw runs at once, so every step pays for
a full redraw of the moving load: this is the cost of one step when the
slider moves slowly (fast drags coalesce several steps into one redraw).
Also printed: the read-out alone (the core call and the text), a change of
quantity (a new background), and a jump to the worst placement.

Target: median step under 30 ms.  Run: ``.venv/bin/python benchmarks/bench_explorer.py``.
"""

from __future__ import annotations

import statistics
import time

import numpy as np

import ilkit
from ilkit.views.explorer import Explorer

GIRDER = ilkit.Beam(
    length=96,
    supports={0: "pin", 28: "roller", 68: "roller", 96: "roller"},
    EI=[(0, 24, 4.2e6), (24, 32, 6.3e6), (32, 64, 4.2e6), (64, 72, 6.3e6), (72, 96, 4.2e6)],
    units="kN-m",
)
VEHICLE = ilkit.AxleTrain(
    [60, 110, 110, 95, 95], [3.4, 1.35, 5.8, 1.35], units="kN-m", name="five-axle service vehicle"
)  # our own vehicle (kN, m), lead axle first
TARGET_MS = 30.0
SECTIONS = [("moment", "28"), ("moment", "48"), ("shear", "68")]


def timed(control, value) -> float:
    """Milliseconds to set a control's value and have the explorer finish with it."""
    start = time.perf_counter()
    control.value = value
    return (time.perf_counter() - start) * 1e3


def drive(backend: str) -> dict[str, list[float]]:
    explorer = Explorer(GIRDER, [VEHICLE], backend=backend)
    if backend == "ipympl":
        # as after the browser's "initialized" message: ipympl stops keeping a full PNG still per frame
        explorer._figure.live.widget.syncing_data_url = False
    explorer.load.value = VEHICLE.name
    slider = explorer.slider
    steps = range(slider.min, slider.max, 40)
    out: dict[str, list[float]] = {"step": [], "read-out": [], "new quantity": [], "worst placement": []}
    for kind, at in SECTIONS:
        out["new quantity"].append(timed(explorer.quantity, kind) + timed(explorer.location, at))
        for direction in ("left to right", "right to left"):
            explorer.direction.value = direction
            for x in [*steps, *steps[::-1]]:
                out["step"].append(timed(slider, int(x)))
        for x in steps:  # the read-out alone: what the step does before the coalesced redraw
            slider.value = int(x)
            start = time.perf_counter()
            explorer._update_value()
            out["read-out"].append((time.perf_counter() - start) * 1e3)
        for button in (explorer.largest, explorer.smallest):
            start = time.perf_counter()
            button.click()
            out["worst placement"].append((time.perf_counter() - start) * 1e3)
    explorer.close()
    return out


def main() -> int:
    print(f"girder: {GIRDER!r}")
    print(f"load:   {VEHICLE!r}")
    worst = 0.0
    for backend in ("inline", "ipympl"):
        figures = drive(backend)
        print(f"\n{backend}:")
        for name, values in figures.items():
            median = statistics.median(values)
            p90 = float(np.percentile(values, 90))
            print(f"  {name:16s} median {median:7.2f} ms   90th percentile {p90:7.2f} ms   ({len(values)} runs)")
        step = statistics.median(figures["step"])
        worst = max(worst, step)
        print(f"  slider step: {step:.2f} ms median, target < {TARGET_MS:.0f} ms -> ratio {TARGET_MS / step:.1f}x")
    print(f"\n{'OK' if worst < TARGET_MS else 'ABOVE TARGET'}: slowest median step {worst:.2f} ms")
    return 0


if __name__ == "__main__":
    raise SystemExit(main())
