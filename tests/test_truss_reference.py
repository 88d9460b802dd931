"""Indeterminate trusses against a general-purpose finite-element library, and Betti's reciprocal theorem.

Reference: anastruct (``anastruct.SystemElements``, a general-purpose 2D
finite-element library for frames and trusses from the package registry),
truss elements with the same ``EA``, a pin and rollers (``add_support_roll``,
free horizontally), a unit downward point load at each panel point in turn;
its axial forces are tension positive like ilkit's.  anastruct keeps element
lengths in single precision, so the comparison allows a relative difference
of 1e-6.  (openseespy, the other candidate, was not used: its Linux wheel
needs the system library ``libblas.so.3``, which a clean machine lacks.)

Scenarios of our own: a two-span continuous Pratt truss, a simple span with
crossed diagonals (counters) in its middle panels, and a Warren truss on two
pins.
"""

from __future__ import annotations

import numpy as np
import pytest

from ilkit import trusses

anastruct = pytest.importorskip("anastruct")

SOURCE = "anastruct (general-purpose 2D finite-element library), truss elements"


def fe_solution(truss):
    """Member forces ``{member: [N at each panel point]}`` and vertical reactions from anastruct."""
    from anastruct import SystemElements

    forces = {m: [] for m in truss.members}
    reactions = {j: [] for j in truss.supports}
    for joint in truss.deck:
        ss = SystemElements()
        ids = {}
        for name, (a, b) in truss.members.items():
            (xa, ya), (xb, yb) = (tuple(map(float, truss.joints[j])) for j in (a, b))
            ids[name] = ss.add_truss_element([[xa, ya], [xb, yb]], EA=float(truss.EA[name]))
        node = {j: ss.find_node_id([float(x), float(y)]) for j, (x, y) in truss.joints.items()}
        for j, kind in truss.supports.items():
            if kind == "pin":
                ss.add_support_hinged(node[j])
            else:
                ss.add_support_roll(node[j], direction="x")
        ss.point_load(node[joint], Fy=-1.0)
        ss.solve()
        for name, eid in ids.items():
            forces[name].append(float(ss.get_element_results(eid)["Nmax"]))
        for j in truss.supports:
            # anastruct reports the force the support takes from the structure: the reaction with its sign flipped
            reactions[j].append(-float(ss.get_node_results_system(node[j])["Fy"]))
    return forces, reactions


def continuous_pratt():
    """Two 36 m spans, 12 panels of 6 m, 8 m deep (diagonals 10 m); chords stiffer than the web (kN)."""
    base = trusses.pratt(72, 12, 8, end_posts="vertical", units="kN-m")
    ea = {m: (2.1e6 if "chord" in role else 1.2e6) for m, role in base.roles.items()}
    supports = {"L0": "pin", "L6": "roller", "L12": "roller"}
    return trusses.Truss(base.joints, base.members, supports, "bottom", EA=ea, units="kN-m", roles=base.roles)


def counters():
    """A 48 m span of 8 panels, 6 m deep, with crossed diagonals in the two middle panels."""
    base = trusses.pratt(48, 8, 6, units="kN-m")
    members = dict(base.members)
    members["L3-U4"] = ("L3", "U4")
    members["U4-L5"] = ("U4", "L5")
    ea = {m: (1.8e6 if m in ("L3-U4", "U4-L5") else 3.0e6) for m in members}
    return trusses.Truss(base.joints, members, base.supports, "bottom", EA=ea, units="kN-m")


def two_pins():
    """A 40 m Warren truss (8 panels, 3 m deep) on pins at both ends."""
    base = trusses.warren(40, 8, 3, units="kN-m")
    return trusses.Truss(base.joints, base.members, {"L0": "pin", "L8": "pin"}, "bottom", EA=2.5e6, units="kN-m")


@pytest.mark.parametrize("make, degree", [(continuous_pratt, 1), (counters, 2), (two_pins, 1)],
                         ids=["continuous Pratt", "crossed diagonals", "two pins"])
def test_indeterminate_trusses_against_a_finite_element_library(reference, make, degree):
    truss = make()
    assert truss.degree == degree
    forces, reactions = fe_solution(truss)
    scale = max(abs(v) for values in forces.values() for v in values)
    computed = {m: list(line.origin.ordinates) for m, line in truss.member_forces().items()}
    reference(f"{make.__doc__.split(':')[0].strip()}: every member force at every panel point",
              expected=[forces[m] for m in truss.members], computed=[computed[m] for m in truss.members],
              source=SOURCE, clause="SystemElements.add_truss_element, point_load, solve; axial force N",
              rel=1e-6, abs=1e-6 * scale)
    reference(f"{make.__doc__.split(':')[0].strip()}: vertical reactions at every panel point",
              expected=[reactions[j] for j in truss.supports],
              computed=[list(truss.reaction(j).origin.ordinates) for j in truss.supports],
              source=SOURCE, clause="get_node_results_system, Fy", rel=1e-6, abs=1e-6)


def test_maxwell_betti_the_member_force_line_is_the_deck_movement_under_a_unit_shortening():
    """Betti's reciprocal theorem on the continuous truss: the force in a member for a unit load at panel
    point k equals the upward movement of k when the member alone is made shorter by 1 (a separate solution
    of the stiffness equations, with the dislocation as its load); Maxwell: the stiffness matrix is
    symmetric, so the movement at i for a load at j equals that at j for a load at i."""
    truss = continuous_pratt()
    for name in ("L5-L6", "U6-L6", "U2-L3", "U8-U9"):
        line = truss.member_force(name)
        shape = line.origin.shape()
        moved = [shape[j][1] for j in truss.deck]
        assert np.allclose(moved, line.origin.ordinates, rtol=1e-9, atol=1e-12)
    from ilkit.trusses.stiffness import StiffnessModel

    layout = truss.layout
    model = StiffnessModel(layout, tuple(float(truss.EA[m]) for m, _, _ in layout.members))
    index = {j: k for k, j in enumerate(layout.joints)}
    loads = np.zeros((2 * len(layout.joints), len(truss.deck)))
    for k, j in enumerate(truss.deck):
        loads[2 * index[j] + 1, k] = -1.0
    d = model.displacements(loads)
    flexibility = -np.array([[d[2 * index[i] + 1, k] for k in range(len(truss.deck))] for i in truss.deck])
    assert np.allclose(flexibility, flexibility.T, rtol=1e-10, atol=0)
