"""``GET /docs``, the API explorer: an interactive page that renders ``/openapi.json`` with Swagger UI.

Swagger UI's files come from the ``flask-swagger-ui`` package, whose ``dist`` folder follows Swagger
UI's releases (its Flask blueprint is not used), and the service serves them itself: plant networks
are often closed, so the page loads nothing from a CDN. The page and the script that starts Swagger
UI are this service's own (``explorer_page/``). With no inline script, the page's content-security
policy is relaxed only as far as Swagger UI needs, and only on this page; the assets keep the
service's deny-all policy (a script or a stylesheet is not a document: no policy it carries applies).
Each asset URL carries a digest of the file, so the assets are cached for a year and a new release
of either changes the URL.
"""

from __future__ import annotations

import functools
import hashlib
import re
from pathlib import Path

import flask_swagger_ui
from flask import Blueprint, Response, send_file

from service.api.openapi import document_get
from service.api.problems import Problem

blueprint = Blueprint("explorer", __name__)

_OWN = Path(__file__).with_name("explorer_page")
_VENDOR = Path(flask_swagger_ui.__file__).with_name("dist")

ASSETS: dict[str, tuple[Path, str]] = {
    "swagger-ui-bundle.js": (_VENDOR / "swagger-ui-bundle.js", "text/javascript"),
    "swagger-ui.css": (_VENDOR / "swagger-ui.css", "text/css"),
    "favicon.png": (_VENDOR / "favicon-32x32.png", "image/png"),
    "explorer.js": (_OWN / "explorer.js", "text/javascript"),
    "explorer.css": (_OWN / "explorer.css", "text/css"),
}
"""The files the page loads, by the name in their URL, with their media types; nothing else is served."""

PAGE_POLICY = "; ".join(
    (
        "default-src 'none'",
        "script-src 'self'",
        "style-src 'self'",
        "img-src 'self' data:",  # Swagger UI's stylesheet draws its icons as data: SVG images
        "connect-src 'self'",  # the document, and the requests made with "Try it out"
        "base-uri 'none'",
        "form-action 'none'",
        "frame-ancestors 'none'",
    )
)
"""The content-security policy of the page: the service's own scripts, styles and requests only."""

_A_YEAR = 365 * 24 * 3600


@functools.cache
def _digest(name: str) -> str:
    """The first 16 hex digits of the SHA-256 of the asset ``name``: its URL changes with its content."""
    return hashlib.sha256(ASSETS[name][0].read_bytes()).hexdigest()[:16]


@functools.cache
def _page() -> str:
    """The page, each ``{{asset}}`` replaced by the asset's URL relative to the page."""
    template = (_OWN / "index.html").read_text(encoding="utf-8")
    return re.sub(r"\{\{([\w.-]+)\}\}", lambda m: f"docs/assets/{m[1]}?v={_digest(m[1])}", template)


@blueprint.get("/docs")
def page() -> Response:
    response = Response(_page(), mimetype="text/html")
    response.headers["Content-Security-Policy"] = PAGE_POLICY
    response.headers["Cache-Control"] = "no-cache"
    return response


@blueprint.get("/docs/assets/<path:name>")
def asset(name: str) -> Response:
    if name not in ASSETS:
        raise Problem(404, "The API explorer has no such file.")
    path, mimetype = ASSETS[name]
    response = send_file(path, mimetype=mimetype, max_age=_A_YEAR, conditional=True, etag=True)
    response.cache_control.immutable = True
    return response


document_get(
    "/docs",
    "explorer",
    "The API explorer: this document as an interactive page, served with its assets by this service",
    {
        "200": {
            "description": "An HTML page (Swagger UI) for a web browser.",
            "content": {"text/html": {"schema": {"type": "string"}}},
        }
    },
)
