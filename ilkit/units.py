"""Consistent unit systems for beams and loads.

A beam may declare ``units="kN-m"`` or ``units="kip-ft"`` (or another system
listed in :data:`SYSTEMS`).  Every number then carries that system: lengths in
its length unit, forces in its force unit, moments in force x length.

Conversion factors use the exact definitions: 1 ft = 0.3048 m (international
foot, 1959), 1 in = 0.0254 m, 1 lbf = 4.4482216152605 N (avoirdupois pound
0.45359237 kg times standard gravity 9.80665 m/s^2), so
1 kip = 4.4482216152605 kN.
"""

from __future__ import annotations

from dataclasses import dataclass
from fractions import Fraction

from ilkit.errors import BeamInputError

__all__ = ["UnitSystem", "SYSTEMS", "unit_system", "conversion"]


@dataclass(frozen=True)
class UnitSystem:
    """A consistent pair of a length unit and a force unit.

    ``metres_per_length`` and ``newtons_per_force`` are exact.
    """

    name: str
    length: str
    force: str
    metres_per_length: Fraction
    newtons_per_force: Fraction

    @property
    def moment(self) -> str:
        """Label of a moment unit, e.g. ``"kN·m"``."""
        return f"{self.force}·{self.length}"

    @property
    def line_load(self) -> str:
        """Label of a load per unit length, e.g. ``"kN/m"``."""
        return f"{self.force}/{self.length}"


_FT = Fraction("0.3048")
_IN = Fraction("0.0254")
_LBF = Fraction("4.4482216152605")

SYSTEMS: dict[str, UnitSystem] = {
    "kN-m": UnitSystem("kN-m", "m", "kN", Fraction(1), Fraction(1000)),
    "N-mm": UnitSystem("N-mm", "mm", "N", Fraction(1, 1000), Fraction(1)),
    "kN-mm": UnitSystem("kN-mm", "mm", "kN", Fraction(1, 1000), Fraction(1000)),
    "kip-ft": UnitSystem("kip-ft", "ft", "kip", _FT, _LBF * 1000),
    "kip-in": UnitSystem("kip-in", "in", "kip", _IN, _LBF * 1000),
    "lb-ft": UnitSystem("lb-ft", "ft", "lb", _FT, _LBF),
}


def unit_system(name: str | UnitSystem | None) -> UnitSystem | None:
    """Look up a unit system by name; ``None`` stays ``None`` (no units declared)."""
    if name is None or isinstance(name, UnitSystem):
        return name
    if isinstance(name, str) and name in SYSTEMS:
        return SYSTEMS[name]
    raise BeamInputError(
        f"units: unknown unit system {name!r}; choose one of {', '.join(repr(k) for k in SYSTEMS)}.",
        field="units",
        value=name,
    )


def conversion(source: UnitSystem, target: UnitSystem) -> tuple[Fraction, Fraction]:
    """Exact factors ``(length, force)`` that turn ``source`` numbers into ``target`` numbers."""
    return (
        source.metres_per_length / target.metres_per_length,
        source.newtons_per_force / target.newtons_per_force,
    )
