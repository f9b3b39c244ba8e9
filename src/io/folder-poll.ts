/**
 * Following a folder of traces while they are written (the page's "Follow a folder" and
 * `sekundo watch`): which files to read after each look at the folder. Pure bookkeeping over
 * listings; the listing and the reading are the caller's (node's fs, a browser folder handle, a
 * test's fake), so the same rules hold everywhere:
 *
 *  - A file is read only once its size and modification time are the same in two looks in a row
 *    (a file still being written keeps growing between looks); an empty file is never read.
 *  - A file that changes after it was read (it grew) is read again once it is stable again.
 *  - A file renamed after it was read is not read again: a new name with the identity of a file
 *    that has just gone (its inode where the system gives one, else its size and modification time)
 *    is the same file under a new name.
 *  - A file that goes away is forgotten.
 *  - Files that settle in the same look are read oldest first (modification time, then name).
 */

/** One file in a listing. */
export interface FolderEntry {
  /** The file's name inside the folder. */
  name: string;
  size_bytes: number;
  /** Last modification, ms since 1970-01-01 UTC. */
  modified_ms: number;
  /** What stays the same when the file is renamed (device and inode), where the system gives it. */
  identity?: string;
}

export type PollEvent =
  /** Read this file now (`again`: it was read before and has changed since). */
  | { kind: 'ready'; entry: FolderEntry; again: boolean }
  /** A file read before now has another name; it is not read again. */
  | { kind: 'renamed'; from: string; to: string }
  /** A file that was listed before has gone (`read`: whether it had been read). */
  | { kind: 'vanished'; name: string; read: boolean };

interface Known {
  entry: FolderEntry;
  /** Size and time when it was read (or handed out to be read), or null. */
  readAs: { size_bytes: number; modified_ms: number } | null;
}

function sameState(a: { size_bytes: number; modified_ms: number }, b: { size_bytes: number; modified_ms: number }): boolean {
  return a.size_bytes === b.size_bytes && a.modified_ms === b.modified_ms;
}

function identityOf(e: FolderEntry): string {
  return e.identity ?? `${e.size_bytes}:${e.modified_ms}`;
}

/** The bookkeeping of one followed folder; `poll` takes each listing in turn. */
export class FolderPoller {
  private readonly known = new Map<string, Known>();

  /** @param matches which file names to follow (see compileWatchPattern). */
  constructor(private readonly matches: (name: string) => boolean) {}

  /**
   * Takes a new listing of the folder and says what to do. A `ready` file counts as read from
   * here on (a file that then cannot be read is not tried again until it changes).
   */
  poll(listing: readonly FolderEntry[]): PollEvent[] {
    const events: PollEvent[] = [];
    const listed = new Map<string, FolderEntry>();
    for (const e of listing) if (this.matches(e.name) && !listed.has(e.name)) listed.set(e.name, e);
    // Gone since the last look: kept by identity for a moment, to recognise a rename.
    const gone = new Map<string, Known & { name: string }>();
    for (const [name, k] of this.known) {
      if (listed.has(name)) continue;
      this.known.delete(name);
      gone.set(identityOf(k.entry), { ...k, name });
    }
    for (const [name, entry] of listed) {
      const k = this.known.get(name);
      if (!k) {
        const before = gone.get(identityOf(entry));
        if (before?.readAs && sameState(before.readAs, entry)) {
          gone.delete(identityOf(entry));
          this.known.set(name, { entry, readAs: before.readAs });
          events.push({ kind: 'renamed', from: before.name, to: name });
        } else this.known.set(name, { entry, readAs: null });
        continue;
      }
      const stable = sameState(k.entry, entry);
      k.entry = entry;
      if (!stable || entry.size_bytes === 0) continue;
      if (k.readAs && sameState(k.readAs, entry)) continue;
      events.push({ kind: 'ready', entry, again: k.readAs !== null });
      k.readAs = { size_bytes: entry.size_bytes, modified_ms: entry.modified_ms };
    }
    for (const g of gone.values()) events.push({ kind: 'vanished', name: g.name, read: g.readAs !== null });
    // Files that settled in the same look are read oldest first (then by name, shot-2 before shot-10).
    const byAge = (a: PollEvent, b: PollEvent) =>
      a.kind === 'ready' && b.kind === 'ready'
        ? a.entry.modified_ms - b.entry.modified_ms || a.entry.name.localeCompare(b.entry.name, undefined, { numeric: true })
        : 0;
    return [...events.filter((e) => e.kind !== 'ready'), ...events.filter((e) => e.kind === 'ready').sort(byAge)];
  }

  /** Names listed but not read in their present state (still being written, or waiting for a second look). */
  waiting(): string[] {
    const out: string[] = [];
    for (const [name, k] of this.known) if (!k.readAs || !sameState(k.readAs, k.entry)) out.push(name);
    return out;
  }

  /** Files followed now. */
  get size(): number {
    return this.known.size;
  }
}
