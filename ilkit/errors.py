"""Errors raised by ilkit.

Every error is an :class:`IlkitError`, which subclasses :class:`ValueError`, so
callers may catch either.  Messages name the value at fault, what is allowed and
what to do next.
"""

from __future__ import annotations

__all__ = [
    "IlkitError",
    "BeamInputError",
    "UnstableBeamError",
    "IndeterminateBeamError",
    "SideRequiredError",
    "MissingDependencyError",
    "IllConditionedError",
    "StiffnessRequiredError",
    "UnitsError",
    "UnsupportedResultError",
    "NoDerivationError",
    "LoadInputError",
    "ExportError",
    "WriteError",
    "PlacementTooLargeError",
    "DesignInputError",
    "FactorAppliedTwiceError",
    "OutsideRangeError",
    "RatingInputError",
    "MissingResistanceError",
    "TrussInputError",
    "UnstableTrussError",
    "InventoryError",
    "BatchInputError",
]


class IlkitError(ValueError):
    """Base class of every error ilkit raises on purpose."""


class _InputError(IlkitError):
    """An input value that cannot be used; ``field`` names the argument, ``value`` holds it as given."""

    def __init__(self, message: str, *, field: str | None = None, value: object = None) -> None:
        super().__init__(message)
        self.field = field
        self.value = value


class BeamInputError(_InputError):
    """A beam or a request was described with a value that cannot be used.

    Attributes
    ----------
    field:
        The argument at fault (``"length"``, ``"supports"``, ``"hinges"`` ...).
    value:
        The offending value as given.
    """


class StiffnessRequiredError(BeamInputError):
    """The result needs the flexural stiffness ``EI`` and the beam has none.

    Raised for every line of a statically indeterminate beam and for
    deflection and rotation lines of any beam; ``field`` is ``"EI"``.
    """


class UnstableBeamError(IlkitError):
    """The beam is a mechanism: some part of it can move with no load resisted.

    Attributes
    ----------
    motions:
        One line per rigid part that can move, saying how it moves.
    """

    def __init__(self, message: str, *, motions: tuple[str, ...] = ()) -> None:
        super().__init__(message)
        self.motions = motions


class IndeterminateBeamError(IlkitError):
    """A kinematic (rigid-part) result was asked of a statically indeterminate beam.

    The beam's own methods never raise it: they route indeterminate beams to
    the stiffness method (and raise :class:`StiffnessRequiredError` when
    ``EI`` is missing).
    """


class SideRequiredError(IlkitError):
    """A quantity jumps at the requested point and the caller did not name a side."""


class MissingDependencyError(IlkitError, ImportError):
    """An optional package is needed for this call; the message names the install."""


class IllConditionedError(IlkitError):
    """The stiffness system of the beam is too ill-conditioned for float arithmetic.

    Stiffness ratios or spring stiffnesses so far apart (a condition number
    above :data:`ilkit.stiffness.CONDITION_LIMIT`, typically a value in the
    wrong units) that float ordinates would be mostly rounding noise; ilkit
    refuses them, and ``exact=True`` still answers.  Milder cases (very close
    points included) are solved exactly and rounded instead.

    Attributes
    ----------
    condition:
        Estimated condition number of the (diagonally scaled) stiffness matrix.
    limit:
        The largest condition number accepted.
    """

    def __init__(self, message: str, *, condition: float, limit: float) -> None:
        super().__init__(message)
        self.condition = condition
        self.limit = limit


class UnitsError(BeamInputError):
    """A value's units cannot be used as given: the beam declares no unit system,
    the dimension is wrong (a force where a length is expected), or the unit has
    no exact conversion.  The message names the fix.
    """


class UnsupportedResultError(IlkitError, TypeError):
    """A view (table, display, report) was given an object it does not know how to show."""


class NoDerivationError(UnsupportedResultError):
    """The influence line carries no derivation ilkit can write out (for example a
    line built by hand, or by an analysis whose derivation is not yet supported)."""


class LoadInputError(_InputError):
    """A load (axle train, uniform load, combination, load model) was described with a value that cannot be used.

    Attributes
    ----------
    field:
        The argument or table column at fault (``"loads"``, ``"spacings"`` ...).
    value:
        The offending value as given.
    """


class ExportError(_InputError):
    """An export that cannot be written as asked, before any file is touched: two results whose Excel sheet
    names would be the same (after the characters Excel forbids are replaced, its 31-character limit applied
    and case ignored), a name Excel refuses, or nothing to write.

    Attributes
    ----------
    field:
        The argument at fault (``"sheets"``).
    value:
        The names or the value at fault, as given.
    """


class WriteError(IlkitError, OSError):
    """A file could not be written: its folder cannot be made, the path is a folder, the existing file is
    read-only, permission is denied, the disk is full.

    ilkit writes every file to a temporary file beside it and renames it only when it is complete, so a
    failed write leaves an existing file as it was.  Also an :class:`OSError`, so code catching file-system
    errors keeps working.

    Attributes
    ----------
    path:
        The file (or folder) that could not be written.
    """

    def __init__(self, message: str, *, path: object = None) -> None:
        super().__init__(message)
        self.path = path


class PlacementTooLargeError(LoadInputError):
    """A placement search would take more work than ilkit allows (a train with very many axles on the
    beam at once, or very many varying spacings).

    Raised before any work is done.

    Attributes
    ----------
    work:
        The estimated number of ordinate evaluations.
    limit:
        The most allowed (``ilkit.loads.placement.WORK_LIMIT``).
    axles, variable, breakpoints, on_beam:
        The train's axles and varying spacings, the line's breakpoints and the
        most axles that can stand on the beam at once.
    """

    def __init__(
        self,
        message: str,
        *,
        work: float,
        limit: float,
        axles: int,
        variable: int,
        breakpoints: int,
        on_beam: int,
    ) -> None:
        super().__init__(message, field="load")
        self.work = work
        self.limit = limit
        self.axles = axles
        self.variable = variable
        self.breakpoints = breakpoints
        self.on_beam = on_beam


class DesignInputError(_InputError):
    """A design input (a factor, a limit state, lanes, a cross-section, a girder's share of the live load)
    was described with a value that cannot be used.

    Attributes
    ----------
    field:
        The argument at fault (``"value"``, ``"limit_states"``, ``"spacing"`` ...).
    value:
        The offending value as given.
    """


class FactorAppliedTwiceError(DesignInputError):
    """A factor was applied to a result that already contains a factor of its kind (a multiple presence
    factor on top of an AASHTO approximate distribution factor that includes it, a second dynamic
    allowance).

    Attributes
    ----------
    kind:
        The kind of factor applied twice (``"multiple presence"``, ``"dynamic allowance"`` ...).
    """

    def __init__(self, message: str, *, kind: str) -> None:
        super().__init__(message, field="factors", value=kind)
        self.kind = kind


class RatingInputError(DesignInputError):
    """A load-rating input (a resistance, a rating vehicle, a condition or system factor, a permit, a rail
    rating) was described with a value that cannot be used.

    Attributes
    ----------
    field:
        The argument at fault (``"resistances"``, ``"loads"``, ``"condition"`` ...).
    value:
        The offending value as given.
    """


class MissingResistanceError(RatingInputError):
    """A rated section has no nominal resistance for an action: give it (a value, a function of x, or a
    table row covering the section).

    Attributes
    ----------
    field:
        The resistance missing (``"positive moment"``, ``"negative moment"``, ``"shear"``).
    value:
        The section's position, in the beam's length unit.
    """


class OutsideRangeError(DesignInputError):
    """An input lies outside the range of applicability of a formula (the AASHTO approximate live-load
    distribution formulas): use another method (the lever rule, a refined analysis).

    Attributes
    ----------
    field:
        The parameter outside its range (``"spacing"``, ``"span"`` ...).
    value:
        Its value, in the formula's units.
    low, high:
        The range of applicability (inclusive; ``None`` for an open end).
    """

    def __init__(self, message: str, *, field: str, value: object, low: float | None, high: float | None) -> None:
        super().__init__(message, field=field, value=value)
        self.low = low
        self.high = high


class TrussInputError(_InputError):
    """A truss (joints, members, supports, deck, ``EA``) or a request on it was described with a value
    that cannot be used.

    Attributes
    ----------
    field:
        The argument at fault (``"joints"``, ``"members"``, ``"supports"``, ``"deck"``, ``"EA"`` ...).
    value:
        The offending value as given.
    """


class UnstableTrussError(IlkitError):
    """The truss is a mechanism: some joints can move while every member keeps its length.

    Attributes
    ----------
    joints:
        The joints that move in the mechanism (the first one found where there are several).
    members:
        The members that turn in it (their two ends move differently).
    motions:
        How many independent ways the truss can move.
    """

    def __init__(self, message: str, *, joints: tuple[str, ...] = (), members: tuple[str, ...] = (),
                 motions: int = 1) -> None:
        super().__init__(message)
        self.joints = joints
        self.members = members
        self.motions = motions


class InventoryError(_InputError):
    """A record of a girder inventory (:mod:`ilkit.batch`) has a field that cannot be used, or the
    inventory file itself cannot be read.

    The errors of the girder's beam, loads and live load keep their own types
    (:class:`BeamInputError`, :class:`UnstableBeamError`, :class:`UnitsError`,
    :class:`LoadInputError` ...); this one covers what only an inventory has:
    a missing or repeated id, an unknown field, a field of the wrong form.

    Attributes
    ----------
    record:
        The id of the record at fault (``None`` for the file as a whole).
    field:
        The field at fault (``"spans"``, ``"permanent[2].intensity"`` ...).
    value:
        The offending value as given.
    """

    def __init__(self, message: str, *, record: str | None = None, field: str | None = None,
                 value: object = None) -> None:
        super().__init__(message, field=field, value=value)
        self.record = record


class BatchInputError(_InputError):
    """A batch run (:func:`ilkit.batch.run`) was asked with an argument that cannot be used: an unknown
    load model or limit state, a bad number of workers, an output folder that holds another run's results.

    Attributes
    ----------
    field:
        The argument at fault (``"models"``, ``"workers"``, ``"out"`` ...).
    value:
        The offending value as given.
    """
