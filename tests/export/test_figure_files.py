"""Figure files: valid PNG/SVG/PDF at journal widths, drawn from the scene's own arrays."""

import struct
import subprocess
import sys
import warnings
import xml.etree.ElementTree as ET

import matplotlib
import numpy as np
import pytest

from zeffir.export import COLUMN_WIDTHS, ExportError, write_figure
from zeffir.export._figures import _draw
from zeffir.scene import compare_radial, compare_slices, radial_scene, slice_scene
from zeffir.state import ColourSettings, CompareSettings, OrbitalChoice, SliceSettings, Source, ViewState

PNG_SIGNATURE = b"\x89PNG\r\n\x1a\n"
# Below 128 points per side the slices take the plain numpy path: fast, and exact.
SMALL = SliceSettings(plane="xz", extent=10.0, resolution=48, quantity="psi")


@pytest.fixture(scope="module")
def state():
    return ViewState(slice=SMALL, compare=CompareSettings(True, Source("Na", "clementi"))).validated()


@pytest.fixture(scope="module")
def radial(state):
    return radial_scene(state.left, state.radial, "bohr", "3s")


@pytest.fixture(scope="module")
def sliced(state):
    return slice_scene(state.left, state.orbital, state.slice)


def _png_size(path):
    data = path.read_bytes()
    assert data[:8] == PNG_SIGNATURE
    return struct.unpack(">II", data[16:24])


@pytest.mark.parametrize(("width", "dpi"), [("single", 100), ("double", 100), ("single", 300)])
def test_png_is_as_wide_as_the_journal_column_at_the_resolution(tmp_path, radial, width, dpi):
    path = write_figure(radial, tmp_path / "r.png", width=width, dpi=dpi)
    pixels_wide, pixels_high = _png_size(path)
    assert abs(pixels_wide - COLUMN_WIDTHS[width] * dpi) < 1.0
    assert 0.3 * pixels_wide < pixels_high < 1.2 * pixels_wide


def test_comparisons_default_to_double_width(tmp_path, state):
    path = write_figure(compare_radial(state), tmp_path / "c.png", dpi=100)
    assert abs(_png_size(path)[0] - 700) < 1.0


def test_svg_parses_as_xml_with_an_svg_root(tmp_path, sliced):
    path = write_figure(sliced, tmp_path / "s.svg")
    root = ET.parse(path).getroot()
    assert root.tag.endswith("svg")
    assert root.get("width", "").startswith("241.2")  # 3.35 in at 72 pt per inch


def test_pdf_is_a_complete_pdf(tmp_path, state):
    path = write_figure(compare_slices(state), tmp_path / "c.pdf")
    data = path.read_bytes()
    assert data.startswith(b"%PDF-") and data.rstrip().endswith(b"%%EOF")


def test_slice_png_and_two_panel_comparison(tmp_path, sliced, state):
    assert _png_size(write_figure(sliced, tmp_path / "s.png", dpi=100))[0] == 335
    two = write_figure(compare_slices(state), tmp_path / "two.png", dpi=100, difference=False)
    assert _png_size(two)[0] == 700


def test_labels_render_without_missing_glyphs(tmp_path):
    # Å, ⁻³ᐟ², ψ, log₁₀ and ⟂ all appear in these labels.
    settings = SliceSettings(plane="custom", normal=(1.0, 1.0, 1.0), offset=0.5, extent=6.0,
                             resolution=32, quantity="density",
                             colour=ColourSettings(log_scale=True))
    custom = slice_scene(Source("Fe", "slater"), OrbitalChoice("4s"), settings, "angstrom")
    state = ViewState(length_unit="angstrom").validated()
    curves = radial_scene(state.left, state.radial.__class__(quantity="R"), "angstrom", "3s")
    with warnings.catch_warnings():
        warnings.simplefilter("error")
        write_figure(custom, tmp_path / "c.pdf")
        write_figure(custom, tmp_path / "c.png", dpi=72)
        write_figure(curves, tmp_path / "r.svg")


def test_radial_figure_plots_exactly_the_scene_curves(radial):
    figure = _draw(radial, COLUMN_WIDTHS["single"])
    lines = {line.get_label(): line for line in figure.axes[0].get_lines()}
    for curve in radial.curves:
        x, y = lines[curve.label].get_data()
        assert np.array_equal(x, curve.x) and np.array_equal(y, curve.y)


def test_slice_figure_maps_exactly_the_scene_image(sliced, state):
    figure = _draw(sliced, COLUMN_WIDTHS["single"])
    image = figure.axes[0].get_images()[0]
    assert np.array_equal(image.get_array(), sliced.image)
    assert image.get_clim() == sliced.colour_range
    comparison = compare_slices(state)
    figure = _draw(comparison, COLUMN_WIDTHS["double"])
    panels = [ax for ax in figure.axes if ax.get_images()][:3]
    shown = [ax.get_images()[0] for ax in panels]
    for image, scene in zip(shown, (comparison.left, comparison.right, comparison.difference), strict=True):
        assert np.array_equal(image.get_array(), scene.image)
    assert shown[0].get_clim() == shown[1].get_clim()  # one colour scale for left and right


@pytest.mark.parametrize(
    ("options", "message"),
    [
        ({"width": "triple"}, "width: 'triple' is not one of single, double"),
        ({"dpi": 10}, "dpi: 10 is not a whole number between 50 and 1200"),
        ({"dpi": 300.5}, "dpi: 300.5 is not a whole number"),
    ],
)
def test_bad_options_are_refused_and_nothing_is_written(tmp_path, radial, options, message):
    with pytest.raises(ExportError, match=message):
        write_figure(radial, tmp_path / "r.png", **options)
    assert list(tmp_path.iterdir()) == []


def test_unknown_figure_suffix_lists_the_figure_formats(tmp_path, radial):
    with pytest.raises(ExportError, match=r"r\.gif: a figure is written as \.png, \.svg, \.pdf"):
        write_figure(radial, tmp_path / "r.gif")


def test_failing_savefig_leaves_no_file(tmp_path, radial, monkeypatch):
    from matplotlib.figure import Figure

    def broken(self, *args, **kwargs):
        raise OSError(28, "No space left on device")

    monkeypatch.setattr(Figure, "savefig", broken)
    with pytest.raises(ExportError, match=r"r\.png: cannot write \(No space left on device\)"):
        write_figure(radial, tmp_path / "r.png")
    assert list(tmp_path.iterdir()) == []


def test_export_leaves_matplotlib_settings_as_they_were(tmp_path, radial):
    before = dict(matplotlib.rcParams)
    write_figure(radial, tmp_path / "r.png", dpi=72)
    assert dict(matplotlib.rcParams) == before


def test_export_neither_selects_a_backend_nor_imports_pyplot(tmp_path):
    code = (
        "import sys\n"
        "import zeffir.export as e\n"
        "assert 'matplotlib' not in sys.modules, 'importing zeffir.export pulled in matplotlib'\n"
        "from zeffir.state import ViewState\n"
        f"e.export_view(ViewState(), {str(tmp_path / 'r.png')!r}, dpi=72)\n"
        "assert 'matplotlib.pyplot' not in sys.modules\n"
        "import matplotlib\n"
        "assert matplotlib.rcParams._get_backend_or_none() is None\n"
    )
    result = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True, check=False)
    assert result.returncode == 0, result.stderr


def test_subshell_colours_match_the_window():
    plot_style = pytest.importorskip("zeffir.ui._plot_style")
    from PySide6.QtCore import Qt

    from zeffir.export._style import subshell_line_style

    dashes = {Qt.PenStyle.SolidLine: "-", Qt.PenStyle.DashLine: "--", Qt.PenStyle.DashDotLine: "-."}
    for label in (None, "1s", "2p", "3d", "4f", "5g", "6s", "7p", "8s"):
        colour, dash = plot_style.subshell_style(label)
        assert subshell_line_style(label) == (colour, dashes[dash])
