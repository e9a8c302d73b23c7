"""The About box: version, model limits and cautions, and every published source."""

from __future__ import annotations

import html

from PySide6.QtWidgets import QMessageBox, QWidget

import zeffir.core
from zeffir import __version__
from zeffir._references import CAUTIONS, REFERENCES

__all__ = ["about_html", "help_html", "show_about", "show_help"]


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
        f"<p>Units: atomic inside; Å and eV from {html.escape(zeffir.core.CODATA_EDITION)}.</p>"
    )


def _show_rich_text(parent: QWidget | None, title: str, text: str) -> None:
    box = QMessageBox(parent)
    box.setWindowTitle(title)
    box.setTextFormat(box.textFormat().RichText)
    box.setText(text)
    box.exec()


def show_about(parent: QWidget | None) -> None:
    """Open the About box."""
    _show_rich_text(parent, "About Zeffir", about_html())


def help_html() -> str:
    """Short help: the spec syntax, the views and their shortcuts."""
    rows = [
        ("Ctrl+1 … Ctrl+5", "Radial curves, Slice, Pair densities, Two electrons, Terms"),
        ("Ctrl+D", "side by side with a second model or atom"),
        ("Ctrl+E / Ctrl+Shift+E", "export the figure / the data of the current view"),
        ("Ctrl+O / Ctrl+S", "open / save a session (.zeffir)"),
        ("Return in the Atom field", "apply the spec, or compute it again after a failure"),
        ("F1", "this help"),
    ]
    table = "".join(f"<tr><td><b>{html.escape(k)}</b></td><td>{html.escape(v)}</td></tr>"
                    for k, v in rows)
    return (
        "<h3>Zeffir</h3>"
        "<p><b>Atom field</b>: an element or ion, optionally with a configuration in trade "
        "notation: <code>Fe</code>, <code>26</code>, <code>Fe3+</code>, <code>O2-</code>, "
        "<code>C 1s2 2s1 2p3</code>, <code>Na [Ne] 4d1</code>. Ions of charge +1 to +4 take "
        "NIST's observed ground configuration; an explicit configuration replaces the ground "
        "one.</p>"
        f"<table cellspacing='6'>{table}</table>"
        "<p>A yellow strip above the views means the picture is not (yet) what the controls "
        "ask for: it says what is shown, what was asked and why; Retry computes again.</p>"
        "<p>Spin and combo boxes change on the mouse wheel only after a click into them.</p>"
    )


def show_help(parent: QWidget | None) -> None:
    """Open the help box (F1)."""
    _show_rich_text(parent, "Zeffir help", help_html())
