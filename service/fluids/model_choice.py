"""Which activity model answers a mixture: fitted pairs, a group prediction, or Raoult's law where asked for.

Also the refusals that depend on the mixture's make-up alone: a component named twice, fewer than two, and
acids that associate in the vapor (the ideal-vapor law does not hold for them).
"""

from __future__ import annotations

from collections.abc import Mapping, Sequence

from service.fluids.cautions import literal
from service.fluids.fluid import Fluid
from service.fluids.groups import GroupTable
from service.fluids.limits import Refusal
from service.fluids.mixture import MODEL_NAMES, Binary, Mixture, Model
from service.fluids.pairs import PairModel, PairSet
from service.fluids.two_liquids import Judge

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
        return _ideal_mixture(tuple(components), pair_sets, tables)
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
        return _group_mixture(tuple(components), tables["unifac"], notes, tables)
    return _group_mixture(tuple(components), tables[model], (), tables)


def _group_mixture(
    components: tuple[Fluid, ...], table: GroupTable, notes: tuple[str, ...], tables: Mapping[str, GroupTable]
) -> Mixture:
    activity = table.model(components)
    binaries = tuple(
        Binary((a.id, b.id), _judges(a, b, tables, _group_judge(table, a, b)))
        for i, a in enumerate(components)
        for b in components[i + 1 :]
    )
    return Mixture(components, table.form, activity, binaries, notes, table)  # type: ignore[arg-type]


def _ideal_mixture(
    components: tuple[Fluid, ...], pair_sets: Mapping[PairModel, PairSet], tables: Mapping[str, GroupTable]
) -> Mixture:
    binaries = tuple(
        Binary((a.id, b.id), _judges(a, b, tables, _fitted_judge(pair_sets, (a.id, b.id))))
        for i, a in enumerate(components)
        for b in components[i + 1 :]
    )
    return Mixture(components, "ideal", None, binaries, (IDEAL_NOTE, *_untested(binaries)))


def _group_judge(table: GroupTable, first: Fluid, second: Fluid) -> Judge:
    return Judge(MODEL_NAMES[table.form], table.model([first, second]), _scan((first, second)), table.source)


def _judges(first: Fluid, second: Fluid, tables: Mapping[str, GroupTable], own: Judge | None) -> tuple[Judge, ...]:
    """``own`` (else original UNIFAC, for a model that cannot show two liquids), and modified UNIFAC (Dortmund)
    beside it, where each has the pair's groups. A split is refused only where every judge predicts it: sets
    fitted to vapor-liquid data, and original UNIFAC, predict splits that do not exist (1-propanol and water, by
    ChemSep's UNIQUAC set), and Dortmund's parameters were fitted to liquid-liquid data too (Weidlich and
    Gmehling 1987)."""
    found = [own] if own else []
    for form in ("unifac", "unifac-dortmund") if own is None else ("unifac-dortmund",):
        if own and own.name == MODEL_NAMES[form]:
            continue  # the model is Dortmund itself
        try:
            found.append(_group_judge(tables[form], first, second))
        except Refusal:  # no groups for the pair, or a pair the method answers badly: that judge is absent
            continue
    return tuple(found)


def _untested(binaries: tuple[Binary, ...]) -> tuple[str, ...]:
    """A caution per pair that no model at hand tests for two liquid phases."""
    return tuple(
        f"No model at hand tests {' and '.join(literal(i) for i in b.ids)} for two liquid phases (no fitted pair, "
        "and the group methods have no groups for it or are not used for it): the answer assumes one liquid."
        for b in binaries
        if not b.judges
    )


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
    activity = chosen.activity([f.id for f in components])
    return Mixture(components, chosen.model, activity, binaries, _untested(binaries), pair_set=chosen)


def _binary(
    chosen: PairSet,
    first: Fluid,
    second: Fluid,
    pair_sets: Mapping[PairModel, PairSet],
    tables: Mapping[str, GroupTable],
) -> Binary:
    """The pair of ``first`` and ``second`` the answer uses, with the judges of two liquid phases: the pair's own
    set, or for Wilson (which cannot show them) the same pair's NRTL or UNIQUAC set, else UNIFAC; and Dortmund."""
    ids = (first.id, second.id)
    own = _fitted_judge({chosen.model: chosen} if chosen.model != "wilson" else pair_sets, ids)
    return Binary(ids, _judges(first, second, tables, own), chosen.pairs[frozenset(ids)])


def _fitted_judge(pair_sets: Mapping[PairModel, PairSet], ids: tuple[str, str]) -> Judge | None:
    """The pair's NRTL set as a judge of two liquid phases, else its UNIQUAC set (Wilson's and Raoult's law cannot
    show them), over the set's stated range widened by ``SPLIT_MARGIN``; None where neither has the pair."""
    for model in ("nrtl", "uniquac"):
        judge = pair_sets.get(model)
        pair = judge.pairs.get(frozenset(ids)) if judge else None
        if judge and pair:
            scan = (pair.t_min - SPLIT_MARGIN, pair.t_max + SPLIT_MARGIN)
            return Judge(MODEL_NAMES[model], judge.activity(ids), scan, pair.source)
    return None
