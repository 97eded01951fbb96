"""The array path: broadcasting, limits, exact equality with single answers, CSV, caching."""

import random

import pytest

from service import create_app
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


def test_body_size_limit(app) -> None:
    small = app.test_client()
    app.config["MAX_CONTENT_LENGTH"], before = 1000, app.config["MAX_CONTENT_LENGTH"]
    try:
        r = small.post("/v1/atmosphere", json={"elevation": [1000.0] * 500})
        assert r.status_code == 413 and r.mimetype == "application/problem+json"
    finally:
        app.config["MAX_CONTENT_LENGTH"] = before


def test_mixed_valid_and_invalid_points_refuse_the_request_with_indexes(client) -> None:
    r = client.post("/v1/vapor-pressure", json={"temperature": [20, -30, 50, 400]})
    assert r.status_code == 422
    messages = r.get_json()["errors"]["temperature"]
    assert messages[0].startswith("index 1: ") and messages[1].startswith("index 3: ")


def test_csv_round_trip(client) -> None:
    text = "gauge_pressure [bar]\n-0.6\n0\n9.5\n"
    r = client.post("/v1/boiling-point?elevation=1420&format=csv", data=text, content_type="text/csv")
    assert r.status_code == 200 and r.mimetype == "text/csv"
    _, rows = csv_answer(r.get_data(as_text=True))
    json_answer = client.post(
        "/v1/boiling-point", json={"gauge_pressure": {"value": [-0.6, 0, 9.5], "unit": "bar"}, "elevation": 1420}
    ).get_json()
    assert [float(row["boiling_point [degC]"]) for row in rows] == json_answer["boiling_point"]["value"]
    assert [float(row["pressure [kPa]"]) for row in rows] == json_answer["pressure"]["value"]


def test_csv_body_with_query_options_answers_json(client) -> None:
    text = "temperature,static_head\n20,1.5\n60,2.5\n"
    r = client.post("/v1/npsh-available?fluid=water&pressure=101.325", data=text, content_type="text/csv")
    assert r.mimetype == "application/json"
    assert len(r.get_json()["npsh_available"]["value"]) == 2


@pytest.mark.parametrize(
    "text",
    ["temperature\n", "temperature\nhot\n", "temperature,static_head\n1\n", "colour\n1\n", "\n", "temperature\nnull\n"],
)
def test_bad_csv_bodies(client, text: str) -> None:
    r = client.post("/v1/vapor-pressure", data=text, content_type="text/csv")
    assert r.status_code == 400, r.get_json()


def test_csv_rows_with_too_many_or_too_few_cells_are_refused(client) -> None:
    # Three cells and then one add up to two rows of two, but they are not: refused, naming the row.
    r = client.post("/v1/boiling-point", data="gauge_pressure,elevation\n1,2,3\n4\n", content_type="text/csv")
    assert r.status_code == 400 and "row 2 of the file (the header is row 1) has 3" in r.get_json()["detail"]
    blank = client.post("/v1/boiling-point", data="gauge_pressure,elevation\n1,2\n\n3,4\n", content_type="text/csv")
    assert blank.status_code == 400 and "row 3 of the file (the header is row 1) has 1" in blank.get_json()["detail"]
    for ending in ("\r\n", "\r"):  # Windows, and old Mac spreadsheets
        body = f"pressure{ending}100{ending}50{ending}"
        answer = client.post("/v1/boiling-point", data=body, content_type="text/csv")
        assert answer.status_code == 200 and len(answer.get_json()["boiling_point"]["value"]) == 2, ending


def test_etag_and_not_modified(client) -> None:
    first = client.get("/v1/boiling-point?pressure=101.325")
    etag = first.headers["ETag"]
    assert not etag.startswith("W/") and "max-age" in first.headers["Cache-Control"]
    again = client.get("/v1/boiling-point?pressure=101.325", headers={"If-None-Match": etag})
    assert again.status_code == 304 and again.data == b""
    other = client.get("/v1/boiling-point?pressure=101.3", headers={"If-None-Match": etag})
    assert other.status_code == 200 and other.headers["ETag"] != etag
    text = client.get("/v1/boiling-point?pressure=101.325&format=text")
    assert text.headers["ETag"] != etag  # another representation, another tag


def test_answer_cache_gives_the_same_answer_and_stays_bounded() -> None:
    cached, uncached = create_app({"ANSWER_CACHE_SIZE": 2}).test_client(), create_app({"ANSWER_CACHE_SIZE": 0})
    fresh = uncached.test_client()
    for q in ("pressure=50", "pressure=60", "pressure=70", "pressure=50", "pressure=50&format=text"):
        a, b = cached.get(f"/v1/boiling-point?{q}"), fresh.get(f"/v1/boiling-point?{q}")
        assert a.data == b.data and a.headers["ETag"] == b.headers["ETag"] and a.mimetype == b.mimetype
    assert len(cached.application.extensions["answers"]._answers) == 2
    assert cached.get("/v1/boiling-point?pressure=0.1").status_code == 422  # refusals are not kept
    assert len(cached.application.extensions["answers"]._answers) == 2
