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
