"""``place`` against an independent brute force, on geometry typed the way engineers type it.

Beams are drawn as random determinate and continuous beams whose positions
are then *typed* as an engineer would: products and sums of decimal floats
(``7 * 0.3``, ``0.3 + 0.3 + ...``) and conversions from feet (``x * 0.3048``),
so that supports, releases, sections and axles meet within rounding rather
than exactly.  Trains have decimal spacings (some a multiple of the same
step, so that axles meet breakpoints within rounding), some given in feet and
kips and converted, some with variable spacings.  Lines are reactions,
moments and shears at sections and at supports on both faces.

Checks (tests/brute_force.py has the brute force and its bound):

* the brute force never beats ``place`` (beyond ``S x eps``);
* where the line is piecewise linear and every spacing fixed, the brute
  force, which then tries every placement that can be extreme, reaches it;
* the placement table is what it says: each axle's ordinate is the line's on
  the face it names, its spacings are the train's, the factored effects sum
  to the extreme's value, and one rigid train stands on one face.

Run with many more examples: ``ILKIT_HYPOTHESIS_PROFILE=nightly`` (DEVELOPERS.md).
"""

from __future__ import annotations

from fractions import Fraction
from math import gcd

import pytest
from brute_force import brute_force, check_table, effect_scale, lipschitz
from continuous_strategies import elastic_beams
from hypothesis import HealthCheck, assume, given, settings
from hypothesis import strategies as st
from profiles import examples
from strategies import determinate_beams

import ilkit
from ilkit.loads import (
    AxleTrain,
    Combination,
    KnifeEdge,
    TrainUniform,
    UniformBlocks,
    UniformLoad,
    cooper,
    extremes,
    hl93,
    lm1,
    lm71,
    sw0,
)

SETTINGS = settings(max_examples=examples(40), deadline=None, suppress_health_check=list(HealthCheck))
MANY = settings(SETTINGS, max_examples=examples(150))
FT = 0.3048  # m per ft (exact by definition)
EPS = 1e-8  # brute-force offset from a breakpoint, relative to the beam length


# ------------------------------------------------------------------ typed geometry
def _unit(values: list[Fraction]) -> Fraction:
    """The largest step that every value is a whole multiple of."""
    num, den = 0, 1
    for v in values:
        num, den = gcd(num * v.denominator, v.numerator * den), den * v.denominator
    return Fraction(num, den)


@st.composite
def typings(draw):
    """How positions are typed: ``typed(c)`` is cell ``c`` of a grid of step ``h``, computed in floats."""
    h = draw(st.sampled_from([0.1, 0.3, 0.7, 1.1, 2.5, 0.45, 1.2]))
    how = draw(st.sampled_from(["product", "sum", "feet"]))
    if how == "product":
        return h, lambda c: c * h
    if how == "sum":
        return h, lambda c: sum([h] * int(c), 0.0) + (c - int(c)) * h
    h_ft = h / FT  # a step measured in feet, converted by hand to metres
    return h, lambda c: c * h_ft * FT


@st.composite
def typed_lines(draw, continuous: bool = False):
    """A line of a random beam whose positions are typed in floats (kN-m), the step of the typing, the beam."""
    if continuous:
        topo = draw(elastic_beams(max_spans=3, varying_ei=False))
    else:
        topo = draw(determinate_beams(max_parts=3))
    points = [topo.length, *(s.at for s in topo.supports), *topo.hinges, *topo.shear_releases]
    unit = _unit([p for p in points if p])
    h, typed = draw(typings())

    def at(p: Fraction) -> float:
        return typed(p / unit)

    supports = {at(s.at): s.spec for s in topo.supports}
    try:
        beam = ilkit.Beam(
            at(topo.length),
            supports,
            hinges=[at(p) for p in topo.hinges],
            shear_releases=[at(p) for p in topo.shear_releases],
            EI=topo.EI,
            units="kN-m",
        )
    except ilkit.IlkitError:
        assume(False)
    kind = draw(st.sampled_from(["shear", "shear", "moment", "reaction"]))
    if kind == "reaction":
        rigid = [s.at for s in beam.supports if s.spring is None]
        assume(rigid)
        return beam.reaction(draw(st.sampled_from(rigid))), h, beam
    cells = int(topo.length / unit)
    c = draw(st.integers(0, cells))
    where = draw(st.sampled_from(["cell", "between", "third"]))
    x = typed(c) if where == "cell" or c == cells else (typed(c) + typed(c + 1)) / 2 if where == "between" else (
        typed(c) + h / 3
    )
    side = draw(st.sampled_from(["left", "right"]))
    try:
        line = getattr(beam, kind)(x)
    except ilkit.SideRequiredError:
        line = getattr(beam, kind)(x, side=side)
    except ilkit.IlkitError:
        assume(False)
    return line, h, beam


@st.composite
def typed_trains(draw, h: float, ranges: bool = True):
    """A train with decimal loads and spacings (some multiples of the geometry's step ``h``), maybe in kip-ft."""
    n = draw(st.integers(1, 5))
    loads = draw(st.lists(st.integers(1, 400).map(lambda k: k / 4), min_size=n, max_size=n))
    spacings: list = []
    for _ in range(n - 1):
        if draw(st.booleans()):
            spacings.append(draw(st.integers(1, 12)) * h)
        else:
            spacings.append(draw(st.integers(1, 60)) / 10)
    if ranges and n > 1:
        for k in draw(st.lists(st.integers(0, n - 2), max_size=2, unique=True)):
            spacings[k] = (spacings[k], spacings[k] + draw(st.integers(1, 40)) / 10)
    drop = draw(st.booleans())
    if draw(st.booleans()):  # the same train typed in kips and feet
        kip = 4.4482216152605
        ft_spacings = [tuple(v / FT for v in s) if isinstance(s, tuple) else s / FT for s in spacings]
        return AxleTrain([p / kip for p in loads], ft_spacings, units="kip-ft", drop_adverse_axles=drop)
    return AxleTrain(loads, spacings, units="kN-m", drop_adverse_axles=drop)


# ------------------------------------------------------------------ checks
def check_against_brute_force(line, train, two_sided: bool) -> None:
    found = extremes(line, train)
    own = train.converted(line.units)
    b_max, b_min = brute_force(line, own, eps_rel=EPS)
    scale = effect_scale(line, own)
    tol = 2 * lipschitz(line, own) * EPS * line.length + 1e-9 * scale
    # the brute force never beats the search
    assert b_max <= found.maximum.value + tol
    assert b_min >= found.minimum.value - tol
    if two_sided:  # and reaches it where it tries every placement that can be extreme
        assert found.maximum.value <= b_max + tol
        assert found.minimum.value >= b_min - tol
    for e in (found.maximum, found.minimum):
        check_table(e, line, own)


# ------------------------------------------------------------------ tests
@MANY
@given(data=st.data())
def test_place_is_never_beaten_on_typed_determinate_beams(data):
    line, h, _ = data.draw(typed_lines())
    train = data.draw(typed_trains(h))
    check_against_brute_force(line, train, two_sided=line.is_exact and not train.is_variable)


@SETTINGS
@given(data=st.data())
def test_place_is_never_beaten_on_typed_continuous_beams(data):
    line, h, _ = data.draw(typed_lines(continuous=True))
    train = data.draw(typed_trains(h))
    check_against_brute_force(line, train, two_sided=False)


def test_brute_force_catches_a_lost_face():
    # the fault this guards against: the second axle must stand just left of the section too
    beam = ilkit.Beam(10, {0: "pin", 10: "roller"}, units="kN-m")
    train = AxleTrain([100, 100], [0.3], units="kN-m")
    _, b_min = brute_force(beam.shear(0.9), train)
    # both axles left of the section: -100 (0.9 + 0.6) / 10 (simple span shear line, -x/L left of it)
    assert b_min == pytest.approx(-15.0, abs=1e-5)
    assert b_min < -3.0  # the value the search used to give


def _models():
    """Published models and a combination of our own with every kind of part."""
    own = Combination(
        "crane and stock",
        [
            AxleTrain([40, 65, 65], [2.4, (1.2, 3.6)], units="kN-m", name="crane", drop_adverse_axles=True,
                      behind=TrainUniform(6.5, 1.1, breakable=True)),
            UniformBlocks(12.0, [2.5, 2.5], [1.7], units="kN-m", name="stock"),
            KnifeEdge(30.0, units="kN-m", name="post"),
            UniformLoad(3.0, units="kN-m", name="crowd"),
        ],
        dynamic_allowance=0.25,
        dynamic_on=["crane"],
        factor=1.1,
    )
    return [hl93(), lm1(), lm71(dynamic_factor=1.0), sw0(dynamic_factor=1.0), cooper(impact=0), own]


@SETTINGS
@given(data=st.data(), model=st.sampled_from(range(6)))
def test_every_placement_table_sums_to_its_value(data, model):
    line, _, beam = data.draw(typed_lines(continuous=data.draw(st.booleans())))
    chosen = _models()[model]
    found = extremes(line, chosen, beam=beam)
    scale = 1e-12 * max(abs(found.maximum.value), abs(found.minimum.value), 1e-300)
    for e in (found.maximum, found.minimum):
        frame = e.to_frame()
        if frame.empty:  # nothing on the beam: no rows, nothing added
            assert e.value == 0.0
        else:
            column = next(c for c in frame.columns if c.startswith("factored effect"))
            assert float(frame[column].sum()) == pytest.approx(e.value, rel=1e-12, abs=scale)
        assert sum(p.factored for p in e.placements) == pytest.approx(e.value, rel=1e-12, abs=scale)
        for p in e.placements:
            for a in p.axles:  # an axle named on a face carries that face's ordinate
                face = {"left": line.left, "right": line.right, None: line}[a.side]
                assert a.ordinate == pytest.approx(float(face(a.x)), rel=1e-12, abs=1e-12)
