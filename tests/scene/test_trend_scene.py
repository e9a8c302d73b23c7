"""The trend scene: display units, x positions, the reference, differences and blocks."""

from __future__ import annotations

import math

import pytest

from zeffir.core import ANGSTROM_PER_BOHR, EV_PER_HARTREE
from zeffir.core.trends import evaluate_trend, parse_rule
from zeffir.scene import element_blocks, trend_scene


def test_energies_follow_the_unit_and_differences_the_reference():
    trend = evaluate_trend(parse_rule("Z=1-4"), ["hartree-fock"], "ionization_energy",
                           methods=["koopmans", "delta-scf"], processes=1, cache=False)
    atomic, ev = trend_scene(trend, "bohr"), trend_scene(trend, "angstrom")
    assert atomic.unit == "hartree" and ev.unit == "eV" and atomic.by_z
    assert [line.name for line in atomic.lines] == ["restricted Hartree–Fock, Koopmans",
                                                    "restricted Hartree–Fock, ΔSCF"]
    for a, e in zip(atomic.lines[0].y, ev.lines[0].y, strict=True):
        assert e == pytest.approx(a * EV_PER_HARTREE, rel=1e-12)
    assert atomic.reference is not None and atomic.reference.x == (1.0, 2.0, 3.0, 4.0)
    for line, difference in zip(atomic.lines, atomic.differences, strict=True):
        for y, r, d in zip(line.y, atomic.reference.y, difference.y, strict=True):
            assert d == pytest.approx(y - r, abs=1e-15)
    assert atomic.blocks == ((0.5, 4.5, "s"),)


def test_lengths_scale_with_their_power_and_a_list_repeating_z_uses_positions():
    trend = evaluate_trend(["Fe", "Fe+", "Fe2+"], ["slater"], "<r^2>", subshell="3d", processes=1,
                           cache=False)
    bohr, angstrom = trend_scene(trend, "bohr"), trend_scene(trend, "angstrom")
    assert not bohr.by_z and bohr.x_ticks == ((1.0, "Fe"), (2.0, "Fe+"), (3.0, "Fe2+"))
    assert angstrom.unit == "Å^2" and bohr.blocks == ()
    for b, a in zip(bohr.lines[0].y, angstrom.lines[0].y, strict=True):
        assert a == pytest.approx(b * ANGSTROM_PER_BOHR**2, rel=1e-12)
    assert "3d" in bohr.y_label


def test_gaps_are_nan_with_their_notes():
    trend = evaluate_trend(["K", "Sc"], ["hartree-fock"], "energy", subshell="3d", processes=1, cache=False)
    line = trend_scene(trend).lines[0]
    assert math.isnan(line.y[0]) and not math.isnan(line.y[1])
    assert "not occupied" in line.notes[0][0]


def test_blocks_along_z_follow_the_periodic_table():
    # The block is the subshell the last electron enters in Madelung order (helium with
    # the s block): d from Sc, f from La (common practice puts La and Ac with either).
    assert element_blocks(1, 10) == ((0.5, 4.5, "s"), (4.5, 10.5, "p"))
    assert element_blocks(19, 31) == ((18.5, 20.5, "s"), (20.5, 30.5, "d"), (30.5, 31.5, "p"))
    assert element_blocks(56, 58) == ((55.5, 56.5, "s"), (56.5, 58.5, "f"))
