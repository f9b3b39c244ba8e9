/**
 * Keeping plans in the browser: an autosave slot per tab for the plan being edited, named plans
 * (list, save, duplicate, rename, delete with undo) and small preferences. Entries written by a
 * newer Sekundo (a newer plan format) are named as such and never overwritten. Storage is a plain key–value
 * store (localStorage in the page, an in-memory map in tests). Nothing here throws: storage that
 * is full, disabled or holds a corrupted entry gives a message, and every other plan stays.
 * Entries are our own JSON records, validated on the way in with the plan file's schema.
 */
import { CURRENT_PLAN_VERSION, type PlanFile, parsePlanFile, serializePlanFile } from './plan-file';

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
  /**
   * Set on a copy the page kept by itself before something replaced the open plan: what replaced
   * it ("before opening a share link"). Absent on plans the user saved.
   */
  kept?: string;
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

/**
 * Autosave slots. Each tab writes its own slot, `sekundo.autosave.<slot>` (a record with the time
 * of the save), so two tabs never overwrite each other's work; a new tab starts from the newest
 * slot. The slot without a suffix (`sekundo.autosave`, the plan text alone) is where earlier
 * versions kept the one autosave: it is still read, and written only when no slot is given.
 */
const AUTOSAVE_SLOT_PREFIX = `${AUTOSAVE_KEY}.`;
const AUTOSAVE_FORMAT = 'sekundo-autosave';
/** Autosave slots kept: the newest ones (by time of save); older slots go when a tab saves. */
export const MAX_AUTOSAVE_SLOTS = 12;
const SLOT_ID = /^[a-z0-9-]{1,40}$/;

/** A refusal that is not damage: the entry was written by a newer Sekundo and is kept untouched. */
export type ReadFailure = { ok: false; message: string; newerVersion?: number };

function newerMessage(what: string, version: number): string {
  return `${what} was saved by a newer Sekundo (plan format version ${version}; this page reads versions up to ${CURRENT_PLAN_VERSION}). It is kept untouched: reload the page to get the newer app.`;
}

function autosaveKey(slot: string | undefined): string {
  if (slot === undefined) return AUTOSAVE_KEY;
  if (!SLOT_ID.test(slot)) throw new RangeError(`autosave slot "${slot}" is not a slot id`);
  return AUTOSAVE_SLOT_PREFIX + slot;
}

/** A new slot id for a tab: time and randomness, lower-case letters, digits and '-'. */
export function newAutosaveSlot(now = new Date()): string {
  return newId(now);
}

/**
 * Saves the plan being edited into a tab's autosave slot (`slot`), or into the one slot of earlier
 * versions when `slot` is not given. At a slot's first save in this page, drops the oldest slots past
 * {@link MAX_AUTOSAVE_SLOTS}.
 */
export function saveAutosave(store: KeyValueStore | null, plan: PlanFile, slot?: string, now = new Date()): StoreResult {
  if (!store) return unavailable('the plan');
  try {
    if (slot === undefined) store.setItem(AUTOSAVE_KEY, serializePlanFile(plan));
    else store.setItem(autosaveKey(slot), JSON.stringify({ format: AUTOSAVE_FORMAT, savedAt: now.toISOString(), plan: serializePlanFile(plan) }));
  } catch (error) {
    return writeFailure(error, 'the plan');
  }
  // Pruning reads every slot: done at a slot's first save (a new tab), not after every pause in typing.
  if (slot !== undefined) {
    const pruned = prunedSlots.get(store) ?? new Set<string>();
    prunedSlots.set(store, pruned);
    if (!pruned.has(slot)) {
      pruned.add(slot);
      pruneAutosaves(store, slot);
    }
  }
  return { ok: true, value: undefined };
}

/** Slots whose first save in this page has pruned the others, per store. */
const prunedSlots = new WeakMap<KeyValueStore, Set<string>>();

interface SlotEntry {
  key: string;
  slot: string | null;
  savedAt: string;
  text: string;
}

function readSlot(store: KeyValueStore, key: string): SlotEntry | null {
  let text: string | null;
  try {
    text = store.getItem(key);
  } catch {
    return null;
  }
  if (text === null) return null;
  if (key === AUTOSAVE_KEY) return { key, slot: null, savedAt: '', text };
  try {
    const raw: unknown = JSON.parse(text);
    if (raw && typeof raw === 'object' && !Array.isArray(raw)) {
      const r = raw as Record<string, unknown>;
      if (r.format === AUTOSAVE_FORMAT && typeof r.savedAt === 'string' && typeof r.plan === 'string') {
        return { key, slot: key.slice(AUTOSAVE_SLOT_PREFIX.length), savedAt: r.savedAt, text: r.plan };
      }
    }
  } catch {
    // A damaged slot reads as damaged text below.
  }
  return { key, slot: key.slice(AUTOSAVE_SLOT_PREFIX.length), savedAt: '', text };
}

function autosaveKeys(store: KeyValueStore): string[] {
  const keys: string[] = [];
  try {
    for (let i = 0; i < store.length; i++) {
      const k = store.key(i);
      if (k === AUTOSAVE_KEY || k?.startsWith(AUTOSAVE_SLOT_PREFIX)) keys.push(k);
    }
  } catch {
    return [];
  }
  return keys;
}

function pruneAutosaves(store: KeyValueStore, keep: string): void {
  const slots = autosaveKeys(store)
    .filter((k) => k !== AUTOSAVE_KEY)
    .map((k) => readSlot(store, k))
    .filter((e): e is SlotEntry => e !== null)
    .sort((a, b) => b.savedAt.localeCompare(a.savedAt));
  for (const entry of slots.slice(MAX_AUTOSAVE_SLOTS)) {
    // Never the caller's own slot, and never a slot a newer Sekundo wrote.
    if (entry.slot === keep || isNewerText(entry.text)) continue;
    try {
      store.removeItem(entry.key);
    } catch {
      return;
    }
  }
}

function isNewerText(text: string): boolean {
  const parsed = parsePlanFile(text);
  return !parsed.ok && parsed.newerVersion !== undefined;
}

function parseSlot(entry: SlotEntry): StoreResult<PlanFile> & ({ ok: true } | ReadFailure) {
  const parsed = parsePlanFile(entry.text);
  if (parsed.ok) return { ok: true, value: parsed.plan };
  if (parsed.newerVersion !== undefined) return { ok: false, newerVersion: parsed.newerVersion, message: newerMessage('The autosaved plan', parsed.newerVersion) };
  return { ok: false, message: `The autosaved plan is damaged and was not opened (${parsed.errors[0] ?? 'unreadable'}).` };
}

/**
 * The plan autosaved in `slot` (or in the one slot of earlier versions); null value when there is
 * none; a message when it is unreadable, with `newerVersion` when a newer Sekundo wrote it.
 */
export function loadAutosave(store: KeyValueStore | null, slot?: string): StoreResult<PlanFile | null> | ReadFailure {
  if (!store) return { ok: true, value: null };
  let key: string;
  try {
    key = autosaveKey(slot);
    store.getItem(key);
  } catch (error) {
    return { ok: false, message: `The autosaved plan could not be read (${error instanceof Error ? error.message : String(error)}).` };
  }
  const entry = readSlot(store, key);
  if (entry === null) return { ok: true, value: null };
  return parseSlot(entry);
}

/** The newest autosave of any tab, with its slot (null: the slot of earlier versions). */
export interface LatestAutosave {
  plan: PlanFile;
  slot: string | null;
  savedAt: string;
}

/**
 * The newest readable autosave among every tab's slots (what a new tab opens), and a message for
 * each slot that could not be opened; a slot from a newer Sekundo is named as such and left alone.
 */
export function latestAutosave(store: KeyValueStore | null): { latest: LatestAutosave | null; problems: ReadFailure[] } {
  if (!store) return { latest: null, problems: [] };
  const entries = autosaveKeys(store)
    .map((k) => readSlot(store, k))
    .filter((e): e is SlotEntry => e !== null)
    .sort((a, b) => b.savedAt.localeCompare(a.savedAt));
  const problems: ReadFailure[] = [];
  for (const entry of entries) {
    const read = parseSlot(entry);
    if (read.ok) return { latest: { plan: read.value, slot: entry.slot, savedAt: entry.savedAt }, problems };
    problems.push(read);
  }
  return { latest: null, problems };
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
  if (!parsed.ok && parsed.newerVersion !== undefined) return { ok: false, message: newerMessage(`The saved plan "${r.name.slice(0, MAX_PLAN_NAME)}"`, parsed.newerVersion) };
  if (!parsed.ok) return { ok: false, message: `The saved plan "${r.name.slice(0, MAX_PLAN_NAME)}" is damaged (${parsed.errors[0] ?? 'unreadable'}); the other plans are fine.` };
  const name = r.name.slice(0, MAX_PLAN_NAME);
  const kept = typeof r.kept === 'string' ? r.kept.slice(0, MAX_KEPT_REASON) : keptReasonInName(name);
  return { ok: true, value: { id: r.id, name, savedAt: r.savedAt, plan: parsed.plan, ...(kept === null ? {} : { kept }) } };
}

/** Longest reason kept with a kept copy. */
const MAX_KEPT_REASON = 200;

/**
 * A kept copy written before kept copies were marked in the record carries its reason only in its
 * name, "<plan> (kept <time>, before <reason>)": read it from there (null for any other name).
 */
function keptReasonInName(name: string): string | null {
  const match = /\(kept [^()]*?, (before [^()]+)\)$/.exec(name);
  return match?.[1] ?? null;
}

/** One named plan as it is in storage now (another tab may have changed or deleted it). */
export function readSavedPlan(store: KeyValueStore | null, id: string): StoreResult<SavedPlan> | { ok: 'missing' } {
  if (!store) return unavailable('the plan');
  let present: boolean;
  try {
    present = store.getItem(PLAN_PREFIX + id) !== null;
  } catch (error) {
    return { ok: false, message: `The saved plan could not be read (${error instanceof Error ? error.message : String(error)}).` };
  }
  return present ? readRecord(store, PLAN_PREFIX + id) : { ok: 'missing' };
}

/** Whether a storage key holds named plans (for the page's `storage` event listener). */
export function isSavedPlanKey(key: string | null): boolean {
  return key === null || key.startsWith(PLAN_PREFIX);
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
      JSON.stringify({
        format: RECORD_FORMAT,
        id: record.id,
        name: record.name,
        savedAt: record.savedAt,
        plan: serializePlanFile(record.plan),
        ...(record.kept === undefined ? {} : { kept: record.kept }),
      }),
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

/**
 * Keeps a plan as a copy the page made by itself before something replaced it (`reason`: "before
 * opening a share link"), marked as such in Saved plans.
 */
export function keepPlanCopy(store: KeyValueStore | null, name: string, plan: PlanFile, reason: string, now = new Date()): StoreResult<SavedPlan> {
  if (!store) return unavailable(`"${name}"`);
  const n = cleanName(name);
  if (!n.ok) return n;
  return writeRecord(store, { id: newId(now), name: n.value, savedAt: now.toISOString(), plan, kept: reason.slice(0, MAX_KEPT_REASON) });
}

/** Makes a kept copy one of the user's own saved plans (it is no longer listed with the kept copies). */
export function adoptKeptPlan(store: KeyValueStore | null, id: string): StoreResult<SavedPlan> {
  if (!store) return unavailable('the change');
  const r = readRecord(store, PLAN_PREFIX + id);
  if (!r.ok) return r;
  const { kept: _kept, ...own } = r.value;
  const name = own.name.replace(/ \(kept [^()]*?, before [^()]+\)$/, '') || own.name;
  return writeRecord(store, { ...own, name });
}

/** A copy of a saved plan under "<name> (copy)". */
export function duplicatePlan(store: KeyValueStore | null, id: string, now = new Date()): StoreResult<SavedPlan> {
  if (!store) return unavailable('the copy');
  const r = readRecord(store, PLAN_PREFIX + id);
  if (!r.ok) return r;
  const name = `${r.value.name} (copy)`.slice(0, MAX_PLAN_NAME);
  return writeRecord(store, { id: newId(now), name, savedAt: now.toISOString(), plan: r.value.plan, ...(r.value.kept === undefined ? {} : { kept: r.value.kept }) });
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
