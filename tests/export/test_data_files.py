"""Data files: CSV for radial curves, NPZ for slices; the numbers are exactly the scene's."""

import csv
import io
import json

import numpy as np
import pytest

from zeffir import __version__
from zeffir.core import CODATA_EDITION
from zeffir.export import ExportError, write_data
from zeffir.scene import compare_radial, compare_slices, radial_scene, slice_scene
from zeffir.state import ColourSettings, CompareSettings, RadialSettings, SliceSettings, Source, ViewState

SMALL = SliceSettings(plane="xy", extent=6.0, resolution=40, quantity="psi2",
                      colour=ColourSettings(log_scale=True))


@pytest.fixture(scope="module")
def state():
    return ViewState(
        slice=SMALL, compare=CompareSettings(True, Source("Mg", "slater"), same_atom=False),
    ).validated()


def _read_csv(path):
    text = path.read_text(encoding="utf-8")
    header = [line for line in text.splitlines() if line.startswith("#")]
    rows = list(csv.reader(io.StringIO("\n".join(l for l in text.splitlines() if not l.startswith("#")))))
    names, body = rows[0], rows[1:]
    return header, names, np.array([[float(v) for v in row] for row in body])


def test_radial_csv_has_a_self_describing_header_and_one_column_per_curve(tmp_path, state):
    scene = radial_scene(state.left, state.radial, "bohr", "3s")
    header, names, table = _read_csv(write_data(scene, tmp_path / "r.csv"))
    text = "\n".join(header)
    for needed in ("spec: Na", "model: slater", "quantity: D", "r in bohr", "bohr⁻¹",
                   f"zeffir {__version__}", CODATA_EDITION, "model estimate"):
        assert needed in text
    assert names == ["r", *(c.label for c in scene.curves)]
    assert table.shape == (scene.curves[0].x.size, 1 + len(scene.curves))


def test_radial_csv_reads_back_to_exactly_the_plotted_values(tmp_path, state):
    scene = radial_scene(state.left, RadialSettings(quantity="R", log_r=True), "angstrom", "3s")
    _, _, table = _read_csv(write_data(scene, tmp_path / "r.csv"))
    assert np.array_equal(table[:, 0], scene.curves[0].x)
    for index, curve in enumerate(scene.curves, start=1):
        assert np.array_equal(table[:, index], curve.y)


def test_radial_comparison_csv_prefixes_columns_and_difference_is_right_minus_left(tmp_path, state):
    comparison = compare_radial(state)
    header, names, table = _read_csv(write_data(comparison, tmp_path / "c.csv"))
    assert "# left: spec Na; model slater" in header
    assert "# right: spec Mg; model slater" in header
    column = {name: table[:, i] for i, name in enumerate(names)}
    assert {n.split(":")[0] for n in names[1:]} == {"left", "right", "difference"}
    for curve in comparison.difference.curves:
        # Labels carry occupancies, which differ between Na and Mg: match by subshell.
        left = next(c for c in comparison.left.curves if c.subshell == curve.subshell)
        right = next(c for c in comparison.right.curves if c.subshell == curve.subshell)
        delta = column[f"right:{right.label}"] - column[f"left:{left.label}"]
        assert np.array_equal(column[f"difference:{curve.label}"], delta)


def test_slice_npz_holds_exactly_the_scene_arrays_and_metadata(tmp_path, state):
    scene = slice_scene(state.left, state.orbital, state.slice)
    with np.load(write_data(scene, tmp_path / "s.npz"), allow_pickle=False) as data:
        assert np.array_equal(data["values"], scene.values)
        assert np.array_equal(data["image"], scene.image)
        assert np.array_equal(data["u"], scene.coordinates)
        metadata = json.loads(str(data["metadata"]))
    assert metadata["spec"] == "Na" and metadata["model"] == "slater"
    assert metadata["orbital"] == "3s" and metadata["quantity"] == "psi2"
    assert metadata["plane_text"] == scene.plane_text
    assert metadata["units"] == {"u": "bohr", "values": "bohr⁻³", "image": "log10 of bohr⁻³"}
    assert metadata["colour_range"] == list(scene.colour_range)
    assert metadata["zeffir_version"] == __version__


def test_slice_comparison_npz_difference_is_right_minus_left(tmp_path, state):
    comparison = compare_slices(state)
    with np.load(write_data(comparison, tmp_path / "c.npz"), allow_pickle=False) as data:
        assert np.array_equal(data["left_values"], comparison.left.values)
        assert np.array_equal(data["right_values"], comparison.right.values)
        assert np.array_equal(data["difference"], data["right_values"] - data["left_values"])
        assert np.array_equal(data["values"], comparison.left.values)
        metadata = json.loads(str(data["metadata"]))
    assert metadata["right"]["spec"] == "Mg"
    assert metadata["difference"]["signed"] is True


def test_csv_for_a_slice_and_npz_for_curves_are_refused(tmp_path, state):
    scene = slice_scene(state.left, state.orbital, state.slice)
    with pytest.raises(ExportError, match=r"s\.csv: a slice is written as \.npz"):
        write_data(scene, tmp_path / "s.csv")
    with pytest.raises(ExportError, match=r"r\.npz: radial curves are written as \.csv"):
        write_data(radial_scene(state.left, state.radial), tmp_path / "r.npz")
    with pytest.raises(ExportError, match=r"r\.txt: data are written as \.csv, \.npz"):
        write_data(scene, tmp_path / "r.txt")
    assert list(tmp_path.iterdir()) == []
