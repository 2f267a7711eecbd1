"""The cells of a table: exact values, their notation, and how to write a correction back.

A table has a header row and one number per cell, in any notation numcheck
reads.  Each cell keeps its text, its exact value (``None`` when damage leaves
more than one reading), its Reading (for damaged cells and for writing a
correction back in the cell's own notation) and, for a longitude written as
degrees within a zodiacal sign (``14;11,57,4 Libra``), the sign it names.

Plain undamaged sexagesimal cells (digits, ``,`` and ``;``) are read by a
fast path that gives the same exact value as :func:`numcheck.read` (a test
pins the equality): an ephemeris of 10,000 lines must load in well under a
second.  Everything else goes through :func:`numcheck.read`.
"""

from __future__ import annotations

import functools
import re
import unicodedata
from array import array
from collections import Counter
from itertools import accumulate
from dataclasses import dataclass, field
from fractions import Fraction

from ..errors import LimitError, NumcheckError, UnknownNameError
from .. import limits
from ..reader import read
from ..reading import Reading
from ..units import ZODIAC, zodiac_index
from .settle import settle_column

__all__ = ["Cell", "Cells", "Column", "Table", "build_table", "check_cells", "ZODIAC", "sign_index",
           "ColumnReading", "read_column"]


#: Notations whose module writes a value in the style of a given cell (``write_like``).
_WRITES_LIKE = ("atf", "atf-math")
_PLAIN = re.compile(r"-?\d+(?:,\d+)*(?:;\d+(?:,\d+)*)?")
_SEPARATORS = re.compile(r"[,;]")
_LONGITUDE = re.compile(r"(?P<number>.*\S)\s+(?P<sign>\S+)")


@functools.lru_cache(maxsize=256)
def sign_index(name: str) -> int | None:
    """The 0-based index of a zodiacal sign name, or None.

    >>> sign_index("Libra")
    6
    """
    try:
        return zodiac_index(name)
    except UnknownNameError:
        return None


@dataclass(slots=True)
class Cell:
    """One cell of the table as written, with its exact value when it has one.

    A plain sexagesimal cell keeps its value as an integer count of its last
    place (``num``, in units of 60**-places), which is what the audit works
    with; ``value`` gives the Fraction.  Other cells keep their Reading's
    exact value.
    """

    row: int                      # 1-based data row (header not counted)
    column: str
    text: str
    notation: str
    num: int | None = None        # value × 60**places, for a plain sexagesimal cell
    exact: Fraction | None = None  # the value of any other cell with one reading
    floating: bool = False
    places: int = 0               # sexagesimal places written after ';'
    digits: tuple[int, ...] | None = None   # the places as written (cells read by a notation)
    whole_places: int = 1
    reading: Reading | None = None
    sign_name: str | None = None  # a longitude: the sign named in the cell
    unreadable: str | None = None  # why the text cannot be read (the cell then counts as lost)

    @property
    def value(self) -> Fraction | None:
        """The exact value (a longitude in degrees from the vernal point); None if damaged."""
        if self.num is not None:
            return Fraction(self.num, 60 ** self.places)
        return self.exact

    @property
    def damaged(self) -> bool:
        return self.num is None and self.exact is None


#: The bit of ``Cells._flags`` for a cuneiform cell written without ';' (its magnitude free).
_FLOATING = 1
#: The bit of a cell kept whole, as a Cell object (read by a notation, unreadable, or too large).
_WHOLE = 2


class Cells:
    """The cells of one column, stored by column so that a 10^6-line table fits in memory.

    A plain sexagesimal cell (the fast path of the reader) is kept as a few
    numbers in arrays: its value as an integer count of its last place, its
    places, its whole places, its sign; every text of the column is kept in
    one string.  A cell read by a notation, an unreadable one, or one too
    large for the arrays is kept whole, as a :class:`Cell`.  Indexing gives a
    :class:`Cell` either way, made on demand for a plain one (equal to the one
    the reader would have kept), so code that reads cells one by one needs no
    change; code that walks a whole column uses the column-wide methods.
    """

    __slots__ = ("column", "notation", "_num", "_places", "_whole_places", "_flags", "_signs",
                 "_sign_names", "_text", "_ends", "_kept", "_n")

    def __init__(self, column: str, notation: str):
        self.column = column
        self.notation = notation            # the notation of every plain cell
        self._num = array("q")
        self._places = bytearray()
        self._whole_places = bytearray()
        self._flags = bytearray()
        self._signs = bytearray()           # 0: no sign; k: self._sign_names[k - 1]
        self._sign_names: list[str] = []
        self._text = ""
        self._ends = array("q")
        self._kept: dict[int, Cell] = {}
        self._n = 0

    @classmethod
    def of(cls, column: str, cells, notation: str = "sexagesimal") -> "Cells":
        """A store holding the Cell objects *cells* as they are."""
        out = cls(column, notation)
        texts = []
        for c in cells:
            out.keep(c)
            texts.append(c.text)
        out.set_texts(texts)
        return out

    # -- building --------------------------------------------------------
    def add_plain(self, num: int, places: int, whole_places: int, floating: bool,
                  sign_name: str | None) -> bool:
        """Append a plain cell; False (nothing appended) when it does not fit the arrays."""
        if not (-(1 << 63) <= num < (1 << 63)) or places > 255 or whole_places > 255:
            return False
        self._num.append(num)
        self._places.append(places)
        self._whole_places.append(whole_places)
        self._flags.append(_FLOATING if floating else 0)
        if sign_name is None:
            self._signs.append(0)
        else:
            try:
                k = self._sign_names.index(sign_name) + 1
            except ValueError:
                self._sign_names.append(sign_name)
                k = len(self._sign_names)
            if k > 255:
                self._pop()
                return False
            self._signs.append(k)
        self._n += 1
        return True

    def _pop(self) -> None:
        self._num.pop()
        self._places.pop()
        self._whole_places.pop()
        self._flags.pop()

    def keep(self, cell: "Cell") -> None:
        """Append a cell kept whole."""
        self._kept[self._n] = cell
        self._num.append(0)
        self._places.append(0)
        self._whole_places.append(0)
        self._flags.append(_WHOLE)
        self._signs.append(0)
        self._n += 1

    def set_texts(self, texts) -> None:
        """The texts of the cells, top to bottom (kept as one string)."""
        self._text = "".join(texts)
        # 4 bytes an end where the text allows (any table under MAX_TABLE_BYTES)
        self._ends = array("I" if len(self._text) < 1 << 32 else "q", accumulate(map(len, texts)))

    # -- reading ---------------------------------------------------------
    def __len__(self) -> int:
        return self._n

    def text(self, i: int) -> str:
        return self._text[self._ends[i - 1] if i else 0:self._ends[i]]

    def texts(self):
        """The text of every cell, top to bottom."""
        start = 0
        for end in self._ends:
            yield self._text[start:end]
            start = end

    def __getitem__(self, i):
        if isinstance(i, slice):
            return [self[k] for k in range(*i.indices(self._n))]
        if i < 0:
            i += self._n
        if not 0 <= i < self._n:
            raise IndexError("cell index out of range")
        if self._flags[i] & _WHOLE:
            return self._kept[i]
        k = self._signs[i]
        return Cell(row=i + 1, column=self.column, text=self.text(i), notation=self.notation,
                    num=self._num[i], floating=bool(self._flags[i] & _FLOATING),
                    places=self._places[i], whole_places=self._whole_places[i],
                    sign_name=self._sign_names[k - 1] if k else None)

    def __setitem__(self, i: int, cell: "Cell") -> None:
        if i < 0:
            i += self._n
        self._kept[i] = cell
        self._flags[i] = _WHOLE

    def __iter__(self):
        for i in range(self._n):
            yield self[i]

    def kept(self) -> list[tuple[int, "Cell"]]:
        """(index, cell) of every cell kept whole, top to bottom."""
        return sorted(self._kept.items())

    def plain_places(self) -> set[int]:
        """The numbers of places the plain cells write."""
        return {p for p, f in zip(self._places, self._flags) if not f & _WHOLE}

    def plain(self):
        """(index, num, places, whole places) of every plain cell, top to bottom."""
        for i, (num, places, whole, flag) in enumerate(zip(self._num, self._places,
                                                            self._whole_places, self._flags)):
            if not flag & _WHOLE:
                yield i, num, places, whole

    def scaled(self, scale: int) -> list:
        """Every value times *scale* (an integer, or a Fraction off the scale), None where damaged.

        The same numbers as ``cell.value * scale`` cell by cell (make_frame).
        """
        # 60**places divides the scale for every plain cell (make_frame takes them all in)
        factor = {p: scale // 60 ** p for p in set(self._places)}
        out = [num * factor[p] for num, p in zip(self._num, self._places)]
        per_place = {p: scale // 60 ** p for p in range(13) if scale % 60 ** p == 0}
        for i, c in self._kept.items():
            out[i] = (c.num * per_place[c.places] if c.num is not None and c.places in per_place else
                      None if c.value is None else c.value.numerator * (scale // c.value.denominator))
        return out

    def values(self) -> list:
        """The exact value of every cell (None where damaged)."""
        out = [Fraction(num, 60 ** p) for num, p in zip(self._num, self._places)]
        for i, c in self._kept.items():
            out[i] = c.value
        return out

    def known_places(self):
        """The places of every cell with a value, top to bottom."""
        kept = self._kept
        for i, (p, f) in enumerate(zip(self._places, self._flags)):
            if not f & _WHOLE:
                yield p
            elif kept[i].value is not None:
                yield kept[i].places

    def whole_in_one_place(self) -> bool:
        """Every cell with a value writes its whole part as one number, and one is 60 or more."""
        large = False
        kept = self._kept
        for i, (num, p, whole, f) in enumerate(zip(self._num, self._places, self._whole_places,
                                                    self._flags)):
            if f & _WHOLE:
                c = kept[i]
                if c.value is None:
                    continue
                whole, text, large_here = c.whole_places, c.text, abs(c.value) >= 60
            else:
                text, large_here = self.text(i), abs(num) >= 60 * 60 ** p
            if whole != 1 or "," in text.split(";")[0]:
                return False
            large = large or large_here
        return large

    def holds(self, char: str) -> bool:
        """Some cell's text holds *char* (one character)."""
        return char in self._text

    def all_unreadable(self) -> bool:
        return len(self._kept) == self._n and all(c.unreadable for c in self._kept.values())

    def notations(self) -> dict[str, int]:
        """How many readable cells each notation has, in the order they first appear."""
        first: dict[str, list[int]] = {}    # notation -> [first index, count]
        plain = self._n - sum(1 for f in self._flags if f & _WHOLE)
        if plain:
            start = next(i for i, f in enumerate(self._flags) if not f & _WHOLE)
            first[self.notation] = [start, plain]
        for i, c in sorted(self._kept.items()):
            if c.unreadable:
                continue
            entry = first.setdefault(c.notation, [i, 0])
            entry[0] = min(entry[0], i)
            entry[1] += 1
        return {k: v[1] for k, v in sorted(first.items(), key=lambda kv: kv[1][0])}

    def signs_read(self) -> tuple[int, int]:
        """(readable cells that name a sign, readable cells)."""
        readable = [c for c in self._kept.values() if not c.unreadable]
        plain = sum(1 for f in self._flags if not f & _WHOLE)
        signs = sum(1 for s, f in zip(self._signs, self._flags) if s and not f & _WHOLE)
        return (signs + sum(1 for c in readable if c.sign_name is not None),
                plain + len(readable))

    def final_zeros(self) -> bool:
        """Some cell writes a final empty place (29;30,0)."""
        if any(p and not f & _WHOLE and num % 60 == 0
               for num, p, f in zip(self._num, self._places, self._flags)):
            return True
        return any(c.places and (c.num % 60 == 0 if c.num is not None else
                                 bool(c.digits) and c.digits[-1] == 0) for c in self._kept.values())

    def any_floating(self) -> bool:
        return any(f & _FLOATING for f in self._flags) or any(c.floating for c in self._kept.values())

    def any_sign(self) -> bool:
        return any(self._signs)



@dataclass
class Column:
    """The cells of one column, top to bottom."""

    name: str
    cells: Cells
    notation: str = "sexagesimal"
    longitude: bool = False       # written as degrees within a named sign
    floating: bool = False
    final_zeros: bool = False     # the scribe writes final empty places (29;30,0)

    @property
    def values(self) -> list[Fraction | None]:
        return self.cells.values()

    @functools.cached_property
    def usual_places(self) -> int:
        """The number of fractional places most cells of the column write."""
        usual = Counter(self.cells.known_places()).most_common(1)
        return usual[0][0] if usual else 0

    @functools.cached_property
    def whole_in_one_place(self) -> bool:
        """The whole part is written as one number, even above 59 (Ptolemy's 115;2,44, Indian 3438)."""
        return self.notation == "sexagesimal" and not self.longitude and \
            self.cells.whole_in_one_place()

    def write(self, index: int, value: Fraction) -> str:
        """*value* as the scribe of this column would write it in row *index* (0-based).

        In the cell's notation; final empty places only where the column
        writes them, to the number of places the column usually writes (a
        cell written one place off must not set the width of its correction).
        """
        from ..slips import write_value
        cell = self.cells[index]
        if cell.reading is not None and cell.notation in _WRITES_LIKE:
            # a notation with styles of its own (ATF: 2(u) 4(disz) or 24) writes as the cell does
            from ..notations import notation_module
            text = notation_module(cell.notation).write_like(cell.reading, value)
            if text is not None:
                return text
        text = write_value(value, notation=cell.notation,
                           places=self.usual_places if self.final_zeros else 0,
                           floating=cell.floating, sign_name=cell.sign_name,
                           longitude=self.longitude,
                           separator=" " if " " in cell.text.strip() and "," not in cell.text else ",")
        if self.whole_in_one_place and not cell.floating:
            v = Fraction(value)
            whole = abs(v.numerator) // v.denominator
            sign = "-" if v < 0 else ""
            _, semi, tail = text.partition(";")
            text = f"{sign}{whole}" + (f";{tail}" if semi else "")
        if cell.notation == "greek" and "ō" in text and self.zero_sign != "ō":
            text = text.replace("ō", self.zero_sign)   # the zero sign this column writes
        return text

    @functools.cached_property
    def zero_sign(self) -> str:
        """The Greek zero sign the column's cells write (𐆊 or ō)."""
        return "𐆊" if self.cells.holds("𐆊") else "ō"


@dataclass
class Table:
    """A table read into columns of cells.

    A cell that cannot be read is kept as a lost cell and listed in
    :attr:`unreadable`; a column none of whose cells reads as a number (names,
    notes) is left out, with the reason, in :attr:`left_out`.
    """

    columns: dict[str, Column]
    nrows: int
    source: str = "<table>"
    header: list[str] = field(default_factory=list)
    left_out: dict[str, str] = field(default_factory=dict)
    #: How cells whose text allows two readings were decided by their column
    #: (:mod:`numcheck.tables.settle`).
    notes: list[str] = field(default_factory=list)

    @property
    def unreadable(self) -> list[dict]:
        """Every cell that cannot be read: row, column, text and the reason."""
        return [{"row": c.row, "column": c.column, "text": c.text, "message": c.unreadable}
                for col in self.columns.values() for _, c in col.cells.kept() if c.unreadable]


def _nfc(text: str) -> str:
    return text if text.isascii() else unicodedata.normalize("NFC", text)


def check_cells(cells: int) -> None:
    if cells > limits.MAX_TABLE_CELLS:
        raise LimitError("number of cells in the table", f"{cells:,}", f"{limits.MAX_TABLE_CELLS:,}",
                         "Set numcheck.limits.MAX_TABLE_CELLS higher to audit it.")


def build_table(header, rows, *, notation, columns, source) -> Table:
    """Cells of exact values from a *header* and *rows* of cell texts, however they were read."""
    # One normal form (NFC) for every text, as numcheck.read uses: the same
    # table typed with decomposed accents gives the same audit, word for word.
    header = [_nfc(h) for h in header]
    # A text table comes column by column (tables.text.TextColumns, its texts
    # already in NFC): a list per row cost more than the cells of a 10^6-line table.
    by_columns = None if isinstance(rows, list) or not hasattr(rows, "columns") else rows
    if by_columns is None:
        # In place: a copy of every row doubled the memory of a 10^6-line table.
        if not isinstance(rows, list):
            rows = list(rows)
        for r in rows:
            if not all(c.isascii() for c in r):
                r[:] = [_nfc(c) for c in r]
    nrows = len(rows) if by_columns is None else by_columns.nrows
    if columns is not None:
        try:
            columns = _nfc(columns) if isinstance(columns, str) else [_nfc(str(c)) for c in columns]
        except TypeError:
            raise NumcheckError(f"columns= must be a header name or a list of them, not "
                                f"{type(columns).__name__}.") from None
    if not header or all(not h for h in header):
        raise NumcheckError(f"The table {source} has no header row.")
    if not nrows:
        raise NumcheckError(f"The table {source} is empty: it has a header ({', '.join(header)}) "
                            "but no data rows.")
    check_cells(nrows * len(header))
    for j, name in enumerate(header):
        if not name:
            raise NumcheckError(f"The header of {source} has no name for column {j + 1}.")
        if _looks_numeric(name):
            raise NumcheckError(
                f"The first row of {source} looks like data ({name!r} in column {j + 1}), "
                "not a header: add a header row naming the columns (e.g. 'A  B').")
    if len(set(header)) != len(header):
        dup = next(h for h in header if header.count(h) > 1)
        raise NumcheckError(f"The header of {source} names column {dup!r} twice.")
    # (a ragged text table comes as rows: tables.text.split_columns)
    for i, r in (enumerate(rows, start=1) if by_columns is None else ()):
        if len(r) != len(header):
            hint = (" In CSV, quote the cells that hold commas (\"29;31,20\"), or use tabs."
                    if source.lower().endswith(".csv") else "")
            raise NumcheckError(
                f"Row {i} of {source} has {len(r)} cells but the header has {len(header)} "
                f"({', '.join(header)}): the rows are ragged. Check the separators of row {i}.{hint}")
    wanted = list(header)
    if columns is not None:
        columns = [columns] if isinstance(columns, str) else list(columns)
        for name in columns:
            if name not in header:
                raise UnknownNameError("column", name, header)
        wanted = [h for h in header if h in columns]
    # Column by column, each row list given up once read: the texts stay (the
    # cells keep them), the row lists do not.
    if by_columns is None:
        by_column = {name: [r[header.index(name)] for r in rows] for name in wanted}
        rows.clear()
    else:
        by_column = {name: by_columns.columns[header.index(name)] for name in wanted}
        by_columns.columns = []
    cols: dict[str, Column] = {}
    left_out: dict[str, str] = {}
    notes: list[str] = []
    for name in wanted:
        texts = by_column.pop(name)
        cells = read_cells(name, texts, notation, source)
        del texts
        if cells.all_unreadable():
            # A column of names or notes, not numbers: the audit goes on without it.
            left_out[name] = (f"no cell of column {name!r} reads as a number (row 1: "
                              f"{cells[0].unreadable}); the column was left out")
            continue
        cols[name] = _column(name, cells, source)
        notes += settle_column(cols[name], source, _settled_cell)
    if not cols:
        first = next(iter(left_out.values()), "no column to audit")
        raise NumcheckError(f"No column of {source} reads as numbers: {first}. Give the "
                            "notation (--notation) or the columns to audit (--columns).")
    return Table(columns=cols, nrows=nrows, source=source, header=list(header),
                 left_out=left_out, notes=notes)


@dataclass
class ColumnReading:
    """A column read as a whole, unreadable cells reported instead of stopping the rest."""

    column: Column
    errors: dict[int, str]        # 1-based row -> the message of the cell that could not be read
    notes: list[str]              # cells the column decided (numcheck.tables.settle)


def read_column(name: str, texts, *, notation: str | None = None, source: str = "<column>") -> ColumnReading:
    """Read the cells *texts* of one column, then let the column decide its ambiguous cells.

    Empty cells are passed over; a cell that cannot be read is reported in
    ``errors`` (by its 1-based row) and the others are still read.

    >>> r = read_column("min", ["νε", "ο", "ε"], notation="greek")
    >>> r.column.values
    [Fraction(55, 1), Fraction(0, 1), Fraction(5, 1)]
    """
    cells: list[Cell] = []
    errors: dict[int, str] = {}
    for row, text in enumerate(texts, start=1):
        text = _nfc(str(text)).strip()
        if not text:
            continue
        try:
            cells.append(_read_cell(row, name, text, notation, source))
        except NumcheckError as err:
            errors[row] = str(err)
    column = Column(name=name, cells=Cells.of(name, cells),
                    notation=notation or (cells[0].notation if cells else "sexagesimal"))
    notes = settle_column(column, source, _settled_cell)
    return ColumnReading(column, errors, notes)


def _settled_cell(cell: Cell, reading: Reading) -> Cell:
    """*cell* read again from a Reading its column narrowed to one value."""
    new = _from_reading(cell.row, cell.column, cell.text, reading)
    new.sign_name = cell.sign_name
    if cell.sign_name is not None and new.exact is not None:
        new.exact += 30 * sign_index(cell.sign_name)
    return new


def _looks_numeric(name: str) -> bool:
    return bool(_PLAIN.fullmatch(name)) or _LONGITUDE.fullmatch(name) is not None and \
        sign_index(_LONGITUDE.fullmatch(name)["sign"]) is not None and \
        bool(_PLAIN.fullmatch(_LONGITUDE.fullmatch(name)["number"]))


def _cell(row: int, column: str, text: str, notation, source) -> Cell:
    """One cell; a text that cannot be read gives a lost cell that says why."""
    try:
        return _read_cell(row, column, text, notation, source)
    except NumcheckError as err:
        return Cell(row=row, column=column, text=text, notation=notation or "",
                    unreadable=str(err).split("\n", 1)[0])


def _read_cell(row: int, column: str, text: str, notation, source) -> Cell:
    if not text:
        raise NumcheckError(f"Row {row}, column {column!r} of {source} is empty. Write the "
                            "number, or mark a lost cell with '[...]'.")
    if len(text) > limits.MAX_TEXT_LENGTH:
        raise LimitError(f"length of row {row}, column {column!r} of {source}", f"{len(text):,} characters",
                         f"{limits.MAX_TEXT_LENGTH:,}", "Set numcheck.limits.MAX_TEXT_LENGTH higher to read it.")
    sign_name = None
    number = text
    m = _LONGITUDE.fullmatch(text)
    if m and sign_index(m["sign"]) is not None:
        number, sign_name = m["number"], m["sign"]
    if notation in (None, "sexagesimal", "cuneiform") and _PLAIN.fullmatch(number):
        cell = _fast(row, column, number, notation or "sexagesimal", text)
    else:
        cell = None
    if cell is None:
        try:
            reading = read(number, notation=notation)
        except NumcheckError as err:
            raise NumcheckError(f"Row {row}, column {column!r} of {source}: cannot read "
                                f"{text!r} as a number. {err}\nIf column {column!r} holds "
                                "no numbers (month names, notes), leave it out with --columns "
                                "(columns= in Python).") from err
        cell = _from_reading(row, column, text, reading)
    if sign_name is not None:
        value = cell.value
        if value is not None and not 0 <= value < 30:
            raise NumcheckError(f"Row {row}, column {column!r} of {source}: {text!r} gives "
                                f"{number} degrees within {sign_name}, but a sign holds 0 to 30 degrees.")
        cell.sign_name = sign_name
        offset = 30 * sign_index(sign_name)
        if cell.num is not None:
            cell.num += offset * 60 ** cell.places
        elif cell.exact is not None:
            cell.exact += offset
    return cell


def read_cells(name: str, texts: list[str], notation, source) -> Cells:
    """The cells of column *name* from their *texts*: plain ones into the arrays, the rest whole."""
    cells = Cells(name, notation or "sexagesimal")
    plain_kind = notation in (None, "sexagesimal", "cuneiform")
    for i, text in enumerate(texts):
        got = _plain(text, notation) if plain_kind else None
        if got is None or not cells.add_plain(*got):
            cells.keep(_cell(i + 1, name, text, notation, source))
    cells.set_texts(texts)
    return cells


def _plain(text: str, notation):
    """(num, places, whole places, floating, sign) of a plain cell, as _read_cell reads it; None otherwise."""
    if not text or len(text) > limits.MAX_TEXT_LENGTH:
        return None
    sign_name = None
    number = text
    m = _LONGITUDE.fullmatch(text)
    if m and sign_index(m["sign"]) is not None:
        number, sign_name = m["number"], m["sign"]
    if not _PLAIN.fullmatch(number):
        return None
    got = _fast_parts(number, notation or "sexagesimal")
    if got is None:
        return None
    num, places, whole_places, floating = got
    if sign_name is not None:
        unit = 60 ** places
        if not 0 <= num < 30 * unit:
            return None     # _read_cell gives the error
        num += 30 * sign_index(sign_name) * unit
    return num, places, whole_places, floating, sign_name


def _fast(row, column, number, notation, text) -> Cell | None:
    got = _fast_parts(number, notation)
    if got is None:
        return None
    num, places, whole_places, floating = got
    return Cell(row=row, column=column, text=text, notation=notation, num=num,
                floating=floating, places=places, whole_places=whole_places)


def _fast_parts(number, notation) -> tuple[int, int, int, bool] | None:
    # Too many places, or a place of more digits than the reader accepts:
    # let the reader give its own error (the same limits as numcheck.read).
    if number.count(",") + number.count(";") >= limits.MAX_PLACES or \
            any(len(p) > limits.MAX_WHOLE_PLACE_DIGITS for p in _SEPARATORS.split(number.lstrip("-"))):
        return None
    neg = number.startswith("-")
    whole, _, frac = (number[1:] if neg else number).partition(";")
    total = 0
    first = True
    for p in whole.split(","):
        d = int(p)
        if d > 59 and not (first and "," not in whole and (frac or notation == "sexagesimal")):
            return None  # let the reader give its own message (or another notation)
        total = total * 60 + d
        first = False
    places = 0
    if frac:
        for p in frac.split(","):
            d = int(p)
            if d > 59:
                return None
            total = total * 60 + d
            places += 1
    floating = notation == "cuneiform" and not frac
    return -total if neg else total, places, whole.count(",") + 1, floating


def _from_reading(row, column, text, reading: Reading) -> Cell:
    value = reading.value if reading.count == 1 else None
    digits = None
    whole_places = 1
    if reading.base == 60 and not reading.has_gap and value is not None:
        slots = reading.counted_slots
        digits = tuple(int(s.preferred) for s in slots)
        whole_places = sum(1 for s in slots if s.place >= 0)
    return Cell(row=row, column=column, text=text, notation=reading.notation, exact=value,
                floating=reading.floating, places=max(0, -reading.last_place), digits=digits,
                whole_places=whole_places, reading=reading)


def _column(name: str, cells: Cells, source: str) -> Column:
    kinds = cells.notations()
    main = max(kinds, key=kinds.get)
    if len(kinds) > 1:
        read = [c for c in cells if not c.unreadable]
        odd = next(c for c in read if c.notation != main)
        raise NumcheckError(
            f"Column {name!r} of {source} mixes notations: row {odd.row} ({odd.text!r}) is "
            f"{odd.notation}, the rest of the column is {main}. Give --notation, or write the "
            "column in one notation.")
    for _, c in cells.kept():
        if c.unreadable:
            c.notation = main
    signs, readable = cells.signs_read()
    if signs and signs != readable:
        odd = next(c for c in cells if not c.unreadable and c.sign_name is None)
        raise NumcheckError(
            f"Column {name!r} of {source} writes longitudes within named signs, but row "
            f"{odd.row} ({odd.text!r}) names no sign.")
    return Column(name=name, cells=cells, notation=main, longitude=bool(signs),
                  floating=cells.any_floating(), final_zeros=cells.final_zeros())
