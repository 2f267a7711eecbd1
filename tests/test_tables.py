

def test_a_seven_digit_line_number_is_read_by_the_fast_path():
    # A lone whole place has no six-digit limit (the reader and the table's fast path agree).
    from numcheck.tables.cells import _fast
    cell = _fast(1, "line", "1000001", "sexagesimal", "1000001")
    assert cell is not None and cell.value == 1000001
