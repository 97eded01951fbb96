"""What every request passes through: request ids, limits, the API key, CORS, security headers,
metrics and the structured access log.

All of it is configured from environment variables (see ``service.config``) and costs a few
microseconds per request.
"""

from __future__ import annotations

import contextlib
import functools
import hmac
import logging
import os
import re
import sys
import time
import uuid
from typing import Any

import numpy as np
import orjson
from flask import Flask, Response, g, request
from prometheus_client import CONTENT_TYPE_LATEST as METRICS_TYPE
from prometheus_client import (
    PLATFORM_COLLECTOR,
    REGISTRY,
    CollectorRegistry,
    Counter,
    Histogram,
    generate_latest,
    multiprocess,
)

from service.api.problems import Problem

_REQUEST_ID = re.compile(r"^[A-Za-z0-9._:-]{1,128}$")
_GUARDED_PREFIX = "/v1/"
"""Only the API needs the key: probes, the metrics scraper and the documentation carry no token."""
_METHODS = frozenset({"GET", "HEAD", "POST", "OPTIONS", "PUT", "PATCH", "DELETE"})
"""Methods counted by name in the metrics; any other counts as ``other``, so labels stay few."""
_MAX_DEPTH = 16
"""Deepest JSON nesting a body may have; the deepest valid body nests three levels."""

SECURITY_HEADERS = {
    "X-Content-Type-Options": "nosniff",
    "Content-Security-Policy": "default-src 'none'; frame-ancestors 'none'",
    "Referrer-Policy": "no-referrer",
    "X-Frame-Options": "DENY",
}

REQUESTS = Counter("boiling_requests_total", "Requests answered, by path and status.", ["path", "method", "status"])
LATENCY = Histogram(
    "boiling_request_duration_seconds",
    "Time to answer a request, by path.",
    ["path"],
    buckets=(0.0005, 0.001, 0.0025, 0.005, 0.01, 0.025, 0.05, 0.1, 0.25, 0.5, 1.0, 2.5),
)
POINTS = Counter("boiling_points_computed_total", "Points computed by the computing paths.", ["path"])

_ACCESS = logging.getLogger("service.access")
# The platform collector would publish the Python version to anyone who can read /metrics.
with contextlib.suppress(KeyError):
    REGISTRY.unregister(PLATFORM_COLLECTOR)


class JsonLogFormatter(logging.Formatter):
    """One JSON object per line: time, level, logger, message, and any ``fields`` given."""

    def format(self, record: logging.LogRecord) -> str:
        entry = {
            "time": self.formatTime(record, "%Y-%m-%dT%H:%M:%S%z"),
            "level": record.levelname.lower(),
            "logger": record.name,
            "message": record.getMessage(),
            **getattr(record, "fields", {}),
        }
        if record.exc_info:
            entry["exception"] = self.formatException(record.exc_info)
        return orjson.dumps(entry, default=str).decode()


def configure_logging(level: str = "INFO") -> None:
    """Send the service's logs to stdout as JSON lines."""
    handler = logging.StreamHandler(sys.stdout)
    handler.setFormatter(JsonLogFormatter())
    root = logging.getLogger("service")
    root.handlers[:] = [handler]
    root.setLevel(level.upper())
    root.propagate = False


@functools.lru_cache(maxsize=1024)
def _child(metric: Counter | Histogram, *labels: str) -> Any:
    """``metric.labels(*labels)``, looked up once per label set (paths, methods and statuses are few)."""
    return metric.labels(*labels)


def request_id() -> str:
    """The id of the request being answered (the caller's X-Request-ID, or a new one)."""
    return g.get("request_id", "-")


def json_depth_exceeds(body: bytes, limit: int) -> bool:
    """True when the JSON text ``body`` nests arrays and objects deeper than ``limit``.

    Brackets inside strings do not count. Bodies with fewer brackets than the limit pass at
    once; others are scanned with numpy, without recursion, in a few passes over the bytes.

    >>> json_depth_exceeds(b'{"a": [[1], "[[[["]}', 3), json_depth_exceeds(b"[[[[1]]]]", 3)
    (False, True)
    """
    if body.count(b"[") + body.count(b"{") <= limit:
        return False
    text = np.frombuffer(body.replace(b"\\\\", b"").replace(b'\\"', b""), dtype=np.uint8)
    in_string = np.cumsum(text == 0x22) % 2 == 1
    step = np.isin(text, (0x5B, 0x7B)).astype(np.int64) - np.isin(text, (0x5D, 0x7D))
    step[in_string] = 0
    return bool(np.cumsum(step).max() > limit)


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
    """Register the request guards and the /metrics path on ``app``."""
    api_key = app.config.get("API_KEY") or ""
    origins = frozenset(app.config.get("CORS_ORIGINS") or ())
    max_query = app.config["MAX_QUERY_BYTES"]
    body_seconds = app.config["BODY_TIMEOUT"]

    @app.before_request
    def _guard() -> Response | None:
        g.started = time.perf_counter()
        given = request.headers.get("X-Request-ID", "")
        g.request_id = given if _REQUEST_ID.match(given) else uuid.uuid4().hex
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
    def _finish(response: Response) -> Response:
        for name, value in SECURITY_HEADERS.items():  # a view may set its own policy (the explorer page does)
            response.headers.setdefault(name, value)
        response.headers["X-Request-ID"] = request_id()
        origin = request.headers.get("Origin")
        if origin and origin in origins:
            response.headers["Access-Control-Allow-Origin"] = origin
            response.headers["Access-Control-Allow-Methods"] = "GET, POST, OPTIONS"
            response.headers["Access-Control-Allow-Headers"] = "Authorization, Content-Type, X-Request-ID"
            response.headers["Access-Control-Expose-Headers"] = "ETag, X-Request-ID"
            response.headers["Access-Control-Max-Age"] = "600"
            response.vary.add("Origin")
        rule = request.url_rule.rule if request.url_rule else "(unknown)"
        elapsed = time.perf_counter() - g.get("started", time.perf_counter())
        method = request.method if request.method in _METHODS else "other"  # a client's made-up method
        _child(REQUESTS, rule, method, str(response.status_code)).inc()
        _child(LATENCY, rule).observe(elapsed)
        points = g.get("points")
        if points:
            _child(POINTS, rule).inc(points)
        _ACCESS.info(
            "request",
            extra={
                "fields": {
                    "request_id": request_id(),
                    "method": request.method,
                    "path": request.path,
                    "status": response.status_code,
                    "duration_ms": round(elapsed * 1e3, 3),
                    "points": points or 0,
                    "remote": request.remote_addr,
                }
            },
        )
        return response

    @app.get("/metrics")
    def metrics() -> Response:
        registry = None
        if multiprocess_dir():
            registry = CollectorRegistry()
            multiprocess.MultiProcessCollector(registry)
        return Response(generate_latest(registry) if registry else generate_latest(), content_type=METRICS_TYPE)


def multiprocess_dir() -> str | None:
    """The directory where gunicorn's workers share their metrics (docker/gunicorn.conf.py sets it)."""
    return os.environ.get("PROMETHEUS_MULTIPROC_DIR")
