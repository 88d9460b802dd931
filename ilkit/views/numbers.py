"""Numbers and units as an engineer reads them: one place for every view.

Plots, tables, notebook displays, calculation sheets and the explorer all
write numbers through this module, so a quantity reads the same everywhere:

* rounding noise is judged against the size the quantity has on this beam
  (:func:`line_scale`: 1 for a force per unit force, the beam length for a
  moment per unit force, ``L³/EI`` for a deflection ...; :func:`effect_scale`
  for the effect of a load), never against a column that may be all noise;
  it is shown as ``0``, and ``-0`` never appears (:func:`clean`);
* deflection and rotation lines are shown in readable units: mm (or in) and
  mrad per unit force instead of m (or ft) and rad (:func:`ordinate_unit`);
* the area of a line has the unit it has when multiplied by a uniform load
  (``m`` for a reaction line, ``m²`` for a moment line; :func:`area_unit`);
* very large and very small numbers in engineering notation
  (``24 × 10⁶ kN·m²``; :func:`engineering`).

Only what is shown changes: the core keeps its numbers and units.
"""

from __future__ import annotations

import math
from typing import TYPE_CHECKING, Any

if TYPE_CHECKING:  # pragma: no cover
    from ilkit.influence import InfluenceLine
    from ilkit.loads.results import Extreme, LoadPlacement
    from ilkit.quantity import Quantity
    from ilkit.units import UnitSystem

__all__ = [
    "NOISE",
    "clean",
    "short",
    "engineering",
    "line_scale",
    "effect_scale",
    "ordinate_unit",
    "effect_display",
    "area_unit",
]

NOISE = 1e-10
"""A value smaller than this fraction of its quantity's scale is rounding noise, shown as 0."""

_SMALLER = {"m": ("mm", 1000), "ft": ("in", 12)}
"""Deflections are shown in the smaller length unit of the system (the larger one gives 1e-5 and the like)."""


def clean(value: float, scale: float) -> float:
    """``value``, or ``0.0`` when it is rounding noise against ``scale`` (``-0.0`` becomes ``0.0`` too)."""
    value = float(value)
    if math.isnan(value) or not math.isfinite(scale):
        return value
    return 0.0 if abs(value) <= NOISE * abs(scale) else value


def short(value: float, digits: int = 4) -> str:
    """A number for tables, labels and sheets: ``digits`` significant figures, no ``-0``, no trailing zeros,
    engineering notation outside 0.001 to a million (``12.5``, ``-0.0749``, ``12350``, ``24 × 10⁶``).
    The same as :func:`engineering`."""
    return engineering(value, digits)


_SUPERSCRIPT = str.maketrans("-0123456789", "⁻⁰¹²³⁴⁵⁶⁷⁸⁹")


def engineering(value: float, digits: int = 4) -> str:
    """A number for reading: plain from 0.001 to under a million, else mantissa × 10 to a power of 3.

    ``24000000`` reads ``24 × 10⁶``, ``100000000`` reads ``100 × 10⁶``,
    ``0.0000456`` reads ``45.6 × 10⁻⁶``; ``digits`` significant figures.
    """
    value = float(value)
    if not math.isfinite(value):
        return str(value)
    size = abs(float(f"{value:.{digits}g}"))
    if size == 0:
        return "0"
    if 1e-3 <= size < 1e6:
        return _plain(value, digits)
    power = 3 * math.floor(math.log10(size) / 3)
    return f"{_plain(value / 10**power, digits)} × 10{str(power).translate(_SUPERSCRIPT)}"


def _plain(value: float, digits: int) -> str:
    """``digits`` significant figures without an exponent: ``200000``, ``123500``, ``0.0125``."""
    decimals = digits - 1 - math.floor(math.log10(abs(value)))
    rounded = round(value, decimals)
    text = f"{rounded:.{max(decimals, 0)}f}"
    if "." in text:
        text = text.rstrip("0").rstrip(".")
    return "0" if float(text) == 0 else text


def _beam_of(line: InfluenceLine) -> Any:
    return getattr(line.origin, "beam", None)


def line_scale(line: InfluenceLine) -> float:
    """The size of an ordinate of ``line``'s quantity on its beam (the yardstick for rounding noise).

    A force per unit force: 1; a moment per unit force: the beam length; a
    deflection per unit force: ``L³/EI``; a rotation: ``L²/EI`` (the smallest
    ``EI`` of the beam).  A line made without a beam: its largest ordinate.
    """
    beam = _beam_of(line)
    largest = max(abs(line.maximum.value), abs(line.minimum.value))
    if beam is None:
        return largest or 1.0
    q = line.quantity
    length = float(beam.length)
    if q.is_force:
        return 1.0
    if q.is_moment:
        return length
    ranges = beam.EI_ranges
    stiffness = min((float(ei) for _, _, ei in ranges), default=0.0)
    if stiffness <= 0:
        return largest or 1.0
    return length ** (3 if q.kind == "deflection" else 2) / stiffness


def effect_scale(result: Extreme | LoadPlacement) -> float:
    """The size of the effect of a placed load: its total load (axles, and uniform loads over the beam)
    times the scale of the line's ordinates."""
    from ilkit.loads.results import Extreme

    line = result.line
    placements = result.placements if isinstance(result, Extreme) else (result,)
    length = line.length if line is not None else 1.0
    total = sum(abs(a.load) for p in placements for a in p.axles)
    total += sum(abs(s.intensity) * length for p in placements for s in p.patches)
    factor = max((abs(p.factor) for p in placements), default=1.0)
    return (total or 1.0) * max(factor, 1.0) * (line_scale(line) if line is not None else 1.0)


def ordinate_unit(line: InfluenceLine) -> tuple[float, str]:
    """``(factor, unit)``: ordinates of ``line`` times ``factor`` read in ``unit``.

    Forces and moments per unit force as the core gives them (``kN/kN``,
    ``kip·ft/kip``); deflections in mm (or in) per unit force, rotations in
    mrad per unit force.
    """
    return _display(line.quantity, line.units, per_force=True)


def effect_display(quantity: Quantity, units: UnitSystem | None) -> tuple[float, str]:
    """``(factor, unit)`` of the effect of a load on ``quantity`` (a deflection in mm, a rotation in mrad)."""
    return _display(quantity, units, per_force=False)


def _display(quantity: Quantity, units: UnitSystem | None, *, per_force: bool) -> tuple[float, str]:
    if units is None:
        return 1.0, ""
    per = f"/{units.force}" if per_force else ""
    if quantity.kind == "deflection":
        small, factor = _SMALLER.get(units.length, (units.length, 1))
        return float(factor), f"{small}{per}"
    if quantity.kind == "rotation":
        return 1000.0, f"mrad{per}"
    if quantity.is_force:
        return 1.0, f"{units.force}{per}"
    return 1.0, f"{units.moment}{per}"


def area_unit(line: InfluenceLine) -> str:
    """The unit of an area of ``line`` (shown times :func:`ordinate_unit`'s factor): what a uniform load
    (force per length) multiplies to give the effect: ``m`` for a reaction or shear, ``m²`` for a moment,
    ``mm·m/kN`` for a deflection."""
    units = line.units
    if units is None:
        return ""
    q = line.quantity
    if q.is_force:
        return units.length
    if q.is_moment:
        return f"{units.length}²"
    return f"{ordinate_unit(line)[1].split('/')[0]}·{units.length}/{units.force}"
