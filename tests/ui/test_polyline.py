"""The drawn subset of a curve's samples stays on the curve to a fraction of a pixel."""

from __future__ import annotations

import itertools
from dataclasses import replace

import numpy as np
import pytest

from zeffir.scene import VIEW_RECIPES, panels_of
from zeffir.state import OrbitalChoice, Source, ViewState
from zeffir.ui._polyline import drawn_subset


def _worst_departure(px: np.ndarray, py: np.ndarray, kept: np.ndarray) -> float:
    """Largest distance (px) of any sample from the chord of the kept points around it."""
    worst = 0.0
    for a, b in itertools.pairwise(kept):
        if b - a < 2:
            continue
        sx, sy = px[b] - px[a], py[b] - py[a]
        qx, qy = px[a + 1:b] - px[a], py[a + 1:b] - py[a]
        length2 = sx * sx + sy * sy
        t = np.clip((qx * sx + qy * sy) / length2, 0.0, 1.0) if length2 > 0 else 0.0
        worst = max(worst, float(np.hypot(qx - t * sx, qy - t * sy).max()))
    return worst


def _pixel_curves(spec: str, log_r: bool) -> list[tuple[np.ndarray, np.ndarray]]:
    """The radial curves of ``spec`` mapped onto a 1400 × 700 pixel plot."""
    state = ViewState(left=Source(spec, "slater"), orbital=OrbitalChoice("3d"), view="radial")
    state = replace(state, radial=replace(state.radial, log_r=log_r))
    scene = next(iter(panels_of(VIEW_RECIPES["radial"].build(state))))
    xs = [np.asarray(c.x, dtype=float) for c in scene.curves]
    ys = [np.asarray(c.y, dtype=float) for c in scene.curves]
    if log_r:
        keep = [x > 0 for x in xs]
        xs = [np.log10(x[k]) for x, k in zip(xs, keep, strict=True)]
        ys = [y[k] for y, k in zip(ys, keep, strict=True)]
    x0, x1 = min(x.min() for x in xs), max(x.max() for x in xs)
    y0, y1 = min(y.min() for y in ys), max(y.max() for y in ys)
    return [((x - x0) / (x1 - x0) * 1400.0, (y - y0) / (y1 - y0) * 700.0)
            for x, y in zip(xs, ys, strict=True)]


@pytest.mark.parametrize("spec", ["Fe", "Xe", "U"])
@pytest.mark.parametrize("log_r", [False, True])
def test_radial_curves_keep_their_shape_with_few_points(spec: str, log_r: bool) -> None:
    kept_total = samples = 0
    for px, py in _pixel_curves(spec, log_r):
        kept = drawn_subset(px, py)
        assert kept[0] == 0 and kept[-1] == px.size - 1
        assert np.all(np.diff(kept) > 0)
        assert _worst_departure(px, py, kept) <= 0.25
        # The peak of every curve is drawn exactly.
        assert int(np.argmax(py)) in set(kept.tolist())
        kept_total += kept.size
        samples += px.size
    assert kept_total <= 0.15 * samples


def test_a_kink_and_a_wave_are_kept() -> None:
    x = np.linspace(-500.0, 500.0, 2001)
    kept = drawn_subset(x, np.abs(x))
    assert 1000 in set(kept.tolist())  # the vertex
    wave_x = np.linspace(0.0, 1200.0, 4000)
    wave_y = 300.0 * np.sin(wave_x / 25.0)
    wave = drawn_subset(wave_x, wave_y)
    assert _worst_departure(wave_x, wave_y, wave) <= 0.25
    assert wave.size < 0.5 * wave_x.size


def test_a_straight_line_keeps_its_longest_chord_guard() -> None:
    x = np.linspace(0.0, 1000.0, 1500)
    kept = drawn_subset(x, 0.3 * x)
    chords = np.diff(np.hypot(x[kept], 0.3 * x[kept]))
    assert chords.max() <= 48.0 + 2.0  # the guard (plus one sample spacing)
    assert kept.size < 40


def test_gaps_and_short_lines_are_kept_whole() -> None:
    x = np.linspace(0.0, 100.0, 50)
    y = np.sin(x / 10.0)
    y[20] = np.nan
    kept = set(drawn_subset(x, y).tolist())
    assert {19, 20, 21} <= kept
    assert drawn_subset(np.array([0.0, 1.0, 2.0]), np.array([0.0, 5.0, 0.0])).tolist() == [0, 1, 2]


def test_radial_view_draws_a_subset_and_chooses_again_on_zoom(qtbot) -> None:
    from zeffir.ui._radial_view import RadialView

    state = ViewState(left=Source("Fe", "slater"), orbital=OrbitalChoice("3d"), view="radial")
    scene = next(iter(panels_of(VIEW_RECIPES["radial"].build(state))))
    view = RadialView()
    qtbot.addWidget(view)
    view.resize(1200, 700)
    view.show()
    qtbot.waitExposed(view)
    view.set_scene(scene)
    full, drawn = view.curve_data()["total"], view.drawn_data()["total"]
    assert full[0].size == np.asarray(scene.curves[-1].x).size
    assert drawn[0].size < 0.2 * full[0].size
    assert set(drawn[0].tolist()) <= set(full[0].tolist())  # drawn points are samples
    # Zoomed into the inner 0.2 bohr, the samples there are chosen more densely.
    inner = 0.2
    before = int(np.count_nonzero(drawn[0] <= inner))
    view._plot.setXRange(0.0, inner, padding=0)
    after = int(np.count_nonzero(view.drawn_data()["total"][0] <= inner))
    assert after > before
