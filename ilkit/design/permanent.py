"""Permanent loads, construction stages and support settlement: their effects at the sections of a beam.

Loads (each with a ``name`` and a load ``category`` such as ``"DC"``, ``"DW"``, ``"G"``):

* :class:`DistributedLoad`: a uniform load over the whole beam or a stretch of it;
* :class:`SpanLoad`: a uniform load over one span (numbered from 1, left to right);
* :class:`PointLoad`: a concentrated load;
* :class:`Settlement`: an imposed downward movement of a rigid bearing.

Forces act downward when positive (a negative value acts upward); numbers are in the beam's
units (force, force per length, length), or pint quantities converted exactly into them.

Effects come from the influence lines of the beam, never from sampling: a uniform load ``w``
over ``[a, b]`` gives ``w`` times the exact integral of the line's polynomial pieces over ``[a, b]``
(:meth:`ilkit.InfluenceLine.integral`); a point load ``P`` at ``c`` gives ``P`` times the ordinate at
``c``.  A point load standing exactly at the section of a shear is on one side of the cut: on the
left face of a section (``side="left"``, the cut just left of ``x``) it stands right of the cut, on
the right face left of it (:func:`ilkit.design.sections.load_ordinate`); at a section without a side
where a point load stands, the shear is given on both faces (rows ``side="left"`` and ``"right"``),
because it jumps by the load there.  A point load exactly at a shear release belongs to neither
part and is refused.

Settlement (stiffness method, with Müller-Breslau's reading of the result): the influence line of
the reaction of a rigid bearing is the beam's deflected shape when that bearing settles by 1 with
every other restraint held (:class:`ilkit.stiffness.UnitShape`).  A settlement ``Δ`` therefore
deflects the beam by ``Δ`` times that line; its bending moment is ``-EI v''`` and its shear ``-EI v'''`` of that shape
``v`` (downward positive), and each reaction is the jump of the shear at its support.  On a
statically determinate beam the settlement moves the beam as a rigid body: every force effect is
zero, and the result says so in its notes.

Staged construction: a :class:`Stage` holds the loads that act on one beam (the steel girder alone
for the wet deck, the composite section for superimposed loads); stages share the geometry and the
supports and differ in ``EI``; their effects add.

Sign conventions are those of :mod:`ilkit.model`: sagging moment positive, shear positive when the
forces left of the section add up to an upward resultant, reactions positive upward, deflections
positive downward.
"""

from __future__ import annotations

from collections.abc import Sequence
from dataclasses import dataclass, field
from fractions import Fraction
from typing import TYPE_CHECKING, Any, Literal

from ilkit._check import choice, finite, listed, whole
from ilkit._display import RichDisplay
from ilkit._exact import fmt, fmt_precise, is_quantity, to_exact
from ilkit.design.factors import Applied
from ilkit.design.sections import Section, envelope_sections, load_ordinate
from ilkit.errors import LoadInputError, SideRequiredError
from ilkit.floor import FloorLine
from ilkit.loads.primitives import OVERFLOW, read_name
from ilkit.model import Beam
from ilkit.positions import tolerance
from ilkit.quantity import Side
from ilkit.units import FORCE, LENGTH, LINE_LOAD, SYSTEMS, Dimension, UnitSystem, factor_to, magnitude_in

if TYPE_CHECKING:  # pragma: no cover
    import pandas as pd

    from ilkit.influence import InfluenceLine

__all__ = [
    "DistributedLoad",
    "SpanLoad",
    "PointLoad",
    "Settlement",
    "PermanentLoad",
    "Stage",
    "PermanentEffects",
    "permanent_effects",
    "QUANTITIES",
]

QUANTITIES: tuple[str, ...] = ("moment", "shear", "reaction", "deflection")
"""The quantities of permanent effects: bending moment (force·length, sagging positive), shear
(force, positive when the part left of the section is pushed up), vertical reaction (force, upward
positive) and deflection (length, downward positive)."""

EffectKind = Literal["moment", "shear", "reaction", "deflection"]


# ------------------------------------------------------------------- reading
def _read(load: object, /, **numbers: Dimension) -> str:
    """Check and store a load's ``name``, ``category`` and the ``numbers`` given (field name -> dimension;
    ``None`` stays ``None``); returns the name."""
    name = read_name(load.name, type(load).__name__)  # type: ignore[attr-defined]
    category = load.category  # type: ignore[attr-defined]
    if not isinstance(category, str) or not category.strip():
        raise LoadInputError(
            f"{name}: the category must be a non-empty text such as 'DC', 'DW' or 'G', got {category!r}.",
            field="category",
            value=category,
        )
    object.__setattr__(load, "name", name)
    for label, dims in numbers.items():
        value = getattr(load, label)
        if value is not None:
            object.__setattr__(load, label, _given(value, dims, f"{name}: {label}"))
    return name


def _given(value: object, dims: Dimension, field: str) -> Any:
    """A number as given: exact, or a pint quantity whose dimension and units are checked now (it is
    converted into the beam's units when the load is applied)."""
    if is_quantity(value):
        factor_to(value, dims=dims, system=SYSTEMS["kN-m"], field=field)  # the dimension, an exact conversion
        to_exact(value.magnitude, field=field, error=LoadInputError)  # type: ignore[attr-defined]
        return value
    return to_exact(value, field=field, error=LoadInputError, units="the beam's units")


def _text(value: Any) -> str:
    return fmt_precise(value) if isinstance(value, Fraction) else str(value)


def _on_beam(value: Any, beam: Beam, field: str, what: str) -> Fraction:
    """A position in the beam's length unit, on the beam (within the merge tolerance), moved onto the
    beam's point within that tolerance of it."""
    pos = magnitude_in(value, dims=LENGTH, system=beam.units, field=field)
    if pos < -tolerance(beam.length) or pos > beam.length + tolerance(beam.length):
        raise LoadInputError(
            f"{what}: x={fmt_precise(pos)} is off the beam; give positions from 0 to {fmt_precise(beam.length)}.",
            field=field,
            value=value,
        )
    return beam.position(min(max(pos, Fraction(0)), beam.length))


# --------------------------------------------------------------------- loads
@dataclass(frozen=True, repr=False)
class DistributedLoad:
    """A uniform load of ``intensity`` (force per length, downward positive) from ``start`` to ``end``.

    ``start`` and ``end`` are positions in the beam's length unit; ``None``
    is the beam's end (the load covers the whole beam when both are left
    out).  ``name`` names the load in results; ``category`` is its load
    category (``"DC"``, ``"DW"``, ``"G"``, ``"EV"`` ...).
    """

    name: str
    category: str
    intensity: Any
    start: Any = None
    end: Any = None

    def __post_init__(self) -> None:
        name = _read(self, intensity=LINE_LOAD, start=LENGTH, end=LENGTH)
        if isinstance(self.start, Fraction) and isinstance(self.end, Fraction) and self.start >= self.end:
            raise LoadInputError(
                f"{name}: start (x={fmt_precise(self.start)}) must lie left of end (x={fmt_precise(self.end)}); "
                "give the stretch from left to right.",
                field="end",
                value=self.end,
            )

    def __repr__(self) -> str:
        where = "".join(f", {k}={_text(getattr(self, k))}" for k in ("start", "end") if getattr(self, k) is not None)
        return f"DistributedLoad({self.name!r}, {self.category!r}, {_text(self.intensity)}{where})"

    def _parts(self, beam: Beam) -> list[_Part]:
        w = magnitude_in(self.intensity, dims=LINE_LOAD, system=beam.units, field=f"{self.name}: intensity")
        a = Fraction(0) if self.start is None else _on_beam(self.start, beam, "start", self.name)
        b = beam.length if self.end is None else _on_beam(self.end, beam, "end", self.name)
        if a >= b:
            raise LoadInputError(
                f"{self.name}: the load runs from x={fmt_precise(a)} to x={fmt_precise(b)}, which is no stretch of "
                f"the beam (0 to {fmt_precise(beam.length)}); give start left of end.",
                field="end",
                value=self.end,
            )
        return [_Part(w, a, b)]


@dataclass(frozen=True, repr=False)
class SpanLoad:
    """A uniform load of ``intensity`` (force per length, downward positive) over span number ``span``.

    Spans are numbered from 1, left to right, between consecutive supports
    (overhangs are not spans: load them with :class:`DistributedLoad`).
    """

    name: str
    category: str
    intensity: Any
    span: int

    def __post_init__(self) -> None:
        name = _read(self, intensity=LINE_LOAD)
        span = whole(self.span, what=f"{name}: span (numbered from 1)", field="span", minimum=1, error=LoadInputError)
        object.__setattr__(self, "span", span)

    def __repr__(self) -> str:
        return f"SpanLoad({self.name!r}, {self.category!r}, {_text(self.intensity)}, span={self.span})"

    def _parts(self, beam: Beam) -> list[_Part]:
        spans = beam.spans
        if self.span > len(spans):
            listed_spans = "; ".join(f"{k} from x={fmt(a)} to {fmt(b)}" for k, (a, b) in enumerate(spans, start=1))
            raise LoadInputError(
                f"{self.name}: the beam has {len(spans)} span{'s' if len(spans) != 1 else ''} "
                f"({listed_spans or 'none'}), so there is no span {self.span}; load an overhang with "
                "DistributedLoad(start=..., end=...).",
                field="span",
                value=self.span,
            )
        w = magnitude_in(self.intensity, dims=LINE_LOAD, system=beam.units, field=f"{self.name}: intensity")
        a, b = spans[self.span - 1]
        return [_Part(w, a, b)]


@dataclass(frozen=True, repr=False)
class PointLoad:
    """A concentrated load ``load`` (force, downward positive) at ``at`` (length from the left end)."""

    name: str
    category: str
    load: Any
    at: Any

    def __post_init__(self) -> None:
        _read(self, load=FORCE, at=LENGTH)

    def __repr__(self) -> str:
        return f"PointLoad({self.name!r}, {self.category!r}, {_text(self.load)}, at={_text(self.at)})"

    def _parts(self, beam: Beam) -> list[_Part]:
        P = magnitude_in(self.load, dims=FORCE, system=beam.units, field=f"{self.name}: load")
        c = _on_beam(self.at, beam, "at", self.name)
        if c in beam.shear_releases:
            raise LoadInputError(
                f"{self.name}: the load stands exactly at the shear release at x={fmt_precise(c)}, which belongs to "
                "neither of the parts it separates; put it on one of them (a little left or right of the release).",
                field="at",
                value=self.at,
            )
        return [_Part(P, c, None)]


@dataclass(frozen=True, repr=False)
class Settlement:
    """An imposed downward movement ``displacement`` (length) of the rigid bearing at ``at``.

    The bearing must be rigid vertically (fixed, pin, roller, or a support
    with only a rotational spring); other supports hold.  On a statically
    indeterminate beam it causes moments, shears and reactions; on a
    determinate beam it moves the beam as a rigid body (deflections only, no
    forces), and the result says so.  ``category`` defaults to
    ``"settlement"``.  A negative displacement lifts the bearing.
    """

    name: str
    at: Any
    displacement: Any
    category: str = "settlement"

    def __post_init__(self) -> None:
        _read(self, at=LENGTH, displacement=LENGTH)

    def __repr__(self) -> str:
        extra = f", category={self.category!r}" if self.category != "settlement" else ""
        return f"Settlement({self.name!r}, at={_text(self.at)}, displacement={_text(self.displacement)}{extra})"

    def _support(self, beam: Beam) -> tuple[Fraction, Fraction]:
        """``(position of the bearing, displacement)`` in the beam's units."""
        pos = _on_beam(self.at, beam, "at", self.name)
        support = next((s for s in beam.supports if s.at == pos), None)
        if support is None:
            places = ", ".join(fmt_precise(s.at) for s in beam.supports)
            raise LoadInputError(
                f"{self.name}: there is no support at x={fmt_precise(pos)}; a settlement moves a bearing (supports "
                f"are at x={places}).",
                field="at",
                value=self.at,
            )
        if support.vertical_stiffness is not None:
            raise LoadInputError(
                f"{self.name}: the support at x={fmt_precise(pos)} is an elastic bearing (a vertical spring); a "
                "settlement is an imposed movement of a rigid bearing. For the base of a spring that settles by Δ, "
                "apply the point load k·Δ at the bearing (and subtract it from the spring's reaction).",
                field="at",
                value=self.at,
            )
        delta = magnitude_in(self.displacement, dims=LENGTH, system=beam.units, field=f"{self.name}: displacement")
        return pos, delta


PermanentLoad = DistributedLoad | SpanLoad | PointLoad | Settlement
"""Any permanent load or imposed movement of ``ilkit.design.permanent``."""

_LOADS = (DistributedLoad, SpanLoad, PointLoad, Settlement)


@dataclass(frozen=True)
class _Part:
    """A load in the beam's units: uniform ``value`` over ``[a, b]``, or a point load ``value`` at ``a``
    (``b`` is ``None``)."""

    value: Fraction
    a: Fraction
    b: Fraction | None


# -------------------------------------------------------------------- stages
@dataclass(frozen=True, repr=False)
class Stage:
    """Loads acting on one beam: a construction stage.

    ``beam`` is the girder line as it carries these loads (its ``EI`` for
    this stage); all stages of one study share the length, supports,
    releases and units.  ``loads`` are permanent loads and settlements with
    distinct names.
    """

    name: str
    beam: Beam
    loads: tuple[PermanentLoad, ...]

    def __init__(self, name: str, beam: Beam, loads: Sequence[PermanentLoad]) -> None:
        if not isinstance(name, str):
            raise LoadInputError(f"Stage: the name must be a text such as 'wet deck', got {name!r}.", field="name",
                                 value=name)
        if not isinstance(beam, Beam):
            raise LoadInputError(f"Stage {name!r}: give the Beam of this stage, got {type(beam).__name__} {beam!r}.",
                                 field="beam", value=beam)
        if isinstance(loads, _LOADS):
            loads = (loads,)
        items = listed(loads, wanted=f"Stage {name!r}: give the loads as a list, e.g. [SpanLoad('deck', 'DC', 12, 1)]",
                       field="loads", error=LoadInputError)
        for item in items:
            if not isinstance(item, _LOADS):
                raise LoadInputError(
                    f"Stage {name!r}: a load must be a DistributedLoad, SpanLoad, PointLoad or Settlement, got "
                    f"{type(item).__name__} {item!r}.",
                    field="loads",
                    value=item,
                )
        names = [item.name for item in items]
        repeated = sorted({n for n in names if names.count(n) > 1})
        if repeated:
            raise LoadInputError(
                f"Stage {name!r}: loads must have distinct names; {repeated} appear more than once. Rename one.",
                field="loads",
                value=repeated,
            )
        object.__setattr__(self, "name", name)
        object.__setattr__(self, "beam", beam)
        object.__setattr__(self, "loads", tuple(items))

    def __repr__(self) -> str:
        return f"Stage({self.name!r}, {self.beam!r}, [{', '.join(repr(x) for x in self.loads)}])"


def _stages(stages_or_beam: object, loads: object) -> tuple[Stage, ...]:
    if isinstance(stages_or_beam, Beam):
        if loads is None:
            raise LoadInputError(
                "permanent_effects: give the loads with the beam, permanent_effects(beam, [SpanLoad(...), ...]), "
                "or give stages: permanent_effects([Stage(...), ...]).",
                field="loads",
            )
        return (Stage("", stages_or_beam, loads),)  # type: ignore[arg-type]
    if loads is not None:
        raise LoadInputError(
            "permanent_effects: the loads belong to the stages; give either a beam and its loads or a list of "
            "Stage objects, not both.",
            field="loads",
            value=loads,
        )
    given = (stages_or_beam,) if isinstance(stages_or_beam, Stage) else stages_or_beam
    items = listed(given, wanted="permanent_effects: give a Beam and its loads, a Stage or a list of Stage objects",
                   field="stages", error=LoadInputError)
    if not items or not all(isinstance(s, Stage) for s in items):
        raise LoadInputError(
            f"permanent_effects: give a Beam and its loads, a Stage or a list of Stage objects, got {given!r}.",
            field="stages",
            value=given,
        )
    names = [s.name for s in items]
    if len(set(names)) != len(names):
        raise LoadInputError(f"permanent_effects: stages must have distinct names, got {names}.", field="stages",
                             value=names)
    first = items[0].beam
    for s in items[1:]:
        b = s.beam
        same = (b.length, b.supports, b.hinges, b.shear_releases, b.units) == (
            first.length, first.supports, first.hinges, first.shear_releases, first.units)
        if not same:
            raise LoadInputError(
                f"permanent_effects: stage {s.name!r} has another girder line than stage {items[0].name!r} (length, "
                "supports, releases or units differ); stages share the geometry and supports and differ only in EI. "
                f"Build each stage's beam with beam.replace(EI=...): {first!r} against {b!r}.",
                field="stages",
                value=s.name,
            )
    return tuple(items)


# ------------------------------------------------------------------- results
@dataclass(frozen=True, eq=False)
class PermanentEffects(RichDisplay):
    """Effects of permanent loads (and settlements) at the sections of a beam, stage by stage.

    ``frame``: a tidy table, one row per quantity, section, stage and load,
    with columns ``quantity`` (``"moment"``, ``"shear"``, ``"reaction"``,
    ``"deflection"``), ``x`` (float, the beam's length unit), ``side``
    (``"left"``, ``"right"`` or ``""``), ``stage``, ``load``, ``category`` and
    ``value`` in the beam's units (force·length for moments, force for
    shears and reactions, length for deflections), signs of
    :mod:`ilkit.model` (sagging moment positive, reactions upward,
    deflections downward).  Reactions have ``x`` at the support and side
    ``""``.  ``units`` is the beam's unit system (``None`` if it has none);
    ``notes`` say what the numbers do not show (a settlement of a
    determinate beam causes no forces, deflections left out without ``EI``).
    ``factors`` is empty: the values are unfactored (an
    :class:`~ilkit.design.Applied` with no factor; load factors are applied
    by the limit states).  ``name``: what the loads are of (empty when not
    given).
    """

    frame: pd.DataFrame = field(repr=False)
    units: UnitSystem | None
    stages: tuple[Stage, ...] = field(repr=False)
    sections: tuple[Section, ...] = field(repr=False)
    quantities: tuple[str, ...]
    notes: tuple[str, ...] = ()
    factors: Applied = field(default_factory=Applied)
    name: str = ""

    def __repr__(self) -> str:
        loads = sum(len(s.loads) for s in self.stages)
        stages = f"{len(self.stages)} stage{'s' if len(self.stages) != 1 else ''}, " if self.stages[0].name else ""
        units = f", units={self.units.name!r}" if self.units else ""
        return (
            f"PermanentEffects({stages}{loads} load{'s' if loads != 1 else ''}, categories "
            f"{', '.join(self.categories)}; {', '.join(self.quantities)} at {len(self.sections)} sections{units})"
        )

    @property
    def categories(self) -> tuple[str, ...]:
        """The load categories, in the order the loads were given."""
        return tuple(dict.fromkeys(load.category for s in self.stages for load in s.loads))

    def to_frame(self) -> pd.DataFrame:
        """The tidy table (a copy); see the class notes for its columns, units and signs."""
        return self.frame.copy()

    def by_category(self) -> pd.DataFrame:
        """One row per ``(quantity, x, side)``, one column per load category: the sum over stages and loads.

        Values in the beam's units with the signs of :mod:`ilkit.model`; the
        rows keep the order of the tidy table (quantity, then left to right).
        """
        import pandas as pd

        frame = self.frame
        keys = ["quantity", "x", "side"]
        if frame.empty:
            return pd.DataFrame(columns=[*keys, *self.categories])
        table = frame.pivot_table(index=keys, columns="category", values="value", aggfunc="sum", sort=False,
                                  fill_value=0.0)
        table = table.reindex(columns=list(self.categories), fill_value=0.0)
        out = table.reset_index()
        out.columns.name = None
        return out

    def value(
        self,
        quantity: EffectKind,
        at: object,
        side: Side | None = None,
        *,
        category: str | None = None,
        stage: str | None = None,
        load: str | None = None,
    ) -> float:
        """The sum of the effects on ``quantity`` at ``at`` (and ``side``), optionally of one ``category``,
        ``stage`` or ``load``; in the beam's units with the signs of :mod:`ilkit.model`.

        Where the quantity jumps at ``at`` (two faces in the table, with
        different values) the side must be named, as for
        :meth:`ilkit.Beam.shear`; where the table has one value for the
        section, a side given is accepted and gives it.
        """
        choice(quantity, self.quantities, what="value: quantity", field="quantity", error=LoadInputError)
        choice(side, ("left", "right"), what="value: side", field="side", error=LoadInputError, optional=True)
        beam = self.stages[0].beam
        pos = float(magnitude_in(at, dims=LENGTH, system=beam.units, field="at"))
        frame = self.frame
        rows = frame[(frame["quantity"] == quantity) & ((frame["x"] - pos).abs() <= float(tolerance(beam.length)))]
        for column, wanted in (("category", category), ("stage", stage), ("load", load)):
            if wanted is not None:
                if wanted not in set(frame[column]):
                    raise LoadInputError(
                        f"value: no {column} {wanted!r}; the {column}s are {sorted(set(frame[column]))}.",
                        field=column, value=wanted)
                rows = rows[rows[column] == wanted]
        if rows.empty:
            places = sorted(set(frame.loc[frame["quantity"] == quantity, "x"]))
            raise LoadInputError(
                f"value: no {quantity} at x={fmt(pos)} in these results; they have x = "
                f"{', '.join(fmt(p) for p in places[:12])}{' ...' if len(places) > 12 else ''}.",
                field="at", value=at)
        faces = set(rows["side"])
        if side is not None and side in faces:
            return float(rows.loc[rows["side"] == side, "value"].sum())
        if "" in faces:
            return float(rows.loc[rows["side"] == "", "value"].sum())
        left, right = (float(rows.loc[rows["side"] == s, "value"].sum()) for s in ("left", "right"))
        if abs(left - right) <= 1e-9 * max(abs(left), abs(right), 1e-300):
            return left
        raise SideRequiredError(
            f"value: the {quantity} jumps at x={fmt(pos)} ({fmt(left)} on the left face, {fmt(right)} on the right "
            f"face); name the side: value({quantity!r}, {fmt(pos)}, side='left') or side='right'."
        )


# ---------------------------------------------------------------- the effects
def permanent_effects(
    stages_or_beam: Beam | Stage | Sequence[Stage],
    loads: Sequence[PermanentLoad] | None = None,
    *,
    sections: Sequence[Section] | None = None,
    divisions: int = 10,
    at: Sequence[object] = (),
    quantities: Sequence[str] | None = None,
    name: str = "",
) -> PermanentEffects:
    """Moments, shears, reactions and deflections of permanent loads at the sections of a beam.

    Give a beam and its ``loads`` (one stage), or one :class:`Stage` or a
    list of them (their effects add; each stage's loads act on its own
    beam).  ``sections``: the sections (:func:`envelope_sections`); by
    default those of an envelope with ``divisions`` parts per span and the
    further positions ``at``.  ``quantities``: any of ``"moment"``,
    ``"shear"``, ``"reaction"``, ``"deflection"``; by default all four, with
    deflections left out (and a note saying so) when a stage's beam has no
    ``EI``.  Asking for deflections of a beam without ``EI`` raises
    :class:`ilkit.StiffnessRequiredError`, as do force effects of an
    indeterminate beam without it.

    Values are in the beam's units (force·length, force, length) with the
    signs of :mod:`ilkit.model`: sagging moment positive, shear positive when
    the part left of the section is pushed up, reactions upward, deflections
    downward.  See :class:`PermanentEffects` for the table.  ``name``: what the
    loads are of (``"interior girder"``), for headings and tables.
    """
    import pandas as pd

    from ilkit.design._inputs import text

    stages = _stages(stages_or_beam, loads)
    beam = stages[0].beam
    if sections is None:
        sections = envelope_sections(beam, divisions, at)
    else:
        sections = _read_sections(sections, beam)
    kinds, notes = _read_quantities(quantities, stages)
    parts = {id(stage): [(load, _applied(load, stage.beam)) for load in stage.loads] for stage in stages}
    points = {p.a for stage in stages for load, applied in parts[id(stage)] if not isinstance(load, Settlement)
              for p in applied if p.b is None}
    rows: list[dict[str, Any]] = []
    for kind in kinds:
        keys = _keys(kind, beam, sections, points)
        for stage in stages:
            for load, applied in parts[id(stage)]:
                for x, side in keys:
                    if isinstance(load, Settlement):
                        value = _settlement(stage.beam, kind, x, side, *applied)  # type: ignore[misc]
                    else:
                        line = stage.beam.line(kind, x, side)
                        value = sum((_effect(line, part, x, side) for part in applied), 0.0)
                    finite(value, what=f"{load.name}: the {kind} at x={fmt(x)}", why=OVERFLOW, field="loads",
                           error=LoadInputError)
                    rows.append({"quantity": kind, "x": float(x), "side": side or "", "stage": stage.name,
                                 "load": load.name, "category": load.category, "value": value})
    for stage in stages:
        for load in stage.loads:
            if isinstance(load, Settlement) and stage.beam.is_determinate:
                notes.append(
                    f"{load.name}: the beam is statically determinate, so the settlement moves it as a rigid body; "
                    "it causes no moment, shear or reaction (zero in the table)"
                    + (", only the rigid-body deflection." if "deflection" in kinds else ".")
                )
    frame = pd.DataFrame(rows, columns=["quantity", "x", "side", "stage", "load", "category", "value"])
    return PermanentEffects(frame, beam.units, stages, tuple(sections), kinds, tuple(notes),
                            name=text(name, "permanent_effects: name", empty=True))


def _read_sections(sections: object, beam: Beam) -> tuple[Section, ...]:
    items = listed(sections, wanted="sections: give a list of Section objects, e.g. envelope_sections(beam)",
                   field="sections", error=LoadInputError)
    out = []
    for item in items:
        if not isinstance(item, Section):
            raise LoadInputError(
                f"sections: each section must be a Section (see envelope_sections), got {type(item).__name__} "
                f"{item!r}.",
                field="sections",
                value=item,
            )
        out.append(Section(_on_beam(item.x, beam, "sections", "sections"), item.side))
    if not out:
        raise LoadInputError("sections: the list is empty; give at least one section, or leave sections out.",
                             field="sections", value=sections)
    return tuple(out)


def _read_quantities(quantities: object, stages: tuple[Stage, ...]) -> tuple[tuple[str, ...], list[str]]:
    notes: list[str] = []
    if quantities is None:
        if all(s.beam.EI is not None for s in stages):
            return QUANTITIES, notes
        notes.append("deflections are left out: a stage's beam has no EI (give Beam(..., EI=...) to have them).")
        return QUANTITIES[:3], notes
    if isinstance(quantities, str):
        quantities = (quantities,)
    items = listed(quantities, wanted="quantities: give a list such as ['moment', 'shear']", field="quantities",
                   error=LoadInputError)
    for q in items:
        choice(q, QUANTITIES, what="quantities: a quantity", field="quantities", error=LoadInputError)
    if not items:
        raise LoadInputError(f"quantities: the list is empty; choose from {list(QUANTITIES)}.", field="quantities")
    return tuple(q for q in QUANTITIES if q in items), notes


Key = tuple[Fraction, Side | None]


def _keys(kind: str, beam: Beam, sections: Sequence[Section], points: set[Fraction]) -> list[Key]:
    """The ``(x, side)`` rows of one quantity: the supports for reactions; the sections otherwise, with
    the shear on both faces of a section without a side where a point load stands."""
    if kind == "reaction":
        return [(s.at, None) for s in beam.supports]
    out: list[Key] = []
    for s in sections:
        if kind == "shear" and s.side is None and s.x in points and 0 < s.x < beam.length:
            out += [(s.x, "left"), (s.x, "right")]
        else:
            out.append((s.x, s.side))
    return list(dict.fromkeys(out))


def _applied(load: PermanentLoad, beam: Beam) -> Any:
    if isinstance(load, Settlement):
        return load._support(beam)
    return load._parts(beam)


def _effect(line: InfluenceLine, part: _Part, x: Fraction, side: Side | None) -> float:
    """Effect of one uniform stretch or point load on ``line``, the line of a quantity at ``(x, side)``."""
    if part.b is not None:
        return float(part.value) * line.integral(float(part.a), float(part.b))
    own = line.quantity.kind == "shear" and part.a == x
    if own:
        # the cut is just left of x on the left face (the load stands right of it), just right on the right face;
        # at the ends the one face is the inner one
        face = side or ("right" if x == 0 else "left")
        where: Side = "right" if face == "left" else "left"
        return float(part.value) * load_ordinate(line, float(x), where, own_section=True)
    return float(part.value) * load_ordinate(line, float(part.a), None)


def _settlement(beam: Beam, kind: str, x: Fraction, side: Side | None, at: Fraction, delta: Fraction) -> float:
    """Effect on ``kind`` at ``(x, side)`` of the bearing at ``at`` settling by ``delta`` (see the module notes)."""
    shape = beam.reaction(at)  # the deflected shape of a unit settlement of that bearing
    if isinstance(shape.origin, FloorLine):  # the girder's own shape, not the line of loads on its floor system
        shape = shape.origin.girder
    if kind == "deflection":
        return float(delta) * load_ordinate(shape, float(x), side)
    if beam.is_determinate:
        return 0.0
    if kind == "reaction":
        below = _derivative(beam, shape, x, "left", 3) if x > 0 else 0.0
        above = _derivative(beam, shape, x, "right", 3) if x < beam.length else 0.0
        return float(delta) * (below - above)  # the jump of the shear -EI v''' across the support
    if kind == "moment":
        if x in beam.hinges:
            return 0.0
        return -float(delta) * _derivative(beam, shape, x, side, 2)
    if x in beam.shear_releases:
        return 0.0
    return -float(delta) * _derivative(beam, shape, x, side, 3)


def _derivative(beam: Beam, shape: InfluenceLine, x: Fraction, side: Side | None, order: int) -> float:
    """``EI`` times the ``order``-th derivative of the cubic ``shape`` at ``x`` on ``side`` (the piece that
    ends at ``x`` for the left face, the one that starts there otherwise)."""
    pieces = shape.pieces
    xf = float(x)
    if side == "left" or xf >= pieces[-1].end:
        piece = next(p for p in pieces if p.start < xf <= p.end)
    else:
        piece = next(p for p in pieces if p.start <= xf < p.end)
    c = (*piece.coefficients, 0.0, 0.0, 0.0, 0.0)
    t = xf - piece.start
    value = 2 * c[2] + 6 * c[3] * t if order == 2 else 6 * c[3]
    mid = (Fraction(piece.start) + Fraction(piece.end)) / 2
    ei = next(ei for a, b, ei in beam.EI_ranges if a <= mid <= b)
    return float(ei) * value
