"""Design effects on top of the influence lines: permanent loads and stages, settlement, concurrent forces,
live-load deflection; factors as data (each applied once); lanes, distribution to a girder and transverse
lines; limit states and factored envelopes.

Results are frozen objects with tidy pandas tables (pandas is imported when a table is built); signs
follow :mod:`ilkit.model` (sagging moment positive, shear positive when the part left of the section is
pushed up, reactions upward, deflections downward).
"""

from ilkit.design.combinations import (
    AASHTO_LIMIT_STATES,
    EN1990_LIMIT_STATES,
    LIMIT_STATES,
    LimitState,
    limit_states,
)
from ilkit.design.concurrent import ConcurrentForces, concurrent_forces, concurrent_value
from ilkit.design.deflection import DeflectionCheck, aashto_deflection_load, deflection_check
from ilkit.design.distribution import (
    Distribution,
    aashto_distribution,
    distribution_from_line,
    given_distribution,
    lever_rule,
    longitudinal_stiffness,
    rigid_section,
)
from ilkit.design.factored import FactoredEnvelope, factored_envelope
from ilkit.design.factors import FACTOR_KINDS, Applied, Factor, FactorAppliedTwiceError
from ilkit.design.lanes import DesignLanes, NotionalLanes, design_lanes, multiple_presence_factor, notional_lanes
from ilkit.design.live import GirderLiveLoad, LiveEnvelope, live_envelope
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
from ilkit.design.transverse import (
    CrossSection,
    LanePlacement,
    NotionalPlacement,
    TransverseLine,
    place_design_lanes,
    place_notional_lanes,
    transverse_line,
)

__all__ = [
    # factors
    "Factor",
    "Applied",
    "FACTOR_KINDS",
    "FactorAppliedTwiceError",
    # lanes
    "design_lanes",
    "DesignLanes",
    "multiple_presence_factor",
    "notional_lanes",
    "NotionalLanes",
    # transverse lines and distribution to a girder
    "CrossSection",
    "transverse_line",
    "TransverseLine",
    "place_design_lanes",
    "LanePlacement",
    "place_notional_lanes",
    "NotionalPlacement",
    "Distribution",
    "given_distribution",
    "lever_rule",
    "rigid_section",
    "distribution_from_line",
    "aashto_distribution",
    "longitudinal_stiffness",
    # live load of a girder
    "GirderLiveLoad",
    "live_envelope",
    "LiveEnvelope",
    # limit states and factored envelopes
    "LimitState",
    "limit_states",
    "LIMIT_STATES",
    "AASHTO_LIMIT_STATES",
    "EN1990_LIMIT_STATES",
    "factored_envelope",
    "FactoredEnvelope",
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
