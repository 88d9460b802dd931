"""Envelopes: the largest and smallest moment and shear at sections along a beam under a load model.

Sections are the ends, every support, every release, every floor beam of a
floor system and equal divisions of each span and overhang.  At interior
supports, releases and floor beams both sides are listed (``side``
``"left"`` and ``"right"``).  The reaction envelope covers every support;
the absolute maximum moment is searched along the whole beam and refined
to 1e-6 of the beam length.  Sign conventions are those of
:mod:`ilkit.model`: sagging moment positive, shear positive when the part
left of the section is pushed up, reactions positive upward.
"""

from __future__ import annotations

from dataclasses import dataclass, field
from fractions import Fraction
from typing import TYPE_CHECKING, Any, Literal

from ilkit._check import choice, listed, whole
from ilkit._display import RichDisplay
from ilkit._exact import fmt, fmt_precise
from ilkit.errors import LoadInputError, SideRequiredError, UnitsError
from ilkit.loads.combination import Combination, LoadModel, as_model
from ilkit.loads.placement import extremes_of, maxima_of
from ilkit.loads.primitives import Load
from ilkit.loads.results import Extreme, Extremes
from ilkit.model import Beam
from ilkit.quantity import Side
from ilkit.units import LENGTH, magnitude_in

if TYPE_CHECKING:  # pragma: no cover
    import pandas as pd

    from ilkit.influence import InfluenceLine

__all__ = ["Envelope", "envelope"]

_ROUNDS = 40
"""Most rounds of the search for the absolute maximum moment (a smooth maximum takes three or four)."""
_NARROW = 64
"""How much closer than the bracket the sections searched around a parabola's vertex are."""
MAX_DIVISIONS = 1000
"""Most parts per span: each section is two placement searches, so more would run for hours."""


@dataclass(frozen=True)
class Envelope(RichDisplay):
    """Envelope of a load model on a beam.

    ``sections``: one row per section (two at interior supports and
    releases), with the largest and smallest moment and shear and the
    governing case of each.  ``reactions``: one row per support.
    ``absolute_maximum_moment``: the largest sagging moment anywhere, with its
    section in ``.quantity.at``; ``absolute_maximum_positions`` lists every
    section that attains it (both mirror positions of a symmetric girder).
    Column names carry the units.
    """

    beam: Beam
    model: str
    sections: pd.DataFrame = field(repr=False)
    reactions: pd.DataFrame = field(repr=False)
    absolute_maximum_moment: Extreme
    _found: dict[tuple[str, Fraction, Side | None], Extremes] = field(repr=False, compare=False)
    load_model: LoadModel | None = field(default=None, repr=False, compare=False)
    """The load model applied (in the beam's units): its cases give the parts of every factor."""
    absolute_maximum_positions: tuple[float, ...] = ()
    """Every section where the absolute maximum moment is attained (to :data:`SAME_VALUE`): two mirror
    positions on a symmetric girder; ``absolute_maximum_moment`` is placed at one of them."""

    def __repr__(self) -> str:
        a = self.absolute_maximum_moment
        dynamic = f"; {self.dynamic}" if self.dynamic else ""
        return (
            f"Envelope({self.model} on {self.beam!r}: {len(self.sections)} section rows, "
            f"{len(self.reactions)} supports; absolute maximum moment {a.value:.6g} {a.unit} "
            f"at x={fmt(float(a.quantity.at))}{dynamic})"
        )

    @property
    def dynamic(self) -> str:
        """The dynamic effects the values contain, in words (:attr:`ilkit.LoadModel.dynamic`)."""
        return self.load_model.dynamic if self.load_model is not None else ""

    def to_frame(self) -> pd.DataFrame:
        """The section table (a copy), with a last column ``dynamic``: the dynamic effect the row's
        governing cases contain (``dynamic`` of each :class:`ilkit.Extreme`)."""
        frame = self.sections.copy()
        order = {"left": 0, None: 1, "right": 2}  # the rows: by position, the left side first
        keys = sorted((k for k in self._found if k[0] == "moment"), key=lambda k: (k[1], order[k[2]]))
        texts = []
        for key in keys:
            m, v = self._found[key], self._found[("shear", *key[1:])]
            found = (m.maximum, m.minimum, v.maximum, v.minimum)
            texts.append(" / ".join(dict.fromkeys(str(e.dynamic) for e in found if e.dynamic is not None)))
        frame["dynamic"] = texts
        return frame

    def extreme(
        self,
        quantity: Literal["moment", "shear", "reaction"],
        at: float,
        extreme: Literal["max", "min"] = "max",
        side: Side | None = None,
    ) -> Extreme:
        """The governing placement behind one entry of the tables.

        ``quantity`` is ``"moment"``, ``"shear"`` or ``"reaction"``; ``at`` a
        section or support of the tables; ``side`` picks the side where the
        quantity jumps (at a pier, a release or its own section) and must be
        given there, as for :meth:`ilkit.Beam.shear`: without it such a call
        raises :class:`ilkit.SideRequiredError`.  Where the quantity does not
        jump, both sides hold the same value and ``side`` may be left out.
        """
        kinds = ("moment", "shear", "reaction")
        choice(quantity, kinds, what="extreme: quantity", field="quantity", error=LoadInputError)
        choice(extreme, ("max", "min"), what="extreme: extreme", field="extreme", error=LoadInputError)
        choice(side, ("left", "right"), what="extreme: side", field="side", error=LoadInputError, optional=True)
        pos = magnitude_in(at, dims=LENGTH, system=self.beam.units, field="at")
        # a section given as a float (20/3 written 6.666666666666667) is the section within rounding of it
        tol = Fraction(1, 10**9) * self.beam.length
        near = [k for k in self._found if k[0] == quantity and abs(k[1] - pos) <= tol and (side in (None, k[2]))]
        keys = sorted(near, key=lambda k: (abs(k[1] - pos), k[2] != "left"))
        if not keys:
            sections = [fmt(p) for p in sorted({k[1] for k in self._found if k[0] == quantity})]
            raise LoadInputError(
                f"extreme: no {quantity} at x={fmt_precise(pos)}{f' ({side})' if side else ''} in this envelope; "
                f"it has x = {', '.join(sections[:12])}{' ...' if len(sections) > 12 else ''}.",
                field="at",
                value=at,
            )
        if side is None and {k[2] for k in keys} == {"left", "right"}:
            _needs_no_side(self.beam, quantity, keys[0][1])
        found = self._found[keys[0]]
        return found.maximum if extreme == "max" else found.minimum


def _needs_no_side(beam: Beam, quantity: str, pos: Fraction) -> None:
    """Raise :class:`SideRequiredError` where ``quantity`` jumps at ``pos`` (the beam decides, as for its lines)."""
    try:
        beam.line(quantity, pos)
    except SideRequiredError as err:
        raise SideRequiredError(
            f"extreme: the {quantity} jumps at x={fmt_precise(pos)}, so the envelope holds two values there; "
            f"name the side: env.extreme({quantity!r}, {fmt(pos)}, side='left') or side='right'."
        ) from err


def envelope(
    beam: Beam,
    load: Load | Combination | LoadModel,
    *,
    divisions: int = 10,
    at: list[float] | tuple[float, ...] = (),
) -> Envelope:
    """Envelope of ``load`` on ``beam``: moments and shears at sections, reactions, absolute maximum moment.

    ``divisions``: equal parts per span and per overhang (10 gives tenth
    points).  ``at``: further section positions.  The load is converted to
    the beam's units; a beam without units is an error.  Values are in the
    beam's units with the signs of :mod:`ilkit.model` (sagging moment positive,
    reactions upward).
    """
    import pandas as pd

    if not isinstance(beam, Beam):
        raise LoadInputError(
            f"envelope: give a Beam, got {type(beam).__name__} {beam!r}.", field="beam", value=beam
        )
    model = as_model(load)
    if beam.units is None:
        raise UnitsError(
            f"envelope: the beam declares no units, so {model.name} (in {model.units.name}) cannot be applied. "
            f"Declare them: Beam(..., units={model.units.name!r}) or units='kN-m'.",
            field="units",
        )
    model = model.converted(beam.units)
    u = beam.units
    faces = section_faces(beam, divisions, at)

    # every line of the envelope first, then one search of all of them together
    lines: dict[tuple[str, Fraction, Side | None], InfluenceLine] = {}
    for p, side in faces:
        lines[("moment", p, side)] = beam.moment(p, side=side)
        lines[("shear", p, side)] = beam.shear(p, side=side)
    for s in beam.supports:
        lines[("reaction", s.at, None)] = beam.reaction(s.at)
    found: dict[tuple[str, Fraction, Side | None], Extremes] = dict(
        zip(lines, extremes_of(list(lines.values()), model, beam=beam))
    )
    rows: list[dict[str, Any]] = []
    for p, side in faces:
        m, v = found[("moment", p, side)], found[("shear", p, side)]
        rows.append(
            {
                f"x [{u.length}]": float(p),
                "side": side or "",
                f"M max [{u.moment}]": m.maximum.value,
                "M max case": m.maximum.case,
                f"M min [{u.moment}]": m.minimum.value,
                "M min case": m.minimum.case,
                f"V max [{u.force}]": v.maximum.value,
                "V max case": v.maximum.case,
                f"V min [{u.force}]": v.minimum.value,
                "V min case": v.minimum.case,
            }
        )
    reaction_rows = []
    for s in beam.supports:
        r = found[("reaction", s.at, None)]
        reaction_rows.append(
            {
                f"x [{u.length}]": float(s.at),
                "support": s.kind,
                f"R max [{u.force}]": r.maximum.value,
                "R max case": r.maximum.case,
                f"R min [{u.force}]": r.minimum.value,
                "R min case": r.minimum.case,
            }
        )
    best, positions = _absolute_maximum(beam, model, found, _barriers(beam))
    return Envelope(
        beam, model.name, pd.DataFrame(rows), pd.DataFrame(reaction_rows), best, found, model, positions
    )


def _barriers(beam: Beam) -> list[Fraction]:
    """The ends, supports, releases and floor beams of ``beam``: where an influence line may jump or kink."""
    return [Fraction(0), beam.length, *(s.at for s in beam.supports), *(p for p, _ in beam.releases),
            *(beam.panel_points or ())]


def section_faces(beam: Beam, divisions: object = 10, at: object = ()) -> list[tuple[Fraction, Side | None]]:
    """The sections of an envelope of ``beam``, left to right, as ``(x, side)``.

    The ends, every support, every hinge and shear release, every floor beam
    (``Beam(panel_points=...)``, where a floor system brings the load down and
    the shear jumps), ``divisions`` equal parts of each span and overhang, and
    the further positions ``at`` (in the beam's length unit, or pint
    quantities; one within the merge tolerance of a support is that support).
    Both faces (``"left"``, ``"right"``) at interior supports, releases and
    floor beams; ``side=None`` elsewhere.  The one rule shared by
    :func:`envelope` and :func:`ilkit.design.envelope_sections`.
    """
    divisions = whole(
        divisions,
        what="divisions: the parts per span",
        field="divisions",
        minimum=1,
        maximum=MAX_DIVISIONS,
        error=LoadInputError,
        hint="; for a closer look at one stretch add its sections with at=[...]",
    )
    L = beam.length
    stations = sorted({Fraction(0), L, *(s.at for s in beam.supports)})
    jumps = {p for p in _barriers(beam) if 0 < p < L}
    points: set[Fraction] = set(_barriers(beam))
    for a, b in zip(stations[:-1], stations[1:]):
        points.update(a + (b - a) * Fraction(k, divisions) for k in range(divisions + 1))
    for raw in listed(at, wanted="at: give a list of section positions, e.g. [12.5]", field="at", ordered=False):
        pos = magnitude_in(raw, dims=LENGTH, system=beam.units, field="at")
        if not 0 <= pos <= L:
            raise LoadInputError(
                f"at: x={fmt_precise(pos)} is off the beam; give sections from 0 to {fmt(L)}.", field="at", value=raw
            )
        points.add(beam.position(pos))  # a section within the merge tolerance of a support is the support
    faces: list[tuple[Fraction, Side | None]] = []
    for p in sorted(points):
        faces.extend((p, side) for side in (("left", "right") if p in jumps else (None,)))
    return faces


def _absolute_maximum(
    beam: Beam,
    model: LoadModel,
    found: dict[tuple[str, Fraction, Side | None], Extremes],
    barriers: list[Fraction],
) -> tuple[Extreme, tuple[float, ...]]:
    """Largest moment over all sections: the sampled local maxima refined on each side of the sample
    (:func:`_refine`); also every section that attains it.

    The samples are ordered on plain keys (position, then the left side before
    the right one): where the moment jumps (an interior fixed support, a
    rotational spring) the two sides at one position carry different extremes,
    and ties must never fall through to comparing result objects.  A side is
    refined only on its own side of the jump.
    """
    face_order = {"left": 0, None: 1, "right": 2}
    sampled = sorted(
        ((k[1], k[2], e.maximum) for k, e in found.items() if k[0] == "moment"),
        key=lambda s: (s[0], face_order[s[1]]),
    )
    xs = [float(p) for p, _, _ in sampled]
    values = [e.value for _, _, e in sampled]
    top = max(values)
    candidates = [e for _, _, e in sampled]
    if top <= 0:
        return _attained(candidates, beam)
    cuts = sorted(float(b) for b in barriers)
    tol = 1e-6 * float(beam.length)
    brackets: list[dict[float, Extreme]] = []
    for i, (value, (_, side, sample)) in enumerate(zip(values, sampled)):
        neighbours = values[max(i - 1, 0) : i + 2]
        if value < max(neighbours) or value < 0.95 * top:
            continue
        lo = xs[max(i - 1, 0)]
        hi = xs[min(i + 1, len(xs) - 1)]
        # stay between supports and releases, where the moment line is smooth in the section position
        lo = max([lo, *(c for c in cuts if c < xs[i])])
        hi = min([hi, *(c for c in cuts if c > xs[i])])
        if side == "left":
            hi = xs[i]
        elif side == "right":
            lo = xs[i]
        # each side of the sample on its own: the moment may peak on both (mirror positions on a symmetric
        # girder, where the sample at the axis of symmetry lies between two equal maxima)
        for a, b in ((lo, xs[i]), (xs[i], hi)):
            if b - a > 2 * tol:
                end = b if a == xs[i] else a  # the other end: its sample on the bracket's face
                here = {xs[i]: sample, end: _facing(sampled, end, "right" if end == a else "left")}
                brackets.append(here)
    candidates.extend(_refine(beam, model, brackets, tol))
    return _attained(candidates, beam)


def _facing(sampled: list[tuple[Fraction, Side | None, Extreme]], x: float, face: Side) -> Extreme:
    """The sample at ``x`` on ``face`` (the only one where the moment does not jump there)."""
    at = [(s, e) for p, s, e in sampled if float(p) == x]
    return next((e for s, e in at if s == face), at[0][1])


SAME_VALUE = 1e-9
"""Relative difference below which two maxima found at different sections are the same value (a
symmetric girder under a load that travels both ways attains its absolute maximum at mirror positions)."""


def _attained(candidates: list[Extreme], beam: Beam) -> tuple[Extreme, tuple[float, ...]]:
    """The largest candidate, and every distinct section where a candidate attains its value."""
    best = max(candidates, key=lambda e: e.value)
    near = SAME_VALUE * max(abs(best.value), 1e-300)
    apart = 1e-5 * float(beam.length)
    positions: list[float] = []
    for e in sorted(candidates, key=lambda e: float(e.quantity.at)):
        at = float(e.quantity.at)
        if best.value - e.value <= near and all(abs(at - p) > apart for p in positions):
            positions.append(at)
    return best, tuple(positions)


def _refine(beam: Beam, model: LoadModel, brackets: list[dict[float, Extreme]], tol: float) -> list[Extreme]:
    """The largest moment in each bracket (given by the sections known in it, ends included), by
    successive parabolas: through the best section known and its neighbours, seven sections around the
    parabola's vertex (at three distances) are searched, those of every bracket together, until the best
    section's neighbours are within ``tol`` of it.  The bracket always holds the best section between two
    lower ones (or an end), so a kink slows the search but cannot mislead it."""
    known = [dict(b) for b in brackets]  # section -> its largest moment
    todo: list[tuple[int, float]] = []
    for _ in range(_ROUNDS):
        if todo:
            found = maxima_of([beam.moment(x) for _, x in todo], model, beam=beam)
            for (k, x), e in zip(todo, found):
                known[k][x] = e
        todo = []
        for k, samples in enumerate(known):
            xs = sorted(samples)
            values = [samples[x].value for x in xs]
            i = max(range(len(xs)), key=lambda n: values[n])
            left, right = xs[max(i - 1, 0)], xs[min(i + 1, len(xs) - 1)]
            if right - left <= 2 * tol:
                continue
            if len(xs) < 3:  # the two ends alone: the middle first
                vertex = 0.5 * (xs[0] + xs[-1])
            else:
                x0, x1, x2 = left, xs[i], right
                f0, f1, f2 = (samples[x].value for x in (x0, x1, x2))
                den = (x1 - x0) * (f1 - f2) - (x1 - x2) * (f1 - f0)
                num = (x1 - x0) ** 2 * (f1 - f2) - (x1 - x2) ** 2 * (f1 - f0)
                vertex = x1 - 0.5 * num / den if den != 0 else x1
            step = max((right - left) / _NARROW, tol / 2)
            closer = [max(step / 16**n, tol / 2) for n in (0, 1, 2)]  # three distances: fewer rounds
            offsets = (0.0, *closer, *(-d for d in closer))
            probes = {min(max(vertex + d, left + tol / 4), right - tol / 4) for d in offsets}
            todo.extend((k, x) for x in sorted(probes) if x not in samples)
        if not todo:
            break
    return [max(samples.values(), key=lambda e: e.value) for samples in known]
