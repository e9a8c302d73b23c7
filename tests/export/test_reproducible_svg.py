"""SVG figures are reproducible byte for byte and keep their text as text."""

from __future__ import annotations

import html
import re

import pytest

from zeffir.export import export_view
from zeffir.export._style import rc_parameters
from zeffir.scene import view_scene
from zeffir.state import CompareSettings, SliceSettings, Source, ViewState

CASES = {
    "radial comparison": ViewState(left=Source("Na", "slater"),
                                   compare=CompareSettings(True, Source("Na", "clementi"), True, True)),
    "slice": ViewState(left=Source("Na", "slater"), view="slice",
                       slice=SliceSettings(plane="xz", quantity="psi", resolution=32, extent=8.0,
                                           fit_extent=False)),
}


def _texts(svg: str) -> list[str]:
    return [html.unescape(t) for t in re.findall(r"<text\b[^>]*>([^<]*)</text>", svg)]


@pytest.mark.parametrize("name", list(CASES))
def test_the_same_view_exports_to_the_same_bytes(tmp_path, name):
    state = CASES[name]
    first = export_view(state, tmp_path / "a.svg").read_bytes()
    second = export_view(state, tmp_path / "b.svg").read_bytes()
    assert first == second
    # What would differ between runs if left to chance: dates and random ids.
    assert b"<dc:date>" not in first


@pytest.mark.parametrize("name", list(CASES))
def test_svg_text_is_text_with_the_title(tmp_path, name):
    state = CASES[name].validated()
    svg = export_view(state, tmp_path / "f.svg").read_text(encoding="utf-8")
    target = view_scene(state)
    title = target.title if hasattr(target, "title") else target.left.title
    texts = _texts(svg)
    assert any(title in text for text in texts), (title, texts[:8])
    assert "font-family: 'DejaVu Sans'" in svg
    # Text drawn as outlines would leave glyph definitions behind.
    assert 'id="DejaVuSans-' not in svg


def test_the_style_asks_for_text_and_a_fixed_salt():
    rc = rc_parameters()
    assert rc["svg.fonttype"] == "none" and rc["svg.hashsalt"]
