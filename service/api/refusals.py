"""The domain's refusals as RFC 9457 problems, in the request's own units.

The domain states its limits in SI (:mod:`service.fluids.limits`); here each refused value and the
limit it passes are shown in the unit the request uses for its kind.
"""

from __future__ import annotations

from collections.abc import Mapping

import numpy as np

from service.api.problems import Problem
from service.api.quantity_fields import format_value, unit_of
from service.fluids.limits import OutOfRange, Refusal
from service.physics import site
from service.physics.units import Unit

_MAX_LISTED = 10


def problem(refusal: Refusal, units: Mapping[str, Unit]) -> Problem:
    """The problem that answers ``refusal``, its numbers in the request's units."""
    if isinstance(refusal, OutOfRange):
        return _out_of_range(refusal, unit_of(refusal.kind, units))
    return Problem(refusal.status, refusal.message, refusal.fields)


def _out_of_range(refusal: OutOfRange, unit: Unit) -> Problem:
    """422 naming each refused value (with its index in an array) and the limit it passes, in ``unit``."""
    bad = np.logical_or(refusal.too_low, refusal.too_high)
    values, too_low = np.broadcast_to(refusal.values, bad.shape), np.broadcast_to(refusal.too_low, bad.shape)
    lows = np.broadcast_to(-np.inf if refusal.low is None else refusal.low, bad.shape)
    highs = np.broadcast_to(np.inf if refusal.high is None else refusal.high, bad.shape)
    hint = _air_pressure_hint(values, bad, unit) if refusal.read_as_air_pressure else ""
    messages = []
    for index in np.flatnonzero(bad)[:_MAX_LISTED]:
        limit = float(lows.flat[index] if too_low.flat[index] else highs.flat[index])
        value, limit_text = _distinct(float(values.flat[index]), limit, unit)
        if too_low.flat[index]:
            text = f"{value} is below " + (refusal.below + hint).format(limit=limit_text)
        else:
            text = f"{value} is above " + (refusal.above + hint).format(limit=limit_text)
        messages.append(f"index {index}: {text}" if values.ndim else text)
    count = int(bad.sum())
    if count > len(messages):
        messages.append(f"and {count - len(messages)} more")
    field = refusal.field
    return Problem(
        422, f"{field}: {messages[0]}" + (f" ({count} values in all)" if count > 1 else ""), {field: messages}
    )


def _distinct(value: float, limit: float, unit: Unit) -> tuple[str, str]:
    """A value and its limit formatted with enough digits to tell them apart."""
    for digits in (6, 9, 12, 17):
        texts = format_value(value, unit, digits), format_value(limit, unit, digits)
        if texts[0] != texts[1]:
            break
    return texts


def _air_pressure_hint(values: np.ndarray, bad: np.ndarray, unit: Unit) -> str:
    """For a barometer reading outside the band: the air pressures its first such number would be in the
    units it fits (two at most)."""
    number = float(unit.from_si(float(np.ravel(values)[np.flatnonzero(np.ravel(bad))[0]])))
    readings = [
        f"{format_value(pascal, unit)} in {' or '.join(u.code for u in fits)}"
        for pascal, fits in site.air_pressure_readings(number)
        if unit.code not in {u.code for u in fits}
    ][:2]
    if not readings:
        return ""
    return f"; as a barometer reading, {number:g} would be {', or '.join(readings)}: check the unit it was sent in"
