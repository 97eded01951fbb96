"""Edge cases found in review: each once answered wrongly or with a 500."""

import pytest


def test_head_answers_like_get(client) -> None:
    assert client.client.head("/v1/boiling-point?pressure=100").status_code == 200


def test_weak_etag_matches(client) -> None:
    etag = client.get("/v1/boiling-point?pressure=100").headers["ETag"]
    assert client.get("/v1/boiling-point?pressure=100", headers={"If-None-Match": f"W/{etag}"}).status_code == 304


def test_empty_arrays(client) -> None:
    r = client.post("/v1/boiling-point", json={"gauge_pressure": [], "elevation": 100})
    assert r.status_code == 200 and r.get_json()["boiling_point"]["value"] == []
    csv = client.post("/v1/saturation-margin?format=csv", json={"temperature": [], "pressure": 100})
    lines = csv.get_data(as_text=True).splitlines()
    assert csv.status_code == 200 and lines[-1].startswith("pressure [kPa],")  # comments and the header alone


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


def test_elevation_refuses_an_unknown_fluid_even_with_a_pressure(client) -> None:
    assert client.get("/v1/elevation?pressure=85&fluid=nope").status_code == 404


def test_one_unit_spelled_two_ways_is_no_conflict(client) -> None:
    r = client.post("/v1/boiling-point?pressure_unit=bar", json={"pressure": 1, "pressure_unit": "BAR"})
    assert r.status_code == 200


def test_a_csv_column_named_twice_is_refused(client) -> None:
    r = client.post("/v1/boiling-point", data="pressure,pressure [kPa]\n1,2\n", content_type="text/csv")
    assert r.status_code == 400


@pytest.mark.parametrize(
    "fluid",
    [
        {
            "equation": "wagner",
            "coefficients": [-7.8],
            "exponents": [1e308],
            "critical_temperature": 373.946,
            "critical_pressure": 22064,
            "t_min": 0.01,
            "t_max": 373.946,
        },
        {"boiling_point": 1e300},
        {"boiling_point": 1e-300, "temperature_unit": "K"},
    ],
)
def test_absurd_definitions_are_refused(client, fluid: dict) -> None:
    assert client.post("/v1/boiling-point", json={"fluid": fluid, "pressure": [100]}).status_code == 400


def test_dippr101_with_unused_large_exponent(client) -> None:
    # D = 0 makes E irrelevant; a huge E must not turn the slope into NaN.
    water = {
        "equation": "dippr101",
        "A": 73.649,
        "B": -7258.2,
        "C": -7.3037,
        "D": 0.0,
        "E": 1e6,
        "temperature_unit": "K",
        "t_min": 300,
        "t_max": 400,
    }
    assert client.post("/v1/vapor-pressure", json={"fluid": water, "temperature": 50}).status_code == 200


def test_a_station_sea_level_pressure_gets_its_own_caution(client) -> None:
    body = client.get("/v1/boiling-point?elevation=1420&sea_level_pressure=101.9").get_json()
    assert any("scaled to the station's sea-level pressure" in w for w in body["warnings"])
    assert not any("3% change" in w for w in body["warnings"])
