"""Liquid mixtures: bubble and dew points, and the built-in binary pairs."""

from __future__ import annotations

from typing import Any

import numpy as np
from flask import Blueprint, Response, current_app
from marshmallow import ValidationError, fields, validate

from service.api import mixture_schemas
from service.api.answer_cache import cacheable
from service.api.catalog_lookup import catalog, resolve_catalog_fluid
from service.api.computing_path import ComputingPath, Input, Inputs
from service.api.numbers import finite_numbers, parse_number, printable
from service.api.openapi import GUARDED, NOT_MODIFIED, document_get, json_answer, problem_responses
from service.api.pressure_inputs import PRESSURE_INPUTS, pressure_fields, readings
from service.api.problems import invalid
from service.api.quantity_fields import RATIO, quantity
from service.api.rendering import provenance
from service.fluids.azeotrope import azeotrope
from service.fluids.mixture import Basis, Mixture, phase_point
from service.fluids.model_choice import mixture
from service.fluids.pairs import PairModel, PairSet
from service.physics.units import UNITS, Unit

blueprint = Blueprint("mixtures", __name__)
_MOST_COMPONENTS = 10
_MOLE = Unit("mole fraction", "ratio", 1.0)  # type: ignore[arg-type]


class ComponentsField(fields.Field):
    """Catalog names: comma-separated text (a query string) or an array of strings."""

    def _deserialize(self, value: Any, attr: str | None, data: Any, **kwargs: Any) -> list[str]:
        names = value.split(",") if isinstance(value, str) else value
        if not isinstance(names, list) or not all(isinstance(n, str) for n in names):
            raise ValidationError("must be catalog names, comma-separated or as an array of strings")
        names = [n.strip() for n in names]
        if not 2 <= len(names) <= _MOST_COMPONENTS or not all(names):
            raise ValidationError(f"give 2 to {_MOST_COMPONENTS} names, none empty")
        for name in names:
            printable(name)
        return names


class FractionsField(fields.Field):
    """One composition (comma-separated text, or an array of numbers) or, in a POST body, one per point (an
    array of arrays of one length): a float array of 1 or 2 dimensions."""

    def _deserialize(self, value: Any, attr: str | None, data: Any, **kwargs: Any) -> np.ndarray:
        if isinstance(value, str):
            return np.array([parse_number(text.strip()) for text in value.split(",")])
        if isinstance(value, np.ndarray) and value.ndim == 2:  # a CSV body's columns
            return _rows(value)
        if isinstance(value, list) and value and isinstance(value[0], list):
            return _rows(value)
        array = finite_numbers(value)
        if not isinstance(array, np.ndarray) or array.ndim != 1 or not array.size:
            raise ValidationError("must be numbers, one per component, or an array of such arrays")
        return array


def _rows(value: list[Any]) -> np.ndarray:
    """An array of arrays of numbers, one length each, as a 2-D float array: numpy reads the nested lists in one
    pass (a row-by-row check would cost seconds at the point limit); what it reads as other than numbers of one
    shape is refused."""
    try:
        rows = np.array(value)
    except ValueError:  # ragged: numpy refuses an inhomogeneous shape
        raise ValidationError("every composition has one number per component") from None
    if rows.ndim != 2 or rows.dtype.kind not in "iuf" or not rows.shape[1]:
        raise ValidationError("must be an array of arrays of numbers, one number per component")
    rows = rows.astype(float)
    if not np.isfinite(rows).all():
        raise ValidationError("every number must be finite")
    return rows


COMPONENTS = ComponentsField(
    metadata={
        "description": "Catalog ids or names of the components (2 to 10), comma-separated in a query string.",
        "oneOf": [{"type": "string"}, {"type": "array", "items": {"type": "string"}, "minItems": 2, "maxItems": 10}],
        "example": "ethanol,water",
    },
)
FRACTIONS = FractionsField(
    metadata={
        "description": "Fractions of the components in `basis`, in their order, summing to 1 within 1e-6; in a POST "
        "body also an array of such arrays, one composition per point.",
        "oneOf": [
            {"type": "string"},
            {"type": "array", "items": {"type": "number"}},
            {"type": "array", "items": {"type": "array", "items": {"type": "number"}}},
        ],
        "example": "0.1,0.9",
    },
)
BASIS = fields.String(
    load_default="mole",
    validate=validate.OneOf(["mole", "mass"]),
    metadata={"description": "Whether fractions are mole or mass fractions, in the request and the answer."},
)
MODEL = fields.String(
    load_default="auto",
    validate=validate.OneOf(["auto", "nrtl", "wilson", "uniquac", "unifac", "unifac-dortmund", "ideal"]),
    metadata={
        "description": "auto: the built-in NRTL parameters where every pair has them, else the UNIFAC group "
        "prediction with a warning; nrtl, wilson, uniquac: that model's fitted pairs only (a missing pair "
        "refused); unifac: original UNIFAC; unifac-dortmund: modified UNIFAC (Dortmund); ideal: Raoult's law, for "
        "mixtures known to be ideal. Wilson's equation and Raoult's law cannot show two liquid phases: their "
        "mixtures are tested for them with the pair's NRTL or UNIQUAC set, else UNIFAC."
    },
)
TEMPERATURE = Input("temperature", "Temperature, instead of a pressure: the answer is then a pressure.")


def pair_sets() -> dict[PairModel, PairSet]:
    return current_app.extensions["pairs"]


def _answer(inputs: Inputs, dew: bool) -> dict[str, Any]:
    mix = _mixture(inputs)
    if inputs.options.get("fractions") is None:
        raise invalid("fractions", "is required")
    fractions = inputs.options["fractions"]
    basis: Basis = inputs.options["basis"]
    rows = np.broadcast_to(fractions, (*inputs.shape, fractions.shape[-1]))
    given_pressure = any(inputs.get(name) is not None for name in PRESSURE_INPUTS)
    found = phase_point(mix, dew, rows, basis, readings(inputs) if given_pressure else None, inputs.get("temperature"))
    p_unit, t_unit = inputs.units["pressure"], inputs.units["temperature"]
    kind = "dew" if dew else "bubble"
    if given_pressure:
        head = {**pressure_fields(inputs, found.local, p_unit), f"{kind}_point": quantity(found.temperature, t_unit)}
    else:
        head = {"temperature": inputs.echo("temperature", t_unit), f"{kind}_pressure": quantity(found.pressure, p_unit)}
    ids = [fluid.id for fluid in mix.components]
    fraction = Unit(f"{basis} fraction", "ratio", 1.0)  # type: ignore[arg-type]

    def by_component(values: np.ndarray, unit: Unit) -> dict[str, Any]:
        return {name: quantity(values[..., i], unit) for i, name in enumerate(ids)}

    answer = {
        "components": ids,
        **head,
        ("liquid_composition" if dew else "vapor_composition"): by_component(found.other, fraction),
        "k_values": by_component(found.k_values, RATIO),
        "activity_coefficients": by_component(found.gamma, RATIO),
    }
    if found.relative_volatility is not None:
        answer["relative_volatility"] = quantity(found.relative_volatility, RATIO)
    return {**answer, "model": mix.model, **provenance(found, inputs.units)}


def _mixture(inputs: Inputs) -> Mixture:
    """The request's components under its model; ``components`` is required."""
    if inputs.options.get("components") is None:
        raise invalid("components", "is required")
    components = [resolve_catalog_fluid(n) for n in inputs.options["components"]]
    return mixture(components, pair_sets(), current_app.extensions["groups"], inputs.options["model"])


def azeotrope_of(inputs: Inputs) -> dict[str, Any]:
    mix = _mixture(inputs)
    if len(mix.components) != 2:
        raise invalid("components", "an azeotrope is sought for two components")
    found = azeotrope(mix, readings(inputs))
    ids = [fluid.id for fluid in mix.components]
    point = None
    if found.composition is not None:
        point = {
            "temperature": quantity(found.temperature, inputs.units["temperature"]),
            "composition": {name: quantity(found.composition[i], _MOLE) for i, name in enumerate(ids)},
        }
    return {
        "components": ids,
        **pressure_fields(inputs, found.local, inputs.units["pressure"]),
        "azeotrope": point,
        "reason": found.reason,
        "model": mix.model,
        **provenance(found, inputs.units),
    }


def bubble_point(inputs: Inputs) -> dict[str, Any]:
    return _answer(inputs, dew=False)


def dew_point(inputs: Inputs) -> dict[str, Any]:
    return _answer(inputs, dew=True)


_COMMON = (
    "Give `components` and their `fractions`, and either a pressure (as /v1/boiling-point takes it: absolute, "
    "elevation, barometer or gauge reading) or a `temperature`. Modified Raoult's law with an ideal vapor: a "
    "low-pressure method, warned above 0.5 MPa and refused above 1 MPa; refused where a component is above its "
    "critical temperature, or where the liquid would split into two liquid phases by every model that tests the "
    "pair (its own, and modified UNIFAC (Dortmund) where it has the groups; a caution where they disagree). "
    "`k_values` are y/x; `relative_volatility` is K1/K2 for two components."
)

for _operation in (
    ComputingPath(
        path="/v1/bubble-point",
        name="BubblePoint",
        summary="Where a liquid mixture starts to boil",
        description="The bubble point of a liquid of the given composition (or, at a temperature, its bubble "
        "pressure) and the composition of the first vapor. " + _COMMON,
        inputs={**PRESSURE_INPUTS, "temperature": TEMPERATURE},
        options={"components": COMPONENTS, "fractions": FRACTIONS, "basis": BASIS, "model": MODEL},
        row_options={"fractions": "components"},
        dimensions=("pressure", "temperature", "length"),
        response=mixture_schemas.BubblePointAnswer,
        compute=bubble_point,
        example={"components": "ethanol,water", "fractions": "0.1,0.9", "elevation": 1420.0},
    ),
    ComputingPath(
        path="/v1/dew-point",
        name="DewPoint",
        summary="Where a vapor mixture starts to condense",
        description="The dew point of a vapor of the given composition (or, at a temperature, its dew pressure) "
        "and the composition of the first liquid. " + _COMMON,
        inputs={**PRESSURE_INPUTS, "temperature": TEMPERATURE},
        options={"components": COMPONENTS, "fractions": FRACTIONS, "basis": BASIS, "model": MODEL},
        row_options={"fractions": "components"},
        dimensions=("pressure", "temperature", "length"),
        response=mixture_schemas.DewPointAnswer,
        compute=dew_point,
        example={"components": "ethanol,water", "fractions": "0.4,0.6", "elevation": 1420.0},
    ),
    ComputingPath(
        path="/v1/azeotrope",
        name="Azeotrope",
        summary="The azeotrope of a binary liquid mixture at a pressure",
        description="Where the vapor of two `components` has the liquid's composition (their relative volatility "
        "passes through 1), at one pressure given as /v1/boiling-point takes it: its temperature and composition "
        "in mole fractions, or null and the reason. The same model and limits as /v1/bubble-point.",
        inputs=PRESSURE_INPUTS,
        options={"components": COMPONENTS, "model": MODEL},
        dimensions=("pressure", "temperature", "length"),
        response=mixture_schemas.AzeotropeAnswer,
        one_point=True,
        compute=azeotrope_of,
        example={"components": "ethanol,water", "elevation": 1420.0},
    ),
):
    _operation.register(blueprint)


@blueprint.get("/v1/pairs")
def list_pairs() -> Response:
    found = sorted((p for s in pair_sets().values() for p in s.pairs.values()), key=lambda p: (p.model, p.components))
    sizes = {model: s.sizes for model, s in pair_sets().items()}
    names = catalog().entries
    return cacheable(
        {
            "count": len(found),
            "pairs": [
                {
                    "components": list(p.components),
                    "names": [names[c].name for c in p.components],
                    "model": p.model,
                    "parameters": {**p.values, **_sizes(sizes[p.model], p.components)},
                    "temperature_min": quantity(p.t_min, UNITS["K"]),
                    "temperature_max": quantity(p.t_max, UNITS["K"]),
                    "source": p.source,
                }
                for p in found
            ],
        }
    )


def _sizes(sizes: dict[str, tuple[float, float]], components: tuple[str, str]) -> dict[str, float]:
    """UNIQUAC's r1, q1, r2, q2 where the model has them."""
    if not sizes:
        return {}
    (r1, q1), (r2, q2) = (sizes[c] for c in components)
    return {"r1": r1, "q1": q1, "r2": r2, "q2": q2}


document_get(
    "/v1/pairs",
    "listPairs",
    "The built-in binary interaction parameters, with their sources and temperature ranges",
    {"200": json_answer(mixture_schemas.PairList), "304": NOT_MODIFIED, **problem_responses((400, *GUARDED))},
    [],
)
