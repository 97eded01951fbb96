"""A Python client generated from openapi/openapi.yaml by a mainstream generator keeps every schema and
answers a call of each path: a contract suite over every path, not the tests of one module.

The generator is openapi-python-client (a test-only dependency); ``literal_enums`` lets it type the unit
enums, whose spellings differ only in letter case (`kPa`, `kpa`, `KPA`). It does not support CSV request
bodies, which it says and passes over: the same paths answer JSON. The client talks to the application
in process, through httpx's WSGI transport.
"""

from __future__ import annotations

import importlib
import os
import subprocess
import sys
from pathlib import Path
from types import ModuleType
from typing import Any

import httpx
import pytest
from flask import Flask

from tests.conftest import ROOT

PACKAGE = "kessock_fell_client"


@pytest.fixture(scope="module")
def generated(tmp_path_factory: pytest.TempPathFactory) -> tuple[ModuleType, str]:
    """The generated package, imported, and what the generator printed."""
    where = tmp_path_factory.mktemp("client")
    config = where / "config.yaml"
    config.write_text(f"literal_enums: true\npackage_name_override: {PACKAGE}\n", encoding="utf-8")
    binaries = Path(sys.executable).parent
    run = subprocess.run(
        [
            str(binaries / "openapi-python-client"),
            "generate",
            "--path",
            str(ROOT / "openapi" / "openapi.yaml"),
            "--meta",
            "none",
            "--output-path",
            str(where / PACKAGE),
            "--config",
            str(config),
        ],
        capture_output=True,
        text=True,
        env={**os.environ, "PATH": f"{binaries}{os.pathsep}{os.environ.get('PATH', '')}"},
        timeout=300,
        check=False,
    )
    printed = run.stdout + run.stderr
    assert run.returncode == 0, printed
    sys.path.insert(0, str(where))
    try:
        return importlib.import_module(PACKAGE), printed
    finally:
        sys.path.remove(str(where))


def test_no_schema_is_dropped(generated: tuple[ModuleType, str], openapi_document: dict[str, Any]) -> None:
    package, printed = generated
    assert "Unable to process schema" not in printed and "removal of" not in printed, printed
    warnings = [line for line in printed.splitlines() if line.startswith("WARNING")]
    for line, reason in zip(warnings, printed.split("WARNING")[1:], strict=True):
        assert "Unsupported content type text/csv" in reason, line  # the CSV bodies, and nothing else
    models = importlib.import_module(f"{PACKAGE}.models")
    for name, schema in openapi_document["components"]["schemas"].items():
        if schema.get("type") == "object" and schema.get("properties"):
            assert hasattr(models, name), f"the client has no model for {name}"
    assert package is not None


def _call(package: ModuleType, app: Flask, module: str, function: str = "sync_detailed", **kwargs: Any) -> Any:
    client = importlib.import_module(f"{PACKAGE}.client").Client(base_url="http://kessock-fell.test")
    client.set_httpx_client(httpx.Client(transport=httpx.WSGITransport(app=app), base_url="http://kessock-fell.test"))
    return getattr(importlib.import_module(f"{PACKAGE}.api.{module}"), function)(client=client, **kwargs)


@pytest.mark.parametrize(
    ("module", "kwargs"),
    [
        ("boiling_point.get_boiling_point", {"gauge_pressure": 950.0, "elevation": 1420.0, "pressure_unit": "kpa"}),
        ("vapor_pressure.get_vapor_pressure", {"temperature": 72.0, "fluid": "ethanol"}),
        ("elevation.get_elevation", {"boiling_point": 95.2}),
        ("atmosphere.get_atmosphere", {"elevation": 1420.0, "tag": "site"}),
        ("saturation_margin.get_saturation_margin", {"temperature": 48.0, "pressure": 30.0, "fluid": "ethanol"}),
        ("npsh_available.get_npsh_available", {"temperature": 72.0, "elevation": 1420.0, "static_head": 2.4}),
        ("fluids.list_fluids", {"q": "xylene"}),
        ("fluids.get_fluid", {"name": "ethanol"}),
        ("service.index", {}),
        ("service.healthz", {}),
        ("service.readyz", {}),
        ("service.metrics", {}),
        ("service.openapi", {}),
        ("service.explorer", {}),
    ],
)
def test_each_path_answers_the_generated_client(generated, app: Flask, module: str, kwargs: dict) -> None:
    package, _ = generated
    response = _call(package, app, module, **kwargs)
    assert response.status_code == 200, response.content[:300]
    if response.headers["content-type"].startswith("application/json"):
        assert response.parsed is not None


def test_posts_with_models_the_generator_built(generated, app: Flask) -> None:
    package, _ = generated
    models = importlib.import_module(f"{PACKAGE}.models")
    # Water's Antoine constants in mmHg and degC, 1-100 degC (Lange's Handbook of Chemistry; recalled from memory).
    antoine = models.EquationFluid(
        equation="antoine", a=8.07131, b=1730.63, c=233.426, log_base=10, t_min=1.0, t_max=100.0, pressure_unit="mmHg"
    )
    body = models.BoilingPointBody.from_dict({"pressure": [50.0, 101.325], "tag": ["A", "B"]})
    body.fluid = antoine
    answer = _call(package, app, "boiling_point.post_boiling_point", body=body)
    assert answer.status_code == 200, answer.content[:300]
    assert answer.parsed.boiling_point.value == pytest.approx([81.3, 100.0], abs=0.1)
    assert answer.parsed.tag == ["A", "B"]
