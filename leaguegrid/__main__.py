"""`python -m leaguegrid` runs the command line."""

import sys

from leaguegrid.cli import main

sys.exit(main())
