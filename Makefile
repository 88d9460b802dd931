# The two commands of the README:
#   make demo  - set up and run the demo study, results in out/demo/
#   make test  - set up and run the whole test suite (lint, unit, property,
#                reference, notebook and browser tests)
PYTHON ?= python3
VENV   := .venv
PY     := $(VENV)/bin/python
STAMP  := $(VENV)/.installed

.PHONY: demo test lint bench clean

$(STAMP): pyproject.toml
	$(PYTHON) -m venv $(VENV)
	$(PY) -m pip install --quiet --upgrade pip
	$(PY) -m pip install --quiet -e ".[notebook,test]"
	touch $(STAMP)

demo: $(STAMP)
	$(PY) -m ilkit.demo --out out/demo

lint: $(STAMP)
	$(PY) -m ruff check ilkit tests benchmarks tools notebooks

test: $(STAMP) lint
	$(PY) -m pytest --nbval --nbval-current-env -p no:cacheprovider

bench: $(STAMP)
	@for f in benchmarks/*.py; do echo "== $$f"; $(PY) $$f || exit 1; done

clean:
	rm -rf $(VENV) out .pytest_cache
