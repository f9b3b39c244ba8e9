/**
 * Keeping the source-location view's sensors and fit options in the browser, like the plan's
 * autosave: one record under its own key, the sensors as the same CSV the view reads and writes
 * (so they are validated on the way back in by the same reader), the options as JSON checked field
 * by field. Nothing here throws: storage that is full, disabled or holds a damaged record gives a
 * message, and the view starts from the demo instead.
 */
import { type LocateSensor, locateSensorsToCsv, parseLocateCsv } from './locate-csv';
import type { KeyValueStore, StoreResult } from './workspace-storage';

/** Storage key of the kept location inputs. */
export const LOCATE_STORAGE_KEY = 'sekundo.locate';
const FORMAT = 'sekundo-locate-inputs';
const VERSION = 1;

/** Where the sensors came from, as the view names it. */
export interface KeptOrigin {
  kind: 'demo' | 'built-in' | 'file';
  name: string;
}

/** What is kept: the sensors, where they came from, and the fit options (as an object the view checks). */
export interface KeptLocate {
  sensors: LocateSensor[];
  origin: KeptOrigin;
  options: Record<string, unknown>;
}

/** Writes the location inputs; a message when the browser keeps nothing or the storage is full. */
export function saveLocateInputs(store: KeyValueStore | null, kept: KeptLocate): StoreResult {
  if (store === null) return { ok: false, message: 'this browser keeps no data' };
  const record = { format: FORMAT, version: VERSION, origin: kept.origin, sensorsCsv: locateSensorsToCsv(kept.sensors), options: kept.options };
  try {
    store.setItem(LOCATE_STORAGE_KEY, JSON.stringify(record));
    return { ok: true, value: undefined };
  } catch (error) {
    return { ok: false, message: `the sensors could not be kept (${error instanceof Error ? error.message : String(error)})` };
  }
}

/** Reads the kept location inputs: null when there are none; a message when the record is damaged (it is then ignored). */
export function loadLocateInputs(store: KeyValueStore | null): StoreResult<KeptLocate | null> {
  if (store === null) return { ok: true, value: null };
  let text: string | null;
  try {
    text = store.getItem(LOCATE_STORAGE_KEY);
  } catch {
    return { ok: true, value: null };
  }
  if (text === null) return { ok: true, value: null };
  try {
    const record: unknown = JSON.parse(text);
    if (typeof record !== 'object' || record === null) throw new Error('not a record');
    const r = record as Record<string, unknown>;
    if (r.format !== FORMAT || r.version !== VERSION) throw new Error('not a kept sensor table of this version');
    if (typeof r.sensorsCsv !== 'string') throw new Error('no sensor table');
    const { sensors } = parseLocateCsv(r.sensorsCsv);
    const o = r.origin as Record<string, unknown> | undefined;
    const kind = o?.kind === 'demo' || o?.kind === 'built-in' || o?.kind === 'file' ? o.kind : 'file';
    const name = typeof o?.name === 'string' ? o.name.slice(0, 200) : 'kept sensors';
    const options = typeof r.options === 'object' && r.options !== null ? (r.options as Record<string, unknown>) : {};
    return { ok: true, value: { sensors, origin: { kind, name }, options } };
  } catch (error) {
    return { ok: false, message: `the sensors kept from the last visit could not be read (${error instanceof Error ? error.message : String(error)}); the view starts from the demo` };
  }
}
