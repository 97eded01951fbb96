"""Two committed revisions in one run: the HTTP benchmark and the 100,000-point array POSTs of each.

A refactor shows that it costs nothing by its ratios to the revision before it, measured at the
same moments of the same machine. Each revision is checked out in a detached git worktree in a
temporary directory and served by its own docker/gunicorn.conf.py and its own code (this venv's
Python and packages, the worktree first on PYTHONPATH and gunicorn's working directory; checked
before anything is measured). Both servers run side by side; the measurements alternate between
them case by case, the first revision first in one round and second in the next, so that drift
on a shared machine reaches both. Everything is measured as bench/throughput.py (the same cases,
wrk settings and worker CPU from /proc, with each configuration's default worker class) and
bench/arrays.py (JSON and CSV POSTs of 100,000 points) measure it. The worktrees are removed at
the end, also after an error.

    python bench/compare.py [BASE] [HEAD]      (or: make bench-compare BASE=eb6c1ea HEAD=HEAD)
"""

from __future__ import annotations

import contextlib
import http.client
import os
import signal
import statistics
import subprocess
import sys
import tempfile
import time
from collections.abc import Callable, Iterator
from pathlib import Path
from urllib.parse import urlparse

import numpy as np

sys.path.insert(0, str(Path(__file__).resolve().parents[1]))

from bench.arrays import post_csv, post_json, timed_posts
from bench.common import ROOT, free_port, gunicorn, machine, write_section
from bench.throughput import CASES, CONNECTIONS, DURATION, THREADS, ensure_wrk, run_wrk

ROUNDS = int(os.environ.get("COMPARE_ROUNDS", "4"))
ARRAY_POINTS = 100_000
ARRAY_REPEATS = 15
NOISY = 1.2
"""A ratio whose rounds spread wider than this factor (largest over smallest) is marked noisy."""
POSTS: dict[str, Callable[[http.client.HTTPConnection, np.ndarray], np.ndarray]] = {
    "JSON": post_json,
    "CSV": post_csv,
}
HEALTHZ = CASES[0][0]


def git(*args: str) -> str:
    return subprocess.run(["git", "-C", str(ROOT), *args], check=True, capture_output=True, text=True).stdout.strip()


@contextlib.contextmanager
def worktrees(commits: dict[str, str]) -> Iterator[dict[str, Path]]:
    """A detached worktree of each commit in one temporary directory; all removed on the way out."""
    tmp = Path(tempfile.mkdtemp(prefix="bench-compare-"))
    added: dict[str, Path] = {}
    try:
        for label, commit in commits.items():
            path = tmp / label
            git("worktree", "add", "--detach", str(path), commit)
            added[label] = path
        yield added
    finally:
        for path in added.values():
            with contextlib.suppress(subprocess.CalledProcessError):
                git("worktree", "remove", "--force", str(path))
        subprocess.run(["rm", "-rf", str(tmp)], check=False)


def imported_from(tree: Path) -> str:
    """Where ``import service`` resolves for gunicorn in ``tree``: its PYTHONPATH and working directory, as
    gunicorn puts them in front of sys.path. The venv installs this checkout editable, behind both."""
    env = {**os.environ, "PYTHONPATH": str(tree)}
    code = "import os, sys; sys.path.insert(0, os.getcwd()); import service; print(service.__file__)"
    where = subprocess.run([sys.executable, "-c", code], cwd=tree, env=env, check=True, capture_output=True, text=True)
    location = Path(where.stdout.strip()).resolve()
    if not location.is_relative_to(tree.resolve()):
        raise RuntimeError(f"service resolves to {location}, not into the worktree {tree}")
    return str(location)


def array_times(base: str, post: Callable[[http.client.HTTPConnection, np.ndarray], np.ndarray]) -> list[float]:
    """Seconds of each of ARRAY_REPEATS POSTs of ARRAY_POINTS points, after two untimed ones, on a fresh
    kept-alive connection (the last one was closed by the server's keep-alive timeout meanwhile)."""
    url = urlparse(base)
    conn = http.client.HTTPConnection(url.hostname, url.port, timeout=60)
    pressures = np.geomspace(1.0, 20_000.0, ARRAY_POINTS)  # kPa, as bench/arrays.py
    try:
        timed_posts(conn, post, pressures, 2)  # untimed: the connection and the server warm up
        return timed_posts(conn, post, pressures, ARRAY_REPEATS)
    finally:
        conn.close()


def measure(servers: dict[str, tuple[str, int]], wrk: str) -> list[dict[str, dict[str, float]]]:
    """Per round, per revision label: each case's wrk figures and each array POST's median seconds."""
    rounds: list[dict[str, dict[str, float]]] = []
    labels = list(servers)
    for round_ in range(ROUNDS):
        order = labels if round_ % 2 == 0 else labels[::-1]
        figures: dict[str, dict[str, float]] = {label: {} for label in labels}
        for name, path, script in CASES:
            for label in order:
                base, master = servers[label]
                for key, value in run_wrk(wrk, base + path, script, master, round_).items():
                    figures[label][f"{name}|{key}"] = value
        for body, post in POSTS.items():
            for label in order:
                figures[label][f"POST {body}|s"] = statistics.median(array_times(servers[label][0], post))
        rounds.append(figures)
        print(f"round {round_ + 1} of {ROUNDS} done", flush=True)
    return rounds


def report(rounds: list[dict[str, dict[str, float]]], names: dict[str, str], elapsed: float) -> str:
    before, after = names  # labels, in the order BASE, HEAD

    def median(label: str, key: str) -> float:
        return statistics.median(r[label][key] for r in rounds)

    def to_healthz(r: dict[str, dict[str, float]], label: str, name: str) -> float:
        return r[label][f"{name}|rps"] / r[label][f"{HEALTHZ}|rps"]

    lines = [
        "| request | revision | requests/s | ratio to /healthz | worker CPU us/request | p50 ms | p99 ms | non-2xx |",
        "| --- | --- | ---: | ---: | ---: | ---: | ---: | ---: |",
    ]
    for name, *_ in CASES:
        for label in (before, after):
            ratio = statistics.median(to_healthz(r, label, name) for r in rounds)
            errors = sum(r[label][f"{name}|errors"] for r in rounds)
            lines.append(
                f"| {name} | {names[label]} | {median(label, f'{name}|rps'):,.0f} | {ratio:.2f} | "
                f"{median(label, f'{name}|cpu_us'):,.0f} | {median(label, f'{name}|p50'):.2f} | "
                f"{median(label, f'{name}|p99'):.2f} | {errors:.0f} |"
            )
    lines += [
        "",
        "| body | points | revision | median s | points/s |",
        "| --- | ---: | --- | ---: | ---: |",
    ]
    for body in POSTS:
        for label in (before, after):
            seconds = median(label, f"POST {body}|s")
            lines.append(
                f"| {body} | {ARRAY_POINTS:,} | {names[label]} | {seconds:.4f} | {ARRAY_POINTS / seconds:,.0f} |"
            )

    def change(measure: str, per_round: Callable[[dict[str, dict[str, float]]], float], better: str) -> str:
        values = [per_round(r) for r in rounds]
        noisy = " (noisy)" if max(values) > NOISY * min(values) else ""
        return (
            f"| {measure} | {statistics.median(values):.3f} | {min(values):.3f} - {max(values):.3f}{noisy} | {better} |"
        )

    lines += [
        "",
        f"{names[after]} / {names[before]}, the median of the per-round ratios, beside their range over the rounds:",
        "",
        "| measure | after / before | per-round range | better when |",
        "| --- | ---: | --- | --- |",
    ]
    for name, *_ in CASES:
        lines.append(
            change(f"{name}: requests/s", lambda r, n=name: r[after][f"{n}|rps"] / r[before][f"{n}|rps"], "above 1")
        )
    for name, *_ in CASES[1:]:
        lines.append(
            change(
                f"{name}: ratio to /healthz",
                lambda r, n=name: to_healthz(r, after, n) / to_healthz(r, before, n),
                "above 1",
            )
        )
    for name, *_ in CASES:
        lines.append(
            change(
                f"{name}: worker CPU per request",
                lambda r, n=name: r[after][f"{n}|cpu_us"] / r[before][f"{n}|cpu_us"],
                "below 1",
            )
        )
    for body in POSTS:
        lines.append(
            change(
                f"POST {ARRAY_POINTS:,} points, {body}: seconds",
                lambda r, b=body: r[after][f"POST {b}|s"] / r[before][f"POST {b}|s"],
                "below 1",
            )
        )
    lines += [
        "",
        f"wrk -t{THREADS} -c{CONNECTIONS} -d{DURATION} on loopback, bench/throughput.py's cases, each revision's "
        "docker/gunicorn.conf.py with its default worker class, both servers up side by side; "
        f"{ROUNDS} rounds, each case (and then the array POSTs: {ARRAY_REPEATS} per figure, its median) against "
        "one revision and then the other, the first revision first in even rounds and second in odd ones. "
        f"Figures are medians over the rounds. Rows marked noisy moved by more than {NOISY - 1:.0%} between "
        "rounds: judge a change by the steadier rows (worker CPU per request, the array POSTs) and by medians "
        "well outside the range that identical revisions show. "
        f"Whole run {elapsed / 60:.1f} min.",
    ]
    return "\n".join(lines)


def main() -> None:
    base_rev = sys.argv[1] if len(sys.argv) > 1 else "eb6c1ea"
    head_rev = sys.argv[2] if len(sys.argv) > 2 else "HEAD"
    commits = {"base": git("rev-parse", "--verify", f"{base_rev}^{{commit}}")}
    commits["head"] = git("rev-parse", "--verify", f"{head_rev}^{{commit}}")
    names = {
        label: f"{label.upper()} {commits[label][:7]}" + ("" if commits[label].startswith(rev) else f" ({rev})")
        for label, rev in (("base", base_rev), ("head", head_rev))
    }
    signal.signal(signal.SIGTERM, lambda *_: sys.exit(143))  # so that the worktrees go on `kill` too
    wrk = ensure_wrk()
    start = time.perf_counter()
    with worktrees(commits) as trees, contextlib.ExitStack() as stack:
        servers = {}
        for label, tree in trees.items():
            print(f"{names[label]}: service from {imported_from(tree)}", flush=True)
            metrics = tree.parent / f"metrics-{label}"  # each server its own, not the shared default
            log = tree.parent / f"gunicorn-{label}.log"
            try:
                servers[label] = stack.enter_context(
                    gunicorn(free_port(), root=tree, log=log, PROMETHEUS_MULTIPROC_DIR=str(metrics))
                )
            except RuntimeError:
                print(log.read_text(errors="replace")[-3000:], file=sys.stderr)
                raise
            cwd = Path(f"/proc/{servers[label][1]}/cwd").resolve()
            assert cwd == tree.resolve(), f"gunicorn runs in {cwd}, not in {tree}"
        rounds = measure(servers, wrk)
    body = report(rounds, names, time.perf_counter() - start)
    write_section("compare", f"Measured {machine()}.\n\n{body}")


if __name__ == "__main__":
    main()
