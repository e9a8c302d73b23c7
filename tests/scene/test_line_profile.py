"""Line profiles: the slice's values along a segment, exact for linear fields, true to ψ, in CSV."""

from __future__ import annotations

import math
from dataclasses import replace
from pathlib import Path

import numpy as np
import pytest
import sympy as sp

from zeffir import __version__
from zeffir.core import ANGSTROM_PER_BOHR, HydrogenicRadial, ZeffirError, real_harmonic
from zeffir.export._errors import ExportError
from zeffir.export._profile_data import PROFILE_COLUMNS, PROFILE_SKIPROWS, profile_csv_text, write_profile_csv
from zeffir.scene import SliceScene, slice_scene
from zeffir.scene._profile import LineProfile, line_profile, sample_bilinear, values_label
from zeffir.state import ColourSettings, OrbitalChoice, SliceSettings, Source

HYDROGEN = Source("H 2p1", "hydrogenic")
P_Z = OrbitalChoice("2p", "real", 0)
#: 801 points on ±8 bohr: a grid step of exactly 0.02 bohr.
FINE = SliceSettings(plane="xz", extent=8.0, resolution=801, quantity="psi")


@pytest.fixture(scope="module")
def p_z() -> SliceScene:
    """Hydrogen 2pz (bare nucleus, Z = 1) in the xz plane: x across, z up."""
    return slice_scene(HYDROGEN, P_Z, FINE)


@pytest.fixture(scope="module")
def coarse() -> SliceScene:
    """A small slice whose values the linear-field tests replace."""
    return slice_scene(Source("Ne", "slater"), OrbitalChoice("2p", "real", 0),
                       SliceSettings(plane="xz", extent=3.0, resolution=41))


def _segments(extent: float, count: int, seed: int) -> list[tuple[tuple[float, float], tuple[float, float]]]:
    """Seeded random segments inside the grid, plus the corner-to-corner and edge-to-edge ones."""
    rng = np.random.default_rng(seed)
    ends = rng.uniform(-extent, extent, size=(count, 4))
    fixed = [(-extent, -extent, extent, extent), (extent, -extent, -extent, extent),
             (-extent, 0.0, extent, 0.0), (0.0, extent, 0.0, -extent)]
    return [((a, b), (c, d)) for a, b, c, d in [*fixed, *ends.tolist()]]


# -- interpolation ------------------------------------------------------------------------------


def test_bilinear_sampling_is_exact_for_linear_and_bilinear_fields(coarse):
    c = coarse.coordinates
    u, v = c[None, :], c[:, None]
    field = 0.7 - 1.9 * u + 2.3 * v + 0.45 * u * v  # values[j, i] at (u_i, v_j)
    scene = replace(coarse, values=field, image=field)
    extent = float(c[-1])
    with np.errstate(all="raise"):
        for start, end in _segments(extent, 40, seed=11):
            profile = line_profile(scene, start, end, points=257)
            expected = 0.7 - 1.9 * profile.u + 2.3 * profile.v + 0.45 * profile.u * profile.v
            # Exact but for rounding: values are O(10), a few ulps of that.
            np.testing.assert_allclose(profile.values, expected, rtol=0, atol=1e-13)


def test_transposed_grid_would_be_caught(coarse):
    # values[j, i] has j along v: a field that grows along v only must not appear along u.
    c = coarse.coordinates
    field = np.broadcast_to(c[:, None], (c.size, c.size)).copy()
    profile = line_profile(replace(coarse, values=field, image=field), (-1.0, 0.25), (1.0, 0.25))
    np.testing.assert_allclose(profile.values, 0.25, rtol=0, atol=1e-14)


def test_grid_nodes_are_returned_unchanged(coarse):
    c = coarse.coordinates
    j, i = np.meshgrid(np.arange(c.size), np.arange(c.size), indexing="ij")
    values = sample_bilinear(coarse.values, c, c[i].ravel(), c[j].ravel())
    np.testing.assert_array_equal(values, coarse.values.ravel())


def test_profile_agrees_with_the_exact_hydrogen_2pz(p_z):
    start, end = (-0.37, -7.3), (0.81, 7.6)  # across both lobes and the nodal plane z = 0, off-grid
    profile = line_profile(p_z, start, end, points=1001)
    x, z = profile.u, profile.v  # the xz plane at y = 0
    r = np.hypot(x, z)
    theta = np.arctan2(np.abs(x), z)
    exact = HydrogenicRadial(2, 1, 1.0)(r) * real_harmonic(1, 0, theta, np.zeros_like(r))
    # Tolerance: bilinear interpolation errs by at most h²/8 (max|ψ_xx| + max|ψ_zz|) on a grid of
    # step h; the second derivatives are those of the closed form ψ = z e^{-r/2}/(4√(2π)) taken by
    # sympy, maximised on a mesh 4× finer than the grid (5 % margin for the mesh missing the
    # peak). The slice's own radial table adds < 1e-9 of max|ψ| (see core.density._radial_table).
    xs, zs = sp.symbols("x z", real=True)
    psi = zs * sp.exp(-sp.sqrt(xs**2 + zs**2) / 2) / (4 * sp.sqrt(2 * sp.pi))
    second = [sp.lambdify((xs, zs), sp.diff(psi, w, 2), "numpy") for w in (xs, zs)]
    h = float(p_z.coordinates[1] - p_z.coordinates[0])
    mesh = np.linspace(-8.0, 8.0, 4 * 800 + 2)  # even count: never exactly the singular r = 0
    mx, mz = np.meshgrid(mesh, mesh)
    bound = h**2 / 8 * sum(float(np.max(np.abs(f(mx, mz)))) for f in second) * 1.05
    tolerance = bound + 1e-9 * float(np.max(np.abs(exact)))
    error = np.max(np.abs(profile.values - exact))
    assert error <= tolerance
    # The bound is tight enough to matter: the nearest grid value would miss it by far.
    nearest = p_z.values[np.rint((z + 8.0) / h).astype(int), np.rint((x + 8.0) / h).astype(int)]
    assert np.max(np.abs(nearest - exact)) > 10 * tolerance
    # ψ's sign follows z: the positive lobe up.
    assert profile.values[np.argmin(np.abs(z - 2.0))] > 0 > profile.values[np.argmin(np.abs(z + 2.0))]


def test_samples_outside_the_grid_are_nan(p_z):
    profile = line_profile(p_z, (-10.0, 1.0), (6.0, -9.5), points=500)
    outside = (np.abs(profile.u) > 8.0) | (np.abs(profile.v) > 8.0)
    assert outside.any() and (~outside).any()
    assert np.all(np.isnan(profile.values[outside]))
    assert np.all(np.isfinite(profile.values[~outside]))
    entirely = line_profile(p_z, (9.0, 9.0), (12.0, 8.5))
    assert np.all(np.isnan(entirely.values))


# -- geometry and labels ------------------------------------------------------------------------


def test_distance_runs_from_the_start_to_the_length(p_z):
    start, end = (1.5, -2.0), (-3.5, 4.0)
    profile = line_profile(p_z, start, end, points=123)
    assert profile.s.shape == profile.u.shape == profile.v.shape == profile.values.shape == (123,)
    assert profile.s[0] == 0.0 and profile.length == pytest.approx(math.hypot(5.0, 6.0), rel=1e-15)
    assert (profile.u[0], profile.v[0]) == start and (profile.u[-1], profile.v[-1]) == end
    np.testing.assert_allclose(np.diff(profile.s), profile.length / 122, rtol=1e-12)
    np.testing.assert_allclose(np.hypot(profile.u - start[0], profile.v - start[1]), profile.s,
                               rtol=1e-12, atol=1e-14)


def test_profile_is_labelled_with_the_scene_and_its_ends(p_z):
    profile = line_profile(p_z, (-1.0, 0.5), (2.0, 3.0))
    assert profile.value_label == p_z.value_label == "ψ / bohr⁻³ᐟ²"
    assert profile.axis_names == ("x", "z") and profile.length_unit == "bohr"
    assert profile.distance_label == "distance along the segment / bohr"
    for part in ("H 2p1", "hydrogenic", "2pz", "(x, z) = (−1, 0.5)", "(2, 3) bohr"):
        assert part in profile.title
    assert profile.signed and not profile.log_scale


def test_log_scale_profiles_the_values_not_their_logarithm():
    settings = SliceSettings(plane="xz", extent=4.0, resolution=81, quantity="density")
    linear = slice_scene(Source("Ne", "slater"), P_Z, settings)
    logged = slice_scene(Source("Ne", "slater"), P_Z,
                         replace(settings, colour=ColourSettings(log_scale=True)))
    assert logged.value_label.startswith("log₁₀ ")
    a = line_profile(linear, (-3.0, -1.0), (3.5, 2.0))
    b = line_profile(logged, (-3.0, -1.0), (3.5, 2.0))
    np.testing.assert_array_equal(b.values, a.values)
    assert b.value_label == a.value_label == "ρ / bohr⁻³" and b.log_scale and not a.log_scale
    assert np.all(b.values > 0)


def test_the_hole_profile_is_labelled_as_h_itself(coarse):
    # The exchange hole's colours show the depth −h, its values hold h (≤ 0).
    hole = replace(coarse, value_label="depth −hₓ↑(r₁; r₂) / bohr⁻³")
    assert values_label(hole) == "hₓ↑(r₁; r₂) / bohr⁻³"


def test_angstrom_profile_is_the_bohr_profile_rescaled():
    settings = SliceSettings(plane="xz", extent=5.0, resolution=101, quantity="psi")
    bohr = slice_scene(Source("Ne", "slater"), P_Z, settings, "bohr")
    angstrom = slice_scene(Source("Ne", "slater"), P_Z, settings, "angstrom")
    start, end = (-2.2, -3.1), (1.7, 4.4)
    in_bohr = line_profile(bohr, start, end)
    in_angstrom = line_profile(angstrom, tuple(c * ANGSTROM_PER_BOHR for c in start),
                               tuple(c * ANGSTROM_PER_BOHR for c in end))
    np.testing.assert_allclose(in_angstrom.s, in_bohr.s * ANGSTROM_PER_BOHR, rtol=1e-13)
    np.testing.assert_allclose(in_angstrom.values, in_bohr.values * ANGSTROM_PER_BOHR**-1.5,
                               rtol=1e-9, atol=1e-12)
    assert in_angstrom.length_symbol == "Å" and in_angstrom.distance_label.endswith("/ Å")


def test_a_segment_needs_two_distinct_finite_ends_and_two_points(p_z):
    with pytest.raises(ZeffirError, match="coincide"):
        line_profile(p_z, (1.0, 1.0), (1.0, 1.0))
    with pytest.raises(ZeffirError, match="finite"):
        line_profile(p_z, (math.nan, 0.0), (1.0, 1.0))
    with pytest.raises(ValueError, match="at least 2"):
        line_profile(p_z, (0.0, 0.0), (1.0, 1.0), points=1)


# -- CSV ------------------------------------------------------------------------------------------


@pytest.fixture(scope="module")
def profile(p_z) -> LineProfile:
    """A segment that starts off the slice, so the file holds NaN too."""
    return line_profile(p_z, (-9.0, -6.0), (3.0, 5.0), points=300)


def test_csv_round_trip_with_numpy(tmp_path, profile):
    path = write_profile_csv(profile, tmp_path / "profile.csv")
    lines = path.read_text(encoding="utf-8").splitlines()
    notes = [line for line in lines if line.startswith("#")]
    assert lines[0] == "s_bohr,u_bohr,v_bohr,value_per_bohr3_2"  # the names first, with units
    assert lines[1:1 + len(notes)] == notes and PROFILE_SKIPROWS == 1
    assert [name.partition("_")[0] for name in lines[0].split(",")] == list(PROFILE_COLUMNS)
    table = np.loadtxt(path, delimiter=",", skiprows=PROFILE_SKIPROWS)
    assert table.shape == (300, 4)
    for column, expected in zip(table.T, (profile.s, profile.u, profile.v, profile.values), strict=True):
        np.testing.assert_array_equal(column, expected)  # shortest round-trip text: bit for bit
    assert np.isnan(table[0, 3]) and np.isfinite(table[-1, 3])
    header = "\n".join(notes)
    for part in (f"zeffir_version: {__version__}", "format_version: 2", "spec: H 2p1",
                 "model: hydrogenic", "xz plane",
                 "start (x, z) = (-9.0, -6.0) bohr", "end (3.0, 5.0) bohr",
                 "s, u, v in bohr; value in bohr⁻³ᐟ²", "u = x, v = z", "value = ψ"):
        assert part in header


def test_copied_text_is_the_file_with_tabs(profile):
    text = profile_csv_text(profile, delimiter="\t")
    assert text.replace("\t", ",") == profile_csv_text(profile)
    assert text.splitlines()[0] == "s_bohr\tu_bohr\tv_bohr\tvalue_per_bohr3_2"


@pytest.mark.parametrize("where", ["missing/profile.csv", "a_file/profile.csv", "a_folder"])
def test_unwritable_path_raises_export_error_and_writes_nothing(tmp_path, profile, where):
    (tmp_path / "a_file").write_text("not a folder", encoding="utf-8")
    (tmp_path / "a_folder").mkdir()
    before = sorted(p.relative_to(tmp_path) for p in tmp_path.rglob("*"))
    target = tmp_path / where
    with pytest.raises(ExportError, match="cannot write") as caught:
        write_profile_csv(profile, target)
    assert str(target) in str(caught.value)
    assert sorted(p.relative_to(tmp_path) for p in tmp_path.rglob("*")) == before
    assert (tmp_path / "a_file").read_text(encoding="utf-8") == "not a folder"


def test_a_failed_write_keeps_the_old_file(tmp_path, profile, monkeypatch):
    path = tmp_path / "profile.csv"
    path.write_text("old", encoding="utf-8")

    def refuse(*_args: object) -> None:
        raise OSError(28, "No space left on device")

    monkeypatch.setattr("zeffir.export._atomic.os.replace", refuse)
    with pytest.raises(ExportError, match="No space left"):
        write_profile_csv(profile, path)
    assert path.read_text(encoding="utf-8") == "old"
    assert [p.name for p in tmp_path.iterdir()] == ["profile.csv"]


def test_written_path_is_returned(tmp_path, profile):
    assert write_profile_csv(profile, str(tmp_path / "p.csv")) == Path(tmp_path / "p.csv")
