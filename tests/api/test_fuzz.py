"""Property-based fuzzing of the whole API from its OpenAPI document (schemathesis).

Every operation, GET and POST, is called in-process through the WSGI app with data generated
from the served document: valid inputs (positive) and inputs that break the document (negative).
Whatever is sent, the service must never answer 5xx, and every answer must be one the document
describes: a listed status code, a listed (and well-formed) content type, a body matching the
schema. Problem documents must not leak tracebacks, file paths or library versions.

The document types unit names and fluids as free strings, so nearly every generated request
stops at "unknown unit". A second run therefore draws them from the valid units and the catalog,
so that generated numbers reach the physics; its responses are still checked against the
document's own response schemas.

The budget keeps the module within a couple of minutes on a 2-core machine; ``derandomize``
makes every run generate the same cases.
"""

from __future__ import annotations

import copy
import json
import re
from typing import Any

import hypothesis
import pytest
import schemathesis
from hypothesis import HealthCheck
from schemathesis.checks import not_a_server_error
from schemathesis.specs.openapi.checks import (
    content_type_conformance,
    response_schema_conformance,
    status_code_conformance,
)

from service import create_app

MAX_EXAMPLES = 50  # per operation and generation mode, in the fuzzing phase

UNITS = {
    "pressure_unit": ["Pa", "hPa", "kPa", "MPa", "bar", "mbar", "atm", "psi", "mmHg", "Torr", "inHg"],
    "temperature_unit": ["K", "degC", "degF", "degR"],
    "length_unit": ["m", "km", "ft"],
}

LEAKS = (
    re.compile(r"Traceback \(most recent call last\)"),
    re.compile(r'File "[^"]+", line \d+'),
    re.compile(r"/site-packages/|/dist-packages/|\.py\"|\.py:\d+"),
    re.compile(
        r"\b(?:flask|werkzeug|marshmallow|numpy|scipy|orjson|python|gunicorn|apispec|prometheus)[ /-]v?\d+\.\d+",
        re.IGNORECASE,
    ),
)


def leak(text: str) -> str | None:
    """The first piece of ``text`` that gives away the implementation, if any."""
    for pattern in LEAKS:
        match = pattern.search(text)
        if match:
            return match.group(0)
    return None


def _strings(node: Any) -> list[str]:
    if isinstance(node, str):
        return [node]
    if isinstance(node, dict):
        return [text for key, value in node.items() for text in (*_strings(key), *_strings(value))]
    if isinstance(node, list):
        return [text for value in node for text in _strings(value)]
    return []


@schemathesis.check
def problem_leaks_nothing(ctx: schemathesis.CheckContext, response: schemathesis.Response, case: Any) -> None:
    """A problem document names what was wrong with the request, not the service's insides."""
    media_type = (response.headers.get("content-type") or [""])[0].split(";")[0].strip()
    if media_type != "application/problem+json":
        return None
    raw = response.content.decode("utf-8", errors="replace")
    body = json.loads(raw)
    leaked = next(filter(None, map(leak, (raw, *_strings(body)))), None)
    if leaked:
        raise AssertionError(f"problem document leaks {leaked!r}: {raw[:500]}")
    if body.get("status") != response.status_code:
        raise AssertionError(f"problem says status {body.get('status')!r}, the HTTP status is {response.status_code}")
    return None


@schemathesis.check
def content_type_is_well_formed(ctx: schemathesis.CheckContext, response: schemathesis.Response, case: Any) -> None:
    """One Content-Type header, each of its parameters (charset, version) given once."""
    values = response.headers.get("content-type") or []
    if len(values) > 1:
        raise AssertionError(f"{len(values)} Content-Type headers: {values}")
    names = [part.split("=", 1)[0].strip().lower() for part in (values or [""])[0].split(";")[1:]]
    repeated = sorted({name for name in names if names.count(name) > 1})
    if repeated:
        raise AssertionError(f"Content-Type {values[0]!r} repeats {', '.join(repeated)}")


CHECKS = [
    not_a_server_error,
    status_code_conformance,
    content_type_conformance,
    response_schema_conformance,
    content_type_is_well_formed,
    problem_leaks_nothing,
]

SETTINGS = hypothesis.settings(
    max_examples=MAX_EXAMPLES,
    deadline=None,
    derandomize=True,
    database=None,
    print_blob=False,
    suppress_health_check=[HealthCheck.too_slow, HealthCheck.filter_too_much, HealthCheck.data_too_large],
)

app = create_app()


def configure(schema: schemathesis.BaseSchema, *modes: schemathesis.GenerationMode) -> schemathesis.BaseSchema:
    schema.config.generation.update(modes=list(modes), max_examples=MAX_EXAMPLES, deterministic=True)
    return schema


def focused(document: dict[str, Any], fluids: list[str]) -> dict[str, Any]:
    """The document with unit names and fluids narrowed to valid values (request side only)."""
    narrowed = copy.deepcopy(document)

    def walk(node: Any) -> None:
        if isinstance(node, dict):
            for key, value in node.get("properties", {}).items():
                if key in UNITS and value.get("type") == "string":
                    value["enum"] = UNITS[key]
            if node.get("in") == "query" and node.get("name") in UNITS:
                node["schema"] = {"type": "string", "enum": UNITS[node["name"]]}
            if node.get("in") in {"query", "path"} and node.get("name") in {"fluid", "name"}:
                node["schema"] = {"type": "string", "enum": fluids}
            for value in node.values():
                walk(value)
        elif isinstance(node, list):
            for value in node:
                walk(value)

    walk(narrowed["paths"])
    for name, component in narrowed["components"]["schemas"].items():
        if name.endswith(("Body", "Fluid")):
            walk(component)
            fluid = component.get("properties", {}).get("fluid")
            if fluid and "oneOf" in fluid:
                fluid["oneOf"][0] = {"type": "string", "enum": fluids}
    return narrowed


_served = app.test_client().get("/openapi.json").get_json()
document_schema = configure(
    schemathesis.openapi.from_dict(copy.deepcopy(_served)),
    schemathesis.GenerationMode.POSITIVE,
    schemathesis.GenerationMode.NEGATIVE,
)
document_schema.app = app
_catalog = [fluid["id"] for fluid in app.test_client().get("/v1/fluids").get_json()["fluids"]]
focused_schema = configure(
    schemathesis.openapi.from_dict(focused(_served, _catalog)), schemathesis.GenerationMode.POSITIVE
)
focused_schema.app = app


def _call_and_validate(case: schemathesis.Case) -> None:
    case.call_and_validate(checks=CHECKS)


@document_schema.parametrize()
@SETTINGS
def test_api_conforms_to_its_document(case: schemathesis.Case) -> None:
    _call_and_validate(case)


@focused_schema.parametrize()
@SETTINGS
def test_api_with_valid_units_and_fluids(case: schemathesis.Case) -> None:
    _call_and_validate(case)


def test_every_operation_is_fuzzed() -> None:
    """Both runs reach every GET and POST operation of the document."""
    documented = {f"{method.upper()} {path}" for path, item in _served["paths"].items() for method in item}
    assert {"GET", "POST"} <= {label.split()[0] for label in documented}
    for schema in (document_schema, focused_schema):
        assert {result.ok().label for result in schema.get_all_operations()} == documented


@pytest.mark.parametrize(
    "text",
    [
        'Traceback (most recent call last):\n  File "/app/service/api/operations.py", line 126, in parse',
        "/usr/lib/python3.11/site-packages/numpy/core/_methods.py",
        "werkzeug/3.1.3",
        "Python 3.11.7",
        "numpy 2.1.0 refused",
    ],
)
def test_the_leak_check_sees_implementation_details(text: str) -> None:
    assert leak(text)


def test_the_leak_check_passes_ordinary_problems() -> None:
    assert leak("pressure: 0.5 kPa is below the triple-point pressure of Water, 0.611657 kPa") is None
    assert leak("The query string has 5637 bytes; the limit is 4096.") is None
