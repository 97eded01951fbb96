"""GET and POST /v1/boiling-point."""

import pytest

from service.physics import atmosphere, water


def value(response, field):
    return response.get_json()[field]["value"]


def test_normal_boiling_point_of_water(client) -> None:
    # 99.974 degC at 101.325 kPa on ITS-90 (common practice, no source).
    r = client.get("/v1/boiling-point?pressure=101.325")
    assert r.status_code == 200
    body = r.get_json()
    assert body["boiling_point"] == {"value": pytest.approx(99.974, abs=5e-4), "unit": "degC"}
    assert body["pressure"] == {"value": 101.325, "unit": "kPa"}
    assert body["fluid"] == "water"
    assert body["method"].startswith("IAPWS 1992")
    assert "Wagner and A. Pruss" in body["source"]
    assert body["warnings"] == []
    # dT/dp = 1/(dp/dT); IAPWS 1992 gives dp/dT = 3.616 kPa/K at 1 atm.
    assert body["sensitivity"] == {"value": pytest.approx(1 / 3.6164, rel=1e-3), "unit": "degC/kPa"}


def test_units_in_and_out(client) -> None:
    r = client.get("/v1/boiling-point?pressure=14.695949&pressure_unit=psia&temperature_unit=F")
    body = r.get_json()
    assert body["pressure"]["unit"] == "psi"
    assert body["boiling_point"] == {"value": pytest.approx(211.953, abs=1e-3), "unit": "degF"}
    assert body["sensitivity"]["unit"] == "degF/psi"
    # A temperature difference in degF per psi: 1.8 * (K/Pa) * Pa/psi.
    assert body["sensitivity"]["value"] == pytest.approx(1.8 * 6894.757 / 3616.4, rel=1e-3)


def test_elevation_uses_the_standard_atmosphere_and_warns(client) -> None:
    r = client.get("/v1/boiling-point?elevation=1420")
    body = r.get_json()
    expected_p = float(atmosphere.pressure_at_elevation(1420.0))
    assert body["pressure"]["value"] == pytest.approx(expected_p / 1e3, rel=1e-12)
    assert body["boiling_point"]["value"] == pytest.approx(float(water.saturation_temperature(expected_p)) - 273.15)
    assert any("Standard Atmosphere" in w and "few percent" in w for w in body["warnings"])
    assert "U.S. Standard Atmosphere 1976" in body["method"]


def test_common_practice_everest(client) -> None:
    # Common practice, no source: at about 8,800 m water boils near 70 degC.
    assert value(client.get("/v1/boiling-point?elevation=8800"), "boiling_point") == pytest.approx(70, abs=1.5)


def test_gauge_pressure_with_barometer(client) -> None:
    # A steam drum gauge reading 950 kPa(g) with the site barometer at 85.6 kPa(a).
    body = client.get("/v1/boiling-point?gauge_pressure=950&barometric_pressure=85.6").get_json()
    assert body["pressure"]["value"] == pytest.approx(1035.6)
    assert body["boiling_point"]["value"] == pytest.approx(float(water.saturation_temperature(1035.6e3)) - 273.15)
    assert not any("Standard Atmosphere" in w for w in body["warnings"])


def test_gauge_pressure_with_elevation_and_vacuum(client) -> None:
    atm = float(atmosphere.pressure_at_elevation(1420.0))
    body = client.get("/v1/boiling-point?gauge_pressure=-60&elevation=1420").get_json()
    assert body["pressure"]["value"] == pytest.approx(atm / 1e3 - 60)
    assert any("Standard Atmosphere" in w for w in body["warnings"])


def test_barometric_pressure_alone_is_an_open_vessel(client) -> None:
    body = client.get("/v1/boiling-point?barometric_pressure=850&pressure_unit=hPa").get_json()
    assert body["pressure"] == {"value": pytest.approx(850.0), "unit": "hPa"}


def test_sea_level_pressure_shifts_the_local_atmosphere(client) -> None:
    body = client.get("/v1/boiling-point?elevation=1420&sea_level_pressure=102.1").get_json()
    assert body["pressure"]["value"] == pytest.approx(float(atmosphere.pressure_at_elevation(1420.0, 102_100.0)) / 1e3)


def test_post_arrays_broadcast_and_equal_single_answers(client) -> None:
    gauges = [-60.0, 0.0, 950.0]
    r = client.post("/v1/boiling-point", json={"gauge_pressure": {"value": gauges, "unit": "kPa"}, "elevation": 1420})
    assert r.status_code == 200
    many = r.get_json()["boiling_point"]["value"]
    singles = [
        value(client.get(f"/v1/boiling-point?gauge_pressure={g}&elevation=1420"), "boiling_point") for g in gauges
    ]
    assert many == singles
    assert len(r.get_json()["pressure"]["value"]) == 3


def test_post_scalars_answer_scalars_and_query_units_apply(client) -> None:
    r = client.post("/v1/boiling-point?temperature_unit=K", json={"pressure": 1, "pressure_unit": "atm"})
    body = r.get_json()
    assert body["boiling_point"] == {"value": pytest.approx(373.1243, abs=1e-4), "unit": "K"}
    assert body["pressure"] == {"value": pytest.approx(1.0), "unit": "atm"}


def test_near_critical_warning(client) -> None:
    body = client.get("/v1/boiling-point?pressure=22&pressure_unit=MPa").get_json()
    assert any("critical temperature" in w for w in body["warnings"])


def test_fluid_by_alias_and_cas(client) -> None:
    for name in ("H2O", "7732-18-5", "Steam"):
        assert client.get(f"/v1/boiling-point?pressure=100&fluid={name}").get_json()["fluid"] == "water"


@pytest.mark.parametrize(
    ("reading", "meant"),
    [("1013", "1013 would be 101.3 kPa in hPa or mbar"), ("29.92", "29.92 would be 101.321 kPa in inHg")],
)
def test_a_barometer_reading_in_the_wrong_unit_is_refused_naming_the_band(client, reading: str, meant: str) -> None:
    # Sent without pressure_unit, 1013 (hPa) would be 1013 kPa and boil near 180 degC; 29.92 (inHg) near 69 degC.
    r = client.get(f"/v1/boiling-point?barometric_pressure={reading}")
    assert r.status_code == 422
    detail = r.get_json()["detail"]
    assert ("140 kPa" in detail or "40 kPa" in detail) and meant in detail, detail
    ok = client.get("/v1/boiling-point?barometric_pressure=1013&pressure_unit=hPa")
    assert ok.status_code == 200


def test_the_gauge_reading_is_echoed_beside_the_absolute_pressure(client) -> None:
    body = client.get("/v1/boiling-point?gauge_pressure=950&barometric_pressure=85.4").get_json()
    assert body["gauge_pressure"] == {"value": 950.0, "unit": "kPa"}
    assert body["pressure"] == {"value": pytest.approx(1035.4), "unit": "kPa"}
    assert "gauge_pressure" not in client.get("/v1/boiling-point?pressure=100").get_json()
