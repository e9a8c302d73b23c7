"""Trend values against published numbers, hand-worked rules and the subshell table."""

from __future__ import annotations

import math

import pytest

from zeffir.cli import table_json
from zeffir.core import EV_PER_HARTREE, ModelError, build
from zeffir.core.sweep import DiskCache
from zeffir.core.trends import (
    TrendQuantityError,
    evaluate_trend,
    measured_first_ionization,
    parse_rule,
    quantity,
    valence_subshell,
)


def _values(trend, series=0):
    return [p.value for p in trend.series[series].points]


def test_two_electron_sequence_under_the_variational_model():
    # One screened exponent ζ = Z − 5/16 for both 1s electrons gives E = −(Z − 5/16)²
    # at every Z (the textbook single-zeta variational result for two-electron atoms;
    # H. A. Bethe and E. E. Salpeter, Quantum Mechanics of One- and Two-Electron Atoms,
    # 1957, variational treatment of the helium ground state).
    trend = evaluate_trend(parse_rule("isoelectronic=2:Z=1-10"), ["variational"], "total_energy",
                           processes=1, cache=False)
    for point in trend.series[0].points:
        assert point.value == pytest.approx(-((point.Z - 5 / 16) ** 2), abs=1e-9), point.spec


def test_slater_valence_s_charge_of_the_alkali_metals_by_hand():
    # Slater's rules (J. C. Slater, Phys. Rev. 36, 57 (1930)), worked by hand (common
    # practice: the rules themselves): Li 3 − 2(0.85) = 1.30; Na 11 − 8(0.85) − 2(1) = 2.20;
    # K 19 − 8(0.85) − 10(1) = 2.20; Rb 37 − 8(0.85) − 28(1) = 2.20.
    trend = evaluate_trend(parse_rule("Li,Na,K,Rb"), ["slater"], "z_eff", processes=1, cache=False)
    assert _values(trend) == pytest.approx([1.30, 2.20, 2.20, 2.20], abs=1e-12)
    assert [p.notes for p in trend.series[0].points] == [
        (f"valence subshell {n}s",) for n in (2, 3, 4, 5)]


@pytest.mark.parametrize(("name", "model", "key"), [
    ("zeta", "clementi", "zeta"), ("z_eff", "slater", "z_eff"), ("r_mean", "hartree-fock", "r_mean_bohr"),
    ("r_max", "variational", "r_max_bohr"), ("energy", "hartree-fock", "energy_hartree"),
])
def test_every_point_equals_the_table(name, model, key):
    specs = ["Na", "Fe", "Cu+", "Ce [Xe] 4f1 5d1 6s2"]
    trend = evaluate_trend(specs, [model], name, processes=1, cache=False)
    for spec, point in zip(specs, trend.series[0].points, strict=True):
        table = table_json(spec, model)
        label = valence_subshell(build(spec, model)).label
        row = next(r for r in table["subshells"] if r["label"] == label)
        assert point.value == row[key], (spec, name)
    totals = evaluate_trend(specs, [model], "total_energy", processes=1, cache=False)
    assert _values(totals) == [table_json(s, model)["total_energy_hartree"] for s in specs]


def test_a_named_subshell_and_the_gaps_it_leaves():
    trend = evaluate_trend(parse_rule("Z=19-22"), ["hartree-fock"], "energy", subshell="3d",
                           processes=1, cache=False)
    k, ca, sc, ti = trend.series[0].points
    assert k.value is None and "3d is not occupied" in k.notes[0]
    assert ca.value is None
    assert sc.value is not None and sc.value < 0 and ti.value is not None


def test_a_model_without_energies_leaves_gaps_with_the_reason():
    trend = evaluate_trend(["Ne"], ["clementi"], "ionization_energy", methods=["koopmans", "delta-scf"],
                           processes=1, cache=False)
    koopmans, delta = (s.points[0] for s in trend.series)
    assert koopmans.value is None and "no orbital energies" in koopmans.notes[-1]
    assert delta.value is None and "no total energy" in delta.notes[0]


def test_a_refused_configuration_is_a_gap_not_a_failure(tmp_path):
    # Be⁻ has no bound Hartree–Fock solution in this basis (see the sweep tests).
    trend = evaluate_trend(["Be-", "Li"], ["hartree-fock"], "total_energy", processes=1,
                           cache=DiskCache(tmp_path))
    be, li = trend.series[0].points
    assert be.value is None and be.notes[0].startswith("refused: Be-")
    assert li.value is not None


def test_moments_and_their_divergence():
    trend = evaluate_trend(["Ne"], ["slater"], "<r^-3>", subshell="1s", processes=1, cache=False)
    assert trend.series[0].points[0].value is None
    assert "diverges" in trend.series[0].points[0].notes[0]
    p = evaluate_trend(["Ne"], ["slater"], "r^-3", subshell="2p", processes=1, cache=False)
    assert p.quantity.unit == "bohr^-3" and p.series[0].points[0].value > 0


def test_wrong_requests_are_refused_before_any_work():
    with pytest.raises(TrendQuantityError, match="unknown quantity"):
        evaluate_trend(["Ne"], ["slater"], "colour", processes=1, cache=False)
    with pytest.raises(TrendQuantityError, match="unknown method"):
        evaluate_trend(["Ne"], ["slater"], "ionization_energy", methods=["guess"], processes=1, cache=False)
    with pytest.raises(TrendQuantityError, match="applies to ionization_energy only"):
        evaluate_trend(["Ne"], ["slater"], "z_eff", methods=["koopmans"], processes=1, cache=False)
    with pytest.raises(TrendQuantityError, match="not a subshell label"):
        evaluate_trend(["Ne"], ["slater"], "z_eff", subshell="outer", processes=1, cache=False)
    with pytest.raises(TrendQuantityError, match="whole atom"):
        evaluate_trend(["Ne"], ["slater"], "total_energy", subshell="2p", processes=1, cache=False)
    with pytest.raises(ModelError):
        evaluate_trend(["Ne"], ["no-such-model"], "z_eff", processes=1, cache=False)
    assert quantity("<r^2>").power == 2


def test_the_measured_table_covers_z_1_to_104_from_nist():
    # NIST ASD first ionization energies (shipped file); hydrogen against the reduced-mass
    # Rydberg energy from CODATA (scipy.constants), NIST adding relativistic and QED shifts
    # of about 1.5e-4 eV.
    from scipy import constants

    rydberg = constants.physical_constants["Rydberg constant times hc in eV"][0]
    hydrogen = measured_first_ionization(1)
    assert hydrogen.energy_ev == pytest.approx(rydberg / (1 + constants.m_e / constants.m_p), abs=2e-4)
    assert all(measured_first_ionization(z) is not None for z in range(1, 105))
    assert measured_first_ionization(105) is None
    helium = measured_first_ionization(2)
    assert helium.energy == pytest.approx(helium.energy_ev / EV_PER_HARTREE, rel=1e-15)
    assert math.isclose(max((measured_first_ionization(z).energy_ev, z) for z in range(1, 105))[1], 2)


def test_several_subshells_give_one_series_each():
    trend = evaluate_trend(parse_rule("Z=21-23"), ["hartree-fock"], "energy", subshell="3d, 4s",
                           processes=1, cache=False)
    assert trend.subshell == "3d,4s"
    assert [(s.model, s.subshell) for s in trend.series] == [("hartree-fock", "3d"), ("hartree-fock", "4s")]
    d, s = ([p.value for p in series.points] for series in trend.series)
    # Hartree–Fock puts the 3d orbital energy below the 4s one across Sc–V (the table agrees).
    assert all(a < b < 0 for a, b in zip(d, s, strict=True))
    assert d[0] == table_json("Sc", "hartree-fock")["subshells"][-2]["energy_hartree"]
    delta = evaluate_trend(["Sc"], ["hartree-fock"], "ionization_energy", subshell="3d,4s",
                           methods=["koopmans", "delta-scf"], processes=1, cache=False)
    assert [(s.method, s.subshell) for s in delta.series] == [
        ("koopmans", "3d"), ("koopmans", "4s"), ("delta-scf", None)]  # ΔSCF is one per atom
