"""Moving-load primitives: axle trains, uniform loads, blocks and knife-edge loads.

Every load carries its unit system (``"kip-ft"``, ``"kN-m"`` ...): forces in
its force unit, lengths in its length unit, uniform loads in force per length.
Applying a load to a beam in another system converts it exactly
(:meth:`converted`).  Loads act downward; a positive load on a positive
ordinate gives a positive effect.

An axle train lists its axles from the lead axle.  It is always checked in
both travel directions.
"""

from __future__ import annotations

import math
import numbers
from collections.abc import Sequence
from dataclasses import dataclass
from decimal import Decimal
from fractions import Fraction
from pathlib import Path
from typing import TYPE_CHECKING, Any

from ilkit._check import flag, listed
from ilkit._exact import fmt, to_exact
from ilkit.errors import LoadInputError
from ilkit.loads._search import Chain, Group, Segment
from ilkit.units import UnitSystem, conversion, unit_system

if TYPE_CHECKING:  # pragma: no cover
    import pandas as pd

__all__ = ["AxleTrain", "TrainUniform", "UniformLoad", "UniformBlocks", "KnifeEdge", "Load", "read_units"]

OVERFLOW = (
    "loads times ordinates overflow float arithmetic. Check the load's numbers and units, and the beam's "
    "(a length, EI or spring far from 1 in its units)."
)
"""Why an effect is not finite (for :func:`ilkit._check.finite`)."""

SpacingInput = float | int | str | Fraction | tuple[Any, Any] | list[Any]


# ------------------------------------------------------------------ helpers
def number(value: object, what: str, *, minimum: float = 0.0, strict: bool = True, allow_inf: bool = False) -> float:
    """``value`` as a float, checked to be finite and above ``minimum`` (at or above if not ``strict``).

    Read like every number of ilkit (:func:`ilkit._exact.to_exact`: ints,
    floats, fractions, decimals, decimal strings; no booleans, NaN or
    arrays); ``allow_inf`` lets ``+inf`` through (an open upper bound).
    """
    if allow_inf and _positive_infinity(value):
        return math.inf
    out = float(to_exact(value, field=what, error=LoadInputError, units="the load's units"))
    if out < minimum or (strict and out == minimum):
        bound = "greater than" if strict else "at least"
        raise LoadInputError(f"{what}: must be {bound} {fmt(minimum)}, got {value!r}.", field=what, value=value)
    return out


def _positive_infinity(value: object) -> bool:
    if isinstance(value, bool) or not isinstance(value, (numbers.Real, str, Decimal)):
        return False
    try:
        return float(value) == math.inf
    except (TypeError, ValueError, OverflowError):
        return False


def numbers_of(values: object, *, what: str, item: str, wanted: str, **limits: Any) -> tuple[float, ...]:
    """A list of numbers (list, tuple, 1-d array or Series), item ``k`` read by :func:`number` as
    ``"{what}: {item} k"``; ``wanted`` is the message for something that is not a list."""
    items = listed(values, wanted=wanted, field=what, error=LoadInputError)
    return tuple(number(v, f"{what}: {item} {k}", **limits) for k, v in enumerate(items, start=1))


def read_name(name: object, what: str) -> str:
    """The name of a load, a combination or a model: a non-empty string."""
    if isinstance(name, str) and name.strip():
        return name
    raise LoadInputError(
        f"{what}: the name must be a non-empty string such as 'crane', got {name!r}.", field="name", value=name
    )


def read_units(units: object, what: str) -> UnitSystem:
    """The unit system of a load; a load without units is an error that says how to give them."""
    if units is None:
        raise LoadInputError(
            f"{what}: give the unit system of the load, e.g. units='kip-ft' or units='kN-m'.",
            field="units",
            value=units,
        )
    try:
        system = unit_system(units)  # type: ignore[arg-type]
    except ValueError as err:
        raise LoadInputError(str(err), field="units", value=units) from None
    assert system is not None
    return system


def _factors(source: UnitSystem, target: UnitSystem | str) -> tuple[UnitSystem, float, float]:
    system = read_units(target, "converted")
    length, force = conversion(source, system)
    return system, float(length), float(force)


def _text(value: float) -> str:
    return "inf" if math.isinf(value) else fmt(value)


# --------------------------------------------------------------- primitives
@dataclass(frozen=True)
class TrainUniform:
    """A uniform load that travels with an axle train, of unlimited length.

    ``intensity`` (force per length) starts ``clearance`` (length) beyond the
    outer axle and runs on indefinitely.  ``breakable=True``: it is applied
    only on the parts of the line that add to the wanted extreme (e.g.
    EN 1991-2 LM71); ``False``: it is applied wherever it stands.
    """

    intensity: float
    clearance: float = 0.0
    breakable: bool = False

    def __post_init__(self) -> None:
        object.__setattr__(self, "intensity", number(self.intensity, "intensity"))
        object.__setattr__(self, "clearance", number(self.clearance, "clearance", strict=False))
        breakable = flag(self.breakable, what="breakable", field="breakable", error=LoadInputError)
        object.__setattr__(self, "breakable", breakable)

    def __repr__(self) -> str:
        return (
            f"TrainUniform(intensity={fmt(self.intensity)}, clearance={fmt(self.clearance)}, "
            f"breakable={self.breakable})"
        )


@dataclass(frozen=True, repr=False)
class AxleTrain:
    """A train of concentrated axle loads at given spacings, listed from the lead axle.

    Parameters
    ----------
    loads:
        Axle loads (force unit), lead axle first, each > 0.
    spacings:
        Distances between consecutive axles (length unit), one fewer than the
        loads.  A spacing may be a range ``(lo, hi)``: the search picks the
        spacing that gives the extreme (``hi`` may be ``math.inf``).
    units:
        Unit system of the numbers, e.g. ``"kip-ft"`` or ``"kN-m"``.
    name:
        Name used in results.
    ahead, behind:
        Uniform loads travelling with the train ahead of the lead axle and
        behind the last axle (:class:`TrainUniform`).
    drop_adverse_axles:
        Leave out axles that would reduce the extreme (they stand where the
        line has the other sign), as AASHTO LRFD 3.6.1.3.1 allows.
    """

    loads: tuple[float, ...]
    spacings: tuple[tuple[float, float], ...]
    units: UnitSystem
    name: str = "axle train"
    ahead: TrainUniform | None = None
    behind: TrainUniform | None = None
    drop_adverse_axles: bool = False

    def __init__(
        self,
        loads: Sequence[float],
        spacings: Sequence[SpacingInput] = (),
        *,
        units: str | UnitSystem,
        name: str = "axle train",
        ahead: TrainUniform | None = None,
        behind: TrainUniform | None = None,
        drop_adverse_axles: bool = False,
    ) -> None:
        wanted = "loads: give the axle loads as a list from the lead axle, e.g. [8, 32, 32]"
        axle_loads = numbers_of(loads, what="loads", item="axle", wanted=wanted)
        if not axle_loads:
            raise LoadInputError(f"{wanted}; got {loads!r}.", field="loads", value=loads)
        gaps = listed(
            spacings,
            wanted="spacings: give the distances between consecutive axles as a list, e.g. [14, 14]",
            field="spacings",
            error=LoadInputError,
        )
        if len(gaps) != len(axle_loads) - 1:
            raise LoadInputError(
                f"spacings: {len(axle_loads)} axles need {len(axle_loads) - 1} spacings, got {len(gaps)} "
                f"({gaps!r}).",
                field="spacings",
                value=spacings,
            )
        ranges = tuple(_spacing(s, i) for i, s in enumerate(gaps))
        label = read_name(name, "AxleTrain")
        system = read_units(units, label)
        for which, extra in (("ahead", ahead), ("behind", behind)):
            if extra is not None and not isinstance(extra, TrainUniform):
                raise LoadInputError(
                    f"{which}: give a TrainUniform(intensity, clearance) or None, got {extra!r}.", field=which
                )
        drop = flag(drop_adverse_axles, what="drop_adverse_axles", field="drop_adverse_axles", error=LoadInputError)
        object.__setattr__(self, "loads", axle_loads)
        object.__setattr__(self, "spacings", ranges)
        object.__setattr__(self, "units", system)
        object.__setattr__(self, "name", label)
        object.__setattr__(self, "ahead", ahead)
        object.__setattr__(self, "behind", behind)
        object.__setattr__(self, "drop_adverse_axles", drop)

    # ------------------------------------------------------------ reading tables
    @classmethod
    def from_frame(
        cls,
        frame: pd.DataFrame,
        *,
        units: str | UnitSystem,
        name: str = "axle train",
        drop_adverse_axles: bool = False,
    ) -> AxleTrain:
        """An axle train from a table with one row per axle, lead axle first.

        Columns: ``load`` (force unit), ``spacing`` (distance from the
        previous axle, length unit; empty on the first row) and optionally
        ``spacing_max`` (upper end where the spacing may vary; empty where it
        is fixed).  Other columns are ignored.
        """
        import pandas as pd

        if not isinstance(frame, pd.DataFrame):
            raise LoadInputError(
                f"from_frame: expected a pandas DataFrame, got {type(frame).__name__}; "
                "use AxleTrain.from_csv for a file.",
                field="frame",
            )
        name = read_name(name, "from_frame")
        read_units(units, name)
        columns = [str(c).strip().lower() for c in frame.columns]
        repeated = sorted({c for c in columns if columns.count(c) > 1})
        if repeated:
            raise LoadInputError(
                f"{name}: the table has more than one column named {repeated[0]!r} (columns: {list(frame.columns)}; "
                "names are read without case and spaces); keep one, or rename the others.",
                field=repeated[0],
            )
        table = frame.set_axis(columns, axis=1)
        for needed in ("load", "spacing"):
            if needed not in columns:
                raise LoadInputError(
                    f"{name}: the table has no {needed!r} column (columns: {list(frame.columns)}); "
                    "give one row per axle with columns 'load' and 'spacing' (distance from the previous axle).",
                    field=needed,
                )
        if len(table) == 0:
            raise LoadInputError(f"{name}: the table has no rows; give one row per axle.", field="load")
        loads = [_cell(table, "load", i, name) for i in range(len(table))]
        first = _item(table["spacing"].iloc[0])
        if not _blank(first) and _cell(table, "spacing", 0, name, minimum=0.0, strict=False) != 0.0:
            raise LoadInputError(
                f"{name}: row 1 (the lead axle) has spacing {first!r}; leave it empty or 0 "
                "(spacing is the distance from the previous axle).",
                field="spacing",
                value=first,
            )
        spacings: list[SpacingInput] = []
        has_max = "spacing_max" in columns
        first_max = _item(table["spacing_max"].iloc[0]) if has_max else None
        if not _blank(first_max):
            raise LoadInputError(
                f"{name}: row 1 (the lead axle) has spacing_max {first_max!r}; leave it empty "
                "(a varying spacing belongs to the row of the axle it leads to).",
                field="spacing_max",
                value=first_max,
            )
        for i in range(1, len(table)):
            lo = _cell(table, "spacing", i, name)
            hi_raw = table["spacing_max"].iloc[i] if has_max else None
            if has_max and not _blank(hi_raw):
                hi = _cell(table, "spacing_max", i, name, allow_inf=True)
                spacings.append((lo, hi))
            else:
                spacings.append(lo)
        try:
            return cls(loads, spacings, units=units, name=name, drop_adverse_axles=drop_adverse_axles)
        except LoadInputError as err:
            raise LoadInputError(f"{name}: {err}", field=err.field, value=err.value) from None

    @classmethod
    def from_csv(
        cls,
        path: str | Path,
        *,
        units: str | UnitSystem,
        name: str | None = None,
        drop_adverse_axles: bool = False,
    ) -> AxleTrain:
        """An axle train from a CSV file with the columns of :meth:`from_frame`."""
        import pandas as pd

        if not isinstance(path, (str, Path)):
            raise LoadInputError(
                f"from_csv: give the path of a CSV file as a string or a pathlib.Path, got {path!r}.",
                field="path",
                value=path,
            )
        file = Path(path)
        if not file.is_file():
            raise LoadInputError(
                f"from_csv: no file at {str(file)!r}; give the path of a CSV file with columns load, spacing.",
                field="path",
                value=str(path),
            )
        try:
            frame = pd.read_csv(file)
        except (pd.errors.ParserError, pd.errors.EmptyDataError, UnicodeDecodeError, OSError) as err:
            raise LoadInputError(
                f"from_csv: cannot read {str(file)!r} as CSV ({err}); save it as comma-separated text with a "
                "header row 'load,spacing'.",
                field="path",
                value=str(path),
            ) from None
        return cls.from_frame(frame, units=units, name=name or file.stem, drop_adverse_axles=drop_adverse_axles)

    # -------------------------------------------------------------- properties
    @property
    def is_variable(self) -> bool:
        """True when some spacing is a range."""
        return any(lo != hi for lo, hi in self.spacings)

    @property
    def total_load(self) -> float:
        """Sum of the axle loads (force unit)."""
        return sum(self.loads)

    def __repr__(self) -> str:
        spacings = ", ".join(fmt(lo) if lo == hi else f"({fmt(lo)}, {_text(hi)})" for lo, hi in self.spacings)
        extra = ""
        if self.ahead is not None:
            extra += f", ahead={self.ahead!r}"
        if self.behind is not None:
            extra += f", behind={self.behind!r}"
        if self.drop_adverse_axles:
            extra += ", drop_adverse_axles=True"
        loads = ", ".join(fmt(v) for v in self.loads)
        return f"AxleTrain([{loads}], [{spacings}], units={self.units.name!r}, name={self.name!r}{extra})"

    def converted(self, units: str | UnitSystem) -> AxleTrain:
        """The same train in another unit system (exact factors)."""
        system, lf, ff = _factors(self.units, units)
        if system == self.units:
            return self

        def tail(t: TrainUniform | None) -> TrainUniform | None:
            return None if t is None else TrainUniform(t.intensity * ff / lf, t.clearance * lf, t.breakable)

        return AxleTrain(
            [v * ff for v in self.loads],
            [(lo * lf, hi * lf) for lo, hi in self.spacings],
            units=system,
            name=self.name,
            ahead=tail(self.ahead),
            behind=tail(self.behind),
            drop_adverse_axles=self.drop_adverse_axles,
        )

    def renamed(self, name: str) -> AxleTrain:
        """The same train under another name."""
        return AxleTrain(
            self.loads,
            self.spacings,
            units=self.units,
            name=name,
            ahead=self.ahead,
            behind=self.behind,
            drop_adverse_axles=self.drop_adverse_axles,
        )

    def chain(self) -> Chain:
        """Groups between variable spacings, lead axle at the left (the train travelling right to left)."""
        groups: list[Group] = []
        gaps: list[tuple[float, float]] = []
        spacings: list[float] = []
        loads = [self.loads[0]]
        for (lo, hi), load in zip(self.spacings, self.loads[1:]):
            if lo == hi:
                spacings.append(lo)
                loads.append(load)
            else:
                groups.append(Group.of(spacings, loads))
                gaps.append((lo, hi))
                spacings, loads = [], [load]
        groups.append(Group.of(spacings, loads))
        if self.ahead is not None:
            a = self.ahead
            first = groups[0]
            lead = Segment(-math.inf, -a.clearance, a.intensity, a.breakable)
            groups[0] = Group(first.offsets, first.loads, (*first.segments, lead), first.exact)
        if self.behind is not None:
            b = self.behind
            last = groups[-1]
            groups[-1] = Group(
                last.offsets,
                last.loads,
                (*last.segments, Segment(last.extent + b.clearance, math.inf, b.intensity, b.breakable)),
                last.exact,
            )
        return Chain(tuple(groups), tuple(gaps))


def _spacing(value: SpacingInput, index: int) -> tuple[float, float]:
    what = f"spacings: spacing {index + 1} (axle {index + 1} to {index + 2})"
    if isinstance(value, (tuple, list)):
        if len(value) != 2:
            raise LoadInputError(
                f"{what}: a varying spacing is a pair (lo, hi), got {value!r}.", field="spacings", value=value
            )
        lo = number(value[0], what)
        hi = number(value[1], what, allow_inf=True)
        if hi < lo:
            raise LoadInputError(
                f"{what}: the range {value!r} runs backwards; give (smallest, largest).", field="spacings", value=value
            )
        return (lo, hi)
    v = number(value, what)
    return (v, v)


def _blank(value: object) -> bool:
    """True for an empty table cell: None, NaN, pandas NA or blank text."""
    if value is None:
        return True
    if isinstance(value, str):
        return value.strip() == ""
    if isinstance(value, numbers.Real):
        return value != value  # NaN (no float conversion: a huge integer is a value, not a blank)
    return type(value).__name__ in ("NAType", "NaTType")


def _item(raw: Any) -> Any:
    """A table cell as a plain Python value (``4.0``, not ``np.float64(4.0)``), for reading and for messages."""
    return raw.item() if getattr(raw, "ndim", None) == 0 else raw


def _cell(table: Any, column: str, row: int, name: str, **limits: Any) -> float:
    raw = _item(table[column].iloc[row])
    if _blank(raw):
        raise LoadInputError(
            f"{name}: row {row + 1} has no {column!r}; fill it in (one row per axle, lead axle first).",
            field=column,
            value=raw,
        )
    try:
        return number(raw, column, **limits)
    except LoadInputError as err:
        raise LoadInputError(f"{name}: row {row + 1}, {err}", field=column, value=raw) from None


@dataclass(frozen=True, repr=False)
class UniformLoad:
    """A uniform load (force per length) that may be broken into patches.

    It covers exactly the parts of the line of the wanted sign, as a design
    lane load does (AASHTO LRFD 3.6.1.2.4, EN 1991-2 4.3.2).
    """

    intensity: float
    units: UnitSystem
    name: str = "uniform load"

    def __init__(self, intensity: float, *, units: str | UnitSystem, name: str = "uniform load") -> None:
        label = read_name(name, "UniformLoad")
        object.__setattr__(self, "intensity", number(intensity, "intensity"))
        object.__setattr__(self, "units", read_units(units, label))
        object.__setattr__(self, "name", label)

    def __repr__(self) -> str:
        return f"UniformLoad({fmt(self.intensity)}, units={self.units.name!r}, name={self.name!r})"

    def converted(self, units: str | UnitSystem) -> UniformLoad:
        """The same load in another unit system (exact factors)."""
        system, lf, ff = _factors(self.units, units)
        return self if system == self.units else UniformLoad(self.intensity * ff / lf, units=system, name=self.name)


@dataclass(frozen=True, repr=False)
class UniformBlocks:
    """Unbreakable uniform loads of fixed lengths at fixed distances, placed as a whole.

    ``lengths`` of the loaded blocks and ``gaps`` between them (length
    unit), ``intensity`` in force per length.  Example: EN 1991-2 SW/0, two
    blocks of 15.0 m, 5.3 m apart.
    """

    intensity: float
    lengths: tuple[float, ...]
    gaps: tuple[float, ...]
    units: UnitSystem
    name: str = "uniform blocks"

    def __init__(
        self,
        intensity: float,
        lengths: Sequence[float],
        gaps: Sequence[float] = (),
        *,
        units: str | UnitSystem,
        name: str = "uniform blocks",
    ) -> None:
        wanted = "lengths: give the block lengths as a list, e.g. [15, 15]"
        blocks = numbers_of(lengths, what="lengths", item="block", wanted=wanted)
        if not blocks:
            raise LoadInputError(f"{wanted}; got {lengths!r}.", field="lengths", value=lengths)
        between = numbers_of(
            gaps, what="gaps", item="gap", wanted="gaps: give the gaps between the blocks as a list", strict=False
        )
        if len(between) != len(blocks) - 1:
            raise LoadInputError(
                f"gaps: {len(blocks)} blocks need {len(blocks) - 1} gaps between them, got {gaps!r}.", field="gaps"
            )
        label = read_name(name, "UniformBlocks")
        object.__setattr__(self, "intensity", number(intensity, "intensity"))
        object.__setattr__(self, "lengths", blocks)
        object.__setattr__(self, "gaps", between)
        object.__setattr__(self, "units", read_units(units, label))
        object.__setattr__(self, "name", label)

    def __repr__(self) -> str:
        lengths = ", ".join(fmt(v) for v in self.lengths)
        gaps = ", ".join(fmt(v) for v in self.gaps)
        return (
            f"UniformBlocks({fmt(self.intensity)}, [{lengths}], [{gaps}], units={self.units.name!r}, "
            f"name={self.name!r})"
        )

    def converted(self, units: str | UnitSystem) -> UniformBlocks:
        """The same blocks in another unit system (exact factors)."""
        system, lf, ff = _factors(self.units, units)
        if system == self.units:
            return self
        return UniformBlocks(
            self.intensity * ff / lf,
            [v * lf for v in self.lengths],
            [v * lf for v in self.gaps],
            units=system,
            name=self.name,
        )

    def chain(self) -> Chain:
        """One group of segments, the first block starting at offset 0."""
        segments = []
        start = 0.0
        for k, length in enumerate(self.lengths):
            segments.append(Segment(start, start + length, self.intensity, False))
            start += length + (self.gaps[k] if k < len(self.gaps) else 0.0)
        return Chain((Group((), (), tuple(segments)),))


@dataclass(frozen=True, repr=False)
class KnifeEdge:
    """A single concentrated load placed anywhere along the line (force unit)."""

    load: float
    units: UnitSystem
    name: str = "knife-edge load"

    def __init__(self, load: float, *, units: str | UnitSystem, name: str = "knife-edge load") -> None:
        label = read_name(name, "KnifeEdge")
        object.__setattr__(self, "load", number(load, "load"))
        object.__setattr__(self, "units", read_units(units, label))
        object.__setattr__(self, "name", label)

    def __repr__(self) -> str:
        return f"KnifeEdge({fmt(self.load)}, units={self.units.name!r}, name={self.name!r})"

    def converted(self, units: str | UnitSystem) -> KnifeEdge:
        """The same load in another unit system (exact factors)."""
        system, _, ff = _factors(self.units, units)
        return self if system == self.units else KnifeEdge(self.load * ff, units=system, name=self.name)

    def chain(self) -> Chain:
        """One group of one load at offset 0."""
        return Chain((Group.of([], [self.load]),))


Load = AxleTrain | UniformLoad | UniformBlocks | KnifeEdge
"""A primitive moving load."""
