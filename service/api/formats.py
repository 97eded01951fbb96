"""Answers as JSON (the default), plain text for a terminal, or CSV for arrays.

The client chooses with ``format`` (``json``, ``text`` or ``csv``) or the ``Accept`` header.
Text is one ``name: value unit`` line per field; CSV has one column per quantity, its
unit in the header (``boiling_point [degC]``), and one row per point. Numbers are written
in Python's shortest round-trip form, so both parse back to the JSON values exactly.
"""

from __future__ import annotations

import csv
import hashlib
import io
from collections import OrderedDict
from collections.abc import Callable, Iterable
from typing import Any

import numpy as np
import orjson
from flask import Response, request
from numpy.typing import NDArray

from service.api.jsonio import encode
from service.api.problems import invalid

MEDIA_TYPES = {"json": "application/json", "text": "text/plain", "csv": "text/csv"}


def chosen_format(requested: str | None, offered: Iterable[str]) -> str:
    """``requested`` if given, else the best of ``offered`` for the Accept header (JSON on a tie)."""
    if requested:
        return requested
    if request.environ.get("HTTP_ACCEPT", "*/*") == "*/*":  # no preference: JSON, without parsing the header
        return "json"
    types = [MEDIA_TYPES["json"], *(MEDIA_TYPES[f] for f in offered if f != "json")]
    best = request.accept_mimetypes.best_match(types, default=MEDIA_TYPES["json"])
    return next(name for name, media in MEDIA_TYPES.items() if media == best)


def render(body: dict[str, Any], fmt: str) -> tuple[bytes, str]:
    """The answer ``body`` in format ``fmt``, and its media type."""
    if fmt == "json":
        return encode(body), MEDIA_TYPES["json"]
    text = as_text(body) if fmt == "text" else as_csv(body)
    return text.encode(), MEDIA_TYPES[fmt]


def respond(body: dict[str, Any], fmt: str) -> Response:
    """The answer ``body`` in format ``fmt``, as a response."""
    content, mimetype = render(body, fmt)
    return Response(content, mimetype=mimetype)


CACHE_CONTROL = "public, max-age=3600"
"""Answers follow from the request and the built-in tables alone: an hour is safe for any cache."""


def cacheable(body: dict[str, Any]) -> Response:
    """The JSON answer ``body`` with a strong ETag, cacheable; 304 when If-None-Match matches it."""
    content = encode(body)
    return _tagged(content, MEDIA_TYPES["json"], _etag(content))


def _etag(body: bytes) -> str:
    return hashlib.blake2b(body, digest_size=16).hexdigest()


def _tagged(body: bytes, mimetype: str, etag: str) -> Response:
    headers = [("ETag", f'"{etag}"'), ("Cache-Control", CACHE_CONTROL), ("Vary", "Accept")]
    # If-None-Match compares weakly (RFC 9110); most requests carry none, and skip parsing it.
    if "HTTP_IF_NONE_MATCH" in request.environ and request.if_none_match.contains_weak(etag):
        return Response(status=304, headers=headers)
    return Response(body, mimetype=mimetype, headers=headers)


class AnswerCache:
    """The last answers to identical GETs, per worker: an answer depends only on the request.

    Keyed by path, query string and Accept header; holds ``size`` answers, least recently
    used out first. Refusals are not kept: they raise before anything is stored. Every
    answer, cached or not, carries its ETag and Cache-Control (:func:`_tagged`).
    """

    def __init__(self, size: int) -> None:
        self.size = size
        self._answers: OrderedDict[tuple[str, bytes, str], tuple[bytes, str, str]] = OrderedDict()

    def answer(self, compute: Callable[[], tuple[bytes, str]]) -> Response:
        """The response to this GET: ``compute()`` gives its body and media type, unless a recent answer stands."""
        key = (request.path, request.query_string, request.environ.get("HTTP_ACCEPT", ""))
        hit = self._answers.get(key)
        if hit is None:
            content, mimetype = compute()
            hit = (content, mimetype, _etag(content))
            if self.size:
                self._answers[key] = hit
                if len(self._answers) > self.size:
                    self._answers.popitem(last=False)
        else:
            self._answers.move_to_end(key)
        return _tagged(*hit)


def csv_columns(text: str) -> dict[str, dict[str, Any]]:
    """A CSV body as ``{name: {"value": array, "unit": code or None}}``, parsed in one numpy call.

    The header names the columns, optionally with a unit: ``gauge_pressure [kPa]``. Every row
    has as many cells as the header; the first row that has not is named in the refusal. Rows
    end with LF, CRLF or a bare CR (spreadsheets write all three).
    """
    header, _, rows = text.replace("\r\n", "\n").replace("\r", "\n").strip().partition("\n")
    if not rows.strip():
        raise invalid("body", "a CSV body has a header row and at least one row of numbers")
    names = [h.strip() for h in header.split(",")]
    bare = [n.partition("[")[0].strip() for n in names]
    if len(set(bare)) != len(bare):
        raise invalid("body", "a CSV header names each column once")
    cells_per_row = _commas_per_row(rows) + 1
    misfits = np.flatnonzero(cells_per_row != len(names))
    if misfits.size:
        row = misfits[0]
        raise invalid(
            "body",
            f"every CSV row must have as many cells as the header ({len(names)}); "
            f"row {row + 1} below the header has {cells_per_row[row]}",
        )
    try:  # orjson reads the cells as one JSON array of numbers: strict and fast
        cells = orjson.loads("[" + rows.replace("\n", ",") + "]")
    except orjson.JSONDecodeError:
        cells = None
    if cells is None or not set(map(type, cells)) <= {int, float}:
        raise invalid("body", "every CSV cell below the header must be a number")
    table = np.array(cells, dtype=float).reshape(-1, len(names))
    columns = {}
    for i, header_cell in enumerate(names):
        name, _, unit = header_cell.partition("[")
        columns[name.strip()] = {"value": table[:, i].copy(), "unit": unit.rstrip("] ") or None}
    return columns


def _commas_per_row(rows: str) -> NDArray[np.intp]:
    """How many commas each line of ``rows`` holds, from where its commas and line ends lie.

    >>> _commas_per_row("1,2\\n3\\n,,").tolist()
    [1, 0, 2]
    """
    data = np.frombuffer(rows.encode(), dtype=np.uint8)
    commas = np.flatnonzero(data == ord(","))
    line_ends = np.append(np.flatnonzero(data == ord("\n")), data.size)
    return np.diff(np.searchsorted(commas, line_ends), prepend=0)


def _number(value: float) -> str:
    return repr(float(value))


def _is_quantity(value: Any) -> bool:
    return isinstance(value, dict) and set(value) == {"value", "unit"}


def as_text(body: dict[str, Any]) -> str:
    """One readable line per field: ``boiling_point: 95.2498 degC``; one line per warning."""
    lines = []
    for name, value in body.items():
        if _is_quantity(value):
            numbers = _listed(value["value"])
            lines.append(f"{name}: {' '.join(_number(v) for v in numbers)} {value['unit']}")
        elif name == "warnings":
            lines.extend(f"warning: {w}" for w in value)
        elif isinstance(value, list):
            lines.append(f"{name}: {' '.join(map(str, value))}")
        else:
            lines.append(f"{name}: {value}")
    return "\n".join(lines) + "\n"


def as_csv(body: dict[str, Any]) -> str:
    """The quantities (and per-point labels such as ``state``) as columns, one row per point.

    Numbers are written by orjson in the same shortest round-trip form as the JSON answer;
    with labels among the columns, the cells are joined into rows in Python.
    """
    headers, columns = [], []
    for name, value in body.items():
        if _is_quantity(value):
            headers.append(f"{name} [{value['unit']}]")
            columns.append(np.atleast_1d(np.asarray(value["value"], dtype=float)))
        elif isinstance(value, list | str) and name not in {"warnings", "method", "source", "fluid", "model"}:
            headers.append(name)
            columns.append([value] if isinstance(value, str) else value)
    out = io.StringIO()
    csv.writer(out, lineterminator="\n").writerow(headers)
    if all(isinstance(c, np.ndarray) for c in columns):
        # All numbers: orjson writes the whole table as [[a,b],[c,d]]; brackets become line ends.
        table = np.column_stack(np.broadcast_arrays(*columns))
        text = orjson.dumps(table, option=orjson.OPT_SERIALIZE_NUMPY).decode()
        out.write(text[2:-2].replace("],[", "\n") + "\n" if table.size else "")
        return out.getvalue()
    cells = [_cells(c) for c in columns]
    rows = max((len(c) for c in cells if len(c) != 1), default=1)  # single values repeat down the column
    cells = [c * rows if len(c) == 1 else c for c in cells]
    if rows:
        out.write("\n".join(map(",".join, zip(*cells, strict=True))) + "\n")
    return out.getvalue()


def _cells(value: np.ndarray | list[str]) -> list[str]:
    """One column's cells as text: numbers through orjson, labels as they are."""
    if isinstance(value, list):
        return value
    encoded = orjson.dumps(value, option=orjson.OPT_SERIALIZE_NUMPY)
    return encoded[1:-1].decode().split(",") if len(encoded) > 2 else []


def _listed(value: Any) -> list[Any]:
    if isinstance(value, np.ndarray):
        return value.tolist()
    return value if isinstance(value, list) else [value]
