"""Answers as JSON (the default), plain text for a terminal, or CSV for arrays.

The client chooses with ``format`` (``json``, ``text`` or ``csv``) or the ``Accept`` header.
Text is one ``name: value unit`` line per field; CSV has one column per quantity, its
unit in the header (``boiling_point [degC]``), and one row per point. Numbers are written
in Python's shortest round-trip form, so both parse back to the JSON values exactly.
"""

from __future__ import annotations

import csv
import io
from collections.abc import Iterable
from typing import Any

from flask import Response, current_app, request

MEDIA_TYPES = {"json": "application/json", "text": "text/plain", "csv": "text/csv"}


def chosen_format(requested: str | None, offered: Iterable[str]) -> str:
    """``requested`` if given, else the best of ``offered`` for the Accept header (JSON on a tie)."""
    if requested:
        return requested
    types = [MEDIA_TYPES["json"], *(MEDIA_TYPES[f] for f in offered if f != "json")]
    best = request.accept_mimetypes.best_match(types, default=MEDIA_TYPES["json"])
    return next(name for name, media in MEDIA_TYPES.items() if media == best)


def respond(body: dict[str, Any], fmt: str) -> Response:
    """The answer ``body`` in format ``fmt``."""
    if fmt == "json":
        return current_app.json.response(body)
    text = as_text(body) if fmt == "text" else as_csv(body)
    return Response(text, mimetype=MEDIA_TYPES[fmt])


def _number(value: float) -> str:
    return repr(float(value))


def _is_quantity(value: Any) -> bool:
    return isinstance(value, dict) and set(value) == {"value", "unit"}


def as_text(body: dict[str, Any]) -> str:
    """One readable line per field: ``boiling_point: 95.2498 degC``; one line per warning."""
    lines = []
    for name, value in body.items():
        if _is_quantity(value):
            numbers = value["value"] if isinstance(value["value"], list) else [value["value"]]
            lines.append(f"{name}: {' '.join(_number(v) for v in numbers)} {value['unit']}")
        elif name == "warnings":
            lines.extend(f"warning: {w}" for w in value)
        elif isinstance(value, list):
            lines.append(f"{name}: {' '.join(map(str, value))}")
        else:
            lines.append(f"{name}: {value}")
    return "\n".join(lines) + "\n"


def as_csv(body: dict[str, Any]) -> str:
    """The quantities (and per-point labels such as ``state``) as columns, one row per point."""
    columns: list[tuple[str, list[Any]]] = []
    for name, value in body.items():
        if _is_quantity(value):
            columns.append((f"{name} [{value['unit']}]", _listed(value["value"])))
        elif isinstance(value, list | str) and name not in {"warnings", "method", "source", "fluid"}:
            columns.append((name, _listed(value)))
    rows = max(len(values) for _, values in columns)
    out = io.StringIO()
    writer = csv.writer(out, lineterminator="\n")
    writer.writerow(header for header, _ in columns)
    for i in range(rows):
        writer.writerow(_cell(values[i] if len(values) > 1 else values[0]) for _, values in columns)
    return out.getvalue()


def _listed(value: Any) -> list[Any]:
    return value if isinstance(value, list) else [value]


def _cell(value: Any) -> str:
    return _number(value) if isinstance(value, int | float) and not isinstance(value, bool) else str(value)
