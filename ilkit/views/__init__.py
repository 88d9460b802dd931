"""Views: drawings, derivations, notebook displays, tables and calculation sheets.

The views sit on top of the core and hold no engineering logic: every number
they show is taken from the core's results.  Nothing in the core imports
them at import time; core objects reach :mod:`ilkit.views.display` lazily
when a notebook displays them.  matplotlib is optional (``pip install
ilkit[plot]``); without it, drawing functions raise
:class:`ilkit.MissingDependencyError`, while derivations, tables and
displays (without their figure) still work.

Public names:

* :func:`draw_beam`: beam diagram; :func:`plot_line`: influence line plot;
  :func:`sketch`: Müller-Breslau sketch (all take ``ax=`` and return it);
* :func:`derivation` -> :class:`Derivation` (Markdown/LaTeX, text, HTML);
* :func:`table`, :func:`to_csv`, :func:`to_excel`, :func:`to_latex`;
  :func:`plain_names`: a table with columns easy to type (``"M_max"``);
  :func:`summary`: key values of several lines, with units;
* :func:`formula`: a line's formula for reading (decimals, no repeated pieces);
* :func:`write_calculation_sheet` -> :class:`CalculationSheet`, with a
  :class:`TitleBlock`;
* :func:`draw_truss`: a truss (joints, members, supports, deck);
  :func:`plot_member_forces`: member forces, tension solid, compression
  hollow (``views.table(envelope)`` is the member table of a
  :class:`~ilkit.trusses.MemberEnvelope`);
* :class:`Explorer` (``beam.explore()``): the interactive explorer;
  :func:`plot_placement`: where the loads of a governing placement stand;
  :func:`plot_envelope`: envelopes of moving loads.

Moving-load results (placements, envelopes, load models) have their tables,
displays and sheet sections in :mod:`ilkit.views.moving_records`; design results
(permanent effects, concurrent forces, the deflection check) in
:mod:`ilkit.views.design_records`, drawn by :func:`plot_permanent_effects` and
:func:`plot_deflection_check`; factored envelopes, distributions, limit states
and lane placements in :mod:`ilkit.views.factored_records`, drawn by
:func:`plot_factored_envelope` (with the unfactored components underneath)
and :func:`plot_transverse`.  Batch runs over a girder inventory (:mod:`ilkit.batch`):
:func:`plot_inventory` (the spread of a governing value across the inventory) and
:func:`write_girder_sheet` (one girder's sheet on demand), in ``ilkit.views.inventory``; load
ratings (:mod:`ilkit.rating`) in :mod:`ilkit.views.rating_records`, drawn by :func:`plot_rating` and
:func:`plot_rail_rating`, written as a rating sheet (HTML, Markdown and PDF) by :func:`write_rating_sheet`,
explored with :class:`RatingView` (pick a vehicle, move it, watch the RF).

A new result type joins by registering with the dispatchers
:func:`ilkit.views.display.mimebundle`, :func:`table`,
:func:`ilkit.views.report.report_section` and, for a new analysis,
:func:`ilkit.views.derive.derive_origin`.
"""

# tables, displays and sheet sections of the moving-load and design results register themselves
from ilkit.views import design_records, factored_records, moving_records, rating_records  # noqa: F401
from ilkit.views.derive import Derivation, derivation
from ilkit.views.design_plots import plot_deflection_check, plot_permanent_effects
from ilkit.views.draw import draw_beam
from ilkit.views.explorer import Explorer
from ilkit.views.factored_plots import plot_factored_envelope, plot_transverse
from ilkit.views.formula import formula
from ilkit.views.inventory import plot_inventory, write_girder_sheet
from ilkit.views.moving import plot_envelope, plot_placement
from ilkit.views.plot import plot_line
from ilkit.views.rating_plots import plot_rail_rating, plot_rating
from ilkit.views.rating_records import RatingSheet, write_rating_sheet
from ilkit.views.rating_view import RatingView
from ilkit.views.report import CalculationSheet, TitleBlock, write_calculation_sheet
from ilkit.views.sketch import sketch
from ilkit.views.tables import plain_names, summary, table, to_csv, to_excel, to_latex
from ilkit.views.truss import draw_truss, plot_member_forces

__all__ = [
    "draw_beam",
    "plot_line",
    "sketch",
    "derivation",
    "Derivation",
    "table",
    "to_csv",
    "to_excel",
    "to_latex",
    "plain_names",
    "summary",
    "formula",
    "write_calculation_sheet",
    "CalculationSheet",
    "TitleBlock",
    "Explorer",
    "plot_envelope",
    "plot_inventory",
    "write_girder_sheet",
    "plot_placement",
    "plot_permanent_effects",
    "plot_deflection_check",
    "plot_factored_envelope",
    "plot_transverse",
    "plot_rating",
    "plot_rail_rating",
    "write_rating_sheet",
    "RatingSheet",
    "RatingView",
    "draw_truss",
    "plot_member_forces",
]
