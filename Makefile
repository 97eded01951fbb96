# The README's two commands: `make serve` and `make test`. Both create .venv when needed.
PYTHON ?= python3
VENV := .venv
BIN := $(VENV)/bin
HOST ?= 127.0.0.1
PORT ?= 8000
export HOST PORT

.PHONY: serve test soak lint openapi openapi-check bench-physics bench-http bench-arrays clean

$(BIN)/python:
	$(PYTHON) -m venv $(VENV)
	$(BIN)/python -m pip install --quiet --upgrade pip

# Stamps: reinstall only when pyproject.toml changes.
$(VENV)/.installed-run: pyproject.toml | $(BIN)/python
	$(BIN)/python -m pip install --quiet -e .
	touch $@

$(VENV)/.installed-test: pyproject.toml | $(BIN)/python
	$(BIN)/python -m pip install --quiet -e '.[test]'
	touch $@ $(VENV)/.installed-run

serve: $(VENV)/.installed-run
	$(BIN)/gunicorn --config docker/gunicorn.conf.py 'service:create_app()'

test: $(VENV)/.installed-test lint openapi-check
	$(BIN)/python -m pytest

# The load and fault tests for minutes instead of seconds; writes their figures to bench/README.md.
SOAK_SECONDS ?= 120
soak: $(VENV)/.installed-test
	BOILING_SOAK_SECONDS=$(SOAK_SECONDS) BOILING_LOAD_REPORT=1 $(BIN)/python -m pytest -m load -s tests/load

lint: $(VENV)/.installed-test
	$(BIN)/python -m ruff check .

openapi: $(VENV)/.installed-run
	$(BIN)/python -m service openapi > openapi/openapi.yaml

openapi-check: $(VENV)/.installed-run
	$(BIN)/python -m service openapi | diff -u openapi/openapi.yaml - \
		|| (echo "openapi/openapi.yaml is out of date: run 'make openapi'" >&2; exit 1)

$(VENV)/.installed-bench: pyproject.toml | $(BIN)/python
	$(BIN)/python -m pip install --quiet -e '.[test,bench]'
	touch $@ $(VENV)/.installed-test $(VENV)/.installed-run

bench-physics: $(VENV)/.installed-bench
	$(BIN)/python bench/physics.py

bench-http: $(VENV)/.installed-bench
	$(BIN)/python bench/throughput.py

bench-arrays: $(VENV)/.installed-bench
	$(BIN)/python bench/arrays.py

clean:
	rm -rf $(VENV) .pytest_cache .ruff_cache
