"""A damaged ``<num>`` in a TEI table, restored by the table's scheme.

The audit finds the scheme of the table around the number and ranks the
readings of its damaged cells by what that scheme expects, which says more
than the number alone.
"""

from __future__ import annotations

from ..errors import NumcheckError
from ..tables.tei import table_frame, tei_tables
from .markup import TEI_NS

__all__ = ["table_restorations"]


def table_restorations(root, nums, *, notation: str | None = None, top: int = 3,
                       notes: list[str] | None = None) -> dict[int, list]:
    """Restorations of damaged ``<num>`` in TEI tables, ranked by the table's scheme.

    Audits each ``<table>`` that holds one of *nums* and returns, for each
    ``<num>`` alone in a cell the audit restored, the audit's restorations
    (best first), keyed by ``id(num)``.  A table the audit cannot read is
    passed over (with a line in *notes*); its numbers keep their own
    restorations.
    """
    from ..audit import audit

    wanted = {id(n): n for n in nums}
    out: dict[int, list] = {}
    for el in tei_tables(root):
        inside = [n for n in el.iter(f"{{{TEI_NS}}}num") if id(n) in wanted]
        if not inside:
            continue
        try:
            read = table_frame(el, "<table>", notation)
            result = audit(read.frame, notation=notation or read.frame.attrs.get("notation"))
        except NumcheckError as err:
            if notes is not None:
                notes.append(f"the table at line {el.sourceline} could not be audited, so its numbers "
                             f"were restored one by one: {str(err).splitlines()[0]}")
            continue
        by_cell: dict[tuple[int, str], list] = {}
        for r in result.to_dict().get("restorations", []):
            by_cell.setdefault((r["row"], r["column"]), []).append(r)
        for key, restorations in by_cell.items():
            cell = read.cells.get(key)
            if cell is None:
                continue
            cell_nums = list(cell.iter(f"{{{TEI_NS}}}num"))
            if len(cell_nums) == 1 and id(cell_nums[0]) in wanted:
                out[id(cell_nums[0])] = restorations[:top]
    return out
