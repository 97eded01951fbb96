"""Settings from environment variables."""

import os
from pathlib import Path

import pytest

from service.config import DEFAULTS, settings


def test_defaults() -> None:
    assert settings({}) == {**DEFAULTS, "EXTRA_CATALOGS": [], "API_KEY": "", "CORS_ORIGINS": [], "LOG_LEVEL": "info"}
    assert DEFAULTS["MAX_POINTS"] == 100_000


def test_overrides() -> None:
    out = settings(
        {
            "BOILING_MAX_POINTS": "500",
            "BOILING_EXTRA_CATALOGS": f"/a.toml{os.pathsep}/b.toml",
            "BOILING_CORS_ORIGINS": "https://plant.example, https://app.example",
            "BOILING_API_KEY": "s3cret",
            "BOILING_MAX_QUERY_BYTES": "2048",
        }
    )
    assert out["MAX_POINTS"] == 500 and out["MAX_QUERY_BYTES"] == 2048 and out["API_KEY"] == "s3cret"
    assert out["EXTRA_CATALOGS"] == [Path("/a.toml"), Path("/b.toml")]
    assert out["CORS_ORIGINS"] == ["https://plant.example", "https://app.example"]


def test_bad_number_stops_start_up() -> None:
    with pytest.raises(SystemExit, match="BOILING_MAX_POINTS must be a whole number"):
        settings({"BOILING_MAX_POINTS": "lots"})
