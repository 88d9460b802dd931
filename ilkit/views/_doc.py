"""A small document model with three renderings: Markdown with LaTeX, plain
text and self-contained HTML (MathML for the mathematics).

Derivations and calculation sheets are built once as a list of blocks and
rendered to whichever form the reader needs, so the three forms cannot drift
apart.  Mathematics is carried as :class:`Math`, which holds the same formula
in LaTeX, in plain text and in presentation MathML.
"""

from __future__ import annotations

import base64
import html
import re
from collections.abc import Callable, Iterable, Sequence
from dataclasses import dataclass
from fractions import Fraction
from typing import Any, Literal

__all__ = [
    "Math",
    "Heading",
    "Para",
    "Equation",
    "Cases",
    "Table",
    "Figure",
    "Callout",
    "Block",
    "num",
    "ident",
    "op",
    "word",
    "paren",
    "sympy_math",
    "value_math",
    "rounded_poly",
    "lincomb",
    "to_markdown",
    "to_text",
    "to_html",
    "svg_data_uri",
]


# ---------------------------------------------------------------------- math
@dataclass(frozen=True)
class Math:
    """One formula in three notations; ``a + b`` writes ``b`` after ``a``."""

    latex: str
    text: str
    mathml: str

    def __add__(self, other: Math) -> Math:
        return Math(f"{self.latex} {other.latex}", self.text + other.text, self.mathml + other.mathml)


def _join(parts: Iterable[Math]) -> Math:
    out = Math("", "", "")
    for p in parts:
        out = out + p
    return Math(out.latex.strip(), out.text, out.mathml)


def num(value: Fraction | int) -> Math:
    """An exact number: integers as such, other rationals as fractions."""
    value = Fraction(value)
    sign = value < 0
    mag = -value if sign else value
    if mag.denominator == 1:
        latex, text, ml = str(mag.numerator), str(mag.numerator), f"<mn>{mag.numerator}</mn>"
    else:
        latex = rf"\frac{{{mag.numerator}}}{{{mag.denominator}}}"
        text = f"{mag.numerator}/{mag.denominator}"
        ml = f"<mfrac><mn>{mag.numerator}</mn><mn>{mag.denominator}</mn></mfrac>"
    if sign:
        return Math(f"-{latex}", f"-{text}", f"<mrow><mo>-</mo>{ml}</mrow>")
    return Math(latex, text, ml)


_GREEK = {"η": r"\eta", "δ": r"\delta", "θ": r"\theta"}


def ident(name: str, sub: str | int | None = None) -> Math:
    """A symbol such as ``w_2`` or ``η``."""
    latex_name = _GREEK.get(name, name)
    ml_name = f"<mi>{html.escape(name)}</mi>"
    if sub is None:
        return Math(latex_name, name, ml_name)
    sub = str(sub)
    ml_sub = f"<mn>{sub}</mn>" if sub.isdigit() else f"<mi>{html.escape(sub)}</mi>"
    return Math(f"{latex_name}_{{{sub}}}", f"{name}_{sub}", f"<msub>{ml_name}{ml_sub}</msub>")


_OPS = {
    "=": ("=", " = ", "="),
    "+": ("+", " + ", "+"),
    "-": ("-", " - ", "-"),
    "<": ("<", " < ", "&lt;"),
    "≤": (r"\le", " ≤ ", "≤"),
    "·": (r"\cdot", "·", "·"),
    ",": (",", ", ", ","),
}


def op(symbol: str) -> Math:
    """An operator or relation: ``=``, ``+``, ``-``, ``<``, ``≤``, ``·`` or ``,``."""
    latex, text, ml = _OPS[symbol]
    return Math(latex, text, f"<mo>{ml}</mo>")


def word(text: str) -> Math:
    """Words inside a formula."""
    escaped = text.replace("\\", r"\textbackslash{}").replace("{", r"\{").replace("}", r"\}")
    spaced = html.escape(text).replace(" ", "&#160;")  # MathML drops plain spaces at the ends of <mtext>
    return Math(rf"\text{{{escaped}}}", text, f"<mtext>{spaced}</mtext>")


def paren(inner: Math) -> Math:
    """``inner`` in round brackets."""
    return Math(rf"\left({inner.latex}\right)", f"({inner.text})", f"<mrow><mo>(</mo>{inner.mathml}<mo>)</mo></mrow>")


def sympy_math(expr: Any) -> Math:
    """A sympy expression; its text form is sympy's own, so it parses back."""
    import sympy
    from sympy.printing.mathml import mathml

    return Math(sympy.latex(expr), sympy.sstr(expr), f"<mrow>{mathml(expr, printer='presentation')}</mrow>")


def value_math(v: Any, scale: float = 1.0) -> Math:
    """An exact number as such; a float to six significant figures (rounding noise shown as 0)."""
    if isinstance(v, Fraction):
        return num(v)
    v = float(v)
    if abs(v) <= 1e-12 * scale:
        return num(0)
    text = f"{v:.6g}"
    if "e" not in text:
        return Math(text, text, f"<mn>{text}</mn>")
    mantissa, exponent = text.split("e")
    power = str(int(exponent))
    return Math(
        rf"{mantissa} \times 10^{{{power}}}",
        text,
        f"<mrow><mn>{mantissa}</mn><mo>×</mo><msup><mn>10</mn><mn>{power}</mn></msup></mrow>",
    )


def rounded_poly(expr: Any, reach: float) -> Any:
    """A float polynomial in x for display: six significant figures, rounding noise dropped.

    A term ``c x^p`` is noise when ``|c| reach^p`` is below 1e-12 of the largest term over ``|x| <= reach``.
    """
    import sympy

    from ilkit._symbols import x

    terms = sympy.Poly(expr, x).terms()
    size = {p: abs(float(c)) * reach**p for (p,), c in terms}
    big = max(size.values(), default=0.0)
    return sum(
        (sympy.Float(float(c), 6) * x**p for (p,), c in terms if size[p] > 1e-12 * big),
        sympy.Integer(0),
    )


def lincomb(terms: Sequence[tuple[Fraction, Math | None]]) -> Math:
    """``c1 s1 + c2 s2 + ...`` in the given order (zero terms left out; ``None`` is a constant term)."""
    parts: list[Math] = []
    for coef, symbol in terms:
        if not coef:
            continue
        mag = abs(Fraction(coef))
        if parts:
            parts.append(op("-" if coef < 0 else "+"))
        elif coef < 0:
            parts.append(Math("-", "-", "<mo>-</mo>"))
        if symbol is None:
            parts.append(num(mag))
            continue
        if mag != 1:
            parts.append(num(mag) + Math("", " ", "<mo>&InvisibleTimes;</mo>"))
        parts.append(symbol)
    return _join(parts) if parts else num(0)


# -------------------------------------------------------------------- blocks
Inline = str | Math


@dataclass(frozen=True)
class Heading:
    text: str
    level: int = 2


@dataclass(frozen=True)
class Para:
    items: tuple[Inline, ...]


@dataclass(frozen=True)
class Equation:
    math: Math


@dataclass(frozen=True)
class Cases:
    """``lhs = { value_i  for condition_i }``, one row per piece."""

    lhs: Math
    rows: tuple[tuple[Math, Math], ...]


@dataclass(frozen=True)
class Table:
    header: tuple[Inline, ...]
    rows: tuple[tuple[Inline, ...], ...]
    align: str = ""  # one of "l", "r", "c" per column; left by default
    css: str = ""  # a class for the HTML table (e.g. "title-block")


@dataclass(frozen=True)
class Figure:
    """An SVG drawing; ``name`` is a file stem for renderings that write files."""

    svg: str
    caption: str
    name: str


@dataclass(frozen=True)
class Callout:
    """A boxed remark, e.g. the caution that results must be checked."""

    text: str
    kind: Literal["caution", "note"] = "note"


Block = Heading | Para | Equation | Cases | Table | Figure | Callout


def svg_data_uri(svg: str) -> str:
    """The SVG as a ``data:`` URI (keeps pages self-contained; ids cannot clash)."""
    return "data:image/svg+xml;base64," + base64.b64encode(svg.encode("utf-8")).decode("ascii")


# ------------------------------------------------------------------ markdown
_SYMBOL = re.compile(r"(?<![\w\\])([A-Za-zδθη])_([A-Za-z0-9]{1,3})(?![\w])")
"""A quantity's symbol with a subscript written in words, such as ``V_h`` or ``M_R``."""
_LATEX_LETTER = {"δ": r"\delta", "θ": r"\theta", "η": r"\eta"}


def _md_text(text: str) -> str:
    """Text for Markdown: symbols such as ``V_h`` as inline formulas (``$V_{h}$``)."""
    return _SYMBOL.sub(lambda m: f"${_LATEX_LETTER.get(m[1], m[1])}_{{{m[2]}}}$", text)


def _html_text(text: str) -> str:
    """Text for HTML, escaped; symbols such as ``V_h`` with a real subscript."""
    return _SYMBOL.sub(r"<i>\1</i><sub>\2</sub>", html.escape(text))


def _md_inline(item: Inline) -> str:
    return f"${item.latex}$" if isinstance(item, Math) else _md_text(item)


def _md_cell(item: Inline) -> str:
    return _md_inline(item).replace("|", r"\|")


def to_markdown(blocks: Iterable[Block], figure_link: Callable[[Figure], str] | None = None) -> str:
    """Markdown with LaTeX (``$...$`` inline, ``$$...$$`` displayed).

    ``figure_link`` gives the link of a figure (e.g. a file written next to
    the Markdown); without it figures are embedded as ``data:`` URIs.
    """
    out: list[str] = []
    for b in blocks:
        if isinstance(b, Heading):
            out.append("#" * b.level + " " + _md_text(b.text))
        elif isinstance(b, Para):
            out.append("".join(_md_inline(i) for i in b.items))
        elif isinstance(b, Equation):
            out.append(f"$$\n{b.math.latex}\n$$")
        elif isinstance(b, Cases):
            rows = r" \\ ".join(rf"{v.latex} & \text{{for }} {c.latex}" for v, c in b.rows)
            out.append(f"$$\n{b.lhs.latex} = \\begin{{cases}} {rows} \\end{{cases}}\n$$")
        elif isinstance(b, Table):
            align = b.align or "l" * len(b.header)
            rule = {"l": ":--", "r": "--:", "c": ":-:"}
            lines = ["| " + " | ".join(_md_cell(h) for h in b.header) + " |",
                     "|" + "|".join(rule[a] for a in align) + "|"]
            lines += ["| " + " | ".join(_md_cell(c) for c in row) + " |" for row in b.rows]
            out.append("\n".join(lines))
        elif isinstance(b, Figure):
            link = figure_link(b) if figure_link else svg_data_uri(b.svg)
            out.append(f"![{b.caption}]({link})\n\n*{_md_text(b.caption)}*")
        elif isinstance(b, Callout):
            label = "Caution" if b.kind == "caution" else "Note"
            out.append(f"> **{label}.** {_md_text(b.text)}")
        else:  # pragma: no cover - Block is a closed union
            raise TypeError(f"unknown block {b!r}")
    return "\n\n".join(out) + "\n"


# ---------------------------------------------------------------------- text
def _text_inline(item: Inline) -> str:
    return item.text if isinstance(item, Math) else item


def _text_table(header: Sequence[str], rows: Sequence[Sequence[str]], align: str) -> list[str]:
    widths = [max(len(r[i]) for r in [header, *rows]) for i in range(len(header))]

    def line(cells: Sequence[str]) -> str:
        return "  ".join(c.rjust(w) if a == "r" else c.ljust(w) for c, w, a in zip(cells, widths, align)).rstrip()

    return [line(header), "  ".join("-" * w for w in widths), *(line(r) for r in rows)]


def to_text(blocks: Iterable[Block]) -> str:
    """Plain text: formulas in a linear notation that sympy reads back."""
    out: list[str] = []
    for b in blocks:
        if isinstance(b, Heading):
            out.append(b.text + "\n" + ("=" if b.level <= 1 else "-") * len(b.text))
        elif isinstance(b, Para):
            out.append("".join(_text_inline(i) for i in b.items))
        elif isinstance(b, Equation):
            out.append("    " + b.math.text)
        elif isinstance(b, Cases):
            lead = b.lhs.text + " = "
            width = max(len(v.text) for v, _ in b.rows)
            lines = [
                ("    " + (lead if i == 0 else " " * len(lead)) + v.text.ljust(width) + "  for " + c.text).rstrip()
                for i, (v, c) in enumerate(b.rows)
            ]
            out.append("\n".join(lines))
        elif isinstance(b, Table):
            align = b.align or "l" * len(b.header)
            header = [_text_inline(h) for h in b.header]
            rows = [[_text_inline(c) for c in r] for r in b.rows]
            out.append("\n".join("    " + ln for ln in _text_table(header, rows, align)))
        elif isinstance(b, Figure):
            out.append(f"[Figure: {b.caption}]")
        elif isinstance(b, Callout):
            out.append(("CAUTION: " if b.kind == "caution" else "Note: ") + b.text)
        else:  # pragma: no cover
            raise TypeError(f"unknown block {b!r}")
    return "\n\n".join(out) + "\n"


# ---------------------------------------------------------------------- html
def _html_inline(item: Inline) -> str:
    if isinstance(item, Math):
        return f'<math><mrow>{item.mathml}</mrow></math>'
    return _html_text(item)


def to_html(blocks: Iterable[Block], heading_offset: int = 0) -> str:
    """An HTML fragment; formulas as MathML (rendered by browsers without scripts)."""
    out: list[str] = []
    for b in blocks:
        if isinstance(b, Heading):
            level = min(b.level + heading_offset, 6)
            out.append(f"<h{level}>{_html_text(b.text)}</h{level}>")
        elif isinstance(b, Para):
            out.append("<p>" + "".join(_html_inline(i) for i in b.items) + "</p>")
        elif isinstance(b, Equation):
            out.append(f'<math display="block"><mrow>{b.math.mathml}</mrow></math>')
        elif isinstance(b, Cases):
            rows = "".join(
                f"<mtr><mtd>{v.mathml}</mtd><mtd><mtext>&#160;for&#160;</mtext>{c.mathml}</mtd></mtr>"
                for v, c in b.rows
            )
            out.append(
                f'<math display="block"><mrow>{b.lhs.mathml}<mo>=</mo>'
                f'<mrow><mo stretchy="true">{{</mo><mtable class="cases">{rows}</mtable></mrow></mrow></math>'
            )
        elif isinstance(b, Table):
            align = b.align or "l" * len(b.header)
            css = {"l": "left", "r": "right", "c": "center"}
            head = "".join(f'<th style="text-align:{css[a]}">{_html_inline(h)}</th>' for h, a in zip(b.header, align))
            body = "".join(
                "<tr>" + "".join(f'<td style="text-align:{css[a]}">{_html_inline(c)}</td>' for c, a in zip(r, align))
                + "</tr>"
                for r in b.rows
            )
            css = f' class="{html.escape(b.css)}"' if b.css else ""
            thead = f"<thead><tr>{head}</tr></thead>" if any(b.header) else ""
            out.append(f"<table{css}>{thead}<tbody>{body}</tbody></table>")
        elif isinstance(b, Figure):
            out.append(
                f'<figure><img src="{svg_data_uri(b.svg)}" alt="{html.escape(b.caption)}">'
                f"<figcaption>{_html_text(b.caption)}</figcaption></figure>"
            )
        elif isinstance(b, Callout):
            label = "Caution" if b.kind == "caution" else "Note"
            out.append(f'<aside class="{b.kind}"><strong>{label}.</strong> {_html_text(b.text)}</aside>')
        else:  # pragma: no cover
            raise TypeError(f"unknown block {b!r}")
    return "\n".join(out)
