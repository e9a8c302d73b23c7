"""The three pair panels formed together equal the functions that form them one by one.

For a single determinant ρ2^{σσ}(r1, r2) = ρ^σ(r1)ρ^σ(r2) − |γ^σ(r1, r2)|² and
ρ2^{σ,−σ}(r1, r2) = ρ^σ(r1)ρ^{−σ}(r2) (McWeeny, Methods of Molecular Quantum Mechanics,
2nd ed., 1989, §5.5), so one |γ|² serves the same-spin panel and the exchange hole.
"""

from __future__ import annotations

import numpy as np
import pytest

from zeffir.core import Plane, ZeffirError, build
from zeffir.core.pairs import (
    DOWN,
    UP,
    exchange_hole_on_plane,
    pair_density_on_plane,
    parse_determinant,
    reference_panels_on_plane,
    spin_density,
)


@pytest.mark.parametrize(("spec", "model", "spin", "r1"), [
    ("O", "slater", UP, (0.3, -0.1, 0.5)),
    ("O", "slater", DOWN, (0.0, 0.2, 0.6)),
    ("Fe", "hartree-fock", UP, (0.4, 0.3, -0.2)),
    ("Ne", "clementi", DOWN, (0.0, 0.0, 0.5)),
])
def test_panels_equal_the_separate_functions(spec, model, spin, r1):
    orbitals = build(spec, model)
    plane = Plane.named("xz", extent=3.0, resolution=33, offset=0.15)
    panels = reference_panels_on_plane(orbitals, plane, r1, spin)
    rho = float(spin_density(orbitals, np.array([r1]), spin)[0])
    assert panels.reference_density == pytest.approx(rho, rel=1e-12)
    same = pair_density_on_plane(orbitals, plane, r1, (spin, spin)) / rho
    other = pair_density_on_plane(orbitals, plane, r1, (spin, -spin)) / rho
    hole = exchange_hole_on_plane(orbitals, plane, r1, spin)
    scale = float(np.max(np.abs(same)))
    np.testing.assert_allclose(panels.same_spin, same, rtol=0, atol=1e-12 * scale)
    np.testing.assert_allclose(panels.opposite_spin, other, rtol=0, atol=1e-12 * scale)
    np.testing.assert_allclose(panels.exchange_hole, hole, rtol=0, atol=1e-12 * scale)


def test_a_chosen_determinant_is_used():
    orbitals = build("C", "slater")
    plane = Plane.named("xy", extent=2.0, resolution=17)
    chosen = parse_determinant(orbitals.configuration, "2p: 1u -1u")
    r1 = (0.4, 0.2, 0.1)
    panels = reference_panels_on_plane(orbitals, plane, r1, UP, chosen)
    hole = exchange_hole_on_plane(orbitals, plane, r1, UP, chosen)
    np.testing.assert_allclose(panels.exchange_hole, hole, rtol=1e-12, atol=1e-14)


def test_no_density_at_the_reference_is_refused():
    # Hydrogen's one electron is spin up: a spin-down reference electron has no density.
    plane = Plane.named("xz", extent=2.0, resolution=9)
    with pytest.raises(ZeffirError, match="down"):
        reference_panels_on_plane(build("H"), plane, (0.0, 0.0, 0.5), DOWN)
