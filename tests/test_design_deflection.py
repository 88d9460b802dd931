"""Live-load deflection: the AASHTO deflection loading, the girder's share, the envelope and the check."""

from __future__ import annotations

import numpy as np
import pytest

import ilkit
from ilkit.design import DeflectionCheck, Factor, aashto_deflection_load, deflection_check
from ilkit.loads import AxleTrain, UniformLoad

AASHTO = "AASHTO LRFD Bridge Design Specifications"
AISC = "AISC Steel Construction Manual, Part 3: Beam Diagrams and Formulas"


def _point_deflection(L, EI, a, x):
    """Deflection at x of a simple span under a unit load at a (AISC, simple beam, concentrated load at any
    point, from memory): P b x (L² - b² - x²) / (6 L EI) left of the load, mirrored right of it."""
    a, x = np.asarray(a, dtype=float), np.asarray(x, dtype=float)
    b = L - a
    left = b * x * (L**2 - b**2 - x**2) / (6 * L * EI)
    right = a * (L - x) * (L**2 - a**2 - (L - x) ** 2) / (6 * L * EI)
    on = (a >= 0) & (a <= L)
    return np.where(on, np.where(x <= a, left, right), 0.0)


def _truck_brute(L, EI, x, factor):
    """The largest deflection at x of the design truck (8, 32, 32 kip; 14 ft, then 14 to 30 ft) on a simple span,
    by brute force over the truck's position (0.02 ft steps), both directions and the rear spacing (1 ft steps)."""
    best = 0.0
    fronts = np.arange(-60.0, L + 60.0, 0.02)
    for rear in np.arange(14.0, 30.5, 1.0):
        for direction in (1, -1):
            axles = [(8.0, 0.0), (32.0, 14.0), (32.0, 14.0 + rear)]
            total = sum(p * _point_deflection(L, EI, fronts - direction * d, x) for p, d in axles)
            best = max(best, float(total.max()))
    return factor * best


@pytest.mark.parametrize("L", [60.0, 180.0])
def test_simple_span_against_closed_forms_and_brute_force(L, reference):
    EI = 29000 * 144 * 60000 / 12**4  # kip·ft²: E = 29000 ksi, I = 60000 in⁴ (a plate girder of our own)
    beam = ilkit.Beam(L, {0: "pin", L: "roller"}, EI=EI, units="kip-ft")
    check = deflection_check(beam, share=1)
    mid = float(check.envelope.loc[check.envelope["x [ft]"] == L / 2, "max [ft]"].iloc[0])
    truck = _truck_brute(L, EI, L / 2, 1.33)
    quarter_lane = 0.25 * truck + 0.64 * 5 * L**4 / (384 * EI)  # AISC simple beam, uniform load, from memory
    expected = max(truck, quarter_lane)
    reference(f"simple span {L:g} ft: largest midspan deflection of the AASHTO deflection loading (one lane)",
              expected=expected, computed=mid, source=f"{AASHTO} 3.6.1.3.2 (from memory) with {AISC} (from memory), "
              "the truck placed by brute force", clause="max(truck × 1.33, 0.25 × truck × 1.33 + lane 5wL⁴/384EI)",
              from_memory=True, rel=1e-6)
    case = "design truck" if truck >= quarter_lane else "25 % design truck + lane"
    assert check.envelope.loc[check.envelope["x [ft]"] == L / 2, "max case"].iloc[0] == case
    # the span's largest deflection is searched between the sections: the brute force at the section found
    # gives it, and at no section near midspan is the brute force larger

    def brute(x):
        truck = _truck_brute(L, EI, x, 1.33)
        lane = 0.64 * x * (L**3 - 2 * L * x**2 + x**3) / (24 * EI)  # AISC simple beam, uniform load, from memory
        return max(truck, 0.25 * truck + lane)

    span = check.spans.iloc[0]
    assert span["deflection [ft]"] >= mid
    assert span["deflection [ft]"] == pytest.approx(brute(span["at [ft]"]), rel=1e-6)
    assert max(brute(x) for x in np.linspace(0.44 * L, 0.56 * L, 41)) <= span["deflection [ft]"] * (1 + 1e-6)
    assert span["limit"] == "L/800"
    assert span["allowed [ft]"] == pytest.approx(L / 800)
    assert span["ratio"] == pytest.approx(span["deflection [ft]"] / (L / 800))
    assert bool(span["passes"]) == (span["deflection [ft]"] <= L / 800)


def test_share_is_lanes_times_multiple_presence_over_girders(reference):
    beam = ilkit.Beam(100, {0: "pin", 100: "roller"}, EI=3e8, units="kip-ft")
    one = deflection_check(beam, share=1, divisions=2)
    for lanes, m in [(1, 1.20), (2, 1.00), (3, 0.85), (4, 0.65)]:
        check = deflection_check(beam, lanes=lanes, girders=6, divisions=2)
        reference(f"girder's share for deflection, {lanes} lane(s) on 6 girders: lanes × m / girders",
                  expected=lanes * m / 6, computed=check.share, source=f"{AASHTO} 2.5.2.6.2 and Table 3.6.1.1.2-1",
                  clause="all design lanes loaded, all girders deflect equally; multiple presence factor m",
                  from_memory=True, rel=1e-12)
        largest = one.spans["deflection [ft]"].iloc[0]
        assert check.spans["deflection [ft]"].iloc[0] == pytest.approx(check.share * largest)
        assert [f.kind for f in check.factors] == ["dynamic allowance", "lanes", "multiple presence", "distribution"]
    given = deflection_check(beam, lanes=2, girders=4, multiple_presence_factor=1.0, divisions=2)
    assert given.share == pytest.approx(0.5)
    assert given.factors.get("multiple presence").source == ""  # given by the user
    assert given.factors.get("dynamic allowance").parts == ("design truck", "25 % design truck")
    assert given.factors.describe() == "IM 33 % (design truck, 25 % design truck) × N_L 2.00 × m 1.00 × 1/N_b 0.25"
    # a share given as a factor that includes multiple presence refuses a second one
    g = Factor("distribution", 0.55, "g_δ", includes=("multiple presence",))
    assert deflection_check(beam, share=g, divisions=2).share == pytest.approx(0.55)
    with pytest.raises(ilkit.FactorAppliedTwiceError):
        deflection_check(beam, share=Factor("dynamic allowance", 1.33, "IM"), divisions=2)


def test_limits_for_pedestrians_and_overhangs(reference):
    beam = ilkit.Beam(130, {15: "pin", 115: "roller"}, EI=5e8, units="kip-ft")
    plain = deflection_check(beam, share=0.5, divisions=4)
    walk = deflection_check(beam, share=0.5, divisions=4, pedestrians=True)
    source = f"{AASHTO} 2.5.2.6.2, deflection criteria"
    reference("limits: vehicular span/800 and cantilever arm/300; with pedestrians span/1000 and arm/375",
              expected=["L/300", "L/800", "L/300", "L/375", "L/1000", "L/375"],
              computed=list(plain.spans["limit"]) + list(walk.spans["limit"]), source=source, from_memory=True)
    assert list(plain.spans["span"]) == ["left overhang", "span 1", "right overhang"]
    assert plain.spans["allowed [ft]"].iloc[0] == pytest.approx(15 / 300)
    own = deflection_check(beam, share=0.5, divisions=4, limit=500, overhang_limit=150)
    assert list(own.spans["limit"]) == ["L/150", "L/500", "L/150"]
    assert isinstance(own, DeflectionCheck) and "passes" in repr(own)


def test_continuous_girder_span_maxima_between_sections():
    beam = ilkit.Beam(150, {0: "pin", 65: "roller", 150: "roller"}, EI=[(0, 55, 4e8), (55, 75, 7e8), (75, 150, 4e8)],
                      units="kip-ft")
    coarse = deflection_check(beam, lanes=2, girders=4, divisions=5)
    dense = deflection_check(beam, lanes=2, girders=4, divisions=60)
    for k in range(2):
        a, b = coarse.spans.iloc[k], dense.spans.iloc[k]
        assert a["deflection [ft]"] >= b["deflection [ft]"] * (1 - 1e-9)  # the search beats dense sampling
        assert a["deflection [ft]"] == pytest.approx(b["deflection [ft]"], rel=1e-3)
        assert abs(a["at [ft]"] - b["at [ft]"]) <= 150 / 60
    # the largest placements are kept (one lane, before the share)
    assert coarse.largest[1].value * coarse.share == pytest.approx(coarse.spans["deflection [ft]"].iloc[1])
    assert coarse.passes == bool(coarse.spans["passes"].all())
    strict = deflection_check(beam, lanes=2, girders=4, divisions=5, limit=1e6)
    assert not strict.passes and "FAILS" in repr(strict)


def test_any_load_model_with_a_given_share():
    beam = ilkit.Beam(30, {0: "pin", 30: "roller"}, EI=2.5e6, units="kN-m")
    load = AxleTrain([100, 100], [1.2], units="kN-m", name="tandem of our own")
    check = deflection_check(beam, load, share=0.6, divisions=4)
    # two 100 kN loads 1.2 m apart at midspan ± 0.6: AISC simple beam, concentrated load at any point (from memory)
    by_hand = 0.6 * 100 * float(_point_deflection(30, 2.5e6, 14.4, 15) + _point_deflection(30, 2.5e6, 15.6, 15))
    assert float(check.envelope.loc[check.envelope["x [m]"] == 15, "max [m]"].iloc[0]) == pytest.approx(by_hand)
    assert [f.kind for f in check.factors] == ["distribution"]  # the tandem of our own has no dynamic allowance
    uniform = deflection_check(beam, UniformLoad(10, units="kN-m", name="crowd"), share=1, divisions=2)
    assert uniform.spans["deflection [m]"].iloc[0] == pytest.approx(5 * 10 * 30**4 / (384 * 2.5e6), rel=1e-7)


def test_deflection_loading_is_data_with_its_sources():
    model = aashto_deflection_load()
    assert [c.name for c in model.cases] == ["design truck", "25 % design truck + lane"]
    assert model.cases[1].parts[0].loads == (2.0, 8.0, 8.0)
    assert all(c.dynamic_allowance == 0.33 for c in model.cases)
    assert "3.6.1.3.2" in model.source and model.from_memory
    assert aashto_deflection_load(0.0).cases[0].dynamic_allowance == 0


@pytest.mark.parametrize(
    ("make", "error", "match"),
    [
        (lambda b: deflection_check(b.replace(EI=None), share=1), ilkit.StiffnessRequiredError, "flexural stiffness"),
        (lambda b: deflection_check(ilkit.Beam(10, {0: "pin", 10: "roller"}, EI=1), share=1), ilkit.UnitsError,
         "declares no units"),
        (lambda b: deflection_check(b), ilkit.DesignInputError, "number of design lanes and of girders"),
        (lambda b: deflection_check(b, lanes=2), ilkit.DesignInputError, "number of design lanes and of girders"),
        (lambda b: deflection_check(b, share=0.5, lanes=2, girders=4), ilkit.DesignInputError, "not both"),
        (lambda b: deflection_check(b, lanes=0, girders=4), ilkit.DesignInputError, "lanes: the number of design"),
        (lambda b: deflection_check(b, lanes=2, girders=2.5), ilkit.DesignInputError, "girders: the number of"),
        (lambda b: deflection_check(b, share=-1), ilkit.DesignInputError, "share: must be greater than 0"),
        (lambda b: deflection_check(b, share=1, limit=0), ilkit.DesignInputError, "limit: must be greater than 0"),
        (lambda b: deflection_check(b, share=1, pedestrians="yes"), ilkit.DesignInputError, "pedestrians: give True"),
        (lambda b: deflection_check("beam", share=1), ilkit.DesignInputError, "give a Beam"),
        (lambda b: deflection_check(b, "truck", share=1), ilkit.LoadInputError, "expected a load"),
        (lambda b: aashto_deflection_load(-0.1), ilkit.LoadInputError, "dynamic_allowance: must be at least 0"),
    ],
)
def test_bad_input(make, error, match):
    beam = ilkit.Beam(60, {0: "pin", 60: "roller"}, EI=1e8, units="kip-ft")
    with pytest.raises(error, match=match):
        make(beam)
