"""Data file of a line profile: CSV with '#' notes, a row of column names, then s, u, v, value."""

from __future__ import annotations

import os
from pathlib import Path
from typing import Final

import numpy as np

from zeffir import __version__
from zeffir.core import CODATA_EDITION
from zeffir.export._atomic import write_atomic
from zeffir.export._data import CAUTION
from zeffir.scene._profile import LineProfile

__all__ = ["PROFILE_COLUMNS", "PROFILE_SKIPROWS", "profile_csv_text", "write_profile_csv"]

#: Names in the column row: fixed, whatever the plane, so scripts can rely on them.
PROFILE_COLUMNS: Final[tuple[str, ...]] = ("s", "u", "v", "value")

#: '#' note lines of every profile file; the same count always, so that
#: ``np.loadtxt(path, delimiter=",", skiprows=PROFILE_SKIPROWS)`` reads the numbers.
_NOTE_LINES: Final[int] = 11

#: Lines before the numbers: the notes and the row of column names.
PROFILE_SKIPROWS: Final[int] = _NOTE_LINES + 1


def _one_line(text: str) -> str:
    # A note must stay one '#' line, or the fixed count above would break.
    return " ".join(str(text).split())


def _number(value: float) -> str:
    # repr is the shortest text that reads back to the same double; NaN is written "nan".
    return repr(float(value))


def _notes(profile: LineProfile) -> list[str]:
    unit = profile.length_symbol
    symbol, _, value_unit = profile.value_label.rpartition(" / ")
    symbol = symbol or profile.value_label
    u_name, v_name = profile.axis_names
    (u0, v0), (u1, v1) = profile.start, profile.end
    notes = [
        f"Zeffir line profile: {_NOTE_LINES} lines of notes, one row of column names, "
        f"then {profile.s.size} rows; np.loadtxt(path, delimiter=',', skiprows={PROFILE_SKIPROWS})",
        f"written by zeffir {__version__}; constants {CODATA_EDITION} (via scipy.constants)",
        f"title: {profile.title}",
        f"spec: {profile.spec}",
        f"model: {profile.model}",
        f"plane: {profile.plane_text}",
        f"segment: start ({u_name}, {v_name}) = ({_number(u0)}, {_number(v0)}) {unit}; "
        f"end ({_number(u1)}, {_number(v1)}) {unit}; length {_number(profile.length)} {unit}",
        f"columns: s = distance from the start along the segment; u = {u_name}, v = {v_name} "
        f"(in-plane coordinates); value = {symbol}",
        f"units: s, u, v in {unit}; value in {value_unit or 'the units of ' + symbol}",
        "sampling: bilinear interpolation of the slice grid; nan where the segment leaves the slice",
        f"caution: {CAUTION}",
    ]
    assert len(notes) == _NOTE_LINES
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
        ``PROFILE_SKIPROWS − 1`` note lines starting with ``#``, the column names
        ``s, u, v, value``, then one row per sample.
    """
    table = np.column_stack((profile.s, profile.u, profile.v, profile.values))
    rows = (delimiter.join(_number(x) for x in row) for row in table.tolist())
    lines = [*_notes(profile), delimiter.join(PROFILE_COLUMNS), *rows]
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
    label. The notes name the Zeffir version, spec, model, plane, the segment's
    ends and the units. Read the numbers with
    ``np.loadtxt(path, delimiter=",", skiprows=PROFILE_SKIPROWS)`` or
    ``pandas.read_csv(path, comment="#")``.
    """
    return write_atomic(path, profile_csv_text(profile))
