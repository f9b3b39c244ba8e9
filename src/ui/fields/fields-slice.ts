import type { StateCreator } from 'zustand';
import type { Unit } from '../../io/quantity';

/*
 * The typed fields' own state, shared by every view: the text of a field being typed or refused
 * (with the unit a bare number is read in, fixed when typing began, and the message of a refusal),
 * and the unit a person picked in a field's own unit menu. Keys are unique on the page and start
 * with the feature's prefix ("plan.", "converter.", "locate.", "explorer."), so a feature can drop
 * its own drafts (a plan replaced, a row removed) with `dropFieldDrafts(prefix)`.
 * The values in effect are not here: each feature keeps its own in SI.
 */

export interface FieldDraft {
  /** The text as typed. */
  text: string;
  /** The unit a bare number in `text` is read in (the one shown when typing began); null for a plain number. */
  unit: Unit | null;
  /** Why the text is refused (the last good value stays in effect); null when it was applied. */
  message: string | null;
}

export interface FieldsSlice {
  fieldDrafts: Readonly<Record<string, FieldDraft>>;
  /** Units picked in fields' own menus, by field key (the field no longer follows the header). */
  fieldUnits: Readonly<Record<string, Unit>>;
  setFieldDraft: (key: string, draft: FieldDraft) => void;
  /** The field shows its value in effect again (Escape, a good draft left, a value set from elsewhere). */
  dropFieldDraft: (key: string) => void;
  /** Drops the drafts and messages of every field whose key starts with `prefix`. */
  dropFieldDrafts: (prefix: string) => void;
  setFieldUnit: (key: string, unit: Unit) => void;
}

function without<V>(record: Readonly<Record<string, V>>, key: string): Readonly<Record<string, V>> {
  if (!(key in record)) return record;
  const copy = { ...record };
  delete copy[key];
  return copy;
}

export const createFieldsSlice: StateCreator<FieldsSlice, [], [], FieldsSlice> = (set, get) => ({
  fieldDrafts: {},
  fieldUnits: {},
  setFieldDraft: (key, draft) => set({ fieldDrafts: { ...get().fieldDrafts, [key]: draft } }),
  dropFieldDraft: (key) => {
    const drafts = get().fieldDrafts;
    if (key in drafts) set({ fieldDrafts: without(drafts, key) });
  },
  dropFieldDrafts: (prefix) => {
    const drafts = get().fieldDrafts;
    const kept = Object.entries(drafts).filter(([key]) => !key.startsWith(prefix));
    if (kept.length !== Object.keys(drafts).length) set({ fieldDrafts: Object.fromEntries(kept) });
  },
  setFieldUnit: (key, unit) => set({ fieldUnits: { ...get().fieldUnits, [key]: unit } }),
});

/** The message of a field's refused text, or null. */
export function fieldMessage(state: Pick<FieldsSlice, 'fieldDrafts'>, key: string): string | null {
  return state.fieldDrafts[key]?.message ?? null;
}

/** Whether any field whose key starts with `prefix` holds a refused text. */
export function hasRefusedField(state: Pick<FieldsSlice, 'fieldDrafts'>, prefix: string): boolean {
  return Object.entries(state.fieldDrafts).some(([key, draft]) => key.startsWith(prefix) && draft.message !== null);
}
