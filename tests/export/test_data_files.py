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
    assert text.splitlines()[0] == ",".join(names)  # the names come first, then the notes
    return header, names, np.array([[float(v) for v in row] for row in body])


def test_radial_csv_has_a_self_describing_header_and_one_column_per_curve(tmp_path, state):
    scene = radial_scene(state.left, state.radial, "bohr", "3s")
    header, names, table = _read_csv(write_data(scene, tmp_path / "r.csv"))
    text = "\n".join(header)
    for needed in ("spec: Na", "model: slater", "quantity: D", "r in bohr", "bohr⁻¹",
                   f"zeffir_version: {__version__}", "format_version: 2", CODATA_EDITION,
                   "model estimate", "3s, 1 electron"):
        assert needed in text
    assert names == ["r_bohr", *(f"D_{c.subshell or 'total'}_per_bohr" for c in scene.curves)]
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
    assert any(line.startswith("# series_1: spec Na; model slater") for line in header)
    assert any(line.startswith("# series_2: spec Mg; model slater") for line in header)
    column = {name: table[:, i] for i, name in enumerate(names)}
    assert {n.split("_D_")[0] for n in names[1:]} == {"series_1", "series_2", "difference"}
    for curve in comparison.difference.curves:
        key = f"D_{curve.subshell or 'total'}_per_bohr"
        delta = column[f"series_2_{key}"] - column[f"series_1_{key}"]
        assert np.array_equal(column[f"difference_{key}"], delta)


def test_slice_npz_holds_exactly_the_scene_arrays_and_metadata(tmp_path, state):
    scene = slice_scene(state.left, state.orbital, state.slice)
    with np.load(write_data(scene, tmp_path / "s.npz"), allow_pickle=False) as data:
        assert np.array_equal(data["values"], scene.values)
        assert np.array_equal(data["image"], scene.image)  # a log scale: stored apart
        assert np.array_equal(data["u"], scene.coordinates)
        metadata = json.loads(str(data["metadata"]))
    assert metadata["spec"] == "Na" and metadata["model"] == "slater"
    assert metadata["orbital"] == "3s" and metadata["quantity"] == "psi2"
    assert metadata["plane_text"] == scene.plane_text
    assert metadata["units"] == {"u": "bohr", "values": "bohr⁻³", "image": "log10 of bohr⁻³"}
    assert metadata["colour_range"] == list(scene.colour_range)
    assert metadata["zeffir_version"] == __version__ and metadata["format_version"] == 2


def test_slice_comparison_npz_difference_is_right_minus_left(tmp_path, state):
    comparison = compare_slices(state)
    with np.load(write_data(comparison, tmp_path / "c.npz"), allow_pickle=False) as data:
        assert np.array_equal(data["series_1_values"], comparison.left.values)
        assert np.array_equal(data["series_2_values"], comparison.right.values)
        assert np.array_equal(data["difference_values"],
                              data["series_2_values"] - data["series_1_values"])
        metadata = json.loads(str(data["metadata"]))
    assert metadata["series_2"]["spec"] == "Mg" and metadata["values_panel"] == "series_1"
    assert metadata["difference"]["signed"] is True
    assert "series_2 − series_1" in metadata["difference"]["quantity_name"]


def test_csv_for_a_slice_and_npz_for_curves_are_refused(tmp_path, state):
    scene = slice_scene(state.left, state.orbital, state.slice)
    with pytest.raises(ExportError, match=r"s\.csv: a slice is written as \.npz"):
        write_data(scene, tmp_path / "s.csv")
    with pytest.raises(ExportError, match=r"r\.npz: radial curves are written as \.csv"):
        write_data(radial_scene(state.left, state.radial), tmp_path / "r.npz")
    with pytest.raises(ExportError, match=r"r\.txt: data are written as \.csv, \.npz"):
        write_data(scene, tmp_path / "r.txt")
    assert list(tmp_path.iterdir()) == []
