"""Demo scenario for the calculation sheet (invented numbers, for illustration only).

A three-span girder of 24 m, 26 m and 24 m in which the outer spans
cantilever 6 m into the middle span and carry a 14 m suspended span on two
hinges: a statically determinate girder line that is common in older road
bridges (common practice).  :func:`write_demo_sheet` writes its calculation
sheet; the demo runner (``python -m ilkit.demo``) calls it.
"""

from __future__ import annotations

from pathlib import Path

from ilkit.influence import InfluenceLine
from ilkit.model import Beam
from ilkit.views.report import CalculationSheet, write_calculation_sheet

__all__ = ["suspended_span_girder", "demo_lines", "write_demo_sheet"]


def suspended_span_girder() -> Beam:
    """The demo girder: supports at 0, 24, 50 and 74 m, hinges at 30 and 44 m (kN, m)."""
    return Beam(
        length=74,
        supports={0: "pin", 24: "roller", 50: "roller", 74: "roller"},
        hinges=[30, 44],
        units="kN-m",
    )


def demo_lines(beam: Beam) -> list[InfluenceLine]:
    """The governing lines of the demo girder: pier reaction, span and pier moments, shears."""
    return [
        beam.reaction(24),
        beam.moment(12),
        beam.moment(24),
        beam.moment(37),
        beam.shear(24, side="left"),
        beam.shear(24, side="right"),
        beam.hinge_shear(30),
    ]


def write_demo_sheet(directory: str | Path) -> CalculationSheet:
    """Write the demo girder's calculation sheet into ``directory`` (as ``girder.html`` and ``girder.md``)."""
    beam = suspended_span_girder()
    return write_calculation_sheet(
        beam,
        Path(directory) / "girder",
        lines=demo_lines(beam),
        title="Suspended-span girder: influence lines",
        info={"scenario": "demo data (invented numbers)", "structure": "three spans 24 + 26 + 24 m, "
              "14 m suspended span on hinges at 30 m and 44 m"},
    )
