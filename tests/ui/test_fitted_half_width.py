"""The slice half-width fits what is shown (99.9 % of the orbital's charge) unless set."""

from __future__ import annotations

import pytest

from zeffir.core import build, cumulative_charge
from zeffir.export import view_target
from zeffir.scene import fitted_extent
from zeffir.state import OrbitalChoice, SliceSettings, Source, ViewState


@pytest.fixture
def window(make_window):
    return make_window(ViewState(left=Source("Fe", "slater"), orbital=OrbitalChoice("3d"), view="slice",
                      slice=SliceSettings(resolution=48)))


def test_the_fitted_half_width_holds_the_orbitals_charge():
    state = ViewState(left=Source("Fe", "slater"), orbital=OrbitalChoice("3d"), view="slice")
    half = fitted_extent(state)
    orbitals = build("Fe", "slater")
    inside = cumulative_charge(orbitals, [half], "3d")[0] / 6  # per electron (3d6)
    assert 0.999 <= inside < 0.9995
    # A 3d orbital of iron is far smaller than the old fixed 8 bohr; its 4s far larger.
    assert half < 5.0 < fitted_extent(state.with_changes(orbital=OrbitalChoice("4s")))


def test_the_window_draws_and_shows_the_fitted_half_width(window):
    scene = window.slice_trio.views[0]._scene
    expected = fitted_extent(window.state)
    assert float(abs(scene.coordinates).max()) == pytest.approx(expected)
    assert window.controls.extent.value() == pytest.approx(expected)
    assert not window.controls.extent.isEnabled() and window.controls.fit_extent.isChecked()
    # the export draws the very same frame
    assert float(abs(view_target(window.state).coordinates).max()) == pytest.approx(expected)


def test_unticking_keeps_the_fitted_half_width_for_editing(window):
    expected = fitted_extent(window.state)
    window.controls.fit_extent.setChecked(False)
    assert window.state.slice.fit_extent is False
    assert window.state.slice.extent == pytest.approx(expected)
    assert window.controls.extent.isEnabled()


def test_sessions_from_before_the_setting_keep_their_half_width():
    data = ViewState().to_dict()
    del data["slice"]["fit_extent"]
    data["slice"]["extent"] = 12.0
    state = ViewState.from_dict(data)
    assert state.slice.fit_extent is False and state.slice.extent == 12.0
