"""What one worker of a batch has learnt, given to the others through a private folder.

Each worker of ``annotate DIR`` meets the corpus's numbers in its own files;
a number's outcome learnt by one (:mod:`.quick`, :mod:`.outcomes`) is what
the other would find.  So after a file a worker writes the outcomes it
learnt to a file of its own in a folder only the batch uses, and before a
file it reads those the others wrote.  What is read is only ever added
where the process has learnt nothing for that text (the same outcome either
way: ``tests/test_tei_sharing.py``), under the same options and limits (part
of each outcome's key).  Files are renamed into place whole; a worker that
cannot read or write one simply learns the numbers itself.
"""

from __future__ import annotations

import os
import pickle

from . import outcomes

__all__ = ["Sharing", "GIVE_AT"]

#: Outcomes are written once this many are new (or at the end of a job).
GIVE_AT = 8


class Sharing:
    """One worker's side of the exchange in *folder* (made private by the batch)."""

    def __init__(self, folder: str):
        self.folder = folder
        self.mine = f"{os.getpid()}-"
        self.seen: set[str] = set()
        self.count = 0
        self.waiting: list[tuple] = []
        outcomes.NOTING = True

    def take(self) -> int:
        """Keep what the other workers wrote since the last call; the number of outcomes taken."""
        taken = 0
        try:
            names = [e.name for e in os.scandir(self.folder)]
        except OSError:
            return 0
        for name in names:
            if name in self.seen or name.startswith(self.mine) or not name.endswith(".pickle"):
                continue
            self.seen.add(name)
            try:
                with open(os.path.join(self.folder, name), "rb") as handle:
                    records = pickle.load(handle)
            except (OSError, pickle.UnpicklingError, EOFError, AttributeError, ImportError):
                continue
            outcomes.adopt(records)
            taken += len(records)
        return taken

    def give(self, force: bool = False) -> None:
        """Write the outcomes learnt since the last call (once there are :data:`GIVE_AT`, or *force*)."""
        self.waiting += outcomes.take_new()
        if not self.waiting or (len(self.waiting) < GIVE_AT and not force):
            return
        self.count += 1
        name = f"{self.mine}{self.count:06d}.pickle"
        tmp = os.path.join(self.folder, name + ".part")
        try:
            with open(tmp, "wb") as handle:
                pickle.dump(self.waiting, handle, protocol=pickle.HIGHEST_PROTOCOL)
            os.replace(tmp, os.path.join(self.folder, name))
        except OSError:
            try:
                os.unlink(tmp)
            except OSError:
                pass
        self.waiting = []
