"""Scenes: what the views draw equals what the core computes, in the chosen units."""

import numpy as np
import pytest
from scipy.integrate import trapezoid

from zeffir.core import ANGSTROM_PER_BOHR, Plane, build, orbital_on_plane
from zeffir.scene import (
    compare_radial,
    compare_slices,
    radial_scene,
    slice_scene,
)
from zeffir.state import (
    ColourSettings,
    CompareSettings,
    OrbitalChoice,
    RadialSettings,
    SliceSettings,
    Source,
    ViewState,
)


def test_radial_distribution_curves_integrate_to_the_occupancies():
    scene = radial_scene(Source("Ne", "slater"), RadialSettings(r_limit=40.0))
    for curve in scene.curves:
        expected = 10 if curve.subshell is None else int(curve.label.split(", ")[1].split()[0])
        assert trapezoid(curve.y, curve.x) == pytest.approx(expected, rel=1e-4)


def test_angstrom_scene_is_the_bohr_scene_rescaled():
    settings = RadialSettings(quantity="R", show_total=False)
    bohr = radial_scene(Source("Li"), settings, "bohr")
    angstrom = radial_scene(Source("Li"), settings, "angstrom")
    for a, b in zip(bohr.curves, angstrom.curves, strict=True):
        np.testing.assert_allclose(b.x, a.x * ANGSTROM_PER_BOHR)
        np.testing.assert_allclose(b.y, a.y * ANGSTROM_PER_BOHR**-1.5)
    assert "Å" in angstrom.x_label


def test_markers_are_the_orbital_numbers():
    scene = radial_scene(Source("Na", "hydrogenic"), RadialSettings(), highlight="3s")
    orbital = build("Na", "hydrogenic").orbital("3s")
    kinds = {(m.kind, round(m.x, 12)) for m in scene.markers}
    assert ("r_max", round(orbital.radial.r_max(), 12)) in kinds
    assert ("mean", round(orbital.radial.expectation(1), 12)) in kinds
    assert sum(m.kind == "node" for m in scene.markers) == 2


def test_slice_scene_holds_the_core_values():
    settings = SliceSettings(plane="xz", extent=5.0, resolution=64, quantity="psi")
    scene = slice_scene(Source("Ne"), OrbitalChoice("2p", "real", 0), settings)
    expected = orbital_on_plane(build("Ne").orbital("2p"), Plane.named("xz", 0.0, 5.0, 64), 0)
    np.testing.assert_array_equal(scene.values, expected)
    assert scene.signed and scene.colour_range[0] == -scene.colour_range[1]
    assert scene.zero_contour and 0.0 not in scene.levels


def test_log_density_scale_spans_the_top_decades():
    settings = SliceSettings(quantity="density", colour=ColourSettings(log_scale=True), resolution=32)
    scene = slice_scene(Source("Ar"), OrbitalChoice("3p"), settings)
    low, high = scene.colour_range
    assert high == pytest.approx(np.log10(scene.values.max()))
    assert high - low == pytest.approx(6.0)


def test_slice_difference_is_right_minus_left_on_one_colour_scale():
    state = ViewState(
        left=Source("Na", "hydrogenic"),
        orbital=OrbitalChoice("3s"),
        view="slice",
        slice=SliceSettings(resolution=48, extent=10.0),
        compare=CompareSettings(True, Source("Na", "clementi")),
    ).validated()
    comparison = compare_slices(state)
    np.testing.assert_array_equal(comparison.difference.values,
                                  comparison.right.values - comparison.left.values)
    assert comparison.left.colour_range == comparison.right.colour_range
    assert comparison.difference.colour_range[0] == -comparison.difference.colour_range[1]


def test_radial_difference_uses_one_grid():
    state = ViewState(left=Source("K", "slater"),
                      compare=CompareSettings(True, Source("K", "clementi"))).validated()
    comparison = compare_radial(state)
    for left, right, diff in zip(comparison.left.curves, comparison.right.curves,
                                 comparison.difference.curves, strict=True):
        np.testing.assert_array_equal(left.x, right.x)
        np.testing.assert_allclose(diff.y, right.y - left.y)


def test_difference_titles_name_only_what_differs():
    from zeffir.scene._compare import difference_title

    # Readable short names (the panel is narrow), not the registry's internal ones.
    assert difference_title("Gd", "hartree-fock", "Gd", "hartree-fock-average") == \
        "Gd: HF average − HF"
    assert difference_title("Ne", "slater", "Ar", "slater") == "Ar − Ne (Slater)"
    assert difference_title("Ne", "slater", "Ar", "clementi") == \
        "(Ar, Clementi–Raimondi) − (Ne, Slater)"


def test_subshells_of_one_atom_keep_distinct_colours():
    from zeffir.core import element
    from zeffir.scene import subshell_colour

    # 1s and 3d once shared a colour; up to krypton colour alone tells every subshell apart,
    # and up to oganesson colour with dash style does.
    assert subshell_colour("1s")[0] != subshell_colour("3d")[0]
    for z in range(1, 119):
        labels = [sub.label for sub, _ in element(z).ground]
        styles = [subshell_colour(label) for label in labels]
        assert len(set(styles)) == len(styles), element(z).symbol
        if z <= 36:
            assert len({colour for colour, _ in styles}) == len(styles), element(z).symbol


def test_the_terms_summary_is_computed_without_qt():
    import subprocess
    import sys

    code = ("import sys; sys.modules['PySide6'] = None; sys.modules['pyqtgraph'] = None\n"
            "from zeffir.scene._terms import terms_summary\n"
            "s = terms_summary('Eu3+'); print(s.spec)")
    out = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True, check=True)
    assert out.stdout.strip() == "Eu3+"
