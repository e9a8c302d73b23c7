"""The periodic-table chooser: layout, tooltips, choosing and the atom field it feeds."""

from __future__ import annotations

import pytest
from PySide6.QtCore import Qt
from PySide6.QtWidgets import QDialog, QLabel, QPushButton, QToolButton
from scipy.integrate import trapezoid

from zeffir.core.config import elements
from zeffir.state import OrbitalChoice, SliceSettings, Source, ViewState
from zeffir.ui._element_chooser import BLOCK_COLOURS, ElementChooser


@pytest.fixture
def chooser(qtbot):
    dialog = ElementChooser()
    qtbot.addWidget(dialog)
    dialog.show()
    qtbot.waitExposed(dialog)
    return dialog


def _grid_cell(dialog, symbol):
    row, column, _rows, _columns = dialog.grid.getItemPosition(dialog.grid.indexOf(dialog.button(symbol)))
    return row, column


def test_the_dialog_holds_118_named_buttons_in_distinct_cells(chooser):
    buttons = [b for b in chooser.findChildren(QPushButton) if b.objectName().startswith("element-")]
    assert len(buttons) == 118
    assert {b.objectName() for b in buttons} == {f"element-{e.symbol}" for e in elements()}
    cells = {chooser.position(e.symbol) for e in elements()}
    assert len(cells) == 118
    # position() reports where the button really sits in the grid layout
    for e in elements():
        assert _grid_cell(chooser, e.symbol) == chooser.position(e.symbol), e.symbol
    assert chooser.windowTitle() == "Choose an element"


def test_main_table_places_follow_the_long_form(chooser):
    assert chooser.position("H") == (0, 0)
    assert chooser.position("He") == (0, 17)
    assert chooser.position("Fe") == (3, 7)  # period 4, group 8
    assert chooser.position("B") == (1, 12)  # group 13
    assert chooser.position("Hf") == (5, 3)  # group 4, right after the 57–71 marker
    assert chooser.position("Og") == (6, 17)
    assert {chooser.position(s)[1] for s in ("He", "Ne", "Ar", "Kr", "Xe", "Rn", "Og")} == {17}


def test_the_two_series_fill_their_own_rows_below_a_gap(chooser):
    lanthanides = ["La", "Ce", "Pr", "Nd", "Pm", "Sm", "Eu", "Gd", "Tb", "Dy", "Ho", "Er", "Tm", "Yb", "Lu"]
    actinides = ["Ac", "Th", "Pa", "U", "Np", "Pu", "Am", "Cm", "Bk", "Cf", "Es", "Fm", "Md", "No", "Lr"]
    assert [chooser.position(s) for s in lanthanides] == [(8, c) for c in range(2, 17)]
    assert [chooser.position(s) for s in actinides] == [(9, c) for c in range(2, 17)]
    # row 7 is the gap: nothing sits in it
    assert all(chooser.grid.itemAtPosition(7, c) is None for c in range(18))
    markers = [chooser.grid.itemAtPosition(r, 2).widget() for r in (5, 6)]
    assert [m.text().replace("\n", "") for m in markers] == ["57–71", "89–103"]


def test_tooltips_name_the_element_and_its_ground_configuration(chooser):
    # Ground configurations: NIST Atomic Spectra Database ground levels (Kramida, Ralchenko,
    # Reader and NIST ASD Team, NIST Atomic Spectra Database, version 5).
    tip = chooser.button("Cr").toolTip()
    assert "Chromium" in tip and "Z = 24" in tip and "[Ar] 3d5 4s1" in tip
    assert "[Xe] 4f14 5d10 6s1" in chooser.button("Au").toolTip()
    # a noble gas is its own core: the tooltip spells out what it holds
    assert "1s2" in chooser.button("He").toolTip()
    assert "[Ne] 3s2 3p6" in chooser.button("Ar").toolTip()


def test_buttons_show_the_symbol_and_z_and_are_tinted_by_block(chooser):
    fe = chooser.button("Fe")
    texts = [label.text() for label in fe.findChildren(QLabel)]
    assert "Fe" in texts and "26" in texts
    assert fe.width() == fe.height() == 34
    blocks = {s: chooser.button(s).property("block")
              for s in ("H", "He", "Na", "B", "Ne", "Fe", "Cu", "La", "Ce", "Yb", "Lu", "Ac", "Lr")}
    assert blocks == {"H": "s", "He": "s", "Na": "s", "B": "p", "Ne": "p", "Fe": "d", "Cu": "d",
                      "La": "f", "Ce": "f", "Yb": "f", "Lu": "d", "Ac": "f", "Lr": "d"}
    counts = {b: sum(chooser.button(e.symbol).property("block") == b for e in elements())
              for b in BLOCK_COLOURS}
    # Madelung filling to Z = 118: 7 s subshells (14 elements), 6 p (36), 4 d (40), 2 f (28)
    assert counts == {"s": 14, "p": 36, "d": 40, "f": 28}
    # the tint is really drawn: the pixel beside the symbol has the block's colour
    image = fe.grab().toImage()
    assert image.pixelColor(3, fe.height() // 2).name() == BLOCK_COLOURS["d"]


def test_the_dialog_fits_a_small_screen(chooser):
    size = chooser.sizeHint()
    assert size.width() <= 1280 and size.height() <= 720


def test_clicking_an_element_emits_its_symbol_and_closes(qtbot, chooser):
    with qtbot.waitSignal(chooser.chosen, timeout=1000) as blocker:
        qtbot.mouseClick(chooser.findChild(QPushButton, "element-Cu"), Qt.MouseButton.LeftButton)
    assert blocker.args == ["Cu"]
    assert not chooser.isVisible()
    assert chooser.result() == QDialog.DialogCode.Accepted


def test_escape_closes_without_choosing(qtbot, chooser):
    emitted: list[str] = []
    chooser.chosen.connect(emitted.append)
    qtbot.keyClick(chooser, Qt.Key.Key_Escape)
    assert not chooser.isVisible()
    assert chooser.result() == QDialog.DialogCode.Rejected
    assert emitted == []


@pytest.fixture
def window(make_window):
    return make_window(ViewState(left=Source("Na", "slater"), orbital=OrbitalChoice("3s"),
                                 slice=SliceSettings(resolution=48)))


def test_the_chooser_is_made_only_when_first_asked_for(window):
    assert window.findChildren(ElementChooser) == []
    assert window.atom_bar.source_fields.chooser is None


def test_choosing_from_the_atom_strip_sets_and_draws_the_atom(qtbot, window):
    fields = window.atom_bar.source_fields
    button = window.atom_bar.findChild(QToolButton, "elementChooserButton")
    assert button is fields.chooser_button
    assert button.toolTip() == "Choose an element from the periodic table"
    qtbot.mouseClick(button, Qt.MouseButton.LeftButton)
    chooser = fields.chooser
    assert isinstance(chooser, ElementChooser) and chooser.isVisible()
    assert chooser.focusWidget() is chooser.button("Na")  # it opens on the current atom
    qtbot.mouseClick(chooser.button("Cu"), Qt.MouseButton.LeftButton)
    assert not chooser.isVisible()
    assert fields.spec_edit.text() == "Cu"
    assert window.state.left.spec == "Cu"
    assert window.drawn("radial").left.spec == "Cu"
    # the radial view's total curve now integrates to copper's 29 electrons
    x, y = window.radial_trio.views[0].curve_data()["total"]
    assert trapezoid(y, x) == pytest.approx(29, rel=1e-3)
    # a second use reuses the same dialog
    qtbot.mouseClick(button, Qt.MouseButton.LeftButton)
    assert fields.chooser is chooser
    assert len(window.findChildren(ElementChooser)) == 1


def test_the_side_panel_rows_have_no_chooser_button(window):
    assert window.controls.compare_source.chooser_button is None
    assert len(window.findChildren(QToolButton, "elementChooserButton")) == 1
