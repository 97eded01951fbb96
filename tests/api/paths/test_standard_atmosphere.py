"""GET and POST /v1/atmosphere (``service.api.paths.standard_atmosphere``)."""

import pytest


def test_sea_level(client) -> None:
    # U.S. Standard Atmosphere 1976 at 0 m: 288.15 K, 101325 Pa, 1.2250 kg/m3.
    body = client.get("/v1/atmosphere?elevation=0&temperature_unit=K&pressure_unit=Pa").get_json()
    assert body["pressure"] == {"value": 101325.0, "unit": "Pa"}
    assert body["temperature"] == {"value": 288.15, "unit": "K"}
    assert body["density"] == {"value": pytest.approx(1.2250, abs=1e-4), "unit": "kg/m3"}
    assert body["geopotential_height"] == {"value": 0.0, "unit": "m"}
    assert body["model"] == "U.S. Standard Atmosphere 1976"
    assert body["warnings"]


def test_eleven_km_in_feet(client) -> None:
    # 1976 tables: 11,000 m -> 216.774 K (-56.376 degC), 22.700 kPa; 36,089 ft = 11,000 m.
    body = client.get(f"/v1/atmosphere?elevation={11000 / 0.3048!r}&length_unit=ft").get_json()
    assert body["elevation"]["unit"] == "ft"
    assert body["pressure"]["value"] == pytest.approx(22.700, abs=1e-3)
    assert body["temperature"]["value"] == pytest.approx(-56.376, abs=1e-3)


def test_sea_level_pressure_scales_and_is_named_in_the_model(client) -> None:
    body = client.get("/v1/atmosphere?elevation=1420&sea_level_pressure=1021&pressure_unit=hPa").get_json()
    assert "1021 hPa" in body["model"]
    assert body["warnings"] == []


def test_post_array(client) -> None:
    r = client.post("/v1/atmosphere", json={"elevation": {"value": [0, 1, 2], "unit": "km"}})
    body = r.get_json()
    assert body["pressure"]["value"][0] == pytest.approx(101.325)
    assert len(body["density"]["value"]) == 3
    assert body["elevation"] == {"value": [0.0, 1000.0, 2000.0], "unit": "m"}  # answers in length_unit


@pytest.mark.parametrize(("elevation", "words"), [(-5001, "bottom"), (86001, "top")])
def test_outside_the_model(client, elevation: float, words: str) -> None:
    r = client.get(f"/v1/atmosphere?elevation={elevation}")
    assert r.status_code == 422
    assert words in r.get_json()["detail"]
    assert "m" in r.get_json()["errors"]["elevation"][0]
