"""Generated inventories of our own girders, for the demo, the benchmark, the notebook and the tests.

The girders are invented (no real bridge): continuous steel or concrete girder lines of 1 to 5 spans
of 20 to 150 ft (kip-ft), some with a suspended span on two hinges, with a given distribution factor
and deck and wearing-surface loads; every few girders one gets a varying stiffness.  The same ``seed``
gives the same inventory on every machine (Python's own random generator, no numpy).
"""

from __future__ import annotations

import random
from typing import Any

__all__ = ["sample_inventory"]


def sample_inventory(count: int, *, seed: int = 2026, spans: tuple[int, int] = (1, 5),
                     lengths: tuple[float, float] = (20.0, 150.0), rated: int = 4) -> list[dict[str, Any]]:
    """``count`` girder records (mappings in the inventory format, kip-ft) with ``spans`` (fewest, most)
    spans of ``lengths`` (shortest, longest) ft, rounded to 0.5 ft; ids ``"G0001"`` ...; the live load is
    HL-93.  Every ``rated``-th girder (the first, then every ``rated``-th after it; ``0``: none) carries
    nominal resistances for a rating run (invented: sized on its dead load and an HL-93 estimate, between
    about 0.75 and 1.5 times the demand, some with a reduced sagging resistance in the first span); the
    other girders are the same whatever ``rated`` is."""
    rng = random.Random(seed)
    out = []
    for i in range(count):
        n = rng.randint(*spans)
        main = round(rng.uniform(*lengths) * 2) / 2
        span_list = []
        for k in range(n):
            outer = n > 2 and k in (0, n - 1)
            s = round(main * (0.8 if outer else 1.0) * 2) / 2
            span_list.append(min(max(s, lengths[0]), lengths[1]))
        ei = round(rng.uniform(2.0, 9.0), 2) * 10**int(rng.choice((7, 8)))
        record: dict[str, Any] = {
            "id": f"G{i + 1:04d}",
            "units": "kip-ft",
            "spans": span_list,
            "EI": ei,
            "live": "HL-93",
            "distribution": {"moment": round(rng.uniform(0.45, 0.85), 3), "shear": round(rng.uniform(0.6, 1.0), 3),
                             "includes_multiple_presence": True},
            "permanent": [
                {"name": "deck and girder", "category": "DC", "intensity": round(rng.uniform(0.8, 2.4), 2)},
                {"name": "wearing surface", "category": "DW", "intensity": round(rng.uniform(0.15, 0.4), 2)},
            ],
        }
        if n >= 2 and i % 7 == 3:  # a cover-plated zone over the first pier
            first = span_list[0]
            record["EI"] = [[0, first * 0.8, ei], [first * 0.8, first * 1.2, ei * 1.5],
                            [first * 1.2, sum(span_list), ei]]
        if rated and i % rated == 0:
            record["resistance"] = _resistance(random.Random(f"{seed}:{i}:resistance"), span_list, record)
        out.append(record)
    return out


def _resistance(rng: random.Random, spans: list[float], record: dict[str, Any]) -> dict[str, Any]:
    """Invented nominal resistances (kip-ft, kip) for a sample girder: its factored dead load and an estimate of
    the HL-93 effect (truck with IM 33 % and lane, on the longest span taken as simple) times its
    distribution, times a spread of 0.75 to 1.5.  Demo data: no cross-section stands behind them."""
    longest = max(spans)
    dc, dw = (p["intensity"] for p in record["permanent"])
    g_m, g_v = record["distribution"]["moment"], record["distribution"]["shear"]
    dead_m = (1.25 * dc + 1.5 * dw) * longest**2 / 8
    truck_m = max(72 * (longest / 4 - 7), 25 * (longest / 2 - 2))  # design truck or tandem at mid-span
    truck_v = max(72 * (1 - 9.33 / longest), 50 * (1 - 2 / longest))  # at the support
    live_m = 1.75 * g_m * (1.33 * truck_m + 0.64 * longest**2 / 8)
    dead_v = (1.25 * dc + 1.5 * dw) * longest / 2
    live_v = 1.75 * g_v * (1.33 * truck_v + 0.64 * longest / 2)
    out: dict[str, Any] = {
        "positive_moment": round(rng.uniform(0.75, 1.5) * (dead_m + live_m), -1),
        "negative_moment": round(rng.uniform(0.75, 1.5) * (dead_m + live_m), -1),
        "shear": round(rng.uniform(0.75, 1.5) * (dead_v + live_v)),
    }
    if len(spans) >= 2 and rng.random() < 0.5:  # section loss in the first span (a corroded bottom flange)
        reduced = round(out["positive_moment"] * rng.uniform(0.7, 0.9), -1)
        out["positive_moment"] = [[0, spans[0], reduced], [spans[0], sum(spans), out["positive_moment"]]]
    return out
