"""Bad input: each gets the right 4xx problem response, never a 500."""

import pytest


def problem(response, status: int) -> dict:
    assert response.status_code == status, response.get_json()
    assert response.mimetype == "application/problem+json"
    body = response.get_json()
    assert body["status"] == status
    assert body["type"].startswith("urn:boiling-point:problem:")
    assert "Traceback" not in body["detail"] and "/site-packages/" not in body["detail"]
    return body


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


def test_limits_are_named_in_the_request_unit(client) -> None:
    body = problem(client.get("/v1/boiling-point?pressure=0.05&pressure_unit=psi"), 422)
    assert "triple-point pressure of Water, 0.0887133 psi" in body["detail"]
    body = problem(client.get("/v1/vapor-pressure?temperature=800&temperature_unit=degF"), 422)
    assert "critical temperature of Water, 705.103 degF" in body["detail"]


@pytest.mark.parametrize(
    ("body", "field"),
    [
        ({"pressure": "100"}, "pressure"),
        ({"pressure": True}, "pressure"),
        ({"pressure": [1, None]}, "pressure"),
        ({"pressure": [[1, 2]]}, "pressure"),
        ({"pressure": {"value": 1, "unit": 5}}, "pressure"),
        ({"pressure": {"value": 1, "unit": "K"}}, "pressure"),
        ({"pressure": {"unit": "kPa"}}, "pressure"),
        ({"pressure": {"value": 1, "extra": 2}}, "pressure"),
        ({"pressure": 100, "fluid": 7}, "fluid"),
        ({"pressure": [1, 2, 3], "elevation": [1, 2]}, "pressure"),
    ],
)
def test_post_refusals(client, body: dict, field: str) -> None:
    assert field in problem(client.post("/v1/boiling-point", json=body), 400)["errors"]


def test_post_array_names_the_bad_indexes(client) -> None:
    body = problem(client.post("/v1/boiling-point", json={"pressure": [100, 0.1, 50, 0.2]}), 422)
    assert body["errors"]["pressure"][0].startswith("index 1: ")
    assert body["errors"]["pressure"][1].startswith("index 3: ")
    assert "2 values in all" in body["detail"]


def test_post_body_must_be_a_json_object(client) -> None:
    problem(client.post("/v1/boiling-point", data="pressure=100", content_type="text/plain"), 415)
    problem(client.post("/v1/boiling-point", data="{not json", content_type="application/json"), 400)
    problem(client.post("/v1/boiling-point", data='{"pressure": NaN}', content_type="application/json"), 400)
    problem(client.post("/v1/boiling-point", json=[100]), 400)


def test_post_query_takes_options_and_single_values_once(client) -> None:
    # The query string of a POST carries what a GET's does; a name given in the query and the body is refused,
    # but for a unit given alike in both.
    both = client.post("/v1/boiling-point?fluid=ethanol&digits=4", json={"pressure": [50, 100]}).get_json()
    assert both["fluid"] == "ethanol" and both["boiling_point"]["value"] == [61.35, 77.93]
    single = client.post("/v1/boiling-point?pressure=100", json={"tag": "drum"}).get_json()
    assert single["tag"] == "drum" and single["pressure"]["value"] == 100.0
    problem(client.post("/v1/boiling-point?pressure=100", json={"pressure": 100}), 400)
    problem(client.post("/v1/boiling-point?pressure_unit=kPa", json={"pressure": 100, "pressure_unit": "psi"}), 400)
    assert (
        client.post("/v1/boiling-point?pressure_unit=kPa", json={"pressure": 1, "pressure_unit": "KPA"}).status_code
        == 200
    )
    problem(client.post("/v1/boiling-point?pressure=١٠٠", json={}), 400)


def test_too_many_points(app, client) -> None:
    limit = app.config["MAX_POINTS"]
    body = problem(client.post("/v1/vapor-pressure", json={"temperature": [50.0] * (limit + 1)}), 413)
    assert str(limit) in body["detail"]


def test_unknown_path_and_method(client) -> None:
    problem(client.get("/v1/boiling-points"), 404)
    assert client.client.delete("/v1/boiling-point").status_code == 405


def test_vapor_pressure_refusals(client) -> None:
    problem(client.get("/v1/vapor-pressure?temperature=-1"), 422)
    problem(client.get("/v1/vapor-pressure?temperature=374"), 422)
    problem(client.get("/v1/vapor-pressure"), 400)
    problem(client.get("/v1/vapor-pressure?temperature=50&fluid=xyzzy"), 404)


@pytest.mark.parametrize(
    "query",
    [
        "elevation=760&sea_level_pressure=-1.7976931348623155e308",
        "temperature=20&static_head=1&gauge_pressure=-1.7976931348623157e308&elevation=0",
    ],
)
def test_values_that_overflow_in_si_are_refused(client, query: str) -> None:
    path = "/v1/atmosphere" if "sea_level" in query else "/v1/npsh-available"
    body = problem(client.get(f"{path}?{query}"), 422)  # found by the fuzz test
    assert "too large" in body["detail"]


@pytest.mark.parametrize(
    ("query", "field", "says"),
    [
        # 10 mPa would be 1e-8 of 10 MPa: letter case carries the SI prefix (SI Brochure, 9th ed., table 7).
        ("pressure=10&pressure_unit=mPa", "pressure_unit", "millipascal"),
        ("pressure=1&pressure_unit=Mbar", "pressure_unit", "megabar"),
        ("pressure=1&pressure_unit=MBAR", "pressure_unit", "could be Mbar (the megabar) or mbar (millibar)"),
        ("pressure=10&pressure_unit=mpa", "pressure_unit", "could be MPa (megapascal) or mPa (the millipascal)"),
        ("gauge_pressure=10&elevation=1420&pressure_unit=psia", "gauge_pressure", "is a gauge reading"),
        ("pressure=10&pressure_unit=psig", "pressure_unit", "marks a gauge reading"),
    ],
)
def test_units_whose_case_or_kind_is_wrong_are_refused(client, query: str, field: str, says: str) -> None:
    body = problem(client.get(f"/v1/boiling-point?{query}"), 400)
    assert says in body["errors"][field][0], body


def test_gauge_and_absolute_spellings_on_their_own_quantities(client) -> None:
    gauge = {"gauge_pressure": {"value": 10, "unit": "psig"}, "barometric_pressure": {"value": 0.854, "unit": "bara"}}
    body = client.post("/v1/boiling-point?pressure_unit=psi", json=gauge).get_json()
    assert body["gauge_pressure"] == {"value": 10.0, "unit": "psi"}
    assert body["pressure"]["value"] == pytest.approx(10 + 85_400 / 6894.757293168)
    wrong = {"gauge_pressure": {"value": 10, "unit": "psia"}, "elevation": 1420}
    assert "marks an absolute pressure" in problem(client.post("/v1/boiling-point", json=wrong), 400)["detail"]
    absolute = {"pressure": {"value": 2, "unit": "barg"}}
    assert "marks a gauge reading" in problem(client.post("/v1/boiling-point", json=absolute), 400)["detail"]
    # Water columns and the technical atmosphere (units module): 1 kgf/cm2 = 98.0665 kPa.
    kgf = client.get("/v1/boiling-point?pressure=1&pressure_unit=kgf/cm2").get_json()
    assert kgf["sensitivity"]["unit"] == "degC/(kgf/cm2)"


@pytest.mark.parametrize("number", ["١٠٠", "１００", "1_000", " 100", "+100", ".5", "0x10", "1e999"])
def test_query_numbers_take_the_json_number_syntax_only(client, number: str) -> None:
    body = problem(client.get(f"/v1/boiling-point?pressure={number}"), 400)
    assert "pressure" in body["errors"]


def test_errors_come_as_text_to_a_request_that_asked_for_text(client) -> None:
    for r in (
        client.get("/v1/boiling-point?pressure=-5&format=text"),
        client.get("/v1/boiling-point?pressure=-5", headers={"Accept": "text/plain"}),
        client.post("/v1/boiling-point?format=csv", json={"pressure": [-5]}),
    ):
        assert r.status_code == 422 and r.mimetype == "text/plain"
        text = r.get_data(as_text=True)
        assert "status: 422" in text and "error: pressure: " in text
    assert client.get("/v1/boiling-point?pressure=-5").mimetype == "application/problem+json"


def test_the_body_limit_is_named(app) -> None:
    small = app.test_client()
    app.config["MAX_CONTENT_LENGTH"], before = 1000, app.config["MAX_CONTENT_LENGTH"]
    try:
        body = small.post("/v1/atmosphere", json={"elevation": [1000.0] * 500}).get_json()
        assert body["status"] == 413 and "the limit is 1000 bytes" in body["detail"]
    finally:
        app.config["MAX_CONTENT_LENGTH"] = before


def test_absolute_spellings_fit_every_absolute_pressure_and_a_difference(client) -> None:
    # psia marks an absolute pressure: sea-level pressures, air pressures and uncertainties take it as psi.
    for query in (
        "/v1/atmosphere?elevation=1420&sea_level_pressure=14.7&pressure_unit=psia",
        "/v1/elevation?pressure=12.38&pressure_unit=psia",
        "/v1/boiling-point?barometric_pressure=12.38&pressure_unit=psia&pressure_uncertainty=0.01",
    ):
        assert client.get(query).status_code == 200, query
    posted = client.post("/v1/elevation", json={"pressure": {"value": 12.38, "unit": "PSIA"}})
    assert posted.status_code == 200


def test_option_numbers_take_the_json_number_syntax_too(client) -> None:
    query = "/v1/saturation-margin?pressure=100&temperature=90&tolerance="
    assert client.get(query + "0.5").status_code == 200
    assert "tolerance" in problem(client.get(query + "１"), 400)["errors"]
    fluid = {"name": "lab oil", "boiling_point": "１００", "pressure": "101.325"}
    assert problem(client.post("/v1/boiling-point", json={"fluid": fluid, "pressure": 50}), 400)["errors"]


@pytest.mark.parametrize(
    ("body", "says"),
    [
        ({"pressure": [100, 200], "tag": ["a"]}, "has 1 labels for 2 points"),
        ({"pressure": 100, "tag": []}, "non-empty array"),
        ({"pressure": [100, 200], "tag": ["a", "b\nboiling_point: 50 degC"]}, "control characters"),
        ({"pressure": 100, "fluid": {"name": "oil\ntag", "boiling_point": 300}}, "control characters"),
    ],
)
def test_tags_and_names_that_would_corrupt_an_answer_are_refused(client, body: dict, says: str) -> None:
    assert says in problem(client.post("/v1/boiling-point", json=body), 400)["detail"]
    assert "control characters" in problem(client.get("/v1/boiling-point?pressure=100&tag=x%0Ay"), 400)["detail"]
