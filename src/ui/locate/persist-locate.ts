/**
 * Nothing loaded is lost: the sensors of the source-location view (a CSV the person opened, the
 * demo, their edits) and its fit options are kept in the browser as they change, like the plan's
 * autosave, and restored on the next visit instead of the demo. Kept options are checked field by
 * field; a value that is missing or out of range takes its default. Storage that is full, disabled
 * or damaged costs only the keeping: the view works on, and says so once.
 */
import { LOCATE_POSITION_RANGE_M } from '../../io/locate-csv';
import { type KeptLocate, loadLocateInputs, saveLocateInputs } from '../../io/locate-storage';
import { browserStore, type KeyValueStore } from '../../io/workspace-storage';
import { LOCATE_SPEED_RANGE_M_S, MODEL_MIN_K, T_LAMBDA_K, type Vec3 } from '../../physics';
import { useSekundoStore } from '../store';
import { DEFAULT_LOCATE_OPTIONS, type LocateOptionsInput, type SurfaceKind } from './locate-inputs';

/** What the view says, once, when its sensors cannot be kept. */
export const LOCATE_NOT_KEPT = 'The sensors cannot be kept in this browser (its storage is full or turned off): save them as CSV to keep them.';

const num = (x: unknown, lo: number, hi: number, aboveLo = false): number | undefined =>
  typeof x === 'number' && Number.isFinite(x) && x <= hi && (aboveLo ? x > lo : x >= lo) ? x : undefined;
const bool = (x: unknown): boolean | undefined => (typeof x === 'boolean' ? x : undefined);
const vec = (x: unknown, lo: number = LOCATE_POSITION_RANGE_M[0], hi: number = LOCATE_POSITION_RANGE_M[1]): Vec3 | undefined =>
  Array.isArray(x) && x.length === 3 && x.every((v) => num(v, lo, hi) !== undefined) ? ([x[0], x[1], x[2]] as Vec3) : undefined;
const direction = (x: unknown): Vec3 | undefined => {
  const v = vec(x, -1e6, 1e6);
  return v && Math.hypot(...v) > 0 ? v : undefined;
};
const SURFACES: readonly SurfaceKind[] = ['none', 'sphere', 'cylinder', 'plane'];

/** Kept options, each field checked; anything missing or out of range takes the default. */
export function checkedLocateOptions(raw: Readonly<Record<string, unknown>>): LocateOptionsInput {
  const d = DEFAULT_LOCATE_OPTIONS;
  const obj = (x: unknown): Record<string, unknown> => (typeof x === 'object' && x !== null ? (x as Record<string, unknown>) : {});
  const sphere = obj(raw.sphere);
  const cylinder = obj(raw.cylinder);
  const plane = obj(raw.plane);
  const region = obj(raw.sensorRegion);
  const min_m = vec(region.min_m) ?? d.sensorRegion.min_m;
  const max_m = vec(region.max_m) ?? d.sensorRegion.max_m;
  const regionOk = [0, 1, 2].every((k) => (min_m[k as 0] as number) < (max_m[k as 0] as number));
  return {
    speedMode: raw.speedMode === 'speed' || raw.speedMode === 'temperature' ? raw.speedMode : d.speedMode,
    temperature_K: num(raw.temperature_K, MODEL_MIN_K, T_LAMBDA_K) ?? d.temperature_K,
    speed_m_s: num(raw.speed_m_s, LOCATE_SPEED_RANGE_M_S[0], LOCATE_SPEED_RANGE_M_S[1]) ?? d.speed_m_s,
    speedPrior: bool(raw.speedPrior) ?? d.speedPrior,
    temperatureSd_K: num(raw.temperatureSd_K, 0, 1) ?? d.temperatureSd_K,
    fitSpeed: bool(raw.fitSpeed) ?? d.fitSpeed,
    arrivalSd_s: num(raw.arrivalSd_s, 0, 10, true) ?? d.arrivalSd_s,
    dropOutliers: bool(raw.dropOutliers) ?? d.dropOutliers,
    surface: SURFACES.includes(raw.surface as SurfaceKind) ? (raw.surface as SurfaceKind) : d.surface,
    sphere: { centre_m: vec(sphere.centre_m) ?? d.sphere.centre_m, radius_m: num(sphere.radius_m, 0, 100, true) ?? d.sphere.radius_m },
    cylinder: {
      axisPoint_m: vec(cylinder.axisPoint_m) ?? d.cylinder.axisPoint_m,
      axisDirection: direction(cylinder.axisDirection) ?? d.cylinder.axisDirection,
      radius_m: num(cylinder.radius_m, 0, 100, true) ?? d.cylinder.radius_m,
    },
    plane: { point_m: vec(plane.point_m) ?? d.plane.point_m, normal: direction(plane.normal) ?? d.plane.normal },
    sensorRegion: regionOk ? { on: bool(region.on) ?? false, min_m, max_m } : d.sensorRegion,
  };
}

function keptOf(state: ReturnType<typeof useSekundoStore.getState>): KeptLocate {
  return {
    sensors: state.locateRows.map(({ key: _key, ...sensor }) => sensor),
    origin: { kind: state.locateOrigin.kind, name: state.locateOrigin.name },
    options: { ...state.locateOptions },
  };
}

/**
 * Restores the kept sensors and options into the store (the view then opens them instead of the
 * demo) and keeps every later change. Returns a function that stops keeping (tests).
 */
export function startLocatePersistence(store: KeyValueStore | null = browserStore()): () => void {
  const api = useSekundoStore;
  const kept = loadLocateInputs(store);
  if (!kept.ok) api.setState({ locateErrors: { ...api.getState().locateErrors, rows: kept.message } });
  else if (kept.value && api.getState().locateStatus === 'idle') {
    const { sensors, origin, options } = kept.value;
    api.getState().loadLocateSensors(sensors, { ...origin, note: `Kept from your last visit (${origin.name}).` }, checkedLocateOptions(options));
  }
  let last = '';
  let told = false;
  return api.subscribe((state) => {
    if (state.locateStatus !== 'ready') return;
    const record = keptOf(state);
    const text = JSON.stringify(record);
    if (text === last) return;
    last = text;
    const result = saveLocateInputs(store, record);
    if (!result.ok && !told && store !== null) {
      told = true;
      api.setState({ locateErrors: { ...api.getState().locateErrors, rows: LOCATE_NOT_KEPT } });
    }
  });
}
