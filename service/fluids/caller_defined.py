"""Fluids a caller defines in a request: an equation as printed, or one known boiling point.

SI in: temperature [K], pressure [Pa], enthalpy [J/mol]. Each function returns a
:class:`~service.fluids.fluid.Fluid` that the computing paths use like a catalog fluid, or
raises ``ValueError`` saying what is wrong with the definition.
"""

from __future__ import annotations

import math
from collections.abc import Mapping
from typing import Any

import numpy as np

from service.fluids.fluid import Fluid
from service.fluids.forms import VAPOR_PRESSURE_FORMS, equation_from_entry
from service.physics.units import ATMOSPHERE
from service.physics.vapor_pressure import ExtendedAntoine

GAS_CONSTANT = 8.314462618
"""R [J/(mol K)], CODATA 2018 (exact since the 2019 SI)."""
TROUTON_ENTROPY = 88.0
"""Trouton's rule: entropy of vaporization at the normal boiling point [J/(mol K)], about 10.5 R.

F. Trouton, Phil. Mag. 18, 54 (1884); 85 to 88 J/(mol K) is the usual textbook figure."""
POINT_TEMPERATURES = (1.0, 10_000.0)
"""Boiling points [K] a one-point fluid may have: from helium's neighbourhood to well past any liquid."""
POINT_RANGE = (1e-3, 10.0)
"""A one-point fluid answers for pressures from 1/1000 to 10 times its known pressure."""

_CLAUSIUS = "R. Clausius, Ann. Phys. 79, 368 and 500 (1850); B. P. E. Clapeyron, J. Ec. Polytech. 14, 153 (1834)"
_TROUTON = "F. Trouton, Phil. Mag. 18, 54 (1884)"
_UNCHECKED = "A caller-defined fluid: its equation is used as given, not checked against reference data."


def fluid_from_equation(name: str, vapor_pressure: Mapping[str, Any], critical: tuple[float, float] | None) -> Fluid:
    """A fluid from a catalog-style ``vapor_pressure`` table (form, coefficients, t_min, t_max in K).

    ``critical`` is (Tc [K], pc [Pa]) where the caller gave it; a Wagner equation needs it.
    The equation must give finite pressures that rise with temperature over its range.
    """
    tc, pc = critical if critical else (math.inf, math.inf)
    equation = equation_from_entry(vapor_pressure, tc, pc)
    t_min, t_max = vapor_pressure["t_min"], vapor_pressure["t_max"]
    low, high = equation.domain
    if not low < t_min < t_max <= min(high, tc):
        raise ValueError(f"the range must lie inside where the equation is defined ({low:.6g} K to {high:.6g} K)")
    t = np.linspace(t_min, t_max, 64)
    with np.errstate(all="ignore"):
        p, slope = equation.pressure(t), equation.slope(t)
    if not (np.all(np.isfinite(p)) and np.all(np.isfinite(slope)) and np.all(slope > 0) and np.all(p > 0)):
        raise ValueError(
            "the equation's pressure must be finite and rise with temperature from t_min to t_max: "
            "check the coefficients' signs and units"
        )
    return Fluid(
        id=name,
        name=name,
        equation=equation,
        t_min=t_min,
        t_max=t_max,
        method=f"{VAPOR_PRESSURE_FORMS[vapor_pressure['form']].name} with caller-supplied coefficients",
        source="coefficients supplied in the request",
        critical_temperature=tc,
        critical_pressure=pc,
        notes=(_UNCHECKED,),
        tabulated=False,
    )


def fluid_from_boiling_point(
    name: str, temperature: float, pressure: float | None = None, enthalpy: float | None = None
) -> Fluid:
    """A fluid from one boiling point ``temperature`` [K] at ``pressure`` [Pa] (default 1 atm), by
    Clausius-Clapeyron.

    ln(p/p0) = -(dH/R)(1/T - 1/T0), with the enthalpy of vaporization dH [J/mol] taken
    constant; without it, Trouton's rule dH = 88 J/(mol K) * T0 estimates it.

    >>> toluene = fluid_from_boiling_point("toluene", 383.75, 101_325.0, None)
    >>> round(float(toluene.saturation_temperature(10_000.0)) - 273.15, 1)  # reference EOS: 45.3 degC
    41.7
    """
    pressure = ATMOSPHERE if pressure is None else pressure
    low, high = POINT_TEMPERATURES
    if not (low <= temperature <= high and math.isfinite(pressure) and pressure > 0):
        raise ValueError(f"the boiling point must lie between {low:g} K and {high:g} K, at a positive pressure")
    notes = [_UNCHECKED]
    method, source = "Clausius-Clapeyron equation through one boiling point", _CLAUSIUS
    if enthalpy is None:
        enthalpy = TROUTON_ENTROPY * temperature
        method += ", enthalpy of vaporization from Trouton's rule"
        source = f"{source}; {_TROUTON}"
        notes.append(
            f"The enthalpy of vaporization, {enthalpy / 1e3:.3g} kJ/mol, is estimated by Trouton's rule "
            f"({TROUTON_ENTROPY:g} J/(mol K) times the boiling point): often within 10 % for non-polar liquids, "
            "too low for hydrogen-bonded ones such as water and alcohols. Send enthalpy_of_vaporization if known."
        )
        if abs(pressure / ATMOSPHERE - 1.0) > 0.05:
            notes.append("Trouton's rule holds at the normal boiling point; this boiling point is not at 1 atm.")
    slope = enthalpy / GAS_CONSTANT
    equation = ExtendedAntoine(a=math.log(pressure) + slope / temperature, b=-slope)
    with np.errstate(all="ignore"):  # an absurd point may overflow: refused just below
        lowest, highest = (float(1.0 / (1.0 / np.float64(temperature) - math.log(f) / slope)) for f in POINT_RANGE)
    if not all(math.isfinite(v) for v in (equation.a, equation.b, lowest, highest)) or not 0 < lowest < highest:
        raise ValueError("this boiling point and enthalpy give no usable Clausius-Clapeyron equation")
    return Fluid(
        id=name,
        name=name,
        equation=equation,
        t_min=lowest,
        t_max=highest,
        method=method,
        source=source,
        notes=tuple(notes),
        tabulated=False,
    )
