"""The caution that travels with every result ilkit shows or writes.

Engineering results can hurt people if misused: calculation sheets, the
explorer, notebook displays of placements and envelopes, and CSV, Excel and
LaTeX exports all carry it (a line, a header row, a sheet, a table note).
"""

from __future__ import annotations

__all__ = ["CAUTION", "CAUTION_SHORT"]

CAUTION = (
    "These results were produced by software as an aid to calculation. They must be checked by a qualified "
    "engineer, who is responsible for their use; the governing design codes, the licensed current editions "
    "of the standards and licensed professional practice take precedence over anything in this sheet."
)
"""The full caution: calculation sheets (at their start and end), exports and the demo pages."""

CAUTION_SHORT = (
    "Results to be checked by a qualified engineer; the governing codes and licensed practice take precedence."
)
"""The caution in one line, where space is short: the explorer, notebook displays, a LaTeX table's note."""
