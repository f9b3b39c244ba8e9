import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { render, screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { type LocateSensor, parseLocateCsv } from '../../src/io/locate-csv';
import type { Vec3 } from '../../src/physics';
import { DEMO_LOCATE_NAME } from '../../src/ui/locate/load-demo';
import type { LocateOptionsInput } from '../../src/ui/locate/locate-inputs';
import { LocateView } from '../../src/ui/locate/LocateView';
import { useSekundoStore } from '../../src/ui/store';
import { lastDraw } from './fake-plotly';

/** The demo sensors, read from public/ as the page reads them (tests run from the repository root). */
export const DEMO_SENSORS: readonly LocateSensor[] = parseLocateCsv(readFileSync(join(process.cwd(), 'public/demo-locate.csv'))).sensors;

export const store = () => useSekundoStore.getState();

/** Opens the view on `sensors` (the demo by default) without fetching anything. */
export async function openLocate(sensors: readonly LocateSensor[] = DEMO_SENSORS, options?: Partial<LocateOptionsInput>) {
  store().loadLocateSensors(sensors, { kind: 'demo', name: DEMO_LOCATE_NAME, note: null }, options);
  const user = userEvent.setup();
  render(<LocateView />);
  await waitFor(() => expect(lastDraw('locate-projection-1')).toBeDefined());
  return { user };
}

/** The located source's x, y, z as the summary shows them (text, mm). */
export function shownSource(): string[] {
  return ['x', 'y', 'z'].map((k) => screen.getByTestId(`locate-source-${k}`).textContent ?? '');
}

/** The drawn source in a projection, mm, or null. */
export function drawnSource(chartId = 'locate-projection-1'): [number, number] | null {
  const trace = lastDraw(chartId)?.data.find((t) => t.name === 'located source');
  const x = trace?.x[0];
  const y = trace?.y[0];
  return typeof x === 'number' && typeof y === 'number' ? [x, y] : null;
}

/** Arrival times at `sensors` from a source, on a clock starting `t0` before emission. */
export function arrivalsFrom(source: Vec3, positions: readonly Vec3[], speed: number, t0 = 2e-4): LocateSensor[] {
  return positions.map((p, i) => ({
    label: `P${i + 1}`,
    position_m: p,
    arrival_s: t0 + Math.hypot(p[0] - source[0], p[1] - source[1], p[2] - source[2]) / speed,
    arrivalSd_s: 1e-5,
  }));
}
