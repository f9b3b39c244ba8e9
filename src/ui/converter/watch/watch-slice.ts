import type { StateCreator } from 'zustand';
import { DEFAULT_WATCH_PATTERN } from '../../../io/watch-pattern';

/*
 * "Follow a folder": the inputs of a followed run — which files (pattern), how often to look, the
 * alarms the person chose, whether a sound goes with them — and the run's state (following,
 * paused). The series itself (a few numbers per file read) is data read from the folder, kept by
 * watch-live.ts outside the store, so a run of 10 000 files does not copy arrays on every file.
 */

export type WatchStatus = 'idle' | 'running' | 'paused';
export type WatchSourceKind = 'folder' | 'demo' | 'files';

/** The alarm inputs (SI, except the rate, in its own unit: mK per minute over a window of minutes). */
export interface WatchAlarmInputs {
  bandOn: boolean;
  low_K: number;
  high_K: number;
  rateOn: boolean;
  rate_mK_min: number;
  window_min: number;
  sound: boolean;
}

export interface WatchSlice {
  watchStatus: WatchStatus;
  /** What is followed: a folder's name, the demo, or dropped files; null before a run. */
  watchSource: { kind: WatchSourceKind; name: string } | null;
  watchPattern: string;
  /** Time between two looks at the folder, s. */
  watchInterval_s: number;
  watchAlarms: WatchAlarmInputs;
  /** One line for the person: why a folder cannot be followed here, or what went wrong starting. */
  watchNotice: string | null;

  setWatchStatus: (status: WatchStatus) => void;
  setWatchSource: (source: { kind: WatchSourceKind; name: string } | null) => void;
  setWatchPattern: (pattern: string) => void;
  setWatchInterval: (interval_s: number) => void;
  setWatchAlarms: (change: Partial<WatchAlarmInputs>) => void;
  setWatchNotice: (notice: string | null) => void;
}

/** Defaults: a band of ±5 mK around 1.8 K and 1 mK/min over 5 min, both off until ticked. Common practice, no source. */
export const DEFAULT_WATCH_ALARMS: WatchAlarmInputs = { bandOn: false, low_K: 1.795, high_K: 1.805, rateOn: false, rate_mK_min: 1, window_min: 5, sound: false };

/** Time between looks when a run starts, s. */
export const DEFAULT_WATCH_INTERVAL_S = 3;

/** Reads and writes only its own keys, so it needs nothing of the root state (no import of it, no loop). */
export const createWatchSlice: StateCreator<WatchSlice, [], [], WatchSlice> = (set, get) => ({
  watchStatus: 'idle',
  watchSource: null,
  watchPattern: DEFAULT_WATCH_PATTERN,
  watchInterval_s: DEFAULT_WATCH_INTERVAL_S,
  watchAlarms: DEFAULT_WATCH_ALARMS,
  watchNotice: null,

  setWatchStatus: (status) => set({ watchStatus: status }),
  setWatchSource: (source) => set({ watchSource: source }),
  setWatchPattern: (pattern) => set({ watchPattern: pattern }),
  setWatchInterval: (interval_s) => set({ watchInterval_s: interval_s }),
  setWatchAlarms: (change) => set({ watchAlarms: { ...get().watchAlarms, ...change } }),
  setWatchNotice: (notice) => set({ watchNotice: notice }),
});
