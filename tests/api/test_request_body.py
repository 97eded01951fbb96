"""POST bodies read strictly (``service.api.request_body``): JSON objects and CSV tables, with refusals
that say what and where."""

import pytest

from tests.api.test_problems import problem
from tests.conftest import csv_answer

BOM = b"\xef\xbb\xbf"


def post_json(client, text: bytes | str, path: str = "/v1/boiling-point"):
    return client.post(path, data=text, content_type="application/json")


def test_a_key_given_twice_is_refused_not_answered_with_the_last(client) -> None:
    body = problem(post_json(client, '{"pressure": 100, "pressure": 200}'), 400)
    assert body["errors"] == {"pressure": ["given more than once in the body"]}
    nested = '{"pressure": {"value": 1, "unit": "bar", "unit": "psi"}}'
    assert problem(post_json(client, nested), 400)["errors"] == {"unit": ["given more than once in the body"]}
    # A colon inside a string is not a key: the body is read again, and answered.
    tagged = post_json(client, '{"pressure": 100, "tag": "TI-101: drum"}')
    assert tagged.status_code == 200 and tagged.get_json()["tag"] == "TI-101: drum"


def test_a_key_given_twice_deep_in_rows_of_numbers_is_refused(client) -> None:
    # Rows of numbers are counted by their first row only; a repeated key further in must still be found.
    text = '{"components": ["ethanol", "water"], "fractions": [[0.5, 0.5], [{"a": 1, "a": 2}]], "pressure": 100}'
    body = problem(post_json(client, text, "/v1/bubble-point"), 400)
    assert "a" in body["errors"], body


@pytest.mark.parametrize("text", ["", "  \n", BOM.decode()])
def test_an_empty_body_says_it_is_empty(client, text: str) -> None:
    assert "is empty" in problem(post_json(client, text), 400)["detail"]


@pytest.mark.parametrize("number", ["1e999", "-1e999", "1" + "0" * 400])
def test_numbers_beyond_double_range_are_out_of_range(client, number: str) -> None:
    detail = problem(post_json(client, f'{{"pressure": {number}}}'), 400)["detail"]
    assert "out of range" in detail and "NaN" not in detail


def test_json_and_csv_with_a_byte_order_mark_are_read(client) -> None:
    assert post_json(client, BOM + b'{"pressure": 100}').status_code == 200
    csv = client.post("/v1/boiling-point", data=BOM + b"pressure\r\n100\r\n50\r\n", content_type="text/csv")
    assert csv.status_code == 200 and len(csv.get_json()["boiling_point"]["value"]) == 2


@pytest.mark.parametrize(
    ("text", "field", "where"),
    [
        ("pressure,depth\n100,0.1\n101,abc\n", "depth", "row 3, column 2 (depth): 'abc'"),
        ("pressure,depth\n100,\n", "depth", "row 2, column 2 (depth): empty"),
        ("pressure\n100\n1e999\n", "pressure", "row 3, column 1 (pressure): '1e999': out of range"),
        ("pressure\n١٠٠\n", "pressure", "row 2, column 1 (pressure)"),
        ("pressure\n1_000\n", "pressure", "row 2, column 1 (pressure)"),
    ],
)
def test_a_bad_csv_cell_is_named_by_row_and_column(client, text: str, field: str, where: str) -> None:
    body = problem(client.post("/v1/boiling-point", data=text.encode(), content_type="text/csv"), 400)
    assert where in body["errors"][field][0], body


def test_a_csv_tag_column_is_echoed_beside_each_row(client) -> None:
    text = 'tag,gauge_pressure [psig]\nPT-101,10\n"PT-102, drum B",20\n'
    r = client.post("/v1/boiling-point?elevation=1420", data=text.encode(), content_type="text/csv")
    body = r.get_json()
    assert body["tag"] == ["PT-101", "PT-102, drum B"]
    assert body["gauge_pressure"]["value"] == pytest.approx([68.9475729, 137.8951459])


def test_quoted_csv_cells_and_blank_rows(client) -> None:
    # RFC 4180 lets a writer quote any cell; a blank row in the middle is named.
    quoted = client.post("/v1/boiling-point", data=b'pressure\n"100"\n200\n', content_type="text/csv")
    assert quoted.status_code == 200 and len(quoted.get_json()["boiling_point"]["value"]) == 2
    blank = problem(client.post("/v1/boiling-point", data=b"pressure\n100\n\n200\n", content_type="text/csv"), 400)
    assert "row 3 of the file (the header is row 1) is empty" in blank["detail"]


def test_post_body_must_be_a_json_object(client) -> None:
    problem(client.post("/v1/boiling-point", data="pressure=100", content_type="text/plain"), 415)
    problem(client.post("/v1/boiling-point", data="{not json", content_type="application/json"), 400)
    problem(client.post("/v1/boiling-point", data='{"pressure": NaN}', content_type="application/json"), 400)
    problem(client.post("/v1/boiling-point", json=[100]), 400)


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


def test_a_csv_column_named_twice_is_refused(client) -> None:
    r = client.post("/v1/boiling-point", data="pressure,pressure [kPa]\n1,2\n", content_type="text/csv")
    assert r.status_code == 400
