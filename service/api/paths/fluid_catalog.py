"""The fluid catalog: list, search and details."""

from __future__ import annotations

from typing import Any

from flask import Blueprint, Response
from marshmallow import Schema, fields

from service.api import answer_schemas
from service.api.answer_cache import cacheable
from service.api.catalog_lookup import catalog, resolve_catalog_fluid
from service.api.openapi import GUARDED, NOT_MODIFIED, document_get, json_answer, problem_responses
from service.api.quantity_fields import UnitField, difference, quantity
from service.api.request_body import query_args
from service.fluids.fluid import Fluid
from service.physics.units import Unit, default_unit

blueprint = Blueprint("fluids", __name__)


class FluidQuery(Schema):
    pressure_unit = UnitField("pressure", metadata={"description": "Unit of the pressures in the answer."})
    temperature_unit = UnitField("temperature", metadata={"description": "Unit of the temperatures in the answer."})


class FluidSearchQuery(FluidQuery):
    q = fields.String(
        metadata={"description": "Part of an id, name, alias, formula or CAS number.", "example": "alcohol"}
    )


def _units(loaded: dict[str, Any]) -> tuple[Unit, Unit]:
    return (
        loaded.get("pressure_unit") or default_unit("pressure"),
        loaded.get("temperature_unit") or default_unit("temperature"),
    )


def summary(fluid: Fluid, p_unit: Unit, t_unit: Unit) -> dict[str, Any]:
    nbp = fluid.boiling_point_at_one_atmosphere
    return {
        "id": fluid.id,
        "name": fluid.name,
        "formula": fluid.formula,
        "cas": fluid.cas,
        "aliases": list(fluid.aliases),
        "normal_boiling_point": None if nbp is None else quantity(nbp, t_unit),
        "range": {
            "temperature_min": quantity(fluid.t_min, t_unit),
            "temperature_max": quantity(fluid.t_max, t_unit),
            "pressure_min": quantity(fluid.p_min, p_unit),
            "pressure_max": quantity(fluid.p_max, p_unit),
        },
        "method": fluid.method,
        "source": fluid.source,
    }


def detail(fluid: Fluid, p_unit: Unit, t_unit: Unit) -> dict[str, Any]:
    return {
        **summary(fluid, p_unit, t_unit),
        "molar_mass": fluid.molar_mass,
        "critical_point": {
            "temperature": quantity(fluid.critical_temperature, t_unit),
            "pressure": quantity(fluid.critical_pressure, p_unit),
        },
        "triple_point": {
            "temperature": quantity(fluid.triple_temperature, t_unit),
            "pressure": quantity(fluid.triple_pressure, p_unit),
        },
        "constants_source": fluid.constants_source,
        "reference_normal_boiling_point": _reference_boiling_point(fluid, t_unit),
    }


def _reference_boiling_point(fluid: Fluid, t_unit: Unit) -> dict[str, Any] | None:
    """The catalog's reference normal boiling point, its source, and how far the equation's lies from it."""
    listed, computed = fluid.normal_boiling_point, fluid.boiling_point_at_one_atmosphere
    if listed is None:
        return None
    return {
        "temperature": quantity(listed, t_unit),
        "difference": None if computed is None else difference(computed - listed, t_unit),
        "source": fluid.constants_source,
    }


@blueprint.get("/v1/fluids")
def list_fluids() -> Response:
    loaded = FluidSearchQuery().load(query_args())
    found = catalog().search(loaded["q"]) if loaded.get("q") else list(catalog().entries.values())
    units = _units(loaded)
    return cacheable({"count": len(found), "fluids": [summary(f, *units) for f in found]})


@blueprint.get("/v1/fluids/<name>")
def fluid_detail(name: str) -> Response:
    loaded = FluidQuery().load(query_args())
    return cacheable(detail(resolve_catalog_fluid(name), *_units(loaded)))


document_get(
    "/v1/fluids",
    "listFluids",
    "List or search the fluid catalog",
    {"200": json_answer(answer_schemas.FluidList), "304": NOT_MODIFIED, **problem_responses((400, *GUARDED))},
    [{"in": "query", "schema": FluidSearchQuery}],
)
document_get(
    "/v1/fluids/{name}",
    "getFluid",
    "One fluid: identity, fixed points, equation and source",
    {
        "200": json_answer(answer_schemas.FluidDetail),
        "304": NOT_MODIFIED,
        **problem_responses((400, 404, *GUARDED)),
    },
    [
        {
            "in": "path",
            "name": "name",
            "required": True,
            "schema": {"type": "string"},
            "description": "Catalog id, CAS registry number or alias.",
            "example": "water",
        },
        {"in": "query", "schema": FluidQuery},
    ],
)
