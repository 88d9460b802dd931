"""The sections of the design layer are the envelope's sections, and the one rule for a load at a jump."""

from __future__ import annotations

from fractions import Fraction

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st
from scenarios import built_in_girder
from strategies import determinate_beams

import ilkit
from ilkit.design import Section, envelope_sections, load_ordinate
from ilkit.design.sections import MAX_DIVISIONS
from ilkit.loads import KnifeEdge, envelope
from ilkit.loads.envelope import MAX_DIVISIONS as ENVELOPE_MAX

KNIFE = KnifeEdge(1, units="kN-m", name="unit load")


def _envelope_keys(beam, divisions=10, at=()):
    env = envelope(beam, KNIFE, divisions=divisions, at=at)
    frame = env.sections
    return [(x, side or None) for x, side in zip(frame[f"x [{beam.units.length}]"], frame["side"])]


def _keys(sections):
    return [(float(s.x), s.side) for s in sections]


BEAMS = {
    "girder built into the abutment": built_in_girder(),
    "three continuous spans with an overhang": ilkit.Beam(
        72.5, {0: "pin", 20.5: "roller", 45: "roller", 66: "roller"}, EI=3.1e6, units="kN-m"
    ),
    "girder loaded through a floor system": ilkit.Beam(
        64, {0: "pin", 32: "roller", 64: "roller"}, EI=9e5, units="kN-m", panel_points=list(range(0, 65, 8))
    ),
    "fixed ends, hinge, shear release, spring": ilkit.Beam(
        40, {0: "fixed", 15: ilkit.Spring(vertical=8000), 40: "fixed"}, hinges=[9], shear_releases=[27],
        EI=2e5, units="kN-m",
    ),
}


@pytest.mark.parametrize("name", list(BEAMS))
@pytest.mark.parametrize(("divisions", "at"), [(10, ()), (3, (12.25, 0.1 + 0.2)), (7, (9,))])
def test_sections_are_the_envelope_sections(name, divisions, at):
    beam = BEAMS[name]
    assert _keys(envelope_sections(beam, divisions, at)) == _envelope_keys(beam, divisions, at)


@settings(max_examples=15, deadline=None)
@given(beam=determinate_beams(), divisions=st.integers(1, 6))
def test_sections_are_the_envelope_sections_on_random_beams(beam, divisions):
    beam = beam.replace(units="kN-m")
    assert _keys(envelope_sections(beam, divisions)) == _envelope_keys(beam, divisions)


def test_limits_agree_with_the_envelope():
    assert MAX_DIVISIONS == ENVELOPE_MAX


def test_sections_sort_left_face_first_and_read_numbers():
    a = [Section(Fraction(5), "right"), Section(5), Section(Fraction(5), "left"), Section("2.5")]
    assert sorted(a) == [Section(Fraction(5, 2)), Section(5, "left"), Section(5), Section(5, "right")]
    assert Section(0.1).x == Fraction(1, 10)
    assert repr(Section(24, "left")) == "Section(24, 'left')"
    assert Section(24, "left").label == "x=24 (left)"


def test_section_errors():
    with pytest.raises(ilkit.LoadInputError, match="Section: side must be 'left' or 'right'"):
        Section(1, "top")
    with pytest.raises(ilkit.LoadInputError, match="Section: x"):
        Section(float("nan"))
    with pytest.raises(ilkit.LoadInputError, match="divisions"):
        envelope_sections(built_in_girder(), 0)
    with pytest.raises(ilkit.LoadInputError, match="is off the beam"):
        envelope_sections(built_in_girder(), at=[40])
    with pytest.raises(ilkit.LoadInputError, match="give a Beam"):
        envelope_sections("beam")


def test_load_at_the_section_of_its_own_shear_takes_the_face_of_the_cut():
    """Statics of a simple span of 10 with the cut at 4 (derived here): a load right of the cut gives shear
    R_left = (10 - 4)/10 = 0.6; left of it, R_left - 1 = -0.4."""
    beam = ilkit.Beam(10, {0: "pin", 10: "roller"})
    line = beam.shear(4)
    assert load_ordinate(line, 4.0, "right", own_section=True) == pytest.approx(0.6)
    assert load_ordinate(line, 4.0, "left", own_section=True) == pytest.approx(-0.4)
    # at the ends the outer side of the cut is off the beam: the unit jump gives it
    assert load_ordinate(beam.shear(0), 0.0, "left", own_section=True) == pytest.approx(0.0)  # R - 1 = 0
    assert load_ordinate(beam.shear(10), 10.0, "right", own_section=True) == pytest.approx(0.0)
    cantilever = ilkit.Beam(6, {0: "fixed"})
    assert load_ordinate(cantilever.shear(6), 6.0, "right", own_section=True) == pytest.approx(1.0)
    # elsewhere: one-sided values where asked, the value where the line is continuous
    assert load_ordinate(line, 2.0, None) == pytest.approx(-0.2)
    assert load_ordinate(line, 4.0, "left") == pytest.approx(-0.4)
