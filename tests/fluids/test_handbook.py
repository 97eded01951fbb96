"""Normal boiling points of the built-in catalog against the CRC Handbook.

Source: W.M. Haynes (ed.), CRC Handbook of Chemistry and Physics, 95th ed., CRC Press, Boca Raton,
2014, tables "Physical Constants of Organic Compounds" and "Physical Constants of Inorganic
Compounds". How the numbers were obtained: not read from the printed book, but from the CRC data
tables that the `chemicals` Python package (version 1.5.2) ships and attributes to that edition
(its Tb methods "CRC_ORG" and "CRC_INORG"), in kelvin as stored there. R-1234yf is not in those
tables and is left out here; carbon dioxide has no normal boiling point (it sublimes at 1 atm).
"""

from __future__ import annotations

import pytest

from service.fluids.catalog import load_catalog

ATMOSPHERE = 101325.0  # Pa
TOLERANCE = 0.2  # K

# Normal boiling point [K] at 101325 Pa, CRC Handbook 95th ed. (via the chemicals package's CRC tables).
CRC_95_NORMAL_BOILING_POINT = {
    "methanol": 337.65,
    "ethanol": 351.39,
    "1-propanol": 370.19,
    "2-propanol": 355.36,
    "1-butanol": 390.75,
    "ethylene-glycol": 470.65,
    "acetone": 329.23,
    "methyl-ethyl-ketone": 352.75,
    "ethyl-acetate": 350.25,
    "diethyl-ether": 307.55,
    "tetrahydrofuran": 339.15,
    "benzene": 353.23,
    "toluene": 383.75,
    "o-xylene": 417.55,
    "m-xylene": 412.25,
    "p-xylene": 411.45,
    "ethylbenzene": 409.35,
    "styrene": 418.45,
    "methane": 111.65,
    "ethane": 184.55,
    "propane": 231.04,
    "n-butane": 272.65,
    "isobutane": 261.45,
    "n-pentane": 309.21,
    "isopentane": 300.98,
    "n-hexane": 341.87,
    "n-heptane": 371.53,
    "n-octane": 398.77,
    "n-nonane": 423.95,
    "n-decane": 447.25,
    "n-dodecane": 489.45,
    "cyclohexane": 353.85,
    "cyclopentane": 322.35,
    "ethylene": 169.35,
    "propylene": 225.55,
    "dichloromethane": 312.95,
    "chloroform": 334.35,
    "1-2-dichloroethane": 356.55,
    "acetonitrile": 354.75,
    "acetic-acid": 391.05,
    "dimethyl-sulfoxide": 465.05,  # 191.9 degC; the CRC "Enthalpy of Vaporization" table has 462.15 K (189.0 degC)
    "dimethylformamide": 425.95,  # 152.8 degC; the CRC "Enthalpy of Vaporization" table has 426.15 K (153.0 degC)
    "r134a": 247.05,
    "r32": 221.5,
    "r22": 232.35,
    "r152a": 249.13,
    "r125": 225.06,
    "ammonia": 239.82,  # inorganic table
    "sulfur-dioxide": 263.1,  # inorganic table
    "nitrogen": 77.355,  # inorganic table
    "oxygen": 90.188,  # inorganic table
    "argon": 87.302,  # inorganic table
    "hydrogen": 20.271,  # inorganic table (normal hydrogen)
    "helium": 4.222,  # inorganic table
    "carbon-monoxide": 81.65,  # inorganic table
    "water": 373.124,  # inorganic table
}

# No published correlation in a form the catalog can hold was found that reaches the handbook value and
# agrees with other published data; the entries keep their DIPPR 101 equations (Perry's 8th ed.). The sets
# examined and why each was not taken are listed in a comment above each entry's vapor_pressure table.
KNOWN_MISSES = {
    "dimethyl-sulfoxide": "DIPPR 101 (Perry's 8th ed.) boils at 463.89 K, 1.16 K below the CRC value; the other "
    "published sets at hand give 463.77 K (Landolt-Boernstein IV/20A, extrapolated) and 462.38 K (ChemSep)",
    "dimethylformamide": "DIPPR 101 (Perry's 8th ed.) boils at 424.92 K, 1.03 K below the CRC value; ChemSep's "
    "DIPPR 101 set reaches it (426.01 K) but disagrees with the CRC enthalpy of vaporization at 298.15 K",
}

CATALOG = load_catalog()


def _cases() -> list[object]:
    return [
        pytest.param(
            fluid_id,
            kelvin,
            id=fluid_id,
            marks=[pytest.mark.xfail(reason=KNOWN_MISSES[fluid_id], strict=True)] if fluid_id in KNOWN_MISSES else [],
        )
        for fluid_id, kelvin in CRC_95_NORMAL_BOILING_POINT.items()
    ]


def test_known_misses_warn_in_every_answer() -> None:
    for fluid_id in KNOWN_MISSES:
        assert any("CRC Handbook normal boiling point" in note for note in CATALOG.entries[fluid_id].notes)


def test_the_table_names_catalog_fluids() -> None:
    assert set(CRC_95_NORMAL_BOILING_POINT) <= set(CATALOG.entries)


@pytest.mark.parametrize(("fluid_id", "handbook"), _cases())
def test_normal_boiling_point_matches_the_handbook(fluid_id: str, handbook: float) -> None:
    computed = float(CATALOG.entries[fluid_id].saturation_temperature(ATMOSPHERE))
    assert computed == pytest.approx(handbook, abs=TOLERANCE)


def test_carbon_dioxide_does_not_boil_at_one_atmosphere() -> None:
    co2 = CATALOG.entries["carbon-dioxide"]
    assert co2.normal_boiling_point is None
    assert co2.triple_pressure > ATMOSPHERE
