"""The saturation temperature of a vapor-pressure equation from a table: the fast inverse T(p)."""

from __future__ import annotations

import math
from functools import cache

import numpy as np
from numpy.typing import ArrayLike, NDArray

from service.physics.array_blocks import in_blocks
from service.physics.vapor_pressure import VaporPressureEquation


class InverseTable:
    """T(p) of an equation between two temperatures, as a piecewise-cubic Hermite table.

    The nodes are exact inverses (Newton, :meth:`VaporPressureEquation.temperature`) with
    exact slopes, spaced evenly in s = sqrt(ln p_high - ln p). In s the inverse stays smooth
    up to a Wagner equation's critical end, where T(ln p) itself has a square-root cusp, so
    4096 intervals reproduce the Newton answers to about 1e-10 K. One log, one sqrt and a
    cubic per point: the fast path for every saturation-temperature request.
    """

    def __init__(self, equation: VaporPressureEquation, low: float, high: float, intervals: int = 4096) -> None:
        ln_lo, self._ln_high = (float(v) for v in equation.ln_pressure(np.array([low, high])))
        self._step = math.sqrt(self._ln_high - ln_lo) / intervals
        self._end = float(intervals)
        s = np.arange(intervals + 1) * self._step
        ln_p = self._ln_high - s * s
        nodes = equation.temperature(np.exp(ln_p), low, high)
        nodes[0], nodes[-1] = high, low
        _, d_ln_p = equation.ln_pressure_and_slope(nodes)
        tangent = -2.0 * s / d_ln_p * self._step  # dT/ds, per interval
        t0, t1, m0, m1 = nodes[:-1], nodes[1:], tangent[:-1], tangent[1:]
        # One more interval past the last node, constant at `low`: with s clamped to the table's end,
        # its index and fraction are valid there too, and no other clamp is needed.
        c = (t0, m0, 3 * (t1 - t0) - 2 * m0 - m1, 2 * (t0 - t1) + m0 + m1)
        self._c = tuple(np.append(part, end) for part, end in zip(c, (low, 0.0, 0.0, 0.0), strict=True))

    def __call__(self, pressure: ArrayLike) -> NDArray[np.float64]:
        """Saturation temperature [K] at ``pressure`` [Pa]; pressures beyond the ends give the ends."""
        return in_blocks(self._evaluate, pressure)

    def _evaluate(self, pressure: NDArray) -> NDArray:
        # s in intervals from the high end, clamped to the table: no index or fraction falls outside it.
        s = np.minimum(np.sqrt(np.maximum(self._ln_high - np.log(pressure), 0.0)) / self._step, self._end)
        index = s.astype(np.intp)
        t = s - index
        c0, c1, c2, c3 = (c.take(index, mode="clip") for c in self._c)  # clip: a NaN's index is garbage
        return ((c3 * t + c2) * t + c1) * t + c0


@cache
def inverse_table(equation: VaporPressureEquation, low: float, high: float) -> InverseTable:
    """The one :class:`InverseTable` of ``equation`` between ``low`` and ``high`` [K], built on first use."""
    return InverseTable(equation, low, high)
