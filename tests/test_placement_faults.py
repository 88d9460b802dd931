"""Regression tests, one per placement fault found by random and adversarial inputs (each named after it).

Reference values are closed forms written out in the test (the shear line
of a simple span of length L at a section a: ``-x / L`` left of the section,
``(L - x) / L`` right of it, statics of a simple span, common practice), the
exact unit factors (1 ft = 0.3048 m and 1 lbf = 4.4482216152605 N exactly,
by definition) and the independent brute force of tests/brute_force.py.
"""

from __future__ import annotations

import math
from fractions import Fraction

import numpy as np
import pytest
from brute_force import brute_force, lipschitz

import ilkit
from ilkit.loads import AxleTrain, extremes, lm1, place

KIP = 4.4482216152605  # kN per kip, exact by definition


def simple(L, units="kN-m"):
    return ilkit.Beam(L, {0: "pin", L: "roller"}, units=units)


def test_shear_axle_behind_lead_stays_on_its_face():
    # 0.9 - 0.3 + 0.3 rounds to 0.9000000000000001, right of the section: the second axle
    # must still stand just left of it.  Both left of the section: -100 (0.9 + 0.6) / 10 = -15
    found = place(simple(10).shear(0.9), AxleTrain([100, 100], [0.3], units="kN-m"), "min")
    assert found.value == pytest.approx(-15.0, rel=1e-12)
    axles = sorted(found.placements[0].axles, key=lambda a: a.x)
    assert [a.x for a in axles] == [pytest.approx(0.6), 0.9]
    assert axles[1].side == "left" and axles[1].ordinate == pytest.approx(-0.09, rel=1e-12)


def test_placement_table_sums_to_the_extreme_with_an_axle_on_a_face():
    # two spans (10 and 80 m), shear at 47.7, a four-axle train with a varying first spacing: the table
    # once listed an axle on the left face with the right face's ordinate, summing to 1.401 for -0.599
    beam = ilkit.Beam(90, {0: "pin", 10: "roller", 90: "roller"}, EI=1, units="kN-m")
    line = beam.shear(47.7)
    train = AxleTrain([1, 1, 1, 2], [(27, 40.5), 1.8, 41.4], units="kN-m")
    found = extremes(line, train)
    b_max, b_min = brute_force(line, train)
    tol = 2 * lipschitz(line, train) * 1e-8 * line.length + 1e-9
    for e, b in ((found.maximum, b_max), (found.minimum, b_min)):
        table = e.to_frame()
        assert table["factored effect [kN]"].sum() == pytest.approx(e.value, rel=1e-12)
        for a in e.placements[0].axles:
            face = {"left": line.left, "right": line.right, None: line}[a.side]
            assert a.ordinate == pytest.approx(float(face(a.x)), rel=1e-12, abs=1e-15)
        # the brute force never beats it
        assert b <= e.value + tol if e.extreme == "max" else b >= e.value - tol
    assert found.minimum.value == pytest.approx(b_min, abs=0.01)  # the brute force steps the spacing


def test_lm1_on_a_kip_ft_girder_equals_the_same_girder_in_kn_m():
    # the tandem's 1.2 m spacing converted to feet put its second axle on the wrong face of the section
    span_ft = 97.3
    in_ft = simple(span_ft, "kip-ft")
    in_m = in_ft.in_units("kN-m")
    model = lm1()
    for x in [12.1625, *np.linspace(0, span_ft, 21)[1:-1]]:
        a = extremes(in_ft.shear(x), model)
        b = extremes(in_m.shear(Fraction(str(x)) * Fraction("0.3048")), model)
        assert a.minimum.value * KIP == pytest.approx(b.minimum.value, rel=1e-9)
        assert a.maximum.value * KIP == pytest.approx(b.maximum.value, rel=1e-9)


def test_shear_near_an_end_support_is_not_zero():
    # 64.7 ft simple span, shear at 0.1 ft under the LM1 tandem (300 kN axles, 1.2 m apart): only one axle
    # fits left of the section, just left of it: V = -P a / L with P = 300 kN in kips
    beam = simple(64.7, "kip-ft")
    tandem = lm1().cases[0].parts[0]
    assert isinstance(tandem, AxleTrain)
    found = place(beam.shear(0.1), tandem, "min")
    P = 300 / KIP
    assert found.value == pytest.approx(-P * 0.1 / 64.7, rel=1e-12)
    assert found.value != 0.0 and not math.isclose(found.value, 0.0)


def test_train_as_long_as_the_beam_to_rounding_is_described_as_it_was_valued():
    # a 0.1 + 0.7 m cantilevered girder (fixed at 0, hinge at 0.1, pin at 0.2, free end at
    # 0.7999999999999999) and two 0.25 kN axles 0.8 m apart: the train fits on the beam to rounding.
    # The search once cut it as longer than the beam, valued the rear axle as off the beam and then
    # described it standing on the free end, so the table summed to -1.25 for a maximum of 0.25.
    # Statics (common practice): shear just right of the fixed support is +1 for a load on the
    # first part (0 < x <= 0.1); a load at the free end gives -(0.8 - 0.2)/(0.2 - 0.1) = -6.
    beam = ilkit.Beam(0.1 + 0.7, {0: "fixed", 0.2: "pin"}, hinges=[0.1], units="kN-m")
    line = beam.shear(0, side="right")
    train = AxleTrain([0.25, 0.25], [0.8], units="kN-m")
    found = extremes(line, train)
    assert found.maximum.value == pytest.approx(0.25, rel=1e-12)  # one axle at the support, the other off
    assert found.minimum.value == pytest.approx(-1.5, rel=1e-12)  # one axle at the free end, the other off
    for e in (found.maximum, found.minimum):
        assert e.to_frame()["factored effect [kN]"].sum() == pytest.approx(e.value, rel=1e-12)
        for a in e.placements[0].axles:
            face = {"left": line.left, "right": line.right, None: line}[a.side]
            on_beam = a.counted
            assert a.ordinate * on_beam == pytest.approx(float(face(a.x)) * on_beam, rel=1e-12, abs=1e-15)
