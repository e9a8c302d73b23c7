"""NPZ format 2: each panel once under its name, image only where it differs, the plane as numbers."""

from __future__ import annotations

import json

import numpy as np
import pytest

from zeffir import __version__
from zeffir.core import ANGSTROM_PER_BOHR
from zeffir.export import export_view
from zeffir.scene import plane_of, view_scene
from zeffir.state import (
    ColourSettings,
    CompareSettings,
    OrbitalChoice,
    PairSettings,
    SliceSettings,
    Source,
    TwoElectronSettings,
    ViewState,
)

_SLICE = SliceSettings(plane="custom", normal=(1.0, 2.0, 2.0), offset=0.7, extent=5.0, resolution=24,
                       fit_extent=False, quantity="psi")
_PLANE_KEYS = {"origin", "axis_u", "axis_v", "normal", "offset"}


def _load(path):
    with np.load(path, allow_pickle=False) as data:
        return {key: data[key] for key in data.files}


def _metadata(arrays) -> dict:
    return json.loads(str(arrays["metadata"]))


def _panel_keys(prefix: str, image: bool) -> set[str]:
    keys = {f"{prefix}values", f"{prefix}nodal_u", f"{prefix}nodal_v"}
    return keys | {f"{prefix}image"} if image else keys


def test_a_linear_slice_stores_values_once_and_a_log_slice_adds_its_image(tmp_path):
    state = ViewState(left=Source("Na", "slater"), view="slice", slice=_SLICE).validated()
    linear = _load(export_view(state, tmp_path / "linear.npz"))
    assert set(linear) == _panel_keys("", False) | {"u", "metadata"} | _PLANE_KEYS
    meta = _metadata(linear)
    assert meta["format_version"] == 2 and meta["zeffir_version"] == __version__
    assert meta["log_scale"] is False and meta["image"].startswith("values")

    log = state.with_changes(slice=SliceSettings(
        plane="xy", extent=5.0, resolution=24, fit_extent=False, quantity="density",
        colour=ColourSettings(log_scale=True)))
    arrays = _load(export_view(log, tmp_path / "log.npz"))
    scene = view_scene(log.validated())
    assert set(arrays) == _panel_keys("", True) | {"u", "metadata"} | _PLANE_KEYS
    np.testing.assert_array_equal(arrays["image"], scene.image)
    assert not np.array_equal(arrays["image"], arrays["values"])
    assert _metadata(arrays)["log_scale"] is True


@pytest.mark.parametrize("unit", ["bohr", "angstrom"])
def test_plane_arrays_place_every_grid_point(tmp_path, unit):
    state = ViewState(left=Source("Na", "slater"), view="slice", slice=_SLICE, length_unit=unit).validated()
    arrays = _load(export_view(state, tmp_path / "p.npz"))
    scale = 1.0 if unit == "bohr" else ANGSTROM_PER_BOHR
    x, y, z = plane_of(state.slice).points()  # bohr, [j, i]
    u = arrays["u"]
    points = (arrays["origin"] + u[None, :, None] * arrays["axis_u"] + u[:, None, None] * arrays["axis_v"])
    np.testing.assert_allclose(points, np.stack((x, y, z), axis=-1) * scale, rtol=0, atol=1e-12 * 5 * scale)
    np.testing.assert_allclose(arrays["normal"], np.array([1.0, 2.0, 2.0]) / 3.0, rtol=0, atol=1e-15)
    assert arrays["offset"].shape == () and float(arrays["offset"]) == pytest.approx(0.7 * scale, rel=1e-15)
    np.testing.assert_allclose(arrays["origin"], float(arrays["offset"]) * arrays["normal"], rtol=1e-15)
    basis = np.stack((arrays["axis_u"], arrays["axis_v"], arrays["normal"]))
    np.testing.assert_allclose(basis @ basis.T, np.eye(3), rtol=0, atol=1e-15)
    assert _metadata(arrays)["length_unit"] == ("bohr" if unit == "bohr" else "Å")


def test_a_comparison_stores_each_panel_once_under_its_name(tmp_path):
    state = ViewState(left=Source("Na", "slater"), view="slice", slice=_SLICE,
                      compare=CompareSettings(True, Source("Na", "clementi"), True, True)).validated()
    arrays = _load(export_view(state, tmp_path / "c.npz"))
    comparison = view_scene(state)
    names = ("series_1", "series_2", "difference")
    expected = set().union(*(_panel_keys(f"{name}_", False) for name in names))
    assert set(arrays) == expected | {"u", "metadata"} | _PLANE_KEYS
    np.testing.assert_array_equal(arrays["series_1_values"], comparison.left.values)
    np.testing.assert_array_equal(arrays["series_2_values"], comparison.right.values)
    np.testing.assert_array_equal(arrays["difference_values"],
                                  arrays["series_2_values"] - arrays["series_1_values"])
    meta = _metadata(arrays)
    assert meta["panels"] == ["series_1", "series_2", "difference"] and meta["values_panel"] == "series_1"
    assert meta["series"] == [{"panel": "series_1", "spec": "Na", "model": "slater"},
                              {"panel": "series_2", "spec": "Na", "model": "clementi"}]
    assert meta["format_version"] == 2 and "left" not in meta and "right" not in meta


def test_the_pair_file_names_its_own_panels_and_its_reference_electron(tmp_path):
    state = ViewState(left=Source("C", "clementi"), view="pair", slice=_SLICE,
                      pair=PairSettings(reference=(0.0, 0.0, 1.2), spin="up")).validated()
    arrays = _load(export_view(state, tmp_path / "pair.npz"))
    pair = view_scene(state)
    expected = (_panel_keys("same_spin_", False) | _panel_keys("opposite_spin_", False)
                | _panel_keys("exchange_hole_", True))
    assert set(arrays) == expected | {"u", "metadata"} | _PLANE_KEYS
    # The hole's colours are its depth: the one image that is not its values.
    np.testing.assert_array_equal(arrays["exchange_hole_image"], -arrays["exchange_hole_values"])
    np.testing.assert_array_equal(arrays["same_spin_values"], pair.same_spin.values)
    meta = _metadata(arrays)
    text = json.dumps(meta, ensure_ascii=False)
    assert "right" not in text and "left" not in text and "difference" not in text
    assert meta["panels"] == ["same_spin", "opposite_spin", "exchange_hole"]
    for name in meta["panels"]:
        assert meta[name]["quantity"] == name and meta[name]["quantity_name"] != "total density ρ"
    assert "ρ₂↑↑" in meta["same_spin"]["quantity_name"] and "ρ₂↑↓" in meta["opposite_spin"]["quantity_name"]
    assert meta["exchange_hole"]["image"].startswith("−values")
    reference = meta["reference_electron"]
    assert reference["position"] == [0.0, 0.0, 1.2] and reference["spin"] == "up"
    assert reference["hole_integral"] == pytest.approx(-1.0, abs=1e-3)


def test_two_electron_maps_say_they_are_not_on_a_plane(tmp_path):
    state = ViewState(left=Source("He 1s1 2s1", "hydrogenic"), view="two-electron",
                      two_electron=TwoElectronSettings("radial", 10.0, 32)).validated()
    arrays = _load(export_view(state, tmp_path / "t.npz"))
    assert not (_PLANE_KEYS & set(arrays))
    meta = _metadata(arrays)
    assert meta["plane"].startswith("none: the two-electron maps are not on a plane")
    assert meta["difference"]["quantity_name"].startswith("triplet − singlet")
    assert "right" not in json.dumps(meta, ensure_ascii=False)
    np.testing.assert_array_equal(arrays["difference_values"],
                                  arrays["triplet_values"] - arrays["singlet_values"])


def test_no_two_arrays_of_a_file_hold_the_same_grid(tmp_path):
    states = [
        ViewState(left=Source("Na", "slater"), view="slice", slice=_SLICE,
                  compare=CompareSettings(True, Source("Mg", "slater"), same_atom=False)),
        ViewState(left=Source("C", "clementi"), view="pair", slice=_SLICE),
        ViewState(left=Source("He 1s1 2p1", "hydrogenic"), view="two-electron",
                  two_electron=TwoElectronSettings("collinear", 8.0, 24)),
    ]
    for k, state in enumerate(states):
        arrays = _load(export_view(state.validated(), tmp_path / f"{k}.npz"))
        grids = [(key, a) for key, a in arrays.items() if a.ndim == 2]
        for i, (key, a) in enumerate(grids):
            for other, b in grids[i + 1:]:
                assert not np.array_equal(a, b), (state.view, key, other)


def test_orbital_choice_reaches_the_metadata(tmp_path):
    state = ViewState(left=Source("Cl", "slater"), orbital=OrbitalChoice("3p", "real", 1), view="slice",
                      slice=_SLICE).validated()
    meta = _metadata(_load(export_view(state, tmp_path / "o.npz")))
    assert meta["kind"] == "zeffir-slice" and meta["orbital"].startswith("3p")
    assert "grid point (i, j) is at origin + u[i]·axis_u + u[j]·axis_v" in meta["plane"]
