"""The variational single-zeta model: identities, progress, cancellation and failure."""

import numpy as np
import pytest

from zeffir.core import ModelError, parse_spec
from zeffir.core.energy import configuration_energy
from zeffir.core.models._variational import (
    OptimisationCancelled,
    OptimisationError,
    VariationalModel,
    optimise_exponents,
)
from zeffir.core.orbitals import SlaterExpansionRadial


@pytest.fixture(scope="module")
def carbon():
    return VariationalModel().build(parse_spec("C"))


def test_model_fills_the_orbital_set(carbon):
    assert carbon.model == "variational"
    assert carbon.labels == ("1s", "2s", "2p")
    for orbital in carbon.orbitals:
        assert orbital.n_star == orbital.n
        assert orbital.z_eff == pytest.approx(orbital.zeta * orbital.n, rel=1e-15)
        assert orbital.energy is not None and orbital.energy < 0  # ⟨φ|F|φ⟩, see test_orbital_energies.py
    assert isinstance(carbon.orbital("2s").radial, SlaterExpansionRadial)
    assert carbon.orbital("2s").notes


def test_model_orbitals_are_orthonormal(carbon):
    from scipy import integrate

    t = np.linspace(0.0, np.sqrt(60.0), 20001)
    r = t * t
    p1, p2 = (carbon.orbital(x).radial.p(r) for x in ("1s", "2s"))
    assert integrate.simpson(p1 * p2 * 2 * t, x=t) == pytest.approx(0.0, abs=1e-10)
    assert integrate.simpson(p2 * p2 * 2 * t, x=t) == pytest.approx(1.0, abs=1e-10)
    assert carbon.orbital("2s").radial.nodes().size == 1


def test_total_energy_is_reproduced_by_the_energy_module(carbon):
    # The model orthogonalises analytically (Cholesky of the overlap matrix); the energy
    # module re-orthogonalises on its grid, which must leave the functions as they are.
    assert configuration_energy(carbon).total == pytest.approx(carbon.total_energy, abs=1e-8)


@pytest.mark.parametrize("spec", ["He", "Li", "C", "O"])
def test_virial_ratio_is_two_at_the_optimum(spec):
    # Scaling every ζ by one factor is among the variations, so -V/T = 2 (virial theorem;
    # Slater 1960, vol. I §6). The stationarity tolerance keeps the error below ~1e-7.
    result = optimise_exponents(parse_spec(spec))
    assert result.virial_ratio == pytest.approx(2.0, abs=1e-6)


def test_optimum_is_lower_than_its_neighbours():
    conf = parse_spec("N")
    result = optimise_exponents(conf)
    shifted = list(result.zetas)
    shifted[2] *= 1.01
    from zeffir.core.models._variational import orthogonalised_radials
    from zeffir.core.orbitals import OrbitalSet, SubshellOrbital

    subshells = tuple(s for s, _ in conf.occupations)
    radials = orthogonalised_radials(subshells, tuple(shifted))
    orbitals = OrbitalSet(conf, "test", tuple(
        SubshellOrbital(s, occ, rad, 1.0, 1.0, None, None)
        for (s, occ), rad in zip(conf.occupations, radials, strict=True)))
    assert configuration_energy(orbitals).total > result.energy + 1e-7


def test_progress_reports_every_iteration():
    states = []
    result = optimise_exponents(parse_spec("Be"), progress=states.append)
    assert len(states) >= 2
    assert [s.iteration for s in states] == sorted(s.iteration for s in states)
    assert states[-1].energy >= result.energy - 1e-12


def test_should_stop_cancels_with_the_last_state():
    calls = []

    def stop():
        calls.append(1)
        return len(calls) > 5

    with pytest.raises(OptimisationCancelled) as caught:
        optimise_exponents(parse_spec("O"), should_stop=stop)
    assert isinstance(caught.value, ModelError)
    assert caught.value.state is not None and len(caught.value.state.zetas) == 3


def test_unbound_electron_raises_with_state():
    # H⁻ 1s 2s ³S: the 2s electron of a triplet is not bound to H (H⁻ has a single bound state
    # of natural parity, its 1s² ¹S ground state: R. N. Hill, Phys. Rev. Lett. 38, 643 (1977)),
    # so its exponent runs to the lower bound: an error, never a result.
    with pytest.raises(OptimisationError, match="2s ran to its bound") as caught:
        optimise_exponents(parse_spec("H- 1s1 2s1"))
    assert isinstance(caught.value, ModelError)
    assert caught.value.state.zetas[0] == pytest.approx(1.0, abs=1e-3)  # bare hydrogen 1s left


def test_open_shell_mixes_same_l_orbitals():
    # Li 1s² 2s: the determinant depends on how 1s and 2s functions mix (one 2s electron),
    # so the optimum has a non-zero angle and the 1s orbital carries some 2s function.
    result = optimise_exponents(parse_spec("Li"))
    assert list(result.mixing) == [(0, 1)]
    assert 1e-3 < abs(result.mixing[(0, 1)]) < 0.1
    assert isinstance(result.radials[0], SlaterExpansionRadial)
    # Closed 1s² 2s² in carbon: no angle, a pure 1s function.
    assert optimise_exponents(parse_spec("C")).mixing == {}


def test_lithium_model_energy_is_reproduced_by_the_energy_module():
    lithium = VariationalModel().build(parse_spec("Li"))
    assert configuration_energy(lithium).total == pytest.approx(lithium.total_energy, abs=1e-8)
