"""Speed of factored envelopes on top of the live-load envelope.

A four-span continuous girder of our own (100, 130, 130, 100 ft, EI varying
over the piers: the force effects depend on the stiffness ratios, so the
lines are those of a real composite girder) at tenth points (both faces at
the piers), under:

* two permanent loads (a wet deck on the steel girder alone, DC; a wearing
  surface on the composite girder, DW: two stages, two beams of the same
  geometry);
* AASHTO HL-93 for one girder (distribution factors given), and the fatigue
  truck (IM 15 %, without multiple presence) for the fatigue limit states;
* every AASHTO LRFD limit state (Strength I and II, Service I, II and III,
  Fatigue I and II).

Printed, best of five runs each, on a fresh beam every run (no cached lines):

* the live-load envelopes alone (:func:`ilkit.design.live_envelope` of HL-93
  and of the fatigue truck);
* the permanent effects (:func:`ilkit.design.permanent_effects`);
* the factored envelope given the live-load envelopes
  (:func:`ilkit.design.factored_envelope`);
* on top of the live-load envelope: the permanent effects and the factored
  envelope together (target: under 0.5 s, issue 11);
* the whole: permanent effects, live-load envelopes and the factored envelope.

Run: ``.venv/bin/python benchmarks/bench_design.py`` (or ``make bench``).
Exits with status 1 if the work on top of the live-load envelope is over
its target.
"""

from __future__ import annotations

import sys
import time

import numpy as np

import ilkit
from ilkit import design, loads

SPANS = [100.0, 130.0, 130.0, 100.0]
TARGET = 0.5  # s, factored envelope on top of the live-load envelope
PIER_ZONE = 0.2  # fraction of the longer adjacent span each side of a pier with the heavier section


def girder(EI_span: float, EI_pier: float) -> ilkit.Beam:
    piers = np.cumsum([0.0, *SPANS])
    supports = {float(p): ("pin" if i == 0 else "roller") for i, p in enumerate(piers)}
    edges = [0.0]
    for k, p in enumerate(piers[1:-1], start=1):
        zone = PIER_ZONE * max(SPANS[k - 1], SPANS[k])
        edges += [float(p) - zone, float(p) + zone]
    edges.append(float(piers[-1]))
    ranges = [(a, b, EI_pier if i % 2 else EI_span) for i, (a, b) in enumerate(zip(edges, edges[1:]))]
    return ilkit.Beam(float(piers[-1]), supports, EI=ranges, units="kip-ft")


def study() -> dict[str, float]:
    steel = girder(8.46e6, 1.57e7)
    composite = girder(2.38e7, 1.85e7)
    times: dict[str, float] = {}
    t0 = time.perf_counter()
    permanent = design.permanent_effects(
        [design.Stage("steel alone", steel, [design.DistributedLoad("wet deck", "DC", 1.05)]),
         design.Stage("composite", composite, [design.DistributedLoad("wearing surface", "DW", 0.20)])],
        quantities=("moment", "shear", "reaction"))
    times["permanent effects"] = time.perf_counter() - t0
    g = design.given_distribution(0.78, 0.92, includes_multiple_presence=True, girder="interior")
    gf = design.given_distribution(0.45, 0.55, girder="interior, fatigue")
    hl93 = design.GirderLiveLoad(loads.hl93(), distribution=g)
    fatigue = design.GirderLiveLoad(loads.fatigue_truck(), distribution=gf)
    t0 = time.perf_counter()
    live = {"*": design.live_envelope(composite, hl93),
            "Fatigue I": (fat := design.live_envelope(composite, fatigue)), "Fatigue II": fat}
    times["live-load envelopes"] = time.perf_counter() - t0
    t0 = time.perf_counter()
    design.factored_envelope(composite, permanent=permanent, live=live, limit_states="AASHTO")
    times["factored envelope"] = time.perf_counter() - t0
    times["on top of the live load"] = times["permanent effects"] + times["factored envelope"]
    times["whole"] = times["on top of the live load"] + times["live-load envelopes"]
    return times


def main() -> int:
    runs = [study() for _ in range(5)]
    best = {k: min(r[k] for r in runs) for k in runs[0]}
    rows = len(ilkit.design.envelope_sections(girder(1.0, 2.0), 10))
    print(f"four-span girder {'+'.join(f'{s:g}' for s in SPANS)} ft, {rows} sections (tenth points, both faces "
          "at the piers), 7 AASHTO limit states, HL-93 and the fatigue truck, DC and DW in two stages")
    for name, t in best.items():
        print(f"  {name:<24} {1000 * t:8.1f} ms")
    top = best["on top of the live load"]
    print(f"permanent effects and factored envelope on top of the live-load envelope: {1000 * top:.1f} ms "
          f"(target under {1000 * TARGET:.0f} ms: {top / TARGET:.2f} of it)")
    return 0 if top < TARGET else 1


if __name__ == "__main__":
    sys.exit(main())
