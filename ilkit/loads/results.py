"""Results of critical placement: plain frozen objects with a readable repr and a table form.

Nothing here prints.  Positions are in the beam's length unit measured from
its left end; effects carry the sign conventions of :mod:`ilkit.model`.
"""

from __future__ import annotations

import functools
from collections.abc import Callable
from dataclasses import dataclass, field
from typing import TYPE_CHECKING, Any, Literal

from ilkit._display import RichDisplay
from ilkit._exact import fmt
from ilkit.quantity import Quantity, Side
from ilkit.units import UnitSystem

if TYPE_CHECKING:  # pragma: no cover
    import pandas as pd

    from ilkit.influence import InfluenceLine
    from ilkit.loads.combination import DynamicEffect

__all__ = ["AxlePosition", "Patch", "LoadPlacement", "Extreme", "Extremes", "Direction", "effect_unit"]

Direction = Literal["left to right", "right to left"]


def effect_unit(quantity: Quantity, units: UnitSystem) -> str:
    """Unit of a load effect on ``quantity``: force, moment, length or rad."""
    if quantity.is_force:
        return units.force
    if quantity.is_moment:
        return units.moment
    if quantity.kind == "deflection":
        return units.length
    return "rad"


@dataclass(frozen=True)
class AxlePosition:
    """One axle of a placed train.

    ``number`` counts from the lead axle (1).  ``side`` is the one-sided
    limit taken where the line jumps under the axle (the axle stands just
    left or just right of ``x``), ``None`` elsewhere.  ``counted`` is False
    when the axle is off the beam or left off because it would reduce the
    extreme.
    """

    number: int
    load: float
    x: float
    side: Side | None
    ordinate: float
    counted: bool

    @property
    def effect(self) -> float:
        """Load times ordinate for a counted axle, 0 otherwise (unfactored), in the unit of the effect, signed."""
        return self.load * self.ordinate if self.counted else 0.0

    def __repr__(self) -> str:
        side = f" ({self.side})" if self.side else ""
        off = "" if self.counted else ", not counted"
        return (
            f"AxlePosition({self.number}: {fmt(self.load)} at x={fmt(self.x)}{side}, "
            f"ordinate {fmt(self.ordinate)}{off})"
        )


@dataclass(frozen=True)
class Patch:
    """A stretch ``start..end`` of the beam covered by a uniform load of ``intensity``, and its effect."""

    start: float
    end: float
    intensity: float
    effect: float

    def __repr__(self) -> str:
        return f"Patch({fmt(self.start)}..{fmt(self.end)}, intensity {fmt(self.intensity)}, effect {fmt(self.effect)})"


@dataclass(frozen=True)
class LoadPlacement(RichDisplay):
    """Where one load stands for an extreme, and its effect.

    ``effect`` is unfactored; ``factor`` is the factor on it in the case
    (the dynamic multiplier, 1 + allowance or Φ, times the case factor).  ``direction`` is the travel
    direction of a train (the lead axle is in front), ``None`` for loads
    without one.  ``spacings`` are the distances between consecutive axles
    as placed (the chosen value where a spacing varies).  ``front`` is the
    position of the front of a travelling load (its lead axle, or the leading
    end of its first block; see :func:`ilkit.loads.stand`), ``None`` for a
    uniform load placed in patches.  ``line`` is the influence line the load
    stands on (for tables with units and drawings).
    """

    load: str
    effect: float
    factor: float
    direction: Direction | None
    spacings: tuple[float, ...]
    axles: tuple[AxlePosition, ...]
    patches: tuple[Patch, ...]
    front: float | None = None
    line: InfluenceLine | None = field(default=None, repr=False, compare=False)

    @property
    def factored(self) -> float:
        """``factor x effect``, in the unit of the effect, with its sign."""
        return self.factor * self.effect

    def to_frame(self) -> pd.DataFrame:
        """One row per axle and per loaded patch, with positions, ordinates and effects.

        Column names carry the units of the line the load stands on (none
        when the placement was built without its line).
        """
        import pandas as pd

        line = self.line
        units = line.units if line is not None else None
        unit = effect_unit(line.quantity, units) if line is not None and units is not None else None
        return pd.DataFrame(_rows(self, units, unit))

    def __repr__(self) -> str:
        parts = [f"{self.load!r}", f"effect={fmt(self.effect)}"]
        if self.factor != 1.0:
            parts.append(f"factor={fmt(self.factor)}")
        if self.direction:
            parts.append(f"travelling {self.direction}")
        if self.axles:
            lead = self.axles[0]
            parts.append(f"lead axle at x={fmt(lead.x)}")
        if len(self.spacings) > 0:
            parts.append("spacings " + ", ".join(fmt(s) for s in self.spacings))
        if self.patches:
            parts.append(", ".join(f"{fmt(p.start)}..{fmt(p.end)}" for p in self.patches))
        return f"LoadPlacement({'; '.join(parts)})"


@dataclass(frozen=True, init=False, eq=False)
class Extreme(RichDisplay):
    """The largest (``extreme="max"``) or smallest (``"min"``) effect of a load on one quantity.

    ``value`` is the factored total of the governing ``case``;
    ``placements`` say where each load of the case stands (an extreme of an
    envelope describes them the first time they are asked for); ``dynamic``
    is the dynamic effect the value contains (the case's
    :attr:`ilkit.Combination.dynamic`: an allowance, a factor, included in the
    load values, or none; ``None`` when not recorded).
    """

    quantity: Quantity
    extreme: Literal["max", "min"]
    value: float
    case: str
    units: UnitSystem
    dynamic: DynamicEffect | None = None
    """The dynamic effect ``value`` contains (the governing case's :attr:`ilkit.Combination.dynamic`), or
    ``None`` when not recorded."""

    def __init__(
        self,
        quantity: Quantity,
        extreme: Literal["max", "min"],
        value: float,
        case: str,
        placements: tuple[LoadPlacement, ...] | Callable[[], tuple[LoadPlacement, ...]],
        units: UnitSystem,
        dynamic: DynamicEffect | None = None,
    ) -> None:
        object.__setattr__(self, "dynamic", dynamic)
        object.__setattr__(self, "quantity", quantity)
        object.__setattr__(self, "extreme", extreme)
        object.__setattr__(self, "value", value)
        object.__setattr__(self, "case", case)
        object.__setattr__(self, "units", units)
        if callable(placements):
            object.__setattr__(self, "_describe", placements)
        else:
            self.__dict__["placements"] = tuple(placements)

    @functools.cached_property
    def placements(self) -> tuple[LoadPlacement, ...]:
        """Where each load of the governing case stands, with its effect."""
        described = tuple(self._describe())  # type: ignore[attr-defined]
        object.__delattr__(self, "_describe")  # the search behind it is no longer kept
        return described

    def __eq__(self, other: object) -> bool:
        if not isinstance(other, Extreme):
            return NotImplemented
        mine = (self.quantity, self.extreme, self.value, self.case, self.units)
        return mine == (other.quantity, other.extreme, other.value, other.case, other.units) and (
            self.placements == other.placements
        )

    def __hash__(self) -> int:
        return hash((self.quantity, self.extreme, self.value, self.case))

    @property
    def unit(self) -> str:
        """Unit of ``value``."""
        return effect_unit(self.quantity, self.units)

    def __repr__(self) -> str:
        dynamic = f"; {self.dynamic.words}" if self.dynamic is not None else ""
        return (
            f"Extreme({self.extreme} {self.quantity.label} = {self.value:.6g} {self.unit}, "
            f"case {self.case!r}{dynamic})"
        )

    @property
    def line(self) -> InfluenceLine | None:
        """The influence line the loads were placed on."""
        return self.placements[0].line if self.placements else None

    def to_frame(self) -> pd.DataFrame:
        """One row per axle and per loaded patch, with positions, ordinates and effects.

        Column names carry the units.  ``factored effect`` sums to ``value``;
        ``dynamic`` says what dynamic effect each row's factor contains.
        """
        import pandas as pd

        rows = [row for p in self.placements for row in _rows(p, self.units, self.unit)]
        if self.dynamic is not None:
            for row in rows:
                row["dynamic"] = self.dynamic.of(row["load"])
        return pd.DataFrame(rows)


def _rows(p: LoadPlacement, u: UnitSystem | None, eff: str | None) -> list[dict[str, Any]]:
    """The table rows of one placement: its axles, then its patches (units in the column names)."""

    def col(name: str, unit: str | None) -> str:
        return f"{name} [{unit}]" if unit else name

    x, to_x = col("x", u and u.length), col("to x", u and u.length)
    load = col("load", u.force) if u else "axle load"  # "load" alone names the load
    intensity = col("intensity", u and u.line_load)
    effect, factored = col("effect", eff), col("factored effect", eff)
    rows = []
    for a in p.axles:
        rows.append({
            "load": p.load, "item": f"axle {a.number}", x: a.x, to_x: None, "side": a.side or "",
            "direction": p.direction or "", load: a.load, intensity: None, "ordinate": a.ordinate,
            "counted": a.counted, effect: a.effect, "factor": p.factor, factored: a.effect * p.factor,
        })
    for k, patch in enumerate(p.patches):
        rows.append({
            "load": p.load, "item": f"patch {k + 1}", x: patch.start, to_x: patch.end, "side": "",
            "direction": p.direction or "", load: None, intensity: patch.intensity, "ordinate": None,
            "counted": True, effect: patch.effect, "factor": p.factor, factored: patch.effect * p.factor,
        })
    return rows


@dataclass(frozen=True)
class Extremes(RichDisplay):
    """Both extremes of a load on one quantity."""

    maximum: Extreme
    minimum: Extreme

    def __repr__(self) -> str:
        q = self.maximum.quantity.label
        unit = self.maximum.unit
        dynamic = {e.dynamic.words: None for e in (self.maximum, self.minimum) if e.dynamic is not None}
        return (
            f"Extremes({q}: max {self.maximum.value:.6g} {unit} ({self.maximum.case}), "
            f"min {self.minimum.value:.6g} {unit} ({self.minimum.case})"
            f"{'; ' + ' / '.join(dynamic) if dynamic else ''})"
        )

    def to_frame(self) -> pd.DataFrame:
        """The rows of both extremes, with a first column saying which."""
        import pandas as pd

        parts = []
        for e in (self.maximum, self.minimum):
            frame = e.to_frame()
            frame.insert(0, "extreme", e.extreme)
            parts.append(frame)
        return pd.concat(parts, ignore_index=True)
