import { parseLocateCsv, type LocateSensor } from '../../io/locate-csv';
import type { LocateOrigin } from '../store';
import { BUILT_IN_SENSORS } from './locate-inputs';

/** The demo beside the page (relative, so the built page works from any folder). */
export const DEMO_LOCATE_URL = 'demo-locate.csv';
/** What the view calls the demo: an invented cavity on an invented frame. */
export const DEMO_LOCATE_NAME = 'Linnet-1 quench (invented demo)';

/**
 * Fetches and reads the demo sensors. Never throws: when they cannot be had, the built-in layout
 * (no readings) comes back with a note saying why.
 */
export async function loadLocateDemo(fetchText: (url: string) => Promise<Response> = (url) => fetch(url)): Promise<{ sensors: readonly LocateSensor[]; origin: LocateOrigin }> {
  const fallback = (why: string) => ({
    sensors: BUILT_IN_SENSORS,
    origin: { kind: 'built-in', name: 'built-in layout', note: `The demo could not be loaded (${why}), so the view starts from a built-in layout without readings.` } as const,
  });
  try {
    const response = await fetchText(DEMO_LOCATE_URL);
    if (!response.ok) return fallback(`the server answered ${response.status}`);
    const { sensors } = parseLocateCsv(new Uint8Array(await response.arrayBuffer()));
    return { sensors, origin: { kind: 'demo', name: DEMO_LOCATE_NAME, note: null } };
  } catch (error) {
    return fallback(error instanceof Error ? error.message : String(error));
  }
}
