"""Slice data files hold the nodal lines drawn, as plane coordinates a script can use."""

import json

import numpy as np
import pytest

from zeffir.core import ANGSTROM_PER_BOHR
from zeffir.export import export_view, write_data
from zeffir.scene import compare_slices, slice_scene
from zeffir.state import (
    CompareSettings,
    OrbitalChoice,
    SliceSettings,
    Source,
    TwoElectronSettings,
    ViewState,
)

EXTENT = 8.0  # bohr
P_Z = OrbitalChoice("2p", "real", 0)


def _p_z_settings(resolution, quantity="psi"):
    return SliceSettings(plane="xz", extent=EXTENT, resolution=resolution, quantity=quantity)


def _finite(u, v):
    # One NaN in both arrays separates two polylines; nowhere is only one of them NaN.
    np.testing.assert_array_equal(np.isnan(u), np.isnan(v))
    keep = np.isfinite(u)
    return u[keep], v[keep]


def _reaches_both_edges(along, edge, pixel):
    ends = np.concatenate(([-edge], np.sort(along), [edge]))
    return float(np.diff(ends).max()) <= pixel * (1 + 1e-9)


@pytest.mark.parametrize(("resolution", "unit"), [(255, "bohr"), (256, "bohr"), (255, "angstrom")])
def test_slice_npz_nodal_lines_lie_on_the_nodal_plane_of_2pz(tmp_path, resolution, unit):
    scene = slice_scene(Source("H 2p1", "hydrogenic"), P_Z, _p_z_settings(resolution), unit)
    with np.load(write_data(scene, tmp_path / "s.npz"), allow_pickle=False) as data:
        u, v = _finite(data["nodal_u"], data["nodal_v"])
        grid = data["u"]
        metadata = json.loads(str(data["metadata"]))
    assert u.size, "no nodal line in the file"
    # ψ ∝ z, odd under z → −z: the node z = 0 is traced exactly (a grid row at odd
    # resolutions, the midpoint of two opposite rows at even ones).
    np.testing.assert_allclose(v, 0.0, rtol=0, atol=1e-9 * EXTENT)
    edge = EXTENT * (ANGSTROM_PER_BOHR if unit == "angstrom" else 1.0)
    assert grid[-1] == pytest.approx(edge)
    assert _reaches_both_edges(u, edge, float(grid[1] - grid[0]))
    assert "nodal_u" in metadata["nodal_lines"]


def test_slice_npz_holds_the_very_nodal_lines_the_view_draws(tmp_path):
    scene = slice_scene(Source("H 3d1", "hydrogenic"), OrbitalChoice("3d", "real", 1),
                        _p_z_settings(301)).with_contours()
    with np.load(write_data(scene, tmp_path / "s.npz"), allow_pickle=False) as data:
        np.testing.assert_array_equal(data["nodal_u"], scene.contours.zero[:, 0])
        np.testing.assert_array_equal(data["nodal_v"], scene.contours.zero[:, 1])
    assert np.isfinite(scene.contours.zero).any()


def test_slice_npz_nodal_lines_are_empty_for_a_density(tmp_path):
    scene = slice_scene(Source("H 2p1", "hydrogenic"), P_Z, _p_z_settings(64, "psi2"))
    with np.load(write_data(scene, tmp_path / "s.npz"), allow_pickle=False) as data:
        assert data["nodal_u"].shape == (0,) and data["nodal_v"].shape == (0,)
        assert data["nodal_u"].dtype == np.float64


def test_comparison_npz_holds_the_nodal_lines_of_every_panel(tmp_path):
    state = ViewState(
        left=Source("H 2p1", "hydrogenic"), orbital=P_Z, view="slice", slice=_p_z_settings(255),
        compare=CompareSettings(True, Source("He+ 2p1", "hydrogenic"), same_atom=False),
    ).validated()
    comparison = compare_slices(state)
    with np.load(write_data(comparison, tmp_path / "c.npz"), allow_pickle=False) as data:
        assert "nodal_u" not in data.files  # each panel once, under its own name
        pixel = float(data["u"][1] - data["u"][0])
        for prefix in ("series_1_", "series_2_", "difference_"):
            u, v = _finite(data[f"{prefix}nodal_u"], data[f"{prefix}nodal_v"])
            # Both ψ are odd in z and so is right − left: z = 0 is a node of each panel.
            on_node = np.abs(v) <= 1e-9 * EXTENT
            assert _reaches_both_edges(u[on_node], EXTENT, pixel), prefix


def test_two_electron_collinear_npz_holds_the_triplet_line_where_the_electrons_meet(tmp_path):
    state = ViewState(left=Source("He 1s1 2p1", "hydrogenic"), view="two-electron",
                      two_electron=TwoElectronSettings("collinear", 10.0, 255))
    with np.load(export_view(state, tmp_path / "t.npz"), allow_pickle=False) as data:
        s1, s2 = _finite(data["triplet_nodal_u"], data["triplet_nodal_v"])
        grid = data["u"]
        metadata = json.loads(str(data["metadata"]))
    meet = np.abs(s1 - s2) <= 1e-9 * grid[-1]
    assert _reaches_both_edges(s1[meet], grid[-1], float(grid[1] - grid[0]))
    assert metadata["triplet"]["units"]["values"] == "bohr⁻³"
    assert metadata["triplet"]["formula"] == "ψ(s₁ẑ, s₂ẑ)"


def test_two_electron_radial_npz_has_no_nodal_lines_in_its_distributions(tmp_path):
    state = ViewState(left=Source("Li+ 1s1 2s1", "hydrogenic"), view="two-electron",
                      two_electron=TwoElectronSettings("radial", 10.0, 64))
    with np.load(export_view(state, tmp_path / "r.npz"), allow_pickle=False) as data:
        # P(r1, r2) >= 0 has no sign to change; only triplet − singlet may.
        assert data["singlet_nodal_u"].size == 0 and data["triplet_nodal_u"].size == 0
        assert "difference_nodal_u" in data.files
        metadata = json.loads(str(data["metadata"]))
    assert metadata["singlet"]["units"]["values"] == "bohr⁻²"
    assert metadata["panels"] == ["singlet", "triplet", "difference"]
    assert metadata["kind"] == "zeffir-two-electron-maps"
