/**
 * Keeping plans in the browser: an autosave slot for the plan being edited, named plans (list,
 * save, duplicate, rename, delete with undo) and small preferences. Storage is a plain key–value
 * store (localStorage in the page, an in-memory map in tests). Nothing here throws: storage that
 * is full, disabled or holds a corrupted entry gives a message, and every other plan stays.
 * Entries are our own JSON records, validated on the way in with the plan file's schema.
 */
import { type PlanFile, parsePlanFile, serializePlanFile } from './plan-file';

/** The few methods of Web Storage this module uses. */
export interface KeyValueStore {
  getItem(key: string): string | null;
  setItem(key: string, value: string): void;
  removeItem(key: string): void;
  key(index: number): string | null;
  readonly length: number;
}

export type StoreResult<T = undefined> = { ok: true; value: T } | { ok: false; message: string };

const PREFIX = 'sekundo.';
const AUTOSAVE_KEY = `${PREFIX}autosave`;
const PLAN_PREFIX = `${PREFIX}plan.`;
const PREFS_KEY = `${PREFIX}prefs`;
const RECORD_FORMAT = 'sekundo-saved-plan';
/** Longest plan name. */
export const MAX_PLAN_NAME = 120;

/** A named plan as kept in storage. */
export interface SavedPlan {
  id: string;
  name: string;
  /** ISO 8601 time of the last save. */
  savedAt: string;
  plan: PlanFile;
}

/** What a listing found: the plans that read cleanly, and a message for each entry that did not. */
export interface PlanListing {
  plans: SavedPlan[];
  problems: string[];
}

/** localStorage when the page may use it, else null (disabled, blocked, or not a browser). */
export function browserStore(): KeyValueStore | null {
  try {
    const store = globalThis.localStorage;
    if (!store) return null;
    const probe = `${PREFIX}probe`;
    store.setItem(probe, '1');
    store.removeItem(probe);
    return store;
  } catch {
    return null;
  }
}

/** A store in memory (tests; or when the browser's storage is unavailable). */
export function memoryStore(): KeyValueStore {
  const map = new Map<string, string>();
  return {
    getItem: (k) => map.get(k) ?? null,
    setItem: (k, v) => {
      map.set(k, v);
    },
    removeItem: (k) => {
      map.delete(k);
    },
    key: (i) => [...map.keys()][i] ?? null,
    get length() {
      return map.size;
    },
  };
}

function isQuotaError(error: unknown): boolean {
  return error instanceof Error && (error.name === 'QuotaExceededError' || error.name === 'NS_ERROR_DOM_QUOTA_REACHED' || /quota/i.test(error.message));
}

function writeFailure(error: unknown, what: string): { ok: false; message: string } {
  if (isQuotaError(error)) return { ok: false, message: `The browser's storage is full: ${what} was not saved. Export the plan to a file, or delete saved plans you no longer need.` };
  return { ok: false, message: `The browser refused to store ${what} (${error instanceof Error ? error.message : String(error)}); export the plan to a file to keep it.` };
}

function unavailable(what: string): { ok: false; message: string } {
  return { ok: false, message: `This browser does not let the page keep data (storage is disabled or blocked): ${what} lives only in this tab. Export the plan to a file to keep it.` };
}

/** Saves the plan being edited into the autosave slot. */
export function saveAutosave(store: KeyValueStore | null, plan: PlanFile): StoreResult {
  if (!store) return unavailable('the plan');
  try {
    store.setItem(AUTOSAVE_KEY, serializePlanFile(plan));
    return { ok: true, value: undefined };
  } catch (error) {
    return writeFailure(error, 'the plan');
  }
}

/** The autosaved plan; null value when there is none; a message when it is unreadable. */
export function loadAutosave(store: KeyValueStore | null): StoreResult<PlanFile | null> {
  if (!store) return { ok: true, value: null };
  let text: string | null;
  try {
    text = store.getItem(AUTOSAVE_KEY);
  } catch (error) {
    return { ok: false, message: `The autosaved plan could not be read (${error instanceof Error ? error.message : String(error)}).` };
  }
  if (text === null) return { ok: true, value: null };
  const parsed = parsePlanFile(text);
  if (!parsed.ok) return { ok: false, message: `The autosaved plan is damaged and was not opened (${parsed.errors[0] ?? 'unreadable'}).` };
  return { ok: true, value: parsed.plan };
}

function readRecord(store: KeyValueStore, key: string): StoreResult<SavedPlan> {
  let text: string | null;
  try {
    text = store.getItem(key);
  } catch (error) {
    return { ok: false, message: `${key}: could not be read (${error instanceof Error ? error.message : String(error)})` };
  }
  if (text === null) return { ok: false, message: `${key}: not found` };
  let raw: unknown;
  try {
    raw = JSON.parse(text);
  } catch {
    return { ok: false, message: `A saved plan (${key.slice(PLAN_PREFIX.length)}) is damaged and cannot be read; the other plans are fine.` };
  }
  if (!raw || typeof raw !== 'object' || Array.isArray(raw)) return { ok: false, message: `A saved plan (${key.slice(PLAN_PREFIX.length)}) is not a plan record.` };
  const r = raw as Record<string, unknown>;
  if (r.format !== RECORD_FORMAT || typeof r.id !== 'string' || typeof r.name !== 'string' || typeof r.savedAt !== 'string' || typeof r.plan !== 'string') {
    return { ok: false, message: `A saved plan (${key.slice(PLAN_PREFIX.length)}) is not a plan record this Sekundo wrote.` };
  }
  const parsed = parsePlanFile(r.plan);
  if (!parsed.ok) return { ok: false, message: `The saved plan "${r.name.slice(0, MAX_PLAN_NAME)}" is damaged (${parsed.errors[0] ?? 'unreadable'}); the other plans are fine.` };
  return { ok: true, value: { id: r.id, name: r.name.slice(0, MAX_PLAN_NAME), savedAt: r.savedAt, plan: parsed.plan } };
}

/** Every named plan, newest first, with a message for each damaged entry (which stays untouched). */
export function listPlans(store: KeyValueStore | null): PlanListing {
  if (!store) return { plans: [], problems: [] };
  const keys: string[] = [];
  try {
    for (let i = 0; i < store.length; i++) {
      const k = store.key(i);
      if (k?.startsWith(PLAN_PREFIX)) keys.push(k);
    }
  } catch (error) {
    return { plans: [], problems: [`Saved plans could not be listed (${error instanceof Error ? error.message : String(error)}).`] };
  }
  const plans: SavedPlan[] = [];
  const problems: string[] = [];
  for (const k of keys) {
    const r = readRecord(store, k);
    if (r.ok) plans.push(r.value);
    else problems.push(r.message);
  }
  plans.sort((a, b) => b.savedAt.localeCompare(a.savedAt));
  return { plans, problems };
}

function cleanName(name: string): StoreResult<string> {
  const trimmed = name.replace(/\s+/g, ' ').trim();
  if (trimmed.length === 0) return { ok: false, message: 'Plan name: give a name (1–120 characters).' };
  if (trimmed.length > MAX_PLAN_NAME) return { ok: false, message: `Plan name: at most ${MAX_PLAN_NAME} characters (got ${trimmed.length}).` };
  return { ok: true, value: trimmed };
}

function newId(now: Date): string {
  return `${now.getTime().toString(36)}-${Math.floor(Math.random() * 36 ** 6).toString(36)}`;
}

function writeRecord(store: KeyValueStore, record: SavedPlan): StoreResult<SavedPlan> {
  try {
    store.setItem(
      PLAN_PREFIX + record.id,
      JSON.stringify({ format: RECORD_FORMAT, id: record.id, name: record.name, savedAt: record.savedAt, plan: serializePlanFile(record.plan) }),
    );
    return { ok: true, value: record };
  } catch (error) {
    return writeFailure(error, `"${record.name}"`);
  }
}

/** Saves a plan under a name (a new entry, or over `id` when given). */
export function savePlan(store: KeyValueStore | null, name: string, plan: PlanFile, id?: string, now = new Date()): StoreResult<SavedPlan> {
  if (!store) return unavailable(`"${name}"`);
  const n = cleanName(name);
  if (!n.ok) return n;
  return writeRecord(store, { id: id ?? newId(now), name: n.value, savedAt: now.toISOString(), plan });
}

/** A copy of a saved plan under "<name> (copy)". */
export function duplicatePlan(store: KeyValueStore | null, id: string, now = new Date()): StoreResult<SavedPlan> {
  if (!store) return unavailable('the copy');
  const r = readRecord(store, PLAN_PREFIX + id);
  if (!r.ok) return r;
  const name = `${r.value.name} (copy)`.slice(0, MAX_PLAN_NAME);
  return writeRecord(store, { id: newId(now), name, savedAt: now.toISOString(), plan: r.value.plan });
}

/** Renames a saved plan. */
export function renamePlan(store: KeyValueStore | null, id: string, name: string): StoreResult<SavedPlan> {
  if (!store) return unavailable('the new name');
  const n = cleanName(name);
  if (!n.ok) return n;
  const r = readRecord(store, PLAN_PREFIX + id);
  if (!r.ok) return r;
  return writeRecord(store, { ...r.value, name: n.value });
}

/** Deletes a saved plan; the returned record restores it with {@link restorePlan} (undo). */
export function deletePlan(store: KeyValueStore | null, id: string): StoreResult<SavedPlan> {
  if (!store) return unavailable('the change');
  const r = readRecord(store, PLAN_PREFIX + id);
  if (!r.ok) return r;
  try {
    store.removeItem(PLAN_PREFIX + id);
  } catch (error) {
    return writeFailure(error, 'the change');
  }
  return r;
}

/** Puts a deleted plan back as it was (undo of {@link deletePlan}). */
export function restorePlan(store: KeyValueStore | null, record: SavedPlan): StoreResult<SavedPlan> {
  if (!store) return unavailable(`"${record.name}"`);
  return writeRecord(store, record);
}

/** Small preferences (display units, theme, tour dismissed): a flat record of short strings. */
export type Preferences = Record<string, string>;
const MAX_PREF_ENTRIES = 64;
const MAX_PREF_VALUE = 200;
const PREF_KEY = /^[a-zA-Z][\w.-]{0,63}$/;

/** Preferences, leaving out anything malformed (a corrupted entry costs only itself). */
export function loadPreferences(store: KeyValueStore | null): Preferences {
  if (!store) return {};
  try {
    const raw: unknown = JSON.parse(store.getItem(PREFS_KEY) ?? '{}');
    if (!raw || typeof raw !== 'object' || Array.isArray(raw)) return {};
    const out: Preferences = Object.create(null) as Preferences;
    for (const [k, v] of Object.entries(raw).slice(0, MAX_PREF_ENTRIES)) {
      if (PREF_KEY.test(k) && typeof v === 'string' && v.length <= MAX_PREF_VALUE) out[k] = v;
    }
    return out;
  } catch {
    return {};
  }
}

/** Stores the preferences. */
export function savePreferences(store: KeyValueStore | null, prefs: Preferences): StoreResult {
  if (!store) return unavailable('your preferences');
  try {
    store.setItem(PREFS_KEY, JSON.stringify(prefs));
    return { ok: true, value: undefined };
  } catch (error) {
    return writeFailure(error, 'your preferences');
  }
}
