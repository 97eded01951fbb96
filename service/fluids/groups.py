"""The group-contribution tables (``data/groups/<form>.toml``: original UNIFAC, modified UNIFAC (Dortmund)):
subgroups, main-group interactions, each catalog liquid's groups, and the mixtures a method is known to answer
badly. Loaded and checked against the catalog at start-up; :meth:`GroupTable.model` builds a mixture's model.
"""

from __future__ import annotations

import tomllib
from collections.abc import Sequence
from dataclasses import dataclass
from pathlib import Path

import numpy as np

from service.fluids.catalog import Catalog, CatalogError
from service.fluids.fluid import Fluid
from service.fluids.limits import Refusal
from service.physics.activity.unifac import ModifiedUnifac, Unifac

GROUP_DIR = Path(__file__).with_name("data") / "groups"
GROUP_FILE = GROUP_DIR / "unifac.toml"
FORMS = {"unifac": "UNIFAC", "unifac-dortmund": "modified UNIFAC (Dortmund)"}
"""The group methods by the ``form`` their file names, as messages name them."""


@dataclass(frozen=True)
class Subgroup:
    """A subgroup: its number and main group's in the published tables, its volume R and area Q."""

    number: int
    main: int
    r: float
    q: float


@dataclass(frozen=True)
class GroupTable:
    """A method's subgroups by name, (a_mn [K], b_mn, c_mn [1/K]) by (main m, main n), each fluid's subgroup
    counts, and refusals by pair."""

    form: str
    method: str
    source: str
    subgroups: dict[str, Subgroup]
    interactions: dict[tuple[int, int], tuple[float, float, float]]
    fluids: dict[str, dict[str, int]]
    unreliable: dict[frozenset[str], str]

    def model(self, components: Sequence[Fluid]) -> Unifac:
        """The model of ``components``; refused for a fluid without groups, a pair the method answers badly, or
        two main groups without an interaction parameter."""
        ids = [fluid.id for fluid in components]
        unknown = [i for i in ids if i not in self.fluids]
        if unknown:
            raise Refusal(
                f"No {FORMS[self.form]} groups are assigned to {', '.join(unknown)}: no group-contribution prediction.",
                {"components": [f"{i}: no {FORMS[self.form]} groups" for i in unknown]},
            )
        for i, first in enumerate(ids):
            for second in ids[i + 1 :]:
                reason = self.unreliable.get(frozenset((first, second)))
                if reason:
                    raise Refusal(reason, {"components": [f"{first}/{second}: the group method fails"]})
        names = sorted({name for i in ids for name in self.fluids[i]}, key=lambda n: self.subgroups[n].main)
        mains = [self.subgroups[n].main for n in names]
        missing = sorted({(m, n) for m in mains for n in mains if m != n and (m, n) not in self.interactions}, key=str)
        if missing:
            raise Refusal(
                f"{FORMS[self.form]} has no interaction parameters for main groups "
                f"{', '.join(f'{m}/{n}' for m, n in missing)} of these components: no prediction.",
                {"components": ["missing UNIFAC interaction parameters"]},
            )
        a, b, c = np.array([[self.interactions.get((m, n), (0.0, 0.0, 0.0)) for n in mains] for m in mains]).T
        counts = np.array([[float(self.fluids[i].get(name, 0)) for name in names] for i in ids])
        r = np.array([self.subgroups[n].r for n in names])
        q = np.array([self.subgroups[n].q for n in names])
        if self.form == "unifac":
            return Unifac(counts, r, q, a.T)
        return ModifiedUnifac(counts, r, q, a.T, b.T, c.T)


def load_groups(catalog: Catalog[Fluid], path: Path = GROUP_FILE) -> GroupTable:
    """The group table, checked: every fluid in the catalog, every subgroup declared."""
    try:
        data = tomllib.loads(path.read_text(encoding="utf-8"))
        form, method, source = str(data["form"]), str(data["method"]), str(data["source"])
        subgroups = {
            name: Subgroup(int(v["id"]), int(v["main"]), float(v["R"]), float(v["Q"]))
            for name, v in data["subgroup"].items()
        }
        interactions = {(int(m), int(n)): _terms(values) for m, n, *values in data["interaction"]}
        fluids = {fid: {name: int(count) for name, count in groups.items()} for fid, groups in data["fluid"].items()}
        unreliable = {frozenset(e["components"]): str(e["reason"]) for e in data.get("unreliable", [])}
    except (OSError, UnicodeDecodeError, tomllib.TOMLDecodeError, KeyError, TypeError, ValueError) as exc:
        raise CatalogError(f"{path}: cannot read the group table: {exc!r}") from exc
    if form not in FORMS:
        raise CatalogError(f"{path}: form must be one of {', '.join(FORMS)}")
    for fid, groups in fluids.items():
        if fid not in catalog.entries:
            raise CatalogError(f"{path}: fluid {fid!r} is not in the catalog")
        undeclared = [name for name in groups if name not in subgroups]
        if undeclared or not groups or min(groups.values()) < 1:
            raise CatalogError(f"{path}: fluid {fid!r} has undeclared subgroups or counts below 1: {groups}")
    return GroupTable(form, method, source, subgroups, interactions, fluids, unreliable)


def load_group_tables(catalog: Catalog[Fluid], directory: Path = GROUP_DIR) -> dict[str, GroupTable]:
    """Every group table, by its form."""
    tables = [load_groups(catalog, path) for path in sorted(directory.glob("*.toml"))]
    return {table.form: table for table in tables}


def _terms(values: list[float]) -> tuple[float, float, float]:
    """(a, b, c) from an entry's one (original UNIFAC) or three (Dortmund) parameters."""
    a, b, c = (*map(float, values), 0.0, 0.0)[:3]
    return a, b, c
