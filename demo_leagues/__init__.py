"""The demo league workbooks (an invented scenario), installed as the package data
`leaguegrid.demos`; read them through `leaguegrid.app.demos`."""
