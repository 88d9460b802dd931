"""Consistent unit systems for beams and loads.

A beam may declare ``units="kN-m"`` or ``units="kip-ft"`` (or another system
listed in :data:`SYSTEMS`).  Every number then carries that system: lengths in
its length unit, forces in its force unit, moments in force x length.

Conversion factors use the exact definitions: 1 ft = 0.3048 m (international
foot, 1959), 1 in = 0.0254 m, 1 lbf = 4.4482216152605 N (avoirdupois pound
0.45359237 kg times standard gravity 9.80665 m/s^2), so
1 kip = 4.4482216152605 kN.

Values may also be given as pint quantities (``30 * ureg.ft``) when pint is
installed: :func:`magnitude_in` converts them exactly into the beam's system.
pint itself is never imported here; a quantity is recognised by its
``magnitude`` and ``unit_items()``.  A quantity given to a beam that declares
no unit system is an error that names the fix (``units="kip-ft"`` ...): ilkit
does not guess which system the numbers should live in.
"""

from __future__ import annotations

from dataclasses import dataclass
from fractions import Fraction
from typing import Any, Protocol

from ilkit._exact import is_quantity, to_exact
from ilkit.errors import BeamInputError, UnitsError

__all__ = [
    "UnitSystem",
    "SYSTEMS",
    "unit_system",
    "conversion",
    "is_quantity",
    "magnitude_in",
    "factor_to",
    "LENGTH",
    "FORCE",
    "MOMENT",
    "FLEXURAL_STIFFNESS",
    "LINE_LOAD",
]


class QuantityLike(Protocol):
    """What ilkit needs of a pint quantity: a magnitude and its units."""

    @property
    def magnitude(self) -> Any: ...

    def unit_items(self) -> Any: ...


Dimension = tuple[int, int]
"""Exponents ``(length, force)``: a length is ``(1, 0)``, EI is ``(2, 1)``."""

LENGTH: Dimension = (1, 0)
FORCE: Dimension = (0, 1)
MOMENT: Dimension = (1, 1)
FLEXURAL_STIFFNESS: Dimension = (2, 1)
LINE_LOAD: Dimension = (-1, 1)


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

    def __post_init__(self) -> None:
        for label in ("name", "length", "force"):
            text = getattr(self, label)
            if not isinstance(text, str) or not text.strip():
                raise BeamInputError(
                    f"UnitSystem: {label} must be a non-empty text such as 'm' or 'kN', got {text!r}.",
                    field=f"UnitSystem.{label}",
                    value=text,
                )
        for label, unit in (("metres_per_length", "metres"), ("newtons_per_force", "newtons")):
            factor = to_exact(getattr(self, label), field=f"UnitSystem.{label}")
            if factor <= 0:
                raise BeamInputError(
                    f"UnitSystem: {label} must be greater than 0, got {getattr(self, label)!r}; give how many "
                    f"{unit} one {self.length if unit == 'metres' else self.force} is.",
                    field=f"UnitSystem.{label}",
                    value=getattr(self, label),
                )
            object.__setattr__(self, label, factor)

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
"""The unit systems a beam or a load may declare, by name (``units="kN-m"``): each a
:class:`UnitSystem` with exact factors to metres and newtons."""


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


def _dimension_words(dims: Dimension) -> str:
    names = {LENGTH: "a length", FORCE: "a force", MOMENT: "a moment (force x length)",
             FLEXURAL_STIFFNESS: "a flexural stiffness (force x length²)", LINE_LOAD: "a load per length",
             (0, 0): "a pure number", (-2, 1): "a stress (force / length²)"}
    return names.get(dims, f"length^{dims[0]} x force^{dims[1]}")


def _dimension_unit(dims: Dimension, system: UnitSystem) -> str:
    """A unit text pint understands for ``dims`` in ``system``, e.g. ``"kN * m ** 2"``."""
    parts = []
    force, length = (_PINT_NAMES.get(u, u) for u in (system.force, system.length))
    for unit, power in ((force, dims[1]), (length, dims[0])):
        if power == 1:
            parts.append(unit)
        elif power:
            parts.append(f"{unit} ** {power}")
    return " * ".join(parts) or "dimensionless"


# Exact definitions of the units ilkit converts, by pint's canonical unit name.
_STANDARD_GRAVITY = Fraction("9.80665")  # m/s², by definition (CGPM 1901)
_UNITS: dict[str, tuple[Fraction, int, int]] = {
    # name: (SI factor, length exponent, force exponent); SI = metres and newtons
    "meter": (Fraction(1), 1, 0),
    "foot": (_FT, 1, 0),
    "inch": (_IN, 1, 0),
    "yard": (_FT * 3, 1, 0),
    "mile": (_FT * 5280, 1, 0),
    "newton": (Fraction(1), 0, 1),
    "force_pound": (_LBF, 0, 1),
    "kip": (_LBF * 1000, 0, 1),
    "force_kilogram": (_STANDARD_GRAVITY, 0, 1),
    "force_metric_ton": (_STANDARD_GRAVITY * 1000, 0, 1),
    "pascal": (Fraction(1), -2, 1),
    "pound_force_per_square_inch": (_LBF / _IN**2, -2, 1),
    "kip_per_square_inch": (_LBF * 1000 / _IN**2, -2, 1),
}
_SI_PREFIXES = {"milli": Fraction(1, 1000), "centi": Fraction(1, 100), "kilo": Fraction(1000),
                "mega": Fraction(10**6), "giga": Fraction(10**9)}
_SI_BASES = ("meter", "newton", "pascal")
_PINT_NAMES = {"m": "m", "mm": "mm", "ft": "ft", "in": "inch", "kN": "kN", "N": "N", "kip": "kip", "lb": "lbf"}


def _unit_factor(name: str) -> tuple[Fraction, int, int] | None:
    if name in _UNITS:
        return _UNITS[name]
    for prefix, scale in _SI_PREFIXES.items():
        base = name.removeprefix(prefix)
        if base != name and base in _SI_BASES:
            factor, length, force = _UNITS[base]
            return factor * scale, length, force
    return None


def factor_to(quantity: object, *, dims: Dimension, system: UnitSystem | None, field: str) -> Fraction:
    """Exact factor that turns the magnitude of a pint ``quantity`` into numbers of ``system``.

    ``dims`` is the expected dimension (:data:`LENGTH`, :data:`FORCE` ...).
    Raises :class:`UnitsError` when the beam declares no ``system``, when the
    quantity has another dimension, or when one of its units has no exact
    definition here (the message says how to convert it first).
    """
    if system is None:
        raise UnitsError(
            f"{field}: got the quantity {quantity}, but the beam declares no unit system, so ilkit "
            "cannot tell which units to work in. Say it: Beam(..., units='kN-m') or units='kip-ft' "
            f"(choices: {', '.join(repr(k) for k in SYSTEMS)}); quantities are then converted exactly.",
            field=field,
            value=quantity,
        )
    factor = Fraction(1)
    length = force = 0
    for name, power in quantity.unit_items():  # type: ignore[attr-defined]
        known = _unit_factor(name)
        if known is None or power != int(power):
            target = _dimension_unit(dims, system)
            raise UnitsError(
                f"{field}: no exact conversion for the unit {name!r} of {quantity}; convert it first, "
                f"e.g. value.to({target!r}), or give it in m, mm, cm, km, ft, in, yd, mi, N, kN, MN, "
                "lbf, kip, kgf, Pa, kPa, MPa, GPa, psi or ksi.",
                field=field,
                value=quantity,
            )
        unit_factor, unit_length, unit_force = known
        factor *= unit_factor ** int(power)
        length += unit_length * int(power)
        force += unit_force * int(power)
    if (length, force) != dims:
        raise UnitsError(
            f"{field}: {quantity} is {_dimension_words((length, force))}, but {field} must be "
            f"{_dimension_words(dims)}; give it in {_dimension_unit(dims, system)} or an equivalent unit.",
            field=field,
            value=quantity,
        )
    return factor / (system.metres_per_length ** dims[0] * system.newtons_per_force ** dims[1])


def magnitude_in(value: object, *, dims: Dimension, system: UnitSystem | None, field: str) -> Fraction:
    """``value`` as an exact number in ``system``.

    A plain number (int, fraction, decimal string, float by its decimal text)
    is taken as already being in the beam's units.  A pint quantity is
    converted with the exact factors of this module.
    """
    if is_quantity(value):
        scale = factor_to(value, dims=dims, system=system, field=field)
        return to_exact(value.magnitude, field=field) * scale  # type: ignore[attr-defined]
    return to_exact(value, field=field)
