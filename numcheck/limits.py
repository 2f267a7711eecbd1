"""Every size limit of numcheck, in one place.

Each limit protects a scholar from a hang or an exhausted machine.  Errors that
enforce them name the limit and say how to raise it (pass a larger value to
the function, or set the module attribute before the call).
"""

#: Longest text read as one number (characters).
MAX_TEXT_LENGTH = 4000
#: Most places (or signs) in one number.
MAX_PLACES = 60
#: Most decimal digits in a lone whole place written in decimal (365 in 365;14,48,
#: an Indian yuga's 1577917500 days, a line number).  Exact integers have no size
#: limit of their own; this only keeps a pasted run of digits from being read as one number.
MAX_WHOLE_PLACE_DIGITS = 40
#: Most unread or lost digits (``x``, ``[x]``) in such a place: each one multiplies the
#: readings by ten.
MAX_WHOLE_PLACE_OPEN_DIGITS = 6
#: An unknown number of lost places (``[...]``) stands for 1 to this many places.
GAP_MAX_PLACES = 3
#: Largest XML file read by ``annotate`` or as a TEI table (bytes).
MAX_XML_BYTES = 50_000_000
#: Deepest element nesting accepted in an XML file.
MAX_XML_DEPTH = 200
#: Most ``<num>`` elements annotated in one XML file.
MAX_XML_NUMS = 200_000
#: Most number words listed from one ATF file by ``annotate FILE.atf``.
MAX_ATF_NUMBERS = 200_000
#: Most files in one batch run (``annotate DIR``, ``audit DIR``).
MAX_BATCH_FILES = 10_000
#: Largest table file (TSV, CSV, aligned text) read by ``audit`` (bytes).
MAX_TABLE_BYTES = 200_000_000
#: Most cells in one table given to ``audit`` (rows times columns).
MAX_TABLE_CELLS = 2_000_000
#: Most readings of one damaged table cell enumerated when restoring it from its scheme.
AUDIT_MAX_CELL_READINGS = 100_000
#: Most lost letters tried at once when a lost letter changes its neighbours
#: (Roman numerals, abjad groups): every letter is tried at every lost place.
MAX_LOST_LETTERS = 6
#: Most readings a restoration scores one by one (those that agree with some evidence).
RESTORE_MAX_MATCHES = 200_000
#: Most steps of a restoration's search (branch and bound, and the walk by prior).
RESTORE_MAX_NODES = 2_000_000
#: A restoration space larger than this, with no evidence that narrows it, is said to be wide.
RESTORE_WIDE_SPACE = 10_000
#: A floating (cuneiform) number is tried with its first place from 60^lo to 60^hi.
RESTORE_FLOAT_FIRST_PLACE = (-2, 3)
#: Largest whole multiple of a catalogue period that identify tries (e.g. 4267 months).
IDENTIFY_MAX_MULTIPLE = 5000
#: Largest numerator and denominator of the simple factors n/m that identify tries.
IDENTIFY_MAX_SIMPLE = 12
#: Most catalogue targets returned by one ``catalogue_targets`` call (simplest kept).
IDENTIFY_MAX_TARGETS = 50_000
#: Longest span, in years, that ``relate --search`` walks (months: this many years of them).
RELATE_MAX_SEARCH_YEARS = 20_000
#: Most catalogue candidates (values times factors) identify compares for one number; past
#: it only simple parts and multiples are compared (long multiples left out, with a note).
IDENTIFY_MAX_CANDIDATES = 100_000
#: identify compares the whole range a damaged reading allows only up to this many readings.
IDENTIFY_DAMAGE_READINGS = 60
#: Most candidates a restoration lists (``top``).
RESTORE_MAX_TOP = 100_000
#: A table cell whose text allows more readings than this (a Greek 'ο' as 0 or 70, times
#: other open places) is not decided by its column; the audit restores it from the scheme.
SETTLE_MAX_READINGS = 16
