"""The GET and POST views of the computing paths (``service.api.computing_path``): array answers equal
single answers exactly on every path, broadcasting, the point limit, a POST's query string, inputs
echoed as sent, tags and digits."""

import random

import pytest

from tests.api.test_problems import problem
from tests.api.test_rendering import parse_text
from tests.conftest import csv_answer

# One example per computing path: a scalar query, and the quantity to turn into an array.
PATHS = [
    ("/v1/boiling-point", {"elevation": 1420.0}, "gauge_pressure", [-60.0, 0.0, 950.0]),
    ("/v1/vapor-pressure", {"fluid": "toluene"}, "temperature", [20.0, 60.0, 110.0]),
    ("/v1/elevation", {}, "pressure", [101.325, 85.0, 30.0]),
    ("/v1/atmosphere", {}, "elevation", [-400.0, 1420.0, 30000.0]),
    ("/v1/saturation-margin", {"barometric_pressure": 85.4}, "temperature", [20.0, 95.3, 99.0]),
    ("/v1/npsh-available", {"elevation": 1420.0, "static_head": 2.0}, "temperature", [20.0, 60.0, 90.0]),
]


def quantities(body: dict) -> dict:
    return {k: v["value"] for k, v in body.items() if isinstance(v, dict) and "value" in v}


@pytest.mark.parametrize(("path", "fixed", "name", "values"), PATHS)
def test_array_answers_equal_single_answers_exactly(client, path, fixed, name, values) -> None:
    many = client.post(path, json={**fixed, name: values}).get_json()
    for i, v in enumerate(values):
        query = "&".join(f"{k}={x}" for k, x in {**fixed, name: v}.items())
        one = client.get(f"{path}?{query}").get_json()
        for field, value in quantities(one).items():
            answer = quantities(many)[field]  # a setting such as tolerance stays a single number
            assert (answer[i] if isinstance(answer, list) else answer) == value, (field, i)  # same floats


# Random points in each path's range, with the inputs that reach every equation form: an
# Antoine fluid's slope, liquid densities (depth, NPSH), the atmosphere; then one more number.
# For depth, ethylene glycol and NPSH that number once answered a single GET a bit off its array
# answer (Python's ** on a numpy scalar); for the other rows it is a round number.
RANDOM = [
    ("/v1/boiling-point", {"pressure_uncertainty": 0.3, "depth": 2.0}, "pressure", (20.0, 900.0, 137.262)),
    ("/v1/boiling-point", {"fluid": "ethanol", "elevation": 1420.0}, "gauge_pressure", (-50.0, 300.0, 0.0)),
    ("/v1/vapor-pressure", {"fluid": "ethylene-glycol"}, "temperature", (100.0, 190.0, 155.04)),
    ("/v1/vapor-pressure", {"fluid": "r134a"}, "temperature", (-40.0, 90.0, 0.0)),
    ("/v1/npsh-available", {"elevation": 1420.0, "static_head": 2.0}, "temperature", (5.0, 90.0, 26.313)),
    ("/v1/atmosphere", {"sea_level_pressure": 102.1}, "elevation", (-4000.0, 85000.0, 0.0)),
    ("/v1/elevation", {"fluid": "toluene"}, "boiling_point", (60.0, 110.0, 100.0)),
]


@pytest.mark.parametrize(("path", "fixed", "name", "numbers"), RANDOM, ids=lambda v: str(v)[:30])
def test_random_array_answers_equal_single_answers_exactly(client, path, fixed, name, numbers) -> None:
    low, high, known = numbers
    rng = random.Random(f"{path}{fixed}")
    values = [round(rng.uniform(low, high), 3) for _ in range(25)] + [known]
    many = quantities(client.post(path, json={**fixed, name: values}).get_json())
    for i, v in enumerate(values):
        query = "&".join(f"{k}={x}" for k, x in {**fixed, name: v}.items())
        for field, value in quantities(client.get(f"{path}?{query}").get_json()).items():
            answer = many[field]
            assert (answer[i] if isinstance(answer, list) else answer) == value, (field, v)


def test_broadcasting_and_empty_arrays(client) -> None:
    body = client.post(
        "/v1/boiling-point", json={"gauge_pressure": [0, 100], "barometric_pressure": [85, 86]}
    ).get_json()
    assert body["pressure"]["value"] == [85.0, 186.0]
    empty = client.post("/v1/boiling-point", json={"pressure": []})
    assert empty.status_code == 200
    assert empty.get_json()["boiling_point"]["value"] == []


def test_mismatched_lengths(client) -> None:
    r = client.post("/v1/boiling-point", json={"gauge_pressure": [0, 1, 2], "barometric_pressure": [85, 86]})
    assert r.status_code == 400
    assert r.get_json()["errors"] == {"gauge_pressure": ["length 3"], "barometric_pressure": ["length 2"]}


def test_too_many_points_names_the_limit(client, app) -> None:
    limit = app.config["MAX_POINTS"]
    r = client.post("/v1/atmosphere", json={"elevation": [0.0] * (limit + 1)})
    assert r.status_code == 413 and f"the limit is {limit}" in r.get_json()["detail"]
    assert client.post("/v1/atmosphere", json={"elevation": [0.0] * limit}).status_code == 200


def test_head_answers_like_get(client) -> None:
    assert client.client.head("/v1/boiling-point?pressure=100").status_code == 200


def test_empty_arrays(client) -> None:
    r = client.post("/v1/boiling-point", json={"gauge_pressure": [], "elevation": 100})
    assert r.status_code == 200 and r.get_json()["boiling_point"]["value"] == []
    csv = client.post("/v1/saturation-margin?format=csv", json={"temperature": [], "pressure": 100})
    lines = csv.get_data(as_text=True).splitlines()
    assert csv.status_code == 200 and lines[-1].startswith("pressure [kPa],")  # comments and the header alone


def test_one_unit_spelled_two_ways_is_no_conflict(client) -> None:
    r = client.post("/v1/boiling-point?pressure_unit=bar", json={"pressure": 1, "pressure_unit": "BAR"})
    assert r.status_code == 200


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


def test_tags_are_echoed_in_every_format(client) -> None:
    one = client.get("/v1/boiling-point?pressure=100&tag=PT-7").get_json()
    assert one["tag"] == "PT-7"
    text = parse_text(client.get("/v1/boiling-point?pressure=100&tag=PT-7&format=text").get_data(as_text=True))
    assert text["tag"] == ["PT-7"]
    many = client.post("/v1/boiling-point", json={"pressure": [90, 100], "tag": ["PT-7", "PT-8"]}).get_json()
    assert many["tag"] == ["PT-7", "PT-8"]
    shared = client.post("/v1/boiling-point", json={"pressure": [90, 100], "tag": "drum"}).get_json()
    assert shared["tag"] == "drum"
    assert client.post("/v1/boiling-point", json={"pressure": [90, 100], "tag": ["a", "b", "c"]}).status_code == 400
    assert client.post("/v1/boiling-point", json={"pressure": 90, "tag": [1]}).status_code == 400
    assert client.get("/v1/boiling-point?pressure=100&tag=").status_code == 400


def test_digits_round_every_number_in_every_format(client) -> None:
    query = "/v1/boiling-point?gauge_pressure=950&elevation=1420&digits=4"
    body = client.get(query).get_json()
    assert body["boiling_point"]["value"] == 181.4 and body["pressure"]["value"] == 1035.0
    assert body["sensitivity"]["value"] == 0.04228
    text = parse_text(client.get(query + "&format=text").get_data(as_text=True))
    assert text["boiling_point"] == ["181.4 degC"]
    _, rows = csv_answer(
        client.post("/v1/boiling-point?format=csv&digits=3", json={"pressure": [101.325, 50]}).get_data(as_text=True)
    )
    assert rows[0]["boiling_point [degC]"] == "100.0"
    full = client.get("/v1/boiling-point?gauge_pressure=950&elevation=1420").get_json()
    assert full["boiling_point"]["value"] == 181.3948870639569  # without digits: every digit of the double
    for bad in ("0", "18", "x", "١"):
        assert client.get(f"/v1/boiling-point?pressure=100&digits={bad}").status_code == 400


def test_echoed_inputs_come_back_as_sent(client) -> None:
    body = client.get("/v1/vapor-pressure?temperature=200&temperature_unit=degF").get_json()
    assert body["temperature"] == {"value": 200.0, "unit": "degF"}
    margin = client.get(
        "/v1/saturation-margin?temperature=0.1&temperature_unit=degC&pressure=14.7&pressure_unit=psi"
    ).get_json()
    assert margin["temperature"]["value"] == 0.1 and margin["pressure"]["value"] == 14.7
    posted = client.post(
        "/v1/boiling-point", json={"gauge_pressure": {"value": [10, 20], "unit": "psig"}, "barometric_pressure": 85.4}
    ).get_json()
    assert posted["gauge_pressure"] == {"value": pytest.approx([68.9475729, 137.8951459]), "unit": "kPa"}
