"""The UNIFAC group table (``data/groups/unifac.toml``): subgroups, main-group interactions, each catalog liquid's
groups, and the mixtures the method is known to answer badly. Loaded and checked against the catalog at
start-up; :meth:`GroupTable.model` builds the :class:`~service.physics.activity.unifac.Unifac` of a mixture.
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
from service.physics.activity.unifac import Unifac

GROUP_FILE = Path(__file__).with_name("data") / "groups" / "unifac.toml"
METHOD = "UNIFAC (Fredenslund, Jones and Prausnitz 1975), original parameters"
SOURCE = (
    "A. Fredenslund, R. L. Jones and J. M. Prausnitz, AIChE J. 21 (1975) 1086-1099; parameters of H. K. Hansen, "
    "P. Rasmussen, Aa. Fredenslund, M. Schiller and J. Gmehling, Ind. Eng. Chem. Res. 30 (1991) 2352-2355"
)


@dataclass(frozen=True)
class Subgroup:
    """A subgroup: its number and main group's in the published tables, its volume R and area Q."""

    number: int
    main: int
    r: float
    q: float


@dataclass(frozen=True)
class GroupTable:
    """Subgroups by name, a_mn [K] by (main m, main n), each fluid's subgroup counts, and refusals by pair."""

    subgroups: dict[str, Subgroup]
    interactions: dict[tuple[int, int], float]
    fluids: dict[str, dict[str, int]]
    unreliable: dict[frozenset[str], str]

    def model(self, components: Sequence[Fluid]) -> Unifac:
        """The UNIFAC model of ``components``; refused for a fluid without groups, a pair the method answers
        badly, or two main groups without an interaction parameter."""
        ids = [fluid.id for fluid in components]
        unknown = [i for i in ids if i not in self.fluids]
        if unknown:
            raise Refusal(
                f"No UNIFAC groups are assigned to {', '.join(unknown)}: no group-contribution prediction either.",
                {"components": [f"{i}: no UNIFAC groups" for i in unknown]},
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
                "UNIFAC has no interaction parameters for main groups "
                f"{', '.join(f'{m}/{n}' for m, n in missing)} of these components: no prediction.",
                {"components": ["missing UNIFAC interaction parameters"]},
            )
        a = np.array([[self.interactions.get((m, n), 0.0) for n in mains] for m in mains])
        counts = np.array([[float(self.fluids[i].get(name, 0)) for name in names] for i in ids])
        r = np.array([self.subgroups[n].r for n in names])
        q = np.array([self.subgroups[n].q for n in names])
        return Unifac(counts, r, q, a)


def load_groups(catalog: Catalog[Fluid], path: Path = GROUP_FILE) -> GroupTable:
    """The group table, checked: every fluid in the catalog, every subgroup declared."""
    try:
        data = tomllib.loads(path.read_text(encoding="utf-8"))
        subgroups = {
            name: Subgroup(int(v["id"]), int(v["main"]), float(v["R"]), float(v["Q"]))
            for name, v in data["subgroup"].items()
        }
        interactions = {(int(m), int(n)): float(a) for m, n, a in data["interaction"]}
        fluids = {fid: {name: int(count) for name, count in groups.items()} for fid, groups in data["fluid"].items()}
        unreliable = {frozenset(e["components"]): str(e["reason"]) for e in data.get("unreliable", [])}
    except (OSError, UnicodeDecodeError, tomllib.TOMLDecodeError, KeyError, TypeError, ValueError) as exc:
        raise CatalogError(f"{path}: cannot read the group table: {exc!r}") from exc
    for fid, groups in fluids.items():
        if fid not in catalog.entries:
            raise CatalogError(f"{path}: fluid {fid!r} is not in the catalog")
        undeclared = [name for name in groups if name not in subgroups]
        if undeclared or not groups or min(groups.values()) < 1:
            raise CatalogError(f"{path}: fluid {fid!r} has undeclared subgroups or counts below 1: {groups}")
    return GroupTable(subgroups, interactions, fluids, unreliable)
