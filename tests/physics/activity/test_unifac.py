"""UNIFAC against the thermo package (test-only reference) for the same groups and parameters."""

from __future__ import annotations

import numpy as np
import pytest

from service.fluids.catalog import load_catalog
from service.fluids.groups import load_group_tables

thermo_unifac = pytest.importorskip("thermo.unifac")

CATALOG = load_catalog()
TABLES = load_group_tables(CATALOG)
TABLE = TABLES["unifac"]


@pytest.mark.parametrize(
    "ids",
    [("ethanol", "water"), ("acetone", "n-hexane"), ("benzene", "toluene", "ethanol"), ("methanol", "chloroform")],
)
@pytest.mark.parametrize("temperature", [300.0, 340.0, 370.0])
def test_equals_thermo(ids: tuple[str, ...], temperature: float) -> None:
    # thermo 0.6 UNIFAC(version=0), the original UNIFAC (Fredenslund et al. 1975) with the same parameter table.
    fluids = [CATALOG.get(i) for i in ids]
    model = TABLE.model(fluids)
    x = np.linspace(1.0, 2.0, len(ids))
    x /= x.sum()
    chemgroups = [{TABLE.subgroups[name].number: count for name, count in TABLE.fluids[i].items()} for i in ids]
    reference = thermo_unifac.UNIFAC.from_subgroups(T=temperature, xs=list(x), chemgroups=chemgroups, version=0)
    np.testing.assert_allclose(np.exp(model.log_gamma(x, temperature)), reference.gammas(), rtol=1e-9)


def test_a_pure_component_has_gamma_one() -> None:
    model = TABLE.model([CATALOG.get("ethanol"), CATALOG.get("water")])
    np.testing.assert_allclose(model.log_gamma([1.0, 0.0], 350.0)[0], 0.0, atol=1e-14)


@pytest.mark.parametrize(
    "ids", [("ethanol", "water"), ("acetone", "n-hexane"), ("cyclohexane", "tetrahydrofuran", "2-propanol")]
)
@pytest.mark.parametrize("temperature", [300.0, 350.0])
def test_dortmund_equals_thermo(ids: tuple[str, ...], temperature: float) -> None:
    # thermo 0.6 UNIFAC(version=1) with its 2016 modified UNIFAC (Dortmund) table (Weidlich and Gmehling 1987).
    table = TABLES["unifac-dortmund"]
    model = table.model([CATALOG.get(i) for i in ids])
    x = np.linspace(1.0, 2.0, len(ids))
    x /= x.sum()
    chemgroups = [{table.subgroups[name].number: count for name, count in table.fluids[i].items()} for i in ids]
    reference = thermo_unifac.UNIFAC.from_subgroups(
        T=temperature,
        xs=list(x),
        chemgroups=chemgroups,
        version=1,
        interaction_data=thermo_unifac.DOUFIP2016,
        subgroups=thermo_unifac.DOUFSG,
    )
    np.testing.assert_allclose(np.exp(model.log_gamma(x, temperature)), reference.gammas(), rtol=1e-9)
