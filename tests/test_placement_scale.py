"""Placement does not depend on the size of the numbers: the same problem at another size gives the same answer.

Dimensional analysis (common practice): with every length multiplied by
``lam`` and every load by ``mu``, the ordinates of reaction and shear lines
are unchanged (ratios of forces) and those of moment lines are multiplied
by ``lam`` (a length), so extremes of reactions and shears scale by ``mu``,
of moments by ``mu lam``, and every position by ``lam``.  Lengths are scaled
exactly (fractions), so the problems are exactly similar; the answers must
agree to 1e-9, relative.
"""

from __future__ import annotations

import math
from fractions import Fraction

import pytest

import ilkit
from ilkit.loads import AxleTrain, KnifeEdge, TrainUniform, UniformBlocks, UniformLoad, extremes

SCALES = [Fraction(1, 10**6), Fraction(1, 1000), Fraction(1000), Fraction(10**6)]
REL = 1e-9


def gerber(lam: Fraction) -> ilkit.Beam:
    """A suspended-span girder of our own: 12 + 20 + 12, hinges 4 from the piers, an overhang of 3."""
    return ilkit.Beam(
        47 * lam,
        {0: "pin", 12 * lam: "roller", 32 * lam: "roller", 44 * lam: "roller"},
        hinges=[16 * lam, 28 * lam],
        units="kN-m",
    )


def continuous(lam: Fraction) -> ilkit.Beam:
    """Three continuous spans of our own (11, 14.5, 9), EI changing over the middle span (curved lines)."""
    return ilkit.Beam(
        Fraction(69, 2) * lam,
        {0: "pin", 11 * lam: "roller", Fraction(51, 2) * lam: "roller", Fraction(69, 2) * lam: "roller"},
        EI=[(0, 13 * lam, 2), (13 * lam, Fraction(69, 2) * lam, 3)],
        units="kN-m",
    )


def lines(beam: ilkit.Beam, lam: Fraction):
    """Shear at a section and at a pier (both faces), moments at a section and a pier, a reaction."""
    out = [
        beam.shear(Fraction(37, 5) * lam),
        beam.shear(12 * lam if beam.length == 47 * lam else 11 * lam, side="left"),
        beam.shear(12 * lam if beam.length == 47 * lam else 11 * lam, side="right"),
        beam.moment(Fraction(37, 5) * lam),
        beam.moment(Fraction(211, 10) * lam),
        beam.reaction(beam.supports[1].at),
    ]
    return out


def loads(lam: float, mu: float):
    """Loads of our own at the given scale: trains with fixed and varying spacings, dropped adverse axles,
    uniform parts travelling with a train, blocks, a knife edge and a breakable uniform load."""
    return [
        AxleTrain(
            [1.5 * mu, 4 * mu, 4 * mu], [1.3 * lam, (1.3 * lam, 4.1 * lam)], units="kN-m", drop_adverse_axles=True
        ),
        AxleTrain(
            [2 * mu, 3 * mu, 3 * mu, 1 * mu],
            [0.3 * lam, (2.5 * lam, math.inf), 0.9 * lam],
            units="kN-m",
        ),
        AxleTrain(
            [5 * mu] * 3,
            [0.7 * lam] * 2,
            units="kN-m",
            ahead=TrainUniform(0.8 * mu / lam, 0.4 * lam, breakable=True),
            behind=TrainUniform(0.8 * mu / lam, 0.4 * lam, breakable=True),
        ),
        UniformBlocks(1.1 * mu / lam, [3 * lam, 3 * lam], [5 * lam], units="kN-m"),
        KnifeEdge(7 * mu, units="kN-m"),
        UniformLoad(0.6 * mu / lam, units="kN-m"),
    ]


def moved(extreme, line, lam: float, mu: float) -> float:
    """The effect on ``line`` of the placement of ``extreme`` with positions divided by ``lam`` and loads by
    ``mu``, each axle on the face it names (the same placement in the unscaled problem)."""
    total = 0.0
    for p in extreme.placements:
        effect = 0.0
        for a in p.axles:
            if a.counted:
                face = {"left": line.left, "right": line.right, None: line}[a.side]
                effect += a.load / mu * float(face(a.x / lam))
        for q in p.patches:
            effect += q.intensity * lam / mu * line.integral(q.start / lam, q.end / lam)
        total += p.factor * effect
    return total


def compare(line, base, scaled, lam: float, mu: float) -> None:
    size = mu * lam if line.quantity.is_moment else mu
    for a, b in ((base.maximum, scaled.maximum), (base.minimum, scaled.minimum)):
        assert b.value == pytest.approx(a.value * size, rel=REL, abs=REL * abs(a.value) * size + 1e-300)
        same = all(
            [x.x * lam for x in pa.axles] == pytest.approx([x.x for x in pb.axles], rel=REL, abs=REL * lam * 50)
            and [x.side for x in pa.axles] == [x.side for x in pb.axles]
            and [s * lam for s in pa.spacings] == pytest.approx(list(pb.spacings), rel=REL)
            for pa, pb in zip(a.placements, b.placements)
        )
        if not same:  # a tie: another placement, as good as the first in the unscaled problem
            assert moved(b, line, lam, mu) == pytest.approx(a.value, rel=REL, abs=REL * abs(a.value) + 1e-300)


@pytest.mark.parametrize("make", [gerber, continuous], ids=["gerber", "continuous"])
@pytest.mark.parametrize("lam", SCALES, ids=[f"length x {float(s):g}" for s in SCALES])
def test_same_extremes_at_any_length_scale(make, lam):
    one = Fraction(1)
    for base_line, scaled_line in zip(lines(make(one), one), lines(make(lam), lam)):
        for base_load, scaled_load in zip(loads(1.0, 1.0), loads(float(lam), 1.0)):
            compare(base_line, extremes(base_line, base_load), extremes(scaled_line, scaled_load), float(lam), 1.0)


@pytest.mark.parametrize("mu", [1e-200, 1e-6, 1e6, 1e200])
def test_same_extremes_at_any_load_scale(mu):
    # loads of 1e200 or 1e-200 once overflowed or underflowed the search for stationary points (b^2 - 4ac)
    one = Fraction(1)
    for make in (gerber, continuous):
        for line in lines(make(one), one):
            for base_load, scaled_load in zip(loads(1.0, 1.0), loads(1.0, mu)):
                compare(line, extremes(line, base_load), extremes(line, scaled_load), 1.0, mu)


def test_axles_1e13_apart_keep_their_spacing():
    # a spacing of 1e13 m (inside the documented range of numbers) once rounded the 0.3 m behind it:
    # the two axles 0.3 m apart just left of the section, 100 (0.9 + 0.6) / 10 (simple span, -x/L)
    beam = ilkit.Beam(10, {0: "pin", 10: "roller"}, units="kN-m")
    train = AxleTrain([100, 100, 100], [1e13, 0.3], units="kN-m")
    found = extremes(beam.shear(0.9), train)
    assert found.minimum.value == pytest.approx(-15.0, rel=1e-12)
    # moment at 3.3 with both near axles on the span: 100 (3.3 x 6.7 + 3.3 x 6.4) / 10 (a (L - x) / L)
    assert extremes(beam.moment(3.3), train).maximum.value == pytest.approx(432.3, rel=1e-12)
    on_beam = [a for a in found.minimum.placements[0].axles if a.counted]
    assert sorted(a.x for a in on_beam) == [pytest.approx(0.6, rel=1e-12), 0.9]
    assert found.minimum.placements[0].spacings == (1e13, 0.3)
