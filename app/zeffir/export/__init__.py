"""Figure, data and session files: written atomically, from the scenes the window shows.

The window and the command line both call :func:`export_view`; the format follows
the file's suffix. Sessions (``.zeffir``) store the view state as JSON.
"""

from zeffir.export._atomic import MAX_NAME_BYTES, atomic_file, atomic_path, check_target, write_atomic
from zeffir.export._data import CAUTION, DATA_FORMATS, FORMAT_VERSION, unit_token, write_data
from zeffir.export._errors import ExportError, SessionError
from zeffir.export._figures import DPI_RANGE, FIGURE_FORMATS, write_figure
from zeffir.export._profile_data import (
    PROFILE_SKIPROWS,
    profile_column_names,
    profile_csv_text,
    write_profile_csv,
)
from zeffir.export._session import (
    MAX_NESTING,
    MAX_SESSION_BYTES,
    SESSION_KIND,
    SESSION_SUFFIX,
    SESSION_VERSION,
    load_session,
    save_session,
)
from zeffir.export._style import COLUMN_WIDTHS
from zeffir.export._trend_files import TREND_FORMATS, trend_csv_text, write_trend
from zeffir.export._view import EXPORT_FORMATS, export_view, view_target

__all__ = [
    "CAUTION",
    "COLUMN_WIDTHS",
    "DATA_FORMATS",
    "DPI_RANGE",
    "EXPORT_FORMATS",
    "FIGURE_FORMATS",
    "FORMAT_VERSION",
    "MAX_NAME_BYTES",
    "MAX_NESTING",
    "MAX_SESSION_BYTES",
    "PROFILE_SKIPROWS",
    "SESSION_KIND",
    "SESSION_SUFFIX",
    "SESSION_VERSION",
    "TREND_FORMATS",
    "ExportError",
    "SessionError",
    "atomic_file",
    "atomic_path",
    "check_target",
    "export_view",
    "load_session",
    "profile_column_names",
    "profile_csv_text",
    "save_session",
    "trend_csv_text",
    "unit_token",
    "view_target",
    "write_atomic",
    "write_data",
    "write_figure",
    "write_profile_csv",
    "write_trend",
]
