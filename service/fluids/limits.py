"""Refusals and limits as data: which input, which limit [SI], and why.

The domain raises a :class:`Refusal` when it will not answer; the API turns it into a problem
and shows an :class:`OutOfRange`'s numbers in the request's own units. A :class:`Limits`
states where something that boils may answer for one input: where it exists at all (outside,
always refused), the stated range of its equation (refused unless the caller asks to
extrapolate, then a caution), and how far the equation may be extrapolated.
"""

from __future__ import annotations

from collections.abc import Mapping
from dataclasses import dataclass

import numpy as np
from numpy.typing import NDArray

from service.fluids.cautions import Caution, Kind, Shown, Warnings

SLACK = 1e-12
"""A limit typed in another unit comes back a rounding error off (0.01 degC is 273.15999999999997 K):
values within this relative distance of a limit count as on it."""

Bound = NDArray[np.float64] | float | None
"""A limit [SI]: one number, one per point, or None for no limit on that side."""


def any_of(mask: NDArray[np.bool_] | np.bool_ | bool) -> bool:
    """Whether any point of ``mask`` is true. A single value (a numpy scalar) is answered without ``np.any``,
    whose reduction costs microseconds on a scalar, several times on every request."""
    return bool(mask.any()) if isinstance(mask, np.ndarray) else bool(mask)


class Refusal(Exception):
    """A question the domain does not answer: ``status`` 400 for inputs that do not fit together, 422 for
    inputs the physics cannot answer; ``fields`` gives the messages per input."""

    def __init__(self, message: str, fields: Mapping[str, list[str]], status: int = 422) -> None:
        super().__init__(message)
        self.message, self.fields, self.status = message, dict(fields), status


class OutOfRange(Refusal):
    """Values of input ``field`` outside [``low``, ``high``] [SI]; ``below`` and ``above`` say why, with
    ``{limit}`` where the limit goes. ``too_low`` and ``too_high`` mark the values refused.
    ``read_as_air_pressure`` asks the API to name the units in which a refused number would be an air
    pressure (a barometer reading sent in the wrong unit)."""

    def __init__(
        self,
        field: str,
        kind: Kind,
        values: NDArray,
        bounds: tuple[Bound, Bound],
        reasons: tuple[str, str],
        masks: tuple[NDArray | bool, NDArray | bool],
        read_as_air_pressure: bool = False,
    ) -> None:
        super().__init__(f"{field} is out of range", {field: ["out of range"]})
        self.field, self.kind, self.values = field, kind, values
        (self.low, self.high), (self.below, self.above), (self.too_low, self.too_high) = bounds, reasons, masks
        self.read_as_air_pressure = read_as_air_pressure


def refuse_outside(
    field: str,
    kind: Kind,
    values: NDArray | float,
    low: Bound,
    high: Bound,
    below: str = "",
    above: str = "",
    read_as_air_pressure: bool = False,
) -> None:
    """Raise :class:`OutOfRange` when any of ``values`` lies below ``low`` or above ``high`` [SI].

    >>> refuse_outside("depth", "length", np.array([1.0, 2.0]), 0.0, None, "the surface, {limit}")
    >>> refuse_outside("depth", "length", np.array([1.0, -2.0]), 0.0, None, "the surface, {limit}")
    Traceback (most recent call last):
    ...
    service.fluids.limits.OutOfRange: depth is out of range
    """
    too_low = values < low - SLACK * abs(low) if low is not None else False
    too_high = values > high + SLACK * abs(high) if high is not None else False
    if any_of(too_low) or any_of(too_high):
        raise OutOfRange(
            field, kind, np.asarray(values), (low, high), (below, above), (too_low, too_high), read_as_air_pressure
        )


@dataclass(frozen=True)
class Limit:
    """A band an input must lie in [SI], with the reason for each end: a template where ``{limit}`` marks the
    number and any name goes through :func:`~service.fluids.cautions.literal`."""

    low: Bound
    high: Bound
    below: str
    above: str


@dataclass(frozen=True)
class Limits:
    """Where something that boils answers for one input [SI].

    ``exists``: bands outside which it has no answer at all (below the triple point, above the critical
    point, beyond a solubility); ``stated``: the equation's stated range; ``reach``: as far as it may be
    extrapolated; ``equation``: the equation's name in message templates ("the Wagner equation for water"),
    through :func:`~service.fluids.cautions.literal`.
    """

    exists: tuple[Limit, ...]
    stated: tuple[float, float]
    reach: tuple[float, float]
    equation: str


def check_limits(limits: Limits, field: str, kind: Kind, values: NDArray | float, extrapolate: bool) -> Warnings:
    """Refuse ``values`` of input ``field`` outside ``limits``; the caution owed where they are extrapolated.

    >>> water = Limits((Limit(273.16, 647.096, "the triple point, {limit}", "the critical point, {limit}"),),
    ...                (273.16, 647.096), (273.16, 647.096), "the IAPWS equation")
    >>> check_limits(water, "temperature", "temperature", np.array([300.0, 350.0]), False)
    []
    """
    for limit in limits.exists:
        refuse_outside(field, kind, values, limit.low, limit.high, limit.below, limit.above)
    low, high = limits.stated
    outside = (values < low) | (values > high)
    if not any_of(outside):
        return []
    where = f"the stated range of {limits.equation}"
    if not extrapolate:
        beyond = f"{where}, {{limit}} (send extrapolate=true to extrapolate)"
        refuse_outside(field, kind, values, low, high, beyond, beyond)
    reach = f"{{limit}}, as far as {limits.equation} can be extrapolated"
    refuse_outside(field, kind, values, *limits.reach, reach, reach)
    shown = {"low": Shown(low, kind), "high": Shown(high, kind)}
    return [
        Caution(f"{field} lies outside {where}, {{low}} to {{high}}: extrapolated, accuracy unknown.", outside, shown)
    ]
