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


@settings(max_examples=100, deadline=None)
@given(
    st.lists(st.lists(coefficient, min_size=3, max_size=5), min_size=1, max_size=6),
    st.sampled_from([2.0**-830, 2.0**-400, 2.0**400, 2.0**830]),
)
def test_roots_do_not_depend_on_the_size_of_the_coefficients(rows, size):
    # the same polynomials times about 1e250 or 1e-250 (loads of any size): b^2 - 4ac must neither overflow
    # nor underflow.  Powers of two scale without rounding, so the roots must be the very same.
    width = max(len(r) for r in rows)
    c = np.array([r + [0.0] * (width - len(r)) for r in rows])
    idx, roots = unit_roots(c)
    idx_s, roots_s = unit_roots(c * size)
    assert idx.tolist() == idx_s.tolist() and roots.tolist() == roots_s.tolist()
    widths = np.linspace(0.5, 3.0, len(rows))
    for scale in (2.0**-20, 1.0, 2.0**20):  # pieces of any length (about 1e-6 to 1e6): roots scaled with them
        k = np.arange(width)
        r1, t1 = roots_in_pieces(c * size, widths)
        r2, t2 = roots_in_pieces(c / scale**k, widths * scale)
        assert r1.tolist() == r2.tolist()
        assert t2.tolist() == (t1 * scale).tolist()
