"""Demo calculation sheets (scenarios of our own, invented numbers).

* The girder of ``notebooks/hinged_girder.ipynb``: anchor spans of 32 m and a
  44 m centre span made of two 9 m cantilevers carrying a 26 m suspended
  span on hinges at 41 m and 67 m (kN, m); a statically determinate girder
  line (common practice in older road bridges).  :func:`write_demo_sheet`
  writes its influence-line sheet.
* The highway girder of ``notebooks/moving_loads.ipynb``: three continuous
  spans of 90, 115 and 90 ft (kip, ft) under the AASHTO LRFD HL-93 live load
  of one lane.  :func:`write_highway_sheet` writes its sheet with the load
  model, the governing placements and the envelope.
* The through truss of ``notebooks/truss_bridge.ipynb``: a 10-panel Pratt
  truss of 240 ft carrying a two-lane road through stringers and floor
  beams (kip, ft).  :func:`write_truss_sheet` writes its sheet with the
  member forces under HL-93.

* The rated girder of ``notebooks/load_rating.ipynb``: a 1960s-style three-span continuous
  steel girder of 70 + 90 + 70 ft (kip, ft) whose first span lost section to corrosion, rated for the
  design load, the legal loads, the emergency vehicles and a permit vehicle of our own.
  :func:`write_rating_demo_sheet` writes its rating sheet (HTML, Markdown and, where WeasyPrint is
  installed, PDF).

The demo runner (``python -m ilkit.demo``) calls all four; their title blocks
are filled in (the checker's box is left for a person).
"""

from __future__ import annotations

from pathlib import Path

from ilkit.influence import InfluenceLine
from ilkit.model import Beam
from ilkit.trusses.model import Truss
from ilkit.views.report import CalculationSheet, TitleBlock, write_calculation_sheet

__all__ = [
    "suspended_span_girder",
    "demo_lines",
    "write_demo_sheet",
    "highway_girder",
    "highway_lines",
    "write_highway_sheet",
    "through_truss",
    "truss_lane_factor",
    "write_truss_sheet",
    "corroded_girder",
    "corroded_girder_rating",
    "write_rating_demo_sheet",
]


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
        title_block=TitleBlock(
            project="ilkit demo study (invented data)", structure="Three-span road bridge with a suspended span",
            girder="Main girder, spans 32 + 44 + 32 m", prepared_by="ilkit demo", checked_by="",
            date="2025-01-15", revision="A",
        ),
        info={"scenario": "demo data (invented numbers), as in notebooks/hinged_girder.ipynb",
              "geometry": "spans 32 + 44 + 32 m; 26 m suspended span on hinges at 41 m and 67 m"},
    )


def highway_girder() -> Beam:
    """Three continuous spans of 90, 115 and 90 ft on a pin and rollers; EI constant (kip, ft)."""
    return Beam(295, {0: "pin", 90: "roller", 205: "roller", 295: "roller"}, EI=1.0e8, units="kip-ft")


def highway_lines(beam: Beam) -> list[InfluenceLine]:
    """The notebook's four governing quantities: sagging moment at 0.4 of span 1, pier moment, shear
    right of the pier, pier reaction."""
    return [beam.moment(36), beam.moment(90), beam.shear(90, side="right"), beam.reaction(90)]


def write_highway_sheet(directory: str | Path) -> CalculationSheet:
    """Write the highway girder's sheet under HL-93 into ``directory`` (``highway_girder.html`` and ``.md``)."""
    from ilkit.loads import hl93

    beam = highway_girder()
    return write_calculation_sheet(
        beam,
        Path(directory) / "highway_girder",
        lines=highway_lines(beam),
        load=hl93(),
        divisions=10,
        title="Three-span continuous highway girder under HL-93",
        title_block=TitleBlock(
            project="ilkit demo study (invented data)", structure="Three-span continuous highway bridge",
            girder="Interior girder, spans 90 + 115 + 90 ft", prepared_by="ilkit demo", checked_by="",
            date="2025-01-15", revision="A",
        ),
        info={"scenario": "demo data (invented numbers), as in notebooks/moving_loads.ipynb",
              "geometry": "continuous spans 90 + 115 + 90 ft, EI = 1e8 kip·ft² (force effects do not depend "
                           "on its value)",
              "live load": "AASHTO LRFD HL-93, one lane, dynamic allowance 33 % on truck and tandem, no "
                           "multiple presence or distribution factor"},
    )


def through_truss() -> Truss:
    """The through truss of ``notebooks/truss_bridge.ipynb``: a 10-panel Pratt truss, 240 ft span, 24 ft panels,
    32 ft deep (diagonals 40 ft), deck on the lower chord (kip, ft)."""
    from ilkit.trusses import pratt

    return pratt(240, 10, 32, units="kip-ft")


def truss_lane_factor() -> float:
    """Lanes carried by one truss of the notebook's two-lane bridge (lever rule across the floor beam: trusses
    32 ft apart, two 12 ft lanes from 2 ft inside one truss; lane centres 8 and 20 ft from it), times the
    multiple presence factor of two loaded lanes (AASHTO LRFD Table 3.6.1.1.2-1, from memory: 1.00)."""
    from ilkit.loads import multiple_presence

    return ((32 - 8) / 32 + (32 - 20) / 32) * multiple_presence(2)


def write_truss_sheet(directory: str | Path) -> CalculationSheet:
    """Write the through truss's sheet under HL-93 (two lanes, lever rule) into ``directory``
    (``through_truss.html`` and ``.md``)."""
    from ilkit.loads import hl93

    truss = through_truss()
    factor = truss_lane_factor()
    return write_calculation_sheet(
        truss,
        Path(directory) / "through_truss",
        lines=[truss.member_force(m) for m in ("U4-U5", "L4-L5", "U1-L2", "U1-L1")] + [truss.reaction("L0")],
        load=hl93(factor=factor),
        title="Pratt through truss under HL-93: member forces",
        title_block=TitleBlock(
            project="ilkit demo study (invented data)", structure="Two-lane through-truss bridge, 240 ft span",
            girder="One truss: Pratt, 10 panels of 24 ft, 32 ft deep", prepared_by="ilkit demo", checked_by="",
            date="2025-01-15", revision="A",
        ),
        info={"scenario": "demo data (invented numbers), as in notebooks/truss_bridge.ipynb",
              "load path": "deck on stringers, stringers simply supported on floor beams at the panel points of "
                           "the lower chord",
              "live load": f"AASHTO LRFD HL-93 times {factor:g} lanes per truss (lever rule, two lanes, multiple "
                           "presence 1.00), dynamic allowance 33 % on truck and tandem"},
    )


def corroded_girder() -> Beam:
    """The rated girder: three continuous spans of 70, 90 and 70 ft; the first span's steel lost section to
    corrosion, so its EI is smaller (kip, ft; invented numbers)."""
    return Beam(230, {0: "pin", 70: "roller", 160: "roller", 230: "roller"},
                EI=[(0, 70, 3.4e6), (70, 230, 4.0e6)], units="kip-ft")


def corroded_girder_rating() -> object:
    """The notebook's rating of :func:`corroded_girder` (girder 2 of five, 7.5 ft apart): dead loads, lever-rule
    distribution, nominal resistances with the corroded first span and the web loss at the abutment bearing,
    fair condition, ADTT 1200, the Service II limits of the steel; the design load, the legal loads, the
    emergency vehicles and a permit vehicle of our own (a six-axle transformer hauler, special single trip
    with traffic)."""
    from ilkit import design, rating

    beam = corroded_girder()
    dead = [design.DistributedLoad("steel, slab and haunch", "DC", 1.05),
            design.DistributedLoad("parapets (share)", "DC", 0.10),
            design.DistributedLoad("asphalt overlay", "DW", 0.22)]
    permanent = design.permanent_effects(beam, dead, quantities=("moment", "shear"))
    section = design.CrossSection(girders=5, spacing=7.5, overhang=2.5, barrier=1.25, units="kip-ft")
    resistances = rating.Resistances(
        positive_moment=[(0, 70, 1800), (70, 230, 2900)], negative_moment=2700,
        shear=[(0, 8, 300), (8, 230, 420)], name="G2, 1964 plans with the section loss of the last inspection")
    service = rating.Resistances(positive_moment=[(0, 70, 1450), (70, 230, 2300)], negative_moment=2150,
                                 name="0.80 Fy in the flanges (non-composite)")
    hauler = rating.permit_vehicle([14, 36, 36, 34, 34, 34], [13, 4.5, 26, 4.5, 4.5], name="transformer hauler")
    return rating.rate_girder(
        beam, permanent=permanent, resistances=resistances, distribution=design.lever_rule(section, 2),
        loads=["design", "legal", "emergency", rating.permit_load(hauler, "special single trip", adtt=1200)],
        adtt=1200, condition="fair", service=service)


def write_rating_demo_sheet(directory: str | Path) -> object:
    """Write the rating sheet of :func:`corroded_girder_rating` into ``directory`` (``rating_sheet.html``,
    ``.md`` and, where WeasyPrint is installed, ``.pdf``)."""
    from ilkit.views.rating_records import write_rating_sheet

    return write_rating_sheet(
        corroded_girder_rating(),  # type: ignore[arg-type]
        Path(directory) / "rating_sheet",  # load_rating.html is the notebook's page
        title="Load rating of a three-span steel girder with a corroded span",
        title_block={"project": "ilkit demo study (invented data)",
                     "bridge": "Three-span continuous steel girder bridge (1960s style)",
                     "girder": "G2 of five, spans 70 + 90 + 70 ft", "engineer": "ilkit demo", "checker": "",
                     "date": "2025-01-15", "revision": "A"},
        info={"scenario": "demo data (invented numbers), as in notebooks/load_rating.ipynb",
              "condition": "fair (section loss in span 1 and in the web at the left bearing)",
              "traffic": "ADTT 1200 trucks a day in one direction"},
    )
