"""Inventory scale: many girders under many load models or limit states, locally or on a Dask cluster.

* :func:`read_inventory`: a girder inventory file of our own format (TOML, JSON, CSV, Parquet; see
  ``ilkit.batch.inventory`` and the README), every record validated with the typed errors of
  :class:`ilkit.Beam` and the design layer; a bad record is reported with its id and field.
* :func:`run`: a per-girder task (:class:`EnvelopeTask`: live-load envelopes of load models and
  factored envelopes of limit states at tenth points) over every record, in local worker processes
  (all cores by default) or on a ``dask.distributed`` cluster; results in Parquet, written in chunks
  atomically; a killed run resumes where it stopped; a failing girder is an error row.
* :func:`open_run`: a finished run's :class:`BatchResult` from its folder.
* ``python -m ilkit batch inventory.toml --out results --model HL-93``: the same from a shell.

One pure function (:func:`girder_results`) computes one girder's results from one validated record;
the runner holds no engineering.  Values are in each girder's units with the signs of
:mod:`ilkit.model`.  Results must be checked by a qualified engineer; local codes and licensed
practice govern.
"""

from ilkit.batch.inventory import FIELDS, LIVE_MODELS, Inventory, Record, RecordError, read_inventory, validate_record
from ilkit.batch.names import file_name
from ilkit.batch.runner import STATUS_COLUMNS, BatchResult, open_run, run
from ilkit.batch.sample import sample_inventory
from ilkit.batch.tasks import (
    RATING_COLUMNS,
    ROW_COLUMNS,
    EnvelopeTask,
    GirderResult,
    GirderTask,
    RatingTask,
    girder_results,
)

__all__ = [
    "read_inventory",
    "validate_record",
    "Inventory",
    "Record",
    "RecordError",
    "FIELDS",
    "LIVE_MODELS",
    "run",
    "open_run",
    "BatchResult",
    "EnvelopeTask",
    "RatingTask",
    "GirderResult",
    "GirderTask",
    "girder_results",
    "ROW_COLUMNS",
    "RATING_COLUMNS",
    "STATUS_COLUMNS",
    "sample_inventory",
    "file_name",
]
