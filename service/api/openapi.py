"""The OpenAPI 3.1 document, generated from the marshmallow schemas.

``python -m service openapi`` prints it as YAML; ``make openapi`` writes it to
``openapi/openapi.yaml`` and ``make openapi-check`` fails when the committed file drifts.
Example answers are computed by the service itself from the example requests.
"""

from __future__ import annotations

import math
from dataclasses import dataclass
from typing import Any

import numpy as np
import yaml
from apispec import APISpec
from apispec.ext.marshmallow import MarshmallowPlugin
from flask import current_app

from service.api import answer_schemas
from service.api.computing_path import COMPUTING_PATHS, ComputingPath
from service.api.fluid_input import EquationFluid, PointFluid
from service.api.problems import PROBLEM_TYPE, TITLES
from service.api.quantity_fields import UNIT_SCHEMAS, QuantityField, UnitField, unit_schema, unit_spellings_schema
from service.api.rendering import as_csv, as_text, shown
from service.config import VERSION

DESCRIPTION = """\
Boiling points where the liquid really is: convert an elevation or a barometer reading to
absolute pressure with the U.S. Standard Atmosphere 1976, find the boiling point of water or
a catalog fluid at that pressure (absolute, or gauge relative to the local atmosphere), the
vapor pressure at a temperature, and the reverse lookups. Every answer carries units, the
equation's published name, its source and warnings.

Conventions: JSON bodies with snake_case fields; every physical quantity is
`{"value": ..., "unit": ...}`; `pressure` is absolute, `gauge_pressure` is relative to the local
atmosphere; `pressure_unit`, `temperature_unit` and `length_unit` set the units of every input
and output of their dimension (defaults kPa, degC, m). Errors are RFC 9457
`application/problem+json`. Each computing path answers GET (query string, single values) and
POST (JSON body; any quantity may be an array; arrays broadcast against single values).

Caution: the answers are engineering estimates from published correlations. They do not
replace the design codes for pressure equipment and steam systems, a pump maker's NPSH data,
or a validated process authority's thermal process for food at altitude. Decisions that bear
on safety belong to licensed engineers under the local codes.

Examples are set at an invented site: the Kessock Fell creamery and bioethanol plant, 1,420 m
above sea level.
"""


class _PlainDumper(yaml.SafeDumper):
    """YAML without anchors and aliases, so the file reads top to bottom."""

    def ignore_aliases(self, data: Any) -> bool:
        return True


def _text(dumper: yaml.SafeDumper, data: str) -> yaml.ScalarNode:
    return dumper.represent_scalar("tag:yaml.org,2002:str", data, style="|" if "\n" in data else None)


_PlainDumper.add_representer(str, _text)


def _paragraphs(text: str) -> str:
    """Hard-wrapped source text as one line per paragraph, for the document."""
    return "\n\n".join(" ".join(p.split()) for p in text.split("\n\n"))


def _unit_property(self: Any, field: Any, **kwargs: Any) -> dict[str, Any]:
    """JSON Schema of a :class:`UnitField`: the document's list of the spellings it takes."""
    return unit_schema(field.dimension, field.reference) if isinstance(field, UnitField) else {}


def _quantity_property(self: Any, field: Any, **kwargs: Any) -> dict[str, Any]:
    """JSON Schema of a :class:`QuantityField`: a number, an array, or ``{value, unit}``."""
    if not isinstance(field, QuantityField):
        return {}
    numbers = [{"type": "number"}, {"type": "array", "items": {"type": "number"}}]
    return {
        "oneOf": [
            *numbers,
            {
                "type": "object",
                "required": ["value"],
                "additionalProperties": False,
                "properties": {"value": {"oneOf": numbers}, "unit": unit_schema(field.dimension, field.reference)},
            },
        ]
    }


def _rounded(value: Any) -> Any:
    """Examples to 6 significant digits, so the document does not depend on the last bit."""
    if isinstance(value, float):
        return float(f"{value:.6g}") if math.isfinite(value) else value
    if isinstance(value, np.ndarray):
        return _rounded(value.tolist())
    if isinstance(value, list):
        return [_rounded(v) for v in value]
    if isinstance(value, dict):
        return {k: _rounded(v) for k, v in value.items()}
    return value


_PROBLEM_TEXT = {
    "schema": {
        "type": "string",
        "description": "The problem's fields as `name: value` lines, one `error: field: message` line per message: "
        "the answer to a request that asked for text or CSV.",
    }
}


def problem_responses(statuses: tuple[int, ...]) -> dict[str, Any]:
    return {
        str(s): {
            "description": TITLES[s],
            "content": {PROBLEM_TYPE: {"schema": "Problem"}, "text/plain": _PROBLEM_TEXT},
        }
        for s in statuses
    }


def _array_example(operation: ComputingPath) -> dict[str, Any]:
    """The GET example with its first quantity turned into a short array."""
    body = dict(operation.example)
    first = next(k for k in body if k in operation.inputs)
    body[first] = [round(body[first] * f, 1) for f in (0.9, 1.0, 1.1)]
    return body


GUARDED = (401, 414)
"""Any /v1 path: 401 when an API key is configured and missing, 414 for an over-long query string."""
NOT_MODIFIED = {"description": "Not modified: the answer has the ETag sent in If-None-Match."}
_CSV_BODY = (
    "A header row naming input quantities, each optionally with its unit (`gauge_pressure [kPa]`), then one "
    "row of numbers per point. Options and single values go in the query string. A mixture's `fractions` may "
    "instead be columns, one per component named in the query string: `fractions.ethanol,fractions.water` for "
    "`components=ethanol,water`, without units (`basis` says which fractions)."
)


def _csv_example(operation: ComputingPath, body: dict[str, Any]) -> str:
    """The array example as a CSV body: every input quantity a column, single values repeated."""
    columns = {k: v for k, v in body.items() if k in operation.inputs}
    length = max((len(v) for v in columns.values() if isinstance(v, list)), default=1)
    cells = [v if isinstance(v, list) else [v] * length for v in columns.values()]
    return "\n".join([",".join(columns), *(",".join(map(repr, row)) for row in zip(*cells, strict=True))]) + "\n"


def _computing_paths(spec: APISpec, operation: ComputingPath) -> None:
    get_answer = shown(_rounded(operation.answer(operation.parse(operation.example, "query"))), ())
    array_body = dict(operation.example) if operation.one_point else _array_example(operation)
    post_inputs = operation.parse(array_body, "body")
    post_answer = _rounded(operation.answer(post_inputs))
    text = {"type": "string"}
    tag = operation.path.split("/")[2]
    common = {"tags": [tag], "summary": operation.summary, "description": operation.description}
    spec.path(
        path=operation.path,
        operations={
            "get": {
                **common,
                "operationId": f"get{operation.name}",
                "parameters": [{"in": "query", "schema": operation.query_schema}],
                "responses": {
                    "200": {
                        "description": "The answer.",
                        "content": {
                            "application/json": {"schema": operation.response, "example": get_answer},
                            "text/plain": {"schema": text, "example": as_text(get_answer)},
                        },
                    },
                    "304": NOT_MODIFIED,
                    **problem_responses((*operation.errors, *GUARDED)),
                },
            },
            "post": {
                **common,
                "operationId": f"post{operation.name}",
                "parameters": [{"in": "query", "schema": operation.post_query_schema}],
                "requestBody": {
                    "required": True,
                    "content": {
                        "application/json": {"schema": operation.body_schema, "example": array_body},
                        "text/csv": {
                            "schema": {"type": "string", "description": _CSV_BODY},
                            "example": _csv_example(operation, array_body),
                        },
                    },
                },
                "responses": {
                    "200": {
                        "description": "The answer; arrays where the request sent arrays.",
                        "content": {
                            "application/json": {
                                "schema": operation.response,
                                "example": shown(post_answer, post_inputs.shape),
                            },
                            "text/csv": {"schema": text, "example": as_csv(post_answer, post_inputs.shape)},
                        },
                    },
                    **problem_responses((*operation.errors, *GUARDED, 408, 413, 415)),
                },
            },
        },
    )


@dataclass(frozen=True)
class PlainPath:
    """A GET path that is not a computing path, as the document lists it (``{name}`` for a path parameter)."""

    path: str
    operation_id: str
    summary: str
    responses: dict[str, Any]
    parameters: list[dict[str, Any]] | None = None


PLAIN_PATHS: list[PlainPath] = []
"""Every plain GET path, listed by the module that answers it with :func:`document_get`."""


def document_get(
    path: str,
    operation_id: str,
    summary: str,
    responses: dict[str, Any],
    parameters: list[dict[str, Any]] | None = None,
) -> None:
    """List a plain GET path in the document: the module that answers a path documents it beside the view."""
    PLAIN_PATHS.append(PlainPath(path, operation_id, summary, responses, parameters))


def json_answer(schema: Any, description: str = "The answer.") -> dict[str, Any]:
    """A 200 response whose JSON body follows ``schema``."""
    return {"description": description, "content": {"application/json": {"schema": schema}}}


def build_document() -> dict[str, Any]:
    """The whole OpenAPI 3.1 document as a dict (needs an application context)."""
    marshmallow_plugin = MarshmallowPlugin()
    spec = APISpec(
        title="Boiling-point service",
        version=VERSION,
        openapi_version="3.1.0",
        plugins=[marshmallow_plugin],
        info={"description": _paragraphs(DESCRIPTION), "license": {"name": "MIT", "identifier": "MIT"}},
        servers=[{"url": "/", "description": "this service"}],
        components={
            "securitySchemes": {
                "apiKey": {
                    "type": "http",
                    "scheme": "bearer",
                    "description": "Only when the operator sets BOILING_API_KEY; then every /v1 path needs it.",
                }
            }
        },
        security=[{}, {"apiKey": []}],
    )
    # The plugin's converter exists once the spec has initialised it: apispec documents this way to teach it
    # custom fields ("Custom Fields" in apispec's marshmallow docs).
    marshmallow_plugin.converter.add_attribute_function(_quantity_property)
    marshmallow_plugin.converter.add_attribute_function(_unit_property)
    spec.components.schema("Problem", schema=answer_schemas.Problem)
    for name in UNIT_SCHEMAS:
        spec.components.schema(name, unit_spellings_schema(name))
    spec.components.schema("EquationFluid", schema=EquationFluid)
    spec.components.schema("PointFluid", schema=PointFluid)
    # By path, not by the order in which the path modules happened to be imported: the document is the same
    # whichever module a process (or a test) loads first.
    for operation in sorted(COMPUTING_PATHS, key=lambda o: o.path):
        _computing_paths(spec, operation)
    for path in sorted(PLAIN_PATHS, key=lambda p: p.path):
        catalog_path = path.path.startswith("/v1/")
        operation: dict[str, Any] = {
            "tags": ["fluids" if catalog_path else "service"],
            "operationId": path.operation_id,
            "summary": path.summary,
        }
        if path.parameters:
            operation["parameters"] = path.parameters
        if not catalog_path:
            operation["security"] = []  # probes, scraper and documentation need no key
        spec.path(path=path.path, operations={"get": {**operation, "responses": path.responses}})
    return spec.to_dict()


def document_yaml() -> str:
    """The document as YAML, as committed in ``openapi/openapi.yaml``."""
    return yaml.dump(
        current_app.extensions["openapi"], Dumper=_PlainDumper, sort_keys=False, allow_unicode=True, width=100
    )
