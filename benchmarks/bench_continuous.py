"""Speed of continuous-beam influence lines, against a naive moving-load baseline.

A five-span continuous girder with haunches over the piers (our own demo
girder).  Printed:

* the time to assemble and factorise the beam once;
* one influence line built and evaluated at 2,001 load positions
  (target: under 2 ms per line once the beam is assembled);
* every moment and shear line at 200 sections (target: under 0.2 s);
* a naive baseline written here with numpy/scipy: for each of the 2,001 load
  positions, mesh the girder with nodes at the supports, the EI changes, the
  section and the load, assemble, solve, and read the moment at the section
  (target: ilkit at least 100 times faster, agreeing to 1e-9 relative).

Run: ``.venv/bin/python benchmarks/bench_continuous.py`` (or ``make bench``).
Exits with status 1 if the baseline and ilkit disagree.
"""

from __future__ import annotations

import time
from fractions import Fraction

import numpy as np
import scipy.linalg

import ilkit
from ilkit.analysis import influence_line
from ilkit.quantity import Quantity
from ilkit.stiffness import elastic_model

SPANS = [30.0, 38.0, 42.0, 38.0, 30.0]
EI_SPAN, EI_HAUNCH, HAUNCH = 6.0e6, 9.5e6, 4.0  # kN·m², kN·m², m either side of a pier
N_POSITIONS, N_SECTIONS = 2001, 200


def girder() -> ilkit.Beam:
    piers = np.cumsum([0.0, *SPANS])
    length = float(piers[-1])
    cuts = sorted({0.0, length, *[p + s for p in piers[1:-1] for s in (-HAUNCH, HAUNCH)]})
    ranges = []
    for a, b in zip(cuts[:-1], cuts[1:]):
        haunch = any(abs((a + b) / 2 - p) < HAUNCH for p in piers[1:-1])
        ranges.append((a, b, EI_HAUNCH if haunch else EI_SPAN))
    supports = {float(p): ("pin" if i == 0 else "roller") for i, p in enumerate(piers)}
    return ilkit.Beam(length, supports, EI=ranges, units="kN-m")


# ------------------------------------------------------------------ baseline
def _element(h: float, ei: float) -> np.ndarray:
    """Bernoulli beam element stiffness, degrees of freedom (v1, θ1, v2, θ2), v down, θ clockwise."""
    a, b, c = 12 * ei / h**3, 6 * ei / h**2, 2 * ei / h
    return np.array([[a, b, -a, b], [b, 2 * c, -b, c], [-a, -b, a, -b], [b, c, -b, 2 * c]])


def _point_load(xi: float, h: float) -> np.ndarray:
    """Handbook fixed-end forces of a unit point load at xi·h, reversed (Hermite shape functions)."""
    return np.array([1 - 3 * xi**2 + 2 * xi**3, h * xi * (1 - xi) ** 2, 3 * xi**2 - 2 * xi**3, h * xi**2 * (xi - 1)])


def naive_moment(beam: ilkit.Beam, section: float, loads: np.ndarray) -> np.ndarray:
    """Bending moment at ``section`` for a unit load at each position, assembling and solving the girder anew
    for every position (nodes at the ends, supports, EI changes and the section)."""
    supports = [float(s.at) for s in beam.supports]
    ranges = [(float(a), float(b), float(e)) for a, b, e in beam.EI_ranges]
    nodes = np.array(sorted({*supports, *[a for a, _, _ in ranges], float(beam.length), section}))
    restrained = {2 * int(np.searchsorted(nodes, s)) for s in supports}
    free = np.array([k for k in range(2 * nodes.size) if k not in restrained])
    at = int(np.searchsorted(nodes, section))  # the element that starts at the section
    out = np.empty(loads.size)
    for i, xp in enumerate(loads):
        n = 2 * nodes.size
        K = np.zeros((n, n))
        elements = []
        for j in range(nodes.size - 1):
            h = nodes[j + 1] - nodes[j]
            mid = (nodes[j] + nodes[j + 1]) / 2
            k = _element(h, next(e for a, b, e in ranges if a <= mid <= b))
            K[2 * j : 2 * j + 4, 2 * j : 2 * j + 4] += k
            elements.append(k)
        j = min(int(np.searchsorted(nodes, xp, side="right")) - 1, nodes.size - 2)
        h = nodes[j + 1] - nodes[j]
        f = np.zeros(n)
        f[2 * j : 2 * j + 4] = _point_load((xp - nodes[j]) / h, h)
        d = np.zeros(n)
        d[free] = scipy.linalg.solve(K[np.ix_(free, free)], f[free], assume_a="pos")
        end_forces = elements[at] @ d[2 * at : 2 * at + 4]
        if j == at:
            end_forces -= f[2 * at : 2 * at + 4]
        out[i] = end_forces[1]  # clockwise end couple on the element's left face = sagging moment
    return out


def main() -> int:
    beam = girder()
    length = float(beam.length)
    xs = np.linspace(0.0, length, N_POSITIONS)
    pier = float(SPANS[0] + SPANS[1])  # the second pier: hogging moment
    print(f"girder: spans {SPANS} m, haunches ±{HAUNCH} m at the piers, degree {beam.degree}")

    t0 = time.perf_counter()
    model = elastic_model(beam)
    t_assemble = time.perf_counter() - t0
    print(f"assemble and factorise once:                {t_assemble * 1e3:8.2f} ms  "
          f"({model.ndof} degrees of freedom, condition {model.condition:.1e})")

    # one line at 2,001 positions, many different sections (no line cache: the analysis is called directly)
    sections = [Fraction(round(length * (k + 0.37) / 50, 6)) for k in range(50)]
    t0 = time.perf_counter()
    for a in sections:
        influence_line(beam, Quantity("moment", a))(xs)
    t_line = (time.perf_counter() - t0) / len(sections)
    print(f"one line, built and evaluated at {N_POSITIONS} points: {t_line * 1e3:8.3f} ms   (target < 2 ms) "
          f"{'met' if t_line < 2e-3 else 'MISSED'}")

    grid = [Fraction(round(length * (k + 0.5) / N_SECTIONS, 6)) for k in range(N_SECTIONS)]
    t0 = time.perf_counter()
    for a in grid:
        influence_line(beam, Quantity("moment", a))
        influence_line(beam, Quantity("shear", a))
    t_all = time.perf_counter() - t0
    print(f"moment and shear lines at {N_SECTIONS} sections:     {t_all * 1e3:8.1f} ms  (target < 200 ms) "
          f"{'met' if t_all < 0.2 else 'MISSED'}")

    worst = 0.0
    for name, section in (("pier", pier), ("midspan", pier + SPANS[2] / 2)):
        t0 = time.perf_counter()
        ours = influence_line(beam, Quantity("moment", Fraction(section)))(xs)
        t_ours = time.perf_counter() - t0
        t0 = time.perf_counter()
        naive = naive_moment(beam, section, xs)
        t_naive = time.perf_counter() - t0
        ratio = t_naive / t_ours
        rel = float(np.max(np.abs(ours - naive)) / np.max(np.abs(naive)))
        worst = max(worst, rel)
        print(f"{name} moment at x={section:g}: naive baseline ({N_POSITIONS} re-solves) {t_naive * 1e3:7.1f} ms, "
              f"ilkit {t_ours * 1e3:6.3f} ms, speed-up {ratio:,.0f}x (target >= 100x) "
              f"{'met' if ratio >= 100 else 'MISSED'}; largest difference {rel:.1e} of the largest ordinate "
              f"(target <= 1e-9) {'met' if rel <= 1e-9 else 'MISSED'}")
    return 0 if worst <= 1e-9 else 1


if __name__ == "__main__":
    raise SystemExit(main())
