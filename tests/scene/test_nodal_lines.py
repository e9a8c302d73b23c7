"""Nodal lines of signed slices: drawn at every resolution, and only where ψ changes sign."""

import math

import numpy as np
import pytest

from zeffir.core import set_compiled_kernels
from zeffir.scene import CONTOUR_POINTS, compare_slices, slice_scene
from zeffir.scene._contours import stray_zeros
from zeffir.state import CompareSettings, OrbitalChoice, SliceSettings, Source, ViewState

EXTENT = 12.0  # bohr: wide enough for both radial nodes of the hydrogen 3s


def _psi(spec, orbital, plane, resolution, extent=EXTENT):
    # slice_scene takes unvalidated settings, so resolutions below the window's
    # minimum (16) are evaluated too.
    settings = SliceSettings(plane=plane, extent=extent, resolution=resolution, quantity="psi")
    return slice_scene(Source(spec, "hydrogenic"), orbital, settings).with_contours()


def _points(scene):
    lines = scene.contours.zero
    return lines[np.isfinite(lines[:, 0])]


def _contour_pixel(scene):
    """Spacing of the grid the lines are traced on (the image is subsampled to CONTOUR_POINTS)."""
    step = max(1, math.ceil(scene.coordinates.size / CONTOUR_POINTS))
    return step * float(scene.coordinates[1] - scene.coordinates[0])


def _covers(along, low, high, gap):
    """True if the sorted values ``along`` reach both ends and leave no hole wider than ``gap``."""
    if along.size == 0:
        return False
    ends = np.concatenate(([low], np.sort(along), [high]))
    return float(np.diff(ends).max()) <= gap


def test_stray_zeros_are_the_zeros_without_both_signs_around_them():
    field = np.array([
        [2.0, 1.0, 0.0, 0.0],
        [0.0, 0.0, 0.0, 0.0],   # a nodal row up to column 2, the last one with both signs near
        [-1.0, -2.0, 0.0, 0.0],
        [-1.0, 0.0, -0.0, 0.0],  # zeros touching one sign only (no sign change)
    ])
    expected = np.array([
        [False, False, True, True],
        [False, False, False, True],
        [False, False, True, True],
        [False, True, True, True],
    ])
    np.testing.assert_array_equal(stray_zeros(field), expected)


def test_a_zero_where_two_nodal_lines_cross_is_kept():
    # dxz-like signs around a grid point on both nodes: only diagonal neighbours carry signs.
    field = np.array([[1.0, 0.0, -1.0], [0.0, 0.0, 0.0], [-1.0, 0.0, 1.0]])
    assert not stray_zeros(field).any()


@pytest.mark.parametrize("resolution", [2, 3, 17, 255, 256, 1023, 1024])
def test_nodal_plane_of_2pz_is_drawn_at_odd_and_even_resolutions(resolution):
    # At odd resolutions z = 0 is a row of grid points where ψ is exactly 0.
    scene = _psi("H 2p1", OrbitalChoice("2p", "real", 0), "xz", resolution)
    points = _points(scene)
    pixel = _contour_pixel(scene)
    assert points.size, "the nodal line z = 0 vanished"
    # On the node to within half a traced pixel (the node lies between two rows at worst).
    assert np.abs(points[:, 1]).max() <= 0.5 * pixel + 1e-9 * EXTENT
    assert _covers(points[:, 0], -EXTENT, EXTENT, gap=pixel + 1e-9 * EXTENT)


@pytest.mark.parametrize("resolution", [3, 255, 256, 1024])
def test_both_nodal_planes_of_3dxz_are_drawn_through_their_crossing(resolution):
    # ψ ∝ xz: nodes x = 0 and z = 0 cross at the nucleus, a grid point at odd resolutions.
    scene = _psi("H 3d1", OrbitalChoice("3d", "real", 1), "xz", resolution)
    points = _points(scene)
    pixel = _contour_pixel(scene)
    half = 0.5 * pixel + 1e-9 * EXTENT
    assert points.size, "the nodal lines x = 0 and z = 0 vanished"
    assert np.minimum(np.abs(points[:, 0]), np.abs(points[:, 1])).max() <= half
    # Marching squares cuts the corner at the crossing (a saddle), so allow two pixels there.
    on_x = points[np.abs(points[:, 0]) <= half, 1]
    on_z = points[np.abs(points[:, 1]) <= half, 0]
    assert _covers(on_x, -EXTENT, EXTENT, gap=2 * pixel + 1e-9 * EXTENT)
    assert _covers(on_z, -EXTENT, EXTENT, gap=2 * pixel + 1e-9 * EXTENT)


@pytest.mark.parametrize("resolution", [255, 256])
def test_radial_node_circles_of_3s_are_drawn(resolution):
    # Hydrogen 3s: R ∝ 27 − 18r + 2r² (r in bohr), nodes at r = (9 ∓ 3√3)/2
    # (Bethe & Salpeter 1957, §3, table 1).
    radii = ((9.0 - 3.0 * math.sqrt(3.0)) / 2.0, (9.0 + 3.0 * math.sqrt(3.0)) / 2.0)
    scene = _psi("H 3s1", OrbitalChoice("3s"), "xy", resolution)
    points = _points(scene)
    pixel = _contour_pixel(scene)
    r = np.hypot(points[:, 0], points[:, 1])
    angle = np.arctan2(points[:, 1], points[:, 0])
    nearest = np.min(np.abs(r[:, None] - np.array(radii)[None, :]), axis=1)
    # Linear interpolation across a curved node: well inside one traced pixel.
    assert nearest.max() <= 0.1 * pixel
    for radius in radii:
        around = np.abs(r - radius) <= 0.1 * pixel
        # Each circle is closed: no angular hole wider than two traced pixels along it.
        assert _covers(angle[around], -math.pi, math.pi, gap=2 * pixel / radius)


@pytest.fixture(params=[True, False], ids=["compiled", "plain"])
def kernels(request):
    """Each grid-kernel path in turn (the choice is the process's: restored after)."""
    before = set_compiled_kernels(request.param)
    yield request.param
    set_compiled_kernels(before)


@pytest.mark.parametrize("resolution", [255, 256])
def test_zeros_outside_a_compact_orbital_draw_no_nodal_line(resolution, kernels):
    # Far from a Z = 36 nucleus ψ ~ e^{-36 r} is below 1e-16 of its peak over most of the
    # plane. The compiled path's radial table ends at the radius beyond which less than
    # 1e-16 of the electron lies and gives exact zeros past it; the plain path evaluates
    # the tiny positive values.
    # Neither edge is a node.
    nodeless = _psi("Kr", OrbitalChoice("1s"), "xy", resolution, extent=10.0)
    peak = np.abs(nodeless.values).max()
    far = nodeless.values[np.abs(nodeless.values) < 1e-16 * peak]
    assert far.size > nodeless.values.size // 2
    if kernels:
        assert np.count_nonzero(nodeless.values == 0.0) > nodeless.values.size // 2
    else:
        assert np.all(nodeless.values > 0.0)
    assert _points(nodeless).size == 0
    p_z = _psi("Kr", OrbitalChoice("2p", "real", 0), "xz", resolution, extent=10.0)
    points = _points(p_z)
    assert points.size
    # Only the plane z = 0 (to half a pixel where it meets the zeros), no ring around the lobes.
    assert np.abs(points[:, 1]).max() <= 0.5 * _contour_pixel(p_z) + 1e-9


@pytest.mark.parametrize("resolution", [255, 256])
def test_comparison_panels_and_difference_draw_the_nodal_plane(resolution):
    state = ViewState(
        left=Source("H 2p1", "hydrogenic"), orbital=OrbitalChoice("2p", "real", 0), view="slice",
        slice=SliceSettings(plane="xz", extent=EXTENT, resolution=resolution, quantity="psi"),
        compare=CompareSettings(True, Source("He+ 2p1", "hydrogenic"), same_atom=False),
    ).validated()
    comparison = compare_slices(state)
    for panel in (comparison.left, comparison.right, comparison.difference):
        scene = panel.with_contours()
        points = _points(scene)
        pixel = _contour_pixel(scene)
        # Both ψ are odd in z, so is their difference: z = 0 is a node of all three.
        on_node = points[np.abs(points[:, 1]) <= 0.5 * pixel + 1e-9 * EXTENT, 0]
        assert _covers(on_node, -EXTENT, EXTENT, gap=pixel + 1e-9 * EXTENT), panel.title


@pytest.mark.parametrize(("spec", "orbital", "quantity", "plane", "offset", "reason"), [
    ("Na", OrbitalChoice("2p", "real", 0), "psi", "xy", 0.0, "(a nodal plane)"),
    ("Na", OrbitalChoice("2p", "real", 0), "psi2", "xy", 0.0, "(a nodal plane)"),
    ("Na", OrbitalChoice("3s"), "psi", "xz", -1e4, "(beyond the electrons' reach)"),
    ("Na", OrbitalChoice("3s"), "density", "xz", 5e3, "(beyond the electrons' reach)"),
])
def test_a_plane_zero_throughout_says_why_in_its_title(spec, orbital, quantity, plane, offset, reason):
    # ψ of 2p0 vanishes on z = 0 by symmetry; 1e4 bohr out, e^{-ζr} underflows to exactly 0.
    settings = SliceSettings(plane=plane, offset=offset, extent=10.0, resolution=32,
                             quantity=quantity)
    scene = slice_scene(Source(spec, "slater"), orbital, settings)
    assert not np.any(scene.values)
    assert scene.title.endswith("zero everywhere on this plane " + reason)


def test_a_plane_with_values_has_no_zero_note():
    settings = SliceSettings(plane="xz", offset=1.0, extent=10.0, resolution=32, quantity="psi")
    scene = slice_scene(Source("Na", "slater"), OrbitalChoice("3s"), settings)
    assert np.any(scene.values) and "zero everywhere" not in scene.title
