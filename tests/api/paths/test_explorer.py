"""GET /docs and its assets (``service.api.paths.explorer``) without a browser: media types, caching and
content-security policies.

The browser test (``test_explorer_page.py``) shows that the page works under its policy.
"""

import importlib.metadata
import re

import pytest

from service import create_app
from service.api.paths.explorer import ASSETS, PAGE_POLICY
from service.api.security import SECURITY_HEADERS

STRICT = SECURITY_HEADERS["Content-Security-Policy"]
MEDIA_TYPES = {
    "swagger-ui-bundle.js": "text/javascript",
    "swagger-ui.css": "text/css",
    "favicon.png": "image/png",
    "explorer.js": "text/javascript",
    "explorer.css": "text/css",
}


def policy(header: str) -> dict[str, str]:
    """A content-security policy as {directive: sources}."""
    return {name: rest.strip() for name, _, rest in (d.strip().partition(" ") for d in header.split(";"))}


def test_the_page_is_html_with_its_own_policy(client) -> None:
    page = client.get("/docs")
    assert page.status_code == 200 and page.mimetype == "text/html"
    assert page.headers["Content-Security-Policy"] == PAGE_POLICY
    assert page.headers["Cache-Control"] == "no-cache"
    assert page.headers["X-Content-Type-Options"] == "nosniff" and page.headers["X-Frame-Options"] == "DENY"
    assert 'data-document="openapi.json"' in page.get_data(as_text=True)


def test_the_page_policy_relaxes_only_what_the_page_needs() -> None:
    directives = policy(PAGE_POLICY)
    assert directives == {
        "default-src": "'none'",
        "script-src": "'self'",
        "style-src": "'self'",
        "img-src": "'self' data:",
        "connect-src": "'self'",
        "base-uri": "'none'",
        "form-action": "'none'",
        "frame-ancestors": "'none'",
    }
    assert "unsafe" not in PAGE_POLICY and "*" not in PAGE_POLICY and "http" not in PAGE_POLICY


def test_the_page_has_no_inline_script_or_style(client) -> None:
    html = client.get("/docs").get_data(as_text=True)
    scripts = re.findall(r"<script\b([^>]*)>(.*?)</script>", html, re.DOTALL)
    assert len(scripts) == html.count("<script") == 2
    assert all(" src=" in attributes and not body.strip() for attributes, body in scripts)
    assert "<style" not in html and not re.search(r"<[^>]*\s(?:style|on\w+)=", html)


def _digest_in(html: str, name: str) -> str:
    match = re.search(rf"docs/assets/{re.escape(name)}\?v=([0-9a-f]{{16}})\"", html)
    assert match, f"the page does not load {name}"
    return match[1]


def test_every_asset_the_page_loads_is_served(app, client) -> None:
    html = client.get("/docs").get_data(as_text=True)
    loaded = re.findall(r'(?:src|href)="docs/assets/([^"?]+)\?v=[0-9a-f]{16}"', html)
    assert sorted(loaded) == sorted(ASSETS)
    raw = app.test_client()
    for name in loaded:
        answer = raw.get(f"/docs/assets/{name}?v={_digest_in(html, name)}")
        assert answer.status_code == 200, name
        assert answer.mimetype == MEDIA_TYPES[name], name
        assert answer.data == ASSETS[name][0].read_bytes(), name


def test_assets_are_cached_for_a_year_and_keep_the_strict_policy(app) -> None:
    raw = app.test_client()
    for name in ASSETS:
        answer = raw.get(f"/docs/assets/{name}")
        assert answer.cache_control.max_age == 365 * 24 * 3600 and answer.cache_control.public, name
        assert answer.cache_control.immutable, name
        assert answer.headers["Content-Security-Policy"] == STRICT, name
        assert answer.headers["X-Content-Type-Options"] == "nosniff", name
        again = raw.get(f"/docs/assets/{name}", headers={"If-None-Match": answer.headers["ETag"]})
        assert again.status_code == 304, name


def test_the_ui_is_a_release_that_reads_openapi_31() -> None:
    version = importlib.metadata.version("flask-swagger-ui")  # the version of the Swagger UI it ships
    assert int(version.split(".")[0]) >= 5, version  # Swagger UI reads OpenAPI 3.1 from 5.0 on


def test_an_api_path_keeps_the_strict_policy(client) -> None:
    for path in ("/v1/boiling-point?pressure=101.325", "/openapi.json", "/"):
        assert client.get(path).headers["Content-Security-Policy"] == STRICT, path


@pytest.mark.parametrize("name", ["nothing.js", "swagger-ui.js", "VERSION", "LICENSE", "index.html", "../explorer.py"])
def test_an_unknown_asset_is_a_404_problem(app, name: str) -> None:
    answer = app.test_client().get(f"/docs/assets/{name}")
    assert answer.status_code == 404 and answer.mimetype == "application/problem+json"
    assert answer.get_json()["status"] == 404
    assert answer.headers["Content-Security-Policy"] == STRICT


def test_the_page_and_its_assets_need_no_api_key(monkeypatch) -> None:
    monkeypatch.setenv("BOILING_API_KEY", "kessock-fell-2026")
    raw = create_app().test_client()
    assert raw.get("/docs").status_code == 200
    assert raw.get("/docs/assets/explorer.js").status_code == 200
    assert raw.get("/v1/fluids").status_code == 401  # the API it explores still does


def test_the_page_is_listed_and_documented(client, openapi_document) -> None:
    assert "/docs" in client.get("/").get_json()["paths"]
    operation = openapi_document["paths"]["/docs"]["get"]
    assert operation["security"] == [] and "text/html" in operation["responses"]["200"]["content"]
