import type { StateCreator } from 'zustand';
import type { LockinCsv, SweepCsv } from '../../io/resonance-csv';
import type { TangleGeometry } from '../../physics';

/*
 * The resonator view's inputs: the resonator and bath (plan), how a sweep is read (mode number or a
 * neighbouring resonance, a vapour-pressure reading), and the files read (sweep, vortex-free
 * reference, lock-in record) as parsed columns. Results (modes, fits, temperatures, line densities,
 * L(t)) are derived from these with the kernel (use-resonator.ts), never stored.
 */

export interface ResonatorInputs {
  /** Plate gap as measured, m (warm when a spacer is chosen, else cold). */
  gap_m: number;
  gapSd_m: number;
  /** Spacer material the gap was measured warm on; null: the gap is cold. */
  spacerId: string | null;
  plateDiameter_m: number | null;
  /** Bath temperature, K: the plan's, and the expected one that chooses among candidates. */
  temperature_K: number;
  modes: number;
  targetSd_K: number | null;
  width0_Hz: number | null;
  amplitudeNoise: number | null;
  geometry: TangleGeometry;
  /** Mode number of the swept resonance; null: from `neighbour_Hz`, or none. */
  mode: number | null;
  /** Centre of the neighbouring resonance, Hz (gives n when `mode` is null). */
  neighbour_Hz: number | null;
  /** Bath vapour pressure, Pa: chooses the candidate and sets T for B(T). */
  pressure_Pa: number | null;
  /** Drive frequency of the lock-in record, Hz; null: the reference's centre. */
  drive_Hz: number | null;
}

export type ResonatorFileRole = 'sweep' | 'reference' | 'lockin';

export interface ResonatorFile<T> {
  name: string;
  data: T;
}

export interface ResonatorSlice {
  resonatorInputs: ResonatorInputs;
  resonatorSweep: ResonatorFile<SweepCsv> | null;
  resonatorReference: ResonatorFile<SweepCsv> | null;
  resonatorLockin: ResonatorFile<LockinCsv> | null;
  /** Why a file was refused (one line naming the file, line and column), per role; null when fine. */
  resonatorFileErrors: Readonly<Record<ResonatorFileRole, string | null>>;
  /** 'idle' until the view first opens, 'loading' while the demo is fetched, then 'ready'. */
  resonatorStatus: 'idle' | 'loading' | 'ready';
  /** What the files on screen are ("Kestrel-2 (invented demo)"), or null for the user's own. */
  resonatorOrigin: string | null;
  setResonatorInput: <K extends keyof ResonatorInputs>(key: K, value: ResonatorInputs[K]) => void;
  setResonatorFile: (role: ResonatorFileRole, file: ResonatorFile<SweepCsv> | ResonatorFile<LockinCsv> | null) => void;
  setResonatorFileError: (role: ResonatorFileRole, message: string | null) => void;
  beginResonatorLoad: () => void;
  /** The demo (or nothing) arrived: its inputs and files, and what it is. */
  finishResonatorLoad: (loaded: { inputs?: Partial<ResonatorInputs>; sweep?: ResonatorFile<SweepCsv>; reference?: ResonatorFile<SweepCsv>; lockin?: ResonatorFile<LockinCsv>; origin: string | null; note?: string }) => void;
  /** Why the demo did not load, or null. */
  resonatorNote: string | null;
}

/** A resonator to start from before any demo or file: 2 mm cold gap, 1.8 K, ten modes. */
export const DEFAULT_RESONATOR_INPUTS: ResonatorInputs = {
  gap_m: 0.002,
  gapSd_m: 0,
  spacerId: null,
  plateDiameter_m: null,
  temperature_K: 1.8,
  modes: 10,
  targetSd_K: 1e-5,
  width0_Hz: null,
  amplitudeNoise: null,
  geometry: 'isotropic',
  mode: null,
  neighbour_Hz: null,
  pressure_Pa: null,
  drive_Hz: null,
};

const NO_ERRORS: Readonly<Record<ResonatorFileRole, string | null>> = { sweep: null, reference: null, lockin: null };

export const createResonatorSlice: StateCreator<ResonatorSlice, [], [], ResonatorSlice> = (set, get) => ({
  resonatorInputs: DEFAULT_RESONATOR_INPUTS,
  resonatorSweep: null,
  resonatorReference: null,
  resonatorLockin: null,
  resonatorFileErrors: NO_ERRORS,
  resonatorStatus: 'idle',
  resonatorOrigin: null,
  resonatorNote: null,
  setResonatorInput: (key, value) => set({ resonatorInputs: { ...get().resonatorInputs, [key]: value } }),
  setResonatorFile: (role, file) => {
    const errors = { ...get().resonatorFileErrors, [role]: null };
    if (role === 'sweep') set({ resonatorSweep: file as ResonatorFile<SweepCsv> | null, resonatorFileErrors: errors, resonatorOrigin: null });
    else if (role === 'reference') set({ resonatorReference: file as ResonatorFile<SweepCsv> | null, resonatorFileErrors: errors, resonatorOrigin: null });
    else set({ resonatorLockin: file as ResonatorFile<LockinCsv> | null, resonatorFileErrors: errors, resonatorOrigin: null });
  },
  setResonatorFileError: (role, message) => set({ resonatorFileErrors: { ...get().resonatorFileErrors, [role]: message } }),
  beginResonatorLoad: () => set({ resonatorStatus: 'loading' }),
  finishResonatorLoad: (loaded) =>
    set({
      resonatorStatus: 'ready',
      resonatorInputs: { ...get().resonatorInputs, ...loaded.inputs },
      resonatorSweep: loaded.sweep ?? null,
      resonatorReference: loaded.reference ?? null,
      resonatorLockin: loaded.lockin ?? null,
      resonatorFileErrors: NO_ERRORS,
      resonatorOrigin: loaded.origin,
      resonatorNote: loaded.note ?? null,
    }),
});
