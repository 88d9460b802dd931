"""An independent brute-force placement, for the property tests of ``ilkit.place``.

It shares nothing with the search but the influence line's evaluation
(``line(x)``, ``line.part``): for every combination of spacings from a set
(each bound, a grid inside the range, and every value that puts one axle on
one breakpoint while another stands on another), both travel directions,
every axle on every breakpoint (of the line and of its signed parts) just
left and just right of it (``eps`` away, far more than rounding and far less
than any distance between breakpoints), plus the lead axle on a grid along
the beam, it sums load x ordinate and keeps the extremes.  Adverse axles are
dropped as ``drop_adverse_axles`` says.

The brute force can never beat the exact extremes beyond ``S x eps`` (``S``
the sum of the loads times the steepest slope of the line): every position
it tries is a real placement, shifted by at most ``eps`` from one.
"""

from __future__ import annotations

import itertools

import numpy as np
import pytest

MAX_COMBINATIONS = 400


def breakpoints(line) -> np.ndarray:
    """Knots of the line and of both its signed parts (their zero crossings)."""
    points = set(line.breakpoints)
    for sign in ("positive", "negative"):
        points.update(line.part(sign).breakpoints)
    return np.array(sorted(points))


def spacing_sets(train, knots: np.ndarray, grid: int = 6) -> list[np.ndarray]:
    """Candidate values of each spacing: the fixed value, or the bounds, a grid and the values that put
    an axle on a breakpoint while another stands on another (with the other spacings at their lower bound)."""
    base = np.array([lo for lo, _ in train.spacings])
    offsets = np.concatenate(([0.0], np.cumsum(base)))
    span = knots[-1] - knots[0]
    distances = np.unique(np.abs(knots[:, None] - knots[None, :]).ravel())
    out = []
    for v, (lo, hi) in enumerate(train.spacings):
        if lo == hi:
            out.append(np.array([lo]))
            continue
        top = hi if np.isfinite(hi) else lo + span + 1.0
        values = {lo, top, *np.linspace(lo, top, grid + 2)[1:-1]}
        n = len(offsets)
        for i in range(v + 1):
            for j in range(v + 1, n):
                fixed = offsets[j] - offsets[i] - base[v]  # the distance from axle i to axle j, less this spacing
                g = distances - fixed
                values.update(g[(g >= lo) & (g <= top)].tolist())
        out.append(np.array(sorted(values)))
    return out


def combinations(sets: list[np.ndarray]) -> np.ndarray:
    """Every combination of one value from each set, or an even sample of at most ``MAX_COMBINATIONS`` of
    them (decoded from their rank: the product is never built)."""
    if not sets:
        return np.zeros((1, 0))
    sizes = [len(s) for s in sets]
    total = 1
    for n in sizes:
        total *= n
    if total <= MAX_COMBINATIONS:
        return np.array(list(itertools.product(*sets)))
    ranks = sorted({round(k * (total - 1) / (MAX_COMBINATIONS - 1)) for k in range(MAX_COMBINATIONS)})
    out = np.empty((len(ranks), len(sets)))
    for row, rank in enumerate(ranks):
        for col in range(len(sets) - 1, -1, -1):
            rank, digit = divmod(rank, sizes[col])
            out[row, col] = sets[col][digit]
    return out


def brute_force(line, train, *, eps_rel: float = 1e-8, step_rel: float = 1 / 997) -> tuple[float, float]:
    """Largest and smallest effect of ``train`` (already in the line's units) found by brute force."""
    L = line.length
    eps = eps_rel * L
    knots = breakpoints(line)
    loads = np.asarray(train.loads, dtype=float)
    if train.drop_adverse_axles:
        high, low = line.part("positive"), line.part("negative")
    else:
        high = low = line
    best_max, best_min = 0.0, 0.0  # every load off the beam
    for spacings in combinations(spacing_sets(train, knots)):
        offsets = np.concatenate(([0.0], np.cumsum(spacings)))
        for orientation in (offsets, offsets[-1] - offsets):  # lead axle on the left, or on the right
            # axle i on knot k, just left and just right: the lead position that puts it there
            leads = (knots[:, None] - orientation[None, :]).ravel()
            leads = np.concatenate((leads - eps, leads + eps))
            grid = np.arange(-offsets[-1] - L * step_rel, L + L * step_rel, L * step_rel)
            xs = np.concatenate((leads, grid))[:, None] + orientation[None, :]
            top = np.asarray(high(xs)) @ loads + uniform_parts(line, train, xs, 1)
            bottom = np.asarray(low(xs)) @ loads + uniform_parts(line, train, xs, -1)
            best_max = max(best_max, float(top.max()))
            best_min = min(best_min, float(bottom.min()))
    return best_max, best_min


def uniform_parts(line, train, xs: np.ndarray, sense: int) -> np.ndarray:
    """Effect of the uniform loads travelling ahead of and behind the train, for axles at ``xs`` (one row
    per placement, lead axle first): each covers the line from its clearance on, away from the train
    (only the parts of the wanted sign where it is breakable)."""
    total = np.zeros(xs.shape[0])
    if xs.shape[1] == 0:
        return total
    lead, last = xs[:, 0], xs[:, -1]
    lead_left = lead <= last  # the train travels right to left (its lead axle is its leftmost)
    for extra, at, away in ((train.ahead, lead, -1.0), (train.behind, last, 1.0)):
        if extra is None:
            continue
        h = line.part("positive" if sense > 0 else "negative") if extra.breakable else line
        direction = np.where(lead_left, away, -away)  # which way the uniform load runs from the axle
        edge = at + direction * extra.clearance
        whole = float(h.cumulative(np.inf))
        covered = np.where(direction > 0, whole - h.cumulative(edge), h.cumulative(edge))
        total += extra.intensity * covered
    return total


def lipschitz(line, train) -> float:
    """Sum of the loads times the steepest slope of the line (between its jumps)."""
    xs = np.linspace(0, line.length, 4001)
    slope = max(float(np.abs(line.slope(xs)).max()), float(np.abs(line.slope(xs, side="left")).max()))
    for k in line.breakpoints:  # the slopes at the knots themselves, each side
        slope = max(slope, abs(float(line.slope(k))), abs(float(line.slope(k, side="left"))))
    return float(np.sum(train.loads)) * slope


def effect_scale(line, train) -> float:
    """A size of the effects: sum of the loads times the largest ordinate.

    A line that is zero up to rounding (a moment at a pinned end, from the
    stiffness method) has ordinates of about 1e-16 of those of its beam: its
    size is taken as 1e-6 of the beam's, so that rounding noise is not read
    as a difference.
    """
    xs = np.concatenate((np.linspace(0, line.length, 2001), line.breakpoints))
    ordinate = max(float(np.abs(line(xs)).max()), float(np.abs(line.left(xs)).max()))
    q = line.quantity
    typical = line.length if q.is_moment else 1.0  # a moment ordinate is a length, a force one a ratio
    return float(np.sum(train.loads)) * max(ordinate, 1e-6 * typical)


def check_table(e, line, train) -> None:
    """The placement table of one extreme is what it says (see the module docstring)."""
    scale = effect_scale(line, train)
    frame = e.to_frame()
    column = next(c for c in frame.columns if c.startswith("factored effect"))
    assert float(frame[column].sum()) == pytest.approx(e.value, rel=1e-12, abs=1e-12 * scale)
    (p,) = e.placements
    assert p.factored == pytest.approx(e.value, rel=1e-12, abs=1e-12 * scale)
    big = max(float(np.abs(line(np.linspace(0, line.length, 501))).max()), 1e-300)
    for a in p.axles:
        expected = {"left": line.left, "right": line.right, None: line}[a.side](a.x)
        assert a.ordinate == pytest.approx(float(expected), rel=1e-12, abs=1e-12 * big)
        if a.side:  # a face is named only where the line jumps
            assert line.left(a.x) != line.right(a.x)
        assert a.effect == (a.load * a.ordinate if a.counted else 0.0)
    assert p.effect == pytest.approx(
        sum(a.effect for a in p.axles) + sum(q.effect for q in p.patches), rel=1e-12, abs=1e-12 * scale
    )
    xs = [a.x for a in p.axles]
    for k, ((lo, hi), s) in enumerate(zip(train.spacings, p.spacings)):
        assert lo <= s <= hi
        assert abs(xs[k + 1] - xs[k]) == pytest.approx(s, rel=1e-9, abs=1e-9 * line.length)
    if not train.is_variable:  # one rigid train moves as one: every named face is the same
        assert len({a.side for a in p.axles if a.side}) <= 1
