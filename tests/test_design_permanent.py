"""Permanent loads, stages and settlement: effects from the influence lines.

Reference values name their source beside them; handbook coefficients recalled from memory say so.
"""

from __future__ import annotations

from fractions import Fraction

import pytest
import sympy
from continuous_strategies import elastic_beams
from hypothesis import HealthCheck, assume, given, settings
from hypothesis import strategies as st
from strategies import determinate_beams
from sympy.physics.continuum_mechanics.beam import Beam as SympyBeam

import ilkit
from ilkit.design import (
    DistributedLoad,
    PermanentEffects,
    PointLoad,
    Section,
    Settlement,
    SpanLoad,
    Stage,
    envelope_sections,
    permanent_effects,
)

AISC = "AISC Steel Construction Manual, Part 3: Beam Diagrams and Formulas"


def _close(rel=1e-9, abs=1e-9):
    return {"rel": rel, "abs": abs}


# =========================================================================== handbook coefficients
def test_simple_span_under_uniform_and_point_loads(reference):
    L, w, P, EI = 12.5, 18.0, 140.0, 2.6e5
    beam = ilkit.Beam(L, {0: "pin", L: "roller"}, EI=EI, units="kN-m")
    uniform = permanent_effects(beam, [DistributedLoad("deck", "DC", w)])
    reference("simple span, uniform load: midspan moment wL²/8", expected=w * L**2 / 8,
              computed=uniform.value("moment", L / 2), source=AISC, clause="simple beam, uniformly distributed load",
              from_memory=True, **_close())
    reference("simple span, uniform load: end reaction wL/2", expected=w * L / 2, computed=uniform.value("reaction", 0),
              source=AISC, clause="simple beam, uniformly distributed load", from_memory=True, **_close())
    reference("simple span, uniform load: midspan deflection 5wL⁴/(384EI)", expected=5 * w * L**4 / (384 * EI),
              computed=uniform.value("deflection", L / 2), source=AISC,
              clause="simple beam, uniformly distributed load", from_memory=True, **_close())
    a = 5.0
    point = permanent_effects(beam, [PointLoad("column", "DC", P, a)], at=[a])
    reference("simple span, point load at a: moment under the load Pab/L", expected=P * a * (L - a) / L,
              computed=point.value("moment", a), source=AISC, clause="simple beam, concentrated load at any point",
              from_memory=True, **_close())
    reference("simple span, point load at a: shear left of the load Pb/L and right of it -Pa/L",
              expected=[P * (L - a) / L, -P * a / L],
              computed=[point.value("shear", a, "left"), point.value("shear", a, "right")], source=AISC,
              clause="simple beam, concentrated load at any point", from_memory=True, **_close())


def test_two_equal_spans_under_uniform_load(reference):
    L, w = 15.0, 22.0
    beam = ilkit.Beam(2 * L, {0: "pin", L: "pin", 2 * L: "roller"}, EI=4.0e5, units="kN-m")
    e = permanent_effects(beam, [DistributedLoad("slab", "DC", w)], at=[3 * L / 8])
    clause = "continuous beam, two equal spans, uniform load on both spans"
    reference("support moment -wL²/8", expected=-w * L**2 / 8, computed=e.value("moment", L), source=AISC,
              clause=clause, from_memory=True, **_close())
    reference("end reaction 3wL/8", expected=3 * w * L / 8, computed=e.value("reaction", 0), source=AISC,
              clause=clause, from_memory=True, **_close())
    reference("middle reaction 10wL/8", expected=10 * w * L / 8, computed=e.value("reaction", L), source=AISC,
              clause=clause, from_memory=True, **_close())
    reference("largest span moment 9wL²/128 at 3L/8", expected=9 * w * L**2 / 128,
              computed=e.value("moment", 3 * L / 8), source=AISC, clause=clause, from_memory=True, **_close())
    reference("shear at the middle support ±5wL/8", expected=[-5 * w * L / 8, 5 * w * L / 8],
              computed=[e.value("shear", L, "left"), e.value("shear", L, "right")], source=AISC, clause=clause,
              from_memory=True, **_close())


def test_three_equal_spans_under_uniform_load(reference):
    L, w = 9.0, 1.6
    beam = ilkit.Beam(3 * L, {0: "pin", L: "roller", 2 * L: "roller", 3 * L: "roller"}, EI=5e4, units="kip-ft")
    e = permanent_effects(beam, [DistributedLoad("deck", "DC", w)])
    clause = "continuous beam, three equal spans, all spans loaded"
    for what, expected, computed in [
        ("interior support moments -0.1wL²", [-0.1 * w * L**2] * 2, [e.value("moment", L), e.value("moment", 2 * L)]),
        ("end span moment 0.08wL² at 0.4L", 0.08 * w * L**2, e.value("moment", 0.4 * L)),
        ("centre span moment 0.025wL² at midspan", 0.025 * w * L**2, e.value("moment", 1.5 * L)),
        ("end reactions 0.4wL", [0.4 * w * L] * 2, [e.value("reaction", 0), e.value("reaction", 3 * L)]),
        ("interior reactions 1.1wL", [1.1 * w * L] * 2, [e.value("reaction", L), e.value("reaction", 2 * L)]),
    ]:
        reference(what, expected=expected, computed=computed, source=AISC, clause=clause, from_memory=True,
                  **_close())


def test_fixed_ended_span_under_uniform_load(reference):
    L, w, EI = 8.0, 30.0, 9.0e4
    beam = ilkit.Beam(L, {0: "fixed", L: "fixed"}, EI=EI, units="kN-m")
    e = permanent_effects(beam, [SpanLoad("deck", "DC", w, 1)])
    clause = "beam fixed at both ends, uniformly distributed load"
    reference("end moments -wL²/12", expected=[-w * L**2 / 12] * 2,
              computed=[e.value("moment", 0), e.value("moment", L)], source=AISC, clause=clause, from_memory=True,
              **_close())
    reference("midspan moment wL²/24", expected=w * L**2 / 24, computed=e.value("moment", L / 2), source=AISC,
              clause=clause, from_memory=True, **_close())
    reference("midspan deflection wL⁴/(384EI)", expected=w * L**4 / (384 * EI), computed=e.value("deflection", L / 2),
              source=AISC, clause=clause, from_memory=True, **_close())


# ============================================================================ sympy's beam module
SYMPY = "sympy.physics.continuum_mechanics.beam.Beam (sympy >= 1.13): statics and elastic curve of the loaded beam"

SYMPY_CASES = {
    "three unequal spans, partial uniform loads and a point load": {
        "length": 46, "supports": {0: "pin", 14: "roller", 32: "roller", 46: "roller"},
        "loads": [DistributedLoad("deck", "DC", 11), DistributedLoad("barrier", "DC", 7, start=6, end=25),
                  PointLoad("diaphragm", "DC", 60, 23), SpanLoad("surfacing", "DW", 3, 3)],
        "sections": [7, 14, 21, 30, 39],
    },
    "fixed end, two spans and an overhang": {
        "length": 31, "supports": {0: "fixed", 12: "roller", 27: "roller"},
        "loads": [DistributedLoad("self weight", "DC", 9), PointLoad("post", "DC", 25, 30),
                  DistributedLoad("fill", "EV", 4, start=2, end=10)],
        "sections": [0, 6, 12, 20, 29],
    },
}


def _sympy_beam(case, EI):
    sb = SympyBeam(case["length"], EI, 1)
    unknowns, symbols = [], {}
    for pos, kind in case["supports"].items():
        out = sb.apply_support(pos, kind)
        if kind == "fixed":
            symbols[pos] = out[0]
            unknowns += list(out)
        else:
            symbols[pos] = out
            unknowns.append(out)
    return sb, symbols, unknowns


def _load_sympy(sb, load, length):
    if isinstance(load, PointLoad):
        sb.apply_load(-sympy.Rational(str(load.load)), sympy.Rational(str(load.at)), -1)
    elif isinstance(load, SpanLoad):
        raise AssertionError("convert span loads first")
    else:
        start = 0 if load.start is None else load.start
        end = length if load.end is None else load.end
        sb.apply_load(-sympy.Rational(str(load.intensity)), sympy.Rational(str(start)), 0,
                      end=sympy.Rational(str(end)))


@pytest.mark.parametrize("name", list(SYMPY_CASES))
def test_against_sympy_beam(name, reference):
    case = SYMPY_CASES[name]
    EI = 1000
    beam = ilkit.Beam(case["length"], case["supports"], EI=EI, units="kN-m")
    effects = permanent_effects(beam, case["loads"], at=case["sections"])
    sb, symbols, unknowns = _sympy_beam(case, EI)
    for load in case["loads"]:
        if isinstance(load, SpanLoad):
            a, b = beam.spans[load.span - 1]
            load = DistributedLoad(load.name, load.category, load.intensity, start=a, end=b)
        _load_sympy(sb, load, case["length"])
    sb.solve_for_reaction_loads(*unknowns)
    x = sb.variable
    expected_r = [float(sb.reaction_loads[symbols[p]]) for p in case["supports"]]
    reference(f"{name}: reactions", expected=expected_r,
              computed=[effects.value("reaction", p) for p in case["supports"]], source=SYMPY,
              clause="reaction_loads", **_close(1e-9, 1e-7))
    sections = [s for s in case["sections"] if s not in case["supports"] or s == 0]
    # sympy's bending_moment() is hogging positive and its deflection upward positive: both negated
    moment = sb.bending_moment()
    deflection = sb.deflection()
    reference(f"{name}: moments at x = {sections}",
              expected=[float(-moment.subs(x, s)) for s in sections],
              computed=[effects.value("moment", s) for s in sections], source=SYMPY, clause="bending_moment()",
              **_close(1e-9, 1e-7))
    reference(f"{name}: deflections at x = {sections}",
              expected=[float(-deflection.subs(x, s)) for s in sections],
              computed=[effects.value("deflection", s) for s in sections], source=SYMPY, clause="deflection()",
              **_close(1e-9, 1e-9))


# ===================================================================================== settlement
def test_settlement_of_the_middle_support_of_two_equal_spans(reference):
    """Closed form, derived here: the middle bearing of two equal spans L settling by Δ acts on the beam of
    length 2L (pinned at its ends) like a downward force F at midspan with F(2L)³/(48EI) = Δ, so
    F = 6EIΔ/L³; the middle moment is F·2L/4 = 3EIΔ/L² (sagging), the middle reaction -F, the end reactions
    F/2 = 3EIΔ/L³."""
    L, EI, delta = 20.0, 3.2e6, 0.015
    beam = ilkit.Beam(2 * L, {0: "pin", L: "roller", 2 * L: "roller"}, EI=EI, units="kN-m")
    e = permanent_effects(beam, [Settlement("pier settles", L, delta)])
    derived = "closed form derived in the test (two equal spans, middle bearing settles)"
    reference("middle moment 3EIΔ/L²", expected=3 * EI * delta / L**2, computed=e.value("moment", L), source=derived,
              clause="F = 6EIΔ/L³, M = F·2L/4", **_close())
    reference("reactions 3EIΔ/L³, -6EIΔ/L³, 3EIΔ/L³",
              expected=[3 * EI * delta / L**3, -6 * EI * delta / L**3, 3 * EI * delta / L**3],
              computed=[e.value("reaction", p) for p in (0, L, 2 * L)], source=derived, clause="F = 6EIΔ/L³",
              **_close())
    reference("deflection at the settled bearing Δ", expected=delta, computed=e.value("deflection", L),
              source=derived, clause="imposed movement", **_close())
    reference("shear in the left span 3EIΔ/L³", expected=3 * EI * delta / L**3, computed=e.value("shear", L / 2),
              source=derived, clause="V = F/2", **_close())
    assert e.notes == ()
    assert set(e.frame["category"]) == {"settlement"}


def test_settlement_of_one_end_of_a_fixed_ended_span(reference):
    """Closed form, derived here: a span L fixed at both ends whose right end drops Δ bends into the cubic
    v = Δ(3ξ² - 2ξ³) (ξ = x/L, zero slope at both ends); M = -EI v'' = -6EIΔ/L² (1 - 2ξ), so -6EIΔ/L² at
    the left end and +6EIΔ/L² at the right end, shear dM/dx = 12EIΔ/L³."""
    L, EI, delta = 7.5, 8.0e4, -0.004  # the bearing lifted by 4 mm
    beam = ilkit.Beam(L, {0: "fixed", L: "fixed"}, EI=EI, units="kN-m")
    e = permanent_effects(beam, [Settlement("jacking", L, delta, category="imposed")])
    derived = "closed form derived in the test (fixed-ended span, one end moves)"
    reference("end moments ∓6EIΔ/L²", expected=[-6 * EI * delta / L**2, 6 * EI * delta / L**2],
              computed=[e.value("moment", 0), e.value("moment", L)], source=derived, clause="M = -EI v''",
              **_close())
    reference("shear 12EIΔ/L³ and reactions ±12EIΔ/L³",
              expected=[12 * EI * delta / L**3, 12 * EI * delta / L**3, -12 * EI * delta / L**3],
              computed=[e.value("shear", 0.3 * L), e.value("reaction", 0), e.value("reaction", L)], source=derived,
              clause="V = dM/dx", **_close())
    reference("deflection at midspan Δ/2", expected=delta / 2, computed=e.value("deflection", L / 2), source=derived,
              clause="v(1/2) = Δ(3/4 - 1/4)", **_close())


def test_settlement_of_a_determinate_beam_causes_no_force_and_says_so():
    beam = ilkit.Beam(18, {0: "pin", 12: "roller"}, EI=5e4, units="kN-m")
    e = permanent_effects(beam, [Settlement("abutment", 12, 0.02)])
    forces = e.frame[e.frame["quantity"] != "deflection"]
    assert (forces["value"] == 0).all() and len(forces) > 0
    assert any("statically determinate" in n and "rigid body" in n for n in e.notes)
    # the rigid-body movement: a rotation about the pin, 0.02 at the bearing, 0.03 at the free end
    assert e.value("deflection", 12) == pytest.approx(0.02)
    assert e.value("deflection", 18) == pytest.approx(0.03)
    assert e.value("deflection", 6) == pytest.approx(0.01)


def test_settlement_errors():
    beam = ilkit.Beam(20, {0: "pin", 10: ilkit.Spring(vertical=5e3), 20: "roller"}, EI=1e4, units="kN-m")
    with pytest.raises(ilkit.LoadInputError, match="no support at x=5"):
        permanent_effects(beam, [Settlement("s", 5, 0.01)])
    with pytest.raises(ilkit.LoadInputError, match=r"elastic bearing .* point load k·Δ"):
        permanent_effects(beam, [Settlement("s", 10, 0.01)])
    with pytest.raises(ilkit.StiffnessRequiredError):
        permanent_effects(ilkit.Beam(20, {0: "pin", 10: "pin", 20: "roller"}), [Settlement("s", 10, 0.01)])


# ========================================================================================= stages
def test_stages_add_and_each_acts_on_its_own_beam(reference):
    steel = ilkit.Beam(60, {0: "pin", 27: "roller", 60: "roller"}, EI=1.8e6, units="kN-m")
    composite = steel.replace(EI=[(0, 22, 4.1e6), (22, 32, 2.6e6), (32, 60, 4.1e6)])
    wet = Stage("wet deck on steel", steel, [DistributedLoad("slab", "DC", 14), PointLoad("diaphragm", "DC", 12, 40)])
    sdl = Stage("superimposed, composite", composite,
                [DistributedLoad("barriers", "DC", 5), SpanLoad("surfacing", "DW", 3.5, 2)])
    both = permanent_effects([wet, sdl])
    alone = [permanent_effects(s.beam, s.loads) for s in (wet, sdl)]
    for quantity, x in [("moment", 27), ("deflection", 13.5), ("reaction", 27), ("deflection", 43.5)]:
        side = "left" if quantity == "moment" else None
        assert both.value(quantity, x, side) == pytest.approx(sum(a.value(quantity, x, side) for a in alone))
        assert both.value(quantity, x, side, stage="wet deck on steel") == pytest.approx(alone[0].value(quantity, x,
                                                                                                        side))
    # the composite stage's moments depend on its varying EI: not those of a prismatic beam
    prismatic = permanent_effects(steel, sdl.loads)
    assert abs(both.value("moment", 27, stage="superimposed, composite") - prismatic.value("moment", 27)) > 1.0
    # deflections of a prismatic stage scale with 1/EI (stiffness method, linear in 1/EI)
    doubled = permanent_effects(steel.replace(EI=3.6e6), wet.loads)
    reference("deflection of a stage on a beam twice as stiff is half", expected=alone[0].value("deflection", 13.5) / 2,
              computed=doubled.value("deflection", 13.5), source="linear elasticity: deflection proportional to 1/EI "
              "for a prismatic continuous beam (forces independent of EI)", **_close())
    table = both.by_category()
    assert list(table.columns) == ["quantity", "x", "side", "DC", "DW"]
    row = table[(table["quantity"] == "reaction") & (table["x"] == 27)]
    assert float(row["DC"].iloc[0] + row["DW"].iloc[0]) == pytest.approx(both.value("reaction", 27))
    assert "2 stages" in repr(both)


def test_stage_errors():
    a = ilkit.Beam(20, {0: "pin", 20: "roller"}, EI=1, units="kN-m")
    b = ilkit.Beam(20, {0: "pin", 19: "roller"}, EI=1, units="kN-m")
    load = DistributedLoad("w", "DC", 1)
    with pytest.raises(ilkit.LoadInputError, match="another girder line"):
        permanent_effects([Stage("1", a, [load]), Stage("2", b, [load])])
    with pytest.raises(ilkit.LoadInputError, match="distinct names"):
        Stage("1", a, [load, load])
    with pytest.raises(ilkit.LoadInputError, match="stages must have distinct names"):
        permanent_effects([Stage("1", a, [load]), Stage("1", a, [load])])
    with pytest.raises(ilkit.LoadInputError, match="not both"):
        permanent_effects(Stage("1", a, [load]), [load])
    with pytest.raises(ilkit.LoadInputError, match="give the loads with the beam"):
        permanent_effects(a)
    with pytest.raises(ilkit.LoadInputError, match="a load must be a DistributedLoad"):
        Stage("1", a, [ilkit.loads.design_lane()])
    with pytest.raises(ilkit.LoadInputError, match="give the Beam of this stage"):
        Stage("1", "beam", [load])


# ================================================================================= point loads at sections
def test_point_load_at_a_section_gives_the_shear_on_both_faces():
    beam = ilkit.Beam(24, {0: "pin", 12: "roller", 24: "roller"}, EI=1e5, units="kN-m")
    e = permanent_effects(beam, [PointLoad("column", "DC", 100, 6), PointLoad("on the pier", "DC", 50, 12)])
    shear = e.frame[(e.frame["quantity"] == "shear") & (e.frame["x"] == 6)]
    left, right = (float(shear.loc[shear["side"] == s, "value"].sum()) for s in ("left", "right"))
    assert left - right == pytest.approx(100)  # the load sits between the faces
    with pytest.raises(ilkit.SideRequiredError, match="jumps at x=6"):
        e.value("shear", 6)
    # the moment does not jump there: one row, no side
    assert set(e.frame.loc[(e.frame["quantity"] == "moment") & (e.frame["x"] == 6), "side"]) == {""}
    # a load on the pier goes into it: it does not pass the faces of the pier's section
    pier = permanent_effects(beam, [PointLoad("on the pier", "DC", 50, 12)])
    assert pier.value("shear", 12, "left") == pytest.approx(0, abs=1e-12)
    assert pier.value("shear", 12, "right") == pytest.approx(0, abs=1e-12)
    assert pier.value("reaction", 12) == pytest.approx(50)
    # loads at the ends go into the end bearings
    ends = permanent_effects(beam, [PointLoad("a", "DC", 10, 0), PointLoad("b", "DC", 10, 24)])
    assert ends.value("shear", 0) == pytest.approx(0, abs=1e-12)
    assert ends.value("shear", 24) == pytest.approx(0, abs=1e-12)
    assert ends.value("reaction", 0) == pytest.approx(10)


def test_point_load_at_the_free_end_of_a_cantilever():
    beam = ilkit.Beam(6, {0: "fixed"}, EI=1e4, units="kN-m")
    e = permanent_effects(beam, [PointLoad("sign", "DC", 8, 6)])
    assert e.value("shear", 6) == pytest.approx(8)  # the fixed end pushes up the part left of the cut
    assert e.value("moment", 0) == pytest.approx(-48)
    assert e.value("deflection", 6) == pytest.approx(8 * 6**3 / (3 * 1e4))  # PL³/3EI (AISC, cantilever, from memory)


def test_point_load_at_a_shear_release_is_refused():
    beam = ilkit.Beam(20, {0: "fixed", 20: "roller"}, shear_releases=[8], units="kN-m")
    with pytest.raises(ilkit.LoadInputError, match="shear release at x=8, which belongs to neither"):
        permanent_effects(beam, [PointLoad("p", "DC", 5, 8)])


def test_girder_loaded_through_a_floor_system():
    """Statics of a simple span of 60 with floor beams every 10 (derived here): a load on a floor beam reaches
    the girder there, a load between floor beams reaches it at the two beside it (simple stringers)."""
    beam = ilkit.Beam(60, {0: "pin", 60: "roller"}, EI=1e5, units="kN-m", panel_points=[0, 10, 20, 30, 40, 50, 60])
    loads = [PointLoad("a", "DC", 100, 0), PointLoad("b", "DC", 100, 20), PointLoad("c", "DC", 100, 60),
             PointLoad("d", "DC", 100, 25)]
    e = permanent_effects(beam, loads)
    r0 = 100 + 100 * 40 / 60 + 50 * 40 / 60 + 50 * 30 / 60  # d splits 50/50 onto the floor beams at 20 and 30
    assert e.value("reaction", 0) == pytest.approx(r0)
    assert e.value("shear", 0) == pytest.approx(r0 - 100)  # the load on the end floor beam is left of the cut
    assert e.value("shear", 20, "left") == pytest.approx(r0 - 100)
    assert e.value("shear", 20, "right") == pytest.approx(r0 - 100 - 100 - 50)
    assert e.value("shear", 60) == pytest.approx(-(400 - r0) + 100)
    assert e.value("moment", 30) == pytest.approx(r0 * 30 - 100 * 30 - 100 * 10 - 50 * 10 - 50 * 0)
    # a settlement moves the girder itself: its own deflected shape, not the chord between floor beams
    continuous = beam.replace(supports={0: "pin", 30: "roller", 60: "roller"})
    floored = permanent_effects(continuous, [Settlement("s", 30, 0.01)])
    plain = permanent_effects(continuous.replace(panel_points=None), [Settlement("s", 30, 0.01)])
    for quantity, x in [("moment", 30), ("deflection", 24), ("reaction", 30), ("shear", 12)]:
        assert floored.value(quantity, x) == pytest.approx(plain.value(quantity, x))


# ================================================================================== bad input
BEAM = ilkit.Beam(20, {0: "pin", 10: "pin", 20: "roller"}, EI=2e4, units="kN-m")


@pytest.mark.parametrize(
    ("make", "match"),
    [
        (lambda: permanent_effects(BEAM, [DistributedLoad("w", "DC", 1, start=15, end=25)]), "x=25 is off the beam"),
        (lambda: permanent_effects(BEAM, [PointLoad("p", "DC", 1, -2)]), "x=-2 is off the beam"),
        (lambda: permanent_effects(BEAM, [SpanLoad("w", "DC", 1, 3)]), "has 2 spans .* no span 3"),
        (lambda: DistributedLoad("w", "DC", 1, start=8, end=4), "start .* must lie left of end"),
        (lambda: DistributedLoad("w", "", 1), "category must be a non-empty text"),
        (lambda: DistributedLoad("", "DC", 1), "name must be a non-empty"),
        (lambda: PointLoad("p", "DC", float("nan"), 3), "not a finite number"),
        (lambda: PointLoad("p", "DC", True, 3), "boolean"),
        (lambda: SpanLoad("w", "DC", 1, 0), "span .* whole number >= 1"),
        (lambda: permanent_effects(BEAM, [DistributedLoad("w", "DC", 1)], quantities=["torque"]),
         "quantities: a quantity must be one of 'moment'"),
        (lambda: permanent_effects(BEAM, [DistributedLoad("w", "DC", 1)], quantities=[]), "the list is empty"),
        (lambda: permanent_effects(BEAM, [DistributedLoad("w", "DC", 1)], sections=[3.5]), "must be a Section"),
        (lambda: permanent_effects(BEAM, [DistributedLoad("w", "DC", 1)]).value("torque", 5), "quantity must be"),
        (lambda: permanent_effects(BEAM, [DistributedLoad("w", "DC", 1)]).value("moment", 5.5), "no moment at x=5.5"),
        (lambda: permanent_effects(BEAM, [DistributedLoad("w", "DC", 1)]).value("moment", 5, category="DW"),
         "no category 'DW'"),
        (lambda: permanent_effects(BEAM, [DistributedLoad("w", "DC", 1)]).value("shear", 10), "jumps at x=10"),
        (lambda: permanent_effects("beam"), "give a Beam and its loads"),
    ],
)
def test_bad_input_is_a_typed_error_naming_the_fix(make, match):
    with pytest.raises(ilkit.IlkitError, match=match):
        make()


def test_wrong_units_are_refused_and_right_ones_converted():
    pint = pytest.importorskip("pint")
    ureg = pint.UnitRegistry()
    with pytest.raises(ilkit.UnitsError, match=r"intensity: .* is a force, but .* must be a load per length"):
        DistributedLoad("w", "DC", 12 * ureg.kN)
    with pytest.raises(ilkit.UnitsError, match="declares no unit system"):
        permanent_effects(ilkit.Beam(10, {0: "pin", 10: "roller"}), [PointLoad("p", "DC", 1 * ureg.kip, 5)])
    in_si = permanent_effects(BEAM, [DistributedLoad("w", "DC", 1.2 * ureg.kN / ureg.m, start=2000 * ureg.mm),
                                     PointLoad("p", "DC", 2 * ureg.kip, 5 * ureg.m)])
    plain = permanent_effects(BEAM, [DistributedLoad("w", "DC", 1.2, start=2),
                                     PointLoad("p", "DC", 2 * 4.4482216152605, 5)])
    assert in_si.value("moment", 10) == pytest.approx(plain.value("moment", 10), rel=1e-12)


def test_deflections_need_ei_and_are_left_out_with_a_note_by_default():
    beam = ilkit.Beam(10, {0: "pin", 10: "roller"}, units="kN-m")
    e = permanent_effects(beam, [DistributedLoad("w", "DC", 1)])
    assert e.quantities == ("moment", "shear", "reaction")
    assert any("deflections are left out" in n for n in e.notes)
    with pytest.raises(ilkit.StiffnessRequiredError):
        permanent_effects(beam, [DistributedLoad("w", "DC", 1)], quantities=["deflection"])


def test_given_sections_and_repr():
    sections = envelope_sections(BEAM, 4)
    e = permanent_effects(BEAM, [DistributedLoad("w", "DC", 1.5), SpanLoad("s", "DW", 2, 2)], sections=sections,
                          quantities=("moment",))
    assert len(e.frame) == 2 * len(sections)
    assert e.sections == sections
    assert repr(e) == ("PermanentEffects(2 loads, categories DC, DW; moment at 10 sections, units='kN-m')")
    assert isinstance(e, PermanentEffects)
    assert repr(DistributedLoad("w", "DC", 1.5, start=2)) == "DistributedLoad('w', 'DC', 1.5, start=2)"
    assert repr(Settlement("s", 10, "0.01")) == "Settlement('s', at=10, displacement=0.01)"
    assert Section(Fraction(10), "left") in e.sections


# ================================================================================== laws
def _random_loads(draw, beam):
    L = beam.length
    grid = [L * Fraction(k, 48) for k in range(49)]
    loads = []
    for k in range(draw(st.integers(1, 4))):
        kind = draw(st.sampled_from(["whole", "stretch", "point", "span"]))
        w = draw(st.sampled_from([Fraction(3), Fraction(-1, 2), Fraction(25, 4), Fraction(11)]))
        if kind == "whole":
            loads.append(DistributedLoad(f"l{k}", "DC", w))
        elif kind == "stretch":
            a, b = sorted(draw(st.lists(st.sampled_from(grid), min_size=2, max_size=2, unique=True)))
            loads.append(DistributedLoad(f"l{k}", "DW", w, start=a, end=b))
        elif kind == "span" and beam.spans:
            loads.append(SpanLoad(f"l{k}", "DW", w, draw(st.integers(1, len(beam.spans)))))
        else:
            c = draw(st.sampled_from([g for g in grid if g not in beam.shear_releases]))
            loads.append(PointLoad(f"l{k}", "DC", w * 7, c))
    return loads


def _stretch(load, beam):
    if isinstance(load, SpanLoad):
        return beam.spans[load.span - 1]
    return (Fraction(0) if load.start is None else load.start, beam.length if load.end is None else load.end)


def _check_statics(beam, loads, e, floor=0.0):
    """Equilibrium of the whole beam and of the part left of every section, from the tabulated reactions;
    ``floor``: the least force × length by which rounding is judged (where every force may be zero)."""
    total = sum(float(ld.load) if isinstance(ld, PointLoad) else float(ld.intensity) * float(
        _stretch(ld, beam)[1] - _stretch(ld, beam)[0]) for ld in loads)
    reactions = {s.at: e.value("reaction", s.at) for s in beam.supports}
    scale = max(abs(total), *(abs(r) for r in reactions.values())) * float(beam.length) or 1.0
    scale = max(scale, floor)
    assert sum(reactions.values()) == pytest.approx(total, abs=1e-9 * scale)
    moment_jumps = {}
    for s in beam.supports:
        if s.restrains_rotation and 0 < s.at < beam.length:
            moment_jumps[s.at] = e.value("moment", s.at, "right") - e.value("moment", s.at, "left")
    start = e.value("moment", 0)
    rows = e.frame[e.frame["quantity"] == "shear"]
    for x, side in {(r.x, r.side) for r in rows.itertuples()}:
        xf = Fraction(x)
        # what stands at the section is left of the cut on its right face, and at the left end (inner face)
        at_section_left = side == "right" or (side == "" and xf == 0)

        def cut(p, xf=xf, at_section_left=at_section_left):
            return p < xf or (p == xf and at_section_left)

        load_left = moment_left = 0.0
        for ld in loads:
            if isinstance(ld, PointLoad):
                if cut(Fraction(ld.at)):
                    load_left += float(ld.load)
                    moment_left += float(ld.load) * float(xf - Fraction(ld.at))
            else:
                a, b = _stretch(ld, beam)
                hi = min(b, xf)
                if hi > a:
                    load_left += float(ld.intensity) * float(hi - a)
                    moment_left += float(ld.intensity) * float(hi - a) * float(xf - (a + hi) / 2)
        left_r = sum(r for p, r in reactions.items() if cut(p))
        shear = e.value("shear", x, side or None)
        assert shear == pytest.approx(left_r - load_left, abs=1e-9 * scale)
        if not any(s.restrains_rotation for s in beam.supports if s.at == xf):
            expected = start + sum(r * float(xf - p) for p, r in reactions.items() if p < xf) - moment_left
            expected += sum(j for p, j in moment_jumps.items() if p < xf)
            assert e.value("moment", x, side or None) == pytest.approx(expected, abs=1e-8 * scale)


@settings(max_examples=30, deadline=None, suppress_health_check=[HealthCheck.too_slow])
@given(data=st.data(), beam=determinate_beams())
def test_statics_of_the_loaded_determinate_beam(data, beam):
    """Law: the tabulated reactions balance the loads, and the shear and moment at every section equal the
    resultant of the forces left of it (statics of the loaded beam, written here)."""
    loads = _random_loads(data.draw, beam)
    e = permanent_effects(beam, loads, divisions=4)
    _check_statics(beam, loads, e)


@settings(max_examples=25, deadline=None, suppress_health_check=[HealthCheck.too_slow])
@given(data=st.data(), beam=elastic_beams(max_spans=3))
def test_statics_of_the_loaded_continuous_beam(data, beam):
    """The same law on indeterminate beams (stiffness method), springs and varying EI included."""
    loads = _random_loads(data.draw, beam)
    e = permanent_effects(beam, loads, divisions=4)
    _check_statics(beam, loads, e)


@settings(max_examples=20, deadline=None, suppress_health_check=[HealthCheck.too_slow])
@given(data=st.data(), beam=elastic_beams(max_spans=3, min_degree=0))
def test_uniform_load_equals_point_loads_by_simpsons_rule(data, beam):
    """Two routes: the exact integral of the line's pieces against the superposition of point loads at the
    ends and midpoints of every stretch between the line's knots with Simpson's weights, exact for cubic
    pieces (moments, reactions and deflections; their lines are continuous)."""
    L = beam.length
    grid = [L * Fraction(k, 24) for k in range(25)]
    a, b = sorted(data.draw(st.lists(st.sampled_from(grid), min_size=2, max_size=2, unique=True)))
    w = Fraction(9, 2)
    sections = envelope_sections(beam, 3)
    quantities = ("moment", "reaction", "deflection")
    uniform = permanent_effects(beam, [DistributedLoad("w", "DC", w, start=a, end=b)], sections=sections,
                                quantities=quantities)
    knots = {a, b, *(p for p in beam._points if a < p < b), *(s.x for s in sections if a < s.x < b)}
    knots = sorted(knots)
    weights: dict[Fraction, Fraction] = {}
    for p, q in zip(knots[:-1], knots[1:]):
        h = q - p
        for pos, weight in ((p, h / 6), ((p + q) / 2, 2 * h / 3), (q, h / 6)):
            weights[pos] = weights.get(pos, Fraction(0)) + weight * w
    points = [PointLoad(f"p{k}", "DC", weight, pos) for k, (pos, weight) in enumerate(sorted(weights.items()))
              if pos not in beam.shear_releases]
    assume(len(points) == len(weights))
    superposed = permanent_effects(beam, points, sections=sections, quantities=quantities)
    one = uniform.frame.groupby(["quantity", "x", "side"], sort=False)["value"].sum()
    many = superposed.frame.groupby(["quantity", "x", "side"], sort=False)["value"].sum()
    assert list(one.index) == list(many.index)
    for quantity in quantities:
        scale = max(abs(one[quantity]).max(), 1e-300)
        for key, value in one[quantity].items():
            assert value == pytest.approx(many[quantity][key], abs=1e-9 * scale)


def _rigid_bearings(beam):
    return [s.at for s in beam.supports if s.vertical_stiffness is None]


@settings(max_examples=25, deadline=None, suppress_health_check=[HealthCheck.too_slow])
@given(data=st.data(), beam=elastic_beams(max_spans=3))
def test_settlement_is_self_equilibrated_and_reciprocal(data, beam):
    """Laws: a settlement alone loads the beam with reactions that balance (sum zero, and the shear and
    moment at every section are the resultant of the reactions left of it), and by Maxwell-Betti the
    reaction at bearing k due to a unit settlement of bearing s equals the reaction at s due to a unit
    settlement of k."""
    bearings = _rigid_bearings(beam)
    assume(len(bearings) >= 2)
    s, k = data.draw(st.lists(st.sampled_from(bearings), min_size=2, max_size=2, unique=True))
    one = permanent_effects(beam, [Settlement("s", s, 1)], divisions=3, quantities=("moment", "shear", "reaction"))
    # the size of settlement forces: EI·Δ/h² (force × length) on the shortest element h; a settlement may move
    # a part of the beam as a rigid body and cause no force at all
    points = beam._points
    h = min(b - a for a, b in zip(points[:-1], points[1:]))
    floor = float(max(ei for _, _, ei in beam.EI_ranges) / h**2)
    _check_statics(beam, [], one, floor)
    other = permanent_effects(beam, [Settlement("k", k, 1)], quantities=("reaction",))
    scale = max(abs(one.frame["value"]).max(), floor / float(h))
    assert one.value("reaction", k) == pytest.approx(other.value("reaction", s), abs=1e-9 * scale)


def test_a_name_says_what_the_loads_are_of():
    beam = ilkit.Beam(40, {0: "pin", 40: "roller"}, units="kip-ft")
    e = permanent_effects(beam, [DistributedLoad("slab", "DC", 1.0)], quantities=["moment"], name="girder 2")
    assert e.name == "girder 2"
    assert permanent_effects(beam, [DistributedLoad("slab", "DC", 1.0)], quantities=["moment"]).name == ""
    with pytest.raises(ilkit.DesignInputError, match="name"):
        permanent_effects(beam, [DistributedLoad("slab", "DC", 1.0)], name=3)
