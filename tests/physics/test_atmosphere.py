"""U.S. Standard Atmosphere 1976 against its tables and an independent implementation."""

import numpy as np
import pytest
from fluids.atmosphere import ATMOSPHERE_1976

from service.physics import atmosphere as atm

# U.S. Standard Atmosphere 1976, Table I (geometric altitude), as printed to five
# significant figures: elevation [m], temperature [K], pressure [Pa], density [kg/m3].
# The figures are recalled from memory of the printed tables (not copied from a scan);
# the independent implementation below confirms every one of them.
TABLE_I = [
    (-5000.0, 320.676, 1.7776e5, 1.9311),
    (0.0, 288.150, 1.01325e5, 1.2250),
    (1000.0, 281.651, 8.9876e4, 1.1117),
    (5000.0, 255.676, 5.4048e4, 7.3643e-1),
    (11000.0, 216.774, 2.2700e4, 3.6480e-1),
    (20000.0, 216.650, 5.5293e3, 8.8910e-2),
    (32000.0, 228.490, 8.8906e2, 1.3555e-2),
    (47000.0, 269.684, 1.1585e2, 1.4965e-3),
    (51000.0, 270.650, 7.0458e1, 9.0690e-4),
    (71000.0, 216.846, 4.4796, 7.1965e-5),
    (86000.0, 186.87, 3.7338e-1, 6.958e-6),
]


@pytest.mark.parametrize(("z", "t", "p", "rho"), TABLE_I)
def test_table_i(z: float, t: float, p: float, rho: float) -> None:
    assert atm.temperature_at_elevation(z) == pytest.approx(t, abs=0.006)
    assert atm.pressure_at_elevation(z) == pytest.approx(p, rel=1e-4)  # 0.01 %
    assert atm.density_at_elevation(z) == pytest.approx(rho, rel=1e-4)


def test_layer_bases_match_the_standard() -> None:
    # U.S. Standard Atmosphere 1976, Table 4: base pressures of the seven layers [Pa].
    printed = [101325.0, 22632.06, 5474.889, 868.0187, 110.9063, 66.93887, 3.956420]
    np.testing.assert_allclose(atm._BASE_P, printed, rtol=2e-7)


def test_against_fluids_library_over_the_whole_range() -> None:
    # Independent implementation: fluids.atmosphere.ATMOSPHERE_1976 (Caleb Bell, ChEDL).
    # It reports the molecular-scale temperature above 80 km, so temperatures are
    # compared up to 80 km; pressure and density everywhere.
    z = np.linspace(atm.MIN_ELEVATION, atm.MAX_ELEVATION, 1733)
    reference = [ATMOSPHERE_1976(float(v)) for v in z]
    np.testing.assert_allclose(atm.pressure_at_elevation(z), [r.P for r in reference], rtol=1e-4)
    np.testing.assert_allclose(atm.density_at_elevation(z), [r.rho for r in reference], rtol=1e-4)
    below_80 = z <= 80_000
    t_ref = np.array([r.T for r in reference])
    assert np.max(np.abs(atm.temperature_at_elevation(z[below_80]) - t_ref[below_80])) < 0.01


def test_kinetic_temperature_above_80_km_uses_molecular_weight_ratio() -> None:
    # Table 8: M/M0 = 0.999579 at 86 km; T_M = 186.946 K there (eq. 23).
    assert atm.temperature_at_elevation(86_000.0) == pytest.approx(186.946 * 0.999579, abs=1e-3)


def test_geopotential_conversion() -> None:
    # Eq. (18) with r0 = 6 356 766 m: 86 km geometric is 84 852 m' (the standard's own figure).
    assert atm.geopotential_height(86_000.0) == pytest.approx(84_852.05, abs=0.01)
    z = np.array([-5000.0, 0.0, 12345.0, 86000.0])
    np.testing.assert_allclose(atm.geometric_elevation(atm.geopotential_height(z)), z, atol=1e-8)


def test_inverse_is_exact_to_a_centimetre() -> None:
    z = np.linspace(atm.MIN_ELEVATION, atm.MAX_ELEVATION, 200_001)
    p = atm.pressure_at_elevation(z)
    assert np.max(np.abs(atm.elevation_at_pressure(p) - z)) < 0.01
    z_back = atm.elevation_at_pressure(p)
    np.testing.assert_allclose(atm.pressure_at_elevation(z_back), p, rtol=1e-9)


def test_sea_level_pressure_scales_the_profile() -> None:
    # A station reporting 1021 hPa at sea level: every pressure is 1021/1013.25 of standard.
    scale = 102_100.0 / 101_325.0
    assert atm.pressure_at_elevation(1420.0, 102_100.0) == pytest.approx(atm.pressure_at_elevation(1420.0) * scale)
    p = atm.pressure_at_elevation(1420.0, 102_100.0)
    assert atm.elevation_at_pressure(p, 102_100.0) == pytest.approx(1420.0, abs=1e-6)


def test_common_practice_checks() -> None:
    # Common practice, no source: about 12 % less air pressure per 1,000 m near sea level,
    # and roughly a third of sea-level pressure on the summit of Everest (8,849 m).
    assert atm.pressure_at_elevation(1000.0) / 101_325 == pytest.approx(0.887, abs=0.005)
    assert atm.pressure_at_elevation(8849.0) / 101_325 == pytest.approx(0.31, abs=0.01)


def test_one_layer_shortcut_agrees_to_the_bit() -> None:
    # Points all in one layer take its constants at once; mixed with another layer they are
    # looked up point by point. Both must give the same floats.
    z = np.linspace(100.0, 10_000.0, 50)
    mixed_z = np.concatenate((z, [30_000.0]))
    np.testing.assert_array_equal(atm.pressure_at_elevation(mixed_z)[:-1], atm.pressure_at_elevation(z))
    np.testing.assert_array_equal(atm.temperature_at_elevation(mixed_z)[:-1], atm.temperature_at_elevation(z))
    p = atm.pressure_at_elevation(z)
    mixed_p = np.concatenate((p, [1000.0]))
    np.testing.assert_array_equal(atm.elevation_at_pressure(mixed_p)[:-1], atm.elevation_at_pressure(p))
    for layer_z in (15_000.0, 25_000.0, 50_000.0, 60_000.0, 80_000.0):  # each layer alone, then mixed
        alone = atm.elevation_at_pressure(atm.pressure_at_elevation(layer_z))
        together = atm.elevation_at_pressure(np.array([float(atm.pressure_at_elevation(layer_z)), 101_325.0]))[0]
        assert alone == together, layer_z


def test_single_values_equal_array_elements_exactly() -> None:
    # Shuffled points across all seven layers, layer bases included: each single value gives the
    # same float as its place in the array.
    rng = np.random.default_rng(1976)
    bases = atm.geometric_elevation(atm._BASE_HEIGHT)
    z = np.concatenate((rng.uniform(atm.MIN_ELEVATION, atm.MAX_ELEVATION, 3000), bases))
    p = atm.pressure_at_elevation(z)
    assert [atm.pressure_at_elevation(float(v)) for v in z] == p.tolist()
    assert [atm.temperature_at_elevation(float(v)) for v in z] == atm.temperature_at_elevation(z).tolist()
    assert [atm.density_at_elevation(float(v)) for v in z] == atm.density_at_elevation(z).tolist()
    assert [atm.elevation_at_pressure(float(v)) for v in p] == atm.elevation_at_pressure(p).tolist()
    assert float(atm.pressure_at_elevation(0.0)) == atm.SEA_LEVEL_PRESSURE


def test_layer_lookup_by_kilometre_agrees_with_the_bases() -> None:
    # The lookup table assumes whole-kilometre bases; at each base, one ulp below and at the base.
    assert all(h % 1000 == 0 for h in atm._BASE_HEIGHT)
    below = np.nextafter(atm._BASE_HEIGHT[1:], -np.inf)
    h = np.concatenate((below, atm._BASE_HEIGHT[1:], [-6000.0, 0.0, 90_000.0]))
    expected = [int(np.searchsorted(atm._BASE_HEIGHT[1:], v, side="right")) for v in h]
    assert atm._layer_of_height(h).tolist() == expected
