"""Boiling-point uncertainty from the pressure reading, and the hydrostatic head at depth."""

import pytest

from service.physics import water

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
