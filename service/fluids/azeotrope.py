"""The azeotrope of a binary liquid mixture at a pressure: where the vapor has the liquid's composition.

At an azeotrope the relative volatility K1/K2 of the two components passes through 1. It is looked for
on a grid of liquid compositions from pure component 2 to pure component 1 and, where K1/K2 - 1 changes
sign, pinned down by bisection. SI throughout: temperature [K], pressure [Pa], mole fractions.
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

from service.fluids.cautions import Caution, Warnings, literal
from service.fluids.limits import Refusal
from service.fluids.mixture import Array, Mixture
from service.fluids.questions import Answer
from service.fluids.site_pressure import LocalPressure, PressureReadings, local_pressure

GRID = np.linspace(0.0, 1.0, 41)
"""Liquid mole fractions of component 1 on which the sign of K1/K2 - 1 is first read."""
_BISECTIONS = 45
"""Halvings of the bracketing interval: 0.025 / 2**45 is below 1e-15 in mole fraction."""


@dataclass
class Azeotrope(Answer):
    """The azeotrope's temperature [K] and liquid (= vapor) mole fractions, or None and the reason."""

    local: LocalPressure | None = None
    temperature: float | None = None
    composition: Array | None = None
    reason: str | None = None


def azeotrope(mix: Mixture, readings: PressureReadings) -> Azeotrope:
    """The azeotrope of the two components of ``mix`` at the one pressure ``readings`` describe."""
    answer = Azeotrope(local=local_pressure(readings))
    pressure = float(answer.local.value)
    first, second = (fluid.name for fluid in mix.components)

    def excess(x1: Array) -> Array:
        """K1/K2 - 1 at liquid fractions ``x1`` of component 1."""
        found = mix.bubble_point(np.full(x1.shape, pressure), np.stack([x1, 1.0 - x1], axis=-1))
        k = found.other / np.stack([x1, 1.0 - x1], axis=-1).clip(1e-300)
        return (
            np.where(x1 == 0.0, _dilute_k(mix, found, 0), k[:, 0])
            / np.where(x1 == 1.0, _dilute_k(mix, found, 1), k[:, 1])
            - 1.0
        )

    try:
        signs = np.sign(excess(GRID))
    except Refusal as exc:
        raise Refusal(
            f"{literal(first)} and {literal(second)} form two liquid phases over part of their composition range "
            "at this pressure: a single-liquid azeotrope is not looked for (where the vapor meets two liquids, the "
            "azeotrope is heterogeneous, outside this method).",
            exc.fields,
            exc.status,
        ) from exc
    changes = np.flatnonzero(signs[:-1] * signs[1:] < 0)
    answer.citations += mix.citations
    answer.cite(None, air=answer.local.note)
    if not changes.size:
        answer.warnings += _one_point(mix.bubble_point(np.array([pressure]), np.array([[0.5, 0.5]])).warnings)
        lighter = first if signs[len(signs) // 2] > 0 else second
        answer.reason = (
            f"none: {lighter} is the more volatile over the whole range of composition at this pressure "
            "(the relative volatility never passes through 1)"
        )
        return answer
    low, high = GRID[changes[0]], GRID[changes[0] + 1]
    low_sign = signs[changes[0]]
    for _ in range(_BISECTIONS):
        middle = 0.5 * (low + high)
        if np.sign(excess(np.array([middle]))[0]) == low_sign:
            low = middle
        else:
            high = middle
    x1 = 0.5 * (low + high)
    found = mix.bubble_point(np.array([pressure]), np.array([[x1, 1.0 - x1]]))
    answer.temperature, answer.composition = float(found.temperature[0]), np.array([x1, 1.0 - x1])
    answer.warnings += _one_point(found.warnings)
    if changes.size > 1:
        answer.warnings.append("The relative volatility passes through 1 more than once: the first azeotrope is given.")
    return answer


def _dilute_k(mix: Mixture, found: object, index: int) -> Array:
    """K of component ``index`` at its infinite dilution: gamma p_sat / p at the bubble point found."""
    pure = mix.components[index].saturation_pressure(found.temperature)  # type: ignore[attr-defined]
    return found.gamma[:, index] * pure / found.pressure  # type: ignore[attr-defined]


def _one_point(warnings: Warnings) -> Warnings:
    """Cautions of a one-point array, for an answer of one point."""
    return [Caution(w.text, True, w.shown) if isinstance(w, Caution) else w for w in warnings]
