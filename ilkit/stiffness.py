"""Influence lines of elastic beams by the stiffness method (continuous beams, springs, deflections).

The beam is divided at its ends, supports, internal releases and the points
where ``EI`` changes into prismatic Hermite elements (:mod:`ilkit.elements`).
Degrees of freedom are the deflection ``v`` (downward) and the rotation ``θ``
(clockwise) of every node; a hinge has a rotation on each face, a shear
release a deflection on each face.  Rigid bearings and fixities remove
degrees of freedom; springs add their stiffness.  The stiffness matrix is
assembled and inverted once per beam (cached on the beam), then every line is
one product with that inverse.

Every influence line is the deflected shape of the beam under one unit
action (Müller-Breslau, Maxwell, Land), measured downward:

* deflection at ``a``: a unit downward force at ``a`` (Maxwell);
* rotation at ``a``: a unit clockwise couple at ``a``;
* bending moment at ``a``: a unit sagging kink at ``a``;
* shear at ``a``: a unit slip at ``a`` (right face down by 1, slopes equal);
* reaction of a rigid bearing: the bearing settles by 1;
* moment reaction of a rigid fixity: the support rotates clockwise by 1;
* reaction of a vertical spring: ``k`` times the deflection line at the spring;
* moment of a rotational spring: ``k`` times the rotation line at the spring.

The action at ``a`` sits inside one element (or at one of its ends); that
element's shape is its Hermite cubic plus the clamped response to the action,
so the line is a cubic between consecutive knots (the nodes and ``a``) and as
precise as a closed form.  With ``exact=True`` the same steps run in
:class:`fractions.Fraction` arithmetic (sparse exact elimination instead of the
float inverse), giving the exact rational piecewise-cubic line.

Where float arithmetic would lose digits (points very close together, a very
stiff short piece, a condition number above :data:`EXACT_CONDITION`), float
lines are the exact lines rounded (:func:`float_trouble` says why); beyond
:data:`CONDITION_LIMIT` they are refused with :class:`ilkit.IllConditionedError`.
"""

from __future__ import annotations

import bisect
import math
from dataclasses import dataclass, field, replace
from fractions import Fraction
from typing import TYPE_CHECKING, Any

import numpy as np

from ilkit import _exact
from ilkit._exact import fmt, fmt_precise
from ilkit.elements import ACTIONS, Action, clamped_response, hermite, shift, stiffness_matrix
from ilkit.errors import IllConditionedError, StiffnessRequiredError
from ilkit.influence import InfluenceLine
from ilkit.quantity import Quantity

if TYPE_CHECKING:  # pragma: no cover
    from ilkit.model import Beam

__all__ = [
    "ElasticModel", "UnitShape", "elastic_line", "elastic_model", "float_trouble", "CONDITION_LIMIT",
    "EXACT_CONDITION", "SPREAD_LIMIT",
]

SPREAD_LIMIT = 10**5
"""Largest ratio of the elements' bending stiffness ``EI/h²`` for which float lines are computed in floats
(see :func:`float_trouble`); beyond it they are computed exactly and rounded."""

EXACT_CONDITION = 1e6
"""Largest condition number of the scaled stiffness matrix for which float lines are computed in floats
(an error of at most about 1e-10 of the largest ordinate); from it up to :data:`CONDITION_LIMIT` they are
computed exactly and rounded (ordinary girders, haunches included, stay near 1e3)."""

CONDITION_LIMIT = 1e10
"""Largest accepted condition number of the diagonally scaled stiffness matrix.

Float64 resolves about 16 significant digits; a condition number ``κ`` may
cost ``log10 κ`` of them, so at the limit about 6 digits remain.
"""


@dataclass(frozen=True)
class UnitShape:
    """How an elastic influence line was obtained (the line's ``origin``).

    ``action`` says in words which unit action the beam was given;
    ``factor`` multiplies the deflected shape (a spring stiffness for a
    spring's force, 1 otherwise); ``deflections`` and ``rotations`` are the
    nodal values of that shape before the factor, at ``nodes`` (the left face
    where a release separates the faces); ``unit_action`` is the action
    applied inside an element (``None`` for a unit movement of a restraint);
    ``beam`` the beam analysed (for derivations and drawings);
    ``exact_because`` says, for a float line, why its shape was solved in
    exact arithmetic and rounded (empty when it was solved in floats, see
    :func:`float_trouble`).
    """

    quantity: Quantity
    action: str
    factor: Fraction | float
    nodes: tuple[Fraction, ...]
    deflections: tuple[Fraction | float, ...]
    rotations: tuple[Fraction | float, ...]
    unit_action: Action | None = None
    beam: Beam | None = field(default=None, repr=False, compare=False)
    exact_because: str = ""


@dataclass(frozen=True)
class _Spring:
    node: int
    dof: int
    stiffness: Any
    rotational: bool


class ElasticModel:
    """Assembled (and, for floats, inverted) stiffness model of one beam.

    Build it with :func:`elastic_model`, which caches it on the beam.
    """

    def __init__(self, beam: Beam, *, exact: bool) -> None:
        self.beam = beam
        self.exact = exact
        self.num: Any = Fraction if exact else float
        self._mesh(beam)
        entries = self._assemble(beam)
        fixed_set = set(self.fixed)
        self.free = [i for i in range(self.ndof) if i not in fixed_set]
        self._position = {dof: k for k, dof in enumerate(self.free)}
        if exact:
            self._prepare_exact(entries)
        else:
            self._prepare_float(entries)

    def _mesh(self, beam: Beam) -> None:
        """Nodes, degrees of freedom and elements."""
        ranges = beam.EI_ranges
        nodes = mesh_nodes(beam)
        self.nodes: list[Fraction] = nodes
        self.node_floats = [float(p) for p in nodes]
        hinges, slides = set(beam.hinges), set(beam.shear_releases)
        # degrees of freedom per node: (v left face, θ left face, v right face, θ right face)
        faces: list[tuple[int, int, int, int]] = []
        n = 0
        for p in nodes:
            if p in hinges:
                faces.append((n, n + 1, n, n + 2))
                n += 3
            elif p in slides:
                faces.append((n, n + 2, n + 1, n + 2))
                n += 3
            else:
                faces.append((n, n + 1, n, n + 1))
                n += 2
        self.faces = faces
        self.ndof = n
        ne = len(nodes) - 1
        self.h = [self.num(nodes[j + 1] - nodes[j]) for j in range(ne)]
        self.EI = [self.num(_ei_at(ranges, (nodes[j] + nodes[j + 1]) / 2)) for j in range(ne)]
        self.element_dofs = np.array(
            [(faces[j][2], faces[j][3], faces[j + 1][0], faces[j + 1][1]) for j in range(ne)], dtype=np.intp
        )

    def _assemble(self, beam: Beam) -> dict[tuple[int, int], Any]:
        """Stiffness entries of elements and springs; records the restrained degrees of freedom."""
        entries: dict[tuple[int, int], Any] = {}

        def add(r: int, c: int, value: Any) -> None:
            entries[(r, c)] = entries.get((r, c), 0) + value

        for j, dofs in enumerate(self.element_dofs):
            k = self._element_stiffness(j)
            for r in range(4):
                for c in range(4):
                    add(int(dofs[r]), int(dofs[c]), k[r][c])
        fixed: list[int] = []
        self.springs: list[_Spring] = []
        for s in beam.supports:
            node = bisect.bisect_left(self.nodes, s.at)
            v, r = self.faces[node][0], self.faces[node][1]
            for dof, stiffness, rotational in ((v, s.vertical_stiffness, False), (r, s.rotational_stiffness, True)):
                if stiffness is not None:
                    add(dof, dof, self.num(stiffness))
                    self.springs.append(_Spring(node, dof, self.num(stiffness), rotational))
            if s.vertical_stiffness is None:
                fixed.append(v)
            if s.restrains_rotation and s.rotational_stiffness is None:
                fixed.append(r)
        self.fixed = sorted(fixed)
        return entries

    def _element_stiffness(self, j: int) -> list[list[Any]]:
        """Stiffness matrix of element ``j``; in floats, refused when its terms leave the float range."""
        if self.exact:
            return stiffness_matrix(self.h[j], self.EI[j])
        try:
            k = stiffness_matrix(self.h[j], self.EI[j])
        except (OverflowError, ZeroDivisionError):
            k = [[math.inf]]
        terms = [abs(v) for row in k for v in row]
        if all(math.isfinite(v) and v > 0 for v in terms):
            return k
        a, b = self.nodes[j], self.nodes[j + 1]
        raise IllConditionedError(
            f"the element from x={fmt_precise(a)} to x={fmt_precise(b)} (length {fmt(self.h[j])}, EI="
            f"{fmt(self.EI[j])}) has stiffness terms EI/h³ beyond the range of float arithmetic. Give the beam's "
            "lengths, EI and springs in units that keep them nearer to 1 (e.g. m and kN·m² rather than mm and "
            "N·mm²), or merge points that close.",
            condition=math.inf,
            limit=CONDITION_LIMIT,
        )

    def _prepare_exact(self, entries: dict[tuple[int, int], Any]) -> None:
        """Sparse rational rows of the free system and the coupling to each restrained degree of freedom."""
        position = self._position
        self._rows: list[dict[int, Fraction]] = [{} for _ in self.free]
        self._coupling: dict[int, dict[int, Fraction]] = {c: {} for c in self.fixed}
        for (r, c), value in entries.items():
            if not value or r not in position:
                continue
            if c in position:
                self._rows[position[r]][position[c]] = value
            else:
                self._coupling[c][position[r]] = value

    def _prepare_float(self, entries: dict[tuple[int, int], Any]) -> None:
        """Check the conditioning and invert the free system once."""
        K = np.zeros((self.ndof, self.ndof))
        for (r, c), value in entries.items():
            K[r, c] = value
        free = np.array(self.free, dtype=np.intp)
        Kff = K[np.ix_(free, free)]
        # symmetric diagonal scaling: the inverse of the scaled matrix keeps its accuracy
        # when stiffnesses differ by orders of magnitude (stiff springs, short elements)
        scale = 1.0 / np.sqrt(np.diag(Kff))
        scaled = Kff * scale[:, None] * scale[None, :]
        self.condition = self._check_condition(scaled)
        self._flexibility = np.linalg.inv(scaled) * scale[:, None] * scale[None, :]
        self._coupling_matrix = K[np.ix_(free, np.array(self.fixed, dtype=np.intp))]
        self._fixed_index = {c: k for k, c in enumerate(self.fixed)}

    # ------------------------------------------------------------------ solving
    def displacements(self, loads: dict[int, Any], settled: int | None = None) -> np.ndarray:
        """All degrees of freedom under nodal ``loads`` ``{dof: value}`` or a unit movement of the
        restrained degree of freedom ``settled`` (the other restraints hold)."""
        n_free = len(self.free)
        if self.exact:
            rhs = [Fraction(0)] * n_free
            if settled is not None:
                for k, value in self._coupling[settled].items():
                    rhs[k] = -value
            for dof, value in loads.items():
                if dof in self._position:
                    rhs[self._position[dof]] += value
            solution: Any = _exact.solve(self._rows, rhs, n_free)
            d = np.array([Fraction(0)] * self.ndof, dtype=object)
        else:
            rhs = np.zeros(n_free)
            if settled is not None:
                rhs -= self._coupling_matrix[:, self._fixed_index[settled]]
            for dof, value in loads.items():
                if dof in self._position:
                    rhs[self._position[dof]] += value
            solution = self._flexibility @ rhs
            d = np.zeros(self.ndof)
        d[self.free] = solution
        if settled is not None:
            d[settled] = self.num(1)
        return d

    def locate(self, at: Fraction, side: str | None) -> tuple[int, Any]:
        """Element index and local coordinate of the point ``at``, on the face ``side`` at a node."""
        nodes = self.nodes
        k = bisect.bisect_left(nodes, at)
        last = len(nodes) - 2
        if k < len(nodes) and nodes[k] == at:
            if (side == "left" and k > 0) or k > last:
                return k - 1, self.h[k - 1]
            return k, self.num(0)
        return k - 1, self.num(at - nodes[k - 1])

    # -------------------------------------------------------------- the line
    def shape(
        self,
        quantity: Quantity,
        *,
        action: Action | None = None,
        settled: int | None = None,
        factor: Any = 1,
        words: str = "",
    ) -> InfluenceLine:
        """The line of ``quantity``: ``factor`` times the deflected shape under a unit ``action`` at
        ``quantity.at`` (or a unit movement of the restrained degree of freedom ``settled``)."""
        split: tuple[int, Any, Any] | None = None
        loads: dict[int, Any] = {}
        if action is not None:
            j, xi = self.locate(quantity.at, quantity.side)
            response = clamped_response(action, xi, self.h[j], self.EI[j])
            for dof, value in zip(self.element_dofs[j], response.loads):
                loads[int(dof)] = loads.get(int(dof), 0) + value
            split = (j, xi, response)
        d = self.displacements(loads, settled)
        dofs = self.element_dofs
        h = np.array(self.h, dtype=object if self.exact else float)
        c = np.stack(hermite(d[dofs[:, 0]], d[dofs[:, 1]], d[dofs[:, 2]], d[dofs[:, 3]], h), axis=1)
        knots: list[Any] = list(self.nodes) if self.exact else list(self.node_floats)
        rows = list(c)
        if split is not None:
            j, xi, response = split
            own = tuple(c[j])
            pieces = []
            if xi > 0:
                pieces.append(tuple(a + b for a, b in zip(own, response.left)))
            if xi < self.h[j]:
                moved = shift(own, xi)
                pieces.append(tuple(a + b for a, b in zip(moved, response.right)))
            rows[j : j + 1] = pieces
            if 0 < xi < self.h[j]:
                knots.insert(j + 1, quantity.at if self.exact else float(quantity.at))
        factor = self.num(factor)
        if self.exact:
            coefficients = tuple(tuple(Fraction(factor * v) for v in row) for row in rows)
        else:
            coefficients = tuple(tuple(row) for row in (np.array(rows) * factor).tolist())
        faces = self.faces
        origin = UnitShape(
            quantity,
            words,
            factor,
            tuple(self.nodes),
            tuple(d[f[0]] for f in faces),
            tuple(d[f[1]] for f in faces),
            unit_action=action,
            beam=self.beam,
        )
        return InfluenceLine(
            quantity=quantity, knots=tuple(knots), coefficients=coefficients, units=self.beam.units, origin=origin
        )

    # ------------------------------------------------------------ conditioning
    def _check_condition(self, scaled: np.ndarray) -> float:
        with np.errstate(all="ignore"):
            condition = float(np.linalg.cond(scaled)) if scaled.size else 1.0
        if not np.isfinite(condition) or condition > CONDITION_LIMIT:
            raise IllConditionedError(
                f"the stiffness system of this beam is too ill-conditioned for float arithmetic "
                f"(condition number about {condition:.1e}, limit {CONDITION_LIMIT:.0e}); its float ordinates "
                f"would be rounding noise. Likely cause: {self._likely_cause()}. Ask for the exact line "
                "instead (exact=True, rational arithmetic without rounding), or change the model as said.",
                condition=condition,
                limit=CONDITION_LIMIT,
            )
        return condition

    def _likely_cause(self) -> str:
        """The most extreme ratio in the model, in words with the fix."""
        causes: list[tuple[float, str]] = []
        ei = [float(v) for v in self.EI]
        lo, hi = int(np.argmin(ei)), int(np.argmax(ei))
        causes.append(
            (
                ei[hi] / ei[lo],
                f"EI varies by a factor of {ei[hi] / ei[lo]:.1e} along the beam (EI={fmt(ei[lo])} near "
                f"x={fmt_precise(self.nodes[lo])}, EI={fmt(ei[hi])} near x={fmt_precise(self.nodes[hi])}); check the "
                "values and their units",
            )
        )
        h = [float(v) for v in self.h]
        short, long = int(np.argmin(h)), int(np.argmax(h))
        closer = h[long] / h[short]
        causes.append(
            (
                closer**3 if closer < 1e100 else math.inf,
                f"the points x={fmt_precise(self.nodes[short])} and x={fmt_precise(self.nodes[short + 1])} "
                f"(supports, releases or EI changes) are {closer:.1e} times closer together than the longest "
                "element; merge points that close",
            )
        )
        for spring in self.springs:
            near = [j for j in (spring.node - 1, spring.node) if 0 <= j < len(self.h)]
            power = 1 if spring.rotational else 3
            beam_k = max(float(self.EI[j]) / float(self.h[j]) ** power for j in near)
            ratio = float(spring.stiffness) / beam_k
            kind = "rotational" if spring.rotational else "vertical"
            what = f"the {kind} spring at x={fmt_precise(self.nodes[spring.node])}"
            if ratio >= 1:
                causes.append((ratio, f"{what} is {ratio:.1e} times stiffer than the beam beside it; make it rigid"))
            else:
                causes.append((1 / ratio, f"{what} is {1 / ratio:.1e} times softer than the beam beside it; check it"))
        return max(causes)[1]


def mesh_nodes(beam: Beam) -> list[Fraction]:
    """The nodes of the stiffness model: ends, supports, releases and changes of ``EI``, left to right."""
    points = {Fraction(0), beam.length}
    points.update(s.at for s in beam.supports)
    points.update(p for p, _ in beam.releases)
    points.update(a for a, _, _ in beam.EI_ranges[1:])
    return sorted(points)


def float_trouble(beam: Beam) -> str:
    """Why float arithmetic cannot give this beam's lines to about 1e-10, in words; empty when it can.

    Two causes, both checked:

    * In floats the stiffness terms of an element (``12EI/h³``, ``6EI/h²``, ``4EI/h``) are rounded
      apart, so the element resists a rigid-body rotation with a spurious stiffness of about
      ``ε·EI/h²`` (``ε`` about 1e-16).  Compared with the element of the smallest ``EI/h²`` this is a
      relative error of about ``ε`` times their ratio: two points of the beam very close together (a
      short element) or a very stiff short piece beside a long flexible one.  The condition number
      of the matrix does not see it.  Beyond :data:`SPREAD_LIMIT` the float model is not even built.
    * The condition number ``κ`` of the (diagonally scaled) stiffness matrix costs about ``log10 κ``
      digits: beyond :data:`EXACT_CONDITION` (and up to :data:`CONDITION_LIMIT`, past which the
      beam is refused with :class:`~ilkit.IllConditionedError`).

    Where it says why, the float lines are the exact lines rounded (exact arithmetic is slower:
    about 0.1 s a line for 100 spans).
    """
    nodes = mesh_nodes(beam)
    ranges = beam.EI_ranges
    if ranges and len(nodes) > 2:
        terms = [_ei_at(ranges, (a + b) / 2) / (b - a) ** 2 for a, b in zip(nodes[:-1], nodes[1:])]
        j = max(range(len(terms)), key=terms.__getitem__)
        k = min(range(len(terms)), key=terms.__getitem__)
        if terms[j] > SPREAD_LIMIT * terms[k]:
            short, long = (nodes[j], nodes[j + 1]), (nodes[k], nodes[k + 1])
            close = " (the points are very close together)" if short[1] - short[0] < (long[1] - long[0]) / 100 else ""
            return (
                f"the element from x={fmt_precise(short[0])} to x={fmt_precise(short[1])} is "
                f"{float(terms[j] / terms[k]):.1e} times stiffer in bending (EI/h²) than the one from "
                f"x={fmt_precise(long[0])} to x={fmt_precise(long[1])}{close}"
            )
    model = elastic_model(beam)  # refuses a condition number beyond CONDITION_LIMIT
    if model.condition > EXACT_CONDITION:
        return (
            f"the stiffness system's condition number is about {model.condition:.1e}, which would cost about "
            f"{math.log10(model.condition):.0f} of the 16 digits of floating point; likely cause: "
            f"{model._likely_cause()}"
        )
    return ""


def _ei_at(ranges: tuple[tuple[Fraction, Fraction, Fraction], ...], x: Fraction) -> Fraction:
    for a, b, ei in ranges:
        if a <= x <= b:
            return ei
    raise AssertionError("EI ranges do not cover the beam")  # pragma: no cover


def elastic_model(beam: Beam, *, exact: bool = False) -> ElasticModel:
    """The stiffness model of ``beam`` (float or exact), built once and cached on the beam."""
    cache: dict[bool, ElasticModel] = beam._models  # type: ignore[attr-defined]
    model = cache.get(exact)
    if model is None:
        model = ElasticModel(beam, exact=exact)
        cache[exact] = model
    return model


def _trouble(beam: Beam) -> str:
    """:func:`float_trouble` of ``beam``, cached on it."""
    cache: dict[str, str] = beam._models  # type: ignore[attr-defined]
    if "trouble" not in cache:
        cache["trouble"] = float_trouble(beam)
    return cache["trouble"]


def elastic_line(beam: Beam, quantity: Quantity, *, exact: bool = False) -> InfluenceLine:
    """Influence line of ``quantity`` from the elastic (stiffness) analysis of ``beam``.

    Works for every stable beam with ``EI``, determinate or not, springs
    included.  Float pieces unless ``exact=True``; where float arithmetic
    would lose digits (:func:`float_trouble`: points very close together, a
    very stiff short piece, a condition number above :data:`EXACT_CONDITION`)
    the float line is the exact line rounded.
    """
    if beam.EI is None:
        if quantity.kind in ("deflection", "rotation"):
            why = f"{quantity.words} lines need the flexural stiffness"
        else:
            why = (
                f"the beam is statically indeterminate (degree {beam.degree}), so its influence lines depend "
                "on the stiffness"
            )
        raise StiffnessRequiredError(
            f"{quantity.label}: {why}; give the beam EI=... (one number, or ranges "
            "[(start, end, EI), ...] where it varies), e.g. beam.replace(EI=2.1e6).",
            field="EI",
            value=None,
        )
    kind, at = quantity.kind, quantity.at
    if (kind == "moment" and at in beam.hinges) or (kind in ("shear", "hinge_shear") and at in beam.shear_releases):
        from ilkit.kinematics import nothing_released

        return nothing_released(beam, quantity, exact=exact)
    if not exact and _trouble(beam):
        return _rounded(_shape_of(beam, quantity, exact=True), _trouble(beam))
    return _shape_of(beam, quantity, exact=exact)


def _rounded(line: InfluenceLine, because: str) -> InfluenceLine:
    """The float copy of an exact line (and of its origin), saying why it was solved exactly."""
    origin = line.origin
    assert isinstance(origin, UnitShape)
    origin = replace(
        origin,
        factor=float(origin.factor),
        deflections=tuple(float(v) for v in origin.deflections),
        rotations=tuple(float(v) for v in origin.rotations),
        exact_because=because,
    )
    return InfluenceLine(
        quantity=line.quantity,
        knots=tuple(float(k) for k in line.exact_breakpoints or ()),
        coefficients=tuple(piece.coefficients for piece in line.pieces),
        units=line.units,
        origin=origin,
    )


def _shape_of(beam: Beam, quantity: Quantity, *, exact: bool) -> InfluenceLine:
    """The line of ``quantity`` as the beam's shape under its unit action (see the module notes)."""
    model = elastic_model(beam, exact=exact)
    kind, at = quantity.kind, quantity.at
    where = f"at x={fmt_precise(at)}"
    if kind in ("reaction", "moment_reaction"):
        support = next(s for s in beam.supports if s.at == at)
        node = bisect.bisect_left(model.nodes, at)
        if kind == "reaction":
            k = support.vertical_stiffness
            if k is not None:
                return model.shape(quantity, action="force", factor=k, words=f"{ACTIONS['force']} {where}, times k")
            words = f"the bearing {where} settles by 1"
            return model.shape(quantity, settled=model.faces[node][0], words=words)
        k = support.rotational_stiffness
        if k is not None:
            return model.shape(quantity, action="couple", factor=k, words=f"{ACTIONS['couple']} {where}, times k")
        words = f"the fixed support {where} rotates clockwise by 1 rad"
        return model.shape(quantity, settled=model.faces[node][1], words=words)
    action: Action = {
        "deflection": "force",
        "rotation": "couple",
        "moment": "kink",
        "shear": "slip",
        "hinge_shear": "slip",
    }[kind]  # type: ignore[assignment]
    return model.shape(quantity, action=action, words=f"{ACTIONS[action]} {where}")
