"""The exchange hole integrates to −1 for every reference position (Parr and Yang,
Density-Functional Theory of Atoms and Molecules, 1989, §2.4)."""

from __future__ import annotations

import numpy as np
import pytest

from zeffir.core import build
from zeffir.core.pairs import DOWN, UP, hole_integral, hund_determinant


@pytest.mark.parametrize(("spec", "spin"), [("Ne", UP), ("N", UP), ("O", DOWN)])
@pytest.mark.parametrize("r1", [(0.0, 0.0, 0.3), (0.5, -0.2, 0.9), (1.5, 1.0, 0.0)])
def test_the_hole_holds_exactly_one_electron(spec, spin, r1):
    orbitals = build(spec, "slater")
    value = hole_integral(orbitals, np.array(r1), spin, hund_determinant(orbitals.configuration))
    assert value == pytest.approx(-1.0, abs=2e-3)


@pytest.mark.parametrize(("spec", "model"), [("Fe", "slater"), ("Gd", "slater"), ("Ni", "hartree-fock")])
def test_the_small_angular_rule_is_exact(spec, model):
    # The default angular rule (l_max + 3 polar nodes) is exact for the degree of |γ|²,
    # so it must agree with a far denser rule to rounding, and both must hold one electron.
    orbitals = build(spec, model)
    determinant = hund_determinant(orbitals.configuration)
    r1 = np.array([0.35, -0.2, 0.55])
    small = hole_integral(orbitals, r1, UP, determinant)
    dense = hole_integral(orbitals, r1, UP, determinant, polar_points=40)
    assert small == pytest.approx(dense, abs=1e-12)
    assert small == pytest.approx(-1.0, abs=2e-3)


def test_too_few_angular_nodes_would_show():
    # The same check can fail: one polar node too few for a d shell misses the sum rule.
    orbitals = build("Fe", "slater")
    determinant = hund_determinant(orbitals.configuration)
    r1 = np.array([0.35, -0.2, 0.55])
    coarse = hole_integral(orbitals, r1, UP, determinant, polar_points=1)
    assert abs(coarse + 1.0) > 1e-6
