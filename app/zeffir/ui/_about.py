"""The About box: version, model limits and cautions, and every published source."""

from __future__ import annotations

import html

from PySide6.QtWidgets import QMessageBox, QWidget

from zeffir import __version__
from zeffir._references import CAUTIONS, REFERENCES
from zeffir.core import CODATA_EDITION

__all__ = ["about_html", "show_about"]


def about_html() -> str:
    """The About text as rich text."""
    cautions = "".join(f"<li>{html.escape(c)}</li>" for c in CAUTIONS)
    references = "".join(f"<li>{html.escape(r)}</li>" for r in REFERENCES)
    return (
        f"<h3>Zeffir {__version__}</h3>"
        "<p>Orbitals, densities and figures for many-electron atoms: bare, screened and "
        "optimised orbitals of any configuration, side by side.</p>"
        f"<p><b>Model limits</b></p><ul>{cautions}</ul>"
        f"<p><b>Sources</b></p><ul>{references}</ul>"
        f"<p>Units: atomic inside; Å and eV from {html.escape(CODATA_EDITION)}.</p>"
    )


def show_about(parent: QWidget | None) -> None:
    """Open the About box."""
    box = QMessageBox(parent)
    box.setWindowTitle("About Zeffir")
    box.setTextFormat(box.textFormat().RichText)
    box.setText(about_html())
    box.exec()
