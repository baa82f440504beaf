"""What the frozen app runs: the `leaguegrid` program (window, command or engine process)."""

import multiprocessing
import sys

from leaguegrid.launch import main

if __name__ == "__main__":
    multiprocessing.freeze_support()
    sys.exit(main())
