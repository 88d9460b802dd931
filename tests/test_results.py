"""Result objects: readable repr, table form with units, nothing printed."""

from __future__ import annotations

import pytest

import ilkit
from ilkit.loads import extremes, hl93, lm71, place


@pytest.fixture
def beam():
    return ilkit.Beam(100, {0: "pin", 100: "roller"}, units="kip-ft")


def test_extreme_repr_and_table(beam, capsys):
    found = place(beam.moment(50), hl93())
    assert repr(found) == (
        "Extreme(max M at x=50 = 2821.6 kip·ft, case 'design truck + lane'; dynamic allowance 33 % on design truck)"
    )
    table = found.to_frame()
    assert list(table.columns) == [
        "load",
        "item",
        "x [ft]",
        "to x [ft]",
        "side",
        "direction",
        "load [kip]",
        "intensity [kip/ft]",
        "ordinate",
        "counted",
        "effect [kip·ft]",
        "factor",
        "factored effect [kip·ft]",
        "dynamic",
    ]
    assert list(table["item"]) == ["axle 1", "axle 2", "axle 3", "patch 1"]
    # what each row's factor contains (issue 10 item 4): IM on the truck, none on the lane
    assert list(table["dynamic"]) == ["dynamic allowance 33 %"] * 3 + ["none"]
    # the factored effects add up to the extreme
    assert table["factored effect [kip·ft]"].sum() == pytest.approx(found.value)
    truck = found.placements[0]
    assert repr(truck).startswith("LoadPlacement('design truck'; effect=1520; factor=1.33; travelling ")
    assert "spacings 14, 14" in repr(truck)
    assert repr(truck.axles[1]).startswith("AxlePosition(2: 32 at x=50")
    assert capsys.readouterr().out == ""


def test_extremes_table_and_patch_repr(beam):
    both = extremes(beam.shear(30), hl93())
    assert repr(both).startswith("Extremes(V at x=30: max ")
    table = both.to_frame()
    assert set(table["extreme"]) == {"max", "min"}
    lane = both.minimum.placements[1]
    assert repr(lane.patches[0]) == "Patch(0..30, intensity 0.64, effect -2.88)"


def test_one_sided_limits_are_reported_at_a_jump():
    # shear just right of the section of a simple span: the heaviest axle stands just right of it
    beam = ilkit.Beam(30, {0: "pin", 30: "roller"}, units="kN-m")
    found = place(beam.shear(10), lm71(dynamic_factor=1.0))
    sides = {a.side for a in found.placements[0].axles}
    assert "right" in sides
    at_section = [a for a in found.placements[0].axles if a.x == pytest.approx(10.0)]
    assert at_section and at_section[0].side == "right" and at_section[0].ordinate == pytest.approx(20 / 30)
