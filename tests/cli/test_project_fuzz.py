"""A seeded mutation loop over project files: truncations, flipped bytes, fields of the wrong
type, huge values and deep nesting. Every command that reads a project (check, count, plan,
whatif) exits 0, 1 or 4 (or 3 when the pins it was given leave no schedule), with no traceback,
a message of at most 2,000 characters per line, and the file unchanged."""

from __future__ import annotations

import json
import random
import shutil
from pathlib import Path
from typing import Any

from leaguegrid.core.wording import MESSAGE_CHARS

LABELS = ["Herons v Wrens", "Otters v Badgers", "Herons v Otters", "Wrens v Badgers",
          "Otters v Wrens", "Badgers v Herons"]
ODD_VALUES: list[Any] = [None, True, False, -1, 0, 1001, 10 ** 30, 1.5, "soon", "", "x" * 3000,
                         [], {}, [[1, 2]], {"a": {"b": [None]}}, "\x00", ["a", "b", "c"],
                         {"kind": "team"}, list(range(2000))]
ROUNDS = 5
SEED = 20261203
CASES = 200


def sound(folder: Path, demo: Path) -> dict[str, Any]:
    shutil.copy(demo / "small.xlsx", folder / "small.xlsx")
    return {
        "format": "leaguegrid-project", "version": 1,
        "workbook": {"path": str(folder / "small.xlsx"), "relative": "small.xlsx",
                     "sha256": None},
        "mapping": {"Home": "Home"}, "pins": {"Herons v Wrens": 2, "Otters v Wrens": None},
        "ties": [["Otters v Wrens", "Badgers v Herons"]],  # share no team nor venue
        "waived": [{"kind": "venue", "key": "Millbrook Field", "row": None}],
        "added_clashes": [["Herons v Wrens", "Otters v Badgers"]], "rounds": ROUNDS,
        "schedule": {"rounds": ROUNDS, "seed": 7, "method": "uniform",
                     "assignment": dict(zip(LABELS, [2, 1, 1, 3, 3, 4], strict=True))},
        "seed": 7,
    }


def places(value: Any, path: tuple = ()) -> list[tuple]:
    """Every path into a JSON value (keys and indexes)."""
    out = [path]
    if isinstance(value, dict):
        for key, item in value.items():
            out += places(item, (*path, key))
    elif isinstance(value, list):
        for i, item in enumerate(value):
            out += places(item, (*path, i))
    return out


def replaced(value: Any, path: tuple, new: Any) -> Any:
    if not path:
        return new
    head, rest = path[0], path[1:]
    if isinstance(value, dict):
        return {k: (replaced(v, rest, new) if k == head else v) for k, v in value.items()}
    return [replaced(v, rest, new) if i == head else v for i, v in enumerate(value)]


def mutate(rng: random.Random, raw: dict[str, Any]) -> bytes:
    text = json.dumps(raw, indent=2).encode()
    kind = rng.randrange(6)
    if kind == 0:  # truncated
        return text[:rng.randrange(len(text))]
    if kind == 1:  # flipped bytes
        data = bytearray(text)
        for _ in range(rng.randint(1, 6)):
            data[rng.randrange(len(data))] = rng.randrange(256)
        return bytes(data)
    if kind == 5:  # nesting injected in place of a value
        depth = rng.choice([5, 17, 5000])
        new: Any = "[" * depth + "]" * depth
        path = rng.choice(places(raw)[1:])
        marker = "\x01MARK\x01"
        text = json.dumps(replaced(raw, path, marker))
        return text.replace(json.dumps(marker), new).encode()
    mutated = raw
    for _ in range(rng.randint(1, 3)):  # a wrong type, a huge value, or an unknown field
        path = rng.choice(places(mutated))
        if kind == 2:
            new = rng.choice(ODD_VALUES)
        elif kind == 3:
            new = rng.choice([10 ** rng.randint(3, 400), -(10 ** 20), "é" * 50_000,
                              [LABELS[0]] * 20_000, {f"F{i}": i for i in range(5000)}])
        else:
            new = {"surprise": rng.choice(ODD_VALUES)}
        mutated = replaced(mutated, path, new)
    return json.dumps(mutated).encode()


def write(path: Path, raw: dict[str, Any]) -> Path:
    path.write_text(json.dumps(raw), encoding="utf-8")
    return path


def test_mutated_project_files_never_crash_a_command(cli, tmp_path, demo):
    rng = random.Random(SEED)
    raw = sound(tmp_path, demo)
    path = tmp_path / "season.leaguegrid"
    commands = [["check"], ["count", "--rounds", str(ROUNDS), "--budget", "5"],
                ["plan", "--rounds", str(ROUNDS), "--seed", "1", "--budget", "5"],
                ["whatif", "--rounds", str(ROUNDS), "--add", "Herons,Otters", "--budget", "5"]]
    assert [cli(c[0], str(write(path, raw)), *c[1:])[0] for c in commands] == [0, 0, 0, 0]
    seen = set()
    for case in range(CASES):
        data = mutate(rng, raw)
        path.write_bytes(data)
        command, *options = commands[case % len(commands)]
        code, out, err = cli(command, str(path), *options)
        seen.add(code)
        assert code in (0, 1, 3, 4), (case, command, code, err)
        assert "Traceback" not in err + out, (case, err)
        assert all(len(line) <= MESSAGE_CHARS + 40 for line in err.splitlines()), case
        assert path.read_bytes() == data, case
    assert {0, 1} <= seen  # the loop reaches both sound and refused files
    assert sorted(p.name for p in tmp_path.iterdir()) == ["season.leaguegrid", "small.xlsx"]
