"""The truss model: stability (mechanisms of several kinds named), determinacy, layouts, bad input.

Mechanisms: a truss whose supports let it slide or turn as a whole, a joint
held by two members in one line, a joint hanging from one member, a panel
without a diagonal (two rigid parts joined by links) and a truss with no
supports; each is refused with :class:`ilkit.UnstableTrussError` naming the
joints that move and the members that turn (or join the parts), and the fix.
Degrees of indeterminacy are counted as ``m + r - 2j`` for stable trusses
(common practice).
"""

from __future__ import annotations

from fractions import Fraction as F

import pytest

import ilkit
from ilkit import TrussInputError, UnstableTrussError, trusses

TRIANGLE = {"L0": (0, 0), "L1": (4, 0), "L2": (8, 0), "U1": (4, 3)}
BARS = [("L0", "L1"), ("L1", "L2"), ("L0", "U1"), ("U1", "L2"), ("L1", "U1")]


def panels(n=3):
    joints = {f"L{i}": (4 * i, 0) for i in range(n + 1)} | {f"U{i}": (4 * i, 3) for i in range(n + 1)}
    bars = [(f"L{i}", f"L{i + 1}") for i in range(n)] + [(f"U{i}", f"U{i + 1}") for i in range(n)]
    bars += [(f"L{i}", f"U{i}") for i in range(n + 1)]
    return joints, bars


def unstable(**kw):
    with pytest.raises(UnstableTrussError) as err:
        trusses.Truss(**kw)
    return err.value


def test_supports_that_let_the_whole_truss_slide_are_named():
    err = unstable(joints=TRIANGLE, members=BARS, supports={"L0": "roller", "L2": "roller"})
    assert "slide horizontally" in str(err) and "pin" in str(err)
    assert set(err.joints) == set(TRIANGLE) and err.motions == 1


def test_supports_whose_reactions_meet_in_one_point_let_the_truss_turn_about_it():
    joints = {**TRIANGLE, "U0": (0, 3)}
    err = unstable(joints=joints, members=[*BARS, ("U0", "U1"), ("L0", "U0")], supports={"L0": "pin", "U0": "roller"})
    assert "turn about joint L0" in str(err)


def test_a_joint_held_by_two_members_in_one_line_is_named():
    err = unstable(joints=TRIANGLE, members=BARS[:4], supports={"L0": "pin", "L2": "roller"})
    assert err.joints == ("L1",) and set(err.members) == {"L0-L1", "L1-L2"}
    assert "in one line" in str(err) and "Add a member" in str(err)


def test_a_joint_hanging_from_one_member_is_named():
    err = unstable(joints={**TRIANGLE, "X": (12, 3)}, members=[*BARS, ("L2", "X")],
                   supports={"L0": "pin", "L2": "roller"})
    assert err.joints == ("X",) and err.members == ("L2-X",)


def test_a_panel_without_a_diagonal_names_the_two_rigid_parts_and_the_links_between_them():
    joints, bars = panels()
    err = unstable(joints=joints, members=[*bars, ("U0", "L1"), ("U2", "L3")], supports={"L0": "pin", "L3": "roller"})
    assert set(err.members) == {"L1-L2", "U1-U2"}
    assert "joints L0, U0, L1, U1" in str(err) and "joints L2, U2, L3, U3" in str(err)
    assert "diagonal of a panel" in str(err)


def test_two_mechanisms_at_once_are_counted():
    joints, bars = panels()
    err = unstable(joints=joints, members=[*bars, ("U0", "L1")], supports={"L0": "pin", "L3": "roller"})
    assert err.motions == 2 and "2 independent ways" in str(err)


def test_degree_of_indeterminacy_counts_members_and_reactions_beyond_the_joint_equations():
    joints, bars = panels()
    diagonals = [("U0", "L1"), ("U1", "L2"), ("U2", "L3")]
    # m + r - 2j (common practice): 13 + 3 - 16 = 0; crossed diagonals in the middle panel: 1; a second pin: 2
    assert trusses.Truss(joints, [*bars, *diagonals], {"L0": "pin", "L3": "roller"}).degree == 0
    crossed = [*bars, *diagonals, ("L1", "U2")]
    assert trusses.Truss(joints, crossed, {"L0": "pin", "L3": "roller"}, EA=1).degree == 1
    assert trusses.Truss(joints, crossed, {"L0": "pin", "L3": "pin"}, EA=1).degree == 2
    with pytest.raises(TrussInputError, match=r"statically indeterminate \(degree 1"):
        trusses.Truss(joints, crossed, {"L0": "pin", "L3": "roller"})


@pytest.mark.parametrize("make", [
    lambda: trusses.pratt(80, 10, 6), lambda: trusses.pratt(80, 10, 6, deck="top"),
    lambda: trusses.howe(80, 8, 8), lambda: trusses.howe(80, 8, 8, end_posts="vertical"),
    lambda: trusses.warren(80, 8, 8), lambda: trusses.warren(80, 8, 8, deck="top"),
    lambda: trusses.warren(80, 8, 8, verticals=True), lambda: trusses.warren(80, 8, 8, verticals=True, deck="top"),
    lambda: trusses.k_truss(80, 8, 10), lambda: trusses.k_truss(80, 8, 10, deck="top"),
    lambda: trusses.parker(120, 10, 18, 12), lambda: trusses.pratt(60, 6, [0, 5, 6, 6.5, 6, 5, 0]),
    lambda: trusses.howe(60, 6, [4, 5, 6, 6.5, 6, 5, 4], deck="top"),
], ids=["pratt", "pratt deck", "howe", "howe vertical posts", "warren", "warren deck", "warren verticals",
        "warren verticals deck", "k", "k deck", "parker", "pratt polygonal", "howe polygonal deck"])
def test_every_layout_is_stable_determinate_and_carries_the_load_to_its_supports(make):
    truss = make()
    assert truss.is_determinate
    assert truss.panel_points[0] == 0 and truss.panel_points[-1] == truss.length
    for k in range(len(truss.deck)):
        assert sum(truss.reaction(j).origin.ordinates[k] for j in truss.supports) == 1
    roles = set(truss.roles.values())
    assert {"top chord", "bottom chord", "diagonal"} <= roles


def test_layout_roles_and_names():
    truss = trusses.pratt(80, 10, 6)
    assert truss.roles["L0-U1"] == "end post" and truss.roles["U1-L1"] == "vertical"
    assert truss.roles["U1-L2"] == "diagonal" and truss.roles["L9-U10"] if "L9-U10" in truss.members else True
    assert "U9-L10" in truss.members and truss.roles["U9-L10"] == "end post"
    k = trusses.k_truss(80, 8, 10)
    assert {"M0-U1", "M0-L1", "U4-L4", "U0-M0"} <= set(k.members)
    parker = trusses.parker(120, 10, 18, 12)
    assert parker.joints["U5"][1] == 18 and parker.joints["U1"][1] == 12


def test_the_deck_coordinate_starts_at_the_left_support():
    base = trusses.pratt(80, 10, 6)
    moved = {j: (x + 100, y - 7) for j, (x, y) in base.joints.items()}
    truss = trusses.Truss(moved, base.members, base.supports, "bottom")
    assert truss.origin == 100 and truss.panel_points == base.panel_points
    assert truss.member_force("U4-U5").expr == base.member_force("U4-U5").expr


@pytest.mark.parametrize("call, match", [
    (lambda: trusses.Truss({}, [], {}), "joints: give a mapping"),
    (lambda: trusses.Truss({"A": (0, 0), "B": (0, 0)}, [("A", "B")], {"A": "pin"}), "both at"),
    (lambda: trusses.Truss({"A": (0, 0), "B": 5}, [("A", "B")], {"A": "pin"}), r"coordinates \(x, y\)"),
    (lambda: trusses.Truss({"A": (0, "x"), "B": (1, 0)}, [("A", "B")], {"A": "pin"}), "cannot read"),
    (lambda: trusses.Truss(TRIANGLE, [("L0", "Q")], {"L0": "pin"}), "not a joint"),
    (lambda: trusses.Truss(TRIANGLE, [*BARS, ("L1", "L0")], {"L0": "pin"}), "both join"),
    (lambda: trusses.Truss(TRIANGLE, [("L0", "L2"), *BARS[2:]], {"L0": "pin"}), "passes through joint L1"),
    (lambda: trusses.Truss(TRIANGLE, BARS, {"L0": "fixed"}), "'pin' or 'roller'"),
    (lambda: trusses.Truss(TRIANGLE, BARS, {"Z": "pin"}), "not a joint"),
    (lambda: trusses.Truss(TRIANGLE, BARS, {"L0": "pin", "L2": "roller"}, deck="middle"), "'bottom' or 'top'"),
    (lambda: trusses.Truss(TRIANGLE, BARS, {"L0": "pin", "L2": "roller"}, deck="top"), "only joint U1"),
    (lambda: trusses.Truss(TRIANGLE, BARS, {"L0": "pin", "L2": "roller"}, deck=["L1", "U1"]), "both at x = 4"),
    (lambda: trusses.Truss(TRIANGLE, BARS, {"L0": "pin", "L2": "roller"}, EA=-1), "greater than 0"),
    (lambda: trusses.Truss(TRIANGLE, BARS, {"L0": "pin", "L2": "roller"}, EA={"L0-L1": 1}), "no axial stiffness"),
    (lambda: trusses.Truss({**TRIANGLE, "Z": (9, 9)}, BARS, {"L0": "pin", "L2": "roller"}), "joined by no member"),
    (lambda: trusses.pratt(80, 9, 6), "panels must be even"),
    (lambda: trusses.pratt(80, 10, [1, 2]), "11 values"),
    (lambda: trusses.pratt(80, 4, [0, 5, 6, 5, 4]), "both end depths"),
    (lambda: trusses.pratt(-80, 4, 6), "span must be greater than 0"),
    (lambda: trusses.pratt(80, 4, 6, supports=("pin",)), "left and the right end"),
    (lambda: trusses.warren(80, 4, [1, 2, 3, 4, 5]), "one depth"),
    (lambda: trusses.parker(80, 6, 10, 12), "end_depth <= depth"),
    (lambda: trusses.pratt(80, 10, 6).member_force("U0-U1"), "no member 'U0-U1'"),
    (lambda: trusses.pratt(80, 10, 6).member_force("L1-U1"), "did you mean 'U1-L1'"),
    (lambda: trusses.pratt(80, 10, 6).reaction("L3"), "no support"),
    (lambda: trusses.pratt(80, 10, 6).line("moment", "L3"), "'member_force' or 'reaction'"),
])
def test_bad_input_is_refused_with_a_typed_error_that_names_the_fix(call, match):
    with pytest.raises(ilkit.IlkitError, match=match):
        call()


def test_units_and_quantities():
    pint = pytest.importorskip("pint")
    ureg = pint.UnitRegistry()
    truss = trusses.pratt(80 * ureg.ft, 10, 6 * ureg.ft, units="kip-ft")
    assert truss.length == 80 and truss.units.name == "kip-ft"
    metric = trusses.pratt(24.384 * ureg.m, 10, 6 * ureg.ft, units="kip-ft")
    assert metric.length == F("24.384") / F("0.3048")
    with pytest.raises(ilkit.UnitsError):
        trusses.pratt(80 * ureg.ft, 10, 6, units=None)
    with pytest.raises(ilkit.UnitsError, match="declares no units"):
        ilkit.loads.place(trusses.pratt(80, 10, 6).member_force("U1-U2"), ilkit.loads.lm2())


def test_a_truss_is_immutable_and_compares_by_value():
    a, b = trusses.pratt(80, 10, 6), trusses.pratt(80, 10, 6)
    assert a == b and hash(a) == hash(b) and a != trusses.pratt(80, 10, 7)
    with pytest.raises(AttributeError, match="immutable"):
        a.units = "kN-m"
    assert "Truss(20 joints, 37 members" in repr(a)
