"""Vectorised polynomial roots (ilkit._poly) against numpy.roots, and the awkward cases."""

from __future__ import annotations

import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from ilkit._poly import roots_in_pieces, unit_roots

# zero or of a size numpy.roots handles (a subnormal leading coefficient overflows its companion matrix)
coefficient = st.one_of(st.just(0.0), st.floats(1e-3, 10), st.floats(-10, -1e-3))


def crossings_by_numpy(c):
    """Real crossings in (-1, 1) by numpy.roots (companion-matrix eigenvalues), clear of the ends by 1e-9."""
    c = np.trim_zeros(np.asarray(c, dtype=float), "b")
    if c.size < 2:
        return []
    out = []
    for z in np.roots(c[::-1]):
        if abs(z.imag) < 1e-9 and -1 + 1e-9 < z.real < 1 - 1e-9:
            r = z.real
            p = np.polynomial.polynomial.Polynomial(c)
            if p(r - 1e-7) * p(r + 1e-7) < 0:
                out.append(r)
    return sorted(out)


@settings(max_examples=300, deadline=None)
@given(st.lists(st.lists(coefficient, min_size=4, max_size=4), min_size=1, max_size=8))
def test_unit_roots_match_numpy(rows):
    c = np.array(rows)
    idx, roots = unit_roots(c)
    for k, row in enumerate(rows):
        mine = sorted(roots[idx == k])
        want = crossings_by_numpy(row)
        # every crossing numpy sees is found, and everything found is a root
        for r in want:
            assert any(abs(r - m) < 1e-7 for m in mine)
        poly = np.polynomial.polynomial.Polynomial(row)
        scale = max(1.0, float(np.abs(row).sum()))
        assert all(abs(poly(m)) <= 1e-9 * scale for m in mine)


def test_awkward_cubics():
    # u^3 (inflection on the axis), u - u^3 (roots at 0 and at the ends), zero polynomial, a line
    idx, roots = unit_roots(np.array([[0, 0, 0, 1.0], [0, 1.0, 0, -1.0], [0, 0, 0, 0], [0.5, 1.0, 0, 0]]))
    found = {(int(i), round(float(r), 12)) for i, r in zip(idx, roots)}
    assert found == {(0, 0.0), (1, 0.0), (3, -0.5)}


def test_roots_in_pieces_maps_back_to_each_width():
    # (t - 1)(t - 3) on 0..4 and t - 0.25 on 0..0.5: roots 1, 3 and 0.25
    c = np.array([[3.0, -4.0, 1.0, 0.0], [-0.25, 1.0, 0.0, 0.0]])
    rows, t = roots_in_pieces(c, np.array([4.0, 0.5]))
    assert rows.tolist() == [0, 0, 1]
    assert t == pytest.approx([1.0, 3.0, 0.25])
