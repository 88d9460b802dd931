"""Design effects on top of the influence lines: permanent loads and stages, settlement, concurrent forces,
live-load deflection; factors as data (each applied once).

Results are frozen objects with tidy pandas tables (pandas is imported when a table is built); signs
follow :mod:`ilkit.model` (sagging moment positive, shear positive when the part left of the section is
pushed up, reactions upward, deflections downward).
"""

from ilkit.design.concurrent import ConcurrentForces, concurrent_forces, concurrent_value
from ilkit.design.deflection import DeflectionCheck, aashto_deflection_load, deflection_check
from ilkit.design.factors import FACTOR_KINDS, Applied, Factor, FactorAppliedTwiceError
from ilkit.design.permanent import (
    QUANTITIES,
    DistributedLoad,
    PermanentEffects,
    PermanentLoad,
    PointLoad,
    Settlement,
    SpanLoad,
    Stage,
    permanent_effects,
)
from ilkit.design.sections import Section, envelope_sections, load_ordinate

__all__ = [
    # factors
    "Factor",
    "Applied",
    "FACTOR_KINDS",
    "FactorAppliedTwiceError",
    # sections
    "Section",
    "envelope_sections",
    "load_ordinate",
    # permanent loads
    "DistributedLoad",
    "SpanLoad",
    "PointLoad",
    "Settlement",
    "PermanentLoad",
    "Stage",
    "permanent_effects",
    "PermanentEffects",
    "QUANTITIES",
    # concurrent forces
    "concurrent_forces",
    "ConcurrentForces",
    "concurrent_value",
    # live-load deflection
    "aashto_deflection_load",
    "deflection_check",
    "DeflectionCheck",
]
