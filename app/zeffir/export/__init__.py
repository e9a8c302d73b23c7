"""Figure, data and session files: written atomically, from the scenes the window shows."""
