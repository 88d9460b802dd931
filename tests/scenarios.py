"""Example girders of our own shared by the tests."""

from __future__ import annotations

from typing import Any

import ilkit


def built_in_girder(**kwargs: Any) -> ilkit.Beam:
    """A girder built into the abutment wall at x=0 (fixed), with a hinge at 9.6 m, resting on a pier at
    31.2 m and cantilevering 6 m beyond it to 37.2 m, in kN and m; keyword arguments replace or add
    arguments of :class:`ilkit.Beam` (a variant of the same girder).

    Between the hinge and the pier the girder is a simple span of 21.6 m carried by the cantilever from
    the abutment; the 6 m cantilever end lifts the hinge when loaded.  Positions are typed as an engineer
    types them (decimals), so exact answers come from decimal text.
    """
    arguments = {"length": 37.2, "supports": {0: "fixed", 31.2: "roller"}, "hinges": [9.6], "units": "kN-m"}
    return ilkit.Beam(**{**arguments, **kwargs})
