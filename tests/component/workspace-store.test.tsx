/**
 * The workspace without the page: undo history (steps, typing coalesced, limit), autosave and
 * restore, named plans with undo of delete, storage that is off, full or damaged, and the corpus of
 * malformed share-link fragments leaving the open plan untouched.
 */
import { readFileSync } from 'node:fs';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { serializePlanFile } from '../../src/io/plan-file';
import { encodeShareFragment } from '../../src/io/share-link';
import { type KeyValueStore, latestAutosave, listPlans, memoryStore, savePlan } from '../../src/io/workspace-storage';
import { useSekundoStore } from '../../src/ui/store';
import { HISTORY_LIMIT, historyKey, redoPlan, undoPlan } from '../../src/ui/workspace/plan-history';
import {
  deleteSaved,
  duplicateSaved,
  openSaved,
  renameSaved,
  STORAGE_OFF,
  saveCurrentAs,
  startWorkspace,
} from '../../src/ui/workspace/persist-workspace';
import { acceptSharedPlan, declineSharedPlan, readShareFragment } from '../../src/ui/workspace/share-actions';
import { resetWorkspaceStore, useWorkspaceStore } from '../../src/ui/workspace/workspace-store';
import { demoPlan } from './planner-helpers';

const main = () => useSekundoStore.getState();
const ws = () => useWorkspaceStore.getState();
const nameEdit = (text: string) => main().applyPlannerEdit((plan) => ({ ...plan, name: text }));

let stop: (() => void) | null = null;
function start(store: KeyValueStore | null, hash = '') {
  stop = startWorkspace(store, { delayMs: 5, listen: false, hash });
}

/** Types text into the plan name one character at a time, as the field does. */
function typeName(text: string, key = 'planner.plan.name') {
  for (let i = 1; i <= text.length; i++) {
    main().setFieldDraft(key, { text: text.slice(0, i), unit: null, message: null });
    nameEdit(text.slice(0, i));
  }
}

beforeEach(() => {
  resetWorkspaceStore();
});

afterEach(() => {
  stop?.();
  stop = null;
  vi.useRealTimers();
});

describe('undo history', () => {
  it('typing in one field is one step; leaving it starts a new one; undo and redo walk them', async () => {
    start(memoryStore());
    main().loadPlannerPlan(demoPlan(), { kind: 'demo', note: null });
    const first = main().plannerPlan;
    expect(ws().past).toHaveLength(0);
    typeName('Cell A');
    await Promise.resolve();
    expect(main().plannerPlan.name).toBe('Cell A');
    expect(ws().past).toHaveLength(1);
    main().dropFieldDraft('planner.plan.name');
    typeName('Cell B');
    await Promise.resolve();
    expect(ws().past).toHaveLength(2);
    expect(undoPlan()).toBe(true);
    expect(main().plannerPlan.name).toBe('Cell A');
    expect(undoPlan()).toBe(true);
    expect(main().plannerPlan).toBe(first);
    expect(undoPlan()).toBe(false);
    expect(redoPlan()).toBe(true);
    expect(redoPlan()).toBe(true);
    expect(main().plannerPlan.name).toBe('Cell B');
    expect(redoPlan()).toBe(false);
  });

  it('a control edit after typing is its own step, and a new edit clears redo', async () => {
    start(memoryStore());
    main().loadPlannerPlan(demoPlan(), { kind: 'demo', note: null });
    typeName('X');
    await Promise.resolve();
    main().addPlannerSensor();
    expect(ws().past).toHaveLength(2);
    expect(main().plannerPlan.sensors).toHaveLength(demoPlan().sensors.length + 1);
    undoPlan();
    expect(main().plannerPlan.sensors).toHaveLength(demoPlan().sensors.length);
    expect(main().plannerSensorKeys).toHaveLength(demoPlan().sensors.length);
    expect(ws().future).toHaveLength(1);
    main().addPlannerReflector();
    expect(ws().future).toHaveLength(0);
  });

  it(`keeps at least 50 steps (${HISTORY_LIMIT})`, () => {
    start(memoryStore());
    main().loadPlannerPlan(demoPlan(), { kind: 'demo', note: null });
    for (let i = 0; i < 60; i++) main().editPlanner('x', (p) => ({ ...p, name: `Step ${i}` }));
    expect(ws().past).toHaveLength(60);
    for (let i = 0; i < 60; i++) expect(undoPlan()).toBe(true);
    expect(main().plannerPlan.name).toBe(demoPlan().name);
  });

  it('reads Ctrl/Cmd+Z, Ctrl/Cmd+Shift+Z and Ctrl+Y', () => {
    const k = (key: string, mods: Partial<KeyboardEvent> = {}) => historyKey({ key, ctrlKey: false, metaKey: false, shiftKey: false, altKey: false, ...mods });
    expect(k('z', { ctrlKey: true })).toBe('undo');
    expect(k('z', { metaKey: true })).toBe('undo');
    expect(k('Z', { ctrlKey: true, shiftKey: true })).toBe('redo');
    expect(k('y', { ctrlKey: true })).toBe('redo');
    expect(k('z')).toBeNull();
    expect(k('a', { ctrlKey: true })).toBeNull();
  });
});

describe('autosave and restore', () => {
  it('saves the plan after a pause and restores it on the next start (no demo)', async () => {
    const store = memoryStore();
    start(store);
    main().loadPlannerPlan(demoPlan(), { kind: 'demo', note: null });
    main().editPlanner('x', (p) => ({ ...p, name: 'Kept across visits' }));
    await vi.waitFor(() => {
      expect(latestAutosave(store).latest?.plan.name).toBe('Kept across visits');
    });
    stop?.();
    useSekundoStore.setState(useSekundoStore.getInitialState(), true);
    start(store);
    expect(main().plannerStatus).toBe('ready');
    expect(main().plannerSource.kind).toBe('restored');
    expect(main().plannerPlan.name).toBe('Kept across visits');
  });

  it('storage that is off: says so, and the plan still works', () => {
    start(null);
    expect(ws().storageNotice).toBe(STORAGE_OFF);
    main().loadPlannerPlan(demoPlan(), { kind: 'demo', note: null });
    main().editPlanner('x', (p) => ({ ...p, name: 'Only in this tab' }));
    expect(main().plannerPlan.name).toBe('Only in this tab');
    expect(saveCurrentAs('Anything')).toBeNull();
    expect(ws().toasts.at(-1)?.text).toMatch(/does not let the page keep data/);
  });

  it('storage that is full: autosave says so, every saved plan stays', async () => {
    const store = memoryStore();
    savePlan(store, 'Older plan', demoPlan());
    const full: KeyValueStore = {
      ...store,
      key: (i) => store.key(i),
      get length() {
        return store.length;
      },
      setItem: () => {
        throw Object.assign(new Error('The quota has been exceeded.'), { name: 'QuotaExceededError' });
      },
    };
    start(full);
    main().loadPlannerPlan(demoPlan(), { kind: 'demo', note: null });
    main().editPlanner('x', (p) => ({ ...p, name: 'Too much' }));
    await vi.waitFor(() => expect(ws().storageNotice).toMatch(/storage is full/));
    expect(ws().savedPlans.map((p) => p.name)).toEqual(['Older plan']);
    expect(main().plannerPlan.name).toBe('Too much');
  });

  it('a damaged autosave and a damaged saved plan: messages, the rest kept, the demo opens', () => {
    const store = memoryStore();
    savePlan(store, 'Good plan', demoPlan());
    store.setItem('sekundo.autosave', '{"format":"sekundo-plan", broken');
    store.setItem('sekundo.plan.zzz', 'not json');
    start(store);
    expect(ws().storageNotice).toMatch(/autosaved plan is damaged/);
    expect(main().plannerStatus).toBe('idle');
    expect(ws().savedPlans.map((p) => p.name)).toEqual(['Good plan']);
    expect(ws().savedProblems.join(' ')).toMatch(/damaged/);
  });
});

describe('named plans', () => {
  it('save as, open, duplicate, rename, delete and undo the delete', () => {
    const store = memoryStore();
    start(store);
    main().loadPlannerPlan(demoPlan(), { kind: 'demo', note: null });
    const saved = saveCurrentAs('First cooldown');
    expect(saved?.name).toBe('First cooldown');
    expect(ws().currentSavedId).toBe(saved?.id);
    main().editPlanner('x', (p) => ({ ...p, name: 'Changed since' }));
    if (!saved) throw new Error('not saved');
    openSaved(saved);
    expect(main().plannerPlan.name).toBe(demoPlan().name);
    expect(main().plannerSource.kind).toBe('saved');
    // The edited plan it replaced is kept as a named copy, and the note says where.
    const kept = ws().savedPlans.find((p) => p.name.startsWith('Changed since (kept '));
    expect(kept?.plan.name).toBe('Changed since');
    expect(main().plannerSource.note).toContain(`kept in Saved plans as “${kept?.name}”`);
    if (kept) deleteSaved(kept);
    undoPlan();
    expect(main().plannerPlan.name).toBe('Changed since');

    duplicateSaved(saved);
    expect(ws().savedPlans.map((p) => p.name).sort()).toEqual(['First cooldown', 'First cooldown (copy)']);
    expect(renameSaved(saved, '   ')).toMatch(/give a name/);
    expect(renameSaved(saved, 'Second cooldown')).toBeNull();
    expect(ws().savedPlans.map((p) => p.name).sort()).toEqual(['First cooldown (copy)', 'Second cooldown']);

    const renamed = ws().savedPlans.find((p) => p.name === 'Second cooldown');
    if (!renamed) throw new Error('not renamed');
    deleteSaved(renamed);
    expect(listPlans(store).plans.map((p) => p.name)).toEqual(['First cooldown (copy)']);
    const toast = ws().toasts.findLast((t) => t.action?.label === 'Undo');
    expect(toast?.text).toBe('Deleted “Second cooldown”.');
    toast?.action?.run();
    expect(listPlans(store).plans.map((p) => p.name).sort()).toEqual(['First cooldown (copy)', 'Second cooldown']);
  });
});

describe('share links', () => {
  it('over work of one’s own, a good link waits for a yes; no keeps the plan, yes replaces it', () => {
    start(memoryStore());
    main().loadPlannerPlan(demoPlan(), { kind: 'restored', note: null });
    const mine = main().plannerPlan;
    const shared = { ...demoPlan(), name: 'From a colleague' };
    readShareFragment(encodeShareFragment(shared));
    expect(ws().sharePrompt?.plan.name).toBe('From a colleague');
    expect(main().plannerPlan).toBe(mine);
    declineSharedPlan();
    expect(main().plannerPlan).toBe(mine);
    readShareFragment(encodeShareFragment(shared));
    acceptSharedPlan();
    expect(main().plannerPlan.name).toBe('From a colleague');
    expect(main().plannerSource.kind).toBe('link');
    expect(main().activeView).toBe('planner');
    undoPlan();
    expect(main().plannerPlan).toBe(mine);
  });

  it('a link in the address at start opens on the planner at once: nothing of the visitor’s own is open', () => {
    start(memoryStore(), encodeShareFragment({ ...demoPlan(), name: 'At start' }));
    expect(ws().sharePrompt).toBeNull();
    expect(main().plannerPlan.name).toBe('At start');
    expect(main().plannerSource.kind).toBe('link');
    expect(main().activeView).toBe('planner');
  });

  it('over the demo as it came, or a plan file unchanged, a link opens without asking', () => {
    for (const kind of ['demo', 'file', 'saved'] as const) {
      stop?.();
      start(memoryStore());
      main().loadPlannerPlan(demoPlan(), { kind, note: null });
      readShareFragment(encodeShareFragment({ ...demoPlan(), name: `Over the ${kind}` }));
      expect(ws().sharePrompt).toBeNull();
      expect(main().plannerPlan.name).toBe(`Over the ${kind}`);
    }
  });

  it('over the demo once edited, a link asks first', () => {
    start(memoryStore());
    main().loadPlannerPlan(demoPlan(), { kind: 'demo', note: null });
    useSekundoStore.setState({ plannerPlan: { ...main().plannerPlan, name: 'Edited demo' } });
    readShareFragment(encodeShareFragment({ ...demoPlan(), name: 'From a colleague' }));
    expect(ws().sharePrompt?.plan.name).toBe('From a colleague');
    expect(main().plannerPlan.name).toBe('Edited demo');
  });

  const fragments = JSON.parse(readFileSync('tests/corpus/fragments/fragments.json', 'utf8')) as { cases: { fragment: string; expect: string | null }[] };
  it.each(fragments.cases)('corpus fragment $fragment leaves the store unchanged', ({ fragment, expect: want }) => {
    start(memoryStore());
    main().loadPlannerPlan(demoPlan(), { kind: 'demo', note: null });
    const before = main();
    const text = serializePlanFile(before.plannerPlan);
    readShareFragment(fragment);
    expect(main()).toBe(before);
    expect(serializePlanFile(main().plannerPlan)).toBe(text);
    expect(ws().sharePrompt).toBeNull();
    if (want === null) expect(ws().linkProblem).toBeNull();
    else expect(ws().linkProblem?.join(' ')).toContain(want.replace(/^link: $/, 'link'));
  });
});
