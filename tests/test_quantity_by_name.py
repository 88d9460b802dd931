"""Quantities asked for by name (``beam.line``) and where they can be taken (``beam.locations``)."""

from __future__ import annotations

from fractions import Fraction

import pytest
from hypothesis import given, settings
from strategies import determinate_beams

import ilkit
from ilkit import BeamInputError, SideRequiredError


@pytest.fixture
def girder():
    # a fixed left end, hinges at 8 and 18, rollers at 12 and 30 (our own determinate layout)
    return ilkit.Beam(30, {0: "fixed", 12: "roller", 30: "roller"}, hinges=[8, 18])


def test_line_by_name_is_the_method_of_that_name(girder):
    assert girder.line("moment", 6) is girder.moment(6)
    assert girder.line("shear", 12, side="right") is girder.shear(12, side="right")
    assert girder.line("reaction", 12) is girder.reaction(12)
    assert girder.line("moment_reaction", 0) is girder.moment_reaction(0)
    assert girder.line("hinge_shear", 18) is girder.hinge_shear(18)


def test_line_by_name_keeps_the_errors_of_the_method(girder):
    with pytest.raises(SideRequiredError, match="side='left' or side='right'"):
        girder.line("shear", 12)
    with pytest.raises(BeamInputError, match="no support at x=5"):
        girder.line("reaction", 5)


def test_line_by_name_rejects_an_unknown_kind_and_lists_the_choices(girder):
    with pytest.raises(BeamInputError, match=r"unknown kind 'momnet'; choose one of 'reaction', .*'moment'"):
        girder.line("momnet", 6)


def test_a_reaction_has_no_side(girder):
    with pytest.raises(BeamInputError, match="a support reaction has no side; leave side out"):
        girder.line("reaction", 12, side="left")


def test_locations(girder):
    assert girder.locations("reaction") == (0, 12, 30)
    assert girder.locations("moment_reaction") == (0,)
    assert girder.locations("hinge_shear") == (8, 18)
    assert girder.locations("moment") is None
    assert girder.locations("shear") is None
    simple = ilkit.Beam(10, {0: "pin", 10: "roller"})
    assert simple.locations("moment_reaction") == ()
    assert simple.locations("hinge_shear") == ()
    with pytest.raises(BeamInputError, match="unknown kind"):
        simple.locations("torsion")


@settings(max_examples=40, deadline=None)
@given(determinate_beams())
def test_every_listed_location_gives_a_line(beam):
    """Law: at every position ``locations`` lists, the quantity exists (a side may be needed)."""
    for kind in ("reaction", "moment_reaction", "hinge_shear"):
        for at in beam.locations(kind):
            assert isinstance(at, Fraction)
            try:
                line = beam.line(kind, at)
            except SideRequiredError:
                line = beam.line(kind, at, side="left")
            assert line.quantity.kind == kind and line.quantity.at == at
