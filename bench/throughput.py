"""HTTP benchmark: throughput, latency and worker CPU of single answers through `make serve`'s gunicorn.

wrk (Debian's package, installed here when missing) drives GET /healthz, GET
/v1/boiling-point and GET /v1/atmosphere on loopback against two servers started with
docker/gunicorn.conf.py: one with its gevent workers, one with the sync workers it had
before (GUNICORN_WORKER_CLASS=sync), so that the worker model's cost is measured in one run.
The main rows change the numbers on every request (a dashboard polling live readings), so
every answer is computed; the last rows repeat one request, which each worker then answers
from its answer cache. The cases run in turn, each against both servers, three rounds over;
each figure is the median of its rounds, and each ratio the median of the per-round ratios
(to the same server's /healthz, or gevent to sync), so that both sides of a ratio saw the
same moments of a shared machine.

    python bench/throughput.py      (or: make bench-http)
"""

from __future__ import annotations

import os
import re
import shutil
import statistics
import subprocess
import sys
import tempfile
from pathlib import Path

sys.path.insert(0, str(Path(__file__).resolve().parents[1]))

from bench.common import free_port, gunicorn, machine, write_section

DURATION, THREADS, CONNECTIONS, ROUNDS = "5s", 2, 32, 3
TARGET_RATIO = 0.8


def varied(template: str) -> str:
    """A wrk script whose every request is new: the URL's path, and the query ``template`` with
    ``{x}`` as 10 + k / 10**6.

    k counts each thread's requests from its own offset, and each round starts its threads at
    offsets of its own (ROUND, set per run), so no two requests of a run share a query and no
    worker's answer cache can answer one.
    """
    query = template.replace("{x}", '" .. string.format("%.6f", 10 + k / 1e6) .. "')
    return f"""
threads = 0
function setup(thread)
  thread:set("first", (ROUND * 16 + threads) * 10000000)
  threads = threads + 1
end
k = 0
request = function()
  if k == 0 then k = first end
  k = k + 1
  return wrk.format("GET", wrk.path .. "?{query}")
end
"""


CASES = [  # name, path (with a fixed query, or none), wrk script (adding a new query each time) or None
    ("GET /healthz", "/healthz", None),
    (
        "GET /v1/boiling-point, gauge + elevation, every request new",
        "/v1/boiling-point",
        varied("gauge_pressure={x}&elevation=1420"),
    ),
    (
        "GET /v1/boiling-point, absolute pressure, every request new",
        "/v1/boiling-point",
        varied("pressure={x}"),
    ),
    ("GET /v1/atmosphere, every request new", "/v1/atmosphere", varied("elevation={x}")),
    ("GET /v1/boiling-point, one request repeated", "/v1/boiling-point?gauge_pressure=950&elevation=1420", None),
    ("GET /v1/atmosphere, one request repeated", "/v1/atmosphere?elevation=1420", None),
]


def ensure_wrk() -> str:
    if not shutil.which("wrk"):
        subprocess.run(["apt-get", "update", "-qq"], check=True)
        subprocess.run(["apt-get", "install", "-y", "-qq", "wrk"], check=True)
    return shutil.which("wrk") or "wrk"


def worker_cpu_seconds(master: int) -> float:
    """CPU time of gunicorn's workers so far, those recycled included (their time is the master's cutime)."""

    def stat(pid: str) -> list[str]:  # the fields after the command name: state, ppid, ...
        return Path(f"/proc/{pid}/stat").read_text().rpartition(")")[2].split()

    total = 0
    for pid in filter(str.isdigit, os.listdir("/proc")):
        try:
            fields = stat(pid)
        except (FileNotFoundError, ProcessLookupError):  # gone meanwhile: counted in the master's cutime
            continue
        if fields[1] == str(master):
            total += int(fields[11]) + int(fields[12])  # utime, stime
    own = stat(str(master))
    return (total + int(own[13]) + int(own[14])) / os.sysconf("SC_CLK_TCK")  # + cutime, cstime


def run_wrk(wrk: str, url: str, script: str | None, master: int, round_: int) -> dict[str, float]:
    command = [wrk, f"-t{THREADS}", f"-c{CONNECTIONS}", f"-d{DURATION}", "--latency", url]
    with tempfile.NamedTemporaryFile("w", suffix=".lua") as lua:
        if script:
            lua.write(f"ROUND = {round_}\n{script}")
            lua.flush()
            command[1:1] = ["-s", lua.name]
        cpu = worker_cpu_seconds(master)
        out = subprocess.run(command, check=True, capture_output=True, text=True).stdout
        cpu = worker_cpu_seconds(master) - cpu
    requests = float(re.search(r"(\d+) requests in", out).group(1))
    figures = {"rps": float(re.search(r"Requests/sec:\s+([\d.]+)", out).group(1)), "cpu_us": cpu / requests * 1e6}
    errors = re.search(r"Non-2xx or 3xx responses: (\d+)", out)
    figures["errors"] = float(errors.group(1)) if errors else 0.0
    for pct in ("50", "90", "99"):
        value, unit = re.search(rf"\s{pct}(?:\.000)?%\s+([\d.]+)(us|ms|s)", out).groups()
        figures[f"p{pct}"] = float(value) * {"us": 1e-3, "ms": 1.0, "s": 1e3}[unit]
    return figures


MODELS = ("gevent", "sync")


def main() -> None:
    wrk = ensure_wrk()
    rounds: list[dict[tuple[str, str], dict[str, float]]] = []
    with (
        gunicorn(free_port(), GUNICORN_WORKER_CLASS="gevent") as gevent,
        gunicorn(free_port(), GUNICORN_WORKER_CLASS="sync") as sync,
    ):
        servers = {"gevent": gevent, "sync": sync}
        for round_ in range(ROUNDS):
            figures = {}
            for name, path, script in CASES:
                for model, (base, master) in servers.items():
                    figures[name, model] = run_wrk(wrk, base + path, script, master, round_)
            rounds.append(figures)
    rows = [
        "| request | workers | requests/s | ratio to /healthz | gevent / sync | worker CPU us/request "
        "| p50 ms | p90 ms | p99 ms | non-2xx |",
        "| --- | --- | ---: | ---: | ---: | ---: | ---: | ---: | ---: | ---: |",
    ]
    ratios = {}
    for name, *_ in CASES:
        for model in MODELS:
            runs = sorted((r[name, model] for r in rounds), key=lambda f: f["rps"])
            middle = runs[len(runs) // 2]
            ratio = statistics.median(r[name, model]["rps"] / r["GET /healthz", model]["rps"] for r in rounds)
            ratios[name, model] = ratio
            versus = statistics.median(r[name, "gevent"]["rps"] / r[name, "sync"]["rps"] for r in rounds)
            cpu = statistics.median(run["cpu_us"] for run in runs)
            errors = sum(run["errors"] for run in runs)
            rows.append(
                f"| {name} | {model} | {middle['rps']:,.0f} | {ratio:.2f} | "
                f"{f'{versus:.2f}' if model == 'gevent' else ''} | {cpu:,.0f} | {middle['p50']:.2f} | "
                f"{middle['p90']:.2f} | {middle['p99']:.2f} | {errors:.0f} |"
            )
    rows += [
        "",
        f"Target: a single GET /v1/boiling-point at {TARGET_RATIO} of /healthz or more (an uncached one at about "
        "0.7 is accepted). "
        + "; ".join(
            f"{name.removeprefix('GET ')} ({model}): {ratio:.2f} ({'met' if ratio >= TARGET_RATIO else 'not met'})"
            for (name, model), ratio in ratios.items()
            if "boiling-point" in name
        )
        + ".",
        "",
        f"wrk -t{THREADS} -c{CONNECTIONS} -d{DURATION} on loopback, {ROUNDS} rounds of all cases in turn; medians. "
        "gunicorn with docker/gunicorn.conf.py (2 workers per core + 1), gevent workers and, for comparison, sync "
        "workers; wrk shares the 2 cores. Worker CPU is what the gunicorn workers spent per request, from /proc.",
    ]
    write_section("http", f"Measured {machine()}.\n\n" + "\n".join(rows))


if __name__ == "__main__":
    main()
