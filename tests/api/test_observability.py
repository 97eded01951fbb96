"""What every request leaves behind (``service.api.observability``): its request id, the Prometheus
metrics and the JSON access log."""

import json
import logging

from service.api.observability import JsonLogFormatter


def test_request_id_is_echoed_or_made(client) -> None:
    assert client.get("/healthz", headers={"X-Request-ID": "tag-TI-4711"}).headers["X-Request-ID"] == "tag-TI-4711"
    made = client.get("/healthz").headers["X-Request-ID"]
    assert len(made) == 32
    hostile = client.get("/healthz", headers={"X-Request-ID": "x" * 500}).headers["X-Request-ID"]
    assert hostile != "x" * 500  # not echoed: too long, or not plain characters


def test_metrics_count_requests_and_points(client) -> None:
    client.post("/v1/vapor-pressure", json={"temperature": [20, 30, 40]})
    client.get("/v1/vapor-pressure?temperature=-100")
    text = client.get("/metrics").get_data(as_text=True)
    assert 'boiling_requests_total{method="POST",path="/v1/vapor-pressure",status="200"}' in text
    assert 'boiling_requests_total{method="GET",path="/v1/vapor-pressure",status="422"}' in text
    assert 'boiling_points_computed_total{path="/v1/vapor-pressure"}' in text
    assert "boiling_request_duration_seconds_bucket" in text


def test_access_log_is_json_with_the_request_id(client) -> None:
    records: list[logging.LogRecord] = []
    handler = logging.Handler()
    handler.emit = records.append
    logging.getLogger("service.access").addHandler(handler)
    try:
        client.get("/v1/boiling-point?pressure=100", headers={"X-Request-ID": "trace-42"})
    finally:
        logging.getLogger("service.access").removeHandler(handler)
    line = json.loads(JsonLogFormatter().format(records[-1]))
    assert line["request_id"] == "trace-42" and line["status"] == 200 and line["path"] == "/v1/boiling-point"
    assert line["level"] == "info" and "duration_ms" in line


def test_metrics_content_type_and_no_python_version(client) -> None:
    r = client.get("/metrics")
    assert r.headers["Content-Type"].count("charset") == 1  # found by the fuzz test
    assert "python_info" not in r.get_data(as_text=True)
