"""Mixture benchmark: a 100,000-point binary bubble-point POST end to end, and the physics per point against a
reference library's equilibrium call made point by point.

Issue 13's targets: the POST in under 0.3 s end to end, and the physics at least 1,000 times faster per point
than the reference library (thermo's FlashVL with the same NRTL parameters, one bubble point per call).

    python bench/mixtures.py      (or: make bench-mixtures)
"""

from __future__ import annotations

import http.client
import statistics
import sys
import time
from pathlib import Path
from urllib.parse import urlparse

import numpy as np
import orjson
from thermo import NRTL, ChemicalConstantsPackage, FlashVL, GibbsExcessLiquid, IdealGas

sys.path.insert(0, str(Path(__file__).resolve().parents[1]))

from bench.common import free_port, gunicorn, machine, write_section
from service.fluids.catalog import load_catalog
from service.fluids.groups import load_group_tables
from service.fluids.model_choice import mixture
from service.fluids.pairs import load_pair_sets

POINTS = 100_000
REPEATS = 7
REFERENCE_POINTS = 100
TARGET_SECONDS = 0.3
TARGET_SPEEDUP = 1_000


def compositions(n: int) -> np.ndarray:
    x = np.linspace(0.001, 0.999, n)
    return np.stack([x, 1.0 - x], axis=-1)


def physics_seconds_per_point() -> float:
    catalog = load_catalog()
    mix = mixture(
        [catalog.get("ethanol"), catalog.get("water")], load_pair_sets(catalog), load_group_tables(catalog), "nrtl"
    )
    x, p = compositions(POINTS), np.full(POINTS, 101_325.0)
    mix.bubble_point(p, x)  # the pair's liquid-split table is built once
    times = []
    for _ in range(REPEATS):
        t0 = time.perf_counter()
        mix.bubble_point(p, x)
        times.append(time.perf_counter() - t0)
    return statistics.median(times) / POINTS


def reference_seconds_per_point() -> float:
    constants, correlations = ChemicalConstantsPackage.from_IDs(["ethanol", "water"])
    b = [[0.0, -29.166654483541816], [624.8676222389441, 0.0]]  # data/pairs/nrtl.toml, ethanol/water in K
    alpha = [[0.0, 0.2937], [0.2937, 0.0]]
    state = {"T": 351.45, "P": 101_325.0, "zs": [0.5, 0.5]}
    liquid = GibbsExcessLiquid(
        VaporPressures=correlations.VaporPressures,
        HeatCapacityGases=correlations.HeatCapacityGases,
        VolumeLiquids=correlations.VolumeLiquids,
        GibbsExcessModel=NRTL(T=351.45, xs=[0.5, 0.5], tau_bs=b, alpha_cs=alpha),
        equilibrium_basis="Psat",
        caloric_basis="Psat",
        **state,
    )
    flash = FlashVL(constants, correlations, liquid=liquid, gas=IdealGas(correlations.HeatCapacityGases, **state))
    t0 = time.perf_counter()
    for x1, x2 in compositions(REFERENCE_POINTS):
        flash.flash(P=101_325.0, VF=0, zs=[x1, x2])
    return (time.perf_counter() - t0) / REFERENCE_POINTS


def post_seconds() -> list[float]:
    body = orjson.dumps(
        {"components": ["ethanol", "water"], "fractions": compositions(POINTS), "pressure": 101.325},
        option=orjson.OPT_SERIALIZE_NUMPY,
    )
    times = []
    with gunicorn(free_port()) as (base, _):
        url = urlparse(base)
        conn = http.client.HTTPConnection(url.hostname, url.port, timeout=60)
        for _ in range(REPEATS + 1):
            t0 = time.perf_counter()
            conn.request("POST", "/v1/bubble-point", body, {"Content-Type": "application/json"})
            response = conn.getresponse()
            answer = orjson.loads(response.read())
            times.append(time.perf_counter() - t0)
            assert response.status == 200, answer
            assert len(answer["bubble_point"]["value"]) == POINTS
        conn.close()
    return times[1:]  # the first warms the worker


def main() -> None:
    ours, reference = physics_seconds_per_point(), reference_seconds_per_point()
    posts = post_seconds()
    median, speedup = statistics.median(posts), reference / ours
    rows = [
        "| measure | result | target |",
        "| --- | ---: | --- |",
        f"| 100,000-point binary bubble-point POST, end to end (median of {REPEATS}) | {median:.3f} s | under "
        f"{TARGET_SECONDS} s: {'met' if median < TARGET_SECONDS else 'not met'} |",
        f"| physics per point, this service (100,000 points at once) | {ours * 1e6:.2f} us | |",
        f"| physics per point, thermo FlashVL, one call per point ({REFERENCE_POINTS} points) | {reference * 1e6:,.0f} "
        "us | |",
        f"| speed-up | {speedup:,.0f}x | at least {TARGET_SPEEDUP:,}x: "
        f"{'met' if speedup >= TARGET_SPEEDUP else 'not met'} |",
        "",
        "Ethanol and water at 101.325 kPa, NRTL with the same DECHEMA parameters in both; compositions from x = 0.001 "
        "to 0.999. The POST sends the compositions as a list of lists over one kept-alive loopback connection to "
        "`make serve`'s gunicorn; the physics is the domain call (Mixture.bubble_point) in this process.",
    ]
    write_section("mixtures", f"Measured {machine()}.\n\n" + "\n".join(rows))


if __name__ == "__main__":
    main()
