"""Loading a request against a flat marshmallow schema, visiting only the fields it gives.

``Schema.load`` walks every declared field on every call; a query string carries two or
three of a path's dozen. :class:`FieldLoader` deserializes the given keys with the schema's
own fields (their types, validators and messages) and fills in the rest from the fields'
defaults, so that it answers as ``Schema.load`` does: the same values, and the same errors
(``Unknown field.``, ``Missing data for required field.``) in one ``ValidationError``.
``tests/api/test_loader.py`` holds it to that for every computing path.
"""

from __future__ import annotations

from collections.abc import Mapping
from typing import Any

from marshmallow import RAISE, Schema, ValidationError, missing


class FieldLoader:
    """``schema.load`` for a schema of plain fields: no hooks, data keys or attributes; unknown keys refused."""

    def __init__(self, schema: Schema) -> None:
        plain = (
            not any(schema._hooks.values())  # marshmallow keeps pre/post_load and validates_schema hooks here
            and not any(f.data_key or f.attribute for f in schema.load_fields.values())
            and schema.unknown == RAISE
            and not schema.many
        )
        if not plain:
            raise TypeError(
                f"{type(schema).__name__} has hooks, data keys, attributes, many=True or a lenient "
                "`unknown`: load it with Schema.load"
            )
        self.fields = dict(schema.load_fields)
        self.unknown_message = schema.error_messages["unknown"]
        self.required = [name for name, f in self.fields.items() if f.required]
        self.defaults = {name: f.load_default for name, f in self.fields.items() if f.load_default is not missing}

    def load(self, data: Mapping[str, Any]) -> dict[str, Any]:
        """The loaded values of ``data``, with defaults for what it leaves out; ValidationError otherwise."""
        loaded = {name: value() if callable(value) else value for name, value in self.defaults.items()}
        errors: dict[str, Any] = {}
        unknown = []
        for name, value in data.items():
            field = self.fields.get(name)
            if field is None:
                unknown.append(name)
                continue
            try:
                loaded[name] = field.deserialize(value, name, data)
            except ValidationError as error:
                errors[name] = error.messages
        for name in self.required:
            if name not in data:
                errors[name] = [self.fields[name].error_messages["required"]]
        if errors or unknown:  # in declaration order, then the unknown keys, as Schema.load lists them
            ordered = {name: errors[name] for name in self.fields if name in errors}
            raise ValidationError(ordered | {name: [self.unknown_message] for name in unknown})
        return loaded
