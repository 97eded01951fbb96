"""The OpenAPI document (``service.api.openapi``): the committed file is valid OpenAPI 3.1, documents
every path and unit, and has not drifted from the code. ``paths/test_meta.py`` checks it is served."""

import yaml
from openapi_spec_validator import validate

from service.api.openapi import document_yaml
from tests.api.paths.test_meta import SERVICE_PATHS, V1_PATHS
from tests.conftest import ROOT


def test_committed_document_is_valid_openapi_31(openapi_document) -> None:
    assert openapi_document["openapi"] == "3.1.0"
    validate(openapi_document)


def test_committed_document_has_not_drifted_from_the_code(app) -> None:
    # `make openapi` regenerates the file; this fails when the schemas changed without it.
    with app.app_context():
        assert document_yaml() == (ROOT / "openapi" / "openapi.yaml").read_text(encoding="utf-8")


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
