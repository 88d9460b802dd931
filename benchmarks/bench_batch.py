"""Speed of inventory runs (ilkit.batch.run): girders per second with 1 and 2 workers, locally and on a Dask
LocalCluster of 2 worker processes, and the peak memory.

The inventory is generated, of our own (``ilkit.batch.sample_inventory``): 1,000 girders of 1 to 5
continuous spans of 20 to 150 ft (kip-ft), each under AASHTO HL-93 (the girder's live-load envelope at
tenth points: moment, shear and reaction, exact placement).  Each run writes into a fresh folder
(chunks, then the Parquet tables).  Printed: wall time, girders per second, the speed-up of two workers
over one, and the peak resident memory of the driver, of the local worker processes and of each Dask
worker (Linux: ``getrusage``).  Results of every run are checked to be identical (they must not depend
on the number of workers or the executor).

Run: ``.venv/bin/python benchmarks/bench_batch.py`` (or ``make bench``); ``--girders 200`` for a
shorter run.  Exits with status 1 if two runs give different tables.
"""

from __future__ import annotations

import argparse
import sys
import tempfile
import time
from pathlib import Path

import pandas as pd

from ilkit import batch


def peak_mb(who: str = "self") -> float:
    """Peak resident memory in MB of this process (``"self"``) or of its finished children (``"children"``)."""
    try:
        import resource
    except ImportError:  # pragma: no cover - not on this platform
        return float("nan")
    usage = resource.getrusage(resource.RUSAGE_SELF if who == "self" else resource.RUSAGE_CHILDREN)
    return usage.ru_maxrss / 1024.0  # kB on Linux


def timed(label: str, records: list[dict], folder: Path, **how: object) -> tuple[float, pd.DataFrame]:
    start = time.perf_counter()
    result = batch.run(records, folder, models=["HL-93"], progress=False, **how)
    seconds = time.perf_counter() - start
    assert result.failed == 0 and result.invalid == 0, result.errors()
    print(f"{label:<34} {seconds:8.1f} s  {len(records) / seconds:7.1f} girders/s")
    return seconds, result.results()


def main(argv: list[str] | None = None) -> int:
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument("--girders", type=int, default=1000)
    args = parser.parse_args(argv)
    records = batch.sample_inventory(args.girders, seed=1, spans=(1, 5), lengths=(20.0, 150.0))
    print(f"{len(records)} generated girders, 1 to 5 spans of 20 to 150 ft, HL-93 at tenth points")
    work = Path(tempfile.mkdtemp(prefix="ilkit-bench-batch-"))
    one, reference = timed("local, 1 worker (this process)", records, work / "one", workers=1)
    two, rows = timed("local, 2 worker processes", records, work / "two", workers=2)
    same = rows.equals(reference)
    print(f"  speed-up of 2 workers over 1: {one / two:.2f} (at most 2 on two cores; this machine's other work "
          "and the workers' start-up count against it)")
    print(f"  peak memory: driver {peak_mb('self'):.0f} MB, largest local worker {peak_mb('children'):.0f} MB")
    from distributed import Client, LocalCluster

    with LocalCluster(n_workers=2, threads_per_worker=1, processes=True, host="127.0.0.1",
                      dashboard_address=None, silence_logs=40) as cluster, Client(cluster) as client:
        dask, rows = timed("Dask LocalCluster, 2 processes", records, work / "dask", client=client)
        same = same and rows.equals(reference)
        workers = client.run(peak_mb)
    print(f"  speed-up over 1 local worker: {one / dask:.2f}")
    print(f"  peak memory of the Dask workers: {', '.join(f'{v:.0f} MB' for v in workers.values())}")
    print(f"identical tables from every run: {same}")
    return 0 if same else 1


if __name__ == "__main__":
    sys.exit(main())
