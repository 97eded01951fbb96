"""The lean loader (``service.api.field_loader.FieldLoader``) answers as marshmallow's Schema.load does,
for every computing path.

``COMPUTING_PATHS`` fills as the path modules are imported; this module imports them itself, so that its cases
do not depend on another test module having built the app before it is collected.
"""

from typing import Any

import pytest
from marshmallow import ValidationError, fields

from service.api.computing_path import COMPUTING_PATHS
from service.api.field_loader import FieldLoader
from service.api.paths import blueprints
from service.api.quantity_fields import Quantity

blueprints()  # imports every path module in the package's order, which fills COMPUTING_PATHS as the app does

# Queries and bodies of every kind: valid, wrong types, unknown keys, NaN, bad units, nested fluids.
SAMPLES: list[dict[str, Any]] = [
    {},
    {"pressure": "101.325"},
    {"pressure": "abc", "fluid": "ethanol"},
    {"gauge_pressure": "950", "elevation": "1420", "pressure_unit": "psig"},
    {"temperature": "nan", "extrapolate": "maybe", "nonsense": "1"},
    {"elevation": "1e400", "format": "xml", "length_unit": "ft", "other": "x", "zzz": "y"},
    {"pressure": [1.0, 2.0], "fluid": {"boiling_point": 78.4}},
    {"pressure": {"value": [1, 2], "unit": "bar"}, "fluid": {"equation": "antoine", "A": 1}},
    {"temperature": None, "fluid": 5, "extrapolate": True},
    {"static_head": "2", "friction_loss": "-1", "temperature": "20", "tolerance": "-0.5"},
]


def outcome(load: Any, data: dict[str, Any]) -> tuple[str, Any]:
    try:
        loaded = load(data)
    except ValidationError as error:
        return "refused", error.messages
    return "loaded", {k: (v.value.tolist(), v.unit) if isinstance(v, Quantity) else v for k, v in loaded.items()}


@pytest.mark.parametrize("operation", COMPUTING_PATHS, ids=lambda o: o.path)
@pytest.mark.parametrize("kind", ["query", "body", "post_query"])
def test_same_values_and_errors_as_schema_load(operation, kind) -> None:
    schema = {
        "query": operation.query_schema,
        "body": operation.body_schema,
        "post_query": operation.post_query_schema,
    }[kind]()
    for data in SAMPLES:
        expected, got = outcome(schema.load, data), outcome(FieldLoader(operation.fields[kind]).load, data)
        assert got == expected, data
        if got[0] == "refused":  # declared fields' errors in declaration order (Schema.load lists unknown keys
            declared = [name for name in got[1] if name in operation.fields[kind]]  # in set order, so not those)
            assert declared == [name for name in expected[1] if name in operation.fields[kind]], data


def test_fields_it_cannot_load_alike_are_refused() -> None:
    with pytest.raises(TypeError, match=r"Schema\.load"):
        FieldLoader({"x": fields.Float(attribute="y")})
    with pytest.raises(TypeError, match=r"Schema\.load"):
        FieldLoader({"x": fields.Float(data_key="y")})
