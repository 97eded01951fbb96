"""RFC 9457 problems (``service.api.problems``): unknown paths and methods, the body limit, errors as
text to a request that asked for text, and no internals in a 500. :func:`problem` checks a problem
answer for the other API tests."""


def problem(response, status: int) -> dict:
    assert response.status_code == status, response.get_json()
    assert response.mimetype == "application/problem+json"
    body = response.get_json()
    assert body["status"] == status
    assert body["type"].startswith("urn:boiling-point:problem:")
    assert "Traceback" not in body["detail"] and "/site-packages/" not in body["detail"]
    return body


def test_unknown_path_and_method(client) -> None:
    problem(client.get("/v1/boiling-points"), 404)
    assert client.client.delete("/v1/boiling-point").status_code == 405


def test_errors_come_as_text_to_a_request_that_asked_for_text(client) -> None:
    for r in (
        client.get("/v1/boiling-point?pressure=-5&format=text"),
        client.get("/v1/boiling-point?pressure=-5", headers={"Accept": "text/plain"}),
        client.post("/v1/boiling-point?format=csv", json={"pressure": [-5]}),
    ):
        assert r.status_code == 422 and r.mimetype == "text/plain"
        text = r.get_data(as_text=True)
        assert "status: 422" in text and "error: pressure: " in text
    assert client.get("/v1/boiling-point?pressure=-5").mimetype == "application/problem+json"


def test_the_body_limit_is_named(app) -> None:
    small = app.test_client()
    app.config["MAX_CONTENT_LENGTH"], before = 1000, app.config["MAX_CONTENT_LENGTH"]
    try:
        body = small.post("/v1/atmosphere", json={"elevation": [1000.0] * 500}).get_json()
        assert body["status"] == 413 and "the limit is 1000 bytes" in body["detail"]
    finally:
        app.config["MAX_CONTENT_LENGTH"] = before


def test_body_size_limit(app) -> None:
    small = app.test_client()
    app.config["MAX_CONTENT_LENGTH"], before = 1000, app.config["MAX_CONTENT_LENGTH"]
    try:
        r = small.post("/v1/atmosphere", json={"elevation": [1000.0] * 500})
        assert r.status_code == 413 and r.mimetype == "application/problem+json"
    finally:
        app.config["MAX_CONTENT_LENGTH"] = before


def test_errors_hold_no_internals(client, app, monkeypatch) -> None:
    def explode(*_: object) -> None:
        raise RuntimeError("/site-packages/secret.py line 3")

    monkeypatch.setattr("service.fluids.questions.local_pressure", explode)
    r = client.client.get("/v1/boiling-point?pressure=100.5")  # a 500 is no documented answer
    assert r.status_code == 500 and r.mimetype == "application/problem+json"
    assert "site-packages" not in r.get_data(as_text=True) and "Traceback" not in r.get_data(as_text=True)
