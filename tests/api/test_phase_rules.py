"""Where a fluid does not boil: triple point, critical point, stated ranges, extrapolation."""

import pytest


def test_carbon_dioxide_sublimes_at_one_atmosphere(client) -> None:
    # CO2's triple point is at 0.518 MPa and 216.6 K: at 1 atm dry ice sublimes (common practice, no source).
    r = client.get("/v1/boiling-point?fluid=co2&pressure=1&pressure_unit=atm")
    assert r.status_code == 422
    detail = r.get_json()["detail"]
    assert "triple-point pressure of Carbon dioxide" in detail and "sublimes" in detail and "atm" in detail
    assert client.get("/v1/fluids/carbon-dioxide").get_json()["normal_boiling_point"] is None


def test_carbon_dioxide_boils_above_its_triple_point(client) -> None:
    # CO2 saturation at 20 degC: 5.73 MPa (common practice, no source; CoolProp gives 5.729 MPa).
    body = client.get("/v1/vapor-pressure?fluid=CO2&temperature=20&pressure_unit=MPa").get_json()
    assert body["vapor_pressure"]["value"] == pytest.approx(5.73, abs=0.02)


def test_helium(client) -> None:
    # Helium-4 boils at 4.22 K at 1 atm (common practice, no source); it has no ordinary triple point:
    # the catalog's lower limit is the lambda point, where it becomes superfluid.
    body = client.get("/v1/boiling-point?fluid=helium&pressure=101.325&temperature_unit=K").get_json()
    assert body["boiling_point"]["value"] == pytest.approx(4.22, abs=0.01)
    low = client.get("/v1/boiling-point?fluid=helium&pressure=1")
    assert low.status_code == 422
    assert "lambda" in low.get_json()["detail"] and "sublimes" not in low.get_json()["detail"]


def test_above_the_critical_point(client) -> None:
    r = client.get("/v1/boiling-point?fluid=nitrogen&pressure=5&pressure_unit=MPa")
    assert r.status_code == 422
    assert "critical pressure of Nitrogen" in r.get_json()["detail"] and "MPa" in r.get_json()["detail"]
    r = client.get("/v1/vapor-pressure?fluid=methane&temperature=-50")
    assert r.status_code == 422 and "critical temperature" in r.get_json()["detail"]


def test_out_of_stated_range_with_and_without_extrapolate(client) -> None:
    # Propane's Wagner equation (McGarry 1983) is stated from 145 K; its triple point is 85.5 K.
    refused = client.get("/v1/vapor-pressure?fluid=propane&temperature=120&temperature_unit=K")
    assert refused.status_code == 422
    assert "stated range" in refused.get_json()["detail"] and "145 K" in refused.get_json()["detail"]
    allowed = client.get("/v1/vapor-pressure?fluid=propane&temperature=120&temperature_unit=K&extrapolate=true")
    assert allowed.status_code == 200
    assert any("extrapolated" in w for w in allowed.get_json()["warnings"])


def test_near_the_critical_point_warns(client) -> None:
    body = client.get("/v1/vapor-pressure?fluid=r134a&temperature=100").get_json()  # Tc = 101.06 degC
    assert any("Within 2 % of the critical temperature" in w for w in body["warnings"])


def test_catalog_lists_forty_fluids_with_sources(client) -> None:
    body = client.get("/v1/fluids").get_json()
    assert body["count"] >= 40
    for fluid in body["fluids"]:
        assert fluid["cas"] and fluid["source"] and fluid["method"]
        assert fluid["range"]["temperature_min"]["value"] < fluid["range"]["temperature_max"]["value"]


@pytest.mark.parametrize(
    ("name", "fluid_id"),
    [
        ("ethyl alcohol", "ethanol"),
        ("64-17-5", "ethanol"),
        ("R-134A", "r134a"),
        ("IPA", "2-propanol"),
        ("Toluene", "toluene"),
        ("N2", "nitrogen"),
    ],
)
def test_lookup_names(client, name: str, fluid_id: str) -> None:
    assert client.get(f"/v1/fluids/{name}").get_json()["id"] == fluid_id


def test_unknown_fluid_suggests_three(client) -> None:
    r = client.get("/v1/boiling-point?pressure=50&fluid=tolune")
    assert r.status_code == 404
    assert "toluene" in r.get_json()["detail"]
    assert r.get_json()["detail"].count(",") >= 2


def test_search_names_and_aliases(client) -> None:
    ids = [f["id"] for f in client.get("/v1/fluids?q=xylene").get_json()["fluids"]]
    assert {"o-xylene", "m-xylene", "p-xylene"} <= set(ids)
