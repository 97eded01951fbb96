"""RFC 9457 problem responses: every error the service gives, in one shape."""

from __future__ import annotations

import logging
from collections.abc import Mapping, Sequence

from flask import Flask, Response, current_app, g, request
from marshmallow import ValidationError
from werkzeug.exceptions import HTTPException

from service.api.rendering import MEDIA_TYPES, chosen_format

PROBLEM_TYPE = "application/problem+json"
_LOG = logging.getLogger(__name__)

TITLES = {
    400: "Invalid input",
    401: "API key required",
    404: "Not found",
    405: "Method not allowed",
    406: "Not acceptable",
    408: "Request timeout",
    413: "Request too large",
    414: "Request URI too long",
    415: "Unsupported media type",
    422: "Outside the valid range",
    500: "Internal error",
    503: "Not ready",
}
_SLUGS = {
    400: "invalid-input",
    401: "unauthorized",
    404: "not-found",
    405: "method-not-allowed",
    406: "not-acceptable",
    408: "request-timeout",
    413: "too-large",
    414: "uri-too-long",
    415: "unsupported-media-type",
    422: "out-of-range",
    500: "internal-error",
    503: "not-ready",
}


def problem_type(status: int) -> str:
    """The ``type`` URI of a problem with ``status``."""
    return f"urn:boiling-point:problem:{_SLUGS.get(status, 'http-error')}"


class Problem(Exception):
    """An error answered as ``application/problem+json``."""

    def __init__(
        self,
        status: int,
        detail: str,
        errors: Mapping[str, Sequence[str]] | None = None,
        headers: Mapping[str, str] | None = None,
    ) -> None:
        super().__init__(detail)
        self.status = status
        self.detail = detail
        self.errors = {k: list(v) for k, v in (errors or {}).items()}
        self.headers = dict(headers or {})


def invalid(field: str, message: str) -> Problem:
    """A 400 problem about one field."""
    return Problem(400, f"{field}: {message}", {field: [message]})


def problem_response(problem: Problem) -> Response:
    """The problem as ``application/problem+json``, or as plain text to a request that asked for text or CSV."""
    body = {
        "type": problem_type(problem.status),
        "title": TITLES.get(problem.status, "HTTP error"),
        "status": problem.status,
        "detail": problem.detail,
    }
    if problem.errors:
        body["errors"] = problem.errors
    if wants_text():
        lines = [f"{name}: {value}" for name, value in body.items() if name != "errors"]
        lines += [f"error: {field}: {message}" for field, messages in problem.errors.items() for message in messages]
        response = Response("\n".join(lines) + "\n", mimetype="text/plain")
    else:
        response = current_app.json.response(body)
        response.mimetype = PROBLEM_TYPE
    response.status_code = problem.status
    response.headers.update(problem.headers)
    return response


def wants_text() -> bool:
    """Whether the request asked for a text answer (``format=text`` or ``csv``, or an Accept header that
    prefers text/plain or text/csv to JSON): its errors come as text too."""
    asked = request.args.get("format")
    return chosen_format(asked if asked in MEDIA_TYPES else None, ("text", "csv")) != "json"


def _flatten(messages: object, prefix: str = "") -> dict[str, list[str]]:
    """marshmallow's nested messages as ``{"field.sub": [message, ...]}``."""
    if isinstance(messages, Mapping):
        out: dict[str, list[str]] = {}
        for key, value in messages.items():
            out.update(_flatten(value, f"{prefix}{key}." if prefix or key != "_schema" else ""))
        return out
    if isinstance(messages, str):
        messages = [messages]
    return {prefix.rstrip(".") or "request": [str(m) for m in messages]}  # type: ignore[union-attr]


def validation_problem(error: ValidationError) -> Problem:
    errors = _flatten(error.normalized_messages())
    detail = "; ".join(f"{field}: {' '.join(msgs)}" for field, msgs in errors.items())
    return Problem(400, detail, errors)


def register_problem_handlers(app: Flask) -> None:
    """Answer every error, the framework's own included, as a problem."""

    @app.errorhandler(Problem)
    def _problem(problem: Problem) -> Response:
        return problem_response(problem)

    @app.errorhandler(ValidationError)
    def _validation(error: ValidationError) -> Response:
        return problem_response(validation_problem(error))

    @app.errorhandler(HTTPException)
    def _http(error: HTTPException) -> Response:
        status = error.code or 500
        detail = error.description or TITLES.get(status, "HTTP error")
        if status == 413:
            limit = current_app.config["MAX_CONTENT_LENGTH"]
            size = f"{request.content_length} bytes" if request.content_length else "more bytes than that"
            detail = f"The body has {size}; the limit is {limit} bytes (BOILING_MAX_BODY_BYTES)."
        response = problem_response(Problem(status, detail))
        if status == 405 and error.get_response().allow:
            response.allow.update(error.get_response().allow)
        return response

    @app.errorhandler(Exception)
    def _unexpected(error: Exception) -> Response:
        _LOG.exception("unhandled error", extra={"fields": {"request_id": g.get("request_id", "-")}})
        return problem_response(Problem(500, "The service could not compute this answer; the error was logged."))
