"""Every shipped notebook imports only what `pip install "ilkit[notebook]"` installs.

Regression: calculation_record.ipynb imported pint, which only the test extra
installed; a user who installed the notebook extra, as the README says, got
ModuleNotFoundError in its second cell.  This test reads the extra from
pyproject.toml; tests/test_install.py runs the notebooks in a clean virtual
environment with nothing else installed.
"""

from __future__ import annotations

import ast
import re
import sys
from importlib.metadata import packages_distributions
from pathlib import Path

import pytest

nbformat = pytest.importorskip("nbformat")

if sys.version_info >= (3, 11):
    import tomllib
else:  # pragma: no cover - Python 3.10
    tomllib = pytest.importorskip("tomli")

ROOT = Path(__file__).resolve().parents[1]
NOTEBOOKS = sorted((ROOT / "notebooks").glob("*.ipynb"))


def canonical(name: str) -> str:
    """A distribution name as the package index compares it (PEP 503)."""
    return re.sub(r"[-_.]+", "-", name).lower()


def requirement_name(requirement: str) -> str:
    return canonical(re.match(r"[A-Za-z0-9._-]+", requirement.strip()).group(0))


def notebook_user_distributions() -> set[str]:
    """What `pip install "ilkit[notebook]"` asks for directly: the core dependencies and the notebook extra."""
    project = tomllib.loads((ROOT / "pyproject.toml").read_text(encoding="utf-8"))["project"]
    wanted = project["dependencies"] + project["optional-dependencies"]["notebook"]
    return {requirement_name(r) for r in wanted} | {"ilkit"}


def imported_modules(nb: nbformat.NotebookNode) -> set[str]:
    """Top-level modules imported by the code cells (IPython magics and shell lines left out)."""
    modules = set()
    for cell in nb.cells:
        if cell.cell_type != "code":
            continue
        code = "\n".join(line for line in cell.source.splitlines() if not line.lstrip().startswith(("%", "!")))
        for node in ast.walk(ast.parse(code)):
            if isinstance(node, ast.Import):
                modules.update(alias.name.split(".")[0] for alias in node.names)
            elif isinstance(node, ast.ImportFrom) and node.level == 0 and node.module:
                modules.add(node.module.split(".")[0])
    return modules


def test_the_notebook_extra_is_read_from_pyproject() -> None:
    names = notebook_user_distributions()
    assert {"numpy", "sympy", "pandas", "matplotlib", "jupyterlab", "ipywidgets", "ilkit"} <= names
    assert "pytest" not in names and "nbval" not in names  # the test extra is not part of it


@pytest.mark.parametrize("path", NOTEBOOKS, ids=lambda p: p.name)
def test_every_notebook_imports_only_what_the_notebook_extra_installs(path: Path) -> None:
    allowed = notebook_user_distributions()
    owners = packages_distributions()
    missing = {}
    for module in sorted(imported_modules(nbformat.read(path, as_version=4))):
        if module in sys.stdlib_module_names or module == "ilkit":
            continue
        distributions = {canonical(d) for d in owners.get(module, [])}
        if not distributions & allowed:
            missing[module] = sorted(distributions) or ["(not installed here)"]
    assert not missing, (
        f"{path.name} imports {missing}, which `pip install 'ilkit[notebook]'` does not install: "
        "add the package to the notebook extra in pyproject.toml, or do without it in tools/nb_*.py"
    )
