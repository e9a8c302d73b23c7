"""Screening models against published values."""

import pytest

from zeffir.core import build, parse_spec
from zeffir.core.config import Subshell
from zeffir.core.models import clementi_z_eff, slater_screening


def test_slater_nitrogen_2p():
    # J. C. Slater, Phys. Rev. 36, 57 (1930): N 2p, σ = 4×0.35 + 2×0.85 = 3.10, Z_eff = 3.90.
    assert build("N", "slater").orbital("2p").z_eff == pytest.approx(3.90, abs=1e-12)


@pytest.mark.parametrize(
    ("spec", "label", "z_eff"),
    [
        # Slater's rules (Slater, Phys. Rev. 36, 57 (1930)) evaluated by hand, the screening
        # written out term by term: same group 0.35 (1s: 0.30); for an s or p electron 0.85
        # per electron in shell n-1 and 1.00 further in; for a d electron 1.00 per electron
        # in every group before its own.
        ("Zn", "3d", 30 - (9 * 0.35 + 18 * 1.00)),          # 8.85
        ("Zn", "4s", 30 - (0.35 + 18 * 0.85 + 10 * 1.00)),  # 4.35
        ("Fe", "4s", 26 - (0.35 + 14 * 0.85 + 10 * 1.00)),  # 3.75
        ("He", "1s", 2 - 0.30),                             # 1.70
        ("Na", "3s", 11 - (8 * 0.85 + 2 * 1.00)),           # 2.20
    ],
)
def test_slater_rules_worked_examples(spec, label, z_eff):
    assert build(spec, "slater").orbital(label).z_eff == pytest.approx(z_eff, abs=1e-12)


def test_slater_n_star_and_zeta():
    # Slater 1930: n* = 3.7 for n = 4; ζ = Z_eff / n*.
    k4s = build("K", "slater").orbital("4s")
    assert k4s.n_star == 3.7
    assert k4s.zeta == pytest.approx(k4s.z_eff / 3.7, rel=1e-15)


def test_screening_ignores_electrons_to_the_right():
    # An excited 4d electron of Na is screened fully by the [Ne] core and by nothing else.
    assert slater_screening(parse_spec("Na [Ne] 4d1"), Subshell(4, 2)) == pytest.approx(10.0)


@pytest.mark.parametrize(
    ("symbol", "label", "z_eff"),
    [
        # E. Clementi and D. L. Raimondi, J. Chem. Phys. 38, 2686 (1963), Table I.
        ("C", "2p", 3.1358),
        ("Na", "3s", 2.5074),
        ("He", "1s", 1.6875),
    ],
)
def test_clementi_raimondi_values(symbol, label, z_eff):
    orbital = build(symbol, "clementi").orbital(label)
    assert orbital.z_eff == pytest.approx(z_eff, abs=5e-5)  # the paper prints 4 decimals
    assert orbital.zeta == pytest.approx(z_eff / orbital.n, abs=5e-5)
    assert orbital.notes == ()


def test_clementi_covers_z_up_to_86_and_falls_back_beyond():
    # Clementi, Raimondi & Reinhardt, J. Chem. Phys. 47, 1300 (1967) extends the table to Z = 86.
    assert clementi_z_eff(86, Subshell(6, 1)) is not None
    radium = build("Ra", "clementi")
    assert all("Slater's rules used" in " ".join(o.notes) for o in radium.orbitals)
    excited = build("Na [Ne] 4d1", "clementi")
    assert "Slater's rules used" in " ".join(excited.orbital("4d").notes)
    assert excited.notes  # the neutral-atom exponents are flagged for an excited configuration
