"""Parquet tables: read and written with pandas and pyarrow (the ``batch`` extra), written atomically."""

from __future__ import annotations

import io
from pathlib import Path
from typing import TYPE_CHECKING

from ilkit._files import write_files
from ilkit.errors import MissingDependencyError

if TYPE_CHECKING:  # pragma: no cover
    import pandas as pd

__all__ = ["need_pyarrow", "to_bytes", "read_table", "write_tables"]


def need_pyarrow() -> None:
    """Raise :class:`ilkit.MissingDependencyError` naming the install when pyarrow is missing."""
    try:
        import pyarrow  # noqa: F401
    except ImportError as err:
        raise MissingDependencyError(
            'Parquet files need pyarrow: pip install "ilkit[batch]" (or pip install pyarrow).') from err


def to_bytes(frame: pd.DataFrame) -> bytes:
    """``frame`` as the bytes of a Parquet file (no index)."""
    need_pyarrow()
    buffer = io.BytesIO()
    frame.to_parquet(buffer, index=False, engine="pyarrow")
    return buffer.getvalue()


def read_table(path: Path) -> pd.DataFrame:
    """A Parquet file as a DataFrame (values only: nothing in the file is run or unpickled)."""
    import pandas as pd

    need_pyarrow()
    return pd.read_parquet(path, engine="pyarrow")


def write_tables(tables: dict[Path, pd.DataFrame], *, what: str) -> None:
    """Write each table to its Parquet file, all or none, atomically (:func:`ilkit._files.write_files`)."""
    write_files({path: to_bytes(frame) for path, frame in tables.items()}, what=what)
