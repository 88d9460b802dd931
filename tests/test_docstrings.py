"""Every public name has a docstring, with its units and sign conventions where they apply.

The public names are the ``__all__`` of ``ilkit``, ``ilkit.loads``, ``ilkit.design``, ``ilkit.trusses`` and
``ilkit.views``; for a class, also its public methods and properties.  A value (``SYSTEMS``, ``ALPHA_VALUES``, ``x``)
is documented by the string after its assignment, as the API pages read it.  A callable that
returns an engineering number (an influence line, an effect, an envelope, an ordinate, a float)
must name its unit and its sign convention, or refer to the sign-convention section
(:mod:`ilkit.model`).
"""

from __future__ import annotations

import ast
import importlib
import inspect
import pkgutil
import re
import typing
from functools import cache

import pytest

import ilkit

PACKAGES = ("ilkit", "ilkit.loads", "ilkit.design", "ilkit.rating", "ilkit.trusses", "ilkit.batch", "ilkit.views")

# what a docstring says when it states a unit, and when it states a sign convention
UNIT = re.compile(
    r"\bunits?\b|\bkN|\bkip|\bm\b|\bft\b|\bper\b|\bforce\b|\blength\b|\brad\b|dimensionless|\bfactor|ratio|%",
    re.IGNORECASE,
)
SIGN = re.compile(
    r"positive|negative|sagging|hogging|upward|downward|clockwise|sign|ilkit\.model|largest|smallest|"
    r"\bmax\b|\bmin\b",
    re.IGNORECASE,
)
# a callable returning one of these gives an engineering number: it names its unit and sign
# (positions returned in tuples or lists, such as breakpoints and roots, are lengths of no sign)
NUMBERS = re.compile(
    r"^(InfluenceLine|Extremes?|Envelope|LoadPlacement|Ordinate|float|float \| np\.ndarray|np\.ndarray)$"
)
# results that are not engineering quantities of a sign (counts, texts, drawings, files, factors)
NO_SIGN = {
    "ilkit.loads.multiple_presence",  # a factor
    "ilkit.loads.phi2",
    "ilkit.loads.phi3",
    "ilkit.loads.train_length",  # a length
}


def public_names() -> list[tuple[str, str, object]]:
    rows = []
    for package in PACKAGES:
        module = importlib.import_module(package)
        for name in module.__all__:
            rows.append((package, name, getattr(module, name)))
    return rows


@cache
def _modules() -> tuple[object, ...]:
    found = [ilkit, importlib.import_module("ilkit._symbols")]
    for info in pkgutil.walk_packages(ilkit.__path__, "ilkit."):
        try:
            found.append(importlib.import_module(info.name))
        except ImportError:  # pragma: no cover - an optional dependency missing
            continue
    return tuple(found)


def value_docstring(obj: object, name: str) -> str:
    """The string literal after ``name = ...`` in the module that defines the value."""
    for module in _modules():
        if module.__dict__.get(name) is not obj:
            continue
        try:
            tree = ast.parse(inspect.getsource(module))
        except (OSError, TypeError):  # pragma: no cover
            continue
        body = tree.body
        for stmt, after in zip(body, body[1:]):
            targets = stmt.targets if isinstance(stmt, ast.Assign) else [stmt.target] if isinstance(
                stmt, ast.AnnAssign) else []
            if any(isinstance(t, ast.Name) and t.id == name for t in targets) and isinstance(after, ast.Expr):
                if isinstance(after.value, ast.Constant) and isinstance(after.value.value, str):
                    return after.value.value
    return ""


def own_docstring(obj: object, name: str) -> str:
    if inspect.ismodule(obj):
        return obj.__doc__ or ""
    if inspect.isclass(obj):
        return obj.__dict__.get("__doc__") or ""
    if not callable(obj):
        return value_docstring(obj, name)
    return getattr(obj, "__doc__", None) or ""


def members(cls: type) -> list[tuple[str, object]]:
    out = []
    for name, member in cls.__dict__.items():
        if name.startswith("_") and name != "__call__":
            continue
        if isinstance(member, (staticmethod, classmethod)):
            member = member.__func__
        if isinstance(member, (property, typing.Callable)) or inspect.isfunction(member):
            out.append((name, member))
        elif hasattr(member, "__get__") and hasattr(member, "func"):  # functools.cached_property
            out.append((name, member.func))
    return out


def returns(member: object) -> str:
    function = member.fget if isinstance(member, property) else member
    try:
        annotation = inspect.signature(function).return_annotation
    except (TypeError, ValueError):
        return ""
    return "" if annotation is inspect.Signature.empty else str(annotation)


def test_every_public_name_is_listed_once_per_package_and_exists():
    for package in PACKAGES:
        names = importlib.import_module(package).__all__
        assert len(names) == len(set(names)), package
    assert len(public_names()) > 80


@pytest.mark.parametrize(("package", "name", "obj"), public_names(), ids=lambda v: v if isinstance(v, str) else "")
def test_public_name_has_a_docstring(package, name, obj):
    doc = own_docstring(obj, name)
    assert doc.strip(), f"{package}.{name} has no docstring"
    if inspect.isclass(obj):
        missing = [m for m, member in members(obj) if not (getattr(member, "__doc__", None) or "").strip()]
        assert not missing, f"{package}.{name}: public members without a docstring: {missing}"


def _callables() -> list[tuple[str, object, object]]:
    """``(path, callable, its class or None)`` of every public function, method and property."""
    seen: set[int] = set()
    out = []
    for package, name, obj in public_names():
        if id(obj) in seen or inspect.ismodule(obj):
            continue
        seen.add(id(obj))
        if inspect.isclass(obj):
            out += [(f"{package}.{name}.{m}", member, obj) for m, member in members(obj)]
        elif callable(obj):
            out.append((f"{package}.{name}", obj, None))
    return out


@pytest.mark.parametrize(("path", "member", "owner"), _callables(), ids=lambda v: v if isinstance(v, str) else "")
def test_a_callable_that_returns_a_number_names_its_unit_and_sign(path, member, owner):
    result = returns(member)
    if not NUMBERS.match(result):
        return
    function = member.fget if isinstance(member, property) else member
    # a member may rely on its class's docstring, which states the units and signs of all of them
    context = (inspect.getdoc(function) or "") + "\n" + (inspect.getdoc(owner) or "" if owner else "")
    assert UNIT.search(context), f"{path} returns {result}: its docstring (or its class's) names no unit"
    if path not in NO_SIGN:
        assert SIGN.search(context), f"{path} returns {result}: its docstring (or its class's) names no sign"


def test_the_quantity_methods_state_unit_and_sign_in_their_own_words():
    # the lines themselves: every quantity method of a beam says what is positive and its unit
    for kind in ("reaction", "moment_reaction", "shear", "moment", "hinge_shear", "deflection", "rotation"):
        doc = inspect.getdoc(getattr(ilkit.Beam, kind)) or ""
        assert SIGN.search(doc) and UNIT.search(doc), f"Beam.{kind}: state its sign and unit: {doc!r}"
