"""`python -m leaguegrid` runs the command line."""

import sys

from leaguegrid.cli import main

if __name__ == "__main__":
    sys.exit(main())
