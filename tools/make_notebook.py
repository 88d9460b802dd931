"""Write a notebook from a list of cells and execute it in place (maintainers' tool).

Usage: python tools/make_notebook.py notebooks/NAME.ipynb  (re-executes an existing notebook)
"""

from __future__ import annotations

import sys
from pathlib import Path

import nbformat

from ilkit import demo  # runs notebooks in a kernel of this Python, on local sockets


def execute(path: Path) -> None:
    nb = nbformat.read(path, as_version=4)
    demo.execute(nb, cwd=path.parent)
    for cell in nb.cells:
        cell.metadata.pop("execution", None)
    nbformat.write(nb, path)


def build(path: Path, cells: list[tuple[str, str]]) -> None:
    nb = nbformat.v4.new_notebook()
    nb.metadata["kernelspec"] = {"name": "python3", "display_name": "Python 3", "language": "python"}
    for kind, text in cells:
        text = text.strip("\n")
        nb.cells.append(nbformat.v4.new_markdown_cell(text) if kind == "md" else nbformat.v4.new_code_cell(text))
    nbformat.write(nb, path)
    execute(path)


if __name__ == "__main__":
    for arg in sys.argv[1:]:
        execute(Path(arg))
