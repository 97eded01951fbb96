"""The domain's refusals and cautions over HTTP (``service.api.refusals``): where a fluid does not boil
(triple point, critical point, stated ranges, extrapolation), and 422 problems that name each refused
value and its limit in the request's units."""

import numpy as np
import pytest

from service.api import refusals
from service.fluids.limits import OutOfRange
from service.physics.units import resolve_unit
from tests.api.test_problems import problem


def test_carbon_dioxide_sublimes_at_one_atmosphere(client) -> None:
    # CO2's triple point is at 0.518 MPa and 216.6 K: at 1 atm dry ice sublimes (common practice, no source).
    r = client.get("/v1/boiling-point?fluid=co2&pressure=1&pressure_unit=atm")
    assert r.status_code == 422
    detail = r.get_json()["detail"]
    assert "triple-point pressure of Carbon dioxide" in detail and "sublimes" in detail and "atm" in detail
    assert client.get("/v1/fluids/carbon-dioxide").get_json()["normal_boiling_point"] is None


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


def test_limits_are_named_in_the_request_unit(client) -> None:
    body = problem(client.get("/v1/boiling-point?pressure=0.05&pressure_unit=psi"), 422)
    assert "triple-point pressure of Water, 0.0887133 psi" in body["detail"]
    body = problem(client.get("/v1/vapor-pressure?temperature=800&temperature_unit=degF"), 422)
    assert "critical temperature of Water, 705.103 degF" in body["detail"]


def test_post_array_names_the_bad_indexes(client) -> None:
    body = problem(client.post("/v1/boiling-point", json={"pressure": [100, 0.1, 50, 0.2]}), 422)
    assert body["errors"]["pressure"][0].startswith("index 1: ")
    assert body["errors"]["pressure"][1].startswith("index 3: ")
    assert "2 values in all" in body["detail"]


def test_mixed_valid_and_invalid_points_refuse_the_request_with_indexes(client) -> None:
    r = client.post("/v1/vapor-pressure", json={"temperature": [20, -30, 50, 400]})
    assert r.status_code == 422
    messages = r.get_json()["errors"]["temperature"]
    assert messages[0].startswith("index 1: ") and messages[1].startswith("index 3: ")


@pytest.mark.parametrize(
    "query",
    [
        "/v1/vapor-pressure?temperature=0.01",
        "/v1/boiling-point?pressure=0.611657",
        "/v1/vapor-pressure?temperature=32.018&temperature_unit=degF",
    ],
)
def test_the_triple_point_itself_is_inside(client, query: str) -> None:
    # 0.01 degC and 611.657 Pa are water's triple point (IAPWS 1992); 32.018 degF is 0.01 degC.
    assert client.get(query).status_code == 200


def test_limits_and_values_are_printed_distinct(client) -> None:
    detail = client.get("/v1/boiling-point?pressure=0.6116569").get_json()["detail"]
    value, limit = detail.split(" is below ")[0].split(": ")[1], detail.split("Water, ")[1].split(":")[0]
    assert value != limit


def test_a_refusal_in_si_reads_in_the_request_units() -> None:
    # The domain keeps the limit in SI (273.16 K); a Fahrenheit request reads it in degF: 32.018 degF.
    refused = OutOfRange(
        "temperature",
        "temperature",
        np.array([300.0, 200.0]),
        (273.16, None),
        ("the triple point, {limit}", ""),
        (np.array([False, True]), False),
    )
    answer = refusals.problem(refused, {"temperature": resolve_unit("degF", "temperature")})
    assert answer.status == 422
    assert answer.errors == {"temperature": ["index 1: -99.67 degF is below the triple point, 32.018 degF"]}


def test_a_barometer_reading_in_the_wrong_unit_names_the_units_it_fits() -> None:
    refused = OutOfRange(
        "barometric_pressure",
        "pressure",
        np.float64(1013.0),
        (40e3, 140e3),
        ("{limit}", "{limit}"),
        (True, False),
        read_as_air_pressure=True,
    )
    detail = refusals.problem(refused, {"pressure": resolve_unit("Pa", "pressure")}).detail
    assert "1013 would be 101300 Pa in hPa or mbar" in detail


@pytest.mark.parametrize("name", ["{oops}", "a } b {", "{0}"])
def test_names_with_braces_read_as_written(client, name) -> None:
    # A caller's name goes into message templates: its braces must come out as sent, never break the template.
    fluid = {"boiling_point": 100, "name": name}
    extrapolated = client.post("/v1/boiling-point", json={"fluid": fluid, "pressure": 1e-6, "extrapolate": True})
    assert extrapolated.status_code == 200
    assert any(name in w for w in extrapolated.get_json()["warnings"])
    refused = client.post("/v1/boiling-point", json={"fluid": fluid, "pressure": 1e-6})
    assert refused.status_code == 422 and name in refused.get_json()["detail"]
    wagner = {
        "equation": "wagner",
        "name": name,
        "coefficients": [-7.86, 1.84, -11.79, 22.68],
        "exponents": [1, 1.5, 3, 3.5],
    }
    wagner |= {"critical_temperature": 373.946, "critical_pressure": 22064, "t_min": 10, "t_max": 373.9}
    near = client.post("/v1/vapor-pressure", json={"fluid": wagner, "temperature": 370.0})
    assert near.status_code == 200 and any(name in w for w in near.get_json()["warnings"])
