"""Demo calculation sheet (a scenario of our own, invented numbers).

The girder of the notebook ``notebooks/hinged_girder.ipynb``: anchor spans of
32 m and a 44 m centre span made of two 9 m cantilevers carrying a 26 m
suspended span on hinges at 41 m and 67 m (kN, m); a statically determinate
girder line (common practice in older road bridges).  :func:`write_demo_sheet`
writes its calculation sheet; the demo runner (``python -m ilkit.demo``)
calls it.
"""

from __future__ import annotations

from pathlib import Path

from ilkit.influence import InfluenceLine
from ilkit.model import Beam
from ilkit.views.report import CalculationSheet, write_calculation_sheet

__all__ = ["suspended_span_girder", "demo_lines", "write_demo_sheet"]


def suspended_span_girder() -> Beam:
    """The demo girder: supports at 0, 32, 76 and 108 m, hinges at 41 and 67 m (kN, m)."""
    return Beam(
        length=108,
        supports={0: "pin", 32: "roller", 76: "roller", 108: "roller"},
        hinges=[41, 67],
        units="kN-m",
    )


def demo_lines(beam: Beam) -> list[InfluenceLine]:
    """The governing lines of the notebook: pier reaction, pier and span moments, shears."""
    return [
        beam.reaction(32),
        beam.moment(32),
        beam.shear(32, side="right"),
        beam.hinge_shear(41),
        beam.moment(16),
        beam.moment(54),
    ]


def write_demo_sheet(directory: str | Path) -> CalculationSheet:
    """Write the demo girder's calculation sheet into ``directory`` (as ``girder.html`` and ``girder.md``)."""
    beam = suspended_span_girder()
    return write_calculation_sheet(
        beam,
        Path(directory) / "girder",
        lines=demo_lines(beam),
        title="Three-span girder with a suspended span: influence lines",
        info={"scenario": "demo data (invented numbers), as in notebooks/hinged_girder.ipynb",
              "structure": "spans 32 + 44 + 32 m; 26 m suspended span on hinges at 41 m and 67 m"},
    )
