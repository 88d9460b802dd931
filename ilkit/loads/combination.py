"""Combinations of moving loads with factors, and load models made of alternative combinations.

A :class:`Combination` adds the extremes of its parts, each part placed
independently where it is worst (a design lane load beside a design truck),
with a dynamic effect on some parts only and a factor on the whole
(multiple presence, distribution, a 90 % rule).  A :class:`LoadModel` holds
alternative combinations; its extreme is the governing one.

The dynamic effect a combination contains is explicit data
(:class:`DynamicEffect`, ``combination.dynamic``): an allowance added to
named parts (AASHTO IM, AREMA impact), a factor on named parts (EN 1991-2
Φ), dynamic amplification included in the load values (EN 1991-2 LM1, LM2),
or none.  Every extreme found says which (``Extreme.dynamic``).
"""

from __future__ import annotations

from collections.abc import Sequence
from dataclasses import dataclass
from typing import Literal, get_args

from ilkit._check import choice, flag, listed
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

__all__ = ["AppliesTo", "Combination", "DynamicEffect", "DynamicKind", "LoadModel", "as_model"]

AppliesTo = Literal["all", "negative moment and interior reactions"]
"""Where a combination is considered: everywhere, or only for negative bending moment
between points of contraflexure and for reactions at interior supports (AASHTO LRFD
3.6.1.3.1)."""

_PRIMITIVES = (AxleTrain, UniformLoad, UniformBlocks, KnifeEdge)

DynamicKind = Literal["allowance", "factor", "included", "none"]
"""The kinds of dynamic effect a combination can contain: an ``"allowance"`` added to named parts
(1 + IM), a ``"factor"`` on named parts (Φ), ``"included"`` in the load values, or ``"none"``."""


@dataclass(frozen=True)
class DynamicEffect:
    """The dynamic effect contained in the values of a combination (``combination.dynamic``).

    ``kind`` is one of :data:`DynamicKind`.  ``value`` is the allowance as a
    fraction for ``"allowance"`` (0.33 adds 33 %), the factor for
    ``"factor"`` (Φ = 1.12 multiplies by 1.12), and 0 otherwise.  ``on`` names
    the parts it applies to (empty for ``"included"`` and ``"none"``).
    ``str()`` gives the short form shown in tables, to four significant
    figures (``"dynamic allowance 33 %"``), :attr:`words` the long one (``"dynamic allowance 33 % on design
    truck"``).  Dimensionless.
    """

    kind: DynamicKind
    value: float = 0.0
    on: tuple[str, ...] = ()

    def multiplier(self, part: str) -> float:
        """The factor on the part named ``part`` (dimensionless): 1 + allowance, Φ, or 1."""
        if part not in self.on:
            return 1.0
        return 1.0 + self.value if self.kind == "allowance" else self.value if self.kind == "factor" else 1.0

    def of(self, part: str) -> str:
        """What one part's effect contains, in short words (``"none"`` for a part it does not apply to)."""
        if self.kind in ("allowance", "factor") and part not in self.on:
            return "none"
        return str(self)

    def __str__(self) -> str:
        if self.kind == "allowance":
            return f"dynamic allowance {100 * self.value:.4g} %"
        if self.kind == "factor":
            return f"dynamic factor {self.value:.4g}"
        if self.kind == "included":
            return "dynamic effect included in the load values"
        return "no dynamic effect"

    @property
    def words(self) -> str:
        """The long form: the short form and the parts it applies to."""
        return f"{self} on {', '.join(self.on)}" if self.on else str(self)


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
        Fraction added to the parts named in ``dynamic_on`` (0.33 adds 33 %:
        AASHTO IM, AREMA impact).
    dynamic_factor:
        Factor (at least 1) on the parts named in ``dynamic_on`` (EN 1991-2
        Φ2 or Φ3).  A combination has an allowance or a factor, not both.
    dynamic_on:
        Names of the parts that get the dynamic allowance or factor.
    dynamic_included:
        True when the load values already include dynamic amplification (EN
        1991-2 LM1 and LM2); then no allowance or factor may be given.
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
    dynamic_factor: float
    dynamic_included: bool

    def __init__(
        self,
        name: str,
        parts: Sequence[Load],
        *,
        dynamic_allowance: float = 0.0,
        dynamic_factor: float = 1.0,
        dynamic_on: Sequence[str] = (),
        dynamic_included: bool = False,
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
        phi = number(dynamic_factor, "dynamic_factor", minimum=1.0, strict=False)
        included = flag(dynamic_included, what=f"{name}: dynamic_included", field="dynamic_included",
                        error=LoadInputError)
        for given, words in ((allowance, f"a dynamic allowance of {fmt(allowance)}"),
                             (phi != 1.0, f"a dynamic factor of {fmt(phi)}")):
            if given and not dynamic_on:
                raise LoadInputError(
                    f"{name}: {words} is given but dynamic_on names no part; name the parts it applies to, "
                    f"from {names}.",
                    field="dynamic_on",
                )
        if allowance and phi != 1.0:
            raise LoadInputError(
                f"{name}: both a dynamic allowance ({fmt(allowance)}) and a dynamic factor ({fmt(phi)}) are given; "
                "a combination contains one dynamic effect: give one of them (the factor of an allowance IM is "
                "1 + IM).",
                field="dynamic_factor",
                value=dynamic_factor,
            )
        if included and (allowance or phi != 1.0):
            raise LoadInputError(
                f"{name}: dynamic_included=True says the load values already contain the dynamic effect, so no "
                "dynamic allowance or factor may be added; leave them out, or set dynamic_included=False.",
                field="dynamic_included",
                value=dynamic_included,
            )
        choice(applies_to, get_args(AppliesTo), what=f"{name}: applies_to", field="applies_to", error=LoadInputError)
        units = parts[0].units
        object.__setattr__(self, "name", name)
        object.__setattr__(self, "parts", tuple(p.converted(units) for p in parts))
        object.__setattr__(self, "dynamic_allowance", allowance)
        object.__setattr__(self, "dynamic_on", tuple(dynamic_on))
        object.__setattr__(self, "factor", number(factor, "factor"))
        object.__setattr__(self, "applies_to", applies_to)
        object.__setattr__(self, "dynamic_factor", phi)
        object.__setattr__(self, "dynamic_included", included)

    @property
    def units(self) -> UnitSystem:
        """Unit system of the parts."""
        return self.parts[0].units

    @property
    def dynamic(self) -> DynamicEffect:
        """The dynamic effect this combination's values contain (an allowance, a factor, included, none)."""
        if self.dynamic_allowance:
            return DynamicEffect("allowance", self.dynamic_allowance, self.dynamic_on)
        if self.dynamic_factor != 1.0:
            return DynamicEffect("factor", self.dynamic_factor, self.dynamic_on)
        return DynamicEffect("included" if self.dynamic_included else "none")

    def part_factor(self, part: Load) -> float:
        """Factor on one part (dimensionless): its dynamic multiplier (1 + allowance, Φ or 1) x ``factor``."""
        return self.dynamic.multiplier(part.name) * self.factor

    def __repr__(self) -> str:
        extra = ""
        if self.dynamic_allowance:
            extra += f", dynamic_allowance={fmt(self.dynamic_allowance)}, dynamic_on={list(self.dynamic_on)}"
        if self.dynamic_factor != 1.0:
            extra += f", dynamic_factor={fmt(self.dynamic_factor)}, dynamic_on={list(self.dynamic_on)}"
        if self.dynamic_included:
            extra += ", dynamic_included=True"
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
            dynamic_factor=self.dynamic_factor,
            dynamic_on=self.dynamic_on,
            dynamic_included=self.dynamic_included,
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

    @property
    def dynamic(self) -> str:
        """The dynamic effects the model's cases contain, in words, e.g. ``"dynamic allowance 33 % on design
        truck, design tandem (not on design lane)"``; cases with the same effect are listed together."""
        groups: dict[str, list[str]] = {}
        without: list[str] = []
        for case in self.cases:
            d = case.dynamic
            groups.setdefault(str(d), [])
            groups[str(d)] += [n for n in d.on if n not in groups[str(d)]]
            if d.kind in ("allowance", "factor"):
                without += [p.name for p in case.parts if p.name not in d.on and p.name not in without]
        out = "; ".join(f"{k} on {', '.join(on)}" if on else k for k, on in groups.items())
        without = [n for n in without if not any(n in on for on in groups.values())]
        return f"{out} (not on {', '.join(without)})" if without else out

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
