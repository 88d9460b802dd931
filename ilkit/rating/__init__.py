"""Load rating of girders: LRFR rating factors for design, legal and permit loads; rail ratings.

* :func:`rate_girder` -> :class:`GirderRating`: rating factors at every rated section and action for the
  design load (HL-93, inventory and operating), the AASHTO legal loads (Type 3, 3S2, 3-3, the lane-type
  legal load, the specialised hauling vehicles, the notional rating load), the emergency vehicles and permit
  vehicles of the user's own; the controlling rating per vehicle, the rating in tons and the posting load;
* the vehicles as load models (:mod:`ilkit.rating.vehicles`), the rating constants as factors with their
  sources (:mod:`ilkit.rating.factors`), the nominal resistances as an input (:class:`Resistances`);
* :func:`cooper_rating` (AREMA Cooper E-rating, normal and maximum, impact from the span) and
  :func:`classified_rating` (EN 1991-2 classified load α with Φ2 or Φ3 from the determinant length).

Every value recalled from the Manuals is marked ``from_memory``; check it against the licensed current
edition, and have every rating checked and sealed by a licensed engineer under the owner's rules.  The core
imports no plotting or widget library; the views (:mod:`ilkit.views.rating_records`,
:func:`ilkit.views.plot_rating`, :class:`ilkit.views.RatingView`) sit on top.
"""

from ilkit.rating.factors import (
    CONDITION_FACTORS,
    PHI_CS_MINIMUM,
    SYSTEM_FACTORS,
    Posting,
    condition_factor,
    design_live_factor,
    emergency_live_factor,
    legal_live_factor,
    permit_live_factor,
    posting_load,
    rating_limit_state,
    service_live_factor,
    system_factor,
)
from ilkit.rating.lrfr import (
    LEGAL_SET,
    GirderRating,
    RatingLoad,
    StandingRating,
    design_load,
    legal_load,
    permit_load,
    rate_girder,
    rating_loads,
    vehicle_tons,
)
from ilkit.rating.rail import (
    STRUCTURE_TYPES,
    RailRating,
    arema_impact,
    classified_rating,
    cooper_rating,
    determinant_length,
)
from ilkit.rating.resistance import RESISTANCE_KINDS, Resistances
from ilkit.rating.vehicles import (
    LEGAL_TRUCKS,
    emergency_vehicle,
    lane_type_legal_load,
    notional_rating_load,
    permit_vehicle,
    specialized_hauling_vehicle,
    type_3,
    type_3_3,
    type_3s2,
)

__all__ = [
    # the rating
    "rate_girder",
    "GirderRating",
    "StandingRating",
    "Resistances",
    "RESISTANCE_KINDS",
    "RatingLoad",
    "design_load",
    "legal_load",
    "permit_load",
    "rating_loads",
    "LEGAL_SET",
    "vehicle_tons",
    # vehicles
    "type_3",
    "type_3s2",
    "type_3_3",
    "lane_type_legal_load",
    "specialized_hauling_vehicle",
    "notional_rating_load",
    "emergency_vehicle",
    "permit_vehicle",
    "LEGAL_TRUCKS",
    # factors
    "condition_factor",
    "system_factor",
    "CONDITION_FACTORS",
    "SYSTEM_FACTORS",
    "PHI_CS_MINIMUM",
    "design_live_factor",
    "legal_live_factor",
    "emergency_live_factor",
    "permit_live_factor",
    "rating_limit_state",
    "service_live_factor",
    "posting_load",
    "Posting",
    # rail
    "arema_impact",
    "cooper_rating",
    "determinant_length",
    "classified_rating",
    "RailRating",
    "STRUCTURE_TYPES",
]
