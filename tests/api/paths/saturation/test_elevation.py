"""GET and POST /v1/elevation (``service.api.paths.saturation``)."""

import pytest

from service.physics import atmosphere


def test_elevation_of_a_pressure_inverts_the_atmosphere(client) -> None:
    p = float(atmosphere.pressure_at_elevation(1420.0)) / 1e3
    body = client.get(f"/v1/elevation?pressure={p!r}").get_json()
    assert body["elevation"] == {"value": pytest.approx(1420.0, abs=0.01), "unit": "m"}
    assert body["method"] == "U.S. Standard Atmosphere 1976"
    assert "fluid" not in body
    assert body["warnings"]


def test_elevation_where_water_boils_at_a_temperature(client) -> None:
    t = client.get("/v1/boiling-point?elevation=1420").get_json()["boiling_point"]["value"]
    body = client.get(f"/v1/elevation?boiling_point={t!r}&length_unit=ft").get_json()
    assert body["elevation"] == {"value": pytest.approx(1420.0 / 0.3048, abs=0.05), "unit": "ft"}
    assert body["fluid"] == "water"
    assert body["boiling_point"]["value"] == pytest.approx(t)


def test_elevation_with_sea_level_pressure(client) -> None:
    p = float(atmosphere.pressure_at_elevation(2000.0, 99_000.0)) / 1e3
    body = client.get(f"/v1/elevation?pressure={p!r}&sea_level_pressure=99").get_json()
    assert body["elevation"]["value"] == pytest.approx(2000.0, abs=0.01)


def test_post_array(client) -> None:
    r = client.post("/v1/elevation", json={"pressure": {"value": [1013.25, 898.76], "unit": "hPa"}})
    assert r.get_json()["elevation"]["value"] == pytest.approx([0.0, 1000.0], abs=0.1)


@pytest.mark.parametrize("query", ["", "pressure=90&boiling_point=95"])
def test_needs_exactly_one_of_pressure_and_boiling_point(client, query: str) -> None:
    assert client.get(f"/v1/elevation?{query}").status_code == 400


def test_pressure_outside_the_atmosphere(client) -> None:
    r = client.get("/v1/elevation?pressure=200")
    assert r.status_code == 422
    assert "bottom of the standard atmosphere" in r.get_json()["detail"]
    assert "kPa" in r.get_json()["detail"]


def test_elevation_refuses_an_unknown_fluid_even_with_a_pressure(client) -> None:
    assert client.get("/v1/elevation?pressure=85&fluid=nope").status_code == 404
