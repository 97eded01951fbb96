"""Index, health, readiness, and the OpenAPI document (served and committed)."""

import yaml
from openapi_spec_validator import validate

from service.api.openapi import document_yaml
from tests.conftest import ROOT

SERVICE_PATHS = ("/healthz", "/readyz", "/metrics", "/openapi.json")
V1_PATHS = (
    "/v1/boiling-point",
    "/v1/vapor-pressure",
    "/v1/elevation",
    "/v1/atmosphere",
    "/v1/saturation-margin",
    "/v1/npsh-available",
    "/v1/fluids",
)


def test_index_lists_the_paths(client) -> None:
    body = client.get("/").get_json()
    for path in (*V1_PATHS, *SERVICE_PATHS):
        assert path in body["paths"]


def test_health_and_readiness(client) -> None:
    assert client.get("/healthz").get_json() == {"status": "ok"}
    ready = client.get("/readyz").get_json()
    assert ready["status"] == "ready" and ready["fluids"] >= 1


def test_committed_document_is_valid_openapi_31(openapi_document) -> None:
    assert openapi_document["openapi"] == "3.1.0"
    validate(openapi_document)


def test_committed_document_has_not_drifted_from_the_code(app) -> None:
    # `make openapi` regenerates the file; this fails when the schemas changed without it.
    with app.app_context():
        assert document_yaml() == (ROOT / "openapi" / "openapi.yaml").read_text(encoding="utf-8")


def test_served_document_is_the_committed_one(client, openapi_document) -> None:
    assert client.get("/openapi.json").get_json() == openapi_document


def test_every_path_and_unit_is_documented(openapi_document) -> None:
    text = yaml.safe_dump(openapi_document)
    for path in (*V1_PATHS, "/v1/fluids/{name}", *SERVICE_PATHS, "/"):
        assert path in openapi_document["paths"]
    for code in (
        "Pa",
        "hPa",
        "kPa",
        "MPa",
        "bar",
        "mbar",
        "atm",
        "psi",
        "mmHg",
        "Torr",
        "inHg",
        "degC",
        "degF",
        "degR",
        "km",
        "ft",
    ):
        assert code in text
    for path, item in openapi_document["paths"].items():
        for method, operation in item.items():
            assert "200" in operation["responses"], (path, method)
            if path.startswith("/v1/") and method == "get" and path != "/v1/fluids":
                assert "400" in operation["responses"] or "404" in operation["responses"], path
