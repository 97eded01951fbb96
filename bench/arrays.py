"""Array benchmark: points per second for POSTs of 1e3, 1e4 and 1e5 points, JSON and CSV.

Each figure is end to end as a client sees it: encode the request body, send it over a
kept-alive loopback connection to `make serve`'s gunicorn, read the answer and decode it.

    python bench/arrays.py      (or: make bench-arrays)
"""

from __future__ import annotations

import http.client
import re
import statistics
import sys
import time
from collections.abc import Callable
from pathlib import Path
from urllib.parse import urlparse

import numpy as np
import orjson

sys.path.insert(0, str(Path(__file__).resolve().parents[1]))

from bench.common import free_port, gunicorn, machine, write_section

SIZES = (1_000, 10_000, 100_000)
CSV = {"Content-Type": "text/csv"}
REPEATS = 15
TARGET_SECONDS = 0.1


def post_json(conn: http.client.HTTPConnection, pressures: np.ndarray) -> np.ndarray:
    body = orjson.dumps({"pressure": pressures}, option=orjson.OPT_SERIALIZE_NUMPY)
    conn.request("POST", "/v1/boiling-point", body, {"Content-Type": "application/json"})
    response = conn.getresponse()
    answer = orjson.loads(response.read())
    assert response.status == 200, answer
    return np.asarray(answer["boiling_point"]["value"])


def post_csv(conn: http.client.HTTPConnection, pressures: np.ndarray) -> np.ndarray:
    # orjson writes the column as [a,b,...] and reads the rows back as one array: a client's fast CSV.
    numbers = orjson.dumps(pressures, option=orjson.OPT_SERIALIZE_NUMPY)[1:-1]
    conn.request("POST", "/v1/boiling-point?format=csv", b"pressure\n" + numbers.replace(b",", b"\n"), CSV)
    response = conn.getresponse()
    text = response.read()
    assert response.status == 200, text
    # Skip the comment lines and the header; drop the warnings column (the last) where there is one.
    lines = text.rstrip(b"\n").split(b"\n", text.count(b"#") + 1)
    header_at = next(i for i, line in enumerate(lines) if not line.startswith(b"#"))
    rows = b"\n".join(lines[header_at + 1 :]) if header_at + 1 < len(lines) else b""
    if lines[header_at].endswith(b",warnings"):
        rows = re.sub(rb",[^,\n]*$", b"", rows, flags=re.MULTILINE)
    return np.array(orjson.loads(b"[" + rows.replace(b"\n", b",") + b"]")).reshape(-1, 3)[:, 1]


def timed_posts(
    conn: http.client.HTTPConnection,
    post: Callable[[http.client.HTTPConnection, np.ndarray], np.ndarray],
    pressures: np.ndarray,
    repeats: int,
) -> list[float]:
    """Seconds of each of ``repeats`` POSTs of ``pressures`` [kPa], each answer checked to have every point."""
    times = []
    for _ in range(repeats):
        t0 = time.perf_counter()
        result = post(conn, pressures)
        times.append(time.perf_counter() - t0)
        assert result.size == pressures.size
    return times


def main() -> None:
    rows = ["| body | points | median s | best s | points/s (median) |", "| --- | ---: | ---: | ---: | ---: |"]
    with gunicorn(free_port()) as (base, _):
        url = urlparse(base)
        conn = http.client.HTTPConnection(url.hostname, url.port, timeout=60)
        for name, post in (("JSON", post_json), ("CSV", post_csv)):
            for n in SIZES:
                times = timed_posts(conn, post, np.geomspace(1.0, 20_000.0, n), REPEATS)  # kPa
                median = statistics.median(times)
                rows.append(f"| {name} | {n:,} | {median:.4f} | {min(times):.4f} | {n / median:,.0f} |")
                if (name, n) == ("JSON", 100_000):
                    verdict = (
                        f"Target: a 100,000-point JSON POST in under {TARGET_SECONDS} s end to end: {median:.3f} s "
                        f"median ({'met' if median < TARGET_SECONDS else 'not met'})."
                    )
        conn.close()
    rows += [
        "",
        verdict,
        "",
        f"Water boiling points, kPa in and degC out; {REPEATS} requests per row, one at a time over one kept-alive "
        "loopback connection to the gevent workers; client side numpy and orjson (the CSV rows too, comment lines "
        "and the warnings column set aside).",
    ]
    write_section("arrays", f"Measured {machine()}.\n\n" + "\n".join(rows))


if __name__ == "__main__":
    main()
