"""Computing operations: one declaration gives the GET and POST views and their OpenAPI entry.

Each operation names its input quantities once. From that list come the query-string
schema of its GET (plain numbers in the request's units), the JSON-body schema of its POST
(numbers, arrays, or ``{"value", "unit"}`` objects), and the parser that turns either into
SI numpy arrays broadcast to one shape, ready for one vectorised call into the physics.
"""

from __future__ import annotations

import math
from collections.abc import Callable, Mapping
from dataclasses import dataclass, field
from typing import Any

import numpy as np
from flask import Blueprint, Response, current_app, g, request
from marshmallow import Schema, fields, validate
from numpy.typing import NDArray
from werkzeug.exceptions import BadRequest

from service.api.formats import chosen_format, csv_columns, render, respond
from service.api.loader import FieldLoader
from service.api.problems import Problem, invalid
from service.api.quantities import Numbers, Quantity, QuantityField, UnitField, all_finite
from service.physics.units import Dimension, Unit, default_unit, resolve_unit

UNIT_DESCRIPTIONS = {
    "pressure": "Unit of every pressure in the request and the answer.",
    "temperature": "Unit of every temperature in the request and the answer.",
    "length": "Unit of every elevation and length in the request and the answer.",
}


OPERATIONS: list[Operation] = []
"""Every registered computing operation, in registration order."""


@dataclass(frozen=True)
class Input:
    """One input quantity of an operation."""

    dimension: Dimension
    description: str
    required: bool = False


@dataclass(frozen=True, slots=True)
class Inputs:
    """A parsed request: SI arrays of one shape (or single numpy scalars), units, and the other options."""

    values: dict[str, Numbers]
    units: dict[str, Unit]
    options: dict[str, Any]
    shape: tuple[int, ...]

    def get(self, name: str) -> Numbers | None:
        return self.values.get(name)


@dataclass
class Operation:
    """A computing path, answered on GET (query string) and POST (JSON body)."""

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
    errors: tuple[int, ...] = (400, 404, 422)
    """Problem statuses of the GET; the POST adds 413 and 415."""
    query_schema: type[Schema] = field(init=False)
    body_schema: type[Schema] = field(init=False)
    units_schema: type[Schema] = field(init=False)
    _loaders: dict[str, FieldLoader] = field(init=False, repr=False)

    def __post_init__(self) -> None:
        units = {f"{d}_unit": UnitField(d, metadata={"description": UNIT_DESCRIPTIONS[d]}) for d in self.dimensions}
        query = {
            n: fields.Float(
                allow_nan=False,
                required=s.required,
                metadata={"description": f"{s.description} In `{s.dimension}_unit`."},
            )
            for n, s in self.inputs.items()
        }
        body = {
            n: QuantityField(
                s.dimension,
                required=s.required,
                metadata={
                    "description": f"{s.description} A number, an array of "
                    f"numbers, or an object with `value` and `unit`."
                },
            )
            for n, s in self.inputs.items()
        }
        self.query_schema = Schema.from_dict(
            name=f"{self.name}Query", fields={**query, **units, "format": _format_field("json", "text"), **self.options}
        )
        self.body_schema = Schema.from_dict(
            name=f"{self.name}Body", fields={**body, **units, **self.options, **self.body_options}
        )
        self.units_schema = Schema.from_dict(
            name=f"{self.name}Units", fields={**units, "format": _format_field("json", "csv")}
        )
        # Built once: a schema instance deep-copies its fields, too slow to repeat per request.
        self._loaders = {
            "query": FieldLoader(self.query_schema()),
            "body": FieldLoader(self.body_schema()),
            "units": FieldLoader(self.units_schema()),
        }

    def parse(self, data: Mapping[str, Any], kind: str) -> Inputs:
        """Load ``data`` as a ``query`` or ``body`` and convert its quantities to broadcast SI arrays.

        A single value stays a numpy scalar: the physics gives it the same floats as an array element.
        """
        loaded = self._loaders[kind].load(data)
        units = {d: loaded.pop(f"{d}_unit", None) or default_unit(d) for d in self.dimensions}
        values: dict[str, Numbers] = {}
        for name, spec in self.inputs.items():
            raw = loaded.pop(name, None)
            if raw is None:
                continue
            given = raw if isinstance(raw, Quantity) else Quantity(raw)
            values[name] = si = _in_si(given.value, given.unit or units[spec.dimension])
            if not all_finite(si):
                raise Problem(
                    422,
                    f"{name}: a value is too large to be a {spec.dimension} in SI units.",
                    {name: ["beyond the range of double-precision numbers once converted to SI"]},
                )
        shape = _broadcast_shape(values)
        limit = current_app.config["MAX_POINTS"]
        size = math.prod(shape)
        if size > limit:
            raise Problem(413, f"{size} points in one request; the limit is {limit}.")
        if shape:  # single values need no broadcasting
            values = {k: np.broadcast_to(v, shape) for k, v in values.items()}
        g.points = size  # for the points-computed metric
        return Inputs(values, units, loaded, shape)

    def view(self) -> Response:
        if request.method in ("GET", "HEAD"):
            return current_app.extensions["answers"].answer(self._answer_get)
        args = query_args()
        requested = (
            self._loaders["units"].load({"format": args.pop("format")}).get("format") if "format" in args else None
        )
        if request.mimetype == "text/csv":
            body = self._csv_body(args)
        else:
            self._loaders["units"].load(args)
            body = _json_body(args)
        return respond(self._computed(self.parse(body, "body")), chosen_format(requested, ("csv",)))

    def _answer_get(self) -> tuple[bytes, str]:
        inputs = self.parse(query_args(), "query")
        return render(self._computed(inputs), chosen_format(inputs.options.pop("format", None), ("text",)))

    def _computed(self, inputs: Inputs) -> dict[str, Any]:
        """The answer, refused with 422 if any of its numbers is not finite (JSON would show null)."""
        answer = self.compute(inputs)
        for name, value in answer.items():
            if isinstance(value, dict) and "value" in value and not all_finite(value["value"]):
                raise Problem(
                    422,
                    f"{name}: the equations give no finite answer for these inputs.",
                    {name: ["not a finite number"]},
                )
        return answer

    def _csv_body(self, args: dict[str, str]) -> dict[str, Any]:
        """A CSV body's columns as quantities; options and single values come from the query string."""
        columns = csv_columns(request.get_data(as_text=True))
        for name in columns:
            if name not in self.inputs:
                raise invalid(name, f"not an input of this path; columns may be {', '.join(self.inputs)}")
            if name in args:
                raise invalid(name, "given both as a column and in the query string")
        body: dict[str, Any] = dict(args)
        for name in set(args) & set(self.inputs):
            try:
                body[name] = float(args[name])
            except ValueError:
                raise invalid(name, "must be a number") from None
        return body | columns

    def register(self, blueprint: Blueprint) -> None:
        """Answer GET and POST on ``blueprint`` and list the operation in the OpenAPI document."""
        blueprint.add_url_rule(self.path, self.name, self.view, methods=["GET", "POST"])
        OPERATIONS.append(self)


def _in_si(value: Numbers, unit: Unit) -> NDArray[np.float64] | np.float64:
    """``value`` converted from ``unit`` to SI: an array, or a single value as a numpy scalar.

    A value too large for SI comes out infinite (refused by the caller): Python's float arithmetic
    does so silently, and numpy's is told to.
    """
    if isinstance(value, np.ndarray):
        with np.errstate(over="ignore"):
            return unit.to_si(value)
    return np.float64(unit.to_si(float(value)))


def _broadcast_shape(values: Mapping[str, NDArray]) -> tuple[int, ...]:
    shapes = {name: v.shape for name, v in values.items()}
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


def query_args() -> dict[str, str]:
    """The query string as a dict; a parameter given twice is refused."""
    pairs = list(request.args.items(multi=True))
    args = dict(pairs)
    if len(args) < len(pairs):
        repeated = next(key for key in args if len(request.args.getlist(key)) > 1)
        raise invalid(repeated, "given more than once")
    return args


def _json_body(query: dict[str, Any]) -> dict[str, Any]:
    """The JSON object of a POST, with the units its query string sets."""
    if not request.is_json:
        raise Problem(415, "POST bodies are JSON (application/json) or CSV (text/csv).")
    try:
        body = request.get_json()
    except BadRequest:
        raise invalid(
            "body", "is not valid JSON (NaN, Infinity and numbers beyond double range are not JSON)"
        ) from None
    if not isinstance(body, dict):
        raise invalid("body", "must be a JSON object")
    for key in query:
        if key.endswith("_unit"):
            if key in body and not _same_unit(body[key], request.args[key], key.removesuffix("_unit")):
                raise invalid(key, "given in the query string and the body with different values")
            body[key] = request.args[key]
    return body


def _same_unit(a: object, b: str, dimension: str) -> bool:
    """Whether two spellings name one unit (``BAR`` and ``bar``); anything unreadable counts as different."""
    try:
        return isinstance(a, str) and resolve_unit(a, dimension) == resolve_unit(b, dimension)  # type: ignore[arg-type]
    except KeyError:
        return False


def _format_field(*formats: str) -> fields.String:
    return fields.String(
        validate=validate.OneOf(formats),
        metadata={
            "description": f"Answer as {' or '.join(formats)}; without it the Accept header decides (JSON by default)."
        },
    )
