"""The fluid catalog and solutes of the running application, and a request's names looked up in them."""

from __future__ import annotations

from typing import Any

from flask import current_app

from service.api.problems import Problem, invalid
from service.fluids.catalog import Catalog
from service.fluids.fluid import Fluid
from service.fluids.not_pure import solution_or_mixture
from service.fluids.solutes import Solute

_SOLUTE_HINT = "ask with solute={id} (and fluid=water or no fluid) and its concentration; GET /v1/solutes lists them."


def catalog() -> Catalog[Fluid]:
    """The catalog loaded at start-up."""
    return current_app.extensions["catalog"]


def solutes() -> Catalog[Solute]:
    """The built-in solutes loaded at start-up."""
    return current_app.extensions["solutes"]


def resolve_solute(name: str) -> Solute:
    """The solute named ``name``; 404 listing the closest names."""
    solute = solutes().get(name)
    if solute is None:
        raise _unknown(name, "solute", solutes(), "No solute named {name!r}.", "/v1/solutes")
    return solute


def _unknown(name: str, field: str, entries: Catalog[Any], missing: str, listing: str) -> Problem:
    """404 for a name ``entries`` do not hold, with the closest names and the path that lists them all."""
    close = entries.close_matches(name)
    hint = f" Closest matches: {', '.join(close)}." if close else ""
    return Problem(
        404, f"{missing.format(name=name)}{hint} GET {listing} lists them all.", {field: [f"unknown {field} {name!r}"]}
    )


def _solute_in(name: str) -> Solute | None:
    """The solute that ``name`` names, or whose name or alias it contains as words (``sea salt brine``)."""
    found = solutes().get(name)
    if found:
        return found
    words = f" {' '.join(name.casefold().replace('-', ' ').split())} "
    for solute in solutes().entries.values():
        if any(f" {key.casefold()} " in words for key in (solute.id.replace("-", " "), solute.name, *solute.aliases)):
            return solute
    return None


def resolve_catalog_fluid(name: str) -> Fluid:
    """The catalog fluid named ``name``; 400 for an empty name, 404 listing the closest names otherwise."""
    if not name.strip():
        raise invalid("fluid", "is empty: give a catalog id, CAS number or alias (GET /v1/fluids lists them)")
    fluid = catalog().get(name)
    what = None if fluid else solution_or_mixture(name, _fluid_id)
    solute = None if fluid else _solute_in(name)
    if what or solute:
        use = f" For {solute.name.lower()} in water, {_SOLUTE_HINT.format(id=solute.id)}" if solute else ""
        raise Problem(
            404,
            f"{name!r} names {what or 'a solute'}, not a pure fluid. The catalog holds pure fluids only, and a "
            "solution or a mixture does not boil where any of its components does: a dissolved solid raises the "
            "boiling point, and a liquid mixture boils over a range. Do not use a pure component's answer for it."
            + use,
            {"fluid": ["a solution or a mixture, not a pure fluid"]},
        )
    if fluid is None:
        raise _unknown(name, "fluid", catalog(), "No fluid named {name!r} in the catalog.", "/v1/fluids")
    return fluid


def _fluid_id(name: str) -> str | None:
    """The id of the catalog fluid ``name`` denotes, if any."""
    fluid = catalog().get(name)
    return fluid.id if fluid else None
