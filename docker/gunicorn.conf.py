"""gunicorn settings for production and for `make serve`; every value can be set from the environment.

HOST and PORT choose the address (default 127.0.0.1:8000; the container sets HOST=0.0.0.0).
WEB_CONCURRENCY sets the number of worker processes (default: 2 per CPU core plus 1, at most 9).
Logs are JSON lines on stdout: the service writes one access line per request (with its
request id); gunicorn's own messages use the same format.
"""

import multiprocessing
import os
import shutil
import tempfile

bind = f"{os.environ.get('HOST', '127.0.0.1')}:{os.environ.get('PORT', '8000')}"
workers = int(os.environ.get("WEB_CONCURRENCY", min(2 * multiprocessing.cpu_count() + 1, 9)))
# gevent: a client that sends its body slowly, or never finishes it, holds a greenlet rather than a worker;
# the service gives each body BOILING_BODY_TIMEOUT seconds (then 408), and waits for the next request on a
# kept-alive connection for `keepalive` seconds. The computing itself is numpy and holds the worker while it
# runs, as a sync worker would. GUNICORN_WORKER_CLASS=sync gives the old model (bench/throughput.py compares).
worker_class = os.environ.get("GUNICORN_WORKER_CLASS", "gevent")
worker_connections = int(os.environ.get("GUNICORN_WORKER_CONNECTIONS", "1000"))
# A request is a few milliseconds of numpy; anything near this limit is a fault, not work.
timeout = int(os.environ.get("GUNICORN_TIMEOUT", "30"))
# On SIGTERM, workers finish the requests in flight for up to this long, then exit.
graceful_timeout = int(os.environ.get("GUNICORN_GRACEFUL_TIMEOUT", "20"))
keepalive = 5
# Recycle workers now and then, with jitter so they do not restart together.
max_requests = 20_000
max_requests_jitter = 2_000
# Build the app (catalog, schemas, OpenAPI document) once, before forking.
preload_app = True
loglevel = os.environ.get("LOG_LEVEL", "info")
accesslog = None  # the service logs each request itself, as JSON with its request id
errorlog = "-"
_JSON_STDOUT = {"class": "logging.StreamHandler", "formatter": "json", "stream": "ext://sys.stdout"}
logconfig_dict = {  # gunicorn's own handler names, pointed at JSON lines on stdout
    "version": 1,
    "disable_existing_loggers": False,
    "formatters": {"json": {"()": "service.api.observability.JsonLogFormatter"}},
    "handlers": {"console": _JSON_STDOUT, "error_console": _JSON_STDOUT},
    "root": {"level": loglevel.upper(), "handlers": ["console"]},
    "loggers": {"gunicorn.error": {"handlers": ["error_console"], "level": loglevel.upper(), "propagate": False}},
}
# No control socket: gunicorn would keep one at a fixed path in the home directory, shared by every instance
# of the user, so that stopping one instance removed another's. Nothing here uses gunicornc.
control_socket_disable = True
# Header limits. The service itself refuses query strings over BOILING_MAX_QUERY_BYTES with a 414
# problem; gunicorn's own limit sits above it.
limit_request_line = 8190
limit_request_fields = 100

# Prometheus metrics shared by all workers: each worker writes its own files in this directory.
# It must be set before prometheus_client is first imported.
os.environ.setdefault("PROMETHEUS_MULTIPROC_DIR", os.path.join(tempfile.gettempdir(), "boiling-point-metrics"))
from prometheus_client import multiprocess  # noqa: E402


def on_starting(server):
    """Start from an empty metrics directory."""
    directory = os.environ["PROMETHEUS_MULTIPROC_DIR"]
    shutil.rmtree(directory, ignore_errors=True)
    os.makedirs(directory, exist_ok=True)


def child_exit(server, worker):
    """Drop a dead worker's live gauges from the shared metrics."""
    multiprocess.mark_process_dead(worker.pid)
