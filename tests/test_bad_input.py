"""Bad input raises a typed error whose message names the problem and the fix."""

from __future__ import annotations

import math

import numpy as np
import pytest

import ilkit
from ilkit import BeamInputError, IlkitError, SideRequiredError, UnstableBeamError


def test_errors_are_value_errors():
    assert issubclass(IlkitError, ValueError)
    for cls in (BeamInputError, UnstableBeamError, SideRequiredError, ilkit.IndeterminateBeamError):
        assert issubclass(cls, IlkitError)


@pytest.mark.parametrize("length", [0, -5, "-1.5"])
def test_zero_or_negative_length(length):
    with pytest.raises(BeamInputError, match="length: must be greater than 0"):
        ilkit.Beam(length, {0: "pin"})


@pytest.mark.parametrize("bad", [math.nan, math.inf, -math.inf, "nan", "inf", np.float64("nan")])
def test_nan_or_infinite_numbers(bad):
    with pytest.raises(BeamInputError, match="not a finite number"):
        ilkit.Beam(bad, {0: "pin", 10: "roller"})
    with pytest.raises(BeamInputError, match="not a finite number"):
        ilkit.Beam(10, {0: "pin", bad: "roller"})
    with pytest.raises(BeamInputError, match="not a finite number"):
        ilkit.Beam(10, {0: "pin", 10: "roller"}, hinges=[bad])


def test_unreadable_number():
    with pytest.raises(BeamInputError, match="cannot read 'ten'"):
        ilkit.Beam("ten", {0: "pin"})
    with pytest.raises(BeamInputError, match="boolean"):
        ilkit.Beam(True, {0: "pin"})


def test_support_off_the_beam():
    with pytest.raises(BeamInputError, match=r"off the beam; positions must lie from 0 to 10"):
        ilkit.Beam(10, {0: "pin", 12: "roller"})


def test_release_off_the_beam_or_at_an_end():
    with pytest.raises(BeamInputError, match="off the beam"):
        ilkit.Beam(10, {0: "fixed"}, hinges=[11])
    with pytest.raises(BeamInputError, match="releases nothing"):
        ilkit.Beam(10, {0: "fixed"}, hinges=[10])
    with pytest.raises(BeamInputError, match="releases nothing"):
        ilkit.Beam(10, {0: "pin", 10: "roller"}, shear_releases=[0])


def test_two_supports_at_one_point():
    with pytest.raises(BeamInputError, match="two supports at x=5"):
        ilkit.Beam(10, {0: "pin", 5: "roller", "5.0": "pin", 10: "roller"})


def test_hinge_at_a_fixed_end():
    with pytest.raises(BeamInputError, match=r"fixed end x=0.*use a .pin. support"):
        ilkit.Beam(10, {0: "fixed", 10: "roller"}, hinges=[0])


def test_hinge_at_an_interior_fixed_support():
    with pytest.raises(BeamInputError, match="hinge at the fixed support x=5"):
        ilkit.Beam(10, {0: "pin", 5: "fixed", 10: "roller"}, hinges=[5])


def test_hinge_and_shear_release_at_one_point():
    with pytest.raises(BeamInputError, match="cut the beam in two"):
        ilkit.Beam(10, {0: "fixed", 10: "fixed"}, hinges=[5], shear_releases=[5])


def test_unknown_support_kind():
    with pytest.raises(BeamInputError, match=r"unknown support kind 'hinged'.*'fixed', 'pin', 'roller'"):
        ilkit.Beam(10, {0: "hinged", 10: "roller"})


def test_no_supports():
    with pytest.raises(BeamInputError, match="no support"):
        ilkit.Beam(10, {})


def test_mechanism_names_the_moving_part():
    with pytest.raises(UnstableBeamError) as info:
        ilkit.Beam(37.2, {0: "pin", 31.2: "roller"}, hinges=[9.6])  # the girder of scenarios.py, not built in
    message = str(info.value)
    assert "the part from x=0 to x=9.6 can rotate about the pin support at x=0" in message
    assert "add a support between x=0 and x=9.6" in message
    assert "remove the hinge at x=9.6" in message
    assert info.value.motions


def test_mechanism_suspended_part_without_support():
    with pytest.raises(UnstableBeamError, match=r"the part from x=6 to x=10 can rotate about the hinge at x=6"):
        ilkit.Beam(10, {0: "fixed"}, hinges=[6])


def test_single_pin_is_a_mechanism():
    with pytest.raises(UnstableBeamError, match="rotate about the pin support at x=0"):
        ilkit.Beam(10, {0: "pin"})


def test_request_errors():
    beam = ilkit.Beam(20, {0: "pin", 10: "roller", 20: "roller"}, hinges=[15])
    nearest = r"no support at x=5; the nearest support is at x=0, 5 away \(supports are at x=0, 10, 20\)"
    with pytest.raises(BeamInputError, match=nearest):
        beam.reaction(5)
    with pytest.raises(BeamInputError, match="not fixed"):
        beam.moment_reaction(0)
    with pytest.raises(SideRequiredError, match="side='left' or side='right'"):
        beam.shear(10)
    with pytest.raises(BeamInputError, match="off the beam"):
        beam.moment(25)
    with pytest.raises(BeamInputError, match="side must be 'left' or 'right'"):
        beam.shear(10, side="up")
    with pytest.raises(BeamInputError, match="no hinge at x=12"):
        beam.hinge_shear(12)
    with pytest.raises(BeamInputError, match="end of the beam"):
        beam.shear(0, side="left")
    with pytest.raises(BeamInputError, match="NaN"):
        beam.moment(5)(np.array([1.0, np.nan]))


def test_indeterminate_beam_is_recognised():
    beam = ilkit.Beam(20, {0: "pin", 10: "roller", 20: "roller"})
    assert beam.degree == 1 and not beam.is_determinate
    assert ilkit.Beam(10, {0: "fixed", 10: "fixed"}).degree == 2
    # its lines come from the stiffness method, which needs EI
    with pytest.raises(ilkit.StiffnessRequiredError, match="statically indeterminate"):
        beam.moment(5)


def test_beam_is_immutable():
    beam = ilkit.Beam(10, {0: "pin", 10: "roller"})
    with pytest.raises(AttributeError, match="replace"):
        beam.length = 12
    longer = beam.replace(length=12, supports={0: "pin", 12: "roller"})
    assert longer.length == 12 and beam.length == 10
    with pytest.raises(BeamInputError, match="unknown argument"):
        beam.replace(span=3)
