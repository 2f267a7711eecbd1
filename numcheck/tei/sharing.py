"""What one worker of a batch has learnt, given to the others through a private folder.

Each worker of ``annotate DIR`` meets the corpus's numbers in its own files;
a number's outcome learnt by one (:mod:`.quick`, :mod:`.outcomes`) is what
the other would find.  So after a file a worker appends the outcomes it
learnt to a log of its own in a folder only the batch uses, and before a
file it reads what the others appended since it last looked.  What is read
is only ever added where the process has learnt nothing for that text (the
same outcome either way: ``tests/test_tei_sharing.py``), under the same
options and limits (part of each outcome's key).

A log is a row of frames, each its length (8 bytes) and a pickle, appended
in one write: a reader takes only whole frames, and leaves a frame still
being written for its next look.  A worker that cannot read or write a log
simply learns the numbers itself.
"""

from __future__ import annotations

import os
import pickle
import struct

from . import outcomes

__all__ = ["Sharing", "GIVE_AT", "LOG_SUFFIX", "LOOK_EVERY"]

#: Outcomes are written once this many are new (or when *force* is given): the other
#: workers learn least twice when each file's are given at once.
GIVE_AT = 1
#: Once another worker's log is found, the folder is looked at for more only at every this
#: many calls of Sharing.take (before, at every call: the first files teach the most).
LOOK_EVERY = 8
#: The logs in the folder end so; a worker's is named by its process id.
LOG_SUFFIX = ".outcomes"
_HEAD = struct.Struct("<Q")


class _Peer:
    """Another worker's log, read on from where the last look stopped (kept open)."""

    def __init__(self, path: str):
        self.path = path
        self.fd: int | None = None
        self.buffer = b""

    def frames(self) -> list[bytes]:
        try:
            if self.fd is None:
                self.fd = os.open(self.path, os.O_RDONLY | getattr(os, "O_BINARY", 0))
            chunks = []
            while True:
                chunk = os.read(self.fd, 1 << 20)
                if not chunk:
                    break
                chunks.append(chunk)
        except OSError:
            return []
        data = self.buffer + b"".join(chunks) if chunks else self.buffer
        out, at = [], 0
        while len(data) - at >= _HEAD.size:
            (size,) = _HEAD.unpack_from(data, at)
            if len(data) - at - _HEAD.size < size:
                break                               # still being written
            out.append(data[at + _HEAD.size: at + _HEAD.size + size])
            at += _HEAD.size + size
        self.buffer = data[at:]
        return out

    def close(self) -> None:
        if self.fd is not None:
            os.close(self.fd)
            self.fd = None


class Sharing:
    """One worker's side of the exchange in *folder* (made private by the batch)."""

    def __init__(self, folder: str, name: str | None = None):
        self.folder = folder
        self.mine = f"{os.getpid() if name is None else name}{LOG_SUFFIX}"
        self.peers: dict[str, _Peer] = {}
        self.calls = 0
        self.waiting: list[tuple] = []
        self.fd: int | None = None          # this worker's own log, once written
        outcomes.NOTING = True

    def take(self) -> int:
        """Keep what the other workers wrote since the last call; the number of outcomes taken.

        The folder is looked at for new logs at every call until one is found, then at
        every :data:`LOOK_EVERY` th call only: a third worker that starts late is heard
        from a little later."""
        if not self.peers or self.calls % LOOK_EVERY == 0:
            try:
                names = [e.name for e in os.scandir(self.folder)]
            except OSError:
                names = []
            for name in names:
                if name not in self.peers and name != self.mine and name.endswith(LOG_SUFFIX):
                    self.peers[name] = _Peer(os.path.join(self.folder, name))
        self.calls += 1
        taken = 0
        for peer in self.peers.values():
            for frame in peer.frames():
                try:
                    records = pickle.loads(frame)
                except (pickle.UnpicklingError, EOFError, AttributeError, ImportError,
                        ValueError, TypeError):
                    continue
                outcomes.adopt(records)
                taken += len(records)
        return taken

    def give(self, force: bool = False) -> None:
        """Append the outcomes learnt since the last call (once there are :data:`GIVE_AT`, or *force*)."""
        self.waiting += outcomes.take_new()
        if not self.waiting or (len(self.waiting) < GIVE_AT and not force):
            return
        payload = pickle.dumps(self.waiting, protocol=pickle.HIGHEST_PROTOCOL)
        self.waiting = []
        try:
            if self.fd is None:         # kept open: a worker gives after most of its files
                self.fd = os.open(os.path.join(self.folder, self.mine),
                                  os.O_WRONLY | os.O_APPEND | os.O_CREAT | getattr(os, "O_BINARY", 0),
                                  0o600)
            os.write(self.fd, _HEAD.pack(len(payload)) + payload)
        except OSError:
            pass

    def close(self) -> None:
        """Close the other workers' logs (a worker's process ending closes them too)."""
        for peer in self.peers.values():
            peer.close()
        if self.fd is not None:
            os.close(self.fd)
            self.fd = None
