"""Whether a mixture's liquid splits into two liquid phases, where its bubble or dew point would not hold.

Each pair of components has judges: models that give its binodal (:mod:`service.physics.liquid_split`). A split
is refused where every judge of the pair predicts it, and cautioned where only some do. With two components the
test is of the liquid's own composition; with three or more, of the temperature alone (any split of a pair
there), a conservative test. SI throughout: temperature [K], mole fractions.
"""

from __future__ import annotations

from collections.abc import Sequence
from dataclasses import dataclass

import numpy as np
from numpy.typing import NDArray

from service.fluids.cautions import Caution, Warnings, literal
from service.fluids.limits import Refusal, any_of
from service.fluids.pairs import Activity
from service.physics.activity.unifac import Unifac
from service.physics.liquid_split import binodal

Array = NDArray[np.float64]
DISAGREE = (
    " split into two liquid phases here, and another judge does not: answered as one liquid. If the liquid turns "
    "cloudy or separates into layers, this answer does not hold."
)


@dataclass(frozen=True)
class Judge:
    """A model that tests a pair's liquid for two phases over ``scan`` [K], named as refusals name it."""

    name: str
    model: Activity | Unifac
    scan: tuple[float, float]
    source: str


def check_two_liquids(
    pair: tuple[str, str],
    judges: Sequence[Judge],
    components: Sequence[str],
    liquid: Array,
    temperature: Array,
    field: str,
) -> Warnings:
    """Refuse the points where the ``liquid`` (N, n) of ``components`` splits by every judge of ``pair`` at
    ``temperature`` [K] (N,); a caution where only some judges predict it."""
    if not judges:
        return []
    gaps = [_binodal_at(pair, judge, temperature) for judge in judges]
    if len(components) == 2:
        share = liquid[:, list(components).index(pair[0])]
        inside = [(share > low) & (share < high) for low, high in gaps]
        every = np.logical_and.reduce(inside)
    else:  # a gap at all; every judge's, and overlapping, to agree
        inside = [~np.isnan(low) for low, _ in gaps]
        overlap = np.fmax.reduce([g[0] for g in gaps]) < np.fmin.reduce([g[1] for g in gaps])
        every = np.logical_and.reduce(inside) & overlap
    some = np.logical_or.reduce(inside)
    names, who = " and ".join(literal(c) for c in pair), " and ".join(judge.name for judge in judges)
    if any_of(every):
        i = int(np.flatnonzero(every)[0])
        point = f" (point {i} of the request)" if len(every) > 1 else ""
        where = f"about {temperature[i]:.2f} K ({temperature[i] - 273.15:.2f} degC){point}"
        if len(components) == 2:
            low, high = max(g[0][i] for g in gaps), min(g[1][i] for g in gaps)
            extent = f"where the liquid holds between {low:.4g} and {high:.4g} mole fraction {literal(pair[0])}"
        else:
            extent = (
                "at some composition of the two (with three components or more, any temperature at which a pair "
                "splits is refused: a conservative test)"
            )
        agree = "predicts it" if len(judges) == 1 else "predict it"
        raise Refusal(
            f"{names} form two liquid phases at {where} {extent} ({who} {agree}); a single-liquid bubble or dew "
            "point is not answered there.",
            {field: ["two liquid phases"]},
        )
    if not any_of(some):
        return []
    first = int(np.flatnonzero(some)[0])
    yes = " and ".join(judge.name for judge, split in zip(judges, inside, strict=True) if split[first])
    return [Caution(f"{yes} predicts that {names}{DISAGREE} ({who} were asked.)", some)]


_SPLITS: dict[tuple[str, tuple[str, str], tuple[float, float]], tuple[Array, Array, Array, NDArray[np.bool_]]] = {}
"""The binodal tables by judge and pair: temperatures at 1 K steps over the scan, low, high, and which rows are
computed (each the first time an answer falls next to it: a single answer computes two rows, not the scan)."""


def _binodal_at(ids: tuple[str, str], judge: Judge, temperature: Array) -> tuple[Array, Array]:
    """Where the pair ``ids`` splits by ``judge`` at each of ``temperature`` [K]: mole fractions of its first
    component (low, high), NaN where it is one phase. From a table over the judge's scan at 1 K steps; between two
    steps the union of their gaps; beyond the scan, its end's."""
    key = (judge.name, ids, judge.scan)
    if key not in _SPLITS:
        low_end, high_end = judge.scan
        temperatures = np.arange(low_end, max(high_end, low_end + 1.0) + 0.5, 1.0)  # two rows at least
        nothing = np.full(len(temperatures), np.nan)
        _SPLITS[key] = (temperatures, nothing, nothing.copy(), np.zeros(len(temperatures), dtype=bool))
    temperatures, low, high, done = _SPLITS[key]
    k = np.clip(np.searchsorted(temperatures, temperature), 1, len(temperatures) - 1)
    needed = np.bincount(k, minlength=len(temperatures)) > 0  # rows k, and k - 1 below: no sort of the points
    needed[:-1] |= needed[1:]
    missing = np.flatnonzero(needed & ~done)
    if missing.size:
        low[missing], high[missing] = binodal(judge.model.log_gamma, temperatures[missing])
        done[missing] = True
    return np.fmin(low[k - 1], low[k]), np.fmax(high[k - 1], high[k])
