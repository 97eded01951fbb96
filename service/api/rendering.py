"""Answers as JSON (the default), plain text for a terminal, or CSV for arrays.

The client chooses with ``format`` (``json``, ``text`` or ``csv``) or the ``Accept`` header.
Text is one ``name: value unit`` line per field; CSV has one column per quantity, its
unit in the header (``boiling_point [degC]``), and one row per point. Numbers are written
in Python's shortest round-trip form, so both parse back to the JSON values exactly.
"""

from __future__ import annotations

from collections.abc import Iterable, Mapping, Sequence
from typing import Any

import numpy as np
import orjson
from flask import Response, request

from service.api.json_provider import encode
from service.api.numbers import significant
from service.api.quantity_fields import number_text
from service.fluids.cautions import Caution, Warnings
from service.fluids.questions import Answer
from service.physics.units import Unit

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


def finish(
    answer: dict[str, Any], tag: str | list[str] | None, digits: int | None, shape: tuple[int, ...]
) -> dict[str, Any]:
    """The answer with the request's ``tag`` first, every number rounded to ``digits`` significant digits."""
    if isinstance(tag, list) and not shape:  # one label for one point
        tag = tag[0]
    if tag is not None:
        answer = {"tag": tag, **answer}
    if digits is None:
        return answer

    def rounded(value: Any) -> Any:
        if _is_quantity(value):
            return {**value, "value": significant(value["value"], digits)}
        return {k: rounded(v) for k, v in value.items()} if _is_group(value) else value

    return {name: rounded(value) for name, value in answer.items()}


def render(body: dict[str, Any], fmt: str, shape: tuple[int, ...] = ()) -> tuple[bytes, str]:
    """The answer ``body`` (of ``shape`` points) in format ``fmt``, and its media type."""
    if fmt == "csv":
        return as_csv(body, shape).encode(), MEDIA_TYPES["csv"]
    if fmt == "json":
        return encode(shown(body, shape)), MEDIA_TYPES["json"]
    return as_text(shown(body, shape)).encode(), MEDIA_TYPES["text"]


def shown(body: dict[str, Any], shape: tuple[int, ...]) -> dict[str, Any]:
    """The answer as JSON shows it: its warnings as text that names the points each concerns."""
    return {**body, "warnings": warning_texts(body["warnings"], shape)} if "warnings" in body else body


def respond(body: dict[str, Any], fmt: str, shape: tuple[int, ...] = ()) -> Response:
    """The answer ``body`` in format ``fmt``, as a response."""
    content, mimetype = render(body, fmt, shape)
    return Response(content, mimetype=mimetype)


def warning_texts(warnings: Sequence[str | Caution], shape: tuple[int, ...]) -> list[str]:
    """The warnings as text; in an array answer each says which points it concerns (``points 0, 3-5: ...``)."""
    out = []
    for item in warnings:
        text, mask = (item, None) if isinstance(item, str) else (item.text, item.points)
        if not shape:
            if mask is None or bool(mask):
                out.append(text)
            continue
        marked = None if mask is None else np.flatnonzero(np.broadcast_to(mask, shape))
        if marked is None or marked.size == np.prod(shape):
            out.append(f"all points: {text}")
        elif marked.size:
            out.append(f"{'point' if marked.size == 1 else 'points'} {index_ranges(marked)}: {text}")
    return out


def index_ranges(indexes: np.ndarray) -> str:
    """Ascending indexes written as runs: ``0-2, 5, 7-8``.

    >>> index_ranges(np.array([0, 1, 2, 5, 7, 8]))
    '0-2, 5, 7-8'
    """
    breaks = np.flatnonzero(np.diff(indexes) != 1) + 1
    starts, ends = indexes[np.r_[0, breaks]], indexes[np.r_[breaks - 1, -1]]
    return ", ".join(str(a) if a == b else f"{a}-{b}" for a, b in zip(starts.tolist(), ends.tolist(), strict=True))


def _number(value: float) -> str:
    return repr(float(value))


def _is_quantity(value: Any) -> bool:
    return isinstance(value, dict) and set(value) == {"value", "unit"}


def _is_group(value: Any) -> bool:
    """A dict of quantities, or of such dicts, by name (one per component of a mixture, say)."""
    return (
        isinstance(value, dict)
        and not _is_quantity(value)
        and bool(value)
        and all(_is_quantity(v) or _is_group(v) for v in value.values())
    )


def _flat(body: dict[str, Any]) -> dict[str, Any]:
    """The answer with each group's quantities as fields of their own, ``group.name`` (``group.inner.name``)."""
    out: dict[str, Any] = {}
    for name, value in body.items():
        if _is_group(value):
            out |= {f"{name}.{key}": inner for key, inner in _flat(value).items()}
        else:
            out[name] = value
    return out


def as_text(body: dict[str, Any]) -> str:
    """One readable line per field: ``boiling_point: 95.2498 degC``; one line per warning."""
    lines = []
    for name, value in _flat(body).items():
        if _is_quantity(value):
            numbers = _listed(value["value"])
            lines.append(f"{name}: {' '.join(_number(v) for v in numbers)} {value['unit']}")
        elif name == "warnings":
            lines.extend(f"warning: {w}" for w in value)
        elif isinstance(value, list):
            lines.append(f"{name}: {' '.join(map(str, value))}")
        elif value is not None:
            lines.append(f"{name}: {value}")
    return "\n".join(lines) + "\n"


_CSV_NOTES = ("fluid", "solute", "components", "model", "method", "source")
"""Fields of an answer that a CSV answer carries in comment lines above its header."""


def as_csv(body: dict[str, Any], shape: tuple[int, ...]) -> str:
    """The answer as CSV: comment lines, then one column per quantity or label, one row per point.

    Lines starting with ``#`` above the header carry the answer's fluid, method and source and its
    numbered warnings; a ``warnings`` column gives each row the numbers of the warnings that concern
    it, and a ``tag`` column leads when the request sent tags. Numbers are written by orjson in the
    same shortest round-trip form as the JSON answer.
    """
    rows = int(np.prod(shape)) if shape else 1
    warnings = [w if isinstance(w, Caution) else Caution(w, True) for w in body.get("warnings", ())]
    notes = [f"# {name}: {_note(body[name])}" for name in _CSV_NOTES if body.get(name)]
    notes += [f"# warning {i}: {w.text}" for i, w in enumerate(warnings, start=1)]
    notes = [" ".join(note.splitlines()) for note in notes]  # one line each, whatever a name holds
    numbers, number_headers = [], []
    labels: dict[str, list[str]] = {}
    for name, value in _flat(body).items():
        if _is_quantity(value):
            number_headers.append(f"{name} [{value['unit']}]")
            numbers.append(np.broadcast_to(np.asarray(value["value"], dtype=float), shape or (1,)))
        elif name not in {"warnings", *_CSV_NOTES} and isinstance(value, list | str):
            labels[name] = [_csv_cell(v) for v in ([value] * rows if isinstance(value, str) else value)]
    if warnings:
        labels["warnings"] = _warning_numbers(warnings, shape, rows)
    tag = labels.pop("tag", None)
    columns = [*([tag] if tag else []), *([_number_rows(numbers)] if numbers else []), *labels.values()]
    header = ",".join([*(["tag"] if tag else []), *number_headers, *labels])
    lines = [*notes, header, *(map(",".join, zip(*columns, strict=True)) if rows else ())]
    return "\n".join(lines) + "\n"


def _note(value: str | list[str]) -> str:
    return ", ".join(value) if isinstance(value, list) else value


def _number_rows(columns: list[np.ndarray]) -> list[str]:
    """The number columns as one text line per row: orjson writes the table as [[a,b],[c,d]]."""
    table = np.column_stack(columns)
    return orjson.dumps(table, option=orjson.OPT_SERIALIZE_NUMPY).decode()[2:-2].split("],[") if table.size else []


def _csv_cell(text: str) -> str:
    """A label as a CSV cell: quoted when it holds a comma, a quote or a line end (RFC 4180), or starts with
    ``#``, so that a reader which skips the comment lines keeps its row."""
    if text.startswith("#") or any(c in text for c in ',"\r\n'):
        return '"' + text.replace('"', '""') + '"'
    return text


def _warning_numbers(warnings: list[Caution], shape: tuple[int, ...], rows: int) -> list[str]:
    """Each row's warning numbers (``1 3``); rows alike share one string, found per distinct set."""
    marks = np.zeros(rows, dtype=np.int64)
    for bit, warning in enumerate(warnings):
        marks |= np.broadcast_to(np.asarray(warning.points, dtype=bool), shape).reshape(-1).astype(np.int64) << bit
    sets, which = np.unique(marks, return_inverse=True)
    texts = [" ".join(str(b + 1) for b in range(len(warnings)) if s >> b & 1) for s in sets.tolist()]
    return [texts[i] for i in which.tolist()]


def _listed(value: Any) -> list[Any]:
    if isinstance(value, np.ndarray):
        return value.tolist()
    return value if isinstance(value, list) else [value]


def in_units(warnings: Warnings, units: Mapping[str, Unit]) -> Warnings:
    """The warnings with the numbers in their texts shown in the request's units."""
    return [
        Caution(w.text.format(**{k: number_text(v, units) for k, v in w.shown.items()}), w.points)
        if isinstance(w, Caution) and w.shown
        else w
        for w in warnings
    ]


def provenance(answer: Answer, units: Mapping[str, Unit]) -> dict[str, Any]:
    """``method``, ``source`` and ``warnings`` of an answer from the equations it used."""
    return {
        "method": "; ".join(method for method, _ in answer.citations),
        "source": "; ".join(source for _, source in answer.citations),
        "warnings": in_units(answer.warnings, units),
    }
