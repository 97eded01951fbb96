"""Computing paths: one declaration gives the GET and POST views and their OpenAPI entry.

Each operation names its input quantities once. From that list come the query-string
schema of its GET (plain numbers in the request's units), the JSON-body schema of its POST
(numbers, arrays, or ``{"value", "unit"}`` objects), and the parser that turns either into
SI numpy arrays broadcast to one shape, ready for one vectorised call into the physics.
A POST's query string may carry the same options and single values as a GET's.
"""

from __future__ import annotations

import copy
import math
from collections.abc import Callable, Mapping
from dataclasses import dataclass, field
from typing import Any

import numpy as np
from flask import Blueprint, Response, current_app, g, request
from marshmallow import Schema, ValidationError, fields, missing, validate
from numpy.typing import NDArray

from service.api.field_loader import FieldLoader
from service.api.numbers import Number, WholeNumber, all_finite, parse_number, printable
from service.api.problems import Problem, invalid
from service.api.quantity_fields import Quantity, QuantityField, UnitField, quantity
from service.api.refusals import problem
from service.api.rendering import chosen_format, finish, render, respond
from service.api.request_body import csv_table, json_object, query_args
from service.fluids.limits import Refusal
from service.physics.array_blocks import Numbers
from service.physics.units import Dimension, Reference, Unit, default_unit, resolve_unit

UNIT_DESCRIPTIONS = {
    "pressure": "Unit of every pressure in the request and the answer.",
    "temperature": "Unit of every temperature in the request and the answer.",
    "length": "Unit of every elevation and length in the request and the answer.",
    "concentration": "Unit of `concentration`: wt% (the default), g/kg, mol/kg, or degBx for sucrose.",
}


COMPUTING_PATHS: list[ComputingPath] = []
"""Every registered computing operation, in registration order."""


@dataclass(frozen=True)
class Input:
    """One input quantity of an operation; ``reference`` says whether a pressure is absolute or gauge."""

    dimension: Dimension
    description: str
    required: bool = False
    reference: Reference | None = None


@dataclass(frozen=True, slots=True)
class Inputs:
    """A parsed request: SI arrays of one shape (or single numpy scalars), units, and the other options.

    ``sent`` keeps each input quantity as the request wrote it, so that an answer can echo it unchanged.
    """

    values: dict[str, Numbers]
    units: dict[str, Unit]
    options: dict[str, Any]
    shape: tuple[int, ...]
    sent: dict[str, Quantity] = field(default_factory=dict)

    def get(self, name: str) -> Numbers | None:
        return self.values.get(name)

    def echo(self, name: str, unit: Unit) -> dict[str, Any]:
        """Input ``name`` as ``{"value", "unit"}`` in ``unit``: the numbers as sent where the units agree
        (200 degF comes back as 200, not as 200.00000000000006 from a round trip through kelvin)."""
        sent = self.sent[name]
        if sent.unit is not None and sent.unit.code != unit.code:
            return quantity(self.values[name], unit)
        value = sent.value
        if self.shape:
            value = np.broadcast_to(np.asarray(value, dtype=float), self.shape)
        return {"value": np.ascontiguousarray(value) if self.shape else float(value), "unit": unit.code}


TAG_TEXT = [validate.Length(min=1, max=200), printable]
TAG = fields.String(
    validate=TAG_TEXT,
    metadata={
        "description": "A label echoed beside the answer (an instrument tag, say), so a caller matches answers "
        "to its instruments by name."
    },
)


class TagField(fields.Field):
    """A POST's ``tag``: one string, or a non-empty array of strings (one per point; ``parse`` checks the count)."""

    def _deserialize(self, value: Any, attr: str | None, data: Any, **kwargs: Any) -> str | list[str]:
        tags = value if isinstance(value, list) else [value]
        if not tags or not all(isinstance(t, str) for t in tags):
            raise ValidationError("must be a string or a non-empty array of strings")
        for text in tags:
            for check in TAG_TEXT:
                check(text)
        return value


BODY_TAG = TagField(
    metadata={
        "description": "A label, or an array of labels one per point, echoed beside the answer so a dashboard "
        "matches answers to its instruments by name, not by order.",
        "oneOf": [
            {"type": "string", "minLength": 1, "maxLength": 200},
            {"type": "array", "minItems": 1, "items": {"type": "string", "minLength": 1, "maxLength": 200}},
        ],
    }
)
DIGITS = WholeNumber(
    validate=validate.Range(min=1, max=17),
    metadata={
        "description": "Round every number of the answer to this many significant digits (default: full "
        "precision, which parses back to the same double)."
    },
)


@dataclass
class ComputingPath:
    """A computing path, answered on GET (query string) and POST (JSON or CSV body)."""

    path: str
    name: str
    summary: str
    description: str
    inputs: Mapping[str, Input]
    options: Mapping[str, fields.Field]
    dimensions: tuple[Dimension, ...]
    response: type[Schema]
    compute: Callable[[Inputs], dict[str, Any]]
    example: dict[str, Any]
    body_options: Mapping[str, fields.Field] = field(default_factory=dict)
    """Options that take another field in a POST body than in the query string."""
    row_options: Mapping[str, str] = field(default_factory=dict)
    """Options that may give one row per point (a list of lists in a POST body, loaded as a 2-D array): their
    rows broadcast with the input arrays as one more array would. Each names the option whose comma-separated
    names label its columns in a CSV body (``fractions`` by ``components``: ``fractions.ethanol``)."""
    one_point: bool = False
    """Whether the path answers one point per request (its POST then takes single values only)."""
    errors: tuple[int, ...] = (400, 404, 422)
    """Problem statuses of the GET; the POST adds 408, 413 and 415."""
    fields: dict[str, dict[str, fields.Field]] = field(init=False, repr=False)
    """The fields of the query string, the POST body and the POST query string, by kind."""
    query_schema: type[Schema] = field(init=False)
    body_schema: type[Schema] = field(init=False)
    post_query_schema: type[Schema] = field(init=False)
    _loaders: dict[str, FieldLoader] = field(init=False, repr=False)

    def __post_init__(self) -> None:
        units = {f"{d}_unit": UnitField(d, metadata={"description": UNIT_DESCRIPTIONS[d]}) for d in self.dimensions}

        def numbers(required: bool) -> dict[str, fields.Field]:
            return {
                n: Number(
                    required=required and s.required,
                    metadata={"description": f"{s.description} In `{s.dimension}_unit`."},
                )
                for n, s in self.inputs.items()
            }

        body = {
            n: QuantityField(
                s.dimension,
                s.reference,
                required=s.required,
                metadata={
                    "description": f"{s.description} A number, an array of "
                    f"numbers, or an object with `value` and `unit`."
                },
            )
            for n, s in self.inputs.items()
        }
        common = {"tag": TAG, "digits": DIGITS}
        self.fields = {
            "query": {**numbers(True), **units, "format": _format_field("json", "text"), **self.options, **common},
            "body": {**body, **units, **self.options, **self.body_options, "tag": BODY_TAG, "digits": DIGITS},
            # Documented without defaults: a client that sent them would clash with the body's own values.
            "post_query": {
                **numbers(False),
                **units,
                "format": _format_field("json", "csv"),
                **{name: _without_default(f) for name, f in {**self.options, **common}.items()},
            },
        }
        self.query_schema, self.body_schema, self.post_query_schema = (
            Schema.from_dict(self.fields[kind], name=f"{self.name}{suffix}")
            for kind, suffix in (("query", "Query"), ("body", "Body"), ("post_query", "PostQuery"))
        )
        self._loaders = {
            "query": FieldLoader(self.fields["query"]),
            "body": FieldLoader(self.fields["body"]),
            "format": FieldLoader({"format": _format_field("json", "csv")}),
        }

    def parse(self, data: Mapping[str, Any], kind: str) -> Inputs:
        """Load ``data`` as a ``query`` or ``body`` and convert its quantities to broadcast SI arrays.

        A single value stays a numpy scalar: the physics gives it the same floats as an array element.
        """
        loaded = self._loaders[kind].load(data)
        units = {d: loaded.pop(f"{d}_unit", None) or default_unit(d) for d in self.dimensions}
        values: dict[str, Numbers] = {}
        sent: dict[str, Quantity] = {}
        for name, spec in self.inputs.items():
            raw = loaded.pop(name, None)
            if raw is None:
                continue
            sent[name] = given = raw if isinstance(raw, Quantity) else Quantity(raw)
            unit = given.unit or units[spec.dimension]
            if unit.reference == "absolute" and spec.reference == "gauge":  # pressure_unit=psia, say
                raise invalid(
                    name,
                    f"pressure_unit marks absolute pressures, and {name} is a gauge reading: "
                    f"use pressure_unit={unit.code}, or give {name} its own unit",
                )
            values[name] = si = _in_si(given.value, unit)
            if not all_finite(si):
                raise Problem(
                    422,
                    f"{name}: a value is too large to be a {spec.dimension} in SI units.",
                    {name: ["beyond the range of double-precision numbers once converted to SI"]},
                )
        shapes = {name: np.shape(v) for name, v in values.items()}
        for name in self.row_options:
            rows = loaded.get(name)
            if isinstance(rows, np.ndarray) and rows.ndim == 2:
                shapes[name] = rows.shape[:1]
        shape = _broadcast_shape(shapes)
        if shape and self.one_point:
            first = next(name for name, s in shapes.items() if s)
            raise invalid(first, f"{self.path} answers one point per request: give single values")
        tag = loaded.get("tag")
        if isinstance(tag, list) and (len(tag),) != (shape or (1,)):
            raise invalid(
                "tag", f"has {len(tag)} labels for {math.prod(shape)} points: give one per point, or one string"
            )
        limit = current_app.config["MAX_POINTS"]
        size = math.prod(shape)
        if size > limit:
            raise Problem(413, f"{size} points in one request; the limit is {limit}.")
        if shape:  # single values need no broadcasting
            values = {k: np.broadcast_to(v, shape) for k, v in values.items()}
        g.points = size  # for the points-computed metric
        return Inputs(values, units, loaded, shape, sent)

    def view(self) -> Response:
        if request.method in ("GET", "HEAD"):
            return current_app.extensions["answers"].answer(self._answer_get)
        args = query_args()
        requested = self._loaders["format"].load({"format": args.pop("format")})["format"] if "format" in args else None
        if request.mimetype == "text/csv":
            labels = {name: (key, _labels(args.get(key))) for name, key in self.row_options.items()}
            sent = csv_table(request.get_data(), (*self.inputs, "tag"), labels)
        elif request.is_json:
            sent = json_object(request.get_data())
        else:
            raise Problem(415, "POST bodies are JSON (application/json) or CSV (text/csv).")
        inputs = self.parse(self._with_query(sent, args), "body")
        return respond(self.answer(inputs), chosen_format(requested, ("csv",)), inputs.shape)

    def _answer_get(self) -> tuple[bytes, str]:
        inputs = self.parse(query_args(), "query")
        return render(self.answer(inputs), chosen_format(inputs.options.pop("format", None), ("text",)), inputs.shape)

    def answer(self, inputs: Inputs) -> dict[str, Any]:
        """The answer with its tag and rounding; refused with 422 if a number is not finite (JSON would show null)."""
        try:
            computed = self.compute(inputs)
        except Refusal as refusal:
            raise problem(refusal, inputs.units) from None
        answer = finish(computed, inputs.options.get("tag"), inputs.options.get("digits"), inputs.shape)
        for name, value in answer.items():
            if isinstance(value, dict) and "value" in value and not all_finite(value["value"]):
                raise Problem(
                    422,
                    f"{name}: the equations give no finite answer for these inputs.",
                    {name: ["not a finite number"]},
                )
        return answer

    def _with_query(self, body: dict[str, Any], args: dict[str, str]) -> dict[str, Any]:
        """The body with the query string's options and single values; a name given in both is refused,
        but for a unit given alike in both."""
        merged = dict(body)
        for name, text in args.items():
            if name in body:
                if name.endswith("_unit") and _same_unit(body[name], text, name.removesuffix("_unit")):
                    continue
                raise invalid(name, "given both in the query string and the body")
            if name in self.inputs:
                try:
                    merged[name] = parse_number(text)
                except ValidationError as error:
                    raise invalid(name, str(error.messages[0])) from None
            else:
                merged[name] = text
        return merged

    def register(self, blueprint: Blueprint) -> None:
        """Answer GET and POST on ``blueprint`` and list the operation in the OpenAPI document."""
        blueprint.add_url_rule(self.path, self.name, self.view, methods=["GET", "POST"])
        COMPUTING_PATHS.append(self)


def _in_si(value: Numbers, unit: Unit) -> NDArray[np.float64] | np.float64:
    """``value`` converted from ``unit`` to SI: an array, or a single value as a numpy scalar.

    A value too large for SI comes out infinite (refused by the caller): Python's float arithmetic
    does so silently, and numpy's is told to.
    """
    if isinstance(value, np.ndarray):
        with np.errstate(over="ignore"):
            return unit.to_si(value)
    return np.float64(unit.to_si(float(value)))


def _broadcast_shape(shapes: Mapping[str, tuple[int, ...]]) -> tuple[int, ...]:
    if not any(shapes.values()):
        return ()
    try:
        shape = np.broadcast_shapes(*shapes.values())
    except ValueError:
        lengths = ", ".join(f"{n} has {s[0]}" for n, s in shapes.items() if s)
        raise Problem(
            400,
            f"arrays must have one length (or be single numbers): {lengths}",
            {n: [f"length {s[0]}"] for n, s in shapes.items() if s},
        ) from None
    return shape


def _same_unit(a: object, b: str, dimension: str) -> bool:
    """Whether two spellings name one unit (``BAR`` and ``bar``); anything unreadable counts as different."""
    try:
        return isinstance(a, str) and resolve_unit(a, dimension) == resolve_unit(b, dimension)  # type: ignore[arg-type]
    except KeyError:
        return False


def _without_default(field: fields.Field) -> fields.Field:
    """A copy of ``field`` that fills in nothing when left out."""
    bare = copy.copy(field)
    bare.load_default = missing
    return bare


def _format_field(*formats: str) -> fields.String:
    return fields.String(
        validate=validate.OneOf(formats),
        metadata={
            "description": f"Answer as {' or '.join(formats)}; without it the Accept header decides (JSON by default)."
        },
    )


def _labels(text: str | None) -> list[str] | None:
    """The comma-separated names of a query parameter, stripped; None where it is absent."""
    return None if text is None else [name.strip() for name in text.split(",")]
