"""export_view: one entry point that picks the scene from the state and the format from the suffix."""

import json

import numpy as np
import pytest

from zeffir.export import EXPORT_FORMATS, ExportError, export_view, view_target
from zeffir.scene import RadialComparison, RadialScene, SliceComparison, SliceScene, slice_scene
from zeffir.state import CompareSettings, SliceSettings, Source, StateError, ViewState

SLICE = ViewState(view="slice", slice=SliceSettings(resolution=32, extent=8.0, fit_extent=False))


def test_view_target_follows_the_view_and_the_comparison_switch():
    compare = CompareSettings(True, Source("Na", "hydrogenic"))
    assert isinstance(view_target(ViewState()), RadialScene)
    assert isinstance(view_target(SLICE), SliceScene)
    assert isinstance(view_target(ViewState(compare=compare)), RadialComparison)
    assert isinstance(view_target(SLICE.with_changes(compare=compare)), SliceComparison)


def test_export_dispatches_on_the_suffix_and_returns_the_path(tmp_path):
    assert export_view(ViewState(), tmp_path / "r.csv") == tmp_path / "r.csv"
    lines = (tmp_path / "r.csv").read_text(encoding="utf-8").splitlines()
    assert lines[0].startswith("r_bohr,") and lines[1].startswith("# Zeffir radial data")
    written = export_view(SLICE, tmp_path / "s.npz")
    expected = slice_scene(SLICE.left, SLICE.orbital, SLICE.slice)
    with np.load(written, allow_pickle=False) as data:
        assert np.array_equal(data["values"], expected.values)
        assert json.loads(str(data["metadata"]))["kind"] == "zeffir-slice"
    assert export_view(SLICE, tmp_path / "S.SVG").read_bytes().lstrip().startswith(b"<?xml")


def test_unknown_suffix_lists_the_accepted_ones_and_writes_nothing(tmp_path):
    with pytest.raises(ExportError) as caught:
        export_view(ViewState(), tmp_path / "r.jpeg")
    assert str(caught.value) == (f"{tmp_path / 'r.jpeg'}: unknown file type .jpeg; "
                                 "use one of .png, .svg, .pdf, .csv, .npz")
    assert EXPORT_FORMATS == (".png", ".svg", ".pdf", ".csv", ".npz")
    assert list(tmp_path.iterdir()) == []


def test_data_format_must_suit_the_view(tmp_path):
    with pytest.raises(ExportError, match=r"\.csv holds radial curves; save the slice view as \.npz"):
        export_view(SLICE, tmp_path / "s.csv")
    with pytest.raises(ExportError, match=r"\.npz holds slice images; save the radial view as \.csv"):
        export_view(ViewState(), tmp_path / "r.npz")


def test_missing_directory_fails_before_any_work(tmp_path):
    target = tmp_path / "absent" / "f.png"
    with pytest.raises(ExportError) as caught:
        export_view(ViewState(), target)
    assert str(caught.value) == f"{target}: cannot write (No such file or directory)"


def test_invalid_state_raises_state_error_naming_the_field(tmp_path):
    with pytest.raises(StateError, match=r"slice\.extent"):
        export_view(SLICE.with_changes(slice=SliceSettings(extent=-1.0)), tmp_path / "s.npz")
    assert list(tmp_path.iterdir()) == []
