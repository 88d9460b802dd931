"""Supports of a beam: rigid (fixed, pin, roller) and elastic (:class:`Spring`).

Positions are in the beam's length unit; spring stiffnesses in force per unit
settlement (vertical) and moment per radian (rotational) of the beam's units.
"""

from __future__ import annotations

from collections.abc import Mapping
from dataclasses import dataclass
from fractions import Fraction
from typing import Any, Literal

from ilkit._check import choice
from ilkit._exact import fmt, fmt_precise, to_exact
from ilkit.errors import BeamInputError
from ilkit.positions import tolerance
from ilkit.units import LENGTH, QuantityLike, UnitSystem, magnitude_in

__all__ = ["Spring", "Support", "SupportKind", "SUPPORT_KINDS", "read_supports"]

SupportKind = Literal["fixed", "pin", "roller", "spring"]
SUPPORT_KINDS: tuple[str, ...] = ("fixed", "pin", "roller")
"""Support kinds that can be named by a string (a spring support is a :class:`Spring`)."""

Number = int | float | str | Fraction | QuantityLike


@dataclass(frozen=True, init=False)
class Spring:
    """An elastic support: a bearing whose vertical restraint, rotational restraint or both yield.

    Parameters
    ----------
    vertical:
        Stiffness of the vertical spring, force per unit settlement (e.g.
        kN/m), or ``"rigid"`` (the default) for a bearing that does not settle.
    rotational:
        Stiffness of the rotational spring, moment per radian (e.g. kN·m/rad),
        ``"free"`` (the default) for a support free to rotate, or ``"rigid"``
        for full fixity.

    ``Spring(vertical=5000)`` is an elastic bearing free to rotate;
    ``Spring(rotational=2e5)`` a pin whose rotation is partly restrained;
    ``Spring(vertical=5000, rotational="rigid")`` a fixed end that settles.
    The spring force is the reaction (positive upward), the spring moment the
    moment reaction (positive counter-clockwise).
    """

    vertical: Fraction | Literal["rigid"]
    rotational: Fraction | Literal["rigid", "free"]

    def __init__(
        self,
        vertical: Number | Literal["rigid"] = "rigid",
        rotational: Number | Literal["rigid", "free"] = "free",
    ) -> None:
        v = _read_spring_stiffness(vertical, "vertical", ("rigid",))
        r = _read_spring_stiffness(rotational, "rotational", ("rigid", "free"))
        if v == "rigid" and r in ("rigid", "free"):
            plain = "fixed" if r == "rigid" else "pin"
            raise BeamInputError(
                f"Spring: vertical={vertical!r}, rotational={rotational!r} has no spring in it; it is a "
                f"{plain!r} support. Write {plain!r}, or give vertical= or rotational= a stiffness.",
                field="Spring",
                value=(vertical, rotational),
            )
        object.__setattr__(self, "vertical", v)
        object.__setattr__(self, "rotational", r)

    def __repr__(self) -> str:
        args = []
        if self.vertical != "rigid":
            args.append(f"vertical={_fmt_stiffness(self.vertical)}")
        if self.rotational != "free":
            args.append(f"rotational={_fmt_stiffness(self.rotational)}")
        return f"Spring({', '.join(args)})"


def _fmt_stiffness(value: Fraction | str) -> str:
    return repr(value) if isinstance(value, str) else fmt(value)


def _read_spring_stiffness(value: object, field: str, words: tuple[str, ...]) -> Fraction | Any:
    if isinstance(value, str) and value.strip().lower() in ("rigid", "free"):
        word = value.strip().lower()
        if word not in words:  # vertical="free"
            raise BeamInputError(
                f"Spring: {field}={value!r}: a support free to move vertically carries no load; remove "
                "the support, or give the vertical spring stiffness (force per unit settlement).",
                field=f"Spring.{field}",
                value=value,
            )
        return word
    k = to_exact(value, field=f"Spring {field} stiffness")
    if k <= 0:
        unit = "force per unit settlement" if field == "vertical" else "moment per radian"
        default = "'rigid'" if field == "vertical" else "'free'"
        raise BeamInputError(
            f"Spring: {field} stiffness must be greater than 0, got {value!r}; give it in {unit} of the "
            f"beam's units, or leave it out ({default}).",
            field=f"Spring.{field}",
            value=value,
        )
    return k


@dataclass(frozen=True)
class Support:
    """A support at position ``at`` (beam length unit).

    ``"pin"`` and ``"roller"`` both restrain vertical movement (for the
    vertical loads ilkit deals with they act alike: common practice);
    ``"fixed"`` also restrains rotation; ``"spring"`` is an elastic support
    described by ``spring``.
    """

    at: Fraction
    kind: SupportKind
    spring: Spring | None = None

    def __post_init__(self) -> None:
        object.__setattr__(self, "at", to_exact(self.at, field="Support.at"))
        choice(self.kind, (*SUPPORT_KINDS, "spring"), what="Support: kind", field="Support.kind")
        if (self.kind == "spring") != isinstance(self.spring, Spring):
            raise BeamInputError(
                f"Support: kind={self.kind!r} with spring={self.spring!r}; a 'spring' support needs "
                "spring=ilkit.Spring(...), and only a 'spring' support takes one. In a Beam, write the kind "
                "('pin') or the Spring itself.",
                field="Support.spring",
                value=self.spring,
            )

    @property
    def restrains_rotation(self) -> bool:
        """True for a fixed support and for a support with a rotational spring or fixity."""
        if self.spring is not None:
            return self.spring.rotational != "free"
        return self.kind == "fixed"

    @property
    def vertical_stiffness(self) -> Fraction | None:
        """Stiffness of a vertical spring; ``None`` for a rigid bearing."""
        if self.spring is None or self.spring.vertical == "rigid":
            return None
        return self.spring.vertical

    @property
    def rotational_stiffness(self) -> Fraction | None:
        """Stiffness of a rotational spring; ``None`` when rotation is free or fully fixed."""
        if self.spring is None or isinstance(self.spring.rotational, str):
            return None
        return self.spring.rotational

    @property
    def spec(self) -> str | Spring:
        """The support as the ``supports`` argument of :class:`Beam` takes it."""
        return self.spring if self.spring is not None else self.kind



def read_supports(
    supports: Mapping[Number, str | Support], L: Fraction, system: UnitSystem | None
) -> list[Support]:
    """The supports as given, left to right; positions within the merge tolerance of the beam
    (:mod:`ilkit.positions`) are accepted here and merged by the beam."""
    if not isinstance(supports, Mapping):
        raise BeamInputError(
            "supports: give a mapping {position: kind}, e.g. {0: 'pin', 20: 'roller'}.",
            field="supports",
            value=supports,
        )
    out: dict[Fraction, Support] = {}
    tol = tolerance(L)
    for raw_pos, raw_kind in supports.items():
        pos = magnitude_in(raw_pos, dims=LENGTH, system=system, field="supports position")
        if pos < -tol or pos > L + tol:
            raise BeamInputError(
                f"supports: the support at x={raw_pos!r} is off the beam; positions must lie "
                f"from 0 to {fmt_precise(L)}.",
                field="supports",
                value=raw_pos,
            )
        spring: Spring | None = None
        if isinstance(raw_kind, Support):
            if raw_kind.at != pos:
                raise BeamInputError(
                    f"supports: the Support at key x={fmt_precise(pos)} says at={fmt_precise(raw_kind.at)}; "
                    "give the same position, or write the kind alone ({position: 'pin'}).",
                    field="supports",
                    value=raw_kind,
                )
            kind, spring = raw_kind.kind, raw_kind.spring
        elif isinstance(raw_kind, Spring):
            kind, spring = "spring", raw_kind
        elif isinstance(raw_kind, str) and raw_kind.strip().lower() in SUPPORT_KINDS:
            kind = raw_kind.strip().lower()  # type: ignore[assignment]
        else:
            hint = (
                "; for an elastic support give ilkit.Spring(vertical=..., rotational=...)"
                if isinstance(raw_kind, str) and "spring" in raw_kind.lower()
                else " or an ilkit.Spring(...)"
            )
            raise BeamInputError(
                f"supports: unknown support kind {raw_kind!r} at x={fmt_precise(pos)}; "
                f"choose one of {', '.join(repr(k) for k in SUPPORT_KINDS)}{hint}.",
                field="supports",
                value=raw_kind,
            )
        if pos in out:
            raise BeamInputError(
                f"supports: two supports at x={fmt_precise(pos)}; keep one (use 'fixed' for a support "
                "that also restrains rotation).",
                field="supports",
                value=raw_pos,
            )
        out[pos] = Support(pos, kind, spring)
    if not out:
        raise BeamInputError(
            "supports: the beam has no support; add some, e.g. {0: 'pin', 20: 'roller'}.",
            field="supports",
            value=supports,
        )
    return sorted(out.values(), key=lambda s: s.at)
