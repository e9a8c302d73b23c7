"""Allow ``python -m zeffir``."""

import sys

from zeffir.cli import main

if __name__ == "__main__":
    sys.exit(main())
