import { type LockinCsv, parseLockinCsv, parseSweepCsv, type SweepCsv } from '../../io/resonance-csv';
import type { ResonatorFile, ResonatorInputs } from './resonator-slice';

/** The demo's files beside the page (relative, so the built page works from any folder). */
export const DEMO_RESONATOR_FILES = {
  reference: 'demo-resonator-reference.csv',
  sweep: 'demo-resonator-sweep.csv',
  lockin: 'demo-resonator-lockin.csv',
} as const;

/** What the view calls the demo: an invented resonator of an invented lab. */
export const DEMO_RESONATOR_NAME = 'Kestrel-2 resonator (invented demo)';

/** The demo resonator's settings (tests/support/resonator-demo.ts made its files from the same). */
export const DEMO_RESONATOR_INPUTS: Partial<ResonatorInputs> = {
  gap_m: 0.01,
  gapSd_m: 5e-6,
  spacerId: 'stainless-304',
  plateDiameter_m: 0.025,
  temperature_K: 1.85,
  modes: 12,
  targetSd_K: 1e-5,
  width0_Hz: 2.4,
  amplitudeNoise: 0.005,
  geometry: 'isotropic',
  mode: 8,
  neighbour_Hz: null,
  pressure_Pa: null,
  drive_Hz: null,
};

export interface LoadedDemo {
  inputs?: Partial<ResonatorInputs>;
  sweep?: ResonatorFile<SweepCsv>;
  reference?: ResonatorFile<SweepCsv>;
  lockin?: ResonatorFile<LockinCsv>;
  origin: string | null;
  note?: string;
}

/**
 * Fetches and reads the demo's three files. Never throws: when they cannot be had, the view opens
 * on its defaults without files, with a note saying why.
 */
export async function loadResonatorDemo(fetchText: (url: string) => Promise<Response> = (url) => fetch(url)): Promise<LoadedDemo> {
  try {
    const bytes = async (url: string) => {
      const response = await fetchText(url);
      if (!response.ok) throw new Error(`the server answered ${response.status} for ${url}`);
      return new Uint8Array(await response.arrayBuffer());
    };
    const [reference, sweep, lockin] = await Promise.all([bytes(DEMO_RESONATOR_FILES.reference), bytes(DEMO_RESONATOR_FILES.sweep), bytes(DEMO_RESONATOR_FILES.lockin)]);
    return {
      inputs: DEMO_RESONATOR_INPUTS,
      reference: { name: DEMO_RESONATOR_FILES.reference, data: parseSweepCsv(reference) },
      sweep: { name: DEMO_RESONATOR_FILES.sweep, data: parseSweepCsv(sweep) },
      lockin: { name: DEMO_RESONATOR_FILES.lockin, data: parseLockinCsv(lockin) },
      origin: DEMO_RESONATOR_NAME,
    };
  } catch (error) {
    return { origin: null, note: `The demo could not be loaded (${error instanceof Error ? error.message : String(error)}); the view starts from its defaults without files.` };
  }
}
