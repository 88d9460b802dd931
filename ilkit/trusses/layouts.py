"""The common truss layouts, generated from span, panel count and depth.

Every layout has a straight deck chord with a panel point at every panel
(``deck="bottom"``: a through truss, the deck on the lower chord;
``deck="top"``: a deck truss), the supports at its two ends (a pin on the
left, a roller on the right unless ``supports=`` says otherwise) and the other
chord above or below it.  Joints are named ``L0 ... Ln`` along the lower
chord, ``U0 ... Un`` along the upper one (index = panel point, counted from
the left), ``M1 ...`` at mid-height of a K-truss's verticals; members by their
joints from left to right, the upper first at the same ``x`` (``"U1-U2"``,
``"L0-U1"``, ``"U1-L2"``, ``"U1-L1"``); every member carries its role (``"top chord"``,
``"bottom chord"``, ``"vertical"``, ``"diagonal"``, ``"end post"``).

``depth`` is the height between the chords: one number (parallel chords) or
the depths at the panel points 0 to n (a polygonal chord; the deck chord
stays straight).  A depth of 0 at an end means the chord stops one panel
short and an inclined end post runs from the support to it; with one number,
``end_posts`` chooses: ``"inclined"`` (the default of a through truss) or
``"vertical"`` (the default of a deck truss).

* :func:`pratt`: verticals, diagonals sloping down towards mid-span (tension
  under gravity load on a simple span);
* :func:`howe`: verticals, diagonals sloping up towards mid-span;
* :func:`warren`: diagonals alternating, without verticals (the other chord's
  joints at mid-panel) or with verticals at every panel point;
* :func:`k_truss`: each panel braced by two diagonals meeting at mid-height of
  a vertical;
* :func:`parker`: a Pratt truss whose upper chord is polygonal, its joints on
  a parabola (a polygonal-chord through truss).

Panel counts must be even (symmetric layouts); the lengths are exact
(``span / panels``) when span and depth are.
"""

from __future__ import annotations

from collections.abc import Sequence
from fractions import Fraction
from typing import Any, Literal

from ilkit._check import choice, listed, whole
from ilkit._exact import fmt, is_quantity
from ilkit.errors import TrussInputError
from ilkit.trusses.model import DECKS, SUPPORT_KINDS, Truss, _number
from ilkit.units import LENGTH, UnitSystem, unit_system

__all__ = ["pratt", "howe", "warren", "k_truss", "parker"]

EndPosts = Literal["inclined", "vertical"]
Deck = Literal["bottom", "top"]


class _Builder:
    """Joints and members of a layout, with roles."""

    def __init__(self, span: Any, panels: Any, depth: Any, deck: Any, system: UnitSystem | None,
                 end_posts: Any, *, layout: str, even: bool = True, depth_list: bool = True) -> None:
        choice(deck, DECKS, what=f"{layout}: deck", field="deck", error=TrussInputError)
        self.n = whole(panels, what=f"{layout}: panels", field="panels", minimum=2, maximum=200,
                       error=TrussInputError)
        if even and self.n % 2:
            raise TrussInputError(
                f"{layout}: panels must be even (a symmetric layout, diagonals meeting at mid-span), got {self.n}.",
                field="panels",
                value=panels,
            )
        self.span = _number(span, dims=LENGTH, system=system, field="span")
        if self.span <= 0:
            raise TrussInputError(f"{layout}: span must be greater than 0, got {span!r}.", field="span", value=span)
        self.panel = self.span / self.n
        self.deck: Deck = deck
        self.depths = self._depths(depth, system, end_posts, layout, depth_list)
        self.top = max(self.depths)
        self.joints: dict[str, tuple[Fraction, Fraction]] = {}
        self.members: list[tuple[str, str]] = []
        self.roles: dict[str, str] = {}

    def _depths(self, depth: Any, system: UnitSystem | None, end_posts: Any, layout: str,
                allowed: bool) -> list[Fraction]:
        n = self.n
        if is_quantity(depth) or isinstance(depth, (str, bytes)) or not hasattr(depth, "__len__"):
            d = _number(depth, dims=LENGTH, system=system, field="depth")
            if d <= 0:
                raise TrussInputError(f"{layout}: depth must be greater than 0, got {depth!r}.", field="depth",
                                      value=depth)
            posts = end_posts if end_posts is not None else ("inclined" if self.deck == "bottom" else "vertical")
            choice(posts, ("inclined", "vertical"), what=f"{layout}: end_posts", field="end_posts",
                   error=TrussInputError)
            ends = Fraction(0) if posts == "inclined" else d
            return [ends, *([d] * (n - 1)), ends]
        if not allowed:
            raise TrussInputError(
                f"{layout}: this layout takes one depth (parallel chords), got {depth!r:.60}.", field="depth",
                value=depth,
            )
        values = [_number(v, dims=LENGTH, system=system, field="depth") for v in listed(
            depth, wanted=f"{layout}: depth: give one number or the depths at the panel points 0 to {n}",
            field="depth", error=TrussInputError)]
        if len(values) != n + 1:
            raise TrussInputError(
                f"{layout}: depth lists the depths at the panel points 0 to {n}: {n + 1} values, got {len(values)}.",
                field="depth",
                value=depth,
            )
        if any(v <= 0 for v in values[1:-1]) or any(v < 0 for v in (values[0], values[-1])):
            raise TrussInputError(
                f"{layout}: every depth must be greater than 0 (0 allowed at the ends, for inclined end posts), got "
                f"{', '.join(fmt(v) for v in values)}.",
                field="depth",
                value=depth,
            )
        if (values[0] == 0) != (values[-1] == 0):
            raise TrussInputError(
                f"{layout}: give both end depths 0 (inclined end posts) or both greater than 0 (vertical end posts).",
                field="depth",
                value=depth,
            )
        if end_posts is not None and (end_posts == "inclined") != (values[0] == 0):
            raise TrussInputError(
                f"{layout}: end_posts={end_posts!r} disagrees with the end depths {fmt(values[0])}; leave end_posts "
                "out when giving the depths (0 at the ends means inclined end posts).",
                field="end_posts",
                value=end_posts,
            )
        return values

    @property
    def inclined(self) -> bool:
        return self.depths[0] == 0

    def x(self, i: int | Fraction) -> Fraction:
        return self.panel * i

    # the deck chord is straight at y = 0 (bottom) or y = top (top); the other chord follows the depths
    def chord_names(self) -> tuple[str, str]:
        """(deck chord letter, other chord letter)."""
        return ("L", "U") if self.deck == "bottom" else ("U", "L")

    def add_chords(self, other_at: Sequence[Fraction] | None = None) -> None:
        """The deck chord at every panel point; the other chord at the panel points with a depth (or at the
        positions ``other_at``, in panels, with the full depth)."""
        deck, other = self.chord_names()
        y_deck = Fraction(0) if self.deck == "bottom" else self.top
        sign = 1 if self.deck == "bottom" else -1
        for i in range(self.n + 1):
            self.joints[f"{deck}{i}"] = (self.x(i), y_deck)
        if other_at is None:
            for i, d in enumerate(self.depths):
                if d > 0:
                    self.joints[f"{other}{i}"] = (self.x(i), y_deck + sign * d)
        else:
            for k, at in enumerate(other_at, start=1):
                self.joints[f"{other}{k}"] = (self.x(at), y_deck + sign * self.depths[1])
        for chord in (deck, other):
            names = sorted((j for j in self.joints if j[0] == chord), key=lambda j: self.joints[j][0])
            for a, b in zip(names, names[1:]):
                self.add(a, b, "bottom chord" if chord == "L" else "top chord")

    def add(self, a: str, b: str, role: str) -> None:
        """The member a-b, named by its joints from left to right (upper first at the same x)."""
        if a in self.joints and b in self.joints:
            a, b = sorted((a, b), key=lambda j: (self.joints[j][0], -self.joints[j][1]))
            name = f"{a}-{b}"
            self.members.append((a, b))
            self.roles[name] = role

    def end_posts(self) -> None:
        """Inclined end posts from the deck chord's end joints to the other chord's first and last joints."""
        if not self.inclined:
            return
        deck, other = self.chord_names()
        self.add(f"{deck}0", f"{other}1", "end post")
        self.add(f"{other}{self.n - 1}", f"{deck}{self.n}", "end post")

    def verticals(self, points: Sequence[int]) -> None:
        for i in points:
            self.add(f"U{i}", f"L{i}", "vertical")

    def truss(self, supports: Any, EA: Any, units: Any) -> Truss:
        if not isinstance(supports, Sequence) or isinstance(supports, str) or len(supports) != 2:
            raise TrussInputError(
                f"supports: give the kinds at the left and the right end, e.g. ('pin', 'roller'), got {supports!r}.",
                field="supports",
                value=supports,
            )
        for kind in supports:
            choice(kind, SUPPORT_KINDS, what="supports", field="supports", error=TrussInputError)
        ends = []
        for x in (Fraction(0), self.span):
            at = [j for j, (xj, _) in self.joints.items() if xj == x]
            ends.append(min(at, key=lambda j: self.joints[j][1]))
        deck_letter = self.chord_names()[0]
        deck = [f"{deck_letter}{i}" for i in range(self.n + 1)]
        return Truss(self.joints, {f"{a}-{b}": (a, b) for a, b in self.members},
                     {ends[0]: supports[0], ends[1]: supports[1]}, deck, EA=EA, units=units, roles=self.roles)


def _diagonals(b: _Builder, towards_middle_down: bool) -> None:
    """One diagonal per panel (not the panels of inclined end posts); ``towards_middle_down``: the upper end
    nearer the support (Pratt), else nearer mid-span (Howe)."""
    n = b.n
    first, last = (1, n - 1) if b.inclined else (0, n)
    for i in range(first, last):
        outer, inner = (i, i + 1) if i < n // 2 else (i + 1, i)
        up, down = (outer, inner) if towards_middle_down else (inner, outer)
        b.add(f"U{up}", f"L{down}", "diagonal")


def _with_verticals(layout: str, span: Any, panels: Any, depth: Any, deck: Any, end_posts: Any, supports: Any,
                    EA: Any, units: Any, *, down: bool) -> Truss:
    """Chords, end posts, a vertical at every panel point and one diagonal per panel (Pratt or Howe)."""
    b = _Builder(span, panels, depth, deck, unit_system(units), end_posts, layout=layout)
    b.add_chords()
    b.end_posts()
    b.verticals(range(1, b.n) if b.inclined else range(b.n + 1))
    _diagonals(b, towards_middle_down=down)
    return b.truss(supports, EA, units)


def pratt(
    span: Any,
    panels: int,
    depth: Any,
    *,
    deck: Deck = "bottom",
    end_posts: EndPosts | None = None,
    supports: Sequence[str] = ("pin", "roller"),
    EA: Any = None,
    units: str | UnitSystem | None = None,
) -> Truss:
    """A Pratt truss: verticals at every panel point, diagonals sloping down towards mid-span.

    ``span`` and ``depth`` in the length unit (``depth`` one number or the
    depths at the panel points, see :mod:`ilkit.trusses.layouts`); ``panels``
    even; ``deck`` ``"bottom"`` (through truss) or ``"top"`` (deck truss);
    ``supports`` the kinds at the left and right ends; ``EA`` and ``units`` as
    for :class:`~ilkit.trusses.Truss`.  Member forces are positive in tension.
    """
    return _with_verticals("pratt", span, panels, depth, deck, end_posts, supports, EA, units, down=True)


def howe(
    span: Any,
    panels: int,
    depth: Any,
    *,
    deck: Deck = "bottom",
    end_posts: EndPosts | None = None,
    supports: Sequence[str] = ("pin", "roller"),
    EA: Any = None,
    units: str | UnitSystem | None = None,
) -> Truss:
    """A Howe truss: verticals at every panel point, diagonals sloping up towards mid-span.

    Arguments as for :func:`pratt`.  Member forces are positive in tension.
    """
    return _with_verticals("howe", span, panels, depth, deck, end_posts, supports, EA, units, down=False)


def warren(
    span: Any,
    panels: int,
    depth: Any,
    *,
    verticals: bool = False,
    deck: Deck = "bottom",
    end_posts: EndPosts | None = None,
    supports: Sequence[str] = ("pin", "roller"),
    EA: Any = None,
    units: str | UnitSystem | None = None,
) -> Truss:
    """A Warren truss: diagonals alternating in direction from panel to panel.

    Without verticals (the default) the other chord's joints stand at
    mid-panel, the diagonals forming equal triangles, and ``depth`` is one
    number.  With ``verticals=True`` both chords have joints at the panel
    points and a vertical stands at each of them (``depth`` and ``end_posts``
    as for :func:`pratt`).  Other arguments as for :func:`pratt`.  Member
    forces are positive in tension.
    """
    from ilkit._check import flag

    with_verticals = flag(verticals, what="warren: verticals", field="verticals", error=TrussInputError)
    system = unit_system(units)
    b = _Builder(span, panels, depth, deck, system, end_posts if with_verticals else "vertical", layout="warren",
                 even=with_verticals, depth_list=with_verticals)
    deck_letter, other = b.chord_names()
    if not with_verticals:
        if end_posts is not None:
            raise TrussInputError(
                "warren: end_posts applies to a Warren truss with verticals; without them the end diagonals run "
                "from the supports (leave end_posts out).",
                field="end_posts",
                value=end_posts,
            )
        b.add_chords(other_at=[Fraction(2 * k - 1, 2) for k in range(1, b.n + 1)])
        for k in range(1, b.n + 1):
            b.add(f"{deck_letter}{k - 1}", f"{other}{k}", "diagonal")
            b.add(f"{other}{k}", f"{deck_letter}{k}", "diagonal")
        return b.truss(supports, EA, units)
    b.add_chords()
    b.end_posts()
    b.verticals(range(1, b.n) if b.inclined else range(b.n + 1))
    first, last = (1, b.n - 1) if b.inclined else (0, b.n)
    for i in range(first, last):
        # alternate: the panels next to inclined end posts continue the zig-zag the end posts start
        if i % 2 == 0:
            b.add(f"{deck_letter}{i}", f"{other}{i + 1}", "diagonal")
        else:
            b.add(f"{other}{i}", f"{deck_letter}{i + 1}", "diagonal")
    return b.truss(supports, EA, units)


def k_truss(
    span: Any,
    panels: int,
    depth: Any,
    *,
    deck: Deck = "bottom",
    supports: Sequence[str] = ("pin", "roller"),
    EA: Any = None,
    units: str | UnitSystem | None = None,
) -> Truss:
    """A K-truss: vertical end posts and verticals at every panel point; each panel braced by two diagonals
    from the mid-height joint of its outer vertical to the ends of its inner one (the K opens towards
    mid-span; the middle vertical is one member).

    Arguments as for :func:`pratt` (``depth`` greater than 0 at the ends).  Mid-height joints are named
    ``M0``, ``M1`` ...  Member forces are positive in tension.
    """
    system = unit_system(units)
    b = _Builder(span, panels, depth, deck, system, "vertical", layout="k_truss")
    if b.inclined:
        raise TrussInputError("k_truss: a K-truss has vertical end posts; give depths greater than 0 at the ends.",
                              field="depth", value=depth)
    b.add_chords()
    n, mid = b.n, b.n // 2
    for i in range(n + 1):
        if i == mid:
            b.add(f"U{i}", f"L{i}", "vertical")
            continue
        (xu, yu), (_, yl) = b.joints[f"U{i}"], b.joints[f"L{i}"]
        b.joints[f"M{i}"] = (xu, (yu + yl) / 2)
        b.add(f"U{i}", f"M{i}", "vertical")
        b.add(f"M{i}", f"L{i}", "vertical")
    for i in range(n):
        outer, inner = (i, i + 1) if i < mid else (i + 1, i)
        b.add(f"M{outer}", f"U{inner}", "diagonal")
        b.add(f"M{outer}", f"L{inner}", "diagonal")
    return b.truss(supports, EA, units)


def parker(
    span: Any,
    panels: int,
    depth: Any,
    end_depth: Any,
    *,
    supports: Sequence[str] = ("pin", "roller"),
    EA: Any = None,
    units: str | UnitSystem | None = None,
) -> Truss:
    """A Parker truss: a through Pratt truss with inclined end posts whose upper chord is polygonal, its
    joints on a parabola from ``end_depth`` at the first and last upper joints to ``depth`` at mid-span.

    ``span``, ``depth`` and ``end_depth`` (``0 < end_depth <= depth``) in the length unit; ``panels`` even
    (at least 4).  Other arguments as for :func:`pratt`.  Member forces are positive in tension.
    """
    system = unit_system(units)
    n = whole(panels, what="parker: panels", field="panels", minimum=4, maximum=200, error=TrussInputError)
    d = _number(depth, dims=LENGTH, system=system, field="depth")
    e = _number(end_depth, dims=LENGTH, system=system, field="end_depth")
    if not 0 < e <= d:
        raise TrussInputError(
            f"parker: give 0 < end_depth <= depth (the upper chord rises towards mid-span), got end_depth "
            f"{end_depth!r} and depth {depth!r}.",
            field="end_depth",
            value=end_depth,
        )
    half = Fraction(n, 2) - 1  # panels from the first upper joint to mid-span
    depths = [Fraction(0)]
    for i in range(1, n):
        u = (Fraction(i) - Fraction(n, 2)) / half
        depths.append(d - (d - e) * u * u)
    depths.append(Fraction(0))
    return pratt(span, n, depths, supports=supports, EA=EA, units=units)  # depths in the truss's units
