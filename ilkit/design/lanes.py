"""Lanes on a deck: AASHTO design lanes and multiple presence, EN 1991-2 notional lanes.

* :func:`design_lanes`: the number and width of AASHTO LRFD design lanes from
  the clear roadway width (3.6.1.1.1): the integer part of w / 12.0 ft, each
  12.0 ft wide; a roadway from 20 to 24 ft wide has two design lanes, each
  half the roadway.  From memory: check against the licensed edition.
* :func:`multiple_presence_factor`: the multiple presence factor m of
  AASHTO LRFD Table 3.6.1.1.2-1 (1.20, 1.00, 0.85, 0.65) as a
  :class:`~ilkit.design.Factor`; the numbers are those of
  :func:`ilkit.loads.multiple_presence`.
* :func:`notional_lanes`: EN 1991-2 Table 4.1: the number and width of the
  notional lanes and the width of the remaining area from the carriageway
  width.  From memory.

Widths are in the length unit of ``units`` (``"kip-ft"``: ft for AASHTO,
``"kN-m"``: m for EN 1991-2); a pint length is converted exactly.
"""

from __future__ import annotations

import math
from dataclasses import dataclass
from fractions import Fraction

from ilkit._check import whole
from ilkit._exact import fmt
from ilkit.design._inputs import amount
from ilkit.design.factors import Factor
from ilkit.errors import DesignInputError, UnitsError
from ilkit.loads.models import multiple_presence
from ilkit.units import LENGTH, SYSTEMS, UnitSystem, magnitude_in, unit_system

__all__ = [
    "DesignLanes",
    "NotionalLanes",
    "design_lanes",
    "notional_lanes",
    "multiple_presence_factor",
    "AASHTO_LRFD",
    "EN_1991_2",
]

AASHTO_LRFD = "AASHTO LRFD Bridge Design Specifications"
"""The document the AASHTO design functions cite (the licensed current edition governs)."""
EN_1991_2 = "EN 1991-2 (Eurocode 1, traffic loads on bridges)"
"""The document the EN 1991-2 design functions cite (with its National Annex)."""

FT = Fraction("0.3048")
"""Metres per foot (exact)."""


def read_units(units: object, what: str) -> UnitSystem:
    """A unit system by name (``"kip-ft"``, ``"kN-m"`` ...), refused with :class:`~ilkit.DesignInputError`."""
    try:
        system = unit_system(units)  # type: ignore[arg-type]
    except ValueError:
        system = None
    if system is None:
        raise DesignInputError(
            f"{what}: units must be one of {', '.join(repr(k) for k in SYSTEMS)}, got {units!r}.",
            field="units", value=units)
    return system


def read_length(value: object, what: str, system: UnitSystem, *, minimum: float = 0.0, strict: bool = True,
                dims: tuple[int, int] = LENGTH) -> float:
    """A length (or another dimension ``dims``) in ``system``: a plain number is taken in its units, a pint
    quantity is converted exactly; refused with :class:`~ilkit.DesignInputError` (a unit mismatch with
    :class:`~ilkit.UnitsError`)."""
    try:
        exact = magnitude_in(value, dims=dims, system=system, field=what)
    except UnitsError:
        raise
    except ValueError as err:
        raise DesignInputError(str(err), field=what, value=value) from None
    return amount(exact, what, minimum=minimum, strict=strict)


def in_feet(value: float, system: UnitSystem) -> float:
    """A length of ``system`` in feet (exact factor)."""
    return float(Fraction(value) * system.metres_per_length / FT)


@dataclass(frozen=True)
class DesignLanes:
    """AASHTO LRFD design lanes on a roadway (3.6.1.1.1, from memory).

    ``count`` lanes of ``width`` each on a clear roadway ``roadway`` wide
    (length unit of ``units``); ``source`` and ``from_memory`` say where the
    rule comes from; ``note`` says which rule applied.
    """

    count: int
    width: float
    roadway: float
    units: UnitSystem
    note: str
    source: str = f"{AASHTO_LRFD}, 3.6.1.1.1"
    from_memory: bool = True

    def __repr__(self) -> str:
        u = self.units.length
        return (f"DesignLanes({self.count} lane{'s' if self.count > 1 else ''} of {fmt(round(self.width, 9))} {u} "
                f"on a {fmt(round(self.roadway, 9))} {u} roadway)")

    def multiple_presence(self, loaded: int | None = None) -> Factor:
        """The multiple presence factor for ``loaded`` lanes (all of them by default): see
        :func:`multiple_presence_factor` (dimensionless)."""
        n = self.count if loaded is None else whole(loaded, what="multiple_presence: loaded lanes", field="loaded",
                                                     minimum=1, maximum=self.count, error=DesignInputError)
        return multiple_presence_factor(n)


def design_lanes(roadway_width: float, *, units: str = "kip-ft") -> DesignLanes:
    """The AASHTO LRFD design lanes of a clear roadway (3.6.1.1.1, from memory).

    The number of design lanes is the integer part of w / 12.0 ft, each 12.0
    ft wide, w being the clear roadway width between curbs or barriers; a
    roadway from 20 to 24 ft wide has two design lanes, each half the
    roadway.  A roadway narrower than 12 ft carries one lane as wide as the
    roadway (common practice).  ``roadway_width`` is in the length unit of
    ``units`` (ft for ``"kip-ft"``) or a pint length.
    """
    system = read_units(units, "design_lanes")
    w = read_length(roadway_width, "design_lanes: roadway_width", system)
    feet = in_feet(w, system)
    lane = float(12 * FT / system.metres_per_length)
    if 20.0 <= feet <= 24.0:
        return DesignLanes(2, w / 2, w, system, "a roadway from 20 to 24 ft wide: two design lanes, each half of it")
    count = math.floor(feet / 12.0 + 1e-12)
    if count == 0:
        return DesignLanes(1, w, w, system, "a roadway narrower than 12 ft: one lane as wide as the roadway "
                                            "(common practice)")
    return DesignLanes(count, lane, w, system, f"the integer part of {fmt(round(feet, 9))} ft / 12 ft")


def multiple_presence_factor(lanes: int) -> Factor:
    """The AASHTO LRFD multiple presence factor m for ``lanes`` loaded lanes (Table 3.6.1.1.2-1, from memory).

    1.20 for one loaded lane, 1.00 for two, 0.85 for three, 0.65 for more
    (dimensionless; the numbers of :func:`ilkit.loads.multiple_presence`).
    Not applied for fatigue (3.6.1.1.2), and already included in the
    approximate distribution factors of 4.6.2.2
    (:func:`~ilkit.design.aashto_distribution`).
    """
    n = whole(lanes, what="multiple_presence_factor: the number of loaded lanes", field="lanes", minimum=1,
              error=DesignInputError)
    return Factor("multiple presence", multiple_presence(n), "m", source=f"{AASHTO_LRFD}, Table 3.6.1.1.2-1",
                  from_memory=True, note=f"{n} loaded lane{'s' if n > 1 else ''}")


@dataclass(frozen=True)
class NotionalLanes:
    """EN 1991-2 notional lanes on a carriageway (4.2.3, Table 4.1, from memory).

    ``count`` notional lanes of ``width`` each and a remaining area
    ``remaining`` wide on a carriageway ``carriageway`` wide (length unit of
    ``units``).
    """

    count: int
    width: float
    remaining: float
    carriageway: float
    units: UnitSystem
    source: str = f"{EN_1991_2}, 4.2.3, Table 4.1"
    from_memory: bool = True

    def __repr__(self) -> str:
        u = self.units.length
        return (f"NotionalLanes({self.count} lane{'s' if self.count > 1 else ''} of {fmt(round(self.width, 9))} {u}, "
                f"remaining area {fmt(round(self.remaining, 9))} {u}, on a {fmt(round(self.carriageway, 9))} {u} "
                "carriageway)")


def notional_lanes(carriageway_width: float, *, units: str = "kN-m") -> NotionalLanes:
    """The EN 1991-2 notional lanes of a carriageway (4.2.3, Table 4.1, from memory).

    w < 5.4 m: one lane 3 m wide, the remaining area w - 3 m;
    5.4 m <= w < 6 m: two lanes of w / 2, no remaining area;
    w >= 6 m: the integer part of w / 3 lanes of 3 m, the remaining area
    w - 3 m x lanes.  ``carriageway_width`` is in the length unit of
    ``units`` (m for ``"kN-m"``) or a pint length; a carriageway narrower
    than 3 m is refused.
    """
    system = read_units(units, "notional_lanes")
    w = read_length(carriageway_width, "notional_lanes: carriageway_width", system)
    metres = float(Fraction(w) * system.metres_per_length)
    to_units = float(1 / system.metres_per_length)
    if metres < 3.0:
        raise DesignInputError(
            f"notional_lanes: a carriageway of {fmt(round(metres, 9))} m is narrower than one notional lane (3 m); "
            "check the width and its units.", field="carriageway_width", value=carriageway_width)
    if metres < 5.4:
        return NotionalLanes(1, 3.0 * to_units, w - 3.0 * to_units, w, system)
    if metres < 6.0:
        return NotionalLanes(2, w / 2, 0.0, w, system)
    count = math.floor(metres / 3.0 + 1e-12)
    return NotionalLanes(count, 3.0 * to_units, max(w - count * 3.0 * to_units, 0.0), w, system)
