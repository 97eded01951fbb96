"""Where a binary liquid splits into two liquid phases: the binodal, per temperature, from a model's ln gamma.

At temperature T the liquid's Gibbs energy of mixing is g(x) = x ln(x gamma_1) + (1 - x) ln((1 - x) gamma_2)
[in units of RT], x the mole fraction of component 1. A liquid of composition x is stable as one phase where g
touches its lower convex envelope; where g lies above it, the liquid is cheaper as the two phases at the ends of
the envelope's bridging segment (the common tangent), and those ends are the binodal (e.g. J. M. Prausnitz,
R. N. Lichtenthaler and E. G. de Azevedo, Molecular Thermodynamics of Fluid-Phase Equilibria, 3rd ed., 1999,
ch. 6). SI throughout: temperature [K], mole fractions.
"""

from __future__ import annotations

import itertools
from collections.abc import Callable

import numpy as np
from numpy.typing import NDArray

Array = NDArray[np.float64]

GRID = 0.5 * (1.0 - np.cos(np.pi * np.arange(1, 600) / 600))
"""Interior compositions x at which g is evaluated: dense near 0 and 1 (1.7e-5 apart there), where the binodal
of a sparingly soluble liquid lies."""
ABOVE = 1e-9
"""How far [RT] g must lie above its envelope for a composition to count as split (rounding stays one phase)."""


def binodal(log_gamma: Callable[[Array, Array], Array], temperatures: Array) -> tuple[Array, Array]:
    """The mole fractions of component 1 between which a binary liquid is two phases, at each of ``temperatures``
    [K]: (low, high), both NaN where the liquid is one phase at every composition. Where the envelope bridges more
    than one gap, the span from the first to the last.

    Water (1) and 1-butanol (2) at 363.15 K, NRTL with the DECHEMA set (A12 = 2633.6951, A21 = 504.0381 cal/mol,
    alpha = 0.4447; DECHEMA Chemistry Data Series Vol. I/1a, p. 336, via ChemSep) splits between x1 = 0.589 and
    0.983; the measured mutual solubilities near 90 degC are about x1 = 0.6 and 0.98 (recalled from memory):

    >>> from service.physics.activity.nrtl import Nrtl
    >>> b = np.array([[0.0, 2633.6951], [504.0381, 0.0]]) * 4.184 / 8.314462618
    >>> model = Nrtl(np.zeros((2, 2)), b, np.full((2, 2), 0.4447) * (1 - np.eye(2)))
    >>> [round(float(v[0]), 3) for v in binodal(model.log_gamma, np.array([363.15]))]
    [0.589, 0.983]
    """
    x = np.stack([GRID, 1.0 - GRID], axis=-1)[None, :, :]
    g = np.sum(x * (np.log(x) + log_gamma(x, temperatures[:, None])), axis=-1)
    g = np.pad(g, ((0, 0), (1, 1)))  # the pure liquids: g = 0
    grid = np.concatenate([[0.0], GRID, [1.0]])
    slopes = np.diff(g, axis=-1) / np.diff(grid)
    low, high = np.full(len(temperatures), np.nan), np.full(len(temperatures), np.nan)
    for k in np.flatnonzero(np.any(np.diff(slopes, axis=-1) < 0.0, axis=-1)):  # convex rows have no gap
        gaps = _gaps(grid, g[k])
        if gaps:
            low[k], high[k] = gaps[0][0], gaps[-1][1]
    return low, high


def _gaps(grid: Array, g: Array) -> list[tuple[float, float]]:
    """The segments of the lower convex envelope of (grid, g) that bridge points lying above it by more than
    ``ABOVE``, by Andrew's monotone chain."""
    hull: list[int] = []
    for i in range(len(grid)):
        while len(hull) >= 2:
            a, b = hull[-2], hull[-1]
            if (grid[b] - grid[a]) * (g[i] - g[a]) - (g[b] - g[a]) * (grid[i] - grid[a]) > 0.0:
                break
            hull.pop()
        hull.append(i)
    gaps = []
    for a, b in itertools.pairwise(hull):
        if b - a < 2:
            continue
        inside = slice(a + 1, b)
        chord = g[a] + (g[b] - g[a]) * (grid[inside] - grid[a]) / (grid[b] - grid[a])
        if np.max(g[inside] - chord) > ABOVE:
            gaps.append((float(grid[a]), float(grid[b])))
    return gaps
