"""API reference pages: one page per public name, one summary page per package.

The public names are the ``__all__`` of ``ilkit``, ``ilkit.loads``, ``ilkit.design``, ``ilkit.rating``,
``ilkit.trusses``, ``ilkit.batch`` and ``ilkit.views``.  A name listed by several packages (``ilkit.AxleTrain`` is
``ilkit.loads.AxleTrain``) is documented once, in the most specific package, and the others link to it.
"""

from __future__ import annotations

import importlib
import inspect
import pkgutil
import re
import sys
from functools import cache
from typing import Any

PACKAGES = ("ilkit", "ilkit.loads", "ilkit.design", "ilkit.rating", "ilkit.trusses", "ilkit.batch", "ilkit.views")
PAGE = {"ilkit": "ilkit", "ilkit.loads": "loads", "ilkit.design": "design", "ilkit.rating": "rating",
        "ilkit.trusses": "trusses", "ilkit.batch": "batch", "ilkit.views": "views"}

# groups of a package's summary, by the module that defines a name (first match wins)
GROUPS: tuple[tuple[str, str], ...] = (
    ("ilkit.model", "The beam"),
    ("ilkit.supports", "The beam"),
    ("ilkit.influence", "Influence lines"),
    ("ilkit.quantity", "Influence lines"),
    ("ilkit._symbols", "Influence lines"),
    ("ilkit.units", "Units"),
    ("ilkit.errors", "Errors"),
    ("ilkit.loads.primitives", "Loads"),
    ("ilkit.loads.combination", "Loads"),
    ("ilkit.loads.models", "Published load models"),
    ("ilkit.loads.placement", "Placement and envelopes"),
    ("ilkit.loads.standing", "Placement and envelopes"),
    ("ilkit.loads.envelope", "Placement and envelopes"),
    ("ilkit.loads.results", "Results of the placement"),
    ("ilkit.design.factors", "Factors"),
    ("ilkit.design.sections", "Sections and permanent loads"),
    ("ilkit.design.permanent", "Sections and permanent loads"),
    ("ilkit.design.lanes", "Lanes and distribution to a girder"),
    ("ilkit.design.distribution", "Lanes and distribution to a girder"),
    ("ilkit.design.transverse", "Lanes and distribution to a girder"),
    ("ilkit.design.live", "Lanes and distribution to a girder"),
    ("ilkit.design.combinations", "Limit states and factored envelopes"),
    ("ilkit.design.factored", "Limit states and factored envelopes"),
    ("ilkit.design.concurrent", "Concurrent forces and deflection"),
    ("ilkit.design.deflection", "Concurrent forces and deflection"),
    ("ilkit.rating.lrfr", "Rating a girder (LRFR)"),
    ("ilkit.rating.resistance", "Rating a girder (LRFR)"),
    ("ilkit.rating.vehicles", "Rating vehicles"),
    ("ilkit.rating.factors", "Rating factors and posting"),
    ("ilkit.rating.rail", "Rail ratings"),
    ("ilkit.trusses.model", "The truss"),
    ("ilkit.trusses.layouts", "Layouts"),
    ("ilkit.trusses.statics", "The truss"),
    ("ilkit.trusses.lines", "Influence lines of a truss"),
    ("ilkit.trusses.envelope", "Member envelopes"),
    ("ilkit.batch.inventory", "Inventories"),
    ("ilkit.batch.names", "Inventories"),
    ("ilkit.batch.sample", "Inventories"),
    ("ilkit.batch.tasks", "Per-girder tasks"),
    ("ilkit.batch.runner", "Batch runs"),
    ("ilkit.views.inventory", "Batch runs"),
    ("ilkit.views.truss", "Drawings"),
    ("ilkit.views.draw", "Drawings"),
    ("ilkit.views.plot", "Drawings"),
    ("ilkit.views.sketch", "Drawings"),
    ("ilkit.views.moving", "Drawings"),
    ("ilkit.views.design_plots", "Drawings"),
    ("ilkit.views.rating_plots", "Drawings"),
    ("ilkit.views.rating_records", "Calculation sheets"),
    ("ilkit.views.rating_view", "The explorer"),
    ("ilkit.views.derive", "Derivations"),
    ("ilkit.views.tables", "Tables and export"),
    ("ilkit.views.report", "Calculation sheets"),
    ("ilkit.views.explorer", "The explorer"),
    ("ilkit.views", "Subpackages"),
    ("ilkit.loads", "Subpackages"),
    ("ilkit.design", "Subpackages"),
    ("ilkit.rating", "Subpackages"),
    ("ilkit.trusses", "Subpackages"),
    ("ilkit.batch", "Subpackages"),
    ("ilkit", "Other names"),
)


@cache
def _ilkit_modules() -> tuple[Any, ...]:
    """Every module of the package (imported), for finding where a value is defined."""
    import ilkit

    found = [ilkit]
    for info in pkgutil.walk_packages(ilkit.__path__, "ilkit."):
        if info.name.endswith(("demo", "_explorer_figure")):
            continue
        try:
            found.append(importlib.import_module(info.name))
        except ImportError:  # pragma: no cover - an optional dependency missing
            continue
    found.append(importlib.import_module("ilkit._symbols"))
    return tuple(found)


def _is_data(obj: Any) -> bool:
    return not (inspect.ismodule(obj) or inspect.isclass(obj) or callable(obj))


@cache
def public() -> tuple[tuple[str, str, Any], ...]:
    """``(package, name, object)`` for every name of every package's ``__all__``."""
    rows = []
    for package in PACKAGES:
        module = importlib.import_module(package)
        for name in module.__all__:
            rows.append((package, name, getattr(module, name)))
    return tuple(rows)


@cache
def canonical() -> dict[int, str]:
    """``id(object)`` -> the full name under which it is documented."""
    out: dict[int, str] = {}
    for package in reversed(PACKAGES):  # the most specific package first
        module = importlib.import_module(package)
        for name in module.__all__:
            obj = getattr(module, name)
            out.setdefault(id(obj), obj.__name__ if inspect.ismodule(obj) else f"{package}.{name}")
    return out


def documented_name(obj: Any, target: str) -> str | None:
    """The documented full name of ``obj`` reached by the dotted path ``target``, or None."""
    names = canonical()
    if id(obj) in names:
        return names[id(obj)]
    parts = target.split(".")
    for cut in range(len(parts) - 1, 0, -1):
        prefix = resolve(".".join(parts[:cut]))
        if prefix is not None and id(prefix) in names:
            return ".".join([names[id(prefix)], *parts[cut:]])
    return None


def resolve(path: str) -> Any:
    """The object at a dotted path (``ilkit.model.Beam.reaction``), or None."""
    parts = path.split(".")
    for cut in range(len(parts), 0, -1):
        name = ".".join(parts[:cut])
        if name not in sys.modules:
            try:
                importlib.import_module(name)
            except ImportError:
                continue
        obj: Any = sys.modules[name]
        try:
            for attr in parts[cut:]:
                obj = getattr(obj, attr)
        except AttributeError:
            return None
        return obj
    return None


def data_docs(obj: Any, name: str) -> tuple[str, str]:
    """``(defining module, docstring)`` of a public value, from the comment or string after its assignment."""
    from sphinx.pycode import ModuleAnalyzer

    for module in _ilkit_modules():
        if module.__dict__.get(name) is not obj:
            continue
        try:
            docs = ModuleAnalyzer.for_module(module.__name__).find_attr_docs()
        except Exception:  # pragma: no cover - a module without source
            continue
        if ("", name) in docs:
            return module.__name__, "\n".join(docs[("", name)]).strip()
    return "", ""


def docstring(obj: Any, name: str) -> str:
    """The object's own docstring (not one inherited from Python or another library)."""
    if inspect.ismodule(obj):
        return inspect.cleandoc(obj.__doc__ or "")
    if inspect.isclass(obj):
        return inspect.cleandoc(obj.__dict__.get("__doc__") or "")
    if _is_data(obj):
        return data_docs(obj, name)[1]
    return inspect.cleandoc(getattr(obj, "__doc__", None) or "")


def missing_docstrings() -> list[str]:
    return [
        f"public name without a docstring: {package}.{name}"
        for package, name, obj in public()
        if not docstring(obj, name)
    ]


def summary(text: str) -> str:
    """The first sentence of a docstring, on one line."""
    first = text.strip().split("\n\n")[0].replace("\n", " ")
    match = re.match(r"(.+?[.:])(\s|$)", first)
    return (match.group(1) if match else first).rstrip(":") or "(no description)"


def _group(obj: Any, name: str) -> str:
    module = obj.__name__ if inspect.ismodule(obj) else getattr(obj, "__module__", None) or ""
    if _is_data(obj):
        module = data_docs(obj, name)[0]
    for prefix, title in GROUPS:
        if module == prefix or module.startswith(prefix + "."):
            return title
    return "Other names"


def _underline(text: str, char: str) -> str:
    return f"{text}\n{char * len(text)}\n"


def object_page(full: str, obj: Any) -> str:
    package, _, name = full.rpartition(".")
    lines = [_underline(full, "="), f".. currentmodule:: {package}\n"]
    if inspect.isclass(obj):
        directive = "autoexception" if issubclass(obj, BaseException) else "autoclass"
        special = "\n   :special-members: __call__" if "__call__" in obj.__dict__ else ""
        lines.append(f".. {directive}:: {name}\n   :members:{special}\n")
    elif _is_data(obj):
        module, doc = data_docs(obj, name)
        value = repr(obj)
        if len(value) > 200:
            value = value[:200] + " ..."
        body = "\n".join("   " + line if line else "" for line in doc.splitlines())
        lines.append(f".. py:data:: {name}\n\n{body}\n\n   Value: ``{value}``\n")
        if module:
            lines.append(f"Defined in ``{module}``.\n")
    else:
        lines.append(f".. autofunction:: {name}\n")
    return "\n".join(lines)


def package_page(package: str) -> str:
    module = importlib.import_module(package)
    names = canonical()
    lines = [_underline(package, "="), f".. automodule:: {package}\n   :no-members:\n"]
    groups: dict[str, list[tuple[str, Any]]] = {}
    for name in module.__all__:
        obj = getattr(module, name)
        groups.setdefault(_group(obj, name), []).append((name, obj))
    order = [title for _, title in GROUPS]
    own: list[str] = []
    for title in sorted(groups, key=order.index):
        lines += [_underline(title, "-"), ".. list-table::", "   :widths: 30 70", ""]
        for name, obj in groups[title]:
            full = names[id(obj)]
            role = "mod" if inspect.ismodule(obj) else "obj"
            lines.append(f"   * - :py:{role}:`{name} <{full}>`")
            text = summary(docstring(obj, name))
            if full != f"{package}.{name}":
                text += f" (documented as ``{full}``)"
            lines.append(f"     - {text}")
            if full == f"{package}.{name}" and not inspect.ismodule(obj):
                own.append(full)
        lines.append("")
    if own:
        lines += [".. toctree::", "   :hidden:", ""] + [f"   {full}" for full in own] + [""]
    return "\n".join(lines)


def pages() -> dict[str, str]:
    """File name -> reStructuredText of every API page."""
    out = {f"{PAGE[p]}.rst": package_page(p) for p in PACKAGES}
    done: set[str] = set()
    for package, name, obj in public():
        full = canonical()[id(obj)]
        if inspect.ismodule(obj) or full in done or full != f"{package}.{name}":
            continue
        done.add(full)
        out[f"{full}.rst"] = object_page(full, obj)
    return out
