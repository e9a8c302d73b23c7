"""The four Kohn–Sham approximations: limits, the virial relation, electron counts and paths."""

from __future__ import annotations

import numpy as np
import pytest

from zeffir.core import ModelError, build, cancellation, parse_spec, progress_reporting
from zeffir.core._errors import ComputationCancelled
from zeffir.core.dft._kohn_sham import solve_kohn_sham
from zeffir.core.dft._xc import lda_xc
from zeffir.core.dft._xc_spin import lsda_xc


@pytest.mark.parametrize(("spec", "model"), [("Ne", "lda"), ("Na", "lsda"), ("Fe", "lsda")])
def test_the_kohn_sham_virial_relation_holds(spec, model):
    # For a local potential the virial theorem of the Kohn–Sham system reads
    # 2T_s + V_ne + U_H = ∫ρ r·∇v_xc d³r (M. Levy and J. P. Perdew, Phys. Rev. A 32,
    # 2010 (1985)); radially the right side is Σ_σ ∫ q_σ r dv_xc,σ/dr dr.
    result = solve_kohn_sham(parse_spec(spec), model)
    grid = result.grid
    r = grid.r
    four_pi_r2 = 4 * np.pi * r * r
    q = {s: sum(o.occupation * o.density for o in result.orbitals if o.spin == s)
         for s in {o.spin for o in result.orbitals}}
    if model == "lda":
        _, v = lda_xc(q[None] / four_pi_r2)
        pairs = [(q[None], v)]
    else:
        _, v_up, v_down = lsda_xc(q["up"] / four_pi_r2, q["down"] / four_pi_r2)
        pairs = [(q["up"], v_up), (q["down"], v_down)]
    # r dv/dr = dv/dx on the uniform x = ln r grid.
    work = sum(grid.integrate(charge * np.gradient(v, grid.h, edge_order=2)) for charge, v in pairs)
    left = 2 * result.kinetic + result.nuclear + result.hartree
    assert left == pytest.approx(work, rel=1e-6, abs=1e-6)
    ratio = build(spec, model).virial_ratio
    assert ratio == pytest.approx(2.0, abs=5e-3) and ratio != 2.0


def test_closed_shells_are_the_same_with_and_without_spin_polarisation():
    # NIST's Mg table lists identical LDA and LSD columns for the closed-shell atom.
    assert build("Ar", "lsda").total_energy == pytest.approx(build("Ar", "lda").total_energy, abs=1e-9)


def test_hund_populations_put_the_open_shell_in_the_majority_spin():
    # Fe 3d6 (NIST: majority spin "down"): 5 down, 1 up; 4s2 shared.
    result = solve_kohn_sham(parse_spec("Fe"), "lsda")
    d = {o.spin: o.occupation for o in result.orbitals if o.label == "3d"}
    s = {o.spin: o.occupation for o in result.orbitals if o.label == "4s"}
    assert d == {"down": 5.0, "up": 1.0} and s == {"down": 1.0, "up": 1.0}
    # Exchange binds the majority spin more strongly.
    levels = {(o.label, o.spin): o.energy for o in result.orbitals}
    assert levels[("3d", "down")] < levels[("3d", "up")]


def test_without_relativity_the_relativistic_models_give_lda():
    # c → ∞ removes every relativistic term, MacDonald–Vosko's exchange factor too.
    lda = solve_kohn_sham(parse_spec("Ar"), "lda").total_energy
    for model in ("relativistic-lda", "scalar-relativistic-lda"):
        assert solve_kohn_sham(parse_spec("Ar"), model, c=1e7).total_energy == pytest.approx(lda, abs=1e-7)


@pytest.mark.parametrize("model", ["lsda", "relativistic-lda", "scalar-relativistic-lda"])
def test_every_model_keeps_all_electrons_and_reports_progress(model):
    lines: list[str] = []
    with progress_reporting(lines.append):
        orbitals = build("Kr+", model)
    assert lines and all("iteration" in line for line in lines)
    assert sum(o.occupancy * o.radial.norm() for o in orbitals.orbitals) == pytest.approx(35, abs=1e-8)
    for o in orbitals.orbitals:
        assert sum(c.occupancy for c in o.components) == pytest.approx(o.occupancy) or not o.components
    with cancellation(lambda: True), pytest.raises(ComputationCancelled, match="cancelled"):
        solve_kohn_sham(parse_spec("C"), model)


def test_an_unbound_anion_is_refused_under_every_model():
    for model in ("lsda", "relativistic-lda", "scalar-relativistic-lda"):
        with pytest.raises(ModelError, match="is not bound in"):
            build("H-", model)


def test_an_unknown_approximation_is_refused():
    with pytest.raises(ModelError, match="unknown approximation"):
        solve_kohn_sham(parse_spec("He"), "gga")
