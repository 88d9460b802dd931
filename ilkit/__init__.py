"""ilkit: influence lines for girders in Jupyter notebooks.

Exact (rational, piecewise) influence lines of reactions, shears and moments
for hinged determinate beams; piecewise-cubic lines (float, or exact on
request) for continuous beams, elastic supports, varying stiffness,
deflections and rotations; moving loads, published load models, critical
placement and envelopes (:mod:`ilkit.loads`).  Sign conventions are stated
in :mod:`ilkit.model`.
"""

from __future__ import annotations

from typing import Any

from ilkit.errors import (
    BatchInputError,
    BeamInputError,
    DesignInputError,
    ExportError,
    FactorAppliedTwiceError,
    IlkitError,
    IllConditionedError,
    IndeterminateBeamError,
    InventoryError,
    LoadInputError,
    MissingDependencyError,
    MissingResistanceError,
    NoDerivationError,
    OutsideRangeError,
    PlacementTooLargeError,
    RatingInputError,
    SideRequiredError,
    StiffnessRequiredError,
    TrussInputError,
    UnitsError,
    UnstableBeamError,
    UnstableTrussError,
    UnsupportedResultError,
    WriteError,
)
from ilkit.influence import InfluenceLine, Ordinate, Piece
from ilkit.loads import (
    AxleTrain,
    Combination,
    Envelope,
    Extreme,
    Extremes,
    KnifeEdge,
    LoadModel,
    TrainUniform,
    UniformBlocks,
    UniformLoad,
    envelope,
    extremes,
    place,
    stand,
)
from ilkit.model import Beam, Spring, Support
from ilkit.quantity import Quantity
from ilkit.units import SYSTEMS, UnitSystem

__version__ = "0.1.0"

__all__ = [
    "Beam",
    "Support",
    "Spring",
    "InfluenceLine",
    "Piece",
    "Ordinate",
    "Quantity",
    "UnitSystem",
    "SYSTEMS",
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
    "views",
    "design",
    "rating",
    "trusses",
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
    "batch",
    # moving loads (published models: ilkit.loads)
    "AxleTrain",
    "TrainUniform",
    "UniformLoad",
    "UniformBlocks",
    "KnifeEdge",
    "Combination",
    "LoadModel",
    "place",
    "extremes",
    "stand",
    "envelope",
    "Extreme",
    "Extremes",
    "Envelope",
    "x",
]


def __getattr__(name: str) -> Any:
    # ``ilkit.x`` is the sympy symbol of the load position; sympy is imported
    # only when it is first asked for, so ``import ilkit`` stays fast.
    if name == "x":
        from ilkit._symbols import x

        return x
    if name in ("views", "design", "rating", "trusses", "batch"):
        # drawings, derivations, tables and calculation sheets; design effects; load rating; trusses; batch
        # runs: loaded on first use
        import importlib

        return importlib.import_module(f"ilkit.{name}")
    raise AttributeError(f"module 'ilkit' has no attribute {name!r}")
