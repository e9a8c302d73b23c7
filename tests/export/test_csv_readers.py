"""Every CSV Zeffir writes reads with numpy.genfromtxt(names=True) and pandas.read_csv as they are."""

from __future__ import annotations

import io
import re

import numpy as np
import pytest

from zeffir import __version__
from zeffir.export import export_view, write_profile_csv
from zeffir.scene import line_profile, view_scene
from zeffir.state import CompareSettings, OrbitalChoice, RadialSettings, SliceSettings, Source, ViewState

_NAME = re.compile(r"[A-Za-z0-9_]+")
_TWO = CompareSettings(True, Source("Na", "clementi"), True, True)
_FOUR = CompareSettings(True, Source("Na", "clementi"), True, True,
                        more=(Source("", "hydrogenic"), Source("Mg+", "slater")))

#: (file name, state) of every kind of radial CSV: one series, two with the difference,
#: several, an overlay, and other quantities and units.
RADIAL_CASES = {
    "single": ViewState(left=Source("Na", "slater")),
    "two": ViewState(left=Source("Na", "slater"), compare=_TWO),
    "several": ViewState(left=Source("Na", "slater"), compare=_FOUR),
    "overlay": ViewState(left=Source("Na", "slater"),
                         compare=CompareSettings(True, Source("Na", "clementi"), True, True, overlay=True)),
    "R-angstrom": ViewState(left=Source("Fe", "slater"), radial=RadialSettings(quantity="R"),
                            length_unit="angstrom"),
    "Q-per-electron": ViewState(left=Source("C", "clementi"),
                                radial=RadialSettings(quantity="Q", weighted=False)),
}


def _radial_columns(state: ViewState) -> dict[str, np.ndarray]:
    """The expected columns, named as the format promises, from the scenes themselves."""
    target = view_scene(state.validated())
    panels = ([("", target)] if not hasattr(target, "series") else
              [(f"series_{i + 1}_", s) for i, s in enumerate(target.series)]
              + ([("difference_", target.difference)] if target.difference is not None else []))
    head = panels[0][1]
    unit = "bohr" if head.length_unit == "bohr" else "angstrom"
    power = {"R": f"per_{unit}3_2", "P": f"per_{unit}1_2", "D": f"per_{unit}", "Q": "electrons"}
    columns = {f"r_{unit}": head.curves[0].x}
    for prefix, scene in panels:
        for curve in scene.curves:
            columns[f"{prefix}{head.quantity}_{curve.subshell or 'total'}_{power[head.quantity]}"] = curve.y
    return columns


@pytest.fixture(scope="module")
def radial_files(tmp_path_factory):
    folder = tmp_path_factory.mktemp("radial")
    return {key: (export_view(state, folder / f"{key}.csv"), _radial_columns(state))
            for key, state in RADIAL_CASES.items()}


@pytest.fixture(scope="module")
def profile_file(tmp_path_factory):
    state = ViewState(left=Source("H 2p1", "hydrogenic"), orbital=OrbitalChoice("2p", "real", 0),
                      view="slice", slice=SliceSettings(plane="xz", quantity="psi", extent=8.0,
                                                        resolution=64, fit_extent=False),
                      length_unit="angstrom").validated()
    profile = line_profile(view_scene(state), (-5.0, -5.0), (2.0, 3.0), points=90)
    path = write_profile_csv(profile, tmp_path_factory.mktemp("profile") / "p.csv")
    columns = {"s_angstrom": profile.s, "u_angstrom": profile.u, "v_angstrom": profile.v,
               "value_per_angstrom3_2": profile.values}
    return path, columns


def _all_files(radial_files, profile_file):
    return [*radial_files.values(), profile_file]


def test_one_line_of_names_with_units_then_only_hash_notes_then_numbers(radial_files, profile_file):
    for path, columns in _all_files(radial_files, profile_file):
        lines = path.read_text(encoding="utf-8").splitlines()
        names = lines[0].split(",")
        assert names == list(columns), path.name
        assert all(_NAME.fullmatch(name) for name in names), names
        notes = [line for line in lines[1:] if not re.match(r"[-+0-9n]", line)]
        assert notes and all(line.startswith("# ") for line in notes), path.name
        assert f"# format_version: 2; zeffir_version: {__version__}" in notes
        # The notes sit together between the names and the numbers.
        assert lines[1:1 + len(notes)] == notes
        numbers = np.array([[float(v) for v in line.split(",")] for line in lines[1 + len(notes):]])
        assert numbers.shape == (columns[names[0]].size, len(names))


def test_numpy_genfromtxt_keeps_every_name_and_every_number(radial_files, profile_file):
    for path, columns in _all_files(radial_files, profile_file):
        table = np.genfromtxt(path, delimiter=",", names=True, comments="#")
        assert table.dtype.names == tuple(columns), path.name
        for name, expected in columns.items():
            np.testing.assert_array_equal(table[name], expected)  # shortest round-trip text


def test_pandas_read_csv_keeps_every_name_and_every_number(radial_files, profile_file):
    pandas = pytest.importorskip(
        "pandas", reason="pandas is not installed in this environment (Zeffir does not depend on "
                         "it); the check runs wherever pandas is present")
    for path, columns in _all_files(radial_files, profile_file):
        frame = pandas.read_csv(path, comment="#")
        assert list(frame.columns) == list(columns), path.name
        for name, expected in columns.items():
            np.testing.assert_array_equal(frame[name].to_numpy(dtype=float), expected)


def test_two_series_difference_columns_are_second_minus_first(radial_files):
    path, _ = radial_files["two"]
    table = np.genfromtxt(path, delimiter=",", names=True, comments="#")
    differences = [n for n in table.dtype.names if n.startswith("difference_")]
    assert differences
    for name in differences:
        key = name.removeprefix("difference_")
        np.testing.assert_array_equal(table[name], table[f"series_2_{key}"] - table[f"series_1_{key}"])


def test_the_notes_explain_the_unit_spellings_and_the_readers(radial_files):
    path, _ = radial_files["R-angstrom"]
    text = path.read_text(encoding="utf-8")
    assert "per_bohr3_2 = bohr⁻³ᐟ²" in text and "every other column in Å⁻³ᐟ²" in text
    assert "numpy.genfromtxt(path, delimiter=',', names=True, comments='#')" in text
    assert "pandas.read_csv(path, comment='#')" in text


def test_the_profile_names_survive_a_tab_separated_copy(profile_file):
    path, columns = profile_file
    text = path.read_text(encoding="utf-8")
    table = np.genfromtxt(io.StringIO(text.replace(",", "\t")), delimiter="\t", names=True,
                          comments="#")
    assert table.dtype.names == tuple(columns)
    np.testing.assert_array_equal(table["value_per_angstrom3_2"], columns["value_per_angstrom3_2"])
