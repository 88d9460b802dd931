"""Calculation sheets: one call writes the record of a study as HTML and Markdown.

``write_calculation_sheet(beam, path, lines=...)`` writes

* ``<path>.html``: one self-contained page (figures inline as SVG, formulas as
  MathML; no scripts, no network), for reading, printing and filing;
* ``<path>.md``: the same in Markdown with LaTeX formulas, its figures as SVG
  files in the folder ``<path>_figures/`` beside it.

The sheet holds: a title block (project, structure, girder, prepared by,
checked by, date, revision; :class:`TitleBlock`) and, in print, the page
number with the title at the foot of every page; the caution that results
must be checked by a qualified engineer under the governing codes; the
inputs (beam summary and diagram, units, sign conventions); for every
influence line its Müller-Breslau sketch, key ordinates, ordinate table and
derivation; the method and its sources.

Results from other parts of ilkit (placements, envelopes) join the sheet
through ``results=``: each type adds its section with
``report_section.register(TheirType)``, a function returning document blocks.
"""

from __future__ import annotations

import html
from collections.abc import Iterable, Mapping, Sequence
from dataclasses import dataclass, replace
from functools import singledispatch
from pathlib import Path

from ilkit._files import write_files
from ilkit.errors import BeamInputError, UnsupportedResultError
from ilkit.influence import InfluenceLine
from ilkit.loads.combination import LoadModel
from ilkit.loads.envelope import Envelope
from ilkit.loads.results import Extremes
from ilkit.model import Beam
from ilkit.quantity import KINDS
from ilkit.stiffness import UnitShape
from ilkit.trusses.envelope import MemberEnvelope
from ilkit.trusses.model import Truss
from ilkit.views import _doc, style
from ilkit.views._doc import Block, Callout, Figure, Heading, Para, Table
from ilkit.views.caution import CAUTION
from ilkit.views.derive import SIGN_CONVENTIONS, derivation, quantity_title
from ilkit.views.display import beam_figure, line_facts, line_figure
from ilkit.views.numbers import clean, effect_scale, short
from ilkit.views.tables import beam_facts, ordinate_table

__all__ = [
    "CAUTION", "CalculationSheet", "TitleBlock", "TITLE_FIELDS", "write_calculation_sheet", "sheet_blocks",
    "report_section", "default_lines",
]

_METHODS = {
    "Mechanism": "Statically determinate beams: the Müller-Breslau principle (virtual work on the beam with the "
    "restraint of the quantity removed); the conditions of the rigid parts are solved in exact rational "
    "arithmetic, so the lines are exact and straight between breakpoints.",
    "UnitShape": "Indeterminate beams, springs, deflections and rotations: the stiffness method with prismatic "
    "beam elements; the line is the deflected shape under the unit action conjugate to the quantity "
    "(Müller-Breslau, Maxwell), cubic and exact between the nodes for the nodal displacements found.",
    "FloorLine": "Girders loaded through a floor system: the stringers span simply between the floor beams, so a "
    "load reaches the girder at the two floor beams beside it in the ratio of the stringer's reactions; every line "
    "is the girder's own line at the floor beams and straight between them.",
    "TrussLine": "Trusses: a unit load on each floor beam (panel point) in turn; statically determinate trusses by "
    "the equilibrium of every joint, solved in exact rational arithmetic (member force = force density times "
    "length), indeterminate ones by the stiffness method with the members' EA. Between panel points the lines are "
    "straight (stringers simply supported on the floor beams). The Müller-Breslau sketch shows the truss moved by "
    "a unit shortening of the member: the deck's upward movement is the influence line (Betti).",
    "ForceMethod": "Derivations of the lines of statically indeterminate beams: the force (flexibility) method on a "
    "determinate primary structure (redundants, flexibility coefficients from the primary structure's "
    "deflection lines by Maxwell's theorem, compatibility); its ordinates are set beside the stiffness "
    "method's, an independent check.",
}


@dataclass(frozen=True)
class CalculationSheet:
    """Paths of a written calculation sheet."""

    html: Path
    markdown: Path
    figures: Path


@dataclass(frozen=True)
class TitleBlock:
    """The title block of a calculation sheet, at its head as on a drawing.

    Every field is text; a field left empty is printed as an empty box, to
    be filled in by hand (a date, a checker's initials).  The printed sheet
    repeats the title, the project and the revision at the foot of every
    page, with the page number (``page 3 of 12``).
    """

    project: str = ""
    structure: str = ""
    girder: str = ""
    prepared_by: str = ""
    checked_by: str = ""
    date: str = ""
    revision: str = ""

    def __post_init__(self) -> None:
        for name in TITLE_FIELDS:
            value = getattr(self, name.replace(" ", "_"))
            if not isinstance(value, str):
                raise BeamInputError(
                    f"TitleBlock: {name} must be text, got {type(value).__name__} {value!r:.60}; e.g. "
                    f"TitleBlock({name.replace(' ', '_')}='...').",
                    field=name,
                    value=value,
                )

    @classmethod
    def of(cls, value: TitleBlock | Mapping[str, str] | None) -> TitleBlock:
        """``value`` as a title block: a :class:`TitleBlock`, a mapping with the fields as keys
        (``{"project": ..., "prepared by": ...}``), or ``None`` (every field blank)."""
        if value is None:
            return cls()
        if isinstance(value, TitleBlock):
            return value
        if not isinstance(value, Mapping):
            raise BeamInputError(
                f"write_calculation_sheet: title_block must be a TitleBlock or a mapping of its fields, got "
                f"{type(value).__name__} {value!r:.60}.",
                field="title_block",
                value=value,
            )
        fields = {}
        for key, text in value.items():
            name = str(key).strip().lower().replace("_", " ")
            if name not in TITLE_FIELDS:
                raise BeamInputError(
                    f"write_calculation_sheet: title_block has no field {key!r}; the fields are "
                    f"{', '.join(repr(f) for f in TITLE_FIELDS)} (other header lines go in info=).",
                    field="title_block",
                    value=key,
                )
            fields[name.replace(" ", "_")] = text
        return cls(**fields)

    def blocks(self, title: str) -> list[Block]:
        """The title block as document blocks: a boxed table of the fields and the title."""
        rows = (
            ("project", self.project, "revision", self.revision),
            ("structure", self.structure, "date", self.date),
            ("girder", self.girder, "prepared by", self.prepared_by),
            ("calculation", title, "checked by", self.checked_by),
        )
        return [Table(("", "", "", ""), rows, "llll", "title-block")]

    def footer(self, title: str) -> str:
        """The words at the foot of every printed page (the page number follows them)."""
        return " · ".join(t for t in (title, self.project, f"revision {self.revision}" if self.revision else "") if t)


TITLE_FIELDS = ("project", "structure", "girder", "prepared by", "checked by", "date", "revision")
"""The fields of a :class:`TitleBlock`, as they are printed."""


def default_lines(beam: Beam | Truss) -> list[InfluenceLine]:
    """The lines a sheet shows when none are given.

    A beam: the vertical reaction of every support, the moment reaction of
    every fixed support, and the bending moment at the middle of every span.
    A truss: the reaction of every support and, for each role of member
    (top chord, diagonal ...), the member with the largest ordinate.
    """
    if isinstance(beam, Truss):
        found = [beam.reaction(j) for j in beam.supports]
        best: dict[str, InfluenceLine] = {}
        for name, line in beam.member_forces().items():
            role = beam.roles[name]
            size = max(abs(line.maximum.value), abs(line.minimum.value))
            if role not in best or size > max(abs(best[role].maximum.value), abs(best[role].minimum.value)):
                best[role] = line
        return found + list(best.values())
    lines = [beam.reaction(s.at) for s in beam.supports]
    lines += [beam.moment_reaction(s.at) for s in beam.supports if s.restrains_rotation]
    lines += [beam.moment((a + b) / 2) for a, b in beam.spans]
    return lines


@singledispatch
def report_section(obj: object, number: str) -> list[Block]:
    """The blocks of one result's section of a sheet; extend with ``.register``."""
    raise UnsupportedResultError(
        f"write_calculation_sheet: no sheet section for {type(obj).__name__}; give influence lines "
        "(beam.reaction(x), beam.moment(x) ...) in lines=."
    )


@report_section.register(InfluenceLine)
def _(line: InfluenceLine, number: str) -> list[Block]:
    derived = derivation(line)  # raises NoDerivationError for lines it cannot explain
    fig = line_figure(line)
    steps = [replace(b, level=b.level + 2) if isinstance(b, Heading) else b for b in derived.blocks[1:]]
    return [
        Heading(f"{number} {derived.title}", 3),
        Figure(style.figure_svg(fig), f"{number}: the structure displaced by the unit action (Müller-Breslau sketch)",
               f"line-{number.replace('.', '-')}"),
        Table(("key values", ""), tuple(line_facts(line))),
        Para(("Ordinates at the breakpoints (both sides where the line jumps):",)),
        ordinate_table(line),
        Heading("Derivation", 4),
        *steps,
    ]


def sheet_blocks(
    beam: Beam | Truss,
    lines: Sequence[InfluenceLine] | None = None,
    results: Iterable[object] = (),
    *,
    load: object = None,
    divisions: int = 10,
    title: str = "Influence-line calculation sheet",
    info: Mapping[str, str] | None = None,
    title_block: TitleBlock | Mapping[str, str] | None = None,
) -> list[Block]:
    """The sheet as document blocks (what :func:`write_calculation_sheet` renders)."""
    import ilkit
    from ilkit._check import listed
    from ilkit.views._args import expect

    expect(beam, (Beam, Truss), what="write_calculation_sheet: beam", hint="give an ilkit.Beam or a truss")
    if lines is None:
        chosen = default_lines(beam)
    else:
        chosen = listed(lines, wanted="write_calculation_sheet: lines: give a list of influence lines", field="lines")
        for line in chosen:
            expect(line, InfluenceLine, what="write_calculation_sheet: lines", hint="give influence lines")
    results = listed(results, wanted="write_calculation_sheet: results: give a list of results, e.g. [found]",
                     field="results", ordered=False)
    _same_beam(beam, chosen, "lines")
    _same_beam(beam, results, "results")
    if info is not None and not isinstance(info, Mapping):
        raise BeamInputError(
            "write_calculation_sheet: info must be a mapping of header fields, e.g. {'project': 'Bridge 12'}; "
            f"got {info!r:.60}.",
            field="info",
            value=info,
        )
    from ilkit.views.moving_records import placement_blocks

    moving = _moving_load(beam, chosen, load, divisions)  # computed before anything is drawn: bad input fails fast
    block = TitleBlock.of(title_block)
    blocks: list[Block] = [Heading(title, 1), *block.blocks(title)]
    if info:
        blocks.append(Table(("", ""), tuple((str(k), str(v)) for k, v in info.items())))
    blocks += [Callout(CAUTION, "caution"), Heading("1. Inputs", 2), *_inputs(beam)]
    chapter = 2
    if moving is not None:
        blocks += [Heading(f"{chapter}. Load model", 2), *moving.model_section]
        chapter += 1
    blocks.append(Heading(f"{chapter}. Influence lines", 2))
    if not chosen:
        blocks.append(Para(("No influence lines were asked for.",)))
    for i, line in enumerate(chosen, start=1):
        blocks += report_section(line, f"{chapter}.{i}")
    chapter += 1
    if moving is not None:
        blocks += [
            Heading(f"{chapter}. Governing placements", 2),
            Para((f"For every influence line above, where the loads of {moving.model.name} must stand for the "
                  "largest and for the smallest value, and what each load contributes. Loads act downward; "
                  "values follow the sign conventions of the inputs. In short:",)),
            extremes_summary(moving.placements, f"{chapter}."),
        ]
        for i, found in enumerate(moving.placements, start=1):
            blocks += placement_blocks(found.maximum, f"{chapter}.{i}a", moving.model)
            blocks += placement_blocks(found.minimum, f"{chapter}.{i}b", moving.model)
        blocks += [Heading(f"{chapter + 1}. Envelope", 2), *report_section(moving.envelope, f"{chapter + 1}.1")]
        chapter += 2
    extra = results
    if extra:
        blocks.append(Heading(f"{chapter}. Further results", 2))
        for i, result in enumerate(extra, start=1):
            blocks += report_section(result, f"{chapter}.{i}")
        chapter += 1
    origins = {type(line.origin).__name__ for line in chosen}
    methods = [text for kind, text in _METHODS.items() if kind in origins]
    if any(isinstance(line.origin, UnitShape) and line.origin.beam is not None and line.origin.beam.degree > 0
           for line in chosen):
        methods.append(_METHODS["ForceMethod"])
    if moving is not None:
        methods.append(_PLACEMENT_METHOD)
        if moving.model.source:
            methods.append(f"Load model: {moving.model.name}, from {moving.model.source}.")
    blocks += [
        Heading(f"{chapter}. Method and sources", 2),
        *(Para((text,)) for text in methods),
        Para((f"Computed by ilkit {ilkit.__version__}. Figures and tables show the same values as the "
              "derivations; tables round them (four significant figures for ordinates, five for effects).",)),
        Callout(CAUTION, "caution"),
    ]
    return blocks


def _inputs(structure: Beam | Truss) -> list[Block]:
    """The inputs section: the structure's facts, its drawing and the sign conventions."""
    if isinstance(structure, Beam):
        return [
            Table(("item", "value"), tuple(beam_facts(structure))),
            Figure(style.figure_svg(beam_figure(structure)), "The beam: supports, releases and spans", "beam"),
            Para(("Sign conventions: x is the position of the travelling unit load from the left end of the beam; "
                  "the unit load acts downward. "
                  + " ".join(f"{KINDS[kind][1].capitalize()}: {words}." for kind, words in SIGN_CONVENTIONS.items()
                             if kind in KINDS),)),
        ]
    from ilkit.views.truss import truss_facts, truss_figure

    return [
        Table(("item", "value"), tuple(truss_facts(structure))),
        Figure(style.figure_svg(truss_figure(structure)), "The truss: joints, members, supports and the deck",
               "truss"),
        Table(("member", "from", "to", "role", "length"), tuple(
            (name, a, b, structure.roles[name], short(structure.member_length(name), 5))
            for name, (a, b) in structure.members.items()), "llllr"),
        Para(("Sign conventions: x is the position of the travelling unit load on the deck, from the left "
              "support along the loaded chord; the unit load acts downward and reaches the truss at the panel "
              f"points. Member force: {SIGN_CONVENTIONS['member_force']}. Vertical reaction: "
              f"{SIGN_CONVENTIONS['reaction']}.",)),
    ]


def _beam_of(result: object) -> Beam | Truss | None:
    """The beam or truss a result was computed on, where it says (lines, placements, extremes, envelopes)."""
    from ilkit.trusses.lines import TrussLine

    if isinstance(result, Envelope):
        return result.beam
    if isinstance(result, MemberEnvelope):
        return result.truss
    if isinstance(result, Extremes):
        result = result.maximum
    line = result if isinstance(result, InfluenceLine) else getattr(result, "line", None)
    if isinstance(line, InfluenceLine):
        if isinstance(line.origin, TrussLine):
            return line.origin.truss
        found = getattr(line.origin, "beam", None)
        return found if isinstance(found, Beam) else None
    return None


def _same_beam(beam: Beam | Truss, items: Sequence[object], field: str) -> None:
    """Refuse a result of another beam: a sheet about one beam must not show another's numbers."""
    for i, item in enumerate(items):
        other = _beam_of(item)
        if other is not None and other != beam:
            what = item.quantity.label if isinstance(item, InfluenceLine) else type(item).__name__
            raise BeamInputError(
                f"write_calculation_sheet: {field}[{i}] ({what}) belongs to another beam, {other!r}, not to the "
                f"beam of this sheet, {beam!r}; a sheet shows one beam. Take the {field} from this beam "
                "(e.g. beam.moment(x)), or write a sheet for the other one.",
                field=field,
                value=item,
            )


_PLACEMENT_METHOD = (
    "Moving loads: every axle train is tried in both directions of travel; axles off the beam count nothing; "
    "a uniform load that may be broken covers exactly the parts of the line of the wanted sign; the placements "
    "with an axle at a breakpoint are enumerated and, on curved lines, the stationary points of the effect "
    "between breakpoints are found in closed form, so the extreme is exact to rounding. The envelope takes the "
    "extremes at the sections listed and refines the absolute maximum moment between them."
)


def extremes_summary(found: Sequence[Extremes], prefix: str = "") -> Table:
    """One row per quantity: the largest and the smallest (most negative) value with their governing cases
    (core values, five significant figures; an extreme of zero names no case) and, first, the paragraph of
    the sheet that shows each placement."""
    from ilkit.views.moving_records import NO_CASE

    rows = []
    for i, both in enumerate(found, start=1):
        hi, lo = both.maximum, both.minimum
        units = hi.line.units if hi.line is not None else None
        what = quantity_title(hi.quantity, units.length if units else "")
        cells: list[str] = [f"{prefix}{i}", what]
        for extreme in (hi, lo):
            value = clean(extreme.value, effect_scale(extreme))
            cells += [f"{short(value, 5)} {extreme.unit}", extreme.case if value else NO_CASE]
        rows.append(tuple(cells))
    header = ("see", "quantity", "largest", "governing case", "smallest (most negative)", "governing case")
    return Table(header, tuple(rows), "llrlrl")


@dataclass(frozen=True)
class _MovingLoad:
    """The moving-load part of a sheet: the model's section, the governing placements, the envelope."""

    model: LoadModel
    model_section: list[Block]
    placements: list[Extremes]
    envelope: Envelope | MemberEnvelope


def _moving_load(
    beam: Beam | Truss, lines: Sequence[InfluenceLine], load: object, divisions: int
) -> _MovingLoad | None:
    if load is None:
        return None
    from ilkit.loads import envelope, extremes
    from ilkit.loads.combination import as_model
    from ilkit.trusses.envelope import _supports_beam, member_envelope
    from ilkit.views.moving_records import model_blocks

    model = as_model(load)  # type: ignore[arg-type]
    if isinstance(beam, Beam):
        placements = [extremes(line, model, beam=beam) for line in lines if line.quantity.kind not in _NOT_FORCES]
        found: Envelope | MemberEnvelope = envelope(beam, model, divisions=divisions)
    else:
        supports = _supports_beam(beam)
        placements = [extremes(line, model, beam=supports) for line in lines]
        found = member_envelope(beam, model)
    return _MovingLoad(model, model_blocks(model, beam.units), placements, found)


_NOT_FORCES = ("deflection", "rotation")
"""Quantities whose line is not a force effect per unit load (a deflection under a design load model is a
serviceability check with its own load rules; the sheet does not place models on them)."""


_CSS = """
body { margin: 0; background: #f3f1ec; color: #1c1c1c; }
main.sheet { max-width: 52rem; margin: 1.5rem auto; padding: 2rem 2.5rem; background: white;
  font: 15px/1.5 Georgia, 'DejaVu Serif', serif; box-shadow: 0 0 0 1px #d8d4ca; }
h1 { font-size: 1.6rem; border-bottom: 3px double #1c1c1c; padding-bottom: .3rem; }
h2 { font-size: 1.25rem; border-bottom: 1px solid #1c1c1c; margin-top: 2rem; }
h3 { font-size: 1.1rem; margin-top: 1.8rem; }
h4, h5 { font-size: 1rem; margin-bottom: .3rem; }
table { border-collapse: collapse; margin: .6rem 0; font: 13px/1.4 'DejaVu Sans', sans-serif; }
th, td { padding: .15rem .7rem; border-bottom: 1px solid #cfcac0; vertical-align: top; }
td[style*="right"], th[style*="right"] { white-space: nowrap; }
tbody th, td:first-child { min-width: 6rem; }
thead th { border-bottom: 1.5px solid #1c1c1c; }
figure { margin: 1rem 0; } figure img { width: 100%; }
figcaption { font-size: 13px; font-style: italic; }
aside.caution { border-left: 5px solid #1c1c1c; background: #f3f1ec; padding: .6rem 1rem; margin: 1rem 0; }
math { font-family: 'STIX Two Math', 'Cambria Math', 'Latin Modern Math', 'DejaVu Math TeX Gyre', math;
  font-size: 1.05em; }
math[display="block"] { margin: .6rem 0; }
mtable.cases mtd { text-align: left; }
table.title-block { width: 100%; border: 1.5px solid #1c1c1c; margin: .4rem 0 1rem; }
table.title-block td { border: 1px solid #1c1c1c; height: 1.4rem; }
table.title-block td:nth-child(odd) { width: 7rem; min-width: 0; color: #5a5a5a; font-size: 11px;
  text-transform: uppercase; letter-spacing: .04em; }
@media print { body { background: white; } main.sheet { box-shadow: none; margin: 0; max-width: none;
  padding: 0; } h3 { break-before: page; } figure, table { break-inside: avoid; } }
@page { size: A4; margin: 16mm 14mm 18mm 14mm;
  @bottom-right { content: "page " counter(page) " of " counter(pages); font: 9px 'DejaVu Sans', sans-serif; }
  @bottom-left { content: var(--footer); font: 9px 'DejaVu Sans', sans-serif; } }
"""


def _css_text(text: str) -> str:
    """``text`` as a CSS string (quotes, backslashes and ``<`` escaped; one line)."""
    escaped = "".join(f"\\{ord(c):x} " if c in '"\\<>' or ord(c) < 32 else c for c in text)
    return f'"{escaped}"'


def _page(title: str, body: str, footer: str = "") -> str:
    page_css = _CSS.replace("var(--footer)", _css_text(footer or title))
    return (
        '<!DOCTYPE html>\n<html lang="en">\n<head>\n<meta charset="utf-8">\n'
        f"<title>{html.escape(title)}</title>\n<style>{page_css}</style>\n</head>\n"
        f'<body>\n<main class="sheet">\n{body}\n</main>\n</body>\n</html>\n'
    )


def _stem(path: str | Path) -> Path:
    from ilkit.views._args import path_of

    path = path_of(path, what="write_calculation_sheet")
    if path.suffix.lower() in (".html", ".md"):
        return path.with_suffix("")
    if path.suffix:
        raise BeamInputError(
            f"write_calculation_sheet: the path {str(path)!r} ends in {path.suffix!r}; give a path ending in "
            "'.html' or '.md', or no suffix: both files are written.",
            field="path",
            value=str(path),
        )
    return path


def write_calculation_sheet(
    beam: Beam | Truss,
    path: str | Path,
    *,
    lines: Sequence[InfluenceLine] | None = None,
    load: object = None,
    divisions: int = 10,
    results: Iterable[object] = (),
    title: str = "Influence-line calculation sheet",
    info: Mapping[str, str] | None = None,
    title_block: TitleBlock | Mapping[str, str] | None = None,
) -> CalculationSheet:
    """Write the calculation sheet of ``beam`` as HTML and Markdown; returns the paths.

    Parameters
    ----------
    beam:
        The beam studied, or a truss (:class:`ilkit.trusses.Truss`): its
        inputs are then the truss drawing and its members, its lines member
        forces and reactions, and its envelope the member envelope
        (:func:`ilkit.trusses.member_envelope`: the largest tension and
        compression of every member).
    path:
        Where to write: ``"out/girder"``, ``"out/girder.html"`` or
        ``"out/girder.md"`` all write ``out/girder.html``, ``out/girder.md``
        and the folder ``out/girder_figures/``.  Missing folders are created.
        The files are written all or none: everything is rendered first,
        then written to temporary files and renamed, so a failure leaves
        an earlier sheet at the same path whole (never new HTML beside old
        Markdown); file-system faults raise :class:`ilkit.WriteError`.
    lines:
        Influence lines to show, each with sketch, ordinates and derivation;
        default :func:`default_lines`.  A line whose derivation cannot be
        written raises :class:`ilkit.NoDerivationError`.
    load:
        A moving load: a published model (``ilkit.loads.hl93()``,
        ``ilkit.loads.lm1()`` ...), a :class:`~ilkit.LoadModel`, a
        :class:`~ilkit.Combination` or a single load.  The sheet then also
        holds the load model (its definition, its source, edition and the
        values recalled from memory), the governing placements of the load
        for the largest and the smallest value of every line (a plot and a
        table each; deflection and rotation lines excepted), and the envelope
        of the load along the beam (moment, shear and reaction tables and
        plots, the absolute maximum moment with its placement).  The beam
        must declare its units.
    divisions:
        Sections of the envelope: equal parts per span and overhang.
    results:
        Further results with a registered :func:`report_section`.
    title:
        The sheet's title.
    title_block:
        The title block at the head of the sheet (:class:`TitleBlock`, or a
        mapping ``{"project": ..., "structure": ..., "girder": ...,
        "prepared by": ..., "checked by": ..., "date": ..., "revision": ...}``);
        fields not given are left as empty boxes to fill in by hand.  The
        printed sheet carries the title, project and revision and the page
        number (``page 3 of 12``) at the foot of every page.
    info:
        Further header lines, e.g. ``{"scenario": ..., "live load": ...}``.
    """
    stem = _stem(path)
    block = TitleBlock.of(title_block)
    blocks = sheet_blocks(beam, lines, results, load=load, divisions=divisions, title=title, info=info,
                          title_block=block)
    _, files, figures = sheet_files(stem, title, blocks, block)
    # all files or none: a failure never leaves new HTML beside old Markdown
    write_files(files, what="write_calculation_sheet")
    return CalculationSheet(stem.with_name(stem.name + ".html"), stem.with_name(stem.name + ".md"), figures)


def sheet_files(
    stem: Path, title: str, blocks: list[Block], block: TitleBlock
) -> tuple[str, dict[Path, str | bytes], Path]:
    """The files of a sheet at ``stem``: its HTML page, the page's Markdown twin and the Markdown's SVG
    figures in ``<stem>_figures/``; returns the page, the files by path (for :func:`write_files`) and the
    figures' folder."""
    figures = stem.parent / f"{stem.name}_figures"
    svgs: dict[Path, str | bytes] = {}

    def link(fig: Figure) -> str:
        target = figures / f"{fig.name}.svg"
        svgs[target] = fig.svg
        return f"{figures.name}/{target.name}"

    page = _page(title, _doc.to_html(blocks), block.footer(title))
    files: dict[Path, str | bytes] = {stem.with_name(stem.name + ".html"): page,
                                      stem.with_name(stem.name + ".md"): _doc.to_markdown(blocks, link), **svgs}
    return page, files, figures

