"""The beam model: geometry, supports, internal releases, stiffness and units.

Sign conventions (used by every result of ilkit):

* ``x`` is the position of the travelling load from the left end of the beam,
  in the beam's length unit; the unit load acts downward.
* Vertical reactions are positive upward; the moment reaction of a fixed
  support is positive counter-clockwise.
* Shear at a section is positive when the resultant of the forces on the part
  left of the section acts upward.
* Bending moment is positive when sagging.
* Deflection is positive downward; rotation is positive clockwise.
* Where a quantity jumps (shear at a support, moment at an interior fixed
  support) the caller names the side of the section: ``side="left"`` or
  ``side="right"``.

A :class:`Beam` is immutable: every input is checked before anything is
stored, and :meth:`Beam.replace` returns a new beam.
"""

from __future__ import annotations

from collections.abc import Iterable, Mapping
from fractions import Fraction
from functools import cached_property
from typing import TYPE_CHECKING, Any

from ilkit._check import choice, flag, listed
from ilkit._display import RichDisplay
from ilkit._exact import fmt_precise, is_quantity
from ilkit.errors import BeamInputError, SideRequiredError, UnitsError
from ilkit.positions import PANEL, RELEASE, STIFFNESS, SUPPORT, Point, merge_points, nearest, snap, tolerance
from ilkit.quantity import KINDS, Quantity, QuantityKind, Side
from ilkit.supports import Spring, Support, SupportKind, read_supports
from ilkit.units import FLEXURAL_STIFFNESS, LENGTH, QuantityLike, UnitSystem, conversion, magnitude_in, unit_system

if TYPE_CHECKING:  # pragma: no cover
    from ilkit.influence import InfluenceLine
    from ilkit.kinematics import Stability
    from ilkit.views.explorer import Explorer

__all__ = ["Beam", "Support", "SupportKind", "Spring", "StiffnessRange"]

_AT_SUPPORTS = ("reaction", "moment_reaction")

Number = int | float | str | Fraction | QuantityLike
"""A number in the beam's units, or (lengths and EI) a pint quantity converted into them."""
StiffnessRange = tuple[Fraction, Fraction, Fraction]
"""``(start, end, EI)``: flexural stiffness ``EI`` from ``start`` to ``end``."""


class Beam(RichDisplay):
    """A straight girder line under vertical loads.

    Parameters
    ----------
    length:
        Total length ``L`` (> 0), overhangs included, in the beam's length unit.
    supports:
        ``{position: kind}`` with kind ``"fixed"``, ``"pin"``, ``"roller"`` or
        an elastic support :class:`Spring` (``Spring(vertical=k)``,
        ``Spring(rotational=k)``); positions within ``0 <= x <= L``.
    hinges:
        Positions of internal moment releases (the hinge passes shear, no
        moment); strictly inside the beam.
    shear_releases:
        Positions of internal shear releases (pass moment, no shear; both sides
        keep equal slopes); strictly inside the beam.
    EI:
        Flexural stiffness (force x length²); needed for deflections and
        rotations and for indeterminate beams.  One number for a prismatic
        beam, or ranges ``[(start, end, EI), ...]`` that cover the beam from 0
        to ``L`` without gaps or overlaps (haunches, cover plates, cracked
        zones): the stiffness is constant within each range.
    units:
        Name of a consistent unit system (``"kN-m"``, ``"kip-ft"``, see
        :data:`ilkit.units.SYSTEMS`) or ``None``.
    panel_points:
        Positions of the floor beams when the load reaches the girder through
        a floor system (stringers spanning simply between floor beams), at
        least two, from 0 to ``L``; ``None`` (the default) when the load
        stands on the girder itself.  Every line of the beam is then straight
        between panel points and equal there to the girder's own ordinate, and
        0 beyond the first and the last panel point (no deck); see
        :mod:`ilkit.floor`.  The shear at an interior panel point jumps (by
        the floor beam's load): name the face with ``side``.

    Positions (supports, hinges, shear releases, ends of ``EI`` ranges, and
    the sections given to the quantity methods) that lie within
    :data:`ilkit.positions.MERGE_TOLERANCE` (1e-9) times the length of each
    other are one point: they are placed at the beam end if one of them is an
    end, else at the support, else at the release, so that positions typed as
    float arithmetic (``3.3*s`` beside ``2*s + 1.3*s``) make no phantom
    segment.  Where two supports or two releases would become one point the
    beam is refused with a :class:`~ilkit.BeamInputError` (see
    :mod:`ilkit.positions`).

    Numbers given as ints, fractions or decimal strings stay exact; floats are
    taken by their decimal text (``12.5`` is 25/2).  With pint installed,
    lengths (length, positions, EI ranges) and ``EI`` may be pint quantities
    (``30 * ureg.ft``): they are converted exactly into the declared
    ``units``; a quantity on a beam without ``units`` is a
    :class:`~ilkit.UnitsError`.  Plain numbers (and spring stiffnesses) are
    always taken in the declared units.
    """

    def __init__(
        self,
        length: Number,
        supports: Mapping[Number, str | Support],
        hinges: Iterable[Number] = (),
        shear_releases: Iterable[Number] = (),
        EI: Number | None = None,
        units: str | UnitSystem | None = None,
        panel_points: Iterable[Number] | None = None,
    ) -> None:
        system = unit_system(units)
        L = magnitude_in(length, dims=LENGTH, system=system, field="length")
        if L <= 0:
            raise BeamInputError(
                f"length: must be greater than 0, got {length!r}; give the total length of the beam.",
                field="length",
                value=length,
            )
        given_supports = read_supports(supports, L, system)
        given_hinges = _read_positions(hinges, L, "hinges", system)
        given_shear = _read_positions(shear_releases, L, "shear_releases", system)
        given_ei = _read_ei(EI, L, system)
        given_panels = None if panel_points is None else _read_positions(panel_points, L, "panel_points", system)
        points = _given_points(given_supports, given_hinges, given_shear, given_ei)
        points += [Point(p, PANEL, "the panel point", "panel_points") for p in given_panels or ()]
        moved = merge_points(L, points)
        support_list = [Support(moved.get(s.at, s.at), s.kind, s.spring) for s in given_supports]
        hinge_list = _check_releases(given_hinges, moved, L, "hinges", support_list)
        shear_list = _check_releases(given_shear, moved, L, "shear_releases", support_list)
        _check_release_overlap(hinge_list, shear_list, support_list)
        ei = _check_ei(given_ei, moved, L, EI)
        panels = None if given_panels is None else _check_panels(given_panels, moved, shear_list)

        object.__setattr__(self, "_length", L)
        object.__setattr__(self, "_supports", tuple(support_list))
        object.__setattr__(self, "_hinges", tuple(at for _, at in hinge_list))
        object.__setattr__(self, "_shear_releases", tuple(at for _, at in shear_list))
        object.__setattr__(self, "_EI", ei)
        object.__setattr__(self, "_units", system)
        object.__setattr__(self, "_panel_points", panels)
        object.__setattr__(self, "_lines", {})
        object.__setattr__(self, "_models", {})  # stiffness models (float, exact), see ilkit.stiffness
        self.stability.raise_if_unstable()

    # ---------------------------------------------------------------- immutability
    def __setattr__(self, name: str, value: Any) -> None:
        if name in type(self).__dict__ and isinstance(type(self).__dict__[name], cached_property):
            object.__setattr__(self, name, value)
            return
        raise AttributeError(f"Beam is immutable; use beam.replace({name}=...) to get a changed copy.")

    def replace(self, **changes: Any) -> Beam:
        """A new beam with some constructor arguments changed.

        Changing ``units`` from one declared system to another is refused: the
        stored numbers would silently change meaning.  Use :meth:`in_units` to
        convert them.
        """
        args: dict[str, Any] = {
            "length": self._length,
            "supports": {s.at: s.spec for s in self._supports},
            "hinges": self._hinges,
            "shear_releases": self._shear_releases,
            "EI": self._EI,
            "units": self._units,
            "panel_points": self._panel_points,
        }
        unknown = set(changes) - set(args)
        if unknown:
            raise BeamInputError(
                f"replace: unknown argument(s) {sorted(unknown)}; choose from {sorted(args)}.",
                field="replace",
                value=sorted(unknown),
            )
        new_units = unit_system(changes["units"]) if "units" in changes else self.units
        if self.units is not None and new_units is not None and new_units != self.units:
            raise UnitsError(
                f"replace: the beam's numbers are in {self.units.name!r}; changing units to "
                f"{new_units.name!r} would reinterpret them. Convert with beam.in_units({new_units.name!r}), "
                "or build a new Beam with the numbers in the new units.",
                field="units",
                value=changes["units"],
            )
        args.update(changes)
        return Beam(**args)

    def in_units(self, units: str | UnitSystem) -> Beam:
        """The same beam with every number converted exactly into another unit system.

        Lengths scale by the ratio of the length units, ``EI`` by
        force x length², vertical springs by force / length, rotational
        springs by force x length.  The beam must declare its units.
        """
        target = unit_system(units)
        if self.units is None or target is None:
            raise UnitsError(
                "in_units: the beam declares no unit system, so its numbers cannot be converted; "
                "declare it first with beam.replace(units='kN-m') (or the system the numbers are in).",
                field="units",
                value=units,
            )
        length, force = conversion(self.units, target)

        def spec(s: Support) -> str | Spring:
            if s.spring is None:
                return s.kind
            v, r = s.spring.vertical, s.spring.rotational
            return Spring(
                vertical=v if isinstance(v, str) else v * force / length,
                rotational=r if isinstance(r, str) else r * force * length,
            )

        return Beam(
            length=self.length * length,
            supports={s.at * length: spec(s) for s in self.supports},
            hinges=[h * length for h in self.hinges],
            shear_releases=[h * length for h in self.shear_releases],
            EI=[(a * length, b * length, ei * force * length**2) for a, b, ei in self.EI_ranges] or None,
            units=target,
            panel_points=None if self.panel_points is None else [p * length for p in self.panel_points],
        )

    # ------------------------------------------------------------------ properties
    @property
    def length(self) -> Fraction:
        """Total length of the beam."""
        return self._length  # type: ignore[attr-defined, no-any-return]

    @property
    def supports(self) -> tuple[Support, ...]:
        """Supports, left to right."""
        return self._supports  # type: ignore[attr-defined, no-any-return]

    @property
    def hinges(self) -> tuple[Fraction, ...]:
        """Positions of internal hinges (moment releases), left to right."""
        return self._hinges  # type: ignore[attr-defined, no-any-return]

    @property
    def shear_releases(self) -> tuple[Fraction, ...]:
        """Positions of internal shear releases, left to right."""
        return self._shear_releases  # type: ignore[attr-defined, no-any-return]

    @property
    def EI(self) -> Fraction | tuple[StiffnessRange, ...] | None:
        """Flexural stiffness: one number for a prismatic beam, ranges ``((start, end, EI), ...)``
        where it varies, or ``None`` when not given."""
        return self._EI  # type: ignore[attr-defined, no-any-return]

    @property
    def EI_ranges(self) -> tuple[StiffnessRange, ...]:
        """Flexural stiffness as ranges ``((start, end, EI), ...)`` covering the beam; empty without EI."""
        ei = self.EI
        if ei is None:
            return ()
        if isinstance(ei, Fraction):
            return ((Fraction(0), self.length, ei),)
        return ei

    @property
    def panel_points(self) -> tuple[Fraction, ...] | None:
        """Positions of the floor beams, left to right, when the load reaches the girder through a floor
        system (``None`` when it stands on the girder itself); see :mod:`ilkit.floor`."""
        return self._panel_points  # type: ignore[attr-defined, no-any-return]

    @property
    def units(self) -> UnitSystem | None:
        """The declared unit system, or ``None``."""
        return self._units  # type: ignore[attr-defined, no-any-return]

    @property
    def releases(self) -> tuple[tuple[Fraction, str], ...]:
        """All internal releases as ``(position, "hinge" | "shear release")``, left to right."""
        out = [(h, "hinge") for h in self.hinges] + [(s, "shear release") for s in self.shear_releases]
        return tuple(sorted(out))

    @property
    def parts(self) -> tuple[tuple[Fraction, Fraction], ...]:
        """The rigid-body parts between internal releases, as ``(start, end)``."""
        cuts = [p for p, _ in self.releases]
        bounds = [Fraction(0), *cuts, self.length]
        return tuple(zip(bounds[:-1], bounds[1:]))

    @property
    def spans(self) -> tuple[tuple[Fraction, Fraction], ...]:
        """Spans between consecutive supports, as ``(start, end)`` (overhangs excluded)."""
        xs = [s.at for s in self.supports]
        return tuple(zip(xs[:-1], xs[1:]))

    @cached_property
    def stability(self) -> Stability:
        """Stability and determinacy of the beam (see :class:`ilkit.kinematics.Stability`)."""
        from ilkit.kinematics import analyse_stability

        return analyse_stability(self)

    @property
    def degree(self) -> int:
        """Degree of static indeterminacy (0 for a determinate beam)."""
        return self.stability.degree

    @property
    def is_determinate(self) -> bool:
        """True when the beam is statically determinate."""
        return self.stability.degree == 0

    def __repr__(self) -> str:
        sup = ", ".join(f"{fmt_precise(s.at)}: {s.spec!r}" for s in self.supports)
        parts = [f"length={fmt_precise(self.length)}", f"supports={{{sup}}}"]
        if self.hinges:
            parts.append(f"hinges=[{', '.join(fmt_precise(h) for h in self.hinges)}]")
        if self.shear_releases:
            parts.append(f"shear_releases=[{', '.join(fmt_precise(h) for h in self.shear_releases)}]")
        if isinstance(self.EI, Fraction):
            parts.append(f"EI={fmt_precise(self.EI)}")
        elif self.EI is not None:
            ranges = ", ".join(f"({fmt_precise(a)}, {fmt_precise(b)}, {fmt_precise(ei)})" for a, b, ei in self.EI)
            parts.append(f"EI=[{ranges}]")
        if self.units is not None:
            parts.append(f"units={self.units.name!r}")
        if self.panel_points is not None:
            parts.append(f"panel_points=[{', '.join(fmt_precise(p) for p in self.panel_points)}]")
        return f"Beam({', '.join(parts)})"

    def __eq__(self, other: object) -> bool:
        if not isinstance(other, Beam):
            return NotImplemented
        return self._key() == other._key()

    def __hash__(self) -> int:
        return hash(self._key())

    def _key(self) -> tuple[Any, ...]:
        return (self.length, self.supports, self.hinges, self.shear_releases, self.EI, self.units, self.panel_points)

    # ------------------------------------------------------------- influence lines
    # Every quantity method takes ``exact``: ``exact=True`` asks for the exact
    # rational line (pieces with Fraction coefficients, ``line.expr`` a sympy
    # Piecewise with rationals).  Lines of force quantities of determinate
    # beams are always exact; the others (indeterminate beams, deflections,
    # rotations) are float lines unless ``exact=True``.  Exact arithmetic is
    # meant for small beams: its cost grows quickly with the number of spans.

    def reaction(self, at: Number, *, exact: bool = False) -> InfluenceLine:
        """Influence line of the vertical reaction (positive upward) of the support at ``at``.

        For a spring support it is the spring force.
        """
        pos = self._support_at(at, "reaction")
        return self._line("reaction", pos, None, exact)

    def moment_reaction(self, at: Number, *, exact: bool = False) -> InfluenceLine:
        """Influence line of the moment reaction (positive counter-clockwise) of the fixed support at ``at``.

        Ordinates in force x length per unit load (kN·m/kN).  For a support with
        a rotational spring it is the spring moment.
        """
        pos = self._support_at(at, "moment_reaction")
        if not any(s.at == pos and s.restrains_rotation for s in self.supports):
            fixed = [s.at for s in self.supports if s.restrains_rotation]
            hint = _nearest_words(pos, fixed, "fixed support") if fixed else "this beam has no fixed support"
            raise BeamInputError(
                f"moment_reaction: the support at x={fmt_precise(pos)} is not fixed ({hint}); "
                "only a fixed support (or one with a rotational spring) has a moment reaction.",
                field="at",
                value=at,
            )
        return self._line("moment_reaction", pos, None, exact)

    def shear(self, at: Number, side: Side | None = None, *, exact: bool = False) -> InfluenceLine:
        """Influence line of the shear at the section ``at``.

        Positive when the forces on the part left of the section add up to an
        upward resultant; ordinates in force per unit load (kN/kN).  At an interior support the shear jumps: name the
        face with ``side="left"`` or ``side="right"``.  At the beam ends the
        inner face is taken.
        """
        pos = self._position(at, "shear")
        side = self._side(pos, side, "shear", jumps=self._has_support(pos) or self._is_panel_point(pos))
        return self._line("shear", pos, side, exact)

    def moment(self, at: Number, side: Side | None = None, *, exact: bool = False) -> InfluenceLine:
        """Influence line of the bending moment (sagging positive) at the section ``at``.

        Ordinates in force x length per unit load (kN·m/kN).  Identically zero
        at a hinge.  At an interior support that restrains
        rotation (fixed, rotational spring) the moment jumps: name the face
        with ``side``.
        """
        pos = self._position(at, "moment")
        jumps = any(s.at == pos and s.restrains_rotation for s in self.supports)
        side = self._side(pos, side, "moment", jumps=jumps)
        return self._line("moment", pos, side, exact)

    def deflection(self, at: Number, side: Side | None = None, *, exact: bool = False) -> InfluenceLine:
        """Influence line of the deflection (positive downward) at the point ``at``.

        The ordinate at ``x`` is the deflection at ``at`` caused by a unit
        downward load at ``x`` (length per unit force); by Maxwell's theorem it
        is also the deflected shape of the beam under a unit load at ``at``.
        Needs ``EI``.  At a shear release the deflection jumps: name the face
        with ``side``.
        """
        pos = self._position(at, "deflection")
        side = self._side(pos, side, "deflection", jumps=pos in self.shear_releases)
        return self._line("deflection", pos, side, exact)

    def rotation(self, at: Number, side: Side | None = None, *, exact: bool = False) -> InfluenceLine:
        """Influence line of the rotation (positive clockwise, radians) at the point ``at``.

        The ordinate at ``x`` is the rotation at ``at`` caused by a unit
        downward load at ``x`` (radians per unit force); it is also the
        deflected shape under a unit clockwise couple at ``at``.  Needs ``EI``.
        At a hinge the rotation jumps: name the face with ``side``.
        """
        pos = self._position(at, "rotation")
        side = self._side(pos, side, "rotation", jumps=pos in self.hinges)
        return self._line("rotation", pos, side, exact)

    def hinge_shear(self, at: Number, side: Side | None = None, *, exact: bool = False) -> InfluenceLine:
        """Influence line of the shear force passed through the hinge at ``at``.

        Same sign convention as :meth:`shear`.  Where a support stands under
        the hinge, name the face with ``side``.
        """
        pos = self._position(at, "hinge_shear")
        if pos not in self.hinges:
            hint = _nearest_words(pos, list(self.hinges), "hinge") if self.hinges else "the beam has no hinge"
            raise BeamInputError(
                f"hinge_shear: there is no hinge at x={fmt_precise(pos)} ({hint}); "
                "use beam.shear(x) for a section that is not a hinge.",
                field="at",
                value=at,
            )
        side = self._side(pos, side, "hinge_shear", jumps=self._has_support(pos) or self._is_panel_point(pos))
        return self._line("hinge_shear", pos, side, exact)

    # ------------------------------------------------------- quantities by name
    def line(self, kind: str, at: Number, side: Side | None = None, *, exact: bool = False) -> InfluenceLine:
        """Influence line of the quantity named ``kind`` at ``at``: the same as calling
        the method of that name (``beam.line("moment", 12)`` is ``beam.moment(12)``).

        ``kind`` is one of :data:`ilkit.quantity.KINDS`.  Quantities that need no
        side (reactions) accept only ``side=None``.  Units and signs are those of
        the method (see :mod:`ilkit.model`).
        """
        method = self._method(kind)
        if kind in _AT_SUPPORTS:
            if side is not None:
                raise BeamInputError(
                    f"{kind}: a support reaction has no side; leave side out (got side={side!r}).",
                    field="side",
                    value=side,
                )
            return method(at, exact=exact)  # type: ignore[no-any-return]
        return method(at, side=side, exact=exact)  # type: ignore[no-any-return]

    def position(self, at: Number) -> Fraction:
        """The section ilkit takes for ``at`` (exact, in the beam's length unit).

        ``at`` itself, or the beam's end, support, release or change of ``EI``
        that lies within :data:`ilkit.positions.MERGE_TOLERANCE` times the
        length of it: ``beam.position(10 / 3)`` is ``Fraction(10, 3)`` on a
        beam with a support at 10/3.  The quantity methods take their sections
        this way; use it to tell whether a section is a support
        (``beam.position(x) in beam.locations("reaction")``).  A position off the
        beam is an error.
        """
        return self._position(at, "position")

    def locations(self, kind: str) -> tuple[Fraction, ...] | None:
        """Where the quantity named ``kind`` can be taken.

        The positions of the supports for ``"reaction"``, of the supports that
        restrain rotation for ``"moment_reaction"``, of the hinges for
        ``"hinge_shear"`` (empty when there are none); ``None`` for quantities
        that exist at any section from 0 to ``L`` (shear, moment, deflection,
        rotation).
        """
        self._method(kind)
        if kind == "reaction":
            return tuple(s.at for s in self.supports)
        if kind == "moment_reaction":
            return tuple(s.at for s in self.supports if s.restrains_rotation)
        if kind == "hinge_shear":
            return self.hinges
        return None

    def explore(self, loads: Any = None, **options: Any) -> Explorer:
        """Open the interactive influence-line explorer of this beam in a notebook.

        ``loads`` are the load models offered besides the unit load (one model,
        a list, or a ``{name: model}`` mapping); ``options`` go to
        :class:`ilkit.views.explorer.Explorer`.  Needs the ``notebook`` extra
        (``pip install 'ilkit[notebook]'``).
        """
        from ilkit.views.explorer import Explorer

        return Explorer(self, loads, **options)

    def _method(self, kind: str) -> Any:
        if not isinstance(kind, str) or kind not in KINDS or not hasattr(self, kind):
            choices = ", ".join(repr(k) for k in KINDS if hasattr(self, k))
            raise BeamInputError(
                f"quantity: unknown kind {kind!r}; choose one of {choices}.", field="kind", value=kind
            )
        return getattr(self, kind)

    # --------------------------------------------------------------------- helpers
    def _line(self, kind: QuantityKind, pos: Fraction, side: Side | None, exact: bool) -> InfluenceLine:
        exact = flag(exact, what="exact", field="exact")
        key = (kind, pos, side, exact)
        cache: dict[Any, InfluenceLine] = self._lines  # type: ignore[attr-defined]
        line = cache.get(key)
        if line is None:
            from ilkit.analysis import influence_line

            line = influence_line(self, Quantity(kind, pos, side), exact=exact)
            if self.panel_points is not None:
                from ilkit.floor import through_floor

                line = through_floor(line, self.panel_points, beam=self)
            cache[key] = line
        return line

    @cached_property
    def _points(self) -> tuple[Fraction, ...]:
        """Every point of the beam, left to right: ends, supports, releases and changes of ``EI``."""
        points = {Fraction(0), self.length, *(s.at for s in self.supports), *self.hinges, *self.shear_releases}
        points.update(x for a, b, _ in self.EI_ranges for x in (a, b))
        points.update(self.panel_points or ())
        return tuple(sorted(points))

    def _position(self, at: Number, what: str) -> Fraction:
        """A section as given, moved onto the beam's point within the merge tolerance of it
        (:mod:`ilkit.positions`)."""
        pos = magnitude_in(at, dims=LENGTH, system=self.units, field=f"{what} position")
        pos = snap(pos, self._points, self.length)
        if pos < 0 or pos > self.length:
            raise BeamInputError(
                f"{what}: x={fmt_precise(pos)} is off the beam; give a position from 0 to "
                f"{fmt_precise(self.length)}.",
                field="at",
                value=at,
            )
        return pos

    def _support_at(self, at: Number, what: str) -> Fraction:
        pos = self._position(at, what)
        if not self._has_support(pos):
            raise BeamInputError(
                f"{what}: there is no support at x={fmt_precise(pos)}; "
                f"{_nearest_words(pos, [s.at for s in self.supports], 'support')}.",
                field="at",
                value=at,
            )
        return pos

    def _has_support(self, pos: Fraction) -> bool:
        return any(s.at == pos for s in self.supports)

    def _is_panel_point(self, pos: Fraction) -> bool:
        return self.panel_points is not None and pos in self.panel_points

    def _point_name(self, pos: Fraction) -> str:
        """What stands at ``pos`` in words (for messages)."""
        if self._has_support(pos):
            return "the support"
        if pos in self.hinges:
            return "the hinge"
        return "the shear release" if pos in self.shear_releases else "the floor beam"

    def _side(self, pos: Fraction, side: Side | None, what: str, *, jumps: bool) -> Side | None:
        choice(side, ("left", "right"), what=f"{what}: side", field="side", optional=True)
        if pos == 0 or pos == self.length:
            inner: Side = "right" if pos == 0 else "left"
            if side is not None and side != inner:
                raise BeamInputError(
                    f"{what}: x={fmt_precise(pos)} is an end of the beam; there is no beam on its {side} "
                    f"side. Leave side out or give side={inner!r}.",
                    field="side",
                    value=side,
                )
            return inner if jumps else None
        if jumps and side is None:
            raise SideRequiredError(
                f"{what}: the {what.replace('_', ' ')} jumps at {self._point_name(pos)} at x={fmt_precise(pos)}; "
                "say which face you mean with side='left' or side='right'."
            )
        return side if jumps else None


def _nearest_words(pos: Fraction, places: list[Fraction], name: str) -> str:
    """``the nearest support is at x=..., ... away; supports are at x=...`` at full precision."""
    near = nearest(pos, sorted(places))
    assert near is not None
    listed = ", ".join(fmt_precise(p) for p in places)
    return (
        f"the nearest {name} is at x={fmt_precise(near)}, {fmt_precise(abs(near - pos))} away ({name}s are at "
        f"x={listed}); give the position of a {name}"
    )


Given = tuple[Fraction, Fraction]
"""A position as read, exact, and where it stands after merging: ``(given, at)``."""
GivenRange = tuple[Fraction, Fraction, Fraction, object]
"""An ``EI`` range as read: ``(start, end, EI, the item as given)``."""


def _at(given: Fraction, at: Fraction) -> str:
    """``x=...`` for a message, saying where a merged position came from."""
    if given == at:
        return f"x={fmt_precise(at)}"
    return f"x={fmt_precise(given)} (within the merge tolerance of x={fmt_precise(at)}, so taken as that point)"


def _read_positions(values: Iterable[Number], L: Fraction, field: str, system: UnitSystem | None) -> list[Fraction]:
    """Release (or panel point) positions as given (exact); off the beam beyond the merge tolerance is refused."""
    positions = listed(values, wanted=f"{field}: give a list of positions, e.g. [12.5]", field=field, ordered=False)
    name = {"hinges": "hinge", "shear_releases": "shear release"}.get(field, "panel point")
    tol = tolerance(L)
    out: list[Fraction] = []
    for raw in positions:
        pos = magnitude_in(raw, dims=LENGTH, system=system, field=f"{field} position")
        if pos < -tol or pos > L + tol:
            raise BeamInputError(
                f"{field}: the {name} at x={raw!r} is off the beam; "
                + (f"panel points lie from 0 to {fmt_precise(L)}." if field == "panel_points" else
                   f"releases must lie strictly between 0 and {fmt_precise(L)}."),
                field=field,
                value=raw,
            )
        if pos in out:
            raise BeamInputError(f"{field}: two {name}s at x={fmt_precise(pos)}; keep one.", field=field, value=raw)
        out.append(pos)
    return out


def _given_points(
    supports: list[Support], hinges: list[Fraction], shear: list[Fraction], ei: Fraction | list[GivenRange] | None
) -> list[Point]:
    """Every position of the beam as given, for merging (:mod:`ilkit.positions`)."""
    points = [Point(s.at, SUPPORT, "the support", "supports") for s in supports]
    points += [Point(h, RELEASE, "the hinge", "hinges") for h in hinges]
    points += [Point(h, RELEASE, "the shear release", "shear_releases") for h in shear]
    if isinstance(ei, list):
        points += [Point(x, STIFFNESS, "the end of an EI range", "EI") for a, b, _, _ in ei for x in (a, b)]
    return points


def _check_panels(given: list[Fraction], moved: dict[Fraction, Fraction], shear: list[Given]) -> tuple[Fraction, ...]:
    """Merged panel points, left to right: at least two, none at a shear release, no two at one point."""
    out: list[Fraction] = []
    for raw in given:
        pos = moved.get(raw, raw)
        if pos in out:
            raise BeamInputError(
                f"panel_points: two panel points at {_at(raw, pos)}; keep one.", field="panel_points", value=raw
            )
        out.append(pos)
    if len(out) < 2:
        raise BeamInputError(
            f"panel_points: give at least two floor beams (the stringers span between them), got {len(out)}; "
            "e.g. panel_points=[0, 8, 16, 24, 32], or leave panel_points out for a load on the girder itself.",
            field="panel_points",
            value=given,
        )
    slides = {at for _, at in shear}
    for pos in out:
        if pos in slides:
            raise BeamInputError(
                f"panel_points: a floor beam at the shear release at x={fmt_precise(pos)} loads one side of it or "
                "the other; move the panel point off the release.",
                field="panel_points",
                value=pos,
            )
    return tuple(sorted(out))


def _check_releases(
    given: list[Fraction], moved: dict[Fraction, Fraction], L: Fraction, field: str, supports: list[Support]
) -> list[Given]:
    """Merged release positions, left to right; a release at an end of the beam is refused."""
    name = "hinge" if field == "hinges" else "shear release"
    out: list[Given] = []
    for raw in given:
        pos = moved.get(raw, raw)
        if pos in (0, L):
            where = _at(raw, pos)
            if any(s.at == pos and s.restrains_rotation for s in supports):
                raise BeamInputError(
                    f"{field}: a {name} at the fixed end {where} would leave the fixity undefined; use a 'pin' "
                    f"support there instead of a fixed support and a {name}.",
                    field=field,
                    value=raw,
                )
            raise BeamInputError(
                f"{field}: a {name} at the end {where} of the beam releases nothing; remove it (releases must lie "
                f"strictly between 0 and {fmt_precise(L)}).",
                field=field,
                value=raw,
            )
        out.append((raw, pos))
    return sorted(out, key=lambda g: g[1])


def _check_release_overlap(hinges: list[Given], shear_releases: list[Given], supports: list[Support]) -> None:
    slides = {at: raw for raw, at in shear_releases}
    for raw, at in hinges:
        if at in slides:
            raise BeamInputError(
                f"hinges/shear_releases: a hinge at {_at(raw, at)} and a shear release at {_at(slides[at], at)} "
                "would cut the beam in two; move one of them or remove one.",
                field="shear_releases",
                value=at,
            )
    for s in supports:
        for raw, at in hinges:
            if s.restrains_rotation and at == s.at:
                raise BeamInputError(
                    f"hinges: a hinge at the fixed support {_at(raw, at)} leaves the fixity undefined; use a 'pin' "
                    "support there instead, or move the hinge off the support.",
                    field="hinges",
                    value=s.at,
                )
        if s.at in slides:
            raise BeamInputError(
                f"shear_releases: a shear release at the support {_at(slides[s.at], s.at)} leaves it unclear which "
                "side the support carries; move the release off the support.",
                field="shear_releases",
                value=s.at,
            )


def _read_ei(EI: object, L: Fraction, system: UnitSystem | None) -> Fraction | list[GivenRange] | None:
    """One positive number, or the ranges ``(start, end, EI)`` as given (checked after merging)."""
    if EI is None:
        return None
    if isinstance(EI, Mapping):
        raise BeamInputError(
            "EI: give one number, or a list of ranges [(start, end, EI), ...], e.g. "
            "[(0, 18, 2.1e6), (18, 22, 3.4e6), (22, 40, 2.1e6)].",
            field="EI",
            value=EI,
        )
    if is_quantity(EI) or isinstance(EI, (str, bytes)) or not isinstance(EI, Iterable) or getattr(EI, "ndim", 1) == 0:
        return _positive_ei(EI, EI, system)
    tol = tolerance(L)
    ranges: list[GivenRange] = []
    for item in EI:
        listlike = isinstance(item, Iterable) and not isinstance(item, (str, bytes)) and getattr(item, "ndim", 1) == 1
        triple = list(item) if listlike else []
        if len(triple) != 3:
            raise BeamInputError(
                f"EI: each range must be (start, end, EI), got {item!r}; e.g. [(0, 18, 2.1e6), (18, 40, 3.4e6)].",
                field="EI",
                value=item,
            )
        raw_a, raw_b, raw_ei = triple
        a = magnitude_in(raw_a, dims=LENGTH, system=system, field="EI range start")
        b = magnitude_in(raw_b, dims=LENGTH, system=system, field="EI range end")
        if not -tol <= a < b <= L + tol:
            raise BeamInputError(
                f"EI: the range ({raw_a!r}, {raw_b!r}) must have 0 <= start < end <= {fmt_precise(L)} "
                "(the beam's length).",
                field="EI",
                value=item,
            )
        ranges.append((a, b, _positive_ei(raw_ei, item, system), item))
    if not ranges:
        raise BeamInputError(
            "EI: the list of ranges is empty; give [(0, L, EI)] or leave EI out.", field="EI", value=EI
        )
    return ranges


def _check_ei(
    given: Fraction | list[GivenRange] | None, moved: dict[Fraction, Fraction], L: Fraction, raw: object
) -> Fraction | tuple[StiffnessRange, ...] | None:
    """Merged ``EI`` ranges covering ``0..L`` without gaps or overlaps (merged where equal); ``raw`` is
    the ``EI`` argument as given."""
    if not isinstance(given, list):
        return given
    ranges: list[StiffnessRange] = []
    for a, b, ei, item in given:
        start, end = moved.get(a, a), moved.get(b, b)
        if start == end:
            raise BeamInputError(
                f"EI: the range {item!r} is shorter than the merge tolerance ({fmt_precise(tolerance(L))}); its ends "
                "are one point. Remove it, or give it a real length.",
                field="EI",
                value=item,
            )
        ranges.append((start, end, ei))
    ranges.sort()
    reach = Fraction(0)
    for a, b, _ in ranges:
        if a > reach:
            raise BeamInputError(
                f"EI: no stiffness is given from x={fmt_precise(reach)} to x={fmt_precise(a)}; add a range "
                f"({fmt_precise(reach)}, {fmt_precise(a)}, EI) so that the ranges cover the beam from 0 to "
                f"{fmt_precise(L)}.",
                field="EI",
                value=raw,
            )
        if a < reach:
            raise BeamInputError(
                f"EI: two ranges overlap from x={fmt_precise(a)} to x={fmt_precise(min(b, reach))}; each point of "
                "the beam must lie in exactly one range.",
                field="EI",
                value=raw,
            )
        reach = b
    if reach != L:
        raise BeamInputError(
            f"EI: no stiffness is given from x={fmt_precise(reach)} to x={fmt_precise(L)}; add a range "
            f"({fmt_precise(reach)}, {fmt_precise(L)}, EI) so that the ranges cover the whole beam.",
            field="EI",
            value=raw,
        )
    merged: list[StiffnessRange] = [ranges[0]]
    for a, b, ei in ranges[1:]:
        if ei == merged[-1][2]:
            merged[-1] = (merged[-1][0], b, ei)
        else:
            merged.append((a, b, ei))
    if len(merged) == 1:
        return merged[0][2]
    return tuple(merged)


def _positive_ei(raw: object, given: object, system: UnitSystem | None) -> Fraction:
    value = magnitude_in(raw, dims=FLEXURAL_STIFFNESS, system=system, field="EI")
    if value <= 0:
        raise BeamInputError(
            f"EI: flexural stiffness must be greater than 0, got {raw!r}; give E times I in "
            "force x length² of the beam's units.",
            field="EI",
            value=given,
        )
    return value
