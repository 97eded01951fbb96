"""Flask JSON provider on orjson: fast, strict (no NaN), numpy-aware."""

from __future__ import annotations

from typing import Any

import orjson
from flask.json.provider import JSONProvider

_OPTIONS = orjson.OPT_SERIALIZE_NUMPY


def encode(obj: Any) -> bytes:
    """``obj`` as JSON bytes; numpy arrays and scalars are written directly."""
    return orjson.dumps(obj, option=_OPTIONS)


class OrjsonProvider(JSONProvider):
    """Encode with orjson; decoding refuses NaN and Infinity, which JSON does not have."""

    def dumps(self, obj: Any, **kwargs: Any) -> str:
        return encode(obj).decode()

    def loads(self, s: str | bytes, **kwargs: Any) -> Any:
        return orjson.loads(s)
