"""The equation forms of solutes, declared as :mod:`service.fluids.forms` declares the fluids' forms.

Two kinds: the water activity of a solution (:data:`SOLUTE_FORMS`) and its density
(:data:`SOLUTION_DENSITY_FORMS`). A solute file's ``water_activity`` and ``density`` tables name
one of them; the builders turn a validated table into the physics of
:mod:`service.physics.solutions` and :mod:`service.physics.solution_density`.
"""

from __future__ import annotations

from collections.abc import Callable
from dataclasses import dataclass

from marshmallow import ValidationError

from service.fluids.forms import Check, Coefficient, Form, Table, by_key, numbers
from service.physics.solution_density import CondeDensity, OlssonDensity, SolutionDensity
from service.physics.solutions import Conde, Olsson, PatekKlomfar, Sharqawy, SoluteEquation, Sparrow, StarzakPeacock


@dataclass(frozen=True, kw_only=True)
class SoluteForm(Form):
    """A water-activity form of a solute; ``build`` takes the table and the solute's molar mass [kg/mol]."""

    build: Callable[[Table, float], SoluteEquation]


@dataclass(frozen=True, kw_only=True)
class SolutionDensityForm(Form):
    """A density form of a solution; ``build`` takes the table."""

    build: Callable[[Table], SolutionDensity]


def _starzak_peacock(table: Table, molar_mass: float) -> SoluteEquation:
    return StarzakPeacock(energy=table["Q"], b=table["b"], c=table["c"], molar_mass=molar_mass)


def _sharqawy(table: Table, _: float) -> SoluteEquation:
    return Sharqawy(a=tuple(table["a"]), b=tuple(table["b"]))


def _patek_klomfar(table: Table, molar_mass: float) -> SoluteEquation:
    return PatekKlomfar(
        a=tuple(table["a"]), m=tuple(table["m"]), n=tuple(table["n"]), t=tuple(table["t"]), molar_mass=molar_mass
    )


def _conde(table: Table, _: float) -> SoluteEquation:
    return Conde(pi=tuple(table["pi"]))


def _sparrow(table: Table, _: float) -> SoluteEquation:
    return Sparrow(rows=tuple(tuple(table[name]) for name in "ABCDE"))


def _olsson(table: Table, _: float) -> SoluteEquation:
    return Olsson(k=tuple(table["k"]), l=tuple(table["l"]), m=tuple(table["m"]))


def _lists_of(*lengths: tuple[str, int]) -> tuple[Coefficient, ...]:
    """List coefficients of a fixed length each (a form's table of terms)."""
    return tuple(Coefficient(name, kind="list", most=length) for name, length in lengths)


def _same_lengths(*names: str) -> Check:
    def check(table: Table) -> None:
        lengths = {len(table[name]) for name in names}
        if len(lengths) > 1:
            raise ValidationError(f"{', '.join(names)} need one length", names[-1])

    return check


def _exact_lengths(**lengths: int) -> Check:
    def check(table: Table) -> None:
        for name, length in lengths.items():
            if len(table[name]) != length:
                raise ValidationError(f"needs {length} numbers", name)

    return check


def _olsson_density(table: Table) -> SolutionDensity:
    return OlssonDensity(k=tuple(table["k"]), l=tuple(table["l"]), m=tuple(table["m"]))


def _conde_density(table: Table) -> SolutionDensity:
    return CondeDensity(rho=tuple(table["rho"]))


SOLUTE_FORMS = by_key(
    SoluteForm(
        key="starzak-peacock",
        name="Starzak-Peacock water-activity equation",
        equation="ln(gamma_w) = Q/(R T) x_s**2 (1 + b x_s + c x_s**2), a_w = gamma_w (1 - x_s), Q in J/mol",
        coefficients=numbers("Qbc"),
        build=_starzak_peacock,
    ),
    SoluteForm(
        key="sharqawy-2010",
        name="Sharqawy-Lienhard-Zubair boiling-point elevation",
        equation="BPE = A S**2 + B S, A = (a0 + a1 t + a2 t**2) 1e-6, B = (b0 + b1 t + b2 t**2) 1e-3, S in g/kg, "
        "t in degC",
        coefficients=_lists_of(("a", 3), ("b", 3)),
        checks=(_exact_lengths(a=3, b=3),),
        build=_sharqawy,
    ),
    SoluteForm(
        key="patek-klomfar",
        name="Patek-Klomfar vapor-pressure equation",
        equation="p = p_w(T - sum a_i x**m_i (0.4 - x)**n_i (T/Tc)**t_i), x the solute's mole fraction",
        coefficients=_lists_of(("a", 12), ("m", 12), ("n", 12), ("t", 12)),
        checks=(_same_lengths("a", "m", "n", "t"),),
        build=_patek_klomfar,
    ),
    SoluteForm(
        key="conde-2004",
        name="Conde relative vapor-pressure equation",
        equation="a_w = pi_25(w) (A(w) + B(w) T/647.26 K), with pi0 to pi9",
        coefficients=_lists_of(("pi", 10)),
        checks=(_exact_lengths(pi=10),),
        build=_conde,
    ),
    SoluteForm(
        key="sparrow-2003",
        name="Sparrow vapor-pressure equation",
        equation="p/MPa = A + B t + C t**2 + D t**3 + E t**4, each a quartic in the mass fraction, t in degC",
        coefficients=_lists_of(*((name, 5) for name in "ABCDE")),
        checks=(_exact_lengths(**dict.fromkeys("ABCDE", 5)),),
        build=_sparrow,
    ),
    SoluteForm(
        key="olsson-1997",
        name="Olsson-Jernqvist-Aly vapor-pressure equation",
        equation="ln(p/kPa) = (a1 + a2 t)/(t - a3), a_i polynomials in ln(1 - w) with coefficients k, l, m, t in degC",
        coefficients=_lists_of(("k", 12), ("l", 12), ("m", 12)),
        build=_olsson,
    ),
)
"""The water-activity forms of solutes by key."""


def solute_equation_from_entry(table: Table, molar_mass: float) -> SoluteEquation:
    """The water-activity equation of a validated ``water_activity`` table, molar mass [kg/mol]."""
    return SOLUTE_FORMS[table["form"]].build(table, molar_mass)


SOLUTION_DENSITY_FORMS = by_key(
    SolutionDensityForm(
        key="olsson-1997-density",
        name="Olsson-Jernqvist-Aly density equation",
        equation="rho = b1 + b2 t + b3 t**2 in kg/m3, b_i = sum_j c_ij xi**(j/2), j = 0 to 5, with coefficients k, l, "
        "m, xi the mass fraction of water, t in degC",
        coefficients=_lists_of(("k", 6), ("l", 6), ("m", 6)),
        checks=(_exact_lengths(k=6, l=6, m=6),),
        build=_olsson_density,
    ),
    SolutionDensityForm(
        key="conde-2004-density",
        name="Conde density equation",
        equation="rho = rho_w(T) sum_i rho_i (w/(1 - w))**i, rho_w saturated liquid water",
        coefficients=_lists_of(("rho", 8)),
        build=_conde_density,
    ),
)
"""The density forms of solutions by key."""


def solution_density_from_entry(table: Table) -> SolutionDensity:
    """The density equation of a validated ``density`` table."""
    return SOLUTION_DENSITY_FORMS[table["form"]].build(table)
