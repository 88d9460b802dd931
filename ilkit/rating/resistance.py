"""Nominal resistances of a girder: an input of the rating, never computed by ilkit.

:class:`Resistances` holds, per action, the nominal resistance Rn along the girder and the resistance factor
φ: the positive (sagging) and negative (hogging) moment resistance and the shear resistance, each given as

* a number (the same at every section),
* a function of ``x`` (the section's position in the beam's length unit) returning the number, or
* a list of ranges ``(start, end, value)``: the value holds on ``start <= x <= end``.

A table (a pandas DataFrame or a CSV file) with one row per range and the columns ``start``, ``end``,
``action`` (``"positive moment"``, ``"negative moment"`` or ``"shear"``) and ``Rn`` gives the same
(:meth:`Resistances.from_frame`, :meth:`Resistances.from_csv`).  Values are magnitudes (at least 0) in the
beam's units: force·length for moments, force for shears.

Where two ranges meet at a section, a face of a support or release takes the range on its own side; a
section without a face takes the smaller value (common practice).  A rated section that no value covers
raises :class:`~ilkit.MissingResistanceError`.
"""

from __future__ import annotations

from collections.abc import Callable
from dataclasses import dataclass
from pathlib import Path
from typing import Any, Literal

from ilkit._check import choice, listed
from ilkit._exact import fmt
from ilkit.design.factors import Factor
from ilkit.errors import DesignInputError, MissingResistanceError, RatingInputError
from ilkit.rating._inputs import amount

__all__ = ["Resistances", "RESISTANCE_KINDS"]

RESISTANCE_KINDS = ("positive moment", "negative moment", "shear")
"""The nominal resistances a girder may be given."""

Given = float | Callable[[float], float] | tuple[tuple[float, float, float], ...]


def _read(value: object, kind: str) -> Given | None:
    if value is None:
        return None
    if callable(value):
        return value  # type: ignore[return-value]
    if isinstance(value, (list, tuple)):
        rows = []
        for row in listed(value, wanted=f"{kind}: give ranges as (start, end, value) rows", field=kind,
                          error=RatingInputError):
            items = listed(row, wanted=f"{kind}: each range is (start, end, value)", field=kind,
                           error=RatingInputError)
            if len(items) != 3:
                raise RatingInputError(f"{kind}: each range is (start, end, value), got {row!r}.", field=kind,
                                       value=row)
            a = amount(items[0], f"{kind}: start", minimum=None)
            b = amount(items[1], f"{kind}: end", minimum=None)
            if b < a:
                raise RatingInputError(f"{kind}: a range ends before it starts ({fmt(a)} to {fmt(b)}); give "
                                       "(start, end, value) with start <= end.", field=kind, value=row)
            rows.append((a, b, _value(items[2], kind, None)))
        if not rows:
            raise RatingInputError(f"{kind}: the list of ranges is empty; give (start, end, value) rows.",
                                   field=kind, value=value)
        return tuple(rows)
    return _value(value, kind, None)


def _value(value: object, kind: str, x: float | None) -> float:
    where = "" if x is None else f" at x={fmt(round(x, 9))}"
    try:
        return amount(value, f"Resistances: {kind}{where}", minimum=0.0,
                      fix=" (a resistance is a magnitude: give the negative moment resistance as a positive "
                          "number; a negative capacity cannot carry any load)")
    except DesignInputError as err:
        raise RatingInputError(str(err), field=kind, value=value) from None


@dataclass(frozen=True, init=False, repr=False)
class Resistances:
    """Nominal resistances Rn of a girder and their resistance factors φ.

    Parameters
    ----------
    positive_moment, negative_moment, shear:
        Rn for sagging moment, hogging moment (both as magnitudes, force·length) and shear (force), each a
        number, a function of ``x`` or a list of ``(start, end, value)`` ranges (see the module notes); an
        action left out is not rated.
    phi_moment, phi_shear:
        The resistance factors φ (AASHTO LRFD 6.5.4.2: 1.00 for flexure and shear of steel girders, from
        memory; 0.90 for flexure of tension-controlled reinforced concrete, 5.5.4.2), dimensionless.
    name:
        A name for sheets (``"girder G2, 1965 plans, section loss from the 2024 inspection"``).
    """

    given: dict[str, Given]
    phi: dict[str, Factor]
    name: str

    def __init__(
        self,
        *,
        positive_moment: Any = None,
        negative_moment: Any = None,
        shear: Any = None,
        phi_moment: float = 1.0,
        phi_shear: float = 1.0,
        name: str = "",
    ) -> None:
        given = {k: _read(v, k) for k, v in zip(RESISTANCE_KINDS, (positive_moment, negative_moment, shear))}
        given = {k: v for k, v in given.items() if v is not None}
        if not given:
            raise RatingInputError(
                "Resistances: give at least one nominal resistance, e.g. Resistances(positive_moment=12000, "
                "negative_moment=9000, shear=800) (beam units).", field="resistances")
        phi = {}
        for action, value in (("moment", phi_moment), ("shear", phi_shear)):
            v = amount(value, f"Resistances: phi_{action}", minimum=0.0, strict=True, maximum=1.0)
            phi[action] = Factor("resistance", v, "φ", note=f"{action} resistance factor, given")
        if not isinstance(name, str):
            raise RatingInputError(f"Resistances: name must be text, got {name!r}.", field="name", value=name)
        object.__setattr__(self, "given", given)
        object.__setattr__(self, "phi", phi)
        object.__setattr__(self, "name", name)

    @classmethod
    def from_frame(cls, frame: Any, *, phi_moment: float = 1.0, phi_shear: float = 1.0,
                   name: str = "") -> Resistances:
        """Resistances from a table: one row per range with the columns ``start``, ``end``, ``action``
        (``"positive moment"``, ``"negative moment"``, ``"shear"``) and ``Rn`` (beam units)."""
        import pandas as pd

        if not isinstance(frame, pd.DataFrame):
            raise RatingInputError(f"Resistances.from_frame: give a pandas DataFrame, got {type(frame).__name__}.",
                                   field="frame")
        columns = {str(c).strip().lower(): c for c in frame.columns}
        for needed in ("start", "end", "action", "rn"):
            if needed not in columns:
                raise RatingInputError(
                    f"Resistances.from_frame: the table has no {needed!r} column (columns: {list(frame.columns)}); "
                    "give one row per range with columns start, end, action, Rn.", field=needed)
        ranges: dict[str, list[tuple[Any, Any, Any]]] = {}
        for i, row in enumerate(frame.itertuples(index=False), start=1):
            values = dict(zip(frame.columns, row))
            action = values[columns["action"]]
            if not isinstance(action, str) or action.strip().lower() not in RESISTANCE_KINDS:
                raise RatingInputError(
                    f"Resistances.from_frame: row {i}: action {action!r} is not one of "
                    f"{', '.join(map(repr, RESISTANCE_KINDS))}.", field="action", value=action)
            ranges.setdefault(action.strip().lower(), []).append(
                (values[columns["start"]], values[columns["end"]], values[columns["rn"]]))
        return cls(**{k.replace(" ", "_"): v for k, v in ranges.items()}, phi_moment=phi_moment,
                   phi_shear=phi_shear, name=name)

    @classmethod
    def from_csv(cls, path: str | Path, **options: Any) -> Resistances:
        """Resistances from a CSV file with the columns of :meth:`from_frame` (``options`` as there)."""
        import pandas as pd

        file = Path(path) if isinstance(path, (str, Path)) else None
        if file is None or not file.is_file():
            raise RatingInputError(f"Resistances.from_csv: no CSV file at {path!r}.", field="path", value=path)
        try:
            frame = pd.read_csv(file)
        except (pd.errors.ParserError, pd.errors.EmptyDataError, UnicodeDecodeError, OSError) as err:
            raise RatingInputError(f"Resistances.from_csv: cannot read {str(file)!r} ({err}).", field="path",
                                   value=str(path)) from None
        return cls.from_frame(frame, **options)

    @property
    def kinds(self) -> tuple[str, ...]:
        """The resistances given, in the order of :data:`RESISTANCE_KINDS`."""
        return tuple(k for k in RESISTANCE_KINDS if k in self.given)

    @property
    def actions(self) -> tuple[str, ...]:
        """The actions rated: ``"moment"`` when a moment resistance is given, ``"shear"`` when a shear one is."""
        out = []
        if "positive moment" in self.given or "negative moment" in self.given:
            out.append("moment")
        if "shear" in self.given:
            out.append("shear")
        return tuple(out)

    def covers(self, action: str, sense: str) -> bool:
        """True when a resistance is given for ``action`` (``"moment"``, ``"shear"``) of ``sense``."""
        return ("shear" if action == "shear" else f"{sense} moment") in self.given

    def nominal(self, action: Literal["moment", "shear"], sense: Literal["positive", "negative"], x: float,
                side: Literal["left", "right"] | None = None) -> float:
        """Rn for ``action`` of ``sense`` at the section ``x`` (face ``side``), in the beam's units (a magnitude).

        Raises :class:`~ilkit.MissingResistanceError` where none is given for the section."""
        choice(action, ("moment", "shear"), what="nominal: action", field="action", error=RatingInputError)
        choice(sense, ("positive", "negative"), what="nominal: sense", field="sense", error=RatingInputError)
        choice(side, ("left", "right"), what="nominal: side", field="side", error=RatingInputError, optional=True)
        x = amount(x, "nominal: x", minimum=None)
        kind = "shear" if action == "shear" else f"{sense} moment"
        value = self.given.get(kind)
        where = f"x={fmt(round(float(x), 9))}" + (f" ({side} face)" if side else "")
        if value is None:
            raise MissingResistanceError(
                f"Resistances: no {kind} resistance is given, but the live load causes {kind} at {where}; give "
                f"Resistances(..., {kind.replace(' ', '_')}=...) (a number, a function of x or ranges).",
                field=kind, value=float(x))
        if isinstance(value, tuple):
            return self._in_ranges(value, kind, float(x), side, where)
        if callable(value):
            try:
                raw = value(float(x))
            except Exception as err:  # the user's function failed: say where
                raise RatingInputError(f"Resistances: the {kind} function failed at {where}: {err!r}.", field=kind,
                                       value=float(x)) from err
            return _value(raw, kind, float(x))
        return value

    @staticmethod
    def _in_ranges(ranges: tuple[tuple[float, float, float], ...], kind: str, x: float,
                   side: str | None, where: str) -> float:
        span = max(max(abs(a), abs(b)) for a, b, _ in ranges) or 1.0
        tol = 1e-9 * span
        inside = [(a, b, v) for a, b, v in ranges if a - tol <= x <= b + tol]
        if side == "left":
            inside = [r for r in inside if r[0] < x - tol] or inside
        elif side == "right":
            inside = [r for r in inside if r[1] > x + tol] or inside
        if not inside:
            covered = ", ".join(f"{fmt(a)} to {fmt(b)}" for a, b, _ in ranges)
            raise MissingResistanceError(
                f"Resistances: no {kind} resistance covers the rated section {where} (the ranges given cover "
                f"{covered}); add a range that covers it.", field=kind, value=x)
        return min(v for _, _, v in inside)

    def describe(self, kind: str) -> str:
        """How a resistance was given, in words (for sheets)."""
        value = self.given.get(kind)
        if value is None:
            return "not given (not rated)"
        if isinstance(value, tuple):
            return "; ".join(f"{fmt(v)} on {fmt(a)} to {fmt(b)}" for a, b, v in value)
        if callable(value):
            return f"a function of x ({getattr(value, '__name__', 'function')})"
        return f"{fmt(value)} everywhere"

    def __repr__(self) -> str:
        parts = ", ".join(f"{k}: {self.describe(k)}" for k in self.kinds)
        return f"Resistances({self.name + ': ' if self.name else ''}{parts})"

