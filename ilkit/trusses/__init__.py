"""Plane pin-jointed trusses loaded through a deck: member force influence lines.

A truss is its own model (:class:`Truss`: joints, members, supports, the deck
and, for indeterminate trusses, the members' axial stiffness ``EA``) with its
own validation and solver; what it returns is the same
:class:`ilkit.InfluenceLine` as a beam's, on the deck coordinate ``x``, so
placement, envelopes of single lines, tables, exports and calculation sheets
work unchanged.

* Sign conventions: a member force is positive in tension; reactions are
  vertical, positive upward; the unit load acts downward on the deck; ``x`` is
  measured from the left support along the loaded chord (see
  :mod:`ilkit.trusses.model`).
* The load reaches the truss through stringers and floor beams at the panel
  points, so every line is straight between them (:mod:`ilkit.floor`).
* Determinate trusses are solved exactly (equilibrium of the joints in
  rational arithmetic); indeterminate ones by the stiffness method with
  ``EA`` (:mod:`ilkit.trusses.lines`).
* Layouts of the trade from span, panel count and depth: :func:`pratt`,
  :func:`howe`, :func:`warren`, :func:`k_truss`, :func:`parker`.
* :func:`member_envelope`: the largest tension and compression of every
  member (and every reaction) under a load model, with the governing cases.
"""

from ilkit.trusses.envelope import MemberEnvelope, member_envelope
from ilkit.trusses.layouts import howe, k_truss, parker, pratt, warren
from ilkit.trusses.lines import TrussLine
from ilkit.trusses.model import Truss
from ilkit.trusses.statics import TrussStability

__all__ = [
    "Truss",
    "pratt",
    "howe",
    "warren",
    "k_truss",
    "parker",
    "member_envelope",
    "MemberEnvelope",
    "TrussLine",
    "TrussStability",
]
