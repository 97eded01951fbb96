"""The fluid catalog of the running application, and a request's catalog name looked up in it."""

from __future__ import annotations

from flask import current_app

from service.api.problems import Problem, invalid
from service.fluids.catalog import Catalog
from service.fluids.fluid import Fluid


def catalog() -> Catalog:
    """The catalog loaded at start-up."""
    return current_app.extensions["catalog"]


def resolve_catalog_fluid(name: str) -> Fluid:
    """The catalog fluid named ``name``; 400 for an empty name, 404 listing the closest names otherwise."""
    if not name.strip():
        raise invalid("fluid", "is empty: give a catalog id, CAS number or alias (GET /v1/fluids lists them)")
    fluid = catalog().get(name)
    if fluid is None:
        close = catalog().close_matches(name)
        hint = f" Closest matches: {', '.join(close)}." if close else ""
        raise Problem(
            404,
            f"No fluid named {name!r} in the catalog.{hint} GET /v1/fluids lists them all.",
            {"fluid": [f"unknown fluid {name!r}"]},
        )
    return fluid
