"""Binary interaction parameters for pairs of catalog fluids, loaded from ``data/pairs/<model>.toml``.

One file per activity model (NRTL, Wilson, UNIQUAC). Each keeps the licence notice of the databank it comes
from; each entry names its components (catalog ids), its energies A12 and A21 [cal/mol] and the model's other
parameters, its temperature range [K] and its source. UNIQUAC's file also gives each component's volume r and
area q, from the same databank as its pairs. Validated at start-up against the catalog, as the catalog itself is.
"""

from __future__ import annotations

import tomllib
from collections.abc import Callable, Mapping, Sequence
from dataclasses import dataclass, field
from pathlib import Path
from typing import Any, Literal

import numpy as np
from marshmallow import Schema, ValidationError, fields, validate, validates_schema

from service.fluids.catalog import Catalog, CatalogError, entry_error
from service.fluids.fluid import Fluid
from service.physics.activity.nrtl import Nrtl
from service.physics.activity.uniquac import Uniquac
from service.physics.activity.wilson import Wilson

PAIR_DIR = Path(__file__).with_name("data") / "pairs"
CALORIE = 4.184
"""The thermochemical calorie [J] (NIST SP 811): the databank's energies are in cal/mol."""
GAS_CONSTANT = 8.314462618
"""The molar gas constant R [J/(mol K)] (CODATA 2018, exact)."""

PairModel = Literal["nrtl", "wilson", "uniquac"]
Activity = Nrtl | Wilson | Uniquac


@dataclass(frozen=True)
class FittedPair:
    """A pair (1, 2) fitted under one model. ``values`` in SI: b12 and b21 [K], the coefficients of 1/T (NRTL:
    tau_12 = b12 / T; Wilson: Lambda_12 = exp(a12 + b12 / T); UNIQUAC: tau_12 = exp(b12 / T)), and NRTL's alpha
    or Wilson's a12 and a21 = ln of the ratio of the liquids' molar volumes; the stated range [K]."""

    model: PairModel
    components: tuple[str, str]
    values: Mapping[str, float]
    t_min: float
    t_max: float
    source: str


@dataclass(frozen=True)
class PairSet:
    """One model's pairs by their two catalog ids and, for UNIQUAC, each component's (r, q) and their source."""

    model: PairModel
    method: str
    pairs: dict[frozenset[str], FittedPair]
    sizes: dict[str, tuple[float, float]] = field(default_factory=dict)
    sizes_source: str = ""

    def activity(self, ids: Sequence[str]) -> Activity:
        """The model of the components ``ids`` (in order) from their pairs, every one of which is in the set."""
        n = len(ids)
        a, b, alpha = np.zeros((n, n)), np.zeros((n, n)), np.zeros((n, n))
        for i, first in enumerate(ids):
            for j in range(i + 1, n):
                pair = self.pairs[frozenset((first, ids[j]))]
                ij, ji = ((i, j), (j, i)) if pair.components[0] == first else ((j, i), (i, j))
                b[ij], b[ji] = pair.values["b12"], pair.values["b21"]
                a[ij], a[ji] = pair.values.get("a12", 0.0), pair.values.get("a21", 0.0)
                alpha[ij] = alpha[ji] = pair.values.get("alpha", 0.0)
        if self.model == "nrtl":
            return Nrtl(a, b, alpha)
        if self.model == "wilson":
            return Wilson(a, b)
        r, q = (np.array(v) for v in zip(*(self.sizes[i] for i in ids), strict=True))
        return Uniquac(r, q, a, b)


class _Pair(Schema):
    components = fields.List(fields.String(), required=True, validate=validate.Length(equal=2))
    A12 = fields.Float(required=True)
    A21 = fields.Float(required=True)
    t_min = fields.Float(required=True, validate=validate.Range(min=0.0, min_inclusive=False))
    t_max = fields.Float(required=True)
    source = fields.String(required=True, validate=validate.Length(min=10))

    @validates_schema
    def _checks(self, data: dict[str, Any], **_: Any) -> None:
        if data["t_min"] >= data["t_max"]:
            raise ValidationError("t_min must be below t_max", "t_max")
        if data["components"][0] == data["components"][1]:
            raise ValidationError("a pair has two different components", "components")


class _NrtlPair(_Pair):
    alpha = fields.Float(required=True, validate=validate.Range(min=0.0, min_inclusive=False))


class _WilsonPair(_Pair):
    log_volume_ratio = fields.Float(required=True, validate=validate.Range(min=-10.0, max=10.0))


class _Size(Schema):
    id = fields.String(required=True)
    r = fields.Float(required=True, validate=validate.Range(min=0.0, min_inclusive=False))
    q = fields.Float(required=True, validate=validate.Range(min=0.0, min_inclusive=False))


_SCALE = CALORIE / GAS_CONSTANT
"""From an energy A [cal/mol] to A / R [K]."""


def _nrtl(entry: Mapping[str, Any]) -> dict[str, float]:
    """tau_ij = A_ij / (R T) (Renon and Prausnitz 1968, DECHEMA's form)."""
    return {"b12": entry["A12"] * _SCALE, "b21": entry["A21"] * _SCALE, "alpha": entry["alpha"]}


def _wilson(entry: Mapping[str, Any]) -> dict[str, float]:
    """Lambda_12 = (V2 / V1) exp(-A12 / (R T)), Lambda_21 = (V1 / V2) exp(-A21 / (R T)) (Wilson 1964)."""
    ratio = entry["log_volume_ratio"]
    return {"a12": ratio, "a21": -ratio, "b12": -entry["A12"] * _SCALE, "b21": -entry["A21"] * _SCALE}


def _uniquac(entry: Mapping[str, Any]) -> dict[str, float]:
    """tau_ij = exp(-A_ij / (R T)) (Abrams and Prausnitz 1975)."""
    return {"b12": -entry["A12"] * _SCALE, "b21": -entry["A21"] * _SCALE}


_FORMS: dict[PairModel, tuple[str, type[_Pair], Callable[[Mapping[str, Any]], dict[str, float]]]] = {
    "nrtl": ("NRTL (Renon and Prausnitz 1968)", _NrtlPair, _nrtl),
    "wilson": ("Wilson (1964)", _WilsonPair, _wilson),
    "uniquac": ("UNIQUAC (Abrams and Prausnitz 1975)", _Pair, _uniquac),
}


def load_pair_sets(catalog: Catalog[Fluid], directory: Path = PAIR_DIR) -> dict[PairModel, PairSet]:
    """Every model's pairs; raise :class:`CatalogError` naming the file, the entry and what is wrong."""
    return {model: load_pair_set(catalog, model, directory / f"{model}.toml") for model in _FORMS}


def load_pair_set(catalog: Catalog[Fluid], model: PairModel, path: Path) -> PairSet:
    """The pairs of one ``model`` from ``path``."""
    try:
        document = tomllib.loads(path.read_text(encoding="utf-8"))
    except (OSError, UnicodeDecodeError, tomllib.TOMLDecodeError) as exc:
        raise CatalogError(f"{path}: cannot read pair file: {exc}") from exc
    method, schema, convert = _FORMS[model]
    sizes = {}
    for number, raw in enumerate(document.get("component", []), start=1):
        size = _valid(_Size(), raw, f"{path}: component {number}")
        if size["id"] not in catalog.entries:
            raise CatalogError(f"{path}: component {number}: {size['id']} not in the catalog")
        sizes[size["id"]] = (size["r"], size["q"])
    pairs: dict[frozenset[str], FittedPair] = {}
    for number, raw in enumerate(document.get("pair", []), start=1):
        label = f"{path}: pair {number}"
        entry = _valid(schema(), raw, label)
        first, second = entry["components"]
        pair = FittedPair(model, (first, second), convert(entry), entry["t_min"], entry["t_max"], entry["source"])
        unknown = [c for c in pair.components if c not in catalog.entries]
        if unknown:
            raise CatalogError(f"{label}: {', '.join(unknown)} not in the catalog")
        if model == "uniquac" and not all(c in sizes for c in pair.components):
            raise CatalogError(f"{label}: UNIQUAC needs r and q of both components ([[component]] entries)")
        key = frozenset(pair.components)
        if key in pairs:
            raise CatalogError(f"{label}: {' and '.join(pair.components)} given twice")
        pairs[key] = pair
    if sizes and not document.get("sizes_source"):
        raise CatalogError(f"{path}: sizes_source must cite where the [[component]] r and q come from")
    return PairSet(model, method, pairs, sizes, document.get("sizes_source", ""))


def _valid(schema: Schema, raw: Any, label: str) -> dict[str, Any]:
    try:
        return schema.load(raw)
    except ValidationError as exc:
        raise entry_error(label, exc) from exc
