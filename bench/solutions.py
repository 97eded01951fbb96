"""Solution benchmark: a 100,000-point POST for water with a solute against the same POST for pure water.

Issue 12's target: a solution's array path within 2x of pure water's, end to end as a client sees
it (encode, send over a kept-alive loopback connection to `make serve`'s gunicorn, read, decode).
Rounds alternate pure water and each solute, so drift on a shared machine falls on both alike.

    python bench/solutions.py      (or: make bench-solutions)
"""

from __future__ import annotations

import http.client
import statistics
import sys
from pathlib import Path
from typing import Any
from urllib.parse import urlparse

import numpy as np
import orjson

sys.path.insert(0, str(Path(__file__).resolve().parents[1]))

from bench.arrays import timed_posts
from bench.common import free_port, gunicorn, machine, write_section

POINTS = 100_000
ROUNDS = 5
REPEATS = 3
TARGET = 2.0
SOLUTES = {  # id: the top of the concentrations sent [wt%], inside each equation's range at these pressures
    "sodium-chloride": 25.0,
    "sucrose": 60.0,
    "sea-salt": 7.0,
    "calcium-chloride": 30.0,
    "sodium-hydroxide": 30.0,
    "lithium-bromide": 50.0,
}


def poster(extra: dict[str, Any], sizes: list[int]) -> Any:
    """A POST of the pressures [kPa] with ``extra`` fields (a solute and its concentrations) to /v1/boiling-point;
    the bytes of each answer go to ``sizes``."""

    def post(conn: http.client.HTTPConnection, pressures: np.ndarray) -> np.ndarray:
        body = orjson.dumps({"pressure": pressures, **extra}, option=orjson.OPT_SERIALIZE_NUMPY)
        conn.request("POST", "/v1/boiling-point", body, {"Content-Type": "application/json"})
        response = conn.getresponse()
        text = response.read()
        sizes.append(len(body) + len(text))
        answer = orjson.loads(text)
        assert response.status == 200, answer
        return np.asarray(answer["boiling_point"]["value"])

    return post


def main() -> None:
    pressures = np.geomspace(20.0, 200.0, POINTS)  # kPa: every solute boils inside its stated range here
    sizes: dict[str, list[int]] = {name: [] for name in ("water", *SOLUTES)}
    posts = {"water": poster({}, sizes["water"])}
    for solute, top in SOLUTES.items():
        posts[solute] = poster({"solute": solute, "concentration": np.linspace(0.0, top, POINTS)}, sizes[solute])
    times: dict[str, list[float]] = {name: [] for name in posts}
    with gunicorn(free_port()) as (base, _):
        url = urlparse(base)
        conn = http.client.HTTPConnection(url.hostname, url.port, timeout=60)
        for post in posts.values():  # warm up
            timed_posts(conn, post, pressures, 1)
        for _ in range(ROUNDS):
            for name, post in posts.items():
                times[name] += timed_posts(conn, post, pressures, REPEATS)
        conn.close()
    water = statistics.median(times["water"])
    rows = [
        "| liquid | median s | ratio to water | within 2x | MB sent and received | ratio to water |",
        "| --- | ---: | ---: | --- | ---: | ---: |",
    ]
    for name, measured in times.items():
        median = statistics.median(measured)
        ratio, volume = median / water, sizes[name][-1]
        rows.append(
            f"| {name} | {median:.4f} | {ratio:.2f} | {'yes' if ratio <= TARGET else 'no'} | {volume / 1e6:.1f} "
            f"| {volume / sizes['water'][-1]:.2f} |"
        )
    rows += [
        "",
        f"{POINTS:,}-point JSON POSTs to /v1/boiling-point (pressures 20 to 200 kPa; for a solution, concentrations "
        f"from 0 to the top given in bench/solutions.py), {ROUNDS} rounds of {REPEATS} per liquid, alternating, "
        "over one kept-alive loopback connection to the gevent workers; medians. A solution's request carries its "
        "concentrations and its answer three more arrays (concentration, elevation, water activity), so it moves "
        "about twice the bytes: the client's decoding, the transfer and the server's encoding all scale with them.",
    ]
    write_section("solutions", f"Measured {machine()}.\n\n" + "\n".join(rows))


if __name__ == "__main__":
    main()
