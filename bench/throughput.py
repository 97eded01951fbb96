"""HTTP benchmark: throughput and latency of single answers through `make serve`'s gunicorn.

wrk (Debian's package, installed here when missing) drives GET /healthz, GET
/v1/boiling-point and GET /v1/atmosphere in one run on loopback, same server, same
settings. Identical requests are served from each worker's answer cache, as a polling
dashboard's are; a second boiling-point run varies the pressure on every request, so every
answer is computed.

    python bench/throughput.py      (or: make bench-http)
"""

from __future__ import annotations

import re
import shutil
import subprocess
import sys
import tempfile
from pathlib import Path

sys.path.insert(0, str(Path(__file__).resolve().parents[1]))

from bench.common import free_port, gunicorn, machine, write_section

DURATION, THREADS, CONNECTIONS = "8s", 2, 32
VARIED = """
counter = 0
request = function()
  counter = counter + 1
  return wrk.format("GET", "/v1/boiling-point?gauge_pressure=" .. (counter % 100000) / 100 .. "&elevation=1420")
end
"""


def ensure_wrk() -> str:
    if not shutil.which("wrk"):
        subprocess.run(["apt-get", "update", "-qq"], check=True)
        subprocess.run(["apt-get", "install", "-y", "-qq", "wrk"], check=True)
    return shutil.which("wrk") or "wrk"


def run_wrk(wrk: str, url: str, script: str | None = None) -> dict[str, float]:
    command = [wrk, f"-t{THREADS}", f"-c{CONNECTIONS}", f"-d{DURATION}", "--latency", url]
    with tempfile.NamedTemporaryFile("w", suffix=".lua") as lua:
        if script:
            lua.write(script)
            lua.flush()
            command[1:1] = ["-s", lua.name]
        out = subprocess.run(command, check=True, capture_output=True, text=True).stdout
    figures = {"rps": float(re.search(r"Requests/sec:\s+([\d.]+)", out).group(1))}
    errors = re.search(r"Non-2xx or 3xx responses: (\d+)", out)
    figures["errors"] = float(errors.group(1)) if errors else 0.0
    for pct in ("50", "90", "99"):
        value, unit = re.search(rf"\s{pct}(?:\.000)?%\s+([\d.]+)(us|ms|s)", out).groups()
        figures[f"p{pct}"] = float(value) * {"us": 1e-3, "ms": 1.0, "s": 1e3}[unit]
    return figures


def main() -> None:
    wrk = ensure_wrk()
    cases = [
        ("GET /healthz", "/healthz", None),
        ("GET /v1/boiling-point (same request)", "/v1/boiling-point?gauge_pressure=950&elevation=1420", None),
        ("GET /v1/atmosphere (same request)", "/v1/atmosphere?elevation=1420", None),
        ("GET /v1/boiling-point (every request new)", "/v1/boiling-point", VARIED),
    ]
    with gunicorn(free_port()) as base:
        results = {name: run_wrk(wrk, base + path, script) for name, path, script in cases}
    rows = [
        "| request | requests/s | p50 ms | p90 ms | p99 ms | non-2xx |",
        "| --- | ---: | ---: | ---: | ---: | ---: |",
    ]
    for name, r in results.items():
        rows.append(
            f"| {name} | {r['rps']:,.0f} | {r['p50']:.2f} | {r['p90']:.2f} | {r['p99']:.2f} | {r['errors']:.0f} |"
        )
    health = results["GET /healthz"]["rps"]
    same = results["GET /v1/boiling-point (same request)"]["rps"] / health
    new = results["GET /v1/boiling-point (every request new)"]["rps"] / health
    rows += [
        "",
        f"Ratio of boiling-point to healthz throughput: {same:.2f} for a repeated request (answer cache), "
        f"{new:.2f} when every request is new. wrk -t{THREADS} -c{CONNECTIONS} -d{DURATION} on loopback; "
        "gunicorn with docker/gunicorn.conf.py (workers: 2 per core + 1); wrk shares the 2 cores.",
    ]
    write_section("http", f"Measured {machine()}.\n\n" + "\n".join(rows))


if __name__ == "__main__":
    main()
