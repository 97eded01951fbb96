"""The built-in solutes, and water with one dissolved in it: concentration bases, refusals and limits."""

import numpy as np
import pytest

from service.fluids.boiling import Boiling
from service.fluids.catalog import Catalog
from service.fluids.limits import OutOfRange, Refusal
from service.fluids.solutes import Solute, load_solutes
from service.fluids.solution import Basis, Solution, solution

SOLUTES = load_solutes()


@pytest.fixture(scope="module")
def water(catalog: Catalog) -> Boiling:
    return catalog.get("water")


def solute(solute_id: str) -> Solute:
    return SOLUTES.entries[solute_id]


def dissolved(water: Boiling, solute_id: str, concentration: float, basis: Basis = "mass fraction") -> Solution:
    return solution(solute(solute_id), water, np.float64(concentration), basis)


def test_six_solutes_each_with_method_and_source() -> None:
    # data/solutes/*.toml: one file per solute, each naming its equation and where it comes from.
    assert set(SOLUTES.entries) == {
        "sucrose",
        "sea-salt",
        "sodium-chloride",
        "calcium-chloride",
        "sodium-hydroxide",
        "lithium-bromide",
    }
    for entry in SOLUTES.entries.values():
        assert entry.method
        assert len(entry.source) > 10


@pytest.mark.parametrize(
    ("alias", "solute_id"),
    [
        ("brine", "sodium-chloride"),
        ("seawater", "sea-salt"),
        ("NaOH", "sodium-hydroxide"),
        ("LiBr", "lithium-bromide"),
        ("sugar", "sucrose"),
    ],
)
def test_aliases(alias: str, solute_id: str) -> None:
    # The aliases listed in data/solutes/*.toml.
    found = SOLUTES.get(alias)
    assert found is not None
    assert found.id == solute_id


def test_brix_is_for_sucrose_only(water: Boiling) -> None:
    # Degrees Brix are the mass percent of sucrose (definition): a 400, inputs that do not fit together.
    with pytest.raises(Refusal) as refused:
        dissolved(water, "sodium-chloride", 0.1, "Brix")
    assert refused.value.status == 400
    assert dissolved(water, "sucrose", 0.6, "Brix").mass_fraction == 0.6


def test_negative_concentration_is_out_of_range(water: Boiling) -> None:
    with pytest.raises(OutOfRange) as refused:
        dissolved(water, "sodium-chloride", -0.01)
    assert refused.value.field == "concentration"


def test_molality_converts_to_mass_fraction(water: Boiling) -> None:
    # w = m M / (1 + m M), M(NaCl) = 0.05844277 kg/mol (as data/solutes/sodium-chloride.toml states it).
    moles = 5.0 * 0.05844277
    assert dissolved(water, "sodium-chloride", 5.0, "molality").mass_fraction == pytest.approx(
        moles / (1.0 + moles), rel=1e-15
    )


def test_zero_concentration_boils_as_water(water: Boiling) -> None:
    # The solution's pure-water limit is the catalog's water, exactly.
    pressures = np.geomspace(5e3, 400e3, 12)
    for solute_id in SOLUTES.entries:
        brine = dissolved(water, solute_id, 0.0)
        np.testing.assert_array_equal(brine.saturation_temperature(pressures), water.saturation_temperature(pressures))
        assert brine.elevation_and_activity(np.float64(373.0)) == (0.0, 1.0)


def test_above_solubility_is_refused(water: Boiling) -> None:
    # Halite's solubility at 108.7 degC is about 0.283 (data/solutes/sodium-chloride.toml, after Sparrow 2003).
    with pytest.raises(OutOfRange) as refused:
        dissolved(water, "sodium-chloride", 0.30).check_concentration(np.float64(381.85), extrapolate=True)
    assert refused.value.field == "concentration"


def test_above_the_stated_range_needs_extrapolate(water: Boiling) -> None:
    # Sucrose at 120 degC: soluble to 0.853 (Vavrinecz 1962, recalled), stated to 0.85 (data/solutes/sucrose.toml).
    syrup = dissolved(water, "sucrose", 0.852)
    with pytest.raises(OutOfRange):
        syrup.check_concentration(np.float64(393.15), extrapolate=False)
    assert len(syrup.check_concentration(np.float64(393.15), extrapolate=True)) == 1


def test_boiling_point_above_the_stated_range_needs_extrapolate(water: Boiling) -> None:
    # Olsson, Jernqvist and Aly (1997) state their equation to 200 degC (data/solutes/sodium-hydroxide.toml).
    caustic = dissolved(water, "sodium-hydroxide", 0.5)
    at_205 = caustic.saturation_pressure(np.float64(478.15))  # where it boils 5 K above the range
    with pytest.raises(OutOfRange):
        caustic.check_pressure(at_205, extrapolate=False)
    assert len(caustic.check_pressure(at_205, extrapolate=True)) == 1
    # Beyond the 10 K reach the refusal names the pressure where the reach ends, not a solver's bound.
    with pytest.raises(OutOfRange) as refused:
        caustic.check_pressure(3e6, extrapolate=True)
    assert refused.value.high == pytest.approx(caustic.saturation_pressure(np.float64(483.15)), rel=1e-12)
