"""A stateless HTTP service for boiling points, vapor pressures and the standard atmosphere."""

from __future__ import annotations

from collections.abc import Mapping
from typing import Any

from flask import Flask

from service.api import observability, register_api, security
from service.api.answer_cache import AnswerCache
from service.api.json_provider import OrjsonProvider
from service.config import settings
from service.fluids.catalog import load_catalog
from service.fluids.groups import load_group_tables
from service.fluids.pairs import load_pair_sets
from service.fluids.solutes import load_solutes


def create_app(config: Mapping[str, Any] | None = None) -> Flask:
    """Build the application: settings, the catalog, solutes, pairs and groups, the API and its OpenAPI document."""
    app = Flask(__name__)
    app.config.from_mapping(settings())
    app.config.from_mapping(config or {})
    app.json = OrjsonProvider(app)
    # A bad operator file raises CatalogError here, naming file, entry and field: start-up stops.
    app.extensions["catalog"] = load_catalog(extra_files=app.config["EXTRA_CATALOGS"])
    app.extensions["solutes"] = load_solutes()
    app.extensions["pairs"] = load_pair_sets(app.extensions["catalog"])
    app.extensions["groups"] = load_group_tables(app.extensions["catalog"])
    app.extensions["answers"] = AnswerCache(app.config["ANSWER_CACHE_SIZE"])
    observability.configure_logging(app.config["LOG_LEVEL"])
    observability.install(app)
    security.install(app)
    register_api(app)
    return app
