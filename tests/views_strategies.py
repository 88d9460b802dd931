"""Hypothesis strategies of the views tests: influence lines of random determinate beams."""

from __future__ import annotations

from fractions import Fraction

from hypothesis import assume
from hypothesis import strategies as st
from strategies import determinate_beams

import ilkit


@st.composite
def determinate_lines(draw: st.DrawFn) -> ilkit.InfluenceLine:
    """An influence line of a random quantity of a random determinate beam, with or without units."""
    beam = draw(determinate_beams()).replace(units=draw(st.sampled_from([None, "kN-m", "kip-ft"])))
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
