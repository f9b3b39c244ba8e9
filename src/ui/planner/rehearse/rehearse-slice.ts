import type { StateCreator } from 'zustand';
import type { PlanFile } from '../../../io/plan-file';
import { DEFAULT_REHEARSAL_OPTIONS, type RehearsalOptions, type RehearsalResult } from '../../../io/rehearse-run';

/*
 * The planner's rehearsal: its settings (picker, trials, seed, digitiser resolution, pickup), the
 * state of the last run (progress, its result and the plan and settings it ran on, so the view can
 * say when they are no longer the plan's), which sensor the chart shows, and the export's choices.
 * The run itself happens in a worker (rehearse-engine.ts); this slice only holds what it reports.
 */

export type RehearseStatus = 'idle' | 'running' | 'done' | 'failed' | 'cancelled';

export interface RehearseRun {
  status: RehearseStatus;
  done: number;
  total: number;
  result: RehearsalResult | null;
  /** The plan and settings of the run shown (the result belongs to them). */
  plan: PlanFile | null;
  options: RehearsalOptions | null;
  /** Why the run failed, in one line. */
  message: string | null;
}

export const IDLE_REHEARSAL: RehearseRun = { status: 'idle', done: 0, total: 0, result: null, plan: null, options: null, message: null };

/** Trials offered for download at once, at most (each is one file of the whole record). */
export const MAX_FILES_AT_ONCE = 20;

export interface RehearseSlice {
  rehearseOptions: RehearsalOptions;
  rehearseRun: RehearseRun;
  /** Sensor id the chart shows; null: the first. */
  rehearseChartSensor: string | null;
  /** Trial offered for download (1-based), and how many files "Download the first …" writes. */
  rehearseExportTrial: number;
  rehearseExportCount: number;
  setRehearseOptions: (patch: Partial<RehearsalOptions>) => void;
  setRehearseRun: (patch: Partial<RehearseRun>) => void;
  setRehearseChartSensor: (id: string | null) => void;
  setRehearseExport: (patch: { trial?: number; count?: number }) => void;
}

export const createRehearseSlice: StateCreator<RehearseSlice, [], [], RehearseSlice> = (set, get) => ({
  rehearseOptions: DEFAULT_REHEARSAL_OPTIONS,
  rehearseRun: IDLE_REHEARSAL,
  rehearseChartSensor: null,
  rehearseExportTrial: 1,
  rehearseExportCount: 3,
  setRehearseOptions: (patch) => set({ rehearseOptions: { ...get().rehearseOptions, ...patch } }),
  setRehearseRun: (patch) => set({ rehearseRun: { ...get().rehearseRun, ...patch } }),
  setRehearseChartSensor: (id) => set({ rehearseChartSensor: id }),
  setRehearseExport: (patch) =>
    set({ rehearseExportTrial: patch.trial ?? get().rehearseExportTrial, rehearseExportCount: patch.count ?? get().rehearseExportCount }),
});
