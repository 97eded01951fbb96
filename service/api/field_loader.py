"""Loading a request with a flat set of marshmallow fields, visiting only the fields it gives.

``Schema.load`` walks every declared field on every call; a query string carries two or
three of a path's dozen. :class:`FieldLoader` deserializes the given keys with the same
fields (their types, validators and messages) and fills in the rest from the fields'
defaults, so that it answers as ``Schema.load`` on ``Schema.from_dict(fields)`` does: the
same values, and the same errors (``Unknown field.``, ``Missing data for required field.``)
in one ``ValidationError``. ``tests/api/test_field_loader.py`` holds it to that for every
computing path; ``make bench-devices`` measures what it saves (bench/README.md).
"""

from __future__ import annotations

from collections.abc import Mapping
from typing import Any

from marshmallow import ValidationError, fields, missing

UNKNOWN = "Unknown field."
"""marshmallow's message for a key no field declares (it keeps it privately; the tests pin the text)."""


class FieldLoader:
    """``Schema.from_dict(fields)().load`` for plain fields: no data keys or attributes; unknown keys refused."""

    def __init__(self, declared: Mapping[str, fields.Field]) -> None:
        renamed = [name for name, f in declared.items() if f.data_key or f.attribute]
        if renamed:
            raise TypeError(f"{', '.join(renamed)}: a field with data_key or attribute needs Schema.load")
        self.fields = dict(declared)
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
            raise ValidationError(ordered | {name: [UNKNOWN] for name in unknown})
        return loaded
