"""How the notebook tests (``pytest --nbval``) compare a cell's outputs with the stored ones.

nbval compares every text output strictly: printed text, tables (HTML and
plain), Markdown, and the numbers in them as the notebooks display them
(rounded).  Figures are not compared byte for byte: the bytes of a drawing
change with the library versions and with last-bit floating-point differences
between machines (a path with one repeated vertex draws the same picture).  A
figure is compared by what a reader can check on it:

* an SVG figure (embedded in an HTML display, or an ``image/svg+xml`` output)
  by its size and every text drawn on it (titles, axis labels, tick labels,
  ordinates, loads), in drawing order;
* a PNG figure (inline ``plt.show()``, a widget's still image) by its presence:
  a cell that drew a figure must still draw one.  What such figures show is
  tested on the drawn artists by the unit tests of the views.
"""

from __future__ import annotations

import base64
import binascii
import html
import re

import pytest

SVG_URI = r"data:image/svg\+xml;base64,[A-Za-z0-9+/=]+"
SVG_TEXT = r"(?s)<svg\b.*?</svg>"
PNG_DATA = r"^iVBORw0KGgo[A-Za-z0-9+/=\s]*$"  # a base64 PNG (the PNG signature encodes to iVBORw0KGgo)


def svg_summary(svg: str) -> str:
    """What a reader checks on an SVG figure: its size and its texts, in drawing order."""
    tag = re.search(r"<svg\b[^>]*>", svg)
    size = " × ".join(re.findall(r'\b(?:width|height)="([^"]*)"', tag.group(0))[:2]) if tag else "?"
    texts = [html.unescape(re.sub(r"<[^>]+>", "", t)).strip()
             for t in re.findall(r"(?s)<text\b[^>]*>(.*?)</text>", svg)]
    return f"[figure {size}; texts: {' | '.join(t for t in texts if t)}]"


def _uri_summary(match: re.Match[str]) -> str:
    data = match.group(0).split(",", 1)[1]
    try:
        return svg_summary(base64.b64decode(data).decode("utf-8"))
    except (binascii.Error, UnicodeDecodeError):
        return "[figure: unreadable SVG]"


# applied in this order to every output before the comparison
SANITIZERS = {
    SVG_URI: _uri_summary,
    SVG_TEXT: lambda match: svg_summary(match.group(0)),
    PNG_DATA: "[figure (PNG)]",
}


def configure(notebook: object) -> None:
    """Set up one nbval notebook collector: figures by summary, PNG figures counted."""
    patterns = getattr(notebook, "sanitize_patterns", None)
    skipped = getattr(notebook, "skip_compare", None)
    if patterns is None or skipped is None:
        raise pytest.UsageError(
            "notebooks/conftest.py relies on nbval's sanitize_patterns and skip_compare (nbval 0.11); "
            "this nbval has neither: update notebooks/conftest.py"
        )
    for regex, replace in SANITIZERS.items():
        patterns.setdefault(regex, replace)
    notebook.skip_compare = tuple(key for key in skipped if key != "image/png")


def pytest_collection_modifyitems(items: list[pytest.Item]) -> None:
    try:
        from nbval.plugin import IPyNbFile
    except ImportError:
        return
    for notebook in {id(item.parent): item.parent for item in items if isinstance(item.parent, IPyNbFile)}.values():
        configure(notebook)
