"""File names from girder ids: an id is free text, a file name must stay in its folder.

Every character outside letters, digits, ``-``, ``_`` and ``.`` (a path separator, a drive colon, a
space) is written ``%XX`` (its UTF-8 bytes in hex), a leading dot too, so ``../x`` becomes
``%2E.%2Fx`` and ``/etc/x`` becomes ``%2Fetc%2Fx``: the name is one entry of the folder, whatever the id.
Two ids never give one name.
"""

from __future__ import annotations

import os
from pathlib import Path

from ilkit.errors import BatchInputError

__all__ = ["file_name"]

_PLAIN = set("abcdefghijklmnopqrstuvwxyzABCDEFGHIJKLMNOPQRSTUVWXYZ0123456789-_.")


def _escape(c: str) -> str:
    return "".join(f"%{b:02X}" for b in c.encode("utf-8"))


def file_name(folder: str | os.PathLike[str], girder: str, suffix: str = "") -> Path:
    """The path in ``folder`` of a file named after the girder id ``girder`` (escaped, see the module notes),
    with ``suffix`` (``".html"``); never outside ``folder``."""
    if not isinstance(girder, str) or not girder:
        raise BatchInputError(f"file_name: give a girder id (text), got {girder!r}.", field="girder", value=girder)
    stem = "".join(c if c in _PLAIN else _escape(c) for c in girder)
    if stem.startswith("."):
        stem = _escape(".") + stem[1:]
    base = Path(folder)
    path = base / f"{stem}{suffix}"
    if path.parent != base or os.path.isabs(stem) or path.name != f"{stem}{suffix}":  # pragma: no cover - by design
        raise BatchInputError(f"file_name: {girder!r} cannot be a file name in {str(base)!r}.", field="girder",
                              value=girder)
    return path
