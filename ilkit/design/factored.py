"""Factored envelopes of a girder: permanent and live effects combined per limit state.

:func:`factored_envelope` combines, at every section of
:func:`~ilkit.design.envelope_sections`, the permanent effects
(:class:`~ilkit.design.PermanentEffects`, by category) and the girder's live
load (:class:`~ilkit.design.GirderLiveLoad`) with the factors of each
:class:`~ilkit.design.LimitState`:

    max = Σ_c γ_c P_c + γLL × max(L_max, 0),   γ_c = γmax where P_c > 0, γmin where P_c < 0
    min = Σ_c γ_c P_c + γLL × min(L_min, 0),   γ_c = γmax where P_c < 0, γmin where P_c > 0

P_c is the total effect of category c (sum over stages and loads), L the
girder's live-load extreme (one lane's exact extreme with its dynamic effect,
times lanes, multiple presence and distribution); a live load that would
relieve the extreme is left out (a variable action counts only where
unfavourable: common practice, EN 1990 6.4.3.2).  Where a limit state
factors the live load's parts apart (EN 1990's ψ of the tandem system and
of the uniform load), each part takes its own factor: the parts of a case
are placed independently, so their worst placements do not change.

The result is a :class:`FactoredEnvelope`: a tidy table, the factors each
limit state's values contain, and the unfactored components.
"""

from __future__ import annotations

from collections.abc import Mapping, Sequence
from dataclasses import dataclass, field
from types import MappingProxyType
from typing import TYPE_CHECKING, Literal

import numpy as np

from ilkit._check import choice
from ilkit._display import RichDisplay
from ilkit._exact import fmt
from ilkit.design.combinations import LimitState
from ilkit.design.combinations import limit_states as read_limit_states
from ilkit.design.factors import Applied
from ilkit.design.live import GirderLiveLoad, LiveEnvelope, _from_lane, live_envelope
from ilkit.design.permanent import PermanentEffects
from ilkit.errors import DesignInputError, SideRequiredError
from ilkit.model import Beam
from ilkit.units import LENGTH, UnitSystem, magnitude_in

if TYPE_CHECKING:  # pragma: no cover
    import pandas as pd

    from ilkit.loads.results import Extremes

__all__ = ["FactoredEnvelope", "factored_envelope", "NO_LIVE"]

QUANTITIES = ("moment", "shear", "reaction")
"""The quantities a factored envelope holds."""

NO_LIVE = "no live load"
"""The live-load case shown where the live load is left out (it would relieve the extreme)."""


@dataclass(frozen=True)
class FactoredEnvelope(RichDisplay):
    """Factored envelopes of one girder, per limit state.

    ``frame``: one row per (``quantity``, ``x``, ``side``, ``limit_state``)
    with ``max`` and ``min`` (the factored extremes), ``max_case`` and
    ``min_case`` (the governing live-load case, or :data:`NO_LIVE` where the
    live load would relieve), ``permanent_max``, ``live_max``,
    ``permanent_min``, ``live_min`` (the factored permanent and live parts:
    ``max = permanent_max + live_max``).  ``quantity`` is ``"moment"``,
    ``"shear"`` or ``"reaction"``; ``x`` in the beam's length unit, ``side``
    ``"left"``, ``"right"`` or ``""``; values in the beam's units with the
    signs of :mod:`ilkit.model` (sagging moment positive, shear positive when
    the part left of the section is pushed up, reactions upward).

    ``factors[limit state][action]`` is the :class:`~ilkit.design.Applied`
    record of the factors in the live part (dynamic effect, lanes, multiple
    presence, distribution, γLL); the permanent factors are the limit
    state's (``limit_states``).  ``permanent`` and ``live`` are the
    unfactored components (the girder's live load: with its dynamic effect
    and share, without γ).
    """

    beam: Beam = field(repr=False)
    frame: pd.DataFrame = field(repr=False)
    limit_states: tuple[LimitState, ...]
    factors: Mapping[str, Mapping[str, Applied]] = field(repr=False)
    permanent: PermanentEffects = field(repr=False)
    live: Mapping[str, LiveEnvelope] = field(repr=False)
    notes: tuple[str, ...] = ()

    @property
    def units(self) -> UnitSystem | None:
        """The beam's unit system."""
        return self.beam.units

    def __repr__(self) -> str:
        names = ", ".join(s.name for s in self.limit_states)
        sections = self.frame[["x", "side"]].drop_duplicates().shape[0] if not self.frame.empty else 0
        return f"FactoredEnvelope({names}; {sections} section rows)"

    def to_frame(self) -> pd.DataFrame:
        """The tidy table (a copy); see the class notes for its columns, units and signs."""
        return self.frame.copy()

    def table(self, quantity: str = "moment") -> pd.DataFrame:
        """One row per section (``x``, ``side``), for each limit state its ``max`` and ``min`` columns
        (``"Strength I max"``), in the beam's units with the signs of :mod:`ilkit.model`."""
        choice(quantity, QUANTITIES, what="table: quantity", field="quantity", error=DesignInputError)
        part = self.frame[self.frame["quantity"] == quantity]
        wide = part.pivot_table(index=["x", "side"], columns="limit_state", values=["max", "min"], sort=False)
        order = [s.name for s in self.limit_states]
        wide = wide.reindex(columns=[(w, n) for n in order for w in ("max", "min")])
        wide.columns = [f"{n} {w}" for w, n in wide.columns]
        return wide.reset_index()

    def governing(self, limit_states: Sequence[str] | None = None) -> pd.DataFrame:
        """Per (``quantity``, ``x``, ``side``) the limit state giving the largest ``max`` and the one giving the
        smallest ``min`` among ``limit_states`` (all by default), with their values and live-load cases
        (beam units, signs of :mod:`ilkit.model`)."""
        import pandas as pd

        names = [s.name for s in self.limit_states] if limit_states is None else list(limit_states)
        for n in names:
            choice(n, [s.name for s in self.limit_states], what="governing: limit state", field="limit_states",
                   error=DesignInputError)
        part = self.frame[self.frame["limit_state"].isin(names)]
        keys = ["quantity", "x", "side"]
        top = part.loc[part.groupby(keys, sort=False)["max"].idxmax()]
        low = part.loc[part.groupby(keys, sort=False)["min"].idxmin()]
        out = pd.DataFrame({
            **{k: top[k].to_numpy() for k in keys},
            "max": top["max"].to_numpy(), "max_limit_state": top["limit_state"].to_numpy(),
            "max_case": top["max_case"].to_numpy(),
            "min": low["min"].to_numpy(), "min_limit_state": low["limit_state"].to_numpy(),
            "min_case": low["min_case"].to_numpy(),
        })
        return out

    def governing_extremes(self, limit_state: str) -> list[Extremes]:
        """The live load's extremes (:class:`ilkit.Extremes`, one lane, with their placements) at the sections that
        govern ``limit_state``: where its largest and its smallest moment, shear and reaction are (one section may
        give two).  Of equal values (to 1e-9 of the largest) the first section along the beam is taken.  For
        :func:`~ilkit.design.concurrent_forces` (then :meth:`~ilkit.design.ConcurrentForces.for_girder`)."""
        choice(limit_state, [s.name for s in self.limit_states], what="governing_extremes: limit_state",
               field="limit_state", error=DesignInputError)
        rows = self.frame[self.frame["limit_state"] == limit_state]
        live = self.live[limit_state]
        picked: dict[tuple[str, float, str], Extremes] = {}
        for quantity in QUANTITIES:
            part = rows[rows["quantity"] == quantity]
            for column, sign in (("max", 1.0), ("min", -1.0)):
                values = sign * part[column].to_numpy(dtype=float)
                tol = 1e-9 * max(float(np.abs(values).max(initial=0.0)), 1e-300)
                row = part.iloc[int(np.argmax(values >= values.max() - tol))]
                key = (quantity, float(row["x"]), str(row["side"]))
                if key not in picked:
                    picked[key] = live.extremes(quantity, row["x"], side=row["side"] or None)
        return list(picked.values())

    def value(self, quantity: str, at: object, limit_state: str, extreme: Literal["max", "min"] = "max",
              side: str | None = None) -> float:
        """One factored extreme: ``quantity`` at ``at`` (``side`` where there are two) for ``limit_state``; in
        the beam's units with the signs of :mod:`ilkit.model`."""
        choice(quantity, QUANTITIES, what="value: quantity", field="quantity", error=DesignInputError)
        choice(extreme, ("max", "min"), what="value: extreme", field="extreme", error=DesignInputError)
        choice(limit_state, [s.name for s in self.limit_states], what="value: limit_state", field="limit_state",
               error=DesignInputError)
        choice(side, ("left", "right"), what="value: side", field="side", error=DesignInputError, optional=True)
        pos = float(magnitude_in(at, dims=LENGTH, system=self.beam.units, field="at"))
        f = self.frame
        rows = f[(f["quantity"] == quantity) & (f["limit_state"] == limit_state)
                 & ((f["x"] - pos).abs() <= 1e-9 * float(self.beam.length))]
        if rows.empty:
            raise DesignInputError(f"value: no {quantity} at x={fmt(pos)} in this envelope.", field="at", value=at)
        if side is not None and side in set(rows["side"]):
            rows = rows[rows["side"] == side]
        elif "" in set(rows["side"]):
            rows = rows[rows["side"] == ""]
        elif len(rows) > 1:
            values = rows[extreme].to_numpy()
            if abs(values[0] - values[1]) > 1e-9 * max(abs(values).max(), 1e-300):
                raise SideRequiredError(
                    f"value: the {quantity} jumps at x={fmt(pos)}; name the side: value({quantity!r}, {fmt(pos)}, "
                    f"{limit_state!r}, side='left') or side='right'.")
        return float(rows[extreme].iloc[0])


Live = GirderLiveLoad | LiveEnvelope


def _live_map(live: object, states: tuple[LimitState, ...]) -> dict[str, Live]:
    if isinstance(live, (GirderLiveLoad, LiveEnvelope)):
        return {s.name: live for s in states}
    if not isinstance(live, Mapping):
        raise DesignInputError(
            f"factored_envelope: give live as a GirderLiveLoad, or a mapping of limit-state names to them, got "
            f"{type(live).__name__} {live!r}.", field="live", value=live)
    default = live.get("*")
    out = {}
    for s in states:
        chosen = live.get(s.name, default)
        if chosen is None:
            raise DesignInputError(
                f"factored_envelope: no live load for {s.name!r}; give live={{{s.name!r}: GirderLiveLoad(...), ...}} "
                "or a default under the key '*'.", field="live", value=sorted(live))
        if not isinstance(chosen, (GirderLiveLoad, LiveEnvelope)):
            raise DesignInputError(f"factored_envelope: the live load for {s.name!r} must be a GirderLiveLoad (or its "
                                   f"LiveEnvelope), got {type(chosen).__name__}.", field="live", value=chosen)
        out[s.name] = chosen
    unknown = sorted(set(live) - {s.name for s in states} - {"*"})
    if unknown:
        raise DesignInputError(f"factored_envelope: live loads given for {unknown}, which are not among the limit "
                               f"states {[s.name for s in states]}.", field="live", value=unknown)
    return out


def factored_envelope(
    beam: Beam,
    *,
    permanent: PermanentEffects,
    live: GirderLiveLoad | LiveEnvelope | Mapping[str, GirderLiveLoad | LiveEnvelope],
    limit_states: object,
    divisions: int = 10,
    at: Sequence[object] = (),
) -> FactoredEnvelope:
    """The factored envelopes of a girder on ``beam`` for each of ``limit_states``.

    ``permanent``: the permanent effects at the sections of an envelope with
    the same ``divisions`` and ``at`` (:func:`~ilkit.design.permanent_effects`).
    ``live``: the girder's live load (or its
    :class:`~ilkit.design.LiveEnvelope`, computed once), or a mapping of
    limit-state names to them (the fatigue truck for the fatigue limit
    states; the key ``"*"`` for the others).  ``limit_states``: names (``"Strength I"``),
    ``"AASHTO"``, ``"EN 1990"`` or :class:`~ilkit.design.LimitState` objects
    (:func:`~ilkit.design.limit_states`).  Moments, shears and reactions in
    the beam's units with the signs of :mod:`ilkit.model`; see the module
    notes for the rule and :class:`FactoredEnvelope` for the table.
    """
    import pandas as pd

    if not isinstance(beam, Beam):
        raise DesignInputError(f"factored_envelope: give a Beam, got {type(beam).__name__} {beam!r}.", field="beam",
                               value=beam)
    if not isinstance(permanent, PermanentEffects):
        raise DesignInputError(
            "factored_envelope: give permanent=ilkit.design.permanent_effects(...) (PermanentEffects), got "
            f"{type(permanent).__name__}.", field="permanent", value=permanent)
    states = read_limit_states(limit_states)
    lives = _live_map(live, states)
    for s in states:
        given = lives[s.name]
        (given.live if isinstance(given, LiveEnvelope) else given).check(s)
    envelopes: dict[int, LiveEnvelope] = {}
    for s in states:
        g = lives[s.name]
        needs_parts = bool(s.live_parts)
        current = g if isinstance(g, LiveEnvelope) else envelopes.get(id(g))
        if current is None or (needs_parts and "max_axles" not in current.frame):
            if isinstance(g, LiveEnvelope):
                current = _from_lane(g.lane, g.live, True)
            else:
                current = live_envelope(beam, g, divisions=divisions, at=at, parts=needs_parts)
        envelopes[id(g)] = current
    # the permanent effects by category, on the live envelope's rows
    by_cat = permanent.by_category()
    by_cat = by_cat[by_cat["quantity"].isin(QUANTITIES)]
    categories = [c for c in by_cat.columns if c not in ("quantity", "x", "side")]
    for s in states:  # every category has factors (an unknown one is named before any work)
        for c in categories:
            s.factors_of(c)
    frames = []
    factors: dict[str, Mapping[str, Applied]] = {}
    for s in states:
        env = envelopes[id(lives[s.name])]
        if env.lane.beam != beam:
            raise DesignInputError(f"factored_envelope: the live-load envelope for {s.name!r} is of another beam; "
                                   "compute it for this one.", field="live")
        rows = env.frame
        merged = rows.merge(by_cat, on=["quantity", "x", "side"], how="left", indicator=True)
        missing = merged["_merge"] != "both"
        if missing.any() or len(merged) != len(by_cat) or len(merged) != len(rows):
            raise DesignInputError(
                "factored_envelope: the permanent effects were computed at other sections than the live load's; "
                "compute both for the same beam with the same divisions and at (permanent_effects(..., "
                f"divisions={divisions}, at=...)), with moment, shear and reaction.", field="permanent")
        perm_max = np.zeros(len(merged))
        perm_min = np.zeros(len(merged))
        for c in categories:
            p = merged[c].to_numpy(dtype=float)
            hi, lo = s.factors_of(c)
            perm_max += np.where(p > 0, hi, lo) * p
            perm_min += np.where(p < 0, hi, lo) * p
        if s.live_parts:
            fa, fu = s.live_parts.get("axles", 1.0), s.live_parts.get("uniform", 1.0)
            lmax = fa * merged["max_axles"].to_numpy() + fu * merged["max_uniform"].to_numpy()
            lmin = fa * merged["min_axles"].to_numpy() + fu * merged["min_uniform"].to_numpy()
        else:
            lmax, lmin = merged["max"].to_numpy(dtype=float), merged["min"].to_numpy(dtype=float)
        noise = 1e-12 * max(float(np.abs(lmax).max(initial=0.0)), float(np.abs(lmin).max(initial=0.0)), 1e-300)
        live_max = s.live * np.where(lmax > noise, lmax, 0.0)
        live_min = s.live * np.where(lmin < -noise, lmin, 0.0)
        frames.append(pd.DataFrame({
            "quantity": merged["quantity"], "x": merged["x"], "side": merged["side"], "limit_state": s.name,
            "max": perm_max + live_max, "min": perm_min + live_min,
            "max_case": np.where(live_max > 0, merged["max_case"], NO_LIVE),
            "min_case": np.where(live_min < 0, merged["min_case"], NO_LIVE),
            "permanent_max": perm_max, "live_max": live_max, "permanent_min": perm_min, "live_min": live_min,
        }))
        gamma = s.live_factor()
        factors[s.name] = MappingProxyType({a: env.live.factors(a).then(gamma) for a in QUANTITIES})
    frame = pd.concat(frames, ignore_index=True)
    notes = (
        "A live load that would relieve an extreme is left out there (its case reads 'no live load').",
        *permanent.notes,
    )
    return FactoredEnvelope(beam, frame, states, MappingProxyType(factors), permanent,
                            MappingProxyType({s.name: envelopes[id(lives[s.name])] for s in states}), notes)

