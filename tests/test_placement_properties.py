"""Exact placement against brute force (dense stepping of every train in both directions).

The brute force here is independent of the placement search: it steps the
lead axle along the beam with a step ``h`` that is not aligned with anything,
for both travel directions (and every spacing of a grid where a spacing
varies), evaluates the sum of load x ordinate, and keeps the extremes.

Tolerance from the step: the exact extreme is a value (or a one-sided limit)
of the effect at some position; the nearest grid point on the right side of
it lies within ``h``, and the effect is Lipschitz with constant
``S = sum |P| x max |slope of the line|`` between jumps.  Random beams
(tests/strategies.py), sections and train spacings live on a 0.25 lattice,
so jumps are at least 0.25 apart in the train position and the grid point is
reached without crossing one: ``exact - brute <= S h``.  Where a spacing varies
it is stepped on a grid of ``k = 0.125``: the extreme may need two axles each
just beside a jump, a spacing just short of a grid value, so the bound is
``S (h + k)`` there.  The brute force can never beat the exact
value: ``brute <= exact`` (to rounding).
"""

from __future__ import annotations

import itertools
import math

import numpy as np
import pytest
from closed_forms import moment as cmoment
from closed_forms import reaction as creaction
from closed_forms import shear as cshear
from continuous_strategies import elastic_beams
from hypothesis import HealthCheck, assume, given, settings
from hypothesis import strategies as st
from profiles import examples
from strategies import determinate_beams

import ilkit
from ilkit.loads import AxleTrain, TrainUniform, UniformBlocks, extremes

STEP = 0.0173  # brute-force step, deliberately not a divisor of the 0.5 lattice
SETTINGS = settings(max_examples=examples(60), deadline=None, suppress_health_check=[HealthCheck.too_slow])


# ------------------------------------------------------------------ strategies
half = st.integers(min_value=1, max_value=24).map(lambda k: k / 2)  # 0.5 .. 12 on the lattice


@st.composite
def beam_lines(draw):
    beam = draw(determinate_beams()).replace(units="kN-m")
    kind = draw(st.sampled_from(["moment", "shear", "reaction"]))
    if kind == "reaction":
        return beam.reaction(draw(st.sampled_from([s.at for s in beam.supports])))
    at = draw(st.integers(min_value=0, max_value=int(2 * beam.length))) / 2
    side = draw(st.sampled_from(["left", "right"]))
    interior_support = 0 < at < beam.length and any(s.at == at for s in beam.supports)
    return getattr(beam, kind)(at, side=side if interior_support else None)


@st.composite
def continuous_lines(draw):
    """Closed-form lines of two equal continuous spans (cubic pieces), see tests/closed_forms.py."""
    L = draw(st.integers(min_value=6, max_value=30))
    kind = draw(st.sampled_from(["moment", "shear", "reaction"]))
    if kind == "reaction":
        return creaction(L, draw(st.sampled_from("ABC")), units="kN-m")
    a = draw(st.integers(min_value=1, max_value=4 * L - 1)) / 2
    assume(a != L)
    return (cmoment if kind == "moment" else cshear)(L, a, units="kN-m")


@st.composite
def continuous_beam_lines(draw):
    """Lines of random continuous beams from the stiffness solver (cubic pieces; springs, hinges, varying EI)."""
    beam = draw(elastic_beams(max_spans=3)).replace(units="kN-m")
    kind = draw(st.sampled_from(["moment", "shear", "reaction"]))
    if kind == "reaction":
        rigid = [s.at for s in beam.supports if s.spring is None]
        assume(rigid)
        return beam.reaction(draw(st.sampled_from(rigid)))
    at = draw(st.integers(min_value=1, max_value=int(4 * beam.length) - 1)) / 4  # on the 0.25 lattice
    on_support = any(s.at == at for s in beam.supports)
    side = draw(st.sampled_from(["left", "right"])) if on_support else None
    return getattr(beam, kind)(at, side=side)


@st.composite
def trains(draw, ranges=True):
    n = draw(st.integers(min_value=1, max_value=5))
    loads = draw(st.lists(st.floats(min_value=1, max_value=50), min_size=n, max_size=n))
    spacings: list = draw(st.lists(half, min_size=n - 1, max_size=n - 1))
    if ranges and n > 1 and draw(st.booleans()):
        k = draw(st.integers(min_value=0, max_value=n - 2))
        extra = draw(st.integers(min_value=1, max_value=12)) / 2
        spacings[k] = (spacings[k], spacings[k] + extra)
    drop = draw(st.booleans())
    return AxleTrain(loads, spacings, units="kN-m", drop_adverse_axles=drop)


# ----------------------------------------------------------------- brute force
SPACING_STEP = 0.125


def spacing_grid(train, step=SPACING_STEP):
    """Every combination of spacings on a grid where they vary (0.125: the lattice's vertices are on it)."""
    axes = [np.arange(lo, hi + 1e-9, step) if hi > lo else np.array([lo]) for lo, hi in train.spacings]
    return [np.array(c) for c in itertools.product(*axes)] if axes else [np.zeros(0)]


def brute_force(line, train, step=STEP, spacing_step=SPACING_STEP):
    L = line.length
    best_max, best_min = -np.inf, np.inf
    pos = line.part("positive")
    neg = line.part("negative")
    for spacings in spacing_grid(train, spacing_step):
        offsets = np.concatenate(([0.0], np.cumsum(spacings)))
        length = offsets[-1]
        for orientation in (offsets, length - offsets):  # lead axle left, or lead axle right
            lead = np.arange(-length - 1.0, L + 1.0, step)
            xs = lead[:, None] + orientation[None, :]
            loads = np.asarray(train.loads)
            if train.drop_adverse_axles:
                e_max, e_min = pos(xs) @ loads, neg(xs) @ loads
            else:
                e_max = e_min = line(xs) @ loads
            best_max = max(best_max, float(e_max.max()))
            best_min = min(best_min, float(e_min.min()))
    return best_max, best_min


def lipschitz(line, train):
    xs = np.linspace(0, line.length, 4001)
    slope = max(float(np.abs(line.slope(xs)).max()), float(np.abs(line.slope(xs, side="left")).max()))
    return sum(train.loads) * slope


def check_against_brute_force(line, train):
    exact = extremes(line, train)
    b_max, b_min = brute_force(line, train)
    scale = sum(train.loads) * max(1.0, float(np.abs(line(np.linspace(0, line.length, 401))).max()))
    # a varying spacing is stepped on a grid too: the exact extreme may need a spacing just short of a
    # grid value (two axles each just beside a jump), reached within one spacing step of the grid
    varies = any(hi > lo for lo, hi in train.spacings)
    tol = lipschitz(line, train) * (STEP + (SPACING_STEP if varies else 0.0)) + 1e-9 * scale
    # brute force never beats the exact extreme
    assert b_max <= exact.maximum.value + 1e-9 * scale
    assert b_min >= exact.minimum.value - 1e-9 * scale
    # and comes within the step's reach of it
    assert exact.maximum.value - b_max <= tol
    assert b_min - exact.minimum.value <= tol
    return exact


# --------------------------------------------------------------------- tests
@SETTINGS
@given(line=beam_lines(), train=trains())
def test_exact_placement_matches_brute_force_on_random_determinate_beams(line, train):
    exact = check_against_brute_force(line, train)
    # the reported placement adds up to the reported value
    for e in (exact.maximum, exact.minimum):
        (p,) = e.placements
        assert sum(a.effect for a in p.axles) == pytest.approx(e.value, abs=1e-9 * max(1.0, abs(e.value)))


@SETTINGS
@given(line=continuous_lines(), train=trains(ranges=False))
def test_exact_placement_matches_brute_force_on_curved_lines(line, train):
    check_against_brute_force(line, train)


@SETTINGS
@given(line=continuous_lines(), train=trains(ranges=True))
def test_variable_spacing_on_curved_lines(line, train):
    check_against_brute_force(line, train)


@SETTINGS
@given(line=continuous_beam_lines(), train=trains(ranges=True))
def test_exact_placement_matches_brute_force_on_random_continuous_beams(line, train):
    check_against_brute_force(line, train)


@SETTINGS
@given(line=st.one_of(beam_lines(), continuous_lines()), loads=st.lists(st.floats(1, 40), min_size=2, max_size=3))
def test_two_trucks_with_an_open_ended_gap(line, loads):
    # two identical groups at least 3 apart, any farther: the brute force steps the gap up to the
    # beam length (beyond it the second group is off the beam whichever the position)
    n = len(loads)
    train = AxleTrain(loads + loads, [1.5] * (n - 1) + [(3.0, math.inf)] + [1.5] * (n - 1), units="kN-m")
    exact = extremes(line, train)
    length = line.length
    stepped = AxleTrain(loads + loads, [1.5] * (n - 1) + [(3.0, 3.0 + length + 2)] + [1.5] * (n - 1), units="kN-m")
    b_max, b_min = brute_force(line, stepped, spacing_step=0.25)
    tol = lipschitz(line, train) * (STEP + 0.25) + 1e-9 * max(1.0, abs(b_max), abs(b_min))
    assert b_max <= exact.maximum.value + 1e-9 * max(1.0, abs(b_max))
    assert b_min >= exact.minimum.value - 1e-9 * max(1.0, abs(b_min))
    assert exact.maximum.value - b_max <= tol and b_min - exact.minimum.value <= tol


def test_brute_force_check_can_fail():
    # the check is not vacuous: a placement that ignores the second direction is caught
    beam = ilkit.Beam(20, {0: "pin", 20: "roller"}, units="kN-m")
    train = AxleTrain([5, 40], [6], units="kN-m")
    line = beam.moment(4)
    exact = extremes(line, train).maximum.value
    b_max, _ = brute_force(line, train)
    one_way = max(
        float((line(np.arange(-7, 21, STEP)[:, None] + np.array([0.0, 6.0])[None, :]) @ np.array([5.0, 40.0])).max()),
        0.0,
    )
    assert b_max == pytest.approx(exact, abs=lipschitz(line, train) * STEP)
    assert one_way < exact - 1.0


# ----------------------------------------------- uniform loads travelling with a train
def brute_force_with_uniforms(line, group_xs, loads, segments, sense_lines, step=STEP / 2):
    """Effect of point loads plus uniform segments (start, end, q, breakable) for every lead position."""
    best_max, best_min = -np.inf, np.inf
    L = line.length
    lead = np.arange(-80.0, L + 80.0, step)
    for sense, clipped in sense_lines:
        total = line(lead[:, None] + group_xs[None, :]) @ loads if loads.size else np.zeros_like(lead)
        for start, end, q, breakable in segments:
            h = clipped if breakable else line
            total = total + q * (h.cumulative(lead + end) - h.cumulative(lead + start))
        if sense > 0:
            best_max = float(total.max())
        else:
            best_min = float(total.min())
    return best_max, best_min


@SETTINGS
@given(
    line=st.one_of(beam_lines(), continuous_lines()),
    q=st.floats(min_value=1, max_value=40),
    clearance=st.sampled_from([0.0, 0.5, 1.5]),
    breakable=st.booleans(),
)
def test_train_with_uniform_loads_ahead_and_behind(line, q, clearance, breakable):
    train = AxleTrain(
        [30, 30],
        [2.0],
        units="kN-m",
        ahead=TrainUniform(q, clearance, breakable),
        behind=TrainUniform(q, clearance, breakable),
    )
    exact = extremes(line, train)
    got = []
    for orientation in (1, -1):  # symmetric train: one orientation is enough, both are run anyway
        segments = [(-math.inf, -clearance, q, breakable), (2.0 + clearance, math.inf, q, breakable)]
        got.append(
            brute_force_with_uniforms(
                line,
                np.array([0.0, 2.0]) * orientation,
                np.array([30.0, 30.0]),
                segments if orientation == 1 else [(-e, -s, q, b) for s, e, q, b in segments],
                [(1, line.part("positive")), (-1, line.part("negative"))],
            )
        )
    b_max = max(g[0] for g in got)
    b_min = min(g[1] for g in got)
    xs = np.linspace(0, line.length, 4001)
    slope = float(np.abs(line.slope(xs)).max())
    ordinate = float(np.abs(line(xs)).max())
    tol = (60 * slope + 2 * q * ordinate) * STEP / 2 + 1e-9 * (60 + q * line.length) * max(1, ordinate)
    assert b_max <= exact.maximum.value + 1e-9 * (60 + q * line.length) * max(1, ordinate)
    assert b_min >= exact.minimum.value - 1e-9 * (60 + q * line.length) * max(1, ordinate)
    assert exact.maximum.value - b_max <= tol
    assert b_min - exact.minimum.value <= tol


@SETTINGS
@given(
    line=st.one_of(beam_lines(), continuous_lines()),
    lengths=st.lists(half, min_size=1, max_size=3),
    gap=half,
)
def test_unbreakable_blocks(line, lengths, gap):
    gaps = [gap] * (len(lengths) - 1)
    blocks = UniformBlocks(10.0, lengths, gaps, units="kN-m")
    exact = extremes(line, blocks)
    starts = np.concatenate(([0.0], np.cumsum([a + g for a, g in zip(lengths[:-1], gaps)])))
    segments = [(s, s + a, 10.0, False) for s, a in zip(starts, lengths)]
    total = starts[-1] + lengths[-1]
    mirrored = [(total - e, total - s, q, b) for s, e, q, b in segments]
    got = [
        brute_force_with_uniforms(line, np.zeros(0), np.zeros(0), segs, [(1, line), (-1, line)])
        for segs in (segments, mirrored)
    ]
    b_max, b_min = max(g[0] for g in got), min(g[1] for g in got)
    xs = np.linspace(0, line.length, 4001)
    ordinate = float(np.abs(line(xs)).max())
    tol = 2 * len(lengths) * 10.0 * ordinate * STEP / 2 + 1e-9 * 10 * total * max(1, ordinate)
    assert b_max <= exact.maximum.value + 1e-9 * 10 * total * max(1, ordinate)
    assert exact.maximum.value - b_max <= tol
    assert b_min - exact.minimum.value <= tol
