"""Index, health, readiness and the OpenAPI document."""

from __future__ import annotations

from flask import Blueprint, Response, current_app

from service.api import answer_schemas
from service.api.openapi import document_get, json_answer, problem_responses
from service.api.problems import Problem
from service.config import VERSION

blueprint = Blueprint("meta", __name__)


@blueprint.get("/")
def index() -> Response:
    paths = sorted({rule.rule for rule in current_app.url_map.iter_rules() if rule.endpoint != "static"})
    return current_app.json.response(
        {
            "service": "boiling-point service",
            "version": VERSION,
            "paths": paths,
            "documentation": "/openapi.json",
        }
    )


@blueprint.get("/healthz")
def healthz() -> Response:
    return current_app.json.response({"status": "ok"})


@blueprint.get("/readyz")
def readyz() -> Response:
    catalog = current_app.extensions.get("catalog")
    if catalog is None or not catalog.entries:
        raise Problem(503, "The fluid catalog is not loaded yet.")
    return current_app.json.response({"status": "ready", "fluids": len(catalog.entries)})


@blueprint.get("/openapi.json")
def openapi_document() -> Response:
    return current_app.json.response(current_app.extensions["openapi"])


document_get("/", "index", "The paths this service answers", {"200": json_answer(answer_schemas.Index)})
document_get("/healthz", "healthz", "Liveness: the process answers", {"200": json_answer(answer_schemas.Health)})
document_get(
    "/readyz",
    "readyz",
    "Readiness: the catalog is loaded",
    {"200": json_answer(answer_schemas.Health), **problem_responses((503,))},
)
document_get(
    "/openapi.json",
    "openapi",
    "This document, as JSON",
    {"200": {"description": "The OpenAPI document.", "content": {"application/json": {"schema": {"type": "object"}}}}},
)
