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
    sizes = [len(s) for s in sets]
    total = int(np.prod(sizes)) if sets else 1
    if not sets:
        return np.zeros((1, 0))
    combos = np.array(list(itertools.product(*sets)))
    if total > MAX_COMBINATIONS:  # keep the corners and an even sample
        keep = np.unique(np.linspace(0, total - 1, MAX_COMBINATIONS).astype(int))
        combos = combos[keep]
    return combos


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
            best_max = max(best_max, float((np.asarray(high(xs)) @ loads).max()))
            best_min = min(best_min, float((np.asarray(low(xs)) @ loads).min()))
    return best_max, best_min


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
