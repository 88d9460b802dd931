"""Benchmark: exact influence lines of determinate beams.

Prints, for a 12-span hinged determinate girder: time to build the beam, to
derive one influence line, to derive every reaction and the shear and moment
at 100 sections, and to evaluate one line at 10,000 points; then the time of
sympy's own beam module (its influence-line helpers) against ilkit's on the
same simple-span and hinged beams, with the ratio.

Targets (issue "exact influence lines"): under 20 ms per influence line, under
1 ms for the 10,000-point evaluation, and at least 20 times faster than sympy.

Run: ``.venv/bin/python benchmarks/bench_determinate.py``
"""

from __future__ import annotations

import statistics
import time
from collections.abc import Callable

import numpy as np

import ilkit


def best_of(fn: Callable[[], object], repeat: int = 5, number: int = 1) -> float:
    """Best wall time of ``number`` calls, over ``repeat`` rounds (seconds per call)."""
    times = []
    for _ in range(repeat):
        t0 = time.perf_counter()
        for _ in range(number):
            fn()
        times.append((time.perf_counter() - t0) / number)
    return min(times)


def twelve_span_girder() -> dict:
    """12 spans of 30 m, a hinge 6 m into every span after the first (determinate)."""
    span, n = 30, 12
    supports = {i * span: ("pin" if i == 0 else "roller") for i in range(n + 1)}
    hinges = [i * span + 6 for i in range(1, n)]
    return {"length": n * span, "supports": supports, "hinges": hinges}


def main() -> None:
    spec = twelve_span_girder()
    t_build = best_of(lambda: ilkit.Beam(**spec), repeat=5, number=5)
    beam = ilkit.Beam(**spec)
    assert beam.is_determinate

    def one_line() -> None:
        ilkit.Beam(**spec).moment(187)  # new beam: no cache

    fresh = ilkit.Beam(**spec)
    t_line = best_of(one_line, repeat=5, number=3) - t_build

    sections = np.linspace(0, float(beam.length), 102)[1:-1]

    def all_lines() -> None:
        b = ilkit.Beam(**spec)
        for s in b.supports:
            b.reaction(s.at)
        for a in sections:
            a = round(float(a), 3)
            on_support = any(float(s.at) == a for s in b.supports)
            b.shear(a, side="left" if on_support else None)
            b.moment(a)

    t_all = best_of(all_lines, repeat=3)
    n_lines = len(beam.supports) + 2 * len(sections)

    line = fresh.moment(187)
    xs = np.linspace(0, float(beam.length), 10_000)
    line(xs)
    t_eval = best_of(lambda: line(xs), repeat=7, number=20)
    from sympy.core.cache import clear_cache

    def line_with_expr() -> None:
        clear_cache()  # no help from sympy's cache between rounds
        _ = ilkit.Beam(**spec).moment(187).expr

    t_expr = best_of(line_with_expr, repeat=3) - t_build

    print("12-span hinged determinate girder (13 supports, 11 hinges)")
    print(f"  build beam (validation + stability)      {t_build * 1e3:8.3f} ms")
    print(f"  derive one influence line                {t_line * 1e3:8.3f} ms   target < 20 ms")
    print(f"  ... with its sympy Piecewise expression  {t_expr * 1e3:8.3f} ms")
    print(
        f"  all {n_lines} lines (reactions, V and M at 100 sections) {t_all * 1e3:8.1f} ms"
        f"  ({t_all / n_lines * 1e3:.3f} ms per line)"
    )
    print(f"  evaluate one line at 10,000 points       {t_eval * 1e3:8.3f} ms   target < 1 ms")

    from sympy import Rational
    from sympy.physics.continuum_mechanics.beam import Beam as SympyBeam

    def sympy_simple() -> None:
        b = SympyBeam(10, 1, 1)
        r0 = b.apply_support(0, "pin")
        r1 = b.apply_support(10, "roller")
        b.solve_for_ild_reactions(1, r0, r1)
        b.solve_for_ild_shear(4, 1, r0, r1)
        b.solve_for_ild_moment(4, 1, r0, r1)

    def ilkit_simple() -> None:
        b = ilkit.Beam(10, {0: "pin", 10: "roller"})
        b.reaction(0), b.reaction(10), b.shear(4), b.moment(4)

    # a girder built into the abutment, a hinge at 9.6 m, a pier at 31.2 m and a 6 m cantilever end
    def sympy_hinged() -> None:
        b = SympyBeam(Rational("37.2"), 1, 1)
        p0, m0 = b.apply_support(0, "fixed")
        r = b.apply_support(Rational("31.2"), "roller")
        b.apply_rotation_hinge(Rational("9.6"))
        b.solve_for_ild_reactions(1, p0, m0, r)
        b.solve_for_ild_shear(15, 1, p0, m0, r)
        b.solve_for_ild_moment(Rational("4.8"), 1, p0, m0, r)

    def ilkit_hinged() -> None:
        b = ilkit.Beam(37.2, {0: "fixed", 31.2: "roller"}, hinges=[9.6])
        b.reaction(0), b.moment_reaction(0), b.reaction(31.2), b.shear(15), b.moment(4.8)

    print("\nAgainst sympy.physics.continuum_mechanics.beam (same lines, fresh beams)")
    for name, ours, theirs in [("simple span", ilkit_simple, sympy_simple), ("hinged", ilkit_hinged, sympy_hinged)]:
        t_ours = statistics.median([best_of(ours, repeat=1, number=10) for _ in range(5)])
        t_theirs = best_of(theirs, repeat=3)
        print(
            f"  {name:12s} ilkit {t_ours * 1e3:8.3f} ms   sympy {t_theirs * 1e3:9.1f} ms   "
            f"ratio {t_theirs / t_ours:7.0f}x   target >= 20x"
        )


if __name__ == "__main__":
    main()
