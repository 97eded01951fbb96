"""Numbers at the edge: JSON's number syntax, and rounding to significant digits."""

import numpy as np
import pytest
from marshmallow import ValidationError

from service.api.numbers import parse_number, significant


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
