# The two commands of the README:
#   make demo  - set up and run the demo study, results in out/demo/
#   make test  - set up and run the whole test suite (lint, the documentation
#                site, unit, property, reference, notebook, install and browser tests)
#   make docs  - the documentation site in out/docs/ (open out/docs/index.html)
# They create .venv on first use, which needs the package index (PyPI).
PYTHON ?= python3
VENV   := .venv
PY     := $(VENV)/bin/python
STAMP  := $(VENV)/.installed

.PHONY: demo test lint docs bench dist clean

# An editable install (changes to ilkit/ need no reinstall); setuptools' notice
# about editable installs is left out of the first-use output.
$(STAMP): pyproject.toml
	$(PYTHON) -m venv $(VENV)
	$(PY) -m pip install --quiet --upgrade pip
	PYTHONWARNINGS="ignore:Editable installation" $(PY) -m pip install --quiet -e ".[notebook,test,docs]"
	touch $(STAMP)

demo: $(STAMP)
	$(PY) -m ilkit.demo --out out/demo

lint: $(STAMP)
	$(PY) -m ruff check ilkit tests benchmarks tools notebooks docs

# The reference tests write the verification record that the manual is generated from; a failed
# check, a broken reference, a public name without a docstring or a failing notebook is a warning,
# and warnings are errors (-W); --keep-going reports them all.
docs: $(STAMP)
	rm -f out/verification.json
	-$(PY) -m pytest -q -p no:cacheprovider -m reference --verification-json=out/verification.json tests
	$(PY) -m sphinx -E -W --keep-going -n -q -b html docs out/docs
	@echo "documentation: $(CURDIR)/out/docs/index.html"

test: $(STAMP) lint docs
	$(PY) -m pytest --nbval --nbval-current-env -p no:cacheprovider

bench: $(STAMP)
	@for f in benchmarks/*.py; do echo "== $$f"; $(PY) $$f || exit 1; done

# The sdist and the wheel in dist/, with their metadata checked.
dist: $(STAMP)
	rm -rf dist
	$(PY) -m build --outdir dist .
	$(PY) -m twine check --strict dist/*

clean:
	rm -rf $(VENV) out dist build *.egg-info .pytest_cache docs/generated
