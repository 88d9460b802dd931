"""Argument checks at the entry points of the views (one place, one wording).

A view given the wrong kind of object, axes that are not matplotlib axes or
a path that is not a path raises a typed ilkit error naming what was given
and what to pass instead, never a raw ``AttributeError`` from deep inside
matplotlib or pathlib.
"""

from __future__ import annotations

import os
from pathlib import Path
from typing import Any

from ilkit.errors import BeamInputError, UnsupportedResultError


def expect(obj: object, kind: type | tuple[type, ...], *, what: str, hint: str) -> Any:
    """``obj`` when it is an instance of ``kind``; else :class:`UnsupportedResultError`."""
    if isinstance(obj, kind):
        return obj
    raise UnsupportedResultError(f"{what}: got {type(obj).__name__} {obj!r:.60}; {hint}.")


def axes_or_none(ax: object, *, what: str) -> Any:
    """``ax`` when it is ``None`` or a matplotlib ``Axes``; else a typed error."""
    if ax is None:
        return None
    from matplotlib.axes import Axes

    if isinstance(ax, Axes):
        return ax
    raise BeamInputError(
        f"{what}: ax must be matplotlib axes (e.g. from plt.subplots()) or left out, got "
        f"{type(ax).__name__} {ax!r:.60}.",
        field="ax",
        value=ax,
    )


def path_of(path: object, *, what: str) -> Path:
    """``path`` as a :class:`Path` when it is text or path-like; else a typed error."""
    if isinstance(path, (str, os.PathLike)) and str(path).strip():
        return Path(path)
    raise BeamInputError(
        f"{what}: path must be a file path (text or pathlib.Path), got {type(path).__name__} {path!r:.60}.",
        field="path",
        value=path,
    )
