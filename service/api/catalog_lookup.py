"""The fluid catalog of the running application, and a request's catalog name looked up in it."""

from __future__ import annotations

from flask import current_app

from service.api.problems import Problem, invalid
from service.fluids.catalog import Catalog
from service.fluids.fluid import Fluid
from service.fluids.not_pure import solution_or_mixture


def catalog() -> Catalog:
    """The catalog loaded at start-up."""
    return current_app.extensions["catalog"]


def resolve_catalog_fluid(name: str) -> Fluid:
    """The catalog fluid named ``name``; 400 for an empty name, 404 listing the closest names otherwise."""
    if not name.strip():
        raise invalid("fluid", "is empty: give a catalog id, CAS number or alias (GET /v1/fluids lists them)")
    fluid = catalog().get(name)
    what = None if fluid else solution_or_mixture(name, _fluid_id)
    if what:
        raise Problem(
            404,
            f"{name!r} names {what}, not a pure fluid. The catalog holds pure fluids only, and a solution or a "
            "mixture does not boil where any of its components does: a dissolved solid raises the boiling point, "
            "and a liquid mixture boils over a range. Do not use a pure component's answer for it.",
            {"fluid": ["a solution or a mixture, not a pure fluid"]},
        )
    if fluid is None:
        close = catalog().close_matches(name)
        hint = f" Closest matches: {', '.join(close)}." if close else ""
        raise Problem(
            404,
            f"No fluid named {name!r} in the catalog.{hint} GET /v1/fluids lists them all.",
            {"fluid": [f"unknown fluid {name!r}"]},
        )
    return fluid


def _fluid_id(name: str) -> str | None:
    """The id of the catalog fluid ``name`` denotes, if any."""
    fluid = catalog().get(name)
    return fluid.id if fluid else None
