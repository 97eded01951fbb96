"""The built-in solutes: what dissolves in water, with its water-activity equation, ranges and solubility.

One file per solute in ``data/solutes/*.toml``, validated at start-up as the fluid catalog is.
Numbers are SI: temperature [K], mass fraction of solute [kg/kg], molar mass [kg/mol].
"""

from __future__ import annotations

import tomllib
from dataclasses import dataclass, field
from pathlib import Path
from typing import Any

import numpy as np
from marshmallow import Schema, ValidationError, fields, validate, validates, validates_schema
from numpy.typing import ArrayLike, NDArray

from service.fluids.catalog import Catalog, CatalogError, entry_error
from service.fluids.schema import FormTable, cas_check_digit_ok
from service.fluids.solute_forms import (
    SOLUTE_FORMS,
    SOLUTION_DENSITY_FORMS,
    solute_equation_from_entry,
    solution_density_from_entry,
)
from service.physics.solution_density import SolutionDensity
from service.physics.solutions import SoluteEquation

SOLUTE_DIR = Path(__file__).with_name("data") / "solutes"
_FRACTION = validate.Range(min=0.0, max=1.0, min_inclusive=False, max_inclusive=False)


@dataclass(frozen=True)
class Curve:
    """A mass fraction [kg/kg] along temperature [K]: straight between the points, constant beyond them."""

    temperatures: tuple[float, ...]
    fractions: tuple[float, ...]
    source: str

    def at(self, temperature: ArrayLike) -> NDArray[np.float64]:
        """The mass fraction [kg/kg] at ``temperature`` [K]."""
        return np.interp(temperature, self.temperatures, self.fractions)

    @property
    def highest(self) -> float:
        """The largest mass fraction anywhere on the curve [kg/kg]."""
        return max(self.fractions)


@dataclass(frozen=True)
class Density:
    """A solution density correlation with its stated temperature range [K] and citation."""

    equation: SolutionDensity = field(repr=False)
    t_min: float
    t_max: float
    method: str
    source: str


@dataclass(frozen=True)
class Solute:
    """A solute of the built-in list: identity, water-activity equation with its stated temperature range [K],
    the stated concentration range and the solubility along temperature."""

    id: str
    name: str
    formula: str
    cas: str
    aliases: tuple[str, ...]
    molar_mass: float
    brix: bool
    """Whether degrees Brix measure it (sucrose: Brix is its mass percent by definition)."""
    equation: SoluteEquation = field(repr=False)
    t_min: float
    t_max: float
    method: str
    source: str
    stated_max: Curve
    solubility: Curve | None
    notes: tuple[str, ...] = ()
    density: Density | None = None


def _points() -> fields.List:
    """[[temperature K, mass fraction], ...], at least one."""
    temperature = fields.Float(validate=validate.Range(min=0.0, min_inclusive=False))
    return fields.List(fields.Tuple((temperature, fields.Float(validate=_FRACTION))), required=True, validate=_rising)


def _rising(points: list[tuple[float, float]]) -> None:
    temperatures = [t for t, _ in points]
    if not points or temperatures != sorted(temperatures):
        raise ValidationError("at least one point, temperatures not falling")


class _CurveSchema(Schema):
    points = _points()
    source = fields.String(required=True, validate=validate.Length(min=10))


class SoluteEntrySchema(Schema):
    """One solute file's ``[solute]`` table."""

    id = fields.String(required=True, validate=validate.Regexp(r"^[a-z0-9][a-z0-9-]*$"))
    name = fields.String(required=True, validate=validate.Length(min=1))
    formula = fields.String(required=True, validate=validate.Length(min=1))
    cas = fields.String(required=True)
    aliases = fields.List(fields.String(validate=validate.Length(min=1)), load_default=list)
    molar_mass = fields.Float(required=True, validate=validate.Range(min=0.0, min_inclusive=False))
    brix = fields.Boolean(load_default=False)
    notes = fields.List(fields.String(validate=validate.Length(min=10)), load_default=list)
    water_activity = FormTable(SOLUTE_FORMS, unknown="raise", required=True)
    density = FormTable(SOLUTION_DENSITY_FORMS, unknown="raise", load_default=None)
    concentration = fields.Nested(
        Schema.from_dict(
            {
                "stated_max": _points(),
                "source": fields.String(required=True, validate=validate.Length(min=10)),
            }
        ),
        required=True,
    )
    solubility = fields.Nested(_CurveSchema, load_default=None)

    @validates("cas")
    def _cas(self, value: str, **_: Any) -> None:
        if value and not cas_check_digit_ok(value):
            raise ValidationError(f"{value!r} is not a CAS registry number with a valid check digit")

    @validates_schema
    def _range(self, data: dict[str, Any], **_: Any) -> None:
        table = data["water_activity"]
        if table["t_min"] >= table["t_max"]:
            raise ValidationError("t_min must be below t_max", "water_activity")


def _curve(points: list[tuple[float, float]], source: str) -> Curve:
    return Curve(tuple(t for t, _ in points), tuple(w for _, w in points), source)


def solute_from_entry(entry: dict[str, Any]) -> Solute:
    """Turn one validated ``[solute]`` table into a :class:`Solute`."""
    table, stated, solubility = entry["water_activity"], entry["concentration"], entry["solubility"]
    return Solute(
        id=entry["id"],
        name=entry["name"],
        formula=entry["formula"],
        cas=entry["cas"],
        aliases=tuple(entry["aliases"]),
        molar_mass=entry["molar_mass"],
        brix=entry["brix"],
        equation=solute_equation_from_entry(table, entry["molar_mass"]),
        t_min=table["t_min"],
        t_max=table["t_max"],
        method=table["method"],
        source=table["source"],
        stated_max=_curve(stated["stated_max"], stated["source"]),
        solubility=None if solubility is None else _curve(solubility["points"], solubility["source"]),
        notes=tuple(entry["notes"]),
        density=None if entry["density"] is None else _density(entry["density"]),
    )


def _density(table: dict[str, Any]) -> Density:
    equation = solution_density_from_entry(table)
    return Density(equation, table["t_min"], table["t_max"], table["method"], table["source"])


def load_solute_file(path: Path) -> Solute:
    """Read and validate one solute file; raise :class:`CatalogError` naming what is wrong."""
    try:
        document = tomllib.loads(path.read_text(encoding="utf-8"))
        return solute_from_entry(SoluteEntrySchema().load(document.get("solute", {})))
    except (OSError, UnicodeDecodeError, tomllib.TOMLDecodeError) as exc:
        raise CatalogError(f"{path}: cannot read solute file: {exc}") from exc
    except ValidationError as exc:
        raise entry_error(str(path), exc) from exc


def load_solutes(directory: Path = SOLUTE_DIR) -> Catalog[Solute]:
    """The built-in solutes, found by id, name, formula or alias."""
    return Catalog((load_solute_file(path) for path in sorted(directory.glob("*.toml"))), kind="solute")
