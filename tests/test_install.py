"""The package installs cleanly: metadata, licence, type marker, one version, and a working install.

The slow tests build the sdist and the wheel (``python -m build``), check their
metadata (``twine check --strict``), install the wheel with the notebook extra
into a new, empty virtual environment, and run there what a user runs: the
README's first example and the demo study on every shipped notebook.
"""

from __future__ import annotations

import re
import subprocess
import sys
import zipfile
from pathlib import Path

import pytest

import ilkit

pytest.importorskip("build")
pytest.importorskip("twine")

ROOT = Path(__file__).resolve().parents[1]

if sys.version_info >= (3, 11):
    import tomllib
else:  # pragma: no cover - Python 3.10
    tomllib = pytest.importorskip("tomli")


def readme_first_example() -> str:
    return re.findall(r"```python\n(.*?)```", (ROOT / "README.md").read_text(encoding="utf-8"), flags=re.S)[0]


def test_the_version_is_declared_in_one_place() -> None:
    project = tomllib.loads((ROOT / "pyproject.toml").read_text(encoding="utf-8"))
    assert "version" not in project["project"] and "version" in project["project"]["dynamic"]
    assert project["tool"]["setuptools"]["dynamic"]["version"] == {"attr": "ilkit.__version__"}
    assert re.fullmatch(r"\d+\.\d+\.\d+([ab]\d+|rc\d+)?(\.dev\d+)?", ilkit.__version__)


def test_the_licence_file_matches_the_declared_licence() -> None:
    project = tomllib.loads((ROOT / "pyproject.toml").read_text(encoding="utf-8"))["project"]
    text = (ROOT / "LICENSE").read_text(encoding="utf-8")
    assert project["license"] == "MIT" and project["license-files"] == ["LICENSE"]
    assert text.startswith("MIT License") and "Copyright (c) the ilkit developers" in text
    assert "THE SOFTWARE IS PROVIDED \"AS IS\"" in text
    assert (ROOT / "ilkit" / "py.typed").exists()


@pytest.mark.slow
def test_the_built_packages_pass_the_metadata_check(built_dist) -> None:
    wheel, sdist = built_dist
    done = subprocess.run([sys.executable, "-m", "twine", "check", "--strict", str(wheel), str(sdist)],
                          capture_output=True, text=True)
    assert done.returncode == 0, done.stdout + done.stderr
    assert wheel.name == f"ilkit-{ilkit.__version__}-py3-none-any.whl"
    with zipfile.ZipFile(wheel) as zf:
        names = set(zf.namelist())
        info = f"ilkit-{ilkit.__version__}.dist-info"
        metadata = zf.read(f"{info}/METADATA").decode("utf-8")
        assert zf.read(f"{info}/licenses/LICENSE") == (ROOT / "LICENSE").read_bytes()
    assert "ilkit/py.typed" in names and "ilkit/views/__init__.py" in names and "ilkit/loads/__init__.py" in names
    assert f"\nVersion: {ilkit.__version__}\n" in metadata and "\nLicense-Expression: MIT\n" in metadata
    assert 'Provides-Extra: notebook' in metadata and "Description-Content-Type: text/markdown" in metadata


@pytest.mark.slow
def test_readme_first_example_runs_from_the_wheel_in_a_clean_environment(clean_install) -> None:
    script = clean_install.workdir / "first_example.py"
    script.write_text(
        readme_first_example()
        + "\nimport importlib.metadata, pathlib, sys\n"
        "print('file', pathlib.Path(ilkit.__file__).resolve())\n"
        "print('version', ilkit.__version__, importlib.metadata.version('ilkit'))\n"
        "print('typed', (pathlib.Path(ilkit.__file__).parent / 'py.typed').exists())\n"
        "print('determinate', beam.is_determinate, beam.degree)\n",
        encoding="utf-8",
    )
    out = dict(line.split(" ", 1) for line in clean_install.run(script).stdout.splitlines() if " " in line)
    assert Path(out["file"]).is_relative_to(clean_install.folder.resolve())  # the installed copy, not the checkout
    assert out["version"] == f"{ilkit.__version__} {ilkit.__version__}"
    assert out["typed"] == "True" and out["determinate"] == "True 0"


@pytest.mark.slow
def test_every_notebook_runs_with_only_the_notebook_extra(clean_install, installed_demo) -> None:
    """The demo study, run from the wheel in the clean environment, executes every shipped notebook."""
    out, done = installed_demo
    # the environment holds the notebook extra and nothing of the test extra
    probe = "import importlib.util as u; print([m for m in %r if u.find_spec(m)])"
    test_only = ["pytest", "hypothesis", "nbval", "scipy", "voila", "openpyxl", "playwright"]
    assert clean_install.run("-c", probe % test_only).stdout.strip() == "[]"
    argv = clean_install.run("-c", "from jupyter_client.kernelspec import KernelSpecManager as K; "
                                   "print(K().get_kernel_spec('python3').argv[0])").stdout.strip()
    assert argv in ("python", str(clean_install.python)) or Path(argv).parent == clean_install.python.parent
    for notebook in sorted((ROOT / "notebooks").glob("*.ipynb")):
        assert (out / notebook.name).exists() and (out / f"{notebook.stem}.html").exists(), notebook.name
    assert "without encryption" not in done.stdout + done.stderr
    assert (out / "index.html").exists()
