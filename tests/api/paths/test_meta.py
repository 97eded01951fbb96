"""Index, health, readiness and the served OpenAPI document (``service.api.paths.meta``); the document
itself is ``tests/api/test_openapi.py``'s."""

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


def test_served_document_is_the_committed_one(client, openapi_document) -> None:
    assert client.get("/openapi.json").get_json() == openapi_document
