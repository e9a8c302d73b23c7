"""Exports of several series and of the named pair panels: every panel drawn, every array written."""

from __future__ import annotations

import csv
import io
import json

import numpy as np

from zeffir.export import export_view
from zeffir.export._figures import COLUMN_WIDTHS, _draw
from zeffir.scene import view_scene
from zeffir.state import CompareSettings, OrbitalChoice, SliceSettings, Source, ViewState

FOUR = CompareSettings(True, Source("Na", "clementi"), True, True,
                       more=(Source("", "hydrogenic"), Source("Mg+", "slater")))


def _state(**changes) -> ViewState:
    changes.setdefault("compare", FOUR)
    return ViewState(left=Source("Na", "slater"), orbital=OrbitalChoice("3s"),
                     slice=SliceSettings(resolution=40, extent=8.0, fit_extent=False),
                     **changes).validated()


def test_radial_csv_has_a_column_block_per_series(tmp_path):
    path = export_view(_state(), tmp_path / "four.csv")
    text = path.read_text(encoding="utf-8")
    header = [line for line in text.splitlines() if line.startswith("# series")]
    assert [line.partition("; curves")[0] for line in header] == [
        "# series_1: spec Na; model slater", "# series_2: spec Na; model clementi",
        "# series_3: spec Na; model hydrogenic", "# series_4: spec Mg+; model slater"]
    rows = list(csv.reader(io.StringIO("\n".join(l for l in text.splitlines() if not l.startswith("#")))))
    names = rows[0]
    for k in range(1, 5):
        assert f"series_{k}_D_total_per_bohr" in names
    assert not any(name.startswith("difference") for name in names)
    comparison = view_scene(_state())
    column = names.index("series_4_D_total_per_bohr")
    total = next(c for c in comparison.series[3].curves if c.subshell is None)
    np.testing.assert_array_equal([float(r[column]) for r in rows[1:]], total.y)


def test_slice_npz_writes_every_series_panel(tmp_path):
    state = _state(view="slice")
    with np.load(export_view(state, tmp_path / "four.npz"), allow_pickle=False) as data:
        metadata = json.loads(str(data["metadata"]))
        comparison = view_scene(state)
        assert metadata["panels"] == ["series_1", "series_2", "series_3", "series_4"]
        for k, scene in enumerate(comparison.series, start=1):
            np.testing.assert_array_equal(data[f"series_{k}_values"], scene.values)
            assert f"series_{k}_nodal_u" in data.files
        assert metadata["series_4"]["spec"] == "Mg+"
        assert "difference" not in data.files


def test_figures_draw_every_series_panel_and_an_overlay_one():
    side = _draw(view_scene(_state(view="slice")), COLUMN_WIDTHS["double"])
    panels = [ax for ax in side.axes if ax.get_images() and ax.get_visible() and ax.get_title(loc="left")]
    assert [ax.get_title(loc="left")[:4] for ax in panels] == ["(a) ", "(b) ", "(c) ", "(d) "]
    overlay_state = _state(compare=CompareSettings(**{**FOUR.__dict__, "overlay": True}))
    figure = _draw(view_scene(overlay_state), COLUMN_WIDTHS["double"])
    drawn = [ax for ax in figure.axes if ax.get_visible() and ax.lines]
    assert len(drawn) == 1
    styles = {line.get_linestyle() for line in drawn[0].lines if line.get_label() == "total · Mg+, Slater"}
    solid = {line.get_linestyle() for line in drawn[0].lines if line.get_label() == "total · Na, Slater"}
    assert styles and solid and styles != solid  # one line style per series
    labels = [t.get_text() for t in drawn[0].get_legend().get_texts()]
    assert {"Na, Slater", "Na, Clementi–Raimondi", "Na, hydrogenic", "Mg+, Slater"} <= set(labels)


def test_pair_npz_names_its_three_panels(tmp_path):
    state = ViewState(left=Source("N", "slater"), view="pair",
                      slice=SliceSettings(resolution=32, extent=4.0, fit_extent=False)).validated()
    with np.load(export_view(state, tmp_path / "pair.npz"), allow_pickle=False) as data:
        metadata = json.loads(str(data["metadata"]))
        scenes = view_scene(state)
        assert metadata["kind"] == "zeffir-pair-densities"
        assert metadata["panels"] == ["same_spin", "opposite_spin", "exchange_hole"]
        np.testing.assert_array_equal(data["exchange_hole_values"], scenes.exchange_hole.values)
        assert float(np.max(data["exchange_hole_values"])) <= 0.0
