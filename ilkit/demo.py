"""The demo study: run the example notebooks headless and write results a person can open.

``python -m ilkit.demo --out out/demo`` executes every notebook in
``notebooks/`` (scenarios of our own), and writes to the output folder:

* ``<name>.ipynb``: the executed notebook;
* ``<name>.html``: the same rendered as a page (figures included, no kernel needed);
* ``figures/<name>-<k>.png``: every figure;
* ``index.html``: a page linking all of the above, with the engineering caution.

Needs the ``notebook`` extra (nbclient, nbconvert, matplotlib).
"""

from __future__ import annotations

import argparse
import base64
import html
import sys
from pathlib import Path
from typing import Any


def _notebooks_folder() -> Path:
    here = Path(__file__).resolve().parent.parent / "notebooks"
    if not here.is_dir():
        raise SystemExit(f"no notebooks folder at {here}; run the demo from a checkout of ilkit")
    return here


def run(out: Path, notebooks: Path | None = None) -> Path:
    """Execute the notebooks and write the rendered results to ``out``; return the index page."""
    try:
        import nbformat
        from nbclient import NotebookClient
    except ImportError as err:  # pragma: no cover - exercised without the extra only
        from ilkit.errors import MissingDependencyError

        raise MissingDependencyError(
            f"the demo needs the notebook extra ({err.name} is missing); run: pip install 'ilkit[notebook]'"
        ) from err

    from ilkit._files import make_folder, write_file, write_files
    from ilkit.views.caution import CAUTION

    source = notebooks or _notebooks_folder()
    make_folder(out, "demo")  # the notebooks run in it
    figures = out / "figures"
    entries = []
    for path in sorted(source.glob("*.ipynb")):
        print(f"running {path.name} ...", flush=True)
        nb = nbformat.read(path, as_version=4)
        NotebookClient(
            nb, timeout=900, kernel_name="python3", resources={"metadata": {"path": str(out)}}
        ).execute()
        title = _title(nb, path.stem)
        nb.metadata["title"] = title  # the page's title in the browser (nbconvert writes "Notebook" without it)
        body, _ = _page_exporter().from_notebook_node(nb, resources={"metadata": {"name": path.stem}})
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


def _page_exporter() -> Any:
    """The HTML exporter for pages read without a kernel.

    A widget cannot be driven from such a page, so where an output carries a
    still image besides its widget view (the influence-line explorer, ipympl
    figures) the page shows the image; widgets without a still keep their view.
    """
    from nbconvert import HTMLExporter
    from traitlets.config import Config

    widget = "application/vnd.jupyter.widget-view+json"
    priority = [m for m in HTMLExporter().default_config.NbConvertBase.display_data_priority if m != widget]
    priority.insert(priority.index("text/plain"), widget)
    config = Config()
    config.NbConvertBase.display_data_priority = priority
    return HTMLExporter(config=config, template_name="lab")


def _extra_outputs(out: Path) -> list[tuple[str, str, int]]:
    """Further demo outputs written by the views layer: calculation sheets of two notebook girders."""
    from ilkit.views.demo import write_demo_sheet, write_highway_sheet

    entries = []
    for write, title in (
        (write_demo_sheet, "Calculation sheet of the suspended-span girder"),
        (write_highway_sheet, "Calculation sheet of the continuous highway girder under HL-93 (placements, "
                              "envelope)"),
    ):
        sheet = write(out)
        print(f"wrote {sheet.html.name} and {sheet.markdown.name} ...", flush=True)
        entries.append((sheet.html.name, f"{title} (Markdown version: {sheet.markdown.name})", 0))
    return entries


def main(argv: list[str] | None = None) -> int:
    parser = argparse.ArgumentParser(prog="python -m ilkit.demo", description=__doc__.splitlines()[0])
    parser.add_argument("--out", type=Path, default=Path("out/demo"), help="output folder (default out/demo)")
    args = parser.parse_args(argv)
    index = run(args.out)
    print(f"\nDemo study written to {args.out.resolve()}")
    print(f"Open {index.resolve()} in a browser.")
    return 0


if __name__ == "__main__":
    sys.exit(main())
