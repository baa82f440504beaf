"""The Clashes, Ties and Splits sheets: names resolved to fixtures, qualifiers, expansion of a
team or venue to all its fixtures, and every problem at its cell."""

from __future__ import annotations

from test_reader_support import errors, load_book, one, warnings_of

FIXTURES = [
    ["Fixture", "Home", "Away", "Venue", "Round"],
    [None, "Alder", "Birch", "Marsh Lane", None],  # Alder v Birch
    [None, "Cedar", "Alder", "Oak Rd", None],  # Cedar v Alder
    [None, "Marsh Lane", "Damson", "Oak Rd", None],  # Marsh Lane v Damson
    [None, "Elm", "Fir", "Pine St", None],  # Elm v Fir
    ["Cup Final", None, None, "Pine St", None],
]


def with_sheet(tmp_path, name, rows, **more):
    return load_book(tmp_path, {"Fixtures": FIXTURES, name: rows, **more})


def where(problem):
    return (problem.sheet, problem.row, problem.column, problem.value)


def test_team_expands_to_all_its_fixtures_and_self_pairs_are_skipped(tmp_path):
    rows = [["First", "Second", "Reason"], ["Alder", "Cedar", "one coach"]]
    result = with_sheet(tmp_path, "Clashes", rows)
    assert result.ok, [str(p) for p in result.problems]
    clash = one(result.league.clash_rows)
    # Alder: Alder v Birch, Cedar v Alder; Cedar: Cedar v Alder. The pair Cedar v Alder with
    # itself is skipped.
    assert clash.pairs == [("Alder v Birch", "Cedar v Alder")]
    assert (clash.first, clash.second, clash.reason, clash.row) == (
        "Alder",
        "Cedar",
        "one coach",
        2,
    )


def test_venue_and_fixture_names(tmp_path):
    rows = [
        ["First", "Second", "Reason"],
        ["Pine St", "fixture:  alder v birch", "family"],
        ["Cup Final", "Elm v Fir", None],
    ]
    result = with_sheet(tmp_path, "Clashes", rows)
    assert not errors(result)
    assert [c.pairs for c in result.league.clash_rows] == [
        [("Alder v Birch", "Elm v Fir"), ("Alder v Birch", "Cup Final")],
        [("Elm v Fir", "Cup Final")],
    ]
    assert one(warnings_of(result)).message == (
        "written differently from 'Alder v Birch' (Fixtures row 2); read as the same fixture"
    )


def test_ambiguous_name_names_the_kinds(tmp_path):
    rows = [["First", "Second"], ["Marsh Lane", "Elm"]]
    problem = one(errors(with_sheet(tmp_path, "Clashes", rows)))
    assert problem.message == (
        "'Marsh Lane' is both a team and a venue: write 'team: Marsh Lane' or 'venue: Marsh Lane'"
    )
    assert where(problem) == ("Clashes", 2, "First", "Marsh Lane")


def test_qualifiers_settle_the_kind(tmp_path):
    rows = [["First", "Second"], ["team: marsh lane", "Elm"], ["Venue:Marsh Lane", "Elm"]]
    result = with_sheet(tmp_path, "Clashes", rows)
    assert not errors(result)
    assert [c.pairs for c in result.league.clash_rows] == [
        [("Marsh Lane v Damson", "Elm v Fir")],
        [("Alder v Birch", "Elm v Fir")],
    ]


def test_unknown_name_suggests_the_closest(tmp_path):
    rows = [["First", "Second"], ["Aldr", "Elm"], ["team: Pine St", "Elm"], ["Zzyzx", "Elm"]]
    found = errors(with_sheet(tmp_path, "Clashes", rows))
    assert [(p.message, where(p)) for p in found] == [
        (
            "no fixture, team or venue is named 'Aldr'; did you mean 'Alder'?",
            ("Clashes", 2, "First", "Aldr"),
        ),
        ("no team is named 'Pine St'", ("Clashes", 3, "First", "team: Pine St")),
        ("no fixture, team or venue is named 'Zzyzx'", ("Clashes", 4, "First", "Zzyzx")),
    ]


def test_same_fixture_on_both_sides(tmp_path):
    rows = [["First", "Second"], ["Elm v Fir", "fixture: ELM V FIR"], ["Elm", "team: elm"]]
    found = errors(with_sheet(tmp_path, "Clashes", rows))
    assert [(p.message, where(p)) for p in found] == [
        (
            "the row names the same fixture on both sides",
            ("Clashes", 2, "Second", "fixture: ELM V FIR"),
        ),
        ("the row names the same team on both sides", ("Clashes", 3, "Second", "team: elm")),
    ]


def test_blank_side_and_missing_column(tmp_path):
    problem = one(errors(with_sheet(tmp_path, "Clashes", [["First", "Second"], ["Elm", None]])))
    assert (problem.message, where(problem)) == (
        "the row needs both First and Second",
        ("Clashes", 2, "Second", None),
    )
    problem = one(errors(with_sheet(tmp_path, "Clashes", [["First", "Other"], ["Elm", "Fir"]])))
    assert (problem.message, where(problem)) == (
        "the sheet has no Second column (columns found: First, Other)",
        ("Clashes", 1, "Second", None),
    )


def test_team_without_fixtures_adds_no_clash(tmp_path):
    sheets = {"Teams": [["Team"], ["Gorse"]]}
    result = with_sheet(tmp_path, "Clashes", [["First", "Second"], ["Gorse", "Elm"]], **sheets)
    assert not errors(result)
    assert [(p.message, where(p)) for p in warnings_of(result)] == [
        ("the team has no fixtures", ("Teams", 2, "Team", "Gorse")),
        (
            "the team 'Gorse' has no fixtures, so the row adds no clash",
            ("Clashes", 2, "First", "Gorse"),
        ),
    ]


def test_empty_optional_sheet_warns(tmp_path):
    result = with_sheet(tmp_path, "Clashes", [])
    assert result.ok
    assert (one(result.problems).message, one(result.problems).sheet) == (
        "the sheet is empty; nothing is read from it",
        "Clashes",
    )


def test_ties_and_splits(tmp_path):
    result = load_book(
        tmp_path,
        {
            "Fixtures": FIXTURES,
            "Ties": [["First", "Second"], ["Alder v Birch", "Elm v Fir"]],
            "Splits": [
                ["First", "Second", "Reason"],
                ["Cup Final", "Marsh Lane v Damson", "county ask"],
                ["Cup Final", "Alder v Birch", None],
            ],
        },
    )
    assert result.ok, [str(p) for p in result.problems]
    tie = one(result.league.ties)
    assert (tie.first, tie.second, tie.row) == ("Alder v Birch", "Elm v Fir", 2)
    assert [(s.first, s.second, s.reason, s.row) for s in result.league.splits] == [
        ("Cup Final", "Marsh Lane v Damson", "county ask", 2),
        ("Cup Final", "Alder v Birch", "kept apart", 3),
    ]


def test_together_and_apart_are_the_sheets_names_now_and_ties_splits_still_read(tmp_path):
    """Issue 12's fixed names: Together and Apart; Ties and Splits are the same sheets."""
    for together, apart in (("Together", "Apart"), ("Ties", "Splits"), ("together", "APART")):
        result = load_book(
            tmp_path,
            {
                "Fixtures": FIXTURES,
                together: [["First", "Second"], ["Alder v Birch", "Elm v Fir"]],
                apart: [["First", "Second"], ["Cup Final", "Alder v Birch"]],
            },
        )
        assert result.ok, [str(p) for p in result.problems]
        assert [(t.first, t.second) for t in result.league.ties] == [("Alder v Birch", "Elm v Fir")]
        assert [(s.first, s.second, s.reason) for s in result.league.splits] == [
            ("Cup Final", "Alder v Birch", "kept apart")
        ]


def test_ties_name_fixtures_only(tmp_path):
    rows = [
        ["First", "Second"],
        ["team: Elm", "Cup Final"],
        ["Cup Finale", "Elm v Fir"],
        ["Cup Final", "cup final"],
    ]
    found = errors(with_sheet(tmp_path, "Ties", rows))
    assert [(p.message, where(p)) for p in found] == [
        ("this sheet names fixtures only, not a team", ("Ties", 2, "First", "team: Elm")),
        (
            "no fixture is named 'Cup Finale'; did you mean 'Cup Final'?",
            ("Ties", 3, "First", "Cup Finale"),
        ),
        ("the row names the same fixture on both sides", ("Ties", 4, "Second", "cup final")),
    ]


def test_tie_between_clashing_fixtures(tmp_path):
    rows = [["First", "Second"], ["Alder v Birch", "Cedar v Alder"]]
    problem = one(errors(with_sheet(tmp_path, "Ties", rows)))
    assert problem.message == (
        "'Alder v Birch' and 'Cedar v Alder' clash (team Alder) but Together (row 2) keeps them "
        "in one round"
    )
    assert where(problem) == ("Ties", 2, None, None)


def test_tie_joining_two_pins(tmp_path):
    fixtures = [row[:] for row in FIXTURES]
    fixtures[1][4], fixtures[4][4] = 1, 2
    rows = [
        ["First", "Second"],
        ["Alder v Birch", "Marsh Lane v Damson"],
        ["Marsh Lane v Damson", "Elm v Fir"],
    ]
    result = load_book(tmp_path, {"Fixtures": fixtures, "Ties": rows})
    problem = one(errors(result))
    assert problem.message == (
        "Together (rows 2 and 3) keeps 'Alder v Birch' (pinned to round 1) and 'Elm v Fir' "
        "(pinned to round 2) in one round"
    )


def test_tie_into_a_pinned_round_that_clashes(tmp_path):
    fixtures = [row[:] for row in FIXTURES]
    fixtures[1][4], fixtures[2][4] = 1, None  # Alder v Birch pinned to 1
    fixtures[4][4] = 1  # Elm v Fir pinned to 1, tied to Cedar v Alder (clashes with Alder v Birch)
    rows = [["First", "Second"], ["Elm v Fir", "Cedar v Alder"]]
    result = load_book(tmp_path, {"Fixtures": fixtures, "Ties": rows})
    problem = one(errors(result))
    assert problem.message == (
        "'Alder v Birch' and 'Cedar v Alder' clash (team Alder) but pins and Together (row 2) "
        "put both in round 1"
    )
    assert where(problem) == ("Ties", 2, None, None)


def test_split_inside_a_tie(tmp_path):
    result = load_book(
        tmp_path,
        {
            "Fixtures": FIXTURES,
            "Ties": [["First", "Second"], ["Elm v Fir", "Alder v Birch"]],
            "Splits": [["First", "Second", "Reason"], ["Alder v Birch", "Elm v Fir", "apart"]],
        },
    )
    problem = one(errors(result))
    assert problem.message == (
        "'Alder v Birch' and 'Elm v Fir' clash (Apart row 2: apart) but Together (row 2) keeps "
        "them in one round"
    )
