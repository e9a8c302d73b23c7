"""Roothaan–Hartree–Fock (closed shells, one open s, p or d subshell) against published energies."""

import pytest

from zeffir.core import parse_spec
from zeffir.core.config import Subshell
from zeffir.core.models._hartree_fock import solve, solve_closed_shell

# Total energies (hartree). Source: Koga et al., Int. J. Quantum Chem. 71, 491 (1999)
# (Slater-type Roothaan–Hartree–Fock), values as given to us by the project lead — these
# are what we rely on. From memory, they agree to every digit shown with the numerical
# Hartree–Fock limits of Bunge, Barrientos and Bunge, At. Data Nucl. Data Tables 53, 113
# (1993).
HARTREE_FOCK_ENERGIES = {
    "He": -2.861680,
    "Be": -14.573023,
    "Ne": -128.547098,
    "Mg": -199.614636,
    "Ar": -526.817513,
}


@pytest.fixture(scope="module")
def results():
    return {}


def _solve(results, spec):
    if spec not in results:
        results[spec] = solve_closed_shell(parse_spec(spec))
    return results[spec]


@pytest.mark.parametrize("spec", list(HARTREE_FOCK_ENERGIES))
def test_total_energies_reach_the_hartree_fock_limit(results, spec):
    # The table gives 6 decimals (±5e-7 from rounding). Our basis errors: He +2e-9,
    # Be -2e-7, Ne -1e-7, Mg -4e-7, Ar +7e-7 relative to the rounded values (negative
    # means below: the unrounded limits are lower, e.g. Be -14.5730232, Mg -199.6146364).
    # 1e-6 covers rounding plus basis error, ten times tighter than the 1e-5 we were asked.
    result = _solve(results, spec)
    assert result.energy == pytest.approx(HARTREE_FOCK_ENERGIES[spec], abs=1e-6)


@pytest.mark.parametrize("spec", list(HARTREE_FOCK_ENERGIES))
def test_virial_ratio_is_two(results, spec):
    # The exact Hartree–Fock solution satisfies -V/T = 2. The fixed even-tempered basis is
    # not rescaled to the variational optimum, so the ratio is off by about the basis
    # error; we reach |-V/T - 2| <= 1e-8 for these atoms, tested at 5e-8.
    result = _solve(results, spec)
    assert result.virial_ratio == pytest.approx(2.0, abs=5e-8)


# Heavier closed shells with occupied d subshells (hartree), each with the tolerance we
# test it at. Kr: from memory (numerical Hartree–Fock limit, Bunge, Barrientos and Bunge,
# At. Data Nucl. Data Tables 53, 113 (1993)), 6 decimals; we get -2752.0549770 (+4e-8),
# so 1e-6 covers the ±5e-7 rounding plus a basis error of the size seen for He–Ar.
# Xe: Koga et al., Int. J. Quantum Chem. 71, 491 (1999), as quoted in the issue, 5
# decimals (±5e-6 from rounding); we get -7232.1383604 (-4e-7), so 6e-6 is the rounding
# plus 1e-6. From memory the numerical limit is -7232.138364 (Bunge et al. 1993), 4e-6
# below us, also inside that tolerance. With the former p and d ratio β = 1.4 the
# errors were +6e-6 (Kr) and +6e-5 (Xe): both tests fail with that basis.
# Sr: from memory (Bunge et al. 1993), 6 decimals; we get -3131.5456859 (+1e-7). Its
# iteration diverged from the bare-nucleus start in the dense basis before the start in
# the reduced basis (START_LINEAR_DEPENDENCE) was added.
HEAVY_CLOSED_SHELLS = {
    "Kr": (-2752.054977, 1e-6),
    "Sr": (-3131.545686, 1e-6),
    "Xe": (-7232.13836, 6e-6),
}


@pytest.fixture(scope="module")
def heavy_results():
    # The heavier runs (Xe about 0.4 s) are solved once here.
    return {spec: solve_closed_shell(parse_spec(spec)) for spec in HEAVY_CLOSED_SHELLS}


@pytest.mark.parametrize("spec", list(HEAVY_CLOSED_SHELLS))
def test_heavier_closed_shells_reach_the_hartree_fock_limit(heavy_results, spec):
    energy, tolerance = HEAVY_CLOSED_SHELLS[spec]
    result = heavy_results[spec]
    assert result.energy == pytest.approx(energy, abs=tolerance)
    # -V/T - 2: Kr 2e-9, Sr 4e-10, Xe 8e-9; tested at 5e-8 like the lighter atoms.
    assert result.virial_ratio == pytest.approx(2.0, abs=5e-8)
    # Nothing dropped as linearly dependent (smallest overlap eigenvalue ~3e-10).
    assert sum(result.dropped.values()) == 0


@pytest.mark.parametrize(
    ("label", "energy", "tolerance"),
    [
        # Koga et al. 1999 as given to us by the lead: 6 decimals; we get -0.8504097.
        ("2p", -0.850410, 1e-6),
        # From memory (Bunge et al. 1993, numerical HF): Ne 1s -32.772443, 2s -1.930391.
        ("1s", -32.772443, 2e-6),
        ("2s", -1.930391, 2e-6),
    ],
)
def test_neon_orbital_energies(results, label, energy, tolerance):
    result = _solve(results, "Ne")
    n, l = int(label[0]), "spdf".index(label[1])
    assert result.orbital_energies[Subshell(n, l)] == pytest.approx(energy, abs=tolerance)


# Open shells (one open s or p subshell; energy of the Hund ground term), hartree.
# C, N, O: the numerical Hartree–Fock limits quoted to us in the issue (Koga et al., Int. J.
# Quantum Chem. 71, 491 (1999); Bunge, Barrientos and Bunge, At. Data Nucl. Data Tables 53,
# 113 (1993)). The others from memory (Bunge et al. 1993, numerical Hartree–Fock).
OPEN_SHELL_ENERGIES = {
    "Li": -7.432727,  # ²S, from memory
    "B": -24.529061,  # ²P, from memory
    "C": -37.688619,  # ³P, issue
    "N": -54.400934,  # ⁴S, issue
    "O": -74.809398,  # ³P, issue
    "F": -99.409349,  # ²P, from memory
    "Na": -161.858912,  # ²S, from memory
    "Al": -241.876707,  # ²P, from memory
    "P": -340.718781,  # ⁴S, from memory
    "Cl": -459.482072,  # ²P, from memory
}


@pytest.mark.parametrize("spec", list(OPEN_SHELL_ENERGIES))
def test_open_shell_energies_reach_the_hartree_fock_limit(spec):
    # We were asked for 1e-5. Our differences from the rounded values are 4e-8 to 5e-7
    # (C +4e-8, N -2e-7, O -5e-7, Li +7e-8); 1e-6 covers the ±5e-7 rounding of the
    # table plus a basis error of the size seen for the closed shells.
    result = solve(parse_spec(spec))
    assert result.energy == pytest.approx(OPEN_SHELL_ENERGIES[spec], abs=1e-6)
    # Virial ratio to about the basis error, as for closed shells (|-V/T - 2| <= 5e-9 here).
    assert result.virial_ratio == pytest.approx(2.0, abs=5e-8)


@pytest.mark.parametrize(
    ("spec", "label", "energy"),
    [
        # From memory, 5 decimals (Clementi and Roetti, At. Data Nucl. Data Tables 14, 177
        # (1974)): C 2p -0.43334, N 2p -0.56759, O 2p -0.63191, Li 2s -0.19632.
        ("C", "2p", -0.43334),
        ("N", "2p", -0.56759),
        ("O", "2p", -0.63191),
        ("Li", "2s", -0.19632),
    ],
)
def test_open_shell_orbital_energies(spec, label, energy):
    # The open subshell's ε is the diagonal element of its own Fock operator (per electron).
    # 1e-5: the ±5e-6 rounding of 5 decimals plus our basis error (we get C -0.4333405,
    # N -0.5675889, O -0.6319062, Li -0.1963228).
    result = solve(parse_spec(spec))
    n, l = int(label[0]), "spdf".index(label[1])
    assert result.orbital_energies[Subshell(n, l)] == pytest.approx(energy, abs=1e-5)


# One open d subshell (Hund ground term), hartree: numerical Hartree–Fock limits from
# memory (Bunge, Barrientos and Bunge, At. Data Nucl. Data Tables 53, 113 (1993); Koga et
# al., Int. J. Quantum Chem. 71, 491 (1999)), as quoted to us by the lead, 6 decimals.
# We get Sc -759.7357180 (+7e-9), Ti -848.4059969 (+6e-8), V -942.8843377 (-7e-7),
# Mn -1149.8662517 (+3e-7), Fe -1262.4436653 (-3e-7), Co -1381.4145529 (+1e-7),
# Ni -1506.8709081 (-8e-8), in 15–16 iterations each.
OPEN_D_SHELL_ENERGIES = {
    "Sc": -759.735718,  # 3d1 4s2 ²D
    "Ti": -848.405997,  # 3d2 4s2 ³F
    "V": -942.884337,  # 3d3 4s2 ⁴F
    "Mn": -1149.866252,  # 3d5 4s2 ⁶S
    "Fe": -1262.443665,  # 3d6 4s2 ⁵D
    "Co": -1381.414553,  # 3d7 4s2 ⁴F
    "Ni": -1506.870908,  # 3d8 4s2 ³F
}


# Several open subshells, the Hund ground term as one determinant (hartree), and one
# open s outside a full d shell. All from memory (numerical Hartree–Fock limits, Bunge,
# Barrientos and Bunge, At. Data Nucl. Data Tables 53, 113 (1993)), 6 decimals. We get
# Cr -1043.3563763 (-3e-7), Cu -1638.9637421 (-1e-7), Nb -3753.5977274 (+6e-7),
# Mo -3975.5494992 (-2e-7), in 15–21 iterations.
SEVERAL_OPEN_SUBSHELLS = {
    "Cr": -1043.356376,  # 3d5 4s1 ⁷S
    "Cu": -1638.963742,  # 3d10 4s1 ²S
    "Nb": -3753.597728,  # 4d4 5s1 ⁶D
    "Mo": -3975.549499,  # 4d5 5s1 ⁷S
}


@pytest.mark.parametrize("spec", [*OPEN_D_SHELL_ENERGIES, *SEVERAL_OPEN_SUBSHELLS])
def test_open_d_shells_and_several_open_subshells_reach_the_hartree_fock_limit(spec):
    # We were asked for 1e-5; all eleven lie within 7e-7 of the rounded values, so 1e-6
    # (the ±5e-7 rounding plus a basis error of the size seen for lighter atoms) holds.
    result = solve(parse_spec(spec))
    assert result.energy == pytest.approx({**OPEN_D_SHELL_ENERGIES, **SEVERAL_OPEN_SUBSHELLS}[spec], abs=1e-6)
    # |-V/T - 2| <= 5e-10 for these; tested at 5e-8 as for the other atoms.
    assert result.virial_ratio == pytest.approx(2.0, abs=5e-8)


# Closed shells with a full 4f (hartree), from memory (numerical Hartree–Fock limits, Bunge
# et al. 1993 for Yb; the Rn value as we recall it from the same kind of table). We get
# Yb -13391.4561826 (+1.0e-5) and Rn -21866.7722128 (+2.8e-5): above the recalled limits
# by more than for the lighter atoms. Varying the d set moved Rn by 1.2e-5 before the
# denser d set now used (2Z, β = 1.25); further variations of the s, p and f sets move
# it by less than 5e-6 Eh, up and down, at the rounding floor of a -2e4 Eh energy. We
# test at 5e-5 and say so: this lies outside the 1e-5 asked for He–Xe.
F_CLOSED_SHELLS = {
    "Yb": -13391.456193,
    "Rn": -21866.772241,
}


@pytest.mark.parametrize("spec", list(F_CLOSED_SHELLS))
def test_closed_shells_with_a_full_f_subshell(spec):
    result = solve_closed_shell(parse_spec(spec))
    assert result.energy == pytest.approx(F_CLOSED_SHELLS[spec], abs=5e-5)
    assert result.energy > F_CLOSED_SHELLS[spec] - 5e-6  # a basis-set energy lies above the limit
    assert result.virial_ratio == pytest.approx(2.0, abs=5e-8)


# Anions (hartree), from memory (numerical Hartree–Fock; e.g. Clementi and Roetti 1974 list
# the same to their precision): H⁻ -0.487930, F⁻ -99.459454. We get -0.4879297 and
# -99.4594539. H⁻ lies above the hydrogen atom (-0.5): unbound at the Hartree–Fock level.
@pytest.mark.parametrize(("spec", "energy"), [("H-", -0.487930), ("F-", -99.459454)])
def test_anions(spec, energy):
    result = solve(parse_spec(spec))
    assert result.energy == pytest.approx(energy, abs=1e-6)
    assert result.virial_ratio == pytest.approx(2.0, abs=5e-8)
