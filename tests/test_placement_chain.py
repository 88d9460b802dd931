"""Trains with varying spacings and very long trains: two independent chain searches agree, the work stays
bounded, and a search too large is refused before it starts.

The pattern search (every gap held at a bound or left free, ``3^k``
patterns) and the dynamic programme over group positions
(ilkit/loads/_chain.py) share only the evaluation of a group's effect; they
must find the same extremes on random lines and trains.  Trains with more
varying spacings than the patterns take are checked against the brute force
of tests/brute_force.py.
"""

from __future__ import annotations

import math

import pytest
from brute_force import brute_force, check_table, effect_scale, lipschitz
from continuous_strategies import elastic_beams
from hypothesis import HealthCheck, assume, given, settings
from hypothesis import strategies as st
from profiles import examples
from strategies import determinate_beams

import ilkit
from ilkit.loads import AxleTrain, TrainUniform, _search, extremes
from ilkit.loads._chain import best_by_programme
from ilkit.loads.placement import WORK_LIMIT, _layouts, _Study

SETTINGS = settings(max_examples=examples(60), deadline=None, suppress_health_check=list(HealthCheck))


@st.composite
def lines(draw):
    continuous = draw(st.booleans())
    beam = draw(elastic_beams(max_spans=3) if continuous else determinate_beams(max_parts=3)).replace(units="kN-m")
    kind = draw(st.sampled_from(["shear", "moment", "reaction"]))
    if kind == "reaction":
        rigid = [s.at for s in beam.supports if s.spring is None]
        assume(rigid)
        return beam.reaction(draw(st.sampled_from(rigid)))
    at = draw(st.integers(0, int(4 * beam.length))) / 4
    try:
        return getattr(beam, kind)(at)
    except ilkit.SideRequiredError:
        return getattr(beam, kind)(at, side=draw(st.sampled_from(["left", "right"])))


@st.composite
def trains(draw, least: int = 1, most: int = 3):
    """Trains with ``least`` to ``most`` varying spacings (some without upper bound), maybe a uniform load
    travelling behind."""
    varying = draw(st.integers(least, most))
    n = varying + 1 + draw(st.integers(0, 2))
    loads = draw(st.lists(st.integers(1, 80).map(lambda k: k / 4), min_size=n, max_size=n))
    spacings: list = [draw(st.integers(1, 40)) / 10 for _ in range(n - 1)]
    for k in draw(st.lists(st.integers(0, n - 2), min_size=varying, max_size=varying, unique=True)):
        extra = draw(st.one_of(st.integers(1, 60).map(lambda v: v / 10), st.just(math.inf)))
        spacings[k] = (spacings[k], spacings[k] + extra)
    behind = TrainUniform(draw(st.integers(1, 20)) / 4, 0.5, draw(st.booleans())) if draw(st.booleans()) else None
    return AxleTrain(loads, spacings, units="kN-m", drop_adverse_axles=draw(st.booleans()), behind=behind)


@SETTINGS
@given(line=lines(), train=trains())
def test_the_programme_agrees_with_the_patterns(line, train):
    study = _Study.of((line,), (1, -1), train, None)  # row 0: the largest effect, row 1: the smallest
    drop = train.drop_adverse_axles
    scale = effect_scale(line, train)
    lines = study.lines_for(drop)
    find = study.finder(drop)
    for _, chain in _layouts(train):
        cut = _search.split(chain, line.length)
        for index in range(len(cut.parts)):
            part = cut.part(index)
            by_patterns = _search.best_in_chain(part, find, study.sense, study.tol)
            for row, sense in enumerate((1, -1)):
                by_programme = best_by_programme(part, lines.row(row), sense)
                assert by_programme.value == pytest.approx(by_patterns.value[row], rel=1e-9, abs=1e-9 * scale)


@settings(SETTINGS, max_examples=examples(25))
@given(line=lines(), train=trains(least=3, most=5))
def test_many_varying_spacings_are_never_beaten(line, train):
    # more varying spacings than the patterns take: the programme runs, checked against the brute force
    found = extremes(line, train)
    b_max, b_min = brute_force(line, train)
    tol = 2 * lipschitz(line, train) * 1e-8 * line.length + 1e-9 * effect_scale(line, train)
    assert b_max <= found.maximum.value + tol
    assert b_min >= found.minimum.value - tol
    for e in (found.maximum, found.minimum):
        check_table(e, line, train)


def test_twelve_varying_spacings_take_the_programme():
    # three-axle trucks of our own in a convoy, 3 to 9 m between trucks: 12 varying spacings
    # (3^12 = 531441 patterns of held and free gaps)
    beam = ilkit.Beam(120, {0: "pin", 50: "roller", 120: "roller"}, EI=1, units="kN-m")
    convoy = AxleTrain(
        [10.0, 20.0, 20.0] * 13, [1.5, 2.0, (3.0, 9.0)] * 12 + [1.5, 2.0], units="kN-m", drop_adverse_axles=True
    )
    line = beam.moment(33.3)
    study = _Study.of((line,), (1,), convoy, None)
    chain = _layouts(convoy)[0][1]
    plan = _search.cost(chain, study.lines_for(True))
    assert not plan.patterns and plan.variable == 12 and plan.work < WORK_LIMIT / 10
    found = extremes(line, convoy)
    b_max, b_min = brute_force(line, convoy)
    tol = 2 * lipschitz(line, convoy) * 1e-8 * line.length + 1e-9 * effect_scale(line, convoy)
    assert b_max <= found.maximum.value + tol and b_min >= found.minimum.value - tol
    check_table(found.maximum, line, convoy)


def test_a_placement_too_large_is_refused_with_its_numbers():
    beam = ilkit.Beam(120, {0: "pin", 120: "roller"}, units="kN-m")
    dense = AxleTrain([1.0] * 6000, [0.01] * 5999, units="kN-m", name="dense train")
    with pytest.raises(ilkit.PlacementTooLargeError) as info:
        extremes(beam.moment(33.3), dense)
    err = info.value
    assert isinstance(err, ilkit.LoadInputError) and isinstance(err, ilkit.IlkitError)
    assert err.axles == 6000 and err.on_beam == 6000 and err.variable == 0
    assert err.work > err.limit == WORK_LIMIT
    assert "dense train" in str(err) and "6000 axles" in str(err) and "WORK_LIMIT" in str(err)


def test_a_long_train_is_the_train_that_covers_the_beam():
    # 2000 axles 1.1 m apart on a 60 m span: no more than 55 stand on it at once, so a train of 100 of
    # them reaches every placement the long one does (and the search keeps to the axles on the beam)
    beam = ilkit.Beam(60, {0: "pin", 60: "roller"}, units="kN-m")
    for line in (beam.moment(21.3), beam.shear(17.7), beam.reaction(0)):
        long = extremes(line, AxleTrain([50.0] * 2000, [1.1] * 1999, units="kN-m"))
        short = extremes(line, AxleTrain([50.0] * 100, [1.1] * 99, units="kN-m"))
        assert long.maximum.value == pytest.approx(short.maximum.value, rel=1e-12)
        assert long.minimum.value == pytest.approx(short.minimum.value, rel=1e-12)
