"""What every request leaves behind: its request id, the Prometheus metrics and a structured access-log line."""

from __future__ import annotations

import contextlib
import functools
import logging
import os
import re
import sys
import time
import uuid
from typing import Any

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

from service.api.openapi import document_get

_REQUEST_ID = re.compile(r"^[A-Za-z0-9._:-]{1,128}$")
_METHODS = frozenset({"GET", "HEAD", "POST", "OPTIONS", "PUT", "PATCH", "DELETE"})
"""Methods counted by name in the metrics; any other counts as ``other``, so labels stay few."""

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


def install(app: Flask) -> None:
    """Give every request an id, count and time it, log it, and serve the metrics on /metrics.

    Registered before the guards: a refused request is counted and logged too.
    """

    @app.before_request
    def _start() -> None:
        g.started = time.perf_counter()
        given = request.headers.get("X-Request-ID", "")
        g.request_id = given if _REQUEST_ID.match(given) else uuid.uuid4().hex

    @app.after_request
    def _record(response: Response) -> Response:
        response.headers["X-Request-ID"] = request_id()
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


document_get(
    "/metrics",
    "metrics",
    "Prometheus metrics: requests by path and status, latency, points computed (all workers)",
    {"200": {"description": "Prometheus text format.", "content": {"text/plain": {"schema": {"type": "string"}}}}},
)
