"""The stiffness method for statically indeterminate trusses (float arithmetic).

Each member is a bar of axial stiffness ``EA / L``; the joints have two
degrees of freedom (horizontal, vertical), a pin support holds both, a roller
the vertical one.  The assembled stiffness ``K`` of the free degrees of
freedom is solved once for a unit downward load at every panel point of the
deck; member forces are ``N = (EA / L) e`` with ``e`` the elongation (tension
positive) and reactions follow from the equilibrium of the supported joints.

Müller-Breslau: the deck's movement when member ``m`` is made shorter by 1
(a dislocation: the member pulls its ends together with ``EA / L`` until the
truss takes it up) is, read upward, the member's influence line; a support
moved up by 1 gives the reaction's.  Both come from the same ``K``.

A stiffness system whose (diagonally scaled) condition number exceeds
:data:`ilkit.stiffness.CONDITION_LIMIT` is refused with
:class:`ilkit.IllConditionedError`: the ordinates would be mostly rounding
noise (typically an ``EA`` in the wrong units).
"""

from __future__ import annotations

from collections.abc import Sequence
from dataclasses import dataclass
from functools import cached_property

import numpy as np

from ilkit.errors import IllConditionedError
from ilkit.stiffness import CONDITION_LIMIT
from ilkit.trusses.statics import Layout

__all__ = ["StiffnessModel"]


@dataclass(frozen=True)
class StiffnessModel:
    """The float stiffness model of a truss: ``EA`` per member (same order as ``layout.members``)."""

    layout: Layout
    EA: tuple[float, ...]

    @cached_property
    def _geometry(self) -> tuple[np.ndarray, np.ndarray, np.ndarray]:
        """Member lengths, direction cosines ``(cx, cy)`` from end a to end b, and the dof indices."""
        xy = np.array([[float(x), float(y)] for x, y in self.layout.coordinates])
        ends = np.array([[a, b] for _, a, b in self.layout.members], dtype=int)
        delta = xy[ends[:, 1]] - xy[ends[:, 0]]
        length = np.hypot(delta[:, 0], delta[:, 1])
        cosines = delta / length[:, None]
        dofs = np.stack([2 * ends[:, 0], 2 * ends[:, 0] + 1, 2 * ends[:, 1], 2 * ends[:, 1] + 1], axis=1)
        return length, cosines, dofs

    @cached_property
    def _free(self) -> np.ndarray:
        held = {2 * j + (0 if d == "x" else 1) for j, d in self.layout.reactions}
        return np.array([k for k in range(2 * len(self.layout.joints)) if k not in held], dtype=int)

    @cached_property
    def _k(self) -> np.ndarray:
        """Member stiffnesses ``EA / L``."""
        length, _, _ = self._geometry
        return np.asarray(self.EA, dtype=float) / length

    @cached_property
    def stiffness(self) -> np.ndarray:
        """The assembled stiffness matrix of all degrees of freedom."""
        _, cos, dofs = self._geometry
        n = 2 * len(self.layout.joints)
        K = np.zeros((n, n))
        vec = np.concatenate([-cos, cos], axis=1)  # elongation = vec . d
        for m in range(len(self._k)):
            K[np.ix_(dofs[m], dofs[m])] += self._k[m] * np.outer(vec[m], vec[m])
        return K

    @cached_property
    def _factor(self) -> tuple[np.ndarray, np.ndarray]:
        """The free block of ``K`` and its scaling, checked for conditioning."""
        free = self._free
        Kff = self.stiffness[np.ix_(free, free)]
        scale = 1.0 / np.sqrt(np.diag(Kff))
        scaled = Kff * scale[:, None] * scale[None, :]
        condition = float(np.linalg.cond(scaled))
        if not np.isfinite(condition) or condition > CONDITION_LIMIT:
            raise IllConditionedError(
                f"the truss's stiffness system has a condition number of about {condition:.3g} (above "
                f"{CONDITION_LIMIT:.0e}): its EA values are so far apart that float ordinates would be mostly "
                "rounding noise. Check that every EA is in the truss's force unit.",
                condition=condition,
                limit=CONDITION_LIMIT,
            )
        return scaled, scale

    def displacements(self, loads: np.ndarray) -> np.ndarray:
        """Joint movements (all dofs, one column per load case) for nodal ``loads`` (all dofs x cases)."""
        scaled, scale = self._factor
        free = self._free
        d = np.zeros_like(loads, dtype=float)
        d[free] = scale[:, None] * np.linalg.solve(scaled, scale[:, None] * loads[free])
        return d

    def forces(self, d: np.ndarray) -> np.ndarray:
        """Member forces (tension positive), one row per member, for the movements ``d`` (dofs x cases)."""
        _, cos, dofs = self._geometry
        vec = np.concatenate([-cos, cos], axis=1)
        elongation = np.einsum("mk,mkc->mc", vec, d[dofs])
        return self._k[:, None] * elongation

    def unit_loads(self, loaded: Sequence[int]) -> tuple[np.ndarray, np.ndarray]:
        """Member forces ``[member, case]`` and reactions ``[reaction, case]`` for a unit downward load at each
        joint of ``loaded``."""
        n = 2 * len(self.layout.joints)
        P = np.zeros((n, len(loaded)))
        for k, joint in enumerate(loaded):
            P[2 * joint + 1, k] = -1.0
        d = self.displacements(P)
        return self.forces(d), self._reactions(d, P)

    def _reactions(self, d: np.ndarray, P: np.ndarray) -> np.ndarray:
        """Support reactions from the equilibrium of the held degrees of freedom: ``R = K d - P``."""
        internal = self.stiffness @ d - P
        rows = [2 * j + (0 if direction == "x" else 1) for j, direction in self.layout.reactions]
        return internal[rows]

    def shortened(self, member: int) -> np.ndarray:
        """Joint movements (all dofs) when ``member`` is made shorter by 1 (a dislocation)."""
        _, cos, dofs = self._geometry
        n = 2 * len(self.layout.joints)
        f = np.zeros((n, 1))
        # the short member pulls its ends together with EA/L times the shortening
        f[dofs[member], 0] += self._k[member] * np.concatenate([cos[member], -cos[member]])
        return self.displacements(f)[:, 0]

    def support_moved(self, reaction: int) -> np.ndarray:
        """Joint movements (all dofs) when the support of ``reaction`` moves by 1 in its direction."""
        joint, direction = self.layout.reactions[reaction]
        dof = 2 * joint + (0 if direction == "x" else 1)
        d = np.zeros((2 * len(self.layout.joints), 1))
        d[dof, 0] = 1.0
        free = self._free
        scaled, scale = self._factor
        rhs = -(self.stiffness[np.ix_(free, [dof])])
        d[free] = scale[:, None] * np.linalg.solve(scaled, scale[:, None] * rhs)
        return d[:, 0]
