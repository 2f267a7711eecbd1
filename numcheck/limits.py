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
MAX_BATCH_FILES = 200_000
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
#: Most candidates a restoration may be asked for (``top``) ...
RESTORE_MAX_TOP = 100_000
#: ... and most it lists (more asked for are cut to this, with a note).
RESTORE_MAX_LISTED = 10_000
#: Longest excerpt of an input quoted in a message (characters).
MAX_ECHO = 200
#: A temporary file of numcheck's naming older than this (seconds) is stale and swept.
STALE_TEMP_SECONDS = 3600
#: A batch run records finished files in its journal at least every this many seconds
#: (after ``kill -9`` at most this much work is done again on resume).
BATCH_JOURNAL_SECONDS = 2.0
#: ... or every this many files, whichever comes first.
BATCH_JOURNAL_ENTRIES = 200
#: Largest span ``relate`` accepts, in its unit (and no part finer than 1 over it).
RELATE_MAX_SPAN = 10**18
#: The audit tries every pair and triple of columns for a relation (sums, products,
#: reciprocals) in a table of up to this many columns ...
AUDIT_CROSS_COLUMNS = 20
#: ... and in a wider table only among columns at most this many apart.
AUDIT_CROSS_WINDOW = 6
#: Most names, numbers and signs in a relation stated to ``audit`` (this bounds its nesting too).
MAX_RELATION_TOKENS = 200
#: A table cell whose text allows more readings than this (a Greek 'ο' as 0 or 70, times
#: other open places) is not decided by its column; the audit restores it from the scheme.
SETTLE_MAX_READINGS = 16
#: Longest message of an error (characters): a longer one keeps its beginning and its end.
MAX_MESSAGE = 2000
#: Most ways a restoration counts the lost places of the ``[...]`` of one number
#: (each stands for 1 to GAP_MAX_PLACES places: six of them make 729).
RESTORE_MAX_EXPANSIONS = 729
