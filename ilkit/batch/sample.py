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
                     lengths: tuple[float, float] = (20.0, 150.0)) -> list[dict[str, Any]]:
    """``count`` girder records (mappings in the inventory format, kip-ft) with ``spans`` (fewest, most)
    spans of ``lengths`` (shortest, longest) ft, rounded to 0.5 ft; ids ``"G0001"`` ...; the live load is
    HL-93."""
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
        out.append(record)
    return out
