"""Stiffness and spring input: accepted forms, normalisation, immutability and the errors for bad input."""

from __future__ import annotations

from fractions import Fraction as F

import numpy as np
import pytest

import ilkit
from ilkit import Spring
from ilkit.analysis import method_for
from ilkit.quantity import Quantity

SPANS = {0: "pin", 10: "pin", 20: "roller"}


# ------------------------------------------------------------------------- EI
def test_scalar_ei_stays_a_number():
    beam = ilkit.Beam(20, SPANS, EI="2.5e6")
    assert beam.EI == F(2500000)
    assert beam.EI_ranges == ((0, 20, F(2500000)),)
    assert "EI=2500000" in repr(beam)


def test_ei_ranges_are_sorted_merged_and_shown_like_the_constructor():
    beam = ilkit.Beam(20, SPANS, EI=[(8, 12, "3.5"), (0, 8, 2), (12, 20, 2)])
    assert beam.EI == ((0, 8, 2), (8, 12, F(7, 2)), (12, 20, 2))
    assert repr(beam).endswith("EI=[(0, 8, 2), (8, 12, 3.5), (12, 20, 2)])")
    assert eval(repr(beam), {"Beam": ilkit.Beam, "Spring": Spring}) == beam
    # equal neighbours merge; a single range is a prismatic beam
    assert ilkit.Beam(20, SPANS, EI=[(0, 5, 3), (5, 20, 3)]) == ilkit.Beam(20, SPANS, EI=3)
    assert ilkit.Beam(20, SPANS, EI=np.array([[0, 20, 3.0]])).EI == 3


def test_varying_ei_changes_the_lines_and_replace_keeps_it():
    prismatic = ilkit.Beam(20, SPANS, EI=2)
    haunched = prismatic.replace(EI=[(0, 8, 2), (8, 12, 4), (12, 20, 2)])
    assert haunched.EI_ranges[1] == (8, 12, 4)
    assert haunched.moment(10)(5.0) < prismatic.moment(10)(5.0) < 0  # a stiffer pier zone draws more moment
    # a uniform change of EI leaves force lines unchanged (they depend on stiffness ratios only)
    assert prismatic.replace(EI=7).moment(10)(5.0) == pytest.approx(prismatic.moment(10)(5.0), rel=1e-13)
    assert haunched.replace(supports={0: "pin", 20: "roller"}).EI == haunched.EI


@pytest.mark.parametrize(
    ("EI", "words"),
    [
        (0, "greater than 0"),
        (-3, "greater than 0"),
        ("soft", "cannot read"),
        ({(0, 20): 3}, "list of ranges"),
        ([(0, 8, 2), (9, 20, 2)], "from x=8 to x=9"),
        ([(0, 8, 2), (6, 20, 2)], "overlap from x=6 to x=8"),
        ([(0, 8, 2)], "from x=8 to x=20"),
        ([(2, 20, 2)], "from x=0 to x=2"),
        ([(0, 25, 2)], "0 <= start < end <= 20"),
        ([(5, 5, 2), (0, 20, 1)], "0 <= start < end"),
        ([(0, 20)], "(start, end, EI)"),
        ([(0, 20, -1)], "greater than 0"),
        ([], "empty"),
    ],
)
def test_bad_ei_is_refused_with_the_fix(EI, words):
    with pytest.raises(ilkit.BeamInputError) as info:
        ilkit.Beam(20, SPANS, EI=EI)
    assert words in str(info.value)
    assert info.value.field == "EI"


def test_indeterminate_beam_without_ei_says_to_give_it():
    beam = ilkit.Beam(20, SPANS)
    assert beam.degree == 1  # building the beam and asking its degree need no EI
    with pytest.raises(ilkit.StiffnessRequiredError, match=r"indeterminate \(degree 1\).*give the beam EI"):
        beam.moment(5)
    with pytest.raises(ilkit.StiffnessRequiredError, match="deflection lines need the flexural stiffness"):
        ilkit.Beam(10, {0: "pin", 10: "roller"}).deflection(5)


# --------------------------------------------------------------------- springs
def test_spring_forms_and_repr():
    assert repr(Spring(vertical=5000)) == "Spring(vertical=5000)"
    assert repr(Spring(rotational="2e5")) == "Spring(rotational=200000)"
    assert repr(Spring(vertical=1.5, rotational="rigid")) == "Spring(vertical=1.5, rotational='rigid')"
    assert Spring(vertical=2) == Spring(vertical="2", rotational="free")
    beam = ilkit.Beam(20, {0: "pin", 10: Spring(vertical=800), 20: Spring(rotational=300)}, EI=1000)
    assert beam.supports[1].kind == "spring" and beam.supports[1].vertical_stiffness == 800
    assert beam.supports[2].restrains_rotation and beam.supports[2].rotational_stiffness == 300
    assert beam.supports[0].vertical_stiffness is None and beam.supports[0].spec == "pin"
    text = repr(beam)
    assert "10: Spring(vertical=800), 20: Spring(rotational=300)" in text
    assert eval(text, {"Beam": ilkit.Beam, "Spring": Spring}) == beam
    assert beam.replace(EI=2000).supports == beam.supports
    with pytest.raises(AttributeError):
        beam.supports[1].spring.vertical = 3  # type: ignore[misc]


@pytest.mark.parametrize(
    ("kwargs", "words"),
    [
        ({}, "no spring in it; it is a 'pin' support"),
        ({"rotational": "rigid"}, "it is a 'fixed' support"),
        ({"vertical": 0}, "vertical stiffness must be greater than 0"),
        ({"vertical": -5}, "vertical stiffness must be greater than 0"),
        ({"rotational": 0}, "rotational stiffness must be greater than 0"),
        ({"vertical": "free"}, "carries no load"),
        ({"vertical": "stiff"}, "cannot read"),
        ({"vertical": float("inf")}, "not a finite number"),
    ],
)
def test_bad_spring_is_refused(kwargs, words):
    with pytest.raises(ilkit.BeamInputError) as info:
        Spring(**kwargs)
    assert words in str(info.value)


def test_spring_as_a_string_points_to_the_spring_value():
    with pytest.raises(ilkit.BeamInputError, match=r"ilkit\.Spring\(vertical=\.\.\., rotational=\.\.\.\)"):
        ilkit.Beam(10, {0: "pin", 10: "spring"})


def test_moment_reaction_and_side_at_a_rotational_spring():
    beam = ilkit.Beam(20, {0: "pin", 10: Spring(vertical=500, rotational=4000), 20: "roller"}, EI=1000)
    assert beam.moment_reaction(10)(4.0) != 0
    with pytest.raises(ilkit.SideRequiredError, match="side='left' or side='right'"):
        beam.moment(10)  # the moment jumps by the spring moment
    xs = np.linspace(0, 20, 41)
    jump = beam.moment(10, side="left")(xs) - beam.moment(10, side="right")(xs)
    np.testing.assert_allclose(jump, beam.moment_reaction(10)(xs), atol=1e-12)
    with pytest.raises(ilkit.BeamInputError, match="not fixed"):
        beam.moment_reaction(0)
    with pytest.raises(ilkit.BeamInputError, match="fixity undefined"):
        ilkit.Beam(20, {0: "pin", 10: Spring(rotational=4000), 20: "roller"}, hinges=[10])


def test_sides_of_deflection_and_rotation():
    beam = ilkit.Beam(20, {0: "fixed", 12: "pin", 20: "roller"}, hinges=[6], shear_releases=[15], EI=1000)
    with pytest.raises(ilkit.SideRequiredError, match="deflection jumps"):
        beam.deflection(15)
    with pytest.raises(ilkit.SideRequiredError, match="rotation jumps"):
        beam.rotation(6)
    xs = np.linspace(0, 20, 81)
    # the two faces of the shear release differ, both faces of the hinge deflect alike
    assert np.max(np.abs(beam.deflection(15, side="left")(xs) - beam.deflection(15, side="right")(xs))) > 1e-6
    assert np.max(np.abs(beam.rotation(6, side="left")(xs) - beam.rotation(6, side="right")(xs))) > 1e-6
    assert beam.deflection(6)(6.0) > 0  # no side needed at a hinge; a load there pushes it down
    assert beam.deflection(0)(xs).tolist() == [0.0] * len(xs)  # the fixed end does not move
    assert beam.rotation(0)(xs).tolist() == [0.0] * len(xs)


def test_exact_flag_must_be_a_bool():
    beam = ilkit.Beam(20, SPANS, EI=1)
    with pytest.raises(ilkit.BeamInputError, match="exact: give True or False"):
        beam.moment(5, exact="yes")  # type: ignore[arg-type]


def test_lines_are_cached_per_beam_and_kind():
    beam = ilkit.Beam(20, SPANS, EI=1)
    assert beam.moment(5) is beam.moment(5)
    assert beam.moment(5, exact=True) is not beam.moment(5)
    assert beam.moment(5, exact=True).is_exact and not beam.moment(5).is_exact


def test_kinematic_solver_refuses_an_indeterminate_beam():
    from ilkit.kinematics import exact_line

    with pytest.raises(ilkit.IndeterminateBeamError, match=r"degree 1.*stiffness method"):
        exact_line(ilkit.Beam(20, SPANS, EI=1), Quantity("moment", F(5)))


def test_which_method_answers():
    determinate = ilkit.Beam(10, {0: "pin", 10: Spring(vertical=300)}, EI=1)
    continuous = ilkit.Beam(20, SPANS, EI=1)
    assert method_for(determinate, Quantity("moment", F(5))) == "kinematic"
    assert method_for(determinate, Quantity("rotation", F(5))) == "stiffness"
    assert method_for(continuous, Quantity("reaction", F(0))) == "stiffness"
    assert continuous.moment(5).degree == 3 and determinate.moment(5).degree == 1


# ---------------------------------------------------------------- conditioning
def test_ill_conditioned_beam_is_refused_and_exact_still_works():
    # a pin whose rotational spring is 1e14 times softer than the beam: nearly a mechanism
    beam = ilkit.Beam(10, {0: Spring(rotational=1e-15)}, EI=1)
    with pytest.raises(ilkit.IllConditionedError) as info:
        beam.deflection(10)
    message = str(info.value)
    assert "rotational spring at x=0 is 1.0e+14 times softer" in message and "exact=True" in message
    assert info.value.condition > info.value.limit
    exact = beam.deflection(10, exact=True)
    assert exact.is_exact
    # rigid-body rotation about the spring, 10 / k per unit load at 10, plus the cantilever's bending
    assert exact.ordinate_exact(10) == 10 * 10 * 10**15 + F(1000, 3)


def test_an_extreme_stiffness_contrast_is_solved_exactly_not_refused():
    # EI 1e13 times larger in the middle: rounding the stiffness terms apart in floats would give a
    # spurious stiffness of the order of the flexible parts' own, so the float line is the exact line rounded
    beam = ilkit.Beam(20, SPANS, EI=[(0, 5, 1), (5, 15, F(10) ** 13), (15, 20, 1)])
    line, exact = beam.moment(10), beam.moment(10, exact=True)
    assert not line.is_exact and "1.0e+13 times stiffer in bending" in line.origin.exact_because
    xs = np.linspace(0, 20, 201)
    truth = np.array([float(exact.ordinate_exact(float(x))) for x in xs])
    assert np.max(np.abs(line(xs) - truth)) <= 1e-14 * np.max(np.abs(truth))
    assert exact.ordinate_exact(3) < 0


def test_reasonable_contrasts_are_accepted():
    beam = ilkit.Beam(
        40.001,
        {0: "pin", 20: Spring(vertical=F(10) ** 9), 40: "pin", 40.001: "roller"},
        EI=[(0, 19, 1), (19, 21, 1000), (21, 40.001, 1)],
    )
    line = beam.moment(10)
    exact = beam.moment(10, exact=True)
    xs = np.linspace(0, 40, 81)
    np.testing.assert_allclose(line(xs), exact(xs), rtol=0, atol=1e-9 * np.max(np.abs(exact(xs))))
