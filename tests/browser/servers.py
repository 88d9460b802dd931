"""Local JupyterLab and Voilà servers for the browser tests (127.0.0.1 only).

Each server runs on a free port with its own runtime, config, IPython and
matplotlib folders inside a temp directory, and is stopped by its PID (SIGTERM
shuts its kernels down), then any child left is ended.
"""

from __future__ import annotations

import os
import secrets
import shutil
import signal
import socket
import subprocess
import sys
import time
import urllib.request
from contextlib import contextmanager
from pathlib import Path

ROOT = Path(__file__).resolve().parents[2]
CHROMIUM = "/usr/bin/chromium"
CHROMIUM_ARGS = [
    "--headless",
    "--no-sandbox",
    "--disable-gpu",
    "--disable-quic",
    "--no-first-run",
    "--disable-background-networking",
    "--disable-component-update",
    "--disable-sync",
    "--disable-dev-shm-usage",
]
ARTIFACTS = ROOT / "tests" / "artifacts"


def free_port() -> int:
    with socket.socket() as s:
        s.bind(("127.0.0.1", 0))
        return int(s.getsockname()[1])


def _env(tmp: Path) -> dict[str, str]:
    env = dict(os.environ)
    # the machine's own Jupyter folders (a user's kernelspecs, settings) stay out of the test
    for name in ("JUPYTER_RUNTIME_DIR", "JUPYTER_CONFIG_DIR", "JUPYTER_DATA_DIR", "IPYTHONDIR", "MPLCONFIGDIR"):
        folder = tmp / name.lower()
        folder.mkdir(exist_ok=True)
        env[name] = str(folder)
    env["JUPYTER_PATH"] = env["JUPYTER_DATA_DIR"]
    env["PYTHONPATH"] = str(ROOT) + os.pathsep + env.get("PYTHONPATH", "")
    # no "get notified about Jupyter news?" pop-up over the page (and no calls out for news)
    labconfig = tmp / "jupyter_config_dir" / "labconfig"
    labconfig.mkdir(exist_ok=True)
    (labconfig / "page_config.json").write_text(
        '{"disabledExtensions": {"@jupyterlab/apputils-extension:announcements": true}}'
    )
    return env


def _wait(url: str, proc: subprocess.Popen, timeout: float = 90.0) -> None:
    deadline = time.monotonic() + timeout
    while time.monotonic() < deadline:
        if proc.poll() is not None:
            raise RuntimeError(f"server exited early with code {proc.returncode}")
        try:
            with urllib.request.urlopen(url, timeout=2) as response:
                if response.status == 200:
                    return
        except OSError:
            time.sleep(0.3)
    raise RuntimeError(f"server at {url} did not answer within {timeout} s")


def _stop(proc: subprocess.Popen) -> None:
    if proc.poll() is None:
        proc.send_signal(signal.SIGTERM)
        try:
            proc.wait(timeout=15)
        except subprocess.TimeoutExpired:
            proc.kill()
            proc.wait(timeout=5)
    # end any child left behind (kernels) by its process group
    try:
        os.killpg(proc.pid, signal.SIGKILL)
    except (ProcessLookupError, PermissionError):
        pass


def copy_notebooks(tmp: Path, names: list[str]) -> Path:
    folder = tmp / "work"
    folder.mkdir(exist_ok=True)
    for name in names:
        shutil.copy(ROOT / "notebooks" / name, folder / name)
    return folder


@contextmanager
def jupyter_lab(tmp: Path, folder: Path):
    """Start JupyterLab on 127.0.0.1 serving ``folder``; yield ``(base_url, token)``."""
    port, token = free_port(), secrets.token_hex(16)
    log = open(tmp / "jupyterlab.log", "w")
    proc = subprocess.Popen(
        [
            sys.executable, "-m", "jupyter", "lab", "--no-browser",
            "--ServerApp.ip=127.0.0.1", f"--ServerApp.port={port}", "--ServerApp.port_retries=0",
            f"--ServerApp.token={token}", "--ServerApp.allow_root=True",
            f"--ServerApp.root_dir={folder}",
        ],
        env=_env(tmp), stdout=log, stderr=subprocess.STDOUT, start_new_session=True,
    )  # fmt: skip
    base = f"http://127.0.0.1:{port}"
    try:
        _wait(f"{base}/api/status?token={token}", proc)
        yield base, token
    finally:
        _stop(proc)
        log.close()


@contextmanager
def voila(tmp: Path, folder: Path):
    """Start Voilà on 127.0.0.1 serving ``folder``; yield the base URL."""
    port = free_port()
    log = open(tmp / "voila.log", "w")
    proc = subprocess.Popen(
        [
            sys.executable, "-m", "voila", "--no-browser", "--Voila.ip=127.0.0.1", f"--port={port}",
            "--ServerApp.allow_root=True", str(folder),
        ],
        env=_env(tmp), stdout=log, stderr=subprocess.STDOUT, start_new_session=True,
    )  # fmt: skip
    base = f"http://127.0.0.1:{port}"
    try:
        _wait(f"{base}/", proc)
        yield base
    finally:
        _stop(proc)
        log.close()


def run_all_cells(page, base: str, token: str, notebook: str, timeout_ms: int = 120_000) -> None:
    """Open ``notebook`` in JupyterLab, wait for an idle kernel, and run every cell."""
    page.goto(f"{base}/lab/tree/{notebook}?token={token}&reset", timeout=timeout_ms)
    page.wait_for_selector(".jp-Notebook", timeout=timeout_ms)
    # the toolbar says idle before a kernel exists; the status bar's "| Idle" appears with the kernel
    page.get_by_text("| Idle").first.wait_for(timeout=timeout_ms)
    page.locator(".lm-MenuBar-itemLabel", has_text="Run").first.click()
    page.locator(".lm-Menu-itemLabel", has_text="Run All Cells").first.click()
    # wait until no cell is queued or running and the kernel is idle again
    page.wait_for_function(
        """() => {
            const prompts = [...document.querySelectorAll('.jp-InputArea-prompt')];
            return prompts.length > 0 && prompts.every(p => !p.textContent.includes('*'))
                && prompts.some(p => /\\[\\d+\\]/.test(p.textContent));
        }""",
        timeout=timeout_ms,
    )
    page.get_by_text("| Idle").first.wait_for(timeout=timeout_ms)
