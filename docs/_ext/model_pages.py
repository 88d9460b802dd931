"""Load-model pages, generated from the model objects of :mod:`ilkit.loads`.

Every function of ``ilkit.loads.__all__`` defined in ``ilkit.loads.models`` that returns a
:class:`~ilkit.loads.LoadModel` when called with its defaults gets a page: its definition and
sources as the calculation sheets print them (``model_blocks``), what was recalled from memory,
its parameters, the functions that build its parts, and the worst placement on an example span
drawn by ilkit when the site is built.  Functions that return a part of a model (a vehicle, a
lane load) are described on the page of the model that uses the part; the others (factors) on the
index page.
"""

from __future__ import annotations

import inspect
import io
import re
from pathlib import Path
from typing import Any


def _slug(text: str) -> str:
    return re.sub(r"[^a-z0-9]+", "-", text.lower()).strip("-")


def _catalogue() -> tuple[list[tuple[str, Any, Any]], dict[str, list[str]], list[str]]:
    """``(models, parts by name, other functions)``: models as ``(function name, function, model)``."""
    from ilkit import loads
    from ilkit.loads.combination import LoadModel

    models, parts, others = [], {}, []
    for name in loads.__all__:
        fn = getattr(loads, name)
        if not inspect.isfunction(fn) or fn.__module__ != "ilkit.loads.models":
            if not callable(fn):
                others.append(name)
            continue
        try:
            made = fn()
        except TypeError:  # needs an argument: a factor such as phi2(length)
            others.append(name)
            continue
        if isinstance(made, LoadModel):
            models.append((name, fn, made))
        elif hasattr(made, "name"):
            parts.setdefault(made.name, []).append(name)
        else:  # pragma: no cover - a function returning a number with defaults
            others.append(name)
    return models, parts, others


def _example(model: Any) -> tuple[bytes, str]:
    """The worst placement for the midspan moment of a simple span, drawn by ilkit (SVG)."""
    import matplotlib

    matplotlib.use("Agg")
    import matplotlib.pyplot as plt

    import ilkit
    from ilkit import loads, views

    length = 100 if model.units.name == "kip-ft" else 30
    beam = ilkit.Beam(length, {0: "pin", length: "roller"}, units=model.units.name)
    worst = loads.place(beam.moment(length / 2), model, "max", beam=beam)
    fig, ax = plt.subplots(figsize=(7.5, 3.4))
    views.plot_placement(worst, ax=ax)
    buffer = io.StringIO()
    with matplotlib.rc_context({"svg.hashsalt": "ilkit-docs", "svg.fonttype": "path"}):
        fig.savefig(buffer, format="svg", bbox_inches="tight", metadata={"Date": None})
    plt.close(fig)
    words = (
        f"The worst placement of {model.name} for the bending moment at midspan of a simple span of "
        f"{length} {model.units.length}, found by {{py:func}}`ilkit.loads.place` and drawn by "
        f"{{py:func}}`ilkit.views.plot_placement` when this site was built: "
        f"M = {worst.value:.1f} {worst.unit} (case: {worst.case})."
    )
    return buffer.getvalue().encode(), words


def _autofunction(name: str) -> str:
    return f"```{{eval-rst}}\n.. autofunction:: ilkit.loads.{name}\n   :no-index:\n```\n"


def _parameters(fn: Any) -> str:
    if not inspect.signature(fn).parameters:
        return "The model has no parameters.\n"
    return (
        "Every value recalled from memory is a parameter (keyword argument), so it can be set to the value "
        "of the licensed current edition; the defaults are the values above.\n"
    )


def model_page(name: str, fn: Any, model: Any, parts: dict[str, list[str]], figure: str, words: str) -> str:
    from ilkit.views._doc import to_markdown
    from ilkit.views.moving_records import model_blocks

    used = {p.name for c in model.cases for p in c.parts}
    builders = [f for part in sorted(used) for f in parts.get(part, []) if f != name]
    lines = [
        f"# {model.name}\n",
        f"Built by {{py:func}}`ilkit.loads.{name}`; source: {model.source or 'not recorded'}.\n",
        "## Definition\n",
        "The definition below is generated from the model object, exactly as a calculation sheet "
        "prints it.\n",
        to_markdown(model_blocks(model)),
        "\n## Parameters\n",
        _parameters(fn),
        _autofunction(name),
    ]
    if builders:
        lines += ["\n## Parts\n", "The parts of the model are built by these functions:\n"]
        lines += [_autofunction(b) for b in dict.fromkeys(builders)]
    lines += [
        "\n## Example\n",
        f"```{{figure}} {figure}\n:alt: worst placement of {model.name}\n:width: 100%\n\n{words}\n```\n",
    ]
    return "\n".join(lines)


def index_page(models: list[tuple[str, Any, Any]], others: list[str], parts: dict[str, list[str]]) -> str:
    used = {p.name for _, _, m in models for c in m.cases for p in c.parts}
    loose = [f for part, fns in parts.items() if part not in used for f in fns]
    rows = ["| model | function | source |", "|:--|:--|:--|"]
    for name, _, model in models:
        rows.append(f"| [{model.name}]({_slug(name)}.md) | {{py:func}}`ilkit.loads.{name}` | {model.source} |")
    lines = [
        "# Load models\n",
        "The published load models that ilkit ships, one page each, generated from the model objects "
        "when this site is built: the definition and the clauses, the values recalled from memory "
        "(check each against the standard), the parameters (every recalled value can be overridden) "
        "and an example placement drawn by ilkit.\n",
        ":::{caution}\nThe licensed current edition of each standard, its National Annex (Eurocodes) "
        "and the governing local code govern. Every result must be checked by a qualified engineer.\n:::\n",
        "\n".join(rows) + "\n",
        "```{toctree}\n:hidden:\n\n" + "\n".join(_slug(n) for n, _, _ in models) + "\n```\n",
    ]
    if others or loose:
        lines.append("## Factors and other parts\n")
        lines += [_autofunction(f) for f in loose + [o for o in others if o != "ALPHA_VALUES"]]
        if "ALPHA_VALUES" in others:
            lines.append(
                "{py:data}`ilkit.loads.ALPHA_VALUES`: the values of α allowed by {py:func}`ilkit.loads.lm71`.\n"
            )
    return "\n".join(lines)


def pages(folder: Path) -> dict[str, bytes | str]:
    """File name (relative to ``folder``) -> content of every load-model page and figure."""
    models, parts, others = _catalogue()
    out: dict[str, bytes | str] = {"index.md": index_page(models, others, parts)}
    for name, fn, model in models:
        svg, words = _example(model)
        out[f"figures/{_slug(name)}.svg"] = svg
        out[f"{_slug(name)}.md"] = model_page(name, fn, model, parts, f"figures/{_slug(name)}.svg", words)
    return out
