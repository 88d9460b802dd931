"""The demo study: run the example notebooks headless and write results a person can open.

``python -m ilkit.demo --out out/demo`` executes every notebook in
``notebooks/`` (scenarios of our own), and writes to the output folder:

* ``<name>.ipynb``: the executed notebook;
* ``<name>.html``: the same rendered as a page (figures included, no kernel needed);
* ``figures/<name>-<k>.png``: every figure;
* ``_static/mathjax/``: the MathJax that typesets the pages' formulas;
* ``inventory_run.html``, ``inventory_run_summary.csv``, ``inventory_run/``: a generated inventory of a few hundred
  girders of our own run under HL-93 and two limit states (:mod:`ilkit.batch`); ``inventory_rating.html``,
  ``inventory_rating_summary.csv``, ``inventory_rating/``: the load rating of its girders with resistances;
* calculation sheets (``girder``, ``highway_girder``, ``through_truss``, ``composite_girder``) and the rating
  sheet (``rating_sheet``) as ``.html`` and ``.md`` (the rating sheet also ``.pdf`` where WeasyPrint is
  installed);
* ``index.html``: a page linking all of the above, with the engineering caution.

Every page renders offline (a calculation package is archived and read on
machines without internet): the pages load nothing from the network.

Needs the ``notebook`` extra (nbclient, nbconvert, matplotlib, MathJax).
"""

from __future__ import annotations

import argparse
import base64
import html
import os
import sys
import uuid
from pathlib import Path
from typing import Any


def _notebooks_folder() -> Path:
    here = Path(__file__).resolve().parent.parent / "notebooks"
    if not here.is_dir():
        raise SystemExit(f"no notebooks folder at {here}; run the demo from a checkout of ilkit")
    return here


def _missing(err: ImportError) -> Exception:
    from ilkit.errors import MissingDependencyError

    return MissingDependencyError(
        f"the demo needs the notebook extra ({err.name} is missing); run: pip install 'ilkit[notebook]'"
    )


def run(out: Path, notebooks: Path | None = None, girders: int = 0) -> Path:
    """Execute the notebooks and write the rendered results to ``out``; with ``girders``, also run a generated
    inventory of that many girders (:func:`ilkit.views.inventory.write_inventory_demo`); return the index
    page."""
    try:
        import nbformat
    except ImportError as err:  # pragma: no cover - exercised without the extra only
        raise _missing(err) from err

    from ilkit._files import make_folder, write_file, write_files
    from ilkit.views.caution import CAUTION

    source = notebooks or _notebooks_folder()
    make_folder(out, "demo")  # the notebooks run in it
    figures = out / "figures"
    mathjax_url = copy_mathjax(out)
    entries = []
    for path in sorted(source.glob("*.ipynb")):
        print(f"running {path.name} ...", flush=True)
        nb = nbformat.read(path, as_version=4)
        execute(nb, cwd=out)
        title = _title(nb, path.stem)
        nb.metadata["title"] = title  # the page's title in the browser (nbconvert writes "Notebook" without it)
        body, _ = _page_exporter(mathjax_url).from_notebook_node(nb, resources={"metadata": {"name": path.stem}})
        files: dict[Path, str | bytes] = {
            out / path.name: nbformat.writes(nb) + "\n",
            out / f"{path.stem}.html": body,
        }
        count = 0
        for cell in nb.cells:
            for output in cell.get("outputs", []):
                data = output.get("data", {})
                if "image/png" in data:
                    count += 1
                    files[figures / f"{path.stem}-{count}.png"] = base64.b64decode(data["image/png"])
        write_files(files, what="demo")  # the notebook, its page and its figures together, or none
        entries.append((path.stem, title, count))
    for extra in _extra_outputs(out):
        entries.append(extra)
    if girders:
        from ilkit.views.inventory import write_inventory_demo

        print(f"running an inventory of {girders} girders ...", flush=True)
        page = write_inventory_demo(out, girders)
        entries.append((page.name, f"Inventory run: {girders} generated girders under HL-93, Strength I and "
                                   "Service II (summary table and histograms), and the load rating of its girders "
                                   "with resistances", 0))
    index = out / "index.html"
    items = "\n".join(
        f'<li><a href="{html.escape(href)}">{html.escape(title)}</a>'
        + (f" ({n} figure{'s' if n != 1 else ''} in figures/)" if n else "")
        + "</li>"
        for href, title, n in (
            (e[0] if e[0].endswith((".html", ".md")) else f"{e[0]}.html", e[1], e[2]) for e in entries
        )
    )
    write_file(
        index,
        "<!doctype html><html><head><meta charset='utf-8'><title>ilkit demo study</title></head>"
        "<body style='font-family: sans-serif; max-width: 50em; margin: 2em auto'>"
        "<h1>ilkit demo study</h1>"
        f"<p><strong>Caution.</strong> {html.escape(CAUTION)}</p>"
        f"<ul>{items}</ul></body></html>",
        what="demo",
    )
    return index


def _title(nb: Any, fallback: str) -> str:
    """The notebook's title: the text of its first Markdown heading."""
    for cell in nb.cells:
        if cell.cell_type == "markdown":
            for text in cell.source.splitlines():
                if text.startswith("#"):
                    return text.lstrip("# ").strip()
    return fallback


def execute(nb: Any, cwd: Path, timeout: float = 900) -> Any:
    """Run every cell of the notebook ``nb`` (in place) in a kernel of this Python started in ``cwd``;
    the kernel is shut down afterwards.  Returns ``nb``."""
    try:
        from nbclient import NotebookClient
    except ImportError as err:  # pragma: no cover - exercised without the extra only
        raise _missing(err) from err
    client = NotebookClient(nb, timeout=timeout, km=kernel_manager(), resources={"metadata": {"path": str(cwd)}})
    # the client does not own a manager it is given: ask it to shut the kernel down all the same
    return client.execute(cleanup_kc=True)


def kernel_manager() -> Any:
    """A Jupyter kernel manager for this very Python, talking over local sockets.

    The kernel runs ``sys.executable`` (the interpreter that has ilkit), whatever
    kernelspecs named "python3" the machine's Jupyter folders hold; on Unix its
    channels are domain sockets in the Jupyter runtime folder, so the kernel has
    no unencrypted TCP to warn about (on Windows: TCP, encrypted where the kernel
    can).  Used by the demo runner, and by the tests that start kernels.
    """
    from ipykernel.kernelspec import get_kernel_dict
    from jupyter_client import KernelManager
    from jupyter_client.kernelspec import KernelSpec, KernelSpecManager
    from jupyter_core.paths import jupyter_runtime_dir

    class ThisPython(KernelSpecManager):  # type: ignore[misc]
        def get_kernel_spec(self, kernel_name: str) -> KernelSpec:
            return KernelSpec(resource_dir="", **get_kernel_dict())

    manager = KernelManager(kernel_name="python3", kernel_spec_manager=ThisPython())
    if os.name == "posix":
        runtime = Path(jupyter_runtime_dir())
        runtime.mkdir(parents=True, exist_ok=True)
        manager.transport = "ipc"
        manager.ip = str(runtime / f"ilkit-kernel-{uuid.uuid4().hex[:12]}")
    elif manager.has_trait("transport_encryption"):
        manager.transport_encryption = "auto"
    return manager


MATHJAX = "_static/mathjax"


def copy_mathjax(out: Path) -> str:
    """Copy MathJax 3 (one file, SVG output: no fonts to fetch) into ``out/_static/mathjax``; its URL relative
    to ``out``.  Used by the demo's pages and the documentation site."""
    try:
        import mathjax  # the django-static-mathjax distribution: MathJax's files, no Django needed
    except ImportError as err:  # pragma: no cover - exercised without the extra only
        raise _missing(err) from err
    source = Path(mathjax.__file__).parent / "static" / "mathjax"
    target = out / MATHJAX
    from ilkit._files import write_files

    write_files({target / Path(name).name: (source / name).read_bytes() for name in ("es5/tex-svg-full.js", "LICENSE")},
                what="demo")
    return f"{MATHJAX}/tex-svg-full.js"


# The page template: JupyterLab's look, and nothing loaded from the network.  MathJax
# comes from beside the page; require.js, the widget manager and mermaid are left out
# (a page without a kernel shows stills and text instead of widgets).
PAGE_TEMPLATE = """{%- extends 'index.html.j2' -%}
{%- block html_head_js_requirejs -%}{%- endblock html_head_js_requirejs -%}
{% block jupyter_widgets %}{% endblock jupyter_widgets %}
{%- block html_head_js_mermaidjs -%}{%- endblock html_head_js_mermaidjs -%}
{%- block html_head_js_mathjax -%}
<script>
window.MathJax = {
  tex: {inlineMath: [['$', '$']], displayMath: [['$$', '$$']], processEscapes: true},
  svg: {fontCache: 'global'},
  options: {enableMenu: false}
};
</script>
<script defer src="{{ resources.mathjax_url }}"></script>
{%- endblock html_head_js_mathjax -%}
"""


def _page_exporter(mathjax_url: str) -> Any:
    """The HTML exporter for pages read without a kernel and without a network.

    A widget cannot be driven from such a page, so where an output carries a
    still image besides its widget view (the influence-line explorer, ipympl
    figures) the page shows the image, and a widget without a still shows its
    text.  Formulas are typeset by the MathJax copied beside the page.
    """
    from jinja2 import DictLoader
    from nbconvert import HTMLExporter
    from traitlets.config import Config

    widget = "application/vnd.jupyter.widget-view+json"
    config = Config()
    config.NbConvertBase.display_data_priority = [
        m for m in HTMLExporter().default_config.NbConvertBase.display_data_priority if m != widget
    ]
    config.HTMLExporter.mathjax_url = mathjax_url
    return HTMLExporter(
        config=config, template_name="lab", template_file="ilkit_page.html.j2",
        extra_loaders=[DictLoader({"ilkit_page.html.j2": PAGE_TEMPLATE})],
    )


def _extra_outputs(out: Path) -> list[tuple[str, str, int]]:
    """Further demo outputs written by the views layer: calculation sheets of two notebook girders, of the
    notebook's through truss and of the design notebook's composite girder, and the rating sheet of the rated
    girder."""
    from ilkit.views.demo import write_demo_sheet, write_highway_sheet, write_rating_demo_sheet, write_truss_sheet
    from ilkit.views.demo_girder import write_composite_girder_sheet

    entries = []
    for write, title in (
        (write_demo_sheet, "Calculation sheet of the suspended-span girder"),
        (write_highway_sheet, "Calculation sheet of the continuous highway girder under HL-93 (placements, "
                              "envelope)"),
        (write_truss_sheet, "Calculation sheet of the Pratt through truss under HL-93 (member forces)"),
        (write_composite_girder_sheet, "Calculation sheet of the three-span composite steel girder (distribution, "
                                       "factored envelopes of an interior and an exterior girder)"),
        (write_rating_demo_sheet, "Rating sheet of the three-span steel girder with a corroded span (design, "
                                  "legal, emergency and permit loads)"),
    ):
        sheet = write(out)
        pdf = getattr(sheet, "pdf", None)
        print(f"wrote {sheet.html.name} and {sheet.markdown.name}{f' and {pdf.name}' if pdf else ''} ...",
              flush=True)
        also = f", PDF: {pdf.name}" if pdf else ""
        entries.append((sheet.html.name, f"{title} (Markdown version: {sheet.markdown.name}{also})", 0))
    return entries


def main(argv: list[str] | None = None) -> int:
    parser = argparse.ArgumentParser(prog="python -m ilkit.demo", description=__doc__.splitlines()[0])
    parser.add_argument("--out", type=Path, default=Path("out/demo"), help="output folder (default out/demo)")
    parser.add_argument("--notebooks", type=Path, default=None,
                        help="folder of the notebooks to run (default: notebooks/ of this checkout)")
    parser.add_argument("--girders", type=int, default=300,
                        help="girders of the generated inventory run (default 300; 0 leaves it out)")
    args = parser.parse_args(argv)
    index = run(args.out, notebooks=args.notebooks, girders=args.girders)
    print(f"\nDemo study written to {args.out.resolve()}")
    print(f"Open {index.resolve()} in a browser.")
    return 0


if __name__ == "__main__":
    sys.exit(main())
