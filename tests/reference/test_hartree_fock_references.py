"""Roothaan–Hartree–Fock (closed shells, one or several open subshells) against published energies.

Published values: T. Koga, K. Kanayama, S. Watanabe and A. J. Thakkar, Int. J. Quantum Chem. 71,
491 (1999), and T. Koga, K. Kanayama, T. Watanabe et al., Theor. Chem. Acc. 104, 411 (2000), read
from tests/reference/data/koga_rhf_energies.csv (its header names the copies the digits were
checked against). Koga's energies are those of optimised Slater-type basis sets; Zeffir's basis
is even-tempered, so the two agree within the basis error of either, not to every digit.

Where no published value could be traced, the expected value is a regression value (computed by
Zeffir, not published), and is marked so beside it.
"""

import pytest
from reference_data import rows

from zeffir.core import parse_spec
from zeffir.core.config import Subshell
from zeffir.core.models.hartree_fock import solve, solve_closed_shell

KOGA = rows("koga_rhf_energies.csv")
KOGA_1999_ENERGIES = {row["symbol"]: float(row["value_hartree"]) for row in KOGA
                      if row["quantity"] == "E" and row["paper"] == "koga1999"}
KOGA_2000_ENERGIES = {row["symbol"]: float(row["value_hartree"]) for row in KOGA
                      if row["quantity"] == "E" and row["paper"] == "koga2000"}
KOGA_ORBITAL_ENERGIES = {(row["symbol"], row["quantity"]): float(row["value_hartree"])
                         for row in KOGA if row["quantity"] != "E"}

CLOSED_SHELLS = {"He", "Be", "Ne", "Mg", "Ar", "Kr", "Sr", "Xe", "Yb", "Rn"}


def regression_tolerance(energy: float) -> float:
    """Tolerance on a regression value (Zeffir's own energy, 10 decimals), hartree.

    The SCF stops once the energy changes by less than 1e-11 Eh between iterations, and a
    different BLAS or numpy moves a converged energy by rounding only (about 1e-12 of |E|;
    Og, the heaviest atom, scatters by 1e-7 Eh). A change of basis or of the iteration
    moves these energies by 1e-6 Eh or more (the former p and d ratio β = 1.4 gave Kr
    +6e-6 and Xe +6e-5 Eh). 1e-7 Eh, or 1e-10 of |E| for the heaviest atoms, lies between.
    """
    return max(1e-7, 1e-10 * abs(energy))


@pytest.fixture(scope="module")
def results():
    return {}


def _solve(results, spec):
    if spec not in results:
        solver = solve_closed_shell if spec in CLOSED_SHELLS else solve
        results[spec] = solver(parse_spec(spec))
    return results[spec]


def _orbital_energy(result, label):
    n, l = int(label[0]), "spdf".index(label[1])
    return result.orbital_energies[Subshell(n, l)]


@pytest.mark.parametrize("spec", sorted(KOGA_1999_ENERGIES))
def test_total_energies_match_koga_1999(results, spec):
    # Koga et al. give 9 decimals. Zeffir's even-tempered basis and their optimised STO
    # sets give energies within 1e-6 Eh of each other for these atoms: He +4e-10,
    # Be -7e-10, C -1e-9, Ne -3e-8, Al -5e-8, H⁻ 0, F⁻ -5e-9, Cu -9e-7 Eh (negative: Zeffir
    # lower, its basis the larger one there). Tested at 1e-6 Eh.
    result = _solve(results, spec)
    assert result.energy == pytest.approx(KOGA_1999_ENERGIES[spec], abs=1e-6)
    # The exact Hartree–Fock solution satisfies -V/T = 2. The fixed even-tempered basis is
    # not rescaled to the variational optimum, so the ratio is off by about the basis
    # error; |-V/T - 2| <= 1e-8 here, tested at 5e-8.
    assert result.virial_ratio == pytest.approx(2.0, abs=5e-8)


@pytest.mark.parametrize(("spec", "label"), sorted(KOGA_ORBITAL_ENERGIES))
def test_orbital_energies_match_koga_1999(results, spec, label):
    # Koga et al. give 7 decimals (±5e-8). An open subshell's ε is the diagonal element of
    # its own Fock operator (per electron), as in their tables. Zeffir's ε differ from
    # theirs by at most 1.2e-6 Eh (Cu 3d; Ne 1s 3e-7, Cu 4s 6e-7, the rest below 5e-7):
    # orbital energies carry the basis error to first order. Tested at 2e-6 Eh.
    result = _solve(results, spec)
    assert _orbital_energy(result, label) == pytest.approx(KOGA_ORBITAL_ENERGIES[(spec, label)], abs=2e-6)


# Regression values (computed by Zeffir, not published): total energies of the ground
# (Hund) term, hartree, 10 decimals. No published value of these could be traced to a copy
# of its table. For comparison, Zeffir's energies of the atoms above lie within 1e-6 Eh of
# Koga et al. 1999.
REGRESSION_ENERGIES = {
    # One open s or p subshell.
    "Li": -7.4327269296,  # ²S
    "B": -24.5290607272,  # ²P
    "N": -54.4009342079,  # ⁴S
    "O": -74.8093984694,  # ³P
    "F": -99.4093493854,  # ²P
    "Na": -161.8589116096,  # ²S
    "P": -340.7187809112,  # ⁴S
    "Cl": -459.4820719308,  # ²P
    # Closed shells.
    "Mg": -199.6146364118,
    "Ar": -526.8175122541,
    "Kr": -2752.0549769579,
    # Sr iterated to divergence from the bare-nucleus start in the dense basis before the
    # start in the reduced basis (START_LINEAR_DEPENDENCE) was added.
    "Sr": -3131.5456859230,
    "Xe": -7232.1383603651,
    # One open d subshell outside a closed 4s (15–16 iterations each).
    "Sc": -759.7357179927,  # 3d1 4s2 ²D
    "Ti": -848.4059969412,  # 3d2 4s2 ³F
    "V": -942.8843376968,  # 3d3 4s2 ⁴F
    "Mn": -1149.8662516741,  # 3d5 4s2 ⁶S
    "Fe": -1262.4436653442,  # 3d6 4s2 ⁵D
    "Co": -1381.4145528908,  # 3d7 4s2 ⁴F
    "Ni": -1506.8709080805,  # 3d8 4s2 ³F
    # Several open subshells, the Hund term as one determinant (15–21 iterations).
    "Cr": -1043.3563762673,  # 3d5 4s1 ⁷S
    "Nb": -3753.5977273538,  # 4d4 5s1 ⁶D
    "Mo": -3975.5494992024,  # 4d5 5s1 ⁷S
    # Closed shells with a full 4f.
    "Yb": -13391.4561826100,
    "Rn": -21866.7722130713,
}


@pytest.mark.parametrize("spec", list(REGRESSION_ENERGIES))
def test_total_energies_hold_their_regression_values(results, spec):
    expected = REGRESSION_ENERGIES[spec]
    result = _solve(results, spec)
    assert result.energy == pytest.approx(expected, abs=regression_tolerance(expected))
    # Virial ratio to about the basis error, as above (|-V/T - 2| <= 1e-8 for all of these).
    assert result.virial_ratio == pytest.approx(2.0, abs=5e-8)


@pytest.mark.parametrize("spec", ["Kr", "Sr", "Xe"])
def test_heavier_closed_shells_drop_no_basis_function(results, spec):
    # Nothing dropped as linearly dependent (smallest overlap eigenvalue ~3e-10).
    assert sum(_solve(results, spec).dropped.values()) == 0


@pytest.mark.parametrize("spec", sorted(KOGA_2000_ENERGIES))
def test_closed_shells_with_a_full_f_subshell_lie_below_koga_2000(results, spec):
    # Koga et al. 2000 (9 decimals) is a basis-set energy, an upper bound to the
    # Hartree–Fock limit; Zeffir's denser d set (2Z, β = 1.25) reaches lower, by 1.7e-4 Eh
    # (Yb) and 1.4e-4 Eh (Rn). Lower is not by itself right: the regression values above
    # pin the energies; this checks that Zeffir's basis is at least as good as the paper's.
    assert _solve(results, spec).energy < KOGA_2000_ENERGIES[spec]


# Regression values (computed by Zeffir, not published): orbital energies of open
# subshells, hartree, 8 decimals. ε converges with the commutator (below 1e-9 at the end of
# the SCF), so 1e-7 Eh leaves room for rounding only.
REGRESSION_ORBITAL_ENERGIES = {
    ("Li", "2s"): -0.19632283,
    ("N", "2p"): -0.56758894,
    ("O", "2p"): -0.63190617,
}


@pytest.mark.parametrize(("spec", "label"), list(REGRESSION_ORBITAL_ENERGIES))
def test_open_shell_orbital_energies_hold_their_regression_values(results, spec, label):
    expected = REGRESSION_ORBITAL_ENERGIES[(spec, label)]
    assert _orbital_energy(_solve(results, spec), label) == pytest.approx(expected, abs=1e-7)


def test_hydrogen_anion_is_unbound_at_the_hartree_fock_level(results):
    # H⁻ lies above the hydrogen atom (-0.5 Eh) in Hartree–Fock: Koga et al. 1999 give
    # -0.487929734 Eh; the bound H⁻ needs correlation.
    assert -0.5 < _solve(results, "H-").energy < -0.48


# Roothaan–Hartree–Fock limits of the heavier closed and open shells, hartree: C. F. Bunge,
# J. A. Barrientos and A. V. Bunge, At. Data Nucl. Data Tables 53, 113 (1993), 6 decimals
# (the figures as recalled from that table; Kr agrees with the fully numerical
# −2752.05497735 of S. Lehtola, Int. J. Quantum Chem. 119, e25945 (2019)). Zeffir's
# even-tempered basis reaches them to within 1e-6 Eh up to Kr; from Rb to Xe it leaves a
# few µEh, the gap README states per atom. The test pins that statement from both sides:
# never below the limit (a basis energy is an upper bound), never further above than said.
HEAVIER_LIMITS = {
    "Kr": (-2752.054977, 1e-6),
    "Ag": (-5197.698473, 4e-6),
    "Cd": (-5465.133143, 4e-6),
    "Xe": (-7232.138364, 4e-6),
}


@pytest.mark.parametrize("spec", list(HEAVIER_LIMITS))
def test_heavier_atoms_lie_within_the_stated_gap_above_the_limit(results, spec):
    limit, gap = HEAVIER_LIMITS[spec]
    energy = _solve(results, spec).energy
    assert limit - 5e-7 <= energy <= limit + gap, energy - limit


def test_silver_lies_below_koga_s_constrained_basis_energy(results):
    # Koga et al. 1999 (cusp- and asymptote-constrained functions): −5197.698467674 Eh, the
    # figure AtomDB's test suite asserts for its Ag file (theochem/AtomDB,
    # atomdb/test/test_wfn_slater.py); Zeffir's basis reaches 1.9e-6 Eh lower.
    assert _solve(results, "Ag").energy < -5197.698467674
