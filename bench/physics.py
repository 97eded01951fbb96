"""Physics micro-benchmark: nanoseconds per point on arrays of 1e3 to 1e7 points.

Beside each function: one numpy.log over an array of the same size (the memory-bound floor),
and independent reference libraries called point by point, as a caller would otherwise do
(CoolProp and iapws for water saturation; the fluids and ambiance packages for the atmosphere).

numpy picks its loops for the CPU at import. On a CPU with AVX-512 its log runs a vector
loop at about 1 ns per point, four to five times faster than on an AVX2-only CPU, while the
service's chains of twenty-odd array operations gain far less. So where AVX-512 is present,
the 1e6-point rows are measured a second time in a child process with numpy's AVX-512 loops
switched off (NPY_DISABLE_CPU_FEATURES), which is how the same code runs on an AVX2 machine.

    python bench/physics.py      (or: make bench-physics)
"""

from __future__ import annotations

import json
import os
import subprocess
import sys
import time
from collections.abc import Callable
from pathlib import Path

import numpy as np
from numpy.lib.introspect import opt_func_info

sys.path.insert(0, str(Path(__file__).resolve().parents[1]))

from bench.common import machine, write_section
from service.physics import atmosphere, water

SIZES = (1_000, 10_000, 100_000, 1_000_000, 10_000_000)
TARGET_RATIO, TARGET_SPEED_UP = 5.0, 1000.0
AVX512_OFF = {"NPY_DISABLE_CPU_FEATURES": "X86_V4 AVX512_ICL AVX512_SPR"}


def best_seconds(func: Callable[[], object], budget: float = 1.0) -> float:
    """The fastest of repeated calls within about ``budget`` seconds (at least 3 calls)."""
    times: list[float] = []
    start = time.perf_counter()
    while len(times) < 3 or time.perf_counter() - start < budget:
        t0 = time.perf_counter()
        func()
        times.append(time.perf_counter() - t0)
        if len(times) >= 200:
            break
    return min(times)


def _shuffled(x: np.ndarray) -> np.ndarray:
    np.random.default_rng(1976).shuffle(x)
    return x


FUNCTIONS = {
    "saturation_temperature": (water.saturation_temperature, lambda n: np.geomspace(700.0, 2.2e7, n)),
    "saturation_pressure": (water.saturation_pressure, lambda n: np.linspace(274.0, 646.0, n)),
    "pressure_at_elevation": (atmosphere.pressure_at_elevation, lambda n: np.linspace(-4e3, 8.5e4, n)),
    "elevation_at_pressure": (atmosphere.elevation_at_pressure, lambda n: np.geomspace(0.4, 1.7e5, n)),
    # The same points in random order: most blocks then span several layers.
    "pressure_at_elevation, shuffled": (
        atmosphere.pressure_at_elevation,
        lambda n: _shuffled(np.linspace(-4e3, 8.5e4, n)),
    ),
    "elevation_at_pressure, shuffled": (
        atmosphere.elevation_at_pressure,
        lambda n: _shuffled(np.geomspace(0.4, 1.7e5, n)),
    ),
}


def measure(sizes: tuple[int, ...]) -> list[dict[str, float | str]]:
    """ns per point of every function and of numpy.log, interleaved, best of three rounds each."""
    results = []
    for name, (func, make) in FUNCTIONS.items():
        for n in sizes:
            x, positive = make(n), np.linspace(1.0, 2.0, n)
            budget = 0.5 if n < 10_000_000 else 1.5
            ours = log = np.inf
            for _ in range(3):  # interleaved, so that both see the same machine load
                ours = min(ours, best_seconds(lambda f=func, x=x: f(x), budget) / n * 1e9)
                log = min(log, best_seconds(lambda p=positive: np.log(p), budget) / n * 1e9)
            results.append({"name": name, "n": n, "ours": ours, "log": log})
    return results


REFERENCES = {  # name: (our function it stands beside, what it is)
    "CoolProp PropsSI, saturation T(p)": ("saturation_temperature", "IAPWS-95 equation of state (C++)"),
    "CoolProp PropsSI, saturation p(T)": ("saturation_pressure", "IAPWS-95 equation of state (C++)"),
    "iapws IAPWS97(P=..., x=0).T": ("saturation_temperature", "IF97 state on the saturation line (Python)"),
    "iapws IAPWS97(T=..., x=0).P": ("saturation_pressure", "IF97 state on the saturation line (Python)"),
    "iapws.iapws97._TSat_P": ("saturation_temperature", "the bare IF97 backward equation (Python)"),
    "iapws.iapws97._PSat_T": ("saturation_pressure", "the bare IF97 region-4 equation (Python)"),
    "fluids ATMOSPHERE_1976(z).P": ("pressure_at_elevation", "every property of the 1976 atmosphere (Python)"),
    "ambiance Atmosphere(z).pressure": ("pressure_at_elevation", "every property of the ICAO atmosphere (numpy)"),
    "ambiance, one call with all 1e6 points": ("pressure_at_elevation", "the same, vectorised"),
}
COLUMN = {  # the reference in the table's speed-up column: a library's public call, one point at a time
    "saturation_temperature": "CoolProp PropsSI, saturation T(p)",
    "saturation_pressure": "CoolProp PropsSI, saturation p(T)",
    "pressure_at_elevation": "fluids ATMOSPHERE_1976(z).P",
}


def reference_ns_per_point() -> dict[str, float]:
    """ns per point of each reference, called once per point (but for ambiance's vectorised row)."""
    from ambiance import Atmosphere  # noqa: PLC0415 - installed by the benchmark
    from CoolProp.CoolProp import PropsSI  # noqa: PLC0415 - a test-only dependency
    from fluids.atmosphere import ATMOSPHERE_1976  # noqa: PLC0415
    from iapws import IAPWS97  # noqa: PLC0415
    from iapws.iapws97 import _PSat_T, _TSat_P  # noqa: PLC0415

    p = np.geomspace(1e3, 2e7, 400)
    t = np.linspace(280.0, 640.0, 400)
    z = np.linspace(0.0, 80_000.0, 400)
    cases = {
        "CoolProp PropsSI, saturation T(p)": lambda: [PropsSI("T", "P", v, "Q", 0, "Water") for v in p],
        "CoolProp PropsSI, saturation p(T)": lambda: [PropsSI("P", "T", v, "Q", 0, "Water") for v in t],
        "iapws IAPWS97(P=..., x=0).T": lambda: [IAPWS97(P=v / 1e6, x=0).T for v in p],
        "iapws IAPWS97(T=..., x=0).P": lambda: [IAPWS97(T=v, x=0).P for v in t],
        "iapws.iapws97._TSat_P": lambda: [_TSat_P(v / 1e6) for v in p],
        "iapws.iapws97._PSat_T": lambda: [_PSat_T(v) for v in t],
        "fluids ATMOSPHERE_1976(z).P": lambda: [ATMOSPHERE_1976(v).P for v in z],
        "ambiance Atmosphere(z).pressure": lambda: [Atmosphere(v).pressure for v in z],
    }
    figures = {name: best_seconds(f, 2.0) / 400 * 1e9 for name, f in cases.items()}
    million = np.linspace(0.0, 80_000.0, 1_000_000)
    figures["ambiance, one call with all 1e6 points"] = best_seconds(lambda: Atmosphere(million).pressure) / 1e6 * 1e9
    return figures


def verdicts(rows: list[dict[str, float | str]], reference: dict[str, float] | None, loops: str) -> list[str]:
    """The targets at 1e6 points, one line each: within 5x of numpy.log, and 1,000x the column's reference."""
    lines = [
        f"Targets at 1e6 points, {loops} (within {TARGET_RATIO:g}x of numpy.log; {TARGET_SPEED_UP:,.0f}x the "
        "speed-up column's reference):"
    ]
    for r in (row for row in rows if row["n"] == 1_000_000):
        ratio = float(r["ours"]) / float(r["log"])
        line = f"- {r['name']}: {ratio:.2f}x numpy.log ({'met' if ratio <= TARGET_RATIO else 'not met'})"
        column = COLUMN.get(str(r["name"]).split(",")[0])
        if reference and column:
            speed_up = reference[column] / float(r["ours"])
            line += f"; {speed_up:,.0f}x {column} ({'met' if speed_up >= TARGET_SPEED_UP else 'not met'})"
        lines.append(line)
    return lines


def log_loop() -> str:
    """The loop numpy.log runs for float64 here, e.g. X86_V4 (AVX-512) or X86_V3 (AVX2)."""
    return opt_func_info("log", "float64")["log"]["dd"]["current"]


def main() -> None:
    if sys.argv[1:] == ["--json"]:  # the child run with AVX-512 off: 1e6-point figures only
        print(json.dumps({"loop": log_loop(), "rows": measure((1_000_000,))}))
        return
    reference = reference_ns_per_point()
    rows = [
        "| function | points | ns/point | numpy.log ns/point | ratio to log | reference ns/point | speed-up |",
        "| --- | ---: | ---: | ---: | ---: | ---: | ---: |",
    ]
    native = measure(SIZES)
    for r in native:
        column = COLUMN.get(str(r["name"]).split(",")[0])
        ref = reference[column] if column else None
        rows.append(
            f"| {r['name']} | {r['n']:,} | {r['ours']:.1f} | {r['log']:.1f} | {r['ours'] / r['log']:.2f} | "
            + (f"{ref:,.0f} | {ref / r['ours']:,.0f}x |" if ref else "- | - |")
        )
    ours = {str(r["name"]): float(r["ours"]) for r in native if r["n"] == 1_000_000}
    notes = [
        "",
        f"numpy.log ran its {log_loop()} loop. The speed-up column divides by a library's public call made once "
        "per point, as a caller without this service would: CoolProp for water, the fluids package for the "
        "atmosphere. The references do different amounts of work, so here they all are, beside the function at "
        "1e6 points:",
        "",
        "| reference | what it computes | ns/point | speed-up |",
        "| --- | --- | ---: | ---: |",
        *(
            f"| {name} | {what} | {reference[name]:,.1f} | {reference[name] / ours[function]:,.0f}x {function} |"
            for name, (function, what) in REFERENCES.items()
        ),
        "",
        "The atmosphere computes each layer's points with that layer's printed equation; the shuffled rows "
        "mix layers in every block.",
        "",
        *verdicts(native, reference, "this CPU's loops"),
    ]
    if log_loop() == "X86_V4":
        child = subprocess.run(
            [sys.executable, __file__, "--json"],
            env={**os.environ, **AVX512_OFF},
            check=True,
            capture_output=True,
            text=True,
        )
        portable = json.loads(child.stdout)
        notes += [
            "",
            f"For information, the 1e6-point rows again with numpy's AVX-512 loops off "
            f"({AVX512_OFF['NPY_DISABLE_CPU_FEATURES']!r} in NPY_DISABLE_CPU_FEATURES; numpy.log then runs its "
            f"{portable['loop']} loop), as on an AVX2 machine. This slows numpy.log far more than the service, so "
            "the targets above are judged on this CPU's own loops, not on these:",
            "",
            "| function | ns/point | numpy.log ns/point | ratio to log |",
            "| --- | ---: | ---: | ---: |",
            *(
                f"| {r['name']} | {r['ours']:.1f} | {r['log']:.1f} | {r['ours'] / r['log']:.2f} |"
                for r in portable["rows"]
            ),
        ]
    write_section("physics", f"Measured {machine()}.\n\n" + "\n".join(rows + notes))


if __name__ == "__main__":
    main()
