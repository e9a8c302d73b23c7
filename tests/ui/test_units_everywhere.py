"""One unit system: with Å chosen, every length box shows Å and the state keeps bohr."""

from __future__ import annotations

import pytest

from zeffir.core import ANGSTROM_PER_BOHR
from zeffir.state import ColourSettings, OrbitalChoice, PairSettings, SliceSettings, Source, ViewState


@pytest.fixture
def window(make_window):
    return make_window(ViewState(left=Source("Na", "slater"), orbital=OrbitalChoice("3s"), view="slice",
                      slice=SliceSettings(resolution=48, offset=0.5, extent=6.0, fit_extent=False),
                      pair=PairSettings(reference=(0.0, 0.0, 1.1))))


def test_length_boxes_follow_the_unit(window):
    controls = window.controls
    boxes = [controls.offset, controls.extent]
    assert all(box.suffix() == " bohr" for box in boxes)
    assert controls.reference_label.text() == "r₁ / bohr"  # three boxes in a row: unit in the label
    window.apply(window.state.with_changes(length_unit="angstrom"))
    assert all(box.suffix() == " Å" for box in boxes)
    assert controls.reference_label.text() == "r₁ / Å"
    assert controls.offset.value() == pytest.approx(0.5 * ANGSTROM_PER_BOHR, abs=1e-3)
    assert controls.extent.value() == pytest.approx(6.0 * ANGSTROM_PER_BOHR, abs=1e-2)
    assert controls.reference[2].value() == pytest.approx(1.1 * ANGSTROM_PER_BOHR, abs=1e-3)
    assert window.state.slice.extent == 6.0  # the state stays in bohr


def test_an_edit_in_angstrom_is_stored_in_bohr(window):
    window.apply(window.state.with_changes(length_unit="angstrom"))
    window.controls.extent.setValue(2.0)
    window.controls._emit_slice()
    assert window.state.slice.extent == pytest.approx(2.0 / ANGSTROM_PER_BOHR)
    window.controls.reference[0].setValue(0.5)
    assert window.state.pair.reference[0] == pytest.approx(0.5 / ANGSTROM_PER_BOHR)


def test_editing_another_box_does_not_move_lengths_by_rounding(window):
    window.apply(window.state.with_changes(length_unit="angstrom"))
    window.controls.contours.setValue(3)
    window.controls._emit_slice()
    assert window.state.slice.contours == 3
    assert window.state.slice.offset == 0.5 and window.state.slice.extent == 6.0


def test_the_decades_box_sets_the_log_scale_span(qtbot, window):
    window.apply(window.state.with_changes(
        slice=window.state.slice.__class__(quantity="density", resolution=48,
                                           colour=ColourSettings(log_scale=True))))
    assert window.controls.log_decades.isEnabled()
    window.controls.log_decades.setValue(4.0)
    qtbot.waitUntil(lambda: window.state.slice.log_decades == 4.0, timeout=2000)  # after coalescing
    low, high = window.slice_trio.views[0]._scene.colour_range
    assert high - low == pytest.approx(4.0)


def test_a_line_profile_follows_a_switch_of_units(make_window):
    window = make_window(ViewState(left=Source("Ne", "slater"), view="slice",
                                   slice=SliceSettings(plane="xz", extent=3.0, resolution=48,
                                                       fit_extent=False)))
    panel = window.slice_trio.views[0]
    panel.profile_requested.emit(-2.0, 0.0, 2.0, 0.0)  # as a Shift + drag along x would
    before = window.profile_view.profile()
    assert before is not None and "bohr" in window.profile_view.axis_labels()[0]
    window.apply(window.state.with_changes(length_unit="angstrom"))
    after = window.profile_view.profile()
    assert after is not None and "Å" in window.profile_view.axis_labels()[0]
    (u0, _), (u1, _) = panel.profile_segment()
    assert u1 - u0 == pytest.approx(4.0 * ANGSTROM_PER_BOHR)  # the same stretch of the atom
    distance, _values = window.profile_view.curve_data()
    assert distance[-1] == pytest.approx(4.0 * ANGSTROM_PER_BOHR, rel=1e-6)


def test_the_unit_chooser_names_what_the_session_and_command_line_name(window):
    from zeffir.state import LENGTH_UNITS

    box = window.controls.units
    items = [(box.itemData(i), box.itemText(i)) for i in range(box.count())]
    assert [key for key, _ in items] == list(LENGTH_UNITS)
    assert all(text.startswith(key) for key, text in items)  # "bohr and hartree…", "angstrom and eV"
    assert all(action.text().replace("&", "").startswith(key)
               for key, action in window.unit_actions.items())
