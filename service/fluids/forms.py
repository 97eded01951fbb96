"""The equation forms, declared once: what each needs, how it is checked and what it builds.

A catalog table (:mod:`service.fluids.schema`), a fluid a request defines
(:mod:`service.api.fluid_input`, :mod:`service.fluids.caller_defined`) and the OpenAPI document
all read these declarations; adding a form means adding one entry to :data:`VAPOR_PRESSURE_FORMS`
or :data:`DENSITY_FORMS`, with its builder and its test (``tests/fluids/test_forms.py``). The forms of
solutes, built on the same declarations, are in :mod:`service.fluids.solute_forms`.

Tables are SI where the form says nothing else: temperature [K], pressure [Pa], molar mass
[kg/mol], density [kg/m3]. Sources: each builder's physics class in
:mod:`service.physics.vapor_pressure`, :mod:`service.physics.liquid_density` and :mod:`service.physics.water`.
"""

from __future__ import annotations

import json
import math
from collections.abc import Callable, Mapping
from dataclasses import dataclass
from typing import Any, Literal, TypeVar

import numpy as np
from marshmallow import ValidationError, fields, validate
from numpy.typing import ArrayLike, NDArray

from service.fluids.boiling import LiquidDensity
from service.physics import water
from service.physics.liquid_density import Dippr105
from service.physics.units import Dimension, codes, resolve_unit
from service.physics.vapor_pressure import ExtendedAntoine, VaporPressureEquation, Wagner

_POSITIVE = validate.Range(min=0.0, min_inclusive=False)


@dataclass(frozen=True)
class Coefficient:
    """One value a form's table gives, and how it is checked on its own.

    ``kind`` is ``number`` (a number within ``bounds``), ``list`` (1 to ``most`` such numbers), ``choice``
    (one of ``choices``) or ``unit`` (the code of a unit of ``dimension``). A request states no ``unit``
    among the coefficients: its own field of that name (default: the request's unit) sets it.
    """

    name: str
    kind: Literal["number", "list", "choice", "unit"] = "number"
    bounds: validate.Range | None = None
    most: int = 8
    choices: tuple[int | str, ...] = ()
    dimension: Dimension | None = None
    description: str = ""

    @property
    def in_request(self) -> bool:
        """Whether a request gives this value among the equation's coefficients."""
        return self.kind != "unit"

    def field(self, number: type[fields.Float] = fields.Float, **kwargs: Any) -> fields.Field:
        """The marshmallow field that loads this value; ``number`` is the field of one number."""
        if self.kind == "choice":
            return fields.Raw(validate=self._chosen, **kwargs)
        if self.kind == "unit":
            return fields.String(validate=validate.OneOf(codes(self.dimension)), **kwargs)
        if self.kind == "list":
            return fields.List(number(validate=self.bounds), validate=validate.Length(min=1, max=self.most), **kwargs)
        return number(validate=self.bounds, **kwargs)

    def _chosen(self, value: Any) -> None:
        # A plain function, not validate.OneOf: the document states the choices as typed enums itself.
        if value not in self.choices:
            raise ValidationError(f"must be {' or '.join(json.dumps(c) for c in self.choices)}")


Table = Mapping[str, Any]
"""A validated table: its form's coefficients and range [K], SI where the form says nothing else."""
Check = Callable[[Table], None]
"""A check across a table's values; raises :class:`ValidationError` naming the field to fix."""


@dataclass(frozen=True, kw_only=True)
class Form:
    """What one equation form needs: its key, display name, equation with units as the documents print it,
    the coefficients a table must give, those it may give (``optional``, catalog tables only) and the checks
    across them."""

    key: str
    name: str
    equation: str
    coefficients: tuple[Coefficient, ...] = ()
    optional: tuple[Coefficient, ...] = ()
    checks: tuple[Check, ...] = ()


@dataclass(frozen=True, kw_only=True)
class VaporPressureForm(Form):
    """A vapor-pressure form; ``build`` takes the table, critical temperature [K] and pressure [Pa]."""

    build: Callable[[Table, float, float], VaporPressureEquation]
    caller_definable: bool = True
    """Whether a request may define a fluid by this form (water's own equation is the catalog's)."""
    needs_critical: bool = False
    """Whether the equation is reduced by the critical point, which a request must then state."""


@dataclass(frozen=True, kw_only=True)
class DensityForm(Form):
    """A saturated-liquid density form; ``build`` takes the table and the molar mass [kg/mol] and gives
    the density [kg/m3] at a temperature [K]."""

    build: Callable[[Table, float], Callable[[ArrayLike], NDArray[np.float64]]]


F = TypeVar("F", bound=Form)


def _antoine(table: Table, *_: float) -> VaporPressureEquation:
    """log_b(p/P_unit) = A - B/(t + C) as ln(p [Pa]) = a + b/(T + c), T [K] (Antoine 1888)."""
    # t = (T - offset) / scale in the table's temperature unit
    k = math.log(10.0) if table["log_base"] == 10 else 1.0
    p_unit = resolve_unit(table["pressure_unit"], "pressure")
    t_unit = resolve_unit(table["temperature_unit"], "temperature")
    return ExtendedAntoine(
        a=math.log(p_unit.scale) + k * table["A"],
        b=-k * table["B"] * t_unit.scale,
        c=table["C"] * t_unit.scale - t_unit.offset,
    )


def _wagner(table: Table, critical_temperature: float, critical_pressure: float) -> VaporPressureEquation:
    """ln(p/pc) = (Tc/T) sum(a_i tau**e_i) (Wagner 1973), reduced by the table's reducing point [K, Pa]
    where it gives one, else by the critical point."""
    return Wagner(
        critical_temperature=table.get("reducing_temperature", critical_temperature),
        critical_pressure=table.get("reducing_pressure", critical_pressure),
        coefficients=tuple(table["coefficients"]),
        exponents=tuple(table["exponents"]),
    )


def _dippr101(table: Table, *_: float) -> VaporPressureEquation:
    """ln(p [Pa]) = A + B/T + C ln T + D T**E, T [K] (Perry's, 8th ed., Table 2-8)."""
    return ExtendedAntoine(a=table["A"], b=table["B"], e=table["C"], f=table["D"], g=table["E"])


def _water_saturation(table: Table, *_: float) -> VaporPressureEquation:
    """Water's saturation pressure, IAPWS 1992 eq. (1)."""
    return water.SATURATION


def _dippr105(table: Table, molar_mass: float) -> Callable[[ArrayLike], NDArray[np.float64]]:
    """rho [kg/m3] = M A / B**(1 + (1 - T/C)**D) (Perry's, 8th ed., Table 2-32), A [kmol/m3] as Perry's prints it."""
    equation = Dippr105(a=table["A"] * 1e3, b=table["B"], c=table["C"], d=table["D"])

    def density(temperature: ArrayLike) -> NDArray[np.float64]:
        return equation.molar_density(temperature) * molar_mass

    return density


def _water_density(table: Table, molar_mass: float) -> Callable[[ArrayLike], NDArray[np.float64]]:
    """Water's saturated-liquid density, IAPWS 1992 eq. (2)."""
    return water.saturated_liquid_density


def _as_many_exponents(table: Table) -> None:
    if len(table["coefficients"]) != len(table["exponents"]):
        raise ValidationError("needs as many exponents as coefficients", "exponents")


def _ends_at_c(table: Table) -> None:
    if table["t_max"] > table["C"]:
        raise ValidationError("t_max is above C, where the DIPPR 105 equation ends", "t_max")


def numbers(names: str, bounds: validate.Range | None = None) -> tuple[Coefficient, ...]:
    return tuple(Coefficient(name, bounds=bounds) for name in names)


def by_key(*forms: F) -> Mapping[str, F]:
    return {form.key: form for form in forms}


VAPOR_PRESSURE_FORMS = by_key(
    VaporPressureForm(
        key="antoine",
        name="Antoine equation",
        equation="log_b(p) = A - B/(t + C) in `pressure_unit` and `temperature_unit`",
        coefficients=(
            *numbers("ABC"),
            Coefficient(
                "log_base",
                kind="choice",
                choices=(10, "e"),
                description='the base of the logarithm, the number 10 or the string "e".',
            ),
            Coefficient("pressure_unit", kind="unit", dimension="pressure"),
            Coefficient("temperature_unit", kind="unit", dimension="temperature"),
        ),
        build=_antoine,
    ),
    VaporPressureForm(
        key="wagner",
        name="Wagner equation",
        equation="ln(p/pc) = (Tc/T) sum(a_i tau**e_i), tau = 1 - T/Tc",
        coefficients=(
            Coefficient("coefficients", kind="list"),
            Coefficient("exponents", kind="list", bounds=validate.Range(min=0.5, max=50)),
        ),
        optional=(
            Coefficient("reducing_temperature", bounds=_POSITIVE),
            Coefficient("reducing_pressure", bounds=_POSITIVE),
        ),
        checks=(_as_many_exponents,),
        build=_wagner,
        needs_critical=True,
    ),
    VaporPressureForm(
        key="dippr101",
        name="DIPPR 101 equation",
        equation="ln(p/Pa) = A + B/T + C ln T + D T**E with T in K",
        coefficients=numbers("ABCDE"),
        build=_dippr101,
    ),
    VaporPressureForm(
        key="iapws-1992",
        name="IAPWS 1992 saturation-pressure equation",
        equation="water's own Wagner equation, with Tc = 647.096 K and pc = 22.064 MPa",
        build=_water_saturation,
        caller_definable=False,
    ),
)
"""The vapor-pressure forms by key, in the order the document lists them."""

DENSITY_FORMS = by_key(
    DensityForm(
        key="dippr105",
        name="DIPPR 105 equation",
        equation="rho = A / B**(1 + (1 - T/C)**D) with A in kmol/m3, T and C in K",
        coefficients=(*numbers("ABC", _POSITIVE), *numbers("D")),
        checks=(_ends_at_c,),
        build=_dippr105,
    ),
    DensityForm(
        key="iapws-1992",
        name="IAPWS 1992 saturated-liquid density equation",
        equation="water's own rho'/rho_c = 1 + sum(b_i tau**e_i), with rho_c = 322 kg/m3",
        build=_water_density,
    ),
)
"""The saturated-liquid density forms by key."""


def equation_from_entry(table: Table, critical_temperature: float, critical_pressure: float) -> VaporPressureEquation:
    """The equation of a validated ``vapor_pressure`` table (SI), built by its form.

    The critical point [K, Pa] reduces a Wagner equation whose table gives no reducing point.
    """
    return VAPOR_PRESSURE_FORMS[table["form"]].build(table, critical_temperature, critical_pressure)


def density_from_entry(table: Table, molar_mass: float) -> LiquidDensity:
    """The density correlation of a validated ``liquid_density`` table (SI), molar mass [kg/mol]."""
    density = DENSITY_FORMS[table["form"]].build(table, molar_mass)
    return LiquidDensity(density, table["t_min"], table["t_max"], table["method"], table["source"])
