"""Sphinx extension of the ilkit site: generated pages, offline MathJax, reference checks.

* API pages: one page per public name of ``ilkit``, ``ilkit.loads`` and ``ilkit.views`` (their
  ``__all__``), and a summary table per package; a public name without a docstring is a warning
  (an error in ``make docs``).
* Load-model pages: one page per published model, generated from the model objects.
* Gallery: the example notebooks of ``notebooks/``, copied in and executed by myst-nb.
* Verification manual: the ``verification-table`` directive reads the record that the reference
  tests write (``tests/_verification.py``); a failed check is a warning.
* MathJax 3 is copied from the ``django-static-mathjax`` package into ``_static/mathjax``.
* References to ilkit objects by another of their paths (``ilkit.model.Beam``,
  ``ilkit.units.SYSTEMS``) resolve to the page of the same object.
"""

from __future__ import annotations

import inspect
import json
import re
from pathlib import Path
from typing import Any

import api_pages
import model_pages
from docutils import nodes
from sphinx.application import Sphinx
from sphinx.util import logging
from sphinx.util.docutils import SphinxDirective

logger = logging.getLogger("ilkit_docs")

HERE = Path(__file__).resolve().parent
DOCS = HERE.parent
ROOT = DOCS.parent
GENERATED = DOCS / "generated"


# ------------------------------------------------------------------ generated sources
def write_if_changed(path: Path, text: str | bytes) -> None:
    """Write ``path`` only when its content changes (keeps incremental builds incremental)."""
    data = text.encode() if isinstance(text, str) else text
    if path.exists() and path.read_bytes() == data:
        return
    path.parent.mkdir(parents=True, exist_ok=True)
    tmp = path.with_name(path.name + ".tmp")
    tmp.write_bytes(data)
    tmp.replace(path)


def generate_sources(app: Sphinx, config: Any) -> None:
    GENERATED.mkdir(exist_ok=True)
    wanted: set[Path] = set()
    for name, text in api_pages.pages().items():
        path = GENERATED / "api" / name
        write_if_changed(path, text)
        wanted.add(path)
    for warning in api_pages.missing_docstrings():
        logger.warning(warning, type="ilkit", subtype="docstring")
    for name, data in model_pages.pages(GENERATED / "load-models").items():
        path = GENERATED / "load-models" / name
        write_if_changed(path, data)
        wanted.add(path)
    for notebook in sorted((ROOT / "notebooks").glob("*.ipynb")):
        path = GENERATED / "gallery" / notebook.name
        write_if_changed(path, notebook.read_bytes())
        wanted.add(path)
    (GENERATED / "extra").mkdir(exist_ok=True)  # written by the executed pages
    for stale in GENERATED.rglob("*"):
        if stale.is_file() and stale not in wanted and "extra" not in stale.relative_to(GENERATED).parts[:1]:
            stale.unlink()


# ------------------------------------------------------------------ MathJax, served from the build
def copy_mathjax(app: Sphinx) -> None:
    if app.builder.format != "html":
        return
    from ilkit.demo import copy_mathjax as copy  # the demo's pages use the same MathJax

    copy(Path(app.outdir))


# ------------------------------------------------------------------ references by identity
def resolve_by_identity(app: Sphinx, env: Any, node: Any, contnode: nodes.Node) -> nodes.Node | None:
    """``ilkit.model.Beam`` -> the page of ``ilkit.Beam`` (the same object), and so on."""
    if node.get("refdomain") != "py":
        return None
    target = node.get("reftarget", "")
    if not target.startswith("ilkit"):
        modname = node.get("py:module") or ""
        if modname.startswith("ilkit"):
            target = f"{modname}.{target}"
        else:
            return None
    obj = api_pages.resolve(target)
    if obj is None:
        return None
    documented = api_pages.documented_name(obj, target)
    if documented is None or documented == node.get("reftarget"):
        return None
    domain = env.get_domain("py")
    for objtype in ("class", "exception", "function", "method", "attribute", "property", "data", "module"):
        found = domain.resolve_xref(env, node["refdoc"], app.builder, objtype, documented, node, contnode)
        if found is not None:
            return found
    return None


# ------------------------------------------------------------------ missing docstrings of members
def check_member_docstring(app: Sphinx, what: str, name: str, obj: Any, skip: bool, options: Any) -> bool | None:
    if skip or name.startswith("_"):
        return None
    if isinstance(obj, property):
        doc = obj.__doc__
    elif callable(obj) or inspect.ismodule(obj):
        doc = inspect.getdoc(obj)
    else:  # a data attribute: checked by check_attribute_docstring, on its own docstring, not its value's type
        return None
    if not doc or not doc.strip():
        logger.warning("public member without a docstring: %s (%s)", name, what, type="ilkit", subtype="docstring")
    return None


def check_attribute_docstring(app: Sphinx, what: str, name: str, obj: Any, options: Any, lines: list[str]) -> None:
    """A documented attribute needs its own docstring (the string written after it)."""
    if what in ("attribute", "data") and not any(line.strip() for line in lines):
        logger.warning("public member without a docstring: %s (%s)", name, what, type="ilkit", subtype="docstring")


# ------------------------------------------------------------------ the docstring convention
_SECTION = re.compile(r"^(Parameters|Attributes|Returns|Raises|Other Parameters)$")
_ITEM = re.compile(r"^\*{0,2}\w+(, \*{0,2}\w+)*\s*(:.*)?$")


def close_sections(app: Sphinx, what: str, name: str, obj: Any, options: Any, lines: list[str]) -> None:
    """Text after a numpy-style section of items (``name:`` lines with indented descriptions) is
    general text: ilkit's docstrings write it there.  Napoleon would read it as more items, so a
    ``Notes`` heading is put before it (this runs before napoleon)."""
    inside = False
    k = 0
    while k < len(lines):
        line = lines[k]
        if _SECTION.match(line.strip()) and k + 1 < len(lines) and set(lines[k + 1].strip()) == {"-"}:
            inside = not line.startswith((" ", "\t"))
            k += 2
            continue
        if inside and line and not line.startswith((" ", "\t")):
            previous_blank = k > 0 and not lines[k - 1].strip()
            if previous_blank and not _ITEM.match(line):
                lines[k:k] = ["Notes", "-----", ""]
                inside = False
                k += 3
                continue
        k += 1


# ------------------------------------------------------------------ verification manual
def _format(value: Any) -> str:
    if isinstance(value, list):
        shown = ", ".join(_format(v) for v in value[:6])
        return f"[{shown}{', …' if len(value) > 6 else ''}] ({len(value)} values)" if len(value) > 6 else f"[{shown}]"
    return str(value)


def _tolerance(record: dict[str, Any]) -> str:
    parts = []
    if record.get("abs"):
        parts.append(f"abs {record['abs']:g}")
    if record.get("rel"):
        parts.append(f"rel {record['rel']:g}")
    return ", ".join(parts) or "exact"


class VerificationTable(SphinxDirective):
    """The table of every reference check of the last run (``out/verification.json``)."""

    has_content = False

    def run(self) -> list[nodes.Node]:
        path = Path(self.config.ilkit_verification_json)
        self.env.note_dependency(str(path))
        if not path.exists():
            logger.warning(
                "no verification record at %s: run the reference tests first (make docs does)", path,
                location=self.get_location(), type="ilkit", subtype="verification",
            )
            return [nodes.paragraph(text="No verification record: the reference tests have not been run.")]
        record = json.loads(path.read_text())
        tests = record["tests"]
        failed = [t for t in tests if t["outcome"] != "passed" or not all(c["passed"] for c in t["checks"])]
        if failed:
            logger.warning(
                "%d reference test(s) failed in the last run: %s", len(failed),
                ", ".join(t["nodeid"] for t in failed[:5]), location=self.get_location(), type="ilkit",
                subtype="verification",
            )
        out: list[nodes.Node] = [self._summary(record, tests, failed)]
        by_file: dict[str, list[dict[str, Any]]] = {}
        for test in tests:
            by_file.setdefault(test["file"], []).append(test)
        for file, group in by_file.items():
            section = nodes.section(ids=[nodes.make_id(f"verification {file}")])
            section += nodes.title(text=group[0]["file_title"] or file)
            section += nodes.paragraph(text=f"{file}: {len(group)} test(s)")
            section += self._table(group)
            out.append(section)
        return out

    @staticmethod
    def _summary(record: dict[str, Any], tests: list[dict[str, Any]], failed: list[dict[str, Any]]) -> nodes.Node:
        checks = sum(len(t["checks"]) for t in tests)
        text = (
            f"Last run: {record['finished']} with ilkit {record['ilkit_version']}, Python {record['python']}; "
            f"{len(tests)} reference tests, {checks} checks, "
            f"{'all passed' if not failed else f'{len(failed)} test(s) FAILED'}."
        )
        para = nodes.paragraph(text=text)
        para["classes"].append("verification-summary")
        return para

    def _table(self, tests: list[dict[str, Any]]) -> nodes.Node:
        headers = ("test", "what is checked", "source", "expected", "computed", "tolerance", "result")
        table = nodes.table(classes=["verification"])
        group = nodes.tgroup(cols=len(headers))
        table += group
        for width in (14, 22, 22, 12, 12, 8, 6):
            group += nodes.colspec(colwidth=width)
        head = nodes.thead()
        row = nodes.row()
        for h in headers:
            row += nodes.entry("", nodes.paragraph(text=h))
        head += row
        group += head
        body = nodes.tbody()
        for test in tests:
            checks = test["checks"] or [None]
            for k, check in enumerate(checks):
                row = nodes.row(classes=["reference-test"] if k == 0 else [])
                name = nodes.entry("", nodes.paragraph(text=test["name"] if k == 0 else ""))
                if k == 0:
                    name["ids"].append(nodes.make_id("test " + test["nodeid"]))
                    row["ids"].append(nodes.make_id("row " + test["nodeid"]))
                    row["classes"].append("test-" + test["outcome"])
                row += name
                if check is None:
                    cells = ("(no check recorded)", "", "", "", "", test["outcome"])
                    passed = False
                else:
                    source = check["source"]
                    if check.get("clause"):
                        source += f", {check['clause']}"
                    if check.get("from_memory"):
                        source += " (from memory)"
                    passed = check["passed"] and test["outcome"] == "passed"
                    cells = (
                        check["what"],
                        source,
                        _format(check["expected"]) + (f" {check['unit']}" if check.get("unit") else ""),
                        _format(check["computed"]) + (f" {check['unit']}" if check.get("unit") else ""),
                        _tolerance(check),
                        "pass" if passed else "FAIL",
                    )
                for i, text in enumerate(cells):
                    entry = nodes.entry("", nodes.paragraph(text=text))
                    if i == 1:
                        entry["classes"].append("source")
                    if i == 5:
                        entry["classes"].append("result-pass" if passed else "result-fail")
                    row += entry
                body += row
        group += body
        return table


def setup(app: Sphinx) -> dict[str, Any]:
    app.setup_extension("sphinx.ext.napoleon")
    app.add_config_value("ilkit_verification_json", "", "env")
    app.connect("config-inited", generate_sources)
    app.connect("builder-inited", copy_mathjax)
    app.connect("missing-reference", resolve_by_identity)
    app.connect("autodoc-skip-member", check_member_docstring)
    app.connect("autodoc-process-docstring", close_sections, priority=100)
    app.connect("autodoc-process-docstring", check_attribute_docstring, priority=50)
    app.add_directive("verification-table", VerificationTable)
    return {"version": "1", "parallel_read_safe": True, "parallel_write_safe": True}
