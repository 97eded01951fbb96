"""Reading a request strictly: the query string (each parameter once), a JSON object body, or a CSV table
of numbers (and labels).

Every refusal is a 400 that says what is wrong and where: an empty body, a number out of double
range, a key given twice, a CSV cell by its row and column. A byte-order mark, which spreadsheets
write at the start of a UTF-8 file, is skipped.
"""

from __future__ import annotations

import csv
import io
import json
from collections.abc import Collection, Mapping
from typing import Any

import numpy as np
import orjson
from flask import request
from marshmallow import ValidationError
from numpy.typing import NDArray

from service.api.numbers import OUT_OF_RANGE, parse_number
from service.api.problems import invalid

BOM = b"\xef\xbb\xbf"
TEXT_COLUMNS = frozenset({"tag"})
"""CSV columns that hold labels rather than numbers."""


def json_object(raw: bytes) -> dict[str, Any]:
    """The JSON object of a body; 400 when it is empty, not JSON, not an object, or repeats a key."""
    raw = raw.removeprefix(BOM)
    if not raw.strip():
        raise invalid("body", 'is empty: send a JSON object, such as {"pressure": [100, 200]}')
    try:
        body = orjson.loads(raw)
    except orjson.JSONDecodeError as error:
        if "infinity" in error.msg:  # orjson: "number is infinity when parsed as double"
            raise invalid("body", f"a number is {OUT_OF_RANGE}") from None
        raise invalid("body", f"is not valid JSON: {error.msg} (at character {error.pos})") from None
    if not isinstance(body, dict):
        raise invalid("body", "must be a JSON object")
    repeated = _repeated_key(raw, body)
    if repeated:
        raise invalid(repeated, "given more than once in the body")
    return body


def _repeated_key(raw: bytes, body: dict[str, Any]) -> str | None:
    """A key that some object of the body repeats (the parser kept only its last value), or None.

    Every key of every object is followed by one colon. When the body holds as many colons as its
    parsed objects hold keys, no key was lost; otherwise (a repeat, or a colon inside a string) the
    body is read once more, key by key.
    """
    if raw.count(b":") == _key_count(body):
        return None
    found: list[str] = []

    def pairs(items: list[tuple[str, Any]]) -> dict[str, Any]:
        keys = [k for k, _ in items]
        found.extend(k for i, k in enumerate(keys) if k in keys[:i])
        return dict(items)

    json.loads(raw, object_pairs_hook=pairs)
    return found[0] if found else None


def _key_count(value: Any) -> int:
    """Keys in every object of ``value``; an array of numbers, or of arrays of numbers, is passed over by its first
    element. Where that misses keys further in, the count falls short of the colons, and the body is read once
    more, key by key: a shortcut can only send a body to the exact reading, never let a repeated key through."""
    if isinstance(value, dict):
        return len(value) + sum(_key_count(v) for v in value.values())
    if isinstance(value, list) and value and isinstance(value[0], dict | list):
        first = value[0]
        if isinstance(first, list) and not (first and isinstance(first[0], dict | list)):
            return 0
        return sum(_key_count(v) for v in value)
    return 0


def csv_table(
    raw: bytes, columns: Collection[str], rows: Mapping[str, tuple[str, list[str] | None]] | None = None
) -> dict[str, Any]:
    """A CSV body as ``{name: {"value": array, "unit": code or None}}`` and ``{"tag": [labels]}``.

    The header names the columns, each one of ``columns``, optionally with a unit:
    ``gauge_pressure [kPa]``. Every row has as many cells as the header. Rows end with LF, CRLF or
    a bare CR (spreadsheets write all three). Numbers are parsed in one call; only when that fails
    is the table read cell by cell, to name the first bad cell by row and column.

    ``rows`` names the options given one row of numbers per point, ``{option: (labelled by, labels)}``: their
    columns are ``option.label``, one per label (``fractions.ethanol`` for ``components=ethanol,...``), and they
    come back as ``{option: 2-D array}``, columns in the labels' order. ``labels`` None: the query string did
    not give them.
    """
    try:
        text = raw.removeprefix(BOM).decode("utf-8")
    except UnicodeDecodeError:
        raise invalid("body", "a CSV body must be UTF-8 text") from None
    header, _, body = text.replace("\r\n", "\n").replace("\r", "\n").strip().partition("\n")
    if not body.strip():
        raise invalid("body", "a CSV body has a header row and at least one row below it")
    names, units = [], []
    for cell in next(csv.reader([header])):
        name, _, unit = cell.partition("[")
        names.append(name.strip())
        units.append(unit.rstrip("] ") or None)
    grouped = rows or {}
    for name in names:
        option, dot, label = name.partition(".")
        if name not in columns and not (dot and label and option in grouped):
            shown = [*columns, *(f"{grouped_name}.<one of {key}>" for grouped_name, (key, _) in grouped.items())]
            raise invalid(name, f"not an input of this path; columns may be {', '.join(shown)}")
    if len(set(names)) != len(names):
        raise invalid("body", "a CSV header names each column once")
    labels = [i for i, n in enumerate(names) if n in TEXT_COLUMNS]
    if labels or '"' in body:  # labels, or quoted cells: read by the csv module
        count, cells, text_cells = _quoted_cells(body, len(names), labels)
    else:
        count, cells, text_cells = body.count("\n") + 1, _number_cells(body, len(names)), {}
    table = _numbers(cells, count, body, names, labels)
    numeric = [i for i in range(len(names)) if i not in labels]
    out: dict[str, Any] = {names[i]: text_cells[i] for i in labels}
    for column, i in enumerate(numeric):
        if names[i] in columns:
            out[names[i]] = {"value": table[:, column].copy(), "unit": units[i]}
    for i, name in enumerate(names):
        if name not in columns and units[i]:
            raise invalid(name, f"{name.partition('.')[0]} columns take no unit: the basis option says what they are")
    for option, (key, wanted) in grouped.items():
        found = {
            names[i].partition(".")[2]: column for column, i in enumerate(numeric) if names[i].startswith(f"{option}.")
        }
        if found:
            out[option] = _labelled_columns(table, option, key, wanted, found)
    return out


def _labelled_columns(
    table: NDArray[np.float64], option: str, key: str, wanted: list[str] | None, found: dict[str, int]
) -> NDArray[np.float64]:
    """The columns ``option.<label>`` of ``table`` as one 2-D array, in the order of ``wanted``; 400 where the query
    string does not give the labels, or the columns do not name each of them once."""
    if wanted is None:
        raise invalid(key, f"give {key} in the query string: the CSV columns {option}.<name> follow its order")
    named = set(wanted)
    missing, extra = [w for w in wanted if w not in found], [f for f in found if f not in named]
    if missing or extra:
        wrong = [f"missing: {_few(missing)}" if missing else "", f"not in {key}: {_few(extra)}" if extra else ""]
        raise invalid(
            option,
            f"the CSV needs one column {option}.<name> for each of {key} ({_few(wanted)}); "
            + "; ".join(filter(None, wrong)),
        )
    return table[:, [found[w] for w in wanted]]


def _few(names: list[str]) -> str:
    """Up to five names, and how many more."""
    return ", ".join(names[:5]) + (f" and {len(names) - 5} more" if len(names) > 5 else "")


def _number_cells(rows: str, width: int) -> str:
    """The cells of an all-number table as one JSON array text; 400 naming the first row of another width."""
    cells_per_row = _commas_per_row(rows) + 1
    misfits = np.flatnonzero(cells_per_row != width)
    if misfits.size:
        _wrong_width(int(misfits[0]), width, int(cells_per_row[misfits[0]]))
    return "[" + rows.replace("\n", ",") + "]"


def _quoted_cells(rows: str, width: int, labels: list[int]) -> tuple[int, str, dict[int, list[str]]]:
    """The row count, the number cells as one JSON array text, and the label columns' cells, read by the csv
    module (quoted cells, line ends inside quotes)."""
    table = list(csv.reader(io.StringIO(rows)))
    for number, row in enumerate(table):
        if len(row) != width:
            _wrong_width(number, width, len(row))
    texts = {i: [row[i] for row in table] for i in labels}
    keep = [i for i in range(width) if i not in labels]
    return len(table), "[" + ",".join(",".join(row[i] for i in keep) for row in table) + "]", texts


def _wrong_width(row: int, width: int, found: int) -> None:
    raise invalid(
        "body",
        f"every CSV row must have as many cells as the header ({width}); "
        f"row {row + 2} of the file (the header is row 1) has {found}",
    )


def _numbers(cells: str, count: int, rows: str, names: list[str], labels: list[int]) -> NDArray[np.float64]:
    """The number cells as a table of floats, one column per numeric input."""
    width = len(names) - len(labels)
    try:  # orjson reads the cells as one JSON array of numbers: strict and fast
        values = orjson.loads(cells)
    except orjson.JSONDecodeError:
        values = None
    if values is None or len(values) != count * width or not set(map(type, values)) <= {int, float}:
        _name_bad_cell(rows, names, labels)
    return np.array(values, dtype=float).reshape(count, width)


def _name_bad_cell(rows: str, names: list[str], labels: list[int]) -> None:
    """Refuse the first cell that is not a number, by its row and column."""
    for number, row in enumerate(csv.reader(io.StringIO(rows))):
        if not row:
            raise invalid("body", f"row {number + 2} of the file (the header is row 1) is empty")
        for column, cell in enumerate(row):
            if column in labels:
                continue
            try:
                parse_number(cell.strip())
            except ValidationError as error:
                where = f"row {number + 2}, column {column + 1} ({names[column]})"
                shown = f"{cell[:20]!r}" if cell.strip() else "empty"
                raise invalid(names[column], f"{where}: {shown}: {error.messages[0]}") from None
    # Each cell reads as a number on its own, but the table as a whole did not: say what is expected.
    raise invalid("body", "every CSV cell below the header must be a number, one per column")


def _commas_per_row(rows: str) -> NDArray[np.intp]:
    """How many commas each line of ``rows`` holds, from where its commas and line ends lie.

    >>> _commas_per_row("1,2\\n3\\n,,").tolist()
    [1, 0, 2]
    """
    data = np.frombuffer(rows.encode(), dtype=np.uint8)
    commas = np.flatnonzero(data == ord(","))
    line_ends = np.append(np.flatnonzero(data == ord("\n")), data.size)
    return np.diff(np.searchsorted(commas, line_ends), prepend=0)


def query_args() -> dict[str, str]:
    """The query string as a dict; a parameter given twice is refused."""
    pairs = list(request.args.items(multi=True))
    args = dict(pairs)
    if len(args) < len(pairs):
        repeated = next(key for key in args if len(request.args.getlist(key)) > 1)
        raise invalid(repeated, "given more than once")
    return args
