"""Solution densities against published values (source beside each check)."""

from __future__ import annotations

import numpy as np
import pytest

from service.fluids.solutes import load_solutes
from service.physics import water

SOLUTES = load_solutes()


def density(solute_id: str, temperature: float, mass_fraction: float) -> float:
    return float(SOLUTES.get(solute_id).density.equation.density(temperature, mass_fraction))


def test_caustic_at_50_percent() -> None:
    # Dow, caustic soda solution 50 %: specific gravity 1.52 at 20 degC (from International Critical Tables).
    assert density("sodium-hydroxide", 293.15, 0.5) == pytest.approx(1520.0, rel=0.005)


def test_caustic_tends_to_water() -> None:
    # Olsson's fit at no NaOH against IAPWS 1992 eq. (2) saturated liquid water: within 0.3 % from 20 to 150 degC.
    t = np.array([293.15, 353.15, 423.15])
    np.testing.assert_allclose(
        SOLUTES.get("sodium-hydroxide").density.equation.density(t, 0.0), water.saturated_liquid_density(t), rtol=3e-3
    )


def test_calcium_chloride_at_30_percent() -> None:
    # CRC Handbook of Chemistry and Physics, concentrative properties of aqueous solutions: CaCl2 30 wt% at 20 degC,
    # 1.2816 g/cm3 (recalled from memory).
    assert density("calcium-chloride", 293.15, 0.3) == pytest.approx(1281.6, rel=0.005)


def test_calcium_chloride_at_no_salt_is_water() -> None:
    # Conde (2004), eq. (5): the ratio is 1 at w = 0, over saturated liquid water.
    assert density("calcium-chloride", 333.15, 0.0) == float(water.saturated_liquid_density(333.15))
