# The two commands of the README:
#   make demo  - set up and run the demo study, results in out/demo/
#   make test  - set up and run the whole test suite (lint, the documentation
#                site, unit, property, reference, notebook and browser tests)
#   make docs  - the documentation site in out/docs/ (open out/docs/index.html)
PYTHON ?= python3
VENV   := .venv
PY     := $(VENV)/bin/python
STAMP  := $(VENV)/.installed

.PHONY: demo test lint docs bench clean

$(STAMP): pyproject.toml
	$(PYTHON) -m venv $(VENV)
	$(PY) -m pip install --quiet --upgrade pip
	$(PY) -m pip install --quiet -e ".[notebook,test,docs]"
	touch $(STAMP)

demo: $(STAMP)
	$(PY) -m ilkit.demo --out out/demo

lint: $(STAMP)
	$(PY) -m ruff check ilkit tests benchmarks tools docs

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

clean:
	rm -rf $(VENV) out .pytest_cache docs/generated
