/**
 * Where a followed run's files come from, each as a FolderSource (src/io/folder-watch.ts) that can
 * also open a file: a folder picked with the File System Access API (read-only: the page asks for
 * "read" and has no way to write), or files given at once (dropped, chosen, the demo's). Opening
 * gives a Blob that the trace worker reads exactly as a dropped file.
 */
import type { FolderEntry } from '../../../io/folder-poll';
import type { FolderSource } from '../../../io/folder-watch';

export interface WatchSource extends FolderSource {
  kind: 'folder' | 'demo' | 'files';
  /** The folder's name (or "demo", "dropped files"). */
  name: string;
  /** The file's bytes now; rejects when it has gone. */
  open(name: string): Promise<Blob>;
  /** Time between looks this source asks for (the demo's replay), ms; else the page's setting. */
  interval_ms?: number;
}

/** The parts of a File System Access directory handle the page uses (typed here: not every DOM library has them). */
export interface DirectoryHandleLike {
  readonly kind: 'directory';
  readonly name: string;
  entries(): AsyncIterable<[string, { readonly kind: 'file' | 'directory'; getFile?: () => Promise<File> }]>;
  getFileHandle(name: string): Promise<{ getFile(): Promise<File> }>;
}

interface PickerWindow {
  showDirectoryPicker?: (options?: { mode?: 'read' | 'readwrite'; id?: string }) => Promise<DirectoryHandleLike>;
}

/** Whether this browser can follow a folder (it has the directory picker of the File System Access API). */
export function canFollowFolders(): boolean {
  return typeof window !== 'undefined' && typeof (window as unknown as PickerWindow).showDirectoryPicker === 'function';
}

/** Asks the person for a folder, read-only; null when they cancel. */
export async function pickFolder(): Promise<DirectoryHandleLike | null> {
  const picker = (window as unknown as PickerWindow).showDirectoryPicker;
  if (!picker) return null;
  try {
    return await picker.call(window, { mode: 'read', id: 'sekundo-watch' });
  } catch (error) {
    if (error instanceof DOMException && error.name === 'AbortError') return null;
    throw error;
  }
}

/** A picked folder: its files (not sub-folders) whose names match, listed with size and time. */
export function folderSource(handle: DirectoryHandleLike, matches: (name: string) => boolean): WatchSource {
  return {
    kind: 'folder',
    name: handle.name,
    async list() {
      const out: FolderEntry[] = [];
      for await (const [name, entry] of handle.entries()) {
        if (entry.kind !== 'file' || !matches(name)) continue;
        try {
          // The listing's own handle when it has one (one call per file and look, not two).
          const file = entry.getFile ? await entry.getFile() : await (await handle.getFileHandle(name)).getFile();
          out.push({ name, size_bytes: file.size, modified_ms: file.lastModified });
        } catch {
          // Gone (or locked) between the listing and the look: the next look says so.
        }
      }
      return out;
    },
    async open(name) {
      return (await handle.getFileHandle(name)).getFile();
    },
  };
}

/** Files given all at once (dropped or chosen where no folder can be followed): each is read once. */
export function filesSource(files: readonly File[], name = 'dropped files'): WatchSource {
  const byName = new Map(files.map((f) => [f.name, f]));
  return {
    kind: 'files',
    name,
    async list() {
      return [...byName.values()].map((f) => ({ name: f.name, size_bytes: f.size, modified_ms: f.lastModified }));
    },
    async open(n) {
      const f = byName.get(n);
      if (!f) throw new Error(`${n} is no longer there`);
      return f;
    },
  };
}
