"""Per-girder tasks for the batch runner's tests: wrappers of the envelope task that kill a process.

They live in a module of their own so that spawned worker processes can import them.  Each wrapper
describes itself as the task it wraps, so a run started again with the plain task resumes the run it
killed.
"""

from __future__ import annotations

import os
import signal
from dataclasses import dataclass
from pathlib import Path

from ilkit.batch import EnvelopeTask, GirderResult, Record


@dataclass(frozen=True)
class KillProcess:
    """Runs ``task``; at the girder ``victim`` it kills its own process (SIGKILL) the first time (a marker
    file says it happened), or every time when ``always``."""

    task: EnvelopeTask
    victim: str
    marker: str
    always: bool = False

    def describe(self) -> dict:
        return self.task.describe()

    def __call__(self, record: Record) -> GirderResult:
        if record.id == self.victim and (self.always or not Path(self.marker).exists()):
            Path(self.marker).write_text("killed", encoding="utf-8")
            os.kill(os.getpid(), signal.SIGKILL)
        return self.task(record)
