"""Hypothesis strategies shared by the views tests: random stable determinate beams."""

from __future__ import annotations

from fractions import Fraction

from hypothesis import assume
from hypothesis import strategies as st

import ilkit


@st.composite
def determinate_beams(draw: st.DrawFn) -> ilkit.Beam:
    """A stable, statically determinate beam with hinges and shear releases.

    Positions lie on a half-unit grid.  The support count makes the number of
    restraints equal to the number of rigid-body freedoms (2 per part, less 1
    per release); configurations that still move as a mechanism are rejected.
    """
    half_units = draw(st.integers(8, 80))
    length = Fraction(half_units, 2)
    grid = [Fraction(i, 2) for i in range(half_units + 1)]
    interior = grid[1:-1]
    n_releases = draw(st.sampled_from([0, 1, 1, 2, 2, 3, 3]))
    releases = draw(st.lists(st.sampled_from(interior), min_size=n_releases, max_size=n_releases, unique=True))
    kinds = draw(st.lists(st.sampled_from(["hinge", "shear release"]), min_size=n_releases, max_size=n_releases))
    hinges = [p for p, k in zip(releases, kinds) if k == "hinge"]
    shear = [p for p, k in zip(releases, kinds) if k == "shear release"]
    supports: dict[Fraction, str] = {}
    if draw(st.booleans()):
        # a chain: the first part carried on its own, every further part on one more support
        cuts = [Fraction(0), *sorted(releases), length]
        if draw(st.booleans()):
            supports[Fraction(0)] = "fixed"
        else:
            first = [p for p in grid if p <= cuts[1] and p not in releases]
            assume(len(first) >= 2)
            for p in draw(st.lists(st.sampled_from(first), min_size=2, max_size=2, unique=True)):
                supports[p] = draw(st.sampled_from(["pin", "roller"]))
        for a, b in zip(cuts[1:-1], cuts[2:]):
            inside = [p for p in grid if a < p <= b and p not in releases]
            assume(inside)
            supports[draw(st.sampled_from(inside))] = draw(st.sampled_from(["pin", "roller"]))
    else:
        # anywhere: as many restraints as freedoms, mechanisms rejected below
        needed = 2 + n_releases
        if draw(st.booleans()):
            end = draw(st.sampled_from([Fraction(0), length]))
            supports[end] = "fixed"
            needed -= 2
        free = [p for p in grid if p not in supports and p not in releases]
        for p in draw(st.lists(st.sampled_from(free), min_size=needed, max_size=needed, unique=True)):
            supports[p] = draw(st.sampled_from(["pin", "roller"]))
    assume(supports)
    units = draw(st.sampled_from([None, "kN-m", "kip-ft"]))
    try:
        beam = ilkit.Beam(length, supports, hinges=hinges, shear_releases=shear, units=units)
    except ilkit.UnstableBeamError:
        assume(False)
        raise  # unreachable: assume(False) stops the example
    assert beam.degree == 0
    return beam


@st.composite
def determinate_lines(draw: st.DrawFn) -> ilkit.InfluenceLine:
    """An influence line of a random quantity of a random determinate beam."""
    beam = draw(determinate_beams())
    grid = [Fraction(i, 4) for i in range(int(beam.length * 4) + 1)]
    choice = draw(st.sampled_from(["reaction", "moment_reaction", "shear", "moment", "hinge_shear"]))
    if choice == "reaction":
        return beam.reaction(draw(st.sampled_from(beam.supports)).at)
    if choice == "moment_reaction":
        fixed = [s.at for s in beam.supports if s.restrains_rotation]
        assume(fixed)
        return beam.moment_reaction(fixed[0])
    if choice == "hinge_shear":
        assume(beam.hinges)
        at = draw(st.sampled_from(beam.hinges))
        side = draw(st.sampled_from(["left", "right"])) if any(s.at == at for s in beam.supports) else None
        return beam.hinge_shear(at, side=side)
    at = draw(st.sampled_from(grid))
    try:
        return getattr(beam, choice)(at)
    except ilkit.SideRequiredError:
        return getattr(beam, choice)(at, side=draw(st.sampled_from(["left", "right"])))
