"""The built-in solutes: list and details."""

from __future__ import annotations

from typing import Any

from flask import Blueprint, Response
from marshmallow import Schema

from service.api import answer_schemas
from service.api.answer_cache import cacheable
from service.api.catalog_lookup import resolve_solute, solutes
from service.api.openapi import GUARDED, NOT_MODIFIED, document_get, json_answer, problem_responses
from service.api.quantity_fields import UnitField, quantity
from service.api.request_body import query_args
from service.fluids.solutes import Curve, Solute
from service.physics.units import Unit, default_unit

blueprint = Blueprint("solutes", __name__)
_PERCENT = default_unit("concentration")


class SoluteQuery(Schema):
    temperature_unit = UnitField("temperature", metadata={"description": "Unit of the temperatures in the answer."})


def _curve(curve: Curve, t_unit: Unit) -> dict[str, Any]:
    return {
        "points": [
            {"temperature": quantity(t, t_unit), "concentration": quantity(w, _PERCENT)}
            for t, w in zip(curve.temperatures, curve.fractions, strict=True)
        ],
        "source": curve.source,
    }


def summary(solute: Solute, t_unit: Unit) -> dict[str, Any]:
    return {
        "id": solute.id,
        "name": solute.name,
        "formula": solute.formula,
        "cas": solute.cas or None,
        "aliases": list(solute.aliases),
        "molar_mass": solute.molar_mass,
        "concentration_units": ["wt%", "g/kg", "mol/kg", *(["degBx"] if solute.brix else [])],
        "range": {"temperature_min": quantity(solute.t_min, t_unit), "temperature_max": quantity(solute.t_max, t_unit)},
        "concentration_max": _curve(solute.stated_max, t_unit),
        "solubility": None if solute.solubility is None else _curve(solute.solubility, t_unit),
        "notes": list(solute.notes),
        "method": solute.method,
        "source": solute.source,
    }


def _unit(loaded: dict[str, Any]) -> Unit:
    return loaded.get("temperature_unit") or default_unit("temperature")


@blueprint.get("/v1/solutes")
def list_solutes() -> Response:
    t_unit = _unit(SoluteQuery().load(query_args()))
    found = list(solutes().entries.values())
    return cacheable({"count": len(found), "solutes": [summary(s, t_unit) for s in found]})


@blueprint.get("/v1/solutes/<name>")
def solute_detail(name: str) -> Response:
    return cacheable(summary(resolve_solute(name), _unit(SoluteQuery().load(query_args()))))


document_get(
    "/v1/solutes",
    "listSolutes",
    "List the solutes that water may carry in a computing path",
    {"200": json_answer(answer_schemas.SoluteList), "304": NOT_MODIFIED, **problem_responses((400, *GUARDED))},
    [{"in": "query", "schema": SoluteQuery}],
)
document_get(
    "/v1/solutes/{name}",
    "getSolute",
    "One solute: identity, water-activity equation, ranges, solubility and sources",
    {"200": json_answer(answer_schemas.SoluteSummary), "304": NOT_MODIFIED, **problem_responses((400, 404, *GUARDED))},
    [
        {
            "in": "path",
            "name": "name",
            "required": True,
            "schema": {"type": "string"},
            "description": "Id, name, formula or alias of the solute.",
            "example": "sodium-chloride",
        },
        {"in": "query", "schema": SoluteQuery},
    ],
)
