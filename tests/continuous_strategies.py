"""Hypothesis strategies: random stable beams with stiffness, continuity, hinges and springs."""

from __future__ import annotations

from fractions import Fraction

from hypothesis import assume
from hypothesis import strategies as st

import ilkit

EI_VALUES = [Fraction(1), Fraction(3, 2), Fraction(2), Fraction(5, 2), Fraction(4)]


@st.composite
def elastic_beams(
    draw,
    *,
    max_spans: int = 4,
    springs: bool = True,
    hinges: bool = True,
    min_degree: int = 1,
    varying_ei: bool = True,
):
    """A random stable beam with EI on a rational grid.

    Spans of 2 to 8 cells, optional overhangs, fixed or pinned ends, optional
    hinges, elastic supports (vertical and rotational springs with stiffness
    of the order of the beam's) and piecewise-constant EI.  Beams with a
    degree of indeterminacy below ``min_degree`` are rejected.
    """
    nspans = draw(st.integers(1, max_spans))
    spans = [draw(st.integers(2, 8)) for _ in range(nspans)]
    left = draw(st.sampled_from([0, 0, 1, 2]))
    right = draw(st.sampled_from([0, 0, 1, 3]))
    scale = draw(st.sampled_from([Fraction(1), Fraction(1, 2), Fraction(5, 4), Fraction(3)]))
    cells = left + sum(spans) + right
    bearing = [left]
    for s in spans:
        bearing.append(bearing[-1] + s)
    ei_base = draw(st.sampled_from(EI_VALUES))
    supports: dict[Fraction, object] = {}
    for _i, p in enumerate(bearing):
        at_end = p in (0, cells)
        choices = ["pin", "roller"] + (["fixed"] if at_end else [])
        if springs:
            choices += ["vertical spring", "rotational spring"]
        kind = draw(st.sampled_from(choices))
        if kind == "vertical spring":
            k = draw(st.sampled_from([Fraction(1, 10), Fraction(1), Fraction(20)])) * ei_base / scale**3
            supports[p * scale] = ilkit.Spring(vertical=k)
        elif kind == "rotational spring":
            k = draw(st.sampled_from([Fraction(1, 2), Fraction(3), Fraction(50)])) * ei_base / scale
            supports[p * scale] = ilkit.Spring(rotational=k)
        else:
            supports[p * scale] = kind
    hinge_list: list[Fraction] = []
    if hinges:
        free = [c for c in range(1, cells) if c not in bearing]
        if free:
            hinge_list = draw(st.lists(st.sampled_from(free), max_size=2, unique=True))
    ranges = None
    if varying_ei:
        cuts = draw(st.lists(st.integers(1, cells - 1), max_size=3, unique=True))
        bounds = [0, *sorted(cuts), cells]
        ranges = [(a * scale, b * scale, draw(st.sampled_from(EI_VALUES))) for a, b in zip(bounds[:-1], bounds[1:])]
    try:
        beam = ilkit.Beam(
            length=cells * scale,
            supports=supports,
            hinges=[h * scale for h in hinge_list],
            EI=ranges if ranges is not None else ei_base,
        )
    except ilkit.UnstableBeamError:
        assume(False)
    assume(beam.degree >= min_degree)
    return beam


def positions(beam, *, avoid=()):
    """Strategy: a load or section position strictly inside the beam, on a grid of 1/24, not in ``avoid``."""
    avoid_set = set(avoid)
    grid = [Fraction(k, 24) for k in range(1, int(beam.length * 24))]
    return st.sampled_from([p for p in grid if p not in avoid_set])
