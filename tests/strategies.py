"""Hypothesis strategies: random stable beams."""

from __future__ import annotations

from fractions import Fraction

from hypothesis import assume
from hypothesis import strategies as st

import ilkit


@st.composite
def determinate_beams(draw, max_parts: int = 4, allow_shear_releases: bool = True):
    """A random stable, statically determinate beam on a rational grid.

    Releases and supports stand on grid points; the count of support
    conditions is chosen so that the beam is determinate, and layouts that
    form a mechanism are rejected.
    """
    parts = draw(st.integers(1, max_parts))
    cells = draw(st.integers(max(2, 2 * parts), 24))
    scale = draw(st.sampled_from([Fraction(1), Fraction(1, 2), Fraction(5, 4), Fraction(3)]))
    interior = list(range(1, cells))
    releases = sorted(draw(st.lists(st.sampled_from(interior), min_size=parts - 1, max_size=parts - 1, unique=True)))
    kinds = [
        draw(st.sampled_from(["hinge", "shear"] if allow_shear_releases else ["hinge"])) for _ in releases
    ]
    hinges = [r for r, k in zip(releases, kinds) if k == "hinge"]
    shears = [r for r, k in zip(releases, kinds) if k == "shear"]
    needed = parts + 1  # 2 per part minus 1 per release
    supports: dict[int, str] = {}
    if draw(st.booleans()):
        supports[0] = "fixed"
        needed -= 2
    if needed >= 2 and draw(st.booleans()):
        supports[cells] = "fixed"
        needed -= 2
    free = [p for p in range(cells + 1) if p not in supports and p not in shears]
    assume(needed >= 0 and len(free) >= needed)
    pins = draw(st.lists(st.sampled_from(free), min_size=needed, max_size=needed, unique=True))
    for p in pins:
        supports[p] = draw(st.sampled_from(["pin", "roller"]))
    try:
        beam = ilkit.Beam(
            length=cells * scale,
            supports={p * scale: k for p, k in supports.items()},
            hinges=[h * scale for h in hinges],
            shear_releases=[s * scale for s in shears],
        )
    except ilkit.UnstableBeamError:
        assume(False)
    assume(beam.is_determinate)
    return beam

