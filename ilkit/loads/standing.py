"""A moving load standing at a given position, and its effect on an influence line.

Where critical placement (:mod:`ilkit.loads.placement`) searches for the
worst position, :func:`stand` answers for one position the engineer chooses:
where every axle and every loaded stretch is, the ordinate under each axle,
and the total effect.  Stepping a vehicle along a girder (a table of effects,
or the explorer's slider) is a sequence of such calls.

The position of a load is the position ``at`` of its *front*: the lead axle
of an axle train (the rest trail behind it, against the travel direction),
the leading end of the first block of :class:`UniformBlocks`, the load itself
for a :class:`KnifeEdge`.  Every load on the beam counts as it stands: no
axle is left off, and a uniform part travelling with a train covers its whole
length on the beam (the rules that drop adverse axles or break a uniform load
belong to the search for an extreme, not to a load standing somewhere).

Effects follow the sign conventions of :mod:`ilkit.model`; values are in the
line's unit system.
"""

from __future__ import annotations

import math
from collections.abc import Sequence
from typing import get_args

import numpy as np

from ilkit._check import choice, finite, listed
from ilkit._exact import fmt, is_quantity
from ilkit.errors import LoadInputError, UnitsError
from ilkit.influence import InfluenceLine
from ilkit.loads.primitives import OVERFLOW, AxleTrain, KnifeEdge, UniformBlocks, number
from ilkit.loads.results import AxlePosition, Direction, LoadPlacement, Patch
from ilkit.units import LENGTH, UnitSystem, magnitude_in

__all__ = ["stand", "train_length", "Travelling"]

Travelling = AxleTrain | KnifeEdge | UniformBlocks
"""A load that travels along the beam as a whole (a breakable :class:`UniformLoad` does not)."""

DIRECTIONS: tuple[str, ...] = get_args(Direction)


def stand(
    line: InfluenceLine,
    load: Travelling,
    at: float,
    *,
    direction: Direction = "left to right",
    spacings: Sequence[float] | None = None,
) -> LoadPlacement:
    """The effect on ``line`` of ``load`` standing with its front at ``at``, travelling in ``direction``.

    Parameters
    ----------
    line:
        The influence line (its beam must declare units).
    load:
        An :class:`AxleTrain`, :class:`KnifeEdge` or :class:`UniformBlocks`,
        converted to the line's units.
    at:
        Position of the front of the load (beam length unit, from the left end
        of the beam); any finite value (or a pint length when the beam declares
        units): parts of the load off the beam carry nothing.
    direction:
        ``"left to right"`` (the front is the rightmost axle) or
        ``"right to left"``.
    spacings:
        For an axle train, the distance between each pair of consecutive axles
        (length unit, one fewer than the axles, lead axle first); each must lie
        within the train's spacing or range (to rounding: a value a rounding
        error outside is taken as the bound).  Default: the train's spacings,
        the smallest value where a spacing varies.

    Returns
    -------
    LoadPlacement
        Axles numbered from the lead axle with their positions and ordinates
        (``counted`` False for axles off the beam), the loaded stretches on the
        beam, and ``effect``, the sum of load x ordinate and intensity x area.
    """
    if not isinstance(line, InfluenceLine):
        raise LoadInputError(
            f"stand: expected an InfluenceLine (e.g. beam.moment(12)), got {type(line).__name__}.", field="line"
        )
    _travelling(load, "stand")
    choice(direction, DIRECTIONS, what="stand: direction", field="direction", error=LoadInputError)
    if is_quantity(at):  # a position on the beam, in the beam's length unit
        at = magnitude_in(at, dims=LENGTH, system=line.units, field="stand: position at")
    front = number(at, "stand: position at", minimum=-math.inf, strict=False)
    load = load.converted(units_for(load, line.units, line.quantity.label))
    gaps = _spacings(load, spacings)
    offsets, weights, segments = _layout(load, gaps)
    sign = -1.0 if direction == "left to right" else 1.0  # offsets run behind the front

    with np.errstate(over="ignore", invalid="ignore"):  # an overflow is reported below, as the effect
        xs = front + sign * np.asarray(offsets)
        ordinates = np.asarray(line(xs), dtype=float) if xs.size else np.zeros(0)
        axles = tuple(
            AxlePosition(k + 1, p, float(x), None, float(y), bool(0.0 <= x <= line.length))
            for k, (x, p, y) in enumerate(zip(xs, weights, ordinates))
        )
        patches = []
        for start, end, intensity in segments:
            lo, hi = sorted((front + sign * start, front + sign * end))
            a, b = max(lo, 0.0), min(hi, line.length)
            if b > a:
                patches.append(Patch(a, b, intensity, float(intensity * line.integral(a, b))))
        patches.sort(key=lambda p: p.start)
        effect = float(sum(a.load * a.ordinate for a in axles if a.counted) + sum(p.effect for p in patches))
    what = f"stand: the effect of {load.name} on {line.quantity.label}"
    finite(effect, what=what, why=OVERFLOW, field="load", error=LoadInputError)
    shown = None if isinstance(load, KnifeEdge) else direction
    return LoadPlacement(load.name, effect, 1.0, shown, tuple(gaps), axles, tuple(patches), front, line)


def train_length(load: Travelling, spacings: Sequence[float] | None = None) -> float:
    """Distance from the front of ``load`` to its last axle or the far end of its last block
    (length unit of the load; uniform parts of unlimited length not included)."""
    _travelling(load, "train_length")
    gaps = _spacings(load, spacings)
    offsets, _, segments = _layout(load, gaps)
    ends = [*offsets, *(e for s, e, _ in segments if math.isfinite(e))]
    return float(max(ends, default=0.0))


# -------------------------------------------------------------------- helpers
def _travelling(load: object, what: str) -> None:
    """Refuse anything but a load that travels as one (an axle train, a knife-edge load, blocks)."""
    if isinstance(load, (AxleTrain, KnifeEdge, UniformBlocks)):
        return
    hint = (
        "a breakable uniform load stands where the line has the wanted sign; use ilkit.place(line, load)"
        if type(load).__name__ == "UniformLoad"
        else "for a combination or a load model, stand each travelling part (e.g. model.cases[0].parts)"
    )
    raise LoadInputError(
        f"{what}: {load!r} does not travel as one load; give an AxleTrain, KnifeEdge or UniformBlocks ({hint}).",
        field="load",
        value=load,
    )


def units_for(load: Travelling, system: UnitSystem | None, what: str) -> UnitSystem:
    """The unit system ``load`` is applied in: the beam's ``system``; a beam without one is an error."""
    if system is None:
        raise UnitsError(
            f"{what}: the beam declares no units, so {load.name} (in {load.units.name}) cannot be applied. "
            f"Declare them: Beam(..., units={load.units.name!r}) or units='kN-m'.",
            field="units",
        )
    return system


def _spacings(load: Travelling, spacings: Sequence[float] | None) -> list[float]:
    if not isinstance(load, AxleTrain):
        empty = getattr(spacings, "size", None) == 0 or (isinstance(spacings, (list, tuple)) and not spacings)
        if spacings is not None and not empty:
            raise LoadInputError(
                f"stand: {load.name} has no axle spacings; leave spacings out.", field="spacings", value=spacings
            )
        return []
    ranges = load.spacings
    if spacings is None:
        return [lo for lo, _ in ranges]
    wanted = f"stand: {load.name} has {len(ranges) + 1} axles, so give {len(ranges)} spacings (lead axle first)"
    given = listed(spacings, wanted=wanted, field="spacings", error=LoadInputError)
    if len(given) != len(ranges):
        raise LoadInputError(f"{wanted}; got {spacings!r}.", field="spacings", value=spacings)
    out = []
    for k, (raw, (lo, hi)) in enumerate(zip(given, ranges)):
        value = number(raw, f"stand: spacing {k + 1}", strict=False)
        tol = 1e-9 * max(lo, hi if math.isfinite(hi) else lo)  # relative: spacings of any size
        if not lo - tol <= value <= hi + tol:
            allowed = fmt(lo) if lo == hi else f"{fmt(lo)} to {fmt(hi) if math.isfinite(hi) else 'any length'}"
            raise LoadInputError(
                f"stand: spacing {k + 1} of {load.name} (axle {k + 1} to {k + 2}) must be {allowed}, "
                f"got {fmt(value)}.",
                field="spacings",
                value=raw,
            )
        out.append(min(max(value, lo), hi))  # a spacing within rounding of a bound is that bound
    return out


def _layout(load: Travelling, gaps: list[float]) -> tuple[list[float], list[float], list[tuple[float, float, float]]]:
    """Axle offsets behind the front, their loads, and uniform stretches ``(start, end, intensity)``."""
    if isinstance(load, KnifeEdge):
        return [0.0], [load.load], []
    if isinstance(load, UniformBlocks):
        segments, start = [], 0.0
        for k, length in enumerate(load.lengths):
            segments.append((start, start + length, load.intensity))
            start += length + (load.gaps[k] if k < len(load.gaps) else 0.0)
        return [], [], segments
    offsets = [0.0]
    for gap in gaps:
        offsets.append(offsets[-1] + gap)
    segments = []
    if load.ahead is not None:
        segments.append((-math.inf, -load.ahead.clearance, load.ahead.intensity))
    if load.behind is not None:
        segments.append((offsets[-1] + load.behind.clearance, math.inf, load.behind.intensity))
    return offsets, list(load.loads), segments
