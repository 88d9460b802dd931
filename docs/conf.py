"""Sphinx configuration of the ilkit documentation site (``make docs``, output in ``out/docs/``).

The site is built offline: the theme's files, MathJax (from the ``django-static-mathjax``
package) and every script are served from the build; nothing is loaded from a CDN.  The build
runs with warnings as errors (``-W --keep-going -n``): broken references, public names without a
docstring, notebooks that fail and failed reference checks stop it.
"""

from __future__ import annotations

import sys
from pathlib import Path

HERE = Path(__file__).resolve().parent
ROOT = HERE.parent
sys.path.insert(0, str(HERE / "_ext"))
sys.path.insert(0, str(ROOT))

import ilkit  # noqa: E402

project = "ilkit"
author = "the ilkit developers"
copyright = "the ilkit developers"
version = release = ilkit.__version__

extensions = [
    "sphinx.ext.autodoc",
    "sphinx.ext.autosummary",
    "sphinx.ext.napoleon",
    "sphinx.ext.mathjax",
    "myst_nb",
    "ilkit_docs",
]

# ---------------------------------------------------------------- sources
# generated/extra: pages written by the executed pages (calculation sheets), copied as they are
exclude_patterns = ["_build", "Thumbs.db", ".DS_Store", "**.ipynb_checkpoints", "_templates", "generated/extra"]
templates_path = ["_templates"]
myst_enable_extensions = ["dollarmath", "amsmath", "colon_fence", "deflist"]
myst_heading_anchors = 3
myst_update_mathjax = False  # MathJax is configured below (mathjax3_config)
suppress_warnings: list[str] = []

# ---------------------------------------------------------------- notebooks (executed at build time)
nb_execution_mode = "force"
nb_execution_raise_on_error = True  # a failing notebook or page stops the build
nb_execution_timeout = 600
nb_execution_show_tb = True
nb_merge_streams = True
nb_render_markdown_format = "myst"  # Markdown outputs (derivations) with their tables and $...$ mathematics
# no widget manager from a CDN: a widget shows the still image that goes with it
nb_ipywidgets_js: dict[str, dict[str, str]] = {}
nb_mime_priority_overrides = [("html", "application/vnd.jupyter.widget-view+json", None)]
nb_render_image_options = {"align": "center"}

# ---------------------------------------------------------------- API pages
autosummary_generate = True
autosummary_imported_members = False
autodoc_member_order = "bysource"
autodoc_typehints = "signature"
autoclass_content = "class"
napoleon_google_docstring = False
napoleon_numpy_docstring = True
napoleon_use_rtype = False
add_module_names = False

# Cross-references are checked (nitpicky) for ilkit's own names; names of other projects
# (Python, numpy, pandas, sympy, matplotlib, pint) cannot be resolved offline without their
# inventories and are not checked.
nitpicky = True
nitpick_ignore_regex = [
    (r"py:.*", r"(?!ilkit\b).*"),
    # private helpers (a name or module starting with an underscore) have no page
    (r"py:.*", r"ilkit\.(\w+\.)*_\w+.*"),
]

# ---------------------------------------------------------------- HTML
html_theme = "furo"
html_title = f"ilkit {release}"
html_static_path = ["_static"]
html_extra_path = ["generated/extra"]
html_css_files = ["ilkit.css"]
html_show_sourcelink = False
html_copy_source = False
html_last_updated_fmt = None
html_theme_options = {
    "sidebar_hide_name": False,
    "navigation_with_keys": True,
}

# MathJax 3 (one file, SVG output: no fonts to fetch), copied into _static/mathjax by ilkit_docs from
# the same package the demo's pages use (ilkit.demo.copy_mathjax)
mathjax_path = "mathjax/tex-svg-full.js"
mathjax3_config = {
    # only math that Sphinx and myst mark as math is typeset (myst marks the rest of the page
    # mathjax_ignore, so that a $ in the text stays a $)
    "tex": {"inlineMath": [["\\(", "\\)"]], "displayMath": [["\\[", "\\]"]], "processEscapes": True},
    "options": {
        "ignoreHtmlClass": "tex2jax_ignore|mathjax_ignore",
        "processHtmlClass": "tex2jax_process|mathjax_process|math|output_area",
        "enableMenu": False,
    },
    "svg": {"fontCache": "global"},
}

# ---------------------------------------------------------------- ilkit_docs (docs/_ext/ilkit_docs.py)
ilkit_verification_json = str(ROOT / "out" / "verification.json")
