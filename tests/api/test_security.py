"""What guards every request (``service.api.security``): the query-string limit, the API key, the JSON
body's depth, CORS and the security headers."""

import pytest

from service import create_app
from service.api.security import json_depth_exceeds
from tests.conftest import ContractClient


@pytest.fixture
def keyed(openapi_document, monkeypatch) -> ContractClient:
    monkeypatch.setenv("BOILING_API_KEY", "kessock-fell-2026")
    monkeypatch.setenv("BOILING_CORS_ORIGINS", "https://dash.kessock.example")
    return ContractClient(create_app(), openapi_document)


def test_security_headers_everywhere(client) -> None:
    for response in (
        client.get("/v1/boiling-point?pressure=100"),
        client.get("/v1/boiling-point?pressure=-1"),
        client.get("/nowhere"),
    ):
        assert response.headers["X-Content-Type-Options"] == "nosniff"
        assert "default-src 'none'" in response.headers["Content-Security-Policy"]


def test_cors_is_off_by_default(client) -> None:
    r = client.get("/v1/boiling-point?pressure=100", headers={"Origin": "https://evil.example"})
    assert "Access-Control-Allow-Origin" not in r.headers


def test_cors_for_listed_origins(keyed) -> None:
    auth = {"Authorization": "Bearer kessock-fell-2026"}
    ok = keyed.get("/v1/boiling-point?pressure=100", headers={"Origin": "https://dash.kessock.example", **auth})
    assert ok.headers["Access-Control-Allow-Origin"] == "https://dash.kessock.example"
    other = keyed.get("/v1/boiling-point?pressure=100", headers={"Origin": "https://evil.example", **auth})
    assert "Access-Control-Allow-Origin" not in other.headers
    preflight = keyed.client.options(
        "/v1/boiling-point", headers={"Origin": "https://dash.kessock.example", "Access-Control-Request-Method": "POST"}
    )
    assert preflight.status_code == 200 and "POST" in preflight.headers["Access-Control-Allow-Methods"]


def test_api_key(keyed) -> None:
    missing = keyed.get("/v1/boiling-point?pressure=100")
    assert missing.status_code == 401 and missing.headers["WWW-Authenticate"].startswith("Bearer")
    assert keyed.get("/v1/fluids", headers={"Authorization": "Bearer wrong"}).status_code == 401
    good = keyed.get("/v1/boiling-point?pressure=100", headers={"Authorization": "Bearer kessock-fell-2026"})
    assert good.status_code == 200
    for open_path in ("/healthz", "/readyz", "/metrics", "/openapi.json", "/"):
        assert keyed.get(open_path).status_code == 200, open_path


def test_long_query_strings_get_414(client, app) -> None:
    r = client.get("/v1/boiling-point?pressure=100&fluid=" + "w" * app.config["MAX_QUERY_BYTES"])
    assert r.status_code == 414 and r.mimetype == "application/problem+json"


def test_deep_json_gets_400(client) -> None:
    r = client.post(
        "/v1/boiling-point", data='{"pressure": ' + "[" * 40 + "1" + "]" * 40 + "}", content_type="application/json"
    )
    assert r.status_code == 400 and "nests deeper" in r.get_json()["detail"]


def test_json_depth_ignores_brackets_in_strings() -> None:
    assert not json_depth_exceeds(b'{"fluid": {"name": "[[[[[[[[[[[[[[[[[[[[x\\"[[[[\\\\"}}', 3)
    assert json_depth_exceeds(b'{"a": [[[[{"b": 1}]]]]}', 4)
    assert not json_depth_exceeds(b'{"pressure": [' + b"1," * 1000 + b"1]}", 2)


def test_the_bearer_scheme_is_matched_without_regard_to_case() -> None:
    # RFC 9110, section 11.1: the authentication scheme is a case-insensitive token.
    keyed = create_app({"API_KEY": "kessock-fell-2026"}).test_client()
    for scheme in ("Bearer", "bearer", "BEARER"):
        r = keyed.get("/v1/boiling-point?pressure=100", headers={"Authorization": f"{scheme} kessock-fell-2026"})
        assert r.status_code == 200, scheme
    assert keyed.get("/v1/boiling-point?pressure=100", headers={"Authorization": "Basic kessock"}).status_code == 401
