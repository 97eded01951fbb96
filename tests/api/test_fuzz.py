"""Property-based fuzzing of the whole API from its OpenAPI document (schemathesis): a contract
suite over every path, GET and POST, not the tests of one module.

Every operation, GET and POST, is called in-process through the WSGI app with data generated
from the served document: valid inputs (positive) and inputs that break the document (negative).
Every check schemathesis has runs, but one: whatever is sent, the service must never answer 5xx,
every answer must be one the document describes (a listed status code, a listed and well-formed
content type, listed headers, a body matching the schema), data that breaks the document must be
refused, and problem documents must not leak tracebacks, file paths or library versions. The one
left out, positive data acceptance, would have every request the document admits answered 2xx;
but the document cannot say which pressures lie between a fluid's triple and critical points, or
that a gauge reading must not exceed the local atmosphere, so schema-valid requests may rightly
get 422 (and an overlong query 414).

The document types fluids as free strings, so nearly every generated request stops at "unknown
fluid". A second run therefore draws them from the catalog, so that generated numbers reach the
physics; its responses are still checked against the document's own response schemas.

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
from schemathesis.checks import positive_data_acceptance
from schemathesis.config import SchemathesisConfig

from service import create_app

MAX_EXAMPLES = 50  # per operation and generation mode, in the fuzzing phase

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


OUR_CHECKS = [content_type_is_well_formed, problem_leaks_nothing]
LEFT_OUT = [positive_data_acceptance]

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


# Data that breaks the document may also be refused with 414: a generated query string longer than the
# service takes is refused for its length before anything in it is read.
REFUSALS = [400, 401, 403, 404, 405, 406, 409, 414, 415, 422, 428, 429, "5XX"]
CONFIG = SchemathesisConfig.from_dict({"checks": {"negative_data_rejection": {"expected-statuses": REFUSALS}}})


def focused(document: dict[str, Any], fluids: list[str]) -> dict[str, Any]:
    """The document with fluids narrowed to catalog ids (request side only)."""
    narrowed = copy.deepcopy(document)

    def walk(node: Any) -> None:
        if isinstance(node, dict):
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
    schemathesis.openapi.from_dict(copy.deepcopy(_served), config=CONFIG),
    schemathesis.GenerationMode.POSITIVE,
    schemathesis.GenerationMode.NEGATIVE,
)
document_schema.app = app
_catalog = [fluid["id"] for fluid in app.test_client().get("/v1/fluids").get_json()["fluids"]]
focused_schema = configure(
    schemathesis.openapi.from_dict(focused(_served, _catalog), config=CONFIG), schemathesis.GenerationMode.POSITIVE
)
focused_schema.app = app


def _call_and_validate(case: schemathesis.Case) -> None:
    case.call_and_validate(additional_checks=OUR_CHECKS, excluded_checks=LEFT_OUT)


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
        'Traceback (most recent call last):\n  File "/app/service/api/computing_path.py", line 126, in parse',
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
