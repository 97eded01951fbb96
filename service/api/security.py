"""What guards every request: the query-string limit, the API key, the body's deadline and depth, CORS
and the security headers.

All of it is configured from environment variables (see ``service.config``).
"""

from __future__ import annotations

import contextlib
import hmac
from typing import Any

import numpy as np
from flask import Flask, Response, request

from service.api.problems import Problem

_GUARDED_PREFIX = "/v1/"
"""Only the API needs the key: probes, the metrics scraper and the documentation carry no token."""
_MAX_DEPTH = 16
"""Deepest JSON nesting a body may have; the deepest valid body nests three levels."""

SECURITY_HEADERS = {
    "X-Content-Type-Options": "nosniff",
    "Content-Security-Policy": "default-src 'none'; frame-ancestors 'none'",
    "Referrer-Policy": "no-referrer",
    "X-Frame-Options": "DENY",
}


def json_depth_exceeds(body: bytes, limit: int) -> bool:
    """True when the JSON text ``body`` nests arrays and objects deeper than ``limit``.

    Brackets inside strings do not count. Bodies with fewer brackets than the limit pass at
    once; others are scanned with numpy, without recursion: one pass over the bytes finds the
    brackets and quotes, and the rest works on those alone (a tenth of a body of numbers).

    >>> json_depth_exceeds(b'{"a": [[1], "[[[["]}', 3), json_depth_exceeds(b"[[[[1]]]]", 3)
    (False, True)
    """
    if body.count(b"[") + body.count(b"{") <= limit:
        return False
    text = np.frombuffer(body.replace(b"\\\\", b"").replace(b'\\"', b""), dtype=np.uint8)
    opens, closes = (text == 0x5B) | (text == 0x7B), (text == 0x5D) | (text == 0x7D)
    marks = text[np.flatnonzero(opens | closes | (text == 0x22))]
    outside = ~np.logical_xor.accumulate(marks == 0x22)  # an even number of quotes before: not in a string
    step = ((marks == 0x5B) | (marks == 0x7B)).view(np.int8) - ((marks == 0x5D) | (marks == 0x7D)).view(np.int8)
    return bool(np.cumsum(step * outside, dtype=np.int32).max(initial=0) > limit)


def read_body(seconds: float) -> bytes:
    """The request's body, which must arrive within ``seconds``: 408 when it does not.

    Under gunicorn's gevent worker a slow or stalled client only holds a greenlet, and the
    deadline (a ``gevent.Timeout``) ends its wait even while bytes trickle in. Elsewhere (the
    test client, a development server) nothing can interrupt a blocking read, and the body is read
    as it comes.
    """
    late = Problem(
        408,
        f"The request body did not arrive within {seconds:g} s (BOILING_BODY_TIMEOUT): send it whole, at once.",
        {"body": ["arrived too slowly"]},
    )
    with _deadline(seconds, late):
        return request.get_data()


def _deadline(seconds: float, late: Problem) -> contextlib.AbstractContextManager[Any]:
    """A context that raises ``late`` after ``seconds``, where the server runs on gevent's event loop."""
    try:
        from gevent import Timeout  # noqa: PLC0415 (gevent is only used under its gunicorn worker)
        from gevent.monkey import is_module_patched  # noqa: PLC0415
    except ImportError:  # pragma: no cover (gevent is a dependency of the service)
        return contextlib.nullcontext()
    return Timeout(seconds, late) if is_module_patched("socket") else contextlib.nullcontext()


def install(app: Flask) -> None:
    """Register the request guards on ``app``."""
    api_key = app.config.get("API_KEY") or ""
    origins = frozenset(app.config.get("CORS_ORIGINS") or ())
    max_query = app.config["MAX_QUERY_BYTES"]
    body_seconds = app.config["BODY_TIMEOUT"]

    @app.before_request
    def _guard() -> Response | None:
        if len(request.query_string) > max_query:
            raise Problem(414, f"The query string has {len(request.query_string)} bytes; the limit is {max_query}.")
        if request.method == "OPTIONS":
            return None
        if api_key and request.path.startswith(_GUARDED_PREFIX):
            scheme, _, token = request.headers.get("Authorization", "").strip().partition(" ")
            # The scheme name is case-insensitive (RFC 9110, section 11.1).
            if scheme.lower() != "bearer" or not hmac.compare_digest(token.strip().encode(), api_key.encode()):
                raise Problem(
                    401,
                    "This service needs an API key: send Authorization: Bearer <key>.",
                    headers={"WWW-Authenticate": 'Bearer realm="boiling-point"'},
                )
        if request.method == "POST":
            body = read_body(body_seconds)
            if request.is_json and json_depth_exceeds(body, _MAX_DEPTH):
                raise Problem(
                    400, f"The JSON body nests deeper than {_MAX_DEPTH} levels.", {"body": ["nested too deep"]}
                )
        return None

    @app.after_request
    def _headers(response: Response) -> Response:
        for name, value in SECURITY_HEADERS.items():  # a view may set its own policy (the explorer page does)
            response.headers.setdefault(name, value)
        origin = request.headers.get("Origin")
        if origin and origin in origins:
            response.headers["Access-Control-Allow-Origin"] = origin
            response.headers["Access-Control-Allow-Methods"] = "GET, POST, OPTIONS"
            response.headers["Access-Control-Allow-Headers"] = "Authorization, Content-Type, X-Request-ID"
            response.headers["Access-Control-Expose-Headers"] = "ETag, X-Request-ID"
            response.headers["Access-Control-Max-Age"] = "600"
            response.vary.add("Origin")
        return response
