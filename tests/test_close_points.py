"""Close and coincident points: positions typed as float arithmetic, near-coincident geometry, and the
messages about positions.

Each regression test is named after the fault it pins.  The closed forms come from Clapeyron's
three-moment equation, written out beside each check (common practice).
"""

from __future__ import annotations

from fractions import Fraction
from unittest import mock

import matplotlib
import numpy as np
import pytest
from continuous_strategies import elastic_beams
from hypothesis import HealthCheck, assume, given, settings
from hypothesis import strategies as st

matplotlib.use("Agg")
import matplotlib.pyplot as plt

import ilkit
from ilkit import BeamInputError, IllConditionedError, SideRequiredError, Spring, UnstableBeamError
from ilkit import positions as positions_module
from ilkit.positions import MERGE_TOLERANCE
from ilkit.views import derivation, sketch, write_calculation_sheet

F = Fraction
FLOAT_TOLERANCE = 1e-9
"""Float lines equal the exact lines to this fraction of their largest ordinate, or of a typical ordinate of
their kind where that is larger (the deflection line of a section next to a fixed end is itself tiny, and
float arithmetic resolves it to the beam's scale, not to its own): the stated tolerance."""


@pytest.fixture(autouse=True)
def _close_figures():
    yield
    plt.close("all")


def two_span_end_reaction(a: float) -> float:
    """Reaction at the far end support of a two-span continuous beam (spans 1, EI constant) for a unit load
    at ``a`` in the first span.  Three-moment equation at the middle support: 2 M_B (1 + 1) = -a (1 - a²),
    so M_B = -a (1 - a²) / 4; the unloaded second span gives R_C = M_B / 1."""
    return -a * (1 - a * a) / 4


def three_span_reaction_c(a: float) -> float:
    """Reaction at the second interior support C of a three-span continuous beam A-B-C-D (spans 1, EI
    constant) for a unit load at ``a`` in span AB.  Three-moment equations: at B 4 M_B + M_C = -a (1 - a²),
    at C M_B + 4 M_C = 0, so M_B = -4 a (1 - a²) / 15 and M_C = -M_B / 4; span BC gives M_B - M_C and span CD
    gives -M_C at C: R_C = M_B - 2 M_C = 3 M_B / 2."""
    return 1.5 * (-4 * a * (1 - a * a) / 15)


# ----------------------------------------------------------------- near-coincident geometry (item 3)
def test_hinge_1e8_from_a_roller_gave_a_wrong_float_reaction(reference):
    # it gave -0.192 (then 0.0) in floats where the exact value is -0.096
    beam = ilkit.Beam(3, {0: "pin", 1: "pin", 2: "roller", 3: "pin"}, hinges=[2.00000001], EI=1)
    line = beam.reaction(2)
    # the part right of the hinge carries nothing for a load in the first span: a two-span beam 0-1-2
    reference("hinge 1e-8 beside a roller: end reaction of two unit spans, load at 0.58",
              expected=two_span_end_reaction(0.58), computed=line(0.58), abs=1e-7,
              source="three-moment (Clapeyron) equation, written out in the test (common practice)",
              clause="2 M_B (1 + 1) = -a (1 - a²), R_C = M_B")
    assert line(0.58) == pytest.approx(float(beam.reaction(2, exact=True).ordinate_exact(F("0.58"))), rel=1e-12)
    assert "from x=2 to x=2.00000001" in line.origin.exact_because


def test_spring_and_roller_1e8_apart_gave_a_wrong_float_reaction(reference):
    beam = ilkit.Beam(3, {0: "pin", 1: "pin", 2: "roller", 2.00000001: Spring(vertical=1), 3: "pin"}, EI=1)
    line = beam.reaction(2)
    # the spring beside the roller barely moves: a three-span continuous beam 0-1-2-3
    reference("spring 1e-8 beside a roller: reaction at C of three unit spans, load at 0.58",
              expected=three_span_reaction_c(0.58), computed=line(0.58), abs=1e-7,
              source="three-moment (Clapeyron) equation, written out in the test (common practice)",
              clause="4 M_B + M_C = -a (1 - a²), M_B + 4 M_C = 0, R_C = 3 M_B / 2")
    assert line(0.58) == pytest.approx(float(beam.reaction(2, exact=True).ordinate_exact(F("0.58"))), rel=1e-12)
    assert abs(beam.reaction(2.00000001)(0.58)) < 1e-7


def test_near_coincident_lines_are_derived_exactly_and_say_why():
    beam = ilkit.Beam(3, {0: "pin", 1: "pin", 2: "roller", 3: "pin"}, hinges=[2.00000001], EI=1)
    line = beam.reaction(2)
    force = derivation(line).to_text()  # the force method, as a check, in exact arithmetic
    assert "The exact ordinates equal those of the stiffness method's exact line" in force
    stiffness = derivation(line, method="stiffness").to_text()
    assert "exactly, in rational arithmetic, then rounded to floats" in stiffness
    assert "from x=2 to x=2.00000001 is 1.0e+16 times stiffer" in stiffness


@st.composite
def near_coincident(draw):
    """A stable beam, a point of it, and something new placed 1e-3 to 1e-12 of the length away from it:
    a hinge, a shear release, a roller, a spring, a change of EI, or the section of a line."""
    beam = draw(elastic_beams(max_spans=3, min_degree=0, hinges=draw(st.booleans())))
    L = beam.length
    anchor = draw(st.sampled_from(beam._points))
    exponent = draw(st.floats(3, 12))
    gap = L * F(repr(10.0**-exponent))
    direction = draw(st.sampled_from([1, -1]))
    if not 0 < anchor + direction * gap < L:
        direction = -direction
    where = anchor + direction * gap
    if draw(st.booleans()):  # typed as float arithmetic
        where = F(repr(float(anchor) + direction * float(gap)))
    what = draw(st.sampled_from(["hinge", "shear release", "roller", "spring", "EI change", "section"]))
    return beam, what, where, abs(where - anchor)


def changed(beam: ilkit.Beam, what: str, where: Fraction) -> ilkit.Beam:
    supports = {s.at: s.spec for s in beam.supports}
    if what == "hinge":
        return beam.replace(hinges=[*beam.hinges, where])
    if what == "shear release":
        return beam.replace(shear_releases=[*beam.shear_releases, where])
    if what in ("roller", "spring"):
        return beam.replace(supports={**supports, where: "roller" if what == "roller" else Spring(vertical=3)})
    if what == "EI change":
        ranges = []
        for a, b, ei in beam.EI_ranges:
            ranges += [(a, where, ei), (where, b, ei * 2)] if a < where < b else [(a, b, ei)]
        return beam.replace(EI=ranges)
    return beam


def lines(beam: ilkit.Beam, where: Fraction, *, exact: bool) -> list:
    """Lines of several kinds, at the new point and elsewhere (shear with a side where it jumps)."""
    spans = beam.spans or ((Fraction(0), beam.length),)
    asked = [("moment", where), ("shear", where), ("deflection", where), ("rotation", where),
             ("moment", (spans[0][0] + spans[0][1]) / 2), ("reaction", beam.supports[-1].at)]
    out = []
    for kind, at in asked:
        try:
            out.append(beam.line(kind, at, exact=exact))
        except SideRequiredError:
            out.append(beam.line(kind, at, side="right", exact=exact))
    return out


def typical(line) -> float:
    """A typical ordinate of the line's kind on its beam (the size of a line that is identically zero)."""
    beam = line.origin.beam
    L = float(beam.length)
    ei = min(float(e) for _, _, e in beam.EI_ranges)
    q = line.quantity
    return {"deflection": L**3 / ei, "rotation": L**2 / ei}.get(q.kind, L if q.is_moment else 1.0)


def worst_difference(line, truth, xs) -> float:
    """Largest difference of ``line`` from the exact ``truth`` (rational evaluation), relative to the
    largest exact ordinate or a typical one of its kind, at ``xs`` and on both faces of every knot."""
    points = [F(repr(float(x))) for x in xs] + list(truth.exact_breakpoints)
    exact = [(p, s, float(truth.ordinate_exact(p, s))) for p in points for s in ("left", "right")]
    scale = max(max(abs(v) for _, _, v in exact), typical(truth))
    got = [float(line.left(float(p)) if s == "left" else line.right(float(p))) for p, s, _ in exact]
    return max(abs(g - v) for g, (_, _, v) in zip(got, exact)) / scale


@settings(max_examples=60, deadline=None, suppress_health_check=[HealthCheck.filter_too_much, HealthCheck.too_slow])
@given(near_coincident())
def test_near_coincident_float_lines_equal_the_exact_lines_or_are_refused(case):
    beam, what, where, gap = case
    try:
        near = changed(beam, what, where)
    except UnstableBeamError:
        assume(False)
    except BeamInputError:
        # only a merge that would be ambiguous is refused (two supports, a release on a support ...)
        assert gap <= beam.length * MERGE_TOLERANCE
        return
    xs = np.linspace(0, float(near.length), 23)
    for exact in lines(near, where, exact=True):
        try:
            line = near.line(exact.quantity.kind, exact.quantity.at, exact.quantity.side)
        except IllConditionedError:
            continue
        assert worst_difference(line, exact, xs) <= FLOAT_TOLERANCE, (line, near)


@settings(max_examples=40, deadline=None, suppress_health_check=[HealthCheck.filter_too_much, HealthCheck.too_slow])
@given(near_coincident(), st.floats(9.5, 12))
def test_merging_close_points_moves_the_lines_by_no_more_than_the_gap(case, exponent):
    beam, what, _, _ = case
    anchor = min(beam._points[1:], key=lambda p: abs(p - beam.length / 2))
    where = anchor - beam.length * F(repr(10.0**-exponent))  # within the merge tolerance
    try:
        merged = changed(beam, what, where)
        with mock.patch.object(positions_module, "MERGE_TOLERANCE", Fraction(0)):
            apart = changed(beam, what, where)
            truths = lines(apart, where, exact=True)
    except (UnstableBeamError, BeamInputError):
        assume(False)
    assert len(merged._points) <= len(beam._points)  # the new point merged with an old one
    gap = float((anchor - where) / beam.length)
    xs = [x for x in np.linspace(0, float(beam.length), 41) if abs(x - float(anchor)) > 1e-6 * float(beam.length)]
    for truth in truths:
        q = truth.quantity
        try:
            line = merged.line(q.kind, q.at, q.side)
        except SideRequiredError:
            line = merged.line(q.kind, q.at, "left")  # the section was just left of the point
        scale = max(abs(truth.maximum.value), abs(truth.minimum.value), typical(truth))
        assert np.max(np.abs(line(np.array(xs)) - truth(np.array(xs)))) <= max(1e3 * gap, 1e-9) * scale


# ------------------------------------------------------------------ float-typed geometry (item 9)
S = 92


def test_last_support_typed_as_a_float_product_made_a_tiny_overhang_and_was_refused():
    # 2*s + 1.3*s is 303.6 but 3.3*s is 303.59999999999997: the support missed the end by 6e-14 ft
    beam = ilkit.Beam(2 * S + 1.3 * S, {0: "pin", S: "roller", 2.3 * S: "roller", 3.3 * S: "roller"},
                      EI=2.6e7, units="kip-ft")
    assert beam.supports[-1].at == beam.length == F("303.6")
    typed = ilkit.Beam("303.6", {0: "pin", 92: "roller", "211.6": "roller", "303.6": "roller"}, EI=2.6e7,
                       units="kip-ft")
    assert beam == typed
    assert np.array_equal(beam.moment(10).sample()[1], typed.moment(10).sample()[1])


def test_determinate_beam_typed_as_float_arithmetic_had_a_phantom_segment():
    beam = ilkit.Beam(2 * S + 1.3 * S, {0: "pin", 3.3 * S: "roller"}, units="kip-ft")
    assert beam.spans == ((0, F("303.6")),) and beam.supports[-1].at == beam.length
    line = beam.reaction(3.3 * S)
    assert line.breakpoints == (0.0, 303.6) and line.right(303.6) == 0 and line.left(303.6) == 1


def test_positions_merge_onto_the_end_then_the_support_then_the_release():
    L = F(30)
    eps = F(1, 10**12)
    beam = ilkit.Beam(L + eps, {0 - eps: "pin", 10 + eps: "roller", 20: "roller", L: "roller"}, hinges=[10 - eps],
                      EI=[(0, 20 - eps, 2), (20 + eps, 30, 3)])
    assert beam.length == L + eps  # the length is the length given: positions merge onto it
    assert [s.at for s in beam.supports] == [0, 10 + eps, 20, L + eps]
    assert beam.hinges == (10 + eps,)
    assert beam.EI == ((0, 20, 2), (20, L + eps, 3))


def test_ends_of_ei_ranges_merge_onto_the_simplest_value():
    beam = ilkit.Beam(20, {0: "pin", 20: "roller"}, EI=[(0, 9.999999999999998, 1), (10, 20, 2)])
    assert beam.EI == ((0, 10, 1), (10, 20, 2))


@pytest.mark.parametrize(
    ("kwargs", "message"),
    [
        ({"supports": {0: "pin", 10: "roller", 10.00000000001: "roller", 20: "roller"}},
         r"supports: the support at x=10 and the support at x=10.00000000001 are 1e-11 apart, closer than the "
         r"merge tolerance \(2e-08: 1e-09 of the beam.s length\)"),
        ({"supports": {0: "pin", 20: "roller"}, "hinges": [10], "shear_releases": [10.000000000001]},
         r"the hinge at x=10 and the shear release at x=10.000000000001 .* would cut the beam in two"),
        ({"supports": {0: "pin", 20: "roller"}, "hinges": [10, 10.000000000001], "EI": 1},
         r"hinges: the hinge at x=10 and the hinge at x=10.000000000001 are .* keep one of them"),
        ({"supports": {0: "pin", 10: "roller", 20: "roller"}, "hinges": [10.00000003],
          "EI": [(0, 10.000000015, 1), (10.000000015, 20, 2)]},
         r"hinges: the support at x=10, the end of an EI range at x=10.000000015, the hinge at x=10.00000003 "
         r"follow each other closer than the merge tolerance "
         r"\(2e-08: 1e-09 of the beam's length\) but span 3e-08, so it is not clear which of them are one point"),
        ({"supports": {0: "fixed", 20: "roller"}, "hinges": [1e-12]},
         r"hinges: a hinge at the fixed end x=1e-12 \(within the merge tolerance of x=0, so taken as that point\)"),
        ({"supports": {0: "pin", 20: "roller"}, "hinges": [19.999999999999996]},
         r"a hinge at the end x=19.999999999999996 \(within the merge tolerance of x=20.*releases nothing"),
        ({"supports": {0: "pin", 10: "pin", 20: "roller"}, "shear_releases": [10.000000000002]},
         r"a shear release at the support x=10.000000000002 \(within the merge tolerance of x=10"),
        ({"supports": {0: "pin", 20: "roller"}, "EI": [(0, 10, 1), (10, 10.000000000001, 5), (10, 20, 1)]},
         r"EI: the range \(10, 10.000000000001, 5\) is shorter than the merge tolerance"),
    ],
)
def test_merges_that_would_be_ambiguous_are_refused_with_the_positions_given(kwargs, message):
    with pytest.raises(BeamInputError, match=message):
        ilkit.Beam(20, **kwargs)


def test_position_says_which_section_is_taken():
    beam = ilkit.Beam(10, {0: "pin", F(10, 3): "roller", 10: "roller"}, hinges=[7.5], EI=1)
    assert beam.position(10 / 3) == F(10, 3) and beam.position(7.500000000001) == F(15, 2)
    assert beam.position(10.000000000001) == 10 and beam.position("5.5") == F(11, 2)
    with pytest.raises(BeamInputError, match=r"position: x=10.001 is off the beam; give a position from 0 to 10"):
        beam.position(10.001)


def test_envelope_section_typed_beside_a_support_asked_for_a_side():
    from ilkit.loads import KnifeEdge, envelope

    beam = ilkit.Beam(20, {0: "pin", 10: "roller", 20: "roller"}, EI=1, units="kN-m")
    found = envelope(beam, KnifeEdge(1, units="kN-m", name="k"), divisions=2, at=[10.000000000001])
    rows = found.sections[found.sections["x [m]"] == 10]
    assert sorted(rows["side"]) == ["left", "right"]


def test_merge_tolerance_is_relative_to_the_length():
    for scale in (F(1, 10**6), 1, 10**6):
        beam = ilkit.Beam(20 * scale, {0: "pin", 10 * scale * (1 + F(1, 10**11)): "roller", 20 * scale: "roller"},
                          EI=1)
        assert beam.supports[1].at == 10 * scale * (1 + F(1, 10**11))  # one point each: nothing to merge
        assert beam.moment(10 * scale).quantity.at == beam.supports[1].at  # the section merges onto it
        apart = 10 * scale * (1 + F(1, 10**8))
        assert beam.moment(apart).quantity.at == apart


def test_repr_showed_positions_rounded_to_six_digits():
    beam = ilkit.Beam(20, {0: "pin", 10.0000001: "roller", 20: "roller"}, hinges=[F(10, 3)], EI=2.4198233244004768)
    text = repr(beam)
    assert "10.0000001: 'roller'" in text and "hinges=[3.3333333333333335]" in text
    assert "EI=2.4198233244004768" in text
    assert repr(beam.moment(F(10, 3))).startswith("<InfluenceLine M at x=3.3333333333333335,")


# ------------------------------------------------------------------------------- messages (item 10)
def test_section_as_the_float_nearest_a_support_at_10_3_failed_with_a_message_about_knots():
    beam = ilkit.Beam(10, {0: "pin", F(10, 3): "roller", 10: "roller"}, EI=1)
    assert beam.moment(10 / 3) is beam.moment(F(10, 3))
    assert beam.reaction(10 / 3) is beam.reaction(F(10, 3))
    with pytest.raises(SideRequiredError, match=r"jumps at the support at x=3.3333333333333335; say which face"):
        beam.shear(10 / 3)
    assert beam.shear(10 / 3, side="left").quantity.at == F(10, 3)


def test_section_at_a_support_after_in_units_failed_with_a_message_about_knots():
    beam = ilkit.Beam(10, {0: "pin", F(10, 3): "roller", 10: "roller"}, EI=1, units="kN-m").in_units("kip-ft")
    support = beam.supports[1].at  # 12500/1143 ft, exactly
    typed = float(support)
    assert F(repr(typed)) != support
    assert beam.moment(typed).quantity.at == support and beam.reaction(typed).quantity.at == support
    # a hinge typed the same way lands on the support of a determinate beam too
    hinged = ilkit.Beam(beam.length, {0: "pin", support: "roller", beam.length: "roller"}, hinges=[typed],
                        units="kip-ft")
    assert hinged.hinges == (support,)


def test_reaction_off_a_support_said_the_support_was_there_at_six_digits():
    beam = ilkit.Beam(300, {0: "pin", F("223.0971234"): "roller", 300: "roller"}, EI=1)
    expected = (r"reaction: there is no support at x=223.0971; the nearest support is at x=223.0971234, "
                r"2.34e-05 away \(supports are at x=0, 223.0971234, 300\); give the position of a support")
    with pytest.raises(BeamInputError, match=expected):
        beam.reaction(223.0971)
    with pytest.raises(BeamInputError, match=r"no hinge at x=5 \(the beam has no hinge\)"):
        beam.hinge_shear(5)


def test_moment_at_a_hinge_of_an_indeterminate_beam_could_not_be_derived_or_sketched():
    beam = ilkit.Beam(20, {0: "fixed", 10: "roller", 20: "roller"}, hinges=[5], EI=1)
    assert beam.degree == 1
    for exact in (False, True):
        line = beam.moment(5, exact=exact)
        assert line.is_exact == exact
        assert line(np.linspace(0, 20, 9)).tolist() == [0.0] * 9  # a hinge carries no moment
        text = derivation(line).to_text()
        assert "Nothing to release: a hinge carries no moment at x = 5" in text
        assert "η(x) = 0  for 0 ≤ x ≤ 20" in text
        ax = sketch(line)
        assert [a.get_gid() for a in ax.findobj() if a.get_gid() in ("release", "imposed")] == []
    shear = ilkit.Beam(20, {0: "fixed", 10: "roller", 20: "roller"}, shear_releases=[15], EI=1).shear(15)
    assert "a shear release carries no shear at x = 15" in derivation(shear).to_text()


def test_default_sheet_failed_when_a_span_midpoint_is_a_hinge_of_an_indeterminate_beam(tmp_path):
    beam = ilkit.Beam(20, {0: "fixed", 10: "roller", 20: "roller"}, hinges=[5], EI=1, units="kN-m")
    sheet = write_calculation_sheet(beam, tmp_path / "hinged")
    text = sheet.markdown.read_text(encoding="utf-8")
    assert "bending moment M at x = 5 m" in text and "Nothing to release: a hinge carries no moment" in text


@pytest.mark.parametrize("length", [1e100, 1e160, 1e200, 1e300])
def test_integral_and_cumulative_raised_a_raw_overflow_on_huge_lengths(length):
    beam = ilkit.Beam(length, {0: "pin", length: "roller"})
    reaction = beam.reaction(0)  # ordinates up to 1: the area L/2 is within the float range
    assert reaction.integral(0, length) == pytest.approx(length / 2, rel=1e-15)
    assert reaction.cumulative(length) == pytest.approx(length / 2, rel=1e-15)
    assert reaction.cumulative(np.array([length / 2]))[0] == pytest.approx(3 * length / 8, rel=1e-15)
    moment = beam.moment(length / 2)  # ordinates up to L/4: the area L²/8 may leave the float range
    if length < 1e150:
        assert moment.integral(0, length) == pytest.approx(length**2 / 8, rel=1e-15)
        return
    with pytest.raises(BeamInputError, match=r"the integral from x=0 to x=1e\+\d+ is beyond the range of floats"):
        moment.integral(0, length)
    with pytest.raises(BeamInputError, match=r"the integral from the left end is beyond the range of floats"):
        moment.cumulative(length)
