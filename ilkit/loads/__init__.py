"""Moving loads: primitives, published load models, critical placement and envelopes.

Loads act downward.  Every load carries its unit system; it is converted to
the beam's units when applied.
"""

from ilkit.loads.combination import Combination, DynamicEffect, LoadModel
from ilkit.loads.envelope import Envelope, envelope
from ilkit.loads.models import (
    ALPHA_VALUES,
    alternate_live_load,
    cooper,
    cooper_train,
    design_lane,
    design_tandem,
    design_truck,
    fatigue_truck,
    hl93,
    lm1,
    lm2,
    lm71,
    multiple_presence,
    phi2,
    phi3,
    sw0,
    sw2,
    two_design_trucks,
)
from ilkit.loads.placement import extremes, place
from ilkit.loads.primitives import AxleTrain, KnifeEdge, TrainUniform, UniformBlocks, UniformLoad
from ilkit.loads.results import AxlePosition, Extreme, Extremes, LoadPlacement, Patch
from ilkit.loads.standing import stand, train_length

__all__ = [
    "AxleTrain",
    "TrainUniform",
    "UniformLoad",
    "UniformBlocks",
    "KnifeEdge",
    "Combination",
    "DynamicEffect",
    "LoadModel",
    "place",
    "extremes",
    "stand",
    "train_length",
    "envelope",
    "Envelope",
    "Extreme",
    "Extremes",
    "LoadPlacement",
    "AxlePosition",
    "Patch",
    # published models
    "hl93",
    "design_truck",
    "design_tandem",
    "design_lane",
    "two_design_trucks",
    "fatigue_truck",
    "multiple_presence",
    "lm1",
    "lm2",
    "lm71",
    "sw0",
    "sw2",
    "phi2",
    "phi3",
    "ALPHA_VALUES",
    "cooper",
    "cooper_train",
    "alternate_live_load",
]
