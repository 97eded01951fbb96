"""Settings, from environment variables only (see README, "Configuration")."""

from __future__ import annotations

import os
from collections.abc import Mapping
from importlib import metadata
from pathlib import Path
from typing import Any

VERSION = metadata.version("boiling-point-service")
"""The installed version of this service."""

DEFAULTS: dict[str, Any] = {
    "MAX_POINTS": 100_000,
    "MAX_CONTENT_LENGTH": 16 * 1024 * 1024,
    "ANSWER_CACHE_SIZE": 4096,
    "MAX_QUERY_BYTES": 4096,
    "BODY_TIMEOUT": 10,
}
_ENVIRONMENT = {
    "MAX_POINTS": "BOILING_MAX_POINTS",
    "MAX_CONTENT_LENGTH": "BOILING_MAX_BODY_BYTES",
    "ANSWER_CACHE_SIZE": "BOILING_ANSWER_CACHE_SIZE",
    "MAX_QUERY_BYTES": "BOILING_MAX_QUERY_BYTES",
    "BODY_TIMEOUT": "BOILING_BODY_TIMEOUT",
}


def settings(environ: Mapping[str, str] = os.environ) -> dict[str, Any]:
    """The defaults, overridden by any ``BOILING_*`` variables set in ``environ``.

    ``BOILING_EXTRA_CATALOGS`` names operator catalog files, separated by ``os.pathsep``;
    ``BOILING_API_KEY`` (empty: off) is the bearer token every /v1 request must carry;
    ``BOILING_CORS_ORIGINS`` lists, comma-separated, the web origins allowed to call the API.
    """
    out = dict(DEFAULTS)
    for key, variable in _ENVIRONMENT.items():
        if variable in environ:
            try:
                out[key] = int(environ[variable])
            except ValueError:
                raise SystemExit(f"{variable} must be a whole number, not {environ[variable]!r}") from None
    extra = environ.get("BOILING_EXTRA_CATALOGS", "")
    out["EXTRA_CATALOGS"] = [Path(p) for p in extra.split(os.pathsep) if p.strip()]
    out["API_KEY"] = environ.get("BOILING_API_KEY", "")
    out["CORS_ORIGINS"] = [o.strip() for o in environ.get("BOILING_CORS_ORIGINS", "").split(",") if o.strip()]
    out["LOG_LEVEL"] = environ.get("LOG_LEVEL", "info")
    return out
