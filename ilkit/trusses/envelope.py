"""Member envelope: the largest tension and compression of every member of a truss under a load model.

Each member's influence line is searched for the worst placement of the
load model (:func:`ilkit.loads.extremes`: every axle train both ways, lanes on
the parts of the wanted sign, dynamic allowance and factors as the model
says), once for the largest value (tension, positive) and once for the
smallest (compression, negative); the supports' reactions likewise.  Values
are in the truss's force unit with its sign conventions (tension positive,
reactions upward).
"""

from __future__ import annotations

from dataclasses import dataclass, field
from typing import TYPE_CHECKING, Any, Literal

from ilkit._check import choice
from ilkit._display import RichDisplay
from ilkit.errors import LoadInputError, TrussInputError, UnitsError
from ilkit.loads.combination import Combination, LoadModel, as_model
from ilkit.loads.placement import extremes
from ilkit.loads.primitives import Load
from ilkit.loads.results import Extreme, Extremes
from ilkit.trusses.model import Truss

if TYPE_CHECKING:  # pragma: no cover
    import pandas as pd

    from ilkit.model import Beam

__all__ = ["MemberEnvelope", "member_envelope"]


@dataclass(frozen=True)
class MemberEnvelope(RichDisplay):
    """Envelope of a load model on a truss.

    ``members``: one row per member (in the order the members were given)
    with its role, length, the largest force (tension positive) and the
    smallest (compression negative) and the governing case of each.
    ``reactions``: one row per support.  Column names carry the units.
    :meth:`extreme` gives the placement behind any entry.
    """

    truss: Truss
    model: str
    members: pd.DataFrame = field(repr=False)
    reactions: pd.DataFrame = field(repr=False)
    _found: dict[tuple[str, str], Extremes] = field(repr=False, compare=False)
    load_model: LoadModel | None = field(default=None, repr=False, compare=False)
    """The load model applied (in the truss's units)."""

    def __repr__(self) -> str:
        return (f"MemberEnvelope({self.model} on {self.truss!r}: {len(self.members)} members, "
                f"{len(self.reactions)} supports)")

    def to_frame(self) -> pd.DataFrame:
        """The member table (a copy)."""
        return self.members.copy()

    def forces(self, extreme: Literal["max", "min"] = "max") -> dict[str, float]:
        """``{member: force}``: every member's largest (``"max"``, tension positive) or smallest (``"min"``,
        compression negative) force, in the force unit."""
        choice(extreme, ("max", "min"), what="forces: extreme", field="extreme", error=LoadInputError)
        return {
            name: (found.maximum if extreme == "max" else found.minimum).value
            for (kind, name), found in self._found.items()
            if kind == "member_force"
        }

    def extreme(self, name: str, extreme: Literal["max", "min"] = "max", *,
                kind: Literal["member_force", "reaction"] = "member_force") -> Extreme:
        """The governing placement behind one entry of the tables: the member (or, with
        ``kind="reaction"``, the support joint) ``name`` and ``extreme`` ``"max"`` (largest: the most tension)
        or ``"min"`` (smallest: the most compression)."""
        choice(kind, ("member_force", "reaction"), what="extreme: kind", field="kind", error=LoadInputError)
        choice(extreme, ("max", "min"), what="extreme: extreme", field="extreme", error=LoadInputError)
        found = self._found.get((kind, name)) if isinstance(name, str) else None
        if found is None:
            names = [n for k, n in self._found if k == kind]
            raise LoadInputError(
                f"extreme: no {'member' if kind == 'member_force' else 'support'} {name!r} in this envelope; it has "
                f"{', '.join(names[:16])}{' ...' if len(names) > 16 else ''}.",
                field="name",
                value=name,
            )
        return found.maximum if extreme == "max" else found.minimum


def _supports_beam(truss: Truss) -> Beam | None:
    """A beam with supports where the truss's supports stand on the deck coordinate: it tells the placement
    which reactions are at interior supports (loads for interior reactions, AASHTO 3.6.1.3.1)."""
    from ilkit.model import Beam

    xs = sorted({truss.deck_x(j) for j in truss.supports})
    if len(xs) < 2:
        return None
    return Beam(truss.length, {x: ("pin" if k == 0 else "roller") for k, x in enumerate(xs)}, units=truss.units)


def member_envelope(truss: Truss, load: Load | Combination | LoadModel) -> MemberEnvelope:
    """The largest and smallest force of every member of ``truss`` under ``load``, and the reactions.

    ``load`` is a published model (``ilkit.loads.hl93()`` ...), a
    :class:`~ilkit.LoadModel`, a :class:`~ilkit.Combination` or a single load,
    converted to the truss's units (the truss must declare them).  Forces in
    the truss's force unit, tension positive; reactions upward.
    """
    import pandas as pd

    if not isinstance(truss, Truss):
        raise TrussInputError(
            f"member_envelope: give an ilkit.trusses.Truss, got {type(truss).__name__} {truss!r:.60}.",
            field="truss",
            value=truss,
        )
    model = as_model(load)
    u = truss.units
    if u is None:
        raise UnitsError(
            f"member_envelope: the truss declares no units, so {model.name} (in {model.units.name}) cannot be "
            f"applied. Declare them: Truss(..., units={model.units.name!r}) or units='kN-m'.",
            field="units",
        )
    model = model.converted(u)
    found: dict[tuple[str, str], Extremes] = {}
    rows: list[dict[str, Any]] = []
    for name, line in truss.member_forces().items():
        both = extremes(line, model)
        found[("member_force", name)] = both
        a, b = truss.members[name]
        rows.append({
            "member": name, "role": truss.roles[name], "from": a, "to": b,
            f"length [{u.length}]": truss.member_length(name),
            f"N max [{u.force}]": both.maximum.value, "N max case": both.maximum.case,
            f"N min [{u.force}]": both.minimum.value, "N min case": both.minimum.case,
        })
    beam = _supports_beam(truss)
    reaction_rows = []
    for joint, kind in truss.supports.items():
        both = extremes(truss.reaction(joint), model, beam=beam)
        found[("reaction", joint)] = both
        reaction_rows.append({
            "joint": joint, "support": kind, f"x [{u.length}]": float(truss.deck_x(joint)),
            f"R max [{u.force}]": both.maximum.value, "R max case": both.maximum.case,
            f"R min [{u.force}]": both.minimum.value, "R min case": both.minimum.case,
        })
    return MemberEnvelope(truss, model.name, pd.DataFrame(rows), pd.DataFrame(reaction_rows), found, model)
