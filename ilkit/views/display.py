"""Rich notebook displays of ilkit's objects.

Core objects inherit :class:`ilkit._display.RichDisplay`, whose
``_repr_mimebundle_`` calls :func:`mimebundle` here when a notebook shows
them.  ``mimebundle`` adds ``text/html``; Jupyter fills ``text/plain`` from the
short, constructor-like ``repr``.

* a beam: its diagram and a summary (length, spans, overhangs, supports,
  releases, degree of indeterminacy, units);
* an influence line: its Müller-Breslau sketch (or its plot, for a line not
  made from a beam's analysis), and a table of key ordinates, extremes and
  areas.

Further result types add theirs with ``mimebundle.register(TheirType)``,
returning ``{"text/html": ...}``.  Without matplotlib the display leaves the
drawing out and says how to get it.
"""

from __future__ import annotations

import html
from functools import singledispatch
from typing import TYPE_CHECKING, Any

from ilkit._exact import fmt
from ilkit.errors import MissingDependencyError
from ilkit.influence import InfluenceLine
from ilkit.model import Beam
from ilkit.views import _doc, style
from ilkit.views.derive import SIGN_CONVENTIONS, quantity_title
from ilkit.views.numbers import area_unit, clean, line_scale, ordinate_unit, short
from ilkit.views.tables import beam_facts

if TYPE_CHECKING:  # pragma: no cover
    from collections.abc import Callable

    from matplotlib.axes import Axes

__all__ = ["mimebundle", "figure_html", "line_facts", "beam_figure", "line_figure"]

_CSS = (
    "<style>.ilkit-view{font-family:'DejaVu Sans',sans-serif;font-size:13px;max-width:760px}"
    ".ilkit-view table{border-collapse:collapse;margin:4px 0}"
    ".ilkit-view th,.ilkit-view td{padding:2px 10px;border-bottom:1px solid #ddd;text-align:left}"
    ".ilkit-view th{font-weight:600;color:#333}"
    ".ilkit-view img{max-width:100%}"
    ".ilkit-view .note{color:#666;font-style:italic}</style>"
)


@singledispatch
def mimebundle(obj: object, include: Any = None, exclude: Any = None) -> dict[str, Any]:
    """Rich representations of ``obj`` for Jupyter; empty for types without one (Jupyter then uses ``repr``)."""
    return {}


def beam_figure(beam: Beam) -> Any:
    """A new (pyplot-free) figure with the beam diagram."""
    from ilkit.views.draw import draw_beam

    return _figure(lambda ax: draw_beam(beam, ax), 1.4)


def line_figure(line: InfluenceLine) -> Any:
    """A new (pyplot-free) figure with the line's Müller-Breslau sketch, or its plot for a line not made
    from a beam's analysis."""
    from ilkit.trusses.lines import TrussLine
    from ilkit.views.plot import plot_line
    from ilkit.views.sketch import sketch

    truss = isinstance(line.origin, TrussLine)
    drawer = sketch if truss or getattr(line.origin, "beam", None) is not None else plot_line
    return _figure(lambda ax: drawer(line, ax), 4.2 if truss else 2.6)


def _figure(draw: Callable[[Axes], Any], height: float) -> Any:
    with style.context():
        fig = style.new_figure(height)
        draw(fig.add_subplot())
    return fig


def figure_html(make_figure: Callable[[], Any], alt: str) -> str:
    """An ``<img>`` with the figure as inline SVG, or a note when matplotlib is missing."""
    try:
        fig = make_figure()
    except MissingDependencyError as err:
        return f'<p class="note">{html.escape(str(err))}</p>'
    return f'<img src="{_doc.svg_data_uri(style.figure_svg(fig))}" alt="{html.escape(alt)}">'


def _facts_html(rows: list[tuple[str, str]]) -> str:
    body = "".join(f"<tr><th>{html.escape(k)}</th><td>{html.escape(v)}</td></tr>" for k, v in rows)
    return f"<table>{body}</table>"


@mimebundle.register(Beam)
def _(beam: Beam, include: Any = None, exclude: Any = None) -> dict[str, Any]:
    body = figure_html(lambda: beam_figure(beam), "beam diagram") + _facts_html(beam_facts(beam))
    return {"text/html": f'{_CSS}<div class="ilkit-view"><strong>Beam</strong>{body}</div>'}


def line_facts(line: InfluenceLine) -> list[tuple[str, str]]:
    """Key facts of a line: sign convention, extremes with positions, areas (core values, in the units of
    the plots and tables: :mod:`ilkit.views.numbers`)."""
    units = line.units
    factor, unit = ordinate_unit(line)
    scale = line_scale(line)
    u = f" {unit}" if unit else ""
    at = f" {units.length}" if units else ""
    per_area = f" {area_unit(line)}" if units else ""

    def where(o: Any) -> str:
        side = f", {o.side} side" if o.side else ""
        return f"{short(clean(o.value, scale) * factor)}{u} at x = {fmt(o.x)}{at}{side}"

    def area(value: float) -> str:
        return f"{short(clean(value, scale * line.length) * factor)}{per_area}"

    return [
        ("sign convention", f"{line.quantity.words} {SIGN_CONVENTIONS[line.quantity.kind]}"),
        ("largest ordinate", where(line.maximum)),
        ("smallest ordinate (most negative)", where(line.minimum)),
        ("positive area", area(line.positive_area)),
        ("negative area", area(line.negative_area)),
        ("breakpoints", ", ".join(fmt(b) for b in line.breakpoints) + at),
        ("form", "exact (rational)" if line.is_exact else "numeric"),
    ]


@mimebundle.register(InfluenceLine)
def _(line: InfluenceLine, include: Any = None, exclude: Any = None) -> dict[str, Any]:
    from ilkit.views.tables import ordinate_table

    title = html.escape("Influence line of the " + quantity_title(line.quantity, line.units.length
                                                                    if line.units else ""))
    body = (
        figure_html(lambda: line_figure(line), title)
        + _facts_html(line_facts(line))
        + _doc.to_html([ordinate_table(line)])
    )
    return {"text/html": f'{_CSS}<div class="ilkit-view"><strong>{title}</strong>{body}</div>'}
