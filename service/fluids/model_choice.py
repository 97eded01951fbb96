"""Which activity model answers a mixture: fitted pairs, a group prediction, or Raoult's law where asked for.

Also the refusals that depend on the mixture's make-up alone: a component named twice, fewer than two, and
acids that associate in the vapor (the ideal-vapor law does not hold for them).
"""

from __future__ import annotations

from collections.abc import Mapping, Sequence

from service.fluids.fluid import Fluid
from service.fluids.groups import GroupTable
from service.fluids.limits import Refusal
from service.fluids.mixture import MODEL_NAMES, Binary, Mixture, Model
from service.fluids.pairs import PairModel, PairSet

IDEAL_NOTE = (
    "An ideal solution (Raoult's law), as the request asked: every activity coefficient is 1. Real mixtures depart "
    "from it, some by several kelvin; it is close only for liquids known to mix ideally."
)
SPLIT_MARGIN = 20.0
"""How far [K] beyond a pair's stated range its liquid is tested for splitting (the answers may reach there)."""


def mixture(
    components: Sequence[Fluid],
    pair_sets: Mapping[PairModel, PairSet],
    tables: Mapping[str, GroupTable],
    model: Model,
) -> Mixture:
    """The mixture of ``components`` under ``model``: ``ideal`` (Raoult's law); ``nrtl``, ``wilson`` or ``uniquac``
    with that model's built-in pair of every two components (a missing pair refused); ``unifac`` or
    ``unifac-dortmund``, a group prediction from ``tables``; ``auto``, NRTL where every pair has parameters, else
    original UNIFAC with a caution: never an ideal solution unasked."""
    ids = [fluid.id for fluid in components]
    if len(set(ids)) != len(ids):
        raise Refusal("A component is named twice.", {"components": ["repeated"]}, 400)
    if len(ids) < 2:
        raise Refusal("A mixture has two components or more.", {"components": ["fewer than two"]}, 400)
    for fluid in components:
        if fluid.vapor_associates:
            raise Refusal(
                f"{fluid.vapor_associates} A bubble or dew point with {fluid.name} is not answered.",
                {"components": [f"{fluid.id}: its vapor associates"]},
            )
    if model == "ideal":
        return Mixture(tuple(components), "ideal", None, notes=(IDEAL_NOTE,))
    fitted: PairModel = "nrtl" if model == "auto" else model  # type: ignore[assignment]
    if fitted in pair_sets:
        chosen = pair_sets[fitted]
        missing = [f"{a}/{b}" for i, a in enumerate(ids) for b in ids[i + 1 :] if frozenset((a, b)) not in chosen.pairs]
        if not missing:
            return _fitted_mixture(tuple(components), chosen, pair_sets, tables)
        if model != "auto":
            raise Refusal(
                f"No built-in {MODEL_NAMES[fitted]} parameters for {', '.join(missing)} (GET /v1/pairs lists them); "
                "model=auto falls back to the UNIFAC group prediction.",
                {"components": [f"no parameters for {m}" for m in missing]},
            )
        notes = (
            f"No fitted NRTL parameters for {', '.join(missing)}: the answer is the UNIFAC group-contribution "
            "prediction, typically within a few kelvin of measured bubble points, and less sure than a fitted pair.",
        )
        return _group_mixture(tuple(components), tables["unifac"], notes)
    return _group_mixture(tuple(components), tables[model], ())


def _group_mixture(components: tuple[Fluid, ...], table: GroupTable, notes: tuple[str, ...]) -> Mixture:
    scan = _scan(components)
    binaries = tuple(
        Binary((a.id, b.id), table.model([a, b]), scan, MODEL_NAMES[table.form])
        for i, a in enumerate(components)
        for b in components[i + 1 :]
    )
    return Mixture(components, table.form, table.model(components), binaries, notes, table)  # type: ignore[arg-type]


def _scan(components: Sequence[Fluid]) -> tuple[float, float]:
    """The temperatures [K] where every component has a liquid by its equation, within 200 to 600 K."""
    lows, highs = zip(*(fluid.temperature_limits for fluid in components), strict=True)
    return max(*lows, 200.0), min(*highs, 600.0)


def _fitted_mixture(
    components: tuple[Fluid, ...],
    chosen: PairSet,
    pair_sets: Mapping[PairModel, PairSet],
    tables: Mapping[str, GroupTable],
) -> Mixture:
    binaries = tuple(
        _binary(chosen, a, b, pair_sets, tables) for i, a in enumerate(components) for b in components[i + 1 :]
    )
    return Mixture(components, chosen.model, chosen.activity([f.id for f in components]), binaries, pair_set=chosen)


def _binary(
    chosen: PairSet,
    first: Fluid,
    second: Fluid,
    pair_sets: Mapping[PairModel, PairSet],
    tables: Mapping[str, GroupTable],
) -> Binary:
    """The pair of ``first`` and ``second`` the answer uses, with the model that tests it for two liquid phases:
    the pair's own, or for Wilson (which cannot describe them) the same pair's NRTL or UNIQUAC set, else UNIFAC."""
    pair = chosen.pairs[frozenset((first.id, second.id))]
    judges = (chosen,) if chosen.model != "wilson" else (pair_sets.get("nrtl"), pair_sets.get("uniquac"))
    for judge in judges:
        other = judge.pairs.get(frozenset(pair.components)) if judge else None
        if judge and other:
            scan = (other.t_min - SPLIT_MARGIN, other.t_max + SPLIT_MARGIN)
            return Binary(other.components, judge.activity(other.components), scan, MODEL_NAMES[judge.model], pair)
    try:
        unifac = tables["unifac"].model([first, second])
    except Refusal as exc:
        raise Refusal(
            f"Wilson's equation cannot show two liquid phases, and {first.name} and {second.name} have neither an "
            f"NRTL nor a UNIQUAC pair nor a UNIFAC prediction to test them with ({exc.message}). Ask for another "
            "model.",
            {"components": [f"{first.id}/{second.id}: no test for two liquid phases"]},
        ) from exc
    return Binary((first.id, second.id), unifac, _scan((first, second)), MODEL_NAMES["unifac"], pair)
