"""Margin to boiling and NPSH available: /v1/saturation-margin and /v1/npsh-available
(``service.api.paths.margins``)."""

import pytest

from service.physics import atmosphere, water

G = 9.80665  # standard gravity, m/s2 (CGPM 1901)


def test_margin_states(client) -> None:
    r = client.post("/v1/saturation-margin", json={"temperature": [20.0, 95.25, 99.0], "barometric_pressure": 85.39})
    body = r.get_json()
    t_sat = float(water.saturation_temperature(85_390.0)) - 273.15
    assert body["saturation_temperature"]["value"] == pytest.approx([t_sat] * 3)
    assert body["margin"] == {"value": pytest.approx([t_sat - 20.0, t_sat - 95.25, t_sat - 99.0]), "unit": "K"}
    assert body["state"] == ["subcooled", "saturated", "superheated"]
    assert body["tolerance"] == {"value": 0.1, "unit": "K"}


def test_exactly_saturated_within_tolerance(client) -> None:
    t_sat = client.get("/v1/boiling-point?pressure=101.325").get_json()["boiling_point"]["value"]
    for offset, state in (
        (0.0, "saturated"),
        (0.09, "saturated"),
        (-0.09, "saturated"),
        (0.2, "subcooled"),
        (-0.2, "superheated"),
    ):
        body = client.get(f"/v1/saturation-margin?pressure=101.325&temperature={t_sat - offset!r}").get_json()
        assert body["state"] == state, offset


def test_margin_in_fahrenheit_is_in_rankine(client) -> None:
    body = client.get(
        "/v1/saturation-margin?pressure=14.696&pressure_unit=psi&temperature=200&temperature_unit=degF&tolerance=0.5"
    ).get_json()
    assert body["margin"]["unit"] == "degR"
    assert body["margin"]["value"] == pytest.approx(body["saturation_temperature"]["value"] - 200.0)
    assert body["tolerance"] == {"value": 0.5, "unit": "degR"}


def test_margin_with_gauge_pressure_on_a_catalog_fluid(client) -> None:
    body = client.get("/v1/saturation-margin?fluid=ethanol&temperature=48&gauge_pressure=-55&elevation=1420").get_json()
    assert body["pressure"]["value"] == pytest.approx(float(atmosphere.pressure_at_elevation(1420.0)) / 1e3 - 55)
    assert body["state"] == "subcooled"
    assert any("Standard Atmosphere" in w for w in body["warnings"])


# Worked NPSH examples, computed by hand from steam-table values for saturated water
# (IAPWS-95, as printed in steam tables; recalled from memory):
#   20 degC: p_sat = 2.339 kPa, rho' = 998.21 kg/m3
#   60 degC: p_sat = 19.946 kPa, rho' = 983.20 kg/m3
# and the 1976 standard atmosphere at 1,420 m: 85.3927 kPa.
def npsh_by_hand(p_surface: float, p_vapor: float, rho: float, static: float, friction: float) -> float:
    return (p_surface - p_vapor) / (rho * G) + static - friction


def test_npsh_open_tank_at_altitude(client) -> None:
    expected = npsh_by_hand(85_392.7, 19_946.0, 983.20, 3.0, 0.8)  # 8.988 m
    body = client.get("/v1/npsh-available?temperature=60&elevation=1420&static_head=3&friction_loss=0.8").get_json()
    assert body["npsh_available"] == {"value": pytest.approx(expected, abs=0.02), "unit": "m"}
    assert body["vapor_pressure"]["value"] == pytest.approx(19.946, abs=0.005)
    assert body["liquid_density"] == {"value": pytest.approx(983.20, abs=0.05), "unit": "kg/m3"}
    assert any("NPSH required" in w for w in body["warnings"])


def test_npsh_vacuum_vessel(client) -> None:
    # A condensate receiver at -60 kPa(g) with the barometer at 85.4 kPa: 25.4 kPa absolute.
    expected = npsh_by_hand(25_400.0, 19_946.0, 983.20, 4.0, 0.5)  # 4.066 m
    body = client.get(
        "/v1/npsh-available?temperature=60&gauge_pressure=-60&barometric_pressure=85.4&static_head=4&friction_loss=0.5"
    ).get_json()
    assert body["npsh_available"]["value"] == pytest.approx(expected, abs=0.02)


def test_npsh_suction_lift_in_feet(client) -> None:
    expected = npsh_by_hand(101_325.0, 2_339.0, 998.21, -4.5, 1.2) / 0.3048  # 4.412 m
    body = client.get(
        f"/v1/npsh-available?temperature=20&pressure=101.325&static_head={-4.5 / 0.3048!r}"
        f"&friction_loss={1.2 / 0.3048!r}&length_unit=ft"
    ).get_json()
    assert body["npsh_available"] == {"value": pytest.approx(expected, abs=0.02 / 0.3048), "unit": "ft"}


def test_npsh_when_the_liquid_already_boils(client) -> None:
    body = client.get("/v1/npsh-available?temperature=99&elevation=1420&static_head=1").get_json()
    assert body["npsh_available"]["value"] < 1.0
    assert any("boils at the surface" in w for w in body["warnings"])


def test_npsh_catalog_fluid_and_refusals(client) -> None:
    ok = client.get("/v1/npsh-available?fluid=toluene&temperature=40&pressure=101.325&static_head=2")
    assert ok.status_code == 200 and "DIPPR 105" in ok.get_json()["method"]
    assert (
        client.get("/v1/npsh-available?temperature=40&pressure=101.325&static_head=2&friction_loss=-1").status_code
        == 422
    )
    assert client.get("/v1/npsh-available?temperature=40&pressure=101.325").status_code == 400
    no_density = client.get("/v1/npsh-available?fluid=r22&temperature=0&pressure=600&static_head=1")
    assert no_density.status_code == 200 and "DIPPR 105" in no_density.get_json()["method"]


def test_negative_npsh_available_warns_for_its_points(client) -> None:
    # Water at 95 degC (p_sat = 84.6 kPa, IAPWS) from an open tank at 1,420 m (85.39 kPa) with a 2 m lift:
    # about 0.08 m of pressure head less 2 m, negative; at 20 degC, about 6.5 m.
    body = client.post(
        "/v1/npsh-available", json={"temperature": [20, 95], "elevation": 1420, "static_head": -2.0}
    ).get_json()
    assert body["npsh_available"]["value"][1] < 0 < body["npsh_available"]["value"][0]
    assert any(w.startswith("point 1: NPSH available is negative") for w in body["warnings"])


def test_a_thermometer_check_reads_a_reading_error_not_superheat(client) -> None:
    # A bath probe 0.15 m deep reads 0.13 K above the surface boiling point; the head of 0.15 m of boiling water
    # raises the saturation temperature there by about 0.45 K, so the reading is below boiling, not above.
    # By hand, from steam-table values (IAPWS-95, recalled from memory): saturated water near 95.2 degC has
    # rho' = 961.9 kg/m3 and dp/dT = 3.14 kPa/K at 85.39 kPa, so 961.9 x 9.80665 x 0.15 Pa = 1.415 kPa of head
    # and 1.415 / 3.14 = 0.45 K; dT/dp = 0.3187 K/kPa.
    surface = client.get("/v1/boiling-point?barometric_pressure=85.39").get_json()["boiling_point"]["value"]
    reading = surface + 0.13
    flat = client.get(f"/v1/saturation-margin?barometric_pressure=85.39&temperature={reading}").get_json()
    assert flat["state"] == "superheated"
    deep = client.get(f"/v1/saturation-margin?barometric_pressure=85.39&temperature={reading}&depth=0.15").get_json()
    assert deep["surface_pressure"]["value"] == 85.39 and deep["pressure"]["value"] > 86.8
    assert deep["state"] == "subcooled" and deep["margin"]["value"] == pytest.approx(0.45 - 0.13, abs=0.03)
    # A barometer good to 0.5 kPa: u(T) = 0.5 kPa x 0.319 K/kPa = 0.16 K, and the saturated band is 0.1 K + 2u.
    uncertain = client.get(
        f"/v1/saturation-margin?barometric_pressure=85.39&temperature={reading}&pressure_uncertainty=0.5"
    ).get_json()
    u = uncertain["saturation_temperature_uncertainty"]["value"]
    assert u == pytest.approx(0.5 * 0.3187, rel=0.01)
    assert uncertain["state"] == "saturated"


@pytest.mark.parametrize(
    ("query", "status", "field"),
    [
        ("depth=-0.1", 422, "depth"),  # above the liquid surface
        ("pressure_uncertainty=-0.5", 422, "pressure_uncertainty"),
        # 300 m of hot water below 22 MPa: past water's critical pressure, 22.064 MPa (IAPWS 1992).
        ("depth=300&pressure=22000", 422, "pressure"),
        ("depth=abc", 400, "depth"),
        ("pressure_uncertainty=0.5&pressure_unit=psig", 400, "pressure_unit"),
        ("depth=0.1&length_unit=M", 400, "length_unit"),  # M is the nautical mile, not the metre
    ],
)
def test_margin_instrument_inputs_refuse_what_makes_no_sense(client, query: str, status: int, field: str) -> None:
    site = "" if "pressure=" in query.replace("_pressure", "") else "barometric_pressure=85.39&"
    r = client.get(f"/v1/saturation-margin?temperature=90&{site}{query}")
    assert r.status_code == status and field in r.get_json()["errors"], r.get_json()
