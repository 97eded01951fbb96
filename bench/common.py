"""Shared pieces of the benchmarks: the machine line, the README writer, a gunicorn server."""

from __future__ import annotations

import contextlib
import os
import platform
import socket
import subprocess
import sys
import time
import urllib.request
from collections.abc import Iterator
from datetime import UTC, datetime
from pathlib import Path

ROOT = Path(__file__).resolve().parents[1]
README = ROOT / "bench" / "README.md"


def machine() -> str:
    """One line naming the machine, the Python and numpy versions, and the date."""
    import numpy as np  # noqa: PLC0415 - only benchmarks need it here

    cpu = "unknown CPU"
    with contextlib.suppress(OSError):
        for line in Path("/proc/cpuinfo").read_text().splitlines():
            if line.startswith("model name"):
                cpu = line.split(":", 1)[1].strip()
                break
    return (
        f"{datetime.now(UTC):%Y-%m-%d %H:%M} UTC; {os.cpu_count()} cores, {cpu}; "
        f"Python {platform.python_version()}, numpy {np.__version__}"
    )


def write_section(name: str, body: str) -> None:
    """Replace the text between ``<!-- name:start -->`` and ``<!-- name:end -->`` in bench/README.md."""
    text = README.read_text(encoding="utf-8")
    start, end = f"<!-- {name}:start -->", f"<!-- {name}:end -->"
    before, _, rest = text.partition(start)
    _, _, after = rest.partition(end)
    README.write_text(f"{before}{start}\n{body.strip()}\n{end}{after}", encoding="utf-8")
    print(body)


def free_port() -> int:
    with socket.socket() as s:
        s.bind(("127.0.0.1", 0))
        return s.getsockname()[1]


@contextlib.contextmanager
def gunicorn(port: int, root: Path = ROOT, log: Path | None = None, **env: str) -> Iterator[tuple[str, int]]:
    """The service under gunicorn with docker/gunicorn.conf.py, as `make serve` starts it: its URL and master pid.

    ``root`` is the checkout to serve (another one, such as a worktree of an older revision, brings its own
    code, put first on PYTHONPATH, and its own gunicorn.conf.py); ``log`` keeps gunicorn's output.
    """
    environ = {**os.environ, "HOST": "127.0.0.1", "PORT": str(port), **env}
    if root != ROOT:
        environ["PYTHONPATH"] = os.pathsep.join([str(root), *filter(None, [os.environ.get("PYTHONPATH")])])
    output = open(log, "wb") if log else subprocess.DEVNULL  # noqa: SIM115 - closed below
    process = subprocess.Popen(
        [
            str(Path(sys.executable).with_name("gunicorn")),
            "--config",
            "docker/gunicorn.conf.py",
            "service:create_app()",
        ],
        cwd=root,
        env=environ,
        stdout=output,
        stderr=subprocess.STDOUT if log else subprocess.DEVNULL,
    )
    base = f"http://127.0.0.1:{port}"
    try:
        for _ in range(100):
            with contextlib.suppress(OSError):
                urllib.request.urlopen(f"{base}/readyz", timeout=1).read()
                break
            time.sleep(0.1)
        else:
            raise RuntimeError("gunicorn did not become ready")
        yield base, process.pid
    finally:
        process.terminate()
        process.wait(timeout=30)
        if log:
            output.close()
