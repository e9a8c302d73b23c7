"""The table side of the window: notes, the comparison's energy, units, selection."""

from __future__ import annotations

import pytest

from zeffir.core import EV_PER_HARTREE
from zeffir.state import CompareSettings, OrbitalChoice, SliceSettings, Source, ViewState


@pytest.fixture
def window(make_window):
    return make_window(ViewState(left=Source("Fe3+", "clementi"), orbital=OrbitalChoice("3d"),
                      slice=SliceSettings(resolution=48)))


def test_set_wide_notes_reach_the_window(window):
    notes = window.notes_area.text()
    assert "observed ground configuration of Fe3+" in notes
    # Clementi–Raimondi exponents are the neutral atom's: the model says so for an ion.
    assert "neutral" in notes


def test_the_hartree_fock_term_solved_is_shown(window):
    window.apply(window.state.with_changes(left=Source("C", "hartree-fock")))
    assert "3P" in window.notes_area.text()


def test_a_comparison_shows_both_energies(window):
    window.apply(window.state.with_changes(
        left=Source("Ne", "hartree-fock"), compare=CompareSettings(True, Source("Ne", "variational"))))
    lines = window.energy_line.text().splitlines()
    assert len(lines) == 2
    assert "hartree-fock" in lines[0] and lines[1].startswith("Ne") and "variational" in lines[1]


def test_the_energy_line_follows_the_units(window):
    window.apply(window.state.with_changes(left=Source("Ne", "hartree-fock")))
    assert " Eh" in window.energy_line.text()
    window.apply(window.state.with_changes(length_unit="angstrom"))
    text = window.energy_line.text()
    assert " eV" in text and " Eh" not in text
    assert f"{-128.547098 * EV_PER_HARTREE:.4f} eV" in text  # Ne Hartree–Fock energy in eV


def test_the_table_selection_follows_the_orbital_chooser(window):
    window.apply(window.state.with_changes(orbital=OrbitalChoice("3p")))
    rows = {index.row() for index in window.table.selectedIndexes()}
    assert [window.table.item(row, 0).text().rstrip(" *") for row in rows] == ["3p"]
    assert window.state.orbital.subshell == "3p"  # and selecting did not echo a change


def test_further_radial_moments_are_optional_columns(window):
    from zeffir.core import build, subshell_table

    table = window.table
    assert all(table.isColumnHidden(c) for c in (8, 9, 10))
    assert "⟨r²⟩" not in table.as_text()
    table.moments_action.trigger()
    lines = table.as_text().splitlines()
    header = lines[0].split("\t")
    assert header[8:] == ["⟨r²⟩ / bohr²", "⟨1/r⟩ / bohr⁻¹", "⟨r⁻³⟩ / bohr⁻³"]
    rows = {line.split("\t")[0]: line.split("\t") for line in lines[1:]}
    expected = {row.label: row for row in subshell_table(build("Fe3+", "clementi"))}
    assert float(rows["3d"][8]) == pytest.approx(expected["3d"].moments[2], abs=1e-4)
    assert float(rows["3d"][10]) == pytest.approx(expected["3d"].moments[-3], abs=1e-4)
    assert rows["1s"][10] == "—"  # ⟨r⁻³⟩ diverges for s


def test_j_levels_sit_beside_the_other_series_and_select_their_subshell(window):
    window.apply(window.state.with_changes(
        left=Source("Mg", "relativistic-lda"), orbital=OrbitalChoice("3s"),
        compare=CompareSettings(True, Source("Mg", "lda"))))
    table = window.table
    labels = [table.item(r, 0).text().rstrip(" *") for r in range(table.rowCount())]
    assert labels == ["1s1/2", "1s", "2s1/2", "2s", "2p1/2", "2p3/2", "2p", "3s1/2", "3s"]
    # j populations of the filled 2p: 2 and 4 electrons.
    assert [table.item(r, 1).text() for r in (4, 5)] == ["2", "4"]
    table.selectRow(5)  # 2p3/2
    assert window.state.orbital.subshell == "2p"
    assert window.problem() is None


def test_spin_eigenvalues_are_in_the_energy_cell_tooltip(window):
    window.apply(window.state.with_changes(left=Source("Mg+", "lsda"), orbital=OrbitalChoice("3s")))
    table = window.table
    row = [table.item(r, 0).text().rstrip(" *") for r in range(table.rowCount())].index("3s")
    tip = table.item(row, 7).toolTip()
    assert "ε↓ (majority) -0.4404" in tip and "ε↑ -0.3884" in tip
