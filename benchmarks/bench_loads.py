"""Speed of moving-load envelopes, against a brute-force stepping baseline.

A four-span continuous girder of our own (100, 130, 130, 100 ft, constant
EI), 200 sections (50 per span, both faces at the piers), under the full
AASHTO HL-93 model: design truck with every rear spacing from 14 to 30 ft,
design tandem, design lane, and the two-truck rule for negative moment and
interior reactions, both travel directions.  Printed:

* ilkit's envelope (influence lines, placement, reactions and the absolute
  maximum moment), best of five runs on a fresh beam (target: under 0.15 s,
  from about 0.6 s before the search ran on all the lines of a beam at once),
  and the same for a three-span girder of our own at tenth points (target:
  under 30 ms);
* the placement of trains with 1 to 24 varying spacings (the search must not
  grow exponentially with them) and of a 4,000-axle train, and how fast a
  search too large is refused;
* a baseline written here: for every line, step the lead axle along the
  girder in both directions for every rear spacing (and every gap between
  the two trucks) on a grid, sum load x ordinate, keep the extremes.  It is
  timed on every tenth section row and all reactions and scaled to all rows;
  its error against ilkit's exact extremes is printed with its step.  The
  baseline is less precise than ilkit (whose positions are exact to
  rounding), so the ratio is a lower bound of the ratio at equal precision
  (target: at least 20 times).

Run: ``.venv/bin/python benchmarks/bench_loads.py`` (or ``make bench``).
Exits with status 1 if the baseline ever beats ilkit's extreme (it must not:
ilkit's extremes are exact).
"""

from __future__ import annotations

import sys
import time

import numpy as np

import ilkit
from ilkit.loads import envelope, hl93

SPANS = [100.0, 130.0, 130.0, 100.0]
DIVISIONS = 50  # per span: 200 sections
STEP = 0.1  # ft, baseline lead-axle step
SPACING_STEP = 0.5  # ft, baseline rear-spacing step
GAP_STEP = 1.0  # ft, baseline step of the gap between two trucks
IM, LANE, TWO = 0.33, 0.64, 0.90


def girder() -> ilkit.Beam:
    piers = np.cumsum([0.0, *SPANS])
    supports = {float(p): ("pin" if i == 0 else "roller") for i, p in enumerate(piers)}
    return ilkit.Beam(float(piers[-1]), supports, EI=1, units="kip-ft")


def best_of(fn, repeat: int = 3) -> tuple[float, object]:
    times, out = [], None
    for _ in range(repeat):
        t0 = time.perf_counter()
        out = fn()
        times.append(time.perf_counter() - t0)
    return min(times), out


# ------------------------------------------------------------------ baseline
def stepped(line, loads: np.ndarray, offsets: np.ndarray) -> tuple[float, float]:
    """Largest and smallest sum of load x ordinate over a grid of lead-axle positions, both directions.

    Axles that would reduce the extreme are left out (AASHTO 3.6.1.3.1), as in ilkit.
    """
    length = line.length
    hi, lo = 0.0, 0.0
    for offs in (offsets, offsets[-1] - offsets):
        lead = np.arange(-offs.max() - STEP, length + STEP, STEP)
        ordinates = line(lead[:, None] + offs[None, :])
        hi = max(hi, float((np.maximum(ordinates, 0.0) @ loads).max()))
        lo = min(lo, float((np.minimum(ordinates, 0.0) @ loads).min()))
    return hi, lo


def baseline(line, two_trucks_max: bool, two_trucks_min: bool) -> tuple[float, float]:
    truck = np.array([8.0, 32.0, 32.0])
    tandem_hi, tandem_lo = stepped(line, np.array([25.0, 25.0]), np.array([0.0, 4.0]))
    truck_hi, truck_lo = 0.0, 0.0
    for rear in np.arange(14.0, 30.0 + 1e-9, SPACING_STEP):
        hi, lo = stepped(line, truck, np.array([0.0, 14.0, 14.0 + rear]))
        truck_hi, truck_lo = max(truck_hi, hi), min(truck_lo, lo)
    lane_hi, lane_lo = LANE * line.positive_area, LANE * line.negative_area
    best_hi = (1 + IM) * max(truck_hi, tandem_hi) + lane_hi
    best_lo = (1 + IM) * min(truck_lo, tandem_lo) + lane_lo
    if two_trucks_max or two_trucks_min:
        pair_hi, pair_lo = 0.0, 0.0
        for gap in np.arange(50.0, line.length + GAP_STEP, GAP_STEP):
            offs = np.array([0.0, 14.0, 28.0, 28.0 + gap, 42.0 + gap, 56.0 + gap])
            hi, lo = stepped(line, np.concatenate([truck, truck]), offs)
            pair_hi, pair_lo = max(pair_hi, hi), min(pair_lo, lo)
        if two_trucks_max:
            best_hi = max(best_hi, TWO * ((1 + IM) * pair_hi + lane_hi))
        if two_trucks_min:
            best_lo = min(best_lo, TWO * ((1 + IM) * pair_lo + lane_lo))
    return best_hi, best_lo


def three_span() -> ilkit.Beam:
    """A three-span girder of our own: 90, 120, 90 ft, constant EI."""
    return ilkit.Beam(300.0, {0.0: "pin", 90.0: "roller", 210.0: "roller", 300.0: "roller"}, EI=1, units="kip-ft")


def growth() -> None:
    """Placement time against the number of varying spacings, a long train, and a refused search."""
    beam = ilkit.Beam(120, {0: "pin", 50: "roller", 120: "roller"}, EI=1, units="kN-m")
    line = beam.moment(33.3)
    print("trains of our own on a two-span girder (50, 70 m), moment at 33.3 m:")
    times = {}
    for k in (1, 2, 3, 6, 12, 24):
        train = ilkit.AxleTrain([10.0, 20.0, 20.0] * (k + 1), ([1.5, 2.0, (3.0, 9.0)] * (k + 1))[:-1], units="kN-m")
        times[k], _ = best_of(lambda train=train: ilkit.extremes(line, train), repeat=2)
        print(f"  {k:2d} varying spacings ({3 * (k + 1):2d} axles)                               {times[k]:8.3f} s")
    print(
        f"  ratio 24 / 12 varying spacings {times[24] / times[12]:5.1f}x, 12 / 6 {times[12] / times[6]:5.1f}x"
        "   (exponential would be 3^k: 531441x, 729x)"
    )
    long = ilkit.AxleTrain([100.0] * 4000, [1.1] * 3999, units="kN-m")
    t_long, _ = best_of(lambda: ilkit.extremes(line, long), repeat=1)
    print(f"  4,000-axle train, both extremes                             {t_long:8.3f} s")
    dense = ilkit.AxleTrain([1.0] * 6000, [0.01] * 5999, units="kN-m")
    t0 = time.perf_counter()
    try:
        ilkit.extremes(line, dense)
    except ilkit.PlacementTooLargeError:
        pass
    print(f"  6,000 axles 0.01 m apart: refused with PlacementTooLargeError in {time.perf_counter() - t0:.3f} s")


def main() -> None:
    model = hl93()
    envelope(girder(), model, divisions=5)  # warm up imports and caches of the model
    t_ilkit, env = best_of(lambda: envelope(girder(), model, divisions=DIVISIONS), repeat=5)
    t_three, _ = best_of(lambda: envelope(three_span(), model, divisions=10), repeat=7)
    rows = env.sections
    n_rows = len(rows)
    n_lines = 2 * n_rows + len(env.reactions)
    print(f"four-span continuous girder {SPANS} ft, {n_rows} section rows, HL-93 (kip, ft)")
    print(
        f"  ilkit envelope (lines, placement, reactions, absolute max)  {t_ilkit:8.3f} s   target < 0.15 s"
        f" ({t_ilkit / 0.15:.2f} of it; {0.6 / t_ilkit:.1f}x faster than the 0.6 s before)"
    )
    print(
        f"three-span girder 90, 120, 90 ft at tenth points, HL-93        {1000 * t_three:8.1f} ms  target < 30 ms"
        f" ({t_three / 0.030:.2f} of it)"
    )

    beam = girder()
    interior = {float(s.at) for s in beam.supports[1:-1]}
    checked, worst, worst_rel, beaten = 0, 0.0, 0.0, False
    t0 = time.perf_counter()
    subset = list(range(0, n_rows, 10))
    for i in subset:
        row = rows.iloc[i]
        x, side = row["x [ft]"], (row["side"] or None)
        for kind, column in (("moment", "M"), ("shear", "V")):
            line = getattr(beam, kind)(x, side=side)
            two_min = kind == "moment" and line.area < 0
            hi, lo = baseline(line, False, two_min)
            unit = "kip·ft" if kind == "moment" else "kip"
            exact_hi, exact_lo = row[f"{column} max [{unit}]"], row[f"{column} min [{unit}]"]
            for b, e in ((hi, exact_hi), (lo, exact_lo)):
                beaten |= abs(b) > abs(e) + 1e-9 * max(1.0, abs(e))
                worst = max(worst, abs(e - b))
                worst_rel = max(worst_rel, abs(e - b) / max(abs(e), 1e-9))
            checked += 2
    for _, r in env.reactions.iterrows():
        line = beam.reaction(r["x [ft]"])
        hi, lo = baseline(line, r["x [ft]"] in interior, False)
        for b, e in ((hi, r["R max [kip]"]), (lo, r["R min [kip]"])):
            beaten |= abs(b) > abs(e) + 1e-9 * max(1.0, abs(e))
            worst = max(worst, abs(e - b))
            worst_rel = max(worst_rel, abs(e - b) / max(abs(e), 1e-9))
        checked += 2
    t_subset = time.perf_counter() - t0
    n_subset_lines = 2 * len(subset) + len(env.reactions)
    t_baseline = t_subset * n_lines / n_subset_lines
    print(
        f"  baseline: step {STEP} ft, rear spacing every {SPACING_STEP} ft, two-truck gap every {GAP_STEP} ft;"
        f" {n_subset_lines} of {n_lines} lines in {t_subset:.2f} s"
    )
    print(f"  baseline scaled to all {n_lines} lines                       {t_baseline:8.2f} s")
    print(
        f"  baseline error against ilkit: largest {worst:.4g} (kip or kip·ft), relative {worst_rel:.2e}"
        f" over {checked} extremes; ilkit positions exact to rounding"
    )
    print(f"  ratio baseline / ilkit                                     {t_baseline / t_ilkit:8.0f}x   target >= 20x")
    best = env.absolute_maximum_moment
    print(f"  absolute maximum moment {best.value:.1f} kip·ft at x = {float(best.quantity.at):.4f} ft ({best.case})")
    growth()
    if beaten:
        print("FAILED: the baseline found a larger extreme than ilkit")
        sys.exit(1)


if __name__ == "__main__":
    main()
