"""Member force influence lines of parallel-chord trusses against the method of sections, written out here.

The method of sections (statics, common practice): cut the truss through a
panel and take the part left of the cut.  The load reaches the truss only at
the panel points of the deck, so the part left of the cut carries the left
reaction and the panel-point loads left of it.

* a chord: moments about the joint where the other two cut members meet:
  ``N = ±M / h`` with ``M`` the simple-span moment at that joint's ``x``
  (bottom chord in tension, top chord in compression under downward load);
* a diagonal: vertical forces: ``N = ±V / sin θ`` with ``V`` the panel shear
  (left reaction minus the loads left of the cut) and ``θ`` the diagonal's
  slope;
* a vertical: the vertical equilibrium of an unloaded upper joint.

The simple span's moment and the panel shear for a unit load at ``x`` are
written out below (statics of a simple span, common practice); every
expected value is exact and compared exactly with ilkit's ordinate at each
panel point.
"""

from __future__ import annotations

from fractions import Fraction as F

from ilkit import trusses

SOURCE = "method of sections, written out in the test (statics, common practice)"


def moment(L, a, x):
    """Simple-span bending moment at ``a`` for a unit load at ``x`` (sagging positive)."""
    return a * (L - x) / L if x >= a else x * (L - a) / L


def panel_shear(L, x_left_end_of_panel, x):
    """Shear in a panel (the load reaches the span at panel points): left reaction minus the loads left of it."""
    return (L - x) / L - (1 if x <= x_left_end_of_panel else 0)


def ordinates(line, xs):
    return [line.ordinate_exact(x) for x in xs]


def test_pratt_through_truss_against_the_method_of_sections(reference):
    """A 10-panel Pratt through truss (8 m panels, 6 m deep: diagonals 10 m), every member."""
    n, p, h = 10, F(8), F(6)
    L = n * p
    truss = trusses.pratt(L, n, h, units="kN-m")
    xs = [k * p for k in range(n + 1)]
    sin = h / 10
    for j in range(n):
        left, right = j * p, (j + 1) * p
        # bottom chord: moments about the upper joint the diagonal of the panel meets (the end post's U1 in the
        # end panels)
        centre = right if j == 0 or j >= n // 2 else left
        if j == n - 1:
            centre = left
        reference(f"bottom chord L{j}-L{j + 1}", expected=[moment(L, centre, x) / h for x in xs],
                  computed=ordinates(truss.member_force(f"L{j}-L{j + 1}"), xs), source=SOURCE,
                  clause="N = M / h, moments about the upper joint")
        if 1 <= j <= n - 2:
            centre = right if j < n // 2 else left  # where the diagonal meets the bottom chord
            reference(f"top chord U{j}-U{j + 1}", expected=[-moment(L, centre, x) / h for x in xs],
                      computed=ordinates(truss.member_force(f"U{j}-U{j + 1}"), xs), source=SOURCE,
                      clause="N = -M / h, moments about the lower joint")
            name = f"U{j}-L{j + 1}" if j < n // 2 else f"L{j}-U{j + 1}"
            sign = 1 if j < n // 2 else -1  # the diagonal pulls the left part down (left half) or up (right half)
            reference(f"diagonal {name}", expected=[sign * panel_shear(L, left, x) / sin for x in xs],
                      computed=ordinates(truss.member_force(name), xs), source=SOURCE,
                      clause="N = ±V / sin θ, sin θ = 6/10")
    # end posts: vertical forces on the end panel, V / sin θ with the post's slope, compression
    reference("end post L0-U1", expected=[-panel_shear(L, F(0), x) / sin for x in xs],
              computed=ordinates(truss.member_force("L0-U1"), xs), source=SOURCE, clause="N = -V / sin θ")
    # hip vertical U1-L1: the joint L1 holds the floor beam's load alone (chords horizontal)
    reference("hip vertical U1-L1", expected=[F(1) if x == p else F(0) for x in xs],
              computed=ordinates(truss.member_force("U1-L1"), xs), source=SOURCE,
              clause="vertical equilibrium of joint L1")
    # interior verticals: the unloaded upper joint U_j balances its diagonal: N = -V of the panel the diagonal
    # crosses; the middle vertical meets no diagonal and carries nothing
    for j in range(2, n - 1):
        if j == n // 2:
            expected = [F(0)] * len(xs)
        else:
            panel_left = j * p if j < n // 2 else (j - 1) * p
            expected = [(-1 if j < n // 2 else 1) * panel_shear(L, panel_left, x) for x in xs]
        reference(f"vertical U{j}-L{j}", expected=expected, computed=ordinates(truss.member_force(f"U{j}-L{j}"), xs),
                  source=SOURCE, clause="vertical equilibrium of the upper joint")


def test_howe_truss_diagonals_and_chords_against_the_method_of_sections(reference):
    """An 8-panel Howe truss with vertical end posts (6 m panels, 8 m deep: diagonals 10 m)."""
    n, p, h = 8, F(6), F(8)
    L = n * p
    truss = trusses.howe(L, n, h, end_posts="vertical", units="kN-m")
    xs = [k * p for k in range(n + 1)]
    sin = h / 10
    for j in range(n):
        left, right = j * p, (j + 1) * p
        # Howe diagonal L_j-U_{j+1} (left half) meets the top chord at U_{j+1}: bottom chord about U_{j+1}
        name = f"L{j}-U{j + 1}" if j < n // 2 else f"U{j}-L{j + 1}"
        reference(f"bottom chord L{j}-L{j + 1}",
                  expected=[moment(L, right if j < n // 2 else left, x) / h for x in xs],
                  computed=ordinates(truss.member_force(f"L{j}-L{j + 1}"), xs), source=SOURCE,
                  clause="N = M / h")
        reference(f"top chord U{j}-U{j + 1}",
                  expected=[-moment(L, left if j < n // 2 else right, x) / h for x in xs],
                  computed=ordinates(truss.member_force(f"U{j}-U{j + 1}"), xs), source=SOURCE,
                  clause="N = -M / h")
        sign = -1 if j < n // 2 else 1  # rising towards mid-span: it pushes the left part up (compression)
        reference(f"diagonal {name}", expected=[sign * panel_shear(L, left, x) / sin for x in xs],
                  computed=ordinates(truss.member_force(name), xs), source=SOURCE, clause="N = ±V / sin θ")


def test_warren_truss_without_verticals_against_the_method_of_sections(reference):
    """A 6-panel Warren truss (8 m panels, 3 m deep: diagonals 5 m), upper joints at mid-panel."""
    n, p, h = 6, F(8), F(3)
    L = n * p
    truss = trusses.warren(L, n, h, units="kN-m")
    xs = [k * p for k in range(n + 1)]
    sin = h / 5
    for j in range(n):
        left, right = j * p, (j + 1) * p
        mid = left + p / 2
        reference(f"bottom chord L{j}-L{j + 1}", expected=[moment(L, mid, x) / h for x in xs],
                  computed=ordinates(truss.member_force(f"L{j}-L{j + 1}"), xs), source=SOURCE,
                  clause="N = M / h about the upper joint at mid-panel")
        if j < n - 1:
            reference(f"top chord U{j + 1}-U{j + 2}", expected=[-moment(L, right, x) / h for x in xs],
                      computed=ordinates(truss.member_force(f"U{j + 1}-U{j + 2}"), xs), source=SOURCE,
                      clause="N = -M / h about the lower joint")
        reference(f"rising diagonal L{j}-U{j + 1}", expected=[-panel_shear(L, left, x) / sin for x in xs],
                  computed=ordinates(truss.member_force(f"L{j}-U{j + 1}"), xs), source=SOURCE,
                  clause="N = -V / sin θ")
        reference(f"falling diagonal U{j + 1}-L{j + 1}", expected=[panel_shear(L, left, x) / sin for x in xs],
                  computed=ordinates(truss.member_force(f"U{j + 1}-L{j + 1}"), xs), source=SOURCE,
                  clause="N = V / sin θ")


def test_reactions_of_a_truss_are_those_of_the_simple_span_at_the_panel_points(reference):
    truss = trusses.pratt(80, 10, 6, units="kN-m")
    xs = [F(8 * k) for k in range(11)]
    reference("left reaction", expected=[1 - x / 80 for x in xs], computed=ordinates(truss.reaction("L0"), xs),
              source="statics of a simple span (common practice)", clause="R_A = (L - x) / L")
    reference("right reaction", expected=[x / 80 for x in xs], computed=ordinates(truss.reaction("L10"), xs),
              source="statics of a simple span (common practice)", clause="R_B = x / L")
