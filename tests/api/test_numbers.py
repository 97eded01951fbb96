"""Numbers at the HTTP edge (``service.api.numbers``): JSON's number syntax for every number a request
sends, and rounding to significant digits."""

import numpy as np
import pytest
from marshmallow import ValidationError

from service.api.numbers import parse_number, significant
from tests.api.test_problems import problem


@pytest.mark.parametrize("text", ["0", "-0", "12", "-1.5", "1e3", "1E-3", "2.5e+10"])
def test_json_numbers_parse(text: str) -> None:
    assert parse_number(text) == float(text)


@pytest.mark.parametrize("text", ["", "+1", ".5", "5.", "01", "1_000", "١٠٠", "１", " 1", "nan", "inf", "0x1"])
def test_anything_else_is_refused(text: str) -> None:
    with pytest.raises(ValidationError):
        parse_number(text)


@pytest.mark.parametrize("digits", [1, 2, 3, 6, 10, 14, 15, 16, 17])
def test_significant_digits_round_as_the_decimal_text_does(digits: int) -> None:
    # The reference is Python's own correctly rounded formatting (format spec 'g'), read back.
    rng = np.random.default_rng(digits)
    values = np.concatenate([rng.uniform(-1e4, 1e4, 3000), 10 ** rng.uniform(-30, 30, 3000), [0.0, -0.0, 0.125]])
    expected = [float(f"{v:.{digits}g}") for v in values.tolist()]
    assert significant(values, digits).tolist() == expected
    assert significant(float(values[0]), digits) == expected[0]


@pytest.mark.parametrize("number", ["١٠٠", "１００", "1_000", " 100", "+100", ".5", "0x10", "1e999"])
def test_query_numbers_take_the_json_number_syntax_only(client, number: str) -> None:
    body = problem(client.get(f"/v1/boiling-point?pressure={number}"), 400)
    assert "pressure" in body["errors"]


def test_option_numbers_take_the_json_number_syntax_too(client) -> None:
    query = "/v1/saturation-margin?pressure=100&temperature=90&tolerance="
    assert client.get(query + "0.5").status_code == 200
    assert "tolerance" in problem(client.get(query + "１"), 400)["errors"]
    fluid = {"name": "lab oil", "boiling_point": "１００", "pressure": "101.325"}
    assert problem(client.post("/v1/boiling-point", json={"fluid": fluid, "pressure": 50}), 400)["errors"]


def test_digits_never_turn_a_number_into_null(client) -> None:
    # 1.75e308 rounded to 2 digits would be 1.8e308, beyond double range: it stays as it is.
    body = client.get("/v1/npsh-available?temperature=72&pressure=100&static_head=1.75e308&digits=2").get_json()
    assert body["static_head"]["value"] == 1.75e308 and body["npsh_available"]["value"] == 1.75e308
    assert body["pressure"]["value"] == 100.0
