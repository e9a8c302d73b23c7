"""One place decides what each view draws: the window and the exporters use the same recipes."""

from __future__ import annotations

import ast
from pathlib import Path

import numpy as np

from zeffir.export import view_target
from zeffir.scene import FIGURE_VIEWS, VIEW_RECIPES, PairScenes, TwoElectronScenes, panels_of, view_scene
from zeffir.state import VIEW_NAMES, CompareSettings, SliceSettings, Source, ViewState

APP = Path(__file__).resolve().parents[2] / "app" / "zeffir"


def test_every_view_has_one_recipe_and_the_figure_views_exclude_the_table():
    # The Terms view is a table; the Trends view has its own writer (write_trend).
    assert set(VIEW_RECIPES) == set(VIEW_NAMES)
    assert set(FIGURE_VIEWS) == set(VIEW_NAMES) - {"terms", "trends"}


def test_the_exporter_draws_the_recipe_scene():
    state = ViewState(left=Source("Ne", "slater"), view="slice",
                      slice=SliceSettings(resolution=24, extent=4.0, fit_extent=False),
                      compare=CompareSettings(True, Source("Ne", "clementi"))).validated()
    exported, shown = view_target(state), view_scene(state)
    assert [p.title for p in panels_of(exported)] == [p.title for p in panels_of(shown)]
    for a, b in zip(panels_of(exported), panels_of(shown), strict=True):
        np.testing.assert_array_equal(a.values, b.values)


def test_pair_and_two_electron_scenes_have_their_own_named_panels():
    assert PairScenes.panel_names == ("same_spin", "opposite_spin", "exchange_hole")
    assert TwoElectronScenes.panel_names == ("singlet", "triplet", "difference")
    for cls in (PairScenes, TwoElectronScenes):
        assert not hasattr(cls, "left") and not hasattr(cls, "right")


def test_the_window_keeps_no_copy_of_the_view_table_nor_file_dialogs():
    tree = ast.parse((APP / "ui" / "_main_window.py").read_text(encoding="utf-8"))
    names = {node.id for node in ast.walk(tree) if isinstance(node, ast.Name)}
    assigned = {t.id for node in ast.walk(tree) if isinstance(node, ast.Assign)
                for t in node.targets if isinstance(t, ast.Name)}
    assert "_JOBS" not in assigned
    assert "QFileDialog" not in names  # sessions and exports live in their own modules
    assert "VIEW_RECIPES" in names
