"""Random stable plane trusses for property tests (hypothesis strategies).

A truss built joint by joint, each new joint tied to two earlier joints that
are not in one line with it (a simple truss: rigid, ``M = 2J - 3``), on a
pin and a roller at different ``x`` (stable and determinate); optionally with
extra members (indeterminate, with ``EA``).  Coordinates are small integers
or decimals, typed as engineers type them.
"""

from __future__ import annotations

from fractions import Fraction

from hypothesis import assume
from hypothesis import strategies as st

from ilkit import trusses


def _collinear(p, q, r):
    return (q[0] - p[0]) * (r[1] - p[1]) - (q[1] - p[1]) * (r[0] - p[0]) == 0


def _crosses_joint(a, b, joints):
    for p in joints:
        if p in (a, b):
            continue
        if _collinear(a, b, p) and min(a[0], b[0]) <= p[0] <= max(a[0], b[0]) and min(a[1], b[1]) <= p[1] <= max(
            a[1], b[1]
        ):
            return True
    return False


@st.composite
def simple_trusses(draw, *, extra_members: int = 0, decimals: bool = False):
    """``(truss, layout description)``: a random stable truss (determinate unless ``extra_members``)."""
    def text(v: Fraction) -> object:
        return str(float(v)) if decimals else int(v)

    step = Fraction(1, 4) if decimals else Fraction(1)
    coordinate = st.integers(-24, 48).map(lambda k: k * step) if decimals else st.integers(-6, 12).map(Fraction)
    width = draw(st.integers(1, 12)) * step * (4 if decimals else 1)
    apex = (draw(coordinate), draw(st.integers(1, 8)) * step * (4 if decimals else 1))
    more = draw(st.lists(st.tuples(coordinate, coordinate), min_size=2 if extra_members else 0, max_size=5,
                         unique=True))
    points: list[tuple[Fraction, Fraction]] = [(Fraction(0), Fraction(0)), (width, Fraction(0)), apex]
    points += [p for p in more if p not in points]
    count = len(points)
    texts = [(text(x), text(y)) for x, y in points]
    names = [f"J{k}" for k in range(count)]
    members = [(0, 1), (0, 2), (1, 2)]
    for k in range(3, count):
        i = draw(st.integers(0, k - 1))
        j = draw(st.integers(0, k - 1).filter(lambda v, i=i: v != i))
        assume(not _collinear(points[i], points[j], points[k]))
        members += [(i, k), (j, k)]
    for i, j in members:
        assume(not _crosses_joint(points[i], points[j], points))
    if extra_members:
        free = [(i, j) for i in range(count) for j in range(i + 1, count)
                if (i, j) not in members and (j, i) not in members and not _crosses_joint(points[i], points[j], points)]
        assume(len(free) >= extra_members)
        members += draw(st.lists(st.sampled_from(free), min_size=extra_members, max_size=extra_members, unique=True))
    pin = draw(st.integers(0, count - 1))
    roller = draw(st.integers(0, count - 1).filter(lambda v: v != pin))
    assume(points[pin][0] != points[roller][0])
    by_x: dict[Fraction, int] = {}
    for k, p in enumerate(points):
        by_x.setdefault(p[0], k)
    deck = draw(st.lists(st.sampled_from(sorted(by_x.values())), min_size=2, max_size=len(by_x), unique=True))
    joints = {names[k]: texts[k] for k in range(count)}
    bars = [(names[i], names[j]) for i, j in members]
    ea = None
    if extra_members:
        ea = {f"{a}-{b}": draw(st.sampled_from([1000, 2500, "3e3", 4200.5])) for a, b in bars}
    truss = trusses.Truss(joints, bars, {names[pin]: "pin", names[roller]: "roller"}, [names[k] for k in deck],
                          EA=ea, units="kN-m")
    return truss
