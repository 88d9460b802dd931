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
* :func:`write_calculation_sheet` -> :class:`CalculationSheet`.

A new result type joins by registering with the dispatchers
:func:`ilkit.views.display.mimebundle`, :func:`table`,
:func:`ilkit.views.report.report_section` and, for a new analysis,
:func:`ilkit.views.derive.derive_origin`.
"""

from ilkit.views.derive import Derivation, derivation
from ilkit.views.draw import draw_beam
from ilkit.views.plot import plot_line
from ilkit.views.report import CalculationSheet, write_calculation_sheet
from ilkit.views.sketch import sketch
from ilkit.views.tables import table, to_csv, to_excel, to_latex

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
    "write_calculation_sheet",
    "CalculationSheet",
]
