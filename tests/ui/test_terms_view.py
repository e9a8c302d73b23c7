"""The terms view: the table, the ground levels and notes follow the configuration shown."""

from __future__ import annotations

import dataclasses
import threading

import pytest
from PySide6.QtCore import Qt
from PySide6.QtGui import QGuiApplication

from zeffir.core.terms import microstate_count
from zeffir.ui._terms_view import COLUMNS, WARNING_COLOUR, TermsSummary, TermsView, terms_summary

# More than the core's limit of 200 000 terms (219 618), so listing them fails.
TOO_MANY_TERMS = "Gd [Xe] 4f7 5g2 6h1"


@pytest.fixture
def view(qtbot):
    widget = TermsView()
    qtbot.addWidget(widget)
    return widget


def _column(view: TermsView, header: str) -> list[str]:
    column = [name for name, _ in COLUMNS].index(header)
    return [view.table.item(row, column).text() for row in range(view.table.rowCount())]


def _row_fonts(view: TermsView, row: int) -> list[tuple[bool, bool]]:
    return [(view.table.item(row, c).font().bold(), view.table.item(row, c).font().italic())
            for c in range(view.table.columnCount())]


def test_carbon_shows_three_terms_with_the_hund_term_bold(view):
    view.show_configuration("C")
    assert view.current_spec() == "C"
    assert _column(view, "Term") == ["³P", "¹D", "¹S"]
    assert _column(view, "J levels") == ["0, 1, 2", "2", "0"]
    assert _column(view, "S") == ["1", "0", "0"]
    assert _column(view, "L") == ["1", "2", "0"]
    assert _column(view, "States") == ["9", "5", "1"]
    assert _row_fonts(view, 0) == [(True, False)] * len(COLUMNS)
    assert all(font == (False, False) for row in (1, 2) for font in _row_fonts(view, row))
    assert _column(view, "Ground level") == ["³P₀ by Hund's rules", "", ""]
    assert view.ground_label.text() == "Ground level by Hund's rules: ³P₀  (S = 1, L = 1, J = 0)"
    assert "[He] 2s2 2p2" in view.header_label.text() and "1s2 2s2 2p2" in view.header_label.text()
    details = view.details_label.text()
    assert "2p2" in details and "parity even" in details and "15 microstates" in details
    assert "observed ground configuration of C" in view.origin_label.text()
    assert view.observed_label.isHidden() and view.note_labels == []


def test_repeated_terms_are_counted_and_their_states_add_up(view):
    view.show_configuration("Eu3+")
    terms = _column(view, "Term")
    assert len(terms) == len(set(terms)) == 33  # one row per distinct term
    assert _column(view, "Count")[terms.index("⁵I")] == "2"
    assert _column(view, "States")[terms.index("⁵I")] == "130"  # 5 × 13 × 2
    assert sum(int(s) for s in _column(view, "States")) == microstate_count("Eu3+") == 3003
    assert "119 terms (33 distinct)" in view.details_label.text()
    multiplicities = [int(term[0].translate(str.maketrans("¹²³⁴⁵⁶⁷⁸⁹", "123456789")))
                      for term in terms]
    assert multiplicities == sorted(multiplicities, reverse=True)


def test_europium_3plus_shows_the_observed_ground_level_agreeing(view):
    view.show_configuration("Eu3+")
    observed = view.observed_label.text()
    assert observed.startswith("Observed ground level: ⁷F₀")
    assert "NIST Atomic Spectra Database" in observed and "agrees with Hund's rules" in observed
    assert "⁷F₀" in view.ground_label.text()
    assert _column(view, "Ground level")[0] == "⁷F₀ by Hund's rules and observed"
    assert _row_fonts(view, 0)[0] == (True, False)
    assert not any(italic for row in range(view.table.rowCount())
                   for _, italic in _row_fonts(view, row))
    assert all(label.objectName() != "termsHundMiss" for label in view.note_labels)


def test_cerium_plus_flags_the_hund_miss(view):
    view.show_configuration("Ce+")
    terms = _column(view, "Term")
    hund, seen = terms.index("⁴I°"), terms.index("⁴H°")
    assert hund == 0
    assert _row_fonts(view, hund)[0] == (True, False)
    assert _row_fonts(view, seen)[0] == (False, True)
    marks = _column(view, "Ground level")
    assert marks[hund] == "⁴I°₉/₂ by Hund's rules" and marks[seen] == "⁴H°₇/₂ observed"
    assert "⁴I°₉/₂" in view.ground_label.text() and "J = 9/2" in view.ground_label.text()
    assert view.observed_label.text().startswith("Observed ground level: ⁴H°₇/₂")
    assert "differs from Hund's rules" in view.observed_label.text()
    misses = [label for label in view.note_labels if label.objectName() == "termsHundMiss"]
    assert len(misses) == 1
    assert "4H°7/2" in misses[0].text() and WARNING_COLOUR in misses[0].styleSheet()
    others = [label for label in view.note_labels if label not in misses]
    assert any("several open subshells" in label.text() for label in others)
    assert all(WARNING_COLOUR not in label.styleSheet() for label in others)
    assert "parity odd" in view.details_label.text()


@pytest.mark.parametrize(("spec", "message"), [
    (TOO_MANY_TERMS, "too many to list"),
    ("Xx", "unknown element"),
])
def test_an_error_replaces_everything_shown(view, spec, message):
    view.show_configuration("Ce+")
    view.show_configuration(spec)
    assert view.current_spec() == spec
    assert view.summary() is None
    assert spec in view.header_label.text()
    assert message in view.error_label.text() and not view.error_label.isHidden()
    assert message in (view.error_message() or "")
    assert view.table.rowCount() == 0
    assert view.details_label.text() == view.origin_label.text() == ""
    assert view.ground_label.text() == view.observed_label.text() == ""
    assert view.note_labels == []
    assert view.as_text().count("\n") == 0  # the header row only

    view.show_configuration("C")  # and the next good spec clears the error
    assert view.error_label.isHidden() and view.error_message() is None
    assert view.table.rowCount() == 3


def test_as_text_is_a_header_and_one_line_per_row(view):
    view.show_configuration("Ce+")
    lines = view.as_text().split("\n")
    assert len(lines) == view.table.rowCount() + 1 == 16  # 15 distinct terms
    assert lines[0].split("\t") == [name for name, _ in COLUMNS]
    assert all(len(line.split("\t")) == len(COLUMNS) for line in lines)
    assert lines[1] == "⁴I°\t1\t3/2\t6\todd\t9/2, 11/2, 13/2, 15/2\t52\t⁴I°₉/₂ by Hund's rules"


# The offscreen platform cannot resize a shown top-level window to its size hints, and says so.
@pytest.mark.qt_log_ignore("This plugin does not support propagateSizeHints")
def test_ctrl_c_in_the_table_copies_it(view, qtbot):
    view.show_configuration("C")
    QGuiApplication.clipboard().clear()
    view.show()
    qtbot.waitExposed(view)
    view.activateWindow()
    view.table.setFocus()
    qtbot.waitUntil(view.table.hasFocus)
    qtbot.keyClick(view.table, Qt.Key.Key_C, Qt.KeyboardModifier.ControlModifier)
    assert QGuiApplication.clipboard().text() == view.as_text()
    assert QGuiApplication.clipboard().text().startswith("Term\tCount")


def test_the_summary_computed_on_another_thread_shows_the_same(view, qtbot):
    results: list[TermsSummary] = []
    worker = threading.Thread(target=lambda: results.append(terms_summary("Ce+")))
    worker.start()
    worker.join(timeout=30)
    assert results and results[0] == terms_summary("Ce+")
    with pytest.raises(dataclasses.FrozenInstanceError):
        results[0].spec = "C"  # type: ignore[misc]
    view.show_summary(results[0])
    shown = view.as_text()
    other = TermsView()
    qtbot.addWidget(other)
    other.show_configuration("Ce+")
    assert shown == other.as_text() and view.current_spec() == "Ce+"
    assert view.summary() is results[0]
