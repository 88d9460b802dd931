"""The truss model: joints, members, supports, the deck, axial stiffness and units.

Sign conventions:

* A member force ``N`` is positive in tension, negative in compression.
* Support reactions are vertical, positive upward (a pin also holds
  horizontally; under the vertical loads of a deck its horizontal reaction
  is zero on a truss with one pin).
* The travelling unit load acts downward on the deck.  The deck runs along
  the loaded chord (``deck="bottom"`` for a through truss, ``"top"`` for a
  deck truss); it rests on floor beams at the deck's joints (the panel
  points), the stringers spanning simply between them (:mod:`ilkit.floor`),
  so every influence line is straight between panel points.
* The deck coordinate ``x`` is measured horizontally from the left support
  (from the first panel point where the deck starts further left, on a
  cantilevered deck), in the truss's length unit.

A :class:`Truss` is immutable: every input is checked before anything is
stored.  Coordinates given as ints, fractions or decimal strings stay exact;
floats are taken by their decimal text.
"""

from __future__ import annotations

from collections.abc import Mapping, Sequence
from fractions import Fraction
from functools import cached_property
from typing import TYPE_CHECKING, Any, Literal

from ilkit._check import choice, listed
from ilkit._display import RichDisplay
from ilkit._exact import fmt, fmt_precise
from ilkit.errors import BeamInputError, TrussInputError, UnitsError, UnstableTrussError
from ilkit.units import FORCE, LENGTH, UnitSystem, magnitude_in, unit_system

if TYPE_CHECKING:  # pragma: no cover
    from ilkit.influence import InfluenceLine
    from ilkit.trusses.lines import Solution
    from ilkit.trusses.statics import Layout, TrussStability
    from ilkit.views.truss_explorer import TrussExplorer

__all__ = ["Truss", "SUPPORT_KINDS", "DECKS"]

SUPPORT_KINDS: tuple[str, ...] = ("pin", "roller")
"""Supports of a truss: a ``"pin"`` holds a joint both ways, a ``"roller"`` only vertically."""

DECKS: tuple[str, ...] = ("bottom", "top")
"""The chord that carries the deck, when it is not given as a list of joints."""

Point = tuple[Fraction, Fraction]


def _number(value: object, *, dims: tuple[int, int], system: UnitSystem | None, field: str) -> Fraction:
    """A number (or a pint quantity) in the truss's units; bad input is a :class:`TrussInputError`."""
    try:
        return magnitude_in(value, dims=dims, system=system, field=field)
    except UnitsError:
        raise
    except BeamInputError as err:
        raise TrussInputError(str(err), field=field.split(" ")[0], value=value) from None


def _name(value: object, what: str, field: str) -> str:
    if not isinstance(value, str) or not value.strip():
        raise TrussInputError(
            f"{field}: {what} names must be non-empty text such as 'L0' or 'U3', got {value!r}.",
            field=field,
            value=value,
        )
    return value.strip()


class Truss(RichDisplay):
    """A plane pin-jointed truss loaded through a deck at its panel points.

    Parameters
    ----------
    joints:
        ``{name: (x, y)}``: the joints and their coordinates (length unit;
        ``y`` upward).  Names are text (``"L0"``, ``"U3"``).
    members:
        The bars, each joining two joints: a list of pairs
        ``[("L0", "L1"), ...]`` (named ``"L0-L1"``) or a mapping
        ``{name: (joint, joint)}``.
    supports:
        ``{joint: kind}``: ``"pin"`` (holds both ways) or ``"roller"`` (holds
        vertically, rolls horizontally).
    deck:
        Where the deck is: ``"bottom"`` (a through truss: the joints of the
        lowest chord), ``"top"`` (a deck truss: the joints of the highest
        chord), or the list of deck joints.  The floor beams stand at these
        joints (the panel points), left to right, at distinct ``x``.
    EA:
        Axial stiffness (force unit): one number for every member or a
        mapping ``{member: EA}`` covering every member.  Needed for
        statically indeterminate trusses (stiffness method); a determinate
        truss's forces follow from statics alone.
    units:
        A unit system (``"kN-m"``, ``"kip-ft"`` ...; :data:`ilkit.units.SYSTEMS`)
        or ``None``; with it, coordinates and ``EA`` may be pint quantities,
        and load models can be placed on the lines.
    roles:
        Optional ``{member: words}`` (``"top chord"``, ``"diagonal"`` ...) for
        tables and drawings; the layouts of :mod:`ilkit.trusses` set them.
        Members not named get ``"vertical"``, ``"chord"`` (horizontal) or
        ``"diagonal"`` from their direction.

    A truss that can move as a mechanism is refused with
    :class:`~ilkit.UnstableTrussError` naming the joints that move and the
    members that turn; other bad input raises :class:`~ilkit.TrussInputError`.
    Sign conventions: see :mod:`ilkit.trusses.model`.
    """

    def __init__(
        self,
        joints: Mapping[str, Sequence[Any]],
        members: Sequence[Sequence[str]] | Mapping[str, Sequence[str]],
        supports: Mapping[str, str],
        deck: str | Sequence[str] = "bottom",
        *,
        EA: Any = None,
        units: str | UnitSystem | None = None,
        roles: Mapping[str, str] | None = None,
    ) -> None:
        system = unit_system(units)
        points = _read_joints(joints, system)
        bars = _read_members(members, points)
        held = _read_supports(supports, points)
        deck_joints = _read_deck(deck, points)
        stiffness = _read_ea(EA, bars, system)
        role_of = _read_roles(roles, bars, points)
        loose = [j for j in points if not any(j in ends for ends in bars.values())]
        if loose:
            raise TrussInputError(
                f"joints: {', '.join(loose)} {'is' if len(loose) == 1 else 'are'} joined by no member; remove "
                f"{'it' if len(loose) == 1 else 'them'} or add the members that meet there.",
                field="joints",
                value=loose,
            )
        store = object.__setattr__
        store(self, "_joints", points)
        store(self, "_members", bars)
        store(self, "_supports", held)
        store(self, "_deck", deck_joints)
        store(self, "_deck_given", deck if isinstance(deck, str) else tuple(deck_joints))
        store(self, "_EA", stiffness)
        store(self, "_units", system)
        store(self, "_roles", role_of)
        store(self, "_lines", {})
        stability = self.stability
        if not stability.is_stable:
            raise UnstableTrussError(
                stability.message, joints=stability.joints, members=stability.members, motions=stability.motions
            )
        if stability.degree > 0 and stiffness is None:
            raise TrussInputError(
                f"EA: the truss is statically indeterminate (degree {stability.degree}: "
                f"{stability.degree} member force{'s' if stability.degree > 1 else ''} or reaction"
                f"{'s' if stability.degree > 1 else ''} beyond what statics fixes), so its forces depend on the "
                "members' axial stiffness; give EA (one number, or {member: EA}) in the truss's force unit.",
                field="EA",
                value=None,
            )

    # ---------------------------------------------------------------- immutability
    def __setattr__(self, name: str, value: Any) -> None:
        if name in type(self).__dict__ and isinstance(type(self).__dict__[name], cached_property):
            object.__setattr__(self, name, value)
            return
        raise AttributeError("Truss is immutable; build a new Truss with the changed inputs.")

    # ------------------------------------------------------------------ properties
    @property
    def joints(self) -> Mapping[str, Point]:
        """Joint coordinates ``{name: (x, y)}`` (exact, length unit, ``y`` upward)."""
        return dict(self._joints)  # type: ignore[attr-defined]

    @property
    def members(self) -> Mapping[str, tuple[str, str]]:
        """Members ``{name: (joint, joint)}``, in the order given."""
        return dict(self._members)  # type: ignore[attr-defined]

    @property
    def supports(self) -> Mapping[str, str]:
        """Supports ``{joint: "pin" | "roller"}``."""
        return dict(self._supports)  # type: ignore[attr-defined]

    @property
    def deck(self) -> tuple[str, ...]:
        """The deck joints (panel points), left to right."""
        return self._deck  # type: ignore[attr-defined, no-any-return]

    @property
    def EA(self) -> Mapping[str, Fraction] | None:
        """Axial stiffness of each member (force unit), or ``None`` when not given."""
        ea = self._EA  # type: ignore[attr-defined]
        return None if ea is None else dict(ea)

    @property
    def units(self) -> UnitSystem | None:
        """The declared unit system, or ``None``."""
        return self._units  # type: ignore[attr-defined, no-any-return]

    @property
    def roles(self) -> Mapping[str, str]:
        """What each member is (``"top chord"``, ``"diagonal"`` ...), by name."""
        return dict(self._roles)  # type: ignore[attr-defined]

    @cached_property
    def origin(self) -> Fraction:
        """The ``x`` coordinate of the joints where the deck coordinate is 0: the left support, or the
        first panel point where the deck starts further left."""
        left_support = min(self._joints[j][0] for j in self._supports)  # type: ignore[attr-defined]
        return min(left_support, self._joints[self.deck[0]][0])  # type: ignore[attr-defined, no-any-return]

    @cached_property
    def panel_points(self) -> tuple[Fraction, ...]:
        """Deck positions ``x`` of the panel points (the deck joints), left to right."""
        return tuple(self.deck_x(j) for j in self.deck)

    @cached_property
    def length(self) -> Fraction:
        """Length of the deck coordinate: from 0 to the last panel point or the right support, whichever is
        further right (length unit)."""
        right = max(self._joints[j][0] for j in self._supports)  # type: ignore[attr-defined]
        return max(right, self._joints[self.deck[-1]][0]) - self.origin  # type: ignore[attr-defined, no-any-return]

    def deck_x(self, joint: str) -> Fraction:
        """The deck coordinate ``x`` of a joint (its horizontal distance from the deck's origin)."""
        return self._joints[self._joint(joint, "deck_x")][0] - self.origin  # type: ignore[attr-defined, no-any-return]

    def member_length(self, member: str) -> float:
        """Length of a member (length unit)."""
        a, b = self._members[self._member(member, "member_length")]  # type: ignore[attr-defined]
        (xa, ya), (xb, yb) = self._joints[a], self._joints[b]  # type: ignore[attr-defined]
        return float((xb - xa) ** 2 + (yb - ya) ** 2) ** 0.5

    @cached_property
    def layout(self) -> Layout:
        """The numbers of the truss as the statics use them (:class:`ilkit.trusses.statics.Layout`)."""
        from ilkit.trusses.statics import Layout

        names = tuple(sorted(self._joints, key=lambda j: (self._joints[j][0], self._joints[j][1])))  # type: ignore[attr-defined]
        index = {n: k for k, n in enumerate(names)}
        members = tuple(
            (name, index[a], index[b])
            for name, (a, b) in sorted(
                self._members.items(),  # type: ignore[attr-defined]
                key=lambda item: min(self._joints[item[1][0]][0], self._joints[item[1][1]][0]),  # type: ignore[attr-defined]
            )
        )
        reactions: list[tuple[int, str]] = []
        for joint in names:
            kind = self._supports.get(joint)  # type: ignore[attr-defined]
            if kind == "pin":
                reactions.append((index[joint], "x"))
            if kind is not None:
                reactions.append((index[joint], "y"))
        return Layout(names, tuple(self._joints[n] for n in names), members, tuple(reactions))  # type: ignore[attr-defined]

    @cached_property
    def stability(self) -> TrussStability:
        """Stability and determinacy (:class:`ilkit.trusses.TrussStability`)."""
        from ilkit.trusses.statics import analyse

        return analyse(self.layout)

    @property
    def degree(self) -> int:
        """Degree of static indeterminacy (0 for a determinate truss)."""
        return self.stability.degree

    @property
    def is_determinate(self) -> bool:
        """True when the truss is statically determinate."""
        return self.stability.degree == 0

    def __repr__(self) -> str:
        deck = self._deck_given  # type: ignore[attr-defined]
        deck_words = repr(deck) if isinstance(deck, str) else f"[{', '.join(deck)}]"
        sup = ", ".join(f"{j!r}: {k!r}" for j, k in self._supports.items())  # type: ignore[attr-defined]
        units = f", units={self.units.name!r}" if self.units is not None else ""
        return (
            f"Truss({len(self._joints)} joints, {len(self._members)} members, "  # type: ignore[attr-defined]
            f"supports={{{sup}}}, deck={deck_words}, span {fmt_precise(self.length)}{units})"
        )

    def __eq__(self, other: object) -> bool:
        if not isinstance(other, Truss):
            return NotImplemented
        return self._key() == other._key()

    def __hash__(self) -> int:
        return hash(self._key())

    def _key(self) -> tuple[Any, ...]:
        ea = self._EA  # type: ignore[attr-defined]
        return (
            tuple(self._joints.items()), tuple(self._members.items()),  # type: ignore[attr-defined]
            tuple(self._supports.items()), self.deck, None if ea is None else tuple(ea.items()), self.units,  # type: ignore[attr-defined]
        )

    # ------------------------------------------------------------- influence lines
    def member_force(self, member: str) -> InfluenceLine:
        """Influence line of the force in ``member`` (positive in tension), on the deck coordinate ``x``.

        Ordinates in force per unit load (kN/kN), straight between panel
        points.  Exact rationals for a determinate truss whose member has a
        rational length (every chord and vertical of a layout on a rational
        grid, diagonals of panels like 6 by 8); otherwise floats, exact to
        rounding (the force is an exact rational times the square root of the
        member's squared length; ``line.origin`` keeps both).  Indeterminate
        trusses: the stiffness method with ``EA``, floats.
        """
        name = self._member(member, "member_force")
        return self._line("member_force", name)

    def reaction(self, joint: str) -> InfluenceLine:
        """Influence line of the vertical reaction (positive upward) of the support at ``joint``.

        Ordinates in force per unit load (kN/kN) on the deck coordinate ``x``.
        """
        name = self._joint(joint, "reaction")
        if name not in self._supports:  # type: ignore[attr-defined]
            raise TrussInputError(
                f"reaction: joint {name} has no support; the supports are at "
                f"{', '.join(self._supports)}.",  # type: ignore[attr-defined]
                field="joint",
                value=joint,
            )
        return self._line("reaction", name)

    def line(self, kind: Literal["member_force", "reaction"], name: str) -> InfluenceLine:
        """The line of the quantity named ``kind`` (``"member_force"`` or ``"reaction"``) of the member or
        support joint ``name``: the same as :meth:`member_force` or :meth:`reaction`."""
        choice(kind, ("member_force", "reaction"), what="line: kind", field="kind", error=TrussInputError)
        return self.member_force(name) if kind == "member_force" else self.reaction(name)

    def member_forces(self) -> dict[str, InfluenceLine]:
        """The influence line of every member's force, by name (in the order the members were given)."""
        return {name: self._line("member_force", name) for name in self._members}  # type: ignore[attr-defined]

    def explore(self, loads: Any = None, **options: Any) -> TrussExplorer:
        """Open the interactive explorer of this truss in a notebook: move a vehicle along the deck and see
        every member's force.  ``loads`` as for :meth:`ilkit.Beam.explore`; ``options`` go to
        :class:`ilkit.views.truss_explorer.TrussExplorer`.  Needs the ``notebook`` extra."""
        from ilkit.views.truss_explorer import TrussExplorer

        return TrussExplorer(self, loads, **options)

    # --------------------------------------------------------------------- helpers
    @cached_property
    def _solution(self) -> Solution:
        from ilkit.trusses.lines import solve

        return solve(self)

    def _line(self, kind: str, name: str) -> InfluenceLine:
        cache: dict[tuple[str, str], InfluenceLine] = self._lines  # type: ignore[attr-defined]
        key = (kind, name)
        if key not in cache:
            from ilkit.trusses.lines import truss_line

            cache[key] = truss_line(self, kind, name)
        return cache[key]

    def _member(self, member: object, what: str) -> str:
        if isinstance(member, str) and member.strip() in self._members:  # type: ignore[attr-defined]
            return member.strip()
        known = list(self._members)  # type: ignore[attr-defined]
        near = [m for m in known if isinstance(member, str) and _same_ends(m, member)]
        hint = f" (did you mean {near[0]!r}?)" if near else ""
        raise TrussInputError(
            f"{what}: there is no member {member!r}{hint}; the members are {_some(known)}.",
            field="member",
            value=member,
        )

    def _joint(self, joint: object, what: str) -> str:
        if isinstance(joint, str) and joint.strip() in self._joints:  # type: ignore[attr-defined]
            return joint.strip()
        raise TrussInputError(
            f"{what}: there is no joint {joint!r}; the joints are {_some(list(self._joints))}.",  # type: ignore[attr-defined]
            field="joint",
            value=joint,
        )


def _some(names: list[str], most: int = 16) -> str:
    shown = ", ".join(names[:most])
    return shown + (f" ... ({len(names)} in all)" if len(names) > most else "")


def _same_ends(name: str, asked: str) -> bool:
    """``"U1-L1"`` asked where the member is named ``"L1-U1"``."""
    parts = asked.split("-")
    return len(parts) == 2 and name == f"{parts[1]}-{parts[0]}"


# ------------------------------------------------------------------------ reading
def _read_joints(joints: object, system: UnitSystem | None) -> dict[str, Point]:
    if not isinstance(joints, Mapping) or not joints:
        raise TrussInputError(
            f"joints: give a mapping {{name: (x, y)}} with at least two joints, e.g. "
            f"{{'L0': (0, 0), 'L1': (8, 0), 'U1': (8, 6)}}; got {joints!r:.80}.",
            field="joints",
            value=joints,
        )
    out: dict[str, Point] = {}
    seen: dict[Point, str] = {}
    for raw_name, raw_xy in joints.items():
        name = _name(raw_name, "joint", "joints")
        if name in out:
            raise TrussInputError(f"joints: two joints named {name!r}; keep one.", field="joints", value=raw_name)
        listlike = isinstance(raw_xy, Sequence) or hasattr(raw_xy, "ndim")
        if isinstance(raw_xy, (str, bytes, Mapping)) or not listlike or getattr(raw_xy, "ndim", 1) != 1:
            pair: list[Any] = []
        else:
            pair = list(raw_xy)
        if len(pair) != 2:
            raise TrussInputError(
                f"joints: joint {name} must have coordinates (x, y), got {raw_xy!r:.60}.", field="joints",
                value=raw_xy,
            )
        xy = (
            _number(pair[0], dims=LENGTH, system=system, field=f"joints {name} x"),
            _number(pair[1], dims=LENGTH, system=system, field=f"joints {name} y"),
        )
        if xy in seen:
            raise TrussInputError(
                f"joints: {seen[xy]} and {name} are both at ({fmt(xy[0])}, {fmt(xy[1])}); two joints at one point "
                "are one joint: keep one and join its members there.",
                field="joints",
                value=name,
            )
        seen[xy] = name
        out[name] = xy
    if len(out) < 2:
        raise TrussInputError("joints: a truss needs at least two joints.", field="joints", value=joints)
    return out


def _read_members(members: object, joints: dict[str, Point]) -> dict[str, tuple[str, str]]:
    if isinstance(members, Mapping):
        items = [(_name(k, "member", "members"), v) for k, v in members.items()]
    else:
        pairs = listed(members, wanted="members: give a list of joint pairs, e.g. [('L0', 'L1'), ('L1', 'U1')]",
                       field="members", error=TrussInputError)
        items = [(None, v) for v in pairs]
    if not items:
        raise TrussInputError("members: the truss has no members; give the bars as joint pairs.", field="members",
                              value=members)
    out: dict[str, tuple[str, str]] = {}
    pairs_seen: dict[frozenset[str], str] = {}
    for given_name, ends in items:
        pair = list(ends) if isinstance(ends, Sequence) and not isinstance(ends, str) else []
        if len(pair) != 2 or not all(isinstance(e, str) for e in pair):
            raise TrussInputError(
                f"members: each member joins two joints, given by name, e.g. ('L0', 'L1'); got {ends!r:.60}.",
                field="members",
                value=ends,
            )
        a, b = (e.strip() for e in pair)
        for end in (a, b):
            if end not in joints:
                raise TrussInputError(
                    f"members: {a}-{b} ends at {end!r}, which is not a joint; the joints are {_some(list(joints))}.",
                    field="members",
                    value=ends,
                )
        if a == b:
            raise TrussInputError(f"members: {a}-{b} joins a joint to itself; remove it.", field="members",
                                  value=ends)
        name = given_name or f"{a}-{b}"
        key = frozenset((a, b))
        if key in pairs_seen:
            raise TrussInputError(
                f"members: {pairs_seen[key]} and {name} both join {a} and {b}; keep one (give one member its "
                "total EA).",
                field="members",
                value=ends,
            )
        if name in out:
            raise TrussInputError(f"members: two members named {name!r}; name them apart.", field="members",
                                  value=name)
        _no_joint_inside(a, b, joints)
        pairs_seen[key] = name
        out[name] = (a, b)
    return out


def _no_joint_inside(a: str, b: str, joints: dict[str, Point]) -> None:
    """A member must not pass through another joint (it would be two members not connected there)."""
    (xa, ya), (xb, yb) = joints[a], joints[b]
    for name, (x, y) in joints.items():
        if name in (a, b):
            continue
        cross = (xb - xa) * (y - ya) - (yb - ya) * (x - xa)
        if cross == 0 and min(xa, xb) <= x <= max(xa, xb) and min(ya, yb) <= y <= max(ya, yb):
            raise TrussInputError(
                f"members: {a}-{b} passes through joint {name}; split it into {a}-{name} and {name}-{b} (a bar "
                "connected at the joint) or move the joint.",
                field="members",
                value=(a, b),
            )


def _read_supports(supports: object, joints: dict[str, Point]) -> dict[str, str]:
    if not isinstance(supports, Mapping) or not supports:
        raise TrussInputError(
            f"supports: give a mapping {{joint: 'pin' | 'roller'}}, e.g. {{'L0': 'pin', 'L8': 'roller'}}; got "
            f"{supports!r:.60}.",
            field="supports",
            value=supports,
        )
    out: dict[str, str] = {}
    for raw, kind in supports.items():
        joint = raw.strip() if isinstance(raw, str) else raw
        if joint not in joints:
            raise TrussInputError(
                f"supports: {raw!r} is not a joint; the joints are {_some(list(joints))}.", field="supports",
                value=raw,
            )
        word = kind.strip().lower() if isinstance(kind, str) else kind
        choice(word, SUPPORT_KINDS, what=f"supports: the support at {joint}", field="supports",
               error=TrussInputError)
        out[joint] = word
    return out


def _read_deck(deck: object, joints: dict[str, Point]) -> tuple[str, ...]:
    if isinstance(deck, str):
        choice(deck, DECKS, what="deck", field="deck", error=TrussInputError)
        ys = [y for _, y in joints.values()]
        level = min(ys) if deck == "bottom" else max(ys)
        chosen = [j for j, (_, y) in joints.items() if y == level]
        if len(chosen) < 2:
            raise TrussInputError(
                f"deck: only joint {chosen[0]} lies at the {deck} level (y = {fmt(level)}); list the deck joints "
                "instead, e.g. deck=['L0', 'L1', ...].",
                field="deck",
                value=deck,
            )
    else:
        chosen = [_name(j, "deck joint", "deck") for j in listed(
            deck, wanted="deck: give 'bottom', 'top' or a list of joints, e.g. ['L0', 'L1', 'L2']", field="deck",
            error=TrussInputError)]
        for j in chosen:
            if j not in joints:
                raise TrussInputError(f"deck: {j!r} is not a joint; the joints are {_some(list(joints))}.",
                                      field="deck", value=j)
        if len(set(chosen)) != len(chosen) or len(chosen) < 2:
            raise TrussInputError(
                f"deck: give at least two distinct joints (the panel points), got {chosen!r}.", field="deck",
                value=deck,
            )
    ordered = sorted(chosen, key=lambda j: joints[j][0])
    for a, b in zip(ordered, ordered[1:]):
        if joints[a][0] == joints[b][0]:
            raise TrussInputError(
                f"deck: {a} and {b} are both at x = {fmt(joints[a][0])}; the panel points of a deck follow each "
                "other along it: keep one.",
                field="deck",
                value=deck,
            )
    return tuple(ordered)


def _read_ea(EA: object, members: dict[str, tuple[str, str]], system: UnitSystem | None) -> dict[str, Fraction] | None:
    if EA is None:
        return None
    if isinstance(EA, Mapping):
        out: dict[str, Fraction] = {}
        for raw, value in EA.items():
            if raw not in members:
                raise TrussInputError(f"EA: {raw!r} is not a member; the members are {_some(list(members))}.",
                                      field="EA", value=raw)
            out[raw] = _positive_ea(value, raw, system)
        missing = [m for m in members if m not in out]
        if missing:
            raise TrussInputError(
                f"EA: no axial stiffness for {_some(missing)}; give every member its EA (or one number for all).",
                field="EA",
                value=missing,
            )
        return {m: out[m] for m in members}
    value = _positive_ea(EA, None, system)
    return dict.fromkeys(members, value)


def _positive_ea(value: object, member: str | None, system: UnitSystem | None) -> Fraction:
    where = f" of {member}" if member else ""
    ea = _number(value, dims=FORCE, system=system, field=f"EA{where}")
    if ea <= 0:
        raise TrussInputError(
            f"EA{where}: axial stiffness must be greater than 0, got {value!r}; give E times A in the force unit.",
            field="EA",
            value=value,
        )
    return ea


def _read_roles(roles: object, members: dict[str, tuple[str, str]], joints: dict[str, Point]) -> dict[str, str]:
    given: dict[str, str] = {}
    if roles is not None:
        if not isinstance(roles, Mapping):
            raise TrussInputError(f"roles: give a mapping {{member: words}}, got {roles!r:.60}.", field="roles",
                                  value=roles)
        for m, words in roles.items():
            if m not in members:
                raise TrussInputError(f"roles: {m!r} is not a member.", field="roles", value=m)
            given[m] = _name(words, "role", "roles")
    out = {}
    for m, (a, b) in members.items():
        (xa, ya), (xb, yb) = joints[a], joints[b]
        out[m] = given.get(m) or ("vertical" if xa == xb else "chord" if ya == yb else "diagonal")
    return out

