"""GET and POST /v1/boiling-point (``service.api.paths.saturation``): answers, the instrument inputs
(pressure uncertainty, depth), cautions and refusals."""

import pytest

from service.physics import atmosphere, water
from tests.api.test_problems import problem


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


@pytest.mark.parametrize(
    ("query", "status", "field"),
    [
        ("pressure=abc", 400, "pressure"),
        ("pressure=nan", 400, "pressure"),
        ("pressure=inf", 400, "pressure"),
        ("pressure=-Infinity", 400, "pressure"),
        ("pressure=", 400, "pressure"),
        ("pressure=-5", 422, "pressure"),
        ("pressure=0", 422, "pressure"),
        ("pressure=0.5", 422, "pressure"),  # below the triple point of water
        ("pressure=30000", 422, "pressure"),  # above the critical point
        ("pressure=100&pressure_unit=furlong", 400, "pressure_unit"),
        ("pressure=100&temperature_unit=kPa", 400, "temperature_unit"),
        ("pressure=100&fluid=", 400, "fluid"),
        ("pressure=100&extrapolate=maybe", 400, "extrapolate"),
        ("", 400, "pressure"),
        ("gauge_pressure=100", 400, "gauge_pressure"),
        ("pressure=100&gauge_pressure=5", 400, "gauge_pressure"),
        ("pressure=100&elevation=5", 400, "elevation"),
        ("gauge_pressure=5&elevation=100&barometric_pressure=90", 400, "barometric_pressure"),
        ("gauge_pressure=5&barometric_pressure=90&sea_level_pressure=101", 400, "sea_level_pressure"),
        ("elevation=100&sea_level_pressure=50", 422, "sea_level_pressure"),
        ("gauge_pressure=-90&elevation=1420", 422, "gauge_pressure"),  # vacuum deeper than the atmosphere
        ("gauge_pressure=-5&barometric_pressure=-3", 422, "barometric_pressure"),
        ("elevation=90000", 422, "elevation"),
        ("pressure=100&pressure=200", 400, "pressure"),
        ("pressure=100&colour=blue", 400, "colour"),
    ],
)
def test_boiling_point_refusals(client, query: str, status: int, field: str) -> None:
    body = problem(client.get(f"/v1/boiling-point?{query}"), status)
    assert field in body["errors"], body


G = 9.80665


def test_uncertainty_is_slope_times_pressure_uncertainty(client) -> None:
    body = client.get("/v1/boiling-point?barometric_pressure=85.39&pressure_uncertainty=0.05").get_json()
    assert body["boiling_point_uncertainty"] == {
        "value": pytest.approx(body["sensitivity"]["value"] * 0.05, rel=1e-12),
        "unit": "K",
    }


def test_uncertainty_in_fahrenheit_and_psi(client) -> None:
    body = client.get(
        "/v1/boiling-point?pressure=14.7&pressure_unit=psi&temperature_unit=degF&pressure_uncertainty=0.02"
    ).get_json()
    assert body["boiling_point_uncertainty"]["unit"] == "degR"
    assert body["boiling_point_uncertainty"]["value"] == pytest.approx(body["sensitivity"]["value"] * 0.02)


def test_depth_adds_the_head_of_the_boiling_liquid(client) -> None:
    # Independent computation: iterate p = p0 + rho'(Tsat(p)) g h with the physics functions directly.
    p0, depth = 85_390.0, 0.25
    p = p0
    for _ in range(20):
        p = p0 + float(water.saturated_liquid_density(water.saturation_temperature(p))) * G * depth
    body = client.get(f"/v1/boiling-point?barometric_pressure=85.39&depth={depth}").get_json()
    assert body["surface_pressure"]["value"] == pytest.approx(85.39)
    assert body["pressure"]["value"] == pytest.approx(p / 1e3, rel=1e-9)
    assert body["boiling_point"]["value"] == pytest.approx(float(water.saturation_temperature(p)) - 273.15, abs=1e-9)
    # Through the slope: the rise is about rho g h times dT/dp (0.25 m of water near 95 degC: ~0.75 K;
    # the slope falls across the 2.4 kPa step, so the linear estimate is 1 % high).
    surface = client.get("/v1/boiling-point?barometric_pressure=85.39").get_json()
    rise = body["boiling_point"]["value"] - surface["boiling_point"]["value"]
    assert rise == pytest.approx(962.0 * G * depth / 1e3 * surface["sensitivity"]["value"], rel=0.02)
    assert "saturated-liquid density" in body["method"]


def test_depth_refusals(client) -> None:
    assert client.get("/v1/boiling-point?pressure=100&depth=-1").status_code == 422


def test_standard_atmosphere_warning_gives_the_weather_spread(client) -> None:
    body = client.get("/v1/boiling-point?elevation=1420").get_json()
    spread = next(w for w in body["warnings"] if "3%" in w)
    # 3 % of 85.39 kPa times 0.3187 K/kPa is about 0.82 K.
    assert "0.82 K" in spread


def test_a_station_sea_level_pressure_gets_its_own_caution(client) -> None:
    body = client.get("/v1/boiling-point?elevation=1420&sea_level_pressure=101.9").get_json()
    assert any("scaled to the station's sea-level pressure" in w for w in body["warnings"])
    assert not any("3% change" in w for w in body["warnings"])
