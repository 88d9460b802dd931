"""Speed of a load rating: a three-span girder at tenth points, HL-93 and the full legal set.

A three-span continuous steel girder of our own (80, 100, 80 ft, the first span less stiff), rated at the
tenth points of every span (both faces at the piers), for moment and shear, both senses, with
:func:`ilkit.rating.rate_girder` for the design load at both levels (HL-93) and the full legal set (Type 3,
3S2, 3-3, the lane-type legal load, SU4 to SU7, the NRL): 11 rating loads.  Each run starts
from a fresh beam (its influence lines computed again).  Printed: the best of five runs (target: under
2 s), the time per rating load, the rows rated, and the controlling rating factors (a check that the
numbers did not change while speeding up).

Run: ``.venv/bin/python benchmarks/bench_rating.py`` (or ``make bench``).  Exits with status 1 above the
target.
"""

from __future__ import annotations

import sys
import time

import ilkit
from ilkit import design, rating

TARGET = 2.0  # seconds


def girder() -> ilkit.Beam:
    return ilkit.Beam(260, {0: "pin", 80: "roller", 180: "roller", 260: "roller"},
                      EI=[(0, 80, 3.6e6), (80, 260, 4.2e6)], units="kip-ft")


def rate() -> rating.GirderRating:
    beam = girder()
    dead = [design.DistributedLoad("steel and slab", "DC", 1.1), design.DistributedLoad("overlay", "DW", 0.2)]
    permanent = design.permanent_effects(beam, dead, quantities=("moment", "shear"))
    return rating.rate_girder(
        beam, permanent=permanent, distribution=design.given_distribution(0.68, 0.8),
        resistances=rating.Resistances(positive_moment=[(0, 80, 2200), (80, 260, 3100)], negative_moment=2900,
                                       shear=450),
        loads=["design", "legal"], adtt=2000)


def main() -> int:
    times = []
    result = None
    for _ in range(5):
        start = time.perf_counter()
        result = rate()
        times.append(time.perf_counter() - start)
    assert result is not None
    best = min(times)
    n = len(result.loads)
    print(f"three-span girder, {len(result.sections)} sections, {n} rating loads, {len(result.frame)} rated rows")
    print(f"rate_girder (permanent effects included): best {best:.3f} s of 5 (median {sorted(times)[2]:.3f} s); "
          f"target under {TARGET:.1f} s: {'met' if best < TARGET else 'NOT MET'} (ratio {TARGET / best:.1f}x)")
    print(f"per rating load: {1000 * best / n:.1f} ms")
    for row in result.controlling().itertuples():
        print(f"  {row.vehicle:16s} RF {row.RF:6.3f}  {row.quantity} {row.sense} at x={row.x:g} {row.side}")
    return 0 if best < TARGET else 1


if __name__ == "__main__":
    sys.exit(main())
