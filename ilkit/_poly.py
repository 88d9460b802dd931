"""Real roots of many small polynomials at once (vectorised), for influence lines and placement.

Polynomials have small degree (up to 4 in practice) and are given one per
row of a 2-D array of ascending coefficients.  Roots are wanted inside an
interval, so each row is first mapped to ``(-1, 1)`` and normalised, so that
the result does not depend on the size of the numbers.
"""

from __future__ import annotations

import numpy as np

__all__ = ["normalised", "unit_roots", "roots_in_pieces", "horner", "taylor_shift"]


def horner(c: np.ndarray, t: np.ndarray) -> np.ndarray:
    """``sum c[..., p] t^p`` by Horner's rule, highest power first (the arithmetic of ``InfluenceLine``),
    ``c`` and ``t`` broadcast against each other (one polynomial per row of ``c``)."""
    y = c[..., -1] + 0.0 * t
    for p in range(c.shape[-1] - 2, -1, -1):
        y = y * t + c[..., p]
    return y


def taylor_shift(c: np.ndarray, shift: np.ndarray) -> np.ndarray:
    """Rows of coefficients of ``p(shift + u)`` in ``u`` for rows ``p`` (repeated synthetic division)."""
    out = np.array(c, dtype=float)
    n = out.shape[1]
    for i in range(n - 1):
        for k in range(n - 2, i - 1, -1):
            out[:, k] += shift * out[:, k + 1]
    return out


def _polyval(coefficients: np.ndarray, u: np.ndarray) -> np.ndarray:
    out = np.zeros_like(u)
    for k in range(coefficients.shape[1] - 1, -1, -1):
        out = out * u + coefficients[:, k]
    return out


def _quadratic_roots(coefficients: np.ndarray) -> tuple[np.ndarray, np.ndarray]:
    """Real roots in (-1, 1) of ``c0 + c1 u + c2 u^2``, by the cancellation-free formula."""
    c0, c1, c2 = coefficients[:, 0], coefficients[:, 1], coefficients[:, 2]
    scale = np.maximum(np.abs(coefficients).max(axis=1), 1e-300)
    flat = np.abs(c2) <= 1e-14 * scale
    disc = c1 * c1 - 4 * c2 * c0
    with np.errstate(divide="ignore", invalid="ignore"):
        q = -0.5 * (c1 + np.copysign(np.sqrt(np.maximum(disc, 0.0)), c1))
        r1 = np.where(flat, -c0 / c1, q / c2)
        r2 = np.where(flat, np.nan, c0 / q)
    real = flat | (disc >= 0)
    rows, roots = [], []
    for r in (r1, r2):
        ok = real & (r > -1) & (r < 1)
        rows.append(np.nonzero(ok)[0])
        roots.append(r[ok])
    return np.concatenate(rows), np.concatenate(roots)


def normalised(coefficients: np.ndarray) -> np.ndarray:
    """Each row divided by a power of two near its largest coefficient (rows of zeros unchanged).

    The roots do not change, and the arithmetic that finds them (``b² - 4ac``,
    Newton steps) neither overflows nor underflows whatever the size of the
    numbers (loads of 1e200 or 1e-200 N).
    """
    top = np.abs(coefficients).max(axis=1) if coefficients.size else np.zeros(coefficients.shape[0])
    _, exponent = np.frexp(np.where(top > 0, top, 1.0))
    return np.ldexp(coefficients, -exponent[:, None])


def unit_roots(coefficients: np.ndarray) -> tuple[np.ndarray, np.ndarray]:
    """Real roots inside (-1, 1) of polynomials of small degree (one row of ascending coefficients each).

    Returns the row index and the root of each.  Rows are first normalised
    (:func:`normalised`).  Quadratics are solved in closed form; a higher
    degree is split at the roots of its derivative into monotone stretches,
    and a stretch whose ends differ in sign holds one root, found by Newton
    steps kept inside a shrinking bracket (bisection where a step would leave
    it), to rounding.
    """
    n, width = coefficients.shape
    if width <= 1 or n == 0:
        return np.zeros(0, dtype=int), np.zeros(0)
    coefficients = normalised(coefficients)
    if width == 2:
        c0, c1 = coefficients[:, 0], coefficients[:, 1]
        with np.errstate(divide="ignore", invalid="ignore"):
            r = np.where(c1 != 0, -c0 / np.where(c1 != 0, c1, 1.0), np.nan)
        ok = (r > -1) & (r < 1)
        return np.nonzero(ok)[0], r[ok]
    if width == 3:
        return _quadratic_roots(coefficients)
    derivative = coefficients[:, 1:] * np.arange(1, width)[None, :]
    rows_d, crit = unit_roots(derivative)
    # monotone stretches: from -1 through the critical points to 1
    order = np.lexsort((crit, rows_d))
    rows_d, crit = rows_d[order], crit[order]
    starts = np.concatenate((np.arange(n), rows_d))
    lo = np.concatenate((np.full(n, -1.0), crit))
    order = np.lexsort((lo, starts))
    rows, lo = starts[order], lo[order]
    hi = np.append(lo[1:], 1.0)
    hi[np.append(rows[1:] != rows[:-1], True)] = 1.0
    sub = coefficients[rows]
    flo, fhi = _polyval(sub, lo), _polyval(sub, hi)
    scale = np.abs(sub).max(axis=1)
    # a critical point that is itself a root (an inflection on the axis) is a root
    on_axis = (lo > -1) & (np.abs(flo) <= 1e-15 * scale)
    axis_rows, axis_roots = rows[on_axis], lo[on_axis]
    change = np.sign(flo) * np.sign(fhi) < 0
    rows_c, lo, hi, flo, sub = rows[change], lo[change], hi[change], flo[change], sub[change]
    # Newton steps that stay inside the bracket, bisection otherwise; the bracket shrinks every step.  A row
    # is done when the step, the bracket or the residual is at the level of rounding (a residual below a
    # few roundings of the polynomial's terms cannot shrink further); only unfinished rows go on.
    slope = sub[:, 1:] * np.arange(1, width)[None, :]
    noise = 8 * np.finfo(float).eps * np.abs(sub).sum(axis=1)
    u = 0.5 * (lo + hi)
    active = np.arange(u.size)
    for _ in range(64):
        if not active.size:
            break
        ua, loa, hia, floa, suba = u[active], lo[active], hi[active], flo[active], sub[active]
        fu, du = _polyval(suba, ua), _polyval(slope[active], ua)
        same = np.sign(fu) == np.sign(floa)
        loa, floa, hia = np.where(same, ua, loa), np.where(same, fu, floa), np.where(same, hia, ua)
        with np.errstate(divide="ignore", invalid="ignore"):
            newton = ua - fu / du
        done = (np.abs(fu) <= noise[active]) | (np.abs(newton - ua) <= 1e-15) | (hia - loa <= 1e-15)
        inside = (newton >= loa) & (newton <= hia)
        u[active] = np.where(done, ua, np.where(inside, newton, 0.5 * (loa + hia)))
        lo[active], hi[active], flo[active] = loa, hia, floa
        active = active[~done]
    return np.concatenate((rows_c, axis_rows)), np.concatenate((u, axis_roots))


def _bernstein(n: int) -> np.ndarray:
    """Matrix taking power coefficients on [0, 1] to Bernstein coefficients (degree n - 1)."""
    from math import comb

    m = np.zeros((n, n))
    for i in range(n):
        for k in range(i + 1):
            m[i, k] = comb(i, k) / comb(n - 1, k)
    return m


def roots_in_pieces(coefficients: np.ndarray, widths: np.ndarray) -> tuple[np.ndarray, np.ndarray]:
    """Roots ``t`` with ``0 < t < width`` of ``sum c_k t^k``, one polynomial per row.

    Returns the row index and the root of each, sorted by row then root.
    Rows whose Bernstein coefficients on the piece share one sign cannot
    cross zero and are skipped.  The others are mapped to ``(-1, 1)`` by
    ``t = width (1 + u) / 2`` (scaling, then a Taylor shift by 1), solved by
    :func:`unit_roots`, and mapped back.
    """
    n = coefficients.shape[1]
    # in s = t / width: c_k width^k, with mantissas and exponents apart so that no power overflows
    mantissa, exponent = np.frexp(coefficients)
    w_mantissa, w_exponent = np.frexp(widths)
    powers = np.arange(n)[None, :]
    exponent = exponent + w_exponent[:, None] * powers
    live = mantissa != 0
    top = np.where(live.any(axis=1), np.where(live, exponent, -(10**6)).max(axis=1, initial=-(10**6)), 0)
    scaled = np.ldexp(mantissa * w_mantissa[:, None] ** powers, exponent - top[:, None])
    bernstein = scaled @ _bernstein(n).T
    mixed = np.nonzero((bernstein.min(axis=1) < 0) & (bernstein.max(axis=1) > 0))[0]
    c = scaled[mixed] * 0.5 ** np.arange(n)[None, :]  # in v = 2 s
    for i in range(n - 1):  # Taylor shift by 1 (u = v - 1): repeated synthetic division
        for k in range(n - 2, i - 1, -1):
            c[:, k] += c[:, k + 1]
    rows, u = unit_roots(c)
    rows = mixed[rows]
    t = 0.5 * widths[rows] * (1.0 + u)
    order = np.lexsort((t, rows))
    return rows[order], t[order]
