"""Shared fixtures: the application, and a test client that checks every answer against
the committed OpenAPI document (the contract tests)."""

from __future__ import annotations

import csv
from pathlib import Path
from typing import Any

import jsonschema
import pytest
import yaml
from flask import Flask
from werkzeug.exceptions import MethodNotAllowed, NotFound

from service import create_app
from service.fluids.catalog import Catalog, load_catalog
from service.fluids.groups import load_group_tables
from service.fluids.mixture import Mixture, Model
from service.fluids.model_choice import mixture
from service.fluids.pairs import load_pair_sets

ROOT = Path(__file__).resolve().parents[1]

WATER_ANTOINE = {
    "A": 8.07131,
    "B": 1730.63,
    "C": 233.426,
    "log_base": 10,
    "pressure_unit": "mmHg",
    "temperature_unit": "degC",
}
"""Antoine constants of water, 1 to 100 degC, log10(p/mmHg) = A - B/(t/degC + C): the classic handbook set
(e.g. Lange's Handbook of Chemistry; recalled from memory), 760.1 mmHg at 100 degC."""


@pytest.fixture(scope="session")
def openapi_document() -> dict[str, Any]:
    return yaml.safe_load((ROOT / "openapi" / "openapi.yaml").read_text(encoding="utf-8"))


@pytest.fixture(scope="session")
def app() -> Flask:
    return create_app()


@pytest.fixture(scope="session")
def catalog() -> Catalog:
    """The built-in fluid catalog, loaded and validated once."""
    return load_catalog()


class MixtureOf:
    """``mixture_of("ethanol", "water", model="wilson")``: a mixture of catalog fluids with the built-in pairs and
    group tables."""

    def __init__(self, catalog: Catalog) -> None:
        self.catalog, self.pairs, self.groups = catalog, load_pair_sets(catalog), load_group_tables(catalog)

    def __call__(self, *ids: str, model: Model = "auto") -> Mixture:
        return mixture([self.catalog.get(i) for i in ids], self.pairs, self.groups, model)


@pytest.fixture(scope="session")
def mixture_of(catalog: Catalog) -> MixtureOf:
    return MixtureOf(catalog)


class ContractClient:
    """A Flask test client whose every response must match the OpenAPI document."""

    def __init__(self, app: Flask, document: dict[str, Any]) -> None:
        self.app = app
        self.document = document
        self.client = app.test_client()

    def get(self, path: str, **kwargs: Any) -> Any:
        return self.check("GET", path, self.client.get(path, **kwargs))

    def post(self, path: str, **kwargs: Any) -> Any:
        return self.check("POST", path, self.client.post(path, **kwargs))

    def schema_validator(self, schema: dict[str, Any]) -> jsonschema.Draft202012Validator:
        return jsonschema.Draft202012Validator({**schema, "components": self.document["components"]})

    def check(self, method: str, path: str, response: Any) -> Any:
        template = self.template(method, path.split("?", maxsplit=1)[0])
        body = response.get_json(force=True, silent=True) if response.data else None
        if template is None:  # not a documented path: still a problem document
            assert response.mimetype == "application/problem+json", response.data
            self.schema_validator({"$ref": "#/components/schemas/Problem"}).validate(body)
            return response
        operation = self.document["paths"][template][method.lower()]
        documented = operation["responses"]
        assert str(response.status_code) in documented, (
            f"{method} {template} answered {response.status_code}, which the document does not list: {body}"
        )
        if "content" not in documented[str(response.status_code)]:
            assert not response.data, f"{method} {template} {response.status_code} should have no body"
            return response
        content = documented[str(response.status_code)]["content"]
        assert response.mimetype in content, f"{response.mimetype} not documented for {method} {template}"
        if response.mimetype.startswith("text/"):
            body = response.get_data(as_text=True)
        self.schema_validator(content[response.mimetype]["schema"]).validate(body)
        return response

    def template(self, method: str, path: str) -> str | None:
        adapter = self.app.url_map.bind("localhost")
        try:
            endpoint, _ = adapter.match(path, method=method)
        except (NotFound, MethodNotAllowed):
            return None
        rule = next(r for r in self.app.url_map.iter_rules() if r.endpoint == endpoint)
        return rule.rule.replace("<", "{").replace(">", "}")


@pytest.fixture
def client(app: Flask, openapi_document: dict[str, Any]) -> ContractClient:
    return ContractClient(app, openapi_document)


def csv_answer(text: str) -> tuple[list[str], list[dict[str, str]]]:
    """A CSV answer's comment lines (without their ``# ``) and its rows, keyed by the header's cells."""
    lines = text.splitlines()
    notes = [line.removeprefix("# ") for line in lines if line.startswith("#")]
    return notes, list(csv.DictReader(line for line in lines if not line.startswith("#")))
