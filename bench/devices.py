"""Speed devices against the plain forms they replace, in one run, on the same inputs.

The project keeps a speed device only where a benchmark shows its gain. Each device is timed
beside the plain form it replaces, alternately (device, plain, device, plain, ...), and each
pair is first checked to give the same results (np.allclose, or identical text):

1. The Wagner series by Horner's rule in sqrt(tau) (``_GappedPolynomial``, ``_power_plan`` in
   service/physics/vapor_pressure.py) against ``sum(a * np.power(tau, e))`` and its derivative:
   the plain branch of ``Wagner._series``, reached through a subclass that declines the polynomial.
2. CSV number rows cut from orjson's output (``_number_rows`` in service/api/rendering.py) against
   ``",".join(map(repr, row))`` over ``table.tolist()``.
3. ``FieldLoader(path.fields["query"])`` (service/api/field_loader.py) against marshmallow's
   ``path.query_schema().load``, the schema built from the same fields, for a computing path.
4. ``in_blocks`` (service/physics/array_blocks.py) against calling the function on the whole array.
5. ``any_of(mask)`` (service/fluids/limits.py), which answers a numpy scalar without a reduction,
   against ``bool(np.any(mask))``.

Beside the functions, each device is timed where callers feel it: whole requests through
Flask's test client in this process, with the device swapped for its plain form at run time
(no file is changed; a spy first proves that the swap reaches the request). Those rows leave
out gunicorn's socket work, so the share of a request that a device saves is an upper bound
of what a client sees.

Times are the best of alternating batches (time.perf_counter, batches of about 5 ms).

    python bench/devices.py      (or: make bench-devices)
"""

from __future__ import annotations

import contextlib
import dataclasses
import itertools
import logging
import math
import os
import sys
import time
from collections.abc import Callable, Iterator
from functools import partial
from pathlib import Path
from typing import Any

import numpy as np
import orjson
from marshmallow import Schema

sys.path.insert(0, str(Path(__file__).resolve().parents[1]))

from bench.common import machine, write_section
from service import create_app
from service.api import rendering
from service.api.computing_path import COMPUTING_PATHS, ComputingPath
from service.api.field_loader import FieldLoader
from service.fluids import limits, questions
from service.physics import array_blocks, water
from service.physics.inverse_table import InverseTable
from service.physics.vapor_pressure import Wagner

BATCH_SECONDS = 0.005
BUDGET_SECONDS = 0.3
REQUEST_BUDGET_SECONDS = 1.5

WAGNER, CSV_ROWS, LOADER, BLOCKS, ANY_OF = (
    "Wagner series by Horner in sqrt(tau)",
    "CSV rows from orjson",
    "FieldLoader",
    "in_blocks",
    "any_of",
)


# --- timing and checks ----------------------------------------------------------------------------


def pair(
    device: Callable[[], object],
    plain: Callable[[], object],
    budget: float = BUDGET_SECONDS,
    plain_in: Callable[[], contextlib.AbstractContextManager[object]] = contextlib.nullcontext,
) -> list[float]:
    """Seconds per call of ``device`` and of ``plain`` (run inside ``plain_in()``): the best of alternating
    batches within ``budget``, at least three of each."""
    device()
    with plain_in():
        plain()  # warm-up: caches, tables, first-call imports
    t0 = time.perf_counter()
    device()
    loops = max(1, int(BATCH_SECONDS / max(time.perf_counter() - t0, 1e-9)))
    best = [math.inf, math.inf]
    start, rounds = time.perf_counter(), 0
    while rounds < 3 or (time.perf_counter() - start < budget and rounds < 500):
        for i, (func, context) in enumerate(((device, contextlib.nullcontext), (plain, plain_in))):
            with context():
                t0 = time.perf_counter()
                for _ in range(loops):
                    func()
                best[i] = min(best[i], (time.perf_counter() - t0) / loops)
        rounds += 1
    return best


ROWS: list[dict[str, Any]] = []


def row(device: str, call: str, points: int | str, times: list[float], request: bool = False) -> None:
    ROWS.append(
        {
            "device": device,
            "call": call,
            "points": points,
            "device_s": times[0],
            "plain_s": times[1],
            "request": request,
        }
    )
    print(f"  {call} [{points}]: device {_time(times[0], points)}, plain {_time(times[1], points)}", flush=True)


def _time(seconds: float, points: int | str) -> str:
    text = f"{seconds * 1e6:,.1f} us" if seconds < 1e-3 else f"{seconds * 1e3:,.2f} ms"
    if isinstance(points, int) and points >= 1000:
        text += f" ({seconds / points * 1e9:,.1f} ns/pt)"
    return text


def close(a: Any, b: Any, rtol: float = 1e-10, atol: float | None = None) -> None:
    """np.allclose for a result or a tuple of results; ``atol`` by default ``rtol`` times the largest magnitude,
    so that values crossing zero (ln p near 1 Pa) compare on the scale of the whole result."""
    for x, y in zip(a if isinstance(a, tuple) else (a,), b if isinstance(b, tuple) else (b,), strict=True):
        tolerance = rtol * float(np.max(np.abs(y))) if atol is None else atol
        difference = float(np.max(np.abs(np.subtract(x, y)))) if np.size(y) else 0.0
        assert np.shape(x) == np.shape(y), (np.shape(x), np.shape(y))
        assert np.allclose(x, y, rtol=rtol, atol=tolerance), f"largest difference {difference:g}"


def same(a: Any, b: Any) -> bool:
    """Equal values, arrays element by element, as loaded request data holds them."""
    if isinstance(a, np.ndarray) or isinstance(b, np.ndarray):
        return type(a) is type(b) and a.dtype == b.dtype and np.array_equal(a, b)
    if dataclasses.is_dataclass(a) and not isinstance(a, type):
        return type(a) is type(b) and all(same(getattr(a, f.name), getattr(b, f.name)) for f in dataclasses.fields(a))
    if isinstance(a, dict):
        return isinstance(b, dict) and set(a) == set(b) and all(same(a[k], b[k]) for k in a)
    if isinstance(a, list | tuple):
        return type(a) is type(b) and len(a) == len(b) and all(map(same, a, b))
    return bool(a == b)


@contextlib.contextmanager
def swapped(owner: Any, name: str, value: Any) -> Iterator[None]:
    """``owner.name`` (or ``owner[name]`` for a dict) set to ``value`` for the block, then restored."""
    get, put = (
        (owner.__getitem__, owner.__setitem__)
        if isinstance(owner, dict)
        else (
            lambda n: getattr(owner, n),
            lambda n, v: setattr(owner, n, v),
        )
    )
    old = get(name)
    put(name, value)
    try:
        yield
    finally:
        put(name, old)


def calls_of(owners: tuple[Any, ...], name: str, action: Callable[[], object]) -> list[int]:
    """How often ``action`` calls ``owner.name``, for each of ``owners``: proof that a swap reaches the request."""
    counts = [0] * len(owners)

    def spy(i: int, inner: Callable[..., Any]) -> Callable[..., Any]:
        def counted(*args: Any, **kwargs: Any) -> Any:
            counts[i] += 1
            return inner(*args, **kwargs)

        return counted

    with contextlib.ExitStack() as stack:
        for i, owner in enumerate(owners):
            stack.enter_context(swapped(owner, name, spy(i, getattr(owner, name))))
        action()
    return counts


def numbers(content: bytes) -> list[float]:
    """The numbers of a JSON answer in order, for np.allclose."""
    out: list[float] = []

    def walk(value: Any) -> None:
        if isinstance(value, dict | list):
            for item in value.values() if isinstance(value, dict) else value:
                walk(item)
        elif isinstance(value, int | float) and not isinstance(value, bool):
            out.append(float(value))

    walk(orjson.loads(content))
    return out


# --- the application, for the request rows --------------------------------------------------------


class Service:
    """The app in this process; its access log is written, as in production, but to /dev/null."""

    def __init__(self) -> None:
        self.app = create_app()
        self._devnull = open(os.devnull, "w")  # noqa: SIM115 - kept for the life of the run
        for handler in logging.getLogger("service").handlers:
            if isinstance(handler, logging.StreamHandler):
                handler.setStream(self._devnull)
        self.client = self.app.test_client()
        self._k = itertools.count()

    def get(self, template: str) -> Callable[..., bytes]:
        """A GET whose every call is new: ``{x}`` becomes decimals .000000, .000001, ... (``10{x}`` as
        bench/throughput.py's 10 + k / 1e6), or .5 when ``fixed``, to compare two forms' answers."""

        def call(fixed: bool = False) -> bytes:
            x = ".5" if fixed else f".{next(self._k):06d}"
            response = self.client.get(template.replace("{x}", x))
            assert response.status_code == 200, response.data[:300]
            return response.data

        return call

    def post(self, path: str, body: bytes, content_type: str = "application/json") -> Callable[..., bytes]:
        def call(fixed: bool = False) -> bytes:  # a POST is never cached: nothing to fix
            response = self.client.post(path, data=body, content_type=content_type)
            assert response.status_code == 200, response.data[:300]
            return response.data

        return call

    def same_answer(
        self,
        request: Callable[..., bytes],
        plain_in: Callable[[], contextlib.AbstractContextManager[object]],
        exact: bool = False,
    ) -> None:
        """Check that ``request`` answers alike with the device and with the plain form (no answer cache)."""
        answers = self.app.extensions["answers"]
        with swapped(self.app.extensions, "answers", type(answers)(0)):
            with plain_in():
                plain = request(True)
            device = request(True)
        if exact:
            assert device == plain, "the answers differ"
        else:
            close(np.array(numbers(device)), np.array(numbers(plain)), rtol=1e-9)

    @property
    def catalog(self) -> Any:
        return self.app.extensions["catalog"]

    def request_row(
        self,
        device: str,
        call: str,
        n: int,
        request: Callable[..., bytes],
        plain_in: Callable[[], contextlib.AbstractContextManager[object]],
        exact: bool = False,
    ) -> None:
        """A request's row: checked to answer alike both ways, then timed with the device and with ``plain_in``."""
        self.same_answer(request, plain_in, exact)
        row(device, f"request: {call}", n, pair(request, request, REQUEST_BUDGET_SECONDS, plain_in), True)


def computing_path(path: str) -> ComputingPath:
    """The computing path registered at ``path`` (create_app registers them)."""
    return next(p for p in COMPUTING_PATHS if p.path == path)


def points(n: int, low: float, high: float, spacing: Callable[..., np.ndarray] = np.linspace) -> Any:
    """``n`` points from ``low`` to ``high``; one point is a numpy scalar, as a request's single value is."""
    return np.float64(spacing(low, high, 3)[1]) if n == 1 else spacing(low, high, n)


# --- 1. Wagner ------------------------------------------------------------------------------------


class _Plain:
    """Mixin: decline the polynomial in sqrt(tau), so that ``_series`` takes its sum of powers."""

    @property
    def _in_sqrt_tau(self) -> None:
        return None


def plain_wagner(equation: Wagner) -> Wagner:
    """The same equation, and class (water keeps its IF97 first guess), evaluated by powers."""
    cls = type(f"Plain{type(equation).__name__}", (_Plain, type(equation)), {})
    return cls(**{f.name: getattr(equation, f.name) for f in dataclasses.fields(equation)})


def bench_wagner(service: Service) -> None:
    fluids = {"water (1, 1.5, 3, 3.5, 4, 7.5)": "water", "methanol (2.5-5 set)": "methanol"}
    for label, fluid_id in fluids.items():
        fluid = service.catalog.get(fluid_id)
        fast, slow = fluid.equation, plain_wagner(fluid.equation)
        assert fast._in_sqrt_tau is not None and slow._in_sqrt_tau is None
        low, high = fluid.temperature_limits
        for n in (1, 1_000, 100_000, 1_000_000):
            t = points(n, low + 0.5, high - 0.5)
            for name in ("ln_pressure_and_slope", "pressure"):
                f, g = getattr(fast, name), getattr(slow, name)
                close(f(t), g(t))
                row(WAGNER, f"{label}: {name}", n, pair(partial(f, t), partial(g, t)))
        plain_fluid = dataclasses.replace(fluid, equation=slow)
        p_low, p_high = fluid.pressure_limits
        for n in (1, 100_000):
            t = points(n, low + 0.5, high - 0.5)
            p = points(n, p_low * 1.01, p_high * 0.99, np.geomspace)
            for name, x in (("saturation_pressure_slope", t), ("saturation_temperature", p)):
                f, g = getattr(fluid, name), getattr(plain_fluid, name)
                close(f(x), g(x), rtol=1e-12)
                call = f"{label}: catalog fluid, {name}" + (" (from its table)" if "temperature" in name else "")
                row(WAGNER, call, n, pair(partial(f, x), partial(g, x)))
            # A fluid defined in a request is not tabulated: its boiling points run the Newton iteration.
            f, g = fast.temperature, slow.temperature
            close(f(p, low, high), g(p, low, high), rtol=1e-12)
            call = f"{label}: a request's own fluid, saturation temperature (Newton)"
            row(WAGNER, call, n, pair(partial(f, p, low, high), partial(g, p, low, high)))
        row(
            WAGNER,
            f"{label}: build the saturation-temperature table (once, at start-up)",
            "4,097 nodes",
            pair(partial(InverseTable, fast, low, high), partial(InverseTable, slow, low, high)),
        )

    # In whole requests the plain form goes in at the class: a property outranks the instances' cached
    # polynomials, so every Wagner equation (the catalog's, and one a request defines) sums powers.
    body = orjson.dumps({"pressure": np.geomspace(1.0, 20_000.0, 100_000)}, option=orjson.OPT_SERIALIZE_NUMPY)
    own = {  # methanol's coefficients as a caller would send them: a fluid the request defines
        "equation": "wagner",
        "coefficients": [-8.72963, 1.4586, -2.78449, -0.70669],
        "exponents": [1.0, 1.5, 2.5, 5.0],
        "critical_temperature": 513.38,
        "critical_pressure": 8216.0,
        "t_min": 175.45,
        "t_max": 513.38,
        "temperature_unit": "K",
        "pressure_unit": "kPa",
    }
    own_body = orjson.dumps(
        {"fluid": own, "pressure": np.geomspace(1.0, 8_000.0, 100_000)}, option=orjson.OPT_SERIALIZE_NUMPY
    )
    requests = (
        ("GET /v1/boiling-point, water, gauge + elevation", 1, "/v1/boiling-point?gauge_pressure=10{x}&elevation=1420"),
        ("GET /v1/vapor-pressure, water", 1, "/v1/vapor-pressure?temperature=10{x}"),
        ("POST /v1/boiling-point, water, JSON", 100_000, body),
        ("POST /v1/boiling-point, a request's own Wagner fluid, JSON", 100_000, own_body),
    )
    for call, n, what in requests:
        request = service.get(what) if isinstance(what, str) else service.post("/v1/boiling-point", what)
        reached = itertools.count()
        with swapped(Wagner, "_in_sqrt_tau", property(lambda _, reached=reached: (next(reached), None)[1])):
            request()
        assert next(reached), "the plain form is not reached"
        service.request_row(WAGNER, call, n, request, plain_wagner_everywhere)


def plain_wagner_everywhere() -> contextlib.AbstractContextManager[None]:
    """Every Wagner equation evaluated by powers, for the block."""
    return swapped(Wagner, "_in_sqrt_tau", property(lambda _: None))


# --- 2. CSV rows ----------------------------------------------------------------------------------


def plain_number_rows(columns: list[np.ndarray]) -> list[str]:
    """The plain form: Python's repr of each number (its shortest round-trip form), joined by commas."""
    return [",".join(map(repr, line)) for line in np.column_stack(columns).tolist()]


def csv_columns(n: int) -> list[np.ndarray]:
    """Five columns as a boiling-point answer has them: pressures, boiling points, sensitivities, and so on."""
    p = np.geomspace(1.0, 20_000.0, n)  # kPa
    t = water.saturation_temperature(p * 1e3)
    sensitivity = 1e3 / water.saturation_pressure_slope(t)  # K/kPa
    return [p, t - 273.15, sensitivity, np.linspace(0.0, 3_000.0, n), 0.5 * sensitivity]


def bench_csv(service: Service) -> None:
    for n in (1_000, 100_000):
        columns = csv_columns(n)
        assert rendering._number_rows(columns) == plain_number_rows(columns), "the texts differ"
        row(
            CSV_ROWS,
            "_number_rows, 5 columns",
            n,
            pair(partial(rendering._number_rows, columns), partial(plain_number_rows, columns)),
        )
    columns = csv_columns(100_000)
    names = ("pressure", "boiling_point", "sensitivity", "elevation", "boiling_point_uncertainty")
    units = ("kPa", "degC", "degC/kPa", "m", "degC")
    answer = {
        "fluid": "water",
        **{name: {"value": c, "unit": u} for name, c, u in zip(names, columns, units, strict=True)},
        "warnings": [],
    }

    def plain_in() -> contextlib.AbstractContextManager[None]:
        return swapped(rendering, "_number_rows", plain_number_rows)

    whole = partial(rendering.as_csv, answer, (100_000,))
    text = whole()
    with plain_in():
        assert whole() == text, "the CSV answers differ"
    row(CSV_ROWS, "as_csv, a whole 5-column answer", 100_000, pair(whole, whole, plain_in=plain_in))
    body = b"pressure\n" + b"\n".join(repr(v).encode() for v in np.geomspace(1.0, 20_000.0, 100_000).tolist())
    request = service.post("/v1/boiling-point?format=csv", body, "text/csv")
    with plain_in():
        assert all(calls_of((rendering,), "_number_rows", request)), "_number_rows is not reached through rendering"
    service.request_row(CSV_ROWS, "POST /v1/boiling-point, CSV", 100_000, request, plain_in, exact=True)
    # For the record: where the two forms part (orjson 0.00001 and 1e+16, Python 1e-05 and 1e+16).
    wide = np.geomspace(1e-9, 1e18, 1_000)
    texts = zip(rendering._number_rows([wide]), plain_number_rows([wide]), strict=True)
    differ = [float(v) for v, (a, b) in zip(wide, texts, strict=True) if a != b]
    NOTES.append(
        "CSV: the texts are identical for the answers above. Over 1,000 numbers from 1e-9 to 1e18 they differ in "
        f"{len(differ)}, from {min(differ):.3g} to {max(differ):.3g}: below 1e-4 orjson writes 0.00001 where repr "
        "writes 1e-05, and 1.5e-7 for 1.5e-07 (both parse back to the same double)."
        if differ
        else "CSV: the texts are identical, also over 1,000 numbers from 1e-9 to 1e18."
    )


NOTES: list[str] = []


# --- 3. FieldLoader -------------------------------------------------------------------------------


class SchemaLoader:
    """marshmallow's own ``Schema.load``, in the place of a FieldLoader."""

    def __init__(self, schema: Schema) -> None:
        self.load = schema.load


def bench_loader(service: Service) -> None:
    path = computing_path("/v1/boiling-point")
    query = {"gauge_pressure": "950", "elevation": "1420", "fluid": "water"}
    body = orjson.loads(
        orjson.dumps(
            {"gauge_pressure": np.linspace(50.0, 500.0, 1_000), "elevation": np.linspace(0.0, 3_000.0, 1_000)},
            option=orjson.OPT_SERIALIZE_NUMPY,
        )
    )
    body["fluid"] = "water"
    for kind, schema, data in (
        ("query", path.query_schema(), query),
        ("body", path.body_schema(), body),
    ):
        loader = FieldLoader(path.fields[kind])
        assert same(loader.load(data), schema.load(data)), f"the {kind} loads differ"
        what = "3 fields" if kind == "query" else "3 fields, two arrays of 1,000"
        n = 1 if kind == "query" else 1_000
        row(
            LOADER,
            f"{kind} schema of /v1/boiling-point, {what}",
            n,
            pair(partial(loader.load, data), partial(schema.load, data)),
        )
    plain = {**path._loaders, "query": SchemaLoader(path.query_schema()), "body": SchemaLoader(path.body_schema())}

    def plain_in() -> contextlib.AbstractContextManager[None]:
        return swapped(path, "_loaders", plain)

    request = service.get("/v1/boiling-point?gauge_pressure=10{x}&elevation=1420")
    with plain_in():
        assert all(calls_of((plain["query"],), "load", request)), "the request does not load through _loaders"
    service.request_row(LOADER, "GET /v1/boiling-point, gauge + elevation", 1, request, plain_in, exact=True)


# --- 4. in_blocks ---------------------------------------------------------------------------------


def bench_blocks(service: Service) -> None:
    equation = water.SATURATION
    for n in (100_000, 1_000_000, 10_000_000):
        t = np.linspace(274.0, 646.0, n)
        assert np.array_equal(equation.pressure(t), equation._pressure(t)), "blocked and whole differ"
        budget = 2.0 if n >= 10_000_000 else BUDGET_SECONDS
        row(
            BLOCKS,
            "Wagner pressure (water)",
            n,
            pair(lambda t=t: equation.pressure(t), lambda t=t: equation._pressure(t), budget),
        )
    # The whole service without blocks: a block larger than any request makes in_blocks a pass-through.
    body = orjson.dumps({"pressure": np.geomspace(1.0, 20_000.0, 100_000)}, option=orjson.OPT_SERIALIZE_NUMPY)
    request = service.post("/v1/boiling-point", body)

    def plain_in() -> contextlib.AbstractContextManager[None]:
        return swapped(array_blocks, "BLOCK", 1 << 62)

    service.request_row(BLOCKS, "POST /v1/boiling-point, JSON", 100_000, request, plain_in, exact=True)


# --- 5. any_of ------------------------------------------------------------------------------------


def plain_any_of(mask: Any) -> bool:
    """The plain form: numpy's reduction, on an array and on a single value alike."""
    return bool(np.any(mask))


@contextlib.contextmanager
def plain_any_of_everywhere() -> Iterator[None]:
    """The plain form wherever the domain asks: the limits module and the questions module, which imports it."""
    with swapped(limits, "any_of", plain_any_of), swapped(questions, "any_of", plain_any_of):
        yield


def bench_any_of(service: Service) -> None:
    masks = {  # a check that passes, as nearly every request's does: nothing is out of range
        "a numpy scalar bool (one value's check)": np.float64(1420.0) < -5_000.0,
        "an array of 1,000 bools, none true": np.linspace(0.0, 3_000.0, 1_000) < -5_000.0,
    }
    for label, mask in masks.items():
        assert limits.any_of(mask) is plain_any_of(mask) is False
        row(ANY_OF, label, np.size(mask), pair(partial(limits.any_of, mask), partial(plain_any_of, mask)))
    requests = {
        "GET /v1/boiling-point, water, gauge + elevation": "/v1/boiling-point?fluid=water&gauge_pressure=950{x}"
        "&elevation=1420",
        "GET /v1/saturation-margin, ethanol, gauge + elevation": "/v1/saturation-margin?fluid=ethanol"
        "&temperature=48{x}&gauge_pressure=-55&elevation=1420",
    }
    for call, template in requests.items():
        request = service.get(template)
        with plain_any_of_everywhere():
            counts = calls_of((limits, questions), "any_of", request)
        assert all(counts), f"{call}: the plain any_of is not reached through both modules ({counts})"
        NOTES.append(f"any_of: {call} calls it {sum(counts)} times (limits {counts[0]}, questions {counts[1]}).")
        service.request_row(ANY_OF, call, 1, request, plain_any_of_everywhere, exact=True)


# --- report ---------------------------------------------------------------------------------------


def table() -> list[str]:
    lines = [
        "| device | call | points | device | plain | plain / device | saved per call |",
        "| --- | --- | ---: | ---: | ---: | ---: | ---: |",
    ]
    for r in ROWS:
        saved = r["plain_s"] - r["device_s"]
        share = f" ({saved / r['plain_s']:.1%} of the request)" if r["request"] else ""
        n = r["points"]
        lines.append(
            f"| {r['device']} | {r['call']} | {n:,} | "
            if isinstance(n, int)
            else f"| {r['device']} | {r['call']} | {n} | "
        )
        lines[-1] += (
            f"{_time(r['device_s'], n)} | {_time(r['plain_s'], n)} | {r['plain_s'] / r['device_s']:.2f} | "
            f"{_signed(saved)}{share} |"
        )
    return lines


def _signed(seconds: float) -> str:
    sign = "-" if seconds < 0 else ""
    return sign + _time(abs(seconds), 1)


def verdicts() -> list[str]:
    """Per device: the share of each request it saves, beside its gain on the functions alone."""
    lines = ["Per device, the share of a request it saves (the decisions below weigh it against run-to-run noise):"]
    for device in dict.fromkeys(r["device"] for r in ROWS):
        requests = [r for r in ROWS if r["device"] == device and r["request"]]
        gains = {r["call"].removeprefix("request: "): 1 - r["device_s"] / r["plain_s"] for r in requests}
        functions = [r["plain_s"] / r["device_s"] for r in ROWS if r["device"] == device and not r["request"]]
        lines.append(
            f"- {device}: {'; '.join(f'{call} {gain:.1%}' for call, gain in gains.items()) or 'no request row'} "
            f"(functions alone: {min(functions):.2f}x to {max(functions):.2f}x)."
        )
    return lines


def main() -> None:
    start = time.perf_counter()
    service = Service()
    for section in (bench_wagner, bench_csv, bench_loader, bench_blocks, bench_any_of):
        print(section.__name__, flush=True)
        section(service)
    elapsed = time.perf_counter() - start
    notes = [
        "",
        *verdicts(),
        "",
        *NOTES,
        "",
        "Device and plain form alternate in batches of about 5 ms, best batch of each; every pair checked first to "
        "give the same results (np.allclose; identical text for CSV; equal loaded values for the loaders). The plain "
        "forms: Wagner's own sum of powers (a subclass declines the polynomial); repr joined by commas; "
        "Schema.load on Schema.from_dict of the same fields; the function over the whole array; bool(np.any(mask)). "
        "Request rows go through Flask's test client in this process with the device swapped out at run time (the "
        "Wagner class's polynomial, rendering's _number_rows, the computing path's loaders, the block size, "
        "any_of in service.fluids.limits and service.fluids.questions), each swap but the block size's first "
        "proved to reach the request; they leave out gunicorn's socket work (most of what the HTTP section's "
        f"worker CPU for /healthz measures), so their shares are upper bounds. Whole run {elapsed:.0f} s.",
    ]
    write_section("devices", f"Measured {machine()}.\n\n" + "\n".join(table() + notes))


if __name__ == "__main__":
    main()
