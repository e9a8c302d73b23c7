"""Print the colour-map stops kept in ``zeffir.scene._colours``, read from matplotlib's tables.

Usage: ``python tools/colour_stops.py``. Run once when a map is added; the numbers are
pasted into the module, so neither the window nor the scenes import matplotlib.

- viridis, magma, inferno, plasma (van der Walt & Smith 2015) and cividis (Nuñez,
  Anderton & Renslow 2018): matplotlib's published 256-entry tables, sampled at 33
  evenly spaced entries.
- RdBu, PuOr, BrBG: ColorBrewer 2.0's 11-class schemes (C. A. Brewer), reversed so that
  the warm end stands for positive values.
- coolwarm: K. Moreland's 33 control points (Moreland 2009), as matplotlib keeps them.
"""

from __future__ import annotations

import numpy as np
from matplotlib import _cm, colormaps
from matplotlib.colors import to_hex

SEQUENTIAL = ("viridis", "cividis", "magma", "inferno", "plasma")
STOPS = 33


def _block(name: str, colours: list[str]) -> str:
    lines = [f'    "{name}": (']
    for i in range(0, len(colours), 8):
        lines.append("        " + " ".join(f'"{c}",' for c in colours[i:i + 8]))
    lines.append("    ),")
    return "\n".join(lines)


def main() -> None:
    print("SEQUENTIAL_MAPS = {")
    for name in SEQUENTIAL:
        table = np.asarray(colormaps[name].colors)
        index = np.round(np.linspace(0, len(table) - 1, STOPS)).astype(int)
        print(_block(name, [to_hex(c) for c in table[index]]))
    print("}")
    print("DIVERGING_MAPS = {")
    for key, data in (("RdBu", _cm._RdBu_data), ("PuOr", _cm._PuOr_data), ("BrBG", _cm._BrBG_data)):
        print(_block(key, [to_hex(c) for c in list(data)[::-1]]))
    points = _cm._coolwarm_data
    rgb = np.stack([[p[1] for p in points[c]] for c in ("red", "green", "blue")], axis=1)
    print(_block("coolwarm", [to_hex(c) for c in rgb]))
    print("}")


if __name__ == "__main__":
    main()
