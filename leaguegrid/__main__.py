"""`python -m leaguegrid` runs the same program as the `leaguegrid` command."""

import sys

from leaguegrid.launch import main

if __name__ == "__main__":
    sys.exit(main())
