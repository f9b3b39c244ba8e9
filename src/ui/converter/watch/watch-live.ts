/**
 * The followed run's data, outside the zustand store (it grows with every file): the series
 * (src/io/watch-series.ts: a few numbers per file, never the samples), the files that could not be
 * read with their messages, what is still being written, when the folder was last looked at, and
 * the channel names seen. Components read it through useWatchLive(); a burst of files (a folder
 * that already holds thousands) redraws at most a few times a second.
 */
import { useSyncExternalStore } from 'react';
import { type WatchReading, type WatchRow, WatchSeries, type WatchSettings } from '../../../io/watch-series';

/** Most unreadable files listed by name (the count goes on past it). */
export const WATCH_FAILED_SHOWN = 200;
/** Least time between two redraws while files pour in, ms. */
const NOTIFY_MS = 250;

export interface WatchFailure {
  name: string;
  message: string;
}

export interface WatchLiveSnapshot {
  /** Changes whenever anything below changes. */
  version: number;
  rows: readonly WatchRow[];
  failed: readonly WatchFailure[];
  failedCount: number;
  /** Files listed but not read yet (still being written, or waiting for a second look). */
  waiting: readonly string[];
  lastLook_ms: number | null;
  /** The folder could not be listed at the last look (the run goes on), or null. */
  listError: string | null;
  channels: readonly string[];
}

const listeners = new Set<() => void>();
let series: WatchSeries | null = null;
let settings: WatchSettings | null = null;
let snapshot: WatchLiveSnapshot = { version: 0, rows: [], failed: [], failedCount: 0, waiting: [], lastLook_ms: null, listError: null, channels: [] };
let timer: ReturnType<typeof setTimeout> | null = null;
const afterNotify = new Set<(s: WatchLiveSnapshot) => void>();

function publish(): void {
  timer = null;
  snapshot = { ...snapshot, version: snapshot.version + 1, rows: series ? [...series.rows] : [] };
  for (const l of listeners) l();
  for (const f of afterNotify) f(snapshot);
}

/** Schedules a redraw (at most one per NOTIFY_MS); `now` redraws at once. */
function changed(now = false): void {
  if (now) {
    if (timer !== null) clearTimeout(timer);
    publish();
    return;
  }
  timer ??= setTimeout(publish, NOTIFY_MS);
}

export const watchLive = {
  subscribe(listener: () => void): () => void {
    listeners.add(listener);
    return () => listeners.delete(listener);
  },
  get(): WatchLiveSnapshot {
    return snapshot;
  },
  /** Called after each redraw with the new snapshot (the alarms, the page title). */
  onPublish(f: (s: WatchLiveSnapshot) => void): () => void {
    afterNotify.add(f);
    return () => afterNotify.delete(f);
  },
  /** Distance, offset and start rule: the whole series is built again with them. */
  configure(next: WatchSettings): void {
    if (settings && JSON.stringify(settings) === JSON.stringify(next)) return;
    settings = next;
    if (series) {
      series.configure(next);
      changed(true);
    }
  },
  /** Adds a file read (or replaces it, read again after it grew). */
  add(reading: WatchReading, again: boolean, channels: readonly string[]): void {
    if (!settings) throw new Error('watchLive.configure must come first');
    series ??= new WatchSeries(settings);
    if (!(again && series.replace(reading))) series.add(reading);
    if (channels.some((c) => !snapshot.channels.includes(c))) snapshot = { ...snapshot, channels: [...new Set([...snapshot.channels, ...channels])] };
    changed();
  },
  /** Channel names of a file read (offered in the picker card even when its pick fails). */
  seen(channels: readonly string[]): void {
    if (channels.every((c) => snapshot.channels.includes(c))) return;
    snapshot = { ...snapshot, channels: [...new Set([...snapshot.channels, ...channels])] };
    changed();
  },
  rename(from: string, to: string): void {
    series?.rename(from, to);
    changed();
  },
  fail(name: string, message: string): void {
    const failed = [...snapshot.failed, { name, message }];
    snapshot = { ...snapshot, failed: failed.length > WATCH_FAILED_SHOWN ? failed.slice(-WATCH_FAILED_SHOWN) : failed, failedCount: snapshot.failedCount + 1 };
    changed();
  },
  looked(waiting: readonly string[], listError: string | null, at_ms: number): void {
    snapshot = { ...snapshot, waiting, listError, lastLook_ms: at_ms };
    changed();
  },
  /** Forgets the run's data (a new folder, "Start over"). */
  clear(): void {
    series = null;
    snapshot = { version: snapshot.version, rows: [], failed: [], failedCount: 0, waiting: [], lastLook_ms: null, listError: null, channels: [] };
    changed(true);
  },
  /** Redraws now (tests, the end of a run). */
  flush(): void {
    changed(true);
  },
};

/** The run's data for a component. */
export function useWatchLive(): WatchLiveSnapshot {
  return useSyncExternalStore(watchLive.subscribe, watchLive.get);
}
