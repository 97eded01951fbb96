"""Binary interaction parameters for pairs of catalog fluids, loaded from ``data/pairs/<model>.toml``.

Each file keeps the licence notice of the databank it comes from; each entry names its components
(catalog ids), its parameters in the units the file states, its temperature range [K] and its source.
Validated at start-up against the catalog, as the catalog itself is.
"""

from __future__ import annotations

import tomllib
from collections.abc import Mapping
from dataclasses import dataclass
from pathlib import Path
from typing import Any

from marshmallow import Schema, ValidationError, fields, validate, validates_schema

from service.fluids.catalog import Catalog, CatalogError, messages
from service.fluids.fluid import Fluid

PAIR_DIR = Path(__file__).with_name("data") / "pairs"
CALORIE = 4.184
"""The thermochemical calorie [J] (NIST SP 811): DECHEMA's NRTL energies are in cal/mol."""
GAS_CONSTANT = 8.314462618
"""The molar gas constant R [J/(mol K)] (CODATA 2018, exact)."""


@dataclass(frozen=True)
class NrtlPair:
    """NRTL parameters of a pair (i, j): tau_ij = b_ij / T, tau_ji = b_ji / T [K], one alpha; stated range [K]."""

    components: tuple[str, str]
    b_ij: float
    b_ji: float
    alpha: float
    t_min: float
    t_max: float
    source: str


class _NrtlEntry(Schema):
    components = fields.List(fields.String(), required=True, validate=validate.Length(equal=2))
    A12 = fields.Float(required=True)
    A21 = fields.Float(required=True)
    alpha = fields.Float(required=True, validate=validate.Range(min=0.0, min_inclusive=False))
    t_min = fields.Float(required=True, validate=validate.Range(min=0.0, min_inclusive=False))
    t_max = fields.Float(required=True)
    source = fields.String(required=True, validate=validate.Length(min=10))

    @validates_schema
    def _checks(self, data: dict[str, Any], **_: Any) -> None:
        if data["t_min"] >= data["t_max"]:
            raise ValidationError("t_min must be below t_max", "t_max")
        if data["components"][0] == data["components"][1]:
            raise ValidationError("a pair has two different components", "components")


def _nrtl_pair(entry: Mapping[str, Any]) -> NrtlPair:
    """A validated entry in SI: b = A [cal/mol] x 4.184 J/cal / R."""
    scale = CALORIE / GAS_CONSTANT
    first, second = entry["components"]
    return NrtlPair(
        (first, second),
        entry["A12"] * scale,
        entry["A21"] * scale,
        entry["alpha"],
        entry["t_min"],
        entry["t_max"],
        entry["source"],
    )


def load_nrtl_pairs(catalog: Catalog[Fluid], path: Path = PAIR_DIR / "nrtl.toml") -> dict[frozenset[str], NrtlPair]:
    """The NRTL pairs by their two catalog ids; raise :class:`CatalogError` naming what is wrong."""
    try:
        entries = tomllib.loads(path.read_text(encoding="utf-8")).get("pair", [])
    except (OSError, UnicodeDecodeError, tomllib.TOMLDecodeError) as exc:
        raise CatalogError(f"{path}: cannot read pair file: {exc}") from exc
    pairs: dict[frozenset[str], NrtlPair] = {}
    for number, raw in enumerate(entries, start=1):
        label = f"{path}: pair {number}"
        try:
            pair = _nrtl_pair(_NrtlEntry().load(raw))
        except ValidationError as exc:
            raise CatalogError(f"{label}: {' | '.join(messages(exc.normalized_messages()))}") from exc
        unknown = [c for c in pair.components if c not in catalog.entries]
        if unknown:
            raise CatalogError(f"{label}: {', '.join(unknown)} not in the catalog")
        key = frozenset(pair.components)
        if key in pairs:
            raise CatalogError(f"{label}: {' and '.join(pair.components)} given twice")
        pairs[key] = pair
    return pairs
