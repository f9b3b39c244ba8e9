/**
 * Keeping plans: autosave, named plans with undo, preferences — and faults: storage full,
 * storage unavailable, corrupted entries. Nothing may throw and no other plan may be lost.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { CURRENT_PLAN_VERSION, type PlanFile, parsePlanFile, serializePlanFile } from '../../src/io/plan-file';
import {
  deletePlan,
  duplicatePlan,
  type KeyValueStore,
  latestAutosave,
  listPlans,
  loadAutosave,
  MAX_AUTOSAVE_SLOTS,
  loadPreferences,
  memoryStore,
  renamePlan,
  restorePlan,
  saveAutosave,
  savePlan,
  savePreferences,
} from '../../src/io/workspace-storage';

function demo(): PlanFile {
  const parsed = parsePlanFile(readFileSync(new URL('../../public/demo-plan.json', import.meta.url), 'utf8'));
  if (!parsed.ok) throw new Error(parsed.errors.join('\n'));
  return parsed.plan;
}

/** A store that refuses writes as a full browser storage does. */
function fullStore(base = memoryStore()): KeyValueStore {
  return {
    ...base,
    getItem: (k) => base.getItem(k),
    key: (i) => base.key(i),
    get length() {
      return base.length;
    },
    removeItem: (k) => base.removeItem(k),
    setItem: () => {
      const e = new Error('The quota has been exceeded.');
      e.name = 'QuotaExceededError';
      throw e;
    },
  };
}

describe('autosave', () => {
  it('round-trips the plan being edited', () => {
    const store = memoryStore();
    expect(saveAutosave(store, demo()).ok).toBe(true);
    const back = loadAutosave(store);
    expect(back.ok && back.value).toEqual(demo());
  });

  it('nothing saved yet: no plan and no error', () => {
    expect(loadAutosave(memoryStore())).toEqual({ ok: true, value: null });
  });

  it('a damaged autosave is reported, not opened', () => {
    const store = memoryStore();
    store.setItem('sekundo.autosave', '{"format":"sekundo-plan","version":1,"bath":');
    const r = loadAutosave(store);
    expect(r.ok).toBe(false);
    expect(!r.ok && r.message).toMatch(/damaged/);
  });

  it('storage full: a message that says what to do, and no throw', () => {
    const r = saveAutosave(fullStore(), demo());
    expect(r.ok).toBe(false);
    expect(!r.ok && r.message).toMatch(/full.*Export/);
  });

  it('storage unavailable: a message, and loading gives nothing', () => {
    const r = saveAutosave(null, demo());
    expect(!r.ok && r.message).toMatch(/does not let the page keep data/);
    expect(loadAutosave(null)).toEqual({ ok: true, value: null });
  });
});

describe('named plans', () => {
  const t0 = new Date('2026-01-01T10:00:00Z');
  const t1 = new Date('2026-01-01T11:00:00Z');

  it('save, list newest first, rename, duplicate, delete and undo', () => {
    const store = memoryStore();
    const a = savePlan(store, 'Run A', demo(), undefined, t0);
    const b = savePlan(store, '  Run   B  ', demo(), undefined, t1);
    expect(a.ok && b.ok).toBe(true);
    if (!a.ok || !b.ok) return;
    expect(b.value.name).toBe('Run B');
    expect(listPlans(store).plans.map((p) => p.name)).toEqual(['Run B', 'Run A']);
    expect(renamePlan(store, a.value.id, 'Run A, warm distances').ok).toBe(true);
    const copy = duplicatePlan(store, b.value.id, new Date('2026-01-01T12:00:00Z'));
    expect(copy.ok && copy.value.name).toBe('Run B (copy)');
    const removed = deletePlan(store, a.value.id);
    expect(removed.ok).toBe(true);
    expect(listPlans(store).plans.map((p) => p.name)).toEqual(['Run B (copy)', 'Run B']);
    if (removed.ok) restorePlan(store, removed.value);
    expect(listPlans(store).plans.map((p) => p.name).sort()).toEqual(['Run A, warm distances', 'Run B', 'Run B (copy)']);
  });

  it('a bad name is refused with the rule', () => {
    expect(savePlan(memoryStore(), '   ', demo())).toEqual({ ok: false, message: 'Plan name: give a name (1–120 characters).' });
    const long = savePlan(memoryStore(), 'x'.repeat(121), demo());
    expect(!long.ok && long.message).toMatch(/at most 120/);
  });

  it('a corrupted entry is reported and every other plan still lists', () => {
    const store = memoryStore();
    savePlan(store, 'Good one', demo());
    store.setItem('sekundo.plan.broken', '{not json');
    store.setItem('sekundo.plan.alien', JSON.stringify({ format: 'something-else' }));
    store.setItem('sekundo.plan.badplan', JSON.stringify({ format: 'sekundo-saved-plan', id: 'badplan', name: 'Bad', savedAt: 'x', plan: '{"format":"sekundo-plan","version":99}' }));
    const listing = listPlans(store);
    expect(listing.plans.map((p) => p.name)).toEqual(['Good one']);
    expect(listing.problems.length).toBe(3);
    expect(listing.problems.join(' ')).toMatch(/damaged/);
    // The damaged entries stay where they are (nothing is deleted behind the user's back).
    expect(store.getItem('sekundo.plan.broken')).toBe('{not json');
  });

  it('storage full while saving leaves the earlier plans intact', () => {
    const base = memoryStore();
    savePlan(base, 'Kept', demo());
    const r = savePlan(fullStore(base), 'New', demo());
    expect(r.ok).toBe(false);
    expect(listPlans(base).plans.map((p) => p.name)).toEqual(['Kept']);
  });
});

describe('preferences', () => {
  it('round-trip, dropping malformed entries and prototype keys', () => {
    const store = memoryStore();
    savePreferences(store, { theme: 'dark', 'unit.length': 'mm' });
    expect(loadPreferences(store)).toEqual({ theme: 'dark', 'unit.length': 'mm' });
    store.setItem('sekundo.prefs', `{"__proto__":{"polluted":"yes"},"theme":"light","n":5,"long":"${'x'.repeat(300)}"}`);
    const prefs = loadPreferences(store);
    expect(prefs).toEqual({ theme: 'light' });
    expect(({} as Record<string, unknown>).polluted).toBeUndefined();
    store.setItem('sekundo.prefs', 'garbage');
    expect(loadPreferences(store)).toEqual({});
  });
});

describe('autosave slots: one per tab, newer formats kept untouched', () => {
  it('two tabs autosave into their own slots; a new tab starts from the newest', () => {
    const store = memoryStore();
    const a = { ...demo(), name: 'Tab A' };
    const b = { ...demo(), name: 'Tab B' };
    saveAutosave(store, a, 'tab-a', new Date('2026-12-03T08:00:00Z'));
    saveAutosave(store, b, 'tab-b', new Date('2026-12-03T08:00:05Z'));
    const backA = loadAutosave(store, 'tab-a');
    const backB = loadAutosave(store, 'tab-b');
    expect(backA.ok && backA.value?.name).toBe('Tab A');
    expect(backB.ok && backB.value?.name).toBe('Tab B');
    expect(latestAutosave(store).latest).toMatchObject({ slot: 'tab-b', plan: { name: 'Tab B' } });
  });

  it('the autosave of an earlier version is still read as a slot', () => {
    const store = memoryStore();
    saveAutosave(store, { ...demo(), name: 'From before slots' });
    expect(latestAutosave(store).latest?.plan.name).toBe('From before slots');
  });

  it(`keeps the ${MAX_AUTOSAVE_SLOTS} newest slots`, () => {
    const store = memoryStore();
    for (let i = 0; i < MAX_AUTOSAVE_SLOTS + 3; i++) saveAutosave(store, demo(), `tab-${i}`, new Date(Date.UTC(2026, 11, 3, 8, i)));
    const left = [...Array(store.length).keys()].map((i) => store.key(i)).filter((k) => k?.startsWith('sekundo.autosave.'));
    expect(left).toHaveLength(MAX_AUTOSAVE_SLOTS);
    expect(left).not.toContain('sekundo.autosave.tab-0');
  });

  it('an autosave of a newer format version is named as newer (not "damaged") and left untouched', () => {
    const store = memoryStore();
    const newer = JSON.stringify({ ...JSON.parse(serializePlanFile(demo())), version: CURRENT_PLAN_VERSION + 1 });
    store.setItem('sekundo.autosave', newer);
    const r = loadAutosave(store);
    expect(r.ok).toBe(false);
    expect(!r.ok && r.message).toMatch(new RegExp(`saved by a newer Sekundo \\(plan format version ${CURRENT_PLAN_VERSION + 1}.*kept untouched: reload the page`));
    expect(!r.ok && r.message).not.toMatch(/damaged/);
    expect(!r.ok && 'newerVersion' in r && r.newerVersion).toBe(CURRENT_PLAN_VERSION + 1);
    expect(latestAutosave(store).problems.map((p) => p.message).join(' ')).toMatch(/newer Sekundo/);
    // A tab's own saves go to its slot; the newer entry stays as it was.
    saveAutosave(store, demo(), 'tab-a');
    expect(store.getItem('sekundo.autosave')).toBe(newer);
  });

  it('a saved plan of a newer format version is listed as newer, never as damaged', () => {
    const store = memoryStore();
    savePlan(store, 'Good', demo());
    const plan = JSON.stringify({ ...JSON.parse(serializePlanFile(demo())), version: CURRENT_PLAN_VERSION + 1 });
    store.setItem('sekundo.plan.zz9', JSON.stringify({ format: 'sekundo-saved-plan', id: 'zz9', name: 'From tomorrow', savedAt: '2026-12-04T00:00:00Z', plan }));
    const listing = listPlans(store);
    expect(listing.plans.map((p) => p.name)).toEqual(['Good']);
    expect(listing.problems).toEqual([expect.stringMatching(/^The saved plan "From tomorrow" was saved by a newer Sekundo .*reload the page/)]);
  });
});
