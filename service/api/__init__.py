"""The HTTP layer: blueprints, problem handlers and the OpenAPI document."""

from __future__ import annotations

from flask import Flask

from service.api.openapi import build_document
from service.api.paths import blueprints
from service.api.problems import register_problem_handlers


def register_api(app: Flask) -> None:
    """Attach every path, the problem handlers, and the OpenAPI document built once."""
    register_problem_handlers(app)
    for blueprint in blueprints():
        app.register_blueprint(blueprint)
    with app.app_context():
        app.extensions["openapi"] = build_document()
