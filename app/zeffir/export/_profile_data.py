"""Data file of a line profile: a row of column names with units, '#' notes, then s, u, v, value.

Format version 2 (see :mod:`zeffir.export._data`): the names come first and carry
their unit (``s_bohr, u_bohr, v_bohr, value_per_bohr3_2``), so
``numpy.genfromtxt(path, delimiter=",", names=True, comments="#")`` and
``pandas.read_csv(path, comment="#")`` read the file as it is. Version 1 had eleven
notes first and the bare names ``s, u, v, value``.
"""

from __future__ import annotations

import os
from pathlib import Path
from typing import Final

import numpy as np

import zeffir.core
from zeffir.export._atomic import write_atomic
from zeffir.export._data import CAUTION, UNIT_TOKENS_NOTE, unit_token, unit_token_of_text, version_note
from zeffir.scene import LineProfile

__all__ = ["PROFILE_COLUMNS", "PROFILE_SKIPROWS", "profile_column_names", "profile_csv_text",
           "write_profile_csv"]

#: Stems of the column names, fixed whatever the plane; each name adds ``_{unit}``.
PROFILE_COLUMNS: Final[tuple[str, ...]] = ("s", "u", "v", "value")

#: Lines before the numbers that are not '#' notes (the row of column names):
#: ``np.loadtxt(path, delimiter=",", skiprows=PROFILE_SKIPROWS)`` reads the numbers,
#: since loadtxt skips the '#' lines itself.
PROFILE_SKIPROWS: Final[int] = 1


def _one_line(text: str) -> str:
    # A note must stay one '#' line.
    return " ".join(str(text).split())


def _number(value: float) -> str:
    # repr is the shortest text that reads back to the same double; NaN is written "nan".
    return repr(float(value))


def _split_label(profile: LineProfile) -> tuple[str, str]:
    symbol, _, value_unit = profile.value_label.rpartition(" / ")
    return symbol or profile.value_label, value_unit


def profile_column_names(profile: LineProfile) -> tuple[str, ...]:
    """The column names of a profile file: ``s, u, v, value``, each with its unit.

    ``value`` takes the unit of the profile's label (``value_per_bohr3`` for a
    density in bohr⁻³); a label whose unit the files do not spell keeps ``value``.

    Parameters
    ----------
    profile : LineProfile

    Returns
    -------
    tuple of str
        Four names of letters, digits and ``_`` (kept as they are by genfromtxt).
    """
    length = unit_token(profile.length_unit, 1.0)
    value_token = unit_token_of_text(_split_label(profile)[1])
    value = f"value_{value_token}" if value_token else "value"
    return f"s_{length}", f"u_{length}", f"v_{length}", value


def _notes(profile: LineProfile) -> list[str]:
    unit = profile.length_symbol
    symbol, value_unit = _split_label(profile)
    u_name, v_name = profile.axis_names
    (u0, v0), (u1, v1) = profile.start, profile.end
    s_name, u_col, v_col, value_name = profile_column_names(profile)
    notes = [
        f"Zeffir line profile: the line above names the columns, these '#' lines describe them, "
        f"then {profile.s.size} rows",
        version_note(),
        f"title: {profile.title}",
        f"spec: {profile.spec}",
        f"model: {profile.model}",
        f"plane: {profile.plane_text}",
        f"segment: start ({u_name}, {v_name}) = ({_number(u0)}, {_number(v0)}) {unit}; "
        f"end ({_number(u1)}, {_number(v1)}) {unit}; length {_number(profile.length)} {unit}",
        f"columns: {s_name}: s = distance from the start along the segment; {u_col}, {v_col}: "
        f"u = {u_name}, v = {v_name} (in-plane coordinates); {value_name}: value = {symbol}",
        f"units: s, u, v in {unit}; value in {value_unit or 'the units of ' + symbol}",
        UNIT_TOKENS_NOTE,
        "sampling: bilinear interpolation of the slice grid; nan where the segment leaves the slice",
        f"constants: {zeffir.core.CODATA_EDITION} (via scipy.constants)",
        f"caution: {CAUTION}",
        "read with numpy.genfromtxt(path, delimiter=',', names=True, comments='#') "
        "or pandas.read_csv(path, comment='#')",
    ]
    return [f"# {_one_line(note)}" for note in notes]


def profile_csv_text(profile: LineProfile, delimiter: str = ",") -> str:
    """The text of a profile file (also what the window copies, with tabs for spreadsheets).

    Parameters
    ----------
    profile : LineProfile
        The profile shown.
    delimiter : str
        ``","`` for files; ``"\\t"`` pastes into a spreadsheet's columns directly.

    Returns
    -------
    str
        The column names (:func:`profile_column_names`), note lines starting with
        ``#``, then one row per sample.
    """
    table = np.column_stack((profile.s, profile.u, profile.v, profile.values))
    rows = (delimiter.join(_number(x) for x in row) for row in table.tolist())
    lines = [delimiter.join(profile_column_names(profile)), *_notes(profile), *rows]
    return "\n".join(lines) + "\n"


def write_profile_csv(profile: LineProfile, path: str | os.PathLike[str]) -> Path:
    """Write a line profile as CSV, atomically.

    Parameters
    ----------
    profile : LineProfile
        The profile shown.
    path : str or path-like
        The file to create or replace.

    Returns
    -------
    Path
        The file written.

    Raises
    ------
    ExportError
        ``'<path>: cannot write (<reason>)'`` (a missing folder, a folder in the
        way, no permission, a full disk); nothing is written then.

    Notes
    -----
    Lengths are in the profile's unit (bohr or Å), the value in the unit of its
    label. The notes name the format and Zeffir versions, spec, model, plane, the
    segment's ends and the units. Read the file with
    ``numpy.genfromtxt(path, delimiter=",", names=True, comments="#")``,
    ``pandas.read_csv(path, comment="#")`` or, numbers only,
    ``np.loadtxt(path, delimiter=",", skiprows=PROFILE_SKIPROWS)``.
    """
    return write_atomic(path, profile_csv_text(profile))
