"""Load, validate and look up the fluid catalog.

The built-in entries live in ``data/*.toml`` beside this module; every entry is checked
by :class:`~service.fluids.schema.FluidEntrySchema` and turned into a
:class:`~service.fluids.fluid.Fluid` whose equations its forms build (:mod:`service.fluids.forms`).
"""

from __future__ import annotations

import difflib
import tomllib
from collections.abc import Iterable, Mapping
from pathlib import Path
from typing import Any, Generic, Protocol, TypeVar

from marshmallow import ValidationError

from service.fluids.fluid import Fluid
from service.fluids.forms import density_from_entry, equation_from_entry
from service.fluids.schema import FluidEntrySchema

DATA_DIR = Path(__file__).with_name("data")


class CatalogError(ValueError):
    """A catalog file that cannot be loaded; the message names file, entry and field."""


def fluid_from_entry(entry: Mapping[str, Any]) -> Fluid:
    """Turn one validated catalog entry into a :class:`Fluid`."""
    vp = entry["vapor_pressure"]
    return Fluid(
        id=entry["id"],
        name=entry["name"],
        formula=entry["formula"],
        cas=entry["cas"],
        aliases=tuple(entry["aliases"]),
        molar_mass=entry["molar_mass"],
        critical_temperature=entry["critical_temperature"],
        critical_pressure=entry["critical_pressure"],
        triple_temperature=entry["triple_temperature"],
        triple_pressure=entry["triple_pressure"],
        normal_boiling_point=entry["normal_boiling_point"],
        constants_source=entry["constants_source"],
        lower_limit_note=entry["lower_limit_note"],
        notes=tuple(entry["notes"]),
        vapor_associates=entry["vapor_associates"],
        liquid_density=None
        if entry["liquid_density"] is None
        else density_from_entry(entry["liquid_density"], entry["molar_mass"]),
        equation=equation_from_entry(vp, entry["critical_temperature"], entry["critical_pressure"]),
        t_min=vp["t_min"],
        t_max=vp["t_max"],
        method=vp["method"],
        source=vp["source"],
    )


def entry_error(label: str, exc: ValidationError) -> CatalogError:
    """The start-up error of an entry that fails its schema: ``label`` (file and entry), then each field's message."""
    return CatalogError(f"{label}: {' | '.join(messages(exc.normalized_messages()))}")


def messages(errors: Mapping[str, Any], prefix: str = "") -> Iterable[str]:
    for key, value in errors.items():
        if isinstance(value, Mapping):
            yield from messages(value, f"{prefix}{key}.")
        else:
            yield f"{prefix}{key}: {'; '.join(map(str, value))}"


def load_file(path: Path) -> list[Fluid]:
    """Read and validate one catalog file; raise :class:`CatalogError` naming what is wrong."""
    try:
        document = tomllib.loads(path.read_text(encoding="utf-8"))
    except (OSError, UnicodeDecodeError, tomllib.TOMLDecodeError) as exc:
        raise CatalogError(f"{path}: cannot read catalog file: {exc}") from exc
    entries = document.get("fluid")
    if not isinstance(entries, list) or not entries:
        raise CatalogError(f"{path}: no [[fluid]] entries")
    fluids = []
    for number, raw in enumerate(entries, start=1):
        label = f"{path}: entry {number} ({raw.get('id', 'no id')!s})"
        try:
            fluids.append(fluid_from_entry(FluidEntrySchema().load(raw)))
        except ValidationError as exc:
            raise entry_error(label, exc) from exc
    return fluids


class Named(Protocol):
    """What the catalog finds an entry by."""

    id: str
    name: str
    formula: str
    cas: str
    aliases: tuple[str, ...]


E = TypeVar("E", bound=Named)


class Catalog(Generic[E]):
    """Entries (fluids, or solutes) found by id, CAS number, name or alias, case-insensitively."""

    def __init__(self, entries: Iterable[E], kind: str = "fluid") -> None:
        self.entries: dict[str, E] = {}
        self._keys: dict[str, str] = {}
        for entry in entries:
            if entry.id in self.entries:
                raise CatalogError(f"{kind} id {entry.id!r} is defined twice")
            self.entries[entry.id] = entry
            for key in filter(None, (entry.id, entry.cas, entry.name, *entry.aliases)):  # a mixture has no CAS number
                owner = self._keys.setdefault(_fold(key), entry.id)
                if owner != entry.id:
                    raise CatalogError(f"{key!r} names both {owner!r} and {entry.id!r}")

    def get(self, name: str) -> E | None:
        """The entry that ``name`` denotes, or None."""
        entry_id = self._keys.get(_fold(name))
        return self.entries[entry_id] if entry_id else None

    def close_matches(self, name: str, count: int = 3) -> list[str]:
        """Ids of up to ``count`` entries whose names resemble ``name``, best first."""
        ids: list[str] = []
        for key in difflib.get_close_matches(_fold(name), self._keys, n=4 * count, cutoff=0.5):
            if self._keys[key] not in ids:
                ids.append(self._keys[key])
        return ids[:count]

    def search(self, query: str) -> list[E]:
        """Entries whose id, CAS number, formula, name or an alias contains ``query``."""
        q = _fold(query)
        return [
            e for e in self.entries.values() if any(q in _fold(k) for k in (e.id, e.cas, e.formula, e.name, *e.aliases))
        ]


def _fold(text: str) -> str:
    return " ".join(text.casefold().split())


def builtin_files() -> list[Path]:
    """The built-in catalog files, in name order."""
    return sorted(DATA_DIR.glob("*.toml"))


def load_catalog(files: Iterable[Path] | None = None, extra_files: Iterable[Path] = ()) -> Catalog[Fluid]:
    """The catalog from ``files`` (default: the built-in ones) plus operator files, validated alike.

    Every fluid's pressure limits and saturation-temperature table are computed here (about 0.1 s
    for the built-in catalog), so that no request pays for them and gunicorn's workers, forked
    from a preloaded application, share them.
    """
    paths = [*(builtin_files() if files is None else files), *extra_files]
    catalog = Catalog(fluid for path in paths for fluid in load_file(Path(path)))
    for fluid in catalog.entries.values():
        fluid.prepare()
    return catalog
