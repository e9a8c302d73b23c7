"""The self-consistent LDA atom: its energy parts, electron count, paths and cancellation."""

from __future__ import annotations

import math

import numpy as np
import pytest

from zeffir.core import cancellation, parse_spec, progress_reporting, set_compiled_solvers
from zeffir.core._errors import ComputationCancelled
from zeffir.core.dft._lda_atom import solve_lda
from zeffir.core.dft._xc import lda_xc


def test_parts_add_up_and_the_electrons_are_all_there():
    result = solve_lda(parse_spec("Ar"))
    assert result.kinetic + result.nuclear + result.hartree + result.xc == pytest.approx(
        result.total_energy, abs=1e-9)
    r = result.grid.r
    q = sum(f * s.u**2 for f, s in zip(result.occupations, result.orbitals, strict=True))
    assert result.grid.integrate(q) == pytest.approx(18.0, abs=1e-9)
    assert result.kinetic > 0 > result.nuclear and result.hartree > 0 > result.xc
    assert [s.energy for s in result.orbitals] == sorted(s.energy for s in result.orbitals)  # 1s<2s<2p<3s<3p
    assert r[0] < 1e-7


def test_compiled_and_plain_paths_agree():
    before = set_compiled_solvers(False)
    try:
        plain = solve_lda(parse_spec("Na")).total_energy
    finally:
        set_compiled_solvers(before)
    assert solve_lda(parse_spec("Na")).total_energy == pytest.approx(plain, abs=1e-10)


def test_progress_and_cancellation():
    lines: list[str] = []
    with progress_reporting(lines.append):
        solve_lda(parse_spec("C"))
    assert lines and all("LDA iteration" in line for line in lines)
    with cancellation(lambda: True), pytest.raises(ComputationCancelled, match="cancelled"):
        solve_lda(parse_spec("C"))


def test_exchange_correlation_is_the_derivative_of_its_energy_density():
    # v_xc = d(ρ ε_xc)/dρ, checked by central differences over six decades of density;
    # ε_x = −(3/4)(3/π)^{1/3} ρ^{1/3} exactly (Dirac 1930).
    rho = np.geomspace(1e-5, 1e3, 9)
    eps, pot = lda_xc(rho)
    step = rho * 1e-6
    plus, _ = lda_xc(rho + step)
    minus, _ = lda_xc(rho - step)
    numeric = ((rho + step) * plus - (rho - step) * minus) / (2 * step)
    np.testing.assert_allclose(pot, numeric, rtol=1e-7)
    eps_x_only = -0.75 * (3 / math.pi) ** (1 / 3) * rho ** (1 / 3)
    assert np.all(eps < eps_x_only)  # correlation lowers the energy
    assert lda_xc(np.array([0.0]))[0][0] == 0.0


def test_an_unbound_anion_is_refused_with_the_reason():
    # LDA's self-interaction error leaves the extra electron of H⁻ and F⁻ with a positive
    # eigenvalue (a well-known failure of the local approximation for anions).
    from zeffir.core import ModelError, build

    for spec, label in (("H-", "1s"), ("F-", "2p")):
        with pytest.raises(ModelError, match=f"the {label} electron is not bound in LDA"):
            build(spec, "lda")
    assert build("F", "lda").orbital("2p").energy < 0
