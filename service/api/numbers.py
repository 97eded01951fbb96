"""Numbers at the HTTP edge: one syntax for every number a request sends, and rounding for the answer."""

from __future__ import annotations

import math
import re
from typing import Any

import numpy as np
from marshmallow import ValidationError, fields

from service.physics.array_blocks import Numbers

_JSON_NUMBER = re.compile(r"-?(?:0|[1-9][0-9]*)(?:\.[0-9]+)?(?:[eE][+-]?[0-9]+)?")
"""A number as JSON writes it (RFC 8259, section 6), in ASCII digits: the one syntax every input takes."""
OUT_OF_RANGE = "out of range: beyond double precision (magnitude above about 1.8e308)"
NOT_A_NUMBER = "must be a number as JSON writes it: ASCII digits, an optional minus sign, fraction and exponent"


def parse_number(text: str) -> float:
    """A number written as text (a query string, a CSV cell), in JSON's syntax; ValidationError otherwise.

    >>> parse_number("-1.5e3"), parse_number("0")
    (-1500.0, 0.0)
    """
    if not _JSON_NUMBER.fullmatch(text):
        raise ValidationError(NOT_A_NUMBER)
    value = float(text)
    if not math.isfinite(value):
        raise ValidationError(OUT_OF_RANGE)
    return value


def finite_numbers(value: Any) -> Numbers:
    """A number as a float, or a flat list (or float array, from CSV) of numbers as a float array.

    Anything else, or a number that is not finite, raises ValidationError.
    """
    if isinstance(value, np.ndarray):
        array = value
    elif isinstance(value, bool) or not isinstance(value, int | float | list):
        raise ValidationError("must be a number or an array of numbers")
    elif isinstance(value, list) and not set(map(type, value)) <= {int, float}:
        raise ValidationError("an array must hold numbers only")
    else:
        try:
            array = np.asarray(value, dtype=float) if isinstance(value, list) else float(value)
        except OverflowError:  # a whole number too large for a double
            raise ValidationError(OUT_OF_RANGE) from None
    if not all_finite(array):
        raise ValidationError(OUT_OF_RANGE)
    return array


class Number(fields.Float):
    """A finite number: a JSON number, or text in JSON's number syntax (a query string)."""

    def __init__(self, **kwargs: Any) -> None:
        super().__init__(allow_nan=False, **kwargs)

    def _deserialize(self, value: Any, attr: str | None, data: Any, **kwargs: Any) -> float:
        if isinstance(value, str):
            return super()._deserialize(parse_number(value), attr, data, **kwargs)
        if isinstance(value, bool) or not isinstance(value, int | float):
            raise ValidationError("must be a number")
        return super()._deserialize(finite_numbers(value), attr, data, **kwargs)


def printable(text: str) -> None:
    """Refuse control characters (line ends, tabs): labels are echoed into text and CSV answers line by line."""
    if any(not c.isprintable() for c in text):
        raise ValidationError("must not hold control characters such as line ends")


class WholeNumber(fields.Integer):
    """A whole number: a JSON integer, or ASCII digits in a query string."""

    def _deserialize(self, value: Any, attr: str | None, data: Any, **kwargs: Any) -> int:
        text_ok = not isinstance(value, str) or _WHOLE.fullmatch(value)
        if isinstance(value, bool) or not isinstance(value, int | str) or not text_ok:
            raise ValidationError("must be a whole number in ASCII digits")
        return super()._deserialize(value, attr, data, **kwargs)


_WHOLE = re.compile(r"-?[0-9]{1,9}")


# A single value is a float (a numpy scalar, mostly): answered without a numpy reduction, which costs
# microseconds on a scalar.


def all_finite(value: Numbers) -> bool:
    """Whether a number, or every number of an array, is finite."""
    return math.isfinite(value) if isinstance(value, float) else bool(np.isfinite(value).all())


_EXACT_POWERS = 22
"""10**k is exact in double precision up to k = 22: the fast rounding below divides by such powers only."""
_FAST_DIGITS = 14
"""Up to this many digits x * 10**k stays well inside the 53-bit mantissa, so its rounding error is tiny."""


def significant(value: Numbers, digits: int) -> Numbers:
    """``value`` rounded to ``digits`` significant digits: the double nearest the rounded decimal, so that
    JSON and CSV show it in its short form (``95.2498``). A number whose rounding would overflow stays as it is.

    Vectorised: x is scaled by an exact power of ten, rounded to a whole number and scaled back. The
    scaling itself rounds, so where the scaled number lies within a few units in its last place of a half
    (a tie the scaling may have moved), and for more than 14 digits or powers beyond 10**22, the number is
    rounded through its decimal text instead, which is exact.

    >>> significant(95.24976013, 6), significant(-0.000123456, 2), significant(123456.0, 2)
    (95.2498, -0.00012, 120000.0)
    >>> significant(876.5370964165805, 15), significant(0.125, 2)
    (876.537096416581, 0.12)
    """
    array = np.asarray(value, dtype=float)
    with np.errstate(divide="ignore", over="ignore", invalid="ignore"):
        magnitude = np.floor(np.log10(np.abs(array)))
        exponent = np.where(np.isfinite(magnitude), digits - 1 - magnitude, 0).astype(np.int64)
        scale = np.power(10.0, np.minimum(np.abs(exponent), _EXACT_POWERS))
        scaled = np.where(exponent >= 0, array * scale, array / scale)
        whole = np.round(scaled)
        out = np.where(exponent >= 0, whole / scale, whole * scale)
        near_tie = np.abs(np.abs(scaled - np.trunc(scaled)) - 0.5) <= 4 * np.spacing(np.abs(scaled))
    doubtful = near_tie | (np.abs(exponent) > _EXACT_POWERS) | (digits > _FAST_DIGITS)
    if doubtful.any():
        out = np.array(out, dtype=float, copy=True, ndmin=1)
        flat = np.ravel(doubtful)
        out.reshape(-1)[flat] = [float(f"{v:.{digits}g}") for v in np.ravel(array)[flat].tolist()]
        out = out.reshape(array.shape)
    out = np.where(np.isfinite(out), out, array)
    return out if out.ndim else float(out)
