"""What each view draws against what the controls ask: failures, cancels, retries, exports."""

from __future__ import annotations

import pytest
from PySide6.QtCore import QPoint, QPointF, QSettings, Qt
from PySide6.QtGui import QWheelEvent
from PySide6.QtWidgets import QApplication, QWidget

from zeffir.state import CompareSettings, OrbitalChoice, SliceSettings, Source, ViewState
from zeffir.ui import MainWindow

# Be⁻ has no Hartree–Fock solution in the basis (the extra electron is unbound): the
# model refuses it with the reason, in about a second.
FAILING = Source("Be-", "hartree-fock")


def _title(view) -> str:
    return view._plot.titleLabel.text


@pytest.fixture
def window(make_window):
    return make_window(ViewState(left=Source("Na", "slater"), orbital=OrbitalChoice("3s"),
                      slice=SliceSettings(resolution=48, extent=10.0)))


def test_a_current_view_has_no_problem_and_names_its_drawn_state(window):
    assert window.problem() is None
    assert window.drawn("radial") == window.state
    assert window.drawn("terms") is None


def test_a_failed_build_leaves_a_standing_message_and_the_old_picture(window, tmp_path):
    window.apply(window.state.with_changes(left=FAILING))
    assert window.state.left == FAILING  # the controls keep what was asked
    assert window.drawn("radial").left == Source("Na", "slater")  # the picture does not
    message = window.problem()
    assert message is not None
    assert "showing: Na — Slater's rules" in message and "asked: Be- — " in message
    assert "failed:" in message and "not bound" in message
    assert window.banner.isVisibleTo(window) and window.retry_button.isVisibleTo(window)
    assert window.banner_text.text() == message
    # the view's own title still names what it draws
    assert "Na" in _title(window.radial_trio.views[0])
    # export refuses, and writes nothing
    target = tmp_path / "stale.png"
    assert window.export_figure(target) is False
    assert window.export_data(tmp_path / "stale.csv") is False
    assert not target.exists()


def test_a_failed_build_runs_once_for_the_table_and_the_views(window, monkeypatch):
    import zeffir.scene._build as build_module

    calls: list[tuple[str, str]] = []
    real = build_module.build

    def counting(spec, model):
        calls.append((spec, model))
        return real(spec, model)

    build_module.forget_failure(FAILING)
    monkeypatch.setattr(build_module, "build", counting)
    window.apply(window.state.with_changes(left=FAILING))
    window.apply(window.state.with_changes(view="slice"))
    assert calls.count(("Be-", "hartree-fock")) == 1
    assert "failed" in window.problem()


def test_retry_and_return_compute_again(window, monkeypatch, qtbot):
    import zeffir.scene._build as build_module

    window.apply(window.state.with_changes(left=FAILING))
    calls: list[str] = []
    real = build_module.build
    monkeypatch.setattr(build_module, "build", lambda s, m: (calls.append(s), real(s, m))[1])
    window.retry()
    assert calls == ["Be-"]  # the remembered failure was forgotten and tried again
    edit = window.atom_bar.source_fields.spec_edit
    qtbot.keyClick(edit, Qt.Key.Key_Return)  # the same spec: Return retries
    assert calls == ["Be-", "Be-"]
    assert "failed" in window.problem()


def test_a_valid_spec_after_a_failure_clears_the_message(window):
    window.apply(window.state.with_changes(left=FAILING))
    window.apply(window.state.with_changes(left=Source("Fe", "slater")))
    assert window.problem() is None and not window.banner.isVisibleTo(window)
    assert window.drawn("radial").left.spec == "Fe"


def test_going_back_to_the_drawn_atom_needs_no_recompute(window):
    window.apply(window.state.with_changes(left=FAILING))
    window.apply(window.state.with_changes(left=Source("Na", "slater")))
    assert window.problem() is None


def test_cancel_leaves_a_cancelled_message_and_the_previous_picture(qtbot, tmp_path):
    settings = QSettings(str(tmp_path / "settings.ini"), QSettings.Format.IniFormat)
    win = MainWindow(ViewState(left=Source("Na", "slater")), synchronous=False, settings=settings)
    qtbot.addWidget(win)
    qtbot.waitUntil(lambda: win.problem() is None, timeout=20000)
    # Kr under the variational model takes several seconds: long enough to cancel.
    win.apply(win.state.with_changes(left=Source("Kr", "variational")))
    assert "computing" in win.problem()
    win.cancel()
    assert "cancelled" in win.problem()
    assert win.drawn("radial").left == Source("Na", "slater")
    assert win.export_figure(tmp_path / "x.png") is False
    win.worker.shutdown()


def test_the_comparison_follows_the_main_atom(window):
    window.apply(window.state.with_changes(
        compare=CompareSettings(True, Source("Na", "clementi"))))
    window.apply(window.state.with_changes(left=Source("Fe", "slater")))
    drawn = window.drawn("radial")
    assert drawn.compare.right == Source("Fe", "clementi")
    assert "Fe" in _title(window.radial_trio.views[1])
    assert "Na" not in _title(window.radial_trio.views[2])


def test_another_atom_in_the_comparison_is_a_deliberate_saved_choice(window):
    window.apply(window.state.with_changes(
        compare=CompareSettings(True, Source("Mg", "clementi"), same_atom=False)))
    window.apply(window.state.with_changes(left=Source("Fe", "slater")))
    assert window.drawn("radial").compare.right == Source("Mg", "clementi")
    assert window.state.to_dict()["compare"]["same_atom"] is False
    assert not window.controls.same_atom.isChecked()
    assert window.controls.compare_source.spec_edit.isEnabled()


def test_ticking_same_atom_makes_the_comparison_follow(window, qtbot):
    window.apply(window.state.with_changes(
        compare=CompareSettings(True, Source("Mg", "clementi"), same_atom=False)))
    window.controls.same_atom.setChecked(True)
    assert window.state.compare.right == Source("Na", "clementi")
    assert not window.controls.compare_source.spec_edit.isEnabled()


def _wheel(widget: QWidget) -> None:
    centre = QPointF(widget.width() / 2, widget.height() / 2)
    event = QWheelEvent(centre, widget.mapToGlobal(centre), QPoint(0, 0), QPoint(0, 120),
                        Qt.MouseButton.NoButton, Qt.KeyboardModifier.NoModifier,
                        Qt.ScrollPhase.NoScrollPhase, False)
    QApplication.sendEvent(widget, event)


def test_the_wheel_does_not_change_an_unfocused_spin_box(window):
    window.apply(window.state.with_changes(view="pair"))
    spin = window.controls.reference[2]
    before = window.state.pair.reference
    window.controls.setFocus()
    assert not spin.hasFocus()
    _wheel(spin)
    assert spin.value() == before[2]
    assert window.state.pair.reference == before


def test_the_wheel_changes_a_focused_spin_box(qtbot):
    from PySide6.QtWidgets import QSpinBox, QVBoxLayout

    from zeffir.ui._wheel_guard import guard_wheel

    class Focused(QSpinBox):
        def hasFocus(self) -> bool:  # Qt's name; the guard asks through Python
            return True

    panel = QWidget()
    qtbot.addWidget(panel)
    focused, unfocused = Focused(), QSpinBox()
    layout = QVBoxLayout(panel)
    for spin in (focused, unfocused):
        spin.setRange(0, 10)
        spin.setValue(5)
        layout.addWidget(spin)
    guard_wheel(panel)
    _wheel(focused)
    _wheel(unfocused)
    assert focused.value() == 6 and unfocused.value() == 5


@pytest.mark.parametrize("name", ["Atom", "Model", "Versus", "Offset", "Half-width", "Retry"])
def test_input_controls_are_named_by_their_visible_labels(window, name):
    found = [w for w in window.findChildren(QWidget) if w.accessibleName() == name]
    assert found, f"no control named {name!r}"


def test_the_pair_export_keeps_three_panels_without_the_difference(window, tmp_path):
    from zeffir.export._figures import _draw
    from zeffir.export._view import view_target

    state = window.state.with_changes(
        view="pair", compare=CompareSettings(False, Source("Na", "clementi"),
                                             show_difference=False)).validated()
    figure = _draw(view_target(state), 7.0)
    images = [axes for axes in figure.axes if axes.images]
    assert len(images) == 3
    assert "hole" in images[2].get_title(loc="left").lower()


def test_the_terms_view_lists_the_terms_of_the_asked_atom(window, tmp_path):
    window.apply(window.state.with_changes(left=Source("Eu3+", "slater"), view="terms"))
    assert window.tabs.currentWidget() is window.terms_view
    assert window.drawn("terms").left.spec == "Eu3+" and window.problem() is None
    assert window.terms_view.current_spec() == "Eu3+"
    assert "7F0" in window.terms_view.as_text() or "⁷F" in window.terms_view.as_text()
    assert window.export_figure(tmp_path / "terms.png") is False
    assert not window.controls.radial_box.isVisibleTo(window.controls)


def test_a_segment_on_a_slice_panel_shows_its_line_profile(window):
    window.apply(window.state.with_changes(view="slice", orbital=OrbitalChoice("3s")))
    view = window.slice_trio.views[0]
    view.profile_requested.emit(-4.0, 0.0, 4.0, 0.0)
    profile = window.profile_view.profile()
    assert profile is not None and not window.profile_dock.isHidden()
    assert profile.s[0] == 0.0 and profile.s[-1] == pytest.approx(8.0)
    # a new orbital keeps the segment and recomputes the profile under it
    window.apply(window.state.with_changes(orbital=OrbitalChoice("2p")))
    assert window.profile_view.profile() is not profile
    assert window.profile_view.profile().orbital != profile.orbital
