"""The batch runner: maps a per-girder task over an inventory, writes the results in chunks, resumes.

No engineering here: the runner reads and validates the inventory, hands batches of records to the
task (``ilkit.batch.tasks``) in worker processes, and keeps what comes back.

Output folder (``out``)::

    batch.json              the task's settings (a resumed run must have the same)
    chunks/part-N.rows.parquet, chunks/part-N.summary.parquet
                            finished girders, written as they finish, each file atomically; a chunk
                            counts once its summary file exists (the ledger of girders done)
    results.parquet         every girder's rows (see :data:`ilkit.batch.ROW_COLUMNS`), in inventory order
    summary.parquet         one row per girder: status "done", "failed" or "invalid", the error's type,
                            field and message, and the governing values
    inventory.json          the valid records, so that a finished run can be opened again (:func:`open_run`)

A killed run started again with the same arguments skips every girder whose chunk was written (with
the same record: a changed record is computed again), so nothing is computed twice.  Results do not
depend on the number of workers, the executor or the order in which girders finish.
"""

from __future__ import annotations

import json
import math
import os
import time
from collections.abc import Iterator, Mapping, Sequence
from concurrent.futures import FIRST_COMPLETED, Future, ProcessPoolExecutor, wait
from concurrent.futures.process import BrokenProcessPool
from dataclasses import dataclass, field
from pathlib import Path
from typing import TYPE_CHECKING, Any

from ilkit._check import whole
from ilkit._display import RichDisplay
from ilkit._files import make_folder, write_file
from ilkit.batch._parquet import need_pyarrow, read_table, write_tables
from ilkit.batch.inventory import Inventory, Record, read_inventory
from ilkit.batch.tasks import EnvelopeTask, GirderTask, RatingTask
from ilkit.errors import BatchInputError, IlkitError, MissingDependencyError

if TYPE_CHECKING:  # pragma: no cover
    import pandas as pd

__all__ = ["run", "open_run", "BatchResult", "STATUS_COLUMNS"]

STATUS_COLUMNS = ("girder", "status", "error", "field", "message")
"""The first columns of the summary: the girder's id, ``"done"``, ``"failed"`` (the task raised: the
error's type, field and message) or ``"invalid"`` (the record did not validate)."""

_FORMAT = 1
_MANIFEST = "batch.json"
_CHUNKS = "chunks"
_RESULTS = "results.parquet"
_SUMMARY = "summary.parquet"
_RECORDS = "inventory.json"
DIED = "the worker process ended while computing this girder (killed, or out of memory)"
"""The message of a girder whose worker process died under it twice."""


@dataclass(frozen=True)
class BatchResult(RichDisplay):
    """A finished batch run: where its tables are and what happened.

    ``task``: the per-girder task (``None`` when a reopened run's task cannot be rebuilt from its
    settings); ``settings``: its description.  ``computed``: girders computed by this call; ``skipped``:
    girders found done in the folder (a resumed run); ``failed``: girders whose task raised (error rows);
    ``invalid``: records that did not validate.  Read the tables with :meth:`results` and :meth:`summary`
    (pandas DataFrames); :meth:`compute` gives one girder's design objects again, for its sheet.
    """

    folder: Path
    task: GirderTask | None = field(repr=False)
    settings: Mapping[str, Any] = field(repr=False)
    computed: int = 0
    skipped: int = 0
    failed: int = 0
    invalid: int = 0
    inventory: Inventory | None = field(default=None, repr=False, compare=False)

    @property
    def results_path(self) -> Path:
        """``results.parquet``: every girder's rows."""
        return self.folder / _RESULTS

    @property
    def summary_path(self) -> Path:
        """``summary.parquet``: one row per girder."""
        return self.folder / _SUMMARY

    def results(self) -> pd.DataFrame:
        """The tidy table of every girder's rows (:data:`ilkit.batch.ROW_COLUMNS`; a rating run's:
        :data:`ilkit.batch.RATING_COLUMNS`), in inventory order; values
        in each girder's units (its summary's ``units``), signs of :mod:`ilkit.model`."""
        return read_table(self.results_path)

    def summary(self) -> pd.DataFrame:
        """One row per girder of the inventory: :data:`STATUS_COLUMNS`, then the task's summary (for the
        envelope task the governing ``moment_max``, ``moment_min``, ``shear_max`` ... with their ``x``, load
        and case; for the rating task the controlling ``RF`` and per vehicle ``"RF: Type 3"`` ..., see
        :class:`~ilkit.batch.RatingTask`), in inventory order."""
        return read_table(self.summary_path)

    def errors(self) -> pd.DataFrame:
        """The summary rows of the girders not done (failed or invalid), with their field and message."""
        s = self.summary()
        return s[s["status"] != "done"][list(STATUS_COLUMNS)].reset_index(drop=True)

    def girder(self, girder: str) -> pd.DataFrame:
        """The rows of one girder."""
        r = self.results()
        return r[r["girder"] == girder].reset_index(drop=True)

    def record(self, girder: str) -> Record:
        """The validated record of one girder (its beam: ``record(girder).beam()``)."""
        if self.inventory is None:
            raise BatchInputError("record: this result has no inventory; open it with open_run(folder).",
                                  field="inventory")
        return self.inventory.record(girder)

    def compute(self, girder: str) -> list[tuple[str, str, Any]]:
        """One girder's design results again (``(load, kind, result)``: :class:`~ilkit.design.LiveEnvelope`
        and :class:`~ilkit.design.FactoredEnvelope` objects for the envelope task, a
        :class:`~ilkit.rating.GirderRating` for the rating task), computed from its record:
        the objects behind its rows, with their placements, for drawings and sheets."""
        compute = getattr(self.task, "compute", None)
        if compute is None:
            raise BatchInputError("compute: this run's task cannot be computed again here (its settings: "
                                  f"{dict(self.settings)}).", field="task")
        return compute(self.record(girder))

    def __repr__(self) -> str:
        return (f"BatchResult({str(self.folder)!r}: {self.computed} computed, {self.skipped} skipped, "
                f"{self.failed} failed, {self.invalid} invalid)")


def run(
    inventory: object,
    out: str | os.PathLike[str],
    *,
    models: object = None,
    limit_states: object = None,
    divisions: int = 10,
    task: GirderTask | None = None,
    workers: int | None = None,
    client: object = None,
    scheduler: str | None = None,
    chunk_size: int = 100,
    progress: bool = True,
    retry_failed: bool = False,
    fresh: bool = False,
) -> BatchResult:
    """Run a task over every girder of ``inventory`` and write the results to the folder ``out``.

    Parameters
    ----------
    inventory:
        A file (``.toml``, ``.json``, ``.csv``, ``.parquet``), a list of records, a DataFrame or an
        :class:`~ilkit.batch.Inventory` (:func:`~ilkit.batch.read_inventory`).
    models, limit_states, divisions:
        What to compute (:class:`~ilkit.batch.EnvelopeTask`): load models (``"HL-93"`` ...), limit
        states (``"Strength I"`` ...), parts per span (tenth points by default).
    task:
        Another per-girder task instead: :class:`~ilkit.batch.RatingTask` (the load rating of each girder from
        its ``resistance``), or one of your own (see ``ilkit.batch.tasks``).
    workers:
        Local worker processes; all cores by default; ``1`` runs in this process.
    client, scheduler:
        A :class:`dask.distributed.Client`, or a scheduler's address (``"tcp://10.0.0.5:8786"``): the
        girders run on that cluster instead (the ``batch`` extra installs dask).
    chunk_size:
        Girders per chunk file (a killed run loses at most the unwritten chunk).
    progress:
        Show a progress bar (tqdm: girders done, failed, rate, time left; a widget in notebooks).
    retry_failed:
        Compute again the girders that failed in an earlier run into ``out``.
    fresh:
        Remove the results of an earlier run in ``out`` first (only the files a run writes).

    A run into a folder that holds a finished or killed run with the same task resumes it; with
    another task it raises :class:`ilkit.BatchInputError`.  Returns a :class:`BatchResult`.
    """
    need_pyarrow()
    if task is None:
        task = EnvelopeTask(models=() if models is None else models,
                            limit_states=() if limit_states is None else limit_states, divisions=divisions)
    elif models is not None or limit_states is not None:
        raise BatchInputError("run: give a task, or models and limit_states, not both.", field="task", value=task)
    elif not (callable(task) and callable(getattr(task, "describe", None))):
        raise BatchInputError(f"run: a task has describe() and is called with one record (see GirderTask), got "
                              f"{type(task).__name__} {task!r:.60}.", field="task", value=task)
    described = task.describe()
    size = whole(chunk_size, what="run: chunk_size", field="chunk_size", minimum=1, error=BatchInputError)
    if workers is not None:
        workers = whole(workers, what="run: workers", field="workers", minimum=1, error=BatchInputError)
    if client is not None and scheduler is not None:
        raise BatchInputError("run: give client or scheduler, not both.", field="scheduler", value=scheduler)
    inv = read_inventory(inventory)  # type: ignore[arg-type]
    folder = Path(out)
    _prepare(folder, described, fresh)
    done = _ledger(folder)
    current = {r.id: r.digest for r in inv.records}
    todo = [r for r in inv.records
            if not (done.get(r.id, ("", ""))[0] == r.digest and (not retry_failed or done[r.id][1] == "done"))]
    skipped = len(inv.records) - len(todo)
    failed = 0
    bar = _bar(progress, len(inv.records), skipped)
    try:
        with _executor(workers, client, scheduler) as execute:
            chunk: list[_Outcome] = []
            last = time.monotonic()
            number = _next_chunk(folder)
            for outcomes in execute(task, _batches(todo, execute.slots, size)):
                chunk.extend(outcomes)
                failed += sum(o.status != "done" for o in outcomes)
                if bar is not None:
                    bar.update(len(outcomes))
                    bar.set_postfix(failed=failed, invalid=len(inv.errors), refresh=False)
                if len(chunk) >= size or (chunk and time.monotonic() - last > 60):
                    _write_chunk(folder, number, chunk)
                    number, chunk, last = number + 1, [], time.monotonic()
            if chunk:
                _write_chunk(folder, number, chunk)
    finally:
        if bar is not None:
            bar.close()
    all_failed = _assemble(folder, inv, current)
    return BatchResult(folder, task, described, computed=len(todo), skipped=skipped, failed=all_failed,
                       invalid=len(inv.errors), inventory=inv)


def open_run(out: str | os.PathLike[str]) -> BatchResult:
    """A finished run's :class:`BatchResult` from its folder (tables and records; no counts of the run)."""
    folder = Path(out)
    try:
        described = json.loads((folder / _MANIFEST).read_text(encoding="utf-8"))["task"]
        records = json.loads((folder / _RECORDS).read_text(encoding="utf-8"))
    except (OSError, ValueError, KeyError) as err:
        raise BatchInputError(f"open_run: {str(folder)!r} holds no finished batch run ({err}).", field="out",
                              value=str(folder)) from None
    inv = read_inventory(records)
    summary = read_table(folder / _SUMMARY)
    task: GirderTask | None = None
    try:
        if described.get("task") == "envelope":
            task = EnvelopeTask(models=described["models"], limit_states=described["limit_states"],
                                divisions=described["divisions"])
        elif described.get("task") == "rating":
            task = RatingTask(**{k: v for k, v in described.items() if k != "task"})
    except (IlkitError, KeyError, TypeError):  # a load given as an object is not rebuilt from its description
        task = None
    return BatchResult(folder, task, described, failed=int((summary["status"] == "failed").sum()),
                       invalid=int((summary["status"] == "invalid").sum()), inventory=inv)


# ------------------------------------------------------------------------------------------------- workers
@dataclass(frozen=True)
class _Outcome:
    girder: str
    digest: str
    status: str
    rows: Any  # a DataFrame, or None for a failed girder
    summary: dict[str, Any]


def run_batch(task: GirderTask, records: Sequence[Record]) -> list[_Outcome]:
    """Apply ``task`` to each record (in a worker); a girder whose task raises becomes an error outcome (the
    error's type, field and message) and the others go on."""
    out = []
    for record in records:
        try:
            result = task(record)
        except Exception as err:
            out.append(_failed(record, type(err).__name__, getattr(err, "field", None), str(err)))
            continue
        out.append(_Outcome(record.id, record.digest, "done", result.rows, {
            "girder": record.id, "status": "done", "error": "", "field": "", "message": "", **result.summary}))
    return out


def _failed(record: Record, error: str, where: object, message: str) -> _Outcome:
    return _Outcome(record.id, record.digest, "failed", None, {
        "girder": record.id, "status": "failed", "error": error, "field": "" if where is None else str(where),
        "message": message})


def _batches(records: list[Record], slots: int, size: int) -> list[list[Record]]:
    """Records in batches, in inventory order: about four batches per worker slot, at most ``size`` and at most
    eight (the progress bar moves by a batch)."""
    if not records:
        return []
    n = max(1, min(size, 8, math.ceil(len(records) / (4 * max(slots, 1)))))
    return [records[i:i + n] for i in range(0, len(records), n)]


class _Inline:
    slots = 1

    def __enter__(self) -> _Inline:
        return self

    def __exit__(self, *exc: object) -> None:
        return None

    def __call__(self, task: GirderTask, batches: list[list[Record]]) -> Iterator[list[_Outcome]]:
        for batch in batches:
            yield run_batch(task, batch)


class _Pool:
    """Local worker processes (spawned, so that nothing of the driver's state is shared).  A worker that dies
    breaks the pool: the unfinished girders run again on a new pool; girders that break it again run one
    at a time, and the one under which a worker dies becomes an error row."""

    def __init__(self, workers: int) -> None:
        self.slots = workers

    def __enter__(self) -> _Pool:
        return self

    def __exit__(self, *exc: object) -> None:
        return None

    def _pool(self, workers: int) -> ProcessPoolExecutor:
        import multiprocessing

        return ProcessPoolExecutor(max_workers=workers, mp_context=multiprocessing.get_context("spawn"))

    def __call__(self, task: GirderTask, batches: list[list[Record]]) -> Iterator[list[_Outcome]]:
        broken: list[Record] = []
        yield from self._round(task, batches, self.slots, broken)
        if broken:  # the pool broke once (a worker killed from outside, or a girder that kills it): once more
            again: list[Record] = []
            yield from self._round(task, [[r] for r in broken], self.slots, again)
            for record in again:  # one at a time: the girder under which the worker dies is the culprit
                retry: list[Record] = []
                yield from self._round(task, [[record]], 1, retry)
                if retry:
                    yield [_failed(record, "WorkerDied", None, DIED)]

    def _round(self, task: GirderTask, batches: list[list[Record]], workers: int,
               broken: list[Record]) -> Iterator[list[_Outcome]]:
        if not batches:
            return
        pool = self._pool(min(workers, len(batches)))
        try:
            futures: dict[Future[list[_Outcome]], list[Record]] = {pool.submit(run_batch, task, b): b for b in batches}
            pending = set(futures)
            while pending:
                finished, pending = wait(pending, return_when=FIRST_COMPLETED)
                for f in sorted(finished, key=lambda f: futures[f][0].index):
                    try:
                        result = f.result()
                    except BrokenProcessPool:
                        broken.extend(futures[f])
                        continue
                    yield result
        finally:
            pool.shutdown(wait=True, cancel_futures=True)


class _Dask:
    """The same batches as futures on a dask.distributed cluster."""

    def __init__(self, client: object, scheduler: str | None) -> None:
        try:
            import distributed
        except ImportError as err:
            raise MissingDependencyError('a Dask cluster needs dask.distributed: pip install "ilkit[batch]" (or pip '
                                         'install "dask[distributed]").') from err
        self._own = client is None
        if client is None:
            client = distributed.Client(scheduler)
        if not isinstance(client, distributed.Client):
            raise BatchInputError(f"run: client must be a dask.distributed.Client, got {type(client).__name__}.",
                                  field="client", value=client)
        self.client = client
        info = client.scheduler_info()
        self.slots = max(1, sum(w.get("nthreads", 1) for w in info.get("workers", {}).values()))

    def __enter__(self) -> _Dask:
        return self

    def __exit__(self, *exc: object) -> None:
        if self._own:
            self.client.close()

    def __call__(self, task: GirderTask, batches: list[list[Record]]) -> Iterator[list[_Outcome]]:
        from distributed import as_completed

        futures = {self.client.submit(run_batch, task, b, pure=False): b for b in batches}
        try:
            for f in as_completed(list(futures)):
                try:
                    yield f.result()
                except Exception as err:
                    yield [_failed(r, type(err).__name__, None, f"{DIED}: {err}") for r in futures[f]]
        finally:
            for f in futures:
                f.cancel()


def _executor(workers: int | None, client: object, scheduler: str | None) -> Any:
    if client is not None or scheduler is not None:
        if workers is not None:
            raise BatchInputError("run: workers is for the local pool; a Dask cluster has its own workers.",
                                  field="workers", value=workers)
        return _Dask(client, scheduler)
    n = workers if workers is not None else (os.cpu_count() or 1)
    return _Inline() if n == 1 else _Pool(n)


def _bar(progress: object, total: int, initial: int) -> Any:
    if not progress:
        return None
    try:
        from tqdm.auto import tqdm
    except ImportError as err:
        raise MissingDependencyError('the progress bar needs tqdm: pip install "ilkit[batch]" (or give '
                                     'progress=False).') from err
    return tqdm(total=total, initial=initial, unit="girder", desc="girders", smoothing=0.1)


# ------------------------------------------------------------------------------------------------ the folder
def _prepare(folder: Path, described: Mapping[str, Any], fresh: bool) -> None:
    if folder.exists() and not folder.is_dir():
        raise BatchInputError(f"run: out {str(folder)!r} is a file; give a folder.", field="out", value=str(folder))
    manifest = folder / _MANIFEST
    wanted = {"ilkit batch": _FORMAT, "task": described}
    if fresh:
        for path in [*(folder / _CHUNKS).glob("part-*.parquet"), folder / _RESULTS, folder / _SUMMARY,
                     folder / _RECORDS, manifest]:
            if path.is_file():
                path.unlink()
    if manifest.is_file():
        try:
            given = json.loads(manifest.read_text(encoding="utf-8"))
        except ValueError:
            given = None
        if given != json.loads(json.dumps(wanted, default=str)):
            raise BatchInputError(
                f"run: {str(folder)!r} holds the results of another run ({given.get('task') if given else 'unread'}"
                f"); give another folder, the same settings to resume it, or fresh=True to start again there.",
                field="out", value=str(folder))
    make_folder(folder / _CHUNKS, "run")
    if not manifest.is_file():
        write_file(manifest, json.dumps(wanted, indent=1, default=str), what="run")


def _chunk_numbers(folder: Path, kind: str) -> list[int]:
    out = []
    for path in (folder / _CHUNKS).glob(f"part-*.{kind}.parquet"):
        digits = path.name.split(".")[0].removeprefix("part-")
        if digits.isdigit():
            out.append(int(digits))
    return sorted(out)


def _next_chunk(folder: Path) -> int:
    numbers = _chunk_numbers(folder, "rows") + _chunk_numbers(folder, "summary")
    return max(numbers, default=0) + 1


def _chunk(folder: Path, number: int, kind: str) -> Path:
    return folder / _CHUNKS / f"part-{number:06d}.{kind}.parquet"


def _write_chunk(folder: Path, number: int, outcomes: list[_Outcome]) -> None:
    """The rows first, then the summary (which makes the chunk count): each file atomically."""
    import pandas as pd

    frames = [o.rows for o in outcomes if o.rows is not None]
    rows = pd.concat(frames, ignore_index=True) if frames else pd.DataFrame({"girder": pd.Series([], dtype=str)})
    summary = pd.DataFrame([{**o.summary, "digest": o.digest} for o in outcomes])
    write_tables({_chunk(folder, number, "rows"): rows}, what="run")
    write_tables({_chunk(folder, number, "summary"): summary}, what="run")


def _ledger(folder: Path) -> dict[str, tuple[str, str]]:
    """Girders done in earlier runs: id -> (digest of the record, status)."""
    done: dict[str, tuple[str, str]] = {}
    for n in _chunk_numbers(folder, "summary"):
        s = read_table(_chunk(folder, n, "summary"))
        for g, d, st in zip(s["girder"], s["digest"], s["status"]):
            done[str(g)] = (str(d), str(st))
    return done


def _assemble(folder: Path, inv: Inventory, current: Mapping[str, str]) -> int:
    """results.parquet and summary.parquet from the chunks (girders of the current records only, the latest
    chunk of each), in inventory order, with the invalid records; returns the number of failed girders."""
    import pandas as pd

    order = {r.id: r.index for r in inv.records}
    summaries, rows = [], []
    for n in _chunk_numbers(folder, "summary"):
        s = read_table(_chunk(folder, n, "summary"))
        keep = [current.get(str(g)) == str(d) for g, d in zip(s["girder"], s["digest"])]
        s = s[keep]
        if s.empty:
            continue
        s = s.assign(_chunk=n)
        summaries.append(s)
        done = set(s.loc[s["status"] == "done", "girder"])
        if done:
            r = read_table(_chunk(folder, n, "rows"))
            rows.append(r[r["girder"].isin(done)].assign(_chunk=n))
    invalid = pd.DataFrame([{"girder": e.id, "status": "invalid", "error": e.error, "field": e.field,
                             "message": e.message, "_index": e.index} for e in inv.errors])
    summary = pd.concat(summaries, ignore_index=True) if summaries else pd.DataFrame(columns=[*STATUS_COLUMNS])
    if not summary.empty:
        summary = summary.sort_values("_chunk", kind="stable").drop_duplicates("girder", keep="last")
        summary = summary.assign(_index=summary["girder"].map(order))
    chunks = summary.set_index("girder")["_chunk"] if not summary.empty else pd.Series(dtype=int)
    summary = pd.concat([summary, invalid], ignore_index=True) if not invalid.empty else summary
    summary = summary.sort_values("_index", kind="stable").drop(columns=["_index", "_chunk", "digest"],
                                                               errors="ignore").reset_index(drop=True)
    results = pd.concat(rows, ignore_index=True) if rows else pd.DataFrame(columns=["girder"])
    if not results.empty:
        results = results[results["_chunk"].to_numpy() == results["girder"].map(chunks).to_numpy()]
        results = results.assign(_index=results["girder"].map(order))
        results = results.sort_values("_index", kind="stable").drop(columns=["_index", "_chunk"])
    results = results.reset_index(drop=True)
    records = [{**r.data, "id": r.id} for r in inv.records]
    write_tables({folder / _RESULTS: results, folder / _SUMMARY: summary}, what="run")
    write_file(folder / _RECORDS, json.dumps(records, indent=1, default=str, ensure_ascii=False), what="run")
    return int((summary["status"] == "failed").sum()) if "status" in summary else 0
