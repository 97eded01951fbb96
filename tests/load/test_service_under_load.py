"""The service under gunicorn takes load, loses a worker, and drains on SIGTERM.

Every request goes to 127.0.0.1 on a free port, from a bounded number of threads for a
bounded time. ``make test`` runs these for a few seconds each; ``make soak`` runs them long
(BOILING_SOAK_SECONDS) and writes the figures to bench/README.md.
"""

from __future__ import annotations

import contextlib
import http.client
import json
import os
import signal
import socket
import subprocess
import sys
import threading
import time
from collections import Counter
from collections.abc import Iterator
from dataclasses import dataclass, field
from pathlib import Path

import pytest

ROOT = Path(__file__).resolve().parents[2]
SECONDS = float(os.environ.get("BOILING_SOAK_SECONDS", "6"))
THREADS = 6
WORKERS = 3

pytestmark = pytest.mark.load

REQUESTS = [
    ("GET", "/v1/boiling-point?gauge_pressure={i}&elevation=1420", None),
    ("GET", "/v1/atmosphere?elevation={i}", None),
    ("GET", "/v1/saturation-margin?fluid=ethanol&temperature=40&pressure={i}", None),
    ("POST", "/v1/vapor-pressure", json.dumps({"fluid": "toluene", "temperature": [20 + k / 10 for k in range(1000)]})),
    ("GET", "/healthz", None),
]


@dataclass
class Server:
    process: subprocess.Popen
    port: int

    def workers(self) -> list[int]:
        children = Path(f"/proc/{self.process.pid}/task/{self.process.pid}/children").read_text().split()
        return [int(c) for c in children]

    def worker_memory_mib(self) -> float:
        total = 0
        for pid in self.workers():
            with contextlib.suppress(FileNotFoundError):
                for line in Path(f"/proc/{pid}/status").read_text().splitlines():
                    if line.startswith("VmRSS:"):
                        total += int(line.split()[1])
        return total / 1024


@contextlib.contextmanager
def gunicorn(**settings: str) -> Iterator[Server]:
    """The service under gunicorn with docker/gunicorn.conf.py, as `make serve` runs it; ``settings`` add to its
    environment."""
    with socket.socket() as s:
        s.bind(("127.0.0.1", 0))
        port = s.getsockname()[1]
    env = {
        **os.environ,
        "HOST": "127.0.0.1",
        "PORT": str(port),
        "WEB_CONCURRENCY": str(WORKERS),
        "LOG_LEVEL": "warning",
        "PROMETHEUS_MULTIPROC_DIR": f"/tmp/boiling-load-{port}",
        **settings,
    }
    gunicorn_bin = str(Path(sys.executable).with_name("gunicorn"))
    process = subprocess.Popen(
        [gunicorn_bin, "-c", "docker/gunicorn.conf.py", "service:create_app()"],
        cwd=ROOT,
        env=env,
        stdout=subprocess.DEVNULL,
        stderr=subprocess.DEVNULL,
    )
    server = Server(process, port)
    try:
        deadline = time.monotonic() + 30
        while time.monotonic() < deadline:
            with contextlib.suppress(OSError):
                if get(port, "/readyz")[0] == 200 and len(server.workers()) == WORKERS:
                    break
            time.sleep(0.1)
        else:
            raise RuntimeError("gunicorn did not start")
        yield server
    finally:
        if process.poll() is None:
            process.kill()
        process.wait(timeout=30)


def get(port: int, path: str) -> tuple[int, bytes]:
    conn = http.client.HTTPConnection("127.0.0.1", port, timeout=10)
    try:
        conn.request("GET", path)
        response = conn.getresponse()
        return response.status, response.read()
    finally:
        conn.close()


@dataclass
class Load:
    """Threads sending the mix of REQUESTS until stopped, counting statuses and failures."""

    port: int
    statuses: Counter = field(default_factory=Counter)
    failures: int = 0
    stop: threading.Event = field(default_factory=threading.Event)
    lock: threading.Lock = field(default_factory=threading.Lock)

    def _run(self, seed: int) -> None:
        conn = http.client.HTTPConnection("127.0.0.1", self.port, timeout=10)
        i = seed
        while not self.stop.is_set():
            method, path, body = REQUESTS[i % len(REQUESTS)]
            i += 1
            headers = {"Content-Type": "application/json"} if body else {}
            try:
                conn.request(method, path.format(i=(i * 37) % 900 + 10), body, headers)
                response = conn.getresponse()
                response.read()
                with self.lock:
                    self.statuses[response.status] += 1
            except (OSError, http.client.HTTPException):
                with self.lock:
                    self.failures += 1
                conn.close()
                conn = http.client.HTTPConnection("127.0.0.1", self.port, timeout=10)
        conn.close()

    @contextlib.contextmanager
    def running(self) -> Iterator[Load]:
        threads = [threading.Thread(target=self._run, args=(n * 1000,)) for n in range(THREADS)]
        for t in threads:
            t.start()
        try:
            yield self
        finally:
            self.stop.set()
            for t in threads:
                t.join(timeout=30)

    @property
    def total(self) -> int:
        return sum(self.statuses.values()) + self.failures

    @property
    def errors(self) -> int:
        return self.failures + sum(n for status, n in self.statuses.items() if status >= 400)


def report(name: str, text: str) -> None:
    print(f"\n[{name}] {text}")  # shown with -s or in the captured output of a failure
    if os.environ.get("BOILING_LOAD_REPORT"):
        readme = ROOT / "bench" / "README.md"
        start, end = f"<!-- load-{name}:start -->", f"<!-- load-{name}:end -->"
        content = readme.read_text()
        before, _, rest = content.partition(start)
        _, _, after = rest.partition(end)
        readme.write_text(f"{before}{start}\n{text}\n{end}{after}")


def test_sustained_load_without_errors_and_with_stable_memory() -> None:
    with gunicorn() as server:
        warm = Load(server.port)
        with warm.running():
            time.sleep(min(2.0, SECONDS / 3))
        before = server.worker_memory_mib()
        load = Load(server.port)
        with load.running():
            time.sleep(SECONDS)
        after = server.worker_memory_mib()
    report(
        "sustained",
        f"{SECONDS:.0f} s, {THREADS} client threads, {WORKERS} workers: {load.total} requests, "
        f"{load.errors} errors, {load.total / SECONDS:.0f} requests/s; worker memory {before:.0f} MiB before, "
        f"{after:.0f} MiB after.",
    )
    assert load.total > 0
    assert load.errors == 0, (load.statuses, load.failures)
    assert after <= before * 1.25 + 16, (before, after)


def test_a_killed_worker_is_replaced_and_only_its_requests_fail() -> None:
    with gunicorn() as server:
        load = Load(server.port)
        with load.running():
            time.sleep(1.0)
            victim = server.workers()[0]
            os.kill(victim, signal.SIGKILL)
            time.sleep(max(3.0, SECONDS / 2))
        deadline = time.monotonic() + 15
        while time.monotonic() < deadline and (len(server.workers()) < WORKERS or victim in server.workers()):
            time.sleep(0.1)
        workers = server.workers()
        status, _ = get(server.port, "/v1/boiling-point?pressure=101.325")
    report(
        "kill",
        f"SIGKILL to worker {victim} under load: {load.total} requests, {load.errors} failed "
        f"(at most {THREADS} can be in flight); {len(workers)} workers afterwards, still answering ({status}).",
    )
    assert victim not in workers and len(workers) == WORKERS
    assert status == 200
    assert load.errors <= THREADS


def test_sigterm_drains_requests_in_flight() -> None:
    body = json.dumps({"temperature": [20.0 + (k % 300) * 0.25 for k in range(100_000)]}).encode()
    results: list[int | str] = []

    def slow_post(port: int) -> None:
        conn = http.client.HTTPConnection("127.0.0.1", port, timeout=30)
        try:
            conn.request("POST", "/v1/vapor-pressure?format=csv", body, {"Content-Type": "application/json"})
            results.append(conn.getresponse().status)
        except (OSError, http.client.HTTPException) as exc:
            results.append(type(exc).__name__)
        finally:
            conn.close()

    with gunicorn() as server:
        threads = [threading.Thread(target=slow_post, args=(server.port,)) for _ in range(WORKERS)]
        for t in threads:
            t.start()
        time.sleep(0.05)  # the bodies are sent; the workers are computing
        server.process.send_signal(signal.SIGTERM)
        for t in threads:
            t.join(timeout=30)
        code = server.process.wait(timeout=30)
    report("drain", f"SIGTERM with {WORKERS} 100,000-point requests in flight: answers {results}; master exit {code}.")
    assert results == [200] * WORKERS
    assert code == 0


def test_slow_clients_hold_no_worker_and_get_a_408() -> None:
    # Twelve clients, four times the workers: half send their headers and part of the body and stop, half
    # trickle the body a byte at a time. /healthz keeps answering fast, an ordinary POST is answered, and
    # each slow client gets a problem+json 408 once BOILING_BODY_TIMEOUT has passed.
    timeout = 2.0
    with gunicorn(BOILING_BODY_TIMEOUT=str(int(timeout))) as server:
        stop = threading.Event()
        slow = [socket.create_connection(("127.0.0.1", server.port)) for _ in range(4 * WORKERS)]
        head = (
            b"POST /v1/boiling-point HTTP/1.1\r\nHost: t\r\n"
            b"Content-Type: application/json\r\nContent-Length: 64\r\n\r\n"
        )
        for client in slow:
            client.sendall(head + b'{"pres')

        def trickle(client: socket.socket) -> None:
            while not stop.wait(0.3):
                with contextlib.suppress(OSError):
                    client.sendall(b" ")

        tricklers = [threading.Thread(target=trickle, args=(c,), daemon=True) for c in slow[::2]]
        for t in tricklers:
            t.start()
        started = time.monotonic()
        latencies = []
        while time.monotonic() - started < timeout * 0.8:
            t0 = time.perf_counter()
            assert get(server.port, "/healthz")[0] == 200
            latencies.append(time.perf_counter() - t0)
            time.sleep(0.05)
        conn = http.client.HTTPConnection("127.0.0.1", server.port, timeout=10)
        conn.request("POST", "/v1/boiling-point", b'{"pressure": [100, 50]}', {"Content-Type": "application/json"})
        ordinary = conn.getresponse().status
        conn.close()
        answers = []
        for client in slow:
            client.settimeout(timeout + 5)
            answers.append(client.recv(65536).split(b"\r\n\r\n", 1)[0])
        waited = time.monotonic() - started
        stop.set()
        for client in slow:
            client.close()
    report(
        "slow-clients",
        f"{len(slow)} slow clients against {WORKERS} gevent workers: /healthz answered {len(latencies)} times, "
        f"slowest {max(latencies) * 1e3:.1f} ms; every slow client had its 408 after {waited:.1f} s "
        f"(BOILING_BODY_TIMEOUT={timeout:g} s).",
    )
    assert max(latencies) < 1.0, latencies
    assert ordinary == 200
    for answer in answers:
        assert answer.startswith(b"HTTP/1.1 408"), answer
        assert b"Content-Type: application/problem+json" in answer, answer
    assert waited < timeout + 3


def test_instances_keep_no_control_socket_to_share(tmp_path: Path) -> None:
    # gunicorn's control socket defaults to one path in the home directory: a second instance of the same
    # user took it over, and stopping either removed it. The configuration turns it off.
    home = {"HOME": str(tmp_path), "XDG_RUNTIME_DIR": ""}
    with gunicorn(**home) as first, gunicorn(**home) as second:
        first.process.send_signal(signal.SIGTERM)
        first.process.wait(timeout=30)
        assert get(second.port, "/healthz")[0] == 200
        assert not list(tmp_path.rglob("*.ctl")), list(tmp_path.rglob("*"))


def test_a_client_that_never_finishes_its_headers_is_let_go() -> None:
    # The headers of a request, like the wait for the next one on a kept-alive connection, get gunicorn's
    # keepalive time (5 s, docker/gunicorn.conf.py); then the connection is closed, with nothing sent.
    with gunicorn() as server:
        started = time.monotonic()
        client = socket.create_connection(("127.0.0.1", server.port))
        client.sendall(b"GET /healthz HTTP/1.1\r\nHost: t\r\n")  # and never the blank line
        client.settimeout(15)
        assert get(server.port, "/healthz")[0] == 200
        assert client.recv(1024) == b""
        waited = time.monotonic() - started
        client.close()
    assert 4 < waited < 8, waited
