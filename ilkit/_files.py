"""Atomic file writes: every file ilkit writes goes through :func:`write_files`.

Each file is written in full to a temporary file in its own folder, then takes
its name with :func:`os.replace`, so no reader ever sees half a file and a
failed write leaves an existing file exactly as it was.  Files written
together (a calculation sheet: HTML, Markdown and its figures) are
all-or-nothing: every temporary file is written first, then all are renamed;
should a rename fail, the files already renamed are put back as they were.

Missing folders are created.  Every file-system fault (a folder where a file
should be, a file where a folder should be, a read-only file, permission
denied, a full disk) is raised as :class:`ilkit.WriteError`, naming the path
and what to do.
"""

from __future__ import annotations

import errno
import os
import secrets
import shutil
import stat
from collections.abc import Mapping
from pathlib import Path

from ilkit.errors import WriteError

__all__ = ["make_folder", "write_file", "write_files"]

_TEMP = ".ilkit-tmp"
"""Marks the temporary files (``.<name>.<random>.ilkit-tmp``), hidden beside their targets."""


def write_file(path: Path, data: str | bytes, *, what: str) -> Path:
    """Write ``data`` (text as UTF-8) to ``path`` atomically; returns ``path``.  ``what`` names the caller
    in error messages (``"to_csv"``)."""
    write_files({path: data}, what=what)
    return path


def write_files(files: Mapping[Path, str | bytes], *, what: str) -> list[Path]:
    """Write every file of ``files`` (``{path: data}``), all or none; returns the paths.

    Raises :class:`ilkit.WriteError` for any file-system fault; then no target
    has been changed and no temporary file is left behind.
    """
    targets = {_target(Path(path), what): data for path, data in files.items()}
    if not targets:
        return []
    for target in targets:
        make_folder(target.parent, what)
    temporaries: dict[Path, Path] = {}
    current = next(iter(targets))
    try:
        for current, data in targets.items():
            temporaries[current] = _write_temporary(current, data)
        _rename_all(temporaries)
    except OSError as err:
        renamed = {str(temporary): target for target, temporary in temporaries.items()}
        raise _error(what, renamed.get(str(err.filename), current), err) from err
    finally:
        for temporary in temporaries.values():
            _remove(temporary)
    return list(targets)


def _target(path: Path, what: str) -> Path:
    """The file to replace: ``path`` (through a symbolic link to what it names), checked before any write."""
    if path.is_symlink():
        path = Path(os.path.realpath(path))
    if path.is_dir():
        raise WriteError(
            f"{what}: cannot write {str(path)!r}: it is a folder. Give a file name, e.g. {str(path / 'name')!r}.",
            path=path,
        )
    if path.exists() and not _writable(path):
        raise WriteError(
            f"{what}: cannot write {str(path)!r}: the existing file is read-only, and it is left as it is. "
            "Make it writable, or write under another name.",
            path=path,
        )
    return path


def _writable(path: Path) -> bool:
    mode = path.stat().st_mode
    return bool(mode & stat.S_IWUSR) and os.access(path, os.W_OK)


def make_folder(folder: Path, what: str) -> None:
    """Create ``folder`` and its parents if missing; a fault is a :class:`ilkit.WriteError`."""
    try:
        folder.mkdir(parents=True, exist_ok=True)
    except OSError as err:
        raise _error(what, folder, err) from err


def _write_temporary(target: Path, data: str | bytes) -> Path:
    """A complete copy of ``data`` in a new temporary file beside ``target`` (the target's mode if it exists)."""
    raw = data.encode("utf-8") if isinstance(data, str) else bytes(data)
    while True:
        temporary = target.with_name(f".{target.name}.{secrets.token_hex(4)}{_TEMP}")
        try:
            fd = os.open(temporary, os.O_WRONLY | os.O_CREAT | os.O_EXCL | getattr(os, "O_BINARY", 0), 0o666)
        except FileExistsError:
            continue
        break
    try:
        with os.fdopen(fd, "wb") as handle:
            handle.write(raw)
            handle.flush()
            os.fsync(handle.fileno())
        if target.exists():
            shutil.copymode(target, temporary)
    except BaseException:
        _remove(temporary)
        raise
    return temporary


def _rename_all(temporaries: dict[Path, Path]) -> None:
    """Give each temporary file its target's name; on a failure put back every target already replaced."""
    if len(temporaries) == 1:
        (target, temporary), = temporaries.items()
        os.replace(temporary, target)
        return
    backups: dict[Path, Path | None] = {}
    try:
        for target, temporary in temporaries.items():
            backups[target] = _backup(target)
            os.replace(temporary, target)
    except BaseException:
        for target, backup in backups.items():
            if backup is not None:
                os.replace(backup, target)
            elif not temporaries[target].exists():  # renamed: the target did not exist before
                _remove(target)
        raise
    finally:
        for backup in backups.values():
            if backup is not None:
                _remove(backup)


def _backup(target: Path) -> Path | None:
    """A second name (or a copy) of an existing ``target``, to put back if the group fails."""
    if not target.exists():
        return None
    backup = target.with_name(f".{target.name}.{secrets.token_hex(4)}.old{_TEMP}")
    try:
        os.link(target, backup)
    except OSError:
        shutil.copy2(target, backup)
    return backup


def _remove(path: Path) -> None:
    try:
        path.unlink()
    except FileNotFoundError:
        pass
    except OSError:  # pragma: no cover - a temporary that cannot be removed is left, never a target
        pass


_REASONS = {
    errno.EACCES: "permission denied; write to a folder you may write to, or change its permissions",
    errno.EPERM: "permission denied; write to a folder you may write to, or change its permissions",
    errno.EROFS: "the file system is read-only; write somewhere else",
    errno.ENOSPC: "the disk is full; free some space or write somewhere else",
    errno.EDQUOT: "the disk quota is exceeded; free some space or write somewhere else",
    errno.ENOTDIR: "a part of the path is a file, not a folder; give a path in a folder",
    errno.EEXIST: "a part of the path is a file, not a folder; give a path in a folder",
    errno.EISDIR: "it is a folder; give a file name",
    errno.ENAMETOOLONG: "the name is too long; give a shorter path",
}


def _error(what: str, path: Path, err: OSError) -> WriteError:
    reason = _REASONS.get(err.errno or 0) or f"{err.strerror or err}"
    return WriteError(
        f"{what}: cannot write {str(path)!r}: {reason}. Existing files were left as they were.", path=path
    )
