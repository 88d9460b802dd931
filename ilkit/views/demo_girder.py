"""Demo design study: a three-span composite steel girder under HL-93 (a scenario of our own, invented numbers).

The bridge of ``notebooks/design_girder.ipynb``: continuous spans of 110, 140
and 110 ft; a 43 ft deck on five steel plate girders 9 ft apart with 3.5 ft
overhangs and 1.25 ft barriers (a 40.5 ft roadway, three design lanes); an
8.5 in slab, composite with the girders.  From the cross-section to the
factored envelopes of an interior and an exterior girder:

* the distribution factors (AASHTO approximate formulas for the interior
  girder, the lever rule and the rigid cross-section check for the exterior
  one), with their ranges of applicability checked;
* permanent loads in two stages: the wet deck and the steel on the steel
  girder alone (DC1), the barriers (DC2) and the wearing surface (DW) on the
  long-term composite girder;
* HL-93 and, for fatigue, the fatigue truck on the short-term composite
  girder; every AASHTO limit state; the concurrent forces at the governing
  sections; the live-load deflection check.

:func:`composite_girder_study` computes it (the same calls as the notebook);
:func:`write_composite_girder_sheet` writes its calculation sheet (the demo
runner, ``python -m ilkit.demo``, calls it).
"""

from __future__ import annotations

from dataclasses import dataclass
from pathlib import Path
from typing import Any

from ilkit.model import Beam
from ilkit.views.report import CalculationSheet, TitleBlock, write_calculation_sheet

__all__ = ["GirderStudy", "composite_girder_study", "write_composite_girder_sheet", "composite_beams"]

SUPPORTS = {0: "pin", 110: "roller", 250: "roller", 360: "roller"}
"""Three continuous spans of 110, 140 and 110 ft (ft)."""
PIER_REGIONS = ((88, 138), (222, 272))
"""Where the heavier pier sections are, around each pier (ft)."""
E_STEEL = 29_000.0
"""Modulus of elasticity of steel, ksi (AASHTO LRFD 6.4.1, from memory)."""
INERTIA = {"steel alone": (37_600, 68_000), "composite, long-term (3n)": (82_000, 76_000),
           "composite, short-term (n)": (110_000, 76_000)}
"""Moments of inertia (in⁴) of the girder in the spans and over the piers, by stage (invented: demo data).  Over
the piers the composite section is the steel girder with the deck's reinforcement (the cracked deck)."""


def composite_beams() -> dict[str, Beam]:
    """The girder line for each stage of :data:`INERTIA`, EI = E I / 144 (kip·ft², I in in⁴)."""
    beams = {}
    for name, (span, pier) in INERTIA.items():
        a, b = E_STEEL * span / 144, E_STEEL * pier / 144
        (p1, q1), (p2, q2) = PIER_REGIONS
        beams[name] = Beam(360, SUPPORTS, EI=[(0, p1, a), (p1, q1, b), (q1, p2, a), (p2, q2, b), (q2, 360, a)],
                           units="kip-ft")
    return beams


@dataclass(frozen=True)
class GirderStudy:
    """Every result of the demo study (see the module notes); ``girders`` maps ``"interior"`` and
    ``"exterior"`` to their results by kind."""

    section: Any
    beams: dict[str, Beam]
    Kg: float
    lever: Any
    girders: dict[str, dict[str, Any]]
    deflection: Any


def composite_girder_study() -> GirderStudy:
    """Compute the demo study (kip, ft): distribution, permanent effects, live loads, factored envelopes for every
    AASHTO limit state, concurrent forces at the governing sections and the live-load deflection check."""
    import pint

    from ilkit import design, loads

    ureg = pint.UnitRegistry()
    section = design.CrossSection(girders=5, spacing=9.0, overhang=3.5, barrier=1.25, units="kip-ft")
    eg = (56.375 - 24.9) + 2.0 + 8.5 / 2  # in: girder centroid to top flange, haunch, half the slab
    Kg = design.longitudinal_stiffness(n=8, inertia=37_600, area=71.1, eccentricity=eg)  # in⁴
    beams = composite_beams()
    steel, long_term, short_term = beams.values()
    formulas = {"span": 110, "slab_thickness": 8.5 * ureg.inch, "Kg": Kg * ureg.inch**4, "diaphragms": True}
    lever = design.place_design_lanes(design.transverse_line(section, 1, "lever rule"), loaded=1)
    deck = {"interior": 1.00, "exterior": 0.93}  # kip/ft: slab and haunch on each girder
    girders: dict[str, dict[str, Any]] = {}
    lane_envelopes: dict[str, Any] = {}
    for where, number in (("interior", 3), ("exterior", 1)):
        g = design.aashto_distribution(section, number, **formulas)
        permanent = design.permanent_effects([
            design.Stage("steel alone", steel, [design.DistributedLoad("DC1 deck slab and haunch", "DC", deck[where]),
                                                design.DistributedLoad("DC1 steel and cross-frames", "DC", 0.22)]),
            design.Stage("composite, long-term", long_term, [design.DistributedLoad("DC2 barriers", "DC", 0.16),
                                                             design.DistributedLoad("DW wearing surface", "DW", 0.20)]),
        ], quantities=("moment", "shear", "reaction"), name=f"{where} girder")
        hl93 = design.GirderLiveLoad(loads.hl93(), distribution=g, name=f"HL-93, {where} girder")
        fatigue = design.GirderLiveLoad(loads.fatigue_truck(), distribution=g.fatigue(),
                                        name=f"fatigue truck, {where} girder")
        if not lane_envelopes:
            lane_envelopes = {"hl93": design.live_envelope(short_term, hl93),
                              "fatigue": design.live_envelope(short_term, fatigue)}
        live = lane_envelopes["hl93"].for_girder(hl93)
        fatigue_live = lane_envelopes["fatigue"].for_girder(fatigue)
        factored = design.factored_envelope(short_term, permanent=permanent, limit_states="AASHTO",
                                            live={"*": live, "Fatigue I": fatigue_live, "Fatigue II": fatigue_live})
        concurrent = design.concurrent_forces(factored.governing_extremes("Strength I"), short_term).for_girder(hl93)
        girders[where] = {"distribution": g, "permanent": permanent, "live": hl93, "fatigue": fatigue,
                          "factored": factored, "concurrent": concurrent}
    deflection = design.deflection_check(short_term, lanes=design.design_lanes(section.roadway_width).count,
                                         girders=section.girders)
    return GirderStudy(section, beams, Kg, lever, girders, deflection)


def write_composite_girder_sheet(directory: str | Path) -> CalculationSheet:
    """Write the demo study's calculation sheet into ``directory`` (``composite_girder.html`` and ``.md``)."""
    from ilkit.loads import hl93

    study = composite_girder_study()
    beam = study.beams["composite, short-term (n)"]
    interior, exterior = study.girders["interior"], study.girders["exterior"]
    return write_calculation_sheet(
        beam,
        Path(directory) / "composite_girder",
        lines=[beam.moment(44), beam.moment(110)],
        load=hl93(),
        results=[study.lever, interior["distribution"], exterior["distribution"], interior["live"],
                 exterior["live"], interior["permanent"], exterior["permanent"], interior["factored"],
                 exterior["factored"], interior["concurrent"], exterior["concurrent"], study.deflection],
        title="Three-span composite steel girder: factored envelopes of an interior and an exterior girder",
        title_block=TitleBlock(
            project="ilkit demo study (invented data)", structure="Three-span continuous composite steel bridge",
            girder="Interior girder 3 and exterior girder 1 of 5, spans 110 + 140 + 110 ft", prepared_by="ilkit demo",
            checked_by="", date="2025-01-15", revision="A",
        ),
        info={
            "scenario": "demo data (invented numbers), as in notebooks/design_girder.ipynb",
            "cross-section": f"{study.section!r}; 8.5 in slab, composite; Kg = {study.Kg:,.0f} in⁴",
            "stages": "DC1 (deck slab, haunch, steel) on the steel girder alone; DC2 (barriers) and DW (wearing "
                      "surface) on the long-term composite girder (3n); live load on the short-term composite "
                      "girder (n)",
            "live load": "AASHTO LRFD HL-93 (IM 33 % on truck and tandem) and the fatigue truck (IM 15 %), times "
                         "the distribution factors of each girder (multiple presence inside them, applied once)",
            "limit states": "AASHTO LRFD Strength I and II, Service I, II and III, Fatigue I and II",
        },
    )
