"""gunicorn settings for production and for `make serve`; every value can be set from the environment.

HOST and PORT choose the address (default 127.0.0.1:8000; the container sets HOST=0.0.0.0).
WEB_CONCURRENCY sets the number of worker processes (default: 2 per CPU core plus 1, at most 9).
"""

import multiprocessing
import os

bind = f"{os.environ.get('HOST', '127.0.0.1')}:{os.environ.get('PORT', '8000')}"
workers = int(os.environ.get("WEB_CONCURRENCY", min(2 * multiprocessing.cpu_count() + 1, 9)))
worker_class = "sync"
# A request is a few milliseconds of numpy; anything near this limit is a fault, not work.
timeout = int(os.environ.get("GUNICORN_TIMEOUT", "30"))
graceful_timeout = int(os.environ.get("GUNICORN_GRACEFUL_TIMEOUT", "20"))
keepalive = 5
# Recycle workers now and then, with jitter so they do not restart together.
max_requests = 20_000
max_requests_jitter = 2_000
# Build the app (catalog, schemas, OpenAPI document) once, before forking.
preload_app = True
accesslog = "-"
errorlog = "-"
loglevel = os.environ.get("LOG_LEVEL", "info")
access_log_format = '%(h)s "%(r)s" %(s)s %(b)s %(M)sms'
# Header limits: a query string longer than this is refused by gunicorn itself (414).
limit_request_line = 8190
limit_request_fields = 100
