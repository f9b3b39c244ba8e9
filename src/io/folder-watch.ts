/**
 * The loop that follows a folder: look, hand each event to the caller (who reads the ready files,
 * one at a time), wait, look again — until stopped. The folder, the clock and the reading are
 * passed in (node's fs and timers in `sekundo watch`, a folder handle in the page, fakes in tests);
 * the rules for what to read are FolderPoller's (folder-poll.ts).
 */
import { type FolderEntry, FolderPoller, type PollEvent } from './folder-poll';

/** A folder that can be listed (names, sizes, modification times). */
export interface FolderSource {
  list(): Promise<FolderEntry[]>;
}

/** Waiting between looks; resolves early (without error) when the signal aborts. */
export type Sleep = (ms: number, signal: AbortSignal) => Promise<void>;

/** Least and most time between two looks at a folder, ms (a looked-at network share needs no more than this). */
export const WATCH_INTERVAL_RANGE_MS = [100, 600_000] as const;

/** Waiting with real timers. */
export const realSleep: Sleep = (ms, signal) =>
  new Promise((resolve) => {
    if (signal.aborted) return resolve();
    const timer = setTimeout(done, ms);
    function done() {
      clearTimeout(timer);
      signal.removeEventListener('abort', done);
      resolve();
    }
    signal.addEventListener('abort', done);
  });

export interface FollowOptions {
  source: FolderSource;
  poller: FolderPoller;
  interval_ms: number;
  sleep: Sleep;
  signal: AbortSignal;
  /** Called for each event in order and awaited, so files are read one at a time. */
  onEvent: (event: PollEvent) => Promise<void> | void;
  /** The folder could not be listed this time; the loop goes on and looks again. */
  onListError?: (error: unknown) => void;
  /** While true the folder is not looked at (paused); the loop keeps waiting. */
  paused?: () => boolean;
  /** Look twice (one interval apart), handle what is ready, and return. */
  once?: boolean;
}

/** Follows the folder until the signal aborts (or after two looks with `once`). */
export async function followFolder(o: FollowOptions): Promise<void> {
  let looks = 0;
  while (!o.signal.aborted) {
    if (!o.paused?.()) {
      let listing: FolderEntry[] | null = null;
      try {
        listing = await o.source.list();
      } catch (error) {
        o.onListError?.(error);
      }
      if (listing !== null) {
        looks += 1;
        for (const event of o.poller.poll(listing)) {
          if (o.signal.aborted) return;
          await o.onEvent(event);
        }
      }
      if (o.once && looks >= 2) return;
    }
    await o.sleep(o.interval_ms, o.signal);
  }
}

export { FolderPoller };
