"""ilkit as a user gets it: the built wheel in a clean virtual environment (fixtures in conftest.py).

``build`` makes the sdist and the wheel (``python -m build``: the wheel is
built from the sdist, so a file missing from the sdist shows);
``install`` creates a virtual environment with nothing in it and installs the
wheel with the notebook extra only (``pip install "ilkit-….whl[notebook]"``,
by this environment's pip);
``run_demo`` runs ``python -m ilkit.demo`` there on the shipped notebooks.
Everything runs outside the checkout, so ``import ilkit`` finds the installed
copy.  Needs the package index (as ``make test`` does to set up ``.venv``).
"""

from __future__ import annotations

import os
import subprocess
import sys
from dataclasses import dataclass
from pathlib import Path

ROOT = Path(__file__).resolve().parents[1]


@dataclass(frozen=True)
class Environment:
    """A clean virtual environment with the built wheel installed."""

    folder: Path
    python: Path
    wheel: Path
    sdist: Path
    workdir: Path  # an empty folder outside the checkout to run in

    def env(self) -> dict[str, str]:
        """Process environment: this interpreter's paths and the checkout kept out."""
        keep = {k: v for k, v in os.environ.items() if k not in ("PYTHONPATH", "VIRTUAL_ENV", "PYTHONHOME")}
        jupyter = self.folder / "jupyter"
        return {
            **keep,
            "PYTHONNOUSERSITE": "1",
            "PATH": f"{self.python.parent}{os.pathsep}{keep.get('PATH', '')}",
            "JUPYTER_CONFIG_DIR": str(jupyter / "config"),
            "JUPYTER_DATA_DIR": str(jupyter / "data"),
            "JUPYTER_RUNTIME_DIR": str(jupyter / "runtime"),
            "JUPYTER_PATH": str(jupyter / "data"),
            "IPYTHONDIR": str(jupyter / "ipython"),
            "MPLCONFIGDIR": str(jupyter / "matplotlib"),
            "MPLBACKEND": "Agg",
        }

    def run(self, *args: str | Path, timeout: float = 900) -> subprocess.CompletedProcess[str]:
        """Run this environment's Python with ``args`` in the work folder; fail with its output."""
        done = subprocess.run([str(self.python), *map(str, args)], cwd=self.workdir, env=self.env(),
                              capture_output=True, text=True, timeout=timeout)
        if done.returncode != 0:
            raise AssertionError(f"{args} failed ({done.returncode}):\n{done.stdout[-4000:]}\n{done.stderr[-4000:]}")
        return done


def checked(command: list[str], cwd: Path, timeout: float = 900) -> subprocess.CompletedProcess[str]:
    done = subprocess.run(command, cwd=cwd, capture_output=True, text=True, timeout=timeout)
    if done.returncode != 0:
        raise AssertionError(f"{command} failed ({done.returncode}):\n{done.stdout[-4000:]}\n{done.stderr[-4000:]}")
    return done


def build(out: Path) -> tuple[Path, Path]:
    """``python -m build`` of the checkout into ``out``; the wheel and the sdist."""
    checked([sys.executable, "-m", "build", "--outdir", str(out), str(ROOT)], cwd=out)
    (wheel,) = out.glob("ilkit-*.whl")
    (sdist,) = out.glob("ilkit-*.tar.gz")
    return wheel, sdist


def install(wheel: Path, sdist: Path, folder: Path) -> Environment:
    """A new virtual environment in ``folder`` with ``wheel[notebook]`` installed, and nothing else.

    The environment is made without pip (no ensurepip run) and filled by this
    environment's pip (``pip --python``), so it holds the wheel and what its
    notebook extra requires, and not even pip.
    """
    venv = folder / "venv"
    checked([sys.executable, "-m", "venv", "--without-pip", str(venv)], cwd=folder, timeout=120)
    python = venv / ("Scripts/python.exe" if os.name == "nt" else "bin/python")
    workdir = folder / "work"
    workdir.mkdir()
    checked([sys.executable, "-m", "pip", "--python", str(python), "install", "--disable-pip-version-check",
             "--quiet", f"{wheel}[notebook]"], cwd=workdir, timeout=1800)
    return Environment(folder, python, wheel, sdist, workdir)
