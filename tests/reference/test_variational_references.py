"""The variational single-zeta model against published and textbook values."""

import pytest

from zeffir.core import parse_spec
from zeffir.core.models import clementi_z_eff
from zeffir.core.models._variational import VariationalModel, optimise_exponents


@pytest.mark.parametrize(("spec", "Z"), [("H-", 1), ("He", 2), ("Li+", 3), ("Be2+", 4)])
def test_two_electron_ions_screened_by_five_sixteenths(spec, Z):
    # Standard textbook result: 1s² with one exponent has ζ = Z - 5/16, E = -(Z - 5/16)²
    # (He: 1.6875, -2.84765625 Eh; H⁻: 0.6875, -0.47265625 Eh). The optimiser stops at
    # |dE/dln ζ| < 2e-7 Eh, so ζ is within ~1e-7 and E within ~1e-13; 1e-6 holds with room.
    result = optimise_exponents(parse_spec(spec))
    assert result.zetas[0] == pytest.approx(Z - 5 / 16, abs=1e-6)
    assert result.energy == pytest.approx(-((Z - 5 / 16) ** 2), abs=1e-6)


@pytest.mark.parametrize("spec", ["Li", "C", "N", "O", "Ne"])
def test_single_zeta_exponents_match_clementi_raimondi(spec):
    # E. Clementi and D. L. Raimondi, J. Chem. Phys. 38, 2686 (1963), Table I (via
    # resources/data/clementi_exponents.csv, z_eff = ζn). The table gives z_eff to four
    # decimals, i.e. ζ to ±5e-5/n from rounding; we find differences up to 8e-5 in ζ
    # (their optimisation was less tight than ours), hence 1.5e-4. Li checks the open-shell
    # mixing of 1s and 2s functions (without it 1s is 4e-3 off).
    built = VariationalModel().build(parse_spec(spec))
    Z = built.configuration.Z
    for orbital in built.orbitals:
        published, _source = clementi_z_eff(Z, orbital.subshell)
        assert orbital.zeta == pytest.approx(published / orbital.n, abs=1.5e-4), orbital.label


@pytest.mark.parametrize(("spec", "table_configuration"), [
    ("Cr", "Cr [Ar] 3d4 4s2"), ("Cu", "Cu [Ar] 3d9 4s2"),
])
def test_clementi_raimondi_cr_and_cu_rows_are_the_d_s2_configurations(spec, table_configuration):
    # E. Clementi and D. L. Raimondi, J. Chem. Phys. 38, 2686 (1963), Table I (via
    # resources/data/clementi_exponents.csv): their Cr and Cu exponents are reproduced by
    # this model in 3d⁴ 4s² and 3d⁹ 4s² (largest relative difference 1.4e-3, Cr 4s; Cu
    # 4.4e-4), as closely as their other rows are for Z = 2–36 (below 7e-4, As 4p
    # excepted), and missed by 15 % (Cr) and 21 % (Cu) in the 3d⁵ 4s¹ and 3d¹⁰ 4s¹ ground
    # configurations. Tested at 2e-3 and 0.1.
    def worst(text):
        configuration = parse_spec(text)
        result = optimise_exponents(configuration)
        return max(abs(zeta - clementi_z_eff(configuration.Z, sub)[0] / sub.n) / zeta
                   for (sub, _), zeta in zip(configuration.occupations, result.zetas, strict=True))

    assert worst(table_configuration) < 2e-3
    assert worst(spec) > 0.1
