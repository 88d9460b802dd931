"""Combinations of moving loads with factors, and load models made of alternative combinations.

A :class:`Combination` adds the extremes of its parts, each part placed
independently where it is worst (a design lane load beside a design truck),
with a dynamic allowance on some parts only and a factor on the whole
(multiple presence, distribution, a 90 % rule).  A :class:`LoadModel` holds
alternative combinations; its extreme is the governing one.
"""

from __future__ import annotations

from collections.abc import Sequence
from dataclasses import dataclass
from typing import Literal, get_args

from ilkit._check import choice, listed
from ilkit._display import RichDisplay
from ilkit._exact import fmt
from ilkit.errors import LoadInputError
from ilkit.loads.primitives import (
    AxleTrain,
    KnifeEdge,
    Load,
    UniformBlocks,
    UniformLoad,
    number,
    read_name,
    read_units,
)
from ilkit.units import UnitSystem

__all__ = ["AppliesTo", "Combination", "LoadModel", "as_model"]

AppliesTo = Literal["all", "negative moment and interior reactions"]
"""Where a combination is considered: everywhere, or only for negative bending moment
between points of contraflexure and for reactions at interior supports (AASHTO LRFD
3.6.1.3.1)."""

_PRIMITIVES = (AxleTrain, UniformLoad, UniformBlocks, KnifeEdge)


@dataclass(frozen=True, repr=False)
class Combination:
    """Loads acting together, each placed where it is worst, with factors.

    Parameters
    ----------
    name:
        Name used in results (the governing case).
    parts:
        Primitive loads (:class:`AxleTrain`, :class:`UniformLoad`,
        :class:`UniformBlocks`, :class:`KnifeEdge`) with distinct names.  All
        are converted to the units of the first.
    dynamic_allowance:
        Fraction added to the parts named in ``dynamic_on`` (0.33 adds 33 %).
    dynamic_on:
        Names of the parts that get the dynamic allowance.
    factor:
        Factor on the whole (multiple presence, distribution, 0.90 ...), > 0.
    applies_to:
        ``"all"`` or ``"negative moment and interior reactions"``.
    """

    name: str
    parts: tuple[Load, ...]
    dynamic_allowance: float
    dynamic_on: tuple[str, ...]
    factor: float
    applies_to: AppliesTo

    def __init__(
        self,
        name: str,
        parts: Sequence[Load],
        *,
        dynamic_allowance: float = 0.0,
        dynamic_on: Sequence[str] = (),
        factor: float = 1.0,
        applies_to: AppliesTo = "all",
    ) -> None:
        name = read_name(name, "Combination")
        if isinstance(parts, _PRIMITIVES):
            parts = (parts,)
        if not isinstance(parts, Sequence) or isinstance(parts, str) or not parts:
            raise LoadInputError(f"{name}: give the parts as a list of loads, got {parts!r}.", field="parts")
        for p in parts:
            if not isinstance(p, _PRIMITIVES):
                raise LoadInputError(
                    f"{name}: a part must be an AxleTrain, UniformLoad, UniformBlocks or KnifeEdge, got {p!r}.",
                    field="parts",
                    value=p,
                )
        names = [p.name for p in parts]
        repeated = sorted({n for n in names if names.count(n) > 1})
        if repeated:
            raise LoadInputError(
                f"{name}: parts must have distinct names; {repeated} appear more than once. Rename one "
                "(e.g. AxleTrain(..., name='second truck')).",
                field="parts",
                value=repeated,
            )
        if isinstance(dynamic_on, str):
            dynamic_on = (dynamic_on,)
        dynamic_on = listed(
            dynamic_on,
            wanted=f"{name}: dynamic_on: give the names of the parts that get the dynamic allowance, e.g. {names[:1]}",
            field="dynamic_on",
            error=LoadInputError,
        )
        unknown = [n for n in dynamic_on if not isinstance(n, str) or n not in names]
        if unknown:
            raise LoadInputError(
                f"{name}: dynamic_on names {unknown}, which are not parts; the parts are {names}.",
                field="dynamic_on",
                value=unknown,
            )
        allowance = number(dynamic_allowance, "dynamic_allowance", strict=False)
        if allowance and not dynamic_on:
            raise LoadInputError(
                f"{name}: a dynamic allowance of {fmt(allowance)} is given but dynamic_on names no part; "
                f"name the parts it applies to, from {names}.",
                field="dynamic_on",
            )
        choice(applies_to, get_args(AppliesTo), what=f"{name}: applies_to", field="applies_to", error=LoadInputError)
        units = parts[0].units
        object.__setattr__(self, "name", name)
        object.__setattr__(self, "parts", tuple(p.converted(units) for p in parts))
        object.__setattr__(self, "dynamic_allowance", allowance)
        object.__setattr__(self, "dynamic_on", tuple(dynamic_on))
        object.__setattr__(self, "factor", number(factor, "factor"))
        object.__setattr__(self, "applies_to", applies_to)

    @property
    def units(self) -> UnitSystem:
        """Unit system of the parts."""
        return self.parts[0].units

    def part_factor(self, part: Load) -> float:
        """Factor on one part: ``(1 + dynamic allowance if it applies) x factor``."""
        dynamic = 1.0 + self.dynamic_allowance if part.name in self.dynamic_on else 1.0
        return dynamic * self.factor

    def __repr__(self) -> str:
        extra = ""
        if self.dynamic_on:
            extra += f", dynamic_allowance={fmt(self.dynamic_allowance)}, dynamic_on={list(self.dynamic_on)}"
        if self.factor != 1.0:
            extra += f", factor={fmt(self.factor)}"
        if self.applies_to != "all":
            extra += f", applies_to={self.applies_to!r}"
        parts = ", ".join(p.name for p in self.parts)
        return f"Combination({self.name!r}, [{parts}]{extra})"

    def converted(self, units: str | UnitSystem) -> Combination:
        """The same combination in another unit system."""
        system = read_units(units, self.name)
        if system == self.units:
            return self
        return Combination(
            self.name,
            [p.converted(system) for p in self.parts],
            dynamic_allowance=self.dynamic_allowance,
            dynamic_on=self.dynamic_on,
            factor=self.factor,
            applies_to=self.applies_to,
        )


@dataclass(frozen=True, repr=False)
class LoadModel(RichDisplay):
    """A published (or user) load model: alternative combinations, the worst of which governs.

    Where the model comes from, as plain data (calculation sheets print it):
    ``source`` names the document and its clauses; ``edition`` the edition
    the values were checked against (empty: not recorded, and the licensed
    current edition governs); ``from_memory`` lists the values recalled
    rather than read in a copy of the standard, each with its clause, to be
    checked before use; ``notes`` holds any further remark.
    """

    name: str
    cases: tuple[Combination, ...]
    source: str = ""
    notes: str = ""
    edition: str = ""
    from_memory: tuple[str, ...] = ()

    def __init__(
        self,
        name: str,
        cases: Sequence[Combination],
        *,
        source: str = "",
        notes: str = "",
        edition: str = "",
        from_memory: Sequence[str] = (),
    ) -> None:
        name = read_name(name, "LoadModel")
        if isinstance(cases, Combination):
            cases = (cases,)
        if (
            not isinstance(cases, Sequence)
            or isinstance(cases, str)
            or not cases
            or not all(isinstance(c, Combination) for c in cases)
        ):
            raise LoadInputError(
                f"{name}: give the cases as a list of Combination objects, got {cases!r}.", field="cases", value=cases
            )
        if not any(c.applies_to == "all" for c in cases):
            raise LoadInputError(
                f"{name}: every case is limited to {cases[0].applies_to!r}; add a case with applies_to='all'.",
                field="cases",
            )
        names = [c.name for c in cases]
        if len(set(names)) != len(names):
            raise LoadInputError(f"{name}: cases must have distinct names, got {names}.", field="cases")
        units = cases[0].units
        object.__setattr__(self, "name", name)
        object.__setattr__(self, "cases", tuple(c.converted(units) for c in cases))
        object.__setattr__(self, "source", str(source))
        object.__setattr__(self, "notes", str(notes))
        object.__setattr__(self, "edition", str(edition))
        recalled = listed(
            (from_memory,) if isinstance(from_memory, str) else from_memory,
            wanted=f"{name}: give from_memory as texts, e.g. ['tandem spacing 1.2 m (4.3.2)']",
            field="from_memory",
            error=LoadInputError,
        )
        if not all(isinstance(item, str) for item in recalled):
            raise LoadInputError(
                f"{name}: from_memory lists texts (the values recalled, with their clauses), got {recalled!r}.",
                field="from_memory",
                value=from_memory,
            )
        object.__setattr__(self, "from_memory", tuple(recalled))

    @property
    def units(self) -> UnitSystem:
        """Unit system of the model's numbers."""
        return self.cases[0].units

    def __repr__(self) -> str:
        cases = ", ".join(repr(c.name) for c in self.cases)
        return f"LoadModel({self.name!r}, cases=[{cases}], units={self.units.name!r})"

    def converted(self, units: str | UnitSystem) -> LoadModel:
        """The same model in another unit system (exact factors)."""
        system = read_units(units, self.name)
        if system == self.units:
            return self
        return LoadModel(
            self.name,
            [c.converted(system) for c in self.cases],
            source=self.source,
            notes=self.notes,
            edition=self.edition,
            from_memory=self.from_memory,
        )


def as_model(load: Load | Combination | LoadModel) -> LoadModel:
    """Any load as a load model (a primitive is a combination of one part)."""
    if isinstance(load, LoadModel):
        return load
    if isinstance(load, Combination):
        return LoadModel(load.name, (load,))
    if isinstance(load, _PRIMITIVES):
        return LoadModel(load.name, (Combination(load.name, (load,)),))
    raise LoadInputError(
        f"expected a load (AxleTrain, UniformLoad, UniformBlocks, KnifeEdge), a Combination or a LoadModel, "
        f"got {type(load).__name__} {load!r}.",
        field="load",
        value=load,
    )
