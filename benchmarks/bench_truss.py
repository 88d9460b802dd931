"""Benchmark: member force influence lines and member envelopes of trusses.

Prints, for a 12-panel determinate Pratt through truss (a new truss each
time, so nothing is cached): the time to build it and check its stability,
to derive every member's influence line (exact statics) and the HL-93
envelope of every member (largest tension and compression, governing cases);
the same for an indeterminate truss (two continuous spans, stiffness method);
and each figure's ratio to its target.

Targets (issue "Trusses and floor systems"): all member influence lines of a
12-panel determinate truss under 50 ms, the HL-93 envelope of every member
under 1 s.

Run: ``.venv/bin/python benchmarks/bench_truss.py``
"""

from __future__ import annotations

import time
from collections.abc import Callable

from ilkit import loads, trusses

LINES_TARGET = 0.050
ENVELOPE_TARGET = 1.0


def best_of(fn: Callable[[], object], repeat: int = 5) -> float:
    """Best wall time of one call over ``repeat`` rounds (seconds)."""
    times = []
    for _ in range(repeat):
        t0 = time.perf_counter()
        fn()
        times.append(time.perf_counter() - t0)
    return min(times)


def pratt() -> trusses.Truss:
    """12 panels of 25 ft, 32 ft deep (a through truss of our own, 300 ft)."""
    return trusses.pratt(300, 12, 32, units="kip-ft")


def continuous() -> trusses.Truss:
    """Two 150 ft spans of the same layout on three supports (indeterminate, EA 2.0e6 kip)."""
    base = trusses.pratt(300, 12, 32, end_posts="vertical", units="kip-ft")
    return trusses.Truss(base.joints, base.members, {"L0": "pin", "L6": "roller", "L12": "roller"}, "bottom",
                         EA=2.0e6, units="kip-ft", roles=base.roles)


def report(name: str, seconds: float, target: float) -> None:
    print(f"{name:<58s} {seconds * 1e3:9.1f} ms   target {target * 1e3:7.0f} ms   ratio {seconds / target:5.2f}")


def main() -> None:
    hl93 = loads.hl93()
    build = best_of(pratt)
    truss = pratt()
    members = len(truss.members)
    lines = best_of(lambda: pratt().member_forces()) - build
    envelope = best_of(lambda: trusses.member_envelope(pratt(), hl93), repeat=3)
    print(f"12-panel Pratt truss: {len(truss.joints)} joints, {members} members, degree {truss.degree}")
    print(f"{'build and check stability':<58s} {build * 1e3:9.1f} ms")
    report(f"all {members} member influence lines (exact)", lines, LINES_TARGET)
    report(f"HL-93 envelope of every member ({members} members + 2 supports)", envelope, ENVELOPE_TARGET)
    two = continuous()
    build2 = best_of(continuous)
    lines2 = best_of(lambda: continuous().member_forces()) - build2
    envelope2 = best_of(lambda: trusses.member_envelope(continuous(), hl93), repeat=3)
    print(f"two-span continuous truss: degree {two.degree}")
    report("all member influence lines (stiffness method)", lines2, LINES_TARGET)
    report("HL-93 envelope of every member", envelope2, ENVELOPE_TARGET)


if __name__ == "__main__":
    main()
