"""Tables of results, with units in the column names, and their export.

``table(obj)`` gives the pandas DataFrame form of a result:

* :class:`~ilkit.InfluenceLine`: position and the ordinates just left and
  right of every breakpoint (``line.ordinates()``);
* :class:`~ilkit.Beam`: its supports and releases by position;
* a DataFrame is returned as it is;
* moving-load results (placements, envelopes): see
  :mod:`ilkit.views.moving_records`.

Further result types add their form with ``table.register(TheirType)``.

Export: :func:`to_csv`, :func:`to_excel` (needs openpyxl) and
:func:`to_latex` (a booktabs table, written by ilkit: no LaTeX packages other
than booktabs are needed).  Each accepts a result or a DataFrame.
"""

from __future__ import annotations

import io
import math
from collections.abc import Iterable, Mapping
from functools import singledispatch
from pathlib import Path
from typing import TYPE_CHECKING, Any

from ilkit._check import flag
from ilkit._exact import fmt
from ilkit._files import write_file
from ilkit.errors import ExportError, MissingDependencyError, UnsupportedResultError
from ilkit.influence import InfluenceLine
from ilkit.model import Beam, Support
from ilkit.views import _doc
from ilkit.views._args import path_of
from ilkit.views.caution import CAUTION, CAUTION_SHORT
from ilkit.views.numbers import NOISE, area_unit, clean, engineering, line_scale, ordinate_unit

if TYPE_CHECKING:  # pragma: no cover
    import pandas as pd

__all__ = [
    "table", "beam_facts", "to_csv", "to_excel", "to_latex", "doc_table", "without_noise", "NOISE", "plain_name",
    "plain_names", "ordinate_table", "summary",
]


@singledispatch
def table(obj: object) -> pd.DataFrame:
    """The DataFrame form of a result; units are in the column names."""
    import pandas as pd

    if isinstance(obj, pd.DataFrame):
        return obj
    raise UnsupportedResultError(
        f"table: no table form for {type(obj).__name__}; give an InfluenceLine, a Beam or a pandas DataFrame."
    )


@table.register(InfluenceLine)
def _(line: InfluenceLine) -> pd.DataFrame:
    frame = line.ordinates()
    factor, unit = ordinate_unit(line)
    if factor == 1.0:
        return frame
    # deflections in mm (or in), rotations in mrad per unit force: the units of the plots
    first, *rest = frame.columns
    out = frame[[first]].copy()
    for column in rest:
        out[f"{column.split(' [')[0]} [{unit}]"] = frame[column] * factor
    return out


@table.register(Beam)
def _(beam: Beam) -> pd.DataFrame:
    import pandas as pd

    unit = f" [{beam.units.length}]" if beam.units else ""
    rows = [(float(s.at), _support_words(s, beam.units)) for s in beam.supports]
    rows += [(float(p), kind) for p, kind in beam.releases]
    rows.sort(key=lambda r: r[0])
    return pd.DataFrame({f"x{unit}": [r[0] for r in rows], "item": [r[1] for r in rows]})


def _support_words(support: Support, units: Any = None) -> str:
    """``"pin support"``, or for an elastic support its springs, e.g. ``"spring support (vertical 5000 kN/m,
    rotational free)"``."""
    return f"{support.kind} support" if support.spring is None else f"spring support ({_spring_words(support, units)})"


def _spring_words(support: Support, units: Any = None) -> str:
    """A spring's stiffnesses in words: ``"vertical 5000 kN/m, rotational free"``."""
    spring = support.spring
    assert spring is not None

    def stiffness(value: object, unit: str) -> str:
        return value if isinstance(value, str) else f"{engineering(float(value))}{unit}"  # type: ignore[arg-type]

    return (f"vertical {stiffness(spring.vertical, f' {units.force}/{units.length}' if units else '')}, "
            f"rotational {stiffness(spring.rotational, f' {units.moment}/rad' if units else '')}")


def beam_facts(beam: Beam) -> list[tuple[str, str]]:
    """The beam in a few lines: ``(label, value)`` for summaries and calculation sheets.

    Positions carry the length unit; springs are described in words with
    their units; ``EI`` in engineering notation (``24 × 10⁶ kN·m²``).
    """
    u = f" {beam.units.length}" if beam.units else ""

    def at(x: object) -> str:
        return f"{fmt(x)}{u}"  # type: ignore[arg-type]

    spans = ", ".join(f"{at(b - a)} ({fmt(a)} to {at(b)})" for a, b in beam.spans) or "none"
    first, last = beam.supports[0].at, beam.supports[-1].at
    overhangs = [f"left {at(first)}"] if first > 0 else []
    overhangs += [f"right {at(beam.length - last)}"] if last < beam.length else []
    degree = beam.degree
    supports = ", ".join(
        f"{s.kind} at {at(s.at)}" if s.spring is None else f"spring at {at(s.at)} ({_spring_words(s, beam.units)})"
        for s in beam.supports
    )
    facts = [
        ("length", at(beam.length)),
        ("spans", spans),
        ("overhangs", ", ".join(overhangs) or "none"),
        ("supports", supports),
        ("hinges", ", ".join(at(h) for h in beam.hinges) or "none"),
        ("shear releases", ", ".join(at(h) for h in beam.shear_releases) or "none"),
        ("degree of indeterminacy", f"{degree} ({'determinate' if degree == 0 else 'indeterminate'})"),
        ("units", f"{beam.units.name} (lengths in {beam.units.length}, forces in {beam.units.force})"
         if beam.units else "not declared"),
    ]
    ranges = beam.EI_ranges
    if ranges:
        ei_unit = f" {beam.units.force}·{beam.units.length}²" if beam.units else ""
        facts.append(("EI", ", ".join(
            f"{engineering(float(ei))}{ei_unit}" + (f" ({fmt(a)} to {at(b)})" if len(ranges) > 1 else "")
            for a, b, ei in ranges
        )))
    return facts


def summary(lines: Mapping[str, InfluenceLine] | Iterable[InfluenceLine]) -> pd.DataFrame:
    """Key values of several influence lines, one row each: largest and smallest (most negative) ordinate
    with their positions, positive and negative areas, and the units of each.

    ``lines``: a mapping ``{name: line}`` (the names index the rows) or a list
    of lines (indexed by their labels, ``"M at x=32"``).  Ordinates and areas
    are in the units of the plots (a deflection in mm or in per unit force;
    :mod:`ilkit.views.numbers`), rounding noise shown as 0; each row says its
    units, since the lines may be of different quantities.  All lines must
    share one length unit.
    """
    import pandas as pd

    from ilkit._check import listed
    from ilkit.views._args import expect

    given = list(lines.items()) if isinstance(lines, Mapping) else [(None, v) for v in listed(
        lines, wanted="summary: give a list of influence lines or a mapping {name: line}", field="lines",
        ordered=False)]
    items = []
    for name, line in given:
        expect(line, InfluenceLine, what="summary: lines", hint="give influence lines, e.g. beam.moment(12)")
        items.append((str(name) if name is not None else line.quantity.label, line))
    lengths = {line.units.length if line.units else "" for _, line in items}
    if len(lengths) > 1:
        raise ExportError(
            f"summary: the lines are in different length units ({', '.join(sorted(repr(u) for u in lengths))}); "
            "convert the beams to one system first (beam.in_units(...)).",
            field="lines",
        )
    at = f" [{lengths.pop()}]" if lengths and next(iter(lengths), "") else ""
    rows = []
    for _, line in items:
        factor, unit = ordinate_unit(line)
        scale = line_scale(line)

        def shown(value: float, size: float = scale, f: float = factor) -> float:
            return clean(value, size) * f

        rows.append({
            "largest": shown(line.maximum.value),
            f"x of largest{at}": line.maximum.x,
            "smallest (most negative)": shown(line.minimum.value),
            f"x of smallest{at}": line.minimum.x,
            "positive area": shown(line.positive_area, scale * line.length),
            "negative area": shown(line.negative_area, scale * line.length),
            "ordinate unit": unit,
            "area unit": area_unit(line),
        })
    return pd.DataFrame(rows, index=pd.Index([name for name, _ in items], name="quantity"))


_PLAIN = str.maketrans({"·": "_", "²": "2", "³": "3", "δ": "delta", "θ": "theta", "η": "eta", "−": "-"})


def plain_name(column: object) -> str:
    """The plain name of a table column: the unit dropped, words joined by ``_`` (``"M max [kip·ft]"`` ->
    ``"M_max"``, ``"M max case"`` -> ``"M_max_case"``, ``"factored effect [kN]"`` -> ``"factored_effect"``)."""
    text = str(column)
    if _unit_of(text):
        text = text[: text.rfind("[")]
    words = "".join(c if c.isalnum() or c == "_" else " " for c in text.translate(_PLAIN)).split()
    return "_".join(words) or "column"


def plain_names(obj: object) -> pd.DataFrame:
    """The table of ``obj`` (a result or a DataFrame) with columns that are easy to type in code.

    The readable names (``"M max [kip·ft]"``) stay in every display and
    export; this copy has the plain names of :func:`plain_name`
    (``frame["M_max"]``, or ``frame.M_max``), and keeps the units in
    ``frame.attrs["units"]`` (``{"M_max": "kip·ft", ...}``).  Where a name
    and a name with a unit would meet (``"load"``, the load's name, and
    ``"load [kip]"``, the axle load) the second keeps its unit (``load_kip``);
    two columns that still meet are refused with :class:`ilkit.ExportError`.
    """
    frame = table(obj)
    names = [plain_name(c) for c in frame.columns]
    for k, column in enumerate(frame.columns):  # "load" and "load [kip]": the second is "load_kip"
        if names.count(names[k]) > 1 and _unit_of(column):
            names[k] = f"{names[k]}_{plain_name(_unit_of(column))}"
    for k, name in enumerate(names):
        if name in names[:k]:
            first = frame.columns[names.index(name)]
            raise ExportError(
                f"plain_names: the columns {first!r} and {frame.columns[k]!r} both have the plain name {name!r}; "
                "rename one of them.",
                field="columns",
                value=(first, frame.columns[k]),
            )
    out = frame.set_axis(names, axis=1)
    out.attrs["units"] = {n: _unit_of(c) for n, c in zip(names, frame.columns) if _unit_of(c)}
    return out


def _is_bool(value: Any) -> bool:
    return isinstance(value, bool) or getattr(getattr(value, "dtype", None), "kind", "") == "b"


def _cell(value: Any, digits: int) -> str:
    """A table cell: numbers to ``digits`` significant figures, truth values as yes or no; a missing value
    (None, NaN) is empty."""
    if value is None:
        return ""
    if _is_bool(value):
        return "yes" if value else "no"
    if isinstance(value, float) or hasattr(value, "dtype"):
        as_float = float(value)
        if math.isnan(as_float):
            return ""
        return engineering(as_float, digits) if math.isfinite(as_float) else str(as_float)
    return str(value)


def _align(frame: pd.DataFrame) -> str:
    """Numbers right, text left."""
    return "".join("r" if frame[c].dtype.kind in "fiu" else "l" for c in frame.columns)


def _unit_of(column: object) -> str:
    text = str(column)
    return text[text.find("[") + 1 : text.rfind("]")] if "[" in text and text.endswith("]") else ""


def without_noise(frame: pd.DataFrame, scale: float | Mapping[str, float] | None = None) -> pd.DataFrame:
    """A copy of ``frame`` with rounding noise in its float columns set to 0 (and ``-0.0`` to ``0.0``).

    Float results carry noise where the exact value is 0 (a moment at a
    simple support: 1e-13 kip·ft); printed to four figures it would read as a
    value.  A value is noise when it is below :data:`NOISE` times the scale of
    its quantity: ``scale`` (one number for every float column, or a number
    per column); by default the largest magnitude among the columns with the
    same unit in their name.  Give the scale when a column may hold nothing
    but noise (the ordinates of a line at its supports:
    :func:`ilkit.views.numbers.line_scale`).  Only what is shown is cleaned;
    the results keep their numbers.
    """
    out = frame.copy()
    floats = [c for c in out.columns if out[c].dtype.kind == "f"]
    groups: dict[str, float] = {}
    for column in floats:
        key = _unit_of(column) or f"\0{column}"
        groups[key] = max(groups.get(key, 0.0), float(out[column].abs().max(skipna=True) or 0.0))
    for column in floats:
        if isinstance(scale, Mapping):
            size = scale.get(column)
        else:
            size = scale
        if size is None:
            size = groups[_unit_of(column) or f"\0{column}"]
        values = out[column]
        out[column] = values.where((values.abs() > NOISE * abs(size)) | values.isna(), 0.0)
    return out


def doc_table(
    frame: pd.DataFrame, digits: int = 4, *, scale: float | Mapping[str, float] | None = None
) -> _doc.Table:
    """A DataFrame as a document table (numbers to ``digits`` significant figures, noise shown as 0; ``scale``
    as in :func:`without_noise`)."""
    clean = without_noise(frame, scale)
    rows = tuple(tuple(_cell(v, digits) for v in row) for row in clean.itertuples(index=False))
    return _doc.Table(tuple(str(c) for c in frame.columns), rows, _align(frame))


def ordinate_table(line: InfluenceLine, digits: int = 4) -> _doc.Table:
    """The ordinates of ``line`` at its breakpoints (both sides where it jumps) as a document table: in the
    units of the plots, rounding noise judged against the size of the quantity on its beam."""
    factor, _ = ordinate_unit(line)
    return doc_table(table(line), digits, scale=line_scale(line) * factor)


def to_csv(obj: object, path: str | Path, *, caution: bool = True) -> Path:
    """Write the table of ``obj`` as CSV (UTF-8, full precision, no index); returns the path.

    The first line is the caution that results must be checked by a
    qualified engineer (``# ...``; read the table back with
    ``pd.read_csv(path, skiprows=1)``); ``caution=False`` leaves it out, for
    a file that another program reads.  The file is written whole or not at
    all (an existing file is left as it was when the write fails); missing
    folders are created; file-system faults raise :class:`ilkit.WriteError`.
    """
    path = path_of(path, what="to_csv")
    caution = flag(caution, what="to_csv: caution", field="caution")
    head = f"# Caution: {CAUTION}\n" if caution else ""
    return write_file(path, head + table(obj).to_csv(index=False, lineterminator="\n"), what="to_csv")


_SHEET_FORBIDDEN = str.maketrans({c: "_" for c in "[]:*?/\\"})
SHEET_NAME_LIMIT = 31
"""Excel's longest sheet name."""


def _sheet_names(names: Iterable[object]) -> list[str]:
    """The Excel sheet name of each of ``names``: ``[]:*?/\\`` replaced by ``_``, cut to 31 characters.

    Two names that would give the same sheet (Excel ignores case) are refused
    with :class:`ilkit.ExportError` naming both, as are names Excel refuses
    (empty, starting or ending with an apostrophe, ``History``): a sheet is
    never dropped or renamed behind the caller's back.
    """
    taken: dict[str, object] = {}
    out = []
    for given in names:
        sheet = str(given).translate(_SHEET_FORBIDDEN)[:SHEET_NAME_LIMIT]
        if not sheet.strip() or sheet[0] == "'" or sheet[-1] == "'" or sheet.casefold() == "history":
            raise ExportError(
                f"to_excel: Excel refuses the sheet name {sheet!r} (from {given!r}): names must not be empty, "
                "start or end with an apostrophe, or be 'History'. Rename it.",
                field="sheets",
                value=given,
            )
        if sheet.casefold() in taken:
            first = taken[sheet.casefold()]
            raise ExportError(
                f"to_excel: the names {first!r} and {given!r} both become the sheet {sheet!r} (Excel sheet names "
                f"have at most {SHEET_NAME_LIMIT} characters, no []:*?/\\, and ignore case), so one result would "
                "be lost. Rename one of them.",
                field="sheets",
                value=(first, given),
            )
        taken[sheet.casefold()] = given
        out.append(sheet)
    return out


CAUTION_SHEET = "caution"
"""The sheet of a workbook written by :func:`to_excel` that holds the caution (the last one)."""


def to_excel(obj: object, path: str | Path, *, caution: bool = True) -> Path:
    """Write ``obj`` to an Excel workbook; returns the path.

    ``obj`` is a result, a DataFrame, or a mapping ``{sheet name: result}``
    for several sheets.  Sheet names have ``[]:*?/\\`` replaced by ``_`` and
    are cut to Excel's 31 characters; two names that would give the same
    sheet (Excel ignores case) are refused with :class:`ilkit.ExportError`
    naming both, never dropped.  A last sheet, ``caution``, says that the
    results must be checked by a qualified engineer (``caution=False`` leaves
    it out; a sheet of your own named ``caution`` is then allowed).  The
    workbook is written whole or not at all (an existing file is left as it
    was when anything fails); missing folders are created; file-system
    faults raise :class:`ilkit.WriteError`.  Needs
    openpyxl: without it :class:`ilkit.MissingDependencyError` names
    ``pip install openpyxl``.
    """
    try:
        import openpyxl  # noqa: F401
    except ImportError:
        raise MissingDependencyError(
            "to_excel: writing Excel files needs openpyxl, which is not installed; install it with: "
            "pip install openpyxl (or write CSV with ilkit.views.to_csv)."
        ) from None
    import pandas as pd

    path = path_of(path, what="to_excel")
    sheets = obj if isinstance(obj, Mapping) else {"ilkit": obj}
    if not sheets:
        raise ExportError(
            "to_excel: no sheets to write (an empty mapping); give a result, a DataFrame or "
            "{sheet name: result} with at least one entry.",
            field="sheets",
            value=obj,
        )
    caution = flag(caution, what="to_excel: caution", field="caution")
    names = [*sheets, CAUTION_SHEET] if caution else list(sheets)
    frames = dict(zip(_sheet_names(names), (table(item) for item in sheets.values())))
    buffer = io.BytesIO()
    with pd.ExcelWriter(buffer, engine="openpyxl") as writer:
        for name, frame in frames.items():
            frame.to_excel(writer, sheet_name=name, index=False)
        if caution:
            pd.DataFrame({"caution": [CAUTION]}).to_excel(writer, sheet_name=CAUTION_SHEET, index=False)
    return write_file(path, buffer.getvalue(), what="to_excel")


_LATEX_TEXT = {
    "\\": r"\textbackslash{}", "&": r"\&", "%": r"\%", "$": r"\$", "#": r"\#", "_": r"\_", "{": r"\{",
    "}": r"\}", "~": r"\textasciitilde{}", "^": r"\textasciicircum{}", "·": r"\ensuremath{\cdot}",
    "²": r"\textsuperscript{2}", "³": r"\textsuperscript{3}", "δ": r"\ensuremath{\delta}",
    "θ": r"\ensuremath{\theta}", "η": r"\ensuremath{\eta}", "−": r"\ensuremath{-}",
}


def _latex_text(text: str) -> str:
    return "".join(_LATEX_TEXT.get(ch, ch) for ch in text)


def _latex_cell(value: Any, digits: int) -> str:
    text = _cell(value, digits)
    if text and not _is_bool(value) and (isinstance(value, (int, float)) or hasattr(value, "dtype")):
        mantissa, times, power = text.partition(" × 10")
        if times:  # engineering notation: 24 × 10⁶
            text = rf"{mantissa} \times 10^{{{power.translate(_FROM_SUPERSCRIPT)}}}"
        return f"${text}$"
    return _latex_text(text)


_FROM_SUPERSCRIPT = str.maketrans("⁻⁰¹²³⁴⁵⁶⁷⁸⁹", "-0123456789")


def to_latex(
    obj: object, path: str | Path | None = None, *, digits: int = 4, caption: str | None = None,
    label: str | None = None, caution: bool = True,
) -> str:
    """The table of ``obj`` as a LaTeX ``tabular`` with booktabs rules; also written to ``path`` if given.

    Numbers have ``digits`` significant figures and are set in math mode (so
    the minus sign is a proper minus).  With ``caption`` or ``label`` the
    tabular is wrapped in a ``table`` float.  Needs ``\\usepackage{booktabs}``.
    The caution that results must be checked by a qualified engineer is a
    comment at the top and a note under the table (``caution=False`` leaves
    both out).
    The file is written whole or not at all (see :func:`to_csv`).
    """
    from ilkit._check import whole

    digits = whole(digits, what="to_latex: digits", field="digits", minimum=1, maximum=17)
    caution = flag(caution, what="to_latex: caution", field="caution")
    frame = table(obj)
    note = [rf"\multicolumn{{{len(frame.columns)}}}{{@{{}}l}}{{\footnotesize\itshape {_latex_text(CAUTION_SHORT)}}} \\"]
    lines = [
        rf"\begin{{tabular}}{{{_align(frame)}}}",
        r"\toprule",
        " & ".join(_latex_text(str(c)) for c in frame.columns) + r" \\",
        r"\midrule",
        *(" & ".join(_latex_cell(v, digits) for v in row) + r" \\" for row in frame.itertuples(index=False)),
        r"\bottomrule",
        *(note if caution else []),
        r"\end{tabular}",
    ]
    if caption is not None or label is not None:
        extra = ([rf"\caption{{{_latex_text(caption)}}}"] if caption is not None else []) + (
            [rf"\label{{{label}}}"] if label is not None else []
        )
        lines = [r"\begin{table}[htbp]", r"\centering", *lines, *extra, r"\end{table}"]
    head = f"% Caution: {CAUTION}\n" if caution else ""
    text = head + "\n".join(lines) + "\n"
    if path is not None:
        write_file(path_of(path, what="to_latex"), text, what="to_latex")
    return text
